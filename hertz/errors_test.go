package hertz

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

// TestSolveErrors checks that every invalid input gives an *InputError
// naming the field and wrapping the right sentinel, and no NaN.
func TestSolveErrors(t *testing.T) {
	s := Steel52100
	nan, inf := math.NaN(), math.Inf(1)
	ball, flat := Sphere(0.005, s), Flat(s)
	withMat := func(b Body, f func(*Material)) Body { f(&b.Material); return b }
	cases := []struct {
		name   string
		b1, b2 Body
		load   float64
		field  string
		target error
		text   string
	}{
		{"NaN radius", Body{R1: nan, R2: 0.005, Material: s}, flat, 1, "b1.R1", ErrNonFinite, "NaN"},
		{"zero radius", ball, Body{R1: inf, R2: 0, Material: s}, 1, "b2.R2", ErrRange, "nonzero"},
		{"denormal radius", Body{R1: 1e-320, R2: 0.005, Material: s}, flat, 1, "b1.R1", ErrRange, "too small"},
		{"NaN angle", Cylinder(0.005, nan, s), Cylinder(0.005, 0, s), 1, "b1.Angle", ErrNonFinite, "finite"},
		{"Inf angle", ball, Groove(0.006, inf, s), 1, "b2.Angle", ErrNonFinite, "finite"},
		{"E zero", withMat(ball, func(m *Material) { m.E = 0 }), flat, 1, "b1.Material.E", ErrRange, "positive"},
		{"E negative", ball, withMat(flat, func(m *Material) { m.E = -1 }), 1, "b2.Material.E", ErrRange, "positive"},
		{"E NaN", withMat(ball, func(m *Material) { m.E = nan }), flat, 1, "b1.Material.E", ErrNonFinite, "NaN"},
		{"E −Inf", withMat(ball, func(m *Material) { m.E = -inf }), flat, 1, "b1.Material.E", ErrRange, "positive"},
		{"ν = −1", withMat(ball, func(m *Material) { m.Nu = -1 }), flat, 1, "b1.Material.Nu", ErrRange, "(-1, 0.5]"},
		{"ν > 0.5", ball, withMat(flat, func(m *Material) { m.Nu = 0.5000001 }), 1, "b2.Material.Nu", ErrRange, "(-1, 0.5]"},
		{"ν NaN", ball, withMat(flat, func(m *Material) { m.Nu = nan }), 1, "b2.Material.Nu", ErrNonFinite, "(-1, 0.5]"},
		{"ν −Inf", ball, withMat(flat, func(m *Material) { m.Nu = -inf }), 1, "b2.Material.Nu", ErrNonFinite, "finite"},
		{"α Inf", withMat(ball, func(m *Material) { m.Alpha = inf }), flat, 1, "b1.Material.Alpha", ErrNonFinite, "finite"},
		{"allowable NaN", ball, withMat(flat, func(m *Material) { m.Allowable = nan }), 1, "b2.Material.Allowable", ErrNonFinite, "finite"},
		{"allowable negative", ball, withMat(flat, func(m *Material) { m.Allowable = -1 }), 1, "b2.Material.Allowable", ErrRange, "≥ 0"},
		{"negative load", ball, flat, -1, "load", ErrRange, "≥ 0"},
		{"NaN load", ball, flat, nan, "load", ErrNonFinite, "finite"},
		{"Inf load", ball, flat, inf, "load", ErrNonFinite, "finite"},
		{"−Inf load", ball, flat, -inf, "load", ErrNonFinite, "finite"},
		{"huge load", Sphere(1e300, s), Flat(s), 1e300, "load", ErrRange, "floating-point"},
		{"parallel cylinders", Cylinder(0.005, 0.3, s), Cylinder(0.008, 0.3+math.Pi, s), 1, "b1, b2", ErrLineContact, "line"},
		{"cylinder on flat", Cylinder(0.005, 1, s), flat, 1, "b1, b2", ErrLineContact, "line"},
		{"ball in own-radius groove", ball, Groove(0.005, 0.2, s), 1, "b1, b2", ErrLineContact, "line"},
		{"flat on flat", flat, flat, 1, "b1, b2", ErrGeometry, "conform"},
		{"socket of ball's radius", ball, Socket(0.005, s), 1, "b1, b2", ErrGeometry, "conform"},
		{"socket smaller than ball", ball, Socket(0.0049, s), 1, "b1, b2", ErrGeometry, "socket smaller"},
		{"groove tighter than ball", ball, Groove(0.0049, 0, s), 1, "b1, b2", ErrGeometry, "tighter"},
		{"both rigid", withMat(ball, func(m *Material) { m.E = inf }), withMat(flat, func(m *Material) { m.E = inf }), 1, "b1.Material.E, b2.Material.E", ErrGeometry, "rigid"},
		{"zero material", Sphere(0.005, Material{}), flat, 1, "b1.Material.E", ErrRange, "positive"},
		{"G* overflows", Sphere(0.005, Material{E: 1e300, Nu: -1 + 1e-16}), Flat(Material{E: 1e300, Nu: -1 + 1e-16}), 1, "b1.Material, b2.Material", ErrRange, "effective moduli"},
	}
	for _, c := range cases {
		got, err := Solve(c.b1, c.b2, c.load)
		if err == nil {
			t.Errorf("%s: no error, got %+v", c.name, got)
			continue
		}
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field {
			t.Errorf("%s: error %q, want *InputError for field %q", c.name, err, c.field)
		}
		if !errors.Is(err, c.target) {
			t.Errorf("%s: error %q does not wrap %v", c.name, err, c.target)
		}
		if !strings.Contains(err.Error(), c.text) || !strings.HasPrefix(err.Error(), "hertz: "+c.field+": ") {
			t.Errorf("%s: message %q lacks %q", c.name, err, c.text)
		}
		if got != (Contact{}) {
			t.Errorf("%s: non-zero Contact with an error: %+v", c.name, got)
		}
		for _, f := range []func(Body, Body, float64) (float64, error){LoadForPressure, LoadForApproach} {
			if c.field == "load" {
				continue
			}
			if F, err := f(c.b1, c.b2, 1); err == nil || !errors.Is(err, c.target) || F != 0 {
				t.Errorf("%s: inverse gives %v, %v", c.name, F, err)
			}
		}
	}
}

// TestInverseErrors checks the inverse problems' own fields.
func TestInverseErrors(t *testing.T) {
	b1, b2 := Sphere(0.005, Steel52100), Flat(Steel52100)
	for _, c := range []struct {
		v    float64
		kind error
	}{{-1, ErrRange}, {math.NaN(), ErrNonFinite}, {math.Inf(1), ErrNonFinite}, {math.Inf(-1), ErrNonFinite}} {
		if _, err := LoadForPressure(b1, b2, c.v); !errors.Is(err, c.kind) || !strings.Contains(err.Error(), "p0") {
			t.Errorf("LoadForPressure(%v): %v, want %v", c.v, err, c.kind)
		}
		if _, err := LoadForApproach(b1, b2, c.v); !errors.Is(err, c.kind) || !strings.Contains(err.Error(), "delta") {
			t.Errorf("LoadForApproach(%v): %v, want %v", c.v, err, c.kind)
		}
	}
	if _, err := LoadForPressure(Sphere(1e-300, Steel52100), Flat(Steel52100), 1e300); !errors.Is(err, ErrRange) {
		t.Errorf("LoadForPressure overflow: %v", err)
	}
}

// TestSentinels checks the error vocabulary: the shared meanings are the
// module's values (internal/errs), the two refined kinds are found by
// errors.Is both as themselves and as ErrDegenerate, and no sentinel
// matches an unrelated one.
func TestSentinels(t *testing.T) {
	if ErrNonFinite != errs.ErrNonFinite || ErrRange != errs.ErrRange || ErrDegenerate != errs.ErrDegenerate {
		t.Fatal("ErrNonFinite, ErrRange, ErrDegenerate are not the module's shared sentinels")
	}
	s := Steel52100
	_, line := Solve(Cylinder(0.005, 0, s), Flat(s), 1)
	_, geom := Solve(Flat(s), Flat(s), 1)
	_, nan := Solve(Sphere(math.NaN(), s), Flat(s), 1)
	_, neg := Solve(Sphere(0.005, s), Flat(s), -1)
	for _, c := range []struct {
		name     string
		err      error
		is, isnt []error
	}{
		{"line contact", line, []error{ErrLineContact, ErrDegenerate}, []error{ErrGeometry, ErrRange, ErrNonFinite}},
		{"flat on flat", geom, []error{ErrGeometry, ErrDegenerate}, []error{ErrLineContact, ErrRange, ErrNonFinite}},
		{"NaN radius", nan, []error{ErrNonFinite}, []error{ErrRange, ErrDegenerate, ErrLineContact, ErrGeometry}},
		{"negative load", neg, []error{ErrRange}, []error{ErrNonFinite, ErrDegenerate, ErrLineContact, ErrGeometry}},
	} {
		for _, target := range c.is {
			if !errors.Is(c.err, target) {
				t.Errorf("%s: %v does not match %v", c.name, c.err, target)
			}
		}
		for _, target := range c.isnt {
			if errors.Is(c.err, target) {
				t.Errorf("%s: %v matches %v", c.name, c.err, target)
			}
		}
	}
}
