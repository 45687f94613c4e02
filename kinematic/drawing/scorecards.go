package drawing

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// dots is a plot.Plotter of one figure's values, one row per candidate
// (row 0 at the top), the best filled, each with its value printed.
type dots struct {
	vals []float64
	best int
}

func (d dots) Plot(c draw.Canvas, plt *plot.Plot) {
	tx, ty := plt.Transforms(&c)
	sty := plt.X.Tick.Label
	sty.Font.Size = 9
	sty.Color = ink
	sty.YAlign = draw.YCenter
	x0 := tx(plt.X.Min)
	for i, v := range d.vals {
		y := ty(float64(len(d.vals) - 1 - i))
		x := tx(v)
		c.StrokeLine2(draw.LineStyle{Color: faintFill, Width: 0.6}, x0, y, x, y)
		var col color.Color = faint
		if i == d.best {
			col = blue
		}
		c.DrawGlyph(draw.GlyphStyle{Color: col, Radius: 4, Shape: draw.CircleGlyph{}}, vg.Point{X: x, Y: y})
		s := idraw.Sig(v)
		if i != d.best {
			s += " (" + relative(v/d.vals[d.best]-1) + ")"
		}
		sty.XAlign = draw.XLeft
		at := x + 6
		if at+sty.Width(s) > c.Max.X {
			sty.XAlign = draw.XRight
			at = x - 6
		}
		c.FillText(sty, vg.Point{X: at, Y: y}, s)
	}
}

func (d dots) DataRange() (xmin, xmax, ymin, ymax float64) {
	xmin, xmax = math.Inf(1), math.Inf(-1)
	for _, v := range d.vals {
		xmin, xmax = math.Min(xmin, v), math.Max(xmax, v)
	}
	return xmin, xmax, 0, float64(len(d.vals) - 1)
}

// Scorecards writes the design figures of candidate layouts to w as a
// table of dot plots, one panel per figure with its unit and which
// direction is better, each zoomed to its candidates' values (the axis
// does not start at zero, so that differences of a few per cent show)
// with the best candidate filled and every value printed: the error at
// the point of interest (µm/µm, lower is better), the stiffness there
// (N/µm), the first natural frequency (Hz), the shock level (g), the
// thermal drift (µm/K, lower is better) and the weakest Maxwell index at
// the contact points (Scorecard.WeakestContactIndex). names[i] names
// cards[i]. Every figure drawn must be finite and greater than zero (a
// scorecard of a payload without inertia has no frequency): the error
// names the card's field, for example "cards[1].FirstFrequency".
func Scorecards(w io.Writer, names []string, cards []kinematic.Scorecard, opt *Options) error {
	o := opt.orDefault()
	if len(names) != len(cards) || len(cards) == 0 {
		return fmt.Errorf("drawing: %d names for %d scorecards: %w", len(names), len(cards), kinematic.ErrDegenerate)
	}
	type figure struct {
		name, unit, field string
		lower             bool
		value             func(k *kinematic.Scorecard) float64
	}
	figs := []figure{
		{"error at the " + o.pointName(), "µm/µm", "Amplification", true, func(k *kinematic.Scorecard) float64 { return k.Amplification }},
		{"stiffness", "N/µm", "Stiffness", false, func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 }},
		{"first frequency", "Hz", "FirstFrequency", false, func(k *kinematic.Scorecard) float64 { return k.FirstFrequency }},
		{"shock level", "g", "ShockLevel", false, func(k *kinematic.Scorecard) float64 { return k.ShockLevel / kinematic.StandardGravity }},
		{"thermal drift", "µm/K", "Drift", true, func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 }},
		{"weakest Maxwell index at the contacts", "dimensionless", "WeakestContactIndex", false, func(k *kinematic.Scorecard) float64 { return k.WeakestContactIndex }},
	}
	var plots []*plot.Plot
	for _, f := range figs {
		d := dots{}
		for i := range cards {
			v := f.value(&cards[i])
			if !(v > 0) || math.IsInf(v, 0) {
				return fmt.Errorf("drawing: cards[%d].%s: %w: %g, want a finite figure > 0", i, f.field, kinematic.ErrRange, v)
			}
			d.vals = append(d.vals, v)
			if (f.lower && v < d.vals[d.best]) || (!f.lower && v > d.vals[d.best]) {
				d.best = i
			}
		}
		better := "higher is better →"
		if f.lower {
			better = "← lower is better"
		}
		p := newPlot(fmt.Sprintf("%s, %s", f.name, f.unit))
		p.Title.TextStyle.Font.Size = 11
		p.Add(d)
		lo, hi := p.X.Min, p.X.Max
		span := hi - lo
		if span < 1e-3*hi {
			span = 1e-3 * hi
		}
		p.X.Min, p.X.Max = lo-0.15*span, hi+0.35*span
		p.X.Label.Text = better
		p.X.Label.TextStyle.Font.Size = 9
		p.Y.Min, p.Y.Max = -0.6, float64(len(cards))-0.4
		rev := make([]string, len(names))
		for i, n := range names {
			rev[len(names)-1-i] = n
		}
		p.NominalY(rev...)
		p.Y.Min, p.Y.Max = -0.6, float64(len(cards))-0.4
		plots = append(plots, p)
	}
	title := o.title("Candidate layouts: design figures (best of each filled, others relative to it)")
	const cols = 2
	rows := (len(plots) + cols - 1) / cols
	rowH := 0.9*vg.Inch + vg.Length(len(cards))*0.28*vg.Inch
	height := 0.5*vg.Inch + rowH*vg.Length(rows) + 0.3*vg.Inch*vg.Length(len(o.Notes)+1)
	notes := o.notes("each panel is zoomed to its values: compare positions, not lengths from zero")
	return write(w, o, title, figWidth, height, func(c draw.Canvas) {
		head := newPlot(title)
		sty := head.Title.TextStyle
		sty.XAlign, sty.YAlign = draw.XCenter, draw.YTop
		c.FillText(sty, vg.Point{X: (c.Min.X + c.Max.X) / 2, Y: c.Max.Y - 6}, title)
		body := draw.Crop(c, 0, 0, 0, -0.4*vg.Inch)
		sty2 := noteStyle()
		var lines []string
		for _, n := range notes {
			lines = append(lines, wrap(sty2, n, c.Max.X-c.Min.X-16)...)
		}
		lh := sty2.Height("Mg") * 1.15
		for i, l := range lines {
			c.FillText(sty2, vg.Point{X: c.Min.X + 8, Y: c.Min.Y + 8 + lh*vg.Length(len(lines)-1-i)}, l)
		}
		body = draw.Crop(body, 0, 0, 8+lh*vg.Length(len(lines)), 0)
		tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: 0.2 * vg.Inch, PadY: 0.1 * vg.Inch, PadLeft: 4, PadRight: 8}
		for i, p := range plots {
			p.Draw(tiles.At(body, i%cols, i/cols))
		}
	})
}

// relative formats a relative difference r: "+3.8 %", "-0.04 %", or
// "equal" below 0.005 %.
func relative(r float64) string {
	switch a := math.Abs(r); {
	case a < 5e-5:
		return "equal"
	case a < 1e-3:
		return fmt.Sprintf("%+.2f %%", 100*r)
	}
	return fmt.Sprintf("%+.1f %%", 100*r)
}
