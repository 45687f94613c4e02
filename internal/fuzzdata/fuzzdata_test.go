package fuzzdata

import (
	"math"
	"testing"
)

func TestRoundTrip(t *testing.T) {
	xs := []float64{1.5, math.Copysign(0, -1), math.Inf(1), math.SmallestNonzeroFloat64, 7, math.MaxFloat64}
	b := Append(nil, xs...)
	b = append(b, 1, 2, 3) // a partial value is ignored
	got := Floats(b, 3)
	if len(got) != 2 {
		t.Fatalf("%d groups, want 2", len(got))
	}
	for i, x := range xs {
		if g := got[i/3][i%3]; math.Float64bits(g) != math.Float64bits(x) {
			t.Errorf("value %d: %g, want %g", i, g, x)
		}
	}
	nan := Floats(Append(nil, math.NaN()), 1)[0][0]
	if !math.IsNaN(nan) {
		t.Errorf("NaN came back as %g", nan)
	}
}
