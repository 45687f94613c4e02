package constraint

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// RankTol is the rank threshold of [Analyze] near the origin: a singular
// value at or below RankTol times the largest counts as zero.
//
// The singular values are those of the normalised constraint matrix, whose
// columns have unit norm, so the smallest one measures how far the set is
// from losing a constraint: a relative misalignment of the lines in
// radians, or a relative offset as a fraction of the characteristic
// length. The matrix is built from float64 input, with relative errors of
// a few ε ≈ 2.2e-16 per entry, and the decomposition adds a small multiple
// of ε: 1e-10 is far above anything that rounding alone produces near the
// origin. Far from it, where the moments carry rounding of ε times the
// distance, the threshold rises to the bound momentRounding·ε·far/length
// (see there). Above 1e-10, nothing is lost that matters: no part is made
// to better than 1e-7 of its size.
const RankTol = 1e-10

// NearSingularRatio is the ratio of the smallest retained singular value to
// the largest below which [Analyze] flags a set as near-singular.
//
// A set with a smaller ratio keeps its rank only if its geometry is known to
// better than 0.1 % of its characteristic length (10 µm on a 10 mm
// coupling), and it amplifies geometry errors into errors of the located
// body by more than a factor of 1000.
const NearSingularRatio = 1e-3

// translationTol decides which free twists are reported as pure
// translations: a free twist of unit norm in normalised coordinates whose
// rotation part is at most translationTol·Condition has its rotation set to
// zero. The computed free twists are accurate to a small multiple of
// ε·Condition (the angle between computed and exact null spaces is bounded
// by the rounding error over the gap σ_rank/σ_1; Wedin 1972, "Perturbation
// bounds in connection with singular value decomposition", BIT 12), so this
// removes rounding and nothing that the geometry holds: a rotation larger
// than that is kept, however small, and the twist is reported as a screw of
// large pitch. Far from the origin the rounding bound of the moments
// (momentRounding·ε·far/length), and when the rank decision dropped a
// singular value above rounding, droppedMargin times that value relative
// to the largest, take its place when they are larger.
const translationTol = 1e-12

// weightTol sets to zero the weights of a redundant combination (of the
// normalised wrenches) that are at most weightTol·Condition times its
// largest weight: at that level they are rounding (the basis is accurate to
// a small multiple of ε·Condition, as the free twists are), and the
// wrenches that take part in a redundancy can then be read off exactly.
// Far from the origin the rounding bound of the moments takes its place
// when it is larger, as for translationTol, and so does droppedMargin
// times the largest singular value the rank decision dropped.
const weightTol = 1e-12

// droppedMargin multiplies the largest singular value that the rank
// decision dropped (relative to the largest kept) in the cut-offs of
// translationTol and weightTol. The free space and the redundancies are
// those of the matrix without the dropped singular values, and a twist's
// rotation part at that level over the gap, or a weight at that level, is
// an artefact of dropping them: a translation that the dropped value tilts
// by 1e-11 rad would otherwise be reported as a screw whose axis lies 1e11
// times the set's size away, and a weight of 1e-10 on a force among
// couples 1e120 times larger would dominate its combination once
// converted to the wrenches as given. The level is droppedMargin·√n times
// the dropped value: a perturbation σ of the matrix moves the n unit
// columns' coordinates by up to √n·σ in all; 2 is a margin over that
// first-order bound.
const droppedMargin = 2

// maxCut bounds the cut-offs of translationTol and weightTol once
// multiplied by Condition: 1e-2, the largest that translationTol·Condition
// reaches when only rounding enters (Condition is at most 1/RankTol =
// 1e10). Beyond it the free space is not determined by the data, and the
// set is flagged near-singular; the cut-offs then remove no more than
// that.
const maxCut = 1e-2

// stackWrenches is the largest set analysed without allocating workspace.
const stackWrenches = 12

// Result is the constraint analysis of a set of n wrenches. Lengths are in
// metres; every other number is dimensionless or in the units of the
// twists (rad/s, m/s).
type Result struct {
	// Rank is the number of independent constraints, 1 to 6.
	Rank int

	// Singular holds in its first K = min(n, 6) entries the singular
	// values of the normalised constraint matrix, in descending order.
	// Their squares sum to n.
	Singular [6]float64
	K        int

	// Condition is Singular[0]/Singular[Rank−1], at least 1.
	Condition float64

	// NearSingular reports whether Singular[Rank−1] is below
	// NearSingularRatio·Singular[0].
	NearSingular bool

	// Free holds in its first 6 − Rank entries a basis of the twists
	// reciprocal to every wrench. Twists with a rotation come first,
	// scaled to |W| = 1 rad/s with orthogonal W; pure translations come
	// last, scaled to |V| = 1 m/s, and the translations are removed from
	// the twists with a rotation. Each twist's largest component of W (of
	// V for a translation) is positive.
	Free [6]Twist

	// Redundant is nil when Rank = n; otherwise it holds n − Rank
	// combinations of weights c, one per wrench, with Σ cᵢwᵢ = 0, in
	// reduced echelon form (each has a wrench of its own), each scaled to
	// a largest weight of +1, with rounding-level weights exactly 0.
	Redundant [][]float64

	// Centre is the reference point: the point nearest to all lines of
	// force in least squares.
	Centre r3.Vec

	// Length is the characteristic length: the RMS distance of the lines
	// of force from Centre. It is 0 when no wrench has a force, or when
	// the lines meet at Centre to within the rounding their moments carry
	// (32ε times their distance from the origin).
	Length float64

	// Freed is filled, and HasFreed true, when n = 6 and Rank = 6:
	// Power(Freed[i], ws[j]) = δᵢⱼ for the wrenches as given, the rows
	// of the inverse of the 6×6 matrix [ws]. HasFreed is false otherwise,
	// and when a twist would overflow (wrenches of magnitude near the
	// bottom of the float64 range).
	Freed    [6]Twist
	HasFreed bool
}

// workspace is the storage of a set of up to stackWrenches wrenches.
type workspace struct {
	a, work [6 * stackWrenches]float64
	pre     [stackWrenches]Wrench
	exps    [stackWrenches]int
	gain    [stackWrenches]float64
}

// Analyze writes the constraint analysis of the wrenches ws into r: the
// rank, the singular values of the normalised constraint matrix, the free
// twists, the redundant combinations and, for six independent wrenches,
// the freed twists. Only the lines (or, for couples, the directions)
// matter, not the magnitudes. It does not allocate for n ≤ 12 wrenches
// of rank n.
//
// A singular value counts as zero at or below tol times the largest, with
// tol = max(RankTol, 32ε·far/Length), far the largest distance of a line
// or of Centre from the origin: the second term bounds the rounding that
// moments taken about the origin carry (see momentRounding). Lines that
// meet at Centre to within 32ε·far are analysed as concurrent, with
// Length 0.
//
// Analyze returns an [*Error] wrapping errs.ErrDegenerate for an empty set or
// a zero wrench, errs.ErrNonFinite for a NaN or infinite component, and
// errs.ErrRange for magnitudes that float64 cannot analyse: two wrenches whose
// magnitudes differ by more than 1e150 times, a moment more than 1e100
// times its force, lines too far apart for their distances to be squared,
// and lines that do not meet in one point but lie within 7.1e-12 of their
// distance from the origin of one another (see farLimit), where the
// moments' rounding hides the rank, and redundant sets whose weights would
// span more than 2¹⁰⁰⁰ (couples whose moment over the characteristic
// length is that much larger than a force: Index names the couple). On
// error *r is the zero Result.
func Analyze(ws []Wrench, r *Result) error { return analyze(ws, r, true) }

// analyze is Analyze, with the freed twists only if withFreed (for the
// benchmarks, which measure what they cost).
func analyze(ws []Wrench, r *Result, withFreed bool) error {
	*r = Result{}
	n := len(ws)
	var st workspace
	var a, work, gain []float64
	var pre []Wrench
	var exps []int
	if n <= stackWrenches {
		a, work, gain = st.a[:6*n], st.work[:6*n], st.gain[:n]
		pre, exps = st.pre[:n], st.exps[:n]
	} else {
		buf := make([]float64, 13*n)
		a, work, gain = buf[:6*n], buf[6*n:12*n], buf[12*n:]
		pre, exps = make([]Wrench, n), make([]int, n)
	}
	fr, err := normalise(ws, pre, a, exps, gain)
	if err != nil {
		return err
	}

	// Singular values and left singular vectors.
	//
	// Six wrenches: one-sided Jacobi on Aᵀ first, Aᵀ·J = W with orthogonal
	// columns, so that A = J·Wᵀ: W's column norms are the singular values
	// (Hestenes 1958, applied to the transpose; the same accuracy, Demmel
	// & Veselić 1992), and W alone gives the freed twists (freedFromRows),
	// without J. The rows of a coupling's normalised matrix are far closer
	// to orthogonal than its columns: on the benchmark three-vee coupling
	// Jacobi on the rows ends after two sweeps, on the columns after five
	// (DEVELOPERS.md, "Performance as ratios"). With rank 6 that is all
	// the analysis needs. When the rank is below six the free twists and
	// the redundancies need the left singular vectors, and the
	// factorisation is taken again on the columns (below), where they are
	// the columns A·V/σ, in the range of A to rounding relative to σ: a
	// second decomposition, only for sets that lose a constraint.
	//
	// Fewer: one-sided Jacobi on A. More than six: Jacobi on Rᵀ from the
	// pivoted QR factorisation AᵀΠ = QR, which has the same singular values
	// and, permuted, the same left singular vectors in six columns instead
	// of n.
	var u, w [36]float64
	var sigma, wsigma [6]float64
	k := min(n, 6)
	tol := max(RankTol, fr.noise)
	rows := false // rank 6 decided on the rows: u is not needed
	if n == 6 {
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				w[6*j+i] = a[6*i+j]
			}
		}
		linalg.Jacobi6(&w, 6)
		linalg.Sort6(&w, 6, &wsigma)
		sigma = wsigma
		rows = wsigma[5] > tol*wsigma[0]
	}
	if !rows {
		if n <= 6 {
			copy(u[:], a)
		} else {
			for i := 0; i < n; i++ {
				for j := 0; j < 6; j++ {
					work[j*n+i] = a[6*i+j]
				}
			}
			var rt [36]float64
			var perm [6]int
			linalg.QRPivot(work, n, &rt, &perm)
			for j := 0; j < 6; j++ {
				for c := 0; c < 6; c++ {
					u[6*j+perm[c]] = rt[6*j+c]
				}
			}
		}
		linalg.Jacobi6(&u, k)
		linalg.Sort6(&u, k, &sigma)
	}

	rank := 0
	for _, s := range sigma[:k] {
		if s > tol*sigma[0] {
			rank++
		}
	}
	for j := 0; j < rank && !rows; j++ {
		uj := u[6*j : 6*j+6]
		s := 1 / sigma[j]
		for i := range uj {
			uj[i] *= s
		}
	}
	r.Rank, r.K, r.Singular = rank, k, sigma
	r.Condition = sigma[0] / sigma[rank-1]
	r.NearSingular = sigma[rank-1] < NearSingularRatio*sigma[0]
	r.Centre = r3.Scale(fr.unit, fr.c)
	r.Length = fr.length * fr.unit
	// What the free twists and the redundancies are accurate to, beyond
	// ε's rounding: the moments' rounding bound, and the singular values
	// that the rank decision dropped (the free space and the redundancies
	// are those of the matrix without them).
	var dropped float64
	if rank < k {
		dropped = droppedMargin * math.Sqrt(float64(n)) * sigma[rank] / sigma[0]
	}
	// Both are as accurate as the perturbation over the gap σ_rank/σ₁
	// (Wedin 1972), hence the factor Condition.
	cut := min(max(translationTol, fr.noise, dropped)*r.Condition, maxCut)
	if rank < 6 {
		// The free twists span the complement of the retained left
		// singular vectors.
		linalg.Complete(u[:], 6, rank)
		freeTwists(&u, rank, &fr, cut, &r.Free)
	}
	if rank < n {
		if err := weightRange(ws, exps, gain, fr.unit*fr.used); err != nil {
			*r = Result{}
			return err
		}
		wcut := min(max(weightTol, fr.noise, dropped)*r.Condition, maxCut)
		r.Redundant = redundancies(a, n, &u, rank, sigma[rank-1], exps, gain, wcut, work)
	}
	if n == 6 && rank == 6 && withFreed {
		r.HasFreed = freedFromRows(a, &w, &wsigma, &fr, exps, gain, &r.Freed)
	}
	return nil
}
