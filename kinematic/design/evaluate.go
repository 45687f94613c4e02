package design

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// Evaluation is the whole evaluation of a design: what package kinematic
// says of its constraint, loads, stiffness and errors. A part the design
// gives no data for (no payload mass for a shock, no thermal change) is
// nil. Its Verdicts compare it with the design's requirements.
type Evaluation struct {
	// Analysis is the constraint analysis of the contacts and Stability
	// their Maxwell indices; Weakest indexes Stability.Contacts at the
	// smallest CentreIndex (the first of equals).
	Analysis  kinematic.Analysis
	Stability kinematic.Stability
	Weakest   int

	// Amplification is the error amplification at the point of interest:
	// its displacement per unit gap error at each contact.
	Amplification kinematic.Amplification

	// Cases holds the rigid statics of every load case, in the design's
	// order, with each contact's Hertz stresses against the allowable.
	// MaxPressureRatio is the largest PressureRatio over all of them and
	// MaxPressureAt where it occurs; MinForce the smallest contact force,
	// N (negative when a contact would have to pull), and MinForceAt
	// where. Both are zero without load cases.
	Cases            []kinematic.Statics
	MaxPressureRatio float64
	MaxPressureAt    kinematic.Bound
	MinForce         float64
	MinForceAt       kinematic.Bound

	// Shock is the worst shock added to the case ShockCase (the
	// requirement's single case, else the first) with that case's
	// gravity as given: its Unload is the level in m/s² at which the
	// first contact unloads. Nil without payload mass or load cases. The
	// verdicts of a requirement on several cases, or with gravity in any
	// orientation, are made case by case (see Verdicts).
	Shock     *kinematic.Shock
	ShockCase string

	// Homing is whether the body seats against the design's friction
	// under case SeatingCase. Nil without friction or load cases.
	Homing     *kinematic.Homing
	HomingCase string

	// Stiffness is the coupling's stiffness under case StiffnessCase (the
	// frequency requirement's case, else the first); Compliance is its
	// compliance at the point of interest and Modes the payload's natural
	// modes on it (nil without the payload's mass and inertia). Nil when
	// the design has no load case or the case leaves a contact in
	// tension (Notes says so).
	Stiffness     *kinematic.Stiffness
	Compliance    *kinematic.Compliance
	Modes         *[6]kinematic.Mode
	StiffnessCase string

	// Budget is the first-order error budget of the point of interest
	// for the tolerances, and AxisWorst and AxisRSS its worst case
	// and RSS along the design's axis, m (zero without an axis). Nil
	// without tolerances.
	Budget    *kinematic.Budget
	AxisWorst float64
	AxisRSS   float64

	// Study is the Monte Carlo study of the point of interest. Nil
	// without monte_carlo or tolerances.
	Study *kinematic.StudyResult

	// Drift is the thermal drift of the point of interest. Nil without
	// thermal.
	Drift *kinematic.Drift

	// Sizing is the preload window of the preload margin requirement
	// over its cases (nil without that requirement, or when no preload
	// meets it), and Repeatability the friction repeatability of the
	// point of interest under the first case of the repeatability
	// requirement (nil without it).
	Sizing        *kinematic.PreloadSizing
	Repeatability *kinematic.Repeatability

	// Random holds the random vibration response along each axis of
	// the design's vibration section, in its order, under case
	// RandomCase; nil without the section, or when the case gives no
	// response (a contact in tension: Notes says why).
	Random     []RandomAxis
	RandomCase string

	// Hysteresis is the response of the point of interest to the load
	// cycle HysteresisCycle added to case HysteresisCase with micro-slip
	// at the contacts: the hysteresis requirement's cycle and case, or
	// the first of each without it. Nil without cycles, cases or
	// friction, or when a contact opens under the cycle (Notes says
	// why).
	Hysteresis                      *kinematic.Hysteresis
	HysteresisCycle, HysteresisCase string

	// Notes lists analyses that could not be made and why.
	Notes []string

	req            Requirements
	checked        map[string]Verdicts // per requirement, made by more
	mu             float64
	deltaT         float64
	stiffnessNote  string
	point          string // the point of interest's name, for the notes
	randomNote     string // why there is no random response
	randomSpectrum string // the vibration's spectrum as the notes name it
	randomDuration string // the vibration's duration as the notes name it
	hysteresisNote string // why there is no hysteresis
}

// Evaluate returns the whole evaluation of the design, as
// [Built.Evaluate] does, building it first with [Design.Build], whose
// errors it returns. To make several analyses of one design, build it
// once and use the [Built].
func (d *Design) Evaluate(ctx context.Context) (Evaluation, error) {
	b, err := d.Build()
	if err != nil {
		return Evaluation{}, err
	}
	return b.Evaluate(ctx)
}

// Evaluate returns the whole evaluation of the design: constraint and
// Maxwell stability, the error amplification at the point of interest,
// rigid statics of every load case with Hertz stresses, the worst shock,
// seating against friction, stiffness, compliance and natural modes, the
// error budget, the Monte Carlo study and the thermal drift, each where
// the design gives its data. Errors are *Error values with the file's
// paths, or ctx's error when ctx is cancelled (the Monte Carlo study
// stops early).
func (b *Built) Evaluate(ctx context.Context) (Evaluation, error) {
	d := &b.d
	e := Evaluation{Analysis: b.analysis, req: d.Requirements, point: d.pointLabel()}
	if d.Friction != nil {
		e.mu = d.Friction.Mu
	}
	t := translator{b: b, params: pointParams}
	var err error
	if e.Stability, err = b.analysis.Stability(); err != nil {
		return Evaluation{}, t.translate(err)
	}
	for i, m := range e.Stability.Contacts {
		if m.CentreIndex < e.Stability.Contacts[e.Weakest].CentreIndex {
			e.Weakest = i
		}
	}
	if e.Amplification, err = e.Stability.Amplification(d.Point); err != nil {
		return Evaluation{}, t.translate(err)
	}
	if err := e.statics(b); err != nil {
		return Evaluation{}, err
	}
	if err := ctx.Err(); err != nil {
		return Evaluation{}, err
	}
	if err := e.loads(b); err != nil {
		return Evaluation{}, err
	}
	if err := e.more(b); err != nil {
		return Evaluation{}, err
	}
	if err := e.random(b); err != nil {
		return Evaluation{}, err
	}
	e.hysteresis(b)
	if b.budget != nil {
		e.Budget = b.budget
		if d.Axis != zeroVec {
			if e.AxisWorst, e.AxisRSS, err = b.budget.Along(d.Axis); err != nil {
				return Evaluation{}, &Error{Path: "axis", Err: errors.Unwrap(err)}
			}
		}
		if mc := d.MonteCarlo; mc != nil {
			res, err := b.assembly.Study(ctx, d.Point, d.Tolerances, &kinematic.StudyOptions{
				Samples: mc.Samples, Seed: mc.Seed, Exact: mc.Exact,
			})
			if err != nil {
				if ctx.Err() != nil {
					return Evaluation{}, ctx.Err()
				}
				return Evaluation{}, translator{b: b, fallback: "monte_carlo", params: studyParams}.translate(err)
			}
			e.Study = &res
		}
	}
	if th := d.Thermal; th != nil {
		e.deltaT = th.DeltaT
		dr, err := b.assembly.Drift(*th, d.Point)
		if err != nil {
			return Evaluation{}, thermalError(b, translator{b: b, fallback: "thermal", params: driftParams}.translate(err))
		}
		e.Drift = &dr
	}
	return e, ctx.Err()
}

// The parameters of Assembly.Study and Assembly.Drift in the file's
// terms.
var (
	studyParams = map[string]string{"p": "point_of_interest", "tols": "tolerances", "opt": "monte_carlo"}
	driftParams = map[string]string{"p": "point_of_interest", "th": "thermal",
		"th.DeltaT": "thermal.delta_t", "th.Moving": "thermal.moving_alpha", "th.Base": "thermal.base_alpha", "th.BaseRef": "thermal.base_ref"}
)

// thermalError returns the error err of the thermal drift blamed on the
// thermal input: an error that Drift finds at a seat or a ball (a ball
// that cannot reach its expanded seat) is the expansion's doing, since
// the same coupling seats at the reference temperature. The input named
// is the one that moves the geometry most: the moving body's expansion
// about the origin (ball centres up to |ΔT·α_moving|·max|c|) or the
// base's about base_ref (seats up to |ΔT·α_base|·max|c − base_ref|);
// delta_t when neither moves anything.
func thermalError(b *Built, err error) error {
	e, ok := err.(*Error)
	if !ok || (strings.HasPrefix(e.Path, "thermal") && e.Path != "thermal") || e.Path == "point_of_interest" {
		return err
	}
	whole := e.Path == "thermal" // kinematic's own "the thermal solve failed", with the seat as Other
	th := b.d.Thermal
	var far, farBase, span float64
	var centroid r3.Vec
	for _, ball := range b.d.Balls {
		centroid = r3.Add(centroid, r3.Scale(1/float64(len(b.d.Balls)), ball.Centre))
	}
	for _, ball := range b.d.Balls {
		far = math.Max(far, r3.Norm(ball.Centre))
		farBase = math.Max(farBase, r3.Norm(r3.Sub(ball.Centre, th.BaseRef)))
		span = math.Max(span, r3.Norm(r3.Sub(ball.Centre, centroid)))
	}
	moving := math.Abs(th.DeltaT*th.Moving) * far
	base := math.Abs(th.DeltaT*th.Base) * farBase
	path := "thermal.delta_t"
	var why []string
	if moving > 0 {
		why = append(why, fmt.Sprintf("moving_alpha %g /K moves the ball centres up to %.3g m (the moving body expands about the origin)", th.Moving, moving))
	}
	if base > 0 {
		why = append(why, fmt.Sprintf("base_alpha %g /K moves the seats up to %.3g m (about base_ref, %.3g m from the farthest ball)", th.Base, base, farBase))
	}
	switch {
	case moving >= base && moving > 0:
		path = "thermal.moving_alpha"
	case base > 0 && farBase > 10*span:
		// Held far from the coupling: the distance, not the coefficient,
		// makes the motion.
		path = "thermal.base_ref"
	case base > 0:
		path = "thermal.base_alpha"
	}
	if len(why) == 0 {
		why = append(why, "the balls' and seats' own materials expand")
	}
	if whole {
		return &Error{Path: path, Other: e.Other, Err: fmt.Errorf("%w; over delta_t %g K, %s",
			e.Err, th.DeltaT, strings.Join(why, ", and "))}
	}
	return &Error{Path: path, Other: e.Path, Err: fmt.Errorf("the thermal solve failed: over delta_t %g K, %s; the expanded coupling cannot be seated: %w",
		th.DeltaT, strings.Join(why, ", and "), e.Err)}
}

// statics solves every load case.
func (e *Evaluation) statics(b *Built) error {
	d := &b.d
	e.Cases = make([]kinematic.Statics, len(d.Cases))
	first := true
	for k, lc := range d.Cases {
		st, err := b.model.Statics(lc)
		if err != nil {
			p := index("cases", k)
			return translator{b: b, lc: p, fallback: p}.translate(err)
		}
		e.Cases[k] = st
		for _, c := range st.Contacts {
			at := kinematic.Bound{Case: lc.Name, Contact: c.Label}
			if first || c.Force < e.MinForce {
				e.MinForce, e.MinForceAt = c.Force, at
			}
			if first || c.PressureRatio > e.MaxPressureRatio {
				e.MaxPressureRatio, e.MaxPressureAt = c.PressureRatio, at
			}
			first = false
		}
	}
	return nil
}

// loads makes the shock, seating and stiffness analyses.
func (e *Evaluation) loads(b *Built) error {
	d, r, m := &b.d, b.d.Requirements, b.model
	if len(d.Cases) == 0 {
		return nil
	}
	caseOf := func(name string) (kinematic.LoadCase, translator) {
		k := d.caseIndex(name)
		p := index("cases", k)
		return d.Cases[k], translator{b: b, lc: p, fallback: p}
	}
	if d.Payload.Mass > 0 {
		lc, t := caseOf(r.ShockCase)
		s, err := m.Shock(lc, r.MinShock)
		if err != nil {
			t.params = map[string]string{"magnitude": "requirements.min_shock.level"}
			return t.translate(err)
		}
		e.Shock, e.ShockCase = &s, lc.Name
	}
	if d.Friction != nil {
		lc, t := caseOf(r.HomingCase)
		s, err := m.Homing(lc, d.Friction.Mu)
		if err != nil {
			t.params = map[string]string{"mu": "friction.mu"}
			return t.translate(err)
		}
		e.Homing, e.HomingCase = &s, lc.Name
	}
	lc, t := caseOf(r.FrequencyCase)
	e.StiffnessCase = lc.Name
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		if errors.Is(err, ErrRange) {
			e.note(fmt.Sprintf("no stiffness under case %q: %v", lc.Name, unwrapKinematic(err)))
			return nil
		}
		return t.translate(err)
	}
	e.Stiffness = &st
	if c, err := st.Compliance(d.Point); err == nil {
		e.Compliance = &c
	} else {
		e.note(fmt.Sprintf("no compliance at the point of interest under case %q: %v", lc.Name, unwrapKinematic(err)))
	}
	if d.Payload.Mass > 0 && d.Payload.Inertia != ([3][3]float64{}) {
		modes, err := st.Modes()
		if err != nil {
			e.note(fmt.Sprintf("no natural modes under case %q: %v", lc.Name, unwrapKinematic(err)))
			return nil
		}
		e.Modes = &modes
	}
	return nil
}

// note records why an analysis could not be made; the first note about
// stiffness explains a frequency requirement that cannot pass.
func (e *Evaluation) note(s string) {
	e.Notes = append(e.Notes, s)
	if e.stiffnessNote == "" {
		e.stiffnessNote = s
	}
}

// unwrapKinematic returns the reason of a kinematic input error, without
// kinematic's field path.
func unwrapKinematic(err error) error {
	var ke *kinematic.InputError
	if errors.As(err, &ke) {
		return ke.Err
	}
	return err
}

// Verdicts returns, for every requirement the design sets, what the
// design achieves against its limit, in the order of the requirements'
// documentation (see [Requirements] and the package documentation): one
// verdict per load case for a requirement checked in several cases, each
// verdict's Note stating its conditions (the case, the gravity turned,
// the temperature change, the samples, the axis).
func (e Evaluation) Verdicts() Verdicts {
	r := e.req
	var vs Verdicts
	add := func(name string, value, limit float64, unit string, min bool, note string) {
		v := Verdict{Requirement: "requirements." + name, Value: value, Limit: limit, Unit: unit, Min: min, Note: note}
		if min {
			v.Pass = value >= limit
		} else {
			v.Pass = value <= limit
		}
		vs = append(vs, v)
	}
	if r.MinCentreIndex > 0 {
		c := e.Stability.Contacts[e.Weakest]
		add("min_centre_index", c.CentreIndex, r.MinCentreIndex, "", true, "Maxwell index at the ball centre, weakest at contact "+c.Label)
	}
	if r.MinContactIndex > 0 {
		w := 0
		for i, m := range e.Stability.Contacts {
			if m.Index < e.Stability.Contacts[w].Index {
				w = i
			}
		}
		c := e.Stability.Contacts[w]
		add("min_contact_index", c.Index, r.MinContactIndex, "", true, "Maxwell index at the contact point, weakest at contact "+c.Label)
	}
	if r.MaxPressureRatio > 0 {
		add("max_pressure_ratio", e.MaxPressureRatio, r.MaxPressureRatio, "", false, where(e.MaxPressureAt))
	}
	if r.MinContactForce > 0 && !r.ForceAnyGravity {
		add("min_contact_force", e.MinForce, r.MinContactForce, "N", true, where(e.MinForceAt))
	}
	vs = append(vs, e.checked["min_contact_force"]...)
	vs = append(vs, e.checked["min_shock"]...)
	vs = append(vs, e.checked["min_frequency"]...)
	if e.Budget != nil {
		worst, rss, note := e.Budget.Worst, e.Budget.RSS, "at the "+e.point
		if r.AlongAxis {
			worst, rss, note = e.AxisWorst, e.AxisRSS, "along the axis at the point of interest"
		}
		if r.MaxWorst > 0 {
			add("max_error.worst_case", worst, r.MaxWorst, "m", false, note)
		}
		if r.MaxRSS > 0 {
			add("max_error.rss", rss, r.MaxRSS, "m", false, note)
		}
	}
	if r.MaxStudy > 0 && e.Study != nil {
		note := fmt.Sprintf("radial %v of %d samples", r.StudyPercentile, e.Study.Samples)
		add("max_study", r.StudyPercentile.of(e.Study.Radial), r.MaxStudy, "m", false, note)
	}
	if r.MaxThermalDrift > 0 && e.Drift != nil {
		add("max_thermal_drift", r3.Norm(e.Drift.Relative), r.MaxThermalDrift, "m", false,
			fmt.Sprintf("at the %s over delta_t %s, exact seat of the expanded geometry, relative to the base", e.point, quantityString(e.deltaT, "K")))
	}
	vs = append(vs, e.checked["seating"]...)
	vs = append(vs, e.tiltVerdicts()...)
	for _, name := range []string{"min_stiffness.along_axis", "min_stiffness.across_axis", "min_preload_margin", "max_repeatability.worst_case", "max_repeatability.rss"} {
		vs = append(vs, e.checked[name]...)
	}
	vs = append(vs, e.randomVerdicts()...)
	vs = append(vs, e.hysteresisVerdicts()...)
	return vs
}

// where returns a note naming a case and contact.
func where(b kinematic.Bound) string {
	if b.Case == "" && b.Contact == "" {
		return ""
	}
	return fmt.Sprintf("at contact %s in case %q", b.Contact, b.Case)
}

// Verdict is one requirement checked: what the design achieves (Value)
// against the requirement's limit, both in the SI unit Unit ("" for a
// pure number). A minimum (Min) passes when Value ≥ Limit, a maximum when
// Value ≤ Limit. For requirements.seating, Value is the largest
// coefficient of friction at which the body seats (kinematic.Homing
// MaxMu), Limit the design's, and Pass whether it seats at that friction.
type Verdict struct {
	Requirement string // the requirement's JSON path, e.g. "requirements.min_shock"
	Value       float64
	Limit       float64
	Unit        string
	Min         bool
	Pass        bool
	Note        string // where the value occurs, or why it could not be found
}

// String returns the verdict in words, for example
// "requirements.min_shock: 31.18 m/s^2 (3.18 g), needs at least 49.03 m/s^2 (5 g): fails".
func (v Verdict) String() string {
	verdict := "passes"
	if !v.Pass {
		verdict = "fails"
	}
	note := ""
	if v.Note != "" {
		note = " (" + v.Note + ")"
	}
	if v.Requirement == "requirements.seating" {
		return fmt.Sprintf("%s: seats up to mu = %.4g, needs mu = %.4g%s: %s", v.Requirement, v.Value, v.Limit, note, verdict)
	}
	bound := "at most"
	if v.Min {
		bound = "at least"
	}
	value := quantityString(v.Value, v.Unit)
	if v.Requirement == "requirements.max_random_openings" && v.Limit >= tinyBelow {
		// A limit under the threshold prints the value as computed, so
		// that the comparison stays readable.
		value = tinyString(v.Value)
	}
	return fmt.Sprintf("%s: %s, needs %s %s%s: %s", v.Requirement, value, bound, quantityString(v.Limit, v.Unit), note, verdict)
}

// tinyBelow is the smallest expected number of openings or probability
// printed as a number: below it the Gaussian tail's figures (1e-41,
// 1e-294, or 0 once they underflow) say only "never" and carry no
// precision that the linear model supports.
const tinyBelow = 1e-12

// tinyString formats an expected number of openings or a probability
// with three figures, or as "< 1e-12" below tinyBelow. The study
// example's tables print them alike (its own copy: examples import only
// public packages).
func tinyString(v float64) string {
	if math.IsInf(v, 1) {
		return "unbounded"
	}
	if v < tinyBelow {
		return "< 1e-12"
	}
	return fmt.Sprintf("%.3g", v)
}

// quantityString formats a value in its unit; accelerations also in g.
func quantityString(v float64, unit string) string {
	if math.IsInf(v, 1) {
		return "unbounded"
	}
	s := fmt.Sprintf("%.4g", v)
	if unit != "" {
		s += " " + unit
	}
	switch {
	case unit == "m/s^2":
		s += fmt.Sprintf(" (%.3g g)", v/kinematic.StandardGravity)
	case unit == "m" && v != 0 && math.Abs(v) < 1e-3:
		s += fmt.Sprintf(" (%.4g µm)", v*1e6)
	case unit == "rad" && v != 0 && math.Abs(v) < 1e-3:
		s += fmt.Sprintf(" (%.4g µrad)", v*1e6)
	case unit == "N/m" && math.Abs(v) >= 1e3:
		s += fmt.Sprintf(" (%.4g N/µm)", v*1e-6)
	}
	return s
}

// Verdicts are the verdicts of a design's requirements.
type Verdicts []Verdict

// Err returns nil when every verdict passes, and otherwise one error that
// names every requirement that fails, with its value and limit, and wraps
// [ErrRequirement]:
//
//	if err := ev.Verdicts().Err(); err != nil {
//		t.Fatal(err)
//	}
func (v Verdicts) Err() error {
	var failed Verdicts
	for _, x := range v {
		if !x.Pass {
			failed = append(failed, x)
		}
	}
	if len(failed) == 0 {
		return nil
	}
	return &verdictError{failed: failed, total: len(v)}
}

type verdictError struct {
	failed Verdicts
	total  int
}

func (e *verdictError) Error() string {
	s := fmt.Sprintf("design: %d of %d requirements not met", len(e.failed), e.total)
	for i, v := range e.failed {
		sep := "; "
		if i == 0 {
			sep = ": "
		}
		s += sep + v.String()
	}
	return s
}

func (e *verdictError) Unwrap() error { return ErrRequirement }
