package draw

import "github.com/sixfold-dev/sixfold/internal/errs"

// The shared sentinels, wrapped by every *InputError of this package.
var (
	ErrNonFinite  = errs.ErrNonFinite  // a NaN or an infinity where a finite number is needed
	ErrRange      = errs.ErrRange      // a finite number outside its domain
	ErrDegenerate = errs.ErrDegenerate // nothing to draw, or sizes that do not agree
)

// InputError reports an invalid input: the field that holds it, and why.
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "Balls[2].Radius"
	Err   error  // wraps one of the sentinels above
}

// Error returns the package, the field and the reason.
func (e *InputError) Error() string { return "draw: " + e.Field + ": " + e.Err.Error() }

// Unwrap returns the wrapped error, so that errors.Is finds the sentinel.
func (e *InputError) Unwrap() error { return e.Err }
