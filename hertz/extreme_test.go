package hertz

import (
	"errors"
	"math"
	"math/big"
	"testing"
)

// oneMinusSquare returns 1 − ν² for the float64 ν exactly (math/big at 200
// bits), rounded once: a reference free of the cancellation near ν = −1.
func oneMinusSquare(nu float64) float64 {
	x := new(big.Float).SetPrec(200).SetFloat64(nu)
	x.Mul(x, x)
	x.Sub(new(big.Float).SetPrec(200).SetInt64(1), x)
	f, _ := x.Float64()
	return f
}

// TestExtremeInputsWork checks inputs at the ends of the float64 range that
// have a representable answer: a ball on a flat against Hertz's closed
// forms (Johnson 1985, §4.2, eqs. 4.22–4.23: a³ = 3FR/(4E*),
// p0 = 3F/(2πa²), δ = a²/R), evaluated as cbrt(0.75R/E*)·cbrt(F) so that
// nothing overflows; and E* = E/(2(1 − ν²)) for equal materials at ν = 0.5
// and near ν = −1, with 1 − ν² exact (math/big).
func TestExtremeInputsWork(t *testing.T) {
	steel := Steel52100
	cases := []struct {
		name string
		R, F float64
		m    Material
	}{
		{"load 1e-300 N", 0.005, 1e-300, steel},
		{"load 1e-307 N, near the smallest normal float64", 0.005, 1e-307, steel},
		{"load 1e100 N on R = 1e300 m (a³ overflows, a does not)", 1e300, 1e100, steel},
		{"radius 1e308 m (subnormal curvature)", 1e308, 1, steel},
		{"radius 1.7976931348623157e308 m", math.MaxFloat64, 1, steel},
		{"E = 1e4 Pa, the smallest accepted", 0.005, 1, Material{E: 1e4, Nu: 0.3}},
		{"ν = 0.5", 0.005, 10, Material{E: 1e9, Nu: 0.5}},
		{"ν = −0.999", 0.005, 10, Material{E: 1e9, Nu: -0.999}},
		{"ν = −1 + 2⁻⁵³", 0.005, 10, Material{E: 1e9, Nu: math.Nextafter(-1, 0)}},
		{"E = 1e300 Pa, ν = −0.999", 0.005, 1e30, Material{E: 1e300, Nu: -0.999}},
	}
	for _, c := range cases {
		p, err := NewPair(Sphere(c.R, c.m), Flat(c.m))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		got, err := p.Solve(c.F)
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		es := c.m.E / (2 * oneMinusSquare(c.m.Nu))
		a := math.Cbrt(0.75*c.R/es) * math.Cbrt(c.F)
		for _, q := range []struct {
			what      string
			got, want float64
		}{
			{"E*", got.EStar, es},
			{"a", got.SemiMajor, a},
			{"b", got.SemiMinor, a},
			{"p0", got.PeakPressure, 3 * c.F / (2 * math.Pi * a * a)},
			{"δ", got.Approach, a * (a / c.R)},
			{"stiffness", got.Stiffness, 1.5 * c.F / (a * (a / c.R))},
		} {
			if d := relDiff(q.got, q.want); !(d <= 1e-13) {
				t.Errorf("%s: %s = %.16g, want %.16g (rel %.2g)", c.name, q.what, q.got, q.want, d)
			}
		}
		for i, s := range got.Stress {
			if !(s.MaxShear > 0 && s.MaxVonMises >= s.MaxShear && s.MaxShearDepth >= 0) || math.IsInf(s.MaxVonMises, 0) {
				t.Errorf("%s: Stress[%d] = %+v", c.name, i, s)
			}
		}
		if fp, err := p.LoadForPressure(got.PeakPressure); err != nil || relDiff(fp, c.F) > 1e-13 {
			t.Errorf("%s: LoadForPressure(p0) = %.16g, %v; want %g", c.name, fp, err, c.F)
		}
		if fa, err := p.LoadForApproach(got.Approach); err != nil || relDiff(fa, c.F) > 1e-13 {
			t.Errorf("%s: LoadForApproach(δ) = %.16g, %v; want %g", c.name, fa, err, c.F)
		}
	}
}

// TestHugeAngle checks an angle whose double overflows: turning both
// bodies by the same angle changes nothing but MajorAngle (the frame
// independence of TestRotation), here for θ = MaxFloat64 and −1e308.
func TestHugeAngle(t *testing.T) {
	s := Steel52100
	want, err := Solve(Toroid(0.005, 0.05, 0, s), Groove(0.2, 0, s), 20)
	if err != nil {
		t.Fatal(err)
	}
	for _, th := range []float64{math.MaxFloat64, -1e308} {
		got, err := Solve(Toroid(0.005, 0.05, th, s), Groove(0.2, th, s), 20)
		if err != nil {
			t.Errorf("θ = %g: %v", th, err)
			continue
		}
		got.MajorAngle = want.MajorAngle
		for _, q := range [][2]float64{{got.SemiMajor, want.SemiMajor}, {got.SemiMinor, want.SemiMinor}, {got.A, want.A}, {got.B, want.B}} {
			if relDiff(q[0], q[1]) > 1e-13 {
				t.Errorf("θ = %g: %+v, want %+v", th, got, want)
				break
			}
		}
	}
}

// TestExtremeInputErrors checks inputs at the ends of the float64 range
// that have no representable or precise answer: each gives an *InputError
// naming the field, with the right sentinel and a zero result.
func TestExtremeInputErrors(t *testing.T) {
	s := Steel52100
	ball, flat := Sphere(0.005, s), Flat(s)
	pair, err := NewPair(ball, flat)
	if err != nil {
		t.Fatal(err)
	}
	light, err := pair.Contact(1e-10)
	if err != nil {
		t.Fatal(err)
	}
	heavy, err := pair.Contact(1e10)
	if err != nil {
		t.Fatal(err)
	}
	solve := func(b1, b2 Body, F float64) func() (bool, error) {
		return func() (bool, error) { c, err := Solve(b1, b2, F); return c == Contact{}, err }
	}
	value := func(f func(float64) (float64, error), x float64) func() (bool, error) {
		return func() (bool, error) { v, err := f(x); return v == 0, err }
	}
	cases := []struct {
		name  string
		call  func() (zero bool, err error)
		field string
		kind  error
	}{
		{"radius 5e-324 m", solve(Sphere(5e-324, s), flat, 1), "b1.R1", ErrRange},
		{"radius −5e-324 m", solve(ball, Socket(5e-324, s), 1), "b2.R1", ErrRange},
		{"radius 1e-308 m: curvatures overflow", solve(Sphere(1e-308, s), flat, 1), "b1, b2", ErrRange},
		{"E = 5e-324 Pa", solve(Sphere(0.005, Material{E: 5e-324, Nu: 0.3}), flat, 1), "b1.Material.E", ErrRange},
		{"E = 5e-324 Pa, ν = 0.5", solve(ball, Flat(Material{E: 5e-324, Nu: 0.5}), 1), "b2.Material.E", ErrRange},
		{"E = 1e-307 Pa both (E* would be subnormal): refused below 1e4 Pa", solve(Sphere(0.005, Material{E: 1e-307, Nu: 0.3}), Flat(Material{E: 1e-307, Nu: 0.3}), 1), "b1.Material.E", ErrRange},
		{"E = MaxFloat64 both: a³/F underflows", solve(Sphere(0.005, Material{E: math.MaxFloat64, Nu: 0}), Flat(Material{E: math.MaxFloat64, Nu: 0}), 1), "b1, b2", ErrRange},
		{"E = 1e308 both, ν = −1 + 1e-16: G* overflows", solve(Sphere(0.005, Material{E: 1e308, Nu: -1 + 1e-16}), Flat(Material{E: 1e308, Nu: -1 + 1e-16}), 1), "b1.Material, b2.Material", ErrRange},
		{"ν = −1", solve(Sphere(0.005, Material{E: 1e9, Nu: -1}), flat, 1), "b1.Material.Nu", ErrRange},
		{"ν = 0.5 + 2⁻⁵³", solve(ball, Flat(Material{E: 1e9, Nu: math.Nextafter(0.5, 1)}), 1), "b2.Material.Nu", ErrRange},
		{"load 5e-324 N", solve(ball, flat, 5e-324), "load", ErrRange},
		{"load 1e-310 N", solve(ball, flat, 1e-310), "load", ErrRange},
		{"load 1e308 N", solve(ball, flat, 1e308), "load", ErrRange},
		{"load MaxFloat64", solve(ball, flat, math.MaxFloat64), "load", ErrRange},
		{"load 1e-307 N on R = 1e300 m: δ underflows", solve(Sphere(1e300, s), flat, 1e-307), "load", ErrRange},
		{"Pair.Contact(5e-324)", func() (bool, error) { c, err := pair.Contact(5e-324); return c == Contact{}, err }, "load", ErrRange},
		{"p0 1e-300 Pa: load underflows", value(pair.LoadForPressure, 1e-300), "p0", ErrRange},
		{"p0 5e-324 Pa", value(pair.LoadForPressure, 5e-324), "p0", ErrRange},
		{"p0 1e300 Pa: load overflows", value(pair.LoadForPressure, 1e300), "p0", ErrRange},
		{"δ 1e-300 m: load underflows", value(pair.LoadForApproach, 1e-300), "delta", ErrRange},
		{"δ MaxFloat64: load overflows", value(pair.LoadForApproach, math.MaxFloat64), "delta", ErrRange},
		{"μN underflows", value(light.SlidingLimit, 1e-300), "mu", ErrRange},
		{"μN overflows", value(heavy.SlidingLimit, 1e300), "mu", ErrRange},
		{"tangential, μN underflows", func() (bool, error) { k, err := light.TangentialStiffness(1e-300, 0); return k == 0, err }, "mu", ErrRange},
	}
	// R = 1e300 m, E* = E/(2(1 − 0.09)) = 7.5e-9 Pa, F = 1.157e-305 N:
	// a³ = 3FR/(4E*) = 1157 m³, a ≈ 10.5 m, δ = a²/R ≈ 1.1e-298 m,
	// p0 = 3F/(2πa²) ≈ 5e-308 Pa and the mean pressure 2p0/3 are normal
	// float64 numbers; the largest shear stress, about 0.31 p0 (Johnson
	// 1985, §3.4), is not. That case needs a modulus of 1.365e-8 Pa, which
	// is now refused as below 1e4 Pa (a modulus in GPa written as Pa)
	// before any stress is computed.
	soft := Material{E: 1.365e-8, Nu: 0.3}
	big := func() (bool, error) {
		c, err := Solve(Sphere(1e300, soft), Flat(soft), 1.157e-305)
		return c == Contact{}, err
	}
	cases = append(cases, struct {
		name  string
		call  func() (zero bool, err error)
		field string
		kind  error
	}{"stresses would underflow: E = 1.365e-8 Pa refused", big, "b1.Material.E", ErrRange})
	for _, c := range cases {
		zero, err := c.call()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.kind) || !zero {
			t.Errorf("%s: %v (zero result %v); want an *InputError for %q wrapping %v", c.name, err, zero, c.field, c.kind)
		}
	}
}
