package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"
)

// TestErrorAtAgainstEquilibrium: an exactly constrained coupling takes a
// small gap error without any change of force — six contact forces are
// fixed by statics alone — and moves by x with Power(x, lⱼ) = eⱼ at every
// contact (first-order kinematics: contact j's gap closes by the normal
// velocity of its point, n·x(pⱼ)). The nonlinear elastic equilibrium (an
// independent computation) with the seat of contact i set 0.1 µm high must
// therefore move the point of interest by 0.1 µm·Tᵢ(p) relative to the
// perfect seat, and leave the forces unchanged, to second order.
func TestErrorAtAgainstEquilibrium(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	st := mustStability(t, c)
	p := r3.Vec{X: 0.01, Y: 0.005, Z: 0.07}
	pe, err := st.ErrorAt(p)
	if err != nil {
		t.Fatal(err)
	}
	m, err := NewModel(cs, []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{Preload: 1}
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
			t.Errorf("%s: equilibrium moves p by %v per m, ErrorAt says %v", ce.Label, got, ce.Displacement)
		}
		for j := range e1.Contacts {
			if f0, f1 := e0.Contacts[j].Force, e1.Contacts[j].Force; math.Abs(f1-f0) > 1e-6*f0 {
				t.Errorf("gap at %s changes %s's force from %g to %g N", ce.Label, e1.Contacts[j].Label, f0, f1)
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
	w, rss, wa, ra := pe.Along(r3.Vec{Z: 1})
	if w < rss || wa < ra*(1-1e-12) || math.Abs(rss*rss+ra*ra-pe.RSS*pe.RSS) > 1e-12*pe.RSS*pe.RSS {
		t.Errorf("along z: worst %g, rss %g; across: %g, %g; total RSS %g", w, rss, wa, ra, pe.RSS)
	}
}

// TestErrorAtEquilateral: for the equilateral coupling with radial 90°
// vees, a uniform gap error on all six contacts (every seat high by e)
// lifts the body straight up by e/sin θ without tilt (each ball centre
// rises by e/sin θ in its vee: the normals lean θ from the horizontal),
// and by the threefold symmetry a point on the axis moves as far for a gap
// error at A+ as at B+ (and A− as B−).
func TestErrorAtEquilateral(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	st := mustStability(t, c)
	p := r3.Vec{Z: 0.03}
	pe, err := st.ErrorAt(p)
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

// TestRepeatability checks the friction estimate against a brute-force
// search: for each contact, the friction force μN in 3600 directions of
// its tangent plane, applied at the contact, solved against the stiffness
// matrix with gonum's LU (an independent route from Compliance and the
// closed-form largest singular value), gives the largest displacement of
// the point; and the estimate is linear in μ.
func TestRepeatability(t *testing.T) {
	m, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{Preload: 1}
	p := r3.Vec{X: 0.01, Z: 0.04}
	r, err := m.Repeatability(lc, 0.15, p)
	if err != nil {
		t.Fatal(err)
	}
	st, err := m.Stiffness(lc, &StiffnessOptions{Tangential: true})
	if err != nil {
		t.Fatal(err)
	}
	K := st.Matrix(p)
	km := mat.NewDense(6, 6, nil)
	for i := range 6 {
		for j := range 6 {
			km.Set(i, j, K[i][j])
		}
	}
	var lu mat.LU
	lu.Factorize(km)
	for i, c := range cs {
		q := 0.15 * st.Forces[i]
		t1 := anyNormal(c.Normal)
		t2 := r3.Cross(c.Normal, t1)
		var best float64
		for k := 0; k < 3600; k++ {
			s, co := math.Sincos(2 * math.Pi * float64(k) / 3600)
			f := r3.Scale(q, r3.Add(r3.Scale(co, t1), r3.Scale(s, t2)))
			mo := r3.Cross(r3.Sub(c.Point, p), f)
			b := mat.NewVecDense(6, []float64{f.X, f.Y, f.Z, mo.X, mo.Y, mo.Z})
			var x mat.VecDense
			if err := lu.SolveVecTo(&x, false, b); err != nil {
				t.Fatal(err)
			}
			best = math.Max(best, math.Sqrt(x.AtVec(0)*x.AtVec(0)+x.AtVec(1)*x.AtVec(1)+x.AtVec(2)*x.AtVec(2)))
		}
		// The grid misses the optimum by at most a relative (π/3600)²/2.
		if got := r.Contacts[i].Displacement; got < best*(1-1e-9) || got > best*(1+1e-6) {
			t.Errorf("%s: %g m, brute force %g m", c.Label, got, best)
		}
	}
	r2, err := m.Repeatability(lc, 0.3, p)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r2.RSS-2*r.RSS) > 1e-12*r.RSS || math.Abs(r2.Worst-2*r.Worst) > 1e-12*r.Worst {
		t.Errorf("μ ×2: RSS %g → %g, worst %g → %g", r.RSS, r2.RSS, r.Worst, r2.Worst)
	}
	if _, err := m.Repeatability(lc, 0, p); err == nil {
		t.Error("μ = 0 accepted")
	}
}
