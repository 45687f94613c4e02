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
// case's PreloadFactor (zero means 1; NoPreload switches them off), the
// payload's weight Mass·Gravity and its inertial load −Mass·Acceleration
// at its centre of mass, and the applied wrenches (zero: none).
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
// # Gap-dependent preload
//
// A preload element may give its force as a [ForceLaw] of its gap: a
// table of measured forces ([ForceTable], monotone cubic), two cuboid
// magnets ([MagnetPair]) or a magnet on a steel plate ([MagnetPlate]).
// The gap, in m, is the separation along the element's line that grows
// as the moving body lifts off its seats (moves against the element's
// Direction); the force, in N, is the element's pull or push along
// Direction, attraction positive for a magnet; its stiffness dF/dgap is
// negative for a magnet (a negative spring: it lowers the coupling's
// stiffness, its natural frequencies and the lift-off level) and positive
// for a compression spring pressing the part down. [Preload.Rate] is
// −dF/dgap. Magnets: sizes are full edge lengths (the published closed
// form is written with half edges), magnetised along their third edge
// with parallel magnetisation; the gap is the clearance between the
// facing pole faces; a lateral offset is between centres; the relative
// permeability is 1 (rigid magnets, no demagnetisation by the partner);
// remanence Br in T. The touching limit (gap 0) gives a finite force but
// an infinite stiffness for faces with an edge in common, so a seated gap
// must be > 0; beyond 20 magnet sizes the force is the point-dipole limit.
// Statics, stiffness, modes, random vibration, the scorecard and the
// preload window use the law's force and slope at the seated gap (the
// Monte Carlo study of tolerances is geometric and needs no preload; the
// friction repeatability takes the forces from the statics); the shock's
// runaway level
// ([Shock.Runaway]) follows the law along the lift, and the preload
// window gives the range of seated gaps ([PreloadSizing.Gaps]). The
// nonlinear equilibrium uses the law's tangent at the seat, so its
// displacements must be small against the gap.
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
// # Micro-slip and hysteresis
//
// [Model.Hysteresis] follows the point of interest through a load cycle
// given by the caller (a push, a cable pull, a shock or a thermal load as
// equivalent wrenches: a sequence of [CycleStep]s added to a load case)
// and reports its path, the residual displacement and tilt after the
// cycle (the hysteresis) and the energy dissipated per cycle. The model:
//
//   - the normal force P of each contact at each step is its rigid-statics
//     force under the case plus the step's load; a step that opens a
//     contact is an error naming it ("steps[3]");
//   - the body's small pose change balances the loads against the
//     contacts' Hertz normal springs, taken about their seated approach,
//     and their tangential tractions; normal and tangential problems are
//     uncoupled (Johnson, Contact Mechanics, 1985, §7.2);
//   - each contact's tangential traction follows Mindlin's partial-slip
//     law, δ = 3μP/(2k0)[1 − (1 − Q/μP)^(2/3)] with the no-slip stiffness
//     k0 = 8G*a and 1/G* = (2 − ν1)/G1 + (2 − ν2)/G2, unloading and
//     reloading by Mindlin & Deresiewicz (Johnson §7.4), and the memory of
//     the load path kept exactly by Masing's rules (each reversal starts a
//     branch at twice the scale; a branch that meets an earlier one
//     continues it); beyond |Q| = μP the contact slides. Displacements
//     are those of distant points of the two bodies (hertz.Contact.Slip);
//   - the traction is resolved along two directions of the tangent plane,
//     each following the law independently with the limit μP: the
//     direction in which the contact moves, without slip, under the
//     cycle's largest step, and the one across it. This is exact when a
//     contact's traction keeps its line of action, as it does to first
//     order under a cycle of one load scaled up and down; a traction
//     that turns is an approximation (a contact loaded diagonally to both
//     directions holds up to √2 μP before it slides);
//   - when P changes during the cycle the memory is kept in the scaled
//     variables Q/μP and δ/δs, δs = 3μP/(2k0) (so the whole load path is
//     rescaled with the normal force, at constant Q/μP): exact at constant
//     P, and with no slip (μ → ∞) the force k0(P)·δ depends on the
//     present state only, so a cycle leaves nothing behind. Mindlin &
//     Deresiewicz's solution for a normal force that changes together with
//     the tangential (oblique loading, Johnson §7.5) is outside the model:
//     the normal force must change slowly against the tangential (the
//     cycle's load small against the preload);
//   - small slip: the pose change is small against the contacts; no wear,
//     fretting or change of friction over the cycles; no dynamics (the
//     steps are quasi-static).
//
// Energy is the work of the cycle's loads around the second pass of the
// cycle, by the trapezoid rule over the steps: by Masing's rules the
// second pass is a closed loop (at constant normal forces), so the work is
// the energy dissipated by micro-slip, which in the small-amplitude limit
// grows as the cube of the load (Johnson §7.4; hertz.Contact.SlipEnergy).
// Steps fine enough to follow the loop are the caller's choice: the
// trapezoid rule's error falls as the square of the step.
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
// # Figures that cannot be computed
//
// A figure the inputs cannot support is an error naming the missing input
// or is marked unavailable; it is never a plain zero that reads as a
// value, nor a NaN. What each result needs beyond the geometry:
//
//   - [Statics]: a Hertz model (materials on both bodies, a point contact)
//     at every compressed contact, else an error naming "cs[i]..."; an
//     allowable on file for both bodies for [ContactLoad.PressureRatio], else Allowable and
//     PressureRatio are both 0 (Allowable 0 is the marker). A contact in
//     tension is a result: it is listed in Tensile, with the input that
//     pulls it in [ContactLoad.PulledBy] ("preloads[0]").
//   - [Shock]: a payload mass, else an error naming "payload.Mass".
//   - [Stiffness], [Compliance], [Model.Repeatability]: a Hertz model and a
//     compressive force at every contact of an exactly constrained set
//     (six loaded contacts otherwise); a contact in tension is an error
//     naming the input that pulls it ("preloads[0]", "lc.Gravity"), and
//     contacts with no force an error naming "lc.NoPreload" (the preload switched off)
//     or "preloads" (none) and listing them: an unloaded Hertz contact has
//     no stiffness.
//   - [Model.Hysteresis]: what [Stiffness] needs, with every contact in
//     compression at every step of the cycle.
//   - [Mode]: a payload mass and inertia tensor, else an error naming
//     "payload.Mass" or "payload.Inertia".
//   - [PreloadSizing]: a preload element, else an error naming
//     "preloads"; MaxScale is +Inf, documented, when no compressed contact
//     has an allowable on file.
//   - [Scorecard]: each figure that needs more than the geometry says so
//     in its [Figure] constant (Axis, payload mass and inertia, a preload,
//     materials, allowables, expansion coefficients); without it the
//     figure is 0 and its bit is set in [Scorecard.Unavailable], which
//     costs no allocation. A preload that puts a contact in tension is an
//     error naming it ("s.Preloads[0]"): the part does not seat.
//   - [Amplification], [Effect], [Budget], [StudyResult], [Pose], [Limit],
//     [LiftOff], [Homing]: the geometry and their own arguments only.
//
// The only infinities in results are documented unbounded figures, each
// with its meaning: a shock level or unloading acceleration of +Inf (no
// acceleration unloads the contact: a massless payload), a [Limit] scale
// or [LiftOff] force of +Inf (no load of that kind unloads a contact), a
// friction limit of +Inf ([HomingContact.Limit]: friction cannot stop
// it), [Scorecard.PreloadMin] of +Inf (no factor keeps a contact loaded),
// [Scorecard.PreloadMax] of +Inf (the preload presses no contact) and
// [PreloadSizing.MaxScale] as above.
//
// Finite inputs whose result leaves the floating-point range return an
// [*InputError] wrapping [ErrRange] naming the input: every result is
// checked finite before it is returned, and the entry point names the
// input the overflow comes from ("p" for a point of interest 1e300 m
// away, "payload.Mass" for a payload of 5e-324 kg whose shock level would
// be 1/mass, "tols[i].Sigma" for a σ of 1e308 whose 3σ overflows, "mu",
// "magnitude", "w", "s.Point"). Zero values of [Model], [Assembly],
// [Stiffness] and [Stability], and nil pointers, are refused by their
// methods with an error wrapping [ErrDegenerate] that says how to make
// one.
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
// wrote it: the parameter's name as in the function's signature, then the
// fields of its type (for example "Pairs[1].Seat.HalfAngle" for a
// Coupling built by hand, "vees[1].HalfAngle" or "socket.HalfAngle" for
// one built by [BisectorVees] or [SocketVeeFlat], "cs[4].Normal") and
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
// # Random vibration
//
// [Model.Random] answers whether a contact opens in a random vibration
// test or in transport, in linear theory about the load case given, with
// these conventions (each changes the answer by more than 0.1 %):
//
//   - The spectrum ([Spectrum]) is the base acceleration's power spectral
//     density in g²/Hz, g = [StandardGravity], linear in log–log between
//     breakpoints and zero outside its band; a slope of X dB/octave is the
//     exponent X / (10 log10 2) (6 dB/octave is f^1.993, not f²), and
//     levels given as slopes propagate from the anchor breakpoints that
//     have a level. Its grms is exact per segment in closed form.
//   - Damping is viscous and modal: C = M Φ diag(2 ζ_r ω_r) Φᵀ M with Φ
//     the mass-normalised modes, ζ = 0.02 (Q = 25) unless given. No
//     structural (hysteretic) damping is offered.
//   - The stiffness is that of [Model.Stiffness] at the load case: each
//     contact's normal Hertz stiffness; the tangential stiffness is
//     neglected (the contacts may slip). The mass matrix is the payload's
//     rigid-body one.
//   - The payload's acceleration (centre of mass, point of interest) is
//     absolute, what an accelerometer on it reads; the displacement and
//     tilt at the point are relative to the base. Vector quantities are
//     given as the RMS of their magnitude.
//   - A contact's dynamic force is its normal stiffness times its relative
//     normal displacement; its static force is that of the load case
//     (preload and gravity). Margin = static / RMS dynamic, the number of
//     standard deviations at which it opens.
//   - Openings are down-crossings of zero force by a stationary Gaussian
//     process, counted by Rice's formula ν = (1/2π)(σ_ḟ/σ_f)
//     exp(−F²/2σ_f²) (S. O. Rice, Bell System Technical Journal 23 (1944)
//     and 24 (1945)), in linear theory (after a first opening the real
//     contact is no longer linear); the probability of at least one
//     opening in T treats them as a Poisson process, 1 − exp(−νT).
//   - All six modes and their cross terms enter: the response spectra are
//     integrated directly over the band, on the modal transfer functions
//     h_r = 1/(ω_r² − ω² + 2iζ_r ω_r ω), so close modes are right, and
//     for a repeated frequency with one damping ratio the answer does not
//     depend on the eigenvectors the solver returned. The quadrature is
//     4-point Gauss–Legendre on subintervals whose ends are the
//     breakpoints, 12 log-spaced points per decade and, around each mode,
//     f_r ± t ζ_r f_r for t = 0.5, 1, 2, 3, 5, 8, 13, 25; against
//     the closed-form response of a single mode to white noise it agrees
//     to better than 1e-5 of the variance (6e-8 measured at ζ = 0.02, once the
//     finite band's share is subtracted by hand).
//   - Damping given per mode (six values) applies ζ_r to the r-th mode
//     as [Stiffness.Modes] returns them, lowest frequency first. Where
//     two or more modes share one frequency (a symmetric coupling's
//     lateral pair), the eigenvectors of that frequency are any basis
//     of their subspace, and which one the solver returns is an accident
//     of rounding. With one damping ratio for the repeated modes the
//     damping matrix on that subspace is 2ζω times the identity (mass
//     normalised), the same in every basis, so the answer does not
//     depend on the basis (a test turns the excitation by the
//     coupling's symmetry and finds the same response). With different
//     ratios on modes of equal frequency the damping matrix, and so the
//     response, depends on the basis the solver happened to return: the
//     library does not detect this and computes with the solver's
//     basis; give such modes one ratio (or a single value for all six).
//     Modes that are close but distinct are well defined and any ratios
//     are right for them.
//   - [Model.RandomDensity] gives the power spectral densities of the
//     base input and of the point's absolute acceleration ((m/s²)²/Hz)
//     and relative displacement (m²/Hz) at frequencies the caller
//     chooses, for plots; the RMS figures integrate the same densities.
//   - The worst direction over the sphere ([Model.RandomWorst]) is in
//     closed form: a contact's force variance is a quadratic form in the
//     direction, so its least margin lies along the top eigenvector of a
//     3×3 matrix.
//   - The preload for a margin ([Model.RandomPreload]) is a factor on the
//     preload elements, not on gravity: first order with every contact's
//     stiffness held at its value in the case given (static forces linear
//     in the factor), and exactly with every contact stiffness following
//     Hertz (k ∝ F^(1/3)), by bisection on the factor.
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
