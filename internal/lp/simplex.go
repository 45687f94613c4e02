package lp

import (
	"fmt"
	"math"
)

// Tolerances of the simplex, for the scaled program of [scaling] (entries of
// A', b' and c' at most 1 in magnitude, each row and column with an entry of
// at least 1/2): every one is relative to the data's own scale.
const (
	// costTol, times 1 + |π|∞ (π the simplex multipliers), is the reduced
	// cost below which a column enters: reduced costs carry a few ulps of
	// that scale, so anything above −1e-11 of it is zero to rounding.
	costTol = 1e-11
	// pivotTol, times 1 + |B⁻¹aⱼ|∞, is the smallest entry of the entering
	// column that can be a pivot: smaller ones would leave the next basis
	// singular to working precision.
	pivotTol = 1e-9
	// feasTol, times 1 + |b'|∞, is how far below zero a basic variable may
	// go in the ratio test of Harris (1973, "Pivot selection methods of the
	// Devex LP code", Math. Program. 5), which in exchange for it picks the
	// largest pivot among the near-ties: a hundred times the rounding of
	// the basic variables of a well-conditioned basis.
	feasTol = 1e-12
	// infeasTol, times 1 + |b'|₁, is the phase-I optimum (the total of the
	// artificial variables) above which the program is infeasible.
	infeasTol = 1e-10
	// negTol is how far below zero a variable of the final basis may be:
	// Harris's ratio test leaves at most feasTol·(1 + |b'|∞), and driving an
	// artificial variable left at up to infeasTol out of the basis divides
	// it by its pivot; a thousand times feasTol passes every
	// well-conditioned basis, and a basis that leaves more is too
	// ill-conditioned to trust (ErrSingular).
	negTol = 1e-9
	// stallPivots is the number of successive pivots that gain nothing
	// after which the solver turns to Bland's rule until one gains.
	stallPivots = 8
)

// solver is the state of the two-phase revised simplex method (Dantzig;
// Chvátal, Linear Programming, 1983, ch. 7–8) on a scaled program. Columns
// n to n+m−1 are the artificial variables of phase I, the identity.
type solver struct {
	m, n      int
	a, b, c   []float64 // the scaled program: A' (m×n), b' ≥ 0, c'
	phase1    bool
	basic     []int  // basic[k]: the column in basis position k
	inBasis   []bool // by column, artificial ones included
	lu        []float64
	perm      []int
	xb, pi, d []float64 // basic variables, multipliers, entering column B⁻¹aⱼ
	col, work []float64
	feasTol   float64 // feasTol·(1 + |b'|∞)

	pivots, maxPivots, stalled int
}

// newSolver returns a solver of the scaled program sc, starting from the
// basis of the artificial variables (feasible at x = b' ≥ 0).
func newSolver(sc *scaling, m, n int) *solver {
	s := &solver{m: m, n: n, a: sc.a, b: sc.b, c: sc.c, inBasis: make([]bool, n+m)}
	is := make([]int, 2*m)
	s.basic, s.perm = is[:m], is[m:]
	f := make([]float64, m*m+5*m)
	s.lu, f = f[:m*m], f[m*m:]
	s.xb, s.pi, s.d, s.col, s.work = f[:m], f[m:2*m], f[2*m:3*m], f[3*m:4*m], f[4*m:]
	var bMax float64
	for k := range m {
		s.basic[k] = n + k
		s.inBasis[n+k] = true
		bMax = max(bMax, s.b[k])
	}
	s.feasTol = feasTol * (1 + bMax)
	return s
}

// column writes column j of [A' I] into out.
func (s *solver) column(j int, out []float64) {
	if j < s.n {
		copy(out, s.a[s.m*j:s.m*j+s.m])
		return
	}
	clear(out)
	out[j-s.n] = 1
}

// cost returns the cost of column j in the current phase: phase I
// minimises the total of the artificial variables, phase II cᵀx.
func (s *solver) cost(j int) float64 {
	if s.phase1 {
		if j >= s.n {
			return 1
		}
		return 0
	}
	return s.c[j]
}

// factor factorises the basis afresh (so that rounding does not accumulate
// from pivot to pivot) and computes the basic variables B⁻¹b'.
func (s *solver) factor() error {
	m := s.m
	for k, j := range s.basic {
		s.column(j, s.lu[m*k:m*k+m])
	}
	if !luFactor(s.lu, m, s.perm) {
		return ErrSingular
	}
	copy(s.xb, s.b)
	luSolve(s.lu, m, s.perm, s.xb, s.work)
	return nil
}

// multipliers computes π = B⁻ᵀc_B and returns the scale 1 + |π|∞ of the
// reduced costs.
func (s *solver) multipliers() float64 {
	for k, j := range s.basic {
		s.pi[k] = s.cost(j)
	}
	luSolveT(s.lu, s.m, s.perm, s.pi, s.work)
	scale := 1.0
	for _, v := range s.pi {
		scale = max(scale, 1+math.Abs(v))
	}
	return scale
}

// price returns the entering column and its reduced cost, or −1 if none
// has a reduced cost below −costTol·scale (the basis is optimal). The
// column with the most negative reduced cost enters (Dantzig's rule), or,
// under Bland's rule, the first one that improves (Bland 1977, "New finite
// pivoting rules for the simplex method", Math. Oper. Res. 2(2)).
func (s *solver) price(scale float64, bland bool) (enter int, best float64) {
	enter, best = -1, -costTol*scale
	for j := range s.n + s.m {
		if s.inBasis[j] || (j >= s.n && !s.phase1) {
			continue
		}
		s.column(j, s.col)
		r := s.cost(j)
		for i, v := range s.col {
			r -= s.pi[i] * v
		}
		if r < best {
			enter, best = j, r
			if bland {
				break
			}
		}
	}
	return enter, best
}

// ratio computes the entering column d = B⁻¹aⱼ and returns the basis
// position that leaves and the step the entering variable takes, or −1 if
// no entry of d can be a pivot (the column is a ray). The test is
// Harris's (1973, Math. Program. 5) in two passes: the largest step that
// keeps every basic variable above −feasTol, then among the rows that bind
// within it the largest pivot. Under Bland's rule, among the rows that bind
// first (to feasTol), the smallest column index leaves (Bland 1977).
func (s *solver) ratio(enter int, bland bool) (leave int, step float64) {
	s.column(enter, s.d)
	luSolve(s.lu, s.m, s.perm, s.d, s.work)
	var dmax float64
	for _, v := range s.d {
		dmax = max(dmax, math.Abs(v))
	}
	pivTol := pivotTol * (1 + dmax)
	theta, first := math.Inf(1), math.Inf(1)
	for i, v := range s.d {
		if v > pivTol {
			theta = min(theta, (max(s.xb[i], 0)+s.feasTol)/v)
			first = min(first, max(s.xb[i], 0)/v)
		}
	}
	if math.IsInf(theta, 1) {
		return -1, 0
	}
	leave = -1
	for i, v := range s.d {
		if !(v > pivTol) {
			continue
		}
		t := max(s.xb[i], 0) / v
		switch {
		case bland:
			if t <= first+s.feasTol/v && (leave < 0 || s.basic[i] < s.basic[leave]) {
				leave = i
			}
		case t <= theta && (leave < 0 || v > s.d[leave]):
			leave = i
		}
	}
	return leave, max(s.xb[leave], 0) / s.d[leave]
}

// run pivots from the current basis until no column enters, and reports
// whether it stopped on a ray instead (the phase's objective is
// unbounded below). After a pivot that gains nothing (a degenerate vertex),
// stallPivots in a row, Bland's rule chooses until one gains: it cannot
// cycle (Bland 1977), and Dantzig's rule, which can, resumes after.
func (s *solver) run() (unbounded bool, err error) {
	for {
		if err := s.factor(); err != nil {
			return false, err
		}
		scale := s.multipliers()
		bland := s.stalled >= stallPivots
		enter, best := s.price(scale, bland)
		if enter < 0 {
			return false, nil
		}
		if s.pivots++; s.pivots > s.maxPivots {
			return false, fmt.Errorf("%w: %d pivots", ErrIterationLimit, s.maxPivots)
		}
		leave, step := s.ratio(enter, bland)
		if leave < 0 {
			return true, nil
		}
		if step*(-best) <= costTol*scale*s.feasTol {
			s.stalled++ // the pivot gains nothing
		} else {
			s.stalled = 0
		}
		s.inBasis[s.basic[leave]], s.inBasis[enter] = false, true
		s.basic[leave] = enter
	}
}

// driveOut replaces the artificial variables left in the basis after a
// feasible phase I (at zero, to infeasTol) by original columns, each by the
// column with the largest pivot in its row. If a row has none, A has
// dependent rows (to working precision): ErrSingular.
func (s *solver) driveOut() error {
	for k := range s.basic {
		if s.basic[k] < s.n {
			continue
		}
		if err := s.factor(); err != nil {
			return err
		}
		best, bestV := -1, 0.0
		for j := range s.n {
			if s.inBasis[j] {
				continue
			}
			s.column(j, s.d)
			luSolve(s.lu, s.m, s.perm, s.d, s.work)
			if v := math.Abs(s.d[k]); v > bestV {
				best, bestV = j, v
			}
		}
		if best < 0 || bestV <= pivotTol {
			return fmt.Errorf("%w: A has dependent rows to working precision", ErrSingular)
		}
		s.inBasis[s.basic[k]], s.inBasis[best] = false, true
		s.basic[k] = best
	}
	return nil
}

// solve runs phase I, decides feasibility, drives the artificial variables
// out and runs phase II. On return s.xb and s.pi belong to the final basis
// (of phase I when Infeasible).
func (s *solver) solve() (Status, error) {
	s.phase1 = true
	unbounded, err := s.run()
	if err != nil {
		return 0, err
	}
	if unbounded { // phase I is bounded below by 0: only rounding gets here
		return 0, fmt.Errorf("%w: phase I found a ray", ErrSingular)
	}
	var w, b1 float64
	for k, j := range s.basic {
		if j >= s.n {
			w += max(s.xb[k], 0)
		}
		b1 += s.b[k]
	}
	if w > infeasTol*(1+b1) {
		return Infeasible, nil
	}
	if err := s.driveOut(); err != nil {
		return 0, err
	}
	s.phase1, s.stalled = false, 0
	if unbounded, err = s.run(); err != nil {
		return 0, err
	}
	if unbounded {
		return Unbounded, nil
	}
	for _, v := range s.xb {
		if v < -negTol*s.feasTol/feasTol { // −negTol·(1 + |b'|∞)
			return 0, fmt.Errorf("%w: the optimal basis leaves a variable at %g of the data's scale", ErrSingular, v)
		}
	}
	return Optimal, nil
}
