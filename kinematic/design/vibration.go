package design

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// The random vibration section of a design: a test spectrum (or a named
// test level with its source), the damping, the test's time per axis, the
// axes, and the evaluation of the requirements on it (no contact opening
// at k σ, the RMS displacement of the point of interest).

// maxBreakpoints bounds the breakpoints of a spectrum.
const maxBreakpoints = 256

// Vibration is a random vibration test, or a transport, that the design
// must survive: a stationary Gaussian base acceleration of a given power
// spectral density along each of its axes in turn, for Duration per axis
// (kinematic.Model.Random).
type Vibration struct {
	// Spectrum is the base acceleration's power spectral density, g²/Hz
	// (kinematic.Spectrum: breakpoints with a level or a slope in
	// dB/octave, log–log between them).
	Spectrum kinematic.Spectrum

	// Level names the test level ("component qualification") and Source
	// where it comes from (a standard and its table); both optional, for
	// reports.
	Level, Source string

	// Case names the load case about which the response is linear: its
	// static contact forces (preload and gravity) and its stiffness. ""
	// means the first case.
	Case string

	// Damping is the modal damping ratio ζ, one value or six (one per
	// mode from the lowest), each in (0, 1); Q is the amplification
	// Q = 1/(2ζ) in its place, each > 0.5. At most one of the two; both
	// nil means kinematic's default, ζ = 0.02 (Q = 25).
	Damping, Q []float64

	// Duration is the time of the test per axis, s; 0 means
	// kinematic's default, 120 s.
	Duration float64

	// Axes are the directions of excitation, each once; nil means X, Y
	// and Z.
	Axes []Axis

	// Sigma is the k of the k-σ peaks and of the preload for a margin
	// (kinematic.Model.RandomPreload); 0 means 3.
	Sigma float64
}

// Axis is a direction of excitation of a [Vibration].
type Axis int

// The axes: the global x, y and z, and the worst direction over the
// sphere for the least contact margin (kinematic.Model.RandomWorst).
const (
	AxisX Axis = iota + 1
	AxisY
	AxisZ
	AxisWorst
)

var axisNames = [...]string{AxisX: "x", AxisY: "y", AxisZ: "z", AxisWorst: "worst"}

// String returns the axis's name in the file: "x", "y", "z" or "worst".
func (a Axis) String() string {
	if a > 0 && int(a) < len(axisNames) {
		return axisNames[a]
	}
	return fmt.Sprintf("Axis(%d)", int(a))
}

// direction returns the unit direction of a global axis (zero for Worst).
func (a Axis) direction() r3.Vec {
	switch a {
	case AxisX:
		return r3.Vec{X: 1}
	case AxisY:
		return r3.Vec{Y: 1}
	case AxisZ:
		return r3.Vec{Z: 1}
	}
	return r3.Vec{}
}

// axes returns the axes of v, the default X, Y, Z when none are given.
func (v *Vibration) axes() []Axis {
	if len(v.Axes) == 0 {
		return []Axis{AxisX, AxisY, AxisZ}
	}
	return v.Axes
}

// sigma returns the k of the k-σ figures.
func (v *Vibration) sigma() float64 {
	if v.Sigma > 0 {
		return v.Sigma
	}
	return 3
}

// options returns the options of kinematic.Model.Random along the axis
// (the direction is left zero for Worst) at the point of interest.
func (v *Vibration) options(a Axis, point r3.Vec) kinematic.RandomOptions {
	return kinematic.RandomOptions{
		Damping:   append([]float64(nil), v.Damping...),
		Q:         append([]float64(nil), v.Q...),
		Direction: a.direction(),
		Duration:  v.Duration,
		Sigma:     v.Sigma,
		Point:     point,
	}
}

// clone returns a copy of v that shares no slice with it.
func (v *Vibration) clone() *Vibration {
	c := *v
	c.Spectrum.Points = append([]kinematic.Breakpoint(nil), v.Spectrum.Points...)
	c.Damping = append([]float64(nil), v.Damping...)
	c.Q = append([]float64(nil), v.Q...)
	c.Axes = append([]Axis(nil), v.Axes...)
	return &c
}

// The units of the vibration section. A slope in dB/octave and an
// acceleration spectral density in g²/Hz are the units of test
// specifications and of kinematic.Spectrum; a plain number in a file that
// declares "units": "si" is read in them. (m/s²)²/Hz is 1/g² g²/Hz with
// g = 9.80665 m/s² (3rd CGPM, 1901).
var (
	spectralDensity = &quantityKind{what: "an acceleration spectral density", si: "g^2/Hz", hints: []string{"g^2/Hz"}, units: []unit{
		{name: "g^2/Hz"}, {name: "g2/Hz"}, {name: "(m/s^2)^2/Hz", factor: 1 / (kinematic.StandardGravity * kinematic.StandardGravity)},
	}}
	slope = &quantityKind{what: "a slope", si: "dB/oct", hints: []string{"dB/oct"}, units: []unit{
		{name: "dB/oct"}, {name: "dB/octave"},
	}}
	duration = &quantityKind{what: "a time", si: "s", hints: []string{"s", "min"}, units: []unit{
		{name: "s"}, {name: "ms", pow10: -3}, {name: "min", factor: 60}, {name: "h", factor: 3600},
	}}
)

// readVibration reads the vibration section.
func (r *reader) readVibration(root *node, d *Design) error {
	n := root.get("vibration")
	if n == nil {
		return nil
	}
	const path = "vibration"
	if err := fields(n, path, "a vibration section", "spectrum", "case", "damping", "duration", "axes", "sigma"); err != nil {
		return err
	}
	v := &Vibration{}
	sn := n.get("spectrum")
	if sn == nil {
		return errorf(join(path, "spectrum"), ErrMissing, "the test spectrum {\"points\": [{\"frequency\": ..., \"asd\": ...}, ...]}")
	}
	if err := r.readSpectrum(sn, join(path, "spectrum"), v); err != nil {
		return err
	}
	if err := optText(n, path, "case", maxName, &v.Case); err != nil {
		return err
	}
	if dn := n.get("damping"); dn != nil {
		if err := readDamping(dn, join(path, "damping"), v); err != nil {
			return err
		}
	}
	if err := r.optQuantity(n, path, "duration", duration, &v.Duration); err != nil {
		return err
	}
	if n.get("duration") != nil && !(v.Duration > 0) {
		return errorf(join(path, "duration"), ErrRange, "a test lasts a time > 0, got %g s; leave duration out for 120 s", v.Duration)
	}
	if an := n.get("axes"); an != nil {
		elems, err := list(an, join(path, "axes"), len(axisNames))
		if err != nil {
			return err
		}
		for i, e := range elems {
			p := index(join(path, "axes"), i)
			s, err := text(e, p, maxName)
			if err != nil {
				return err
			}
			a := Axis(0)
			for k, name := range axisNames {
				if name != "" && name == s {
					a = Axis(k)
				}
			}
			if a == 0 {
				return errorf(p, ErrRange, "%q; an axis is \"x\", \"y\", \"z\" or \"worst\"", s)
			}
			v.Axes = append(v.Axes, a)
		}
	}
	if err := optNumber(n, path, "sigma", &v.Sigma); err != nil {
		return err
	}
	if n.get("sigma") != nil && !(v.Sigma > 0) {
		return errorf(join(path, "sigma"), ErrRange, "a number of standard deviations > 0, got %g; leave sigma out for 3", v.Sigma)
	}
	d.Vibration = v
	return nil
}

// readSpectrum reads a spectrum: its breakpoints and optional name and
// source.
func (r *reader) readSpectrum(n *node, path string, v *Vibration) error {
	if err := fields(n, path, "a spectrum", "name", "source", "points"); err != nil {
		return err
	}
	if err := optText(n, path, "name", maxText, &v.Level); err != nil {
		return err
	}
	if err := optText(n, path, "source", maxText, &v.Source); err != nil {
		return err
	}
	pn := n.get("points")
	if pn == nil {
		return errorf(join(path, "points"), ErrMissing, "the breakpoints, at least two: {\"frequency\": \"20 Hz\", \"asd\": \"0.01 g^2/Hz\"} or with a \"slope\" in dB/oct")
	}
	elems, err := list(pn, join(path, "points"), maxBreakpoints)
	if err != nil {
		return err
	}
	for i, e := range elems {
		p := index(join(path, "points"), i)
		if err := fields(e, p, "a breakpoint", "frequency", "asd", "slope"); err != nil {
			return err
		}
		var b kinematic.Breakpoint
		if err := r.reqQuantity(e, p, "frequency", frequency, &b.Frequency); err != nil {
			return err
		}
		if err := r.optQuantity(e, p, "asd", spectralDensity, &b.ASD); err != nil {
			return err
		}
		if err := r.optQuantity(e, p, "slope", slope, &b.Slope); err != nil {
			return err
		}
		v.Spectrum.Points = append(v.Spectrum.Points, b)
	}
	return nil
}

// readDamping reads {"zeta": number or numbers} or {"q": ...}.
func readDamping(n *node, path string, v *Vibration) error {
	if err := fields(n, path, "a damping", "zeta", "q"); err != nil {
		return err
	}
	z, q := n.get("zeta"), n.get("q")
	switch {
	case z != nil && q != nil:
		return errorf(join(path, "q"), ErrRange, "give the damping as zeta or as q, not both")
	case z == nil && q == nil:
		return errorf(join(path, "zeta"), ErrMissing, "the damping ratio zeta (or q), one number or six")
	}
	key, dst, m := "zeta", &v.Damping, z
	if q != nil {
		key, dst, m = "q", &v.Q, q
	}
	p := join(path, key)
	if m.kind == numberNode {
		x, err := number(m, p)
		*dst = []float64{x}
		return err
	}
	elems, err := list(m, p, 6)
	if err != nil {
		return err
	}
	for i, e := range elems {
		x, err := number(e, index(p, i))
		if err != nil {
			return err
		}
		*dst = append(*dst, x)
	}
	return nil
}

// checkVibration checks the vibration section's own values and that the
// design holds what it needs: a payload with mass and inertia, and the
// load case.
func (d *Design) checkVibration() error {
	v := d.Vibration
	if v == nil {
		return nil
	}
	const path = "vibration"
	sp := join(path, "spectrum")
	if err := checkText(v.Level, join(sp, "name"), maxText); err != nil {
		return err
	}
	if err := checkText(v.Source, join(sp, "source"), maxText); err != nil {
		return err
	}
	if len(v.Spectrum.Points) > maxBreakpoints {
		return errorf(join(sp, "points"), ErrTooLarge, "%d breakpoints; at most %d", len(v.Spectrum.Points), maxBreakpoints)
	}
	if _, err := v.Spectrum.GRMS(); err != nil {
		return spectrumError(err, sp)
	}
	if len(v.Damping) > 0 && len(v.Q) > 0 {
		return errorf(join(path, "damping.q"), ErrRange, "give the damping as zeta or as q, not both")
	}
	for _, dm := range []struct {
		key  string
		vals []float64
	}{{"zeta", v.Damping}, {"q", v.Q}} {
		p := join(path, "damping."+dm.key)
		if dm.vals != nil && len(dm.vals) != 1 && len(dm.vals) != 6 {
			return errorf(p, ErrRange, "one value or six (one per mode), got %d", len(dm.vals))
		}
		for i, x := range dm.vals {
			pi := p
			if len(dm.vals) == 6 {
				pi = index(p, i)
			}
			switch {
			case math.IsNaN(x) || math.IsInf(x, 0):
				return errorf(pi, ErrNonFinite, "%g", x)
			case dm.key == "zeta" && !(x > 0 && x < 1):
				return errorf(pi, ErrRange, "a damping ratio lies in (0, 1), got %g", x)
			case dm.key == "q" && !(x > 0.5):
				return errorf(pi, ErrRange, "Q = 1/(2 zeta) must exceed 0.5 (an oscillating mode), got %g", x)
			}
		}
	}
	if !(v.Duration >= 0) || math.IsInf(v.Duration, 0) {
		return errorf(join(path, "duration"), ErrRange, "must be a finite time ≥ 0 (0: 120 s), got %g s", v.Duration)
	}
	if !(v.Sigma >= 0) || math.IsInf(v.Sigma, 0) {
		return errorf(join(path, "sigma"), ErrRange, "must be a finite number > 0 (0: 3), got %g", v.Sigma)
	}
	seen := map[Axis]int{}
	for i, a := range v.Axes {
		p := index(join(path, "axes"), i)
		if a < AxisX || a > AxisWorst {
			return errorf(p, ErrRange, "unknown axis %d", int(a))
		}
		if j, dup := seen[a]; dup {
			return errorf(p, ErrRange, "%q is also axes[%d]", a, j)
		}
		seen[a] = i
	}
	if err := d.needCase(path+".case", v.Case); err != nil {
		// needCase names the path under requirements; the case belongs to
		// the vibration section.
		var e *Error
		if errors.As(err, &e) {
			e.Path = join(path, "case")
		}
		return err
	}
	if !(d.Payload.Mass > 0) || d.Payload.Inertia == ([3][3]float64{}) {
		return errorf(path, ErrMissing, "a random vibration response needs the payload's mass and inertia")
	}
	return nil
}

// spectrumError returns kinematic's error about a spectrum with the
// file's path under sp ("vibration.spectrum.points[2].frequency").
func spectrumError(err error, sp string) error {
	var ke *kinematic.InputError
	if !errors.As(err, &ke) {
		return &Error{Path: sp, Err: err}
	}
	tr := func(f string) string {
		if f == "" {
			return ""
		}
		f = strings.TrimPrefix(f, "s.")
		f = strings.NewReplacer("Points", "points", ".Frequency", ".frequency", ".ASD", ".asd", ".Slope", ".slope").Replace(f)
		return join(sp, f)
	}
	return &Error{Path: tr(ke.Field), Other: tr(ke.Other), Err: ke.Err}
}

// The requirements on the vibration: checked when the file is read.
func (d *Design) needVibration() error {
	r := d.Requirements
	for _, l := range []struct {
		path string
		v    float64
	}{{"min_random_margin", r.MinRandomMargin}, {"max_random_displacement", r.MaxRandomDisplacement}, {"max_random_openings", r.MaxRandomOpenings}} {
		if !(l.v >= 0) || math.IsInf(l.v, 0) {
			return errorf(join(reqPath, l.path), ErrRange, "a limit must be finite and > 0 (0: not set), got %g", l.v)
		}
		if l.v > 0 && d.Vibration == nil {
			return errorf(join(reqPath, l.path), ErrMissing, "a random vibration requirement needs the vibration section (its spectrum)")
		}
	}
	return nil
}

type wireVibration struct {
	Spectrum wireSpectrum `json:"spectrum"`
	Case     string       `json:"case,omitempty"`
	Damping  *wireDamping `json:"damping,omitempty"`
	Duration float64      `json:"duration,omitempty"`
	Axes     []string     `json:"axes,omitempty"`
	Sigma    float64      `json:"sigma,omitempty"`
}

type wireSpectrum struct {
	Name   string           `json:"name,omitempty"`
	Source string           `json:"source,omitempty"`
	Points []wireBreakpoint `json:"points"`
}

type wireBreakpoint struct {
	Frequency float64 `json:"frequency"`
	ASD       float64 `json:"asd,omitempty"`
	Slope     float64 `json:"slope,omitempty"`
}

type wireDamping struct {
	Zeta []float64 `json:"zeta,omitempty"`
	Q    []float64 `json:"q,omitempty"`
}

// wireVibration returns the file's form of the vibration section, nil
// without one.
func (d *Design) wireVibration() *wireVibration {
	v := d.Vibration
	if v == nil {
		return nil
	}
	w := &wireVibration{Spectrum: wireSpectrum{Name: v.Level, Source: v.Source}, Case: v.Case, Duration: v.Duration, Sigma: v.Sigma}
	for _, b := range v.Spectrum.Points {
		w.Spectrum.Points = append(w.Spectrum.Points, wireBreakpoint{Frequency: b.Frequency, ASD: b.ASD, Slope: b.Slope})
	}
	if len(v.Damping) > 0 || len(v.Q) > 0 {
		w.Damping = &wireDamping{Zeta: v.Damping, Q: v.Q}
	}
	for _, a := range v.Axes {
		w.Axes = append(w.Axes, a.String())
	}
	return w
}

// RandomAxis is the random vibration response along one axis of the
// design's [Vibration].
type RandomAxis struct {
	Axis Axis

	// Options are those of kinematic.Model.Random that gave Response,
	// with the direction found for AxisWorst: what
	// kinematic.Model.RandomDensity needs to draw the response's
	// spectrum.
	Options kinematic.RandomOptions

	// Response is the response along the axis (kinematic.Random).
	Response kinematic.Random

	// Preload is the factor on the preload elements that gives every
	// contact a margin of the vibration's Sigma along the axis
	// (kinematic.Model.RandomPreload); nil when the design has no
	// preloads or no factor does, and PreloadNote says why.
	Preload     *kinematic.RandomPreload
	PreloadNote string
}

// random makes the random vibration analysis of the design's vibration
// section into e.Random, along each axis.
func (e *Evaluation) random(b *Built) error {
	d := &b.d
	v := d.Vibration
	if v == nil {
		return nil
	}
	k := d.caseIndex(v.Case)
	lc := d.Cases[k]
	e.RandomCase = lc.Name
	e.randomSpectrum = "spectrum"
	e.randomDuration = "the default duration of kinematic.RandomOptions"
	if v.Duration > 0 {
		e.randomDuration = fmt.Sprintf("%.4g s", v.Duration)
	}
	if v.Level != "" {
		e.randomSpectrum = fmt.Sprintf("spectrum %q", v.Level)
	}
	t := caseTranslator(b, k, map[string]string{"opt": "vibration", "s": "vibration.spectrum", "opt.Point": "point_of_interest"})
	for _, a := range v.axes() {
		opt := v.options(a, d.Point)
		var res kinematic.Random
		var err error
		if a == AxisWorst {
			res, err = b.model.RandomWorst(lc, v.Spectrum, &opt)
			opt.Direction = res.Direction
		} else {
			res, err = b.model.Random(lc, v.Spectrum, &opt)
		}
		if err != nil {
			if !errors.Is(err, ErrRange) && !errors.Is(err, ErrDegenerate) {
				return t.translate(err)
			}
			// A contact in tension under the case, or a singular
			// stiffness: no response, and the requirements fail.
			e.randomNote = fmt.Sprintf("no random vibration response under case %q: %v", lc.Name, unwrapKinematic(err))
			e.Notes = append(e.Notes, e.randomNote)
			e.Random = nil
			return nil
		}
		ra := RandomAxis{Axis: a, Options: opt, Response: res}
		if len(d.Preloads) == 0 {
			ra.PreloadNote = "the design has no preload to scale"
		} else if p, err := b.model.RandomPreload(lc, v.Spectrum, &opt); err == nil {
			ra.Preload = &p
		} else {
			ra.PreloadNote = fmt.Sprintf("no preload factor gives a margin of %g: %v", v.sigma(), unwrapKinematic(err))
		}
		e.Random = append(e.Random, ra)
	}
	return nil
}

// randomVerdicts returns the verdicts of the random vibration
// requirements, one per axis: the least contact margin, and the RMS
// displacement of the point of interest relative to the base.
func (e Evaluation) randomVerdicts() Verdicts {
	r := e.req
	var vs Verdicts
	if r.MinRandomMargin == 0 && r.MaxRandomDisplacement == 0 && r.MaxRandomOpenings == 0 {
		return nil
	}
	if len(e.Random) == 0 {
		if r.MinRandomMargin > 0 {
			vs = append(vs, Verdict{Requirement: "requirements.min_random_margin", Limit: r.MinRandomMargin, Min: true, Note: e.randomNote})
		}
		if r.MaxRandomDisplacement > 0 {
			vs = append(vs, Verdict{Requirement: "requirements.max_random_displacement", Value: math.Inf(1), Limit: r.MaxRandomDisplacement, Unit: "m", Note: e.randomNote})
		}
		if r.MaxRandomOpenings > 0 {
			vs = append(vs, Verdict{Requirement: "requirements.max_random_openings", Value: math.Inf(1), Limit: r.MaxRandomOpenings, Note: e.randomNote})
		}
		return vs
	}
	for _, ra := range e.Random {
		res := ra.Response
		along := fmt.Sprintf("along %s %s", ra.Axis, vecString(res.Direction))
		cond := fmt.Sprintf("%s %.3g grms, case %q", e.randomSpectrum, res.Input/kinematic.StandardGravity, e.RandomCase)
		if r.MinRandomMargin > 0 {
			c := res.Contacts[res.Least]
			vs = append(vs, Verdict{Requirement: "requirements.min_random_margin", Value: c.Margin, Limit: r.MinRandomMargin, Min: true,
				Pass: c.Margin >= r.MinRandomMargin,
				Note: fmt.Sprintf("contact %s %s: static %.4g N over RMS dynamic %.4g N; %s", c.Label, along, c.Static, c.Dynamic, cond)})
		}
		if r.MaxRandomDisplacement > 0 {
			x := res.Displacement.RMS
			vs = append(vs, Verdict{Requirement: "requirements.max_random_displacement", Value: x, Limit: r.MaxRandomDisplacement, Unit: "m",
				Pass: x <= r.MaxRandomDisplacement,
				Note: fmt.Sprintf("RMS at the %s relative to the base %s; %s", e.point, along, cond)})
		}
		if r.MaxRandomOpenings > 0 {
			worst := 0
			for i, c := range res.Contacts {
				if c.Openings > res.Contacts[worst].Openings {
					worst = i
				}
			}
			c := res.Contacts[worst]
			vs = append(vs, Verdict{Requirement: "requirements.max_random_openings", Value: c.Openings, Limit: r.MaxRandomOpenings,
				Pass: c.Openings <= r.MaxRandomOpenings,
				Note: fmt.Sprintf("contact %s %s: expected openings in %s (Rice), margin %.3g σ, chance of at least one %s; %s",
					c.Label, along, e.randomDuration, c.Margin, tinyString(c.Probability), cond)})
		}
	}
	return vs
}
