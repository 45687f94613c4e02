package constraint

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/errs"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// pivotTol is the residual below which redundancies passes over a column
// as a basis column when it can: the columns it sees have norm 1 to within
// the rank decision, so a column whose part independent of the basis
// chosen so far is a millionth of it is expressed in that basis rather
// than added to it (which would divide by the millionth).
const pivotTol = 1e-6

// redundancies returns the n − rank redundant combinations of the columns
// of the 6×n column-major a (unit columns), whose retained left singular
// vectors are the first rank columns of u (orthonormal) and whose smallest
// retained singular value is sigmaR: a basis of the null space of the
// rank-rank part of a, in reduced echelon form, converted to weights of
// the wrenches as given (column i was divided by 2^exps[i]·gain[i]) and
// scaled to a largest weight of +1. Weights below tiny times the largest
// of their combination (in normalised terms) are set to zero. ah is
// workspace of rank·n values.
//
// The null space comes from a basis of the column space chosen greedily
// from the last column to the first: column j joins the basis if its part
// independent of the columns already chosen (all to its right) exceeds
// δ = min(pivotTol, σᵣ/(2√n)). Every other column is then expressed in the
// basis, which gives the combination with weight 1 on it and the negated
// coefficients on the basis columns; the columns passed over are the pivot
// columns of the combinations, each combination has one of its own, and
// the other combinations have weight 0 there. In exact arithmetic and with
// δ = 0 they are the pivot columns of the reduced echelon form of the null
// space (by matroid duality: the complement of the lexicographically last
// basis of the columns is the lexicographically first basis of the dual),
// and every column passed over depends on basis columns to its right
// only. A column passed over for a small but real independent part, as
// Gauss–Jordan elimination passes over a small pivot, depends on basis
// columns to its left as well and carries their weights. The threshold
// always completes a basis of rank columns: if fewer were chosen, every
// column's independent part would be below δ, so the Frobenius norm of the
// part of a independent of them would be below √n·δ = σᵣ/2, while it is at
// least σᵣ. The work is O(n·rank²) besides the output.
func redundancies(a []float64, n int, u *[36]float64, rank int, sigmaR float64, exps []int, gain []float64, tiny float64, ah []float64) [][]float64 {
	r := rank
	// Â = U_rᵀA, r×n column-major: the columns in the retained space.
	for j := 0; j < n; j++ {
		aj := (*[6]float64)(a[6*j : 6*j+6])
		for l := 0; l < r; l++ {
			ul := (*[6]float64)(u[6*l : 6*l+6])
			ah[j*r+l] = dot6(ul, aj)
		}
	}
	delta := min(pivotTol, sigmaR/(2*math.Sqrt(float64(n))))

	var q [6][6]float64  // orthonormal basis of the chosen columns, in R^r
	var rm [6][6]float64 // rm[c][l]: coefficient of q[l] in chosen column c (upper triangular)
	var piv [6]int       // the chosen columns
	nq := 0

	// The basis, from the right.
	for j := n - 1; j >= 0 && nq < r; j-- {
		var v, y [6]float64
		copy(v[:r], ah[j*r:j*r+r])
		// Classical Gram–Schmidt, twice ("twice is enough": Giraud, Langou
		// & Rozložník 2005, Numer. Math. 101).
		for pass := 0; pass < 2; pass++ {
			for c := 0; c < nq; c++ {
				d := dot6(&q[c], &v)
				y[c] += d
				for l := 0; l < r; l++ {
					v[l] -= d * q[c][l]
				}
			}
		}
		if rho := linalg.Norm(v[:r]); rho > delta {
			s := 1 / rho
			for l := 0; l < r; l++ {
				q[nq][l] = v[l] * s
			}
			rm[nq] = y
			rm[nq][nq] = rho
			piv[nq] = j
			nq++
		}
	}

	// Every other column in the whole basis: column j = Σ x_c·(basis
	// column c), by back-substitution in rm. A column passed over for a
	// small but real independent part is expressed with the basis
	// columns to its left too, which then carry weight in its
	// combination.
	k := n - r
	flat := make([]float64, k*n)
	out := make([][]float64, k)
	row, next := 0, r-1 // piv[next] is the next basis column from the left
	for j := 0; j < n; j++ {
		if next >= 0 && piv[next] == j {
			next--
			continue
		}
		var v, y [6]float64
		copy(v[:r], ah[j*r:j*r+r])
		for c := 0; c < r; c++ {
			y[c] = dot6(&q[c], &v)
		}
		var x [6]float64
		for c := r - 1; c >= 0; c-- {
			s := y[c]
			for d := c + 1; d < r; d++ {
				s -= rm[d][c] * x[d]
			}
			x[c] = s / rm[c][c]
		}
		w := flat[row*n : row*n+n : row*n+n]
		w[j] = 1
		big := 1.0
		// The non-zero weights in increasing order of index: the basis
		// columns (piv decreases), with j in its place.
		var idx [7]int
		m, placed := 0, false
		for c := r - 1; c >= 0; c-- {
			if !placed && piv[c] > j {
				idx[m], m, placed = j, m+1, true
			}
			idx[m], m = piv[c], m+1
			w[piv[c]] = -x[c]
			big = max(big, math.Abs(x[c]))
		}
		if !placed {
			idx[m], m = j, m+1
		}
		toWeights(w, idx[:m], j, exps, gain, tiny*big)
		out[row] = w
		row++
	}
	return out
}

// toWeights converts the normalised weights of w at the indices idx (the
// only non-zero ones) into weights of the wrenches as given, wᵢ/(2^expsᵢ·gainᵢ),
// after setting to zero those below cut in magnitude (never the pivot's,
// which keeps the combination a wrench of its own), and scales them to a
// largest weight of +1 (the first of equals in the order of idx).
func toWeights(w []float64, idx []int, pivot int, exps []int, gain []float64, cut float64) {
	// The binary exponents of the divisors are taken out and the smallest
	// one restored, so that no quotient overflows.
	emin := math.MaxInt
	for _, i := range idx {
		if i != pivot && math.Abs(w[i]) < cut {
			w[i] = 0
			continue
		}
		_, eg := math.Frexp(gain[i])
		emin = min(emin, exps[i]+eg)
	}
	var big float64
	for _, i := range idx {
		if w[i] == 0 {
			continue
		}
		fg, eg := math.Frexp(gain[i])
		w[i] = math.Ldexp(w[i]/fg, emin-exps[i]-eg)
		if math.Abs(w[i]) > math.Abs(big) {
			big = w[i]
		}
	}
	for _, i := range idx {
		w[i] /= big
	}
}

func dot6(x, y *[6]float64) float64 {
	return (x[0]*y[0] + x[1]*y[1]) + (x[2]*y[2] + x[3]*y[3]) + (x[4]*y[4] + x[5]*y[5])
}

// weightRange reports an error if the weights of a redundant combination
// could leave the float64 range: the weight of wrench i scales as
// 1/(2^exps[i]·gain[i]), its column's divisor, and scaled to a largest
// weight of 1, a weight below 2⁻¹⁰⁰⁰ of it (maxWeightExp) would be
// subnormal or zero. For lines the divisor is the magnitude to within a
// factor of the column norm, and the magnitudes are within maxSpread; a
// couple's is its moment over the characteristic length, so a set that
// mixes couples and forces can exceed the bound. length is the
// characteristic length in metres, for the message.
func weightRange(ws []Wrench, exps []int, gain []float64, length float64) error {
	lo, hi := 0, 0
	elo, ehi := math.MaxInt, math.MinInt
	for i := range exps {
		e := exps[i] + exponent(gain[i])
		if e < elo {
			lo, elo = i, e
		}
		if e > ehi {
			hi, ehi = i, e
		}
	}
	if ehi-elo <= maxWeightExp {
		return nil
	}
	what := func(i int) string {
		if ws[i].F == (r3.Vec{}) {
			return fmt.Sprintf("a couple of %.3g N·m", linalg.Norm3(ws[i].M))
		}
		return fmt.Sprintf("a force of %.3g N", linalg.Norm3(ws[i].F))
	}
	return &Error{Index: hi, Err: fmt.Errorf(
		"%w: %s is more than 2^%d times %s (wrench %d) over the characteristic length %.3g m; "+
			"the weights of their redundant combination leave the float64 range",
		errs.ErrRange, what(hi), maxWeightExp, what(lo), lo, length)}
}

// maxWeightExp bounds the binary exponent of the ratio of two weights of
// a redundant combination: 2¹⁰⁰⁰ ≈ 1e301, short of the 2¹⁰²² below which
// float64 numbers are subnormal.
const maxWeightExp = 1000
