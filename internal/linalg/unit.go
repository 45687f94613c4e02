package linalg

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Unit3 returns v/|v| and reports whether v has a direction: false for the
// zero vector and for a vector with a NaN or infinite component. It is safe
// for every finite v, subnormal components included: v is first divided by
// its largest |component| (exactly, by a power of two where possible), so
// that neither the norm nor its reciprocal can overflow or underflow. The
// result has unit length to a few ulps (r3.Unit, which divides by the norm
// directly, returns NaN or Inf when the norm is subnormal).
func Unit3(v r3.Vec) (r3.Vec, bool) {
	if !Finite3(v) {
		return r3.Vec{}, false
	}
	m := max(math.Abs(v.X), math.Abs(v.Y), math.Abs(v.Z))
	if m == 0 {
		return r3.Vec{}, false
	}
	if m < 0x1p-500 || m > 0x1p+500 {
		// Scale by a power of two: exact, and brings the largest component
		// into [1, 2).
		_, e := math.Frexp(m)
		v = r3.Vec{X: math.Ldexp(v.X, 1-e), Y: math.Ldexp(v.Y, 1-e), Z: math.Ldexp(v.Z, 1-e)}
	}
	l := math.Sqrt(v.X*v.X + v.Y*v.Y + v.Z*v.Z)
	return r3.Vec{X: v.X / l, Y: v.Y / l, Z: v.Z / l}, true
}
