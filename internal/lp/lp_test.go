package lp

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
	"time"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

// verify checks res against the program by certificates that do not rely
// on the solver: for Optimal, x primal feasible, y dual feasible and
// cᵀx = bᵀy (optimal by the duality theorem, Chvátal, Linear Programming,
// 1983, ch. 5; when strict); for Infeasible, y a Farkas certificate
// (Aᵀy ≤ 0, bᵀy > 0: no x ≥ 0 has A·x = b, since 0 < bᵀy = xᵀAᵀy ≤ 0;
// Chvátal 1983, ch. 9, from memory). All on the tests' scaled program,
// to checkTol.
func verify(t testing.TB, name string, c, a, b []float64, res Result, strict bool) {
	t.Helper()
	p := newScaledProgram(c, a, b)
	switch res.Status {
	case Optimal:
		if len(res.X) != p.n || len(res.Y) != p.m {
			t.Fatalf("%s: optimal with len(X) %d, len(Y) %d; want %d, %d", name, len(res.X), len(res.Y), p.n, p.m)
		}
		xs, ys := p.x(res.X), p.y(res.Y)
		if v := p.primalViolation(xs); !(v <= checkTol) {
			t.Errorf("%s: x violates A·x = b, x ≥ 0 by %g (scaled)", name, v)
		}
		if v := p.dualViolation(ys, false); !(v <= checkTol) {
			t.Errorf("%s: y violates Aᵀy ≤ c by %g (scaled)", name, v)
		}
		if g := p.gap(xs, ys); strict && !(g <= checkTol) {
			t.Errorf("%s: duality gap %g (scaled)", name, g)
		}
		var v float64
		for j, xj := range res.X {
			v += c[j] * xj
		}
		if v != res.Value {
			t.Errorf("%s: Value %g, cᵀx %g", name, res.Value, v)
		}
	case Infeasible:
		if res.X != nil || len(res.Y) != p.m {
			t.Fatalf("%s: infeasible with X %v, len(Y) %d", name, res.X, len(res.Y))
		}
		ys := p.farkas(res.Y)
		// bᵀy is the phase-I optimum, above infeasTol; but on an
		// ill-conditioned basis at the boundary of feasibility (fuzzed
		// programs) the multipliers carry rounding of ε times its
		// condition, which can outweigh it: there only bᵀy > −checkTol.
		floor := 0.0
		if !strict {
			floor = -checkTol
		}
		if m := p.farkasMargin(ys); !(m > floor) {
			t.Errorf("%s: Farkas certificate with bᵀy = %g (scaled), want > %g", name, m, floor)
		}
		if v := p.dualViolation(ys, true); !(v <= checkTol) {
			t.Errorf("%s: Farkas certificate violates Aᵀy ≤ 0 by %g (scaled)", name, v)
		}
	case Unbounded:
		if res.X != nil || res.Y != nil {
			t.Errorf("%s: unbounded with X %v, Y %v", name, res.X, res.Y)
		}
	default:
		t.Errorf("%s: status %v", name, res.Status)
	}
}

// colMajor returns the rows as an m×n column-major matrix.
func colMajor(rows [][]float64) []float64 {
	m, n := len(rows), len(rows[0])
	a := make([]float64, m*n)
	for r, row := range rows {
		for j, v := range row {
			a[m*j+r] = v
		}
	}
	return a
}

// withSlacks returns A·x ≤ b as [A I]: the rows with a slack each, and c
// padded with zeros.
func withSlacks(rows [][]float64, c []float64) (cs, a []float64) {
	m := len(rows)
	var ext [][]float64
	for r, row := range rows {
		e := append(slices.Clone(row), make([]float64, m)...)
		e[len(row)+r] = 1
		ext = append(ext, e)
	}
	return append(slices.Clone(c), make([]float64, m)...), colMajor(ext)
}

// TestHandSolved solves small programs whose optimum is worked by hand in
// the comments, each certified by a dual solution found by hand.
func TestHandSolved(t *testing.T) {
	for _, tc := range []struct {
		name   string
		rows   [][]float64 // A·x ≤ b, with slacks
		b, c   []float64   // minimise cᵀx
		x      []float64   // optimal x (without slacks)
		value  float64
		status Status
	}{
		{
			// Chvátal, Linear Programming, 1983, ch. 2, the first example
			// (from memory): maximise 5x₁ + 4x₂ + 3x₃ subject to
			// 2x₁ + 3x₂ + x₃ ≤ 5, 4x₁ + x₂ + 2x₃ ≤ 11, 3x₁ + 4x₂ + 2x₃ ≤ 8.
			// Checked by hand: x = (2, 0, 1) meets rows 1 and 3 with
			// equality (5, 8) and row 2 with 10 ≤ 11, value 13; the dual
			// y = (1, 0, 1) has 2+3 = 5, 3+4 = 7 ≥ 4, 1+2 = 3, y ≥ 0 and
			// bᵀy = 5 + 8 = 13, so 13 is optimal (weak duality).
			name: "Chvátal ch. 2",
			rows: [][]float64{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}}, b: []float64{5, 11, 8},
			c: []float64{-5, -4, -3}, x: []float64{2, 0, 1}, value: -13,
		},
		{
			// Two variables by hand, degenerate at the optimum: maximise
			// 3x + 2y subject to x + y ≤ 4, x + 3y ≤ 6, x ≤ 3. The three
			// lines meet at (3, 1) (3+1 = 4, 3+3 = 6, 3 = 3): three tight
			// rows in two dimensions. Value 11; the dual y = (2, 0, 1)
			// has 2 + 1 = 3, 2 = 2, y ≥ 0 and 4·2 + 3·1 = 11.
			name: "degenerate vertex",
			rows: [][]float64{{1, 1}, {1, 3}, {1, 0}}, b: []float64{4, 6, 3},
			c: []float64{-3, -2}, x: []float64{3, 1}, value: -11,
		},
		{
			// Beale's example (1955, "Cycling in the dual simplex
			// algorithm", Naval Res. Logist. Quart. 2; as in Chvátal 1983,
			// ch. 3, from memory), on which Dantzig's rule with the
			// smallest-index tie-break cycles: maximise
			// 10x₁ − 57x₂ − 9x₃ − 24x₄ subject to
			// ½x₁ − 5½x₂ − 2½x₃ + 9x₄ ≤ 0, ½x₁ − 1½x₂ − ½x₃ + x₄ ≤ 0,
			// x₁ ≤ 1. Checked by hand: x = (1, 0, 1, 0) gives rows −2 ≤ 0,
			// 0 ≤ 0, 1 ≤ 1 and value 10 − 9 = 1; the dual y = (0, 18, 1)
			// has ½·18 + 1 = 10, −1½·18 = −27 ≥ −57, −½·18 = −9,
			// 18 ≥ −24, y ≥ 0, and bᵀy = 1.
			name: "Beale",
			rows: [][]float64{{0.5, -5.5, -2.5, 9}, {0.5, -1.5, -0.5, 1}, {1, 0, 0, 0}}, b: []float64{0, 0, 1},
			c: []float64{-10, 57, 9, 24}, x: []float64{1, 0, 1, 0}, value: -1,
		},
		{
			// x₁ + x₂ ≤ −1 with x ≥ 0: infeasible (the left side is ≥ 0).
			name: "infeasible", rows: [][]float64{{1, 1}}, b: []float64{-1},
			c: []float64{1, 1}, status: Infeasible,
		},
		{
			// Minimise −x₁ subject to x₁ − x₂ ≤ 1: x = (1 + s, s) is
			// feasible for every s ≥ 0, with value −1 − s.
			name: "unbounded", rows: [][]float64{{1, -1}}, b: []float64{1},
			c: []float64{-1, 0}, status: Unbounded,
		},
	} {
		c, a := withSlacks(tc.rows, tc.c)
		res, err := Solve(c, a, tc.b, nil)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if res.Status != tc.status {
			t.Fatalf("%s: %v, want %v", tc.name, res.Status, tc.status)
		}
		verify(t, tc.name, c, a, tc.b, res, true)
		if tc.status != Optimal {
			continue
		}
		if math.Abs(res.Value-tc.value) > 1e-12*math.Abs(tc.value) {
			t.Errorf("%s: value %.15g, want %g (by hand)", tc.name, res.Value, tc.value)
		}
		for j, want := range tc.x {
			if math.Abs(res.X[j]-want) > 1e-12*(1+math.Abs(want)) {
				t.Errorf("%s: x = %v, want %v (by hand)", tc.name, res.X[:len(tc.x)], tc.x)
				break
			}
		}
	}
}

// randomProgram returns a program of m rows and n columns with Gaussian
// entries. b = A·x₀ for x₀ with about m non-negative entries (feasible)
// or with some negative ones (perhaps infeasible), c = Aᵀy₀ + s₀ for s₀ ≥ 0
// (bounded if feasible: y₀ is dual feasible) or with some negative entries
// (perhaps unbounded).
func randomProgram(rng *rand.Rand, m, n int, feasible, bounded bool) (c, a, b []float64) {
	a = make([]float64, m*n)
	for i := range a {
		a[i] = rng.NormFloat64()
	}
	b = make([]float64, m)
	for j := range n {
		if rng.IntN(n) >= m {
			continue
		}
		x0 := rng.ExpFloat64()
		if !feasible && rng.IntN(2) == 0 {
			x0 = -x0
		}
		for r := range m {
			b[r] += a[m*j+r] * x0
		}
	}
	y0 := make([]float64, m)
	for r := range y0 {
		y0[r] = rng.NormFloat64()
	}
	c = make([]float64, n)
	for j := range n {
		s0 := rng.ExpFloat64()
		if !bounded && rng.IntN(3) == 0 {
			s0 = -3 * s0
		}
		c[j] = s0
		for r := range m {
			c[j] += a[m*j+r] * y0[r]
		}
	}
	return c, a, b
}

// TestSolveAgainstGonum compares Solve with gonum's lp.Simplex, the
// reference library, on seeded random programs (Gaussian data: generic,
// non-degenerate programs, on which gonum ends): the same status, and
// the same optimum to 1e-9·(1 + |optimum|) (both solvers stop at vertices
// that meet the constraints to about 1e-10 of the data, which moves an
// objective of data near 1 by as much; checkTol's margin above it).
func TestSolveAgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(14, 1))
	var count [3]int
	for i := range 600 {
		m := 1 + rng.IntN(12)
		n := m + 1 + rng.IntN(3*m+4)
		c, a, b := randomProgram(rng, m, n, i%3 != 1, i%3 != 2)
		res, err := Solve(c, a, b, nil)
		if err != nil {
			t.Fatalf("program %d (%d×%d): %v", i, m, n, err)
		}
		verify(t, "random", c, a, b, res, true)
		g := gonumSolve(c, a, b, 10*time.Second)
		if !g.done || g.err != nil {
			t.Logf("program %d: gonum gave no answer (%v)", i, g.err)
			continue
		}
		if res.Status != g.status {
			t.Errorf("program %d (%d×%d): %v, gonum %v", i, m, n, res.Status, g.status)
			continue
		}
		count[res.Status]++
		if res.Status == Optimal && math.Abs(res.Value-g.opt) > 1e-9*(1+math.Abs(g.opt)) {
			t.Errorf("program %d (%d×%d): optimum %.15g, gonum %.15g", i, m, n, res.Value, g.opt)
		}
	}
	if count[Optimal] < 100 || count[Infeasible] < 30 || count[Unbounded] < 30 {
		t.Fatalf("compared %v optimal, infeasible, unbounded programs: too few", count)
	}
}

// TestClosureProgramsAgainstGonum (moved from kinematic, where it compared
// the closure simplex with gonum) compares Solve with gonum's lp.Simplex
// on the closure programs of random generators: minimise Σxⱼ subject to
// Σ xⱼŵⱼ = −Σŵⱼ, x ≥ 0, for Gaussian unit columns ŵⱼ (generic programs,
// on which gonum ends): the same feasibility and the same optimum.
func TestClosureProgramsAgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 4))
	agree := [2]int{}
	for range 300 {
		n := 7 + rng.IntN(20)
		a := make([]float64, 6*n)
		b := make([]float64, 6)
		c := make([]float64, n)
		for j := range n {
			var nrm float64
			for r := range 6 {
				a[6*j+r] = rng.NormFloat64()
				nrm += a[6*j+r] * a[6*j+r]
			}
			c[j] = 1
			for r := range 6 {
				a[6*j+r] /= math.Sqrt(nrm)
				b[r] -= a[6*j+r]
			}
		}
		g := gonumSolve(c, a, b, 10*time.Second)
		res, err := Solve(c, a, b, nil)
		if err != nil {
			t.Fatalf("n = %d: %v", n, err)
		}
		verify(t, "closure", c, a, b, res, true)
		switch {
		case g.done && g.status == Infeasible:
			if res.Status != Infeasible {
				t.Errorf("n = %d: %v, gonum says infeasible", n, res.Status)
			}
			agree[0]++
		case g.done && g.err == nil && g.status == Optimal:
			if res.Status != Optimal || math.Abs(res.Value-g.opt) > 1e-9*(1+g.opt) {
				t.Errorf("n = %d: %v, optimum %g; gonum %g", n, res.Status, res.Value, g.opt)
			}
			agree[1]++
		}
	}
	if agree[0] < 30 || agree[1] < 30 {
		t.Fatalf("compared %d infeasible and %d feasible programs: too few", agree[0], agree[1])
	}
}

// TestDegeneratePrograms solves the programs of kinematic's fuzz corpora
// (testdata/programs, each file naming its source): the closure programs
// with the bounds λ ≥ 1 (b = −Σŵ, as degenerate as they come) and raised,
// and the preload sizing program on which gonum's lp.Simplex panicked (a
// singular initial basis), in gonum's form and as the dual that kinematic
// solves. Each answer is checked by its certificates; where gonum answers
// (in 10 s) the status and optimum must agree; the sizing program and its
// dual must have opposite optima (the duality theorem).
func TestDegeneratePrograms(t *testing.T) {
	values := map[string]float64{}
	for _, p := range readPrograms(t) {
		res, err := Solve(p.c, p.a, p.b, nil)
		if err != nil {
			t.Errorf("%s: %v", p.name, err)
			continue
		}
		verify(t, p.name, p.c, p.a, p.b, res, true)
		values[p.name] = res.Value
		g := gonumSolve(p.c, p.a, p.b, 10*time.Second)
		if !g.done || g.err != nil {
			t.Logf("%s: %v in %d pivots; gonum gave no answer (%v)", p.name, res.Status, res.Pivots, g.err)
			continue
		}
		if g.status != res.Status {
			t.Errorf("%s: %v; gonum %v", p.name, res.Status, g.status)
			continue
		}
		if res.Status == Optimal {
			notWorse(t, p.name, p.c, p.a, p.b, res, g)
		}
	}
	for name, v := range values {
		const primal = "sizing-primal-"
		if len(name) > len(primal) && name[:len(primal)] == primal {
			d, ok := values["sizing-dual-"+name[len(primal):]]
			if !ok || math.Abs(v+d) > 1e-9*math.Abs(v) {
				t.Errorf("%s: optimum %g, its dual %g (found %v): want opposite", name, v, d, ok)
			}
		}
	}
}

// notWorse checks an optimal res against gonum's optimum g: not worse
// than it (to checkTol of the terms of cᵀx), and g not better than the
// lower bound that weak duality gives from res.Y for gonum's own x,
// cᵀx ≥ bᵀy + Σⱼ min(0, (cⱼ − aⱼᵀy)·xⱼ) − Σᵣ |yᵣ|·|(A·x − b)ᵣ| (Chvátal 1983, ch. 5,
// with the violations of both points counted): the two optima agree to
// what the certificates can tell apart.
func notWorse(t testing.TB, name string, c, a, b []float64, res Result, g gonumResult) {
	t.Helper()
	m := len(b)
	var mag float64
	for j := range c {
		mag += math.Abs(c[j]*res.X[j]) + math.Abs(c[j]*g.x[j])
	}
	if res.Value > g.opt+checkTol*mag {
		t.Errorf("%s: optimum %.15g, worse than gonum's %.15g", name, res.Value, g.opt)
	}
	var bound, bmag float64
	for r := range m {
		bound += b[r] * res.Y[r]
		bmag += math.Abs(b[r] * res.Y[r])
		rr := -b[r]
		for j := range c {
			rr += a[m*j+r] * g.x[j]
		}
		bound -= math.Abs(rr * res.Y[r])
	}
	for j := range c {
		s := c[j]
		for r := range m {
			s -= a[m*j+r] * res.Y[r]
		}
		bound += min(0, s*g.x[j])
	}
	if g.opt < bound-checkTol*(mag+bmag) {
		t.Errorf("%s: gonum's optimum %.15g below the dual bound %.15g of ours (%.15g)", name, g.opt, bound, res.Value)
	}
}

// TestScaling: rows, b and c multiplied by powers of two give exactly the
// same pivots and the solution scaled back exactly (the solver's scaling
// rounds nothing and absorbs them); columns too, and every factor any
// number, the same optimum to checkTol.
func TestScaling(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 7))
	for i := range 100 {
		m := 2 + rng.IntN(6)
		n := m + 2 + rng.IntN(2*m)
		c, a, b := randomProgram(rng, m, n, true, true)
		ref, err := Solve(c, a, b, nil)
		if err != nil || ref.Status != Optimal {
			t.Fatalf("program %d: %v %v", i, ref.Status, err)
		}
		for _, pow2 := range []bool{true, false} {
			fac := func() float64 {
				if pow2 {
					return math.Ldexp(1, rng.IntN(81)-40)
				}
				return math.Exp(rng.NormFloat64() * 20)
			}
			rowF, colF, bF, cF := make([]float64, m), make([]float64, n), fac(), fac()
			for r := range rowF {
				rowF[r] = fac()
			}
			for j := range colF {
				colF[j] = 1
				if !pow2 {
					colF[j] = fac()
				}
			}
			c2, a2, b2 := make([]float64, n), make([]float64, m*n), make([]float64, m)
			for j := range n {
				c2[j] = c[j] * colF[j] * cF
				for r := range m {
					a2[m*j+r] = a[m*j+r] * rowF[r] * colF[j]
				}
			}
			for r := range m {
				b2[r] = b[r] * rowF[r] * bF
			}
			res, err := Solve(c2, a2, b2, nil)
			if err != nil || res.Status != Optimal {
				t.Fatalf("program %d scaled (powers of two %v): %v %v", i, pow2, res.Status, err)
			}
			verify(t, "scaled", c2, a2, b2, res, true)
			if want := ref.Value * bF * cF; pow2 {
				// x₂ = x·bF/colF, y₂ = y·cF/rowF, both exact.
				for j := range n {
					if res.X[j] != ref.X[j]*bF/colF[j] {
						t.Fatalf("program %d: x[%d] = %g, want %g exactly", i, j, res.X[j], ref.X[j]*bF/colF[j])
					}
				}
				for r := range m {
					if res.Y[r] != ref.Y[r]*cF/rowF[r] {
						t.Fatalf("program %d: y[%d] = %g, want %g exactly", i, r, res.Y[r], ref.Y[r]*cF/rowF[r])
					}
				}
				if res.Pivots != ref.Pivots {
					t.Errorf("program %d: %d pivots, unscaled %d", i, res.Pivots, ref.Pivots)
				}
			} else if math.Abs(res.Value-want) > checkTol*(math.Abs(want)+bF*cF) {
				t.Errorf("program %d: optimum %g, want %g", i, res.Value, want)
			}
		}
	}
}

// TestErrors: input that is not a program, a rank-deficient feasible
// program and the iteration limit are errors, never a panic; the inputs
// are not modified.
func TestErrors(t *testing.T) {
	nan := math.NaN()
	for _, tc := range []struct {
		name    string
		c, a, b []float64
		want    error
	}{
		{"no rows", []float64{1}, nil, nil, errs.ErrDegenerate},
		{"no columns", nil, nil, []float64{1}, errs.ErrDegenerate},
		{"short a", []float64{1, 1}, []float64{1}, []float64{1}, errs.ErrRange},
		{"NaN in c", []float64{nan, 1}, []float64{1, 1}, []float64{1}, errs.ErrNonFinite},
		{"Inf in a", []float64{1, 1}, []float64{math.Inf(1), 1}, []float64{1}, errs.ErrNonFinite},
		{"NaN in b", []float64{1, 1}, []float64{1, 1}, []float64{nan}, errs.ErrNonFinite},
		// Rows 1 and 2 equal, b consistent: feasible, rank 1 < 2.
		{"dependent rows", []float64{1, 1}, []float64{1, 1, 2, 2}, []float64{1, 1}, ErrSingular},
		// Row 2 is 1e-15 from row 1: rank 2 only to rounding.
		{"rank 2 to rounding", []float64{1, 1, 1}, []float64{1, 1, 1, 1 + 1e-15, 1, 1}, []float64{1, 1}, ErrSingular},
	} {
		ins := [][]float64{slices.Clone(tc.c), slices.Clone(tc.a), slices.Clone(tc.b)}
		_, err := Solve(tc.c, tc.a, tc.b, nil)
		if !errors.Is(err, tc.want) {
			t.Errorf("%s: %v, want %v", tc.name, err, tc.want)
		}
		for i, in := range [][]float64{tc.c, tc.a, tc.b} {
			if !slices.EqualFunc(in, ins[i], func(x, y float64) bool { return x == y || (x != x && y != y) }) {
				t.Errorf("%s: input %d modified", tc.name, i)
			}
		}
	}
	// The Chvátal example needs 2 or more pivots (x₁ and x₃ enter).
	c, a := withSlacks([][]float64{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}}, []float64{-5, -4, -3})
	if res, err := Solve(c, a, []float64{5, 11, 8}, &Options{MaxPivots: 1}); !errors.Is(err, ErrIterationLimit) || res.Pivots != 2 {
		t.Errorf("one pivot allowed: %+v, %v; want ErrIterationLimit after the second", res, err)
	}
}

// TestLU: the factorisation solves M·x = v and Mᵀ·y = v for random M to
// the backward error of partial pivoting (residuals of a few ε·|M||x|,
// Golub & Van Loan 2013, §3.4), and reports a singular M.
func TestLU(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 3))
	for range 200 {
		m := 1 + rng.IntN(12)
		mm := make([]float64, m*m)
		for i := range mm {
			mm[i] = rng.NormFloat64()
		}
		lu, perm := slices.Clone(mm), make([]int, m)
		if !luFactor(lu, m, perm) {
			t.Fatalf("random %d×%d reported singular", m, m)
		}
		for _, trans := range []bool{false, true} {
			v := make([]float64, m)
			for i := range v {
				v[i] = rng.NormFloat64()
			}
			x, work := slices.Clone(v), make([]float64, m)
			if trans {
				luSolveT(lu, m, perm, x, work)
			} else {
				luSolve(lu, m, perm, x, work)
			}
			for r := range m {
				s, mag := -v[r], math.Abs(v[r])
				for c := range m {
					e := mm[m*c+r] // M[r][c]
					if trans {
						e = mm[m*r+c]
					}
					s += e * x[c]
					mag += math.Abs(e * x[c])
				}
				if math.Abs(s) > 64*float64(m)*0x1p-52*mag {
					t.Errorf("%d×%d, transposed %v: residual %g of %g", m, m, trans, s, mag)
				}
			}
		}
	}
	sing := []float64{1, 2, 2, 4} // column 2 = 2·column 1
	if luFactor(sing, 2, make([]int, 2)) {
		t.Error("a singular 2×2 factorised")
	}
}
