package drawing_test

import (
	"bytes"
	"errors"
	"image/color"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// The bench fixture's balls, mm: on a 50 mm circle at 90°, 210° and
// 330°, so two balls are 50·√3 = 86.603 mm apart (closed form), radius
// 6.35 mm.
const (
	benchSide   = 86.60254037844386
	benchRadius = 6.35
)

func draw(t *testing.T, name string, f func(io.Writer) error) svgDoc {
	t.Helper()
	var buf bytes.Buffer
	if err := f(&buf); err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	d := parse(t, name, buf.Bytes())
	onCanvas(t, name, d)
	return d
}

// labelBox returns the box of a text, page pt: its measured width, from
// 0.8 size above the baseline to 0.25 size below.
func labelBox(x svgText) [4]float64 {
	return [4]float64{x.x, x.y - 0.8*x.size, x.x + width(x.s, x.size), x.y + 0.25*x.size}
}

func overlap(a, b [4]float64) bool {
	return a[0] < b[2] && b[0] < a[2] && a[1] < b[3] && b[1] < a[3]
}

// TestPlanDrawn: the balls to scale at their positions, on equal
// scales; every label present, none over another; no footnote of axes
// off the drawing unless asked; keep-outs and windows drawn.
func TestPlanDrawn(t *testing.T) {
	b, ev := built(t, bench)
	keep := []kinematic.KeepOut{{Name: "cable exit", At: r3.Vec{X: -0.030, Y: 0.040}, Clearance: 0.3}}
	wins, err := kinematic.KeepOutWindows(b.Coupling(), keep)
	if err != nil {
		t.Fatal(err)
	}
	opt := &drawing.Options{Title: "Bench, plan", PointName: "probe tip", KeepOuts: keep, Windows: wins}
	d := draw(t, "plan", func(w io.Writer) error { return drawing.Plan(w, b, ev, opt) })
	if d.title != "Bench, plan" {
		t.Errorf("title %q", d.title)
	}
	var balls []svgPath
	for _, p := range d.paths {
		if p.style == "fill:#E4E4E4" && len(p.pts) == 48 {
			balls = append(balls, p)
		}
	}
	if len(balls) != 3 {
		t.Fatalf("%d ball outlines, want 3", len(balls))
	}
	_, _, r0, _ := centroid(balls[0])
	s := r0 / benchRadius // pt per mm
	var cs [][2]float64
	for i, p := range balls {
		cx, cy, rx, ry := centroid(p)
		if math.Abs(rx-ry) > 0.01*rx {
			t.Errorf("ball %d drawn %.2f × %.2f pt: the scales differ", i, 2*rx, 2*ry)
		}
		if math.Abs(rx/benchRadius-s) > 0.01*s {
			t.Errorf("ball %d radius %.2f pt, want %.2f (to scale)", i, rx, benchRadius*s)
		}
		cs = append(cs, [2]float64{cx, cy})
	}
	for i := range cs {
		j := (i + 1) % 3
		if got := math.Hypot(cs[i][0]-cs[j][0], cs[i][1]-cs[j][1]) / s; math.Abs(got-benchSide) > 0.01*benchSide {
			t.Errorf("balls %d and %d %.2f mm apart on the drawing, want %.2f", i, j, got, benchSide)
		}
	}
	// Ball A, at (0, 50) mm, is the highest on the page.
	top := 0
	for i := range cs {
		if cs[i][1] < cs[top][1] {
			top = i
		}
	}
	var labels []svgText
	for _, want := range []string{"ball A", "ball B", "ball C", "probe tip", "centre of mass", "preload 1: 300 N", "grooves meet", "cable exit"} {
		x, ok := d.text(want)
		if !ok {
			t.Errorf("no label %q", want)
			continue
		}
		labels = append(labels, x)
	}
	if a, ok := d.text("ball A"); ok {
		bx := labelBox(a)
		mx, my := (bx[0]+bx[2])/2, (bx[1]+bx[3])/2
		for i := range cs {
			if i != top && math.Hypot(mx-cs[i][0], my-cs[i][1]) < math.Hypot(mx-cs[top][0], my-cs[top][1]) {
				t.Errorf("label ball A nearer another ball than ball A")
			}
		}
	}
	for i := range labels {
		for j := range i {
			if overlap(labelBox(labels[i]), labelBox(labels[j])) {
				t.Errorf("labels %q and %q overlap", labels[i].s, labels[j].s)
			}
		}
	}
	// A leader to every label: a grey line with one end on the label's
	// box as gonum/plot sets it out: from the baseline down by the
	// descent and up by the line height less the descent, about 0.93 of
	// the size for Liberation Serif (ascent 0.891, descent 0.216, line
	// height 1.149 em, from memory), grown by 1.5 pt for rounding.
	for _, l := range labels {
		bx := labelBox(l)
		bx[1], bx[3] = l.y-1.0*l.size, l.y+0.3*l.size
		found := false
		for _, p := range d.paths {
			if p.style != "fill:none;stroke:#909090;stroke-width:0.6" || len(p.pts) != 2 {
				continue
			}
			for _, q := range p.pts {
				if q[0] > bx[0]-1.5 && q[0] < bx[2]+1.5 && q[1] > bx[1]-1.5 && q[1] < bx[3]+1.5 {
					found = true
				}
			}
		}
		if !found {
			t.Errorf("label %q has no leader", l.s)
		}
	}
	// The colour scale fitted to the indices drawn: its tick labels (the
	// texts right of the plot) lie within [lowest − 0.01, highest] of
	// ev's centre indices (0.01 is the span of a scale whose indices are
	// all equal).
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, m := range ev.Stability.Contacts {
		lo, hi = math.Min(lo, m.CentreIndex), math.Max(hi, m.CentreIndex)
	}
	ticks := 0
	for _, x := range d.texts {
		if x.rotated || x.x < 0.85*d.w {
			continue
		}
		v, err := strconv.ParseFloat(x.s, 64)
		if err != nil {
			continue
		}
		ticks++
		if v < lo-0.01-1e-9 || v > hi+1e-9 {
			t.Errorf("colour bar tick %g outside [%g, %g]", v, lo-0.01, hi)
		}
	}
	if ticks < 2 {
		t.Errorf("%d colour bar ticks, want at least 2", ticks)
	}
	if d.has("off the drawing") {
		t.Error("a footnote about axes off the drawing, not asked for")
	}
	if ev.Shock != nil && !d.has("worst shock") {
		t.Error("the evaluation has a shock and the plan does not show it")
	}
	if !d.has("kept out") {
		t.Error("no note on the keep-out fans")
	}
	if len(d.images) != 1 {
		t.Errorf("%d images, want the colour bar", len(d.images))
	}

	if err := drawing.Plan(io.Discard, b, ev, &drawing.Options{Windows: wins[:1]}); !errors.Is(err, kinematic.ErrDegenerate) || !strings.Contains(err.Error(), "Options.Windows") {
		t.Errorf("one window for three pairs: %v", err)
	}
	bad := []kinematic.KeepOut{{At: r3.Vec{X: math.NaN()}}}
	if err := drawing.Plan(io.Discard, b, ev, &drawing.Options{KeepOuts: bad}); !errors.Is(err, kinematic.ErrNonFinite) || !strings.Contains(err.Error(), "Options.KeepOuts[0]") {
		t.Errorf("a keep-out at NaN: %v", err)
	}
	if err := drawing.Plan(io.Discard, b, ev, &drawing.Options{Format: "gif"}); !errors.Is(err, kinematic.ErrRange) || !strings.Contains(err.Error(), "Options.Format") {
		t.Errorf("format gif: %v", err)
	}
}

// TestPlanLegendNamesWhatIsDrawn: the note under the plan names a line
// style only when the plan draws it. The bench's radial vees meet their
// neighbours' normal planes 2R = 100 mm from the centre (vertical planes
// through each ball across its groove, by plane geometry), off the
// drawing, so no instantaneous axis is drawn. Vees turned 60° from
// radial have normal planes whose traces pass R·sin 30° = 25 mm from the
// centre, tangent to that circle: they meet in pairs at the corners of
// the circumscribed equilateral triangle, 25 mm / cos 60° = 50 mm from
// the centre, on the drawing, and the axes are vertical (vertical
// planes), drawn as blue discs.
func TestPlanLegendNamesWhatIsDrawn(t *testing.T) {
	dashDot := func(d svgDoc) int {
		n := 0
		for _, p := range d.paths {
			if strings.Contains(p.style, "stroke-dasharray:8,2,2,2") {
				n++
			}
		}
		return n
	}
	b, ev := built(t, bench)
	d := draw(t, "plan radial", func(w io.Writer) error { return drawing.Plan(w, b, ev, nil) })
	if dashDot(d) != 0 {
		t.Fatalf("%d dash-dot lines on the bench's plan, want none", dashDot(d))
	}
	if d.has("dash-dot") || d.has("instantaneous") {
		t.Error("the note names instantaneous axes that the plan does not draw")
	}
	if !d.has("groove axes dashed blue") {
		t.Error("the note does not name the groove axes the plan draws")
	}
	turned := strings.ReplaceAll(bench, `"azimuth": 0`, `"azimuth": "60 deg"`)
	b, ev = built(t, turned)
	d = draw(t, "plan turned", func(w io.Writer) error { return drawing.Plan(w, b, ev, nil) })
	if !d.has("(vertical)") {
		t.Fatal("the turned vees' pair axes are not drawn as vertical")
	}
	if !d.has("vertical instantaneous axes of seat pairs blue discs") || d.has("dash-dot") {
		t.Error("the note does not name the rings alone")
	}
}

// TestPlanEscapesText: markup in a caller's name is text, not markup.
func TestPlanEscapesText(t *testing.T) {
	b, ev := built(t, bench)
	d := draw(t, "plan", func(w io.Writer) error {
		return drawing.Plan(w, b, ev, &drawing.Options{Title: "a <b> & c", PointName: "<tip>"})
	})
	if d.title != "a <b> & c" {
		t.Errorf("title %q", d.title)
	}
	if _, ok := d.text("<tip>"); !ok {
		t.Error("the point's name is missing or mangled")
	}
}

// TestPlanFormats: PNG and PDF through gonum/plot's back ends.
func TestPlanFormats(t *testing.T) {
	b, ev := built(t, bench)
	for format, magic := range map[string]string{"png": "\x89PNG", "pdf": "%PDF"} {
		var buf bytes.Buffer
		if err := drawing.Plan(&buf, b, ev, &drawing.Options{Format: format}); err != nil {
			t.Fatal(err)
		}
		if !bytes.HasPrefix(buf.Bytes(), []byte(magic)) {
			t.Errorf("%s: starts %q", format, buf.Bytes()[:8])
		}
	}
}

// TestLiftOffDrawn: the cap stated; the cells fill a box of the grid's
// proportions; a push at the centre of the three balls never unloads a
// contact, one at the corner of the map does; the points where loads act
// are marked.
//
// Grid: x over the balls ±20 mm, 2·43.301 + 40 = 126.60 mm; y from −25
// − 20 to 50 + 20 mm, 115 mm: aspect 1.1009 on equal scales. A downward
// push inside the triangle of ball centres shares out to the three balls
// with positive weights (barycentric), and a downward load on a ball in a
// symmetric vee presses both flanks: nothing unloads (closed form). At a
// corner outside the triangle the push tips the body about the nearest
// edge and unloads the far ball at a finite force.
func TestLiftOffDrawn(t *testing.T) {
	b, _ := built(t, bench)
	d := draw(t, "lift-off", func(w io.Writer) error { return drawing.LiftOff(w, b, nil) })
	if !d.has("capped at 1200 N") { // 4 × the 300 N preload
		t.Error("the scale's cap is not stated")
	}
	for _, want := range []string{"ball A", "ball B", "ball C", "preload 1: 300 N", "centre of mass (weight, inertia)"} {
		if _, ok := d.text(want); !ok {
			t.Errorf("no mark %q", want)
		}
	}
	var heat *svgImage
	for i := range d.images {
		if d.images[i].img.Bounds().Dx() > 1 {
			heat = &d.images[i]
		}
	}
	if heat == nil {
		t.Fatal("no heat map image")
	}
	if got, want := heat.w/heat.h, 126.60254037844386/115; math.Abs(got-want) > 0.01*want {
		t.Errorf("heat map %.1f × %.1f pt, aspect %.4f, want %.4f", heat.w, heat.h, got, want)
	}
	bd := heat.img.Bounds()
	n := bd.Dx()
	if n < 80 || bd.Dy() != n {
		t.Errorf("heat map %v cells, want a square grid of at least 80", bd)
	}
	// The cell holding (0, 0) mm: column n/2, row from the top
	// (70 − 0)/115 of the way down.
	row := int(70.0 / 115 * float64(n))
	never := color.RGBAModel.Convert(heat.img.At(n/2, row)).(color.RGBA)
	if never != (color.RGBA{0xf4, 0xf4, 0xf4, 0xff}) {
		t.Errorf("the centre cell is %v, want the pale grey of 'never unloads'", never)
	}
	corner := color.RGBAModel.Convert(heat.img.At(0, 0)).(color.RGBA)
	if corner == never {
		t.Error("the corner cell never unloads")
	}
}

// TestHistogramDrawn: samples 0, 1, ..., 200 µm along x. Hyndman & Fan
// (1996), Am. Stat. 50(4), definition 7: P50 = 100, P95 = 190, P99 = 198
// and P99.73 = 199.46 µm (printed to three figures, 199). The limit line
// at 150 µm lies 50/90 of the way from the P50 line to the P95 line (the
// axis is linear).
func TestHistogramDrawn(t *testing.T) {
	var res kinematic.StudyResult
	for i := range 201 {
		res.Points = append(res.Points, r3.Vec{X: float64((i*37)%201) * 1e-6})
	}
	res.Samples = len(res.Points)
	d := draw(t, "histogram", func(w io.Writer) error {
		return drawing.Histogram(w, res, &drawing.Options{Limit: 150e-6})
	})
	for _, want := range []string{"50 %: 100 µm", "95 %: 190 µm", "99 %: 198 µm", "99.73 %: 199 µm", "limit: 150 µm", "3-D magnitude"} {
		if !d.has(want) {
			t.Errorf("no text %q", want)
		}
	}
	var dashed, red []float64
	for _, p := range d.paths {
		if len(p.pts) == 2 && p.pts[0][0] == p.pts[1][0] {
			switch {
			case strings.Contains(p.style, "stroke-dasharray"):
				dashed = append(dashed, p.pts[0][0])
			case strings.Contains(p.style, "stroke:#C02020"):
				red = append(red, p.pts[0][0])
			}
		}
	}
	sort.Float64s(dashed)
	if len(dashed) != 4 || len(red) != 1 {
		t.Fatalf("%d percentile lines and %d limit lines, want 4 and 1", len(dashed), len(red))
	}
	want := dashed[0] + 50.0/90*(dashed[1]-dashed[0])
	if math.Abs(red[0]-want) > 0.05 {
		t.Errorf("limit line at %.2f pt, want %.2f", red[0], want)
	}
	if err := drawing.Histogram(io.Discard, res, &drawing.Options{Limit: math.NaN()}); !errors.Is(err, kinematic.ErrRange) || !strings.Contains(err.Error(), "Options.Limit") {
		t.Errorf("limit NaN: %v", err)
	}
	// All samples equal: still a drawing.
	one := kinematic.StudyResult{Points: []r3.Vec{{X: 1e-6}, {X: 1e-6}, {X: 1e-6}}}
	draw(t, "one-value histogram", func(w io.Writer) error { return drawing.Histogram(w, one, nil) })
}

// TestScorecardsDrawn: each figure with its unit and the better
// direction, every value printed, the others relative to the best, and
// text no smaller than 9 pt: on an 8 in (576 pt) page drawn 1200 px wide,
// 9 pt is 9·1200/576 = 18.75 px.
func TestScorecardsDrawn(t *testing.T) {
	b, _ := built(t, bench)
	card, err := b.Coupling().Score(b.Scenario())
	if err != nil {
		t.Fatal(err)
	}
	soft := card
	soft.Stiffness *= 0.95
	d := draw(t, "scorecards", func(w io.Writer) error {
		return drawing.Scorecards(w, []string{"stiff", "soft"}, []kinematic.Scorecard{card, soft}, nil)
	})
	if d.w != 576 {
		t.Errorf("page %g pt wide, want 576 (8 in)", d.w)
	}
	for _, want := range []string{"stiffness, N/µm", "first frequency, Hz", "shock level, g", "thermal drift, µm/K", "higher is better →", "← lower is better", "(-5.0 %)", "stiff", "soft"} {
		if !d.has(want) {
			t.Errorf("no text %q", want)
		}
	}
	for _, x := range d.texts {
		if x.size < 9 {
			t.Errorf("text %q at %g pt", x.s, x.size)
		}
	}
}

// TestBudgetDrawn: the contributors ranked from the top, bars in
// proportion to their effects (3 : 2 : 1 µm).
func TestBudgetDrawn(t *testing.T) {
	bud := kinematic.Budget{
		Contributors: []kinematic.Contributor{
			{Dimension: "A.Ball.X", Effect: 3e-6, Share: 9.0 / 14},
			{Dimension: "B.Seat.Turn", Effect: 2e-6, Share: 4.0 / 14},
			{Dimension: "C.Ball.Radius", Effect: 1e-6, Share: 1.0 / 14},
		},
		Worst: 6e-6, RSS: math.Sqrt(14) * 1e-6, Sigma: math.Sqrt(14) / 3 * 1e-6,
	}
	d := draw(t, "budget", func(w io.Writer) error { return drawing.Budget(w, bud, &drawing.Options{PointName: "vertex"}) })
	var ys []float64
	for _, n := range []string{"A.Ball.X", "B.Seat.Turn", "C.Ball.Radius"} {
		x, ok := d.text(n)
		if !ok {
			t.Fatalf("no row %q", n)
		}
		ys = append(ys, x.y)
	}
	if !(ys[0] < ys[1] && ys[1] < ys[2]) {
		t.Errorf("rows at %v pt from the top, want the largest effect first", ys)
	}
	var w []float64
	for _, p := range d.paths {
		if p.style == "fill:#2050B0" {
			_, _, rx, _ := centroid(p)
			w = append(w, 2*rx)
		}
	}
	if len(w) != 3 {
		t.Fatalf("%d bars, want 3", len(w))
	}
	if math.Abs(w[0]/w[2]-3) > 3e-3 || math.Abs(w[1]/w[2]-2) > 2e-3 { // five-figure coordinates, as in TestForcesDrawn
		t.Errorf("bar lengths %v, want 3 : 2 : 1", w)
	}
	for _, want := range []string{"3.00 µm (64 %)", "worst case", "6.00 µm", "vertex"} {
		if !d.has(want) {
			t.Errorf("no text %q", want)
		}
	}
	if err := drawing.Budget(io.Discard, kinematic.Budget{}, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("empty budget: %v", err)
	}
}

// TestForcesDrawn: one bar per contact and case, heights in proportion
// to the forces, a pulling contact below the zero line, the cases named
// in the legend.
func TestForcesDrawn(t *testing.T) {
	labels := []string{"A+", "A-", "B+", "B-", "C+", "C-"}
	var up, tilt kinematic.Statics
	up.Case, tilt.Case = "upright", "tilted"
	for i, l := range labels {
		up.Contacts[i] = kinematic.ContactLoad{Label: l, Force: 10 * float64(i+1)}
		tilt.Contacts[i] = kinematic.ContactLoad{Label: l, Force: 20 - 10*float64(i)}
	}
	d := draw(t, "forces", func(w io.Writer) error { return drawing.Forces(w, []kinematic.Statics{up, tilt}, nil) })
	for _, want := range append([]string{"upright", "tilted"}, labels...) {
		if _, ok := d.text(want); !ok {
			t.Errorf("no text %q", want)
		}
	}
	// plotutil's first colours, #F15A60 and #7AC36A: six bars and a
	// legend swatch each.
	bars := func(fill string) []svgPath {
		var ps []svgPath
		for _, p := range d.paths {
			if p.style == "fill:"+fill {
				ps = append(ps, p)
			}
		}
		return ps
	}
	first, second := bars("#F15A60"), bars("#7AC36A")
	if len(first) != 7 || len(second) != 7 {
		t.Fatalf("%d and %d filled shapes, want 7 each", len(first), len(second))
	}
	_, _, _, h1 := centroid(first[0])
	_, _, _, h6 := centroid(first[5])
	// vgsvg prints coordinates to five significant figures: ratios of
	// lengths of about 20 pt hold to 1e-3 relative.
	if math.Abs(h6/h1-6) > 6e-3 {
		t.Errorf("bars of 10 N and 60 N in the ratio %.4f, want 6", h6/h1)
	}
	// tilted: 20, 10, 0, −10, −20, −30 N: the bar of −30 N reaches 1.5
	// times as far below the zero line as the 20 N bar above it.
	_, cyUp, _, hUp := centroid(second[0])
	_, cyDown, _, hDown := centroid(second[5])
	if !(cyDown > cyUp) || math.Abs(hDown/hUp-1.5) > 1.5e-3 {
		t.Errorf("bars of 20 N and -30 N: centres at %.1f and %.1f pt, half heights %.2f and %.2f", cyUp, cyDown, hUp, hDown)
	}
	if err := drawing.Forces(io.Discard, nil, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("no cases: %v", err)
	}
}

// TestPlanThermalCentre: the bench fixture's three radial vees are
// symmetric (mirror planes through each ball and the centre), so with the
// body and the base expanding alike the motion relative to the base has
// no turn or strain in the plane of the balls and there is no thermal
// centre: the plan draws none and says so in its notes. With aluminium on
// steel (23.6e-6 and 11.9e-6 1/K) the body strains relative to the base
// about where the grooves meet, and the plan marks the thermal centre.
func TestPlanThermalCentre(t *testing.T) {
	for _, tc := range []struct {
		name, thermal string
		centre        bool
	}{
		{"alike", `{"delta_t": "5 K", "moving_alpha": "23e-6 /K", "base_alpha": "23e-6 /K"}`, false},
		{"aluminium on steel", `{"delta_t": "5 K", "moving_alpha": "23.6e-6 /K", "base_alpha": "11.9e-6 /K"}`, true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			src := strings.Replace(bench, `"point_of_interest"`, `"thermal": `+tc.thermal+`, "point_of_interest"`, 1)
			b, ev := built(t, src)
			if ev.Drift == nil || ev.Drift.HasCentre != tc.centre {
				t.Fatalf("drift %+v, want a centre: %v", ev.Drift, tc.centre)
			}
			d := draw(t, "plan", func(w io.Writer) error { return drawing.Plan(w, b, ev, nil) })
			_, marked := d.text("thermal centre")
			noted := d.has("no thermal centre")
			if marked != tc.centre || noted == tc.centre {
				t.Errorf("thermal centre marked %v, noted as none %v; want a centre: %v", marked, noted, tc.centre)
			}
		})
	}
}

// smallBench is the bench fixture at a twentieth of its size (balls of
// 0.3175 mm radius on a 2.5 mm circle, 4.33 mm apart), with a preload
// and a payload to match.
const smallBench = `{
  "format": "sixfold.design/2",
  "name": "small bench",
  "balls": [
    {"name": "A", "centre": ["0 mm", "2.5 mm", 0], "radius": "0.3175 mm", "material": "steel-52100"},
    {"name": "B", "centre": ["-2.1650635094610966 mm", "-1.25 mm", 0], "radius": "0.3175 mm", "material": "steel-52100"},
    {"name": "C", "centre": ["2.1650635094610966 mm", "-1.25 mm", 0], "radius": "0.3175 mm", "material": "steel-52100"}
  ],
  "seats": [
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"}
  ],
  "preloads": [{"point": [0, 0, "1 mm"], "direction": [0, 0, -1], "force": "0.05 N"}],
  "payload": {"mass": "0.2 g", "centre": [0, 0, "0.5 mm"]},
  "cases": [{"name": "seated", "gravity": [0, 0, "-1 g"]}],
  "point_of_interest": [0, 0, "1.5 mm"]
}`

// TestPlanSmallFills: a coupling a twentieth of the bench's size fills
// its plan as the bench does (the balls' spread across the page at
// least 0.85 of the bench's), instead of sitting in the middle third of
// a frame held to fixed margins of 5 mm about the balls and 3 mm about
// the marks (it was drawn in about ±8 mm: its balls spread over 0.18 of
// the page, the bench's over 0.44).
func TestPlanSmallFills(t *testing.T) {
	spread := func(src string) float64 {
		b, ev := built(t, src)
		d := draw(t, "plan", func(w io.Writer) error { return drawing.Plan(w, b, ev, nil) })
		x0, x1 := math.Inf(1), math.Inf(-1)
		n := 0
		for _, p := range d.paths {
			if p.style == "fill:#E4E4E4" && len(p.pts) == 48 {
				cx, _, _, _ := centroid(p)
				x0, x1 = math.Min(x0, cx), math.Max(x1, cx)
				n++
			}
		}
		if n != 3 {
			t.Fatalf("%d ball outlines, want 3", n)
		}
		return (x1 - x0) / d.w
	}
	big, small := spread(bench), spread(smallBench)
	if small < 0.85*big {
		t.Errorf("the small coupling's balls spread over %.2f of the page, the bench's over %.2f", small, big)
	}
}
