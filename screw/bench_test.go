package screw

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

var sinkAnalysis Analysis

// BenchmarkAnalyze measures Analyze per regime: the well-conditioned best
// case (the edges of a regular tetrahedron), a general layout of six
// random lines, a set with one free twist, one with one redundancy, and
// general sets of n = 12 to 96 lines (n − 6 redundancies each) for the
// growth in n.
func BenchmarkAnalyze(b *testing.B) {
	tetra := regularTetrahedron(b, 0.02, 0.3, r3.Vec{X: 1, Y: 1}, r3.Vec{X: 0.1})
	rng := rand.New(rand.NewPCG(1, 1))
	general6 := families[0].make(rng, 6)
	meeting5 := families[4].make(rng, 5)
	cases := []struct {
		name string
		ws   []Wrench
	}{
		{"6/tetrahedron", tetra},
		{"6/general", general6},
		{"5/one-free", meeting5},
		{"7/one-redundant", append(append([]Wrench(nil), tetra...), tetra[0].Scale(2))},
	}
	for _, n := range []int{12, 24, 48, 96} {
		cases = append(cases, struct {
			name string
			ws   []Wrench
		}{fmt.Sprintf("%d/general", n), families[0].make(rng, n)})
	}
	for _, bc := range cases {
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
