package drawing

import (
	"bytes"
	"fmt"
	"html"
	"image/color"
	"io"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/palette/moreland"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgsvg"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// The size of a ready figure: 8 in wide, so that 10 pt text is 21 px
// high at 1200 px.
const (
	figWidth  = 8 * vg.Inch
	figHeight = 6 * vg.Inch
	barWidth  = 1.3 * vg.Inch
	noteSize  = 9
)

// colours of the drawings.
var (
	ink       = color.Gray{Y: 0x20}
	faint     = color.Gray{Y: 0x90}
	faintFill = color.Gray{Y: 0xcc}
	red       = color.RGBA{R: 0xc0, G: 0x20, B: 0x20, A: 0xff}
	blue      = color.RGBA{R: 0x20, G: 0x50, B: 0xb0, A: 0xff}
	green     = color.RGBA{R: 0x20, G: 0x80, B: 0x30, A: 0xff}
	keepFill  = color.NRGBA{R: 0xd0, G: 0x30, B: 0x30, A: 0x38}
	winFill   = color.NRGBA{R: 0x30, G: 0xa0, B: 0x40, A: 0x30}
)

// scale returns the sequential colour map of the drawings over [lo, hi].
func scale(lo, hi float64) palette.ColorMap {
	// The top 15 % of the map, near white, is left out: the highest
	// values stay visible on a white page.
	cm := moreland.ExtendedBlackBody()
	cm.SetMin(lo)
	cm.SetMax(hi + 0.18*(hi-lo))
	return &partMap{ColorMap: cm, lo: lo, hi: hi}
}

// partMap is the part [lo, hi] of a colour map whose range is wider.
type partMap struct {
	palette.ColorMap
	lo, hi float64
}

func (m *partMap) Min() float64 { return m.lo }
func (m *partMap) Max() float64 { return m.hi }

// Palette returns n colours evenly over [lo, hi].
func (m *partMap) Palette(n int) palette.Palette {
	cs := make([]color.Color, n)
	for i := range cs {
		x := m.lo
		if n > 1 {
			x += (m.hi - m.lo) * float64(i) / float64(n-1)
		}
		cs[i] = colourAt(m, x)
	}
	return plainPalette(cs)
}

type plainPalette []color.Color

func (p plainPalette) Colors() []color.Color { return p }

// newPlot returns a plot with the drawings' styles and the given title.
func newPlot(title string) *plot.Plot {
	p := plot.New()
	p.Title.TextStyle.Font.Size = 13
	p.Title.Text = fitTitle(p.Title.TextStyle, title, figWidth-24)
	p.Title.Padding = 8
	p.X.Label.TextStyle.Font.Size = 11
	p.Y.Label.TextStyle.Font.Size = 11
	p.X.Tick.Label.Font.Size = 10
	p.Y.Tick.Label.Font.Size = 10
	p.Legend.TextStyle.Font.Size = 10
	p.X.Tick.Marker = ticks{}
	p.Y.Tick.Marker = ticks{}
	return p
}

// fitTitle returns title as it is when it fits in width at style, else
// broken into two lines at the space nearest its middle (a caller's long
// design name before the drawing's own title would be cut at both edges).
func fitTitle(style text.Style, title string, width vg.Length) string {
	if strings.Contains(title, "\n") || style.Width(title) <= width {
		return title
	}
	mid, best := len(title)/2, -1
	for i, r := range title {
		if r == ' ' && (best < 0 || abs(i-mid) < abs(best-mid)) {
			best = i
		}
	}
	if best < 0 {
		return title
	}
	return title[:best] + "\n" + title[best+1:]
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// ticks are plot.DefaultTicks labelled with up to six significant
// figures and no trailing zeros ("75", not "75.00").
type ticks struct{}

func (ticks) Ticks(lo, hi float64) []plot.Tick {
	ts := plot.DefaultTicks{}.Ticks(lo, hi)
	for i := range ts {
		if ts[i].Label != "" {
			ts[i].Label = strconv.FormatFloat(ts[i].Value, 'g', 6, 64)
			if ts[i].Label == "-0" {
				ts[i].Label = "0"
			}
		}
	}
	return ts
}

// label draws s at pt in sty over a white box, so that it reads on any
// background.
func label(c draw.Canvas, sty text.Style, pt vg.Point, s string) {
	r := sty.Rectangle(s)
	r.Min, r.Max = r.Min.Add(pt), r.Max.Add(pt)
	c.FillPolygon(color.NRGBA{R: 0xff, G: 0xff, B: 0xff, A: 0xd8}, []vg.Point{
		{X: r.Min.X - 1, Y: r.Min.Y}, {X: r.Max.X + 1, Y: r.Min.Y}, {X: r.Max.X + 1, Y: r.Max.Y}, {X: r.Min.X - 1, Y: r.Max.Y}})
	c.FillText(sty, pt, s)
}

// colourBar returns a plot holding the colour bar of cm, labelled.
func colourBar(cm palette.ColorMap, label string) *plot.Plot {
	p := newPlot("")
	p.Add(&plotter.ColorBar{ColorMap: cm, Vertical: true})
	p.HideX()
	p.Y.Label.Text = label
	p.Y.Padding = 0
	return p
}

// noteStyle returns the style of the lines under a figure.
func noteStyle() text.Style {
	p := plot.New()
	s := p.X.Label.TextStyle
	s.Font.Size = noteSize
	s.Color = ink
	s.XAlign = draw.XLeft
	s.YAlign = draw.YBottom
	return s
}

// wrap breaks s into lines no wider than width in style sty.
func wrap(sty text.Style, s string, width vg.Length) []string {
	var lines []string
	line := ""
	for _, w := range strings.Fields(s) {
		try := w
		if line != "" {
			try = line + " " + w
		}
		if line != "" && sty.Width(try) > width {
			lines = append(lines, line)
			line = w
			continue
		}
		line = try
	}
	if line != "" {
		lines = append(lines, line)
	}
	return lines
}

// areas returns the canvases of a ready figure on c: the main plot's,
// the colour bar's at the right (when bar), and the lines of the notes
// with their height.
func areas(c draw.Canvas, bar bool, notes []string) (main, barC draw.Canvas, lines []string, lh vg.Length) {
	sty := noteStyle()
	const pad = vg.Length(8)
	for _, n := range notes {
		lines = append(lines, wrap(sty, n, c.Max.X-c.Min.X-2*pad)...)
	}
	lh = sty.Height("Mg") * 1.15
	bottom := pad + lh*vg.Length(len(lines))
	right := vg.Length(0)
	if bar {
		right = barWidth
		barC = draw.Crop(c, c.Max.X-c.Min.X-barWidth, -pad, bottom+0.5*vg.Inch, -0.45*vg.Inch)
	}
	return draw.Crop(c, 2, -right-10, bottom, -6), barC, lines, lh
}

// layout draws a ready figure on c: the main plot, a colour bar at the
// right (nil for none) and the notes under both.
func layout(c draw.Canvas, main, bar *plot.Plot, notes []string) {
	mc, bc, lines, lh := areas(c, bar != nil, notes)
	sty := noteStyle()
	for i, l := range lines {
		c.FillText(sty, vg.Point{X: c.Min.X + 8, Y: c.Min.Y + 8 + lh*vg.Length(len(lines)-1-i)}, l)
	}
	if bar != nil {
		bar.Draw(bc)
	}
	main.Draw(mc)
}

// write renders a ready figure of the given size to w in o.Format; an SVG
// document gets a <title> element holding title.
func write(w io.Writer, o Options, title string, width, height vg.Length, fill func(draw.Canvas)) error {
	format := strings.ToLower(o.Format)
	switch format {
	case "":
		format = "svg"
	case "svg", "png", "pdf":
	default:
		return fmt.Errorf("drawing: Options.Format: %w: %q, want \"svg\", \"png\" or \"pdf\"", kinematic.ErrRange, o.Format)
	}
	var cw vg.CanvasWriterTo
	if format == "svg" {
		cw = vgsvg.NewWith(vgsvg.UseWH(width, height))
	} else {
		var err error
		if cw, err = draw.NewFormattedCanvas(width, height, format); err != nil {
			return err
		}
	}
	dc := draw.New(cw)
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	fill(dc)
	var buf bytes.Buffer
	if _, err := cw.WriteTo(&buf); err != nil {
		return err
	}
	out := buf.Bytes()
	if format == "svg" {
		// vgsvg labels its PNG images as JPEG; viewers that trust the
		// label draw nothing.
		// An image (a heat map's cells, a colour bar) fills its box: by
		// default SVG keeps the bitmap's aspect ratio and leaves bands.
		out = bytes.ReplaceAll(out, []byte("data:image/jpg;base64,"), []byte("data:image/png;base64,"))
		out = bytes.ReplaceAll(out, []byte("<image "), []byte(`<image preserveAspectRatio="none" `))
		// Liberation Serif, whose metrics placed the labels, or a font
		// with the same metrics (Times New Roman), before any serif.
		out = bytes.ReplaceAll(out, []byte("font-family:Liberation Serif;"), []byte("font-family:'Liberation Serif','Times New Roman',Times,serif;"))
		i := bytes.Index(out, []byte("<svg"))
		if i >= 0 {
			j := bytes.IndexByte(out[i:], '>')
			if j > 0 {
				k := i + j + 1
				out = append(append(append([]byte(nil), out[:k]...), []byte("\n<title>"+html.EscapeString(strings.ReplaceAll(title, "\n", " "))+"</title>")...), out[k:]...)
			}
		}
	}
	_, err := w.Write(out)
	return err
}

// colourAt returns cm's colour at x, clamped to its range.
func colourAt(cm palette.ColorMap, x float64) color.Color {
	x = max(cm.Min(), min(cm.Max(), x))
	if m, ok := cm.(*partMap); ok {
		cm = m.ColorMap
	}
	c, err := cm.At(x)
	if err != nil {
		return faint
	}
	return c
}
