package design_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// A column rises through the middle of the bench fixture, so no groove
// may point at the centre: a keep-out at the origin with 20° of
// clearance. The fixture's balls sit at 50 mm from the origin, A on +y,
// so A's groove may not lie within 20° of the y axis: from the frame's x
// axis it keeps to 110° to 250° (the line to the column at 90°, ± 20°,
// taken modulo 180°: a groove is a line). From B at (−43.3, −25) mm the
// column lies at 30° and from C at (43.3, −25) mm at 150°, leaving 50° to
// 190° and 170° to 310°. The optimiser chooses inside those windows, and the design
// it returns is written by Design.Write.
func ExampleBuilt_Optimize() {
	d, err := design.Parse(fixture)
	if err != nil {
		log.Fatal(err)
	}
	d.Packaging = &design.Packaging{KeepOuts: []kinematic.KeepOut{{Name: "column", Clearance: 20 * math.Pi / 180}}}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	o, err := b.OptimizeOptions()
	if err != nil {
		log.Fatal(err)
	}
	for i, w := range o.Windows {
		fmt.Printf("groove %s: %.1f° to %.1f°\n", b.Coupling().Pairs[i].Name, w.Min*180/math.Pi, w.Max*180/math.Pi)
	}
	best, optimised, err := b.Optimize()
	if err != nil {
		log.Fatal(err)
	}
	for i, p := range best.Coupling.Pairs {
		// The angle between the groove and the line to the column.
		g := r3.Unit(p.Seat.(kinematic.Vee).Direction)
		u := r3.Unit(r3.Scale(-1, p.Ball.Centre))
		off := math.Acos(math.Min(1, math.Abs(r3.Dot(g, u)))) * 180 / math.Pi
		fmt.Printf("groove %s at least 20° off the column: %v; written back: %v\n", p.Name, off >= 20-1e-9, optimised.Seats[i].Direction != r3.Vec{})
	}
	// Output:
	// groove A: 110.0° to 250.0°
	// groove B: 50.0° to 190.0°
	// groove C: 170.0° to 310.0°
	// groove A at least 20° off the column: true; written back: true
	// groove B at least 20° off the column: true; written back: true
	// groove C at least 20° off the column: true; written back: true
}
