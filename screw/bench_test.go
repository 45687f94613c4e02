package screw

import (
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

var sinkAnalysis Analysis

func BenchmarkAnalyze(b *testing.B) {
	tetra := regularTetrahedron(b, 0.02, 0.3, r3.Vec{X: 1, Y: 1}, r3.Vec{X: 0.1})
	rng := rand.New(rand.NewPCG(1, 1))
	general6 := families[0].make(rng, 6)
	general12 := families[0].make(rng, 12)
	meeting5 := families[4].make(rng, 5)
	for _, bc := range []struct {
		name string
		ws   []Wrench
	}{
		{"6/tetrahedron", tetra},
		{"6/general", general6},
		{"5/one-free", meeting5},
		{"7/one-redundant", append(append([]Wrench(nil), tetra...), tetra[0].Scale(2))},
		{"12/general", general12},
	} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				an, err := Analyze(bc.ws)
				if err != nil {
					b.Fatal(err)
				}
				sinkAnalysis = an
			}
		})
	}
}
