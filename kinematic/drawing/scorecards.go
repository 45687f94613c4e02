package drawing

import (
	"fmt"
	"io"
	"math"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing/internal/draw"
)

// Scorecards writes the design figures of candidate layouts side by side
// to w, each figure relative to its best candidate so that taller is
// better: the error at the point of interest (µm/µm), the stiffness
// there (N/µm), the first natural frequency (Hz), the shock level (g),
// the thermal drift (µm/K) and the weakest Maxwell index at the contact
// points (Scorecard.WeakestContactIndex). names[i] names
// cards[i]. Every figure drawn must be finite and greater than zero (a
// scorecard of a payload without inertia has no frequency): the error
// names the card's field, for example "cards[1].FirstFrequency".
func Scorecards(w io.Writer, names []string, cards []kinematic.Scorecard, opt *Options) error {
	o := opt.orDefault()
	if len(names) != len(cards) {
		return fmt.Errorf("drawing: %d names for %d scorecards: %w", len(names), len(cards), kinematic.ErrDegenerate)
	}
	bars := draw.Bars{
		Title:      o.title("Candidate layouts: design figures (each relative to its best; taller is better)"),
		Candidates: append([]string(nil), names...),
		Notes:      o.notes(),
	}
	for _, f := range []struct {
		name, unit, field string
		lower             bool
		value             func(k *kinematic.Scorecard) float64
	}{
		{"error at " + o.pointName(), "µm/µm", "Amplification", true, func(k *kinematic.Scorecard) float64 { return k.Amplification }},
		{"stiffness", "N/µm", "Stiffness", false, func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 }},
		{"first frequency", "Hz", "FirstFrequency", false, func(k *kinematic.Scorecard) float64 { return k.FirstFrequency }},
		{"shock level", "g", "ShockLevel", false, func(k *kinematic.Scorecard) float64 { return k.ShockLevel / kinematic.StandardGravity }},
		{"thermal drift", "µm/K", "Drift", true, func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 }},
		{"Maxwell index at the contact points", "", "WeakestContactIndex", false, func(k *kinematic.Scorecard) float64 { return k.WeakestContactIndex }},
	} {
		fig := draw.Figure{Name: f.name, Unit: f.unit, LowerIsBetter: f.lower}
		for i := range cards {
			v := f.value(&cards[i])
			if !(v > 0) || math.IsInf(v, 0) {
				return fmt.Errorf("drawing: cards[%d].%s: %w: %g, want a finite figure > 0 (figures are drawn relative to the best)", i, f.field, kinematic.ErrRange, v)
			}
			fig.Values = append(fig.Values, v)
		}
		bars.Figures = append(bars.Figures, fig)
	}
	return bars.WriteSVG(w)
}
