package kinematic

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"runtime"
	"sort"
	"sync"
	"sync/atomic"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// StudyOptions holds options for [Assembly.Study]; the zero value and a
// nil pointer mean defaults: 100 000 first-order samples with seed 0 on
// GOMAXPROCS workers.
type StudyOptions struct {
	// Samples is the number of parts drawn, at most 1e7; zero means
	// 100 000, enough for the 99.73rd percentile to rest on 270 samples.
	Samples int

	// Seed makes the study reproducible: the same seed gives the same
	// samples and the same statistics whatever the number of workers.
	Seed uint64

	// Workers is the number of goroutines; zero means GOMAXPROCS.
	Workers int

	// Exact seats every sample with the exact model ([Assembly.Pose])
	// instead of the first-order one ([Assembly.Sensitivities]).
	Exact bool

	// Calibration holds deviations that are known (a measured part):
	// every sample starts from them, and the tolerances add to them.
	Calibration []Deviation

	// Progress, when not nil, is called with the samples done and the
	// total, after each block of samples, from one goroutine at a time.
	Progress func(done, total int)

	// KeepSamples keeps every seated sample's displacement in the result.
	KeepSamples bool
}

// Stats summarises one quantity over the N samples that seated.
type Stats struct {
	// Mean is the sample mean and StdDev the sample standard deviation
	// (divisor N − 1; 0 for one sample).
	Mean, StdDev float64

	// P50, P95, P99 and P9973 are percentiles of the quantity's
	// magnitude (for a coordinate, of its absolute value): the envelope
	// that holds that fraction of the parts. Each is a sample itself, by
	// the nearest-rank method (Hyndman & Fan 1996, The American
	// Statistician 50(4), definition 1): the ⌈qN⌉-th smallest magnitude
	// for the fraction q.
	P50, P95, P99, P9973 float64
}

// StudyResult is the outcome of a Monte Carlo tolerance study: the
// interchangeability of parts made to the drawing.
type StudyResult struct {
	Samples int // drawn; every one seated (a study in which a part cannot seat is an error)

	// X, Y and Z are the point of interest's displacement along the
	// frame's axes, m; Radial its magnitude, m; Tilt the magnitude of the
	// body's rotation, rad.
	X, Y, Z, Radial, Tilt Stats

	// Points holds each seated sample's displacement, in the order drawn,
	// when KeepSamples was set.
	Points []r3.Vec
}

// maxSamples bounds a study's memory: 32 bytes a sample.
const maxSamples = 10_000_000

// defaultSamples is the number of samples of a study whose options leave
// it zero.
const defaultSamples = 100_000

// studyBlock is the number of samples drawn from one random stream: block
// k uses the stream PCG(seed, k), so the samples do not depend on which
// worker draws them.
const studyBlock = 4096

// Study returns the Monte Carlo tolerance study of the point p of the
// moving body: each sample draws every toleranced dimension independently
// from its distribution, adds the calibration, seats the part (first-order
// or exact) and records where the point goes and how far the body turns.
// It answers "how far does a different part made to the same drawing
// sit" — interchangeability; how well the same part comes back is
// [Model.Repeatability]'s question.
//
// The study stops early with ctx's error when ctx is cancelled.
// Errors are those of [Assembly.Budget] and [Assembly.Pose] (for the
// calibration), and an [*InputError] naming "opt.Samples" out of range or
// "opt.Workers" negative; "tols[i].HalfWidth" or "tols[i].Sigma" (or
// "tols" for their sum, "opt.Calibration[i].Value", "p") wrapping
// [ErrRange] when a displacement can overflow: the first-order study
// bounds every sample by Σ |Sᵢ|·(HalfWidth, or maxNormal·Sigma).
func (a *Assembly) Study(ctx context.Context, p r3.Vec, tols []Tolerance, opt *StudyOptions) (StudyResult, error) {
	if err := a.check(); err != nil {
		return StudyResult{}, err
	}
	var o StudyOptions
	if opt != nil {
		o = *opt
	}
	if o.Samples == 0 {
		o.Samples = defaultSamples
	}
	opt = &o
	if opt.Samples < 0 || opt.Samples > maxSamples {
		return StudyResult{}, &InputError{Field: "opt.Samples", Err: fmt.Errorf("%w: must be in [1, %d], got %d", ErrRange, maxSamples, opt.Samples)}
	}
	if opt.Workers < 0 {
		return StudyResult{}, &InputError{Field: "opt.Workers", Err: fmt.Errorf("%w: must be ≥ 0, got %d", ErrRange, opt.Workers)}
	}
	if !linalg.Finite3(p) {
		return StudyResult{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	s, err := a.newSampler(p, tols, opt)
	if err != nil {
		return StudyResult{}, err
	}
	disp, tilt, ok := s.run(ctx, len(tols), opt)
	if err := ctx.Err(); err != nil {
		return StudyResult{}, err
	}
	res, failed := summarise(disp, tilt, ok, opt.KeepSamples)
	if failed > 0 {
		return StudyResult{}, &InputError{Field: "tols", Err: fmt.Errorf(
			"%w: %d of %d sampled parts cannot seat (a ball would leave its seat, exact model): the tolerances are too wide for the coupling, and statistics of the parts that do seat would understate the spread",
			ErrRange, failed, res.Samples)}
	}
	if !res.finite() {
		return StudyResult{}, &InputError{Field: "tols", Err: fmt.Errorf("%w: a sample's displacement overflows", ErrRange)}
	}
	return res, nil
}

// finite reports whether every statistic of the result is finite.
func (r *StudyResult) finite() bool {
	for _, s := range [...]*Stats{&r.X, &r.Y, &r.Z, &r.Radial, &r.Tilt} {
		if !allFinite(s.Mean, s.StdDev, s.P50, s.P95, s.P99, s.P9973) {
			return false
		}
	}
	return true
}

// maxNormal bounds |rand.NormFloat64()|: its ziggurat (Marsaglia & Tsang
// 2000, "The ziggurat method for generating random variables", J. Stat.
// Software 5(8); Go's math/rand/v2/normal.go) draws the tail beyond
// r = 3.442619855899 as r − ln(U₁)/r, with U₁ = k/2⁵³ from Rand.Float64:
// a non-zero U₁ is ≥ 2⁻⁵³, giving at most 3.44 + 36.7/3.44 ≈ 14.1; U₁ = 0
// gives +Inf, rejected unless U₂ is 0 too (probability 2⁻¹⁰⁶, caught by
// the result's finite check). 40 leaves room to spare.
const maxNormal = 40

// newSampler prepares the sampler of a study: the tolerances' limits and
// sensitivities, and the calibrated part.
func (a *Assembly) newSampler(p r3.Vec, tols []Tolerance, opt *StudyOptions) (*sampler, error) {
	idx, err := a.checkTolerances(tols)
	if err != nil {
		return nil, err
	}
	s := &sampler{a: a, p: p, pl: r3.Sub(p, a.origin), idx: idx, exact: opt.Exact}
	s.lim = make([]float64, len(tols))
	s.normal = make([]bool, len(tols))
	for i, t := range tols {
		if t.Sigma > 0 {
			s.lim[i], s.normal[i] = t.Sigma, true
		} else {
			s.lim[i] = t.HalfWidth
		}
	}
	// The calibrated part: its geometry for the exact model, its
	// first-order displacement for the linear one.
	s.base = a.nominal()
	for i, d := range opt.Calibration {
		k, err := a.lookup(d.Dimension, indexed("opt.Calibration", i)+".Dimension")
		if err != nil {
			return nil, err
		}
		if !linalg.Finite(d.Value) {
			return nil, &InputError{Field: indexed("opt.Calibration", i) + ".Value", Err: fmt.Errorf("%w: %g", ErrNonFinite, d.Value)}
		}
		a.apply(&s.base, k, d.Value)
		x := a.sensitivity(k)
		s.d0 = r3.Add(s.d0, r3.Scale(d.Value, x.At(s.pl)))
		s.w0 = r3.Add(s.w0, r3.Scale(d.Value, x.W))
	}
	if !allFinite3(s.d0, s.w0) {
		return nil, &InputError{Field: "opt.Calibration", Err: fmt.Errorf("%w: the calibrated displacement overflows", ErrRange)}
	}
	s.jd = make([]r3.Vec, len(tols))
	s.jw = make([]r3.Vec, len(tols))
	bound, tbound := linalg.Norm3(s.d0), linalg.Norm3(s.w0)
	for i, k := range idx {
		x := a.sensitivity(k)
		s.jd[i], s.jw[i] = x.At(s.pl), x.W
		if n := linalg.Norm3(s.jd[i]); !allFinite(n * n) {
			return nil, &InputError{Field: "p", Err: fmt.Errorf("%w: the displacement of %v per unit of %s overflows: the point is too far from the coupling", ErrRange, p, tols[i].Dimension)}
		}
		lim := s.lim[i]
		if s.normal[i] {
			lim *= maxNormal
		}
		bound += linalg.Norm3(s.jd[i]) * lim
		tbound += linalg.Norm3(s.jw[i]) * lim
		if d, w := linalg.Norm3(s.jd[i])*lim, linalg.Norm3(s.jw[i])*lim; !allFinite(d*d, w*w) {
			return nil, &InputError{Field: indexed("tols", i) + "." + tols[i].field(), Err: fmt.Errorf("%w: the displacement of %g on %s can overflow", ErrRange, tols[i].value(), tols[i].Dimension)}
		}
		if !allFinite(bound*bound, tbound*tbound) {
			return nil, &InputError{Field: "tols", Err: fmt.Errorf("%w: the sum of the tolerances' displacements can overflow", ErrRange)}
		}
	}
	s.prepareLinear()
	if opt.Exact {
		// The calibrated part itself must seat.
		var zero [6]float64
		base := s.base
		if _, err := a.seat(&base, &zero, 1e-13, 50); err != nil {
			return nil, err
		}
	}
	return s, nil
}

// run draws opt.Samples parts of nt toleranced dimensions in blocks of
// studyBlock, each block from its own stream of opt.Seed, on opt.Workers
// goroutines, and returns each part's displacement, tilt and whether it
// seated. It stops early, with the results partly filled, when ctx is
// done.
func (s *sampler) run(ctx context.Context, nt int, opt *StudyOptions) (disp []r3.Vec, tilt []float64, ok []bool) {
	n := opt.Samples
	disp = make([]r3.Vec, n)
	tilt = make([]float64, n)
	ok = make([]bool, n)
	workers := opt.Workers
	if workers == 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	blocks := (n + studyBlock - 1) / studyBlock
	workers = min(workers, blocks)
	var next atomic.Int64
	var mu sync.Mutex
	done := 0
	var wg sync.WaitGroup
	var stopped atomic.Bool
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			dev := make([]float64, nt)
			for {
				k := int(next.Add(1) - 1)
				if k >= blocks || stopped.Load() {
					return
				}
				if ctx.Err() != nil {
					stopped.Store(true)
					return
				}
				rng := rand.New(rand.NewPCG(opt.Seed, uint64(k)))
				lo, hi := k*studyBlock, min(n, (k+1)*studyBlock)
				for j := lo; j < hi; j++ {
					s.draw(rng, dev)
					disp[j], tilt[j], ok[j] = s.sample(dev)
				}
				if opt.Progress != nil {
					mu.Lock()
					done += hi - lo
					opt.Progress(done, n)
					mu.Unlock()
				}
			}
		}()
	}
	wg.Wait()
	return disp, tilt, ok
}

// sampler draws and seats samples; it is shared, read-only, by the
// workers.
type sampler struct {
	a      *Assembly
	p, pl  r3.Vec // the point of interest, in the frame and about the origin
	idx    []int
	lim    []float64
	normal []bool
	exact  bool
	base   geom         // the calibrated geometry
	d0, w0 r3.Vec       // its first-order displacement and tilt
	jd, jw []r3.Vec     // per toleranced dimension
	rows   [][6]float64 // the same side by side, for the linear sample (prepareLinear)
}

// draw fills dev with one sample of every toleranced dimension.
func (s *sampler) draw(rng *rand.Rand, dev []float64) {
	for i := range dev {
		if s.normal[i] {
			dev[i] = s.lim[i] * rng.NormFloat64()
		} else {
			dev[i] = s.lim[i] * (2*rng.Float64() - 1)
		}
	}
}

// prepareLinear fills s.rows from s.jd and s.jw: one row of six
// sensitivities per toleranced dimension (displacement of the point, then
// rotation), so that the linear sample reads them in one stream.
func (s *sampler) prepareLinear() {
	s.rows = make([][6]float64, len(s.jd))
	for i := range s.rows {
		d, w := s.jd[i], s.jw[i]
		s.rows[i] = [6]float64{d.X, d.Y, d.Z, w.X, w.Y, w.Z}
	}
}

// sample returns the displacement of the point and the tilt magnitude of
// one part with the deviations dev, and whether it seated.
func (s *sampler) sample(dev []float64) (r3.Vec, float64, bool) {
	if !s.exact {
		// The first-order model: the calibrated displacement plus the
		// sensitivities times the deviations, accumulated in the order of
		// the dimensions. dev re-sliced to the rows' length, so that the
		// loop has no bounds checks.
		rows := s.rows
		dev = dev[:len(rows)]
		d, w := s.d0, s.w0
		for i := range rows {
			v, r := dev[i], &rows[i]
			d.X += v * r[0]
			d.Y += v * r[1]
			d.Z += v * r[2]
			w.X += v * r[3]
			w.Y += v * r[4]
			w.Z += v * r[5]
		}
		// linalg.Norm3 inline for the usual range, where it is this
		// square root.
		if q := w.X*w.X + w.Y*w.Y + w.Z*w.Z; q > 0x1p-486 && q < 0x1p+486 {
			return d, math.Sqrt(q), true
		}
		return d, linalg.Norm3(w), true
	}
	g := s.base
	for i, v := range dev {
		s.a.apply(&g, s.idx[i], v)
	}
	var zero [6]float64
	pose, err := s.a.seat(&g, &zero, 1e-13, 50)
	if err != nil {
		return r3.Vec{}, 0, false
	}
	return r3.Sub(pose.Apply(s.p), s.p), linalg.Norm3(pose.Rotation), true
}

// summarise returns the statistics of the seated samples and the number
// of samples that could not seat.
func summarise(disp []r3.Vec, tilt []float64, ok []bool, keep bool) (res StudyResult, failed int) {
	res.Samples = len(disp)
	var xs, ys, zs, rs, ts []float64
	for i := range disp {
		if !ok[i] {
			failed++
			continue
		}
		d := disp[i]
		xs, ys, zs = append(xs, d.X), append(ys, d.Y), append(zs, d.Z)
		// The radial magnitude as r3.Norm gives it, so that a caller's
		// r3.Norm of a kept point reproduces the statistics exactly.
		rs, ts = append(rs, r3.Norm(d)), append(ts, tilt[i])
		if keep {
			res.Points = append(res.Points, d)
		}
	}
	res.X, res.Y, res.Z = stats(xs), stats(ys), stats(zs)
	res.Radial, res.Tilt = stats(rs), stats(ts)
	return res, failed
}

// stats returns the mean and standard deviation of x (Welford's update,
// Welford 1962, Technometrics 4(3)), and percentiles of |x| by the
// nearest-rank method on the sorted magnitudes.
func stats(x []float64) Stats {
	if len(x) == 0 {
		return Stats{}
	}
	var mean, m2 float64
	for i, v := range x {
		d := v - mean
		mean += d / float64(i+1)
		m2 += d * (v - mean)
	}
	s := Stats{Mean: mean}
	if len(x) > 1 {
		s.StdDev = math.Sqrt(m2 / float64(len(x)-1))
	}
	mag := make([]float64, len(x))
	for i, v := range x {
		mag[i] = math.Abs(v)
	}
	sort.Float64s(mag)
	pick := func(q float64) float64 {
		k := int(math.Ceil(q*float64(len(mag)))) - 1
		return mag[max(0, min(len(mag)-1, k))]
	}
	s.P50, s.P95, s.P99, s.P9973 = pick(0.50), pick(0.95), pick(0.99), pick(0.9973)
	return s
}
