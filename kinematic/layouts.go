package kinematic

import (
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// BisectorVees returns a three-vee coupling for the given balls, named
// "A", "B", "C", with each groove along the bisector of the ball triangle's
// angle at its ball: the grooves' axes meet at the triangle's incentre.
// The seats are copies of vee with Direction replaced.
//
// Errors are those of [Coupling.Contacts]; balls in a line have no
// triangle and give an [*InputError] wrapping [ErrDegenerate].
func BisectorVees(balls [3]Ball, vee Vee) (Coupling, error) {
	if err := checkTriangle(balls); err != nil {
		return Coupling{}, err
	}
	in := incentre(balls[0].Centre, balls[1].Centre, balls[2].Centre)
	return aimed(balls, vee, func(int) r3.Vec { return in }, "balls")
}

// AimedVees returns a three-vee coupling for the given balls, named "A",
// "B", "C", with each groove aimed at the point target (for example the
// centroid of the balls, or a point of interest on the moving body). The
// seats are copies of vee with Direction replaced.
//
// Errors are those of [Coupling.Contacts], and an [*InputError] naming
// "target" if it is not finite or lies straight above or below a ball
// (along the seat's Up), which leaves that groove no direction.
func AimedVees(balls [3]Ball, target r3.Vec, vee Vee) (Coupling, error) {
	if !linalg.Finite3(target) {
		return Coupling{}, &InputError{Field: "target", Err: fmt.Errorf("%w: %v", ErrNonFinite, target)}
	}
	return aimed(balls, vee, func(int) r3.Vec { return target }, "target")
}

// SocketVeeFlat returns the classic coupling of a trihedral socket under
// ball "A", a vee under ball "B" with its groove aimed at ball A, and a
// flat under ball "C". The seats are copies of the given ones with the
// vee's Direction replaced and, if the socket's Azimuth is zero, its
// Azimuth set towards ball B.
//
// Errors are those of [Coupling.Contacts].
func SocketVeeFlat(balls [3]Ball, socket Trihedral, vee Vee, flat Flat) (Coupling, error) {
	vee.Direction = r3.Sub(balls[0].Centre, balls[1].Centre)
	if socket.Azimuth == (r3.Vec{}) {
		socket.Azimuth = r3.Sub(balls[1].Centre, balls[0].Centre)
	}
	c := Coupling{Pairs: []Pair{
		{Name: "A", Ball: balls[0], Seat: socket},
		{Name: "B", Ball: balls[1], Seat: vee},
		{Name: "C", Ball: balls[2], Seat: flat},
	}}
	if _, err := c.Contacts(); err != nil {
		return Coupling{}, err
	}
	return c, nil
}

// aimed builds three vees with groove i pointing from ball i to target(i).
func aimed(balls [3]Ball, vee Vee, target func(int) r3.Vec, field string) (Coupling, error) {
	var c Coupling
	for i, b := range balls {
		if err := checkBall(b, fmt.Sprintf("balls[%d]", i)); err != nil {
			return Coupling{}, err
		}
		v := vee
		v.Direction = r3.Sub(target(i), b.Centre)
		if up, err := unitOf(vee.Up, "vee.Up"); err == nil {
			if _, err := horizontal(v.Direction, up, field); err != nil {
				return Coupling{}, err
			}
		}
		c.Pairs = append(c.Pairs, Pair{Name: pairName("", i), Ball: b, Seat: v})
	}
	if _, err := c.Contacts(); err != nil {
		return Coupling{}, err
	}
	return c, nil
}

// collinearTol is the smallest ratio of the triangle's doubled area to the
// square of its longest side that counts as a triangle: below it the balls
// lie in a line to within a millionth of their spacing.
const collinearTol = 1e-6

func checkTriangle(balls [3]Ball) error {
	for i, b := range balls {
		if err := checkBall(b, fmt.Sprintf("balls[%d]", i)); err != nil {
			return err
		}
	}
	a, b, c := balls[0].Centre, balls[1].Centre, balls[2].Centre
	area2 := linalg.Norm3(r3.Cross(r3.Sub(b, a), r3.Sub(c, a)))
	longest := max(r3.Norm2(r3.Sub(b, a)), r3.Norm2(r3.Sub(c, b)), r3.Norm2(r3.Sub(a, c)))
	if area2 <= collinearTol*longest {
		return &InputError{Field: "balls", Err: fmt.Errorf("%w: the three balls lie in a line", ErrDegenerate)}
	}
	return nil
}
