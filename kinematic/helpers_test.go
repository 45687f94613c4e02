package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

var (
	up     = r3.Vec{Z: 1}
	vee45  = Vee{Up: up, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	flatUp = Flat{Up: up, Material: hertz.Steel440C}
	cube   = Trihedral{Up: up, HalfAngle: math.Atan(1 / math.Sqrt2), Material: hertz.Steel440C}
)

// ball returns a 10 mm steel ball centred at (x, y, z) mm.
func ball(x, y, z float64) Ball {
	return Ball{Centre: r3.Vec{X: x * 1e-3, Y: y * 1e-3, Z: z * 1e-3}, Radius: 5e-3, Material: hertz.Steel52100}
}

// equilateral returns three balls on a circle of radius 50 mm about the
// origin, at 90°, 210° and 330°.
func equilateral() [3]Ball {
	var bs [3]Ball
	for i := range bs {
		a := (90 + 120*float64(i)) * math.Pi / 180
		bs[i] = ball(50*math.Cos(a), 50*math.Sin(a), 0)
	}
	return bs
}

// isosceles returns balls at (−60, 0), (60, 0) and (0, 30) mm: a flat
// isosceles triangle, whose incentre (0, 60/(60+√4500)·30... ) differs
// markedly from its centroid (0, 10) mm.
func isosceles() [3]Ball {
	return [3]Ball{ball(-60, 0, 0), ball(60, 0, 0), ball(0, 30, 0)}
}

func mustContacts(t testing.TB, c Coupling) []Contact {
	t.Helper()
	cs, err := c.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	return cs
}

func mustAnalyze(t testing.TB, cs []Contact) Analysis {
	t.Helper()
	an, err := Analyze(cs)
	if err != nil {
		t.Fatal(err)
	}
	return an
}

func mustStability(t testing.TB, c Coupling) Stability {
	t.Helper()
	st, err := mustAnalyze(t, mustContacts(t, c)).Stability()
	if err != nil {
		t.Fatal(err)
	}
	return st
}

// moved returns the coupling moved rigidly: scaled by s about the origin,
// rotated by angle about axis, then translated by off. Radii scale too.
func moved(c Coupling, s, angle float64, axis, off r3.Vec) Coupling {
	rot := func(v r3.Vec) r3.Vec { return r3.Rotate(v, angle, axis) }
	out := Coupling{Pairs: make([]Pair, len(c.Pairs))}
	for i, p := range c.Pairs {
		b := p.Ball
		b.Centre = r3.Add(rot(r3.Scale(s, b.Centre)), off)
		b.Radius *= s
		var seat Seat
		switch v := p.Seat.(type) {
		case Vee:
			v.Direction, v.Up = rot(v.Direction), rot(v.Up)
			if v.FlankRadius != 0 && !math.IsInf(v.FlankRadius, 1) {
				v.FlankRadius *= s
			}
			seat = v
		case Flat:
			v.Up = rot(v.Up)
			seat = v
		case Trihedral:
			v.Up, v.Azimuth = rot(v.Up), rot(v.Azimuth)
			seat = v
		case Cone:
			v.Up, v.Azimuth = rot(v.Up), rot(v.Azimuth)
			seat = v
		}
		out.Pairs[i] = Pair{Name: p.Name, Ball: b, Seat: seat}
	}
	return out
}

func near(a, b r3.Vec, tol float64) bool { return r3.Norm(r3.Sub(a, b)) <= tol }

// three returns v three times, for the three-vee layouts.
func three(v Vee) [3]Vee { return [3]Vee{v, v, v} }

// must1 returns v, for a call whose error the test has no use for beyond
// failing loudly.
func must1(v float64, err error) float64 {
	if err != nil {
		panic(err)
	}
	return v
}
