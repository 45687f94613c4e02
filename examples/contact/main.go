// Command contact is a Hertz contact calculator: two bodies by shape,
// size and material, pressed together by a normal load, give the contact
// ellipse, pressures, approach, normal and tangential stiffness, the
// largest stresses under the surface of each body, and the margin against
// each material's allowable peak pressure.
//
// Usage:
//
//	go run ./examples/contact -shape1 sphere -radius1 5mm -material1 steel-52100 \
//	    -shape2 groove -radius2 5.2mm -material2 steel-440c -load 50N
//
// Every length, angle, force and modulus carries its unit: lengths m, cm,
// mm, um or µm ("5mm", "5.2 mm", "200um"); angles deg, ° or rad; forces N
// or kN; moduli and pressures Pa, kPa, MPa or GPa. A bare number other
// than 0 is an error that suggests the unit ("-radius1 5" could be 5 mm or
// 5 m). The materials are package hertz's reference materials by their
// short keys (hertz.MaterialKeys, the names design files use), or a custom
// material:
//
//	-material1 custom -E1 "210 GPa" -nu1 0.3 -allowable1 "2 GPa"
//
// The report echoes every input with its unit. Run with -h for every flag
// and the materials on file.
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

// custom is the -materialN value that takes the material from -EN, -nuN
// and -allowableN.
const custom = "custom"

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
	e, nu, allowable          *string // a custom material's
}

func newBodyFlags(fs *flag.FlagSet, n, shape, radius, mat string) bodyFlags {
	return bodyFlags{
		n:       n,
		shape:   fs.String("shape"+n, shape, "shape of body "+n+": sphere, flat, cylinder, socket, groove or toroid"),
		radius:  fs.String("radius"+n, radius, "radius of body "+n+", a length with its unit: m, cm, mm, um or µm (5mm, 5.2 mm); for a toroid the signed radius in the principal plane"),
		radiusB: fs.String("radius"+n+"b", "", "toroid only: signed radius of body "+n+" across the principal plane, a length with its unit (-6mm); inf for straight"),
		m:       fs.String("material"+n, mat, "material of body "+n+", a short key from the list below, or "+custom+" with -E"+n+" and -nu"+n),
		e:       fs.String("E"+n, "", "custom material only: Young's modulus of body "+n+", a pressure with its unit: Pa, kPa, MPa or GPa (210 GPa)"),
		nu:      fs.String("nu"+n, "", "custom material only: Poisson's ratio of body "+n+", dimensionless, in (-1, 0.5]"),
		allowable: fs.String("allowable"+n, "", "custom material only, optional: allowable peak contact pressure of body "+n+
			", a pressure with its unit (2 GPa); left out, none on file"),
	}
}

// run parses args, solves the contact and writes the report to stdout.
// With -h it writes the usage to stdout and returns nil.
func run(args []string, stdout io.Writer) error {
	fs := flag.NewFlagSet("contact", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	b1f := newBodyFlags(fs, "1", "sphere", "5mm", "steel-52100")
	b2f := newBodyFlags(fs, "2", "flat", "", "steel-440c")
	angleS := fs.String("angle", "0", "angle between the principal planes of the two bodies (the plane of body 2's first radius from body 1's), an angle with its unit: deg, ° or rad (30deg, 0.5rad)")
	loadS := fs.String("load", "10N", "normal load pressing the bodies together, a force with its unit: N or kN (50N, 1.2kN)")
	mu := fs.Float64("mu", 0.15, "coefficient of friction for the tangential stiffness and the sliding limit, dimensionless, > 0 and at most 3 (15% is 0.15)")
	qS := fs.String("tangential", "0", "tangential load at which the tangential stiffness is given, a force with its unit: N or kN; |Q| < mu·load")
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
	// The library's bound on μ (above 3 a percentage), checked before the
	// tangential load is compared with μ·load: an unloaded contact's
	// sliding limit refuses nothing else.
	if _, err := (hertz.Contact{}).SlidingLimit(*mu); err != nil {
		return translate(err, b1f, b2f)
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
	inputs := append(b1f.echo(b1), b2f.echo(b2)...)
	inputs = append(inputs,
		[2]string{"-angle", num(angle*180/math.Pi) + " °"},
		[2]string{"-load", num(load) + " N"},
		[2]string{"-mu", num(*mu)}, // a coefficient: no unit word
		[2]string{"-tangential", num(q) + " N"})
	r := report{inputs: inputs, b1: b1, b2: b2, d1: d1, d2: d2, angle: angle, load: load, mu: *mu, q: q, c: c, kt: kt, slide: slide}
	return r.write(stdout)
}

// body returns the hertz.Body of the flags, its principal plane at angle,
// and a description for the report.
func (f bodyFlags) body(angle float64, set map[string]bool) (hertz.Body, string, error) {
	m, err := f.material(set)
	if err != nil {
		return hertz.Body{}, "", err
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
	mat := fmt.Sprintf("%s (E = %s GPa, Poisson's ratio %s)", m.Name, num(m.E/1e9), num(m.Nu))
	if !(m.E > 0) || math.IsInf(m.E, 0) {
		mat = m.Name // hertz refuses the modulus below; the report is not written
	}
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
		if strings.ToLower(*bf.m) == custom {
			b := "b" + bf.n + ".Material."
			flags[b+"E"], flags[b+"Nu"], flags[b+"Allowable"] = "-E"+bf.n, "-nu"+bf.n, "-allowable"+bf.n
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

// unit is an accepted unit suffix and its size in the SI unit.
type unit struct {
	suffix string
	si     float64
}

// The units each kind of input accepts, longest suffix first where one
// ends another ("mm" before "m", "kN" before "N").
var (
	lengthUnits   = []unit{{"µm", 1e-6}, {"um", 1e-6}, {"mm", 1e-3}, {"cm", 1e-2}, {"m", 1}}
	angleUnits    = []unit{{"deg", math.Pi / 180}, {"°", math.Pi / 180}, {"rad", 1}}
	forceUnits    = []unit{{"kN", 1e3}, {"N", 1}}
	pressureUnits = []unit{{"GPa", 1e9}, {"MPa", 1e6}, {"kPa", 1e3}, {"Pa", 1}}
)

// unitNames returns the suffixes of units, for messages.
func unitNames(units []unit) string {
	names := make([]string, len(units))
	for i, u := range units {
		names[i] = u.suffix
	}
	return strings.Join(names, ", ")
}

// parseQuantity reads a number followed by one of units ("5mm", "5.2 mm")
// and returns it in the SI unit. A bare number other than 0 is an error
// suggesting the units in hints: nothing says whether "5" is millimetres
// or metres. what names the kind of input ("a length").
func parseQuantity(s, what string, units []unit, hints ...string) (float64, error) {
	t := strings.TrimSpace(s)
	for _, u := range units {
		if strings.HasSuffix(t, u.suffix) {
			v, err := number(strings.TrimSpace(strings.TrimSuffix(t, u.suffix)))
			if err != nil {
				break
			}
			v *= u.si
			if math.IsInf(v, 0) {
				return 0, fmt.Errorf("%q is beyond the floating-point range", s)
			}
			return v, nil
		}
	}
	v, err := number(t)
	if err != nil {
		return 0, fmt.Errorf("%q is not %s (a number and a unit: %s)", s, what, unitNames(units))
	}
	if v == 0 {
		return 0, nil // zero in every unit
	}
	q := make([]string, len(hints))
	for i, h := range hints {
		q[i] = strconv.Quote(t + " " + h)
	}
	return 0, fmt.Errorf("%s has no unit: write %s (%s takes one of %s)", t, strings.Join(q, " or "), what, unitNames(units))
}

// parseLength reads a length with its unit; "inf" (with a sign, and with
// or without a unit) is accepted only when straight is allowed.
func parseLength(s string, straight bool) (float64, error) {
	low := strings.ToLower(strings.TrimSpace(s))
	for _, u := range lengthUnits {
		low = strings.TrimSpace(strings.TrimSuffix(low, u.suffix))
	}
	if low == "inf" || low == "+inf" || low == "-inf" {
		if !straight {
			return 0, fmt.Errorf("%q: only a toroid's radius may be inf (straight)", s)
		}
		if low == "-inf" {
			return math.Inf(-1), nil
		}
		return math.Inf(1), nil
	}
	return parseQuantity(s, "a length", lengthUnits, "mm", "m")
}

// parseAngle reads an angle with its unit and returns it in radians.
func parseAngle(s string) (float64, error) {
	return parseQuantity(s, "an angle", angleUnits, "deg", "rad")
}

// parseForce reads a force with its unit, in newtons.
func parseForce(s string) (float64, error) {
	return parseQuantity(s, "a force", forceUnits, "N", "kN")
}

// parsePressure reads a pressure or modulus with its unit, in pascals.
func parsePressure(s string) (float64, error) {
	return parseQuantity(s, "a pressure", pressureUnits, "GPa", "MPa")
}

// material returns the material of the flags: a reference material by
// its key, or a custom one from -EN, -nuN and -allowableN.
func (f bodyFlags) material(set map[string]bool) (hertz.Material, error) {
	key := strings.ToLower(strings.TrimSpace(*f.m))
	customFlags := []string{"E" + f.n, "nu" + f.n, "allowable" + f.n}
	if key != custom {
		for _, c := range customFlags {
			if set[c] {
				return hertz.Material{}, &FlagError{"-" + c, fmt.Errorf("only a custom material takes it; give -material%s %s with -E%s and -nu%s", f.n, custom, f.n, f.n)}
			}
		}
		m, ok := hertz.MaterialByKey(key)
		if !ok {
			return hertz.Material{}, &FlagError{"-material" + f.n, fmt.Errorf("%q is not on file%s; use one of %s, or %s with -E%s and -nu%s",
				*f.m, didYouMean(key), strings.Join(hertz.MaterialKeys(), ", "), custom, f.n, f.n)}
		}
		return m, nil
	}
	which := map[string]string{"1": "first", "2": "second"}[f.n]
	m := hertz.Material{Name: "custom material of the " + which + " body", Source: "given on the command line"}
	for _, req := range customFlags[:2] {
		if !set[req] {
			return m, &FlagError{"-" + req, fmt.Errorf("-material%s %s needs -E%s and -nu%s", f.n, custom, f.n, f.n)}
		}
	}
	var err error
	if m.E, err = parsePressure(*f.e); err != nil {
		return m, &FlagError{"-E" + f.n, err}
	}
	if m.Nu, err = number(strings.TrimSpace(*f.nu)); err != nil {
		return m, &FlagError{"-nu" + f.n, fmt.Errorf("%q: Poisson's ratio is a plain number in (-1, 0.5]", *f.nu)}
	}
	if set[customFlags[2]] {
		if m.Allowable, err = parsePressure(*f.allowable); err != nil {
			return m, &FlagError{"-allowable" + f.n, err}
		}
		if m.Allowable < 0 {
			return m, &FlagError{"-allowable" + f.n, fmt.Errorf("%s: an allowable pressure is ≥ 0", *f.allowable)}
		}
	}
	return m, nil
}

// didYouMean returns ` (did you mean "steel-440c"?)` when exactly one
// material key contains key, or "".
func didYouMean(key string) string {
	var found []string
	for _, k := range hertz.MaterialKeys() {
		if key != "" && strings.Contains(k, key) {
			found = append(found, strconv.Quote(k))
		}
	}
	if len(found) == 0 || len(found) > 3 {
		return ""
	}
	return " (did you mean " + strings.Join(found, " or ") + "?)"
}

// echo returns the body's inputs as read, each with its unit, for the
// report.
func (f bodyFlags) echo(b hertz.Body) [][2]string {
	n := f.n
	out := [][2]string{{"-shape" + n, strings.ToLower(*f.shape)}}
	shape := strings.ToLower(*f.shape)
	switch shape {
	case "flat":
	case "toroid":
		out = append(out, [2]string{"-radius" + n, radiusText(b.R1)}, [2]string{"-radius" + n + "b", radiusText(b.R2)})
	default:
		// A cylinder or groove is straight one way: its radius is the
		// finite one.
		r := math.Abs(b.R1)
		if math.IsInf(r, 0) {
			r = math.Abs(b.R2)
		}
		out = append(out, [2]string{"-radius" + n, num(r*1e3) + " mm"})
	}
	m := b.Material
	allow, allowable := "no allowable on file", "none on file"
	if m.Allowable > 0 {
		allowable = num(m.Allowable/1e6) + " MPa"
		allow = "allowable " + allowable
	}
	key := strings.ToLower(strings.TrimSpace(*f.m))
	out = append(out, [2]string{"-material" + n, fmt.Sprintf("%s: %s", key, m.Name)})
	desc := fmt.Sprintf("E = %s GPa, Poisson's ratio %s, %s", num(m.E/1e9), num(m.Nu), allow)
	if key == custom {
		out = append(out, [2]string{"-E" + n, num(m.E/1e9) + " GPa"}, [2]string{"-nu" + n, num(m.Nu)},
			[2]string{"-allowable" + n, allowable})
	} else {
		out = append(out, [2]string{"", desc})
	}
	return out
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

// usage writes the help: what the program does, every flag with its unit,
// the shapes and the materials on file.
func usage(w io.Writer, fs *flag.FlagSet) {
	fmt.Fprint(w, `Usage: contact [flags]

Hertz contact of two bodies pressed together by a normal load: contact
ellipse, peak and mean pressure, approach, normal and tangential stiffness,
subsurface shear and von Mises stress of each body, and the margin against
each material's allowable peak pressure.

Units: every length, angle, force and pressure carries its unit: lengths
m, cm, mm, um or µm (5mm, 5.2 mm); angles deg, ° or rad (30deg); forces N
or kN (50N); moduli and pressures Pa, kPa, MPa or GPa (210 GPa). A bare
number other than 0 is refused. -mu and -nuN are dimensionless.

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
	fmt.Fprint(w, "\nMaterials (-material1, -material2), by their keys in package hertz (the names design files use):\n")
	for _, n := range hertz.MaterialKeys() {
		m, _ := hertz.MaterialByKey(n)
		allow := "no allowable on file"
		if m.Allowable > 0 {
			allow = "allowable peak pressure " + num(m.Allowable/1e6) + " MPa"
		}
		fmt.Fprintf(w, "  %-17s %s: E = %s GPa, Poisson's ratio %s; %s\n", n, m.Name, num(m.E/1e9), num(m.Nu), allow)
	}
	fmt.Fprintf(w, "  %-17s your own: -EN (pressure), -nuN (dimensionless), -allowableN (pressure, optional)\n", custom)
	fmt.Fprint(w, "\n"+caution+"\n")
}
