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

// TestBareNumbers checks that a bare number for a length, angle, force
// or pressure is refused with its flag and the units it most likely
// meant ("-radius1 5" could be 5 mm or 5 m), and that a bare 0, zero in
// every unit, is accepted.
func TestBareNumbers(t *testing.T) {
	for _, c := range []struct {
		args    []string
		flag    string
		suggest string
	}{
		{[]string{"-radius1", "5"}, "-radius1", `write "5 mm" or "5 m"`},
		{[]string{"-shape2", "groove", "-radius2", "5.2"}, "-radius2", `write "5.2 mm" or "5.2 m"`},
		{[]string{"-shape1", "toroid", "-radius1", "20mm", "-radius1b", "-6"}, "-radius1b", `write "-6 mm" or "-6 m"`},
		{[]string{"-load", "50"}, "-load", `write "50 N" or "50 kN"`},
		{[]string{"-tangential", "1"}, "-tangential", `write "1 N" or "1 kN"`},
		{[]string{"-angle", "30"}, "-angle", `write "30 deg" or "30 rad"`},
		{[]string{"-material1", "custom", "-E1", "210", "-nu1", "0.3"}, "-E1", `write "210 GPa" or "210 MPa"`},
		{[]string{"-material2", "custom", "-E2", "70 GPa", "-nu2", "0.33", "-allowable2", "500"}, "-allowable2", `write "500 GPa" or "500 MPa"`},
	} {
		var b strings.Builder
		err := run(c.args, &b)
		var fe *FlagError
		if !errors.As(err, &fe) || fe.Flag != c.flag || !strings.Contains(err.Error(), "has no unit") || !strings.Contains(err.Error(), c.suggest) {
			t.Errorf("run(%q) = %v, want flag %s: … has no unit: %s", c.args, err, c.flag, c.suggest)
		}
		if b.Len() != 0 {
			t.Errorf("run(%q) printed a report with an error", c.args)
		}
	}
	out(t, "-angle", "0", "-tangential", "0", "-load", "0") // zero needs no unit
}

// TestEcho checks that the report echoes every input as read, each with
// its unit: the values are the flags' own, converted by hand (0.2 kN is
// 200 N, 0.5236 rad is 30.00°, 5200 µm is 5.2 mm).
func TestEcho(t *testing.T) {
	s := out(t, "-radius1", "0.005 m", "-shape2", "groove", "-radius2", "5200um", "-material2", "custom",
		"-E2", "70 GPa", "-nu2", "0.33", "-allowable2", "300 MPa", "-angle", "0.5235987755982988rad", "-load", "0.2kN", "-mu", "0.2", "-tangential", "10 N")
	for _, want := range []string{
		"-shape1        sphere", "-radius1       5 mm", "-material1     steel-52100: AISI 52100 bearing steel",
		"E = 208 GPa, Poisson's ratio 0.3, allowable 4200 MPa",
		"-shape2        groove", "-radius2       5.2 mm", "-material2     custom: custom material of the second body",
		"-E2            70 GPa", "-nu2           0.33\n", "-allowable2    300 MPa",
		"-angle         30 °", "-load          200 N", "-mu            0.2\n", "-tangential    10 N",
	} {
		if !strings.Contains(s, "  "+want+"\n") && !strings.Contains(s, want) {
			t.Errorf("the report does not echo %q:\n%s", want, s)
		}
	}
	if ps := problems(s); len(ps) != 0 {
		t.Errorf("%q", ps)
	}
}

// TestCustomMaterial checks a material given on the command line: one
// with the values of AISI 52100 from package hertz's table gives the same
// report figures as the table's own key (an identity), and a softer one
// gives Hertz's closed forms for a sphere on a plane with E* from
// Johnson's 1/E* = (1−ν1²)/E1 + (1−ν2²)/E2 (Contact Mechanics, 1985, eq.
// 4.22, from memory) and its allowable margin.
func TestCustomMaterial(t *testing.T) {
	m := hertz.Steel52100
	table := out(t, "-material1", "steel-52100", "-load", "50 N")
	own := out(t, "-material1", "custom", "-E1", "208 GPa", "-nu1", "0.3", "-allowable1", "4200 MPa", "-load", "50 N")
	if m.E != 208e9 || m.Nu != 0.3 || m.Allowable != 4200e6 {
		t.Fatalf("hertz.Steel52100 changed (%+v): update the custom flags of this test", m)
	}
	for _, q := range []struct{ label, unit string }{{"semi-major axis a", "mm"}, {"peak pressure p0", "MPa"}, {"approach δ", "µm"},
		{"normal stiffness dF/dδ", "N/µm"}, {"effective shear modulus G*", "GPa"}} {
		if g, w := value(t, own, q.label, q.unit), value(t, table, q.label, q.unit); g != w {
			t.Errorf("%s: custom %g, table %g", q.label, g, w)
		}
	}
	if !regexp.MustCompile(`first body:\s+4200 MPa; p0 within it`).MatchString(own) {
		t.Errorf("custom allowable not reported:\n%s", own)
	}

	soft := hertz.Material{E: 70e9, Nu: 0.33}
	s := out(t, "-material1", "custom", "-E1", "70 GPa", "-nu1", "0.33", "-allowable1", "0.5 GPa", "-load", "20 N")
	const F, R = 20.0, 5e-3
	E := estar(soft, hertz.Steel440C)
	a := math.Cbrt(3 * F * R / (4 * E))
	p0 := 3 * F / (2 * math.Pi * a * a)
	near(t, "E*", value(t, s, "effective modulus E*", "GPa")*1e9, E, printed)
	near(t, "a", value(t, s, "semi-major axis a", "mm")*1e-3, a, printed)
	near(t, "p0", value(t, s, "peak pressure p0", "MPa")*1e6, p0, printed)
	mm := regexp.MustCompile(`first body:\s+500 MPa; p0 (within|EXCEEDS) it, margin (-?[0-9.]+) %`).FindStringSubmatch(s)
	if mm == nil {
		t.Fatalf("no margin against the custom allowable in:\n%s", s)
	}
	near(t, "margin %", parse(t, mm[2]), 100*(500e6-p0)/500e6, printed)
}

// TestCustomErrors checks the refusals of a custom material, each naming
// its flag.
func TestCustomErrors(t *testing.T) {
	for _, c := range []struct {
		args   []string
		flag   string
		reason string
	}{
		{[]string{"-E1", "210 GPa"}, "-E1", "only a custom material takes it"},
		{[]string{"-material2", "steel-440c", "-nu2", "0.3"}, "-nu2", "only a custom material takes it"},
		{[]string{"-material1", "custom", "-nu1", "0.3"}, "-E1", "needs -E1 and -nu1"},
		{[]string{"-material1", "custom", "-E1", "210 GPa"}, "-nu1", "needs -E1 and -nu1"},
		{[]string{"-material1", "custom", "-E1", "210 GPa", "-nu1", "0.7"}, "-nu1", "Poisson's ratio"},
		{[]string{"-material1", "custom", "-E1", "0 GPa", "-nu1", "0.3"}, "-E1", "Young's modulus"},
		{[]string{"-material1", "custom", "-E1", "210 mm", "-nu1", "0.3"}, "-E1", "is not a pressure"},
		{[]string{"-material1", "custom", "-E1", "210 GPa", "-nu1", "x"}, "-nu1", "plain number"},
		{[]string{"-material1", "custom", "-E1", "210 GPa", "-nu1", "0.3", "-allowable1", "-1 GPa"}, "-allowable1", "≥ 0"},
		{[]string{"-material2", "440c"}, "-material2", `did you mean "steel-440c"?`},
		{[]string{"-material1", "52100"}, "-material1", `did you mean "steel-52100"?`},
	} {
		err := run(c.args, new(strings.Builder))
		var fe *FlagError
		if !errors.As(err, &fe) || fe.Flag != c.flag || !strings.Contains(err.Error(), c.reason) {
			t.Errorf("run(%q) = %v, want flag %s: …%s…", c.args, err, c.flag, c.reason)
		}
	}
}

// TestMaterialKeys checks that the command line takes every key of
// package hertz's table, the names design files use, for either body.
func TestMaterialKeys(t *testing.T) {
	for _, k := range hertz.MaterialKeys() {
		m, _ := hertz.MaterialByKey(k)
		s := out(t, "-material1", k, "-material2", k, "-load", "1 N")
		if !strings.Contains(s, "-material1     "+k+": "+m.Name) || !strings.Contains(s, "-material2     "+k+": "+m.Name) {
			t.Errorf("%s: the report does not name %s for both bodies", k, m.Name)
		}
	}
}

func parse(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatal(err)
	}
	return v
}
