package kinematic

import (
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Flat is a plane pad that holds a ball at one point, under its centre
// along −Up.
type Flat struct {
	Up       r3.Vec // normal of the pad, towards the ball
	Material hertz.Material
}

func (f Flat) count() int { return 1 }

func (f Flat) up() r3.Vec { return f.Up }

func (f Flat) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	up, err := unitOf(f.Up, field+".Up")
	if err != nil {
		return nil, err
	}
	return append(dst, ballContact(b, name, up, linalg.AnyNormal(up), hertz.Flat(f.Material))), nil
}

func (f Flat) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	n := cs[0].Normal
	t1 := cs[0].Tangent
	t2 := r3.Cross(n, t1)
	p := cs[0].Point
	return []seatSurface{{kind: planeSurface, q: p, d: n}}, []dimension{
		{name: "Height", kind: seatMotion, motions: []motion{{surf: 0, axis: n}}},
		{name: "Tilt1", kind: seatMotion, motions: []motion{{surf: 0, rot: true, axis: t1, point: p}}},
		{name: "Tilt2", kind: seatMotion, motions: []motion{{surf: 0, rot: true, axis: t2, point: p}}},
	}, p, f.Material.Alpha
}

func (f Flat) ideals(cs []Contact, out []float64) {
	for i := range out {
		out[i] = 1
	}
}
