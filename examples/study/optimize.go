package main

import (
	"bytes"
	"context"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// objectiveText says in words what each objective improves.
func objectiveText(o kinematic.Objective, point string) string {
	switch o {
	case kinematic.MinDrift:
		return "the least thermal drift of the " + point
	case kinematic.MinCompliance:
		return "the least compliance at the " + point
	case kinematic.MaxShockLevel:
		return "the highest shock level with every contact closed"
	case kinematic.MaxFirstFrequency:
		return "the highest first natural frequency"
	case kinematic.MaxContactIndex:
		return "the highest weakest Maxwell index at the contact points (a screen, not a design figure)"
	case kinematic.MaxCentreIndex:
		return "the highest weakest Maxwell index at the ball centres (a screen, not a design figure)"
	}
	return "the least worst-case displacement of the " + point + " per µm of seat error"
}

// optimise runs the optimiser with the file's settings, prints the
// figures before and after and the optimised design's verdicts, and
// writes the optimised design.
func (s *study) optimise(ctx context.Context, n int) error {
	s.section(n, "Optimisation (asked for with -optimize)")
	o, err := s.b.OptimizeOptions()
	if err != nil {
		return err
	}
	s.printf("Objective: %s.\n", objectiveText(o.Objective, s.point))
	var screens []string
	if o.MinCentreIndex > 0 {
		screens = append(screens, fmt.Sprintf("Maxwell index at every ball centre ≥ %.3g", o.MinCentreIndex))
	}
	if o.MinContactIndex > 0 {
		screens = append(screens, fmt.Sprintf("Maxwell index at every contact point ≥ %.3g", o.MinContactIndex))
	}
	if o.MaxPressureRatio > 0 {
		screens = append(screens, fmt.Sprintf("peak pressure ≤ %.3g of the allowable", o.MaxPressureRatio))
	}
	mc := o.MaxCondition
	if mc == 0 {
		mc = kinematic.DesignCondition
	}
	screens = append(screens, fmt.Sprintf("condition number ≤ %.3g", mc))
	s.printf("Held to: %s.\n", strings.Join(screens, "; "))
	c := s.b.Coupling()
	for i, w := range o.Windows {
		if w.Max-w.Min >= math.Pi {
			continue
		}
		s.printf("groove %s: azimuth allowed from %.1f° to %.1f° (from the frame's x axis about up)\n", c.Pairs[i].Name, w.Min/deg, w.Max/deg)
	}
	if s.d.Packaging != nil {
		for _, k := range s.d.Packaging.KeepOuts {
			name := k.Name
			if name == "" {
				name = "keep-out"
			}
			reach := "any distance"
			if k.Reach > 0 {
				reach = fmt.Sprintf("balls within %.0f mm", k.Reach*1e3)
			}
			s.printf("keep-out %q at %s: grooves of %s stay %.0f° off it\n", name, mm(k.At), reach, k.Clearance/deg)
		}
	}
	if len(o.HalfAngles) > 0 {
		var hs []string
		for _, h := range o.HalfAngles {
			hs = append(hs, fmt.Sprintf("%.1f°", h/deg))
		}
		s.printf("groove half-angles chosen from: %s\n", strings.Join(hs, ", "))
	}
	best, nd, err := s.b.Optimize()
	if err != nil {
		return err
	}
	s.opt = &best
	cols := []string{"as written"}
	cards := []kinematic.Scorecard{best.Start}
	if best.HasBisector {
		name := "bisectors"
		if !best.BisectorFeasible {
			name = "bisectors*"
		}
		cols, cards = append(cols, name), append(cards, best.Bisector)
	}
	cols, cards = append(cols, "optimised"), append(cards, best.Score)
	s.figures(cols, cards)
	if best.HasBisector && !best.BisectorFeasible {
		s.printf("(* the grooves on the bisectors of the ball triangle break a window or a screen)\n")
	}
	s.printf("Optimised layout:\n")
	for _, p := range best.Coupling.Pairs {
		s.printf("  %-6s %-32s %s\n", p.Name, mm(p.Ball.Centre), seatText(p.Seat))
	}
	if len(best.Binding) > 0 {
		s.printf("Held back by: %s\n", strings.Join(bindingText(best.Binding, c), "; "))
	}
	s.printf("Search: %s\n", searchText(best.Status, best.Evaluations))

	var buf bytes.Buffer
	if err := nd.Write(&buf); err != nil {
		return err
	}
	if dir := filepath.Dir(s.cfg.optimized); dir != "" {
		if err := os.MkdirAll(dir, 0o755); err != nil {
			return err
		}
	}
	if err := os.WriteFile(s.cfg.optimized, buf.Bytes(), 0o644); err != nil {
		return err
	}
	s.printf("wrote the optimised design to %s (the input is unchanged)\n", s.cfg.optimized)
	if s.optimized, err = nd.Build(); err != nil {
		return err
	}
	ev, err := s.optimized.Evaluate(ctx)
	if err != nil {
		return err
	}
	s.optEv = ev
	s.printf("\nRequirements of the optimised design (for information; the exit status is the design as written):\n")
	vs := ev.Verdicts()
	for _, v := range vs {
		s.printf("  %s\n", v)
	}
	if len(vs) > 0 && vs.Err() == nil {
		s.printf("  every requirement is met\n")
	}
	return nil
}

// figures prints the design figures of layouts side by side.
func (s *study) figures(cols []string, cards []kinematic.Scorecard) {
	s.printf("%-40s", "figure (better)")
	for _, c := range cols {
		s.printf(" %12s", c)
	}
	s.printf("\n")
	row := func(name string, need kinematic.Figure, f func(k *kinematic.Scorecard) float64, format string) {
		s.printf("%-40s", name)
		for i := range cards {
			if need != 0 && cards[i].Unavailable.Has(need) {
				s.printf(" %12s", "n/a")
				continue
			}
			v := f(&cards[i])
			if math.IsNaN(v) || math.IsInf(v, 0) {
				s.printf(" %12s", "n/a")
				continue
			}
			s.printf(" "+format, v)
		}
		s.printf("\n")
	}
	row("error at "+s.point+", µm/µm (lower)", 0, func(k *kinematic.Scorecard) float64 { return k.Amplification }, "%12.3f")
	row("  along the axis, µm/µm (lower)", kinematic.FigureAxisAmplification, func(k *kinematic.Scorecard) float64 { return k.AxisAmplification }, "%12.3f")
	row("tilt, µrad/µm (lower)", 0, func(k *kinematic.Scorecard) float64 { return k.Tilt }, "%12.1f")
	row("stiffness at "+s.point+", N/µm (higher)", kinematic.FigureStiffness, func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 }, "%12.2f")
	row("first frequency, Hz (higher)", kinematic.FigureFirstFrequency, func(k *kinematic.Scorecard) float64 { return k.FirstFrequency }, "%12.0f")
	row("shock level, g (higher)", 0, func(k *kinematic.Scorecard) float64 { return k.ShockLevel / kinematic.StandardGravity }, "%12.2f")
	row("thermal drift, µm/K (lower)", kinematic.FigureDrift, func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 }, "%12.3f")
	row("Maxwell index, ball centres (higher)", 0, func(k *kinematic.Scorecard) float64 { return k.WeakestCentreIndex }, "%12.4f")
	row("Maxwell index, contact points (higher)", 0, func(k *kinematic.Scorecard) float64 { return k.WeakestContactIndex }, "%12.4f")
	row("condition number, 1 = ideal (lower)", 0, func(k *kinematic.Scorecard) float64 { return k.Condition }, "%12.2f")
}

// bindingText says which constraints hold the optimum back, in the
// design's words: kinematic.Optimum.Binding names them by pair index.
func bindingText(binding []string, c kinematic.Coupling) []string {
	out := make([]string, len(binding))
	for k, b := range binding {
		out[k] = b
		var i int
		var end string
		switch {
		case scan(b, "Windows[%d].%s", &i, &end) && i < len(c.Pairs):
			out[k] = fmt.Sprintf("the %s edge of groove %s's window", map[string]string{"Min": "lower", "Max": "upper"}[end], c.Pairs[i].Name)
		case scan(b, "Regions[%d]", &i) && i < len(c.Pairs):
			out[k] = fmt.Sprintf("the edge of ball %s's region", c.Pairs[i].Name)
		case b == "MinCentreIndex":
			out[k] = "the floor on the Maxwell index at the ball centres"
		case b == "MinContactIndex":
			out[k] = "the floor on the Maxwell index at the contact points"
		case b == "MaxPressureRatio":
			out[k] = "the ceiling on the pressure ratio"
		case b == "MaxCondition":
			out[k] = "the ceiling on the condition number"
		}
	}
	return out
}

// scan reports whether s matches format completely.
func scan(s, format string, a ...any) bool {
	n, err := fmt.Sscanf(s, format, a...)
	return err == nil && n == len(a)
}

// searchText says in plain words how the optimiser's search ended, after
// n layouts evaluated (kinematic.Status, without its Go name).
func searchText(st kinematic.Status, n int) string {
	switch st {
	case kinematic.Converged:
		return fmt.Sprintf("converged after %d layouts evaluated: the local search from the best layout found settled, and no constraint binds.", n)
	case kinematic.Constrained:
		return fmt.Sprintf("ended on a constraint after %d layouts evaluated: the optimum sits on the limit named in \"Held back by\", and relaxing it would improve the objective.", n)
	case kinematic.EvaluationLimit:
		return fmt.Sprintf("stopped at its evaluation budget after %d layouts evaluated, before the local search converged: the layout above is the best one seen, not a converged optimum.", n)
	}
	return fmt.Sprintf("ended after %d layouts evaluated (status %d).", n, int(st))
}
