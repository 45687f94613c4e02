package kinematic

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/constraint"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Analysis is the constraint analysis of a contact set: the
// [screw.Analysis] of the contact normals, with the contacts' labels.
//
// DOF is the number of freedoms left, 6 − Rank, each a twist of Free
// (see [screw.Analysis] for their canonical form; call [screw.Twist.Axis]
// for the screw axis). Participants lists, for each redundant combination
// in Redundant, the labels of the contacts that take part in it (those
// with a non-zero weight).
//
// NearSingular is an arithmetic flag (see [screw.NearSingularRatio]): it
// says that the rank itself is barely decided, not that the layout is good.
// Layouts that no designer would accept (a condition number of 30, a point
// of interest that moves ten micrometres per micrometre of gap error) are
// far from it; judge a layout by its design figures, not by this flag.
type Analysis struct {
	screw.Analysis
	DOF          int
	Participants [][]string

	// The contacts, in local coordinates, kept for Stability: up to six
	// in line6 (no allocation), more in more; read them with contacts.
	line6  [6]line
	nLines int
	more   []line
	origin r3.Vec // the local origin: contacts()[i].p + origin is contact i's point

	freed    [6]screw.Twist // about origin, when hasFreed: power δᵢⱼ with contact j
	hasFreed bool
}

// Analyze returns the constraint analysis of the contacts cs: how many
// freedoms they constrain, the motions left free, the redundant contacts,
// and whether the set is near-singular.
//
// Verdicts do not depend on units or on where the design sits: the
// contacts are taken relative to their own centroid before anything else,
// so a design 10 km from the origin gets the same verdicts and indices as
// at the origin, until its coordinates themselves run out of digits (a
// size below about 1e-10 of its distance from the origin, where float64
// holds the contact points to about 1e-6 of the design's size).
//
// Analyze returns an [*InputError] wrapping [ErrDegenerate] for fewer than
// two contacts or a zero normal, [ErrNonFinite] for a NaN or infinite
// point, normal, ball centre or radius, and [ErrRange] for contacts too far
// apart for float64 arithmetic.
func Analyze(cs []Contact) (Analysis, error) {
	if len(cs) < 2 {
		return Analysis{}, &InputError{Field: "cs", Err: fmt.Errorf("%w: %d contacts; a coupling needs at least two", ErrDegenerate, len(cs))}
	}
	// Up to six contacts, the lines are kept in the Analysis itself: the
	// singular values are its one allocation.
	var an Analysis
	var lines []line
	if len(cs) <= 6 {
		an.nLines = len(cs)
		lines = an.line6[:len(cs)]
	} else {
		an.more = make([]line, len(cs))
		lines = an.more
	}
	var o r3.Vec
	for i := range cs {
		c := &cs[i]
		if !linalg.Finite3(c.Point) {
			return Analysis{}, &InputError{Field: indexed("cs", i) + ".Point", Err: fmt.Errorf("%w: %v", ErrNonFinite, c.Point)}
		}
		n, ok := linalg.Unit3(c.Normal)
		if !ok {
			// The field name is formatted only on error, off the hot path.
			_, err := unitOf(c.Normal, indexed("cs", i)+".Normal")
			return Analysis{}, err
		}
		ball := c.Radius != 0
		if ball && (!linalg.Finite3(c.Centre) || !linalg.Finite(c.Radius)) {
			return Analysis{}, &InputError{Field: indexed("cs", i) + ".Centre", Err: fmt.Errorf("%w: centre %v, radius %g", ErrNonFinite, c.Centre, c.Radius)}
		}
		lines[i] = line{label: c.Label, p: c.Point, n: n, centre: c.Centre, ball: ball}
		o = r3.Add(o, r3.Scale(1/float64(len(cs)), c.Point))
	}
	if !linalg.Finite3(o) {
		return Analysis{}, &InputError{Field: "cs", Err: fmt.Errorf("%w: contact points too far apart for float64", ErrRange)}
	}
	// Local coordinates: subtracting o costs each point a rounding error
	// of ε|p|, the precision the point carries anyway.
	var stack [12]constraint.Wrench
	ws := stack[:0]
	if len(cs) > len(stack) {
		ws = make([]constraint.Wrench, 0, len(cs))
	}
	for i := range lines {
		l := &lines[i]
		l.p = r3.Sub(l.p, o)
		l.centre = r3.Sub(l.centre, o)
		ws = append(ws, constraint.Wrench{F: l.n, M: r3.Cross(l.p, l.n)})
	}
	// One factorisation of the normalised contact matrix serves the report
	// and, for six independent contacts, the freed twists of Stability.
	var r constraint.Result
	if err := constraint.Analyze(ws, &r); err != nil {
		return Analysis{}, fromConstraint(err, cs)
	}
	sa := screw.Analysis{
		Rank: r.Rank, Singular: append([]float64(nil), r.Singular[:r.K]...), Condition: r.Condition,
		NearSingular: r.NearSingular, Redundant: r.Redundant, Centre: r3.Add(r.Centre, o), Length: r.Length,
	}
	if r.Rank < 6 {
		sa.Free = make([]screw.Twist, 6-r.Rank)
		for k := range sa.Free {
			sa.Free[k] = global(screw.Twist(r.Free[k]), o)
		}
	}
	an.Analysis, an.DOF, an.origin = sa, 6-sa.Rank, o
	if r.HasFreed {
		an.hasFreed = true
		for k := range an.freed {
			an.freed[k] = screw.Twist(r.Freed[k])
		}
	}
	if len(sa.Redundant) > 0 {
		an.Participants = make([][]string, len(sa.Redundant))
		for k, c := range sa.Redundant {
			for i, x := range c {
				if x != 0 {
					an.Participants[k] = append(an.Participants[k], labelOf(lines[i].label, i))
				}
			}
		}
	}
	return an, nil
}

// contacts returns the contacts' lines, in local coordinates.
func (a *Analysis) contacts() []line {
	if a.more != nil {
		return a.more
	}
	return a.line6[:a.nLines]
}

// global returns the twist t, whose V is the velocity of the body point at
// the local origin o, with V at the global origin instead: V − W × o.
func global(t screw.Twist, o r3.Vec) screw.Twist {
	return screw.Twist{W: t.W, V: r3.Sub(t.V, r3.Cross(t.W, o))}
}

// outlier returns the index of the contact point farthest from the
// componentwise median of all of them.
func outlier(cs []Contact) int {
	med := func(get func(r3.Vec) float64) float64 {
		xs := make([]float64, len(cs))
		for i := range cs {
			xs[i] = get(cs[i].Point)
		}
		sort.Float64s(xs)
		return xs[len(xs)/2]
	}
	m := r3.Vec{X: med(func(v r3.Vec) float64 { return v.X }), Y: med(func(v r3.Vec) float64 { return v.Y }), Z: med(func(v r3.Vec) float64 { return v.Z })}
	best, far := 0, -1.0
	for i := range cs {
		d := r3.Sub(cs[i].Point, m)
		if n := max(math.Abs(d.X), math.Abs(d.Y), math.Abs(d.Z)); n > far {
			best, far = i, n
		}
	}
	return best
}

// fromConstraint translates an error of the constraint analysis into this
// package's vocabulary: wrench i's force is contact i's normal, its moment
// (and the wrench as a whole) its point; a set out of range about the
// centroid blames the contact farthest from the others (the componentwise
// median), not the one the shifted arithmetic happened to overflow on.
func fromConstraint(err error, cs []Contact) error {
	var ce *constraint.Error
	if !errors.As(err, &ce) {
		return err
	}
	field := "cs"
	switch {
	case ce.Index >= 0 && ce.Part == "F":
		field = indexed("cs", ce.Index) + ".Normal"
	case ce.Index >= 0:
		field = indexed("cs", ce.Index) + ".Point"
	}
	if errors.Is(ce.Err, ErrRange) && (ce.Index >= 0 && ce.Part != "F" || ce.Index < 0) {
		field = indexed("cs", outlier(cs)) + ".Point"
	}
	return &InputError{Field: field, Err: ce.Err}
}
