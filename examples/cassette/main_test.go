package main

import (
	"bytes"
	"encoding/xml"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// TestRun runs the whole study on the built-in design and checks the
// report and the drawings.
func TestRun(t *testing.T) {
	dir := t.TempDir()
	var out bytes.Buffer
	if err := run([]string{"-out", dir, "-samples", "20000"}, nil, &out); err != nil {
		t.Fatal(err)
	}
	rep := out.String()
	for _, want := range []string{"1. Packaging", "2. Choosing the grooves", "3. Constraint", "4. Loads", "5. Stiffness",
		"6. Error budget", "7. Requirements", "8. Drawings", "Caution:", "Monte Carlo", "thermal +10 K", "friction seating"} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if m := regexp.MustCompile(`(?i)\bNaN\b|[+-]?Inf\b`).FindString(rep); m != "" {
		t.Errorf("report prints %q", m)
	}

	// Vertical balance of the seated case (statics, by hand): the six
	// flank normals of the 90° vees lean 45° from the horizontal, so
	// Σ fᵢ sin 45° = preload + weight = 40 N + 0.320 kg · 9.80665 m/s²,
	// Σ fᵢ = 61.006 N. The report prints each force to 0.01 N.
	sec := rep[strings.Index(rep, `case "seated":`):]
	sec = sec[:strings.Index(sec, `case "cable pull"`)]
	var sum float64
	for _, m := range regexp.MustCompile(`(?m)^\s+[ABC][+-]\s+([0-9.]+)`).FindAllStringSubmatch(sec, -1) {
		f, _ := strconv.ParseFloat(m[1], 64)
		sum += f
	}
	want := (40 + 0.320*9.80665) / math.Sin(math.Pi/4)
	if math.Abs(sum-want) > 6*0.005 {
		t.Errorf("seated forces sum to %.3f N, want %.3f N", sum, want)
	}

	for _, name := range []string{"plan.svg", "liftoff.svg", "histogram.svg", "scorecards.svg"} {
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			t.Fatal(err)
		}
		dec := xml.NewDecoder(bytes.NewReader(b))
		elems := 0
		for {
			tok, err := dec.Token()
			if err == io.EOF {
				break
			}
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			if _, ok := tok.(xml.StartElement); ok {
				elems++
			}
		}
		if elems < 20 {
			t.Errorf("%s: only %d elements", name, elems)
		}
	}
}

// TestRunErrors: a bad design on standard input is reported with its
// JSON path; bad flags name themselves.
func TestRunErrors(t *testing.T) {
	var out bytes.Buffer
	err := run([]string{"-out", "", "-"}, strings.NewReader(`{"format": "sixfold.design/1", "balls": 3}`), &out)
	if err == nil || !strings.Contains(err.Error(), "balls") {
		t.Errorf("bad design: %v", err)
	}
	if err := run([]string{"-samples", "0"}, nil, &out); err == nil || !strings.Contains(err.Error(), "-samples") {
		t.Errorf("-samples 0: %v", err)
	}
	if err := run([]string{"a.json", "b.json"}, nil, &out); err == nil {
		t.Error("two design files accepted")
	}
}

// TestPercentileColumns reads the report's radial percentile columns and
// checks them against the percentile definition that kinematic.Stats
// documents, the nearest rank: the p-th percentile of n sorted
// magnitudes is the ⌈p·n⌉-th smallest (Hyndman and Fan 1996, "Sample
// quantiles in statistical packages", The American Statistician 50(4),
// definition 1, the inverse of the empirical distribution function),
// applied here to the study's own samples. Worked by hand for n = 10:
// the median is the 5th smallest, and 95, 99 and 99.73 % are all the
// largest (⌈9.5⌉ = ⌈9.9⌉ = ⌈9.973⌉ = 10); for n = 200 the ranks are
// 100, 190, 198 and 200 (⌈199.46⌉).
func TestPercentileColumns(t *testing.T) {
	for _, tc := range []struct {
		n     int
		ranks [4]int
	}{
		{10, [4]int{5, 10, 10, 10}},
		{200, [4]int{100, 190, 198, 200}},
	} {
		var out bytes.Buffer
		st := &study{w: &out, source: "test", samples: tc.n, shockG: 5, deltaT: 10}
		if err := st.run(t.Context(), builtIn); err != nil {
			t.Fatal(err)
		}
		if st.res == nil || len(st.res.Points) != tc.n {
			t.Fatalf("n = %d: the study kept no samples", tc.n)
		}
		m := regexp.MustCompile(`radial: median ([0-9.]+) µm, 95 % ([0-9.]+) µm, 99 % ([0-9.]+) µm, 99.73 % ([0-9.]+) µm`).FindStringSubmatch(out.String())
		if m == nil {
			t.Fatalf("n = %d: no radial percentiles in the report", tc.n)
		}
		r := make([]float64, tc.n)
		for i, p := range st.res.Points {
			r[i] = math.Sqrt(p.X*p.X + p.Y*p.Y + p.Z*p.Z)
		}
		sort.Float64s(r)
		for k, rank := range tc.ranks {
			if want := strconv.FormatFloat(r[rank-1]*1e6, 'f', 2, 64); m[k+1] != want {
				t.Errorf("n = %d: column %d prints %s µm, want %s µm (the %d-th smallest of %d)", tc.n, k+1, m[k+1], want, rank, tc.n)
			}
		}
	}
}
