package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/screw"
)

// hertzBallFlatStiffness returns dF/dδ = 2E*a of a ball of radius r on a
// flat at force f (Johnson 1985, eq. 4.22–4.23: a³ = 3fr/(4E*), δ = a²/r,
// so F ∝ δ^(3/2) and dF/dδ = 3F/(2δ) = 2E*a).
func hertzBallFlatStiffness(r, f float64, m1, m2 hertz.Material) float64 {
	es := 1 / ((1-m1.Nu*m1.Nu)/m1.E + (1-m2.Nu*m2.Nu)/m2.E)
	a := math.Cbrt(3 * f * r / (4 * es))
	return 2 * es * a
}

// TestStiffnessEquilateral: each flank is a spring of the Hertz stiffness
// kᵢ = 2E*a at its force P/(6 sin θ), along its normal, which leans θ from
// the horizontal; springs in parallel give a vertical stiffness
// Σ kᵢ (nᵢ·z)² = 6 k sin²θ, and, with the payload centred on the axis, a
// vertical mode of its own (the coupling's threefold symmetry separates
// the vertical translation from the other motions) at f = √(6 k sin²θ/m)/2π.
func TestStiffnessEquilateral(t *testing.T) {
	th := math.Pi / 4
	const P, mass = 60.0, 0.8
	m, _ := equilateralModel(t, th, P, mass, 0)
	st, err := m.Stiffness(LoadCase{PreloadFactor: 1}, nil)
	if err != nil {
		t.Fatal(err)
	}
	k := hertzBallFlatStiffness(5e-3, P/(6*math.Sin(th)), hertz.Steel52100, hertz.Steel440C)
	kz := 6 * k * math.Sin(th) * math.Sin(th)
	K := st.Matrix(r3.Vec{})
	if math.Abs(K[2][2]-kz) > 1e-12*kz {
		t.Errorf("vertical stiffness %.12g N/m, want 6 k sin²θ = %.12g", K[2][2], kz)
	}
	for i, kn := range st.Normal {
		if math.Abs(kn-k) > 1e-12*k {
			t.Errorf("contact %d normal stiffness %g, want 2E*a = %g", i, kn, k)
		}
	}
	c, err := st.Compliance(r3.Vec{})
	if err != nil {
		t.Fatal(err)
	}
	if got, err := c.Along(r3.Vec{Z: 1}); err != nil || math.Abs(got-1/kz) > 1e-10/kz {
		t.Errorf("vertical compliance %g m/N, want 1/kz = %g", got, 1/kz)
	}
	modes, err := st.Modes()
	if err != nil {
		t.Fatal(err)
	}
	want := math.Sqrt(kz/mass) / (2 * math.Pi)
	found := false
	for _, md := range modes {
		if math.Abs(md.Frequency-want) < 1e-9*want {
			found = true
			if math.Abs(math.Abs(md.Shape.V.Z)-1) > 1e-9 || r3.Norm(md.Shape.W) > 1e-9 {
				t.Errorf("vertical mode shape %+v, want a pure vertical translation", md.Shape)
			}
		}
	}
	if !found {
		t.Errorf("modes %v Hz; none at √(kz/m)/2π = %g Hz", frequencies(modes), want)
	}
}

func frequencies(ms [6]Mode) []float64 {
	var f []float64
	for _, m := range ms {
		f = append(f, m.Frequency)
	}
	return f
}

// TestStiffnessProperties on a general layout: K is symmetric positive
// definite (checked with gonum's Cholesky), the compliance at any point is
// its inverse shifted there (C·K = I to rounding, with K from Matrix at
// the same point), the frequencies equal the square roots of the
// eigenvalues of M⁻¹K computed by gonum's general eigensolver (mat.Eigen,
// an independent route), and they scale as √(k/m): four times the mass
// halves every frequency.
func TestStiffnessProperties(t *testing.T) {
	c, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs := mustContacts(t, c)
	pay := Payload{Mass: 1.2, Centre: r3.Vec{X: 0.01, Y: 0.01, Z: 0.04}, Inertia: [3][3]float64{{4e-3, 2e-4, 0}, {2e-4, 5e-3, -1e-4}, {0, -1e-4, 6e-3}}}
	pre := []Preload{{Point: r3.Vec{Z: 0.03}, Direction: r3.Vec{Z: -1}, Force: 80}}
	m, err := NewModel(cs, pre, pay)
	if err != nil {
		t.Fatal(err)
	}
	lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	q := r3.Vec{X: 0.02, Y: -0.01, Z: 0.07}
	K := st.Matrix(q)
	sym := mat.NewSymDense(6, nil)
	for i := range 6 {
		for j := range 6 {
			if math.Abs(K[i][j]-K[j][i]) > 1e-9*math.Abs(K[i][i]) {
				t.Errorf("K not symmetric at %d,%d", i, j)
			}
			if j >= i {
				sym.SetSym(i, j, K[i][j])
			}
		}
	}
	var ch mat.Cholesky
	if !ch.Factorize(sym) {
		t.Error("K is not positive definite")
	}
	comp, err := st.Compliance(q)
	if err != nil {
		t.Fatal(err)
	}
	var prod mat.Dense
	prod.Mul(mat.NewDense(6, 6, flat6(comp.Matrix)), mat.NewDense(6, 6, flat6(K)))
	for i := range 6 {
		for j := range 6 {
			want := 0.0
			if i == j {
				want = 1
			}
			if math.Abs(prod.At(i, j)-want) > 1e-8 {
				t.Errorf("C·K[%d][%d] = %g, want %g", i, j, prod.At(i, j), want)
			}
		}
	}

	// Mass matrix about q for (V at q, W): from the kinetic energy
	// ½m|V + W × (c − q)|² + ½WᵀJW, written out here independently of
	// Modes (which works about the contacts' centroid).
	r := r3.Sub(pay.Centre, q)
	rx := [3][3]float64{{0, -r.Z, r.Y}, {r.Z, 0, -r.X}, {-r.Y, r.X, 0}}
	M := mat.NewDense(6, 6, nil)
	for a := range 3 {
		M.Set(a, a, pay.Mass)
		for b := range 3 {
			M.Set(a, 3+b, -pay.Mass*rx[a][b])
			M.Set(3+b, a, -pay.Mass*rx[a][b])
			var s float64
			for k := range 3 {
				s += rx[a][k] * rx[k][b]
			}
			M.Set(3+a, 3+b, pay.Inertia[a][b]-pay.Mass*s)
		}
	}
	var minv, mk mat.Dense
	if err := minv.Inverse(M); err != nil {
		t.Fatal(err)
	}
	mk.Mul(&minv, mat.NewDense(6, 6, flat6(K)))
	var eig mat.Eigen
	if !eig.Factorize(&mk, mat.EigenNone) {
		t.Fatal("gonum Eigen failed")
	}
	var want []float64
	for _, v := range eig.Values(nil) {
		want = append(want, math.Sqrt(real(v))/(2*math.Pi))
	}
	sortFloats(want)
	modes, err := st.Modes()
	if err != nil {
		t.Fatal(err)
	}
	for i, md := range modes {
		if math.Abs(md.Frequency-want[i]) > 1e-8*want[i] {
			t.Errorf("mode %d: %.10g Hz, gonum %.10g Hz", i, md.Frequency, want[i])
		}
	}
	heavy := pay
	heavy.Mass *= 4
	heavy.Inertia = [3][3]float64{}
	for a := range 3 {
		for b := range 3 {
			heavy.Inertia[a][b] = 4 * pay.Inertia[a][b]
		}
	}
	// Gravity scaled down by 4 keeps the contact forces, hence k.
	mh, err := NewModel(cs, pre, heavy)
	if err != nil {
		t.Fatal(err)
	}
	lh := lc
	lh.Gravity = r3.Scale(0.25, lc.Gravity)
	sh, err := mh.Stiffness(lh, nil)
	if err != nil {
		t.Fatal(err)
	}
	mdh, err := sh.Modes()
	if err != nil {
		t.Fatal(err)
	}
	for i := range mdh {
		if math.Abs(mdh[i].Frequency-modes[i].Frequency/2) > 1e-10*modes[i].Frequency {
			t.Errorf("mode %d: ×4 mass gives %g Hz, want half of %g", i, mdh[i].Frequency, modes[i].Frequency)
		}
	}
}

func flat6(a [6][6]float64) []float64 {
	out := make([]float64, 36)
	for i := range 6 {
		copy(out[6*i:6*i+6], a[i][:])
	}
	return out
}

func sortFloats(x []float64) {
	for i := 1; i < len(x); i++ {
		for j := i; j > 0 && x[j] < x[j-1]; j-- {
			x[j], x[j-1] = x[j-1], x[j]
		}
	}
}

// TestStiffnessAgainstEquilibrium: the stiffness predicts the
// displacement that a small extra load causes; the nonlinear equilibrium
// (a different computation) gives it directly. A 0.05 N push, a thousandth
// of the contact forces, moves the point of interest by C·w to within the
// second-order term of the Hertz law (relative 1e-3).
func TestStiffnessAgainstEquilibrium(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{PreloadFactor: 1}
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	q := r3.Vec{X: 0.01, Z: 0.05}
	comp, err := st.Compliance(q)
	if err != nil {
		t.Fatal(err)
	}
	e0, err := m.Equilibrium(lc, nil)
	if err != nil {
		t.Fatal(err)
	}
	push := r3.Vec{X: 0.03, Y: -0.02, Z: -0.03}
	w, _ := screw.Line(q, push)
	lc1 := lc
	lc1.Applied = []screw.Wrench{w.Scale(r3.Norm(push))}
	e1, err := m.Equilibrium(lc1, nil)
	if err != nil {
		t.Fatal(err)
	}
	got := r3.Sub(e1.Displacement.At(q), e0.Displacement.At(q))
	f := [6]float64{push.X, push.Y, push.Z}
	var want r3.Vec
	for a := range 3 {
		var v float64
		for b := range 6 {
			v += comp.Matrix[a][b] * f[b]
		}
		switch a {
		case 0:
			want.X = v
		case 1:
			want.Y = v
		case 2:
			want.Z = v
		}
	}
	if d := r3.Norm(r3.Sub(got, want)); d > 2e-3*r3.Norm(want) {
		t.Errorf("displacement of q: equilibrium %v, compliance %v (differ by %g)", got, want, d)
	}
}

// TestLoadsScaleInvariance: the same design in cm and N (lengths ×100,
// moduli and allowables in N/cm² ×1e-4, mass in units of 100 kg ×1e-2,
// inertia in 100 kg·cm² ×1e2) has the same forces, shock level in cm/s²
// ×100, stiffness in N/cm ×1e-2, and the same natural frequencies: the
// equations are the same in any coherent set of units. Centimetres, not
// millimetres: a modulus in N/mm² (MPa) can fall below the 1e4 that
// hertz accepts, refused as a modulus in MPa written as Pa.
func TestLoadsScaleInvariance(t *testing.T) {
	si, siCs := equilateralModel(t, math.Pi/4, 60, 0.8, 0.03)
	cm := make([]Contact, len(siCs))
	for i, c := range siCs {
		c.Point, c.Centre, c.Radius = r3.Scale(100, c.Point), r3.Scale(100, c.Centre), c.Radius*100
		for _, b := range []*hertz.Body{&c.Moving, &c.Base} {
			b.R1, b.R2 = b.R1*100, b.R2*100
			b.Material.E *= 1e-4
			b.Material.Allowable *= 1e-4
		}
		cm[i] = c
	}
	pay := si.payload
	pay.Centre = r3.Scale(100, r3.Add(pay.Centre, si.origin))
	pay.Mass *= 1e-2
	for a := range 3 {
		for b := range 3 {
			pay.Inertia[a][b] *= 1e2
		}
	}
	cmModel, err := NewModel(cm, []Preload{{Point: r3.Vec{Z: 2}, Direction: r3.Vec{Z: -1}, Force: 60}}, pay)
	if err != nil {
		t.Fatal(err)
	}
	lcSI := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	lcCM := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity * 100}}
	a, _ := si.Statics(lcSI)
	b, err := cmModel.Statics(lcCM)
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Contacts {
		if d := math.Abs(a.Contacts[i].Force - b.Contacts[i].Force); d > 1e-12*a.Contacts[i].Force {
			t.Errorf("%s: %g N in SI, %g N in cm", a.Contacts[i].Label, a.Contacts[i].Force, b.Contacts[i].Force)
		}
		if d := math.Abs(a.Contacts[i].PressureRatio - b.Contacts[i].PressureRatio); d > 1e-12 {
			t.Errorf("%s: pressure ratio %g, %g", a.Contacts[i].Label, a.Contacts[i].PressureRatio, b.Contacts[i].PressureRatio)
		}
	}
	sa, _ := si.Shock(lcSI, 0)
	sb, _ := cmModel.Shock(lcCM, 0)
	if math.Abs(sb.Unload-100*sa.Unload) > 1e-11*sb.Unload {
		t.Errorf("shock level %g m/s², %g cm/s²", sa.Unload, sb.Unload)
	}
	ka, _ := si.Stiffness(lcSI, nil)
	kb, err := cmModel.Stiffness(lcCM, nil)
	if err != nil {
		t.Fatal(err)
	}
	if k1, k2 := ka.Matrix(r3.Vec{})[2][2], kb.Matrix(r3.Vec{})[2][2]; math.Abs(k2-1e-2*k1) > 1e-11*k2 {
		t.Errorf("vertical stiffness %g N/m, %g N/cm", k1, k2)
	}
	ma, _ := ka.Modes()
	mb, err := kb.Modes()
	if err != nil {
		t.Fatal(err)
	}
	for i := range ma {
		if math.Abs(ma[i].Frequency-mb[i].Frequency) > 1e-9*ma[i].Frequency {
			t.Errorf("mode %d: %g Hz in SI, %g Hz in cm", i, ma[i].Frequency, mb[i].Frequency)
		}
	}
}
