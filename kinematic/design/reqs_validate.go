package design

import (
	"math"
	"reflect"
)

// clone returns a copy of r that shares no slice with it.
func (r Requirements) clone() Requirements {
	for _, c := range []*Cases{&r.ShockCases, &r.FrequencyCases, &r.HomingCases, &r.StiffnessCases, &r.PreloadCases, &r.RepeatCases} {
		if c.Names != nil {
			c.Names = append([]string(nil), c.Names...)
		}
	}
	return r
}

// isZero reports whether no requirement is set.
func (r Requirements) isZero() bool { return reflect.DeepEqual(r, Requirements{}) }

// checkCaseSet checks a requirement's cases at path: names that exist,
// each once, and not given together with the single case name one.
func (d *Design) checkCaseSet(path, one string, cs Cases) error {
	if cs.zero() {
		return nil
	}
	if one != "" {
		return errorf(join(reqPath, path), ErrRange, "give case or cases, not both")
	}
	if cs.All && len(cs.Names) > 0 {
		return errorf(join(reqPath, path), ErrRange, "all cases, or the cases named, not both")
	}
	if len(d.Cases) == 0 {
		return errorf(join(reqPath, path), ErrMissing, "the requirement needs a load case; the design has none")
	}
	if len(cs.Names) > maxCases {
		return errorf(join(reqPath, path), ErrTooLarge, "%d names; at most %d", len(cs.Names), maxCases)
	}
	seen := map[string]int{}
	for i, n := range cs.Names {
		p := join(reqPath, index(path, i))
		if j, dup := seen[n]; dup {
			return errorf(p, ErrRange, "%q is also %s[%d]", n, path, j)
		}
		seen[n] = i
		if n == "" || d.caseIndex(n) < 0 {
			return errorf(p, ErrRange, "no load case named %q", n)
		}
	}
	return nil
}

// selected returns the indices of the load cases of a requirement: the
// single case one, or the set cs, or (both zero) the first case, or every
// case when all is set.
func (d *Design) selected(one string, cs Cases, all bool) []int {
	switch {
	case cs.All || (cs.zero() && one == "" && all):
		out := make([]int, len(d.Cases))
		for i := range out {
			out[i] = i
		}
		return out
	case len(cs.Names) > 0:
		out := make([]int, len(cs.Names))
		for i, n := range cs.Names {
			out[i] = d.caseIndex(n)
		}
		return out
	}
	if k := d.caseIndex(one); k >= 0 {
		return []int{k}
	}
	return nil
}

// anyGravity reports whether one of the cases ks has gravity.
func (d *Design) anyGravity(ks []int) bool {
	for _, k := range ks {
		if d.Cases[k].Gravity != zeroVec {
			return true
		}
	}
	return false
}

// needMore checks the limits and prerequisites of the requirements on
// several cases, gravity in any orientation, tilt, stiffness at the
// point, preload margin and repeatability.
func (d *Design) needMore() error {
	r := d.Requirements
	for _, l := range []struct {
		path string
		v    float64
	}{
		{"max_tilt.worst_case", r.MaxTiltWorst}, {"max_tilt.rss", r.MaxTiltRSS}, {"max_tilt.study", r.MaxTiltStudy},
		{"min_stiffness.along_axis", r.MinStiffnessAlong}, {"min_stiffness.across_axis", r.MinStiffnessAcross},
		{"min_preload_margin.min_force", r.PreloadMinForce},
		{"max_repeatability.worst_case", r.MaxRepeatWorst}, {"max_repeatability.rss", r.MaxRepeatRSS},
	} {
		if !(l.v >= 0) || math.IsInf(l.v, 0) {
			return errorf(join(reqPath, l.path), ErrRange, "a limit must be finite and > 0 (0: not set), got %g", l.v)
		}
	}
	if m := r.MinPreloadMargin; m != 0 && !(m >= 1 && !math.IsInf(m, 0)) {
		return errorf(join(reqPath, "min_preload_margin.factor"), ErrRange, "must be a finite number ≥ 1 (0: not set), got %g", m)
	}
	stiff := r.MinStiffnessAlong > 0 || r.MinStiffnessAcross > 0
	repeat := r.MaxRepeatWorst > 0 || r.MaxRepeatRSS > 0
	for _, o := range []struct {
		path   string
		set    bool
		parent bool
	}{
		{"min_shock.cases", !r.ShockCases.zero(), r.MinShock > 0},
		{"min_shock.gravity_any_orientation", r.ShockAnyGravity, r.MinShock > 0},
		{"min_frequency.cases", !r.FrequencyCases.zero(), r.MinFrequency > 0},
		{"seating.cases", !r.HomingCases.zero(), r.Homing},
		{"min_contact_force.gravity_any_orientation", r.ForceAnyGravity, r.MinContactForce > 0},
		{"max_tilt.percentile", r.TiltPercentile != P99, r.MaxTiltStudy > 0},
		{"min_stiffness.cases", !r.StiffnessCases.zero(), stiff},
		{"min_preload_margin.min_force", r.PreloadMinForce != 0, r.MinPreloadMargin > 0},
		{"min_preload_margin.cases", !r.PreloadCases.zero(), r.MinPreloadMargin > 0},
		{"max_repeatability.cases", !r.RepeatCases.zero(), repeat},
	} {
		if o.set && !o.parent {
			return errorf(join(reqPath, o.path), ErrRange, "set without the requirement's limit")
		}
	}
	if r.TiltPercentile < P99 || r.TiltPercentile > P9973 {
		return errorf(join(reqPath, "max_tilt.percentile"), ErrRange, "unknown percentile %d", int(r.TiltPercentile))
	}
	for _, c := range []struct {
		path string
		one  string
		cs   Cases
	}{
		{"min_shock.cases", r.ShockCase, r.ShockCases},
		{"min_frequency.cases", r.FrequencyCase, r.FrequencyCases},
		{"seating.cases", r.HomingCase, r.HomingCases},
		{"min_stiffness.cases", "", r.StiffnessCases},
		{"min_preload_margin.cases", "", r.PreloadCases},
		{"max_repeatability.cases", "", r.RepeatCases},
	} {
		if err := d.checkCaseSet(c.path, c.one, c.cs); err != nil {
			return err
		}
	}
	if r.ShockAnyGravity && !d.anyGravity(d.selected(r.ShockCase, r.ShockCases, false)) {
		return errorf(join(reqPath, "min_shock.gravity_any_orientation"), ErrMissing,
			"no case of the requirement has gravity to turn; give the case its gravity ([0, 0, \"-1 g\"])")
	}
	if r.ForceAnyGravity {
		if len(d.Cases) == 0 || !d.anyGravity(d.selected("", Cases{}, true)) {
			return errorf(join(reqPath, "min_contact_force.gravity_any_orientation"), ErrMissing,
				"no load case has gravity to turn; give a case its gravity ([0, 0, \"-1 g\"])")
		}
		if !(d.Payload.Mass > 0) {
			return errorf(join(reqPath, "min_contact_force.gravity_any_orientation"), ErrMissing, "turning gravity needs the payload's mass (payload.mass is 0)")
		}
	}
	if (r.MaxTiltWorst > 0 || r.MaxTiltRSS > 0 || r.MaxTiltStudy > 0) && len(d.Tolerances) == 0 {
		return errorf(join(reqPath, "max_tilt"), ErrMissing, "a tilt from the tolerances needs tolerances")
	}
	if r.MaxTiltStudy > 0 && d.MonteCarlo == nil {
		return errorf(join(reqPath, "max_tilt.study"), ErrMissing, "a Monte Carlo study needs monte_carlo (samples)")
	}
	if stiff {
		if len(d.Cases) == 0 {
			return errorf(join(reqPath, "min_stiffness"), ErrMissing, "the requirement needs a load case; the design has none")
		}
		if d.Axis == zeroVec {
			return errorf(join(reqPath, "min_stiffness"), ErrMissing, "a stiffness along or across the axis needs the design's axis")
		}
	}
	if r.MinPreloadMargin > 0 {
		if len(d.Preloads) == 0 {
			return errorf(join(reqPath, "min_preload_margin"), ErrMissing, "a preload margin needs preloads")
		}
		if len(d.Cases) == 0 {
			return errorf(join(reqPath, "min_preload_margin"), ErrMissing, "the requirement needs a load case; the design has none")
		}
	}
	if repeat {
		if len(d.Cases) == 0 {
			return errorf(join(reqPath, "max_repeatability"), ErrMissing, "the requirement needs a load case; the design has none")
		}
		if d.Friction == nil || !(d.Friction.Mu > 0) {
			return errorf(join(reqPath, "max_repeatability"), ErrMissing, "a friction repeatability needs friction with mu > 0")
		}
	}
	return nil
}
