package main

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// hysteresis prints the response of the point of interest to the load
// cycle that the evaluation followed with micro-slip at the contacts: the
// peak displacement along the load, the residual displacement and tilt
// after the cycle, the energy lost per cycle and how close the contacts
// came to sliding.
func (s *study) hysteresis(n int) {
	s.section(n, "Hysteresis under a load cycle")
	h := s.ev.Hysteresis
	if h == nil {
		s.printf("No hysteresis: see the notes above.\n")
		return
	}
	var c int
	for i, cy := range s.d.Cycles {
		if cy.Name == s.ev.HysteresisCycle {
			c = i
		}
	}
	s.printf("cycle %q (%d steps of %d substeps, %d in all) added to case %q, friction mu = %g\n",
		s.ev.HysteresisCycle, len(s.d.Cycles[c].Steps), max(s.d.Cycles[c].Substeps, 1), len(h.Path), s.ev.HysteresisCase, h.Mu)
	// The direction of the cycle's largest force, and the peak
	// displacement of the point along it.
	var u r3.Vec
	var big, peak, ratio float64
	for _, st := range h.Path {
		if f := r3.Norm(st.Force); f > big {
			big, u = f, r3.Scale(1/f, st.Force)
		}
		ratio = math.Max(ratio, st.SlipRatio)
	}
	for _, st := range h.Path {
		peak = math.Max(peak, math.Abs(r3.Dot(st.Displacement, u)))
	}
	if big > 0 {
		s.printf("largest force %.4g N along %s; largest displacement of the %s along it %.4g µm\n", big, dir(u), s.point, peak*1e6)
	}
	s.printf("residual after the cycle: displacement %.4g µm (3-D magnitude) along %s, tilt %.4g µrad\n",
		r3.Norm(h.Residual)*1e6, dir(h.Residual), r3.Norm(h.ResidualTilt)*1e6)
	if big > 0 {
		// The component that hysteresis.svg plots (its red dot).
		s.printf("  of which %.4g µm along the largest force %s (the red dot of hysteresis.svg)\n", r3.Dot(h.Residual, u)*1e6, dir(u))
	}
	s.printf("energy lost per cycle (micro-slip, once the cycle repeats): %.4g J\n", h.Energy)
	s.printf("largest |Q|/(mu P) at a contact: %.3g (1: the contact slides)\n", ratio)
	s.printf("Model: Mindlin partial slip with Masing's memory of the load path, normal forces\n" +
		"from rigid statics, no wear; valid while the cycle's load is small against the\n" +
		"preload (see package kinematic, \"Micro-slip and hysteresis\").\n")
}
