package drawing

import (
	"fmt"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// curveN is the number of points of a drawn force law.
const curveN = 400

// preloadCurve is a force law's drawing: its plotters, their legend
// names, and the figures the notes state.
type preloadCurve struct {
	ps          []plot.Plotter
	names       []string
	f0, slope   float64 // N and N/m at the seated gap
	hold, holdG float64 // the largest force at a gap ≥ the seated one, N, and where, m
}

func newPreloadCurve(p kinematic.Preload, o Options) (*preloadCurve, error) {
	if p.Law == nil {
		return nil, fmt.Errorf("drawing: p.Law: %w: the preload has no force law to draw", kinematic.ErrDegenerate)
	}
	f0, slope, err := p.Law.Force(p.Gap)
	if err != nil {
		return nil, fmt.Errorf("drawing: p: %w", err)
	}
	if !finite(slope) {
		return nil, fmt.Errorf("drawing: p.Gap: %w: the law's stiffness at %g m is infinite", kinematic.ErrRange, p.Gap)
	}
	if !finite(o.Limit) {
		return nil, fmt.Errorf("drawing: Options.Limit: %w: %g", kinematic.ErrNonFinite, o.Limit)
	}
	// The gap range: out to where the force has fallen below 15 % of the
	// seated force (a magnet), or to 1.1 times the last gap at which it
	// still changes, and at least twice the seated gap.
	force := func(g float64) (float64, bool) {
		f, _, err := p.Law.Force(g)
		return f, err == nil && finite(f)
	}
	reach := math.Max(2*p.Gap, 1e-3)
	if t, ok := p.Law.(*kinematic.ForceTable); ok && len(t.Points) > 0 {
		reach = math.Max(reach, 1.1*t.Points[len(t.Points)-1].Gap)
	} else {
		for g := math.Max(p.Gap, 1e-6); g < 1e3; g *= 1.05 {
			f, ok := force(g)
			if !ok || f < 0.15*f0 {
				reach = math.Max(reach, g)
				break
			}
		}
	}
	if !finite(reach) || reach <= 0 {
		return nil, fmt.Errorf("drawing: p.Law: %w: no range of gaps to draw", kinematic.ErrRange)
	}
	pc := &preloadCurve{f0: f0, slope: slope, hold: f0, holdG: p.Gap}
	xy := make(plotter.XYs, 0, curveN+1)
	for k := 0; k <= curveN; k++ {
		g := reach * float64(k) / curveN
		f, ok := force(g)
		if !ok {
			return nil, fmt.Errorf("drawing: p.Law: %w: the force at %g m cannot be computed", kinematic.ErrRange, g)
		}
		xy = append(xy, plotter.XY{X: g * mm, Y: f})
		if g >= p.Gap && f > pc.hold {
			pc.hold, pc.holdG = f, g
		}
	}
	line, err := plotter.NewLine(xy)
	if err != nil {
		return nil, err
	}
	line.Color, line.Width = ink, 2
	pc.add(line, "force of the element against its gap")

	// The tangent at the seat: the linear model the stiffness uses.
	h := 0.25 * reach
	tan := plotter.XYs{{X: math.Max(0, p.Gap-h) * mm, Y: f0 + slope*(math.Max(0, p.Gap-h)-p.Gap)}, {X: (p.Gap + h) * mm, Y: f0 + slope*h}}
	tl, err := plotter.NewLine(tan)
	if err != nil {
		return nil, err
	}
	tl.Color, tl.Dashes, tl.Width = blue, []vg.Length{4, 3}, 1.2
	pc.add(tl, fmt.Sprintf("tangent at the seat: dF/dgap = %s N/mm", idraw.Sig(slope/1e3)))

	if o.Limit > 0 {
		ll, err := plotter.NewLine(plotter.XYs{{X: 0, Y: o.Limit}, {X: reach * mm, Y: o.Limit}})
		if err != nil {
			return nil, err
		}
		ll.Color, ll.Dashes, ll.Width = red, []vg.Length{2, 2}, 1
		pc.add(ll, fmt.Sprintf("%s: %s N", o.limitName(), idraw.Sig(o.Limit)))
	}
	op, err := plotter.NewScatter(plotter.XYs{{X: p.Gap * mm, Y: f0}})
	if err != nil {
		return nil, err
	}
	op.GlyphStyle = draw.GlyphStyle{Color: green, Radius: 6, Shape: draw.RingGlyph{}}
	pc.add(op, fmt.Sprintf("seated: %s N at %s mm", idraw.Sig(f0), idraw.Sig(p.Gap*mm)))
	rp, err := plotter.NewScatter(plotter.XYs{{X: pc.holdG * mm, Y: pc.hold}})
	if err != nil {
		return nil, err
	}
	rp.GlyphStyle = draw.GlyphStyle{Color: red, Radius: 4, Shape: draw.CrossGlyph{}}
	what := "lift-off = runaway: the force only falls as the part lifts"
	if pc.hold > f0*(1+1e-9) {
		what = fmt.Sprintf("runaway: the most the element holds as the part lifts, %s N at %s mm", idraw.Sig(pc.hold), idraw.Sig(pc.holdG*mm))
	}
	pc.add(rp, what)
	return pc, nil
}

func (pc *preloadCurve) add(p plot.Plotter, name string) {
	pc.ps = append(pc.ps, p)
	pc.names = append(pc.names, name)
}

// PreloadCurvePlotters returns the lines and points of PreloadCurve, in
// N against mm, with their legend names.
func PreloadCurvePlotters(p kinematic.Preload, opt *Options) ([]plot.Plotter, []string, error) {
	pc, err := newPreloadCurve(p, opt.orDefault())
	if err != nil {
		return nil, nil, err
	}
	return pc.ps, pc.names, nil
}

// PreloadCurve writes to w the force law of a gap-dependent preload
// element (p.Law, seated at p.Gap), N against the gap in mm: the curve,
// its tangent at the seat (the linear model the stiffness and modes use),
// the seated operating point, and the lift-off and runaway point: the
// largest force the element gives at a gap at or beyond the seated one.
// A pull along the element's line beyond the seated force lifts the part;
// beyond that largest force nothing holds it (for a magnet the two are
// the seated point). Options.Limit, when > 0, draws a force in N as a
// line (the lower end of the preload window, say). An element without a
// law, or a law that cannot be evaluated, is an error wrapping one of
// kinematic's sentinels.
func PreloadCurve(w io.Writer, p kinematic.Preload, opt *Options) error {
	o := opt.orDefault()
	pc, err := newPreloadCurve(p, o)
	if err != nil {
		return err
	}
	name := p.Name
	if name == "" {
		name = "preload element"
	}
	pl := newPlot(o.title(fmt.Sprintf("Preload curve of %s: force against gap", name)))
	for i, x := range pc.ps {
		pl.Add(x)
		if t, ok := x.(plot.Thumbnailer); ok {
			pl.Legend.Add(pc.names[i], t)
		}
	}
	grid := plotter.NewGrid()
	grid.Vertical.Color, grid.Horizontal.Color = faintFill, faintFill
	pl.Add(grid)
	pl.X.Label.Text = "gap, mm (grows as the part lifts off its seats)"
	pl.Y.Label.Text = "force of the element, N"
	pl.Y.Min = math.Min(0, pl.Y.Min)
	pl.X.Min = 0
	pl.Y.Max *= 1.35 // room for the legend above the curve
	pl.Legend.Top = true
	notes := []string{
		fmt.Sprintf("seated at %s mm: %s N, stiffness dF/dgap %s N/mm (%s)", idraw.Sig(p.Gap*mm), idraw.Sig(pc.f0), idraw.Sig(pc.slope/1e3),
			map[bool]string{true: "a negative spring: it lowers the coupling's stiffness", false: "it adds to the coupling's stiffness"}[pc.slope < 0]),
	}
	return write(w, o, pl.Title.Text, figWidth, figHeight*0.8, func(c draw.Canvas) {
		layout(c, pl, nil, o.notes(notes...))
	})
}

// seated returns the element's force at the seat, N (0 for a law that
// cannot be evaluated: a built design's laws can).
func seated(p kinematic.Preload) float64 {
	f, _, _ := p.AtSeat()
	return f
}
