package design

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestVibrationVerticalClosedForm evaluates the equilateral fixture in a
// white random vibration along z. Its vertical mode is a translation of
// its own (three-fold symmetry, centre of mass on the axis), so the
// payload is a single-degree-of-freedom oscillator there: with
// ω² = 6 k sin²θ / m (k the contact stiffness eqK), the relative
// displacement's variance for a white base acceleration S per Hz is
// σ² = S/(8 ζ ω³) (the closed form of ∫|h|² df, Crandall & Mark, Random
// Vibration in Mechanical Systems, 1963 — from memory; the same in
// kinematic's random_test.go), every contact's dynamic force is
// k sinθ σ and its static force N = F/(6 sinθ).
func TestVibrationVerticalClosedForm(t *testing.T) {
	const asd, zeta = 0.05, 0.025
	d := editFixture(t, "testdata/equilateral.json", both(
		set("vibration", map[string]any{
			"spectrum": map[string]any{"points": []any{
				map[string]any{"frequency": "1 Hz", "asd": "0.05 g^2/Hz"},
				map[string]any{"frequency": "1000 kHz", "asd": "0.05 g2/Hz"},
			}},
			"damping":  map[string]any{"zeta": zeta},
			"axes":     []any{"z"},
			"case":     "seated",
			"duration": "10 min",
		}),
		set("requirements", map[string]any{"min_random_margin": 2, "max_random_displacement": "0.1 um", "max_random_openings": 0.01}),
	))
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	F := eqP + eqM*eqG
	k := eqK(F)
	s := math.Sin(eqTheta)
	w := math.Sqrt(6 * k * s * s / eqM)
	S := asd * eqG * eqG
	sigma := math.Sqrt(S / (8 * zeta * w * w * w))
	N := F / (6 * s)
	// The band 1 Hz – 1 MHz leaves out far less than 1e-4 of the
	// variance of a mode near 1 kHz; the tolerance is 1e-4 on σ.
	if len(ev.Random) != 1 {
		t.Fatalf("%d axes evaluated, want 1", len(ev.Random))
	}
	r := ev.Random[0].Response
	vertical := -1
	for i, e := range r.EffectiveMass {
		if math.Abs(e.Z-eqM) < 1e-9*eqM {
			vertical = i
		}
	}
	if vertical < 0 {
		t.Fatalf("no mode carries the whole vertical mass: %v", r.EffectiveMass)
	}
	near(t, "vertical frequency", r.Modes[vertical]*2*math.Pi, w, 1e-6)
	near(t, "RMS displacement at the point", r.Displacement.RMS, sigma, 1e-4)
	for _, c := range r.Contacts {
		near(t, "static force of "+c.Label, c.Static, N, 1e-9)
		near(t, "dynamic force of "+c.Label, c.Dynamic, k*s*sigma, 1e-4)
	}
	m := byRequirement(ev, "requirements.min_random_margin")
	x := byRequirement(ev, "requirements.max_random_displacement")
	if len(m) != 1 || len(x) != 1 {
		t.Fatalf("verdicts %v %v, want one each", m, x)
	}
	near(t, "margin verdict", m[0].Value, N/(k*s*sigma), 1e-4)
	near(t, "displacement verdict", x[0].Value, sigma, 1e-4)
	if m[0].Pass != (m[0].Value >= 2) || x[0].Pass != (x[0].Value <= 1e-7) {
		t.Errorf("verdicts %v and %v judged wrongly", m[0], x[0])
	}
	if !strings.Contains(m[0].Note, `along z (0, 0, 1)`) || !strings.Contains(m[0].Note, `case "seated"`) {
		t.Errorf("margin note %q does not state the axis and case", m[0].Note)
	}
	// Rice's expected number of zero down-crossings in T = 600 s (Rice,
	// Mathematical Analysis of Random Noise, Bell Syst. Tech. J. 23,
	// 1944, eq. 3.3-5 — from memory): (1/2π)(σ_ḟ/σ_f)·exp(−N²/2σ_f²)·T.
	// For one mode under white noise σ_ḟ/σ_f = ω exactly (the ratio of
	// ∫ω²|h|² to ∫|h|², Crandall & Mark 1963 — from memory). The
	// tolerance follows the 1e-4 on σ through the exponent: m² times it.
	o := byRequirement(ev, "requirements.max_random_openings")
	if len(o) != 1 {
		t.Fatalf("openings verdicts %v, want one", o)
	}
	margin := N / (k * s * sigma)
	openings := w / (2 * math.Pi) * math.Exp(-margin*margin/2) * 600
	near(t, "openings verdict", o[0].Value, openings, 1e-3+3e-4*margin*margin)
	if o[0].Pass != (o[0].Value <= 0.01) || !strings.Contains(o[0].Note, "600 s") {
		t.Errorf("openings verdict %v judged or noted wrongly", o[0])
	}
	// The preload for a margin of 3 to first order: the static forces
	// grow with the preload, (300φ + mg)/(6 sinθ), the dynamic ones held:
	// φ = (3 k sinθ σ·6 sinθ − mg)/300.
	p := ev.Random[0].Preload
	if p == nil {
		t.Fatalf("no preload: %s", ev.Random[0].PreloadNote)
	}
	near(t, "first-order preload factor", p.FirstOrder, (3*k*s*sigma*6*s-eqM*eqG)/eqP, 1e-4)
}

// TestVibrationFixture reads testdata/vibration.json: the spectrum by
// slopes, Q per mode, two axes; one verdict per axis and requirement,
// the worst direction no better than z, and the canonical form reads
// back equal.
func TestVibrationFixture(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/vibration.json"))
	if err != nil {
		t.Fatal(err)
	}
	v := d.Vibration
	if v == nil || len(v.Spectrum.Points) != 4 || v.Level != "component qualification" || v.Duration != 120 ||
		len(v.Q) != 6 || v.Q[4] != 15 || len(v.Axes) != 2 || v.Axes[1] != AxisWorst || v.Sigma != 3 {
		t.Fatalf("vibration read as %+v", v)
	}
	if b := v.Spectrum.Points[3]; b.Frequency != 2000 || b.Slope != -6 || b.ASD != 0 {
		t.Errorf("last breakpoint %+v, want 2000 Hz at −6 dB/oct", b)
	}
	ev, err := d.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	if len(ev.Random) != 2 || ev.RandomCase != "seated" {
		t.Fatalf("random axes %d in case %q", len(ev.Random), ev.RandomCase)
	}
	z, worst := ev.Random[0].Response, ev.Random[1].Response
	if worst.Contacts[worst.Least].Margin > z.Contacts[z.Least].Margin*(1+1e-12) {
		t.Errorf("worst direction's margin %g exceeds z's %g", worst.Contacts[worst.Least].Margin, z.Contacts[z.Least].Margin)
	}
	if ev.Random[1].Options.Direction != worst.Direction {
		t.Errorf("worst axis options direction %v, response %v", ev.Random[1].Options.Direction, worst.Direction)
	}
	for _, req := range []string{"requirements.min_random_margin", "requirements.max_random_displacement", "requirements.max_random_openings"} {
		if n := len(byRequirement(ev, req)); n != 2 {
			t.Errorf("%s: %d verdicts, want 2", req, n)
		}
	}
	out := roundTrip(t, d)
	for _, want := range []string{`"vibration": {`, `"name": "component qualification"`, `{"frequency": 2000, "slope": -6}`,
		`"damping": {"q": [25, 25, 20, 20, 15, 15]}`, `"axes": ["z", "worst"]`, `"min_random_margin": 3`, `"max_random_displacement": 0.000005`, `"max_random_openings": 0.01`} {
		if !bytes.Contains(out, []byte(want)) {
			t.Errorf("canonical file lacks %s:\n%s", want, out)
		}
	}
	d2, err := Parse(out)
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(d, d2); diff != "" {
		t.Errorf("round trip (-want +got):\n%s", diff)
	}
}

// TestVibrationUnits reads the spectral density in (m/s²)²/Hz and the
// duration in minutes: 1 (m/s²)²/Hz is 1/9.80665² g²/Hz (standard
// gravity, 3rd CGPM 1901) and 1 min is 60 s.
func TestVibrationUnits(t *testing.T) {
	d := editFixture(t, "testdata/vibration.json", both(
		set("vibration.spectrum.points[1].asd", "1 (m/s²)²/Hz"),
		set("vibration.duration", "10 min"),
	))
	if got, want := d.Vibration.Spectrum.Points[1].ASD, 1/(kinematic.StandardGravity*kinematic.StandardGravity); math.Abs(got/want-1) > 1e-15 {
		t.Errorf("1 (m/s²)²/Hz read as %g g²/Hz, want %g", got, want)
	}
	if d.Vibration.Duration != 600 {
		t.Errorf("10 min read as %g s", d.Vibration.Duration)
	}
}

func TestVibrationRefused(t *testing.T) {
	fix := func(change func(map[string]any)) string {
		t.Helper()
		var m map[string]any
		if err := json.Unmarshal(readFile(t, "testdata/vibration.json"), &m); err != nil {
			t.Fatal(err)
		}
		change(m)
		b, err := json.Marshal(m)
		if err != nil {
			t.Fatal(err)
		}
		return string(b)
	}
	for _, tc := range []struct {
		name, json, path string
		sentinel         error
	}{
		{"no spectrum", fix(del("vibration.spectrum")), "vibration.spectrum", ErrMissing},
		{"no points", fix(del("vibration.spectrum.points")), "vibration.spectrum.points", ErrMissing},
		{"one point", fix(set("vibration.spectrum.points", []any{map[string]any{"frequency": "20 Hz", "asd": "0.1 g^2/Hz"}})), "vibration.spectrum.points", ErrDegenerate},
		{"frequency not increasing", fix(set("vibration.spectrum.points[2].frequency", "40 Hz")), "vibration.spectrum.points[2].frequency", ErrRange},
		{"negative level", fix(set("vibration.spectrum.points[1].asd", "-0.1 g^2/Hz")), "vibration.spectrum.points[1].asd", ErrRange},
		{"level in g", fix(set("vibration.spectrum.points[1].asd", "0.1 g")), "vibration.spectrum.points[1].asd", ErrUnit},
		{"bare level", fix(set("vibration.spectrum.points[1].asd", 0.1)), "vibration.spectrum.points[1].asd", ErrUnit},
		{"slope contradicting", fix(set("vibration.spectrum.points[2].slope", "3 dB/oct")), "vibration.spectrum.points[2].slope", ErrRange},
		{"slope in Hz", fix(set("vibration.spectrum.points[3].slope", "-6 Hz")), "vibration.spectrum.points[3].slope", ErrUnit},
		// A level of 0 carried by a slope of 0 was read as flat.
		{"last level from no slope", fix(del("vibration.spectrum.points[3].slope")), "vibration.spectrum.points[3].slope", ErrRange},
		{"first level from no slope", fix(del("vibration.spectrum.points[1].slope")), "vibration.spectrum.points[1].slope", ErrRange},
		{"frequency missing", fix(del("vibration.spectrum.points[0].frequency")), "vibration.spectrum.points[0].frequency", ErrMissing},
		{"unknown breakpoint member", fix(set("vibration.spectrum.points[0].level", 1)), "vibration.spectrum.points[0].level", ErrUnknownField},
		{"zeta and q", fix(set("vibration.damping.zeta", 0.02)), "vibration.damping.q", ErrRange},
		{"zeta of 1", fix(set("vibration.damping", map[string]any{"zeta": 1})), "vibration.damping.zeta", ErrRange},
		{"three zetas", fix(set("vibration.damping", map[string]any{"zeta": []any{0.1, 0.1, 0.1}})), "vibration.damping.zeta", ErrRange},
		{"q of 0.4", fix(set("vibration.damping.q[3]", 0.4)), "vibration.damping.q[3]", ErrRange},
		{"seven qs", fix(set("vibration.damping.q", []any{1, 2, 3, 4, 5, 6, 7})), "vibration.damping.q", ErrTooLarge},
		{"empty damping", fix(set("vibration.damping", map[string]any{})), "vibration.damping.zeta", ErrMissing},
		{"zero duration", fix(set("vibration.duration", "0 s")), "vibration.duration", ErrRange},
		{"duration in m", fix(set("vibration.duration", "2 m")), "vibration.duration", ErrUnit},
		{"axis w", fix(set("vibration.axes", []any{"x", "w"})), "vibration.axes[1]", ErrRange},
		{"axis twice", fix(set("vibration.axes", []any{"x", "x"})), "vibration.axes[1]", ErrRange},
		{"negative sigma", fix(set("vibration.sigma", -1)), "vibration.sigma", ErrRange},
		{"unknown case", fix(set("vibration.case", "dropped")), "vibration.case", ErrRange},
		{"no inertia", fix(del("payload.inertia")), "vibration", ErrMissing},
		{"margin without vibration", fix(del("vibration")), "requirements.min_random_margin", ErrMissing},
		{"negative margin", fix(set("requirements.min_random_margin", -3)), "requirements.min_random_margin", ErrRange},
		{"openings without vibration", fix(both(del("vibration"), set("requirements", map[string]any{"max_random_openings": 0.01}))), "requirements.max_random_openings", ErrMissing},
		{"negative openings", fix(set("requirements.max_random_openings", -1)), "requirements.max_random_openings", ErrRange},
		{"displacement in g", fix(set("requirements.max_random_displacement", "1 g")), "requirements.max_random_displacement", ErrUnit},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(tc.json))
			var e *Error
			if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, tc.sentinel) {
				t.Errorf("error %v, want one at %s wrapping %v", err, tc.path, tc.sentinel)
			}
		})
	}
	// The trial's spectrum: 0.01 g²/Hz at 20 Hz and a level of 0 at
	// 2 kHz, which was read as 0.01 g²/Hz flat to 2 kHz. The error and
	// the input it refers to are named by their JSON paths.
	_, err := Parse([]byte(fix(set("vibration.spectrum.points", []any{
		map[string]any{"frequency": "20 Hz", "asd": "0.01 g^2/Hz"},
		map[string]any{"frequency": "2000 Hz", "asd": "0 g^2/Hz"},
	}))))
	var e *Error
	if !errors.As(err, &e) || e.Path != "vibration.spectrum.points[1].slope" || e.Other != "vibration.spectrum.points[1]" || !errors.Is(err, ErrRange) {
		t.Errorf("a level of 0 at 2 kHz: %v; want an error at vibration.spectrum.points[1].slope, see vibration.spectrum.points[1]", err)
	} else if msg := err.Error(); strings.Contains(msg, "Points") || !strings.Contains(msg, "repeat the level") {
		t.Errorf("a level of 0 at 2 kHz: %q names the Go fields or gives no fix", msg)
	}
	// A Design built in Go is checked as a file is.
	d, err := Parse(readFile(t, "testdata/vibration.json"))
	if err != nil {
		t.Fatal(err)
	}
	d.Vibration.Damping = []float64{0.02}
	var buf bytes.Buffer
	if err := d.Write(&buf); err == nil || !strings.Contains(err.Error(), "vibration.damping.q") {
		t.Errorf("Write of zeta and q: %v", err)
	}
}
