package design

import (
	"errors"
	"fmt"
	"io"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
)

func TestBaseIsValid(t *testing.T) {
	if _, err := Parse([]byte(baseJSON)); err != nil {
		t.Fatalf("the base design of the malformed-file table must read: %v", err)
	}
}

// TestMalformed reads malformed design files, each with one entry wrong,
// and checks that each gets its own error: the JSON path of the entry,
// the sentinel and the reason.
func TestMalformed(t *testing.T) {
	many := func(n int, item string) string {
		return "[" + strings.TrimSuffix(strings.Repeat(item+",", n), ",") + "]"
	}
	tests := []struct {
		name   string
		file   string
		path   string
		is     error
		reason string
	}{
		// The file as a whole.
		{"empty", "", "", ErrSyntax, "empty input"},
		{"truncated", `{"format": "sixfold.design/1", "balls": [`, "balls", ErrSyntax, "unexpected end of input"},
		{"bad token", `{"format": "sixfold.design/1",, }`, "", ErrSyntax, "line 1, column"},
		{"trailing data", baseJSON + "{}", "", ErrSyntax, "more data after"},
		{"not an object", `[1, 2, 3]`, "", ErrType, "a design file is a JSON object, got an array"},
		{"no format", edit(t, del("format")), "format", ErrMissing, `"format": "sixfold.design/2"`},
		{"future format", edit(t, set("format", "sixfold.design/3")), "format", ErrVersion, `"sixfold.design/3"; this package reads "sixfold.design/2" and "sixfold.design/1"`},
		{"format number", edit(t, set("format", 1)), "format", ErrType, "must be a string"},
		{"unknown member", edit(t, set("colour", "blue")), "colour", ErrUnknownField, "a design has the fields format, units, name"},
		{"too deep", edit(t, set("description", deep(20))), "description[0][0][0][0][0][0][0][0][0][0][0][0][0][0][0][0]", ErrTooLarge, "nested more than 16 deep"},

		// Balls.
		{"no balls", edit(t, del("balls")), "balls", ErrMissing, "needs its balls"},
		{"misspelt field", edit(t, both(del("balls[0].radius"), set("balls[0].radus", "6.35 mm"))), "balls[0].radus", ErrUnknownField, "a ball has the fields name, centre, radius, material"},
		{"field twice", strings.Replace(baseJSON, `"radius": "6.35 mm",`, `"radius": "6.35 mm", "radius": "6 mm",`, 1), "balls[0].radius", ErrUnknownField, "given twice"},
		{"no radius", edit(t, del("balls[1].radius")), "balls[1].radius", ErrMissing, "a length in m"},
		{"negative radius", edit(t, set("balls[1].radius", "-5 mm")), "balls[1].radius", ErrRange, "must be a finite length > 0, got -0.005 m"},
		{"angle for a length", edit(t, set("balls[1].radius", "5 deg")), "balls[1].radius", ErrUnit, `"deg" is not a length unit (accepted: m, cm, mm`},
		{"string without unit", edit(t, set("balls[1].radius", "0.005")), "balls[1].radius", ErrUnit, "has no unit"},
		{"words", edit(t, set("balls[1].radius", "five mm")), "balls[1].radius", ErrUnit, "does not start with a number"},
		{"overflow in unit", edit(t, set("balls[1].radius", "1e400 mm")), "balls[1].radius", ErrNonFinite, "beyond float64"},
		{"overflow number", strings.Replace(baseJSON, `"radius": "6.35 mm"`, `"radius": 1e400`, 1), "balls[0].radius", ErrNonFinite, "1e400 is beyond float64"},
		{"short centre", edit(t, set("balls[0].centre", []any{0, 0})), "balls[0].centre", ErrType, "must be an array of three quantities (a length each) [x, y, z], got 2 entries"},
		{"bool coordinate", edit(t, set("balls[0].centre[1]", true)), "balls[0].centre[1]", ErrType, "must be a length: a number in m or a string"},
		{"unknown material", edit(t, set("balls[0].material", "steel-5210")), "balls[0].material", ErrRange, `no material "steel-5210" in the table`},
		{"inline nu", edit(t, set("balls[0].material", map[string]any{"e": "200 GPa", "nu": 0.7})), "balls[0].material.nu", ErrRange, "Poisson's ratio must be in (-1, 0.5], got 0.7"},
		{"inline no E", edit(t, set("balls[0].material", map[string]any{"nu": 0.3})), "balls[0].material.e", ErrMissing, "a pressure or modulus in Pa"},
		{"bad name", edit(t, set("balls[2].name", "1C")), "balls[2].name", ErrRange, "letters, digits"},
		{"same name", edit(t, set("balls[2].name", "A")), "balls[2].name", ErrRange, `"A" is also the name of balls[0]`},
		{"coincident balls", edit(t, set("balls[1].centre", []any{"0 mm", "50 mm", 0})), "balls[1].centre", ErrDegenerate, "the same centre as another ball; see balls[0].centre"},
		{"too many balls", edit(t, set("balls", fromJSON(many(65, `{"centre": [0, 0, 0], "radius": 0.001, "material": "sapphire"}`)))), "balls", ErrTooLarge, "65 entries; at most 64"},

		// Seats.
		{"half-angle 95 deg", edit(t, set("seats[2].half_angle", "95 deg")), "seats[2].half_angle", ErrRange, "must be in (0, 90) deg, got 95 deg"},
		{"no half-angle", edit(t, del("seats[0].half_angle")), "seats[0].half_angle", ErrMissing, "an angle in rad"},
		{"unknown type", edit(t, set("seats[0].type", "groove")), "seats[0].type", ErrRange, `"groove"; must be one of "vee"`},
		{"field of another type", edit(t, set("seats[0].rod_radius", "3 mm")), "seats[0].rod_radius", ErrUnknownField, "a vee seat has the fields type, up, material, half_angle, flank_radius"},
		{"direction and azimuth", edit(t, set("seats[1].direction", []any{1, 0, 0})), "seats[1].azimuth", ErrRange, "not both"},
		{"no groove direction", edit(t, del("seats[1].azimuth")), "seats[1].direction", ErrMissing, "direction [x, y, z] or an azimuth"},
		{"unknown reference", edit(t, set("seats[0].reference", "north")), "seats[0].reference", ErrRange, `"north"; must be "radial" or "frame_x"`},
		{"groove along up", edit(t, both(del("seats[2].azimuth"), set("seats[2].direction", []any{0, 0, 1}))), "seats[2].direction", ErrDegenerate, "along Up"},
		{"zero up", edit(t, set("seats[0].up", []any{0, 0, 0})), "seats[0].up", ErrDegenerate, "zero vector"},
		{"flank radius below ball", edit(t, set("seats[0].flank_radius", "3 mm")), "seats[0].flank_radius", ErrRange, "greater than the ball's radius 0.00635 m, got 0.003 m"},
		{"too few seats", edit(t, set("seats", []any{})), "seats", ErrRange, "0 seats for 3 balls"},
		{"parallel grooves", edit(t, both(
			del("seats[0].azimuth"), set("seats[0].direction", []any{1, 0, 0}),
			del("seats[1].azimuth"), set("seats[1].direction", []any{1, 0, 0}),
			del("seats[2].azimuth"), set("seats[2].direction", []any{1, 0, 0}))), "seats", ErrNotExact, "6 contacts of rank 5, leaving 1 freedom(s)"},
		{"radial undefined", edit(t, both(
			set("balls[0].centre", []any{0, 0, "30 mm"}), set("balls[1].centre", []any{"-50 mm", 0, 0}),
			set("balls[2].centre", []any{"50 mm", 0, 0}))), "seats[0].reference", ErrDegenerate, "the radial direction is undefined"},
		{"trihedral without toward", edit(t, set("seats[0]", map[string]any{"type": "trihedral", "half_angle": "35 deg", "material": "steel-440c"})), "seats[0].toward", ErrMissing, "first contact"},

		// Preloads and payload.
		{"negative preload", edit(t, set("preloads[0].force", "-10 N")), "preloads[0].force", ErrRange, "must be ≥ 0"},
		{"preload without direction", edit(t, del("preloads[0].direction")), "preloads[0].direction", ErrDegenerate, "zero vector"},
		{"inertia not positive", edit(t, set("payload.inertia.xx", -1)), "payload.inertia", ErrRange, "not positive definite"},
		{"inertia unit", edit(t, set("payload.inertia.xy", "3 kg m")), "payload.inertia.xy", ErrUnit, `"kg m" is not a moment of inertia unit`},

		// Load cases.
		{"case without name", edit(t, del("cases[0].name")), "cases[0].name", ErrMissing, "needs a name"},
		{"same case name", edit(t, set("cases", fromJSON(`[{"name": "x"}, {"name": "x"}]`))), "cases[1].name", ErrRange, `"x" is also the name of cases[0]`},
		{"force for gravity", edit(t, set("cases[0].gravity[2]", "-1 N")), "cases[0].gravity[2]", ErrUnit, "is not an acceleration unit"},
		{"negative preload factor", edit(t, set("cases[0].preload", -1)), "cases[0].preload", ErrRange, "finite number ≥ 0, got -1"},
		{"applied unknown", edit(t, set("cases[0].applied", fromJSON(`[{"force": [1, 0, 0], "at": [0, 0, 0]}]`))), "cases[0].applied[0].at", ErrUnknownField, "an applied load has the fields force, point, moment"},

		// Tolerances and the study.
		{"unknown dimension", edit(t, set("tolerances[0].dimension", "A.Ball.Colour")), "tolerances[0].dimension", ErrRange, `no dimension "A.Ball.Colour"`},
		{"repeated dimension", edit(t, set("tolerances", fromJSON(`[{"dimension": "A.Ball.X", "value": "1 um"}, {"dimension": "A.Ball.X", "value": "2 um"}]`))), "tolerances[1].dimension", ErrRange, `"A.Ball.X" is already toleranced; see tolerances[0].dimension`},
		{"angle on a length", edit(t, set("tolerances[0].value", "1 deg")), "tolerances[0].value", ErrUnit, "(A.Ball.Radius is a length)"},
		{"length on an angle", edit(t, set("tolerances[0]", map[string]any{"dimension": "B.Seat.Turn", "value": "1 um"})), "tolerances[0].value", ErrUnit, "(B.Seat.Turn is an angle)"},
		{"negative tolerance", edit(t, set("tolerances[0].value", "-1 um")), "tolerances[0].value", ErrRange, "must be ≥ 0"},
		{"unknown distribution", edit(t, set("tolerances[0].distribution", "triangular")), "tolerances[0].distribution", ErrRange, `"triangular"; must be "uniform" or "normal"`},
		{"too many tolerances", edit(t, set("tolerances", fromJSON(many(10001, `{"dimension": "A.Ball.X", "value": 0}`)))), "tolerances", ErrTooLarge, "more than 10000 entries"},
		{"fractional samples", edit(t, set("monte_carlo", map[string]any{"samples": 1.5})), "monte_carlo.samples", ErrRange, "whole number in [1, 10000000], got 1.5"},
		{"too many samples", edit(t, set("monte_carlo", map[string]any{"samples": 2e7})), "monte_carlo.samples", ErrRange, "whole number in [1, 10000000]"},
		{"negative seed", edit(t, set("monte_carlo", map[string]any{"samples": 10, "seed": -1})), "monte_carlo.seed", ErrRange, "[0, 2^64)"},
		{"negative friction", edit(t, set("friction", map[string]any{"mu": -0.1})), "friction.mu", ErrRange, "a coefficient of friction must be ≥ 0, got -0.1"},
		{"friction as a percentage", edit(t, set("friction", map[string]any{"mu": 15})), "friction.mu", ErrRange, "a percentage? (15% is 0.15)"},
		{"thermal without delta_t", edit(t, set("thermal", map[string]any{"moving_alpha": "23 ppm/K"})), "thermal.delta_t", ErrMissing, "a temperature difference in K"},

		// Requirements.
		{"zero limit", edit(t, set("requirements.min_shock.level", 0)), "requirements.min_shock.level", ErrRange, "a limit must be > 0"},
		{"unknown case", edit(t, set("requirements.min_shock.case", "transport")), "requirements.min_shock.case", ErrRange, `no load case named "transport"`},
		{"index above 1", edit(t, set("requirements.min_maxwell_index", 1.5)), "requirements.min_maxwell_index", ErrRange, "lies in [0, 1]"},
		{"unknown requirement", edit(t, set("requirements.min_wobble", 1)), "requirements.min_wobble", ErrUnknownField, "a requirements object has the fields"},
		{"study without monte carlo", edit(t, set("requirements.max_study", map[string]any{"limit": "1 um"})), "requirements.max_study", ErrMissing, "needs monte_carlo"},
		{"seating without friction", edit(t, set("requirements.seating", map[string]any{})), "requirements.seating", ErrMissing, "needs friction"},
		{"frequency without inertia", edit(t, both(del("payload.inertia"), set("requirements.min_frequency", map[string]any{"limit": "100 Hz"}))), "requirements.min_frequency", ErrMissing, "mass and inertia"},
		{"pressure without allowable", edit(t, both(
			set("balls[1].material", "tungsten-carbide"), set("seats[1].material", "sapphire"),
			set("requirements.max_pressure_ratio", 0.5))), "requirements.max_pressure_ratio", ErrMissing, "balls[1].material (tungsten carbide (WC–6%Co)) has no allowable contact pressure on file"},
		{"percentile", edit(t, both(set("monte_carlo", map[string]any{"samples": 10}),
			set("requirements.max_study", map[string]any{"limit": "1 um", "percentile": "p90"}))), "requirements.max_study.percentile", ErrRange, `"p90"; must be one of`},
	}
	seen := map[string]string{}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			d, err := Parse([]byte(tc.file))
			if err == nil {
				t.Fatalf("Parse accepted the file: %+v", d)
			}
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("error %v (%T) is not a *design.Error", err, err)
			}
			if e.Path != tc.path {
				t.Errorf("path %q, want %q (error: %v)", e.Path, tc.path, err)
			}
			if !errors.Is(err, tc.is) {
				t.Errorf("error %v does not wrap %v", err, tc.is)
			}
			if !strings.Contains(err.Error(), tc.reason) {
				t.Errorf("error %q does not give the reason %q", err, tc.reason)
			}
			if want := "design: " + tc.path; tc.path != "" && !strings.HasPrefix(err.Error(), want+": ") {
				t.Errorf("error %q does not start with %q", err, want)
			}
			noKinematicNames(t, err)
		})
		key := tc.path + " " + tc.reason
		if other, dup := seen[key]; dup {
			t.Errorf("cases %q and %q expect the same error", other, tc.name)
		}
		seen[key] = tc.name
	}
	if len(tests) < 30 {
		t.Errorf("%d malformed files; the table should have at least 30", len(tests))
	}
}

// TestKinematicSentinels checks that errors found by package kinematic
// and translated to the file's paths still match kinematic's sentinels.
func TestKinematicSentinels(t *testing.T) {
	for _, tc := range []struct {
		file string
		is   error
	}{
		{edit(t, set("seats[2].half_angle", "95 deg")), kinematic.ErrRange},
		{edit(t, set("balls[1].centre", []any{"0 mm", "50 mm", 0})), kinematic.ErrDegenerate},
		{edit(t, set("tolerances[0].dimension", "A.Ball.Colour")), kinematic.ErrRange},
		{edit(t, set("format", "sixfold.design/9")), kinematic.ErrRange},
		{edit(t, set("balls[1].radius", "1e400 mm")), kinematic.ErrNonFinite},
	} {
		if _, err := Parse([]byte(tc.file)); !errors.Is(err, tc.is) {
			t.Errorf("error %v does not wrap kinematic's %v", err, tc.is)
		}
	}
}

// TestReadBound checks that Read stops at MaxSize+1 bytes of a longer
// input instead of reading all of it.
func TestReadBound(t *testing.T) {
	r := &countingReader{r: strings.NewReader(`{"format": "sixfold.design/1", "description": "` + strings.Repeat("x", 3*MaxSize) + `"}`)}
	_, err := Read(r)
	if !errors.Is(err, ErrTooLarge) || !errors.Is(err, ErrRange) {
		t.Fatalf("error %v, want one wrapping ErrTooLarge", err)
	}
	if want := "longer than 4194304 bytes"; !strings.Contains(err.Error(), want) {
		t.Errorf("error %q does not say %q", err, want)
	}
	if r.n > MaxSize+1 {
		t.Errorf("Read read %d bytes, more than MaxSize+1 = %d", r.n, MaxSize+1)
	}
	if _, err := Parse(make([]byte, MaxSize+1)); !errors.Is(err, ErrTooLarge) {
		t.Errorf("Parse of MaxSize+1 bytes: %v, want ErrTooLarge", err)
	}
}

// TestTokenBound checks the bound on the number of JSON values.
func TestTokenBound(t *testing.T) {
	file := `{"format": "sixfold.design/1", "description": [` + strings.TrimSuffix(strings.Repeat("[1,2,3,4,5,6,7,8,9,10,11,12,13,14,15,16,17,18,19,20,21,22,23,24,25,26,27,28,29,30],", 5100), ",") + `]}`
	_, err := Parse([]byte(file))
	if !errors.Is(err, ErrTooLarge) || !strings.Contains(err.Error(), "more than 150000 JSON values") {
		t.Fatalf("error %v, want the bound on JSON values", err)
	}
}

type countingReader struct {
	r io.Reader
	n int
}

func (c *countingReader) Read(p []byte) (int, error) {
	n, err := c.r.Read(p)
	c.n += n
	return n, err
}

// deep returns n nested arrays.
func deep(n int) any {
	var v any = []any{}
	for range n {
		v = []any{v}
	}
	return v
}

// fromJSON decodes a JSON literal for the table.
func fromJSON(s string) any {
	var v any
	if err := jsonUnmarshal(s, &v); err != nil {
		panic(fmt.Sprintf("bad test JSON %q: %v", s, err))
	}
	return v
}
