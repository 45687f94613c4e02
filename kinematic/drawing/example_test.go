package drawing_test

import (
	"bytes"
	"context"
	"encoding/xml"
	"fmt"
	"log"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// bench is a small bench fixture: three half-inch balls on a 50 mm
// circle in 90° vees aimed at the centre, held down by a 300 N spring.
const bench = `{
  "format": "sixfold.design/1",
  "name": "bench fixture",
  "balls": [
    {"name": "A", "centre": ["0 mm", "50 mm", 0], "radius": "6.35 mm", "material": "steel-52100"},
    {"name": "B", "centre": ["-43.30127018922193 mm", "-25 mm", 0], "radius": "6.35 mm", "material": "steel-52100"},
    {"name": "C", "centre": ["43.30127018922193 mm", "-25 mm", 0], "radius": "6.35 mm", "material": "steel-52100"}
  ],
  "seats": [
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-440c"}
  ],
  "preloads": [{"point": [0, 0, "20 mm"], "direction": [0, 0, -1], "force": "300 N"}],
  "payload": {"mass": "2 kg", "centre": [0, 0, "10 mm"], "inertia": {"xx": 4e-3, "yy": 4e-3, "zz": 6e-3}},
  "cases": [{"name": "seated", "gravity": [0, 0, "-1 g"]}],
  "point_of_interest": [0, 0, "30 mm"]
}`

// The plan view of a bench fixture: build the design once, evaluate it,
// and draw the plan with the point of interest named; the drawing is a
// standalone SVG document titled as asked.
func ExamplePlan() {
	d, err := design.Parse([]byte(bench))
	if err != nil {
		log.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	ev, err := b.Evaluate(context.Background())
	if err != nil {
		log.Fatal(err)
	}
	var svg bytes.Buffer
	opt := &drawing.Options{Title: "Bench fixture, plan", PointName: "probe tip"}
	if err := drawing.Plan(&svg, b, ev, opt); err != nil {
		log.Fatal(err)
	}
	var doc struct {
		XMLName xml.Name
		Title   string `xml:"title"`
	}
	if err := xml.Unmarshal(svg.Bytes(), &doc); err != nil {
		log.Fatal(err)
	}
	fmt.Printf("<%s>: %s; names the probe tip: %v\n", doc.XMLName.Local, doc.Title, bytes.Contains(svg.Bytes(), []byte("probe tip")))
	// Output:
	// <svg>: Bench fixture, plan; names the probe tip: true
}

// The error budget of the bench fixture's point of interest for two
// toleranced dimensions, as a ranked chart with the caller's name for
// the point.
func ExampleBudget() {
	d, err := design.Parse([]byte(bench))
	if err != nil {
		log.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	bud, err := b.Assembly().Budget(d.Point, []kinematic.Tolerance{
		{Dimension: "A.Ball.X", HalfWidth: 5e-6},
		{Dimension: "B.Seat.Turn", HalfWidth: 1e-3},
	})
	if err != nil {
		log.Fatal(err)
	}
	var svg bytes.Buffer
	if err := drawing.Budget(&svg, bud, &drawing.Options{PointName: "probe tip"}); err != nil {
		log.Fatal(err)
	}
	fmt.Println(bytes.Contains(svg.Bytes(), []byte("A.Ball.X")), bytes.Contains(svg.Bytes(), []byte("probe tip")))
	// Output:
	// true true
}

// The contact forces of every load case of the bench fixture, named by
// the cases' own names.
func ExampleForces() {
	d, err := design.Parse([]byte(bench))
	if err != nil {
		log.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	var cases []kinematic.Statics
	for _, lc := range d.Cases {
		s, err := b.Model().Statics(lc)
		if err != nil {
			log.Fatal(err)
		}
		cases = append(cases, s)
	}
	var svg bytes.Buffer
	if err := drawing.Forces(&svg, cases, nil); err != nil {
		log.Fatal(err)
	}
	fmt.Println(bytes.Contains(svg.Bytes(), []byte(">seated<")))
	// Output:
	// true
}

// The plan as a plot.Plotter in a plot of the caller's own: their title,
// axes and size, saved as a PNG.
func ExamplePlanPlotter() {
	d, err := design.Parse([]byte(bench))
	if err != nil {
		log.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		log.Fatal(err)
	}
	ev, err := b.Evaluate(context.Background())
	if err != nil {
		log.Fatal(err)
	}
	pl, err := drawing.PlanPlotter(b, ev, &drawing.Options{PointName: "probe tip"})
	if err != nil {
		log.Fatal(err)
	}
	p := plot.New()
	p.Title.Text = "My fixture"
	p.X.Label.Text, p.Y.Label.Text = "x, mm", "y, mm"
	p.Add(pl)
	wt, err := p.WriterTo(4*vg.Inch, 4*vg.Inch, "png")
	if err != nil {
		log.Fatal(err)
	}
	var png bytes.Buffer
	if _, err := wt.WriteTo(&png); err != nil {
		log.Fatal(err)
	}
	fmt.Println(bytes.HasPrefix(png.Bytes(), []byte("\x89PNG")))
	// Output:
	// true
}
