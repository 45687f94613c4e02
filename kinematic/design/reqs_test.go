package design

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// The closed forms of the equilateral fixture used here, from the
// derivation above TestEquilateralEndToEnd (evaluate_test.go): N = F/(6
// sin θ) at every contact, |T(O)| = √10/6 for every contact, and the
// Hertz normal stiffness k = 3N/(2δ), δ = a²/r, a³ = 3Nr/(4E*).
const (
	eqR     = 6.35e-3 // ball radius, m
	eqBigR  = 0.05    // radius of the ball circle, m
	eqP     = 300.0   // preload, N
	eqM     = 2.0     // payload mass, kg
	eqG     = 9.80665 // standard gravity, m/s² (3rd CGPM, 1901)
	eqTheta = math.Pi / 4
)

// eqK returns the Hertz normal stiffness of one contact of the fixture
// under the total vertical load F, N/m (items 1, 2 and 6 of the
// derivation).
func eqK(F float64) float64 {
	mat := hertz.Steel52100
	eStar := mat.E / (2 * (1 - mat.Nu*mat.Nu))
	n := F / (6 * math.Sin(eqTheta))
	a := math.Cbrt(3 * n * eqR / (4 * eStar))
	return 1.5 * n / (a * a / eqR)
}

// byRequirement returns the verdicts of ev on the requirement req.
func byRequirement(ev Evaluation, req string) Verdicts {
	var out Verdicts
	for _, v := range ev.Verdicts() {
		if v.Requirement == req {
			out = append(out, v)
		}
	}
	return out
}

func near(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if !(math.Abs(got-want) <= rel*math.Abs(want)) {
		t.Errorf("%s = %.10g, want %.10g (rel. tol. %g)", what, got, want, rel)
	}
}

// TestShockAndFrequencyPerCase checks min_shock and min_frequency over
// "cases": "all" on the equilateral fixture: one verdict per case, each
// naming its case. Shock (item 4): a = N/(m |T(O)|) with N = (P + m g)/(6
// sin θ) in "seated" (7.29 g, 71.47 m/s²) and N = P/(6 sin θ) in "preload
// only" (67.08 m/s²). First frequency (item 6): the lowest of
// √(K/M)/(2π), which for this fixture is the lateral translation
// √(3k cos²θ/m)/(2π) (797.4 Hz in "seated").
func TestShockAndFrequencyPerCase(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("monte_carlo.samples", 1000),
		set("requirements.min_shock", map[string]any{"level": "6.9 g", "cases": "all"}),
		set("requirements.min_frequency", map[string]any{"limit": "780 Hz", "cases": []any{"preload only", "seated"}}),
	))
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	tO := math.Sqrt(10) / 6
	shock := map[string]float64{
		"seated":       (eqP + eqM*eqG) / (6 * math.Sin(eqTheta)) / (eqM * tO),
		"preload only": eqP / (6 * math.Sin(eqTheta)) / (eqM * tO),
	}
	vs := byRequirement(ev, "requirements.min_shock")
	if len(vs) != 2 {
		t.Fatalf("%d shock verdicts, want 2: %v", len(vs), vs)
	}
	for _, v := range vs {
		name := "seated"
		if strings.Contains(v.Note, `case "preload only"`) {
			name = "preload only"
		} else if !strings.Contains(v.Note, `case "seated"`) {
			t.Errorf("shock verdict names no case: %v", v)
		}
		near(t, "shock "+name, v.Value, shock[name], 1e-9)
		if v.Pass != (shock[name] >= 6.9*eqG) {
			t.Errorf("%v: Pass %v", v, v.Pass)
		}
	}
	freq := func(F float64) float64 {
		return math.Sqrt(3*eqK(F)*math.Cos(eqTheta)*math.Cos(eqTheta)/eqM) / (2 * math.Pi)
	}
	fs := byRequirement(ev, "requirements.min_frequency")
	if len(fs) != 2 || !strings.Contains(fs[0].Note, `"preload only"`) || !strings.Contains(fs[1].Note, `"seated"`) {
		t.Fatalf("frequency verdicts %v, want preload only then seated", fs)
	}
	near(t, "frequency preload only", fs[0].Value, freq(eqP), 1e-9)
	near(t, "frequency seated", fs[1].Value, freq(eqP+eqM*eqG), 1e-9)
	// 6.9 g = 67.67 m/s² > 67.08: the preload-only shock fails; the
	// frequency preload only, lower than 797.4 Hz, is checked against 780.
	err = ev.Verdicts().Err()
	if err == nil || !strings.Contains(err.Error(), `requirements.min_shock: 67.08 m/s^2 (6.84 g), needs at least 67.67 m/s^2 (6.9 g) (contact A+ unloads first, added to case "preload only"): fails`) {
		t.Errorf("Err() = %v", err)
	}
	if (freq(eqP) >= 780) == strings.Contains(err.Error(), "min_frequency") {
		t.Errorf("Err() and the frequency %.4g Hz against 780 Hz disagree: %v", freq(eqP), err)
	}
}

// TestGravityAnyOrientationClosedForm: the equilateral fixture with its
// gravity turned. Every contact has |T(O)| = √10/6, so the least force
// over the sphere of gravity directions is P/(6 sin θ) − m g √10/6 =
// 60.37 N (worst with gravity pulling the body out of its seats, along
// +z up to the tangential part) and the shock level is P/(6 sin θ)/(m
// |T(O)|) − g = 57.28 m/s²; fixed, they are 70.71 N (case "preload
// only") and 71.47 m/s² (case "seated").
func TestGravityAnyOrientationClosedForm(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("monte_carlo.samples", 1000),
		set("requirements.min_shock", map[string]any{"level": "5 g", "case": "seated", "gravity_any_orientation": true}),
		set("requirements.min_contact_force", map[string]any{"limit": "61 N", "gravity_any_orientation": true}),
	))
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	n0 := eqP / (6 * math.Sin(eqTheta))
	tO := math.Sqrt(10) / 6
	f := byRequirement(ev, "requirements.min_contact_force")
	if len(f) != 1 {
		t.Fatalf("force verdicts %v", f)
	}
	near(t, "least force, gravity any orientation", f[0].Value, n0-eqM*eqG*tO, 1e-9)
	if f[0].Pass || !strings.Contains(f[0].Note, `case "seated" with its gravity of 9.807 m/s^2 (1 g) turned to its worst direction`) {
		t.Errorf("force verdict %v: want a failure (60.37 < 61 N) stating the turned gravity", f[0])
	}
	s := byRequirement(ev, "requirements.min_shock")
	if len(s) != 1 {
		t.Fatalf("shock verdicts %v", s)
	}
	near(t, "shock level, gravity any orientation", s[0].Value, n0/(eqM*tO)-eqG, 1e-9)
	if !s[0].Pass || !strings.Contains(s[0].Note, "any orientation") {
		t.Errorf("shock verdict %v", s[0])
	}
	// The round trip keeps both flags.
	roundTrip(t, d)
}

// TestGravityAnyOrientationSweep checks the closed form against a brute
// force sweep of the gravity direction over the sphere on the socket
// fixture, whose payload sits off the balls' centroid (every contact has
// its own Tᵢ(c)) and whose case "probe" has applied loads and an
// acceleration. Directions are a Fibonacci lattice of N points (spacing
// δ ≈ √(4π/N)); a linear function g G cos φ of the angle φ to the worst
// direction is then found within g G δ²/2 of its least value, from above.
func TestGravityAnyOrientationSweep(t *testing.T) {
	d := editFixture(t, "testdata/socket.json", both(
		set("monte_carlo.samples", 100), set("monte_carlo.seed", 1),
		set("requirements.min_contact_force", map[string]any{"limit": "0.1 N", "gravity_any_orientation": true}),
		set("requirements.min_shock", map[string]any{"level": "1 g", "cases": "all", "gravity_any_orientation": true}),
	))
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	ev, err := b.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	lattice := func(n int) []r3.Vec {
		out := make([]r3.Vec, n)
		golden := math.Pi * (3 - math.Sqrt(5))
		for i := range out {
			z := 1 - (2*float64(i)+1)/float64(n)
			rho := math.Sqrt(1 - z*z)
			out[i] = r3.Vec{X: rho * math.Cos(golden*float64(i)), Y: rho * math.Sin(golden*float64(i)), Z: z}
		}
		return out
	}
	m := b.Model()

	// The least contact force over every case and direction.
	const nForce = 40000
	delta := math.Sqrt(4 * math.Pi / nForce)
	least, spread := math.Inf(1), 0.0
	for _, lc := range d.Cases {
		g := r3.Norm(lc.Gravity)
		for _, u := range lattice(nForce) {
			lc.Gravity = r3.Scale(g, u)
			st, err := m.Statics(lc)
			if err != nil {
				t.Fatal(err)
			}
			for _, c := range st.Contacts {
				least = math.Min(least, c.Force)
				spread = math.Max(spread, math.Abs(c.Force))
			}
		}
	}
	fv := byRequirement(ev, "requirements.min_contact_force")[0]
	if tol := spread * delta * delta; !(fv.Value <= least+1e-9*spread && least-fv.Value <= tol) {
		t.Errorf("closed form %.9g N, sweep %.9g N (tolerance %.3g N)", fv.Value, least, tol)
	}

	// The shock level: for each gravity direction, Model.Shock with the
	// gravity fixed finds the worst shock direction; the sweep takes the
	// least over the gravity directions.
	const nShock = 6000
	delta = math.Sqrt(4 * math.Pi / nShock)
	for k, v := range byRequirement(ev, "requirements.min_shock") {
		lc := d.Cases[k]
		if !strings.Contains(v.Note, `case "`+lc.Name+`"`) {
			t.Fatalf("verdict %d %v is not about case %q", k, v, lc.Name)
		}
		g := r3.Norm(lc.Gravity)
		level := math.Inf(1)
		for _, u := range lattice(nShock) {
			lc.Gravity = r3.Scale(g, u)
			s, err := m.Shock(lc, 0)
			if err != nil {
				t.Fatal(err)
			}
			level = math.Min(level, s.Unload)
		}
		if tol := g * delta * delta; !(v.Value <= level+1e-9*level && level-v.Value <= tol) {
			t.Errorf("case %q: closed form %.9g m/s², sweep %.9g (tolerance %.3g)", lc.Name, v.Value, level, tol)
		}
	}
}

// TestTiltOfOneBall: the equilateral fixture with only ball A toleranced
// (radius ±e, e = 1 µm). By item 7 of the derivation, a ball smaller by
// e sinks e/sin θ = √2 e and the body turns about line BC, which lies
// 3R/2 from A: the tilt is √2 e/(1.5 R) = 18.86 µrad, worst case and RSS
// alike (one contributor). In the study the tilt is √2|e_A|/(1.5 R) with
// e_A uniform on ±e, so its p-th percentile is p·18.86 µrad (|e_A| is
// uniform on [0, e]); at N = 20 000 the sampling error of p95 is
// √(0.95·0.05/N)·e, 0.15 % of e.
func TestTiltOfOneBall(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("tolerances", []any{map[string]any{"dimension": "A.Ball.Radius", "value": "1 um"}}),
		set("monte_carlo.samples", 20000),
		del("requirements.max_error"), del("requirements.max_study"),
		set("requirements.max_tilt", map[string]any{"worst_case": "20 urad", "rss": "18 urad", "study": "18 urad", "percentile": "p95"}),
	))
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	tilt := math.Sqrt2 * 1e-6 / (1.5 * eqBigR)
	for req, want := range map[string]struct {
		v, rel float64
		pass   bool
	}{
		"requirements.max_tilt.worst_case": {tilt, 1e-6, true},
		"requirements.max_tilt.rss":        {tilt, 1e-6, false},
		"requirements.max_tilt.study":      {0.95 * tilt, 0.005, true},
	} {
		vs := byRequirement(ev, req)
		if len(vs) != 1 {
			t.Fatalf("%s: %v", req, vs)
		}
		near(t, req, vs[0].Value, want.v, want.rel)
		if vs[0].Pass != want.pass || vs[0].Unit != "rad" {
			t.Errorf("%v: want Pass %v in rad", vs[0], want.pass)
		}
	}
	if v := byRequirement(ev, "requirements.max_tilt.study")[0]; !strings.Contains(v.Note, "p95 of 20000 samples") {
		t.Errorf("study tilt note %q", v.Note)
	}
}

// TestStiffnessAtPoint: by item 6 of the derivation the compliance at O
// is diagonal in the fixture's frame, 1/K_z = 1/(6k sin²θ) along z (the
// axis) and 1/K_x = 1/K_y = 1/(3k cos²θ) across it, so the stiffness
// along the axis is 6k sin²θ = 3k and across it 3k cos²θ = 1.5k, with k
// the contact stiffness of case "seated" (F = P + m g).
func TestStiffnessAtPoint(t *testing.T) {
	k := eqK(eqP + eqM*eqG)
	along, across := 6*k*math.Pow(math.Sin(eqTheta), 2), 3*k*math.Pow(math.Cos(eqTheta), 2)
	d := editFixture(t, "testdata/equilateral.json", both(
		set("monte_carlo.samples", 1000),
		set("requirements.min_stiffness", map[string]any{"along_axis": "1 N/um", "across_axis": "1 N/um", "case": "seated"}),
	))
	d.Requirements.MinStiffnessAlong = 0.99 * along
	d.Requirements.MinStiffnessAcross = 1.01 * across
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	a := byRequirement(ev, "requirements.min_stiffness.along_axis")
	c := byRequirement(ev, "requirements.min_stiffness.across_axis")
	if len(a) != 1 || len(c) != 1 {
		t.Fatalf("verdicts %v %v", a, c)
	}
	near(t, "stiffness along the axis", a[0].Value, along, 1e-9)
	near(t, "stiffness across the axis", c[0].Value, across, 1e-9)
	if !a[0].Pass || c[0].Pass || !strings.Contains(a[0].Note, `under case "seated"`) {
		t.Errorf("verdicts %v, %v: want along passing, across failing, naming the case", a[0], c[0])
	}
	if err := ev.Verdicts().Err(); err == nil || !strings.Contains(err.Error(), "requirements.min_stiffness.across_axis:") ||
		strings.Contains(err.Error(), "requirements.min_stiffness.along_axis:") {
		t.Errorf("Err() = %v: want the across-axis stiffness named, and only it", err)
	}
}

// TestSeatingPerCase checks seating in two cases: "seated" (every contact
// pushed closed: the fixture's own seating requirement passes there) and
// "dropped", where the base accelerating down at 20 g lifts the payload
// with 392 N against the 300 N preload, leaving every contact force at
// (300 − 392.3)/(6 sin 45°) = −21.8 N (TestVerdictsOpenContact): a body
// held only by pulling contacts cannot slide home, so that case fails
// and Err names it.
func TestSeatingPerCase(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("monte_carlo.samples", 1000),
		func(m map[string]any) {
			m["cases"] = append(m["cases"].([]any), map[string]any{"name": "dropped", "acceleration": []any{0, 0, "-20 g"}})
		},
		set("requirements.seating", map[string]any{"cases": []any{"seated", "dropped"}}),
	))
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	vs := byRequirement(ev, "requirements.seating")
	if len(vs) != 2 || !vs[0].Pass || vs[1].Pass || !strings.Contains(vs[1].Note, `under case "dropped"`) {
		t.Fatalf("seating verdicts %v: want seated passing, dropped failing", vs)
	}
	if err := ev.Verdicts().Err(); err == nil || !strings.Contains(err.Error(), `(under case "dropped"): fails`) {
		t.Errorf("Err() = %v", err)
	}
}

// TestPreloadMargin: one preload element, so the window is the closed
// form of Model.SizePreload. With min_force F_m = 50 N, case "preload
// only" (no other load) needs s P/(6 sin θ) ≥ F_m, s ≥ 6 sin θ F_m/P =
// 1/√2, the larger of the two cases' needs ("seated" adds m g). The top
// of the window is where the peak pressure reaches 4200 MPa (52100 steel)
// in "seated": p₀ = 3N/(2πa²) ∝ N^(1/3) gives N_a = (2π p_a/3)³
// (3r/(4E*))² ≈ 1182 N, so s ≤ (6 sin θ N_a − m g)/P ≈ 16.6. The preload
// as given (s = 1) may fall by √2 = 1.414 and rise by 16.6: the margin is
// √2, which passes a factor of 1.4 and fails 1.5.
func TestPreloadMargin(t *testing.T) {
	mat := hertz.Steel52100
	eStar := mat.E / (2 * (1 - mat.Nu*mat.Nu))
	na := math.Pow(2*math.Pi*mat.Allowable/3, 3) * math.Pow(3*eqR/(4*eStar), 2)
	top := (6*math.Sin(eqTheta)*na - eqM*eqG) / eqP
	for _, tc := range []struct {
		factor float64
		pass   bool
	}{{1.4, true}, {1.5, false}} {
		d := editFixture(t, "testdata/equilateral.json", both(
			set("monte_carlo.samples", 1000),
			set("requirements.min_preload_margin", map[string]any{"factor": tc.factor, "min_force": "50 N"}),
		))
		ev, err := d.Evaluate(t.Context())
		if err != nil {
			t.Fatal(err)
		}
		vs := byRequirement(ev, "requirements.min_preload_margin")
		if len(vs) != 1 {
			t.Fatalf("verdicts %v", vs)
		}
		near(t, "preload margin", vs[0].Value, math.Sqrt2, 1e-9)
		near(t, "window top", ev.Sizing.MaxScale, top, 1e-6)
		near(t, "window bottom", ev.Sizing.MinScale, 1/math.Sqrt2, 1e-9)
		if vs[0].Pass != tc.pass || !strings.Contains(vs[0].Note, `min_force 50 N, cases "seated", "preload only"`) {
			t.Errorf("factor %g: %v", tc.factor, vs[0])
		}
	}
}

// TestRepeatabilityScalesWithMu: in kinematic.Model.Repeatability the
// locked-in friction force at each contact is μ times its normal force
// and the displacement is the compliance (which μ does not change) times
// it, so the worst case and the RSS are proportional to μ: doubling μ
// doubles both exactly (up to rounding).
func TestRepeatabilityScalesWithMu(t *testing.T) {
	var worst [2]float64
	for i, mu := range []float64{0.1, 0.2} {
		d := editFixture(t, "testdata/equilateral.json", both(
			set("monte_carlo.samples", 1000),
			set("friction.mu", mu),
			set("requirements.max_repeatability", map[string]any{"worst_case": "1 um", "rss": "1 nm", "cases": "all"}),
		))
		ev, err := d.Evaluate(t.Context())
		if err != nil {
			t.Fatal(err)
		}
		w := byRequirement(ev, "requirements.max_repeatability.worst_case")
		r := byRequirement(ev, "requirements.max_repeatability.rss")
		if len(w) != 2 || len(r) != 2 {
			t.Fatalf("verdicts %v %v: want one per case", w, r)
		}
		if !(w[0].Value > 0 && r[0].Value > 0 && r[0].Value <= w[0].Value) || !strings.Contains(w[0].Note, `under case "seated" with mu = `) {
			t.Errorf("verdicts %v %v", w[0], r[0])
		}
		worst[i] = w[0].Value
	}
	near(t, "worst case at mu 0.2", worst[1], 2*worst[0], 1e-9)
}

// TestMoreRequirementsRefused checks that the reader refuses bad values of
// the new requirements, naming the JSON path.
func TestMoreRequirementsRefused(t *testing.T) {
	for _, tc := range []struct {
		name, json, path string
		sentinel         error
	}{
		{"case and cases", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "case": "seated", "cases": "all"})), "requirements.min_shock.cases", ErrRange},
		{"unknown case in list", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "cases": []any{"seated", "dropped"}})), "requirements.min_shock.cases[1]", ErrRange},
		{"case twice", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "cases": []any{"seated", "seated"}})), "requirements.min_shock.cases[1]", ErrRange},
		{"empty list", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "cases": []any{}})), "requirements.min_shock.cases", ErrRange},
		{"cases some", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "cases": "some"})), "requirements.min_shock.cases", ErrRange},
		{"gravity flag not boolean", edit(t, set("requirements.min_shock", map[string]any{"level": "5 g", "gravity_any_orientation": 1})), "requirements.min_shock.gravity_any_orientation", ErrType},
		{"no gravity to turn", edit(t, both(set("cases[0].gravity", []any{0, 0, 0}), set("requirements.min_shock", map[string]any{"level": "5 g", "gravity_any_orientation": true}))), "requirements.min_shock.gravity_any_orientation", ErrMissing},
		{"force without unit", editSocket(t, set("requirements.min_contact_force", map[string]any{"limit": 5, "gravity_any_orientation": true})), "requirements.min_contact_force.limit", ErrUnit},
		{"tilt without limit", edit(t, set("requirements.max_tilt", map[string]any{})), "requirements.max_tilt.worst_case", ErrMissing},
		{"tilt in mm", edit(t, set("requirements.max_tilt", map[string]any{"rss": "1 mm"})), "requirements.max_tilt.rss", ErrUnit},
		{"tilt percentile alone", edit(t, set("requirements.max_tilt", map[string]any{"rss": "1 urad", "percentile": "p95"})), "requirements.max_tilt.percentile", ErrRange},
		{"tilt study without monte_carlo", edit(t, set("requirements.max_tilt", map[string]any{"study": "1 urad"})), "requirements.max_tilt.study", ErrMissing},
		{"stiffness without axis", edit(t, set("requirements.min_stiffness", map[string]any{"along_axis": "10 N/um"})), "requirements.min_stiffness", ErrMissing},
		{"stiffness bare number", editSocket(t, set("requirements.min_stiffness", map[string]any{"along_axis": 1e7})), "requirements.min_stiffness.along_axis", ErrUnit},
		{"margin below 1", edit(t, set("requirements.min_preload_margin", map[string]any{"factor": 0.9})), "requirements.min_preload_margin.factor", ErrRange},
		{"margin without factor", edit(t, set("requirements.min_preload_margin", map[string]any{"min_force": "1 N"})), "requirements.min_preload_margin.factor", ErrMissing},
		{"margin without preload", edit(t, both(del("preloads"), set("requirements.min_preload_margin", map[string]any{"factor": 1.5}))), "requirements.min_preload_margin", ErrMissing},
		{"repeatability without friction", edit(t, set("requirements.max_repeatability", map[string]any{"rss": "1 um"})), "requirements.max_repeatability", ErrMissing},
		{"repeatability unknown member", edit(t, set("requirements.max_repeatability", map[string]any{"rss": "1 um", "mu": 0.1})), "requirements.max_repeatability.mu", ErrUnknownField},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(tc.json))
			var e *Error
			if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, tc.sentinel) {
				t.Errorf("error %v, want one at %s wrapping %v", err, tc.path, tc.sentinel)
			}
		})
	}
}

// TestMoreRequirementsRoundTrip writes and reads back a design that sets
// every new requirement, and checks the keys in the canonical file.
func TestMoreRequirementsRoundTrip(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("requirements.min_shock", map[string]any{"level": "5 g", "cases": []any{"seated", "preload only"}}),
		set("requirements.min_frequency", map[string]any{"limit": "700 Hz", "cases": "all"}),
		set("requirements.seating", map[string]any{"cases": "all"}),
		set("requirements.min_contact_force", map[string]any{"limit": "50 N", "gravity_any_orientation": true}),
		set("requirements.max_tilt", map[string]any{"worst_case": "30 urad", "study": "30 urad", "percentile": "p99.73"}),
		set("requirements.min_stiffness", map[string]any{"along_axis": "100 N/um", "across_axis": "50 N/um", "cases": "all"}),
		set("requirements.min_preload_margin", map[string]any{"factor": 1.2, "min_force": "20 N", "cases": []any{"seated"}}),
		set("requirements.max_repeatability", map[string]any{"worst_case": "1 um", "case": "seated"}),
	))
	out := string(roundTrip(t, d))
	for _, want := range []string{
		`"min_shock": {"level": 49.033249999999995, "cases": ["seated", "preload only"]}`,
		`"min_frequency": {"limit": 700, "cases": "all"}`,
		`"seating": {"cases": "all"}`,
		`"min_contact_force": {"limit": 50, "gravity_any_orientation": true}`,
		`"max_tilt": {"worst_case": 0.00003, "study": 0.00003, "percentile": "p99.73"}`,
		`"min_stiffness": {"along_axis": 100000000, "across_axis": 50000000, "cases": "all"}`,
		`"min_preload_margin": {"factor": 1.2, "min_force": 20, "cases": ["seated"]}`,
		`"max_repeatability": {"worst_case": 0.000001, "cases": ["seated"]}`,
	} {
		if !strings.Contains(out, want) {
			t.Errorf("canonical file lacks %s:\n%s", want, out)
		}
	}
	// A Design built in Go is checked as a file is.
	d.Requirements.StiffnessCases = Cases{All: true, Names: []string{"seated"}}
	var buf bytes.Buffer
	if err := d.Write(&buf); err == nil || !strings.Contains(err.Error(), "requirements.min_stiffness.cases") {
		t.Errorf("Write of all and named cases: %v", err)
	}
	_ = kinematic.StandardGravity
}

// editSocket returns the socket fixture, a format 2 file without the
// units declaration, with change applied.
func editSocket(t *testing.T, change func(m map[string]any)) string {
	t.Helper()
	var m map[string]any
	if err := json.Unmarshal(readFile(t, "testdata/socket.json"), &m); err != nil {
		t.Fatal(err)
	}
	set("monte_carlo.seed", 1)(m) // beyond float64's exact integers
	change(m)
	b, err := json.Marshal(m)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// TestMirrorFixture evaluates testdata/mirror.json, which sets every new
// requirement: it meets them, gives one verdict per case where it names
// cases, and turning gravity can only make things worse than the
// gravity as written (the written direction is one of the sphere's):
// the least contact force and each case's shock level with gravity
// turned are at most their values with gravity fixed.
func TestMirrorFixture(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/mirror.json"))
	if err != nil {
		t.Fatal(err)
	}
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	if err := ev.Verdicts().Err(); err != nil {
		t.Error(err)
	}
	for req, n := range map[string]int{
		"requirements.min_contact_force": 1, "requirements.min_shock": 2, "requirements.min_frequency": 2,
		"requirements.seating": 2, "requirements.max_tilt.worst_case": 1, "requirements.max_tilt.rss": 1,
		"requirements.max_tilt.study": 1, "requirements.min_stiffness.along_axis": 1,
		"requirements.min_stiffness.across_axis": 1, "requirements.min_preload_margin": 1,
		"requirements.max_repeatability.worst_case": 2, "requirements.max_repeatability.rss": 2,
		"requirements.max_thermal_drift": 1,
	} {
		if got := len(byRequirement(ev, req)); got != n {
			t.Errorf("%s: %d verdicts, want %d", req, got, n)
		}
	}
	if v := byRequirement(ev, "requirements.min_contact_force")[0]; !(v.Value <= ev.MinForce) {
		t.Errorf("least force with gravity turned %g N > with gravity fixed %g N", v.Value, ev.MinForce)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	for k, v := range byRequirement(ev, "requirements.min_shock") {
		s, err := b.Model().Shock(d.Cases[k], 0)
		if err != nil {
			t.Fatal(err)
		}
		if !(v.Value <= s.Unload) || !strings.Contains(v.Note, `case "`+d.Cases[k].Name+`"`) {
			t.Errorf("case %q: shock with gravity turned %v, fixed %g m/s²", d.Cases[k].Name, v, s.Unload)
		}
	}
}
