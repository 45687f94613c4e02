package linalg

// SolvePSD3 solves s·x = b for the 3×3 symmetric positive semi-definite
// matrix s (column-major) in least squares, dropping the eigen-directions
// of s whose eigenvalue is at most tiny: the pseudo-inverse solution with
// that cut-off. It returns x and the number of directions kept. It is
// FactorPSD3 followed by one Solve.
func SolvePSD3(s [9]float64, b [3]float64, tiny float64) ([3]float64, int) {
	f := FactorPSD3(&s, tiny)
	return f.Solve(b), f.Kept
}

// PSD3 is a factorisation of a 3×3 symmetric positive semi-definite
// matrix, made by FactorPSD3, for solving with several right-hand sides.
type PSD3 struct {
	// Kept is the number of eigen-directions the solutions use: 3 unless
	// an eigenvalue is at most the cut-off.
	Kept int

	ldl           bool
	l10, l20, l21 float64    // unit lower triangle of LDLᵀ
	d0, d1, d2    float64    // its diagonal
	v             [9]float64 // eigenvectors (columns), when not LDLᵀ
	ev            [3]float64 // eigenvalues, descending
}

// FactorPSD3 factors the 3×3 symmetric positive semi-definite s
// (column-major) for the pseudo-inverse solutions of s·x = b that drop the
// eigen-directions whose eigenvalue is at most tiny.
//
// When no eigenvalue can be at or below tiny it takes the fast path of an
// LDLᵀ factorisation (Golub & Van Loan, Matrix Computations, 4th ed., 2013,
// Algorithm 4.1.2). The test: the eigenvalues sum to the trace T, so the
// two larger multiply to at most T²/4 and λmin ≥ det s / (T²/4); det s is
// the product of the pivots. Otherwise it takes the eigen-decomposition of s
// by one-sided Jacobi, whose singular values are then its eigenvalues.
func FactorPSD3(s *[9]float64, tiny float64) PSD3 {
	tr := s[0] + s[4] + s[8]
	if d0 := s[0]; d0 > 0 {
		l10, l20 := s[1]/d0, s[2]/d0
		if d1 := s[4] - l10*l10*d0; d1 > 0 {
			l21 := (s[5] - l20*l10*d0) / d1
			d2 := s[8] - l20*l20*d0 - l21*l21*d1
			if d0*d1*d2 > tiny*tr*tr/4 {
				return PSD3{Kept: 3, ldl: true, l10: l10, l20: l20, l21: l21, d0: d0, d1: d1, d2: d2}
			}
		}
	}
	f := PSD3{v: *s}
	var v [9]float64
	Jacobi(f.v[:], 3, 3, v[:])
	SortColumns(f.v[:], 3, 3, v[:], f.ev[:])
	f.v = v
	for f.Kept < 3 && f.ev[f.Kept] > tiny {
		f.Kept++
	}
	return f
}

// Solve returns the solution of s·x = b for the factored s.
func (f *PSD3) Solve(b [3]float64) [3]float64 {
	if f.ldl {
		y1 := b[1] - f.l10*b[0]
		y2 := b[2] - f.l20*b[0] - f.l21*y1
		z2 := y2 / f.d2
		z1 := y1/f.d1 - f.l21*z2
		z0 := b[0]/f.d0 - f.l10*z1 - f.l20*z2
		return [3]float64{z0, z1, z2}
	}
	var x [3]float64
	for j := 0; j < f.Kept; j++ {
		vj := f.v[3*j : 3*j+3]
		c := Dot(vj, b[:]) / f.ev[j]
		for i := range x {
			x[i] += c * vj[i]
		}
	}
	return x
}
