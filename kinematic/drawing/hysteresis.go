package drawing

import (
	"fmt"
	"io"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// um is micrometres per metre.
const um = 1e6

// loop is a hysteresis path as the drawing reads it: the load along the
// cycle's direction and the displacement along it, from the seated pose.
type loop struct {
	xy       plotter.XYs // load (N or N·m), displacement (µm)
	dev      plotter.XYs // load, departure from the secant (µm)
	dir      r3.Vec      // unit direction of the load
	moment   bool        // the cycle is a couple only: x is N·m
	residual float64     // along dir, µm
}

// newLoop reads h: the direction of its largest step force (or couple,
// for a cycle of couples only) and the path along it, starting at the
// seated pose.
func newLoop(h kinematic.Hysteresis) (*loop, error) {
	if len(h.Path) == 0 {
		return nil, fmt.Errorf("drawing: h.Path: %w: no steps to draw", kinematic.ErrDegenerate)
	}
	l := &loop{}
	var big float64
	for i, s := range h.Path {
		for _, v := range [...]struct {
			name string
			v    r3.Vec
		}{{"Force", s.Force}, {"Moment", s.Moment}, {"Displacement", s.Displacement}, {"Tilt", s.Tilt}} {
			if !finite(v.v.X) || !finite(v.v.Y) || !finite(v.v.Z) {
				return nil, fmt.Errorf("drawing: h.Path[%d].%s: %w: %v", i, v.name, kinematic.ErrNonFinite, v.v)
			}
		}
		if n := r3.Norm(s.Force); n > big {
			big, l.dir = n, r3.Scale(1/n, s.Force)
		}
	}
	if big == 0 {
		l.moment = true
		for _, s := range h.Path {
			if n := r3.Norm(s.Moment); n > big {
				big, l.dir = n, r3.Scale(1/n, s.Moment)
			}
		}
	}
	if big == 0 || math.IsInf(big, 0) {
		return nil, fmt.Errorf("drawing: h.Path: %w: the cycle has no load to draw against (largest %g)", kinematic.ErrDegenerate, big)
	}
	l.xy = plotter.XYs{{}}
	for _, s := range h.Path {
		x, y := r3.Dot(s.Force, l.dir), r3.Dot(s.Displacement, l.dir)*um
		if l.moment {
			x, y = r3.Dot(s.Moment, l.dir), r3.Dot(s.Tilt, l.dir)*um
		}
		l.xy = append(l.xy, plotter.XY{X: x, Y: y})
	}
	if !finite(h.Residual.X) || !finite(h.Residual.Y) || !finite(h.Residual.Z) || !finite(h.Energy) {
		return nil, fmt.Errorf("drawing: h.Residual, h.Energy: %w", kinematic.ErrNonFinite)
	}
	l.residual = l.xy[len(l.xy)-1].Y
	// The departure from the straight line through the two extremes of
	// the load magnifies the loop.
	lo, hi := 0, 0
	for i, p := range l.xy {
		if p.X < l.xy[lo].X {
			lo = i
		}
		if p.X > l.xy[hi].X {
			hi = i
		}
	}
	k := 0.0
	if dx := l.xy[hi].X - l.xy[lo].X; dx > 0 {
		k = (l.xy[hi].Y - l.xy[lo].Y) / dx
	}
	for _, p := range l.xy {
		l.dev = append(l.dev, plotter.XY{X: p.X, Y: p.Y - (l.xy[lo].Y + k*(p.X-l.xy[lo].X))})
	}
	for _, p := range append(append(plotter.XYs(nil), l.xy...), l.dev...) {
		if !finite(p.X) || !finite(p.Y) || math.Abs(p.Y) > 1e300 {
			return nil, fmt.Errorf("drawing: h.Path: %w: a displacement of %g µm is out of the drawing's range", kinematic.ErrRange, p.Y)
		}
	}
	return l, nil
}

// HysteresisPlotters returns the path of Hysteresis as plotters: the
// loop (the displacement of the point of interest along the load, µm,
// against the load along its direction, N, from the seated pose) and the
// residual after the cycle, a point at zero load.
func HysteresisPlotters(h kinematic.Hysteresis, opt *Options) (path *plotter.Line, residual *plotter.Scatter, err error) {
	l, err := newLoop(h)
	if err != nil {
		return nil, nil, err
	}
	path, residual, err = loopPlotters(l.xy, l.residual)
	return path, residual, err
}

func loopPlotters(xy plotter.XYs, res float64) (*plotter.Line, *plotter.Scatter, error) {
	path, err := plotter.NewLine(xy)
	if err != nil {
		return nil, nil, err
	}
	path.Color, path.Width = ink, 1.5
	residual, err := plotter.NewScatter(plotter.XYs{{X: 0, Y: res}})
	if err != nil {
		return nil, nil, err
	}
	residual.GlyphStyle = draw.GlyphStyle{Color: red, Radius: 4, Shape: draw.CircleGlyph{}}
	return path, residual, nil
}

// Hysteresis writes to w the hysteresis of the point of interest under a
// load cycle (kinematic.Model.Hysteresis): above, its displacement along
// the load, µm, against the load along the direction of the cycle's
// largest force, N (for a cycle of couples only, the tilt about the
// couple's direction, µrad, against the couple, N·m), from the seated
// pose through every step; below, the same path less the straight line
// through its two extremes, which magnifies the loop. The residual after
// the cycle is a red dot at zero load on both, its component along the
// load named in the legend; the notes give the residual displacement and
// tilt as 3-D magnitudes with their directions, and the energy lost per
// cycle.
func Hysteresis(w io.Writer, h kinematic.Hysteresis, opt *Options) error {
	o := opt.orDefault()
	l, err := newLoop(h)
	if err != nil {
		return err
	}
	what, load, unit := "displacement", "load", "N"
	if l.moment {
		what, load, unit = "tilt", "couple", "N·m"
	}
	top := newPlot(o.title(fmt.Sprintf("Hysteresis of the %s under a load cycle (micro-slip at the contacts)", o.pointName())))
	path, res, err := loopPlotters(l.xy, l.residual)
	if err != nil {
		return err
	}
	grid := plotter.NewGrid()
	grid.Vertical.Color, grid.Horizontal.Color = faintFill, faintFill
	top.Add(grid, path, res)
	top.Legend.Add("path from the seated pose", path)
	top.Legend.Add(fmt.Sprintf("residual after the cycle, its component along the %s: %s µ%s (the 3-D magnitude is in the notes)", load, idraw.Sig(l.residual), map[bool]string{false: "m", true: "rad"}[l.moment]), res)
	top.Legend.Top, top.Legend.Left = true, true
	top.Legend.Padding = 3
	top.Legend.XOffs = 6
	dirS := vecString(l.dir)
	top.X.Label.Text = fmt.Sprintf("%s along %s, %s", load, dirS, unit)
	top.Y.Label.Text = fmt.Sprintf("%s along it, µ%s", what, map[bool]string{false: "m", true: "rad"}[l.moment])

	bottom := newPlot("")
	dpath, dres, err := loopPlotters(l.dev, l.dev[len(l.dev)-1].Y)
	if err != nil {
		return err
	}
	dpath.Color = blue
	grid2 := plotter.NewGrid()
	grid2.Vertical.Color, grid2.Horizontal.Color = faintFill, faintFill
	bottom.Add(grid2, dpath, dres)
	bottom.X.Label.Text = top.X.Label.Text
	bottom.Y.Label.Text = fmt.Sprintf("less the line through the extremes, µ%s", map[bool]string{false: "m", true: "rad"}[l.moment])
	bottom.X.Min, bottom.X.Max = top.X.Min, top.X.Max

	notes := []string{fmt.Sprintf("residual at the %s after the cycle: displacement %s µm along %s, tilt %s µrad (3-D magnitudes; the red dot is the component along the %s); energy lost per cycle %s J with mu %s",
		o.pointName(), idraw.Sig(r3.Norm(h.Residual)*um), vecString(unitOr(h.Residual)), idraw.Sig(r3.Norm(h.ResidualTilt)*um),
		load, idraw.Sig(h.Energy), idraw.Sig(h.Mu))}
	if h.Case != "" {
		notes = append(notes, fmt.Sprintf("the cycle's loads are added to case %q; %d steps", h.Case, len(h.Path)))
	}
	notes = append(notes, "the contacts follow Mindlin's partial slip with Masing's memory of the load path; the lower plot is the upper less the straight line through its two extremes")
	return write(w, o, top.Title.Text, figWidth, figHeight*1.25, func(c draw.Canvas) {
		mc, _, lines, lh := areas(c, false, o.notes(notes...))
		sty := noteStyle()
		for i, ln := range lines {
			c.FillText(sty, vg.Point{X: c.Min.X + 8, Y: c.Min.Y + 8 + lh*vg.Length(len(lines)-1-i)}, ln)
		}
		// Aligned so that the two load axes line up.
		cs := plot.Align([][]*plot.Plot{{top}, {bottom}}, draw.Tiles{Rows: 2, Cols: 1, PadY: 12}, mc)
		top.Draw(cs[0][0])
		bottom.Draw(cs[1][0])
	})
}

// unitOr returns v's unit vector, or zero for a zero v.
func unitOr(v r3.Vec) r3.Vec {
	if n := r3.Norm(v); n > 0 {
		return r3.Scale(1/n, v)
	}
	return v
}

// vecString formats a unit direction with components below 1e-9 as 0:
// the direction of a residual formed from small differences carries
// rounding of that order in its zero components.
func vecString(v r3.Vec) string {
	c := [3]float64{v.X, v.Y, v.Z}
	for i := range c {
		if math.Abs(c[i]) < 1e-9 {
			c[i] = 0
		}
	}
	return fmt.Sprintf("(%.3g, %.3g, %.3g)", c[0], c[1], c[2])
}
