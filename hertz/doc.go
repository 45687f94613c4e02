// Package hertz solves the elastic point contact of two curved bodies
// (Hertz 1882): the contact ellipse, the peak and mean pressure, the mutual
// approach, the normal and tangential stiffness, and the largest stresses
// under the surface. Every ball of a kinematic coupling touches its seat in
// such a contact.
//
// # Units
//
// SI throughout: metres, newtons, pascals, radians, 1/K. Nothing is
// converted inside the package.
//
// # Bodies, signs and frames
//
// Each Body is described near the contact point by its two principal radii
// of curvature, R1 and R2, and the angle of the principal plane that holds
// R1. A radius is positive where the body is convex (centre of curvature
// inside the body), negative where it is concave, and ±Inf where the
// surface is straight. Angles are measured about the common contact normal
// from the x axis of one frame in the tangent plane shared by both bodies;
// only the difference of the two bodies' angles matters for the shape of
// the contact, and MajorAngle, the direction of the major axis of the
// contact ellipse, is reported in the same frame, in [0, π).
//
// The constructors cover the surfaces of couplings: Sphere (a ball), Flat,
// Cylinder (convex, with its axis angle), Socket (concave spherical seat),
// Groove (concave cylindrical groove, one flank of a gothic arch) and Toroid
// (any signed pair, a saddle when the signs differ). They take magnitudes
// and set the signs; they do not validate, Solve and NewPair do.
//
// Johnson's half relative curvatures A ≤ B (Johnson, Contact Mechanics,
// 1985, §4.1) are the principal values of half the sum of the two bodies'
// curvature tensors; the gap between the undeformed surfaces is Ax² + By²
// with x along the major axis. The major axis of the contact lies along
// the smaller relative curvature A.
//
// # Results
//
// Solve returns a Contact: semi-axes a ≥ b, peak pressure p0 = 3F/(2πab),
// mean pressure F/(πab), mutual approach δ, normal stiffness
// dF/dδ = 3F/(2δ), the effective moduli E* and G*, and for each body the
// largest Tresca shear stress (σ1 − σ3)/2 and von Mises stress on the load
// axis, with their depths, computed with that body's Poisson's ratio. The
// maximum of the von Mises stress may lie at the surface (for example for
// elongated contacts with small ν), in which case its depth is 0.
//
// Contact.Valid reports whether the semi-major axis is at most 0.1 of the
// smallest |radius| of the two bodies (common practice for the half-space
// assumption of Hertz theory); the result is returned either way.
//
// LoadForPressure and LoadForApproach invert Solve for the load. The
// Contact methods TangentialStiffness and SlidingLimit give Mindlin's
// tangential stiffness and the sliding limit μN; Contact.Slip follows the
// tangential load–displacement path of a contact under constant normal load
// through any sequence of loads (Mindlin's partial slip, Mindlin &
// Deresiewicz's unloading, the memory of the path by Masing's rules), and
// Contact.SlipEnergy gives the energy lost per cycle.
//
// # Many loads on the same bodies
//
// Everything but the load is solved once by NewPair, which validates the
// bodies and returns a Pair: the relative curvatures, the effective moduli
// and the shape of the contact ellipse. Pair.Contact then gives the contact
// at any load for a cube root and a few divisions, without the subsurface
// stresses (Stress is left zero), and allocates nothing; Pair.Solve adds the
// stresses; Pair.LoadForPressure and Pair.LoadForApproach invert them. Loads,
// stiffness and tolerance studies that evaluate each contact many times
// make the Pair once:
//
//	p, err := hertz.NewPair(ball, flank) // validates once
//	...
//	c, err := p.Contact(load)            // every load
//
// The package-level Solve, LoadForPressure and LoadForApproach are NewPair
// followed by the Pair method, and Pair.Contact returns exactly the fields
// Solve returns but Stress.
//
// # Zero values
//
// A zero load gives a Contact of zero size: a = b = 0, zero pressures,
// approach, stiffness and stresses, with MajorAngle, A, B, EStar and GStar
// set. The zero Pair is not a pair of bodies: its methods return an error
// wrapping ErrDegenerate. A Material with E = +Inf is rigid (it adds nothing to 1/E* and 1/G*);
// the stresses reported for a rigid body are those of an elastic half-space
// with its ν under the same pressure. The zero Material is not valid (E = 0).
//
// # Accuracy
//
// The eccentricity is found from Hertz's condition written with the
// arithmetic–geometric mean of 1 and b/a, which has no cancellation for a
// near-circle nor for a long ellipse, and solved by Newton's method in
// ln(a/b). Against gonum's Carlson integrals the tests require the
// condition to hold to 1e-12 relative in B/A − 1 for 1.001 ≤ B/A ≤ 1e14
// (the residuals seen are about 1e-15) and K(e), E(e) to 1e-13; near the
// circle ln(a/b) follows its limit (2/3)(B/A − 1). So a, b, p0 and δ carry
// a relative error of order 1e-13 or less beyond that of the inputs.
// B/A itself is formed from the radii: when A is a small difference of
// large curvatures (a ball in a groove of almost its own radius) its
// relative error is about 1e-16·B/A, which no solver can remove. Solve
// accepts B/A up to about 1.4e14 (see ErrLineContact).
//
// The subsurface maxima of an ellipse come from exact expressions of the
// axis stresses in Carlson's integral R_D, maximized in depth by a
// bracketed Halley iteration on exact derivatives; those of a circle
// (k' = b/a = 1) from Johnson's closed form of the axis stresses (1985,
// eq. 3.45) by the same iteration, without elliptic integrals. The tests
// compare them with the closed forms for a circle (1e-12) and a line
// contact, with a direct quadrature of Boussinesq's solution (1e-9, the
// quadrature's own accuracy), and with dense sampling in depth over
// −0.95 ≤ ν ≤ 0.5 and 1 ≤ B/A ≤ 1e10; the maxima are correct to about
// 1e-12 relative and their depths to about 1e-9 of b (the circle's to
// rounding).
//
// These bounds hold over the whole float64 range because no result is
// returned that has passed through a subnormal number: a load below
// 2.2e-308 N, or a contact, stress or inverse load that would overflow or
// underflow the normal range, gives ErrRange instead.
//
// # Errors
//
// Invalid input gives an *InputError naming the field ("b1.R2",
// "b2.Material.Nu", "load", "p0", "b1, b2", ...; the forms are listed on
// InputError) and wrapping one of the module's shared sentinels:
//
//   - ErrNonFinite: a NaN, or an infinity where a finite number is needed
//     (radii and Young's modulus accept +Inf, radii also −Inf);
//   - ErrRange: a number outside its domain (including a subnormal load),
//     or a result that would overflow or underflow the normal float64
//     range;
//   - ErrDegenerate: no Hertz point contact, refined as ErrLineContact
//     (the bodies touch along a line) or ErrGeometry (conforming or
//     separating surfaces, both bodies rigid), both of which errors.Is
//     also reports as ErrDegenerate; and a Pair method called on the zero
//     Pair (field "p").
//
// ErrNonFinite, ErrRange and ErrDegenerate are the module's shared values
// (internal/errs), re-exported under these names. errors.Is and errors.As
// work. No function panics on its arguments or returns NaN or Inf
// without an error.
//
// # Aliasing
//
// Input arguments are never modified. Materials returns a fresh slice. A
// Pair holds no reference to the bodies it was made from.
//
// # Materials
//
// Materials returns the reference materials: bearing steels (Steel52100,
// Steel440C), a hardened tool steel (SteelD2), ceramics and crystals for
// balls and seats (SiliconNitride, TungstenCarbide, Sapphire, FusedSilica)
// and metals for the flats and bodies of light mounts (Aluminium6061T6,
// Ti6Al4V, Invar36). Each Source names, value by value, the standard or
// data sheet a figure was checked against, or says "from memory" and gives
// the range the documents read do give; a value marked so is not checked
// and should be replaced by certified data before it is quoted.
//
// Allowable, the static peak pressure p0 a contact on the material may
// carry, comes from one of two criteria, named in each Source: ISO 76:2006
// clause 3 (4200 MPa at the centre of the most heavily loaded contact of a
// ball bearing other than self-aligning, where the permanent set of ball and
// raceway together is about 0.0001 of the ball diameter) for the bearing
// steels 52100 and 440C; or, derived here, first yield under a circular
// contact, p0 = Y/max|σz − σr| on the load axis from Johnson (1985)
// eq. 3.45 with the material's ν and a cited yield strength Y (1.589 Y to
// 1.664 Y for ν from 0.28 to 0.342), rounded down to three digits, for 6061-T6
// (397 MPa), Ti-6Al-4V (1310 MPa) and D2 at 60 HRC (3410 MPa). First
// yield is the stricter criterion. The brittle materials and Invar 36 have
// no allowable on file (0), and the Source says why; a contact with such a
// body is not judged against the other body's allowable, which says
// nothing of the brittle body (package kinematic reports no pressure ratio
// for it). Allowable is data for the caller: Solve
// checks that it is finite and not negative, and does not otherwise use it.
//
// # References
//
// Hertz (1882), J. reine angew. Math. 92, 156–171 (volume and pages as
// given in several published reference lists); K. L. Johnson, Contact
// Mechanics, Cambridge University Press, 1985 (chapters 3, 4, 6 and 7; the
// section and equation numbers quoted in this package are from memory and
// were not checked against the book); B. C. Carlson, "Numerical computation
// of real or complex elliptic integrals" (title checked against its arXiv
// copy, math/9409227), Numer. Algorithms 10 (1995), 13–26 (volume and pages
// from memory); from memory, not checked: R. D. Mindlin (1949), J. Appl.
// Mech. 16, 259–268; Mindlin & Deresiewicz (1953), J. Appl. Mech. 20,
// 327–344; G. Masing (1926), on the hysteresis of brass (the rule that a
// reversal starts a branch at twice the scale of the first loading),
// Proc. 2nd Int. Congress of Applied Mechanics, Zürich, 332–335; DLMF
// chapter 19. ISO 76:2006, Rolling bearings — Static load
// ratings, clause 3 (checked). The material data sheets are named in each
// Material's Source.
//
// # Scope
//
// Hertz theory assumes smooth, frictionless, non-conforming surfaces whose
// contact is small against the radii, linear elasticity, and ignores the
// tangential tractions that arise between dissimilar materials (Dundurs'
// β); see Johnson (1985), §4.1.
package hertz
