package drawing_test

import (
	"io"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// BenchmarkLiftOff draws the bench fixture's lift-off map.
func BenchmarkLiftOff(b *testing.B) {
	bl, _ := built(b, bench)
	for b.Loop() {
		if err := drawing.LiftOff(io.Discard, bl, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkPlan draws the bench fixture's plan.
func BenchmarkPlan(b *testing.B) {
	bl, ev := built(b, bench)
	for b.Loop() {
		if err := drawing.Plan(io.Discard, bl, ev, nil); err != nil {
			b.Fatal(err)
		}
	}
}
