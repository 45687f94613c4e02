package constraint

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
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

// BenchmarkDecompose measures, on the normalised matrices of the
// benchmark sets, the pieces that bound Analyze's speed (issue 19;
// DEVELOPERS.md, "Performance as ratios"): the normalisation alone; the
// one-sided Jacobi SVD on the columns, with the sort; the same on the
// rows, which is what Analyze does for six wrenches (the columns follow
// only when the rank is below six); and the alternatives measured
// against them: the columns after a pivoted QR (Drmač & Veselić's
// preconditioner), the eigenvalues of the Gram matrix AᵀA (Householder
// tridiagonalisation and implicit QR, which square the condition number
// and so could only serve well-conditioned sets), and the Gauss–Jordan
// inverse that any path without the singular vectors needs for the freed
// twists.
func BenchmarkDecompose(b *testing.B) {
	for _, s := range benchSets() {
		var pre [6]Wrench
		var src [36]float64
		var exps [6]int
		var gain [6]float64
		if _, err := normalise(s.ws[:], pre[:], src[:], exps[:], gain[:]); err != nil {
			b.Fatal(err)
		}
		b.Run(s.name+"/normalise", func(b *testing.B) {
			var a [36]float64
			for b.Loop() {
				if _, err := normalise(s.ws[:], pre[:], a[:], exps[:], gain[:]); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(s.name+"/jacobi", func(b *testing.B) {
			var sigma [6]float64
			for b.Loop() {
				a := src
				if !linalg.Jacobi6(&a, 6) {
					b.Fatal("no convergence")
				}
				linalg.Sort6(&a, 6, &sigma)
			}
		})
		b.Run(s.name+"/jacobi-rows", func(b *testing.B) {
			var sigma [6]float64
			for b.Loop() {
				var w [36]float64
				for i := 0; i < 6; i++ {
					for j := 0; j < 6; j++ {
						w[6*j+i] = src[6*i+j]
					}
				}
				if !linalg.Jacobi6(&w, 6) {
					b.Fatal("no convergence")
				}
				linalg.Sort6(&w, 6, &sigma)
			}
		})
		b.Run(s.name+"/qr-jacobi", func(b *testing.B) {
			var sigma [6]float64
			var rt [36]float64
			var perm [6]int
			for b.Loop() {
				a := src
				linalg.QRPivot(a[:], 6, &rt, &perm)
				if !linalg.Jacobi6(&rt, 6) {
					b.Fatal("no convergence")
				}
				linalg.Sort6(&rt, 6, &sigma)
			}
		})
		b.Run(s.name+"/gram-eigenvalues", func(b *testing.B) {
			var w [6]float64
			for b.Loop() {
				var g [36]float64
				for p := 0; p < 6; p++ {
					for q := 0; q <= p; q++ {
						x := dot6((*[6]float64)(src[6*p:6*p+6]), (*[6]float64)(src[6*q:6*q+6]))
						g[6*p+q], g[6*q+p] = x, x
					}
				}
				if !linalg.EigenvaluesSym6(&g, &w) {
					b.Fatal("no convergence")
				}
			}
		})
		b.Run(s.name+"/inverse", func(b *testing.B) {
			for b.Loop() {
				a := src
				if !linalg.Inverse6(&a, freedTol) {
					b.Fatal("singular")
				}
			}
		})
	}
}
