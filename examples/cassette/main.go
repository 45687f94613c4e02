// Command cassette runs the whole design study of a kinematic coupling
// from a design file: by default the removable detector cassette of a
// benchtop spectrometer (cassette.json beside this program, a demo
// scenario whose numbers are invented), which must go back within a few
// micrometres after each swap.
//
// The study chooses the grooves by the error at the detector inside the
// windows that the cable pass-through and the coolant port leave, checks
// constraint and stability, the Hertz stresses and the preload window,
// a transport shock in any direction and friction seating, computes the
// stiffness and the natural frequencies, runs the error budget (ranked
// contributors, a Monte Carlo study, the thermal drift over ±10 K) and
// checks the design's requirements. It prints a report and writes four
// drawings: the plan view, the lift-off map, the error histogram and the
// scorecards of the candidate layouts.
//
// Usage:
//
//	go run ./examples/cassette [flags] [design.json | -]
//
// A design file given by path, or "-" for standard input, replaces the
// built-in one; the groove windows and the shock level are the study's
// own (see the flags).
package main

import (
	"context"
	_ "embed"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
)

//go:embed cassette.json
var builtIn []byte

func main() {
	if err := run(os.Args[1:], os.Stdin, os.Stdout); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			os.Exit(0)
		}
		fmt.Fprintln(os.Stderr, "cassette:", err)
		os.Exit(1)
	}
}

// run parses the arguments, reads the design and runs the study.
func run(args []string, stdin io.Reader, stdout io.Writer) error {
	fs := flag.NewFlagSet("cassette", flag.ContinueOnError)
	fs.SetOutput(stdout)
	out := fs.String("out", "cassette-out", "directory for the drawings (SVG); created if missing; empty: no drawings")
	samples := fs.Int("samples", 100000, "Monte Carlo samples (parts drawn from the tolerances)")
	shock := fs.Float64("shock", 5, "transport shock to survive in any direction, g (1 g = 9.80665 m/s²)")
	dt := fs.Float64("dt", 10, "temperature change for the thermal drift, ± K")
	fs.Usage = func() {
		fmt.Fprintln(stdout, "usage: cassette [flags] [design.json | -]")
		fmt.Fprintln(stdout, "Runs the coupling study of a design file (default: the built-in detector cassette).")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return err
	}
	if fs.NArg() > 1 {
		return fmt.Errorf("one design file at most, got %d arguments", fs.NArg())
	}
	src, name := builtIn, "built-in cassette.json"
	if fs.NArg() == 1 {
		var err error
		switch path := fs.Arg(0); path {
		case "-":
			src, err = io.ReadAll(io.LimitReader(stdin, 4<<20+1))
			name = "standard input"
		default:
			src, err = os.ReadFile(path)
			name = path
		}
		if err != nil {
			return err
		}
	}
	if *samples <= 0 {
		return fmt.Errorf("-samples: must be positive, got %d", *samples)
	}
	if !(*shock >= 0) || !(*dt >= 0) {
		return fmt.Errorf("-shock and -dt must be finite and ≥ 0, got %g and %g", *shock, *dt)
	}
	st := &study{w: stdout, source: name, samples: *samples, shockG: *shock, deltaT: *dt, outDir: *out}
	return st.run(context.Background(), src)
}
