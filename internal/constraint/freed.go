package constraint

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// freedTol is the pivot, relative to the largest entry of its column,
// at or below which [Freed] treats the normalised 6×6 matrix as singular.
// Its columns have unit norm. Gauss–Jordan elimination with partial
// pivoting on a 6×6 matrix grows its entries by at most 2⁵ (Wilkinson's
// bound 2ⁿ⁻¹; Golub & Van Loan, Matrix Computations, 4th ed., 2013,
// §3.4.6), so the pivot that stands for an exact zero is rounding of at
// most about 6·2⁵·ε ≈ 4.3e-14; 2⁻⁴⁰ ≈ 9.1e-13 leaves a margin of 20.
// Far from the origin the bound on the rounding the moments carry
// (momentRounding·ε·far/length, see [Analyze]) takes its place when it is
// larger.
const freedTol = 0x1p-40

// Freed computes the twists freed by removing each of six wrenches: ts[i]
// has power Power(ts[i], ws[j]) = δᵢⱼ with the wrenches as given, in W and
// J. They are the rows of the inverse of the 6×6 matrix whose columns are
// the wrenches, and equal [Result.Freed] of [Analyze] to rounding.
//
// Freed normalises as Analyze does (the same reference point and
// characteristic length) and inverts the normalised matrix by Gauss–Jordan
// elimination, without the singular value decomposition: it is meant for
// an optimiser that evaluates many layouts. It reports false, leaving ts
// unspecified, for input that Analyze rejects, for lines that meet in one
// point, when a pivot is at most max(freedTol, 32ε·far/length) ≈ 9.1e-13
// of the largest entry of its column (singular to working precision, a
// ratio of dimensionless numbers and so independent of units and
// position), or when a twist overflows. It does not allocate.
func Freed(ws *[6]Wrench, ts *[6]Twist) bool {
	var pre [6]Wrench
	var a [36]float64
	var exps [6]int
	var gain [6]float64
	fr, err := normalise(ws[:], pre[:], a[:], exps[:], gain[:])
	if err != nil || fr.length == 0 {
		return false
	}
	if !linalg.Inverse6(&a, max(freedTol, fr.noise)) {
		return false
	}
	// Row i of A⁻¹ is a[i], a[6+i], ..., a[30+i].
	cm := r3.Scale(fr.unit, fr.c)
	for i := range ts {
		row := [6]float64{a[i], a[6+i], a[12+i], a[18+i], a[24+i], a[30+i]}
		if !freedTwist(&row, &fr, cm, exps[i], gain[i], &ts[i]) {
			return false
		}
	}
	return true
}

// freedFromRows writes the rows of the inverse of the normalised 6×6 a,
// converted to freed twists, into ts, from one-sided Jacobi on its
// transpose: w holds W = Aᵀ·J with J orthogonal and W's columns
// orthogonal, of norms sigma (the singular values). Then A·Aᵀ is not
// needed: Aᵀ·A = W·Jᵀ·J·Wᵀ = W·Wᵀ, so (Aᵀ·A)⁻¹ = Σₖ wₖwₖᵀ/σₖ⁴ = M and
// A⁻¹ = (Aᵀ·A)⁻¹·Aᵀ, whose row i is Σₗ Mᵢₗ·aₗ with aₗ column l of A
// (126 + 216 multiply-adds, no J). Its error is of the order of
// ε·Condition relative to |A⁻¹|, as for Gauss–Jordan elimination: the
// computed W is (A + δA)ᵀ·J with J orthogonal and |δA| ≲ ε|A| (Demmel &
// Veselić 1992, "Jacobi's method is more accurate than QR", SIAM J.
// Matrix Anal. Appl. 13(4), §4), so that M is the inverse of
// (A + δA)ᵀ·(A + δA) to the orthogonality of W's columns (4ε, the
// stopping test), and M·(A + δA)ᵀ = (A + δA)⁻¹; replacing A + δA by A
// costs |M|·|δA| = |δA|/σ₆², the same order. It reports false if a twist
// overflows.
func freedFromRows(a []float64, w *[36]float64, sigma *[6]float64, fr *frame, exps []int, gain []float64, ts *[6]Twist) bool {
	// M = Σₖ vₖvₖᵀ with vₖ = wₖ/σₖ², symmetric: 21 entries.
	var v [6][6]float64
	for k := 0; k < 6; k++ {
		s := 1 / (sigma[k] * sigma[k])
		for m := 0; m < 6; m++ {
			v[k][m] = w[6*k+m] * s
		}
	}
	var mm [6][6]float64
	for l := 0; l < 6; l++ {
		for m := l; m < 6; m++ {
			x := v[0][l]*v[0][m] + v[1][l]*v[1][m] + v[2][l]*v[2][m] +
				v[3][l]*v[3][m] + v[4][l]*v[4][m] + v[5][l]*v[5][m]
			mm[l][m], mm[m][l] = x, x
		}
	}
	// Row i of A⁻¹ = M·Aᵀ is Σₗ Mᵢₗ·aₗ.
	cm := r3.Scale(fr.unit, fr.c)
	for i := 0; i < 6; i++ {
		mi := &mm[i]
		var row [6]float64
		for l := 0; l < 6; l++ {
			al := (*[6]float64)(a[6*l : 6*l+6])
			x := mi[l]
			for m := 0; m < 6; m++ {
				row[m] += x * al[m]
			}
		}
		if !freedTwist(&row, fr, cm, exps[i], gain[i], &ts[i]) {
			return false
		}
	}
	return true
}

// freedTwist converts row i of the inverse of the normalised matrix into
// the twist with power δᵢⱼ with the wrenches as given. The normalised
// twist pairs with column j of the matrix as t̂·aⱼ = Power(t, wⱼ)/gⱼ, with
// t̂ = (V at c, W·used) and gⱼ = 2^expsⱼ·gainⱼ, so twist i is row i
// divided by gᵢ, in metres and radians; cm is the reference point in
// metres. It reports false if the twist overflows.
func freedTwist(row *[6]float64, fr *frame, cm r3.Vec, exp int, gain float64, t *Twist) bool {
	g := 1 / gain
	fv := ldexp(g, -exp)
	fw := ldexp(g/fr.used, -fr.ue-exp)
	wx, wy, wz := row[3]*fw, row[4]*fw, row[5]*fw
	t.W.X, t.W.Y, t.W.Z = wx, wy, wz
	t.V.X = row[0]*fv - (wy*cm.Z - wz*cm.Y)
	t.V.Y = row[1]*fv - (wz*cm.X - wx*cm.Z)
	t.V.Z = row[2]*fv - (wx*cm.Y - wy*cm.X)
	return linalg.Finite3(t.W) && linalg.Finite3(t.V)
}

// ldexp returns x·2^k: by one multiplication when 2^k is a normal
// number, by math.Ldexp otherwise.
func ldexp(x float64, k int) float64 {
	if k >= -1022 && k <= 1023 {
		return x * pow2(k)
	}
	return math.Ldexp(x, k)
}
