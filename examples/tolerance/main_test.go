package main

import (
	"bytes"
	"context"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// oneBall is a design whose only tolerance is a uniform ±2 µm on ball A's
// radius, in an equilateral three-vee coupling of 90° vees with the point
// of interest at ball A's centre. A larger ball rises in its vee by
// Δr/sin 45° (its centre lies r + Δr from both flanks, which meet at the
// root), and the body turns about the line through the other two ball
// centres, which carries A's centre straight up: the point moves by
// √2·Δr along z, uniform over ±2√2 µm, with standard deviation
// 2√2/√3 = 1.633 µm and |P50| = √2 µm (half the range of a uniform
// distribution; worked by hand).
const oneBall = `{
  "format": "sixfold.design/1",
  "name": "one toleranced ball (test)",
  "balls": [
    {"name": "A", "centre": ["0 mm", "50 mm", "0 mm"], "radius": "5 mm", "material": "steel-52100"},
    {"name": "B", "centre": ["-43.30127 mm", "-25 mm", "0 mm"], "radius": "5 mm", "material": "steel-52100"},
    {"name": "C", "centre": ["43.30127 mm", "-25 mm", "0 mm"], "radius": "5 mm", "material": "steel-52100"}
  ],
  "seats": [
    {"type": "vee", "up": [0, 0, 1], "half_angle": "45 deg", "direction": [0, -1, 0], "material": "steel-440c"},
    {"type": "vee", "up": [0, 0, 1], "half_angle": "45 deg", "direction": [0.8660254, 0.5, 0], "material": "steel-440c"},
    {"type": "vee", "up": [0, 0, 1], "half_angle": "45 deg", "direction": [-0.8660254, 0.5, 0], "material": "steel-440c"}
  ],
  "tolerances": [{"dimension": "A.Ball.Radius", "value": "2 um"}],
  "point_of_interest": ["0 mm", "50 mm", "0 mm"],
  "monte_carlo": {"samples": 50000, "seed": 9}
}`

func TestRun(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "d.json")
	if err := os.WriteFile(path, []byte(oneBall), 0o644); err != nil {
		t.Fatal(err)
	}
	svg := filepath.Join(dir, "h.svg")
	var out, prog bytes.Buffer
	if err := run(context.Background(), []string{"-svg", svg, path}, nil, &out, &prog); err != nil {
		t.Fatal(err)
	}
	rep := out.String()
	m := regexp.MustCompile(`(?m)^z\s+(\S+)\s+(\S+)\s+(\S+)`).FindStringSubmatch(rep)
	if m == nil {
		t.Fatalf("no z row in\n%s", rep)
	}
	mean, _ := strconv.ParseFloat(m[1], 64)
	sd, _ := strconv.ParseFloat(m[2], 64)
	p50, _ := strconv.ParseFloat(m[3], 64)
	// Sampling error of 5e4 samples: the mean within 4.5 standard
	// errors (1.633/√5e4 = 0.0073 µm), the others within 1 %.
	if math.Abs(mean) > 4.5*0.0073+0.001 || math.Abs(sd-1.633) > 0.0163 || math.Abs(p50-math.Sqrt2) > 0.0142 {
		t.Errorf("z: mean %g, sd %g, |P50| %g µm; want 0, 1.633, 1.414", mean, sd, p50)
	}
	if !strings.Contains(prog.String(), "100 %") {
		t.Errorf("progress bar did not reach 100 %%: %q", prog.String())
	}
	if b, err := os.ReadFile(svg); err != nil || !bytes.Contains(b, []byte("<svg")) {
		t.Errorf("histogram: %v", err)
	}
	if regexp.MustCompile(`\bNaN\b|Inf\b`).MatchString(rep) {
		t.Errorf("report prints NaN or Inf:\n%s", rep)
	}
	// The exact model agrees: the rise is exactly √2·Δr (geometry).
	out.Reset()
	if err := run(context.Background(), []string{"-svg", "", "-exact", "-samples", "2000", path}, nil, &out, nil); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(out.String(), "exact model") {
		t.Errorf("exact run:\n%s", out.String())
	}
}

func TestRunErrors(t *testing.T) {
	var out bytes.Buffer
	if err := run(context.Background(), nil, nil, &out, nil); err == nil {
		t.Error("no design file accepted")
	}
	if err := run(context.Background(), []string{"-"}, strings.NewReader(`{"format": "other/2"}`), &out, nil); err == nil || !strings.Contains(err.Error(), "format") {
		t.Errorf("unknown format: %v", err)
	}
	// A socket's dimension on a vee: the error lists the vee's, by the
	// names the kinematic.Assembly documentation gives a ball and a vee,
	// instead of pointing a file's user to a Go method.
	faced := strings.Replace(oneBall, `"A.Ball.Radius"`, `"A.Seat.Face1"`, 1)
	err := run(context.Background(), []string{"-svg", "", "-"}, strings.NewReader(faced), &out, nil)
	for _, want := range []string{"tolerances[0].dimension", "A.Ball.Radius, A.Ball.X, A.Ball.Y, A.Ball.Z, A.Seat.X, A.Seat.Y, A.Seat.Z", "A.Seat.Turn", "A.Seat.Tilt", "A.Seat.HalfAngle", "A.Seat.Flank+", "A.Seat.Flank-"} {
		if err == nil || !strings.Contains(err.Error(), want) || strings.Contains(err.Error(), "Assembly.Dimensions") {
			t.Errorf("a socket's dimension on a vee: %v; want it to name %q", err, want)
		}
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if err := run(ctx, []string{"-svg", "", "-"}, strings.NewReader(oneBall), &out, nil); err == nil {
		t.Error("cancelled study succeeded")
	}
}

// TestTiltRow reads the report's tilt row for oneBall. Worked by hand:
// ball A rises by √2·Δr in its vee while B and C stay (see oneBall), so
// the body turns about the line BC, which lies 75 mm from A's centre
// (A at y = 50 mm, B and C at y = −25 mm), by θ = √2·Δr / 75 mm. With Δr
// uniform over ±2 µm, |θ| is uniform over [0, θmax], θmax = 2√2 µm /
// 75 mm = 37.712 µrad, the closed-form worst-case tilt: mean and |P50|
// θmax/2 = 18.856 µrad, standard deviation θmax/√12 = 10.887 µrad,
// |P95| 0.95·θmax = 35.827, |P99| 0.99·θmax = 37.335 and |P99.73|
// 0.9973·θmax = 37.610 µrad.
func TestTiltRow(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "d.json")
	if err := os.WriteFile(path, []byte(oneBall), 0o644); err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	if err := run(context.Background(), []string{"-svg", "", path}, nil, &out, nil); err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`(?m)^tilt\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s+µrad$`).FindStringSubmatch(out.String())
	if m == nil {
		t.Fatalf("no tilt row in\n%s", out.String())
	}
	thetaMax := 2 * math.Sqrt2 * 1e-6 / 0.075 * 1e6 // µrad
	want := []float64{thetaMax / 2, thetaMax / math.Sqrt(12), thetaMax / 2, 0.95 * thetaMax, 0.99 * thetaMax, 0.9973 * thetaMax}
	names := []string{"mean", "std dev", "|P50|", "|P95|", "|P99|", "|P99.73|"}
	for i, w := range want {
		got, err := strconv.ParseFloat(m[i+1], 64)
		if err != nil {
			t.Fatal(err)
		}
		// Sampling error of 5e4 samples of a uniform variable: the
		// standard error of a quantile is √(p(1−p)/n)·θmax ≤ 0.084 µrad
		// (at P50), of the mean θmax/√(12n) = 0.049 µrad; 1 % of each
		// value allows at least two of them (0.19 µrad at P50).
		if math.Abs(got-w) > 0.01*w {
			t.Errorf("tilt %s: %g µrad, want %.3f µrad", names[i], got, w)
		}
	}
	if got, _ := strconv.ParseFloat(m[6], 64); got > thetaMax*(1+1e-9)+0.0005 {
		t.Errorf("tilt |P99.73| %g µrad beyond the worst case %.3f µrad", got, thetaMax)
	}
}

// TestDefaultOutputIgnored: run from the repository root as the README
// shows, the default histogram lands in the root; it must be git-ignored
// there, and the README must say where it goes.
func TestDefaultOutputIgnored(t *testing.T) {
	var out bytes.Buffer
	_ = run(context.Background(), []string{"-h"}, nil, &out, nil)
	m := regexp.MustCompile(`-svg string[^\n]*\n[^\n]*\(default "([^"]+)"\)`).FindStringSubmatch(out.String())
	if m == nil {
		t.Fatalf("no default for -svg in the usage:\n%s", out.String())
	}
	ign, err := os.ReadFile("../../.gitignore")
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, line := range strings.Split(string(ign), "\n") {
		if line == m[1] || line == "/"+m[1] {
			found = true
		}
	}
	if !found {
		t.Errorf(".gitignore does not ignore the default output %s", m[1])
	}
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(readme), "to `"+m[1]+"` in the current directory") {
		t.Errorf("the README does not say that %s is written to the current directory", m[1])
	}
}
