package screw

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// RankTol is the rank threshold of [Analyze]: a singular value at or below
// RankTol times the largest counts as zero.
//
// The singular values are those of the normalised constraint matrix, whose
// columns have unit norm, so the smallest one measures how far the set is
// from losing a constraint: a relative misalignment of the lines in radians,
// or a relative offset as a fraction of the characteristic length. Input in
// float64 carries relative errors of about 1e-16, amplified by the shift of
// moments to the reference point (at most 1/lengthFloor = 1e5) and by the
// decomposition (a small multiple of ε): below 1e-10 nothing is left that
// arithmetic can tell from zero. Above it, nothing is lost that matters: no
// part is made to better than 1e-7 of its size.
const RankTol = 1e-10

// NearSingularRatio is the ratio of the smallest retained singular value to
// the largest below which [Analyze] flags a set as near-singular.
//
// A set with a smaller ratio keeps its rank only if its geometry is known to
// better than 0.1 % of its characteristic length (10 µm on a 10 mm
// coupling), and it amplifies geometry errors into errors of the located
// body by more than a factor of 1000.
const NearSingularRatio = 1e-3

// lengthFloor bounds the characteristic length from below, as a fraction of
// the distance of the lines from the origin. Moments about the reference
// point carry rounding errors of about ε times that distance; dividing them
// by a length no smaller than lengthFloor times it keeps the error in the
// normalised matrix below ε/lengthFloor ≈ 2e-11, under RankTol. The floor acts
// only on sets whose lines nearly meet in one point far from the origin.
const lengthFloor = 1e-5

// translationTol decides which free twists are reported as pure
// translations: a free twist of unit norm in normalised coordinates whose
// rotation part is at most translationTol·Condition has its rotation set to
// zero. The computed free twists are accurate to a small multiple of
// ε·Condition (the angle between computed and exact null spaces is bounded
// by the rounding error over the gap σ_rank/σ_1; Wedin 1972, "Perturbation
// bounds in connection with singular value decomposition", BIT 12), so this
// removes rounding and nothing that the geometry holds: a rotation larger
// than that is kept, however small, and the twist is reported as a screw of
// large pitch.
const translationTol = 1e-12

// weightTol sets to zero the weights of a redundant combination (of the
// normalised wrenches) that are at most weightTol·Condition times its
// largest weight: at that level they are rounding (the basis is accurate to
// a small multiple of ε·Condition, as the free twists are), and the
// wrenches that take part in a redundancy can then be read off exactly.
const weightTol = 1e-12

// centreTol is the smallest eigenvalue, relative to the number of lines,
// that the least-squares reference point uses. Lines whose directions all lie
// within about √centreTol ≈ 3e-5 rad of one direction are treated as
// parallel, and the reference point moves along that direction to the
// nearest point to the origin, which changes no moment about it.
const centreTol = 1e-9

// Analysis is the constraint analysis of a set of wrenches.
type Analysis struct {
	// Rank is the number of independent constraints, 0 to 6.
	Rank int

	// Singular holds the min(6, len(ws)) singular values of the normalised
	// constraint matrix, dimensionless, in descending order. Their squares
	// sum to len(ws).
	Singular []float64

	// Condition is the ratio of the largest singular value to the smallest
	// retained one (index Rank−1), at least 1.
	Condition float64

	// NearSingular reports whether the smallest retained singular value is
	// below NearSingularRatio times the largest: the set is exactly
	// constrained in arithmetic, but barely.
	NearSingular bool

	// Free is a basis of the twists reciprocal to every wrench: 6 − Rank
	// twists, each free to first order. Twists with a rotation come first,
	// scaled to |W| = 1 rad/s with orthogonal W; pure translations come last,
	// scaled to |V| = 1 m/s, and the translations are removed from the
	// twists with a rotation. Each twist's largest component of W (of V for
	// a translation) is positive.
	Free []Twist

	// Redundant is a basis of the redundant combinations: len(ws) − Rank
	// vectors of weights c, one per wrench, with Σ cᵢwᵢ = 0. The basis is in
	// reduced echelon form, so each combination has a wrench of its own;
	// each is scaled so that its largest weight is +1. Weights at rounding
	// level (see weightTol) are exactly zero.
	Redundant [][]float64

	// Centre is the reference point in metres: the point nearest to all
	// lines of force in least squares.
	Centre r3.Vec

	// Length is the characteristic length in metres by which moments about
	// Centre were divided: the RMS distance of the lines of force from
	// Centre. It is zero when no wrench has a force, or when every line
	// passes through Centre to rounding (within 1e-5 of the distance of the
	// lines from the origin); no length enters the rank then.
	Length float64
}

// minForce is the smallest |F| that Analyze accepts for a wrench scaled to a
// largest component of 1: a line more than 1/minForce = 1e100 (in the units
// of the moment arm) from the origin is out of range of the arithmetic that
// follows, which squares distances.
const minForce = 1e-100

// maxSpread is the largest ratio between the magnitudes (largest
// components) of two wrenches that Analyze accepts. The weights of a
// redundant combination scale inversely with the magnitudes, and beyond
// this spread they would leave the float64 range.
const maxSpread = 1e150

// minUnit is the smallest length unit, in metres, in which Analyze
// expresses moments. Lines closer than about minUnit² = 1e-300 m to the
// origin pass through it, as far as arithmetic can tell.
const minUnit = 1e-150

// stackWrenches is the largest set analysed without allocating workspace.
const stackWrenches = 12

// Analyze returns the constraint analysis of the wrenches ws.
// Each wrench stands for a constraint along its line (or, for a pure
// moment, about its direction); its magnitude does not matter.
//
// Analyze returns an [*InputError] wrapping [ErrEmpty] if ws is empty,
// [ErrNonFinite] if a component is NaN or infinite, [ErrZero] if a wrench is
// zero, and [ErrRange] if the magnitudes are too far apart for float64: two
// wrenches whose magnitudes differ by more than 1e150 times, a wrench whose
// moment exceeds 1e100 times its force (a line farther than 1e100 m from the
// origin), or lines too far apart for their distances to be squared.
func Analyze(ws []Wrench) (Analysis, error) {
	n := len(ws)
	if n == 0 {
		return Analysis{}, &InputError{Field: "ws", Err: fmt.Errorf("%w: no wrenches to analyse", ErrEmpty)}
	}
	for i, w := range ws {
		if !linalg.Finite3(w.F) {
			return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d].F", i), Err: fmt.Errorf("%w: %v", ErrNonFinite, w.F)}
		}
		if !linalg.Finite3(w.M) {
			return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d].M", i), Err: fmt.Errorf("%w: %v", ErrNonFinite, w.M)}
		}
		if w == (Wrench{}) {
			return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d]", i), Err: fmt.Errorf("%w: a zero wrench constrains nothing", ErrZero)}
		}
	}

	// Workspace: A, a working copy of it, the n×n basis of the weight
	// space, the scale of each wrench, and the wrenches scaled to a largest
	// component of 1 (only their lines matter; this keeps every product in
	// range).
	var stack [2*stackWrenches*6 + stackWrenches*stackWrenches + 2*stackWrenches]float64
	var preStack [stackWrenches]Wrench
	var buf []float64
	var pre []Wrench
	if size := 2*n*6 + n*n + 2*n; size <= len(stack) {
		buf, pre = stack[:size], preStack[:n]
	} else {
		buf, pre = make([]float64, size), make([]Wrench, n)
	}
	a, work := buf[:6*n], buf[6*n:12*n]
	q, scale, gain := buf[12*n:12*n+n*n], buf[12*n+n*n:12*n+n*n+n], buf[12*n+n*n+n:]
	lo, hi := 0, 0
	for i, w := range ws {
		scale[i] = maxAbs(w)
		if scale[i] < scale[lo] {
			lo = i
		}
		if scale[i] > scale[hi] {
			hi = i
		}
	}
	if scale[hi] > maxSpread*scale[lo] {
		return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d]", hi), Err: fmt.Errorf(
			"%w: magnitude %g is more than %g times that of ws[%d] (%g); only the lines matter, so scale the wrenches",
			ErrRange, scale[hi], maxSpread, lo, scale[lo])}
	}
	for i, w := range ws {
		pre[i] = w.Scale(1 / scale[i])
		if f := pre[i].F; f != (r3.Vec{}) && r3.Norm2(f) < minForce*minForce {
			return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d]", i), Err: fmt.Errorf(
				"%w: moment more than %g times the force: the line is too far from the origin (a couple has F = 0)", ErrRange, 1/minForce)}
		}
	}

	// Lengths in units of the farthest line's distance from the origin
	// (but no smaller than minUnit), so that squared distances neither
	// overflow nor underflow at any scale. A twist (W, V) becomes
	// (W, V/unit) and a line's wrench (F, M) becomes (F, M/unit). Couples
	// (F = 0) keep their moment: only its direction enters the analysis.
	unit := minUnit
	for _, w := range pre {
		if f := linalg.Norm3(w.F); f > 0 {
			unit = math.Max(unit, linalg.Norm3(w.M)/f)
		}
	}
	for i := range pre {
		if pre[i].F != (r3.Vec{}) {
			pre[i].M = r3.Scale(1/unit, pre[i].M)
		}
	}

	c, length, used, err := reference(pre)
	if err != nil {
		return Analysis{}, err
	}

	// Normalised constraint matrix A, 6×n column-major: column i is wrench i
	// with its moment about c divided by the characteristic length, scaled
	// to unit norm.
	// Column i is wrench i mapped to (F, (M − c×F)/used), divided by
	// scale[i]·gain[i]; the factors are kept apart so that neither
	// overflows.
	for i, w := range pre {
		col := a[6*i : 6*i+6]
		if w.F == (r3.Vec{}) {
			// A couple: (0, M/(unit·used)), whose direction is M's.
			norm := linalg.Norm3(w.M)
			m := r3.Scale(1/norm, w.M)
			col[0], col[1], col[2], col[3], col[4], col[5] = 0, 0, 0, m.X, m.Y, m.Z
			gain[i] = norm / (unit * used)
			continue
		}
		m := r3.Scale(1/used, r3.Sub(w.M, r3.Cross(c, w.F)))
		col[0], col[1], col[2], col[3], col[4], col[5] = w.F.X, w.F.Y, w.F.Z, m.X, m.Y, m.Z
		norm := linalg.Norm(col)
		if math.IsInf(norm, 0) || math.IsNaN(norm) {
			return Analysis{}, &InputError{Field: fmt.Sprintf("ws[%d]", i), Err: fmt.Errorf("%w: cannot normalise the wrench", ErrRange)}
		}
		r := 1 / norm
		for j := range col {
			col[j] *= r
		}
		gain[i] = norm
	}

	// Singular values and left singular vectors: one-sided Jacobi on A, or
	// with more than six wrenches on Rᵀ from the pivoted QR factorisation
	// AᵀΠ = QR, which has the same singular values and, permuted, the same
	// left singular vectors in six columns instead of n.
	var u [36]float64
	var sigma [6]float64
	k := min(n, 6)
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

	rank := 0
	for _, s := range sigma[:k] {
		if s > RankTol*sigma[0] {
			rank++
		}
	}
	for j := 0; j < rank; j++ {
		uj := u[6*j : 6*j+6]
		r := 1 / sigma[j]
		for i := range uj {
			uj[i] *= r
		}
	}
	an := Analysis{
		Rank:         rank,
		Singular:     append([]float64(nil), sigma[:k]...),
		Condition:    sigma[0] / sigma[rank-1],
		NearSingular: sigma[rank-1] < NearSingularRatio*sigma[0],
		Centre:       r3.Scale(unit, c),
		Length:       length * unit,
	}
	if rank < 6 {
		// The free twists span the complement of the retained left
		// singular vectors.
		linalg.Complete(u[:], 6, rank)
		an.Free = freeTwists(u[:], rank, c, used, unit, translationTol*an.Condition)
	}
	if rank < n {
		// The right singular vectors of the retained values, vⱼ = Aᵀuⱼ/σⱼ,
		// completed to a basis of the weight space: the completion spans
		// the redundancies.
		for j := 0; j < rank; j++ {
			uj := u[6*j : 6*j+6]
			qj := q[j*n : j*n+n]
			for i := range qj {
				qj[i] = linalg.Dot(a[6*i:6*i+6], uj) / sigma[j]
			}
		}
		linalg.Complete(q, n, rank)
		an.Redundant = redundancies(q[rank*n:], n-rank, n, scale, gain, weightTol*an.Condition)
	}
	return an, nil
}

// reference returns the reference point, the characteristic length (zero if
// the lines all meet at the reference point) and the length to divide
// moments by (never zero). The wrenches ws are scaled to a largest
// component of 1.
func reference(ws []Wrench) (c r3.Vec, length, used float64, err error) {
	// Least-squares point nearest to all lines: Σ(I − dᵢdᵢᵀ) c = Σ pᵢ, with
	// dᵢ the unit direction and pᵢ the point of line i nearest the origin.
	var s [9]float64
	var b r3.Vec
	var far float64 // largest squared distance of a line from the origin
	nf := 0
	for _, w := range ws {
		f, m := w.F, w.M
		f2 := r3.Norm2(f)
		if f2 == 0 {
			continue
		}
		p := r3.Scale(1/f2, r3.Cross(f, m)) // |p| ≤ 1/minForce
		d := r3.Scale(1/math.Sqrt(f2), f)
		dd := [3]float64{d.X, d.Y, d.Z}
		for r := 0; r < 3; r++ {
			for k := 0; k < 3; k++ {
				s[k*3+r] -= dd[r] * dd[k]
			}
			s[r*3+r]++
		}
		b = r3.Add(b, p)
		if d2 := r3.Norm2(p); d2 > far {
			far = d2
		}
		nf++
	}
	if nf > 0 {
		c = leastSquaresPoint(&s, b, float64(nf))
	}
	if !linalg.Finite3(c) {
		return r3.Vec{}, 0, 0, &InputError{Field: "ws", Err: fmt.Errorf("%w: lines too far from the origin", ErrRange)}
	}
	var sum float64
	for _, w := range ws {
		f2 := r3.Norm2(w.F)
		if f2 == 0 {
			continue
		}
		mc := r3.Sub(w.M, r3.Cross(c, w.F))
		sum += r3.Norm2(mc) / f2
	}
	if nf > 0 {
		length = math.Sqrt(sum / float64(nf))
	}
	if math.IsInf(length, 0) {
		return r3.Vec{}, 0, 0, &InputError{Field: "ws", Err: fmt.Errorf("%w: lines too far from the origin", ErrRange)}
	}
	floor := lengthFloor * math.Sqrt(math.Max(far, r3.Norm2(c)))
	if length <= floor {
		// The lines meet at c to rounding: the moments are noise.
		length, used = 0, floor
	} else {
		used = length
	}
	if used == 0 {
		used = 1 // every moment about c is exactly zero
	}
	return c, length, used, nil
}

// leastSquaresPoint solves S·c = b for the 3×3 symmetric positive
// semi-definite S = Σ(I − dᵢdᵢᵀ) of nf lines (column-major), dropping the
// eigen-directions of S below centreTol·nf (the pseudo-inverse solution).
func leastSquaresPoint(s *[9]float64, b r3.Vec, nf float64) r3.Vec {
	x, _ := linalg.SolvePSD3(*s, [3]float64{b.X, b.Y, b.Z}, centreTol*nf)
	return r3.Vec{X: x[0], Y: x[1], Z: x[2]}
}

// freeTwists returns the canonical basis of the free twists spanned by
// columns rank..5 of the 6×6 matrix v, whose columns are (V at c, W·used)
// in normalised coordinates, with c and used in units of unit metres.
// Twists whose rotation part is at most transTol are pure translations.
func freeTwists(v []float64, rank int, c r3.Vec, used, unit, transTol float64) []Twist {
	k := 6 - rank
	// Ω: the rotation parts, 3×k. Its right singular vectors Y order the
	// free space by rotation; null columns are pure translations.
	var omega [18]float64
	var y [36]float64
	var sig [6]float64
	for j := 0; j < k; j++ {
		copy(omega[j*3:j*3+3], v[(rank+j)*6+3:(rank+j)*6+6])
	}
	linalg.Jacobi(omega[:3*k], 3, k, y[:k*k])
	linalg.SortColumns(omega[:3*k], 3, k, y[:k*k], sig[:k])

	var z [6][6]float64 // the combined twists, one per row
	for j := 0; j < k; j++ {
		for l := 0; l < k; l++ {
			linalg.Axpy(y[j*k+l], v[(rank+l)*6:(rank+l)*6+6], z[j][:])
		}
	}
	nrot := 0
	for nrot < k && sig[nrot] > transTol {
		nrot++
	}
	// Orthonormalise the translations (W = 0) and remove them from the
	// twists with a rotation.
	for j := nrot; j < k; j++ {
		t := z[j][:3]
		for pass := 0; pass < 2; pass++ {
			for i := nrot; i < j; i++ {
				linalg.Axpy(-linalg.Dot(z[i][:3], t), z[i][:3], t)
			}
		}
		s := 1 / linalg.Norm(t)
		for i := range t {
			t[i] *= s
		}
		z[j][3], z[j][4], z[j][5] = 0, 0, 0
	}
	for j := 0; j < nrot; j++ {
		for i := nrot; i < k; i++ {
			linalg.Axpy(-linalg.Dot(z[i][:3], z[j][:3]), z[i][:3], z[j][:3])
		}
	}

	free := make([]Twist, k)
	for j := 0; j < k; j++ {
		vc := r3.Vec{X: z[j][0], Y: z[j][1], Z: z[j][2]}
		w := r3.Scale(1/used, r3.Vec{X: z[j][3], Y: z[j][4], Z: z[j][5]})
		var t Twist
		if j < nrot {
			t = Twist{W: w, V: r3.Scale(unit, r3.Sub(vc, r3.Cross(w, c)))}
			t = t.Scale(signOf(t.W) / linalg.Norm3(t.W))
		} else {
			t = Twist{V: r3.Scale(signOf(vc)/linalg.Norm3(vc), vc)}
		}
		free[j] = t
	}
	return free
}

// redundancies returns the k combinations held in the rows of the k×n
// row-major matrix b (weights of the normalised wrenches), in reduced
// echelon form and converted to weights of the wrenches as given.
func redundancies(b []float64, k, n int, scale, gain []float64, tiny float64) [][]float64 {
	var pivStack [stackWrenches]int
	var piv []int
	if k <= len(pivStack) {
		piv = pivStack[:k]
	} else {
		piv = make([]int, k)
	}
	linalg.Echelon(b, k, n, piv, tiny)
	flat := make([]float64, k*n)
	out := make([][]float64, k)
	for r := 0; r < k; r++ {
		c := flat[r*n : r*n+n : r*n+n]
		// cᵢ = bᵢ/(scaleᵢ·gainᵢ), with the binary exponents of the
		// divisors taken out and the smallest one restored, so that no
		// quotient overflows.
		emin := math.MaxInt
		for i := range c {
			if b[r*n+i] != 0 {
				_, es := math.Frexp(scale[i])
				_, eg := math.Frexp(gain[i])
				emin = min(emin, es+eg)
			}
		}
		var big float64
		for i := range c {
			if b[r*n+i] == 0 {
				continue
			}
			fs, es := math.Frexp(scale[i])
			fg, eg := math.Frexp(gain[i])
			c[i] = math.Ldexp(b[r*n+i]/(fs*fg), emin-es-eg)
			if math.Abs(c[i]) > math.Abs(big) {
				big = c[i]
			}
		}
		for i := range c {
			c[i] /= big
		}
		out[r] = c
	}
	return out
}

// signOf returns +1 or −1, the sign of the component of v largest in
// magnitude (the first of equals).
func signOf(v r3.Vec) float64 {
	x := v.X
	if math.Abs(v.Y) > math.Abs(x) {
		x = v.Y
	}
	if math.Abs(v.Z) > math.Abs(x) {
		x = v.Z
	}
	if x < 0 {
		return -1
	}
	return 1
}

// maxAbs returns the largest magnitude of a component of w.
func maxAbs(w Wrench) float64 {
	return max(math.Abs(w.F.X), math.Abs(w.F.Y), math.Abs(w.F.Z), math.Abs(w.M.X), math.Abs(w.M.Y), math.Abs(w.M.Z))
}
