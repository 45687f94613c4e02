package screw

import "github.com/sixfold-dev/sixfold/internal/errs"

// Sentinel errors wrapped by [InputError]. They are the values of package
// internal/errs that every package of the module re-exports, so that
// errors.Is gives the same answer with screw.ErrRange as with
// kinematic.ErrRange.
var (
	// ErrNonFinite reports a NaN or infinite component.
	ErrNonFinite = errs.ErrNonFinite
	// ErrRange reports input whose magnitudes are too far apart to be
	// analysed in float64 arithmetic.
	ErrRange = errs.ErrRange
	// ErrDegenerate reports input that defines nothing: an empty set of
	// wrenches, a zero wrench, a zero direction.
	ErrDegenerate = errs.ErrDegenerate
)

// InputError reports an invalid input: the field that holds it, and why.
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "ws[2].F" or "n"
	Err   error  // wraps one of the package's sentinel errors
}

// Error returns the package, the field and the reason, for example
// "screw: ws[2].F: not finite: ...".
func (e *InputError) Error() string { return "screw: " + e.Field + ": " + e.Err.Error() }

// Unwrap returns the underlying error, which wraps a sentinel.
func (e *InputError) Unwrap() error { return e.Err }
