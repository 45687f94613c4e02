package design

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// The evaluation of the requirements checked per load case, with gravity
// turned, and at the point of interest (tilt, stiffness, preload margin,
// repeatability). Each verdict's note states its conditions.

// caseTranslator returns the translator of a call on load case k.
func caseTranslator(b *Built, k int, params map[string]string) translator {
	p := index("cases", k)
	return translator{b: b, lc: p, fallback: p, params: params}
}

// vecString formats a unit direction, components below 1e-12 (rounding
// of a zero) as 0.
func vecString(v r3.Vec) string {
	c := [3]float64{v.X, v.Y, v.Z}
	for i := range c {
		if math.Abs(c[i]) < 1e-12 {
			c[i] = 0
		}
	}
	return fmt.Sprintf("(%.3g, %.3g, %.3g)", c[0], c[1], c[2])
}

// gravityNote returns how a case's gravity of magnitude g was turned.
func gravityNote(g float64, worst r3.Vec) string {
	return fmt.Sprintf("its gravity of %s turned to its worst direction %s (any orientation)", quantityString(g, "m/s^2"), vecString(worst))
}

// more makes the per-case and point-of-interest analyses of the
// requirements into e.checked, keyed by requirement.
func (e *Evaluation) more(b *Built) error {
	d, r := &b.d, b.d.Requirements
	e.checked = map[string]Verdicts{}
	add := func(name string, v Verdict) {
		v.Requirement = "requirements." + name
		if v.Min {
			v.Pass = v.Pass || v.Value >= v.Limit
		} else {
			v.Pass = v.Pass || v.Value <= v.Limit
		}
		e.checked[name] = append(e.checked[name], v)
	}
	if r.MinShock > 0 {
		for _, k := range d.selected(r.ShockCase, r.ShockCases, false) {
			v, err := shockVerdict(b, k, r.MinShock, r.ShockAnyGravity)
			if err != nil {
				return err
			}
			add("min_shock", v)
		}
	}
	if r.MinContactForce > 0 && r.ForceAnyGravity {
		v, err := forceVerdict(b, e, r.MinContactForce)
		if err != nil {
			return err
		}
		add("min_contact_force", v)
	}
	if r.MinFrequency > 0 {
		for _, k := range d.selected(r.FrequencyCase, r.FrequencyCases, false) {
			lc := d.Cases[k]
			v := Verdict{Value: 0, Limit: r.MinFrequency, Unit: "Hz", Min: true, Note: fmt.Sprintf("under case %q", lc.Name)}
			st, err := b.model.Stiffness(lc, nil)
			if err == nil {
				var modes [6]kinematic.Mode
				if modes, err = st.Modes(); err == nil {
					v.Value = modes[0].Frequency
				}
			}
			if err != nil {
				if !errors.Is(err, ErrRange) && !errors.Is(err, ErrDegenerate) {
					return caseTranslator(b, k, nil).translate(err)
				}
				v.Note = fmt.Sprintf("no natural modes under case %q: %v", lc.Name, unwrapKinematic(err))
			}
			add("min_frequency", v)
		}
	}
	if r.Homing {
		for _, k := range d.selected(r.HomingCase, r.HomingCases, false) {
			lc := d.Cases[k]
			h, err := b.model.Homing(lc, d.Friction.Mu)
			if err != nil {
				return caseTranslator(b, k, map[string]string{"mu": "friction.mu"}).translate(err)
			}
			e.checked["seating"] = append(e.checked["seating"], Verdict{Requirement: "requirements.seating", Value: h.MaxMu, Limit: d.Friction.Mu,
				Min: true, Pass: h.Home, Note: fmt.Sprintf("under case %q", lc.Name)})
		}
	}
	if r.MinStiffnessAlong > 0 || r.MinStiffnessAcross > 0 {
		for _, k := range d.selected("", r.StiffnessCases, false) {
			along, across, note, err := stiffnessAt(b, k)
			if err != nil {
				return err
			}
			if r.MinStiffnessAlong > 0 {
				add("min_stiffness.along_axis", Verdict{Value: along, Limit: r.MinStiffnessAlong, Unit: "N/m", Min: true, Note: note})
			}
			if r.MinStiffnessAcross > 0 {
				add("min_stiffness.across_axis", Verdict{Value: across, Limit: r.MinStiffnessAcross, Unit: "N/m", Min: true, Note: note})
			}
		}
	}
	if r.MinPreloadMargin > 0 {
		v, err := marginVerdict(b, e)
		if err != nil {
			return err
		}
		add("min_preload_margin", v)
	}
	if r.MaxRepeatWorst > 0 || r.MaxRepeatRSS > 0 {
		for _, k := range d.selected("", r.RepeatCases, false) {
			lc := d.Cases[k]
			rp, err := b.model.Repeatability(lc, d.Friction.Mu, d.Point)
			note := fmt.Sprintf("at the %s under case %q with mu = %.4g", d.pointLabel(), lc.Name, d.Friction.Mu)
			if err != nil {
				if !errors.Is(err, ErrRange) && !errors.Is(err, ErrDegenerate) {
					return caseTranslator(b, k, map[string]string{"mu": "friction.mu", "p": "point_of_interest"}).translate(err)
				}
				// A contact in tension or a singular stiffness: no
				// repeatability can be estimated, and the requirement fails.
				note = fmt.Sprintf("no repeatability under case %q: %v", lc.Name, unwrapKinematic(err))
				rp = kinematic.Repeatability{Worst: math.Inf(1), RSS: math.Inf(1)}
			} else if e.Repeatability == nil {
				e.Repeatability = &rp
			}
			if r.MaxRepeatWorst > 0 {
				add("max_repeatability.worst_case", Verdict{Value: rp.Worst, Limit: r.MaxRepeatWorst, Unit: "m", Note: note})
			}
			if r.MaxRepeatRSS > 0 {
				add("max_repeatability.rss", Verdict{Value: rp.RSS, Limit: r.MaxRepeatRSS, Unit: "m", Note: note})
			}
		}
	}
	return nil
}

// shockVerdict returns the shock level that every contact survives
// closed in case k, with the case's gravity fixed or, with any, turned to
// its worst direction.
//
// With the gravity turned, contact i carries fᵢ = f0ᵢ + m g (Tᵢ(c)·u_g) −
// m a (Tᵢ(c)·u_a) for gravity g along u_g and a shock a along u_a (f0ᵢ
// the case without its gravity): the least over both directions is
// f0ᵢ − m (g + a) |Tᵢ(c)|, with u_g = −u_a = −Tᵢ(c)/|Tᵢ(c)|. Model.Shock
// of the case without gravity at magnitude a + g gives it, and the level
// at which contact i unloads is f0ᵢ/(m|Tᵢ(c)|) − g: Model.Shock's Unload
// less g, or 0 when the turned gravity alone opens the contact.
func shockVerdict(b *Built, k int, level float64, any bool) (Verdict, error) {
	lc := b.d.Cases[k]
	g := 0.0
	if any {
		g = r3.Norm(lc.Gravity)
		lc.Gravity = r3.Vec{}
	}
	s, err := b.model.Shock(lc, level+g)
	if err != nil {
		return Verdict{}, caseTranslator(b, k, map[string]string{"magnitude": "requirements.min_shock.level"}).translate(err)
	}
	v := Verdict{Value: s.Unload, Limit: level, Unit: "m/s^2", Min: true}
	note := fmt.Sprintf("added to case %q", lc.Name)
	if len(s.First) > 0 {
		note = fmt.Sprintf("contact %s unloads first, added to case %q", s.First[0], lc.Name)
	}
	if any {
		switch {
		case g == 0:
			note += ", which has no gravity to turn"
		default:
			v.Value = math.Max(0, s.Unload-g)
			note += " with " + gravityNote(g, r3.Scale(-1, s.Direction))
		}
	}
	v.Note = note + runawayNote(&b.d, &s, g)
	return v, nil
}

// forceVerdict returns the least contact force over every case with each
// case's gravity turned to its worst direction, contact by contact: the
// force fᵢ = f0ᵢ + m g (Tᵢ(c)·u) is linear in the gravity direction u, so
// its least over the sphere is f0ᵢ − m g |Tᵢ(c)| (Model.Shock of the case
// without gravity at magnitude g: ShockContact.Least), at
// u = −Tᵢ(c)/|Tᵢ(c)|, the opposite of the contact's worst acceleration of
// the base. A case without gravity keeps its rigid-statics forces.
func forceVerdict(b *Built, e *Evaluation, limit float64) (Verdict, error) {
	v := Verdict{Limit: limit, Unit: "N", Min: true}
	first := true
	for k, lc := range b.d.Cases {
		g := r3.Norm(lc.Gravity)
		if g == 0 {
			for _, c := range e.Cases[k].Contacts {
				if first || c.Force < v.Value {
					v.Value, v.Note = c.Force, fmt.Sprintf("at contact %s in case %q, which has no gravity to turn", c.Label, lc.Name)
				}
				first = false
			}
			continue
		}
		lc.Gravity = r3.Vec{}
		s, err := b.model.Shock(lc, g)
		if err != nil {
			return Verdict{}, caseTranslator(b, k, map[string]string{"magnitude": join(index("cases", k), "gravity")}).translate(err)
		}
		for _, c := range s.Contacts {
			if first || c.Least < v.Value {
				v.Value = c.Least
				v.Note = fmt.Sprintf("at contact %s in case %q with %s", c.Label, lc.Name, gravityNote(g, r3.Scale(-1, c.Direction)))
			}
			first = false
		}
	}
	return v, nil
}

// stiffnessAt returns the stiffness at the point of interest along the
// axis and across it under case k, N/m, and the verdicts' note. Along the
// unit axis a it is 1/(aᵀ C a) with C the compliance's force-to-
// translation block; across, the least over unit u ⊥ a of 1/(uᵀ C u),
// 1/λ_max of C projected on the plane normal to a (the larger eigenvalue
// of a symmetric 2×2 matrix [p q; q s]: (p+s)/2 + √(((p−s)/2)² + q²)).
// A case that leaves a contact in tension, or a singular stiffness, gives
// zero stiffness, and the note says why.
func stiffnessAt(b *Built, k int) (along, across float64, note string, err error) {
	d := &b.d
	lc := d.Cases[k]
	st, err := b.model.Stiffness(lc, nil)
	var c kinematic.Compliance
	if err == nil {
		c, err = st.Compliance(d.Point)
	}
	if err != nil {
		if !errors.Is(err, ErrRange) && !errors.Is(err, ErrDegenerate) {
			return 0, 0, "", caseTranslator(b, k, pointParams).translate(err)
		}
		return 0, 0, fmt.Sprintf("no stiffness at the point of interest under case %q: %v", lc.Name, unwrapKinematic(err)), nil
	}
	a := r3.Unit(d.Axis)
	t1 := r3.Unit(normalTo(a))
	t2 := r3.Cross(a, t1)
	quad := func(u, w r3.Vec) float64 {
		x, y := [3]float64{u.X, u.Y, u.Z}, [3]float64{w.X, w.Y, w.Z}
		var s float64
		for i := range 3 {
			for j := range 3 {
				s += x[i] * c.Matrix[i][j] * y[j]
			}
		}
		return s
	}
	ca, err := c.Along(a)
	if err != nil {
		return 0, 0, "", &Error{Path: "axis", Err: errors.Unwrap(err)}
	}
	along = 1 / ca
	p, q, s := quad(t1, t1), quad(t1, t2), quad(t2, t2)
	lmax := (p+s)/2 + math.Hypot((p-s)/2, q)
	across = 1 / lmax
	note = fmt.Sprintf("at the %s under case %q, axis %s", b.d.pointLabel(), lc.Name, vecString(a))
	return along, across, note, nil
}

// marginVerdict returns the preload margin: the preload window
// [MinScale, MaxScale] of Model.SizePreload over the requirement's cases
// (every case by default), and the factor by which the preload as given
// (scale 1) sits inside it, min(1/MinScale, MaxScale): the preload may
// fall by that factor before a contact drops below min_force, and rise by
// it before a contact reaches its allowable pressure. A requirement that
// cannot be met at any preload fails with the reason.
func marginVerdict(b *Built, e *Evaluation) (Verdict, error) {
	d, r := &b.d, b.d.Requirements
	ks := d.selected("", r.PreloadCases, true)
	cases := make([]kinematic.LoadCase, len(ks))
	names := make([]string, len(ks))
	for i, k := range ks {
		cases[i], names[i] = d.Cases[k], fmt.Sprintf("%q", d.Cases[k].Name)
	}
	v := Verdict{Limit: r.MinPreloadMargin, Min: true}
	conds := fmt.Sprintf("min_force %s, cases %s", quantityString(r.PreloadMinForce, "N"), strings.Join(names, ", "))
	sz, err := b.model.SizePreload(cases, r.PreloadMinForce)
	if err != nil {
		if !errors.Is(err, ErrRange) {
			var ke *kinematic.InputError
			if errors.As(err, &ke) && strings.HasPrefix(ke.Field, "cases[") {
				// SizePreload indexes its own list; name the design's case.
				var i int
				if _, scanErr := fmt.Sscanf(ke.Field, "cases[%d]", &i); scanErr == nil && i >= 0 && i < len(ks) && strings.HasPrefix(ke.Field, index("cases", i)) {
					ke.Field = index("cases", ks[i]) + ke.Field[len(index("cases", i)):]
				}
			}
			return Verdict{}, translator{b: b, fallback: join(reqPath, "min_preload_margin"),
				params: map[string]string{"minForce": "requirements.min_preload_margin.min_force", "preloads": "preloads"}}.translate(err)
		}
		v.Note = fmt.Sprintf("no preload meets the requirement (%s): %v", conds, unwrapKinematic(err))
		return v, nil
	}
	e.Sizing = &sz
	down, up := math.Inf(1), sz.MaxScale
	if sz.MinScale > 0 {
		down = 1 / sz.MinScale
	}
	v.Value = math.Min(down, up)
	lo := fmt.Sprintf("×%.4g", sz.MinScale)
	if sz.MinBinding.Contact != "" {
		lo += fmt.Sprintf(" (contact %s at min_force in case %q)", sz.MinBinding.Contact, sz.MinBinding.Case)
	}
	hi := "unbounded (no allowable pressure on file)"
	if !math.IsInf(sz.MaxScale, 1) {
		hi = fmt.Sprintf("×%.4g (contact %s at its allowable pressure in case %q)", sz.MaxScale, sz.MaxBinding.Contact, sz.MaxBinding.Case)
	}
	if sz.MinScale > sz.MaxScale {
		v.Value = 0
	}
	v.Note = fmt.Sprintf("the preload as given in its window %s to %s; %s", lo, hi, conds)
	return v, nil
}

// tiltVerdicts returns the verdicts of the tilt requirements, which need
// no analysis beyond the budget and the study.
func (e Evaluation) tiltVerdicts() Verdicts {
	r := e.req
	var vs Verdicts
	add := func(name string, value, limit float64, note string) {
		vs = append(vs, Verdict{Requirement: "requirements.max_tilt." + name, Value: value, Limit: limit, Unit: "rad", Pass: value <= limit, Note: note})
	}
	if e.Budget != nil {
		if r.MaxTiltWorst > 0 {
			add("worst_case", e.Budget.WorstTilt, r.MaxTiltWorst, "the moving body's rotation, first-order worst case of the tolerances")
		}
		if r.MaxTiltRSS > 0 {
			add("rss", e.Budget.RSSTilt, r.MaxTiltRSS, "the moving body's rotation, first-order RSS of the tolerances")
		}
	}
	if r.MaxTiltStudy > 0 && e.Study != nil {
		add("study", r.TiltPercentile.of(e.Study.Tilt), r.MaxTiltStudy, fmt.Sprintf("the moving body's rotation, %v of %d samples", r.TiltPercentile, e.Study.Samples))
	}
	return vs
}
