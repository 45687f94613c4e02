package kinematic_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// closureMount returns the contacts of a mirror mount on three 10 mm balls,
// 50 mm from its axis, in 90° vees along the bisectors.
func closureMount(half float64) []kinematic.Contact {
	var balls [3]kinematic.Ball
	for i := range balls {
		a := (90 + 120*float64(i)) * math.Pi / 180
		balls[i] = kinematic.Ball{Centre: r3.Vec{X: 0.05 * math.Cos(a), Y: 0.05 * math.Sin(a)}, Radius: 5e-3}
	}
	vee := kinematic.Vee{Up: r3.Vec{Z: 1}, HalfAngle: half}
	c, err := kinematic.BisectorVees(balls, [3]kinematic.Vee{vee, vee, vee})
	if err != nil {
		log.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		log.Fatal(err)
	}
	return cs
}

// A mirror mount sits on three balls in 90° vees. Six contacts locate it
// exactly but cannot hold it against a pull: form closure needs seven. A
// spring plunger pressing down on the axis of the mount closes it; the
// margin, worked by hand, is 7√(13/6)/(6√(13/6) + 6 sin 45°) = 0.7881 (the
// least-loaded contact of the most even self-balancing preload carries 79 %
// of the mean). Moved to a bracket 80 mm off the axis, outside the ball
// triangle, the plunger would tip the mount instead.
func ExampleFormClosure() {
	cs := closureMount(math.Pi / 4)
	report := func(name string, cs []kinematic.Contact) {
		cl, err := kinematic.FormClosure(cs)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("%-22s closed %-5v rank %d margin %.4f\n", name, cl.Closed, cl.Rank, cl.Margin)
	}
	report("three vees", cs)
	plunger := func(x float64) []kinematic.Contact {
		return append(cs[:6:6], kinematic.Contact{Label: "plunger", Point: r3.Vec{X: x, Z: 0.02}, Normal: r3.Vec{Z: -1}})
	}
	report("plunger on the axis", plunger(0))
	report("plunger 80 mm out", plunger(0.08))
	// Output:
	// three vees             closed false rank 6 margin 0.0000
	// plunger on the axis    closed true  rank 6 margin 0.7881
	// plunger 80 mm out      closed false rank 6 margin 0.0000
}

// The same mount on 120° vees (each normal leans 30° from the horizontal)
// relies on friction instead of a plunger. It holds against a pull only if
// friction can push a flank's contact down its slope: μ > tan 30° = 0.577.
// A vee's contacts carry the groove direction as their Tangent, so an edge
// of the default octagonal pyramid points straight down each slope and the
// threshold is exactly that; pyramids turned by half a side would need
// tan 30°/cos 22.5° = 0.625.
func ExampleForceClosure() {
	cs := closureMount(math.Pi / 6)
	for _, mu := range []float64{0.3, 0.55, 0.6, 0.8} {
		cl, err := kinematic.ForceClosure(cs, mu, nil)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("μ = %.2f: closed %v\n", mu, cl.Closed)
	}
	// Output:
	// μ = 0.30: closed false
	// μ = 0.55: closed false
	// μ = 0.60: closed true
	// μ = 0.80: closed true
}
