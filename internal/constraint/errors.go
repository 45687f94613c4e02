package constraint

import "strconv"

// Error reports invalid input to [Analyze]. Index is the offending wrench,
// or −1 when the set as a whole is at fault; Part is "F" or "M" when one
// vector of the wrench is at fault, "" for the whole wrench; Err wraps one
// of the sentinels of package internal/errs with the reason. Callers
// translate it into their own vocabulary (screw names the field ws[i].F).
type Error struct {
	Index int
	Part  string
	Err   error
}

// Error returns the offending input and the reason, for example
// "constraint: wrench 2 F: not finite: ...".
func (e *Error) Error() string {
	where := "wrenches"
	if e.Index >= 0 {
		where = "wrench " + strconv.Itoa(e.Index)
		if e.Part != "" {
			where += " " + e.Part
		}
	}
	return "constraint: " + where + ": " + e.Err.Error()
}

// Unwrap returns the reason, which wraps a sentinel.
func (e *Error) Unwrap() error { return e.Err }
