package linalg

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"
)

// randMatrix returns an m×k column-major matrix with entries in [-1, 1) and,
// if rank < min(m, k), rank-deficient: its columns beyond rank are random
// combinations of the first rank columns.
func randMatrix(rng *rand.Rand, m, k, rank int) []float64 {
	a := make([]float64, m*k)
	for j := 0; j < k; j++ {
		col := a[j*m : j*m+m]
		if j < rank {
			for i := range col {
				col[i] = 2*rng.Float64() - 1
			}
			continue
		}
		for l := 0; l < rank; l++ {
			Axpy(2*rng.Float64()-1, a[l*m:l*m+m], col)
		}
	}
	return a
}

// TestJacobiAgainstGonum checks the singular values against gonum's
// LAPACK-based mat.SVD (a general-purpose reference implementation), and the
// factors by rebuilding A = B·Vᵀ and checking VᵀV = I.
func TestJacobiAgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	shapes := []struct{ m, k, rank int }{
		{6, 6, 6}, {12, 6, 6}, {7, 6, 6}, {6, 6, 5}, {6, 6, 3}, {12, 6, 4},
		{3, 6, 3}, {5, 6, 5}, {3, 3, 3}, {3, 2, 1}, {20, 6, 6},
	}
	for _, sh := range shapes {
		for trial := 0; trial < 50; trial++ {
			a := randMatrix(rng, sh.m, sh.k, sh.rank)
			orig := append([]float64(nil), a...)
			v := make([]float64, sh.k*sh.k)
			sigma := make([]float64, sh.k)
			if !Jacobi(a, sh.m, sh.k, v) {
				t.Fatalf("%v: no convergence", sh)
			}
			SortColumns(a, sh.m, sh.k, v, sigma)

			// Reference: gonum's SVD of the same matrix (row-major Dense).
			d := mat.NewDense(sh.m, sh.k, nil)
			for i := 0; i < sh.m; i++ {
				for j := 0; j < sh.k; j++ {
					d.Set(i, j, orig[j*sh.m+i])
				}
			}
			var svd mat.SVD
			if !svd.Factorize(d, mat.SVDNone) {
				t.Fatal("gonum SVD failed")
			}
			want := svd.Values(nil)
			for j := 0; j < sh.k; j++ {
				w := 0.0
				if j < len(want) {
					w = want[j]
				}
				if math.Abs(sigma[j]-w) > 1e-13*want[0] {
					t.Errorf("%v: sigma[%d] = %.17g, gonum %.17g", sh, j, sigma[j], w)
				}
			}
			// A = B Vᵀ, since B = A V with V orthogonal.
			for i := 0; i < sh.m; i++ {
				for j := 0; j < sh.k; j++ {
					var s float64
					for l := 0; l < sh.k; l++ {
						s += a[l*sh.m+i] * v[l*sh.k+j]
					}
					if math.Abs(s-orig[j*sh.m+i]) > 1e-14*float64(sh.k) {
						t.Fatalf("%v: rebuilt A[%d,%d] = %g, want %g", sh, i, j, s, orig[j*sh.m+i])
					}
				}
			}
			checkOrthonormal(t, v, sh.k, sh.k)
			// Columns of B are mutually orthogonal.
			for p := 0; p < sh.k; p++ {
				for q := p + 1; q < sh.k; q++ {
					g := Dot(a[p*sh.m:p*sh.m+sh.m], a[q*sh.m:q*sh.m+sh.m])
					if math.Abs(g) > 1e-14*want[0]*want[0] {
						t.Fatalf("%v: columns %d, %d not orthogonal: %g", sh, p, q, g)
					}
				}
			}
		}
	}
}

// checkOrthonormal checks that the k columns of the n×k column-major q are
// orthonormal to 1e-14.
func checkOrthonormal(t *testing.T, q []float64, n, k int) {
	t.Helper()
	for p := 0; p < k; p++ {
		for r := p; r < k; r++ {
			want := 0.0
			if p == r {
				want = 1
			}
			if g := Dot(q[p*n:p*n+n], q[r*n:r*n+n]); math.Abs(g-want) > 1e-14 {
				t.Fatalf("columns %d, %d: dot %g, want %g", p, r, g, want)
			}
		}
	}
}

func TestJacobiDiagonal(t *testing.T) {
	// A diagonal matrix is its own SVD (closed form): no rotation is needed.
	a := []float64{3, 0, 0, 0, 5, 0, 0, 0, 1}
	v := make([]float64, 9)
	sigma := make([]float64, 3)
	Jacobi(a, 3, 3, v)
	SortColumns(a, 3, 3, v, sigma)
	want := []float64{5, 3, 1}
	for i := range want {
		if sigma[i] != want[i] {
			t.Errorf("sigma[%d] = %g, want %g", i, sigma[i], want[i])
		}
	}
}

func TestComplete(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for _, n := range []int{1, 2, 6, 7, 12} {
		for r := 0; r <= n; r++ {
			q := make([]float64, n*n)
			// First r columns: an orthonormal set from a random matrix's
			// Jacobi SVD (left vectors B_j/σ_j).
			if r > 0 {
				a := randMatrix(rng, n, r, r)
				v := make([]float64, r*r)
				sigma := make([]float64, r)
				Jacobi(a, n, r, v)
				SortColumns(a, n, r, v, sigma)
				for j := 0; j < r; j++ {
					for i := 0; i < n; i++ {
						q[j*n+i] = a[j*n+i] / sigma[j]
					}
				}
			}
			Complete(q, n, r)
			checkOrthonormal(t, q, n, n)
		}
	}
}

func TestNorm(t *testing.T) {
	// Values whose squares overflow or underflow: |(3, 4)|·s = 5·s exactly.
	for _, s := range []float64{1, 1e300, 1e-300} {
		if got := Norm([]float64{3 * s, 4 * s}); math.Abs(got-5*s) > 1e-15*5*s {
			t.Errorf("Norm(3s, 4s) with s=%g = %g, want %g", s, got, 5*s)
		}
	}
	if got := Norm(nil); got != 0 {
		t.Errorf("Norm(nil) = %g", got)
	}
}

// TestQRPivot checks that (AΠ)ᵀ(AΠ) = RᵀR (the factorisation, without Q),
// that |R_rr| does not increase, and that Rᵀ has the singular values of A
// (reference: gonum's mat.SVD).
func TestQRPivot(t *testing.T) {
	rng := rand.New(rand.NewPCG(21, 22))
	for _, sh := range []struct{ m, rank int }{{6, 6}, {12, 6}, {7, 5}, {4, 4}, {6, 3}, {1, 1}, {20, 6}} {
		for trial := 0; trial < 30; trial++ {
			a := randMatrix(rng, sh.m, 6, sh.rank)
			orig := append([]float64(nil), a...)
			var rt [36]float64
			var perm [6]int
			QRPivot(a, sh.m, &rt, &perm)
			k := min(sh.m, 6)
			for r := 1; r < k; r++ {
				if math.Abs(rt[r*6+r]) > math.Abs(rt[(r-1)*6+r-1])*(1+1e-12) {
					t.Fatalf("%v: |R[%d,%d]| increases", sh, r, r)
				}
			}
			// AᵀA (6×6) against Π·(R ᵀR)·Πᵀ, where (RᵀR)[c][d] = Σ_r R[r][c]·R[r][d].
			for c := 0; c < 6; c++ {
				for d := 0; d < 6; d++ {
					var want, got float64
					for i := 0; i < sh.m; i++ {
						want += orig[perm[c]*sh.m+i] * orig[perm[d]*sh.m+i]
					}
					for r := 0; r < k; r++ {
						got += rt[r*6+c] * rt[r*6+d]
					}
					if math.Abs(got-want) > 1e-13*float64(sh.m) {
						t.Fatalf("%v: (AΠ)ᵀ(AΠ)[%d,%d] = %g, RᵀR gives %g", sh, c, d, want, got)
					}
				}
			}
			// Singular values of Rᵀ against gonum's SVD of A.
			Jacobi6(&rt, k)
			sigma := make([]float64, k)
			SortColumns(rt[:], 6, k, nil, sigma)
			d := mat.NewDense(sh.m, 6, nil)
			for i := 0; i < sh.m; i++ {
				for j := 0; j < 6; j++ {
					d.Set(i, j, orig[j*sh.m+i])
				}
			}
			var svd mat.SVD
			svd.Factorize(d, mat.SVDNone)
			want := svd.Values(nil)
			for j := 0; j < k; j++ {
				if math.Abs(sigma[j]-want[j]) > 1e-13*want[0] {
					t.Errorf("%v: sigma[%d] = %.17g, gonum %.17g", sh, j, sigma[j], want[j])
				}
			}
		}
	}
}

// TestInverse6 checks A·A⁻¹ = I and the inverse against gonum's
// mat.Dense.Inverse (a reference LAPACK-based implementation).
func TestInverse6(t *testing.T) {
	rng := rand.New(rand.NewPCG(41, 43))
	for trial := 0; trial < 200; trial++ {
		src := randMatrix(rng, 6, 6, 6)
		var a [36]float64
		copy(a[:], src)
		if !Inverse6(&a, 0) {
			t.Fatal("Inverse6 failed on a random matrix")
		}
		d := mat.NewDense(6, 6, nil)
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				d.Set(i, j, src[j*6+i])
			}
		}
		var want mat.Dense
		if err := want.Inverse(d); err != nil {
			continue // too ill-conditioned for a comparison
		}
		cond := mat.Cond(d, 2)
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				if diff := math.Abs(a[j*6+i] - want.At(i, j)); diff > 1e-14*cond*math.Max(1, math.Abs(want.At(i, j))) {
					t.Fatalf("trial %d: inverse[%d,%d] = %g, gonum %g (cond %g)", trial, i, j, a[j*6+i], want.At(i, j), cond)
				}
			}
		}
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				var s float64
				for k := 0; k < 6; k++ {
					s += src[k*6+i] * a[j*6+k]
				}
				w := 0.0
				if i == j {
					w = 1
				}
				if math.Abs(s-w) > 1e-13*cond {
					t.Fatalf("trial %d: (A·A⁻¹)[%d,%d] = %g", trial, i, j, s)
				}
			}
		}
	}
	// A singular matrix (two equal columns) is reported.
	var a [36]float64
	for i := 0; i < 6; i++ {
		a[i*6+i] = 1
	}
	a[1*6+0], a[1*6+1] = 1, 0 // column 1 = column 0
	if Inverse6(&a, 1e-12) {
		t.Error("Inverse6 inverted a singular matrix")
	}

	// Singular to within rounding, and just regular: A = s·L·U with L unit
	// lower triangular (entries ±1/4, ±1/2) and U upper triangular with
	// small integers, its diagonal powers of two and u₅₅ = 0, so rank 5.
	// Every entry, every multiplier and every division by a pivot is a
	// short dyadic number: elimination is exact and, since |lᵢₖ| < 1, takes
	// the pivots in order without swapping rows (|lᵢₖ uₖₖ| < |uₖₖ|), so
	// they are s·uₖₖ and the last one is 0. Adding η to A₅₅ makes the last
	// pivot η to within half an ulp of A₅₅ (the one rounding, by hand).
	// The documented test is pivot ≤ tiny × (largest |entry| of its
	// column): η = 1e-14·colMax is below tiny = 1e-12 (singular: false,
	// a unchanged), η = 1e-10·colMax above it (inverted, and agreeing with
	// gonum). The scale s = 2^±20 makes the threshold relative.
	l := [6][6]float64{
		{1, 0, 0, 0, 0, 0},
		{0.5, 1, 0, 0, 0, 0},
		{-0.25, 0.5, 1, 0, 0, 0},
		{0.5, -0.5, 0.25, 1, 0, 0},
		{0.25, 0.25, -0.5, 0.5, 1, 0},
		{-0.5, 0.25, 0.5, -0.25, 0.5, 1},
	}
	u := [6][6]float64{
		{4, 1, -2, 3, 1, 2},
		{0, 2, 1, -1, 2, 1},
		{0, 0, -4, 2, 1, 3},
		{0, 0, 0, 2, -3, 1},
		{0, 0, 0, 0, 8, -2},
		{0, 0, 0, 0, 0, 0},
	}
	for _, s := range []float64{0x1p20, 0x1p-20} {
		var lu [36]float64 // column-major
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				for k := 0; k < 6; k++ {
					lu[6*j+i] += s * l[i][k] * u[k][j]
				}
			}
		}
		var colMax float64
		for i := 0; i < 6; i++ {
			colMax = math.Max(colMax, math.Abs(lu[6*5+i]))
		}
		below := lu
		below[6*5+5] += 1e-14 * colMax
		kept := below
		if Inverse6(&below, 1e-12) || below != kept {
			t.Errorf("s = %g: a matrix singular to 1e-14 of its column inverted with tiny = 1e-12", s)
		}
		above := lu
		above[6*5+5] += 1e-10 * colMax
		src := above
		if !Inverse6(&above, 1e-12) {
			t.Errorf("s = %g: a matrix regular to 1e-10 of its column refused with tiny = 1e-12", s)
			continue
		}
		d := mat.NewDense(6, 6, nil)
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				d.Set(i, j, src[6*j+i])
			}
		}
		var want mat.Dense
		if err := want.Inverse(d); err != nil {
			t.Fatalf("s = %g: gonum: %v", s, err)
		}
		// Both inverses are accurate to about ε·cond of the largest entry,
		// as in the random trials above.
		big := mat.Norm(&want, math.Inf(1))
		cond := mat.Cond(d, 2)
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				if diff := math.Abs(above[6*j+i] - want.At(i, j)); diff > 1e-14*cond*big {
					t.Errorf("s = %g: inverse[%d,%d] = %g, gonum %g", s, i, j, above[6*j+i], want.At(i, j))
				}
			}
		}
	}
}

// TestNorm3 checks |(3, 4, 12)|·s = 13·s (a Pythagorean quadruple, by
// hand) across the range where the squares overflow or underflow.
func TestNorm3(t *testing.T) {
	for _, s := range []float64{1, 1e200, 1e-200, 1e-310} {
		v := r3.Vec{X: 3 * s, Y: 4 * s, Z: 12 * s}
		if got := Norm3(v); math.Abs(got-13*s) > 1e-15*13*s {
			t.Errorf("s = %g: Norm3 = %g, want %g", s, got, 13*s)
		}
	}
	if !Finite3(r3.Vec{X: 1, Y: -2, Z: math.MaxFloat64}) || Finite3(r3.Vec{Z: math.NaN()}) || Finite3(r3.Vec{Y: math.Inf(-1)}) {
		t.Error("Finite3 misjudges")
	}
}

// TestSort6 checks that Sort6 orders columns by norm and keeps each column
// with its norm (norms 1, 3, 2 worked by hand).
func TestSort6(t *testing.T) {
	var a [36]float64
	a[0], a[6+1], a[12+2] = 1, 3, 2
	var sigma [6]float64
	Sort6(&a, 3, &sigma)
	if sigma[0] != 3 || sigma[1] != 2 || sigma[2] != 1 || a[1] != 3 || a[6+2] != 2 || a[12] != 1 {
		t.Errorf("sigma %v, columns %v", sigma[:3], a[:18])
	}
}

// TestSolvePSD3 checks both paths against gonum: a well-conditioned
// system (LDLᵀ path) against mat.Dense.Solve, and a singular one (eigen
// path) against the pseudo-inverse solution, which for s = diag(4, 1, 0)
// and b = (2, 3, 5) is (0.5, 3, 0) by hand.
func TestSolvePSD3(t *testing.T) {
	rng := rand.New(rand.NewPCG(51, 53))
	for trial := 0; trial < 100; trial++ {
		m := randMatrix(rng, 3, 3, 3)
		var s [9]float64 // s = MᵀM + I, symmetric positive definite
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				s[3*j+i] = Dot(m[3*i:3*i+3], m[3*j:3*j+3])
			}
			s[4*i]++
		}
		b := [3]float64{rng.Float64(), rng.Float64(), rng.Float64()}
		x, kept := SolvePSD3(s, b, 1e-9)
		var want mat.VecDense
		if err := want.SolveVec(mat.NewDense(3, 3, s[:]), mat.NewVecDense(3, b[:])); err != nil {
			t.Fatal(err)
		}
		for i := range x {
			if math.Abs(x[i]-want.AtVec(i)) > 1e-12 || kept != 3 {
				t.Fatalf("trial %d: x = %v (kept %d), gonum %v", trial, x, kept, want.RawVector().Data)
			}
		}
	}
	x, kept := SolvePSD3([9]float64{4, 0, 0, 0, 1, 0, 0, 0, 0}, [3]float64{2, 3, 5}, 1e-9)
	if kept != 2 || math.Abs(x[0]-0.5) > 1e-15 || math.Abs(x[1]-3) > 1e-15 || x[2] != 0 {
		t.Errorf("singular system: x = %v, kept %d; want (0.5, 3, 0), 2", x, kept)
	}
	// One factorisation, two right-hand sides, on both paths: by hand,
	// diag(4, 1, 0) with b = (4, −1, 7) gives (1, −1, 0); diag(4, 2, 0.5)
	// gives (1, −0.5, 14).
	for _, tc := range []struct {
		s    [9]float64
		b, x [3]float64
	}{
		{[9]float64{4, 0, 0, 0, 1, 0, 0, 0, 0}, [3]float64{4, -1, 7}, [3]float64{1, -1, 0}},
		{[9]float64{4, 0, 0, 0, 2, 0, 0, 0, 0.5}, [3]float64{4, -1, 7}, [3]float64{1, -0.5, 14}},
	} {
		f := FactorPSD3(&tc.s, 1e-9)
		for _, b := range [][3]float64{{2, 3, 5}, tc.b} {
			want, _ := SolvePSD3(tc.s, b, 1e-9)
			if got := f.Solve(b); got != want {
				t.Errorf("%v: Solve(%v) = %v, SolvePSD3 %v", tc.s, b, got, want)
			}
		}
		if got := f.Solve(tc.b); math.Abs(got[0]-tc.x[0]) > 1e-15 || math.Abs(got[1]-tc.x[1]) > 1e-15 || math.Abs(got[2]-tc.x[2]) > 1e-14 {
			t.Errorf("%v: Solve(%v) = %v, want %v", tc.s, tc.b, got, tc.x)
		}
	}
}

// TestUnit3 checks Unit3 against the defining property |u| = 1, u ∥ v, over
// the whole float64 range, subnormals included, where r3.Unit fails.
func TestUnit3(t *testing.T) {
	for _, v := range []r3.Vec{
		{X: 3, Y: 4},                      // 3-4-5 triangle: (0.6, 0.8, 0) exactly
		{Z: 5e-324},                       // the smallest subnormal
		{X: 5e-324, Y: -5e-324},           // two subnormals: (1, −1, 0)/√2
		{X: 1e-310, Y: 2e-310, Z: 2e-310}, // (1, 2, 2)/3
		{X: 1e308, Y: 1e308, Z: 1e308},    // squares overflow
		{X: -7},
	} {
		u, ok := Unit3(v)
		if !ok {
			t.Fatalf("Unit3(%v) reports no direction", v)
		}
		if l := math.Sqrt(u.X*u.X + u.Y*u.Y + u.Z*u.Z); math.Abs(l-1) > 4e-16 {
			t.Errorf("|Unit3(%v)| = %v, want 1", v, l)
		}
		// Parallel: the cross product with v scaled to a largest component
		// of 1 vanishes to rounding.
		m := max(math.Abs(v.X), math.Abs(v.Y), math.Abs(v.Z))
		w := r3.Vec{X: v.X / m, Y: v.Y / m, Z: v.Z / m}
		if c := Norm3(r3.Cross(u, w)); c > 1e-15 {
			t.Errorf("Unit3(%v) = %v is not parallel to v (|u × v̂| = %g)", v, u, c)
		}
	}
	if u, _ := Unit3(r3.Vec{X: 3, Y: 4}); u != (r3.Vec{X: 0.6, Y: 0.8}) {
		t.Errorf("Unit3(3, 4, 0) = %v, want (0.6, 0.8, 0) exactly", u)
	}
	for _, v := range []r3.Vec{{}, {X: math.NaN()}, {Y: math.Inf(-1)}} {
		if _, ok := Unit3(v); ok {
			t.Errorf("Unit3(%v) reports a direction", v)
		}
	}
}

// TestNearestPoint checks the least-squares point of lines against closed
// forms worked by hand: three lines along x, y and z through (0, 1, 1),
// (1, 0, 1) and (1, 1, 0) all pass through (1, 1, 1), which is therefore
// the point (distance zero); two parallel lines along x at y = 1 and y = 3
// have the mid-line y = 2 as their nearest points, of which the one nearest
// the origin, (0, 2, 0), is kept, with rank 2.
func TestNearestPoint(t *testing.T) {
	var q NearestPoint
	q.Add(r3.Vec{Y: 1, Z: 1}, r3.Vec{X: 1})
	q.Add(r3.Vec{X: 1, Z: 1}, r3.Vec{Y: 1})
	q.Add(r3.Vec{X: 1, Y: 1}, r3.Vec{Z: 1})
	x, rank := q.Solve(1e-9)
	if rank != 3 || Norm3(r3.Sub(x, r3.Vec{X: 1, Y: 1, Z: 1})) > 1e-15 {
		t.Errorf("three skew axes: %v (rank %d), want (1, 1, 1) (rank 3)", x, rank)
	}
	var p NearestPoint
	p.Add(r3.Vec{X: 5, Y: 1}, r3.Vec{X: 1})
	p.Add(r3.Vec{X: -2, Y: 3}, r3.Vec{X: -1})
	x, rank = p.Solve(1e-9)
	if rank != 2 || Norm3(r3.Sub(x, r3.Vec{Y: 2})) > 1e-15 {
		t.Errorf("parallel lines: %v (rank %d), want (0, 2, 0) (rank 2)", x, rank)
	}
	var e NearestPoint
	if x, rank := e.Solve(0); rank != 0 || x != (r3.Vec{}) || e.Len() != 0 {
		t.Errorf("no lines: %v rank %d", x, rank)
	}
}
