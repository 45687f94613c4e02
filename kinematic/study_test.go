package kinematic

import (
	"context"
	"errors"
	"math"
	"reflect"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// studyTolerances returns normal tolerances on a mix of dimensions of the
// three-vee assembly: ball radii and centres, seat positions, a turn and
// a half-angle.
func studyTolerances() []Tolerance {
	return []Tolerance{
		{Dimension: "A.Ball.Radius", Sigma: 1e-6}, {Dimension: "B.Ball.Radius", Sigma: 1e-6}, {Dimension: "C.Ball.Radius", Sigma: 1e-6},
		{Dimension: "A.Ball.X", Sigma: 2e-6}, {Dimension: "B.Ball.Y", Sigma: 2e-6}, {Dimension: "C.Ball.Z", Sigma: 2e-6},
		{Dimension: "A.Seat.X", Sigma: 3e-6}, {Dimension: "B.Seat.Z", Sigma: 3e-6}, {Dimension: "C.Seat.Turn", Sigma: 1e-4},
		{Dimension: "B.Seat.HalfAngle", Sigma: 2e-4}, {Dimension: "C.Seat.Flank+", Sigma: 1e-6},
	}
}

// TestStudyLinearMoments: for the linear model with normal tolerances the
// displacement of the point is exactly normal with mean zero and variance
// Σ (Jᵈ σᵈ)² per axis (a linear map of independent normals: the linear
// covariance JΣJᵀ). The sample mean is tested against 0 with a z-test at
// 4.5 standard errors, and the sample variance against σ² with
// (N−1)s²/σ² ~ χ²(N−1), approximately normal with standard deviation
// √(2/(N−1)) in s²/σ² at N = 2e5, at 4.5 of those: each check has a
// false-alarm rate of about 7e-6 over seeds (two-sided normal tail at
// 4.5σ), and the seed is fixed.
func TestStudyLinearMoments(t *testing.T) {
	a := generalAssemblies(t)["three-vee"]
	p := r3.Vec{X: 0.01, Y: 0.02, Z: 0.05}
	tols := studyTolerances()
	const n = 200000
	res, err := a.Study(context.Background(), p, tols, &StudyOptions{Samples: n, Seed: 7})
	if err != nil {
		t.Fatal(err)
	}
	sens, _ := a.Sensitivities(p)
	idx, _ := a.checkTolerances(tols)
	var vx, vy, vz float64
	for i, k := range idx {
		j := sens[k].Displacement
		s := tols[i].Sigma
		vx, vy, vz = vx+j.X*j.X*s*s, vy+j.Y*j.Y*s*s, vz+j.Z*j.Z*s*s
	}
	for _, c := range []struct {
		name string
		st   Stats
		v    float64
	}{{"x", res.X, vx}, {"y", res.Y, vy}, {"z", res.Z, vz}} {
		sd := math.Sqrt(c.v)
		if math.Abs(c.st.Mean) > 4.5*sd/math.Sqrt(n) {
			t.Errorf("%s: mean %g, want 0 within %g", c.name, c.st.Mean, 4.5*sd/math.Sqrt(n))
		}
		if r := c.st.StdDev * c.st.StdDev / c.v; math.Abs(r-1) > 4.5*math.Sqrt(2.0/(n-1)) {
			t.Errorf("%s: s²/σ² = %g, want 1 within %g", c.name, r, 4.5*math.Sqrt(2.0/(n-1)))
		}
	}
	// The budget's Sigma is the root of the summed variances.
	b, err := a.Budget(p, tols)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(b.Sigma*b.Sigma-(vx+vy+vz)) > 1e-12*(vx+vy+vz) {
		t.Errorf("budget sigma² %g, want %g", b.Sigma*b.Sigma, vx+vy+vz)
	}
	for i := 1; i < len(b.Contributors); i++ {
		if b.Contributors[i].Effect > b.Contributors[i-1].Effect {
			t.Errorf("contributors not ranked at %d", i)
		}
	}
	// A normal coordinate's |x| has its 50th percentile at 0.6745σ
	// (the quartile of the standard normal, Abramowitz & Stegun 1964,
	// Table 26.1); check within 1 %.
	if r := res.Z.P50 / math.Sqrt(vz); math.Abs(r-0.6745) > 0.01*0.6745 {
		t.Errorf("z: P50/σ = %g, want 0.6745", r)
	}

	// The variances above come from Sensitivities; beside them, one worked
	// by hand. On the equilateral three-vee with 90° vees on the
	// bisectors, a ball larger by e rises √2 e in its vee and moves the
	// centroid of the balls up by (√2/3) e, and not sideways (item 7 of
	// kinematic/design's evaluate_test.go). Three normal radius tolerances
	// of σ then give z the variance 3 (√2/3)² σ² = (2/3) σ², tested as
	// above.
	bis, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	ab, err := bis.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	const sigma = 1e-6
	eq, err := ab.Study(context.Background(), r3.Vec{}, []Tolerance{
		{Dimension: "A.Ball.Radius", Sigma: sigma}, {Dimension: "B.Ball.Radius", Sigma: sigma}, {Dimension: "C.Ball.Radius", Sigma: sigma},
	}, &StudyOptions{Samples: n, Seed: 7})
	if err != nil {
		t.Fatal(err)
	}
	vh := 2.0 / 3 * sigma * sigma
	if math.Abs(eq.Z.Mean) > 4.5*math.Sqrt(vh/n) {
		t.Errorf("equilateral z: mean %g, want 0 within %g", eq.Z.Mean, 4.5*math.Sqrt(vh/n))
	}
	if r := eq.Z.StdDev * eq.Z.StdDev / vh; math.Abs(r-1) > 4.5*math.Sqrt(2.0/(n-1)) {
		t.Errorf("equilateral z: s²/σ² = %g, want 1 within %g", r, 4.5*math.Sqrt(2.0/(n-1)))
	}
	if eq.X.StdDev > 1e-9*math.Sqrt(vh) || eq.Y.StdDev > 1e-9*math.Sqrt(vh) {
		t.Errorf("equilateral: lateral spread %g, %g m, want none", eq.X.StdDev, eq.Y.StdDev)
	}
}

// TestStudyReproducible: the same seed gives identical results on one
// worker and on four; another seed gives different ones; the exact model
// agrees with the linear one for micrometre tolerances to well within the
// spread; progress reaches the total; cancellation stops the study.
func TestStudyReproducible(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"]
	p := r3.Vec{Z: 0.04}
	tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 2e-6}, {Dimension: "B.Seat.Y", HalfWidth: 5e-6}, {Dimension: "C.Seat.Height", Sigma: 3e-6}, {Dimension: "B.Seat.Turn", HalfWidth: 1e-4}}
	run := func(workers int, seed uint64, exact bool) StudyResult {
		var last, total int
		res, err := a.Study(context.Background(), p, tols, &StudyOptions{
			Samples: 20000, Seed: seed, Workers: workers, Exact: exact, KeepSamples: true,
			Progress: func(done, n int) { last, total = done, n },
		})
		if err != nil {
			t.Fatal(err)
		}
		if last != total || total != 20000 {
			t.Errorf("progress ended at %d of %d", last, total)
		}
		return res
	}
	one, four := run(1, 3, false), run(4, 3, false)
	if !reflect.DeepEqual(one, four) {
		t.Error("seed 3: one worker and four workers differ")
	}
	if other := run(2, 4, false); other.Radial.Mean == one.Radial.Mean {
		t.Error("seeds 3 and 4 give the same mean")
	}
	ex1, ex4 := run(1, 3, true), run(4, 3, true)
	if !reflect.DeepEqual(ex1, ex4) {
		t.Error("exact model: one worker and four workers differ")
	}
	// Same samples, two models: they differ at second order, about
	// |deviation|²/size ≈ (5e-6)²/0.05 = 5e-10 m, far below the spread.
	for i := range ex1.Points {
		if d := r3.Norm(r3.Sub(ex1.Points[i], one.Points[i])); d > 1e-8 {
			t.Fatalf("sample %d: exact and linear differ by %g m", i, d)
		}
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := a.Study(ctx, p, tols, &StudyOptions{Samples: 100000}); !errors.Is(err, context.Canceled) {
		t.Errorf("cancelled study: %v", err)
	}
	for _, o := range []*StudyOptions{{Samples: -1}, {Samples: 10_000_001}, {Samples: 10, Workers: -1}} {
		if _, err := a.Study(context.Background(), p, tols, o); !errors.Is(err, ErrRange) {
			t.Errorf("options %+v: %v", o, err)
		}
	}
	// Nil options and zero Samples mean the documented default of 100 000
	// first-order samples.
	for _, o := range []*StudyOptions{nil, {}} {
		res, err := a.Study(context.Background(), p, tols, o)
		if err != nil || res.Samples != 100_000 {
			t.Errorf("options %+v: %d samples, %v; want the documented 100 000", o, res.Samples, err)
		}
	}
	var ie *InputError
	if _, err := a.Study(context.Background(), p, []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: -1}}, &StudyOptions{Samples: 10}); !errors.As(err, &ie) || ie.Field != "tols[0].HalfWidth" {
		t.Errorf("negative tolerance: %v", err)
	}
	if _, err := a.Study(context.Background(), p, []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 1e-6}, {Dimension: "A.Ball.Radius", HalfWidth: 1e-6}}, &StudyOptions{Samples: 10}); !errors.As(err, &ie) || ie.Field != "tols[1].Dimension" {
		t.Errorf("repeated dimension: %v", err)
	}
}
