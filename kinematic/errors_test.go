package kinematic

import (
	"errors"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/spatial/r3"
)

func TestErrors(t *testing.T) {
	b := ball(0, 0, 0)
	nan := math.NaN()
	badVee := func(f func(*Vee)) Coupling {
		v := vee45
		v.Direction = r3.Vec{X: 1}
		f(&v)
		return Coupling{Pairs: []Pair{{Ball: b, Seat: v}}}
	}
	for _, tc := range []struct {
		name  string
		c     Coupling
		field string
		err   error
	}{
		{"no pairs", Coupling{}, "Pairs", ErrDegenerate},
		{"no seat", Coupling{Pairs: []Pair{{Ball: b}}}, "Pairs[0].Seat", ErrDegenerate},
		{"zero radius", Coupling{Pairs: []Pair{{Ball: Ball{Radius: 0}, Seat: flatUp}}}, "Pairs[0].Ball.Radius", ErrRange},
		{"negative radius", Coupling{Pairs: []Pair{{Ball: Ball{Radius: -1}, Seat: flatUp}}}, "Pairs[0].Ball.Radius", ErrRange},
		{"NaN centre", Coupling{Pairs: []Pair{{Ball: Ball{Centre: r3.Vec{X: nan}, Radius: 1}, Seat: flatUp}}}, "Pairs[0].Ball.Centre", ErrNonFinite},
		{"coincident balls", Coupling{Pairs: []Pair{{Ball: b, Seat: flatUp}, {Ball: ball(10, 0, 0), Seat: flatUp}, {Ball: b, Seat: flatUp}}}, "Pairs[2].Ball.Centre", ErrDegenerate},
		{"zero up", badVee(func(v *Vee) { v.Up = r3.Vec{} }), "Pairs[0].Seat.Up", ErrDegenerate},
		{"Inf direction", badVee(func(v *Vee) { v.Direction = r3.Vec{Y: math.Inf(1)} }), "Pairs[0].Seat.Direction", ErrNonFinite},
		{"groove along up", badVee(func(v *Vee) { v.Direction = r3.Vec{Z: -2} }), "Pairs[0].Seat.Direction", ErrDegenerate},
		{"half-angle 0", badVee(func(v *Vee) { v.HalfAngle = 0 }), "Pairs[0].Seat.HalfAngle", ErrRange},
		{"half-angle π/2", badVee(func(v *Vee) { v.HalfAngle = math.Pi / 2 }), "Pairs[0].Seat.HalfAngle", ErrRange},
		{"half-angle NaN", badVee(func(v *Vee) { v.HalfAngle = nan }), "Pairs[0].Seat.HalfAngle", ErrNonFinite},
		{"flank tighter than ball", badVee(func(v *Vee) { v.FlankRadius = 4e-3 }), "Pairs[0].Seat.FlankRadius", ErrRange},
		{"socket azimuth along up", Coupling{Pairs: []Pair{{Ball: b, Seat: Trihedral{Up: up, Azimuth: up, HalfAngle: 0.6}}}}, "Pairs[0].Seat.Azimuth", ErrDegenerate},
		{"cone half-angle", Coupling{Pairs: []Pair{{Ball: b, Seat: Cone{Up: up, Azimuth: r3.Vec{X: 1}, HalfAngle: 2}}}}, "Pairs[0].Seat.HalfAngle", ErrRange},
	} {
		_, err := tc.c.Contacts()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping %v", tc.name, err, tc.field, tc.err)
		}
	}

	ok := Contact{Point: r3.Vec{X: 1}, Normal: up}
	for _, tc := range []struct {
		name  string
		cs    []Contact
		field string
		err   error
	}{
		{"empty", nil, "cs", ErrDegenerate},
		{"one contact", []Contact{ok}, "cs", ErrDegenerate},
		{"zero normal", []Contact{ok, {Point: r3.Vec{Y: 1}}}, "cs[1].Normal", ErrDegenerate},
		{"NaN normal", []Contact{ok, {Normal: r3.Vec{Z: nan}}}, "cs[1].Normal", ErrNonFinite},
		{"Inf point", []Contact{{Point: r3.Vec{X: math.Inf(-1)}, Normal: up}, ok}, "cs[0].Point", ErrNonFinite},
		{"NaN ball centre", []Contact{ok, {Normal: up, Radius: 1, Centre: r3.Vec{Y: nan}}}, "cs[1].Centre", ErrNonFinite},
	} {
		_, err := Analyze(tc.cs)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping %v", tc.name, err, tc.field, tc.err)
		}
	}

	if _, err := BisectorVees([3]Ball{ball(0, 0, 0), ball(10, 0, 0), ball(20, 0, 0)}, three(vee45)); !errors.Is(err, ErrDegenerate) {
		t.Errorf("collinear balls: err = %v, want ErrDegenerate", err)
	}
	if _, err := AimedVees(isosceles(), r3.Vec{X: -60e-3, Z: 1}, three(vee45)); !errors.Is(err, ErrDegenerate) {
		t.Errorf("target above a ball: err = %v, want ErrDegenerate", err)
	}
	bis, _ := BisectorVees(isosceles(), three(vee45))
	for _, w := range [][]Window{{{}, {}}, {{Min: 1, Max: 0}, {}, {}}, {{Min: nan}, {}, {}}} {
		if _, err := OptimizeGrooves(bis, &GrooveOptions{Windows: w}); err == nil {
			t.Errorf("windows %v accepted", w)
		}
	}
	if _, err := OptimizeGrooves(Coupling{Pairs: bis.Pairs[:2]}, nil); !errors.Is(err, ErrNotExact) {
		t.Errorf("four contacts: err = %v, want ErrNotExact", err)
	}
}

func TestInputsNotModified(t *testing.T) {
	bis, _ := BisectorVees(isosceles(), three(vee45))
	before := moved(bis, 1, 0, up, r3.Vec{}) // a deep copy
	cs := mustContacts(t, bis)
	csBefore := append([]Contact(nil), cs...)
	if _, err := OptimizeGrooves(bis, nil); err != nil {
		t.Fatal(err)
	}
	mustAnalyze(t, cs)
	if d := cmp.Diff(before, bis); d != "" {
		t.Errorf("coupling modified (-before +after):\n%s", d)
	}
	if d := cmp.Diff(csBefore, cs); d != "" {
		t.Errorf("contacts modified (-before +after):\n%s", d)
	}
}
