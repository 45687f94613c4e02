package design

import (
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/screw"
)

// Built is a design checked and built once: its coupling, contacts,
// model and assembly, shared by every analysis made of it. [Design.Build]
// makes one; it holds its own copy of the design, so changing the Design
// afterwards does not change it, and its methods never modify it.
type Built struct {
	d        Design
	coupling kinematic.Coupling
	contacts []kinematic.Contact
	pairOf   []int // the pair of each contact
	analysis kinematic.Analysis
	model    *kinematic.Model
	assembly *kinematic.Assembly
	budget   *kinematic.Budget // when the design has tolerances
}

// Build returns the design checked and built: the coupling (balls[i] in
// seats[i], named by the balls' names, every groove given by azimuth
// turned to it), its contacts, the model with the design's preloads and
// payload, and the assembly whose named dimensions the tolerances vary.
// It checks what [Design.Validate] documents and returns the same errors:
// an [*Error] naming the JSON path of the first entry at fault, with the
// errors of package kinematic translated to the file's paths.
func (d *Design) Build() (*Built, error) {
	if err := d.check(); err != nil {
		return nil, err
	}
	b := &Built{d: d.clone()}
	t := translator{b: b}
	if err := b.buildCoupling(); err != nil {
		return nil, err
	}
	an, err := kinematic.Analyze(b.contacts)
	if err != nil {
		return nil, t.translate(err)
	}
	b.analysis = an
	if len(b.contacts) != 6 || an.Rank != 6 {
		return nil, notExact(b)
	}
	if b.model, err = kinematic.NewModel(b.contacts, b.d.Preloads, b.d.Payload); err != nil {
		return nil, t.translate(err)
	}
	if b.assembly, err = b.coupling.Assembly(); err != nil {
		return nil, t.translate(err)
	}
	if len(b.d.Tolerances) > 0 {
		bu, err := b.assembly.Budget(b.d.Point, b.d.Tolerances)
		if err != nil {
			return nil, translator{b: b, params: pointParams}.translate(err)
		}
		b.budget = &bu
	}
	return b, nil
}

// Design returns a copy of the design that was built.
func (b *Built) Design() Design { return b.d.clone() }

// Coupling returns the design's coupling: balls[i] in seats[i], named by
// the balls' names, with every groove given by azimuth turned to it
// (kinematic.Coupling.WithGroove).
func (b *Built) Coupling() kinematic.Coupling {
	return kinematic.Coupling{Pairs: append([]kinematic.Pair(nil), b.coupling.Pairs...)}
}

// Contacts returns the coupling's contacts, pair by pair as
// kinematic.Coupling.Contacts gives them.
func (b *Built) Contacts() []kinematic.Contact {
	return append([]kinematic.Contact(nil), b.contacts...)
}

// Model returns the coupling's contacts prepared with the design's
// preloads and payload (kinematic.NewModel).
func (b *Built) Model() *kinematic.Model { return b.model }

// Assembly returns the real geometry of the coupling, whose named
// dimensions the tolerances vary (kinematic.Coupling.Assembly).
func (b *Built) Assembly() *kinematic.Assembly { return b.assembly }

// Scenario returns what kinematic.Optimize and kinematic.Coupling.Score
// need to know of the design beyond its coupling: the point of interest
// and axis, the preloads and payload, the gravity of the first load case
// (zero without cases), the requirements' least contact force, N, and the
// thermal expansion coefficients (zero without thermal). The shock level
// is left zero: the file names a shock requirement only with its case.
func (b *Built) Scenario() kinematic.Scenario {
	d := &b.d
	sc := kinematic.Scenario{Point: d.Point, Axis: d.Axis, Preloads: append([]kinematic.Preload(nil), d.Preloads...),
		Payload: d.Payload, MinForce: d.Requirements.MinContactForce}
	if len(d.Cases) > 0 {
		sc.Gravity = d.Cases[0].Gravity
	}
	if d.Thermal != nil {
		sc.Thermal = *d.Thermal
	}
	return sc
}

// clone returns a copy of d that shares no slice or pointer with it.
func (d *Design) clone() Design {
	c := *d
	c.Balls = append([]Ball(nil), d.Balls...)
	c.Seats = append([]Seat(nil), d.Seats...)
	c.Preloads = clonePreloads(d.Preloads)
	c.Tolerances = append([]kinematic.Tolerance(nil), d.Tolerances...)
	c.Requirements = d.Requirements.clone()
	if d.Cases != nil {
		c.Cases = make([]kinematic.LoadCase, len(d.Cases))
		for i, lc := range d.Cases {
			lc.Applied = append([]screw.Wrench(nil), lc.Applied...)
			c.Cases[i] = lc
		}
	}
	if d.Thermal != nil {
		th := *d.Thermal
		c.Thermal = &th
	}
	if d.Friction != nil {
		f := *d.Friction
		c.Friction = &f
	}
	if d.MonteCarlo != nil {
		mc := *d.MonteCarlo
		c.MonteCarlo = &mc
	}
	if d.Vibration != nil {
		c.Vibration = d.Vibration.clone()
	}
	c.Cycles = cloneCycles(d.Cycles)
	d.cloneStudy(&c)
	return c
}
