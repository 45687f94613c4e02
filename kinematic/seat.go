package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Ball is a ball fixed to the moving body.
type Ball struct {
	Centre   r3.Vec  // m
	Radius   float64 // m, > 0
	Material hertz.Material
}

// Seat is the feature of the base that receives one ball: a [Vee], [Flat],
// [Trihedral] or [Cone]. Contacts of any other shape are given directly as
// [Contact] values.
type Seat interface {
	// contacts returns the contacts that the seat makes with the seated
	// ball b; name labels them and field names the seat in errors.
	contacts(b Ball, name, field string) ([]Contact, error)
}

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

// Flat is a plane pad that holds a ball at one point, under its centre
// along −Up.
type Flat struct {
	Up       r3.Vec // normal of the pad, towards the ball
	Material hertz.Material
}

// Trihedral is a socket of three plane faces, equally spaced about Up, that
// holds a ball at three points. Each face makes the angle HalfAngle with
// the socket axis (Up), so each contact normal leans HalfAngle from the
// horizontal; a cube-corner socket has HalfAngle = atan(1/√2) ≈ 35.26°.
// The first contact lies on the side of the ball that Azimuth points to
// (its part normal to Up), the others at 120° and 240° about Up.
type Trihedral struct {
	Up        r3.Vec
	Azimuth   r3.Vec
	HalfAngle float64 // rad, in (0, π/2)
	Material  hertz.Material
}

// Cone is a conical seat of half-angle HalfAngle between its surface and
// its axis (Up). A ball in a cone bears on a ring, not at points; for
// constraint analysis the ring stands as three contacts laid out as those
// of a [Trihedral] with the same fields. The seat surface at those contacts
// conforms to the ball around the ring, so a Hertz analysis of them reports
// line contact ([hertz.ErrLineContact]): a cone's contact stresses need a
// ring-contact model, which this package does not provide.
type Cone struct {
	Up        r3.Vec
	Azimuth   r3.Vec
	HalfAngle float64 // rad, in (0, π/2)
	Material  hertz.Material
}

// Pair is one ball in its seat.
type Pair struct {
	Name string // labels the pair's contacts; "" means a letter by position ("A", "B", ...)
	Ball Ball
	Seat Seat
}

// Coupling is a kinematic coupling: balls on the moving body, each seated
// in a seat on the base.
type Coupling struct {
	Pairs []Pair
}

// Contact is a point contact between the moving body and the base.
//
// The base pushes the moving body along Normal at Point. For a contact made
// by a ball, Centre and Radius are the ball's (Radius is 0 otherwise). The
// surfaces that touch are Moving (the moving body's, usually the ball) and
// Base, as [hertz.Body] values whose principal angles are measured about
// Normal (right-handed) from Tangent, a unit vector normal to Normal.
// Contacts given by hand may leave Tangent and the surfaces zero when only
// constraint and stability are wanted.
type Contact struct {
	Label   string
	Point   r3.Vec // m
	Normal  r3.Vec // unit, into the moving body
	Centre  r3.Vec // m, the ball's centre when Radius > 0
	Radius  float64
	Tangent r3.Vec
	Moving  hertz.Body
	Base    hertz.Body
}

// coincidentTol is the distance, relative to the largest distance between
// two balls of a coupling, below which two balls are the same ball twice.
// Drawings carry 1e-6 at worst; 1e-9 catches only a ball listed twice.
const coincidentTol = 1e-9

// Contacts returns the contacts of the coupling, pair by pair, in the order
// each seat's documentation gives. Vee contacts are labelled Name+"+" and
// Name+"-" ("+" for the flank on the side Up × Direction), trihedral and
// cone contacts Name+"1" to Name+"3", a flat's contact Name.
//
// Contacts returns an [*InputError] naming the pair and field for a
// missing seat, a ball radius that is not positive, a zero or non-finite
// direction, a half-angle outside (0, π/2), a flank radius not larger than
// the ball's, a groove that runs along its own Up, or two coincident balls.
func (c Coupling) Contacts() ([]Contact, error) {
	if len(c.Pairs) == 0 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: no pairs", ErrDegenerate)}
	}
	var span float64
	for i, p := range c.Pairs {
		if err := checkBall(p.Ball, fmt.Sprintf("Pairs[%d].Ball", i)); err != nil {
			return nil, err
		}
		for j := 0; j < i; j++ {
			span = math.Max(span, linalg.Norm3(r3.Sub(p.Ball.Centre, c.Pairs[j].Ball.Centre)))
		}
	}
	for i, p := range c.Pairs {
		for j := 0; j < i; j++ {
			if d := linalg.Norm3(r3.Sub(p.Ball.Centre, c.Pairs[j].Ball.Centre)); d <= coincidentTol*span {
				return nil, &InputError{Field: fmt.Sprintf("Pairs[%d].Ball.Centre", i), Err: fmt.Errorf(
					"%w: the same centre as Pairs[%d]'s ball", ErrDegenerate, j)}
			}
		}
	}
	var cs []Contact
	for i, p := range c.Pairs {
		field := fmt.Sprintf("Pairs[%d].Seat", i)
		if p.Seat == nil {
			return nil, &InputError{Field: field, Err: fmt.Errorf("%w: no seat", ErrDegenerate)}
		}
		more, err := p.Seat.contacts(p.Ball, pairName(p.Name, i), field)
		if err != nil {
			return nil, err
		}
		cs = append(cs, more...)
	}
	return cs, nil
}

// pairName returns name, or a letter by position if name is empty.
func pairName(name string, i int) string {
	if name != "" {
		return name
	}
	if i < 26 {
		return string(rune('A' + i))
	}
	return fmt.Sprintf("P%d", i+1)
}

func checkBall(b Ball, field string) error {
	if !linalg.Finite3(b.Centre) {
		return &InputError{Field: field + ".Centre", Err: fmt.Errorf("%w: %v", ErrNonFinite, b.Centre)}
	}
	if !(b.Radius > 0) || math.IsInf(b.Radius, 0) {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf("%w: must be positive and finite, got %g", ErrRange, b.Radius)}
	}
	return nil
}

func (v Vee) contacts(b Ball, name, field string) ([]Contact, error) {
	up, err := unitOf(v.Up, field+".Up")
	if err != nil {
		return nil, err
	}
	g, err := horizontal(v.Direction, up, field+".Direction")
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
	side := r3.Cross(up, g)
	s, c := math.Sincos(v.HalfAngle)
	cs := make([]Contact, 2)
	for k, sgn := range [2]float64{1, -1} {
		n := r3.Add(r3.Scale(s, up), r3.Scale(-sgn*c, side))
		cs[k] = ballContact(b, name+[2]string{"+", "-"}[k], n, g, base)
	}
	return cs, nil
}

func (f Flat) contacts(b Ball, name, field string) ([]Contact, error) {
	up, err := unitOf(f.Up, field+".Up")
	if err != nil {
		return nil, err
	}
	return []Contact{ballContact(b, name, up, anyNormal(up), hertz.Flat(f.Material))}, nil
}

func (t Trihedral) contacts(b Ball, name, field string) ([]Contact, error) {
	return socket(b, name, field, t.Up, t.Azimuth, t.HalfAngle, func(Ball) hertz.Body { return hertz.Flat(t.Material) })
}

func (c Cone) contacts(b Ball, name, field string) ([]Contact, error) {
	// Around the ring (Tangent) the cone conforms to the ball: radius −r.
	// Along the generator it is straight.
	return socket(b, name, field, c.Up, c.Azimuth, c.HalfAngle, func(b Ball) hertz.Body {
		return hertz.Toroid(-b.Radius, math.Inf(1), 0, c.Material)
	})
}

// socket returns the three contacts of a trihedral or conical seat.
func socket(b Ball, name, field string, upv, az r3.Vec, half float64, surface func(Ball) hertz.Body) ([]Contact, error) {
	up, err := unitOf(upv, field+".Up")
	if err != nil {
		return nil, err
	}
	h0, err := horizontal(az, up, field+".Azimuth")
	if err != nil {
		return nil, err
	}
	if err := checkHalfAngle(half, field+".HalfAngle"); err != nil {
		return nil, err
	}
	s, c := math.Sincos(half)
	cs := make([]Contact, 3)
	for k := range cs {
		h := r3.Rotate(h0, 2*math.Pi*float64(k)/3, up)
		n := r3.Add(r3.Scale(s, up), r3.Scale(-c, h))
		cs[k] = ballContact(b, fmt.Sprintf("%s%d", name, k+1), n, r3.Unit(r3.Cross(up, h)), surface(b))
	}
	return cs, nil
}

// ballContact returns the contact of ball b along the unit normal n.
func ballContact(b Ball, label string, n, tangent r3.Vec, base hertz.Body) Contact {
	return Contact{
		Label:   label,
		Point:   r3.Sub(b.Centre, r3.Scale(b.Radius, n)),
		Normal:  n,
		Centre:  b.Centre,
		Radius:  b.Radius,
		Tangent: tangent,
		Moving:  hertz.Sphere(b.Radius, b.Material),
		Base:    base,
	}
}

func checkHalfAngle(a float64, field string) error {
	if !(a > 0 && a < math.Pi/2) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: must be in (0, π/2) rad, got %g", ErrRange, a)}
	}
	return nil
}

// horizontalTol is the smallest fraction of a direction that must lie
// normal to Up: a groove within about 1e-6 rad of Up has no horizontal
// direction that its numbers can be trusted for.
const horizontalTol = 1e-6

// horizontal returns the unit part of d normal to the unit vector up.
func horizontal(d, up r3.Vec, field string) (r3.Vec, error) {
	u, err := unitOf(d, field)
	if err != nil {
		return r3.Vec{}, err
	}
	h := r3.Sub(u, r3.Scale(r3.Dot(u, up), up))
	l := linalg.Norm3(h)
	if l <= horizontalTol {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: along Up; it must have a part normal to Up", ErrDegenerate)}
	}
	return r3.Scale(1/l, h), nil
}

// unitOf returns v/|v|, or an error naming field if v is zero or not
// finite.
func unitOf(v r3.Vec, field string) (r3.Vec, error) {
	if !linalg.Finite3(v) {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: %v", ErrNonFinite, v)}
	}
	l := linalg.Norm3(v)
	if l == 0 {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: zero vector", ErrDegenerate)}
	}
	return r3.Scale(1/l, v), nil
}

// anyNormal returns a unit vector normal to the unit vector n, chosen
// deterministically.
func anyNormal(n r3.Vec) r3.Vec {
	a := r3.Vec{X: 1}
	if math.Abs(n.X) > math.Abs(n.Y) || math.Abs(n.X) > math.Abs(n.Z) {
		a = r3.Vec{Y: 1}
		if math.Abs(n.Y) > math.Abs(n.Z) {
			a = r3.Vec{Z: 1}
		}
	}
	return r3.Unit(r3.Cross(n, a))
}
