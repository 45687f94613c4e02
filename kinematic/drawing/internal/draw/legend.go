package draw

import "math"

// Styles: presentation attributes of each kind of drawn item.
const (
	inkColour     = "#222222"
	mutedColour   = "#5f5f5f"
	outlineStyle  = `fill="#f4f1ea" stroke="#6b6257" stroke-width="1.5"`
	seatStyle     = `fill="#e3dccd" fill-opacity="0.8" stroke="#8c7b62" stroke-width="1.2"`
	flankStyle    = `stroke="#8c7b62" stroke-width="2" stroke-linecap="round"`
	grooveStyle   = `stroke="#2b5d8a" stroke-width="1.4" stroke-dasharray="7 4" fill="none"`
	axisStyle     = `stroke="#8e3b8a" stroke-width="1.4" stroke-dasharray="10 3 2 3" fill="none"`
	axisColour    = "#8e3b8a"
	ballStyle     = `fill="#dfe4ea" fill-opacity="0.75" stroke="#36414d" stroke-width="1.2"`
	gridStyle     = `stroke="#dddddd" stroke-width="0.8"`
	axisLineStyle = `stroke="#444444" stroke-width="1"`
	dotRadius     = 4.5 // px, a contact's value dot
	markerSize    = 7.0 // px, half the width of a marker symbol
	keyRow        = 20.0
	barHeight     = 160.0 // px, the colour legend bar
	barWidth      = 14.0
)

// MarkerKind names what a plan marker stands for; it sets the symbol.
type MarkerKind int

// The marker kinds.
const (
	CouplingCentre  MarkerKind = iota // the coupling centre (where the groove axes meet): a circled cross
	ThermalCentre                     // the thermal centre: a diamond
	PointOfInterest                   // the point of interest (an optical axis, a probe tip): a square target
)

// name returns the kind's default label.
func (k MarkerKind) name() string {
	switch k {
	case CouplingCentre:
		return "coupling centre"
	case ThermalCentre:
		return "thermal centre"
	default:
		return "point of interest"
	}
}

func (k MarkerKind) colour() string {
	switch k {
	case CouplingCentre:
		return "#2b5d8a"
	case ThermalCentre:
		return "#c8551b"
	default:
		return "#1c7c54"
	}
}

// marker draws the symbol of kind k centred at (x, y) and returns its box.
func (s *scene) marker(k MarkerKind, x, y float64) box {
	m, c := markerSize, k.colour()
	st := `stroke="` + c + `" stroke-width="1.8"`
	switch k {
	case CouplingCentre:
		s.add(circle{x, y, m, "marker", `fill="#ffffff" ` + st},
			line{x - m, y, x + m, y, "marker-detail", st},
			line{x, y - m, x, y + m, "marker-detail", st})
	case ThermalCentre:
		s.add(poly{[]float64{x, y - m, x + m, y, x, y + m, x - m, y}, true, "marker", `fill="#fbe3d4" stroke="` + c + `" stroke-width="1.8"`},
			circle{x, y, 1.6, "marker-detail", `fill="` + c + `"`})
	default:
		s.add(rect{x - m*0.75, y - m*0.75, 1.5 * m, 1.5 * m, "marker", `fill="#ffffff" ` + st},
			line{x - m*1.3, y, x + m*1.3, y, "marker-detail", st},
			line{x, y - m*1.3, x, y + m*1.3, "marker-detail", st})
	}
	return box{x - 1.3*m, y - 1.3*m, x + 1.3*m, y + 1.3*m}
}

// arrow draws a triangle at (x, y) pointing along the angle th (px
// coordinates) in colour c, and returns its box.
func (s *scene) arrow(x, y, th float64, c string) box {
	m := markerSize * 1.2
	ux, uy := math.Cos(th), math.Sin(th)
	px, py := -uy, ux
	pts := []float64{x + m*ux, y + m*uy, x - m*ux + 0.7*m*px, y - m*uy + 0.7*m*py, x - m*ux - 0.7*m*px, y - m*uy - 0.7*m*py}
	s.add(poly{pts, true, "marker", `fill="` + c + `" stroke="none"`})
	return box{x - m, y - m, x + m, y + m}
}

// colourBar draws a vertical colour legend with its top-left corner at
// (x, y): the title (quantity and unit), a bar from lo (bottom) to hi
// (top) with ticks, and returns its box. The scale's gradient is defined
// once per document under the id "scale".
func (s *scene) colourBar(x, y, lo, hi float64, name, unit string) box {
	title := name
	if unit != "" {
		title += ", " + unit
	}
	if title == "" {
		title = "value"
	}
	s.add(text{x, y + ascent*fontSize, fontSize, "start", "legend-title", `fill="` + inkColour + `"`, title})
	top := y + (ascent+descent)*fontSize + 8
	grad := `<linearGradient id="scale" x1="0" y1="1" x2="0" y2="0">`
	for i := 0; i <= 10; i++ {
		t := float64(i) / 10
		grad += `<stop offset="` + num(t) + `" stop-color="` + colour(t) + `"/>`
	}
	s.defs = append(s.defs, grad+`</linearGradient>`)
	s.add(rect{x, top, barWidth, barHeight, "legend-bar", `fill="url(#scale)" stroke="#444444" stroke-width="0.8"`})
	bb := textBox(title, x, y+ascent*fontSize, fontSize, "start")
	bb = bb.union(box{x, top, x + barWidth, top + barHeight})
	var vs []float64
	var step float64
	if hi > lo {
		step = niceStep(hi-lo, 4)
		vs = ticks(lo, hi, step)
	} else {
		vs = []float64{lo}
	}
	for _, v := range vs {
		ty := top + barHeight*(1-fraction(v, lo, hi))
		txt := sig(v)
		if step > 0 {
			txt = tickText(v, step)
		}
		s.add(line{x + barWidth, ty, x + barWidth + 4, ty, "legend-tick", axisLineStyle},
			text{x + barWidth + 7, ty + 0.35*fontSize, fontSize, "start", "legend-tick", `fill="` + inkColour + `"`, txt})
		bb = bb.union(textBox(txt, x+barWidth+7, ty+0.35*fontSize, fontSize, "start"))
	}
	return bb
}

// keyText draws one legend entry's text with its symbol already drawn in
// the 24 px to the left of x, centred on the row at y, and returns the
// row's box.
func (s *scene) keyText(x, y float64, str string) box {
	s.add(text{x + 28, y + 0.35*fontSize, fontSize, "start", "legend", `fill="` + inkColour + `"`, str})
	return box{x, y - keyRow/2, x + 28, y + keyRow/2}.union(textBox(str, x+28, y+0.35*fontSize, fontSize, "start"))
}
