package hertz

import (
	"errors"
	"math"
	"testing"
)

// FuzzSolve checks Solve on arbitrary bodies and loads: no panic; an error
// is an *InputError wrapping a sentinel and comes with a zero Contact;
// every result without an error is finite and positive with a ≥ b,
// p0 = 3F/(2πab), δ and stiffness consistent, and finite non-negative
// stresses. It also runs the prepared path on the same input (see
// checkPair): NewPair, Pair.Contact, Pair.Solve and the inverse problems.
func FuzzSolve(f *testing.F) {
	f.Add(0.005, 0.005, 0.0, 208e9, 0.3, math.Inf(1), math.Inf(1), 0.0, 200e9, 0.28, 100.0)
	f.Add(0.005, 0.005, 0.0, 208e9, 0.3, math.Inf(1), -0.0052, 0.3, 200e9, 0.28, 21.2)
	f.Add(math.Inf(1), 0.003, 0.0, 310e9, 0.27, math.Inf(1), 0.004, 1.5707963267948966, 113.8e9, 0.342, 5.0)
	f.Add(0.003, 0.003, 0.0, 620e9, 0.22, 0.02, -0.0031, 2.5, 208e9, 0.3, 40.0)
	f.Add(0.005, 0.005, 0.0, math.Inf(1), 0.3, -0.0055, -0.0055, 0.0, 72.7e9, 0.16, 1.0)
	f.Add(5.0, 0.005, 0.0, 208e9, -0.9, math.Inf(1), math.Inf(1), 0.0, 1e9, 0.5, 1e-6)
	f.Add(0.005, 0.005, 0.0, 208e9, 0.3, -0.0049, -0.0049, 0.0, 200e9, 0.28, 1.0)
	// Moduli in GPa and MPa written as Pa (refused), and the smallest accepted.
	f.Add(0.003, 0.003, 0.0, 208.0, 0.3, math.Inf(1), math.Inf(1), 0.0, 200e9, 0.28, 10.0)
	f.Add(0.003, 0.003, 0.0, 208e9, 0.3, math.Inf(1), math.Inf(1), 0.0, 210000.0, 0.28, 10.0)
	f.Add(0.003, 0.003, 0.0, 1e6, 0.3, math.Inf(1), math.Inf(1), 0.0, 1e6, 0.28, 10.0)
	f.Fuzz(func(t *testing.T, r11, r12, ang1, e1, nu1, r21, r22, ang2, e2, nu2, load float64) {
		b1 := Body{R1: r11, R2: r12, Angle: ang1, Material: Material{Name: "one", E: e1, Nu: nu1}}
		b2 := Body{R1: r21, R2: r22, Angle: ang2, Material: Material{Name: "two", E: e2, Nu: nu2}}
		c, err := Solve(b1, b2, load)
		checkPair(t, b1, b2, load, c, err)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error %v is not an *InputError with a field", err)
			}
			if !errors.Is(err, ErrNonFinite) && !errors.Is(err, ErrRange) && !errors.Is(err, ErrDegenerate) {
				t.Fatalf("error %v wraps no sentinel", err)
			}
			if c != (Contact{}) {
				t.Fatalf("error %v with a non-zero Contact", err)
			}
			return
		}
		vals := []float64{c.SemiMajor, c.SemiMinor, c.MajorAngle, c.PeakPressure, c.MeanPressure, c.Approach,
			c.Stiffness, c.EStar, c.GStar, c.A, c.B}
		for _, s := range c.Stress {
			vals = append(vals, s.MaxShear, s.MaxShearDepth, s.MaxVonMises, s.MaxVonMisesDepth)
		}
		for i, v := range vals {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				t.Fatalf("value %d = %v not finite and ≥ 0: %+v", i, v, c)
			}
		}
		if !(c.EStar > 0 && c.GStar > 0 && c.A > 0 && c.B >= c.A && c.MajorAngle < math.Pi) {
			t.Fatalf("bad shape data: %+v", c)
		}
		if load == 0 {
			return
		}
		if !(c.SemiMinor > 0 && c.SemiMajor >= c.SemiMinor && c.PeakPressure > 0 && c.Approach > 0 && c.Stiffness > 0) {
			t.Fatalf("not positive with a ≥ b: %+v", c)
		}
		if p0 := 3 * load / (2 * math.Pi * c.SemiMajor * c.SemiMinor); relDiff(c.PeakPressure, p0) > 1e-12 {
			t.Fatalf("p0 = %v, 3F/(2πab) = %v", c.PeakPressure, p0)
		}
		if relDiff(c.Stiffness, 1.5*load/c.Approach) > 1e-12 {
			t.Fatalf("stiffness %v, 3F/(2δ) = %v", c.Stiffness, 1.5*load/c.Approach)
		}
		for _, s := range c.Stress {
			if !(s.MaxShear > 0 && s.MaxVonMises >= s.MaxShear) {
				t.Fatalf("stresses %+v: want 0 < τmax ≤ σvM", s)
			}
		}
	})
}

// checkPair checks the prepared path against Solve's result c, err for the
// same input: NewPair fails exactly when Solve fails on the bodies, with
// the same error; Pair.Solve gives Solve's result; Pair.Contact agrees with
// Solve on every field but Stress (zero), and fails only where Solve does,
// Solve failing alone only on stresses out of range; and the inverse
// problems, when they answer, recover the load to 1e-12.
func checkPair(t *testing.T, b1, b2 Body, load float64, c Contact, err error) {
	t.Helper()
	p, perr := NewPair(b1, b2)
	if perr != nil {
		if err == nil || err.Error() != perr.Error() {
			t.Fatalf("NewPair: %v; Solve: %v", perr, err)
		}
		return
	}
	ps, pserr := p.Solve(load)
	if ps != c || (pserr == nil) != (err == nil) || (err != nil && pserr.Error() != err.Error()) {
		t.Fatalf("Pair.Solve = %+v, %v; Solve %+v, %v", ps, pserr, c, err)
	}
	pc, pcerr := p.Contact(load)
	if pcerr != nil {
		if err == nil || pc != (Contact{}) {
			t.Fatalf("Pair.Contact: %+v, %v; Solve succeeded: %+v", pc, pcerr, c)
		}
		return
	}
	if pc.Stress != ([2]Subsurface{}) {
		t.Fatalf("Pair.Contact sets Stress: %+v", pc.Stress)
	}
	if err != nil {
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != "load" || !errors.Is(err, ErrRange) {
			t.Fatalf("Solve fails (%v) where Pair.Contact succeeds: %+v", err, pc)
		}
		return
	}
	c.Stress = [2]Subsurface{}
	if pc != c {
		t.Fatalf("Pair.Contact = %+v; Solve without stresses %+v", pc, c)
	}
	if load == 0 {
		return
	}
	for _, inv := range []struct {
		name, field string
		f           func(float64) (float64, error)
		x           float64
	}{
		{"LoadForPressure", "p0", p.LoadForPressure, c.PeakPressure},
		{"LoadForApproach", "delta", p.LoadForApproach, c.Approach},
	} {
		F, err := inv.f(inv.x)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field != inv.field || !errors.Is(err, ErrRange) || F != 0 {
				t.Fatalf("%s(%g) = %v, %v", inv.name, inv.x, F, err)
			}
			continue
		}
		if relDiff(F, load) > 1e-12 {
			t.Fatalf("%s(%g) = %.17g, want the load %.17g", inv.name, inv.x, F, load)
		}
	}
}
