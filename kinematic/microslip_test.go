package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

// pushCycle returns a symmetric cycle of a force F along dir through at:
// 0 → +F → −F → 0 in 4n equal steps.
func pushCycle(F float64, dir, at r3.Vec, n int) []CycleStep {
	var s []CycleStep
	add := func(f float64) { s = append(s, CycleStep{Force: r3.Scale(f, dir), Point: at}) }
	for k := 1; k <= n; k++ {
		add(F * float64(k) / float64(n))
	}
	for k := 1; k <= 2*n; k++ {
		add(F - 2*F*float64(k)/float64(2*n))
	}
	for k := 1; k <= n; k++ {
		add(-F + F*float64(k)/float64(n))
	}
	s[len(s)-1].Force = r3.Vec{}
	return s
}

// linearDisplacement returns the displacement at p of the coupling under
// the force f through at, from the compliance of Model.Stiffness (with or
// without the no-slip tangential stiffness): an independent linear path.
func linearDisplacement(t *testing.T, m *Model, lc LoadCase, tangential bool, f, at, p r3.Vec) r3.Vec {
	t.Helper()
	st, err := m.Stiffness(lc, &StiffnessOptions{Tangential: tangential})
	if err != nil {
		t.Fatal(err)
	}
	c, err := st.Compliance(p)
	if err != nil {
		t.Fatal(err)
	}
	mo := r3.Cross(r3.Sub(at, p), f)
	w := [6]float64{f.X, f.Y, f.Z, mo.X, mo.Y, mo.Z}
	var v [3]float64
	for a := range 3 {
		for b := range 6 {
			v[a] += c.Matrix[a][b] * w[b]
		}
	}
	return r3.Vec{X: v[0], Y: v[1], Z: v[2]}
}

// TestHysteresisLimits: with μ → ∞ no contact slips, the path is the
// linear one of the no-slip stiffness (Model.Stiffness with Tangential)
// to first order in the load, and the cycle leaves nothing behind; with
// μ → 0 the contacts carry no tangential force, the path is the
// frictionless one (normal stiffness only) and again nothing is left
// (Johnson 1985, §7.2: no slip without a tangential load, no hysteresis
// without slip). Hysteresis refuses μ > 3 as a percentage, so μ = 1e6 goes
// through its unexported body, hysteresis.
func TestHysteresisLimits(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{Name: "preload"}
	at, p := r3.Vec{Z: 0.01}, r3.Vec{X: 0.01, Z: 0.03}
	const F = 0.01 // N against 60 N of preload: linear to about 1e-4
	steps := pushCycle(F, r3.Vec{X: 1}, at, 10)
	for _, tc := range []struct {
		mu         float64
		tangential bool
	}{{1e6, true}, {1e-12, false}} {
		h, err := m.hysteresis(lc, steps, tc.mu, p)
		if err != nil {
			t.Fatal(err)
		}
		want := linearDisplacement(t, m, lc, tc.tangential, r3.Vec{X: F}, at, p)
		got := h.Path[9].Displacement
		if d := r3.Norm(r3.Sub(got, want)); d > 1e-3*r3.Norm(want) {
			t.Errorf("μ = %g: displacement at +F %v, linear %v", tc.mu, got, want)
		}
		if r := r3.Norm(h.Residual); r > 1e-6*r3.Norm(want) {
			t.Errorf("μ = %g: residual %v against a peak of %v", tc.mu, r, r3.Norm(want))
		}
		if !(math.Abs(h.Energy) < 1e-6*F*r3.Norm(want)) {
			t.Errorf("μ = %g: energy %v J, want ≈ 0 (F·δ = %v J)", tc.mu, h.Energy, F*r3.Norm(want))
		}
	}
}

// TestHysteresisLoop: with finite μ a symmetric cycle leaves a residual,
// the second visit of +F lands where the first did (the loop closes:
// Masing's memory rule, Johnson 1985, §7.4), and the energy per cycle
// in the small-amplitude limit is the sum of the contacts' losses,
// W = Σ μ²Pᵢ²xᵢ³/(36G*aᵢ) = Σ (2/9)Qᵢ³/(μPᵢk₀ᵢ) with k₀ = 8G*a (the limit
// derived in hertz's TestSlipEnergySmall), the amplitudes Qᵢ = k₀ᵢ|uᵢ|
// from the no-slip displacement uᵢ of each contact in its tangent plane
// (Model.Stiffness with Tangential; compliance at the contact point).
func TestHysteresisLoop(t *testing.T) {
	m, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{Name: "preload"}
	at, p := r3.Vec{Z: 0.01}, r3.Vec{X: 0.01, Z: 0.03}
	const F, mu = 0.02, 0.05
	dir := r3.Vec{X: 1}
	n := 50
	steps := pushCycle(F, dir, at, n)
	steps = append(steps[:len(steps):len(steps)], pushCycle(F, dir, at, n)...) // two cycles
	h, err := m.Hysteresis(lc, steps, mu, p)
	if err != nil {
		t.Fatal(err)
	}
	first, second := h.Path[n-1].Displacement, h.Path[5*n-1].Displacement
	if d := r3.Norm(r3.Sub(first, second)); d > 1e-9*r3.Norm(first) {
		t.Errorf("+F first %v, second %v", first, second)
	}
	mid := h.Path[4*n-1].Displacement // after the first cycle
	if !(r3.Norm(mid) > 1e-4*r3.Norm(first)) {
		t.Errorf("no residual after a cycle with slip: %v against %v", mid, first)
	}
	if d := r3.Norm(r3.Sub(mid, h.Residual)); d > 1e-9*r3.Norm(first) {
		t.Errorf("residuals of the two cycles differ: %v, %v", mid, h.Residual)
	}
	// The second cycle of the path is the steady loop (Masing), so the
	// work of the push around it by the trapezoid rule, from the
	// reported displacements of the push's point of application, is the
	// energy per cycle (the work of the loads, which Hysteresis forms
	// from the pose instead).
	hp, err := m.Hysteresis(lc, steps, mu, at)
	if err != nil {
		t.Fatal(err)
	}
	var work float64
	for k := 4 * n; k < 8*n; k++ {
		a, b := hp.Path[k-1], hp.Path[k]
		work += 0.5 * r3.Dot(r3.Add(a.Force, b.Force), r3.Sub(b.Displacement, a.Displacement))
	}
	if math.Abs(work-hp.Energy/2) > 1e-9*hp.Energy {
		t.Errorf("work of the push around the second cycle %v J, energy per cycle %v J", work, hp.Energy/2)
	}
	// Energy per cycle against the contacts' small-amplitude losses.
	st, err := m.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	var want float64
	for i, c := range cs {
		u := linearDisplacement(t, m, lc, true, r3.Scale(F, dir), at, c.Point)
		ut := r3.Sub(u, r3.Scale(r3.Dot(u, c.Normal), c.Normal))
		hc := st.Contacts[i].Hertz
		k0, err := hc.TangentialStiffness(mu, 0)
		if err != nil {
			t.Fatal(err)
		}
		q := k0 * r3.Norm(ut)
		P := hc.Load
		if x := q / (mu * P); x > 0.1 {
			t.Fatalf("contact %d: x = %g is not small", i, x)
		}
		want += 2.0 / 9 * q * q * q / (mu * P * k0)
	}
	if math.Abs(h.Energy/2-want) > 0.05*want { // the steps hold two cycles
		t.Errorf("energy per cycle %v J, small-amplitude sum %v J", h.Energy/2, want)
	}
}

func TestHysteresisErrors(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0, 0)
	ok := pushCycle(1, r3.Vec{X: 1}, r3.Vec{}, 2)
	field := func(err error) string {
		var ie *InputError
		if errors.As(err, &ie) {
			return ie.Field
		}
		return ""
	}
	bad := append([]CycleStep(nil), ok...)
	bad[3].Force.Y = math.NaN()
	for _, tc := range []struct {
		steps []CycleStep
		mu    float64
		p     r3.Vec
		field string
	}{
		{bad, 0.1, r3.Vec{}, "steps[3].Force"},
		{ok, math.NaN(), r3.Vec{}, "mu"},
		{ok, 0, r3.Vec{}, "mu"},
		{ok, 0.1, r3.Vec{X: math.Inf(1)}, "p"},
		{nil, 0.1, r3.Vec{}, "steps"},
		{ok[:2], 0.1, r3.Vec{}, "steps[1].Force"},
		{[]CycleStep{{Force: r3.Vec{Z: 1000}}, {}}, 0.1, r3.Vec{}, "steps[0]"},
	} {
		_, err := m.Hysteresis(LoadCase{}, tc.steps, tc.mu, tc.p)
		if field(err) != tc.field {
			t.Errorf("want field %q, got %v", tc.field, err)
		}
	}
}

var sinkHysteresis Hysteresis

// BenchmarkHysteresis measures one load cycle of 100 steps (and the second
// pass that gives the energy) through the six contacts of a three-vee
// coupling, in two regimes: small loads (little slip) and loads that slip
// most of each contact (slip ratio near 1).
func BenchmarkHysteresis(b *testing.B) {
	m, _ := equilateralModel(b, math.Pi/4, 60, 0, 0)
	at, p := r3.Vec{Z: 0.01}, r3.Vec{X: 0.01, Z: 0.03}
	for _, bc := range []struct {
		name  string
		F, mu float64
	}{{"small-slip", 0.5, 0.2}, {"large-slip", 3, 0.1}} {
		steps := pushCycle(bc.F, r3.Vec{X: 1}, at, 25)
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				h, err := m.Hysteresis(LoadCase{}, steps, bc.mu, p)
				if err != nil {
					b.Fatal(err)
				}
				sinkHysteresis = h
			}
		})
	}
}

// FuzzHysteresis applies arbitrary cycles (force, point and moment of up
// to 40 steps, and μ) to a three-vee coupling: no panic; an error is an
// *InputError naming a field; a result is finite, with the slip ratio in
// [0, 1] and a residual equal to the last step's displacement.
func FuzzHysteresis(f *testing.F) {
	seed := func(mu float64, steps []CycleStep) []byte {
		b := fuzzdata.Append(nil, mu)
		for _, s := range steps {
			b = fuzzdata.Append(b, s.Force.X, s.Force.Y, s.Force.Z, s.Point.X, s.Point.Y, s.Point.Z, s.Moment.X, s.Moment.Y, s.Moment.Z)
		}
		return b
	}
	f.Add(seed(0.1, pushCycle(2, r3.Vec{X: 1}, r3.Vec{Z: 0.01}, 3)))
	f.Add(seed(0.1, pushCycle(2, r3.Vec{X: 1, Y: 1}, r3.Vec{Z: 0.01}, 1)))
	nan := pushCycle(2, r3.Vec{X: 1}, r3.Vec{Z: 0.01}, 1)
	nan[3].Force.X = math.NaN()
	f.Add(seed(0.1, nan))
	f.Add(seed(1e300, []CycleStep{{Force: r3.Vec{Z: 1e300}}, {}}))
	// μ as a percentage (refused) and at the bound 3 (accepted).
	f.Add(seed(15, pushCycle(2, r3.Vec{X: 1}, r3.Vec{Z: 0.01}, 3)))
	f.Add(seed(3, pushCycle(2, r3.Vec{X: 1}, r3.Vec{Z: 0.01}, 3)))
	m, _ := equilateralModel(f, math.Pi/4, 60, 0, 0)
	f.Fuzz(func(t *testing.T, b []byte) {
		if len(b) < 8 {
			return
		}
		mu := fuzzdata.Floats(b[:8], 1)[0][0]
		var steps []CycleStep
		for _, v := range fuzzdata.Floats(b[8:], 9) {
			steps = append(steps, CycleStep{Force: r3.Vec{X: v[0], Y: v[1], Z: v[2]}, Point: r3.Vec{X: v[3], Y: v[4], Z: v[5]}, Moment: r3.Vec{X: v[6], Y: v[7], Z: v[8]}})
		}
		if len(steps) > 40 {
			return
		}
		h, err := m.Hysteresis(LoadCase{}, steps, mu, r3.Vec{Z: 0.02})
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error %v names no field", err)
			}
			return
		}
		for k, s := range h.Path {
			if !allFinite3(s.Displacement, s.Tilt) || !(s.SlipRatio >= 0 && s.SlipRatio <= math.Sqrt2*(1+1e-12)) {
				t.Fatalf("step %d: %+v", k, s)
			}
		}
		if h.Residual != h.Path[len(h.Path)-1].Displacement || !allFinite(h.Energy) {
			t.Fatalf("residual %v, energy %v", h.Residual, h.Energy)
		}
	})
}
