package main

import (
	"errors"
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/hertz"
)

// out runs the program and returns its report, failing on error.
func out(t *testing.T, args ...string) string {
	t.Helper()
	var b strings.Builder
	if err := run(args, &b); err != nil {
		t.Fatalf("run(%q): %v", args, err)
	}
	return b.String()
}

// value returns the number printed after label (up to its colon) with
// the unit unit, e.g. value(t, s, "peak pressure p0", "MPa").
func value(t *testing.T, s, label, unit string) float64 {
	t.Helper()
	re := regexp.MustCompile(regexp.QuoteMeta(label) + `:\s+([-+0-9.e]+) ` + regexp.QuoteMeta(unit))
	m := re.FindStringSubmatch(s)
	if m == nil {
		t.Fatalf("no %q in %s followed by a number and %q in:\n%s", label, unit, unit, s)
	}
	v, err := strconv.ParseFloat(m[1], 64)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// near fails unless got is within rel (relative) of want.
func near(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Abs(want) {
		t.Errorf("%s = %.6g, want %.6g (±%g relative)", what, got, want, rel)
	}
}

// printed is the relative precision of the report: four significant
// figures, so half a unit in the fourth place is at most 5e-4 relative.
const printed = 5e-4

// estar returns Johnson's effective modulus, 1/E* = (1−ν1²)/E1 + (1−ν2²)/E2
// (Johnson, Contact Mechanics, 1985, eq. 4.22 and §3.4, from memory).
func estar(m1, m2 hertz.Material) float64 {
	return 1 / ((1-m1.Nu*m1.Nu)/m1.E + (1-m2.Nu*m2.Nu)/m2.E)
}

// TestBallOnFlat checks the report of a 5 mm AISI 52100 ball on an AISI
// 440C flat under 50 N against Hertz's closed forms for a sphere on a
// plane (Johnson, Contact Mechanics, 1985, eq. 4.22–4.23, from memory):
// a = (3FR/(4E*))^(1/3), p0 = 3F/(2πa²), δ = a²/R, mean pressure 2p0/3,
// and the normal stiffness dF/dδ = 2E*a, which follows from δ = a²/R and
// a³ = 3FR/(4E*) by differentiation. The tangential stiffness at zero
// tangential load is Mindlin's 8G*a with 1/G* = (2−ν1)/G1 + (2−ν2)/G2 and
// G = E/(2(1+ν)) (Mindlin 1949; Johnson 1985, §7.2, from memory). The
// largest shear under a circular contact with ν = 0.3 is 0.31 p0 at a depth
// of 0.48a (Johnson 1985, §3.4, fig. 3.9, from memory; two figures).
func TestBallOnFlat(t *testing.T) {
	s := out(t, "-shape1", "sphere", "-radius1", "5mm", "-material1", "steel-52100", "-shape2", "flat", "-material2", "steel-440c", "-load", "50 N")
	const F, R = 50.0, 5e-3
	m1, m2 := hertz.Steel52100, hertz.Steel440C
	E := estar(m1, m2)
	a := math.Cbrt(3 * F * R / (4 * E))
	p0 := 3 * F / (2 * math.Pi * a * a)
	delta := a * a / R
	near(t, "E*", value(t, s, "effective modulus E*", "GPa")*1e9, E, printed)
	near(t, "a", value(t, s, "semi-major axis a", "mm")*1e-3, a, printed)
	near(t, "b", value(t, s, "semi-minor axis b", "mm")*1e-3, a, printed)
	near(t, "p0", value(t, s, "peak pressure p0", "MPa")*1e6, p0, printed)
	near(t, "mean pressure", value(t, s, "mean pressure", "MPa")*1e6, 2*p0/3, printed)
	near(t, "δ", value(t, s, "approach δ", "µm")*1e-6, delta, printed)
	near(t, "dF/dδ", value(t, s, "normal stiffness dF/dδ", "N/µm")*1e6, 2*E*a, printed)
	g := func(m hertz.Material) float64 { return m.E / (2 * (1 + m.Nu)) }
	G := 1 / ((2-m1.Nu)/g(m1) + (2-m2.Nu)/g(m2))
	near(t, "G*", value(t, s, "effective shear modulus G*", "GPa")*1e9, G, printed)
	near(t, "tangential stiffness", value(t, s, "tangential stiffness (Mindlin)", "N/µm")*1e6, 8*G*a, printed)
	near(t, "sliding limit", value(t, s, "sliding limit μN", "N"), 0.15*F, printed)

	m := regexp.MustCompile(`first body:\s+max shear ([0-9.]+) MPa at ([0-9.]+) mm deep`).FindStringSubmatch(s)
	if m == nil {
		t.Fatalf("no subsurface line for the first body in:\n%s", s)
	}
	tau, _ := strconv.ParseFloat(m[1], 64)
	z, _ := strconv.ParseFloat(m[2], 64)
	near(t, "max shear / p0", tau*1e6/p0, 0.31, 0.01/0.31)
	near(t, "depth / a", z*1e-3/a, 0.48, 0.01/0.48)

	// Allowable: ISO 76:2006's 4200 MPa for 52100 and for 440C (from the
	// hertz table). Since p0 ∝ F^(1/3), it is reached at F·(4200 MPa/p0)³.
	if !regexp.MustCompile(`first body:\s+4200 MPa; p0 within it`).MatchString(s) || !regexp.MustCompile(`second body:\s+4200 MPa; p0 within it`).MatchString(s) {
		t.Errorf("allowables not reported:\n%s", s)
	}
	mm := regexp.MustCompile(`margin ([0-9.]+) % .* reached at a load of ([0-9.]+) N`).FindStringSubmatch(s)
	if mm == nil {
		t.Fatalf("no margin in:\n%s", s)
	}
	margin, _ := strconv.ParseFloat(mm[1], 64)
	fAllow, _ := strconv.ParseFloat(mm[2], 64)
	near(t, "margin %", margin, 100*(4200e6-p0)/4200e6, printed)
	near(t, "load at the allowable", fAllow, F*math.Pow(4200e6/p0, 3), printed)
	if !strings.Contains(s, "Half-space assumption (Valid), a at most 10 % of the smallest radius: holds") {
		t.Errorf("no Valid verdict:\n%s", s)
	}
	near(t, "a / R", value(t, s, "a / smallest radius", "%")/100, a/R, printed)
}

// TestCrossedCylinders checks -angle: two equal cylinders crossed at 90°
// touch like a sphere of the same radius on a plane (Johnson, Contact
// Mechanics, 1985, §4.2, from memory: the relative curvatures are 1/(2R)
// in both directions), so a and p0 are those of the ball on a flat.
func TestCrossedCylinders(t *testing.T) {
	s := out(t, "-shape1", "cylinder", "-radius1", "8 mm", "-material1", "tungsten-carbide", "-shape2", "cylinder", "-radius2", "0.008 m", "-material2", "tungsten-carbide", "-angle", "90 deg", "-load", "0.2kN")
	const F, R = 200.0, 8e-3
	E := estar(hertz.TungstenCarbide, hertz.TungstenCarbide)
	a := math.Cbrt(3 * F * R / (4 * E))
	near(t, "a", value(t, s, "semi-major axis a", "mm")*1e-3, a, printed)
	near(t, "b", value(t, s, "semi-minor axis b", "mm")*1e-3, a, printed)
	near(t, "p0", value(t, s, "peak pressure p0", "MPa")*1e6, 3*F/(2*math.Pi*a*a), printed)
	near(t, "δ", value(t, s, "approach δ", "µm")*1e-6, a*a/R, printed)
	if !strings.Contains(s, "no allowable on file for tungsten carbide") {
		t.Errorf("expected no allowable for WC:\n%s", s)
	}
}

// TestSocket checks a ball in a spherical socket against a sphere of the
// effective radius R = R1·R2/(R2 − R1) on a plane: the relative curvature
// of a ball R1 in a socket R2 is 1/R1 − 1/R2 (Johnson 1985, §4.1, from
// memory). Ball 5 mm, socket 6 mm: R = 30 mm. The radii are given in
// metres and micrometres.
func TestSocket(t *testing.T) {
	s := out(t, "-radius1", "0.005 m", "-shape2", "socket", "-radius2", "6000um", "-material2", "steel-52100", "-load", "100N")
	const F, R = 100.0, 0.005 * 0.006 / (0.006 - 0.005)
	E := estar(hertz.Steel52100, hertz.Steel52100)
	a := math.Cbrt(3 * F * R / (4 * E))
	near(t, "a", value(t, s, "semi-major axis a", "mm")*1e-3, a, printed)
	near(t, "p0", value(t, s, "peak pressure p0", "MPa")*1e6, 3*F/(2*math.Pi*a*a), printed)
	near(t, "δ", value(t, s, "approach δ", "µm")*1e-6, a*a/R, printed)
	// The smallest |radius| is the ball's 5 mm.
	near(t, "a / R", value(t, s, "a / smallest radius", "%")/100, a/0.005, printed)
}

// TestToroid checks that a toroid given with signed radii equal to a
// groove's (straight along, concave across) gives the groove's result.
func TestToroid(t *testing.T) {
	g := out(t, "-shape2", "groove", "-radius2", "5.3mm", "-load", "20 N", "-angle", "15deg")
	tor := out(t, "-shape2", "toroid", "-radius2", "inf", "-radius2b", "-5.3mm", "-load", "20 N", "-angle", "0.2617993877991494rad")
	for _, q := range []struct{ label, unit string }{{"semi-major axis a", "mm"}, {"semi-minor axis b", "mm"}, {"peak pressure p0", "MPa"}, {"approach δ", "µm"}} {
		near(t, q.label, value(t, tor, q.label, q.unit), value(t, g, q.label, q.unit), 1e-12)
	}
}

// units are the words that may follow a number in a report.
var units = map[string]bool{"mm": true, "µm": true, "m": true, "MPa": true, "GPa": true, "N": true, "N/µm": true, "1/m": true, "°": true, "%": true}

// unitless are the words after which a number is a dimensionless
// quantity and takes no unit word: a Poisson's ratio and a coefficient of
// friction, as the report names them and as the echo gives their flags.
var unitless = map[string]bool{"ratio": true, "μ =": true, "-mu": true, "-nu1": true, "-nu2": true}

// problems returns what is wrong with a report: NaN or Inf text, a
// number not followed by a unit, no caution paragraph. Material names
// (which hold grades such as 52100) and the source lines of the material
// data are quoted, not computed, and are removed first.
func problems(s string) []string {
	var ps []string
	if m := regexp.MustCompile(`(?i)\bnan\b|\binf\b|infinity|\?`).FindString(s); m != "" {
		ps = append(ps, "holds "+strconv.Quote(m))
	}
	var kept []string
	for _, l := range strings.Split(s, "\n") {
		if !strings.HasPrefix(strings.TrimSpace(l), "source:") {
			kept = append(kept, l)
		}
	}
	text := strings.Join(kept, "\n")
	for _, m := range hertz.Materials() {
		text = strings.ReplaceAll(text, m.Name, "MATERIAL")
	}
	toks := strings.Fields(text)
	trim := func(s string) string { return strings.Trim(s, ",;:()") }
	for i, tok := range toks {
		if _, err := strconv.ParseFloat(trim(tok), 64); err != nil {
			continue
		}
		if i > 0 && unitless[trim(toks[i-1])] || i > 1 && unitless[toks[i-2]+" "+toks[i-1]] {
			if i+1 < len(toks) && trim(toks[i+1]) == "dimensionless" {
				ps = append(ps, "number "+strconv.Quote(tok)+" followed by a unit word for a dimensionless quantity")
			}
			continue
		}
		if i+1 >= len(toks) || !units[trim(toks[i+1])] {
			next := "the end"
			if i+1 < len(toks) {
				next = toks[i+1]
			}
			ps = append(ps, "number "+strconv.Quote(tok)+" followed by "+strconv.Quote(next)+", not a unit")
		}
	}
	if !strings.Contains(s, "Verify them by test") || !strings.Contains(s, "qualified engineer") || !strings.Contains(s, "engineering estimates") {
		ps = append(ps, "no caution paragraph")
	}
	return ps
}

// TestProblems checks the report checker itself on reports made bad on
// purpose.
func TestProblems(t *testing.T) {
	good := out(t)
	if ps := problems(good); len(ps) != 0 {
		t.Fatalf("default report: %q", ps)
	}
	for _, bad := range []string{
		strings.Replace(good, "1/m", "per metre", 1),
		strings.Replace(good, " MPa", "", 1),
		good + "\n12.5\n",
		strings.Replace(good, "approach δ:", "approach δ: NaN µm", 1),
		strings.Replace(good, "approach δ:", "approach δ: +Inf µm", 1),
		strings.Replace(good, "qualified engineer", "friend", 1),
	} {
		if len(problems(bad)) == 0 {
			t.Errorf("no problem found in a spoiled report:\n%s", bad)
		}
	}
}

// TestReportUnits runs the program over every shape and material and
// checks each report for non-finite text and numbers without units.
func TestReportUnits(t *testing.T) {
	runs := [][]string{
		{},
		{"-load", "0"},
		{"-shape2", "groove", "-radius2", "5.2mm", "-angle", "30 deg", "-tangential", "1 N"},
		{"-shape1", "cylinder", "-radius1", "3mm", "-shape2", "cylinder", "-radius2", "4mm", "-angle", "45°", "-material2", "sapphire"},
		{"-shape1", "toroid", "-radius1", "20mm", "-radius1b", "-6mm", "-shape2", "sphere", "-radius2", "5mm", "-material1", "ti-6al-4v"},
		{"-shape2", "socket", "-radius2", "5.01mm", "-material2", "fused-silica", "-load", "1kN"}, // too large for Hertz: Valid false
		{"-material1", "silicon-nitride", "-material2", "aluminium-6061-t6", "-load", "1e-6 N"},
		{"-material1", "invar-36", "-material2", "tungsten-carbide", "-load", "2 kN"},
		{"-material1", "custom", "-E1", "210 GPa", "-nu1", "0.3", "-allowable1", "2 GPa", "-material2", "custom", "-E2", "70 GPa", "-nu2", "0.33"},
		{"-load", "50000 N"}, // exceeds the allowable
		{"-material2", "custom", "-E2", "0.5MPa", "-nu2", "0.49", "-load", "0.1 N"}, // a soft silicone seat: accepted
	}
	for _, args := range runs {
		if ps := problems(out(t, args...)); len(ps) != 0 {
			t.Errorf("run(%q): %q", args, ps)
		}
	}
	if s := out(t, "-shape2", "socket", "-radius2", "5.01mm", "-material2", "fused-silica", "-load", "1kN"); !strings.Contains(s, "DOES NOT HOLD") {
		t.Errorf("a near-conforming socket under 1 kN should fail the half-space check:\n%s", s)
	}
	if s := out(t, "-load", "50000 N"); !strings.Contains(s, "p0 EXCEEDS it, margin -") {
		t.Errorf("50 kN on a 5 mm ball should exceed 4200 MPa:\n%s", s)
	}
}

// TestBadFlags checks that every bad input gives an error naming its flag.
func TestBadFlags(t *testing.T) {
	cases := []struct {
		args []string
		flag string
	}{
		{[]string{"-radius1", "abc"}, "-radius1"},
		{[]string{"-radius1", "5 parsecs"}, "-radius1"},
		{[]string{"-radius1", "nan"}, "-radius1"},
		{[]string{"-radius1", "inf"}, "-radius1"},
		{[]string{"-radius1", "-5mm"}, "-radius1"},
		{[]string{"-radius1", "0"}, "-radius1"},
		{[]string{"-shape1", "cube"}, "-shape1"},
		{[]string{"-material2", "unobtainium"}, "-material2"},
		{[]string{"-load", "-5 N"}, "-load"},
		{[]string{"-load", "5 tonnes"}, "-load"},
		{[]string{"-load", "1e400 N"}, "-load"},
		{[]string{"-angle", "north"}, "-angle"},
		{[]string{"-mu", "0"}, "-mu"},
		{[]string{"-mu", "abc"}, "-mu"},
		{[]string{"-material1", "custom", "-E1", "208Pa", "-nu1", "0.3"}, "-E1: out of range: 208 Pa: a modulus in GPa? 208 GPa is 2.08e+11 Pa"},
		{[]string{"-material2", "custom", "-E2", "3600Pa", "-nu2", "0.38"}, "-E2: out of range: 3600 Pa: a modulus in MPa? 3600 MPa is 3.6e+09 Pa"}, // PEEK's 3.6 GPa in MPa (hand conversion)
		{[]string{"-mu", "15"}, "-mu: out of range: a coefficient of friction of 15: a percentage? (15% is 0.15); at most 3"},
		{[]string{"-tangential", "100 N"}, "-tangential"},
		{[]string{"-tangential", "x"}, "-tangential"},
		{[]string{"-shape2", "flat", "-radius2", "3mm"}, "-radius2"},
		{[]string{"-shape1", "toroid", "-radius1", "5mm"}, "-radius1b"},
		{[]string{"-shape1", "toroid", "-radius1", "inf", "-radius1b", "inf"}, "-radius1b"},
		{[]string{"-radius2b", "5mm"}, "-radius2b"},
		{[]string{"-shape2", "socket", "-radius2", "4mm"}, "-radius2"},                                            // socket smaller than the ball
		{[]string{"-shape1", "cylinder", "-radius1", "5mm", "-shape2", "cylinder", "-radius2", "5mm"}, "-shape1"}, // parallel: line contact
		{[]string{"-bogus", "1"}, "-bogus"},
	}
	for _, c := range cases {
		var b strings.Builder
		err := run(c.args, &b)
		if err == nil {
			t.Errorf("run(%q) = nil, want an error naming %s", c.args, c.flag)
			continue
		}
		if !strings.Contains(err.Error(), c.flag) {
			t.Errorf("run(%q) = %v, want it to name %s", c.args, err, c.flag)
		}
		var fe *FlagError
		if c.flag != "-mu" && c.flag != "-bogus" && !errors.As(err, &fe) {
			t.Errorf("run(%q) = %v, want a *FlagError", c.args, err)
		}
		if b.Len() != 0 {
			t.Errorf("run(%q) printed a report with an error", c.args)
		}
	}
	// A hertz sentinel survives translation.
	err := run([]string{"-shape2", "socket", "-radius2", "4mm"}, new(strings.Builder))
	if !errors.Is(err, hertz.ErrGeometry) {
		t.Errorf("socket smaller than the ball: %v, want hertz.ErrGeometry", err)
	}
}

// TestHelp checks that -h lists every flag with a unit (or its list of
// names), every shape and every material with its short name.
func TestHelp(t *testing.T) {
	h := out(t, "-h")
	want := map[string]string{
		"-shape1": "sphere, flat, cylinder", "-radius1": "a length with its unit: m, cm, mm, um or µm", "-radius1b": "a length with its unit",
		"-material1": "short key", "-shape2": "toroid", "-radius2": "a length with its unit", "-radius2b": "inf for straight",
		"-material2": "short key", "-angle": "an angle with its unit: deg, ° or rad", "-load": "a force with its unit: N or kN", "-mu": "dimensionless",
		"-tangential": "a force with its unit", "-E1": "a pressure with its unit: Pa, kPa, MPa or GPa", "-nu1": "dimensionless",
		"-allowable1": "a pressure with its unit", "-E2": "a pressure with its unit", "-nu2": "dimensionless", "-allowable2": "a pressure with its unit",
	}
	for f, unit := range want {
		i := strings.Index(h, "  "+f+"\n")
		if i < 0 {
			t.Errorf("help does not list %s", f)
			continue
		}
		entry := h[i+len(f)+3:]
		entry = entry[:strings.Index(entry, "\n")]
		if !strings.Contains(entry, unit) {
			t.Errorf("help of %s = %q, want it to say %q", f, entry, unit)
		}
	}
	for _, name := range hertz.MaterialKeys() {
		m, _ := hertz.MaterialByKey(name)
		if !strings.Contains(h, name) || !strings.Contains(h, m.Name) {
			t.Errorf("help does not list material %s (%s)", name, m.Name)
		}
	}
	for _, s := range shapes {
		if !strings.Contains(h, s.name) {
			t.Errorf("help does not list shape %s", s.name)
		}
	}
	if !strings.Contains(h, "qualified engineer") {
		t.Errorf("help has no caution")
	}
	if len(hertz.MaterialKeys()) != len(hertz.Materials()) {
		t.Errorf("%d short keys for %d materials on file", len(hertz.MaterialKeys()), len(hertz.Materials()))
	}
}
