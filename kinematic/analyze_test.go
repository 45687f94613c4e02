package kinematic

import (
	"errors"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/spatial/r3"
)

// threeVees returns the equilateral balls in 90° vees whose grooves make
// the azimuth az with the radial direction.
func threeVees(t *testing.T, az float64) Coupling {
	t.Helper()
	var c Coupling
	for _, b := range equilateral() {
		rad := r3.Unit(r3.Scale(-1, b.Centre))
		v := vee45
		v.Direction = r3.Rotate(rad, az, up)
		c.Pairs = append(c.Pairs, Pair{Ball: b, Seat: v})
	}
	return c
}

// TestLostFreedoms: three parallel grooves leave the translation along
// them free, and grooves tangent to the ball circle leave the rotation
// about its axis free (closed forms: the contact normals of a vee are
// normal to its groove; a rotation about the circle's axis moves each ball
// along its tangent groove).
func TestLostFreedoms(t *testing.T) {
	var par Coupling
	for _, b := range equilateral() {
		v := vee45
		v.Direction = r3.Vec{X: 1, Y: 2}
		par.Pairs = append(par.Pairs, Pair{Ball: b, Seat: v})
	}
	an := mustAnalyze(t, mustContacts(t, par))
	if an.Rank != 5 || an.DOF != 1 {
		t.Fatalf("parallel grooves: rank %d, DOF %d; want 5, 1", an.Rank, an.DOF)
	}
	ax := an.Free[0].Axis()
	if !math.IsInf(ax.Pitch, 1) || !near(ax.Direction, r3.Unit(r3.Vec{X: 1, Y: 2}), 1e-12) {
		t.Errorf("parallel grooves: free %+v, want translation along (1, 2, 0)/√5", ax)
	}
	if _, err := an.Stability(); !errors.Is(err, ErrNotExact) {
		t.Errorf("stability of a rank-5 set: err = %v, want ErrNotExact", err)
	}
	g, err := par.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	if !g.Parallel || !g.Axes[0].Parallel {
		t.Errorf("parallel grooves not reported: %+v", g)
	}

	an = mustAnalyze(t, mustContacts(t, threeVees(t, math.Pi/2)))
	if an.Rank != 5 {
		t.Fatalf("tangent grooves: rank %d, want 5", an.Rank)
	}
	ax = an.Free[0].Axis()
	if math.Abs(ax.Pitch) > 1e-12*an.Length || !near(ax.Direction, up, 1e-12) || !near(ax.Point, r3.Vec{}, 1e-12*an.Length) {
		t.Errorf("tangent grooves: free %+v, want rotation about z through the origin", ax)
	}
}

// TestSocketVeeFlat: socket, vee and flat take 3 + 2 + 1 contacts and
// constrain all six freedoms (the classic Kelvin coupling). Without the
// flat, the five contacts fix both ball centres and leave the rotation
// about the line through them free (closed form).
func TestSocketVeeFlat(t *testing.T) {
	bs := isosceles()
	c, err := SocketVeeFlat(bs, cube, vee45, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	an := mustAnalyze(t, mustContacts(t, c))
	if an.Rank != 6 || an.DOF != 0 || len(an.Redundant) != 0 {
		t.Fatalf("rank %d, DOF %d, %d redundant; want 6, 0, 0", an.Rank, an.DOF, len(an.Redundant))
	}
	if _, err := an.Stability(); err != nil {
		t.Fatal(err)
	}
	five := Coupling{Pairs: c.Pairs[:2]}
	an = mustAnalyze(t, mustContacts(t, five))
	if an.Rank != 5 {
		t.Fatalf("socket and vee: rank %d, want 5", an.Rank)
	}
	ax := an.Free[0].Axis()
	ab := r3.Unit(r3.Sub(bs[1].Centre, bs[0].Centre))
	off := r3.Norm(r3.Cross(r3.Sub(bs[0].Centre, ax.Point), ax.Direction))
	if math.Abs(ax.Pitch) > 1e-12*an.Length || math.Abs(math.Abs(r3.Dot(ax.Direction, ab))-1) > 1e-12 || off > 1e-12*an.Length {
		t.Errorf("socket and vee: free %+v, want rotation about the line through A and B", ax)
	}
}

// TestSevenContacts: a pad added under a ball already in a vee makes
// exactly one redundancy, among that ball's three contacts (the pad's
// normal is a combination of the vee's two: closed form).
func TestSevenContacts(t *testing.T) {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	c.Pairs = append(c.Pairs, Pair{Name: "pad", Ball: c.Pairs[2].Ball, Seat: flatUp})
	// The extra pair repeats ball C's centre: contacts take it from the
	// pairs, so build them by hand.
	cs := mustContacts(t, Coupling{Pairs: c.Pairs[:3]})
	pad := mustContacts(t, Coupling{Pairs: []Pair{{Name: "pad", Ball: c.Pairs[2].Ball, Seat: flatUp}}})
	cs = append(cs, pad...)
	an := mustAnalyze(t, cs)
	if an.Rank != 6 || len(an.Redundant) != 1 {
		t.Fatalf("rank %d, %d redundancies; want 6, 1", an.Rank, len(an.Redundant))
	}
	if d := cmp.Diff([]string{"C+", "C-", "pad"}, an.Participants[0]); d != "" {
		t.Errorf("participants (-want +got):\n%s", d)
	}
	if _, err := an.Stability(); !errors.Is(err, ErrNotExact) {
		t.Errorf("stability of seven contacts: err = %v, want ErrNotExact", err)
	}
}

func mustSVF(t *testing.T) Coupling {
	t.Helper()
	c, err := SocketVeeFlat(isosceles(), cube, vee45, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestInvariance: moving a design rigidly or scaling it by 2⁻¹⁰ leaves
// every index, verdict and dimensionless measure unchanged (they depend on
// the geometry's shape only), and moves the coupling centre along. Scaled
// down by a power of two, which is exact in binary (a design ×1000 has
// whole balls of metres, refused as millimetres), and moved at most about
// 500 times its size (0.12 mm across, 0.05 m away), so that the
// coordinates' rounding relative to the design (ε·distance/size, see
// TestFarFromOrigin) stays near 1e-13, under the 1e-12 checked.
func TestInvariance(t *testing.T) {
	bis, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	designs := map[string]Coupling{"bisector": bis, "skewed": threeVees(t, 0.4), "socket-vee-flat": mustSVF(t)}
	for name, c := range designs {
		s0 := mustStability(t, c)
		a0 := mustAnalyze(t, mustContacts(t, c))
		for _, tr := range []struct {
			s, angle float64
			axis     r3.Vec
			off      r3.Vec
		}{
			{0x1p-10, 0, up, r3.Vec{}},
			{1, 1.1, r3.Vec{X: 1, Y: -2, Z: 0.5}, r3.Vec{X: 0.3, Y: 0.2, Z: -1.5}},
			{0x1p-10, -2.5, r3.Vec{X: 0.2, Y: 1, Z: 1}, r3.Vec{X: 0.04, Y: -0.03, Z: 0.007}},
		} {
			m := moved(c, tr.s, tr.angle, tr.axis, tr.off)
			s1 := mustStability(t, m)
			a1 := mustAnalyze(t, mustContacts(t, m))
			if a1.Rank != a0.Rank || a1.NearSingular != a0.NearSingular || math.Abs(a1.Condition-a0.Condition) > 1e-12*a0.Condition {
				t.Errorf("%s ×%g: rank %d cond %g, was %d %g", name, tr.s, a1.Rank, a1.Condition, a0.Rank, a0.Condition)
			}
			if s1.Weakest != s0.Weakest {
				t.Errorf("%s ×%g: weakest %d, was %d", name, tr.s, s1.Weakest, s0.Weakest)
			}
			for i := range s0.Contacts {
				if d := math.Abs(s1.Contacts[i].Index - s0.Contacts[i].Index); d > 1e-12 {
					t.Errorf("%s ×%g: %s index changed by %g", name, tr.s, s0.Contacts[i].Label, d)
				}
				if d := math.Abs(s1.Contacts[i].CentreIndex - s0.Contacts[i].CentreIndex); d > 1e-12 {
					t.Errorf("%s ×%g: %s centre index changed by %g", name, tr.s, s0.Contacts[i].Label, d)
				}
			}
		}
	}
}

// TestFarFromOrigin: the same coupling 10 km from the origin (120 mm
// across) or 10 m from it at 0.12 mm across (size/distance about 1e-5), and
// 0.12 mm at 100 km (about 1e-9), gets the verdicts and indices it has at
// the origin. The coordinates themselves carry a rounding error of
// ε·distance (ε = 2.2e-16): relative to the design's size that is 2e-11 at
// 1e-5 and 2e-7 at 1e-9, and the indices move by about the condition
// number (here under 10) times that. The tolerances, 1e-9 and 1e-5, leave
// a margin of 5 or more over that bound.
func TestFarFromOrigin(t *testing.T) {
	bis, err := BisectorVees(isosceles(), three(vee45)) // 120 mm across
	if err != nil {
		t.Fatal(err)
	}
	s0 := mustStability(t, bis)
	a0 := mustAnalyze(t, mustContacts(t, bis))
	for _, tc := range []struct {
		name  string
		scale float64
		off   r3.Vec
		tol   float64
	}{
		{"100 mm at 10 km", 1, r3.Vec{X: 1e4 / math.Sqrt2, Y: 1e4 / math.Sqrt2, Z: 30}, 1e-9},
		{"0.1 mm at 10 m", 1e-3, r3.Vec{X: -6, Y: 8, Z: 0.5}, 1e-9},
		{"0.1 mm at 100 km", 1e-3, r3.Vec{Y: 1e5}, 1e-5},
	} {
		m := moved(bis, tc.scale, 0.7, r3.Vec{X: 1, Y: 1, Z: 3}, tc.off)
		a1 := mustAnalyze(t, mustContacts(t, m))
		if a1.Rank != 6 || a1.NearSingular || math.Abs(a1.Condition-a0.Condition) > tc.tol*a0.Condition {
			t.Errorf("%s: rank %d, near-singular %v, condition %g; want 6, false, %g", tc.name, a1.Rank, a1.NearSingular, a1.Condition, a0.Condition)
		}
		if r := a1.Length / (tc.scale * a0.Length); math.Abs(r-1) > tc.tol {
			t.Errorf("%s: length %g, want %g", tc.name, a1.Length, tc.scale*a0.Length)
		}
		s1, err := a1.Stability()
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		for i := range s0.Contacts {
			if d := math.Abs(s1.Contacts[i].Index - s0.Contacts[i].Index); d > tc.tol {
				t.Errorf("%s: %s index changed by %g", tc.name, s0.Contacts[i].Label, d)
			}
		}
	}
}
