package kinematic

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

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

func (c Cone) count() int { return 3 }

func (c Cone) up() r3.Vec { return c.Up }

func (c Cone) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	// Around the ring (Tangent) the cone conforms to the ball: radius −r.
	// Along the generator it is straight.
	surface := hertz.Toroid(-b.Radius, math.Inf(1), 0, c.Material)
	return socket(dst, b, name, field, c.Up, c.Azimuth, c.HalfAngle, surface, true)
}

func (c Cone) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	s, d, apex := socketSurfaces(c.Up, c.HalfAngle, b, cs)
	return s, d, apex, c.Material.Alpha
}

func (c Cone) ideals(cs []Contact, out []float64) { socketIdeals(cs, out) }

func (Cone) isSocket() {}
