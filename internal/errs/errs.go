package errs

import "errors"

var (
	// ErrNonFinite reports a NaN or an infinity where a finite number is
	// needed.
	ErrNonFinite = errors.New("not finite")

	// ErrRange reports a finite number outside its domain (a radius that is
	// not positive, an angle outside its interval), or input whose result
	// would leave the floating-point range.
	ErrRange = errors.New("out of range")

	// ErrDegenerate reports geometry that defines nothing: a zero direction,
	// coincident points, too few elements, a layout with no answer.
	ErrDegenerate = errors.New("degenerate")
)

// Kind is a sentinel that refines another: errors.Is finds both the kind
// and its parent. hertz.ErrLineContact, for example, is a Kind whose parent
// is ErrDegenerate.
type Kind struct {
	msg    string
	parent error
}

// New returns a sentinel with the message msg that refines parent.
func New(msg string, parent error) *Kind { return &Kind{msg: msg, parent: parent} }

// Error returns the message.
func (k *Kind) Error() string { return k.msg }

// Unwrap returns the parent sentinel.
func (k *Kind) Unwrap() error { return k.parent }
