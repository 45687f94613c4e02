package drawing

import (
	"fmt"
	"io"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// Histogram writes the histogram of a Monte Carlo study's radial
// displacement of the point of interest to w, in µm, with the 50th,
// 95th, 99th and 99.73th percentiles marked. The study must have kept
// its samples (kinematic.StudyOptions.KeepSamples).
func Histogram(w io.Writer, res kinematic.StudyResult, opt *Options) error {
	o := opt.orDefault()
	if len(res.Points) == 0 {
		return fmt.Errorf("drawing: the study kept no samples (kinematic.StudyOptions.KeepSamples): %w", kinematic.ErrDegenerate)
	}
	samples := make([]float64, len(res.Points))
	for i, p := range res.Points {
		samples[i] = r3.Norm(p) * 1e6
	}
	h := draw.Histogram{
		Title:       o.title("Error at the " + o.pointName() + ": parts made to the drawing"),
		Quantity:    "displacement of the " + o.pointName(),
		Unit:        "µm",
		Samples:     samples,
		Percentiles: draw.DefaultPercentiles,
		Notes:       o.notes(),
	}
	return h.WriteSVG(w)
}
