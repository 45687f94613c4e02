package kinematic

import (
	"context"
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestScoreAvailability: every figure that needs an input the scenario
// leaves out is marked unavailable and is 0, and the others are computed.
// The expected sets are the rule of doc.go ("Figures that cannot be
// computed") and of each Figure constant's comment, written out by hand.
func TestScoreAvailability(t *testing.T) {
	bare := Vee{Up: up, HalfAngle: math.Pi / 4} // no Material: no Hertz model
	noAlpha := vee45
	noAlpha.Material.Alpha = 0
	noBallAlpha := equilateral()
	for i := range noBallAlpha {
		noBallAlpha[i].Material.Alpha = 0
	}
	const stiff = FigureStiffness | FigureAxisCompliance | FigureFirstFrequency
	for _, tc := range []struct {
		name  string
		balls [3]Ball
		vee   Vee
		edit  func(*Scenario)
		want  Figure
	}{
		{"everything given", equilateral(), vee45, func(*Scenario) {}, 0},
		{"seats without material", equilateral(), bare, func(*Scenario) {}, stiff | FigurePressureRatio | FigurePreloadMax},
		{"no axis", equilateral(), vee45, func(s *Scenario) { s.Axis = r3.Vec{} }, FigureAxisAmplification | FigureAxisCompliance},
		{"massless payload", equilateral(), vee45, func(s *Scenario) { s.Payload.Mass = 0 }, FigureLoadAmplification | FigureFirstFrequency},
		{"no inertia", equilateral(), vee45, func(s *Scenario) { s.Payload.Inertia = [3][3]float64{} }, FigureFirstFrequency},
		{"no preload, gravity seats it", equilateral(), vee45, func(s *Scenario) { s.Preloads = nil }, FigurePreloadMin | FigurePreloadMax},
		{"no preload, no gravity", equilateral(), vee45, func(s *Scenario) { s.Preloads, s.Gravity = nil, r3.Vec{} }, FigurePreloadMin | FigurePreloadMax | stiff},
		{"no expansion coefficient", noBallAlpha, noAlpha, func(s *Scenario) { s.Thermal = Thermal{} }, FigureDrift | FigureThermalCentreDistance},
	} {
		t.Run(tc.name, func(t *testing.T) {
			c, err := BisectorVees(tc.balls, three(tc.vee))
			if err != nil {
				t.Fatal(err)
			}
			s := scenario()
			tc.edit(&s)
			card, err := c.Score(s)
			if err != nil {
				t.Fatal(err)
			}
			if card.Unavailable != tc.want {
				t.Errorf("unavailable %v, want %v", card.Unavailable, tc.want)
			}
			figs := map[Figure]float64{
				FigureAxisAmplification: card.AxisAmplification, FigureLoadAmplification: card.LoadAmplification,
				FigurePreloadMin: card.PreloadMin, FigurePreloadMax: card.PreloadMax, FigurePressureRatio: card.PressureRatio,
				FigureStiffness: card.Stiffness, FigureAxisCompliance: card.AxisCompliance, FigureFirstFrequency: card.FirstFrequency,
				FigureDrift: card.Drift, FigureThermalCentreDistance: card.ThermalCentreDistance,
			}
			for f, v := range figs {
				switch {
				case card.Unavailable.Has(f) && v != 0:
					t.Errorf("%v is unavailable but %g", f, v)
				case tc.name == "no preload, no gravity" && f == FigurePressureRatio:
					// Nothing loads the contacts: the peak pressure is 0
					// (p₀ ∝ F^(1/3), Johnson 1985, eq. 4.23), a true
					// value, not a missing one.
					if v != 0 || card.Unavailable.Has(f) {
						t.Errorf("pressure ratio %g, unavailable %v", v, card.Unavailable)
					}
				case !card.Unavailable.Has(f) && !(v > 0):
					// Every figure of this symmetric scenario is positive
					// when it can be computed: a point off the axis moves,
					// contacts carry force, the materials differ in α.
					t.Errorf("%v is available but %g", f, v)
				}
			}
			// The geometric figures need nothing more.
			if !(card.Amplification > 0 && card.WeakestContactIndex > 0 && card.Condition >= 1) {
				t.Errorf("geometric figures %+v", card)
			}
		})
	}
}

// TestScoreRefusesBadMaterial: a figure is unavailable for an input left
// out, not for a bad one. A vee of modulus 208 (steel's 208 GPa written as
// Pa) is refused by Score and Optimize as by Statics, naming the seat as
// the caller wrote it (the vee is pair B, Pairs[1]), with hertz's reading
// "208 GPa is 2.08e+11 Pa" (hand conversion); the same coupling with no
// material on that vee is scored, its Hertz figures unavailable.
func TestScoreRefusesBadMaterial(t *testing.T) {
	bad := vee45
	bad.Material = hertz.Material{Name: "x", E: 208, Nu: 0.3}
	c, err := SocketVeeFlat(equilateral(), cube, bad, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	var ie *InputError
	const field, want = "Pairs[1].Seat.Material.E", "208 GPa is 2.08e+11 Pa"
	if _, err := c.Score(s); !errors.As(err, &ie) || ie.Field != field || !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), want) {
		t.Errorf("Score: %v; want %s refused with %q", err, field, want)
	}
	if _, err := Optimize(c, s, nil); !errors.As(err, &ie) || ie.Field != field || !errors.Is(err, ErrRange) {
		t.Errorf("Optimize: %v; want %s refused", err, field)
	}
	cs, err := c.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	m, err := NewModel(cs, s.Preloads, s.Payload)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := m.Statics(LoadCase{Gravity: s.Gravity}); !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), want) {
		t.Errorf("Statics: %v; want the same refusal", err)
	}
	bad.Material = hertz.Material{}
	c, err = SocketVeeFlat(equilateral(), cube, bad, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	card, err := c.Score(s)
	if err != nil {
		t.Fatalf("no material: %v; want scored", err)
	}
	if !card.Unavailable.Has(FigureStiffness | FigurePressureRatio) {
		t.Errorf("no material: unavailable %v, want Stiffness and PressureRatio among them", card.Unavailable)
	}
}

// TestScoreMasslessShockIsUnbounded: a massless payload is loaded by no
// acceleration, so the shock level is the documented +Inf, not a zero.
func TestScoreMasslessShockIsUnbounded(t *testing.T) {
	s := scenario()
	s.Payload.Mass = 0
	card, err := mustBisector(t).Score(s)
	if err != nil {
		t.Fatal(err)
	}
	if !math.IsInf(card.ShockLevel, 1) {
		t.Errorf("shock level %g, want +Inf", card.ShockLevel)
	}
}

// TestFigureNames: the set's names are the Scorecard's field names.
func TestFigureNames(t *testing.T) {
	f := FigureStiffness | FigureDrift
	if got := strings.Join(f.Names(), ","); got != "Stiffness,Drift" {
		t.Errorf("names %q", got)
	}
	if f.String() != "Stiffness|Drift" || Figure(0).String() != "none" || Figure(0).Names() != nil {
		t.Errorf("strings %q %q", f.String(), Figure(0).String())
	}
	if !f.Has(FigureStiffness) || f.Has(FigureStiffness|FigurePressureRatio) || !f.Has(0) {
		t.Error("Has")
	}
	// Every constant has a name and a Scorecard field of that name.
	for b := Figure(1); b < figureEnd; b <<= 1 {
		n := b.Names()
		if len(n) != 1 {
			t.Fatalf("bit %d: names %v", b, n)
		}
		if _, ok := reflectField(Scorecard{}, n[0]); !ok {
			t.Errorf("%s is not a Scorecard field", n[0])
		}
	}
}

// TestScoreRefusesAPreloadThatLifts: a clamp whose Direction points up
// pulls every flank: by symmetry each carries −P/(6 sin θ) of it (the
// closed form of TestStaticsEquilateral with P reversed), gravity's share
// is smaller, and Score names the preload as the caller wrote it.
func TestScoreRefusesAPreloadThatLifts(t *testing.T) {
	s := scenario()
	s.Preloads[0].Direction = r3.Vec{Z: 1}
	_, err := mustBisector(t).Score(s)
	wantField(t, "Score with the clamp reversed", err, "s.Preloads[0]", ErrRange)
	if err != nil && !strings.Contains(err.Error(), "in tension") {
		t.Errorf("message %q does not say tension", err)
	}
	// Gravity reversed (the coupling upside down) without preload lifts
	// it too; gravity is named.
	s = scenario()
	s.Preloads, s.Gravity = nil, r3.Vec{Z: StandardGravity}
	_, err = mustBisector(t).Score(s)
	wantField(t, "Score upside down", err, "s.Gravity", ErrRange)
}

// TestStaticsAndStiffnessNameThePull: Statics returns the rigid solution
// with the tensile contacts and what pulls them; Stiffness refuses, naming
// the preload.
func TestStaticsAndStiffnessNameThePull(t *testing.T) {
	const P = 60.0
	m, _ := equilateralModel(t, math.Pi/4, P, 0, 0)
	// The preload factor −1 reverses the clamp.
	lc := LoadCase{Name: "reversed", PreloadFactor: -1}
	s, err := m.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	want := -P / (6 * math.Sin(math.Pi/4)) // TestStaticsEquilateral's closed form, reversed
	if len(s.Tensile) != 6 {
		t.Errorf("tensile %v", s.Tensile)
	}
	for _, cl := range s.Contacts {
		if math.Abs(cl.Force-want) > 1e-9*P || cl.PulledBy != "preloads[0]" {
			t.Errorf("%s: force %g (want %g), pulled by %q", cl.Label, cl.Force, want, cl.PulledBy)
		}
	}
	_, err = m.Stiffness(lc, nil)
	wantField(t, "Stiffness reversed", err, "preloads[0]", ErrRange)

	// Gravity pulling a coupling hung upside down without preload.
	m2, _ := equilateralModel(t, math.Pi/4, P, 0.8, 0.03)
	s, err = m2.Statics(LoadCase{Gravity: r3.Vec{Z: StandardGravity}, NoPreload: true})
	if err != nil {
		t.Fatal(err)
	}
	if s.Contacts[0].PulledBy != "lc.Gravity" {
		t.Errorf("pulled by %q", s.Contacts[0].PulledBy)
	}
}

// TestStiffnessOfUnloadedContacts: with no force a Hertz contact has no
// stiffness (dF/dδ = (3/2)k^(2/3)F^(1/3) = 0 at F = 0; Johnson 1985,
// eq. 4.23), so Stiffness says which contacts carry none and which input
// is missing, at Stiffness rather than later in Compliance.
func TestStiffnessOfUnloadedContacts(t *testing.T) {
	m, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	_, err := m.Stiffness(LoadCase{Name: "idle", NoPreload: true}, nil)
	wantField(t, "no preload", err, "lc.NoPreload", ErrDegenerate)
	if err != nil {
		for _, c := range cs {
			if !strings.Contains(err.Error(), c.Label) {
				t.Errorf("%q does not name %s", err, c.Label)
			}
		}
		if !strings.Contains(err.Error(), "no stiffness") {
			t.Errorf("%q does not say why", err)
		}
	}
	bare, err := NewModel(cs, nil, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	_, err = bare.Stiffness(LoadCase{PreloadFactor: 1}, nil)
	wantField(t, "no preload element", err, "preloads", ErrDegenerate)
}

// TestZeroValues: the zero and nil Assembly, the zero Model, Stiffness and
// Stability refuse with an error naming the receiver instead of
// panicking or returning empty results.
func TestZeroValues(t *testing.T) {
	p := r3.Vec{Z: 0.05}
	tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 1e-6}}
	for name, a := range map[string]*Assembly{"zero": {}, "nil": nil} {
		if a.Dimensions() != nil {
			t.Errorf("%s: dimensions", name)
		}
		_, err := a.Pose(nil, nil)
		wantField(t, name+" Pose", err, "a", ErrDegenerate)
		_, err = a.Drift(Thermal{DeltaT: 1}, p)
		wantField(t, name+" Drift", err, "a", ErrDegenerate)
		_, err = a.Sensitivities(p)
		wantField(t, name+" Sensitivities", err, "a", ErrDegenerate)
		_, err = a.Budget(p, tols)
		wantField(t, name+" Budget", err, "a", ErrDegenerate)
		_, err = a.Study(context.Background(), p, tols, nil)
		wantField(t, name+" Study", err, "a", ErrDegenerate)
	}
	for name, m := range map[string]*Model{"zero": {}, "nil": nil} {
		lc := LoadCase{PreloadFactor: 1}
		_, err := m.Statics(lc)
		wantField(t, name+" Statics", err, "m", ErrDegenerate)
		_, err = m.Shock(lc, 1)
		wantField(t, name+" Shock", err, "m", ErrDegenerate)
		_, err = m.WrenchLimit(lc, screwWrench(1))
		wantField(t, name+" WrenchLimit", err, "m", ErrDegenerate)
		_, err = m.LiftOff(lc, r3.Vec{Z: 1}, []r3.Vec{p})
		wantField(t, name+" LiftOff", err, "m", ErrDegenerate)
		_, err = m.Stiffness(lc, nil)
		wantField(t, name+" Stiffness", err, "m", ErrDegenerate)
		_, err = m.Homing(lc, 0.1)
		wantField(t, name+" Homing", err, "m", ErrDegenerate)
		_, err = m.Repeatability(lc, 0.1, p)
		wantField(t, name+" Repeatability", err, "m", ErrDegenerate)
		_, err = m.SizePreload([]LoadCase{lc}, 1)
		wantField(t, name+" SizePreload", err, "m", ErrDegenerate)
		_, err = m.Equilibrium(lc, nil)
		wantField(t, name+" Equilibrium", err, "m", ErrDegenerate)
	}
	_, err := Stiffness{}.Compliance(p)
	wantField(t, "zero Stiffness Compliance", err, "s", ErrDegenerate)
	_, err = Stiffness{}.Modes()
	wantField(t, "zero Stiffness Modes", err, "s", ErrDegenerate)
	_, err = Stability{}.Amplification(p)
	wantField(t, "zero Stability Amplification", err, "s.Contacts[0].Freed", ErrDegenerate)
}

// reflectField reports whether the struct v has a field of that name.
func reflectField(v any, name string) (reflect.StructField, bool) {
	return reflect.TypeOf(v).FieldByName(name)
}

// TestResultNeeds: what each load result needs beyond the geometry, and
// what the caller gets without it (doc.go, "Figures that cannot be
// computed"): an error naming the missing input, or a documented marker
// (Allowable 0 with PressureRatio 0; MaxScale +Inf).
func TestResultNeeds(t *testing.T) {
	noAllow := hertz.Steel440C
	noAllow.Allowable = 0
	b := equilateral()
	for i := range b {
		b[i].Material = noAllow
	}
	v := vee45
	v.Material = noAllow
	c, err := BisectorVees(b, three(v))
	if err != nil {
		t.Fatal(err)
	}
	pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}
	m, err := NewModel(mustContacts(t, c), pre, Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}})
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{PreloadFactor: 1}
	s, err := m.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	for _, cl := range s.Contacts {
		// Without an allowable the ratio is not computed: Allowable 0
		// marks it, and the Hertz stresses are still there.
		if cl.Allowable != 0 || cl.PressureRatio != 0 || !(cl.Hertz.PeakPressure > 0) {
			t.Errorf("%s: allowable %g ratio %g peak %g", cl.Label, cl.Allowable, cl.PressureRatio, cl.Hertz.PeakPressure)
		}
	}
	sz, err := m.SizePreload([]LoadCase{lc}, 1)
	if err != nil {
		t.Fatal(err)
	}
	if !math.IsInf(sz.MaxScale, 1) {
		t.Errorf("MaxScale %g without an allowable, want the documented +Inf", sz.MaxScale)
	}
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	// A point mass: frequencies need the inertia.
	_, err = st.Modes()
	wantField(t, "Modes without inertia", err, "payload.Inertia", ErrDegenerate)

	massless, err := NewModel(mustContacts(t, c), pre, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	_, err = massless.Shock(lc, 9.8)
	wantField(t, "Shock without mass", err, "payload.Mass", ErrDegenerate)

	// Seats without material: no Hertz model, so no stiffness; the rigid
	// forces need none.
	bare := Vee{Up: up, HalfAngle: math.Pi / 4}
	cb, err := BisectorVees(equilateral(), three(bare))
	if err != nil {
		t.Fatal(err)
	}
	mb, err := NewModel(mustContacts(t, cb), pre, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	_, err = mb.Stiffness(lc, nil)
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "cs[0].Base.Material" || !errors.Is(err, ErrDegenerate) {
		t.Errorf("Stiffness without seat material: %v", err)
	}
	if _, err := mb.WrenchLimit(lc, screwWrench(1)); err != nil {
		t.Errorf("rigid limit without material: %v", err)
	}
}
