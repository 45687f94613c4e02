package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestErrorsNameCallerFields checks, over the public entry points, that an
// error names the field as that function's caller wrote it (the
// receiver's fields, or the parameter's name then its fields) and wraps
// the sentinel its doc promises.
func TestErrorsNameCallerFields(t *testing.T) {
	c := threeVees(t, 0)
	cs := mustContacts(t, c)
	good := Preload{Point: r3.Vec{}, Direction: r3.Vec{Z: -1}, Force: 10}
	m, err := NewModel(cs, []Preload{good}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	five, err := NewModel(cs[1:], []Preload{good}, Payload{Mass: 1})
	if err != nil {
		t.Fatal(err)
	}
	over := c
	over.Pairs = append(append([]Pair(nil), c.Pairs...), Pair{Ball: ball(0, 0, 0), Seat: flatUp})
	seven, err := NewModel(mustContacts(t, over), []Preload{good}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	badPre := []Preload{{Point: r3.Vec{X: math.NaN()}, Direction: r3.Vec{Z: -1}, Force: 10}}
	lc := LoadCase{PreloadFactor: 1}
	far := c
	far.Pairs = append([]Pair(nil), c.Pairs...)
	for i := range far.Pairs {
		far.Pairs[i].Ball.Centre.X += 1e300
	}
	for _, tc := range []struct {
		name, field string
		sentinel    error
		call        func() error
	}{
		{"Score preload", "s.Preloads[0].Point", ErrNonFinite, func() error {
			_, err := c.Score(Scenario{Preloads: badPre})
			return err
		}},
		{"Score payload", "s.Payload.Mass", ErrRange, func() error {
			_, err := c.Score(Scenario{Preloads: []Preload{good}, Payload: Payload{Mass: -1}})
			return err
		}},
		{"Optimize preload", "s.Preloads[0].Point", ErrNonFinite, func() error {
			_, err := Optimize(c, Scenario{Preloads: badPre}, nil)
			return err
		}},
		{"Optimize payload", "s.Payload.Mass", ErrRange, func() error {
			_, err := Optimize(c, Scenario{Preloads: []Preload{good}, Payload: Payload{Mass: -1}}, nil)
			return err
		}},
		{"Pose tolerance", "opt.Tolerance", ErrRange, func() error {
			_, err := a.Pose(nil, &PoseOptions{Tolerance: 2})
			return err
		}},
		{"Pose iterations", "opt.MaxIterations", ErrRange, func() error {
			_, err := a.Pose(nil, &PoseOptions{MaxIterations: -1})
			return err
		}},
		// Seven contacts: Stiffness takes its forces from Equilibrium.
		{"Stiffness gaps", `opt.Equilibrium.Gaps["nope"]`, ErrRange, func() error {
			_, err := seven.Stiffness(lc, &StiffnessOptions{Equilibrium: &EquilibriumOptions{Gaps: map[string]float64{"nope": 1e-6}}})
			return err
		}},
		{"Equilibrium gaps", `opt.Gaps["nope"]`, ErrRange, func() error {
			_, err := m.Equilibrium(lc, &EquilibriumOptions{Gaps: map[string]float64{"nope": 1e-6}})
			return err
		}},
		// Five contacts leave a freedom: the doc promises ErrNotExact,
		// whatever the load (a sideways load, which the five cannot hold,
		// was reported as the body leaving its seats, ErrRange; no load
		// gave a nil error).
		{"Equilibrium five contacts", "cs", ErrNotExact, func() error {
			for _, l := range []LoadCase{{}, lc, {PreloadFactor: 1, Gravity: r3.Vec{X: -9.8}}} {
				if _, err := five.Equilibrium(l, nil); !errors.Is(err, ErrNotExact) {
					return err
				}
			}
			_, err := five.Equilibrium(lc, nil)
			return err
		}},
		{"Contacts 1e300 m away", "Pairs[0].Ball.Centre", ErrRange, func() error {
			_, err := far.Contacts()
			return err
		}},
		// Expanding the body by 50 % (0.05/K over 10 K) leaves no seat: the
		// thermal solve fails, named on the thermal input.
		{"Drift thermal solve", "th", ErrRange, func() error {
			_, err := a.Drift(Thermal{DeltaT: 10, Moving: 0.05}, r3.Vec{})
			return err
		}},
		{"Drift thermal input", "th.Moving", ErrNonFinite, func() error {
			_, err := a.Drift(Thermal{DeltaT: 1, Moving: math.Inf(1)}, r3.Vec{})
			return err
		}},
	} {
		err := tc.call()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.sentinel) {
			t.Errorf("%s: %v; want an InputError on %q wrapping %v", tc.name, err, tc.field, tc.sentinel)
		}
	}
}
