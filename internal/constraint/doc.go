// Package constraint is the numerical core of constraint analysis, shared
// by package screw (which exposes it as screw.Analyze) and package
// kinematic: one builder of the normalised constraint matrix, one
// factorisation, and the results read off it.
//
// # Units, frame and signs
//
// SI units in one right-handed frame, as in package screw: a [Wrench]
// (F, M) is a force in N and its moment about the origin in N·m; a
// [Twist] (W, V) an angular velocity in rad/s and the velocity in m/s of
// the body point at the origin. Their power is W·M + V·F. Both have the
// layout of screw's types, so that either converts to the other.
//
// # The normalised constraint matrix
//
// Only the lines of the wrenches matter (for couples, F = 0, the directions
// of the moments). Each wrench is scaled by a power of two to a largest
// component in [1, 2); lengths are expressed in units of a power of two at
// least the largest distance of a line from the origin; every moment is
// taken about the reference point c (the point nearest to all lines in
// least squares, refined once from the moments about the first estimate)
// and divided by the characteristic length L (the RMS distance of the lines
// from c); each column (F, (M − c×F)/L) is then scaled to unit norm. The
// scalings by powers of two are exact. [Analyze] decomposes this 6×n
// matrix (one-sided Jacobi, after a pivoted QR factorisation when n > 6);
// [Freed] inverts the same matrix for six wrenches by Gauss–Jordan
// elimination.
//
// # Tolerance policy
//
// Every decision compares dimensionless numbers: singular values with the
// largest, pivots with their column, weights with the largest of their
// combination. A singular value counts as zero at or below
// max(RankTol, 32ε·far/L) times the largest, where far is the largest
// distance from the origin of a line or of c. The second term is the
// rounding that moments given about the origin carry (a moment of a line
// at distance D is known to about ε·D·|F|, the precision of its
// coordinates): see momentRounding for its derivation. Lines that meet at
// c to within 32ε·far are analysed as concurrent, with L = 0. Between
// that and L/far = 7.1e-12 (farLimit: where the rounding bound reaches
// NearSingularRatio) the coordinates cannot tell a sound set from a
// near-singular one, and Analyze returns an error wrapping errs.ErrRange.
// Above it, a set's rank, singular values, free twists, redundancies and
// freed twists do not depend on units or on where it sits, to within that
// rounding (a 100 mm coupling 10 km from the origin: 1.6e-9 of the
// largest singular value; the tests allow twice that and observe 6e-12).
//
// # Errors
//
// Invalid input returns an [*Error] naming the wrench (Index, or −1 for
// the set) and the part ("F", "M" or "") and wrapping a sentinel of
// internal/errs: errs.ErrDegenerate for an empty set or a zero wrench,
// errs.ErrNonFinite for NaN or infinite components, errs.ErrRange for magnitudes
// that float64 cannot analyse. Callers translate it into their own error
// type and field names. Nothing panics on user numbers, and no result is
// NaN or infinite without an error.
//
// # Allocation and aliasing
//
// [Analyze] allocates nothing for up to twelve wrenches of full rank (six
// at most) and allocates the redundant combinations otherwise; [Freed]
// allocates nothing. Input is never modified, and the Result holds no
// reference to it.
package constraint
