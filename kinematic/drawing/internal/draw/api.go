package draw

import (
	"math"
	"strconv"
)

// Box is an axis-aligned rectangle, X0 ≤ X1 and Y0 ≤ Y1.
type Box struct{ X0, Y0, X1, Y1 float64 }

// Placer places labels clear of obstacles and of each other. Its zero
// value has no obstacles.
type Placer struct{ p placer }

// Disc registers a filled circle that labels must keep clear of.
func (p *Placer) Disc(cx, cy, r float64) { p.p.discs = append(p.p.discs, disc{cx, cy, r}) }

// Segment registers a line of half width hw that labels must keep clear of.
func (p *Placer) Segment(x1, y1, x2, y2, hw float64) {
	p.p.segs = append(p.p.segs, seg{x1, y1, x2, y2, hw})
}

// Obstacle registers a box that labels must keep clear of.
func (p *Placer) Obstacle(b Box) { p.p.boxes = append(p.p.boxes, box{b.X0, b.Y0, b.X1, b.Y1}) }

// Within keeps the labels placed from now on inside b (the canvas) while
// a free place inside exists; without it labels may be placed anywhere.
func (p *Placer) Within(b Box) { p.p.within = &box{b.X0, b.Y0, b.X1, b.Y1} }

// Place returns a free box of size w × h near the anchor (ax, ay), at
// least clear away, and registers it.
func (p *Placer) Place(ax, ay, w, h, clear float64) Box {
	b, _ := p.p.place(ax, ay, w, h, clear)
	return Box{b.x0, b.y0, b.x1, b.y1}
}

// Nearest returns the point of b nearest to (x, y): where a leader from
// the anchor meets its label.
func Nearest(b Box, x, y float64) (float64, float64) {
	return nearestOnBox(box{b.X0, b.Y0, b.X1, b.Y1}, x, y)
}

// Sig formats v with three significant figures.
func Sig(v float64) string {
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e6 {
		e := math.Floor(math.Log10(a))
		if math.Round(a/math.Pow(10, e-2)) >= 1000 {
			e++ // 99.99999 prints as 100, not 100.0
		}
		d := max(0, 2-int(e))
		return strconv.FormatFloat(v, 'f', d, 64)
	}
	return strconv.FormatFloat(v, 'e', 2, 64)
}

// box is an axis-aligned rectangle, y down.
type box struct{ x0, y0, x1, y1 float64 }

func (b box) union(c box) box {
	return box{math.Min(b.x0, c.x0), math.Min(b.y0, c.y0), math.Max(b.x1, c.x1), math.Max(b.y1, c.y1)}
}

func (b box) grow(d float64) box { return box{b.x0 - d, b.y0 - d, b.x1 + d, b.y1 + d} }

// overlaps reports whether b and c share interior area.
func (b box) overlaps(c box) bool {
	return b.x0 < c.x1 && c.x0 < b.x1 && b.y0 < c.y1 && c.y0 < b.y1
}
