package screw

import "errors"

// Sentinel errors wrapped by [InputError].
var (
	// ErrEmpty reports an empty set of wrenches.
	ErrEmpty = errors.New("empty")
	// ErrNonFinite reports a NaN or infinite component.
	ErrNonFinite = errors.New("not finite")
	// ErrZero reports a zero direction or a zero wrench, which defines no line.
	ErrZero = errors.New("zero")
	// ErrRange reports input whose magnitudes are too far apart to be
	// analysed in float64 arithmetic.
	ErrRange = errors.New("out of range")
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
