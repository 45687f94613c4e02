package constraint

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

var (
	sinkResult Result
	sinkTwists [6]Twist
)

// benchSets returns the six-wrench sets of the benchmarks: the edges of a
// regular tetrahedron (the well-conditioned best case, all singular
// values 1), the test coupling (a general three-vee layout without
// symmetry) and six random lines (a general layout, worse conditioned).
func benchSets() []struct {
	name string
	ws   [6]Wrench
} {
	var tetra, coupling, general [6]Wrench
	v := []r3.Vec{{X: 1, Y: 1, Z: 1}, {X: 1, Y: -1, Z: -1}, {X: -1, Y: 1, Z: -1}, {X: -1, Y: -1, Z: 1}}
	k := 0
	for i := 0; i < 4; i++ {
		for j := i + 1; j < 4; j++ {
			p := r3.Add(r3.Scale(0.02, v[i]), r3.Vec{X: 0.1})
			q := r3.Add(r3.Scale(0.02, v[j]), r3.Vec{X: 0.1})
			tetra[k] = line(p, r3.Sub(q, p))
			k++
		}
	}
	cs := threeVee()
	copy(coupling[:], placed(cs[:], 0.05, r3.Vec{X: 0.3, Y: -0.1, Z: 0.02}))
	copy(general[:], randLines(rand.New(rand.NewPCG(1, 1)), 6))
	return []struct {
		name string
		ws   [6]Wrench
	}{{"tetrahedron", tetra}, {"coupling", coupling}, {"general", general}}
}

// BenchmarkAnalyze measures Analyze on six wrenches of rank 6, with the
// freed twists (as Analyze computes them) and without (the decomposition
// and the rest alone), and on general sets of n = 12 to 96 lines.
func BenchmarkAnalyze(b *testing.B) {
	for _, s := range benchSets() {
		for _, withFreed := range []bool{true, false} {
			name := "6/" + s.name
			if !withFreed {
				name += "/no-freed"
			}
			b.Run(name, func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					if err := analyze(s.ws[:], &sinkResult, withFreed); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
	rng := rand.New(rand.NewPCG(2, 2))
	for _, n := range []int{12, 24, 48, 96} {
		ws := randLines(rng, n)
		b.Run(fmt.Sprintf("%d/general", n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if err := Analyze(ws, &sinkResult); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkFreed measures Freed, the freed twists without the
// decomposition.
func BenchmarkFreed(b *testing.B) {
	for _, s := range benchSets() {
		b.Run(s.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if !Freed(&s.ws, &sinkTwists) {
					b.Fatal("singular")
				}
			}
		})
	}
}
