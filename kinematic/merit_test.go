package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// scenario returns a scenario of a 0.8 kg payload with a 60 N clamp, a
// point of interest 50 mm above the balls, aluminium on steel.
func scenario() Scenario {
	return Scenario{
		Point:    r3.Vec{X: 0.01, Y: 0.005, Z: 0.05},
		Axis:     r3.Vec{Z: 1},
		Preloads: []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}},
		Payload:  Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}, Inertia: [3][3]float64{{2e-3, 0, 0}, {0, 2e-3, 0}, {0, 0, 3e-3}}},
		Gravity:  r3.Vec{Z: -StandardGravity},
		MinForce: 2,
		Thermal:  Thermal{Moving: hertz.Aluminium6061T6.Alpha, Base: hertz.Steel440C.Alpha},
	}
}

// TestScoreAgreesWithAPIs: every figure of the scorecard equals what the
// API it summarises returns for the same coupling and scenario.
func TestScoreAgreesWithAPIs(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	card, err := c.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	near := func(name string, got, want, tol float64) {
		t.Helper()
		if math.Abs(got-want) > tol*math.Abs(want) {
			t.Errorf("%s: scorecard %.12g, API %.12g", name, got, want)
		}
	}
	cs := mustContacts(t, c)
	an := mustAnalyze(t, cs)
	st, _ := an.Stability()
	weak, weakC := 1.0, 1.0
	for _, m := range st.Contacts {
		weak, weakC = math.Min(weak, m.Index), math.Min(weakC, m.CentreIndex)
	}
	near("weakest index", card.WeakestIndex, weak, 1e-9)
	near("weakest centre index", card.WeakestCentreIndex, weakC, 1e-9)
	// Every vee is 90°: the ideal is |sin 90°| = 1.
	near("Maxwell ratio", card.MaxwellRatio, weakC, 1e-9)
	near("condition", card.Condition, an.Condition, 1e-9)
	pe, _ := st.ErrorAt(s.Point)
	near("amplification", card.Amplification, pe.Worst, 1e-9)
	near("amplification RSS", card.AmplificationRSS, pe.RSS, 1e-9)
	near("tilt", card.Tilt, pe.WorstTilt, 1e-9)
	w, _, _, _ := pe.Along(s.Axis)
	near("axis amplification", card.AxisAmplification, w, 1e-9)
	m, err := NewModel(cs, s.Preloads, s.Payload)
	if err != nil {
		t.Fatal(err)
	}
	base := LoadCase{Preload: 1, Gravity: s.Gravity}
	sh, _ := m.Shock(base, 0)
	near("shock level", card.ShockLevel, sh.Unload, 1e-9)
	stat, _ := m.Statics(base)
	var pr float64
	for _, cl := range stat.Contacts {
		pr = math.Max(pr, cl.PressureRatio)
	}
	near("pressure ratio", card.PressureRatio, pr, 1e-9)
	sz, _ := m.SizePreload([]LoadCase{{Gravity: s.Gravity}}, s.MinForce)
	near("preload min", card.PreloadMin, sz.MinScale, 1e-9)
	near("preload max", card.PreloadMax, sz.MaxScale, 1e-9)
	k, _ := m.Stiffness(base, nil)
	comp, _ := k.Compliance(s.Point)
	near("axis compliance", card.AxisCompliance, comp.Along(s.Axis), 1e-9)
	near("stiffness", card.Stiffness, 1/largestEigen3(&comp.Matrix), 1e-9)
	modes, _ := k.Modes()
	near("first frequency", card.FirstFrequency, modes[0].Frequency, 1e-9)
	a, _ := c.Assembly()
	th := s.Thermal
	th.DeltaT = 1
	dr, _ := a.Drift(th, s.Point)
	near("drift", card.Drift, r3.Norm(dr.Linear), 1e-9)
	near("thermal centre distance", card.ThermalCentreDistance, dr.Distance, 1e-9)
	if card.Poor {
		t.Errorf("condition %g flagged poor", card.Condition)
	}

	// Beside the comparisons with the APIs, outside values: on the
	// equilateral triangle with the grooves on the bisectors every centre
	// index is |sin 2θ| (kinematic/doc.go; DEVELOPERS.md, closed forms),
	// the ideal of a groove of half-angle θ, so the weakest centre index
	// is |sin 2θ| and the Maxwell ratio 1, for 90° vees (θ = 45°: 1) and
	// 60° vees (θ = 30°: sin 60° = √3/2).
	for _, half := range []float64{math.Pi / 4, math.Pi / 6} {
		v := vee45
		v.HalfAngle = half
		bis, err := BisectorVees(equilateral(), three(v))
		if err != nil {
			t.Fatal(err)
		}
		bc, err := bis.Score(s)
		if err != nil {
			t.Fatal(err)
		}
		if want := math.Sin(2 * half); math.Abs(bc.WeakestCentreIndex-want) > 1e-12 || math.Abs(bc.MaxwellRatio-1) > 1e-12 {
			t.Errorf("bisector vees, half-angle %g: weakest centre index %.15g, ratio %.15g; want %.15g and 1",
				half, bc.WeakestCentreIndex, bc.MaxwellRatio, want)
		}
	}
}

// TestScorePoorLayout: grooves A and B radial and C tangential on an
// irregular triangle make a layout no designer would accept: its
// condition is far above the bisector layout's and beyond DesignCondition,
// and a point of interest above the balls moves many times further per
// micrometre of seat error.
func TestScorePoorLayout(t *testing.T) {
	bis, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	poor, err := bis.WithGroove(0, 0, Radial)
	if err == nil {
		poor, err = poor.WithGroove(1, 0, Radial)
	}
	if err == nil {
		poor, err = poor.WithGroove(2, math.Pi/2, Radial)
	}
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	good, err := bis.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	bad, err := poor.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	if !bad.Poor || good.Poor || bad.Amplification < 3*good.Amplification {
		t.Errorf("poor layout: condition %g (poor %v), amplification %g; bisectors %g (poor %v), %g",
			bad.Condition, bad.Poor, bad.Amplification, good.Condition, good.Poor, good.Amplification)
	}
}
