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

// scaledProgram is the program divided by the tests' own scales, written
// apart from the solver's: each row of A by its largest magnitude, then
// each column likewise; b and c by their largest magnitudes after that.
// x' = x·colS/bS and y' = y·rowS/cS are then the solution in units in
// which the data are near 1, where the solver's tolerances apply.
type scaledProgram struct {
	m, n       int
	a, b, c    []float64
	rowS, colS []float64
	bS, cS     float64
}

func nonzero(v float64) float64 {
	if v == 0 {
		return 1
	}
	return v
}

func newScaledProgram(c, a, b []float64) *scaledProgram {
	m, n := len(b), len(c)
	p := &scaledProgram{m: m, n: n, a: make([]float64, m*n), b: make([]float64, m), c: make([]float64, n),
		rowS: make([]float64, m), colS: make([]float64, n)}
	for j := range n {
		for r := range m {
			p.rowS[r] = max(p.rowS[r], math.Abs(a[m*j+r]))
		}
	}
	for r := range m {
		p.rowS[r] = nonzero(p.rowS[r])
	}
	for j := range n {
		for r := range m {
			p.colS[j] = max(p.colS[j], math.Abs(a[m*j+r])/p.rowS[r])
		}
		p.colS[j] = nonzero(p.colS[j])
		for r := range m {
			p.a[m*j+r] = a[m*j+r] / p.rowS[r] / p.colS[j]
		}
	}
	for r := range m {
		p.bS = max(p.bS, math.Abs(b[r])/p.rowS[r])
	}
	p.bS = nonzero(p.bS)
	for j := range n {
		p.cS = max(p.cS, math.Abs(c[j])/p.colS[j])
	}
	p.cS = nonzero(p.cS)
	for r := range m {
		p.b[r] = b[r] / p.rowS[r] / p.bS
	}
	for j := range n {
		p.c[j] = c[j] / p.colS[j] / p.cS
	}
	return p
}

func (p *scaledProgram) x(x []float64) []float64 {
	out := make([]float64, len(x))
	for j, v := range x {
		out[j] = v * p.colS[j] / p.bS
	}
	return out
}

func (p *scaledProgram) y(y []float64) []float64 {
	out := make([]float64, len(y))
	for r, v := range y {
		out[r] = v * p.rowS[r] / p.cS
	}
	return out
}

// primalViolation returns the largest violation of x ≥ 0 and A·x = b by
// the scaled solution xs, each relative to 1 + the magnitude of the terms
// of its row.
func (p *scaledProgram) primalViolation(xs []float64) float64 {
	var worst float64
	for _, v := range xs {
		worst = max(worst, -v)
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
// to 1 + the magnitude of the terms of its column.
func (p *scaledProgram) dualViolation(ys []float64, farkas bool) float64 {
	var worst float64
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
		worst = max(worst, (s-cj)/(1+mag))
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

// farkasMargin returns bᵀy for the scaled certificate ys divided by its
// largest magnitude: positive for a valid certificate.
func (p *scaledProgram) farkasMargin(ys []float64) float64 {
	var big, s float64
	for _, v := range ys {
		big = max(big, math.Abs(v))
	}
	if big == 0 {
		return 0
	}
	for r := range p.m {
		s += p.b[r] * ys[r] / big
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
