package design

import "github.com/sixfold-dev/sixfold/kinematic"

// WithCoupling returns a copy of the design with the geometry of c
// written in, for example the layout kinematic.Optimize chose: each
// ball's centre and radius, and every field of each seat that package
// kinematic's seat holds: a vee's or rods seat's direction, up and
// half-angle, a vee's flank radius and a rods seat's rod radius; a
// trihedral's or cone's up, half-angle and first-contact direction
// (Toward, from kinematic's Azimuth); a flat's up. A groove's direction
// replaces its azimuth and reference, which are cleared. Names,
// materials and everything else stay the design's.
//
// c must hold the design's pairs in order, each seat of the design's
// type (kinematic.Optimize returns such a coupling); otherwise the error
// is an [*Error] naming "seats" or the seat's type. The result is not
// checked: [Design.Build] checks it when it builds it.
func (d *Design) WithCoupling(c kinematic.Coupling) (*Design, error) {
	if len(c.Pairs) != len(d.Balls) || len(d.Seats) != len(d.Balls) {
		return nil, errorf("seats", ErrRange, "a coupling of %d pairs for a design of %d balls and %d seats", len(c.Pairs), len(d.Balls), len(d.Seats))
	}
	out := d.clone()
	for i, p := range c.Pairs {
		out.Balls[i].Centre, out.Balls[i].Radius, out.Balls[i].Canoe = p.Ball.Centre, p.Ball.Radius, p.Ball.Canoe
		s := &out.Seats[i]
		ok := false
		switch k := p.Seat.(type) {
		case kinematic.Vee:
			if ok = s.Type == Vee; ok {
				s.Direction, s.Up, s.HalfAngle, s.FlankRadius = k.Direction, k.Up, k.HalfAngle, k.FlankRadius
			}
		case kinematic.Rods:
			if ok = s.Type == Rods; ok {
				s.Direction, s.Up, s.HalfAngle, s.RodRadius = k.Direction, k.Up, k.HalfAngle, k.RodRadius
			}
		case kinematic.Flat:
			if ok = s.Type == Flat; ok {
				s.Up = k.Up
			}
		case kinematic.Trihedral:
			if ok = s.Type == Trihedral; ok {
				s.Up, s.HalfAngle, s.Toward = k.Up, k.HalfAngle, k.Azimuth
			}
		case kinematic.Cone:
			if ok = s.Type == Cone; ok {
				s.Up, s.HalfAngle, s.Toward = k.Up, k.HalfAngle, k.Azimuth
			}
		}
		if !ok {
			return nil, errorf(join(index("seats", i), "type"), ErrRange, "the coupling's seat of pair %d is a %T, the design's a %v", i, p.Seat, s.Type)
		}
		if s.Type == Vee || s.Type == Rods {
			s.Azimuth, s.Reference = 0, kinematic.Radial
		}
	}
	return &out, nil
}
