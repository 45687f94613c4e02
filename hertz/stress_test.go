package hertz

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestAxisStressesCircle checks the axis stresses for a = b against the
// closed form of Johnson (1985), §3.4, eq. 3.45.
func TestAxisStressesCircle(t *testing.T) {
	for _, nu := range []float64{-0.9, 0, 0.3, 0.5} {
		for _, z := range []float64{0, 0.01, 0.2, 0.48, 1, 3, 10} {
			a := axisAt(1, z)
			sx, sy, sz := a.stresses(nu)
			wr, wz := circleAxis(z, nu)
			if math.Abs(sx[0]-wr) > 1e-14 || math.Abs(sy[0]-wr) > 1e-14 || math.Abs(sz[0]-wz) > 1e-14 {
				t.Errorf("ν=%g z/a=%g: σx, σy, σz = %.16g, %.16g, %.16g; Johnson eq. 3.45: %.16g, %.16g", nu, z, sx[0], sy[0], sz[0], wr, wz)
			}
		}
	}
}

// TestAxisStressesLine checks the limit a/b → ∞ against McEwen's
// plane-strain stresses under a line contact (Johnson 1985, §4.2,
// eq. 4.49): σ across the strip (here σy), σz, and σ along it = ν(σy + σz).
// At a/b = 1e8 the ellipse differs from the strip by O(ln(a/b)·b/a).
func TestAxisStressesLine(t *testing.T) {
	for _, nu := range []float64{0, 0.3, 0.5} {
		for _, z := range []float64{0, 0.3, 0.786, 2} {
			a := axisAt(1e8, z)
			sx, sy, sz := a.stresses(nu)
			wy, wz, wx := lineAxis(z, nu)
			if math.Abs(sx[0]-wx) > 1e-7 || math.Abs(sy[0]-wy) > 1e-7 || math.Abs(sz[0]-wz) > 1e-7 {
				t.Errorf("ν=%g z/b=%g: σx, σy, σz = %.10g, %.10g, %.10g; plane strain %.10g, %.10g, %.10g", nu, z, sx[0], sy[0], sz[0], wx, wy, wz)
			}
		}
	}
}

// boussinesqAxis integrates Boussinesq's stresses under a concentrated
// normal force (Johnson 1985, §3.2, eqs. 3.21–3.22, numbers from memory;
// Timoshenko & Goodier 1970, §138)
//
//	σr = (P/2π)[(1−2ν)(1 − z/ρ)/r² − 3zr²/ρ⁵],
//	σθ = −(P/2π)(1−2ν)[(1 − z/ρ)/r² − z/ρ³],
//	σz = −(3P/2π) z³/ρ⁵,
//
// over the pressure √(1 − x²/a² − y²) (b = 1, p0 = 1) at the axis point
// (0, 0, z), with Gauss–Legendre in θ (ρ_e = sin θ) and the trapezoid rule
// in the polar angle. It is a reference computed without elliptic
// integrals.
func boussinesqAxis(a, z, nu float64) (sx, sy, sz float64) {
	const nt, nphi = 400, 512
	th := make([]float64, nt)
	wt := make([]float64, nt)
	quad.Legendre{}.FixedLocations(th, wt, 0, math.Pi/2)
	for i, tt := range th {
		s, c := math.Sincos(tt)
		for j := range nphi {
			phi := 2 * math.Pi * float64(j) / nphi
			sp, cp := math.Sincos(phi)
			xi, eta := a*s*cp, s*sp
			w := wt[i] * (2 * math.Pi / nphi) * a * s * c * c
			r2 := xi*xi + eta*eta
			rho := math.Sqrt(r2 + z*z)
			f := 1 / (rho * (rho + z)) // (1 − z/ρ)/r², without cancellation
			rho5 := rho * rho * rho * rho * rho
			sr := ((1-2*nu)*f - 3*z*r2/rho5) / (2 * math.Pi)
			st := -(1 - 2*nu) * (f - z/(rho*rho*rho)) / (2 * math.Pi)
			sx += w * (sr*xi*xi + st*eta*eta) / r2
			sy += w * (sr*eta*eta + st*xi*xi) / r2
			sz += w * (-3 * z * z * z / (2 * math.Pi * rho5))
		}
	}
	return sx, sy, sz
}

// TestAxisStressesQuadrature checks the elliptical axis stresses, which no
// limit covers, against a direct integration of Boussinesq's solution.
func TestAxisStressesQuadrature(t *testing.T) {
	for _, a := range []float64{1.5, 4} {
		for _, z := range []float64{0.4, 0.8, 2} {
			for _, nu := range []float64{0, 0.3} {
				wx, wy, wz := boussinesqAxis(a, z, nu)
				at := axisAt(a, z)
				sx, sy, sz := at.stresses(nu)
				if math.Abs(sx[0]-wx) > 1e-9 || math.Abs(sy[0]-wy) > 1e-9 || math.Abs(sz[0]-wz) > 1e-9 {
					t.Errorf("a/b=%g z/b=%g ν=%g: σ = %.12g, %.12g, %.12g; Boussinesq quadrature %.12g, %.12g, %.12g",
						a, z, nu, sx[0], sy[0], sz[0], wx, wy, wz)
				}
			}
		}
	}
}

// TestAxisDerivatives checks the analytic depth derivatives of the axis
// terms against central differences of the values (step h, error O(h²)).
func TestAxisDerivatives(t *testing.T) {
	const h = 1e-4
	for _, r := range []float64{1, 1.7, 30} {
		for _, z := range []float64{0.05, 0.5, 2} {
			lo, mid, hi := axisAt(r, z-h), axisAt(r, z), axisAt(r, z+h)
			for obj := range 3 {
				fl, fm, fh := lo.objective(obj, 0.27), mid.objective(obj, 0.27), hi.objective(obj, 0.27)
				for k := 1; k <= 3; k++ {
					fd := (fh[k-1] - fl[k-1]) / (2 * h)
					if math.Abs(fd-fm[k]) > 2e-6*(1+math.Abs(fm[k])) {
						t.Errorf("r=%g z=%g obj %d: derivative %d = %.10g, difference %.10g", r, z, obj, k, fm[k], fd)
					}
				}
			}
		}
	}
}

// TestSurfaceObjective checks the closed-form surface values and slopes
// (from R_D(0, k'², 1) = 3(K − E)/m and R_D(0, 1, k'²) = 3(E − k'²K)/(mk'²),
// DLMF 19.25.1) against the general axis terms evaluated at ζ = 0.
func TestSurfaceObjective(t *testing.T) {
	for _, ratio := range []float64{1, 1.5, 10, 1e4} {
		sh := solveShape(ratio - 1)
		at := axisAt(math.Exp(sh.t), 0)
		for _, nu := range []float64{-0.5, 0, 0.3, 0.5} {
			for obj := range 3 {
				f0, s0 := surfaceObjective(obj, nu, &sh, sh.P, sh.Q)
				f := at.objective(obj, nu)
				if math.Abs(f0-f[0]) > 1e-13 || math.Abs(s0-f[1]) > 1e-12*(1+math.Abs(s0)) {
					t.Errorf("B/A=%g ν=%g obj %d: closed form %.16g, %.16g; axis terms %.16g, %.16g", ratio, nu, obj, f0, s0, f[0], f[1])
				}
			}
		}
	}
}

// TestCircleMaxStresses checks the maxima under a circular contact.
// Johnson (1985), §3.4: for ν = 0.3 the largest shear stress is 0.31 p0 at
// a depth of 0.48a (printed to two figures). The von Mises maximum, twice
// the shear for a circle, is 0.62 p0 at 0.48a (from memory; common
// practice). The exact values are the maxima of Johnson's eq. 3.45,
// found here by golden-section search.
func TestCircleMaxStresses(t *testing.T) {
	m := Material{Name: "test", E: 200e9, Nu: 0.3}
	c, err := Solve(Sphere(0.006, m), Flat(m), 150)
	if err != nil {
		t.Fatal(err)
	}
	a, p0 := c.SemiMajor, c.PeakPressure
	s := c.Stress[0]
	if math.Abs(s.MaxShear/p0-0.31) > 0.005 || math.Abs(s.MaxShearDepth/a-0.48) > 0.005 {
		t.Errorf("τmax = %.4f p0 at %.4f a; Johnson §3.4: 0.31 p0 at 0.48a", s.MaxShear/p0, s.MaxShearDepth/a)
	}
	if math.Abs(s.MaxVonMises/p0-0.62) > 0.005 || math.Abs(s.MaxVonMisesDepth/a-0.48) > 0.005 {
		t.Errorf("σvM max = %.4f p0 at %.4f a; want 0.62 p0 at 0.48a", s.MaxVonMises/p0, s.MaxVonMisesDepth/a)
	}
	for _, nu := range []float64{-0.9, -0.3, 0, 0.2, 0.3, 0.45, 0.5} {
		m.Nu = nu
		c, err := Solve(Sphere(0.006, m), Flat(m), 150)
		if err != nil {
			t.Fatal(err)
		}
		want, z := goldenMax(func(z float64) float64 {
			sr, sz := circleAxis(z, nu)
			return (sr - sz) / 2
		}, 0, 3)
		s := c.Stress[0]
		if relDiff(s.MaxShear/c.PeakPressure, want) > 1e-12 || math.Abs(s.MaxShearDepth/c.SemiMajor-z) > 1e-7 {
			t.Errorf("ν=%g: τmax = %.15g p0 at %.10g a; eq. 3.45 maximum %.15g p0 at %.10g a", nu, s.MaxShear/c.PeakPressure, s.MaxShearDepth/c.SemiMajor, want, z)
		}
		if relDiff(s.MaxVonMises/c.PeakPressure, 2*want) > 1e-12 || math.Abs(s.MaxVonMisesDepth/c.SemiMajor-z) > 1e-7 {
			t.Errorf("ν=%g: σvM max = %.15g p0 at %.10g a; want %.15g p0 at %.10g a", nu, s.MaxVonMises/c.PeakPressure, s.MaxVonMisesDepth/c.SemiMajor, 2*want, z)
		}
	}
}

// TestLineLimitMaxStresses checks the maxima as B/A grows against the line
// contact: Johnson (1985), §4.2, gives the largest principal shear stress
// 0.30 p0 at z = 0.78b (printed to two figures); the exact limits are the
// maxima of McEwen's stresses (eq. 4.49), by golden-section search, for
// the in-plane shear and for the von Mises stress with σ along the
// strip = ν(σx + σz) (plane strain).
func TestLineLimitMaxStresses(t *testing.T) {
	const nu = 0.3
	m := Material{Name: "test", E: 200e9, Nu: nu}
	b1, b2 := ellipseOnFlat(1-2e-12, m) // B/A ≈ 1e12
	c, err := Solve(b1, b2, 10)
	if err != nil {
		t.Fatal(err)
	}
	b, p0 := c.SemiMinor, c.PeakPressure
	s := c.Stress[0]
	if math.Abs(s.MaxShear/p0-0.30) > 0.005 || math.Abs(s.MaxShearDepth/b-0.78) > 0.01 {
		t.Errorf("τmax = %.4f p0 at %.4f b; Johnson §4.2: 0.30 p0 at 0.78b", s.MaxShear/p0, s.MaxShearDepth/b)
	}
	tau, zt := goldenMax(func(z float64) float64 {
		sx, sz, _ := lineAxis(z, nu)
		return (sx - sz) / 2
	}, 0, 3)
	vm, zv := goldenMax(func(z float64) float64 {
		sx, sz, sy := lineAxis(z, nu)
		return math.Sqrt(((sx-sy)*(sx-sy) + (sy-sz)*(sy-sz) + (sz-sx)*(sz-sx)) / 2)
	}, 0, 3)
	// a/b ≈ 4e6 here: the strip limit is reached to O(ln(a/b)·b/a).
	if math.Abs(s.MaxShear/p0-tau) > 2e-5 || math.Abs(s.MaxShearDepth/b-zt) > 2e-5 {
		t.Errorf("τmax = %.8f p0 at %.8f b; line contact %.8f p0 at %.8f b", s.MaxShear/p0, s.MaxShearDepth/b, tau, zt)
	}
	if math.Abs(s.MaxVonMises/p0-vm) > 2e-5 || math.Abs(s.MaxVonMisesDepth/b-zv) > 2e-5 {
		t.Errorf("σvM max = %.8f p0 at %.8f b; line contact %.8f p0 at %.8f b", s.MaxVonMises/p0, s.MaxVonMisesDepth/b, vm, zv)
	}
	if math.Abs(tau-0.3) > 0.005 || math.Abs(zt-0.786) > 0.0005 {
		t.Errorf("McEwen maximum %.5f p0 at %.5f b; Johnson: 0.30 p0 at 0.786b", tau, zt)
	}
}

// TestSubsurfaceMaxima checks the depth search over the domain: for each
// B/A and ν the reported maxima must be at least the largest of dense
// samples of the Tresca and von Mises stresses on [0, 4b], at most that
// plus the sampling error, and equal to the stress at the reported depth.
// Tresca is (max − min)/2 of the three axis stresses, so the check does not
// rely on the search's assumption that σz is the smallest.
func TestSubsurfaceMaxima(t *testing.T) {
	const n = 2000
	ratios := []float64{1, 1 + 1e-9, 1.0001, 1.05, 1.3, 2, 4, 10, 30, 100, 1e3, 1e4, 1e6, 1e10}
	nus := []float64{-0.95, -0.7, -0.5, -0.3, -0.1, 0, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5}
	if testing.Short() {
		ratios, nus = []float64{1, 1.3, 10, 1e4}, []float64{-0.5, 0, 0.2, 0.3, 0.5}
	}
	for _, ratio := range ratios {
		for _, nu := range nus {
			m := Material{Name: "test", E: 1e11, Nu: nu}
			b1, b2 := ellipseOnFlat((ratio-1)/(ratio+1), m)
			c, err := Solve(b1, b2, 1)
			if err != nil {
				t.Fatal(err)
			}
			r := c.SemiMajor / c.SemiMinor
			stress := func(z float64) (tresca, vm float64) {
				at := axisAt(r, z)
				sx, sy, sz := at.stresses(nu)
				x, y, w := sx[0], sy[0], sz[0]
				tresca = (math.Max(x, math.Max(y, w)) - math.Min(x, math.Min(y, w))) / 2
				vm = math.Sqrt(((x-y)*(x-y) + (y-w)*(y-w) + (w-x)*(w-x)) / 2)
				return tresca, vm
			}
			var tmax, vmax float64
			for i := 0; i <= n; i++ {
				tr, vm := stress(4 * float64(i) / n)
				tmax, vmax = math.Max(tmax, tr), math.Max(vmax, vm)
			}
			s := c.Stress[0]
			p0, b := c.PeakPressure, c.SemiMinor
			name := fmt.Sprintf("B/A=%g ν=%g", ratio, nu)
			// Sampling at spacing h = 0.002 misses a peak by at most
			// |f''|h²/8 ≲ 1e-5 for these stresses.
			if got := s.MaxShear / p0; got < tmax-1e-12 || got > tmax+1e-5 {
				t.Errorf("%s: MaxShear = %.12f p0, dense sampling %.12f p0", name, got, tmax)
			}
			if got := s.MaxVonMises / p0; got < vmax-1e-12 || got > vmax+1e-5 {
				t.Errorf("%s: MaxVonMises = %.12f p0, dense sampling %.12f p0", name, got, vmax)
			}
			tr, _ := stress(s.MaxShearDepth / b)
			_, vm := stress(s.MaxVonMisesDepth / b)
			if relDiff(s.MaxShear/p0, tr) > 1e-12 || relDiff(s.MaxVonMises/p0, vm) > 1e-12 {
				t.Errorf("%s: maxima %.15g, %.15g p0 but stresses at their depths %.15g, %.15g", name, s.MaxShear/p0, s.MaxVonMises/p0, tr, vm)
			}
		}
	}
}

// TestStressPerBody checks that each body's stresses use its own Poisson's
// ratio: with different ν the two entries equal those of contacts in which
// both bodies have that ν (the pressure field depends on E* only, kept
// equal here).
func TestStressPerBody(t *testing.T) {
	m1 := Material{Name: "one", E: 200e9, Nu: 0.3}
	m2 := Material{Name: "two", E: 100e9, Nu: 0.1}
	c, err := Solve(Toroid(0.004, 0.02, 0.2, m1), Groove(0.03, 1.1, m2), 40)
	if err != nil {
		t.Fatal(err)
	}
	if c.Stress[0] == c.Stress[1] {
		t.Fatalf("both bodies report the same stresses %+v", c.Stress[0])
	}
	for i, nu := range []float64{m1.Nu, m2.Nu} {
		// Same E* with both bodies of Poisson's ratio nu.
		e := (1 - nu*nu) / (1 / c.EStar) * 2
		mm := Material{Name: "same", E: e, Nu: nu}
		ci, err := Solve(Toroid(0.004, 0.02, 0.2, mm), Groove(0.03, 1.1, mm), 40)
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(ci.EStar, c.EStar) > 1e-14 {
			t.Fatalf("E* = %v, want %v", ci.EStar, c.EStar)
		}
		for _, q := range [][2]float64{
			{c.Stress[i].MaxShear, ci.Stress[0].MaxShear}, {c.Stress[i].MaxShearDepth, ci.Stress[0].MaxShearDepth},
			{c.Stress[i].MaxVonMises, ci.Stress[0].MaxVonMises}, {c.Stress[i].MaxVonMisesDepth, ci.Stress[0].MaxVonMisesDepth},
		} {
			if relDiff(q[0], q[1]) > 1e-10 {
				t.Errorf("body %d: %+v, want %+v", i+1, c.Stress[i], ci.Stress[0])
				break
			}
		}
	}
}

// TestCircleShear checks the closed-form circular maximum over the whole
// domain of ν, to its ends: against the maximum of Johnson's eq. 3.45
// (circleAxis) found by golden-section search (the depth of a flat maximum
// only to about 1e-8 that way); against the package's general elliptical
// search run at a/b = 1, which uses Carlson's R_D instead of the closed
// form (maxima to 1e-12, depths to 1e-9 as documented); and, as ν → −1,
// against the limit ζ → (1 + ν)π/6 that follows from
// f′(ζ) ≈ [(1 + ν)(π/2 − 2ζ) − 3ζ]/2 for small ζ.
func TestCircleShear(t *testing.T) {
	circle := solveShape(0)
	for _, nu := range []float64{-1 + 1e-9, -0.9999999, -0.999, -0.99, -0.9, -0.5, -0.1, 0, 0.1, 0.27, 0.3, 0.42, 0.5} {
		tau, z := circleShear(nu)
		want, wz := goldenMax(func(z float64) float64 {
			sr, sz := circleAxis(z, nu)
			return (sr - sz) / 2
		}, 0, 3)
		if relDiff(tau, want) > 1e-14 || math.Abs(z-wz) > 1e-7 {
			t.Errorf("ν=%g: τmax = %.16g p0 at %.12g a; eq. 3.45 maximum %.16g at %.12g", nu, tau, z, want, wz)
		}
		d := newDepthSearch(&circle)
		et, ez := d.maximize(objShearY, nu, z)
		if relDiff(tau, et) > 1e-12 || math.Abs(z-ez) > 1e-9 {
			t.Errorf("ν=%g: closed form %.16g at %.12g; elliptical search at a/b = 1 %.16g at %.12g", nu, tau, z, et, ez)
		}
		if s := 1 + nu; s < 1e-5 {
			if lim := s * math.Pi / 6; relDiff(z, lim) > 2*s {
				t.Errorf("ν=%g: depth %.12g a, limit (1+ν)π/6 = %.12g", nu, z, lim)
			}
		}
	}
}
