package design

import (
	"errors"
	"strings"
	"testing"
)

// TestSpectrumSlopePaths: the spectrum's refusals point to entries the
// file has, by their JSON paths. A slope on the first breakpoint (a GEVS
// table's "20 Hz, +3 dB/octave") says to give it on points[1].slope, the
// segment from 20 Hz to 50 Hz; a breakpoint with no "asd" key whose
// segment has no slope is referred to as the breakpoint, not by the asd
// key the file does not have.
func TestSpectrumSlopePaths(t *testing.T) {
	for _, tc := range []struct {
		name        string
		points      []any
		path, other string
		want        string
	}{
		{"first slope", []any{
			map[string]any{"frequency": "20 Hz", "slope": "3 dB/octave"},
			map[string]any{"frequency": "50 Hz", "asd": "0.16 g^2/Hz"},
			map[string]any{"frequency": "800 Hz", "asd": "0.16 g^2/Hz"},
			map[string]any{"frequency": "2000 Hz", "slope": "-3 dB/octave"},
		}, "vibration.spectrum.points[0].slope", "vibration.spectrum.points[1].slope",
			"give it on the next breakpoint (the segment from 20 Hz to 50 Hz); see vibration.spectrum.points[1].slope"},
		{"no level, no slope", []any{
			map[string]any{"frequency": "20 Hz", "asd": "0.01 g^2/Hz"},
			map[string]any{"frequency": "50 Hz", "asd": "0.16 g^2/Hz"},
			map[string]any{"frequency": "800 Hz", "asd": "0.16 g^2/Hz"},
			map[string]any{"frequency": "2000 Hz"},
		}, "vibration.spectrum.points[3].slope", "vibration.spectrum.points[3]",
			"has no level (ASD 0)"},
	} {
		_, err := Parse([]byte(edit(t, set("vibration", map[string]any{
			"spectrum": map[string]any{"points": tc.points},
		}))))
		var e *Error
		if !errors.As(err, &e) || e.Path != tc.path || e.Other != tc.other || !errors.Is(err, ErrRange) ||
			!strings.Contains(err.Error(), tc.want) || strings.Contains(err.Error(), "Points") || strings.Contains(err.Error(), ".asd") {
			t.Errorf("%s: %v; want %s, see %s, with %q", tc.name, err, tc.path, tc.other, tc.want)
		}
	}
}
