package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/screw"
)

// equilateralModel returns the equilateral three-vee coupling (balls 10 mm
// 52100 on a 50 mm circle, 90° vees of 440C on the bisectors, which are
// radial) with a vertical preload p through the centroid, downwards, and
// a payload of mass kg centred on the axis h above the ball plane.
func equilateralModel(t testing.TB, half, p, mass, h float64) (*Model, []Contact) {
	t.Helper()
	v := vee45
	v.HalfAngle = half
	c, err := BisectorVees(equilateral(), three(v))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	pre := []Preload{{Name: "clamp", Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: p}}
	pay := Payload{Mass: mass, Centre: r3.Vec{Z: h}}
	if mass > 0 {
		// A disc-like payload: Jxx = Jyy = 2e-3, Jzz = 3e-3 kg·m².
		pay.Inertia = [3][3]float64{{2e-3, 0, 0}, {0, 2e-3, 0}, {0, 0, 3e-3}}
	}
	m, err := NewModel(cs, pre, pay)
	if err != nil {
		t.Fatal(err)
	}
	return m, cs
}

// TestStaticsEquilateral: a vertical preload P through the centroid of an
// equilateral three-vee coupling loads every flank equally (symmetry), and
// vertical balance gives 6 f sin θ = P: f = P/(6 sin θ), θ the half-angle
// (the normals lean θ from the horizontal). The Hertz contact at f is that
// of a 5 mm ball on a flat (Johnson 1985, eq. 4.22–4.23):
// a = (3fR/(4E*))^(1/3), p₀ = 3f/(2πa²), with 1/E* = (1−ν₁²)/E₁ + (1−ν₂²)/E₂.
func TestStaticsEquilateral(t *testing.T) {
	for _, deg := range []float64{30, 45, 60} {
		th := deg * math.Pi / 180
		const P = 60.0
		m, _ := equilateralModel(t, th, P, 0, 0)
		s, err := m.Statics(LoadCase{Name: "preload", PreloadFactor: 1})
		if err != nil {
			t.Fatal(err)
		}
		want := P / (6 * math.Sin(th))
		b, f := hertz.Steel52100, hertz.Steel440C
		es := 1 / ((1-b.Nu*b.Nu)/b.E + (1-f.Nu*f.Nu)/f.E)
		a := math.Cbrt(3 * want * 5e-3 / (4 * es))
		p0 := 3 * want / (2 * math.Pi * a * a)
		for _, cl := range s.Contacts {
			if math.Abs(cl.Force-want) > 1e-12*want {
				t.Errorf("θ = %g°: %s force %.15g N, want P/(6 sin θ) = %.15g", deg, cl.Label, cl.Force, want)
			}
			if math.Abs(cl.Hertz.SemiMajor-a) > 1e-12*a || math.Abs(cl.Hertz.PeakPressure-p0) > 1e-12*p0 {
				t.Errorf("θ = %g°: %s a = %g, p0 = %g; want %g, %g", deg, cl.Label, cl.Hertz.SemiMajor, cl.Hertz.PeakPressure, a, p0)
			}
			// 52100 and 440C both have ISO 76's 4200 MPa.
			if cl.Allowable != 4200e6 || math.Abs(cl.PressureRatio-p0/4200e6) > 1e-12 {
				t.Errorf("%s: allowable %g, ratio %g", cl.Label, cl.Allowable, cl.PressureRatio)
			}
			if cl.Hertz.Stress[0].MaxShear == 0 {
				t.Errorf("%s: no subsurface stresses", cl.Label)
			}
		}
		if s.Tensile != nil {
			t.Errorf("tensile contacts %v", s.Tensile)
		}
	}
}

// TestStaticsDuality: the contact forces that balance a load w are
// fᵢ = −Power(Tᵢ, w) for the freed twists Tᵢ of Stability (power δᵢⱼ with
// contact j): write the balance Σ fⱼ lⱼ + w = 0 and take its power with Tᵢ.
// Checked on a general layout against Stability's own twists, and the
// balance itself to rounding.
func TestStaticsDuality(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	st := mustStability(t, c)
	m, err := NewModel(cs, nil, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	w := screw.Wrench{F: r3.Vec{X: 3, Y: -2, Z: -40}, M: r3.Vec{X: 0.4, Y: -0.7, Z: 0.2}}
	s, err := m.Statics(LoadCase{Applied: []screw.Wrench{w}})
	if err != nil {
		t.Fatal(err)
	}
	var sum screw.Wrench
	for i, cl := range s.Contacts {
		want := -screw.Power(st.Contacts[i].Freed, w)
		if math.Abs(cl.Force-want) > 1e-10*40 {
			t.Errorf("%s: force %g, −Power(Tᵢ, w) = %g", cl.Label, cl.Force, want)
		}
		l, _ := screw.Line(cs[i].Point, cs[i].Normal)
		sum = sum.Add(l.Scale(cl.Force))
	}
	sum = sum.Add(w)
	if r3.Norm(sum.F) > 1e-12*40 || r3.Norm(sum.M) > 1e-12*40*0.1 {
		t.Errorf("out of balance by %+v", sum)
	}
}

// TestTensileListed: pulling the coupling up with no preload puts every
// contact in tension; they are listed and rigid statics says so.
func TestTensileListed(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 10, 0, 0)
	s, err := m.Statics(LoadCase{NoPreload: true, Applied: []screw.Wrench{{F: r3.Vec{Z: 5}}}})
	if err != nil {
		t.Fatal(err)
	}
	if len(s.Tensile) != 6 {
		t.Errorf("tensile %v, want all six", s.Tensile)
	}
}

// TestShockClosedForm checks Shock against a brute-force search: the
// least force of each contact over 20 000 directions of the base's
// acceleration, each solved by Statics (an independent path through the
// load case), must not go below Shock's least force and must come within
// the grid's resolution of it; the unloading acceleration of the first
// contact, applied along Direction, leaves it at zero force.
func TestShockClosedForm(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0.8, 0.03)
	base := LoadCase{Name: "seated", PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	const a = 3 * StandardGravity
	sh, err := m.Shock(base, a)
	if err != nil {
		t.Fatal(err)
	}
	least := [6]float64{math.Inf(1), math.Inf(1), math.Inf(1), math.Inf(1), math.Inf(1), math.Inf(1)}
	const n = 20000
	for k := 0; k < n; k++ {
		// Fibonacci sphere: nearly even directions.
		z := 1 - (2*float64(k)+1)/n
		r := math.Sqrt(1 - z*z)
		phi := float64(k) * math.Pi * (3 - math.Sqrt(5))
		u := r3.Vec{X: r * math.Cos(phi), Y: r * math.Sin(phi), Z: z}
		lc := base
		lc.Acceleration = r3.Scale(a, u)
		s, err := m.Statics(lc)
		if err != nil {
			t.Fatal(err)
		}
		for i, cl := range s.Contacts {
			least[i] = math.Min(least[i], cl.Force)
		}
	}
	for i, sc := range sh.Contacts {
		// The grid's spacing is about √(4π/n) = 0.025 rad; the least force
		// is quadratic in the angle off the worst direction: within
		// a·Gain·0.025²/2 of the optimum.
		slack := a * sc.Gain * 0.025 * 0.025 / 2
		if least[i] < sc.Least-1e-9*sc.Base || least[i] > sc.Least+slack {
			t.Errorf("%s: brute-force least %g N, Shock says %g (slack %g)", sc.Label, least[i], sc.Least, slack)
		}
	}
	lc := base
	lc.Acceleration = r3.Scale(sh.Unload, sh.Direction)
	s, err := m.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	for i, cl := range s.Contacts {
		if cl.Label == sh.First[0] && math.Abs(cl.Force) > 1e-9*sh.Contacts[i].Base {
			t.Errorf("at the unloading acceleration %s carries %g N", cl.Label, cl.Force)
		}
		if cl.Force < -1e-9*sh.Contacts[i].Base {
			t.Errorf("at the unloading acceleration %s is in tension (%g N)", cl.Label, cl.Force)
		}
	}
	// By symmetry the first contacts to unload come in threes (the
	// coupling's threefold symmetry maps a vee's + flank to the other
	// vees' + flanks).
	if len(sh.First)%3 != 0 {
		t.Errorf("first to unload %v; want a multiple of three by symmetry", sh.First)
	}
}

// TestWrenchLimitAndLiftOff check the scale at which a load unloads a
// contact by bisection on Statics (independent of the closed form): just
// below the limit every contact is in compression, just above one is not.
func TestWrenchLimitAndLiftOff(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0.8, 0.03)
	base := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	check := func(name string, w screw.Wrench, scale float64) {
		t.Helper()
		minForce := func(s float64) float64 {
			lc := base
			lc.Applied = []screw.Wrench{w.Scale(s)}
			st, err := m.Statics(lc)
			if err != nil {
				t.Fatal(err)
			}
			f := math.Inf(1)
			for _, cl := range st.Contacts {
				f = math.Min(f, cl.Force)
			}
			return f
		}
		if !(minForce(scale*(1-1e-6)) > 0) || !(minForce(scale*(1+1e-6)) < 0) {
			t.Errorf("%s: limit %g is not where the first contact unloads", name, scale)
		}
	}
	pull := screw.Wrench{F: r3.Vec{X: 0.3, Z: 1}, M: r3.Vec{X: 0.01}}
	l, err := m.WrenchLimit(base, pull)
	if err != nil {
		t.Fatal(err)
	}
	check("wrench", pull, l.Scale)
	pts := []r3.Vec{{X: 0.07, Z: 0.01}, {Y: -0.05, Z: 0.01}, {X: 0.02, Y: 0.02, Z: 0.01}}
	lo, err := m.LiftOff(base, r3.Vec{Z: 1}, pts)
	if err != nil {
		t.Fatal(err)
	}
	for k, p := range lo {
		w, _ := screw.Line(pts[k], r3.Vec{Z: 1})
		check("lift-off", w, p.Force)
		if p.Contact == "" {
			t.Errorf("lift-off at %v names no contact", p.Point)
		}
	}
	// Pressing down at the centre never unloads anything.
	down, err := m.LiftOff(base, r3.Vec{Z: -1}, []r3.Vec{{Z: 0.01}})
	if err != nil {
		t.Fatal(err)
	}
	if !math.IsInf(down[0].Force, 1) {
		t.Errorf("pressing down at the centre: limit %g N, want +Inf", down[0].Force)
	}
}

// TestLoadErrors: bad numbers in the model and the load cases name their
// field and wrap a sentinel; a non-exact set refuses rigid statics.
func TestLoadErrors(t *testing.T) {
	_, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	nan := math.NaN()
	for _, tc := range []struct {
		name  string
		pre   []Preload
		pay   Payload
		field string
		err   error
	}{
		{"negative mass", nil, Payload{Mass: -1}, "payload.Mass", ErrRange},
		{"NaN mass", nil, Payload{Mass: nan}, "payload.Mass", ErrNonFinite},
		{"NaN centre", nil, Payload{Mass: 1, Centre: r3.Vec{X: nan}}, "payload.Centre", ErrNonFinite},
		{"asymmetric inertia", nil, Payload{Mass: 1, Inertia: [3][3]float64{{1, 0.5, 0}, {0, 1, 0}, {0, 0, 1}}}, "payload.Inertia", ErrRange},
		{"indefinite inertia", nil, Payload{Mass: 1, Inertia: [3][3]float64{{1, 0, 0}, {0, -1, 0}, {0, 0, 1}}}, "payload.Inertia", ErrRange},
		{"Inf inertia", nil, Payload{Mass: 1, Inertia: [3][3]float64{{math.Inf(1), 0, 0}, {0, 1, 0}, {0, 0, 1}}}, "payload.Inertia[0][0]", ErrNonFinite},
		{"zero preload direction", []Preload{{Force: 10}}, Payload{}, "preloads[0].Direction", ErrDegenerate},
		{"negative preload", []Preload{{Force: -1, Direction: up}}, Payload{}, "preloads[0].Force", ErrRange},
		{"NaN rate", []Preload{{Force: 1, Direction: up, Rate: nan}}, Payload{}, "preloads[0].Rate", ErrNonFinite},
	} {
		_, err := NewModel(cs, tc.pre, tc.pay)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping %v", tc.name, err, tc.field, tc.err)
		}
	}
	m, _ := equilateralModel(t, math.Pi/4, 60, 1, 0)
	for _, tc := range []struct {
		name  string
		lc    LoadCase
		field string
	}{
		{"NaN factor", LoadCase{PreloadFactor: nan}, "lc.PreloadFactor"},
		{"Inf gravity", LoadCase{Gravity: r3.Vec{Z: math.Inf(-1)}}, "lc.Gravity"},
		{"NaN acceleration", LoadCase{Acceleration: r3.Vec{Y: nan}}, "lc.Acceleration"},
		{"NaN applied", LoadCase{Applied: []screw.Wrench{{}, {M: r3.Vec{X: nan}}}}, "lc.Applied[1]"},
	} {
		_, err := m.Statics(tc.lc)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, ErrNonFinite) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping ErrNonFinite", tc.name, err, tc.field)
		}
	}
	if _, err := m.Shock(LoadCase{}, -1); !errors.Is(err, ErrRange) {
		t.Errorf("negative shock: %v", err)
	}
	if _, err := m.LiftOff(LoadCase{}, r3.Vec{}, nil); !errors.Is(err, ErrDegenerate) {
		t.Errorf("zero lift-off direction: %v", err)
	}
	seven := append(append([]Contact(nil), cs...), Contact{Label: "pad", Point: r3.Vec{Z: 0.02}, Normal: r3.Vec{Z: -1}})
	m7, err := NewModel(seven, nil, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := m7.Statics(LoadCase{}); !errors.Is(err, ErrNotExact) {
		t.Errorf("rigid statics of seven contacts: %v", err)
	}
	// A hand-made contact has no Hertz surfaces: forces work, Hertz does not.
	bare := append([]Contact(nil), cs...)
	bare[3].Moving, bare[3].Base = hertz.Body{}, hertz.Body{}
	mb, err := NewModel(bare, []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	var ie *InputError
	if _, err := mb.Statics(LoadCase{PreloadFactor: 1}); !errors.As(err, &ie) || ie.Field != "cs[3].Moving, cs[3].Base" {
		t.Errorf("contact without surfaces: err = %v", err)
	}
	if _, err := mb.WrenchLimit(LoadCase{PreloadFactor: 1}, screw.Wrench{F: up}); err != nil {
		t.Errorf("forces without surfaces: %v", err)
	}
	// A cone's ring is not a Hertz point contact: named, not a number.
	cone := Cone{Up: up, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	bs := isosceles()
	v := vee45
	v.Direction = r3.Sub(bs[0].Centre, bs[1].Centre)
	cc := mustContacts(t, Coupling{Pairs: []Pair{{Ball: bs[0], Seat: cone}, {Ball: bs[1], Seat: v}, {Ball: bs[2], Seat: flatUp}}})
	mc, err := NewModel(cc, []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := mc.Statics(LoadCase{PreloadFactor: 1}); !errors.As(err, &ie) || ie.Field != "cs[0].Moving, cs[0].Base" || !errors.Is(err, hertz.ErrLineContact) {
		t.Errorf("cone contact: err = %v, want the line-contact error naming cs[0]", err)
	}
}
