package draw

import (
	"fmt"
	"io"
	"math"
)

// Point is a position in plan, m: x to the right, y up.
type Point struct{ X, Y float64 }

// Segment is a straight piece of line between two plan points, m.
type Segment struct{ A, B Point }

// Ball is a ball seen from above: a circle to scale.
type Ball struct {
	Name   string // printed beside the ball; may be empty
	Centre Point  // m
	Radius float64
}

// Seat is a seat seen from above: its outline (a closed polygon, for
// example the block of a vee), its flank lines (for example the lines where
// a vee's flanks meet the ball), or both.
type Seat struct {
	Name    string // not printed; names the seat in errors
	Outline []Point
	Flanks  []Segment
}

// Line is an infinite line in plan through a point along a direction
// (any length but zero), drawn across the view and trimmed at its edge. A
// zero Direction means a line normal to the plan, drawn as a ring at
// Through.
type Line struct {
	Label     string // printed beside the line where it enters the view; may be empty
	Through   Point  // m
	Direction Point  // any scale
}

// Marker is a marked point in plan.
type Marker struct {
	Kind  MarkerKind
	At    Point  // m
	Label string // printed beside the symbol; empty means the kind's name
}

// Value is a value shown at a point of the plan: a dot coloured on the
// plan's Scale with the value printed beside it (after Label, if any), for
// example a contact's Maxwell index.
type Value struct {
	Label string
	At    Point   // m
	Value float64 // in Scale.Unit
}

// Plan is a plan view of a coupling: base outline, seats, balls to scale,
// groove axes, instantaneous axes of seat pairs, markers, values at the
// contacts on a colour scale, a scale bar in millimetres and a title. Every
// field may be empty except that something must be drawn.
type Plan struct {
	Title    string
	Outline  []Point // the base outline, a closed polygon, m
	Seats    []Seat
	Balls    []Ball
	Grooves  []Line // groove axes: dashed
	PairAxes []Line // instantaneous axes of seat pairs: dash-dot
	Markers  []Marker
	Values   []Value
	Scale    Scale    // the colour scale of Values
	Notes    []string // lines of text under the drawing
}

// Plan sizing.
const (
	planSize = 560.0 // px, the larger side of the view of the geometry
	// lineReach is how far beyond the geometry lines run, as a fraction
	// of the geometry's larger side: far enough to read their direction.
	lineReach = 0.12
	// farMarker is the distance from the centre of the geometry, in units
	// of its half diagonal, beyond which a marker is not brought into the
	// view (it would shrink the plan more than about 2.5 times) but shown
	// by an arrow on the edge, with its coordinates in the legend.
	farMarker = 1.5
	// maxCoord bounds the plan coordinates, m, so that no sum or product
	// formed in drawing (the view's diagonal, a line's far ends, px) can
	// leave the floating-point range; it is a range guard, not a tolerance.
	maxCoord = 1e100
)

// validate checks every number of the plan.
func (p Plan) validate() error {
	pt := func(field string, q Point) error {
		if err := finite(field+".X", q.X); err != nil {
			return err
		}
		return finite(field+".Y", q.Y)
	}
	for i, q := range p.Outline {
		if err := pt(fmt.Sprintf("Outline[%d]", i), q); err != nil {
			return err
		}
	}
	for i, s := range p.Seats {
		for j, q := range s.Outline {
			if err := pt(fmt.Sprintf("Seats[%d].Outline[%d]", i, j), q); err != nil {
				return err
			}
		}
		for j, f := range s.Flanks {
			if err := pt(fmt.Sprintf("Seats[%d].Flanks[%d].A", i, j), f.A); err != nil {
				return err
			}
			if err := pt(fmt.Sprintf("Seats[%d].Flanks[%d].B", i, j), f.B); err != nil {
				return err
			}
		}
	}
	for i, b := range p.Balls {
		f := fmt.Sprintf("Balls[%d]", i)
		if err := pt(f+".Centre", b.Centre); err != nil {
			return err
		}
		if err := finite(f+".Radius", b.Radius); err != nil {
			return err
		}
		if !(b.Radius > 0) {
			return &InputError{Field: f + ".Radius", Err: fmt.Errorf("%w: %g, want > 0", ErrRange, b.Radius)}
		}
	}
	for _, g := range []struct {
		name string
		ls   []Line
	}{{"Grooves", p.Grooves}, {"PairAxes", p.PairAxes}} {
		for i, l := range g.ls {
			f := fmt.Sprintf("%s[%d]", g.name, i)
			if err := pt(f+".Through", l.Through); err != nil {
				return err
			}
			if err := pt(f+".Direction", l.Direction); err != nil {
				return err
			}
		}
	}
	for i, m := range p.Markers {
		if err := pt(fmt.Sprintf("Markers[%d].At", i), m.At); err != nil {
			return err
		}
		if m.Kind < CouplingCentre || m.Kind > PointOfInterest {
			return &InputError{Field: fmt.Sprintf("Markers[%d].Kind", i), Err: fmt.Errorf("%w: unknown kind %d", ErrRange, m.Kind)}
		}
	}
	for i, v := range p.Values {
		f := fmt.Sprintf("Values[%d]", i)
		if err := pt(f+".At", v.At); err != nil {
			return err
		}
		if err := value(f+".Value", v.Value); err != nil {
			return err
		}
	}
	return p.Scale.validate("Scale")
}

// region is a box in plan metres, y up.
type region struct{ x0, y0, x1, y1 float64 }

func emptyRegion() region { return region{math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)} }

func (r region) add(q Point, pad float64) region {
	return region{math.Min(r.x0, q.X-pad), math.Min(r.y0, q.Y-pad), math.Max(r.x1, q.X+pad), math.Max(r.y1, q.Y+pad)}
}

func (r region) ok() bool { return r.x0 <= r.x1 && r.y0 <= r.y1 }

// Limits of a drawable region, m.
const (
	// minExtent keeps the scale, px per metre, finite: 560 px over less
	// than about 1e-306 m overflows. It is a range guard, not a tolerance.
	minExtent = 1e-290
	// minRelExtent is the smallest extent relative to the distance from
	// the origin: coordinates carry a relative rounding error of 2⁻⁵³, so
	// at 1e-12 the drawing is still true to 1e-4 of its size.
	minRelExtent = 1e-12
)

// check reports a region that cannot be drawn, naming field.
func (r region) check(field string) error {
	far := math.Max(math.Max(-r.x0, r.x1), math.Max(-r.y0, r.y1))
	size := math.Max(r.x1-r.x0, r.y1-r.y0)
	switch {
	case far > maxCoord:
		return &InputError{Field: field, Err: fmt.Errorf("%w: coordinates beyond %g m", ErrRange, maxCoord)}
	case !(size > 0):
		return &InputError{Field: field, Err: fmt.Errorf("%w: everything lies at one point", ErrDegenerate)}
	case size < minExtent:
		return &InputError{Field: field, Err: fmt.Errorf("%w: extent %g m is too small to draw", ErrRange, size)}
	case size < minRelExtent*far:
		return &InputError{Field: field, Err: fmt.Errorf("%w: extent %g m is too small against its distance %g m from the origin", ErrDegenerate, size, far)}
	}
	return nil
}

// WriteSVG writes the plan view as an SVG document to w. It returns an
// *InputError for invalid input (see the package documentation) and
// otherwise only w's error.
func (p Plan) WriteSVG(w io.Writer) error {
	if err := p.validate(); err != nil {
		return err
	}
	r, near := p.region()
	if !r.ok() {
		return &InputError{Field: "Plan", Err: fmt.Errorf("%w: nothing to draw (no outline, seat, ball, value or marker)", ErrDegenerate)}
	}
	if err := r.check("Plan"); err != nil {
		return err
	}
	d := newPlanDrawing(r)
	d.outlines(p)
	d.lines(p.Grooves, "groove", grooveStyle, "#2b5d8a", "groove axis")
	d.lines(p.PairAxes, "pair-axis", axisStyle, axisColour, "pair axis")
	d.bodies(p)
	lo, hi := d.values(p)
	d.markers(p, near)
	d.labels(p)
	d.legend(p, lo, hi)
	d.footer(p)
	// Title above everything.
	ext := d.s.extent()
	if p.Title != "" {
		d.s.add(text{ext.x0, ext.y0 - 12, titleSize, "start", "title", `font-weight="bold" fill="` + inkColour + `"`, p.Title})
	}
	return d.s.finish(w, p.Title)
}

// region returns the extent of the plan's geometry and its markers,
// and which markers are near enough to it to be drawn in the view
// (the others get an arrow on the edge of the view).
func (p Plan) region() (r region, near []bool) {
	// The geometry's extent, without the markers.
	r = emptyRegion()
	for _, q := range p.Outline {
		r = r.add(q, 0)
	}
	for _, s := range p.Seats {
		for _, q := range s.Outline {
			r = r.add(q, 0)
		}
		for _, f := range s.Flanks {
			r = r.add(f.A, 0).add(f.B, 0)
		}
	}
	for _, b := range p.Balls {
		r = r.add(b.Centre, b.Radius)
	}
	for _, v := range p.Values {
		r = r.add(v.At, 0)
	}
	base := r
	near = make([]bool, len(p.Markers))
	for i, m := range p.Markers {
		if base.ok() {
			cx, cy := (base.x0+base.x1)/2, (base.y0+base.y1)/2
			half := math.Hypot(base.x1-base.x0, base.y1-base.y0) / 2
			if math.Hypot(m.At.X-cx, m.At.Y-cy) > farMarker*half && half > 0 {
				continue
			}
		}
		near[i] = true
		r = r.add(m.At, 0)
	}
	return r, near
}

// planDrawing is a plan view being drawn: the scene, the mapping from
// the plan to it, and what is gathered on the way to be drawn later.
type planDrawing struct {
	s     scene
	notes []string
	view  region  // the plan's region in view, m
	k     float64 // px per metre
	vb    box     // the view in px

	lineLabels []lineLabel
	rings      []ring // lines normal to the plan, drawn over the balls
	mks        []planMark
}

// lineLabel is a line's label, placed after the bodies are drawn.
type lineLabel struct {
	text, colour string
	x, y, clear  float64
}

// ring is a line normal to the plan, drawn as a ring over the balls.
type ring struct {
	x, y          float64
	class, colour string
}

// planMark is a marker's label and where it goes, in px.
type planMark struct {
	x, y  float64
	label string
}

// newPlanDrawing returns a drawing whose view is the region r grown by
// the lines' reach.
func newPlanDrawing(r region) *planDrawing {
	size := math.Max(r.x1-r.x0, r.y1-r.y0)
	// View: the region grown by the lines' reach; px per metre.
	reach := lineReach * size
	view := region{r.x0 - reach, r.y0 - reach, r.x1 + reach, r.y1 + reach}
	k := planSize / size
	return &planDrawing{view: view, k: k, vb: box{0, 0, (view.x1 - view.x0) * k, (view.y1 - view.y0) * k}}
}

// px returns the position of the plan point q in px.
func (d *planDrawing) px(q Point) (float64, float64) {
	return (q.X - d.view.x0) * d.k, (d.view.y1 - q.Y) * d.k
}

// polygon draws the closed polygon pts as an obstacle for labels.
func (d *planDrawing) polygon(pts []Point, class, style string) {
	xy := make([]float64, 0, 2*len(pts))
	for _, q := range pts {
		x, y := d.px(q)
		xy = append(xy, x, y)
	}
	d.s.add(poly{xy, true, class, style})
	for i := range pts {
		j := (i + 1) % len(pts)
		d.s.place.segs = append(d.s.place.segs, seg{xy[2*i], xy[2*i+1], xy[2*j], xy[2*j+1], 1})
	}
}

// outlines draws the outline and the seats' outlines.
func (d *planDrawing) outlines(p Plan) {
	if len(p.Outline) > 0 {
		d.polygon(p.Outline, "outline", outlineStyle)
	}
	for _, st := range p.Seats {
		if len(st.Outline) > 0 {
			d.polygon(st.Outline, "seat", seatStyle)
		}
	}
}

// lines draws the lines ls trimmed to the view; a line normal to the
// plan becomes a ring, drawn later over the balls, and a line outside
// the view a note naming it as what.
func (d *planDrawing) lines(ls []Line, class, style, colour, what string) {
	view := d.view
	for _, l := range ls {
		x, y := d.px(l.Through)
		if l.Direction == (Point{}) {
			d.rings = append(d.rings, ring{x, y, class, colour})
			d.s.place.discs = append(d.s.place.discs, disc{x, y, 6})
			if l.Label != "" {
				d.lineLabels = append(d.lineLabels, lineLabel{l.Label, colour, x, y, 6 + labelGap})
			}
			continue
		}
		// Two points far beyond the view on either side (its diagonal
		// from Through), then clipped to it.
		dl := math.Hypot(l.Direction.X, l.Direction.Y)
		span := 2 * (math.Hypot(view.x1-view.x0, view.y1-view.y0) + math.Hypot(l.Through.X-(view.x0+view.x1)/2, l.Through.Y-(view.y0+view.y1)/2))
		a := Point{l.Through.X - span*l.Direction.X/dl, l.Through.Y - span*l.Direction.Y/dl}
		b := Point{l.Through.X + span*l.Direction.X/dl, l.Through.Y + span*l.Direction.Y/dl}
		ax, ay := d.px(a)
		bx, by := d.px(b)
		x1, y1, x2, y2, ok := clipSeg(ax, ay, bx, by, d.vb)
		if !ok || math.Hypot(x2-x1, y2-y1) < 1 {
			name := l.Label
			if name == "" {
				name = "unnamed"
			}
			d.notes = append(d.notes, fmt.Sprintf("%s %s passes outside the view.", what, name))
			continue
		}
		d.s.add(line{x1, y1, x2, y2, class, style})
		d.s.place.segs = append(d.s.place.segs, seg{x1, y1, x2, y2, 1.5})
		if l.Label != "" {
			// Anchor near the end the line leaves the view by, right or up.
			ex, ey := x2, y2
			if x1 > x2 || (x1 == x2 && y1 < y2) {
				ex, ey = x1, y1
			}
			f := 0.06
			d.lineLabels = append(d.lineLabels, lineLabel{l.Label, colour, ex + f*(x1+x2-2*ex), ey + f*(y1+y2-2*ey), 4})
		}
	}
}

// bodies draws the seats' flanks, the balls and, over them, the rings.
func (d *planDrawing) bodies(p Plan) {
	for _, st := range p.Seats {
		for _, f := range st.Flanks {
			x1, y1 := d.px(f.A)
			x2, y2 := d.px(f.B)
			d.s.add(line{x1, y1, x2, y2, "flank", flankStyle})
			d.s.place.segs = append(d.s.place.segs, seg{x1, y1, x2, y2, 1.5})
		}
	}
	for _, b := range p.Balls {
		x, y := d.px(b.Centre)
		d.s.add(circle{x, y, b.Radius * d.k, "ball", ballStyle})
		d.s.place.discs = append(d.s.place.discs, disc{x, y, b.Radius*d.k + 1})
	}
	for _, r := range d.rings {
		d.s.add(circle{r.x, r.y, 5, r.class, `fill="#ffffff" stroke="` + r.colour + `" stroke-width="1.4"`},
			circle{r.x, r.y, 1.5, r.class + "-detail", `fill="` + r.colour + `"`})
	}
}

// values draws the value dots and returns the ends of their colour
// scale.
func (d *planDrawing) values(p Plan) (lo, hi float64) {
	vals := make([]float64, len(p.Values))
	for i, v := range p.Values {
		vals[i] = v.Value
	}
	lo, hi = p.Scale.resolve(vals)
	for _, v := range p.Values {
		x, y := d.px(v.At)
		d.s.add(circle{x, y, dotRadius, "value", `fill="` + colour(fraction(v.Value, lo, hi)) + `" stroke="#1d1d1d" stroke-width="0.8"`})
		d.s.place.discs = append(d.s.place.discs, disc{x, y, dotRadius + 1.5})
	}
	return lo, hi
}

// markers draws the markers in view (near), and for the others an arrow
// on the edge of the view towards them.
func (d *planDrawing) markers(p Plan, near []bool) {
	view := d.view
	cx, cy := d.px(Point{(view.x0 + view.x1) / 2, (view.y0 + view.y1) / 2})
	for i, m := range p.Markers {
		label := m.Label
		if label == "" {
			label = m.Kind.name()
		}
		x, y := d.px(m.At)
		if !near[i] {
			// Where the ray from the view's centre towards the marker leaves the view.
			_, _, x2, y2, _ := clipSeg(cx, cy, x, y, d.vb.grow(-markerSize*1.5))
			th := math.Atan2(y-cy, x-cx)
			d.s.place.boxes = append(d.s.place.boxes, d.s.arrow(x2, y2, th, m.Kind.colour()))
			d.mks = append(d.mks, planMark{x2, y2, label + " (off plan)"})
			continue
		}
		d.s.place.boxes = append(d.s.place.boxes, d.s.marker(m.Kind, x, y))
		d.mks = append(d.mks, planMark{x, y, label})
	}
}

// labels places the labels, the most important first.
func (d *planDrawing) labels(p Plan) {
	for _, b := range p.Balls {
		if b.Name != "" {
			x, y := d.px(b.Centre)
			d.s.label(b.Name, x, y, b.Radius*d.k+3, fontSize+1, "ball-label", inkColour)
		}
	}
	for _, m := range d.mks {
		d.s.label(m.label, m.x, m.y, markerSize*1.3+3, fontSize, "marker-label", inkColour)
	}
	for _, v := range p.Values {
		x, y := d.px(v.At)
		t := withUnit(sig(v.Value), p.Scale.Unit)
		if v.Label != "" {
			t = v.Label + ": " + t
		}
		d.s.label(t, x, y, dotRadius+3, fontSize, "value-label", inkColour)
	}
	for _, l := range d.lineLabels {
		d.s.label(l.text, l.x, l.y, l.clear, fontSize, "line-label", l.colour)
	}
}

// legend draws the legend to the right of everything drawn so far: the
// colour bar from lo to hi if there are values, then a key row for each
// kind of thing drawn.
func (d *planDrawing) legend(p Plan, lo, hi float64) {
	s := &d.s
	ext := s.extent().union(d.vb)
	lx, ly := ext.x1+24, ext.y0
	if len(p.Values) > 0 {
		ly = s.colourBar(lx, ly, lo, hi, p.Scale.Name, p.Scale.Unit).y1 + 16
	}
	row := func(str string, sym func(x, y float64)) {
		y := ly + keyRow/2
		sym(lx+12, y)
		s.keyText(lx, y, str)
		ly += keyRow
	}
	if len(p.Balls) > 0 {
		row("ball (to scale)", func(x, y float64) { s.add(circle{x, y, 7, "legend-symbol", ballStyle}) })
	}
	if hasOutline(p.Seats) {
		row("seat", func(x, y float64) { s.add(rect{x - 9, y - 6, 18, 12, "legend-symbol", seatStyle}) })
	}
	if hasFlanks(p.Seats) {
		row("seat flank", func(x, y float64) { s.add(line{x - 10, y, x + 10, y, "legend-symbol", flankStyle}) })
	}
	if len(p.Grooves) > 0 {
		row("groove axis", func(x, y float64) { s.add(line{x - 11, y, x + 11, y, "legend-symbol", grooveStyle}) })
	}
	if len(p.PairAxes) > 0 {
		row("instantaneous axis of a seat pair", func(x, y float64) { s.add(line{x - 11, y, x + 11, y, "legend-symbol", axisStyle}) })
	}
	for _, m := range p.Markers {
		label := m.Label
		if label == "" {
			label = m.Kind.name()
		}
		row(fmt.Sprintf("%s (%s, %s) mm", label, sig(m.At.X*1e3), sig(m.At.Y*1e3)), func(x, y float64) { s.marker(m.Kind, x, y) })
	}
}

// footer draws the scale bar under everything, at the left, and the
// notes under it.
func (d *planDrawing) footer(p Plan) {
	s := &d.s
	ext := s.extent()
	mm := roundBelow(0.25 * (d.view.x1 - d.view.x0) * 1e3)
	L := mm * 1e-3 * d.k
	sx, sy := d.vb.x0, ext.y1+18
	s.add(line{sx, sy, sx + L, sy, "scale-bar", `stroke="` + inkColour + `" stroke-width="2"`},
		line{sx, sy - 5, sx, sy + 5, "scale-bar", `stroke="` + inkColour + `" stroke-width="1.5"`},
		line{sx + L/2, sy - 3, sx + L/2, sy + 3, "scale-bar", `stroke="` + inkColour + `" stroke-width="1"`},
		line{sx + L, sy - 5, sx + L, sy + 5, "scale-bar", `stroke="` + inkColour + `" stroke-width="1.5"`},
		text{sx + L + 8, sy + 0.35*fontSize, fontSize, "start", "scale-bar", `fill="` + inkColour + `"`, tickText(mm, mm) + " mm"})
	ny := sy + 12
	for _, n := range append(append([]string{"Plan view, x right, y up; millimetres."}, d.notes...), p.Notes...) {
		ny += noteSize * 1.4
		s.add(text{sx, ny, noteSize, "start", "note", `fill="` + mutedColour + `"`, n})
	}
}

func hasOutline(ss []Seat) bool {
	for _, s := range ss {
		if len(s.Outline) > 0 {
			return true
		}
	}
	return false
}

func hasFlanks(ss []Seat) bool {
	for _, s := range ss {
		if len(s.Flanks) > 0 {
			return true
		}
	}
	return false
}
