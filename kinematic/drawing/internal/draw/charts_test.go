package draw

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

// liftOff returns a heat map like a lift-off force map over a 120 × 90 mm
// moving body whose corners are cut (cells outside are NaN), with a
// central patch that never lifts off (+Inf). The values are invented.
func liftOff() HeatMap {
	const nx, ny = 40, 30
	g := Grid{X0: -0.060, Y0: -0.045, DX: 0.003, DY: 0.003, NX: nx, NY: ny, Values: make([]float64, nx*ny)}
	for j := range ny {
		for i := range nx {
			x := g.X0 + (float64(i)+0.5)*g.DX
			y := g.Y0 + (float64(j)+0.5)*g.DY
			v := 40 + 2000*math.Hypot(x-0.01, y+0.005)
			switch {
			case math.Abs(x)+math.Abs(y) > 0.090:
				v = math.NaN()
			case math.Hypot(x-0.01, y+0.005) < 0.012:
				v = math.Inf(1)
			}
			g.Values[j*nx+i] = v
		}
	}
	return HeatMap{
		Title:    "Lift-off force for a load applied at each point",
		Grid:     g,
		Scale:    Scale{Name: "lift-off force", Unit: "N"},
		InfLabel: "never lifts off",
		Outline:  []Point{{-0.060, -0.030}, {-0.045, -0.045}, {0.045, -0.045}, {0.060, -0.030}, {0.060, 0.030}, {0.045, 0.045}, {-0.045, 0.045}, {-0.060, 0.030}},
		Markers:  []Marker{{Kind: PointOfInterest, At: Point{0.020, 0.010}, Label: "detector"}, {Kind: CouplingCentre, At: Point{0.010, -0.005}}},
		Notes:    []string{"Invented numbers for a drawing test."},
	}
}

// TestHeatMap checks the cells, the +Inf cells, the legend with units and
// the axes in millimetres.
func TestHeatMap(t *testing.T) {
	m := liftOff()
	d := checkCommon(t, render(t, "heatmap", m.WriteSVG))
	var finiteN, infN int
	minV := math.Inf(1)
	for _, v := range m.Grid.Values {
		switch {
		case math.IsInf(v, 1):
			infN++
		case !math.IsNaN(v):
			finiteN++
			minV = math.Min(minV, v)
		}
	}
	if infN == 0 || finiteN == 0 {
		t.Fatalf("test map has %d finite and %d infinite cells", finiteN, infN)
	}
	if got := len(d.all("rect", "cell")); got != finiteN {
		t.Errorf("%d cells, want %d", got, finiteN)
	}
	if got := len(d.all("rect", "cell-never")); got != infN {
		t.Errorf("%d never-cells, want %d", got, infN)
	}
	if len(d.all("rect", "legend-bar")) != 1 || len(d.all("rect", "legend-never")) != 1 {
		t.Errorf("want one colour bar and one never-swatch")
	}
	for _, want := range []string{"lift-off force, N", "never lifts off", "x, mm", "y, mm", "detector (20.0, 10.0) mm", m.Title} {
		if !d.hasText(want) {
			t.Errorf("no text %q; texts %q", want, d.texts())
		}
	}
	// The grid spans −60..60 mm in x: round ticks every 20 mm.
	for _, want := range []string{"-60", "-20", "0", "20", "60"} {
		if !slices.Contains(d.texts(), want) {
			t.Errorf("no x tick %q", want)
		}
	}
	// The smallest value takes the low end of the scale (the first stop,
	// deep violet #3b1f5c, as documented).
	low := 0
	for _, c := range d.all("rect", "cell") {
		if c.attrs["fill"] == "#3b1f5c" {
			low++
		}
	}
	if low == 0 {
		t.Errorf("no cell at the low end of the scale (min %g N)", minV)
	}
}

// TestHeatMapErrors checks field names and sentinels.
func TestHeatMapErrors(t *testing.T) {
	cases := []struct {
		name   string
		edit   func(*HeatMap)
		field  string
		target error
	}{
		{"short values", func(m *HeatMap) { m.Grid.Values = m.Grid.Values[1:] }, "Grid.Values", ErrDegenerate},
		{"zero DX", func(m *HeatMap) { m.Grid.DX = 0 }, "Grid.DX", ErrRange},
		{"NaN Y0", func(m *HeatMap) { m.Grid.Y0 = math.NaN() }, "Grid.Y0", ErrNonFinite},
		{"zero NY", func(m *HeatMap) { m.Grid.NY = 0 }, "Grid.NY", ErrRange},
		{"too many", func(m *HeatMap) { m.Grid.NX, m.Grid.NY = 1000, 1000 }, "Grid.NY", ErrRange},
		{"-Inf value", func(m *HeatMap) { m.Grid.Values[7] = math.Inf(-1) }, "Grid.Values[7]", ErrNonFinite},
		{"huge value", func(m *HeatMap) { m.Grid.Values[8] = 1e301 }, "Grid.Values[8]", ErrRange},
		{"tiny cells", func(m *HeatMap) {
			m.Grid = Grid{DX: 1e-300, DY: 1e-300, NX: 1, NY: 1, Values: []float64{1}}
			m.Outline, m.Markers = nil, nil
		}, "HeatMap", ErrRange},
		{"NaN marker", func(m *HeatMap) { m.Markers[1].At.X = math.NaN() }, "Markers[1].At.X", ErrNonFinite},
		{"Inf outline", func(m *HeatMap) { m.Outline[3].Y = math.Inf(1) }, "Outline[3].Y", ErrNonFinite},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := liftOff()
			c.edit(&m)
			err := m.WriteSVG(new(strings.Builder))
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.target) {
				t.Fatalf("err = %v, want *InputError on %s wrapping %v", err, c.field, c.target)
			}
		})
	}
}

// TestHeatMapOnlyInf checks a map where nothing lifts off: no colour bar
// (there is no finite value to scale), the never-swatch, no NaN text.
func TestHeatMapOnlyInf(t *testing.T) {
	g := Grid{DX: 0.01, DY: 0.01, NX: 3, NY: 2, Values: []float64{math.Inf(1), math.Inf(1), math.NaN(), math.Inf(1), math.Inf(1), math.Inf(1)}}
	d := checkCommon(t, render(t, "heatmap-inf", HeatMap{Grid: g, Scale: Scale{Name: "lift-off force", Unit: "N"}}.WriteSVG))
	if len(d.all("rect", "legend-bar")) != 0 || len(d.all("rect", "cell-never")) != 5 || !d.hasText("never") {
		t.Errorf("all-infinite map drawn wrong; texts %q", d.texts())
	}
}

// shuffled returns 0, 1, ..., 200 in a fixed random order.
func shuffled() []float64 {
	xs := make([]float64, 201)
	for i := range xs {
		xs[i] = float64(i)
	}
	r := rand.New(rand.NewPCG(1, 2))
	r.Shuffle(len(xs), func(i, j int) { xs[i], xs[j] = xs[j], xs[i] })
	return xs
}

// TestHistogram checks bins, counts and the percentile lines and labels.
//
// Samples 0, 1, ..., 200 (n = 201). Hyndman & Fan (1996), Am. Stat. 50(4),
// definition 7: the p-quantile is x[h] interpolated at h = (n−1)p with
// 0-based order statistics, so P50 = x[100] = 100, P95 = x[190] = 190,
// P99 = x[198] = 198 and P99.73 at h = 199.46 is 199.46 (printed to three
// figures, 199). Freedman & Diaconis (1981): IQR = P75 − P25 = 150 − 50 =
// 100, width 2·100·201^(−1/3) = 34.14, so ⌈200/34.14⌉ = 6 bins of 33.3;
// counting by hand, v = 0..33, 34..66, 67..99, 100..133, 134..166,
// 167..200 fall in the six bins: 34, 33, 33, 34, 33, 34.
func TestHistogram(t *testing.T) {
	xs := shuffled()
	orig := slices.Clone(xs)
	h := Histogram{Title: "Error at the detector over 201 builds", Quantity: "error at the detector", Unit: "µm", Samples: xs}
	d := checkCommon(t, render(t, "histogram", h.WriteSVG))
	if !slices.Equal(xs, orig) {
		t.Errorf("samples modified")
	}
	bins := d.all("rect", "bin")
	if len(bins) != 6 {
		t.Fatalf("%d bins, want 6", len(bins))
	}
	want := []float64{34, 33, 33, 34, 33, 34}
	h0 := atof(t, bins[0].attrs["height"])
	for i, b := range bins {
		if got := atof(t, b.attrs["height"]) / h0; math.Abs(got-want[i]/34) > 1e-3 {
			t.Errorf("bin %d height ratio %g, want %g", i, got, want[i]/34)
		}
	}
	if got := len(d.all("line", "percentile")); got != 4 {
		t.Errorf("%d percentile lines, want 4", got)
	}
	for _, want := range []string{"P50 = 100 µm", "P95 = 190 µm", "P99 = 198 µm", "P99.73 = 199 µm", "error at the detector, µm", "samples per bin"} {
		if !d.hasText(want) {
			t.Errorf("no text %q; texts %q", want, d.texts())
		}
	}
	sorted := slices.Sorted(slices.Values(xs))
	if got := percentile(sorted, 99.73); math.Abs(got-199.46) > 1e-9 {
		t.Errorf("P99.73 = %.12g, want 199.46", got)
	}
	// Percentile lines sit at their values: P50 halfway across the axis.
	axis := d.all("line", "axis")[0]
	x0, x1 := atof(t, axis.attrs["x1"]), atof(t, axis.attrs["x2"])
	p50 := atof(t, d.all("line", "percentile")[0].attrs["x1"])
	if math.Abs(p50-(x0+x1)/2) > 0.02 {
		t.Errorf("P50 line at %g px, want the middle of %g..%g", p50, x0, x1)
	}
}

// TestHistogramOneValue checks a degenerate sample set (all equal).
func TestHistogramOneValue(t *testing.T) {
	d := checkCommon(t, render(t, "histogram-one", Histogram{Quantity: "drift", Unit: "nm", Samples: []float64{3, 3, 3}}.WriteSVG))
	if len(d.all("rect", "bin")) != 1 || !d.hasText("P50 = 3.00 nm") {
		t.Errorf("one-value histogram wrong; texts %q", d.texts())
	}
}

func TestHistogramErrors(t *testing.T) {
	cases := []struct {
		name   string
		h      Histogram
		field  string
		target error
	}{
		{"empty", Histogram{}, "Samples", ErrDegenerate},
		{"NaN", Histogram{Samples: []float64{1, math.NaN()}}, "Samples[1]", ErrNonFinite},
		{"bins", Histogram{Samples: []float64{1}, Bins: -1}, "Bins", ErrRange},
		{"percentile 100", Histogram{Samples: []float64{1}, Percentiles: []float64{50, 100}}, "Percentiles[1]", ErrRange},
	}
	for _, c := range cases {
		err := c.h.WriteSVG(new(strings.Builder))
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.target) {
			t.Errorf("%s: err = %v, want *InputError on %s wrapping %v", c.name, err, c.field, c.target)
		}
	}
}

// TestBars checks one bar per candidate and figure, the normalisation to
// the best candidate, the printed values and the legend.
//
// Error at the detector (lower is better) 2, 4, 8 µm/µm: relative heights
// 2/2, 2/4, 2/8 = 1, 0.5, 0.25. Stiffness (higher is better) 30, 60, 45
// N/µm: 30/60, 60/60, 45/60 = 0.5, 1, 0.75.
func TestBars(t *testing.T) {
	c := Bars{
		Title:      "Candidate layouts",
		Candidates: []string{"aimed at centroid", "bisectors", "optimised"},
		Figures: []Figure{
			{Name: "error at the detector", Unit: "µm/µm", Values: []float64{2, 4, 8}, LowerIsBetter: true},
			{Name: "stiffness at the detector", Unit: "N/µm", Values: []float64{30, 60, 45}},
			{Name: "first natural frequency", Unit: "Hz", Values: []float64{410, 388, 402}},
			{Name: "weakest Maxwell index", Values: []float64{0.62, 0.71, 0.70}},
		},
	}
	d := checkCommon(t, render(t, "bars", c.WriteSVG))
	bars := d.all("rect", "bar")
	if len(bars) != 12 {
		t.Fatalf("%d bars, want 3 × 4", len(bars))
	}
	full := atof(t, bars[0].attrs["height"])
	for i, want := range []float64{1, 0.5, 0.25, 0.5, 1, 0.75} {
		if got := atof(t, bars[i].attrs["height"]) / full; math.Abs(got-want) > 1e-4 {
			t.Errorf("bar %d relative height %g, want %g", i, got, want)
		}
	}
	for _, want := range []string{"2.00 µm/µm", "8.00 µm/µm", "60.0 N/µm", "410 Hz", "0.710", "aimed at centroid", "optimised", "lower is better", "higher is better", "scaled to its best candidate"} {
		if !d.hasText(want) {
			t.Errorf("no text %q; texts %q", want, d.texts())
		}
	}
	if got := len(d.all("text", "bar-value")); got != 12 {
		t.Errorf("%d printed values, want 12", got)
	}
}

func TestBarsErrors(t *testing.T) {
	ok := func() Bars {
		return Bars{Candidates: []string{"a", "b"}, Figures: []Figure{{Name: "f", Values: []float64{1, 2}}, {Name: "g", Values: []float64{3, 4}}}}
	}
	cases := []struct {
		name   string
		edit   func(*Bars)
		field  string
		target error
	}{
		{"no candidates", func(b *Bars) { b.Candidates = nil }, "Candidates", ErrDegenerate},
		{"no figures", func(b *Bars) { b.Figures = nil }, "Figures", ErrDegenerate},
		{"short", func(b *Bars) { b.Figures[1].Values = []float64{3} }, "Figures[1].Values", ErrDegenerate},
		{"zero", func(b *Bars) { b.Figures[0].Values[1] = 0 }, "Figures[0].Values[1]", ErrRange},
		{"Inf", func(b *Bars) { b.Figures[1].Values[0] = math.Inf(1) }, "Figures[1].Values[0]", ErrNonFinite},
	}
	for _, c := range cases {
		b := ok()
		c.edit(&b)
		err := b.WriteSVG(new(strings.Builder))
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.target) {
			t.Errorf("%s: err = %v, want *InputError on %s wrapping %v", c.name, err, c.field, c.target)
		}
	}
}
