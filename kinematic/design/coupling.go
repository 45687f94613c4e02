package design

import "github.com/sixfold-dev/sixfold/kinematic"

// Coupling returns the design's coupling: balls[i] in seats[i], named by
// the balls' names, with every groove given by azimuth turned to it
// (kinematic.Coupling.WithGroove). The design is checked first as by
// [Design.Validate], whose errors it returns.
func (d *Design) Coupling() (kinematic.Coupling, error) {
	b, err := d.build()
	if err != nil {
		return kinematic.Coupling{}, err
	}
	return b.coupling, nil
}

// Model returns the design's contacts prepared with its preloads and
// payload (kinematic.NewModel), and the contacts, pair by pair as
// kinematic.Coupling.Contacts gives them. The design is checked first as
// by [Design.Validate], whose errors it returns.
func (d *Design) Model() (*kinematic.Model, []kinematic.Contact, error) {
	b, err := d.build()
	if err != nil {
		return nil, nil, err
	}
	return b.model, b.contacts, nil
}

// Assembly returns the real geometry of the design's coupling, whose
// named dimensions the tolerances vary (kinematic.Coupling.Assembly). The
// design is checked first as by [Design.Validate], whose errors it
// returns.
func (d *Design) Assembly() (*kinematic.Assembly, error) {
	b, err := d.build()
	if err != nil {
		return nil, err
	}
	return b.assembly, nil
}
