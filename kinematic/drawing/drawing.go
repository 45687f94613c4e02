package drawing

import (
	"fmt"
	"io"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// Options are the words and settings of a drawing. The zero value, and a
// nil *Options, draw with the defaults each field names.
type Options struct {
	// Title is the drawing's title; "" gives one that names what it
	// shows.
	Title string

	// Notes are lines of text under the drawing, after its own.
	Notes []string

	// PointName names the point of interest in labels and legends, for
	// example "detector centre"; "" means "point of interest".
	PointName string

	// FaceHeight is the height, m, above the highest ball centre of the
	// face that a lift-off map pushes on; 0 means the height of the
	// point of interest.
	FaceHeight float64
}

// orDefault returns *o, or the zero Options for nil.
func (o *Options) orDefault() Options {
	if o == nil {
		return Options{}
	}
	return *o
}

// pointName returns the name of the point of interest.
func (o Options) pointName() string {
	if o.PointName == "" {
		return "point of interest"
	}
	return o.PointName
}

// title returns the title, or def when none is set.
func (o Options) title(def string) string {
	if o.Title == "" {
		return def
	}
	return o.Title
}

// notes returns the drawing's own notes followed by the caller's.
func (o Options) notes(own ...string) []string {
	return append(own, o.Notes...)
}

func pt(v r3.Vec) draw.Point { return draw.Point{X: v.X, Y: v.Y} }

// bounds returns the lower-left and upper-right corners of the ball
// centres in plan.
func bounds(c kinematic.Coupling) (lo, hi r3.Vec) {
	lo, hi = r3.Vec{X: math.Inf(1), Y: math.Inf(1)}, r3.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, p := range c.Pairs {
		lo.X, lo.Y = math.Min(lo.X, p.Ball.Centre.X), math.Min(lo.Y, p.Ball.Centre.Y)
		hi.X, hi.Y = math.Max(hi.X, p.Ball.Centre.X), math.Max(hi.Y, p.Ball.Centre.Y)
	}
	return lo, hi
}

// Plan writes the plan view of a built design to w: the base outline,
// the balls to scale, the top edges of each vee's flanks, the groove
// axes, the instantaneous axes of seat pairs (listed in the notes when
// they cross the plan far from the coupling), the coupling centre, the
// thermal centre (when ev has a drift with one), the point of interest,
// and each contact's Maxwell centre index, dimensionless, coloured on a
// scale from 0.8 to 1. ev is b's evaluation (b.Evaluate).
func Plan(w io.Writer, b *design.Built, ev design.Evaluation, opt *Options) error {
	o := opt.orDefault()
	c := b.Coupling()
	g, err := c.Geometry()
	if err != nil {
		return err
	}
	cs := b.Contacts()
	if len(ev.Stability.Contacts) != len(cs) {
		return fmt.Errorf("drawing: ev has %d contacts' Maxwell indices, the design %d contacts: %w", len(ev.Stability.Contacts), len(cs), kinematic.ErrDegenerate)
	}
	p := draw.Plan{
		Title: o.title("Coupling, plan looking down"),
		Scale: draw.Scale{Name: "Maxwell index at the ball centre", Min: 0.8, Max: 1},
		Notes: o.notes("groove axes dashed, instantaneous axes of seat pairs dash-dot"),
	}
	lo, hi := bounds(c)
	for _, pr := range c.Pairs {
		bl := pr.Ball
		p.Balls = append(p.Balls, draw.Ball{Name: pr.Name, Centre: pt(bl.Centre), Radius: bl.Radius})
		if v, ok := pr.Seat.(kinematic.Vee); ok {
			// The flanks' top edges, 12 mm long either side of the ball,
			// at 1.2 ball radii from the groove axis.
			dir, _ := unit(v.Direction)
			side := r3.Cross(r3.Vec{Z: 1}, dir)
			const half = 0.012
			var fl []draw.Segment
			for _, sgn := range []float64{1, -1} {
				off := r3.Scale(sgn*bl.Radius*1.2, side)
				a := r3.Add(r3.Add(bl.Centre, off), r3.Scale(-half, dir))
				e := r3.Add(r3.Add(bl.Centre, off), r3.Scale(half, dir))
				fl = append(fl, draw.Segment{A: pt(a), B: pt(e)})
			}
			p.Seats = append(p.Seats, draw.Seat{Name: pr.Name, Flanks: fl})
		}
	}
	const margin = 0.02
	p.Outline = []draw.Point{{X: lo.X - margin, Y: lo.Y - margin}, {X: hi.X + margin, Y: lo.Y - margin}, {X: hi.X + margin, Y: hi.Y + margin}, {X: lo.X - margin, Y: hi.Y + margin}}
	for _, gr := range g.Grooves {
		p.Grooves = append(p.Grooves, draw.Line{Label: c.Pairs[gr.Pair].Name + " groove", Through: pt(gr.Point), Direction: pt(gr.Direction)})
	}
	// Instantaneous axes of seat pairs: drawn when they cross the plan
	// near the coupling, listed in the notes when they lie far off.
	size := math.Max(hi.X-lo.X, hi.Y-lo.Y)
	mid := r3.Scale(0.5, r3.Add(lo, hi))
	for _, ax := range g.Axes {
		name := c.Pairs[ax.A].Name + c.Pairs[ax.B].Name
		if ax.Parallel {
			p.Notes = append(p.Notes, fmt.Sprintf("seats %s: parallel grooves, a free translation", name))
			continue
		}
		q := ax.Point
		if math.Hypot(q.X-mid.X, q.Y-mid.Y) > 0.75*size {
			p.Notes = append(p.Notes, fmt.Sprintf("axis of seats %s: through (%.0f, %.0f) mm, direction (%.2f, %.2f, %.2f), off the drawing",
				name, q.X*1e3, q.Y*1e3, noNegZero(ax.Dir.X), noNegZero(ax.Dir.Y), noNegZero(ax.Dir.Z)))
			continue
		}
		p.PairAxes = append(p.PairAxes, draw.Line{Label: "axis " + name, Through: pt(ax.Point), Direction: pt(ax.Dir)})
	}
	if g.HasCentre {
		p.Markers = append(p.Markers, draw.Marker{Kind: draw.CouplingCentre, At: pt(g.Centre), Label: "grooves meet"})
	}
	if ev.Drift != nil && ev.Drift.HasCentre {
		p.Markers = append(p.Markers, draw.Marker{Kind: draw.ThermalCentre, At: pt(ev.Drift.Centre), Label: "thermal centre"})
	}
	d := b.Design()
	p.Markers = append(p.Markers, draw.Marker{Kind: draw.PointOfInterest, At: pt(d.Point), Label: o.pointName()})
	for i, m := range ev.Stability.Contacts {
		p.Values = append(p.Values, draw.Value{Label: m.Label, At: pt(cs[i].Point), Value: m.CentreIndex})
	}
	return p.WriteSVG(w)
}

func unit(v r3.Vec) (r3.Vec, bool) {
	n := r3.Norm(v)
	if n == 0 {
		return r3.Vec{}, false
	}
	return r3.Scale(1/n, v), true
}

// LiftOff writes the lift-off map of a built design to w: on a 40 × 40
// grid over the balls' plan (with 20 mm of margin), the largest push, N,
// along −z on the face Options.FaceHeight above the highest ball centre
// before a contact unloads, added to the design's first load case
// (kinematic.Model.LiftOff). Pushes above four times the total preload
// (100 N without preload) are drawn in the top colour; where a push
// never unloads a contact the cell is hatched. The design needs a load
// case.
func LiftOff(w io.Writer, b *design.Built, opt *Options) error {
	o := opt.orDefault()
	d := b.Design()
	if len(d.Cases) == 0 {
		return fmt.Errorf("drawing: a lift-off map needs a load case, the design has none: %w", kinematic.ErrDegenerate)
	}
	if math.IsNaN(o.FaceHeight) || math.IsInf(o.FaceHeight, 0) {
		return fmt.Errorf("drawing: Options.FaceHeight: %w: %g", kinematic.ErrNonFinite, o.FaceHeight)
	}
	c := b.Coupling()
	lo, hi := bounds(c)
	top := math.Inf(-1)
	for _, p := range c.Pairs {
		top = math.Max(top, p.Ball.Centre.Z)
	}
	z, height := d.Point.Z, d.Point.Z-top
	if o.FaceHeight != 0 {
		z, height = top+o.FaceHeight, o.FaceHeight
	}
	const margin, n = 0.02, 40
	gr := draw.Grid{X0: lo.X - margin, Y0: lo.Y - margin, NX: n, NY: n}
	gr.DX, gr.DY = (hi.X-lo.X+2*margin)/n, (hi.Y-lo.Y+2*margin)/n
	var pts []r3.Vec
	for j := range n {
		for i := range n {
			pts = append(pts, r3.Vec{X: gr.X0 + (float64(i)+0.5)*gr.DX, Y: gr.Y0 + (float64(j)+0.5)*gr.DY, Z: z})
		}
	}
	lift, err := b.Model().LiftOff(d.Cases[0], r3.Vec{Z: -1}, pts)
	if err != nil {
		return err
	}
	for _, l := range lift {
		gr.Values = append(gr.Values, l.Force)
	}
	// Near the lines where a push stops unloading anything the limit
	// grows without bound; the scale stops at four times the preload.
	scaleTop := 0.0
	for _, p := range d.Preloads {
		scaleTop += 4 * p.Force
	}
	note := fmt.Sprintf("pushes above %.0f N (four times the preload) are drawn in the top colour", scaleTop)
	if scaleTop == 0 {
		scaleTop = 100
		note = "pushes above 100 N are drawn in the top colour"
	}
	hm := draw.HeatMap{
		Title:    o.title("Lift-off map: downward push on the top face before a contact unloads"),
		Grid:     gr,
		Scale:    draw.Scale{Name: "largest push", Unit: "N", Min: 0, Max: scaleTop},
		InfLabel: "never unloads",
		Notes: o.notes(
			fmt.Sprintf("push along -z at %.0f mm above the balls, added to case %q", height*1e3, d.Cases[0].Name),
			note,
		),
	}
	for _, p := range c.Pairs {
		hm.Markers = append(hm.Markers, draw.Marker{Kind: draw.CouplingCentre, At: pt(p.Ball.Centre), Label: "ball " + p.Name})
	}
	return hm.WriteSVG(w)
}

// Histogram writes the histogram of a Monte Carlo study's radial
// displacement of the point of interest to w, in µm, with the 50th,
// 95th, 99th and 99.73th percentiles marked. The study must have kept
// its samples (kinematic.StudyOptions.KeepSamples).
func Histogram(w io.Writer, res kinematic.StudyResult, opt *Options) error {
	o := opt.orDefault()
	if len(res.Points) == 0 {
		return fmt.Errorf("drawing: the study kept no samples (kinematic.StudyOptions.KeepSamples): %w", kinematic.ErrDegenerate)
	}
	samples := make([]float64, len(res.Points))
	for i, p := range res.Points {
		samples[i] = r3.Norm(p) * 1e6
	}
	h := draw.Histogram{
		Title:       o.title("Error at the " + o.pointName() + ": parts made to the drawing"),
		Quantity:    "displacement of the " + o.pointName(),
		Unit:        "µm",
		Samples:     samples,
		Percentiles: draw.DefaultPercentiles,
		Notes:       o.notes(),
	}
	return h.WriteSVG(w)
}

// Scorecards writes the design figures of candidate layouts side by side
// to w, each figure relative to its best candidate so that taller is
// better: the error at the point of interest (µm/µm), the stiffness
// there (N/µm), the first natural frequency (Hz), the shock level (g),
// the thermal drift (µm/K) and the weakest Maxwell index. names[i] names
// cards[i]. Every figure drawn must be finite and greater than zero (a
// scorecard of a payload without inertia has no frequency): the error
// names the card's field, for example "cards[1].FirstFrequency".
func Scorecards(w io.Writer, names []string, cards []kinematic.Scorecard, opt *Options) error {
	o := opt.orDefault()
	if len(names) != len(cards) {
		return fmt.Errorf("drawing: %d names for %d scorecards: %w", len(names), len(cards), kinematic.ErrDegenerate)
	}
	bars := draw.Bars{
		Title:      o.title("Candidate layouts: design figures (each relative to its best; taller is better)"),
		Candidates: append([]string(nil), names...),
		Notes:      o.notes(),
	}
	for _, f := range []struct {
		name, unit, field string
		lower             bool
		value             func(k *kinematic.Scorecard) float64
	}{
		{"error at " + o.pointName(), "µm/µm", "Amplification", true, func(k *kinematic.Scorecard) float64 { return k.Amplification }},
		{"stiffness", "N/µm", "Stiffness", false, func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 }},
		{"first frequency", "Hz", "FirstFrequency", false, func(k *kinematic.Scorecard) float64 { return k.FirstFrequency }},
		{"shock level", "g", "ShockLevel", false, func(k *kinematic.Scorecard) float64 { return k.ShockLevel / kinematic.StandardGravity }},
		{"thermal drift", "µm/K", "Drift", true, func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 }},
		{"Maxwell index", "", "WeakestIndex", false, func(k *kinematic.Scorecard) float64 { return k.WeakestIndex }},
	} {
		fig := draw.Figure{Name: f.name, Unit: f.unit, LowerIsBetter: f.lower}
		for i := range cards {
			v := f.value(&cards[i])
			if !(v > 0) || math.IsInf(v, 0) {
				return fmt.Errorf("drawing: cards[%d].%s: %w: %g, want a finite figure > 0 (figures are drawn relative to the best)", i, f.field, kinematic.ErrRange, v)
			}
			fig.Values = append(fig.Values, v)
		}
		bars.Figures = append(bars.Figures, fig)
	}
	return bars.WriteSVG(w)
}

// noNegZero returns x, with values that print as -0.00 at two decimals
// made zero.
func noNegZero(x float64) float64 {
	if math.Abs(x) < 0.005 {
		return 0
	}
	return x
}
