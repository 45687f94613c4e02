package drawing

import (
	"fmt"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// bars is a plot.Plotter of horizontal bars from zero, one row per
// value (row 0 at the top), each with a label printed after it.
type bars struct {
	vals   []float64
	labels []string
}

func (b bars) Plot(c draw.Canvas, plt *plot.Plot) {
	tx, ty := plt.Transforms(&c)
	sty := plt.X.Tick.Label
	sty.Font.Size = 9
	sty.Color = ink
	sty.YAlign = draw.YCenter
	h := (ty(1) - ty(0)) * 0.32
	for i, v := range b.vals {
		y := ty(float64(len(b.vals) - 1 - i))
		x0, x1 := tx(0), tx(v)
		c.FillPolygon(blue, c.ClipPolygonXY([]vg.Point{{X: x0, Y: y - h}, {X: x1, Y: y - h}, {X: x1, Y: y + h}, {X: x0, Y: y + h}}))
		sty.XAlign = draw.XLeft
		at := x1 + 4
		if at+sty.Width(b.labels[i]) > c.Max.X {
			sty.XAlign, at = draw.XRight, x1-4
			sty.Color = faintFill
		}
		c.FillText(sty, vg.Point{X: at, Y: y}, b.labels[i])
		sty.Color = ink
	}
}

func (b bars) DataRange() (xmin, xmax, ymin, ymax float64) {
	for _, v := range b.vals {
		xmax = math.Max(xmax, v)
	}
	return 0, xmax, -0.5, float64(len(b.vals)) - 0.5
}

// Budget writes the error budget of the point of interest to w as a
// ranked chart: one bar per toleranced dimension, largest first, its
// Effect (|Sensitivity|·Limit, µm: the displacement with the dimension
// at its limit) with its share of the variance, %; the worst case and
// RSS totals are in the notes. The names on the rows are the budget's
// own (kinematic.Contributor.Dimension); the budget must have a
// contributor.
func Budget(w io.Writer, bud kinematic.Budget, opt *Options) error {
	o := opt.orDefault()
	n := len(bud.Contributors)
	if n == 0 {
		return fmt.Errorf("drawing: the budget has no contributors: %w", kinematic.ErrDegenerate)
	}
	b := bars{}
	names := make([]string, n)
	for i, c := range bud.Contributors {
		if !finite(c.Effect) || !finite(c.Share) || c.Effect < 0 {
			return fmt.Errorf("drawing: bud.Contributors[%d].Effect: %w: %g", i, kinematic.ErrRange, c.Effect)
		}
		b.vals = append(b.vals, c.Effect*1e6)
		b.labels = append(b.labels, fmt.Sprintf("%s µm (%.0f %%)", idraw.Sig(c.Effect*1e6), 100*c.Share))
		names[n-1-i] = c.Dimension
	}
	p := newPlot(o.title("Error budget at the " + o.pointName() + ": contribution of each toleranced dimension"))
	p.Add(b)
	p.NominalY(names...)
	p.Y.Min, p.Y.Max = -0.6, float64(n)-0.4
	p.X.Min = 0
	p.X.Max *= 1.3
	p.X.Label.Text = "displacement of the " + o.pointName() + " with the dimension at its limit, µm (share of the variance)"
	notes := o.notes(fmt.Sprintf("worst case (every dimension at its limit, signs aligned) %s µm; RSS %s µm; 1σ %s µm",
		idraw.Sig(bud.Worst*1e6), idraw.Sig(bud.RSS*1e6), idraw.Sig(bud.Sigma*1e6)))
	height := 1.3*vg.Inch + vg.Length(n)*0.3*vg.Inch
	return write(w, o, p.Title.Text, figWidth, height, func(c draw.Canvas) {
		layout(c, p, nil, notes)
	})
}
