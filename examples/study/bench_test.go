package main

import (
	"context"
	"io"
	"testing"
)

// BenchmarkCassette times the whole study of the cassette design file:
// reading, the evaluation with its 100 000-sample Monte Carlo study (run
// twice: once in the evaluation, once keeping the samples for the
// histogram), the report and the three drawings. Run it on one core
// with -cpu 1.
func BenchmarkCassette(b *testing.B) {
	dir := b.TempDir()
	b.ReportAllocs()
	for b.Loop() {
		if code := run(context.Background(), []string{"-out", dir, cassette}, nil, io.Discard, io.Discard); code != exitPass {
			b.Fatalf("exit status %d", code)
		}
	}
}
