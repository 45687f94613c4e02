package main

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// vibration prints the random vibration study: the test, then for each
// axis the figures of the payload and the point of interest, the
// per-contact table and the preload for the margin, and the worst
// direction.
func (s *study) vibration(n int) {
	v := s.d.Vibration
	s.section(n, "Random vibration")
	grms, _ := v.Spectrum.GRMS() // valid: the design was checked
	name := v.Level
	if name == "" {
		name = "test spectrum"
	}
	s.printf("%s: %.3g grms overall", name, grms)
	if v.Source != "" {
		s.printf("\n%s", wrap("source: "+v.Source, 78))
	}
	s.printf("\nbreakpoints:")
	for _, b := range v.Spectrum.Points {
		a, _ := v.Spectrum.Level(b.Frequency)
		s.printf(" %g Hz %.3g g²/Hz;", b.Frequency, a)
	}
	k := sigmaOf(v)
	duration := v.Duration
	if duration == 0 {
		duration = 120
	}
	s.printf("\ncase %q, %g s per axis, k = %g σ\n", s.ev.RandomCase, duration, k)
	if len(s.ev.Random) == 0 {
		s.printf("No response: see the notes above.\n")
		return
	}
	r0 := s.ev.Random[0].Response
	s.printf("\nModes and effective masses (g) along the frame axes:\n")
	s.printf("  %-5s %9s %7s %9s %9s %9s\n", "mode", "f, Hz", "zeta", "x", "y", "z")
	for i := range 6 {
		e := r0.EffectiveMass[i]
		s.printf("  %-5d %9.1f %7.4f %9.1f %9.1f %9.1f\n", i+1, r0.Modes[i], r0.Damping[i], e.X*1e3, e.Y*1e3, e.Z*1e3)
	}
	worst, worstAxis := math.Inf(1), ""
	for _, ra := range s.ev.Random {
		r := ra.Response
		s.printf("\nAlong %s %s:\n", ra.Axis, dir(r.Direction))
		g := kinematic.StandardGravity
		s.printf("  centre of mass acceleration %.3g g RMS, %.3g g peak (%g σ)\n", r.Centre.RMS/g, r.Centre.Peak/g, k)
		s.printf("  %s acceleration %.3g g RMS, %.3g g peak\n", s.point, r.Point.RMS/g, r.Point.Peak/g)
		s.printf("  %s displacement relative to the base %.4g µm RMS, %.4g µm peak; tilt %s\n",
			s.point, r.Displacement.RMS*1e6, r.Displacement.Peak*1e6, tiltText(r.Tilt.RMS, r.Displacement.RMS, s.size()))
		s.printf("  %-7s %9s %11s %13s %9s %11s %11s\n", "contact", "static N", "RMS dyn. N",
			fmt.Sprintf("F-%gσ·dyn N", k), "σ to open", "openings", "P(open)")
		for _, c := range r.Contacts {
			s.printf("  %-7s %9s %11.4g %13.4g %9.3g %11s %11s\n", c.Label, column(c.Static), c.Dynamic,
				c.Static-k*c.Dynamic, c.Margin, tiny(c.Openings), tiny(c.Probability))
		}
		least := r.Contacts[r.Least]
		s.printf("  least margin %.3g σ at contact %s\n", least.Margin, least.Label)
		if least.Margin < worst {
			worst, worstAxis = least.Margin, fmt.Sprintf("%s %s (contact %s)", ra.Axis, dir(r.Direction), least.Label)
		}
		if p := ra.Preload; p != nil {
			s.printf("  preload for %g σ at every contact: ×%.3g of the preload as given to first order (stiffness held), ×%.3g with Hertz stiffness (%s)\n",
				k, p.FirstOrder, p.Hertz, s.preloadForces(p.Hertz))
		} else {
			s.printf("  preload for %g σ: %s\n", k, ra.PreloadNote)
		}
		if lim := s.d.Requirements.MaxRandomOpenings; lim > 0 && len(s.d.Preloads) > 0 {
			s.openingsPreload(ra, lim)
		}
	}
	s.printf("\nWorst direction: along %s, least margin %.3g σ.\n", worstAxis, worst)
	s.printf("Caution: random vibration figures are engineering estimates in linear theory\n" +
		"(modal damping as assumed, normal contact stiffness only); verify them by test,\n" +
		"and defer to the applicable codes and a qualified engineer.\n")
}

// openingsPreload prints the preload that brings the expected openings
// of every contact along the axis down to lim. By Rice's formula a
// contact's openings in the test are ν₀T·exp(−m²/2) at margin m, so
// ln(ν₀T) = ln(openings) + m²/2 and the margin for lim openings is
// √(2 ln(ν₀T/lim)). The largest such margin among the contacts short of
// their own, with the crossing rates ν₀ held (first order: they move
// little with the preload), goes to kinematic.Model.RandomPreload as its
// k: every contact then has at least that margin, which is enough and,
// for the contacts that cross less often, more than they need.
func (s *study) openingsPreload(ra design.RandomAxis, lim float64) {
	need, at := 0.0, ""
	for _, c := range ra.Response.Contacts {
		if !(c.Openings > lim) { // within the limit (or so few that they underflow)
			continue
		}
		if l := math.Log(c.Openings) + c.Margin*c.Margin/2 - math.Log(lim); math.Sqrt(2*l) > need {
			need, at = math.Sqrt(2*l), c.Label
		}
	}
	if need == 0 {
		s.printf("  at most %g expected openings: met by the preload as given\n", lim)
		return
	}
	lc := s.caseNamed(s.ev.RandomCase)
	opt := ra.Options
	opt.Sigma = need
	p, err := s.b.Model().RandomPreload(lc, s.d.Vibration.Spectrum, &opt)
	if err != nil {
		s.printf("  at most %g expected openings: a margin of %.3g σ at contact %s: %v\n", lim, need, at, err)
		return
	}
	s.printf("  at most %g expected openings: a margin of %.3g σ at contact %s (Rice, its crossing rate held); every contact at it takes ×%.3g of the preload as given with Hertz stiffness (%s)\n",
		lim, need, at, p.Hertz, s.preloadForces(p.Hertz))
}

// sigmaOf returns the vibration's k.
func sigmaOf(v *design.Vibration) float64 {
	if v.Sigma > 0 {
		return v.Sigma
	}
	return 3
}

// preloadForces names the preload elements' forces scaled by f.
func (s *study) preloadForces(f float64) string {
	var parts []string
	for i, p := range s.d.Preloads {
		force, _, _ := p.AtSeat()
		parts = append(parts, fmt.Sprintf("%s %.3g N", nameOf(p, i), force*f))
	}
	return strings.Join(parts, ", ")
}

// densityFrequencies returns the frequencies at which the response's
// spectrum is drawn: 600 log-spaced across the band, and each natural
// frequency in it with points at ±ζ f about it, so that the peaks are
// drawn at their height.
func densityFrequencies(sp kinematic.Spectrum, r kinematic.Random) []float64 {
	lo, hi := sp.Points[0].Frequency, sp.Points[len(sp.Points)-1].Frequency
	const n = 600
	f := make([]float64, 0, n+18)
	for i := range n {
		f = append(f, lo*math.Pow(hi/lo, float64(i)/(n-1)))
	}
	for i, fr := range r.Modes {
		for _, x := range []float64{fr * (1 - r.Damping[i]), fr, fr * (1 + r.Damping[i])} {
			if x > lo && x < hi {
				f = append(f, x)
			}
		}
	}
	sort.Float64s(f)
	return f
}

// tinyBelow is the smallest expected number of openings or probability
// printed as a number: below it the Gaussian tail's figures (1e-294, or
// 0 once it underflows) say only "never" and carry no precision that the
// linear model supports.
const tinyBelow = 1e-12

// tiny formats an expected number of openings or a probability with three
// figures, or as "< 1e-12" below tinyBelow. The design package's verdict
// lines print them alike with their own copy of it: an example imports
// only public packages, and the formatter is not exported.
func tiny(v float64) string {
	if v < tinyBelow {
		return "< 1e-12"
	}
	return fmt.Sprintf("%.3g", v)
}

// tiltRounding is the dimensionless threshold below which a random
// tilt is rounding: a tilt θ whose motion across the coupling, θ·L (L
// its size), is under tiltRounding times the RMS displacement moves
// nothing that the displacement's own digits could show. A symmetric
// coupling shaken along its axis has no tilt, and computes one of 1e-36
// rad or so.
const tiltRounding = 1e-12

// tiltText formats an RMS tilt, rad, in µrad RMS, or as 0 when tilt·size is
// below tiltRounding of the RMS displacement disp (m).
func tiltText(tilt, disp, size float64) string {
	if tilt*size < tiltRounding*disp {
		return "0 µrad RMS (zero to rounding)"
	}
	return fmt.Sprintf("%.4g µrad RMS", tilt*1e6)
}

// size returns the coupling's size, m: the largest distance between two
// of its ball centres and the point of interest.
func (s *study) size() float64 {
	pts := []r3.Vec{s.d.Point}
	for _, p := range s.b.Coupling().Pairs {
		pts = append(pts, p.Ball.Centre)
	}
	var l float64
	for i := range pts {
		for j := range i {
			l = math.Max(l, r3.Norm(r3.Sub(pts[i], pts[j])))
		}
	}
	return l
}
