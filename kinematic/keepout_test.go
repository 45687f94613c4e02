package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestKeepOutWindows checks the windows against geometry worked by hand.
// The ball sits at the origin in a vee with Up along +z, so that an
// obstacle at (x, y) lies at the plan azimuth atan2(y, x) from +x (FrameX
// with Up along z is the global x axis); a groove at azimuth a is the
// same line as a + 180°, so each obstacle forbids [θ − c, θ + c] modulo
// 180° and the window is the longest arc left.
func TestKeepOutWindows(t *testing.T) {
	const deg = math.Pi / 180
	at := func(azDeg, r float64) r3.Vec {
		return r3.Vec{X: r * math.Cos(azDeg*deg), Y: r * math.Sin(azDeg*deg)}
	}
	one := func(up r3.Vec) Coupling {
		v := vee45
		v.Up, v.Direction = up, r3.Cross(up, r3.Vec{X: 1, Y: 1, Z: 1})
		return Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: v}}}
	}
	tests := []struct {
		name     string
		c        Coupling
		obs      []KeepOut
		min, max float64 // deg
	}{
		// θ = 45°, c = 30°: forbidden [15°, 75°]; left (75°, 195°).
		{"one obstacle", one(up), []KeepOut{{At: at(45, 0.03), Clearance: 30 * deg}}, 75, 195},
		// θ = 0° (c 10°) and 60° (c 20°): forbidden [−10°, 10°] and
		// [40°, 80°]; gaps (10°, 40°) of 30° and (80°, 170°) of 90°.
		{"two obstacles", one(up), []KeepOut{{At: at(0, 0.03), Clearance: 10 * deg}, {At: at(60, 0.05), Clearance: 20 * deg}}, 80, 170},
		// θ = 0° (c 80°) covers [−80°, 80°] and so the arcs about 30°
		// and 60° (c 5°) that lie inside it; left (80°, 100°). A
		// search between neighbouring obstacles only would give
		// (35°, 55°), inside the first arc.
		{"arc over its neighbours", one(up), []KeepOut{{At: at(0, 0.03), Clearance: 80 * deg}, {At: at(30, 0.03), Clearance: 5 * deg}, {At: at(60, 0.03), Clearance: 5 * deg}}, 80, 100},
		// θ = 170°: 170° + 180° is the same line; forbidden [160°, 180°];
		// left (180°, 340°).
		{"azimuth near 180°", one(up), []KeepOut{{At: at(170, 0.03), Clearance: 10 * deg}}, 180, 340},
		// Out of reach in plan (50 mm > 40 mm): every azimuth.
		{"out of reach", one(up), []KeepOut{{At: at(45, 0.05), Reach: 0.04, Clearance: 30 * deg}}, -90, 90},
		// 50 mm away in plan and 40 mm above: 64 mm away in space but
		// within a plan reach of 60 mm, so it counts: θ = 0°, c = 30°,
		// left (30°, 150°).
		{"reach in plan", one(up), []KeepOut{{At: r3.Vec{X: 0.05, Z: 0.04}, Reach: 0.06, Clearance: 30 * deg}}, 30, 150},
		// Right above the ball: no direction in plan, nothing forbidden.
		{"above the ball", one(up), []KeepOut{{At: r3.Vec{Z: 0.03}, Clearance: 30 * deg}}, -90, 90},
		// Up along +x: FrameX is then the global y axis (Reference's
		// documentation) and azimuths turn about +x from +y towards +z,
		// so an obstacle on +z lies at 90°: forbidden [60°, 120°], left
		// (120°, 240°).
		{"up along x", one(r3.Vec{X: 1}), []KeepOut{{At: r3.Vec{Z: 0.03}, Clearance: 30 * deg}}, 120, 240},
		// A flat is no groove: every azimuth.
		{"flat", Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: Flat{Up: up, Material: vee45.Material}}}}, []KeepOut{{At: at(0, 0.03), Clearance: 30 * deg}}, -90, 90},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			w, err := KeepOutWindows(tc.c, tc.obs)
			if err != nil {
				t.Fatal(err)
			}
			if len(w) != 1 || w[0].From != FrameX {
				t.Fatalf("windows %+v", w)
			}
			if math.Abs(w[0].Min/deg-tc.min) > 1e-9 || math.Abs(w[0].Max/deg-tc.max) > 1e-9 {
				t.Errorf("window [%.9g°, %.9g°], want [%g°, %g°]", w[0].Min/deg, w[0].Max/deg, tc.min, tc.max)
			}
		})
	}
}

// TestKeepOutErrors: bad obstacles name their field; obstacles that
// leave a groove no direction name its seat.
func TestKeepOutErrors(t *testing.T) {
	c := threeVees(t, 0)
	for _, tc := range []struct {
		obs   []KeepOut
		field string
		err   error
	}{
		{[]KeepOut{{At: r3.Vec{X: math.NaN()}}}, "obstacles[0].At", ErrNonFinite},
		{[]KeepOut{{}, {Reach: -1}}, "obstacles[1].Reach", ErrRange},
		{[]KeepOut{{Reach: math.Inf(1)}}, "obstacles[0].Reach", ErrNonFinite},
		{[]KeepOut{{Clearance: math.Pi / 2}}, "obstacles[0].Clearance", ErrRange},
		// Two obstacles 90° apart in plan from ball A at (0, 50) mm
		// (helpers' equilateral layout), each forbidding ±50°: together
		// they cover all 180° of groove directions.
		{[]KeepOut{{At: r3.Vec{X: 0.05, Y: 0.05}, Clearance: 50 * math.Pi / 180}, {At: r3.Vec{Y: 0.1}, Clearance: 50 * math.Pi / 180}}, "Pairs[0].Seat", ErrRange},
	} {
		_, err := KeepOutWindows(c, tc.obs)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%+v: %v, want %s wrapping %v", tc.obs, err, tc.field, tc.err)
		}
	}
}
