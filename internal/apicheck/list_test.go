package apicheck

import (
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// fixtureAPI is the listing of testdata/fixture, written by hand from its
// source and the line format of $GOROOT/api/go1.txt (a const gives a type
// line and a value line; untyped constants have ideal-* types; a rounded
// value is followed by its exact one, as go/constant's ExactString writes
// it; byte is uint8 and rune int32; type parameters are $0, $1; the method
// set of T holds the value methods, promoted ones included, then the
// pointer-only methods of *T). Nothing of internal/secret, examples/demo,
// cmd/tool (a main package), _skip, .hidden, testdata/data or nested (a
// module of its own) appears.
var fixtureAPI = []string{
	"pkg example.com/fixture, const Limit = 3",
	"pkg example.com/fixture, const Limit int",
	`pkg example.com/fixture, const Name = "fixture"`,
	"pkg example.com/fixture, const Name ideal-string",
	"pkg example.com/fixture, const Ratio = 0.333333  // 1/3",
	"pkg example.com/fixture, const Ratio ideal-float",
	"pkg example.com/fixture, func Read(io.Reader, []uint8) (sub.Unit, int32)",
	"pkg example.com/fixture, func Scale(float64, ...Point) ([]Point, error)",
	"pkg example.com/fixture, func Sum[$0 Number]([]$0) $0",
	"pkg example.com/fixture, method (*Point) Move(float64)",
	"pkg example.com/fixture, method (Pair[$0, $1]) Swap() Pair[$0, $1]",
	"pkg example.com/fixture, method (Point) Label() string",
	"pkg example.com/fixture, method (Point) Norm() float64",
	"pkg example.com/fixture, method (Point) String() string",
	"pkg example.com/fixture, type Alias = Point",
	"pkg example.com/fixture, type Celsius float64",
	"pkg example.com/fixture, type Number interface {}",
	"pkg example.com/fixture, type Number interface, ~int | ~float64",
	"pkg example.com/fixture, type Pair[$0 comparable, $1 interface{}] struct",
	"pkg example.com/fixture, type Pair[$0 comparable, $1 interface{}] struct, Key $0",
	"pkg example.com/fixture, type Pair[$0 comparable, $1 interface{}] struct, Val $1",
	"pkg example.com/fixture, type Point struct",
	"pkg example.com/fixture, type Point struct, X float64",
	"pkg example.com/fixture, type Point struct, Y float64",
	"pkg example.com/fixture, type Point struct, embedded sub.Unit",
	"pkg example.com/fixture, type Point struct, promoted Tag string",
	"pkg example.com/fixture, type Sealed interface, Kind() string",
	"pkg example.com/fixture, type Sealed interface, unexported methods",
	"pkg example.com/fixture, type Shape interface { Area, Write }",
	"pkg example.com/fixture, type Shape interface, Area() float64",
	"pkg example.com/fixture, type Shape interface, Write([]uint8) (int, error)",
	"pkg example.com/fixture, var Default Point",
	"pkg example.com/fixture, var ErrBad error",
	"pkg example.com/fixture/sub, method (Unit) String() string",
	"pkg example.com/fixture/sub, type Unit int",
}

// fixtureModule copies testdata/fixture into a temporary directory, makes
// it the module example.com/fixture with the module example.com/nested
// inside it, and returns its root.
func fixtureModule(t *testing.T) string {
	t.Helper()
	root := t.TempDir()
	src := filepath.Join("testdata", "fixture")
	err := filepath.WalkDir(src, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		rel, err := filepath.Rel(src, path)
		if err != nil {
			return err
		}
		dst := filepath.Join(root, rel)
		if d.IsDir() {
			return os.MkdirAll(dst, 0o755)
		}
		data, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		return os.WriteFile(dst, data, 0o644)
	})
	if err != nil {
		t.Fatal(err)
	}
	write(t, root, "go.mod", "module example.com/fixture\n\ngo 1.22\n")
	write(t, root, "nested/go.mod", "module example.com/nested\n\ngo 1.22\n")
	return root
}

func write(t *testing.T, root, name, text string) {
	t.Helper()
	path := filepath.Join(root, filepath.FromSlash(name))
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
}

func TestFixtureListing(t *testing.T) {
	t.Parallel()
	got, err := listModule(fixtureModule(t))
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(fixtureAPI, got); d != "" {
		t.Errorf("listing of testdata/fixture (-want +got):\n%s", d)
	}
}

// TestFixtureChanges checks that the listing follows a change of the API,
// so that TestAPI cannot pass by construction: each change is made to a
// fresh copy of the fixture, and the lines added and removed are written
// by hand from the change.
func TestFixtureChanges(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name           string
		file, text     string // written into the fixture module
		added, removed []string
	}{
		{
			name:  "exported func",
			file:  "added.go",
			text:  "package fixture\n\n// Added is new.\nfunc Added(n int) bool { return n > 0 }\n",
			added: []string{"pkg example.com/fixture, func Added(int) bool"},
		},
		{
			name:  "method promoted through the unexported embedded field",
			file:  "added.go",
			text:  "package fixture\n\n// Size is new.\nfunc (*inner) Size() int { return 0 }\n",
			added: []string{"pkg example.com/fixture, method (*Point) Size() int"},
		},
		{
			name:  "new public package",
			file:  "extra/extra.go",
			text:  "// Package extra is new.\npackage extra\n\n// On is new.\nconst On = true\n",
			added: []string{"pkg example.com/fixture/extra, const On = true", "pkg example.com/fixture/extra, const On ideal-bool"},
		},
		{
			name:    "changed underlying type",
			file:    "sub/sub.go",
			text:    "package sub\n\n// Unit is now an int64.\ntype Unit int64\n\n// String is unchanged.\nfunc (u Unit) String() string { return \"unit\" }\n",
			added:   []string{"pkg example.com/fixture/sub, type Unit int64"},
			removed: []string{"pkg example.com/fixture/sub, type Unit int"},
		},
		{
			name: "unexported func",
			file: "added.go",
			text: "package fixture\n\nfunc added() {}\n\nvar _ = added\n",
		},
		{
			name: "exported func in an internal package",
			file: "internal/secret/more.go",
			text: "package secret\n\n// More is not listed.\nfunc More() {}\n",
		},
		{
			name: "exported func in a main package",
			file: "cmd/tool/more.go",
			text: "package main\n\n// More is not listed.\nfunc More() {}\n",
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			root := fixtureModule(t)
			write(t, root, tt.file, tt.text)
			got, err := listModule(root)
			if err != nil {
				t.Fatal(err)
			}
			added, removed := diff(fixtureAPI, got)
			if d := cmp.Diff(tt.added, added); d != "" {
				t.Errorf("lines added (-want +got):\n%s", d)
			}
			if d := cmp.Diff(tt.removed, removed); d != "" {
				t.Errorf("lines removed (-want +got):\n%s", d)
			}
		})
	}
}

// TestFixtureBuildConstraint checks that a public package with a file
// excluded on this platform is an error, not a listing for one platform.
func TestFixtureBuildConstraint(t *testing.T) {
	t.Parallel()
	root := fixtureModule(t)
	write(t, root, "other.go", "//go:build ignore\n\npackage fixture\n\n// Other is on no platform.\nfunc Other() {}\n")
	_, err := listModule(root)
	if err == nil || !strings.Contains(err.Error(), "other.go") {
		t.Errorf("got error %v, want one naming other.go", err)
	}
}

// TestCompareMessage checks what a failing TestAPI prints: the lines added
// and removed, the command that records the change, and CHANGELOG.md.
func TestCompareMessage(t *testing.T) {
	want := []string{"pkg m, func A()", "pkg m, func B()"}
	if msg := compare(want, want); msg != "" {
		t.Errorf("compare of equal listings = %q, want \"\"", msg)
	}
	got := []string{"pkg m, func A()", "pkg m, func C()"}
	msg := compare(want, got)
	for _, s := range []string{"\n-pkg m, func B()\n", "\n+pkg m, func C()\n", "go test ./internal/apicheck -update", "CHANGELOG.md"} {
		if !strings.Contains(msg, s) {
			t.Errorf("message lacks %q:\n%s", s, msg)
		}
	}
	if strings.Contains(msg, "func A()") {
		t.Errorf("message shows an unchanged line:\n%s", msg)
	}
}

func TestParse(t *testing.T) {
	got := parse("# header\n\npkg m, func A()\r\npkg m, func B()\n")
	want := []string{"pkg m, func A()", "pkg m, func B()"} // the two item lines of the input, without "\r"
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("parse (-want +got):\n%s", d)
	}
}

func TestPublic(t *testing.T) {
	for rel, want := range map[string]bool{
		".":                  true,
		"kinematic/design":   true,
		"internal/lp":        false,
		"kinematic/internal": false,
		"examples/cassette":  false,
		"screw/testdata/x":   false,
		".git/x":             false,
		"_old/x":             false,
	} {
		if got := public(filepath.FromSlash(rel)); got != want {
			t.Errorf("public(%q) = %v, want %v", rel, got, want)
		}
	}
}
