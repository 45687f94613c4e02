package drawing_test

import (
	"bytes"
	"errors"
	"io"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// benchSpectrum is a flat 0.04 g²/Hz from 20 to 2000 Hz: its grms is
// √(0.04·1980) = 8.899 g (by hand).
var benchSpectrum = kinematic.Spectrum{Points: []kinematic.Breakpoint{{Frequency: 20, ASD: 0.04}, {Frequency: 2000, ASD: 0.04}}}

// randomCurves returns the bench's responses along z and x with their
// densities on 400 log-spaced frequencies across the band.
func randomCurves(t *testing.T) []drawing.RandomCurve {
	t.Helper()
	b, _ := built(t, bench)
	lc := b.Design().Cases[0]
	f := make([]float64, 400)
	for i := range f {
		f[i] = 20 * math.Pow(100, float64(i)/399)
	}
	var cs []drawing.RandomCurve
	for _, ax := range []struct {
		name string
		dir  r3.Vec
	}{{"z", r3.Vec{Z: 1}}, {"x", r3.Vec{X: 1}}} {
		opt := &kinematic.RandomOptions{Direction: ax.dir, Point: b.Design().Point}
		r, err := b.Model().Random(lc, benchSpectrum, opt)
		if err != nil {
			t.Fatal(err)
		}
		d, err := b.Model().RandomDensity(lc, benchSpectrum, opt, f)
		if err != nil {
			t.Fatal(err)
		}
		cs = append(cs, drawing.RandomCurve{Name: ax.name, Response: r, Density: d})
	}
	return cs
}

// TestRandomSpectrumDrawn: the spectrum's grms in the legend (8.899 g by
// hand, printed to three figures), a legend entry per curve with its
// RMS, the title naming the point; the errors documented.
func TestRandomSpectrumDrawn(t *testing.T) {
	cs := randomCurves(t)
	d := draw(t, "random spectrum", func(w io.Writer) error {
		return drawing.RandomSpectrum(w, benchSpectrum, cs, &drawing.Options{PointName: "probe tip"})
	})
	for _, want := range []string{"base input, 8.90 grms", "probe tip, along z:", "probe tip, along x:", "frequency, Hz"} {
		found := false
		for _, x := range d.texts {
			found = found || strings.Contains(x.s, want)
		}
		if !found {
			t.Errorf("no text holding %q", want)
		}
	}
	if !strings.Contains(d.title, "(8.90 grms)") || !strings.Contains(d.title, "probe tip") {
		t.Errorf("title %q", d.title)
	}
	bad := []drawing.RandomCurve{{Density: []kinematic.RandomDensity{{Frequency: 100, Acceleration: math.NaN()}}}}
	if err := drawing.RandomSpectrum(io.Discard, benchSpectrum, bad, nil); !errors.Is(err, kinematic.ErrRange) || !strings.Contains(err.Error(), "curves[0].Density[0]") {
		t.Errorf("NaN density: %v", err)
	}
	if err := drawing.RandomSpectrum(io.Discard, kinematic.Spectrum{}, nil, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("empty spectrum: %v", err)
	}
}

// TestRandomMarginsDrawn: one bar per contact and direction, heights in
// proportion to the margins, the limit line and its legend.
func TestRandomMarginsDrawn(t *testing.T) {
	labels := []string{"A+", "A-", "B+", "B-", "C+", "C-"}
	var r1, r2 kinematic.Random
	for i, l := range labels {
		r1.Contacts = append(r1.Contacts, kinematic.RandomContact{Label: l, Margin: float64(i + 1)})
		r2.Contacts = append(r2.Contacts, kinematic.RandomContact{Label: l, Margin: 6 - float64(i)})
	}
	r2.Least = 5
	cs := []drawing.RandomCurve{{Name: "z", Response: r1}, {Name: "worst", Response: r2}}
	d := draw(t, "random margins", func(w io.Writer) error {
		return drawing.RandomMargins(w, cs, &drawing.Options{Limit: 3})
	})
	for _, want := range append([]string{"along z (least 1.00 at A+)", "along worst (least 1.00 at C-)", "required margin: 3.00 σ"}, labels...) {
		if _, ok := d.text(want); !ok {
			t.Errorf("no text %q", want)
		}
	}
	var first []svgPath
	for _, p := range d.paths {
		if p.style == "fill:#F15A60" {
			first = append(first, p)
		}
	}
	if len(first) != 7 {
		t.Fatalf("%d filled shapes of the first colour, want 7 (six bars and a swatch)", len(first))
	}
	_, _, _, h1 := centroid(first[0])
	_, _, _, h6 := centroid(first[5])
	if math.Abs(h6/h1-6) > 6e-3 {
		t.Errorf("bars of margins 1 and 6 in the ratio %.4f, want 6", h6/h1)
	}
	// An unbounded margin draws to the top and is named in the notes.
	r1.Contacts[2].Margin = math.Inf(1)
	var buf bytes.Buffer
	if err := drawing.RandomMargins(&buf, []drawing.RandomCurve{{Name: "z", Response: r1}}, nil); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "B+ along z") {
		t.Error("the unbounded margin is not named in the notes")
	}
	// Margins beyond four times the larger of the limit (3) and the least
	// margin (1) are cut at 12 and counted in the notes.
	r1.Contacts[2].Margin = 40
	r1.Contacts[4].Margin = 13
	buf.Reset()
	if err := drawing.RandomMargins(&buf, []drawing.RandomCurve{{Name: "z", Response: r1}}, &drawing.Options{Limit: 3}); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "2 bars with margins above 12.0 σ are cut") {
		t.Error("the cut bars are not counted in the notes")
	}
	// The cut bars end at the cap, 12 times the bar of margin 1, and the
	// axis ends short of twice the cap (it ran to 1.57 times the cap
	// with nothing above the legend).
	d = draw(t, "random margins cut", func(w io.Writer) error {
		return drawing.RandomMargins(w, []drawing.RandomCurve{{Name: "z", Response: r1}}, &drawing.Options{Limit: 3})
	})
	first = first[:0]
	for _, p := range d.paths {
		if p.style == "fill:#F15A60" {
			first = append(first, p)
		}
	}
	if len(first) != 7 {
		t.Fatalf("%d filled shapes of the first colour, want 7 (six bars and a swatch)", len(first))
	}
	_, _, _, h1 = centroid(first[0])
	for _, i := range []int{2, 4} {
		if _, _, _, h := centroid(first[i]); math.Abs(h/h1-12) > 12e-3 {
			t.Errorf("cut bar %d: %.4f times the bar of margin 1, want 12 (the cap)", i, h/h1)
		}
	}
	if _, ok := d.text("bars cut at 12.0 σ"); !ok {
		t.Error("no legend entry for the cap's line")
	}
	// The margin axis is the longest vertical two-point line; the bar
	// of margin 1 is 2·h1 high, so the cap is 24·h1.
	axis := 0.0
	for _, p := range d.paths {
		if len(p.pts) == 2 && p.pts[0][0] == p.pts[1][0] {
			axis = math.Max(axis, math.Abs(p.pts[1][1]-p.pts[0][1]))
		}
	}
	if r := axis / (24 * h1); r < 1 || r > 1.4 {
		t.Errorf("the margin axis is %.3f times the cap; want it to end a legend's height above the cap, under 1.4", r)
	}
	for _, c := range []struct {
		name string
		cs   []drawing.RandomCurve
		opt  *drawing.Options
		err  error
		in   string
	}{
		{"none", nil, nil, kinematic.ErrDegenerate, ""},
		{"NaN margin", []drawing.RandomCurve{{Response: kinematic.Random{Contacts: []kinematic.RandomContact{{Label: "A+", Margin: math.NaN()}}}}}, nil, kinematic.ErrNonFinite, "curves[0].Response.Contacts[0].Margin"},
		{"labels differ", []drawing.RandomCurve{cs[0], {Response: kinematic.Random{Contacts: append([]kinematic.RandomContact{{Label: "X"}}, r2.Contacts[1:]...)}}}, nil, kinematic.ErrDegenerate, "curves[1].Response.Contacts[0].Label"},
		{"NaN limit", cs, &drawing.Options{Limit: math.NaN()}, kinematic.ErrRange, "Options.Limit"},
	} {
		err := drawing.RandomMargins(io.Discard, c.cs, c.opt)
		if !errors.Is(err, c.err) || !strings.Contains(fmtErr(err), c.in) {
			t.Errorf("%s: %v, want %v naming %q", c.name, err, c.err, c.in)
		}
	}
}

func fmtErr(err error) string {
	if err == nil {
		return ""
	}
	return err.Error()
}
