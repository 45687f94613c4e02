package hertz

import "errors"

// Sentinel errors wrapped by every *InputError this package returns; test
// for them with errors.Is.
var (
	// ErrRange reports a value outside its domain: NaN or infinity where a
	// finite number is needed, a zero radius, E ≤ 0, ν outside (−1, 0.5],
	// a negative load, pressure or approach, or a result that would leave
	// the floating-point range.
	ErrRange = errors.New("value out of range")

	// ErrLineContact reports that the relative curvature vanishes in one
	// direction (parallel cylinders, a cylinder on a flat, a ball in a
	// groove of its own radius): the bodies touch along a line and Hertz's
	// point-contact solution does not apply.
	ErrLineContact = errors.New("line contact")

	// ErrGeometry reports a pair of bodies without a Hertz point contact:
	// the surfaces conform or separate in every direction (flat on flat, a
	// socket of the ball's radius), a concave body is tighter than the
	// convex one in some direction (a socket smaller than the ball), or
	// both bodies are rigid.
	ErrGeometry = errors.New("no Hertz contact")
)

// InputError reports an invalid input: the field that holds it, and why.
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "b1.R1", "load"
	Err   error  // wraps one of the package's sentinel errors
}

// Error returns the package, the field and the reason, for example
// "hertz: b1.R1: out of range: ...".
func (e *InputError) Error() string { return "hertz: " + e.Field + ": " + e.Err.Error() }

// Unwrap returns the wrapped error, so that errors.Is finds the sentinel.
func (e *InputError) Unwrap() error { return e.Err }
