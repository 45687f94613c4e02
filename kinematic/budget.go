package kinematic

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

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
		if !linalg.Finite(t.Value) {
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
