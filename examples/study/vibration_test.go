package main

import (
	"regexp"
	"strings"
	"testing"
)

// symmetricShaken is a three-vee coupling with three-fold symmetry about
// z (balls 120° apart on a 60 mm circle, vees on the bisectors, the
// preload, the centre of mass and the point of interest on the axis,
// Ixx = Iyy), shaken along x and z. Along z no mode that tilts the body
// is excited: z is unchanged by the 120° turn, while a tilt about x or y
// is turned by it, so the stiffness and the mass matrices couple no tilt
// to z, and the response is a pure translation (tilt zero).
const symmetricShaken = `{"format":"sixfold.design/2","name":"symmetric",
"balls":[{"name":"A","centre":["0.000000 mm","60.000000 mm","0 mm"],"radius":"3 mm","material":"steel-52100"},
{"name":"B","centre":["-51.961524 mm","-30.000000 mm","0 mm"],"radius":"3 mm","material":"steel-52100"},
{"name":"C","centre":["51.961524 mm","-30.000000 mm","0 mm"],"radius":"3 mm","material":"steel-52100"}],
"seats":[{"type":"vee","half_angle":"45 deg","azimuth":0,"material":"steel-440c"},{"type":"vee","half_angle":"45 deg","azimuth":0,"material":"steel-440c"},
{"type":"vee","half_angle":"45 deg","azimuth":0,"material":"steel-440c"}],
"preloads":[{"name":"spring","point":[0,0,"20 mm"],"direction":[0,0,-1],"force":"30 N"}],
"payload":{"mass":"2 kg","centre":[0,0,"15 mm"],"inertia":{"xx":"0.0152 kg m^2","yy":"0.0152 kg m^2","zz":"0.03 kg m^2"}},
"cases":[{"name":"seated","gravity":[0,0,"-1 g"]}],"point_of_interest":[0,0,"30 mm"],"point_name":"beam",
"vibration":{"spectrum":{"name":"shaker","points":[{"frequency":"20 Hz"},{"frequency":"50 Hz","asd":"0.16 g^2/Hz","slope":"6 dB/octave"},
{"frequency":"800 Hz","asd":"0.16 g^2/Hz"},{"frequency":"2000 Hz","slope":"-6 dB/octave"}]},"case":"seated","damping":{"zeta":0.03},"duration":"60 s","axes":["x","z"]}}`

// TestRandomTiltRounding: the symmetric coupling's tilt along z is zero
// (symmetricShaken), and the report says so rather than printing the
// rounding residue as a value (it printed 3.966e-30 µrad); along x the
// body rocks, and its tilt prints as a number.
func TestRandomTiltRounding(t *testing.T) {
	code, rep, errs := runCmd(t, symmetricShaken, "-out", "none", "-")
	if code != exitPass {
		t.Fatalf("exit %d: %s\n%s", code, errs, rep)
	}
	tilt := regexp.MustCompile(`(?m)^Along (\S+) .*\n(?:.*\n){2}.*; tilt (.*)$`)
	got := map[string]string{}
	for _, m := range tilt.FindAllStringSubmatch(rep, -1) {
		got[m[1]] = m[2]
	}
	if got["z"] != "0 µrad RMS (zero to rounding)" {
		t.Errorf("along z: tilt %q, want 0 µrad RMS (zero to rounding)", got["z"])
	}
	if x := got["x"]; !strings.HasSuffix(x, " µrad RMS") || strings.HasPrefix(x, "0 ") || strings.Contains(x, "e-") {
		t.Errorf("along x: tilt %q, want a number of µrad", x)
	}
}

// TestTiltText: the threshold is tilt·size against 1e-12 of the RMS
// displacement. With a 0.1 m coupling and 26 µm RMS, the bound is
// 26e-18/0.1 = 2.6e-16 rad: 1e-16 rad is rounding, 1e-15 rad is not
// (printed as 1e-09 µrad), and no tilt against no displacement is 0.
func TestTiltText(t *testing.T) {
	for _, c := range []struct {
		tilt, disp, size float64
		want             string
	}{
		{1e-16, 26e-6, 0.1, "0 µrad RMS (zero to rounding)"},
		{1e-15, 26e-6, 0.1, "1e-09 µrad RMS"},
		{293.3e-6, 38e-6, 0.1, "293.3 µrad RMS"},
		{0, 0, 0.1, "0 µrad RMS"},
	} {
		if got := tiltText(c.tilt, c.disp, c.size); got != c.want {
			t.Errorf("tiltText(%g, %g, %g) = %q, want %q", c.tilt, c.disp, c.size, got, c.want)
		}
	}
}
