package screw_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/screw"
)

// A filter wheel hub sits on five point contacts: three under its flange and
// two against the side of its shaft, all lines meeting the shaft axis. The
// analysis finds the one motion left free, the spin about the shaft.
func ExampleAnalyze() {
	const r = 0.02 // flange contact radius, m
	var ws []screw.Wrench
	for _, deg := range []float64{90, 210, 330} {
		a := deg * math.Pi / 180
		w, err := screw.Line(r3.Vec{X: r * math.Cos(a), Y: r * math.Sin(a)}, r3.Vec{Z: 1})
		if err != nil {
			log.Fatal(err)
		}
		ws = append(ws, w)
	}
	// Shaft contacts at 5 mm radius, 10 mm up, pushing in x and in y.
	for _, c := range []struct{ p, n r3.Vec }{
		{r3.Vec{X: -0.005, Z: 0.01}, r3.Vec{X: 1}},
		{r3.Vec{Y: -0.005, Z: 0.01}, r3.Vec{Y: 1}},
	} {
		w, err := screw.Line(c.p, c.n)
		if err != nil {
			log.Fatal(err)
		}
		ws = append(ws, w)
	}

	an, err := screw.Analyze(ws)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("constraints: %d, free motions: %d\n", an.Rank, len(an.Free))
	ax := an.Free[0].Axis()
	fmt.Printf("free: rotation about (%.0f, %.0f, %.0f) through (%.1f, %.1f) mm, pitch %.1f mm/rad\n",
		ax.Direction.X, ax.Direction.Y, ax.Direction.Z, ax.Point.X*1e3, ax.Point.Y*1e3, ax.Pitch*1e3)
	// Output:
	// constraints: 5, free motions: 1
	// free: rotation about (0, 0, 1) through (0.0, 0.0) mm, pitch 0.0 mm/rad
}

// A helical motion: 3 rad/s about the z axis while advancing 0.5 mm per
// turn. Its pitch is the lead per radian.
func ExampleTwist_Axis() {
	const lead = 0.5e-3 // m per turn
	t := screw.Twist{W: r3.Vec{Z: 3}, V: r3.Vec{Z: 3 * lead / (2 * math.Pi)}}
	ax := t.Axis()
	fmt.Printf("pitch %.4f mm/rad, lead %.2f mm/turn\n", ax.Pitch*1e3, ax.Pitch*2*math.Pi*1e3)
	// Output:
	// pitch 0.0796 mm/rad, lead 0.50 mm/turn
}

// A unit force along the z axis through (10, 0, 0) mm, and the power it
// develops on a rotation about the y axis.
func ExampleLine() {
	w, err := screw.Line(r3.Vec{X: 0.01}, r3.Vec{Z: 1})
	if err != nil {
		log.Fatal(err)
	}
	spin := screw.Twist{W: r3.Vec{Y: 1}} // 1 rad/s about y through the origin
	fmt.Printf("F = %v N, M = (%.3f, %.3f, %.3f) N·m\n", w.F, w.M.X, w.M.Y, w.M.Z)
	fmt.Printf("power %.3f W\n", screw.Power(spin, w))
	// Output:
	// F = {0 0 1} N, M = (0.000, -0.010, 0.000) N·m
	// power -0.010 W
}
