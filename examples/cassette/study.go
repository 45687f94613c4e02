package main

import (
	"context"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

const (
	deg = math.Pi / 180
	g0  = kinematic.StandardGravity
)

// Obstacles on the bench that a groove must not point at (demo scenario):
// a groove whose line passes within keepOut of the direction from its
// ball to an obstacle closer than reach would run into it.
var obstacles = []kinematic.KeepOut{
	{Name: "cable pass-through", At: r3.Vec{X: -0.015, Y: 0.040}, Reach: reach, Clearance: keepOut},
	{Name: "coolant port", At: r3.Vec{X: 0.040, Y: 0.025}, Reach: reach, Clearance: keepOut},
}

const (
	keepOut = 30 * deg
	reach   = 0.070 // m
)

// study is one run of the report.
type study struct {
	w       io.Writer
	source  string
	samples int
	shockG  float64
	deltaT  float64
	outDir  string

	// res is the Monte Carlo study of the chosen layout, once run, with
	// its samples.
	res *kinematic.StudyResult
}

// candidate is one layout compared in the report.
type candidate struct {
	name string
	c    kinematic.Coupling
	card kinematic.Scorecard
}

func (s *study) printf(format string, a ...any) { fmt.Fprintf(s.w, format, a...) }

func (s *study) section(title string) {
	s.printf("\n%s\n%s\n", title, strings.Repeat("-", len([]rune(title))))
}

func (s *study) run(ctx context.Context, src []byte) error {
	d, err := design.Parse(src)
	if err != nil {
		return err
	}
	drawn, err := d.Build()
	if err != nil {
		return err
	}
	c0 := drawn.Coupling()
	s.printf("%s\n%s\n", d.Name, strings.Repeat("=", len([]rune(d.Name))))
	s.printf("design: %s\n", s.source)
	s.summary(d, c0)

	// 1. Candidates and the choice of grooves.
	scen := drawn.Scenario()
	wins, err := s.windows(c0)
	if err != nil {
		return err
	}
	floor := d.Requirements.MinCentreIndex
	if floor == 0 {
		floor = 0.9
	}
	opt := &kinematic.OptimizeOptions{Objective: kinematic.MinAmplification, Windows: wins, MinCentreIndex: floor, MaxPressureRatio: d.Requirements.MaxPressureRatio}
	best, err := kinematic.Optimize(c0, scen, opt)
	if err != nil {
		return fmt.Errorf("choosing the grooves: %w", err)
	}
	mx, err := kinematic.Optimize(c0, scen, &kinematic.OptimizeOptions{Objective: kinematic.MaxContactIndex, Windows: wins})
	if err != nil {
		return fmt.Errorf("the Maxwell optimum: %w", err)
	}
	cands := []candidate{{"as drawn", c0, best.Start}, {"max Maxwell", mx.Coupling, mx.Score}, {"chosen", best.Coupling, best.Score}}
	if best.HasBisector && math.Abs(best.Bisector.Amplification-best.Start.Amplification) > 1e-3*best.Start.Amplification {
		// The bisector layout, when the drawing is not already on it.
		if bis, err := bisectorsOf(c0); err == nil {
			cands = append([]candidate{{"bisectors", bis, best.Bisector}}, cands...)
		}
	}
	s.choice(best, cands, floor)

	// 2. The chosen layout, evaluated.
	chosen, err := d.WithCoupling(best.Coupling)
	if err != nil {
		return err
	}
	if chosen.MonteCarlo != nil {
		chosen.MonteCarlo.Samples = s.samples
	}
	b, err := chosen.Build()
	if err != nil {
		return err
	}
	ev, err := b.Evaluate(ctx)
	if err != nil {
		return err
	}
	s.constraint(ev)
	if err := s.loads(chosen, b.Model(), ev); err != nil {
		return err
	}
	s.vibration(ev)
	res, err := s.budget(ctx, chosen, b.Assembly(), b.Model(), ev)
	if err != nil {
		return err
	}
	s.requirements(ev)
	if s.outDir != "" {
		if err := s.drawings(b, ev, cands, res); err != nil {
			return err
		}
	}
	s.caution()
	return nil
}

func (s *study) summary(d *design.Design, c kinematic.Coupling) {
	s.printf("\nBalls on the moving body and their seats on the base:\n")
	s.printf("  %-4s %-22s %-10s %-26s %s\n", "ball", "centre (mm)", "radius", "ball material", "seat")
	for i, p := range c.Pairs {
		b := p.Ball
		seat := fmt.Sprintf("%T", p.Seat)
		seat = strings.TrimPrefix(seat, "kinematic.")
		if v, ok := p.Seat.(kinematic.Vee); ok {
			seat = fmt.Sprintf("vee, %.0f° included, %s", 2*(90-v.HalfAngle/deg), v.Material.Name)
		}
		s.printf("  %-4s (%6.1f, %6.1f, %5.1f) %6.2f mm  %-26s %s\n", d.Balls[i].Name, b.Centre.X*1e3, b.Centre.Y*1e3, b.Centre.Z*1e3, b.Radius*1e3, b.Material.Name, seat)
	}
	for _, p := range d.Preloads {
		s.printf("Preload %q: %.1f N along (%.2f, %.2f, %.2f) through (%.1f, %.1f, %.1f) mm, rate %.2f N/mm\n",
			p.Name, p.Force, p.Direction.X, p.Direction.Y, p.Direction.Z, p.Point.X*1e3, p.Point.Y*1e3, p.Point.Z*1e3, p.Rate*1e-3)
	}
	s.printf("Payload: %.0f g, centre of mass (%.1f, %.1f, %.1f) mm\n", d.Payload.Mass*1e3, d.Payload.Centre.X*1e3, d.Payload.Centre.Y*1e3, d.Payload.Centre.Z*1e3)
	s.printf("Point of interest (detector centre): (%.1f, %.1f, %.1f) mm, axis (%.0f, %.0f, %.0f)\n",
		d.Point.X*1e3, d.Point.Y*1e3, d.Point.Z*1e3, d.Axis.X, d.Axis.Y, d.Axis.Z)
}

// windows prints where the obstacles lie from each groove's ball and
// returns the groove windows they leave (kinematic.KeepOutWindows).
func (s *study) windows(c kinematic.Coupling) ([]kinematic.Window, error) {
	s.section("1. Packaging: groove windows")
	wins, err := kinematic.KeepOutWindows(c, obstacles)
	if err != nil {
		return nil, fmt.Errorf("groove windows: %w", err)
	}
	for i, p := range c.Pairs {
		if _, ok := p.Seat.(kinematic.Vee); !ok {
			continue
		}
		near := false
		for _, o := range obstacles {
			// The figures printed: the obstacle seen from the ball in
			// plan (the bench's seats have Up along z).
			d := r3.Sub(o.At, p.Ball.Centre)
			d.Z = 0
			if r3.Norm(d) > o.Reach {
				continue
			}
			near = true
			s.printf("groove %s: the %s lies %.0f mm away at %.0f°; keep at least %.0f° off that line\n",
				p.Name, o.Name, r3.Norm(d)*1e3, math.Atan2(d.Y, d.X)/deg, o.Clearance/deg)
		}
		if near {
			s.printf("groove %s: allowed from %.1f° to %.1f° (frame azimuth)\n", p.Name, wins[i].Min/deg, wins[i].Max/deg)
		}
	}
	return wins, nil
}

// bisectorsOf returns the coupling with its three vees on the bisectors.
func bisectorsOf(c kinematic.Coupling) (kinematic.Coupling, error) {
	var balls [3]kinematic.Ball
	var vees [3]kinematic.Vee
	for i, p := range c.Pairs {
		v, ok := p.Seat.(kinematic.Vee)
		if !ok || i > 2 {
			return kinematic.Coupling{}, fmt.Errorf("not three vees")
		}
		balls[i], vees[i] = p.Ball, v
	}
	return kinematic.BisectorVees(balls, vees)
}

func (s *study) choice(best kinematic.Optimum, cands []candidate, floor float64) {
	s.section("2. Choosing the grooves by the error at the detector")
	s.printf("Objective: the least worst-case displacement of the detector centre per µm of seat error,\n")
	s.printf("inside the windows, with the Maxwell index at every ball centre at least %.2f (a screen, not the aim)\n", floor)
	s.printf("and a condition number of at most %.0f (the optimiser's default screen).\n", float64(kinematic.DesignCondition))
	s.printf("%-32s", "figure")
	for _, c := range cands {
		s.printf(" %12s", c.name)
	}
	s.printf("\n")
	row := func(name string, f func(k *kinematic.Scorecard) float64, format string) {
		s.printf("%-32s", name)
		for _, c := range cands {
			s.printf(" "+format, f(&c.card))
		}
		s.printf("\n")
	}
	row("error at detector, µm/µm", func(k *kinematic.Scorecard) float64 { return k.Amplification }, "%12.3f")
	row("error along axis, µm/µm", func(k *kinematic.Scorecard) float64 { return k.AxisAmplification }, "%12.3f")
	row("tilt, µrad/µm", func(k *kinematic.Scorecard) float64 { return k.Tilt }, "%12.1f")
	row("stiffness at detector, N/µm", func(k *kinematic.Scorecard) float64 { return k.Stiffness * 1e-6 }, "%12.2f")
	row("first frequency, Hz", func(k *kinematic.Scorecard) float64 { return k.FirstFrequency }, "%12.0f")
	row("shock level, g", func(k *kinematic.Scorecard) float64 { return k.ShockLevel / g0 }, "%12.2f")
	row("thermal drift, µm/K", func(k *kinematic.Scorecard) float64 { return k.Drift * 1e6 }, "%12.3f")
	row("Maxwell index, ball centre", func(k *kinematic.Scorecard) float64 { return k.WeakestCentreIndex }, "%12.4f")
	row("Maxwell index, contact point", func(k *kinematic.Scorecard) float64 { return k.WeakestContactIndex }, "%12.4f")
	row("condition number (1 = ideal)", func(k *kinematic.Scorecard) float64 { return k.Condition }, "%12.2f")
	s.printf("Chosen grooves (frame azimuth):")
	for _, p := range best.Coupling.Pairs {
		if v, ok := p.Seat.(kinematic.Vee); ok {
			s.printf("  %s %.1f°", p.Name, math.Atan2(v.Direction.Y, v.Direction.X)/deg)
		}
	}
	s.printf("\n")
	if len(best.Binding) > 0 {
		s.printf("Held back by: %s\n", strings.Join(best.Binding, ", "))
	}
	s.printf("(Each Maxwell row is the weakest contact's index, 0-1.)\n")
	s.printf("The layout with the highest Maxwell index at the contact points is not the one that keeps the detector still:\n")
	s.printf("the Maxwell index is nearly flat among sensible layouts and screens out the poor ones only.\n")
	s.printf("(%d layouts evaluated.)\n", best.Evaluations)
}

func (s *study) constraint(ev design.Evaluation) {
	s.section("3. Constraint and stability of the chosen layout")
	an := ev.Analysis
	s.printf("rank %d of 6, %d degrees of freedom left, %d redundant contacts; condition number %.2f\n",
		an.Rank, an.DOF, len(an.Redundant), an.Condition)
	s.printf("%-8s %16s %16s\n", "contact", "index at point", "index at centre")
	for i, m := range ev.Stability.Contacts {
		mark := ""
		if i == ev.Weakest {
			mark = "  <- weakest"
		}
		s.printf("%-8s %16.4f %16.4f%s\n", m.Label, m.Index, m.CentreIndex, mark)
	}
	s.printf("(Maxwell indices are dimensionless, 0 to 1: 1 when a freed motion lifts its contact straight off.)\n")
}

func (s *study) loads(d *design.Design, m *kinematic.Model, ev design.Evaluation) error {
	s.section("4. Loads, Hertz stresses and the preload window")
	for _, st := range ev.Cases {
		s.printf("case %q:\n", st.Case)
		s.printf("  %-8s %10s %12s %14s %12s\n", "contact", "force, N", "a, µm", "p0, MPa", "p0/allowable")
		for _, cl := range st.Contacts {
			ratio := "no allowable"
			if cl.Allowable > 0 {
				ratio = fmt.Sprintf("%.3f", cl.PressureRatio)
			}
			s.printf("  %-8s %10.2f %12.1f %14.0f %12s\n", cl.Label, cl.Force, cl.Hertz.SemiMajor*1e6, cl.Hertz.PeakPressure/1e6, ratio)
		}
		if len(st.Tensile) > 0 {
			s.printf("  in tension (the part would lift): %s\n", strings.Join(st.Tensile, ", "))
		}
	}
	minF := d.Requirements.MinContactForce
	if minF == 0 {
		minF = 2
	}
	sz, err := m.SizePreload(d.Cases, minF)
	if err != nil {
		s.printf("preload window: %v\n", err)
	} else {
		total := 0.0
		for _, p := range d.Preloads {
			total += p.Force
		}
		s.printf("preload window (every contact ≥ %.1f N in every case, every p0 ≤ allowable): %.1f N to %s, as given %.1f N\n",
			minF, sz.MinScale*total, newtons(sz.MaxScale*total), total)
	}
	base := d.Cases[0]
	sh, err := m.Shock(base, s.shockG*g0)
	if err != nil {
		return err
	}
	least, at := math.Inf(1), ""
	for _, c := range sh.Contacts {
		if c.Least < least {
			least, at = c.Least, c.Label
		}
	}
	verdict := "every contact stays closed"
	if least <= 0 {
		verdict = "a contact opens: the cassette would rattle in its seats"
	}
	s.printf("transport shock of %.1f g in the worst direction on case %q: least force %.2f N at %s; %s\n",
		s.shockG, base.Name, least, at, verdict)
	s.printf("the first contact unloads at %.2f g (%s)\n", sh.Unload/g0, strings.Join(sh.First, ", "))
	if ev.Homing != nil {
		st := ev.Homing
		ok := "slides home"
		if !st.Home {
			ok = "does NOT slide home"
		}
		s.printf("friction seating at μ = %.2f under case %q: the cassette %s; it still does up to μ = %.3f\n", st.Mu, ev.HomingCase, ok, st.MaxMu)
	}
	return nil
}

func newtons(f float64) string {
	if math.IsInf(f, 1) {
		return "no upper limit (no allowable on file)"
	}
	return fmt.Sprintf("%.0f N", f)
}

func (s *study) vibration(ev design.Evaluation) {
	s.section("5. Stiffness and natural frequencies")
	if ev.Compliance != nil {
		if c, err := ev.Compliance.Along(r3.Vec{Z: 1}); err == nil {
			s.printf("compliance of the detector centre along the axis: %.4f µm/N (%.1f N/µm)\n", c*1e6, 1/c*1e-6)
		}
	}
	if ev.Modes != nil {
		s.printf("natural frequencies of the cassette on its coupling:")
		for _, md := range ev.Modes {
			s.printf(" %.0f", md.Frequency)
		}
		s.printf(" Hz\n")
	}
	for _, n := range ev.Notes {
		s.printf("note: %s\n", n)
	}
}

func (s *study) budget(ctx context.Context, d *design.Design, a *kinematic.Assembly, m *kinematic.Model, ev design.Evaluation) (*kinematic.StudyResult, error) {
	s.section("6. Error budget at the detector")
	if ev.Budget != nil {
		b := ev.Budget
		s.printf("(tolerance: ± the uniform half-width, or ±3σ of a normal one; effect: its displacement of the detector centre)\n")
		s.printf("%-20s %14s %14s %10s\n", "dimension", "tolerance", "effect, µm", "share")
		for k, c := range b.Contributors {
			if k == 10 {
				s.printf("  (%d smaller contributors)\n", len(b.Contributors)-k)
				break
			}
			unit, v := "µm", c.Limit*1e6
			if strings.Contains(c.Dimension, "Angle") || strings.Contains(c.Dimension, "Turn") || strings.Contains(c.Dimension, "Tilt") {
				unit, v = "arcmin", c.Limit/deg*60
			}
			s.printf("%-20s ±%9.2f %-6s %10.3f %9.1f%%\n", c.Dimension, v, unit, c.Effect*1e6, 100*c.Share)
		}
		s.printf("worst case %.2f µm, RSS %.2f µm, standard deviation %.2f µm (first order)\n", b.Worst*1e6, b.RSS*1e6, b.Sigma*1e6)
	}
	var study *kinematic.StudyResult
	if len(d.Tolerances) > 0 {
		seed := uint64(1)
		if d.MonteCarlo != nil {
			seed = d.MonteCarlo.Seed
		}
		res, err := a.Study(ctx, d.Point, d.Tolerances, &kinematic.StudyOptions{Samples: s.samples, Seed: seed, KeepSamples: true})
		if err != nil {
			return nil, err
		}
		study = &res
		s.res = study
		s.printf("Monte Carlo, %d parts made to the drawing (interchangeability): displacement of the detector centre\n", res.Samples)
		s.printf("  radial: median %.2f µm, 95 %% %.2f µm, 99 %% %.2f µm, 99.73 %% %.2f µm\n", res.Radial.P50*1e6, res.Radial.P95*1e6, res.Radial.P99*1e6, res.Radial.P9973*1e6)
		s.printf("  standard deviation along x %.2f µm, y %.2f µm, z %.2f µm; tilt 99 %% %.1f µrad\n", res.X.StdDev*1e6, res.Y.StdDev*1e6, res.Z.StdDev*1e6, res.Tilt.P99*1e6)
	}
	if d.Thermal != nil {
		for _, dt := range []float64{s.deltaT, -s.deltaT} {
			th := *d.Thermal
			th.DeltaT = dt
			dr, err := a.Drift(th, d.Point)
			if err != nil {
				return nil, err
			}
			s.printf("thermal %+.0f K: the detector centre moves (%.2f, %.2f, %.2f) µm relative to the base exactly (first order (%.2f, %.2f, %.2f) µm)\n",
				dt, dr.Relative.X*1e6, dr.Relative.Y*1e6, dr.Relative.Z*1e6, dr.RelativeLinear.X*1e6, dr.RelativeLinear.Y*1e6, dr.RelativeLinear.Z*1e6)
			s.printf("  in the frame, the base held at (%.1f, %.1f, %.1f) mm: (%.2f, %.2f, %.2f) µm\n",
				th.BaseRef.X*1e3, th.BaseRef.Y*1e3, th.BaseRef.Z*1e3, dr.World.X*1e6, dr.World.Y*1e6, dr.World.Z*1e6)
			if dt > 0 && dr.HasCentre {
				s.printf("  thermal centre at (%.1f, %.1f) mm, %.1f mm from the detector centre\n", dr.Centre.X*1e3, dr.Centre.Y*1e3, dr.Distance*1e3)
			}
		}
	}
	if d.Friction != nil {
		rep, err := m.Repeatability(d.Cases[0], d.Friction.Mu, d.Point)
		if err != nil {
			return nil, err
		}
		s.printf("friction at μ = %.2f (repeatability, the same cassette put back): about %.3f µm RSS, %.3f µm worst case (an estimate)\n",
			rep.Mu, rep.RSS*1e6, rep.Worst*1e6)
	}
	return study, nil
}

func (s *study) requirements(ev design.Evaluation) {
	s.section("7. Requirements")
	vs := ev.Verdicts()
	for _, v := range vs {
		s.printf("%s\n", v)
	}
	if err := vs.Err(); err != nil {
		s.printf("The design FAILS: %v\n", err)
	} else {
		s.printf("Every requirement is met.\n")
	}
}

func (s *study) caution() {
	s.printf("\nCaution: these are engineering estimates from idealised models (rigid bodies\n")
	s.printf("apart from Hertz contacts, handbook material data, small displacements). Where a\n")
	s.printf("result bears on safety or on hardware that can be damaged, verify it by test, and\n")
	s.printf("let the applicable codes and standards and a qualified engineer decide.\n")
}

// drawings writes the four SVG drawings.
func (s *study) drawings(b *design.Built, ev design.Evaluation, cands []candidate, res *kinematic.StudyResult) error {
	s.section("8. Drawings")
	if err := os.MkdirAll(s.outDir, 0o755); err != nil {
		return err
	}
	write := func(name string, draw func(io.Writer) error) error {
		path := filepath.Join(s.outDir, name)
		f, err := os.Create(path)
		if err != nil {
			return err
		}
		err = draw(f)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			return fmt.Errorf("%s: %w", path, err)
		}
		s.printf("wrote %s\n", path)
		return nil
	}
	opt := &drawing.Options{PointName: "detector centre", Title: "Detector cassette coupling, chosen layout (plan, looking down)"}
	if err := write("plan.svg", func(w io.Writer) error { return drawing.Plan(w, b, ev, opt) }); err != nil {
		return err
	}
	// The cassette's top face, 40 mm above the balls.
	opt = &drawing.Options{PointName: "detector centre", FaceHeight: 0.040}
	if err := write("liftoff.svg", func(w io.Writer) error { return drawing.LiftOff(w, b, opt) }); err != nil {
		return err
	}
	if res != nil && len(res.Points) > 0 {
		opt := &drawing.Options{PointName: "detector centre", Title: "Detector centre: parts made to the drawing",
			Notes: []string{fmt.Sprintf("%d Monte Carlo samples of the tolerances (first-order model)", len(res.Points))}}
		if err := write("histogram.svg", func(w io.Writer) error { return drawing.Histogram(w, *res, opt) }); err != nil {
			return err
		}
	}
	names := make([]string, len(cands))
	cards := make([]kinematic.Scorecard, len(cands))
	for i, c := range cands {
		names[i], cards[i] = c.name, c.card
	}
	opt = &drawing.Options{PointName: "detector"}
	return write("scorecards.svg", func(w io.Writer) error { return drawing.Scorecards(w, names, cards, opt) })
}
