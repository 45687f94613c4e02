package constraint

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// TestLeastSquaresPoint checks the point nearest to a set of lines against
// gonum's general least-squares solver (mat.Dense.Solve, QR-based) applied
// to the stacked system (I − dᵢdᵢᵀ) c = (I − dᵢdᵢᵀ) pᵢ, on sets that take
// the LDLᵀ path and sets that take the eigen-decomposition path.
func TestLeastSquaresPoint(t *testing.T) {
	rng := rand.New(rand.NewPCG(31, 37))
	for trial := 0; trial < 200; trial++ {
		n := 2 + trial%5
		// Directions spread about z: widely and narrowly (the LDLᵀ path;
		// the problem's condition number is about 1/spread², and both
		// solvers lose that many digits), and so narrowly (1e-5 rad) that
		// the smallest eigenvalue of S falls below centreTol·n and is
		// dropped (the eigen-decomposition path).
		spread, tol := 1.0, 1e-12
		switch trial % 3 {
		case 1:
			spread, tol = 0.05, 1e-10
		case 2:
			spread, tol = 1e-5, 1e-12
		}
		var s [9]float64
		var b r3.Vec
		a := mat.NewDense(3*n, 3, nil)
		rhs := mat.NewVecDense(3*n, nil)
		for i := 0; i < n; i++ {
			d := r3.Unit(r3.Add(r3.Vec{Z: 1}, r3.Scale(spread, randVec(rng))))
			p := randVec(rng)
			p = r3.Sub(p, r3.Scale(r3.Dot(p, d), d)) // the point nearest the origin
			dd := [3]float64{d.X, d.Y, d.Z}
			pp := [3]float64{p.X, p.Y, p.Z}
			for r := 0; r < 3; r++ {
				for k := 0; k < 3; k++ {
					pr := -dd[r] * dd[k]
					if r == k {
						pr++
					}
					s[k*3+r] += pr
					a.Set(3*i+r, k, pr)
					rhs.SetVec(3*i+r, rhs.AtVec(3*i+r)+pr*pp[k])
				}
			}
			b = r3.Add(b, p)
		}
		f := linalg.FactorPSD3(&s, centreTol*float64(n))
		got := solve3(&f, b)
		var w r3.Vec
		if spread > 1e-4 {
			var want mat.VecDense
			if err := want.SolveVec(a, rhs); err != nil {
				t.Fatal(err)
			}
			w = r3.Vec{X: want.AtVec(0), Y: want.AtVec(1), Z: want.AtVec(2)}
		} else {
			// Pseudo-inverse solution from gonum's SVD of the stacked
			// system, with the cut-off of centreTol on the eigenvalues of
			// S = AᵀA (the squared singular values of A).
			var svd mat.SVD
			if !svd.Factorize(a, mat.SVDThin) {
				t.Fatal("gonum SVD failed")
			}
			var u, v mat.Dense
			svd.UTo(&u)
			svd.VTo(&v)
			sv := svd.Values(nil)
			for j, sj := range sv {
				if sj*sj <= centreTol*float64(n) {
					continue
				}
				coef := mat.Dot(u.ColView(j), rhs) / sj
				w = r3.Add(w, r3.Scale(coef, r3.Vec{X: v.At(0, j), Y: v.At(1, j), Z: v.At(2, j)}))
			}
		}
		if d := r3.Norm(r3.Sub(got, w)); d > tol*math.Max(1, r3.Norm(w)) {
			t.Errorf("trial %d: point %v, gonum %v", trial, got, w)
		}
	}
}
