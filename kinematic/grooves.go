package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/optimize"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Window is a range of allowed groove azimuths in radians, Min ≤ azimuth ≤
// Max, measured about the seat's Up from the direction From names: the
// [Radial] direction (the zero value) or the drawing's [FrameX]. A groove
// is a line, so azimuths π apart are the same groove, and a window of width
// π or more allows every direction. For example, with Up along +z, "keep
// every groove at least 20° away from the x axis, where the cables run" is
// Window{Min: 20°, Max: 160°, From: FrameX} (in radians).
type Window struct {
	Min, Max float64
	From     Reference
}

// GrooveOptions holds options for [OptimizeGrooves]; the zero value and a
// nil pointer mean defaults.
type GrooveOptions struct {
	// Windows limits each pair's groove azimuth, one entry per pair
	// (entries for seats that are not vees are ignored). Nil allows every
	// azimuth.
	Windows []Window
}

// GrooveResult is the outcome of [OptimizeGrooves].
type GrooveResult struct {
	// Coupling is the input coupling with each vee's Direction set to the
	// best groove found.
	Coupling Coupling

	// Azimuths holds each pair's groove azimuth in radians from [Radial]
	// (zero for seats that are not vees).
	Azimuths []float64

	// Weakest is the weakest Maxwell index (at the contact points) of the
	// best layout.
	Weakest float64

	// For three-ball couplings of three vees (Bisector > 0): the weakest
	// Maxwell index with the grooves on the bisectors of the ball
	// triangle, and whether those bisectors lie inside the windows. When
	// they do, Weakest ≥ Bisector.
	Bisector        float64
	BisectorAllowed bool

	// Evaluations is the number of layouts evaluated.
	Evaluations int
}

// searchPoints is the number of layouts of the grid search that precedes
// the local refinement; spread over one azimuth per vee.
const searchPoints = 4096

// OptimizeGrooves returns the groove directions of the coupling's vee
// seats that maximise the weakest Maxwell index of its six contacts,
// within the allowed azimuth windows; the other seats stay as they are.
//
// The Maxwell index is a screen, not a design figure: among sensible
// layouts it varies little, and the layout that maximises it can be worse
// at the point that matters (error amplification, stiffness, shock margin,
// thermal drift).
//
// The weakest index is a continuous but non-smooth function of the
// azimuths (a minimum of six), so the search is global then local: a grid
// of about 4096 layouts over the windows, then Nelder–Mead (Nelder & Mead
// 1965, "A simplex method for function minimization", Computer Journal
// 7(4); gonum's optimize.NelderMead) from the best grid points, the
// coupling's own grooves and the bisector layout, with the windows mapped
// to unbounded variables by az = mid + half·sin(u). The result is the best
// layout seen, so it is never worse than any start that lies inside the
// windows. It is a local optimum of a search, not a proof of the global
// one.
//
// OptimizeGrooves returns the errors of [Coupling.Contacts]; an
// [*InputError] wrapping [ErrNotExact] unless the coupling has six
// contacts, [ErrDegenerate] if it has no vee or a ball lies straight above
// or below the centroid of the balls (its azimuth has no reference), and
// [ErrRange] or [ErrNonFinite] for a bad window.
func OptimizeGrooves(c Coupling, opt *GrooveOptions) (GrooveResult, error) {
	p, err := newGrooveProblem(c)
	if err != nil {
		return GrooveResult{}, err
	}
	if err := p.limit(c, opt); err != nil {
		return GrooveResult{}, err
	}
	var res GrooveResult
	starts := p.starts(c, &res)
	starts = append(starts, p.grid()...)
	p.refine(starts)
	res.Weakest, res.Evaluations = p.best, p.evals
	res.Azimuths = make([]float64, len(c.Pairs))
	res.Coupling = Coupling{Pairs: append([]Pair(nil), c.Pairs...)}
	for j := range p.vees {
		v := &p.vees[j]
		res.Azimuths[v.pair] = wrapAzimuth(p.bestAz[j])
		seat := c.Pairs[v.pair].Seat.(grooveSeat)
		res.Coupling.Pairs[v.pair].Seat = seat.withDirection(turn(v.rad, v.up, p.bestAz[j]))
	}
	return res, nil
}

// grooveProblem evaluates the weakest Maxwell index of a coupling as its
// vee grooves turn, and keeps the best layout seen.
type grooveProblem struct {
	lines  []line
	vees   []veeVar
	lo, hi []float64 // allowed azimuths from radial, per vee

	best   float64
	bestAz []float64
	evals  int
}

// veeVar is one vee seat whose groove turns about its Up.
type veeVar struct {
	pair     int // index into Coupling.Pairs
	first    int // index of its first contact in lines
	centre   r3.Vec
	radius   float64
	up, rad  r3.Vec // Up and radial, unit
	sin, cos float64
	dir0     r3.Vec // the coupling's own groove direction
}

func newGrooveProblem(c Coupling) (*grooveProblem, error) {
	cs, err := c.Contacts()
	if err != nil {
		return nil, err
	}
	if len(cs) != 6 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf(
			"%w: %d contacts; groove optimisation needs a coupling of six", ErrNotExact, len(cs))}
	}
	p := &grooveProblem{lines: make([]line, 6), best: -1}
	for i, ct := range cs {
		p.lines[i] = line{label: ct.Label, p: ct.Point, n: ct.Normal, centre: ct.Centre, ball: ct.Radius != 0}
	}
	first := 0
	for i, pr := range c.Pairs {
		if v, ok := pr.Seat.(grooveSeat); ok {
			up, dir, _ := v.groove("") // validated by Contacts
			rad, err := c.reference(i, up, Radial)
			if err != nil {
				return nil, err
			}
			sn, cs := math.Sincos(v.halfAngle())
			p.vees = append(p.vees, veeVar{
				pair: i, first: first, centre: pr.Ball.Centre, radius: pr.Ball.Radius,
				up: up, rad: rad, sin: sn, cos: cs, dir0: dir,
			})
		}
		first += pr.Seat.count()
	}
	if len(p.vees) == 0 {
		return nil, errNoVee("Pairs")
	}
	p.bestAz = make([]float64, len(p.vees))
	return p, nil
}

// limit sets the allowed azimuth range of each vee from the options,
// converting windows given in the frame to azimuths from radial.
func (p *grooveProblem) limit(c Coupling, opt *GrooveOptions) error {
	k := len(p.vees)
	p.lo, p.hi = make([]float64, k), make([]float64, k)
	if opt != nil && opt.Windows != nil && len(opt.Windows) != len(c.Pairs) {
		return &InputError{Field: "opt.Windows", Err: fmt.Errorf(
			"%w: %d windows for %d pairs", ErrRange, len(opt.Windows), len(c.Pairs))}
	}
	for j := range p.vees {
		v := &p.vees[j]
		p.lo[j], p.hi[j] = -math.Pi/2, math.Pi/2
		if opt == nil || opt.Windows == nil {
			continue
		}
		w := opt.Windows[v.pair]
		field := indexed("opt.Windows", v.pair)
		if math.IsNaN(w.Min) || math.IsNaN(w.Max) || math.IsInf(w.Min, 0) || math.IsInf(w.Max, 0) {
			return &InputError{Field: field, Err: fmt.Errorf("%w: %+v", ErrNonFinite, w)}
		}
		if w.Min > w.Max {
			return &InputError{Field: field, Err: fmt.Errorf("%w: Min %g > Max %g", ErrRange, w.Min, w.Max)}
		}
		x, err := c.reference(v.pair, v.up, w.From)
		if err != nil {
			if ie, ok := err.(*InputError); ok && ie.Field == "ref" {
				ie.Field = field + ".From"
			}
			return err
		}
		if w.Max-w.Min < math.Pi {
			// Shift by the angle of the window's reference from radial.
			off := math.Atan2(r3.Dot(v.up, r3.Cross(v.rad, x)), r3.Dot(v.rad, x))
			p.lo[j], p.hi[j] = w.Min+off, w.Max+off
		}
	}
	return nil
}

// inside reports whether every azimuth lies in its window.
func (p *grooveProblem) inside(az []float64) bool {
	for j := range az {
		if !within(az[j], p.lo[j], p.hi[j]) {
			return false
		}
	}
	return true
}

// try evaluates a layout and keeps it if it is the best so far.
func (p *grooveProblem) try(az []float64) float64 {
	w := p.weakest(az)
	p.evals++
	if w > p.best {
		p.best = w
		copy(p.bestAz, az)
	}
	return w
}

// starts evaluates the coupling's own grooves and, for three vees on three
// balls, the bisectors (recording them in res), and returns those inside
// the windows as starts for the refinement.
func (p *grooveProblem) starts(c Coupling, res *GrooveResult) [][]float64 {
	var starts [][]float64
	own := make([]float64, len(p.vees))
	for j, v := range p.vees {
		own[j] = azimuthFrom(v.dir0, v.up, v.rad)
	}
	if p.inside(own) {
		starts = append(starts, own)
	}
	if bis, ok := p.bisectors(c); ok {
		res.Bisector = p.weakest(bis)
		if p.inside(bis) {
			res.BisectorAllowed = true
			starts = append(starts, bis)
		}
	}
	for _, s := range starts {
		p.try(s)
	}
	return starts
}

// grid evaluates about searchPoints layouts spread evenly over the
// windows and returns the best few as starts.
func (p *grooveProblem) grid() [][]float64 {
	k := len(p.vees)
	m := min(256, max(3, int(math.Pow(searchPoints, 1/float64(k)))))
	const keep = 4
	type cand struct {
		az []float64
		w  float64
	}
	var top []cand
	az := make([]float64, k)
	idx := make([]int, k)
	for {
		for j := range az {
			az[j] = p.lo[j] + (float64(idx[j])+0.5)/float64(m)*(p.hi[j]-p.lo[j])
		}
		w := p.try(az)
		if len(top) < keep || w > top[len(top)-1].w {
			pos := len(top)
			for pos > 0 && top[pos-1].w < w {
				pos--
			}
			top = append(top, cand{})
			copy(top[pos+1:], top[pos:])
			top[pos] = cand{append([]float64(nil), az...), w}
			if len(top) > keep {
				top = top[:keep]
			}
		}
		j := 0
		for ; j < k; j++ {
			idx[j]++
			if idx[j] < m {
				break
			}
			idx[j] = 0
		}
		if j == k {
			break
		}
	}
	out := make([][]float64, len(top))
	for i, t := range top {
		out[i] = t.az
	}
	return out
}

// refine runs Nelder–Mead from each start in u, with az = mid + half·sin(u)
// keeping every azimuth inside its window.
func (p *grooveProblem) refine(starts [][]float64) {
	k := len(p.vees)
	toAz := func(u, out []float64) {
		for j := range u {
			mid, half := (p.lo[j]+p.hi[j])/2, (p.hi[j]-p.lo[j])/2
			out[j] = mid + half*math.Sin(u[j])
		}
	}
	work := make([]float64, k)
	problem := optimize.Problem{Func: func(u []float64) float64 {
		toAz(u, work)
		return -p.try(work)
	}}
	settings := &optimize.Settings{
		FuncEvaluations: 300 * k,
		Converger:       &optimize.FunctionConverge{Absolute: 1e-10, Iterations: 30 * k},
	}
	for _, s := range starts {
		u := make([]float64, k)
		for j := range s {
			mid, half := (p.lo[j]+p.hi[j])/2, (p.hi[j]-p.lo[j])/2
			if half == 0 {
				continue
			}
			u[j] = math.Asin(math.Max(-1, math.Min(1, (s[j]-mid)/half)))
		}
		// Errors here only report the evaluation budget running out; the
		// best layout seen is kept by try either way.
		_, _ = optimize.Minimize(problem, u, settings, &optimize.NelderMead{SimplexSize: 0.1})
	}
}

// within reports whether the azimuth a lies in [lo, hi], modulo π.
func within(a, lo, hi float64) bool {
	if hi-lo >= math.Pi {
		return true
	}
	d := math.Mod(a-lo, math.Pi)
	if d < 0 {
		d += math.Pi
	}
	return d <= hi-lo+1e-12
}

// bisectors returns the azimuths of the bisector layout (as BisectorVees
// lays it), for a coupling of three vees on three balls in a triangle.
func (p *grooveProblem) bisectors(c Coupling) ([]float64, bool) {
	if len(c.Pairs) != 3 || len(p.vees) != 3 {
		return nil, false
	}
	a, b, cc := c.Pairs[0].Ball.Centre, c.Pairs[1].Ball.Centre, c.Pairs[2].Ball.Centre
	if !isTriangle(a, b, cc) {
		return nil, false
	}
	in := incentre(a, b, cc)
	az := make([]float64, 3)
	for j, v := range p.vees {
		d, ok := linalg.Unit3(r3.Sub(in, v.centre))
		var h r3.Vec
		if ok {
			h, ok = flatten(d, v.up)
		}
		if !ok {
			return nil, false
		}
		az[j] = azimuthFrom(h, v.up, v.rad)
	}
	return az, true
}

// weakest returns the weakest Maxwell index at the contact points with
// the vee grooves at azimuths az, or 0 if the layout is singular.
func (p *grooveProblem) weakest(az []float64) float64 {
	for j := range p.vees {
		v := &p.vees[j]
		ns := flankNormals(v.up, turn(v.rad, v.up, az[j]), v.sin, v.cos)
		for k, n := range ns {
			l := &p.lines[v.first+k]
			l.n = n
			l.p = r3.Sub(v.centre, r3.Scale(v.radius, n))
		}
	}
	var ts [6]screw.Twist
	if !freedOf(p.lines, &ts) {
		return 0
	}
	w := math.Inf(1)
	for i, t := range ts {
		l := &p.lines[i]
		v := t.At(l.p)
		w = min(w, math.Abs(r3.Dot(l.n, v))/linalg.Norm3(v))
	}
	return w
}
