package linalg

import "math"

// Cholesky6 factors the symmetric positive definite 6×6 matrix a
// (row-major, only the lower triangle read) in place into its lower
// Cholesky factor L, a = L·Lᵀ (Golub & Van Loan, Matrix Computations, 4th
// ed., 2013, Algorithm 4.2.1). It reports false, leaving a partly
// overwritten, if a pivot is not positive or falls to tiny times the
// largest diagonal entry or below: the matrix is singular, or indefinite,
// to that relative precision.
func Cholesky6(a *[36]float64, tiny float64) bool {
	var big float64
	for i := range 6 {
		big = math.Max(big, a[7*i])
	}
	if !(big > 0) {
		return false
	}
	for j := range 6 {
		d := a[7*j]
		for k := range j {
			d -= a[6*j+k] * a[6*j+k]
		}
		if !(d > tiny*big) {
			return false
		}
		d = math.Sqrt(d)
		a[7*j] = d
		for i := j + 1; i < 6; i++ {
			s := a[6*i+j]
			for k := range j {
				s -= a[6*i+k] * a[6*j+k]
			}
			a[6*i+j] = s / d
		}
	}
	for i := range 6 {
		for j := i + 1; j < 6; j++ {
			a[6*i+j] = 0
		}
	}
	return true
}

// CholeskySolve6 solves L·Lᵀ·x = b in place in b, for the factor L of
// Cholesky6.
func CholeskySolve6(l *[36]float64, b *[6]float64) {
	for i := range 6 {
		s := b[i]
		for k := range i {
			s -= l[6*i+k] * b[k]
		}
		b[i] = s / l[7*i]
	}
	for i := 5; i >= 0; i-- {
		s := b[i]
		for k := i + 1; k < 6; k++ {
			s -= l[6*k+i] * b[k]
		}
		b[i] = s / l[7*i]
	}
}

// EigenSym6 returns the eigenvalues of the symmetric 6×6 matrix a
// (row-major, overwritten) in ascending order in w, and the eigenvectors
// as the columns of v (row-major: v[6*i+j] is component i of vector j),
// by the cyclic Jacobi method (Golub & Van Loan, 4th ed., Algorithm 8.5.3,
// with the rotation of §8.5.2 that keeps the tangent at most 1). Sweeps
// continue until every off-diagonal entry is below ε times the root of the
// product of its diagonal entries (the relative-accuracy criterion of
// Demmel & Veselić 1992, "Jacobi's method is more accurate than QR", SIAM
// J. Matrix Anal. Appl. 13(4)), at most 30 sweeps (convergence is
// quadratic; six sweeps suffice in practice). The eigenvalues are accurate
// to a small multiple of ε times the largest |eigenvalue|.
//
// With v nil it computes the eigenvalues alone (the same rotations, less
// than half the work).
func EigenSym6(a *[36]float64, v *[36]float64, w *[6]float64) {
	if v != nil {
		*v = [36]float64{}
		for i := range 6 {
			v[7*i] = 1
		}
	}
	const eps = 0x1p-52
	for sweep := 0; sweep < 30; sweep++ {
		rotated := false
		for p := 0; p < 5; p++ {
			for q := p + 1; q < 6; q++ {
				apq := a[6*p+q]
				app, aqq := a[7*p], a[7*q]
				if math.Abs(apq) <= eps*math.Sqrt(math.Abs(app*aqq)) || apq == 0 {
					continue
				}
				rotated = true
				theta := (aqq - app) / (2 * apq)
				t := 1 / (math.Abs(theta) + math.Sqrt(1+theta*theta))
				if theta < 0 {
					t = -t
				}
				c := 1 / math.Sqrt(1+t*t)
				s := t * c
				for k := range 6 {
					akp, akq := a[6*k+p], a[6*k+q]
					a[6*k+p], a[6*k+q] = c*akp-s*akq, s*akp+c*akq
				}
				for k := range 6 {
					apk, aqk := a[6*p+k], a[6*q+k]
					a[6*p+k], a[6*q+k] = c*apk-s*aqk, s*apk+c*aqk
				}
				if v == nil {
					continue
				}
				for k := range 6 {
					vkp, vkq := v[6*k+p], v[6*k+q]
					v[6*k+p], v[6*k+q] = c*vkp-s*vkq, s*vkp+c*vkq
				}
			}
		}
		if !rotated {
			break
		}
	}
	for i := range 6 {
		w[i] = a[7*i]
	}
	// Sort ascending, carrying the vectors (insertion sort of six).
	for i := 1; i < 6; i++ {
		for j := i; j > 0 && w[j] < w[j-1]; j-- {
			w[j], w[j-1] = w[j-1], w[j]
			if v == nil {
				continue
			}
			for k := range 6 {
				v[6*k+j], v[6*k+j-1] = v[6*k+j-1], v[6*k+j]
			}
		}
	}
}

// EigenvaluesSym6 returns in w, ascending, the eigenvalues of the
// symmetric 6×6 matrix a (row-major, overwritten), without eigenvectors:
// Householder reduction to tridiagonal form (Golub & Van Loan, Matrix
// Computations, 4th ed., 2013, Algorithm 8.3.1), then implicit symmetric
// QR steps with the Wilkinson shift (Algorithms 8.3.2 and 8.3.3), an
// off-diagonal entry counting as zero at or below ε times the sum of its
// two diagonal neighbours' magnitudes. The eigenvalues are accurate to a
// small multiple of ε times the largest |eigenvalue|, as EigenSym6's; the
// work is a fraction of Jacobi's. It reports false, with w unspecified,
// if the iteration did not converge in 30 steps per eigenvalue or a
// value is not finite.
func EigenvaluesSym6(a *[36]float64, w *[6]float64) bool {
	const eps = 0x1p-52
	// Householder: for k = 0..3, zero a[k+2:, k] (and a[k, k+2:]).
	for k := 0; k < 4; k++ {
		var v [6]float64
		var xx float64
		for i := k + 1; i < 6; i++ {
			v[i] = a[6*i+k]
			xx += v[i] * v[i]
		}
		tail := xx - v[k+1]*v[k+1]
		if tail == 0 {
			continue // already tridiagonal in this column
		}
		alpha := math.Sqrt(xx)
		if v[k+1] > 0 {
			alpha = -alpha
		}
		v[k+1] -= alpha
		vv := tail + v[k+1]*v[k+1]
		beta := 2 / vv
		// p = β·A₂₂v, q = p − (β/2)(vᵀp)v, A₂₂ ← A₂₂ − vqᵀ − qvᵀ.
		var p [6]float64
		var vp float64
		for i := k + 1; i < 6; i++ {
			var s float64
			for j := k + 1; j < 6; j++ {
				s += a[6*i+j] * v[j]
			}
			p[i] = beta * s
			vp += v[i] * p[i]
		}
		h := 0.5 * beta * vp
		for i := k + 1; i < 6; i++ {
			p[i] -= h * v[i]
		}
		for i := k + 1; i < 6; i++ {
			for j := k + 1; j < 6; j++ {
				a[6*i+j] -= v[i]*p[j] + p[i]*v[j]
			}
		}
		a[6*(k+1)+k], a[6*k+k+1] = alpha, alpha
		for i := k + 2; i < 6; i++ {
			a[6*i+k], a[6*k+i] = 0, 0
		}
	}
	var d [6]float64
	var e [6]float64 // e[i] couples i and i+1
	for i := range 6 {
		d[i] = a[7*i]
	}
	for i := range 5 {
		e[i] = a[6*(i+1)+i]
	}
	for steps := 0; ; steps++ {
		for i := range 5 {
			if math.Abs(e[i]) <= eps*(math.Abs(d[i])+math.Abs(d[i+1])) {
				e[i] = 0
			}
		}
		// The unreduced block [l, m] at the bottom.
		m := 5
		for m > 0 && e[m-1] == 0 {
			m--
		}
		if m == 0 {
			break
		}
		if steps >= 30*6 {
			return false
		}
		l := m - 1
		for l > 0 && e[l-1] != 0 {
			l--
		}
		// Wilkinson shift from the trailing 2×2 block.
		dd := 0.5 * (d[m-1] - d[m])
		em := e[m-1]
		r := hypot(dd, em)
		if dd < 0 {
			r = -r
		}
		mu := d[m] - em*em/(dd+r)
		// Implicit QR step with a bulge chased down the block: T ← GᵀTG.
		x, z := d[l]-mu, e[l]
		var bulge float64
		for k := l; k < m; k++ {
			c, s := 1.0, 0.0
			if rr := hypot(x, z); rr != 0 {
				inv := 1 / rr
				c, s = x*inv, -z*inv
			}
			if k > l {
				e[k-1] = c*e[k-1] - s*bulge
			}
			// Rows and columns k, k+1 of the tridiagonal block.
			dk, dk1, ek := d[k], d[k+1], e[k]
			d[k] = c*c*dk - 2*c*s*ek + s*s*dk1
			d[k+1] = s*s*dk + 2*c*s*ek + c*c*dk1
			e[k] = c*s*(dk-dk1) + (c*c-s*s)*ek
			if k+1 < m {
				bulge = -s * e[k+1]
				e[k+1] *= c
				x, z = e[k], bulge
			}
		}
	}
	*w = d
	for i := 1; i < 6; i++ {
		for j := i; j > 0 && w[j] < w[j-1]; j-- {
			w[j], w[j-1] = w[j-1], w[j]
		}
	}
	for _, x := range w {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// hypot is math.Hypot, by the plain formula where the squares can neither
// overflow nor lose digits to underflow.
func hypot(x, y float64) float64 {
	s := x*x + y*y
	if s > 0x1p-900 && s < 0x1p+900 {
		return math.Sqrt(s)
	}
	return math.Hypot(x, y)
}
