package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/constraint"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Stability is the Maxwell stability of an exactly constrained contact set:
// one entry per contact, in the order analysed, and the weakest of them.
type Stability struct {
	Contacts [6]Maxwell
	Weakest  int // index into Contacts of the smallest Index; the first of those within 1e-12 of it
}

// tieTol is the margin within which Maxwell indices tie for the weakest:
// symmetric designs have equal indices that rounding would otherwise
// order at random, and an index is good to about 1e-14.
const tieTol = 1e-12

// Maxwell describes what contact i holds: the motion that becomes free when
// it is removed, and how squarely the contact resists it.
//
// Freed is that twist, scaled so that the contact point separates from the
// seat at unit speed: n·v = +1, with v the velocity of the contact point
// (rad/s and m/s). It has zero power with every other contact.
//
// Index is the Maxwell index at the contact point, |n·v|/|v| in [0, 1]: 1
// when the freed motion carries the contact point straight along the
// normal, near 0 when it slides nearly along the surface, which then barely
// resists. CentreIndex is the same measure taken with the velocity v_c of
// the ball's centre, which lies a radius r along n from the contact point:
// v_c = v + r·W × n (W the freed angular velocity). The term r·W × n is
// tangent to the surface, so both share n·v = n·v_c = 1 and differ only
// in their tangential parts: Index counts the sliding that the ball's
// rotation adds at its surface, where friction acts, and can be above or
// below CentreIndex; CentreIndex judges where the seat lets the ball's
// centre go, independent of the ball's size. The two are equal for a
// contact not made by a ball and whenever W × n = 0.
type Maxwell struct {
	Label       string
	Freed       screw.Twist
	Index       float64
	CentreIndex float64
}

// Stability returns the Maxwell stability of the analysed contacts: for
// each contact, the twist freed by removing it and the Maxwell index,
// Maxwell's criterion for a stable kinematic constraint generalised to any
// 3D set (each freed motion should move its contact along the normal).
// The twists freed by removing one contact each are the rows of the
// inverse of the 6×6 matrix of contact wrenches: twist i has power δᵢⱼ with
// wrench j.
//
// The Maxwell index screens out layouts that barely resist a freed motion;
// among sensible layouts it varies little, and it is not a figure of merit
// to optimise alone.
//
// Stability returns an [*InputError] wrapping [ErrNotExact] unless the set
// has exactly six contacts of rank 6. A near-singular set is analysed; its
// small indices say so.
func (a Analysis) Stability() (Stability, error) {
	var st Stability
	if err := a.stability(&st); err != nil {
		return Stability{}, err
	}
	return st, nil
}

// stability fills st.
func (a *Analysis) stability(st *Stability) error {
	lines := a.contacts()
	if len(lines) != 6 || a.Rank != 6 {
		return &InputError{Field: "cs", Err: fmt.Errorf(
			"%w: %d contacts of rank %d (%d free motions, %d redundant); Maxwell indices need six independent contacts",
			ErrNotExact, len(lines), a.Rank, len(a.Free), len(a.Redundant))}
	}
	ts := a.freed
	if !a.hasFreed && !freedOf(lines, &ts) {
		return &InputError{Field: "cs", Err: fmt.Errorf("%w: the six contacts are singular to working precision", ErrNotExact)}
	}
	for i, t := range ts {
		l := &lines[i]
		m := &st.Contacts[i]
		t, m.Index, m.CentreIndex = maxwell(t, l)
		// global(t, a.origin), in scalars as in maxwell.
		o := a.origin
		m.Label = l.label
		m.Freed.W = t.W
		m.Freed.V.X = t.V.X - (t.W.Y*o.Z - t.W.Z*o.Y)
		m.Freed.V.Y = t.V.Y - (t.W.Z*o.X - t.W.X*o.Z)
		m.Freed.V.Z = t.V.Z - (t.W.X*o.Y - t.W.Y*o.X)
	}
	low := st.Contacts[0].Index
	for _, m := range st.Contacts {
		low = min(low, m.Index)
	}
	for i, m := range st.Contacts {
		if m.Index <= low+tieTol {
			st.Weakest = i
			break
		}
	}
	return nil
}

// maxwell returns the twist t freed by removing the contact l, scaled so
// that the contact point separates at unit speed (n·v = 1 exactly; it is 1
// to rounding already when t has power 1 with l), and the Maxwell indices
// of [Maxwell]: 1/|v| at the contact point and 1/|v_c| at the ball's
// centre (the same as the index for a contact not made by a ball). It is
// the one definition of the index: Stability and the scorecard call it.
//
// It is written out in scalars, operation for operation as
// t.Scale(1/r3.Dot(l.n, t.At(l.p))) and linalg.Norm3(freed.At(q)) (the
// same results to the bit): the vector helpers' struct temporaries went
// through memory, and their stores cost more than the arithmetic.
func maxwell(t screw.Twist, l *line) (freed screw.Twist, index, centreIndex float64) {
	wx, wy, wz := t.W.X, t.W.Y, t.W.Z
	vx, vy, vz := t.V.X, t.V.Y, t.V.Z
	px, py, pz := l.p.X, l.p.Y, l.p.Z
	// v = V + W × p at the contact point, then the scale 1/(n·v).
	ax := vx + (wy*pz - wz*py)
	ay := vy + (wz*px - wx*pz)
	az := vz + (wx*py - wy*px)
	f := 1 / (l.n.X*ax + l.n.Y*ay + l.n.Z*az)
	wx, wy, wz = f*wx, f*wy, f*wz
	vx, vy, vz = f*vx, f*vy, f*vz
	index = 1 / norm3(vx+(wy*pz-wz*py), vy+(wz*px-wx*pz), vz+(wx*py-wy*px))
	centreIndex = index
	if l.ball {
		cx, cy, cz := l.centre.X, l.centre.Y, l.centre.Z
		centreIndex = 1 / norm3(vx+(wy*cz-wz*cy), vy+(wz*cx-wx*cz), vz+(wx*cy-wy*cx))
	}
	freed.W.X, freed.W.Y, freed.W.Z = wx, wy, wz
	freed.V.X, freed.V.Y, freed.V.Z = vx, vy, vz
	return freed, index, centreIndex
}

// norm3 is linalg.Norm3 of (x, y, z), its usual case inline.
func norm3(x, y, z float64) float64 {
	if q := x*x + y*y + z*z; q > 0x1p-486 && q < 0x1p+486 {
		return math.Sqrt(q)
	}
	return linalg.Norm3(r3.Vec{X: x, Y: y, Z: z})
}

// freedOf sets ts to the twists freed by removing each of the six
// contacts ls: twist i has power δᵢⱼ with contact j (the rows of the
// inverse of the contact matrix). It uses the normalised contact matrix of
// the constraint analysis (internal/constraint: moments about the lines'
// least-squares point over their RMS distance from it), so that every
// analysis of the package inverts the same matrix, and reports false if it
// is singular to working precision.
func freedOf(ls []line, ts *[6]screw.Twist) bool {
	var ws [6]constraint.Wrench
	for i := range ws {
		l := &ls[i]
		ws[i] = constraint.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}
	}
	var ct [6]constraint.Twist
	if !constraint.Freed(&ws, &ct) {
		return false
	}
	for i := range ct {
		ts[i] = screw.Twist(ct[i])
	}
	return true
}
