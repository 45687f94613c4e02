package linalg

import (
	"math"
	"testing"
)

// TestCholesky6Threshold: a symmetric positive semidefinite matrix of rank
// 5, A = s·L·Lᵀ with L unit lower triangular (entries ±1/4, ±1/2) except
// l₅₅ = 0. Every product, every square root (of s = 2^±20, the pivots
// s·1) and every division is exact in float64, so the factorisation
// reproduces s^(1/2)·L and its last pivot is exactly 0. Adding η to A₅₅
// makes that pivot η to within half an ulp of A₅₅ (the one rounding, by
// hand). The documented test refuses a pivot at or below tiny times the
// largest diagonal entry: with tiny = 1e-12, η = 1e-14·big is refused and
// η = 1e-10·big factored, with L·Lᵀ = A to rounding. The two scales make
// the threshold relative, and at s = 2^-20 an absolute shift of a pivot by
// tiny would show in the factor.
func TestCholesky6Threshold(t *testing.T) {
	l := [6][6]float64{
		{1, 0, 0, 0, 0, 0},
		{0.5, 1, 0, 0, 0, 0},
		{-0.25, 0.5, 1, 0, 0, 0},
		{0.5, -0.5, 0.25, 1, 0, 0},
		{0.25, 0.25, -0.5, 0.5, 1, 0},
		{-0.5, 0.25, 0.5, -0.25, 0.5, 0},
	}
	for _, s := range []float64{0x1p20, 0x1p-20} {
		var a [36]float64 // row-major
		var big float64
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				for k := 0; k < 6; k++ {
					a[6*i+j] += s * l[i][k] * l[j][k]
				}
			}
			big = math.Max(big, a[7*i])
		}
		below := a
		below[35] += 1e-14 * big
		if Cholesky6(&below, 1e-12) {
			t.Errorf("s = %g: a matrix singular to 1e-14 of its diagonal factored with tiny = 1e-12", s)
		}
		above := a
		above[35] += 1e-10 * big
		src := above
		if !Cholesky6(&above, 1e-12) {
			t.Errorf("s = %g: a matrix regular to 1e-10 of its diagonal refused with tiny = 1e-12", s)
			continue
		}
		for i := 0; i < 6; i++ {
			for j := 0; j <= i; j++ {
				var p float64
				for k := 0; k <= j; k++ {
					p += above[6*i+k] * above[6*j+k]
				}
				if math.Abs(p-src[6*i+j]) > 1e-15*big {
					t.Errorf("s = %g: (L·Lᵀ)[%d,%d] = %.17g, A %.17g", s, i, j, p, src[6*i+j])
				}
			}
			for j := i + 1; j < 6; j++ {
				if above[6*i+j] != 0 {
					t.Errorf("s = %g: upper entry [%d,%d] = %g, want 0", s, i, j, above[6*i+j])
				}
			}
		}
	}
}

// TestSolvePSD3Cutoff: the eigenvalues of diag(4, 1, λ) are its entries
// (by hand), so with the cut-off tiny = 1e-9 a third eigenvalue λ = 0.5e-9
// is dropped, and one of 2e-9 kept: for b = (2, 3, 5) the solutions are
// (1/2, 3, 0) and (1/2, 3, 2.5e9). The fast path's test (determinant
// against tiny·T²/4) must send the first to the eigen-decomposition.
func TestSolvePSD3Cutoff(t *testing.T) {
	b := [3]float64{2, 3, 5}
	for _, tc := range []struct {
		lambda float64
		kept   int
		x      [3]float64
	}{
		{0.5e-9, 2, [3]float64{0.5, 3, 0}},
		{2e-9, 3, [3]float64{0.5, 3, 2.5e9}},
	} {
		x, kept := SolvePSD3([9]float64{4, 0, 0, 0, 1, 0, 0, 0, tc.lambda}, b, 1e-9)
		if kept != tc.kept {
			t.Errorf("λ = %g: kept %d directions, want %d", tc.lambda, kept, tc.kept)
		}
		for i := range x {
			if math.Abs(x[i]-tc.x[i]) > 1e-12*math.Max(1, math.Abs(tc.x[i])) {
				t.Errorf("λ = %g: x = %v, want %v", tc.lambda, x, tc.x)
				break
			}
		}
	}
}
