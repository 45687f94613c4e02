package kinematic

import (
	"errors"
	"strings"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/errs"
)

// Sentinel errors wrapped by [InputError]. ErrNonFinite, ErrRange and
// ErrDegenerate are the same values as screw's and hertz's sentinels of the
// same names, so errors.Is gives one answer whichever package's name a
// caller tests with.
var (
	// ErrNonFinite reports a NaN or infinite number.
	ErrNonFinite = errs.ErrNonFinite

	// ErrRange reports a finite number outside its domain: a radius that
	// is not positive, a half-angle outside (0, π/2), an empty azimuth
	// window; or input whose result would leave the floating-point range.
	ErrRange = errs.ErrRange

	// ErrDegenerate reports geometry that defines nothing: a zero
	// direction, a groove along its own up direction, coincident balls,
	// too few contacts, two bodies without a Hertz point contact
	// (hertz.ErrGeometry and hertz.ErrLineContact refine it).
	ErrDegenerate = errs.ErrDegenerate

	// ErrNotExact reports a contact set that is not exactly constrained
	// (six independent contacts) where an analysis needs one.
	ErrNotExact = errors.New("not exactly constrained")
)

// InputError reports an invalid input: the field that holds it, as the
// caller wrote it, and why. Errors that arise in package screw or hertz
// come back as an InputError of this package too, with the field path
// translated into the caller's terms ("cs[3].Normal", not "ws[3].F";
// "Pairs[2].Seat.Material.E", not "b2.Material.E") and Err holding the
// other package's reason, so that errors.Is finds its sentinels as well.
type InputError struct {
	Field string // the input as the caller wrote it, e.g. "Pairs[1].Seat.HalfAngle" or "cs[4].Normal"
	Err   error  // wraps one of the package's sentinel errors

	// Other is a second input that the reason refers to, as the caller
	// wrote it ("Pairs[0].Ball.Centre" for a ball with the same centre,
	// "tols[1].Dimension" for a dimension toleranced twice), or "". The
	// reason in Err does not name it; Error appends it, so that a caller
	// translating field paths translates both.
	Other string
}

// Error returns the package, the field and the reason, and the other
// input when there is one, for example
// "kinematic: Pairs[1].Seat.HalfAngle: out of range: ..." or
// "kinematic: Pairs[2].Ball.Centre: degenerate geometry: the same centre as another ball; see Pairs[0].Ball.Centre".
func (e *InputError) Error() string {
	s := "kinematic: " + e.Field + ": " + e.Err.Error()
	if e.Other != "" {
		s += "; see " + e.Other
	}
	return s
}

// Unwrap returns the underlying error, which wraps a sentinel.
func (e *InputError) Unwrap() error { return e.Err }

// fromHertz translates an error of package hertz about the bodies of one
// contact into this package's vocabulary: hertz's "b1" (the moving body's
// surface) becomes moving, "b2" becomes base, and any other name (the
// load, a pressure) is looked up in params ("load" → "cs[2] force").
// Errors that are not hertz input errors are returned as they are.
func fromHertz(err error, moving, base string, params map[string]string) error {
	var he *hertz.InputError
	if !errors.As(err, &he) {
		return err
	}
	parts := strings.Split(he.Field, ", ")
	for i, p := range parts {
		head, rest, _ := strings.Cut(p, ".")
		switch {
		case head == "b1":
			parts[i] = joinField(moving, rest)
		case head == "b2":
			parts[i] = joinField(base, rest)
		case params[head] != "":
			parts[i] = joinField(params[head], rest)
		}
	}
	return &InputError{Field: strings.Join(parts, ", "), Err: he.Err}
}

func joinField(head, rest string) string {
	if rest == "" {
		return head
	}
	return head + "." + rest
}

// rename is one rewriting of a field path: a path that is From, or starts
// with From followed by ".", "[" or " ", gets To in its place.
type rename struct{ From, To string }

// renamed returns err with the field paths of its [*InputError] (Field and
// Other, each a list separated by ", ") rewritten by the first matching
// rule of rs, so that a public function passes on the errors of the
// functions it calls in its own caller's vocabulary ("preloads[0]" from
// NewModel becomes "s.Preloads[0]" in Score). Other errors are returned
// as they are.
func renamed(err error, rs ...rename) error {
	var ie *InputError
	if !errors.As(err, &ie) {
		return err
	}
	return &InputError{Field: renameList(ie.Field, rs), Other: renameList(ie.Other, rs), Err: ie.Err}
}

func renameList(list string, rs []rename) string {
	if list == "" {
		return ""
	}
	parts := strings.Split(list, ", ")
	for i, p := range parts {
		for _, r := range rs {
			if p == r.From || strings.HasPrefix(p, r.From+".") || strings.HasPrefix(p, r.From+"[") || strings.HasPrefix(p, r.From+" ") {
				parts[i] = r.To + p[len(r.From):]
				break
			}
		}
	}
	return strings.Join(parts, ", ")
}

// checkMu returns an [*InputError] naming "mu" when the coefficient of
// friction mu exceeds 3, a percentage (errs.CheckMu, the bound the design
// file applies too).
func checkMu(mu float64) error {
	if err := errs.CheckMu(mu); err != nil {
		return &InputError{Field: "mu", Err: err}
	}
	return nil
}

// checkMuLow returns an [*InputError] naming "mu" when the coefficient of
// friction mu is not finite or below the entry's lower bound (≥ 0 when
// zeroOK, > 0 otherwise), worded alike for every entry (errs.CheckMuLow).
func checkMuLow(mu float64, zeroOK bool) error {
	if err := errs.CheckMuLow(mu, zeroOK); err != nil {
		return &InputError{Field: "mu", Err: err}
	}
	return nil
}
