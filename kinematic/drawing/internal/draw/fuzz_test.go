package draw

import (
	"bytes"
	"errors"
	"math"
	"testing"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

// FuzzPlan draws plans built from arbitrary numbers: each group of five
// is a ball (x, y, radius), its value and the azimuth of its groove. The
// drawing must either be refused with an *InputError or pass every check
// of checkCommon: well-formed, nothing non-finite, everything inside the
// viewBox, no overlapping texts.
func FuzzPlan(f *testing.F) {
	f.Add(fuzzdata.Append(nil, -0.06, -0.035, 5e-3, 0.7, 0.3, 0.065, -0.03, 5e-3, 0.4, 2.1, 0.01, 0.055, 5e-3, 0.9, -1))
	f.Add(fuzzdata.Append(nil, 0, 0, 1, 1, 0, 1e-9, 0, 1e-12, 2, 1))
	f.Add(fuzzdata.Append(nil, 1e90, 0, 1, 0, 0, -1e90, 0, 1, 1, 0))
	f.Add(fuzzdata.Append(nil, 0, 0, 1e-300, 5, 0, 0, 0, 1e-300, 5, 0))
	f.Fuzz(func(t *testing.T, data []byte) {
		var p Plan
		for i, g := range fuzzdata.Floats(data, 5) {
			if i == 8 {
				break
			}
			c := Point{g[0], g[1]}
			p.Balls = append(p.Balls, Ball{Name: string(rune('A' + i)), Centre: c, Radius: g[2]})
			p.Values = append(p.Values, Value{Label: string(rune('a' + i)), At: c, Value: g[3]})
			p.Grooves = append(p.Grooves, Line{Label: "g", Through: c, Direction: Point{math.Cos(g[4]), math.Sin(g[4])}})
			p.Markers = append(p.Markers, Marker{Kind: MarkerKind(i % 3), At: Point{g[0] + g[2], g[1]}})
		}
		var b bytes.Buffer
		err := p.WriteSVG(&b)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) {
				t.Fatalf("error %v is not an *InputError", err)
			}
			return
		}
		checkCommon(t, b.Bytes())
	})
}
