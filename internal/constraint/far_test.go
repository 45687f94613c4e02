package constraint

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

// farBound is the agreement the tests below ask of two placements of one
// set, relative to σ₁: twice momentRounding·ε·far/Length. Each placement's
// normalised matrix is within 17ε·far/Length of the exact one (see
// momentRounding: the moments about the origin carry rounding of ε times
// the distance, which is the precision the coordinates themselves have),
// so by Weyl's inequality (Golub & Van Loan, Matrix Computations, 4th ed.,
// 2013, Corollary 8.6.2) each singular value is that close to the exact
// one; Centre and Length are computed from the same rounded moments and
// move the normalisation by the same order.
func farBound(far, length float64) float64 {
	return 2 * momentRounding * eps * far / length
}

// TestFarFromOrigin places the test coupling (100 mm across at s = 0.05,
// 0.1 mm across at s = 5e-5) at the origin, 1000 times larger, 10 km away
// and 10 m away, and checks that the verdicts do not change: the same
// rank, singular values to the precision the coordinates carry, the same
// freed twists (equal velocities at corresponding contact points, W
// scaled by 1/s), and for five of the contacts the same free twist. A
// placement p → s·p + o of a twist (W, V) is (W/s, V − (W/s)×o): it has
// the same power with the placed wrenches, W/s·(s·M + o×F) + (V −
// (W/s)×o)·F = W·M + V·F, and the velocity V + W×q at s·q + o.
func TestFarFromOrigin(t *testing.T) {
	cs := threeVee()
	ref := placed(cs[:], 1, r3.Vec{})
	r0 := mustAnalyze(t, ref)
	f0 := mustAnalyze(t, ref[:5])
	dir := r3.Unit(r3.Vec{X: 6, Y: -7, Z: 3.6}) // a general direction
	for _, pl := range []struct {
		name string
		s    float64
		off  float64
	}{
		{"100 mm at the origin", 0.05, 0},
		{"100 m at the origin (×1000)", 50, 0},
		{"100 mm, 10 km away", 0.05, 1e4},
		{"0.1 mm, 10 m away", 5e-5, 10},
		{"0.1 mm, 100 km away", 5e-5, 1e5},
	} {
		o := r3.Scale(pl.off, dir)
		ws := placed(cs[:], pl.s, o)
		r := mustAnalyze(t, ws)
		if r.Rank != 6 || r.NearSingular != r0.NearSingular || !r.HasFreed {
			t.Fatalf("%s: rank %d, near-singular %v, freed %v; want 6, %v, true", pl.name, r.Rank, r.NearSingular, r.HasFreed, r0.NearSingular)
		}
		far := pl.off + 1.2*pl.s // the contacts lie within 1.2·s of o
		tol := math.Max(farBound(far, r.Length), 1e-14)
		if math.Abs(r.Length-pl.s*r0.Length) > tol*pl.s*r0.Length {
			t.Errorf("%s: length %g, want %g", pl.name, r.Length, pl.s*r0.Length)
		}
		for i := range r.K {
			if d := math.Abs(r.Singular[i] - r0.Singular[i]); d > tol*r0.Singular[0] {
				t.Errorf("%s: singular[%d] = %.17g, want %.17g (bound %.2g)", pl.name, i, r.Singular[i], r0.Singular[i], tol)
			}
		}
		// Freed: the velocity of contact i's point under twist j, and W·s.
		// The twists are as accurate as the matrix, times Condition.
		ttol := 10 * tol * r0.Condition
		for j := range r.Freed {
			t0, t1 := r0.Freed[j], r.Freed[j]
			if d := r3.Norm(r3.Sub(r3.Scale(pl.s, t1.W), t0.W)); d > ttol*r3.Norm(t0.W) {
				t.Errorf("%s: freed %d: s·W = %v, want %v", pl.name, j, r3.Scale(pl.s, t1.W), t0.W)
			}
			for i, c := range cs {
				v0 := r3.Add(t0.V, r3.Cross(t0.W, c.p))
				q := r3.Add(r3.Scale(pl.s, c.p), o)
				v1 := r3.Add(t1.V, r3.Cross(t1.W, q))
				if d := r3.Norm(r3.Sub(v1, v0)); d > ttol*twistNorm(t0)*(1+r3.Norm(c.p)) {
					t.Errorf("%s: freed %d moves contact %d at %v, want %v", pl.name, j, i, v1, v0)
				}
			}
		}
		var ts [6]Twist
		var a6 [6]Wrench
		copy(a6[:], ws)
		if !Freed(&a6, &ts) {
			t.Fatalf("%s: Freed reports a singular set", pl.name)
		}
		for j := range ts {
			if d := twistDiff(ts[j], r.Freed[j]); d > ttol*twistNorm(r.Freed[j]) {
				t.Errorf("%s: Freed %d = %v, Analyze %v", pl.name, j, ts[j], r.Freed[j])
			}
		}
		// Five contacts: one free twist, |W| = 1, so the placed one is
		// (W, s·V − W×o), with velocity s·(V + W×q) at s·q + o.
		f := mustAnalyze(t, ws[:5])
		if f.Rank != 5 {
			t.Fatalf("%s: five contacts of rank %d", pl.name, f.Rank)
		}
		t0, t1 := f0.Free[0], f.Free[0]
		if d := r3.Norm(r3.Sub(t1.W, t0.W)); d > ttol {
			t.Errorf("%s: free W = %v, want %v", pl.name, t1.W, t0.W)
		}
		for i, c := range cs {
			v0 := r3.Scale(pl.s, r3.Add(t0.V, r3.Cross(t0.W, c.p)))
			v1 := r3.Add(t1.V, r3.Cross(t1.W, r3.Add(r3.Scale(pl.s, c.p), o)))
			if d := r3.Norm(r3.Sub(v1, v0)); d > ttol*pl.s*(twistNorm(t0)+r3.Norm(c.p)) {
				t.Errorf("%s: free twist moves contact %d at %v, want %v", pl.name, i, v1, v0)
			}
		}
	}
}

// TestFarLimit checks the two ends of the precision the coordinates carry.
// The test coupling 0.1 mm across placed 1e6 m away (size/distance 5e-11,
// above the limit of 7.1e-12) keeps its verdict and its real Length; placed
// 1e8 m away (5e-13) it cannot be judged and Analyze says so with
// errs.ErrRange, and Freed reports false. Lines that do meet in one point far
// away are concurrent, Length 0, rank 3 (three independent lines through a
// point leave the rotations about it free: Hunt, Kinematic Geometry of
// Mechanisms, 1978, §12.6), even when their directions lie within 1e-3 rad
// of each other, where the least-squares point is ill-determined along the
// common direction.
func TestFarLimit(t *testing.T) {
	cs := threeVee()
	dir := r3.Unit(r3.Vec{X: 6, Y: -7, Z: 3.6})
	r0 := mustAnalyze(t, placed(cs[:], 1, r3.Vec{}))

	ws := placed(cs[:], 5e-5, r3.Scale(1e6, dir))
	r := mustAnalyze(t, ws)
	if r.Rank != 6 || r.NearSingular || math.Abs(r.Length-5e-5*r0.Length) > 1e-4*5e-5*r0.Length {
		t.Errorf("1e6 m away: rank %d, near-singular %v, length %g; want 6, false, %g", r.Rank, r.NearSingular, r.Length, 5e-5*r0.Length)
	}

	ws = placed(cs[:], 5e-5, r3.Scale(1e8, dir))
	err := Analyze(ws, &r)
	var ce *Error
	if !errors.As(err, &ce) || ce.Index != -1 || !errors.Is(err, errs.ErrRange) {
		t.Errorf("1e8 m away: err = %v, want *Error on the set wrapping errs.ErrRange", err)
	}
	var a6 [6]Wrench
	var ts [6]Twist
	copy(a6[:], ws)
	if Freed(&a6, &ts) {
		t.Error("1e8 m away: Freed reports an independent set")
	}

	q := r3.Vec{X: 3e6, Y: -2e6, Z: 5e6}
	for _, spread := range []float64{1, 1e-3} {
		dirs := []r3.Vec{{Z: 1}, {X: spread, Z: 1}, {Y: spread, Z: 1}, {X: -spread, Y: -spread, Z: 1}}
		ws := make([]Wrench, len(dirs))
		for i, d := range dirs {
			ws[i] = line(q, d)
		}
		r := mustAnalyze(t, ws)
		if r.Rank != 3 || r.Length != 0 || len(r.Redundant) != 1 {
			t.Errorf("concurrent 6e6 m away, spread %g: rank %d, length %g, %d redundant; want 3, 0, 1", spread, r.Rank, r.Length, len(r.Redundant))
		}
		if d := r3.Norm(r3.Sub(r.Centre, q)); d > 1e-9*r3.Norm(q)/spread {
			t.Errorf("concurrent, spread %g: centre %v, want %v", spread, r.Centre, q)
		}
	}
}
