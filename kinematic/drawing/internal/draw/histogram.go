package draw

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
)

// Histogram is the distribution of samples (for example the error at a
// point of interest over a Monte Carlo study) in equal bins, with vertical
// lines at named percentiles.
type Histogram struct {
	Title    string
	Quantity string    // the sampled quantity, e.g. "error at the detector"
	Unit     string    // the samples' unit as printed, e.g. "µm"
	Samples  []float64 // in Unit, finite; at least one
	// Bins is the number of bins; 0 chooses it by the rule of Freedman and
	// Diaconis (1981), bin width 2·IQR·n^(−1/3), within 5 to 100 bins.
	Bins int
	// Percentiles to mark, in per cent, in (0, 100); nil means 50, 95, 99
	// and 99.73 (the two-sided 3σ level of a normal distribution).
	Percentiles []float64
	Notes       []string // lines of text under the drawing
}

// DefaultPercentiles are the percentiles a Histogram marks when it names none, %.
var DefaultPercentiles = []float64{50, 95, 99, 99.73}

const (
	histWidth  = 560.0 // px, the plot area
	histHeight = 260.0
	minBins    = 5
	maxBins    = 100
	// headroom above the tallest bin, as a fraction of the plot height,
	// for the percentile labels.
	headroom = 0.3
)

func (h Histogram) validate() error {
	if len(h.Samples) == 0 {
		return &InputError{Field: "Samples", Err: fmt.Errorf("%w: no samples", ErrDegenerate)}
	}
	for i, v := range h.Samples {
		if err := finite(fmt.Sprintf("Samples[%d]", i), v); err != nil {
			return err
		}
		if math.Abs(v) > 1e300 {
			return &InputError{Field: fmt.Sprintf("Samples[%d]", i), Err: fmt.Errorf("%w: %g beyond 1e300", ErrRange, v)}
		}
	}
	if h.Bins < 0 || h.Bins > maxBins*10 {
		return &InputError{Field: "Bins", Err: fmt.Errorf("%w: %d, want 0 (automatic) to %d", ErrRange, h.Bins, maxBins*10)}
	}
	for i, p := range h.Percentiles {
		if err := finite(fmt.Sprintf("Percentiles[%d]", i), p); err != nil {
			return err
		}
		if !(p > 0 && p < 100) {
			return &InputError{Field: fmt.Sprintf("Percentiles[%d]", i), Err: fmt.Errorf("%w: %g, want in (0, 100)", ErrRange, p)}
		}
	}
	return nil
}

// percentile returns the p-th percentile (0 < p < 100) of the sorted
// samples xs by linear interpolation between order statistics: Hyndman &
// Fan (1996), Am. Stat. 50(4), definition 7 (the default of R and NumPy).
func percentile(xs []float64, p float64) float64 {
	h := (float64(len(xs)) - 1) * p / 100
	i := int(math.Floor(h))
	if i >= len(xs)-1 {
		return xs[len(xs)-1]
	}
	return xs[i] + (h-float64(i))*(xs[i+1]-xs[i])
}

// binCount returns the number of bins for the sorted samples xs over
// the span hi − lo > 0: Freedman & Diaconis (1981), width 2·IQR·n^(−1/3),
// or √n when the IQR is zero, within [minBins, maxBins].
func binCount(xs []float64, span float64) int {
	n := float64(len(xs))
	k := math.Ceil(math.Sqrt(n))
	if iqr := percentile(xs, 75) - percentile(xs, 25); iqr > 0 {
		k = math.Ceil(span / (2 * iqr * math.Cbrt(1/n)))
	}
	return int(math.Min(math.Max(k, minBins), maxBins))
}

// percentName returns "P95", "P99.73".
func percentName(p float64) string {
	return "P" + strconv.FormatFloat(p, 'f', -1, 64)
}

// WriteSVG writes the histogram as an SVG document to w. It returns an
// *InputError for invalid input and otherwise only w's error. The samples
// are not modified.
func (h Histogram) WriteSVG(w io.Writer) error {
	if err := h.validate(); err != nil {
		return err
	}
	xs := slices.Clone(h.Samples)
	slices.Sort(xs)
	lo, hi, counts := h.bin(xs)
	nb := len(counts)
	top := slices.Max(counts)
	ymax := float64(top) * (1 + headroom)
	ystep := math.Max(1, niceStep(ymax, 5))

	var s scene
	px := func(v float64) float64 { return histWidth * (v - lo) / (hi - lo) }
	py := func(c float64) float64 { return histHeight * (1 - c/ymax) }
	bw := histWidth / float64(nb)
	for i, c := range counts {
		if c == 0 {
			continue
		}
		b := rect{float64(i) * bw, py(float64(c)), bw, histHeight - py(float64(c)), "bin", `fill="#9db7cf" stroke="#2b5d8a" stroke-width="0.8"`}
		s.add(b)
		s.place.boxes = append(s.place.boxes, b.bounds())
	}
	unit := ""
	if h.Unit != "" {
		unit = ", " + h.Unit
	}
	q := h.Quantity
	if q == "" {
		q = "value"
	}
	s.xAxis(0, histWidth, histHeight, lo, hi, q+unit)
	s.yAxis(0, histHeight, 0, 0, ymax, ystep, "samples per bin")
	ps := h.Percentiles
	if ps == nil {
		ps = DefaultPercentiles
	}
	marks := make([]percentileMark, len(ps))
	for i, p := range ps {
		v := percentile(xs, p)
		marks[i] = percentileMark{x: px(v), label: percentName(p) + " = " + withUnit(sig(v), h.Unit)}
	}
	s.percentiles(marks)
	ext := s.extent()
	ny := ext.y1 + 4
	bins := "bins"
	if nb == 1 {
		bins = "bin"
	}
	notes := append([]string{fmt.Sprintf("%d samples in %d %s; percentiles by linear interpolation of the order statistics.", len(xs), nb, bins)}, h.Notes...)
	for _, n := range notes {
		ny += noteSize * 1.4
		s.add(text{ext.x0, ny, noteSize, "start", "note", `fill="` + mutedColour + `"`, n})
	}
	if h.Title != "" {
		s.add(text{ext.x0, ext.y0 - 12, titleSize, "start", "title", `font-weight="bold" fill="` + inkColour + `"`, h.Title})
	}
	return s.finish(w, h.Title)
}

// bin returns the span [lo, hi] of the bins and the count of the sorted
// samples xs in each: h.Bins of them, or binCount's number (one when all
// the samples are equal).
func (h Histogram) bin(xs []float64) (lo, hi float64, counts []int) {
	lo, hi = xs[0], xs[len(xs)-1]
	if hi == lo {
		// One value: a single bin a tenth of its size wide (or 1 around 0).
		d := 0.05 * math.Abs(lo)
		if d == 0 {
			d = 0.5
		}
		lo, hi = lo-d, hi+d
	}
	nb := h.Bins
	if nb == 0 {
		nb = binCount(xs, hi-lo)
		if xs[0] == xs[len(xs)-1] {
			nb = 1
		}
	}
	counts = make([]int, nb)
	for _, v := range xs {
		b := int(float64(nb) * (v - lo) / (hi - lo))
		counts[min(max(b, 0), nb-1)]++
	}
	return lo, hi, counts
}

// percentileMark is a percentile's vertical line at x, px, and its label,
// placed at a level of the staircase in box b.
type percentileMark struct {
	x     float64
	label string
	level int
	b     box
}

// percentiles places the labels of the marks and draws them with their
// lines.
//
// Percentile labels go to the right of their lines, in a staircase:
// from the rightmost line leftwards, each label takes the lowest level
// where it is clear of the labels placed, above every level whose line
// it would reach across; each line runs up to its label. So no line
// crosses a label and no label needs a leader.
func (s *scene) percentiles(marks []percentileMark) {
	order := make([]int, len(marks))
	for i := range order {
		order[i] = i
	}
	slices.SortStableFunc(order, func(a, b int) int {
		switch {
		case marks[a].x > marks[b].x:
			return -1
		case marks[a].x < marks[b].x:
			return 1
		}
		return 0
	})
	lh := (ascent+descent)*fontSize + 2
	var done []int
	for _, i := range order {
		m := &marks[i]
		w := textWidth(m.label, fontSize) + 4
		for k := 0; ; k++ {
			y0 := 4 - float64(k)*(lh+2)
			b := box{m.x + 3, y0, m.x + 3 + w, y0 + lh}
			ok := s.place.free(b)
			for _, j := range done {
				if b.overlaps(marks[j].b) || (marks[j].x >= b.x0-2 && marks[j].x <= b.x1+2 && k <= marks[j].level) {
					ok = false
				}
			}
			if ok {
				m.level, m.b = k, b
				break
			}
		}
		done = append(done, i)
		s.place.labels = append(s.place.labels, m.b)
	}
	for _, m := range marks {
		s.add(line{m.x, histHeight, m.x, m.b.y0, "percentile", `stroke="#c8551b" stroke-width="1.4" stroke-dasharray="5 3"`},
			rect{m.b.x0, m.b.y0, m.b.w(), m.b.h(), "halo", `fill="#ffffff" fill-opacity="0.85" stroke="none"`},
			text{m.b.x0 + 2, m.b.y1 - 1 - descent*fontSize, fontSize, "start", "percentile-label", `fill="#8f3a10"`, m.label})
	}
}
