package errs

import (
	"fmt"
	"math"
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
		return fmt.Errorf("%w: a coefficient of friction of %g: a percentage? (%g%% is %g); at most %g", ErrRange, mu, mu, mu/100, float64(MaxMu))
	}
	return nil
}
