package kinematic

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/internal/lp"
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
// closed. The simplex of internal/lp works to tolerances of 1e-12 to
// 1e-10 of its scaled data (here columns of unit norm), and rounding in
// the generators is amplified by their condition number; a smaller Margin
// cannot be told from the boundary of closure, where it is exactly 0, and
// the verdict is then the safe one. For a well-shaped coupling (condition
// below 10) the threshold is below 1e-11.
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
// subject to those constraints, is solved by the two-phase revised simplex
// method of the module (internal/lp), made safe against the degenerate
// programs of symmetric designs by perturbing the bounds (by 2e-10 at most)
// and by Bland's rule; gonum's lp.Simplex, tried first, cycled for ever on
// some of them and serves as the reference in the tests. The optimum gives
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
// mu ([ErrNonFinite]), a negative one or one above 3 ([ErrRange]; a
// percentage: 15% is 0.15), "opt.Sides" for a
// number of sides outside 3 to 256 ([ErrRange]), "cs[i].Tangent" for a
// non-finite Tangent ([ErrNonFinite]) or one along the Normal
// ([ErrDegenerate]), and the errors of [FormClosure].
func ForceClosure(cs []Contact, mu float64, opt *ClosureOptions) (Closure, error) {
	if err := checkMuLow(mu, true); err != nil {
		return Closure{}, err
	}
	if err := checkMu(mu); err != nil {
		return Closure{}, err
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
	a := forceGenerators(cs, t1s, an.Centre, an.Length, mu, k)
	rank, cond := closureRank(a)
	cl := Closure{Rank: rank}
	if rank < 6 {
		return cl, nil
	}
	return closureSolve(a, cond, cl)
}

// forceGenerators returns the 6×N column-major generators of ForceClosure
// (each contact's normal, then the k edges of its friction pyramid, in
// normalised coordinates about pc) for the contacts cs with first tangents
// t1s, friction coefficient mu > 0 and k sides; length is the Length of
// their analysis, 0 if every normal passes through pc.
func forceGenerators(cs []Contact, t1s []r3.Vec, pc r3.Vec, length, mu float64, k int) []float64 {
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
	return a
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

// closureBounds returns the raised bounds lⱼ = 1 + εⱼ of closureSolve
// (closurePerturb) for the 6×N generators a, and b = −A·l.
func closureBounds(a []float64) (l []float64, b [6]float64) {
	n := len(a) / 6
	l = make([]float64, n)
	for j := range n {
		// εⱼ/closurePerturb = 1 + frac(j·φ), φ the golden section:
		// distinct and evenly spread for any n.
		_, f := math.Modf(float64(j) * 0.6180339887498949)
		l[j] = 1 + closurePerturb*(1+f)
		for r := range 6 {
			b[r] -= l[j] * a[6*j+r]
		}
	}
	return l, b
}

// closureSolve decides closure of the 6×N column-major generators a, known
// to have rank 6 and condition number cond, and fills in cl.
//
// The closure program (Lynch & Park 2017, §12.1.7): minimise Σλⱼ subject to
// Σλⱼŵⱼ = 0, λⱼ ≥ 1, feasible exactly when the set is closed; with the
// bounds raised to lⱼ (closurePerturb), λ = l + x and b = −A·l, in standard
// form: minimise Σxⱼ subject to A·x = b, x ≥ 0, bounded below by 0,
// solved by lp.Solve. An error means a numerical failure of the solver (a
// singular basis, the iteration limit) or a solution that fails the check
// below.
func closureSolve(a []float64, cond float64, cl Closure) (Closure, error) {
	n := len(a) / 6
	l, b := closureBounds(a)
	ones := make([]float64, n)
	for j := range ones {
		ones[j] = 1
	}
	sol, err := lp.Solve(ones, a, b[:], nil)
	if err == nil && sol.Status == lp.Unbounded {
		// Σxⱼ ≥ 0 on x ≥ 0: only rounding can find a ray.
		err = errors.New("the simplex found a ray in a program bounded below")
	}
	if err != nil {
		return Closure{}, fmt.Errorf("kinematic: closure: %w (a set of rank 6 and condition %.3g)", err, cond)
	}
	if sol.Status == lp.Infeasible {
		return cl, nil // no λ ≥ 1 balances: some wrench is not resisted
	}
	x := sol.X
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
