package constraint

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"
)

// freedCase is a set of six wrenches with its name.
type freedCase struct {
	name string
	ws   [6]Wrench
}

// freedCases returns independent six-wrench sets of several kinds: the
// test coupling at two sizes, random lines, random lines with magnitudes
// spread over six decades, and five lines with a couple.
func freedCases(t *testing.T) []freedCase {
	t.Helper()
	rng := rand.New(rand.NewPCG(61, 67))
	var out []freedCase
	add := func(name string, ws []Wrench) {
		var a [6]Wrench
		copy(a[:], ws)
		out = append(out, freedCase{name, a})
	}
	cs := threeVee()
	add("coupling", placed(cs[:], 1, r3.Vec{}))
	add("coupling 50 mm off-centre", placed(cs[:], 0.05, r3.Vec{X: 0.02, Y: -0.3, Z: 0.1}))
	for trial := 0; trial < 30; trial++ {
		add("random", randLines(rng, 6))
	}
	for trial := 0; trial < 30; trial++ {
		ws := randLines(rng, 6)
		for i := range ws {
			ws[i] = scaleW(ws[i], math.Pow(10, 6*rng.Float64()-3))
		}
		add("random, magnitudes 1e-3 to 1e3", ws)
	}
	for trial := 0; trial < 10; trial++ {
		ws := randLines(rng, 6)
		ws[5] = Wrench{M: randVec(rng)}
		add("five lines and a couple", ws)
	}
	// Near-singular: six lines that all meet one line would have rank 5
	// (a line is reciprocal to every line it meets; Hunt, Kinematic
	// Geometry of Mechanisms, 1978, §12.6); the sixth passes δ off it, so
	// that the condition number grows as 1/δ and the accuracy bound
	// ε·Condition of the freed twists is tested where it is large.
	for _, delta := range []float64{1e-3, 1e-6, 1e-8} {
		for trial := 0; trial < 5; trial++ {
			a, e := randVec(rng), r3.Unit(randVec(rng))
			ws := make([]Wrench, 6)
			for i := range ws {
				p := r3.Add(a, r3.Scale(2*rng.Float64()-1, e))
				if i == 5 {
					off := r3.Unit(r3.Cross(e, randVec(rng)))
					p = r3.Add(p, r3.Scale(delta, off))
				}
				ws[i] = line(p, randVec(rng))
			}
			add(fmt.Sprintf("near-singular, one line %g off", delta), ws)
		}
	}
	return out
}

func scaleW(w Wrench, f float64) Wrench {
	return Wrench{F: r3.Scale(f, w.F), M: r3.Scale(f, w.M)}
}

// referenceFreed returns the rows of the inverse of the 6×6 matrix whose
// column j is (F_j, M_j), by gonum's mat.Dense.Inverse (LU with partial
// pivoting, LAPACK's dgetrf/dgetri), as twists: row i pairs its first
// three entries with F and its last three with M, so it is the twist
// (W, V) = (row[3:6], row[0:3]) with W·M_j + V·F_j = δᵢⱼ. It returns the
// 2-norm condition number of the matrix too.
func referenceFreed(t *testing.T, ws *[6]Wrench) ([6]Twist, float64) {
	t.Helper()
	d := mat.NewDense(6, 6, nil)
	for j, w := range ws {
		for i, x := range [6]float64{w.F.X, w.F.Y, w.F.Z, w.M.X, w.M.Y, w.M.Z} {
			d.Set(i, j, x)
		}
	}
	var inv mat.Dense
	if err := inv.Inverse(d); err != nil {
		t.Fatalf("gonum: %v", err)
	}
	var ts [6]Twist
	for i := range ts {
		ts[i] = Twist{
			W: r3.Vec{X: inv.At(i, 3), Y: inv.At(i, 4), Z: inv.At(i, 5)},
			V: r3.Vec{X: inv.At(i, 0), Y: inv.At(i, 1), Z: inv.At(i, 2)},
		}
	}
	return ts, mat.Cond(d, 2)
}

func twistNorm(t Twist) float64 { return math.Sqrt(r3.Norm2(t.W) + r3.Norm2(t.V)) }

func twistDiff(a, b Twist) float64 {
	return twistNorm(Twist{W: r3.Sub(a.W, b.W), V: r3.Sub(a.V, b.V)})
}

// checkFreed checks the twists ts against gonum's inverse and against
// their definition, Power(ts[i], ws[j]) = δᵢⱼ.
func checkFreed(t *testing.T, name string, ws *[6]Wrench, ts *[6]Twist, condition float64) {
	t.Helper()
	ref, cond := referenceFreed(t, ws)
	for i := range ts {
		// Both are accurate to a small multiple of ε times the condition
		// number of the matrix each inverts: gonum's of the matrix as
		// given, ours of the normalised one.
		tol := 1e-13 * (cond + condition) * twistNorm(ref[i])
		if d := twistDiff(ts[i], ref[i]); d > tol {
			t.Errorf("%s: twist %d = %v, gonum %v (diff %g, cond %g, Condition %g)", name, i, ts[i], ref[i], d, cond, condition)
		}
		for j, w := range ws {
			want := 0.0
			if i == j {
				want = 1
			}
			// The power sums products as large as |W||M| + |V||F|.
			scale := linalgNorm(ts[i].W)*linalgNorm(w.M) + linalgNorm(ts[i].V)*linalgNorm(w.F)
			if p := power(ts[i], w); math.Abs(p-want) > 1e-13*condition*scale {
				t.Errorf("%s: Power(ts[%d], ws[%d]) = %.17g, want %g (scale %g)", name, i, j, p, want, scale)
			}
		}
	}
}

func linalgNorm(v r3.Vec) float64 { return math.Sqrt(r3.Norm2(v)) }

// TestFreed checks Freed, and Result.Freed of Analyze, against the rows of
// gonum's inverse and against Power(ts[i], ws[j]) = δᵢⱼ.
func TestFreed(t *testing.T) {
	for _, c := range freedCases(t) {
		var r Result
		if err := Analyze(c.ws[:], &r); err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if r.Rank != 6 || !r.HasFreed {
			t.Fatalf("%s: rank %d, HasFreed %v", c.name, r.Rank, r.HasFreed)
		}
		checkFreed(t, c.name+" (Analyze)", &c.ws, &r.Freed, r.Condition)
		var ts [6]Twist
		if !Freed(&c.ws, &ts) {
			t.Fatalf("%s: Freed reports a singular set", c.name)
		}
		checkFreed(t, c.name+" (Freed)", &c.ws, &ts, r.Condition)
	}
}

// TestFreedSingular checks that Freed reports false for six wrenches that
// are not independent, and that Analyze then has no Freed: a repeated
// line; six lines meeting one line (rank 5: a line is reciprocal to every
// line it meets, Hunt, Kinematic Geometry of Mechanisms, 1978, §12.6);
// six lines through one point (rank 3); invalid input.
func TestFreedSingular(t *testing.T) {
	rng := rand.New(rand.NewPCG(71, 73))
	var sets []struct {
		name string
		ws   [6]Wrench
	}
	add := func(name string, ws []Wrench) {
		var a [6]Wrench
		copy(a[:], ws)
		sets = append(sets, struct {
			name string
			ws   [6]Wrench
		}{name, a})
	}
	ws := randLines(rng, 6)
	ws[4] = scaleW(ws[1], -3)
	add("repeated line", ws)
	a, e := randVec(rng), randVec(rng)
	ws = make([]Wrench, 6)
	for i := range ws {
		ws[i] = line(r3.Add(a, r3.Scale(rng.Float64(), e)), randVec(rng))
	}
	add("meeting a line", ws)
	for i := range ws {
		ws[i] = line(a, randVec(rng))
	}
	add("concurrent", ws)
	ws = randLines(rng, 6)
	ws[2].M.Y = math.NaN()
	add("NaN", ws)
	for _, s := range sets {
		var ts [6]Twist
		if Freed(&s.ws, &ts) {
			t.Errorf("%s: Freed reports an independent set", s.name)
		}
		var r Result
		if err := Analyze(s.ws[:], &r); err == nil && (r.Rank == 6 || r.HasFreed) {
			t.Errorf("%s: rank %d, HasFreed %v", s.name, r.Rank, r.HasFreed)
		}
	}
}

// TestFreedScaling checks that Freed scales exactly as the definition
// requires: multiplying wrench j by f divides twist j by f, and the same
// coupling drawn 1000 times larger has W/1000 and the same velocity at
// corresponding points (Power(t, w) = δ for w = (n, p × n) with p → 1000p
// holds for (W/1000, V)).
func TestFreedScaling(t *testing.T) {
	cs := threeVee()
	var ws, big, small [6]Wrench
	copy(ws[:], placed(cs[:], 0.05, r3.Vec{}))
	copy(big[:], placed(cs[:], 50, r3.Vec{}))
	small = ws
	small[2] = scaleW(small[2], 1e-7)
	var t0, t1, t2 [6]Twist
	if !Freed(&ws, &t0) || !Freed(&big, &t1) || !Freed(&small, &t2) {
		t.Fatal("Freed reports a singular coupling")
	}
	for i := range t0 {
		p := r3.Scale(0.05, cs[i].p)
		if d := r3.Norm(r3.Sub(r3.Scale(1000, t1[i].W), t0[i].W)); d > 1e-12*r3.Norm(t0[i].W) {
			t.Errorf("twist %d: 1000·W = %v, want %v", i, r3.Scale(1000, t1[i].W), t0[i].W)
		}
		v0 := r3.Add(t0[i].V, r3.Cross(t0[i].W, p))
		v1 := r3.Add(t1[i].V, r3.Cross(t1[i].W, r3.Scale(1000, p)))
		if d := r3.Norm(r3.Sub(v1, v0)); d > 1e-12*r3.Norm(v0) {
			t.Errorf("twist %d: contact velocity %v, want %v", i, v1, v0)
		}
		f := 1.0
		if i == 2 {
			f = 1e7
		}
		if d := twistDiff(t2[i], Twist{W: r3.Scale(f, t0[i].W), V: r3.Scale(f, t0[i].V)}); d > 1e-12*f*twistNorm(t0[i]) {
			t.Errorf("twist %d with wrench 2 scaled by 1e-7: %v, want %g times %v", i, t2[i], f, t0[i])
		}
	}
}
