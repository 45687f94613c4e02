package screw

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

func near(a, b r3.Vec, tol float64) bool {
	return r3.Norm(r3.Sub(a, b)) <= tol
}

func TestLine(t *testing.T) {
	// A unit force along n through p is (n̂, p × n̂) (Hunt, Kinematic Geometry
	// of Mechanisms, 1978, §12.3: Plücker coordinates of a line; Murray, Li &
	// Sastry, A Mathematical Introduction to Robotic Manipulation, 1994,
	// §2.5.1). Here p = (1, 2, 3), n = (0, 0, 2): n̂ = (0, 0, 1) and
	// p × n̂ = (2, −1, 0), worked by hand.
	w, err := Line(r3.Vec{X: 1, Y: 2, Z: 3}, r3.Vec{Z: 2})
	if err != nil {
		t.Fatal(err)
	}
	want := Wrench{F: r3.Vec{Z: 1}, M: r3.Vec{X: 2, Y: -1}}
	if w != want {
		t.Errorf("Line = %v, want %v", w, want)
	}
	// The same line through another of its points gives the same wrench.
	w2, err := Line(r3.Vec{X: 1, Y: 2, Z: -7}, r3.Vec{Z: 0.5})
	if err != nil {
		t.Fatal(err)
	}
	if w2 != want {
		t.Errorf("Line through another point = %v, want %v", w2, want)
	}
	// Only the direction of n matters, at any magnitude: the smallest
	// subnormal along z gives the same wrench, and n = (1, 1, 1)·1e308,
	// whose squared norm overflows, gives n̂ = (1, 1, 1)/√3.
	for _, n := range []r3.Vec{{Z: 5e-324}, {Z: 1e308}} {
		w, err := Line(r3.Vec{X: 1, Y: 2, Z: 3}, n)
		if err != nil || w != want {
			t.Errorf("Line with n = %v: %v, %v; want %v", n, w, err, want)
		}
	}
	w, err = Line(r3.Vec{}, r3.Vec{X: 1e308, Y: 1e308, Z: 1e308})
	if s := 1 / math.Sqrt(3); err != nil || math.Abs(w.F.X-s) > 1e-16 || w.F.X != w.F.Y || w.F.Y != w.F.Z {
		t.Errorf("Line with n = 1e308·(1, 1, 1): %v, %v; want F = (1, 1, 1)/√3", w, err)
	}
}

func TestLineErrors(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	for _, tc := range []struct {
		name  string
		p, n  r3.Vec
		field string
		err   error
	}{
		{"zero direction", r3.Vec{X: 1}, r3.Vec{}, "n", ErrDegenerate},
		{"moment overflows, subnormal direction", r3.Vec{X: 1.5e308, Y: -1.5e308}, r3.Vec{X: 5e-324, Y: 5e-324}, "p", ErrRange},
		{"NaN direction", r3.Vec{}, r3.Vec{X: nan}, "n", ErrNonFinite},
		{"Inf point", r3.Vec{Y: inf}, r3.Vec{X: 1}, "p", ErrNonFinite},
		{"moment overflows", r3.Vec{X: 1.5e308, Y: -1.5e308}, r3.Vec{X: 1, Y: 1}, "p", ErrRange},
	} {
		_, err := Line(tc.p, tc.n)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping %v", tc.name, err, tc.field, tc.err)
		}
	}
}

func TestAt(t *testing.T) {
	// Unit rotation about the z axis: the point (1, 0, 0) moves at (0, 1, 0)
	// (v = ω × r, closed form).
	tw := Twist{W: r3.Vec{Z: 1}}
	if got := tw.At(r3.Vec{X: 1}); got != (r3.Vec{Y: 1}) {
		t.Errorf("At = %v, want (0, 1, 0)", got)
	}
	// About moves the reference point: the new V is the velocity at o.
	o := r3.Vec{X: 1, Y: 2, Z: 3}
	if got := tw.About(o); got.W != tw.W || got.V != tw.At(o) {
		t.Errorf("About = %v", got)
	}
}

func TestPowerIndependentOfReference(t *testing.T) {
	// The reciprocal product does not depend on the reference point (Ball,
	// A Treatise on the Theory of Screws, 1900, §20, from memory; Hunt 1978
	// §12.6): W·(M − o×F) + (V + W×o)·F = W·M + V·F.
	tw := Twist{W: r3.Vec{X: 0.3, Y: -1.2, Z: 0.7}, V: r3.Vec{X: 2, Y: 0.1, Z: -0.4}}
	w := Wrench{F: r3.Vec{X: -0.5, Y: 0.8, Z: 1.1}, M: r3.Vec{X: 0.9, Y: 0.2, Z: -1.6}}
	p0 := Power(tw, w)
	o := r3.Vec{X: 10, Y: -3, Z: 4}
	if p := Power(tw.About(o), w.About(o)); math.Abs(p-p0) > 1e-13*30 {
		t.Errorf("Power about o = %.17g, about origin %.17g", p, p0)
	}
	// By hand: W·M = 0.27 − 0.24 − 1.12 = −1.09; V·F = −1 + 0.08 − 0.44 = −1.36.
	if math.Abs(p0-(-2.45)) > 1e-15 {
		t.Errorf("Power = %.17g, want -2.45", p0)
	}
}

func TestAxis(t *testing.T) {
	// A helical motion that advances a lead L per turn has pitch L/2π: pitch
	// is translation per radian of rotation (Ball 1900, §2–3; Hunt 1978,
	// §12.4; both from memory). Axis along (1, 1, 0)/√2 through a = (0, 0, 2).
	const lead = 1.5e-3 // m per turn
	e := r3.Unit(r3.Vec{X: 1, Y: 1})
	a := r3.Vec{Z: 2}
	omega := 3.0
	wv := r3.Scale(omega, e)
	va := r3.Scale(lead/(2*math.Pi)*omega, e) // velocity of the axis point
	tw := Twist{W: wv, V: r3.Sub(va, r3.Cross(wv, a))}
	ax := tw.Axis()
	// W·V cancels the large W·(W×a) term, so the pitch is good to a few ε
	// of |V|/|W|, not of itself.
	if got, want := ax.Pitch, lead/(2*math.Pi); math.Abs(got-want) > 4e-16*r3.Norm(tw.V)/omega {
		t.Errorf("pitch = %.17g, want %.17g", got, want)
	}
	if !near(ax.Direction, e, 1e-15) {
		t.Errorf("dir = %v, want %v", ax.Direction, e)
	}
	// a is the point of the axis nearest the origin, since a ⊥ e.
	if !near(ax.Point, a, 1e-15) {
		t.Errorf("point = %v, want %v", ax.Point, a)
	}
}

func TestAxisSpecial(t *testing.T) {
	if got := (Twist{}).Axis(); got != (Axis{}) {
		t.Errorf("zero twist: Axis = %v, want the zero Axis", got)
	}
	got := Twist{V: r3.Vec{Y: -4}}.Axis()
	if !math.IsInf(got.Pitch, 1) || got.Direction != (r3.Vec{Y: -1}) || got.Point != (r3.Vec{}) {
		t.Errorf("translation: Axis = %v, want pitch +Inf along -y", got)
	}
	// A pure rotation has pitch exactly 0; its axis point is
	// W × V/|W|² = (2, 0, 0) × (0, 1, 0)/4 = (0, 0, 0.5) (by hand).
	if got := (Twist{W: r3.Vec{X: 2}, V: r3.Vec{Y: 1}}).Axis(); got.Pitch != 0 || got.Point != (r3.Vec{Z: 0.5}) {
		t.Errorf("rotation: Axis = %v, want pitch 0 through (0, 0, 0.5)", got)
	}
	// Subnormal rates, worked by hand with s = 2⁻¹⁰⁷⁴ (the smallest
	// subnormal): W = (0, 0, s), V = (2⁻¹⁰⁴⁰, 0, 3·2⁻¹⁰⁴⁰) is a screw
	// along z with pitch W·V/|W|² = 3·2⁻¹⁰⁴⁰/s = 3·2³⁴ m/rad through
	// W×V/|W|² = (0, 2⁻¹⁰⁴⁰·s, 0)/s² = (0, 2³⁴, 0), where |W|² underflows
	// to zero; a translation at subnormal speed has a direction.
	s := 0x1p-1074
	got = Twist{W: r3.Vec{Z: s}, V: r3.Vec{X: 0x1p-1040, Z: 3 * 0x1p-1040}}.Axis()
	if got.Direction != (r3.Vec{Z: 1}) || got.Pitch != 3*0x1p34 || got.Point != (r3.Vec{Y: 0x1p34}) {
		t.Errorf("subnormal W: Axis = %v, want pitch 3·2³⁴ along z through (0, 2³⁴, 0)", got)
	}
	got = Twist{V: r3.Vec{X: -s}}.Axis()
	if got.Direction != (r3.Vec{X: -1}) || !math.IsInf(got.Pitch, 1) {
		t.Errorf("subnormal translation: Axis = %v, want pitch +Inf along −x", got)
	}
}

func TestZeroValues(t *testing.T) {
	var tw Twist
	var w Wrench
	if Power(tw, Wrench{F: r3.Vec{X: 1}, M: r3.Vec{Y: 1}}) != 0 || Power(Twist{W: r3.Vec{X: 1}}, w) != 0 {
		t.Error("zero twist or wrench develops power")
	}
	if tw.At(r3.Vec{X: 5}) != (r3.Vec{}) {
		t.Error("zero twist moves a point")
	}
	if tw.Add(tw) != tw || w.Add(w) != w || tw.Scale(3) != tw || w.Scale(3) != w {
		t.Error("zero is not the identity")
	}
}
