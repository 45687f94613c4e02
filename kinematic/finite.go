package kinematic

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/screw"
)

// The results of the exported functions are checked before they are
// returned: a finite input whose result leaves the floating-point range (a
// point of interest 1e300 m away, a tolerance of 1e308, a payload of
// 5e-324 kg whose shock level is 1/mass) returns an [*InputError] wrapping
// [ErrRange] naming that input, never a NaN or an infinity that reads as a
// value. These helpers do the checking; each entry point names the input
// its overflow comes from.

// allFinite reports whether every x is finite. The variadic slice does not
// escape, so a call allocates nothing.
func allFinite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// allFinite3 reports whether every component of every v is finite.
func allFinite3(vs ...r3.Vec) bool {
	for _, v := range vs {
		if !allFinite(v.X, v.Y, v.Z) {
			return false
		}
	}
	return true
}

// finiteTwist reports whether every component of t is finite.
func finiteTwist(t screw.Twist) bool { return allFinite3(t.W, t.V) }
