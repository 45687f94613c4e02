package kinematic

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
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
	near("weakest index", card.WeakestContactIndex, weak, 1e-9)
	near("weakest centre index", card.WeakestCentreIndex, weakC, 1e-9)
	// Every vee is 90°: the ideal is |sin 90°| = 1.
	near("Maxwell ratio", card.MaxwellRatio, weakC, 1e-9)
	near("condition", card.Condition, an.Condition, 1e-9)
	pe, _ := st.Amplification(s.Point)
	near("amplification", card.Amplification, pe.Worst, 1e-9)
	near("amplification RSS", card.AmplificationRSS, pe.RSS, 1e-9)
	near("tilt", card.Tilt, pe.WorstTilt, 1e-9)
	w, _, _, _, err := pe.Along(s.Axis)
	if err != nil {
		t.Fatal(err)
	}
	near("axis amplification", card.AxisAmplification, w, 1e-9)
	m, err := NewModel(cs, s.Preloads, s.Payload)
	if err != nil {
		t.Fatal(err)
	}
	base := LoadCase{PreloadFactor: 1, Gravity: s.Gravity}
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
	ca, err := comp.Along(s.Axis)
	if err != nil {
		t.Fatal(err)
	}
	near("axis compliance", card.AxisCompliance, ca, 1e-9)
	near("stiffness", card.Stiffness, 1/largestEigen3(&comp.Matrix), 1e-9)
	modes, _ := k.Modes()
	near("first frequency", card.FirstFrequency, modes[0].Frequency, 1e-9)
	a, _ := c.Assembly()
	th := s.Thermal
	th.DeltaT = 1
	dr, _ := a.Drift(th, s.Point)
	near("drift", card.Drift, r3.Norm(dr.RelativeLinear), 1e-9)
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

// TestScoreStiffnessWithPreloadRate: the stiffness figures of the
// scorecard include the preload spring's rate, as [Model.Stiffness] does.
// The equilateral three-vee coupling (90° vees, θ = 45°, 10 mm 52100 balls
// on 440C) is clamped by a spring of 60 N and rate −6 N/mm acting down the
// axis, and carries 0.8 kg centred on the axis under gravity.
//
// By hand: vertical balance with every flank loaded alike (symmetry) gives
// 6 f sin θ = P + m g₀, so f = (60 + 0.8·9.80665)/(6 sin 45°) N. Each flank
// is a ball on a flat, whose Hertz stiffness at f is dF/dδ = 2E*a with
// a³ = 3fR/(4E*) and δ = a²/R (Johnson, Contact Mechanics, 1985, §4.2,
// eqs. 4.22–4.23; hertzBallFlatStiffness). Springs in parallel along the
// unit lines lᵢ give K = Σ kᵢ lᵢlᵢᵀ, whose vertical entry is
// Σ kᵢ n_iz² = 6 k sin²θ (each normal leans θ from the horizontal); the
// clamp's line is the axis (unit force −z through (0, 0, 20 mm), no
// moment about the origin), and a spring force that falls by |rate| per
// metre as the body moves down restores it with |rate|: K_zz = 6 k sin²θ
// − rate = 6 k sin²θ + 6e3 N/m. The coupling's threefold symmetry with its
// mirror planes decouples the vertical translation of a point on the axis
// from every other motion, so the compliance along z at a point on the
// axis is 1/K_zz, and the vertical mode of the payload is at
// √(K_zz/m)/2π. The rate is 1e-4 of K_zz: a scorecard that left it out
// would miss these by that much.
func TestScoreStiffnessWithPreloadRate(t *testing.T) {
	const P, rate, mass = 60.0, -6e3, 0.8
	th := math.Pi / 4
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := Scenario{
		Point:    r3.Vec{Z: 0.05},
		Axis:     r3.Vec{Z: 1},
		Preloads: []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: P, Rate: rate}},
		Payload:  Payload{Mass: mass, Centre: r3.Vec{Z: 0.03}, Inertia: [3][3]float64{{2e-3, 0, 0}, {0, 2e-3, 0}, {0, 0, 3e-3}}},
		Gravity:  r3.Vec{Z: -StandardGravity},
	}
	card, err := c.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	f := (P + mass*StandardGravity) / (6 * math.Sin(th))
	k := hertzBallFlatStiffness(5e-3, f, hertz.Steel52100, hertz.Steel440C)
	kzz := 6*k*math.Sin(th)*math.Sin(th) - rate
	if got, want := card.AxisCompliance, 1/kzz; math.Abs(got-want) > 1e-9*want {
		t.Errorf("axis compliance %.12g m/N, want 1/(6 k sin²θ − rate) = %.12g (by hand)", got, want)
	}

	// The same figures by the public API.
	m, err := NewModel(mustContacts(t, c), s.Preloads, s.Payload)
	if err != nil {
		t.Fatal(err)
	}
	st, err := m.Stiffness(LoadCase{PreloadFactor: 1, Gravity: s.Gravity}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if K := st.Matrix(r3.Vec{}); math.Abs(K[2][2]-kzz) > 1e-9*kzz {
		t.Errorf("Model.Stiffness: K_zz %.12g N/m, want 6 k sin²θ − rate = %.12g (by hand)", K[2][2], kzz)
	}
	comp, err := st.Compliance(s.Point)
	if err != nil {
		t.Fatal(err)
	}
	modes, err := st.Modes()
	if err != nil {
		t.Fatal(err)
	}
	vertical := math.Sqrt(kzz/mass) / (2 * math.Pi)
	found := false
	for _, md := range modes {
		found = found || math.Abs(md.Frequency-vertical) < 1e-9*vertical
	}
	if !found {
		t.Errorf("Model modes %v Hz; none at √(K_zz/m)/2π = %g Hz (by hand)", frequencies(modes), vertical)
	}
	for _, tc := range []struct {
		name      string
		got, want float64
	}{
		{"axis compliance", card.AxisCompliance, must1(comp.Along(s.Axis))},
		{"stiffness", card.Stiffness, 1 / largestEigen3(&comp.Matrix)},
		{"first frequency", card.FirstFrequency, modes[0].Frequency},
	} {
		if math.Abs(tc.got-tc.want) > 1e-12*math.Abs(tc.want) {
			t.Errorf("%s: scorecard %.15g, Model.Stiffness %.15g", tc.name, tc.got, tc.want)
		}
	}
}

// TestScoreThermalCentreSocketVeeFlat: Drift takes the thermal centre in
// the plane through the centroid of the ball centres; the scorecard must
// take it in the same plane. A socket, a vee and a flat make three, two and
// one contacts, so a centroid of the contacts' ball centres would weight
// the balls 3:2:1 and, with the balls at different heights and a tilting
// drift, give another plane and another distance.
func TestScoreThermalCentreSocketVeeFlat(t *testing.T) {
	c, err := SocketVeeFlat([3]Ball{ball(-40, -30, 0), ball(45, -25, 12), ball(5, 50, -9)}, cube, vee45, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	s.Thermal.Base = 3 * s.Thermal.Moving
	card, err := c.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	th := s.Thermal
	th.DeltaT = 1
	dr, err := a.Drift(th, s.Point)
	if err != nil {
		t.Fatal(err)
	}
	if !dr.HasCentre {
		t.Fatal("no thermal centre")
	}
	if got, want := card.ThermalCentreDistance, dr.Distance; math.Abs(got-want) > 1e-9*want {
		t.Errorf("thermal centre distance: scorecard %.12g m, Drift %.12g m", got, want)
	}
	if got, want := card.Drift, r3.Norm(dr.RelativeLinear); math.Abs(got-want) > 1e-9*want {
		t.Errorf("drift: scorecard %.12g m/K, Drift %.12g m/K", got, want)
	}
}

// TestLargestEigenSym3AgainstGonum: the closed form of the largest
// eigenvalue matches gonum's mat.EigenSym on random symmetric matrices,
// on nearly repeated eigenvalues in a rotated basis, and on multiples of
// the identity, to 1e-14 of the largest |eigenvalue|.
func TestLargestEigenSym3AgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 19))
	for trial := 0; trial < 200; trial++ {
		var a [6][6]float64
		sym := mat.NewSymDense(3, nil)
		switch {
		case trial == 0:
			a[0][0], a[1][1], a[2][2] = 2.5e-9, 2.5e-9, 2.5e-9
		case trial%4 == 1:
			// Q·diag(λ, λ(1+δ), μ)·Qᵀ with a random rotation Q.
			lam := []float64{1e-7, 1e-7 * (1 + 1e-9), 3e-8}
			q := r3.NewRotation(rng.Float64()*6, r3.Vec{X: rng.Float64(), Y: rng.Float64() - 0.5, Z: 1})
			var cols [3]r3.Vec
			for k, e := range []r3.Vec{{X: 1}, {Y: 1}, {Z: 1}} {
				cols[k] = q.Rotate(e)
			}
			for i := range 3 {
				for j := range 3 {
					for k := range 3 {
						a[i][j] += lam[k] * comp(cols[k], i) * comp(cols[k], j)
					}
				}
			}
		default:
			for i := range 3 {
				for j := i; j < 3; j++ {
					x := 2*rng.Float64() - 1
					a[i][j], a[j][i] = x, x
				}
			}
		}
		for i := range 3 {
			for j := i; j < 3; j++ {
				sym.SetSym(i, j, (a[i][j]+a[j][i])/2)
			}
		}
		var es mat.EigenSym
		if !es.Factorize(sym, false) {
			t.Fatal("gonum EigenSym failed")
		}
		w := es.Values(nil)
		big := math.Max(math.Abs(w[0]), math.Abs(w[2]))
		if got := largestEigenSym3(&a); math.Abs(got-w[2]) > 1e-14*big {
			t.Errorf("trial %d: largest eigenvalue %.17g, gonum %.17g", trial, got, w[2])
		}
	}
}

func comp(v r3.Vec, i int) float64 {
	return [3]float64{v.X, v.Y, v.Z}[i]
}
