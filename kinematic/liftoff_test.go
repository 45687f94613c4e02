package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestLiftOffTilted pulls in tilted directions on a 3-2-1 layout of pads
// whose contacts' centroid (the model's origin) lies off every axis, so
// that a force evaluated about the wrong point gives other numbers. The
// limits are worked by hand with rigid statics.
//
// Layout (a = 0.1 m, all contacts in the plane z = 0; the base pushes the
// body along each normal):
//
//	A1 (0, 0, 0), A2 (a, 0, 0), A3 (0, a, 0)   normal +z
//	B1 (0, −a/2, 0), B2 (a, −a/2, 0)            normal +y
//	C  (−a/2, a/2, 0)                           normal +x
//
// Their centroid is (a/4, a/12, 0). A force f along +z at (x, y, 0) has the
// moment (y f, −x f, 0) about the origin, one along +y at (x, y, 0) the
// moment (0, 0, x f), one along +x the moment (0, 0, −y f). Equilibrium with
// an external wrench (F, M) about the origin gives, one equation each:
//
//	x:  f_C = −F_x
//	Mx: a f_A3 = −M_x           My: −a f_A2 = −M_y, so f_A2 = M_y/a
//	z:  f_A1 = −F_z − f_A2 − f_A3
//	Mz: a f_B2 − (a/2) f_C = −M_z, so f_B2 = ((a/2) f_C − M_z)/a
//	y:  f_B1 = −F_y − f_B2
//
// Preload: 30 N along −z at (a/3, a/3, 0.02) (M = (−1, 1, 0) N·m), 20 N
// along −y at (a/2, 0.01, 0) (M_z = −1 N·m) and 10 N along −x at
// (0.01, a/2, 0) (M_z = +0.5 N·m): every contact carries 10 N.
//
// A unit force along d at q adds F = d and M = q × d.
//
//  1. d = (−0.6, 0, 0.8), q = (a/2, a/2, a): M = (0.04, −0.1, 0.03), so
//     Δf_C = 0.6, Δf_A3 = −0.4, Δf_A2 = −1, Δf_A1 = −0.8 + 1 + 0.4 = 0.6,
//     Δf_B2 = (0.05·0.6 − 0.03)/a = 0, Δf_B1 = 0. A2 unloads first, at
//     10/1 = 10 N (A3 would at 25 N).
//  2. d = (−0.6, 0, 0.8), q = (0, 0, a/2): M = (0, −0.03, 0), so Δf_C = 0.6,
//     Δf_A3 = 0, Δf_A2 = −0.3, Δf_A1 = −0.5, Δf_B2 = 0.3, Δf_B1 = −0.3. A1
//     unloads first, at 10/0.5 = 20 N (A2 and B1 at 33.3 N).
//  3. d = (0.6, 0.8, 0), q = (a, 0, 0): M = (0, 0, 0.08), so Δf_C = −0.6,
//     Δf_A = 0, Δf_B2 = (0.05·(−0.6) − 0.08)/a = −1.1, Δf_B1 = −0.8 + 1.1 =
//     0.3. B2 unloads first, at 10/1.1 N (C at 16.7 N).
func TestLiftOffTilted(t *testing.T) {
	const a = 0.1
	pad := func(label string, x, y float64, n r3.Vec) Contact {
		return Contact{Label: label, Point: r3.Vec{X: x, Y: y}, Normal: n}
	}
	cs := []Contact{
		pad("A1", 0, 0, r3.Vec{Z: 1}), pad("A2", a, 0, r3.Vec{Z: 1}), pad("A3", 0, a, r3.Vec{Z: 1}),
		pad("B1", 0, -a/2, r3.Vec{Y: 1}), pad("B2", a, -a/2, r3.Vec{Y: 1}),
		pad("C", -a/2, a/2, r3.Vec{X: 1}),
	}
	pre := []Preload{
		{Name: "down", Point: r3.Vec{X: a / 3, Y: a / 3, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 30},
		{Name: "side", Point: r3.Vec{X: a / 2, Y: 0.01}, Direction: r3.Vec{Y: -1}, Force: 20},
		{Name: "end", Point: r3.Vec{X: 0.01, Y: a / 2}, Direction: r3.Vec{X: -1}, Force: 10},
	}
	m, err := NewModel(cs, pre, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	base := LoadCase{PreloadFactor: 1}
	for _, tc := range []struct {
		dir, q  r3.Vec
		force   float64
		contact string
	}{
		{r3.Vec{X: -0.6, Z: 0.8}, r3.Vec{X: a / 2, Y: a / 2, Z: a}, 10, "A2"},
		{r3.Vec{X: -0.6, Z: 0.8}, r3.Vec{Z: a / 2}, 20, "A1"},
		{r3.Vec{X: 0.6, Y: 0.8}, r3.Vec{X: a}, 10 / 1.1, "B2"},
		// The direction need not be unit: (−3, 0, 4) is case 1's.
		{r3.Vec{X: -3, Z: 4}, r3.Vec{X: a / 2, Y: a / 2, Z: a}, 10, "A2"},
	} {
		lo, err := m.LiftOff(base, tc.dir, []r3.Vec{tc.q})
		if err != nil {
			t.Fatal(err)
		}
		if got := lo[0]; math.Abs(got.Force-tc.force) > 1e-12*tc.force || got.Contact != tc.contact || got.Point != tc.q {
			t.Errorf("pull along %v at %v: %+v, want %g N at %s", tc.dir, tc.q, got, tc.force, tc.contact)
		}
	}
}
