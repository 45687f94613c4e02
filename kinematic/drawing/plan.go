package drawing

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// mm converts m to mm.
const mm = 1e3

// mark is a labelled point of a picture, mm.
type mark struct {
	x, y  float64
	label string
	glyph draw.GlyphDrawer
	col   color.Color
}

// planView is the plan as a plot.Plotter, in mm.
type planView struct {
	balls   []mark // glyph nil; r in radius
	radius  []float64
	lines   []planLine
	fans    []fan
	dots    []mark // contacts, coloured
	values  []float64
	cm      palette.ColorMap
	marks   []mark
	x0, x1  float64
	y0, y1  float64
	offAxes []string

	// What the legend note may name: groove axes, instantaneous axes
	// drawn as lines and vertical ones drawn as points.
	grooveAxes, axisLines, axisPoints int
}

type planLine struct {
	x0, y0, x1, y1 float64
	dash           []vg.Length
	col            color.Color
	width          vg.Length
}

// fan is a circular sector at (x, y) of radius r from angle a0 to a1, rad.
type fan struct {
	x, y, r, a0, a1 float64
	col             color.Color
}

// PlanPlotter returns the plan view of a built design as a plot.Plotter
// in mm, x to the right and y up, looking down on the base; Plan draws it
// as a ready figure, and a caller may add it to a plot of their own (set
// equal scales on its axes). ev is b's evaluation (b.Evaluate). The
// contacts' Maxwell centre indices are coloured on a scale fitted to
// them; labels are placed clear of each other, each with a leader.
func PlanPlotter(b *design.Built, ev design.Evaluation, opt *Options) (plot.Plotter, error) {
	v, err := newPlan(b, ev, opt.orDefault())
	if err != nil {
		return nil, err
	}
	return v, nil
}

func newPlan(b *design.Built, ev design.Evaluation, o Options) (*planView, error) {
	c := b.Coupling()
	g, err := c.Geometry()
	if err != nil {
		return nil, err
	}
	cs := b.Contacts()
	if err := checkPlan(c, cs, ev, o); err != nil {
		return nil, err
	}
	d := b.Design()
	v := &planView{}
	lo, hi := bounds(c)
	maxR := 0.0
	var centroid r3.Vec
	for _, pr := range c.Pairs {
		maxR = math.Max(maxR, pr.Ball.Radius)
		centroid = r3.Add(centroid, r3.Scale(1/float64(len(c.Pairs)), pr.Ball.Centre))
	}
	fanR := 2.2 * maxR * mm
	v.seats(c, g, o, centroid, fanR)
	v.grooves(c, g)
	v.axes(c, g, lo, hi)
	v.points(g, ev, d, o)
	v.shock(ev, d, lo, hi)
	v.keepOuts(o)
	v.indices(ev, cs)
	v.extent(lo, hi, fanR)
	return v, nil
}

// checkPlan checks that the evaluation and the options fit the coupling.
func checkPlan(c kinematic.Coupling, cs []kinematic.Contact, ev design.Evaluation, o Options) error {
	if len(ev.Stability.Contacts) != len(cs) {
		return fmt.Errorf("drawing: ev has %d contacts' Maxwell indices, the design %d contacts: %w", len(ev.Stability.Contacts), len(cs), kinematic.ErrDegenerate)
	}
	if o.Windows != nil && len(o.Windows) != len(c.Pairs) {
		return fmt.Errorf("drawing: Options.Windows: %w: %d windows for %d pairs", kinematic.ErrDegenerate, len(o.Windows), len(c.Pairs))
	}
	for i, k := range o.KeepOuts {
		if !finite(k.At.X) || !finite(k.At.Y) || !finite(k.Clearance) || !finite(k.Reach) {
			return fmt.Errorf("drawing: Options.KeepOuts[%d]: %w", i, kinematic.ErrNonFinite)
		}
	}
	for i, w := range o.Windows {
		if !finite(w.Min) || !finite(w.Max) {
			return fmt.Errorf("drawing: Options.Windows[%d]: %w", i, kinematic.ErrNonFinite)
		}
	}
	return nil
}

// seats draws each seat's outline in plan and, at the grooves, the
// allowed and kept-out directions as fans.
func (v *planView) seats(c kinematic.Coupling, g kinematic.Geometry, o Options, centroid r3.Vec, fanR float64) {
	grooved := make([]bool, len(c.Pairs))
	for _, gr := range g.Grooves {
		grooved[gr.Pair] = true
	}
	for i, pr := range c.Pairs {
		bl := pr.Ball
		v.balls = append(v.balls, mark{x: bl.Centre.X * mm, y: bl.Centre.Y * mm, label: "ball " + pairName(c, i)})
		v.radius = append(v.radius, bl.Radius*mm)
		// The seat's outline in plan: a groove's flanks (from the
		// geometry's grooves, below), a socket's triangle, a flat's
		// square pad, a cone's rim.
		var outline []r3.Vec
		switch st := pr.Seat.(type) {
		case kinematic.Trihedral:
			a := math.Atan2(st.Azimuth.Y, st.Azimuth.X)
			for k := range 4 {
				th := a + 2*math.Pi*float64(k)/3
				outline = append(outline, r3.Add(bl.Centre, r3.Vec{X: 2 * bl.Radius * math.Cos(th), Y: 2 * bl.Radius * math.Sin(th)}))
			}
		case kinematic.Flat:
			for k := range 5 {
				th := math.Pi/4 + math.Pi/2*float64(k)
				outline = append(outline, r3.Add(bl.Centre, r3.Vec{X: 2 * bl.Radius * math.Cos(th), Y: 2 * bl.Radius * math.Sin(th)}))
			}
		case kinematic.Cone:
			for k := range 33 {
				th := 2 * math.Pi * float64(k) / 32
				outline = append(outline, r3.Add(bl.Centre, r3.Vec{X: 1.6 * bl.Radius * math.Cos(th), Y: 1.6 * bl.Radius * math.Sin(th)}))
			}
		}
		for k := 1; k < len(outline); k++ {
			a, e := outline[k-1], outline[k]
			v.lines = append(v.lines, planLine{a.X * mm, a.Y * mm, e.X * mm, e.Y * mm, nil, ink, 1.5})
		}
		if !grooved[i] {
			continue // keep-outs and windows are for grooves
		}
		if o.Windows != nil {
			w := o.Windows[i]
			ref := 0.0
			if w.From == kinematic.Radial {
				ref = math.Atan2(centroid.Y-bl.Centre.Y, centroid.X-bl.Centre.X)
			}
			lo, hi := w.Min, w.Max
			if hi-lo >= math.Pi {
				lo, hi = 0, math.Pi
			}
			for _, k := range []float64{0, math.Pi} {
				v.fans = append(v.fans, fan{bl.Centre.X * mm, bl.Centre.Y * mm, fanR, ref + lo + k, ref + hi + k, winFill})
			}
		}
		for _, k := range o.KeepOuts {
			dx, dy := k.At.X-bl.Centre.X, k.At.Y-bl.Centre.Y
			if k.Reach > 0 && math.Hypot(dx, dy) > k.Reach {
				continue
			}
			th := math.Atan2(dy, dx)
			for _, s := range []float64{0, math.Pi} {
				v.fans = append(v.fans, fan{bl.Centre.X * mm, bl.Centre.Y * mm, fanR, th + s - k.Clearance, th + s + k.Clearance, keepFill})
			}
		}
	}
}

// grooves draws the vee flanks' top edges and the groove axes.
func (v *planView) grooves(c kinematic.Coupling, g kinematic.Geometry) {
	for _, gr := range g.Grooves {
		bl := c.Pairs[gr.Pair].Ball
		u := gr.Direction
		n := math.Hypot(u.X, u.Y)
		if n == 0 {
			continue
		}
		u = r3.Vec{X: u.X / n, Y: u.Y / n}
		// The flanks' top edges, 2 radii long either side of the ball,
		// 1.2 radii off the groove axis.
		side := r3.Vec{X: -u.Y, Y: u.X}
		for _, sg := range []float64{1, -1} {
			off := r3.Add(bl.Centre, r3.Scale(sg*bl.Radius*1.2, side))
			a, e := r3.Add(off, r3.Scale(-2*bl.Radius, u)), r3.Add(off, r3.Scale(2*bl.Radius, u))
			v.lines = append(v.lines, planLine{a.X * mm, a.Y * mm, e.X * mm, e.Y * mm, nil, ink, 1.5})
		}
		l := 4 * bl.Radius
		a, e := r3.Sub(bl.Centre, r3.Scale(l, u)), r3.Add(bl.Centre, r3.Scale(l, u))
		v.lines = append(v.lines, planLine{a.X * mm, a.Y * mm, e.X * mm, e.Y * mm, []vg.Length{6, 3}, blue, 0.8})
		v.grooveAxes++
	}
}

// axes draws the instantaneous axes of seat pairs on the drawing and
// lists those off it.
func (v *planView) axes(c kinematic.Coupling, g kinematic.Geometry, lo, hi r3.Vec) {
	size := math.Max(hi.X-lo.X, hi.Y-lo.Y)
	mid := r3.Scale(0.5, r3.Add(lo, hi))
	for _, ax := range g.Axes {
		name := pairName(c, ax.A) + pairName(c, ax.B)
		if ax.Parallel {
			v.offAxes = append(v.offAxes, fmt.Sprintf("seats %s: parallel grooves, a free translation", name))
			continue
		}
		q := ax.Point
		if math.Hypot(q.X-mid.X, q.Y-mid.Y) > 0.75*size {
			v.offAxes = append(v.offAxes, fmt.Sprintf("axis of seats %s: through (%.0f, %.0f) mm, direction (%.2f, %.2f, %.2f), off the drawing",
				name, q.X*mm, q.Y*mm, ax.Direction.X+0, ax.Direction.Y+0, ax.Direction.Z+0))
			continue
		}
		u := ax.Direction
		n := math.Hypot(u.X, u.Y)
		if n < 1e-9 {
			v.marks = append(v.marks, mark{q.X * mm, q.Y * mm, "axis " + name + " (vertical)", draw.CircleGlyph{}, blue})
			v.axisPoints++
			continue
		}
		u = r3.Vec{X: u.X / n, Y: u.Y / n}
		l := 0.25 * size
		a, e := r3.Sub(q, r3.Scale(l, u)), r3.Add(q, r3.Scale(l, u))
		v.lines = append(v.lines, planLine{a.X * mm, a.Y * mm, e.X * mm, e.Y * mm, []vg.Length{8, 2, 2, 2}, faint, 0.8})
		v.axisLines++
	}
}

// legend returns the note that names the line styles of the plan, only
// those drawn.
func (v *planView) legend() string {
	var parts []string
	if v.grooveAxes > 0 {
		parts = append(parts, "groove axes dashed blue")
	}
	if v.axisLines > 0 {
		parts = append(parts, "instantaneous axes of seat pairs dash-dot grey")
	}
	if v.axisPoints > 0 {
		parts = append(parts, "vertical instantaneous axes of seat pairs blue discs")
	}
	parts = append(parts, "dots: contact points")
	return strings.Join(parts, "; ")
}

// points marks the coupling centre, the thermal centre, the preloads, the
// centre of mass and the point of interest.
func (v *planView) points(g kinematic.Geometry, ev design.Evaluation, d design.Design, o Options) {
	if g.HasCentre {
		v.marks = append(v.marks, mark{g.Centre.X * mm, g.Centre.Y * mm, "grooves meet", draw.CrossGlyph{}, blue})
	}
	if ev.Drift != nil && ev.Drift.HasCentre {
		v.marks = append(v.marks, mark{ev.Drift.Centre.X * mm, ev.Drift.Centre.Y * mm, "thermal centre", draw.PyramidGlyph{}, red})
	}
	for i, p := range d.Preloads {
		name := p.Name // the file's name for the element, or its number
		if name == "" {
			name = fmt.Sprintf("preload %d", i+1)
		}
		v.marks = append(v.marks, mark{p.Point.X * mm, p.Point.Y * mm, fmt.Sprintf("%s: %s N", name, idraw.Sig(seated(p))), draw.TriangleGlyph{}, green})
	}
	if d.Payload.Mass > 0 {
		v.marks = append(v.marks, mark{d.Payload.Centre.X * mm, d.Payload.Centre.Y * mm, "centre of mass", draw.RingGlyph{}, ink})
	}
	v.marks = append(v.marks, mark{d.Point.X * mm, d.Point.Y * mm, o.pointName(), draw.SquareGlyph{}, ink})
}

// shock draws the worst shock's direction as an arrow from the centre of
// mass.
func (v *planView) shock(ev design.Evaluation, d design.Design, lo, hi r3.Vec) {
	if sh := ev.Shock; sh != nil && sh.Unload > 0 && finite(sh.Unload) && len(sh.First) > 0 {
		// The worst shock: an arrow from the centre of mass along the
		// plan projection of the base's acceleration that unloads a
		// contact soonest.
		txt := fmt.Sprintf("worst shock %s g, unloads %s", idraw.Sig(sh.Unload/kinematic.StandardGravity), sh.First[0])
		q := d.Payload.Centre
		u := sh.Direction
		if n := math.Hypot(u.X, u.Y); n > 0.2 {
			l := 0.3 * math.Max(hi.X-lo.X, hi.Y-lo.Y)
			e := r3.Add(q, r3.Vec{X: l * u.X / n, Y: l * u.Y / n})
			v.lines = append(v.lines, planLine{q.X * mm, q.Y * mm, e.X * mm, e.Y * mm, nil, red, 1.2})
			// The arrow's head: two strokes 0.08 of its length, 25° off.
			back := math.Atan2(-u.Y, -u.X)
			for _, da := range []float64{-25 * math.Pi / 180, 25 * math.Pi / 180} {
				h := r3.Add(e, r3.Vec{X: 0.08 * l * math.Cos(back+da), Y: 0.08 * l * math.Sin(back+da)})
				v.lines = append(v.lines, planLine{e.X * mm, e.Y * mm, h.X * mm, h.Y * mm, nil, red, 1.2})
			}
			v.marks = append(v.marks, mark{e.X * mm, e.Y * mm, txt, nil, red})
		} else {
			dir := "up"
			if u.Z < 0 {
				dir = "down"
			}
			v.marks = append(v.marks, mark{q.X * mm, q.Y * mm, txt + " (" + dir + ")", draw.RingGlyph{}, red})
		}
	}
}

// keepOuts marks the packaging obstacles.
func (v *planView) keepOuts(o Options) {
	for _, k := range o.KeepOuts {
		name := k.Name
		if name == "" {
			name = "keep-out"
		}
		v.marks = append(v.marks, mark{k.At.X * mm, k.At.Y * mm, name, draw.CrossGlyph{}, red})
	}
}

// indices places a dot at every contact, coloured by its Maxwell index at
// the ball centre, on a scale fitted to the values.
func (v *planView) indices(ev design.Evaluation, cs []kinematic.Contact) {
	lov, hiv := math.Inf(1), math.Inf(-1)
	for i, m := range ev.Stability.Contacts {
		v.dots = append(v.dots, mark{x: cs[i].Point.X * mm, y: cs[i].Point.Y * mm, label: m.Label})
		v.values = append(v.values, m.CentreIndex)
		lov, hiv = math.Min(lov, m.CentreIndex), math.Max(hiv, m.CentreIndex)
	}
	if !(hiv-lov > 1e-3) {
		// Every index the same: the scale spans 0.01 below it.
		lov = hiv - 0.01
	}
	v.cm = scale(lov, hiv)
}

// extent sets the drawing's extent: the balls with their fans, the marks
// and the lines. The margins about the balls (5 mm) and the marks (3 mm)
// shrink with a coupling under 25 mm across, to a fifth and an eighth of
// its size, so that a small coupling fills the frame (a 4 mm one was
// drawn in ±8 mm).
func (v *planView) extent(lo, hi r3.Vec, fanR float64) {
	// Extent: balls with the fans, marks, keep-outs.
	size := math.Max(hi.X-lo.X, hi.Y-lo.Y) * mm
	m := math.Max(fanR, math.Min(5, size/5))
	pad := math.Min(3, size/8)
	if size == 0 { // one ball: the margins as they were
		m, pad = math.Max(fanR, 5), 3
	}
	v.x0, v.x1, v.y0, v.y1 = lo.X*mm-m, hi.X*mm+m, lo.Y*mm-m, hi.Y*mm+m
	for _, k := range v.marks {
		v.x0, v.x1 = math.Min(v.x0, k.x-pad), math.Max(v.x1, k.x+pad)
		v.y0, v.y1 = math.Min(v.y0, k.y-pad), math.Max(v.y1, k.y+pad)
	}
	for _, l := range v.lines {
		v.x0, v.x1 = math.Min(v.x0, math.Min(l.x0, l.x1)), math.Max(v.x1, math.Max(l.x0, l.x1))
		v.y0, v.y1 = math.Min(v.y0, math.Min(l.y0, l.y1)), math.Max(v.y1, math.Max(l.y0, l.y1))
	}
}

// DataRange implements plot.DataRanger.
func (v *planView) DataRange() (xmin, xmax, ymin, ymax float64) { return v.x0, v.x1, v.y0, v.y1 }

// Plot implements plot.Plotter.
func (v *planView) Plot(c draw.Canvas, plt *plot.Plot) {
	tx, ty := plt.Transforms(&c)
	sx := float64(tx(1) - tx(0)) // pt per mm
	pt := func(x, y float64) vg.Point { return vg.Point{X: tx(x), Y: ty(y)} }
	var pl idraw.Placer
	for _, f := range v.fans {
		pts := []vg.Point{pt(f.x, f.y)}
		for k := 0; k <= 24; k++ {
			a := f.a0 + (f.a1-f.a0)*float64(k)/24
			pts = append(pts, pt(f.x+f.r*math.Cos(a), f.y+f.r*math.Sin(a)))
		}
		c.FillPolygon(f.col, c.ClipPolygonXY(pts))
	}
	for i, b := range v.balls {
		r := v.radius[i]
		var pts []vg.Point
		for k := range 48 {
			a := 2 * math.Pi * float64(k) / 48
			pts = append(pts, pt(b.x+r*math.Cos(a), b.y+r*math.Sin(a)))
		}
		c.FillPolygon(color.Gray{Y: 0xe4}, c.ClipPolygonXY(pts))
		c.StrokeLines(draw.LineStyle{Color: ink, Width: 0.8}, c.ClipLinesXY(append(pts, pts[0]))...)
		p := pt(b.x, b.y)
		pl.Disc(float64(p.X), -float64(p.Y), r*sx)
	}
	for _, l := range v.lines {
		a, e := pt(l.x0, l.y0), pt(l.x1, l.y1)
		c.StrokeLines(draw.LineStyle{Color: l.col, Width: l.width, Dashes: l.dash}, c.ClipLinesXY([]vg.Point{a, e})...)
		pl.Segment(float64(a.X), -float64(a.Y), float64(e.X), -float64(e.Y), float64(l.width))
	}
	for i, d := range v.dots {
		p := pt(d.x, d.y)
		if !c.Contains(p) {
			continue
		}
		c.DrawGlyph(draw.GlyphStyle{Color: colourAt(v.cm, v.values[i]), Radius: 4, Shape: draw.CircleGlyph{}}, p)
		c.DrawGlyph(draw.GlyphStyle{Color: ink, Radius: 4, Shape: draw.RingGlyph{}}, p)
		pl.Disc(float64(p.X), -float64(p.Y), 4.5)
	}
	for _, m := range v.marks {
		p := pt(m.x, m.y)
		if !c.Contains(p) {
			continue
		}
		if m.glyph != nil {
			c.DrawGlyph(draw.GlyphStyle{Color: m.col, Radius: 4, Shape: m.glyph}, p)
		}
		pl.Obstacle(idraw.Box{X0: float64(p.X) - 5, Y0: -float64(p.Y) - 5, X1: float64(p.X) + 5, Y1: -float64(p.Y) + 5})
	}
	sty := plt.X.Tick.Label
	sty.Font.Size = 9
	sty.Color = ink
	sty.XAlign, sty.YAlign = draw.XLeft, draw.YBottom
	labels := append(append([]mark(nil), v.balls...), v.marks...)
	// Labels are placed on the canvas where they can be: a label moved
	// onto it afterwards may cover its own mark.
	pl.Within(idraw.Box{X0: float64(c.Min.X), Y0: -float64(c.Max.Y), X1: float64(c.Max.X), Y1: -float64(c.Min.Y)})
	for _, m := range labels {
		p := pt(m.x, m.y)
		if !c.Contains(p) {
			continue
		}
		w, h := float64(sty.Width(m.label)), float64(sty.Height(m.label))
		b := pl.Place(float64(p.X), -float64(p.Y), w+2, h, 8)
		// Keep the label on the canvas.
		dx := math.Max(0, float64(c.Min.X)-b.X0) - math.Max(0, b.X1-float64(c.Max.X))
		dy := math.Max(0, -float64(c.Max.Y)-b.Y0) - math.Max(0, b.Y1+float64(c.Min.Y))
		b.X0, b.X1, b.Y0, b.Y1 = b.X0+dx, b.X1+dx, b.Y0+dy, b.Y1+dy
		lx, ly := idraw.Nearest(b, float64(p.X), -float64(p.Y))
		c.StrokeLine2(draw.LineStyle{Color: faint, Width: 0.6}, p.X, p.Y, vg.Length(lx), vg.Length(-ly))
		label(c, sty, vg.Point{X: vg.Length(b.X0 + 1), Y: vg.Length(-b.Y1)}, m.label)
	}
}

// Plan writes the plan view of a built design to w as a ready figure
// (PlanPlotter, to equal scales in mm): the balls to scale, the top edges
// of each groove's flanks and the outlines of sockets, flats and cones,
// the groove axes (dashed), the instantaneous axes of seat pairs near the
// coupling (dash-dot; those far off are listed in the notes only with
// Options.OffAxes), where the grooves meet, the thermal centre (when ev
// has a drift with one; a drift without one, Drift.HasCentre false, is
// said in the notes), the preload points, the centre of mass, the
// worst shock (ev.Shock: the base's acceleration that unloads a contact
// soonest, an arrow from the centre of mass along its plan projection,
// labelled with its level, g), the point of interest, the keep-outs and
// windows of Options, and each contact's Maxwell centre index,
// dimensionless, on a colour scale fitted to the indices drawn. ev is b's
// evaluation (b.Evaluate).
func Plan(w io.Writer, b *design.Built, ev design.Evaluation, opt *Options) error {
	o := opt.orDefault()
	v, err := newPlan(b, ev, o)
	if err != nil {
		return err
	}
	p := newPlot(o.title("Coupling, plan looking down"))
	p.Add(v)
	p.X.Label.Text, p.Y.Label.Text = "x, mm", "y, mm"
	notes := []string{v.legend()}
	if sh := ev.Shock; sh != nil && sh.Unload > 0 && finite(sh.Unload) && len(sh.First) > 0 {
		notes = append(notes, fmt.Sprintf("red arrow from the centre of mass: the base's acceleration that unloads a contact soonest (worst shock), case %q", ev.ShockCase))
	}
	if ev.Drift != nil && !ev.Drift.HasCentre {
		notes = append(notes, "no thermal centre: relative to the base the body neither turns nor strains in the plane of the ball centres")
	}
	if o.KeepOuts != nil || o.Windows != nil {
		notes = append(notes, "fans at the balls: groove directions allowed (green) and kept out (red)")
	}
	if o.OffAxes {
		notes = append(notes, v.offAxes...)
	}
	bar := colourBar(v.cm, "Maxwell index at the contact point")
	return write(w, o, p.Title.Text, figWidth, figHeight, func(c draw.Canvas) {
		notes := o.notes(notes...)
		main, _, _, _ := areas(c, true, notes)
		equalScale(p, main, v)
		layout(c, p, bar, notes)
	})
}

// equalScale widens the shorter range of p so that a mm is as long on
// both axes of the data area the plot would have on c .
func equalScale(p *plot.Plot, c draw.Canvas, v *planView) {
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = v.x0, v.x1, v.y0, v.y1
	for range 3 {
		da := p.DataCanvas(c)
		w, h := float64(da.Max.X-da.Min.X), float64(da.Max.Y-da.Min.Y)
		rx, ry := (p.X.Max-p.X.Min)/w, (p.Y.Max-p.Y.Min)/h
		if rx > ry {
			mid, half := (p.Y.Min+p.Y.Max)/2, rx*h/2
			p.Y.Min, p.Y.Max = mid-half, mid+half
		} else {
			mid, half := (p.X.Min+p.X.Max)/2, ry*w/2
			p.X.Min, p.X.Max = mid-half, mid+half
		}
	}
}
