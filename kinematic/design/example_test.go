package design_test

import (
	"context"
	_ "embed"
	"fmt"
	"log"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

//go:embed testdata/equilateral.json
var fixture []byte

// A bench fixture holds a 2 kg part on three half-inch balls in 90° vees,
// pressed down by a 300 N spring. Its design file carries the requirements
// (a shock of 5 g, a first frequency of 700 Hz, a micrometre of error at
// the centre, ...), and a test asserts all of them in one line. The
// numbers printed are the closed forms worked in the package's tests:
// each contact carries (P + mg)/(6 sin 45°) = 75.33 N, and the first
// contact unloads at 71.47 m/s² (7.29 g) in the worst direction.
func Example() {
	d, err := design.Parse(fixture)
	if err != nil {
		log.Fatal(err)
	}
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		log.Fatal(err)
	}
	st := ev.Cases[0]
	fmt.Printf("contact force in case %q: %.2f N\n", st.Case, st.Contacts[0].Force)
	fmt.Printf("shock level: %.2f g\n", ev.Shock.Unload/kinematic.StandardGravity)
	fmt.Printf("first natural frequency: %.0f Hz\n", ev.Modes[0].Frequency)
	fmt.Printf("error budget at the centre: worst case %.3f µm, RSS %.3f µm\n", ev.Budget.Worst*1e6, ev.Budget.RSS*1e6)
	if err := ev.Verdicts().Err(); err != nil {
		fmt.Println(err)
	} else {
		fmt.Printf("all %d requirements met\n", len(ev.Verdicts()))
	}

	// A stricter shock requirement fails, and the error says which and by
	// how much.
	d.Requirements.MinShock = 10 * kinematic.StandardGravity
	if ev, err = d.Evaluate(context.Background()); err != nil {
		log.Fatal(err)
	}
	fmt.Println(ev.Verdicts().Err())
	// Output:
	// contact force in case "seated": 75.33 N
	// shock level: 7.29 g
	// first natural frequency: 797 Hz
	// error budget at the centre: worst case 1.414 µm, RSS 0.816 µm
	// all 10 requirements met
	// design: 1 of 10 requirements not met: requirements.min_shock: 71.47 m/s^2 (7.29 g), needs at least 98.07 m/s^2 (10 g) (contact A+ unloads first, added to case "seated"): fails
}

// A design built once serves every analysis: here the seated statics
// from its model and the error budget from its assembly, without
// rebuilding the coupling for each. The numbers are those of Example:
// (P + mg)/(6 sin 45°) = 75.33 N per contact.
func ExampleDesign_Build() {
	d, err := design.Parse(fixture)
	if err != nil {
		log.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	st, err := b.Model().Statics(d.Cases[0])
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%d pairs, %d contacts, %d named dimensions\n", len(b.Coupling().Pairs), len(b.Contacts()), len(b.Assembly().Dimensions()))
	fmt.Printf("contact force in case %q: %.2f N\n", st.Case, st.Contacts[0].Force)
	ev, err := b.Evaluate(context.Background())
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("error budget at the centre: worst case %.3f µm\n", ev.Budget.Worst*1e6)
	// Output:
	// 3 pairs, 6 contacts, 36 named dimensions
	// contact force in case "seated": 75.33 N
	// error budget at the centre: worst case 1.414 µm
}
