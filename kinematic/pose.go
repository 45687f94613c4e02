package kinematic

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// PoseOptions holds options for [Assembly.Pose]; the zero value and a nil
// pointer mean defaults.
type PoseOptions struct {
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

// Pose returns the exact pose of the moving body with the deviations
// applied (in the order given; finite rotations do not commute, which
// changes the result at second order): the rotation and translation at
// which every ball touches each of its seat surfaces, found by Newton's
// method on the six tangency equations gᵢ(pose) = −approachᵢ, whose
// Jacobian is the matrix of the contact lines at the current pose, so the
// steps are x = −Σ (gᵢ + aᵢ) Tᵢ with the twists Tᵢ of power δᵢⱼ; the
// convergence is quadratic. A perfect coupling seats at the nominal pose.
//
// Pose returns an [*InputError] naming "devs[i]" for an unknown dimension
// or a value that is not finite, "opt.Approach" for a list of the wrong
// length or a bad value, "opt.Tolerance" outside (0, 1) and
// "opt.MaxIterations" negative, and one wrapping [ErrRange] when a ball
// cannot reach its seat (a ball radius that is not positive, a contact
// that moves more than half its ball's radius across its seat, or no
// convergence), with the ball named in the reason and the field naming
// the input that moved the part most: of the deviations and approaches,
// the one largest for its kind, a length over its pair's ball radius and
// an angle in radians ("devs[1].Value" or "opt.Approach[2]"; several
// separated by ", " when equally large). A moved seat can make another
// ball fail first, so that ball's own small deviations are not blamed.
// The field is "devs" (and "opt.Approach") when no one ball is to blame
// (no convergence); and one naming "a" for a nil or zero Assembly.
func (a *Assembly) Pose(devs []Deviation, opt *PoseOptions) (Pose, error) {
	if err := a.check(); err != nil {
		return Pose{}, err
	}
	g := a.nominal()
	for i, d := range devs {
		k, ok := a.index[d.Dimension]
		if !ok {
			_, err := a.lookup(d.Dimension, indexed("devs", i)+".Dimension")
			return Pose{}, err
		}
		if !linalg.Finite(d.Value) {
			return Pose{}, &InputError{Field: indexed("devs", i) + ".Value", Err: fmt.Errorf("%w: %g", ErrNonFinite, d.Value)}
		}
		a.apply(&g, k, d.Value)
	}
	var o PoseOptions
	if opt != nil {
		o = *opt
	}
	var appr [6]float64
	if o.Approach != nil {
		if len(o.Approach) != 6 {
			return Pose{}, &InputError{Field: "opt.Approach", Err: fmt.Errorf("%w: %d values for 6 contacts", ErrRange, len(o.Approach))}
		}
		for i, v := range o.Approach {
			if !linalg.Finite(v) || v < 0 {
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
	if !(o.Tolerance > 0 && o.Tolerance < 1) {
		return Pose{}, &InputError{Field: "opt.Tolerance", Err: fmt.Errorf("%w: must be in (0, 1), got %g", ErrRange, o.Tolerance)}
	}
	if o.MaxIterations < 0 {
		return Pose{}, &InputError{Field: "opt.MaxIterations", Err: fmt.Errorf("%w: must be ≥ 0, got %d", ErrRange, o.MaxIterations)}
	}
	pose, pair, err := a.seatBlame(&g, &appr, o.Tolerance, o.MaxIterations)
	if err != nil {
		return Pose{}, a.inPoseTerms(err, pair, devs, o.Approach)
	}
	if !allFinite3(pose.Rotation, pose.Translation) {
		return Pose{}, &InputError{Field: "devs", Err: fmt.Errorf("%w: the seated pose overflows", ErrRange)}
	}
	return pose, nil
}

// inPoseTerms returns err, an error of seatBlame for the geometry Pose
// built from devs and approach, with the field naming the inputs of Pose
// that moved the part most, pair being the pair whose ball could not
// reach its seat (−1 when no one ball is to blame). The reason still names
// that ball. Each deviation and approach is measured for its kind: a
// length over the radius of its pair's ball (half the radius across its
// seat is where a contact is lost), an angle in radians (a seat turned by
// θ moves its contacts about r·θ across a ball of radius r: the same
// measure). The largest is named, with any equal to it; the failing
// ball's own deviations are not preferred, since a seat moved far can
// push another ball off first. With pair −1, or no non-zero input, the
// field is "devs" and "opt.Approach" as given; without either, err is
// returned as it is (a nominal geometry that cannot seat).
func (a *Assembly) inPoseTerms(err error, pair int, devs []Deviation, approach []float64) error {
	var ie *InputError
	if !errors.As(err, &ie) {
		return err
	}
	var fs []string
	if pair >= 0 {
		var worst float64
		consider := func(field string, size float64) {
			switch {
			case size > worst:
				worst, fs = size, append(fs[:0], field)
			case size == worst && size > 0:
				fs = append(fs, field)
			}
		}
		for i, d := range devs {
			dim := &a.dims[a.index[d.Dimension]]
			size := math.Abs(d.Value)
			if !dim.angular() {
				size /= a.pairs[dim.pair].ball.Radius
			}
			consider(indexed("devs", i)+".Value", size)
		}
		for k, v := range approach {
			consider(indexed("opt.Approach", k), math.Abs(v)/a.pairs[a.conts[k].pair].ball.Radius)
		}
	}
	if len(fs) == 0 {
		if len(devs) > 0 {
			fs = append(fs, "devs")
		}
		if approach != nil {
			fs = append(fs, "opt.Approach")
		}
	}
	if len(fs) == 0 {
		return err
	}
	return &InputError{Field: strings.Join(fs, ", "), Err: ie.Err}
}

// errUnseated reports that the ball of contact i cannot reach its seat.
func (a *Assembly) errUnseated(i int, why string) error {
	p := a.conts[i].pair
	return &InputError{Field: pairField(p), Err: fmt.Errorf("%w: ball %s cannot reach its seat: %s", ErrRange, a.pairs[p].name, why)}
}

// seat solves the pose for the geometry g in local coordinates.
func (a *Assembly) seat(g *geom, appr *[6]float64, tol float64, maxIt int) (Pose, error) {
	pose, _, err := a.seatBlame(g, appr, tol, maxIt)
	return pose, err
}

// seatBlame is seat, returning as well, when it fails, the pair whose
// ball cannot reach its seat, or −1 when no one ball is to blame (no
// convergence, contacts singular at the pose).
func (a *Assembly) seatBlame(g *geom, appr *[6]float64, tol float64, maxIt int) (Pose, int, error) {
	for i := range g.r {
		if !(g.r[i] > 0) {
			return Pose{}, a.conts[i].pair, a.errUnseated(i, "its radius is not positive")
		}
	}
	L := a.size
	if !(L > 0) {
		L = 1
	}
	R := [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}
	var t r3.Vec
	var cp, cn [6]r3.Vec // the contact points and normals at the current pose
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
		for i := range cp {
			w := r3.Add(mulMat(&R, g.c[i]), t)
			gi, n, ok := g.surfs[i].gap(w, g.r[i])
			if !ok {
				return Pose{}, a.conts[i].pair, a.errUnseated(i, "its centre lies on a cylinder's axis")
			}
			gaps[i] = gi + appr[i]
			resid = max(resid, math.Abs(gaps[i])) // the builtin: math.Max is a call
			p := r3.Sub(w, r3.Scale(g.r[i], n))
			// Squared, so that no square root is taken in the loop.
			if dp := r3.Sub(p, a.lines[i].p); r3.Norm2(dp) > leaveFraction*leaveFraction*g.r[i]*g.r[i] {
				if d := linalg.Norm3(dp); d > leaveFraction*g.r[i] {
					return Pose{}, a.conts[i].pair, a.errUnseated(i, fmt.Sprintf("contact %s would move %.3g m across its seat, more than half the ball's radius", a.conts[i].label, d))
				}
			}
			cp[i], cn[i] = p, n
		}
		if resid <= tol*L {
			break
		}
		if it >= maxIt {
			return Pose{}, -1, a.errUnseated(0, fmt.Sprintf("the seated pose did not converge in %d iterations (largest gap %.3g m)", maxIt, resid))
		}
		if resid > prev/100 {
			var ls [6]line
			for i := range ls {
				ls[i].p, ls[i].n = cp[i], cn[i]
			}
			if !freedOf(ls[:], &ts) {
				return Pose{}, -1, a.errUnseated(0, "the contacts are singular at this pose")
			}
		}
		prev = resid
		var xw, xv r3.Vec
		for i := range ts {
			gi := gaps[i]
			xw.X -= gi * ts[i].W.X
			xw.Y -= gi * ts[i].W.Y
			xw.Z -= gi * ts[i].W.Z
			xv.X -= gi * ts[i].V.X
			xv.Y -= gi * ts[i].V.Y
			xv.Z -= gi * ts[i].V.Z
		}
		x := screw.Twist{W: xw, V: xv}
		// y' = Rot(ω) y + V for every world point y (V is the velocity of
		// the point at the local origin): R ← Rot(ω)R, t ← Rot(ω)t + V.
		rot := rodrigues(x.W)
		R = mulMats(&rot, &R)
		t = r3.Add(mulMat(&rot, t), x.V)
	}
	// Back to the global frame: a body point q is at o + R(q − o) + t.
	o := a.origin
	pose := Pose{Rotation: rotationVector(&R), Translation: r3.Add(r3.Sub(o, mulMat(&R, o)), t), Residual: resid, Iterations: it}
	return pose, -1, nil
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
	s, c := sincos(th)
	// K² = kkᵀ − I for a unit k: R = c·I + s·K + (1 − c)·kkᵀ.
	d := 1 - c
	kx, ky, kz := k.X, k.Y, k.Z
	return [3][3]float64{
		{c + d*kx*kx, d*kx*ky - s*kz, d*kx*kz + s*ky},
		{d*ky*kx + s*kz, c + d*ky*ky, d*ky*kz - s*kx},
		{d*kz*kx - s*ky, d*kz*ky + s*kx, c + d*kz*kz},
	}
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
