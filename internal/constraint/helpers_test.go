package constraint

import (
	"math"
	"math/rand/v2"

	"gonum.org/v1/gonum/spatial/r3"
)

func randVec(rng *rand.Rand) r3.Vec {
	return r3.Vec{X: 2*rng.Float64() - 1, Y: 2*rng.Float64() - 1, Z: 2*rng.Float64() - 1}
}

// line returns the wrench of a unit force along the line through p with
// direction n: (n̂, p × n̂).
func line(p, n r3.Vec) Wrench {
	u := r3.Unit(n)
	return Wrench{F: u, M: r3.Cross(p, u)}
}

// randLines returns n lines through random points in [-1, 1)³ with random
// directions.
func randLines(rng *rand.Rand, n int) []Wrench {
	ws := make([]Wrench, n)
	for i := range ws {
		ws[i] = line(randVec(rng), randVec(rng))
	}
	return ws
}

// contact is a point and the direction of the force the seat exerts there.
type contact struct{ p, n r3.Vec }

// threeVee returns the six contacts of a three-ball, three-vee coupling
// written down for the tests, deliberately without symmetry: balls of
// radius 0.1 at azimuths 0°, 115° and 250° on radii 1, 0.9 and 1.1 in the
// plane z = 0, each in a 90° vee (flanks at 45°) whose groove is turned
// from the radial direction by +10°, −25° and +40°. Each flank pushes
// along sin45°·up ∓ cos45°·side (side = up × groove), touching the ball at
// its centre minus 0.1 times that normal.
func threeVee() [6]contact {
	const rho = 0.1
	up := r3.Vec{Z: 1}
	var cs [6]contact
	for k, b := range []struct{ az, r, turn float64 }{{0, 1, 10}, {115, 0.9, -25}, {250, 1.1, 40}} {
		az, g := b.az*math.Pi/180, (b.az+b.turn)*math.Pi/180
		centre := r3.Vec{X: b.r * math.Cos(az), Y: b.r * math.Sin(az), Z: rho}
		groove := r3.Vec{X: math.Cos(g), Y: math.Sin(g)}
		side := r3.Cross(up, groove)
		for j, sgn := range [2]float64{1, -1} {
			n := r3.Add(r3.Scale(math.Sqrt2/2, up), r3.Scale(-sgn*math.Sqrt2/2, side))
			cs[2*k+j] = contact{p: r3.Sub(centre, r3.Scale(rho, n)), n: n}
		}
	}
	return cs
}

// placed returns the wrenches of the contacts cs scaled by s about the
// origin and moved by off: contact points s·p + off, normals unchanged.
func placed(cs []contact, s float64, off r3.Vec) []Wrench {
	ws := make([]Wrench, len(cs))
	for i, c := range cs {
		ws[i] = line(r3.Add(r3.Scale(s, c.p), off), c.n)
	}
	return ws
}

func maxAbsW(w Wrench) float64 { return maxAbs(&w) }
