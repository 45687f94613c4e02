package kinematic

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Tolerance is the allowed deviation of one named dimension (see
// [Assembly]), in m or rad: either a HalfWidth, for a deviation spread
// evenly over ±HalfWidth (standard deviation HalfWidth/√3; a dimension of a
// part that passed inspection), or a Sigma, for a normal deviation of that
// standard deviation (a process of known capability). At most one of the
// two is non-zero; both zero holds the dimension at its nominal.
type Tolerance struct {
	Dimension string
	HalfWidth float64 // m or rad, ≥ 0: uniform over ±HalfWidth
	Sigma     float64 // m or rad, ≥ 0: normal with this standard deviation
}

// limit returns the tolerance's limit for a worst case (±HalfWidth
// uniform, ±3σ normal, common practice) and its standard deviation (the
// variance of a uniform deviation on [−a, a] is a²/3).
func (t Tolerance) limit() (lim, sigma float64) {
	if t.Sigma > 0 {
		return 3 * t.Sigma, t.Sigma
	}
	return t.HalfWidth, t.HalfWidth / math.Sqrt(3)
}

// field returns the name of the tolerance's non-zero field ("Sigma" or
// "HalfWidth"), and value its value.
func (t Tolerance) field() string {
	if t.Sigma > 0 {
		return "Sigma"
	}
	return "HalfWidth"
}

func (t Tolerance) value() float64 {
	if t.Sigma > 0 {
		return t.Sigma
	}
	return t.HalfWidth
}

// Contributor is one dimension's part in an error budget.
type Contributor struct {
	Dimension string

	// Sensitivity is the point of interest's displacement per unit of
	// the dimension (m/m or m/rad), TiltSensitivity the body's rotation
	// per unit (rad/m or rad/rad).
	Sensitivity, TiltSensitivity r3.Vec

	// Limit is the deviation used for the worst case, m or rad:
	// ±HalfWidth for a uniform tolerance, ±3σ for a normal one. Effect is
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

	// Worst is Σ Effect, m: the displacement when every dimension is
	// at its limit with the worst sign and every sensitivity points the
	// same way (a bound). RSS is √Σ Effect², m, the usual statistical
	// stack of the same limits; Sigma √Σ Sigma², m, the root of the
	// summed variance of the three coordinates for independent
	// deviations. The tilt totals are the same for the rotation, rad.
	Worst, RSS, Sigma  float64
	WorstTilt, RSSTilt float64
}

// Budget returns the first-order error budget of the point p of the
// moving body for the tolerances, contributors ranked by their effect.
// It returns an [*InputError] naming "p" when it is not finite,
// "tols[i].Dimension" for an unknown or repeated dimension,
// "tols[i].HalfWidth" or "tols[i].Sigma" for a value that is negative or
// not finite, or whose effect overflows ([ErrRange]; a 1e300 m
// tolerance), "tols" when the totals overflow, and "a" for a nil or zero
// Assembly.
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
		b.Worst += c.Effect
		b.RSS += c.Effect * c.Effect
		variance += c.Sigma * c.Sigma
		tn := linalg.Norm3(s.Tilt) * lim
		if !allFinite(c.Limit, c.Effect, c.Sigma*c.Sigma, tn*tn) {
			if !allFinite(n * n) {
				// The point's own sensitivity per unit deviation
				// overflows when squared: the point, not the tolerance,
				// is out of range.
				return Budget{}, &InputError{Field: "p", Err: fmt.Errorf(
					"%w: the point %v is too far from the coupling: its displacement per unit of %s (%.3g) overflows when squared", ErrRange, p, t.Dimension, n)}
			}
			return Budget{}, &InputError{Field: indexed("tols", i) + "." + t.field(), Err: fmt.Errorf(
				"%w: the effect of %g on %s overflows", ErrRange, t.value(), t.Dimension)}
		}
		b.WorstTilt += tn
		b.RSSTilt += tn * tn
		b.Contributors[i] = c
	}
	b.RSS, b.Sigma, b.RSSTilt = math.Sqrt(b.RSS), math.Sqrt(variance), math.Sqrt(b.RSSTilt)
	if !allFinite(b.Worst, b.RSS, b.Sigma, b.WorstTilt, b.RSSTilt) {
		return Budget{}, &InputError{Field: "tols", Err: fmt.Errorf("%w: the budget's totals overflow", ErrRange)}
	}
	for i := range b.Contributors {
		if variance > 0 {
			b.Contributors[i].Share = b.Contributors[i].Sigma * b.Contributors[i].Sigma / variance
		}
	}
	sort.SliceStable(b.Contributors, func(i, j int) bool { return b.Contributors[i].Effect > b.Contributors[j].Effect })
	return b, nil
}

// Along returns the budget's worst case and RSS along the direction u, m:
// Σ |u·Sᵢ|·Limitᵢ and √Σ (u·Sᵢ·Limitᵢ)². It returns an [*InputError]
// naming "u" when u is zero or not finite.
func (b Budget) Along(u r3.Vec) (worst, rss float64, err error) {
	d, err := unitOf(u, "u")
	if err != nil {
		return 0, 0, err
	}
	for _, c := range b.Contributors {
		e := math.Abs(r3.Dot(d, c.Sensitivity)) * c.Limit
		worst += e
		rss += e * e
	}
	return worst, math.Sqrt(rss), nil
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
		for _, v := range [...]struct {
			name  string
			value float64
		}{{"HalfWidth", t.HalfWidth}, {"Sigma", t.Sigma}} {
			if !linalg.Finite(v.value) {
				return nil, &InputError{Field: indexed("tols", i) + "." + v.name, Err: fmt.Errorf("%w: %g", ErrNonFinite, v.value)}
			}
			if v.value < 0 {
				return nil, &InputError{Field: indexed("tols", i) + "." + v.name, Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, v.value)}
			}
		}
		if t.HalfWidth != 0 && t.Sigma != 0 {
			return nil, &InputError{Field: indexed("tols", i) + ".Sigma", Other: indexed("tols", i) + ".HalfWidth",
				Err: fmt.Errorf("%w: a tolerance is a half-width or a standard deviation, not both", ErrRange)}
		}
		idx[i] = k
	}
	return idx, nil
}
