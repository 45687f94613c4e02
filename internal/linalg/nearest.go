package linalg

import "gonum.org/v1/gonum/spatial/r3"

// NearestPoint accumulates lines and finds the point nearest to all of them
// in least squares: the x that minimises Σ |(I − dᵢdᵢᵀ)(x − pᵢ)|², the sum
// of squared distances from x to the lines through pᵢ along the unit
// directions dᵢ. Its zero value holds no lines.
//
// The normal equations are Σ(I − dᵢdᵢᵀ) x = Σ(I − dᵢdᵢᵀ) pᵢ; the 3×3 matrix
// is symmetric positive semi-definite with eigenvalues in [0, n] for n
// lines, and singular exactly when every line is parallel to one direction
// (then the nearest points form a line along it).
type NearestPoint struct {
	s [9]float64 // Σ(I − ddᵀ), column-major
	b r3.Vec     // Σ(I − ddᵀ)p
	n int
}

// Add adds the line through p along the unit direction d.
func (q *NearestPoint) Add(p, d r3.Vec) {
	dd := [3]float64{d.X, d.Y, d.Z}
	for r := 0; r < 3; r++ {
		for k := 0; k < 3; k++ {
			q.s[k*3+r] -= dd[r] * dd[k]
		}
		q.s[r*3+r]++
	}
	q.b = r3.Add(q.b, r3.Sub(p, r3.Scale(r3.Dot(d, p), d)))
	q.n++
}

// Len returns the number of lines added.
func (q *NearestPoint) Len() int { return q.n }

// Solve returns the nearest point and the rank kept: eigen-directions of
// Σ(I − dᵢdᵢᵀ) whose eigenvalue is at most tiny are dropped (the
// pseudo-inverse solution), so that for lines parallel within about
// √(tiny/n) rad the point moves along their common direction to the one
// nearest the origin. With no lines it returns the origin and 0.
func (q *NearestPoint) Solve(tiny float64) (r3.Vec, int) {
	if q.n == 0 {
		return r3.Vec{}, 0
	}
	x, rank := SolvePSD3(q.s, [3]float64{q.b.X, q.b.Y, q.b.Z}, tiny)
	return r3.Vec{X: x[0], Y: x[1], Z: x[2]}, rank
}
