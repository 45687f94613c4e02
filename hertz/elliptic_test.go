package hertz

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/mathext"
)

// TestAGMAgainstGonum checks K(m) and E(m) from agm against gonum's
// mathext.CompleteK and CompleteE (Fukushima 2015) where 1 − m is exact, and
// against gonum's Carlson forms K = R_F(0, k'², 1),
// E = R_F(0, k'², 1) − (m/3) R_D(0, k'², 1) (DLMF 19.25.1) for every k'.
func TestAGMAgainstGonum(t *testing.T) {
	for _, kp := range []float64{1, 0.999999, 0.99, 0.9, 0.75, 0.5, 0.3, 0.1, 0.01, 1e-4, 1e-8, 1e-12} {
		m := (1 - kp) * (1 + kp)
		mp := kp * kp
		K, V := agm(kp, m)
		E := K * (1 - m/2 - m*m*V)
		wantK := mathext.EllipticRF(0, mp, 1)
		wantE := wantK - m/3*mathext.EllipticRD(0, mp, 1)
		if d := relDiff(K, wantK); d > 1e-14 {
			t.Errorf("k'=%g: K = %.17g, Carlson %.17g (rel %.2g)", kp, K, wantK, d)
		}
		if d := relDiff(E, wantE); d > 1e-14 {
			t.Errorf("k'=%g: E = %.17g, Carlson %.17g (rel %.2g)", kp, E, wantE, d)
		}
		if kp >= 0.1 { // 1 − m exact enough for gonum's parameter form
			if d := relDiff(K, mathext.CompleteK(m)); d > 1e-14 {
				t.Errorf("k'=%g: K = %.17g, CompleteK %.17g", kp, K, mathext.CompleteK(m))
			}
			if d := relDiff(E, mathext.CompleteE(m)); d > 1e-14 {
				t.Errorf("k'=%g: E = %.17g, CompleteE %.17g", kp, E, mathext.CompleteE(m))
			}
		}
	}
}

// TestAGMCircle checks the exact values at m = 0: K = E = π/2 (DLMF 19.6.1)
// and the tail sum V(0) = 1/16, which makes (K − E)/m = (E − k'²K)/m = π/4
// (from the power series of K and E, Abramowitz & Stegun 1964, 17.3.11–12).
func TestAGMCircle(t *testing.T) {
	K, V := agm(1, 0)
	if K != math.Pi/2 || V != 1.0/16 {
		t.Errorf("agm(1, 0) = %v, %v; want π/2, 1/16", K, V)
	}
	s := solveShape(0)
	if s.t != 0 || s.kp != 1 || s.m != 0 || s.K != math.Pi/2 || s.E != math.Pi/2 || s.P != math.Pi/4 || s.Q != math.Pi/4 {
		t.Errorf("circle shape = %+v", s)
	}
}

// TestLegendreRelation checks E(m)K(1−m) + E(1−m)K(m) − K(m)K(1−m) = π/2
// (Legendre's relation, DLMF 19.7.1), with both arguments from agm.
func TestLegendreRelation(t *testing.T) {
	for _, kp := range []float64{0.999, 0.9, 0.7071067811865476, 0.5, 0.2, 0.05, 1e-3, 1e-6} {
		k := math.Sqrt((1 - kp) * (1 + kp))
		K, V := agm(kp, k*k)
		E := K * (1 - k*k/2 - k*k*k*k*V)
		Kc, Vc := agm(k, kp*kp)
		Ec := Kc * (1 - kp*kp/2 - kp*kp*kp*kp*Vc)
		if got := E*Kc + Ec*K - K*Kc; relDiff(got, math.Pi/2) > 1e-14 {
			t.Errorf("k'=%g: Legendre's relation gives %.17g, want π/2", kp, got)
		}
	}
}

// TestRDPair checks rdPair against gonum's mathext.EllipticRD (Carlson 1995).
func TestRDPair(t *testing.T) {
	for _, c := range [][3]float64{
		{0, 1, 1}, {0, 1, 2}, {0.25, 1.25, 9.25}, {1e-6, 1, 1e6}, {4, 5, 5}, {0.5, 1.5, 1e14}, {3, 2, 1},
	} {
		z, y := rdPair(c[0], c[1], c[2])
		wz := mathext.EllipticRD(c[0], c[1], c[2])
		wy := mathext.EllipticRD(c[0], c[2], c[1])
		if relDiff(z, wz) > 4e-15 || relDiff(y, wy) > 4e-15 {
			t.Errorf("rdPair%v = %.17g, %.17g; EllipticRD %.17g, %.17g", c, z, y, wz, wy)
		}
	}
}

// TestShapeSolvesHertzCondition checks the solved eccentricity against
// Hertz's condition B/A = [(a/b)²E − K]/(K − E) (Johnson 1985, §3.5,
// eq. 3.59 with eq. 3.58), evaluated independently with gonum's Carlson
// integrals as B/A = R_D(0, 1, k'²)/R_D(0, k'², 1) (DLMF 19.25.1), and the
// returned K and E against the same integrals, for 1 < B/A ≤ 1e14.
func TestShapeSolvesHertzCondition(t *testing.T) {
	for _, ratio := range []float64{1.001, 1.01, 1.1, 1.5, 2, 3, 5, 10, 30, 100, 1e3, 1e4, 1e5, 1e6, 1e8, 1e10, 1e12, 1e14} {
		s := solveShape(ratio - 1)
		mp := s.kp * s.kp
		rd1 := mathext.EllipticRD(0, 1, mp)
		rd2 := mathext.EllipticRD(0, mp, 1)
		// The condition in the form (B/A − 1), which keeps its relative
		// precision near the circle: (rd1 − rd2)/rd2.
		if d := relDiff((rd1-rd2)/rd2, ratio-1); d > 1e-12 {
			t.Errorf("B/A = %g: residual %.2g relative to B/A − 1", ratio, d)
		}
		K := mathext.EllipticRF(0, mp, 1)
		E := K - s.m/3*rd2
		if relDiff(s.K, K) > 1e-13 || relDiff(s.E, E) > 1e-13 {
			t.Errorf("B/A = %g: K, E = %.17g, %.17g; Carlson %.17g, %.17g", ratio, s.K, s.E, K, E)
		}
		if relDiff(s.P, (K-E)/s.m) > 1e-12 || relDiff(s.Q, (E-mp*K)/s.m) > 1e-12 {
			t.Errorf("B/A = %g: P, Q = %g, %g; want %g, %g", ratio, s.P, s.Q, (K-E)/s.m, (E-mp*K)/s.m)
		}
		// exp(−t) carries the rounding of t, about 1e-16·t relative.
		if relDiff(math.Exp(-s.t), s.kp) > 1e-15*(1+s.t) || relDiff(-math.Expm1(-2*s.t), s.m) > 1e-14 {
			t.Errorf("B/A = %g: t, k', m inconsistent: %+v", ratio, s)
		}
	}
}

// TestShapeNearCircle checks the near-circular limit, where the condition
// is 0/0: from the power series of K and E (Abramowitz & Stegun 1964,
// 17.3.11–12), B/A − 1 = (3/4)e² + O(e⁴) and ln(a/b) = e²/2 + O(e⁴), so
// ln(a/b) = (2/3)(B/A − 1) + O((B/A − 1)²).
func TestShapeNearCircle(t *testing.T) {
	for _, d := range []float64{1e-300, 1e-100, 1e-16, 1e-12, 1e-9, 1e-7} {
		s := solveShape(d)
		if rel := relDiff(s.t, 2*d/3); rel > 2*d+1e-15 {
			t.Errorf("B/A − 1 = %g: ln(a/b) = %.17g, want ≈ %.17g (rel %.2g)", d, s.t, 2*d/3, rel)
		}
		if relDiff(s.K, math.Pi/2) > d+1e-15 || relDiff(s.E, math.Pi/2) > d+1e-15 {
			t.Errorf("B/A − 1 = %g: K, E = %v, %v; want ≈ π/2", d, s.K, s.E)
		}
	}
}

// TestShapeTable checks that the starting table of solveShape holds
// solutions and interpolates them. The condition of the shape is
// φ(t) = 2t − 2 artanh(2mV) − x = 0 (see solveShape), so the x that a value
// t solves is X(t) = 2t − 2 artanh(2mV(t)), and along the table u = √x:
//
//   - each node t solves the condition at its x = u² (residual to
//     rounding);
//   - each node's slope dt/du = 2u/X'(t), with X'(t) by a central
//     difference of step h = 1e-4·t (truncation ~h²X”'/6 and rounding
//     ~ε X/h, both below 1e-7 relative here); at u = 0, t ≈ 2u²/3 gives
//     dt/du = 0;
//   - between nodes the Hermite interpolation of initialT, at the
//     midpoints where its error is largest, is within 1e-5·(1 + t) of the
//     solution, found here by bisection of X(t) = x between the
//     neighbouring nodes (X rises with t). initialT's comment claims
//     "about 1e-6"; the largest error at the midpoints is 6e-6 (u = 0.875,
//     1.875), so the bound is the claim's order of magnitude.
func TestShapeTable(t *testing.T) {
	bigX := func(tt float64) float64 {
		s, V := shapeAt(tt)
		return 2*tt - 2*math.Atanh(2*s.m*V)
	}
	for i, row := range shapeTable {
		u := float64(i) * shapeStep
		x := u * u
		if i == 0 {
			if row != [2]float64{0, 0} {
				t.Errorf("node 0: %v, want t = 0 and dt/du = 0 (the circle)", row)
			}
		} else {
			s, V := shapeAt(row[0])
			phi := 2*row[0] - 2*math.Atanh(2*s.m*V) - x
			if math.Abs(phi) > 1e-14*(1+x) {
				t.Errorf("node %d: condition residual %.2g", i, phi)
			}
			h := 1e-4 * row[0]
			slope := 2 * u / ((bigX(row[0]+h) - bigX(row[0]-h)) / (2 * h))
			if math.Abs(row[1]-slope) > 1e-7*row[1] {
				t.Errorf("node %d: dt/du = %.12g in the table, %.12g from the condition", i, row[1], slope)
			}
		}
		if i == len(shapeTable)-1 {
			continue
		}
		um := u + shapeStep/2
		xm := um * um
		lo, hi := row[0], shapeTable[i+1][0]
		for range 200 {
			mid := (lo + hi) / 2
			if mid == lo || mid == hi {
				break
			}
			if bigX(mid) < xm {
				lo = mid
			} else {
				hi = mid
			}
		}
		if got := initialT(xm); math.Abs(got-lo) > 1e-5*(1+lo) {
			t.Errorf("u = %g: initialT = %.12g, solution %.12g", um, got, lo)
		}
	}
}

// TestGaussLegendreNodes checks the hard-coded Gauss–Legendre rules against
// gonum's quad.Legendre (Bogaert 2014).
func TestGaussLegendreNodes(t *testing.T) {
	for _, rule := range []struct{ x, w []float64 }{
		{gl4x[:], gl4w[:]}, {gl6x[:], gl6w[:]}, {gl8x[:], gl8w[:]},
	} {
		n := 2 * len(rule.x)
		x := make([]float64, n)
		w := make([]float64, n)
		quad.Legendre{}.FixedLocations(x, w, -1, 1)
		for i := range rule.x {
			j := n/2 + i // the rules are symmetric; compare magnitudes
			if math.Abs(math.Abs(x[j])-rule.x[i]) > 1e-15 || math.Abs(w[j]-rule.w[i]) > 1e-15 {
				t.Errorf("%d-point rule, node %d: %v, %v; gonum %v, %v", n, i, rule.x[i], rule.w[i], x[j], w[j])
			}
		}
	}
}

// TestCarriedIntegrals checks I_a and I_b carried by Gauss–Legendre
// quadrature from an anchor against Carlson's algorithm at the new depth.
func TestCarriedIntegrals(t *testing.T) {
	for _, r := range []float64{1, 3, 1e3, 5e7} {
		for _, z0 := range []float64{0, 0.3, 0.8, 2} {
			ia0, ib0 := axisIntegrals(r, z0)
			for _, dz := range []float64{-0.4, -0.1, -0.01, 0.001, 0.004, 0.03, 0.09, 0.2, 0.4} {
				z1 := z0 + dz
				if z1 < 0 {
					continue
				}
				da, db := glIntegrate(r, z0, z1)
				ia, ib := axisIntegrals(r, z1)
				if relDiff(ia0+da, ia) > 2e-15 || relDiff(ib0+db, ib) > 2e-15 {
					t.Errorf("r=%g %g→%g: carried %.17g, %.17g; Carlson %.17g, %.17g", r, z0, z1, ia0+da, ib0+db, ia, ib)
				}
			}
		}
	}
}
