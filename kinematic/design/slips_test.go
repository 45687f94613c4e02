package design

import (
	"context"
	"errors"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// v2 returns a change that makes baseJSON a version 2 file without the
// SI declaration: the inertia, plain SI numbers in baseJSON, gets units.
func v2(changes ...func(map[string]any)) func(map[string]any) {
	return both(append([]func(map[string]any){
		set("format", Format),
		set("payload.inertia", map[string]any{"xx": "4000 kg mm^2", "yy": "4000 kg mm^2", "zz": "6000 kg mm^2"}),
	}, changes...)...)
}

// TestBareNumbers checks (the numbers as encoding/json writes them) that in a version 2 file a plain number for a
// dimensioned quantity is refused with its path and the units it most
// likely meant, in every kind of field, and that a plain 0, the
// dimensionless numbers and the directions stay plain.
func TestBareNumbers(t *testing.T) {
	if _, err := Parse([]byte(edit(t, v2()))); err != nil {
		t.Fatalf("the base design as version 2 must read: %v", err)
	}
	tests := []struct {
		name, path string
		v          any
		suggest    string
	}{
		{"half-angle", "seats[0].half_angle", 45, `write "45 deg" or "45 rad"`},
		{"radius", "balls[0].radius", 6.35, `write "6.35 mm" or "6.35 m"`},
		{"centre", "balls[1].centre[2]", 3, `write "3 mm" or "3 m"`},
		{"azimuth", "seats[2].azimuth", 30, `"30 deg"`},
		{"flank radius", "seats[0].flank_radius", 7, `"7 mm"`},
		{"preload force", "preloads[0].force", 300, `write "300 N"`},
		{"preload rate", "preloads[0].rate", -6, `"-6 N/mm" or "-6 N/m"`},
		{"payload mass", "payload.mass", 2, `write "2 g" or "2 kg"`},
		{"inertia", "payload.inertia.xx", 4e-3, `"0.004 kg mm^2" or "0.004 kg m^2"`},
		{"gravity", "cases[0].gravity[2]", -9.81, `write "-9.81 g" or "-9.81 m/s^2"`},
		{"tolerance", "tolerances[0].value", 1e-6, `"0.000001 mm" or "0.000001 m"`},
		{"shock level", "requirements.min_shock.level", 5, `"5 g" or "5 m/s^2"`},
		{"modulus", "balls[0].material", map[string]any{"e": 210, "nu": 0.3}, `"210 MPa" or "210 GPa"`},
		{"thermal", "thermal", map[string]any{"delta_t": 3}, `write "3 K"`},
		{"expansion", "thermal", map[string]any{"delta_t": "3 K", "moving_alpha": 23.6}, `"23.6 ppm/K" or "23.6 1/K"`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(edit(t, v2(set(tc.path, tc.v)))))
			var e *Error
			if !errors.As(err, &e) || !errors.Is(err, ErrUnit) {
				t.Fatalf("bare %v at %s: %v, want an *Error wrapping ErrUnit", tc.v, tc.path, err)
			}
			if !strings.HasPrefix(e.Path, tc.path) {
				t.Errorf("path %q, want it to start with %q (%v)", e.Path, tc.path, err)
			}
			for _, want := range []string{"has no unit", tc.suggest, `declare "units": "si" at the top of the file`} {
				if !strings.Contains(err.Error(), want) {
					t.Errorf("error %q does not say %q", err, want)
				}
			}
		})
	}
	// Plain numbers that stay plain in version 2: a 0 (zero in every
	// unit), directions, Poisson's ratio, the preload factor, mu, the
	// requirements' ratios and indices, the study's counts.
	d, err := Parse([]byte(edit(t, v2(
		set("balls[0].centre", []any{0, "50 mm", 0}), set("seats[0].up", []any{0, 0, 2}),
		set("cases[0].preload", 1.5), set("friction", map[string]any{"mu": 0.15}),
		set("balls[1].material", map[string]any{"e": "210 GPa", "nu": 0.3}),
		set("requirements.min_maxwell_index", 0.5), set("monte_carlo", map[string]any{"samples": 10, "seed": 3}),
		set("thermal", map[string]any{"delta_t": 0, "moving_alpha": 0})))))
	if err != nil {
		t.Fatalf("plain zeros and dimensionless numbers must read in version 2: %v", err)
	}
	if d.Balls[0].Centre.X != 0 || d.Cases[0].PreloadFactor != 1.5 || d.Friction.Mu != 0.15 || d.Balls[1].Material.Nu != 0.3 {
		t.Errorf("plain numbers read as %v, %g, %g, %g", d.Balls[0].Centre, d.Cases[0].PreloadFactor, d.Friction.Mu, d.Balls[1].Material.Nu)
	}
}

// TestUnitsDeclaration checks the declaration "units": "si": with it a
// version 2 file reads plain numbers in SI units exactly as version 1
// did, and any other declaration is refused.
func TestUnitsDeclaration(t *testing.T) {
	v1 := readFile(t, "testdata/equilateral.json")
	if !strings.Contains(string(v1), `"format": "sixfold.design/1"`) || !strings.Contains(string(v1), `"half_angle": 0.7853981633974483`) {
		t.Fatal("testdata/equilateral.json should be a version 1 file with a plain SI number")
	}
	old, err := Parse(v1)
	if err != nil {
		t.Fatalf("a version 1 file with plain numbers must still read: %v", err)
	}
	declared := strings.Replace(string(v1), `"format": "sixfold.design/1",`, `"format": "sixfold.design/2", "units": "si",`, 1)
	d, err := Parse([]byte(declared))
	if err != nil {
		t.Fatalf("version 2 with \"units\": \"si\": %v", err)
	}
	if diff := cmp.Diff(old, d); diff != "" {
		t.Errorf("version 2 with the SI declaration reads otherwise than version 1 (-v1 +v2):\n%s", diff)
	}
	undeclared := strings.Replace(string(v1), `"format": "sixfold.design/1",`, `"format": "sixfold.design/2",`, 1)
	if _, err := Parse([]byte(undeclared)); !errors.Is(err, ErrUnit) || !strings.Contains(err.Error(), "seats[2].half_angle") ||
		!strings.Contains(err.Error(), `"0.7853981633974483 rad"`) {
		t.Errorf("version 2 without the declaration: %v, want the bare half-angle refused", err)
	}
	for _, tc := range []struct {
		v      any
		is     error
		reason string
	}{
		{"mm", ErrRange, `"mm"; the only declaration is "si"`},
		{"SI", ErrRange, `"SI"; the only declaration is "si"`},
		{1, ErrType, `must be the string "si"`},
	} {
		_, err := Parse([]byte(edit(t, v2(set("units", tc.v)))))
		var e *Error
		if !errors.As(err, &e) || e.Path != "units" || !errors.Is(err, tc.is) || !strings.Contains(err.Error(), tc.reason) {
			t.Errorf("\"units\": %v: %v, want units: %v: %s", tc.v, err, tc.is, tc.reason)
		}
	}
}

// TestBlame checks slips that were blamed on another entry, or not
// refused at all: each error names the entry the caller wrote.
func TestBlame(t *testing.T) {
	tests := []struct {
		name   string
		change func(map[string]any)
		path   string
		is     error
		reason string
	}{
		{"zero axis", set("axis", []any{0, 0, 0}), "axis", ErrDegenerate, "a zero vector is no direction"},
		{"zero groove direction", both(del("seats[1].azimuth"), set("seats[1].direction", []any{0, 0, 0})), "seats[1].direction", ErrDegenerate, "a zero vector is no direction"},
		{"zero cone toward", set("seats[0]", map[string]any{"type": "cone", "half_angle": "35 deg", "toward": []any{0, 0, 0}, "material": "steel-440c"}), "seats[0].toward", ErrDegenerate, "a zero vector"},
		{"zero preload direction", set("preloads[0].direction", []any{0, 0, 0}), "preloads[0].direction", ErrDegenerate, "a zero vector"},
		{"negative mass with a shock requirement", set("payload.mass", "-450 g"), "payload.mass", ErrRange, "must be a mass ≥ 0, got -0.45 kg"},
		{"negative mass with a frequency requirement", both(set("payload.mass", "-450 g"),
			set("requirements", map[string]any{"min_frequency": map[string]any{"limit": "100 Hz"}})), "payload.mass", ErrRange, "must be a mass ≥ 0"},
		{"long description", set("description", strings.Repeat("x", 4097)), "description", ErrTooLarge, "4097 bytes; at most 4096"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse([]byte(edit(t, v2(tc.change))))
			var e *Error
			if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, tc.is) || !strings.Contains(err.Error(), tc.reason) {
				t.Errorf("got %v, want %s: %v: …%s…", err, tc.path, tc.is, tc.reason)
			}
		})
	}
	if _, err := Parse([]byte(edit(t, v2(set("description", strings.Repeat("x", 4096)))))); err != nil {
		t.Errorf("a description of 4096 bytes, the documented limit, must read: %v", err)
	}
}

// TestInvalidUTF8 checks that bytes that are not UTF-8 are refused with
// the path of the string that holds them, in a value and in a member
// name, and in a Design built in Go.
func TestInvalidUTF8(t *testing.T) {
	base := edit(t, v2())
	for _, tc := range []struct{ name, file, path string }{
		{"description", strings.Replace(base, `{`, "{\"description\": \"ab\xffc\",", 1), "description"},
		{"case name", strings.Replace(base, `"seated"`, "\"seat\xc3\"", 1), "cases[0].name"},
		{"member name", strings.Replace(base, `{`, "{\"na\xe2\x82me\": 1,", 1), ""},
	} {
		_, err := Parse([]byte(tc.file))
		var e *Error
		if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, ErrSyntax) || !strings.Contains(err.Error(), "is not UTF-8") {
			t.Errorf("%s: %v, want %q: malformed JSON: … is not UTF-8", tc.name, err, tc.path)
		}
	}
	d, err := Parse([]byte(base))
	if err != nil {
		t.Fatal(err)
	}
	d.Description = "ab\xffc"
	if err := d.Validate(); !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), "description: out of range: not valid UTF-8") {
		t.Errorf("Validate with invalid UTF-8 in the description: %v", err)
	}
}

// TestThermalBlame checks that a thermal change that moves a ball off
// its seat is blamed on the thermal input that moves it, and says that
// the thermal solve failed, with the seat at fault as Other. The motions
// quoted are |ΔT·α|·distance, worked by hand: the base design's balls lie
// 50 mm from the origin, so 10 K at 0.05 /K moves them 0.025 m; with the
// base held at (1000 m, 0, 0) the farthest ball (B, at x = -43.3 mm)
// lies 1000.04 m away, so 10 K at 20 ppm/K moves its seat 0.2 m.
func TestThermalBlame(t *testing.T) {
	tests := []struct {
		name    string
		thermal map[string]any
		path    string
		reason  string
	}{
		{"moving alpha", map[string]any{"delta_t": "10 K", "moving_alpha": "0.05 1/K"}, "thermal.moving_alpha", "moves the ball centres up to 0.025 m"},
		{"base alpha", map[string]any{"delta_t": "10 K", "base_alpha": "0.05 1/K"}, "thermal.base_alpha", "moves the seats up to 0.025 m"},
		{"base held far away", map[string]any{"delta_t": "10 K", "base_alpha": "20 ppm/K", "base_ref": []any{"1000 m", 0, 0}}, "thermal.base_ref", "moves the seats up to 0.2 m"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			d, err := Parse([]byte(edit(t, v2(set("thermal", tc.thermal)))))
			if err != nil {
				t.Fatal(err)
			}
			_, err = d.Evaluate(context.Background())
			var e *Error
			if !errors.As(err, &e) || e.Path != tc.path || !strings.HasPrefix(e.Other, "seats[") || !errors.Is(err, ErrRange) {
				t.Fatalf("got %v, want %s with Other a seat, wrapping ErrRange", err, tc.path)
			}
			for _, want := range []string{"the thermal solve failed", tc.reason, "cannot reach its seat"} {
				if !strings.Contains(err.Error(), want) {
					t.Errorf("error %q does not say %q", err, want)
				}
			}
		})
	}
}

// TestToleranceOutOfProportion: a tolerance beyond the ball's radius
// (6.35 mm here) or an angular one beyond 0.1 rad is refused at the
// tolerance's path, without the Go API's hint about bare SI numbers (the
// file's value carries its unit). Hand figures: 10 mm = 0.01 m;
// 6° = 0.1047 rad.
func TestToleranceOutOfProportion(t *testing.T) {
	for _, tc := range []struct {
		tol  map[string]any
		want string
	}{
		{map[string]any{"dimension": "B.Seat.X", "value": "10 mm"}, "0.01 m on B.Seat.X exceeds ball B's radius 0.00635 m"},
		{map[string]any{"dimension": "C.Seat.Turn", "value": "6 deg"}, "0.1047 rad on C.Seat.Turn: an angular tolerance is at most 0.1 rad"},
	} {
		_, err := Parse([]byte(edit(t, set("tolerances", []any{map[string]any{"dimension": "A.Ball.Radius", "value": "1 um"}, tc.tol}))))
		var e *Error
		if !errors.As(err, &e) || e.Path != "tolerances[1].value" || !errors.Is(err, ErrRange) {
			t.Fatalf("%v: %v; want tolerances[1].value out of range", tc.tol, err)
		}
		if msg := err.Error(); !strings.Contains(msg, tc.want) || strings.Contains(msg, "if that is") || strings.Contains(msg, "are in metres") || strings.Contains(msg, "are in radians") {
			t.Errorf("%v: %q; want %q and no SI-number hint", tc.tol, msg, tc.want)
		}
	}
}

// TestHalfAngleRadiansAsDegrees: a half-angle whose number in degrees is
// at most π/2 ≈ 1.5708 is radians written with a degree unit and is
// refused with the reading it probably had: 0.785 rad is 0.785·180/π =
// 44.98°, printed "45 deg" (hand arithmetic); 1.5 rad is 85.9°. Just
// above π/2, an azimuth of 1 deg and a tolerance of 1 deg are left alone.
func TestHalfAngleRadiansAsDegrees(t *testing.T) {
	// π/4 = 0.785 rad is 45°; 1.2 rad is 68.8°, the largest reading
	// offered; 1.5 and 1.5707 would read 85.9° and 90° (the field refuses
	// 90° itself), so only the slot is said.
	for _, tc := range []struct {
		v, want, not string
	}{
		{"0.785 deg", "0.785 deg: if that is radians, it is 45 deg; a half-angle of 0.785° leans the contact normals within 0.785° of horizontal", ""},
		{"1.2 deg", "1.2 deg: if that is radians, it is 68.8 deg;", ""},
		{"1.5 °", "1.5 °: a half-angle of 1.5° leans the contact normals within 1.5° of horizontal, the walls of a slot", "if that is radians"},
		{"1.5707 deg", "the walls of a slot", "if that is radians"},
	} {
		_, err := Parse([]byte(edit(t, set("seats[1].half_angle", tc.v))))
		var e *Error
		if !errors.As(err, &e) || e.Path != "seats[1].half_angle" || !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), tc.want) ||
			(tc.not != "" && strings.Contains(err.Error(), tc.not)) {
			t.Errorf("half_angle %q: %v; want seats[1].half_angle refused with %q (and not %q)", tc.v, err, tc.want, tc.not)
		}
	}
	for _, change := range []func(map[string]any){
		set("seats[1].half_angle", "45 deg"),
		set("seats[1].half_angle", "0.785 rad"),
		set("seats[1].azimuth", "1 deg"),
		set("tolerances", []any{map[string]any{"dimension": "B.Seat.Turn", "value": "1 deg"}}),
	} {
		if _, err := Parse([]byte(edit(t, change))); err != nil {
			t.Errorf("%v", err)
		}
	}
	// Just above π/2 the reader leaves the half-angle to the model's own
	// checks; whatever they say, it is not this refusal.
	if _, err := Parse([]byte(edit(t, set("seats[1].half_angle", "1.5709 deg")))); err != nil && strings.Contains(err.Error(), "if that is radians") {
		t.Errorf("1.5709 deg: %v", err)
	}
}

// TestOverlapNamesMistypedBall: balls[0].radius written "0.2 m" (2 mm
// meant) makes ball A overlap ball B (their centres lie 86.6 mm apart in
// the base design, less than 0.2 + 0.00635 m): the error's path is the
// mistyped ball, balls[0], and balls[1] comes as "see". Written "3 m", the
// radius is refused on its own, as a whole ball over 0.5 m, with the
// millimetre reading.
func TestOverlapNamesMistypedBall(t *testing.T) {
	_, err := Parse([]byte(edit(t, set("balls[0].radius", "0.2 m"))))
	var e *Error
	if !errors.As(err, &e) || e.Path != "balls[0]" || e.Other != "balls[1]" || !errors.Is(err, ErrRange) {
		t.Fatalf("a 0.2 m ball: %v; want balls[0], see balls[1]", err)
	}
	if want := "balls A and B overlap: radii 0.2 m and 0.00635 m"; !strings.Contains(err.Error(), want) {
		t.Errorf("a 0.2 m ball: %q lacks %q", err, want)
	}
	_, err = Parse([]byte(edit(t, set("balls[0].radius", "3 m"))))
	if !errors.As(err, &e) || !strings.HasPrefix(e.Path, "balls[0]") || !errors.Is(err, ErrRange) ||
		!strings.Contains(err.Error(), "if that is millimetres, it is 0.003 m") {
		t.Errorf("a 3 m ball: %v; want balls[0] refused with the millimetre reading", err)
	}
}
