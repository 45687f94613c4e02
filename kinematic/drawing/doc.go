// Package drawing draws a coupling design and the studies made of it, on
// gonum.org/v1/plot: the plan view ([Plan]), the lift-off map
// ([LiftOff]), the histogram of a Monte Carlo study ([Histogram]), the
// design figures of candidate layouts ([Scorecards]), the error budget
// ranked by contributor ([Budget]), the contact forces of each load
// case ([Forces]), and random vibration: the test spectrum on log–log
// axes with the response at the point of interest ([RandomSpectrum],
// g²/Hz against Hz) and each contact's margin ([RandomMargins]), the
// hysteresis loop of the point of interest under a load cycle
// ([Hysteresis], displacement along the load against the load), and the
// force law of a gap-dependent preload element with its operating and
// runaway points ([PreloadCurve], N against the gap in mm). Each takes
// the library's own values (a design.Built and its design.Evaluation, a kinematic.StudyResult, kinematic.Scorecard,
// kinematic.Budget or kinematic.Statics values), an io.Writer and an
// [*Options] whose zero value (or nil) draws with the defaults. Titles
// and labels come from the caller: the point of interest's name
// (Options.PointName), the balls' names, the load cases' names, the
// names given to candidates; the package adds no words of its own about
// what the coupling holds.
//
//	b, err := d.Build()
//	ev, err := b.Evaluate(ctx)
//	err = drawing.Plan(f, b, ev, &drawing.Options{PointName: "mirror vertex"})
//
// The pictures are also plot.Plotter values ([PlanPlotter],
// [LiftOffPlotters], [HistogramPlotters], [HysteresisPlotters], [PreloadCurvePlotters]) that a caller adds to a
// plot.Plot of their own, with their own axes, title and size.
//
// # Units and conventions
//
// The inputs are in SI units, as everywhere in the library. A plan is the
// view looking down the global −z axis onto the base: x to the right, y
// up, in mm on equal scales; a point's z is not drawn. Displacements are
// drawn in µm, forces in N, stiffness in N/µm, shock levels in g
// (9.80665 m/s²), thermal drift in µm/K; Maxwell indices are
// dimensionless. "Radial" displacement is the 3-D magnitude |d| of the
// displacement vector. Groove axes are dashed blue lines, instantaneous
// axes of seat pairs dash-dot grey lines (blue discs where vertical;
// the note under a plan names only the styles it draws); where the
// grooves meet is a cross, the thermal centre a filled triangle, the preload points open
// triangles, the centre of mass a ring and the point of interest a
// square. Continuous values use one sequential colour map whose bar
// names the quantity, its unit and, on a lift-off map, the cap. Every
// label has a leader to what it names.
//
// # Output
//
// Each function writes one document in Options.Format: a standalone SVG
// 1.1 document (the default; UTF-8, no scripts, no external references,
// a <title> element holding the title), a PNG or a PDF, through
// gonum/plot's back ends. A figure is 8 in (576 pt) wide, so that its
// smallest text, 9 pt, is about 19 px high when drawn 1200 px wide.
// Labels are placed by the metrics of Liberation Serif; an SVG names
// Times New Roman, which has the same metrics, as the fallback.
//
// # Errors
//
// Errors wrap the library's sentinels (kinematic.ErrNonFinite,
// kinematic.ErrRange, kinematic.ErrDegenerate) and name the field as the
// caller wrote it ("Options.Limit", "cards[1].FirstFrequency"), so
// errors.Is works; an error of the writer is returned as it is. Nothing
// panics on a caller's numbers and no output holds a NaN or an infinity.
// The inputs are never modified.
//
// The drawings are for reading a design, not for manufacture: they are
// schematic (seats are drawn as the top edges of their flanks or their
// outlines) and not to a printed scale.
package drawing
