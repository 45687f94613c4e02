package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// BisectorVees returns a three-vee coupling for the given balls, named
// "A", "B", "C", with each groove on the bisector of the ball triangle's
// angle at its ball. vees[i] is the seat of balls[i], copied with its
// Direction replaced, so each seat keeps its own Up (a tilted seat),
// half-angle, flanks and material; pass the same Vee three times for
// identical seats.
//
// The bisector at a ball is the line from its centre towards the
// triangle's incentre, projected into its seat's plane (normal to Up): the
// groove direction a seat can have that comes nearest to it. When the balls
// lie in a plane normal to every Up the grooves meet at the incentre;
// otherwise they are the projections, and [Groove.OffBisector] of the
// result is zero by the same definition.
//
// Errors are those of [Coupling.Contacts], naming the inputs as passed
// ("balls[0].Radius", "vees[1].HalfAngle"); balls in a line have no
// triangle and give an [*InputError] on "balls" wrapping [ErrDegenerate],
// and an incentre straight above or below a ball along its seat's Up one
// on "vees[i].Up".
func BisectorVees(balls [3]Ball, vees [3]Vee) (Coupling, error) {
	if err := checkTriangle(balls); err != nil {
		return Coupling{}, err
	}
	in := incentre(balls[0].Centre, balls[1].Centre, balls[2].Centre)
	return aimed(balls, vees, in, func(i int) string { return indexed("vees", i) + ".Up" })
}

// AimedVees returns a three-vee coupling for the given balls, named "A",
// "B", "C", with each groove aimed at the point target (for example the
// centroid of the balls, or a point of interest on the moving body),
// projected into its seat's plane. vees[i] is the seat of balls[i], copied
// with its Direction replaced.
//
// Errors are those of [Coupling.Contacts], naming the inputs as passed
// ("balls[0].Radius", "vees[1].HalfAngle"), and an [*InputError] naming
// "target" if it is not finite or lies straight above or below a ball
// (along the seat's Up), which leaves that groove no direction.
func AimedVees(balls [3]Ball, target r3.Vec, vees [3]Vee) (Coupling, error) {
	if !linalg.Finite3(target) {
		return Coupling{}, &InputError{Field: "target", Err: fmt.Errorf("%w: %v", ErrNonFinite, target)}
	}
	return aimed(balls, vees, target, func(int) string { return "target" })
}

// SocketVeeFlat returns the classic coupling of a trihedral socket under
// ball "A", a vee under ball "B" with its groove aimed at ball A, and a
// flat under ball "C". The seats are copies of the given ones with the
// vee's Direction replaced and, if the socket's Azimuth is zero, its
// Azimuth set towards ball B.
//
// Errors are those of [Coupling.Contacts], naming the inputs as passed
// ("balls[2].Radius", "socket.HalfAngle", "flat.Up"). A groove that would
// run along the vee's Up (ball A straight above or below ball B along it)
// is named "vee.Up", and a socket azimuth left zero that would point
// along the socket's Up "socket.Up": the constructor sets those
// directions, not the caller.
func SocketVeeFlat(balls [3]Ball, socket Trihedral, vee Vee, flat Flat) (Coupling, error) {
	vee.Direction = r3.Sub(balls[0].Centre, balls[1].Centre)
	azimuth := "socket.Azimuth"
	if socket.Azimuth == (r3.Vec{}) {
		socket.Azimuth = r3.Sub(balls[1].Centre, balls[0].Centre)
		azimuth = "socket.Up"
	}
	c := Coupling{Pairs: []Pair{
		{Name: "A", Ball: balls[0], Seat: socket},
		{Name: "B", Ball: balls[1], Seat: vee},
		{Name: "C", Ball: balls[2], Seat: flat},
	}}
	if _, err := c.Contacts(); err != nil {
		return Coupling{}, inLayoutTerms(err, [3]string{"socket", "vee", "flat"},
			rename{pairField(0) + ".Seat.Azimuth", azimuth},
			rename{pairField(1) + ".Seat.Direction", "vee.Up"})
	}
	return c, nil
}

// inLayoutTerms returns an error of [Coupling.Contacts] for a coupling
// that a layout constructor built from its parameters, in the terms of
// the constructor's caller: "Pairs[i].Ball…" becomes "balls[i]…" and
// "Pairs[i].Seat…" the parameter seats[i] names ("vees[1]…", "socket…").
// The rules in first, tried before those, name the parameters behind the
// fields the constructor itself set (a groove direction). The checks
// themselves stay in Contacts and the seats.
func inLayoutTerms(err error, seats [3]string, first ...rename) error {
	rs := first
	for i, s := range seats {
		rs = append(rs, rename{pairField(i) + ".Ball", indexed("balls", i)}, rename{pairField(i) + ".Seat", s})
	}
	return renamed(err, rs...)
}

// aimed builds three vees with groove i pointing from ball i to target;
// blame(i) names the input blamed when target lies along seat i's Up.
func aimed(balls [3]Ball, vees [3]Vee, target r3.Vec, blame func(int) string) (Coupling, error) {
	c := Coupling{Pairs: make([]Pair, 3)}
	for i, b := range balls {
		if err := checkBall(b, indexed("balls", i)); err != nil {
			return Coupling{}, err
		}
		v := vees[i]
		up, err := unitOf(v.Up, fmt.Sprintf("vees[%d].Up", i))
		if err != nil {
			return Coupling{}, err
		}
		d, ok := linalg.Unit3(r3.Sub(target, b.Centre))
		var g r3.Vec
		if ok {
			g, ok = flatten(d, up)
		}
		if !ok {
			return Coupling{}, &InputError{Field: blame(i), Err: fmt.Errorf(
				"%w: the groove of ball %s would point along its seat's Up (the target lies on the line through the ball along that Up)", ErrDegenerate, pairName("", i))}
		}
		v.Direction = g
		c.Pairs[i] = Pair{Name: pairName("", i), Ball: b, Seat: v}
	}
	if _, err := c.Contacts(); err != nil {
		var vees [3]string
		var first []rename
		for i := range vees {
			vees[i] = indexed("vees", i)
			first = append(first, rename{pairField(i) + ".Seat.Direction", blame(i)})
		}
		return Coupling{}, inLayoutTerms(err, vees, first...)
	}
	return c, nil
}

// collinearTol is the smallest ratio of the triangle's doubled area to the
// square of its longest side that counts as a triangle: below it the balls
// lie in a line to within a millionth of their spacing.
const collinearTol = 1e-6

func checkTriangle(balls [3]Ball) error {
	for i, b := range balls {
		if err := checkBall(b, indexed("balls", i)); err != nil {
			return err
		}
	}
	if !isTriangle(balls[0].Centre, balls[1].Centre, balls[2].Centre) {
		return &InputError{Field: "balls", Err: fmt.Errorf("%w: the three balls lie in a line", ErrDegenerate)}
	}
	return nil
}

// isTriangle reports whether a, b and c are not collinear (see
// collinearTol).
func isTriangle(a, b, c r3.Vec) bool {
	area2 := linalg.Norm3(r3.Cross(r3.Sub(b, a), r3.Sub(c, a)))
	longest := max(r3.Norm2(r3.Sub(b, a)), r3.Norm2(r3.Sub(c, b)), r3.Norm2(r3.Sub(a, c)))
	return area2 > collinearTol*longest
}

// incentre returns the incentre of the triangle abc: the vertices weighted
// by the lengths of the opposite sides.
func incentre(a, b, c r3.Vec) r3.Vec {
	la, lb, lc := linalg.Norm3(r3.Sub(b, c)), linalg.Norm3(r3.Sub(c, a)), linalg.Norm3(r3.Sub(a, b))
	s := la + lb + lc
	return r3.Scale(1/s, r3.Add(r3.Scale(la, a), r3.Add(r3.Scale(lb, b), r3.Scale(lc, c))))
}

// Reference is the direction from which a groove azimuth is measured,
// about the seat's Up, right-handed.
type Reference int

const (
	// Radial measures from the direction that points from the ball
	// towards the centroid of all ball centres, projected normal to Up.
	// A groove at azimuth 0 is radial, at ±π/2 tangential.
	Radial Reference = iota

	// FrameX measures from the global x axis projected normal to Up (the
	// global y axis when Up lies along x): the drawing's own frame. With
	// Up along +z an azimuth is the usual plan angle from +x towards +y.
	FrameX
)

// String returns "Radial" or "FrameX".
func (r Reference) String() string {
	switch r {
	case Radial:
		return "Radial"
	case FrameX:
		return "FrameX"
	}
	return fmt.Sprintf("Reference(%d)", int(r))
}

// WithGroove returns a copy of the coupling with the groove of pair i (a
// [Vee] or [Rods]) turned so that it lies at the azimuth angle, in
// radians, measured from ref about the seat's Up. Azimuths π apart are the
// same groove.
//
// WithGroove returns an [*InputError] naming "i" if the pair does not
// exist or its seat is not a groove, "angle" if it is not finite, "ref" for
// an unknown reference, and the errors of [Coupling.Contacts].
func (c Coupling) WithGroove(i int, angle float64, ref Reference) (Coupling, error) {
	if i < 0 || i >= len(c.Pairs) {
		return Coupling{}, &InputError{Field: "i", Err: fmt.Errorf("%w: pair %d of %d", ErrRange, i, len(c.Pairs))}
	}
	v, ok := c.Pairs[i].Seat.(grooveSeat)
	if !ok {
		return Coupling{}, &InputError{Field: "i", Err: fmt.Errorf("%w: Pairs[%d].Seat is %T, not a groove (Vee or Rods)", ErrDegenerate, i, c.Pairs[i].Seat)}
	}
	if !linalg.Finite(angle) {
		return Coupling{}, &InputError{Field: "angle", Err: fmt.Errorf("%w: %g", ErrNonFinite, angle)}
	}
	if _, err := c.Contacts(); err != nil {
		return Coupling{}, err
	}
	up, _ := unitOf(v.up(), "")
	x, err := c.reference(i, up, ref)
	if err != nil {
		return Coupling{}, err
	}
	out := Coupling{Pairs: append([]Pair(nil), c.Pairs...)}
	out.Pairs[i].Seat = v.withDirection(turn(x, up, angle))
	return out, nil
}

// turn returns the unit horizontal direction x turned by angle about the
// unit vector up.
func turn(x, up r3.Vec, angle float64) r3.Vec {
	s, co := math.Sincos(angle)
	return r3.Add(r3.Scale(co, x), r3.Scale(s, r3.Cross(up, x)))
}

// reference returns the unit direction, normal to the unit vector up, from
// which azimuths of pair i are measured.
func (c Coupling) reference(i int, up r3.Vec, ref Reference) (r3.Vec, error) {
	switch ref {
	case Radial:
		d, ok := linalg.Unit3(r3.Sub(ballCentroid(c), c.Pairs[i].Ball.Centre))
		var x r3.Vec
		if ok {
			x, ok = flatten(d, up)
		}
		if !ok {
			return r3.Vec{}, &InputError{Field: pairField(i) + ".Ball.Centre", Err: fmt.Errorf(
				"%w: straight above or below the centroid of the balls; the radial direction is undefined", ErrDegenerate)}
		}
		return x, nil
	case FrameX:
		return frameX(up), nil
	}
	return r3.Vec{}, &InputError{Field: "ref", Err: fmt.Errorf("%w: unknown reference %d", ErrRange, int(ref))}
}

// frameX returns the global x axis projected normal to the unit vector up,
// or the y axis if up lies along x.
func frameX(up r3.Vec) r3.Vec {
	if x, ok := flatten(r3.Vec{X: 1}, up); ok {
		return x
	}
	y, _ := flatten(r3.Vec{Y: 1}, up)
	return y
}

// azimuthFrom returns the angle of the unit horizontal direction d about
// the unit vector up from the unit horizontal direction x, in (−π/2, π/2]
// (a groove is a line).
func azimuthFrom(d, up, x r3.Vec) float64 {
	return wrapAzimuth(math.Atan2(r3.Dot(up, r3.Cross(x, d)), r3.Dot(x, d)))
}

// wrapAzimuth returns a in (−π/2, π/2], modulo π.
func wrapAzimuth(a float64) float64 {
	a = math.Mod(a, math.Pi)
	if a <= -math.Pi/2 {
		a += math.Pi
	} else if a > math.Pi/2 {
		a -= math.Pi
	}
	return a
}

func ballCentroid(c Coupling) r3.Vec {
	var s r3.Vec
	for _, p := range c.Pairs {
		s = r3.Add(s, p.Ball.Centre)
	}
	return r3.Scale(1/float64(len(c.Pairs)), s)
}

// Window is a range of allowed groove azimuths in radians, Min ≤ azimuth ≤
// Max, measured about the seat's Up from the direction From names: the
// [Radial] direction (the zero value) or the drawing's [FrameX]. A groove
// is a line, so azimuths π apart are the same groove, and a window of width
// π or more allows every direction. For example, with Up along +z, "keep
// every groove at least 20° away from the x axis, where the cables run" is
// Window{Min: 20°, Max: 160°, From: FrameX} (in radians).
type Window struct {
	Min, Max float64
	From     Reference
}
