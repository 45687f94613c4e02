package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Geometry describes the layout of a coupling's vee seats: where their
// groove axes point, the instantaneous axis of each pair of vees, and the
// coupling centre.
type Geometry struct {
	// Centre is the point nearest to all groove axes in least squares, m:
	// the coupling centre. Spread is the RMS distance of the groove axes
	// from it, m; zero when the axes meet in one point. When all grooves
	// are parallel (Parallel), the nearest points form a line along them
	// and Centre is the one nearest to the centroid of the seated balls.
	Centre   r3.Vec
	Spread   float64
	Parallel bool

	Grooves []Groove
	Axes    []PairAxis

	// Triangle reports whether the coupling has three balls, so that the
	// ball triangle's Centroid and Incentre, and each groove's
	// OffBisector, are set. The angle bisectors of a triangle meet at its
	// incentre, which is also the centroid only for an equilateral
	// triangle.
	Triangle bool
	Centroid r3.Vec
	Incentre r3.Vec
}

// Groove is the axis of one vee seat: the line through the seated ball's
// centre along the groove.
type Groove struct {
	Pair      int    // index into Coupling.Pairs
	Point     r3.Vec // the ball's centre, m
	Direction r3.Vec // unit, normal to the seat's Up

	// Azimuth is the groove's angle about Up from the direction that
	// points from the ball towards the centroid of all ball centres
	// ("radial"), right-handed, in (−π/2, π/2] (a groove is a line, so
	// azimuths π apart are the same groove). Radial is the direction
	// towards the centroid projected normal to Up; it is undefined, and
	// Azimuth zero, when that projection vanishes.
	Azimuth float64

	// OffBisector is the angle in [0, π/2] between the groove axis and
	// the bisector of the ball triangle's angle at this ball (when
	// Geometry.Triangle is set; zero otherwise).
	OffBisector float64
}

// PairAxis is the instantaneous axis of two vee seats: with only these two
// balls seated, the moving body can rotate about this line (and nothing
// else), which meets all four contact normals. It is where the two planes
// that hold each vee's pair of normals meet. When those planes are parallel
// (parallel grooves) the line is at infinity: the pair leaves a translation
// along the grooves free instead, and Parallel is set.
type PairAxis struct {
	A, B     int    // indices into Coupling.Pairs
	Point    r3.Vec // the point of the axis nearest the midpoint of the two balls, m
	Dir      r3.Vec // unit
	Parallel bool
}

// parallelTol is the sine of the angle between two grooves below which
// they are taken as parallel: below 1e-6 rad the line where their normal
// planes meet lies more than a million ball spacings away, and the
// coupling centre as far. For the centre, grooves count as parallel when
// the smallest eigenvalue of Σ(I − dᵢdᵢᵀ), about n·α² for n grooves within
// α of one direction, is below n·parallelTol².
const parallelTol = 1e-6

// Geometry returns the layout of the coupling's vee seats. It needs at
// least two vees. Errors are those of [Coupling.Contacts], and an
// [*InputError] wrapping [ErrDegenerate] with fewer than two vees.
func (c Coupling) Geometry() (Geometry, error) {
	if _, err := c.Contacts(); err != nil { // validates every pair
		return Geometry{}, err
	}
	var g Geometry
	g.Centroid = ballCentroid(c)
	for i, p := range c.Pairs {
		v, ok := p.Seat.(Vee)
		if !ok {
			continue
		}
		up := r3.Unit(v.Up)
		dir, _ := horizontal(v.Direction, up, "")
		g.Grooves = append(g.Grooves, Groove{
			Pair:      i,
			Point:     p.Ball.Centre,
			Direction: dir,
			Azimuth:   azimuth(dir, up, radial(p.Ball.Centre, g.Centroid, up)),
		})
	}
	if len(g.Grooves) < 2 {
		return Geometry{}, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: %d vee seats; the layout of grooves needs two or more", ErrDegenerate, len(g.Grooves))}
	}

	// Coupling centre: Σ(I − ddᵀ) x = Σ(I − ddᵀ) p over the groove axes,
	// solved relative to the ball centroid with the eigen-directions of
	// zero weight (all grooves parallel) dropped.
	var s [9]float64
	var b [3]float64
	for _, gr := range g.Grooves {
		q := r3.Sub(gr.Point, g.Centroid)
		q = r3.Sub(q, r3.Scale(r3.Dot(q, gr.Direction), gr.Direction))
		b[0], b[1], b[2] = b[0]+q.X, b[1]+q.Y, b[2]+q.Z
		d := [3]float64{gr.Direction.X, gr.Direction.Y, gr.Direction.Z}
		for r := 0; r < 3; r++ {
			for k := 0; k < 3; k++ {
				s[3*k+r] -= d[r] * d[k]
			}
			s[3*r+r]++
		}
	}
	x, rank := linalg.SolvePSD3(s, b, float64(len(g.Grooves))*parallelTol*parallelTol)
	g.Centre = r3.Add(g.Centroid, r3.Vec{X: x[0], Y: x[1], Z: x[2]})
	g.Parallel = rank < 3
	var ss float64
	for _, gr := range g.Grooves {
		q := r3.Sub(gr.Point, g.Centre)
		ss += r3.Norm2(r3.Cross(q, gr.Direction))
	}
	g.Spread = math.Sqrt(ss / float64(len(g.Grooves)))

	// Pair axes: the plane of vee i's normals passes through its ball
	// centre with normal dᵢ; two such planes meet along d₁ × d₂.
	for i := 0; i < len(g.Grooves); i++ {
		for j := i + 1; j < len(g.Grooves); j++ {
			gi, gj := g.Grooves[i], g.Grooves[j]
			ax := PairAxis{A: gi.Pair, B: gj.Pair}
			u := r3.Cross(gi.Direction, gj.Direction)
			if linalg.Norm3(u) <= parallelTol {
				ax.Parallel = true
				ax.Dir = gi.Direction
				g.Axes = append(g.Axes, ax)
				continue
			}
			ax.Dir = r3.Unit(u)
			// The point of the line nearest the midpoint m: solve
			// dᵢ·x = dᵢ·pᵢ, dⱼ·x = dⱼ·pⱼ, u·x = u·m.
			m := r3.Scale(0.5, r3.Add(gi.Point, gj.Point))
			ax.Point = r3.Add(m, planes(gi.Direction, r3.Dot(gi.Direction, r3.Sub(gi.Point, m)),
				gj.Direction, r3.Dot(gj.Direction, r3.Sub(gj.Point, m)), ax.Dir))
			g.Axes = append(g.Axes, ax)
		}
	}

	if len(c.Pairs) == 3 {
		g.Triangle = true
		a, bb, cc := c.Pairs[0].Ball.Centre, c.Pairs[1].Ball.Centre, c.Pairs[2].Ball.Centre
		g.Incentre = incentre(a, bb, cc)
		for k := range g.Grooves {
			gr := &g.Grooves[k]
			bis := r3.Unit(r3.Sub(g.Incentre, gr.Point))
			gr.OffBisector = math.Acos(math.Min(1, math.Abs(r3.Dot(bis, gr.Direction))))
		}
	}
	return g, nil
}

// planes returns the point x with a·x = ha, b·x = hb and u·x = 0, for unit
// a, b and u = (a × b)/|a × b| (Cramer's rule with the triple product
// [a, b, u] = |a × b|).
func planes(a r3.Vec, ha float64, b r3.Vec, hb float64, u r3.Vec) r3.Vec {
	// x = (ha (b × u) + hb (u × a)) / (a · (b × u)).
	den := r3.Dot(a, r3.Cross(b, u))
	return r3.Scale(1/den, r3.Add(r3.Scale(ha, r3.Cross(b, u)), r3.Scale(hb, r3.Cross(u, a))))
}

// incentre returns the incentre of the triangle abc: the vertices weighted
// by the lengths of the opposite sides.
func incentre(a, b, c r3.Vec) r3.Vec {
	la, lb, lc := linalg.Norm3(r3.Sub(b, c)), linalg.Norm3(r3.Sub(c, a)), linalg.Norm3(r3.Sub(a, b))
	s := la + lb + lc
	return r3.Scale(1/s, r3.Add(r3.Scale(la, a), r3.Add(r3.Scale(lb, b), r3.Scale(lc, c))))
}

func ballCentroid(c Coupling) r3.Vec {
	var s r3.Vec
	for _, p := range c.Pairs {
		s = r3.Add(s, p.Ball.Centre)
	}
	return r3.Scale(1/float64(len(c.Pairs)), s)
}

// radial returns the unit direction from the ball centre p towards the
// centroid, projected normal to the unit vector up, or the zero vector if
// the projection vanishes (relative to the distance, by horizontalTol).
func radial(p, centroid, up r3.Vec) r3.Vec {
	d := r3.Sub(centroid, p)
	h := r3.Sub(d, r3.Scale(r3.Dot(d, up), up))
	if linalg.Norm3(h) <= horizontalTol*linalg.Norm3(d) || linalg.Norm3(h) == 0 {
		return r3.Vec{}
	}
	return r3.Unit(h)
}

// azimuth returns the angle of the unit horizontal direction d about up
// from the unit horizontal direction rad, in (−π/2, π/2]; zero if rad is
// zero.
func azimuth(d, up, rad r3.Vec) float64 {
	if rad == (r3.Vec{}) {
		return 0
	}
	return wrapAzimuth(math.Atan2(r3.Dot(up, r3.Cross(rad, d)), r3.Dot(rad, d)))
}
