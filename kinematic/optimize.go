package kinematic

import (
	"fmt"
	"math"
	"math/rand/v2"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Region is where a ball may be placed: a box or a disc in the plane of
// its seat (normal to the seat's Up) centred on the ball's drawn centre.
// The zero Region keeps the ball where it is.
type Region struct {
	// HalfWidth gives a box of ±HalfWidth[0] along the seat plane's first
	// axis ([FrameX] projected) and ±HalfWidth[1] along the second (Up ×
	// the first), m. Radius, when positive, gives a disc instead, m.
	HalfWidth [2]float64
	Radius    float64
}

// Objective is the design figure that [Optimize] improves (see
// [Scorecard] for each figure's meaning and unit).
type Objective int

const (
	// MinAmplification minimises Scorecard.Amplification: the worst
	// displacement of the point of interest per unit gap error. The zero
	// value: the figure that decides most layouts.
	MinAmplification Objective = iota
	// MinDrift minimises Scorecard.Drift, the thermal drift of the point.
	MinDrift
	// MinCompliance minimises the compliance at the point: AxisCompliance
	// along Scenario.Axis, or 1/Stiffness without an axis.
	MinCompliance
	// MaxShockLevel maximises Scorecard.ShockLevel.
	MaxShockLevel
	// MaxFirstFrequency maximises Scorecard.FirstFrequency.
	MaxFirstFrequency
	// MaxContactIndex maximises Scorecard.WeakestContactIndex, the
	// weakest Maxwell index at the contact points: a screen, not a design
	// figure (see package documentation).
	MaxContactIndex
	// MaxCentreIndex maximises Scorecard.WeakestCentreIndex, the weakest
	// Maxwell index at the ball centres: a screen too.
	MaxCentreIndex
)

// String returns the objective's name.
func (o Objective) String() string {
	switch o {
	case MinAmplification:
		return "MinAmplification"
	case MinDrift:
		return "MinDrift"
	case MinCompliance:
		return "MinCompliance"
	case MaxShockLevel:
		return "MaxShockLevel"
	case MaxFirstFrequency:
		return "MaxFirstFrequency"
	case MaxContactIndex:
		return "MaxContactIndex"
	case MaxCentreIndex:
		return "MaxCentreIndex"
	}
	return fmt.Sprintf("Objective(%d)", int(o))
}

// OptimizeOptions holds options for [Optimize]; the zero value and a nil
// pointer mean defaults: MinAmplification over every groove azimuth,
// screened by a condition number of at most [DesignCondition].
type OptimizeOptions struct {
	Objective Objective

	// Windows limits each pair's groove azimuth, one entry per pair
	// (entries for seats that are not grooves are ignored); nil allows
	// every azimuth. With Regions, radial windows are taken at the drawn
	// ball positions.
	Windows []Window

	// Regions lets each pair's ball move within a region, one entry per
	// pair; nil or a zero Region keeps the ball where it is drawn.
	Regions []Region

	// HalfAngles lists the half-angles, rad, in (0, π/2), that every
	// groove seat may take (each chooses one); nil keeps them as drawn.
	HalfAngles []float64

	// MinCentreIndex is a floor on Scorecard.WeakestCentreIndex, the
	// Maxwell index at the ball centres, and MinContactIndex one on
	// Scorecard.WeakestContactIndex, the index at the contact points:
	// each in [0, 1) (a floor of 1 would ask for an exact value that
	// rounding cannot give), zero meaning no floor. MaxPressureRatio is a
	// ceiling on Scorecard.PressureRatio; zero means none.
	MinCentreIndex, MinContactIndex, MaxPressureRatio float64

	// MaxCondition is a ceiling on Scorecard.Condition, the condition
	// number of the normalised contact matrix, ≥ 1: zero means
	// DesignCondition (10), +Inf no ceiling. It is on by default because
	// an objective alone can prefer a near-mechanism: the error at a
	// point whose loose motion pivots about that point is small however
	// loose the coupling is (on a canted layout MinAmplification alone
	// turned every groove tangential, to a condition of 38.7, and with
	// the point below the balls to 2.2e4). Optimum.Binding names it
	// when it holds the optimum back.
	MaxCondition float64

	// TradeOff, when set, asks for the trade-off curve between the
	// objective and a second one: Points layouts (at least 2) on the
	// Pareto front, from the best of the first to the best of the second.
	TradeOff *TradeOff

	// Seed makes the random starts of a search with ball regions
	// reproducible.
	Seed uint64
}

// TradeOff names the second objective of a trade-off curve.
type TradeOff struct {
	Objective Objective
	Points    int
}

// Optimum is what [Optimize] found.
type Optimum struct {
	// Coupling is the best layout: the input with its grooves turned,
	// balls moved and half-angles chosen.
	Coupling Coupling

	// Value is the objective's figure for it (in the figure's unit, the
	// sign as reported by the Scorecard). Azimuths holds each pair's
	// groove azimuth from [Radial] at the drawn ball positions, rad (zero
	// for seats that are not grooves).
	Value    float64
	Azimuths []float64

	// Score, Start and Bisector are the scorecards of the optimum, of the
	// coupling as given, and (when HasBisector: three grooves on three
	// balls) of the grooves on the bisectors of the ball triangle as
	// drawn; BisectorFeasible reports whether that layout meets the
	// windows and constraints (the optimum is then at least as good).
	Score, Start, Bisector        Scorecard
	HasBisector, BisectorFeasible bool

	// Binding names the constraints that hold the optimum back:
	// "Windows[i].Min", "Windows[i].Max", "Regions[i]", "MinCentreIndex",
	// "MinContactIndex", "MaxPressureRatio", "MaxCondition" (the default
	// screen included).
	Binding []string

	// Front is the trade-off curve when one was asked for: layouts on
	// the Pareto front, ordered from the best of the first objective to
	// the best of the second.
	Front []FrontPoint

	// Status says how the search ended: converged, held back by the
	// constraints in Binding, or stopped by its evaluation budget.
	Status Status

	// Evaluations is the number of layouts evaluated.
	Evaluations int
}

// Status is how a search by [Optimize] ended.
type Status int

const (
	// Converged: the local search from the best layout found converged
	// (or every layout was enumerated), and no constraint binds.
	Converged Status = iota

	// Constrained: the optimum sits on a constraint, which
	// Optimum.Binding names (a window edge, a region's boundary, the
	// Maxwell floor, the pressure ceiling); relaxing it would improve
	// the objective.
	Constrained

	// EvaluationLimit: the local search from the best layout found
	// stopped at its evaluation budget before it converged; the result is
	// the best layout seen, not a converged optimum.
	EvaluationLimit
)

// String returns the status's name.
func (s Status) String() string {
	switch s {
	case Converged:
		return "Converged"
	case Constrained:
		return "Constrained"
	case EvaluationLimit:
		return "EvaluationLimit"
	}
	return fmt.Sprintf("Status(%d)", int(s))
}

// FrontPoint is one layout of a trade-off curve.
type FrontPoint struct {
	Coupling      Coupling
	Score         Scorecard
	First, Second float64 // the two objectives' figures
}

// Optimize returns the layout of the coupling that is best for the
// objective in the scenario: groove azimuths within their windows, ball
// positions within their regions and groove half-angles from a list, with
// a floor on the Maxwell index and a ceiling on the contact pressure as
// constraints. It reports the optimum's scorecard beside those of the
// coupling as given and of the bisector layout, which constraints bind,
// and on request the trade-off curve with a second objective.
//
// Method: the figures are smooth, or piecewise smooth (minima, worst
// cases), in the variables, which are mapped to unbounded ones
// (az = mid + half·sin u for a window narrower than π, the azimuth itself
// when every direction is allowed; the sine map per axis of a box, a disc
// as a box projected onto it). The search is global then local: a grid of
// about 343 layouts over the azimuths (and seeded random ball positions
// with regions), then Nelder–Mead (Nelder & Mead 1965, Computer Journal
// 7(4)) from the four best grid points that are not grid neighbours of a
// better one, the coupling as given and the bisector layout, and a
// polish of the best with a small simplex, once per combination of
// half-angles. The constraints are exact penalties, and the result is the
// best feasible layout seen, so it is never worse than any feasible start,
// the bisector layout included. The trade-off curve uses the ε-constraint
// method: the first objective optimised with the second bounded at evenly
// spaced levels between the two single-objective optima (Haimes, Lasdon &
// Wismer 1971, IEEE Trans. SMC 1(3)); dominated points are dropped.
//
// Optimize returns the errors of [Coupling.Score], and [*InputError]s:
// "opt.Objective" for an unknown objective or one whose figure the
// scenario cannot give (MaxShockLevel without a payload mass,
// MaxFirstFrequency without a payload inertia, MinCompliance or
// MaxShockLevel without preload); "opt.Windows" or "opt.Regions" of the
// wrong length, "opt.Windows[i]" inverted or not finite,
// "opt.Windows[i].Min" or ".Max" beyond ±2π rad, "opt.Regions[i]"
// negative or not finite; "opt.HalfAngles[i]" outside (0, π/2);
// "opt.MinCentreIndex" or "opt.MinContactIndex" outside [0, 1),
// "opt.MaxPressureRatio" negative, "opt.MaxCondition" below 1;
// "opt.TradeOff" with fewer than two points; and one wrapping ErrRange
// naming the constraints when no layout seen meets them.
func Optimize(c Coupling, s Scenario, opt *OptimizeOptions) (Optimum, error) {
	var o OptimizeOptions
	if opt != nil {
		o = *opt
	}
	p, err := newOptProblem(c, s, &o)
	if err != nil {
		return Optimum{}, err
	}
	var res Optimum
	if err := p.sc.score(&res.Start, allFigures); err != nil {
		return Optimum{}, err
	}
	if err := p.checkObjective(o.Objective, &res.Start, "opt.Objective"); err != nil {
		return Optimum{}, err
	}
	if o.MaxPressureRatio > 0 && res.Start.Unavailable.Has(FigurePressureRatio) {
		return Optimum{}, &InputError{Field: "opt.MaxPressureRatio", Err: fmt.Errorf(
			"%w: the pressure ratio cannot be computed for the coupling as given (a contact without both materials' allowables, or without preload), so the ceiling cannot be held", ErrDegenerate)}
	}
	if o.TradeOff != nil {
		if o.TradeOff.Points < 2 {
			return Optimum{}, &InputError{Field: "opt.TradeOff.Points", Err: fmt.Errorf("%w: need at least 2, got %d", ErrRange, o.TradeOff.Points)}
		}
		if err := p.checkObjective(o.TradeOff.Objective, &res.Start, "opt.TradeOff.Objective"); err != nil {
			return Optimum{}, err
		}
	}
	best, ok := p.search(o.Objective, nil)
	if !ok {
		return Optimum{}, &InputError{Field: "opt", Err: fmt.Errorf("%w: no layout seen meets the constraints (MinCentreIndex %g, MinContactIndex %g, MaxPressureRatio %g, MaxCondition %g) within the windows and regions",
			ErrRange, o.MinCentreIndex, o.MinContactIndex, o.MaxPressureRatio, p.o.MaxCondition)}
	}
	res.Coupling, res.Azimuths = p.coupling(best.x, best.combo)
	p.set(best.x, best.combo)
	if err := p.sc.score(&res.Score, allFigures); err != nil {
		return Optimum{}, err
	}
	res.Value = figure(o.Objective, &res.Score)
	res.Binding = p.binding(best.x, &res.Score)
	switch {
	case p.limited[best.combo]:
		res.Status = EvaluationLimit
	case len(res.Binding) > 0:
		res.Status = Constrained
	}
	if baz, ok := p.bisectorAzimuths(); ok && p.ownCombo >= 0 {
		_, in := p.vars(baz)
		p.setLayout(baz, make([]r3.Vec, len(p.pairs)), nil, p.ownCombo)
		if err := p.sc.score(&res.Bisector, allFigures); err == nil {
			res.HasBisector = true
			res.BisectorFeasible = in && p.violation(&res.Bisector) == 0
		}
	}
	if o.TradeOff != nil {
		front, err := p.front(o.Objective, o.TradeOff.Objective, o.TradeOff.Points, best)
		if err != nil {
			return Optimum{}, err
		}
		res.Front = front
	}
	res.Evaluations = p.evals
	return res, nil
}

// figure returns the objective's figure from a scorecard, and cost the
// value to minimise.
func figure(obj Objective, c *Scorecard) float64 {
	switch obj {
	case MinDrift:
		return c.Drift
	case MinCompliance:
		if c.AxisCompliance > 0 {
			return c.AxisCompliance
		}
		return 1 / c.Stiffness
	case MaxShockLevel:
		return c.ShockLevel
	case MaxFirstFrequency:
		return c.FirstFrequency
	case MaxContactIndex:
		return c.WeakestContactIndex
	case MaxCentreIndex:
		return c.WeakestCentreIndex
	}
	return c.Amplification
}

func cost(obj Objective, c *Scorecard) float64 {
	switch obj {
	case MaxShockLevel, MaxFirstFrequency, MaxContactIndex, MaxCentreIndex:
		return -figure(obj, c)
	}
	return figure(obj, c)
}

// need returns the figures an objective and the constraints use.
func (p *optProblem) need(obj Objective) figures {
	f := figMaxwell | figSingular // for the Maxwell floors, the condition screen and the binding report
	switch obj {
	case MinAmplification:
		f |= figError
	case MinDrift:
		f |= figDrift
	case MinCompliance:
		f |= figStiffness | figLoads
	case MaxShockLevel:
		f |= figLoads
	case MaxFirstFrequency:
		f |= figModes | figLoads
	}
	if p.o.MaxPressureRatio > 0 {
		f |= figLoads
	}
	return f
}

// checkObjective reports an objective the scenario cannot give.
func (p *optProblem) checkObjective(obj Objective, start *Scorecard, field string) error {
	switch obj {
	case MinAmplification, MinDrift, MaxContactIndex, MaxCentreIndex:
	case MinCompliance:
		if len(p.sc.s.Preloads) == 0 {
			return &InputError{Field: field, Err: fmt.Errorf("%w: %v needs preload elements (Scenario.Preloads) to set the contact stiffness", ErrDegenerate, obj)}
		}
	case MaxShockLevel:
		if !(p.sc.pay.Mass > 0) || len(p.sc.s.Preloads) == 0 {
			return &InputError{Field: field, Err: fmt.Errorf("%w: %v needs a payload mass and preload elements", ErrDegenerate, obj)}
		}
	case MaxFirstFrequency:
		if !(p.sc.pay.Mass > 0) || p.sc.pay.Inertia == ([3][3]float64{}) || len(p.sc.s.Preloads) == 0 {
			return &InputError{Field: field, Err: fmt.Errorf("%w: %v needs a payload with mass and inertia, and preload elements", ErrDegenerate, obj)}
		}
	default:
		return &InputError{Field: field, Err: fmt.Errorf("%w: unknown objective %d", ErrRange, int(obj))}
	}
	var need Figure
	switch obj {
	case MinDrift:
		need = FigureDrift
	case MinCompliance:
		need = FigureStiffness
		if p.sc.s.Axis != (r3.Vec{}) {
			need = FigureAxisCompliance
		}
	case MaxFirstFrequency:
		need = FigureFirstFrequency
	}
	if need != 0 && start.Unavailable.Has(need) {
		return &InputError{Field: field, Err: fmt.Errorf("%w: %v needs Scorecard's %v, which the scenario cannot give for the coupling as given (see Figure)", ErrDegenerate, obj, need)}
	}
	return nil
}

// optProblem evaluates layouts of a coupling as its variables change.
type optProblem struct {
	c     Coupling
	o     OptimizeOptions
	sc    *scorer
	pairs []optPair
	nvar  int
	evals int

	// limited reports, per half-angle combination, whether the last
	// search's polish of its best layout ran out of evaluations.
	limited []bool

	gridGap  float64     // the largest gap between neighbours of the start grid
	combos   [][]float64 // half-angle choices, one per groove pair, per combination
	ownCombo int         // index of the drawn half-angles in combos (−1 if not there)
}

// optPair is one pair's variables.
type optPair struct {
	first, count int
	centre       r3.Vec
	radius       float64
	up, rad      r3.Vec // unit Up and radial at the drawn positions (grooves)
	groove       bool
	az0          float64 // the drawn azimuth from radial
	lo, hi       float64 // allowed azimuths from radial
	azVar        int     // index of the azimuth variable, −1 if fixed
	normals      [3]r3.Vec
	e1, e2       r3.Vec // the seat plane's axes
	box          [2]float64
	disc         float64
	posVar       int    // index of the first position variable, −1 if fixed
	grooveIdx    int    // index among groove pairs
	root0        r3.Vec // the seat's root about the origin, as drawn
	periodic     bool   // every azimuth allowed: the variable is the azimuth itself
}

func newOptProblem(c Coupling, s Scenario, o *OptimizeOptions) (*optProblem, error) {
	sc, err := newScorer(c, s)
	if err != nil {
		return nil, err
	}
	n := len(c.Pairs)
	if o.Windows != nil && len(o.Windows) != n {
		return nil, &InputError{Field: "opt.Windows", Err: fmt.Errorf("%w: %d windows for %d pairs", ErrRange, len(o.Windows), n)}
	}
	if o.Regions != nil && len(o.Regions) != n {
		return nil, &InputError{Field: "opt.Regions", Err: fmt.Errorf("%w: %d regions for %d pairs", ErrRange, len(o.Regions), n)}
	}
	for i, h := range o.HalfAngles {
		if err := checkHalfAngle(h, indexed("opt.HalfAngles", i)); err != nil {
			return nil, err
		}
	}
	for _, f := range []struct {
		name string
		v    float64
	}{{"opt.MinCentreIndex", o.MinCentreIndex}, {"opt.MinContactIndex", o.MinContactIndex}} {
		if !(f.v >= 0 && f.v < 1) {
			return nil, &InputError{Field: f.name, Err: fmt.Errorf("%w: a floor on a Maxwell index must be in [0, 1), got %g", ErrRange, f.v)}
		}
	}
	if o.MaxCondition == 0 {
		o.MaxCondition = DesignCondition
	}
	if !(o.MaxCondition >= 1) {
		return nil, &InputError{Field: "opt.MaxCondition", Err: fmt.Errorf("%w: must be ≥ 1 (or 0 for DesignCondition), got %g", ErrRange, o.MaxCondition)}
	}
	if !linalg.Finite(o.MaxPressureRatio) || o.MaxPressureRatio < 0 {
		return nil, &InputError{Field: "opt.MaxPressureRatio", Err: fmt.Errorf("%w: must be finite and ≥ 0, got %g", ErrRange, o.MaxPressureRatio)}
	}
	p := &optProblem{c: c, o: *o, sc: sc}
	first, ng := 0, 0
	var own []float64
	for i, pr := range c.Pairs {
		op := optPair{first: first, count: pr.Seat.count(), centre: pr.Ball.Centre, radius: pr.Ball.Radius, azVar: -1, posVar: -1, grooveIdx: -1}
		up, _ := unitOf(pr.Seat.up(), "")
		op.up = up
		op.e1 = frameX(up)
		op.e2 = r3.Cross(up, op.e1)
		for k := 0; k < op.count; k++ {
			op.normals[k] = sc.lines[first+k].n
		}
		op.root0 = sc.root[first]
		if g, ok := pr.Seat.(grooveSeat); ok {
			own = append(own, g.halfAngle())
			op.grooveIdx = ng
			ng++
			if err := p.addGroove(&op, i, g); err != nil {
				return nil, err
			}
		}
		if o.Regions != nil {
			if err := p.addRegion(&op, o.Regions[i], indexed("opt.Regions", i)); err != nil {
				return nil, err
			}
		}
		p.pairs = append(p.pairs, op)
		first += op.count
	}
	if err := p.setCombos(own, ng); err != nil {
		return nil, err
	}
	return p, nil
}

// addGroove makes the azimuth of the groove seat g of pair i a variable
// of op, within its window if the options give one.
func (p *optProblem) addGroove(op *optPair, i int, g grooveSeat) error {
	c, o, up := p.c, &p.o, op.up
	_, dir, _ := g.groove("")
	rad, err := c.reference(i, up, Radial)
	if err != nil {
		return err
	}
	op.groove, op.rad = true, rad
	op.az0 = azimuthFrom(dir, up, rad)
	op.lo, op.hi = -math.Pi/2, math.Pi/2
	if o.Windows != nil {
		w := o.Windows[i]
		field := indexed("opt.Windows", i)
		if !linalg.Finite(w.Min) || !linalg.Finite(w.Max) {
			return &InputError{Field: field, Err: fmt.Errorf("%w: %+v", ErrNonFinite, w)}
		}
		for _, e := range [...]struct {
			name string
			v    float64
		}{{"Min", w.Min}, {"Max", w.Max}} {
			// An azimuth is an angle in radians: one turn each way
			// holds every window; a limit beyond it is a slip (degrees
			// for radians), not a window.
			if math.Abs(e.v) > 2*math.Pi {
				return &InputError{Field: field + "." + e.name, Err: fmt.Errorf(
					"%w: an azimuth in radians must lie within ±2π, got %g (if that is degrees, it is %.4g rad)", ErrRange, e.v, e.v*math.Pi/180)}
			}
		}
		if w.Min > w.Max {
			return &InputError{Field: field, Err: fmt.Errorf("%w: Min %g > Max %g", ErrRange, w.Min, w.Max)}
		}
		x, err := c.reference(i, up, w.From)
		if err != nil {
			if ie, ok := err.(*InputError); ok && ie.Field == "ref" {
				ie.Field = field + ".From"
			}
			return err
		}
		if w.Max-w.Min < math.Pi {
			off := math.Atan2(r3.Dot(up, r3.Cross(rad, x)), r3.Dot(rad, x))
			op.lo, op.hi = w.Min+off, w.Max+off
		}
	}
	op.periodic = op.hi-op.lo >= math.Pi
	if op.hi > op.lo {
		op.azVar = p.nvar
		p.nvar++
	}
	return nil
}

// addRegion makes the position of op's ball in its seat plane two
// variables when the region rg (named field) allows it to move.
func (p *optProblem) addRegion(op *optPair, rg Region, field string) error {
	for _, v := range []float64{rg.HalfWidth[0], rg.HalfWidth[1], rg.Radius} {
		if !linalg.Finite(v) || v < 0 {
			return &InputError{Field: field, Err: fmt.Errorf("%w: sizes must be finite and ≥ 0, got %+v", ErrRange, rg)}
		}
	}
	if rg.Radius > 0 {
		op.disc = rg.Radius
		op.box = [2]float64{rg.Radius, rg.Radius}
	} else {
		op.box = rg.HalfWidth
	}
	if op.box[0] > 0 || op.box[1] > 0 {
		op.posVar = p.nvar
		p.nvar += 2
	}
	return nil
}

// setCombos sets the half-angle combinations: every choice of
// HalfAngles for each of the ng grooves, or the drawn half-angles own.
func (p *optProblem) setCombos(own []float64, ng int) error {
	o := &p.o
	p.combos = [][]float64{own}
	p.ownCombo = 0
	if len(o.HalfAngles) == 0 || ng == 0 {
		return nil
	}
	p.combos = nil
	p.ownCombo = -1
	total := 1
	for range ng {
		total *= len(o.HalfAngles)
		if total > 4096 {
			return &InputError{Field: "opt.HalfAngles", Err: fmt.Errorf("%w: %d choices for %d grooves is more than 4096 combinations", ErrRange, len(o.HalfAngles), ng)}
		}
	}
	for k := 0; k < total; k++ {
		combo := make([]float64, ng)
		r := k
		same := true
		for j := range combo {
			combo[j] = o.HalfAngles[r%len(o.HalfAngles)]
			r /= len(o.HalfAngles)
			same = same && combo[j] == own[j]
		}
		if same {
			p.ownCombo = len(p.combos)
		}
		p.combos = append(p.combos, combo)
	}
	return nil
}

// violation returns the constraints' total violation, dimensionless.
func (p *optProblem) violation(c *Scorecard) float64 {
	var v float64
	if p.o.MinCentreIndex > 0 && c.WeakestCentreIndex < p.o.MinCentreIndex {
		v += p.o.MinCentreIndex - c.WeakestCentreIndex
	}
	if p.o.MinContactIndex > 0 && c.WeakestContactIndex < p.o.MinContactIndex {
		v += p.o.MinContactIndex - c.WeakestContactIndex
	}
	if c.Condition > p.o.MaxCondition {
		v += c.Condition/p.o.MaxCondition - 1
	}
	if p.o.MaxPressureRatio > 0 && c.PressureRatio > p.o.MaxPressureRatio {
		v += c.PressureRatio/p.o.MaxPressureRatio - 1
	}
	return v
}

// candidate is a layout seen by the search.
type candidate struct {
	x     []float64
	combo int
	cost  float64
	ok    bool // feasible
}

// bound is an extra constraint of the trade-off search: the second
// objective's cost at most limit.
type bound struct {
	obj   Objective
	limit float64
}

// evaluate returns the cost of a layout, the penalised cost the local
// search minimises, and whether it is feasible.
func (p *optProblem) evaluate(obj Objective, extra *bound, x []float64, k int) (cst, pen float64, ok bool) {
	p.evals++
	p.set(x, k)
	need := p.need(obj)
	if extra != nil {
		need |= p.need(extra.obj)
	}
	var card Scorecard
	if err := p.sc.score(&card, need); err != nil {
		return math.Inf(1), math.Inf(1), false
	}
	cst = cost(obj, &card)
	v := p.violation(&card)
	if extra != nil {
		if e := cost(extra.obj, &card); e > extra.limit {
			v += (e - extra.limit) / max(math.Abs(extra.limit), 1e-300)
		}
	}
	if !linalg.Finite(cst) {
		return math.Inf(1), math.Inf(1), false
	}
	// An exact penalty: a unit of relative violation costs a thousand
	// times the objective's own size.
	return cst, cst + 1e3*(math.Abs(cst)+1e-300)*v, v == 0
}

// toVar returns the variable u of a pair's azimuth az (mod π), and
// whether az lies in the pair's window.
func (p *optProblem) toVar(op *optPair, az float64) (float64, bool) {
	if op.periodic {
		return az, true
	}
	mid, half := (op.lo+op.hi)/2, (op.hi-op.lo)/2
	// The azimuth nearest the window's middle, modulo π.
	a := mid + wrapAzimuth(az-mid)
	in := math.Abs(a-mid) <= half+1e-12
	if half == 0 {
		return 0, in
	}
	return math.Asin(max(-1, min(1, (a-mid)/half))), in
}

// vars returns the variables of the azimuths az (per pair, from radial)
// with every ball at its drawn place, and whether all lie in their
// windows.
func (p *optProblem) vars(az []float64) ([]float64, bool) {
	x := make([]float64, p.nvar)
	in := true
	for i := range p.pairs {
		op := &p.pairs[i]
		if !op.groove {
			continue
		}
		u, ok := p.toVar(op, az[i])
		in = in && ok
		if op.azVar >= 0 {
			x[op.azVar] = u
		} else {
			in = in && math.Abs(wrapAzimuth(az[i]-op.az0)) <= 1e-12
		}
	}
	return x, in
}

// ownVars returns the variables of the drawn layout.
func (p *optProblem) ownVars() ([]float64, bool) {
	az := make([]float64, len(p.pairs))
	for i := range p.pairs {
		az[i] = p.pairs[i].az0
	}
	return p.vars(az)
}

// bisectorAzimuths returns the azimuths of the bisector layout (as
// BisectorVees lays it), for three grooves on three balls in a triangle.
func (p *optProblem) bisectorAzimuths() ([]float64, bool) {
	if len(p.pairs) != 3 {
		return nil, false
	}
	for _, op := range p.pairs {
		if !op.groove {
			return nil, false
		}
	}
	a, b, c := p.pairs[0].centre, p.pairs[1].centre, p.pairs[2].centre
	if !isTriangle(a, b, c) {
		return nil, false
	}
	in := incentre(a, b, c)
	az := make([]float64, 3)
	for i := range p.pairs {
		op := &p.pairs[i]
		d, ok := linalg.Unit3(r3.Sub(in, op.centre))
		var h r3.Vec
		if ok {
			h, ok = flatten(d, op.up)
		}
		if !ok {
			return nil, false
		}
		az[i] = azimuthFrom(h, op.up, op.rad)
	}
	return az, true
}

// decode returns the azimuth (from radial) and ball offset of pair i for
// the variables x.
func (p *optProblem) decode(i int, x []float64) (az float64, off r3.Vec) {
	op := &p.pairs[i]
	az = op.az0
	switch {
	case op.azVar >= 0 && op.periodic:
		az = x[op.azVar]
	case op.azVar >= 0:
		mid, half := (op.lo+op.hi)/2, (op.hi-op.lo)/2
		az = mid + half*math.Sin(x[op.azVar])
	}
	if op.posVar >= 0 {
		a := op.box[0] * math.Sin(x[op.posVar])
		b := op.box[1] * math.Sin(x[op.posVar+1])
		if op.disc > 0 {
			if r := math.Hypot(a, b); r > op.disc {
				a, b = a*op.disc/r, b*op.disc/r
			}
		}
		off = r3.Add(r3.Scale(a, op.e1), r3.Scale(b, op.e2))
	}
	return az, off
}

// set puts the layout of the variables x and half-angle combination k
// into the scorer's lines.
func (p *optProblem) set(x []float64, k int) {
	az := make([]float64, 0, 8)
	var offs [16]r3.Vec
	for i := range p.pairs {
		a, off := p.decode(i, x)
		az = append(az, a)
		if i < len(offs) {
			offs[i] = off
		}
	}
	p.setLayout(az, offs[:min(len(p.pairs), len(offs))], x, k)
}

// setLayout puts the layout of the azimuths az (from radial), ball offsets
// offs (or, past their length, those decoded from x) and half-angle
// combination k into the scorer's lines.
func (p *optProblem) setLayout(az []float64, offs []r3.Vec, x []float64, k int) {
	sc := p.sc
	for i := range p.pairs {
		op := &p.pairs[i]
		var off r3.Vec
		if i < len(offs) {
			off = offs[i]
		} else if x != nil {
			_, off = p.decode(i, x)
		}
		c := r3.Sub(r3.Add(op.centre, off), sc.origin)
		var ns [3]r3.Vec
		copy(ns[:], op.normals[:op.count])
		root := r3.Add(op.root0, off)
		if op.groove {
			h := p.combos[k][op.grooveIdx]
			s, co := math.Sincos(h)
			fl := flankNormals(op.up, turn(op.rad, op.up, az[i]), s, co)
			ns[0], ns[1] = fl[0], fl[1]
			ideal := grooveIdeal(h)
			sc.ideal[op.first], sc.ideal[op.first+1] = ideal, ideal
			root = rootBelow(c, op.up, op.radius, s)
		}
		for j := 0; j < op.count; j++ {
			l := &sc.lines[op.first+j]
			l.n = ns[j]
			l.centre = c
			l.p = r3.Sub(c, r3.Scale(op.radius, ns[j]))
			sc.root[op.first+j] = root
		}
	}
}

// grid returns the starting points of the global search: a grid of about
// gridSize layouts over the azimuths with the balls at their drawn places,
// and, with ball regions, 64 layouts drawn at random from the regions
// (and the azimuth windows).
func (p *optProblem) grid(rng *rand.Rand) [][]float64 {
	var az []int
	for i := range p.pairs {
		if p.pairs[i].azVar >= 0 {
			az = append(az, i)
		}
	}
	var out [][]float64
	if len(az) > 0 {
		m := max(2, int(math.Pow(gridSize, 1/float64(len(az)))+1e-9))
		// Neighbours on the grid are at most π/m apart in a periodic
		// variable, at least 2/m in a window's sine map.
		p.gridGap = 1.1 * math.Pi / float64(m)
		idx := make([]int, len(az))
		for {
			x := make([]float64, p.nvar)
			for j, i := range az {
				op := &p.pairs[i]
				a := op.lo + (float64(idx[j])+0.5)/float64(m)*(op.hi-op.lo)
				x[op.azVar], _ = p.toVar(op, a)
			}
			out = append(out, x)
			j := 0
			for ; j < len(idx); j++ {
				idx[j]++
				if idx[j] < m {
					break
				}
				idx[j] = 0
			}
			if j == len(idx) {
				break
			}
		}
	}
	hasPos := false
	for i := range p.pairs {
		hasPos = hasPos || p.pairs[i].posVar >= 0
	}
	if hasPos {
		for r := 0; r < 64; r++ {
			x := make([]float64, p.nvar)
			for j := range x {
				x[j] = math.Asin(2*rng.Float64() - 1)
			}
			for i := range p.pairs {
				if op := &p.pairs[i]; op.azVar >= 0 && op.periodic {
					x[op.azVar] = math.Pi * (rng.Float64() - 0.5)
				}
			}
			out = append(out, x)
		}
	}
	return out
}

// search runs the global-then-local search for the objective (with the
// extra bound of a trade-off point) and returns the best feasible layout.
func (p *optProblem) search(obj Objective, extra *bound) (candidate, bool) {
	best := candidate{cost: math.Inf(1)}
	keep := func(x []float64, k int, c float64, ok bool) {
		if ok && c < best.cost {
			best = candidate{x: append([]float64(nil), x...), combo: k, cost: c, ok: true}
		}
	}
	rng := rand.New(rand.NewPCG(p.o.Seed, 0x5eed))
	grid := p.grid(rng)
	p.limited = make([]bool, len(p.combos))
	nm := newNelderMead(p.nvar)
	for k := range p.combos {
		var starts, tried []candidate
		own, in := p.ownVars()
		seeds := [][]float64{}
		if in {
			seeds = append(seeds, own)
		}
		if baz, ok := p.bisectorAzimuths(); ok {
			if bx, in := p.vars(baz); in {
				seeds = append(seeds, bx)
			}
		}
		for _, x := range seeds {
			c, pen, ok := p.evaluate(obj, extra, x, k)
			keep(x, k, c, ok)
			starts = append(starts, candidate{x: x, cost: pen})
		}
		for _, x := range grid {
			c, pen, ok := p.evaluate(obj, extra, x, k)
			keep(x, k, c, ok)
			tried = append(tried, candidate{x: x, cost: pen})
		}
		sort.SliceStable(tried, func(i, j int) bool { return tried[i].cost < tried[j].cost })
		// The best grid points that are not neighbours of a better
		// one: one start per basin the grid resolves.
		chosen := 0
		for _, c := range tried {
			if chosen == maxStarts {
				break
			}
			if !isolated(c.x, starts[len(seeds):], p.gridGap) {
				continue
			}
			starts = append(starts, c)
			chosen++
		}
		if p.nvar == 0 {
			if len(seeds) == 0 {
				c, _, ok := p.evaluate(obj, extra, nil, k)
				keep(nil, k, c, ok)
			}
			continue
		}
		fn := func(x []float64) float64 {
			c, pen, ok := p.evaluate(obj, extra, x, k)
			keep(x, k, c, ok)
			return pen
		}
		budget := 150 * p.nvar
		for _, s := range starts {
			// Running out of budget is not an error: the best layout
			// seen is kept either way.
			nm.run(fn, s.x, 0.1, startBudget*p.nvar)
		}
		// Polish the best with a small simplex: the figures are minima
		// and maxima of smooth ones, where a large simplex stalls.
		if best.ok && best.combo == k {
			p.limited[k] = nm.run(fn, best.x, 0.01, budget)
		}
	}
	return best, best.ok
}

// coupling returns the coupling of the variables x and half-angle
// combination k, and each pair's azimuth from radial.
func (p *optProblem) coupling(x []float64, k int) (Coupling, []float64) {
	out := Coupling{Pairs: append([]Pair(nil), p.c.Pairs...)}
	az := make([]float64, len(p.pairs))
	for i := range p.pairs {
		op := &p.pairs[i]
		a, off := p.decode(i, x)
		out.Pairs[i].Ball.Centre = r3.Add(op.centre, off)
		if op.groove {
			az[i] = wrapAzimuth(a)
			g := out.Pairs[i].Seat.(grooveSeat)
			out.Pairs[i].Seat = g.withDirection(turn(op.rad, op.up, a)).(grooveSeat).withHalfAngle(p.combos[k][op.grooveIdx])
		}
	}
	return out, az
}

// figureBindTol is the relative distance from its limit within which a
// floor or ceiling on a design figure counts as binding. The search meets
// a constraint through a penalty and stops when the objective changes by
// less than 1e-10 relative, which leaves the constrained figure a few
// parts in a million from its limit (a condition number of 9.99996 against
// 10 was seen); 1e-4 separates that from a constraint that is clear of
// its limit, which stays at least percent away in the tests.
const figureBindTol = 1e-4

// binding returns the constraints active at the variables x.
func (p *optProblem) binding(x []float64, card *Scorecard) []string {
	var out []string
	for i := range p.pairs {
		op := &p.pairs[i]
		if op.azVar >= 0 && !op.periodic {
			// Within 1e-5 rad (2 arcsec) of an edge: the sine map
			// approaches it quadratically, so the search stops just short.
			az, _ := p.decode(i, x)
			if az-op.lo <= 1e-5 {
				out = append(out, indexed("Windows", i)+".Min")
			} else if op.hi-az <= 1e-5 {
				out = append(out, indexed("Windows", i)+".Max")
			}
		}
		if op.posVar >= 0 {
			_, off := p.decode(i, x)
			a, b := r3.Dot(off, op.e1), r3.Dot(off, op.e2)
			edge := false
			if op.disc > 0 {
				edge = math.Hypot(a, b) >= op.disc*(1-1e-6)
			} else {
				edge = (op.box[0] > 0 && math.Abs(a) >= op.box[0]*(1-1e-6)) || (op.box[1] > 0 && math.Abs(b) >= op.box[1]*(1-1e-6))
			}
			if edge {
				out = append(out, indexed("Regions", i))
			}
		}
	}
	if p.o.MinCentreIndex > 0 && card.WeakestCentreIndex <= p.o.MinCentreIndex*(1+figureBindTol) {
		out = append(out, "MinCentreIndex")
	}
	if p.o.MinContactIndex > 0 && card.WeakestContactIndex <= p.o.MinContactIndex*(1+figureBindTol) {
		out = append(out, "MinContactIndex")
	}
	if card.Condition >= p.o.MaxCondition*(1-figureBindTol) {
		out = append(out, "MaxCondition")
	}
	if p.o.MaxPressureRatio > 0 && card.PressureRatio >= p.o.MaxPressureRatio*(1-figureBindTol) {
		out = append(out, "MaxPressureRatio")
	}
	return out
}

// front returns the trade-off curve between the objectives a and b.
func (p *optProblem) front(a, b Objective, n int, bestA candidate) ([]FrontPoint, error) {
	bestB, ok := p.search(b, nil)
	if !ok {
		return nil, &InputError{Field: "opt.TradeOff", Err: fmt.Errorf("%w: no feasible layout for %v", ErrRange, b)}
	}
	score := func(c candidate) (FrontPoint, error) {
		p.set(c.x, c.combo)
		var card Scorecard
		if err := p.sc.score(&card, allFigures); err != nil {
			return FrontPoint{}, err
		}
		cp, _ := p.coupling(c.x, c.combo)
		return FrontPoint{Coupling: cp, Score: card, First: figure(a, &card), Second: figure(b, &card)}, nil
	}
	ends := [2]FrontPoint{}
	var err error
	if ends[0], err = score(bestA); err != nil {
		return nil, err
	}
	if ends[1], err = score(bestB); err != nil {
		return nil, err
	}
	hi, lo := cost(b, &ends[0].Score), cost(b, &ends[1].Score)
	pts := []FrontPoint{ends[0]}
	for k := 1; k < n-1; k++ {
		limit := hi + (lo-hi)*float64(k)/float64(n-1)
		c, ok := p.search(a, &bound{obj: b, limit: limit})
		if !ok {
			continue
		}
		fp, err := score(c)
		if err != nil {
			return nil, err
		}
		pts = append(pts, fp)
	}
	pts = append(pts, ends[1])
	// Drop dominated points (in cost terms, both minimised).
	var out []FrontPoint
	for i, q := range pts {
		dominated := false
		for j, r := range pts {
			if i == j {
				continue
			}
			qa, qb, ra, rb := cost(a, &q.Score), cost(b, &q.Score), cost(a, &r.Score), cost(b, &r.Score)
			if ra <= qa && rb <= qb && (ra < qa || rb < qb) && (ra < qa*(1-1e-9) || rb < qb*(1-1e-9)) {
				dominated = true
				break
			}
		}
		if !dominated {
			out = append(out, q)
		}
	}
	return out, nil
}

// gridSize is about the number of layouts of the start grid.
const gridSize = 343

// maxStarts is the number of grid points the local search starts from.
const maxStarts = 4

// isolated reports whether x is farther than gap from every start in the
// largest difference of a variable.
func isolated(x []float64, starts []candidate, gap float64) bool {
	for _, s := range starts {
		var d float64
		for j := range x {
			d = max(d, math.Abs(x[j]-s.x[j]))
		}
		if d <= gap {
			return false
		}
	}
	return true
}

// startBudget is the evaluations per variable of a local search from a
// start; the polish of the best gets 150 per variable.
var startBudget = 50

// nelderMead is the downhill simplex method of Nelder & Mead (1965,
// Computer Journal 7(4)) with the standard coefficients (reflection 1,
// expansion 2, contraction ½, shrink ½; Lagarias, Reeds, Wright & Wright
// 1998, SIAM J. Optim. 9(1)), on storage reused from one run to the next.
type nelderMead struct {
	x               [][]float64 // the n+1 vertices
	f               []float64   // their values
	cen, xr, xe, xc []float64
	order           []int
}

func newNelderMead(n int) *nelderMead {
	m := &nelderMead{x: make([][]float64, n+1), f: make([]float64, n+1), order: make([]int, n+1)}
	buf := make([]float64, (n+1)*n+4*n)
	for i := range m.x {
		m.x[i] = buf[i*n : (i+1)*n : (i+1)*n]
	}
	buf = buf[(n+1)*n:]
	m.cen, m.xr, m.xe, m.xc = buf[:n:n], buf[n:2*n:2*n], buf[2*n:3*n:3*n], buf[3*n:]
	return m
}

// nmFTol and nmXTol end a run: the values at the vertices within nmFTol
// of the best one (relative), and every vertex within nmXTol of the best
// in each variable (radians of azimuth, or of the sine map of a ball
// position: 1e-9 of a region's half-width).
const (
	nmFTol = 1e-10
	nmXTol = 1e-9
)

// run minimises fn from x0 with the simplex of x0 and x0 + size·eᵢ, for at
// most budget evaluations, and reports whether the budget ended it. fn
// must not keep its argument.
func (m *nelderMead) run(fn func([]float64) float64, x0 []float64, size float64, budget int) (limited bool) {
	n := len(x0)
	evals := 0
	for i := range m.x {
		copy(m.x[i], x0)
		if i > 0 {
			m.x[i][i-1] += size
		}
		m.f[i] = fn(m.x[i])
		evals++
	}
	for {
		// Order the vertices by value: best first, worst last.
		for i := range m.order {
			m.order[i] = i
		}
		for i := 1; i <= n; i++ {
			for j := i; j > 0 && m.f[m.order[j]] < m.f[m.order[j-1]]; j-- {
				m.order[j], m.order[j-1] = m.order[j-1], m.order[j]
			}
		}
		b, w, sw := m.order[0], m.order[n], m.order[max(n-1, 0)]
		fb, fw := m.f[b], m.f[w]
		if fw-fb <= nmFTol*math.Abs(fb) || fw == fb {
			done := true
			for i := range m.x {
				for j := range n {
					if math.Abs(m.x[i][j]-m.x[b][j]) > nmXTol {
						done = false
					}
				}
			}
			if done {
				return false
			}
		}
		if evals >= budget {
			return true
		}
		xw := m.x[w]
		for j := range n {
			var c float64
			for i := range m.x {
				if i != w {
					c += m.x[i][j]
				}
			}
			m.cen[j] = c / float64(n)
		}
		for j := range n {
			m.xr[j] = 2*m.cen[j] - xw[j]
		}
		fr := fn(m.xr)
		evals++
		switch {
		case fr < fb:
			for j := range n {
				m.xe[j] = 3*m.cen[j] - 2*xw[j]
			}
			fe := fn(m.xe)
			evals++
			if fe < fr {
				copy(xw, m.xe)
				m.f[w] = fe
			} else {
				copy(xw, m.xr)
				m.f[w] = fr
			}
			continue
		case fr < m.f[sw]:
			copy(xw, m.xr)
			m.f[w] = fr
			continue
		}
		// Contract: outside when the reflection improved on the worst,
		// inside otherwise; shrink towards the best if that fails.
		from, ff := xw, fw
		if fr < fw {
			from, ff = m.xr, fr
		}
		for j := range n {
			m.xc[j] = 0.5 * (m.cen[j] + from[j])
		}
		fc := fn(m.xc)
		evals++
		if fc < ff || fc <= ff && fr < fw {
			copy(xw, m.xc)
			m.f[w] = fc
			continue
		}
		xb := m.x[b]
		for i := range m.x {
			if i == b {
				continue
			}
			for j := range n {
				m.x[i][j] = 0.5 * (xb[j] + m.x[i][j])
			}
			m.f[i] = fn(m.x[i])
			evals++
		}
	}
}
