package design

import (
	"bytes"
	"errors"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestRoundTrip checks that the canonical form of every test file reads
// back as an equal Design, and that writing that again gives the same
// bytes.
func TestRoundTrip(t *testing.T) {
	files, err := filepath.Glob("testdata/*.json")
	if err != nil || len(files) < 4 {
		t.Fatalf("test files %v, %v", files, err)
	}
	for _, f := range files {
		t.Run(filepath.Base(f), func(t *testing.T) {
			d1, err := Parse(readFile(t, f))
			if err != nil {
				t.Fatal(err)
			}
			roundTrip(t, d1)
		})
	}
	t.Run("base", func(t *testing.T) {
		d, err := Parse([]byte(baseJSON))
		if err != nil {
			t.Fatal(err)
		}
		roundTrip(t, d)
	})
}

// roundTrip checks Read(Write(d)) == d and that Write is stable; it
// returns the canonical bytes.
func roundTrip(t *testing.T, d1 *Design) []byte {
	t.Helper()
	var w1 bytes.Buffer
	if err := d1.Write(&w1); err != nil {
		t.Fatal(err)
	}
	d2, err := Read(bytes.NewReader(w1.Bytes()))
	if err != nil {
		t.Fatalf("the canonical form does not read back: %v\n%s", err, w1.Bytes())
	}
	if diff := cmp.Diff(d1, d2); diff != "" {
		t.Fatalf("Read(Write(d)) differs (-want +got):\n%s", diff)
	}
	var w2 bytes.Buffer
	if err := d2.Write(&w2); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(w1.Bytes(), w2.Bytes()) {
		t.Errorf("writing twice gives different files:\n%s\n%s", w1.Bytes(), w2.Bytes())
	}
	return w1.Bytes()
}

// TestCanonicalForm checks the canonical writer's choices: SI numbers,
// table materials by key and others inline, grooves by azimuth kept as
// azimuths, defaults written where the reader needs them.
func TestCanonicalForm(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/socket.json"))
	if err != nil {
		t.Fatal(err)
	}
	out := string(roundTrip(t, d))
	for _, want := range []string{
		`"format": "sixfold.design/2"`,
		`"units": "si"`,
		`"radius": 0.004`,                  // "4 mm"
		`"material": "silicon-nitride"`,    // a table entry, by key
		`"e": 210000000000`,                // "210 GPa", inline
		`"half_angle": 0.6981317007977318`, // "40 deg"
		`"azimuth": 0`,
		`"reference": "radial"`,
		`"preload": 1.2`,
		`"preload": 1,`, // the default, written out
		`"seed": 18446744073709551615`,
		`"percentile": "p99.73"`,
		`"seating": {}`,
	} {
		if !strings.Contains(out, want) {
			t.Errorf("canonical form lacks %s:\n%s", want, out)
		}
	}
	if strings.Contains(out, " mm") || strings.Contains(out, "deg") {
		t.Errorf("canonical form carries units:\n%s", out)
	}
}

// TestGoDesign builds a design in Go, as a program would, and checks that
// it writes and reads back equal, and that Write refuses a design that
// Validate rejects.
func TestGoDesign(t *testing.T) {
	up := r3.Vec{Z: 1}
	mat := hertz.Material{Name: "custom", E: 190e9, Nu: 0.29, Alpha: 16e-6, Source: "invented"}
	d := &Design{
		Name: "rods",
		Balls: []Ball{
			{Name: "P", Centre: r3.Vec{X: -0.05}, Radius: 3e-3, Material: hertz.Steel52100},
			{Name: "Q", Centre: r3.Vec{X: 0.05}, Radius: 3e-3, Material: hertz.Steel52100},
			{Name: "R_1", Centre: r3.Vec{Y: 0.07}, Radius: 3e-3, Material: mat},
		},
		Seats: []Seat{
			{Type: Rods, Up: up, HalfAngle: math.Pi / 4, RodRadius: 2e-3, Azimuth: 0.1, Reference: kinematic.FrameX, Material: hertz.Steel440C},
			{Type: Rods, Up: up, HalfAngle: math.Pi / 4, RodRadius: 2e-3, Direction: r3.Vec{X: 1, Y: 2}, Material: hertz.Steel440C},
			{Type: Vee, Up: up, HalfAngle: math.Pi / 4, Material: mat},
		},
		Cases:      []kinematic.LoadCase{{Name: "g", NoPreload: true, Gravity: r3.Vec{Z: -9.80665}}},
		Payload:    kinematic.Payload{Mass: 0.1},
		Tolerances: []kinematic.Tolerance{{Dimension: "P.Seat.Rod+", Sigma: 1e-6}},
		Point:      r3.Vec{Z: 0.01},
	}
	roundTrip(t, d)

	bad := *d
	bad.Seats = append([]Seat(nil), d.Seats...)
	bad.Seats[2].RodRadius = 1e-3 // a vee has no rods
	var out bytes.Buffer
	err := bad.Write(&out)
	var e *Error
	if !errors.As(err, &e) || e.Path != "seats[2].rod_radius" || out.Len() != 0 {
		t.Errorf("Write of an invalid design: %v, %d bytes written; want an error on seats[2].rod_radius and nothing written", err, out.Len())
	}
	bad = *d
	bad.Payload.Inertia = [3][3]float64{{1, 1e-20, 0}, {0, 1, 0}, {0, 0, 1}}
	if err := bad.Validate(); !errors.As(err, &e) || e.Path != "payload.inertia.xy" {
		t.Errorf("an asymmetric tensor: %v, want an error on payload.inertia.xy", err)
	}
}
