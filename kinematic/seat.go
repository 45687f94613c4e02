package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Ball is a ball fixed to the moving body: a sphere, or the spherical
// surface that touches a seat.
//
// A canoe ball (a spherical segment of large radius on a small body, which
// gives a stiffer, stronger contact than a ball of the body's size) is a
// Ball whose Radius is the segment's radius and whose Centre is that
// sphere's centre, often far outside the part; each contact of its seat
// then lies a Radius from it along the normal, as for a ball. The segment
// must be large enough to hold every contact of its seat.
type Ball struct {
	Centre   r3.Vec  // m
	Radius   float64 // m, > 0
	Material hertz.Material
}

// Seat is the feature of the base that receives one ball: a [Vee], [Rods],
// [Flat], [Trihedral] or [Cone]. Contacts of any other shape are given
// directly as [Contact] values.
type Seat interface {
	// appendContacts appends the contacts that the seat makes with the
	// seated ball b to dst; name labels them and field names the seat in
	// errors.
	appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error)

	// count returns the number of contacts the seat makes.
	count() int

	// up returns the seat's Up as given, for azimuths.
	up() r3.Vec

	// surfaces returns the seat's surfaces in the base frame, one per
	// contact, its named dimensions (see Assembly), its reference point
	// (root) and its material's expansion coefficient, for the seated
	// ball b and its nominal contacts cs.
	surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64)
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
// of a [Trihedral] with the same fields; the zero Azimuth chooses a
// direction normal to Up (the cone is axisymmetric, so the verdicts do not
// depend on it). The seat surface at those contacts conforms to the ball
// around the ring, so a Hertz analysis of them reports line contact
// ([hertz.ErrLineContact]): a cone's contact stresses need a ring-contact
// model, which this package does not provide.
type Cone struct {
	Up        r3.Vec
	Azimuth   r3.Vec  // zero: any direction normal to Up
	HalfAngle float64 // rad, in (0, π/2)
	Material  hertz.Material
}

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

// grooveSeat is a seat with a groove axis that can turn about its Up: a
// vee or a pair of rods. The groove optimiser and Geometry work with any.
type grooveSeat interface {
	Seat
	// groove returns the unit Up and groove direction, validated.
	groove(field string) (up, g r3.Vec, err error)
	// halfAngle returns the lean of the contact normals from the
	// horizontal.
	halfAngle() float64
	// withDirection returns the seat with its groove along d.
	withDirection(d r3.Vec) Seat
	// withHalfAngle returns the seat with the half-angle h.
	withHalfAngle(h float64) Seat
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

// coincidentTol is the distance, relative to the largest distance between
// two balls of a coupling, below which two balls are the same ball twice.
// Drawings carry 1e-6 at worst; 1e-9 catches only a ball listed twice.
const coincidentTol = 1e-9

// Contacts returns the contacts of the coupling, pair by pair, in the order
// each seat's documentation gives. Vee contacts are labelled Name+"+" and
// Name+"-" ("+" for the flank on the side Up × Direction), trihedral and
// cone contacts Name+"1" to Name+"3", a flat's contact Name.
//
// Contacts checks the geometry only. Materials are not needed for
// constraint, stability and layout geometry, and a zero [hertz.Material]
// passes here; the analyses that use the Hertz surfaces (forces, stiffness,
// seated pose under load) check them and name the pair's field
// ("Pairs[2].Seat.Material.E").
//
// Contacts returns an [*InputError] naming the pair and field for a
// missing seat, a ball radius that is not positive, a zero or non-finite
// direction, a half-angle outside (0, π/2), a flank radius not larger than
// the ball's, a groove that runs along its own Up, or two coincident balls.
func (c Coupling) Contacts() ([]Contact, error) {
	if len(c.Pairs) == 0 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: no pairs", ErrDegenerate)}
	}
	if err := checkBalls(c.Pairs); err != nil {
		return nil, err
	}
	n := 0
	for i, p := range c.Pairs {
		if p.Seat == nil {
			return nil, &InputError{Field: pairField(i) + ".Seat", Err: fmt.Errorf("%w: no seat", ErrDegenerate)}
		}
		n += p.Seat.count()
	}
	cs := make([]Contact, 0, n)
	for i, p := range c.Pairs {
		var err error
		cs, err = p.Seat.appendContacts(cs, p.Ball, pairName(p.Name, i), pairField(i)+".Seat")
		if err != nil {
			return nil, err
		}
	}
	return cs, nil
}

// pairField returns "Pairs[i]".
func pairField(i int) string { return indexed("Pairs", i) }

// checkBalls validates every ball and rejects coincident ones.
func checkBalls(ps []Pair) error {
	var span float64
	for i, p := range ps {
		if err := checkBall(p.Ball, pairField(i)+".Ball"); err != nil {
			return err
		}
		for j := 0; j < i; j++ {
			span = math.Max(span, linalg.Norm3(r3.Sub(p.Ball.Centre, ps[j].Ball.Centre)))
		}
	}
	for i, p := range ps {
		for j := 0; j < i; j++ {
			if d := linalg.Norm3(r3.Sub(p.Ball.Centre, ps[j].Ball.Centre)); d <= coincidentTol*span {
				return &InputError{Field: pairField(i) + ".Ball.Centre", Other: pairField(j) + ".Ball.Centre",
					Err: fmt.Errorf("%w: the same centre as another ball", ErrDegenerate)}
			}
		}
	}
	return nil
}

func checkBall(b Ball, field string) error {
	if !linalg.Finite3(b.Centre) {
		return &InputError{Field: field + ".Centre", Err: fmt.Errorf("%w: %v", ErrNonFinite, b.Centre)}
	}
	if math.IsNaN(b.Radius) || math.IsInf(b.Radius, 0) {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf("%w: %g", ErrNonFinite, b.Radius)}
	}
	if !(b.Radius > 0) {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf("%w: must be positive, got %g", ErrRange, b.Radius)}
	}
	return nil
}

func (v Vee) count() int                    { return 2 }
func (v Vee) up() r3.Vec                    { return v.Up }
func (v Vee) halfAngle() float64            { return v.HalfAngle }
func (v Vee) withDirection(d r3.Vec) Seat   { v.Direction = d; return v }
func (v Vee) withHalfAngle(h float64) Seat  { v.HalfAngle = h; return v }
func (r Rods) withHalfAngle(h float64) Seat { r.HalfAngle = h; return r }
func (r Rods) count() int                   { return 2 }
func (r Rods) up() r3.Vec                   { return r.Up }
func (r Rods) halfAngle() float64           { return r.HalfAngle }
func (r Rods) withDirection(d r3.Vec) Seat  { r.Direction = d; return r }
func (f Flat) count() int                   { return 1 }
func (f Flat) up() r3.Vec                   { return f.Up }

func (t Trihedral) count() int { return 3 }
func (t Trihedral) up() r3.Vec { return t.Up }
func (c Cone) count() int      { return 3 }
func (c Cone) up() r3.Vec      { return c.Up }

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
	if math.IsNaN(r.RodRadius) || math.IsInf(r.RodRadius, 0) {
		return nil, &InputError{Field: field + ".RodRadius", Err: fmt.Errorf("%w: %g", ErrNonFinite, r.RodRadius)}
	}
	if !(r.RodRadius > 0) {
		return nil, &InputError{Field: field + ".RodRadius", Err: fmt.Errorf("%w: must be positive, got %g", ErrRange, r.RodRadius)}
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

// flankNormals returns the contact normals of a vee of half-angle with
// sine s and cosine c, unit Up up and unit groove direction g: the "+"
// flank's on the side up × g, then the "−" flank's. Each leans the
// half-angle from the plane normal to up and points into the ball.
func flankNormals(up, g r3.Vec, s, c float64) [2]r3.Vec {
	side := r3.Cross(up, g)
	return [2]r3.Vec{
		r3.Add(r3.Scale(s, up), r3.Scale(-c, side)),
		r3.Add(r3.Scale(s, up), r3.Scale(c, side)),
	}
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

func (f Flat) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	up, err := unitOf(f.Up, field+".Up")
	if err != nil {
		return nil, err
	}
	return append(dst, ballContact(b, name, up, anyNormal(up), hertz.Flat(f.Material))), nil
}

func (t Trihedral) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	return socket(dst, b, name, field, t.Up, t.Azimuth, t.HalfAngle, hertz.Flat(t.Material), false)
}

func (c Cone) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	// Around the ring (Tangent) the cone conforms to the ball: radius −r.
	// Along the generator it is straight.
	surface := hertz.Toroid(-b.Radius, math.Inf(1), 0, c.Material)
	return socket(dst, b, name, field, c.Up, c.Azimuth, c.HalfAngle, surface, true)
}

// socket appends the three contacts of a trihedral or conical seat. With
// anyAzimuth a zero azimuth picks a direction normal to Up.
func socket(dst []Contact, b Ball, name, field string, upv, az r3.Vec, half float64, surface hertz.Body, anyAzimuth bool) ([]Contact, error) {
	up, err := unitOf(upv, field+".Up")
	if err != nil {
		return nil, err
	}
	var h0 r3.Vec
	if anyAzimuth && az == (r3.Vec{}) {
		h0 = anyNormal(up)
	} else if h0, err = horizontal(az, up, field+".Azimuth"); err != nil {
		return nil, err
	}
	if err := checkHalfAngle(half, field+".HalfAngle"); err != nil {
		return nil, err
	}
	s, c := math.Sincos(half)
	for k := 0; k < 3; k++ {
		h := r3.Rotate(h0, 2*math.Pi*float64(k)/3, up)
		n := r3.Add(r3.Scale(s, up), r3.Scale(-c, h))
		dst = append(dst, ballContact(b, fmt.Sprintf("%s%d", name, k+1), n, r3.Cross(up, h), surface))
	}
	return dst, nil
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
	if math.IsNaN(a) || math.IsInf(a, 0) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: %g", ErrNonFinite, a)}
	}
	if !(a > 0 && a < math.Pi/2) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: must be in (0, π/2) rad, got %g", ErrRange, a)}
	}
	return nil
}
