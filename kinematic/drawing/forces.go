package drawing

import (
	"fmt"
	"io"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// Forces writes the contact forces of load cases to w as grouped bars:
// for each contact (by its label, in the order of cases[0]) one bar per
// case, N, compression positive; a bar below zero is a contact that would
// have to pull (it opens). The legend names each case by its
// kinematic.Statics.Case. cases are the rigid statics of each load case
// (kinematic.Model.Statics, or design.Evaluation.Cases).
func Forces(w io.Writer, cases []kinematic.Statics, opt *Options) error {
	o := opt.orDefault()
	if len(cases) == 0 {
		return fmt.Errorf("drawing: no load cases: %w", kinematic.ErrDegenerate)
	}
	p := newPlot(o.title("Contact forces per load case"))
	width := vg.Length(0.7*vg.Inch) / vg.Length(len(cases))
	labels := make([]string, 6)
	for i, cl := range cases[0].Contacts {
		labels[i] = cl.Label
	}
	for k, s := range cases {
		vals := make(plotter.Values, 6)
		for i, cl := range s.Contacts {
			if !finite(cl.Force) {
				return fmt.Errorf("drawing: cases[%d].Contacts[%d].Force: %w", k, i, kinematic.ErrNonFinite)
			}
			if cl.Label != labels[i] {
				return fmt.Errorf("drawing: cases[%d].Contacts[%d].Label: %w: %q, cases[0] has %q there", k, i, kinematic.ErrDegenerate, cl.Label, labels[i])
			}
			vals[i] = cl.Force
		}
		bc, err := plotter.NewBarChart(vals, width)
		if err != nil {
			return err
		}
		bc.Color = plotutil.Color(k)
		bc.LineStyle.Width = 0
		bc.Offset = width * (vg.Length(k) - vg.Length(len(cases)-1)/2)
		p.Add(bc)
		name := s.Case
		if name == "" {
			name = fmt.Sprintf("case %d", k+1)
		}
		p.Legend.Add(name, bc)
	}
	grid := plotter.NewGrid()
	grid.Vertical.Color = nil
	p.Add(grid)
	p.NominalX(labels...)
	p.Y.Label.Text = "normal force at the contact, N (compression positive)"
	p.X.Label.Text = "contact"
	p.Legend.Top = true
	p.Y.Max *= 1.2 + 0.1*float64(len(cases))
	p.Legend.Padding = 3
	return write(w, o, p.Title.Text, figWidth, figHeight*0.75, func(c draw.Canvas) {
		layout(c, p, nil, o.notes("rigid statics of each case; a bar below zero is a contact that would open"))
	})
}
