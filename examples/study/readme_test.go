package main

import (
	"context"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// readmeDesign returns the design file of the README's "Your own design".
func readmeDesign(t *testing.T) string {
	t.Helper()
	b, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	s := string(b)
	i := strings.Index(s, "## Your own design")
	if i < 0 {
		t.Fatal(`README.md has no "## Your own design"`)
	}
	s = s[i:]
	start := strings.Index(s, "```json\n")
	if start < 0 {
		t.Fatal("no JSON design in the README's own-design section")
	}
	s = s[start+len("```json\n"):]
	end := strings.Index(s, "```")
	if end < 0 {
		t.Fatal("the README's JSON block does not end")
	}
	return s[:end]
}

// TestReadmeOwnDesign follows the README's path of a user with their own
// file: write it, run the one command, read the report, open the
// drawings, assert it in a Go test.
func TestReadmeOwnDesign(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "stage.json")
	if err := os.WriteFile(path, []byte(readmeDesign(t)), 0o644); err != nil {
		t.Fatal(err)
	}

	// The command's defaults, as the README states them.
	cfg, err := parseArgs([]string{path}, nil)
	if err != nil || cfg.out != "stage-out" || cfg.optimized != filepath.Join(dir, "stage.optimized.json") {
		t.Errorf("defaults for %s: %+v, %v; want the drawings in stage-out", path, cfg, err)
	}

	out := filepath.Join(dir, "stage-out")
	code, rep, errs := runCmd(t, "", "-out", out, path)
	if code != exitPass {
		t.Fatalf("exit status %d; stderr %s\n%s", code, errs, rep)
	}
	// Vertical balance by hand: the six flank normals of the 90° vees
	// lean 45° from vertical and share the clamp and the weight equally
	// (the balls lie symmetric about the load's line), so each carries
	// (50 N + 0.5 kg · 9.80665 m/s²) / (6 cos 45°) = 12.941 N.
	for _, want := range []string{"My stage\n========", "error amplification at the sample", "requirements.min_contact_force: 12.94 N",
		"requirements.min_shock", "Every requirement is met (2).", "Caution:"} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q\n%s", want, rep)
		}
	}
	for _, name := range []string{"plan.svg", "liftoff.svg"} {
		if _, elems := svgElements(t, filepath.Join(out, name)); elems < 20 {
			t.Errorf("%s: only %d elements", name, elems)
		}
	}

	// The README's Go test, on the same file.
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	d, err := design.Read(f)
	if err != nil {
		t.Fatal(err)
	}
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	if err := ev.Verdicts().Err(); err != nil {
		t.Fatal(err)
	}
}
