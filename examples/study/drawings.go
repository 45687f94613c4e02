package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/drawing"
)

// drawings writes the drawings to the output folder: the plan view, the
// lift-off map, the Monte Carlo histogram, the random vibration figures
// and the hysteresis loop where the design has them and, after an optimisation,
// the optimised plan and the scorecards of the layouts compared.
func (s *study) drawings(n int) error {
	s.section(n, "Drawings")
	if err := os.MkdirAll(s.cfg.out, 0o755); err != nil {
		return err
	}
	title := s.title()
	opt := func(t string) *drawing.Options { return &drawing.Options{Title: t, PointName: s.point} }
	planOpt := opt(title + ": plan, looking down")
	if s.d.Packaging != nil {
		// The keep-outs and the windows they leave, as the optimiser
		// would see them.
		planOpt.KeepOuts = s.d.Packaging.KeepOuts
		if oo, err := s.b.OptimizeOptions(); err == nil {
			planOpt.Windows = oo.Windows
		}
	}
	if err := s.write("plan.svg", func(w io.Writer) error {
		return drawing.Plan(w, s.b, s.ev, planOpt)
	}); err != nil {
		return err
	}
	if len(s.d.Preloads) > 0 {
		if err := s.write("liftoff.svg", func(w io.Writer) error { return drawing.LiftOff(w, s.b, opt("")) }); err != nil {
			return err
		}
	} else {
		s.printf("liftoff.svg not drawn: the design has no preload\n")
	}
	if err := s.preloadDrawings(title); err != nil {
		return err
	}
	if s.res != nil {
		o := opt(fmt.Sprintf("%s: %s", title, s.point))
		o.Notes = []string{fmt.Sprintf("%d parts made to the drawing (Monte Carlo, seed %d)", s.res.Samples, s.d.MonteCarlo.Seed)}
		if r := s.d.Requirements; r.MaxStudy > 0 {
			o.Limit, o.LimitName = r.MaxStudy, fmt.Sprintf("requirement (%v)", r.StudyPercentile)
		}
		if err := s.write("histogram.svg", func(w io.Writer) error { return drawing.Histogram(w, *s.res, o) }); err != nil {
			return err
		}
	}
	if len(s.ev.Random) > 0 {
		if err := s.randomDrawings(title); err != nil {
			return err
		}
	}
	if h := s.ev.Hysteresis; h != nil {
		o := opt(fmt.Sprintf("%s: hysteresis of the %s under cycle %q", title, s.point, s.ev.HysteresisCycle))
		if err := s.write("hysteresis.svg", func(w io.Writer) error { return drawing.Hysteresis(w, *h, o) }); err != nil {
			return err
		}
	}
	if s.opt != nil && s.optimized != nil {
		if err := s.write("plan-optimized.svg", func(w io.Writer) error {
			return drawing.Plan(w, s.optimized, s.optEv, opt(title+": optimised plan, looking down"))
		}); err != nil {
			return err
		}
		names := []string{"as written", "optimised"}
		cards := []kinematic.Scorecard{s.opt.Start, s.opt.Score}
		err := s.write("scorecards.svg", func(w io.Writer) error {
			return drawing.Scorecards(w, names, cards, opt(title+": design figures before and after"))
		})
		if err != nil {
			// A figure the design cannot give (no thermal expansion, no
			// inertia) cannot be drawn relative to the best.
			s.printf("scorecards.svg not drawn: %v\n", err)
		}
	}
	return nil
}

// write writes one drawing into the output folder.
func (s *study) write(name string, draw func(io.Writer) error) error {
	path := filepath.Join(s.cfg.out, name)
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	err = draw(f)
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	if err != nil {
		os.Remove(path)
		return fmt.Errorf("%s: %w", path, err)
	}
	s.printf("wrote %s\n", path)
	return nil
}

// randomDrawings writes the random vibration spectrum with the response
// at the point of interest along each axis, and the contact margins.
func (s *study) randomDrawings(title string) error {
	v := s.d.Vibration
	lc := s.caseNamed(s.ev.RandomCase)
	var curves []drawing.RandomCurve
	for _, ra := range s.ev.Random {
		opt := ra.Options
		d, err := s.b.Model().RandomDensity(lc, v.Spectrum, &opt, densityFrequencies(v.Spectrum, ra.Response))
		if err != nil {
			return err
		}
		curves = append(curves, drawing.RandomCurve{Name: ra.Axis.String(), Response: ra.Response, Density: d})
	}
	o := &drawing.Options{Title: fmt.Sprintf("%s: random vibration at the %s", title, s.point), PointName: s.point}
	if v.Level != "" {
		o.Notes = []string{"test level: " + v.Level}
	}
	if err := s.write("random-spectrum.svg", func(w io.Writer) error { return drawing.RandomSpectrum(w, v.Spectrum, curves, o) }); err != nil {
		return err
	}
	k := sigmaOf(v)
	mo := &drawing.Options{Title: title + ": contact margins in random vibration", Limit: k, LimitName: "margin for the preload"}
	if r := s.d.Requirements.MinRandomMargin; r > 0 {
		mo.Limit, mo.LimitName = r, "required margin"
	}
	return s.write("random-margins.svg", func(w io.Writer) error { return drawing.RandomMargins(w, curves, mo) })
}
