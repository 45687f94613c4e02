package kinematic

import (
	"context"
	"errors"
	"math"
	"sort"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/gonum/stat/distuv"
)

// TestStudyStatsSmallSample checks the statistics of a study on samples few
// enough that a rank off by one changes every percentile. The definition is
// that documented on Stats in study.go: the mean and the
// sample standard deviation (divisor N − 1), and the percentile q of the
// magnitudes by the nearest rank, the ⌈qN⌉-th smallest magnitude. Worked by
// hand for the ranks:
//
//	N = 7:    P50 = 4th (⌈3.5⌉); P95, P99, P99.73 = 7th (⌈6.65⌉, ⌈6.93⌉, ⌈6.98⌉)
//	N = 1001: P50 = 501st (⌈500.5⌉), P95 = 951st (⌈950.95⌉),
//	          P99 = 991st (⌈990.99⌉), P99.73 = 999th (⌈998.2973⌉)
//
// (no product qN is an integer, so rounding cannot move a rank). The
// statistics are recomputed here from the kept samples with these
// definitions (two-pass mean and variance) and must agree.
func TestStudyStatsSmallSample(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"]
	p := r3.Vec{X: 0.02, Y: -0.01, Z: 0.04}
	tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 2e-6}, {Dimension: "B.Seat.Y", Sigma: 5e-6}, {Dimension: "C.Seat.Height", Sigma: 3e-6}, {Dimension: "B.Seat.Turn", HalfWidth: 1e-4}}
	for _, tc := range []struct {
		n     int
		ranks [4]int // 1-based: P50, P95, P99, P99.73
	}{{7, [4]int{4, 7, 7, 7}}, {1001, [4]int{501, 951, 991, 999}}} {
		res, err := a.Study(context.Background(), p, tols, &StudyOptions{Samples: tc.n, Seed: 11, KeepSamples: true})
		if err != nil {
			t.Fatal(err)
		}
		if len(res.Points) != tc.n || res.Samples != tc.n {
			t.Fatalf("N = %d: kept %d of %d samples", tc.n, len(res.Points), res.Samples)
		}
		for _, q := range []struct {
			name string
			st   Stats
			of   func(r3.Vec) float64
		}{
			{"x", res.X, func(v r3.Vec) float64 { return v.X }},
			{"y", res.Y, func(v r3.Vec) float64 { return v.Y }},
			{"z", res.Z, func(v r3.Vec) float64 { return v.Z }},
			{"radial", res.Radial, r3.Norm},
		} {
			x := make([]float64, tc.n)
			var sum float64
			for i, v := range res.Points {
				x[i] = q.of(v)
				sum += x[i]
			}
			mean := sum / float64(tc.n)
			var ss float64
			for _, v := range x {
				ss += (v - mean) * (v - mean)
			}
			sd := math.Sqrt(ss / float64(tc.n-1))
			if math.Abs(q.st.Mean-mean) > 1e-12*(math.Abs(mean)+sd) || math.Abs(q.st.StdDev-sd) > 1e-12*sd {
				t.Errorf("N = %d, %s: mean, sd = %g, %g; want %g, %g", tc.n, q.name, q.st.Mean, q.st.StdDev, mean, sd)
			}
			mag := make([]float64, tc.n)
			for i, v := range x {
				mag[i] = math.Abs(v)
			}
			sort.Float64s(mag)
			got := [4]float64{q.st.P50, q.st.P95, q.st.P99, q.st.P9973}
			for j, name := range []string{"P50", "P95", "P99", "P99.73"} {
				if want := mag[tc.ranks[j]-1]; got[j] != want {
					t.Errorf("N = %d, %s: %s = %g, want the %d-th smallest magnitude %g", tc.n, q.name, name, got[j], tc.ranks[j], want)
				}
			}
		}
	}
}

// TestStudyDistributions checks the draws of a uniform and a normal
// tolerance through a dimension whose effect is known by hand: on the
// equilateral three-vee with 90° vees on the bisectors, a ball larger by e
// rises e/sin θ = √2 e in its vee and the body turns about the line
// through the other two centres, so the centroid of the balls (the origin)
// rises by (√2/3) e and does not move sideways (the derivation of item 7
// in kinematic/design's evaluate_test.go). The point's z is then the draw
// times √2/3.
//
// Uniform on [−a, a]: mean 0 by symmetry and variance
// ∫ x²/(2a) dx over [−a, a] = a²/3 (by hand; the textbook w²/12 for an
// interval of width w = 2a), so σ = a/√3; |z| is uniform on [0, (√2/3) a],
// so its q-percentile is q (√2/3) a. Normal with σ = a:
// |z|'s q-percentile is the normal quantile at (1 + q)/2 times (√2/3) a
// (gonum's distuv.UnitNormal as the reference).
//
// Sampling errors at N = 2e5, each allowed 4.5 standard errors (a false
// alarm about 7e-6 per check, and the seed is fixed): the mean σ/√N; the
// ratio s²/σ² √((κ − 1)/N) with the kurtosis κ = 9/5 (uniform) or 3
// (normal); the fraction of positive draws 0.5/√N (symmetry); a
// percentile √(q(1 − q)/N)/f(x_q) with f the density of |z| at it.
func TestStudyDistributions(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	const (
		n   = 200000
		lim = 1e-6
		k   = 4.5
	)
	gain := math.Sqrt2 / 3
	for _, tc := range []struct {
		name     string
		normal   bool
		sigma    float64
		limit    float64 // the budget's worst-case deviation
		kurtosis float64
		quantile func(q float64) float64 // of |z|
		density  func(x float64) float64 // of |z|
	}{
		{"uniform", false, gain * lim / math.Sqrt(3), lim, 9.0 / 5,
			func(q float64) float64 { return q * gain * lim },
			func(float64) float64 { return 1 / (gain * lim) }},
		{"normal", true, gain * lim, 3 * lim, 3,
			func(q float64) float64 { return distuv.UnitNormal.Quantile((1+q)/2) * gain * lim },
			func(x float64) float64 { return 2 * distuv.UnitNormal.Prob(x/(gain*lim)) / (gain * lim) }},
	} {
		tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: lim}}
		if tc.normal {
			tols[0] = Tolerance{Dimension: "A.Ball.Radius", Sigma: lim}
		}
		res, err := a.Study(context.Background(), r3.Vec{}, tols, &StudyOptions{Samples: n, Seed: 5, KeepSamples: true})
		if err != nil {
			t.Fatal(err)
		}
		// The error budget takes the same σ, exactly.
		b, err := a.Budget(r3.Vec{}, tols)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(b.Sigma-tc.sigma) > 1e-12*tc.sigma {
			t.Errorf("%s: budget σ %g, want %g", tc.name, b.Sigma, tc.sigma)
		}
		// Its worst case takes ±a for a uniform tolerance and ±3σ for a
		// normal one (the documented limits, common practice); with one
		// tolerance the RSS equals the worst case.
		if math.Abs(b.Worst-gain*tc.limit) > 1e-12*gain*tc.limit || math.Abs(b.RSS-gain*tc.limit) > 1e-12*gain*tc.limit {
			t.Errorf("%s: budget worst case %g, RSS %g; want both %g", tc.name, b.Worst, b.RSS, gain*tc.limit)
		}
		z := res.Z
		if tol := k * tc.sigma / math.Sqrt(n); math.Abs(z.Mean) > tol {
			t.Errorf("%s: mean %g, want 0 within %g", tc.name, z.Mean, tol)
		}
		if r, tol := z.StdDev*z.StdDev/(tc.sigma*tc.sigma), k*math.Sqrt((tc.kurtosis-1)/n); math.Abs(r-1) > tol {
			t.Errorf("%s: s²/σ² = %g, want 1 within %g", tc.name, r, tol)
		}
		var pos int
		for _, v := range res.Points {
			if v.Z > 0 {
				pos++
			}
			if math.Hypot(v.X, v.Y) > 1e-9*math.Abs(v.Z)+1e-22 {
				t.Fatalf("%s: sample %v moves sideways", tc.name, v)
			}
		}
		if f, tol := float64(pos)/n, k*0.5/math.Sqrt(n); math.Abs(f-0.5) > tol {
			t.Errorf("%s: %g of the draws positive, want 1/2 within %g", tc.name, f, tol)
		}
		for _, q := range []struct {
			name string
			got  float64
			q    float64
		}{{"P50", z.P50, 0.5}, {"P95", z.P95, 0.95}, {"P99", z.P99, 0.99}, {"P99.73", z.P9973, 0.9973}} {
			want := tc.quantile(q.q)
			tol := k * math.Sqrt(q.q*(1-q.q)/n) / tc.density(want)
			if math.Abs(q.got-want) > tol {
				t.Errorf("%s: %s = %g, want %g within %g", tc.name, q.name, q.got, want, tol)
			}
		}
	}
}

// TestStudyRefusesUnseatedParts: an exact study whose tolerances let a
// part fall off its seats is an error, not statistics of the parts that
// happen to seat. Ball A (radius r = 5 mm) sits in a cube-corner socket
// (half-angle θ = atan(1/√2), sin θ = 1/√3): its centre is r/sin θ = √3·r
// from the apex and each contact √(3−1)·r = √2·r from it, the whole
// figure similar about the apex, so a radius r + Δ moves every contact
// √2·|Δ| across its face. The exact model gives up when a contact moves
// more than half the actual radius (leaveFraction): √2·|Δ| > (r + Δ)/2,
// that is Δ > 2.73 mm or Δ < −1.31 mm. A radius of 5 mm ± 4.9 mm (within
// the ball's radius, so not refused as a unit slip) draws such a Δ with
// probability (2.17 + 3.59)/9.8 ≈ 0.59, so some of 200 samples fail (the
// chance that none does is 0.41^200 ≈ 1e-77).
func TestStudyRefusesUnseatedParts(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"]
	_, err := a.Study(context.Background(), r3.Vec{}, []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 4.9e-3}},
		&StudyOptions{Samples: 200, Exact: true, Seed: 3})
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "tols" || !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), "cannot seat") {
		t.Errorf("exact study with a ±4.9 mm radius tolerance: %v", err)
	}
}
