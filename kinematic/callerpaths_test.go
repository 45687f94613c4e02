package kinematic

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
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

// TestLayoutErrorsNameParameters checks that the layout constructors name
// a bad input as their caller passed it: the parameter's name from the
// signature, then the field of its type ("vees[0].HalfAngle",
// "socket.HalfAngle", "flat.Up"), never the Pairs of the Coupling they
// build, which the caller did not write.
func TestLayoutErrorsNameParameters(t *testing.T) {
	vees := func(edit func(v *[3]Vee)) [3]Vee {
		v := [3]Vee{vee45, vee45, vee45}
		edit(&v)
		return v
	}
	bs := equilateral()
	shrunk := bs
	shrunk[2].Radius = 0
	// Unit vectors from ball A to ball B and back, in the balls' plane.
	ab := r3.Unit(r3.Sub(bs[1].Centre, bs[0].Centre))
	ba := r3.Scale(-1, ab)
	for _, tc := range []struct {
		name, field string
		sentinel    error
		call        func() error
	}{
		{"BisectorVees half-angle in degrees", "vees[0].HalfAngle", ErrRange, func() error {
			_, err := BisectorVees(bs, vees(func(v *[3]Vee) { v[0].HalfAngle = 45 }))
			return err
		}},
		{"BisectorVees flank tighter than the ball", "vees[2].FlankRadius", ErrRange, func() error {
			_, err := BisectorVees(bs, vees(func(v *[3]Vee) { v[2].FlankRadius = 4e-3 }))
			return err
		}},
		{"BisectorVees zero up", "vees[1].Up", ErrDegenerate, func() error {
			_, err := BisectorVees(bs, vees(func(v *[3]Vee) { v[1].Up = r3.Vec{} }))
			return err
		}},
		{"BisectorVees ball radius", "balls[2].Radius", ErrRange, func() error {
			_, err := BisectorVees(shrunk, vees(func(*[3]Vee) {}))
			return err
		}},
		{"AimedVees half-angle NaN", "vees[1].HalfAngle", ErrNonFinite, func() error {
			_, err := AimedVees(bs, r3.Vec{}, vees(func(v *[3]Vee) { v[1].HalfAngle = math.NaN() }))
			return err
		}},
		{"AimedVees ball radius", "balls[2].Radius", ErrRange, func() error {
			_, err := AimedVees(shrunk, r3.Vec{}, vees(func(*[3]Vee) {}))
			return err
		}},
		// 35.26 is the cube-corner half-angle in degrees.
		{"SocketVeeFlat socket half-angle in degrees", "socket.HalfAngle", ErrRange, func() error {
			s := cube
			s.HalfAngle = 35.26
			_, err := SocketVeeFlat(bs, s, vee45, flatUp)
			return err
		}},
		{"SocketVeeFlat vee half-angle 0", "vee.HalfAngle", ErrRange, func() error {
			v := vee45
			v.HalfAngle = 0
			_, err := SocketVeeFlat(bs, cube, v, flatUp)
			return err
		}},
		{"SocketVeeFlat flat without Up", "flat.Up", ErrDegenerate, func() error {
			_, err := SocketVeeFlat(bs, cube, vee45, Flat{Material: hertz.Steel440C})
			return err
		}},
		{"SocketVeeFlat ball radius", "balls[2].Radius", ErrRange, func() error {
			_, err := SocketVeeFlat(shrunk, cube, vee45, flatUp)
			return err
		}},
		// The groove runs from ball B to ball A: with the vee's Up along
		// that line it has no direction, and the constructor set it.
		{"SocketVeeFlat vee up along the groove", "vee.Up", ErrDegenerate, func() error {
			v := vee45
			v.Up = ba
			_, err := SocketVeeFlat(bs, cube, v, flatUp)
			return err
		}},
		// A zero Azimuth is set towards ball B: along the socket's Up it
		// has no direction, which the caller chose by the Up.
		{"SocketVeeFlat socket up towards ball B", "socket.Up", ErrDegenerate, func() error {
			s := cube
			s.Up = ab
			_, err := SocketVeeFlat(bs, s, vee45, flatUp)
			return err
		}},
		{"SocketVeeFlat socket azimuth along up", "socket.Azimuth", ErrDegenerate, func() error {
			s := cube
			s.Azimuth = r3.Vec{Z: -1}
			_, err := SocketVeeFlat(bs, s, vee45, flatUp)
			return err
		}},
	} {
		err := tc.call()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.sentinel) {
			t.Errorf("%s: %v; want an InputError on %q wrapping %v", tc.name, err, tc.field, tc.sentinel)
		} else if strings.Contains(err.Error(), "Pairs") {
			t.Errorf("%s: %v names Pairs, which the caller did not write", tc.name, err)
		}
	}

	// Two overlapping balls are named both, Field and Other, as balls[i].
	big := bs
	big[0].Radius = 0.1 // a 100 mm ball 86.6 mm from the others: they overlap
	for name, call := range map[string]func() error{
		"BisectorVees": func() error { _, err := BisectorVees(big, vees(func(*[3]Vee) {})); return err },
		"AimedVees":    func() error { _, err := AimedVees(big, r3.Vec{}, vees(func(*[3]Vee) {})); return err },
		"SocketVeeFlat": func() error {
			_, err := SocketVeeFlat(big, cube, vee45, flatUp)
			return err
		},
	} {
		err := call()
		var ie *InputError
		if !errors.As(err, &ie) || !errors.Is(err, ErrRange) || !strings.HasPrefix(ie.Field, "balls[") || !strings.HasPrefix(ie.Other, "balls[") ||
			(ie.Field != "balls[0]" && ie.Other != "balls[0]") || strings.Contains(err.Error(), "Pairs") {
			t.Errorf("%s overlapping balls: %v; want an InputError on balls[i] with Other balls[j], one of them balls[0]", name, err)
		}
	}
}
