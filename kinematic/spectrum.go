package kinematic

import (
	"fmt"
	"math"
	"sort"
)

// Spectrum is a power spectral density of base acceleration, in g²/Hz
// with g = [StandardGravity], given by breakpoints as a test
// specification gives it: linear in log–log between breakpoints and zero
// outside the band from the first breakpoint to the last.
type Spectrum struct {
	// Points are the breakpoints in increasing frequency, at least two.
	Points []Breakpoint
}

// Breakpoint is one breakpoint of a [Spectrum]: a frequency in Hz and
// either its level in g²/Hz or the slope that carries a neighbour's
// level to it.
type Breakpoint struct {
	Frequency float64 // Hz, > 0, increasing along Spectrum.Points

	// ASD is the level in g²/Hz, > 0; 0 means that the level follows
	// from an anchor (a breakpoint with a level) through the slopes in
	// between.
	ASD float64

	// Slope is the slope in dB/octave of the segment from the previous
	// breakpoint to this one, used only when one of the two has ASD 0: a
	// slope of X dB/octave is the log–log exponent X / (10 log10 2), so
	// that 6 dB/octave is f^1.993, not f². Levels propagate forward from
	// the nearest anchor before and backward from the nearest anchor
	// after; a Slope on a segment whose two ends both have a level is an
	// error (it would contradict them). A Slope of 0 cannot carry a
	// level: a breakpoint with ASD 0 whose level would come through a
	// segment of Slope 0 is an error naming that Slope, for the zero
	// value cannot tell "flat" from a slope left out or a level of 0
	// meant as none. A flat segment is written by repeating the level;
	// the spectrum is zero outside its band without a breakpoint of 0.
	Slope float64
}

// spectrum is a validated Spectrum: frequencies f (Hz), levels a (g²/Hz)
// and the log–log exponent n of each segment.
type spectrum struct {
	f, a, n []float64
}

// dBPerOctave is 10 log10 2: a slope of X dB/octave is the exponent
// X / dBPerOctave.
var dBPerOctave = 10 * math.Log10(2)

// prepare validates s and resolves its levels. Errors are
// [*InputError]s naming "Points" (fewer than two breakpoints, or none
// with a level) or the breakpoint's field, e.g. "Points[2].Frequency" or
// "Points[1].Slope" (a level of 0 to be carried by a slope of 0),
// wrapping ErrNonFinite, ErrRange or ErrDegenerate.
func (s Spectrum) prepare() (spectrum, error) {
	p := s.Points
	if len(p) < 2 {
		return spectrum{}, &InputError{Field: "Points", Err: fmt.Errorf("%w: a spectrum needs at least two breakpoints, got %d", ErrDegenerate, len(p))}
	}
	n := len(p)
	sp := spectrum{f: make([]float64, n), a: make([]float64, n), n: make([]float64, n-1)}
	anchor := false
	for i, b := range p {
		field := indexed("Points", i)
		switch {
		case !allFinite(b.Frequency):
			return spectrum{}, &InputError{Field: field + ".Frequency", Err: fmt.Errorf("%w: %g Hz", ErrNonFinite, b.Frequency)}
		case !(b.Frequency > 0):
			return spectrum{}, &InputError{Field: field + ".Frequency", Err: fmt.Errorf("%w: %g Hz: a frequency must be positive", ErrRange, b.Frequency)}
		case i > 0 && !(b.Frequency > p[i-1].Frequency):
			return spectrum{}, &InputError{Field: field + ".Frequency", Other: indexed("Points", i-1) + ".Frequency", Err: fmt.Errorf("%w: %g Hz does not increase on the previous breakpoint's %g Hz", ErrRange, b.Frequency, p[i-1].Frequency)}
		case !allFinite(b.ASD):
			return spectrum{}, &InputError{Field: field + ".ASD", Err: fmt.Errorf("%w: %g g²/Hz", ErrNonFinite, b.ASD)}
		case b.ASD < 0:
			return spectrum{}, &InputError{Field: field + ".ASD", Err: fmt.Errorf("%w: %g g²/Hz: a level must be positive (0 takes it from a slope)", ErrRange, b.ASD)}
		case !allFinite(b.Slope):
			return spectrum{}, &InputError{Field: field + ".Slope", Err: fmt.Errorf("%w: %g dB/octave", ErrNonFinite, b.Slope)}
		case i == 0 && b.Slope != 0:
			// A slope belongs to the segment ending at its breakpoint; a
			// table that lists "20 Hz, +6 dB/octave" means the segment
			// after 20 Hz, which is the next breakpoint's (Other).
			seg := ""
			if f1 := p[1].Frequency; allFinite(f1) && f1 > b.Frequency {
				seg = fmt.Sprintf(" (the segment from %g Hz to %g Hz)", b.Frequency, f1)
			}
			return spectrum{}, &InputError{Field: field + ".Slope", Other: indexed("Points", 1) + ".Slope", Err: fmt.Errorf(
				"%w: the first breakpoint has no segment before it for a slope of %g dB/octave: a slope belongs to the segment that ends at its breakpoint, so give it on the next breakpoint%s",
				ErrRange, b.Slope, seg)}
		case i > 0 && b.Slope != 0 && b.ASD > 0 && p[i-1].ASD > 0:
			return spectrum{}, &InputError{Field: field + ".Slope", Err: fmt.Errorf("%w: both ends of the segment have a level, so a slope of %g dB/octave would contradict them; give one level or the other", ErrRange, b.Slope)}
		}
		sp.f[i], sp.a[i] = b.Frequency, b.ASD
		anchor = anchor || b.ASD > 0
	}
	if !anchor {
		return spectrum{}, &InputError{Field: "Points", Err: fmt.Errorf("%w: no breakpoint has a level (ASD > 0) to anchor the slopes", ErrDegenerate)}
	}
	// Forward from each anchor, then backward to the breakpoints before
	// the first one: a(i) = a(j)·(f(i)/f(j))^(X/dBPerOctave).
	for i := 1; i < n; i++ {
		if sp.a[i] == 0 && sp.a[i-1] > 0 {
			if p[i].Slope == 0 {
				return spectrum{}, errNoSlope(i, i, sp.f[i], sp.a[i-1], "previous")
			}
			sp.a[i] = sp.a[i-1] * math.Pow(sp.f[i]/sp.f[i-1], p[i].Slope/dBPerOctave)
			if !(sp.a[i] > 0) || math.IsInf(sp.a[i], 0) {
				return spectrum{}, &InputError{Field: indexed("Points", i) + ".Slope", Err: fmt.Errorf("%w: the level carried by %g dB/octave leaves the floating-point range", ErrRange, p[i].Slope)}
			}
		}
	}
	for i := n - 2; i >= 0; i-- {
		if sp.a[i] == 0 {
			if p[i+1].Slope == 0 {
				return spectrum{}, errNoSlope(i, i+1, sp.f[i], sp.a[i+1], "next")
			}
			sp.a[i] = sp.a[i+1] * math.Pow(sp.f[i]/sp.f[i+1], p[i+1].Slope/dBPerOctave)
			if !(sp.a[i] > 0) || math.IsInf(sp.a[i], 0) {
				return spectrum{}, &InputError{Field: indexed("Points", i+1) + ".Slope", Err: fmt.Errorf("%w: the level carried by %g dB/octave leaves the floating-point range", ErrRange, p[i+1].Slope)}
			}
		}
	}
	for i := range n - 1 {
		sp.n[i] = math.Log(sp.a[i+1]/sp.a[i]) / math.Log(sp.f[i+1]/sp.f[i])
	}
	return sp, nil
}

// errNoSlope refuses breakpoint i (Other), at f Hz, whose level is 0 (to follow
// from a slope) while the slope of the segment that would carry the
// neighbouring level a to it, Points[j].Slope, is 0 too: read as a flat
// segment, it would be the level a unchanged, but a caller who wrote a
// level of 0 meaning "no vibration" or who left the slope out meant
// something else, and a flat segment is written by repeating the level.
func errNoSlope(i, j int, f, a float64, which string) error {
	// Other names the breakpoint, not its ASD, which the caller may not
	// have written (a design file's breakpoint with no "asd" key).
	return &InputError{Field: indexed("Points", j) + ".Slope", Other: indexed("Points", i), Err: fmt.Errorf(
		"%w: the breakpoint at %g Hz has no level (ASD 0) and the segment that would carry the %s level to it no slope (0 dB/octave): "+
			"for a flat segment repeat the level, %g g²/Hz, at %g Hz; a level of 0 is not a spectrum level (the band ends at its last breakpoint); otherwise give the slope in dB/octave",
		ErrRange, f, which, a, f)}
}

// at returns the level at f in g²/Hz, zero outside the band.
func (sp *spectrum) at(f float64) float64 {
	n := len(sp.f)
	if !(f >= sp.f[0] && f <= sp.f[n-1]) {
		return 0
	}
	i := sort.SearchFloat64s(sp.f, f) // first f[i] ≥ f
	if i == 0 {
		return sp.a[0]
	}
	i--
	return sp.a[i] * math.Pow(f/sp.f[i], sp.n[i])
}

// meanSquare returns ∫ S df over the band in g²: per segment, with
// L = ln(f2/f1) and x = (n+1)L, ∫ a1 (f/f1)^n df = a1 f1 L·expm1(x)/x,
// which is a1 f1 ln(f2/f1) at the exponent n = −1 (x = 0) and exact and
// smooth on both sides of it.
func (sp *spectrum) meanSquare() float64 {
	var s float64
	for i := range sp.n {
		L := math.Log(sp.f[i+1] / sp.f[i])
		x := (sp.n[i] + 1) * L
		r := 1.0
		if x != 0 {
			r = math.Expm1(x) / x
		}
		s += sp.a[i] * sp.f[i] * L * r
	}
	return s
}

// GRMS returns the overall RMS level of the spectrum in g (multiply by
// [StandardGravity] for m/s²): the square root of its integral over the
// band, exact per log–log segment. Errors are [*InputError]s naming the
// breakpoint ("Points[2].Frequency" for a frequency that does not
// increase, "Points[1].ASD" for a negative level) or "Points" for fewer
// than two breakpoints, wrapping [ErrRange], [ErrNonFinite] or
// [ErrDegenerate].
func (s Spectrum) GRMS() (float64, error) {
	sp, err := s.prepare()
	if err != nil {
		return 0, err
	}
	g := math.Sqrt(sp.meanSquare())
	if !allFinite(g) {
		return 0, &InputError{Field: "Points", Err: fmt.Errorf("%w: the overall level overflows", ErrRange)}
	}
	return g, nil
}

// Level returns the level at the frequency f in g²/Hz, interpolated
// linearly in log–log and zero outside the band. Errors are those of
// [Spectrum.GRMS].
func (s Spectrum) Level(f float64) (float64, error) {
	sp, err := s.prepare()
	if err != nil {
		return 0, err
	}
	return sp.at(f), nil
}
