package lp

import (
	"math"
	"sync/atomic"
	"time"

	"gonum.org/v1/gonum/mat"
	glp "gonum.org/v1/gonum/optimize/convex/lp"
)

// checkTol is the tolerance of the checks of a solution, on the program
// scaled by the tests' own scales (scaledProgram): ten times the loosest
// tolerance of the solver (infeasTol, 1e-10, on its scaled program, which
// is within a factor 2 of this one per row and column), and far above the
// rounding of a backward-stable solve with m ≤ 20 (a small multiple of
// m·ε·|A||x|, Golub & Van Loan 2013, §3.3; that term is part of each
// bound below).
const checkTol = 1e-9

// scaledProgram is the program scaled by the tests' own factors, written
// apart from the solver's: each row of A by the power of two that brings
// its largest magnitude into [1/2, 1), then each column likewise; b and c
// by their largest magnitudes after that. The exponents are compared as
// integers (math.Frexp), so no factor overflows on data of any spread.
// x' = x·colS/bS and y' = y·rowS/cS are then the solution in units in
// which the data are near 1, where the documented tolerances apply.
type scaledProgram struct {
	m, n       int
	a, b, c    []float64
	rowK, colK []int // the exponents of rowS, colS
	bK, cK     int
}

// topExp returns the exponent k for which the largest |vᵢ|·2^(kᵢ) lies in
// [1/2, 1) scaled by 2^k; 0 if all vᵢ are 0.
func topExp(vs []float64, ks func(i int) int) int {
	best, any := 0, false
	for i, v := range vs {
		if v == 0 {
			continue
		}
		_, e := math.Frexp(v)
		if e += ks(i); !any || e > best {
			best, any = e, true
		}
	}
	return -best
}

func newScaledProgram(c, a, b []float64) *scaledProgram {
	m, n := len(b), len(c)
	p := &scaledProgram{m: m, n: n, a: make([]float64, m*n), b: make([]float64, m), c: make([]float64, n),
		rowK: make([]int, m), colK: make([]int, n)}
	row := make([]float64, n)
	for r := range m {
		for j := range n {
			row[j] = a[m*j+r]
		}
		p.rowK[r] = topExp(row, func(int) int { return 0 })
	}
	for j := range n {
		p.colK[j] = topExp(a[m*j:m*j+m], func(r int) int { return p.rowK[r] })
		for r := range m {
			p.a[m*j+r] = math.Ldexp(a[m*j+r], p.rowK[r]+p.colK[j])
		}
	}
	p.bK = topExp(b, func(r int) int { return p.rowK[r] })
	p.cK = topExp(c, func(j int) int { return p.colK[j] })
	for r := range m {
		p.b[r] = math.Ldexp(b[r], p.rowK[r]+p.bK)
	}
	for j := range n {
		p.c[j] = math.Ldexp(c[j], p.colK[j]+p.cK)
	}
	return p
}

func (p *scaledProgram) x(x []float64) []float64 {
	out := make([]float64, len(x))
	for j, v := range x {
		out[j] = math.Ldexp(v, p.bK-p.colK[j])
	}
	return out
}

func (p *scaledProgram) y(y []float64) []float64 {
	out := make([]float64, len(y))
	for r, v := range y {
		out[r] = math.Ldexp(v, p.cK-p.rowK[r])
	}
	return out
}

// farkas returns the certificate y in the scaled units of the rows,
// y·rowS, brought to a largest magnitude in [1/2, 1) (a certificate is
// one up to a positive factor); exponents in integer arithmetic, so that
// nothing overflows.
func (p *scaledProgram) farkas(y []float64) []float64 {
	k := topExp(y, func(r int) int { return -p.rowK[r] })
	out := make([]float64, len(y))
	for r, v := range y {
		out[r] = math.Ldexp(v, k-p.rowK[r])
	}
	return out
}

// primalViolation returns the largest violation of x ≥ 0 and A·x = b by
// the scaled solution xs: of x ≥ 0 relative to 1 + |b'|∞ (the documented
// bound), of each row relative to 1 + the magnitude of its terms.
func (p *scaledProgram) primalViolation(xs []float64) float64 {
	var worst, bMax float64
	for _, v := range p.b {
		bMax = max(bMax, math.Abs(v))
	}
	for _, v := range xs {
		worst = max(worst, -v/(1+bMax))
	}
	for r := range p.m {
		res, mag := -p.b[r], 0.0
		for j := range p.n {
			t := p.a[p.m*j+r] * xs[j]
			res += t
			mag += math.Abs(t)
		}
		worst = max(worst, math.Abs(res)/(1+mag))
	}
	return worst
}

// dualViolation returns the largest violation of Aᵀy ≤ c by the scaled
// multipliers ys (costs c, or 0 for a Farkas certificate), each relative
// to 1 + |y|∞ + the magnitude of the terms of its column (the solver
// prices to a tolerance relative to 1 + |π|∞).
func (p *scaledProgram) dualViolation(ys []float64, farkas bool) float64 {
	var worst, yMax float64
	for _, v := range ys {
		yMax = max(yMax, math.Abs(v))
	}
	for j := range p.n {
		var s, mag float64
		for r := range p.m {
			t := p.a[p.m*j+r] * ys[r]
			s += t
			mag += math.Abs(t)
		}
		cj := p.c[j]
		if farkas {
			cj = 0
		}
		worst = max(worst, (s-cj)/(1+yMax+mag))
	}
	return worst
}

// gap returns |cᵀx − bᵀy| of the scaled solution relative to 1 + the
// magnitude of the terms.
func (p *scaledProgram) gap(xs, ys []float64) float64 {
	var s, mag float64
	for j := range p.n {
		s += p.c[j] * xs[j]
		mag += math.Abs(p.c[j] * xs[j])
	}
	for r := range p.m {
		s -= p.b[r] * ys[r]
		mag += math.Abs(p.b[r] * ys[r])
	}
	return math.Abs(s) / (1 + mag)
}

// farkasMargin returns bᵀy for the scaled certificate ys (of farkas):
// positive for a valid certificate.
func (p *scaledProgram) farkasMargin(ys []float64) float64 {
	var s float64
	for r := range p.m {
		s += p.b[r] * ys[r]
	}
	return s
}

// gonumResult is what gonum's lp.Simplex, the reference library, said.
type gonumResult struct {
	done   bool // false: no answer within the timeout, or a panic
	status Status
	err    error // an error other than infeasible or unbounded
	opt    float64
	x      []float64
}

// gonumHung is set once gonum has not answered within its timeout: its
// goroutine cannot be stopped, so no further call is made in this process
// (at most one goroutine is left spinning).
var gonumHung atomic.Bool

// gonumSolve runs gonum's lp.Simplex (gonum v0.17.0) on the program, in a
// goroutine with a timeout, since it loops for ever on some degenerate
// programs and panics on others.
func gonumSolve(c, a, b []float64, timeout time.Duration) gonumResult {
	if gonumHung.Load() {
		return gonumResult{}
	}
	m, n := len(b), len(c)
	A := mat.NewDense(m, n, nil)
	for j := range n {
		for r := range m {
			A.Set(r, j, a[m*j+r])
		}
	}
	ch := make(chan gonumResult, 1)
	go func() {
		defer func() {
			if r := recover(); r != nil {
				ch <- gonumResult{}
			}
		}()
		opt, x, err := glp.Simplex(append([]float64(nil), c...), A, append([]float64(nil), b...), 1e-10, nil)
		switch err {
		case nil:
			ch <- gonumResult{done: true, status: Optimal, opt: opt, x: x}
		case glp.ErrInfeasible:
			ch <- gonumResult{done: true, status: Infeasible}
		case glp.ErrUnbounded:
			ch <- gonumResult{done: true, status: Unbounded}
		default:
			ch <- gonumResult{done: true, err: err}
		}
	}()
	select {
	case r := <-ch:
		return r
	case <-time.After(timeout):
		gonumHung.Store(true)
		return gonumResult{}
	}
}
