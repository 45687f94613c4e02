package kinematic

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/screw"
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
	// A target straight above a ball (isosceles(): A at x = -60 mm, B at
	// +60 mm) names that ball by its letter, as every other message does.
	for _, tc := range []struct {
		x    float64
		ball string
	}{{-60e-3, "ball A "}, {60e-3, "ball B "}} {
		if _, err := AimedVees(isosceles(), r3.Vec{X: tc.x, Z: 1}, three(vee45)); !errors.Is(err, ErrDegenerate) || !strings.Contains(err.Error(), "the groove of "+tc.ball) {
			t.Errorf("target above %s: err = %v, want ErrDegenerate naming %q", tc.ball, err, tc.ball)
		}
	}
}

func TestInputsNotModified(t *testing.T) {
	bis, _ := BisectorVees(isosceles(), three(vee45))
	before := moved(bis, 1, 0, up, r3.Vec{}) // a deep copy
	cs := mustContacts(t, bis)
	csBefore := append([]Contact(nil), cs...)
	if _, err := Optimize(bis, Scenario{}, nil); err != nil {
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

// TestErrorsKeepCallerVocabulary: an error that arises in package screw or
// hertz reaches the caller as this package's *InputError, with the field
// path the caller wrote, and errors.Is finds the sentinel under either
// package's name (they are the same values).
func TestErrorsKeepCallerVocabulary(t *testing.T) {
	// Two contacts 1e300 m either side of the origin: finite, but the
	// squared distances of the analysis overflow (screw reports ErrRange).
	cs := []Contact{
		{Point: r3.Vec{X: -1e300}, Normal: r3.Vec{Z: 1}},
		{Point: r3.Vec{X: 1e300}, Normal: r3.Vec{Y: 1}},
		{Point: r3.Vec{Y: 1}, Normal: r3.Vec{X: 1}},
	}
	_, err := Analyze(cs)
	var ie *InputError
	if !errors.As(err, &ie) || !strings.HasPrefix(ie.Field, "cs") || strings.Contains(ie.Field, "ws") {
		t.Fatalf("far contacts: err = %v, want a *kinematic.InputError on cs...", err)
	}
	if !errors.Is(err, ErrRange) || !errors.Is(err, screw.ErrRange) {
		t.Errorf("far contacts: err = %v, want ErrRange under both names", err)
	}

	// A zero Material fails in hertz; translated, the field is the pair's.
	_, herr := hertz.Solve(hertz.Sphere(5e-3, hertz.Material{}), hertz.Flat(hertz.Steel440C), 10)
	err = fromHertz(herr, "Pairs[2].Ball", "Pairs[2].Seat", map[string]string{"load": "preload"})
	if !errors.As(err, &ie) || ie.Field != "Pairs[2].Ball.Material.E" || !errors.Is(err, ErrRange) || !errors.Is(err, hertz.ErrRange) {
		t.Errorf("zero ball material: err = %v, want *InputError on Pairs[2].Ball.Material.E wrapping ErrRange", err)
	}
	_, herr = hertz.Solve(hertz.Sphere(5e-3, hertz.Steel52100), hertz.Flat(hertz.Steel440C), -1)
	if err = fromHertz(herr, "cs[4].Moving", "cs[4].Base", map[string]string{"load": "preload"}); !errors.As(err, &ie) || ie.Field != "preload" {
		t.Errorf("negative load: err = %v, want field preload", err)
	}
	_, herr = hertz.Solve(hertz.Flat(hertz.Steel52100), hertz.Flat(hertz.Steel440C), 1)
	if err = fromHertz(herr, "cs[4].Moving", "cs[4].Base", nil); !errors.As(err, &ie) || ie.Field != "cs[4].Moving, cs[4].Base" || !errors.Is(err, hertz.ErrGeometry) {
		t.Errorf("flat on flat: err = %v, want field \"cs[4].Moving, cs[4].Base\" wrapping hertz.ErrGeometry", err)
	}
}

// TestSubnormalDirections: directions with subnormal components have a
// direction all the same; they must give the contacts of the unit vector
// along them, never NaN (normalising by 1/|v| overflows there).
func TestSubnormalDirections(t *testing.T) {
	tiny := r3.Vec{Z: 5e-324}
	v := vee45
	v.Direction = r3.Vec{X: 1}
	ref := mustContacts(t, Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: v}, {Ball: ball(50, 0, 0), Seat: flatUp}}})
	v.Up, v.Direction = tiny, r3.Vec{X: 5e-324}
	f := flatUp
	f.Up = tiny
	c := Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: v}, {Ball: ball(50, 0, 0), Seat: f}}}
	got := mustContacts(t, c)
	if d := cmp.Diff(ref, got); d != "" {
		t.Errorf("subnormal Up and Direction (-unit +subnormal):\n%s", d)
	}
	bs := isosceles()
	tv := vee45
	tv.Up = tiny
	bis, err := BisectorVees(bs, three(tv))
	if err != nil {
		t.Fatal(err)
	}
	g, err := bis.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	for _, gr := range g.Grooves {
		if !linalgFinite(gr.Direction) || math.IsNaN(gr.Azimuth) || math.IsNaN(gr.OffBisector) {
			t.Errorf("groove %d: %+v", gr.Pair, gr)
		}
	}
	cs := []Contact{
		{Point: r3.Vec{X: 1}, Normal: tiny},
		{Point: r3.Vec{Y: 1}, Normal: r3.Vec{X: -5e-324, Y: 5e-324}},
	}
	if an, err := Analyze(cs); err != nil || an.Rank != 2 {
		t.Errorf("subnormal normals: rank %d, err %v; want rank 2", an.Rank, err)
	}
}

func linalgFinite(v r3.Vec) bool {
	return !math.IsNaN(v.X+v.Y+v.Z) && !math.IsInf(v.X+v.Y+v.Z, 0)
}

// TestInputErrorOther: an error about two inputs names both in its
// fields, and its message names each once, in the caller's terms.
func TestInputErrorOther(t *testing.T) {
	c := threeVees(t, 0)
	c.Pairs[2].Ball.Centre = c.Pairs[0].Ball.Centre
	_, err := c.Contacts()
	var ie *InputError
	if !errors.As(err, &ie) || !errors.Is(err, ErrDegenerate) {
		t.Fatalf("coincident balls: %v", err)
	}
	if ie.Field != "Pairs[2].Ball.Centre" || ie.Other != "Pairs[0].Ball.Centre" {
		t.Errorf("coincident balls: Field %q, Other %q; want Pairs[2].Ball.Centre and Pairs[0].Ball.Centre", ie.Field, ie.Other)
	}
	if msg := err.Error(); strings.Count(msg, "Pairs[0]") != 1 || strings.Count(msg, "Pairs[2]") != 1 {
		t.Errorf("coincident balls: %q should name Pairs[2] and Pairs[0] once each", msg)
	}

	a, err := threeVees(t, 0).Assembly()
	if err != nil {
		t.Fatal(err)
	}
	tols := []Tolerance{{Dimension: "A.Ball.X", HalfWidth: 1e-6}, {Dimension: "B.Ball.Y", HalfWidth: 1e-6}, {Dimension: "A.Ball.X", HalfWidth: 2e-6}}
	_, err = a.Budget(r3.Vec{}, tols)
	if !errors.As(err, &ie) || !errors.Is(err, ErrRange) {
		t.Fatalf("repeated tolerance: %v", err)
	}
	if ie.Field != "tols[2].Dimension" || ie.Other != "tols[0].Dimension" {
		t.Errorf("repeated tolerance: Field %q, Other %q; want tols[2].Dimension and tols[0].Dimension", ie.Field, ie.Other)
	}
	if msg := err.Error(); strings.Count(msg, "tols[") != 2 {
		t.Errorf("repeated tolerance: %q should name tols[2] and tols[0] once each", msg)
	}
}
