package main

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/draw"
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

func pt(v r3.Vec) draw.Point { return draw.Point{X: v.X, Y: v.Y} }

// planOf returns the plan view of the chosen layout: the base outline,
// balls, vee flanks, groove axes, pair axes, the coupling and thermal
// centres, the point of interest and each contact's Maxwell centre index.
func planOf(d *design.Design, c kinematic.Coupling, ev design.Evaluation) (draw.Plan, error) {
	g, err := c.Geometry()
	if err != nil {
		return draw.Plan{}, err
	}
	p := draw.Plan{
		Title: "Detector cassette coupling, chosen layout (plan, looking down)",
		Scale: draw.Scale{Name: "Maxwell index at the ball centre", Min: 0.8, Max: 1},
		Notes: []string{"groove axes dashed, instantaneous axes of seat pairs dash-dot"},
	}
	lo, hi := r3.Vec{X: math.Inf(1), Y: math.Inf(1)}, r3.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, pr := range c.Pairs {
		b := pr.Ball
		lo.X, lo.Y = math.Min(lo.X, b.Centre.X), math.Min(lo.Y, b.Centre.Y)
		hi.X, hi.Y = math.Max(hi.X, b.Centre.X), math.Max(hi.Y, b.Centre.Y)
		p.Balls = append(p.Balls, draw.Ball{Name: pr.Name, Centre: pt(b.Centre), Radius: b.Radius})
		if v, ok := pr.Seat.(kinematic.Vee); ok {
			// The flanks' top edges, 12 mm long either side of the ball,
			// at the ball's radius from the groove axis.
			dir, _ := unit(v.Direction)
			side := r3.Cross(r3.Vec{Z: 1}, dir)
			half := 0.012
			var fl []draw.Segment
			for _, sgn := range []float64{1, -1} {
				off := r3.Scale(sgn*b.Radius*1.2, side)
				a := r3.Add(r3.Add(b.Centre, off), r3.Scale(-half, dir))
				e := r3.Add(r3.Add(b.Centre, off), r3.Scale(half, dir))
				fl = append(fl, draw.Segment{A: pt(a), B: pt(e)})
			}
			p.Seats = append(p.Seats, draw.Seat{Name: pr.Name, Flanks: fl})
		}
	}
	margin := 0.02
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
	p.Markers = append(p.Markers, draw.Marker{Kind: draw.PointOfInterest, At: pt(d.Point), Label: "detector centre"})
	cs, err := c.Contacts()
	if err != nil {
		return draw.Plan{}, err
	}
	for i, m := range ev.Stability.Contacts {
		p.Values = append(p.Values, draw.Value{Label: m.Label, At: pt(cs[i].Point), Value: m.CentreIndex})
	}
	return p, nil
}

func unit(v r3.Vec) (r3.Vec, bool) {
	n := r3.Norm(v)
	if n == 0 {
		return r3.Vec{}, false
	}
	return r3.Scale(1/n, v), true
}

// liftOffMap returns the map of the largest downward force that can be
// pressed at each point of the cassette's top face (40 mm above the
// balls) before a contact unloads, under the first load case.
func liftOffMap(d *design.Design, m *kinematic.Model) (draw.HeatMap, error) {
	c, err := d.Coupling()
	if err != nil {
		return draw.HeatMap{}, err
	}
	lo, hi := r3.Vec{X: math.Inf(1), Y: math.Inf(1)}, r3.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, p := range c.Pairs {
		lo.X, lo.Y = math.Min(lo.X, p.Ball.Centre.X), math.Min(lo.Y, p.Ball.Centre.Y)
		hi.X, hi.Y = math.Max(hi.X, p.Ball.Centre.X), math.Max(hi.Y, p.Ball.Centre.Y)
	}
	const margin, n = 0.02, 40
	gr := draw.Grid{X0: lo.X - margin, Y0: lo.Y - margin, NX: n, NY: n}
	gr.DX, gr.DY = (hi.X-lo.X+2*margin)/n, (hi.Y-lo.Y+2*margin)/n
	var pts []r3.Vec
	for j := 0; j < n; j++ {
		for i := 0; i < n; i++ {
			pts = append(pts, r3.Vec{X: gr.X0 + (float64(i)+0.5)*gr.DX, Y: gr.Y0 + (float64(j)+0.5)*gr.DY, Z: 0.04})
		}
	}
	lift, err := m.LiftOff(d.Cases[0], r3.Vec{Z: -1}, pts)
	if err != nil {
		return draw.HeatMap{}, err
	}
	for _, l := range lift {
		gr.Values = append(gr.Values, l.Force)
	}
	// Near the lines where a push stops unloading anything the limit
	// grows without bound; the scale stops at four times the preload.
	top := 0.0
	for _, p := range d.Preloads {
		top += 4 * p.Force
	}
	if top == 0 {
		top = 100
	}
	hm := draw.HeatMap{
		Title:    "Lift-off map: downward push on the top face before a contact unloads",
		Grid:     gr,
		Scale:    draw.Scale{Name: "largest push", Unit: "N", Min: 0, Max: top},
		InfLabel: "never unloads",
		Notes: []string{
			fmt.Sprintf("push along -z at 40 mm above the balls, added to case %q", d.Cases[0].Name),
			fmt.Sprintf("pushes above %.0f N (four times the preload) are drawn in the top colour", top),
		},
	}
	for _, p := range c.Pairs {
		hm.Markers = append(hm.Markers, draw.Marker{Kind: draw.CouplingCentre, At: pt(p.Ball.Centre), Label: "ball " + p.Name})
	}
	return hm, nil
}

// bars returns the scorecards of the candidates side by side.
func bars(cands []candidate) draw.Bars {
	b := draw.Bars{Title: "Candidate layouts: design figures (each relative to its best; taller is better)"}
	for _, c := range cands {
		b.Candidates = append(b.Candidates, c.name)
	}
	add := func(name, unit string, lower bool, f func(k *kinematic.Scorecard) float64) {
		fig := draw.Figure{Name: name, Unit: unit, LowerIsBetter: lower}
		for _, c := range cands {
			fig.Values = append(fig.Values, f(&c.card))
		}
		b.Figures = append(b.Figures, fig)
	}
	add("error at detector", "µm/µm", true, func(k *kinematic.Scorecard) float64 { return k.Amplification })
	add("stiffness", "N/µm", false, func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 })
	add("first frequency", "Hz", false, func(k *kinematic.Scorecard) float64 { return k.FirstFrequency })
	add("shock level", "g", false, func(k *kinematic.Scorecard) float64 { return k.ShockLevel / g0 })
	add("thermal drift", "µm/K", true, func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 })
	add("Maxwell index", "", false, func(k *kinematic.Scorecard) float64 { return k.WeakestIndex })
	return b
}

// noNegZero returns x, with values that print as -0.00 at two decimals
// made zero.
func noNegZero(x float64) float64 {
	if math.Abs(x) < 0.005 {
		return 0
	}
	return x
}
