// Package kinematic designs kinematic couplings: balls on a moving body
// seated in vees, flats, trihedral sockets and cones on a base, or any set
// of point contacts given by hand.
//
// A [Coupling] is a list of [Pair] values, each a [Ball] in a [Seat] ([Vee],
// [Flat], [Trihedral] or [Cone]); [Coupling.Contacts] turns it into
// [Contact] values, each with its point, normal, label and the two
// [hertz.Body] surfaces that touch there. [BisectorVees], [AimedVees] and
// [SocketVeeFlat] build the usual layouts for given ball centres, each
// seat with its own Up; [Coupling.WithGroove] turns one groove to a given
// azimuth.
//
// For any contact set, [Analyze] reports the freedoms left, each as a screw,
// and the redundant contacts by label; [Analysis.Stability] gives, for an
// exactly constrained set, each contact's freed motion and Maxwell index.
// [Coupling.Geometry] describes the grooves: their axes and azimuths, the
// instantaneous axis of each pair of vees, the coupling centre, for three
// balls the incentre and each groove's angle off the bisector, and for a
// coupling with a socket each groove's angle off the socket.
// [Optimize] turns the vee grooves (and moves balls, chooses half-angles)
// for a design figure within allowed azimuth windows, screened by floors
// on the Maxwell indices at the contact points and at the ball centres
// and, by default, by a condition number of at most [DesignCondition].
//
// For forces, a [Model] holds the contacts with their [Preload] elements
// and [Payload]; a [LoadCase] combines preload, gravity, the base's
// acceleration and applied wrenches. [Model.Statics] gives the contact
// forces and Hertz stresses against the allowables, [Model.Shock] the worst
// direction and level of a shock, [Model.WrenchLimit] and [Model.LiftOff]
// how far a load can grow before a contact unloads, [Model.SizePreload]
// the preload window, [Model.Equilibrium] the elastic equilibrium of any
// contact set (a hold-down pad, a fourth ball, interferences),
// [Model.Stiffness] the 6×6 stiffness with [Stiffness.Compliance] at a
// point and [Stiffness.Modes] the natural frequencies, and [Model.Homing]
// whether friction lets the part slide home. [FormClosure] and
// [ForceClosure] say whether a contact set holds against every load.
//
// # Units, frame and signs
//
// SI units throughout (m, N, Pa, rad). One right-handed global frame. The
// moving body is the part being located; the base is fixed. A contact is a
// point and a unit normal along which the base can push the moving body
// (into the moving body); contacts are unilateral, compression only. A
// seat's Up points out of the seat towards its ball. A groove azimuth is
// measured about Up, right-handed, from a [Reference] direction: [Radial]
// (from the ball towards the centroid of all ball centres, projected
// normal to Up; the default) or [FrameX] (the global x axis projected
// normal to Up: the drawing's frame). Azimuths π apart are the same groove.
//
// # Forces and loads
//
// A contact force is the magnitude of the force the base applies to the
// moving body along the contact's Normal: compression positive. Rigid
// statics reports a negative force for a contact that would have to pull
// (it opens). Loads on the moving body are wrenches (F in N, M in N·m about
// the origin); accelerations are in m/s² ([StandardGravity] converts from
// g); stiffnesses in N/m, N/rad and N·m/rad, compliances in their
// inverses; frequencies in Hz.
//
// A load case is linear in its parts: the preload elements times the
// case's Preload factor, the payload's weight Mass·Gravity and its
// inertial load −Mass·Acceleration at its centre of mass, and the applied
// wrenches. The zero value of every part means nothing applied.
//
// The load analyses assume rigid bodies apart from the contacts,
// frictionless point contacts following Hertz's force–approach law (the
// surfaces in [Contact.Moving] and [Contact.Base]), small displacements,
// and quasi-static loads (a shock is a steady acceleration of the base).
// Hertz results carry the validity of package hertz (half-spaces, contact
// small against the radii: see hertz.Contact.Valid). A cone's ring
// contact is not a Hertz point contact; the analyses that need its
// elasticity or stress return an error naming it.
//
// # Error budget
//
// An [Assembly] describes a coupling by its own geometry: the balls on the
// moving body and each seat's surfaces (planes, a gothic arch's concave
// cylinders, rods) in the base frame, with named dimensions — each ball's
// radius and centre, each seat's position, turn, tilt, half-angle and
// flank offsets (see [Assembly] for the names). A deviation of a dimension
// is in m or rad, positive as named ("towards the ball" for a flank:
// a flank moved by +e stands e high). The exact model ([Assembly.Pose])
// solves the seated pose by Newton's method on the tangency equations to
// 1e-13 of the size; the linear model ([Assembly.Sensitivities]) is its
// first derivative at the nominal, exact to second order in the
// deviations (halving every deviation quarters the difference; the tests
// check it). For deviations of micrometres on a coupling of tens of
// millimetres the two differ by about |deviation|²/size, 1e-11 m. The
// first-order error at a point per unit gap error at each contact is
// [Stability.Amplification]; an error budget ranks the toleranced dimensions by
// their effect ([Assembly.Budget]); a Monte Carlo study draws parts made to
// the drawing ([Assembly.Study]: interchangeability, how far a different
// part sits); [Model.Repeatability] estimates how well the same part comes
// back, limited by friction; [Assembly.Drift] gives the thermal drift
// relative to the base (and in the frame, with the base held at a point)
// and the thermal centre, a property of the coupling. The models are rigid apart from an optional Hertz
// approach, and ignore form errors of the surfaces, wear and
// contamination.
//
// # Design figures
//
// [Coupling.Score] reports, for a [Scenario] (the point of interest, the
// preload, the payload, the expansion coefficients), what decides a
// layout: the error at the point per unit gap error, the stiffness there,
// the shock level at which a contact unloads, the preload window, the
// first natural frequency, the thermal drift, and the Maxwell indices as a
// screen. [Optimize] improves any one of them within windows, ball regions
// and half-angle lists, with the others as constraints.
//
// # Maxwell's criterion in 3D
//
// Six independent contacts hold a body exactly. Removing contact i frees
// one motion, the twist with zero power against the other five; scaled so
// that contact i opens at unit speed (n·v = +1, v the velocity of the
// contact point) it is [Maxwell].Freed. The Maxwell index |n·v|/|v| is 1
// when that motion lifts the contact straight off its surface and near 0
// when it slides along it, which the contact then barely resists. The
// planar rule that grooves should lie on the bisectors of the ball triangle
// is the special case in which every index taken at the ball centres is
// |sin 2θ| for a vee of half-angle θ (1 for 90° vees).
//
// # Tolerances
//
// Rank and degeneracy decisions are scale-invariant (see package screw):
// a design in millimetres and the same design in metres give the same
// verdicts and the same indices to rounding. Contacts are analysed relative
// to their own centroid, so a design moved anywhere in the frame does too,
// until its coordinates run out of digits: at a size of 1e-5 of the
// distance from the origin (100 mm at 10 km) the indices agree to about
// 1e-10, at 1e-9 to about 1e-6 (the points themselves are known only to
// ε·distance).
// Thresholds in this package (coincident balls, a groove along its own Up,
// parallel grooves, ties between indices) are named constants relative to
// the design's own size, each with its reasoning beside it.
//
// # Errors
//
// Invalid input returns an [*InputError] naming the field as the caller
// wrote it (for example "Pairs[1].Seat.HalfAngle" or "cs[4].Normal") and
// wrapping one of [ErrNonFinite] (NaN or infinity), [ErrRange] (a finite
// number outside its domain), [ErrDegenerate] (geometry that defines
// nothing) or [ErrNotExact] (a set that is not exactly constrained where
// one is needed); errors.Is and errors.As work. The first three are the
// same values as package screw's and hertz's sentinels of the same names.
// Errors that arise in screw or hertz are translated: they come back as a
// kinematic *InputError with the caller's field path, and errors.Is still
// finds the other package's sentinel (hertz.ErrLineContact, for example).
// Nothing panics on user numbers or returns NaN.
//
// Input arguments are never modified; results do not share memory with
// them.
//
// # Scope
//
// Constraint and stability treat the bodies as rigid and the contacts as
// frictionless points. A ball in a cone bears on a ring; it is represented
// by three contacts for constraint and rigid statics only (see [Cone]).
//
// The numbers are engineering estimates from idealised models. Where a
// result bears on safety or on hardware that can be damaged (a preload
// that overloads a contact, a stress above the allowable), verify it by
// test and defer to the applicable codes and a qualified engineer.
//
// Maxwell indices and the arithmetic NearSingular flag screen layouts; they
// are not design figures. Among sensible layouts the weakest index varies
// little, and a layout that maximises it can be worse at the point that
// matters (error amplification, stiffness, shock margin, thermal drift).
package kinematic
