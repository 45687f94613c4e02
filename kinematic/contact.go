package kinematic

import (
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Contact is a point contact between the moving body and the base.
//
// The base pushes the moving body along Normal at Point. For a contact made
// by a ball, Centre and Radius are the ball's (Radius is 0 otherwise). The
// surfaces that touch are Moving (the moving body's, usually the ball) and
// Base, as [hertz.Body] values whose principal angles are measured about
// Normal (right-handed) from Tangent, a unit vector normal to Normal.
// Contacts given by hand may leave Tangent and the surfaces zero when only
// constraint and stability are wanted; analyses of forces and stiffness need
// them (with their materials) and report the field that is missing.
type Contact struct {
	Label   string
	Point   r3.Vec // m
	Normal  r3.Vec // unit, into the moving body
	Centre  r3.Vec // m, the ball's centre when Radius > 0
	Radius  float64
	Tangent r3.Vec
	Moving  hertz.Body
	Base    hertz.Body
}

// line is what the analyses need of a contact: its label, its point and
// unit normal, and the ball centre if a ball makes it.
type line struct {
	label  string
	p, n   r3.Vec
	centre r3.Vec
	ball   bool
}

// pairName returns name, or a letter by position if name is empty.
func pairName(name string, i int) string {
	if name != "" {
		return name
	}
	if i < 26 {
		return string(rune('A' + i))
	}
	return fmt.Sprintf("P%d", i+1)
}

// labelOf returns label, or "cs[i]" if it is empty.
func labelOf(label string, i int) string {
	if label != "" {
		return label
	}
	return fmt.Sprintf("cs[%d]", i)
}

// indexed returns field + "[i]", for error messages.
func indexed(field string, i int) string { return fmt.Sprintf("%s[%d]", field, i) }

// unitOf returns v/|v|, or an error naming field if v is zero or not
// finite. It is exact in direction for every finite v, subnormal
// components included (see linalg.Unit3).
func unitOf(v r3.Vec, field string) (r3.Vec, error) {
	if !linalg.Finite3(v) {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: %v", ErrNonFinite, v)}
	}
	u, ok := linalg.Unit3(v)
	if !ok {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: zero vector", ErrDegenerate)}
	}
	return u, nil
}

// horizontalTol is the smallest fraction of a direction that must lie
// normal to Up: a groove within about 1e-6 rad of Up has no horizontal
// direction that its numbers can be trusted for.
const horizontalTol = 1e-6

// horizontal returns the unit part of d normal to the unit vector up.
func horizontal(d, up r3.Vec, field string) (r3.Vec, error) {
	u, err := unitOf(d, field)
	if err != nil {
		return r3.Vec{}, err
	}
	h, ok := flatten(u, up)
	if !ok {
		return r3.Vec{}, &InputError{Field: field, Err: fmt.Errorf("%w: along Up; it must have a part normal to Up", ErrDegenerate)}
	}
	return h, nil
}

// flatten returns the unit part of the unit vector u normal to the unit
// vector up, and false if that part is below horizontalTol (u lies along
// up).
func flatten(u, up r3.Vec) (r3.Vec, bool) {
	h := r3.Sub(u, r3.Scale(r3.Dot(u, up), up))
	if linalg.Norm3(h) <= horizontalTol {
		return r3.Vec{}, false
	}
	return linalg.Unit3(h)
}

// scaledWrench returns the wrench w in the scaled coordinates of the
// stiffness and equilibrium analyses, g = (F, M/L) with L the contact
// set's size, so that g·y is the power on the scaled twist y = (V, W·L)
// and every entry is of one unit.
func scaledWrench(w screw.Wrench, L float64) [6]float64 {
	return [6]float64{w.F.X, w.F.Y, w.F.Z, w.M.X / L, w.M.Y / L, w.M.Z / L}
}

// dot6 returns the dot product of two 6-vectors.
func dot6(a, b *[6]float64) float64 {
	return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] + a[3]*b[3] + a[4]*b[4] + a[5]*b[5]
}
