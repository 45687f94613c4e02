package constraint

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

func mustAnalyze(t *testing.T, ws []Wrench) Result {
	t.Helper()
	var r Result
	if err := Analyze(ws, &r); err != nil {
		t.Fatal(err)
	}
	return r
}

func TestAnalyzeErrors(t *testing.T) {
	ok := Wrench{F: r3.Vec{X: 1}}
	for _, tc := range []struct {
		name  string
		ws    []Wrench
		index int
		part  string
		err   error
	}{
		{"empty", nil, -1, "", errs.ErrDegenerate},
		{"zero wrench", []Wrench{ok, {}}, 1, "", errs.ErrDegenerate},
		{"NaN force", []Wrench{ok, {F: r3.Vec{Y: math.NaN()}}}, 1, "F", errs.ErrNonFinite},
		{"Inf moment", []Wrench{{M: r3.Vec{Z: math.Inf(1)}}}, 0, "M", errs.ErrNonFinite},
		{"magnitudes apart", []Wrench{ok, {F: r3.Vec{Y: 1e151}}}, 1, "", errs.ErrRange},
		{"line too far", []Wrench{{F: r3.Vec{X: 1e-101}, M: r3.Vec{Y: 1}}}, 0, "", errs.ErrRange},
		// Two couples of 1e100 and 2e100 N·m about x (redundant) and two
		// forces along z 2e-250 m apart: the couples' weights relative to
		// the forces' scale as moment over length, 1e350, out of range.
		{"couples and forces apart", []Wrench{{M: r3.Vec{X: 1e100}}, {M: r3.Vec{X: 2e100}},
			line(r3.Vec{X: 1e-250}, r3.Vec{Z: 1}), line(r3.Vec{X: -1e-250}, r3.Vec{Z: 1})}, 1, "", errs.ErrRange},
	} {
		var r Result
		r.Rank = 7 // must be cleared
		err := Analyze(tc.ws, &r)
		var ce *Error
		if !errors.As(err, &ce) || ce.Index != tc.index || ce.Part != tc.part || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *Error{%d, %q} wrapping %v", tc.name, err, tc.index, tc.part, tc.err)
		}
		if d := cmp.Diff(Result{}, r); d != "" {
			t.Errorf("%s: result not zero on error (-want +got):\n%s", tc.name, d)
		}
	}
}

// TestRedundantByHand checks reduced echelon forms worked by hand.
func TestRedundantByHand(t *testing.T) {
	w := line(r3.Vec{X: 0.3, Y: -0.1}, r3.Vec{X: 0.2, Z: 1})
	v := line(r3.Vec{Y: 0.5}, r3.Vec{X: 1, Y: 0.4})
	for _, tc := range []struct {
		name string
		ws   []Wrench
		want [][]float64
	}{
		// One line three times: the weights with Σcᵢ = 0, the plane
		// x₁ + x₂ + x₃ = 0, whose reduced echelon basis is
		// [1 0 −1; 0 1 −1].
		{"w, w, w", []Wrench{w, w, w}, [][]float64{{1, 0, -1}, {0, 1, -1}}},
		// With magnitudes 1, 2, 4: c₁ + 2c₂ + 4c₃ = 0; the same pivots give
		// (1, 0, −1/4) and (0, 1/2, −1/4), scaled to a largest weight of
		// +1: (0, 1, −1/2).
		{"w, 2w, 4w", []Wrench{w, scaleW(w, 2), scaleW(w, 4)}, [][]float64{{1, 0, -0.25}, {0, 1, -0.5}}},
		// v independent of a repeated w: (0, 1, −1), v's weight exactly 0.
		{"v, w, w", []Wrench{v, w, w}, [][]float64{{0, 1, -1}}},
		// w, v, w: (1, 0, −1).
		{"w, v, w", []Wrench{w, v, w}, [][]float64{{1, 0, -1}}},
		// A line and the opposite force on it, 3 times as large: (1, 1/3).
		{"w, −3w", []Wrench{w, scaleW(w, -3)}, [][]float64{{1, 1.0 / 3}}},
	} {
		r := mustAnalyze(t, tc.ws)
		if d := cmp.Diff(tc.want, r.Redundant, cmpopts.EquateApprox(1e-15, 0)); d != "" {
			t.Errorf("%s: redundancies (-want +got):\n%s", tc.name, d)
		}
		for _, c := range r.Redundant {
			for i, x := range c {
				if tc.want[0][i] == 0 && len(tc.want) == 1 && x != 0 {
					t.Errorf("%s: weight %d = %g, want exactly 0", tc.name, i, x)
				}
			}
		}
	}
}

// TestRedundantNearlyDependent: four wrenches along one force direction
// whose moments differ by 2⁻¹² in relative terms, w0 = w2, w1 and w3 close
// to w0. The redundancies are exact, Σcᵢwᵢ = 0 to rounding, although a
// column is nearly dependent on another (a regression: passing over it
// must not drop its small independent part).
func TestRedundantNearlyDependent(t *testing.T) {
	f := r3.Vec{X: 1, Y: 1, Z: 1}
	ws := []Wrench{{F: f, M: f}, {F: f, M: r3.Vec{X: 1, Y: 1, Z: 65536}}, {F: f, M: f}, {F: f, M: r3.Vec{X: 1, Y: 1, Z: 1 + 0x1p-12}}}
	r := mustAnalyze(t, ws)
	if r.Rank != 2 || len(r.Redundant) != 2 {
		t.Fatalf("rank %d, %d redundancies; want 2 and 2", r.Rank, len(r.Redundant))
	}
	for k, c := range r.Redundant {
		// Relative to the sizes added and to the rounding of taking
		// moments about Centre, ε·|F|·(|Centre| + Length).
		var sum Wrench
		var scale float64
		arm := r3.Norm(r.Centre) + r.Length
		for i, w := range ws {
			sum = Wrench{F: r3.Add(sum.F, r3.Scale(c[i], w.F)), M: r3.Add(sum.M, r3.Scale(c[i], w.M))}
			scale += math.Abs(c[i]) * (maxAbsW(w) + r3.Norm(w.F)*arm)
		}
		if m := maxAbsW(sum); m > 1e-14*scale {
			t.Errorf("combination %d %v sums to %v (scale %g)", k, c, sum, scale)
		}
	}
}

// TestRedundantAgainstGonum checks the redundancies of larger sets: their
// number and span against the null space of the 6×n matrix of the
// wrenches from gonum's mat.SVD (the right singular vectors of the zero
// singular values), and their form: reduced echelon (each combination has
// a wrench of its own, its pivot, with weight 0 in every other one, pivots
// in increasing order; for these sets, without near-dependencies at the
// level of pivotTol, the pivot is the first non-zero weight), largest
// weight exactly +1.
func TestRedundantAgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(81, 83))
	for _, n := range []int{7, 8, 12, 13, 24, 48, 96} {
		for _, kind := range []string{"general", "concurrent"} {
			ws := randLines(rng, n)
			rank := 6
			if kind == "concurrent" {
				c := randVec(rng)
				for i := range ws {
					ws[i] = scaleW(line(c, randVec(rng)), 0.1+rng.Float64())
				}
				rank = 3
			}
			r := mustAnalyze(t, ws)
			if r.Rank != rank || len(r.Redundant) != n-rank {
				t.Fatalf("%s n=%d: rank %d, %d redundancies", kind, n, r.Rank, len(r.Redundant))
			}
			d := mat.NewDense(6, n, nil)
			for j, w := range ws {
				for i, x := range [6]float64{w.F.X, w.F.Y, w.F.Z, w.M.X, w.M.Y, w.M.Z} {
					d.Set(i, j, x)
				}
			}
			var svd mat.SVD
			if !svd.Factorize(d, mat.SVDFull) {
				t.Fatal("gonum SVD failed")
			}
			var v mat.Dense
			svd.VTo(&v)
			null := v.Slice(0, n, rank, n) // n × (n − rank)
			lastPiv := -1
			for k, c := range r.Redundant {
				piv := -1
				big := 0.0
				for i, x := range c {
					if x != 0 && piv < 0 {
						piv = i
					}
					big = math.Max(big, math.Abs(x))
				}
				if piv <= lastPiv {
					t.Fatalf("%s n=%d: pivots not increasing at %d", kind, n, k)
				}
				lastPiv = piv
				if big != 1 || !contains(c, 1) {
					t.Errorf("%s n=%d: combination %d has largest weight %g", kind, n, k, big)
				}
				for l, o := range r.Redundant {
					if l != k && o[piv] != 0 {
						t.Errorf("%s n=%d: combination %d has weight %g on the pivot of %d", kind, n, l, o[piv], k)
					}
				}
				// In gonum's null space: |c − N·Nᵀ·c| small against |c|.
				cv := mat.NewVecDense(n, append([]float64(nil), c...))
				var p, back mat.VecDense
				p.MulVec(null.T(), cv)
				back.MulVec(null, &p)
				back.SubVec(cv, &back)
				if res := mat.Norm(&back, 2); res > 1e-11*mat.Norm(cv, 2) {
					t.Errorf("%s n=%d: combination %d is %g outside the null space", kind, n, k, res)
				}
			}
		}
	}
}

func contains(xs []float64, x float64) bool {
	for _, y := range xs {
		if y == x {
			return true
		}
	}
	return false
}

// TestNoAllocation checks the promise of Analyze and Freed: no heap
// allocation for up to twelve wrenches of full rank (at most six), and
// none for Freed.
func TestNoAllocation(t *testing.T) {
	rng := rand.New(rand.NewPCG(91, 97))
	cs := threeVee()
	six := placed(cs[:], 0.05, r3.Vec{})
	five := six[:5]
	var r Result
	for _, ws := range [][]Wrench{six, five, randLines(rng, 6), randLines(rng, 3)} {
		if a := testing.AllocsPerRun(50, func() { _ = Analyze(ws, &r) }); a != 0 {
			t.Errorf("Analyze of %d wrenches: %g allocations", len(ws), a)
		}
	}
	var a6 [6]Wrench
	copy(a6[:], six)
	var ts [6]Twist
	if a := testing.AllocsPerRun(50, func() { Freed(&a6, &ts) }); a != 0 {
		t.Errorf("Freed: %g allocations", a)
	}
}

// TestSubnormal checks sets whose components are subnormal or near the top
// of the float64 range against the same set at unit scale: the rank and
// the singular values are properties of the lines alone. The subnormal
// set keeps about 44 of the 53 bits (1e-310 over the smallest subnormal
// 4.9e-324), so agreement is to 1e-12.
func TestSubnormal(t *testing.T) {
	cs := threeVee()
	base := placed(cs[:], 0.05, r3.Vec{})
	r0 := mustAnalyze(t, base)
	for _, f := range []float64{1e-310, 1e300} {
		ws := make([]Wrench, len(base))
		for i, w := range base {
			ws[i] = scaleW(w, f)
		}
		r := mustAnalyze(t, ws)
		if r.Rank != r0.Rank {
			t.Fatalf("×%g: rank %d, want %d", f, r.Rank, r0.Rank)
		}
		if d := cmp.Diff(r0.Singular, r.Singular, cmpopts.EquateApprox(1e-12, 0)); d != "" {
			t.Errorf("×%g: singular values (-want +got):\n%s", f, d)
		}
		if math.Abs(r.Length-r0.Length) > 1e-12*r0.Length {
			t.Errorf("×%g: length %g, want %g", f, r.Length, r0.Length)
		}
	}
	// A single line a subnormal distance from the origin, with a moment
	// given to full precision: (ẑ, p × ẑ) for p = (3e-320, 0, 0) scaled
	// by 1e6. The line is 3e-320 m from the origin, and the set of it and
	// its parallel through the origin has rank 2 with Length 1.5e-320 m
	// (each line that far from the midpoint between them).
	p := r3.Vec{X: 3e-320}
	ws := []Wrench{scaleW(Wrench{F: r3.Vec{Z: 1}, M: r3.Cross(p, r3.Vec{Z: 1})}, 1e6), {F: r3.Vec{Z: 1}}}
	r := mustAnalyze(t, ws)
	if r.Rank != 2 || math.Abs(r.Length-1.5e-320) > 1e-3*1.5e-320 {
		t.Errorf("subnormal offset: rank %d, length %g; want 2 and 1.5e-320", r.Rank, r.Length)
	}
}
