package linalg

// SolvePSD3 solves s·x = b for the 3×3 symmetric positive semi-definite
// matrix s (column-major) in least squares, dropping the eigen-directions
// of s whose eigenvalue is at most tiny: the pseudo-inverse solution with
// that cut-off. It returns x and the number of directions kept.
//
// When no eigenvalue can be at or below tiny it takes the fast path of an
// LDLᵀ factorisation (Golub & Van Loan, Matrix Computations, 4th ed., 2013,
// Algorithm 4.1.2). The test: the eigenvalues sum to the trace T, so the
// two larger multiply to at most T²/4 and λmin ≥ det s / (T²/4); det s is
// the product of the pivots. Otherwise it takes the eigen-decomposition of s
// by one-sided Jacobi, whose singular values are then its eigenvalues.
func SolvePSD3(s [9]float64, b [3]float64, tiny float64) ([3]float64, int) {
	tr := s[0] + s[4] + s[8]
	if d0 := s[0]; d0 > 0 {
		l10, l20 := s[1]/d0, s[2]/d0
		if d1 := s[4] - l10*l10*d0; d1 > 0 {
			l21 := (s[5] - l20*l10*d0) / d1
			d2 := s[8] - l20*l20*d0 - l21*l21*d1
			if d0*d1*d2 > tiny*tr*tr/4 {
				y1 := b[1] - l10*b[0]
				y2 := b[2] - l20*b[0] - l21*y1
				z2 := y2 / d2
				z1 := y1/d1 - l21*z2
				z0 := b[0]/d0 - l10*z1 - l20*z2
				return [3]float64{z0, z1, z2}, 3
			}
		}
	}
	var v [9]float64
	var ev [3]float64
	Jacobi(s[:], 3, 3, v[:])
	SortColumns(s[:], 3, 3, v[:], ev[:])
	var x [3]float64
	kept := 0
	for j := 0; j < 3; j++ {
		if ev[j] <= tiny {
			break
		}
		kept++
		vj := v[3*j : 3*j+3]
		f := Dot(vj, b[:]) / ev[j]
		for i := range x {
			x[i] += f * vj[i]
		}
	}
	return x, kept
}
