package lp

import (
	"errors"
	"fmt"
	"math"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

// Status is the outcome of a linear program that [Solve] finished.
type Status int

const (
	// Optimal means that X is an optimal vertex and Y optimal multipliers.
	Optimal Status = iota
	// Infeasible means that no x ≥ 0 satisfies A·x = b; Y is a Farkas
	// certificate.
	Infeasible
	// Unbounded means that the program is feasible and cᵀx has no lower
	// bound on it.
	Unbounded
)

// String returns the status's name.
func (s Status) String() string {
	switch s {
	case Optimal:
		return "optimal"
	case Infeasible:
		return "infeasible"
	case Unbounded:
		return "unbounded"
	}
	return fmt.Sprintf("Status(%d)", int(s))
}

// Options are the settings of [Solve]; the zero value, or a nil pointer,
// means the defaults.
type Options struct {
	// MaxPivots bounds the simplex pivots of both phases together; 0 means
	// 50·(m + n), far more than the programs of the module need (between
	// m and 3m pivots is what the simplex method typically makes; from
	// memory, common practice).
	MaxPivots int
}

// Result is what [Solve] found.
type Result struct {
	Status Status

	// X, of length n, is the optimal vertex when Status is Optimal, nil
	// otherwise.
	X []float64

	// Y, of length m, holds the simplex multipliers of the final basis B,
	// y = B⁻ᵀc_B, when Status is Optimal: an optimum of the dual program
	// (maximise bᵀy subject to Aᵀy ≤ c), with bᵀy = cᵀx (the duality
	// theorem; Chvátal 1983, ch. 5). When Status is Infeasible it is a
	// Farkas certificate from phase I: Aᵀy ≤ 0 and bᵀy > 0, which no
	// x ≥ 0 with A·x = b can meet. Nil when Unbounded.
	Y []float64

	// Value is cᵀx when Status is Optimal, 0 otherwise.
	Value float64

	// Pivots is the number of simplex pivots made, both phases.
	Pivots int
}

var (
	// ErrSingular reports a basis singular to working precision: A does not
	// have full row rank (or has it only to rounding) and the program is
	// feasible, rounding made a pivot vanish, or the optimal basis is too
	// ill-conditioned to keep x ≥ 0 to tolerance (see the package
	// documentation).
	ErrSingular = errors.New("lp: the simplex basis is singular to working precision")

	// ErrIterationLimit reports that the simplex made Options.MaxPivots
	// pivots without finishing.
	ErrIterationLimit = errors.New("lp: the simplex reached its iteration limit")
)

// Solve returns the solution of the linear program in standard form
//
//	minimise cᵀx subject to A·x = b, x ≥ 0,
//
// for the m×n matrix A stored column-major in a (column j in
// a[m·j : m·j+m]), m = len(b) and n = len(c). The contract (form,
// tolerances, what is returned when) is in the package documentation.
//
// Solve returns an error wrapping [errs.ErrDegenerate] if m or n is 0,
// [errs.ErrRange] if len(a) ≠ m·n or the solution is beyond the range of
// float64, [errs.ErrNonFinite] for a NaN or infinite entry, and
// [ErrSingular] or [ErrIterationLimit] when the simplex fails. The inputs
// are never modified.
func Solve(c, a, b []float64, opt *Options) (Result, error) {
	m, n := len(b), len(c)
	if err := validate(c, a, b); err != nil {
		return Result{}, err
	}
	sc := newScaling(c, a, b, m, n)
	s := newSolver(sc, m, n)
	s.maxPivots = 50 * (m + n)
	if opt != nil && opt.MaxPivots > 0 {
		s.maxPivots = opt.MaxPivots
	}
	st, err := s.solve()
	if err != nil {
		return Result{Pivots: s.pivots}, err
	}
	res := Result{Status: st, Pivots: s.pivots}
	okX, okY := true, true
	switch st {
	case Optimal:
		res.X, okX = sc.unscaleX(s)
		res.Y, okY = sc.unscaleY(s.pi, sc.kc)
		for j, v := range res.X {
			res.Value += c[j] * v
		}
	case Infeasible:
		res.Y, okY = sc.unscaleY(s.pi, 0)
	}
	if !okX || !okY || math.IsInf(res.Value, 0) || math.IsNaN(res.Value) {
		return Result{Pivots: s.pivots}, fmt.Errorf("lp: %w: the solution is beyond the range of float64", errs.ErrRange)
	}
	return res, nil
}

// validate checks the shapes and that every entry is finite.
func validate(c, a, b []float64) error {
	m, n := len(b), len(c)
	if m == 0 || n == 0 {
		return fmt.Errorf("lp: %w: a program needs a row and a column, got m = %d, n = %d", errs.ErrDegenerate, m, n)
	}
	if len(a) != m*n {
		return fmt.Errorf("lp: %w: len(a) = %d, want m·n = %d·%d", errs.ErrRange, len(a), m, n)
	}
	for _, in := range []struct {
		name string
		v    []float64
	}{{"c", c}, {"a", a}, {"b", b}} {
		for i, x := range in.v {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return fmt.Errorf("lp: %w: %s[%d] = %g", errs.ErrNonFinite, in.name, i, x)
			}
		}
	}
	return nil
}
