package kinematic

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// symmetricModel returns three bisector vees at 120° with the preload and
// the payload on the axis: the vertical translation is a mode of its own
// (by the three-fold symmetry), and the lateral modes come in pairs of
// equal frequency.
func symmetricModel(t testing.TB) *Model {
	t.Helper()
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	m, err := NewModel(mustContacts(t, c), []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}},
		Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}, Inertia: [3][3]float64{{1e-3, 0, 0}, {0, 1e-3, 0}, {0, 0, 1.6e-3}}})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

var gravityDown = LoadCase{Gravity: r3.Vec{Z: -StandardGravity}}

// verticalMode returns the frequency of the vertical mode: the one whose
// effective mass along Z is the payload's.
func verticalMode(t *testing.T, r Random) float64 {
	for i, e := range r.EffectiveMass {
		if math.Abs(e.Z-0.8) < 1e-9 {
			return r.Modes[i]
		}
	}
	t.Fatalf("no mode carries the whole vertical mass: %v", r.EffectiveMass)
	return 0
}

func TestRandomWhiteNoiseSDOF(t *testing.T) {
	m := symmetricModel(t)
	const S0, zeta = 0.04, 0.02
	probe, err := m.Random(gravityDown, Spectrum{Points: []Breakpoint{{Frequency: 10, ASD: S0}, {Frequency: 20, ASD: S0}}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	fn := verticalMode(t, probe)
	white := Spectrum{Points: []Breakpoint{{Frequency: fn / 1000, ASD: S0}, {Frequency: fn * 1000, ASD: S0}}}
	r, err := m.Random(gravityDown, white, &RandomOptions{Damping: []float64{zeta}, Point: r3.Vec{Z: 0.03}})
	if err != nil {
		t.Fatal(err)
	}
	// Exact RMS response of a single-degree-of-freedom oscillator to white
	// base acceleration S (per Hz) over 0 < f < ∞ (Crandall & Mark, Random
	// Vibration in Mechanical Systems, 1963, ch. 2 — from memory; derived
	// by hand by residues): ∫|H|² dω = π/(2ζω_n³) over −∞ < ω < ∞, so
	//   relative displacement: σ_z² = S/(8ζω_n³),
	//   absolute acceleration: σ_a² = S·f_n·π(1 + 4ζ²)/(4ζ).
	// The band [f_n/1000, 1000 f_n] leaves out, to first order (by hand:
	// |T|² ≈ 1 and |H|² ≈ 1/ω_n⁴ well below f_n; above 1000 f_n the tails
	// are 4ζ²f_n/1000 and less, 4e-8 of the whole), f_n/1000 of ∫|T|² df
	// and f_n/(1000 ω_n⁴) of ∫|H|² df; with these subtracted, what is left
	// is the quadrature's error, which the package doc states is below
	// 1e-5: the tolerance.
	S := S0 * StandardGravity * StandardGravity
	wn := 2 * math.Pi * fn
	wantZ2 := S * (1/(8*zeta*wn*wn*wn) - fn/1000/(wn*wn*wn*wn))
	wantA2 := S * (fn*math.Pi*(1+4*zeta*zeta)/(4*zeta) - fn/1000)
	if got := r.Displacement.RMS * r.Displacement.RMS; math.Abs(got/wantZ2-1) > 1e-5 {
		t.Errorf("relative displacement variance %g, want %g (Crandall & Mark)", got, wantZ2)
	}
	t.Logf("quadrature residuals: displacement %.2g, acceleration %.2g", r.Displacement.RMS*r.Displacement.RMS/wantZ2-1, r.Centre.RMS*r.Centre.RMS/wantA2-1)
	if got := r.Centre.RMS * r.Centre.RMS; math.Abs(got/wantA2-1) > 1e-5 {
		t.Errorf("absolute acceleration variance %g, want %g (Crandall & Mark)", got, wantA2)
	}
	if r.Point != r.Centre || r.Centre.Peak != 3*r.Centre.RMS {
		t.Errorf("the point at the centre of mass: %+v, want %+v with a 3σ peak", r.Point, r.Centre)
	}
	if r.Tilt.RMS > 1e-9*r.Displacement.RMS/0.05 {
		t.Errorf("vertical excitation of a symmetric payload tilts it: %g rad", r.Tilt.RMS)
	}
	// Miles' equation (J. W. Miles, "On structural fatigue under random
	// loading", J. Aeronautical Sciences 21 (1954) 753–762):
	// g_rms = √(π/2 · f_n · Q · ASD). It leaves out the factor (1 + 4ζ²)
	// on the variance (the damper's force transmitted to the mass, by
	// hand from the line above), so for light damping it is low by
	// 2ζ² = 0.08 % of the RMS at ζ = 0.02.
	miles := math.Sqrt(math.Pi / 2 * fn * (1 / (2 * zeta)) * S0)
	ratio := r.Centre.RMS / StandardGravity / miles
	if math.Abs(ratio-math.Sqrt(1+4*zeta*zeta)) > 3e-5 {
		t.Errorf("library/Miles = %.6f, want √(1+4ζ²) = %.6f", ratio, math.Sqrt(1+4*zeta*zeta))
	}
	// The effective masses along each axis sum to the payload's mass
	// (completeness of the mass-normalised modes, by hand).
	var sum r3.Vec
	for _, e := range r.EffectiveMass {
		sum = r3.Add(sum, e)
	}
	if !near(sum, r3.Vec{X: 0.8, Y: 0.8, Z: 0.8}, 1e-9) {
		t.Errorf("effective masses sum to %v, want 0.8 kg on each axis", sum)
	}
	// Q = 25 is ζ = 0.02.
	rq, err := m.Random(gravityDown, white, &RandomOptions{Q: []float64{25}, Point: r3.Vec{Z: 0.03}})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rq.Centre.RMS/r.Centre.RMS-1) > 1e-12 {
		t.Errorf("Q = 25 gives %g, ζ = 0.02 gives %g", rq.Centre.RMS, r.Centre.RMS)
	}
}

// cqc is the complete quadratic combination's correlation coefficient of
// two modes under white noise (A. Der Kiureghian, "A response spectrum
// method for random vibration analysis of MDF systems", Earthquake
// Engineering and Structural Dynamics 9 (1981) 419–435; from memory),
// r = ω_s/ω_r: exact for the displacement responses to white noise.
func cqc(zr, zs, r float64) float64 {
	return 8 * math.Sqrt(zr*zs) * (zr + r*zs) * math.Pow(r, 1.5) /
		((1-r*r)*(1-r*r) + 4*zr*zs*r*(1+r*r) + 4*(zr*zr+zs*zs)*r*r)
}

func TestRandomCloseModesCQC(t *testing.T) {
	// A canted payload (centre off the axis) couples the modes; with six
	// different damping ratios the cross terms do not cancel. Its two
	// lowest modes lie at about 727 and 746 Hz, 2.7 % apart: close modes
	// whose correlation the sum of squares would drop.
	m := symmetricModel(t)
	m2, err := NewModel(mustContacts(t, mustBisector(t)), []Preload{{Point: r3.Vec{X: 0.01, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}},
		Payload{Mass: 0.8, Centre: r3.Vec{X: 0.012, Y: -0.004, Z: 0.03}, Inertia: [3][3]float64{{1e-3, 1e-4, 0}, {1e-4, 1.1e-3, 0}, {0, 0, 1.6e-3}}})
	if err != nil {
		t.Fatal(err)
	}
	for _, mm := range []*Model{m, m2} {
		zeta := [6]float64{0.01, 0.015, 0.02, 0.03, 0.025, 0.05}
		const S0 = 0.01
		white := Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: S0}, {Frequency: 1e6, ASD: S0}}}
		u := r3.Unit(r3.Vec{X: 1, Y: 0.3, Z: 0.5})
		sp, _ := white.prepare()
		rm, err := mm.prepareRandom(gravityDown, &sp, zeta)
		if err != nil {
			t.Fatal(err)
		}
		r := mm.respond(&rm, u, 120, 3, r3.Vec{})
		S := S0 * StandardGravity * StandardGravity
		for i, c := range r.Contacts {
			co := mm.contactCoefficients(&rm, i)
			var sig [6]float64
			for q := range 6 {
				w := rm.omega[q]
				sig[q] = co[q] * r3.Dot(rm.g[q], u) * math.Sqrt(S/(8*rm.zeta[q]*w*w*w))
			}
			var v float64
			for p := range 6 {
				for q := range 6 {
					v += cqc(rm.zeta[p], rm.zeta[q], rm.omega[q]/rm.omega[p]) * sig[p] * sig[q]
				}
			}
			want := rm.st.Normal[i] * math.Sqrt(v)
			// The band 1 Hz – 1 MHz against 0 < f < ∞ leaves out less than
			// 1e-4 of each modal variance (the modes lie between 100 Hz and
			// 10 kHz); the tolerance is 3e-4.
			if math.Abs(c.Dynamic/want-1) > 3e-4 {
				t.Errorf("contact %d: dynamic force %g N, CQC %g N", i, c.Dynamic, want)
			}
		}
	}
}

func TestRandomRepeatedModesInvariant(t *testing.T) {
	// The symmetric coupling's lateral modes come in equal pairs: the
	// response along X turned by 120° about Z must be the response along X
	// with the contacts turned too (by symmetry), whichever eigenvectors
	// the solver chose for each pair.
	m := symmetricModel(t)
	r0, err := m.Random(gravityDown, gevs, &RandomOptions{Direction: r3.Vec{X: 1}})
	if err != nil {
		t.Fatal(err)
	}
	a := 2 * math.Pi / 3
	r1, err := m.Random(gravityDown, gevs, &RandomOptions{Direction: r3.Vec{X: math.Cos(a), Y: math.Sin(a)}})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r0.Centre.RMS/r1.Centre.RMS-1) > 1e-9 {
		t.Errorf("centre acceleration %g along X, %g turned by 120°", r0.Centre.RMS, r1.Centre.RMS)
	}
	// The dynamic forces are the same multiset: the contacts permute.
	for _, c0 := range r0.Contacts {
		found := false
		for _, c1 := range r1.Contacts {
			if math.Abs(c0.Dynamic/c1.Dynamic-1) < 1e-8 {
				found = true
			}
		}
		if !found {
			t.Errorf("contact %s: %g N along X has no match turned by 120°", c0.Label, c0.Dynamic)
		}
	}
}

func TestRandomRice(t *testing.T) {
	// Rice's rate of down-crossings against a simulated stationary
	// Gaussian process: a sum of N cosines with random phases and
	// amplitudes √(2 S_k Δf) on a band-limited flat spectrum from f1 to
	// f2 (Shinozuka & Jan 1972's spectral representation; from memory).
	// Then σ² = Σ a_k²/2, σ_ẋ² = Σ a_k² ω_k²/2, and the expected number of
	// down-crossings of −F in T is ν·T with ν from contactResponse.
	rng := rand.New(rand.NewPCG(17, 2026))
	const n, f1, f2 = 400, 50.0, 150.0
	var amp, om, ph [n]float64
	var s2, d2 float64
	for k := range n {
		f := f1 + (f2-f1)*(float64(k)+0.5)/n
		amp[k] = math.Sqrt(2 * (f2 - f1) / n)
		om[k] = 2 * math.Pi * f
		ph[k] = 2 * math.Pi * rng.Float64()
		s2 += amp[k] * amp[k] / 2
		d2 += amp[k] * amp[k] * om[k] * om[k] / 2
	}
	sf, sd := math.Sqrt(s2), math.Sqrt(d2)
	F := 1.0 * sf
	const T, dt = 100.0, 1.0 / 4000 // the period of the sum is 1/Δf = 4 s: 25 periods
	c := contactResponse("x", F, sf, sd, T)
	var count int
	prev := F + sumCos(amp[:], om[:], ph[:], 0)
	for i := 1; float64(i)*dt <= 4; i++ { // one period, then ×25
		x := F + sumCos(amp[:], om[:], ph[:], float64(i)*dt)
		if prev > 0 && x <= 0 {
			count++
		}
		prev = x
	}
	got := float64(count) * 25
	// The count over one period of the simulated path: about ν·4 s = 250
	// crossings; taking them as Poisson, their standard deviation is
	// √250 ≈ 16 (6 %) and the tolerance is 4 of those (25 % of one period's
	// count); the sampling at 4 kHz misses crossings of fewer than 1 in
	// 27 samples per cycle, far below that.
	want := c.Rate * T
	per := want / 25
	if math.Abs(got-want) > 4*math.Sqrt(per)*25 {
		t.Errorf("simulated down-crossings %g, Rice %g", got, want)
	}
	if math.Abs(c.Probability-(1-math.Exp(-c.Openings))) > 1e-15 || c.Margin != 1 {
		t.Errorf("contact figures %+v", c)
	}
}

func sumCos(a, w, p []float64, t float64) float64 {
	var s float64
	for k := range a {
		s += a[k] * math.Cos(w[k]*t+p[k])
	}
	return s
}

func TestRandomErrors(t *testing.T) {
	m := symmetricModel(t)
	for _, c := range []struct {
		name  string
		s     Spectrum
		opt   RandomOptions
		field string
		want  error
	}{
		{"spectrum", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1}, {Frequency: 10, ASD: 1}}}, RandomOptions{}, "s.Points[1].Frequency", ErrRange},
		{"both", gevs, RandomOptions{Damping: []float64{0.02}, Q: []float64{25}}, "opt.Q", ErrRange},
		{"count", gevs, RandomOptions{Damping: []float64{0.02, 0.03}}, "opt.Damping", ErrRange},
		{"zeta", gevs, RandomOptions{Damping: []float64{0.02, 0.02, 0.02, 1.5, 0.02, 0.02}}, "opt.Damping[3]", ErrRange},
		{"zeta NaN", gevs, RandomOptions{Damping: []float64{math.NaN()}}, "opt.Damping[0]", ErrNonFinite},
		{"Q", gevs, RandomOptions{Q: []float64{0.4}}, "opt.Q[0]", ErrRange},
		{"direction", gevs, RandomOptions{Direction: r3.Vec{X: math.Inf(1)}}, "opt.Direction", ErrNonFinite},
		{"duration", gevs, RandomOptions{Duration: -1}, "opt.Duration", ErrRange},
		{"sigma", gevs, RandomOptions{Sigma: math.NaN()}, "opt.Sigma", ErrNonFinite},
		{"point", gevs, RandomOptions{Point: r3.Vec{Y: math.NaN()}}, "opt.Point", ErrNonFinite},
	} {
		_, err := m.Random(gravityDown, c.s, &c.opt)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.want) {
			t.Errorf("%s: err = %v, want an InputError naming %s wrapping %v", c.name, err, c.field, c.want)
		}
	}
}

func FuzzRandomDamping(f *testing.F) {
	m := symmetricModel(f)
	f.Add(0.02, 0.0, 1)
	f.Add(0.0, 25.0, 6)
	f.Add(-1.0, 0.3, 2)
	f.Fuzz(func(t *testing.T, zeta, q float64, n int) {
		n %= 7
		if n < 0 {
			n = -n
		}
		var o RandomOptions
		if zeta != 0 {
			for range n {
				o.Damping = append(o.Damping, zeta)
			}
		}
		if q != 0 {
			for range n {
				o.Q = append(o.Q, q)
			}
		}
		r, err := m.Random(gravityDown, gevs, &o)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || !strings.HasPrefix(ie.Field, "opt.Damping") && !strings.HasPrefix(ie.Field, "opt.Q") {
				t.Fatalf("error %v does not name an option", err)
			}
			return
		}
		if !(r.Centre.RMS > 0) || math.IsInf(r.Centre.RMS, 0) {
			t.Fatalf("centre RMS %g", r.Centre.RMS)
		}
	})
}

func TestRandomWorst(t *testing.T) {
	// The closed form (the largest eigenvalue of each contact's 3×3
	// covariance, a Rayleigh quotient, by hand) against a sampled sphere:
	// no sampled direction may give a smaller least margin, and the
	// closed form's margin must match the sample's best to within the
	// sampling's angular step (a quadratic form changes by O(step²)).
	m := symmetricModel(t)
	lc := LoadCase{Gravity: r3.Vec{X: -2, Z: -StandardGravity}, PreloadFactor: 3}
	w, err := m.RandomWorst(lc, gevs, nil)
	if err != nil {
		t.Fatal(err)
	}
	least := w.Contacts[w.Least].Margin
	sampled := math.Inf(1)
	const n = 40
	for i := range n {
		th := math.Pi * (float64(i) + 0.5) / n
		for j := range 2 * n {
			ph := math.Pi * float64(j) / n
			u := r3.Vec{X: math.Sin(th) * math.Cos(ph), Y: math.Sin(th) * math.Sin(ph), Z: math.Cos(th)}
			r, err := m.Random(lc, gevs, &RandomOptions{Direction: u})
			if err != nil {
				t.Fatal(err)
			}
			mg := r.Contacts[r.Least].Margin
			if mg < least*(1-1e-9) {
				t.Fatalf("direction %v gives margin %g below the worst %g along %v", u, mg, least, w.Direction)
			}
			sampled = math.Min(sampled, mg)
		}
	}
	step := math.Pi / n
	if sampled > least*(1+step*step) {
		t.Errorf("sampled least margin %g, closed form %g", sampled, least)
	}
}

func TestRandomPreload(t *testing.T) {
	m := symmetricModel(t)
	lc := gravityDown
	opt := &RandomOptions{Direction: r3.Vec{X: 1, Z: 1}, Sigma: 3}
	quiet := Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1e-4}, {Frequency: 2000, ASD: 1e-4}}}
	p, err := m.RandomPreload(lc, quiet, opt)
	if err != nil {
		t.Fatal(err)
	}
	r0, err := m.Random(lc, quiet, opt)
	if err != nil {
		t.Fatal(err)
	}
	// First order (by hand from its definition): at that factor the
	// static forces, from rigid statics, over the dynamic forces of the
	// case given reach 3 at the least contact.
	st, err := m.Stiffness(LoadCase{Gravity: lc.Gravity, PreloadFactor: p.FirstOrder}, nil)
	if err != nil {
		t.Fatal(err)
	}
	least := math.Inf(1)
	for i, c := range r0.Contacts {
		least = math.Min(least, st.Forces[i]/c.Dynamic)
	}
	if math.Abs(least-3) > 1e-9 {
		t.Errorf("first order factor %g gives a least margin %g, want 3", p.FirstOrder, least)
	}
	// Hertz: the full response at that factor has a least margin of 3.
	r, err := m.Random(LoadCase{Gravity: lc.Gravity, PreloadFactor: p.Hertz}, quiet, opt)
	if err != nil {
		t.Fatal(err)
	}
	if mg := r.Contacts[r.Least].Margin; math.Abs(mg-3) > 1e-5 {
		t.Errorf("Hertz factor %g gives a least margin %g, want 3", p.Hertz, mg)
	}
	// Stiffer contacts at a larger preload carry more dynamic force, so
	// the Hertz factor exceeds the first-order one when more preload is
	// needed (dynamic force ∝ F^(1/6) for one mode, by hand).
	if p.FirstOrder > 1 && !(p.Hertz > p.FirstOrder) {
		t.Errorf("Hertz %g not above first order %g", p.Hertz, p.FirstOrder)
	}
	t.Logf("margin %g, first order %g, Hertz %g", p.Margin, p.FirstOrder, p.Hertz)
	for field, lc := range map[string]LoadCase{"lc.NoPreload": {NoPreload: true}, "lc.PreloadFactor": {PreloadFactor: -1}} {
		_, err := m.RandomPreload(lc, quiet, opt)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != field || !errors.Is(err, ErrRange) {
			t.Errorf("%s: err = %v, want an InputError naming it wrapping ErrRange", field, err)
		}
	}
}

func TestRandomOverflow(t *testing.T) {
	// A level near the largest float64 overflows the response: an error
	// naming the spectrum, not an Inf or a NaN.
	m := symmetricModel(t)
	huge := Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1e307}, {Frequency: 2000, ASD: 1e307}}}
	for name, f := range map[string]func() (Random, error){
		"Random":      func() (Random, error) { return m.Random(gravityDown, huge, nil) },
		"RandomWorst": func() (Random, error) { return m.RandomWorst(gravityDown, huge, nil) },
	} {
		_, err := f()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != "s" || !errors.Is(err, ErrRange) {
			t.Errorf("%s: err = %v, want an InputError naming s wrapping ErrRange", name, err)
		}
	}
}
