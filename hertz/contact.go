package hertz

import (
	"fmt"
	"math"
)

// Contact is the solution of a Hertz point contact between two bodies under
// a normal load. Its zero value is not a solution; a Contact comes from
// Solve.
type Contact struct {
	Load         float64       // normal load F, N
	SemiMajor    float64       // semi-major axis a of the contact ellipse, m (a ≥ b)
	SemiMinor    float64       // semi-minor axis b, m
	MajorAngle   float64       // direction of the major axis about the normal in the shared frame, rad, in [0, π)
	PeakPressure float64       // peak pressure p0 = 3F/(2πab), Pa
	MeanPressure float64       // mean pressure F/(πab), Pa
	Approach     float64       // mutual approach δ of distant points of the two bodies, m
	Stiffness    float64       // normal stiffness dF/dδ = 3F/(2δ), N/m
	EStar        float64       // effective modulus E*, 1/E* = (1−ν1²)/E1 + (1−ν2²)/E2, Pa
	GStar        float64       // effective shear modulus G*, 1/G* = (2−ν1)/G1 + (2−ν2)/G2, G = E/(2(1+ν)), Pa
	A, B         float64       // Johnson's half relative curvatures, 1/m, 0 < A ≤ B
	Stress       [2]Subsurface // on the load axis inside body 1 and body 2
	Valid        bool          // reports whether the half-space assumption holds: SemiMajor ≤ 0.1 of the smallest |radius|
}

// Subsurface holds the largest stresses on the load axis inside one body.
// Depths are measured from the contact surface into the body.
type Subsurface struct {
	MaxShear         float64 // largest Tresca shear stress (σ1 − σ3)/2 on the axis, Pa
	MaxShearDepth    float64 // depth of MaxShear, m
	MaxVonMises      float64 // largest von Mises equivalent stress on the axis, Pa
	MaxVonMisesDepth float64 // depth of MaxVonMises, m
}

// validRatio is the largest semi-major axis, as a fraction of the smallest
// |radius| of the two bodies, for which Contact.Valid is true. Hertz's
// half-space assumption needs a ≪ R; 0.1 is common practice.
const validRatio = 0.1

// curvTol is the relative size, against the sum of the magnitudes of the
// curvature terms, below which a half relative curvature A or B cannot be
// told from zero: forming A = (M − D)/2 from the inputs commits a few
// rounding errors of that sum (1/R, the means and differences, cos 2θ and
// sin 2θ, the hypotenuse), each at most ε = 2⁻⁵²; 32ε covers them with a
// wide margin. B/A is therefore at most about 1/(32ε) ≈ 1.4e14.
const curvTol = 32 * 0x1p-52

// pair is the load-independent part of a contact between two bodies.
type pair struct {
	A, B, angle  float64
	estar, gstar float64
	nu           [2]float64
	minR         float64 // smallest finite |radius|, +Inf if none
	sh           ellipseShape
	a3           float64 // a³/F, m³/N
}

// inputErr returns an *InputError for field wrapping the sentinel kind,
// with a message built from format and args.
func inputErr(field string, kind error, format string, args ...any) error {
	return &InputError{Field: field, Err: fmt.Errorf("%w: "+format, append([]any{kind}, args...)...)}
}

// rangeErr returns an *InputError for field wrapping ErrRange.
func rangeErr(field, format string, args ...any) error {
	return inputErr(field, ErrRange, format, args...)
}

// nonFiniteErr returns an *InputError for field wrapping ErrNonFinite.
func nonFiniteErr(field, format string, args ...any) error {
	return inputErr(field, ErrNonFinite, format, args...)
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// curvature returns 1/r for a valid radius r. The field name is
// name + "." + field, built only on error so that Solve does not allocate.
func curvature(r float64, name, field string) (float64, error) {
	switch {
	case math.IsNaN(r):
		return 0, nonFiniteErr(name+"."+field, "radius is NaN")
	case r == 0:
		return 0, rangeErr(name+"."+field, "radius must be nonzero (±Inf for a straight surface), got 0")
	case math.IsInf(r, 0):
		return 0, nil
	}
	k := 1 / r
	if math.IsInf(k, 0) {
		return 0, rangeErr(name+"."+field, "radius %g is too small for floating point", r)
	}
	return k, nil
}

func checkMaterial(m Material, name string) error {
	switch {
	case math.IsNaN(m.E):
		return nonFiniteErr(name+".Material.E", "Young's modulus is NaN")
	case !(m.E > 0):
		return rangeErr(name+".Material.E", "Young's modulus must be positive (or +Inf for a rigid body), got %g", m.E)
	case !finite(m.Nu):
		return nonFiniteErr(name+".Material.Nu", "Poisson's ratio must be finite, in (-1, 0.5], got %g", m.Nu)
	case !(m.Nu > -1 && m.Nu <= 0.5):
		return rangeErr(name+".Material.Nu", "Poisson's ratio must be in (-1, 0.5], got %g", m.Nu)
	case !finite(m.Alpha):
		return nonFiniteErr(name+".Material.Alpha", "expansion coefficient must be finite, got %g", m.Alpha)
	case !finite(m.Allowable):
		return nonFiniteErr(name+".Material.Allowable", "allowable pressure must be finite and ≥ 0, got %g", m.Allowable)
	case m.Allowable < 0:
		return rangeErr(name+".Material.Allowable", "allowable pressure must be finite and ≥ 0, got %g", m.Allowable)
	}
	return nil
}

// bodyTerms validates a body and returns the mean curvature and the
// components of its curvature difference along 2θ.
func bodyTerms(b Body, name string) (mean, dc, ds float64, err error) {
	k1, err := curvature(b.R1, name, "R1")
	if err != nil {
		return 0, 0, 0, err
	}
	k2, err := curvature(b.R2, name, "R2")
	if err != nil {
		return 0, 0, 0, err
	}
	if !finite(b.Angle) {
		return 0, 0, 0, nonFiniteErr(name+".Angle", "angle must be finite, got %g", b.Angle)
	}
	if err := checkMaterial(b.Material, name); err != nil {
		return 0, 0, 0, err
	}
	d := (k1 - k2) / 2
	if d == 0 {
		return k1, 0, 0, nil // sphere, socket or flat: no direction
	}
	s, c := math.Sincos(2 * b.Angle)
	return (k1 + k2) / 2, d * c, d * s, nil
}

// compliance returns (1−ν²)/E and (2−ν)/G = 2(2−ν)(1+ν)/E; both are 0 for a
// rigid body.
func compliance(m Material) (normal, shear float64) {
	if math.IsInf(m.E, 1) {
		return 0, 0
	}
	return (1 - m.Nu*m.Nu) / m.E, 2 * (2 - m.Nu) * (1 + m.Nu) / m.E
}

// minAbsRadius returns the smallest |radius| of two bodies (+Inf if all
// four are straight).
func minAbsRadius(b1, b2 Body) float64 {
	return math.Min(math.Min(math.Abs(b1.R1), math.Abs(b1.R2)), math.Min(math.Abs(b2.R1), math.Abs(b2.R2)))
}

// newPair validates two bodies and solves the load-independent part of
// their contact.
func newPair(b1, b2 Body) (pair, error) {
	m1, c1, s1, err := bodyTerms(b1, "b1")
	if err != nil {
		return pair{}, err
	}
	m2, c2, s2, err := bodyTerms(b2, "b2")
	if err != nil {
		return pair{}, err
	}
	n1, g1 := compliance(b1.Material)
	n2, g2 := compliance(b2.Material)
	if n1+n2 == 0 {
		return pair{}, &InputError{Field: "b1.Material.E, b2.Material.E", Err: fmt.Errorf("%w: both bodies are rigid (E = +Inf)", ErrGeometry)}
	}

	// Relative curvature: the gap between the surfaces is Ax² + By² in
	// the principal frame (Johnson 1985, §4.1). With each
	// body's curvature tensor written as mean·I + half-difference
	// rotated by 2θ, the sum has eigenvalues M ± D.
	M := m1 + m2
	dc, ds := c1+c2, s1+s2
	D := math.Hypot(dc, ds)
	scale := math.Abs(m1) + math.Abs(m2) + math.Abs(c1) + math.Abs(s1) + math.Abs(c2) + math.Abs(s2)
	A, B := (M-D)/2, (M+D)/2
	if !finite(M) || !finite(D) {
		return pair{}, rangeErr("b1, b2", "curvatures overflow the floating-point range")
	}
	switch {
	case B < -curvTol*scale:
		return pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: a concave surface is tighter than the convex one in every direction, as a socket smaller than the ball (half relative curvatures A = %g, B = %g 1/m)", ErrGeometry, A, B)}
	case A < -curvTol*scale:
		return pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: a concave surface is tighter than the convex one in one direction (half relative curvature A = %g 1/m < 0)", ErrGeometry, A)}
	case B <= curvTol*scale:
		return pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: the surfaces conform in every direction, as flat on flat or a socket of the ball's radius (half relative curvatures A = %g, B = %g 1/m)", ErrGeometry, A, B)}
	case A <= curvTol*scale:
		return pair{}, &InputError{Field: "b1, b2", Err: fmt.Errorf("%w: the relative curvature vanishes along one direction (A = %g, B = %g 1/m); the bodies touch along a line, not at a point", ErrLineContact, A, B)}
	}

	p := pair{
		A: A, B: B,
		estar: 1 / (n1 + n2),
		gstar: 1 / (g1 + g2),
		nu:    [2]float64{b1.Material.Nu, b2.Material.Nu},
		minR:  minAbsRadius(b1, b2),
	}
	if !finite(p.estar) || !finite(p.gstar) || !(p.estar > 0 && p.gstar > 0) {
		return pair{}, rangeErr("b1.Material, b2.Material", "effective moduli E* = %g, G* = %g Pa outside the floating-point range", p.estar, p.gstar)
	}
	if D > 0 {
		// The larger eigenvalue M + D has its eigenvector at φ =
		// atan2(ds, dc)/2; the major axis lies along the smaller one.
		p.angle = math.Mod(math.Atan2(ds, dc)/2+3*math.Pi/2, math.Pi)
	}
	p.sh = solveShape(D / A)
	// a·b² = 3F E(e)/(2π E* (A+B)) (Johnson 1985, §3.5) with b = k'a.
	p.a3 = 3 * p.sh.E / (2 * math.Pi * p.estar * M * p.sh.kp * p.sh.kp)
	if !finite(p.a3) || !(p.a3 > 0) {
		return pair{}, rangeErr("b1, b2", "contact size outside the floating-point range")
	}
	return p, nil
}

// contact returns the contact at load F ≥ 0 without the subsurface stresses.
func (p *pair) contact(F float64) Contact {
	c := Contact{
		Load: F, MajorAngle: p.angle, EStar: p.estar, GStar: p.gstar,
		A: p.A, B: p.B, Valid: true,
	}
	if F == 0 {
		return c
	}
	a := math.Cbrt(p.a3 * F)
	b := a * p.sh.kp
	c.SemiMajor, c.SemiMinor = a, b
	c.PeakPressure = 3 * F / (2 * math.Pi * a * b) // Johnson 1985, §3.5
	c.MeanPressure = F / (math.Pi * a * b)
	// δ = p0 b K(e)/E* (Johnson 1985, §3.5: δ = L/(πE*), L = π p0 b K(e)).
	c.Approach = 3 * F * p.sh.K / (2 * math.Pi * a * p.estar)
	c.Stiffness = 1.5 * F / c.Approach // δ ∝ F^(2/3)
	c.Valid = a <= validRatio*p.minR
	return c
}

func (c *Contact) finite() bool {
	for _, v := range [...]float64{c.SemiMajor, c.SemiMinor, c.PeakPressure, c.MeanPressure, c.Approach, c.Stiffness} {
		if !finite(v) || (c.Load > 0 && !(v > 0)) {
			return false
		}
	}
	return true
}

// Solve returns the Hertz contact of bodies b1 and b2 pressed together by
// the normal load, in newtons.
//
// The contact ellipse, pressures, approach and stiffness follow Hertz
// (1882) in the form of Johnson (1985), §3.5 and §4.2, solved exactly (see
// the package documentation for the accuracy). Stress[i] holds the largest
// Tresca and von Mises stresses on the load axis inside body i, each body
// with its own Poisson's ratio. A zero load gives a contact of zero size,
// with zero pressures, approach, stiffness and stresses, and with
// MajorAngle, A, B, EStar and GStar set.
//
// Errors are *InputError wrapping ErrNonFinite (a NaN, or an infinity
// where a finite number is needed), ErrRange (a field outside its domain, a
// negative load, a result outside the floating-point range), or
// ErrLineContact or ErrGeometry (no Hertz point contact; both refine
// ErrDegenerate). The inputs are not modified.
func Solve(b1, b2 Body, load float64) (Contact, error) {
	p, err := newPair(b1, b2)
	if err != nil {
		return Contact{}, err
	}
	if !finite(load) {
		return Contact{}, nonFiniteErr("load", "normal load must be finite and ≥ 0, got %g", load)
	}
	if load < 0 {
		return Contact{}, rangeErr("load", "normal load must be finite and ≥ 0, got %g", load)
	}
	c := p.contact(load)
	if !c.finite() {
		return Contact{}, rangeErr("load", "contact of load %g N is outside the floating-point range", load)
	}
	if load > 0 {
		p.stresses(&c)
	}
	return c, nil
}

// stresses fills c.Stress. For a circle σx = σy on the axis, so the two
// shear planes coincide and the von Mises stress is twice the Tresca
// shear, at the same depth.
func (p *pair) stresses(c *Contact) {
	d := newDepthSearch(&p.sh)
	b, p0 := c.SemiMinor, c.PeakPressure
	kp := p.sh.kp
	for i, nu := range p.nu {
		if i == 1 && nu == p.nu[0] {
			c.Stress[1] = c.Stress[0]
			break
		}
		t1, z1 := d.maximize(objShearY, nu, shearGuess(p.sh.t, nu))
		if kp == 1 {
			c.Stress[i] = Subsurface{
				MaxShear: t1 * p0, MaxShearDepth: z1 * b,
				MaxVonMises: 2 * t1 * p0, MaxVonMisesDepth: z1 * b,
			}
			continue
		}
		vm, zv := d.maximize(objMisesSq, nu, z1)
		tau, zt := t1, z1
		if t2, z2 := d.maximize(objShearX, nu, shearXGuess(p.sh.t, nu, z1)); t2 > t1 {
			tau, zt = t2, z2
		}
		c.Stress[i] = Subsurface{
			MaxShear: tau * p0, MaxShearDepth: zt * b,
			MaxVonMises: math.Sqrt(vm) * p0, MaxVonMisesDepth: zv * b,
		}
	}
}

// shearGuess is a starting depth (over b) for the maximum of (σy − σz)/2:
// for a circle 0.38194 + 0.32973ν + 0.01064ν(ν − 0.3), a fit to this
// package's solutions good to 2e-4 for 0 ≤ ν ≤ 0.5 (0.48 at ν = 0.3,
// Johnson 1985, §3.4), and 0.786 for a line contact (Johnson 1985, §4.2),
// blended with k'^1.2 = exp(−1.2t), t = ln(a/b), good to a few per cent
// for ν ≥ 0. The search does the rest.
func shearGuess(t, nu float64) float64 {
	c := math.Max(0.005, 0.38194+0.32973*nu+0.01064*nu*(nu-0.3))
	if t == 0 {
		return c
	}
	return 0.786 - (0.786-c)*math.Exp(-1.2*t)
}

// shearXGuess is a starting depth (over b) for the maximum of
// (σx − σz)/2, given the depth z1 of the maximum of (σy − σz)/2: the two
// coincide for a circle, and for a line contact the maximum lies near
// 0.466 + 1.48(ν − 0.3) (a fit to this package's own solutions, good to a
// few per cent for 0.1 ≤ ν ≤ 0.5); blended with k'^0.7 = exp(−0.7t).
func shearXGuess(t, nu, z1 float64) float64 {
	c := math.Min(0.79, math.Max(0.02, 0.466+1.48*(nu-0.3)))
	return c + (z1-c)*math.Exp(-0.7*t)
}

// LoadForPressure returns the normal load, in newtons, at which bodies b1
// and b2 reach the peak contact pressure p0, in pascals. Since
// p0 ∝ F^(1/3), the load is exact (to rounding) and p0 = 0 gives 0.
// Errors are *InputError as for Solve; p0 must be finite and ≥ 0.
func LoadForPressure(b1, b2 Body, p0 float64) (float64, error) {
	p, err := newPair(b1, b2)
	if err != nil {
		return 0, err
	}
	if !finite(p0) {
		return 0, nonFiniteErr("p0", "peak pressure must be finite and ≥ 0, got %g", p0)
	}
	if p0 < 0 {
		return 0, rangeErr("p0", "peak pressure must be finite and ≥ 0, got %g", p0)
	}
	// p0 = 3F/(2π a b) with a = (a3 F)^(1/3), b = k' a.
	ca := math.Cbrt(p.a3)
	x := 2 * math.Pi * ca * ca * p.sh.kp * p0 / 3
	F := x * x * x
	if !finite(F) {
		return 0, rangeErr("p0", "load for peak pressure %g Pa is outside the floating-point range", p0)
	}
	return F, nil
}

// LoadForApproach returns the normal load, in newtons, at which bodies b1
// and b2 reach the mutual approach delta, in metres. Since δ ∝ F^(2/3), the
// load is exact (to rounding) and delta = 0 gives 0. Errors are
// *InputError as for Solve; delta must be finite and ≥ 0.
func LoadForApproach(b1, b2 Body, delta float64) (float64, error) {
	p, err := newPair(b1, b2)
	if err != nil {
		return 0, err
	}
	if !finite(delta) {
		return 0, nonFiniteErr("delta", "approach must be finite and ≥ 0, got %g", delta)
	}
	if delta < 0 {
		return 0, rangeErr("delta", "approach must be finite and ≥ 0, got %g", delta)
	}
	// δ = 3 F K/(2π a E*) with a = (a3 F)^(1/3): F^(2/3) = 2π a3^(1/3) E* δ/(3K).
	x := 2 * math.Pi * math.Cbrt(p.a3) * p.estar * delta / (3 * p.sh.K)
	F := x * math.Sqrt(x)
	if !finite(F) {
		return 0, rangeErr("delta", "load for approach %g m is outside the floating-point range", delta)
	}
	return F, nil
}
