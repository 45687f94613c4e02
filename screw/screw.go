package screw

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Twist is an instantaneous rigid-body motion: W is the angular velocity in
// rad/s and V the velocity in m/s of the body point momentarily at the
// origin. The zero Twist is no motion. When a twist stands for a small
// displacement, W is a small rotation in radians and V a displacement in
// metres.
type Twist struct {
	W, V r3.Vec
}

// Wrench is a load on a rigid body: the force F in newtons and its moment M
// about the origin in newton-metres. The zero Wrench is no load.
type Wrench struct {
	F, M r3.Vec
}

// Axis is the screw axis of a twist: the line through Point with unit
// direction Direction, and the pitch in metres per radian (the translation along
// Direction per radian of rotation about it). Point is the point of the line
// nearest the origin. A pure translation has Pitch = +Inf, Direction along the
// translation and Point at the origin. The zero Axis (Direction zero) stands for
// no motion.
type Axis struct {
	Point     r3.Vec
	Direction r3.Vec
	Pitch     float64
}

// Line returns the wrench of a unit force, in newtons, acting along the line
// through the point p with direction n: (n̂, p × n̂) with n̂ = n/|n|.
// n need not be a unit vector; only its direction is used, and any
// non-zero finite n has one, subnormal components included.
//
// Line returns an [*InputError] wrapping [ErrNonFinite] if a component of p
// or n is NaN or infinite, [ErrDegenerate] if n is the zero vector, and
// [ErrRange] if the moment p × n̂ overflows (field "p").
func Line(p, n r3.Vec) (Wrench, error) {
	if !linalg.Finite3(p) {
		return Wrench{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	if !linalg.Finite3(n) {
		return Wrench{}, &InputError{Field: "n", Err: fmt.Errorf("%w: %v", ErrNonFinite, n)}
	}
	u, ok := linalg.Unit3(n) // scales first: safe for subnormal n
	if !ok {
		return Wrench{}, &InputError{Field: "n", Err: fmt.Errorf("%w: a line needs a direction", ErrDegenerate)}
	}
	m := r3.Cross(p, u)
	if !linalg.Finite3(m) {
		return Wrench{}, &InputError{Field: "p", Err: fmt.Errorf("%w: moment of the line overflows: %v", ErrRange, p)}
	}
	return Wrench{F: u, M: m}, nil
}

// Power returns the reciprocal product of t and w, W·M + V·F: the power in
// watts that the wrench w develops on the motion t. It is the same about any
// reference point. A twist is free against a constraint wrench, and the two
// are reciprocal, when their power is zero.
func Power(t Twist, w Wrench) float64 {
	return r3.Dot(t.W, w.M) + r3.Dot(t.V, w.F)
}

// At returns the velocity in m/s of the body point q under the twist t:
// V + W × q.
func (t Twist) At(q r3.Vec) r3.Vec {
	return r3.Add(t.V, r3.Cross(t.W, q))
}

// About returns t with the point o as reference: the same W and, in place of
// V, the velocity of the body point at o. It is the twist expressed in a
// frame whose origin is at o, axes unchanged.
func (t Twist) About(o r3.Vec) Twist {
	return Twist{W: t.W, V: t.At(o)}
}

// Add returns the sum of the twists t and u.
func (t Twist) Add(u Twist) Twist {
	return Twist{W: r3.Add(t.W, u.W), V: r3.Add(t.V, u.V)}
}

// Scale returns the twist t multiplied by f.
func (t Twist) Scale(f float64) Twist {
	return Twist{W: r3.Scale(f, t.W), V: r3.Scale(f, t.V)}
}

// Axis returns the screw axis of t. See [Axis] for pure translations and for
// the zero twist, which has the zero Axis. The direction is found by
// scaling first, so that it is exact for any non-zero W or V, subnormal
// included; Point and Pitch are |V|/|W| in size and overflow to infinity
// only when that ratio exceeds the float64 range.
func (t Twist) Axis() Axis {
	d, ok := linalg.Unit3(t.W)
	if !ok {
		v, ok := linalg.Unit3(t.V)
		if !ok {
			return Axis{}
		}
		return Axis{Direction: v, Pitch: math.Inf(1)}
	}
	// |W|·d = W: point W×V/|W|² = d×V/|W|, pitch W·V/|W|² = d·V/|W|.
	w := linalg.Norm3(t.W)
	p := r3.Cross(d, t.V)
	return Axis{
		Point:     r3.Vec{X: p.X / w, Y: p.Y / w, Z: p.Z / w}, // not ·(1/w), which overflows for subnormal w
		Direction: d,
		Pitch:     r3.Dot(d, t.V) / w,
	}
}

// About returns w with its moment taken about the point o instead of the
// origin: (F, M − o × F). It is the wrench expressed in a frame whose origin
// is at o, axes unchanged.
func (w Wrench) About(o r3.Vec) Wrench {
	return Wrench{F: w.F, M: r3.Sub(w.M, r3.Cross(o, w.F))}
}

// Add returns the sum of the wrenches w and u.
func (w Wrench) Add(u Wrench) Wrench {
	return Wrench{F: r3.Add(w.F, u.F), M: r3.Add(w.M, u.M)}
}

// Scale returns the wrench w multiplied by f.
func (w Wrench) Scale(f float64) Wrench {
	return Wrench{F: r3.Scale(f, w.F), M: r3.Scale(f, w.M)}
}
