package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/optimize"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Window is a range of allowed groove azimuths in radians, Min ≤ azimuth ≤
// Max, with azimuth measured as [Groove.Azimuth]: about the seat's Up from
// the direction towards the centroid of the ball centres. A window of
// width π or more allows every direction.
type Window struct {
	Min, Max float64
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

	// Azimuths holds each pair's groove azimuth in radians (zero for seats
	// that are not vees).
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
}

// searchPoints is the number of layouts of the grid search that precedes
// the local refinement; spread over one azimuth per vee.
const searchPoints = 4096

// OptimizeGrooves returns the groove directions of the coupling's vee
// seats that maximise the weakest Maxwell index of its six contacts,
// within the allowed azimuth windows; the other seats stay as they are.
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
	k := len(p.vees)
	lo, hi := make([]float64, k), make([]float64, k)
	for j, v := range p.vees {
		lo[j], hi[j] = -math.Pi/2, math.Pi/2
		if opt == nil || opt.Windows == nil {
			continue
		}
		if len(opt.Windows) != len(c.Pairs) {
			return GrooveResult{}, &InputError{Field: "opt.Windows", Err: fmt.Errorf(
				"%w: %d windows for %d pairs", ErrRange, len(opt.Windows), len(c.Pairs))}
		}
		w := opt.Windows[v.pair]
		field := fmt.Sprintf("opt.Windows[%d]", v.pair)
		if math.IsNaN(w.Min) || math.IsNaN(w.Max) || math.IsInf(w.Min, 0) || math.IsInf(w.Max, 0) {
			return GrooveResult{}, &InputError{Field: field, Err: fmt.Errorf("%w: %v", ErrNonFinite, w)}
		}
		if w.Min > w.Max {
			return GrooveResult{}, &InputError{Field: field, Err: fmt.Errorf("%w: Min %g > Max %g", ErrRange, w.Min, w.Max)}
		}
		if w.Max-w.Min < math.Pi {
			lo[j], hi[j] = w.Min, w.Max
		}
	}
	inside := func(az []float64) bool {
		for j := range az {
			if !within(az[j], lo[j], hi[j]) {
				return false
			}
		}
		return true
	}

	best := GrooveResult{Weakest: -1}
	bestAz := make([]float64, k)
	try := func(az []float64) float64 {
		w := p.weakest(az)
		if w > best.Weakest {
			best.Weakest = w
			copy(bestAz, az)
		}
		return w
	}

	// Starts: the coupling's own grooves and, for three vees on three
	// balls, the bisectors, when inside the windows.
	var starts [][]float64
	if own := p.azimuths(); inside(own) {
		starts = append(starts, own)
	}
	if bis, ok := p.bisectors(c); ok {
		best.Bisector = p.weakest(bis)
		if inside(bis) {
			best.BisectorAllowed = true
			starts = append(starts, bis)
		}
	}
	for _, s := range starts {
		try(s)
	}

	// Grid search, keeping the best few points as starts.
	m := max(3, int(math.Pow(searchPoints, 1/float64(k))))
	m = min(m, 256)
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
			az[j] = lo[j] + (float64(idx[j])+0.5)/float64(m)*(hi[j]-lo[j])
		}
		w := try(az)
		if len(top) < keep || w > top[len(top)-1].w {
			cd := cand{append([]float64(nil), az...), w}
			pos := len(top)
			for pos > 0 && top[pos-1].w < w {
				pos--
			}
			top = append(top, cand{})
			copy(top[pos+1:], top[pos:])
			top[pos] = cd
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
	for _, t := range top {
		starts = append(starts, t.az)
	}

	// Local refinement in u, with az = mid + half·sin(u).
	toAz := func(u, out []float64) {
		for j := range u {
			mid, half := (lo[j]+hi[j])/2, (hi[j]-lo[j])/2
			out[j] = mid + half*math.Sin(u[j])
		}
	}
	work := make([]float64, k)
	problem := optimize.Problem{Func: func(u []float64) float64 {
		toAz(u, work)
		return -try(work)
	}}
	settings := &optimize.Settings{
		FuncEvaluations: 300 * k,
		Converger:       &optimize.FunctionConverge{Absolute: 1e-10, Iterations: 30 * k},
	}
	for _, s := range starts {
		u := make([]float64, k)
		for j := range s {
			mid, half := (lo[j]+hi[j])/2, (hi[j]-lo[j])/2
			if half == 0 {
				continue
			}
			u[j] = math.Asin(math.Max(-1, math.Min(1, (s[j]-mid)/half)))
		}
		// Errors here only report the evaluation budget running out; the
		// best layout seen is kept by try either way.
		_, _ = optimize.Minimize(problem, u, settings, &optimize.NelderMead{SimplexSize: 0.1})
	}

	best.Azimuths = make([]float64, len(c.Pairs))
	best.Coupling = Coupling{Pairs: append([]Pair(nil), c.Pairs...)}
	for j, v := range p.vees {
		best.Azimuths[v.pair] = wrapAzimuth(bestAz[j])
		seat := c.Pairs[v.pair].Seat.(Vee)
		seat.Direction = v.direction(bestAz[j])
		best.Coupling.Pairs[v.pair].Seat = seat
	}
	return best, nil
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

// wrapAzimuth returns a in (−π/2, π/2], modulo π.
func wrapAzimuth(a float64) float64 {
	a = math.Mod(a, math.Pi)
	if a <= -math.Pi/2 {
		a += math.Pi
	} else if a > math.Pi/2 {
		a -= math.Pi
	}
	return a
}

// grooveProblem evaluates the weakest Maxwell index of a coupling as its
// vee grooves turn.
type grooveProblem struct {
	lines []line
	vees  []veeVar
}

// veeVar is one vee seat whose groove turns about its Up.
type veeVar struct {
	pair        int // index into Coupling.Pairs
	first       int // index of its first contact in lines
	centre      r3.Vec
	radius      float64
	up, rad, tn r3.Vec // Up, radial and Up × radial, unit
	sin, cos    float64
	dir0        r3.Vec // the coupling's own groove direction
}

func (v *veeVar) direction(az float64) r3.Vec {
	s, c := math.Sincos(az)
	return r3.Add(r3.Scale(c, v.rad), r3.Scale(s, v.tn))
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
	p := &grooveProblem{lines: make([]line, 6)}
	for i, ct := range cs {
		p.lines[i] = line{label: ct.Label, p: ct.Point, n: ct.Normal, centre: ct.Centre, ball: ct.Radius != 0}
	}
	centroid := ballCentroid(c)
	first := 0
	for i, pr := range c.Pairs {
		n := 1
		switch s := pr.Seat.(type) {
		case Vee:
			n = 2
			up := r3.Unit(s.Up)
			rad := radial(pr.Ball.Centre, centroid, up)
			if rad == (r3.Vec{}) {
				return nil, &InputError{Field: fmt.Sprintf("Pairs[%d].Ball.Centre", i), Err: fmt.Errorf(
					"%w: straight above or below the centroid of the balls; the groove azimuth has no reference", ErrDegenerate)}
			}
			dir, _ := horizontal(s.Direction, up, "")
			sn, cs := math.Sincos(s.HalfAngle)
			p.vees = append(p.vees, veeVar{
				pair: i, first: first, centre: pr.Ball.Centre, radius: pr.Ball.Radius,
				up: up, rad: rad, tn: r3.Cross(up, rad), sin: sn, cos: cs, dir0: dir,
			})
		case Trihedral, Cone:
			n = 3
		}
		first += n
	}
	if len(p.vees) == 0 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: no vee seat to turn", ErrDegenerate)}
	}
	return p, nil
}

// azimuths returns the coupling's own groove azimuths.
func (p *grooveProblem) azimuths() []float64 {
	az := make([]float64, len(p.vees))
	for j, v := range p.vees {
		az[j] = azimuth(v.dir0, v.up, v.rad)
	}
	return az
}

// bisectors returns the azimuths of the bisector layout, for a coupling of
// three vees on three balls.
func (p *grooveProblem) bisectors(c Coupling) ([]float64, bool) {
	if len(c.Pairs) != 3 || len(p.vees) != 3 {
		return nil, false
	}
	in := incentre(c.Pairs[0].Ball.Centre, c.Pairs[1].Ball.Centre, c.Pairs[2].Ball.Centre)
	az := make([]float64, 3)
	for j, v := range p.vees {
		d := r3.Sub(in, v.centre)
		h := r3.Sub(d, r3.Scale(r3.Dot(d, v.up), v.up))
		if linalg.Norm3(h) == 0 {
			return nil, false
		}
		az[j] = azimuth(r3.Unit(h), v.up, v.rad)
	}
	return az, true
}

// weakest returns the weakest Maxwell index at the contact points with
// the vee grooves at azimuths az, or 0 if the layout is singular.
func (p *grooveProblem) weakest(az []float64) float64 {
	for j := range p.vees {
		v := &p.vees[j]
		g := v.direction(az[j])
		side := r3.Cross(v.up, g)
		for k, sgn := range [2]float64{1, -1} {
			n := r3.Add(r3.Scale(v.sin, v.up), r3.Scale(-sgn*v.cos, side))
			l := &p.lines[v.first+k]
			l.n = n
			l.p = r3.Sub(v.centre, r3.Scale(v.radius, n))
		}
	}
	// The centroid of the contact points and their RMS distance from it
	// normalise the matrix: the layouts searched are sane designs.
	var pc r3.Vec
	for _, l := range p.lines {
		pc = r3.Add(pc, l.p)
	}
	pc = r3.Scale(1/float64(len(p.lines)), pc)
	var s2 float64
	for _, l := range p.lines {
		s2 += r3.Norm2(r3.Sub(l.p, pc))
	}
	ts, ok := freed(p.lines, pc, math.Sqrt(s2/float64(len(p.lines))))
	if !ok {
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
