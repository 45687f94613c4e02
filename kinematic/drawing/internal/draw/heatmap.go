package draw

import (
	"fmt"
	"io"
	"math"
)

// Grid is a regular grid of cells over a plan region with one value per
// cell, for example the external force at which some contact lifts off
// for a load applied at each cell.
type Grid struct {
	X0, Y0 float64 // lower-left corner of cell (0, 0), m
	DX, DY float64 // cell size along x and y, m, > 0
	NX, NY int     // cells along x and y, ≥ 1
	// Values holds NX·NY values, in the unit of the map's Scale, row by
	// row from the bottom: Values[j*NX+i] is the cell whose lower-left
	// corner is (X0 + i·DX, Y0 + j·DY). +Inf is drawn hatched and named
	// by the map's InfLabel; NaN marks a cell outside the region, not
	// drawn; −Inf is an error.
	Values []float64
}

// HeatMap is a map of values on a grid over a region, with a colour
// legend, axes in millimetres, and optional outline and markers.
type HeatMap struct {
	Title    string
	Grid     Grid
	Scale    Scale    // the values' quantity and unit; zero Min and Max: from the data
	InfLabel string   // the legend text of +Inf cells; empty means "never"
	Outline  []Point  // drawn over the cells, m
	Markers  []Marker // drawn over the cells
	Notes    []string // lines of text under the drawing
}

const (
	mapSize = 480.0 // px, the larger side of the grid
	// maxCells bounds the cells of a map so that a drawing stays a few
	// megabytes at most (about 150 bytes per cell).
	maxCells = 100000
)

func (m HeatMap) validate() error {
	g := m.Grid
	for _, f := range []struct {
		name string
		v    float64
	}{{"Grid.X0", g.X0}, {"Grid.Y0", g.Y0}, {"Grid.DX", g.DX}, {"Grid.DY", g.DY}} {
		if err := finite(f.name, f.v); err != nil {
			return err
		}
		if math.Abs(f.v) > maxCoord {
			return &InputError{Field: f.name, Err: fmt.Errorf("%w: %g beyond %g m", ErrRange, f.v, maxCoord)}
		}
	}
	if !(g.DX > 0) {
		return &InputError{Field: "Grid.DX", Err: fmt.Errorf("%w: %g, want > 0", ErrRange, g.DX)}
	}
	if !(g.DY > 0) {
		return &InputError{Field: "Grid.DY", Err: fmt.Errorf("%w: %g, want > 0", ErrRange, g.DY)}
	}
	if g.NX < 1 || g.NX > maxCells {
		return &InputError{Field: "Grid.NX", Err: fmt.Errorf("%w: %d, want 1 to %d", ErrRange, g.NX, maxCells)}
	}
	if g.NY < 1 || g.NY > maxCells/g.NX {
		return &InputError{Field: "Grid.NY", Err: fmt.Errorf("%w: %d, want 1 to %d for NX = %d", ErrRange, g.NY, maxCells/g.NX, g.NX)}
	}
	if len(g.Values) != g.NX*g.NY {
		return &InputError{Field: "Grid.Values", Err: fmt.Errorf("%w: %d values for %d × %d cells", ErrDegenerate, len(g.Values), g.NX, g.NY)}
	}
	for k, v := range g.Values {
		if math.IsInf(v, -1) {
			return &InputError{Field: fmt.Sprintf("Grid.Values[%d]", k), Err: fmt.Errorf("%w: -Inf", ErrNonFinite)}
		}
		if math.Abs(v) > maxValue && !math.IsInf(v, 1) {
			return &InputError{Field: fmt.Sprintf("Grid.Values[%d]", k), Err: fmt.Errorf("%w: %g beyond ±%g", ErrRange, v, maxValue)}
		}
	}
	for i, q := range m.Outline {
		if err := finite(fmt.Sprintf("Outline[%d].X", i), q.X); err != nil {
			return err
		}
		if err := finite(fmt.Sprintf("Outline[%d].Y", i), q.Y); err != nil {
			return err
		}
	}
	for i, mk := range m.Markers {
		if err := finite(fmt.Sprintf("Markers[%d].At.X", i), mk.At.X); err != nil {
			return err
		}
		if err := finite(fmt.Sprintf("Markers[%d].At.Y", i), mk.At.Y); err != nil {
			return err
		}
		if mk.Kind < CouplingCentre || mk.Kind > PointOfInterest {
			return &InputError{Field: fmt.Sprintf("Markers[%d].Kind", i), Err: fmt.Errorf("%w: unknown kind %d", ErrRange, mk.Kind)}
		}
	}
	return m.Scale.validate("Scale")
}

// WriteSVG writes the heat map as an SVG document to w. It returns an
// *InputError for invalid input and otherwise only w's error.
func (m HeatMap) WriteSVG(w io.Writer) error {
	if err := m.validate(); err != nil {
		return err
	}
	g := m.Grid
	r := region{g.X0, g.Y0, g.X0 + float64(g.NX)*g.DX, g.Y0 + float64(g.NY)*g.DY}
	for _, q := range m.Outline {
		r = r.add(q, 0)
	}
	for _, mk := range m.Markers {
		r = r.add(mk.At, 0)
	}
	if err := r.check("HeatMap"); err != nil {
		return err
	}
	size := math.Max(r.x1-r.x0, r.y1-r.y0)
	k := mapSize / size
	px := func(q Point) (float64, float64) { return (q.X - r.x0) * k, (r.y1 - q.Y) * k }

	var s scene
	s.defs = append(s.defs, `<pattern id="never" width="6" height="6" patternUnits="userSpaceOnUse"><rect x="0" y="0" width="6" height="6" fill="#f1f1f1"/><path d="M0 6L6 0M-1 1L1 -1M5 7L7 5" stroke="#8f8f8f" stroke-width="1.2"/></pattern>`)
	lo, hi := m.Scale.resolve(g.Values)
	hasInf, hasFinite := m.cells(&s, px, k, lo, hi)
	if len(m.Outline) > 0 {
		xy := make([]float64, 0, 2*len(m.Outline))
		for _, q := range m.Outline {
			x, y := px(q)
			xy = append(xy, x, y)
		}
		s.add(poly{xy, true, "outline", `fill="none" stroke="#222222" stroke-width="1.6"`})
		for i := range m.Outline {
			j := (i + 1) % len(m.Outline)
			s.place.segs = append(s.place.segs, seg{xy[2*i], xy[2*i+1], xy[2*j], xy[2*j+1], 1})
		}
	}
	W, H := (r.x1-r.x0)*k, (r.y1-r.y0)*k
	s.xAxis(0, W, H+6, r.x0*1e3, r.x1*1e3, "x, mm")
	s.yAxis(-6, H, 0, r.y0*1e3, r.y1*1e3, 0, "y, mm")
	type mk struct {
		x, y  float64
		label string
	}
	var mks []mk
	for _, q := range m.Markers {
		x, y := px(q.At)
		s.place.boxes = append(s.place.boxes, s.marker(q.Kind, x, y))
		label := q.Label
		if label == "" {
			label = q.Kind.name()
		}
		mks = append(mks, mk{x, y, label})
	}
	for _, q := range mks {
		s.label(q.label, q.x, q.y, markerSize*1.3+3, fontSize, "marker-label", inkColour)
	}
	m.legend(&s, lo, hi, hasFinite, hasInf)
	// Notes under, title above.
	ext := s.extent()
	ny := ext.y1 + 4
	for _, n := range m.Notes {
		ny += noteSize * 1.4
		s.add(text{ext.x0, ny, noteSize, "start", "note", `fill="` + mutedColour + `"`, n})
	}
	if m.Title != "" {
		s.add(text{ext.x0, ext.y0 - 12, titleSize, "start", "title", `font-weight="bold" fill="` + inkColour + `"`, m.Title})
	}
	return s.finish(w, m.Title)
}

// cells draws the grid's cells into s, px placing a point and k px per
// metre, coloured on the scale from lo to hi; a NaN cell is left empty
// and a +Inf one hatched. It reports whether there were hatched cells
// and coloured ones.
func (m HeatMap) cells(s *scene, px func(Point) (float64, float64), k, lo, hi float64) (hasInf, hasFinite bool) {
	g := m.Grid
	for j := range g.NY {
		for i := range g.NX {
			v := g.Values[j*g.NX+i]
			if math.IsNaN(v) {
				continue
			}
			x, y := px(Point{g.X0 + float64(i)*g.DX, g.Y0 + float64(j+1)*g.DY})
			cw, ch := g.DX*k, g.DY*k
			if math.IsInf(v, 1) {
				hasInf = true
				s.add(rect{x, y, cw, ch, "cell-never", `fill="url(#never)" stroke="none" shape-rendering="crispEdges"`})
				continue
			}
			hasFinite = true
			c := colour(fraction(v, lo, hi))
			s.add(rect{x, y, cw, ch, "cell", `fill="` + c + `" stroke="` + c + `" stroke-width="0.3" shape-rendering="crispEdges"`})
		}
	}
	return hasInf, hasFinite
}

// legend draws the legend at the right of s: the colour bar from lo to
// hi if there are coloured cells, the hatching if there are hatched
// ones, and the markers.
func (m HeatMap) legend(s *scene, lo, hi float64, hasFinite, hasInf bool) {
	ext := s.extent()
	lx := ext.x1 + 24
	ly := 0.0
	if hasFinite {
		ly = s.colourBar(lx, 0, lo, hi, m.Scale.Name, m.Scale.Unit).y1 + 16
	}
	if hasInf {
		infLabel := m.InfLabel
		if infLabel == "" {
			infLabel = "never"
		}
		s.add(rect{lx, ly, barWidth, barWidth, "legend-never", `fill="url(#never)" stroke="#444444" stroke-width="0.8"`},
			text{lx + barWidth + 7, ly + barWidth/2 + 0.35*fontSize, fontSize, "start", "legend", `fill="` + inkColour + `"`, infLabel})
		ly += keyRow
	}
	for _, q := range m.Markers {
		label := q.Label
		if label == "" {
			label = q.Kind.name()
		}
		y := ly + keyRow/2
		s.marker(q.Kind, lx+12, y)
		s.keyText(lx, y, fmt.Sprintf("%s (%s, %s) mm", label, sig(q.At.X*1e3), sig(q.At.Y*1e3)))
		ly += keyRow
	}
}
