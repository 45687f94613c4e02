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
				name, q.X*1e3, q.Y*1e3, noNegZero(ax.Direction.X), noNegZero(ax.Direction.Y), noNegZero(ax.Direction.Z)))
			continue
		}
		p.PairAxes = append(p.PairAxes, draw.Line{Label: "axis " + name, Through: pt(ax.Point), Direction: pt(ax.Direction)})
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

// noNegZero returns x, with values that print as -0.00 at two decimals
// made zero.
func noNegZero(x float64) float64 {
	if math.Abs(x) < 0.005 {
		return 0
	}
	return x
}
