package draw

import "math"

// seg is a drawn segment as an obstacle: its centre line and half width, px.
type seg struct{ x1, y1, x2, y2, hw float64 }

// disc is a drawn filled circle as an obstacle, px.
type disc struct{ cx, cy, r float64 }

// placer keeps the boxes of the labels placed so far and the drawn items
// that labels must keep clear of, and finds a free place for the next label.
type placer struct {
	labels []box  // placed labels
	boxes  []box  // drawn items known by their box (symbols, legends)
	segs   []seg  // drawn lines: axes, edges, leaders
	discs  []disc // drawn circles: balls, dots
	within *box   // the area labels must keep inside, or nil
}

// Placement search: rings of candidate positions around the anchor, the
// first ring at the caller's clearance and each next one a label height
// farther; 8 directions on the first two rings (the usual cartographic
// preference: right, above right, below right, left, ...) and 16 on the
// outer ones, where a ring is long enough to hold more.
const (
	placeRings     = 16
	innerRings     = 2
	innerDirs      = 8
	outerDirs      = 16
	fallbackMargin = 6.0 // px between the extent of everything and a label set outside it
)

// innerAngles lists the first directions in order of preference, radians,
// in px coordinates (y down: −π/4 is above right).
var innerAngles = [innerDirs]float64{0, -math.Pi / 4, math.Pi / 4, math.Pi, -3 * math.Pi / 4, 3 * math.Pi / 4, -math.Pi / 2, math.Pi / 2}

// free reports whether the box b is clear of every placed label and drawn item.
func (p *placer) free(b box) bool {
	if w := p.within; w != nil && (b.x0 < w.x0 || b.y0 < w.y0 || b.x1 > w.x1 || b.y1 > w.y1) {
		return false
	}
	for _, l := range p.labels {
		if b.overlaps(l) {
			return false
		}
	}
	for _, o := range p.boxes {
		if b.overlaps(o) {
			return false
		}
	}
	for _, s := range p.segs {
		if segHitsBox(s.x1, s.y1, s.x2, s.y2, b.grow(s.hw)) {
			return false
		}
	}
	for _, d := range p.discs {
		if discHitsBox(d, b) {
			return false
		}
	}
	return true
}

// leaderFree reports whether the leader from (ax, ay) to the box b crosses
// no placed label.
func (p *placer) leaderFree(ax, ay float64, b box) bool {
	lx, ly := nearestOnBox(b, ax, ay)
	for _, l := range p.labels {
		if segHitsBox(ax, ay, lx, ly, l) {
			return false
		}
	}
	return true
}

// place returns a free box of size w × h near the anchor (ax, ay), at
// least clear px away, registers it, and reports whether it lies far
// enough away to need a leader line. When no ring has a free place it sets
// the label just outside the extent of everything registered, where
// nothing can be in the way.
func (p *placer) place(ax, ay, w, h, clear float64) (box, bool) {
	for k := range placeRings {
		d := clear + float64(k)*h
		n := innerDirs
		if k >= innerRings {
			n = outerDirs
		}
		for i := range n {
			var th float64
			if n == innerDirs {
				th = innerAngles[i]
			} else {
				th = 2 * math.Pi * float64(i) / float64(n)
			}
			b := boxAt(ax, ay, w, h, d, th)
			if p.free(b) && (k == 0 || p.leaderFree(ax, ay, b)) {
				p.labels = append(p.labels, b)
				return b, k > 0
			}
		}
	}
	ext := box{ax, ay, ax, ay}
	for _, l := range p.labels {
		ext = ext.union(l)
	}
	for _, o := range p.boxes {
		ext = ext.union(o)
	}
	for _, s := range p.segs {
		ext = ext.union(box{math.Min(s.x1, s.x2), math.Min(s.y1, s.y2), math.Max(s.x1, s.x2), math.Max(s.y1, s.y2)}.grow(s.hw))
	}
	for _, d := range p.discs {
		ext = ext.union(box{d.cx - d.r, d.cy - d.r, d.cx + d.r, d.cy + d.r})
	}
	g := fallbackMargin
	cands := []box{
		{ext.x1 + g, ay - h/2, ext.x1 + g + w, ay + h/2},
		{ext.x0 - g - w, ay - h/2, ext.x0 - g, ay + h/2},
		{ax - w/2, ext.y1 + g, ax + w/2, ext.y1 + g + h},
		{ax - w/2, ext.y0 - g - h, ax + w/2, ext.y0 - g},
	}
	b := cands[0]
	for _, c := range cands {
		if p.leaderFree(ax, ay, c) {
			b = c
			break
		}
	}
	p.labels = append(p.labels, b)
	return b, true
}

// boxAt returns the w × h box whose centre lies in the direction th from
// the anchor, far enough that the box's nearest side is about d away: the
// centre is at d plus the box's half extent along the direction (its
// support function).
func boxAt(ax, ay, w, h, d, th float64) box {
	ux, uy := math.Cos(th), math.Sin(th)
	r := d + math.Abs(ux)*w/2 + math.Abs(uy)*h/2
	cx, cy := ax+r*ux, ay+r*uy
	return box{cx - w/2, cy - h/2, cx + w/2, cy + h/2}
}

// nearestOnBox returns the point of box b nearest to (x, y).
func nearestOnBox(b box, x, y float64) (float64, float64) {
	return math.Min(math.Max(x, b.x0), b.x1), math.Min(math.Max(y, b.y0), b.y1)
}

// segHitsBox reports whether the segment from (x1, y1) to (x2, y2) meets
// the interior of box b (Liang & Barsky 1984, parametric clipping).
func segHitsBox(x1, y1, x2, y2 float64, b box) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := x2-x1, y2-y1
	for _, c := range [4][2]float64{{-dx, x1 - b.x0}, {dx, b.x1 - x1}, {-dy, y1 - b.y0}, {dy, b.y1 - y1}} {
		p, q := c[0], c[1]
		if p == 0 {
			if q <= 0 {
				return false
			}
			continue
		}
		t := q / p
		if p < 0 {
			t0 = math.Max(t0, t)
		} else {
			t1 = math.Min(t1, t)
		}
		if t0 >= t1 {
			return false
		}
	}
	return true
}

// clipSeg clips the segment to box b (Liang & Barsky 1984) and reports
// whether any of it is left.
func clipSeg(x1, y1, x2, y2 float64, b box) (float64, float64, float64, float64, bool) {
	t0, t1 := 0.0, 1.0
	dx, dy := x2-x1, y2-y1
	for _, c := range [4][2]float64{{-dx, x1 - b.x0}, {dx, b.x1 - x1}, {-dy, y1 - b.y0}, {dy, b.y1 - y1}} {
		p, q := c[0], c[1]
		if p == 0 {
			if q < 0 {
				return 0, 0, 0, 0, false
			}
			continue
		}
		t := q / p
		if p < 0 {
			t0 = math.Max(t0, t)
		} else {
			t1 = math.Min(t1, t)
		}
		if t0 > t1 {
			return 0, 0, 0, 0, false
		}
	}
	return x1 + t0*dx, y1 + t0*dy, x1 + t1*dx, y1 + t1*dy, true
}

// discHitsBox reports whether the disc meets the interior of box b.
func discHitsBox(d disc, b box) bool {
	nx, ny := nearestOnBox(b, d.cx, d.cy)
	return math.Hypot(nx-d.cx, ny-d.cy) < d.r
}
