package linalg

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// jacobiTol is the relative orthogonality at which a pair of columns counts as
// converged: |a_p·a_q| ≤ jacobiTol·|a_p|·|a_q|. A few units of the float64
// epsilon, as in Demmel & Veselić (1992), "Jacobi's method is more accurate
// than QR", SIAM J. Matrix Anal. Appl. 13(4), §4: this stopping test gives
// singular values with high relative accuracy.
const jacobiTol = 4 * 0x1p-52

// maxSweeps bounds the number of sweeps. One-sided Jacobi converges
// quadratically; matrices of the sizes used here need 5 to 8 sweeps, so 40 is
// reached only by non-finite input.
const maxSweeps = 40

// zeroTol is the norm, relative to the Frobenius norm of the matrix, below
// which a column counts as zero and is no longer rotated. Columns of a
// rank-deficient matrix converge to rounding noise of a few ε; rotating two
// such columns against each other would never meet the relative test above.
// 16ε leaves every singular value above RankTol of the callers untouched.
const zeroTol = 16 * 0x1p-52

// Jacobi orthogonalises the columns of the m×k matrix a in place by plane
// rotations from the right (Hestenes 1958, "Inversion of matrices by
// biorthogonalization", J. SIAM 6(1); rotation formulas of Rutishauser as in
// Demmel & Veselić 1992, Algorithm 4.1), so that on return a holds A·V with
// mutually orthogonal columns. The singular values of A are the column norms
// of the result, and its left singular vectors the normalised columns.
//
// If v is not nil it must have length k*k; it receives the orthogonal k×k
// matrix V (column-major), whose columns are the right singular vectors.
// a must have length m*k. Jacobi reports whether the rotations converged;
// they always do for finite input.
func Jacobi(a []float64, m, k int, v []float64) bool {
	a = a[:m*k]
	if v != nil {
		v = v[:k*k]
		for i := range v {
			v[i] = 0
		}
		for i := 0; i < k; i++ {
			v[i*k+i] = 1
		}
	}
	// Squared column norms, kept up to date through each sweep with the
	// exact updates α' = α − tγ, β' = β + tγ (Demmel & Veselić 1992, §4) and
	// recomputed at the start of the next.
	var normStack [8]float64
	var norm2 []float64
	if k <= len(normStack) {
		norm2 = normStack[:k]
	} else {
		norm2 = make([]float64, k)
	}
	frob := Norm(a)
	zero := zeroTol * zeroTol * frob * frob
	for sweep := 0; sweep < maxSweeps; sweep++ {
		for j := range norm2 {
			col := a[j*m : j*m+m]
			norm2[j] = Dot(col, col)
		}
		rotated := false
		for p := 0; p < k-1; p++ {
			ap := a[p*m : p*m+m]
			for q := p + 1; q < k; q++ {
				aq := a[q*m : q*m+m]
				aq = aq[:len(ap)]
				alpha, beta := norm2[p], norm2[q]
				if alpha <= zero || beta <= zero {
					continue
				}
				var gamma float64
				for i, x := range ap {
					gamma += x * aq[i]
				}
				if math.Abs(gamma) <= jacobiTol*math.Sqrt(alpha)*math.Sqrt(beta) {
					continue
				}
				rotated = true
				zeta := (beta - alpha) / (2 * gamma)
				t := math.Copysign(1, zeta) / (math.Abs(zeta) + math.Sqrt(1+zeta*zeta))
				c := 1 / math.Sqrt(1+t*t)
				s := c * t
				for i, x := range ap {
					y := aq[i]
					ap[i] = c*x - s*y
					aq[i] = s*x + c*y
				}
				norm2[p] = alpha - t*gamma
				norm2[q] = beta + t*gamma
				if v != nil {
					vp := v[p*k : p*k+k]
					vq := v[q*k : q*k+k]
					vq = vq[:len(vp)]
					for i, x := range vp {
						y := vq[i]
						vp[i] = c*x - s*y
						vq[i] = s*x + c*y
					}
				}
			}
		}
		if !rotated {
			return true
		}
	}
	return false
}

// SortColumns computes the column norms of the m×k matrix a into sigma and
// reorders the columns of a, the columns of the k×k matrix v (unless v is
// nil) and sigma so that sigma is in descending order. After Jacobi, sigma
// holds the singular values.
func SortColumns(a []float64, m, k int, v, sigma []float64) {
	for j := 0; j < k; j++ {
		sigma[j] = Norm(a[j*m : j*m+m])
	}
	for j := 0; j < k-1; j++ {
		best := j
		for i := j + 1; i < k; i++ {
			if sigma[i] > sigma[best] {
				best = i
			}
		}
		if best == j {
			continue
		}
		sigma[j], sigma[best] = sigma[best], sigma[j]
		swap(a[j*m:j*m+m], a[best*m:best*m+m])
		if v != nil {
			swap(v[j*k:j*k+k], v[best*k:best*k+k])
		}
	}
}

func swap(x, y []float64) {
	for i := range x {
		x[i], y[i] = y[i], x[i]
	}
}

// Norm returns the Euclidean norm of x, without overflow or underflow for
// finite x.
func Norm(x []float64) float64 {
	var ssq float64
	for _, v := range x {
		ssq += v * v
	}
	// Squares summed plainly are exact to rounding between these bounds
	// (the squares of numbers from about 1e-146 to 1e146 neither underflow
	// to subnormals nor overflow); outside them, rescale.
	if ssq > 0x1p-486 && ssq < 0x1p+486 {
		return math.Sqrt(ssq)
	}
	return scaledNorm(x)
}

// scaledNorm is the LAPACK dnrm2 recurrence (Blue's algorithm in its
// simplest form), safe for any finite x.
func scaledNorm(x []float64) float64 {
	var scale, ssq float64 = 0, 1
	for _, v := range x {
		if v == 0 {
			continue
		}
		av := math.Abs(v)
		if scale < av {
			ssq = 1 + ssq*(scale/av)*(scale/av)
			scale = av
		} else {
			ssq += (av / scale) * (av / scale)
		}
	}
	return scale * math.Sqrt(ssq)
}

// Dot returns x·y.
func Dot(x, y []float64) float64 {
	var s float64
	for i, v := range x {
		s += v * y[i]
	}
	return s
}

// Axpy sets y = y + alpha·x.
func Axpy(alpha float64, x, y []float64) {
	for i, v := range x {
		y[i] += alpha * v
	}
}

// Norm3 returns |v| without overflow or underflow for finite v: the square
// root of the sum of squares where that is exact to rounding (as in Norm),
// math.Hypot otherwise. It is several times faster than r3.Norm, which
// always takes two Hypot calls.
func Norm3(v r3.Vec) float64 {
	s := v.X*v.X + v.Y*v.Y + v.Z*v.Z
	if s > 0x1p-486 && s < 0x1p+486 {
		return math.Sqrt(s)
	}
	return math.Hypot(v.X, math.Hypot(v.Y, v.Z))
}
