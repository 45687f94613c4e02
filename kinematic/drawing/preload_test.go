package drawing_test

import (
	"bytes"
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// TestPreloadCurve checks the drawing of a magnet pair's law: a
// well-formed SVG stating the seated force and stiffness the law gives,
// the runaway point at the seat for a magnet (its force falls as the part
// lifts) and at the peak for a table that rises to 45 N, and errors for
// an element without a law or with a non-finite limit.
func TestPreloadCurve(t *testing.T) {
	m := kinematic.Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: kinematic.RemanenceN42}
	p := kinematic.Preload{Name: "magnets", Law: kinematic.MagnetPair{Moving: m, Base: m}, Gap: 0.0006}
	var buf bytes.Buffer
	if err := drawing.PreloadCurve(&buf, p, &drawing.Options{Limit: 20}); err != nil {
		t.Fatal(err)
	}
	wellFormed(t, "preload curve", buf.Bytes())
	if s := buf.String(); !strings.Contains(s, "lift-off = runaway") || !strings.Contains(s, "negative spring") {
		t.Errorf("the magnet's curve does not say that it lets go at lift-off, or that it is a negative spring")
	}
	tb, err := kinematic.NewForceTable([]kinematic.TablePoint{{Gap: 0, Force: 20}, {Gap: 0.001, Force: 30}, {Gap: 0.002, Force: 45}, {Gap: 0.004, Force: 5}})
	if err != nil {
		t.Fatal(err)
	}
	ps, names, err := drawing.PreloadCurvePlotters(kinematic.Preload{Law: tb, Gap: 0.001}, nil)
	if err != nil || len(ps) != len(names) {
		t.Fatalf("%d plotters, %d names, %v", len(ps), len(names), err)
	}
	if last := names[len(names)-1]; !strings.Contains(last, "45.0 N at 2.00 mm") {
		t.Errorf("runaway point %q; want the table's peak, 45 N at 2 mm", last)
	}
	if err := drawing.PreloadCurve(&buf, kinematic.Preload{Force: 3}, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("no law: %v", err)
	}
	if err := drawing.PreloadCurve(&buf, p, &drawing.Options{Limit: math.NaN()}); !errors.Is(err, kinematic.ErrNonFinite) {
		t.Errorf("NaN limit: %v", err)
	}
}

// FuzzPreloadCurve draws tables and magnets of arbitrary numbers: either
// an error wrapping one of kinematic's sentinels or a well-formed SVG;
// never a panic. The bytes are float64s: the seated gap, then pairs of
// gap and force (a table), or with a first number above 1e3 a magnet's
// three edges and remanence.
func FuzzPreloadCurve(f *testing.F) {
	f.Add(fuzzdata.Append(nil, 0.001, 0, 20, 0.001, 30, 0.002, 45))
	f.Add(fuzzdata.Append(nil, 0.001, 0, -20, 0.001, 30, 0.001, 45))
	f.Add(fuzzdata.Append(nil, 0.0006, 2e3, 0.012, 0.012, 0.004, 1.3))
	f.Add(fuzzdata.Append(nil, 0, 2e3, 0, 0.012, 0.004, math.NaN()))
	f.Fuzz(func(t *testing.T, data []byte) {
		gs := fuzzdata.Floats(data, 1)
		if len(gs) < 3 || len(gs) > 40 {
			return
		}
		v := make([]float64, len(gs))
		for i := range gs {
			v[i] = gs[i][0]
		}
		p := kinematic.Preload{Gap: v[0]}
		if v[1] > 1e3 && len(v) >= 6 {
			m := kinematic.Magnet{Size: [3]float64{v[2], v[3], v[4]}, Remanence: v[5]}
			p.Law = kinematic.MagnetPlate{Magnet: m}
		} else {
			tb := &kinematic.ForceTable{}
			for i := 1; i+1 < len(v); i += 2 {
				tb.Points = append(tb.Points, kinematic.TablePoint{Gap: v[i], Force: v[i+1]})
			}
			p.Law = tb
		}
		var buf bytes.Buffer
		if err := drawing.PreloadCurve(&buf, p, nil); err != nil {
			if !errors.Is(err, kinematic.ErrNonFinite) && !errors.Is(err, kinematic.ErrRange) && !errors.Is(err, kinematic.ErrDegenerate) {
				t.Fatalf("error without a sentinel: %v", err)
			}
			return
		}
		wellFormed(t, "preload curve", buf.Bytes())
	})
}
