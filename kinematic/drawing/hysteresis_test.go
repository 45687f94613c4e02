package drawing_test

import (
	"bytes"
	"errors"
	"io"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// handLoop is a cycle by hand: loads 2, 4, −4, 0 N along (0, 3, 4)/5,
// the point displaced along that direction by 1, 2, −1.5 and 0.25 µm
// (plus 7 µm across it, along x, which the drawing leaves out): the
// residual along the load is 0.25 µm (drawn to three figures, 0.250).
func handLoop() kinematic.Hysteresis {
	u := r3.Vec{Y: 0.6, Z: 0.8}
	step := func(f, d float64) kinematic.HysteresisStep {
		return kinematic.HysteresisStep{Force: r3.Scale(f, u), Displacement: r3.Add(r3.Scale(d*1e-6, u), r3.Vec{X: 7e-6})}
	}
	h := kinematic.Hysteresis{Mu: 0.15, Case: "seated", Energy: 1.25e-7,
		Path: []kinematic.HysteresisStep{step(2, 1), step(4, 2), step(-4, -1.5), step(0, 0.25)}}
	h.Residual = h.Path[3].Displacement
	return h
}

// TestHysteresisDrawn: the residual along the load in the legend
// (0.250 µm, by hand above), the load's direction in the axis label, the
// energy and μ in the notes; the plotters hold the path from the seated
// pose (five points, the first at the origin) and the residual at zero
// load.
func TestHysteresisDrawn(t *testing.T) {
	h := handLoop()
	d := draw(t, "hysteresis", func(w io.Writer) error {
		return drawing.Hysteresis(w, h, &drawing.Options{PointName: "probe tip"})
	})
	all := ""
	for _, x := range d.texts {
		all += x.s + "\n"
	}
	for _, want := range []string{"residual after the cycle, its component along the load: 0.250 µm", "displacement 7.00 µm along", "3-D magnitudes", "load along (0, 0.6, 0.8), N", "1.25e-07 J", "mu 0.150", `case "seated"`, "probe tip"} {
		if !strings.Contains(all, want) {
			t.Errorf("no %q in the texts:\n%s", want, all)
		}
	}
	// No text over another (rotated axis labels are measured along x, so
	// they are left out).
	for i, a := range d.texts {
		for _, b := range d.texts[:i] {
			if !a.rotated && !b.rotated && overlap(labelBox(a), labelBox(b)) {
				t.Errorf("texts %q and %q overlap", a.s, b.s)
			}
		}
	}
	path, res, err := drawing.HysteresisPlotters(h, nil)
	if err != nil {
		t.Fatal(err)
	}
	want := [][2]float64{{0, 0}, {2, 1}, {4, 2}, {-4, -1.5}, {0, 0.25}}
	if path.Len() != len(want) {
		t.Fatalf("%d points, want %d", path.Len(), len(want))
	}
	for i, w := range want {
		x, y := path.XY(i)
		if math.Abs(x-w[0]) > 1e-12 || math.Abs(y-w[1]) > 1e-9 {
			t.Errorf("point %d: (%g, %g), want %v", i, x, y, w)
		}
	}
	if x, y := res.XY(0); x != 0 || math.Abs(y-0.25) > 1e-9 {
		t.Errorf("residual at (%g, %g), want (0, 0.25)", x, y)
	}
}

func TestHysteresisErrors(t *testing.T) {
	h := handLoop()
	h.Path[1].Displacement.Y = math.NaN()
	if err := drawing.Hysteresis(io.Discard, h, nil); !errors.Is(err, kinematic.ErrNonFinite) || !strings.Contains(err.Error(), "h.Path[1].Displacement") {
		t.Errorf("NaN displacement: %v", err)
	}
	if err := drawing.Hysteresis(io.Discard, kinematic.Hysteresis{}, nil); !errors.Is(err, kinematic.ErrDegenerate) {
		t.Errorf("no path: %v", err)
	}
	h = handLoop()
	if err := drawing.Hysteresis(io.Discard, h, &drawing.Options{Format: "gif"}); !errors.Is(err, kinematic.ErrRange) {
		t.Errorf("format gif: %v", err)
	}
}

// FuzzHysteresisDrawing draws arbitrary paths: either an error wrapping
// one of kinematic's sentinels, or a well-formed SVG; never a panic.
func FuzzHysteresisDrawing(f *testing.F) {
	// Each group: a step's force x, z, moment z, displacement x, z, tilt z.
	f.Add(fuzzdata.Append(nil, 1, 0, 0, 1e-6, 0, 0, -1, 0, 0, -0.8e-6, 0, 0, 0, 0, 0, 1e-8, 0, 0))
	f.Add(fuzzdata.Append(nil, 0, 0, 1, 0, 0, 1e-6, 0, 0, 0, 0, 0, 1e-7))
	f.Add(fuzzdata.Append(nil, math.NaN(), 0, 0, 0, 0, 0))
	f.Add(fuzzdata.Append(nil, 1e300, 1e300, 0, 1e300, -1e300, 0, 5e-324, 0, 0, 1e-300, 0, 0))
	f.Fuzz(func(t *testing.T, data []byte) {
		gs := fuzzdata.Floats(data, 6)
		if len(gs) == 0 || len(gs) > 200 {
			return
		}
		var h kinematic.Hysteresis
		for _, g := range gs {
			h.Path = append(h.Path, kinematic.HysteresisStep{Force: r3.Vec{X: g[0], Z: g[1]}, Moment: r3.Vec{Z: g[2]},
				Displacement: r3.Vec{X: g[3], Z: g[4]}, Tilt: r3.Vec{Z: g[5]}})
		}
		h.Residual = h.Path[len(h.Path)-1].Displacement
		var buf bytes.Buffer
		if err := drawing.Hysteresis(&buf, h, nil); err != nil {
			if !errors.Is(err, kinematic.ErrNonFinite) && !errors.Is(err, kinematic.ErrRange) && !errors.Is(err, kinematic.ErrDegenerate) {
				t.Fatalf("error without a sentinel: %v", err)
			}
			return
		}
		wellFormed(t, "hysteresis", buf.Bytes())
	})
}
