package main

import (
	"fmt"
	"math"
	"os"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

const filterwheel = "../magnetmount/filterwheel.json"

// TestFilterWheel runs the magnet-preloaded demo and checks its figures:
// the seated contact forces against the hand calculation of a symmetric
// three-vee of 90° vees under a central vertical load P (each of the six
// flanks leans 45° from the vertical, so vertical balance gives
// 6 f sin 45° = P, f = P/(6 sin 45°), worked by hand) with
// P the magnets' pull at 0.6 mm (the law checked in kinematic against the
// dipole limit and a quadrature) plus the weight 0.15 kg·g₀; and the
// report's statements: the window's gap range, the magnets letting go
// where the first contact opens, the spring of the same force holding.
func TestFilterWheel(t *testing.T) {
	src, err := os.ReadFile(filterwheel)
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
	ev, err := b.Evaluate(t.Context())
	if err != nil {
		t.Fatal(err)
	}
	n42 := kinematic.Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: kinematic.RemanenceN42}
	pull, _, err := kinematic.MagnetPair{Moving: n42, Base: n42}.Force(0.0006)
	if err != nil {
		t.Fatal(err)
	}
	want := (pull + 0.15*kinematic.StandardGravity) / (6 * math.Sin(math.Pi/4))
	for _, c := range ev.Cases[0].Contacts {
		if math.Abs(c.Force/want-1) > 1e-9 {
			t.Errorf("contact %s: %.6g N; by hand (P + m g)/(6 sin 45°) = %.6g N", c.Label, c.Force, want)
		}
	}
	if sh := ev.Shock; sh == nil || sh.Runaway != sh.Unload {
		t.Errorf("shock %+v: a magnet should let go where the first contact opens", sh)
	}
	code, out, errs := runCmd(t, "", "-out", t.TempDir(), filterwheel)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, s := range []string{
		fmt.Sprintf("preload curve of N42 magnet pair: %.4g N at the seated gap of 0.600 mm", pull),
		"(a negative spring",
		// The window's gaps by the law, not by its code: the pull at
		// touching stays below the upper force (GapWindow leaves MinGap
		// 0), and the law needs a gap > 0 (package kinematic, "a seated
		// gap must be > 0"), so no gap of 0.000 mm is offered.
		"met with any seated gap above 0 (the law needs a gap > 0",
		"the part runs away at the same",
		"the part is pulled back at any level (no runaway)",
		"preload-curve-1.svg",
	} {
		if !strings.Contains(out, s) {
			t.Errorf("the report lacks %q", s)
		}
	}
	if strings.Contains(out, "gap from 0.000 mm") {
		t.Error("the report offers a seated gap of 0, which the law refuses")
	}
	// Why there is no lower gap: the pair's pull 1 µm from touching lies
	// below the window's upper force, as the report says.
	m := regexp.MustCompile(`its window: \S+ N to (\S+) N, met with any seated gap above 0`).FindStringSubmatch(out)
	if m == nil {
		t.Fatalf("no window line in\n%s", out)
	}
	upper, _ := strconv.ParseFloat(m[1], 64)
	if near, _, err := (kinematic.MagnetPair{Moving: n42, Base: n42}).Force(1e-6); err != nil || near >= upper {
		t.Errorf("pull at 1 µm %g N (%v), not below the window's upper %g N", near, err, upper)
	}
}
