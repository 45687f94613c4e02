package kinematic

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// inclineBlock returns a block on an incline of slope β: three contacts
// on the plane (normal (sin β, 0, cos β), so the downhill direction is
// d = (cos β, 0, −sin β)), a stop at the downhill end (normal −d), and two
// contacts against a side wall (normal +y) at different points along the
// slope. The payload of mass m sits at the block's centre; a side force q
// along −y presses the block against the wall.
func inclineBlock(t *testing.T, beta, mass, q float64) *Model {
	t.Helper()
	s, c := math.Sincos(beta)
	n := r3.Vec{X: s, Z: c}
	d := r3.Vec{X: c, Z: -s}
	y := r3.Vec{Y: 1}
	at := func(u, v, w float64) r3.Vec { // u along d, v along y, w along n
		return r3.Add(r3.Add(r3.Scale(u, d), r3.Scale(v, y)), r3.Scale(w, n))
	}
	cs := []Contact{
		{Label: "plane1", Point: at(-0.03, -0.02, 0), Normal: n},
		{Label: "plane2", Point: at(0.03, -0.02, 0), Normal: n},
		{Label: "plane3", Point: at(0, 0.03, 0), Normal: n},
		{Label: "stop", Point: at(0.04, 0, 0.01), Normal: r3.Scale(-1, d)},
		{Label: "wall1", Point: at(-0.02, -0.03, 0.01), Normal: y},
		{Label: "wall2", Point: at(0.02, -0.03, 0.01), Normal: y},
	}
	var pre []Preload
	if q > 0 {
		pre = []Preload{{Name: "side", Point: at(0, 0, 0.01), Direction: r3.Vec{Y: -1}, Force: q}}
	}
	m, err := NewModel(cs, pre, Payload{Mass: mass, Centre: at(0, 0, 0.01)})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestSeatingIncline: with the stop open the block slides down the incline
// on the plane and along the wall. Gravity drives it with mg sin β; the
// plane's friction resists with μ mg cos β and the wall's with μq (the
// contacts slide at unit speed along d): ρ = mg sin β − μ(mg cos β + q),
// which closes the stop while μ < mg sin β/(mg cos β + q) — with q = 0 the
// textbook condition μ < tan β for a block on an incline.
func TestSeatingIncline(t *testing.T) {
	const mass = 2.0
	g := StandardGravity
	for _, tc := range []struct {
		beta, q float64
	}{
		{20 * math.Pi / 180, 0},
		{35 * math.Pi / 180, 0},
		{35 * math.Pi / 180, 4},
	} {
		m := inclineBlock(t, tc.beta, mass, tc.q)
		lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -g}}
		s, c := math.Sincos(tc.beta)
		limit := mass * g * s / (mass*g*c + tc.q)
		for _, mu := range []float64{0, 0.5 * limit, 0.9 * limit, 1.1 * limit} {
			st, err := m.Homing(lc, mu)
			if err != nil {
				t.Fatal(err)
			}
			stop := st.Contacts[3]
			want := mass*g*s - mu*(mass*g*c+tc.q)
			if math.Abs(stop.Drive-want) > 1e-9*mass*g {
				t.Errorf("β = %.0f°, q = %g, μ = %.3f: drive %.12g N, want mg sin β − μ(mg cos β + q) = %.12g", tc.beta*180/math.Pi, tc.q, mu, stop.Drive, want)
			}
			if math.Abs(stop.Limit-limit) > 1e-9*limit {
				t.Errorf("β = %.0f°, q = %g: limit μ %.12g, want %.12g", tc.beta*180/math.Pi, tc.q, stop.Limit, limit)
			}
			if mu == 0 && math.Abs(stop.Margin-1) > 1e-12 {
				t.Errorf("frictionless margin %g, want 1", stop.Margin)
			}
		}
	}
}

// TestSeatingCoupling: a preloaded three-vee coupling seats without
// friction (every contact carries load) and not beyond its limit; the
// limit of a vee flank lies between 0 and tan of its slope, where a single
// ball on a single flank would stop (the other contacts' friction only
// adds resistance).
func TestSeatingCoupling(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{PreloadFactor: 1}
	st, err := m.Homing(lc, 0)
	if err != nil {
		t.Fatal(err)
	}
	if !st.Home || !(st.MaxMu > 0) || st.MaxMu > 1 {
		t.Errorf("frictionless: seats %v, max μ %g; want true and a limit in (0, tan 45° = 1]", st.Home, st.MaxMu)
	}
	above, err := m.Homing(lc, st.MaxMu*1.01)
	if err != nil {
		t.Fatal(err)
	}
	below, err := m.Homing(lc, st.MaxMu*0.99)
	if err != nil {
		t.Fatal(err)
	}
	if above.Home || !below.Home {
		t.Errorf("at 1.01·max μ seats %v, at 0.99·max μ %v", above.Home, below.Home)
	}
	if _, err := m.Homing(lc, -0.1); !errors.Is(err, ErrRange) {
		t.Errorf("negative μ: %v", err)
	}
	if _, err := m.Homing(lc, math.NaN()); !errors.Is(err, ErrNonFinite) {
		t.Errorf("NaN μ: %v", err)
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
	lc := LoadCase{PreloadFactor: 1}
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
		t1 := linalg.AnyNormal(c.Normal)
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

// TestMuPercentage: every kinematic entry that takes a coefficient of
// friction refuses μ = 15 (meant as 15%, μ = 0.15) naming "mu", with the
// design file's wording, and accepts μ = 3, the bound; a negative or NaN
// μ is refused in one wording by all.
func TestMuPercentage(t *testing.T) {
	m, cs := equilateralModel(t, math.Pi/4, 60, 0, 0)
	lc := LoadCase{Name: "preload"}
	p := r3.Vec{Z: 0.03}
	steps := pushCycle(0.01, r3.Vec{X: 1}, r3.Vec{Z: 0.01}, 4)
	for _, tc := range []struct {
		name string
		call func(mu float64) error
	}{
		{"Repeatability", func(mu float64) error { _, err := m.Repeatability(lc, mu, p); return err }},
		{"Homing", func(mu float64) error { _, err := m.Homing(lc, mu); return err }},
		{"ForceClosure", func(mu float64) error { _, err := ForceClosure(cs, mu, nil); return err }},
		{"Hysteresis", func(mu float64) error { _, err := m.Hysteresis(lc, steps, mu, p); return err }},
	} {
		// One wording for a negative μ, each entry keeping its bound:
		// ≥ 0 where μ = 0 has an answer (Homing, ForceClosure), > 0
		// where it has none (Repeatability, Hysteresis).
		zeroOK := tc.name == "Homing" || tc.name == "ForceClosure"
		want := "out of range: a coefficient of friction must be > 0, got -0.1"
		if zeroOK {
			want = "out of range: a coefficient of friction must be ≥ 0, got -0.1"
		}
		if err := tc.call(-0.1); !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), "mu: "+want) {
			t.Errorf("%s(μ = -0.1): %v; want %q", tc.name, err, want)
		}
		if err := tc.call(0); (err == nil) != zeroOK {
			t.Errorf("%s(μ = 0): %v; want accepted %v", tc.name, err, zeroOK)
		}
		if err := tc.call(math.NaN()); !errors.Is(err, ErrNonFinite) || !strings.Contains(err.Error(), "a coefficient of friction must be finite") {
			t.Errorf("%s(μ = NaN): %v; want mu refused as not finite", tc.name, err)
		}
		err := tc.call(15)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != "mu" || !errors.Is(err, ErrRange) ||
			!strings.Contains(err.Error(), "a coefficient of friction of 15: a percentage? (15% is 0.15); at most 3") {
			t.Errorf("%s(μ = 15): %v; want mu refused as a percentage", tc.name, err)
		}
		if err := tc.call(3); err != nil {
			t.Errorf("%s(μ = 3): %v; want accepted", tc.name, err)
		}
	}
}
