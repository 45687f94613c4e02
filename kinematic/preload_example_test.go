package kinematic_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// A 0.8 kg filter module sits on three 10 mm balls in 90° vees on a 50 mm
// circle, held down by one 60 N clamp on its axis. By symmetry each flank
// carries P/(6 sin 45°) = 14.14 N. To keep every flank at 2 N or more
// even with the instrument upside down, the clamp needs
// 6·2·sin 45° + mg = 8.49 + 7.85 = 16.33 N (both worked by hand).
func ExampleModel_SizePreload() {
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
	m, err := kinematic.NewModel(cs, []kinematic.Preload{clamp}, kinematic.Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}})
	if err != nil {
		log.Fatal(err)
	}
	s, err := m.Statics(kinematic.LoadCase{Name: "clamped", PreloadFactor: 1})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("flank A+ carries %.2f N\n", s.Contacts[0].Force)
	g := kinematic.StandardGravity
	sz, err := m.SizePreload([]kinematic.LoadCase{
		{Name: "upright", Gravity: r3.Vec{Z: -g}},
		{Name: "inverted", Gravity: r3.Vec{Z: g}},
	}, 2)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("smallest clamp force %.2f N (binding: %s)\n", sz.Total, sz.MinBinding.Case)
	// Output:
	// flank A+ carries 14.14 N
	// smallest clamp force 16.33 N (binding: inverted)
}
