package linalg

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestFinite checks Finite on the IEEE 754 special values and the ends of
// the finite range.
func TestFinite(t *testing.T) {
	for _, x := range []float64{0, math.Copysign(0, -1), 5e-324, -math.MaxFloat64, math.MaxFloat64} {
		if !Finite(x) {
			t.Errorf("Finite(%g) = false", x)
		}
	}
	for _, x := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		if Finite(x) {
			t.Errorf("Finite(%g) = true", x)
		}
	}
}

// TestAnyNormal checks that AnyNormal gives a unit vector normal to n, and
// the choice by hand for the axes: z × x = y, x × y = z, y × x = −z (x is
// least aligned with z and, on the tie, with y; y with x).
func TestAnyNormal(t *testing.T) {
	for _, tc := range []struct{ n, want r3.Vec }{
		{r3.Vec{Z: 1}, r3.Vec{Y: 1}},
		{r3.Vec{X: 1}, r3.Vec{Z: 1}},
		{r3.Vec{Y: 1}, r3.Vec{Z: -1}},
	} {
		if got := AnyNormal(tc.n); got != tc.want {
			t.Errorf("AnyNormal(%v) = %v, want %v", tc.n, got, tc.want)
		}
	}
	for _, v := range []r3.Vec{{X: 1, Y: 1, Z: 1}, {X: -0.3, Y: 0.9, Z: 0.1}, {X: 1e-300, Y: -1, Z: 1e-9}, {X: 0.6, Y: 0, Z: -0.8}} {
		n, _ := Unit3(v)
		u := AnyNormal(n)
		if math.Abs(Norm3(u)-1) > 4e-16 || math.Abs(r3.Dot(u, n)) > 4e-16 {
			t.Errorf("AnyNormal(%v) = %v: |u| = %g, u·n = %g; want 1 and 0", n, u, Norm3(u), r3.Dot(u, n))
		}
	}
}
