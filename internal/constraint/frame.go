package constraint

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/errs"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// eps is the float64 machine epsilon, 2⁻⁵², twice the unit roundoff.
const eps = 0x1p-52

// momentRounding bounds the rounding that the moments of a set carry, in
// units of ε·far·|F|, where far is the largest distance from the origin of
// a line of the set or of the reference point c.
//
// A moment given about the origin for a line at distance D from it,
// M = p × F with |p| ≈ D, is known to about 4u·D·|F| per component (u = ε/2
// the unit roundoff: the rounding of p's coordinates, of the two products
// and of their difference); that is the input's own precision, whatever
// Analyze does. Taking it about c, M − c×F, adds 2u·|c|·|F| for the cross
// product and u·|M − c×F| for the difference (the scalings to a unit
// wrench and a unit length are powers of two, exact). Per component that
// is at most 8u·far·|F| = 4ε·far·|F|, and 4√3·ε·far·|F| ≈ 7ε·far·|F| for
// the vector. Divided by the length used and by the column norm (at least
// |F|), each column of the normalised matrix is perturbed by at most
// 7ε·far/used; the n columns together by ‖E‖₂ ≤ ‖E‖_F ≤ √n·7ε·far/used,
// and since σ₁ ≥ √(n/6) (the squared singular values sum to n), by at most
// √6·7ε·far/used ≈ 17ε·far/used relative to σ₁. By Weyl's inequality
// (Golub & Van Loan, Matrix Computations, 4th ed., 2013, Corollary 8.6.2)
// no singular value moves by more. The moments of lines that meet at one
// point, taken about it, are rounding of at most 7ε·far each, and so is
// their RMS, the characteristic length. 32 covers both with a margin of
// about 2.
const momentRounding = 32

// minForce is the smallest |F| that Analyze accepts for a wrench scaled to
// a largest component in [1, 2): a line more than 1/minForce = 1e100 (in
// the units of the moment arm) from the origin is out of range of the
// arithmetic that follows, which squares distances.
const minForce = 1e-100

// maxSpread is the largest ratio between the magnitudes (largest
// components) of two wrenches that Analyze accepts. The weights of a
// redundant combination scale inversely with the magnitudes, and beyond
// this spread they would leave the float64 range.
const maxSpread = 1e150

// minUnit is the smallest length unit, in metres, in which moments are
// expressed: the smallest normal float64, 2⁻¹⁰²² ≈ 2.2e-308, so that
// 1/unit is finite. A line's distance from the origin in units is then at
// least 2⁻⁵² when it is not zero (the smallest subnormal over minUnit), and
// its square never underflows. A power of two, so that dividing by a unit
// is exact.
const minUnit = 0x1p-1022

// centreTol is the smallest eigenvalue, relative to the number of lines,
// that the least-squares reference point uses. Lines whose directions all
// lie within about √centreTol ≈ 3e-5 rad of one direction are treated as
// parallel, and the reference point moves along that direction to the
// nearest point to the origin, which changes no moment about it.
const centreTol = 1e-9

// frame is the normalisation of a set of wrenches that Analyze and Freed
// share: every length is in units of unit metres, moments are taken about c
// and divided by used.
type frame struct {
	unit   float64 // metres per length unit, 2^ue
	ue     int
	c      r3.Vec  // reference point, in units
	length float64 // characteristic length in units; 0 when the lines meet at c
	used   float64 // the length that moments about c are divided by, in units
	far    float64 // largest distance of a line or of c from the origin, in units
	noise  float64 // bound on the rounding of the normalised matrix relative to σ₁ (momentRounding·ε·far/used); 0 if none
}

// farLimit is the smallest ratio of the characteristic length to the
// distance from the origin (of the lines or the reference point) at which
// Analyze gives a verdict on a set whose lines do not meet in one point:
// there the rounding bound momentRounding·ε·far/length reaches
// NearSingularRatio, about 7.1e-12.
const farLimit = momentRounding * eps / NearSingularRatio

// normalise validates the wrenches ws and builds the normalised constraint
// matrix: column i of the 6×n column-major a is wrench i with its moment
// taken about the reference point and divided by the characteristic
// length, scaled to unit norm. The factor it was divided by is
// 2^exps[i]·gain[i]. pre is workspace of len(ws) wrenches.
//
// Every scaling is by a power of two, exact.
func normalise(ws, pre []Wrench, a []float64, exps []int, gain []float64) (frame, error) {
	if len(ws) == 0 {
		return frame{}, &Error{Index: -1, Err: fmt.Errorf("%w: no wrenches to analyse", errs.ErrDegenerate)}
	}
	if err := prescale(ws, pre, exps); err != nil {
		return frame{}, err
	}
	unit, ue, err := lengthUnit(ws, pre, exps)
	if err != nil {
		return frame{}, err
	}

	fr, ok := reference(pre, gain) // gain is free until the columns
	if !ok {
		return frame{}, &Error{Index: -1, Err: fmt.Errorf("%w: lines too far from the origin", errs.ErrRange)}
	}
	fr.unit, fr.ue = unit, ue
	if fr.noise > NearSingularRatio {
		// Beyond the limit of momentRounding: the coordinates do not
		// carry the precision to tell a near-singular set from a sound
		// one.
		return frame{}, &Error{Index: -1, Err: fmt.Errorf(
			"%w: the lines lie within %.3g m of their reference point but %.3g m from the origin, "+
				"and their moments about the origin carry rounding of about ε times that distance: "+
				"too coarse to judge the constraint (size/distance must be at least %.2g); "+
				"give the wrenches about a point near the lines",
			errs.ErrRange, fr.length*unit, fr.far*unit, farLimit)}
	}
	if err := columns(pre, a, exps, gain, fr.used, ue); err != nil {
		return frame{}, err
	}
	return fr, nil
}

// prescale validates the non-empty wrenches ws and stores in pre each one
// scaled by the power of two 2^-exps[i] that brings its largest component
// into [1, 2). It refuses a set whose magnitudes spread more than
// maxSpread.
func prescale(ws, pre []Wrench, exps []int) error {
	var lo, hi int
	var mlo, mhi float64
	for i := range ws {
		w := &ws[i]
		if !linalg.Finite3(w.F) {
			return &Error{Index: i, Part: "F", Err: fmt.Errorf("%w: %v", errs.ErrNonFinite, w.F)}
		}
		if !linalg.Finite3(w.M) {
			return &Error{Index: i, Part: "M", Err: fmt.Errorf("%w: %v", errs.ErrNonFinite, w.M)}
		}
		m := maxAbs(w)
		if m == 0 {
			return &Error{Index: i, Err: fmt.Errorf("%w: a zero wrench constrains nothing", errs.ErrDegenerate)}
		}
		if i == 0 || m < mlo {
			lo, mlo = i, m
		}
		if i == 0 || m > mhi {
			hi, mhi = i, m
		}
		// Scale by a power of two (exact) to a largest component in [1, 2):
		// only the line matters, and this keeps every product in range.
		e := exponent(m)
		exps[i] = e
		p := &pre[i]
		if e >= -1022 && e <= 1022 {
			f := pow2(-e)
			p.F.X, p.F.Y, p.F.Z = w.F.X*f, w.F.Y*f, w.F.Z*f
			p.M.X, p.M.Y, p.M.Z = w.M.X*f, w.M.Y*f, w.M.Z*f
		} else {
			p.F, p.M = scaleVec(w.F, -e), scaleVec(w.M, -e)
		}
	}
	if mhi > maxSpread*mlo {
		return &Error{Index: hi, Err: fmt.Errorf(
			"%w: magnitude %g is more than %g times that of wrench %d (%g); only the lines matter, so scale the wrenches",
			errs.ErrRange, mhi, maxSpread, lo, mlo)}
	}
	return nil
}

// lengthUnit returns the unit of length unit = 2^ue for the prescaled
// wrenches pre of ws and rescales each line's moment in pre to it.
//
// Lengths are in units of a power of two at least the farthest line's
// distance from the origin (but no smaller than minUnit), so that
// squared distances neither overflow nor underflow at any scale. A
// line's wrench (F, M) becomes (F, M/unit) after the scaling by
// 2^-exps[i], applied to the moment as given in one exact step, so that
// no intermediate is subnormal; a couple keeps its scaled moment, since
// only its direction enters the matrix.
func lengthUnit(ws, pre []Wrench, exps []int) (unit float64, ue int, err error) {
	var far2 float64 // largest squared distance, of lines with a normal |M|²
	far := minUnit
	for i := range pre {
		if pre[i].F == (r3.Vec{}) {
			continue // a couple
		}
		f2 := r3.Norm2(pre[i].F) // |F| ≤ 2√3: no overflow; an underflow is caught below
		if f2 < minForce*minForce {
			return 0, 0, &Error{Index: i, Err: fmt.Errorf(
				"%w: moment more than %g times the force: the line is too far from the origin (a couple has F = 0)", errs.ErrRange, 1/minForce)}
		}
		// Squared distances where |M|² is safely normal (the common
		// case), the norms otherwise.
		if m2 := r3.Norm2(pre[i].M); m2 > 0x1p-1000 {
			if d2 := m2 / f2; d2 > far2 {
				far2 = d2
			}
		} else if d := linalg.Norm3(pre[i].M) / math.Sqrt(f2); d > far {
			far = d
		}
	}
	if d := math.Sqrt(far2); d > far {
		far = d
	}
	ue = exponent(far) + 1 // unit = 2^ue > far
	unit = math.Ldexp(1, ue)
	for i := range pre {
		if pre[i].F != (r3.Vec{}) {
			pre[i].M = scaleVec(ws[i].M, -exps[i]-ue)
		}
	}
	return unit, ue, nil
}

// columns fills the 6×n column-major a with the normalised columns of
// the wrenches pre, whose moments are about the reference point already:
// (F, (M − c×F)/used), scaled to unit norm, with the norm in gain[i]. A
// couple's unit exponent ue joins exps[i].
func columns(pre []Wrench, a []float64, exps []int, gain []float64, used float64, ue int) error {
	for i := range pre {
		w := &pre[i]
		col := (*[6]float64)(a[6*i : 6*i+6])
		if w.F == (r3.Vec{}) {
			// A couple: (0, M/(unit·used)), whose direction is M's. The
			// power of two of unit joins the wrench's own, so that the
			// gain stays in range at every scale.
			norm := linalg.Norm3(w.M)
			r := 1 / norm
			col[0], col[1], col[2] = 0, 0, 0
			col[3], col[4], col[5] = w.M.X*r, w.M.Y*r, w.M.Z*r
			exps[i] -= ue
			gain[i] = norm / used
			continue
		}
		s := 1 / used
		col[0], col[1], col[2] = w.F.X, w.F.Y, w.F.Z
		col[3], col[4], col[5] = w.M.X*s, w.M.Y*s, w.M.Z*s
		// |F| is in [minForce, 2√3] and each |M − c×F|/used is at most √n
		// times |F| (used is the RMS of their ratios), so the squares
		// neither overflow nor underflow.
		norm := math.Sqrt(dot6(col, col))
		if !linalg.Finite(norm) {
			return &Error{Index: i, Err: fmt.Errorf("%w: cannot normalise the wrench", errs.ErrRange)}
		}
		r := 1 / norm
		for j := range col {
			col[j] *= r
		}
		gain[i] = norm
	}
	return nil
}

// reference sets the reference point, the characteristic length, the
// length to divide moments by and the rounding bound of the wrenches ws,
// scaled to a largest component in [1, 2) and lengths in units. It
// replaces each line's moment by its moment about the reference point
// (zero when the lines meet there). It reports false if the point is out
// of range. inv is workspace of len(ws) values.
func reference(ws []Wrench, inv []float64) (fr frame, ok bool) {
	// Least-squares point nearest to all lines: Σ(I − dᵢdᵢᵀ) c = Σ pᵢ, with
	// dᵢ the unit direction and pᵢ the point of line i nearest the origin.
	var s00, s01, s02, s11, s12, s22 float64 // Σ(I − dᵢdᵢᵀ), upper triangle
	var b r3.Vec
	var far2 float64 // largest squared distance of a line from the origin
	nf := 0
	for i := range ws {
		f, m := ws[i].F, ws[i].M
		f2 := r3.Norm2(f)
		if f2 == 0 {
			inv[i] = 0
			continue
		}
		r := 1 / f2
		inv[i] = r
		p := r3.Scale(r, r3.Cross(f, m)) // |p| ≤ 1/minForce
		x, y, z := f.X*r, f.Y*r, f.Z*r
		s00 += 1 - f.X*x
		s01 -= f.X * y
		s02 -= f.X * z
		s11 += 1 - f.Y*y
		s12 -= f.Y * z
		s22 += 1 - f.Z*z
		b = r3.Add(b, p)
		if d2 := r3.Norm2(p); d2 > far2 {
			far2 = d2
		}
		nf++
	}
	s := [9]float64{s00, s01, s02, s01, s11, s12, s02, s12, s22}
	if nf == 0 {
		// Couples only: moments need no reference point and no length.
		return frame{used: 1}, true
	}
	sf := linalg.FactorPSD3(&s, centreTol*float64(nf))
	c := solve3(&sf, b)
	// One step of refinement (Wilkinson's iterative refinement, with the
	// residual taken from the data rather than as b − S·c): the points of
	// the lines nearest to c, relative to c, are F × (M − c×F)/|F|². They
	// lie across the lines to rounding of their own (small) size, so the
	// rounding of the moments, ε·far, enters the correction as a
	// perturbation of the least-squares data, amplified by 1/σmin of the
	// stacked system, not by 1/σmin² = 1/λmin(S) as in the first solve
	// (the normal equations; Golub & Van Loan 2013, §5.3.7). For lines
	// that meet at one point with directions within θ of each other, this
	// takes their moments about c from ε·far/θ down to ε·far.
	var b2 r3.Vec
	for i := range ws {
		if inv[i] == 0 {
			continue
		}
		f := ws[i].F
		m := r3.Sub(ws[i].M, r3.Cross(c, f))
		ws[i].M = m // the moment about c, corrected below
		b2 = r3.Add(b2, r3.Scale(inv[i], r3.Cross(f, m)))
	}
	dc := solve3(&sf, b2)
	c = r3.Add(c, dc)
	if !linalg.Finite3(c) {
		return frame{}, false
	}
	var sum float64
	for i := range ws {
		if inv[i] == 0 {
			continue
		}
		m := r3.Sub(ws[i].M, r3.Cross(dc, ws[i].F)) // M − c×F
		ws[i].M = m
		sum += r3.Norm2(m) * inv[i]
	}
	length := math.Sqrt(sum / float64(nf))
	if math.IsInf(length, 0) {
		return frame{}, false
	}
	far := max(math.Sqrt(far2), linalg.Norm3(c))
	fr = frame{c: c, length: length, used: length, far: far}
	if length <= momentRounding*eps*far {
		// The lines meet at c to within the rounding their moments carry:
		// the moments about c are noise. Drop them; the set is analysed
		// as concurrent at c.
		for i := range ws {
			if ws[i].F != (r3.Vec{}) {
				ws[i].M = r3.Vec{}
			}
		}
		fr.length, fr.used = 0, 1
		return fr, true
	}
	fr.noise = momentRounding * eps * far / length
	return fr, true
}

// solve3 solves S·c = b for the factored 3×3 symmetric positive
// semi-definite S = Σ(I − dᵢdᵢᵀ), dropping its eigen-directions at or
// below the cut-off it was factored with (the pseudo-inverse solution).
func solve3(s *linalg.PSD3, b r3.Vec) r3.Vec {
	x := s.Solve([3]float64{b.X, b.Y, b.Z})
	return r3.Vec{X: x[0], Y: x[1], Z: x[2]}
}

// exponent returns the binary exponent e of the finite x > 0 with
// x = f·2^e, f in [1, 2).
func exponent(x float64) int {
	if b := math.Float64bits(x) >> 52 & 0x7ff; b != 0 {
		return int(b) - 1023
	}
	_, e := math.Frexp(x) // subnormal
	return e - 1
}

// scaleVec returns v·2^k, exactly unless a component becomes subnormal.
func scaleVec(v r3.Vec, k int) r3.Vec {
	if k >= -1022 && k <= 1023 {
		f := pow2(k)
		return r3.Vec{X: v.X * f, Y: v.Y * f, Z: v.Z * f}
	}
	return scaleVecSlow(v, k)
}

// scaleVecSlow is scaleVec for 2^k outside the normal range, in two
// exact steps (|k| ≤ 2100 here).
func scaleVecSlow(v r3.Vec, k int) r3.Vec {
	h := k / 2
	return scaleVec(scaleVec(v, h), k-h)
}

// pow2 returns 2^k for k in [−1022, 1023], from its bits.
func pow2(k int) float64 {
	return math.Float64frombits(uint64(k+1023) << 52)
}

// maxAbs returns the largest magnitude of a component of w, which must be
// finite (plain comparisons, without the NaN handling of max).
func maxAbs(w *Wrench) float64 {
	m := math.Abs(w.F.X)
	for _, x := range [5]float64{w.F.Y, w.F.Z, w.M.X, w.M.Y, w.M.Z} {
		if a := math.Abs(x); a > m {
			m = a
		}
	}
	return m
}
