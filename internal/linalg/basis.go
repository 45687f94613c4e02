package linalg

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
