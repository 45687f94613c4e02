package hertz

import (
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// TangentialStiffness returns the tangential stiffness dQ/dx of the contact,
// in newtons per metre, under a tangential load q, in newtons, applied
// monotonically from zero at constant normal load, with the coefficient of
// friction mu.
//
// For a circular contact it is Mindlin's result (Mindlin 1949; Mindlin &
// Deresiewicz 1953; Johnson 1985, §7.2):
//
//	dQ/dx = 8 G* a (1 − |q|/(μN))^(1/3),
//
// with 1/G* = (2−ν1)/G1 + (2−ν2)/G2. The initial value 8G*a (q = 0) is the
// no-slip stiffness; the factor accounts for the annulus of micro-slip that
// grows with |q| until the contact slides at |q| = μN.
//
// For an elliptical contact the no-slip stiffness depends on the direction
// of q. Along the major and minor axes it is 2πa/Σ_i[(D + (1−ν_i)B)/G_i]
// and 2πa/Σ_i[(B + (1−ν_i)D)/G_i], with D = (K−E)/e², B = (E − (1−e²)K)/e²
// (Mindlin 1949; from Cerruti's solution, Johnson 1985, §3.6). This method
// returns the stiffness of the direction-averaged compliance,
//
//	k0 = 4π G* a / K(e),
//
// which equals 8G*a for a circle and lies between the two axial values;
// they differ from it by the factor 1/(1 ± ν(D−B)/((2−ν)K)) for equal ν,
// i.e. by less than ±ν/(2−ν) for any ellipse (±17.6 % for ν = 0.3, ±2.6 % at
// a/b = 2). The micro-slip factor (1 − |q|/(μN))^(1/3) of the circle is then
// applied unchanged, an approximation for an ellipse. Like Mindlin's, the
// solution ignores the coupling of normal and tangential tractions between
// dissimilar materials.
//
// A contact with zero load has zero stiffness at q = 0. Errors are
// *InputError wrapping ErrNonFinite (mu or q, or a field of c, NaN or
// infinite) or ErrRange (mu ≤ 0 or above 3, a percentage: 15% is 0.15;
// μN underflowing, |q| ≥ μN: gross
// sliding, a stiffness outside the normal float64 range, or a Contact
// whose fields are not those of a solution).
func (c Contact) TangentialStiffness(mu, q float64) (float64, error) {
	if err := checkMu(mu); err != nil {
		return 0, err
	}
	return c.tangentialStiffness(mu, q)
}

// tangentialStiffness is TangentialStiffness without the bound on mu
// above (the no-slip limit μ → ∞ of the tests).
func (c Contact) tangentialStiffness(mu, q float64) (float64, error) {
	if err := c.check(); err != nil {
		return 0, err
	}
	if err := checkMuLow(mu, false); err != nil {
		return 0, err
	}
	if !linalg.Finite(q) {
		return 0, nonFiniteErr("q", "tangential load must be finite, got %g", q)
	}
	if c.Load == 0 && q == 0 {
		return 0, nil
	}
	limit := mu * c.Load
	if limit < minNormal {
		return 0, rangeErr("mu", "sliding limit μN = %g × %g N underflows float64", mu, c.Load)
	}
	if !(math.Abs(q) < limit) {
		return 0, rangeErr("q", "|q| = %g N reaches the sliding limit μN = %g N (gross sliding)", math.Abs(q), limit)
	}
	a, b := c.SemiMajor, c.SemiMinor
	k0 := 8 * c.GStar * a
	if b < a {
		kp := b / a
		if kp < minNormal {
			return 0, rangeErr("c.SemiMinor", "axis ratio b/a = %g / %g underflows float64", b, a)
		}
		K, _ := agm(kp, (1-kp)*(1+kp))
		k0 = 4 * math.Pi * c.GStar * a / K
	}
	k := k0 * math.Cbrt(1-math.Abs(q)/limit)
	if !normal(k) {
		return 0, rangeErr("c.GStar", "stiffness %g N/m outside the normal floating-point range (G* = %g Pa, a = %g m)", k, c.GStar, a)
	}
	return k, nil
}

// SlidingLimit returns the tangential load μN, in newtons, at which the
// contact slides as a whole, for the coefficient of friction mu.
// Errors are *InputError wrapping ErrNonFinite when mu or c.Load is NaN or
// infinite, ErrRange when either is negative, mu is above 3 (a percentage:
// 15% is 0.15), or when μN, for positive mu
// and load, would overflow or underflow the normal float64 range.
func (c Contact) SlidingLimit(mu float64) (float64, error) {
	if err := checkMuLow(mu, true); err != nil {
		return 0, err
	}
	if err := checkMu(mu); err != nil {
		return 0, err
	}
	if err := checkLoad(c.Load); err != nil {
		return 0, err
	}
	l := mu * c.Load
	if mu > 0 && c.Load > 0 && !normal(l) {
		return 0, rangeErr("mu", "sliding limit μN = %g × %g N outside the normal floating-point range", mu, c.Load)
	}
	return l, nil
}

// check reports, as an error, a Contact whose fields used by the
// tangential methods are not those of a solution.
func (c *Contact) check() error {
	if err := checkLoad(c.Load); err != nil {
		return err
	}
	switch {
	case !linalg.Finite(c.SemiMajor):
		return nonFiniteErr("c.SemiMajor", "semi-major axis must be finite and > 0 under load, got %g", c.SemiMajor)
	case c.SemiMajor < 0 || (c.Load > 0 && c.SemiMajor == 0):
		return rangeErr("c.SemiMajor", "semi-major axis must be finite and > 0 under load, got %g", c.SemiMajor)
	case !linalg.Finite(c.SemiMinor):
		return nonFiniteErr("c.SemiMinor", "semi-minor axis must be finite, > 0 under load and ≤ SemiMajor, got %g", c.SemiMinor)
	case c.SemiMinor < 0 || c.SemiMinor > c.SemiMajor || (c.Load > 0 && c.SemiMinor == 0):
		return rangeErr("c.SemiMinor", "semi-minor axis must be finite, > 0 under load and ≤ SemiMajor, got %g", c.SemiMinor)
	case !linalg.Finite(c.GStar):
		return nonFiniteErr("c.GStar", "effective shear modulus must be finite and > 0, got %g", c.GStar)
	case !(c.GStar > 0):
		return rangeErr("c.GStar", "effective shear modulus must be finite and > 0, got %g", c.GStar)
	}
	return nil
}

// checkLoad reports, as an error for the field "c.Load", a Contact's normal
// load that is not finite and ≥ 0.
func checkLoad(load float64) error {
	if !linalg.Finite(load) {
		return nonFiniteErr("c.Load", "normal load must be finite and ≥ 0, got %g", load)
	}
	if load < 0 {
		return rangeErr("c.Load", "normal load must be finite and ≥ 0, got %g", load)
	}
	return nil
}
