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
