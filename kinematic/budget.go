package kinematic

import (
	"fmt"
	"math"
	"sort"

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

// Distribution is the statistical shape of a tolerance.
type Distribution int

const (
	// Uniform spreads a deviation evenly over ±Value (standard deviation
	// Value/√3): a toleranced dimension of a part that passed inspection.
	Uniform Distribution = iota

	// Normal gives a deviation the standard deviation Value: a process
	// of known capability.
	Normal
)

// String returns "Uniform" or "Normal".
func (d Distribution) String() string {
	switch d {
	case Uniform:
		return "Uniform"
	case Normal:
		return "Normal"
	}
	return fmt.Sprintf("Distribution(%d)", int(d))
}

// Tolerance is the allowed deviation of one named dimension (see
// [Assembly]).
type Tolerance struct {
	Dimension    string
	Value        float64 // m or rad, ≥ 0: the half-width of a Uniform tolerance, the standard deviation of a Normal one
	Distribution Distribution
}

// limit returns the tolerance's limit for a worst case (±Value uniform,
// ±3σ normal, common practice) and its standard deviation.
func (t Tolerance) limit() (lim, sigma float64) {
	if t.Distribution == Normal {
		return 3 * t.Value, t.Value
	}
	return t.Value, t.Value / math.Sqrt(3)
}

// Contributor is one dimension's part in an error budget.
type Contributor struct {
	Dimension string

	// Sensitivity is the point of interest's displacement per unit of
	// the dimension (m/m or m/rad), TiltSensitivity the body's rotation
	// per unit (rad/m or rad/rad).
	Sensitivity, TiltSensitivity r3.Vec

	// Limit is the deviation used for the worst case, m or rad: ±Value
	// for a uniform tolerance, ±3σ for a normal one. Effect is
	// |Sensitivity|·Limit, m, and Sigma |Sensitivity| times the
	// tolerance's standard deviation, m. Share is Sigma² as a fraction of
	// the budget's total variance.
	Limit, Effect, Sigma, Share float64
}

// Budget is the first-order error budget of a point of interest: which
// toleranced dimension moves it, by how much, and the totals.
type Budget struct {
	Point        r3.Vec
	Contributors []Contributor // largest Effect first

	// WorstCase is Σ Effect, m: the displacement when every dimension is
	// at its limit with the worst sign and every sensitivity points the
	// same way (a bound). RSS is √Σ Effect², m, the usual statistical
	// stack of the same limits; Sigma √Σ Sigma², m, the root of the
	// summed variance of the three coordinates for independent
	// deviations. The tilt totals are the same for the rotation, rad.
	WorstCase, RSS, Sigma float64
	WorstTilt, RSSTilt    float64
}

// Budget returns the first-order error budget of the point p of the
// moving body for the tolerances, contributors ranked by their effect.
// It returns an [*InputError] naming "p" when it is not finite,
// "tols[i].Dimension" for an unknown or repeated dimension,
// "tols[i].Value" for a value that is negative or not finite and
// "tols[i].Distribution" for an unknown distribution.
func (a *Assembly) Budget(p r3.Vec, tols []Tolerance) (Budget, error) {
	sens, err := a.Sensitivities(p)
	if err != nil {
		return Budget{}, err
	}
	idx, err := a.checkTolerances(tols)
	if err != nil {
		return Budget{}, err
	}
	b := Budget{Point: p, Contributors: make([]Contributor, len(tols))}
	var variance float64
	for i, t := range tols {
		s := sens[idx[i]]
		lim, sd := t.limit()
		c := Contributor{Dimension: t.Dimension, Sensitivity: s.Displacement, TiltSensitivity: s.Tilt, Limit: lim}
		n := linalg.Norm3(s.Displacement)
		c.Effect, c.Sigma = n*lim, n*sd
		b.WorstCase += c.Effect
		b.RSS += c.Effect * c.Effect
		variance += c.Sigma * c.Sigma
		tn := linalg.Norm3(s.Tilt) * lim
		b.WorstTilt += tn
		b.RSSTilt += tn * tn
		b.Contributors[i] = c
	}
	b.RSS, b.Sigma, b.RSSTilt = math.Sqrt(b.RSS), math.Sqrt(variance), math.Sqrt(b.RSSTilt)
	for i := range b.Contributors {
		if variance > 0 {
			b.Contributors[i].Share = b.Contributors[i].Sigma * b.Contributors[i].Sigma / variance
		}
	}
	sort.SliceStable(b.Contributors, func(i, j int) bool { return b.Contributors[i].Effect > b.Contributors[j].Effect })
	return b, nil
}

// Along returns the budget's worst case and RSS along the direction u, m:
// Σ |u·Sᵢ|·Limitᵢ and √Σ (u·Sᵢ·Limitᵢ)². A zero u gives zeros.
func (b Budget) Along(u r3.Vec) (worst, rss float64) {
	d, ok := linalg.Unit3(u)
	if !ok {
		return 0, 0
	}
	for _, c := range b.Contributors {
		e := math.Abs(r3.Dot(d, c.Sensitivity)) * c.Limit
		worst += e
		rss += e * e
	}
	return worst, math.Sqrt(rss)
}

// checkTolerances validates tolerances and returns their dimensions'
// indices.
func (a *Assembly) checkTolerances(tols []Tolerance) ([]int, error) {
	idx := make([]int, len(tols))
	seen := make(map[int]int, len(tols))
	for i, t := range tols {
		k, err := a.lookup(t.Dimension, indexed("tols", i)+".Dimension")
		if err != nil {
			return nil, err
		}
		if j, dup := seen[k]; dup {
			return nil, &InputError{Field: indexed("tols", i) + ".Dimension", Other: indexed("tols", j) + ".Dimension", Err: fmt.Errorf("%w: %q is already toleranced", ErrRange, t.Dimension)}
		}
		seen[k] = i
		if math.IsNaN(t.Value) || math.IsInf(t.Value, 0) {
			return nil, &InputError{Field: indexed("tols", i) + ".Value", Err: fmt.Errorf("%w: %g", ErrNonFinite, t.Value)}
		}
		if t.Value < 0 {
			return nil, &InputError{Field: indexed("tols", i) + ".Value", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, t.Value)}
		}
		if t.Distribution != Uniform && t.Distribution != Normal {
			return nil, &InputError{Field: indexed("tols", i) + ".Distribution", Err: fmt.Errorf("%w: unknown distribution %d", ErrRange, int(t.Distribution))}
		}
		idx[i] = k
	}
	return idx, nil
}

// Repeatability is an estimate of how well the same part comes back to
// the same place, limited by friction at the contacts.
type Repeatability struct {
	Point    r3.Vec
	Mu       float64
	Contacts []SlipContact

	// Worst and RSS combine the contacts' displacements of the point, m:
	// their sum (every contact's friction locked in its worst direction
	// at once) and their root sum of squares (independent directions).
	// WorstTilt and RSSTilt are the same for the rotation, rad.
	Worst, RSS         float64
	WorstTilt, RSSTilt float64
}

// SlipContact is one contact's share of the friction estimate.
type SlipContact struct {
	Label        string
	Friction     float64 // N: μ times the contact's normal force, the largest tangential force it holds without sliding
	Displacement float64 // m: the largest displacement of the point that this friction force can hold, in any tangent direction
	Tilt         float64 // rad: the same for the rotation
}

// Repeatability estimates how far friction can leave the moving body from
// its frictionless seat, at the point p, under the load case (usually the
// preload with gravity) with the coefficient of friction mu.
//
// The model: as the part seats, each contact's tangential (Mindlin)
// stiffness holds whatever tangential force is locked in when it stops
// sliding, up to μN (hertz.Contact.TangentialStiffness; Johnson 1985,
// §7.2). A locked-in force Q at contact i is a self-balanced load on the
// coupling, so the body sits displaced by the coupling's compliance
// (normal and tangential contact stiffness, [StiffnessOptions.Tangential])
// times the wrench of Q at the contact. For each contact the worst
// direction of Q in its tangent plane gives the largest displacement of p
// (the largest singular value of the 3×2 map from the direction), and the
// contacts combine as a sum (Worst) or a root sum of squares (RSS). This
// is an estimate of the scale of the non-repeatability, not a prediction
// of its value: real contacts settle with vibration and micro-slip, and
// their friction is rarely known to better than a factor of two.
// Published measurements of carefully made ball-and-groove couplings
// report repeatability better than 0.1 µm under 1.5 kN preload (Schouten,
// Rosielle & Schellekens 1997, "Design of a kinematic coupling for
// precision applications", Precision Engineering 20(1), with groove
// surfaces made to self-adjust to reduce the friction hysteresis), and
// couplings of ordinary quality around a micrometre.
//
// The result is the repeatability of the same part ("how well does it come
// back"); the spread of different parts made to the same drawing is
// interchangeability, [Assembly.Study]'s answer.
//
// Errors are those of [Model.Stiffness] and [Stiffness.Compliance], and an
// [*InputError] naming "mu" when it is not finite and positive or "p" when
// it is not finite.
func (m *Model) Repeatability(lc LoadCase, mu float64, p r3.Vec) (Repeatability, error) {
	if math.IsNaN(mu) || math.IsInf(mu, 0) {
		return Repeatability{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: %g", ErrNonFinite, mu)}
	}
	if !(mu > 0) {
		return Repeatability{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: must be > 0, got %g", ErrRange, mu)}
	}
	if !linalg.Finite3(p) {
		return Repeatability{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	st, err := m.Stiffness(lc, &StiffnessOptions{Tangential: true})
	if err != nil {
		return Repeatability{}, err
	}
	c, err := st.Compliance(p)
	if err != nil {
		return Repeatability{}, err
	}
	r := Repeatability{Point: p, Mu: mu, Contacts: make([]SlipContact, len(m.lines))}
	for i, l := range m.lines {
		sc := &r.Contacts[i]
		sc.Label = labelOf(l.label, i)
		q := mu * st.Forces[i]
		sc.Friction = q
		if q <= 0 {
			continue
		}
		arm := r3.Sub(r3.Add(l.p, m.origin), p)
		t1 := anyNormal(l.n)
		t2 := r3.Cross(l.n, t1)
		var dv, dw [2]r3.Vec
		for k, t := range [2]r3.Vec{t1, t2} {
			f := r3.Scale(q, t)
			w := [6]float64{f.X, f.Y, f.Z}
			mo := r3.Cross(arm, f)
			w[3], w[4], w[5] = mo.X, mo.Y, mo.Z
			var x [6]float64
			for a := range 6 {
				for b := range 6 {
					x[a] += c.Matrix[a][b] * w[b]
				}
			}
			dv[k] = r3.Vec{X: x[0], Y: x[1], Z: x[2]}
			dw[k] = r3.Vec{X: x[3], Y: x[4], Z: x[5]}
		}
		sc.Displacement, sc.Tilt = maxSingular2(dv), maxSingular2(dw)
		r.Worst += sc.Displacement
		r.RSS += sc.Displacement * sc.Displacement
		r.WorstTilt += sc.Tilt
		r.RSSTilt += sc.Tilt * sc.Tilt
	}
	r.RSS, r.RSSTilt = math.Sqrt(r.RSS), math.Sqrt(r.RSSTilt)
	return r, nil
}

// maxSingular2 returns the largest singular value of the 3×2 matrix with
// columns a[0], a[1]: max |cos φ a₀ + sin φ a₁| over φ, the root of the
// larger eigenvalue of the 2×2 Gram matrix, (p + q)/2 + √(((p − q)/2)² + r²)
// for p = |a₀|², q = |a₁|², r = a₀·a₁.
func maxSingular2(a [2]r3.Vec) float64 {
	p, q, r := r3.Norm2(a[0]), r3.Norm2(a[1]), r3.Dot(a[0], a[1])
	return math.Sqrt((p+q)/2 + math.Hypot((p-q)/2, r))
}
