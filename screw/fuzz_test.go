package screw

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// wrenchBytes encodes wrenches as float64s, six per wrench.
func wrenchBytes(ws []Wrench) []byte {
	var b []byte
	for _, w := range ws {
		b = fuzzdata.Append(b, w.F.X, w.F.Y, w.F.Z, w.M.X, w.M.Y, w.M.Z)
	}
	return b
}

func bytesWrenches(b []byte) []Wrench {
	var ws []Wrench
	for _, x := range fuzzdata.Floats(b, 6) {
		ws = append(ws, Wrench{F: r3.Vec{X: x[0], Y: x[1], Z: x[2]}, M: r3.Vec{X: x[3], Y: x[4], Z: x[5]}})
	}
	return ws
}

// farOf returns the largest distance from the origin of a line of ws or
// of c, in metres.
func farOf(ws []Wrench, c r3.Vec) float64 {
	far := r3.Norm(c)
	for _, w := range ws {
		w = w.Scale(1 / maxAbs(w))
		if f2 := r3.Norm2(w.F); f2 > 0 {
			far = math.Max(far, r3.Norm(w.M)/math.Sqrt(f2))
		}
	}
	return far
}

func finiteTwist(t Twist) bool { return linalg.Finite3(t.W) && linalg.Finite3(t.V) }

// FuzzAnalyze checks that Analyze never panics and that every result it
// returns without an error is consistent: finite numbers, counts that add
// up, descending singular values whose squares sum to n, and free twists and
// redundancies that satisfy their definitions when the set is not
// near-singular.
func FuzzAnalyze(f *testing.F) {
	f.Add(wrenchBytes(regularTetrahedron(f, 0.02, 0.3, r3.Vec{X: 1}, r3.Vec{Y: 0.5})))
	f.Add(wrenchBytes([]Wrench{{F: r3.Vec{X: 1}}, {F: r3.Vec{Y: 1}}, {F: r3.Vec{Z: 1}}}))
	f.Add(wrenchBytes([]Wrench{{F: r3.Vec{Z: 1}, M: r3.Vec{X: 1}}, {F: r3.Vec{Z: 1}, M: r3.Vec{Y: 1}}}))
	f.Add(wrenchBytes([]Wrench{{M: r3.Vec{Z: 1}}, {F: r3.Vec{X: 1e-3}, M: r3.Vec{Y: 2}}}))
	f.Fuzz(func(t *testing.T, b []byte) {
		ws := bytesWrenches(b)
		if len(ws) > 24 {
			return
		}
		an, err := Analyze(ws)
		if err != nil {
			return
		}
		n := len(ws)
		if an.Rank < 1 || an.Rank > min(6, n) || len(an.Free) != 6-an.Rank || len(an.Redundant) != n-an.Rank {
			t.Fatalf("counts: rank %d, %d free, %d redundant for %d wrenches", an.Rank, len(an.Free), len(an.Redundant), n)
		}
		if len(an.Singular) != min(6, n) {
			t.Fatalf("%d singular values for %d wrenches", len(an.Singular), n)
		}
		var ss float64
		for i, s := range an.Singular {
			if math.IsNaN(s) || math.IsInf(s, 0) || s < 0 || (i > 0 && s > an.Singular[i-1]) {
				t.Fatalf("singular values %v", an.Singular)
			}
			ss += s * s
		}
		if math.Abs(ss-float64(n)) > 1e-12*float64(n) {
			t.Fatalf("Σσ² = %g, want %d", ss, n)
		}
		if math.IsNaN(an.Condition) || math.IsInf(an.Condition, 0) || an.Condition < 1 ||
			!linalg.Finite3(an.Centre) || math.IsNaN(an.Length) || math.IsInf(an.Length, 0) || an.Length < 0 {
			t.Fatalf("condition %g, centre %v, length %g", an.Condition, an.Centre, an.Length)
		}
		for _, tw := range an.Free {
			if !finiteTwist(tw) {
				t.Fatalf("free twist %v", tw)
			}
		}
		for _, c := range an.Redundant {
			for _, x := range c {
				if math.IsNaN(x) || math.IsInf(x, 0) || math.Abs(x) > 1 {
					t.Fatalf("redundancy %v", c)
				}
			}
		}
		if !an.NearSingular {
			// Accurate to a small multiple of ε·Condition (see Analyze),
			// plus what the rank decision dropped: singular values up to
			// RankTol of the largest count as zero, and the wrenches are
			// reciprocal to the free twists only to that level.
			tol := 1e-11 * an.Condition
			// And, far from the origin, what the moments' rounding allows:
			// 32ε·far/Length relative to the matrix (see the tolerance
			// policy), times Condition for the twists and weights, with
			// the same factor 10 over the cut-off as for rounding
			// (translationTol = 1e-12).
			if an.Length > 0 {
				tol += 10 * 32 * 0x1p-52 * farOf(ws, an.Centre) / an.Length * an.Condition
			}
			// (The factor covers the change from normalised to physical
			// sizes, which sums over up to n wrenches.) The free twists
			// and the redundancies are those of the matrix without the
			// dropped values, accurate to their size over the gap
			// (Condition; Wedin 1972): a rotation or a weight at that
			// level is set to zero.
			if an.Rank < len(an.Singular) {
				tol += 10 * math.Sqrt(float64(n)) * an.Singular[an.Rank] / an.Singular[0] * an.Condition
			}
			checkFree(t, ws, an, tol)
			checkRedundant(t, ws, an, tol)
		}
	})
}
