package hertz

import (
	"fmt"

	"github.com/sixfold-dev/sixfold/internal/errs"
)

// Sentinel errors wrapped by every *InputError this package returns; test
// for them with errors.Is.
//
// ErrNonFinite, ErrRange and ErrDegenerate are the meanings the module's
// packages share: the values of the module's internal/errs, which each
// package re-exports under these names, so that an error translated into
// another package's vocabulary still matches. ErrLineContact and
// ErrGeometry refine ErrDegenerate: errors.Is(err, ErrDegenerate) is true
// for an error that wraps either of them.
var (
	// ErrNonFinite reports a NaN anywhere, or an infinity where only a
	// finite number is accepted: an angle, Poisson's ratio, an expansion
	// coefficient, an allowable pressure, a load, a pressure, an approach,
	// a coefficient of friction. Radii (±Inf: straight) and Young's
	// modulus (+Inf: rigid) accept an infinity.
	ErrNonFinite = errs.ErrNonFinite

	// ErrRange reports a number that is not NaN but outside its domain (a
	// zero radius, E ≤ 0 or E = −Inf, ν outside (−1, 0.5], a negative load,
	// pressure or approach, |q| at the sliding limit), or input whose
	// result would leave the range of normal float64 numbers (overflow,
	// or underflow below 2.2e-308, where precision is lost).
	ErrRange = errs.ErrRange

	// ErrDegenerate reports input that defines no Hertz solution. It is
	// wrapped through ErrLineContact or ErrGeometry for a pair of bodies,
	// and directly for a Pair that was not made by NewPair.
	ErrDegenerate = errs.ErrDegenerate

	// ErrLineContact reports that the relative curvature vanishes in one
	// direction (parallel cylinders, a cylinder on a flat, a ball in a
	// groove of its own radius): the bodies touch along a line and Hertz's
	// point-contact solution does not apply. It refines ErrDegenerate.
	ErrLineContact error = errs.New("line contact", errs.ErrDegenerate)

	// ErrGeometry reports a pair of bodies without a Hertz point contact:
	// the surfaces conform or separate in every direction (flat on flat, a
	// socket of the ball's radius), a concave body is tighter than the
	// convex one in some direction (a socket smaller than the ball), or
	// both bodies are rigid. It refines ErrDegenerate.
	ErrGeometry error = errs.New("no Hertz contact", errs.ErrDegenerate)
)

// InputError reports an invalid input: the field that holds it, and why.
//
// Field names the input as the caller wrote it, in one of these forms:
//
//   - a parameter of the function: "load", "p0", "delta", "mu", "q", "d",
//     "amplitude";
//   - a path into a parameter: "b1.R1", "b2.Angle", "b1.Material.E",
//     "c.SemiMinor" (the receiver of a Contact method), "p" (the receiver
//     of a Pair method);
//   - several such paths joined by ", " when the fault lies in their
//     combination: "b1, b2" (the two bodies together, for example a line
//     contact), "b1.Material.E, b2.Material.E", "b1.Material, b2.Material".
//
// Every path that refers to a body starts with "b1" or "b2", the first and
// second Body argument of Solve or NewPair (also for errors returned by the
// methods of the Pair made from them), so that a caller can replace those
// prefixes by its own names for the two bodies after splitting on ", ".
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "b1.R1", "load", "b1, b2"
	Err   error  // wraps one of the package's sentinel errors
}

// Error returns the package, the field and the reason, for example
// "hertz: b1.R1: not finite: radius is NaN".
func (e *InputError) Error() string { return "hertz: " + e.Field + ": " + e.Err.Error() }

// Unwrap returns the wrapped error, so that errors.Is finds the sentinel.
func (e *InputError) Unwrap() error { return e.Err }

// inputErr returns an *InputError for field wrapping the sentinel kind,
// with a message built from format and args.
func inputErr(field string, kind error, format string, args ...any) error {
	return &InputError{Field: field, Err: fmt.Errorf("%w: "+format, append([]any{kind}, args...)...)}
}

// rangeErr returns an *InputError for field wrapping ErrRange.
func rangeErr(field, format string, args ...any) error {
	return inputErr(field, ErrRange, format, args...)
}

// nonFiniteErr returns an *InputError for field wrapping ErrNonFinite.
func nonFiniteErr(field, format string, args ...any) error {
	return inputErr(field, ErrNonFinite, format, args...)
}

// checkMu returns an *InputError for "mu" wrapping ErrRange when the
// coefficient of friction mu exceeds 3, a percentage (errs.CheckMu, the
// bound package kinematic and the design file apply too).
func checkMu(mu float64) error {
	if err := errs.CheckMu(mu); err != nil {
		return &InputError{Field: "mu", Err: err}
	}
	return nil
}

// checkMuLow returns an *InputError for "mu" when the coefficient of
// friction mu is not finite or below the entry's lower bound (≥ 0 when
// zeroOK, > 0 otherwise), worded as package kinematic words it
// (errs.CheckMuLow).
func checkMuLow(mu float64, zeroOK bool) error {
	if err := errs.CheckMuLow(mu, zeroOK); err != nil {
		return &InputError{Field: "mu", Err: err}
	}
	return nil
}
