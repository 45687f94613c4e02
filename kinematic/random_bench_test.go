package kinematic

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

var sinkRandom Random

// BenchmarkRandom is the whole random response (stiffness, six modes,
// quadrature, six contacts) along one direction; BenchmarkRandomWorst
// adds the worst direction over the sphere.
func BenchmarkRandom(b *testing.B) {
	m := symmetricModel(b)
	opt := &RandomOptions{Direction: r3.Vec{X: 1, Y: 0.2, Z: 0.5}}
	b.ReportAllocs()
	for b.Loop() {
		r, err := m.Random(gravityDown, gevs, opt)
		if err != nil {
			b.Fatal(err)
		}
		sinkRandom = r
	}
}

func BenchmarkRandomWorst(b *testing.B) {
	m := symmetricModel(b)
	b.ReportAllocs()
	for b.Loop() {
		r, err := m.RandomWorst(gravityDown, gevs, nil)
		if err != nil {
			b.Fatal(err)
		}
		sinkRandom = r
	}
}
