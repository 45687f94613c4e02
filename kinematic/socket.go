package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Trihedral is a socket of three plane faces, equally spaced about Up, that
// holds a ball at three points. Each face makes the angle HalfAngle with
// the socket axis (Up), so each contact normal leans HalfAngle from the
// horizontal; a cube-corner socket has HalfAngle = atan(1/√2) ≈ 35.26°.
// The first contact lies on the side of the ball that Azimuth points to
// (its part normal to Up), the others at 120° and 240° about Up.
type Trihedral struct {
	Up        r3.Vec
	Azimuth   r3.Vec
	HalfAngle float64 // rad, in (0, π/2)
	Material  hertz.Material
}

func (t Trihedral) count() int { return 3 }

func (t Trihedral) up() r3.Vec { return t.Up }

func (t Trihedral) appendContacts(dst []Contact, b Ball, name, field string) ([]Contact, error) {
	return socket(dst, b, name, field, t.Up, t.Azimuth, t.HalfAngle, hertz.Flat(t.Material), false)
}

func (t Trihedral) surfaces(b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec, float64) {
	s, d, apex := socketSurfaces(t.Up, t.HalfAngle, b, cs)
	return s, d, apex, t.Material.Alpha
}

// socket appends the three contacts of a trihedral or conical seat. With
// anyAzimuth a zero azimuth picks a direction normal to Up.
func socket(dst []Contact, b Ball, name, field string, upv, az r3.Vec, half float64, surface hertz.Body, anyAzimuth bool) ([]Contact, error) {
	up, err := unitOf(upv, field+".Up")
	if err != nil {
		return nil, err
	}
	var h0 r3.Vec
	if anyAzimuth && az == (r3.Vec{}) {
		h0 = linalg.AnyNormal(up)
	} else if h0, err = horizontal(az, up, field+".Azimuth"); err != nil {
		return nil, err
	}
	if err := checkHalfAngle(half, field+".HalfAngle"); err != nil {
		return nil, err
	}
	s, c := math.Sincos(half)
	for k := 0; k < 3; k++ {
		h := r3.Rotate(h0, 2*math.Pi*float64(k)/3, up)
		n := r3.Add(r3.Scale(s, up), r3.Scale(-c, h))
		dst = append(dst, ballContact(b, fmt.Sprintf("%s%d", name, k+1), n, r3.Cross(up, h), surface))
	}
	return dst, nil
}

// socketSurfaces returns the three faces of a trihedral socket, or the
// three planes tangent to a cone at its contacts.
func socketSurfaces(upv r3.Vec, half float64, b Ball, cs []Contact) ([]seatSurface, []dimension, r3.Vec) {
	up, _ := linalg.Unit3(upv)
	apex := rootBelow(b.Centre, up, b.Radius, math.Sin(half))
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

// socketSeat is a seat that holds its ball at three points about its Up,
// as a trihedral or a cone does: the coupling's socket in [Geometry].
type socketSeat interface {
	Seat
	isSocket()
}

func (Trihedral) isSocket() {}

func (t Trihedral) ideals(cs []Contact, out []float64) { socketIdeals(cs, out) }

// socketIdeals sets out[i] to the best centre index of contact i of a
// trihedral or conical socket: the index of the one motion its other two
// contacts leave the ball's centre, along their normals' cross product.
func socketIdeals(cs []Contact, out []float64) {
	for i := range out {
		d := r3.Cross(cs[(i+1)%3].Normal, cs[(i+2)%3].Normal)
		out[i] = math.Abs(r3.Dot(cs[i].Normal, d)) / linalg.Norm3(d)
	}
}
