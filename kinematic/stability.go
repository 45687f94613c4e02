package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

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
	if len(a.lines) != 6 || a.Rank != 6 {
		return &InputError{Field: "cs", Err: fmt.Errorf(
			"%w: %d contacts of rank %d (%d free motions, %d redundant); Maxwell indices need six independent contacts",
			ErrNotExact, len(a.lines), a.Rank, len(a.Free), len(a.Redundant))}
	}
	ts, ok := freed(a.lines, r3.Sub(a.Centre, a.origin), a.Length)
	if !ok {
		return &InputError{Field: "cs", Err: fmt.Errorf("%w: the six contacts are singular to working precision", ErrNotExact)}
	}
	for i, t := range ts {
		l := &a.lines[i]
		// Scale so that n·v = 1 exactly (it is 1 to rounding already).
		t = t.Scale(1 / r3.Dot(l.n, t.At(l.p)))
		m := &st.Contacts[i]
		m.Label, m.Freed = l.label, global(t, a.origin)
		m.Index = 1 / linalg.Norm3(t.At(l.p))
		m.CentreIndex = m.Index
		if l.ball {
			m.CentreIndex = 1 / linalg.Norm3(t.At(l.centre))
		}
	}
	low := st.Contacts[0].Index
	for _, m := range st.Contacts {
		low = math.Min(low, m.Index)
	}
	for i, m := range st.Contacts {
		if m.Index <= low+tieTol {
			st.Weakest = i
			break
		}
	}
	return nil
}

// freed returns the twists freed by removing each of six contacts known
// to be independent: twist i has power δᵢⱼ with contact j. Moments are
// taken about pc and divided by L (a reference point and a characteristic
// length of the lines, such as screw.Analysis's Centre and Length), so that
// the matrix's conditioning is that of the geometry, not of its units or
// position. freed reports false if the 6×6 system is singular to working
// precision.
func freed(ls []line, pc r3.Vec, L float64) (ts [6]screw.Twist, ok bool) {
	if !(L > 0) || len(ls) != 6 {
		return ts, false
	}
	var c [36]float64 // column j: (n_j, (p_j − pc) × n_j / L)
	for j := range ls {
		l := &ls[j]
		m := r3.Scale(1/L, r3.Cross(r3.Sub(l.p, pc), l.n))
		c[6*j], c[6*j+1], c[6*j+2], c[6*j+3], c[6*j+4], c[6*j+5] = l.n.X, l.n.Y, l.n.Z, m.X, m.Y, m.Z
	}
	if !linalg.Inverse6(&c, singularTol) {
		return ts, false
	}
	// Row i of C⁻¹ pairs with column j to δᵢⱼ: it is the twist
	// (V at pc, W·L) in the same normalised coordinates.
	for i := range ts {
		vpc := r3.Vec{X: c[0*6+i], Y: c[1*6+i], Z: c[2*6+i]}
		w := r3.Scale(1/L, r3.Vec{X: c[3*6+i], Y: c[4*6+i], Z: c[5*6+i]})
		ts[i] = screw.Twist{W: w, V: r3.Sub(vpc, r3.Cross(w, pc))}
	}
	return ts, true
}

// singularTol is the pivot, relative to the largest entry of its column,
// below which freed treats the normalised 6×6 contact matrix as singular.
// Its entries are at most 1 in magnitude; a pivot of 1e-12 is within
// rounding (1e-16 times the growth of elimination) of a singular matrix.
const singularTol = 1e-12

// freedOf sets ts to the twists freed by removing each of the six
// contacts ls (power δᵢⱼ), normalised about their centroid and RMS
// distance, and reports false if the set is singular to working precision.
func freedOf(ls []line, ts *[6]screw.Twist) bool {
	var pc r3.Vec
	for _, l := range ls {
		pc = r3.Add(pc, l.p)
	}
	pc = r3.Scale(1/float64(len(ls)), pc)
	var s2 float64
	for _, l := range ls {
		s2 += r3.Norm2(r3.Sub(l.p, pc))
	}
	var ok bool
	*ts, ok = freed(ls, pc, math.Sqrt(s2/float64(len(ls))))
	return ok
}
