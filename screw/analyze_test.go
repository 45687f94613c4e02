package screw

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"gonum.org/v1/gonum/spatial/r3"
)

func randVec(rng *rand.Rand) r3.Vec {
	return r3.Vec{X: 2*rng.Float64() - 1, Y: 2*rng.Float64() - 1, Z: 2*rng.Float64() - 1}
}

// maxAbs returns the largest magnitude of a component of w.
func maxAbs(w Wrench) float64 {
	return max(math.Abs(w.F.X), math.Abs(w.F.Y), math.Abs(w.F.Z), math.Abs(w.M.X), math.Abs(w.M.Y), math.Abs(w.M.Z))
}

func mustLine(t testing.TB, p, n r3.Vec) Wrench {
	t.Helper()
	w, err := Line(p, n)
	if err != nil {
		t.Fatal(err)
	}
	return w
}

func mustAnalyze(t testing.TB, ws []Wrench) Analysis {
	t.Helper()
	an, err := Analyze(ws)
	if err != nil {
		t.Fatal(err)
	}
	return an
}

// family builds sets of lines of a known kind.
type family struct {
	name string
	rank int // the rank a generic member has
	make func(rng *rand.Rand, n int) []Wrench
}

var families = []family{
	{"general", -1, func(rng *rand.Rand, n int) []Wrench { // rank min(n, 6)
		ws := make([]Wrench, n)
		for i := range ws {
			ws[i], _ = Line(randVec(rng), randVec(rng))
		}
		return ws
	}},
	{"concurrent", 3, func(rng *rand.Rand, n int) []Wrench { // all through one point
		c := randVec(rng)
		ws := make([]Wrench, n)
		for i := range ws {
			ws[i], _ = Line(c, randVec(rng))
		}
		return ws
	}},
	{"parallel", 3, func(rng *rand.Rand, n int) []Wrench {
		d := randVec(rng)
		ws := make([]Wrench, n)
		for i := range ws {
			ws[i], _ = Line(randVec(rng), d)
		}
		return ws
	}},
	{"planar", 3, func(rng *rand.Rand, n int) []Wrench { // all in the plane z = 0.3
		ws := make([]Wrench, n)
		for i := range ws {
			p, d := randVec(rng), randVec(rng)
			p.Z, d.Z = 0.3, 0
			ws[i], _ = Line(p, d)
		}
		return ws
	}},
	{"meeting a line", 5, func(rng *rand.Rand, n int) []Wrench {
		a, e := randVec(rng), randVec(rng)
		ws := make([]Wrench, n)
		for i := range ws {
			ws[i], _ = Line(r3.Add(a, r3.Scale(2*rng.Float64()-1, e)), randVec(rng))
		}
		return ws
	}},
}

// TestReciprocityProperties checks, over random sets of every family, that
// every free twist develops zero power with every wrench, that every
// redundant combination sums to the zero wrench, and that the counts add up:
// len(Free) = 6 − Rank, len(Redundant) = n − Rank.
func TestReciprocityProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for _, fam := range families {
		for n := 1; n <= 14; n++ {
			for trial := 0; trial < 20; trial++ {
				ws := fam.make(rng, n)
				an := mustAnalyze(t, ws)
				want := min(n, 6)
				if fam.rank >= 0 {
					want = min(n, fam.rank)
				}
				if an.Rank != want {
					t.Fatalf("%s, n=%d: rank %d, want %d (singular %v)", fam.name, n, an.Rank, want, an.Singular)
				}
				checkFree(t, ws, an, 1e-12)
				checkIndependent(t, an)
				checkRedundant(t, ws, an, 1e-12)
			}
		}
	}
}

func checkFree(t *testing.T, ws []Wrench, an Analysis, tol float64) {
	t.Helper()
	if len(an.Free) != 6-an.Rank {
		t.Fatalf("%d free twists, want %d", len(an.Free), 6-an.Rank)
	}
	for k, tw := range an.Free {
		for i, w := range ws {
			w = w.Scale(1 / maxAbs(w)) // only the line matters; avoid subnormals
			// Power relative to the sizes of the terms it sums, and to the
			// rounding of moving a twist from Centre to the origin,
			// ε·|W|·|Centre| (large when the lines lie far from the origin);
			// a floor for subnormal products, which carry absolute rounding
			// of the smallest subnormal, 4.9e-324, per operation. A twist
			// is computed as a unit vector (V at Centre, W·Length), so W
			// carries rounding relative to |V at Centre|/Length as well,
			// which matters for a screw of large pitch or far axis.
			scale := r3.Norm(tw.W)*r3.Norm(w.M) + r3.Norm(tw.V)*r3.Norm(w.F) +
				r3.Norm(tw.W)*r3.Norm(w.F)*(r3.Norm(an.Centre)+an.Length)
			if an.Length > 0 {
				scale += r3.Norm(tw.At(an.Centre)) / an.Length * r3.Norm(w.M)
			}
			if p := Power(tw, w); math.Abs(p) > tol*scale+1e-290 {
				t.Fatalf("free twist %d and wrench %d: power %g (scale %g)", k, i, p, scale)
			}
		}
	}
}

// checkIndependent checks that the free twists are independent: their own
// analysis as wrenches (the same six numbers) has full rank.
func checkIndependent(t *testing.T, an Analysis) {
	t.Helper()
	if len(an.Free) > 0 {
		as := make([]Wrench, len(an.Free))
		for i, tw := range an.Free {
			as[i] = Wrench{F: tw.W, M: tw.V}
		}
		if got := mustAnalyze(t, as).Rank; got != len(an.Free) {
			t.Fatalf("free twists span %d dimensions, want %d", got, len(an.Free))
		}
	}
}

func checkRedundant(t *testing.T, ws []Wrench, an Analysis, tol float64) {
	t.Helper()
	if len(an.Redundant) != len(ws)-an.Rank {
		t.Fatalf("%d redundancies, want %d", len(an.Redundant), len(ws)-an.Rank)
	}
	for k, c := range an.Redundant {
		if len(c) != len(ws) {
			t.Fatalf("redundancy %d has %d weights, want %d", k, len(c), len(ws))
		}
		// The largest component of the sum, relative to the sizes added
		// (largest components of the terms) and to the rounding of taking
		// moments about Centre, ε·|F|·(|Centre| + Length); a floor for
		// subnormal products.
		var sum Wrench
		var scale float64
		arm := r3.Norm(an.Centre) + an.Length
		for i, w := range ws {
			sum = sum.Add(w.Scale(c[i]))
			scale += math.Abs(c[i]) * (maxAbs(w) + r3.Norm(w.F)*arm)
		}
		if r := maxAbs(sum); r > tol*scale+1e-290 {
			t.Fatalf("redundancy %d sums to %v (scale %g)", k, sum, scale)
		}
	}
}

// TestLinesMeetingALine: five independent lines that all meet one line leave
// exactly one free twist, the pure rotation about that line (Ball, A Treatise
// on the Theory of Screws, 1900, ch. 5, the screw reciprocal to a
// 5-system; Hunt, Kinematic Geometry of Mechanisms, 1978, §12.6: a line is
// reciprocal to every line it meets).
func TestLinesMeetingALine(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 5))
	for trial := 0; trial < 100; trial++ {
		a := r3.Scale(0.1, randVec(rng)) // axis point, m
		e := r3.Unit(randVec(rng))
		ws := make([]Wrench, 5)
		for i := range ws {
			q := r3.Add(a, r3.Scale(0.05*(2*rng.Float64()-1), e))
			ws[i] = mustLine(t, q, randVec(rng))
		}
		an := mustAnalyze(t, ws)
		if an.Rank != 5 || len(an.Free) != 1 {
			t.Fatalf("rank %d with %d free twists, want 5 and 1", an.Rank, len(an.Free))
		}
		ax := an.Free[0].Axis()
		if math.Abs(ax.Pitch) > 1e-12*an.Length {
			t.Errorf("pitch %g m/rad, want 0", ax.Pitch)
		}
		if math.Abs(math.Abs(r3.Dot(ax.Direction, e))-1) > 1e-12 {
			t.Errorf("axis direction %v, want ±%v", ax.Direction, e)
		}
		// The axis passes through a: the distance of a from the axis line.
		off := r3.Sub(a, ax.Point)
		if d := r3.Norm(r3.Cross(off, ax.Direction)); d > 1e-12*an.Length {
			t.Errorf("axis misses the common line by %g m", d)
		}
	}
}

// TestConcurrentLines: three independent lines through one point leave the
// three rotations about that point free (Hunt 1978, §12.6; Blanding,
// Exact Constraint, 1999, ch. 2, from memory: three constraints meeting at a
// point allow rotation about any axis through it).
func TestConcurrentLines(t *testing.T) {
	c := r3.Vec{X: 0.04, Y: -0.02, Z: 0.11}
	ws := []Wrench{
		mustLine(t, c, r3.Vec{X: 1}),
		mustLine(t, c, r3.Vec{X: 1, Y: 1}),
		mustLine(t, c, r3.Vec{Y: 0.2, Z: 1}),
	}
	an := mustAnalyze(t, ws)
	if an.Rank != 3 || len(an.Free) != 3 {
		t.Fatalf("rank %d, %d free; want 3 and 3", an.Rank, len(an.Free))
	}
	for i, tw := range an.Free {
		ax := tw.Axis()
		if math.Abs(ax.Pitch) > 1e-12*r3.Norm(c) {
			t.Errorf("free twist %d: pitch %g, want 0", i, ax.Pitch)
		}
		if d := r3.Norm(r3.Cross(r3.Sub(c, ax.Point), ax.Direction)); d > 1e-12*r3.Norm(c) {
			t.Errorf("free twist %d: axis misses the common point by %g m", i, d)
		}
		// The point does not move.
		if v := r3.Norm(tw.At(c)); v > 1e-12 {
			t.Errorf("free twist %d moves the common point at %g m/s", i, v)
		}
	}
	if !near(an.Centre, c, 1e-15) || an.Length != 0 {
		t.Errorf("centre %v, length %g; want %v and 0", an.Centre, an.Length, c)
	}
}

// TestParallelLines: any number of parallel lines has rank at most 3; three
// or more in general position leave the two translations across them and the
// rotation about their direction free (Hunt 1978, §12.6, from memory).
func TestParallelLines(t *testing.T) {
	d := r3.Unit(r3.Vec{X: 0.3, Y: -0.4, Z: 1})
	pts := []r3.Vec{{X: 0.1}, {Y: 0.1}, {X: -0.07, Y: -0.05}, {X: 0.02, Y: 0.09, Z: 0.3}, {X: 0.5, Y: -0.2}}
	for n := 1; n <= len(pts); n++ {
		ws := make([]Wrench, n)
		for i := range ws {
			ws[i] = mustLine(t, pts[i], d)
		}
		an := mustAnalyze(t, ws)
		if an.Rank != min(n, 3) {
			t.Fatalf("%d parallel lines: rank %d, want %d", n, an.Rank, min(n, 3))
		}
		if n < 3 {
			continue
		}
		// Free: one rotation about d (first, with W ∥ d) and two
		// translations across d.
		if len(an.Free) != 3 {
			t.Fatalf("%d free twists, want 3", len(an.Free))
		}
		if w := an.Free[0].W; math.Abs(math.Abs(r3.Dot(w, d))-1) > 1e-12 {
			t.Errorf("rotation about %v, want ±%v", w, d)
		}
		for _, tw := range an.Free[1:] {
			if tw.W != (r3.Vec{}) || math.Abs(r3.Dot(tw.V, d)) > 1e-12 {
				t.Errorf("free twist %v, want a translation across d", tw)
			}
		}
	}
}

// regularTetrahedron returns the wrenches of unit forces along the six edges
// of a regular tetrahedron, scaled by s and moved by the rotation rot about
// the axis ax and the translation off.
func regularTetrahedron(t testing.TB, s, rot float64, ax, off r3.Vec) []Wrench {
	v := []r3.Vec{{X: 1, Y: 1, Z: 1}, {X: 1, Y: -1, Z: -1}, {X: -1, Y: 1, Z: -1}, {X: -1, Y: -1, Z: 1}}
	var ws []Wrench
	for i := 0; i < 4; i++ {
		for j := i + 1; j < 4; j++ {
			p := r3.Add(r3.Rotate(r3.Scale(s, v[i]), rot, ax), off)
			q := r3.Add(r3.Rotate(r3.Scale(s, v[j]), rot, ax), off)
			ws = append(ws, mustLine(t, p, r3.Sub(q, p)))
		}
	}
	return ws
}

// TestTetrahedronEdges: the six edges of a tetrahedron are independent lines,
// rank 6 (Merlet, "Singular configurations of parallel manipulators and
// Grassmann geometry", Int. J. Robotics Research 8(5), 1989: a regular
// tetrahedral arrangement is far from every singular line complex; from
// memory). By symmetry of the regular tetrahedron the three moment-dominant
// and three force-dominant singular values pair up.
func TestTetrahedronEdges(t *testing.T) {
	an := mustAnalyze(t, regularTetrahedron(t, 0.02, 0, r3.Vec{Z: 1}, r3.Vec{}))
	if an.Rank != 6 || an.NearSingular || len(an.Free) != 0 || len(an.Redundant) != 0 {
		t.Fatalf("rank %d, near-singular %v, %d free, %d redundant; want a rigid set",
			an.Rank, an.NearSingular, len(an.Free), len(an.Redundant))
	}
	// The centroid is the centre by symmetry; every edge is a diagonal of a
	// face of the cube of side 2s, at distance s from the centre.
	if r3.Norm(an.Centre) > 1e-15 || math.Abs(an.Length-0.02) > 1e-15 {
		t.Errorf("centre %v, length %g; want 0 and 0.02", an.Centre, an.Length)
	}
	// The Gram matrix of the normalised edges (F, M/s)/√2 is I, so all six
	// singular values are 1. Worked by hand for the cube-inscribed
	// tetrahedron: opposite edges have F·F = 0 and M·M = 0; adjacent edges
	// have F·F = ±½ and M·M/s² = ∓½.
	for i, s := range an.Singular {
		if math.Abs(s-1) > 1e-14 {
			t.Errorf("singular[%d] = %.17g, want 1", i, s)
		}
	}
}

// TestFarTetrahedron: the edges of a regular tetrahedron of half-size
// s = 0.02 m (edges at distance s from the centre, all six singular values
// 1: see TestTetrahedronEdges) moved 10 km from the origin, and 0.02 mm
// moved 10 m. Their moments about the origin carry rounding of ε times the
// distance; the verdict must hold to that precision: rank 6, Length = s,
// singular values 1 to within 64ε·far/Length (twice the bound of the
// tolerance policy; 7e-9 here). A hard floor on Length at 1e-5 of the
// distance from the origin reported Length 0 for both.
func TestFarTetrahedron(t *testing.T) {
	for _, tc := range []struct {
		s   float64
		off r3.Vec
	}{
		{0.02, r3.Vec{X: 6e3, Y: -7e3, Z: 3.6e3}},
		{2e-5, r3.Vec{X: 6, Y: -7, Z: 3.6}},
	} {
		an := mustAnalyze(t, regularTetrahedron(t, tc.s, 0.7, r3.Vec{X: 1, Y: -1}, tc.off))
		far := r3.Norm(tc.off) + 2*tc.s
		tol := 64 * 0x1p-52 * far / tc.s
		if an.Rank != 6 || an.NearSingular || math.Abs(an.Length-tc.s) > tol*tc.s {
			t.Errorf("s = %g: rank %d, near-singular %v, length %g; want 6, false, %g", tc.s, an.Rank, an.NearSingular, an.Length, tc.s)
		}
		for i, sv := range an.Singular {
			if math.Abs(sv-1) > tol {
				t.Errorf("s = %g: singular[%d] = %.17g, want 1 to %.2g", tc.s, i, sv, tol)
			}
		}
		if d := r3.Norm(r3.Sub(an.Centre, tc.off)); d > tol*tc.s {
			t.Errorf("s = %g: centre %v, want %v", tc.s, an.Centre, tc.off)
		}
	}
}

// TestInvariance: moving a set rigidly or scaling it by 1000 leaves the rank
// and the dimensionless singular values unchanged (they are invariants of the
// line geometry; see Analyze's tolerance policy), and moves the free twists
// and redundancies along.
func TestInvariance(t *testing.T) {
	rng := rand.New(rand.NewPCG(13, 17))
	for _, fam := range families {
		for _, n := range []int{3, 5, 6, 7, 9} {
			base := fam.make(rng, n)
			a0 := mustAnalyze(t, base)
			for _, tr := range []struct {
				name  string
				scale float64
				rot   float64
				off   r3.Vec
			}{
				{"scaled by 1000", 1000, 0, r3.Vec{}},
				{"scaled by 1/1000", 1e-3, 0, r3.Vec{}},
				{"moved", 1, 0.9, r3.Vec{X: 0.3, Y: -2, Z: 0.6}},
				{"moved and scaled", 1000, -2.1, r3.Vec{X: 40, Y: 7, Z: -90}},
			} {
				ax := r3.Unit(r3.Vec{X: 1, Y: 2, Z: -0.5})
				moved := make([]Wrench, n)
				for i, w := range base {
					// The line's point nearest the origin, moved.
					p := r3.Scale(1/r3.Norm2(w.F), r3.Cross(w.F, w.M))
					p = r3.Add(r3.Rotate(r3.Scale(tr.scale, p), tr.rot, ax), tr.off)
					moved[i] = mustLine(t, p, r3.Rotate(w.F, tr.rot, ax))
				}
				a1 := mustAnalyze(t, moved)
				if a1.Rank != a0.Rank || a1.NearSingular != a0.NearSingular {
					t.Fatalf("%s %s: rank %d near-singular %v, was %d %v", fam.name, tr.name, a1.Rank, a1.NearSingular, a0.Rank, a0.NearSingular)
				}
				// Singular values to 1e-12 relative to the largest (those at
				// rounding level are compared with that absolute floor).
				opt := cmpopts.EquateApprox(0, 1e-12*a0.Singular[0])
				if d := cmp.Diff(a0.Singular[:a0.Rank], a1.Singular[:a1.Rank], opt); d != "" {
					t.Errorf("%s %s, n=%d: singular values (-want +got):\n%s", fam.name, tr.name, n, d)
				}
				if math.Abs(a1.Length-tr.scale*a0.Length) > 1e-12*tr.scale*a0.Length {
					t.Errorf("%s %s: length %g, want %g", fam.name, tr.name, a1.Length, tr.scale*a0.Length)
				}
				checkFree(t, moved, a1, 1e-12)
				checkIndependent(t, a1)
				checkRedundant(t, moved, a1, 1e-12)
			}
		}
	}
}

// TestRedundantPair: a line given twice, with weights 1 and 2, is one
// redundancy c = (1, −1/2): 1·w − ½·2w = 0 (closed form).
func TestRedundantPair(t *testing.T) {
	w := mustLine(t, r3.Vec{X: 0.01}, r3.Vec{Z: 1})
	an := mustAnalyze(t, []Wrench{w, w.Scale(2)})
	want := [][]float64{{1, -0.5}}
	if d := cmp.Diff(want, an.Redundant, cmpopts.EquateApprox(1e-15, 0)); d != "" {
		t.Errorf("redundancy (-want +got):\n%s", d)
	}
	if an.Rank != 1 {
		t.Errorf("rank %d, want 1", an.Rank)
	}
}

// TestSevenLines: a seventh line added to six independent ones is exactly one
// redundancy, in which the seventh takes part (six independent lines span
// the whole six-dimensional wrench space: Hunt 1978, §12.6).
func TestSevenLines(t *testing.T) {
	ws := regularTetrahedron(t, 0.02, 0, r3.Vec{Z: 1}, r3.Vec{})
	ws = append(ws, mustLine(t, r3.Vec{X: 0.005, Y: 0.003}, r3.Vec{X: 0.2, Y: 0.1, Z: 1}))
	an := mustAnalyze(t, ws)
	if an.Rank != 6 || len(an.Redundant) != 1 {
		t.Fatalf("rank %d, %d redundancies; want 6 and 1", an.Rank, len(an.Redundant))
	}
	if an.Redundant[0][6] == 0 {
		t.Errorf("the seventh line does not take part: %v", an.Redundant[0])
	}
	checkRedundant(t, ws, an, 1e-12)
}

// TestPureMoments: pure couples (F = 0) constrain rotations only: three
// independent couples leave the three translations free (Hunt 1978, §12.6).
func TestPureMoments(t *testing.T) {
	ws := []Wrench{{M: r3.Vec{X: 1}}, {M: r3.Vec{X: 1, Y: 1}}, {M: r3.Vec{Y: 1, Z: 3}}}
	an := mustAnalyze(t, ws)
	if an.Rank != 3 || an.Length != 0 {
		t.Fatalf("rank %d, length %g; want 3 and 0", an.Rank, an.Length)
	}
	for _, tw := range an.Free {
		if tw.W != (r3.Vec{}) {
			t.Errorf("free twist %v rotates; want a translation", tw)
		}
	}
	checkFree(t, ws, an, 1e-12)
}

func TestAnalyzeDoesNotModifyInput(t *testing.T) {
	ws := regularTetrahedron(t, 0.02, 0.4, r3.Vec{X: 1}, r3.Vec{Y: 3})
	ws = append(ws, ws[0].Scale(3))
	orig := append([]Wrench(nil), ws...)
	mustAnalyze(t, ws)
	if d := cmp.Diff(orig, ws); d != "" {
		t.Errorf("input modified (-before +after):\n%s", d)
	}
}

func TestAnalyzeErrors(t *testing.T) {
	ok := Wrench{F: r3.Vec{X: 1}}
	nan := math.NaN()
	for _, tc := range []struct {
		name  string
		ws    []Wrench
		field string
		err   error
	}{
		{"nil", nil, "ws", ErrDegenerate},
		{"empty", []Wrench{}, "ws", ErrDegenerate},
		{"NaN force", []Wrench{ok, {F: r3.Vec{Y: nan}}}, "ws[1].F", ErrNonFinite},
		{"Inf moment", []Wrench{{M: r3.Vec{Z: math.Inf(-1)}}}, "ws[0].M", ErrNonFinite},
		{"zero wrench", []Wrench{ok, {}, ok}, "ws[1]", ErrDegenerate},
		{"all zero", []Wrench{{}, {}}, "ws[0]", ErrDegenerate},
		{"line too far", []Wrench{{F: r3.Vec{X: 1e-160}, M: r3.Vec{Y: 1}}, {F: r3.Vec{Y: 1}}}, "ws[0]", ErrRange},
		{"magnitudes too far apart", []Wrench{{F: r3.Vec{X: 1}}, {F: r3.Vec{Y: 1e200}}}, "ws[1]", ErrRange},
	} {
		an, err := Analyze(tc.ws)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.err) {
			t.Errorf("%s: err = %v, want *InputError on %q wrapping %v", tc.name, err, tc.field, tc.err)
		}
		if an.Rank != 0 || an.Singular != nil {
			t.Errorf("%s: non-zero Analysis with an error: %+v", tc.name, an)
		}
	}
}
