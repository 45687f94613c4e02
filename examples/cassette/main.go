// Command cassette checks the constraint of a detector cassette that is
// lifted off a benchtop spectrometer and put back on three balls.
//
// The cassette carries three 10 mm balls; the bench carries the seats. The
// program compares three seat layouts: a draft with two parallel vees and a
// flat, the corrected three-vee layout, and the three vees with a stray
// fourth pad. For each it prints the number of independent constraints, the
// motions left free (as screw axes) and the redundant constraints.
//
// All scenario numbers are invented for this demonstration.
package main

import (
	"fmt"
	"log"
	"math"
	"os"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/screw"
)

// contact is a point contact: where it touches, the unit normal along which
// the bench pushes the cassette, and a label for the report.
type contact struct {
	label string
	p, n  r3.Vec
}

const (
	ballRadius = 5e-3               // m
	halfAngle  = 45 * math.Pi / 180 // flank to symmetry plane, rad
)

var up = r3.Vec{Z: 1}

// Ball centres on the cassette, m, set by the detector's packaging: an
// irregular triangle, not the textbook equilateral one.
var balls = [3]r3.Vec{
	{X: -0.060, Y: -0.035, Z: 0},
	{X: 0.065, Y: -0.030, Z: 0},
	{X: 0.010, Y: 0.055, Z: 0},
}

// vee returns the two contacts of a ball in a vee groove with the given
// horizontal direction: each flank leans halfAngle from the vertical
// symmetry plane, so its normal leans halfAngle from the vertical.
func vee(name string, c, groove r3.Vec) []contact {
	g := r3.Unit(groove)
	side := r3.Cross(up, g)
	var cs []contact
	for _, sgn := range []float64{1, -1} {
		n := r3.Add(r3.Scale(math.Sin(halfAngle), up), r3.Scale(-sgn*math.Cos(halfAngle), side))
		label := name + "+"
		if sgn < 0 {
			label = name + "-"
		}
		cs = append(cs, contact{label, r3.Sub(c, r3.Scale(ballRadius, n)), n})
	}
	return cs
}

// flat returns the contact of a ball on a horizontal pad.
func flat(name string, c r3.Vec) []contact {
	return []contact{{name, r3.Sub(c, r3.Scale(ballRadius, up)), up}}
}

func main() {
	centroid := r3.Scale(1.0/3, r3.Add(balls[0], r3.Add(balls[1], balls[2])))
	toCentre := func(i int) r3.Vec { return r3.Sub(centroid, balls[i]) }

	layouts := []struct {
		title    string
		contacts []contact
	}{
		{"Draft: two parallel vees and a flat", join(
			vee("A", balls[0], r3.Vec{X: 1}),
			vee("B", balls[1], r3.Vec{X: 1}),
			flat("C", balls[2]),
		)},
		{"Three vees aimed at the centroid", join(
			vee("A", balls[0], toCentre(0)),
			vee("B", balls[1], toCentre(1)),
			vee("C", balls[2], toCentre(2)),
		)},
		{"Three vees plus a stray pad under ball C", join(
			vee("A", balls[0], toCentre(0)),
			vee("B", balls[1], toCentre(1)),
			vee("C", balls[2], toCentre(2)),
			flat("pad", balls[2]),
		)},
	}

	fmt.Println("Detector cassette on a benchtop spectrometer: constraint check")
	fmt.Printf("Balls of radius %.1f mm at (mm):", ballRadius*1e3)
	for i, b := range balls {
		fmt.Printf(" %c(%.0f, %.0f, %.0f)", 'A'+i, b.X*1e3, b.Y*1e3, b.Z*1e3)
	}
	fmt.Printf("\nVee flanks at %.0f° to the symmetry plane.\n", halfAngle*180/math.Pi)
	for _, l := range layouts {
		if err := report(l.title, l.contacts); err != nil {
			log.Print(err)
			os.Exit(1)
		}
	}
}

func join(groups ...[]contact) []contact {
	var all []contact
	for _, g := range groups {
		all = append(all, g...)
	}
	return all
}

func report(title string, cs []contact) error {
	ws := make([]screw.Wrench, len(cs))
	for i, c := range cs {
		w, err := screw.Line(c.p, c.n)
		if err != nil {
			return fmt.Errorf("contact %s: %w", c.label, err)
		}
		ws[i] = w
	}
	an, err := screw.Analyze(ws)
	if err != nil {
		return err
	}
	fmt.Printf("\n== %s\n", title)
	fmt.Printf("contacts: %d   independent constraints: %d   degrees of freedom: %d\n",
		len(cs), an.Rank, len(an.Free))
	fmt.Printf("condition number: %.1f (characteristic length %.1f mm)", an.Condition, an.Length*1e3)
	if an.NearSingular {
		fmt.Print("   WARNING: near-singular")
	}
	fmt.Println()
	for i, t := range an.Free {
		ax := t.Axis()
		if math.IsInf(ax.Pitch, 1) {
			fmt.Printf("free motion %d: translation along (%.3f, %.3f, %.3f)\n", i+1, ax.Dir.X, ax.Dir.Y, ax.Dir.Z)
			continue
		}
		fmt.Printf("free motion %d: rotation about (%.3f, %.3f, %.3f) through (%.2f, %.2f, %.2f) mm, pitch %.3f mm/rad\n",
			i+1, ax.Dir.X, ax.Dir.Y, ax.Dir.Z, ax.Point.X*1e3, ax.Point.Y*1e3, ax.Point.Z*1e3, ax.Pitch*1e3)
	}
	for i, c := range an.Redundant {
		var terms []string
		for j, x := range c {
			if x != 0 {
				terms = append(terms, fmt.Sprintf("%+.3f·%s", x, cs[j].label))
			}
		}
		fmt.Printf("redundancy %d: %s = 0\n", i+1, strings.Join(terms, " "))
	}
	switch {
	case len(an.Free) == 0 && len(an.Redundant) == 0:
		fmt.Println("verdict: exactly constrained")
	case len(an.Free) > 0 && len(an.Redundant) == 0:
		fmt.Println("verdict: under-constrained: the cassette can move as listed")
	case len(an.Free) == 0:
		fmt.Println("verdict: over-constrained: the redundant contacts fight each other")
	default:
		fmt.Println("verdict: both free motions and redundant contacts")
	}
	return nil
}
