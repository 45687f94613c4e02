package apicheck

import (
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite testdata/api.txt with the current exported API")

// recorded is the checked-in listing, relative to this package's directory.
const recorded = "testdata/api.txt"

// updateCommand records a change of the API; run from the module root.
const updateCommand = "go test ./internal/apicheck -update"

// header opens the recorded file; comparisons skip it.
const header = `# The exported API of the public packages of this module, one item a line,
# in the format of $GOROOT/api/go1.txt (see internal/apicheck/doc.go).
# Do not edit: change the code, run "` + updateCommand + `" from the
# module root, and list the change in CHANGELOG.md.
`

// TestAPI checks that the exported API of the module's public packages is
// the one recorded in testdata/api.txt.
func TestAPI(t *testing.T) {
	root := moduleRoot(t)
	got, err := listModule(root)
	if err != nil {
		t.Fatal(err)
	}
	if *update {
		if err := os.WriteFile(recorded, []byte(header+strings.Join(got, "\n")+"\n"), 0o644); err != nil {
			t.Fatal(err)
		}
		t.Logf("wrote %d lines to %s", len(got), recorded)
		return
	}
	data, err := os.ReadFile(recorded)
	if err != nil {
		t.Fatalf("%v\nrecord the API with\n\t%s", err, updateCommand)
	}
	if msg := compare(parse(string(data)), got); msg != "" {
		t.Error(msg)
	}
}

// TestPublicPackagesOfThisModule checks that the walk finds the public
// packages of today's tree, those DEVELOPERS.md lists under "Layers"
// outside internal/ and examples/, and nothing under internal/ or
// examples/.
func TestPublicPackagesOfThisModule(t *testing.T) {
	pkgs, err := publicPackages(moduleRoot(t))
	if err != nil {
		t.Fatal(err)
	}
	var paths []string
	for _, p := range pkgs {
		paths = append(paths, p.ImportPath)
		if strings.Contains(p.ImportPath, "/internal/") || strings.Contains(p.ImportPath, "/examples/") {
			t.Errorf("%s is listed as public", p.ImportPath)
		}
	}
	const mod = "github.com/sixfold-dev/sixfold/"
	for _, want := range []string{"hertz", "kinematic", "kinematic/design", "screw"} {
		if !slices.Contains(paths, mod+want) {
			t.Errorf("%s%s is missing from the public packages %v", mod, want, paths)
		}
	}
}

// parse returns the item lines of a recorded file: blank lines and
// comment lines starting with "#" are skipped, a carriage return before a
// newline is ignored.
func parse(data string) []string {
	var lines []string
	for l := range strings.SplitSeq(data, "\n") {
		l = strings.TrimSuffix(l, "\r")
		if l == "" || strings.HasPrefix(l, "#") {
			continue
		}
		lines = append(lines, l)
	}
	return lines
}

// compare returns "" if want and got hold the same lines, otherwise a
// message with the lines added (+) and removed (-) in got, the command
// that records the change, and the reminder that CHANGELOG.md lists it.
func compare(want, got []string) string {
	added, removed := diff(want, got)
	if len(added) == 0 && len(removed) == 0 {
		return ""
	}
	var b strings.Builder
	fmt.Fprintf(&b, "the exported API differs from internal/apicheck/%s (%d added, %d removed):\n", recorded, len(added), len(removed))
	for _, l := range removed {
		b.WriteString("-" + l + "\n")
	}
	for _, l := range added {
		b.WriteString("+" + l + "\n")
	}
	fmt.Fprintf(&b, "If the change is intended, record it from the module root with\n\t%s\n", updateCommand)
	b.WriteString("and list it in CHANGELOG.md under Unreleased (Added, Changed or Removed) in the same commit.")
	return b.String()
}

// diff returns the lines of got that are not in want (added) and those of
// want that are not in got (removed), each sorted.
func diff(want, got []string) (added, removed []string) {
	in := func(s []string) map[string]bool {
		m := make(map[string]bool, len(s))
		for _, l := range s {
			m[l] = true
		}
		return m
	}
	w, g := in(want), in(got)
	for l := range g {
		if !w[l] {
			added = append(added, l)
		}
	}
	for l := range w {
		if !g[l] {
			removed = append(removed, l)
		}
	}
	slices.Sort(added)
	slices.Sort(removed)
	return added, removed
}

// moduleRoot returns the directory of the go.mod that holds this package.
func moduleRoot(t *testing.T) string {
	t.Helper()
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			return dir
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Fatal("no go.mod above the test's directory")
		}
		dir = parent
	}
}
