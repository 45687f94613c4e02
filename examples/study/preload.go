package main

import (
	"fmt"
	"io"
	"math"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// lawText describes a preload element's force law, "" for a linear
// element.
func lawText(p kinematic.Preload) string {
	size := func(m kinematic.Magnet) string {
		return fmt.Sprintf("%.4g x %.4g x %.4g mm, Br %.3g T", m.Size[0]*1e3, m.Size[1]*1e3, m.Size[2]*1e3, m.Remanence)
	}
	var what string
	switch l := p.Law.(type) {
	case nil:
		return ""
	case kinematic.MagnetPair:
		what = "magnets " + size(l.Moving)
		if l.Base != l.Moving {
			what += " over " + size(l.Base)
		}
		if l.Offset != ([2]float64{}) {
			what += fmt.Sprintf(", offset (%.3g, %.3g) mm", l.Offset[0]*1e3, l.Offset[1]*1e3)
		}
	case kinematic.MagnetPlate:
		what = "magnet " + size(l.Magnet) + " on a steel plate"
	case *kinematic.ForceTable:
		what = fmt.Sprintf("table of %d points", len(l.Points))
	}
	return fmt.Sprintf(" (%s; seated gap %.3f mm)", what, p.Gap*1e3)
}

// preloadCurves prints, for each preload element with a force law, its
// curve's figures at the seat, its preload window in force and gap, and
// the shock at which the part runs away against a compression spring of
// the same static force and the same stiffness in size.
func (s *study) preloadCurves() error {
	var laws []int
	for i, p := range s.d.Preloads {
		if p.Law != nil {
			laws = append(laws, i)
		}
	}
	if len(laws) == 0 {
		return nil
	}
	var sz *kinematic.PreloadSizing
	if w, err := s.preloadSizing(); err == nil && len(s.d.Cases) > 0 {
		sz = &w
	}
	for _, i := range laws {
		p := s.d.Preloads[i]
		f, rate, err := p.AtSeat()
		if err != nil {
			return err
		}
		slope := -rate
		kind := "it adds to the coupling's stiffness"
		if slope < 0 {
			kind = "a negative spring: it takes from the coupling's stiffness"
		}
		s.printf("preload curve of %s: %s at the seated gap of %.3f mm, dF/dgap %.3g N/mm (%s)\n",
			nameOf(p, i), newtons(f), p.Gap*1e3, slope*1e-3, kind)
		if sz != nil {
			g := sz.Gaps[i]
			hi := "no upper limit"
			if !math.IsInf(g.MaxForce, 1) {
				hi = newtons(g.MaxForce)
			}
			switch {
			case g.Met:
				gmax := "any larger gap"
				if !math.IsInf(g.MaxGap, 1) {
					gmax = fmt.Sprintf("%.3f mm", g.MaxGap*1e3)
				}
				if g.MinGap > 0 {
					s.printf("  its window: %s to %s, met with a seated gap from %.3f mm to %s\n", newtons(g.MinForce), hi, g.MinGap*1e3, gmax)
				} else {
					// The window sets no lower limit: the law's force at
					// touching is inside it. The law itself needs a
					// gap > 0 (touching faces are infinitely stiff).
					s.printf("  its window: %s to %s, met with any seated gap above 0 (the law needs a gap > 0; the force at touching is within the window) up to %s\n",
						newtons(g.MinForce), hi, gmax)
				}
			default:
				s.printf("  its window: %s to %s, met at no gap of this law: change the magnets or their number (%.3g times this element)\n",
					newtons(g.MinForce), hi, sz.MinScale)
			}
		}
	}
	sh := s.ev.Shock
	if sh == nil {
		return nil
	}
	base := s.caseNamed(s.ev.ShockCase)
	// The same coupling held by compression springs of the same static
	// forces, each growing as the part lifts by the law's stiffness in
	// size.
	springs := make([]kinematic.Preload, len(s.d.Preloads))
	for i, p := range s.d.Preloads {
		springs[i] = p
		if p.Law != nil {
			f, rate, _ := p.AtSeat() // the design was built: its laws are valid
			springs[i].Law, springs[i].Gap = nil, 0
			springs[i].Force, springs[i].Rate = f, -math.Abs(rate)
		}
	}
	m, err := kinematic.NewModel(s.b.Contacts(), springs, s.d.Payload)
	if err != nil {
		return err
	}
	sp, err := m.Shock(base, sh.Magnitude)
	if err != nil {
		return err
	}
	g := kinematic.StandardGravity
	s.printf("shock along the lift, added to case %q: the first contact opens at %.2f g; %s\n", s.ev.ShockCase, sh.Unload/g, runaway(sh))
	s.printf("  with compression springs of the same static force and stiffness in size (force growing as the part lifts): first contact opens at %.2f g; %s\n",
		sp.Unload/g, runaway(&sp))
	return nil
}

func runaway(sh *kinematic.Shock) string {
	switch {
	case math.IsInf(sh.Runaway, 1):
		return "the part is pulled back at any level (no runaway)"
	case sh.Runaway <= sh.Unload*(1+1e-9):
		return fmt.Sprintf("the part runs away at the same %.2f g (the pull only falls as it lifts)", sh.Runaway/kinematic.StandardGravity)
	}
	return fmt.Sprintf("the part runs away at %.2f g", sh.Runaway/kinematic.StandardGravity)
}

// preloadDrawings writes the curve of each preload element with a force
// law, with the lower end of its window as a line.
func (s *study) preloadDrawings(title string) error {
	var sz *kinematic.PreloadSizing
	if w, err := s.preloadSizing(); err == nil && len(s.d.Cases) > 0 {
		sz = &w
	}
	for i, p := range s.d.Preloads {
		if p.Law == nil {
			continue
		}
		o := &drawing.Options{Title: fmt.Sprintf("%s: %s, force against gap", title, nameOf(p, i))}
		if sz != nil && sz.Gaps[i].MinForce > 0 {
			o.Limit, o.LimitName = sz.Gaps[i].MinForce, "least force of the preload window"
		}
		if err := s.write(fmt.Sprintf("preload-curve-%d.svg", i+1), func(w io.Writer) error { return drawing.PreloadCurve(w, p, o) }); err != nil {
			return err
		}
	}
	return nil
}
