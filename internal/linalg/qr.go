package linalg

import "math"

// QRPivot computes the Householder QR factorisation with column pivoting of
// the m×6 column-major matrix a, A·Π = Q·R (Businger & Golub 1965, "Linear
// least squares solutions by Householder transformations", Numer. Math. 7;
// Golub & Van Loan, Matrix Computations, 4th ed., 2013, Algorithm 5.4.1),
// destroying a. It writes Rᵀ, 6×k with k = min(m, 6), into the first 6k
// entries of rt (column-major: column r of rt is row r of R) and the
// permutation into perm: column c of A·Π is column perm[c] of A.
//
// The diagonal of R does not increase in magnitude, so the columns of Rᵀ are
// graded and nearly orthogonal, and one-sided Jacobi on Rᵀ converges in few
// sweeps (Drmač & Veselić 2008, "New fast and accurate Jacobi SVD algorithm
// I", SIAM J. Matrix Anal. Appl. 29(4), §3). Since Aᵀ = Π·Rᵀ·Qᵀ, the
// singular values of Rᵀ are those of A, and the left singular vectors of Rᵀ
// with entry c moved to row perm[c] are the left singular vectors of Aᵀ.
func QRPivot(a []float64, m int, rt *[36]float64, perm *[6]int) {
	const n = 6
	k := min(m, n)
	for c := range perm {
		perm[c] = c
	}
	for i := range rt {
		rt[i] = 0
	}
	var norm2 [n]float64
	for r := 0; r < k; r++ {
		// Pivot: the remaining column of largest norm below row r.
		best, bestNorm := r, -1.0
		for j := r; j < n; j++ {
			col := a[j*m+r : j*m+m]
			norm2[j] = Dot(col, col)
			if norm2[j] > bestNorm {
				best, bestNorm = j, norm2[j]
			}
		}
		if best != r {
			swap(a[r*m:r*m+m], a[best*m:best*m+m])
			perm[r], perm[best] = perm[best], perm[r]
		}
		x := a[r*m+r : r*m+m]
		x2 := norm2[best]
		if x2 > 0 {
			x0 := x[0]
			alpha := -math.Copysign(math.Sqrt(x2), x0)
			x[0] = x0 - alpha // v = x − αe₁
			vv := 2 * (x2 - alpha*x0)
			for j := r + 1; j < n; j++ {
				y := a[j*m+r : j*m+m]
				Axpy(-2*Dot(x, y)/vv, x, y)
			}
			x[0] = alpha
		}
	}
	// Row r of R is row r of a from column r on; later pivots have moved
	// its columns along with those of A, so it is read only now.
	for r := 0; r < k; r++ {
		for j := r; j < n; j++ {
			rt[r*n+j] = a[j*m+r]
		}
	}
}
