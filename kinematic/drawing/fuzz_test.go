package drawing_test

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// FuzzHistogram draws the histogram of studies with arbitrary kept
// samples and limits: either an error wrapping one of kinematic's
// sentinels (a NaN sample, a limit that is not finite), or a well-formed
// SVG; never a panic.
func FuzzHistogram(f *testing.F) {
	// Each group: a sample's displacement and a limit; the last group's
	// limit is the one drawn.
	f.Add(fuzzdata.Append(nil, 1e-6, 2e-6, 0, 25e-6, -3e-6, 5e-7, 1e-6, 25e-6))
	f.Add(fuzzdata.Append(nil, 0, 0, 0, 0, 0, 0, 0, 0))
	f.Add(fuzzdata.Append(nil, 1e300, -1e300, 1e-300, 1e308, 5e-324, 0, 0, -1))
	f.Fuzz(func(t *testing.T, data []byte) {
		gs := fuzzdata.Floats(data, 4)
		if len(gs) == 0 || len(gs) > 200 {
			return
		}
		res := kinematic.StudyResult{}
		for _, g := range gs {
			res.Points = append(res.Points, r3.Vec{X: g[0], Y: g[1], Z: g[2]})
		}
		res.Samples = len(res.Points)
		var buf bytes.Buffer
		err := drawing.Histogram(&buf, res, &drawing.Options{Limit: gs[len(gs)-1][3]})
		if err != nil {
			if !errors.Is(err, kinematic.ErrNonFinite) && !errors.Is(err, kinematic.ErrRange) && !errors.Is(err, kinematic.ErrDegenerate) {
				t.Fatalf("error without a sentinel: %v", err)
			}
			return
		}
		wellFormed(t, "histogram", buf.Bytes())
	})
}

// FuzzRandomDrawings draws the random vibration figures with arbitrary
// margins, densities and limit: either an error wrapping one of
// kinematic's sentinels, or a well-formed SVG; never a panic.
func FuzzRandomDrawings(f *testing.F) {
	// Each group: a contact's margin, a frequency and an acceleration
	// density; the last group's margin is the limit.
	f.Add(fuzzdata.Append(nil, 1, 100, 2, 3, 200, 5, 0.5, 300, 1, 3))
	f.Add(fuzzdata.Append(nil, math.Inf(1), 0, 0, 0, 1e300, 1e300, 2))
	f.Add(fuzzdata.Append(nil, -1, -5, 1e-300, 5e-324, 1e308, -1, 0))
	spec := kinematic.Spectrum{Points: []kinematic.Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 2000, ASD: 0.01}}}
	f.Fuzz(func(t *testing.T, data []byte) {
		gs := fuzzdata.Floats(data, 3)
		if len(gs) == 0 || len(gs) > 64 {
			return
		}
		var c drawing.RandomCurve
		for i, g := range gs {
			c.Response.Contacts = append(c.Response.Contacts, kinematic.RandomContact{Label: fmt.Sprintf("c%d", i), Margin: g[0]})
			c.Density = append(c.Density, kinematic.RandomDensity{Frequency: g[1], Acceleration: g[2]})
		}
		c.Response.Point.RMS = gs[0][2]
		for _, draw := range []func(*bytes.Buffer) error{
			func(b *bytes.Buffer) error {
				return drawing.RandomMargins(b, []drawing.RandomCurve{c}, &drawing.Options{Limit: gs[len(gs)-1][0]})
			},
			func(b *bytes.Buffer) error { return drawing.RandomSpectrum(b, spec, []drawing.RandomCurve{c}, nil) },
		} {
			var buf bytes.Buffer
			if err := draw(&buf); err != nil {
				if !errors.Is(err, kinematic.ErrNonFinite) && !errors.Is(err, kinematic.ErrRange) && !errors.Is(err, kinematic.ErrDegenerate) {
					t.Fatalf("error without a sentinel: %v", err)
				}
				continue
			}
			wellFormed(t, "random", buf.Bytes())
		}
	})
}
