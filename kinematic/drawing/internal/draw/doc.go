// Package draw is the small SVG drawing kit behind package drawing, its
// only caller: a plan view of a coupling, a heat map over a region, a
// histogram with percentile markers and a grouped bar chart. It knows
// nothing of couplings: package drawing translates the library's results
// into its plain types, so that imports keep pointing down (this package
// never imports kinematic).
//
// # Units and frames
//
// Plan positions (Point, Plan, HeatMap, Grid) are in metres in plan
// coordinates, x to the right and y up, looking down on the base. The kit
// converts them to pixels and prints lengths in millimetres (axis ticks,
// scale bar, marker coordinates). Every other value (contact values, cell
// values, samples, bar values) is drawn and printed as given, in the unit
// the caller names beside it: the kit converts nothing else.
//
// # Output
//
// Each drawing type has a WriteSVG method that writes one complete,
// standalone SVG 1.1 document (valid XML, UTF-8, no scripts, no external
// references) that any browser or rsvg-convert opens. All text is escaped.
// Nothing is clipped: the canvas (the viewBox) grows to hold every element,
// and every label is placed by a label placer that tries positions around
// its anchor, nearest first, and keeps the first whose box is clear of the
// labels already placed and of the drawn geometry (circles, segments,
// boxes); a label set away from its anchor gets a thin leader line. Text
// sizes are estimated from per-character advance widths of a wide
// sans-serif face (DejaVu Sans, Verdana), so a narrower face only leaves
// more room. No element carries a transform: coordinates are absolute,
// which lets the tests check that every element lies inside the viewBox.
//
// # Colours and symbols
//
// Continuous values use one sequential scale from deep violet (low) to amber
// (high), always with a legend bar that names the quantity and its unit.
// Groove axes are dashed blue lines; instantaneous axes of seat pairs are
// dash-dot purple lines; the coupling centre is a circled cross, the
// thermal centre a diamond and the point of interest a square target.
// Candidates in a bar chart get distinct categorical colours.
//
// # Errors
//
// Invalid input returns an *InputError naming the field as the caller
// wrote it ("Balls[2].Radius", "Figures[0].Values[1]") and wrapping
// ErrNonFinite, ErrRange or ErrDegenerate (the shared sentinels of
// internal/errs), so errors.Is works. Nothing panics on a caller's numbers
// and no output holds a NaN or an infinity. Input slices are never
// modified.
package draw
