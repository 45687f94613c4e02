package kinematic

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
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
		sn, cs := sincos(angle)
		s.q = r3.Add(o, rotateAbout(r3.Sub(s.q, o), a, sn, cs))
		s.d = rotateAbout(s.d, a, sn, cs)
	}
	s.q = r3.Add(s.q, t)
}

// rotateAbout returns v rotated about the unit axis a by the angle whose
// sine and cosine are sn and cs, by Rodrigues' formula
// v cos θ + (a × v) sin θ + a (a·v)(1 − cos θ).
func rotateAbout(v, a r3.Vec, sn, cs float64) r3.Vec {
	return r3.Add(r3.Add(r3.Scale(cs, v), r3.Scale(sn, r3.Cross(a, v))), r3.Scale(r3.Dot(a, v)*(1-cs), a))
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

// angular reports whether the dimension is an angle (rad): a seat motion
// that turns its surfaces (Turn, Tilt, HalfAngle, a flat's Tilt1 and
// Tilt2). Every other dimension is a length (m).
func (d *dimension) angular() bool {
	return d.kind == seatMotion && len(d.motions) > 0 && d.motions[0].rot
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

// anchor returns the point about which the surface expands with its seat's
// own material, root being the seat's reference point. A rod (a convex
// cylinder) is a part of its own, located by the base: it expands about its
// own axis (the point q, where its radius meets the contact), and the base
// carries that axis; every other surface is machined in one seat and
// expands with it about the seat's root.
func (s *seatSurface) anchor(root r3.Vec) r3.Vec {
	if s.kind == convexCylinder {
		return s.q
	}
	return root
}

// sincos is math.Sincos, by the Taylor series for |x| < 1e-3, where the
// first omitted terms (x⁹/9!, x⁸/8!) are below 1e-16 of the sums:
// the seating steps and the toleranced rotations are micro-radians.
func sincos(x float64) (sin, cos float64) {
	if math.Abs(x) >= 1e-3 {
		return math.Sincos(x)
	}
	x2 := x * x
	sin = x * (1 - x2/6*(1-x2/20*(1-x2/42)))
	cos = 1 - x2/2*(1-x2/12*(1-x2/30))
	return sin, cos
}
