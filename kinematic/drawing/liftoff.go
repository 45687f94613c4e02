package drawing

import (
	"fmt"
	"io"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// LiftOff writes the lift-off map of a built design to w: on a 40 × 40
// grid over the balls' plan (with 20 mm of margin), the largest push, N,
// along −z on the face Options.FaceHeight above the highest ball centre
// before a contact unloads, added to the design's first load case
// (kinematic.Model.LiftOff). Pushes above four times the total preload
// (100 N without preload) are drawn in the top colour; where a push
// never unloads a contact the cell is hatched. The design needs a load
// case.
func LiftOff(w io.Writer, b *design.Built, opt *Options) error {
	o := opt.orDefault()
	d := b.Design()
	if len(d.Cases) == 0 {
		return fmt.Errorf("drawing: a lift-off map needs a load case, the design has none: %w", kinematic.ErrDegenerate)
	}
	if math.IsNaN(o.FaceHeight) || math.IsInf(o.FaceHeight, 0) {
		return fmt.Errorf("drawing: Options.FaceHeight: %w: %g", kinematic.ErrNonFinite, o.FaceHeight)
	}
	c := b.Coupling()
	lo, hi := bounds(c)
	top := math.Inf(-1)
	for _, p := range c.Pairs {
		top = math.Max(top, p.Ball.Centre.Z)
	}
	z, height := d.Point.Z, d.Point.Z-top
	if o.FaceHeight != 0 {
		z, height = top+o.FaceHeight, o.FaceHeight
	}
	const margin, n = 0.02, 40
	gr := draw.Grid{X0: lo.X - margin, Y0: lo.Y - margin, NX: n, NY: n}
	gr.DX, gr.DY = (hi.X-lo.X+2*margin)/n, (hi.Y-lo.Y+2*margin)/n
	var pts []r3.Vec
	for j := range n {
		for i := range n {
			pts = append(pts, r3.Vec{X: gr.X0 + (float64(i)+0.5)*gr.DX, Y: gr.Y0 + (float64(j)+0.5)*gr.DY, Z: z})
		}
	}
	lift, err := b.Model().LiftOff(d.Cases[0], r3.Vec{Z: -1}, pts)
	if err != nil {
		return err
	}
	for _, l := range lift {
		gr.Values = append(gr.Values, l.Force)
	}
	// Near the lines where a push stops unloading anything the limit
	// grows without bound; the scale stops at four times the preload.
	scaleTop := 0.0
	for _, p := range d.Preloads {
		scaleTop += 4 * p.Force
	}
	note := fmt.Sprintf("pushes above %.0f N (four times the preload) are drawn in the top colour", scaleTop)
	if scaleTop == 0 {
		scaleTop = 100
		note = "pushes above 100 N are drawn in the top colour"
	}
	hm := draw.HeatMap{
		Title:    o.title("Lift-off map: downward push on the top face before a contact unloads"),
		Grid:     gr,
		Scale:    draw.Scale{Name: "largest push", Unit: "N", Min: 0, Max: scaleTop},
		InfLabel: "never unloads",
		Notes: o.notes(
			fmt.Sprintf("push along -z at %.0f mm above the balls, added to case %q", height*1e3, d.Cases[0].Name),
			note,
		),
	}
	for _, p := range c.Pairs {
		hm.Markers = append(hm.Markers, draw.Marker{Kind: draw.CouplingCentre, At: pt(p.Ball.Centre), Label: "ball " + p.Name})
	}
	return hm.WriteSVG(w)
}
