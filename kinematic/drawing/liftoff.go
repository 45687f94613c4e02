package drawing

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// liftN is the number of cells of a lift-off map along each side.
const liftN = 150

// grid is a plotter.GridXYZ of cell values, mm.
type grid struct {
	x0, y0, dx, dy float64
	n              int
	z              []float64
}

func (g grid) Dims() (c, r int)   { return g.n, g.n }
func (g grid) Z(c, r int) float64 { return g.z[r*g.n+c] }
func (g grid) X(c int) float64    { return g.x0 + (float64(c)+0.5)*g.dx }
func (g grid) Y(r int) float64    { return g.y0 + (float64(r)+0.5)*g.dy }

// liftOff is the lift-off map as plotters, with its cap, N.
type liftOff struct {
	heat   *plotter.HeatMap
	marks  *planView
	cap    float64
	height float64
	caseN  string
}

func newLiftOff(b *design.Built, o Options) (*liftOff, error) {
	d := b.Design()
	if len(d.Cases) == 0 {
		return nil, fmt.Errorf("drawing: a lift-off map needs a load case, the design has none: %w", kinematic.ErrDegenerate)
	}
	if !finite(o.FaceHeight) {
		return nil, fmt.Errorf("drawing: Options.FaceHeight: %w: %g", kinematic.ErrNonFinite, o.FaceHeight)
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
	const margin = 0.02
	g := grid{x0: lo.X - margin, y0: lo.Y - margin, n: liftN}
	g.dx, g.dy = (hi.X-lo.X+2*margin)/liftN, (hi.Y-lo.Y+2*margin)/liftN
	pts := make([]r3.Vec, 0, liftN*liftN)
	for r := range liftN {
		for c := range liftN {
			pts = append(pts, r3.Vec{X: g.X(c), Y: g.Y(r), Z: z})
		}
	}
	lift, err := b.Model().LiftOff(d.Cases[0], r3.Vec{Z: -1}, pts)
	if err != nil {
		return nil, err
	}
	// Near the lines where a push stops unloading anything the limit
	// grows without bound; the scale stops at four times the preload.
	capN := 0.0
	for _, p := range d.Preloads {
		f, _, _ := p.AtSeat() // the model was built: the law is valid
		capN += 4 * f
	}
	if capN == 0 {
		capN = 100
	}
	for _, l := range lift {
		v := l.Force
		if math.IsInf(v, 1) {
			v = math.NaN() // never unloads
		}
		g.z = append(g.z, v)
	}
	g.x0, g.y0, g.dx, g.dy = g.x0*mm, g.y0*mm, g.dx*mm, g.dy*mm
	hm := plotter.NewHeatMap(g, scale(0, capN).Palette(64))
	hm.Min, hm.Max = 0, capN
	top2, _ := scale(0, capN).At(capN)
	hm.Overflow = top2
	hm.NaN = color.Gray{Y: 0xf4}
	hm.Rasterized = true
	v := &planView{}
	for i, pr := range c.Pairs {
		v.marks = append(v.marks, mark{pr.Ball.Centre.X * mm, pr.Ball.Centre.Y * mm, "ball " + pairName(c, i), draw.RingGlyph{}, ink})
	}
	for i, p := range d.Preloads {
		name := p.Name // the file's name for the element, or its number, as on the plan
		if name == "" {
			name = fmt.Sprintf("preload %d", i+1)
		}
		v.marks = append(v.marks, mark{p.Point.X * mm, p.Point.Y * mm, fmt.Sprintf("%s: %s N", name, idraw.Sig(seated(p))), draw.TriangleGlyph{}, green})
	}
	if d.Payload.Mass > 0 {
		v.marks = append(v.marks, mark{d.Payload.Centre.X * mm, d.Payload.Centre.Y * mm, "centre of mass (weight, inertia)", draw.RingGlyph{}, blue})
	}
	for _, lc := range d.Cases {
		for i, a := range lc.Applied {
			f2 := r3.Dot(a.F, a.F)
			if f2 == 0 {
				continue
			}
			q := r3.Scale(1/f2, r3.Cross(a.F, a.M))
			// A file's applied loads have no names: the case's name,
			// and the load's place in its "applied" list when there
			// are several.
			name := lc.Name + ": applied load"
			if len(lc.Applied) > 1 {
				name = fmt.Sprintf("%s: applied[%d]", lc.Name, i)
			}
			v.marks = append(v.marks, mark{q.X * mm, q.Y * mm, fmt.Sprintf("%s, %s N", name, idraw.Sig(math.Sqrt(f2))), draw.CrossGlyph{}, blue})
		}
	}
	v.x0, v.x1, v.y0, v.y1 = g.x0, g.x0+g.dx*liftN, g.y0, g.y0+g.dy*liftN
	return &liftOff{heat: hm, marks: v, cap: capN, height: height, caseN: d.Cases[0].Name}, nil
}

// LiftOffPlotters returns the lift-off map of LiftOff as plotters in mm:
// the heat map (a *plotter.HeatMap whose Max is the scale's cap, N) and
// the labelled points where the loads act.
func LiftOffPlotters(b *design.Built, opt *Options) (heat *plotter.HeatMap, points plot.Plotter, err error) {
	l, err := newLiftOff(b, opt.orDefault())
	if err != nil {
		return nil, nil, err
	}
	return l.heat, l.marks, nil
}

// LiftOff writes the lift-off map of a built design to w: on a 150 × 150
// grid over the balls' plan (with 20 mm of margin), the largest push, N,
// along −z on the face Options.FaceHeight above the highest ball centre
// before a contact unloads, added to the design's first load case
// (kinematic.Model.LiftOff). The scale is capped at four times the total
// preload (100 N without preload), stated on it: pushes above it are in
// the top colour; where a push never unloads a contact the cell is pale
// grey. The balls, the preload points (named as the design names them,
// with the force at the seated position, as on the plan), the centre of
// mass (where weight and inertia act) and the applied loads of every case
// (named by their case, "applied[i]" when it has several, with their
// magnitude, N) are marked. The design needs a load case.
func LiftOff(w io.Writer, b *design.Built, opt *Options) error {
	o := opt.orDefault()
	l, err := newLiftOff(b, o)
	if err != nil {
		return err
	}
	p := newPlot(o.title("Lift-off map: downward push on the top face before a contact unloads"))
	p.Add(l.heat, l.marks)
	p.X.Label.Text, p.Y.Label.Text = "x, mm", "y, mm"
	bar := colourBar(scale(0, l.cap), fmt.Sprintf("largest push, N (scale capped at %s N)", idraw.Sig(l.cap)))
	capNote := fmt.Sprintf("pushes above %s N, four times the total preload, are drawn in the top colour", idraw.Sig(l.cap))
	if len(b.Design().Preloads) == 0 {
		capNote = "pushes above 100 N are drawn in the top colour (the design has no preload)"
	}
	notes := o.notes(
		fmt.Sprintf("push along -z at %.3g mm above the balls, added to case %q; pale grey: the push never unloads a contact", l.height*mm, l.caseN),
		capNote,
	)
	return write(w, o, p.Title.Text, figWidth, figHeight, func(c draw.Canvas) {
		main, _, _, _ := areas(c, true, notes)
		equalScale(p, main, l.marks)
		layout(c, p, bar, notes)
	})
}
