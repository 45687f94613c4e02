// Package lp solves small linear programs in standard form by the
// two-phase revised simplex method, made safe against degenerate programs:
// Harris's ratio test, Bland's rule when pivots stall, and an iteration
// limit. It serves kinematic's closure tests (6 rows, many columns) and its
// preload sizing (one row per preload element, solved as the dual of the
// sizing program).
//
// # Problem form
//
// [Solve] takes
//
//	minimise cᵀx subject to A·x = b, x ≥ 0,
//
// with A an m×n matrix stored column-major (column j in a[m·j : m·j+m]),
// m = len(b), n = len(c). A program in another form is brought to this one
// by the caller: an inequality A·x ≥ b by a surplus column −I, a bound
// x ≥ l by the substitution x = l + x', or, when there are many more
// inequalities than variables, by solving the dual program, whose optimal
// multipliers [Result].Y are then the primal solution (up to sign).
//
// The column with the most negative reduced cost on the scaled program
// enters (Dantzig's rule). Each pivot factorises the m×m basis afresh (LU
// with partial pivoting, Golub & Van Loan, Matrix Computations, 4th ed.,
// 2013, Algorithm 3.4.1): O(m³ + m·n) operations, and no rounding carried
// from pivot to pivot. It is meant for m up to a few dozen and any n. A
// feasible program needs A of full row rank m to working precision,
// otherwise Solve returns [ErrSingular].
//
// # What is returned when
//
//   - [Optimal]: X is an optimal vertex (at most m non-zero entries),
//     Value = cᵀx, Y the simplex multipliers: an optimal dual solution,
//     Aᵀy ≤ c and bᵀy = cᵀx, both to the tolerances below.
//   - [Infeasible]: X is nil; Y is a Farkas certificate, Aᵀy ≤ 0 and
//     bᵀy > 0 (to the tolerances), the proof that no x ≥ 0 meets A·x = b.
//     On an ill-conditioned basis at the boundary of feasibility the
//     rounding of y (ε times the basis's condition) can exceed bᵀy: the
//     verdict is then one the data cannot settle.
//   - [Unbounded]: the program is feasible and the objective decreases
//     without bound along a ray; X and Y are nil.
//   - An error for input that is not a program (a dimension of 0,
//     len(a) ≠ m·n, NaN or infinite entries), for a singular basis
//     ([ErrSingular]) or when the pivots reach Options.MaxPivots
//     ([ErrIterationLimit]). Solve never panics and never returns NaN.
//
// # Tolerances
//
// Every decision is taken on a scaled copy of the program: each row of A
// divided by a power of two that brings its largest entry into [1/2, 1),
// then each column likewise; b and c each brought to a largest entry in
// [1/2, 1) the same way. Powers of two round nothing, so the decisions do
// not depend on the units of the rows, b or c: rows, b or c multiplied by
// powers of two give exactly the same pivots and the solution scaled
// exactly. Columns multiplied by powers of two, or anything by other
// factors, give the same optimum to the tolerances below (a column's
// factor can change which entry is the largest of a row, and so the
// scaled program by powers of two). The tests check both. On the scaled
// program (values near 1):
//
//   - a reduced cost below −1e-11·(1 + |π|∞) improves (π the multipliers);
//   - an entry of B⁻¹aⱼ above 1e-9·(1 + |B⁻¹aⱼ|∞) may be a pivot;
//   - a basic variable may fall to −1e-12·(1 + |b'|∞) in the Harris ratio
//     test;
//   - the program is infeasible when the phase-I optimum (the total of the
//     artificial variables) exceeds 1e-10·(1 + |b'|₁);
//   - a pivot of the basis's LU at or below 1e-13 of its largest entry is
//     singular;
//   - an optimal X may have entries down to −1e-9·(1 + |b'|∞) (Harris's
//     −1e-12, plus what driving a near-zero artificial variable out of the
//     basis leaves); a basis that leaves more is reported as [ErrSingular].
//
// In the caller's units, therefore: X may have entries slightly below zero,
// by at most 1e-9 of the scale of x that b and the column set; A·x = b holds
// to a residual of a few ulps of |A|·|x| row by row (the LU solve is
// backward stable); the reduced costs c − Aᵀy are above −1e-11·(1 + |y|∞)
// in scaled units. Values far below the largest of their row or column
// (by 2^1000, say) may underflow in the scaling and count as zero. A
// solution that float64 cannot hold (an entry of X or Y that overflows or
// underflows) is an error wrapping [errs.ErrRange]. Callers that need a
// verdict to be exact check their own residual, as kinematic's closure
// does.
//
// # Degeneracy
//
// Degenerate programs (basic variables at zero, many bases for one vertex)
// are common in the symmetric designs of the module, and a simplex method
// may cycle on them for ever; gonum's lp.Simplex does, on programs that
// fuzzing found (see the tests). Here the Harris ratio test prefers large
// pivots among near-ties; after 8 pivots in a row that gain nothing the
// entering and leaving columns are chosen by Bland's smallest-index rule,
// which cannot cycle (Bland 1977), until a pivot gains; and the pivots are
// counted against a limit in any case. Callers can also perturb their
// program (kinematic's closure raises its bounds by distinct amounts of
// 1e-10, after Charnes 1952).
//
// # Conventions
//
// The inputs are never modified; the slices of a [Result] are new.
package lp
