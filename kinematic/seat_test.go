package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestVeeContacts checks a vee's contacts against the closed form: ball at
// the origin, r = 5 mm, groove along x, Up z, flanks at 30° to the
// symmetry plane. Side = Up × x = y, so n± = (0, ∓cos 30°, sin 30°) and
// the contact points are −r·n± (worked by hand).
func TestVeeContacts(t *testing.T) {
	c := Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: Vee{Direction: r3.Vec{X: 2}, Up: r3.Vec{Z: 3}, HalfAngle: math.Pi / 6}}}}
	cs := mustContacts(t, c)
	if len(cs) != 2 {
		t.Fatalf("%d contacts, want 2", len(cs))
	}
	c30, s30 := math.Cos(math.Pi/6), 0.5
	for k, want := range []r3.Vec{{Y: -c30, Z: s30}, {Y: c30, Z: s30}} {
		if !near(cs[k].Normal, want, 1e-15) {
			t.Errorf("contact %d normal %v, want %v", k, cs[k].Normal, want)
		}
		if !near(cs[k].Point, r3.Scale(-5e-3, want), 1e-18) {
			t.Errorf("contact %d point %v, want %v", k, cs[k].Point, r3.Scale(-5e-3, want))
		}
		if cs[k].Radius != 5e-3 || cs[k].Tangent != (r3.Vec{X: 1}) {
			t.Errorf("contact %d radius %g tangent %v", k, cs[k].Radius, cs[k].Tangent)
		}
	}
	if cs[0].Label != "A+" || cs[1].Label != "A-" {
		t.Errorf("labels %q %q, want A+ A-", cs[0].Label, cs[1].Label)
	}
}

// TestSocketNormals: the faces of a cube-corner socket are mutually
// perpendicular, so its three contact normals are too (closed form: the
// normals of a cube's three faces at a corner), and they lean
// atan(1/√2) from the horizontal.
func TestSocketNormals(t *testing.T) {
	cs := mustContacts(t, Coupling{Pairs: []Pair{{Ball: ball(1, 2, 3), Seat: Trihedral{Up: up, Azimuth: r3.Vec{X: 1, Y: 1}, HalfAngle: math.Atan(1 / math.Sqrt2)}}}})
	for i := 0; i < 3; i++ {
		for j := i + 1; j < 3; j++ {
			if d := r3.Dot(cs[i].Normal, cs[j].Normal); math.Abs(d) > 1e-15 {
				t.Errorf("normals %d, %d: dot %g, want 0", i, j, d)
			}
		}
		if z := cs[i].Normal.Z; math.Abs(z-1/math.Sqrt(3)) > 1e-15 {
			t.Errorf("normal %d: z = %g, want 1/√3", i, z)
		}
	}
	// The first contact lies on the Azimuth side of the ball.
	if d := r3.Dot(r3.Sub(cs[0].Point, cs[0].Centre), r3.Vec{X: 1, Y: 1}); d <= 0 {
		t.Errorf("first contact not on the Azimuth side: %v", cs[0].Point)
	}
}

// TestContactSurfaces checks the Hertz surfaces carried by each contact:
// a ball on a flat flank, on a gothic-arch flank (concave cylinder along
// the groove), and in a cone, whose contacts conform around the ring and
// so are reported by hertz as line contact, as documented.
func TestContactSurfaces(t *testing.T) {
	b := ball(0, 0, 0)
	arch := vee45
	arch.Direction = r3.Vec{X: 1}
	arch.FlankRadius = 5.2e-3
	cs := mustContacts(t, Coupling{Pairs: []Pair{{Ball: b, Seat: arch}}})
	if m := cs[0].Moving; m.R1 != 5e-3 || m.R2 != 5e-3 {
		t.Errorf("ball surface %+v, want a 5 mm sphere", m)
	}
	if s := cs[0].Base; !math.IsInf(s.R1, 1) || s.R2 != -5.2e-3 || s.Angle != 0 {
		t.Errorf("flank surface %+v, want R1 = +Inf along the groove, R2 = -5.2 mm", s)
	}
	if _, err := hertz.Solve(cs[0].Moving, cs[0].Base, 10); err != nil {
		t.Errorf("hertz on a gothic-arch contact: %v", err)
	}
	cone := Cone{Up: up, Azimuth: r3.Vec{X: 1}, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	cs = mustContacts(t, Coupling{Pairs: []Pair{{Ball: b, Seat: cone}}})
	if _, err := hertz.Solve(cs[0].Moving, cs[0].Base, 10); !errors.Is(err, hertz.ErrLineContact) {
		t.Errorf("hertz on a cone contact: err = %v, want line contact", err)
	}
}

// TestRodsContacts: a ball on two rods touches each rod where the normal
// from the rod's axis through the ball centre meets the ball; the normals
// are those of a vee of the same half-angle, and each contact is a ball on
// a convex cylinder along the groove, whose half relative curvatures are
// A = 1/(2r) along the rod and B = (1/r + 1/R)/2 across it (Johnson 1985,
// §4.1, for a sphere of radius r on a cylinder of radius R).
func TestRodsContacts(t *testing.T) {
	const r, R = 5e-3, 3e-3
	rods := Rods{Direction: r3.Vec{X: 1}, Up: up, HalfAngle: math.Pi / 4, RodRadius: R, Material: hertz.Steel440C}
	v := vee45
	v.Direction = r3.Vec{X: 1}
	got := mustContacts(t, Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: rods}}})
	want := mustContacts(t, Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: v}}})
	for k := range got {
		if !near(got[k].Normal, want[k].Normal, 1e-16) || !near(got[k].Point, want[k].Point, 1e-18) || got[k].Label != want[k].Label {
			t.Errorf("contact %d: %+v, want the vee's %+v", k, got[k], want[k])
		}
		h, err := hertz.Solve(got[k].Moving, got[k].Base, 10)
		if err != nil {
			t.Fatal(err)
		}
		if a, b := 1/(2*r), (1/r+1/R)/2; math.Abs(h.A-a) > 1e-12*a || math.Abs(h.B-b) > 1e-12*b {
			t.Errorf("contact %d: A = %g, B = %g; want %g, %g", k, h.A, h.B, a, b)
		}
	}
	// The rods turn with the optimiser and report as grooves.
	vb, vc := v, v
	vb.Direction, vc.Direction = r3.Vec{X: -1, Y: 0.4}, r3.Vec{Y: 1}
	c := Coupling{Pairs: []Pair{{Ball: ball(-60, 0, 0), Seat: rods}, {Ball: ball(60, 0, 0), Seat: vb}, {Ball: ball(0, 30, 0), Seat: vc}}}
	g, err := c.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	if len(g.Grooves) != 3 {
		t.Errorf("%d grooves, want 3 (rods count)", len(g.Grooves))
	}
	if _, err := Optimize(c, Scenario{}, nil); err != nil {
		t.Errorf("optimising a coupling with rods: %v", err)
	}
	for _, bad := range []float64{0, -1, math.NaN()} {
		rb := rods
		rb.RodRadius = bad
		if _, err := (Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: rb}}}).Contacts(); err == nil {
			t.Errorf("rod radius %g accepted", bad)
		}
	}
}
