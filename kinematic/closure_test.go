package kinematic

import (
	"encoding/binary"
	"errors"
	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Helpers of this file are named closure… so as not to depend on the other
// test files of the package.

var closureUp = r3.Vec{Z: 1}

// closureBalls returns three 10 mm balls on a circle of radius 50 mm about
// the z axis, at 90°, 210° and 330°: an equilateral triangle centred on the
// origin.
func closureBalls() [3]Ball {
	var bs [3]Ball
	for i := range bs {
		a := (90 + 120*float64(i)) * math.Pi / 180
		bs[i] = Ball{Centre: r3.Vec{X: 0.05 * math.Cos(a), Y: 0.05 * math.Sin(a)}, Radius: 5e-3}
	}
	return bs
}

// closureThreeVees returns the six contacts of the balls in vees of
// half-angle half along the bisectors of their triangle.
func closureThreeVees(t testing.TB, bs [3]Ball, half float64) []Contact {
	t.Helper()
	c, err := BisectorVees(bs, three(Vee{Up: closureUp, HalfAngle: half}))
	if err != nil {
		t.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	return cs
}

// closureHoldDown returns the equilateral three-vee coupling of half-angle
// half plus a pad that pushes straight down (normal −z) at p.
func closureHoldDown(t testing.TB, half float64, p r3.Vec) []Contact {
	t.Helper()
	return append(closureThreeVees(t, closureBalls(), half), Contact{Label: "pad", Point: p, Normal: r3.Vec{Z: -1}})
}

func mustForm(t testing.TB, cs []Contact) Closure {
	t.Helper()
	cl, err := FormClosure(cs)
	if err != nil {
		t.Fatal(err)
	}
	return cl
}

func mustForce(t testing.TB, cs []Contact, mu float64, opt *ClosureOptions) Closure {
	t.Helper()
	cl, err := ForceClosure(cs, mu, opt)
	if err != nil {
		t.Fatal(err)
	}
	return cl
}

// closureRandomUnit returns a random unit vector.
func closureRandomUnit(rng *rand.Rand) r3.Vec {
	for {
		v := r3.Vec{X: 2*rng.Float64() - 1, Y: 2*rng.Float64() - 1, Z: 2*rng.Float64() - 1}
		if l := r3.Norm(v); l > 0.1 && l <= 1 {
			return r3.Scale(1/l, v)
		}
	}
}

// closureRandomBox returns n contacts on the faces of the box [−a, a]³
// (a = 20 mm) about centre: the first six one on each face, the rest on
// random faces; each normal is the face's inward normal tilted by up to
// 35°. About one such set of seven in twenty is form-closed, one of eight
// in six, two of ten in five.
func closureRandomBox(rng *rand.Rand, n int, centre r3.Vec) []Contact {
	const a = 0.02
	cs := make([]Contact, n)
	for i := range cs {
		face := i
		if i >= 6 {
			face = rng.IntN(6)
		}
		axis, sign := face%3, 1.0
		if face >= 3 {
			sign = -1
		}
		p := [3]float64{a * (2*rng.Float64() - 1), a * (2*rng.Float64() - 1), a * (2*rng.Float64() - 1)}
		p[axis] = sign * a
		nn := [3]float64{}
		nn[axis] = -sign
		n := r3.Vec{X: nn[0], Y: nn[1], Z: nn[2]}
		tilt := 0.6 * rng.Float64()
		n = r3.Rotate(n, tilt, r3.Cross(n, closureRandomUnit(rng)))
		cs[i] = Contact{Point: r3.Add(centre, r3.Vec{X: p[0], Y: p[1], Z: p[2]}), Normal: n}
	}
	return cs
}

// closureNormalised returns the 6×N matrix of the unit normalised
// generators: (f, (p − c) × f / L) scaled to unit norm, with c and L the
// Centre and Length of Analyze(cs), for the forces fs[i] at cs[i].Point.
// This is the definition in Closure's documentation, rebuilt here.
func closureNormalised(t testing.TB, cs []Contact, pts []r3.Vec, fs []r3.Vec) *mat.Dense {
	t.Helper()
	an, err := Analyze(cs)
	if err != nil {
		t.Fatal(err)
	}
	a := mat.NewDense(6, len(fs), nil)
	for j, f := range fs {
		f = r3.Unit(f)
		m := r3.Scale(1/an.Length, r3.Cross(r3.Sub(pts[j], an.Centre), f))
		col := []float64{f.X, f.Y, f.Z, m.X, m.Y, m.Z}
		nrm := math.Sqrt(col[0]*col[0] + col[1]*col[1] + col[2]*col[2] + col[3]*col[3] + col[4]*col[4] + col[5]*col[5])
		for r := range col {
			a.Set(r, j, col[r]/nrm)
		}
	}
	return a
}

func closureNormals(cs []Contact) (pts, ns []r3.Vec) {
	for _, c := range cs {
		pts = append(pts, c.Point)
		ns = append(ns, c.Normal)
	}
	return pts, ns
}

// closureBrute solves the closure linear program of Lynch & Park (Modern
// Robotics, 2017, §12.1.7), minimise Σλ subject to Aλ = 0, λ ≥ 1, by
// enumerating every vertex: with λ = 1 + x, each basis B of six columns
// gives x_B = A_B⁻¹(−A·1), the other x zero; the fundamental theorem of
// linear programming puts the optimum, if the program is feasible, at a
// feasible vertex. It returns whether some vertex is feasible and the
// margin N/min Σλ. Independent of any simplex method: gonum's LU solve per
// basis.
func closureBrute(a *mat.Dense) (feasible bool, margin float64) {
	_, n := a.Dims()
	b := mat.NewVecDense(6, nil)
	for j := range n {
		for r := range 6 {
			b.SetVec(r, b.AtVec(r)-a.At(r, j))
		}
	}
	best := math.Inf(1)
	idx := []int{0, 1, 2, 3, 4, 5}
	for {
		ab := mat.NewDense(6, 6, nil)
		for k, j := range idx {
			for r := range 6 {
				ab.Set(r, k, a.At(r, j))
			}
		}
		var lu mat.LU
		lu.Factorize(ab)
		if lu.Cond() < 1e10 {
			var x mat.VecDense
			if err := lu.SolveVecTo(&x, false, b); err == nil {
				ok, sum, big := true, 0.0, 0.0
				for k := range 6 {
					big = max(big, math.Abs(x.AtVec(k)))
				}
				for k := range 6 {
					v := x.AtVec(k)
					if v < -1e-12*(1+big) {
						ok = false
					}
					sum += v
				}
				if ok {
					feasible = true
					best = min(best, float64(n)+sum)
				}
			}
		}
		// Next combination of six indices out of n.
		i := 5
		for i >= 0 && idx[i] == n-6+i {
			i--
		}
		if i < 0 {
			break
		}
		idx[i]++
		for k := i + 1; k < 6; k++ {
			idx[k] = idx[k-1] + 1
		}
	}
	if !feasible {
		return false, 0
	}
	return true, float64(n) / best
}

// closureEscape reports whether a twist ξ ≠ 0 has non-negative power with
// every column of a (every contact opens or slides: an escape motion),
// which is the dual statement of "not closed" (Farkas' lemma). If the
// columns have rank 6 the cone of such twists is pointed, so if it is not
// zero it has an extreme ray, orthogonal to five independent columns: the
// search runs over all five-column subsets, each ray from gonum's SVD.
func closureEscape(a *mat.Dense) bool {
	_, n := a.Dims()
	idx := []int{0, 1, 2, 3, 4}
	for {
		sub := mat.NewDense(5, 6, nil)
		for k, j := range idx {
			for r := range 6 {
				sub.Set(k, r, a.At(r, j))
			}
		}
		var svd mat.SVD
		if svd.Factorize(sub, mat.SVDFull) {
			s := svd.Values(nil)
			if s[4] > 1e-8*s[0] {
				var v mat.Dense
				svd.VTo(&v)
				neg, pos := false, false
				for j := range n {
					var p float64
					for r := range 6 {
						p += v.At(r, 5) * a.At(r, j)
					}
					if p < -1e-10 {
						neg = true
					}
					if p > 1e-10 {
						pos = true
					}
				}
				if !neg || !pos {
					return true
				}
			}
		}
		i := 4
		for i >= 0 && idx[i] == n-5+i {
			i--
		}
		if i < 0 {
			return false
		}
		idx[i]++
		for k := i + 1; k < 5; k++ {
			idx[k] = idx[k-1] + 1
		}
	}
}

// TestClosureSixNever: at least n+1 vectors are needed to positively span
// an n-dimensional space, so first-order form closure of a body in space
// needs at least seven contacts (Lynch & Park, Modern Robotics, 2017,
// §12.1.7, after Reuleaux's planar count of four; Mason, Mechanics of
// Robotic Manipulation, 2001, Theorem 5.5). Six contacts of rank 6 have no
// balancing combination but zero. Checked on bisector three-vee couplings
// of several shapes and half-angles, a socket-vee-flat coupling, and random
// six-contact sets; each has rank 6, so the linear program is reached.
func TestClosureSixNever(t *testing.T) {
	triangles := [][3]Ball{closureBalls(), {
		{Centre: r3.Vec{X: -0.06}, Radius: 5e-3}, {Centre: r3.Vec{X: 0.06}, Radius: 5e-3}, {Centre: r3.Vec{Y: 0.03}, Radius: 5e-3},
	}, {
		{Centre: r3.Vec{X: -0.045, Y: -0.02}, Radius: 4e-3}, {Centre: r3.Vec{X: 0.05, Y: -0.025}, Radius: 4e-3}, {Centre: r3.Vec{X: 0.005, Y: 0.04}, Radius: 4e-3},
	}}
	var sets [][]Contact
	for _, bs := range triangles {
		for _, half := range []float64{0.3, math.Pi / 4, 1.1} {
			sets = append(sets, closureThreeVees(t, bs, half))
		}
	}
	svf, err := SocketVeeFlat(closureBalls(), Trihedral{Up: closureUp, HalfAngle: math.Atan(1 / math.Sqrt2)}, Vee{Up: closureUp, HalfAngle: math.Pi / 4}, Flat{Up: closureUp})
	if err != nil {
		t.Fatal(err)
	}
	cs, err := svf.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	sets = append(sets, cs)
	rng := rand.New(rand.NewPCG(1, 6))
	for range 200 {
		sets = append(sets, closureRandomBox(rng, 6, r3.Vec{}))
	}
	for i, cs := range sets {
		cl := mustForm(t, cs)
		if cl.Rank != 6 {
			t.Errorf("set %d: rank %d, want 6 (the test needs the linear program to run)", i, cl.Rank)
		}
		if cl.Closed || cl.Margin != 0 {
			t.Errorf("set %d of six contacts: %+v, want not closed with margin 0", i, cl)
		}
	}
}

// TestClosureHoldDown: the equilateral three-vee coupling plus a pad that
// pushes down along the vertical line through the coupling centre.
//
// Derivation. A contact normal of a ball passes through the ball's centre
// c, so the two vee normals n± of a ball, each of unit force, make a force
// n₊ + n₋ = 2 sin θ·z (their horizontal parts cancel) along the vertical
// line through c. The six vee forces with unit weights are a single upward
// force 6 sin θ along the vertical through the centroid of the balls, the
// z axis here; the pad's unit force −z along that axis with weight 6 sin θ
// balances it. So weights (1, 1, 1, 1, 1, 1, 6 sin θ), all positive, sum
// the wrenches to zero; with the six vee contacts already of rank 6 the set
// is form-closed (Lynch & Park 2017, §12.1.7).
//
// Margin, by hand. With seven wrenches of rank 6 the balancing weights are
// unique up to scale, so min Σλ over λ ≥ 1 takes λ = λ̂/min λ̂ and
// Margin = 7·min λ̂/Σλ̂, for the weights λ̂ of the normalised generators:
// λ̂ᵢ = λᵢ·gᵢ with gᵢ = |(n, (p − c) × n / L)|. By the coupling's threefold
// symmetry the reference point c of the lines lies on the z axis and the six
// vee lines are at one distance d from it; the pad's line is the axis
// itself. L² = (6d² + 0)/7, so d²/L² = 7/6 and every vee contact has
// g = √(1 + 7/6) = √(13/6), whatever the size and θ; the pad has g = 1.
// Hence λ̂ = (√(13/6) ×6, 6 sin θ) and, when 6 sin θ ≥ √(13/6) (θ ≥ 14.2°),
// Margin = 7√(13/6)/(6√(13/6) + 6 sin θ): 0.788084 for θ = 45°.
//
// Pads elsewhere (the same derivation, with the pad at P): the six vee
// wrenches, each pair with equal weights, make upward forces at the three
// ball centres only (unequal pair weights leave horizontal forces at 120°
// whose sum and moment about the axis cannot both vanish), so they balance
// a downward pad force at P only as the upward forces at the ball centres
// with weights equal to P's barycentric coordinates in the ball triangle:
// closed for P strictly inside the triangle, not closed outside it, and on
// its boundary at the limit (margin 0: not closed).
func TestClosureHoldDown(t *testing.T) {
	g := math.Sqrt(13.0 / 6)
	for _, half := range []float64{math.Pi / 4, math.Pi / 6, 1.2} {
		cl := mustForm(t, closureHoldDown(t, half, r3.Vec{Z: 0.02}))
		want := 7 * g / (6*g + 6*math.Sin(half))
		if !cl.Closed || cl.Rank != 6 || math.Abs(cl.Margin-want) > 1e-9*want {
			t.Errorf("θ = %g: %+v, want closed, rank 6, margin %.9f", half, cl, want)
		}
	}

	bs := closureBalls()
	a, b, c := bs[0].Centre, bs[1].Centre, bs[2].Centre
	for _, tc := range []struct {
		name   string
		p      r3.Vec
		closed bool
	}{
		{"inside, off centre", r3.Add(r3.Scale(0.5, a), r3.Add(r3.Scale(0.3, b), r3.Scale(0.2, c))), true},
		{"near ball B", r3.Add(r3.Scale(0.05, a), r3.Add(r3.Scale(0.9, b), r3.Scale(0.05, c))), true},
		{"outside, beyond edge BC", r3.Scale(-0.8, a), false},
		{"outside, beyond ball A", r3.Scale(1.5, a), false},
		{"on edge AB", r3.Scale(0.5, r3.Add(a, b)), false},
		{"at ball C", c, false},
	} {
		cl := mustForm(t, closureHoldDown(t, math.Pi/4, r3.Add(tc.p, r3.Vec{Z: 0.02})))
		if cl.Closed != tc.closed || cl.Rank != 6 || (!tc.closed && cl.Margin != 0) || (tc.closed && !(cl.Margin > 0.01)) {
			t.Errorf("pad %s: %+v, want closed = %v", tc.name, cl, tc.closed)
		}
	}
}

// TestClosurePlanar is a planar check embedded in space, worked by hand
// (Lynch & Park's planar Example 12.7 could not be found to verify, so this
// stands in for it). A square plate [−1, 1]² (in units of 10 mm) is held in
// its plane by four contacts: on the left edge at height a pushing +x, on
// the right edge at height b pushing −x, on the bottom edge at x = c pushing
// +y, on the top edge at x = d pushing −y. Their planar wrenches (f_x, f_y,
// m_z) are (1, 0, −a), (−1, 0, b), (0, 1, c), (0, −1, −d); the forces
// balance only with λ₁ = λ₂, λ₃ = λ₄, and the moments then need
// λ₁(b − a) + λ₃(c − d) = 0: a positive solution exists exactly when b − a
// and c − d have opposite signs, i.e. when the two couples turn opposite
// ways (Reuleaux's planar criterion in Lynch & Park §12.1.7 terms: no
// centre of rotation is left). a = ½, b = −½, c = ½, d = −½ is closed with
// λ = (1, 1, 1, 1); c = −½, d = ½ is not (both couples clockwise: the
// plate turns clockwise, lifting off every contact).
//
// Out of the plane, three contacts push up (+z) under the corners of an
// equilateral triangle centred on the origin and one pushes down at the
// origin: vertical forces (1, 1, 1) up at the corners and 3 down at the
// centroid balance, and span (F_z, M_x, M_y). In-plane contacts (points in
// z = 0, normals in the plane) have wrenches in (F_x, F_y, M_z) only, the
// others in (F_z, M_x, M_y) only, so the set positively spans space exactly
// when each part spans its own three dimensions: the verdict in space is the
// planar verdict. The in-plane contacts alone have rank 3.
func TestClosurePlanar(t *testing.T) {
	const u = 0.01
	inPlane := func(a, b, c, d float64) []Contact {
		return []Contact{
			{Point: r3.Vec{X: -u, Y: a * u}, Normal: r3.Vec{X: 1}},
			{Point: r3.Vec{X: u, Y: b * u}, Normal: r3.Vec{X: -1}},
			{Point: r3.Vec{X: c * u, Y: -u}, Normal: r3.Vec{Y: 1}},
			{Point: r3.Vec{X: d * u, Y: u}, Normal: r3.Vec{Y: -1}},
		}
	}
	outOfPlane := []Contact{
		{Point: r3.Vec{X: 0.8 * u, Z: -0.2 * u}, Normal: closureUp},
		{Point: r3.Vec{X: -0.4 * u, Y: 0.4 * math.Sqrt(3) * u, Z: -0.2 * u}, Normal: closureUp},
		{Point: r3.Vec{X: -0.4 * u, Y: -0.4 * math.Sqrt(3) * u, Z: -0.2 * u}, Normal: closureUp},
		{Point: r3.Vec{Z: 0.2 * u}, Normal: r3.Vec{Z: -1}},
	}
	for _, tc := range []struct {
		name       string
		a, b, c, d float64
		closed     bool
	}{
		{"opposite couples", 0.5, -0.5, 0.5, -0.5, true},
		{"opposite couples, unequal", 0.7, 0.2, 0.1, -0.9, true},
		{"both couples clockwise", 0.5, -0.5, -0.5, 0.5, false},
		{"both couples anticlockwise", -0.3, 0.6, 0.2, -0.4, false},
	} {
		plane := inPlane(tc.a, tc.b, tc.c, tc.d)
		if cl := mustForm(t, plane); cl.Rank != 3 || cl.Closed {
			t.Errorf("%s, in-plane contacts alone: %+v, want rank 3, not closed", tc.name, cl)
		}
		cl := mustForm(t, append(slices.Clone(plane), outOfPlane...))
		if cl.Closed != tc.closed || cl.Rank != 6 {
			t.Errorf("%s: %+v, want closed = %v, rank 6", tc.name, cl, tc.closed)
		}
	}
}

// TestClosureSevenRandom checks random seven-contact sets against the
// closed form for one redundancy: seven wrenches of rank 6 have a single
// balancing combination (screw's null space, [Analysis].Redundant, from an
// SVD), and they positively span space exactly when its weights all have
// one sign; the margin is then 7·min λ̂/Σλ̂ with λ̂ the weights of the
// normalised generators (see TestClosureHoldDown).
func TestClosureSevenRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 7))
	closed, open := 0, 0
	for range 3000 {
		cs := closureRandomBox(rng, 7, r3.Vec{X: 0.1, Y: -0.3, Z: 0.2})
		an, err := Analyze(cs)
		if err != nil {
			t.Fatal(err)
		}
		if an.Rank != 6 || an.NearSingular {
			continue
		}
		w := an.Redundant[0]
		lam := make([]float64, 7)
		pos, neg := true, true
		for i, c := range cs {
			n := r3.Unit(c.Normal)
			m := r3.Scale(1/an.Length, r3.Cross(r3.Sub(c.Point, an.Centre), n))
			lam[i] = w[i] * math.Sqrt(1+r3.Norm2(m))
			pos = pos && lam[i] > 0
			neg = neg && lam[i] < 0
		}
		if neg {
			for i := range lam {
				lam[i] = -lam[i]
			}
		}
		lo, sum := math.Inf(1), 0.0
		for _, l := range lam {
			lo, sum = min(lo, math.Abs(l)), sum+math.Abs(l)
		}
		if lo < 1e-6*sum {
			continue // too near the boundary for a sign test
		}
		cl := mustForm(t, cs)
		if pos || neg {
			closed++
			if want := 7 * lo / sum; !cl.Closed || math.Abs(cl.Margin-want) > 1e-9 {
				t.Errorf("weights %v: %+v, want closed, margin %.12f", lam, cl, want)
			}
		} else {
			open++
			if cl.Closed || cl.Margin != 0 {
				t.Errorf("weights %v of both signs: %+v, want not closed", lam, cl)
			}
		}
	}
	if closed < 40 || open < 40 {
		t.Fatalf("%d closed and %d open sets: the generator no longer tests both", closed, open)
	}
}

// TestClosureBruteForce checks sets of eight to ten contacts, with and
// without friction, against an exhaustive solution of the same linear
// program (closureBrute, every vertex) and against its dual (closureEscape:
// a set is not closed exactly when some twist opens or slides every
// contact, Farkas' lemma).
func TestClosureBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 10))
	closed, open := 0, 0
	check := func(name string, cl Closure, a *mat.Dense) {
		t.Helper()
		feasible, margin := closureBrute(a)
		escape := closureEscape(a)
		if feasible == escape {
			t.Fatalf("%s: the references disagree (feasible %v, escape %v)", name, feasible, escape)
		}
		if feasible && margin < 1e-6 {
			return // too near the boundary to compare verdicts
		}
		if feasible {
			closed++
		} else {
			open++
		}
		if cl.Closed != feasible || math.Abs(cl.Margin-margin) > 1e-9 {
			t.Errorf("%s: %+v, want closed = %v, margin %.12f", name, cl, feasible, margin)
		}
	}
	for _, n := range []int{8, 9, 10} {
		for range 30 {
			cs := closureRandomBox(rng, n, r3.Vec{Z: 0.05})
			cl := mustForm(t, cs)
			if cl.Rank != 6 {
				continue
			}
			pts, ns := closureNormals(cs)
			check("frictionless", cl, closureNormalised(t, cs, pts, ns))
		}
	}
	// Friction: three or four contacts, four-sided pyramids: each normal
	// and its edges n + μ(cos φ t₁ + sin φ t₂), as documented (15 or 20
	// generators).
	for _, n := range []int{3, 3, 3, 4} {
		for range 10 {
			cs := closureRandomBox(rng, n, r3.Vec{})
			mu := 0.2 + 0.8*rng.Float64()
			for i := range cs {
				cs[i].Tangent = closureRandomUnit(rng)
			}
			cl := mustForce(t, cs, mu, &ClosureOptions{Sides: 4})
			if cl.Rank != 6 {
				t.Fatalf("rank %d of %d friction pyramids, want 6", cl.Rank, n)
			}
			var pts, fs []r3.Vec
			for _, c := range cs {
				nn := r3.Unit(c.Normal)
				t1 := r3.Unit(r3.Sub(c.Tangent, r3.Scale(r3.Dot(c.Tangent, nn), nn)))
				t2 := r3.Cross(nn, t1)
				pts = append(pts, c.Point)
				fs = append(fs, nn)
				for _, e := range []r3.Vec{t1, t2, r3.Scale(-1, t1), r3.Scale(-1, t2)} {
					pts = append(pts, c.Point)
					fs = append(fs, r3.Add(nn, r3.Scale(mu, e)))
				}
			}
			check("friction", cl, closureNormalised(t, cs, pts, fs))
		}
	}
	if closed < 10 || open < 10 {
		t.Fatalf("%d closed and %d open sets: the generator no longer tests both", closed, open)
	}
}

// TestClosureOpposedPairs: six lines of rank 6, each held by two contacts
// pushing towards each other along it. Every generator has an exact
// opposite, so equal loads balance: the program's optimum is N (x = 0, a
// fully degenerate program with b = 0), and Margin is 1, its largest value
// (a mean of 1 cannot have a larger minimum).
func TestClosureOpposedPairs(t *testing.T) {
	const s, a = 0.01, 0.02
	lines := []struct{ p, d r3.Vec }{
		{r3.Vec{Y: s}, r3.Vec{X: 1}}, {r3.Vec{Z: s}, r3.Vec{X: 1}},
		{r3.Vec{Z: s}, r3.Vec{Y: 1}}, {r3.Vec{X: s}, r3.Vec{Y: 1}},
		{r3.Vec{X: s}, r3.Vec{Z: 1}}, {r3.Vec{Y: s}, r3.Vec{Z: 1}},
	}
	var cs []Contact
	for _, l := range lines {
		cs = append(cs,
			Contact{Point: r3.Sub(l.p, r3.Scale(a, l.d)), Normal: l.d},
			Contact{Point: r3.Add(l.p, r3.Scale(a, l.d)), Normal: r3.Scale(-1, l.d)})
	}
	cl := mustForm(t, cs)
	if !cl.Closed || cl.Rank != 6 || math.Abs(cl.Margin-1) > 1e-9 { // exact to 2e-10 (closurePerturb)
		t.Errorf("opposed pairs: %+v, want closed, rank 6, margin 1", cl)
	}
	if cl := mustForm(t, cs[:11]); cl.Closed {
		t.Errorf("one contact of a pair removed: %+v, want not closed (its line is pushed one way only)", cl)
	}
}

// closureWithTangents returns a copy of the coupling's contacts with each
// vee contact's Tangent set to its groove direction (n₊ × n₋, normal to
// both flanks' normals) turned by rot about its normal.
func closureWithTangents(cs []Contact, rot float64) []Contact {
	out := slices.Clone(cs)
	for i := 0; i+1 < len(out); i += 2 {
		g := r3.Unit(r3.Cross(out[i].Normal, out[i+1].Normal))
		for k := i; k < i+2; k++ {
			out[k].Tangent = r3.Rotate(g, rot, out[k].Normal)
		}
	}
	return out
}

// TestClosureFrictionVees: a three-vee coupling of half-angle θ (each
// normal leans θ from the horizontal) with Coulomb friction μ.
//
// Necessary: against a pure upward pull the contacts must push down in
// sum. A contact force N·n plus friction T along the flank's line of
// steepest descent d (unit, tangent, in the plane of n and z, d·z =
// −cos θ) has vertical part N sin θ − T cos θ, negative only if
// T/N > tan θ. So μ_eff ≤ tan θ leaves the pull unresisted: not closed.
//
// Sufficient: with T = N tan θ the two forces of each vee are horizontal,
// equal and opposite along the line joining the vee's contact points: a
// self-balancing squeeze, at angle θ from each normal. If μ_eff > tan θ it
// lies strictly inside every cone, and with the normals already of rank 6
// any wrench is balanced by a large multiple of it plus normal forces:
// closed (the condition of Murray, Li & Sastry 1994, ch. 5 §3: G onto and an
// internal force inside the cones; from memory). Both arguments use
// friction along d only, normal to the groove.
//
// With the pyramid, μ_eff along d is μ if an edge lies along d, μ·cos(π/k)
// if d is halfway between two edges. With Tangent along the groove (φ = 0)
// and k a multiple of 4, edges lie at φ = ±π/2, along ±d (d = ∓n × g): the
// threshold is tan θ exactly. Turned by π/k about n, d falls halfway: the
// threshold is tan θ/cos(π/k). For any other orientation it lies between.
func TestClosureFrictionVees(t *testing.T) {
	const rel = 1e-3
	for _, half := range []float64{math.Pi / 4, math.Pi / 6, 0.4} {
		cs := closureThreeVees(t, closureBalls(), half)
		tan := math.Tan(half)
		for _, tc := range []struct {
			name      string
			sides     int
			rot       float64
			threshold float64
		}{
			{"edge along d, k = 8", 8, 0, tan},
			{"edge along d, k = 12", 12, 0, tan},
			{"d between edges, k = 8", 8, math.Pi / 8, tan / math.Cos(math.Pi/8)},
			{"d between edges, k = 4", 4, math.Pi / 4, tan / math.Cos(math.Pi/4)},
		} {
			tcs := closureWithTangents(cs, tc.rot)
			opt := &ClosureOptions{Sides: tc.sides}
			if cl := mustForce(t, tcs, tc.threshold*(1-rel), opt); cl.Closed || cl.Rank != 6 {
				t.Errorf("θ = %g, %s, μ just below %g: %+v, want not closed, rank 6", half, tc.name, tc.threshold, cl)
			}
			if cl := mustForce(t, tcs, tc.threshold*(1+rel), opt); !cl.Closed || cl.Rank != 6 {
				t.Errorf("θ = %g, %s, μ just above %g: %+v, want closed", half, tc.name, tc.threshold, cl)
			}
		}
		// Any orientation, odd k: open below tan θ, closed above
		// tan θ/cos(π/k).
		rng := rand.New(rand.NewPCG(5, uint64(1000*half)))
		for range 5 {
			tcs := closureWithTangents(cs, 2*math.Pi*rng.Float64())
			opt := &ClosureOptions{Sides: 5}
			if cl := mustForce(t, tcs, tan*(1-rel), opt); cl.Closed {
				t.Errorf("θ = %g, k = 5: closed below tan θ: %+v", half, cl)
			}
			if cl := mustForce(t, tcs, tan/math.Cos(math.Pi/5)*(1+rel), opt); !cl.Closed {
				t.Errorf("θ = %g, k = 5: not closed above tan θ/cos(π/5): %+v", half, cl)
			}
		}
	}
}

// TestClosureFrictionSocket: one ball in a trihedral socket. Its three
// normals meet at the ball's centre (Analyze's Length is zero), so without
// friction the rank is 3; with friction the same two arguments as for a
// vee hold (TestClosureFrictionVees): the pull needs μ_eff > tan θ, and
// three horizontal forces towards the socket axis at the contacts' common
// height, at angle θ from each normal, balance one another (concurrent,
// 120° apart). The seat's Tangent is horizontal, normal to the plane of n
// and z, so with k = 8 an edge lies along the line of steepest descent:
// the threshold is tan θ, for a cube corner tan(atan(1/√2)) = 0.7071.
func TestClosureFrictionSocket(t *testing.T) {
	half := math.Atan(1 / math.Sqrt2)
	c := Coupling{Pairs: []Pair{{Ball: Ball{Centre: r3.Vec{X: 0.3, Y: 0.1, Z: 0.02}, Radius: 6e-3},
		Seat: Trihedral{Up: closureUp, Azimuth: r3.Vec{X: 1}, HalfAngle: half}}}}
	cs, err := c.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	for i := range cs {
		n := cs[i].Normal
		cs[i].Tangent = r3.Unit(r3.Cross(closureUp, r3.Sub(n, r3.Scale(n.Z, closureUp))))
	}
	if cl := mustForm(t, cs); cl.Rank != 3 || cl.Closed {
		t.Errorf("frictionless socket: %+v, want rank 3, not closed", cl)
	}
	tan := math.Tan(half)
	if cl := mustForce(t, cs, tan*0.999, nil); cl.Closed || cl.Rank != 6 {
		t.Errorf("socket, μ just below tan θ: %+v, want not closed, rank 6", cl)
	}
	if cl := mustForce(t, cs, tan*1.001, nil); !cl.Closed || cl.Rank != 6 {
		t.Errorf("socket, μ just above tan θ: %+v, want closed", cl)
	}
}

// TestClosureOptions: nil and the zero value mean eight sides; μ = 0 is
// form closure; friction never loses what the normals hold, and more
// friction never loses closure (each pyramid contains its normal and, for
// the same orientation, every pyramid of smaller μ).
func TestClosureOptions(t *testing.T) {
	cs := closureWithTangents(closureThreeVees(t, closureBalls(), math.Pi/4), 0.3)
	for _, mu := range []float64{0.5, 1.05, 1.2} {
		a, b, c := mustForce(t, cs, mu, nil), mustForce(t, cs, mu, &ClosureOptions{}), mustForce(t, cs, mu, &ClosureOptions{Sides: 8})
		if a != b || a != c {
			t.Errorf("μ = %g: nil %+v, zero %+v, 8 sides %+v differ", mu, a, b, c)
		}
	}
	rng := rand.New(rand.NewPCG(3, 3))
	for range 60 {
		cs := closureRandomBox(rng, 7, r3.Vec{})
		form := mustForm(t, cs)
		if zero := mustForce(t, cs, 0, nil); zero != form {
			t.Errorf("μ = 0: %+v, form closure %+v", zero, form)
		}
		prev := form.Closed && form.Margin > 1e-6
		for _, mu := range []float64{0.05, 0.2, 0.6} {
			cl := mustForce(t, cs, mu, nil)
			if prev && !cl.Closed {
				t.Errorf("μ = %g loses closure held with less friction: %+v", mu, cl)
			}
			prev = cl.Closed && cl.Margin > 1e-6
		}
	}
}

// TestClosureMarginBound checks the bound documented on Closure.Margin on
// random closed sets of seven: a unit wrench u (normalised coordinates) is
// resisted with total load U(u) ≤ (√N + N/Margin)/σ. U(u) is found in
// closed form: with one redundancy λ̂ > 0, the loads that make u are
// λ₀ + sλ̂ (λ₀ gonum's minimum-norm solution), the least total is at the
// smallest s that keeps every load non-negative.
func TestClosureMarginBound(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 13))
	tested := 0
	for range 1500 {
		cs := closureRandomBox(rng, 7, r3.Vec{})
		cl := mustForm(t, cs)
		if !cl.Closed {
			continue
		}
		pts, ns := closureNormals(cs)
		a := closureNormalised(t, cs, pts, ns)
		var svd mat.SVD
		if !svd.Factorize(a, mat.SVDFull) {
			t.Fatal("SVD failed")
		}
		s := svd.Values(nil)
		var v mat.Dense
		svd.VTo(&v)
		lhat := mat.Col(nil, 6, &v) // the null vector
		if lhat[0] < 0 {
			for i := range lhat {
				lhat[i] = -lhat[i]
			}
		}
		bound := (math.Sqrt(7) + 7/cl.Margin) / s[5]
		for range 20 {
			d := make([]float64, 6)
			var nrm float64
			for i := range d {
				d[i] = rng.NormFloat64()
				nrm += d[i] * d[i]
			}
			for i := range d {
				d[i] /= math.Sqrt(nrm)
			}
			var l0 mat.VecDense
			if err := l0.SolveVec(a, mat.NewVecDense(6, d)); err != nil {
				t.Fatal(err)
			}
			sMin := math.Inf(-1)
			for i := range 7 {
				sMin = max(sMin, -l0.AtVec(i)/lhat[i])
			}
			var total float64
			for i := range 7 {
				total += l0.AtVec(i) + sMin*lhat[i]
			}
			if total > bound*(1+1e-12) {
				t.Errorf("U(u) = %g above the bound %g (margin %g, σ %g)", total, bound, cl.Margin, s[5])
			}
		}
		tested++
	}
	if tested < 20 {
		t.Fatalf("only %d closed sets", tested)
	}
}

// closureMoved returns the contacts scaled by s about the origin, rotated
// by angle about axis and moved by off.
func closureMoved(cs []Contact, s, angle float64, axis, off r3.Vec) []Contact {
	out := slices.Clone(cs)
	for i := range out {
		out[i].Point = r3.Add(r3.Rotate(r3.Scale(s, cs[i].Point), angle, axis), off)
		out[i].Normal = r3.Rotate(cs[i].Normal, angle, axis)
		if cs[i].Tangent != (r3.Vec{}) {
			out[i].Tangent = r3.Rotate(cs[i].Tangent, angle, axis)
		}
		out[i].Centre = r3.Add(r3.Rotate(r3.Scale(s, cs[i].Centre), angle, axis), off)
		out[i].Radius *= s
	}
	return out
}

// TestClosureInvariance: the verdict and the margin depend on the shape of
// the design only: the same design in millimetres-as-metres (×1000), moved
// 10 m away, or turned (tangents with it), gives the same verdict, rank
// and margin to 1e-9. Inputs are not modified.
func TestClosureInvariance(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 9))
	sets := [][]Contact{
		closureHoldDown(t, math.Pi/4, r3.Vec{Z: 0.02}),
		closureHoldDown(t, math.Pi/4, r3.Vec{X: 0.01, Y: 0.005, Z: 0.02}),
		closureWithTangents(closureThreeVees(t, closureBalls(), math.Pi/4), 0.2),
	}
	for range 5 {
		cs := closureRandomBox(rng, 8, r3.Vec{})
		for i := range cs {
			cs[i].Tangent = closureRandomUnit(rng) // turned with the design
		}
		sets = append(sets, cs)
	}
	sets[0][6].Tangent, sets[1][6].Tangent = r3.Vec{X: 1}, r3.Vec{Y: 1} // the pads
	axis := r3.Unit(r3.Vec{X: 1, Y: 2, Z: 3})
	for i, cs := range sets {
		orig := slices.Clone(cs)
		form, force := mustForm(t, cs), mustForce(t, cs, 1.2, nil)
		if d := cmp.Diff(orig, cs); d != "" {
			t.Fatalf("set %d modified (-want +got):\n%s", i, d)
		}
		for _, mv := range []struct {
			name        string
			s, angle    float64
			axis, shift r3.Vec
		}{
			{"×1000", 1000, 0, axis, r3.Vec{}},
			{"10 m away", 1, 0, axis, r3.Vec{X: 10, Y: -7, Z: 3}},
			{"×1000, turned, 10 m away", 1000, 2.1, axis, r3.Vec{X: -10}},
		} {
			ms := closureMoved(cs, mv.s, mv.angle, mv.axis, mv.shift)
			for _, pair := range [][2]Closure{{form, mustForm(t, ms)}, {force, mustForce(t, ms, 1.2, nil)}} {
				want, got := pair[0], pair[1]
				if got.Closed != want.Closed || got.Rank != want.Rank || math.Abs(got.Margin-want.Margin) > 1e-9 {
					t.Errorf("set %d %s: %+v, want %+v", i, mv.name, got, want)
				}
			}
		}
	}
	if cl := mustForm(t, sets[0]); !cl.Closed {
		t.Fatal("the invariance check needs closed sets")
	}
}

// TestClosureErrors: bad input names its field and wraps the sentinel.
func TestClosureErrors(t *testing.T) {
	good := closureHoldDown(t, math.Pi/4, r3.Vec{Z: 0.02})
	with := func(i int, f func(*Contact)) []Contact {
		cs := slices.Clone(good)
		f(&cs[i])
		return cs
	}
	nan := math.NaN()
	for _, tc := range []struct {
		name  string
		cs    []Contact
		mu    float64
		opt   *ClosureOptions
		field string
		want  error
	}{
		{"NaN point", with(3, func(c *Contact) { c.Point.Y = nan }), 0.3, nil, "cs[3].Point", ErrNonFinite},
		{"infinite normal", with(1, func(c *Contact) { c.Normal.X = math.Inf(1) }), 0.3, nil, "cs[1].Normal", ErrNonFinite},
		{"zero normal", with(3, func(c *Contact) { c.Normal = r3.Vec{} }), 0.3, nil, "cs[3].Normal", ErrDegenerate},
		{"one contact", good[:1], 0.3, nil, "cs", ErrDegenerate},
		{"no contacts", nil, 0.3, nil, "cs", ErrDegenerate},
		{"point beyond float64", with(2, func(c *Contact) { c.Point.X = 1e300 }), 0.3, nil, "cs[2].Point", ErrRange},
		{"point 1e120 m away", with(2, func(c *Contact) { c.Point.X = 1e120 }), 0.3, nil, "cs[2].Point", ErrRange},
		{"μ = −1", good, -1, nil, "mu", ErrRange},
		{"NaN μ", good, nan, nil, "mu", ErrNonFinite},
		{"infinite μ", good, math.Inf(1), nil, "mu", ErrNonFinite},
		{"Sides = 2", good, 0.3, &ClosureOptions{Sides: 2}, "opt.Sides", ErrRange},
		{"Sides = −8", good, 0.3, &ClosureOptions{Sides: -8}, "opt.Sides", ErrRange},
		{"Sides = 1000", good, 0.3, &ClosureOptions{Sides: 1000}, "opt.Sides", ErrRange},
		{"NaN tangent", with(6, func(c *Contact) { c.Tangent = r3.Vec{X: nan} }), 0.3, nil, "cs[6].Tangent", ErrNonFinite},
		{"tangent along normal", with(6, func(c *Contact) { c.Tangent = r3.Scale(2, c.Normal) }), 0.3, nil, "cs[6].Tangent", ErrDegenerate},
	} {
		check := func(fn string, cl Closure, err error) {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, tc.want) {
				t.Errorf("%s, %s: err = %v, want *InputError for %q wrapping %v", tc.name, fn, err, tc.field, tc.want)
			}
			if cl != (Closure{}) {
				t.Errorf("%s, %s: result %+v with an error", tc.name, fn, cl)
			}
		}
		cl, err := ForceClosure(tc.cs, tc.mu, tc.opt)
		check("ForceClosure", cl, err)
		if tc.field != "mu" && tc.field != "opt.Sides" && tc.field != "cs[6].Tangent" {
			// FormClosure reads neither μ, the options nor Tangent.
			cl, err := FormClosure(tc.cs)
			check("FormClosure", cl, err)
		}
	}
}

// closureEncode encodes contacts as little-endian float64s, nine per
// contact: point, normal, tangent.
func closureEncode(cs []Contact) []byte {
	var b []byte
	for _, c := range cs {
		for _, x := range []float64{c.Point.X, c.Point.Y, c.Point.Z, c.Normal.X, c.Normal.Y, c.Normal.Z, c.Tangent.X, c.Tangent.Y, c.Tangent.Z} {
			b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x))
		}
	}
	return b
}

func closureDecode(b []byte) []Contact {
	var cs []Contact
	for len(b) >= 72 {
		var x [9]float64
		for i := range x {
			x[i] = math.Float64frombits(binary.LittleEndian.Uint64(b[8*i:]))
		}
		cs = append(cs, Contact{Point: r3.Vec{X: x[0], Y: x[1], Z: x[2]}, Normal: r3.Vec{X: x[3], Y: x[4], Z: x[5]}, Tangent: r3.Vec{X: x[6], Y: x[7], Z: x[8]}})
		b = b[72:]
	}
	return cs
}

// FuzzFormClosure checks that FormClosure and ForceClosure never panic on
// any numbers, and that what they return without an error is consistent:
// Rank in 0..6, Margin in [0, 1] and positive exactly when Closed, closure
// only with rank 6 and at least seven contacts without friction, and
// friction never losing a closure that the normals hold with a margin. The
// seeds in testdata/fuzz/FuzzFormClosure include the inputs on which
// gonum's lp.Simplex, tried first, looped for ever (the hold-down coupling
// with μ = 2.7; three contacts with five-sided pyramids), one that loses
// closure to rounding unless the normals stay generators (a pad 4.6e15 m
// away), and a set of condition 4e9 on which the solver reports failure.
func FuzzFormClosure(f *testing.F) {
	f.Add(closureEncode(closureHoldDown(f, math.Pi/4, r3.Vec{Z: 0.02})), 0.3, 8)
	f.Add(closureEncode(closureHoldDown(f, math.Pi/4, r3.Vec{X: 0.08, Z: 0.02})), 0.0, 0)
	f.Add(closureEncode(closureThreeVees(f, closureBalls(), math.Pi/6)), 0.7, 5)
	f.Fuzz(func(t *testing.T, b []byte, mu float64, sides int) {
		cs := closureDecode(b)
		if len(cs) > 16 || sides > 16 {
			return // keep each run small
		}
		consistent := func(name string, cl Closure) {
			if cl.Rank < 0 || cl.Rank > 6 || !(cl.Margin >= 0 && cl.Margin <= 1) || cl.Closed != (cl.Margin > 0) || (cl.Closed && cl.Rank != 6) {
				t.Fatalf("%s: inconsistent %+v", name, cl)
			}
		}
		form, err := FormClosure(cs)
		if err == nil {
			consistent("FormClosure", form)
			if form.Closed && len(cs) < 7 {
				t.Fatalf("%d contacts form-closed: %+v", len(cs), form)
			}
		}
		force, ferr := ForceClosure(cs, mu, &ClosureOptions{Sides: sides})
		if ferr != nil {
			return
		}
		consistent("ForceClosure", force)
		if err == nil && form.Closed && form.Margin > 1e-6 && !force.Closed {
			t.Fatalf("friction μ = %g loses closure: form %+v, force %+v", mu, form, force)
		}
	})
}

var sinkClosure Closure

// BenchmarkFormClosure measures form closure of seven contacts: the
// three-vee coupling with a hold-down pad that closes it, and one off to
// the side that does not (the linear program is infeasible).
func BenchmarkFormClosure(b *testing.B) {
	for _, bc := range []struct {
		name string
		p    r3.Vec
	}{{"closed", r3.Vec{Z: 0.02}}, {"open", r3.Vec{X: 0.08, Z: 0.02}}} {
		cs := closureHoldDown(b, math.Pi/4, bc.p)
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				cl, err := FormClosure(cs)
				if err != nil {
					b.Fatal(err)
				}
				sinkClosure = cl
			}
		})
	}
}

// BenchmarkForceClosure measures force closure of the same seven contacts
// with μ = 0.3 and pyramids of 8 and 16 sides (56 and 112 edges).
func BenchmarkForceClosure(b *testing.B) {
	cs := closureHoldDown(b, math.Pi/4, r3.Vec{X: 0.01, Z: 0.02})
	for _, bc := range []struct {
		name  string
		sides int
	}{{"sides=8", 8}, {"sides=16", 16}} {
		opt := &ClosureOptions{Sides: bc.sides}
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				cl, err := ForceClosure(cs, 0.3, opt)
				if err != nil {
					b.Fatal(err)
				}
				sinkClosure = cl
			}
		})
	}
}

// lpDataDir, when set (go test ./kinematic/ -run WriteLP -args -lpdata
// ../internal/lp/testdata/programs), is where TestWriteLPClosurePrograms and
// TestWriteLPSizingPrograms write the linear programs of the fuzz corpora,
// the degenerate programs of internal/lp's tests.
var lpDataDir = flag.String("lpdata", "", "directory to write the linear programs of the fuzz corpora into")

// lpWrite writes the program minimise cᵀx, A·x = b, x ≥ 0 (A m×n,
// column-major) into dir/name.txt, every number exactly (shortest
// round-trip decimal), after comment lines naming its source.
func lpWrite(t *testing.T, name string, comment []string, c, a, b []float64) {
	t.Helper()
	var sb strings.Builder
	for _, l := range comment {
		fmt.Fprintf(&sb, "# %s\n", l)
	}
	fmt.Fprintf(&sb, "m %d\nn %d\n", len(b), len(c))
	for _, row := range []struct {
		name string
		v    []float64
	}{{"c", c}, {"b", b}, {"a", a}} {
		sb.WriteString(row.name)
		for _, v := range row.v {
			sb.WriteString(" " + strconv.FormatFloat(v, 'g', -1, 64))
		}
		sb.WriteString("\n")
	}
	if err := os.WriteFile(filepath.Join(*lpDataDir, name+".txt"), []byte(sb.String()), 0o644); err != nil {
		t.Fatal(err)
	}
}

// lpCorpus returns the values of the fuzz corpus file path: the []byte,
// float64 and int lines of the "go test fuzz v1" format.
func lpCorpus(t *testing.T, path string) (b []byte, fs []float64, is []int) {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	for _, l := range strings.Split(strings.TrimSpace(string(data)), "\n")[1:] {
		open, close := strings.IndexByte(l, '('), strings.LastIndexByte(l, ')')
		arg := l[open+1 : close]
		switch l[:open] {
		case "[]byte":
			s, err := strconv.Unquote(arg)
			if err != nil {
				t.Fatal(err)
			}
			b = []byte(s)
		case "float64":
			v, err := strconv.ParseFloat(arg, 64)
			if err != nil {
				t.Fatal(err)
			}
			fs = append(fs, v)
		case "int":
			v, err := strconv.Atoi(arg)
			if err != nil {
				t.Fatal(err)
			}
			is = append(is, v)
		}
	}
	return b, fs, is
}

// TestWriteLPClosurePrograms writes the closure programs of the
// FuzzFormClosure corpus (see lpDataDir): for each input whose generators
// have rank 6, the program of FormClosure and, with friction, that of
// ForceClosure, each with the bounds λ ≥ 1 as gonum's lp.Simplex was given
// them before the closure solver of its own (b = −Σŵⱼ, the most degenerate
// form) and with the raised bounds of closureBounds.
func TestWriteLPClosurePrograms(t *testing.T) {
	if *lpDataDir == "" {
		t.Skip("writes files only with -lpdata")
	}
	paths, _ := filepath.Glob("testdata/fuzz/FuzzFormClosure/*")
	for _, path := range paths {
		b, fs, is := lpCorpus(t, path)
		cs := closureDecode(b)
		mu, k := fs[0], is[0]
		if k == 0 {
			k = closureSides
		}
		an, err := Analyze(cs)
		if err != nil {
			continue
		}
		progs := map[string][]float64{}
		if an.Rank == 6 && an.Length > 0 {
			form := make([]float64, 6*len(cs))
			for j, c := range cs {
				n, _ := linalg.Unit3(c.Normal)
				closureColumn(form[6*j:6*j+6], c.Point, n, an.Centre, an.Length)
			}
			progs["form"] = form
		}
		if mu > 0 {
			t1s := make([]r3.Vec, len(cs))
			for i, c := range cs {
				if t1s[i], err = closureTangent(c, "t"); err != nil {
					t.Fatal(err)
				}
			}
			progs["force"] = forceGenerators(cs, t1s, an.Centre, an.Length, mu, k)
		}
		for kind, a := range progs {
			if rank, _ := closureRank(a); rank < 6 {
				continue
			}
			n := len(a) / 6
			ones := make([]float64, n)
			var b1 [6]float64
			for j := range n {
				ones[j] = 1
				for r := range 6 {
					b1[r] -= a[6*j+r]
				}
			}
			_, bl := closureBounds(a)
			src := fmt.Sprintf("kinematic/%s, %d contacts, mu %g, %d sides", filepath.ToSlash(path), len(cs), mu, k)
			lpWrite(t, kind+"-"+filepath.Base(path)+"-unperturbed", []string{
				"The " + kind + " closure program of " + src + ":",
				"minimise Σλ subject to Σλⱼŵⱼ = 0, λ ≥ 1, as x = λ − 1 (b = −Σŵⱼ), written by TestWriteLPClosurePrograms.",
			}, ones, a, b1[:])
			lpWrite(t, kind+"-"+filepath.Base(path)+"-perturbed", []string{
				"The " + kind + " closure program of " + src + ":",
				"minimise Σλ subject to Σλⱼŵⱼ = 0, λ ≥ l (closureBounds), as x = λ − l, written by TestWriteLPClosurePrograms.",
			}, ones, a, bl[:])
		}
	}
}
