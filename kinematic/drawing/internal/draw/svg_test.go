package draw

import (
	"bytes"
	"encoding/xml"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// node is one element of a parsed SVG document.
type node struct {
	name  string
	attrs map[string]string
	text  string
}

// doc is a parsed SVG document.
type doc struct {
	w, h  float64 // the viewBox size; its origin is checked to be 0 0
	nodes []node
}

// parse decodes the whole document with encoding/xml (so it is well-formed
// XML), checks the root and the viewBox, and returns every element.
func parse(t *testing.T, data []byte) doc {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(data))
	var d doc
	var stack []int
	depth := 0
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("not well-formed XML: %v\n%s", err, data)
		}
		switch tk := tok.(type) {
		case xml.StartElement:
			n := node{name: tk.Name.Local, attrs: map[string]string{}}
			for _, a := range tk.Attr {
				// encoding/xml does not reject a repeated attribute; XML does.
				if _, dup := n.attrs[a.Name.Local]; dup {
					t.Errorf("<%s> repeats the attribute %s", n.name, a.Name.Local)
				}
				n.attrs[a.Name.Local] = a.Value
			}
			if depth == 0 {
				if n.name != "svg" || tk.Name.Space != "http://www.w3.org/2000/svg" {
					t.Fatalf("root is %v, want svg in the SVG namespace", tk.Name)
				}
				f := strings.Fields(n.attrs["viewBox"])
				if len(f) != 4 || f[0] != "0" || f[1] != "0" {
					t.Fatalf("viewBox %q, want 0 0 w h", n.attrs["viewBox"])
				}
				d.w, d.h = atof(t, f[2]), atof(t, f[3])
			}
			d.nodes = append(d.nodes, n)
			stack = append(stack, len(d.nodes)-1)
			depth++
		case xml.CharData:
			if len(stack) > 0 {
				d.nodes[stack[len(stack)-1]].text += string(tk)
			}
		case xml.EndElement:
			stack = stack[:len(stack)-1]
			depth--
		}
	}
	if depth != 0 || len(d.nodes) == 0 {
		t.Fatalf("unbalanced or empty document")
	}
	return d
}

func atof(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("number %q: %v", s, err)
	}
	return v
}

// all returns the elements named name whose class is class ("" for any).
func (d doc) all(name, class string) []node {
	var ns []node
	for _, n := range d.nodes {
		if n.name == name && (class == "" || n.attrs["class"] == class) {
			ns = append(ns, n)
		}
	}
	return ns
}

// texts returns the text of every <text> element.
func (d doc) texts() []string {
	var ts []string
	for _, n := range d.all("text", "") {
		ts = append(ts, n.text)
	}
	return ts
}

// hasText reports whether some <text> element holds s.
func (d doc) hasText(s string) bool {
	for _, t := range d.texts() {
		if strings.Contains(t, s) {
			return true
		}
	}
	return false
}

var nonFinite = regexp.MustCompile(`(?i)\bnan\b|[+-]?\binf\b|infinity`)

// checkCommon runs the checks every drawing must pass: well-formed XML, no
// NaN or Inf anywhere in the text, no transforms, every element inside the
// viewBox, and no two labels (text on a halo) overlapping.
func checkCommon(t *testing.T, data []byte) doc {
	t.Helper()
	if m := nonFinite.Find(data); m != nil {
		t.Errorf("output holds %q", m)
	}
	d := parse(t, data)
	const tol = 0.01 // px: coordinates are printed to 0.01
	in := func(what string, b box) {
		if b.x0 < -tol || b.y0 < -tol || b.x1 > d.w+tol || b.y1 > d.h+tol {
			t.Errorf("%s at %+v lies outside the viewBox 0 0 %g %g", what, b, d.w, d.h)
		}
	}
	var halos, texts []box
	for _, n := range d.nodes {
		if _, ok := n.attrs["transform"]; ok {
			t.Errorf("%s has a transform", n.name)
		}
		a := func(k string) float64 { return atof(t, n.attrs[k]) }
		switch n.name {
		case "circle":
			in("circle", box{a("cx") - a("r"), a("cy") - a("r"), a("cx") + a("r"), a("cy") + a("r")})
		case "line":
			in("line", box{math.Min(a("x1"), a("x2")), math.Min(a("y1"), a("y2")), math.Max(a("x1"), a("x2")), math.Max(a("y1"), a("y2"))})
		case "rect":
			b := box{a("x"), a("y"), a("x") + a("width"), a("y") + a("height")}
			in("rect", b)
			if n.attrs["class"] == "halo" {
				halos = append(halos, b)
			}
		case "polygon", "polyline":
			for _, p := range strings.Fields(n.attrs["points"]) {
				xy := strings.Split(p, ",")
				if len(xy) != 2 {
					t.Fatalf("points %q", n.attrs["points"])
				}
				x, y := atof(t, xy[0]), atof(t, xy[1])
				in(n.name, box{x, y, x, y})
			}
		case "text":
			b := textBox(n.text, a("x"), a("y"), a("font-size"), n.attrs["text-anchor"])
			in("text "+strconv.Quote(n.text), b)
			texts = append(texts, b)
		}
	}
	for i := range halos {
		for j := range i {
			if halos[i].overlaps(halos[j]) {
				t.Errorf("labels overlap: %+v and %+v", halos[i], halos[j])
			}
		}
	}
	// No two texts of the drawing overlap (labels, ticks, legend, notes).
	ts := d.all("text", "")
	for i := range texts {
		for j := range i {
			if texts[i].overlaps(texts[j]) {
				t.Errorf("texts overlap: %q at %+v and %q at %+v", ts[i].text, texts[i], ts[j].text, texts[j])
			}
		}
	}
	return d
}

// render returns the SVG of a drawing, failing the test on error, and
// writes it to $DRAW_OUT/name.svg when that variable is set (to look at).
func render(t *testing.T, name string, write func(io.Writer) error) []byte {
	t.Helper()
	var b bytes.Buffer
	if err := write(&b); err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	if dir := os.Getenv("DRAW_OUT"); dir != "" {
		if err := os.WriteFile(filepath.Join(dir, name+".svg"), b.Bytes(), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return b.Bytes()
}
