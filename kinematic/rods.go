package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Rods is a vee made of two parallel cylindrical rods (or dowel pins) that
// hold a ball at two points, one on each rod: a seat that is easy to make
// precisely. The ball is seated with its centre on the groove axis, the
// line along Direction through the centre; each contact normal runs from a
// rod's axis through the ball centre and leans HalfAngle from the
// horizontal, as a [Vee]'s flank normal does (the rods' spacing follows
// from HalfAngle and the radii: the rod axes lie (r + RodRadius)·cos
// HalfAngle either side of the groove axis). The rods are convex, so each
// contact is a ball on a cylinder: an elliptical Hertz contact.
type Rods struct {
	Direction r3.Vec  // along the rods, either sense; only its part normal to Up is used
	Up        r3.Vec  // out of the groove towards the ball
	HalfAngle float64 // rad, in (0, π/2)
	RodRadius float64 // m, > 0
	Material  hertz.Material
}

func (r Rods) count() int { return 2 }

func (r Rods) up() r3.Vec { return r.Up }

func (r Rods) halfAngle() float64 { return r.HalfAngle }

func (r Rods) withDirection(d r3.Vec) Seat { r.Direction = d; return r }

func (r Rods) withHalfAngle(h float64) Seat { r.HalfAngle = h; return r }

// groove returns the seat's unit Up and unit groove direction, validated.
func (r Rods) groove(field string) (up, g r3.Vec, err error) {
	return Vee{Up: r.Up, Direction: r.Direction}.groove(field)
}

func (r Rods) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	up, g, err := r.groove(field)
	if err != nil {
		return nil, err
	}
	if err := checkHalfAngle(r.HalfAngle, field+".HalfAngle"); err != nil {
		return nil, err
	}
	if !linalg.Finite(r.RodRadius) {
		return nil, &InputError{Field: field + ".RodRadius", Err: fmt.Errorf("%w: %g", ErrNonFinite, r.RodRadius)}
	}
	if !(r.RodRadius > 0) {
		return nil, &InputError{Field: field + ".RodRadius", Err: fmt.Errorf("%w: must be positive, got %g", ErrRange, r.RodRadius)}
	}
	// The rod axes lie (r + R)·cos HalfAngle either side of the groove
	// axis; two rods of radius R whose axes are closer than 2R overlap.
	if gap := (b.Radius + r.RodRadius) * math.Cos(r.HalfAngle); gap < r.RodRadius*(1-overlapTol) {
		return nil, &InputError{Field: field + ".RodRadius", Err: fmt.Errorf(
			"%w: the rods overlap: radius %.6g m, axes %.6g m apart (less than a diameter) for a ball of radius %.6g m at half-angle %.6g rad",
			ErrRange, r.RodRadius, 2*gap, b.Radius, r.HalfAngle)}
	}
	// A convex cylinder with its axis along the groove: Tangent is the
	// groove direction, so the axis angle is 0.
	base := hertz.Cylinder(r.RodRadius, 0, r.Material)
	s, c := math.Sincos(r.HalfAngle)
	ns := flankNormals(up, g, s, c)
	return append(dst,
		ballContact(b, name+"+", ns[0], g, base),
		ballContact(b, name+"-", ns[1], g, base)), nil
}

func (r Rods) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	up, g, _ := r.groove("")
	s := math.Sin(r.HalfAngle)
	root := rootBelow(b.Centre, up, b.Radius, s)
	surfs := make([]seatSurface, 2)
	for k := range surfs {
		// The rod's axis lies RodRadius beyond the contact point, away
		// from the ball.
		surfs[k] = seatSurface{kind: convexCylinder, q: r3.Sub(cs[k].Point, r3.Scale(r.RodRadius, cs[k].Normal)), d: g, R: r.RodRadius}
	}
	ds := append(grooveDimensions(up, g, b.Centre, root),
		dimension{name: "Rod+", kind: seatMotion, motions: []motion{{surf: 0, axis: cs[0].Normal}}},
		dimension{name: "Rod-", kind: seatMotion, motions: []motion{{surf: 1, axis: cs[1].Normal}}},
		dimension{name: "RodRadius+", kind: surfaceRadius, surf: 0},
		dimension{name: "RodRadius-", kind: surfaceRadius, surf: 1})
	return surfs, ds, root, r.Material.Alpha
}

func (r Rods) ideals(cs []Contact, out []float64) {
	for i := range out {
		out[i] = grooveIdeal(r.HalfAngle)
	}
}
