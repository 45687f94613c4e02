package kinematic

import "errors"

// Sentinel errors wrapped by [InputError].
var (
	// ErrNonFinite reports a NaN or infinite number.
	ErrNonFinite = errors.New("not finite")
	// ErrRange reports a number outside its domain: a radius that is not
	// positive, a half-angle outside (0, π/2), an azimuth window that is
	// empty.
	ErrRange = errors.New("out of range")
	// ErrDegenerate reports geometry that defines nothing: a zero
	// direction, a groove along its own up direction, coincident balls,
	// too few contacts.
	ErrDegenerate = errors.New("degenerate")
	// ErrNotExact reports a contact set that is not exactly constrained
	// (six independent contacts) where an analysis needs one.
	ErrNotExact = errors.New("not exactly constrained")
)

// InputError reports an invalid input: the field that holds it, and why.
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "Pairs[1].Seat.HalfAngle" or "cs[4].Normal"
	Err   error  // wraps one of the package's sentinel errors
}

// Error returns the package, the field and the reason, for example
// "kinematic: Pairs[1].Seat.HalfAngle: out of range: ...".
func (e *InputError) Error() string { return "kinematic: " + e.Field + ": " + e.Err.Error() }

// Unwrap returns the underlying error, which wraps a sentinel.
func (e *InputError) Unwrap() error { return e.Err }
