package hertz

import (
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
)

// pairs is a set of valid contacts of every kind used by the property tests.
func pairs() []struct {
	name   string
	b1, b2 Body
} {
	return []struct {
		name   string
		b1, b2 Body
	}{
		{"ball on flat", Sphere(0.005, Steel52100), Flat(FusedSilica)},
		{"ball in groove", Sphere(0.005, Steel52100), Groove(0.0053, 0.4, Steel440C)},
		{"ball in socket", Sphere(0.004, SiliconNitride), Socket(0.0042, Ti6Al4V)},
		{"crossed cylinders", Cylinder(0.003, 0.1, TungstenCarbide), Cylinder(0.005, 1.3, Invar36)},
		{"ball on race", Sphere(0.003, Steel52100), Toroid(0.02, -0.0031, 2.5, Steel52100)},
		{"skewed toroids", Toroid(0.01, 0.002, 0.7, Sapphire), Toroid(-0.05, 0.03, -0.2, Aluminium6061T6)},
	}
}

// TestSwapBodies checks that exchanging the two bodies changes nothing but
// the order of Stress (Hertz's solution is symmetric in the bodies:
// Johnson 1985, §4.1).
func TestSwapBodies(t *testing.T) {
	for _, p := range pairs() {
		c12, err := Solve(p.b1, p.b2, 37)
		if err != nil {
			t.Fatalf("%s: %v", p.name, err)
		}
		c21, err := Solve(p.b2, p.b1, 37)
		if err != nil {
			t.Fatalf("%s: %v", p.name, err)
		}
		c21.Stress[0], c21.Stress[1] = c21.Stress[1], c21.Stress[0]
		if diff := cmp.Diff(c12, c21, cmpopts.EquateApprox(1e-14, 0)); diff != "" {
			t.Errorf("%s: swapping the bodies changes the contact (-b1,b2 +b2,b1):\n%s", p.name, diff)
		}
	}
}

// TestLoadScaling checks the load laws of Hertz theory (Johnson 1985,
// §4.2): a, b, p0 ∝ F^(1/3), δ ∝ F^(2/3), with shape, angle and the
// stresses over p0 unchanged.
func TestLoadScaling(t *testing.T) {
	for _, p := range pairs() {
		c1, err := Solve(p.b1, p.b2, 3)
		if err != nil {
			t.Fatal(err)
		}
		for _, k := range []float64{1e-6, 0.125, 8, 1e9} {
			ck, err := Solve(p.b1, p.b2, 3*k)
			if err != nil {
				t.Fatal(err)
			}
			s, s2 := math.Cbrt(k), math.Cbrt(k*k)
			for _, q := range [][3]float64{
				{ck.SemiMajor, c1.SemiMajor, s}, {ck.SemiMinor, c1.SemiMinor, s},
				{ck.PeakPressure, c1.PeakPressure, s}, {ck.Approach, c1.Approach, s2},
				{ck.Stiffness, c1.Stiffness, s}, {ck.Stress[1].MaxShear, c1.Stress[1].MaxShear, s},
				{ck.Stress[0].MaxVonMisesDepth, c1.Stress[0].MaxVonMisesDepth, s},
			} {
				if relDiff(q[0], q[1]*q[2]) > 1e-12 {
					t.Errorf("%s, load ×%g: %.15g, want %.15g", p.name, k, q[0], q[1]*q[2])
				}
			}
			if ck.MajorAngle != c1.MajorAngle || ck.A != c1.A || ck.B != c1.B {
				t.Errorf("%s: shape depends on the load", p.name)
			}
		}
	}
}

// TestUnitScaling checks exact dimensional scaling: the same design in
// centimetres (radii ×100, moduli ×1e-4, i.e. N/cm², load unchanged)
// gives a, b, δ and depths ×100, pressures and stresses ×1e-4 and
// stiffness ×1e-2, to 1e-12 (ARCHITECTURE.md: results scale exactly).
// Centimetres, not millimetres: a modulus in N/mm² (3600 for a polymer) can
// fall below the 1e4 Pa that Solve accepts, refused as a modulus in MPa
// written as Pa.
func TestUnitScaling(t *testing.T) {
	inCm := func(b Body) Body {
		b.R1 *= 100
		b.R2 *= 100
		b.Material.E *= 1e-4
		return b
	}
	for _, p := range pairs() {
		c, err := Solve(p.b1, p.b2, 12)
		if err != nil {
			t.Fatal(err)
		}
		cm, err := Solve(inCm(p.b1), inCm(p.b2), 12)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range [][3]float64{
			{cm.SemiMajor, c.SemiMajor, 1e2}, {cm.SemiMinor, c.SemiMinor, 1e2},
			{cm.Approach, c.Approach, 1e2}, {cm.PeakPressure, c.PeakPressure, 1e-4},
			{cm.MeanPressure, c.MeanPressure, 1e-4}, {cm.Stiffness, c.Stiffness, 1e-2},
			{cm.EStar, c.EStar, 1e-4}, {cm.GStar, c.GStar, 1e-4},
			{cm.A, c.A, 1e-2}, {cm.B, c.B, 1e-2},
			{cm.Stress[0].MaxShear, c.Stress[0].MaxShear, 1e-4},
			{cm.Stress[1].MaxShearDepth, c.Stress[1].MaxShearDepth, 1e2},
			{cm.Stress[0].MaxVonMises, c.Stress[0].MaxVonMises, 1e-4},
			{cm.Stress[1].MaxVonMisesDepth, c.Stress[1].MaxVonMisesDepth, 1e2},
		} {
			if relDiff(q[0], q[1]*q[2]) > 1e-12 {
				t.Errorf("%s in cm: %.15g, want %.15g", p.name, q[0], q[1]*q[2])
			}
		}
		if math.Abs(cm.MajorAngle-c.MajorAngle) > 1e-12 || cm.Valid != c.Valid {
			t.Errorf("%s in cm: angle or validity changed", p.name)
		}
	}
}

// TestRadiusScaling checks the geometric law with load and moduli fixed:
// radii ×k give a, b ×k^(1/3), p0 ×k^(−2/3), δ ×k^(−1/3), from
// a³ ∝ FR/E*, p0 ∝ F/a², δ ∝ a²/R (Johnson 1985, §4.2, eqs. 4.22–4.23,
// for any ellipse by homogeneity).
func TestRadiusScaling(t *testing.T) {
	const k = 1000
	for _, p := range pairs() {
		b1, b2 := p.b1, p.b2
		c, err := Solve(b1, b2, 5)
		if err != nil {
			t.Fatal(err)
		}
		b1.R1, b1.R2, b2.R1, b2.R2 = k*b1.R1, k*b1.R2, k*b2.R1, k*b2.R2
		ck, err := Solve(b1, b2, 5)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range [][3]float64{
			{ck.SemiMajor, c.SemiMajor, 10}, {ck.SemiMinor, c.SemiMinor, 10},
			{ck.PeakPressure, c.PeakPressure, 0.01}, {ck.Approach, c.Approach, 0.1},
		} {
			if relDiff(q[0], q[1]*q[2]) > 1e-12 {
				t.Errorf("%s, radii ×1000: %.15g, want %.15g", p.name, q[0], q[1]*q[2])
			}
		}
	}
}

// TestRotation checks frame independence: turning both bodies by the same
// angle turns MajorAngle by it (mod π) and changes nothing else.
func TestRotation(t *testing.T) {
	for _, p := range pairs() {
		c, err := Solve(p.b1, p.b2, 9)
		if err != nil {
			t.Fatal(err)
		}
		if c.A == c.B {
			continue // circle: no direction
		}
		for _, rot := range []float64{0.3, 1.5, -2, 10} {
			b1, b2 := p.b1, p.b2
			b1.Angle += rot
			b2.Angle += rot
			cr, err := Solve(b1, b2, 9)
			if err != nil {
				t.Fatal(err)
			}
			d := math.Mod(cr.MajorAngle-c.MajorAngle-rot, math.Pi)
			if d > math.Pi/2 {
				d -= math.Pi
			} else if d < -math.Pi/2 {
				d += math.Pi
			}
			if math.Abs(d) > 1e-12 {
				t.Errorf("%s: rotating by %g turns MajorAngle from %v to %v", p.name, rot, c.MajorAngle, cr.MajorAngle)
			}
			if relDiff(cr.SemiMajor, c.SemiMajor) > 1e-13 || relDiff(cr.SemiMinor, c.SemiMinor) > 1e-13 {
				t.Errorf("%s: rotation changes the ellipse", p.name)
			}
		}
	}
}

// TestNearCircleContinuity checks that the solution is continuous at the
// circle, where Hertz's condition is 0/0: B/A = 1 + d gives a/b − 1 ≈ 2d/3
// (TestShapeNearCircle) and everything else within O(d) of the circle.
func TestNearCircleContinuity(t *testing.T) {
	m := Steel52100
	circle, err := Solve(Sphere(0.005, m), Flat(m), 20)
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range []float64{1e-13, 1e-10, 1e-7} {
		// R1 = R(1 + d), R2 = R(1 − d) on a flat: (B − A)/A ≈ 2d.
		c, err := Solve(Toroid(0.005*(1+d), 0.005*(1-d), 0, m), Flat(m), 20)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range [][2]float64{
			{c.SemiMajor, circle.SemiMajor}, {c.SemiMinor, circle.SemiMinor},
			{c.PeakPressure, circle.PeakPressure}, {c.Approach, circle.Approach},
			{c.Stress[0].MaxShear, circle.Stress[0].MaxShear},
			{c.Stress[0].MaxVonMises, circle.Stress[0].MaxVonMises},
		} {
			if relDiff(q[0], q[1]) > 4*d {
				t.Errorf("d=%g: %.15g vs circle %.15g", d, q[0], q[1])
			}
		}
	}
}

// TestInverseLoads checks LoadForPressure and LoadForApproach against
// Solve, and the circular closed forms F = (2πa²p0/3) with a = πRp0/(2E*)
// (Johnson 1985, §4.2) and F = (4/3)E*R^(1/2)δ^(3/2).
func TestInverseLoads(t *testing.T) {
	for _, p := range pairs() {
		for _, F := range []float64{1e-3, 1, 250} {
			c, err := Solve(p.b1, p.b2, F)
			if err != nil {
				t.Fatal(err)
			}
			fp, err := LoadForPressure(p.b1, p.b2, c.PeakPressure)
			if err != nil || relDiff(fp, F) > 1e-13 {
				t.Errorf("%s: LoadForPressure(p0 at %g N) = %.15g, %v", p.name, F, fp, err)
			}
			fd, err := LoadForApproach(p.b1, p.b2, c.Approach)
			if err != nil || relDiff(fd, F) > 1e-13 {
				t.Errorf("%s: LoadForApproach(δ at %g N) = %.15g, %v", p.name, F, fd, err)
			}
		}
		for _, f := range []func(Body, Body, float64) (float64, error){LoadForPressure, LoadForApproach} {
			if F, err := f(p.b1, p.b2, 0); F != 0 || err != nil {
				t.Errorf("%s: zero target gives %v, %v", p.name, F, err)
			}
		}
	}
	R, m := 0.005, Steel52100
	es := estar(m, m)
	p0 := 3e9
	a := math.Pi * R * p0 / (2 * es)
	F, err := LoadForPressure(Sphere(R, m), Flat(m), p0)
	if err != nil || relDiff(F, 2*math.Pi*a*a*p0/3) > 1e-13 {
		t.Errorf("LoadForPressure = %v, %v; closed form %v", F, err, 2*math.Pi*a*a*p0/3)
	}
	delta := 2e-6
	F, err = LoadForApproach(Sphere(R, m), Flat(m), delta)
	if want := 4.0 / 3 * es * math.Sqrt(R) * math.Pow(delta, 1.5); err != nil || relDiff(F, want) > 1e-13 {
		t.Errorf("LoadForApproach = %v, %v; closed form %v", F, err, want)
	}
}

// TestZeroLoad checks the zero-size contact: no NaN, shape data kept.
func TestZeroLoad(t *testing.T) {
	for _, p := range pairs() {
		c, err := Solve(p.b1, p.b2, 0)
		if err != nil {
			t.Fatal(err)
		}
		c1, _ := Solve(p.b1, p.b2, 1)
		want := Contact{MajorAngle: c1.MajorAngle, EStar: c1.EStar, GStar: c1.GStar, A: c1.A, B: c1.B, Valid: true}
		if c != want {
			t.Errorf("%s: zero load gives %+v, want %+v", p.name, c, want)
		}
	}
}

// TestInputsNotModified checks that Solve leaves its arguments alone (Go
// passes them by value; the check guards against future pointer fields).
func TestInputsNotModified(t *testing.T) {
	for _, p := range pairs() {
		b1, b2 := p.b1, p.b2
		if _, err := Solve(b1, b2, 3); err != nil {
			t.Fatal(err)
		}
		if b1 != p.b1 || b2 != p.b2 {
			t.Errorf("%s: inputs modified", p.name)
		}
	}
}

// TestValid checks the half-space flag: a ≤ 0.1 of the smallest |radius|
// (common practice).
func TestValid(t *testing.T) {
	m := Steel52100
	R := 0.005
	// a = 0.1R exactly at F = 4E*(0.1R)³/(3R).
	F := 4 * estar(m, m) * math.Pow(0.1*R, 3) / (3 * R)
	for _, c := range []struct {
		F    float64
		want bool
	}{{F * 0.99, true}, {F * 1.01, false}} {
		got, err := Solve(Sphere(R, m), Flat(m), c.F)
		if err != nil {
			t.Fatal(err)
		}
		if got.Valid != c.want {
			t.Errorf("a/R = %.4f: Valid = %v", got.SemiMajor/R, got.Valid)
		}
	}
}
