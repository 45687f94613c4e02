package design

import (
	"bytes"
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

const degree = math.Pi / 180

// studyJSON is baseJSON with every study section: the point's name, keep-outs,
// windows by both references, and optimiser settings with a box and a
// disc region.
func studyJSON(t *testing.T) string {
	return edit(t, both(
		set("point_name", "probe tip"),
		set("packaging", map[string]any{
			"keep_outs": []any{
				map[string]any{"name": "cable", "at": []any{"2.614672282429744 mm", "20.114159057247633 mm", 0}, "reach": "40 mm", "clearance": "10 deg"},
				map[string]any{"at": []any{"0 mm", "-80 mm", 0}, "clearance": "5 deg"},
			},
			"windows": []any{
				map[string]any{"ball": "A", "min": "-30 deg", "max": "30 deg"},
				map[string]any{"ball": "C", "min": "10 deg", "max": "100 deg", "reference": "frame_x"},
			},
		}),
		set("optimize", map[string]any{
			"objective": "max_first_frequency", "min_centre_index": 0.85, "min_contact_index": 0.8, "max_pressure_ratio": 0.9,
			"max_condition": 6, "half_angles": []any{"40 deg", "45 deg"}, "seed": 42,
			"regions": []any{
				map[string]any{"ball": "A", "half_width": []any{"2 mm", "1 mm"}},
				map[string]any{"ball": "B", "radius": "3 mm"},
			},
		}),
	))
}

// TestStudyRoundTrip reads every study key and checks that the canonical
// form reads back equal, and what the Go form holds.
func TestStudyRoundTrip(t *testing.T) {
	d, err := Parse([]byte(studyJSON(t)))
	if err != nil {
		t.Fatal(err)
	}
	out := string(roundTrip(t, d))
	for _, want := range []string{`"point_name": "probe tip"`, `"keep_outs"`, `"reference": "frame_x"`, `"reference": "radial"`,
		`"objective": "max_first_frequency"`, `"half_width": [0.002, 0.001]`, `"radius": 0.003`, `"seed": 42`} {
		if !strings.Contains(out, want) {
			t.Errorf("canonical form lacks %s", want)
		}
	}
	want := &OptimizeSettings{Objective: kinematic.MaxFirstFrequency, MinCentreIndex: 0.85, MinContactIndex: 0.8, MaxPressureRatio: 0.9,
		MaxCondition: 6, HalfAngles: []float64{40 * degree, 45 * degree}, Seed: 42,
		Regions: []Region{{Ball: "A", Region: kinematic.Region{HalfWidth: [2]float64{0.002, 0.001}}}, {Ball: "B", Region: kinematic.Region{Radius: 0.003}}}}
	// The file's "40 deg" is read exactly as 40·π/180 (doc.go, Units).
	if diff := cmp.Diff(want, d.Optimize); diff != "" {
		t.Errorf("optimize (-want +got):\n%s", diff)
	}
	if d.PointName != "probe tip" || len(d.Packaging.KeepOuts) != 2 || d.Packaging.KeepOuts[0].Reach != 0.040 ||
		d.Packaging.Windows[1].Reference != kinematic.FrameX || d.Packaging.Windows[0].Reference != kinematic.Radial {
		t.Errorf("packaging read as %+v, point name %q", d.Packaging, d.PointName)
	}

	// A copy shares nothing: changing the design after Build does not
	// change the Built's.
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	h, m := d.Optimize.HalfAngles[0], d.Packaging.Windows[0].Min
	d.Optimize.HalfAngles[0] = 1
	d.Packaging.Windows[0].Min = -1
	if got := b.Design(); got.Optimize.HalfAngles[0] != h || got.Packaging.Windows[0].Min != m {
		t.Error("Built shares the study sections with the Design")
	}
}

// TestStudyErrors: bad study values are refused naming the JSON path.
func TestStudyErrors(t *testing.T) {
	keep := func(k map[string]any) func(map[string]any) {
		return set("packaging", map[string]any{"keep_outs": []any{k}})
	}
	win := func(w map[string]any) func(map[string]any) {
		return set("packaging", map[string]any{"windows": []any{w}})
	}
	opt := func(o map[string]any) func(map[string]any) { return set("optimize", o) }
	for _, tc := range []struct {
		name, file, path string
		is               error
	}{
		{"point_name type", edit(t, set("point_name", 3)), "point_name", ErrType},
		{"packaging member", edit(t, set("packaging", map[string]any{"keepouts": []any{}})), "packaging.keepouts", ErrUnknownField},
		{"keep-out no at", edit(t, keep(map[string]any{"clearance": "10 deg"})), "packaging.keep_outs[0].at", ErrMissing},
		{"keep-out no clearance", edit(t, keep(map[string]any{"at": []any{0, 0, 0}})), "packaging.keep_outs[0].clearance", ErrMissing},
		{"keep-out clearance 90", edit(t, keep(map[string]any{"at": []any{0, 0, 0}, "clearance": "90 deg"})), "packaging.keep_outs[0].clearance", ErrRange},
		{"keep-out reach in degrees", edit(t, keep(map[string]any{"at": []any{0, 0, 0}, "clearance": "9 deg", "reach": "5 deg"})), "packaging.keep_outs[0].reach", ErrUnit},
		{"keep-out negative reach", edit(t, keep(map[string]any{"at": []any{0, 0, 0}, "clearance": "9 deg", "reach": "-5 mm"})), "packaging.keep_outs[0].reach", ErrRange},
		{"window no ball", edit(t, win(map[string]any{"min": "0 deg", "max": "10 deg"})), "packaging.windows[0].ball", ErrMissing},
		{"window unknown ball", edit(t, win(map[string]any{"ball": "Z", "min": "0 deg", "max": "10 deg"})), "packaging.windows[0].ball", ErrRange},
		{"window inverted", edit(t, win(map[string]any{"ball": "A", "min": "10 deg", "max": "0 deg"})), "packaging.windows[0].max", ErrRange},
		{"window of 180", edit(t, win(map[string]any{"ball": "A", "min": "-90 deg", "max": "90 deg"})), "packaging.windows[0].max", ErrRange},
		{"window beyond 180", edit(t, win(map[string]any{"ball": "A", "min": "170 deg", "max": "200 deg"})), "packaging.windows[0].max", ErrRange},
		{"window reference", edit(t, win(map[string]any{"ball": "A", "min": "0 deg", "max": "10 deg", "reference": "x"})), "packaging.windows[0].reference", ErrRange},
		{"window twice", edit(t, set("packaging", map[string]any{"windows": []any{
			map[string]any{"ball": "A", "min": "0 deg", "max": "10 deg"}, map[string]any{"ball": "A", "min": "0 deg", "max": "20 deg"}}})), "packaging.windows[1].ball", ErrRange},
		{"objective", edit(t, opt(map[string]any{"objective": "min_error"})), "optimize.objective", ErrRange},
		{"floor 1", edit(t, opt(map[string]any{"min_centre_index": 1})), "optimize.min_centre_index", ErrRange},
		{"floor 0", edit(t, opt(map[string]any{"min_contact_index": 0})), "optimize.min_contact_index", ErrRange},
		{"condition below 1", edit(t, opt(map[string]any{"max_condition": 0.5})), "optimize.max_condition", ErrRange},
		{"half-angle 90", edit(t, opt(map[string]any{"half_angles": []any{"90 deg"}})), "optimize.half_angles[0]", ErrRange},
		{"half-angle in radians with deg", edit(t, opt(map[string]any{"half_angles": []any{"40 deg", "0.785 deg"}})), "optimize.half_angles[1]", ErrRange},
		{"half-angles empty", edit(t, opt(map[string]any{"half_angles": []any{}})), "optimize.half_angles", ErrRange},
		{"region both", edit(t, opt(map[string]any{"regions": []any{map[string]any{"ball": "A", "radius": "1 mm", "half_width": []any{"1 mm", "1 mm"}}}})), "optimize.regions[0].radius", ErrRange},
		{"region none", edit(t, opt(map[string]any{"regions": []any{map[string]any{"ball": "A"}}})), "optimize.regions[0].half_width", ErrMissing},
		{"region zero", edit(t, opt(map[string]any{"regions": []any{map[string]any{"ball": "A", "radius": 0}}})), "optimize.regions[0]", ErrRange},
		{"region width", edit(t, opt(map[string]any{"regions": []any{map[string]any{"ball": "A", "half_width": []any{"1 mm"}}}})), "optimize.regions[0].half_width", ErrType},
		{"seed", edit(t, opt(map[string]any{"seed": -1})), "optimize.seed", ErrRange},
	} {
		_, err := Parse([]byte(tc.file))
		var e *Error
		if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, tc.is) {
			t.Errorf("%s: %v; want an error at %s wrapping %v", tc.name, err, tc.path, tc.is)
		}
	}
	// A window on a seat that is not a groove: the cone fixture's flat.
	src := strings.Replace(string(readFile(t, "testdata/cone.json")), `"point_of_interest"`,
		`"packaging": {"windows": [{"ball": "C", "min": 0, "max": 0.5}]}, "point_of_interest"`, 1)
	var e *Error
	if _, err := Parse([]byte(src)); !errors.As(err, &e) || e.Path != "packaging.windows[0].ball" {
		t.Errorf("a window on a flat: %v", err)
	}
}

// TestFreeArc checks the part of a window that the keep-outs leave, on
// arcs worked by hand.
func TestFreeArc(t *testing.T) {
	for _, tc := range []struct {
		name          string
		lo, hi        float64
		arcs          [][2]float64
		start, length float64
	}{
		{"nothing forbidden", 0, 1, nil, 0, 1},
		// [0, 1] less [0.2, 0.4]: [0, 0.2] and [0.4, 1]; the longer is 0.6.
		{"one arc", 0, 1, [][2]float64{{0.2, 0.4}}, 0.4, 0.6},
		// The same arc a groove-turn (π) away forbids the same azimuths.
		{"one arc, π on", 0, 1, [][2]float64{{0.2 + math.Pi, 0.4 + math.Pi}}, 0.4, 0.6},
		// [1, 2.5] less [-0.9, -0.5] + π = [2.2416, 2.6416]: [1, π − 0.9].
		{"across the end", 1, 2.5, [][2]float64{{-0.9, -0.5}}, 1, math.Pi - 0.9 - 1},
		// Two gaps of 0.25 each in [0, 1] less [0.25, 0.75]: the lower.
		{"equal gaps", 0, 1, [][2]float64{{0.25, 0.75}}, 0, 0.25},
		// Overlapping arcs merge: [0, 1] less [0.1, 0.5] ∪ [0.4, 0.8].
		{"overlapping", 0, 1, [][2]float64{{0.4, 0.8}, {0.1, 0.5}}, 0.8, 0.2},
	} {
		s, w := freeArc(tc.lo, tc.hi, tc.arcs)
		if math.Abs(s-tc.start) > 1e-12 || math.Abs(w-tc.length) > 1e-12 {
			t.Errorf("%s: start %g, length %g; want %g, %g", tc.name, s, w, tc.start, tc.length)
		}
	}
	if _, w := freeArc(0, 1, [][2]float64{{-1, 2}}); w > 0 {
		t.Errorf("a window covered whole has a free arc of %g", w)
	}
}

// TestOptimizeOptions checks the options the file gives the optimiser,
// on the equilateral base (A at (0, 50) mm, B and C at (∓43.3, −25) mm,
// centroid at the origin, every Up along z).
func TestOptimizeOptions(t *testing.T) {
	d, err := Parse([]byte(studyJSON(t)))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	o, err := b.OptimizeOptions()
	if err != nil {
		t.Fatal(err)
	}
	// A's window, ±30° about radial: radial from A at (0, 50) mm towards
	// the origin is the frame azimuth −90°, so [−120°, −60°]. The cable
	// at 30 mm from A at azimuth −85° (A + 30 mm·(cos −85°, sin −85°) =
	// (2.6, 20.1) mm) forbids [−95°, −75°]; the far keep-out at (0, −80)
	// mm, every reach, lies at −90° from A and forbids [−95°, −85°]. The
	// longer part left is [−120°, −95°] (25°, against [−75°, −60°]).
	// C's window [10°, 100°] from the frame's x axis: the far keep-out is
	// seen from C at (43.3, −25) mm along (−43.3, −55), azimuth
	// atan2(−55, −43.3) = −128.21°, i.e. 51.79° modulo 180°, forbidding
	// [46.79°, 56.79°]; the cable, (−40.7, 45.1) mm from C, is 60.8 mm
	// away, out of reach. The longer part is [56.79°, 100°]. B gets the
	// far keep-out's whole-circle window: from B at (−43.3, −25) mm the
	// obstacle is at atan2(−55, 43.3) = −51.79°, i.e. 128.21°, so the
	// window runs from 133.21° to 123.21° + 180° = 303.21°.
	far := math.Atan2(-55, 43.30127018922193) / degree
	want := []kinematic.Window{
		{Min: -120 * degree, Max: -95 * degree, From: kinematic.FrameX},
		{Min: (far + 180 + 5) * degree, Max: (far + 360 - 5) * degree, From: kinematic.FrameX},
		{Min: (180 + math.Atan2(-55, -43.30127018922193)/degree + 5) * degree, Max: 100 * degree, From: kinematic.FrameX},
	}
	if diff := cmp.Diff(want, o.Windows, cmpApprox(1e-9)); diff != "" {
		t.Errorf("windows (-want +got):\n%s", diff)
	}
	if o.Objective != kinematic.MaxFirstFrequency || o.MinCentreIndex != 0.85 || o.MinContactIndex != 0.8 || o.MaxPressureRatio != 0.9 ||
		o.MaxCondition != 6 || o.Seed != 42 || len(o.HalfAngles) != 2 || len(o.Regions) != 3 || o.Regions[1].Radius != 0.003 || o.Regions[2] != (kinematic.Region{}) {
		t.Errorf("options %+v", o)
	}

	// Without optimiser settings, the floors and ceiling are the
	// requirements'; without packaging, every azimuth is allowed.
	d2, err := Parse([]byte(edit(t, set("requirements", map[string]any{"min_centre_index": 0.7, "min_contact_index": 0.6}))))
	if err != nil {
		t.Fatal(err)
	}
	b2, err := d2.Build()
	if err != nil {
		t.Fatal(err)
	}
	if o, err := b2.OptimizeOptions(); err != nil || o.MinCentreIndex != 0.7 || o.MinContactIndex != 0.6 || o.Windows != nil || o.Objective != kinematic.MinAmplification {
		t.Errorf("defaults: %+v, %v", o, err)
	}

	// Keep-outs that leave a window nothing.
	d3, err := Parse([]byte(edit(t, set("packaging", map[string]any{
		"keep_outs": []any{map[string]any{"at": []any{0, 0, 0}, "clearance": "40 deg"}},
		"windows":   []any{map[string]any{"ball": "A", "min": "-30 deg", "max": "30 deg"}},
	}))))
	if err != nil {
		t.Fatal(err)
	}
	b3, err := d3.Build()
	if err != nil {
		t.Fatal(err)
	}
	var e *Error
	if _, err := b3.OptimizeOptions(); !errors.As(err, &e) || e.Path != "packaging" || e.Other != "packaging.windows[0]" || !errors.Is(err, ErrRange) {
		t.Errorf("a window the keep-outs close: %v", err)
	}
}

func cmpApprox(abs float64) cmp.Option {
	return cmp.Comparer(func(a, b float64) bool { return math.Abs(a-b) <= abs })
}

// TestOptimizeWriteBack optimises designs of every seat type and checks
// that the optimised design, written by the canonical writer, reads back
// equal and builds the optimum's coupling.
func TestOptimizeWriteBack(t *testing.T) {
	rods := strings.ReplaceAll(baseJSON, `{"type": "vee", "half_angle": "45 deg", "azimuth": 0,`, `{"type": "rods", "half_angle": "45 deg", "rod_radius": "3 mm", "azimuth": 0,`)
	for _, tc := range []struct{ name, src string }{
		{"vees", edit(t, set("optimize", map[string]any{"half_angles": []any{"40 deg", "45 deg"}}))},
		{"rods", rods},
		{"socket, vee, flat", string(readFile(t, "testdata/socket.json"))},
		{"cassette", string(readFile(t, "testdata/cassette.json"))},
		{"rods and vees with regions", string(readFile(t, "testdata/packaging.json"))},
		{"cone, rods and flat", string(readFile(t, "testdata/cone.json"))},
	} {
		t.Run(tc.name, func(t *testing.T) {
			d, err := Parse([]byte(tc.src))
			if err != nil {
				t.Fatal(err)
			}
			b, err := d.Build()
			if err != nil {
				t.Fatal(err)
			}
			best, nd, err := b.Optimize()
			if err != nil {
				t.Fatal(err)
			}
			var buf bytes.Buffer
			if err := nd.Write(&buf); err != nil {
				t.Fatal(err)
			}
			back, err := Read(&buf)
			if err != nil {
				t.Fatal(err)
			}
			if diff := cmp.Diff(nd, back); diff != "" {
				t.Fatalf("the optimised design does not read back equal (-want +got):\n%s", diff)
			}
			b2, err := back.Build()
			if err != nil {
				t.Fatal(err)
			}
			got := b2.Coupling()
			for i, p := range best.Coupling.Pairs {
				q := got.Pairs[i]
				if p.Name != q.Name || r3.Norm(r3.Sub(p.Ball.Centre, q.Ball.Centre)) > 1e-15 || !sameSeat(p.Seat, q.Seat) {
					t.Errorf("pair %d: built %+v, the optimum %+v", i, q, p)
				}
			}
			// Each ball stays inside its region (every Up here is +z, so
			// the plane's axes are x and y): a disc of its radius or a box
			// of its half-widths about the drawn centre.
			if d.Optimize != nil {
				for _, g := range d.Optimize.Regions {
					k := d.ballIndex(g.Ball)
					off := r3.Sub(got.Pairs[k].Ball.Centre, d.Balls[k].Centre)
					in := math.Abs(off.Z) < 1e-15 && math.Abs(off.X) <= g.HalfWidth[0]+1e-12 && math.Abs(off.Y) <= g.HalfWidth[1]+1e-12
					if g.Radius > 0 {
						in = math.Abs(off.Z) < 1e-15 && math.Hypot(off.X, off.Y) <= g.Radius+1e-12
					}
					if !in {
						t.Errorf("ball %s moved by %v, outside its region %+v", g.Ball, off, g.Region)
					}
				}
			}
			if d.Optimize == nil && best.Score.Amplification > best.Start.Amplification*(1+1e-12) {
				t.Errorf("the optimum is worse than the start: %g > %g", best.Score.Amplification, best.Start.Amplification)
			}
		})
	}
}

// sameSeat reports whether two seats have the same geometry, directions
// compared as unit vectors to 1e-12.
func sameSeat(a, b kinematic.Seat) bool {
	same := func(u, v r3.Vec) bool { return r3.Norm(r3.Sub(r3.Unit(u), r3.Unit(v))) < 1e-12 }
	switch x := a.(type) {
	case kinematic.Vee:
		y, ok := b.(kinematic.Vee)
		return ok && same(x.Direction, y.Direction) && same(x.Up, y.Up) && x.HalfAngle == y.HalfAngle
	case kinematic.Rods:
		y, ok := b.(kinematic.Rods)
		return ok && same(x.Direction, y.Direction) && same(x.Up, y.Up) && x.HalfAngle == y.HalfAngle && x.RodRadius == y.RodRadius
	case kinematic.Trihedral:
		y, ok := b.(kinematic.Trihedral)
		return ok && same(x.Up, y.Up) && x.HalfAngle == y.HalfAngle && same(x.Azimuth, y.Azimuth)
	case kinematic.Cone:
		y, ok := b.(kinematic.Cone)
		return ok && same(x.Up, y.Up) && x.HalfAngle == y.HalfAngle && (x.Azimuth == y.Azimuth || same(x.Azimuth, y.Azimuth))
	case kinematic.Flat:
		y, ok := b.(kinematic.Flat)
		return ok && same(x.Up, y.Up)
	}
	return false
}

// TestOptimizeErrors: an objective the design cannot give names
// optimize.objective.
func TestOptimizeErrors(t *testing.T) {
	d, err := Parse([]byte(edit(t, both(del("payload.inertia"), set("optimize", map[string]any{"objective": "max_first_frequency"})))))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	var e *Error
	if _, _, err := b.Optimize(); !errors.As(err, &e) || e.Path != "optimize.objective" || !errors.Is(err, ErrDegenerate) {
		t.Errorf("max_first_frequency without inertia: %v", err)
	}
}
