package masing

import (
	"math"
	"testing"
)

// tanhCurve is a smooth saturating backbone for the rule checks; the
// expected values below are Masing's rules (package doc) applied by hand.
var tanhCurve = Curve{
	F:     math.Tanh,
	Slope: func(x float64) float64 { c := math.Cosh(x); return 1 / (c * c) },
	Inv:   math.Atanh,
}

func TestRulesByHand(t *testing.T) {
	m := New(tanhCurve, 4)
	near := func(what string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > 1e-14 {
			t.Errorf("%s: got %.17g, want %.17g", what, got, want)
		}
	}
	p, s := m.MoveX(2)
	near("virgin y(2)", p.Y, math.Tanh(2))
	near("virgin slope", s, tanhCurve.Slope(2))
	y1 := math.Tanh(2)
	p, _ = m.MoveX(-1)
	y2 := y1 + 2*math.Tanh((-1-2)/2.0)
	near("first reversal branch y(-1)", p.Y, y2)
	p, s = m.MoveX(1.5)
	near("second reversal branch y(1.5)", p.Y, y2+2*math.Tanh((1.5+1)/2))
	near("second branch slope", s, tanhCurve.Slope((1.5+1)/2))
	if m.Open() != 2 {
		t.Errorf("open reversals %d, want 2", m.Open())
	}
	// Passing x = 2 closes the inner loop and the path is virgin again.
	p, _ = m.MoveX(3)
	near("after closing y(3)", p.Y, math.Tanh(3))
	if m.Open() != 0 {
		t.Errorf("open reversals %d, want 0", m.Open())
	}
	// First branch from (3, tanh 3) meets the backbone at the mirror point.
	p, _ = m.MoveX(-3)
	near("mirror point", p.Y, -math.Tanh(3))
	p, _ = m.MoveX(-4)
	near("virgin beyond the mirror", p.Y, -math.Tanh(4))
}

func TestMoveYInverse(t *testing.T) {
	a, b := New(tanhCurve, 0), New(tanhCurve, 0)
	for _, x := range []float64{0.7, -0.3, 0.5, -0.9, 1.2, 0.1, -2, 2} {
		p, _ := a.MoveX(x)
		q, _ := b.MoveY(p.Y)
		if math.Abs(q.X-x) > 1e-12 {
			t.Errorf("MoveY(%g) reached x = %.15g, MoveX went to %g", p.Y, q.X, x)
		}
	}
	// A y beyond the saturation of the branch is refused and changes nothing.
	before := b.State()
	if q, _ := b.MoveY(5); !math.IsInf(q.X, 0) || b.State() != before {
		t.Errorf("MoveY(5) = %v, state %v → %v", q, before, b.State())
	}
}

func TestPeekLeavesState(t *testing.T) {
	m := New(tanhCurve, 0)
	m.MoveX(1)
	m.MoveX(0.2)
	st, n := m.State(), m.Open()
	pk, _ := m.PeekX(2)
	if m.State() != st || m.Open() != n {
		t.Fatalf("PeekX changed the memory")
	}
	mv, _ := m.MoveX(2)
	if pk != mv {
		t.Errorf("PeekX %v, MoveX %v", pk, mv)
	}
	m.Reset()
	if m.State() != (Point{}) || m.Open() != 0 {
		t.Errorf("Reset left %v, %d", m.State(), m.Open())
	}
}

// TestMindlinCurve checks the Mindlin backbone and its inverse against
// their binomial series for small arguments, (1 − x)^(3/2) =
// 1 − 3x/2 + 3x²/8 + x³/16 + O(x⁴) and (1 − y)^(2/3) = 1 − 2y/3 − y²/9
// − 4y³/81 + O(y⁴) (by hand), where the plain forms lose their digits,
// against math.Pow at 1/2 (√2/4 and 2^(−2/3)), and the slope
// (3/2)(1 − x)^(1/2) against a central difference.
func TestMindlinCurve(t *testing.T) {
	for _, x := range []float64{1e-12, 1e-6, -1e-6} {
		a := math.Abs(x)
		wantF := math.Copysign(1.5*a-0.375*a*a-a*a*a/16, x)
		if got := Mindlin.F(x); math.Abs(got-wantF) > 1e-15*math.Abs(wantF) {
			t.Errorf("F(%g) = %.17g, series %.17g", x, got, wantF)
		}
		wantInv := math.Copysign(2*a/3+a*a/9+4*a*a*a/81, x)
		if got := Mindlin.Inv(x); math.Abs(got-wantInv) > 1e-15*math.Abs(wantInv) {
			t.Errorf("Inv(%g) = %.17g, series %.17g", x, got, wantInv)
		}
	}
	if got, want := Mindlin.F(0.5), 1-math.Sqrt2/4; math.Abs(got-want) > 1e-15 {
		t.Errorf("F(1/2) = %.17g, want 1 − √2/4 = %.17g", got, want)
	}
	if got, want := Mindlin.Inv(0.5), 1-math.Pow(2, -2.0/3); math.Abs(got-want) > 1e-15 {
		t.Errorf("Inv(1/2) = %.17g, want 1 − 2^(−2/3) = %.17g", got, want)
	}
	for _, x := range []float64{0.1, 0.5, 0.9, -0.7} {
		const h = 1e-6
		fd := (Mindlin.F(x+h) - Mindlin.F(x-h)) / (2 * h)
		if got := Mindlin.Slope(x); math.Abs(got-fd) > 1e-8 {
			t.Errorf("Slope(%g) = %v, central difference %v", x, got, fd)
		}
	}
	if Mindlin.F(1.5) != 1 || Mindlin.F(-3) != -1 || Mindlin.Slope(2) != 0 || !math.IsInf(Mindlin.Inv(1), 1) {
		t.Errorf("saturation: F(1.5) %v, F(−3) %v, Slope(2) %v, Inv(1) %v", Mindlin.F(1.5), Mindlin.F(-3), Mindlin.Slope(2), Mindlin.Inv(1))
	}
}
