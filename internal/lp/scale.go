package lp

import "math"

// scaling holds the scaled program the simplex works on and the exponents
// that map its solution back. Every factor is a power of two, applied with
// math.Ldexp, so scaling rounds nothing (unless an entry leaves the normal
// range) and a program whose rows, columns, b or c are multiplied by powers
// of two is solved by exactly the same pivots.
//
// With R = diag(2^rowExp), S = diag(2^colExp) and D the row signs:
// A' = D·R·A·S, b' = 2^kb·D·R·b ≥ 0, c' = 2^kc·S·c. Each row of R·A has
// its largest magnitude in [1/2, 1), then each column of R·A·S; b' and c'
// have their largest magnitude in [1/2, 1) (or are zero). A solution x' of
// the scaled program gives x = 2^(−kb)·S·x', and multipliers y' give
// y = 2^(−kc)·D·R·y'.
type scaling struct {
	a, b, c        []float64 // A', b', c'
	sign           []float64 // D
	rowExp, colExp []int
	kb, kc         int
}

// exponent returns k such that v·2^k has magnitude in [1/2, 1), or 0 for
// v = 0.
func exponent(v float64) int {
	if v == 0 {
		return 0
	}
	_, e := math.Frexp(v)
	return -e
}

// newScaling builds the scaled program of A (m×n column-major), b and c.
func newScaling(c, a, b []float64, m, n int) *scaling {
	sc := &scaling{
		a: make([]float64, m*n), b: make([]float64, m), c: make([]float64, n),
		sign: make([]float64, m), rowExp: make([]int, m), colExp: make([]int, n),
	}
	rowMax := make([]float64, m)
	for j := range n {
		for r, v := range a[m*j : m*j+m] {
			rowMax[r] = max(rowMax[r], math.Abs(v))
		}
	}
	for r := range m {
		sc.rowExp[r] = exponent(rowMax[r])
	}
	for j := range n {
		var big float64
		for r, v := range a[m*j : m*j+m] {
			big = max(big, math.Abs(math.Ldexp(v, sc.rowExp[r])))
		}
		sc.colExp[j] = exponent(big)
		for r, v := range a[m*j : m*j+m] {
			sc.a[m*j+r] = math.Ldexp(v, sc.rowExp[r]+sc.colExp[j])
		}
	}
	var bMax float64
	for r, v := range b {
		bMax = max(bMax, math.Abs(math.Ldexp(v, sc.rowExp[r])))
	}
	sc.kb = exponent(bMax)
	for r, v := range b {
		sc.sign[r] = 1
		if v < 0 {
			sc.sign[r] = -1
		}
		sc.b[r] = math.Abs(math.Ldexp(v, sc.rowExp[r]+sc.kb))
		if sc.sign[r] < 0 {
			for j := range n {
				sc.a[m*j+r] = -sc.a[m*j+r]
			}
		}
	}
	var cMax float64
	for j, v := range c {
		cMax = max(cMax, math.Abs(math.Ldexp(v, sc.colExp[j])))
	}
	sc.kc = exponent(cMax)
	for j, v := range c {
		sc.c[j] = math.Ldexp(v, sc.colExp[j]+sc.kc)
	}
	return sc
}

// unscaleX returns the solution x of the caller's program from the basis of
// the solver s.
func (sc *scaling) unscaleX(s *solver) []float64 {
	x := make([]float64, s.n)
	for k, j := range s.basic {
		if j < s.n {
			x[j] = math.Ldexp(s.xb[k], sc.colExp[j]-sc.kb)
		}
	}
	return x
}

// unscaleY returns the multipliers of the caller's program from those of
// the scaled program, yp, whose costs were scaled by 2^kc.
func (sc *scaling) unscaleY(yp []float64, kc int) []float64 {
	y := make([]float64, len(yp))
	for r, v := range yp {
		y[r] = sc.sign[r] * math.Ldexp(v, sc.rowExp[r]-kc)
	}
	return y
}
