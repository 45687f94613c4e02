package linalg

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// randomSPD6 returns a random symmetric positive definite 6×6 matrix with
// eigenvalues spread over the given ratio.
func randomSPD6(rnd *rand.Rand, ratio float64) [36]float64 {
	q := mat.NewDense(6, 6, nil)
	for i := range 6 {
		for j := range 6 {
			q.Set(i, j, rnd.NormFloat64())
		}
	}
	var qr mat.QR
	qr.Factorize(q)
	var o mat.Dense
	qr.QTo(&o)
	var a [36]float64
	for i := range 6 {
		for j := range 6 {
			var s float64
			for k := range 6 {
				lam := math.Pow(ratio, float64(k)/5)
				s += o.At(i, k) * lam * o.At(j, k)
			}
			a[6*i+j] = s
		}
	}
	for i := range 6 {
		for j := range i {
			a[6*j+i] = a[6*i+j]
		}
	}
	return a
}

// TestCholesky6 solves random SPD systems and compares with gonum's
// mat.Cholesky (the reference library).
func TestCholesky6(t *testing.T) {
	rnd := rand.New(rand.NewPCG(1, 2))
	for trial := 0; trial < 50; trial++ {
		a := randomSPD6(rnd, 1e6)
		var b [6]float64
		for i := range b {
			b[i] = rnd.NormFloat64()
		}
		sym := mat.NewSymDense(6, nil)
		for i := range 6 {
			for j := i; j < 6; j++ {
				sym.SetSym(i, j, a[6*i+j])
			}
		}
		var ch mat.Cholesky
		if !ch.Factorize(sym) {
			t.Fatal("gonum: not positive definite")
		}
		var want mat.VecDense
		if err := ch.SolveVecTo(&want, mat.NewVecDense(6, b[:])); err != nil {
			t.Fatal(err)
		}
		l := a
		if !Cholesky6(&l, 1e-14) {
			t.Fatal("Cholesky6 refused an SPD matrix")
		}
		CholeskySolve6(&l, &b)
		for i := range b {
			if d := math.Abs(b[i] - want.AtVec(i)); d > 1e-8*mat.Norm(&want, math.Inf(1)) {
				t.Errorf("trial %d: x[%d] = %g, gonum %g", trial, i, b[i], want.AtVec(i))
			}
		}
	}
	var z [36]float64
	if Cholesky6(&z, 1e-14) {
		t.Error("zero matrix factored")
	}
	ind := [36]float64{0: 1, 7: -1, 14: 1, 21: 1, 28: 1, 35: 1}
	if Cholesky6(&ind, 1e-14) {
		t.Error("indefinite matrix factored")
	}
}

// TestEigenSym6 compares eigenvalues with gonum's mat.EigenSym and checks
// A·v = λ·v and orthonormal vectors.
func TestEigenSym6(t *testing.T) {
	rnd := rand.New(rand.NewPCG(3, 4))
	for trial := 0; trial < 50; trial++ {
		a := randomSPD6(rnd, 1e8)
		sym := mat.NewSymDense(6, nil)
		for i := range 6 {
			for j := i; j < 6; j++ {
				sym.SetSym(i, j, a[6*i+j])
			}
		}
		var es mat.EigenSym
		if !es.Factorize(sym, false) {
			t.Fatal("gonum EigenSym failed")
		}
		want := es.Values(nil) // ascending
		work := a
		var v [36]float64
		var w [6]float64
		EigenSym6(&work, &v, &w)
		// The eigenvalues alone (v nil): the same to gonum's tolerance.
		work2 := a
		var w2 [6]float64
		EigenSym6(&work2, nil, &w2)
		for i := range w {
			if d := math.Abs(w[i] - want[i]); d > 1e-13*want[5] {
				t.Errorf("trial %d: λ%d = %.17g, gonum %.17g", trial, i, w[i], want[i])
			}
			if d := math.Abs(w2[i] - want[i]); d > 1e-13*want[5] {
				t.Errorf("trial %d: without vectors λ%d = %.17g, gonum %.17g", trial, i, w2[i], want[i])
			}
			// Residual |A v − λ v| relative to the largest eigenvalue.
			var r float64
			for k := range 6 {
				var s float64
				for j := range 6 {
					s += a[6*k+j] * v[6*j+i]
				}
				r = math.Max(r, math.Abs(s-w[i]*v[6*k+i]))
			}
			if r > 1e-13*want[5] {
				t.Errorf("trial %d: residual of pair %d is %g", trial, i, r)
			}
			for j := range 6 {
				var d float64
				for k := range 6 {
					d += v[6*k+i] * v[6*k+j]
				}
				want := 0.0
				if i == j {
					want = 1
				}
				if math.Abs(d-want) > 1e-14 {
					t.Errorf("trial %d: v%d·v%d = %g", trial, i, j, d)
				}
			}
		}
	}
}
