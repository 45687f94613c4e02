package draw

import (
	"fmt"
	"math"
	"strconv"
)

// Scale is a continuous colour scale: the quantity it shows, its unit, and
// the values at its two ends. Min = Max = 0 (the zero Scale) means "from
// the data": the smallest and largest finite value drawn. Values outside
// [Min, Max] take the colour of the nearer end; their printed value is
// exact.
type Scale struct {
	Name     string  // the quantity, e.g. "Maxwell index"
	Unit     string  // its unit as printed, e.g. "N"; empty for a pure number
	Min, Max float64 // values at the low and high end, in Unit
}

// stops of the sequential colour scale, low to high: deep violet, steel
// blue, green, amber. Lightness rises monotonically, so the scale also
// reads in grey.
var stops = [...][3]float64{
	{59, 31, 92},
	{46, 106, 142},
	{63, 163, 111},
	{239, 201, 76},
}

// colour returns the scale colour at t in [0, 1] (clamped) as #rrggbb.
func colour(t float64) string {
	t = math.Min(math.Max(t, 0), 1)
	n := float64(len(stops) - 1)
	i := int(math.Min(math.Floor(t*n), n-1))
	f := t*n - float64(i)
	var c [3]int
	for k := range c {
		c[k] = int(math.Round(stops[i][k] + f*(stops[i+1][k]-stops[i][k])))
	}
	return fmt.Sprintf("#%02x%02x%02x", c[0], c[1], c[2])
}

// resolve returns the scale's ends, taking them from the finite values in
// vs when the scale is zero; lo == hi when the data hold one value (or none).
func (s Scale) resolve(vs []float64) (lo, hi float64) {
	if s.Min != 0 || s.Max != 0 {
		return s.Min, s.Max
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	if lo > hi {
		return 0, 0
	}
	return lo, hi
}

// fraction returns where v lies between lo and hi, in [0, 1]; the middle
// when lo == hi.
func fraction(v, lo, hi float64) float64 {
	if hi <= lo {
		return 0.5
	}
	return math.Min(math.Max((v-lo)/(hi-lo), 0), 1)
}

// maxValue bounds the magnitude of a value on a colour scale, so that
// the span of the scale (a difference of two values) stays finite; it is a
// range guard, not a tolerance.
const maxValue = 1e300

// value returns an *InputError naming field when v is NaN, infinite or
// beyond ±maxValue.
func value(field string, v float64) error {
	if err := finite(field, v); err != nil {
		return err
	}
	if math.Abs(v) > maxValue {
		return &InputError{Field: field, Err: fmt.Errorf("%w: %g beyond ±%g", ErrRange, v, maxValue)}
	}
	return nil
}

// validate checks the scale's ends, naming them under field.
func (s Scale) validate(field string) error {
	if err := value(field+".Min", s.Min); err != nil {
		return err
	}
	if err := value(field+".Max", s.Max); err != nil {
		return err
	}
	if (s.Min != 0 || s.Max != 0) && !(s.Max > s.Min) {
		return &InputError{Field: field + ".Max", Err: fmt.Errorf("%w: Max %g must exceed Min %g", ErrRange, s.Max, s.Min)}
	}
	return nil
}

// finite returns an *InputError naming field when v is NaN or infinite.
func finite(field string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: %v", ErrNonFinite, v)}
	}
	return nil
}

// niceStep returns a step of 1, 2 or 5 times a power of ten that divides
// span into about n parts (Heckbert, "Nice numbers for graph labels",
// Graphics Gems, 1990).
func niceStep(span float64, n int) float64 {
	if !(span > 0) {
		return 1
	}
	raw := span / float64(n)
	p := math.Pow(10, math.Floor(math.Log10(raw)))
	switch f := raw / p; {
	case f < 1.5:
		return p
	case f < 3.5:
		return 2 * p
	case f < 7.5:
		return 5 * p
	default:
		return 10 * p
	}
}

// roundBelow returns the largest 1, 2 or 5 times a power of ten that is ≤ x > 0.
func roundBelow(x float64) float64 {
	p := math.Pow(10, math.Floor(math.Log10(x)))
	for _, f := range []float64{5, 2, 1} {
		if f*p <= x*(1+1e-12) {
			return f * p
		}
	}
	return p
}

// ticks returns the multiples of step in [lo, hi], with a tolerance of a
// millionth of a step so that rounding keeps the ends.
func ticks(lo, hi, step float64) []float64 {
	var ts []float64
	for k := math.Ceil(lo/step - 1e-6); k*step <= hi+1e-6*step; k++ {
		ts = append(ts, k*step)
		if len(ts) > 1000 {
			break
		}
	}
	return ts
}

// tickText formats the tick value v of a scale with step step, with as
// many decimals as the step needs (0.25 needs two).
func tickText(v, step float64) string {
	d := 0
	for ; d < 15; d++ {
		f := step * math.Pow(10, float64(d))
		if math.Abs(f-math.Round(f)) < 1e-6*f {
			break
		}
	}
	if math.Abs(v) < step*1e-9 {
		v = 0
	}
	return strconv.FormatFloat(v, 'f', d, 64)
}

// sig formats v with three significant figures, in fixed notation from
// 1e-3 to 1e6 and in exponent notation outside.
func sig(v float64) string {
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e6 {
		d := max(0, 2-int(math.Floor(math.Log10(a))))
		return strconv.FormatFloat(v, 'f', d, 64)
	}
	return strconv.FormatFloat(v, 'e', 2, 64)
}

// withUnit joins a value and its unit.
func withUnit(v, unit string) string {
	if unit == "" {
		return v
	}
	return v + " " + unit
}
