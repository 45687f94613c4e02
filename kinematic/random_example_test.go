package kinematic_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// A 0.8 kg filter module on three 10 mm balls in 90° vees on a 50 mm
// circle, held down by a 60 N clamp, is shipped on a truck: a spectrum of
// 0.01 g²/Hz from 10 to 500 Hz (2.2 grms) for 30 minutes along x. The
// modes sit above the band, so the payload follows the base almost
// rigidly, but the sideways inertia load acts 30 mm above the balls and
// rocks the module: the clamp leaves the least loaded flank a margin of
// 1.6 σ, and it opens many times. RandomPreload gives the clamp force for
// a margin of 3 σ (which still opens in a long test: ask for the
// expected openings you accept, not only for k σ).
func ExampleModel_Random() {
	var balls [3]kinematic.Ball
	for i := range balls {
		a := (90 + 120*float64(i)) * math.Pi / 180
		balls[i] = kinematic.Ball{Centre: r3.Vec{X: 0.05 * math.Cos(a), Y: 0.05 * math.Sin(a)}, Radius: 5e-3, Material: hertz.Steel52100}
	}
	vee := kinematic.Vee{Up: r3.Vec{Z: 1}, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	c, err := kinematic.BisectorVees(balls, [3]kinematic.Vee{vee, vee, vee})
	if err != nil {
		log.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		log.Fatal(err)
	}
	clamp := kinematic.Preload{Name: "clamp", Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}
	payload := kinematic.Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03},
		Inertia: [3][3]float64{{6e-4, 0, 0}, {0, 6e-4, 0}, {0, 0, 1e-3}}}
	m, err := kinematic.NewModel(cs, []kinematic.Preload{clamp}, payload)
	if err != nil {
		log.Fatal(err)
	}
	truck := kinematic.Spectrum{Points: []kinematic.Breakpoint{{Frequency: 10, ASD: 0.01}, {Frequency: 500, ASD: 0.01}}}
	grms, err := truck.GRMS()
	if err != nil {
		log.Fatal(err)
	}
	lc := kinematic.LoadCase{Name: "shipping", Gravity: r3.Vec{Z: -kinematic.StandardGravity}}
	opt := &kinematic.RandomOptions{Q: []float64{20}, Direction: r3.Vec{X: 1}, Duration: 1800, Point: r3.Vec{Z: 0.04}}
	r, err := m.Random(lc, truck, opt)
	if err != nil {
		log.Fatal(err)
	}
	least := r.Contacts[r.Least]
	fmt.Printf("input %.2f grms; first mode %.0f Hz\n", grms, r.Modes[0])
	fmt.Printf("least margin %.1f σ at %s; expected openings %.1g\n", least.Margin, least.Label, least.Openings)
	p, err := m.RandomPreload(lc, truck, opt)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("clamp for 3 σ: %.1f N (Hertz stiffness followed)\n", p.Hertz*clamp.Force)
	// Output:
	// input 2.21 grms; first mode 769 Hz
	// least margin 1.6 σ at B+; expected openings 2e+05
	// clamp for 3 σ: 116.1 N (Hertz stiffness followed)
}
