package design

import (
	"context"
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestVerdictsPassFail evaluates the equilateral fixture against limits
// on either side of its closed-form values (derived in
// TestEquilateralEndToEnd): a shock level of 71.47 m/s² (7.29 g), a first
// frequency of 797.4 Hz, an RSS of 0.8165 µm and a worst case of
// 1.414 µm. Err must name exactly the requirements that fail.
func TestVerdictsPassFail(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/equilateral.json"))
	if err != nil {
		t.Fatal(err)
	}
	d.MonteCarlo.Samples = 2000
	d.Requirements.MinShock = 10 * kinematic.StandardGravity // > 7.29 g: fails
	d.Requirements.MinFrequency = 900                        // > 797.4 Hz: fails
	d.Requirements.MaxRSS = 0.5e-6                           // < 0.8165 µm: fails
	d.Requirements.MaxWorst = 1.5e-6                         // > 1.414 µm: passes
	d.Requirements.MaxStudy = 0                              // not set
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	vs := ev.Verdicts()
	failing := map[string]bool{
		"requirements.min_shock":            true,
		"requirements.min_frequency":        true,
		"requirements.max_error.rss":        true,
		"requirements.max_error.worst_case": false,
		"requirements.min_centre_index":     false,
		"requirements.max_pressure_ratio":   false,
		"requirements.min_contact_force":    false,
		"requirements.max_thermal_drift":    false,
		"requirements.seating":              false,
	}
	if len(vs) != len(failing) {
		t.Errorf("%d verdicts, want %d: %v", len(vs), len(failing), vs)
	}
	for _, v := range vs {
		fails, ok := failing[v.Requirement]
		if !ok {
			t.Errorf("unexpected verdict %v", v)
			continue
		}
		if v.Pass == fails {
			t.Errorf("%v: Pass = %v, want %v", v, v.Pass, !fails)
		}
	}
	err = vs.Err()
	if err == nil {
		t.Fatal("Err() = nil with three requirements failing")
	}
	if !errors.Is(err, ErrRequirement) {
		t.Errorf("Err() = %v does not wrap ErrRequirement", err)
	}
	msg := err.Error()
	if !strings.HasPrefix(msg, "design: 3 of 9 requirements not met: ") {
		t.Errorf("message %q does not count the failures", msg)
	}
	for req, fails := range failing {
		// "requirements.max_error.rss" must not match inside another name.
		named := strings.Contains(msg, req+":")
		if named != fails {
			t.Errorf("message names %s: %v, want %v:\n%s", req, named, fails, msg)
		}
	}
	for _, want := range []string{"71.47 m/s^2 (7.29 g), needs at least 98.07 m/s^2 (10 g)", "797.4 Hz, needs at least 900 Hz", "8.165e-07 m (0.8165 µm), needs at most 5e-07 m (0.5 µm)"} {
		if !strings.Contains(msg, want) {
			t.Errorf("message lacks %q:\n%s", want, msg)
		}
	}
}

// TestVerdictsOpenContact checks the verdicts of a case whose load pulls
// every contact open: the base accelerating down at 20 g lifts the 2 kg
// payload with 392 N against the 300 N preload, so every contact force
// is (300 − 392.3)/(6 sin 45°) = −21.8 N < 0 (the closed form of
// TestEquilateralEndToEnd with F = P − 20 m g). A frictionless body held
// by a pulling contact cannot be seated, the stiffness has an open
// contact, and the least contact force is negative.
func TestVerdictsOpenContact(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/equilateral.json"))
	if err != nil {
		t.Fatal(err)
	}
	d.MonteCarlo = nil
	d.Requirements.MaxStudy = 0
	d.Requirements.MinShock = 0
	d.Requirements.ShockCase = ""
	d.Cases = append(d.Cases, kinematic.LoadCase{Name: "dropped", PreloadFactor: 1, Acceleration: r3.Vec{Z: -20 * kinematic.StandardGravity}})
	d.Requirements.FrequencyCase = "dropped"
	d.Requirements.HomingCase = "dropped"
	d.Friction.Mu = 0
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	want := (300 - 20*2*kinematic.StandardGravity) / (6 * math.Sin(math.Pi/4))
	if math.Abs(ev.MinForce-want) > 1e-12*math.Abs(want) || ev.MinForceAt.Case != "dropped" {
		t.Errorf("MinForce %v at %+v, want %v in case \"dropped\"", ev.MinForce, ev.MinForceAt, want)
	}
	byName := map[string]Verdict{}
	for _, v := range ev.Verdicts() {
		byName[v.Requirement] = v
	}
	for _, req := range []string{"requirements.min_contact_force", "requirements.min_frequency", "requirements.seating"} {
		if v, ok := byName[req]; !ok || v.Pass {
			t.Errorf("%s: %v, want a failing verdict", req, v)
		}
	}
	if v := byName["requirements.min_frequency"]; v.Value != 0 || !strings.Contains(v.Note, "tension") {
		t.Errorf("frequency verdict %v: want 0 Hz and a note on the contact in tension", v)
	}
	if ev.Stiffness != nil || len(ev.Notes) == 0 {
		t.Errorf("Stiffness %v, notes %v: want none and a note", ev.Stiffness, ev.Notes)
	}
}

// TestVerdictsErr checks Err on verdicts made by hand.
func TestVerdictsErr(t *testing.T) {
	if err := (Verdicts{}).Err(); err != nil {
		t.Errorf("no verdicts: %v", err)
	}
	vs := Verdicts{
		{Requirement: "requirements.min_maxwell_index", Value: 0.9, Limit: 0.8, Min: true, Pass: true},
		{Requirement: "requirements.max_thermal_drift", Value: 3e-6, Limit: 2e-6, Unit: "m", Pass: false, Note: "exact"},
		{Requirement: "requirements.seating", Value: 0.05, Limit: 0.1, Min: true, Pass: false},
	}
	err := vs.Err()
	want := "design: 2 of 3 requirements not met: " +
		"requirements.max_thermal_drift: 3e-06 m (3 µm), needs at most 2e-06 m (2 µm) (exact): fails; " +
		"requirements.seating: seats up to mu = 0.05, needs mu = 0.1: fails"
	if err == nil || err.Error() != want {
		t.Errorf("Err() = %v\nwant %s", err, want)
	}
	if err := vs[:1].Err(); err != nil {
		t.Errorf("one passing verdict: %v", err)
	}
}

// TestVerdictTinyOpenings: expected openings and chances below 1e-12
// print as "< 1e-12" in the verdict line and its note, as the study
// report's tables print them; larger ones keep three figures. The
// figures are those of a contact at margin m = 12.5 σ crossing down
// ν₀T = 6.5e6 times' worth of test: by Rice, openings ν₀T·exp(−m²/2)
// = 6.5e6·exp(−78.125) ≈ 7.6e-28 (and the chance of at least one,
// 1 − exp(−openings), the same to rounding); at m = 5 σ, 6.5e6·exp(−12.5)
// ≈ 24.
func TestVerdictTinyOpenings(t *testing.T) {
	const nuT = 6.5e6
	tinyO := nuT * math.Exp(-12.5*12.5/2)
	bigO := nuT * math.Exp(-5.0*5.0/2)
	contacts := []kinematic.RandomContact{
		{Label: "A+", Static: 12.5, Dynamic: 1, Margin: 12.5, Openings: tinyO, Probability: -math.Expm1(-tinyO)},
		{Label: "A-", Static: 12.5, Dynamic: 1, Margin: 12.5, Openings: tinyO, Probability: -math.Expm1(-tinyO)},
	}
	ev := Evaluation{req: Requirements{MaxRandomOpenings: 0.01}, point: "beam", randomDuration: "60 s", randomSpectrum: "test spectrum", RandomCase: "seated",
		Random: []RandomAxis{{Axis: AxisZ, Response: kinematic.Random{Direction: r3.Vec{Z: 1}, Contacts: contacts}}}}
	vs := ev.randomVerdicts()
	if len(vs) != 1 {
		t.Fatalf("%d verdicts, want 1", len(vs))
	}
	got := vs[0].String()
	for _, want := range []string{"requirements.max_random_openings: < 1e-12, needs at most 0.01", "chance of at least one < 1e-12;", ": passes"} {
		if !strings.Contains(got, want) {
			t.Errorf("%s\nlacks %q", got, want)
		}
	}
	if strings.Contains(got, "e-28") {
		t.Errorf("%s\nprints the rounding-level figure", got)
	}

	contacts[0].Margin, contacts[0].Openings, contacts[0].Probability = 5, bigO, -math.Expm1(-bigO)
	got = ev.randomVerdicts()[0].String()
	for _, want := range []string{"requirements.max_random_openings: 24.2, needs at most 0.01", "chance of at least one 1;", ": fails"} {
		if !strings.Contains(got, want) {
			t.Errorf("%s\nlacks %q", got, want)
		}
	}

	// A limit itself below the threshold: the value prints as computed,
	// so that the comparison reads.
	v := Verdict{Requirement: "requirements.max_random_openings", Value: 1e-20, Limit: 1e-15, Pass: true}
	if got := v.String(); !strings.Contains(got, "1e-20, needs at most 1e-15") {
		t.Errorf("%s: want the value as computed against a limit of 1e-15", got)
	}
}
