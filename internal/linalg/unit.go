package linalg

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Finite reports whether x is finite (not NaN or ±Inf). With Finite3 it is
// the one finiteness check of the module.
func Finite(x float64) bool {
	// x − x is 0 for finite x and NaN for NaN or ±Inf.
	return x-x == 0
}

// Finite3 reports whether every component of v is finite (not NaN or ±Inf).
func Finite3(v r3.Vec) bool {
	return Finite(v.X) && Finite(v.Y) && Finite(v.Z)
}

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

// AnyNormal returns a unit vector normal to the unit vector n, chosen
// deterministically: n crossed with the coordinate axis least aligned with
// it (the first of x, y, z on a tie), so the cross product has a norm of
// at least √(2/3) before it is normalised. It is the one such helper of
// the module.
func AnyNormal(n r3.Vec) r3.Vec {
	a := r3.Vec{X: 1}
	if math.Abs(n.X) > math.Abs(n.Y) || math.Abs(n.X) > math.Abs(n.Z) {
		a = r3.Vec{Y: 1}
		if math.Abs(n.Y) > math.Abs(n.Z) {
			a = r3.Vec{Z: 1}
		}
	}
	u, _ := Unit3(r3.Cross(n, a))
	return u
}
