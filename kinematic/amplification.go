package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// PointError is the first-order error of a point of interest of the moving
// body per unit gap error at each contact: how far the point moves, and how
// far the body tilts, per metre that a contact's seat surface stands high
// along its normal (or per metre of ball radius, at each of that ball's
// contacts).
//
// An exactly constrained body takes small gap errors eᵢ without any force:
// it moves by x = Σ eᵢ Tᵢ, with Tᵢ the twist of power δᵢⱼ with contact j
// (the Freed twists of [Maxwell], scaled to open their contact at unit
// speed), because then Power(x, lⱼ) = eⱼ at every contact. So the point p
// moves by Σ eᵢ Tᵢ(p) and the body tilts by Σ eᵢ Wᵢ.
type PointError struct {
	Point    r3.Vec
	Contacts [6]ContactError

	// Worst is the largest displacement of the point, in m per m (µm per
	// µm), for gap errors of at most one unit at every contact, in any
	// combination of signs: max |Σ ±Tᵢ(p)| over the 64 sign patterns.
	// RSS is √Σ|Tᵢ(p)|², the standard deviation's amplification for
	// independent gap errors of equal standard deviation (per axis summed).
	Worst, RSS float64

	// WorstTilt and RSSTilt are the same for the tilt |Σ ±Wᵢ|, in rad
	// per m (µrad per µm).
	WorstTilt, RSSTilt float64
}

// ContactError is what a unit gap error at one contact does.
type ContactError struct {
	Label        string
	Displacement r3.Vec // of the point, m per m of gap error: Tᵢ(p)
	Tilt         r3.Vec // of the body, rad per m: Wᵢ
}

// ErrorAt returns the first-order error of the point p of the moving body
// per unit gap error at each contact. It returns an [*InputError] naming
// "p" when it is not finite.
func (s Stability) ErrorAt(p r3.Vec) (PointError, error) {
	if !linalg.Finite3(p) {
		return PointError{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	pe := PointError{Point: p}
	var d, w [6]r3.Vec
	for i, m := range s.Contacts {
		d[i], w[i] = m.Freed.At(p), m.Freed.W
		pe.Contacts[i] = ContactError{Label: m.Label, Displacement: d[i], Tilt: w[i]}
		pe.RSS += r3.Norm2(d[i])
		pe.RSSTilt += r3.Norm2(w[i])
	}
	pe.RSS, pe.RSSTilt = math.Sqrt(pe.RSS), math.Sqrt(pe.RSSTilt)
	pe.Worst, pe.WorstTilt = zonotopeNorm(&d), zonotopeNorm(&w)
	return pe, nil
}

// zonotopeNorm returns max |Σ sᵢ vᵢ| over the signs sᵢ = ±1: the largest
// vector of the zonotope, found at a vertex (the norm is convex), by
// visiting the 32 sign patterns with s₀ = +1 (the others are their
// negatives).
func zonotopeNorm(v *[6]r3.Vec) float64 {
	var best float64
	for mask := 0; mask < 32; mask++ {
		s := v[0]
		for i := 1; i < 6; i++ {
			if mask&(1<<(i-1)) != 0 {
				s = r3.Sub(s, v[i])
			} else {
				s = r3.Add(s, v[i])
			}
		}
		best = math.Max(best, linalg.Norm3(s))
	}
	return best
}

// Along returns the worst and RSS error amplification of the point along
// the direction u (an optical axis, say), in m per m: Σ|u·Tᵢ(p)| and
// √Σ(u·Tᵢ(p))²; and across it, the same for the part of each Tᵢ(p)
// normal to u, worst over sign patterns. A zero u gives zeros.
func (pe PointError) Along(u r3.Vec) (worst, rss, worstAcross, rssAcross float64) {
	d, ok := linalg.Unit3(u)
	if !ok {
		return 0, 0, 0, 0
	}
	var across [6]r3.Vec
	for i, c := range pe.Contacts {
		a := r3.Dot(d, c.Displacement)
		worst += math.Abs(a)
		rss += a * a
		across[i] = r3.Sub(c.Displacement, r3.Scale(a, d))
		rssAcross += r3.Norm2(across[i])
	}
	return worst, math.Sqrt(rss), zonotopeNorm(&across), math.Sqrt(rssAcross)
}
