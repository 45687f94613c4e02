package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// ContactLoad is the load at one contact.
type ContactLoad struct {
	Label string

	// Force is the normal force in N, compression positive. Under rigid
	// statics a negative force means the contact would have to pull: it
	// opens, and the rigid solution does not apply.
	Force float64

	// Hertz is the Hertz contact at Force, with subsurface stresses; its
	// zero value when Force ≤ 0.
	Hertz hertz.Contact

	// Allowable is the allowable peak contact pressure in Pa, the smaller
	// of the two bodies' Material.Allowable values; 0 means that at least
	// one body has no allowable on file (a brittle sapphire or silicon
	// nitride body is not judged by its steel partner's figure), and
	// PressureRatio is then 0 too.
	// PressureRatio is Hertz.PeakPressure / Allowable: above 1 the
	// contact is overloaded.
	Allowable     float64
	PressureRatio float64

	// PulledBy is, for a contact in tension, the input of the load case
	// that pulls it hardest, as the caller wrote it ("preloads[0]" for a
	// preload whose Direction lifts the part off its seats, "lc.Gravity",
	// "lc.Acceleration", "lc.Applied[2]"); "" for a contact in
	// compression.
	PulledBy string
}

// Statics is the rigid-statics solution of one load case.
type Statics struct {
	Case     string
	Contacts [6]ContactLoad

	// Tensile lists the labels of contacts whose force would be tensile:
	// those contacts open, and the rigid solution does not hold (see
	// [Model.Equilibrium]). Nil when every contact is in compression.
	Tensile []string

	// Load is the total load of the case on the moving body, about the
	// origin.
	Load screw.Wrench
}

// Statics returns the contact forces that balance the load case on an
// exactly constrained set, and at every compressed contact its Hertz
// contact with stresses against the allowable.
//
// A contact in tension is a result, not an error: Statics lists it in
// Tensile with the input that pulls it in [ContactLoad.PulledBy]; the
// analyses that need every contact in compression ([Model.Stiffness],
// [Coupling.Score]) refuse such a case, naming that input.
//
// Statics returns an [*InputError] wrapping [ErrNotExact] if the model is
// not exactly constrained, one naming the load case's field ("lc.Gravity")
// for bad numbers or "lc" for forces that overflow, and, for a compressed
// contact without a Hertz model (see [NewModel]), the error that names
// it.
func (m *Model) Statics(lc LoadCase) (Statics, error) {
	if err := m.check(); err != nil {
		return Statics{}, err
	}
	if !m.exact {
		return Statics{}, m.errNotExact()
	}
	w, err := m.wrench(&lc)
	if err != nil {
		return Statics{}, err
	}
	var f [6]float64
	m.forces(w, &f)
	s := Statics{Case: lc.Name, Load: w.About(r3.Scale(-1, m.origin))}
	for i := range s.Contacts {
		cl := &s.Contacts[i]
		cl.Label, cl.Force = labelOf(m.lines[i].label, i), f[i]
		if !allFinite(f[i]) {
			return Statics{}, &InputError{Field: "lc", Err: fmt.Errorf("%w: the force at contact %s overflows", ErrRange, cl.Label)}
		}
		if f[i] < 0 {
			s.Tensile = append(s.Tensile, labelOf(m.lines[i].label, i))
			cl.PulledBy, _ = m.puller(i, &lc)
			continue
		}
		if err := m.hertzAt(i, f[i], cl); err != nil {
			return Statics{}, err
		}
	}
	return s, nil
}

// hertzAt fills cl's Hertz contact and pressure ratio at the force f ≥ 0.
func (m *Model) hertzAt(i int, f float64, cl *ContactLoad) error {
	s := &m.surf[i]
	if s.err != nil {
		return s.err
	}
	h, err := s.pair.Solve(f)
	if err != nil {
		return fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", map[string]string{"load": indexed("cs", i) + " force"})
	}
	cl.Hertz, cl.Allowable = h, s.allow
	if s.allow > 0 {
		cl.PressureRatio = h.PeakPressure / s.allow
	}
	return nil
}

// unloadTol is the relative margin within which contacts tie as the first
// to unload: forces and gains are good to about 1e-14 relative, and
// symmetric designs have exact ties that rounding would order at random.
const unloadTol = 1e-9

// Shock is the worst case of an acceleration of given magnitude in any
// direction, added to a base load case.
type Shock struct {
	Magnitude float64 // the acceleration magnitude studied, m/s²
	Contacts  [6]ShockContact

	// Unload is the smallest acceleration magnitude, in m/s², in the
	// worst direction, at which a contact unloads: the shock level the
	// coupling survives with every contact closed. +Inf if none can
	// unload (a massless payload), 0 if a contact is already open in
	// the base case.
	Unload float64

	// First lists the contacts that unload first (several when they tie
	// within 1e-9), and Direction the acceleration of the base that
	// unloads First[0] soonest (unit).
	First     []string
	Direction r3.Vec

	// Runaway is the smallest acceleration magnitude, in m/s², at which
	// the part can no longer be held: past it, the part lifts off a
	// contact and keeps going. It is the least of the contacts' Runaway
	// levels, never below Unload: equal to it when every preload force
	// falls or stays as the part lifts (a magnet, a constant force: the
	// part lets go where the first contact opens), above it when the
	// preload grows as the part lifts (a compression spring: +Inf, the
	// part lifts and is pulled back).
	Runaway float64
}

// ShockContact is one contact under the worst shock.
type ShockContact struct {
	Label     string
	Base      float64 // N, the force in the base case
	Gain      float64 // N per m/s²: the largest change of force per unit acceleration, in any direction
	Direction r3.Vec  // unit direction of the base's acceleration that unloads this contact soonest
	Least     float64 // N, the smallest force at Magnitude in any direction: Base − Magnitude·Gain
	// Unload is the acceleration magnitude in m/s² along Worst at which
	// the contact unloads, Base/Gain (+Inf when Gain is 0; 0 when Base ≤ 0).
	Unload float64

	// Runaway is the acceleration magnitude in m/s² along Direction
	// beyond which, once the contact has opened, no lift holds the part:
	// the largest over the lift q ≥ 0 of the force the preload and the
	// base case would give the contact, divided by Gain (see
	// [Model.Shock]). ≥ Unload; +Inf when the preload grows without bound
	// as the part lifts or Gain is 0; 0 when Base ≤ 0.
	Runaway float64
}

// Shock returns, for an acceleration of the base of the given magnitude in
// m/s² in any direction added to the load case base (usually preload and
// gravity), the smallest force at every contact, the direction that
// produces it, and the acceleration at which the first contact unloads.
//
// The contact forces are linear in the acceleration: with the payload's
// inertial load −m·a at its centre c, contact i carries
// fᵢ = f₀ᵢ + m a (Tᵢ(c)·u) for a unit direction u, where Tᵢ(c) is the
// velocity of c under the twist of power δᵢⱼ with contact j; so the worst
// direction is u = −Tᵢ(c)/|Tᵢ(c)| and the least force f₀ᵢ − m a |Tᵢ(c)|, in
// closed form. Rotational accelerations are not modelled.
//
// The runaway level follows the preload along the lift: once contact i
// opens, the part moves by q along the same twist Tᵢ (the other five
// contacts stay closed; q is the opening of contact i), the gap of each
// preload element j grows by q·Pᵢⱼ, where Pᵢⱼ = −Tᵢ(pⱼ)·dⱼ is the force at
// contact i per newton of element j, and its force changes along its
// [ForceLaw] (or by −Rate·Δgap for a linear element). The part is held at
// the lift q while the force contact i would carry there,
// hᵢ(q) = f₀ᵢ + Σⱼ Pᵢⱼ ΔFⱼ(q), exceeds a·Gainᵢ; so it runs away at
// a = max over q of hᵢ(q)/Gainᵢ, found on a grid of lifts out to the laws' reach
// and refined by golden-section search. The five other contacts are not
// checked along the lift, and the geometry is linear in q.
//
// Shock returns the errors of [Model.Statics] (without the Hertz ones),
// and an [*InputError] naming "magnitude" when it is negative or not
// finite, "payload.Mass" when the payload is massless, and one wrapping
// [ErrRange] naming "payload.Mass" or "magnitude" when a gain, a least
// force or an unloading level overflows (a payload of 5e-324 kg unloads
// no contact at any representable acceleration).
func (m *Model) Shock(base LoadCase, magnitude float64) (Shock, error) {
	if err := m.check(); err != nil {
		return Shock{}, err
	}
	if !m.exact {
		return Shock{}, m.errNotExact()
	}
	if !linalg.Finite(magnitude) {
		return Shock{}, &InputError{Field: "magnitude", Err: fmt.Errorf("%w: %g", ErrNonFinite, magnitude)}
	}
	if magnitude < 0 {
		return Shock{}, &InputError{Field: "magnitude", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, magnitude)}
	}
	if !(m.payload.Mass > 0) {
		return Shock{}, &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: a shock needs a payload with mass", ErrDegenerate)}
	}
	w, err := m.wrench(&base)
	if err != nil {
		return Shock{}, err
	}
	var f [6]float64
	m.forces(w, &f)
	s := Shock{Magnitude: magnitude, Unload: math.Inf(1)}
	for i := range s.Contacts {
		g := r3.Scale(m.payload.Mass, m.freed[i].At(m.payload.Centre))
		sc := &s.Contacts[i]
		sc.Label, sc.Base, sc.Gain = labelOf(m.lines[i].label, i), f[i], linalg.Norm3(g)
		if !allFinite(sc.Gain) {
			return Shock{}, &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: the force per unit acceleration at contact %s overflows", ErrRange, sc.Label)}
		}
		if u, ok := linalg.Unit3(g); ok && sc.Gain > 0 {
			sc.Direction = r3.Scale(-1, u)
		}
		sc.Least = f[i] - magnitude*sc.Gain
		if !allFinite(sc.Least) {
			return Shock{}, &InputError{Field: "magnitude", Err: fmt.Errorf("%w: the force at contact %s under %g m/s² overflows", ErrRange, sc.Label, magnitude)}
		}
		switch {
		case f[i] <= 0:
			sc.Unload = 0
		case sc.Gain == 0:
			sc.Unload = math.Inf(1)
		default:
			sc.Unload = f[i] / sc.Gain
			if !allFinite(sc.Unload) {
				return Shock{}, &InputError{Field: "payload.Mass", Err: fmt.Errorf(
					"%w: contact %s would unload at an acceleration beyond the floating-point range (%.4g N over %.4g N per m/s²): the payload is too light to load it", ErrRange, sc.Label, f[i], sc.Gain)}
			}
		}
		s.Unload = math.Min(s.Unload, sc.Unload)
		sc.Runaway = sc.Unload
		if f[i] > 0 && sc.Gain > 0 {
			sc.Runaway = m.runaway(i, f[i], base.factor()) / sc.Gain
			if math.IsNaN(sc.Runaway) || sc.Runaway < sc.Unload {
				sc.Runaway = sc.Unload
			}
		}
	}
	s.Runaway = math.Inf(1)
	for _, sc := range s.Contacts {
		s.Runaway = math.Min(s.Runaway, sc.Runaway)
	}
	for _, sc := range s.Contacts {
		if sc.Unload <= s.Unload*(1+unloadTol) && !math.IsInf(sc.Unload, 1) {
			if s.First == nil {
				s.Direction = sc.Direction
			}
			s.First = append(s.First, sc.Label)
		}
	}
	return s, nil
}

// runawayGrid is the number of lifts at which [Model.runaway] evaluates
// the held force before refining the best; the refinement takes
// runawayRefine golden-section steps, shrinking the bracket by
// 0.618^60 ≈ 3e-13.
const (
	runawayGrid   = 96
	runawayRefine = 60
)

// runaway returns the largest force, N, that contact i (base force f0 >
// 0) can carry as the part lifts off it along its freed twist with the
// preload at factor: +Inf when the linear elements' force grows with the
// lift.
func (m *Model) runaway(i int, f0, factor float64) float64 {
	t := m.freed[i]
	var slope, qmax float64
	type lawAt struct {
		law         ForceLaw
		gap, f0, pf float64
	}
	var buf [8]lawAt
	laws := buf[:0] // on the stack for up to eight law elements
	for _, p := range m.preloads {
		pij := -r3.Dot(t.At(p.p), p.dir)
		if pij == 0 {
			continue
		}
		if p.law == nil {
			slope -= factor * p.rate * pij * pij
			continue
		}
		laws = append(laws, lawAt{law: p.law, gap: p.gap, f0: linalg.Norm3(p.w.F), pf: pij})
		switch {
		case pij > 0 && p.law.reach() > p.gap:
			qmax = math.Max(qmax, (p.law.reach()-p.gap)/pij)
		case pij < 0:
			qmax = math.Max(qmax, p.gap/-pij)
		}
	}
	if slope > 0 {
		return math.Inf(1)
	}
	held := func(q float64) float64 {
		h := f0 + slope*q
		for _, la := range laws {
			f, _, err := la.law.Force(math.Max(0, la.gap+q*la.pf))
			if err != nil {
				return math.Inf(-1)
			}
			h += factor * la.pf * (f - la.f0)
		}
		return h
	}
	if len(laws) == 0 || !(qmax > 0) || !allFinite(qmax) {
		return f0
	}
	best, kb := f0, 0
	for k := 1; k <= runawayGrid; k++ {
		x := float64(k) / runawayGrid
		if h := held(qmax * x * x); h > best {
			best, kb = h, k
		}
	}
	if kb == 0 {
		return best
	}
	lo := qmax * math.Pow(float64(kb-1)/runawayGrid, 2)
	hi := qmax * math.Pow(math.Min(float64(kb+1), runawayGrid)/runawayGrid, 2)
	const g = 0.6180339887498949
	a, b := hi-g*(hi-lo), lo+g*(hi-lo)
	ha, hb := held(a), held(b)
	for range runawayRefine {
		if ha > hb {
			hi, b, hb = b, a, ha
			a = hi - g*(hi-lo)
			ha = held(a)
		} else {
			lo, a, ha = a, b, hb
			b = lo + g*(hi-lo)
			hb = held(b)
		}
	}
	return math.Max(best, math.Max(ha, hb))
}

// Limit is how far one load can grow before a contact unloads.
type Limit struct {
	// Scale is the largest factor on the load for which every contact
	// stays closed: +Inf if no contact ever unloads, 0 if one is already
	// open in the base case.
	Scale float64

	// First lists the contacts that unload at Scale (several when they
	// tie within 1e-9).
	First []string
}

// WrenchLimit returns how large a multiple of the wrench w (N and N·m
// about the origin, on the moving body) can be added to the load case base
// before a contact unloads. The contact forces are fᵢ = f₀ᵢ − s·Power(Tᵢ, w)
// for the scale s, so contact i unloads at s = f₀ᵢ/Power(Tᵢ, w) when that
// power is positive. Errors are those of [Model.Shock] and an
// [*InputError] naming "w" when it is not finite, or wrapping [ErrRange]
// when the scale overflows (a subnormal w).
func (m *Model) WrenchLimit(base LoadCase, w screw.Wrench) (Limit, error) {
	if err := m.check(); err != nil {
		return Limit{}, err
	}
	if !m.exact {
		return Limit{}, m.errNotExact()
	}
	if !linalg.Finite3(w.F) || !linalg.Finite3(w.M) {
		return Limit{}, &InputError{Field: "w", Err: fmt.Errorf("%w: %+v", ErrNonFinite, w)}
	}
	b, err := m.wrench(&base)
	if err != nil {
		return Limit{}, err
	}
	var f [6]float64
	m.forces(b, &f)
	wl := w.About(m.origin)
	var rate [6]float64
	for i := range rate {
		rate[i] = screw.Power(m.freed[i], wl)
	}
	l, ok := m.limit(&f, &rate)
	if !ok {
		return Limit{}, &InputError{Field: "w", Err: fmt.Errorf("%w: the scale at which a contact unloads is outside the floating-point range", ErrRange)}
	}
	return l, nil
}

// limit returns the scale s at which the first force f[i] − s·rate[i]
// reaches zero, and which contacts do; ok is false when a rate or a scale
// is not finite.
func (m *Model) limit(f, rate *[6]float64) (Limit, bool) {
	var at [6]float64
	l := Limit{Scale: math.Inf(1)}
	for i := range f {
		switch {
		case f[i] <= 0:
			at[i] = 0
		case !allFinite(rate[i]):
			return Limit{}, false
		case rate[i] > 0:
			at[i] = f[i] / rate[i]
			if !allFinite(at[i]) {
				return Limit{}, false
			}
		default:
			at[i] = math.Inf(1)
		}
		l.Scale = math.Min(l.Scale, at[i])
	}
	if !math.IsInf(l.Scale, 1) {
		for i, a := range at {
			if a <= l.Scale*(1+unloadTol) {
				l.First = append(l.First, labelOf(m.lines[i].label, i))
			}
		}
	}
	return l, true
}

// LiftOff is the largest force that can be applied at one point before a
// contact unloads.
type LiftOff struct {
	Point   r3.Vec  // m, where the force is applied
	Force   float64 // N; +Inf if no contact ever unloads, 0 if one is open in the base case
	Contact string  // the label of the contact that unloads first ("" when Force is +Inf)
}

// LiftOff returns, for a force of the given direction applied in turn at
// each of the points (on the moving body: where a probe, a tool or a hand
// presses), the largest force before the first contact unloads, added to
// the load case base; a map a drawing can colour. Errors are those of
// [Model.WrenchLimit], and an [*InputError] naming "dir" for a zero or
// non-finite direction and "points[i]" for a point that is not finite or
// so far away that its force overflows.
func (m *Model) LiftOff(base LoadCase, dir r3.Vec, points []r3.Vec) ([]LiftOff, error) {
	if err := m.check(); err != nil {
		return nil, err
	}
	if !m.exact {
		return nil, m.errNotExact()
	}
	d, err := unitOf(dir, "dir")
	if err != nil {
		return nil, err
	}
	b, err := m.wrench(&base)
	if err != nil {
		return nil, err
	}
	var f [6]float64
	m.forces(b, &f)
	out := make([]LiftOff, len(points))
	for k, q := range points {
		if !linalg.Finite3(q) {
			return nil, &InputError{Field: indexed("points", k), Err: fmt.Errorf("%w: %v", ErrNonFinite, q)}
		}
		ql := r3.Sub(q, m.origin)
		var rate [6]float64
		for i := range rate {
			// Power of the unit force (d, q × d) on twist i: Tᵢ(q)·d.
			rate[i] = r3.Dot(m.freed[i].At(ql), d)
		}
		l, ok := m.limit(&f, &rate)
		if !ok {
			return nil, &InputError{Field: indexed("points", k), Err: fmt.Errorf("%w: the force at which a contact unloads is outside the floating-point range", ErrRange)}
		}
		out[k] = LiftOff{Point: q, Force: l.Scale}
		if len(l.First) > 0 {
			out[k].Contact = l.First[0]
		}
	}
	return out, nil
}
