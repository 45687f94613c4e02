package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// Vee is a groove of two flanks that holds a ball at two points, one on
// each flank. The ball is seated: its centre lies on the groove axis, the
// line along Direction through the centre.
//
// The flanks are symmetric about the plane that holds Direction and Up. Each
// flank makes the angle HalfAngle with that plane, so each contact normal
// leans HalfAngle from the horizontal (the plane normal to Up): a 90° vee
// has HalfAngle π/4. With FlankRadius zero or +Inf the flanks are flat; a
// finite FlankRadius makes them concave cylinders of that radius with axes
// along the groove (a gothic arch), touching the ball at the same points.
type Vee struct {
	Direction   r3.Vec  // along the groove, either sense; only its part normal to Up is used
	Up          r3.Vec  // out of the groove towards the ball
	HalfAngle   float64 // rad, in (0, π/2)
	FlankRadius float64 // m: 0 or +Inf for flat flanks, else greater than the ball radius
	Material    hertz.Material
}

func (v Vee) count() int { return 2 }

func (v Vee) up() r3.Vec { return v.Up }

func (v Vee) halfAngle() float64 { return v.HalfAngle }

func (v Vee) withDirection(d r3.Vec) Seat { v.Direction = d; return v }

func (v Vee) withHalfAngle(h float64) Seat { v.HalfAngle = h; return v }

// groove returns the vee's unit Up and unit groove direction (the part of
// Direction normal to Up), validated.
func (v Vee) groove(field string) (up, g r3.Vec, err error) {
	up, err = unitOf(v.Up, field+".Up")
	if err != nil {
		return r3.Vec{}, r3.Vec{}, err
	}
	g, err = horizontal(v.Direction, up, field+".Direction")
	if err != nil {
		return r3.Vec{}, r3.Vec{}, err
	}
	return up, g, nil
}

func (v Vee) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	up, g, err := v.groove(field)
	if err != nil {
		return nil, err
	}
	if err := checkHalfAngle(v.HalfAngle, field+".HalfAngle"); err != nil {
		return nil, err
	}
	base := hertz.Flat(v.Material)
	switch rf := v.FlankRadius; {
	case rf == 0 || math.IsInf(rf, 1):
	case math.IsNaN(rf) || rf <= b.Radius:
		return nil, &InputError{Field: field + ".FlankRadius", Err: fmt.Errorf(
			"%w: must be 0 or +Inf (flat flanks) or greater than the ball radius %g, got %g", ErrRange, b.Radius, rf)}
	default:
		// Concave cylinder with its axis along the groove: Tangent is the
		// groove direction, so the axis angle is 0.
		base = hertz.Groove(rf, 0, v.Material)
	}
	s, c := math.Sincos(v.HalfAngle)
	ns := flankNormals(up, g, s, c)
	dst = append(dst,
		ballContact(b, name+"+", ns[0], g, base),
		ballContact(b, name+"-", ns[1], g, base))
	return dst, nil
}

func (v Vee) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	up, g, _ := v.groove("")
	s := math.Sin(v.HalfAngle)
	root := rootBelow(b.Centre, up, b.Radius, s)
	surfs := make([]seatSurface, 2)
	for k := range surfs {
		n := cs[k].Normal
		if v.FlankRadius == 0 || math.IsInf(v.FlankRadius, 1) {
			surfs[k] = seatSurface{kind: planeSurface, q: cs[k].Point, d: n}
		} else {
			// The flank's axis lies FlankRadius from the contact point,
			// back along the normal through the ball's centre.
			surfs[k] = seatSurface{kind: concaveCylinder, q: r3.Add(cs[k].Point, r3.Scale(v.FlankRadius, n)), d: g, R: v.FlankRadius}
		}
	}
	ds := grooveDimensions(up, g, b.Centre, root)
	// Widening the half-angle turns the + flank about −g and the − flank
	// about +g, both through the root line (dn±/dθ = ∓g × n±).
	half := dimension{name: "HalfAngle", kind: seatMotion, motions: []motion{
		{surf: 0, rot: true, axis: r3.Scale(-1, g), point: root},
		{surf: 1, rot: true, axis: g, point: root},
	}}
	ds = append(ds, half,
		dimension{name: "Flank+", kind: seatMotion, motions: []motion{{surf: 0, axis: cs[0].Normal}}},
		dimension{name: "Flank-", kind: seatMotion, motions: []motion{{surf: 1, axis: cs[1].Normal}}})
	if surfs[0].kind == concaveCylinder {
		ds = append(ds,
			dimension{name: "FlankRadius+", kind: surfaceRadius, surf: 0},
			dimension{name: "FlankRadius-", kind: surfaceRadius, surf: 1})
	}
	return surfs, ds, root, v.Material.Alpha
}

func (v Vee) ideals(cs []Contact, out []float64) {
	for i := range out {
		out[i] = grooveIdeal(v.HalfAngle)
	}
}
