package kinematic

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/constraint"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Scenario is what a layout is judged by: the point that matters and what
// acts on the coupling. A figure that needs a field left zero is marked in
// [Scorecard.Unavailable] (see each [Figure]).
type Scenario struct {
	// Point is the point of interest on the moving body (an optical
	// axis, a probe tip), m; Axis, when not zero, a direction there that
	// matters most (the optical axis).
	Point r3.Vec
	Axis  r3.Vec

	// Preloads and Payload as for [NewModel]; Gravity, m/s², the
	// gravity of the working orientation.
	Preloads []Preload
	Payload  Payload
	Gravity  r3.Vec

	// Shock is the shock level, m/s² in any direction, the coupling must
	// survive with every contact at MinForce or more (N); it sets the
	// lower end of the preload window.
	Shock    float64
	MinForce float64

	// Thermal gives the expansion coefficients; its DeltaT is ignored
	// (the drift is per kelvin).
	Thermal Thermal
}

// DesignCondition is the condition number of the normalised contact
// matrix above which [Scorecard.Poor] flags a layout. The error of a
// point within the contacts' RMS distance of their centre, per unit gap
// error at the contacts, is bounded by about √6 times the largest entry
// of the inverse of that matrix, √6/σ_min (each freed twist has norm at
// most 1/σ_min in normalised units, and there are six), and σ_max is at
// most √6 (the columns have unit norm): a condition of 10 already allows
// amplifications of ten — a micrometre of seat error moving the part by
// up to ten micrometres, against the sub-micrometre budgets kinematic
// couplings are chosen for. Sensible layouts have conditions of 2 to 5.
// This is a design warning, distinct from the arithmetic
// screw.NearSingularRatio (1e3).
const DesignCondition = 10

// Figure is a set of [Scorecard] figures, one bit each: the figures that
// need an input beyond the geometry. [Scorecard.Unavailable] holds those
// the scenario cannot support; the zero Figure is the empty set. A figure
// whose bit is set is 0 in the scorecard and means nothing.
type Figure uint32

// The figures that need more than the geometry, and what each needs (the
// Maxwell indices, the singular values, Amplification, AmplificationRSS,
// Tilt, TiltRSS and ShockLevel need nothing more and are always
// available):
const (
	// FigureAxisAmplification needs Scenario.Axis.
	FigureAxisAmplification Figure = 1 << iota
	// FigureLoadAmplification needs Payload.Mass.
	FigureLoadAmplification
	// FigurePreloadMin needs a preload element with a force or couple.
	FigurePreloadMin
	// FigurePreloadMax needs a preload element, and at every contact a
	// Hertz point contact (materials on both bodies, not a cone's ring)
	// with an allowable on file.
	FigurePreloadMax
	// FigurePressureRatio needs at every contact a Hertz point contact
	// with an allowable on file.
	FigurePressureRatio
	// FigureStiffness needs at every contact a Hertz point contact and a
	// force in compression under the preload and gravity: an unloaded
	// Hertz contact has no stiffness.
	FigureStiffness
	// FigureAxisCompliance needs what FigureStiffness needs, and Axis.
	FigureAxisCompliance
	// FigureFirstFrequency needs what FigureStiffness needs, and
	// Payload.Mass and Payload.Inertia.
	FigureFirstFrequency
	// FigureDrift needs an expansion coefficient: Thermal.Moving,
	// Thermal.Base, or a ball's or seat's Material.Alpha.
	FigureDrift
	// FigureThermalCentreDistance needs what FigureDrift needs, and a
	// thermal centre ([Drift.HasCentre]): none when the lateral drift
	// relative to the base is a pure translation or none, as on a layout
	// whose seats only lift the balls as they grow, the body and the base
	// expanding alike (or not at all, Scenario.Thermal left zero).
	FigureThermalCentreDistance

	figureEnd
)

var figureNames = [...]string{"AxisAmplification", "LoadAmplification", "PreloadMin", "PreloadMax",
	"PressureRatio", "Stiffness", "AxisCompliance", "FirstFrequency", "Drift", "ThermalCentreDistance"}

// Has reports whether the set f holds every figure of g.
func (f Figure) Has(g Figure) bool { return f&g == g }

// Names returns the Scorecard field names of the figures in f, in the
// order of the constants; nil for the empty set.
func (f Figure) Names() []string {
	var out []string
	for i, n := range figureNames {
		if f&(1<<i) != 0 {
			out = append(out, n)
		}
	}
	return out
}

// String returns the names of the figures in f joined by "|", or "none".
func (f Figure) String() string {
	if f == 0 {
		return "none"
	}
	return strings.Join(f.Names(), "|")
}

// Scorecard holds the design figures of one exactly constrained layout in
// its scenario. Each figure says its unit and which direction is better.
//
// A figure that the scenario cannot support (a stiffness without
// materials, a pressure ratio without an allowable, a frequency without
// an inertia) is 0 and its bit is set in Unavailable: test
// card.Unavailable.Has(FigureStiffness) before reading Stiffness. The
// record costs no allocation.
type Scorecard struct {
	// Unavailable holds the figures that could not be computed for lack
	// of an input (see [Figure] for what each needs).
	Unavailable Figure

	// WeakestContactIndex and WeakestCentreIndex are the smallest Maxwell
	// indices at the contact points and at the ball centres (0 to 1,
	// higher is better; see [Maxwell]); WeakestAngle is the angle, rad,
	// between the freed motion of the ball centre and the normal at the
	// contact with the weakest centre index, acos of it (lower is
	// better). MaxwellRatio is the smallest ratio of a contact's centre
	// index to its seat's ideal (|sin 2θ| for a vee or rods of half-angle
	// θ, 1 for a flat, the exact value for a socket's own contacts): 1
	// means the layout spends nothing of what the seats allow, whatever
	// their angle (higher is better).
	WeakestContactIndex, WeakestCentreIndex, WeakestAngle, MaxwellRatio float64

	// MinSingular is the smallest singular value of the normalised
	// contact matrix (dimensionless, higher is better), Condition the
	// ratio of the largest to it (lower is better), and Poor reports a
	// condition above DesignCondition.
	MinSingular, Condition float64
	Poor                   bool

	// Amplification is the worst displacement of the point of interest
	// per unit gap error at the contacts, m/m (µm per µm), and
	// AmplificationRSS its root sum of squares; AxisAmplification the
	// worst along Axis (0 without one); Tilt and TiltRSS the same for
	// the rotation, rad/m (µrad per µm). Lower is better. See
	// [Amplification].
	Amplification, AmplificationRSS, AxisAmplification float64
	Tilt, TiltRSS                                      float64

	// LoadAmplification is the largest contact force per newton of the
	// payload's inertial load in its worst direction, N/N (lower is
	// better); unavailable without a payload mass.
	LoadAmplification float64

	// ShockLevel is the acceleration of the base, m/s² in the worst
	// direction, at which the first contact unloads under the preload
	// and gravity (higher is better; +Inf for a massless payload, which
	// no acceleration loads; the scorecard's other unbounded figures
	// are PreloadMin and PreloadMax below).
	ShockLevel float64

	// PreloadMin and PreloadMax bound a common factor on the preload
	// elements: at PreloadMin every contact keeps MinForce under gravity
	// and Shock in the worst direction; at PreloadMax the first contact
	// reaches its allowable peak pressure under the same. A wider window
	// is better; PreloadMin > PreloadMax means no preload works.
	// PreloadMin is +Inf when no factor keeps a contact loaded (the
	// preload does not press it), PreloadMax +Inf when the preload
	// presses no contact (no factor reaches an allowable). PressureRatio is the largest peak
	// pressure over allowable under the preload as given with gravity
	// (lower is better). Each is unavailable without what [Figure] says.
	PreloadMin, PreloadMax, PressureRatio float64

	// Stiffness is the smallest translational stiffness at the point of
	// interest, N/m (the inverse of the largest eigenvalue of the
	// translational block of the compliance there; higher is better);
	// AxisCompliance the compliance along Axis, m/N (lower is better).
	// FirstFrequency is the lowest natural frequency of the payload, Hz
	// (higher is better). Each is unavailable without what [Figure] says.
	Stiffness, AxisCompliance, FirstFrequency float64

	// Drift is the displacement of the point of interest relative to the
	// base per kelvin of uniform temperature change, m/K (lower is
	// better; the magnitude of [Drift.RelativeLinear] per kelvin,
	// independent of where the base is held), and
	// ThermalCentreDistance the lateral distance from it to the thermal
	// centre, m, as [Drift.Distance] (lower is better; unavailable when
	// Drift.HasCentre is false).
	Drift, ThermalCentreDistance float64
}

// Score returns the design figures of the coupling, which must be exactly
// constrained, in the scenario. Every figure comes from the one
// factorisation of the 6×6 contact matrix and agrees with the API it
// summarises ([Stability.Amplification], [Model.Shock], [Model.Stiffness],
// [Stiffness.Compliance], [Stiffness.Modes], [Assembly.Drift]).
//
// A figure the scenario cannot support is marked in
// [Scorecard.Unavailable] (see [Figure]); the others are computed.
//
// Score returns the errors of [Coupling.Contacts], [Analyze] and
// [NewModel], the error of a contact's Hertz law that [Model.Statics]
// returns for a bad input (a ball's or seat's Material refused by
// package hertz, such as a modulus in GPa written as Pa), and an [*InputError] wrapping [ErrNotExact] for a set that
// is not exactly constrained. When the preload and gravity put a contact
// in tension (the part lifts off its seats), it returns one wrapping
// [ErrRange] naming the input that pulls that contact hardest, as the
// caller wrote it ("s.Preloads[0]", "s.Gravity"). When a finite input
// makes a figure overflow, it returns one wrapping [ErrRange] naming it
// ("s.Point" for a point of interest 1e300 m away, "s.Payload.Mass").
func (c Coupling) Score(s Scenario) (Scorecard, error) {
	sc, err := newScorer(c, s)
	if err != nil {
		return Scorecard{}, err
	}
	if err := sc.tension(); err != nil {
		return Scorecard{}, err
	}
	var card Scorecard
	if err := sc.score(&card, allFigures); err != nil {
		return Scorecard{}, err
	}
	return card, nil
}

// tension returns an error naming the scenario's input that pulls hardest
// at the first contact in tension under the preload and gravity, or nil.
func (sc *scorer) tension() error {
	var ts [6]screw.Twist
	if !freedOf(sc.lines[:], &ts) {
		return nil
	}
	grav := r3.Scale(sc.pay.Mass, sc.s.Gravity)
	gw := screw.Wrench{F: grav, M: r3.Cross(sc.pay.Centre, grav)}
	for i, t := range ts {
		f := contactForce(t, sc.pre) + contactForce(t, gw)
		if !(f < 0) {
			continue
		}
		name, pull := "s.Gravity", contactForce(t, gw)
		for j, p := range sc.preloads {
			if g := contactForce(t, p.w); g < pull {
				name, pull = indexed("s.Preloads", j), g
			}
		}
		return &InputError{Field: name, Err: fmt.Errorf(
			"%w: the preload and gravity put contact %s in tension (%.4g N; this input alone pulls it with %.4g N): the part lifts off its seats, and no stiffness, frequency or pressure can be computed; reverse or move the preload",
			ErrRange, labelOf(sc.lines[i].label, i), f, -pull)}
	}
	return nil
}

// finite returns an error wrapping [ErrRange] naming the scenario's input
// whose figures overflowed, or nil when every figure is finite (ShockLevel,
// PreloadMin and PreloadMax may be +Inf, as documented).
func (card *Scorecard) finite() error {
	switch {
	case !allFinite(card.Amplification, card.AmplificationRSS, card.AxisAmplification, card.Tilt, card.TiltRSS,
		card.Stiffness, card.AxisCompliance, card.Drift, card.ThermalCentreDistance):
		return &InputError{Field: "s.Point", Err: fmt.Errorf("%w: a figure at the point of interest overflows: the point is too far from the coupling", ErrRange)}
	case !allFinite(card.LoadAmplification, card.FirstFrequency) || math.IsNaN(card.ShockLevel):
		return &InputError{Field: "s.Payload", Err: fmt.Errorf("%w: a load figure of the payload overflows", ErrRange)}
	case !allFinite(card.PressureRatio) || math.IsNaN(card.PreloadMin) || math.IsInf(card.PreloadMin, -1) ||
		math.IsNaN(card.PreloadMax) || math.IsInf(card.PreloadMax, -1):
		return &InputError{Field: "s.Preloads", Err: fmt.Errorf("%w: a preload figure overflows", ErrRange)}
	case !allFinite(card.WeakestContactIndex, card.WeakestCentreIndex, card.WeakestAngle, card.MaxwellRatio, card.MinSingular, card.Condition):
		return &InputError{Field: "Pairs", Err: fmt.Errorf("%w: a figure of the contact geometry overflows", ErrRange)}
	}
	return nil
}

// figures selects what scorer.score computes.
type figures uint

const (
	figMaxwell figures = 1 << iota
	figSingular
	figError
	figLoads
	figStiffness
	figModes
	figDrift
	allFigures = figMaxwell | figSingular | figError | figLoads | figStiffness | figModes | figDrift
)

// scorer evaluates the figures of a layout quickly: what does not change
// as the grooves turn and the balls move (Hertz constants, allowables,
// seat ideals, expansion data) is held, and the contact lines are set by
// the caller (the optimiser) or by newScorer. Every figure comes from the
// kernel the public API uses: maxwell (Stability), pointError and
// alongAxis (Stability.Amplification), contactForce (Model's statics),
// normalStiffness and stiffnessOf (Model.Stiffness), thermalGap and
// thermalCentre (Assembly.Drift).
type scorer struct {
	s        Scenario
	lines    [6]line // about origin
	ideal    [6]float64
	k        [6]float64 // Hertz F = k δ^(3/2); 0 when the contact has no model
	kerr     error      // why a contact has no Hertz model
	fall     [6]float64 // force at the allowable peak pressure, N; 0 when none on file
	root     [6]r3.Vec  // each contact's seat root, about origin
	alpha    [6]float64 // the seat's α, per contact
	balpha   [6]float64 // the ball's α, per contact
	radius   [6]float64 // the ball's radius, per contact
	wcen     [6]float64 // the contact's weight in the centroid of the ball centres
	origin   r3.Vec
	pre      screw.Wrench  // the preload elements at factor 1, about origin
	preloads []preloadLine // the preload elements, for their rates
	pay      Payload       // Centre about origin
	L        float64
	missing  Figure // the figures the scenario's inputs cannot support, whatever the layout
}

// newScorer prepares the scorer of a coupling: its contacts, their Hertz
// constants and allowables, their seats' ideals and roots.
func newScorer(c Coupling, s Scenario) (*scorer, error) {
	cs, err := c.Contacts()
	if err != nil {
		return nil, err
	}
	m, err := NewModel(cs, s.Preloads, s.Payload)
	if err != nil {
		return nil, scenarioErr(err, c, cs)
	}
	if !m.exact {
		an, _ := Analyze(cs)
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: a scorecard needs six independent contacts, the coupling has %d of rank %d", ErrNotExact, len(cs), an.Rank)}
	}
	if err := checkScenario(&s); err != nil {
		return nil, err
	}
	sc := &scorer{s: s, origin: m.origin, pre: m.preload, preloads: m.preloads, pay: m.payload, L: m.size}
	copy(sc.lines[:], m.lines)
	for i := range cs {
		sf := &m.surf[i]
		if sf.err != nil {
			// A figure is unavailable for an input left out, not for a
			// bad one: a material Statics refuses is refused here too.
			if !sf.missing {
				return nil, scenarioErr(sf.err, c, cs)
			}
			if sc.kerr == nil {
				sc.kerr = sf.err
			}
			continue
		}
		sc.k[i] = sf.k
		if !(sf.allow > 0) {
			sc.missing |= FigurePressureRatio | FigurePreloadMax
		}
		if sf.allow > 0 {
			f, err := sf.pair.LoadForPressure(sf.allow)
			if err != nil {
				return nil, fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
			}
			sc.fall[i] = f
		}
	}
	if sc.kerr != nil {
		sc.missing |= FigurePressureRatio | FigurePreloadMax | FigureStiffness | FigureAxisCompliance | FigureFirstFrequency
	}
	if s.Axis == (r3.Vec{}) {
		sc.missing |= FigureAxisAmplification | FigureAxisCompliance
	}
	if !(s.Payload.Mass > 0) {
		sc.missing |= FigureLoadAmplification | FigureFirstFrequency
	}
	if s.Payload.Inertia == ([3][3]float64{}) {
		sc.missing |= FigureFirstFrequency
	}
	if sc.pre == (screw.Wrench{}) {
		sc.missing |= FigurePreloadMin | FigurePreloadMax
	}
	thermal := s.Thermal.Moving != 0 || s.Thermal.Base != 0
	k := 0
	for _, p := range c.Pairs {
		n := p.Seat.count()
		thermal = thermal || p.Ball.Material.Alpha != 0
		surfs, _, root, alpha := p.Seat.surfaces(p.Ball, cs[k:k+n])
		p.Seat.ideals(cs[k:k+n], sc.ideal[k:k+n])
		for j := 0; j < n; j++ {
			sc.root[k+j] = r3.Sub(surfs[j].anchor(root), m.origin)
			sc.alpha[k+j] = alpha
			thermal = thermal || alpha != 0
			sc.balpha[k+j] = p.Ball.Material.Alpha
			sc.radius[k+j] = p.Ball.Radius
			sc.wcen[k+j] = 1 / float64(n*len(c.Pairs))
		}
		k += n
	}
	if !thermal {
		sc.missing |= FigureDrift | FigureThermalCentreDistance
	}
	return sc, nil
}

// scenarioErr returns an error of NewModel, called by the scorer on the
// contacts cs of coupling c, in the vocabulary of the caller of Score and
// Optimize: "s.Preloads[0]" and "s.Payload" for NewModel's parameters,
// and the pairs' fields for the contacts' (see Coupling.inPairTerms).
func scenarioErr(err error, c Coupling, cs []Contact) error {
	return renamed(c.inPairTerms(err, cs), rename{"preloads", "s.Preloads"}, rename{"payload", "s.Payload"})
}

// checkScenario validates the fields of a scenario that NewModel does not.
func checkScenario(s *Scenario) error {
	for _, f := range []struct {
		name string
		v    r3.Vec
	}{{"s.Point", s.Point}, {"s.Axis", s.Axis}, {"s.Gravity", s.Gravity}, {"s.Thermal.BaseRef", s.Thermal.BaseRef}} {
		if !linalg.Finite3(f.v) {
			return &InputError{Field: f.name, Err: fmt.Errorf("%w: %v", ErrNonFinite, f.v)}
		}
	}
	for _, f := range []struct {
		name string
		v    float64
	}{{"s.Shock", s.Shock}, {"s.MinForce", s.MinForce}, {"s.Thermal.Moving", s.Thermal.Moving}, {"s.Thermal.Base", s.Thermal.Base}} {
		if !linalg.Finite(f.v) {
			return &InputError{Field: f.name, Err: fmt.Errorf("%w: %g", ErrNonFinite, f.v)}
		}
		if f.v < 0 && (f.name == "s.Shock" || f.name == "s.MinForce") {
			return &InputError{Field: f.name, Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, f.v)}
		}
	}
	return nil
}

// score fills the figures selected by need for the scorer's current
// lines, and marks in card.Unavailable those it cannot compute (an
// unavailable figure is set to 0).
func (sc *scorer) score(card *Scorecard, need figures) error {
	card.Unavailable = sc.missing
	var ts [6]screw.Twist
	// One factorisation serves the singular values and, for six
	// independent contacts, the freed twists (as in Analyze).
	var r constraint.Result
	var serr error
	shared := false
	if need&figSingular != 0 {
		serr = sc.factor(&r)
		shared = serr == nil && r.HasFreed
	}
	if shared {
		for i := range ts {
			ts[i] = screw.Twist(r.Freed[i])
		}
	} else if !freedOf(sc.lines[:], &ts) {
		return &InputError{Field: "Pairs", Err: fmt.Errorf("%w: the six contacts are singular to working precision", ErrNotExact)}
	}
	if need&figMaxwell != 0 {
		sc.maxwell(card, &ts)
	}
	if need&figSingular != 0 {
		if serr != nil {
			return serr
		}
		card.MinSingular, card.Condition = r.Singular[r.K-1], r.Condition
		card.Poor = r.Condition > DesignCondition
	}
	p := r3.Sub(sc.s.Point, sc.origin)
	if need&figError != 0 {
		sc.pointError(card, &ts, p)
	}
	var f0 [6]float64
	if need&(figLoads|figStiffness|figModes) != 0 {
		sc.loads(card, &ts, &f0)
	}
	if need&(figStiffness|figModes) != 0 {
		if err := sc.stiffness(card, &f0, need); err != nil {
			return err
		}
	}
	if need&figDrift != 0 {
		sc.drift(card, &ts, p)
	}
	card.zeroUnavailable()
	return card.finite()
}

// zeroUnavailable sets the figures marked unavailable to 0.
func (card *Scorecard) zeroUnavailable() {
	u := card.Unavailable
	if u == 0 {
		return
	}
	for _, f := range [...]struct {
		bit Figure
		v   *float64
	}{
		{FigureAxisAmplification, &card.AxisAmplification}, {FigureLoadAmplification, &card.LoadAmplification},
		{FigurePreloadMin, &card.PreloadMin}, {FigurePreloadMax, &card.PreloadMax}, {FigurePressureRatio, &card.PressureRatio},
		{FigureStiffness, &card.Stiffness}, {FigureAxisCompliance, &card.AxisCompliance}, {FigureFirstFrequency, &card.FirstFrequency},
		{FigureDrift, &card.Drift}, {FigureThermalCentreDistance, &card.ThermalCentreDistance},
	} {
		if u&f.bit != 0 {
			*f.v = 0
		}
	}
}

// maxwell fills the Maxwell figures from the freed twists ts.
func (sc *scorer) maxwell(card *Scorecard, ts *[6]screw.Twist) {
	card.WeakestContactIndex, card.WeakestCentreIndex, card.MaxwellRatio = 1, 1, math.Inf(1)
	for i, t := range ts {
		l := &sc.lines[i]
		freed, idx, ci := maxwell(t, l)
		card.WeakestContactIndex = min(card.WeakestContactIndex, idx)
		if ci <= card.WeakestCentreIndex {
			card.WeakestCentreIndex = ci
			vc := freed.At(l.p)
			if l.ball {
				vc = freed.At(l.centre)
			}
			// The angle from its sine and cosine: accurate near 0,
			// where acos of the index is not.
			card.WeakestAngle = math.Atan2(linalg.Norm3(r3.Cross(l.n, vc)), math.Abs(r3.Dot(l.n, vc)))
		}
		if sc.ideal[i] > 0 {
			card.MaxwellRatio = min(card.MaxwellRatio, ci/sc.ideal[i])
		}
	}
}

// factor writes the constraint analysis of the scorer's lines into r:
// the singular values of the normalised contact matrix and the freed
// twists.
func (sc *scorer) factor(r *constraint.Result) error {
	var ws [6]constraint.Wrench
	for i := range sc.lines {
		l := &sc.lines[i]
		ws[i] = constraint.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}
	}
	if err := constraint.Analyze(ws[:], r); err != nil {
		return &InputError{Field: "Pairs", Err: err}
	}
	return nil
}

// pointError fills the amplification figures at the point p (about
// origin).
func (sc *scorer) pointError(card *Scorecard, ts *[6]screw.Twist, p r3.Vec) {
	var d, w [6]r3.Vec
	card.Amplification, card.AmplificationRSS, card.Tilt, card.TiltRSS = pointError(ts, p, &d, &w)
	if u, ok := linalg.Unit3(sc.s.Axis); ok {
		card.AxisAmplification, _ = alongAxis(&d, u)
	}
}

// loads fills the load, shock and preload figures, and sets f0 to the
// contact forces under the preload and gravity.
func (sc *scorer) loads(card *Scorecard, ts *[6]screw.Twist, f0 *[6]float64) {
	grav := r3.Scale(sc.pay.Mass, sc.s.Gravity)
	gw := screw.Wrench{F: grav, M: r3.Cross(sc.pay.Centre, grav)}
	card.ShockLevel, card.LoadAmplification = math.Inf(1), 0
	card.PreloadMin, card.PreloadMax, card.PressureRatio = 0, math.Inf(1), 0
	for i, t := range ts {
		a := contactForce(t, sc.pre)
		e := contactForce(t, gw)
		f0[i] = a + e
		tc := linalg.Norm3(t.At(sc.pay.Centre))
		gain := sc.pay.Mass * tc
		if sc.pay.Mass > 0 {
			card.LoadAmplification = max(card.LoadAmplification, tc)
		}
		switch {
		case f0[i] <= 0:
			card.ShockLevel = 0
		case gain > 0:
			card.ShockLevel = min(card.ShockLevel, f0[i]/gain)
		}
		need := sc.s.MinForce - e + sc.s.Shock*gain
		switch {
		case a > 0:
			card.PreloadMin = max(card.PreloadMin, need/a)
			if sc.fall[i] > 0 {
				card.PreloadMax = min(card.PreloadMax, (sc.fall[i]-e-sc.s.Shock*gain)/a)
			}
		case need > 0:
			card.PreloadMin = math.Inf(1)
		}
		if sc.fall[i] > 0 && f0[i] > 0 {
			card.PressureRatio = max(card.PressureRatio, math.Cbrt(f0[i]/sc.fall[i]))
		}
	}
}

// stiffness fills the stiffness figures selected by need at the contact
// forces f0. The stiffness needs every contact loaded (Hertz stiffness at
// zero force is zero) and a Hertz model at every contact; without them,
// or when the stiffness is singular (a preload rate that cancels a
// contact), the figures are marked unavailable. It returns an error
// naming "s.Point" when the compliance there overflows.
func (sc *scorer) stiffness(card *Scorecard, f0 *[6]float64, need figures) error {
	const stiff = FigureStiffness | FigureAxisCompliance | FigureFirstFrequency
	if sc.kerr != nil {
		return nil
	}
	var kn [6]float64
	for i := range f0 {
		if !(f0[i] > 0) {
			card.Unavailable |= stiff
			return nil
		}
		kn[i] = normalStiffness(sc.k[i], f0[i])
	}
	st := stiffnessOf(sc.lines[:], kn[:], sc.preloads, sc.origin, sc.L, sc.pay)
	if need&figStiffness != 0 {
		c, err := translationalCompliance(&st, sc.s.Point)
		switch {
		case err == nil:
			card.Stiffness = 1 / largestEigenSym3(&c.Matrix)
			// A zero Axis marks AxisCompliance unavailable (the
			// scenario's availability); Along's error says the same.
			card.AxisCompliance, _ = c.Along(sc.s.Axis)
		case errors.Is(err, ErrRange):
			return &InputError{Field: "s.Point", Err: errors.Unwrap(err)}
		default:
			card.Unavailable |= stiff
		}
	}
	if need&figModes != 0 && !sc.missing.Has(FigureFirstFrequency) {
		if f, ok := firstFrequency(&st); ok {
			card.FirstFrequency = f
		} else {
			card.Unavailable |= FigureFirstFrequency
		}
	}
	return nil
}

// drift fills the thermal figures at the point p (about origin).
func (sc *scorer) drift(card *Scorecard, ts *[6]screw.Twist, p r3.Vec) {
	th := &sc.s.Thermal
	var x screw.Twist
	var cen, up r3.Vec
	strain := max(math.Abs(th.Moving), math.Abs(th.Base)) // per kelvin, as Drift's for ΔT 1 K
	for i, t := range ts {
		strain = max(strain, math.Abs(sc.balpha[i]), math.Abs(sc.alpha[i]))
		l := &sc.lines[i]
		e := thermalGap(th, sc.balpha[i], sc.radius[i], sc.alpha[i],
			r3.Add(l.centre, sc.origin), r3.Add(l.p, sc.origin), l.n, r3.Add(sc.root[i], sc.origin))
		x = x.Add(t.Scale(-e))
		cen = r3.Add(cen, r3.Scale(sc.wcen[i], l.centre))
		up = r3.Add(up, l.n)
	}
	xg := global(x, sc.origin)
	card.Drift = linalg.Norm3(relativeMotion(xg, th.Moving, th.Base, th.BaseRef, sc.s.Point))
	if _, ok, dist := thermalCentre(xg, th.Moving, th.Base, th.BaseRef, r3.Add(cen, sc.origin), up, sc.s.Point, strain); ok {
		card.ThermalCentreDistance = dist
	} else {
		card.Unavailable |= FigureThermalCentreDistance
	}
}

// largestEigen3 returns the largest eigenvalue of the symmetric positive
// semi-definite translational block (the top-left 3×3) of a, by one-sided
// Jacobi (its singular values are its eigenvalues).
func largestEigen3(a *[6][6]float64) float64 {
	var m [9]float64
	for i := range 3 {
		for j := range 3 {
			m[3*j+i] = a[i][j]
		}
	}
	var v [9]float64
	var sv [3]float64
	linalg.Jacobi(m[:], 3, 3, v[:])
	linalg.SortColumns(m[:], 3, 3, v[:], sv[:])
	return sv[0]
}

// firstFrequency returns the lowest natural frequency of Stiffness.Modes,
// Hz, from the eigenvalues alone, and false where Modes returns an error.
func firstFrequency(st *Stiffness) (float64, bool) {
	p := st.payload
	if st.length == 0 || !(p.Mass > 0) || p.Inertia == ([3][3]float64{}) {
		return 0, false
	}
	b, _, err := st.reduced()
	if err != nil {
		return 0, false
	}
	var w [6]float64
	if !linalg.EigenvaluesSym6(&b, &w) {
		return 0, false
	}
	var big float64
	for i := range 6 {
		big = max(big, math.Abs(w[i]))
	}
	if !(w[0] > singularStiffness*big) {
		return 0, false
	}
	f := math.Sqrt(w[0]) / (2 * math.Pi)
	return f, allFinite(f)
}

// translationalCompliance returns the Compliance of st.Compliance(at)
// with only its translational block (the top-left 3×3, all that Along
// and the scorecard's stiffness read) filled, and the same errors: from
// three Cholesky solves instead of six, C_VV = T·K⁻¹·Tᵀ with T the three
// translational rows of the shift S times the unscaling D (see
// Compliance).
func translationalCompliance(st *Stiffness, at r3.Vec) (Compliance, error) {
	if st.length == 0 {
		return Compliance{}, errZeroStiffness
	}
	l := st.k
	if !linalg.Cholesky6(&l, singularStiffness) {
		return Compliance{}, &InputError{Field: "cs", Err: fmt.Errorf("%w: the stiffness is singular or not positive definite: some motion is not resisted", ErrDegenerate)}
	}
	r := r3.Sub(at, st.origin)
	inv := 1 / st.length
	// Row a of T: e_a in the translations, the row of −[r]× over L in
	// the rotations.
	t := [3][6]float64{
		{1, 0, 0, 0, r.Z * inv, -r.Y * inv},
		{0, 1, 0, -r.Z * inv, 0, r.X * inv},
		{0, 0, 1, r.Y * inv, -r.X * inv, 0},
	}
	var y [3][6]float64 // K⁻¹ Tᵀ, by columns
	for b := range 3 {
		y[b] = t[b]
		linalg.CholeskySolve6(&l, &y[b])
	}
	c := Compliance{Point: at}
	for a := range 3 {
		for b := range 3 {
			var v float64
			for p := range 6 {
				v += t[a][p] * y[b][p]
			}
			c.Matrix[a][b] = v
		}
	}
	for a := range 3 {
		for b := range a {
			c.Matrix[a][b] = (c.Matrix[a][b] + c.Matrix[b][a]) / 2
			c.Matrix[b][a] = c.Matrix[a][b]
		}
		if !allFinite(c.Matrix[a][:3]...) {
			return Compliance{}, &InputError{Field: "at", Err: fmt.Errorf("%w: the compliance at %v overflows: the point is too far from the coupling", ErrRange, at)}
		}
	}
	return c, nil
}

// largestEigenSym3 returns the largest eigenvalue of the symmetric
// translational block (the top-left 3×3) of a, in closed form (Smith
// 1961, "Eigenvalues of a symmetric 3 × 3 matrix", Commun. ACM 4(4)):
// with q the mean of the diagonal, p² the mean square of A − qI's
// entries over two, and B = (A − qI)/p, the eigenvalues are
// q + 2p·cos(φ + 2πk/3) with φ = acos(det(B)/2)/3; the largest is k = 0.
// Where two eigenvalues nearly coincide (|det(B)/2| within 1e-6 of 1, or
// A a multiple of I) it returns largestEigen3's instead: there the closed
// form would lose their split to √ε. It is accurate to a small multiple
// of ε times the largest |eigenvalue|.
func largestEigenSym3(a *[6][6]float64) float64 {
	a00, a11, a22 := a[0][0], a[1][1], a[2][2]
	a01, a02, a12 := a[0][1], a[0][2], a[1][2]
	q := (a00 + a11 + a22) / 3
	p1 := a01*a01 + a02*a02 + a12*a12
	b00, b11, b22 := a00-q, a11-q, a22-q
	p := math.Sqrt((b00*b00 + b11*b11 + b22*b22 + 2*p1) / 6)
	if !(p > 0) || p < 1e-300*math.Abs(q) || math.IsInf(p, 0) {
		return largestEigen3(a) // a multiple of I, or out of the range of the squares
	}
	ip := 1 / p
	b00, b11, b22 = b00*ip, b11*ip, b22*ip
	b01, b02, b12 := a01*ip, a02*ip, a12*ip
	det := b00*(b11*b22-b12*b12) - b01*(b01*b22-b12*b02) + b02*(b01*b12-b11*b02)
	h := det / 2
	if !(math.Abs(h) < 1-1e-6) {
		// Two eigenvalues (nearly) equal: h within rounding of ±1 loses
		// their split, to √ε of their size. Jacobi keeps it.
		return largestEigen3(a)
	}
	return q + 2*p*math.Cos(math.Acos(h)/3)
}
