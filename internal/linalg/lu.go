package linalg

import "math"

// Inverse6 overwrites the 6×6 column-major matrix a with its inverse by
// Gauss–Jordan elimination with partial pivoting on the rows of [A | I]
// (Golub & Van Loan, Matrix Computations, 4th ed., 2013, §3.4; the
// inverse's accuracy is that of the LU factorisation with partial
// pivoting). It reports false, leaving a unchanged, if a pivot is zero or
// at most tiny times the largest entry of its column of A; callers that
// have already established the rank pass tiny = 0.
func Inverse6(a *[36]float64, tiny float64) bool {
	var r [6][12]float64 // row i: A's row i, then I's
	var colMax [6]float64
	for j := 0; j < 6; j++ {
		for i := 0; i < 6; i++ {
			x := a[6*j+i]
			r[i][j] = x
			if ax := math.Abs(x); ax > colMax[j] {
				colMax[j] = ax
			}
		}
	}
	for i := 0; i < 6; i++ {
		r[i][6+i] = 1
	}
	for k := 0; k < 6; k++ {
		p, best := k, math.Abs(r[k][k])
		for i := k + 1; i < 6; i++ {
			if v := math.Abs(r[i][k]); v > best {
				p, best = i, v
			}
		}
		if best == 0 || best <= tiny*colMax[k] {
			return false
		}
		if p != k {
			r[k], r[p] = r[p], r[k]
		}
		rk := &r[k]
		s := 1 / rk[k]
		for j := k; j < 12; j++ {
			rk[j] *= s
		}
		for i := 0; i < 6; i++ {
			if i == k {
				continue
			}
			ri := &r[i]
			f := ri[k]
			if f == 0 {
				continue
			}
			for j := k; j < 12; j++ {
				ri[j] -= f * rk[j]
			}
		}
	}
	for j := 0; j < 6; j++ {
		for i := 0; i < 6; i++ {
			a[6*j+i] = r[i][6+j]
		}
	}
	return true
}
