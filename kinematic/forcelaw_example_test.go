package kinematic_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// Two N42 magnets of 12 × 12 × 4 mm, one in a 0.15 kg carrier and one in
// the base, face each other across a 0.6 mm clearance and hold the carrier
// on three vees. The pull falls as the carrier lifts, so the shock at which
// the first contact opens is also the one at which the carrier runs away;
// a spring of the same force that grows as the part lifts would pull it
// back (Runaway +Inf).
func ExampleMagnetPair() {
	n42 := kinematic.Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: kinematic.RemanenceN42}
	pair := kinematic.MagnetPair{Moving: n42, Base: n42}
	f, slope, err := pair.Force(0.6e-3)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("pull %.1f N at 0.6 mm, dF/dgap %.1f N/mm\n", f, slope*1e-3)

	var balls [3]kinematic.Ball
	for i := range balls {
		a := (90 + 120*float64(i)) * math.Pi / 180
		balls[i] = kinematic.Ball{Centre: r3.Vec{X: 0.04 * math.Cos(a), Y: 0.04 * math.Sin(a)}, Radius: 4e-3, Material: hertz.Steel52100}
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
	magnets := kinematic.Preload{Name: "magnets", Point: r3.Vec{Z: -0.003}, Direction: r3.Vec{Z: -1}, Law: pair, Gap: 0.6e-3}
	payload := kinematic.Payload{Mass: 0.15, Centre: r3.Vec{Z: 0.015}}
	m, err := kinematic.NewModel(cs, []kinematic.Preload{magnets}, payload)
	if err != nil {
		log.Fatal(err)
	}
	g := kinematic.StandardGravity
	s, err := m.Shock(kinematic.LoadCase{Gravity: r3.Vec{Z: -g}}, 10*g)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("first contact opens at %.2f g, the carrier runs away at %.2f g\n", s.Unload/g, s.Runaway/g)
	// Output:
	// pull 29.8 N at 0.6 mm, dF/dgap -14.2 N/mm
	// first contact opens at 9.02 g, the carrier runs away at 9.02 g
}
