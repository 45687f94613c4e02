package design

import (
	"fmt"
	"math"
	"strings"
	"unicode/utf8"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/errs"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// Validate reports whether the design is complete and in range: every
// count within the format's bounds, every number finite and in its
// domain, every name well formed and every reference resolved, the
// coupling buildable and exactly constrained (six independent contacts),
// the payload's inertia symmetric and positive definite or zero, and
// every tolerance naming a dimension of the coupling once. It returns nil
// or an [*Error] naming the JSON path of the first entry at fault, with
// the errors of package kinematic translated to that path.
func (d *Design) Validate() error {
	_, err := d.Build()
	return err
}

// notExact returns the error for a coupling that is not exactly
// constrained.
func notExact(b *Built) error {
	an := b.analysis
	why := fmt.Sprintf("%d contacts of rank %d", len(b.contacts), an.Rank)
	if an.DOF > 0 {
		why += fmt.Sprintf(", leaving %d freedom(s)", an.DOF)
	}
	if len(an.Participants) > 0 {
		var sets []string
		for _, p := range an.Participants {
			sets = append(sets, "{"+strings.Join(p, ", ")+"}")
		}
		why += ", redundant among " + strings.Join(sets, " ")
	}
	return errorf("seats", ErrNotExact, "%s; a design needs six independent contacts", why)
}

// buildCoupling makes the coupling and its contacts.
func (b *Built) buildCoupling() error {
	d := &b.d
	t := translator{b: b}
	c := kinematic.Coupling{Pairs: make([]kinematic.Pair, len(d.Balls))}
	for i, ball := range d.Balls {
		c.Pairs[i] = kinematic.Pair{
			Name: ball.Name,
			Ball: kinematic.Ball{Centre: ball.Centre, Radius: ball.Radius, Material: ball.Material, Canoe: ball.Canoe},
			Seat: d.Seats[i].kinematic(),
		}
	}
	if _, err := c.Contacts(); err != nil {
		return t.translate(err)
	}
	for i, s := range d.Seats {
		if (s.Type != Vee && s.Type != Rods) || s.Direction != zeroVec {
			continue
		}
		turned, err := c.WithGroove(i, s.Azimuth, s.Reference)
		if err != nil {
			return grooveError(err, i, t)
		}
		c = turned
	}
	cs, err := c.Contacts()
	if err != nil {
		return t.translate(err)
	}
	b.coupling, b.contacts = c, cs
	b.pairOf = make([]int, 0, len(cs))
	for i, s := range d.Seats {
		for range s.Type.contacts() {
			b.pairOf = append(b.pairOf, i)
		}
	}
	seen := map[string]int{}
	for k, cn := range cs {
		if j, dup := seen[cn.Label]; dup && b.pairOf[j] != b.pairOf[k] {
			p := b.pairOf[k]
			return errorf(join(index("balls", p), "name"), ErrRange, "contact label %q is also one of balls[%d]'s; choose names that do not end like another's contacts", cn.Label, b.pairOf[j])
		}
		seen[cn.Label] = k
	}
	return nil
}

// grooveError translates an error of Coupling.WithGroove(i, angle, ref)
// for seat i. A radial reference that is undefined because the ball lies
// at the centroid of the balls is the reference's fault, not the ball's.
func grooveError(err error, i int, t translator) error {
	s := index("seats", i)
	t.params = map[string]string{"i": join(s, "azimuth"), "angle": join(s, "azimuth"), "ref": join(s, "reference")}
	e := t.translate(err)
	if de, ok := e.(*Error); ok && de.Path == join(index("balls", i), "centre") {
		de.Path = join(s, "reference")
	}
	return e
}

// contacts returns the number of contacts of a seat of type t.
func (t SeatType) contacts() int {
	switch t {
	case Vee, Rods:
		return 2
	case Flat:
		return 1
	}
	return 3
}

// kinematic returns the seat as kinematic's type. A groove given by
// azimuth gets a provisional direction normal to Up, turned to its
// azimuth by Coupling.WithGroove.
func (s Seat) kinematic() kinematic.Seat {
	dir := s.Direction
	if dir == zeroVec {
		dir = normalTo(s.Up)
	}
	switch s.Type {
	case Vee:
		return kinematic.Vee{Direction: dir, Up: s.Up, HalfAngle: s.HalfAngle, FlankRadius: s.FlankRadius, Material: s.Material}
	case Rods:
		return kinematic.Rods{Direction: dir, Up: s.Up, HalfAngle: s.HalfAngle, RodRadius: s.RodRadius, Material: s.Material}
	case Flat:
		return kinematic.Flat{Up: s.Up, Material: s.Material}
	case Trihedral:
		return kinematic.Trihedral{Up: s.Up, Azimuth: s.Toward, HalfAngle: s.HalfAngle, Material: s.Material}
	case Cone:
		return kinematic.Cone{Up: s.Up, Azimuth: s.Toward, HalfAngle: s.HalfAngle, Material: s.Material}
	}
	return nil
}

// normalTo returns a vector normal to v (zero for a zero or non-finite
// v): v crossed with the coordinate axis least aligned with it.
func normalTo(v r3.Vec) r3.Vec {
	if !finite(v) {
		return r3.Vec{}
	}
	a := r3.Vec{X: 1}
	ax, ay, az := math.Abs(v.X), math.Abs(v.Y), math.Abs(v.Z)
	switch {
	case ay <= ax && ay <= az:
		a = r3.Vec{Y: 1}
	case az <= ax && az <= ay:
		a = r3.Vec{Z: 1}
	}
	return r3.Cross(v, a)
}

// check validates everything that needs no kinematic object.
func (d *Design) check() error {
	if err := checkText(d.Name, "name", maxText); err != nil {
		return err
	}
	if err := checkText(d.Description, "description", maxText); err != nil {
		return err
	}
	if len(d.Balls) == 0 {
		return errorf("balls", ErrMissing, "a design needs its balls")
	}
	if len(d.Balls) > maxBalls {
		return errorf("balls", ErrTooLarge, "%d balls; at most %d", len(d.Balls), maxBalls)
	}
	if len(d.Seats) != len(d.Balls) {
		return errorf("seats", ErrRange, "%d seats for %d balls; seats[i] is the seat of balls[i]", len(d.Seats), len(d.Balls))
	}
	names := map[string]int{}
	for i, b := range d.Balls {
		p := index("balls", i)
		if err := checkBallName(b.Name, join(p, "name")); err != nil {
			return err
		}
		n := b.Name
		if n == "" {
			n = defaultName(i)
		}
		if j, dup := names[n]; dup {
			return errorf(join(p, "name"), ErrRange, "%q is also the name of balls[%d]", n, j)
		}
		names[n] = i
		if !finite(b.Centre) {
			return errorf(join(p, "centre"), ErrNonFinite, "%v", b.Centre)
		}
		if err := checkLength(b.Radius, join(p, "radius")); err != nil {
			return err
		}
		if err := checkMaterial(b.Material, join(p, "material")); err != nil {
			return err
		}
	}
	for i, s := range d.Seats {
		if err := s.check(index("seats", i), d.Balls[i].Radius); err != nil {
			return err
		}
	}
	if len(d.Preloads) > maxPreloads {
		return errorf("preloads", ErrTooLarge, "%d preloads; at most %d", len(d.Preloads), maxPreloads)
	}
	for i, p := range d.Preloads {
		if err := checkText(p.Name, join(index("preloads", i), "name"), maxName); err != nil {
			return err
		}
	}
	if err := checkPayload(d.Payload); err != nil {
		return err
	}
	if err := d.checkCases(); err != nil {
		return err
	}
	if len(d.Tolerances) > maxTolerances {
		return errorf("tolerances", ErrTooLarge, "%d tolerances; at most %d", len(d.Tolerances), maxTolerances)
	}
	for i, t := range d.Tolerances {
		if len(t.Dimension) > maxName {
			return errorf(join(index("tolerances", i), "dimension"), ErrTooLarge, "%d bytes; at most %d", len(t.Dimension), maxName)
		}
	}
	if !finite(d.Point) {
		return errorf("point_of_interest", ErrNonFinite, "%v", d.Point)
	}
	if !finite(d.Axis) {
		return errorf("axis", ErrNonFinite, "%v", d.Axis)
	}
	if th := d.Thermal; th != nil {
		for _, f := range []struct {
			path string
			v    float64
		}{{"thermal.delta_t", th.DeltaT}, {"thermal.moving_alpha", th.Moving}, {"thermal.base_alpha", th.Base}} {
			if math.IsNaN(f.v) || math.IsInf(f.v, 0) {
				return errorf(f.path, ErrNonFinite, "%g", f.v)
			}
		}
		if !finite(th.BaseRef) {
			return errorf("thermal.base_ref", ErrNonFinite, "%v", th.BaseRef)
		}
	}
	if f := d.Friction; f != nil {
		if err := errs.CheckMuLow(f.Mu, true); err != nil {
			return &Error{Path: "friction.mu", Err: err}
		}
		if err := errs.CheckMu(f.Mu); err != nil {
			return &Error{Path: "friction.mu", Err: err}
		}
	}
	if mc := d.MonteCarlo; mc != nil && (mc.Samples < 1 || mc.Samples > maxSamples) {
		return errorf("monte_carlo.samples", ErrRange, "must be in [1, %d], got %d", maxSamples, mc.Samples)
	}
	if err := d.checkStudy(); err != nil {
		return err
	}
	if err := d.checkVibration(); err != nil {
		return err
	}
	if err := d.checkCycles(); err != nil {
		return err
	}
	return d.checkRequirements()
}

// defaultName returns the name of the ball at position i when it has
// none, as kinematic names pairs.
func defaultName(i int) string {
	if i < 26 {
		return string(rune('A' + i))
	}
	return fmt.Sprintf("P%d", i+1)
}

// checkLength checks a length that must be finite and > 0.
func checkLength(v float64, path string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return errorf(path, ErrNonFinite, "%g", v)
	}
	if !(v > 0) {
		return errorf(path, ErrRange, "must be a finite length > 0, got %g m", v)
	}
	return nil
}

// checkText checks a text of at most max bytes of UTF-8.
func checkText(s, path string, max int) error {
	if len(s) > max {
		return errorf(path, ErrTooLarge, "%d bytes; at most %d", len(s), max)
	}
	if !utf8.ValidString(s) {
		return errorf(path, ErrRange, "not valid UTF-8 text")
	}
	return nil
}

// checkBallName checks a ball's name: it labels contacts and names
// dimensions ("A.Ball.Radius"), so it holds letters, digits and "_" and
// starts with a letter.
func checkBallName(n, path string) error {
	if n == "" {
		return nil
	}
	if len(n) > maxName {
		return errorf(path, ErrTooLarge, "%d bytes; at most %d", len(n), maxName)
	}
	for i, r := range n {
		letter := r >= 'A' && r <= 'Z' || r >= 'a' && r <= 'z'
		if !(letter || i > 0 && (r >= '0' && r <= '9' || r == '_')) {
			return errorf(path, ErrRange, "%q: a ball's name is letters, digits and \"_\", starting with a letter", n)
		}
	}
	return nil
}

func checkMaterial(m hertz.Material, path string) error {
	switch {
	case m == hertz.Material{}:
		return errorf(path, ErrMissing, "no material")
	case !(m.E > 0) || math.IsInf(m.E, 0):
		return errorf(join(path, "e"), ErrRange, "Young's modulus must be a finite pressure > 0, got %g Pa", m.E)
	case !(m.Nu > -1 && m.Nu <= 0.5):
		return errorf(join(path, "nu"), ErrRange, "Poisson's ratio must be in (-1, 0.5], got %g", m.Nu)
	case math.IsNaN(m.Alpha) || math.IsInf(m.Alpha, 0):
		return errorf(join(path, "alpha"), ErrNonFinite, "%g", m.Alpha)
	case !(m.Allowable >= 0) || math.IsInf(m.Allowable, 0):
		return errorf(join(path, "allowable"), ErrRange, "must be a finite pressure ≥ 0 (0: none on file), got %g Pa", m.Allowable)
	}
	if err := checkText(m.Name, join(path, "name"), maxText); err != nil {
		return err
	}
	return checkText(m.Source, join(path, "source"), maxText)
}

// check validates a seat whose ball has radius r.
func (s Seat) check(path string, r float64) error {
	if s.Type < Vee || s.Type > Cone {
		return errorf(join(path, "type"), ErrRange, "unknown seat type %d", int(s.Type))
	}
	groove := s.Type == Vee || s.Type == Rods
	socket := s.Type == Trihedral || s.Type == Cone
	// Fields that do not belong to the type must be zero: the file has no
	// place for them.
	for _, f := range []struct {
		key string
		set bool
		ok  bool
	}{
		{"half_angle", s.HalfAngle != 0, s.Type != Flat},
		{"flank_radius", s.FlankRadius != 0, s.Type == Vee},
		{"rod_radius", s.RodRadius != 0, s.Type == Rods},
		{"direction", s.Direction != zeroVec, groove},
		{"azimuth", s.Azimuth != 0, groove},
		{"reference", s.Reference != kinematic.Radial, groove},
		{"toward", s.Toward != zeroVec, socket},
	} {
		if f.set && !f.ok {
			return errorf(join(path, f.key), ErrRange, "not a field of a %v seat", s.Type)
		}
	}
	if groove && s.Direction != zeroVec && (s.Azimuth != 0 || s.Reference != kinematic.Radial) {
		return errorf(join(path, "azimuth"), ErrRange, "a groove given by its direction has no azimuth or reference")
	}
	for _, v := range []struct {
		key string
		v   r3.Vec
	}{{"up", s.Up}, {"direction", s.Direction}, {"toward", s.Toward}} {
		if !finite(v.v) {
			return errorf(join(path, v.key), ErrNonFinite, "%v", v.v)
		}
	}
	if math.IsNaN(s.HalfAngle) || math.IsInf(s.HalfAngle, 0) {
		return errorf(join(path, "half_angle"), ErrNonFinite, "%g", s.HalfAngle)
	}
	if s.Type != Flat && !(s.HalfAngle > 0 && s.HalfAngle < math.Pi/2) {
		return errorf(join(path, "half_angle"), ErrRange, "must be in (0, 90) deg, got %.6g deg", s.HalfAngle/radPerDeg)
	}
	if s.Type == Vee && s.FlankRadius != 0 && !(s.FlankRadius > r && !math.IsInf(s.FlankRadius, 0)) {
		return errorf(join(path, "flank_radius"), ErrRange, "must be 0 (flat flanks) or a finite length greater than the ball's radius %g m, got %g m", r, s.FlankRadius)
	}
	if s.Type == Rods {
		if err := checkLength(s.RodRadius, join(path, "rod_radius")); err != nil {
			return err
		}
	}
	if math.IsNaN(s.Azimuth) || math.IsInf(s.Azimuth, 0) {
		return errorf(join(path, "azimuth"), ErrNonFinite, "%g", s.Azimuth)
	}
	if s.Reference != kinematic.Radial && s.Reference != kinematic.FrameX {
		return errorf(join(path, "reference"), ErrRange, "unknown reference %d", int(s.Reference))
	}
	if s.Type == Trihedral && s.Toward == zeroVec {
		return errorf(join(path, "toward"), ErrMissing, "the direction of the socket's first contact")
	}
	return checkMaterial(s.Material, join(path, "material"))
}

// checkPayload checks the mass and the numbers of the payload, which the
// requirements rely on, and what the file cannot express: an inertia
// tensor that is not exactly symmetric (the file holds six entries). The
// rest (a positive definite tensor) is kinematic.NewModel's to check.
func checkPayload(p kinematic.Payload) error {
	// The requirements check whether the payload has a mass; a negative
	// or non-finite mass must be blamed on payload.mass first.
	if math.IsNaN(p.Mass) || math.IsInf(p.Mass, 0) {
		return errorf("payload.mass", ErrNonFinite, "%g", p.Mass)
	}
	if p.Mass < 0 {
		return errorf("payload.mass", ErrRange, "must be a mass ≥ 0, got %g kg", p.Mass)
	}
	if !finite(p.Centre) {
		return errorf("payload.centre", ErrNonFinite, "%v", p.Centre)
	}
	for r := range 3 {
		for c := r; c < 3; c++ {
			if v := p.Inertia[r][c]; math.IsNaN(v) || math.IsInf(v, 0) {
				return errorf(join("payload.inertia", inertiaKey(r, c)), ErrNonFinite, "%g", v)
			}
		}
	}
	for r := range 3 {
		for c := r + 1; c < 3; c++ {
			if p.Inertia[r][c] != p.Inertia[c][r] && !(math.IsNaN(p.Inertia[r][c]) && math.IsNaN(p.Inertia[c][r])) {
				return errorf(join("payload.inertia", inertiaKey(r, c)), ErrRange, "the tensor must be symmetric: [%d][%d] = %g, [%d][%d] = %g", r, c, p.Inertia[r][c], c, r, p.Inertia[c][r])
			}
		}
	}
	return nil
}

func (d *Design) checkCases() error {
	if len(d.Cases) > maxCases {
		return errorf("cases", ErrTooLarge, "%d load cases; at most %d", len(d.Cases), maxCases)
	}
	names := map[string]int{}
	for i, lc := range d.Cases {
		p := index("cases", i)
		switch {
		case lc.Name == "":
			return errorf(join(p, "name"), ErrMissing, "a load case needs a name")
		}
		if err := checkText(lc.Name, join(p, "name"), maxName); err != nil {
			return err
		}
		if j, dup := names[lc.Name]; dup {
			return errorf(join(p, "name"), ErrRange, "%q is also the name of cases[%d]", lc.Name, j)
		}
		names[lc.Name] = i
		if !(lc.PreloadFactor >= 0) || math.IsInf(lc.PreloadFactor, 0) {
			return errorf(join(p, "preload"), ErrRange, "the factor on the preloads must be a finite number ≥ 0, got %g", lc.PreloadFactor)
		}
		if !finite(lc.Gravity) {
			return errorf(join(p, "gravity"), ErrNonFinite, "%v", lc.Gravity)
		}
		if !finite(lc.Acceleration) {
			return errorf(join(p, "acceleration"), ErrNonFinite, "%v", lc.Acceleration)
		}
		if len(lc.Applied) > maxApplied {
			return errorf(join(p, "applied"), ErrTooLarge, "%d loads; at most %d", len(lc.Applied), maxApplied)
		}
		for j, w := range lc.Applied {
			if !finite(w.F) || !finite(w.M) {
				return errorf(index(join(p, "applied"), j), ErrNonFinite, "%+v", w)
			}
		}
	}
	return nil
}

// caseIndex returns the index of the load case named name ("" the first
// case), or -1.
func (d *Design) caseIndex(name string) int {
	if len(d.Cases) == 0 {
		return -1
	}
	if name == "" {
		return 0
	}
	for i, lc := range d.Cases {
		if lc.Name == name {
			return i
		}
	}
	return -1
}

// checkRequirements checks the requirements' limits and that the design
// holds what each requirement needs. The design's own entries are checked
// before (check), so a prerequisite that is missing here is the
// requirement's fault, not a bad value elsewhere.
func (d *Design) checkRequirements() error {
	if err := d.Requirements.checkLimits(); err != nil {
		return err
	}
	for _, step := range []func() error{d.needLoads, d.needPayload, d.needStudies, d.needMore, d.needVibration, d.needHysteresis} {
		if err := step(); err != nil {
			return err
		}
	}
	return nil
}

// reqPath is the path of the requirements object.
const reqPath = "requirements"

// checkLimits checks that every limit is finite and ≥ 0 (0: not set),
// and that no part of a requirement is set without its limit.
func (r Requirements) checkLimits() error {
	for _, l := range []struct {
		path string
		v    float64
	}{
		{"min_centre_index", r.MinCentreIndex},
		{"min_contact_index", r.MinContactIndex},
		{"max_pressure_ratio", r.MaxPressureRatio},
		{"min_contact_force", r.MinContactForce},
		{"min_shock.level", r.MinShock},
		{"min_frequency.limit", r.MinFrequency},
		{"max_error.worst_case", r.MaxWorst},
		{"max_error.rss", r.MaxRSS},
		{"max_study.limit", r.MaxStudy},
		{"max_thermal_drift", r.MaxThermalDrift},
	} {
		if !(l.v >= 0) || math.IsInf(l.v, 0) {
			return errorf(join(reqPath, l.path), ErrRange, "a limit must be finite and > 0 (0: not set), got %g", l.v)
		}
	}
	for _, l := range []struct {
		key string
		v   float64
	}{{"min_centre_index", r.MinCentreIndex}, {"min_contact_index", r.MinContactIndex}} {
		if l.v >= 1 {
			return errorf(join(reqPath, l.key), ErrRange, "%s", indexFloor(l.v))
		}
	}
	// A case named without its requirement, or a percentile without its
	// limit, has no place in the file.
	for _, o := range []struct {
		path   string
		set    bool
		parent bool
	}{
		{"min_shock.case", r.ShockCase != "", r.MinShock > 0},
		{"min_frequency.case", r.FrequencyCase != "", r.MinFrequency > 0},
		{"seating.case", r.HomingCase != "", r.Homing},
		{"max_study.percentile", r.StudyPercentile != P99, r.MaxStudy > 0},
		{"max_error.along_axis", r.AlongAxis, r.MaxWorst > 0 || r.MaxRSS > 0},
	} {
		if o.set && !o.parent {
			return errorf(join(reqPath, o.path), ErrRange, "set without the requirement's limit")
		}
	}
	if r.StudyPercentile < P99 || r.StudyPercentile > P9973 {
		return errorf(join(reqPath, "max_study.percentile"), ErrRange, "unknown percentile %d", int(r.StudyPercentile))
	}
	return nil
}

// needCase returns an error at the requirement's path unless the design
// has the load case name ("" the first).
func (d *Design) needCase(path, name string) error {
	if len(d.Cases) == 0 {
		return errorf(join(reqPath, path), ErrMissing, "the requirement needs a load case; the design has none")
	}
	if d.caseIndex(name) < 0 {
		return errorf(join(reqPath, path), ErrRange, "no load case named %q", name)
	}
	return nil
}

// needLoads checks the prerequisites of the requirements on the load
// cases: a case, and an allowable for the pressure ratio.
func (d *Design) needLoads() error {
	r := d.Requirements
	if r.MaxPressureRatio > 0 {
		if err := d.needCase("max_pressure_ratio", ""); err != nil {
			return err
		}
		for i, b := range d.Balls {
			// A contact is judged only when both bodies have an
			// allowable on file (kinematic.ContactLoad.Allowable): a
			// steel seat's figure says nothing of a ceramic ball.
			for _, m := range []struct {
				path string
				mat  hertz.Material
			}{{index("balls", i) + ".material", b.Material}, {index("seats", i) + ".material", d.Seats[i].Material}} {
				if m.mat.Allowable == 0 {
					return errorf(join(reqPath, "max_pressure_ratio"), ErrMissing,
						"%s (%s) has no allowable contact pressure on file, so its contacts cannot be judged; give it an \"allowable\" or drop the requirement", m.path, m.mat.Name)
				}
			}
		}
	}
	if r.MinContactForce > 0 {
		if err := d.needCase("min_contact_force", ""); err != nil {
			return err
		}
	}
	if r.Homing {
		if err := d.needCase("seating.case", r.HomingCase); err != nil {
			return err
		}
		if d.Friction == nil {
			return errorf(join(reqPath, "seating"), ErrMissing, "seating needs friction (mu)")
		}
	}
	return nil
}

// needPayload checks the prerequisites of the shock and frequency
// requirements: a case and the payload's mass (and inertia).
func (d *Design) needPayload() error {
	r := d.Requirements
	if r.MinShock > 0 {
		if err := d.needCase("min_shock.case", r.ShockCase); err != nil {
			return err
		}
		if !(d.Payload.Mass > 0) {
			return errorf(join(reqPath, "min_shock"), ErrMissing, "a shock level needs the payload's mass (payload.mass is 0)")
		}
	}
	if r.MinFrequency > 0 {
		if err := d.needCase("min_frequency.case", r.FrequencyCase); err != nil {
			return err
		}
		if !(d.Payload.Mass > 0) || d.Payload.Inertia == ([3][3]float64{}) {
			return errorf(join(reqPath, "min_frequency"), ErrMissing, "natural frequencies need the payload's mass and inertia")
		}
	}
	return nil
}

// needStudies checks the prerequisites of the error, study and drift
// requirements.
func (d *Design) needStudies() error {
	r := d.Requirements
	if (r.MaxWorst > 0 || r.MaxRSS > 0) && len(d.Tolerances) == 0 {
		return errorf(join(reqPath, "max_error"), ErrMissing, "an error budget needs tolerances")
	}
	if r.AlongAxis && d.Axis == zeroVec {
		return errorf(join(reqPath, "max_error.along_axis"), ErrMissing, "the design has no axis")
	}
	if r.MaxStudy > 0 {
		if len(d.Tolerances) == 0 {
			return errorf(join(reqPath, "max_study"), ErrMissing, "a Monte Carlo study needs tolerances")
		}
		if d.MonteCarlo == nil {
			return errorf(join(reqPath, "max_study"), ErrMissing, "a Monte Carlo study needs monte_carlo (samples)")
		}
	}
	if r.MaxThermalDrift > 0 && d.Thermal == nil {
		return errorf(join(reqPath, "max_thermal_drift"), ErrMissing, "a thermal drift needs thermal (delta_t)")
	}
	return nil
}

// indexFloor returns why a floor on a Maxwell index is out of range: the
// index lies in [0, 1], and a floor of 1 asks for an exact value that
// rounding cannot give, so a floor lies in (0, 1) (kinematic.Optimize
// takes the same range, with 0 for none).
func indexFloor(v float64) string {
	return fmt.Sprintf("a Maxwell index lies in [0, 1] and a floor on it below 1, got %g", v)
}
