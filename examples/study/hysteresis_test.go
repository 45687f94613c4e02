package main

import (
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// TestHysteresisSection runs the probe design, whose cycle "probe touch"
// pushes the stylus tip with 0.5 N along +x, then −x, then lets go, in
// 3 steps of 20 substeps. By hand: 60 steps in all, the largest force
// 0.5 N along (1, 0, 0). The printed largest displacement along the push
// lies between the linear displacements of the coupling with the
// contacts stuck (no-slip tangential stiffness, the stiffest) and free to
// slip (normal stiffness only), 0.5 N times the compliance along x at the
// tip from kinematic.Stiffness.Compliance (Johnson, Contact Mechanics,
// 1985, §7.2: partial slip lies between the two). The residual is in the
// report, the verdict and hysteresis.svg.
func TestHysteresisSection(t *testing.T) {
	dir := t.TempDir()
	const file = "testdata/probe.json"
	code, rep, errs := runCmd(t, "", "-out", dir, file)
	if code != exitPass {
		t.Fatalf("exit status %d; stderr %s\n%s", code, errs, rep)
	}
	for _, want := range []string{
		"Hysteresis under a load cycle",
		`cycle "probe touch" (3 steps of 20 substeps, 60 in all) added to case "upright", friction mu = 0.15`,
		"largest force 0.5 N along (1.000, 0.000, 0.000)",
		"requirements.max_hysteresis.displacement",
		"wrote " + filepath.Join(dir, "hysteresis.svg"),
	} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	m := regexp.MustCompile(`largest displacement of the stylus tip along it ([0-9.e+-]+) µm`).FindStringSubmatch(rep)
	if m == nil {
		t.Fatalf("no largest displacement in the report:\n%s", rep)
	}
	peak, err := strconv.ParseFloat(m[1], 64)
	if err != nil {
		t.Fatal(err)
	}
	src, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	d, err := design.Parse(src)
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	var lin [2]float64
	for i, tang := range []bool{true, false} {
		st, err := b.Model().Stiffness(d.Cases[0], &kinematic.StiffnessOptions{Tangential: tang})
		if err != nil {
			t.Fatal(err)
		}
		c, err := st.Compliance(d.Point)
		if err != nil {
			t.Fatal(err)
		}
		lin[i] = 0.5 * c.Matrix[0][0] * 1e6 // µm under 0.5 N along x at the tip
	}
	if !(lin[0] < peak && peak < lin[1]) {
		t.Errorf("largest displacement %g µm not between stuck %g µm and free %g µm", peak, lin[0], lin[1])
	}
	text, elems := svgElements(t, filepath.Join(dir, "hysteresis.svg"))
	if elems < 20 || !strings.Contains(text, "stylus tip") || !strings.Contains(text, "its component along the load") {
		t.Errorf("hysteresis.svg: %d elements, text %q", elems, text)
	}
	// The report gives the residual's 3-D magnitude and direction and, as
	// the drawing's red dot, its component along the load (1, 0, 0): the
	// magnitude times the direction's x (a dot product), and the value
	// that the drawing's legend gives to three figures.
	m = regexp.MustCompile(`residual after the cycle: displacement (\S+) µm \(3-D magnitude\) along \((\S+), \S+, \S+\)`).FindStringSubmatch(rep)
	c := regexp.MustCompile(`of which (\S+) µm along the largest force \(1.000, 0.000, 0.000\) \(the red dot of hysteresis.svg\)`).FindStringSubmatch(rep)
	if m == nil || c == nil {
		t.Fatalf("no residual magnitude or component in the report:\n%s", rep)
	}
	mag, _ := strconv.ParseFloat(m[1], 64)
	ux, _ := strconv.ParseFloat(m[2], 64)
	comp, _ := strconv.ParseFloat(c[1], 64)
	if want := mag * ux; math.Abs(comp-want) > 1e-3*math.Abs(mag)+5e-4*math.Abs(want) {
		t.Errorf("residual along x %g µm, want %g × %g = %g", comp, mag, ux, want)
	}
	if !strings.Contains(text, "its component along the load: "+strconv.FormatFloat(comp, 'e', 2, 64)) &&
		!strings.Contains(text, "its component along the load: "+strconv.FormatFloat(comp, 'g', 3, 64)) {
		t.Errorf("the drawing's legend does not give the report's component %g µm:\n%s", comp, text)
	}
}
