package design

import (
	"context"
	"fmt"
	"strings"
	"testing"
)

// BenchmarkParse reads design files of three sizes: the small base
// design, the demo cassette (30 tolerances), and one near the reader's
// bounds: 256 load cases of 40 applied loads each (about 120 000 JSON
// values, 1.4 MB).
func BenchmarkParse(b *testing.B) {
	load := `{"force": ["1 N", "-2 N", "0.5 N"], "point": ["10 mm", "20 mm", "30 mm"]}`
	var cases []string
	for i := range 256 {
		cases = append(cases, fmt.Sprintf(`{"name": "c%d", "gravity": [0, 0, "-1 g"], "applied": [%s]}`, i, strings.TrimSuffix(strings.Repeat(load+",", 40), ",")))
	}
	big := strings.Replace(baseJSON, `"cases": [{"name": "seated", "gravity": [0, 0, "-1 g"]}]`, `"cases": [`+strings.Join(cases, ",")+`]`, 1)
	for _, bc := range []struct {
		name string
		file []byte
	}{
		{"base", []byte(baseJSON)},
		{"cassette", readFile(b, "testdata/cassette.json")},
		{"cases-256x40", []byte(big)},
	} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			b.SetBytes(int64(len(bc.file)))
			for b.Loop() {
				if _, err := Parse(bc.file); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkEvaluate evaluates the demo cassette with its Monte Carlo
// study of 20 000 samples, and without the study.
func BenchmarkEvaluate(b *testing.B) {
	for _, samples := range []int{0, 20000} {
		b.Run(fmt.Sprintf("samples-%d", samples), func(b *testing.B) {
			d, err := Parse(readFile(b, "testdata/cassette.json"))
			if err != nil {
				b.Fatal(err)
			}
			if samples == 0 {
				d.MonteCarlo, d.Requirements.MaxStudy = nil, 0
			}
			b.ReportAllocs()
			for b.Loop() {
				if _, err := d.Evaluate(context.Background()); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
