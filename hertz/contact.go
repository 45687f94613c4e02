package hertz

// Contact is the solution of a Hertz point contact between two bodies under
// a normal load. Its zero value is not a solution; a Contact comes from
// Solve, Pair.Solve or Pair.Contact (which leaves Stress zero).
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
// where a finite number is needed), ErrRange (a field outside its domain,
// among them a Young's modulus below 1e4 Pa, which can only be one in GPa
// or MPa written as Pa; a negative or subnormal load; a result that would
// overflow or underflow the normal float64 range), or
// ErrLineContact or ErrGeometry (no Hertz point contact; both refine
// ErrDegenerate). The inputs are not modified. Solve is NewPair followed
// by Pair.Solve; a caller that evaluates the same bodies at many loads
// makes the Pair once.
func Solve(b1, b2 Body, load float64) (Contact, error) {
	p, err := NewPair(b1, b2)
	if err != nil {
		return Contact{}, err
	}
	return p.Solve(load)
}

// LoadForPressure returns the normal load, in newtons, at which bodies b1
// and b2 reach the peak contact pressure p0, in pascals. Since
// p0 ∝ F^(1/3), the load is exact (to rounding) and p0 = 0 gives 0.
// Errors are *InputError as for Solve; p0 must be finite and ≥ 0.
// It is NewPair followed by Pair.LoadForPressure.
func LoadForPressure(b1, b2 Body, p0 float64) (float64, error) {
	p, err := NewPair(b1, b2)
	if err != nil {
		return 0, err
	}
	return p.LoadForPressure(p0)
}

// LoadForApproach returns the normal load, in newtons, at which bodies b1
// and b2 reach the mutual approach delta, in metres. Since δ ∝ F^(2/3), the
// load is exact (to rounding) and delta = 0 gives 0. Errors are
// *InputError as for Solve; delta must be finite and ≥ 0.
// It is NewPair followed by Pair.LoadForApproach.
func LoadForApproach(b1, b2 Body, delta float64) (float64, error) {
	p, err := NewPair(b1, b2)
	if err != nil {
		return 0, err
	}
	return p.LoadForApproach(delta)
}
