package draw

import (
	"encoding/xml"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// Layout constants, px. The canvas is sized by its content; these set the
// type sizes and the breathing room around things.
const (
	fontSize  = 12.0 // labels and tick values
	titleSize = 15.0 // drawing title
	noteSize  = 11.0 // notes under a drawing
	margin    = 12.0 // blank border around the whole drawing
	labelGap  = 3.0  // between a label and the rim of what it names
	fontStack = "DejaVu Sans, Verdana, Geneva, sans-serif"
)

// Text box metrics as fractions of the font size, for DejaVu Sans (from its
// metrics: ascender 0.76 em, descender 0.24 em; digits advance 0.636 em).
const (
	ascent  = 0.80
	descent = 0.26
)

// advance returns the estimated advance width of r in em. The classes
// follow DejaVu Sans, a wide face (Verdana is about as wide), so the
// estimate errs on the generous side for narrower faces.
func advance(r rune) float64 {
	switch {
	case strings.ContainsRune(" .,:;'|!ijlI()[]", r):
		return 0.36
	case strings.ContainsRune("ftr-", r):
		return 0.42
	case strings.ContainsRune("mwMW%@", r):
		return 1.0
	case r >= 'A' && r <= 'Z', strings.ContainsRune("µ×−→≥≤±", r):
		return 0.78
	case r < 128:
		return 0.64
	default:
		return 0.8
	}
}

// textWidth returns the estimated width of s at font size size, px.
func textWidth(s string, size float64) float64 {
	w := 0.0
	for _, r := range s {
		w += advance(r)
	}
	return w * size
}

// box is an axis-aligned rectangle in px, y down. The zero box is empty
// only by convention of the callers that test ok.
type box struct{ x0, y0, x1, y1 float64 }

func (b box) w() float64 { return b.x1 - b.x0 }
func (b box) h() float64 { return b.y1 - b.y0 }

func (b box) union(c box) box {
	return box{math.Min(b.x0, c.x0), math.Min(b.y0, c.y0), math.Max(b.x1, c.x1), math.Max(b.y1, c.y1)}
}

func (b box) grow(d float64) box { return box{b.x0 - d, b.y0 - d, b.x1 + d, b.y1 + d} }

// overlaps reports whether b and c share interior area.
func (b box) overlaps(c box) bool {
	return b.x0 < c.x1 && c.x0 < b.x1 && b.y0 < c.y1 && c.y0 < b.y1
}

// textBox returns the box of text s drawn at (x, y) (the baseline) with the
// given anchor ("start", "middle", "end") and size.
func textBox(s string, x, y, size float64, anchor string) box {
	w := textWidth(s, size)
	x0 := x
	switch anchor {
	case "middle":
		x0 = x - w/2
	case "end":
		x0 = x - w
	}
	return box{x0, y - ascent*size, x0 + w, y + descent*size}
}

// elem is one SVG element with absolute coordinates in px.
type elem interface {
	bounds() box
	write(b *strings.Builder, dx, dy float64)
	coords() []float64
}

type circle struct {
	cx, cy, r    float64
	class, style string
}

type line struct {
	x1, y1, x2, y2 float64
	class, style   string
}

type poly struct {
	pts          []float64 // x0, y0, x1, y1, ...
	closed       bool
	class, style string
}

type rect struct {
	x, y, w, h   float64
	class, style string
}

type text struct {
	x, y, size   float64
	anchor       string
	class, style string
	s            string
}

func (c circle) bounds() box       { return box{c.cx - c.r, c.cy - c.r, c.cx + c.r, c.cy + c.r} }
func (c circle) coords() []float64 { return []float64{c.cx, c.cy, c.r} }
func (c circle) write(b *strings.Builder, dx, dy float64) {
	fmt.Fprintf(b, `<circle%s cx="%s" cy="%s" r="%s" %s/>`+"\n", classAttr(c.class), num(c.cx+dx), num(c.cy+dy), num(c.r), c.style)
}

func (l line) bounds() box {
	return box{math.Min(l.x1, l.x2), math.Min(l.y1, l.y2), math.Max(l.x1, l.x2), math.Max(l.y1, l.y2)}
}
func (l line) coords() []float64 { return []float64{l.x1, l.y1, l.x2, l.y2} }
func (l line) write(b *strings.Builder, dx, dy float64) {
	fmt.Fprintf(b, `<line%s x1="%s" y1="%s" x2="%s" y2="%s" %s/>`+"\n", classAttr(l.class),
		num(l.x1+dx), num(l.y1+dy), num(l.x2+dx), num(l.y2+dy), l.style)
}

func (p poly) bounds() box {
	bb := box{math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)}
	for i := 0; i+1 < len(p.pts); i += 2 {
		bb = bb.union(box{p.pts[i], p.pts[i+1], p.pts[i], p.pts[i+1]})
	}
	return bb
}
func (p poly) coords() []float64 { return p.pts }
func (p poly) write(b *strings.Builder, dx, dy float64) {
	tag := "polyline"
	if p.closed {
		tag = "polygon"
	}
	fmt.Fprintf(b, `<%s%s points="`, tag, classAttr(p.class))
	for i := 0; i+1 < len(p.pts); i += 2 {
		if i > 0 {
			b.WriteByte(' ')
		}
		b.WriteString(num(p.pts[i]+dx) + "," + num(p.pts[i+1]+dy))
	}
	fmt.Fprintf(b, `" %s/>`+"\n", p.style)
}

func (r rect) bounds() box       { return box{r.x, r.y, r.x + r.w, r.y + r.h} }
func (r rect) coords() []float64 { return []float64{r.x, r.y, r.w, r.h} }
func (r rect) write(b *strings.Builder, dx, dy float64) {
	fmt.Fprintf(b, `<rect%s x="%s" y="%s" width="%s" height="%s" %s/>`+"\n", classAttr(r.class),
		num(r.x+dx), num(r.y+dy), num(r.w), num(r.h), r.style)
}

func (t text) bounds() box       { return textBox(t.s, t.x, t.y, t.size, t.anchor) }
func (t text) coords() []float64 { return []float64{t.x, t.y} }
func (t text) write(b *strings.Builder, dx, dy float64) {
	fmt.Fprintf(b, `<text%s x="%s" y="%s" font-size="%s" text-anchor="%s" %s>`, classAttr(t.class),
		num(t.x+dx), num(t.y+dy), num(t.size), t.anchor, t.style)
	xml.EscapeText(b, []byte(t.s)) // never fails on a strings.Builder
	b.WriteString("</text>\n")
}

func classAttr(c string) string {
	if c == "" {
		return ""
	}
	return ` class="` + c + `"`
}

// num formats a coordinate in px with two decimals at most.
func num(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	if s == "-0" {
		s = "0"
	}
	return s
}

// scene collects the elements of one drawing and the labels' placer.
type scene struct {
	defs  []string // raw definitions (gradients, patterns): no geometry
	els   []elem
	place placer
}

func (s *scene) add(e ...elem) { s.els = append(s.els, e...) }

// extent returns the box that holds every element so far.
func (s *scene) extent() box {
	bb := box{math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)}
	for _, e := range s.els {
		bb = bb.union(e.bounds())
	}
	if len(s.els) == 0 {
		bb = box{}
	}
	return bb
}

// label places the text s (font size size) near the anchor (ax, ay) clear
// of everything registered with the placer, draws it on a pale halo, adds
// a leader line when it lands away from the anchor, and registers its box.
// The leader starts labelGap short of the clearance, on the rim of the
// thing labelled.
func (s *scene) label(str string, ax, ay, clear, size float64, class, colour string) box {
	w := textWidth(str, size)
	h := (ascent + descent) * size
	bb, leader := s.place.place(ax, ay, w+4, h+2, clear)
	if leader {
		lx, ly := nearestOnBox(bb, ax, ay)
		rim := math.Max(clear-labelGap, 0)
		if d := math.Hypot(lx-ax, ly-ay); d > rim {
			sx, sy := ax+rim*(lx-ax)/d, ay+rim*(ly-ay)/d
			s.add(line{sx, sy, lx, ly, "leader", `stroke="#8a8a8a" stroke-width="0.8"`})
			s.place.segs = append(s.place.segs, seg{sx, sy, lx, ly, 0.5})
		}
	}
	s.add(rect{bb.x0, bb.y0, bb.w(), bb.h(), "halo", `fill="#ffffff" fill-opacity="0.85" stroke="none"`})
	s.add(text{bb.x0 + 2, bb.y1 - 1 - descent*size, size, "start", class, `fill="` + colour + `"`, str})
	return bb
}

// errNonFiniteCoord reports a coordinate that arithmetic on valid input
// should never produce; it is a defect of this package, reported rather
// than written.
var errNonFiniteCoord = errors.New("draw: internal error: non-finite coordinate")

// finish writes the scene as a standalone SVG document, shifted so that
// the extent of all elements plus the margin is the viewBox.
func (s *scene) finish(w io.Writer, title string) error {
	bb := s.extent().grow(margin)
	for _, e := range s.els {
		for _, v := range e.coords() {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return errNonFiniteCoord
			}
		}
	}
	dx, dy := -bb.x0, -bb.y0
	W, H := math.Ceil(bb.w()), math.Ceil(bb.h())
	var b strings.Builder
	b.WriteString(`<?xml version="1.0" encoding="UTF-8"?>` + "\n")
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="%s" height="%s" viewBox="0 0 %s %s" font-family="%s">`+"\n",
		num(W), num(H), num(W), num(H), fontStack)
	b.WriteString("<title>")
	xml.EscapeText(&b, []byte(title))
	b.WriteString("</title>\n")
	if len(s.defs) > 0 {
		b.WriteString("<defs>\n")
		for _, d := range s.defs {
			b.WriteString(d + "\n")
		}
		b.WriteString("</defs>\n")
	}
	fmt.Fprintf(&b, `<rect class="background" x="0" y="0" width="%s" height="%s" fill="#ffffff"/>`+"\n", num(W), num(H))
	for _, e := range s.els {
		e.write(&b, dx, dy)
	}
	b.WriteString("</svg>\n")
	_, err := io.WriteString(w, b.String())
	return err
}
