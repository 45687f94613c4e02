package design

import (
	"errors"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestTranslate checks the translation of package kinematic's field paths
// (as its documentation spells them) into the file's JSON paths, for a
// design of a vee given by azimuth, a vee given by direction and a
// trihedral (contacts 0–1, 2–3 and 4–6).
func TestTranslate(t *testing.T) {
	b := &Built{
		d: Design{Seats: []Seat{
			{Type: Vee},
			{Type: Vee, Direction: r3.Vec{X: 1}},
			{Type: Trihedral},
		}},
		pairOf: []int{0, 0, 1, 1, 2, 2, 2},
	}
	// The parameters of the calls, as kinematic's signatures name them.
	calls := map[string]string{"p": "point_of_interest", "tols": "tolerances", "opt": "monte_carlo",
		"th": "thermal", "th.DeltaT": "thermal.delta_t", "th.Moving": "thermal.moving_alpha", "th.Base": "thermal.base_alpha", "th.BaseRef": "thermal.base_ref",
		"mu": "friction.mu", "magnitude": "requirements.min_shock.level"}
	tests := []struct {
		field, lc, want string
	}{
		{"Pairs[1].Seat.HalfAngle", "", "seats[1].half_angle"},
		{"Pairs[1].Seat.FlankRadius", "", "seats[1].flank_radius"},
		{"Pairs[1].Seat.Direction", "", "seats[1].direction"},
		{"Pairs[0].Seat.Direction", "", "seats[0].azimuth"},
		{"Pairs[2].Seat.Azimuth", "", "seats[2].toward"},
		{"Pairs[2].Seat.Material.E", "", "seats[2].material"},
		{"Pairs[2].Ball.Centre", "", "balls[2].centre"},
		{"Pairs[0].Ball.Radius", "", "balls[0].radius"},
		{"Pairs[1]", "", "seats[1]"},
		{"Pairs", "", "seats"},
		{"cs[5].Moving, cs[5].Base", "", "balls[2].material, seats[2].material"},
		{"cs[3].Normal", "", "seats[1]"},
		{"cs[3] force", "cases[4]", "cases[4]"},
		{"preloads[2].Direction", "", "preloads[2].direction"},
		{"payload.Mass", "", "payload.mass"},
		{"payload.Inertia", "", "payload.inertia"},
		{"payload.Inertia[2][0]", "", "payload.inertia.xz"},
		{"lc.Gravity", "cases[1]", "cases[1].gravity"},
		{"lc.Applied[3]", "cases[1]", "cases[1].applied[3]"},
		{"lc", "cases[1]", "cases[1]"},
		{"tols[7].Dimension", "", "tolerances[7].dimension"},
		{"p", "", "point_of_interest"},
		{"opt.Samples", "", "monte_carlo.samples"},
		{"th.DeltaT", "", "thermal.delta_t"},
		{"th.Moving", "", "thermal.moving_alpha"},
		{"th.Base", "", "thermal.base_alpha"},
		{"th.BaseRef", "", "thermal.base_ref"},
		{"mu", "", "friction.mu"},
		{"magnitude", "", "requirements.min_shock.level"},
	}
	for _, tc := range tests {
		in := &kinematic.InputError{Field: tc.field, Err: kinematic.ErrRange}
		err := translator{b: b, lc: tc.lc, params: calls}.translate(in)
		var e *Error
		if !errors.As(err, &e) || e.Path != tc.want {
			t.Errorf("%q: %v, want path %q", tc.field, err, tc.want)
		}
		if !errors.Is(err, kinematic.ErrRange) {
			t.Errorf("%q: %v lost kinematic.ErrRange", tc.field, err)
		}
	}
	plain := errors.New("not an input error")
	if got := (translator{}).translate(plain); got != plain {
		t.Errorf("a plain error came back as %v", got)
	}
}

// TestConeHasNoHertz checks that a kinematic error met during Evaluate
// comes back on the file's path with the other package's sentinel: a
// cone's ring contact has no Hertz point-contact model (kinematic.Cone),
// so the statics of a load case on a cone fails on its contact's
// materials with hertz.ErrLineContact.
func TestConeHasNoHertz(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/cone.json"))
	if err != nil {
		t.Fatal(err)
	}
	d.Cases = []kinematic.LoadCase{{Name: "g", PreloadFactor: 1, Gravity: r3.Vec{Z: -9.80665}}}
	d.Payload.Mass = 0.2
	_, err = d.Evaluate(t.Context())
	var e *Error
	if !errors.As(err, &e) || e.Path != "balls[0].material, seats[0].material" {
		t.Fatalf("error %v, want one on the cone's materials", err)
	}
	if !errors.Is(err, hertz.ErrLineContact) {
		t.Errorf("error %v does not wrap hertz.ErrLineContact", err)
	}
}
