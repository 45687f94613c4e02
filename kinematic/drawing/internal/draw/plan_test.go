package draw

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"
)

// cassette returns a plan in the manner of a three-vee coupling: three
// 10 mm balls on an irregular triangle, vees aimed at the centroid (their
// blocks and flank lines), the base outline, two pair axes, the three
// markers and six contact values. The numbers are invented; only the
// drawing is under test.
func cassette() Plan {
	const r = 5e-3
	centres := []Point{{-0.060, -0.035}, {0.065, -0.030}, {0.010, 0.055}}
	c := Point{(centres[0].X + centres[1].X + centres[2].X) / 3, (centres[0].Y + centres[1].Y + centres[2].Y) / 3}
	p := Plan{
		Title:   "Cassette coupling: vees aimed at the centroid",
		Outline: []Point{{-0.085, -0.055}, {0.090, -0.055}, {0.090, 0.075}, {-0.085, 0.075}},
		Scale:   Scale{Name: "Maxwell index", Min: 0, Max: 1},
		Notes:   []string{"Invented numbers for a drawing test."},
	}
	vals := []float64{0.71, 0.64, 0.38, 0.93, 0.55, 0.12}
	for i, b := range centres {
		name := string(rune('A' + i))
		dx, dy := c.X-b.X, c.Y-b.Y
		l := math.Hypot(dx, dy)
		ux, uy := dx/l, dy/l // along the groove
		nx, ny := -uy, ux    // across it
		h := r * math.Sin(math.Pi/4)
		block := func(a, w float64) Point { return Point{b.X + a*ux + w*nx, b.Y + a*uy + w*ny} }
		p.Balls = append(p.Balls, Ball{Name: name, Centre: b, Radius: r})
		p.Seats = append(p.Seats, Seat{
			Name:    name,
			Outline: []Point{block(-12e-3, -8e-3), block(12e-3, -8e-3), block(12e-3, 8e-3), block(-12e-3, 8e-3)},
			Flanks:  []Segment{{block(-10e-3, -h), block(10e-3, -h)}, {block(-10e-3, h), block(10e-3, h)}},
		})
		p.Grooves = append(p.Grooves, Line{Label: "groove " + name, Through: b, Direction: Point{ux, uy}})
		p.Values = append(p.Values,
			Value{Label: name + "1", At: block(0, -h), Value: vals[2*i]},
			Value{Label: name + "2", At: block(0, h), Value: vals[2*i+1]})
	}
	p.PairAxes = []Line{
		{Label: "AB", Through: Point{0.002, -0.032}, Direction: Point{0.3, 1}},
		{Label: "BC", Through: Point{0.040, 0.012}, Direction: Point{-1, 0.6}},
	}
	p.Markers = []Marker{
		{Kind: CouplingCentre, At: c, Label: "grooves meet"},
		{Kind: ThermalCentre, At: Point{c.X + 0.004, c.Y - 0.003}},
		{Kind: PointOfInterest, At: Point{0.030, 0.020}, Label: "detector"},
	}
	return p
}

// TestPlan checks the elements of the plan view and that labels keep
// clear of each other and of the geometry.
func TestPlan(t *testing.T) {
	p := cassette()
	data := render(t, "plan", p.WriteSVG)
	d := checkCommon(t, data)
	if got := len(d.all("circle", "ball")); got != len(p.Balls) {
		t.Errorf("%d ball circles, want %d", got, len(p.Balls))
	}
	if got := len(d.all("circle", "value")); got != len(p.Values) {
		t.Errorf("%d value dots, want %d", got, len(p.Values))
	}
	if got := len(d.all("line", "groove")); got != len(p.Grooves) {
		t.Errorf("%d groove lines, want %d", got, len(p.Grooves))
	}
	if got := len(d.all("line", "pair-axis")); got != len(p.PairAxes) {
		t.Errorf("%d pair-axis lines, want %d", got, len(p.PairAxes))
	}
	if got := len(d.all("polygon", "seat")); got != len(p.Seats) {
		t.Errorf("%d seat outlines, want %d", got, len(p.Seats))
	}
	if got := len(d.all("line", "flank")); got != 6 {
		t.Errorf("%d flank lines, want 6", got)
	}
	if got := len(d.all("polygon", "outline")); got != 1 {
		t.Errorf("%d base outlines, want 1", got)
	}
	if got := len(d.all("rect", "legend-bar")); got != 1 {
		t.Errorf("%d colour legends, want 1", got)
	}
	// Three markers on the plan and three in the legend.
	if got := len(d.all("circle", "marker")) + len(d.all("polygon", "marker")) + len(d.all("rect", "marker")); got != 6 {
		t.Errorf("%d marker symbols, want 6", got)
	}
	// The balls are to scale: the scale bar's length in px per mm times
	// the 5 mm radius is the ball circles' radius.
	var bar []node
	for _, l := range d.all("line", "scale-bar") {
		if l.attrs["y1"] == l.attrs["y2"] {
			bar = append(bar, l)
		}
	}
	if len(bar) != 1 {
		t.Fatalf("%d scale bars, want 1", len(bar))
	}
	// The geometry spans 175 mm, the view 175·1.24 = 217 mm; a quarter is
	// 54 mm, so the round length is 50 mm.
	if !d.hasText("50 mm") {
		t.Errorf("no scale-bar text \"50 mm\"; texts: %q", d.texts())
	}
	pxPerMM := (atof(t, bar[0].attrs["x2"]) - atof(t, bar[0].attrs["x1"])) / 50
	for _, b := range d.all("circle", "ball") {
		if r := atof(t, b.attrs["r"]); math.Abs(r-5*pxPerMM) > 0.02 {
			t.Errorf("ball radius %g px, want 5 mm = %g px", r, 5*pxPerMM)
		}
	}
	for _, want := range []string{"Maxwell index", "A1: 0.710", "C2: 0.120", "grooves meet", "detector", "thermal centre", "groove axis", "instantaneous axis of a seat pair", p.Title} {
		if !d.hasText(want) {
			t.Errorf("no text %q; texts: %q", want, d.texts())
		}
	}
	// Labels keep clear of balls, lines and markers.
	for _, h := range d.all("rect", "halo") {
		a := func(n node, k string) float64 { return atof(t, n.attrs[k]) }
		hb := box{a(h, "x"), a(h, "y"), a(h, "x") + a(h, "width"), a(h, "y") + a(h, "height")}
		for _, c := range d.all("circle", "ball") {
			if discHitsBox(disc{a(c, "cx"), a(c, "cy"), a(c, "r")}, hb) {
				t.Errorf("label at %+v covers a ball", hb)
			}
		}
		for _, cls := range []string{"groove", "pair-axis", "flank"} {
			for _, l := range d.all("line", cls) {
				if segHitsBox(a(l, "x1"), a(l, "y1"), a(l, "x2"), a(l, "y2"), hb) {
					t.Errorf("label at %+v crosses a %s line", hb, cls)
				}
			}
		}
	}
}

// TestPlanFarMarker checks that a marker far outside the geometry (nearly
// parallel grooves meet far away) is shown by an arrow at the edge with its
// coordinates in the legend, inside the viewBox.
func TestPlanFarMarker(t *testing.T) {
	p := cassette()
	p.Markers[0].At = Point{3.0, -1.5}
	d := checkCommon(t, render(t, "plan-far", p.WriteSVG))
	if !d.hasText("grooves meet (off plan)") || !d.hasText("(3000, -1500) mm") {
		t.Errorf("far marker not labelled; texts %q", d.texts())
	}
	if got := len(d.all("polygon", "marker")); got < 2 { // the arrow and the thermal diamond
		t.Errorf("%d polygon markers, want the arrow and the diamond", got)
	}
}

// TestPlanEscapesText checks that markup in names is escaped.
func TestPlanEscapesText(t *testing.T) {
	p := cassette()
	p.Title = `<b>"A" & 'B'</b>`
	p.Balls[0].Name = "A<1>"
	data := render(t, "plan-escape", p.WriteSVG)
	d := checkCommon(t, data)
	if !d.hasText(`<b>"A" & 'B'</b>`) || !d.hasText("A<1>") {
		t.Errorf("escaped names not found; texts %q", d.texts())
	}
	if strings.Contains(string(data), "<b>") {
		t.Errorf("raw markup in output")
	}
}

// TestPlanErrors checks that bad input names its field and wraps the
// sentinel, and that nothing is written.
func TestPlanErrors(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name   string
		edit   func(*Plan)
		field  string
		target error
	}{
		{"NaN ball centre", func(p *Plan) { p.Balls[1].Centre.Y = nan }, "Balls[1].Centre.Y", ErrNonFinite},
		{"zero radius", func(p *Plan) { p.Balls[2].Radius = 0 }, "Balls[2].Radius", ErrRange},
		{"Inf value", func(p *Plan) { p.Values[3].Value = inf }, "Values[3].Value", ErrNonFinite},
		{"huge value", func(p *Plan) { p.Values[0].Value = -1e308 }, "Values[0].Value", ErrRange},
		{"tiny", func(p *Plan) { *p = Plan{Balls: []Ball{{Radius: 1e-300}}} }, "Plan", ErrRange},
		{"far and small", func(p *Plan) { *p = Plan{Balls: []Ball{{Centre: Point{1e6, 0}, Radius: 1e-9}}} }, "Plan", ErrDegenerate},
		{"Inf outline", func(p *Plan) { p.Outline[2].X = -inf }, "Outline[2].X", ErrNonFinite},
		{"NaN flank", func(p *Plan) { p.Seats[0].Flanks[1].B.X = nan }, "Seats[0].Flanks[1].B.X", ErrNonFinite},
		{"NaN axis direction", func(p *Plan) { p.PairAxes[1].Direction.X = nan }, "PairAxes[1].Direction.X", ErrNonFinite},
		{"bad kind", func(p *Plan) { p.Markers[2].Kind = 7 }, "Markers[2].Kind", ErrRange},
		{"inverted scale", func(p *Plan) { p.Scale = Scale{Min: 1, Max: 0.5} }, "Scale.Max", ErrRange},
		{"nothing", func(p *Plan) { *p = Plan{Title: "empty"} }, "Plan", ErrDegenerate},
		{"one point", func(p *Plan) { *p = Plan{Values: []Value{{At: Point{1, 1}, Value: 1}}} }, "Plan", ErrDegenerate},
		{"huge", func(p *Plan) { p.Outline[0].X = -1e308; p.Outline[1].X = 1e308 }, "Plan", ErrRange},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			p := cassette()
			c.edit(&p)
			var b strings.Builder
			err := p.WriteSVG(&b)
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.target) {
				t.Fatalf("err = %v, want *InputError on %s wrapping %v", err, c.field, c.target)
			}
			if b.Len() != 0 {
				t.Errorf("wrote %d bytes on error", b.Len())
			}
		})
	}
}

// TestPlanCrowded draws many balls with values close together: the
// labels must still not overlap, and the canvas grows to hold them.
func TestPlanCrowded(t *testing.T) {
	var p Plan
	p.Title = "crowded"
	for i := range 12 {
		x := 0.004 * float64(i%4)
		y := 0.004 * float64(i/4)
		p.Balls = append(p.Balls, Ball{Name: fmt.Sprintf("ball %d", i), Centre: Point{x, y}, Radius: 1.5e-3})
		p.Values = append(p.Values, Value{Label: fmt.Sprintf("c%d", i), At: Point{x + 1e-3, y}, Value: float64(i)})
	}
	p.Markers = []Marker{{Kind: CouplingCentre, At: Point{0.006, 0.004}}, {Kind: ThermalCentre, At: Point{0.0062, 0.0041}}, {Kind: PointOfInterest, At: Point{0.0059, 0.0039}}}
	p.Grooves = []Line{{Label: "g", Through: Point{}, Direction: Point{1, 1}}, {Label: "vertical axis", Through: Point{0.005, 0.005}}}
	d := checkCommon(t, render(t, "plan-crowded", p.WriteSVG))
	if got := len(d.all("rect", "halo")); got != 12+12+3+2 {
		t.Errorf("%d labels, want 29", got)
	}
}
