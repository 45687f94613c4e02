package kinematic

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Closure reports whether a contact set holds the moving body against
// every wrench, with no preload needed from outside: every external force
// and moment, of any size and direction, is balanced by compressive contact
// forces (within the friction pyramids, for [ForceClosure]).
//
// The test works on generators: the unit contact wrenches (n, p × n) for
// [FormClosure]; for [ForceClosure], those and the edges of each contact's
// friction pyramid. Each is expressed in the normalised coordinates of
// [screw.Analysis] (moment about the Centre of the contact lines, divided by
// their Length) and scaled to unit norm, so that the verdict and the margin
// depend on the shape of the design only: not on its units, its position or
// its orientation in the frame (but see [ForceClosure] on contacts given
// without a Tangent).
type Closure struct {
	// Closed reports whether every wrench is resisted.
	Closed bool

	// Margin, dimensionless in [0, 1], measures how evenly the generators
	// can share a self-balancing load: among all sets of generator loads
	// λᵢ ≥ 0 that balance one another (Σ λᵢŵᵢ = 0 for the N normalised
	// generators ŵᵢ) and have mean 1, the largest smallest load min λᵢ.
	// Equivalently Margin = N / min{Σλᵢ : Σλᵢŵᵢ = 0, λᵢ ≥ 1}, the optimum
	// of the linear program that decides closure. It is 1 when equal loads
	// balance (every generator has an exact opposite, for example), and it
	// falls to 0 as the set approaches the boundary of closure, where some
	// generator can no longer take any load. It is 0 when not Closed.
	//
	// Margin does not measure how well the generators span wrench space as
	// lines: a set close to losing a constraint can have a large Margin;
	// that is [screw.Analysis].Condition. The two together bound what the
	// contacts need to resist any load: a wrench of unit norm in
	// normalised coordinates is resisted with a total generator load of at
	// most (√N + N/Margin)/σ, where σ is the smallest singular value of the
	// normalised generators.
	Margin float64

	// Rank is the rank of the normalised generators, 0 to 6: closure needs
	// 6.
	Rank int
}

// ClosureOptions are the settings of [ForceClosure]; the zero value, or a
// nil pointer, means the defaults.
type ClosureOptions struct {
	// Sides is the number of sides of the pyramid inscribed in each
	// friction cone, from 3 to 256; 0 means 8.
	Sides int
}

// closureSides is the default number of sides of a friction pyramid. An
// octagon under-states μ by at most 1 − cos(π/8) ≈ 7.6 %, about the
// uncertainty of a friction coefficient itself (common practice), and
// keeps the linear program at 9 columns per contact (the normal and 8
// edges).
const closureSides = 8

// closureMaxSides bounds Sides: beyond 256 sides the pyramid under-states μ
// by less than 1 − cos(π/256) ≈ 8e-5, far below the accuracy of any
// friction coefficient, while the linear program keeps growing.
const closureMaxSides = 256

// closureMarginTol, times the condition number of the normalised
// generators, is the Margin at or below which a set is reported as not
// closed. The simplex of closureSimplex works to tolerances of 1e-12 to
// 1e-10 of its data (columns of unit norm), and rounding in the generators
// is amplified by their condition number; a smaller Margin cannot be told
// from the boundary of closure, where it is exactly 0, and the verdict is
// then the safe one. For a well-shaped coupling (condition below 10) the
// threshold is below 1e-11.
const closureMarginTol = 1e-12

// closureCheckTol is the relative residual and the relative negative load
// that a solution returned by the solver may have before it is rejected as
// inaccurate: a backward-stable solve of the 6×6 basis leaves residuals of
// a few ulps times the total load, so 1e-9 passes every honest solution and
// fails a broken one.
const closureCheckTol = 1e-9

// closureTangentTol is the smallest fraction of a contact's Tangent that
// must lie normal to its Normal: a Tangent within about 1e-6 rad of the
// Normal orients no pyramid that its numbers can be trusted for.
const closureTangentTol = 1e-6

// FormClosure reports whether the frictionless contacts cs hold the moving
// body against every wrench (first-order form closure). Margin and Rank are
// as documented on [Closure]; Margin is dimensionless.
//
// The contacts hold against every wrench exactly when their unit wrenches
// positively span the six-dimensional wrench space (Lynch & Park, Modern
// Robotics, 2017, §12.1.7; Mason, Mechanics of Robotic Manipulation, 2001,
// Theorem 5.5: positive span ⇔ the origin is inside the convex hull).
// FormClosure decides it as Lynch & Park do, by a linear program: the set is
// closed if and only if it has rank 6 and there are weights λᵢ ≥ 1 with
// Σ λᵢŵᵢ = 0. (If such λ exist, any wrench w = Σ μᵢŵᵢ is also Σ (μᵢ + sλᵢ)ŵᵢ,
// non-negative for s large; conversely, if the ŵᵢ positively span, −Σŵᵢ is a
// non-negative combination Σνᵢŵᵢ and λ = 1 + ν.) The program, minimise Σλᵢ
// subject to those constraints, is solved by a two-phase simplex method of
// this package, made safe against the degenerate programs of symmetric
// designs by perturbing the bounds (by 2e-10 at most) and by Bland's rule;
// gonum's lp.Simplex cycles for ever on some of them (see closureSimplex in
// the source) and serves as the reference in the tests. The optimum gives
// the Margin, to a relative 2e-10: a quantitative test in the manner of
// Trinkle (1992, "A quantitative test for form closure grasps", IEEE/RSJ
// IROS).
//
// At least seven contacts are needed: n+1 vectors, at least, positively
// span n dimensions (Lynch & Park §12.1.7). A kinematic coupling of six
// contacts is never form-closed; it needs a preload or friction
// ([ForceClosure]) to hold against a pull.
//
// FormClosure returns an [*InputError] as [Analyze] does: wrapping
// [ErrDegenerate] for fewer than two contacts or a zero normal,
// [ErrNonFinite] for a NaN or infinite point, normal or ball centre, and
// [ErrRange] for points too far from the origin for float64. If the solver
// fails numerically (on a set close to losing rank), the error, not an
// [*InputError], says so.
func FormClosure(cs []Contact) (Closure, error) {
	an, err := Analyze(cs)
	if err != nil {
		return Closure{}, err
	}
	cl := Closure{Rank: an.Rank}
	if an.Rank < 6 || !(an.Length > 0) {
		return cl, nil
	}
	a := make([]float64, 6*len(cs))
	for j, c := range cs {
		n, _ := linalg.Unit3(c.Normal) // Analyze accepted it
		closureColumn(a[6*j:6*j+6], c.Point, n, an.Centre, an.Length)
	}
	return closureSolve(a, an.Condition, cl)
}

// ForceClosure reports whether the contacts cs, with Coulomb friction of
// coefficient mu at every contact, hold the moving body against every
// wrench (force closure). Margin and Rank are as documented on [Closure],
// for the normals and the edges of the friction pyramids (k + 1 generators
// per contact); Margin is dimensionless.
//
// Each friction cone {f : |f − (f·n)n| ≤ μ f·n} is replaced by the pyramid
// inscribed in it with k = opt.Sides sides, whose edges are
// n + μ(cos φⱼ t₁ + sin φⱼ t₂), φⱼ = 2πj/k, with t₁ the part of the
// contact's Tangent normal to n and t₂ = n × t₁; the normal itself, inside
// the pyramid, is kept as a generator too. The contacts of a [Seat]
// carry a Tangent; for a contact given with Tangent zero, t₁ is n crossed
// with the coordinate axis least aligned with n, which does not turn with
// the design: turning such a set can move its verdict within the band
// cos(π/k) described below. The contacts are then closed when these
// generators positively span wrench space, decided as in [FormClosure]:
// force closure is the positive span of the wrenches of the friction cones
// (Murray, Li & Sastry, A Mathematical Introduction to Robotic
// Manipulation, 1994, ch. 5 §3; from memory), here of their pyramids.
// With mu = 0 the pyramids collapse to the normals and ForceClosure is
// FormClosure.
//
// The linearisation errs on the safe side, and by a known amount. A section
// of the pyramid at unit normal force is the regular k-gon inscribed in the
// circle of radius μ: along a vertex it reaches μ, halfway between two
// vertices only its inradius μ·cos(π/k). The pyramid therefore lies inside
// the cone of coefficient μ and contains the cone of coefficient μ·cos(π/k):
// in the worst direction it under-states μ by the factor cos(π/k) (0.924
// for k = 8, 0.981 for k = 16). A set closed with the pyramid is closed with
// the true cone; a set whose true-cone threshold is μ* is found closed with
// the pyramid for every μ > μ*/cos(π/k), and perhaps not below.
//
// ForceClosure returns an [*InputError] naming "mu" for a NaN or infinite
// mu ([ErrNonFinite]) or a negative one ([ErrRange]), "opt.Sides" for a
// number of sides outside 3 to 256 ([ErrRange]), "cs[i].Tangent" for a
// non-finite Tangent ([ErrNonFinite]) or one along the Normal
// ([ErrDegenerate]), and the errors of [FormClosure].
func ForceClosure(cs []Contact, mu float64, opt *ClosureOptions) (Closure, error) {
	if !linalg.Finite(mu) {
		return Closure{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: %g", ErrNonFinite, mu)}
	}
	if mu < 0 {
		return Closure{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: a friction coefficient must not be negative, got %g", ErrRange, mu)}
	}
	k := closureSides
	if opt != nil && opt.Sides != 0 {
		k = opt.Sides
		if k < 3 || k > closureMaxSides {
			return Closure{}, &InputError{Field: "opt.Sides", Err: fmt.Errorf("%w: a friction pyramid needs 3 to %d sides, got %d", ErrRange, closureMaxSides, k)}
		}
	}
	if mu == 0 {
		return FormClosure(cs)
	}
	an, err := Analyze(cs)
	if err != nil {
		return Closure{}, err
	}
	t1s := make([]r3.Vec, len(cs))
	for i, c := range cs {
		t, err := closureTangent(c, fmt.Sprintf("cs[%d].Tangent", i))
		if err != nil {
			return Closure{}, err
		}
		t1s[i] = t
	}
	pc, length := an.Centre, an.Length
	if !(length > 0) {
		// Every normal passes through Centre (one ball in a socket, say);
		// the edges do not. The RMS distance of the contact points from
		// Centre is then the design's own length.
		var s float64
		for _, c := range cs {
			s += r3.Norm2(r3.Sub(c.Point, pc))
		}
		length = math.Sqrt(s / float64(len(cs)))
		if !(length > 0) || math.IsInf(length, 0) {
			// All points at Centre: no edge has a moment, rank ≤ 3.
			length = 1
		}
	}
	// Each edge leans α = atan(μ) from its normal: cos α·n + sin α·t is
	// n + μt scaled to unit length, safe for any finite μ.
	sa, ca := math.Sincos(math.Atan(mu))
	// Generators: each contact's normal, then its k edges. The normal
	// lies inside the pyramid (the edges sum to k·cos α·n), so it changes
	// no verdict; it keeps the normal force one generator away when the
	// edges' moments dwarf it (a contact far from the others), so that
	// friction never loses, to rounding, what the normals hold.
	g := k + 1
	a := make([]float64, 6*g*len(cs))
	for i, c := range cs {
		n, _ := linalg.Unit3(c.Normal) // Analyze accepted it
		t1 := t1s[i]
		t2 := r3.Cross(n, t1)
		closureColumn(a[6*g*i:6*g*i+6], c.Point, n, pc, length)
		for j := range k {
			// Edge j of the inscribed pyramid: n + μ(cos φⱼ t₁ + sin φⱼ t₂).
			sp, cp := math.Sincos(2 * math.Pi * float64(j) / float64(k))
			f := r3.Add(r3.Scale(ca, n), r3.Scale(sa, r3.Add(r3.Scale(cp, t1), r3.Scale(sp, t2))))
			col := 6 * (i*g + 1 + j)
			closureColumn(a[col:col+6], c.Point, f, pc, length)
		}
	}
	rank, cond := closureRank(a)
	cl := Closure{Rank: rank}
	if rank < 6 {
		return cl, nil
	}
	return closureSolve(a, cond, cl)
}

// closureColumn writes into col the unit force along f through p in
// normalised coordinates: (f, (p − pc) × f / length), scaled to unit norm.
func closureColumn(col []float64, p, f, pc r3.Vec, length float64) {
	m := r3.Scale(1/length, r3.Cross(r3.Sub(p, pc), f))
	col[0], col[1], col[2], col[3], col[4], col[5] = f.X, f.Y, f.Z, m.X, m.Y, m.Z
	r := 1 / linalg.Norm(col) // ≥ |f| = 1
	for i := range col {
		col[i] *= r
	}
}

// closureTangent returns the unit first tangent t₁ of contact c's friction
// pyramid: the part of c.Tangent normal to c.Normal, or if Tangent is zero a
// direction fixed by the Normal alone.
func closureTangent(c Contact, field string) (r3.Vec, error) {
	n, _ := linalg.Unit3(c.Normal)
	if c.Tangent == (r3.Vec{}) {
		return linalg.AnyNormal(n), nil
	}
	t, ok := linalg.Unit3(c.Tangent)
	if !ok {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: %v", ErrNonFinite, c.Tangent)}
	}
	h := r3.Sub(t, r3.Scale(r3.Dot(t, n), n))
	l := linalg.Norm3(h)
	if l <= closureTangentTol {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: along the Normal; a tangent must have a part normal to it", ErrDegenerate)}
	}
	return r3.Scale(1/l, h), nil
}

// closureRank returns the rank and the condition number of the 6×N
// column-major matrix a of unit columns, with the rank threshold of package
// screw ([screw.RankTol] times the largest singular value), computed as
// screw.Analyze does: one-sided Jacobi, after a pivoted QR for N > 6.
func closureRank(a []float64) (rank int, cond float64) {
	n := len(a) / 6
	var u [36]float64
	var sigma [6]float64
	k := min(n, 6)
	if n <= 6 {
		copy(u[:], a)
	} else {
		work := make([]float64, 6*n) // Aᵀ, n×6 column-major
		for i := range n {
			for j := range 6 {
				work[j*n+i] = a[6*i+j]
			}
		}
		var perm [6]int
		linalg.QRPivot(work, n, &u, &perm) // the singular values of Rᵀ are A's
	}
	linalg.Jacobi6(&u, k)
	linalg.Sort6(&u, k, &sigma)
	for _, s := range sigma[:k] {
		if s > screw.RankTol*sigma[0] {
			rank++
		}
	}
	if rank == 0 {
		return 0, math.Inf(1)
	}
	return rank, sigma[0] / sigma[rank-1]
}

// closurePerturb is the size of the perturbation of the bounds in
// closureSolve. Symmetric designs make the closure program degenerate
// (zero basic variables at a vertex, many bases for one point), where a
// simplex pivot can gain nothing and a sequence of them can cycle for
// ever. Raising bound j to lⱼ = 1 + εⱼ, εⱼ in [1e-10, 2e-10) and all
// different, separates the bases of a degenerate vertex (the perturbation
// method of Charnes 1952, "Optimality and degeneracy in linear
// programming", Econometrica 20(2)) by far more than the rounding of the
// basic variables (a few ulps of N), so that pivots gain. The loads found
// still satisfy λ ≥ 1 and balance, and their total is within a factor
// 1 + 2e-10 of the optimum (the optimal λ of the unperturbed program,
// scaled by 1 + 2e-10, satisfies the raised bounds): the Margin is exact to
// a relative 2e-10.
const closurePerturb = 1e-10

// closureSolve decides closure of the 6×N column-major generators a, known
// to have rank 6 and condition number cond, and fills in cl.
//
// The closure program (Lynch & Park 2017, §12.1.7): minimise Σλⱼ subject to
// Σλⱼŵⱼ = 0, λⱼ ≥ 1, feasible exactly when the set is closed; with the
// bounds raised to lⱼ (closurePerturb), λ = l + x and b = −A·l, in standard
// form: minimise Σxⱼ subject to A·x = b, x ≥ 0, bounded below by 0.
func closureSolve(a []float64, cond float64, cl Closure) (Closure, error) {
	n := len(a) / 6
	l := make([]float64, n)
	var b [6]float64
	var sumL float64
	for j := range n {
		// εⱼ/closurePerturb = 1 + frac(j·φ), φ the golden section:
		// distinct and evenly spread for any n.
		_, f := math.Modf(float64(j) * 0.6180339887498949)
		l[j] = 1 + closurePerturb*(1+f)
		sumL += l[j]
		for r := range 6 {
			b[r] -= l[j] * a[6*j+r]
		}
	}
	x, feasible, err := closureSimplex(a, b)
	if err != nil {
		return Closure{}, fmt.Errorf("kinematic: closure: %w (a set of rank 6 and condition %.3g)", err, cond)
	}
	if !feasible {
		return cl, nil // no λ ≥ 1 balances: some wrench is not resisted
	}
	// Check the solution: λ = l + x must be at least 1 and balance.
	var total, big float64
	var res [6]float64
	for j, v := range x {
		lam := l[j] + v
		total += lam
		big = max(big, lam)
		for r := range 6 {
			res[r] += lam * a[6*j+r]
		}
	}
	for _, v := range x {
		if v < -closureCheckTol*big {
			return Closure{}, fmt.Errorf("kinematic: closure: the simplex returned a load below its bound by %g (condition %.3g)", -v, cond)
		}
	}
	if r := linalg.Norm(res[:]); !(r <= closureCheckTol*total) {
		return Closure{}, fmt.Errorf("kinematic: closure: the simplex returned loads that do not balance: residual %g of total %g (condition %.3g)", r, total, cond)
	}
	margin := min(float64(n)/total, 1)
	if margin > closureMarginTol*cond {
		cl.Closed, cl.Margin = true, margin
	}
	return cl, nil
}

// Tolerances of closureSimplex, for columns of unit norm and a right-hand
// side of norm at most N.
const (
	// closureCostTol, times 1 + |π|∞ (π the simplex multipliers), is the
	// reduced cost below which a column enters: reduced costs carry a few
	// ulps of that scale, so anything above −1e-11 of it is zero to
	// rounding.
	closureCostTol = 1e-11
	// closurePivotTol, times 1 + |B⁻¹aⱼ|∞, is the smallest entry of the
	// entering column that can be a pivot: smaller ones would leave the
	// next basis singular to working precision.
	closurePivotTol = 1e-9
	// closureFeasTol, times 1 + |b|∞, is how far below zero a basic
	// variable may go in the ratio test of Harris (1973, "Pivot selection
	// methods of the Devex LP code", Math. Program. 5), which in exchange
	// for it picks the largest pivot among the near-ties: a hundredth of
	// the perturbation of closurePerturb, and a hundred times the rounding
	// of the basic variables.
	closureFeasTol = 1e-12
	// closureInfeasTol, times 1 + |b|₁, is the phase-I optimum (the total
	// of the artificial variables) above which the program is infeasible.
	// A set feasible only within it has a margin far below
	// closureMarginTol and is reported not closed either way.
	closureInfeasTol = 1e-10
	// closureStall is the number of successive pivots that gain nothing
	// after which closureSimplex turns to Bland's rule until one gains.
	closureStall = 8
)

// closureSimplex solves minimise Σxⱼ subject to A·x = b, x ≥ 0, for the
// 6×N column-major a of rank 6 (columns of unit norm), by the two-phase
// revised simplex method (Dantzig; Chvátal, Linear Programming, 1983, ch.
// 7–8), and reports whether the program is feasible. The column with the
// most negative reduced cost enters; the ratio test is Harris's, which
// prefers large pivots; the 6×6 basis is factorised afresh at each pivot
// (partial pivoting), so rounding does not accumulate. closureSolve's
// perturbation makes every pivot gain on all but ill-conditioned sets; if
// closureStall pivots in a row gain nothing, the smallest-index rule of
// Bland (1977, "New finite pivoting rules for the simplex method", Math.
// Oper. Res. 2(2)), which cannot cycle, chooses until one does. An error
// means a numerical failure: a singular basis, or more pivots than any
// program of this size needs.
//
// gonum's lp.Simplex would do, but it cycles for ever on the degenerate
// programs that symmetric designs produce, in its phase I and in its main
// loop (its fallback rule follows a list that pivots permute, not Bland's
// order), it has no iteration limit, and its ratio test accepts pivots
// that leave the basis singular: fuzzing found all three, on a three-vee
// coupling with a hold-down pad and on friction pyramids. It stays the
// reference in the tests.
func closureSimplex(a []float64, b [6]float64) (x []float64, feasible bool, err error) {
	n := len(a) / 6
	// Rows with b < 0 are negated, so that the artificial variables
	// (columns n to n+5, the identity) start feasible at b.
	var sg, bs [6]float64
	var b1, binf float64
	for r := range 6 {
		sg[r] = 1
		if b[r] < 0 {
			sg[r] = -1
		}
		bs[r] = sg[r] * b[r]
		b1 += bs[r]
		binf = max(binf, bs[r])
	}
	feasTol := closureFeasTol * (1 + binf)
	col := func(j int, out *[6]float64) {
		if j >= n {
			*out = [6]float64{}
			out[j-n] = 1
			return
		}
		for r := range 6 {
			out[r] = sg[r] * a[6*j+r]
		}
	}
	basic := [6]int{n, n + 1, n + 2, n + 3, n + 4, n + 5}
	inBasis := make([]bool, n+6)
	for _, j := range basic {
		inBasis[j] = true
	}
	var lu [36]float64
	var perm [6]int
	var xb [6]float64
	factor := func() error {
		for k, j := range basic {
			var c [6]float64
			col(j, &c)
			copy(lu[6*k:6*k+6], c[:]) // column-major: column k is basic[k]
		}
		if !closureLU(&lu, &perm) {
			return errors.New("the simplex basis is singular to working precision")
		}
		xb = bs
		closureLUSolve(&lu, &perm, &xb)
		return nil
	}
	maxPivots := 50 * (n + 6)
	pivots, stalled := 0, 0
	// phase runs the simplex for the costs cost(j) over the columns with
	// allowed(j), from the current basis.
	phase := func(cost func(int) float64, allowed func(int) bool) error {
		for {
			if err := factor(); err != nil {
				return err
			}
			var pi [6]float64 // multipliers π = B⁻ᵀc_B
			for k, j := range basic {
				pi[k] = cost(j)
			}
			closureLUSolveT(&lu, &perm, &pi)
			scale := 1.0
			for _, v := range pi {
				scale = max(scale, 1+math.Abs(v))
			}
			bland := stalled >= closureStall
			enter, best := -1, -closureCostTol*scale
			var c [6]float64
			for j := 0; j < n+6; j++ {
				if inBasis[j] || !allowed(j) {
					continue
				}
				col(j, &c)
				r := cost(j) - (pi[0]*c[0] + pi[1]*c[1] + pi[2]*c[2] + pi[3]*c[3] + pi[4]*c[4] + pi[5]*c[5])
				if r < best {
					enter, best = j, r
					if bland {
						break // Bland: the first improving column
					}
				}
			}
			if enter < 0 {
				return nil
			}
			if pivots++; pivots > maxPivots {
				return fmt.Errorf("the simplex made %d pivots without ending", maxPivots)
			}
			var d [6]float64
			col(enter, &d)
			closureLUSolve(&lu, &perm, &d)
			var dmax float64
			for _, v := range d {
				dmax = max(dmax, math.Abs(v))
			}
			pivTol := closurePivotTol * (1 + dmax)
			// Harris, pass 1: the largest step that keeps every basic
			// variable above −feasTol.
			theta := math.Inf(1)
			for i := range 6 {
				if d[i] > pivTol {
					theta = min(theta, (max(xb[i], 0)+feasTol)/d[i])
				}
			}
			if math.IsInf(theta, 1) {
				return errors.New("the simplex found no pivot in the entering column")
			}
			// Pass 2: among the rows that bind within that step, the
			// largest pivot (or, under Bland's rule, the smallest index
			// among the rows that bind first).
			leave := -1
			if bland {
				first := math.Inf(1)
				for i := range 6 {
					if d[i] > pivTol {
						first = min(first, max(xb[i], 0)/d[i])
					}
				}
				for i := range 6 {
					if d[i] > pivTol && max(xb[i], 0)/d[i] <= first+feasTol/d[i] && (leave < 0 || basic[i] < basic[leave]) {
						leave = i
					}
				}
			} else {
				for i := range 6 {
					if d[i] > pivTol && max(xb[i], 0)/d[i] <= theta && (leave < 0 || d[i] > d[leave]) {
						leave = i
					}
				}
			}
			if step := max(xb[leave], 0) / d[leave]; step*(-best) <= closureCostTol*scale*feasTol {
				stalled++ // the pivot gains nothing
			} else {
				stalled = 0
			}
			inBasis[basic[leave]], inBasis[enter] = false, true
			basic[leave] = enter
		}
	}
	// Phase I: minimise the total of the artificial variables.
	if err := phase(func(j int) float64 {
		if j >= n {
			return 1
		}
		return 0
	}, func(int) bool { return true }); err != nil {
		return nil, false, err
	}
	var w float64
	for k, j := range basic {
		if j >= n {
			w += max(xb[k], 0)
		}
	}
	if w > closureInfeasTol*(1+b1) {
		return nil, false, nil
	}
	// Drive the artificial variables left in the basis (near zero) out of
	// it, each for the original column with the largest pivot in its row:
	// rank 6 guarantees one.
	for k := range basic {
		if basic[k] < n {
			continue
		}
		if err := factor(); err != nil {
			return nil, false, err
		}
		best, bestV := -1, 0.0
		var d [6]float64
		for j := range n {
			if inBasis[j] {
				continue
			}
			col(j, &d)
			closureLUSolve(&lu, &perm, &d)
			if v := math.Abs(d[k]); v > bestV {
				best, bestV = j, v
			}
		}
		if best < 0 || bestV <= closurePivotTol {
			return nil, false, errors.New("the simplex cannot leave phase I: the generators are of rank 6 only to rounding")
		}
		inBasis[basic[k]], inBasis[best] = false, true
		basic[k] = best
	}
	// Phase II: minimise Σx over the original columns.
	stalled = 0
	if err := phase(func(int) float64 { return 1 }, func(j int) bool { return j < n }); err != nil {
		return nil, false, err
	}
	if err := factor(); err != nil {
		return nil, false, err
	}
	x = make([]float64, n)
	for k, j := range basic {
		x[j] = xb[k]
	}
	return x, true, nil
}

// closureLU factorises the 6×6 column-major matrix m in place, P·M = L·U
// with partial pivoting (Golub & Van Loan, Matrix Computations, 4th ed.,
// 2013, Algorithm 3.4.1), and reports false if a pivot is at or below 1e-13
// times the largest entry of M: singular to working precision for columns
// of unit norm.
func closureLU(m *[36]float64, perm *[6]int) bool {
	var big float64
	for _, v := range m {
		big = max(big, math.Abs(v))
	}
	for i := range perm {
		perm[i] = i
	}
	at := func(r, c int) *float64 { return &m[6*c+r] }
	for k := range 6 {
		p := k
		for r := k + 1; r < 6; r++ {
			if math.Abs(*at(r, k)) > math.Abs(*at(p, k)) {
				p = r
			}
		}
		if !(math.Abs(*at(p, k)) > 1e-13*big) {
			return false
		}
		if p != k {
			perm[k], perm[p] = perm[p], perm[k]
			for c := range 6 {
				*at(k, c), *at(p, c) = *at(p, c), *at(k, c)
			}
		}
		piv := *at(k, k)
		for r := k + 1; r < 6; r++ {
			f := *at(r, k) / piv
			*at(r, k) = f
			for c := k + 1; c < 6; c++ {
				*at(r, c) -= f * *at(k, c)
			}
		}
	}
	return true
}

// closureLUSolve overwrites v with M⁻¹v for M factorised by closureLU.
func closureLUSolve(m *[36]float64, perm *[6]int, v *[6]float64) {
	var y [6]float64
	for r := range 6 {
		y[r] = v[perm[r]]
	}
	for r := range 6 {
		for c := range r {
			y[r] -= m[6*c+r] * y[c]
		}
	}
	for r := 5; r >= 0; r-- {
		for c := r + 1; c < 6; c++ {
			y[r] -= m[6*c+r] * y[c]
		}
		y[r] /= m[6*r+r]
	}
	*v = y
}

// closureLUSolveT overwrites v with M⁻ᵀv for M factorised by closureLU:
// Mᵀ = Uᵀ·Lᵀ·P.
func closureLUSolveT(m *[36]float64, perm *[6]int, v *[6]float64) {
	y := *v
	for r := range 6 { // Uᵀ is lower triangular
		for c := range r {
			y[r] -= m[6*r+c] * y[c]
		}
		y[r] /= m[6*r+r]
	}
	for r := 5; r >= 0; r-- { // Lᵀ is unit upper triangular
		for c := r + 1; c < 6; c++ {
			y[r] -= m[6*r+c] * y[c]
		}
	}
	var out [6]float64
	for r := range 6 {
		out[perm[r]] = y[r]
	}
	*v = out
}
