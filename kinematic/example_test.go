package kinematic_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// A filter-wheel carrier sits on three 8 mm balls placed where the housing
// allows: an irregular triangle. Grooves on the bisectors of the ball
// triangle meet at its incentre, and with 90° vees the motion each contact
// holds back moves the ball centre straight along that contact's normal:
// the ideal centre index of 1. (Index, at the contact point, adds the
// sliding of the ball's surface and is slightly lower.) The incentre,
// worked by hand (vertices weighted by the opposite sides, 79.06, 78.10
// and 95.13 mm), is (3.26, 1.08) mm.
func ExampleBisectorVees() {
	balls := [3]kinematic.Ball{
		{Centre: r3.Vec{X: -0.045, Y: -0.020}, Radius: 4e-3, Material: hertz.SiliconNitride},
		{Centre: r3.Vec{X: 0.050, Y: -0.025}, Radius: 4e-3, Material: hertz.SiliconNitride},
		{Centre: r3.Vec{X: 0.005, Y: 0.040}, Radius: 4e-3, Material: hertz.SiliconNitride},
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
	an, err := kinematic.Analyze(cs)
	if err != nil {
		log.Fatal(err)
	}
	st, err := an.Stability()
	if err != nil {
		log.Fatal(err)
	}
	g, err := c.Geometry()
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("degrees of freedom: %d\n", an.DOF)
	fmt.Printf("grooves meet at (%.2f, %.2f) mm\n", g.Centre.X*1e3, g.Centre.Y*1e3)
	for _, m := range st.Contacts {
		fmt.Printf("%s centre index %.4f\n", m.Label, m.CentreIndex)
	}
	// Output:
	// degrees of freedom: 0
	// grooves meet at (3.26, 1.08) mm
	// A+ centre index 1.0000
	// A- centre index 1.0000
	// B+ centre index 1.0000
	// B- centre index 1.0000
	// C+ centre index 1.0000
	// C- centre index 1.0000
}

// The same carrier holds a filter whose centre, 30 mm above the balls,
// must come back to the same place. A cable port beside ball B forbids
// grooves within 20° of radial there. The optimiser turns the grooves to
// the layout that moves the filter's centre least per micrometre of seat
// error, inside the windows, and reports the bisector layout beside it.
func ExampleOptimize() {
	balls := [3]kinematic.Ball{
		{Centre: r3.Vec{X: -0.045, Y: -0.020}, Radius: 4e-3},
		{Centre: r3.Vec{X: 0.050, Y: -0.025}, Radius: 4e-3},
		{Centre: r3.Vec{X: 0.005, Y: 0.040}, Radius: 4e-3},
	}
	vee := kinematic.Vee{Up: r3.Vec{Z: 1}, HalfAngle: math.Pi / 4}
	c, err := kinematic.BisectorVees(balls, [3]kinematic.Vee{vee, vee, vee})
	if err != nil {
		log.Fatal(err)
	}
	const deg = math.Pi / 180
	all := kinematic.Window{Min: -90 * deg, Max: 90 * deg}
	res, err := kinematic.Optimize(c, kinematic.Scenario{Point: r3.Vec{Z: 0.03}}, &kinematic.OptimizeOptions{
		Objective: kinematic.MinAmplification,
		Windows:   []kinematic.Window{all, {Min: 20 * deg, Max: 90 * deg}, all},
	})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("bisectors allowed: %v\n", res.BisectorFeasible)
	fmt.Printf("groove B at least 20° off radial: %v\n", res.Azimuths[1] >= 20*deg-1e-9)
	fmt.Printf("no worse than the layout as drawn: %v\n", res.Score.Amplification <= res.Start.Amplification)
	// Output:
	// bisectors allowed: false
	// groove B at least 20° off radial: true
	// no worse than the layout as drawn: true
}

// The filter-wheel carrier, clamped with 40 N, is pushed sideways with
// 2 N at the filter's centre, 30 mm above the balls, then the other way,
// then let go. Friction (μ = 0.1) at the six contacts slips a little on
// each push, and the filter does not come all the way back: the residual
// is the hysteresis of the mount.
func ExampleModel_Hysteresis() {
	balls := [3]kinematic.Ball{
		{Centre: r3.Vec{X: -0.045, Y: -0.020}, Radius: 4e-3, Material: hertz.SiliconNitride},
		{Centre: r3.Vec{X: 0.050, Y: -0.025}, Radius: 4e-3, Material: hertz.SiliconNitride},
		{Centre: r3.Vec{X: 0.005, Y: 0.040}, Radius: 4e-3, Material: hertz.SiliconNitride},
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
	clamp := kinematic.Preload{Name: "clamp", Point: r3.Vec{X: 0.003, Y: 0.001, Z: 0.01}, Direction: r3.Vec{Z: -1}, Force: 40}
	m, err := kinematic.NewModel(cs, []kinematic.Preload{clamp}, kinematic.Payload{})
	if err != nil {
		log.Fatal(err)
	}
	filter := r3.Vec{X: 0.003, Y: 0.001, Z: 0.03}
	var steps []kinematic.CycleStep
	for k := 1; k <= 80; k++ { // 0 → 2 N → −2 N → 0 along x, in steps of 0.1 N
		f := 0.1 * float64(k)
		switch {
		case k > 60:
			f = 0.1 * float64(k-80)
		case k > 20:
			f = 0.1 * float64(40-k)
		}
		steps = append(steps, kinematic.CycleStep{Force: r3.Vec{X: f}, Point: filter})
	}
	h, err := m.Hysteresis(kinematic.LoadCase{Name: "clamped"}, steps, 0.1, filter)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("under +2 N the filter moves %.1f nm along x\n", h.Path[19].Displacement.X*1e9)
	fmt.Printf("after the cycle it is left %.2f nm along x, tilted %.1f nrad\n", h.Residual.X*1e9, r3.Norm(h.ResidualTilt)*1e9)
	fmt.Printf("energy lost per cycle %.2g J\n", h.Energy)
	// Output:
	// under +2 N the filter moves 42.7 nm along x
	// after the cycle it is left -0.99 nm along x, tilted 10.2 nrad
	// energy lost per cycle 5.4e-09 J
}
