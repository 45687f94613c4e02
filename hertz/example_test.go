package hertz_test

import (
	"fmt"
	"math"

	"github.com/sixfold-dev/sixfold/hertz"
)

// A detector cassette on a benchtop spectrometer rests on three 10 mm
// bearing balls in 90° vees of hardened 440C. A 90 N preload puts 30 N on
// each ball, shared by two flanks at 45°: each flat flank carries
// 30/(2 cos 45°) ≈ 21.2 N along its normal.
func ExampleSolve_veeFlank() {
	ball := hertz.Sphere(0.005, hertz.Steel52100)
	flank := hertz.Flat(hertz.Steel440C)
	load := 30 / (2 * math.Cos(math.Pi/4))
	c, err := hertz.Solve(ball, flank, load)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("flank load       %.2f N\n", c.Load)
	fmt.Printf("contact radius   %.1f µm\n", c.SemiMajor*1e6)
	fmt.Printf("peak pressure    %.0f MPa (ISO 76 allowable %.0f MPa)\n", c.PeakPressure/1e6, hertz.Steel52100.Allowable/1e6)
	fmt.Printf("approach         %.3f µm\n", c.Approach*1e6)
	fmt.Printf("normal stiffness %.1f N/µm\n", c.Stiffness/1e6)
	fmt.Printf("max shear        %.0f MPa at %.1f µm in the ball\n", c.Stress[0].MaxShear/1e6, c.Stress[0].MaxShearDepth*1e6)
	fmt.Printf("half-space valid %v\n", c.Valid)
	// Output:
	// flank load       21.21 N
	// contact radius   89.4 µm
	// peak pressure    1267 MPa (ISO 76 allowable 4200 MPa)
	// approach         1.599 µm
	// normal stiffness 19.9 N/µm
	// max shear        393 MPa at 43.0 µm in the ball
	// half-space valid true
}

// The same ball in a gothic-arch groove whose flanks are cylinders of
// 5.2 mm radius (conformity 0.52), groove axis along x: the conforming
// flank spreads the contact across the groove and lowers the pressure.
// (The ellipse, pressure and stiffness agree with an independent
// evaluation of Johnson 1985, §3.5, by bisection on k' = b/a with K and E
// from the arithmetic–geometric mean, Abramowitz & Stegun 17.6: 389.97 ×
// 47.93 µm, 541.8 MPa, 39.05 N/µm.)
func ExampleSolve_groove() {
	ball := hertz.Sphere(0.005, hertz.Steel52100)
	flank := hertz.Groove(0.0052, 0, hertz.Steel440C)
	c, err := hertz.Solve(ball, flank, 21.21)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("semi-axes        %.1f × %.1f µm\n", c.SemiMajor*1e6, c.SemiMinor*1e6)
	fmt.Printf("major axis at    %.0f° (across the groove)\n", c.MajorAngle*180/math.Pi)
	fmt.Printf("B/A              %.1f\n", c.B/c.A)
	fmt.Printf("peak pressure    %.0f MPa\n", c.PeakPressure/1e6)
	fmt.Printf("normal stiffness %.1f N/µm\n", c.Stiffness/1e6)
	fmt.Printf("max von Mises    %.0f MPa at %.1f µm in the flank\n", c.Stress[1].MaxVonMises/1e6, c.Stress[1].MaxVonMisesDepth*1e6)
	fmt.Printf("half-space valid %v\n", c.Valid)
	// Output:
	// semi-axes        390.0 × 47.9 µm
	// major axis at    90° (across the groove)
	// B/A              26.0
	// peak pressure    542 MPa
	// normal stiffness 39.1 N/µm
	// max von Mises    316 MPa at 33.7 µm in the flank
	// half-space valid true
}

// The preload that brings a ball-on-flat contact to the ISO 76 static
// limit.
func ExampleLoadForPressure() {
	ball := hertz.Sphere(0.005, hertz.Steel52100)
	flat := hertz.Flat(hertz.Steel52100)
	F, err := hertz.LoadForPressure(ball, flat, hertz.Steel52100.Allowable)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.0f N\n", F)
	// Output:
	// 733 N
}

// A stiffness study sweeps the preload on one vee flank: the bodies are
// validated and the contact shape solved once by NewPair, then each load
// costs one Pair.Contact. (The numbers agree with Hertz's closed forms for
// a ball on a flat, Johnson 1985, §4.2: a³ = 3FR/(4E*), δ = a²/R,
// k = 3F/(2δ), evaluated independently with E* = 111.3 GPa.)
func ExampleNewPair() {
	p, err := hertz.NewPair(hertz.Sphere(0.005, hertz.Steel52100), hertz.Flat(hertz.Steel440C))
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, load := range []float64{5, 10, 20, 40} {
		c, err := p.Contact(load)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("%2.0f N: a %6.2f µm, δ %.4f µm, k %5.2f N/µm, p0 %4.0f MPa\n",
			load, c.SemiMajor*1e6, c.Approach*1e6, c.Stiffness/1e6, c.PeakPressure/1e6)
	}
	// Output:
	//  5 N: a  55.23 µm, δ 0.6100 µm, k 12.30 N/µm, p0  783 MPa
	// 10 N: a  69.58 µm, δ 0.9683 µm, k 15.49 N/µm, p0  986 MPa
	// 20 N: a  87.67 µm, δ 1.5370 µm, k 19.52 N/µm, p0 1243 MPa
	// 40 N: a 110.45 µm, δ 2.4399 µm, k 24.59 N/µm, p0 1566 MPa
}

// The same flank under a tangential load that an operator's push puts on
// it, with friction 0.15: the contact creeps by micro-slip on loading,
// springs back less on unloading, and is left displaced when the push is
// gone; each further push and release loses a little energy. (By hand
// from Johnson 1985, §7.4, with c = 3μP/(16G*a) = 1.5μP/k0 ≈ 288.7 nm:
// loading c[1 − 0.5^(2/3)] = 0.37004c = 106.8 nm, unloading to zero
// c[2·0.75^(2/3) − 0.5^(2/3) − 1] = 0.02100c = 6.06 nm.)
func ExampleContact_Slip() {
	c, err := hertz.Solve(hertz.Sphere(0.005, hertz.Steel52100), hertz.Flat(hertz.Steel440C), 30/(2*math.Cos(math.Pi/4)))
	if err != nil {
		fmt.Println(err)
		return
	}
	const mu = 0.15
	s, err := c.Slip(mu)
	if err != nil {
		fmt.Println(err)
		return
	}
	push := 0.5 * mu * c.Load // half the sliding limit
	d1, _ := s.Step(push)
	d0, _ := s.Step(0)
	w, _ := c.SlipEnergy(mu, push)
	fmt.Printf("no-slip stiffness   %.1f N/µm\n", 8*c.GStar*c.SemiMajor/1e6)
	fmt.Printf("push %.3f N: moves  %.2f nm\n", push, d1*1e9)
	fmt.Printf("released: left at   %.2f nm\n", d0*1e9)
	fmt.Printf("loss per ±push      %.3g J\n", w)
	// Output:
	// no-slip stiffness   16.5 N/µm
	// push 1.591 N: moves  106.84 nm
	// released: left at   6.06 nm
	// loss per ±push      2.59e-08 J
}
