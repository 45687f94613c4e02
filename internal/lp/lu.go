package lp

import "math"

// luSingularTol, times the largest entry of the basis, is the pivot at or
// below which factor reports the basis singular to working precision. The
// solver's columns are scaled to a largest entry between 1/2 and 1, so a
// pivot 1e-13 of that is some thousand ulps: a basis whose elimination
// leaves less has a condition number near 1/1e-13 and a solve with it
// would carry no correct digit in the smaller basic variables.
const luSingularTol = 1e-13

// luFactor factorises the m×m column-major matrix lu in place,
// P·M = L·U with partial pivoting (Golub & Van Loan, Matrix Computations,
// 4th ed., 2013, Algorithm 3.4.1): L unit lower triangular below the
// diagonal, U on and above it, perm[k] the row of M that became row k. It
// reports false if a pivot is at or below luSingularTol times the largest
// entry of M.
func luFactor(lu []float64, m int, perm []int) bool {
	var big float64
	for _, v := range lu[:m*m] {
		big = max(big, math.Abs(v))
	}
	for i := range m {
		perm[i] = i
	}
	for k := range m {
		p := k
		for r := k + 1; r < m; r++ {
			if math.Abs(lu[m*k+r]) > math.Abs(lu[m*k+p]) {
				p = r
			}
		}
		if !(math.Abs(lu[m*k+p]) > luSingularTol*big) {
			return false
		}
		if p != k {
			perm[k], perm[p] = perm[p], perm[k]
			for c := range m {
				lu[m*c+k], lu[m*c+p] = lu[m*c+p], lu[m*c+k]
			}
		}
		piv := lu[m*k+k]
		for r := k + 1; r < m; r++ {
			lu[m*k+r] /= piv
		}
		for c := k + 1; c < m; c++ {
			f := lu[m*c+k]
			if f == 0 {
				continue
			}
			col := lu[m*c : m*c+m]
			for r := k + 1; r < m; r++ {
				col[r] -= lu[m*k+r] * f
			}
		}
	}
	return true
}

// luSolve overwrites v with M⁻¹v for M factorised by luFactor, using y (of
// length m) as scratch.
func luSolve(lu []float64, m int, perm []int, v, y []float64) {
	for r := range m {
		y[r] = v[perm[r]]
	}
	for c := range m { // L: unit lower triangular, by columns
		if yc := y[c]; yc != 0 {
			for r := c + 1; r < m; r++ {
				y[r] -= lu[m*c+r] * yc
			}
		}
	}
	for c := m - 1; c >= 0; c-- { // U, by columns
		y[c] /= lu[m*c+c]
		if yc := y[c]; yc != 0 {
			for r := range c {
				y[r] -= lu[m*c+r] * yc
			}
		}
	}
	copy(v[:m], y[:m])
}

// luSolveT overwrites v with M⁻ᵀv for M factorised by luFactor:
// Mᵀ = Uᵀ·Lᵀ·P, using y (of length m) as scratch.
func luSolveT(lu []float64, m int, perm []int, v, y []float64) {
	copy(y[:m], v[:m])
	for r := range m { // Uᵀ is lower triangular: row r of Uᵀ is column r of U
		s := y[r]
		for c := range r {
			s -= lu[m*r+c] * y[c]
		}
		y[r] = s / lu[m*r+r]
	}
	for r := m - 1; r >= 0; r-- { // Lᵀ is unit upper triangular
		s := y[r]
		for c := r + 1; c < m; c++ {
			s -= lu[m*r+c] * y[c]
		}
		y[r] = s
	}
	for r := range m {
		v[perm[r]] = y[r]
	}
}
