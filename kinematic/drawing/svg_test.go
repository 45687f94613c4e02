package drawing_test

import (
	"bytes"
	"encoding/base64"
	"encoding/xml"
	"image"
	"image/png"
	"io"
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

// svgText is a text element of a drawing with its anchor in page
// coordinates (pt, y down) and its font size, pt.
type svgText struct {
	s       string
	x, y    float64
	size    float64
	rotated bool
}

// svgPath is a path's vertices in page coordinates (pt, y down) and its
// style.
type svgPath struct {
	pts   [][2]float64
	style string
}

// svgDoc is what a test reads of a drawing written by vgsvg: the page
// size, the title, the texts, the paths and the images.
type svgDoc struct {
	w, h   float64
	title  string
	texts  []svgText
	paths  []svgPath
	images []svgImage
}

type svgImage struct {
	x, y, w, h float64 // page coordinates of the box, pt
	img        image.Image
	attrs      map[string]string
}

func attr(s xml.StartElement) map[string]string {
	m := map[string]string{}
	for _, a := range s.Attr {
		m[a.Name.Local] = a.Value
	}
	return m
}

func num(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.TrimSuffix(s, "pt"), 64)
	if err != nil {
		t.Fatalf("number %q: %v", s, err)
	}
	return v
}

// parse reads a drawing. vgsvg writes everything inside one group
// scale(1, −1) translate(0, −H): a path's (x, y) is the page point
// (x, H − y); a text's (x, y), itself flipped back, is (x, H + y).
func parse(t *testing.T, name string, b []byte) svgDoc {
	t.Helper()
	wellFormed(t, name, b)
	var d svgDoc
	dec := xml.NewDecoder(bytes.NewReader(b))
	rot := 0
	depth := 0
	var inText *svgText
	inTitle := false
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		switch e := tok.(type) {
		case xml.StartElement:
			depth++
			a := attr(e)
			switch e.Name.Local {
			case "svg":
				d.w, d.h = num(t, a["width"]), num(t, a["height"])
			case "title":
				inTitle = true
			case "g":
				if strings.Contains(a["transform"], "rotate") {
					rot = depth
				}
			case "text":
				size := 0.0
				for _, kv := range strings.Split(a["style"], ";") {
					if v, ok := strings.CutPrefix(kv, "font-size:"); ok {
						size = num(t, strings.TrimSuffix(v, "px"))
					}
				}
				inText = &svgText{x: num(t, a["x"]), y: d.h + num(t, a["y"]), size: size, rotated: rot > 0}
			case "path":
				p := svgPath{style: a["style"]}
				for _, m := range pathCmd.FindAllStringSubmatch(a["d"], -1) {
					// M and L give a point; an arc A its end point, the
					// last pair of its numbers.
					f := strings.Fields(strings.ReplaceAll(m[2], ",", " "))
					if len(f) < 2 {
						continue
					}
					p.pts = append(p.pts, [2]float64{num(t, f[len(f)-2]), d.h - num(t, f[len(f)-1])})
				}
				if rot == 0 {
					d.paths = append(d.paths, p)
				}
			case "image":
				im := svgImage{attrs: a}
				im.w, im.h = num(t, a["width"]), num(t, a["height"])
				// The image is flipped: its y attribute is −(ymin + h) in
				// the group's coordinates.
				im.x = num(t, a["x"])
				im.y = d.h + num(t, a["y"]) // top edge, page
				data, ok := strings.CutPrefix(a["href"], "data:image/png;base64,")
				if !ok {
					t.Errorf("%s: an image that is not an inline PNG", name)
				}
				raw, err := base64.StdEncoding.DecodeString(data)
				if err != nil {
					t.Fatalf("%s: image data: %v", name, err)
				}
				if im.img, err = png.Decode(bytes.NewReader(raw)); err != nil {
					t.Fatalf("%s: image: %v", name, err)
				}
				d.images = append(d.images, im)
			}
		case xml.EndElement:
			if e.Name.Local == "g" && depth == rot {
				rot = 0
			}
			if e.Name.Local == "text" && inText != nil {
				d.texts = append(d.texts, *inText)
				inText = nil
			}
			if e.Name.Local == "title" {
				inTitle = false
			}
			depth--
		case xml.CharData:
			if inText != nil {
				inText.s += string(e)
			}
			if inTitle {
				d.title += string(e)
			}
		}
	}
	return d
}

// width returns the width of s at size pt in the drawings' font,
// measured by gonum/plot (the reference library for text metrics here).
func width(s string, size float64) float64 {
	sty := plot.New().X.Label.TextStyle
	sty.Font.Size = vg.Length(size)
	return float64(sty.Width(s))
}

// text returns the first text equal to s, and whether there is one.
func (d svgDoc) text(s string) (svgText, bool) {
	for _, x := range d.texts {
		if x.s == s {
			return x, true
		}
	}
	return svgText{}, false
}

// has reports whether some text contains s.
func (d svgDoc) has(s string) bool {
	for _, x := range d.texts {
		if strings.Contains(x.s, s) {
			return true
		}
	}
	return false
}

// onCanvas fails for any text, path vertex or image outside the page.
// Texts are checked by their measured width and by their size above and
// below the baseline (a text is never taller than its size).
func onCanvas(t *testing.T, name string, d svgDoc) {
	t.Helper()
	const eps = 0.5 // pt
	for _, x := range d.texts {
		if x.rotated {
			continue // axis labels turned by 90°: placed by gonum/plot inside the page
		}
		w := width(x.s, x.size)
		if x.x < -eps || x.x+w > d.w+eps || x.y-x.size < -eps || x.y+0.3*x.size > d.h+eps {
			t.Errorf("%s: text %q at (%.1f, %.1f), %.1f pt wide, leaves the %g × %g page", name, x.s, x.x, x.y, w, d.w, d.h)
		}
	}
	for _, p := range d.paths {
		for _, q := range p.pts {
			if q[0] < -eps || q[0] > d.w+eps || q[1] < -eps || q[1] > d.h+eps {
				t.Errorf("%s: a path vertex at (%.1f, %.1f) leaves the %g × %g page", name, q[0], q[1], d.w, d.h)
				break
			}
		}
	}
	for _, im := range d.images {
		if im.x < -eps || im.y < -eps || im.x+im.w > d.w+eps || im.y+im.h > d.h+eps {
			t.Errorf("%s: an image at (%.1f, %.1f) %.1f × %.1f leaves the page", name, im.x, im.y, im.w, im.h)
		}
		if im.attrs["preserveAspectRatio"] != "none" {
			t.Errorf("%s: an image keeps its bitmap's aspect ratio: it would not fill its box", name)
		}
	}
}

// centroid returns the mean of the path's vertices and half its width
// and height.
func centroid(p svgPath) (cx, cy, rx, ry float64) {
	x0, x1, y0, y1 := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, q := range p.pts {
		cx, cy = cx+q[0], cy+q[1]
		x0, x1, y0, y1 = math.Min(x0, q[0]), math.Max(x1, q[0]), math.Min(y0, q[1]), math.Max(y1, q[1])
	}
	n := float64(len(p.pts))
	return cx / n, cy / n, (x1 - x0) / 2, (y1 - y0) / 2
}

// pathCmd matches one command of a path's data and its numbers.
var pathCmd = regexp.MustCompile(`([MLAZ])([^MLAZ]*)`)
