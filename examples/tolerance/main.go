// Command tolerance runs the Monte Carlo tolerance study of a design file:
// it draws parts made to the drawing (every toleranced dimension from its
// distribution), seats each one, and reports where the point of interest
// goes: the interchangeability of the parts. It writes the histogram of
// the error as an SVG drawing and shows a progress bar on the terminal
// for long runs.
//
// Usage:
//
//	go run ./examples/tolerance [flags] design.json
//
// Use "-" for a design on standard input.
package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

func main() {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	if err := run(ctx, os.Args[1:], os.Stdin, os.Stdout, os.Stderr); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			os.Exit(0)
		}
		fmt.Fprintln(os.Stderr, "tolerance:", err)
		os.Exit(1)
	}
}

// run parses the arguments and runs the study; the progress bar goes to
// progress (nil: none).
func run(ctx context.Context, args []string, stdin io.Reader, stdout, progress io.Writer) error {
	fs := flag.NewFlagSet("tolerance", flag.ContinueOnError)
	fs.SetOutput(stdout)
	samples := fs.Int("samples", 0, "number of parts to draw; 0: the design file's monte_carlo.samples, else 100000")
	seed := fs.Uint64("seed", 0, "random seed; 0: the design file's, else 1 (the same seed gives the same result on any number of cores)")
	exact := fs.Bool("exact", false, "seat every sample exactly instead of by the first-order model (slower)")
	workers := fs.Int("workers", 0, "goroutines; 0: one per core")
	svg := fs.String("svg", "histogram.svg", "write the histogram of the error at the point of interest to this SVG file; empty: none")
	fs.Usage = func() {
		fmt.Fprintln(stdout, "usage: tolerance [flags] design.json")
		fmt.Fprintln(stdout, "Monte Carlo tolerance study of a design file (lengths in the report in µm, tilts in µrad).")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return err
	}
	if fs.NArg() != 1 {
		fs.Usage()
		return fmt.Errorf("need one design file (or - for standard input), got %d arguments", fs.NArg())
	}
	d, b, err := readDesign(fs.Arg(0), stdin)
	if err != nil {
		return err
	}
	n, sd := studySize(d, *samples, *seed)
	if n < 0 {
		return fmt.Errorf("-samples: must be positive, got %d", n)
	}
	opt := &kinematic.StudyOptions{Samples: n, Seed: sd, Workers: *workers, Exact: *exact, KeepSamples: *svg != ""}
	bar := &progressBar{w: progress}
	if progress != nil {
		opt.Progress = bar.update
	}
	res, err := b.Assembly().Study(ctx, d.Point, d.Tolerances, opt)
	bar.finish()
	if err != nil {
		return err
	}
	model := "first-order"
	if *exact {
		model = "exact"
	}
	report(stdout, d, res, model, sd)
	if *svg != "" && len(res.Points) > 0 {
		if err := writeHistogram(*svg, res, model, sd); err != nil {
			return err
		}
		fmt.Fprintf(stdout, "histogram written to %s\n", *svg)
	}
	fmt.Fprintln(stdout, "These are engineering estimates from idealised models; verify by test, and let the")
	fmt.Fprintln(stdout, "applicable codes and a qualified engineer decide where hardware or safety depends on them.")
	return nil
}

// readDesign reads, parses and builds the design file at path ("-":
// stdin) and checks that it has tolerances to study.
func readDesign(path string, stdin io.Reader) (*design.Design, *design.Built, error) {
	var src []byte
	var err error
	if path == "-" {
		src, err = io.ReadAll(io.LimitReader(stdin, design.MaxSize+1))
	} else {
		src, err = os.ReadFile(path)
	}
	if err != nil {
		return nil, nil, err
	}
	d, err := design.Parse(src)
	if err != nil {
		return nil, nil, err
	}
	if len(d.Tolerances) == 0 {
		return nil, nil, fmt.Errorf("%s: the design has no tolerances to study", path)
	}
	b, err := d.Build()
	if err != nil {
		return nil, nil, err
	}
	return d, b, nil
}

// studySize returns the number of samples and the seed of the study: the
// flags' samples and seed, else the design file's, else 100000 and 1.
func studySize(d *design.Design, samples int, seed uint64) (n int, sd uint64) {
	n, sd = samples, seed
	if d.MonteCarlo != nil {
		if n == 0 {
			n = d.MonteCarlo.Samples
		}
		if sd == 0 {
			sd = d.MonteCarlo.Seed
		}
	}
	if n == 0 {
		n = 100000
	}
	if sd == 0 {
		sd = 1
	}
	return n, sd
}

// report prints the study's result res for the design d to w: lengths in
// µm, tilts in µrad.
func report(w io.Writer, d *design.Design, res kinematic.StudyResult, model string, sd uint64) {
	fmt.Fprintf(w, "%s\n", d.Name)
	fmt.Fprintf(w, "Monte Carlo tolerance study (interchangeability): %d parts, %s model, seed %d, %d toleranced dimensions\n",
		res.Samples, model, sd, len(d.Tolerances))
	fmt.Fprintf(w, "point of interest (%.1f, %.1f, %.1f) mm\n", d.Point.X*1e3, d.Point.Y*1e3, d.Point.Z*1e3)
	fmt.Fprintf(w, "%-10s %10s %10s %10s %10s %10s %10s\n", "", "mean", "std dev", "|P50|", "|P95|", "|P99|", "|P99.73|")
	row := func(name string, s kinematic.Stats, scale float64, unit string) {
		fmt.Fprintf(w, "%-10s %10.3f %10.3f %10.3f %10.3f %10.3f %10.3f  %s\n", name,
			s.Mean*scale, s.StdDev*scale, s.P50*scale, s.P95*scale, s.P99*scale, s.P9973*scale, unit)
	}
	row("x", res.X, 1e6, "µm")
	row("y", res.Y, 1e6, "µm")
	row("z", res.Z, 1e6, "µm")
	row("radial", res.Radial, 1e6, "µm")
	row("tilt", res.Tilt, 1e6, "µrad")
}

// writeHistogram writes the histogram of the error at the point of
// interest in res to the SVG file at path.
func writeHistogram(path string, res kinematic.StudyResult, model string, sd uint64) error {
	hopt := &drawing.Options{Notes: []string{fmt.Sprintf("%d samples, %s model, seed %d", len(res.Points), model, sd)}}
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	err = drawing.Histogram(f, res, hopt)
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	return err
}

// progressBar draws a bar of the study's progress on one terminal line.
type progressBar struct {
	w     io.Writer
	shown int // percent drawn so far
	drawn bool
}

func (b *progressBar) update(done, total int) {
	if b.w == nil || total <= 0 {
		return
	}
	pct := 100 * done / total
	if pct == b.shown && b.drawn {
		return
	}
	b.shown, b.drawn = pct, true
	const width = 40
	fill := width * done / total
	fmt.Fprintf(b.w, "\r[%s%s] %3d %% (%d of %d parts)", strings.Repeat("#", fill), strings.Repeat(".", width-fill), pct, done, total)
}

func (b *progressBar) finish() {
	if b.w != nil && b.drawn {
		fmt.Fprintln(b.w)
	}
}
