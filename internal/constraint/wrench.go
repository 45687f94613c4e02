package constraint

import "gonum.org/v1/gonum/spatial/r3"

// Wrench is a load: the force F in newtons and its moment M about the
// origin in newton-metres. It has the layout of screw.Wrench, so that
// either converts to the other.
type Wrench struct{ F, M r3.Vec }

// Twist is an instantaneous motion: the angular velocity W in rad/s and
// the velocity V in m/s of the body point at the origin. It has the layout
// of screw.Twist.
type Twist struct{ W, V r3.Vec }

// power returns the reciprocal product W·M + V·F in watts.
func power(t Twist, w Wrench) float64 {
	return r3.Dot(t.W, w.M) + r3.Dot(t.V, w.F)
}
