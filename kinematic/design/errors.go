package design

import (
	"errors"
	"fmt"
	"strings"

	"github.com/sixfold-dev/sixfold/internal/errs"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// Sentinel errors wrapped by [Error]. ErrNonFinite, ErrRange, ErrDegenerate
// and ErrNotExact are the same values as package kinematic's, so
// errors.Is(err, kinematic.ErrRange) and errors.Is(err, design.ErrRange)
// give one answer.
var (
	// ErrNonFinite reports a NaN or infinite number, for example a
	// quantity such as "1e400 mm" that overflows float64.
	ErrNonFinite = kinematic.ErrNonFinite

	// ErrRange reports a finite number outside its domain: a half-angle
	// of 95°, a negative radius, more balls than the format allows.
	ErrRange = kinematic.ErrRange

	// ErrDegenerate reports geometry that defines nothing: a zero
	// direction, a groove along its own up direction, coincident balls.
	ErrDegenerate = kinematic.ErrDegenerate

	// ErrNotExact reports a coupling that is not exactly constrained
	// (six independent contacts), which every design of format version 1
	// must be.
	ErrNotExact = kinematic.ErrNotExact

	// ErrSyntax reports input that is not well-formed JSON.
	ErrSyntax = errors.New("malformed JSON")

	// ErrType reports a JSON value of the wrong type: a string where an
	// object belongs, a number where a name belongs.
	ErrType = errors.New("wrong type")

	// ErrUnknownField reports an object member that the format does not
	// define (often a misspelt name), or one given twice.
	ErrUnknownField = errors.New("unknown field")

	// ErrMissing reports a required member that is absent.
	ErrMissing = errors.New("required")

	// ErrUnit reports a quantity string whose number or unit cannot be
	// read, or whose unit does not measure what the field holds, and a
	// bare number for a quantity (other than 0) in a version 2 file that
	// does not declare "units": "si".
	ErrUnit = errors.New("bad unit")

	// ErrVersion reports a format field naming a version this package
	// does not read. It refines ErrRange.
	ErrVersion = errs.New("unsupported format version", errs.ErrRange)

	// ErrTooLarge reports input beyond the reader's bounds: more than
	// MaxSize bytes, too many entries in a list, too deep a nesting. It
	// refines ErrRange.
	ErrTooLarge = errs.New("too large", errs.ErrRange)

	// ErrRequirement is wrapped by the error of [Verdicts.Err]: a design
	// that does not meet one or more of its requirements.
	ErrRequirement = errors.New("requirement not met")
)

// Error reports a malformed or out-of-range entry of a design: the JSON
// path of the entry as it stands in the file ("seats[2].half_angle",
// "requirements.min_shock.level"; "" for the file as a whole) and why.
// Errors that arise in package kinematic come back as an Error too, with
// kinematic's field paths ("Pairs[1].Seat.HalfAngle") translated into the
// file's ("seats[1].half_angle") and Err holding kinematic's reason, so
// that errors.Is finds kinematic's sentinels.
type Error struct {
	Path string // JSON path of the entry, e.g. "seats[2].half_angle"
	Err  error  // wraps one of the sentinel errors

	// Other is the JSON path of a second entry the reason refers to
	// ("balls[0].centre" for a ball with the same centre as the one at
	// Path, "tolerances[1].dimension" for a dimension toleranced twice),
	// or "".
	Other string
}

// Error returns the package, the path and the reason, and the other
// entry when there is one, for example
// "design: seats[2].half_angle: out of range: must be in (0, 90) deg, got 95 deg" or
// "design: balls[2].centre: degenerate: the same centre as another ball; see balls[0].centre".
func (e *Error) Error() string {
	s := "design: " + e.Err.Error()
	if e.Path != "" {
		s = "design: " + e.Path + ": " + e.Err.Error()
	}
	if e.Other != "" {
		s += "; see " + e.Other
	}
	return s
}

// Unwrap returns the underlying error, which wraps a sentinel.
func (e *Error) Unwrap() error { return e.Err }

// errorf returns an *Error at path wrapping sentinel with a reason.
func errorf(path string, sentinel error, format string, args ...any) *Error {
	return &Error{Path: path, Err: fmt.Errorf("%w: "+format, append([]any{sentinel}, args...)...)}
}

// join returns the path of member key of the object at path.
func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

// index returns the path of element i of the array at path.
func index(path string, i int) string { return fmt.Sprintf("%s[%d]", path, i) }

// translator turns the field paths of package kinematic into the file's
// JSON paths for one call. The fields of kinematic's own types (Pairs,
// cs, preloads, payload) translate the same in every call; the names of a
// call's parameters ("p", "magnitude", "opt") are given by the call, in
// params.
type translator struct {
	b *Built

	// lc is the path of the load case the call was given ("cases[2]"),
	// or "" when it took none.
	lc string

	// params maps the call's parameter names, or whole fields under
	// them ("th.Moving"), to JSON paths; the rest of a field under a
	// parameter is written in the file's spelling ("opt.Samples" with
	// "opt" → "monte_carlo" gives "monte_carlo.samples"). An indexed
	// parameter ("tols[3]") keeps its index.
	params map[string]string

	// fallback is the path used for a field the translator does not
	// know.
	fallback string
}

// pointParams are the parameters of the calls about the point of
// interest.
var pointParams = map[string]string{"p": "point_of_interest", "at": "point_of_interest", "tols": "tolerances"}

// translate returns err with its kinematic field paths translated into
// the file's vocabulary. Errors that are not kinematic input errors
// (a cancelled context) are returned as they are.
func (t translator) translate(err error) error {
	var ke *kinematic.InputError
	if !errors.As(err, &ke) {
		return err
	}
	e := &Error{Path: t.fields(ke.Field), Err: ke.Err}
	if msg := ke.Err.Error(); strings.HasPrefix(ke.Field, "tols[") {
		// A tolerance out of proportion: the API's hint about its bare
		// SI numbers does not apply to a value the file gave with its
		// unit (it was converted already).
		for _, hint := range [...]string{"; lengths are in metres", "; angles are in radians"} {
			if before, _, ok := strings.Cut(msg, hint); ok {
				e.Err = &retext{msg: before, err: ke.Err}
			}
		}
	}
	if ke.Other != "" {
		e.Other = t.fields(ke.Other)
	}
	return e
}

// fields translates a list of kinematic field paths separated by ", ",
// each named once.
func (t translator) fields(list string) string {
	parts := strings.Split(list, ", ")
	out := parts[:0]
	seen := map[string]bool{}
	for _, p := range parts {
		q := t.field(p)
		if !seen[q] {
			seen[q] = true
			out = append(out, q)
		}
	}
	return strings.Join(out, ", ")
}

// field translates one kinematic field path.
func (t translator) field(f string) string {
	if q, ok := t.params[f]; ok {
		return q
	}
	head, rest, _ := strings.Cut(f, ".")
	name, i, indexed := splitIndex(head)
	if name == "tols" && (rest == "HalfWidth" || rest == "Sigma") {
		rest = "Value" // the file gives either as "value" with its "distribution"
	}
	if q, ok := t.params[name]; ok {
		if indexed {
			q = index(q, i)
		}
		return join(q, snake(rest))
	}
	switch {
	case f == "Pairs" || f == "cs":
		return "seats"
	case name == "Pairs" && indexed:
		return t.pairField(i, rest)
	case name == "cs" && indexed:
		return t.contactField(i, rest)
	case strings.HasPrefix(f, "cs[") && strings.HasSuffix(f, " force"):
		if t.lc != "" {
			return t.lc
		}
		return "cases"
	case name == "preloads" && indexed:
		if t.b != nil && i < len(t.b.d.Preloads) {
			if q, ok := lawField(t.b.d.Preloads[i], rest); ok {
				return join(index("preloads", i), q)
			}
		}
		return join(index("preloads", i), snake(rest))
	case head == "payload":
		return payloadField(rest)
	case head == "lc" && t.lc != "":
		if rest == "" {
			return t.lc
		}
		if n, j, ok := splitIndex(rest); ok && n == "Applied" {
			return index(join(t.lc, "applied"), j)
		}
		return join(t.lc, snake(rest))
	}
	if t.fallback != "" {
		return t.fallback
	}
	return f
}

// pairField translates the rest of "Pairs[i].rest".
func (t translator) pairField(i int, rest string) string {
	part, sub, _ := strings.Cut(rest, ".")
	switch part {
	case "":
		return index("seats", i)
	case "Ball":
		if sub == "" {
			return index("balls", i)
		}
		if strings.HasPrefix(sub, "Material") {
			return join(index("balls", i), "material")
		}
		return join(index("balls", i), snake(sub))
	case "Seat":
		s := index("seats", i)
		switch {
		case sub == "":
			return s
		case strings.HasPrefix(sub, "Material"):
			return join(s, "material")
		case sub == "Azimuth":
			return join(s, "toward")
		case sub == "Direction" && t.b != nil && i < len(t.b.d.Seats) && t.b.d.Seats[i].Direction == (zeroVec):
			return join(s, "azimuth")
		}
		return join(s, snake(sub))
	}
	return index("seats", i)
}

// contactField translates the rest of "cs[i].rest": the moving surface is
// the ball's material, the base surface the seat's.
func (t translator) contactField(i int, rest string) string {
	p := -1
	if t.b != nil && i >= 0 && i < len(t.b.pairOf) {
		p = t.b.pairOf[i]
	}
	if p < 0 {
		return "seats"
	}
	switch {
	case strings.HasPrefix(rest, "Moving"):
		return join(index("balls", p), "material")
	case strings.HasPrefix(rest, "Base"):
		return join(index("seats", p), "material")
	}
	return index("seats", p)
}

// payloadField translates the rest of "payload.rest".
func payloadField(rest string) string {
	if strings.HasPrefix(rest, "Inertia[") && len(rest) == len("Inertia[0][0]") {
		r, c := int(rest[8]-'0'), int(rest[11]-'0')
		if r >= 0 && r < 3 && c >= 0 && c < 3 {
			return join("payload.inertia", inertiaKey(r, c))
		}
	}
	if rest == "" {
		return "payload"
	}
	return join("payload", snake(rest))
}

// inertiaKey returns the file's name of the tensor entry [r][c].
func inertiaKey(r, c int) string {
	if r > c {
		r, c = c, r
	}
	return string("xyz"[r]) + string("xyz"[c])
}

// splitIndex splits "name[i]" into name and i.
func splitIndex(s string) (name string, i int, ok bool) {
	open := strings.IndexByte(s, '[')
	if open < 0 || !strings.HasSuffix(s, "]") {
		return s, 0, false
	}
	if _, err := fmt.Sscanf(s[open:], "[%d]", &i); err != nil {
		return s, 0, false
	}
	return s[:open], i, true
}

// snake converts a kinematic field name ("HalfAngle", "FlankRadius") to
// the file's ("half_angle", "flank_radius"); dots are kept.
func snake(s string) string {
	var b strings.Builder
	for i, r := range s {
		if r >= 'A' && r <= 'Z' {
			if i > 0 && s[i-1] != '.' {
				b.WriteByte('_')
			}
			r += 'a' - 'A'
		}
		b.WriteRune(r)
	}
	return b.String()
}

// retext is an error with the text msg that wraps err (keeping its
// sentinel for errors.Is).
type retext struct {
	msg string
	err error
}

func (e *retext) Error() string { return e.msg }
func (e *retext) Unwrap() error { return e.err }
