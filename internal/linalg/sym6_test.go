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
		// The eigenvalues alone (v nil, and by the tridiagonal QR): the
		// same to gonum's tolerance.
		work2 := a
		var w2 [6]float64
		EigenSym6(&work2, nil, &w2)
		work3 := a
		var w3 [6]float64
		if !EigenvaluesSym6(&work3, &w3) {
			t.Fatalf("trial %d: EigenvaluesSym6 did not converge", trial)
		}
		for i := range w {
			if d := math.Abs(w[i] - want[i]); d > 1e-13*want[5] {
				t.Errorf("trial %d: λ%d = %.17g, gonum %.17g", trial, i, w[i], want[i])
			}
			if d := math.Abs(w2[i] - want[i]); d > 1e-13*want[5] {
				t.Errorf("trial %d: without vectors λ%d = %.17g, gonum %.17g", trial, i, w2[i], want[i])
			}
			if d := math.Abs(w3[i] - want[i]); d > 1e-13*want[5] {
				t.Errorf("trial %d: tridiagonal QR λ%d = %.17g, gonum %.17g", trial, i, w3[i], want[i])
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

// TestEigenvaluesSym6Special checks the tridiagonal QR on matrices whose
// eigenvalues are known in closed form, and on symmetric indefinite ones
// against gonum's mat.EigenSym.
func TestEigenvaluesSym6Special(t *testing.T) {
	// tridiag(−1, 2, −1) of order n has eigenvalues 2 − 2cos(kπ/(n+1)),
	// k = 1..n (the second-difference matrix; Golub & Van Loan, Matrix
	// Computations, 4th ed., 2013, §4.8.3). Given in a rotated basis too
	// (QᵀTQ with Q a product of plane rotations), so that the reduction
	// has work to do.
	var tri [36]float64
	for i := range 6 {
		tri[7*i] = 2
		if i < 5 {
			tri[6*i+i+1], tri[6*(i+1)+i] = -1, -1
		}
	}
	rot := tri
	for _, pq := range [][2]int{{0, 3}, {1, 5}, {2, 4}, {0, 5}, {3, 4}} {
		p, q := pq[0], pq[1]
		c, s := math.Cos(0.7), math.Sin(0.7)
		for k := range 6 {
			x, y := rot[6*k+p], rot[6*k+q]
			rot[6*k+p], rot[6*k+q] = c*x-s*y, s*x+c*y
		}
		for k := range 6 {
			x, y := rot[6*p+k], rot[6*q+k]
			rot[6*p+k], rot[6*q+k] = c*x-s*y, s*x+c*y
		}
	}
	for name, m := range map[string][36]float64{"tridiagonal": tri, "rotated": rot} {
		var w [6]float64
		if !EigenvaluesSym6(&m, &w) {
			t.Fatalf("%s: did not converge", name)
		}
		for k := 1; k <= 6; k++ {
			want := 2 - 2*math.Cos(float64(k)*math.Pi/7)
			if d := math.Abs(w[k-1] - want); d > 1e-14*4 {
				t.Errorf("%s: λ%d = %.17g, want %.17g", name, k, w[k-1], want)
			}
		}
	}
	// The identity (every off-diagonal zero already) and a diagonal
	// matrix out of order.
	id := [36]float64{}
	dg := [36]float64{}
	for i := range 6 {
		id[7*i] = 1
		dg[7*i] = float64(5 - i)
	}
	var w [6]float64
	if !EigenvaluesSym6(&id, &w) || w != [6]float64{1, 1, 1, 1, 1, 1} {
		t.Errorf("identity: %v", w)
	}
	if !EigenvaluesSym6(&dg, &w) || w != [6]float64{0, 1, 2, 3, 4, 5} {
		t.Errorf("diagonal: %v", w)
	}
	// Symmetric indefinite, against gonum.
	rnd := rand.New(rand.NewPCG(8, 9))
	for trial := 0; trial < 50; trial++ {
		var a [36]float64
		sym := mat.NewSymDense(6, nil)
		for i := range 6 {
			for j := i; j < 6; j++ {
				x := 2*rnd.Float64() - 1
				a[6*i+j], a[6*j+i] = x, x
				sym.SetSym(i, j, x)
			}
		}
		var es mat.EigenSym
		if !es.Factorize(sym, false) {
			t.Fatal("gonum EigenSym failed")
		}
		want := es.Values(nil)
		big := math.Max(math.Abs(want[0]), math.Abs(want[5]))
		if !EigenvaluesSym6(&a, &w) {
			t.Fatalf("trial %d: did not converge", trial)
		}
		for i := range w {
			if d := math.Abs(w[i] - want[i]); d > 1e-14*big {
				t.Errorf("trial %d: λ%d = %.17g, gonum %.17g", trial, i, w[i], want[i])
			}
		}
	}
}

func BenchmarkEigenvaluesSym6(b *testing.B) {
	rnd := rand.New(rand.NewPCG(3, 4))
	a := randomSPD6(rnd, 1e4)
	var w [6]float64
	for b.Loop() {
		m := a
		EigenvaluesSym6(&m, &w)
	}
}

func BenchmarkEigenSym6NoVectors(b *testing.B) {
	rnd := rand.New(rand.NewPCG(3, 4))
	a := randomSPD6(rnd, 1e4)
	var w [6]float64
	for b.Loop() {
		m := a
		EigenSym6(&m, nil, &w)
	}
}
