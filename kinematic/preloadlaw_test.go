package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

// lawModel returns the equilateral three-vee of equilateralModel (90°
// vees) held by one element along −z through the axis with the law at the
// gap (or, for a nil law, the force and rate given), and a payload of
// 0.8 kg at the contacts' height.
func lawModel(t testing.TB, law ForceLaw, gap, force, rate float64) *Model {
	t.Helper()
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	var z float64
	for _, x := range cs {
		z += x.Point.Z / float64(len(cs))
	}
	pre := []Preload{{Name: "magnet", Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: force, Rate: rate, Law: law, Gap: gap}}
	pay := Payload{Mass: 0.8, Centre: r3.Vec{Z: z}, Inertia: [3][3]float64{{2e-3, 0, 0}, {0, 2e-3, 0}, {0, 0, 3e-3}}}
	m, err := NewModel(cs, pre, pay)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

var n42 = Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: RemanenceN42}

// TestPreloadLawAtSeat checks that an element with a law acts at the
// seat as a linear element with Force = F(gap) and Rate = −dF/dgap: the
// same contact forces, and a vertical stiffness lower by |dF/dgap|
// (springs in parallel add their stiffnesses, the magnet's being
// negative) than with a constant force; the part lifts off under a
// vertical acceleration of the base a = F/m (no gravity: the inertial
// load m·a up balances the preload F down, so every contact force is
// zero).
func TestPreloadLawAtSeat(t *testing.T) {
	law := MagnetPair{Moving: n42, Base: n42}
	const gap = 0.0006
	F, dF, err := law.Force(gap)
	if err != nil {
		t.Fatal(err)
	}
	ml := lawModel(t, law, gap, 0, 0)
	mc := lawModel(t, nil, 0, F, 0)
	lc := LoadCase{PreloadFactor: 1}
	sl, err := ml.Statics(lc)
	if err != nil {
		t.Fatal(err)
	}
	sc, _ := mc.Statics(lc)
	for i := range sl.Contacts {
		if sl.Contacts[i].Force != sc.Contacts[i].Force {
			t.Errorf("contact %d: %g N with the law, %g N with its force", i, sl.Contacts[i].Force, sc.Contacts[i].Force)
		}
	}
	kl, err := ml.Stiffness(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	kc, _ := mc.Stiffness(lc, nil)
	o := r3.Vec{}
	if got := kl.Matrix(o)[2][2] - kc.Matrix(o)[2][2]; math.Abs(got-dF) > 1e-9*kc.Matrix(o)[2][2] {
		t.Errorf("vertical stiffness changes by %g N/m; want dF/dgap = %g N/m", got, dF)
	}
	lift := lc
	lift.Acceleration = r3.Vec{Z: -F / 0.8}
	s, _ := ml.Statics(lift)
	for _, c := range s.Contacts {
		if math.Abs(c.Force) > 1e-12*F {
			t.Errorf("at a = F/m: contact %s carries %g N, want 0", c.Label, c.Force)
		}
	}
}

// TestRunaway checks the runaway level along the lift: with a constant
// force or a magnet (force falling as the part lifts) the part lets go
// where the first contact opens (Runaway = Unload, the closed form
// f₀/Gain of TestShockClosedForm); with a compression spring (Rate < 0:
// its force grows as the part lifts) it is held at any level (+Inf); with
// a table that rises to a peak Fp before falling, the single central
// element sets every contact's force in proportion to its own, so the
// lift can carry at most Fp/F₀ times the seated force: Runaway =
// Unload·Fp/F₀ (worked by hand from hᵢ(q) = Pᵢ F(gap + q Pᵢ)).
func TestRunaway(t *testing.T) {
	lc := LoadCase{PreloadFactor: 1}
	const a = 10.0
	shock := func(m *Model) Shock {
		t.Helper()
		s, err := m.Shock(lc, a)
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	law := MagnetPair{Moving: n42, Base: n42}
	F, _, _ := law.Force(0.0006)
	sc := shock(lawModel(t, nil, 0, F, 0))
	if sc.Runaway != sc.Unload {
		t.Errorf("constant force: runaway %g, unload %g m/s²", sc.Runaway, sc.Unload)
	}
	sm := shock(lawModel(t, law, 0.0006, 0, 0))
	if sm.Runaway != sm.Unload || math.Abs(sm.Unload/sc.Unload-1) > 1e-12 {
		t.Errorf("magnet: runaway %g, unload %g m/s²; constant force unloads at %g", sm.Runaway, sm.Unload, sc.Unload)
	}
	ss := shock(lawModel(t, nil, 0, F, -2e4))
	if !math.IsInf(ss.Runaway, 1) || ss.Unload != sc.Unload {
		t.Errorf("compression spring: runaway %g, unload %g m/s²", ss.Runaway, ss.Unload)
	}
	tb, err := NewForceTable([]TablePoint{{0, 20}, {0.001, 30}, {0.002, 45}, {0.003, 30}, {0.006, 5}})
	if err != nil {
		t.Fatal(err)
	}
	st := shock(lawModel(t, tb, 0.001, 0, 0))
	if want := st.Unload * 45 / 30; math.Abs(st.Runaway/want-1) > 1e-9 {
		t.Errorf("peaked table: runaway %.12g, want Unload·45/30 = %.12g m/s²", st.Runaway, want)
	}
}

// TestSizePreloadGaps checks the gap window of a magnet: the window's
// forces are the common scales times the seated force, and the law at
// the window's gaps gives its forces (the magnet's force falls with the
// gap, so the smallest gap gives the largest force).
func TestSizePreloadGaps(t *testing.T) {
	law := MagnetPair{Moving: n42, Base: n42}
	m := lawModel(t, law, 0.0006, 0, 0)
	cases := []LoadCase{{Name: "up", Gravity: r3.Vec{Z: -StandardGravity}}, {Name: "down", Gravity: r3.Vec{Z: StandardGravity}}}
	sz, err := m.SizePreload(cases, 2)
	if err != nil {
		t.Fatal(err)
	}
	F, _, _ := law.Force(0.0006)
	w := sz.Gaps[0]
	if !w.Met || math.Abs(w.MinForce-sz.MinScale*F) > 1e-12*F {
		t.Fatalf("window %+v, MinScale %g, F %g", w, sz.MinScale, F)
	}
	if f, _, _ := law.Force(w.MaxGap); math.Abs(f/w.MinForce-1) > 1e-9 {
		t.Errorf("at MaxGap %g m the force is %g N, want MinForce %g N", w.MaxGap, f, w.MinForce)
	}
	if !(w.MinGap < 0.0006 || w.MinGap == 0) || !(w.MaxGap > 0.0006) {
		t.Errorf("seated gap 0.6 mm outside the window %g–%g m", w.MinGap, w.MaxGap)
	}
	if math.IsInf(sz.MaxScale, 1) != math.IsInf(w.MaxForce, 1) {
		t.Errorf("MaxScale %g, MaxForce %g", sz.MaxScale, w.MaxForce)
	}
}

// TestPreloadLawErrors checks the fields named for bad laws and gaps.
func TestPreloadLawErrors(t *testing.T) {
	c, _ := BisectorVees(equilateral(), three(vee45))
	cs := mustContacts(t, c)
	law := MagnetPair{Moving: n42, Base: n42}
	for _, tc := range []struct {
		p     Preload
		field string
		want  error
	}{
		{Preload{Direction: r3.Vec{Z: -1}, Law: law, Gap: 0.001, Force: 3}, "preloads[0].Force", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: law, Gap: 0.001, Rate: 3}, "preloads[0].Rate", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Force: 3, Gap: 0.001}, "preloads[0].Gap", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: law, Gap: -1}, "preloads[0].Gap", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: law, Gap: math.NaN()}, "preloads[0].Gap", ErrNonFinite},
		{Preload{Direction: r3.Vec{Z: -1}, Law: law}, "preloads[0].Gap", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: MagnetPair{Moving: n42}, Gap: 0.001}, "preloads[0].Law.Base.Size[0]", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: &ForceTable{Points: []TablePoint{{0, 1}, {0.001, -1}}}}, "preloads[0].Law.Points[1].Force", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: MagnetPair{Moving: n42, Base: n42, Offset: [2]float64{0.02, 0}}, Gap: 0.001}, "preloads[0].Gap", ErrRange},
		{Preload{Law: law, Gap: 0.001}, "preloads[0].Direction", ErrDegenerate},
		// Millimetres given as metres: a 12 m magnet, a 0.6 m gap.
		{Preload{Direction: r3.Vec{Z: -1}, Law: MagnetPair{Moving: Magnet{Size: [3]float64{12, 12, 4}, Remanence: 1.3}, Base: n42}, Gap: 0.0006}, "preloads[0].Law", ErrRange},
		{Preload{Direction: r3.Vec{Z: -1}, Law: law, Gap: 0.6}, "preloads[0].Gap", ErrRange},
	} {
		_, err := NewModel(cs, []Preload{tc.p}, Payload{})
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.want) {
			t.Errorf("%+v: %v; want %s wrapping %v", tc.p, err, tc.field, tc.want)
		}
	}
}

// BenchmarkShockLaw is Model.Shock of the three-vee held by a magnet pair
// (the runaway search along the lift: a grid and a golden-section
// refinement per contact) and by a linear element of the same force.
func BenchmarkShockLaw(b *testing.B) {
	law := MagnetPair{Moving: n42, Base: n42}
	F, _, _ := law.Force(0.0006)
	for _, c := range []struct {
		name string
		m    *Model
	}{{"magnet", lawModel(b, law, 0.0006, 0, 0)}, {"linear", lawModel(b, nil, 0, F, 0)}} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := c.m.Shock(LoadCase{PreloadFactor: 1}, 10); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// FuzzRunaway builds the three-vee held by a force table of arbitrary
// points at an arbitrary gap and preload factor and checks that NewModel
// refuses it with a named field or that Shock gives a runaway level that
// is not NaN and not below the level at which the first contact opens.
// The bytes are float64s: gap, preload factor, payload mass, then pairs
// of gap and force.
func FuzzRunaway(f *testing.F) {
	f.Add(fuzzdata.Append(nil, 0.001, 1, 0.8, 0, 20, 0.001, 30, 0.002, 45, 0.003, 30, 0.006, 5))
	f.Add(fuzzdata.Append(nil, 0.0005, 2, 0.1, 0, 40, 0.001, 24, 0.004, 4))
	f.Add(fuzzdata.Append(nil, 0, -1, 1e-300, 0, 1e300, 1e-300, 0))
	f.Add(fuzzdata.Append(nil, math.NaN(), 1, 1, 0, 1, 1, -1))
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		f.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 1)
		if len(xs) < 5 || len(xs) > 67 {
			return
		}
		v := make([]float64, len(xs))
		for i := range xs {
			v[i] = xs[i][0]
		}
		tb := &ForceTable{}
		for i := 3; i+1 < len(v); i += 2 {
			tb.Points = append(tb.Points, TablePoint{Gap: v[i], Force: v[i+1]})
		}
		pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Law: tb, Gap: v[0]}}
		m, err := NewModel(cs, pre, Payload{Mass: v[2], Centre: r3.Vec{Z: 0.01}})
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error without a field: %v", err)
			}
			return
		}
		sh, err := m.Shock(LoadCase{PreloadFactor: v[1]}, 9.8)
		if err != nil {
			return
		}
		if math.IsNaN(sh.Runaway) || sh.Runaway < sh.Unload {
			t.Fatalf("runaway %g, unload %g", sh.Runaway, sh.Unload)
		}
	})
}
