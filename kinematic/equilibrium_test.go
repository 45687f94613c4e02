package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/screw"
)

// TestEquilibriumEqualsRigid: on an exactly constrained set in compression
// the elastic equilibrium carries the rigid-statics forces (six equations
// fix six forces whatever the contacts' elasticity), to 1e-9.
func TestEquilibriumEqualsRigid(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	m, err := NewModel(cs, []Preload{{Point: r3.Vec{X: 0.005, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 80}}, Payload{Mass: 1.2, Centre: r3.Vec{Y: 0.01, Z: 0.04}})
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{Name: "tilted", PreloadFactor: 1, Gravity: r3.Vec{X: 2, Y: -1, Z: -9.5}}
	rig, err := m.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	eq, err := m.Equilibrium(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, cl := range eq.Contacts {
		if f := rig.Contacts[i].Force; math.Abs(cl.Force-f) > 1e-9*f {
			t.Errorf("%s: elastic %.12g N, rigid %.12g N", cl.Label, cl.Force, f)
		}
	}
	if eq.Residual > 1e-12 || len(eq.Open) != 0 {
		t.Errorf("residual %g, open %v", eq.Residual, eq.Open)
	}
	checkCompatible(t, m, cs, eq, nil)
}

// checkCompatible checks an equilibrium independently of the solver: the
// displacement gives each contact an approach δᵢ = eᵢ − n·v(pᵢ) (v the
// velocity field of the displacement twist), the force is the Hertz law
// k δ^(3/2) of that approach (zero when δ ≤ 0), and the forces balance the
// load (see checkBalance), all to 1e-9.
func checkCompatible(t *testing.T, m *Model, cs []Contact, eq Equilibrium, gaps map[string]float64) {
	t.Helper()
	for i, c := range cs {
		d := -gaps[c.Label] - r3.Dot(c.Normal, eq.Displacement.At(c.Point))
		want := 0.0
		if d > 0 {
			want = m.surf[i].k * math.Pow(d, 1.5)
		}
		if f := eq.Contacts[i].Force; math.Abs(f-want) > 1e-9*math.Max(f, 1e-3) {
			t.Errorf("%s: force %.12g N, Hertz law of its approach %.6g m gives %.12g N", c.Label, f, d, want)
		}
	}
	if eq.Residual > 1e-9 {
		t.Errorf("residual %g", eq.Residual)
	}
}

// TestEquilibriumSevenContacts: three vees and a hold-down pad above the
// coupling's centre. With the pad just touching (no interference), the
// preload pushes the body down into the vees and away from the pad, which
// carries nothing; with the pad set 2 µm into the body, it carries load and
// the vees carry more (equilibrium and Hertz compatibility both checked
// independently of the solver).
func TestEquilibriumSevenContacts(t *testing.T) {
	_, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	pad := mustContacts(t, Coupling{Pairs: []Pair{{Name: "pad", Ball: ball(0, 0, 20), Seat: Flat{Up: r3.Vec{Z: -1}, Material: vee45.Material}}}})
	seven := append(append([]Contact(nil), cs...), pad...)
	pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}
	m, err := NewModel(seven, pre, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{PreloadFactor: 1}
	eq, err := m.Equilibrium(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	if eq.Contacts[6].Force != 0 || len(eq.Open) != 1 || eq.Open[0] != "pad" {
		t.Errorf("pad without interference: force %g, open %v; want 0 and [pad]", eq.Contacts[6].Force, eq.Open)
	}
	checkBalance(t, seven, eq, 60)
	checkCompatible(t, m, seven, eq, nil)

	gaps := map[string]float64{"pad": -2e-6}
	eq, err = m.Equilibrium(lc, &EquilibriumOptions{Gaps: gaps})
	if err != nil {
		t.Fatal(err)
	}
	if !(eq.Contacts[6].Force > 0) || len(eq.Open) != 0 {
		t.Errorf("pad with 2 µm interference: force %g, open %v", eq.Contacts[6].Force, eq.Open)
	}
	// Vertical balance: 6 f sin θ = P + F_pad (every flank equal by
	// symmetry).
	var vee float64
	for _, c := range eq.Contacts[:6] {
		vee += c.Force * math.Sin(math.Pi/4)
	}
	if want := 60 + eq.Contacts[6].Force; math.Abs(vee-want) > 1e-9*want {
		t.Errorf("vertical: vees carry %g N, want P + pad = %g N", vee, want)
	}
	checkBalance(t, seven, eq, 60)
	checkCompatible(t, m, seven, eq, gaps)

	var ie *InputError
	if _, err := m.Equilibrium(lc, &EquilibriumOptions{Gaps: map[string]float64{"nope": 1e-6}}); !errors.As(err, &ie) || ie.Field != `opt.Gaps["nope"]` {
		t.Errorf("unknown label: %v", err)
	}
	if _, err := m.Equilibrium(lc, &EquilibriumOptions{Gaps: map[string]float64{"pad": math.NaN()}}); !errors.Is(err, ErrNonFinite) {
		t.Errorf("NaN gap: %v", err)
	}
	// Without the pad, pulling the body up off its seats: no equilibrium.
	m6, err := NewModel(cs, pre, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := m6.Equilibrium(LoadCase{NoPreload: true, Applied: []screw.Wrench{{F: r3.Vec{Z: 5}}}}, nil); !errors.Is(err, ErrRange) {
		t.Errorf("pulled off its seats: %v", err)
	}
}

// checkBalance checks Σ Fᵢ lᵢ + w = 0 for a load of a vertical preload P
// down through (0, 0, 20 mm), recomputed from the contacts.
func checkBalance(t *testing.T, cs []Contact, eq Equilibrium, P float64) {
	t.Helper()
	w, _ := screw.Line(r3.Vec{Z: 0.02}, r3.Vec{Z: -1})
	sum := w.Scale(P)
	for i, c := range cs {
		l, _ := screw.Line(c.Point, c.Normal)
		sum = sum.Add(l.Scale(eq.Contacts[i].Force))
	}
	if r3.Norm(sum.F) > 1e-9*P || r3.Norm(sum.M) > 1e-9*P*0.05 {
		t.Errorf("out of balance by %+v", sum)
	}
}
