package draw

import (
	"fmt"
	"io"
	"math"
	"slices"
)

// Figure is one design figure compared across the candidates of a bar
// chart, for example the error at the point of interest of each layout.
type Figure struct {
	Name          string
	Unit          string    // as printed, e.g. "µm/µm"
	Values        []float64 // one per candidate, in Unit, finite and > 0
	LowerIsBetter bool      // reports whether a smaller value is the better one
}

// Bars is a grouped bar chart: for each figure a group of bars, one per
// candidate. Each figure is scaled to its best candidate, which gets
// height 1: v/best when higher is better and best/v when lower is better,
// so that a taller bar is always the better candidate. The chart says so,
// and prints each bar's value with its unit.
type Bars struct {
	Title      string
	Candidates []string // names of the candidate layouts, in the legend
	Figures    []Figure
	Notes      []string // lines of text under the drawing
}

const (
	barsHeight = 260.0 // px, the height of a bar of relative height 1
	groupGap   = 28.0  // px between groups
	minBar     = 30.0  // px, the narrowest bar
)

// categorical colours of the candidates, in order; they repeat after six.
var categorical = [...]string{"#2b5d8a", "#d0641e", "#1c7c54", "#8e3b8a", "#b59a1f", "#5a6b7b"}

func (c Bars) validate() error {
	if len(c.Candidates) == 0 {
		return &InputError{Field: "Candidates", Err: fmt.Errorf("%w: no candidates", ErrDegenerate)}
	}
	if len(c.Figures) == 0 {
		return &InputError{Field: "Figures", Err: fmt.Errorf("%w: no figures", ErrDegenerate)}
	}
	for i, f := range c.Figures {
		if len(f.Values) != len(c.Candidates) {
			return &InputError{Field: fmt.Sprintf("Figures[%d].Values", i), Err: fmt.Errorf("%w: %d values for %d candidates", ErrDegenerate, len(f.Values), len(c.Candidates))}
		}
		for j, v := range f.Values {
			field := fmt.Sprintf("Figures[%d].Values[%d]", i, j)
			if err := finite(field, v); err != nil {
				return err
			}
			if !(v > 0) {
				return &InputError{Field: field, Err: fmt.Errorf("%w: %g, want > 0 (figures are scaled by their best value)", ErrRange, v)}
			}
		}
	}
	return nil
}

// relative returns the bar heights of figure f, each in (0, 1], the best 1.
func (f Figure) relative() []float64 {
	best := slices.Max(f.Values)
	if f.LowerIsBetter {
		best = slices.Min(f.Values)
	}
	rs := make([]float64, len(f.Values))
	for i, v := range f.Values {
		if f.LowerIsBetter {
			rs[i] = best / v
		} else {
			rs[i] = v / best
		}
	}
	return rs
}

// WriteSVG writes the bar chart as an SVG document to w. It returns an
// *InputError for invalid input and otherwise only w's error.
func (c Bars) WriteSVG(w io.Writer) error {
	if err := c.validate(); err != nil {
		return err
	}
	// Every bar as wide as the widest value printed on one.
	bw := minBar
	labels := make([][]string, len(c.Figures))
	for i, f := range c.Figures {
		for _, v := range f.Values {
			t := withUnit(sig(v), f.Unit)
			labels[i] = append(labels[i], t)
			bw = math.Max(bw, textWidth(t, fontSize-1)+8)
		}
	}
	var s scene
	x := 24.0
	for i, f := range c.Figures {
		gw := bw * float64(len(c.Candidates))
		better := "higher is better"
		if f.LowerIsBetter {
			better = "lower is better"
		}
		nameW := math.Max(textWidth(f.Name, fontSize), textWidth(better, noteSize))
		pad := math.Max(0, (nameW+8-gw)/2) // a long name widens its group
		x0 := x + pad
		for j, r := range f.relative() {
			h := barsHeight * r
			bx := x0 + float64(j)*bw
			s.add(rect{bx, barsHeight - h, bw, h, "bar", `fill="` + categorical[j%len(categorical)] + `" stroke="#ffffff" stroke-width="1"`})
			s.add(text{bx + bw/2, barsHeight - h - 5, fontSize - 1, "middle", "bar-value", `fill="` + inkColour + `"`, labels[i][j]})
		}
		cx := x0 + gw/2
		s.add(text{cx, barsHeight + 8 + ascent*fontSize, fontSize, "middle", "figure", `fill="` + inkColour + `"`, f.Name},
			text{cx, barsHeight + 10 + (ascent+descent)*fontSize + ascent*noteSize, noteSize, "middle", "figure-sense", `fill="` + mutedColour + `"`, better})
		x = x0 + gw + pad + groupGap
	}
	right := x - groupGap + 12
	s.add(line{0, barsHeight, right, barsHeight, "axis", axisLineStyle})
	for _, v := range ticks(0.25, 1, 0.25) {
		y := barsHeight * (1 - v)
		s.add(line{0, y, right, y, "grid", gridStyle})
	}
	s.yAxis(0, barsHeight, -0.08*barsHeight, 0, 1.08, 0.25, "relative to the best candidate (best = 1)")
	// Legend at the right.
	ext := s.extent()
	lx, ly := ext.x1+24, 0.0
	for j, name := range c.Candidates {
		y := ly + keyRow/2
		s.add(rect{lx + 4, y - 6, 16, 12, "legend-symbol", `fill="` + categorical[j%len(categorical)] + `"`})
		s.keyText(lx, y, name)
		ly += keyRow
	}
	ext = s.extent()
	ny := ext.y1 + 4
	notes := append([]string{"Each figure is scaled to its best candidate (= 1): taller is better. Printed on each bar: its value with its unit."}, c.Notes...)
	for _, n := range notes {
		ny += noteSize * 1.4
		s.add(text{ext.x0, ny, noteSize, "start", "note", `fill="` + mutedColour + `"`, n})
	}
	if c.Title != "" {
		s.add(text{ext.x0, ext.y0 - 12, titleSize, "start", "title", `font-weight="bold" fill="` + inkColour + `"`, c.Title})
	}
	return s.finish(w, c.Title)
}
