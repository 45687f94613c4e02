package hertz

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

// slipContact returns a circular steel-on-steel contact (a 4 mm radius
// ball on a flat under 60 N) and its G*, computed here from the materials.
func slipContact(t *testing.T) (Contact, float64) {
	t.Helper()
	c, err := Solve(Sphere(0.004, Steel52100), Flat(Steel52100), 60)
	if err != nil {
		t.Fatal(err)
	}
	return c, gstar(Steel52100, Steel52100)
}

// johnsonLoading is the tangential displacement on first loading to Q,
// δ = 3μP/(16G*a)[1 − (1 − Q/μP)^(2/3)] (Mindlin 1949; Johnson, Contact
// Mechanics, 1985, §7.2, eq. 7.48 — equation number from memory).
func johnsonLoading(mu, P, G, a, Q float64) float64 {
	return 3 * mu * P / (16 * G * a) * (1 - math.Pow(1-Q/(mu*P), 2.0/3))
}

// johnsonUnloading is the displacement on unloading from Q* to Q,
// δ = 3μP/(16G*a)[2(1 − (Q* − Q)/(2μP))^(2/3) − (1 − Q*/μP)^(2/3) − 1]
// (Mindlin & Deresiewicz 1953; Johnson 1985, §7.4, eq. 7.61 — equation
// number from memory); reloading from −Q* is its mirror,
// δ(Q) = −johnsonUnloading(−Q).
func johnsonUnloading(mu, P, G, a, Qs, Q float64) float64 {
	return 3 * mu * P / (16 * G * a) * (2*math.Pow(1-(Qs-Q)/(2*mu*P), 2.0/3) - math.Pow(1-Qs/(mu*P), 2.0/3) - 1)
}

func TestSlipLoadingUnloadingJohnson(t *testing.T) {
	c, G := slipContact(t)
	const mu = 0.12
	P, a := c.Load, c.SemiMajor
	s, err := c.Slip(mu)
	if err != nil {
		t.Fatal(err)
	}
	if k := s.Stiffness(); relDiff(k, 8*G*a) > 1e-13 {
		t.Errorf("virgin stiffness %v, want 8G*a = %v (Johnson 1985, §7.2)", k, 8*G*a)
	}
	// First loading to Q* = 0.7 μP.
	Qs := 0.7 * mu * P
	for _, f := range []float64{0.1, 0.4, 0.7} {
		d, err := s.Step(f * mu * P)
		if want := johnsonLoading(mu, P, G, a, f*mu*P); err != nil || relDiff(d, want) > 1e-12 {
			t.Errorf("loading Q = %g μP: δ = %v, %v; want %v", f, d, err, want)
		}
	}
	// Unloading to −Q*.
	for _, f := range []float64{0.5, 0, -0.3, -0.7} {
		d, err := s.Step(f * mu * P)
		if want := johnsonUnloading(mu, P, G, a, Qs, f*mu*P); err != nil || math.Abs(d-want) > 1e-12*johnsonLoading(mu, P, G, a, Qs) {
			t.Errorf("unloading Q = %g μP: δ = %v, %v; want %v", f, d, err, want)
		}
	}
	// At −Q* the first branch meets the loading curve at the mirror point.
	if d := s.Displacement(); relDiff(d, -johnsonLoading(mu, P, G, a, Qs)) > 1e-12 {
		t.Errorf("at −Q*: δ = %v, want %v", d, -johnsonLoading(mu, P, G, a, Qs))
	}
	// Reloading from −Q* back to Q* closes the loop.
	for _, f := range []float64{-0.2, 0.3, 0.7} {
		d, err := s.Step(f * mu * P)
		if want := -johnsonUnloading(mu, P, G, a, Qs, -f*mu*P); err != nil || math.Abs(d-want) > 1e-12*johnsonLoading(mu, P, G, a, Qs) {
			t.Errorf("reloading Q = %g μP: δ = %v, %v; want %v", f, d, err, want)
		}
	}
	// Beyond Q*, after the closed loop, the path is the loading curve
	// again (Masing's memory rule, package internal/masing).
	if d, err := s.Step(0.9 * mu * P); err != nil || relDiff(d, johnsonLoading(mu, P, G, a, 0.9*mu*P)) > 1e-12 {
		t.Errorf("after the loop, Q = 0.9 μP: δ = %v, %v; want %v", d, err, johnsonLoading(mu, P, G, a, 0.9*mu*P))
	}
	// On the branch from the reversal at 0.9 μP the tangent stiffness is
	// the derivative of the unloading curve, by hand
	// dQ/dδ = 8G*a (1 − (Q* − Q)/(2μP))^(1/3): 8G*a at the reversal.
	s.Step(0.85 * mu * P)
	if k, want := s.Stiffness(), 8*G*a*math.Cbrt(1-0.05/2); relDiff(k, want) > 1e-13 {
		t.Errorf("stiffness after a reversal %v, want %v", k, want)
	}
}

// TestSlipInnerLoop checks the memory of an inner loop: 0 → 0.6 → 0.2 →
// 0.6 μP ends where the loading curve is, and the displacement at 0.2 on
// the way down is the unloading curve from 0.6 (Johnson 1985, §7.4).
func TestSlipInnerLoop(t *testing.T) {
	c, G := slipContact(t)
	const mu = 0.3
	P, a := c.Load, c.SemiMajor
	s, err := c.Slip(mu)
	if err != nil {
		t.Fatal(err)
	}
	q := func(f float64) float64 { return f * mu * P }
	s.Step(q(0.6))
	d, _ := s.Step(q(0.2))
	if want := johnsonUnloading(mu, P, G, a, q(0.6), q(0.2)); relDiff(d, want) > 1e-12 {
		t.Errorf("inner unloading δ = %v, want %v", d, want)
	}
	s.Step(q(0.4))
	s.Step(q(0.25))
	d, _ = s.Step(q(0.6))
	if want := johnsonLoading(mu, P, G, a, q(0.6)); relDiff(d, want) > 1e-12 {
		t.Errorf("inner loops closed at 0.6 μP: δ = %v, want %v", d, want)
	}
}

// TestSlipEnergyLoop checks SlipEnergy against the area of the loop
// between Johnson's unloading and reloading curves, integrated here by
// Gauss–Legendre quadrature in Q (W = ∫ [δ_unload(Q) − δ_reload(Q)] dQ
// over −Q* ≤ Q ≤ Q*), independently of the closed form; and at x = 1,
// where the bracket is 1 − 0 − (5/6)(1 + 0) = 1/6 by hand, W = 3μ²P²/(20G*a).
func TestSlipEnergyLoop(t *testing.T) {
	c, G := slipContact(t)
	const mu = 0.2
	P, a := c.Load, c.SemiMajor
	for _, x := range []float64{0.05, 0.3, 0.5, 0.8, 0.99} {
		Qs := x * mu * P
		// 20-point Gauss–Legendre on 64 panels; the integrand has a
		// (1 − …)^(2/3) end singularity only at x = 1.
		var area float64
		const panels = 64
		for p := range panels {
			lo := -Qs + 2*Qs*float64(p)/panels
			hi := lo + 2*Qs/panels
			for i := range gl20x {
				Q := (lo+hi)/2 + (hi-lo)/2*gl20x[i]
				area += (hi - lo) / 2 * gl20w[i] * (johnsonUnloading(mu, P, G, a, Qs, Q) + johnsonUnloading(mu, P, G, a, Qs, -Q))
			}
		}
		w, err := c.SlipEnergy(mu, Qs)
		if err != nil || relDiff(w, area) > 1e-9 {
			t.Errorf("x = %g: W = %v, %v; loop area %v", x, w, err, area)
		}
	}
	if w, err := c.SlipEnergy(mu, mu*P); err != nil || relDiff(w, 3*mu*mu*P*P/(20*G*a)) > 1e-13 {
		t.Errorf("x = 1: W = %v, %v; want %v", w, err, 3*mu*mu*P*P/(20*G*a))
	}
}

// TestSlipEnergySmall checks the small-amplitude limit. By hand, with
// (1 − x)^(5/3) = 1 − 5x/3 + 5x²/9 + 5x³/81 + O(x⁴) and
// (1 − x)^(2/3) = 1 − 2x/3 − x²/9 − 4x³/81 + O(x⁴) (binomial series),
// the bracket is 1 − (1 − 5x/3 + 5x²/9 + 5x³/81) − (5x/3 − 5x²/9 −
// 5x³/54) + O(x⁴) = 5x³(1/54 − 1/81) = 5x³/162, so
// W = 9μ²P²/(10G*a)·5x³/162 = μ²P²x³/(36G*a) (Johnson 1985, §7.4, eq. 7.64
// in its small-amplitude form — equation number from memory). The
// relative error of the limit is O(x); at x = 1e-6 the closed form would
// lose every digit to cancellation, the series keeps them.
func TestSlipEnergySmall(t *testing.T) {
	c, G := slipContact(t)
	const mu = 0.2
	P, a := c.Load, c.SemiMajor
	for _, x := range []float64{1e-9, 1e-6, 1e-3} {
		w, err := c.SlipEnergy(mu, x*mu*P)
		want := mu * mu * P * P * x * x * x / (36 * G * a)
		if err != nil || relDiff(w, want) > 2*x {
			t.Errorf("x = %g: W = %v, %v; want %v within %g", x, w, err, want, 2*x)
		}
	}
	// The series and the closed form agree where they meet.
	closed := func(x float64) float64 {
		return 1 - math.Pow(1-x, 5.0/3) - 5*x/6*(1+math.Pow(1-x, 2.0/3))
	}
	for _, x := range []float64{0.3, 0.45, 0.4999999} {
		if relDiff(slipBracket(x), closed(x)) > 1e-12 {
			t.Errorf("bracket at %g: series %v, closed form %v", x, slipBracket(x), closed(x))
		}
	}
}

// TestSlipLimits checks μ → ∞ (no slip: linear, stiffness 8G*a, no loss)
// and μ → 0 (the contact slides at once, carrying μP). The exported Slip
// and SlipEnergy refuse μ > 3 as a percentage, so μ = 1e9 goes through
// their unexported bodies, slip and slipEnergy.
func TestSlipLimits(t *testing.T) {
	c, G := slipContact(t)
	a := c.SemiMajor
	s, err := c.slip(1e9)
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []float64{3, -2, 5} {
		d, _ := s.Step(q)
		if relDiff(d, q/(8*G*a)) > 1e-8 {
			t.Errorf("μ = 1e9, Q = %g: δ = %v, want Q/(8G*a) = %v", q, d, q/(8*G*a))
		}
	}
	if w, _ := c.slipEnergy(1e9, 5); !(w < 1e-9*5*5/(8*G*a)) {
		t.Errorf("μ = 1e9: W = %v, want ≈ 0 beside the elastic energy", w)
	}
	s, err = c.Slip(1e-9)
	if err != nil {
		t.Fatal(err)
	}
	q, err := s.Displace(1e-6)
	if err != nil || relDiff(q, 1e-9*c.Load) > 1e-15 {
		t.Errorf("μ = 1e-9, δ = 1 µm: Q = %v, %v; want μP = %v", q, err, 1e-9*c.Load)
	}
	if k := s.Stiffness(); k != 0 {
		t.Errorf("sliding stiffness %v, want 0", k)
	}
}

func TestSlipErrors(t *testing.T) {
	c, _ := slipContact(t)
	field := func(err error) string {
		var ie *InputError
		if errors.As(err, &ie) {
			return ie.Field
		}
		return ""
	}
	if _, err := c.Slip(math.NaN()); field(err) != "mu" || !errors.Is(err, ErrNonFinite) {
		t.Errorf("Slip(NaN): %v", err)
	}
	if _, err := c.Slip(0); field(err) != "mu" || !errors.Is(err, ErrRange) {
		t.Errorf("Slip(0): %v", err)
	}
	if _, err := (Contact{GStar: 1e9}).Slip(0.1); field(err) != "c.Load" {
		t.Errorf("unloaded: %v", err)
	}
	s, _ := c.Slip(0.1)
	if _, err := s.Step(math.NaN()); field(err) != "q" || !errors.Is(err, ErrNonFinite) {
		t.Errorf("Step(NaN): %v", err)
	}
	if _, err := s.Step(0.1 * c.Load); field(err) != "q" || !errors.Is(err, ErrRange) {
		t.Errorf("Step(μP): %v", err)
	}
	if _, err := s.Displace(math.Inf(1)); field(err) != "d" {
		t.Errorf("Displace(Inf): %v", err)
	}
	if _, err := c.SlipEnergy(0.1, 0.2*c.Load); field(err) != "amplitude" || !errors.Is(err, ErrRange) {
		t.Errorf("SlipEnergy above μP: %v", err)
	}
	if _, err := c.SlipEnergy(0.1, math.NaN()); field(err) != "amplitude" || !errors.Is(err, ErrNonFinite) {
		t.Errorf("SlipEnergy(NaN): %v", err)
	}
}

// FuzzSlip drives a contact through arbitrary loads and displacements:
// no panic; errors name a field; results are finite, |Q| ≤ μP, and the
// stiffness lies in [0, k0]; the loss is finite and ≥ 0.
func FuzzSlip(f *testing.F) {
	f.Add(60.0, 0.1, fuzzdata.Append(nil, 1, -2, 3, 0.5, -5.9, 1e-7))
	f.Add(1e-3, 1e9, fuzzdata.Append(nil, 0, 0, math.NaN()))
	f.Add(1e4, 1e-12, fuzzdata.Append(nil, 1e-9, -1, math.Inf(1)))
	// μ as a percentage (refused) and at the bound 3 (accepted).
	f.Add(60.0, 15.0, fuzzdata.Append(nil, 1, -2, 3))
	f.Add(60.0, 3.0, fuzzdata.Append(nil, 1, -2, 3, 179))
	f.Fuzz(func(t *testing.T, load, mu float64, data []byte) {
		c, err := Solve(Sphere(0.004, Steel52100), Flat(Steel440C), math.Abs(load))
		if err != nil {
			return
		}
		s, err := c.Slip(mu)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error %v names no field", err)
			}
			return
		}
		k0, _ := c.TangentialStiffness(mu, 0)
		for i, v := range fuzzdata.Floats(data, 2) {
			var q float64
			if i%2 == 0 {
				_, err = s.Step(v[0] * mu * c.Load)
				q = s.Load()
			} else {
				q, err = s.Displace(v[1] * 1e-6)
			}
			if err != nil {
				var ie *InputError
				if !errors.As(err, &ie) || (ie.Field != "q" && ie.Field != "d") {
					t.Fatalf("error %v names no field", err)
				}
				continue
			}
			k := s.Stiffness()
			if math.IsNaN(q) || math.Abs(q) > mu*c.Load*(1+1e-12) || !(k >= 0 && k <= k0*(1+1e-12)) || math.IsNaN(s.Displacement()) {
				t.Fatalf("step %d: Q = %v, k = %v, δ = %v", i, q, k, s.Displacement())
			}
		}
		if w, err := c.SlipEnergy(mu, math.Abs(s.Load())); err == nil && (!(w >= 0) || math.IsInf(w, 0)) {
			t.Fatalf("W = %v", w)
		}
	})
}

// gl20x and gl20w are the 20-point Gauss–Legendre nodes and weights
// (Abramowitz & Stegun, Handbook of Mathematical Functions, 1964,
// Table 25.4), written out for both signs.
var gl20x, gl20w = func() ([]float64, []float64) {
	xs := []float64{0.076526521133497333755, 0.227785851141645078080, 0.373706088715419560673, 0.510867001950827098004,
		0.636053680726515025453, 0.746331906460150792614, 0.839116971822218823395, 0.912234428251325905868,
		0.963971927277913791268, 0.993128599185094924786}
	ws := []float64{0.152753387130725850698, 0.149172986472603746788, 0.142096109318382051329, 0.131688638449176626898,
		0.118194531961518417312, 0.101930119817240435037, 0.083276741576704748725, 0.062672048334109063570,
		0.040601429800386941331, 0.017614007139152118312}
	var x, w []float64
	for i := range xs {
		x, w = append(x, xs[i], -xs[i]), append(w, ws[i], ws[i])
	}
	return x, w
}()

// TestMuPercentage: every hertz entry that takes a coefficient of
// friction refuses μ = 15 (meant as 15%, μ = 0.15) naming "mu", and
// accepts μ = 3, the bound.
func TestMuPercentage(t *testing.T) {
	c, _ := slipContact(t)
	for _, tc := range []struct {
		name string
		call func(mu float64) error
	}{
		{"TangentialStiffness", func(mu float64) error { _, err := c.TangentialStiffness(mu, 0); return err }},
		{"SlidingLimit", func(mu float64) error { _, err := c.SlidingLimit(mu); return err }},
		{"Slip", func(mu float64) error { _, err := c.Slip(mu); return err }},
		{"SlipEnergy", func(mu float64) error { _, err := c.SlipEnergy(mu, 1); return err }},
	} {
		err := tc.call(15)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != "mu" || !errors.Is(err, ErrRange) ||
			!strings.Contains(err.Error(), "a coefficient of friction of 15: a percentage? (15% is 0.15); at most 3") {
			t.Errorf("%s(μ = 15): %v; want mu refused as a percentage", tc.name, err)
		}
		if err := tc.call(3); err != nil {
			t.Errorf("%s(μ = 3): %v; want accepted", tc.name, err)
		}
	}
}
