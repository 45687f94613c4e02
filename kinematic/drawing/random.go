package drawing

import (
	"fmt"
	"io"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
	idraw "github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// RandomCurve is the response to random vibration along one direction,
// as [RandomSpectrum] and [RandomMargins] draw it.
type RandomCurve struct {
	// Name names the direction in legends ("z", "worst"); "" gives
	// "direction 1", "direction 2", ...
	Name string

	// Response is the response along the direction
	// (kinematic.Model.Random, or design.RandomAxis.Response).
	Response kinematic.Random

	// Density is the response's spectrum at the point of interest at
	// frequencies of the caller's choice (kinematic.Model.RandomDensity
	// with the options that gave Response); RandomSpectrum draws its
	// Acceleration, RandomMargins ignores it.
	Density []kinematic.RandomDensity
}

// name returns the curve's name, or one by position.
func (c RandomCurve) name(i int) string {
	if c.Name != "" {
		return c.Name
	}
	return fmt.Sprintf("direction %d", i+1)
}

// gSquared is standard gravity squared, (m/s²)² per g²: the densities
// in (m/s²)²/Hz are drawn in g²/Hz on the spectrum's axes.
const gSquared = kinematic.StandardGravity * kinematic.StandardGravity

// RandomSpectrumPlotters returns the lines of RandomSpectrum in g²/Hz
// against Hz, for a plot whose both axes are logarithmic
// (plot.LogScale): the spectrum s through its breakpoints (straight
// lines on log–log axes, as the spectrum is defined), and for each curve
// the density of the absolute acceleration of the point of interest,
// where it is positive. The legend names of the lines are returned with
// them, the spectrum's first.
func RandomSpectrumPlotters(s kinematic.Spectrum, curves []RandomCurve, opt *Options) ([]plot.Plotter, []string, error) {
	o := opt.orDefault()
	grms, err := s.GRMS()
	if err != nil {
		return nil, nil, fmt.Errorf("drawing: s: %w", err)
	}
	in := make(plotter.XYs, len(s.Points))
	for i, b := range s.Points {
		a, _ := s.Level(b.Frequency) // s is valid: GRMS checked it
		in[i] = plotter.XY{X: b.Frequency, Y: a}
	}
	li, err := plotter.NewLine(in)
	if err != nil {
		return nil, nil, err
	}
	li.Color, li.Width = ink, 2
	ps := []plot.Plotter{li}
	names := []string{fmt.Sprintf("base input, %s grms", idraw.Sig(grms))}
	for k, c := range curves {
		var xy plotter.XYs
		for i, d := range c.Density {
			if !finite(d.Frequency) || !finite(d.Acceleration) || d.Acceleration < 0 || d.Frequency < 0 {
				return nil, nil, fmt.Errorf("drawing: curves[%d].Density[%d]: %w: %g Hz, %g (m/s²)²/Hz", k, i, kinematic.ErrRange, d.Frequency, d.Acceleration)
			}
			if y := d.Acceleration / gSquared; y > 0 && d.Frequency > 0 && y < math.MaxFloat64 {
				xy = append(xy, plotter.XY{X: d.Frequency, Y: y})
			}
		}
		if len(xy) < 2 {
			continue
		}
		l, err := plotter.NewLine(xy)
		if err != nil {
			return nil, nil, err
		}
		l.Color, l.Width = plotutil.Color(k), 1.2 // the colours of RandomMargins' bars
		ps = append(ps, l)
		if !finite(c.Response.Point.RMS) {
			return nil, nil, fmt.Errorf("drawing: curves[%d].Response.Point.RMS: %w", k, kinematic.ErrNonFinite)
		}
		names = append(names, fmt.Sprintf("%s, along %s: %s grms", o.pointName(), c.name(k), idraw.Sig(c.Response.Point.RMS/kinematic.StandardGravity)))
	}
	return ps, names, nil
}

// RandomSpectrum writes to w the spectrum of a random vibration test on
// log–log axes, g²/Hz against Hz, with its overall level (grms) in the
// legend, and on the same axes the spectrum of the absolute acceleration
// of the point of interest along each curve's direction, with its RMS in
// g. The natural frequencies of the first curve's response are marked at
// the foot of the plot.
func RandomSpectrum(w io.Writer, s kinematic.Spectrum, curves []RandomCurve, opt *Options) error {
	o := opt.orDefault()
	ps, names, err := RandomSpectrumPlotters(s, curves, opt)
	if err != nil {
		return err
	}
	grms, _ := s.GRMS()
	p := newPlot(o.title(fmt.Sprintf("Random vibration: the test spectrum (%s grms) and the response at the %s", idraw.Sig(grms), o.pointName())))
	for i, pl := range ps {
		p.Add(pl)
		if l, ok := pl.(*plotter.Line); ok {
			p.Legend.Add(names[i], l)
		}
	}
	p.X.Scale, p.Y.Scale = plot.LogScale{}, plot.LogScale{}
	p.X.Tick.Marker, p.Y.Tick.Marker = plot.LogTicks{Prec: -1}, plot.LogTicks{Prec: -1}
	p.X.Label.Text = "frequency, Hz"
	p.Y.Label.Text = "acceleration spectral density, g²/Hz"
	p.Legend.Top = true
	// The y axis from and to whole decades (a tick label beyond the
	// range would push the plot down), the highest curve
	// within the top decade (the legend sits above the plot area).
	// Both within 1e±300, so that the log scale's arithmetic stays finite.
	p.Y.Min = math.Pow(10, math.Max(-300, math.Floor(math.Log10(p.Y.Min))))
	p.Y.Max = math.Pow(10, math.Min(300, math.Ceil(math.Log10(p.Y.Max))))
	if p.Y.Max <= p.Y.Min {
		p.Y.Max = p.Y.Min * 10
	}
	p.X.Min, p.X.Max = math.Max(p.X.Min, 1e-300), math.Min(p.X.Max, 1e300)
	var notes []string
	if len(curves) > 0 {
		r := curves[0].Response
		var modes vlines
		for i, f := range r.Modes {
			if finite(f) && f > p.X.Min && f < p.X.Max {
				modes = append(modes, vline{f, "", faint, []vg.Length{2, 2}, 0.6, i})
			}
		}
		if len(modes) > 0 {
			p.Add(modes)
		}
		damping := "damping ratios " + strings.Join(fmtList(r.Damping[:]), ", ")
		if r.Damping == [6]float64{r.Damping[0], r.Damping[0], r.Damping[0], r.Damping[0], r.Damping[0], r.Damping[0]} {
			damping = "damping ratio " + idraw.Sig(r.Damping[0]) + " in every mode"
		}
		notes = append(notes, fmt.Sprintf("natural frequencies %s Hz (dashed grey where in the band); %s",
			strings.Join(fmtList(r.Modes[:]), ", "), damping))
	}
	notes = append(notes, "the response is the absolute acceleration of the "+o.pointName()+
		" (all three components), drawn in g²/Hz with g = 9.80665 m/s²; the input is zero outside its band")
	return write(w, o, p.Title.Text, figWidth, figHeight, func(c draw.Canvas) {
		layout(c, p, nil, o.notes(notes...))
	})
}

// fmtList formats numbers with three significant figures.
func fmtList(xs []float64) []string {
	out := make([]string, len(xs))
	for i, x := range xs {
		out[i] = idraw.Sig(x)
	}
	return out
}

// RandomMargins writes to w each contact's margin in random vibration as
// grouped bars, one group per contact (by its label, in the order of
// curves[0]) and one bar per curve: static force over RMS dynamic force,
// the number of standard deviations at which the contact opens
// (kinematic.RandomContact.Margin). Options.Limit, when set, is the
// required margin k, drawn as a red line and named by Options.LimitName
// ("" means "required margin"). The bars are capped at four times the
// larger of the required margin and the least margin drawn, where the
// verdict is read: longer bars end at the cap, a dotted dark line marks
// it, and a note says how many were cut. A contact without dynamic force
// (an unbounded margin) is drawn to the cap too and named in a note as
// "∞". The axis ends just above the cap, leaving room for the legend.
func RandomMargins(w io.Writer, curves []RandomCurve, opt *Options) error {
	o := opt.orDefault()
	if len(curves) == 0 || len(curves[0].Response.Contacts) == 0 {
		return fmt.Errorf("drawing: no responses with contacts to draw: %w", kinematic.ErrDegenerate)
	}
	if !finite(o.Limit) || o.Limit < 0 {
		return fmt.Errorf("drawing: Options.Limit: %w: %g, want a finite margin ≥ 0", kinematic.ErrRange, o.Limit)
	}
	n := len(curves[0].Response.Contacts)
	labels := make([]string, n)
	top := o.Limit
	least := math.Inf(1) // the least finite margin drawn
	for i, c := range curves[0].Response.Contacts {
		labels[i] = c.Label
	}
	for k, cv := range curves {
		cs := cv.Response.Contacts
		if len(cs) != n {
			return fmt.Errorf("drawing: curves[%d].Response.Contacts: %w: %d contacts, curves[0] has %d", k, kinematic.ErrDegenerate, len(cs), n)
		}
		for i, c := range cs {
			switch {
			case c.Label != labels[i]:
				return fmt.Errorf("drawing: curves[%d].Response.Contacts[%d].Label: %w: %q, curves[0] has %q there", k, i, kinematic.ErrDegenerate, c.Label, labels[i])
			case math.IsNaN(c.Margin) || math.IsInf(c.Margin, -1):
				return fmt.Errorf("drawing: curves[%d].Response.Contacts[%d].Margin: %w: %g", k, i, kinematic.ErrNonFinite, c.Margin)
			case c.Margin < 0:
				return fmt.Errorf("drawing: curves[%d].Response.Contacts[%d].Margin: %w: %g, a margin is ≥ 0", k, i, kinematic.ErrRange, c.Margin)
			case !math.IsInf(c.Margin, 1):
				top = math.Max(top, c.Margin)
				least = math.Min(least, c.Margin)
			}
		}
	}
	// The axis reaches four times the larger of the limit and the least
	// margin (the bars far from opening are cut there), at least a
	// margin of 0.01 and at most 1e300, so that the plot's arithmetic
	// stays finite.
	if !math.IsInf(least, 1) {
		top = math.Min(top, 4*math.Max(o.Limit, least))
	}
	top = math.Min(math.Max(top, 0.01), 1e300)
	cut := 0
	p := newPlot(o.title("Contact margins in random vibration"))
	width := vg.Length(0.7*vg.Inch) / vg.Length(len(curves))
	var inf []string
	for k, cv := range curves {
		vals := make(plotter.Values, n)
		for i, c := range cv.Response.Contacts {
			vals[i] = c.Margin
			switch {
			case math.IsInf(c.Margin, 1):
				vals[i] = top
				inf = append(inf, fmt.Sprintf("%s along %s", c.Label, cv.name(k)))
			case c.Margin > top:
				vals[i] = top
				cut++
			}
		}
		bc, err := plotter.NewBarChart(vals, width)
		if err != nil {
			return err
		}
		bc.Color = plotutil.Color(k)
		bc.LineStyle.Width = 0
		bc.Offset = width * (vg.Length(k) - vg.Length(len(curves)-1)/2)
		p.Add(bc)
		if cv.Response.Least < 0 || cv.Response.Least >= n {
			return fmt.Errorf("drawing: curves[%d].Response.Least: %w: %d for %d contacts", k, kinematic.ErrRange, cv.Response.Least, n)
		}
		least := cv.Response.Contacts[cv.Response.Least]
		lm := "∞"
		if !math.IsInf(least.Margin, 1) {
			lm = idraw.Sig(least.Margin)
		}
		p.Legend.Add(fmt.Sprintf("along %s (least %s at %s)", cv.name(k), lm, least.Label), bc)
	}
	if o.Limit > 0 {
		name := o.LimitName
		if name == "" {
			name = "required margin"
		}
		l, err := plotter.NewLine(plotter.XYs{{X: -0.5, Y: o.Limit}, {X: float64(n) - 0.5, Y: o.Limit}})
		if err != nil {
			return err
		}
		l.Color, l.Width, l.Dashes = red, 2, []vg.Length{6, 3}
		p.Add(l)
		p.Legend.Add(fmt.Sprintf("%s: %s σ", name, idraw.Sig(o.Limit)), l)
	}
	if cut > 0 || len(inf) > 0 {
		l, err := plotter.NewLine(plotter.XYs{{X: -0.5, Y: top}, {X: float64(n) - 0.5, Y: top}})
		if err != nil {
			return err
		}
		l.Color, l.Width, l.Dashes = ink, 1, []vg.Length{1.5, 2}
		p.Add(l)
		p.Legend.Add(fmt.Sprintf("bars cut at %s σ", idraw.Sig(top)), l)
	}
	grid := plotter.NewGrid()
	grid.Vertical.Color = nil
	p.Add(grid)
	p.NominalX(labels...)
	p.Y.Min = 0
	p.Y.Max = top * 1.05
	p.Y.Label.Text = "margin: static force / RMS dynamic force (σ to open)"
	p.X.Label.Text = "contact"
	p.Legend.Top = true
	p.Legend.Padding = 3
	notes := []string{"a contact opens when its force fluctuation reaches its static force: at a margin of k it opens at k standard deviations"}
	if len(inf) > 0 {
		notes = append(notes, fmt.Sprintf("no dynamic force (margin ∞, drawn to the dotted line): %v", inf))
	}
	if cut > 0 {
		notes = append(notes, fmt.Sprintf("%d bars with margins above %s σ are cut at the dotted line (those contacts are far from opening)", cut, idraw.Sig(top)))
	}
	notes = o.notes(notes...)
	return write(w, o, p.Title.Text, figWidth, figHeight*0.75, func(c draw.Canvas) {
		// Room for the legend above the cap: the axis ends where the
		// legend's block, at the top of the data area, clears the
		// bars (the data area's height does not depend on Y.Max).
		mc, _, _, _ := areas(c, false, notes)
		dc := p.DataCanvas(mc)
		h := dc.Max.Y - dc.Min.Y
		lg := p.Legend.Rectangle(dc).Size().Y + 4
		if h > 0 && lg < 0.7*h {
			p.Y.Max = top * 1.05 * float64(h/(h-lg))
		}
		layout(c, p, nil, notes)
	})
}
