// Command cassette designs the kinematic coupling of a detector cassette
// that is lifted off a benchtop spectrometer and put back on three balls.
//
// The cassette carries three 10 mm bearing-steel balls where its packaging
// allows them: an irregular triangle. The bench carries the seats. The
// program checks a draft layout, compares grooves aimed at the centroid
// with grooves on the bisectors of the ball triangle, chooses the grooves
// for the error at the detector around a cable port, catches a stray pad,
// and sizes one contact with Hertz theory. With -svg file.svg it also draws the layouts in plan.
//
// All scenario numbers are invented for this demonstration.
package main

import (
	"flag"
	"fmt"
	"log"
	"math"
	"os"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

const deg = math.Pi / 180

var up = r3.Vec{Z: 1}

// Ball centres on the cassette, m.
var balls = [3]kinematic.Ball{
	{Centre: r3.Vec{X: -0.060, Y: -0.035}, Radius: 5e-3, Material: hertz.Steel52100},
	{Centre: r3.Vec{X: 0.065, Y: -0.030}, Radius: 5e-3, Material: hertz.Steel52100},
	{Centre: r3.Vec{X: 0.010, Y: 0.055}, Radius: 5e-3, Material: hertz.Steel52100},
}

// The seats: 90° vees (flanks at 45° to the symmetry plane) and flats in
// hardened 440C.
var (
	vee  = kinematic.Vee{Up: up, HalfAngle: 45 * deg, Material: hertz.Steel440C}
	flat = kinematic.Flat{Up: up, Material: hertz.Steel440C}
)

func main() {
	log.SetFlags(0)
	svgPath := flag.String("svg", "", "also write a plan view of the layouts to this SVG file")
	flag.Parse()
	fmt.Println("Detector cassette on a benchtop spectrometer: kinematic coupling study")
	fmt.Println(strings.Repeat("=", 72))
	fmt.Print("Balls (radius 5.0 mm, AISI 52100) at:")
	for i, b := range balls {
		fmt.Printf("  %c (%.0f, %.0f) mm", 'A'+i, b.Centre.X*1e3, b.Centre.Y*1e3)
	}
	fmt.Println()
	fmt.Println("Seats: 90° vees and flats, 440C.")

	// 1. A draft: two parallel vees and a flat.
	draft := kinematic.Coupling{Pairs: []kinematic.Pair{
		{Name: "A", Ball: balls[0], Seat: withDirection(r3.Vec{X: 1})},
		{Name: "B", Ball: balls[1], Seat: withDirection(r3.Vec{X: 1})},
		{Name: "C", Ball: balls[2], Seat: flat},
	}}
	section("1. Draft: vees under A and B, both along x; a flat under C")
	constraint(must(draft.Contacts()))

	// 2. Vees aimed at the centroid of the balls.
	centroid := r3.Scale(1.0/3, r3.Add(balls[0].Centre, r3.Add(balls[1].Centre, balls[2].Centre)))
	aimed := must(kinematic.AimedVees(balls, centroid, [3]kinematic.Vee{vee, vee, vee}))
	section("2. Three vees aimed at the centroid of the balls")
	constraint(must(aimed.Contacts()))
	weakAimed := stability(must(aimed.Contacts()))
	layout(aimed)

	// 3. Vees on the bisectors of the ball triangle.
	bis := must(kinematic.BisectorVees(balls, [3]kinematic.Vee{vee, vee, vee}))
	section("3. Three vees on the bisectors of the ball triangle")
	constraint(must(bis.Contacts()))
	weakBis := stability(must(bis.Contacts()))
	layout(bis)
	fmt.Printf("Weakest Maxwell index: %.4f on the bisectors against %.4f aimed at the centroid.\n", weakBis, weakAimed)

	// 4. A cable port beside ball B keeps its groove at least 25° off
	// radial (towards +azimuth); the other grooves are free. The grooves
	// are chosen for what matters: the error at the detector, 40 mm above
	// the balls, with the Maxwell index kept above 0.9 as a screen.
	section("4. Grooves chosen for the error at the detector, around the cable port at ball B")
	all := kinematic.Window{Min: -90 * deg, Max: 90 * deg}
	scen := kinematic.Scenario{
		Point:    r3.Vec{X: 0.005, Y: -0.003, Z: 0.040},
		Axis:     up,
		Preloads: []kinematic.Preload{{Name: "clamp", Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 40}},
		Payload:  kinematic.Payload{Mass: 0.45, Centre: r3.Vec{Z: 0.025}, Inertia: [3][3]float64{{6e-4, 0, 0}, {0, 8e-4, 0}, {0, 0, 1.2e-3}}},
		Gravity:  r3.Vec{Z: -kinematic.StandardGravity},
		MinForce: 2,
		Thermal:  kinematic.Thermal{Moving: hertz.Aluminium6061T6.Alpha, Base: hertz.Steel440C.Alpha},
	}
	res := must(kinematic.Optimize(bis, scen, &kinematic.OptimizeOptions{
		Objective:  kinematic.MinAmplification,
		Windows:    []kinematic.Window{all, {Min: 25 * deg, Max: 90 * deg}, all},
		MinMaxwell: 0.9,
	}))
	for i, p := range res.Coupling.Pairs {
		fmt.Printf("groove %s: %+6.1f° from radial\n", p.Name, degrees(res.Azimuths[i]))
	}
	if len(res.Binding) > 0 {
		fmt.Printf("held back by: %s\n", strings.Join(res.Binding, ", "))
	}
	fmt.Printf("%-34s %12s %12s\n", "figure", "bisectors", "optimum")
	row := func(name string, a, b float64) { fmt.Printf("%-34s %12.4g %12.4g\n", name, a, b) }
	row("error at detector (µm per µm)", res.Bisector.Amplification, res.Score.Amplification)
	row("weakest Maxwell index (0 to 1)", res.Bisector.WeakestIndex, res.Score.WeakestIndex)
	row("shock level (g)", res.Bisector.ShockLevel/kinematic.StandardGravity, res.Score.ShockLevel/kinematic.StandardGravity)
	row("first frequency (Hz)", res.Bisector.FirstFrequency, res.Score.FirstFrequency)
	row("stiffness at detector (N/µm)", res.Bisector.Stiffness*1e-6, res.Score.Stiffness*1e-6)
	row("drift at detector (µm/K)", res.Bisector.Drift*1e6, res.Score.Drift*1e6)
	if res.BisectorFeasible {
		fmt.Println("the bisector layout is allowed; the optimum is at least as good at the detector")
	} else {
		fmt.Println("the port rules out the bisector layout")
	}
	stability(must(res.Coupling.Contacts()))

	// 5. A stray pad under ball C as well.
	section("5. The bisector layout with a stray pad under ball C")
	cs := must(bis.Contacts())
	pad := must(kinematic.Coupling{Pairs: []kinematic.Pair{{Name: "pad", Ball: balls[2], Seat: flat}}}.Contacts())
	constraint(append(cs, pad...))

	// 6. Hertz contact of one vee flank.
	section("6. One vee contact, ball on flank, at a nominal 15 N normal force")
	hertzContact(cs[0], 15)

	if *svgPath != "" {
		f, err := os.Create(*svgPath)
		if err != nil {
			log.Fatal(err)
		}
		err = writeSVG(f, []drawing{
			{"aimed at the centroid", aimed},
			{"on the bisectors", bis},
			{"optimised around the port", res.Coupling},
		})
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("\nPlan view written to %s\n", *svgPath)
	}

	fmt.Println()
	fmt.Println("Caution: these are engineering estimates from idealised models (rigid")
	fmt.Println("bodies, point contacts, Hertz theory, handbook material data). Verify by")
	fmt.Println("test, and let the applicable codes and a qualified engineer decide.")
}

// degrees returns the angle a in degrees, without a negative zero when
// printed to one decimal.
func degrees(a float64) float64 {
	d := a / deg
	if math.Abs(d) < 0.05 {
		return 0
	}
	return d
}

func withDirection(d r3.Vec) kinematic.Vee {
	v := vee
	v.Direction = d
	return v
}

func section(title string) {
	fmt.Printf("\n%s\n%s\n", title, strings.Repeat("-", len([]rune(title))))
}

// constraint prints the constraint analysis of a contact set.
func constraint(cs []kinematic.Contact) {
	an := must(kinematic.Analyze(cs))
	fmt.Printf("contacts %d, independent constraints %d, degrees of freedom %d; condition number %.1f (dimensionless)\n",
		len(cs), an.Rank, an.DOF, an.Condition)
	if an.NearSingular {
		fmt.Println("WARNING: near-singular: the constraint barely holds")
	}
	for i, t := range an.Free {
		ax := t.Axis()
		if math.IsInf(ax.Pitch, 1) {
			fmt.Printf("free motion %d: translation along the unit direction (%.3f, %.3f, %.3f)\n", i+1, ax.Dir.X, ax.Dir.Y, ax.Dir.Z)
			continue
		}
		fmt.Printf("free motion %d: rotation about the unit direction (%.3f, %.3f, %.3f) through (%.1f, %.1f, %.1f) mm, pitch %.3f mm/rad\n",
			i+1, ax.Dir.X, ax.Dir.Y, ax.Dir.Z, ax.Point.X*1e3, ax.Point.Y*1e3, ax.Point.Z*1e3, ax.Pitch*1e3)
	}
	for i, c := range an.Redundant {
		var terms []string
		for j, x := range c {
			if x != 0 {
				terms = append(terms, fmt.Sprintf("%+.3f·%s", x, cs[j].Label))
			}
		}
		fmt.Printf("redundant %d: %s = 0 (weights of unit contact forces; contacts %s fight each other)\n", i+1, strings.Join(terms, " "), strings.Join(an.Participants[i], ", "))
	}
	switch {
	case an.DOF == 0 && len(an.Redundant) == 0:
		fmt.Println("verdict: exactly constrained")
	case an.DOF > 0 && len(an.Redundant) == 0:
		fmt.Println("verdict: under-constrained: the cassette can move as listed")
	case an.DOF == 0:
		fmt.Println("verdict: over-constrained: the cassette rocks or strains the seats")
	default:
		fmt.Println("verdict: both free motions and redundant contacts")
	}
}

// explained records that the Maxwell index has been explained once.
var explained bool

// stability prints the Maxwell indices of a six-contact set and returns the
// weakest.
func stability(cs []kinematic.Contact) float64 {
	st := must(must(kinematic.Analyze(cs)).Stability())
	if !explained {
		fmt.Println("Maxwell index (dimensionless, 0 to 1): 1 when the motion freed by losing that")
		fmt.Println("contact lifts it straight off its surface, near 0 when it slides along it.")
		explained = true
	}
	fmt.Println("contact  at contact point  at ball centre")
	for i, m := range st.Contacts {
		mark := ""
		if i == st.Weakest {
			mark = "  <- weakest"
		}
		fmt.Printf("%-7s  %16.4f  %14.4f%s\n", m.Label, m.Index, m.CentreIndex, mark)
	}
	return st.Contacts[st.Weakest].Index
}

// layout prints where the grooves point and meet.
func layout(c kinematic.Coupling) {
	g := must(c.Geometry())
	for _, gr := range g.Grooves {
		fmt.Printf("groove %s: %+6.1f° from radial, %5.1f° off the bisector\n",
			c.Pairs[gr.Pair].Name, degrees(gr.Azimuth), degrees(gr.OffBisector))
	}
	fmt.Printf("grooves meet nearest (%.1f, %.1f) mm (RMS miss %.2f mm); incentre (%.1f, %.1f) mm, centroid (%.1f, %.1f) mm\n",
		g.Centre.X*1e3, g.Centre.Y*1e3, g.Spread*1e3, g.Incentre.X*1e3, g.Incentre.Y*1e3, g.Centroid.X*1e3, g.Centroid.Y*1e3)
}

// hertzContact prints the Hertz solution of a contact under a normal load.
func hertzContact(c kinematic.Contact, load float64) {
	h := must(hertz.Solve(c.Moving, c.Base, load))
	fmt.Printf("contact %s: %s on %s\n", c.Label, c.Moving.Material.Name, c.Base.Material.Name)
	fmt.Printf("contact ellipse %.1f × %.1f µm (semi-axes), approach %.2f µm, stiffness %.1f N/µm\n",
		h.SemiMajor*1e6, h.SemiMinor*1e6, h.Approach*1e6, h.Stiffness*1e-6)
	fmt.Printf("peak pressure %.0f MPa, mean %.0f MPa\n", h.PeakPressure*1e-6, h.MeanPressure*1e-6)
	for i, name := range []string{"ball:", "flank:"} {
		s := h.Stress[i]
		fmt.Printf("%-6s max shear %.0f MPa at %.1f µm depth, max von Mises %.0f MPa at %.1f µm\n",
			name, s.MaxShear*1e-6, s.MaxShearDepth*1e6, s.MaxVonMises*1e-6, s.MaxVonMisesDepth*1e6)
	}
	for _, m := range []hertz.Material{c.Moving.Material, c.Base.Material} {
		if m.Allowable > 0 {
			fmt.Printf("%s: allowable static contact pressure %.0f MPa (%s); margin %.1f×\n",
				m.Name, m.Allowable*1e-6, "ISO 76:2006", m.Allowable/h.PeakPressure)
		} else {
			fmt.Printf("%s: no allowable pressure on file; set one from your own data\n", m.Name)
		}
	}
	if !h.Valid {
		fmt.Println("WARNING: the contact is large against the radii; Hertz theory is stretched")
	}
}

// must returns v, or stops the program with err.
func must[T any](v T, err error) T {
	if err != nil {
		log.Fatal(err)
	}
	return v
}
