package hertz

import (
	"fmt"
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// curvTol is the relative size, against the sum of the magnitudes of the
// curvature terms, below which a half relative curvature A or B cannot be
// told from zero: forming A = (M − D)/2 from the inputs commits a few
// rounding errors of that sum (1/R, the means and differences, cos 2θ and
// sin 2θ, the hypotenuse), each at most ε = 2⁻⁵²; 32ε covers them with a
// wide margin. B/A is therefore at most about 1/(32ε) ≈ 1.4e14.
const curvTol = 32 * 0x1p-52

// Pair is two bodies prepared for contact: validated once, with the part of
// Hertz's solution that does not depend on the load (the relative
// curvatures, the effective moduli and the shape of the contact ellipse)
// solved once. It is the path for evaluating the same two bodies at many
// loads: Pair.Contact costs a cube root and a few divisions, allocates
// nothing and gives the same numbers as Solve.
//
// A Pair is a small value that copies freely and keeps no reference to the
// bodies it was made from. The zero Pair is not a pair of bodies: its
// methods return an *InputError for the field "p" wrapping ErrDegenerate.
type Pair struct {
	a, b         float64    // Johnson's half relative curvatures A ≤ B, 1/m
	angle        float64    // direction of the major axis, rad, in [0, π)
	estar, gstar float64    // effective moduli E*, G*, Pa
	nu           [2]float64 // Poisson's ratios of body 1 and body 2
	minR         float64    // smallest finite |radius|, m, +Inf if none
	sh           ellipseShape
	a3           float64 // a³/F, m³/N; 0 only in the zero Pair
}

// NewPair returns bodies b1 and b2 prepared for Hertz contact at any load.
// Errors are those of Solve for the bodies: *InputError naming a field of
// b1 or b2 (or "b1, b2" for the two together) and wrapping ErrNonFinite,
// ErrRange, ErrLineContact or ErrGeometry. ErrRange also covers a Young's
// modulus so small that its compliance overflows ("b1.Material.E"),
// effective moduli outside the normal float64 range
// ("b1.Material, b2.Material") and a contact size a³/F outside it
// ("b1, b2"). The inputs are not modified.
func NewPair(b1, b2 Body) (Pair, error) {
	m1, c1, s1, err := bodyTerms(&b1, "b1")
	if err != nil {
		return Pair{}, err
	}
	m2, c2, s2, err := bodyTerms(&b2, "b2")
	if err != nil {
		return Pair{}, err
	}
	n1, g1 := compliance(&b1.Material)
	n2, g2 := n1, g1
	if b2.Material.E != b1.Material.E || b2.Material.Nu != b1.Material.Nu {
		n2, g2 = compliance(&b2.Material)
	}
	if !(n1 <= math.MaxFloat64 && g1 <= math.MaxFloat64) {
		return Pair{}, rangeErr("b1.Material.E", "Young's modulus %g Pa is too small for floating point: its compliance overflows", b1.Material.E)
	}
	if !(n2 <= math.MaxFloat64 && g2 <= math.MaxFloat64) {
		return Pair{}, rangeErr("b2.Material.E", "Young's modulus %g Pa is too small for floating point: its compliance overflows", b2.Material.E)
	}
	if math.IsInf(b1.Material.E, 1) && math.IsInf(b2.Material.E, 1) { // not n1+n2 == 0, which may underflow
		return Pair{}, &InputError{Field: "b1.Material.E, b2.Material.E", Err: fmt.Errorf("%w: both bodies are rigid (E = +Inf)", ErrGeometry)}
	}

	// Relative curvature: the gap between the surfaces is Ax² + By² in
	// the principal frame (Johnson 1985, §4.1). With each
	// body's curvature tensor written as mean·I + half-difference
	// rotated by 2θ, the sum has eigenvalues M ± D.
	M := m1 + m2
	dc, ds := c1+c2, s1+s2
	D := 0.0
	if dc != 0 || ds != 0 {
		D = math.Hypot(dc, ds)
	}
	scale := math.Abs(m1) + math.Abs(m2) + math.Abs(c1) + math.Abs(s1) + math.Abs(c2) + math.Abs(s2)
	A, B := (M-D)/2, (M+D)/2
	if M-M != 0 || D-D != 0 { // not finite
		return Pair{}, rangeErr("b1, b2", "curvatures overflow the floating-point range")
	}
	switch tol := curvTol * scale; {
	case B < -tol:
		return Pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: a concave surface is tighter than the convex one in every direction, as a socket smaller than the ball (half relative curvatures A = %g, B = %g 1/m)", ErrGeometry, A, B)}
	case A < -tol:
		return Pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: a concave surface is tighter than the convex one in one direction (half relative curvature A = %g 1/m < 0)", ErrGeometry, A)}
	case B <= tol:
		return Pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: the surfaces conform in every direction, as flat on flat or a socket of the ball's radius (half relative curvatures A = %g, B = %g 1/m)", ErrGeometry, A, B)}
	case A <= tol:
		return Pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: the relative curvature vanishes along one direction (A = %g, B = %g 1/m); the bodies touch along a line, not at a point", ErrLineContact, A, B)}
	}

	p := Pair{
		a: A, b: B,
		estar: 1 / (n1 + n2),
		gstar: 1 / (g1 + g2),
		nu:    [2]float64{b1.Material.Nu, b2.Material.Nu},
		minR:  minAbsRadius(&b1, &b2),
	}
	if !normal(p.estar) || !normal(p.gstar) {
		return Pair{}, rangeErr("b1.Material, b2.Material", "effective moduli E* = %g, G* = %g Pa outside the normal floating-point range", p.estar, p.gstar)
	}
	if D > 0 {
		// The larger eigenvalue M + D has its eigenvector at φ =
		// atan2(ds, dc)/2; the major axis lies along the smaller one.
		p.angle = modPi(math.Atan2(ds, dc)/2 + 3*math.Pi/2)
	}
	p.sh = solveShape(D / A)
	// a·b² = 3F E(e)/(2π E* (A+B)) (Johnson 1985, §3.5) with b = k'a. The
	// partial products of den only shrink after the first (k' ≤ 1), so a
	// normal den has no underflow on the way.
	den := 2 * math.Pi * p.estar * M * p.sh.kp * p.sh.kp
	p.a3 = 3 * p.sh.E / den
	if !normal(den) || !normal(p.a3) {
		return Pair{}, rangeErr("b1, b2", "contact size a³/F = %g m³/N outside the normal floating-point range", p.a3)
	}
	return p, nil
}

// modPi returns math.Mod(x, math.Pi) for 0 ≤ x < 4π without the division
// loop: x − π and x − 2π are exact in that range (Sterbenz's lemma), as
// math.Mod is.
func modPi(x float64) float64 {
	switch {
	case x < math.Pi:
		return x
	case x < 2*math.Pi:
		return x - math.Pi
	}
	return x - 2*math.Pi
}

// minAbsRadius returns the smallest |radius| of two validated bodies (+Inf
// if all four are straight). The radii are not NaN, so plain comparisons
// serve.
func minAbsRadius(b1, b2 *Body) float64 {
	r := math.Abs(b1.R1)
	for _, x := range [...]float64{b1.R2, b2.R1, b2.R2} {
		if x = math.Abs(x); x < r {
			r = x
		}
	}
	return r
}

// check reports, as an error, a Pair that was not made by NewPair.
func (p *Pair) check() error {
	if p.a3 == 0 {
		return inputErr("p", ErrDegenerate, "Pair not made by NewPair")
	}
	return nil
}

// checkLoadArg validates the load argument of the Pair methods.
func checkLoadArg(load float64) error {
	if !linalg.Finite(load) {
		return nonFiniteErr("load", "normal load must be finite and ≥ 0, got %g", load)
	}
	if load < 0 {
		return rangeErr("load", "normal load must be finite and ≥ 0, got %g", load)
	}
	if load > 0 && load < minNormal {
		return rangeErr("load", "normal load %g N is subnormal (below 2.2e-308 N), where float64 loses precision", load)
	}
	return nil
}

// Contact returns the Hertz contact of the pair under the normal load, in
// newtons, without the subsurface stresses: Stress is left zero. Every other
// field is the one Solve returns for the same bodies and load (the same
// float64 values): the ellipse, the pressures, the approach, the
// stiffness, EStar, GStar, A, B and Valid. A zero load gives a contact of
// zero size with MajorAngle, A, B, EStar and GStar set.
//
// Errors are *InputError for the field "load" wrapping ErrNonFinite (NaN
// or infinite) or ErrRange (negative; subnormal, below 2.2e-308 N; or a
// contact whose sizes, pressures, approach or stiffness would overflow or
// underflow the normal float64 range, which keeps every answer at full
// precision), or ErrDegenerate for the zero Pair. Contact allocates nothing
// unless it returns an error.
func (p Pair) Contact(load float64) (c Contact, err error) {
	if err := p.check(); err != nil {
		return Contact{}, err
	}
	if err := checkLoadArg(load); err != nil {
		return Contact{}, err
	}
	if !p.contact(load, &c) {
		return Contact{}, rangeErr("load", "contact of load %g N is outside the normal floating-point range", load)
	}
	return c, nil
}

// Solve returns the Hertz contact of the pair under the normal load, in
// newtons, with the subsurface stresses: the result of the package-level
// Solve for the bodies the pair was made from. Errors are those of
// Pair.Contact, and ErrRange for "load" when a stress would leave the
// normal float64 range (a peak pressure within a factor of about 5 of
// either end of it).
func (p Pair) Solve(load float64) (Contact, error) {
	c, err := p.Contact(load)
	if err != nil || load == 0 {
		return c, err
	}
	p.stresses(&c)
	for _, st := range c.Stress {
		if !normal(st.MaxShear) || !normal(st.MaxVonMises) {
			return Contact{}, rangeErr("load", "stresses under load %g N (peak pressure %g Pa) outside the normal floating-point range", load, c.PeakPressure)
		}
	}
	return c, nil
}

// LoadForPressure returns the normal load, in newtons, at which the pair
// reaches the peak contact pressure p0, in pascals. Since p0 ∝ F^(1/3),
// the load is exact (to rounding) and p0 = 0 gives 0. Errors are
// *InputError for the field "p0" wrapping ErrNonFinite or ErrRange (not
// finite, negative, or a load that would overflow or underflow the normal
// float64 range), or ErrDegenerate for the zero Pair.
func (p Pair) LoadForPressure(p0 float64) (float64, error) {
	if err := p.check(); err != nil {
		return 0, err
	}
	if !linalg.Finite(p0) {
		return 0, nonFiniteErr("p0", "peak pressure must be finite and ≥ 0, got %g", p0)
	}
	if p0 < 0 {
		return 0, rangeErr("p0", "peak pressure must be finite and ≥ 0, got %g", p0)
	}
	if p0 == 0 {
		return 0, nil
	}
	// p0 = 3F/(2π a b) with a = (a3 F)^(1/3), b = k' a. a3 is normal, so
	// 2π ca² k' is (above 1e-213); x is normal when F is.
	ca := math.Cbrt(p.a3)
	x := 2 * math.Pi * ca * ca * p.sh.kp * p0 / 3
	F := x * x * x
	if !normal(F) {
		return 0, rangeErr("p0", "load for peak pressure %g Pa is outside the normal floating-point range", p0)
	}
	return F, nil
}

// LoadForApproach returns the normal load, in newtons, at which the pair
// reaches the mutual approach delta, in metres. Since δ ∝ F^(2/3), the
// load is exact (to rounding) and delta = 0 gives 0. Errors are
// *InputError for the field "delta" wrapping ErrNonFinite or ErrRange (not
// finite, negative, or a load that would overflow or underflow the normal
// float64 range), or ErrDegenerate for the zero Pair.
func (p Pair) LoadForApproach(delta float64) (float64, error) {
	if err := p.check(); err != nil {
		return 0, err
	}
	if !linalg.Finite(delta) {
		return 0, nonFiniteErr("delta", "approach must be finite and ≥ 0, got %g", delta)
	}
	if delta < 0 {
		return 0, rangeErr("delta", "approach must be finite and ≥ 0, got %g", delta)
	}
	if delta == 0 {
		return 0, nil
	}
	// δ = 3 F K/(2π a E*) with a = (a3 F)^(1/3): F^(2/3) = 2π a3^(1/3) E* δ/(3K).
	y := 2 * math.Pi * math.Cbrt(p.a3) * p.estar
	x := y * delta / (3 * p.sh.K)
	F := x * math.Sqrt(x)
	if !normal(y) || !normal(F) {
		return 0, rangeErr("delta", "load for approach %g m is outside the normal floating-point range", delta)
	}
	return F, nil
}

// contact sets the fields of c, which must be zero, to the contact at load
// F (0 or normal) without the subsurface stresses, and reports whether the
// sizes, pressures, approach and stiffness, and the products they are
// divided by, are normal float64 numbers (so that no underflow has cost
// precision and nothing overflowed).
func (p *Pair) contact(F float64, c *Contact) bool {
	c.Load, c.MajorAngle, c.EStar, c.GStar, c.A, c.B = F, p.angle, p.estar, p.gstar, p.a, p.b
	c.Valid = true
	if F == 0 {
		return true
	}
	var a float64
	if x := p.a3 * F; normal(x) {
		a = math.Cbrt(x)
	} else {
		// a³ leaves the normal range though a need not: the product of
		// the cube roots, within a few ulp.
		a = math.Cbrt(p.a3) * math.Cbrt(F)
	}
	b := a * p.sh.kp
	c.SemiMajor, c.SemiMinor = a, b
	d1 := 2 * math.Pi * a * b
	d2 := math.Pi * a * b
	d3 := 2 * math.Pi * a * p.estar
	c.PeakPressure = 3 * F / d1 // Johnson 1985, §3.5
	c.MeanPressure = F / d2
	// δ = p0 b K(e)/E* (Johnson 1985, §3.5: δ = L/(πE*), L = π p0 b K(e)).
	c.Approach = 3 * F * p.sh.K / d3
	c.Stiffness = 1.5 * F / c.Approach // δ ∝ F^(2/3)
	c.Valid = a <= validRatio*p.minR
	return normal(a) && normal(b) && normal(d1) && normal(d2) && normal(d3) &&
		normal(c.PeakPressure) && normal(c.MeanPressure) && normal(c.Approach) && normal(c.Stiffness)
}

// minNormal is the smallest normal float64, 2⁻¹⁰²² ≈ 2.2e-308. Below it a
// result keeps fewer than 53 significant bits.
const minNormal = 0x1p-1022

// normal reports whether x is a positive normal float64: finite and at
// least minNormal.
func normal(x float64) bool { return x >= minNormal && x <= math.MaxFloat64 }
