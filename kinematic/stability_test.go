package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/screw"
)

// TestBisectorClosedForm: with the balls in a plane normal to Up and the
// grooves on the bisectors of the ball triangle, every contact's centre
// index is |sin 2θ| (θ the half-angle), 1 for 90° vees.
//
// Derivation (by hand): removing contact A+ leaves the twists that move
// ball B's centre along g_B and C's along g_C (their normals pass through
// the centres and span the planes normal to the grooves): the rotation
// about the vertical line where the normal planes of B and C meet, and the
// tilt about the line BC. Those normal planes hold the external bisectors
// at B and C, which meet at the excentre opposite A, a point on A's
// internal bisector (Coxeter & Greitzer, Geometry Revisited, 1967, §1.4,
// from memory). So neither twist moves A's centre along g_A: its velocity
// v lies in A's normal plane and, with A− still in place, normal to n_A−.
// Then |n_A+·v|/|v| = |sin∠(n_A+, n_A−)| = |sin 2θ|, since
// n_A+·n_A− = sin²θ − cos²θ = −cos 2θ.
func TestBisectorClosedForm(t *testing.T) {
	bs := isosceles()
	for _, deg := range []float64{30, 45, 60, 75} {
		v := vee45
		v.HalfAngle = deg * math.Pi / 180
		c, err := BisectorVees(bs, three(v))
		if err != nil {
			t.Fatal(err)
		}
		want := math.Abs(math.Sin(2 * v.HalfAngle))
		for _, m := range mustStability(t, c).Contacts {
			if math.Abs(m.CentreIndex-want) > 1e-12 {
				t.Errorf("θ = %g°, %s: centre index %.15f, want |sin 2θ| = %.15f", deg, m.Label, m.CentreIndex, want)
			}
		}
		g, err := c.Geometry()
		if err != nil {
			t.Fatal(err)
		}
		// The bisectors meet at the incentre: for (−60, 0), (60, 0),
		// (0, 30) mm with sides 120, √4500, √4500 mm it is
		// (0, 30·120/(120 + 2√4500)) mm (vertices weighted by the opposite
		// sides; closed form).
		in := r3.Vec{Y: 30e-3 * 120 / (120 + 2*math.Sqrt(4500))}
		if !near(g.Incentre, in, 1e-17) || !near(g.Centre, in, 1e-16) || g.Spread > 1e-16 {
			t.Errorf("incentre %v, centre %v, spread %g; want %v", g.Incentre, g.Centre, g.Spread, in)
		}
		for _, gr := range g.Grooves {
			if gr.OffBisector > 1e-12 {
				t.Errorf("groove %d off the bisector by %g rad", gr.Pair, gr.OffBisector)
			}
		}
	}
}

// TestCentroidAimedWeaker: in a triangle that is not equilateral, grooves
// aimed at the centroid are less stable than grooves on the bisectors (the
// classical bisector rule for three-groove couplings, from memory; checked
// by computation, both index measures).
func TestCentroidAimedWeaker(t *testing.T) {
	bs := isosceles()
	bis, err := BisectorVees(bs, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cen, err := AimedVees(bs, r3.Vec{Y: 10e-3}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	sb, sc := mustStability(t, bis), mustStability(t, cen)
	if wb, wc := sb.Contacts[sb.Weakest].Index, sc.Contacts[sc.Weakest].Index; !(wc < wb) {
		t.Errorf("weakest index: centroid-aimed %g, bisectors %g; want centroid-aimed lower", wc, wb)
	}
	minCentre := func(st Stability) float64 {
		m := math.Inf(1)
		for _, c := range st.Contacts {
			m = math.Min(m, c.CentreIndex)
		}
		return m
	}
	if wb, wc := minCentre(sb), minCentre(sc); !(wc < wb) {
		t.Errorf("weakest centre index: centroid-aimed %g, bisectors %g; want centroid-aimed lower", wc, wb)
	}
	// The centroid-aimed grooves meet at the centroid, not the incentre.
	g, _ := cen.Geometry()
	if !near(g.Centre, r3.Vec{Y: 10e-3}, 1e-16) || g.Grooves[0].OffBisector < 0.01 {
		t.Errorf("centre %v, A off its bisector by %g rad", g.Centre, g.Grooves[0].OffBisector)
	}
}

// TestFreedOpensOwnContact: six unilateral contacts cannot hold a body by
// themselves: at least seven are needed for first-order form closure in
// space (Lynch & Park, Modern Robotics, 2017, §12.1; Murray, Li & Sastry,
// A Mathematical Introduction to Robotic Manipulation, 1994, ch. 5). Each
// freed twist shows it: it opens its own contact at unit speed and leaves
// the other five closed (power δᵢⱼ), so every contact can lift off.
func TestFreedOpensOwnContact(t *testing.T) {
	for _, c := range []Coupling{threeVees(t, 0.3), mustSVF(t)} {
		cs := mustContacts(t, c)
		st := mustStability(t, c)
		for i, m := range st.Contacts {
			for j, ct := range cs {
				w, _ := screw.Line(ct.Point, ct.Normal)
				want := 0.0
				if i == j {
					want = 1
				}
				if p := screw.Power(m.Freed, w); math.Abs(p-want) > 1e-12 {
					t.Errorf("freed %s with contact %s: power %g, want %g", m.Label, ct.Label, p, want)
				}
			}
		}
	}
}

// excentreLayout returns the balls in 90° vees with A's groove on its
// internal bisector (towards the incentre) and B's and C's on their
// external bisectors (normal to the internal ones, in the ball plane): the
// three groove axes meet at the excentre opposite A.
func excentreLayout(t *testing.T, bs [3]Ball, half float64) Coupling {
	t.Helper()
	in := incentre(bs[0].Centre, bs[1].Centre, bs[2].Centre)
	var c Coupling
	for i, b := range bs {
		d := r3.Sub(in, b.Centre)
		if i > 0 {
			d = r3.Cross(up, d)
		}
		v := vee45
		v.HalfAngle = half
		v.Direction = d
		c.Pairs = append(c.Pairs, Pair{Ball: b, Seat: v})
	}
	return c
}

// TestExcentreClosedForm: grooves on one internal and two external
// bisectors (axes meeting at an excentre) also give every contact the
// centre index |sin 2θ|. The derivation of TestBisectorClosedForm carries
// over: removing a contact of ball X leaves the rotation about the vertical
// line where the other two balls' normal planes meet, and that point (the
// incentre or an excentre: each lies on one internal and two external
// bisectors, Coxeter & Greitzer 1967, §1.4, from memory) is on X's groove
// axis.
func TestExcentreClosedForm(t *testing.T) {
	bs := [3]Ball{ball(0, 30, 0), ball(-60, 0, 0), ball(60, 0, 0)} // A at the apex
	for _, deg := range []float64{35, 45, 55} {
		half := deg * math.Pi / 180
		c := excentreLayout(t, bs, half)
		want := math.Abs(math.Sin(2 * half))
		for _, m := range mustStability(t, c).Contacts {
			if math.Abs(m.CentreIndex-want) > 1e-12 {
				t.Errorf("θ = %g°, %s: centre index %.15f, want %.15f", deg, m.Label, m.CentreIndex, want)
			}
		}
		// Excentre opposite the apex A = (0, 30): sides a = 120 (BC),
		// b = c = √4500; E = (−aA + bB + cC)/(−a + b + c), whose y is
		// −120·30/(2√4500 − 120) mm (closed form).
		g, err := c.Geometry()
		if err != nil {
			t.Fatal(err)
		}
		ey := -120 * 30e-3 / (2*math.Sqrt(4500) - 120)
		if !near(g.Centre, r3.Vec{Y: ey}, 1e-15) || g.Spread > 1e-15 {
			t.Errorf("grooves meet at %v (spread %g), want (0, %g)", g.Centre, g.Spread, ey)
		}
	}
}

// TestMaxwellDefinitions checks each reported quantity against its
// definition (the and Maxwell's, restated in the Maxwell doc):
// n·v = +1 at the contact point, Index = |n·v|/|v|, CentreIndex the same
// with the ball centre's velocity, which shares n·v_c = 1 because the
// centre lies on the normal line through the contact point.
func TestMaxwellDefinitions(t *testing.T) {
	for _, c := range []Coupling{threeVees(t, 0.5), mustSVF(t)} {
		cs := mustContacts(t, c)
		st := mustStability(t, c)
		for i, m := range st.Contacts {
			n := cs[i].Normal
			v, vc := m.Freed.At(cs[i].Point), m.Freed.At(cs[i].Centre)
			if math.Abs(r3.Dot(n, v)-1) > 1e-12 || math.Abs(r3.Dot(n, vc)-1) > 1e-12 {
				t.Errorf("%s: n·v = %g, n·v_c = %g; want 1", m.Label, r3.Dot(n, v), r3.Dot(n, vc))
			}
			if want := 1 / r3.Norm(v); math.Abs(m.Index-want) > 1e-12 {
				t.Errorf("%s: index %g, want %g", m.Label, m.Index, want)
			}
			if want := 1 / r3.Norm(vc); math.Abs(m.CentreIndex-want) > 1e-12 {
				t.Errorf("%s: centre index %g, want %g", m.Label, m.CentreIndex, want)
			}
			if m.Label != cs[i].Label {
				t.Errorf("label %q, want %q", m.Label, cs[i].Label)
			}
		}
	}
}
