// Package drawing writes SVG drawings of a coupling design and of the
// studies made of it: the plan view ([Plan]), the lift-off map
// ([LiftOff]), the histogram of a Monte Carlo study ([Histogram]) and the
// scorecards of candidate layouts side by side ([Scorecards]). Each takes
// the library's own values (a design.Built and its design.Evaluation, a
// kinematic.StudyResult, kinematic.Scorecard values), an io.Writer and an
// [*Options] whose zero value (or nil) draws with the defaults.
//
//	b, err := d.Build()
//	ev, err := b.Evaluate(ctx)
//	err = drawing.Plan(f, b, ev, nil)
//
// # Units and conventions
//
// The inputs are in SI units, as everywhere in the library. A plan is the
// view looking down the global −z axis onto the base: x to the right, y
// up; a point's z is not drawn. Lengths in a plan and its legend are
// printed in millimetres, displacements in a histogram in micrometres,
// stiffness in N/µm, shock levels in g (9.80665 m/s²), thermal drift in
// µm/K; Maxwell indices are dimensionless. Groove axes are dashed lines,
// instantaneous axes of seat pairs dash-dot lines; the coupling centre is
// a circled cross, the thermal centre a diamond and the point of interest
// a square target. Continuous values use one sequential colour scale
// with a legend that names the quantity and its unit.
//
// # Output
//
// Each function writes one standalone SVG 1.1 document (UTF-8, no
// scripts, no external references) that a browser or rsvg-convert opens.
// Nothing is clipped: the canvas grows to hold every label.
//
// # Errors
//
// Errors wrap the library's sentinels (kinematic.ErrNonFinite,
// kinematic.ErrRange, kinematic.ErrDegenerate), so errors.Is works; an
// error of the writer is returned as it is. Nothing panics on a caller's
// numbers and no output holds a NaN or an infinity. The inputs are never
// modified.
//
// The drawings are for reading a design, not for manufacture: they are
// schematic (seats are drawn as the top edges of their flanks) and not to
// a printed scale.
package drawing
