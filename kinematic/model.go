package kinematic

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// StandardGravity is the standard acceleration of free fall, g₀, in m/s²
// (3rd CGPM, 1901; ISO 80000-3:2019). Accelerations in this package are in
// m/s²; multiply by StandardGravity to give them in g.
const StandardGravity = 9.80665

// Preload is one preload element: a force on the moving body that pushes
// it into its seats (a spring plunger over a ball, a central clamp screw, a
// magnet), a pure couple, or both.
//
// The force acts along the line through Point with direction Direction,
// with magnitude Force at the seated position. Rate is how that magnitude
// changes, in N/m, as the moving body moves along Direction from the
// seated position: a compression spring pushing the body down loses force
// as the body moves down (Rate = −k, its spring rate); a magnet pulling the
// body into the seats gains force as the gap closes (Rate > 0). Rate enters
// the stiffness and the nonlinear equilibrium; rigid statics uses Force.
// Couple is a pure moment in N·m added to the element.
//
// An element whose force depends on its gap (a magnet, a spring measured
// as a table) gives Law and its seated Gap instead of Force and Rate
// (which must then be zero): Force is the law's force at Gap, and Rate is
// minus the law's slope, −dF/dgap, since the gap closes as the body moves
// along Direction (a magnet, whose force falls as the gap opens, has a
// positive Rate: a negative spring that lowers the coupling's stiffness).
// Every analysis uses these two at the seat; [Model.Shock] follows the
// whole law along the lift path ([Shock.Runaway]) and [Model.SizePreload]
// gives the window in force and gap ([PreloadSizing.Gaps]).
type Preload struct {
	Name      string
	Point     r3.Vec  // m, a point of the line of action
	Direction r3.Vec  // of the force on the moving body; need not be unit
	Force     float64 // N, ≥ 0, at the seated position
	Rate      float64 // N/m, d(Force)/d(displacement along Direction)
	Couple    r3.Vec  // N·m

	Law ForceLaw // the force against the gap; nil for Force and Rate
	Gap float64  // m, ≥ 0: the seated gap of Law
}

// Payload is the moving body and what it carries, for gravity, shocks and
// vibration. The zero Payload is massless.
type Payload struct {
	Mass   float64 // kg, ≥ 0
	Centre r3.Vec  // centre of mass, m

	// Inertia is the inertia tensor about the centre of mass in the global
	// frame, kg·m²: symmetric and positive definite, or zero (a point
	// mass: enough for loads; natural frequencies need the full tensor).
	Inertia [3][3]float64
}

// LoadCase is one combination of what acts on the moving body. The zero
// LoadCase is the preload as given and nothing else: the preload elements
// apply unless NoPreload is set (as in a design file, whose cases apply
// the preload unless they say "preload": 0); zero gravity, acceleration
// and applied loads mean none.
type LoadCase struct {
	Name string

	// PreloadFactor is the factor on every preload element's Force (and
	// Couple); zero means 1, the preload as given (the default of a
	// design file's case too), and a negative factor reverses it. NoPreload switches the preload elements
	// off (an unclamped part, a case that studies gravity alone).
	PreloadFactor float64
	NoPreload     bool

	// Gravity is the acceleration of free fall in m/s², for example
	// {Z: −StandardGravity} with z up; the payload's weight is
	// Mass·Gravity at its centre.
	Gravity r3.Vec

	// Acceleration is the acceleration of the base in m/s² (transport,
	// handling, a shock), which the seated payload follows: its inertial
	// load is −Mass·Acceleration at its centre. Angular accelerations are
	// not modelled.
	Acceleration r3.Vec

	// Applied are further loads on the moving body (a cable pull, a tool
	// force), as wrenches in N and N·m about the origin; screw.Line(p,
	// d).Scale(F) is a force F along d through p.
	Applied []screw.Wrench
}

// Model is a contact set prepared for load, stiffness and vibration
// analyses, with its preload elements and payload. Make one with
// [NewModel]; its methods do not modify it and may be called from several
// goroutines at once.
//
// # Assumptions
//
// The bodies are rigid apart from the contacts, which are frictionless
// unilateral points (compression only) obeying Hertz's force–approach law
// where their surfaces are given; displacements are small. Rigid statics
// ([Model.Statics], [Model.Shock], [Model.WrenchLimit], [Model.LiftOff],
// [Model.SizePreload]) needs an exactly constrained set (six independent
// contacts), where the contact forces follow from equilibrium alone;
// [Model.Equilibrium] solves any set with the contacts' elasticity.
type Model struct {
	lines  []line // contact lines about origin
	origin r3.Vec // the contacts' centroid; everything is held relative to it
	exact  bool
	rank   int            // of the contact lines, as Analyze decides it
	freed  [6]screw.Twist // when exact: power δᵢⱼ with contact j, about origin
	size   float64        // RMS distance of the contacts from origin, m

	surf []contactLaw

	preloads []preloadLine
	preload  screw.Wrench // the preload elements at factor 1, about origin

	payload Payload // Centre about origin
}

// contactLaw is the Hertz description of one contact: its force–approach
// law, its allowable and its prepared pair of bodies.
type contactLaw struct {
	pair hertz.Pair // the two bodies, prepared
	err  error      // why the contact has no Hertz model, in the caller's terms
	// missing is true when err is for an input left out (no surfaces, no
	// material) or a contact outside the Hertz model (a cone's ring), for
	// which a figure is unavailable; false when err is a bad input (a
	// material's modulus in GPa written as Pa), which a scorecard refuses.
	missing bool
	allow   float64 // the allowable peak pressure, Pa; 0 when none is on file
	k       float64 // F = k δ^(3/2), N/m^(3/2)
}

// preloadLine is one preload element about origin.
type preloadLine struct {
	name string
	w    screw.Wrench // at factor 1
	dir  r3.Vec       // unit direction of the force (zero for a pure couple)
	p    r3.Vec       // point of the line, about origin
	rate float64
	law  ForceLaw // nil for a linear element
	gap  float64  // the seated gap of law, m
}

// NewModel returns the contacts cs prepared with the preload elements and
// the payload. The contacts are validated as by [Analyze]; a contact whose
// Hertz surfaces are missing or do not make a point contact (a cone's ring,
// a zero material) is accepted, and the analyses that need its elasticity
// or stresses return an error naming it.
//
// NewModel returns an [*InputError] naming the field: cs as for Analyze;
// "preloads[i].Direction" for a zero or non-finite direction (when Force is
// not zero), "preloads[i].Force" for a negative or non-finite force,
// "preloads[i].Point", ".Rate" or ".Couple" when not finite,
// "preloads[i].Law.…" for an invalid law (its own field after "Law."),
// "preloads[i].Gap" for a gap that is negative, not finite, given
// without a Law, or where the law's force is negative or its stiffness
// infinite (magnet faces touching), and ".Force" or ".Rate" when given
// beside a Law; "preloads[i].Law" or ".Gap" wrapping [ErrRange] when the
// law's reach (ten magnet sizes, a table's last gap) exceeds 100 times the
// coupling's size or the gap 10 times it (millimetres given as metres),
// "preloads[i].Force" or "preloads" wrapping [ErrRange] when an element's
// moment or their sum overflows; "payload.Mass"
// for a negative or non-finite mass, "payload.Centre" when not finite, and
// "payload.Inertia" for a tensor that is not finite, not symmetric, or
// neither zero nor positive definite.
func NewModel(cs []Contact, preloads []Preload, payload Payload) (*Model, error) {
	an, err := Analyze(cs)
	if err != nil {
		return nil, err
	}
	m := &Model{lines: append([]line(nil), an.contacts()...), origin: an.origin, rank: an.Rank}
	var s2 float64
	for _, l := range m.lines {
		s2 += r3.Norm2(l.p)
	}
	m.size = math.Sqrt(s2 / float64(len(m.lines)))
	if len(cs) == 6 && an.Rank == 6 {
		m.exact = freedOf(m.lines, &m.freed)
	}
	m.surf = make([]contactLaw, len(cs))
	for i := range cs {
		m.surf[i] = newContactLaw(&cs[i], i)
	}
	if err := m.setPreloads(preloads); err != nil {
		return nil, err
	}
	if err := checkPayload(payload); err != nil {
		return nil, err
	}
	m.payload = payload
	m.payload.Centre = r3.Sub(payload.Centre, m.origin)
	return m, nil
}

// refDepth is the approach, as a fraction of the contact's smallest
// radius, at which newSurface measures the Hertz law F = kδ^(3/2): any
// depth gives the same k (the law is exact for Hertz), and 1e-6 keeps the
// load in the range the package is valid for.
const refDepth = 1e-6

// hertzForce returns the force, N, of a contact of Hertz constant k at
// the approach d ≥ 0: F = k d^(3/2).
func hertzForce(k, d float64) float64 {
	return k * d * math.Sqrt(d)
}

// hertzApproach returns the approach, m, of a contact of Hertz constant k
// under the force f ≥ 0: δ = (f/k)^(2/3).
func hertzApproach(k, f float64) float64 {
	d := math.Cbrt(f / k)
	return d * d
}

// normalStiffness returns a contact's normal stiffness dF/dδ in N/m at the
// force f ≥ 0 for the Hertz law F = k δ^(3/2): δ = (F/k)^(2/3), so
// dF/dδ = (3/2) k δ^(1/2) = 3F/(2δ) = (3/2) k^(2/3) F^(1/3) (the law is
// Hertz's: Johnson, Contact Mechanics, 1985, §4.2, eqs. 4.22–4.23,
// a³ = 3FR/(4E*) and δ = a²/R), written without the quotient F/δ, which
// underflows for tiny forces. [Model.Stiffness] and the scorecard both
// call it.
func normalStiffness(k, f float64) float64 {
	return 1.5 * math.Cbrt(k*k*f)
}

// newContactLaw returns the Hertz law of contact c (index i), or one
// whose err says, in the caller's field paths, why it has none.
func newContactLaw(c *Contact, i int) contactLaw {
	var s contactLaw
	moving, base := indexed("cs", i)+".Moving", indexed("cs", i)+".Base"
	if c.Moving == (hertz.Body{}) || c.Base == (hertz.Body{}) {
		s.err = &InputError{Field: moving + ", " + base, Err: fmt.Errorf(
			"%w: contact %s has no Hertz surfaces (given by hand?)", ErrDegenerate, labelOf(c.Label, i))}
		s.missing = true
		return s
	}
	for _, b := range [...]struct {
		field, what string
		m           hertz.Material
	}{{moving, "ball's (the moving body's)", c.Moving.Material}, {base, "seat's (the base's)", c.Base.Material}} {
		if b.m == (hertz.Material{}) {
			s.err = &InputError{Field: b.field + ".Material", Err: fmt.Errorf(
				"%w: contact %s has no material on its %s side: set the Material of that ball or seat (a hertz.Material such as hertz.Steel440C)",
				ErrDegenerate, labelOf(c.Label, i), b.what)}
			s.missing = true
			return s
		}
	}
	r := math.Min(math.Min(math.Abs(c.Moving.R1), math.Abs(c.Moving.R2)), math.Min(math.Abs(c.Base.R1), math.Abs(c.Base.R2)))
	if math.IsInf(r, 1) || r == 0 {
		r = 1
	}
	d := refDepth * r
	pair, err := hertz.NewPair(c.Moving, c.Base)
	var f float64
	if err == nil {
		f, err = pair.LoadForApproach(d)
	}
	if err != nil {
		s.err = fromHertz(err, moving, base, nil)
		var ie *InputError
		if errors.Is(err, hertz.ErrLineContact) && errors.As(s.err, &ie) {
			s.missing = true
			ie.Err = fmt.Errorf(
				"%w (contact %s bears along a line, as a ball in a cone bears on a ring; no ring-contact model is provided, so only rigid-statics forces are computed, not its stiffness or stresses)",
				ie.Err, labelOf(c.Label, i))
		}
		return s
	}
	s.pair = pair
	s.k = f / (d * math.Sqrt(d))
	// A contact is judged only when both bodies have an allowable on file:
	// a steel ball's figure says nothing of the sapphire flat it presses.
	if a1, a2 := c.Moving.Material.Allowable, c.Base.Material.Allowable; a1 > 0 && a2 > 0 {
		s.allow = math.Min(a1, a2)
	}
	return s
}

func (m *Model) setPreloads(ps []Preload) error {
	m.preloads = make([]preloadLine, len(ps))
	for i, p := range ps {
		f := indexed("preloads", i)
		if !linalg.Finite3(p.Point) {
			return &InputError{Field: f + ".Point", Err: fmt.Errorf("%w: %v", ErrNonFinite, p.Point)}
		}
		if !linalg.Finite3(p.Couple) {
			return &InputError{Field: f + ".Couple", Err: fmt.Errorf("%w: %v", ErrNonFinite, p.Couple)}
		}
		if !linalg.Finite(p.Force) {
			return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: %g", ErrNonFinite, p.Force)}
		}
		if p.Force < 0 {
			return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: must be ≥ 0 (Direction gives the sense), got %g", ErrRange, p.Force)}
		}
		if !linalg.Finite(p.Rate) {
			return &InputError{Field: f + ".Rate", Err: fmt.Errorf("%w: %g", ErrNonFinite, p.Rate)}
		}
		if err := lawOf(&p, f); err != nil {
			return err
		}
		if err := m.lawScale(p, f); err != nil {
			return err
		}
		pl := preloadLine{name: p.Name, p: r3.Sub(p.Point, m.origin), rate: p.Rate, law: p.Law, gap: p.Gap}
		if p.Force != 0 || p.Rate != 0 || p.Law != nil {
			d, err := unitOf(p.Direction, f+".Direction")
			if err != nil {
				return err
			}
			pl.dir = d
			pl.w = screw.Wrench{F: r3.Scale(p.Force, d), M: r3.Scale(p.Force, r3.Cross(pl.p, d))}
		}
		pl.w.M = r3.Add(pl.w.M, p.Couple)
		if !allFinite3(pl.w.F, pl.w.M) {
			return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: the moment of %g N at %v overflows", ErrRange, p.Force, p.Point)}
		}
		m.preloads[i] = pl
		m.preload = m.preload.Add(pl.w)
		if !allFinite3(m.preload.F, m.preload.M) {
			return &InputError{Field: "preloads", Err: fmt.Errorf("%w: the sum of the preload elements overflows", ErrRange)}
		}
	}
	return nil
}

// AtSeat returns the element's force in N and rate in N/m at the seated
// position: Force and Rate, or for an element with a Law the law's force
// at Gap and minus its slope there. Its errors are those of the law (an
// [*InputError] naming the law's field or "gap").
func (p Preload) AtSeat() (force, rate float64, err error) {
	if p.Law == nil {
		return p.Force, p.Rate, nil
	}
	f, s, err := p.Law.Force(p.Gap)
	if err != nil {
		return 0, 0, err
	}
	return f, -s, nil
}

// lawOf validates p's Law and Gap (field f is "preloads[i]") and sets
// p.Force and p.Rate from the law at the seated gap; a table is replaced
// by a copy.
func lawOf(p *Preload, f string) error {
	if p.Law == nil {
		if p.Gap != 0 {
			return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: a seated gap needs a Law", ErrRange)}
		}
		return nil
	}
	if p.Force != 0 {
		return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: the Law gives the force: leave Force 0", ErrRange)}
	}
	if p.Rate != 0 {
		return &InputError{Field: f + ".Rate", Err: fmt.Errorf("%w: the Law gives the rate: leave Rate 0", ErrRange)}
	}
	if err := p.Law.check(); err != nil {
		if ie, ok := err.(*InputError); ok {
			return &InputError{Field: f + ".Law." + ie.Field, Err: ie.Err}
		}
		return err
	}
	if t, ok := p.Law.(*ForceTable); ok {
		p.Law = &ForceTable{Points: append([]TablePoint(nil), t.Points...)} // the caller's slice may change
	}
	if err := checkGap(p.Gap); err != nil {
		return &InputError{Field: f + ".Gap", Err: err.(*InputError).Err}
	}
	force, rate, err := p.AtSeat()
	if err != nil {
		return &InputError{Field: f + ".Gap", Err: err.(*InputError).Err}
	}
	if force < 0 {
		return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: the law's force at %g m is %g N, a repulsion (a magnet offset beyond its partner's face?)", ErrRange, p.Gap, force)}
	}
	if !allFinite(rate) {
		return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: the law's stiffness at %g m is infinite (magnet faces touching): give the seated clearance, > 0", ErrRange, p.Gap)}
	}
	p.Force, p.Rate = force, rate
	return nil
}

// lawScaleRatio bounds the reach of a law element (ten magnet sizes, a
// table's last gap) and ten times its seated gap against the coupling's
// size (the RMS distance of the contacts from their centroid): beyond it
// a length was almost surely given in millimetres as metres. A 12 mm
// magnet on a coupling of 40 mm radius has a ratio of 3.
const lawScaleRatio = 100

// lawScale refuses a law element far larger than the coupling it holds.
func (m *Model) lawScale(p Preload, f string) error {
	if p.Law == nil || !(m.size > 0) {
		return nil
	}
	if r := p.Law.reach(); r > lawScaleRatio*m.size {
		return &InputError{Field: f + ".Law", Err: fmt.Errorf("%w: the law reaches %g m (ten magnet sizes or the last table gap) on a coupling of %g m: a length in millimetres given as metres?", ErrRange, r, m.size)}
	}
	if 10*p.Gap > lawScaleRatio*m.size {
		return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: a seated gap of %g m on a coupling of %g m: a length in millimetres given as metres?", ErrRange, p.Gap, m.size)}
	}
	return nil
}

// symTol is the relative asymmetry that an inertia tensor may have: a
// tensor typed from a drawing or a CAD report carries about 1e-12; 1e-9
// accepts rounding and rejects a mistyped entry.
const symTol = 1e-9

func checkPayload(p Payload) error {
	if !linalg.Finite(p.Mass) {
		return &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: %g", ErrNonFinite, p.Mass)}
	}
	if p.Mass < 0 {
		return &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, p.Mass)}
	}
	if !linalg.Finite3(p.Centre) {
		return &InputError{Field: "payload.Centre", Err: fmt.Errorf("%w: %v", ErrNonFinite, p.Centre)}
	}
	j := p.Inertia
	var big float64
	for r := range 3 {
		for c := range 3 {
			if !linalg.Finite(j[r][c]) {
				return &InputError{Field: fmt.Sprintf("payload.Inertia[%d][%d]", r, c), Err: fmt.Errorf("%w: %g", ErrNonFinite, j[r][c])}
			}
			big = math.Max(big, math.Abs(j[r][c]))
		}
	}
	if big == 0 {
		return nil
	}
	for r := range 3 {
		for c := r + 1; c < 3; c++ {
			if math.Abs(j[r][c]-j[c][r]) > symTol*big {
				return &InputError{Field: "payload.Inertia", Err: fmt.Errorf(
					"%w: not symmetric: [%d][%d] = %g, [%d][%d] = %g", ErrRange, r, c, j[r][c], c, r, j[c][r])}
			}
		}
	}
	if !spd3(j) {
		return &InputError{Field: "payload.Inertia", Err: fmt.Errorf("%w: not positive definite: %v", ErrRange, j)}
	}
	return nil
}

// spd3 reports whether the symmetric 3×3 matrix j is positive definite,
// by Sylvester's criterion on its leading minors (exact in sign for
// a tensor whose eigenvalues are not within rounding of zero).
func spd3(j [3][3]float64) bool {
	d1 := j[0][0]
	d2 := j[0][0]*j[1][1] - j[0][1]*j[1][0]
	d3 := j[0][0]*(j[1][1]*j[2][2]-j[1][2]*j[2][1]) - j[0][1]*(j[1][0]*j[2][2]-j[1][2]*j[2][0]) + j[0][2]*(j[1][0]*j[2][1]-j[1][1]*j[2][0])
	return d1 > 0 && d2 > 0 && d3 > 0
}

// factor returns the factor on the preload elements: 0 with NoPreload,
// 1 for a zero PreloadFactor, else PreloadFactor.
func (lc *LoadCase) factor() float64 {
	switch {
	case lc.NoPreload:
		return 0
	case lc.PreloadFactor == 0:
		return 1
	}
	return lc.PreloadFactor
}

// wrench returns the total load of the case on the moving body, about
// the model's origin.
func (m *Model) wrench(lc *LoadCase) (screw.Wrench, error) {
	if !linalg.Finite(lc.PreloadFactor) {
		return screw.Wrench{}, &InputError{Field: "lc.PreloadFactor", Err: fmt.Errorf("%w: %g", ErrNonFinite, lc.PreloadFactor)}
	}
	if !linalg.Finite3(lc.Gravity) {
		return screw.Wrench{}, &InputError{Field: "lc.Gravity", Err: fmt.Errorf("%w: %v", ErrNonFinite, lc.Gravity)}
	}
	if !linalg.Finite3(lc.Acceleration) {
		return screw.Wrench{}, &InputError{Field: "lc.Acceleration", Err: fmt.Errorf("%w: %v", ErrNonFinite, lc.Acceleration)}
	}
	w := m.preload.Scale(lc.factor())
	if m.payload.Mass > 0 {
		f := r3.Scale(m.payload.Mass, r3.Sub(lc.Gravity, lc.Acceleration))
		w = w.Add(screw.Wrench{F: f, M: r3.Cross(m.payload.Centre, f)})
	}
	for k, a := range lc.Applied {
		if !linalg.Finite3(a.F) || !linalg.Finite3(a.M) {
			return screw.Wrench{}, &InputError{Field: indexed("lc.Applied", k), Err: fmt.Errorf("%w: %+v", ErrNonFinite, a)}
		}
		w = w.Add(a.About(m.origin))
	}
	if !linalg.Finite3(w.F) || !linalg.Finite3(w.M) {
		return screw.Wrench{}, &InputError{Field: "lc", Err: fmt.Errorf("%w: the total load overflows", ErrRange)}
	}
	return w, nil
}

// check returns an error for a nil Model or the zero Model (one not made
// by NewModel), whose methods have no contacts to work on.
func (m *Model) check() error {
	if m == nil || len(m.lines) == 0 {
		return &InputError{Field: "m", Err: fmt.Errorf("%w: a Model needs contacts: make one with NewModel", ErrDegenerate)}
	}
	return nil
}

// puller returns the input of the load case that pulls contact i of an
// exactly constrained model hardest — the most negative part of its rigid
// force — as the caller wrote it ("preloads[0]", "lc.Gravity",
// "lc.Acceleration", "lc.Applied[2]"), and that part in N; "" and 0 when
// no part pulls.
func (m *Model) puller(i int, lc *LoadCase) (string, float64) {
	t := m.freed[i]
	name, pull := "", 0.0
	take := func(f float64, n string) {
		if f < pull {
			name, pull = n, f
		}
	}
	for j, p := range m.preloads {
		take(contactForce(t, p.w.Scale(lc.factor())), indexed("preloads", j))
	}
	if m.payload.Mass > 0 {
		g := r3.Scale(m.payload.Mass, lc.Gravity)
		take(contactForce(t, screw.Wrench{F: g, M: r3.Cross(m.payload.Centre, g)}), "lc.Gravity")
		a := r3.Scale(-m.payload.Mass, lc.Acceleration)
		take(contactForce(t, screw.Wrench{F: a, M: r3.Cross(m.payload.Centre, a)}), "lc.Acceleration")
	}
	for k, a := range lc.Applied {
		take(contactForce(t, a.About(m.origin)), indexed("lc.Applied", k))
	}
	return name, pull
}

// errNotExact is returned by the rigid-statics methods of a model whose
// contacts are not exactly constrained.
func (m *Model) errNotExact() error {
	return &InputError{Field: "cs", Err: fmt.Errorf(
		"%w: rigid statics needs six independent contacts, the model has %d; use Equilibrium", ErrNotExact, len(m.lines))}
}

// forces sets f to the rigid contact forces that balance the wrench w
// (about origin): Σ fᵢ lᵢ + w = 0, so fᵢ = −Power(Tᵢ, w) with Tᵢ the twist
// of power δᵢⱼ with contact j (the rows of the inverse of the contact
// matrix).
func (m *Model) forces(w screw.Wrench, f *[6]float64) {
	for i := range f {
		f[i] = contactForce(m.freed[i], w)
	}
}

// contactForce returns the rigid-statics force, N, at the contact whose
// freed twist (power δᵢⱼ with contact j) is t, under the load w on the
// moving body about the twist's origin: −Power(t, w), from Σ fᵢ lᵢ + w = 0.
// Model's statics and the scorecard both call it.
func contactForce(t screw.Twist, w screw.Wrench) float64 {
	return -screw.Power(t, w)
}
