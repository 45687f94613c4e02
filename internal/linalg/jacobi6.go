package linalg

import "math"

// Jacobi6 is Jacobi for a matrix of six rows and k ≤ 6 columns held in the
// first 6k entries of a, without V: the hot path of constraint analysis.
//
// It differs from Jacobi in ways that change no result beyond rounding.
// Fixed sizes let the compiler drop bounds checks. Each sweep visits the
// pairs in round-robin ("parallel") order (Brent & Luk 1985, "The solution
// of singular-value and symmetric eigenvalue problems on multiprocessor
// arrays", SIAM J. Sci. Stat. Comput. 6(1)), so that consecutive rotations
// touch disjoint columns and the processor overlaps them. Rotations by
// angles below 5e-5 use the series their size allows, and a sweep made only
// of rotations below 5e-9 ends the iteration. And the rotation is computed from d = β − α and r = √(d² + 4γ²) as
// t = sign(d)·2γ/(|d| + r), c = √((|d| + r)/(2r)), which is Rutishauser's
// t = sign(ζ)/(|ζ| + √(1 + ζ²)), ζ = d/(2γ), c = 1/√(1 + t²) rewritten with
// fewer dependent divisions and square roots. The convergence test is
// squared (γ² ≤ tol²·α·β), safe because callers pass columns of norm at
// most √6 (the columns, or the rows, of six columns of unit norm).
func Jacobi6(a *[36]float64, k int) bool {
	var cols [6]*[6]float64
	for j := range cols {
		cols[j] = (*[6]float64)(a[6*j : 6*j+6])
	}
	pairs := roundRobin[k]
	var norm2 [6]float64
	var frob2 float64
	for j := 0; j < k; j++ {
		norm2[j] = dot6(cols[j], cols[j])
		frob2 += norm2[j]
	}
	zero := zeroTol * zeroTol * frob2
	const tol2 = jacobiTol * jacobiTol
	for sweep := 0; sweep < maxSweeps; sweep++ {
		if sweep > 0 {
			for j := 0; j < k; j++ {
				norm2[j] = dot6(cols[j], cols[j])
			}
		}
		rotated, large := false, false
		for _, round := range pairs {
			for _, pq := range round {
				p, q := pq[0], pq[1]
				ap, aq := cols[p], cols[q]
				alpha, beta := norm2[p], norm2[q]
				if alpha <= zero || beta <= zero {
					continue
				}
				gamma := dot6(ap, aq)
				if gamma*gamma <= tol2*alpha*beta {
					continue
				}
				rotated = true
				d := beta - alpha
				var t, c float64
				if g2 := 2 * gamma; math.Abs(g2) < smallAngle*math.Abs(d) {
					// x = 2γ/d is small: t = x/(1 + √(1 + x²)) and
					// c = 1/√(1 + t²) by their series, whose next terms
					// (x⁵/32, 3t⁴/8) are below 1e-17 for |x| < 1e-4.
					x := g2 / d
					t = 0.5 * x * (1 - 0.25*x*x)
					c = 1 - 0.5*t*t
					if math.Abs(x) >= 1e-8 {
						large = true
					}
				} else {
					large = true
					r := math.Sqrt(d*d + g2*g2)
					u := math.Abs(d) + r
					// sign(d) by a multiplication, exact, rather than a
					// branch that the data make unpredictable (d = 0 gives
					// +1; d is never −0, as α and β are positive).
					t = g2 / u * math.Copysign(1, d)
					c = math.Sqrt(u / (2 * r))
				}
				s := c * t
				for i := 0; i < 6; i++ {
					x, y := ap[i], aq[i]
					ap[i] = c*x - s*y
					aq[i] = s*x + c*y
				}
				norm2[p] -= t * gamma
				norm2[q] += t * gamma
			}
		}
		// A sweep of rotations by angles below 1e-8 leaves cosines of order
		// 1e-16 between the columns, under the tolerance: stop without the
		// sweep that would only confirm it.
		if !rotated || !large {
			return true
		}
	}
	return false
}

// roundRobin[k] lists the k(k−1)/2 column pairs of a sweep over k columns,
// in rounds of at most three disjoint pairs (the circle method of a
// round-robin tournament).
var roundRobin = func() (tab [7][][][2]int) {
	for k := 2; k <= 6; k++ {
		n := k + k%2 // an odd k plays against a dummy column n−1 = k
		ring := make([]int, n)
		for i := range ring {
			ring[i] = i
		}
		for round := 0; round < n-1; round++ {
			var pairs [][2]int
			for i := 0; i < n/2; i++ {
				p, q := ring[i], ring[n-1-i]
				if p >= k || q >= k {
					continue
				}
				if p > q {
					p, q = q, p
				}
				pairs = append(pairs, [2]int{p, q})
			}
			tab[k] = append(tab[k], pairs)
			// Keep ring[0], rotate the rest by one.
			last := ring[n-1]
			copy(ring[2:], ring[1:n-1])
			ring[1] = last
		}
	}
	return tab
}()

// Sort6 computes the norms of the k columns of a (six rows each, as for
// Jacobi6) into sigma and reorders the columns so that sigma descends.
// After Jacobi6 these are the singular values and the columns A·V.
func Sort6(a *[36]float64, k int, sigma *[6]float64) {
	var cols [6]*[6]float64
	for j := range cols {
		cols[j] = (*[6]float64)(a[6*j : 6*j+6])
	}
	for j := 0; j < k; j++ {
		sigma[j] = math.Sqrt(dot6(cols[j], cols[j]))
	}
	for j := 1; j < k; j++ {
		for i := j; i > 0 && sigma[i] > sigma[i-1]; i-- {
			sigma[i], sigma[i-1] = sigma[i-1], sigma[i]
			*cols[i], *cols[i-1] = *cols[i-1], *cols[i]
		}
	}
}

// smallAngle bounds x = 2γ/d for the short rotation formulas, which
// replace two square roots and a division by series exact to rounding.
// Rotations with |x| below 1e-8 (|t| < 5e-9) count as negligible for the
// stopping test.
const smallAngle = 1e-4

func dot6(x, y *[6]float64) float64 {
	return (x[0]*y[0] + x[1]*y[1]) + (x[2]*y[2] + x[3]*y[3]) + (x[4]*y[4] + x[5]*y[5])
}
