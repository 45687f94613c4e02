package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Amplification is the first-order error of a point of interest of the moving
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
type Amplification struct {
	Point    r3.Vec
	Contacts [6]Effect // per unit gap error at each contact, Name its label, Pose its freed twist Tᵢ

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

// Amplification returns the first-order error of the point p of the moving body
// per unit gap error at each contact. It returns an [*InputError] naming
// "p" when it is not finite or so far away that its error overflows
// ([ErrRange]), and one naming "s" for the zero Stability (not made by
// [Analysis.Stability]).
func (s Stability) Amplification(p r3.Vec) (Amplification, error) {
	if !linalg.Finite3(p) {
		return Amplification{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	for i, m := range s.Contacts {
		if m.Freed == (screw.Twist{}) {
			return Amplification{}, &InputError{Field: indexed("s.Contacts", i) + ".Freed", Err: fmt.Errorf("%w: the zero Stability: make one with Analysis.Stability", ErrDegenerate)}
		}
	}
	pe := Amplification{Point: p}
	var ts [6]screw.Twist
	for i, m := range s.Contacts {
		ts[i] = m.Freed
	}
	var d, w [6]r3.Vec
	pe.Worst, pe.RSS, pe.WorstTilt, pe.RSSTilt = pointError(&ts, p, &d, &w)
	if !allFinite(pe.Worst, pe.RSS, pe.WorstTilt, pe.RSSTilt) {
		return Amplification{}, &InputError{Field: "p", Err: fmt.Errorf("%w: the error at %v overflows: the point is too far from the coupling", ErrRange, p)}
	}
	for i, m := range s.Contacts {
		pe.Contacts[i] = Effect{Name: m.Label, Pose: m.Freed, Displacement: d[i], Tilt: w[i]}
	}
	return pe, nil
}

// pointError sets d[i] and w[i] to the displacement of the point p and the
// tilt of the body per unit gap error at contact i, Tᵢ(p) and Wᵢ (ts the
// freed twists, scaled to open their contact at unit speed, and p in their
// frame), and returns the worst and RSS displacement and tilt of
// [Amplification]. It is the one definition of the error at a point:
// [Stability.Amplification] and the scorecard call it.
func pointError(ts *[6]screw.Twist, p r3.Vec, d, w *[6]r3.Vec) (worst, rss, worstTilt, rssTilt float64) {
	for i := range ts {
		d[i], w[i] = ts[i].At(p), ts[i].W
		rss += r3.Norm2(d[i])
		rssTilt += r3.Norm2(w[i])
	}
	return zonotopeNorm(d), math.Sqrt(rss), zonotopeNorm(w), math.Sqrt(rssTilt)
}

// alongAxis returns the worst and RSS error amplification along the unit
// direction u of the displacements d per unit gap error: Σ|u·dᵢ| and
// √Σ(u·dᵢ)².
func alongAxis(d *[6]r3.Vec, u r3.Vec) (worst, rss float64) {
	for i := range d {
		a := r3.Dot(u, d[i])
		worst += math.Abs(a)
		rss += a * a
	}
	return worst, math.Sqrt(rss)
}

// zonotopeNorm returns max |Σ sᵢ vᵢ| over the signs sᵢ = ±1: the largest
// vector of the zonotope, found at a vertex (the norm is convex), by
// visiting the 32 sign patterns with s₀ = +1 (the others are their
// negatives).
//
// It compares squared norms and takes one square root, which gives the
// same result (the square root is monotone and correctly rounded) while
// the squares stay within the range where Norm3 takes them too; outside
// it, or for a NaN, it takes the norm of each vertex.
func zonotopeNorm(v *[6]r3.Vec) float64 {
	var best2 float64
	for mask := 0; mask < 32; mask++ {
		s := zonotopeVertex(v, mask)
		if n2 := s.X*s.X + s.Y*s.Y + s.Z*s.Z; n2 > best2 || n2 != n2 {
			best2 = n2
		}
	}
	if best2 > 0x1p-486 && best2 < 0x1p+486 || best2 == 0 {
		return math.Sqrt(best2)
	}
	var best float64
	for mask := 0; mask < 32; mask++ {
		best = math.Max(best, linalg.Norm3(zonotopeVertex(v, mask)))
	}
	return best
}

// zonotopeVertex returns v₀ + Σ sᵢvᵢ with sᵢ = −1 where bit i−1 of mask
// is set, +1 elsewhere.
func zonotopeVertex(v *[6]r3.Vec, mask int) r3.Vec {
	s := v[0]
	for i := 1; i < 6; i++ {
		if mask&(1<<(i-1)) != 0 {
			s = r3.Sub(s, v[i])
		} else {
			s = r3.Add(s, v[i])
		}
	}
	return s
}

// Along returns the worst and RSS error amplification of the point along
// the direction u (an optical axis, say), in m per m: Σ|u·Tᵢ(p)| and
// √Σ(u·Tᵢ(p))²; and across it, the same for the part of each Tᵢ(p)
// normal to u, worst over sign patterns. It returns an [*InputError]
// naming "u" when u is zero or not finite: there is no figure along no
// direction.
func (pe Amplification) Along(u r3.Vec) (worst, rss, worstAcross, rssAcross float64, err error) {
	d, err := unitOf(u, "u")
	if err != nil {
		return 0, 0, 0, 0, err
	}
	var disp, across [6]r3.Vec
	for i, c := range pe.Contacts {
		disp[i] = c.Displacement
		across[i] = r3.Sub(c.Displacement, r3.Scale(r3.Dot(d, c.Displacement), d))
		rssAcross += r3.Norm2(across[i])
	}
	worst, rss = alongAxis(&disp, d)
	return worst, rss, zonotopeNorm(&across), math.Sqrt(rssAcross), nil
}
