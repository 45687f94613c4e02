// Command study runs the whole study of any kinematic coupling design
// file (the format of package kinematic/design): it evaluates the design
// as written, prints a report whose headings and labels come from the
// design (its name, the point of interest's point_name), writes the
// drawings to a folder, and exits with a status a CI pipeline can gate
// on.
//
// Usage:
//
//	go run ./examples/study [flags] design.json
//	go run ./examples/study [flags] - < design.json
//
// The report covers the coupling, constraint and Maxwell stability, the
// loads of every case with Hertz stresses and the preload window, the
// worst shock, friction seating, stiffness and natural frequencies, the
// error budget at the point of interest with the Monte Carlo study as
// the file sets it (monte_carlo: samples, seed, exact), the thermal drift
// over the file's delta_t, the random vibration response and the
// hysteresis of the point of interest under the file's load cycle
// (micro-slip at the contacts) where the file gives them, and every
// requirement's verdict. A preload element whose force depends on its
// gap (magnet, magnet_plate, table) gets its curve's figures at the seat,
// its window in force and gap, the shock at which the part runs away
// against compression springs of the same static force, and a drawing of
// its curve (preload-curve-N.svg).
//
// The design is never changed unless asked: with -optimize the optimiser
// runs with the file's own packaging (keep_outs, windows) and optimize
// settings, the report shows the design figures before and after, and
// the improved design is written beside the input as NAME.optimized.json
// (through the canonical writer). The exit status is always that of the
// design as written.
//
// Exit status: 0 when every requirement is met (or none is set), 1 when
// a requirement fails, 2 when the command line or the design file is bad
// or the study cannot be made or written.
package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// The exit statuses.
const (
	exitPass = 0 // every requirement met
	exitFail = 1 // a requirement fails
	exitBad  = 2 // bad command line or file, or the study failed
)

func main() {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	code := run(ctx, os.Args[1:], os.Stdin, os.Stdout, os.Stderr)
	stop()
	os.Exit(code)
}

// config is the command line.
type config struct {
	path      string // the design file, "-" for standard input
	out       string // the drawings' folder, "" for none
	optimize  bool
	optimized string // where the optimised design goes
}

// run runs the command and returns its exit status; the report goes to
// stdout, errors to stderr.
func run(ctx context.Context, args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	cfg, err := parseArgs(args, stderr)
	if errors.Is(err, flag.ErrHelp) {
		return exitPass
	}
	if err != nil {
		fmt.Fprintln(stderr, "study:", err)
		return exitBad
	}
	src, err := readInput(cfg.path, stdin)
	if err != nil {
		fmt.Fprintln(stderr, "study:", err)
		return exitBad
	}
	st := &study{w: stdout, cfg: cfg}
	pass, err := st.run(ctx, src)
	if err != nil {
		fmt.Fprintf(stderr, "study: %s: %v\n", st.source(), err)
		return exitBad
	}
	if !pass {
		return exitFail
	}
	return exitPass
}

// parseArgs reads the flags and the design file's path.
func parseArgs(args []string, stderr io.Writer) (config, error) {
	fs := flag.NewFlagSet("study", flag.ContinueOnError)
	fs.SetOutput(stderr)
	out := fs.String("out", "", "folder for the drawings (SVG), created if missing; default NAME-out for NAME.json (design-out for standard input); \"none\": no drawings")
	opt := fs.Bool("optimize", false, "run the optimiser with the file's packaging and optimize settings and write the improved design (the design itself is evaluated as written)")
	optimized := fs.String("optimized", "", "with -optimize: where to write the improved design; default NAME.optimized.json beside the input (in the drawings' folder for standard input)")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: study [flags] design.json   (or - for standard input)")
		fmt.Fprintln(stderr, "Evaluates a design file, prints the report, writes the drawings;")
		fmt.Fprintln(stderr, "exit status 0: every requirement met, 1: a requirement fails, 2: bad file or command line.")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return config{}, err
	}
	if fs.NArg() != 1 {
		fs.Usage()
		return config{}, fmt.Errorf("one design file (or - for standard input), got %d arguments", fs.NArg())
	}
	cfg := config{path: fs.Arg(0), out: *out, optimize: *opt, optimized: *optimized}
	base := "design"
	if cfg.path != "-" {
		base = strings.TrimSuffix(filepath.Base(cfg.path), filepath.Ext(cfg.path))
	}
	switch cfg.out {
	case "":
		cfg.out = base + "-out"
	case "none":
		cfg.out = ""
	}
	if cfg.optimized == "" {
		switch {
		case cfg.path != "-":
			cfg.optimized = filepath.Join(filepath.Dir(cfg.path), base+".optimized.json")
		case cfg.out != "":
			cfg.optimized = filepath.Join(cfg.out, base+".optimized.json")
		default:
			cfg.optimized = base + ".optimized.json"
		}
	}
	if !cfg.optimize && *optimized != "" {
		return config{}, fmt.Errorf("-optimized %q: only with -optimize", *optimized)
	}
	return cfg, nil
}

// readInput returns the bytes of the design file, at most
// design.MaxSize (the reader refuses more).
func readInput(path string, stdin io.Reader) ([]byte, error) {
	r := stdin
	if path != "-" {
		f, err := os.Open(path)
		if err != nil {
			return nil, err
		}
		defer f.Close()
		r = f
	}
	return io.ReadAll(io.LimitReader(r, design.MaxSize+1))
}
