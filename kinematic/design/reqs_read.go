package design

// The reader of the requirements that name several load cases, turn
// gravity, or judge the point of interest's tilt, stiffness, preload
// margin and friction repeatability.

// readCases reads the optional "case" (a name, into c) or "cases" ("all"
// or an array of names, into cs) of the requirement object n at path.
func readCases(n *node, path string, c *string, cs *Cases) error {
	one, many := n.get("case"), n.get("cases")
	if one != nil && many != nil {
		return errorf(join(path, "cases"), ErrRange, "give case or cases, not both")
	}
	if one != nil {
		return caseRef(n, path, c)
	}
	if many == nil {
		return nil
	}
	return readCaseList(many, join(path, "cases"), cs)
}

// readCaseList reads "all" or an array of case names.
func readCaseList(n *node, path string, cs *Cases) error {
	if n.kind == stringNode {
		if n.text != "all" {
			return errorf(path, ErrRange, "%q; cases is \"all\" or an array of case names", n.text)
		}
		cs.All = true
		return nil
	}
	if n.kind != arrayNode {
		return errorf(path, ErrType, "must be \"all\" or an array of case names, got %s", n.kind)
	}
	elems, err := list(n, path, maxCases)
	if err != nil {
		return err
	}
	if len(elems) == 0 {
		return errorf(path, ErrRange, "an empty list names no case; leave cases out for the default, or write \"all\"")
	}
	for i, e := range elems {
		name, err := text(e, index(path, i), maxName)
		if err != nil {
			return err
		}
		cs.Names = append(cs.Names, name)
	}
	return nil
}

// optBool reads the optional boolean key of o.
func optBool(o *node, path, key string, dst *bool) error {
	if n := o.get(key); n != nil {
		v, err := boolean(n, join(path, key))
		*dst = v
		return err
	}
	return nil
}

// readContactForce reads min_contact_force: a force, or an object
// {"limit": force, "gravity_any_orientation": boolean}.
func (r *reader) readContactForce(n *node, path string, q *Requirements) error {
	m := n.get("min_contact_force")
	if m == nil {
		return nil
	}
	if m.kind != objectNode {
		return r.readLimit(n, path, limit{"min_contact_force", force, &q.MinContactForce})
	}
	p := join(path, "min_contact_force")
	if err := fields(m, p, "a contact force requirement", "limit", "gravity_any_orientation"); err != nil {
		return err
	}
	if m.get("limit") == nil {
		return errorf(join(p, "limit"), ErrMissing, "%s in %s", force.what, force.si)
	}
	if err := r.readLimit(m, p, limit{"limit", force, &q.MinContactForce}); err != nil {
		return err
	}
	return optBool(m, p, "gravity_any_orientation", &q.ForceAnyGravity)
}

// readPercentile reads the optional percentile key of m.
func readPercentile(m *node, p string, dst *Percentile) error {
	pn := m.get("percentile")
	if pn == nil {
		return nil
	}
	v, err := text(pn, join(p, "percentile"), maxName)
	if err != nil {
		return err
	}
	for i, name := range percentileNames {
		if name == v {
			*dst = Percentile(i)
			return nil
		}
	}
	return errorf(join(p, "percentile"), ErrRange, "%q; must be one of \"p50\", \"p95\", \"p99\", \"p99.73\"", v)
}

// readLimits reads an object of optional limits, at least one of which
// must be given.
func (r *reader) readLimits(m *node, p, what string, ls []limit, extra ...string) error {
	keys := make([]string, 0, len(ls)+len(extra))
	given := false
	for _, l := range ls {
		keys = append(keys, l.key)
		given = given || m.get(l.key) != nil
	}
	if err := fields(m, p, what, append(keys, extra...)...); err != nil {
		return err
	}
	if !given {
		return errorf(join(p, ls[0].key), ErrMissing, "%s needs at least one of %v", what, keys)
	}
	for _, l := range ls {
		if err := r.readLimit(m, p, l); err != nil {
			return err
		}
	}
	return nil
}

func (r *reader) readMaxTilt(n *node, path string, q *Requirements) error {
	m := n.get("max_tilt")
	if m == nil {
		return nil
	}
	p := join(path, "max_tilt")
	if err := r.readLimits(m, p, "a tilt requirement", []limit{
		{"worst_case", angle, &q.MaxTiltWorst}, {"rss", angle, &q.MaxTiltRSS}, {"study", angle, &q.MaxTiltStudy},
	}, "percentile"); err != nil {
		return err
	}
	if m.get("percentile") != nil && m.get("study") == nil {
		return errorf(join(p, "percentile"), ErrRange, "a percentile goes with the study limit, which is not given")
	}
	return readPercentile(m, p, &q.TiltPercentile)
}

func (r *reader) readMinStiffness(n *node, path string, q *Requirements) error {
	m := n.get("min_stiffness")
	if m == nil {
		return nil
	}
	p := join(path, "min_stiffness")
	if err := r.readLimits(m, p, "a stiffness requirement", []limit{
		{"along_axis", rate, &q.MinStiffnessAlong}, {"across_axis", rate, &q.MinStiffnessAcross},
	}, "case", "cases"); err != nil {
		return err
	}
	var one string
	if err := readCases(m, p, &one, &q.StiffnessCases); err != nil {
		return err
	}
	if one != "" {
		q.StiffnessCases.Names = []string{one}
	}
	return nil
}

func (r *reader) readPreloadMargin(n *node, path string, q *Requirements) error {
	m := n.get("min_preload_margin")
	if m == nil {
		return nil
	}
	p := join(path, "min_preload_margin")
	if err := fields(m, p, "a preload margin requirement", "factor", "min_force", "cases"); err != nil {
		return err
	}
	fn := m.get("factor")
	if fn == nil {
		return errorf(join(p, "factor"), ErrMissing, "the factor, a plain number ≥ 1, by which the preload must sit inside its window")
	}
	v, err := number(fn, join(p, "factor"))
	if err != nil {
		return err
	}
	if !(v >= 1) {
		return errorf(join(p, "factor"), ErrRange, "must be a number ≥ 1, got %s", fn.text)
	}
	q.MinPreloadMargin = v
	if err := r.optQuantity(m, p, "min_force", force, &q.PreloadMinForce); err != nil {
		return err
	}
	if !(q.PreloadMinForce >= 0) {
		return errorf(join(p, "min_force"), ErrRange, "must be a force ≥ 0, got %g N", q.PreloadMinForce)
	}
	if c := m.get("cases"); c != nil {
		return readCaseList(c, join(p, "cases"), &q.PreloadCases)
	}
	return nil
}

func (r *reader) readRepeatability(n *node, path string, q *Requirements) error {
	m := n.get("max_repeatability")
	if m == nil {
		return nil
	}
	p := join(path, "max_repeatability")
	if err := r.readLimits(m, p, "a repeatability requirement", []limit{
		{"worst_case", length, &q.MaxRepeatWorst}, {"rss", length, &q.MaxRepeatRSS},
	}, "case", "cases"); err != nil {
		return err
	}
	var one string
	if err := readCases(m, p, &one, &q.RepeatCases); err != nil {
		return err
	}
	if one != "" {
		q.RepeatCases.Names = []string{one}
	}
	return nil
}
