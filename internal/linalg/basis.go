package linalg

import "math"

// Complete extends the first r columns of the n×n column-major matrix q,
// which must be orthonormal, to an orthonormal basis of Rⁿ by writing columns
// r to n−1. Each new column starts from the unit vector least represented in
// the current span and is orthogonalised twice by modified Gram–Schmidt
// ("twice is enough": Giraud, Langou & Rozložník 2005, Numer. Math. 101).
func Complete(q []float64, n, r int) {
	for col := r; col < n; col++ {
		// Pick the unit vector e_i with the largest residual 1 − Σ q_j[i]².
		best, bestRes := 0, -1.0
		for i := 0; i < n; i++ {
			res := 1.0
			for j := 0; j < col; j++ {
				x := q[j*n+i]
				res -= x * x
			}
			if res > bestRes {
				best, bestRes = i, res
			}
		}
		x := q[col*n : col*n+n]
		for i := range x {
			x[i] = 0
		}
		x[best] = 1
		for pass := 0; pass < 2; pass++ {
			for j := 0; j < col; j++ {
				qj := q[j*n : j*n+n]
				Axpy(-Dot(qj, x), qj, x)
			}
		}
		s := 1 / Norm(x)
		for i := range x {
			x[i] *= s
		}
	}
}

// pivotTol is the smallest pivot Echelon accepts, relative to the largest
// entry of the remaining rows. The rows it is given are orthonormal, so every
// stage has an entry of at least 1/√n; a column whose best entry is a
// millionth of that is skipped rather than used to divide.
const pivotTol = 1e-6

// Echelon brings the k×n row-major matrix b, whose rows must be linearly
// independent, to reduced row echelon form by Gauss–Jordan elimination with
// row pivoting, taking pivot columns in order. It writes the pivot column of
// each row into piv (length k) and sets to zero every entry whose magnitude is
// below tiny relative to its row's largest entry.
func Echelon(b []float64, k, n int, piv []int, tiny float64) {
	row := 0
	for col := 0; col < n && row < k; col++ {
		var big float64
		for i := row; i < k; i++ {
			for j := col; j < n; j++ {
				big = math.Max(big, math.Abs(b[i*n+j]))
			}
		}
		p, best := -1, 0.0
		for i := row; i < k; i++ {
			if a := math.Abs(b[i*n+col]); a > best {
				p, best = i, a
			}
		}
		if p < 0 || best <= pivotTol*big {
			continue
		}
		if p != row {
			swap(b[p*n:p*n+n], b[row*n:row*n+n])
		}
		r := b[row*n : row*n+n]
		inv := 1 / r[col]
		for j := range r {
			r[j] *= inv
		}
		r[col] = 1
		for i := 0; i < k; i++ {
			if i == row {
				continue
			}
			bi := b[i*n : i*n+n]
			if f := bi[col]; f != 0 {
				Axpy(-f, r, bi)
				bi[col] = 0
			}
		}
		piv[row] = col
		row++
	}
	for i := 0; i < k; i++ {
		bi := b[i*n : i*n+n]
		var big float64
		for _, x := range bi {
			big = math.Max(big, math.Abs(x))
		}
		for j, x := range bi {
			if math.Abs(x) < tiny*big {
				bi[j] = 0
			}
		}
	}
}
