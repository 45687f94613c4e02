package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Ball is a ball fixed to the moving body: a sphere, or the spherical
// surface that touches a seat.
//
// A canoe ball (a spherical segment of large radius on a small body, which
// gives a stiffer, stronger contact than a ball of the body's size) is a
// Ball whose Radius is the segment's radius and whose Centre is that
// sphere's centre, often far outside the part; each contact of its seat
// then lies a Radius from it along the normal, as for a ball. The segment
// must be large enough to hold every contact of its seat. Set Canoe for
// such a ball: only the segment near its contacts is solid, so its sphere
// may reach through other balls, and [Coupling.Contacts] checks only the
// segment's contacts against other balls.
type Ball struct {
	Centre   r3.Vec  // m
	Radius   float64 // m, > 0; at most 0.5 m for a whole ball (Canoe false)
	Material hertz.Material

	// Canoe reports that the ball is a spherical segment of its sphere
	// (a canoe ball), not a whole sphere; false: a whole ball.
	Canoe bool
}

// Seat is the feature of the base that receives one ball: a [Vee], [Rods],
// [Flat], [Trihedral] or [Cone]. Contacts of any other shape are given
// directly as [Contact] values.
type Seat interface {
	// appendContacts appends the contacts that the seat makes with the
	// seated ball b to dst; name labels them and field names the seat in
	// errors.
	appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error)

	// count returns the number of contacts the seat makes.
	count() int

	// up returns the seat's Up as given, for azimuths.
	up() r3.Vec

	// surfaces returns the seat's surfaces in the base frame, one per
	// contact, its named dimensions (see Assembly), its reference point
	// (root) and its material's expansion coefficient, for the seated
	// ball b and its nominal contacts cs.
	surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64)

	// ideals sets out[i] to the best centre index (see [Maxwell]) that a
	// layout can give contact i of the seat, for its nominal contacts cs:
	// what [Scorecard.MaxwellRatio] compares the layout's with.
	ideals(cs []Contact, out []float64)
}

// grooveSeat is a seat with a groove axis that can turn about its Up: a
// vee or a pair of rods. The groove optimiser and Geometry work with any.
type grooveSeat interface {
	Seat
	// groove returns the unit Up and groove direction, validated.
	groove(field string) (up, g r3.Vec, err error)
	// halfAngle returns the lean of the contact normals from the
	// horizontal.
	halfAngle() float64
	// withDirection returns the seat with its groove along d.
	withDirection(d r3.Vec) Seat
	// withHalfAngle returns the seat with the half-angle h.
	withHalfAngle(h float64) Seat
}

// Pair is one ball in its seat.
type Pair struct {
	Name string // labels the pair's contacts; "" means a letter by position ("A", "B", ...)
	Ball Ball
	Seat Seat
}

// Coupling is a kinematic coupling: balls on the moving body, each seated
// in a seat on the base.
type Coupling struct {
	Pairs []Pair
}

// coincidentTol is the distance, relative to the largest distance between
// two balls of a coupling, below which two balls are the same ball twice.
// Drawings carry 1e-6 at worst; 1e-9 catches only a ball listed twice.
const coincidentTol = 1e-9

// Contacts returns the contacts of the coupling, pair by pair, in the order
// each seat's documentation gives. Vee contacts are labelled Name+"+" and
// Name+"-" ("+" for the flank on the side Up × Direction), trihedral and
// cone contacts Name+"1" to Name+"3", a flat's contact Name.
//
// Contacts checks the geometry only. Materials are not needed for
// constraint, stability and layout geometry, and a zero [hertz.Material]
// passes here; the analyses that use the Hertz surfaces (forces, stiffness,
// seated pose under load) check them and name the pair's field
// ("Pairs[2].Seat.Material.E").
//
// Contacts returns an [*InputError] naming the pair and field for a
// missing seat, a ball radius that is not positive, a zero or non-finite
// direction, a half-angle outside (0, π/2), a groove that runs along its
// own Up, or two coincident balls (wrapping [ErrDegenerate]); for balls
// so far from the origin that float64 cannot resolve their spacing
// (wrapping [ErrRange]); and for geometry that cannot exist, wrapping
// [ErrRange]: two whole balls that overlap (|cᵢ − cⱼ| < rᵢ + rⱼ, named
// first the ball of the larger radius, the one a mistyped radius makes
// too large, with [InputError.Other] for the other), a contact that lies
// inside another whole ball, a gothic-arch flank radius not larger than
// the ball's (the ball could not touch the flank), and two rods that
// overlap each other. A design in millimetres read as metres is caught
// by the overlap: balls of radius 6.35 "m" a tenth of a metre apart.
// Solids must interpenetrate by more than [overlapTol] of their size to
// be refused, so touching balls pass.
func (c Coupling) Contacts() ([]Contact, error) {
	if len(c.Pairs) == 0 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: no pairs", ErrDegenerate)}
	}
	if err := checkBalls(c.Pairs); err != nil {
		return nil, err
	}
	n := 0
	for i, p := range c.Pairs {
		if p.Seat == nil {
			return nil, &InputError{Field: pairField(i) + ".Seat", Err: fmt.Errorf("%w: no seat", ErrDegenerate)}
		}
		n += p.Seat.count()
	}
	cs := make([]Contact, 0, n)
	owner := make([]int, 0, n) // owner[k]: the pair of contact k
	for i, p := range c.Pairs {
		var err error
		cs, err = p.Seat.appendContacts(cs, p.Ball, pairName(p.Name, i), pairField(i)+".Seat")
		if err != nil {
			return nil, err
		}
		for len(owner) < len(cs) {
			owner = append(owner, i)
		}
	}
	if err := checkSolids(c.Pairs, cs, owner); err != nil {
		return nil, err
	}
	return cs, nil
}

// overlapTol is the fraction of their size by which two solids must
// interpenetrate before [Coupling.Contacts] refuses them as impossible:
// drawings carry dimensions to six or seven significant digits, so
// touching balls given to that precision may overlap by about 1e-6 of
// their size through rounding alone, and are not refused.
const overlapTol = 1e-6

// checkSolids refuses geometry that cannot exist: two whole balls that
// overlap, and a contact (of any ball, canoe or whole) inside another
// whole ball. The contacts' owner[k] is the pair of cs[k].
func checkSolids(ps []Pair, cs []Contact, owner []int) error {
	for i, p := range ps {
		if p.Ball.Canoe {
			continue
		}
		for j := 0; j < i; j++ {
			q := ps[j]
			if q.Ball.Canoe {
				continue
			}
			d := linalg.Norm3(r3.Sub(p.Ball.Centre, q.Ball.Centre))
			if sum := p.Ball.Radius + q.Ball.Radius; d < sum*(1-overlapTol) {
				// Name first the ball of the larger radius: the one out
				// of proportion when a radius is mistyped (5 for 5 mm),
				// the other as Other; the later ball when they are equal.
				a, b := i, j
				if q.Ball.Radius > p.Ball.Radius {
					a, b = j, i
				}
				pa, pb := ps[a].Ball, ps[b].Ball
				return &InputError{Field: pairField(a) + ".Ball", Other: pairField(b) + ".Ball", Err: fmt.Errorf(
					"%w: balls %s and %s overlap: radii %.6g m and %.6g m, centres %.6g m apart (less than %.6g m); lengths are in metres",
					ErrRange, pairName(ps[a].Name, a), pairName(ps[b].Name, b), pa.Radius, pb.Radius, d, sum)}
			}
		}
	}
	for k, ct := range cs {
		for j, q := range ps {
			if j == owner[k] || q.Ball.Canoe {
				continue
			}
			if d := linalg.Norm3(r3.Sub(ct.Point, q.Ball.Centre)); d < q.Ball.Radius*(1-overlapTol) {
				return &InputError{Field: pairField(owner[k]) + ".Seat", Other: pairField(j) + ".Ball", Err: fmt.Errorf(
					"%w: contact %s lies inside ball %s: %.6g m from its centre, radius %.6g m",
					ErrRange, ct.Label, pairName(q.Name, j), d, q.Ball.Radius)}
			}
		}
	}
	return nil
}

// pairField returns "Pairs[i]".
func pairField(i int) string { return indexed("Pairs", i) }

// farTol is the smallest ratio of a coupling's ball spacing to its
// distance from the origin that Contacts accepts: below it the contact
// lines cannot be told apart in float64 coordinates, and screw.Analyze
// refuses them with ErrRange (its cutoff Length/far ≈ 7.1e-12, the rank
// threshold 32ε·far/Length reaching RankTol = 1e-9). Refusing here names
// the ball instead of reporting balls in a line or coincident.
const farTol = 7.1e-12

// checkBalls validates every ball and rejects coincident ones, and balls
// so far from the origin that their spacing is lost in rounding.
func checkBalls(ps []Pair) error {
	var span, far float64
	farthest := 0
	for i, p := range ps {
		if err := checkBall(p.Ball, pairField(i)+".Ball"); err != nil {
			return err
		}
		if d := linalg.Norm3(p.Ball.Centre); d > far {
			far, farthest = d, i
		}
		for j := 0; j < i; j++ {
			span = math.Max(span, linalg.Norm3(r3.Sub(p.Ball.Centre, ps[j].Ball.Centre)))
		}
	}
	if len(ps) > 1 && far > 0 && span <= farTol*far {
		return &InputError{Field: pairField(farthest) + ".Ball.Centre", Err: fmt.Errorf(
			"%w: the balls lie %.6g m from the origin and %.6g m apart: float64 coordinates cannot resolve a spacing below %.2g of the distance; place the origin near the coupling",
			ErrRange, far, span, farTol)}
	}
	for i, p := range ps {
		for j := 0; j < i; j++ {
			if d := linalg.Norm3(r3.Sub(p.Ball.Centre, ps[j].Ball.Centre)); d <= coincidentTol*span {
				return &InputError{Field: pairField(i) + ".Ball.Centre", Other: pairField(j) + ".Ball.Centre",
					Err: fmt.Errorf("%w: the same centre as another ball", ErrDegenerate)}
			}
		}
	}
	return nil
}

func checkBall(b Ball, field string) error {
	if !linalg.Finite3(b.Centre) {
		return &InputError{Field: field + ".Centre", Err: fmt.Errorf("%w: %v", ErrNonFinite, b.Centre)}
	}
	if !linalg.Finite(b.Radius) {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf("%w: %g", ErrNonFinite, b.Radius)}
	}
	if !(b.Radius > 0) {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf("%w: must be positive, got %g", ErrRange, b.Radius)}
	}
	if !b.Canoe && b.Radius > maxBallRadius {
		return &InputError{Field: field + ".Radius", Err: fmt.Errorf(
			"%w: a whole ball of radius %g m, over %g m: lengths are in metres (if that is millimetres, it is %g m); a spherical segment of large radius is a canoe ball (Canoe true)",
			ErrRange, b.Radius, maxBallRadius, b.Radius/1000)}
	}
	return nil
}

// maxBallRadius is the largest radius of a whole ball (Canoe false) that
// a coupling is taken to have, m: precision balls are made to a few tens
// of millimetres in radius (common practice), so a whole ball of 0.5 m
// or more is a length given in millimetres, as when a 3 mm ball is
// written 3 with the rest of the design in millimetres too, which no
// other check can tell from a design a thousand times larger. A canoe
// ball's segment radius has no such bound.
const maxBallRadius = 0.5

// flankNormals returns the contact normals of a vee of half-angle with
// sine s and cosine c, unit Up up and unit groove direction g: the "+"
// flank's on the side up × g, then the "−" flank's. Each leans the
// half-angle from the plane normal to up and points into the ball.
func flankNormals(up, g r3.Vec, s, c float64) [2]r3.Vec {
	side := r3.Cross(up, g)
	return [2]r3.Vec{
		r3.Add(r3.Scale(s, up), r3.Scale(-c, side)),
		r3.Add(r3.Scale(s, up), r3.Scale(c, side)),
	}
}

// ballContact returns the contact of ball b along the unit normal n.
func ballContact(b Ball, label string, n, tangent r3.Vec, base hertz.Body) Contact {
	return Contact{
		Label:   label,
		Point:   r3.Sub(b.Centre, r3.Scale(b.Radius, n)),
		Normal:  n,
		Centre:  b.Centre,
		Radius:  b.Radius,
		Tangent: tangent,
		Moving:  hertz.Sphere(b.Radius, b.Material),
		Base:    base,
	}
}

func checkHalfAngle(a float64, field string) error {
	if !linalg.Finite(a) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: %g", ErrNonFinite, a)}
	}
	if !(a > 0 && a < math.Pi/2) {
		hint := ""
		if a > 1 && a < 90 {
			hint = fmt.Sprintf(" (if that is degrees, it is %.4g rad)", a*math.Pi/180)
		}
		return &InputError{Field: field, Err: fmt.Errorf("%w: must be in (0, π/2) rad, got %g%s", ErrRange, a, hint)}
	}
	return nil
}

// grooveDimensions returns the dimensions shared by a vee and rods: the
// translations, Turn about Up through the ball centre c and Tilt about
// up × g through the root point.
func grooveDimensions(up, g, c, root r3.Vec) []dimension {
	ds := translations(2)
	turn := dimension{name: "Turn", kind: seatMotion}
	tilt := dimension{name: "Tilt", kind: seatMotion}
	side := r3.Cross(up, g)
	for s := 0; s < 2; s++ {
		turn.motions = append(turn.motions, motion{surf: s, rot: true, axis: up, point: c})
		tilt.motions = append(tilt.motions, motion{surf: s, rot: true, axis: side, point: root})
	}
	return append(ds, turn, tilt)
}

// grooveIdeal returns the best centre index a layout can give a contact
// of a groove of half-angle h: |sin 2h|. The best freed motion of the
// ball's centre lies in the plane normal to the groove, normal to the
// other flank's normal, and the two normals make the angle π − 2h.
func grooveIdeal(h float64) float64 {
	return math.Abs(math.Sin(2 * h))
}

// rootBelow returns the root of a seat whose contact normals lean the
// half-angle with sine s from the plane normal to the unit vector up, for
// a ball of centre c and radius r: the point r/s below the centre along
// up, where a vee's flanks or a socket's faces meet.
func rootBelow(c, up r3.Vec, r, s float64) r3.Vec {
	return r3.Sub(c, r3.Scale(r/s, up))
}

// inPairTerms returns an error about the contacts cs of the coupling (as
// Contacts returned them) in the coupling's own terms: "cs[k].Moving…"
// becomes the pair's ball ("Pairs[1].Ball…"), "cs[k].Base…" its seat,
// any other "cs[k]…" the pair, and "cs" "Pairs".
func (c Coupling) inPairTerms(err error, cs []Contact) error {
	var rs []rename
	k := 0
	for i, p := range c.Pairs {
		for j := 0; p.Seat != nil && j < p.Seat.count() && k < len(cs); j++ {
			rs = append(rs,
				rename{indexed("cs", k) + ".Moving", pairField(i) + ".Ball"},
				rename{indexed("cs", k) + ".Base", pairField(i) + ".Seat"},
				rename{indexed("cs", k), pairField(i)})
			k++
		}
	}
	return renamed(err, append(rs, rename{"cs", "Pairs"})...)
}
