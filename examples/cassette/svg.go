package main

import (
	"fmt"
	"io"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// drawing is one coupling layout to draw, with a title.
type drawing struct {
	title string
	c     kinematic.Coupling
}

// writeSVG draws the plan view (x right, y up, looking down −z) of each
// layout side by side: balls, groove axes, contact normals projected on
// the plan, the point where the grooves meet, the incentre and the
// centroid. Coordinates are in millimetres.
func writeSVG(w io.Writer, ds []drawing) error {
	const (
		panel  = 300.0 // px per panel
		legend = 50.0  // px below the plan for the markers' legend
		reach  = 90.0  // mm of groove drawn either side of a ball
	)
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%.0f" height="%.0f" font-family="sans-serif" font-size="11">`+"\n",
		panel*float64(len(ds)), panel+40)
	for k, d := range ds {
		// Fit the balls into 70 % of the plan, centred.
		lo := r3.Vec{X: math.Inf(1), Y: math.Inf(1)}
		hi := r3.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
		for _, p := range d.c.Pairs {
			lo.X, lo.Y = math.Min(lo.X, p.Ball.Centre.X), math.Min(lo.Y, p.Ball.Centre.Y)
			hi.X, hi.Y = math.Max(hi.X, p.Ball.Centre.X), math.Max(hi.Y, p.Ball.Centre.Y)
		}
		mid := r3.Scale(0.5, r3.Add(lo, hi))
		scale := 0.7 * (panel - legend) / (1e3 * math.Max(hi.X-lo.X, hi.Y-lo.Y)) // px per mm
		ox, oy := panel*float64(k)+panel/2, 20+(panel-legend)/2
		px := func(p r3.Vec) (float64, float64) {
			return ox + (p.X-mid.X)*1e3*scale, oy - (p.Y-mid.Y)*1e3*scale
		}
		fmt.Fprintf(&b, `<text x="%.1f" y="14" text-anchor="middle">%s</text>`+"\n", ox, d.title)
		fmt.Fprintf(&b, `<clipPath id="p%d"><rect x="%.1f" y="20" width="%.0f" height="%.0f"/></clipPath>`+"\n", k, ox-panel/2+2, panel-4, panel-4)
		fmt.Fprintf(&b, `<rect x="%.1f" y="20" width="%.0f" height="%.0f" fill="none" stroke="#ccc"/>`+"\n", ox-panel/2+2, panel-4, panel-4)
		fmt.Fprintf(&b, `<g clip-path="url(#p%d)">`+"\n", k)
		g, err := d.c.Geometry()
		if err != nil {
			return err
		}
		for _, gr := range g.Grooves {
			a := r3.Add(gr.Point, r3.Scale(-reach*1e-3, gr.Direction))
			e := r3.Add(gr.Point, r3.Scale(reach*1e-3, gr.Direction))
			x1, y1 := px(a)
			x2, y2 := px(e)
			fmt.Fprintf(&b, `<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="#3a6ea5" stroke-dasharray="4 3"/>`+"\n", x1, y1, x2, y2)
		}
		for _, p := range d.c.Pairs {
			x, y := px(p.Ball.Centre)
			fmt.Fprintf(&b, `<circle cx="%.1f" cy="%.1f" r="%.1f" fill="#ddd" stroke="#333"/>`+"\n", x, y, p.Ball.Radius*1e3*scale)
			fmt.Fprintf(&b, `<text x="%.1f" y="%.1f">%s</text>`+"\n", x+12, y-12, p.Name)
		}
		cs, err := d.c.Contacts()
		if err != nil {
			return err
		}
		for _, ct := range cs {
			x1, y1 := px(ct.Point)
			x2, y2 := px(r3.Add(ct.Point, r3.Scale(12e-3, ct.Normal)))
			fmt.Fprintf(&b, `<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="#b5472b"/>`+"\n", x1, y1, x2, y2)
		}

		// Markers, each label on its own line below the panel's top.
		for i, m := range []struct {
			p             r3.Vec
			colour, label string
		}{
			{g.Centre, "#3a6ea5", "grooves meet"},
			{g.Incentre, "#2a7d2a", "incentre"},
			{g.Centroid, "#777", "centroid"},
		} {
			x, y := px(m.p)
			fmt.Fprintf(&b, `<circle cx="%.1f" cy="%.1f" r="3" fill="%s"/>`+"\n", x, y, m.colour)
			ly := 20 + panel - legend + 10 + 14*float64(i)
			fmt.Fprintf(&b, `<circle cx="%.1f" cy="%.1f" r="3" fill="%s"/><text x="%.1f" y="%.1f" fill="%s">%s (%.1f, %.1f) mm</text>`+"\n",
				ox-panel/2+12, ly-4, m.colour, ox-panel/2+20, ly, m.colour, m.label, m.p.X*1e3, m.p.Y*1e3)
		}
		b.WriteString("</g>\n")
	}
	fmt.Fprintf(&b, `<text x="6" y="%.0f" fill="#555">Plan view (x right, y up), balls to scale. Dashed: groove axes. Red: contact normals in plan (12 mm long in 3D).</text>`+"\n",
		panel+34)
	b.WriteString("</svg>\n")
	_, err := io.WriteString(w, b.String())
	return err
}
