package design

import (
	"context"
	"math"
	"sort"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// The equilateral fixture (testdata/equilateral.json): three balls of
// radius r = 6.35 mm with centres on a circle of radius R = 50 mm in the
// plane z = 0, at 90°, 210° and 330° (A, B, C), each in a 90° vee (contact
// normals leaning θ = 45° from the horizontal) whose groove is radial
// (aimed at the centre O, the origin; the bisectors of the triangle). A
// preload P = 300 N acts down the z axis; the payload, m = 2 kg with
// I_xx = I_yy = 4e-3 and I_zz = 6e-3 kg·m², has its centre of mass at O.
// Balls and seats are AISI 52100 (hertz.Steel52100: E = 208 GPa,
// ν = 0.30, α = 11.9e-6/K, allowable 4200 MPa).
//
// Each contact normal n = sin θ ẑ ∓ cos θ t̂ (t̂ the tangential direction
// at the ball) passes through its ball's centre. The closed forms used
// below, derived here:
//
//  1. Contact force. By the three-fold symmetry and the mirror symmetry of
//     each vee, the six forces are equal, N. Their horizontal parts cancel
//     within each vee; the vertical balance is 6 N sin θ = F, so
//     N = F/(6 sin θ), with F = P (case "preload only") or P + m g
//     (case "seated", g = 9.80665 m/s², 3rd CGPM 1901).
//  2. Hertz contact of a ball on a flat flank (Johnson, Contact
//     Mechanics, 1985, §4.2, circular contact; from memory): a³ = 3NR/(4E*)
//     with R = r and 1/E* = 2(1 − ν²)/E, p₀ = 3N/(2πa²), approach
//     δ = a²/R, normal stiffness k = dN/dδ = 3N/(2δ).
//  3. Maxwell centre index. Removing contact A+ frees the twists with zero
//     power against the other five lines. Those of B and C pass through
//     their centres, so B's and C's centres may only move along their
//     (radial) grooves; the motions that allow it are the rotation about
//     line BC and the rotation about the vertical axis through Q, where
//     the lines normal to OB at B and to OC at C meet: Q = (0, −2R, 0).
//     Under the first A's centre moves along ẑ (1.5R per unit rotation),
//     under the second along the tangent at A (−3R x̂ per unit rotation):
//     never along A's groove. So v_A lies in the plane of A's two normals;
//     v_A ⊥ n(A−) (power zero with A−) and n(A+)·v_A = 1, so the index
//     |n·v|/|v| is the sine of the angle between the normals,
//     sin(π − 2θ) = sin 2θ = 1.
//  4. Shock. Solving v_A·n(A+) = 1, v_A·n(A−) = 0 with v_A = V_z ẑ + V_t t̂
//     gives V_z = 1/(2 sin θ), |V_t| = 1/(2 cos θ). At O the rotation
//     about BC gives a third of A's vertical speed (O is R/2 from BC, A is
//     3R/2) and the rotation about Q two thirds of its tangential speed
//     (O is 2R from Q, A is 3R): |T(O)|² = (1/(6 sin θ))² + (1/(3 cos θ))²,
//     √10/6 for θ = 45°, the same for all six contacts by symmetry. An
//     acceleration a of the base in the worst direction changes the force
//     by m a |T(O)| (the inertial load −m a acts at O), so the first
//     contact unloads at a = N/(m |T(O)|).
//  5. Error amplification at O: a unit gap error at contact i moves O by
//     T_i(O), so the RSS over the six is √6·|T(O)| = √60/6.
//  6. Stiffness and modes. With K = Σ k l lᵀ (lines l = (n, c × n)) and
//     the centre of mass at O, every cross term between the six rigid
//     motions about O vanishes by the symmetry (each vee's pair of
//     tangential parts cancels; Σ t_x = Σ t_x t_y = Σ r_x r_y = 0 over the
//     three balls; the lines pass through the centres at z = 0, so lateral
//     translation and tilt about O decouple), leaving the diagonal
//     K_z = 6k sin²θ, K_x = K_y = 3k cos²θ, K_rx = K_ry = 3k R² sin²θ,
//     K_rz = 6k R² cos²θ; and f = √(K/M)/(2π) with M = m or the moment of
//     inertia about that axis. The compliance at O along z is 1/K_z.
//  7. Error budget. A ball smaller by e sinks e/sin θ in its vee (its
//     centre sits r/sin θ above the groove's root) and the body turns about
//     the line through the other two centres, moving O (a third of the way
//     from that line to the ball) down by e/(3 sin θ) = (√2/3) e. Three
//     radius tolerances of ±e (uniform) then give a worst case
//     3 (√2/3) e = √2 e and an RSS √3 (√2/3) e, all along z.
//  8. Monte Carlo. To first order O moves by (√2/3)(e_A + e_B + e_C) with
//     e_i uniform on ±e: the sum of three uniforms (Irwin–Hall). With
//     U(−1, 1) terms, P(S > s) = (3 − s)³/48 for 1 ≤ s ≤ 3 (the n = 3
//     Irwin–Hall tail (3 − x)³/6 with S = 2X − 3), so the 99th percentile
//     of |S| solves (3 − s)³/24 = 0.01: s = 3 − 0.24^(1/3) = 2.37855. Its
//     sampling error for N = 200 000 is √(0.99·0.01/N)/f(s) with the
//     density of |S| f(s) = (3 − s)²/8, 0.2 % of s.
//  9. Thermal drift. With the bodies' coefficients zero, only the balls
//     grow, each by α r ΔT; as in 7 each centre rises by α r ΔT/sin θ,
//     equally, so the body rises by √2 α r ΔT (ΔT = 10 K), with no tilt.
//     (The flanks are planes through their roots, which their own
//     expansion does not move.)
func TestEquilateralEndToEnd(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/equilateral.json"))
	if err != nil {
		t.Fatal(err)
	}
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	const (
		r     = 6.35e-3
		bigR  = 0.05
		theta = math.Pi / 4
		P     = 300.0
		m     = 2.0
		g     = 9.80665
		e     = 1e-6
		dT    = 10.0
	)
	mat := hertz.Steel52100
	eStar := mat.E / (2 * (1 - mat.Nu*mat.Nu))
	sin, cos := math.Sin(theta), math.Cos(theta)
	near := func(what string, got, want, rel float64) {
		t.Helper()
		if math.Abs(got-want) > rel*math.Abs(want) {
			t.Errorf("%s = %.10g, want %.10g (rel. tol. %g)", what, got, want, rel)
		}
	}

	// 1 and 2: forces and Hertz stresses in both cases.
	for k, F := range map[int]float64{0: P + m*g, 1: P} {
		N := F / (6 * sin)
		a := math.Cbrt(3 * N * r / (4 * eStar))
		p0 := 3 * N / (2 * math.Pi * a * a)
		st := ev.Cases[k]
		if st.Tensile != nil {
			t.Errorf("case %q: tensile contacts %v", st.Case, st.Tensile)
		}
		for _, c := range st.Contacts {
			near(st.Case+" "+c.Label+" force", c.Force, N, 1e-12)
			near(st.Case+" "+c.Label+" contact radius", c.Hertz.SemiMajor, a, 1e-9)
			near(st.Case+" "+c.Label+" peak pressure", c.Hertz.PeakPressure, p0, 1e-9)
			near(st.Case+" "+c.Label+" pressure ratio", c.PressureRatio, p0/4200e6, 1e-9)
		}
	}
	nSeated := (P + m*g) / (6 * sin)
	near("MinForce", ev.MinForce, P/(6*sin), 1e-12)
	if ev.MinForceAt.Case != "preload only" {
		t.Errorf("MinForceAt %+v, want case \"preload only\"", ev.MinForceAt)
	}
	a := math.Cbrt(3 * nSeated * r / (4 * eStar))
	near("MaxPressureRatio", ev.MaxPressureRatio, 3*nSeated/(2*math.Pi*a*a)/4200e6, 1e-9)

	// 3: the weakest centre index.
	if got := ev.Stability.Contacts[ev.Weakest].CentreIndex; math.Abs(got-math.Sin(2*theta)) > 1e-12 {
		t.Errorf("weakest centre index %.15g, want sin 2θ = 1", got)
	}

	// 4 and 5: shock level and error amplification.
	tO := math.Hypot(1/(6*sin), 1/(3*cos))
	near("|T(O)| closed form", tO, math.Sqrt(10)/6, 1e-15)
	near("shock level", ev.Shock.Unload, nSeated/(m*tO), 1e-9)
	if ev.ShockCase != "seated" {
		t.Errorf("ShockCase %q, want \"seated\"", ev.ShockCase)
	}
	near("error amplification RSS at O", ev.Amplification.RSS, math.Sqrt(60)/6, 1e-9)

	// 6: modes and compliance.
	delta := a * a / r
	k := 1.5 * nSeated / delta
	want := []float64{
		math.Sqrt(6*k*sin*sin/m) / (2 * math.Pi),
		math.Sqrt(3*k*cos*cos/m) / (2 * math.Pi),
		math.Sqrt(3*k*cos*cos/m) / (2 * math.Pi),
		math.Sqrt(3*k*bigR*bigR*sin*sin/4e-3) / (2 * math.Pi),
		math.Sqrt(3*k*bigR*bigR*sin*sin/4e-3) / (2 * math.Pi),
		math.Sqrt(6*k*bigR*bigR*cos*cos/6e-3) / (2 * math.Pi),
	}
	sort.Float64s(want)
	if ev.Modes == nil {
		t.Fatalf("no modes; notes %v", ev.Notes)
	}
	for i, md := range ev.Modes {
		near("frequency "+string(rune('1'+i)), md.Frequency, want[i], 1e-9)
	}
	cz, err := ev.Compliance.Along(r3.Vec{Z: 1})
	if err != nil {
		t.Fatal(err)
	}
	near("compliance along z at O", cz, 1/(6*k*sin*sin), 1e-9)

	// 7: error budget, also along the axis (z).
	near("budget worst case", ev.Budget.Worst, math.Sqrt2*e, 1e-9)
	near("budget RSS", ev.Budget.RSS, math.Sqrt(3)*math.Sqrt2/3*e, 1e-9)
	near("budget worst case along z", ev.AxisWorst, math.Sqrt2*e, 1e-9)
	near("budget RSS along z", ev.AxisRSS, math.Sqrt(3)*math.Sqrt2/3*e, 1e-9)

	// 8: Monte Carlo 99th percentile, within 1 % (five times its
	// sampling error).
	near("study radial P99", ev.Study.Radial.P99, math.Sqrt2/3*(3-math.Cbrt(0.24))*e, 0.01)
	if ev.Study.Samples != 200000 {
		t.Errorf("study drew %d samples, want 200000", ev.Study.Samples)
	}

	// 9: thermal drift.
	rise := math.Sqrt2 * mat.Alpha * r * dT
	near("drift z", ev.Drift.Relative.Z, rise, 1e-9)
	if lat := math.Hypot(ev.Drift.Relative.X, ev.Drift.Relative.Y); lat > 1e-9*rise {
		t.Errorf("lateral drift %g m, want 0", lat)
	}

	// Every requirement of the fixture passes with these values.
	if err := ev.Verdicts().Err(); err != nil {
		t.Error(err)
	}
}

// TestCassette evaluates the demo design and checks what must hold for
// any design, independently of the solver: every load case's contact
// forces balance its load (Σ fᵢ lᵢ + w = 0, the force and the moment about
// the origin, from the contacts' points and normals as built), and the
// demo meets its requirements.
func TestCassette(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/cassette.json"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	ev, err := b.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	cs := b.Contacts()
	for k, lc := range d.Cases {
		// The load: preload, weight at the centre of mass, applied wrenches.
		var f, mo r3.Vec
		for _, p := range d.Preloads {
			pf := r3.Scale(lc.PreloadFactor*p.Force/r3.Norm(p.Direction), p.Direction)
			f, mo = r3.Add(f, pf), r3.Add(mo, r3.Cross(p.Point, pf))
		}
		wf := r3.Scale(d.Payload.Mass, r3.Sub(lc.Gravity, lc.Acceleration))
		f, mo = r3.Add(f, wf), r3.Add(mo, r3.Cross(d.Payload.Centre, wf))
		for _, w := range lc.Applied {
			f, mo = r3.Add(f, w.F), r3.Add(mo, w.M)
		}
		scale := r3.Norm(f)
		for i, c := range ev.Cases[k].Contacts {
			cf := r3.Scale(c.Force, cs[i].Normal)
			f, mo = r3.Add(f, cf), r3.Add(mo, r3.Cross(cs[i].Point, cf))
			scale = math.Max(scale, math.Abs(c.Force))
		}
		if r3.Norm(f) > 1e-12*scale || r3.Norm(mo) > 1e-12*scale*0.1 {
			t.Errorf("case %q: out of balance by %v N and %v N·m", lc.Name, f, mo)
		}
	}
	if err := ev.Verdicts().Err(); err != nil {
		t.Errorf("the demo design should meet its requirements: %v", err)
	}
	if len(ev.Notes) != 0 {
		t.Errorf("notes %v", ev.Notes)
	}
}

// TestEvaluateCancelled checks that a cancelled context stops the
// evaluation with the context's error.
func TestEvaluateCancelled(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/equilateral.json"))
	if err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := d.Evaluate(ctx); err != context.Canceled {
		t.Errorf("error %v, want context.Canceled", err)
	}
}

// TestBuilders checks that Build's Coupling, Model and Assembly give kinematic's
// objects for the file: the fixture's grooves given by azimuth 0 from
// the radial direction and by an explicit direction all point at the
// centre (the groove of a ball at angle φ on the circle is ±(cos φ, sin φ, 0)).
func TestBuilders(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/equilateral.json"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	c := b.Coupling()
	for i, p := range c.Pairs {
		v, ok := p.Seat.(kinematic.Vee)
		if !ok {
			t.Fatalf("Pairs[%d].Seat is %T", i, p.Seat)
		}
		radial := r3.Unit(p.Ball.Centre)
		if cross := r3.Norm(r3.Cross(r3.Unit(v.Direction), radial)); cross > 1e-15 {
			t.Errorf("Pairs[%d] groove %v is not radial (|d × r̂| = %g)", i, v.Direction, cross)
		}
		if p.Name != string(rune('A'+i)) {
			t.Errorf("Pairs[%d].Name %q", i, p.Name)
		}
	}
	m, cs := b.Model(), b.Contacts()
	if m == nil || len(cs) != 6 {
		t.Fatalf("Model: %v, %d contacts", m, len(cs))
	}
	a := b.Assembly()
	if n := len(a.Dimensions()); n != 36 {
		t.Errorf("%d dimensions, want 36 (12 per vee pair, kinematic.Assembly)", n)
	}
}
