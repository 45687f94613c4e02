package lp

import (
	"math/rand/v2"
	"testing"
)

var sinkResult Result

// BenchmarkSolve measures Solve per regime: the closure programs of
// kinematic's fuzz corpus (form closure 6×7 feasible and infeasible, force
// closure 6×63 with the bounds raised and as given, λ ≥ 1, the most
// degenerate form), the preload sizing dual (3×15) and primal (12×15), and
// a random dense 20×60 program.
func BenchmarkSolve(b *testing.B) {
	progs := map[string]program{}
	for _, p := range readPrograms(b) {
		progs[p.name] = p
	}
	rng := rand.New(rand.NewPCG(5, 5))
	c, a, bb := randomProgram(rng, 20, 60, true, true)
	for _, bc := range []struct {
		name string
		p    program
	}{
		{"form=closed/6x7", progs["form-d193707625389b16-perturbed"]},
		{"form=open/6x7", progs["form-f12e141c53faa9d4-perturbed"]},
		{"force=raised/6x63", progs["force-d193707625389b16-perturbed"]},
		{"force=degenerate/6x63", progs["force-d193707625389b16-unperturbed"]},
		{"sizing=dual/3x15", progs["sizing-dual-7af7b315d9e0585a"]},
		{"sizing=primal/12x15", progs["sizing-primal-7af7b315d9e0585a"]},
		{"random/20x60", program{m: 20, n: 60, c: c, a: a, b: bb}},
	} {
		if bc.p.n == 0 {
			b.Fatalf("%s: program missing from testdata/programs", bc.name)
		}
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				res, err := Solve(bc.p.c, bc.p.a, bc.p.b, nil)
				if err != nil {
					b.Fatal(err)
				}
				sinkResult = res
			}
		})
	}
}
