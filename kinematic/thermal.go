package kinematic

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Thermal is a uniform temperature change of a coupling. The balls and
// the seats expand with their own materials' Alpha (hertz.Material); the
// moving body and the base, whose materials the coupling does not hold,
// with the coefficients given here.
type Thermal struct {
	DeltaT float64 // K

	// Moving is the expansion coefficient of the moving body, 1/K: the
	// ball centres and the point of interest move apart with it. Base is
	// that of the base, 1/K: the seats' positions move apart with it. A
	// machined seat's own material expands about the seat's root (a vee's
	// flat or gothic-arch flanks keep their tangent planes through the
	// root, so to first order only the ball's growth and the bodies'
	// expansion move the part); a rod is a part of its own whose axis the
	// base holds, and it grows about that axis, pushing the ball out by
	// α_rod·RodRadius·ΔT along the contact normal.
	Moving, Base float64

	// BaseRef is the point where the base is held in the frame, m (zero:
	// the origin): the base expands about it. It changes only the
	// world-frame figures ([Drift.World]); the drift relative to the base
	// and the thermal centre do not depend on it.
	BaseRef r3.Vec
}

// Drift is the motion of a point of interest of the moving body under a
// uniform temperature change: relative to the base, which is what a
// coupling determines, and in the frame with the base held at
// [Thermal.BaseRef].
type Drift struct {
	Point r3.Vec

	// Relative is the point's displacement relative to the base, m: its
	// motion less that of the base's material point that coincided with
	// it, from the exact seat of the expanded geometry; Tilt is the
	// body's rotation vector, rad (the base does not turn).
	// RelativeLinear and LinearTilt are the same from the first-order
	// model. None depends on BaseRef.
	Relative, Tilt             r3.Vec
	RelativeLinear, LinearTilt r3.Vec

	// World and WorldLinear are the point's displacement in the frame,
	// m, with the base held at BaseRef (it expands about that point),
	// exact and first order: Relative (RelativeLinear) plus
	// α_base ΔT (p − BaseRef).
	World, WorldLinear r3.Vec

	// Centre is the thermal centre, a property of the coupling: the
	// point of the moving body, in the plane through the ball centres'
	// centroid normal to the seats' mean Up, that does not move in that
	// plane relative to the base (first order). For three vees it is
	// where the groove lines meet; for a socket, a vee aimed at it and a
	// flat, the socket's ball centre. It does not depend on BaseRef.
	// HasCentre is false when no such point exists: the lateral relative
	// motion is a pure translation or none, as when the body and the
	// base expand alike and the balls' growth only lifts the body (three
	// vees or a socket–vee–flat with their seats' Up vertical and the
	// ball centres at one height). The test is dimensionless: the lateral
	// motion's rotation and strain (its change per metre across the
	// plane) must exceed 1e-8 of the largest expansion strain of the
	// inputs, |ΔT| times the largest |α| of the body, the base, the balls
	// and the seats; below that it is rounding, or a field so weak that
	// its "centre" lies of the order of 1e8 coupling sizes away, and
	// Centre is zero. Distance is the lateral distance from the point of
	// interest to Centre, m (0 without a centre).
	Centre    r3.Vec
	HasCentre bool
	Distance  float64
}

// Drift returns the motion of the point p of the moving body under the
// uniform temperature change th, relative to the base and in the frame,
// by the exact seat of the expanded geometry and by the first-order
// model, with the thermal centre. The first-order model changes each gap
// by ∂gᵢ/∂ΔT =
// −α_ball r + α_moving n·c − α_base n·(root − BaseRef) − α_seat n·(p − root)
// (ball centre c, contact point p, normal n), moves the body by
// x = −ΔT Σ (∂gᵢ/∂ΔT) Tᵢ, and adds the point's own expansion α_moving ΔT p
// (World); relative to the base it subtracts the base's expansion at p,
// α_base ΔT (p − BaseRef), which removes BaseRef.
//
// Drift returns an [*InputError] naming "th.DeltaT", "th.Moving",
// "th.Base", "th.BaseRef" or "p" for numbers that are not finite, and one
// naming "th" wrapping [ErrRange] when the expanded geometry cannot be
// seated (the thermal solve fails: a temperature change or expansion
// coefficient so large that the balls leave their seats).
func (a *Assembly) Drift(th Thermal, p r3.Vec) (Drift, error) {
	if err := a.check(); err != nil {
		return Drift{}, err
	}
	for _, f := range []struct {
		name string
		v    float64
	}{{"th.DeltaT", th.DeltaT}, {"th.Moving", th.Moving}, {"th.Base", th.Base}} {
		if !linalg.Finite(f.v) {
			return Drift{}, &InputError{Field: f.name, Err: fmt.Errorf("%w: %g", ErrNonFinite, f.v)}
		}
	}
	if !linalg.Finite3(th.BaseRef) {
		return Drift{}, &InputError{Field: "th.BaseRef", Err: fmt.Errorf("%w: %v", ErrNonFinite, th.BaseRef)}
	}
	if !linalg.Finite3(p) {
		return Drift{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	dt := th.DeltaT
	d := Drift{Point: p}
	baseAt := r3.Scale(th.Base*dt, r3.Sub(p, th.BaseRef)) // the base's own motion at p

	// First order.
	var x screw.Twist // about origin
	for i, c := range a.conts {
		pr := &a.pairs[c.pair]
		l := &a.lines[i]
		anchor := pr.surfs[c.surf].anchor(pr.root)
		e := thermalGap(&th, pr.ball.Material.Alpha, pr.ball.Radius, pr.alpha, r3.Add(l.centre, a.origin), r3.Add(l.p, a.origin), l.n, anchor)
		x = x.Add(a.freed[i].Scale(-e * dt))
	}
	xg := global(x, a.origin)
	d.RelativeLinear = relativeMotion(xg, th.Moving*dt, th.Base*dt, th.BaseRef, p)
	d.WorldLinear = r3.Add(d.RelativeLinear, baseAt)
	d.LinearTilt = x.W

	// Exact: the expanded geometry, seated.
	g := a.nominal()
	for i, c := range a.conts {
		pr := &a.pairs[c.pair]
		g.c[i] = r3.Sub(r3.Scale(1+th.Moving*dt, r3.Add(g.c[i], a.origin)), a.origin)
		g.r[i] *= 1 + pr.ball.Material.Alpha*dt
		s := &g.surfs[i]
		root := r3.Add(s.anchor(r3.Sub(pr.root, a.origin)), a.origin) // the nominal surface's, in the frame
		newRoot := r3.Add(th.BaseRef, r3.Scale(1+th.Base*dt, r3.Sub(root, th.BaseRef)))
		q := r3.Add(s.q, a.origin)
		q = r3.Add(newRoot, r3.Scale(1+pr.alpha*dt, r3.Sub(q, root)))
		s.q = r3.Sub(q, a.origin)
		s.R *= 1 + pr.alpha*dt
	}
	var zero [6]float64
	pose, err := a.seat(&g, &zero, 1e-13, 50)
	if err != nil {
		why := err // the reason without the pair's field path, which is not the caller's input here
		var ie *InputError
		other := ""
		if errors.As(err, &ie) {
			why, other = ie.Err, ie.Field
		}
		return Drift{}, &InputError{Field: "th", Other: other, Err: fmt.Errorf(
			"%w: the thermal solve failed: the geometry expanded by ΔT %g K (moving %g, base %g 1/K and the balls' and seats' own) cannot be seated (%v)",
			ErrRange, dt, th.Moving, th.Base, why)}
	}
	d.World = r3.Sub(pose.Apply(r3.Scale(1+th.Moving*dt, p)), p)
	d.Relative = r3.Sub(d.World, baseAt)
	d.Tilt = pose.Rotation

	var cen, upSum r3.Vec
	strain := max(math.Abs(th.Moving), math.Abs(th.Base))
	for _, pr := range a.pairs {
		cen = r3.Add(cen, pr.ball.Centre)
		strain = max(strain, math.Abs(pr.ball.Material.Alpha), math.Abs(pr.alpha))
	}
	strain *= math.Abs(dt)
	cen = r3.Scale(1/float64(len(a.pairs)), cen)
	for i := range a.lines {
		upSum = r3.Add(upSum, a.lines[i].n)
	}
	d.Centre, d.HasCentre, d.Distance = thermalCentre(xg, th.Moving*dt, th.Base*dt, th.BaseRef, cen, upSum, p, strain)
	return d, nil
}

// relativeMotion returns the first-order displacement of the body point
// q relative to the base, m: the body's small motion x (a twist with V at
// the origin, in the frame with the base held at baseRef) plus the body's
// own expansion am·q, less the base's expansion about baseRef,
// ab·(q − baseRef). Moving baseRef by δ moves the seats, and so the body,
// by −ab·δ, which the last term cancels: the result does not depend on
// baseRef. It is the one kernel of the thermal figures: [Assembly.Drift]
// and the scorecard call it, through thermalCentre too.
func relativeMotion(x screw.Twist, am, ab float64, baseRef, q r3.Vec) r3.Vec {
	return r3.Sub(r3.Add(x.At(q), r3.Scale(am, q)), r3.Scale(ab, r3.Sub(q, baseRef)))
}

// thermalGap returns ∂g/∂ΔT, m/K: how fast the gap of a contact opens
// per kelvin of uniform temperature change,
// −α_ball r + α_moving n·c − α_base n·(root − BaseRef) − α_seat n·(p − root),
// for the ball of expansion coefficient ballAlpha, radius r and centre c,
// the contact point p and normal n, and the seat of expansion coefficient
// seatAlpha and reference point root (all in the global frame): the ball
// grows into the seat, the moving body carries the ball centre with it,
// the base carries the seat's anchor about BaseRef, and the seat's own
// material carries the contact point about that anchor (the seat's root
// for a machined seat, the rod's axis for a rod: seatSurface.anchor). It is the one
// definition of the thermal gap: [Assembly.Drift] and the scorecard call
// it.
func thermalGap(th *Thermal, ballAlpha, r, seatAlpha float64, c, p, n, root r3.Vec) float64 {
	return -ballAlpha*r + th.Moving*r3.Dot(n, c) -
		th.Base*r3.Dot(n, r3.Sub(root, th.BaseRef)) - seatAlpha*r3.Dot(n, r3.Sub(p, root))
}

// thermalCentreFloor is the smallest rotation and strain of the lateral
// relative motion, as a fraction of the largest expansion strain of the
// inputs, that defines a thermal centre (see thermalCentre).
//
// The rotation ω (about up) and strain s (α_moving − α_base)ΔT of the
// lateral field are sums of products of the inputs' strains (αΔT) with
// the freed twists and the points' positions. When they vanish (by
// symmetry, or because the body and the base expand alike and the balls'
// growth only lifts the body) what is computed is rounding: about ε
// (2.2e-16) times the strains involved, times the conditioning of the
// freed twists (2 to 5 for sensible layouts, DesignCondition 10 flags
// worse, below screw.NearSingularRatio 1e3 for any the library
// analyses), times the ratio of the points' distance from the frame's
// origin to the coupling's size. That is some 1e-15 of the strain for a
// sensible layout near the origin and 2e-10 at worst (a condition of 1e3,
// a thousand sizes away); 1e-18 to 1e-16 is seen on the symmetric
// three-vee and socket–vee–flat of thermal_test.go. A real field is a
// fraction of the strain set by the geometry: the strain difference
// itself, or the balls' growth over the ball circle times the sine of a
// seat's cant (a 1 mm ball on a 100 mm circle in vees canted by half a
// degree: r/R·sin 0.5° ≈ 1e-4). 1e-8 lies fifty times above the worst
// rounding and four orders below that field; a field weaker than it
// moves points a coupling size L apart by less than 1e-8 of the body's
// own expansion over L, and its fixed point lies of the order of 1e8 L
// away, which is no design figure.
const thermalCentreFloor = 1e-8

// thermalCentre returns the thermal centre: the point q, in the plane
// through cen normal to up, at which the lateral part of the motion
// relative to the base, relativeMotion(x, am, ab, baseRef, q), vanishes;
// and the lateral distance from p to it. ok is false when that lateral
// motion does not vary across the plane (a pure translation, or none: no
// centre): when its rotation and strain are below thermalCentreFloor
// times strain, the largest expansion strain (|ΔT| max |α|) of the
// inputs.
func thermalCentre(x screw.Twist, am, ab float64, baseRef, cen, up, p r3.Vec, strain float64) (centre r3.Vec, ok bool, dist float64) {
	upv, ok := linalg.Unit3(up)
	if !ok {
		return r3.Vec{}, false, 0
	}
	e1 := linalg.AnyNormal(upv)
	e2 := r3.Cross(upv, e1)
	vel := func(q r3.Vec) r3.Vec { return relativeMotion(x, am, ab, baseRef, q) }
	v0 := vel(cen)
	a1 := r3.Sub(vel(r3.Add(cen, e1)), v0) // the linear part along e1 and e2
	a2 := r3.Sub(vel(r3.Add(cen, e2)), v0)
	// The lateral gradient is [[s, −ω], [ω, s]] for the strain s and the
	// rotation ω about up (the lateral part of W × e1 is ω e2), so scale
	// is |s| + |ω| and det = s² + ω².
	m11, m12, m21, m22 := r3.Dot(e1, a1), r3.Dot(e1, a2), r3.Dot(e2, a1), r3.Dot(e2, a2)
	det := m11*m22 - m12*m21
	scale := math.Max(math.Abs(m11)+math.Abs(m12), math.Abs(m21)+math.Abs(m22))
	// The lateral motion must change across the plane by more than
	// rounding (thermalCentreFloor) for a centre to be defined, and the
	// 2×2 solve must be well conditioned (it is: det ≥ scale²/2).
	if !(scale > thermalCentreFloor*strain) || !(math.Abs(det) > 1e-12*scale*scale) {
		return r3.Vec{}, false, 0
	}
	b1, b2 := -r3.Dot(e1, v0), -r3.Dot(e2, v0)
	s := (b1*m22 - m12*b2) / det
	t := (m11*b2 - m21*b1) / det
	centre = r3.Add(cen, r3.Add(r3.Scale(s, e1), r3.Scale(t, e2)))
	off := r3.Sub(p, centre)
	off = r3.Sub(off, r3.Scale(r3.Dot(off, upv), upv))
	return centre, true, linalg.Norm3(off)
}
