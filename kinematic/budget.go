package kinematic

import (
	"fmt"
	"math"
	"sort"
	"strings"

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
// "tols" when there are no tolerances (a budget of nothing is not a
// perfect part) or the totals overflow, "tols[i].Dimension" for an
// unknown or repeated dimension, "tols[i].HalfWidth" or "tols[i].Sigma"
// for a value that is negative or not finite, or out of all proportion
// ([ErrRange]; a unit slip): a length whose limit (HalfWidth, or 3σ)
// exceeds its pair's ball radius, or an angle whose limit exceeds 0.1 rad;
// and "a" for a nil or zero Assembly.
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
	if len(tols) == 0 {
		return nil, &InputError{Field: "tols", Err: fmt.Errorf(
			"%w: no tolerances: a budget or study of no toleranced dimension would report zeros that read as a perfect part", ErrRange)}
	}
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
		if err := a.checkScale(i, t, &a.dims[k]); err != nil {
			return nil, err
		}
		idx[i] = k
	}
	return idx, nil
}

// maxAngleTolerance bounds an angular tolerance's limit (HalfWidth, or
// 3σ), rad. 0.1 rad (5.7°) is about twice the coarsest general angular
// tolerance of ISO 2768-1 (class v: ±3° on a shorter leg up to 10 mm;
// from memory), and seats of a kinematic coupling are toleranced in
// arcminutes: a larger value is a unit slip (6 written for 6° or 6
// arcmin), not a drawing's tolerance.
const maxAngleTolerance = 0.1

// minLengthHint is the smallest length tolerance, m, that checkScale
// offers as what a slip probably meant: 0.1 µm, below the tolerances a
// machined seat is drawn to (common practice).
const minLengthHint = 1e-7

// checkScale refuses the tolerance i on dimension d when its limit is out
// of all proportion to the coupling, which can only be a unit slip: a
// length beyond the pair's ball radius (a ball displaced by half its
// radius already runs off its seat in the exact model, [Assembly.Pose]),
// or an angle beyond maxAngleTolerance. The message gives the value in
// the units it was probably meant in, when that value would be accepted.
func (a *Assembly) checkScale(i int, t Tolerance, d *dimension) error {
	lim, _ := t.limit()
	v := t.value()
	written := func(unit string) string {
		if t.Sigma > 0 {
			return fmt.Sprintf("σ %.4g %s (3σ %.4g %s)", v, unit, lim, unit)
		}
		return fmt.Sprintf("%.4g %s", v, unit)
	}
	field := indexed("tols", i) + "." + t.field()
	type unit struct {
		name   string
		factor float64
	}
	// hints gives the value in base units for each unit in which it would
	// be accepted (at most bound, at least floor).
	hints := func(bound, floor float64, base string, us ...unit) string {
		var hs []string
		for _, u := range us {
			if lim*u.factor <= bound && v*u.factor >= floor {
				hs = append(hs, fmt.Sprintf("if that is %s, it is %.4g %s", u.name, v*u.factor, base))
			}
		}
		if len(hs) == 0 {
			return ""
		}
		return " (" + strings.Join(hs, "; ") + ")"
	}
	if d.angular() {
		if lim <= maxAngleTolerance {
			return nil
		}
		return &InputError{Field: field, Err: fmt.Errorf(
			"%w: %s on %s: an angular tolerance is at most %g rad (%.2g°); angles are in radians%s",
			ErrRange, written("rad"), t.Dimension, maxAngleTolerance, maxAngleTolerance*180/math.Pi,
			hints(maxAngleTolerance, 0, "rad", unit{"degrees", math.Pi / 180}, unit{"arcminutes", math.Pi / 10800}))}
	}
	p := &a.pairs[d.pair]
	r := p.ball.Radius
	if lim <= r {
		return nil
	}
	return &InputError{Field: field, Err: fmt.Errorf(
		"%w: %s on %s exceeds ball %s's radius %g m: no part made to it could seat, and a first-order budget means nothing; lengths are in metres%s",
		ErrRange, written("m"), t.Dimension, p.name, r,
		hints(r, minLengthHint, "m", unit{"µm", 1e-6}, unit{"mm", 1e-3}))}
}
