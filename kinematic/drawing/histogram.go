package drawing

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// percentiles marked on a histogram, %.
var percentiles = []float64{50, 95, 99, 99.73}

// vline is a labelled vertical line of a plot, drawn over its y range.
type vline struct {
	x     float64
	label string
	col   color.Color
	dash  []vg.Length
	width vg.Length
	row   int // label row from the top
}

// vlines is a plot.Plotter of labelled vertical lines.
type vlines []vline

func (ls vlines) Plot(c draw.Canvas, plt *plot.Plot) {
	tx, _ := plt.Transforms(&c)
	sty := plt.X.Tick.Label
	sty.Font.Size = 9
	sty.YAlign = draw.YTop
	for _, l := range ls {
		if x := tx(l.x); c.ContainsX(x) {
			c.StrokeLine2(draw.LineStyle{Color: l.col, Width: l.width, Dashes: l.dash}, x, c.Min.Y, x, c.Max.Y)
		}
	}
	// The labels after every line, so that no line crosses a label.
	for _, l := range ls {
		x := tx(l.x)
		if !c.ContainsX(x) {
			continue
		}
		sty.Color = l.col
		y := c.Max.Y - 2 - vg.Length(l.row)*sty.Height("M")*1.2
		sty.XAlign = draw.XLeft
		if x+sty.Width(l.label)+3 > c.Max.X {
			sty.XAlign = draw.XRight
			label(c, sty, vg.Point{X: x - 3, Y: y}, l.label)
			continue
		}
		label(c, sty, vg.Point{X: x + 3, Y: y}, l.label)
	}
}

// DataRange implements plot.DataRanger: the lines' x, no y.
func (ls vlines) DataRange() (xmin, xmax, ymin, ymax float64) {
	xmin, xmax = math.Inf(1), math.Inf(-1)
	for _, l := range ls {
		xmin, xmax = math.Min(xmin, l.x), math.Max(xmax, l.x)
	}
	return xmin, xmax, math.Inf(1), math.Inf(-1)
}

// HistogramPlotters returns the histogram of Histogram as plotters in
// µm: the bars and the lines of the percentiles and of Options.Limit.
func HistogramPlotters(res kinematic.StudyResult, opt *Options) ([]plot.Plotter, error) {
	o := opt.orDefault()
	if len(res.Points) == 0 {
		return nil, fmt.Errorf("drawing: the study kept no samples (kinematic.StudyOptions.KeepSamples): %w", kinematic.ErrDegenerate)
	}
	if !finite(o.Limit) || o.Limit < 0 {
		return nil, fmt.Errorf("drawing: Options.Limit: %w: %g, want a finite length ≥ 0, m", kinematic.ErrRange, o.Limit)
	}
	xs := make([]float64, len(res.Points))
	for i, p := range res.Points {
		xs[i] = r3.Norm(p) * 1e6
		if !finite(xs[i]) {
			return nil, fmt.Errorf("drawing: res.Points[%d]: %w", i, kinematic.ErrNonFinite)
		}
	}
	sort.Float64s(xs)
	bins := binCount(xs)
	vals := make(plotter.Values, len(xs))
	copy(vals, xs)
	h, err := plotter.NewHist(vals, bins)
	if err != nil {
		return nil, err
	}
	h.FillColor = faintFill
	h.LineStyle.Color = faint
	h.LineStyle.Width = 0.5
	var ls vlines
	for i, q := range percentiles {
		x := percentile(xs, q)
		ls = append(ls, vline{x, fmt.Sprintf("%g %%: %s µm", q, idraw.Sig(x)), ink, []vg.Length{3, 2}, 0.8, i})
	}
	if o.Limit > 0 {
		x := o.Limit * 1e6
		ls = append(ls, vline{x, fmt.Sprintf("%s: %s µm", o.limitName(), idraw.Sig(x)), red, nil, 2, len(percentiles)})
	}
	return []plot.Plotter{h, ls}, nil
}

// Histogram writes the histogram of a Monte Carlo study's radial
// displacement of the point of interest to w: the 3-D magnitude |d| of
// each sample's displacement, µm, with the 50th, 95th, 99th and 99.73th
// percentiles marked and, when Options.Limit is set, the requirement's
// limit drawn as a red line. The study must have kept its samples
// (kinematic.StudyOptions.KeepSamples).
func Histogram(w io.Writer, res kinematic.StudyResult, opt *Options) error {
	o := opt.orDefault()
	ps, err := HistogramPlotters(res, opt)
	if err != nil {
		return err
	}
	p := newPlot(o.title("Error at the " + o.pointName() + ": parts made to the drawing"))
	p.Add(ps...)
	p.X.Label.Text = "radial displacement of the " + o.pointName() + " |d| (3-D magnitude), µm"
	p.Y.Label.Text = "parts"
	p.X.Min = 0
	if o.Limit > 0 {
		p.X.Max = math.Max(p.X.Max, o.Limit*1e6*1.05)
	}
	p.Y.Max *= 1.25 // room for the line labels
	notes := o.notes(fmt.Sprintf("%d samples; radial means the 3-D magnitude of the displacement, √(dx² + dy² + dz²)", len(res.Points)))
	return write(w, o, p.Title.Text, figWidth, figHeight*0.8, func(c draw.Canvas) {
		layout(c, p, nil, notes)
	})
}

// percentile returns the p-th percentile of the sorted xs: Hyndman & Fan
// (1996), Am. Stat. 50(4), definition 7, x[h] interpolated at
// h = (n−1)·p/100 with 0-based order statistics.
func percentile(xs []float64, p float64) float64 {
	h := (float64(len(xs)) - 1) * p / 100
	i := int(math.Floor(h))
	if i >= len(xs)-1 {
		return xs[len(xs)-1]
	}
	return xs[i] + (h-float64(i))*(xs[i+1]-xs[i])
}

// binCount returns the number of bins for the sorted samples xs:
// Freedman & Diaconis (1981), width 2·IQR·n^(−1/3), or √n when the IQR
// is zero, within [10, 80].
func binCount(xs []float64) int {
	n := float64(len(xs))
	span := xs[len(xs)-1] - xs[0]
	k := math.Ceil(math.Sqrt(n))
	if iqr := percentile(xs, 75) - percentile(xs, 25); iqr > 0 && span > 0 {
		k = math.Ceil(span / (2 * iqr * math.Cbrt(1/n)))
	}
	return int(math.Min(math.Max(k, 10), 80))
}
