package kinematic

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Geometry describes the layout of a coupling's groove seats (vees and rods): where their
// groove axes point, the instantaneous axis of each pair of vees, and the
// coupling centre.
type Geometry struct {
	// HasCentre reports whether the coupling has two or more vees, so
	// that Centre, Spread and Parallel are set.
	//
	// Centre is the point nearest to all groove axes in least squares, m:
	// the coupling centre. Spread is the RMS distance of the groove axes
	// from it, m; zero when the axes meet in one point. When all grooves
	// are parallel (Parallel), the nearest points form a line along them
	// and Centre is the one nearest to the centroid of the seated balls.
	HasCentre bool
	Centre    r3.Vec
	Spread    float64
	Parallel  bool

	Grooves []Groove
	Axes    []PairAxis

	// Socket is the index into Coupling.Pairs of the coupling's one
	// socket (a Trihedral or Cone seat), or −1 if it has none or several.
	Socket int

	// Triangle reports whether the coupling has three balls that are not
	// in a line, so that the ball triangle's Incentre and each groove's
	// OffBisector are set. The angle bisectors of a triangle meet at its
	// incentre, which is also the centroid only for an equilateral
	// triangle. Centroid, the centroid of all ball centres, is always set.
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

	// Azimuth is the groove's angle about Up from the [Radial] direction,
	// right-handed, in (−π/2, π/2] (a groove is a line, so azimuths π
	// apart are the same groove); zero when the radial direction is
	// undefined (the ball straight above or below the centroid of the
	// balls). FrameAzimuth is the same angle from the [FrameX] direction.
	Azimuth      float64
	FrameAzimuth float64

	// OffBisector is the angle in [0, π/2] between the groove axis and
	// the bisector of the ball triangle's angle at this ball, projected
	// into the seat's plane as [BisectorVees] lays it (when
	// Geometry.Triangle is set; zero otherwise).
	OffBisector float64

	// OffSocket is the angle in [0, π/2] between the groove axis and the
	// direction from this ball to the socket's ball, projected into the
	// seat's plane (when Geometry.Socket ≥ 0; zero otherwise). A vee aimed
	// at the socket has OffSocket zero, so that the coupling expands
	// about the socket without tilting.
	OffSocket float64
}

// PairAxis is the instantaneous axis of two vee seats: with only these two
// balls seated, the moving body can rotate about this line (and nothing
// else), which meets all four contact normals. It is where the two planes
// that hold each vee's pair of normals meet. When those planes are parallel
// (parallel grooves) the line is at infinity: the pair leaves a translation
// along the grooves free instead, and Parallel is set.
type PairAxis struct {
	A, B      int    // indices into Coupling.Pairs
	Point     r3.Vec // the point of the axis nearest the midpoint of the two balls, m
	Direction r3.Vec // unit
	Parallel  bool
}

// parallelTol is the sine of the angle between two grooves below which
// they are taken as parallel: below 1e-6 rad the line where their normal
// planes meet lies more than a million ball spacings away, and the
// coupling centre as far. For the centre, grooves count as parallel when
// the smallest eigenvalue of Σ(I − dᵢdᵢᵀ), about n·α² for n grooves within
// α of one direction, is below n·parallelTol².
const parallelTol = 1e-6

// Geometry returns the layout of the coupling's groove seats (vees and rods): every groove,
// and with two or more vees the pair axes and the coupling centre. Errors
// are those of [Coupling.Contacts].
func (c Coupling) Geometry() (Geometry, error) {
	if _, err := c.Contacts(); err != nil { // validates every pair
		return Geometry{}, err
	}
	g := Geometry{Socket: -1, Centroid: ballCentroid(c)}
	for i, p := range c.Pairs {
		if _, ok := p.Seat.(socketSeat); ok {
			if g.Socket == -1 {
				g.Socket = i
			} else {
				g.Socket = -2
			}
		}
	}
	g.Socket = max(g.Socket, -1)
	if len(c.Pairs) == 3 {
		a, b, cc := c.Pairs[0].Ball.Centre, c.Pairs[1].Ball.Centre, c.Pairs[2].Ball.Centre
		if isTriangle(a, b, cc) {
			g.Triangle = true
			g.Incentre = incentre(a, b, cc)
		}
	}
	for i, p := range c.Pairs {
		v, ok := p.Seat.(grooveSeat)
		if !ok {
			continue
		}
		up, dir, _ := v.groove("") // validated by Contacts
		gr := Groove{Pair: i, Point: p.Ball.Centre, Direction: dir}
		if rad, err := c.reference(i, up, Radial); err == nil {
			gr.Azimuth = azimuthFrom(dir, up, rad)
		}
		gr.FrameAzimuth = azimuthFrom(dir, up, frameX(up))
		if g.Triangle {
			gr.OffBisector = offAxis(dir, up, r3.Sub(g.Incentre, p.Ball.Centre))
		}
		if g.Socket >= 0 {
			gr.OffSocket = offAxis(dir, up, r3.Sub(c.Pairs[g.Socket].Ball.Centre, p.Ball.Centre))
		}
		g.Grooves = append(g.Grooves, gr)
	}
	if len(g.Grooves) < 2 {
		return g, nil
	}

	// Coupling centre: the point nearest to the groove axes, solved
	// relative to the ball centroid with the eigen-directions of zero
	// weight (all grooves parallel) dropped.
	var q linalg.NearestPoint
	for _, gr := range g.Grooves {
		q.Add(r3.Sub(gr.Point, g.Centroid), gr.Direction)
	}
	x, rank := q.Solve(float64(q.Len()) * parallelTol * parallelTol)
	g.HasCentre = true
	g.Centre = r3.Add(g.Centroid, x)
	g.Parallel = rank < 3
	var ss float64
	for _, gr := range g.Grooves {
		ss += r3.Norm2(r3.Cross(r3.Sub(gr.Point, g.Centre), gr.Direction))
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
				ax.Direction = gi.Direction
				g.Axes = append(g.Axes, ax)
				continue
			}
			ax.Direction, _ = linalg.Unit3(u)
			// The point of the line nearest the midpoint m: solve
			// dᵢ·x = dᵢ·pᵢ, dⱼ·x = dⱼ·pⱼ, u·x = u·m.
			m := r3.Scale(0.5, r3.Add(gi.Point, gj.Point))
			ax.Point = r3.Add(m, planes(gi.Direction, r3.Dot(gi.Direction, r3.Sub(gi.Point, m)),
				gj.Direction, r3.Dot(gj.Direction, r3.Sub(gj.Point, m)), ax.Direction))
			g.Axes = append(g.Axes, ax)
		}
	}
	return g, nil
}

// offAxis returns the angle in [0, π/2] between the unit groove direction
// dir and the direction d projected normal to the unit vector up; zero if
// that projection vanishes (d along up, or zero).
func offAxis(dir, up, d r3.Vec) float64 {
	u, ok := linalg.Unit3(d)
	if !ok {
		return 0
	}
	h, ok := flatten(u, up)
	if !ok {
		return 0
	}
	// atan2 of sine and cosine is accurate at every angle, unlike acos
	// near 0.
	return math.Atan2(linalg.Norm3(r3.Cross(h, dir)), math.Abs(r3.Dot(h, dir)))
}

// planes returns the point x with a·x = ha, b·x = hb and u·x = 0, for unit
// a, b and u = (a × b)/|a × b| (Cramer's rule with the triple product
// [a, b, u] = |a × b|).
func planes(a r3.Vec, ha float64, b r3.Vec, hb float64, u r3.Vec) r3.Vec {
	// x = (ha (b × u) + hb (u × a)) / (a · (b × u)).
	den := r3.Dot(a, r3.Cross(b, u))
	return r3.Scale(1/den, r3.Add(r3.Scale(ha, r3.Cross(b, u)), r3.Scale(hb, r3.Cross(u, a))))
}
