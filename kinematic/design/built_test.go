package design

import (
	"errors"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// kinematicNames are spellings of package kinematic's fields and
// parameters that must never reach a design error: the file's caller
// knows only the file's JSON paths. ("A.Ball.X" is the file's own name
// of a dimension.)
var kinematicNames = []string{"Pairs[", "tols[", "cs[", "opt.", "magnitude", "th.", "lc.", "payload.Mass", "preloads[0].Direction"}

// noKinematicNames fails when err's message or paths spell a field of
// package kinematic.
func noKinematicNames(t *testing.T, err error) {
	t.Helper()
	var e *Error
	if errors.As(err, &e) {
		for _, p := range []string{e.Path, e.Other} {
			if strings.ContainsAny(p, "ABCDEFGHIJKLMNOPQRSTUVWXYZ") {
				t.Errorf("path %q of %q is not a JSON path of the file", p, err)
			}
		}
	}
	for _, n := range kinematicNames {
		if strings.Contains(err.Error(), n) {
			t.Errorf("error %q spells kinematic's %q", err, n)
		}
	}
}

// TestTwoPaths: an error about two entries of the file names both by
// their JSON paths, in its fields and in its message.
func TestTwoPaths(t *testing.T) {
	for _, tc := range []struct {
		name        string
		file        string
		path, other string
		is          error
	}{
		{"two balls share a centre", edit(t, set("balls[2].centre", []any{"0 mm", "50 mm", 0})), "balls[2].centre", "balls[0].centre", ErrDegenerate},
		{"a dimension toleranced twice", edit(t, set("tolerances", fromJSON(`[
			{"dimension": "B.Seat.Turn", "value": "1 arcmin"},
			{"dimension": "A.Ball.X", "value": "1 um"},
			{"dimension": "C.Ball.Y", "value": "1 um"},
			{"dimension": "A.Ball.X", "value": "2 um"}]`))), "tolerances[3].dimension", "tolerances[1].dimension", ErrRange},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(tc.file))
			var e *Error
			if !errors.As(err, &e) || !errors.Is(err, tc.is) {
				t.Fatalf("error %v, want a *design.Error wrapping %v", err, tc.is)
			}
			if e.Path != tc.path || e.Other != tc.other {
				t.Errorf("Path %q, Other %q; want %q and %q", e.Path, e.Other, tc.path, tc.other)
			}
			msg := err.Error()
			if !strings.HasPrefix(msg, "design: "+tc.path+": ") || !strings.HasSuffix(msg, "; see "+tc.other) {
				t.Errorf("message %q should start with %q and end with %q", msg, tc.path, tc.other)
			}
			noKinematicNames(t, err)
		})
	}
}

// TestNoKinematicNames builds and evaluates designs made in Go whose
// fault only package kinematic finds, and checks that every error names
// the file's entry and spells nothing of kinematic.
func TestNoKinematicNames(t *testing.T) {
	base, err := Parse([]byte(baseJSON))
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name   string
		change func(d *Design)
		path   string
	}{
		{"groove along its up", func(d *Design) { d.Seats[1].Azimuth, d.Seats[1].Direction = 0, r3.Vec{Z: 1} }, "seats[1].direction"},
		{"zero up", func(d *Design) { d.Seats[2].Up = r3.Vec{} }, "seats[2].up"},
		{"coincident balls", func(d *Design) { d.Balls[1].Centre = d.Balls[0].Centre }, "balls[1].centre"},
		{"preload without direction", func(d *Design) { d.Preloads[0].Direction = r3.Vec{} }, "preloads[0].direction"},
		{"negative mass", func(d *Design) { d.Payload.Mass, d.Requirements = -1, Requirements{} }, "payload.mass"},
		{"unknown dimension", func(d *Design) { d.Tolerances[0].Dimension = "D.Ball.X" }, "tolerances[0].dimension"},
		{"repeated dimension", func(d *Design) {
			d.Tolerances = append(d.Tolerances, d.Tolerances[0])
		}, "tolerances[1].dimension"},
		{"negative tolerance", func(d *Design) { d.Tolerances[0].HalfWidth = -1e-6 }, "tolerances[0].value"},
		{"negative shock", func(d *Design) { d.Requirements.MinShock = -1 }, "requirements.min_shock.level"},
		{"monte carlo samples", func(d *Design) { d.MonteCarlo = &MonteCarlo{Samples: 0} }, "monte_carlo.samples"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			d := base.clone()
			tc.change(&d)
			_, err := d.Evaluate(t.Context())
			if err == nil {
				t.Fatal("accepted")
			}
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("error %v (%T) is not a *design.Error", err, err)
			}
			if e.Path != tc.path {
				t.Errorf("path %q, want %q (%v)", e.Path, tc.path, err)
			}
			noKinematicNames(t, err)
		})
	}
}

// TestBuildCopies: a Built keeps its own copy of the design, and hands
// out copies, so that changing either afterwards changes nothing built.
func TestBuildCopies(t *testing.T) {
	d, err := Parse([]byte(baseJSON))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	d.Balls[0].Radius = 1
	d.Cases[0].Gravity = r3.Vec{}
	got := b.Design()
	if got.Balls[0].Radius != 6.35e-3 || got.Cases[0].Gravity.Z == 0 {
		t.Errorf("the built design changed with the original: %+v", got.Balls[0])
	}
	got.Seats[0].HalfAngle = 1
	c := b.Coupling()
	c.Pairs[0].Ball.Radius = 2
	if again := b.Design(); again.Seats[0].HalfAngle == 1 || b.Coupling().Pairs[0].Ball.Radius == 2 {
		t.Error("a copy handed out shares the built design")
	}
	// The scenario of the base design: gravity of its first case, its
	// preload, no thermal (read from baseJSON above).
	sc := b.Scenario()
	if sc.Gravity != (r3.Vec{Z: -9.80665}) || len(sc.Preloads) != 1 || sc.Preloads[0].Force != 300 || sc.Payload.Mass != 2 {
		t.Errorf("scenario %+v", sc)
	}
}
