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

// expOf returns e with |v| in [2^(e−1), 2^e) for v ≠ 0, and ok false
// for v = 0.
func expOf(v float64) (e int, ok bool) {
	if v == 0 {
		return 0, false
	}
	_, e = math.Frexp(v)
	return e, true
}

// maxExp tracks the largest exponent of a set of numbers in integer
// arithmetic, so that no intermediate product can overflow or underflow.
type maxExp struct {
	e  int
	ok bool
}

// add includes v·2^k.
func (x *maxExp) add(v float64, k int) {
	if e, ok := expOf(v); ok && (!x.ok || e+k > x.e) {
		x.e, x.ok = e+k, true
	}
}

// shift returns the k that brings the largest number into [1/2, 1), 0 if
// all were zero.
func (x maxExp) shift() int {
	if !x.ok {
		return 0
	}
	return -x.e
}

// newScaling builds the scaled program of A (m×n column-major), b and c.
// The exponents are found in integer arithmetic and every scaled number is
// at most 1 in magnitude: nothing overflows, whatever the spread of the
// data (numbers far below the largest of their row or column may
// underflow, which only drops what is negligible there).
func newScaling(c, a, b []float64, m, n int) *scaling {
	// Two allocations: the floats, then the exponents.
	fs := make([]float64, m*n+2*m+n)
	is := make([]int, m+n)
	sc := &scaling{
		a: fs[:m*n], b: fs[m*n : m*n+m], c: fs[m*n+m : m*n+m+n], sign: fs[m*n+m+n:],
		rowExp: is[:m], colExp: is[m:],
	}
	var rowBuf [16]maxExp
	rows := rowBuf[:0]
	if m > len(rowBuf) {
		rows = make([]maxExp, m)
	}
	rows = rows[:m]
	for j := range n {
		for r, v := range a[m*j : m*j+m] {
			rows[r].add(v, 0)
		}
	}
	for r := range m {
		sc.rowExp[r] = rows[r].shift()
	}
	for j := range n {
		var col maxExp
		for r, v := range a[m*j : m*j+m] {
			col.add(v, sc.rowExp[r])
		}
		sc.colExp[j] = col.shift()
		for r, v := range a[m*j : m*j+m] {
			sc.a[m*j+r] = math.Ldexp(v, sc.rowExp[r]+sc.colExp[j])
		}
	}
	var bx maxExp
	for r, v := range b {
		bx.add(v, sc.rowExp[r])
	}
	sc.kb = bx.shift()
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
	var cx maxExp
	for j, v := range c {
		cx.add(v, sc.colExp[j])
	}
	sc.kc = cx.shift()
	for j, v := range c {
		sc.c[j] = math.Ldexp(v, sc.colExp[j]+sc.kc)
	}
	return sc
}

// unscale returns v·2^k and reports whether it is exact: false if it
// overflows, or underflows into the subnormal range and loses digits (a
// number that float64 cannot hold).
func unscale(v float64, k int) (float64, bool) {
	u := math.Ldexp(v, k)
	return u, !math.IsInf(u, 0) && math.Ldexp(u, -k) == v
}

// unscaleX returns the solution x of the caller's program from the basis of
// the solver s, and reports whether float64 holds it.
func (sc *scaling) unscaleX(s *solver) ([]float64, bool) {
	x := make([]float64, s.n)
	ok := true
	for k, j := range s.basic {
		if j < s.n {
			var exact bool
			x[j], exact = unscale(s.xb[k], sc.colExp[j]-sc.kb)
			ok = ok && exact
		}
	}
	return x, ok
}

// unscaleY returns the multipliers of the caller's program from those of
// the scaled program, yp, whose costs were scaled by 2^kc, and reports
// whether float64 holds them.
func (sc *scaling) unscaleY(yp []float64, kc int) ([]float64, bool) {
	y := make([]float64, len(yp))
	ok := true
	for r, v := range yp {
		var exact bool
		y[r], exact = unscale(sc.sign[r]*v, sc.rowExp[r]-kc)
		ok = ok && exact
	}
	return y, ok
}
