package hertz

import (
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/internal/masing"
)

// Slip is the tangential state of a Hertz contact under a tangential load
// that varies below the sliding limit while the normal load stays
// constant: Mindlin's partial slip on loading and Mindlin & Deresiewicz's
// unloading and reloading (Johnson, Contact Mechanics, 1985, §7.2 and
// §7.4), with the memory of the whole load path kept exactly by Masing's
// rules. Make one with [Contact.Slip]; its zero value is not usable.
//
// The displacement is the relative tangential displacement of distant
// points of the two bodies along the line of the load, in metres; the load
// is the tangential force, in newtons, both signed along that line. On
// first loading from rest
//
//	δ = 3μP/(2k0) [1 − (1 − Q/μP)^(2/3)],
//
// Johnson's loading curve with k0 = 8G*a for a circle (the no-slip
// stiffness; see [Contact.TangentialStiffness] for an ellipse). Each
// reversal of the load starts a branch that is this curve scaled by two
// about the reversal point (Johnson's unloading curve), a branch that
// meets an earlier one continues it, and the first branch meets the
// loading curve at the mirror point. A displacement beyond the sliding
// displacement of the branch slides the contact at |Q| = μP.
//
// The normal and tangential problems are uncoupled (Johnson §7.2); the
// load keeps one line of action; the normal load is constant.
type Slip struct {
	limit float64 // μP, N
	scale float64 // δs = 3μP/(2k0), m
	k0    float64 // no-slip stiffness, N/m
	mem   *masing.Memory
	slope float64 // dy/dx of the last move, dimensionless
}

// Slip returns the virgin tangential state of the contact (no tangential
// load yet, no memory) with the coefficient of friction mu.
//
// Errors are *InputError wrapping ErrNonFinite or ErrRange: for mu not
// finite and > 0 or above 3 (a percentage: 15% is 0.15), for a Contact whose fields are not those of a solution,
// for a zero load ("c.Load": an unloaded contact carries no friction), and
// for a sliding limit μP or sliding displacement outside the normal
// float64 range.
func (c Contact) Slip(mu float64) (*Slip, error) {
	if err := checkMu(mu); err != nil {
		return nil, err
	}
	return c.slip(mu)
}

// slip is Slip without the bound on mu above (the no-slip limit μ → ∞
// of the tests).
func (c Contact) slip(mu float64) (*Slip, error) {
	k0, err := c.tangentialStiffness(mu, 0)
	if err != nil {
		return nil, err
	}
	if c.Load == 0 {
		return nil, rangeErr("c.Load", "an unloaded contact carries no friction: normal load must be > 0")
	}
	limit := mu * c.Load
	scale := 1.5 * limit / k0
	if !normal(scale) || !normal(limit) {
		return nil, rangeErr("mu", "sliding limit μP = %g N or its displacement %g m outside the normal floating-point range", limit, scale)
	}
	return &Slip{limit: limit, scale: scale, k0: k0, mem: masing.New(masing.Mindlin, 8), slope: masing.Mindlin.Slope(0)}, nil
}

// Step moves the contact monotonically from its present load to the
// tangential load q, in newtons, and returns the new displacement, in
// metres. Errors are *InputError for "q": ErrNonFinite for NaN or
// infinite, ErrRange for |q| ≥ μP (gross sliding: the displacement is not
// determined by the load); the state is then unchanged.
func (s *Slip) Step(q float64) (float64, error) {
	if !linalg.Finite(q) {
		return 0, nonFiniteErr("q", "tangential load must be finite, got %g", q)
	}
	if !(math.Abs(q) < s.limit) {
		return 0, rangeErr("q", "|q| = %g N reaches the sliding limit μP = %g N (gross sliding)", math.Abs(q), s.limit)
	}
	p, slope := s.mem.MoveY(q / s.limit)
	if math.IsInf(p.X, 0) {
		return 0, rangeErr("q", "q = %g N: the branch the contact is on slides before reaching it", q)
	}
	s.slope = slope
	return p.X * s.scale, nil
}

// Displace moves the contact monotonically to the tangential displacement
// d, in metres, and returns the tangential load, in newtons, which is ±μP
// where the contact slides. Errors are *InputError for "d" wrapping
// ErrNonFinite when it is NaN or infinite.
func (s *Slip) Displace(d float64) (float64, error) {
	if !linalg.Finite(d) {
		return 0, nonFiniteErr("d", "tangential displacement must be finite, got %g", d)
	}
	// A displacement of more than 1e300 sliding displacements slides the
	// contact as far as any other beyond its memory: clamp before scaling
	// overflows.
	x := math.Max(-1e300, math.Min(1e300, d/s.scale))
	p, slope := s.mem.MoveX(x)
	s.slope = slope
	return p.Y * s.limit, nil
}

// Load returns the present tangential load, N.
func (s *Slip) Load() float64 { return s.mem.State().Y * s.limit }

// Displacement returns the present tangential displacement, m.
func (s *Slip) Displacement() float64 { return s.mem.State().X * s.scale }

// Stiffness returns the tangent stiffness dQ/dδ, in N/m, at the present
// state on the side of the last move: k0 on the virgin contact and just
// at a reversal, k0(1 − |Q|/μP)^(1/3) on first loading,
// k0(1 − |Q* − Q|/(2μP))^(1/3) on a branch from the reversal at Q*, 0
// while sliding.
func (s *Slip) Stiffness() float64 { return s.slope * s.limit / s.scale }

// SlipEnergy returns the energy, in joules, dissipated by micro-slip in
// one cycle of the tangential load between −amplitude and +amplitude, in
// newtons, at constant normal load, with the coefficient of friction mu
// (Mindlin & Deresiewicz 1953; Johnson 1985, §7.4):
//
//	W = 9μ²P²/(10G*a) [1 − (1 − x)^(5/3) − (5x/6)(1 + (1 − x)^(2/3))],  x = amplitude/(μP),
//
// written for any contact as W = (36/5) μ²P²/k0 [...] with k0 the no-slip
// stiffness (8G*a for a circle). For small x the bracket is 5x³/162 and
// W ≈ μ²P²x³/(36G*a): the loss grows as the cube of the amplitude. Below
// x = 1/2 the bracket is summed as its power series, where the closed form
// cancels.
//
// Errors are those of [Contact.Slip] and an *InputError for "amplitude"
// when it is not finite (ErrNonFinite), negative, or above μP (ErrRange:
// the contact slides as a whole and the loss is no longer micro-slip).
func (c Contact) SlipEnergy(mu, amplitude float64) (float64, error) {
	if err := checkMu(mu); err != nil {
		return 0, err
	}
	return c.slipEnergy(mu, amplitude)
}

// slipEnergy is SlipEnergy without the bound on mu above (the no-slip
// limit μ → ∞ of the tests).
func (c Contact) slipEnergy(mu, amplitude float64) (float64, error) {
	s, err := c.slip(mu)
	if err != nil {
		return 0, err
	}
	if !linalg.Finite(amplitude) {
		return 0, nonFiniteErr("amplitude", "tangential load amplitude must be finite, got %g", amplitude)
	}
	if amplitude < 0 || amplitude > s.limit {
		return 0, rangeErr("amplitude", "tangential load amplitude must be in [0, μP = %g N], got %g", s.limit, amplitude)
	}
	w := 7.2 * s.limit * (s.limit / s.k0) * slipBracket(amplitude/s.limit)
	if !(w >= 0) || math.IsInf(w, 0) {
		return 0, rangeErr("amplitude", "energy %g J outside the floating-point range", w)
	}
	return w, nil
}

// slipBracket returns 1 − (1 − x)^(5/3) − (5x/6)(1 + (1 − x)^(2/3)) for
// 0 ≤ x ≤ 1. Below 1/2 it sums the series Σ cₙ xⁿ (n ≥ 3) with
// cₙ = −aₙ − (5/6) bₙ₋₁, aₙ and bₙ the coefficients of xⁿ in (1 − x)^(5/3)
// and (1 − x)^(2/3) (the terms of order 0, 1 and 2 cancel exactly);
// aₙ = aₙ₋₁ (n − 1 − 5/3)/n and likewise bₙ. The coefficients are bounded,
// so 60 terms at x < 1/2 leave less than 2⁻⁵⁷ of the first.
func slipBracket(x float64) float64 {
	if x >= 0.5 {
		return 1 - math.Pow(1-x, 5.0/3) - 5*x/6*(1+math.Pow(1-x, 2.0/3))
	}
	a, b := 1.0, 1.0 // a₀, b₀
	for n := 1; n <= 2; n++ {
		a *= (float64(n) - 1 - 5.0/3) / float64(n)
		b *= (float64(n) - 1 - 2.0/3) / float64(n)
	}
	// a = a₂, b = b₂
	var sum float64
	xn := x * x * x
	for n := 3; n <= 62; n++ {
		a *= (float64(n) - 1 - 5.0/3) / float64(n)
		sum += (-a - 5.0/6*b) * xn
		b *= (float64(n) - 1 - 2.0/3) / float64(n)
		xn *= x
	}
	return sum
}
