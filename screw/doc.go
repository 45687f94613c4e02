// Package screw describes rigid-body motions and loads as screws and analyses
// any set of constraint lines: how many freedoms they remove, which motions
// they leave free, and which of them are redundant.
//
// # Units and frame
//
// All quantities are SI: lengths in metres, forces in newtons, moments in
// newton-metres, angular velocities in radians per unit time. One
// right-handed global frame is used throughout; nothing is converted.
//
// # Twists and wrenches
//
// A [Twist] (W, V) is an instantaneous motion of a rigid body: W is its
// angular velocity and V the velocity of the body point that is momentarily
// at the origin. A [Wrench] (F, M) is a load: the force F and its moment M
// about the origin. Both are plain values: they copy freely, compare with ==,
// and their zero values mean "no motion" and "no load".
//
// A unit force along the line through p with direction n is the wrench
// (n̂, p × n̂), built by [Line]. The reciprocal product of a twist and a
// wrench, [Power], is the power W·M + V·F; it does not depend on the point
// about which both are expressed. A twist is free against a constraint
// wrench when their power is zero.
//
// The screw axis of a twist ([Twist.Axis]) has pitch h = W·V / |W|² (metres
// per radian) and passes through the point W × V / |W|², the point of the
// axis nearest the origin. A pure translation (W = 0) has infinite pitch.
//
// # Constraint analysis
//
// [Analyze] takes the wrenches of a set of constraints, for example unit
// forces along contact normals, and returns an [Analysis]: the rank of the
// set, its singular values, a basis of the free twists and a basis of the
// redundant combinations. Only the lines matter, not the magnitudes: each
// wrench is normalised before the analysis.
//
// # Tolerance policy
//
// Verdicts do not depend on units or on where the design sits in the frame.
// Before any threshold, Analyze expresses every moment about a reference
// point taken from the lines themselves (the point nearest to all of them in
// least squares) and divides it by a characteristic length (the RMS distance
// of the lines from that point), then scales every wrench to unit norm. The
// singular values that result are dimensionless: a design drawn in
// millimetres and the same design in metres, or moved anywhere in the frame,
// give the same rank and the same singular values to rounding: the
// rounding of the data, which far from the origin is that of the
// coordinates (see below).
//
// A singular value at or below [RankTol] times the largest counts as zero
// (near the origin; far from it, the threshold rises to the rounding of
// the moments, see below). A set
// whose smallest retained singular value is below [NearSingularRatio] times
// the largest is exactly constrained in arithmetic but near-singular in
// practice, and is flagged as such.
//
// # Far from the origin
//
// A wrench given about the origin for a line at distance D from it carries
// rounding of about ε·D in its moment (ε ≈ 2.2e-16), the precision its
// coordinates have; taken about the reference point, that rounding is
// relative to the characteristic length L, not to D. Analyze accounts for
// it: the rank threshold is max(RankTol, 32ε·far/L), far the largest
// distance of a line or of the reference point from the origin (the bound
// is derived in the source), and Length is the real L. The verdicts then
// hold down to a size-to-distance ratio L/far of about 7e-12, where that
// threshold reaches NearSingularRatio: a 100 mm coupling (L ≈ 45 mm) up to
// about 6·10⁹ m from the origin, a 0.1 mm one up to about 6·10⁶ m.
// Singular values agree with those of the same set at the origin to within
// about 32ε·far/L of the largest (1.6e-9 for a 100 mm coupling 10 km
// away). Lines that meet in one point to within 32ε·far are concurrent,
// with Length 0. Sets between the two limits, which do not meet in one
// point but whose coordinates cannot tell whether they are sound or
// near-singular, are reported with an error wrapping [ErrRange]; to
// analyse such a set, give its wrenches about a point near it.
//
// # Errors
//
// Functions that take user numbers validate them and return an
// [*InputError] that names the offending input as the caller wrote it
// ("ws[2].F", "n") and wraps one of the sentinel errors [ErrNonFinite],
// [ErrRange] or [ErrDegenerate] (an empty set, a zero wrench, a zero
// direction), so errors.Is and errors.As work. The sentinels are the
// values of the module's shared internal/errs. Nothing panics on user
// data, and no result is NaN without an error; directions are found by
// scaling first, so that subnormal and huge components work. Methods on values (Power, At,
// Axis, ...) do plain arithmetic: finite input gives finite output unless
// the result itself exceeds the float64 range.
//
// Input arguments are never modified.
package screw
