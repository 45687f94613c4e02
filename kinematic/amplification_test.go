package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestAmplificationAgainstEquilibrium: an exactly constrained coupling takes a
// small gap error without any change of force — six contact forces are
// fixed by statics alone — and moves by x with Power(x, lⱼ) = eⱼ at every
// contact (first-order kinematics: contact j's gap closes by the normal
// velocity of its point, n·x(pⱼ)). The nonlinear elastic equilibrium (an
// independent computation) with the seat of contact i set 0.1 µm high must
// therefore move the point of interest by 0.1 µm·Tᵢ(p) relative to the
// perfect seat, and leave the forces unchanged, to second order.
func TestAmplificationAgainstEquilibrium(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	st := mustStability(t, c)
	p := r3.Vec{X: 0.01, Y: 0.005, Z: 0.07}
	pe, err := st.Amplification(p)
	if err != nil {
		t.Fatal(err)
	}
	m, err := NewModel(cs, []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{PreloadFactor: 1}
	e0, err := m.Equilibrium(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	const e = 1e-7
	for i, ce := range pe.Contacts {
		e1, err := m.Equilibrium(lc, &EquilibriumOptions{Gaps: map[string]float64{cs[i].Label: -e}})
		if err != nil {
			t.Fatal(err)
		}
		got := r3.Scale(1/e, r3.Sub(e1.Displacement.At(p), e0.Displacement.At(p)))
		if d := r3.Norm(r3.Sub(got, ce.Displacement)); d > 1e-6*r3.Norm(ce.Displacement)+1e-9 {
			t.Errorf("%s: equilibrium moves p by %v per m, Amplification says %v", ce.Name, got, ce.Displacement)
		}
		for j := range e1.Contacts {
			if f0, f1 := e0.Contacts[j].Force, e1.Contacts[j].Force; math.Abs(f1-f0) > 1e-6*f0 {
				t.Errorf("gap at %s changes %s's force from %g to %g N", ce.Name, e1.Contacts[j].Label, f0, f1)
			}
		}
	}
	// Bounds on the worst case: max|Σ±vᵢ| ≥ √Σ|vᵢ|² (the mean of |Σ±vᵢ|²
	// over all sign patterns is Σ|vᵢ|², and the maximum is at least the
	// mean) and ≤ Σ|vᵢ| (triangle inequality).
	var sum float64
	for _, ce := range pe.Contacts {
		sum += r3.Norm(ce.Displacement)
	}
	if pe.Worst < pe.RSS*(1-1e-12) || pe.Worst > sum*(1+1e-12) {
		t.Errorf("worst %g outside [RSS %g, Σ|vᵢ| %g]", pe.Worst, pe.RSS, sum)
	}
	w, rss, wa, ra, err := pe.Along(r3.Vec{Z: 1})
	if err != nil {
		t.Fatal(err)
	}
	if w < rss || wa < ra*(1-1e-12) || math.Abs(rss*rss+ra*ra-pe.RSS*pe.RSS) > 1e-12*pe.RSS*pe.RSS {
		t.Errorf("along z: worst %g, rss %g; across: %g, %g; total RSS %g", w, rss, wa, ra, pe.RSS)
	}
}

// TestAmplificationEquilateral: for the equilateral coupling with radial 90°
// vees, a uniform gap error on all six contacts (every seat high by e)
// lifts the body straight up by e/sin θ without tilt (each ball centre
// rises by e/sin θ in its vee: the normals lean θ from the horizontal),
// and by the threefold symmetry a point on the axis moves as far for a gap
// error at A+ as at B+ (and A− as B−).
func TestAmplificationEquilateral(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	st := mustStability(t, c)
	p := r3.Vec{Z: 0.03}
	pe, err := st.Amplification(p)
	if err != nil {
		t.Fatal(err)
	}
	var sum r3.Vec
	var tilt r3.Vec
	for _, ce := range pe.Contacts {
		sum = r3.Add(sum, ce.Displacement)
		tilt = r3.Add(tilt, ce.Tilt)
	}
	want := 1 / math.Sin(math.Pi/4)
	if !near(sum, r3.Vec{Z: want}, 1e-12) || r3.Norm(tilt) > 1e-10 {
		t.Errorf("uniform gap error moves the axis point by %v and tilts by %v; want (0, 0, %g) and 0", sum, tilt, want)
	}
	for i := 0; i < 2; i++ {
		a, b := r3.Norm(pe.Contacts[i].Displacement), r3.Norm(pe.Contacts[i+2].Displacement)
		if math.Abs(a-b) > 1e-12*a {
			t.Errorf("contacts %d and %d: |Tᵢ(p)| %g and %g; want equal by symmetry", i, i+2, a, b)
		}
	}
}

// TestAlongNeedsADirection: a figure along a zero or non-finite direction
// does not exist; Along says so instead of returning zeros that read as a
// perfect result.
func TestAlongNeedsADirection(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	st := mustStability(t, c)
	pe, err := st.Amplification(r3.Vec{Z: 0.03})
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		u    r3.Vec
		want error
	}{{r3.Vec{}, ErrDegenerate}, {r3.Vec{Z: math.NaN()}, ErrNonFinite}} {
		var ie *InputError
		if _, _, _, _, err := pe.Along(tc.u); !errors.As(err, &ie) || ie.Field != "u" || !errors.Is(err, tc.want) {
			t.Errorf("Amplification.Along(%v): %v", tc.u, err)
		}
		if _, _, err := (Budget{}).Along(tc.u); !errors.As(err, &ie) || ie.Field != "u" || !errors.Is(err, tc.want) {
			t.Errorf("Budget.Along(%v): %v", tc.u, err)
		}
		if _, err := (Compliance{}).Along(tc.u); !errors.As(err, &ie) || ie.Field != "u" || !errors.Is(err, tc.want) {
			t.Errorf("Compliance.Along(%v): %v", tc.u, err)
		}
	}
}
