// Command contact is a Hertz contact calculator: two bodies by shape,
// size and material, pressed together by a normal load, give the contact
// ellipse, pressures, approach, normal and tangential stiffness, the
// largest stresses under the surface of each body, and the margin against
// each material's allowable peak pressure.
//
// Usage:
//
//	go run ./examples/contact -shape1 sphere -radius1 5mm -material1 52100 \
//	    -shape2 groove -radius2 5.2mm -material2 440c -load 50
//
// Lengths are metres when given as plain numbers ("0.005"), or carry one
// of the units m, cm, mm, um or µm ("5mm", "5.2 mm", "200um"). The angle is
// in degrees, or carries deg, ° or rad. The load is in newtons, or carries
// N or kN. Run with -h for every flag and the materials on file.
//
// The results are engineering estimates: verify them by test, and defer to
// the applicable codes and a qualified engineer.
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"sort"
	"strconv"
	"strings"
	"unicode"

	"github.com/sixfold-dev/sixfold/hertz"
)

func main() {
	if err := run(os.Args[1:], os.Stdout); err != nil {
		fmt.Fprintln(os.Stderr, "contact:", err)
		os.Exit(2)
	}
}

// materials maps the short names accepted by -material1 and -material2 to
// the reference materials of package hertz.
var materials = map[string]hertz.Material{
	"52100":    hertz.Steel52100,
	"440c":     hertz.Steel440C,
	"si3n4":    hertz.SiliconNitride,
	"wc":       hertz.TungstenCarbide,
	"sapphire": hertz.Sapphire,
	"silica":   hertz.FusedSilica,
	"al6061":   hertz.Aluminium6061T6,
	"invar":    hertz.Invar36,
	"ti64":     hertz.Ti6Al4V,
	"d2":       hertz.SteelD2,
}

// shapes lists the body shapes and what their radii mean.
var shapes = []struct{ name, radii string }{
	{"sphere", "a ball of radius R (-radiusN)"},
	{"flat", "a plane: no radius"},
	{"cylinder", "a convex cylinder of radius R, its axis along the principal plane"},
	{"socket", "a concave spherical seat of radius R (larger than the ball's)"},
	{"groove", "a concave cylindrical groove of radius R, its axis along the principal plane"},
	{"toroid", "any doubly curved surface: signed radii R (-radiusN, in the principal plane) and R' (-radiusNb, across it), + convex, - concave, inf for straight"},
}

// FlagError reports a command-line flag with a bad value.
type FlagError struct {
	Flag string // the flag as written on the command line, e.g. "-radius1"
	Err  error
}

func (e *FlagError) Error() string { return "flag " + e.Flag + ": " + e.Err.Error() }
func (e *FlagError) Unwrap() error { return e.Err }

// bodyFlags holds the raw flag values of one body.
type bodyFlags struct {
	n                         string // "1" or "2"
	shape, radius, radiusB, m *string
}

func newBodyFlags(fs *flag.FlagSet, n, shape, radius, mat string) bodyFlags {
	return bodyFlags{
		n:       n,
		shape:   fs.String("shape"+n, shape, "shape of body "+n+": sphere, flat, cylinder, socket, groove or toroid"),
		radius:  fs.String("radius"+n, radius, "radius of body "+n+", m or with a unit (5mm); for a toroid the signed radius in the principal plane"),
		radiusB: fs.String("radius"+n+"b", "", "toroid only: signed radius of body "+n+" across the principal plane, m or with a unit; inf for straight"),
		m:       fs.String("material"+n, mat, "material of body "+n+", a short name from the list below"),
	}
}

// run parses args, solves the contact and writes the report to stdout.
// With -h it writes the usage to stdout and returns nil.
func run(args []string, stdout io.Writer) error {
	fs := flag.NewFlagSet("contact", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	b1f := newBodyFlags(fs, "1", "sphere", "5mm", "52100")
	b2f := newBodyFlags(fs, "2", "flat", "", "440c")
	angleS := fs.String("angle", "0", "angle between the principal planes of the two bodies (the plane of body 2's first radius from body 1's), degrees or with a unit (30deg, 0.5rad)")
	loadS := fs.String("load", "10", "normal load pressing the bodies together, N or with a unit (50N, 1.2kN)")
	mu := fs.Float64("mu", 0.15, "coefficient of friction for the tangential stiffness and the sliding limit, dimensionless, > 0")
	qS := fs.String("tangential", "0", "tangential load at which the tangential stiffness is given, N or with a unit; |Q| < mu·load")
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			usage(stdout, fs)
			return nil
		}
		return err // names the flag: "flag provided but not defined: -x", "invalid value ... for flag -mu"
	}
	if fs.NArg() > 0 {
		return fmt.Errorf("unexpected argument %q (every input is a flag; see -h)", fs.Arg(0))
	}
	set := map[string]bool{}
	fs.Visit(func(f *flag.Flag) { set[f.Name] = true })

	angle, err := parseAngle(*angleS)
	if err != nil {
		return &FlagError{"-angle", err}
	}
	load, err := parseForce(*loadS)
	if err != nil {
		return &FlagError{"-load", err}
	}
	if load < 0 {
		return &FlagError{"-load", fmt.Errorf("%s: a normal load presses the bodies together, want ≥ 0 N", *loadS)}
	}
	if math.IsNaN(*mu) || math.IsInf(*mu, 0) || *mu <= 0 {
		return &FlagError{"-mu", fmt.Errorf("%v: want a finite coefficient > 0", *mu)}
	}
	q, err := parseForce(*qS)
	if err != nil {
		return &FlagError{"-tangential", err}
	}
	if math.Abs(q) >= *mu*load && q != 0 {
		return &FlagError{"-tangential", fmt.Errorf("%s: |Q| must stay below the sliding limit mu·load = %s N", *qS, num(*mu*load))}
	}
	b1, d1, err := b1f.body(0, set)
	if err != nil {
		return err
	}
	b2, d2, err := b2f.body(angle, set)
	if err != nil {
		return err
	}
	c, err := hertz.Solve(b1, b2, load)
	if err != nil {
		return translate(err, b1f, b2f)
	}
	kt, err := c.TangentialStiffness(*mu, q)
	if err != nil {
		return translate(err, b1f, b2f)
	}
	slide, err := c.SlidingLimit(*mu)
	if err != nil {
		return &FlagError{"-mu", err}
	}
	r := report{b1: b1, b2: b2, d1: d1, d2: d2, angle: angle, load: load, mu: *mu, q: q, c: c, kt: kt, slide: slide}
	return r.write(stdout)
}

// body returns the hertz.Body of the flags, its principal plane at angle,
// and a description for the report.
func (f bodyFlags) body(angle float64, set map[string]bool) (hertz.Body, string, error) {
	m, ok := materials[strings.ToLower(*f.m)]
	if !ok {
		return hertz.Body{}, "", &FlagError{"-material" + f.n, fmt.Errorf("%q is not on file; use one of %s", *f.m, strings.Join(materialNames(), ", "))}
	}
	shape := strings.ToLower(*f.shape)
	needR := shape != "flat"
	if !needR && set["radius"+f.n] {
		return hertz.Body{}, "", &FlagError{"-radius" + f.n, errors.New("a flat has no radius; leave the flag out")}
	}
	if shape != "toroid" && set["radius"+f.n+"b"] {
		return hertz.Body{}, "", &FlagError{"-radius" + f.n + "b", fmt.Errorf("only a toroid has a second radius, not a %s", shape)}
	}
	var r float64
	if needR {
		var err error
		if r, err = parseLength(*f.radius, shape == "toroid"); err != nil {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n, err}
		}
		if shape != "toroid" && !(r > 0) {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n, fmt.Errorf("%s: want a size > 0 (the shape sets the sign)", *f.radius)}
		}
		if r == 0 {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n, fmt.Errorf("%s: a radius is nonzero (inf for straight)", *f.radius)}
		}
	}
	mat := fmt.Sprintf("%s (E = %s GPa, Poisson's ratio %s dimensionless)", m.Name, num(m.E/1e9), num(m.Nu))
	switch shape {
	case "sphere":
		return hertz.Sphere(r, m), fmt.Sprintf("sphere of radius %s mm, %s", num(r*1e3), mat), nil
	case "flat":
		return hertz.Flat(m), "flat, " + mat, nil
	case "cylinder":
		return hertz.Cylinder(r, angle, m), fmt.Sprintf("cylinder of radius %s mm, %s", num(r*1e3), mat), nil
	case "socket":
		return hertz.Socket(r, m), fmt.Sprintf("socket (concave sphere) of radius %s mm, %s", num(r*1e3), mat), nil
	case "groove":
		return hertz.Groove(r, angle, m), fmt.Sprintf("groove (concave cylinder) of radius %s mm, %s", num(r*1e3), mat), nil
	case "toroid":
		if *f.radiusB == "" {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n + "b", errors.New("a toroid needs its second radius (inf for straight)")}
		}
		rb, err := parseLength(*f.radiusB, true)
		if err != nil {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n + "b", err}
		}
		if rb == 0 {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n + "b", fmt.Errorf("%s: a radius is nonzero (inf for straight)", *f.radiusB)}
		}
		if math.IsInf(r, 0) && math.IsInf(rb, 0) {
			return hertz.Body{}, "", &FlagError{"-radius" + f.n + "b", errors.New("both radii straight: use -shape" + f.n + " flat")}
		}
		return hertz.Toroid(r, rb, angle, m), fmt.Sprintf("toroid with radii %s and %s, %s", radiusText(r), radiusText(rb), mat), nil
	}
	names := make([]string, len(shapes))
	for i, s := range shapes {
		names[i] = s.name
	}
	return hertz.Body{}, "", &FlagError{"-shape" + f.n, fmt.Errorf("%q is not a shape; use one of %s", *f.shape, strings.Join(names, ", "))}
}

// radiusText prints a signed radius in mm, or "straight".
func radiusText(r float64) string {
	if math.IsInf(r, 0) {
		return "straight (no curvature)"
	}
	sense := "convex"
	if r < 0 {
		sense = "concave"
	}
	return fmt.Sprintf("%s mm (%s)", num(math.Abs(r)*1e3), sense)
}

// translate turns an error of package hertz into the vocabulary of the
// command line: the flag that holds the offending input.
func translate(err error, b1, b2 bodyFlags) error {
	var ie *hertz.InputError
	if !errors.As(err, &ie) {
		return err
	}
	flags := map[string]string{
		"b1.R1": "-radius1", "b1.R2": "-radius1", "b2.R1": "-radius2", "b2.R2": "-radius2",
		"b1.Angle": "-angle", "b2.Angle": "-angle", "load": "-load", "mu": "-mu", "q": "-tangential",
	}
	for _, bf := range []bodyFlags{b1, b2} {
		if strings.ToLower(*bf.shape) == "toroid" {
			flags["b"+bf.n+".R2"] = "-radius" + bf.n + "b"
		}
	}
	if f, ok := flags[ie.Field]; ok {
		return &FlagError{f, ie.Err}
	}
	if ie.Field == "b1, b2" || strings.Contains(ie.Field, "Material.E") {
		return &FlagError{"-shape1, -radius1, -shape2, -radius2, -angle", ie.Err}
	}
	return &FlagError{ie.Field, ie.Err}
}

// lengthUnits are the accepted length suffixes and their size in metres.
var lengthUnits = []struct {
	suffix string
	metres float64
}{{"µm", 1e-6}, {"um", 1e-6}, {"mm", 1e-3}, {"cm", 1e-2}, {"m", 1}}

// parseLength reads a length in metres, or with a unit suffix; "inf"
// (with a sign) is accepted only when straight is allowed.
func parseLength(s string, straight bool) (float64, error) {
	t := strings.TrimSpace(s)
	low := strings.ToLower(t)
	if low == "inf" || low == "+inf" || low == "-inf" {
		if !straight {
			return 0, fmt.Errorf("%q: only a toroid's radius may be inf (straight)", s)
		}
		if low == "-inf" {
			return math.Inf(-1), nil
		}
		return math.Inf(1), nil
	}
	scale := 1.0
	for _, u := range lengthUnits {
		if strings.HasSuffix(t, u.suffix) {
			t, scale = strings.TrimSpace(strings.TrimSuffix(t, u.suffix)), u.metres
			break
		}
	}
	v, err := number(t)
	if err != nil {
		return 0, fmt.Errorf("%q is not a length (metres, or with a unit: m, cm, mm, um, µm)", s)
	}
	return v * scale, nil
}

// parseAngle reads an angle in degrees, or with deg, ° or rad, and
// returns it in radians.
func parseAngle(s string) (float64, error) {
	t := strings.TrimSpace(s)
	scale := math.Pi / 180
	switch {
	case strings.HasSuffix(t, "rad"):
		t, scale = strings.TrimSuffix(t, "rad"), 1
	case strings.HasSuffix(t, "deg"):
		t = strings.TrimSuffix(t, "deg")
	case strings.HasSuffix(t, "°"):
		t = strings.TrimSuffix(t, "°")
	}
	v, err := number(strings.TrimSpace(t))
	if err != nil {
		return 0, fmt.Errorf("%q is not an angle (degrees, or with a unit: deg, °, rad)", s)
	}
	return v * scale, nil
}

// parseForce reads a force in newtons, or with N or kN.
func parseForce(s string) (float64, error) {
	t := strings.TrimSpace(s)
	scale := 1.0
	switch {
	case strings.HasSuffix(t, "kN"):
		t, scale = strings.TrimSuffix(t, "kN"), 1e3
	case strings.HasSuffix(t, "N"):
		t = strings.TrimSuffix(t, "N")
	}
	v, err := number(strings.TrimSpace(t))
	if err != nil {
		return 0, fmt.Errorf("%q is not a force (newtons, or with a unit: N, kN)", s)
	}
	return v * scale, nil
}

// number parses a finite decimal number; strconv's "inf", "nan" and hex
// forms are refused.
func number(s string) (float64, error) {
	if s == "" || strings.IndexFunc(s, func(r rune) bool { return unicode.IsLetter(r) && r != 'e' && r != 'E' }) >= 0 {
		return 0, errors.New("not a number")
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, errors.New("not a finite number")
	}
	return v, nil
}

func materialNames() []string {
	names := make([]string, 0, len(materials))
	for n := range materials {
		names = append(names, n)
	}
	sort.Strings(names)
	return names
}

// usage writes the help: what the program does, every flag with its unit,
// the shapes and the materials on file.
func usage(w io.Writer, fs *flag.FlagSet) {
	fmt.Fprint(w, `Usage: contact [flags]

Hertz contact of two bodies pressed together by a normal load: contact
ellipse, peak and mean pressure, approach, normal and tangential stiffness,
subsurface shear and von Mises stress of each body, and the margin against
each material's allowable peak pressure.

Units: lengths are metres as plain numbers (0.005) or carry m, cm, mm, um
or µm (5mm, 5.2 mm); angles are degrees or carry deg, ° or rad; forces are
newtons or carry N or kN; -mu is dimensionless.

Flags:
`)
	fs.VisitAll(func(f *flag.Flag) {
		def := ""
		if f.DefValue != "" {
			def = " (default " + f.DefValue + ")"
		}
		fmt.Fprintf(w, "  -%s\n      %s%s\n", f.Name, f.Usage, def)
	})
	fmt.Fprint(w, "\nShapes (-shape1, -shape2):\n")
	for _, s := range shapes {
		fmt.Fprintf(w, "  %-9s %s\n", s.name, s.radii)
	}
	fmt.Fprint(w, "\nMaterials (-material1, -material2), from package hertz:\n")
	for _, n := range materialNames() {
		m := materials[n]
		allow := "no allowable on file"
		if m.Allowable > 0 {
			allow = "allowable peak pressure " + num(m.Allowable/1e6) + " MPa"
		}
		fmt.Fprintf(w, "  %-9s %s: E = %s GPa, Poisson's ratio %s; %s\n", n, m.Name, num(m.E/1e9), num(m.Nu), allow)
	}
	fmt.Fprint(w, "\n"+caution+"\n")
}
