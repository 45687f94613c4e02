package design

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// The load cycles of a design: named sequences of loads added to a load
// case (an operator's push, a cable pull, a shock as equivalent loads),
// and the requirement on the hysteresis they leave at the point of
// interest through micro-slip at the contacts (kinematic.Model.Hysteresis).

// maxCycleSteps bounds the steps of a cycle, maxSubsteps the substeps of
// each and maxCycleTotal their product.
const (
	maxCycleSteps = 1000
	maxSubsteps   = 1000
	maxCycleTotal = 20000 // steps times substeps: about 0.1 s of evaluation
)

// Cycle is a named load cycle: steps of load added to a load case, each
// reached from the one before (the first from no added load) along a
// straight path in Substeps equal parts. The last step has zero force and
// moment: a cycle ends where it began.
type Cycle struct {
	Name     string
	Steps    []kinematic.CycleStep
	Substeps int // equal parts of each step, 1 to 1000; 0 means 1
}

// steps returns the cycle's steps divided into their substeps.
func (c *Cycle) steps() []kinematic.CycleStep {
	n := max(c.Substeps, 1)
	out := make([]kinematic.CycleStep, 0, n*len(c.Steps))
	var prev kinematic.CycleStep
	for _, s := range c.Steps {
		// The force moves along a straight path in load: force and moment
		// about the step's point, interpolated between the two steps as
		// wrenches about the new step's point.
		pm := r3.Add(prev.Moment, r3.Cross(r3.Sub(prev.Point, s.Point), prev.Force))
		for k := 1; k <= n; k++ {
			t := float64(k) / float64(n)
			out = append(out, kinematic.CycleStep{
				Force:  r3.Add(r3.Scale(1-t, prev.Force), r3.Scale(t, s.Force)),
				Point:  s.Point,
				Moment: r3.Add(r3.Scale(1-t, pm), r3.Scale(t, s.Moment)),
			})
		}
		prev = s
	}
	return out
}

// cycleIndex returns the index of the named cycle ("" the first), or −1.
func (d *Design) cycleIndex(name string) int {
	if name == "" && len(d.Cycles) > 0 {
		return 0
	}
	for i, c := range d.Cycles {
		if c.Name == name {
			return i
		}
	}
	return -1
}

// readCycles reads the cycles section.
func (r *reader) readCycles(root *node, d *Design) error {
	n := root.get("cycles")
	if n == nil {
		return nil
	}
	const path = "cycles"
	elems, err := list(n, path, maxCycles)
	if err != nil {
		return err
	}
	for i, e := range elems {
		p := index(path, i)
		if err := fields(e, p, "a load cycle", "name", "steps", "substeps"); err != nil {
			return err
		}
		var c Cycle
		if e.get("name") == nil {
			return errorf(join(p, "name"), ErrMissing, "a cycle needs a name, which requirements refer to")
		}
		if err := optText(e, p, "name", maxName, &c.Name); err != nil {
			return err
		}
		if sn := e.get("substeps"); sn != nil {
			sp := join(p, "substeps")
			v, err := number(sn, sp)
			if err != nil {
				return err
			}
			if v != math.Trunc(v) || v < 1 || v > maxSubsteps {
				return errorf(sp, ErrRange, "must be a whole number in [1, %d], got %s", maxSubsteps, sn.text)
			}
			c.Substeps = int(v)
		}
		sn := e.get("steps")
		if sn == nil {
			return errorf(join(p, "steps"), ErrMissing, "the steps of load, the last with zero force: [{\"force\": [\"5 N\", 0, 0], \"point\": [...]}, ..., {}]")
		}
		steps, err := list(sn, join(p, "steps"), maxCycleSteps)
		if err != nil {
			return err
		}
		for k, s := range steps {
			sp := index(join(p, "steps"), k)
			if err := fields(s, sp, "a step of a load cycle", "force", "point", "moment"); err != nil {
				return err
			}
			var st kinematic.CycleStep
			if err := r.optVector(s, sp, "force", force, &st.Force); err != nil {
				return err
			}
			if err := r.optVector(s, sp, "point", length, &st.Point); err != nil {
				return err
			}
			if err := r.optVector(s, sp, "moment", moment, &st.Moment); err != nil {
				return err
			}
			c.Steps = append(c.Steps, st)
		}
		d.Cycles = append(d.Cycles, c)
	}
	return nil
}

// maxCycles bounds the cycles of a design.
const maxCycles = 64

// checkCycles checks the cycles' own values: names, steps and substeps.
func (d *Design) checkCycles() error {
	if len(d.Cycles) > maxCycles {
		return errorf("cycles", ErrTooLarge, "%d cycles; at most %d", len(d.Cycles), maxCycles)
	}
	seen := map[string]int{}
	for i, c := range d.Cycles {
		p := index("cycles", i)
		if c.Name == "" {
			return errorf(join(p, "name"), ErrMissing, "a cycle needs a name, which requirements refer to")
		}
		if err := checkText(c.Name, join(p, "name"), maxName); err != nil {
			return err
		}
		if j, dup := seen[c.Name]; dup {
			return errorf(join(p, "name"), ErrRange, "%q is also the name of cycles[%d]", c.Name, j)
		}
		seen[c.Name] = i
		if c.Substeps < 0 || c.Substeps > maxSubsteps {
			return errorf(join(p, "substeps"), ErrRange, "must be a whole number in [1, %d], got %d", maxSubsteps, c.Substeps)
		}
		if len(c.Steps) == 0 {
			return errorf(join(p, "steps"), ErrMissing, "a cycle needs at least one step, the last with zero force and moment")
		}
		if len(c.Steps) > maxCycleSteps {
			return errorf(join(p, "steps"), ErrTooLarge, "%d steps; at most %d", len(c.Steps), maxCycleSteps)
		}
		if n := len(c.Steps) * max(c.Substeps, 1); n > maxCycleTotal {
			return errorf(join(p, "substeps"), ErrTooLarge, "%d steps of %d substeps make %d; at most %d", len(c.Steps), max(c.Substeps, 1), n, maxCycleTotal)
		}
		for k, s := range c.Steps {
			sp := index(join(p, "steps"), k)
			for _, v := range [...]struct {
				key string
				v   r3.Vec
			}{{"force", s.Force}, {"point", s.Point}, {"moment", s.Moment}} {
				if !finite(v.v) {
					return errorf(join(sp, v.key), ErrNonFinite, "%v", v.v)
				}
			}
			if !finite(r3.Cross(s.Point, s.Force)) {
				return errorf(join(sp, "point"), ErrRange, "the moment of the force about the origin overflows")
			}
		}
		last := c.Steps[len(c.Steps)-1]
		if last.Force != zeroVec || last.Moment != zeroVec {
			key := "force"
			if last.Force == zeroVec {
				key = "moment"
			}
			return errorf(join(index(join(p, "steps"), len(c.Steps)-1), key), ErrRange,
				"a cycle ends where it began: its last step has zero force and moment (add a last step {})")
		}
	}
	return nil
}

// needHysteresis checks the hysteresis requirement's limits and what it
// needs: a cycle, a load case and friction.
func (d *Design) needHysteresis() error {
	r := d.Requirements
	const p = reqPath + ".max_hysteresis"
	for _, l := range []struct {
		key string
		v   float64
	}{{"displacement", r.MaxHysteresis}, {"tilt", r.MaxHysteresisTilt}} {
		if !(l.v >= 0) || math.IsInf(l.v, 0) {
			return errorf(join(p, l.key), ErrRange, "a limit must be finite and > 0 (0: not set), got %g", l.v)
		}
	}
	set := r.MaxHysteresis > 0 || r.MaxHysteresisTilt > 0
	if !set {
		switch {
		case r.HysteresisCycle != "":
			return errorf(join(p, "cycle"), ErrRange, "set without the requirement's limit")
		case r.HysteresisCase != "":
			return errorf(join(p, "case"), ErrRange, "set without the requirement's limit")
		}
		return nil
	}
	if len(d.Cycles) == 0 {
		return errorf(p, ErrMissing, "a hysteresis requirement needs a load cycle: add the cycles section")
	}
	if d.cycleIndex(r.HysteresisCycle) < 0 {
		return errorf(join(p, "cycle"), ErrRange, "no cycle is named %q", r.HysteresisCycle)
	}
	if len(d.Cases) == 0 {
		return errorf(p, ErrMissing, "the requirement needs a load case; the design has none")
	}
	if err := d.needCase("max_hysteresis.case", r.HysteresisCase); err != nil {
		return err
	}
	if d.Friction == nil || !(d.Friction.Mu > 0) {
		return errorf(p, ErrMissing, "the hysteresis of micro-slip needs friction with mu > 0")
	}
	return nil
}

// readHysteresis reads the requirement max_hysteresis {displacement,
// tilt, cycle, case}.
func (r *reader) readHysteresis(n *node, path string, q *Requirements) error {
	m := n.get("max_hysteresis")
	if m == nil {
		return nil
	}
	p := join(path, "max_hysteresis")
	if err := r.readLimits(m, p, "a hysteresis requirement", []limit{
		{"displacement", length, &q.MaxHysteresis}, {"tilt", angle, &q.MaxHysteresisTilt},
	}, "cycle", "case"); err != nil {
		return err
	}
	if err := optText(m, p, "cycle", maxName, &q.HysteresisCycle); err != nil {
		return err
	}
	return caseRef(m, p, &q.HysteresisCase)
}

type wireCycle struct {
	Name     string          `json:"name"`
	Substeps int             `json:"substeps,omitempty"`
	Steps    []wireCycleStep `json:"steps"`
}

type wireCycleStep struct {
	Force  *vec `json:"force,omitempty"`
	Point  *vec `json:"point,omitempty"`
	Moment *vec `json:"moment,omitempty"`
}

type wireHysteresis struct {
	Displacement float64 `json:"displacement,omitempty"`
	Tilt         float64 `json:"tilt,omitempty"`
	Cycle        string  `json:"cycle,omitempty"`
	Case         string  `json:"case,omitempty"`
}

// wireCycles returns the file's form of the cycles, nil without any.
func (d *Design) wireCycles() []wireCycle {
	var w []wireCycle
	for _, c := range d.Cycles {
		wc := wireCycle{Name: c.Name, Substeps: c.Substeps, Steps: []wireCycleStep{}}
		for _, s := range c.Steps {
			wc.Steps = append(wc.Steps, wireCycleStep{Force: optVec(s.Force), Point: optVec(s.Point), Moment: optVec(s.Moment)})
		}
		w = append(w, wc)
	}
	return w
}

// wireHysteresis returns the file's form of the hysteresis requirement,
// nil without it.
func (r Requirements) wireHysteresis() *wireHysteresis {
	if r.MaxHysteresis == 0 && r.MaxHysteresisTilt == 0 {
		return nil
	}
	return &wireHysteresis{Displacement: r.MaxHysteresis, Tilt: r.MaxHysteresisTilt, Cycle: r.HysteresisCycle, Case: r.HysteresisCase}
}

// cloneCycles returns a copy of cs that shares no slice with it.
func cloneCycles(cs []Cycle) []Cycle {
	if cs == nil {
		return nil
	}
	out := make([]Cycle, len(cs))
	for i, c := range cs {
		c.Steps = append([]kinematic.CycleStep(nil), c.Steps...)
		out[i] = c
	}
	return out
}

// hysteresis makes the hysteresis analysis: the requirement's cycle and
// case, or, without the requirement, the first cycle in the first case,
// with the design's friction; a note says why when it cannot be made.
func (e *Evaluation) hysteresis(b *Built) {
	d := &b.d
	if len(d.Cycles) == 0 {
		return
	}
	r := d.Requirements
	ci := d.cycleIndex(r.HysteresisCycle)
	if ci < 0 || len(d.Cases) == 0 {
		return
	}
	c := &d.Cycles[ci]
	e.HysteresisCycle = c.Name
	if d.Friction == nil || !(d.Friction.Mu > 0) {
		e.hysteresisNote = fmt.Sprintf("no hysteresis under cycle %q: the design gives no friction (mu > 0)", c.Name)
		e.Notes = append(e.Notes, e.hysteresisNote)
		return
	}
	lc := d.Cases[d.caseIndex(r.HysteresisCase)]
	e.HysteresisCase = lc.Name
	steps := c.steps()
	h, err := b.model.Hysteresis(lc, steps, d.Friction.Mu, d.Point)
	if err != nil {
		where := ""
		var ke *kinematic.InputError
		if errors.As(err, &ke) {
			// steps[k] of the expanded cycle is substep k%n+1 on the way
			// to the file's step k/n.
			if name, k, ok := splitIndex(ke.Field); ok && name == "steps" {
				n := max(c.Substeps, 1)
				where = fmt.Sprintf(" at cycles[%d].steps[%d], %d/%d of the way to it from the step before", ci, k/n, k%n+1, n)
			}
		}
		e.hysteresisNote = fmt.Sprintf("no hysteresis under cycle %q in case %q%s: %v", c.Name, lc.Name, where, unwrapKinematic(err))
		e.Notes = append(e.Notes, e.hysteresisNote)
		return
	}
	e.Hysteresis = &h
}

// hysteresisVerdicts returns the verdicts of the hysteresis requirement:
// the residual displacement and tilt after the cycle.
func (e Evaluation) hysteresisVerdicts() Verdicts {
	r := e.req
	if r.MaxHysteresis == 0 && r.MaxHysteresisTilt == 0 {
		return nil
	}
	var vs Verdicts
	var disp, tilt float64
	note := e.hysteresisNote
	if h := e.Hysteresis; h != nil {
		disp, tilt = r3.Norm(h.Residual), r3.Norm(h.ResidualTilt)
		note = fmt.Sprintf("residual at the %s after cycle %q (%d steps) in case %q, mu %g; %.3g J lost per cycle",
			e.point, e.HysteresisCycle, len(h.Path), e.HysteresisCase, h.Mu, h.Energy)
	} else {
		disp, tilt = math.Inf(1), math.Inf(1)
	}
	if r.MaxHysteresis > 0 {
		vs = append(vs, Verdict{Requirement: "requirements.max_hysteresis.displacement", Value: disp, Limit: r.MaxHysteresis, Unit: "m",
			Pass: disp <= r.MaxHysteresis, Note: note})
	}
	if r.MaxHysteresisTilt > 0 {
		vs = append(vs, Verdict{Requirement: "requirements.max_hysteresis.tilt", Value: tilt, Limit: r.MaxHysteresisTilt, Unit: "rad",
			Pass: tilt <= r.MaxHysteresisTilt, Note: note})
	}
	return vs
}
