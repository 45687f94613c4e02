package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"regexp"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

const deg = math.Pi / 180

// study is one run of the report.
type study struct {
	w   io.Writer
	cfg config

	d     *design.Design
	b     *design.Built
	ev    design.Evaluation
	point string // the point of interest's name

	// res is the Monte Carlo study with its samples (for the histogram),
	// nil without one.
	res *kinematic.StudyResult

	// opt is the optimiser's result with -optimize, and optimized the
	// improved design built.
	opt       *kinematic.Optimum
	optimized *design.Built
	optEv     design.Evaluation

	// sizing is the preload window of the design's cases, computed once
	// (sizingDone) for the loads section, the preload curves and their
	// drawings; sizingErr says why there is none.
	sizing     kinematic.PreloadSizing
	sizingErr  error
	sizingDone bool
}

// preloadSizing returns the preload window of the design's cases with
// the requirements' least contact force.
func (s *study) preloadSizing() (kinematic.PreloadSizing, error) {
	if !s.sizingDone {
		s.sizing, s.sizingErr = s.b.Model().SizePreload(s.d.Cases, s.d.Requirements.MinContactForce)
		s.sizingDone = true
	}
	return s.sizing, s.sizingErr
}

// unpushed is kinematic.SizePreload's reason for a contact that no
// preload element pushes closed and that its case leaves below the
// least force.
var unpushed = regexp.MustCompile(`^(?:[^:]*: )?case "(.*)" leaves contact (\S+) at (\S+) N, below minForce (\S+) N, and the preload does not push it closed$`)

// sizingError says why the preload window cannot be found in the design
// file's terms: its JSON paths (requirements.min_contact_force, not the
// Go parameter minForce; a case by name and index), and for a zero
// preload the cause itself. total is the preload at the seat, N.
func (s *study) sizingError(err error, total float64) string {
	var ie *kinematic.InputError
	if !errors.As(err, &ie) {
		return err.Error()
	}
	reason := ie.Err.Error()
	if m := unpushed.FindStringSubmatch(reason); m != nil {
		at := ""
		for k, c := range s.d.Cases {
			if c.Name == m[1] {
				at = fmt.Sprintf(" (cases[%d])", k)
			}
		}
		why := "no preload element's line of action pushes that contact closed: move or turn a preload"
		if total == 0 {
			var zero []string
			for j := range s.d.Preloads {
				zero = append(zero, fmt.Sprintf("preloads[%d].force", j))
			}
			why = fmt.Sprintf("the preload is 0 N (%s), so nothing pushes it closed: give the preload a force", strings.Join(zero, ", "))
		}
		return fmt.Sprintf("case %q%s leaves contact %s at %s N, below requirements.min_contact_force %s N, and %s",
			m[1], at, m[2], m[3], m[4], why)
	}
	field := ie.Field
	switch {
	case field == "minForce":
		field = "requirements.min_contact_force"
	case strings.HasPrefix(field, "cases["):
		field = strings.NewReplacer(".Gravity", ".gravity", ".Acceleration", ".acceleration", ".Applied", ".applied").Replace(field)
	}
	reason = strings.ReplaceAll(reason, "minForce", "requirements.min_contact_force")
	return field + ": " + reason
}

// caseNamed returns the design's load case of that name (the zero
// LoadCase if there is none).
func (s *study) caseNamed(name string) kinematic.LoadCase {
	for _, c := range s.d.Cases {
		if c.Name == name {
			return c
		}
	}
	return kinematic.LoadCase{}
}

// nameOf returns preload element i's name, or "preload i+1".
func nameOf(p kinematic.Preload, i int) string {
	if p.Name != "" {
		return p.Name
	}
	return fmt.Sprintf("preload %d", i+1)
}

func (s *study) printf(format string, a ...any) { fmt.Fprintf(s.w, format, a...) }

func (s *study) section(n int, title string) {
	t := fmt.Sprintf("%d. %s", n, title)
	s.printf("\n%s\n%s\n", t, strings.Repeat("-", len([]rune(t))))
}

// source names the design file.
func (s *study) source() string {
	if s.cfg.path == "-" {
		return "standard input"
	}
	return s.cfg.path
}

// title returns the design's name, else the file's.
func (s *study) title() string {
	if s.d != nil && s.d.Name != "" {
		return s.d.Name
	}
	if s.cfg.path == "-" {
		return "design"
	}
	return s.cfg.path
}

// run reads, evaluates and reports the design; pass reports whether
// every requirement is met. An error means the file or the study failed.
func (s *study) run(ctx context.Context, src []byte) (pass bool, err error) {
	if s.d, err = design.Parse(src); err != nil {
		return false, err
	}
	if s.b, err = s.d.Build(); err != nil {
		return false, err
	}
	if s.ev, err = s.b.Evaluate(ctx); err != nil {
		return false, err
	}
	s.point = s.d.PointName
	if s.point == "" {
		s.point = "point of interest"
	}
	if err := s.keepSamples(ctx); err != nil {
		return false, err
	}
	t := s.title()
	s.printf("%s\n%s\n", t, strings.Repeat("=", len([]rune(t))))
	s.printf("design file: %s\n", s.source())
	if s.d.Description != "" {
		s.printf("%s\n", wrap(s.d.Description, 78))
	}
	s.coupling()
	s.constraint()
	if err := s.loads(); err != nil {
		return false, err
	}
	s.stiffness()
	if err := s.errors(); err != nil {
		return false, err
	}
	n := 6
	if s.d.Vibration != nil {
		s.vibration(n)
		n++
	}
	if len(s.d.Cycles) > 0 {
		s.hysteresis(n)
		n++
	}
	pass = s.requirements(n, "Requirements of the design as written", s.ev)
	n++
	if s.cfg.optimize {
		if err := s.optimise(ctx, n); err != nil {
			return false, err
		}
		n++
	}
	if s.cfg.out != "" {
		if err := s.drawings(n); err != nil {
			return false, err
		}
	}
	s.caution()
	return pass, nil
}

// keepSamples repeats the design's Monte Carlo study, as the file sets
// it, keeping the samples for the histogram: the same samples and seed
// give the same parts, so its statistics are those of the evaluation.
func (s *study) keepSamples(ctx context.Context) error {
	mc := s.d.MonteCarlo
	if mc == nil || s.ev.Study == nil {
		return nil
	}
	res, err := s.b.Assembly().Study(ctx, s.d.Point, s.d.Tolerances,
		&kinematic.StudyOptions{Samples: mc.Samples, Seed: mc.Seed, Exact: mc.Exact, KeepSamples: true})
	if err != nil {
		return err
	}
	s.res = &res
	return nil
}

// sig formats a quantity with four significant figures, without an
// exponent from 1e4 up (12345 N reads 12345, not 1.234e+04): fixed
// decimals turned a MEMS coupling's 12.25 mN into 0.01 and 50 mN into
// 0.1.
func sig(x float64) string {
	if math.Abs(x) >= 1e4 {
		return fmt.Sprintf("%.0f", x)
	}
	return fmt.Sprintf("%.4g", x)
}

// column formats a table's quantity with four significant figures and
// its trailing zeros, so that a column's figures line up: 32.80, 7.900,
// 0.01225, 2950.
func column(x float64) string {
	d := 3
	if a := math.Abs(x); a > 0 && !math.IsInf(a, 0) {
		d = min(max(3-int(math.Floor(math.Log10(a))), 0), 12)
	}
	return strconv.FormatFloat(x, 'f', d, 64)
}

// newtons formats a force, N, with four significant figures: in mN below
// 1 N (50 mN, 12.25 mN), else in N (12.06 N, 2086 N).
func newtons(f float64) string {
	if f != 0 && math.Abs(f) < 1 {
		return sig(f*1e3) + " mN"
	}
	return sig(f) + " N"
}

func mm(v r3.Vec) string {
	return fmt.Sprintf("(%.2f, %.2f, %.2f) mm", nz(v.X*1e3, 2), nz(v.Y*1e3, 2), nz(v.Z*1e3, 2))
}

// nz returns x, or 0 when x rounds to zero at the given decimals, so that
// no "-0.00" is printed.
func nz(x float64, decimals int) float64 {
	if math.Abs(x) < 0.5*math.Pow(10, -float64(decimals)) {
		return 0
	}
	return x
}

func dir(v r3.Vec) string {
	n := r3.Norm(v)
	if n == 0 {
		return "(none)"
	}
	v = r3.Scale(1/n, v)
	return fmt.Sprintf("(%.3f, %.3f, %.3f)", nz(v.X, 3), nz(v.Y, 3), nz(v.Z, 3))
}

// seatText describes a seat of the coupling. A vee's included angle, the
// angle between its flanks, is twice its half-angle: each flank stands
// HalfAngle from the vertical mid-plane (kinematic.Vee).
func seatText(st kinematic.Seat) string {
	switch k := st.(type) {
	case kinematic.Vee:
		return fmt.Sprintf("vee, %.1f° included, groove %s, %s", 2*k.HalfAngle/deg, dir(k.Direction), k.Material.Name)
	case kinematic.Rods:
		return fmt.Sprintf("rods %.2f mm radius, half-angle %.1f°, groove %s, %s", k.RodRadius*1e3, k.HalfAngle/deg, dir(k.Direction), k.Material.Name)
	case kinematic.Flat:
		return fmt.Sprintf("flat, up %s, %s", dir(k.Up), k.Material.Name)
	case kinematic.Trihedral:
		return fmt.Sprintf("trihedral socket, half-angle %.1f°, %s", k.HalfAngle/deg, k.Material.Name)
	case kinematic.Cone:
		return fmt.Sprintf("cone, half-angle %.1f°, %s", k.HalfAngle/deg, k.Material.Name)
	}
	return fmt.Sprintf("%T", st)
}

func (s *study) coupling() {
	s.section(1, "The coupling")
	c := s.b.Coupling()
	wm := len("ball material")
	for _, p := range c.Pairs {
		wm = max(wm, len([]rune(p.Ball.Material.Name)))
	}
	s.printf("%-6s %-32s %10s  %-*s  %s\n", "ball", "centre", "radius", wm, "ball material", "seat")
	for i, p := range c.Pairs {
		name := p.Name
		if name == "" { // unnamed balls are lettered by position, as kinematic labels them
			name = string(rune('A' + i))
			if i >= 26 {
				name = fmt.Sprintf("P%d", i+1)
			}
		}
		s.printf("%-6s %-32s %7.3f mm  %-*s  %s\n", name, mm(p.Ball.Centre), p.Ball.Radius*1e3, wm, p.Ball.Material.Name, seatText(p.Seat))
	}
	for i, p := range s.d.Preloads {
		name := nameOf(p, i)
		f, r, _ := p.AtSeat() // the design was built: its laws are valid
		rate := ""
		if r != 0 {
			rate = fmt.Sprintf(", rate %.3g N/mm", r*1e-3)
		}
		s.printf("%s: %s along %s through %s%s%s\n", name, newtons(f), dir(p.Direction), mm(p.Point), rate, lawText(p))
	}
	if pl := s.d.Payload; pl.Mass > 0 {
		s.printf("payload: %.4g kg, centre of mass %s\n", pl.Mass, mm(pl.Centre))
	}
	s.printf("%s: %s", s.point, mm(s.d.Point))
	if s.d.Axis != (r3.Vec{}) {
		s.printf(", axis %s", dir(s.d.Axis))
	}
	s.printf("\n")
}

func (s *study) constraint() {
	s.section(2, "Constraint and stability")
	an := s.ev.Analysis
	s.printf("rank %d of 6, %d degrees of freedom left, %d redundant contacts; condition number %.2f (1 = ideal; above %d a poor layout)\n",
		an.Rank, an.DOF, len(an.Redundant), an.Condition, kinematic.DesignCondition)
	s.printf("%-8s %16s %16s\n", "contact", "index at point", "index at centre")
	for i, m := range s.ev.Stability.Contacts {
		mark := ""
		if i == s.ev.Weakest {
			mark = "  <- weakest"
		}
		s.printf("%-8s %16.4f %16.4f%s\n", m.Label, m.Index, m.CentreIndex, mark)
	}
	s.printf("(Maxwell indices are dimensionless, 0 to 1: 1 when a freed motion lifts its contact straight off.)\n")
	a := s.ev.Amplification
	s.printf("error amplification at the %s: %.3f µm per µm of seat error worst case, %.3f RSS\n", s.point, a.Worst, a.RSS)
}

func (s *study) loads() error {
	s.section(3, "Loads, Hertz stresses and the preload window")
	if len(s.d.Cases) == 0 {
		s.printf("no load cases in the design\n")
		return nil
	}
	for _, st := range s.ev.Cases {
		s.printf("case %q:\n", st.Case)
		s.printf("  %-8s %10s %12s %14s %14s\n", "contact", "force, N", "a, µm", "p0, MPa", "p0/allowable")
		for _, cl := range st.Contacts {
			if cl.Force <= 0 {
				// No Hertz contact and no pressure to judge: a
				// contact in tension opens, one at exactly zero
				// touches without load. Zeros here would read as
				// values, and "no allowable" as a missing material.
				mark := "open"
				if cl.Force == 0 {
					mark = "unloaded"
				}
				s.printf("  %-8s %10s %12s %14s %14s\n", cl.Label, column(cl.Force), mark, mark, mark)
				continue
			}
			ratio := "no allowable"
			if cl.Allowable > 0 {
				ratio = fmt.Sprintf("%.3f", cl.PressureRatio)
			}
			s.printf("  %-8s %10s %12.1f %14.0f %14s\n", cl.Label, column(cl.Force), cl.Hertz.SemiMajor*1e6, cl.Hertz.PeakPressure/1e6, ratio)
		}
		if len(st.Tensile) > 0 {
			s.printf("  in tension (the part would lift; open: no Hertz contact, no pressure): %s\n", strings.Join(st.Tensile, ", "))
		}
	}
	if len(s.d.Preloads) > 0 {
		minF := s.d.Requirements.MinContactForce
		sz, err := s.preloadSizing()
		total := 0.0
		for _, p := range s.d.Preloads {
			f, _, _ := p.AtSeat()
			total += f
		}
		if err != nil {
			s.printf("preload window: none: %s\n", s.sizingError(err, total))
		} else {
			hi := "no upper limit (no allowable on file)"
			if !math.IsInf(sz.MaxScale, 1) {
				hi = newtons(sz.MaxScale * total)
			}
			s.printf("preload window (every contact ≥ %s in every case, every p0 ≤ allowable): %s to %s; as given %s\n",
				newtons(minF), newtons(sz.MinScale*total), hi, newtons(total))
		}
	}
	if sh := s.ev.Shock; sh != nil {
		at := ""
		if len(sh.First) > 0 {
			at = fmt.Sprintf(" (%s first, base acceleration along %s)", strings.Join(sh.First, ", "), dir(sh.Direction))
		}
		s.printf("shock in the worst direction, added to case %q: the first contact unloads at %.2f g%s\n",
			s.ev.ShockCase, sh.Unload/kinematic.StandardGravity, at)
	}
	if h := s.ev.Homing; h != nil {
		ok := "seats"
		if !h.Home {
			ok = "does NOT seat"
		}
		s.printf("friction seating at mu = %.3g under case %q: the body %s; it would up to mu = %.3f\n", h.Mu, s.ev.HomingCase, ok, h.MaxMu)
	}
	return s.preloadCurves()
}

func (s *study) stiffness() {
	s.section(4, "Stiffness and natural frequencies")
	if s.ev.Compliance != nil {
		c := s.ev.Compliance
		s.printf("compliance of the %s under case %q:\n", s.point, s.ev.StiffnessCase)
		if along, err := c.Along(s.d.Axis); err == nil { // a design without an axis has none
			s.printf("  along its axis: %.4g µm/N (%.3g N/µm)\n", along*1e6, 1/along*1e-6)
		}
		for _, ax := range []struct {
			name string
			v    r3.Vec
		}{{"x", r3.Vec{X: 1}}, {"y", r3.Vec{Y: 1}}, {"z", r3.Vec{Z: 1}}} {
			along, _ := c.Along(ax.v) // a unit axis: never an error
			s.printf("  along %s: %.4g µm/N\n", ax.name, along*1e6)
		}
	}
	if s.ev.Modes != nil {
		s.printf("natural frequencies of the payload on the coupling:")
		for _, md := range s.ev.Modes {
			s.printf(" %.0f", md.Frequency)
		}
		s.printf(" Hz\n")
	}
	if s.ev.Compliance == nil && s.ev.Modes == nil && len(s.ev.Notes) == 0 {
		s.printf("no stiffness: the design has no load case\n")
	}
	for _, n := range s.ev.Notes {
		s.printf("note: %s\n", n)
	}
}

func (s *study) errors() error {
	s.section(5, "Error budget at the "+s.point)
	ev := s.ev
	if b := ev.Budget; b != nil {
		s.printf("tolerance: as the file gives it, ± the half-width of a uniform one or σ (standard deviation) of a normal one\n")
		s.printf("limit: the worst-case deviation, ± the half-width or ±3σ; effect: the displacement of the %s at that limit\n", s.point)
		s.printf("share: of the variance (σ²) of the displacement; σ² is a²/3 for a uniform ±a but a²/9 for a normal ±3σ = ±a,\n")
		s.printf("       so at equal effect a normal tolerance has a third of the share, and the ranks by effect and by share can differ\n")
		s.printf("%-20s %17s %17s %12s %8s\n", "dimension", "tolerance", "limit", "effect, µm", "share")
		normal := map[string]bool{}
		for _, t := range s.d.Tolerances {
			normal[t.Dimension] = t.Sigma > 0
		}
		for k, c := range b.Contributors {
			if k == 10 {
				s.printf("  (%d smaller contributors)\n", len(b.Contributors)-k)
				break
			}
			unit, scale := "µm", 1e6
			if isAngle(c.Dimension) {
				unit, scale = "arcmin", 60/deg
			}
			tol := fmt.Sprintf("± %8.3f %-6s", c.Limit*scale, unit)
			if normal[c.Dimension] {
				tol = fmt.Sprintf("σ %8.3f %-6s", c.Limit/3*scale, unit)
			}
			s.printf("%-20s %17s ± %8.3f %-6s %12.3f %7.1f%%\n", c.Dimension, tol, c.Limit*scale, unit, c.Effect*1e6, 100*c.Share)
		}
		s.printf("first order: worst case %.3f µm, RSS %.3f µm, standard deviation %.3f µm\n", b.Worst*1e6, b.RSS*1e6, b.Sigma*1e6)
		if s.d.Axis != (r3.Vec{}) {
			s.printf("along the axis: worst case %.3f µm, RSS %.3f µm\n", ev.AxisWorst*1e6, ev.AxisRSS*1e6)
		}
	} else {
		s.printf("no tolerances in the design\n")
	}
	if r := s.res; r != nil {
		how := "first-order model"
		if s.d.MonteCarlo.Exact {
			how = "each part seated exactly"
		}
		s.printf("Monte Carlo, %d parts made to the drawing (interchangeability, seed %d, %s): displacement of the %s\n",
			r.Samples, s.d.MonteCarlo.Seed, how, s.point)
		s.printf("  radial (3-D magnitude): median %.2f µm, 95 %% %.2f µm, 99 %% %.2f µm, 99.73 %% %.2f µm\n",
			r.Radial.P50*1e6, r.Radial.P95*1e6, r.Radial.P99*1e6, r.Radial.P9973*1e6)
		s.printf("  standard deviation along x %.2f µm, y %.2f µm, z %.2f µm; tilt 99 %% %.1f µrad\n",
			r.X.StdDev*1e6, r.Y.StdDev*1e6, r.Z.StdDev*1e6, r.Tilt.P99*1e6)
	}
	if dr := ev.Drift; dr != nil {
		th := s.d.Thermal
		s.printf("thermal change of %+.3g K: the %s moves %s µm relative to the base (first order %s µm)\n",
			th.DeltaT, s.point, um(dr.Relative), um(dr.RelativeLinear))
		s.printf("  in the frame, the base held at %s: %s µm\n", mm(th.BaseRef), um(dr.World))
		if dr.HasCentre {
			s.printf("  thermal centre at %s, %.1f mm from the %s\n", mm(dr.Centre), dr.Distance*1e3, s.point)
		} else {
			s.printf("  no thermal centre: relative to the base the body neither turns nor strains in the plane through the ball centres (its lateral motion there is a pure translation, or none)\n")
		}
	}
	if f := s.d.Friction; f != nil && len(s.d.Cases) > 0 && f.Mu > 0 {
		rep, err := s.b.Model().Repeatability(s.d.Cases[0], f.Mu, s.d.Point)
		if err != nil {
			s.printf("friction repeatability: not available (%v)\n", err)
		} else {
			s.printf("friction at mu = %.3g (repeatability, the same part put back, case %q): about %.3g µm RSS, %.3g µm worst case (an estimate)\n",
				rep.Mu, s.d.Cases[0].Name, rep.RSS*1e6, rep.Worst*1e6)
		}
	}
	return nil
}

func um(v r3.Vec) string {
	return fmt.Sprintf("(%.3f, %.3f, %.3f)", nz(v.X*1e6, 3), nz(v.Y*1e6, 3), nz(v.Z*1e6, 3))
}

// isAngle reports whether a dimension of kinematic.Assembly is an angle.
func isAngle(dim string) bool {
	part := dim[strings.LastIndexByte(dim, '.')+1:]
	switch part {
	case "Turn", "Tilt", "Tilt1", "Tilt2", "HalfAngle":
		return true
	}
	return false
}

// requirements prints the verdicts and reports whether all pass.
func (s *study) requirements(n int, title string, ev design.Evaluation) bool {
	s.section(n, title)
	vs := ev.Verdicts()
	if len(vs) == 0 {
		s.printf("The design sets no requirements.\n")
		return true
	}
	for _, v := range vs {
		s.printf("%s\n", v)
	}
	if err := vs.Err(); err != nil {
		s.printf("The design FAILS: %d of %d requirements not met.\n", failed(vs), len(vs))
		return false
	}
	s.printf("Every requirement is met (%d).\n", len(vs))
	return true
}

func failed(vs design.Verdicts) int {
	n := 0
	for _, v := range vs {
		if !v.Pass {
			n++
		}
	}
	return n
}

func (s *study) caution() {
	s.printf("\nCaution: these are engineering estimates from idealised models (rigid bodies\n")
	s.printf("apart from Hertz contacts, handbook material data, small displacements). Where a\n")
	s.printf("result bears on safety or on hardware that can be damaged, verify it by test, and\n")
	s.printf("let the applicable codes and standards and a qualified engineer decide.\n")
}

// wrap breaks text into lines of at most width runes at spaces (a longer
// word stands on its own line).
func wrap(text string, width int) string {
	var b strings.Builder
	n := 0
	for _, w := range strings.Fields(text) {
		l := len([]rune(w))
		switch {
		case n == 0:
		case n+1+l > width:
			b.WriteByte('\n')
			n = 0
		default:
			b.WriteByte(' ')
			n++
		}
		b.WriteString(w)
		n += l
	}
	return b.String()
}
