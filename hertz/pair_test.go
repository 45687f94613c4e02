package hertz

import (
	"errors"
	"math"
	"testing"
)

// TestPairMatchesSolve checks that the prepared path gives the package-level
// results exactly: Pair.Solve is Solve, Pair.Contact is Solve with Stress
// zero, and the inverse problems agree, for every kind of pair and a range
// of loads (the independent checks of those results are in the other
// tests; this one guards the identity of the two paths).
func TestPairMatchesSolve(t *testing.T) {
	for _, c := range pairs() {
		p, err := NewPair(c.b1, c.b2)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		for _, F := range []float64{0, 1e-6, 0.3, 37, 2e4} {
			want, err := Solve(c.b1, c.b2, F)
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			got, err := p.Solve(F)
			if err != nil || got != want {
				t.Errorf("%s, %g N: Pair.Solve = %+v, %v; Solve %+v", c.name, F, got, err, want)
			}
			got, err = p.Contact(F)
			want.Stress = [2]Subsurface{}
			if err != nil || got != want {
				t.Errorf("%s, %g N: Pair.Contact = %+v, %v; Solve without stresses %+v", c.name, F, got, err, want)
			}
		}
		for _, x := range []float64{0, 1e8, 2e9} {
			fp, err1 := p.LoadForPressure(x)
			wp, err2 := LoadForPressure(c.b1, c.b2, x)
			if fp != wp || err1 != nil || err2 != nil {
				t.Errorf("%s: LoadForPressure(%g) = %v, %v; package-level %v, %v", c.name, x, fp, err1, wp, err2)
			}
			fa, err1 := p.LoadForApproach(x * 1e-15)
			wa, err2 := LoadForApproach(c.b1, c.b2, x*1e-15)
			if fa != wa || err1 != nil || err2 != nil {
				t.Errorf("%s: LoadForApproach(%g) = %v, %v; package-level %v, %v", c.name, x*1e-15, fa, err1, wa, err2)
			}
		}
	}
}

// TestZeroPair checks that the zero Pair neither panics nor answers: every
// method returns an *InputError for "p" wrapping ErrDegenerate, and zero.
func TestZeroPair(t *testing.T) {
	var p Pair
	check := func(what string, zero bool, err error) {
		t.Helper()
		var ie *InputError
		if !errors.Is(err, ErrDegenerate) || !errors.As(err, &ie) || ie.Field != "p" || !zero {
			t.Errorf("%s on the zero Pair: %v, want an *InputError for p wrapping ErrDegenerate and a zero result", what, err)
		}
	}
	c, err := p.Contact(1)
	check("Contact", c == Contact{}, err)
	c, err = p.Solve(1)
	check("Solve", c == Contact{}, err)
	F, err := p.LoadForPressure(1e9)
	check("LoadForPressure", F == 0, err)
	F, err = p.LoadForApproach(1e-6)
	check("LoadForApproach", F == 0, err)
}

// TestPairErrors checks the Pair methods' own arguments and that NewPair
// reports what Solve reports for the bodies.
func TestPairErrors(t *testing.T) {
	p, err := NewPair(Sphere(0.005, Steel52100), Flat(Steel52100))
	if err != nil {
		t.Fatal(err)
	}
	for _, x := range []struct {
		v    float64
		kind error
	}{{-1, ErrRange}, {math.NaN(), ErrNonFinite}, {math.Inf(1), ErrNonFinite}, {math.Inf(-1), ErrNonFinite}} {
		for _, m := range []struct {
			name, field string
			f           func(float64) (float64, error)
		}{
			{"Contact", "load", func(v float64) (float64, error) { c, err := p.Contact(v); return c.Load, err }},
			{"Solve", "load", func(v float64) (float64, error) { c, err := p.Solve(v); return c.Load, err }},
			{"LoadForPressure", "p0", p.LoadForPressure},
			{"LoadForApproach", "delta", p.LoadForApproach},
		} {
			got, err := m.f(x.v)
			var ie *InputError
			if !errors.Is(err, x.kind) || !errors.As(err, &ie) || ie.Field != m.field || got != 0 {
				t.Errorf("Pair.%s(%v) = %v, %v; want %v on %s", m.name, x.v, got, err, x.kind, m.field)
			}
		}
	}
	_, err1 := NewPair(Cylinder(0.005, 0, Steel52100), Flat(Steel52100))
	_, err2 := Solve(Cylinder(0.005, 0, Steel52100), Flat(Steel52100), 1)
	if !errors.Is(err1, ErrLineContact) || err1.Error() != err2.Error() {
		t.Errorf("NewPair: %v; Solve: %v", err1, err2)
	}
}

// TestPairAllocs checks that the prepared path allocates nothing per call
// (ARCHITECTURE.md: hot paths allocate nothing once set up).
func TestPairAllocs(t *testing.T) {
	b1, b2 := Toroid(0.05, 0.005, 0.3, Steel52100), Groove(0.2, 1, FusedSilica)
	p, err := NewPair(b1, b2)
	if err != nil {
		t.Fatal(err)
	}
	var sink float64
	for _, f := range []struct {
		name string
		f    func()
	}{
		{"NewPair", func() { q, _ := NewPair(b1, b2); sink += q.a3 }},
		{"Contact", func() { c, _ := p.Contact(12); sink += c.Approach }},
		{"Solve", func() { c, _ := p.Solve(12); sink += c.Stress[1].MaxShear }},
		{"LoadForPressure", func() { F, _ := p.LoadForPressure(1e9); sink += F }},
		{"LoadForApproach", func() { F, _ := p.LoadForApproach(1e-6); sink += F }},
	} {
		if n := testing.AllocsPerRun(100, f.f); n != 0 {
			t.Errorf("%s: %v allocations per call, want 0", f.name, n)
		}
	}
	if !(sink > 0) {
		t.Errorf("results not positive: %v", sink)
	}
}
