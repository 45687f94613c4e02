package errs

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// MaxMu is the largest coefficient of friction any entry of the module
// accepts (the Go API, the design file and the examples): the solids of
// kinematic couplings (steels, ceramics, carbides, dry or lubricated) lie
// well below 1 (common practice), and clean metals in vacuum reach a few;
// a larger number is a percentage or a slip of the keyboard.
const MaxMu = 3

// CheckMu returns an error wrapping ErrRange, worded for the percentage it
// probably is, when the coefficient of friction mu is finite and exceeds
// MaxMu, and nil otherwise: NaN, infinities and the lower bound are the
// callers' to refuse, in their own words. Callers wrap the error in their
// own field's name ("mu", "friction.mu", "-mu").
func CheckMu(mu float64) error {
	if mu > MaxMu && mu <= math.MaxFloat64 {
		// The reading keeps the significant digits the caller wrote
		// (3.0001% is 0.030001, not the rounding 0.030001000000000003).
		return fmt.Errorf("%w: a coefficient of friction of %g: a percentage? (%g%% is %.*g); at most %g", ErrRange, mu, mu, digits(mu), mu/100, float64(MaxMu))
	}
	return nil
}

// digits returns the number of significant digits of the shortest
// decimal that reads back as x (3 for 3.01, 5 for 3.0001).
func digits(x float64) int {
	m, _, _ := strings.Cut(strconv.FormatFloat(math.Abs(x), 'e', -1, 64), "e")
	return len(strings.Replace(m, ".", "", 1))
}

// CheckMuLow returns an error when the coefficient of friction mu is not
// finite (wrapping ErrNonFinite) or below the entry's lower bound
// (wrapping ErrRange): mu ≥ 0 when zeroOK (an entry that has an answer
// without friction), mu > 0 otherwise. Every entry words it alike;
// callers wrap it in their own field's name and apply CheckMu for the
// bound above.
func CheckMuLow(mu float64, zeroOK bool) error {
	bound := "> 0"
	if zeroOK {
		bound = "≥ 0"
	}
	switch {
	case math.IsNaN(mu) || math.IsInf(mu, 0):
		return fmt.Errorf("%w: a coefficient of friction must be finite and %s, got %g", ErrNonFinite, bound, mu)
	case mu < 0 || mu == 0 && !zeroOK:
		return fmt.Errorf("%w: a coefficient of friction must be %s, got %g", ErrRange, bound, mu)
	}
	return nil
}
