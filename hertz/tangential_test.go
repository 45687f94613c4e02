package hertz

import (
	"errors"
	"math"
	"testing"
)

// gstar returns 1/G* = (2−ν1)/G1 + (2−ν2)/G2 inverted, G = E/(2(1+ν))
// (Mindlin 1949; Johnson 1985, §7.2), a rigid body adding nothing.
func gstar(m1, m2 Material) float64 {
	c := 0.0
	for _, m := range []Material{m1, m2} {
		if !math.IsInf(m.E, 1) {
			c += (2 - m.Nu) / (m.E / (2 * (1 + m.Nu)))
		}
	}
	return 1 / c
}

// TestMindlinCircle checks the circular case: G*, the no-slip stiffness
// 8G*a, and the micro-slip law dQ/dx = 8G*a(1 − |Q|/(μN))^(1/3) under a
// monotonically increasing tangential load (Mindlin & Deresiewicz 1953;
// Johnson 1985, §7.2, from the compliance δx ∝ 1 − (1 − Q/μN)^(2/3)).
func TestMindlinCircle(t *testing.T) {
	rigid := Material{Name: "rigid", E: math.Inf(1), Nu: 0.2}
	for _, ms := range [][2]Material{{Steel52100, Steel52100}, {Steel52100, FusedSilica}, {Aluminium6061T6, rigid}} {
		c, err := Solve(Sphere(0.004, ms[0]), Flat(ms[1]), 60)
		if err != nil {
			t.Fatal(err)
		}
		G := gstar(ms[0], ms[1])
		if relDiff(c.GStar, G) > 1e-14 {
			t.Errorf("%s/%s: G* = %v, want %v", ms[0].Name, ms[1].Name, c.GStar, G)
		}
		const mu = 0.15
		N := c.Load
		for _, q := range []float64{0, 0.5 * mu * N, -0.9 * mu * N, 0.999999 * mu * N} {
			k, err := c.TangentialStiffness(mu, q)
			want := 8 * G * c.SemiMajor * math.Cbrt(1-math.Abs(q)/(mu*N))
			if err != nil || relDiff(k, want) > 1e-13 {
				t.Errorf("%s/%s, q=%g: k = %v, %v; want %v", ms[0].Name, ms[1].Name, q, k, err, want)
			}
		}
		if lim, err := c.SlidingLimit(mu); err != nil || relDiff(lim, mu*N) > 1e-15 {
			t.Errorf("SlidingLimit = %v, %v; want %v", lim, err, mu*N)
		}
	}
}

// TestMindlinEllipse checks the elliptical no-slip stiffness 4πG*a/K(e),
// the inverse of the direction-averaged compliance, against Cerruti's
// surface displacement under a tangential point force (Johnson 1985,
// §3.6; numbers of the equations not recalled),
//
//	u_x = Q/(2πG) [(1 − ν)/ρ + ν x²/ρ³],
//
// integrated over the no-slip traction Q/(2πab)(1 − x²/a² − y²/b²)^(−1/2)
// at the centre, with the angular integral done by the trapezoid rule
// rather than through elliptic integrals; and the stated bound: the axial
// compliances differ from the mean by less than the factor 1 ± ν/(2 − ν).
func TestMindlinEllipse(t *testing.T) {
	m1, m2 := Steel52100, Steel440C
	for _, g := range []float64{0.0052, 0.006, 0.01} {
		c, err := Solve(Sphere(0.005, m1), Groove(g, 0, m2), 30)
		if err != nil {
			t.Fatal(err)
		}
		a, b := c.SemiMajor, c.SemiMinor
		var cx, cy float64 // compliances along the major and minor axes, both bodies
		for _, m := range []Material{m1, m2} {
			G := m.E / (2 * (1 + m.Nu))
			const n = 4096
			var ix, iy float64
			for j := range n {
				phi := 2 * math.Pi * (float64(j) + 0.5) / n
				s, co := math.Sincos(phi)
				R := 1 / math.Sqrt(co*co/(a*a)+s*s/(b*b)) // boundary radius
				// ∫0^R (1 − r²/R²)^(−1/2) dr = πR/2.
				ix += math.Pi * R / 2 * ((1 - m.Nu) + m.Nu*co*co)
				iy += math.Pi * R / 2 * ((1 - m.Nu) + m.Nu*s*s)
			}
			ix *= 2 * math.Pi / n
			iy *= 2 * math.Pi / n
			cx += ix / (2 * math.Pi * G * 2 * math.Pi * a * b)
			cy += iy / (2 * math.Pi * G * 2 * math.Pi * a * b)
		}
		k, err := c.TangentialStiffness(0.2, 0)
		if err != nil || relDiff(k, 2/(cx+cy)) > 1e-12 {
			t.Errorf("groove %g: k0 = %v, %v; Cerruti quadrature %v", g, k, err, 2/(cx+cy))
		}
		nu := m1.Nu
		bound := nu / (2 - nu)
		if r := cx / ((cx + cy) / 2); r < 1-bound || r > 1+bound {
			t.Errorf("groove %g: axial compliance ratio %v outside 1 ± %v", g, r, bound)
		}
	}
}

// TestTangentialErrors checks the error cases of the tangential methods.
func TestTangentialErrors(t *testing.T) {
	c, err := Solve(Sphere(0.004, Steel52100), Flat(Steel52100), 10)
	if err != nil {
		t.Fatal(err)
	}
	for _, x := range []struct {
		mu, q float64
		field string
		kind  error
	}{
		{0, 0, "mu", ErrRange}, {-0.1, 0, "mu", ErrRange}, {math.NaN(), 0, "mu", ErrNonFinite}, {math.Inf(1), 0, "mu", ErrNonFinite},
		{0.1, math.NaN(), "q", ErrNonFinite}, {0.1, math.Inf(-1), "q", ErrNonFinite}, {0.1, 1, "q", ErrRange}, {0.1, -1.5, "q", ErrRange},
	} {
		k, err := c.TangentialStiffness(x.mu, x.q)
		var ie *InputError
		if !errors.Is(err, x.kind) || !errors.As(err, &ie) || ie.Field != x.field || k != 0 {
			t.Errorf("TangentialStiffness(%v, %v) = %v, %v; want %v on %s", x.mu, x.q, k, err, x.kind, x.field)
		}
	}
	for _, x := range []struct {
		mu   float64
		kind error
	}{{-1, ErrRange}, {math.NaN(), ErrNonFinite}, {math.Inf(1), ErrNonFinite}} {
		if _, err := c.SlidingLimit(x.mu); !errors.Is(err, x.kind) {
			t.Errorf("SlidingLimit(%v): %v, want %v", x.mu, err, x.kind)
		}
	}
	nanLoad := c
	nanLoad.Load = math.NaN()
	if _, err := nanLoad.TangentialStiffness(0.1, 0); !errors.Is(err, ErrNonFinite) {
		t.Errorf("NaN c.Load accepted: %v", err)
	}
	bad := c
	bad.SemiMinor = 2 * c.SemiMajor
	if _, err := bad.TangentialStiffness(0.1, 0); !errors.Is(err, ErrRange) {
		t.Errorf("a < b accepted: %v", err)
	}
	if _, err := (Contact{}).TangentialStiffness(0.1, 0); !errors.Is(err, ErrRange) {
		t.Errorf("zero Contact accepted: %v", err)
	}
	z, err := Solve(Sphere(0.004, Steel52100), Flat(Steel52100), 0)
	if err != nil {
		t.Fatal(err)
	}
	if k, err := z.TangentialStiffness(0.1, 0); k != 0 || err != nil {
		t.Errorf("unloaded contact: %v, %v; want 0, nil", k, err)
	}
	if _, err := z.TangentialStiffness(0.1, 1e-9); !errors.Is(err, ErrRange) {
		t.Errorf("unloaded contact under tangential load: %v", err)
	}
}
