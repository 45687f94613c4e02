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
