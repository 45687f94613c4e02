package hertz

import (
	"math"
	"testing"
)

// estar returns 1/E* = (1−ν1²)/E1 + (1−ν2²)/E2 inverted (Johnson 1985,
// §4.2, eq. 4.22), with a rigid body adding nothing.
func estar(m1, m2 Material) float64 {
	c := 0.0
	for _, m := range []Material{m1, m2} {
		if !math.IsInf(m.E, 1) {
			c += (1 - m.Nu*m.Nu) / m.E
		}
	}
	return 1 / c
}

// TestCircularClosedForms checks circular contacts against Hertz (1882) in
// Johnson, Contact Mechanics (1985), §4.2, eqs. 4.22–4.23:
// a³ = 3FR/(4E*), p0 = 3F/(2πa²), δ = a²/R, with 1/R = 1/R1 + 1/R2 (a
// concave radius negative), and the stiffness dF/dδ = 3F/(2δ) that follows
// from δ ∝ F^(2/3).
func TestCircularClosedForms(t *testing.T) {
	steel, glass := Steel52100, FusedSilica
	rigid := Material{Name: "rigid", E: math.Inf(1), Nu: 0.3}
	cases := []struct {
		name   string
		b1, b2 Body
		R      float64 // effective radius
		F      float64
	}{
		{"ball on flat", Sphere(0.005, steel), Flat(steel), 0.005, 100},
		{"ball on glass flat", Sphere(0.003, steel), Flat(glass), 0.003, 10},
		{"ball on ball", Sphere(0.005, steel), Sphere(0.002, SiliconNitride), 1 / (1/0.005 + 1/0.002), 50},
		{"ball in socket", Sphere(0.005, steel), Socket(0.0055, steel), 1 / (1/0.005 - 1/0.0055), 200},
		{"ball on rigid flat", Sphere(0.01, Aluminium6061T6), Flat(rigid), 0.01, 1},
		{"small load", Sphere(0.005, steel), Flat(steel), 0.005, 1e-9},
		{"large load", Sphere(0.005, steel), Flat(steel), 0.005, 1e6},
	}
	for _, c := range cases {
		got, err := Solve(c.b1, c.b2, c.F)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		es := estar(c.b1.Material, c.b2.Material)
		a := math.Cbrt(3 * c.F * c.R / (4 * es))
		p0 := 3 * c.F / (2 * math.Pi * a * a)
		delta := a * a / c.R
		for _, q := range []struct {
			what      string
			got, want float64
		}{
			{"E*", got.EStar, es},
			{"a", got.SemiMajor, a},
			{"b", got.SemiMinor, a},
			{"p0", got.PeakPressure, p0},
			{"mean pressure", got.MeanPressure, 2 * p0 / 3},
			{"δ", got.Approach, delta},
			{"stiffness", got.Stiffness, 3 * c.F / (2 * delta)},
			{"A", got.A, 1 / (2 * c.R)},
			{"B", got.B, 1 / (2 * c.R)},
		} {
			if d := relDiff(q.got, q.want); d > 1e-13 {
				t.Errorf("%s: %s = %.15g, want %.15g (rel %.2g)", c.name, q.what, q.got, q.want, d)
			}
		}
		if got.MajorAngle != 0 {
			t.Errorf("%s: MajorAngle = %v for a circle, want 0", c.name, got.MajorAngle)
		}
	}
}

// TestCrossedCylinders checks that two cylinders of equal radius R with
// crossed axes touch like a sphere of radius R on a flat (Johnson 1985,
// §4.2), and that unequal cylinders at 90° have A = 1/(2R_large),
// B = 1/(2R_small) with the major axis along the axis of the smaller
// cylinder (the gap is x²/(2R_large) + y²/(2R_small); Johnson 1985, §4.1).
func TestCrossedCylinders(t *testing.T) {
	const R, F = 0.004, 80.0
	m := Steel440C
	want, err := Solve(Sphere(R, m), Flat(m), F)
	if err != nil {
		t.Fatal(err)
	}
	for _, axis := range []float64{0, 0.3, 1, -2} {
		got, err := Solve(Cylinder(R, axis, m), Cylinder(R, axis+math.Pi/2, m), F)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range [][3]float64{
			{got.SemiMajor, want.SemiMajor}, {got.SemiMinor, want.SemiMinor},
			{got.PeakPressure, want.PeakPressure}, {got.Approach, want.Approach},
			{got.Stress[0].MaxShear, want.Stress[0].MaxShear},
		} {
			if d := relDiff(q[0], q[1]); d > 1e-12 {
				t.Errorf("axis %g: crossed cylinders %.15g, sphere on flat %.15g", axis, q[0], q[1])
			}
		}
	}
	// Unequal: R1 = 2 mm along x, R2 = 6 mm along y.
	got, err := Solve(Cylinder(0.002, 0, m), Cylinder(0.006, math.Pi/2, m), F)
	if err != nil {
		t.Fatal(err)
	}
	if relDiff(got.A, 1/(2*0.006)) > 1e-14 || relDiff(got.B, 1/(2*0.002)) > 1e-14 {
		t.Errorf("A, B = %v, %v; want %v, %v", got.A, got.B, 1/(2*0.006), 1/(2*0.002))
	}
	if math.Abs(got.MajorAngle) > 1e-15 && math.Abs(got.MajorAngle-math.Pi) > 1e-15 {
		t.Errorf("MajorAngle = %v, want 0 (along the axis of the 2 mm cylinder)", got.MajorAngle)
	}
}

// ellipseOnFlat returns a body that, on a flat, gives the half relative
// curvatures A = (1 − cosθ)/2 and B = (1 + cosθ)/2 (1/m), so that
// cos θ = (B − A)/(A + B) and A + B = 1.
func ellipseOnFlat(cosTheta float64, m Material) (Body, Body) {
	A, B := (1-cosTheta)/2, (1+cosTheta)/2
	return Toroid(1/(2*A), 1/(2*B), 0, m), Flat(m)
}

// TestTimoshenkoGoodierTable checks the coefficients m and n of
// Timoshenko & Goodier, Theory of Elasticity, 3rd ed. (1970), §140 (table
// for θ ≥ 30°), defined by a = m·[3πF(k1 + k2)/(4(A + B))]^(1/3), b = n·[…]
// with k_i = (1 − ν_i²)/(πE_i) and cos θ = (B − A)/(A + B). The table
// values are from memory and cannot be vouched for digit by digit: several
// differ by up to 0.002 from Roark's table at the same θ (interpolated),
// e.g. n(70°) = 0.802 here against 0.800 from Roark's β at cos θ = 0.342.
// They are therefore compared to ±0.0025, two units and a half in the
// printed third decimal; TestRoarkTable holds the tighter check.
func TestTimoshenkoGoodierTable(t *testing.T) {
	table := []struct{ theta, m, n float64 }{ // from memory
		{30, 2.731, 0.493}, {35, 2.397, 0.530}, {40, 2.136, 0.567},
		{45, 1.926, 0.604}, {50, 1.754, 0.641}, {55, 1.611, 0.678},
		{60, 1.486, 0.717}, {65, 1.378, 0.759}, {70, 1.284, 0.802},
		{75, 1.202, 0.846}, {80, 1.128, 0.893}, {85, 1.061, 0.944},
		{90, 1.000, 1.000},
	}
	const F = 10.0
	for _, row := range table {
		b1, b2 := ellipseOnFlat(math.Cos(row.theta*math.Pi/180), Steel52100)
		c, err := Solve(b1, b2, F)
		if err != nil {
			t.Fatal(err)
		}
		unit := math.Cbrt(3 * F / (4 * c.EStar * (c.A + c.B)))
		if m := c.SemiMajor / unit; math.Abs(m-row.m) > 0.0025 {
			t.Errorf("θ = %g°: m = %.4f, table %.3f", row.theta, m, row.m)
		}
		if n := c.SemiMinor / unit; math.Abs(n-row.n) > 0.0025 {
			t.Errorf("θ = %g°: n = %.4f, table %.3f", row.theta, n, row.n)
		}
	}
}

// TestRoarkTable checks the coefficients α, β, λ against cos θ of Roark's
// Formulas for Stress and Strain, 7th ed. (Young & Budynas 2002),
// Table 14.1, case 4 (general case): c = α(F K_D C_E)^(1/3),
// d = β(F K_D C_E)^(1/3), y = λ(F² C_E²/K_D)^(1/3), with
// K_D = 1.5/(1/R1 + 1/R1' + 1/R2 + 1/R2') = 0.75/(A + B), C_E = 1/E*. The
// table values are from memory; compared to one unit in the printed third
// decimal (±0.001), since a printed table may truncate rather than round.
func TestRoarkTable(t *testing.T) {
	table := []struct{ cos, alpha, beta, lambda float64 }{ // from memory
		{0.00, 1.000, 1.000, 0.750}, {0.10, 1.070, 0.936, 0.748},
		{0.20, 1.150, 0.878, 0.743}, {0.30, 1.242, 0.822, 0.734},
		{0.40, 1.351, 0.769, 0.721}, {0.50, 1.486, 0.717, 0.703},
		{0.60, 1.661, 0.664, 0.678}, {0.70, 1.905, 0.608, 0.644},
		{0.75, 2.072, 0.578, 0.622}, {0.80, 2.292, 0.544, 0.594},
		{0.85, 2.600, 0.507, 0.559}, {0.90, 3.093, 0.461, 0.510},
		{0.92, 3.396, 0.438, 0.484}, {0.94, 3.824, 0.412, 0.452},
		{0.96, 4.508, 0.378, 0.410}, {0.98, 5.937, 0.328, 0.345},
		{0.99, 7.774, 0.287, 0.288},
	}
	const F = 25.0
	for _, row := range table {
		b1, b2 := ellipseOnFlat(row.cos, Steel52100)
		c, err := Solve(b1, b2, F)
		if err != nil {
			t.Fatal(err)
		}
		KD := 0.75 / (c.A + c.B)
		CE := 1 / c.EStar
		unit := math.Cbrt(F * KD * CE)
		alpha, beta := c.SemiMajor/unit, c.SemiMinor/unit
		lambda := c.Approach / math.Cbrt(F*F*CE*CE/KD)
		if math.Abs(alpha-row.alpha) > 0.001 || math.Abs(beta-row.beta) > 0.001 || math.Abs(lambda-row.lambda) > 0.001 {
			t.Errorf("cos θ = %.2f: α, β, λ = %.4f, %.4f, %.4f; table %.3f, %.3f, %.3f",
				row.cos, alpha, beta, lambda, row.alpha, row.beta, row.lambda)
		}
	}
}
