package kinematic

import (
	"math"
	"testing"
)

// TestOptimizeMaxwellRatio: the optimiser's scorer keeps its own ideal
// Maxwell index per groove, for the half-angle it chose; its MaxwellRatio
// must equal the one Coupling.Score gives for the layout it returns. The
// outside value: on the equilateral triangle with the grooves on the
// bisectors every centre index is |sin 2θ| (kinematic/doc.go, derived in
// kinematic's tests), the ideal of a groove of half-angle θ, so the best
// layout for MaxCentreIndex has WeakestCentreIndex = |sin 2θ| and
// MaxwellRatio = 1 (no contact can exceed its ideal, and the bisector
// layout, one of the optimiser's starts, reaches it). The vees are drawn
// at 45° and the optimiser may only use 30°, so an ideal taken from the
// drawing (|sin 90°| = 1) instead of the chosen half-angle
// (|sin 60°| = √3/2) shows.
func TestOptimizeMaxwellRatio(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	const half = math.Pi / 6
	res, err := Optimize(c, s, &OptimizeOptions{Objective: MaxCentreIndex, HalfAngles: []float64{half}})
	if err != nil {
		t.Fatal(err)
	}
	for i, p := range res.Coupling.Pairs {
		if v, ok := p.Seat.(Vee); !ok || v.HalfAngle != half {
			t.Fatalf("pair %d: seat %+v, want a vee of half-angle π/6", i, p.Seat)
		}
	}
	card, err := res.Coupling.Score(s)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(res.Score.MaxwellRatio-card.MaxwellRatio) > 1e-9*card.MaxwellRatio {
		t.Errorf("Maxwell ratio: optimiser %.12g, Score %.12g", res.Score.MaxwellRatio, card.MaxwellRatio)
	}
	ideal := math.Sin(2 * half)
	for _, k := range []struct {
		name string
		card Scorecard
	}{{"optimiser", res.Score}, {"Score", card}} {
		if math.Abs(k.card.MaxwellRatio-1) > 1e-9 || math.Abs(k.card.WeakestCentreIndex-ideal) > 1e-9 {
			t.Errorf("%s: Maxwell ratio %.12g, weakest centre index %.12g; want 1 and sin 60° = %.12g",
				k.name, k.card.MaxwellRatio, k.card.WeakestCentreIndex, ideal)
		}
	}
}
