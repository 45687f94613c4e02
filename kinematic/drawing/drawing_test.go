package drawing_test

import (
	"bytes"
	"context"
	"encoding/xml"
	"errors"
	"go/parser"
	"go/token"
	"io"
	"io/fs"
	"math"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// TestExamplesImportPublicOnly: no program under examples/ imports an
// internal package of the module, so that a user can copy any of them
// out of the module and build it.
func TestExamplesImportPublicOnly(t *testing.T) {
	root := filepath.Join("..", "..", "examples")
	fset := token.NewFileSet()
	n := 0
	err := filepath.WalkDir(root, func(path string, e fs.DirEntry, err error) error {
		if err != nil || e.IsDir() || !strings.HasSuffix(path, ".go") {
			return err
		}
		f, err := parser.ParseFile(fset, path, nil, parser.ImportsOnly)
		if err != nil {
			return err
		}
		n++
		for _, im := range f.Imports {
			p, _ := strconv.Unquote(im.Path.Value)
			if strings.HasPrefix(p, "github.com/sixfold-dev/sixfold/") && (strings.Contains(p, "/internal/") || strings.HasSuffix(p, "/internal")) {
				t.Errorf("%s imports %s", path, p)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if n < 6 {
		t.Errorf("only %d Go files under %s; the examples have moved?", n, root)
	}
}

// built returns the example's bench fixture built and evaluated.
func built(t testing.TB, src string) (*design.Built, design.Evaluation) {
	t.Helper()
	d, err := design.Parse([]byte(src))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	ev, err := b.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	return b, ev
}

// wellFormed fails unless svg is one well-formed XML document whose root
// is an svg element.
func wellFormed(t *testing.T, name string, svg []byte) {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(svg))
	root := ""
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if s, ok := tok.(xml.StartElement); ok && root == "" {
			root = s.Name.Local
		}
	}
	if root != "svg" {
		t.Errorf("%s: root element %q", name, root)
	}
	if bytes.Contains(svg, []byte("NaN")) || bytes.Contains(svg, []byte("Inf")) {
		t.Errorf("%s holds a NaN or an infinity", name)
	}
}

// TestDrawings draws each drawing with the zero Options and checks the
// default words and the documented errors.
func TestDrawings(t *testing.T) {
	b, ev := built(t, bench)
	var buf bytes.Buffer
	if err := drawing.Plan(&buf, b, ev, nil); err != nil {
		t.Fatal(err)
	}
	wellFormed(t, "plan", buf.Bytes())
	if !strings.Contains(buf.String(), "point of interest") {
		t.Error("plan: the zero Options should name the point of interest so")
	}

	// Lift-off at the point of interest's height, 30 mm above the balls
	// (bench: point_of_interest z = 30 mm, balls at z = 0).
	buf.Reset()
	if err := drawing.LiftOff(&buf, b, &drawing.Options{}); err != nil {
		t.Fatal(err)
	}
	wellFormed(t, "lift-off", buf.Bytes())
	if !strings.Contains(buf.String(), "at 30 mm above the balls") {
		t.Error("lift-off: the face should default to the point of interest's height, 30 mm")
	}
	if err := drawing.LiftOff(io.Discard, b, &drawing.Options{FaceHeight: math.NaN()}); !errors.Is(err, kinematic.ErrNonFinite) {
		t.Errorf("lift-off at NaN: %v", err)
	}

	res, err := b.Assembly().Study(context.Background(), b.Design().Point,
		[]kinematic.Tolerance{{Dimension: "A.Ball.X", HalfWidth: 1e-6}}, &kinematic.StudyOptions{Samples: 200, Seed: 1, KeepSamples: true})
	if err != nil {
		t.Fatal(err)
	}
	buf.Reset()
	if err := drawing.Histogram(&buf, res, &drawing.Options{Notes: []string{"two hundred parts"}}); err != nil {
		t.Fatal(err)
	}
	wellFormed(t, "histogram", buf.Bytes())
	if !strings.Contains(buf.String(), "two hundred parts") {
		t.Error("histogram: the caller's note is missing")
	}
	res.Points = nil
	if err := drawing.Histogram(io.Discard, res, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("histogram without samples: %v", err)
	}

	card, err := b.Coupling().Score(b.Scenario())
	if err != nil {
		t.Fatal(err)
	}
	buf.Reset()
	if err := drawing.Scorecards(&buf, []string{"as drawn", "again"}, []kinematic.Scorecard{card, card}, nil); err != nil {
		t.Fatal(err)
	}
	wellFormed(t, "scorecards", buf.Bytes())
	if err := drawing.Scorecards(io.Discard, []string{"one"}, []kinematic.Scorecard{card, card}, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("one name for two cards: %v", err)
	}
	still := card
	still.FirstFrequency = 0
	err = drawing.Scorecards(io.Discard, []string{"a", "b"}, []kinematic.Scorecard{card, still}, nil)
	if !errors.Is(err, kinematic.ErrRange) || !strings.Contains(err.Error(), "cards[1].FirstFrequency") {
		t.Errorf("a card without a frequency: %v", err)
	}
}

// TestLiftOffNeedsACase: a design without load cases has no lift-off
// map.
func TestLiftOffNeedsACase(t *testing.T) {
	src := strings.Replace(bench, `"cases": [{"name": "seated", "gravity": [0, 0, "-1 g"]}],`, "", 1)
	b, _ := built(t, src)
	if err := drawing.LiftOff(io.Discard, b, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("no load case: %v", err)
	}
}
