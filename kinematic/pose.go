package kinematic

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// surfaceKind is the shape of one seat surface.
type surfaceKind int

const (
	planeSurface    surfaceKind = iota // a plane: q a point of it, d its unit normal towards the ball
	convexCylinder                     // a rod: q a point of its axis, d the unit axis, R its radius
	concaveCylinder                    // a gothic-arch flank: the same, concave, R larger than the ball
)

// seatSurface is one surface of a seat in the base frame; each contact of
// a seat touches one.
type seatSurface struct {
	kind surfaceKind
	q, d r3.Vec
	R    float64
}

// gap returns the gap between the surface and the ball of centre c and
// radius r (positive when they are apart), and the contact normal (the
// unit direction along which the surface pushes the ball); ok is false
// where the normal is undefined (a ball centre on a cylinder's axis).
func (s *seatSurface) gap(c r3.Vec, r float64) (g float64, n r3.Vec, ok bool) {
	switch s.kind {
	case planeSurface:
		return r3.Dot(s.d, r3.Sub(c, s.q)) - r, s.d, true
	default:
		u := r3.Sub(c, s.q)
		u = r3.Sub(u, r3.Scale(r3.Dot(u, s.d), s.d))
		dist := linalg.Norm3(u)
		if dist == 0 {
			return 0, r3.Vec{}, false
		}
		u = r3.Scale(1/dist, u)
		if s.kind == convexCylinder {
			return dist - s.R - r, u, true
		}
		return s.R - r - dist, r3.Scale(-1, u), true
	}
}

// move applies the rigid motion "rotate by angle about the axis through o
// with unit direction a, then translate by t" to the surface.
func (s *seatSurface) move(angle float64, a, o, t r3.Vec) {
	if angle != 0 {
		s.q = r3.Add(o, r3.Rotate(r3.Sub(s.q, o), angle, a))
		s.d = r3.Rotate(s.d, angle, a)
	}
	s.q = r3.Add(s.q, t)
}

// dimKind is what a named dimension changes.
type dimKind int

const (
	ballRadius    dimKind = iota // the ball's radius
	ballCentre                   // the ball's centre on the moving body, along axis
	seatMotion                   // a rigid motion of some of the seat's surfaces
	surfaceRadius                // a cylinder surface's radius
)

// motion is the rigid motion of one surface per unit of a dimension: a
// rotation about the axis through point (rot), or a translation along
// axis.
type motion struct {
	surf  int // index into the pair's surfaces
	rot   bool
	axis  r3.Vec
	point r3.Vec
}

// dimension is one named dimension of an assembly.
type dimension struct {
	name    string
	pair    int
	kind    dimKind
	axis    r3.Vec   // ballCentre: the unit direction
	surf    int      // surfaceRadius: the surface
	motions []motion // seatMotion
}

// Assembly is a coupling described by its real geometry: the balls on the
// moving body and every seat surface in the base frame, with the named
// dimensions that an error budget varies. Make one with
// [Coupling.Assembly]; it is not modified by its methods, which may be
// called from several goroutines at once.
//
// # Dimensions
//
// A dimension is a deviation from the nominal geometry, in m or rad, named
// "<pair>.<part>" with the pair's name (its letter by default):
//
//	A.Ball.Radius          the ball's radius
//	A.Ball.X, .Y, .Z       the ball's centre on the moving body
//	A.Seat.X, .Y, .Z       the whole seat moved in the base frame
//	A.Seat.Turn            a vee or rods turned about Up through the ball's nominal centre (rad)
//	A.Seat.Tilt            a vee or rods pitched about the horizontal normal to the groove, through its root (rad)
//	A.Seat.HalfAngle       a vee's flanks, or a socket's faces, each turned about its root line to widen the half-angle (rad)
//	A.Seat.Flank+, Flank-  one flank of a vee moved along its normal towards the ball
//	A.Seat.FlankRadius+, - a gothic-arch flank's radius
//	A.Seat.Rod+, Rod-      one rod moved along its contact normal towards the ball
//	A.Seat.RodRadius+, -   one rod's radius
//	A.Seat.Height          a flat moved along its Up
//	A.Seat.Tilt1, Tilt2    a flat tilted about two horizontal axes through its contact point (rad; no first-order effect)
//	A.Seat.Face1, 2, 3     one face of a socket moved along its normal towards the ball
//
// A cone stands as its three tangent planes, which seat a ball exactly as
// the cone does (the ball's centre lies on the axis, r/sin α from the
// apex, either way); a socket's root is its apex. "Towards the ball" is
// positive: a flank moved by +e stands e high, and the gap it makes is e.
type Assembly struct {
	pairs  []assemblyPair
	conts  []assemblyContact
	dims   []dimension
	index  map[string]int
	origin r3.Vec  // the contacts' centroid
	size   float64 // their RMS distance from it
	nom    Analysis
	freed  [6]screw.Twist // at nominal, about origin
	lines  [6]line        // at nominal, about origin
}

type assemblyPair struct {
	name  string
	ball  Ball
	surfs []seatSurface
	root  r3.Vec  // the seat's reference point in the base frame: a groove's root under the ball, a socket's apex, a flat's contact point
	alpha float64 // the seat's expansion coefficient, 1/K
}

type assemblyContact struct {
	pair, surf int
	label      string
}

// Assembly returns the coupling's real geometry with its named
// dimensions, at the nominal (every ball seated as drawn). The coupling
// must be exactly constrained: six independent contacts. Errors are those
// of [Coupling.Contacts] and [Analyze], and an [*InputError] wrapping
// [ErrNotExact] otherwise.
func (c Coupling) Assembly() (*Assembly, error) {
	cs, err := c.Contacts()
	if err != nil {
		return nil, err
	}
	an, err := Analyze(cs)
	if err != nil {
		return nil, err
	}
	if len(cs) != 6 || an.Rank != 6 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf(
			"%w: %d contacts of rank %d; an assembly's seated pose needs six independent contacts", ErrNotExact, len(cs), an.Rank)}
	}
	a := &Assembly{index: map[string]int{}, origin: an.origin, nom: an}
	if !freedOf(an.lines, &a.freed) {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: the six contacts are singular to working precision", ErrNotExact)}
	}
	copy(a.lines[:], an.lines)
	var s2 float64
	for _, l := range an.lines {
		s2 += r3.Norm2(l.p)
	}
	a.size = math.Sqrt(s2 / 6)
	k := 0
	for i, p := range c.Pairs {
		name := pairName(p.Name, i)
		surfs, dims, root, alpha := p.Seat.surfaces(p.Ball, cs[k:k+p.Seat.count()])
		ap := assemblyPair{name: name, ball: p.Ball, surfs: surfs, root: root, alpha: alpha}
		for j := range surfs {
			a.conts = append(a.conts, assemblyContact{pair: i, surf: j, label: cs[k+j].Label})
		}
		k += p.Seat.count()
		a.pairs = append(a.pairs, ap)
		for _, d := range ballDimensions(name) {
			d.pair = i
			a.add(d)
		}
		for _, d := range dims {
			d.name = name + ".Seat." + d.name
			d.pair = i
			a.add(d)
		}
	}
	return a, nil
}

func (a *Assembly) add(d dimension) {
	a.index[d.name] = len(a.dims)
	a.dims = append(a.dims, d)
}

func ballDimensions(name string) []dimension {
	return []dimension{
		{name: name + ".Ball.Radius", kind: ballRadius},
		{name: name + ".Ball.X", kind: ballCentre, axis: r3.Vec{X: 1}},
		{name: name + ".Ball.Y", kind: ballCentre, axis: r3.Vec{Y: 1}},
		{name: name + ".Ball.Z", kind: ballCentre, axis: r3.Vec{Z: 1}},
	}
}

// Dimensions returns the names of the assembly's dimensions, pair by
// pair: the ball's, then the seat's.
func (a *Assembly) Dimensions() []string {
	out := make([]string, len(a.dims))
	for i, d := range a.dims {
		out[i] = d.name
	}
	return out
}

// translations returns the seat dimensions X, Y, Z that move all of n
// surfaces together.
func translations(n int) []dimension {
	var ds []dimension
	for k, ax := range []r3.Vec{{X: 1}, {Y: 1}, {Z: 1}} {
		d := dimension{name: string(rune('X' + k)), kind: seatMotion}
		for s := 0; s < n; s++ {
			d.motions = append(d.motions, motion{surf: s, axis: ax})
		}
		ds = append(ds, d)
	}
	return ds
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

func (v Vee) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	up, g, _ := v.groove("")
	s := math.Sin(v.HalfAngle)
	root := r3.Sub(b.Centre, r3.Scale(b.Radius/s, up))
	surfs := make([]seatSurface, 2)
	for k := range surfs {
		n := cs[k].Normal
		if v.FlankRadius == 0 || math.IsInf(v.FlankRadius, 1) {
			surfs[k] = seatSurface{kind: planeSurface, q: cs[k].Point, d: n}
		} else {
			// The flank's axis lies FlankRadius from the contact point,
			// back along the normal through the ball's centre.
			surfs[k] = seatSurface{kind: concaveCylinder, q: r3.Add(cs[k].Point, r3.Scale(v.FlankRadius, n)), d: g, R: v.FlankRadius}
		}
	}
	ds := grooveDimensions(up, g, b.Centre, root)
	// Widening the half-angle turns the + flank about −g and the − flank
	// about +g, both through the root line (dn±/dθ = ∓g × n±).
	half := dimension{name: "HalfAngle", kind: seatMotion, motions: []motion{
		{surf: 0, rot: true, axis: r3.Scale(-1, g), point: root},
		{surf: 1, rot: true, axis: g, point: root},
	}}
	ds = append(ds, half,
		dimension{name: "Flank+", kind: seatMotion, motions: []motion{{surf: 0, axis: cs[0].Normal}}},
		dimension{name: "Flank-", kind: seatMotion, motions: []motion{{surf: 1, axis: cs[1].Normal}}})
	if surfs[0].kind == concaveCylinder {
		ds = append(ds,
			dimension{name: "FlankRadius+", kind: surfaceRadius, surf: 0},
			dimension{name: "FlankRadius-", kind: surfaceRadius, surf: 1})
	}
	return surfs, ds, root, v.Material.Alpha
}

func (r Rods) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	up, g, _ := r.groove("")
	s := math.Sin(r.HalfAngle)
	root := r3.Sub(b.Centre, r3.Scale(b.Radius/s, up))
	surfs := make([]seatSurface, 2)
	for k := range surfs {
		// The rod's axis lies RodRadius beyond the contact point, away
		// from the ball.
		surfs[k] = seatSurface{kind: convexCylinder, q: r3.Sub(cs[k].Point, r3.Scale(r.RodRadius, cs[k].Normal)), d: g, R: r.RodRadius}
	}
	ds := append(grooveDimensions(up, g, b.Centre, root),
		dimension{name: "Rod+", kind: seatMotion, motions: []motion{{surf: 0, axis: cs[0].Normal}}},
		dimension{name: "Rod-", kind: seatMotion, motions: []motion{{surf: 1, axis: cs[1].Normal}}},
		dimension{name: "RodRadius+", kind: surfaceRadius, surf: 0},
		dimension{name: "RodRadius-", kind: surfaceRadius, surf: 1})
	return surfs, ds, root, r.Material.Alpha
}

func (f Flat) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	n := cs[0].Normal
	t1 := cs[0].Tangent
	t2 := r3.Cross(n, t1)
	p := cs[0].Point
	return []seatSurface{{kind: planeSurface, q: p, d: n}}, []dimension{
		{name: "Height", kind: seatMotion, motions: []motion{{surf: 0, axis: n}}},
		{name: "Tilt1", kind: seatMotion, motions: []motion{{surf: 0, rot: true, axis: t1, point: p}}},
		{name: "Tilt2", kind: seatMotion, motions: []motion{{surf: 0, rot: true, axis: t2, point: p}}},
	}, p, f.Material.Alpha
}

func (t Trihedral) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	s, d, apex := socketSurfaces(t.Up, t.HalfAngle, b, cs)
	return s, d, apex, t.Material.Alpha
}

func (c Cone) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	s, d, apex := socketSurfaces(c.Up, c.HalfAngle, b, cs)
	return s, d, apex, c.Material.Alpha
}

// socketSurfaces returns the three faces of a trihedral socket, or the
// three planes tangent to a cone at its contacts.
func socketSurfaces(upv r3.Vec, half float64, b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec) {
	up, _ := linalg.Unit3(upv)
	apex := r3.Sub(b.Centre, r3.Scale(b.Radius/math.Sin(half), up))
	surfs := make([]seatSurface, 3)
	ha := dimension{name: "HalfAngle", kind: seatMotion}
	var faces []dimension
	for k := range surfs {
		n := cs[k].Normal
		surfs[k] = seatSurface{kind: planeSurface, q: cs[k].Point, d: n}
		// Face k's normal is sin θ·up − cos θ·h; widening θ turns it
		// about t = up × h through the apex.
		h, _ := flatten(r3.Scale(-1, n), up)
		ha.motions = append(ha.motions, motion{surf: k, rot: true, axis: r3.Cross(up, h), point: apex})
		faces = append(faces, dimension{name: fmt.Sprintf("Face%d", k+1), kind: seatMotion, motions: []motion{{surf: k, axis: n}}})
	}
	ds := append(translations(3), ha)
	return surfs, append(ds, faces...), apex
}

// Deviation is the deviation of one named dimension from nominal, in m or
// rad (see [Assembly]).
type Deviation struct {
	Dimension string
	Value     float64
}

// lookup returns the index of a dimension, or an error naming field.
func (a *Assembly) lookup(name, field string) (int, error) {
	i, ok := a.index[name]
	if !ok {
		hint := ""
		if dot := strings.IndexByte(name, '.'); dot > 0 {
			hint = fmt.Sprintf(" (the dimensions of pair %s are listed by Assembly.Dimensions)", name[:dot])
		}
		return 0, &InputError{Field: field, Err: fmt.Errorf("%w: no dimension %q%s", ErrRange, name, hint)}
	}
	return i, nil
}

// effects returns ∂gᵢ/∂v for the six contacts: how far each contact's gap
// opens per unit of dimension d, at the nominal.
func (a *Assembly) effects(d *dimension, out *[6]float64) {
	*out = [6]float64{}
	for i, c := range a.conts {
		if c.pair != d.pair {
			continue
		}
		l := &a.lines[i]
		switch d.kind {
		case ballRadius:
			out[i] = -1
		case ballCentre:
			out[i] = r3.Dot(l.n, d.axis)
		case surfaceRadius:
			if c.surf == d.surf {
				if a.pairs[c.pair].surfs[c.surf].kind == convexCylinder {
					out[i] = -1
				} else {
					out[i] = 1
				}
			}
		case seatMotion:
			p := r3.Add(l.p, a.origin) // the contact point in the base frame
			for _, m := range d.motions {
				if m.surf != c.surf {
					continue
				}
				v := m.axis
				if m.rot {
					v = r3.Cross(m.axis, r3.Sub(p, m.point))
				}
				// The surface moving by v at the contact closes the gap
				// by its normal component.
				out[i] -= r3.Dot(l.n, v)
			}
		}
	}
}

// Sensitivity is the first-order effect of one dimension.
type Sensitivity struct {
	Dimension string

	// Pose is the small displacement of the moving body per unit of the
	// dimension (rad and m per m or per rad), V at the origin.
	Pose screw.Twist

	// Displacement is the point of interest's displacement per unit
	// (m/m or m/rad); Tilt is Pose.W.
	Displacement r3.Vec
	Tilt         r3.Vec
}

// Sensitivities returns the first-order effect of every dimension on the
// pose and on the point p of the moving body, in the order of
// [Assembly.Dimensions]. A dimension that opens gap i by ∂gᵢ/∂v per unit
// moves the body by x = −Σᵢ (∂gᵢ/∂v) Tᵢ, with Tᵢ the twists of power δᵢⱼ
// with contact j, so that every gap stays closed: moving the body by x
// opens gap j by Power(x, lⱼ) (the normal velocity of its contact point).
// It returns an [*InputError] naming "p" when p is not finite.
func (a *Assembly) Sensitivities(p r3.Vec) ([]Sensitivity, error) {
	if !linalg.Finite3(p) {
		return nil, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	out := make([]Sensitivity, len(a.dims))
	pl := r3.Sub(p, a.origin)
	for k := range a.dims {
		x := a.sensitivity(k)
		out[k] = Sensitivity{Dimension: a.dims[k].name, Pose: global(x, a.origin), Displacement: x.At(pl), Tilt: x.W}
	}
	return out, nil
}

// sensitivity returns the pose twist per unit of dimension k, about the
// origin.
func (a *Assembly) sensitivity(k int) screw.Twist {
	var e [6]float64
	a.effects(&a.dims[k], &e)
	var x screw.Twist
	for i := range e {
		if e[i] != 0 {
			x = x.Add(a.freed[i].Scale(-e[i]))
		}
	}
	return x
}

// SeatOptions holds options for [Assembly.Seat]; the zero value and a nil
// pointer mean defaults.
type SeatOptions struct {
	// Approach holds, per contact in the order of [Coupling.Contacts],
	// an elastic approach in m by which the surfaces overlap when seated
	// under preload (for example Statics(...).Contacts[i].Hertz.Approach).
	// Nil means rigid contacts.
	Approach []float64

	// Tolerance is the largest |gap| at which the pose is seated, relative
	// to the contacts' RMS distance from their centroid; zero means 1e-13.
	Tolerance float64

	// MaxIterations bounds the Newton iterations; zero means 50.
	MaxIterations int
}

// Pose is where the moving body sits: a body point at q (in the nominal
// drawing) is at Rot(Rotation)·q + Translation.
type Pose struct {
	Rotation    r3.Vec // rotation vector, rad: the axis times the angle
	Translation r3.Vec // m

	// Residual is the largest |gap + approach| left at a contact, m;
	// Iterations the Newton steps taken.
	Residual   float64
	Iterations int
}

// Apply returns where the body point at q of the nominal drawing is in
// the pose.
func (p Pose) Apply(q r3.Vec) r3.Vec {
	if a := linalg.Norm3(p.Rotation); a > 0 {
		q = r3.Rotate(q, a, p.Rotation)
	}
	return r3.Add(q, p.Translation)
}

// leaveFraction is how far, as a fraction of its ball's radius, a contact
// point may move from its nominal place on its seat before Seat concludes
// that the ball cannot reach its seat: beyond it the ball would run off a
// real flank or face, and the perturbation is too large for the seat.
const leaveFraction = 0.5

// geom is the actual geometry of an assembly's six contacts: each
// contact's ball centre on the moving body and radius, and its seat
// surface, in local coordinates (about the assembly's origin).
type geom struct {
	c     [6]r3.Vec
	r     [6]float64
	surfs [6]seatSurface
}

// nominal returns the assembly's geometry as drawn.
func (a *Assembly) nominal() geom {
	var g geom
	for i, c := range a.conts {
		p := &a.pairs[c.pair]
		g.c[i] = r3.Sub(p.ball.Centre, a.origin)
		g.r[i] = p.ball.Radius
		s := p.surfs[c.surf]
		s.q = r3.Sub(s.q, a.origin)
		g.surfs[i] = s
	}
	return g
}

// apply changes the geometry by v of dimension k, exactly.
func (a *Assembly) apply(g *geom, k int, v float64) {
	d := &a.dims[k]
	for i, c := range a.conts {
		if c.pair != d.pair {
			continue
		}
		switch d.kind {
		case ballRadius:
			g.r[i] += v
		case ballCentre:
			g.c[i] = r3.Add(g.c[i], r3.Scale(v, d.axis))
		case surfaceRadius:
			if c.surf == d.surf {
				// The axis stays; the surface moves with the radius.
				g.surfs[i].R += v
			}
		case seatMotion:
			for _, m := range d.motions {
				if m.surf != c.surf {
					continue
				}
				if m.rot {
					g.surfs[i].move(v, m.axis, r3.Sub(m.point, a.origin), r3.Vec{})
				} else {
					g.surfs[i].move(0, r3.Vec{}, r3.Vec{}, r3.Scale(v, m.axis))
				}
			}
		}
	}
}

// Seat returns the exact pose of the moving body with the deviations
// applied (in the order given; finite rotations do not commute, which
// changes the result at second order): the rotation and translation at
// which every ball touches each of its seat surfaces, found by Newton's
// method on the six tangency equations gᵢ(pose) = −approachᵢ, whose
// Jacobian is the matrix of the contact lines at the current pose, so the
// steps are x = −Σ (gᵢ + aᵢ) Tᵢ with the twists Tᵢ of power δᵢⱼ; the
// convergence is quadratic. A perfect coupling seats at the nominal pose.
//
// Seat returns an [*InputError] naming "devs[i]" for an unknown dimension
// or a value that is not finite, "opt.Approach" for a list of the wrong
// length or a bad value, and one wrapping [ErrRange] naming the pair when
// a ball cannot reach its seat: a ball radius that is not positive, a
// contact that moves more than half its ball's radius across its seat, or
// no convergence.
func (a *Assembly) Seat(devs []Deviation, opt *SeatOptions) (Pose, error) {
	g := a.nominal()
	for i, d := range devs {
		k, ok := a.index[d.Dimension]
		if !ok {
			_, err := a.lookup(d.Dimension, indexed("devs", i)+".Dimension")
			return Pose{}, err
		}
		if math.IsNaN(d.Value) || math.IsInf(d.Value, 0) {
			return Pose{}, &InputError{Field: indexed("devs", i) + ".Value", Err: fmt.Errorf("%w: %g", ErrNonFinite, d.Value)}
		}
		a.apply(&g, k, d.Value)
	}
	var o SeatOptions
	if opt != nil {
		o = *opt
	}
	var appr [6]float64
	if o.Approach != nil {
		if len(o.Approach) != 6 {
			return Pose{}, &InputError{Field: "opt.Approach", Err: fmt.Errorf("%w: %d values for 6 contacts", ErrRange, len(o.Approach))}
		}
		for i, v := range o.Approach {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				return Pose{}, &InputError{Field: indexed("opt.Approach", i), Err: fmt.Errorf("%w: must be finite and ≥ 0, got %g", ErrRange, v)}
			}
			appr[i] = v
		}
	}
	if o.Tolerance == 0 {
		o.Tolerance = 1e-13
	}
	if o.MaxIterations == 0 {
		o.MaxIterations = 50
	}
	if !(o.Tolerance > 0 && o.Tolerance < 1) || o.MaxIterations < 0 {
		return Pose{}, &InputError{Field: "opt", Err: fmt.Errorf("%w: Tolerance %g, MaxIterations %d", ErrRange, o.Tolerance, o.MaxIterations)}
	}
	return a.seat(&g, &appr, o.Tolerance, o.MaxIterations)
}

// errUnseated reports that the ball of contact i cannot reach its seat.
func (a *Assembly) errUnseated(i int, why string) error {
	p := a.conts[i].pair
	return &InputError{Field: pairField(p), Err: fmt.Errorf("%w: ball %s cannot reach its seat: %s", ErrRange, a.pairs[p].name, why)}
}

// seat solves the pose for the geometry g in local coordinates.
func (a *Assembly) seat(g *geom, appr *[6]float64, tol float64, maxIt int) (Pose, error) {
	for i := range g.r {
		if !(g.r[i] > 0) {
			return Pose{}, a.errUnseated(i, "its radius is not positive")
		}
	}
	L := a.size
	if !(L > 0) {
		L = 1
	}
	R := [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}
	var t r3.Vec
	var ls [6]line
	it := 0
	var resid float64
	// The steps use the twists of the nominal contacts while they
	// contract the gaps quickly (a chord method: the Jacobian differs
	// from the nominal by the contact normals' rotation, about the
	// deviations over the size, so each step gains that factor); when a
	// step gains less than a factor 100 the twists are rebuilt at the
	// current pose (Newton's method proper, quadratic).
	ts := a.freed
	prev := math.Inf(1)
	for ; ; it++ {
		resid = 0
		var gaps [6]float64
		for i := range ls {
			w := r3.Add(mulMat(&R, g.c[i]), t)
			gi, n, ok := g.surfs[i].gap(w, g.r[i])
			if !ok {
				return Pose{}, a.errUnseated(i, "its centre lies on a cylinder's axis")
			}
			gaps[i] = gi + appr[i]
			resid = math.Max(resid, math.Abs(gaps[i]))
			p := r3.Sub(w, r3.Scale(g.r[i], n))
			if d := linalg.Norm3(r3.Sub(p, a.lines[i].p)); d > leaveFraction*g.r[i] {
				return Pose{}, a.errUnseated(i, fmt.Sprintf("contact %s would move %.3g m across its seat, more than half the ball's radius", a.conts[i].label, d))
			}
			ls[i] = line{p: p, n: n}
		}
		if resid <= tol*L {
			break
		}
		if it >= maxIt {
			return Pose{}, a.errUnseated(0, fmt.Sprintf("the seated pose did not converge in %d iterations (largest gap %.3g m)", maxIt, resid))
		}
		if resid > prev/100 {
			if !freedOf(ls[:], &ts) {
				return Pose{}, a.errUnseated(0, "the contacts are singular at this pose")
			}
		}
		prev = resid
		var x screw.Twist
		for i := range ts {
			x = x.Add(ts[i].Scale(-gaps[i]))
		}
		// y' = Rot(ω) y + V for every world point y (V is the velocity of
		// the point at the local origin): R ← Rot(ω)R, t ← Rot(ω)t + V.
		rot := rodrigues(x.W)
		R = mulMats(&rot, &R)
		t = r3.Add(mulMat(&rot, t), x.V)
	}
	// Back to the global frame: a body point q is at o + R(q − o) + t.
	o := a.origin
	pose := Pose{Rotation: rotationVector(&R), Translation: r3.Add(r3.Sub(o, mulMat(&R, o)), t), Residual: resid, Iterations: it}
	return pose, nil
}

// rodrigues returns the rotation matrix of the rotation vector w
// (Rodrigues' formula, R = I + sin θ K + (1 − cos θ) K², K the cross
// matrix of the unit axis).
func rodrigues(w r3.Vec) [3][3]float64 {
	th := linalg.Norm3(w)
	if th == 0 {
		return [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}
	}
	k := r3.Scale(1/th, w)
	s, c := math.Sincos(th)
	kx := [3][3]float64{{0, -k.Z, k.Y}, {k.Z, 0, -k.X}, {-k.Y, k.X, 0}}
	var r [3][3]float64
	for i := range 3 {
		for j := range 3 {
			var k2 float64
			for m := range 3 {
				k2 += kx[i][m] * kx[m][j]
			}
			r[i][j] = s*kx[i][j] + (1-c)*k2
		}
		r[i][i]++
	}
	return r
}

// rotationVector returns the rotation vector of the rotation matrix r,
// accurate for angles well below π: θ = atan2(|v|, (tr r − 1)/2) with v
// the axial vector of the antisymmetric part.
func rotationVector(r *[3][3]float64) r3.Vec {
	v := r3.Vec{X: (r[2][1] - r[1][2]) / 2, Y: (r[0][2] - r[2][0]) / 2, Z: (r[1][0] - r[0][1]) / 2}
	s := linalg.Norm3(v)
	if s == 0 {
		return r3.Vec{}
	}
	th := math.Atan2(s, (r[0][0]+r[1][1]+r[2][2]-1)/2)
	return r3.Scale(th/s, v)
}

func mulMat(r *[3][3]float64, v r3.Vec) r3.Vec {
	return r3.Vec{
		X: r[0][0]*v.X + r[0][1]*v.Y + r[0][2]*v.Z,
		Y: r[1][0]*v.X + r[1][1]*v.Y + r[1][2]*v.Z,
		Z: r[2][0]*v.X + r[2][1]*v.Y + r[2][2]*v.Z,
	}
}

func mulMats(a, b *[3][3]float64) [3][3]float64 {
	var c [3][3]float64
	for i := range 3 {
		for j := range 3 {
			c[i][j] = a[i][0]*b[0][j] + a[i][1]*b[1][j] + a[i][2]*b[2][j]
		}
	}
	return c
}
