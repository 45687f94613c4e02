package hertz

import "math"

// Body is the surface of one body near the contact point, described by its
// two principal radii of curvature and its material.
//
// Sign convention: a radius is positive when the body is convex in that
// principal plane (its centre of curvature lies inside the body), negative
// when it is concave, and ±Inf when the surface is straight there
// (curvature 0). The principal plane that holds R1 makes the angle Angle
// with the x axis of a frame in the common tangent plane shared by both
// bodies, measured about the contact normal; R2 lies in the plane at
// Angle + π/2.
type Body struct {
	R1, R2   float64 // signed principal radii of curvature, m: + convex, − concave, ±Inf flat
	Angle    float64 // angle of the principal plane that holds R1 about the contact normal, rad
	Material Material
}

// Sphere returns a convex sphere (a ball) of radius r, in metres.
func Sphere(r float64, m Material) Body { return Body{R1: r, R2: r, Material: m} }

// Flat returns a plane surface.
func Flat(m Material) Body { return Body{R1: math.Inf(1), R2: math.Inf(1), Material: m} }

// Cylinder returns a convex cylinder of radius r, in metres, whose axis
// lies at the angle axis, in radians: R1 = +Inf along the axis, R2 = r
// across it.
func Cylinder(r, axis float64, m Material) Body {
	return Body{R1: math.Inf(1), R2: r, Angle: axis, Material: m}
}

// Socket returns a concave spherical seat of radius r, in metres:
// R1 = R2 = −r.
func Socket(r float64, m Material) Body { return Body{R1: -r, R2: -r, Material: m} }

// Groove returns a concave cylindrical groove of radius r, in metres, whose
// axis lies at the angle axis, in radians: R1 = +Inf along the groove,
// R2 = −r across it. One flank of a gothic-arch groove is such a surface.
func Groove(r, axis float64, m Material) Body {
	return Body{R1: math.Inf(1), R2: -r, Angle: axis, Material: m}
}

// Toroid returns a general doubly curved surface with the signed principal
// radii r1 and r2, in metres, as given (+ convex, − concave), r1 lying in
// the plane at the angle angle, in radians. Radii of opposite signs make a
// saddle, such as the groove of a ball-bearing race (r1 > 0 around the
// race, r2 < 0 across the groove).
func Toroid(r1, r2, angle float64, m Material) Body {
	return Body{R1: r1, R2: r2, Angle: angle, Material: m}
}

// curvature returns 1/r for a valid radius r: 0 for ±Inf (a straight
// surface). The field name is name + "." + field, built only on error so
// that NewPair does not allocate.
func curvature(r float64, name, field string) (float64, error) {
	k := 1 / r
	if k-k == 0 { // k finite: r is not NaN, not 0 and not below 1/MaxFloat64
		if k == 0 {
			return 0, nil // ±Inf radius; +0, whatever the sign of the infinity
		}
		return k, nil
	}
	switch {
	case math.IsNaN(r):
		return 0, nonFiniteErr(name+"."+field, "radius is NaN")
	case r == 0:
		return 0, rangeErr(name+"."+field, "radius must be nonzero (±Inf for a straight surface), got 0")
	}
	return 0, rangeErr(name+"."+field, "radius %g is too small for floating point", r)
}

// bodyTerms validates a body and returns the mean curvature and the
// components of its curvature difference along 2θ.
func bodyTerms(b *Body, name string) (mean, dc, ds float64, err error) {
	k1, err := curvature(b.R1, name, "R1")
	if err != nil {
		return 0, 0, 0, err
	}
	k2 := k1 // a sphere, a socket or a flat
	if b.R2 != b.R1 {
		if k2, err = curvature(b.R2, name, "R2"); err != nil {
			return 0, 0, 0, err
		}
	}
	if b.Angle-b.Angle != 0 { // NaN or ±Inf
		return 0, 0, 0, nonFiniteErr(name+".Angle", "angle must be finite, got %g", b.Angle)
	}
	if err := checkMaterial(&b.Material, name); err != nil {
		return 0, 0, 0, err
	}
	d := (k1 - k2) / 2
	if d == 0 {
		return k1, 0, 0, nil // sphere, socket or flat: no direction
	}
	var s, c float64
	if math.Abs(b.Angle) <= math.MaxFloat64/2 {
		s, c = math.Sincos(2 * b.Angle)
	} else {
		// 2θ would overflow: the double-angle formulas on θ itself.
		s1, c1 := math.Sincos(b.Angle)
		s, c = 2*s1*c1, (c1-s1)*(c1+s1)
	}
	return (k1 + k2) / 2, d * c, d * s, nil
}
