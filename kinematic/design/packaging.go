package design

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// Bounds on the study sections of a design.
const (
	maxKeepOuts   = 64
	maxHalfAngles = 8
)

// Packaging is what the grooves of a design must clear: obstacles on the
// base that no groove may point at, and windows of allowed groove
// azimuths. It limits what [Built.Optimize] may choose; it does not
// judge the design as written.
type Packaging struct {
	// KeepOuts are obstacles on the base (kinematic.KeepOut: At, Reach
	// and Clearance in m, m and rad; Name for the report).
	KeepOuts []kinematic.KeepOut

	// Windows are allowed ranges of groove azimuths, at most one per
	// groove seat.
	Windows []Window
}

// Window is an allowed range of the azimuth of one groove (a vee or
// rods seat): Min to Max, rad, about the seat's Up from Reference, with
// Min < Max < Min + π, each in [−π, π].
type Window struct {
	Ball      string // the name of the ball whose seat it limits ("A" for a ball named by position)
	Min, Max  float64
	Reference kinematic.Reference
}

// OptimizeSettings are the settings of the optimiser
// (kinematic.Optimize) for a design. The zero value means the defaults
// each field names.
type OptimizeSettings struct {
	// Objective is the figure to improve; the zero value is
	// kinematic.MinAmplification.
	Objective kinematic.Objective

	// MinCentreIndex and MinContactIndex are floors on the weakest
	// Maxwell index at the ball centres and at the contact points, in
	// (0, 1); zero means the requirement of the same name, else no floor.
	MinCentreIndex, MinContactIndex float64

	// MaxPressureRatio is a ceiling on peak Hertz pressure over the
	// allowable, > 0; zero means requirements.max_pressure_ratio, else
	// none.
	MaxPressureRatio float64

	// MaxCondition is a ceiling on the condition number of the
	// normalised contact matrix, finite and ≥ 1; zero means
	// kinematic.DesignCondition (10).
	MaxCondition float64

	// Regions let balls move, at most one per ball.
	Regions []Region

	// HalfAngles are the half-angles, rad in (0, π/2), that every groove
	// may take; nil keeps them as drawn.
	HalfAngles []float64

	// Seed makes the random starts of a search with regions
	// reproducible.
	Seed uint64
}

// Region is where one ball may be placed (kinematic.Region: a box of
// ±HalfWidth, m, or a disc of Radius, m, in the seat's plane, centred on
// the ball as drawn; one of the two).
type Region struct {
	Ball string // the name of the ball
	kinematic.Region
}

var objectiveNames = [...]string{
	kinematic.MinAmplification:  "min_amplification",
	kinematic.MinDrift:          "min_drift",
	kinematic.MinCompliance:     "min_compliance",
	kinematic.MaxShockLevel:     "max_shock_level",
	kinematic.MaxFirstFrequency: "max_first_frequency",
	kinematic.MaxContactIndex:   "max_contact_index",
	kinematic.MaxCentreIndex:    "max_centre_index",
}

// objectiveList is the objectives' names for messages.
func objectiveList() string {
	q := make([]string, len(objectiveNames))
	for i, n := range objectiveNames {
		q[i] = strconv.Quote(n)
	}
	return strings.Join(q, ", ")
}

// readStudy reads the point's name, the packaging and the optimiser's
// settings.
func (r *reader) readStudy(root *node, d *Design) error {
	if err := optText(root, "", "point_name", maxText, &d.PointName); err != nil {
		return err
	}
	if n := root.get("packaging"); n != nil {
		p, err := r.readPackaging(n, "packaging")
		if err != nil {
			return err
		}
		d.Packaging = p
	}
	if n := root.get("optimize"); n != nil {
		o, err := r.readOptimize(n, "optimize")
		if err != nil {
			return err
		}
		d.Optimize = o
	}
	return nil
}

func (r *reader) readPackaging(n *node, path string) (*Packaging, error) {
	if err := fields(n, path, "packaging", "keep_outs", "windows"); err != nil {
		return nil, err
	}
	p := &Packaging{}
	if kn := n.get("keep_outs"); kn != nil {
		kp := join(path, "keep_outs")
		elems, err := list(kn, kp, maxKeepOuts)
		if err != nil {
			return nil, err
		}
		for i, e := range elems {
			ep := index(kp, i)
			if err := fields(e, ep, "a keep-out", "name", "at", "reach", "clearance"); err != nil {
				return nil, err
			}
			var k kinematic.KeepOut
			if err := optText(e, ep, "name", maxText, &k.Name); err != nil {
				return nil, err
			}
			if e.get("at") == nil {
				return nil, errorf(join(ep, "at"), ErrMissing, "the obstacle's position [x, y, z], lengths")
			}
			if err := r.optVector(e, ep, "at", length, &k.At); err != nil {
				return nil, err
			}
			if err := r.optQuantity(e, ep, "reach", length, &k.Reach); err != nil {
				return nil, err
			}
			if err := r.reqQuantity(e, ep, "clearance", angle, &k.Clearance); err != nil {
				return nil, err
			}
			p.KeepOuts = append(p.KeepOuts, k)
		}
	}
	if wn := n.get("windows"); wn != nil {
		wp := join(path, "windows")
		elems, err := list(wn, wp, maxBalls)
		if err != nil {
			return nil, err
		}
		for i, e := range elems {
			ep := index(wp, i)
			if err := fields(e, ep, "a window", "ball", "min", "max", "reference"); err != nil {
				return nil, err
			}
			var w Window
			if err := ballRef(e, ep, &w.Ball); err != nil {
				return nil, err
			}
			if err := r.reqQuantity(e, ep, "min", angle, &w.Min); err != nil {
				return nil, err
			}
			if err := r.reqQuantity(e, ep, "max", angle, &w.Max); err != nil {
				return nil, err
			}
			if rn := e.get("reference"); rn != nil {
				rv, err := text(rn, join(ep, "reference"), maxName)
				if err != nil {
					return nil, err
				}
				switch rv {
				case "radial":
				case "frame_x":
					w.Reference = kinematic.FrameX
				default:
					return nil, errorf(join(ep, "reference"), ErrRange, "%q; must be \"radial\" or \"frame_x\"", rv)
				}
			}
			p.Windows = append(p.Windows, w)
		}
	}
	return p, nil
}

// ballRef reads the required member "ball" of n, a ball's name.
func ballRef(n *node, path string, dst *string) error {
	if n.get("ball") == nil {
		return errorf(join(path, "ball"), ErrMissing, "the name of a ball (\"A\", \"B\", ... for balls named by position)")
	}
	return optText(n, path, "ball", maxName, dst)
}

func (r *reader) readOptimize(n *node, path string) (*OptimizeSettings, error) {
	if err := fields(n, path, "the optimiser's settings", "objective", "min_centre_index", "min_contact_index",
		"max_pressure_ratio", "max_condition", "regions", "half_angles", "seed"); err != nil {
		return nil, err
	}
	o := &OptimizeSettings{}
	if on := n.get("objective"); on != nil {
		v, err := text(on, join(path, "objective"), maxName)
		if err != nil {
			return nil, err
		}
		found := false
		for i, name := range objectiveNames {
			if name == v {
				o.Objective, found = kinematic.Objective(i), true
			}
		}
		if !found {
			return nil, errorf(join(path, "objective"), ErrRange, "%q; must be one of %s", v, objectiveList())
		}
	}
	for _, l := range []limit{
		{"min_centre_index", nil, &o.MinCentreIndex},
		{"min_contact_index", nil, &o.MinContactIndex},
		{"max_pressure_ratio", nil, &o.MaxPressureRatio},
		{"max_condition", nil, &o.MaxCondition},
	} {
		if err := r.readLimit(n, path, l); err != nil {
			return nil, err
		}
	}
	if rn := n.get("regions"); rn != nil {
		rp := join(path, "regions")
		elems, err := list(rn, rp, maxBalls)
		if err != nil {
			return nil, err
		}
		for i, e := range elems {
			ep := index(rp, i)
			if err := fields(e, ep, "a region", "ball", "half_width", "radius"); err != nil {
				return nil, err
			}
			var g Region
			if err := ballRef(e, ep, &g.Ball); err != nil {
				return nil, err
			}
			hw, rad := e.get("half_width"), e.get("radius")
			switch {
			case hw != nil && rad != nil:
				return nil, errorf(join(ep, "radius"), ErrRange, "a region is a box (half_width) or a disc (radius), not both")
			case hw == nil && rad == nil:
				return nil, errorf(join(ep, "half_width"), ErrMissing, "a box [half-width, half-width] (lengths) or a disc \"radius\" (length)")
			case hw != nil:
				hp := join(ep, "half_width")
				if hw.kind != arrayNode || len(hw.vals) != 2 {
					return nil, errorf(hp, ErrType, "must be an array of two lengths [along the seat plane's first axis, along its second]")
				}
				for k, v := range hw.vals {
					if g.HalfWidth[k], err = r.quantity(v, index(hp, k), length); err != nil {
						return nil, err
					}
				}
			default:
				if err := r.optQuantity(e, ep, "radius", length, &g.Radius); err != nil {
					return nil, err
				}
			}
			o.Regions = append(o.Regions, g)
		}
	}
	if hn := n.get("half_angles"); hn != nil {
		hp := join(path, "half_angles")
		elems, err := list(hn, hp, maxHalfAngles)
		if err != nil {
			return nil, err
		}
		if len(elems) == 0 {
			return nil, errorf(hp, ErrRange, "an empty list; leave half_angles out to keep the half-angles as drawn")
		}
		for i, e := range elems {
			v, err := r.quantity(e, index(hp, i), angle)
			if err != nil {
				return nil, err
			}
			if err := radiansAsDegrees(e, index(hp, i), v); err != nil {
				return nil, err
			}
			o.HalfAngles = append(o.HalfAngles, v)
		}
	}
	if s := n.get("seed"); s != nil {
		var err error
		if o.Seed, err = readSeed(s, join(path, "seed")); err != nil {
			return nil, err
		}
	}
	return o, nil
}

// readSeed reads a whole number in [0, 2^64).
func readSeed(s *node, p string) (uint64, error) {
	if s.kind != numberNode {
		return 0, errorf(p, ErrType, "must be a whole number in [0, 2^64), got %s", s.kind)
	}
	v, err := strconv.ParseUint(s.text, 10, 64)
	if err != nil {
		return 0, errorf(p, ErrRange, "must be a whole number in [0, 2^64) written without a fraction or exponent, got %s", s.text)
	}
	return v, nil
}

// checkStudy checks the point's name, the packaging and the optimiser's
// settings.
func (d *Design) checkStudy() error {
	if err := checkText(d.PointName, "point_name", maxText); err != nil {
		return err
	}
	if p := d.Packaging; p != nil {
		if err := d.checkPackaging(p); err != nil {
			return err
		}
	}
	if o := d.Optimize; o != nil {
		return d.checkOptimize(o)
	}
	return nil
}

// ballIndex returns the index of the ball named name, or -1.
func (d *Design) ballIndex(name string) int {
	for i, b := range d.Balls {
		n := b.Name
		if n == "" {
			n = defaultName(i)
		}
		if n == name {
			return i
		}
	}
	return -1
}

// checkBallRef checks a reference to a ball at path, once per list
// (seen), and returns the ball's index.
func (d *Design) checkBallRef(name, path string, seen map[int]string) (int, error) {
	i := d.ballIndex(name)
	if i < 0 {
		return -1, errorf(path, ErrRange, "no ball named %q", name)
	}
	if prev, dup := seen[i]; dup {
		return -1, &Error{Path: path, Other: prev, Err: fmt.Errorf("%w: ball %q is named twice", ErrRange, name)}
	}
	seen[i] = path
	return i, nil
}

func (d *Design) checkPackaging(p *Packaging) error {
	if len(p.KeepOuts) > maxKeepOuts {
		return errorf("packaging.keep_outs", ErrTooLarge, "%d keep-outs; at most %d", len(p.KeepOuts), maxKeepOuts)
	}
	for i, k := range p.KeepOuts {
		ep := index("packaging.keep_outs", i)
		switch {
		case checkText(k.Name, join(ep, "name"), maxText) != nil:
			return checkText(k.Name, join(ep, "name"), maxText)
		case !finite(k.At):
			return errorf(join(ep, "at"), ErrNonFinite, "%v", k.At)
		case !(k.Reach >= 0) || math.IsInf(k.Reach, 0):
			return errorf(join(ep, "reach"), ErrRange, "must be a finite length ≥ 0 (0: any distance), got %g m", k.Reach)
		case !(k.Clearance >= 0 && k.Clearance < math.Pi/2):
			return errorf(join(ep, "clearance"), ErrRange, "must be in [0, 90) deg, got %g deg", k.Clearance*180/math.Pi)
		}
	}
	seen := map[int]string{}
	for i, w := range p.Windows {
		ep := index("packaging.windows", i)
		b, err := d.checkBallRef(w.Ball, join(ep, "ball"), seen)
		if err != nil {
			return err
		}
		if t := d.Seats[b].Type; t != Vee && t != Rods {
			return errorf(join(ep, "ball"), ErrRange, "the seat of ball %q is a %v; windows limit grooves (vee, rods)", w.Ball, t)
		}
		for _, f := range []struct {
			key string
			v   float64
		}{{"min", w.Min}, {"max", w.Max}} {
			if !(f.v >= -math.Pi && f.v <= math.Pi) {
				return errorf(join(ep, f.key), ErrRange, "must be in [-180, 180] deg, got %g deg", f.v*180/math.Pi)
			}
		}
		if !(w.Max > w.Min) || w.Max-w.Min >= math.Pi {
			return errorf(join(ep, "max"), ErrRange, "must be greater than min and less than min + 180 deg (a groove is a line: 180 deg allows every direction), got min %g deg, max %g deg",
				w.Min*180/math.Pi, w.Max*180/math.Pi)
		}
		if w.Reference != kinematic.Radial && w.Reference != kinematic.FrameX {
			return errorf(join(ep, "reference"), ErrRange, "%v", w.Reference)
		}
	}
	return nil
}

func (d *Design) checkOptimize(o *OptimizeSettings) error {
	const p = "optimize"
	if o.Objective < 0 || int(o.Objective) >= len(objectiveNames) {
		return errorf(join(p, "objective"), ErrRange, "%v; must be one of %s", o.Objective, objectiveList())
	}
	for _, f := range []struct {
		key string
		v   float64
	}{{"min_centre_index", o.MinCentreIndex}, {"min_contact_index", o.MinContactIndex}} {
		if !(f.v >= 0 && f.v < 1) {
			return errorf(join(p, f.key), ErrRange, "must be in (0, 1), got %g", f.v)
		}
	}
	if !(o.MaxPressureRatio >= 0) || math.IsInf(o.MaxPressureRatio, 0) {
		return errorf(join(p, "max_pressure_ratio"), ErrRange, "must be a finite number > 0, got %g", o.MaxPressureRatio)
	}
	if o.MaxCondition != 0 && !(o.MaxCondition >= 1 && !math.IsInf(o.MaxCondition, 0)) {
		return errorf(join(p, "max_condition"), ErrRange, "must be a finite number ≥ 1 (1: an ideal layout), got %g", o.MaxCondition)
	}
	seen := map[int]string{}
	for i, g := range o.Regions {
		ep := index(join(p, "regions"), i)
		if _, err := d.checkBallRef(g.Ball, join(ep, "ball"), seen); err != nil {
			return err
		}
		for k, h := range g.HalfWidth {
			if !(h >= 0) || math.IsInf(h, 0) {
				return errorf(index(join(ep, "half_width"), k), ErrRange, "must be a finite length ≥ 0, got %g m", h)
			}
		}
		if !(g.Radius >= 0) || math.IsInf(g.Radius, 0) {
			return errorf(join(ep, "radius"), ErrRange, "must be a finite length > 0, got %g m", g.Radius)
		}
		if g.Radius == 0 && g.HalfWidth == [2]float64{} {
			return errorf(ep, ErrRange, "a region of zero size keeps the ball where it is; leave it out")
		}
		if g.Radius > 0 && g.HalfWidth != [2]float64{} {
			return errorf(join(ep, "radius"), ErrRange, "a region is a box (half_width) or a disc (radius), not both")
		}
	}
	if len(o.HalfAngles) > maxHalfAngles {
		return errorf(join(p, "half_angles"), ErrTooLarge, "%d half-angles; at most %d", len(o.HalfAngles), maxHalfAngles)
	}
	for i, h := range o.HalfAngles {
		if !(h > 0 && h < math.Pi/2) {
			return errorf(index(join(p, "half_angles"), i), ErrRange, "must be in (0, 90) deg, got %g deg", h*180/math.Pi)
		}
	}
	return nil
}

// OptimizeOptions returns the options for kinematic.Optimize that the
// design's packaging and optimiser settings give, for the coupling
// [Built.Coupling] and the scenario [Built.Scenario]: the objective; the
// floors and the pressure ceiling (each the optimiser's own, else the
// requirement's); the condition ceiling; each groove's window of
// azimuths, rad from kinematic.FrameX, or nil when the design has no
// packaging; the regions by pair; the half-angles; the seed.
//
// A groove's window is the largest arc of azimuths inside its own window
// (every azimuth when it has none) that keeps it each keep-out's
// clearance off the line from its ball to every keep-out within reach,
// as kinematic.KeepOutWindows documents. Errors are [*Error] values:
// "packaging.keep_outs[i]..." for a bad keep-out, and "packaging" when
// the keep-outs leave a groove no azimuth inside its window (naming the
// seat in [Error.Other]).
func (b *Built) OptimizeOptions() (*kinematic.OptimizeOptions, error) {
	d := &b.d
	var s OptimizeSettings
	if d.Optimize != nil {
		s = *d.Optimize
	}
	o := &kinematic.OptimizeOptions{Objective: s.Objective, MinCentreIndex: s.MinCentreIndex, MinContactIndex: s.MinContactIndex,
		MaxPressureRatio: s.MaxPressureRatio, MaxCondition: s.MaxCondition, Seed: s.Seed}
	if o.MinCentreIndex == 0 {
		o.MinCentreIndex = d.Requirements.MinCentreIndex
	}
	if o.MinContactIndex == 0 {
		o.MinContactIndex = d.Requirements.MinContactIndex
	}
	if o.MaxPressureRatio == 0 {
		o.MaxPressureRatio = d.Requirements.MaxPressureRatio
	}
	if len(s.HalfAngles) > 0 {
		o.HalfAngles = append([]float64(nil), s.HalfAngles...)
	}
	if len(s.Regions) > 0 {
		o.Regions = make([]kinematic.Region, len(d.Balls))
		for _, g := range s.Regions {
			o.Regions[d.ballIndex(g.Ball)] = g.Region
		}
	}
	if d.Packaging != nil {
		wins, err := b.windows()
		if err != nil {
			return nil, err
		}
		o.Windows = wins
	}
	return o, nil
}

// windows returns the groove windows of the packaging, from FrameX.
func (b *Built) windows() ([]kinematic.Window, error) {
	p := b.d.Packaging
	c := b.coupling
	// The keep-outs' checks and the windows of the grooves without a
	// window of their own: kinematic.KeepOutWindows.
	wins, err := kinematic.KeepOutWindows(c, p.KeepOuts)
	if err != nil {
		var ke *kinematic.InputError
		if errors.As(err, &ke) {
			if strings.HasPrefix(ke.Field, "obstacles") {
				return nil, &Error{Path: "packaging.keep_outs" + snake(strings.TrimPrefix(ke.Field, "obstacles")), Err: ke.Err}
			}
			if name, i, ok := splitIndex(strings.TrimSuffix(ke.Field, ".Seat")); ok && name == "Pairs" {
				return nil, &Error{Path: "packaging.keep_outs", Other: index("seats", i), Err: ke.Err}
			}
		}
		return nil, translator{b: b, fallback: "packaging"}.translate(err)
	}
	for i, w := range p.Windows {
		k := b.d.ballIndex(w.Ball)
		lo, hi, err := b.frameWindow(k, w)
		if err != nil {
			return nil, err
		}
		lo, width := freeArc(lo, hi, b.forbidden(k))
		if !(width > 0) {
			return nil, &Error{Path: "packaging", Other: index("packaging.windows", i),
				Err: fmt.Errorf("%w: the keep-outs leave the groove of ball %q no azimuth inside its window", ErrRange, w.Ball)}
		}
		wins[k] = kinematic.Window{Min: lo, Max: lo + width, From: kinematic.FrameX}
	}
	return wins, nil
}

// frameWindow returns window w of pair k's groove as azimuths from
// FrameX: a radial window is turned by the azimuth of the radial
// direction from FrameX about the seat's Up.
func (b *Built) frameWindow(k int, w Window) (lo, hi float64, err error) {
	if w.Reference == kinematic.FrameX {
		return w.Min, w.Max, nil
	}
	x, up, err := b.grooveAt(k, kinematic.FrameX)
	if err != nil {
		return 0, 0, err
	}
	r, _, err := b.grooveAt(k, kinematic.Radial)
	if err != nil {
		return 0, 0, err
	}
	off := math.Atan2(r3.Dot(up, r3.Cross(x, r)), r3.Dot(x, r))
	return w.Min + off, w.Max + off, nil
}

// grooveAt returns the direction of pair k's groove turned to azimuth 0
// from ref, and the seat's unit Up.
func (b *Built) grooveAt(k int, ref kinematic.Reference) (dir, up r3.Vec, err error) {
	c, err := b.coupling.WithGroove(k, 0, ref)
	if err != nil {
		return dir, up, grooveError(err, k, translator{b: b, fallback: index("seats", k)})
	}
	switch s := c.Pairs[k].Seat.(type) {
	case kinematic.Vee:
		dir, up = s.Direction, s.Up
	case kinematic.Rods:
		dir, up = s.Direction, s.Up
	}
	return r3.Unit(dir), r3.Unit(up), nil
}

// forbidden returns the arcs of azimuths, rad from FrameX, that the
// keep-outs forbid pair k's groove, as kinematic.KeepOutWindows finds
// them: the azimuth θ of the obstacle seen from the ball normal to Up,
// ± the clearance.
func (b *Built) forbidden(k int) [][2]float64 {
	x, up, err := b.grooveAt(k, kinematic.FrameX)
	if err != nil {
		return nil // the caller turned this groove already
	}
	centre := b.coupling.Pairs[k].Ball.Centre
	var arcs [][2]float64
	for _, o := range b.d.Packaging.KeepOuts {
		v := r3.Sub(o.At, centre)
		v = r3.Sub(v, r3.Scale(r3.Dot(v, up), up))
		dist := r3.Norm(v)
		if dist == 0 || o.Reach > 0 && dist > o.Reach {
			continue
		}
		az := math.Atan2(r3.Dot(up, r3.Cross(x, v)), r3.Dot(x, v))
		arcs = append(arcs, [2]float64{az - o.Clearance, az + o.Clearance})
	}
	return arcs
}

// freeArc returns the start and length of the longest part of [lo, hi]
// (hi − lo < π) that no arc of arcs, each taken modulo π, covers; the
// length is ≤ 0 when they cover it all. Of equals, the lowest.
func freeArc(lo, hi float64, arcs [][2]float64) (start, width float64) {
	var cover [][2]float64
	for _, a := range arcs {
		// Every copy a + jπ that can meet [lo, hi].
		j0 := math.Floor((lo - a[1]) / math.Pi)
		for j := j0; a[0]+j*math.Pi <= hi; j++ {
			s, e := a[0]+j*math.Pi, a[1]+j*math.Pi
			if e >= lo {
				cover = append(cover, [2]float64{s, e})
			}
		}
	}
	sort.Slice(cover, func(i, j int) bool { return cover[i][0] < cover[j][0] })
	start, width = lo, math.Inf(-1)
	at := lo
	for _, cv := range cover {
		if cv[0] > at && cv[0]-at > width {
			start, width = at, math.Min(cv[0], hi)-at
		}
		at = math.Max(at, cv[1])
		if at >= hi {
			break
		}
	}
	if at < hi && hi-at > width {
		start, width = at, hi-at
	}
	return start, width
}

// Optimize returns the layout that kinematic.Optimize finds for the
// built coupling and scenario with the options of
// [Built.OptimizeOptions], and the design with that layout written in
// ([Design.WithCoupling]), which [Design.Write] writes. The design as
// built is not changed. Errors are [*Error] values with the file's
// paths: those of OptimizeOptions, "optimize.objective" for an objective
// the design cannot give, "optimize" (or the requirement whose limit it
// took) for a floor or ceiling no layout seen meets.
func (b *Built) Optimize() (kinematic.Optimum, *Design, error) {
	o, err := b.OptimizeOptions()
	if err != nil {
		return kinematic.Optimum{}, nil, err
	}
	best, err := kinematic.Optimize(b.Coupling(), b.Scenario(), o)
	if err != nil {
		return kinematic.Optimum{}, nil, b.optimizeError(err)
	}
	nd, err := b.d.WithCoupling(best.Coupling)
	if err != nil {
		return kinematic.Optimum{}, nil, err
	}
	return best, nd, nil
}

// optimizeError translates an error of kinematic.Optimize.
func (b *Built) optimizeError(err error) error {
	var ke *kinematic.InputError
	if !errors.As(err, &ke) || !strings.HasPrefix(ke.Field, "opt") {
		return translator{b: b, fallback: "optimize"}.translate(err)
	}
	var s OptimizeSettings
	if b.d.Optimize != nil {
		s = *b.d.Optimize
	}
	path := "optimize"
	switch f := ke.Field; {
	case f == "opt.Objective":
		path = "optimize.objective"
	case f == "opt.MinCentreIndex" && s.MinCentreIndex == 0:
		path = "requirements.min_centre_index"
	case f == "opt.MinContactIndex" && s.MinContactIndex == 0:
		path = "requirements.min_contact_index"
	case f == "opt.MaxPressureRatio" && s.MaxPressureRatio == 0:
		path = "requirements.max_pressure_ratio"
	case strings.HasPrefix(f, "opt.Windows"):
		path = "packaging"
	case strings.HasPrefix(f, "opt.HalfAngles"):
		path = "optimize" + snake(strings.TrimPrefix(f, "opt"))
	case strings.HasPrefix(f, "opt.Regions"):
		path = "optimize.regions"
	case strings.HasPrefix(f, "opt."):
		path = "optimize" + snake(strings.TrimPrefix(f, "opt"))
	}
	return &Error{Path: path, Err: ke.Err}
}

// The wire forms of the study sections.

type wirePackaging struct {
	KeepOuts []wireKeepOut `json:"keep_outs,omitempty"`
	Windows  []wireWindow  `json:"windows,omitempty"`
}

type wireKeepOut struct {
	Name      string  `json:"name,omitempty"`
	At        vec     `json:"at"`
	Reach     float64 `json:"reach,omitempty"`
	Clearance float64 `json:"clearance"`
}

type wireWindow struct {
	Ball      string  `json:"ball"`
	Min       float64 `json:"min"`
	Max       float64 `json:"max"`
	Reference string  `json:"reference"`
}

type wireOptimize struct {
	Objective        string       `json:"objective"`
	MinCentreIndex   float64      `json:"min_centre_index,omitempty"`
	MinContactIndex  float64      `json:"min_contact_index,omitempty"`
	MaxPressureRatio float64      `json:"max_pressure_ratio,omitempty"`
	MaxCondition     float64      `json:"max_condition,omitempty"`
	Regions          []wireRegion `json:"regions,omitempty"`
	HalfAngles       []float64    `json:"half_angles,omitempty"`
	Seed             uint64       `json:"seed,omitempty"`
}

type wireRegion struct {
	Ball      string      `json:"ball"`
	HalfWidth *[2]float64 `json:"half_width,omitempty"`
	Radius    float64     `json:"radius,omitempty"`
}

// wireStudy fills the study sections of w.
func (d *Design) wireStudy(w *wireDesign) {
	w.PointName = d.PointName
	if p := d.Packaging; p != nil {
		wp := &wirePackaging{}
		for _, k := range p.KeepOuts {
			wp.KeepOuts = append(wp.KeepOuts, wireKeepOut{Name: k.Name, At: wireVec(k.At), Reach: k.Reach, Clearance: k.Clearance})
		}
		for _, win := range p.Windows {
			ref := "radial"
			if win.Reference == kinematic.FrameX {
				ref = "frame_x"
			}
			wp.Windows = append(wp.Windows, wireWindow{Ball: win.Ball, Min: win.Min, Max: win.Max, Reference: ref})
		}
		w.Packaging = wp
	}
	if o := d.Optimize; o != nil {
		wo := &wireOptimize{Objective: objectiveNames[o.Objective], MinCentreIndex: o.MinCentreIndex, MinContactIndex: o.MinContactIndex,
			MaxPressureRatio: o.MaxPressureRatio, MaxCondition: o.MaxCondition, HalfAngles: o.HalfAngles, Seed: o.Seed}
		for _, g := range o.Regions {
			wr := wireRegion{Ball: g.Ball, Radius: g.Radius}
			if g.Radius == 0 {
				hw := g.HalfWidth
				wr.HalfWidth = &hw
			}
			wo.Regions = append(wo.Regions, wr)
		}
		w.Optimize = wo
	}
}

// cloneStudy makes c's study sections share nothing with d's.
func (d *Design) cloneStudy(c *Design) {
	if p := d.Packaging; p != nil {
		q := Packaging{KeepOuts: append([]kinematic.KeepOut(nil), p.KeepOuts...), Windows: append([]Window(nil), p.Windows...)}
		c.Packaging = &q
	}
	if o := d.Optimize; o != nil {
		q := *o
		q.Regions = append([]Region(nil), o.Regions...)
		q.HalfAngles = append([]float64(nil), o.HalfAngles...)
		c.Optimize = &q
	}
}
