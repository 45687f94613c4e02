package kinematic

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// EquilibriumOptions holds options for [Model.Equilibrium]; the zero value
// and a nil pointer mean defaults.
type EquilibriumOptions struct {
	// Gaps gives, by contact label, the gap in metres between the
	// surfaces at the nominal pose before any load: positive for a gap,
	// negative for an interference (a pad set high, a fourth ball
	// oversize). Contacts not named touch without interference.
	Gaps map[string]float64

	// Tolerance is the relative residual at which the iteration stops:
	// the out-of-balance load divided by the sum of the contact forces
	// and the applied load. Zero means 1e-12.
	Tolerance float64

	// MaxIterations bounds the Newton iterations; zero means 100.
	MaxIterations int
}

// Equilibrium is the elastic equilibrium of the moving body on its
// contacts under one load case.
type Equilibrium struct {
	Case string

	// Displacement is the small rigid displacement of the moving body
	// from its nominal pose: rotation W in rad and translation V in m of
	// the body point at the origin.
	Displacement screw.Twist

	// Contacts holds the load at each contact, in the order of the
	// model's contacts; an open contact carries nothing.
	Contacts []ContactLoad

	// Open lists the labels of the contacts whose surfaces separate.
	Open []string

	// Residual is the out-of-balance load relative to the loads in play,
	// dimensionless (moments divided by the contacts' RMS distance from
	// their centroid); Iterations the Newton steps taken.
	Residual   float64
	Iterations int
}

// escapeLimit is the displacement, in units of the contact set's size,
// beyond which Equilibrium concludes that the contacts cannot hold the
// load: a small-displacement model has long stopped applying there.
const escapeLimit = 1e-1

// Equilibrium returns the elastic equilibrium of the moving body under the
// load case for any contact set that constrains all six freedoms: the
// small displacement x at which Σ Fᵢ(δᵢ(x)) lᵢ + w = 0, each contact
// following Hertz's law Fᵢ = kᵢ δᵢ^(3/2) (Johnson 1985, §3.5; kᵢ from
// hertz) while its approach δᵢ = eᵢ − lᵢ·x is positive and carrying nothing
// when its surfaces separate, where eᵢ is minus the gap of
// [EquilibriumOptions.Gaps]. Preload elements add their Rate times their
// displacement (see [Preload]).
//
// The equilibrium is the minimum of the potential
// Π(x) = Σ (2/5) kᵢ δᵢ^(5/2) − x·w − Σ (rate/2) sⱼ², convex in x when no
// preload rate is positive (δ^(5/2) is convex and δ linear in x), so
// Newton's method with a backtracking line search on Π converges from any
// start (Nocedal & Wright, Numerical Optimization, 2nd ed., 2006, §3.1 and
// §3.5). It starts from the rigid-statics solution on an exactly
// constrained set with every contact in compression, where it ends in one
// or two steps and agrees with [Model.Statics] to rounding.
//
// Equilibrium returns an [*InputError] wrapping [ErrNotExact] for a set of
// rank below six, the load case's errors, one naming "opt.Gaps[label]" for
// an unknown label or a gap that is not finite, the error naming a contact
// without a Hertz model, and one wrapping [ErrRange] when the iteration
// does not converge or the contacts cannot hold the load (the body leaves
// its seats).
func (m *Model) Equilibrium(lc LoadCase, opt *EquilibriumOptions) (Equilibrium, error) {
	if err := m.check(); err != nil {
		return Equilibrium{}, err
	}
	var o EquilibriumOptions
	if opt != nil {
		o = *opt
	}
	if o.Tolerance == 0 {
		o.Tolerance = 1e-12
	}
	if o.MaxIterations == 0 {
		o.MaxIterations = 100
	}
	if !(o.Tolerance > 0 && o.Tolerance < 1) {
		return Equilibrium{}, &InputError{Field: "opt.Tolerance", Err: fmt.Errorf("%w: must be in (0, 1), got %g", ErrRange, o.Tolerance)}
	}
	if o.MaxIterations < 0 {
		return Equilibrium{}, &InputError{Field: "opt.MaxIterations", Err: fmt.Errorf("%w: must be ≥ 0, got %d", ErrRange, o.MaxIterations)}
	}
	n := len(m.lines)
	for i := range m.surf {
		if m.surf[i].err != nil {
			return Equilibrium{}, m.surf[i].err
		}
	}
	e := make([]float64, n)
	if len(o.Gaps) > 0 {
		byLabel := make(map[string]int, n)
		for i, l := range m.lines {
			byLabel[labelOf(l.label, i)] = i
		}
		labels := make([]string, 0, len(o.Gaps))
		for k := range o.Gaps {
			labels = append(labels, k)
		}
		sort.Strings(labels) // report the first bad label deterministically
		for _, k := range labels {
			g := o.Gaps[k]
			i, ok := byLabel[k]
			field := fmt.Sprintf("opt.Gaps[%q]", k)
			if !ok {
				return Equilibrium{}, &InputError{Field: field, Err: fmt.Errorf("%w: no contact has this label", ErrRange)}
			}
			if !linalg.Finite(g) {
				return Equilibrium{}, &InputError{Field: field, Err: fmt.Errorf("%w: %g", ErrNonFinite, g)}
			}
			e[i] = -g
		}
	}
	w, err := m.wrench(&lc)
	if err != nil {
		return Equilibrium{}, err
	}
	s := newSolver(m, e, w, lc.factor() != 0)
	if !s.ranked() {
		return Equilibrium{}, &InputError{Field: "cs", Err: fmt.Errorf(
			"%w: the contacts leave the body free to move; an equilibrium needs six independent contacts or more", ErrNotExact)}
	}
	if m.exact {
		s.rigidStart()
	}
	it, err := s.newton(o.Tolerance, o.MaxIterations)
	if err != nil {
		return Equilibrium{}, err
	}
	eq := Equilibrium{Case: lc.Name, Residual: s.residual(), Iterations: it, Contacts: make([]ContactLoad, n)}
	L := s.L
	x := screw.Twist{V: r3.Vec{X: s.y[0], Y: s.y[1], Z: s.y[2]}, W: r3.Vec{X: s.y[3] / L, Y: s.y[4] / L, Z: s.y[5] / L}}
	eq.Displacement = global(x, m.origin)
	for i := range m.lines {
		cl := &eq.Contacts[i]
		cl.Label = labelOf(m.lines[i].label, i)
		d := s.approach(i)
		if d <= 0 {
			eq.Open = append(eq.Open, cl.Label)
			continue
		}
		cl.Force = hertzForce(m.surf[i].k, d)
		if err := m.hertzAt(i, cl.Force, cl); err != nil {
			return Equilibrium{}, err
		}
	}
	return eq, nil
}

// solver holds the Newton iteration of Equilibrium in scaled coordinates:
// y = (V, W·L) for a twist, g = (F, M/L) for a wrench, L the contact set's
// RMS size, so that y·g is the power and every entry is of one unit.
type solver struct {
	m    *Model
	L    float64
	g    [][6]float64 // contact lines
	e    []float64    // interference per contact, m
	w    [6]float64   // applied load
	pre  [][6]float64 // preload lines (unit force) with rates
	rate []float64
	y    [6]float64
}

func newSolver(m *Model, e []float64, w screw.Wrench, preload bool) *solver {
	L := m.size
	if !(L > 0) {
		L = 1
	}
	s := &solver{m: m, L: L, e: e, g: make([][6]float64, len(m.lines))}
	for i, l := range m.lines {
		s.g[i] = scaledWrench(screw.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}, L)
	}
	s.w = scaledWrench(w, L)
	if preload {
		for _, p := range m.preloads {
			if p.rate == 0 {
				continue
			}
			s.pre = append(s.pre, scaledWrench(screw.Wrench{F: p.dir, M: r3.Cross(p.p, p.dir)}, L))
			s.rate = append(s.rate, p.rate)
		}
	}
	return s
}

// ranked reports whether the contact lines span all six directions, by
// the rank Analyze gave the model (screw.Analyze's SVD with its threshold
// RankTol). A Cholesky factorisation of their Gram matrix cannot decide
// it: the Gram matrix of five lines has a last pivot of rounding size,
// about ε times its largest entry, not zero.
func (s *solver) ranked() bool {
	return s.m.rank == 6
}

// approach returns contact i's approach at the current y, m.
func (s *solver) approach(i int) float64 {
	return s.e[i] - dot6(&s.g[i], &s.y)
}

// rigidStart sets y to the displacement at which every contact has the
// approach of its rigid-statics force, when all those forces are
// compressive: lᵢ·x = eᵢ − δᵢ, solved with the twists of power δᵢⱼ.
func (s *solver) rigidStart() {
	m := s.m
	var f [6]float64
	w := screw.Wrench{F: r3.Vec{X: s.w[0], Y: s.w[1], Z: s.w[2]}, M: r3.Scale(s.L, r3.Vec{X: s.w[3], Y: s.w[4], Z: s.w[5]})}
	m.forces(w, &f)
	var x screw.Twist
	for i := range f {
		if f[i] < 0 {
			return
		}
		d := hertzApproach(m.surf[i].k, f[i])
		x = x.Add(m.freed[i].Scale(s.e[i] - d))
	}
	s.y = [6]float64{x.V.X, x.V.Y, x.V.Z, x.W.X * s.L, x.W.Y * s.L, x.W.Z * s.L}
}

// state returns the potential Π, its gradient and Hessian at y.
func (s *solver) state(y *[6]float64, grad *[6]float64, hess *[36]float64) float64 {
	pi := -dot6(y, &s.w)
	for i := range grad {
		grad[i] = -s.w[i]
	}
	if hess != nil {
		*hess = [36]float64{}
	}
	for i := range s.g {
		g := &s.g[i]
		d := s.e[i] - dot6(g, y)
		if d <= 0 {
			continue
		}
		// Π's term (2/5) k δ^(5/2), its force k δ^(3/2) (hertzForce) and
		// stiffness (3/2) k δ^(1/2) (normalStiffness, in terms of δ),
		// sharing √δ.
		k := s.m.surf[i].k
		sd := math.Sqrt(d)
		pi += 0.4 * k * d * d * sd
		f := k * d * sd
		for r := range 6 {
			grad[r] -= f * g[r]
		}
		if hess != nil {
			h := 1.5 * k * sd
			for r := range 6 {
				for c := range 6 {
					hess[6*r+c] += h * g[r] * g[c]
				}
			}
		}
	}
	for j := range s.pre {
		p := &s.pre[j]
		d := dot6(p, y)
		pi -= 0.5 * s.rate[j] * d * d
		for r := range 6 {
			grad[r] -= s.rate[j] * d * p[r]
		}
		if hess != nil {
			for r := range 6 {
				for c := range 6 {
					hess[6*r+c] -= s.rate[j] * p[r] * p[c]
				}
			}
		}
	}
	return pi
}

// scaleOfLoads returns the loads in play at y: the sum of the contact
// forces and the size of the applied load, N.
func (s *solver) scaleOfLoads() float64 {
	sum := math.Sqrt(dot6(&s.w, &s.w))
	for i := range s.g {
		if d := s.approach(i); d > 0 {
			sum += hertzForce(s.m.surf[i].k, d)
		}
	}
	return sum
}

// residual returns |∇Π| relative to the loads in play.
func (s *solver) residual() float64 {
	var grad [6]float64
	s.state(&s.y, &grad, nil)
	scale := s.scaleOfLoads()
	if scale == 0 {
		return 0
	}
	return math.Sqrt(dot6(&grad, &grad)) / scale
}

// newton runs damped Newton on Π from s.y and returns the iterations.
func (s *solver) newton(tol float64, maxIt int) (int, error) {
	var grad, step [6]float64
	var hess [36]float64
	tooLarge := &InputError{Field: "lc", Err: fmt.Errorf(
		"%w: the load is beyond the small-displacement model (approaches or displacements over a tenth of the contact set's size)", ErrRange)}
	for it := 0; ; it++ {
		if math.Sqrt(dot6(&s.y, &s.y)) > escapeLimit*s.L {
			return it, tooLarge
		}
		pi := s.state(&s.y, &grad, &hess)
		scale := s.scaleOfLoads()
		if !linalg.Finite(pi) || !linalg.Finite(scale) {
			return it, tooLarge
		}
		if r := math.Sqrt(dot6(&grad, &grad)); r <= tol*scale || scale == 0 {
			return it, nil
		}
		if it >= maxIt {
			return it, &InputError{Field: "lc", Err: fmt.Errorf(
				"%w: the equilibrium did not converge in %d iterations (residual %.3g)", ErrRange, maxIt, s.residual())}
		}
		// Levenberg regularisation where contacts have opened and the
		// Hessian lost rank: a multiple of its own diagonal scale.
		var diag float64
		for i := range 6 {
			diag = math.Max(diag, hess[7*i])
		}
		lam := 1e-12 * diag
		if diag == 0 {
			lam = scale / (1e-6 * s.L) // no contact touches yet: a first step of about 1e-6 of the size
		}
		for tries := 0; ; tries++ {
			h := hess
			for i := range 6 {
				h[7*i] += lam
			}
			if linalg.Cholesky6(&h, 1e-15) {
				for i := range step {
					step[i] = -grad[i]
				}
				linalg.CholeskySolve6(&h, &step)
				break
			}
			if tries > 40 {
				return it, &InputError{Field: "lc", Err: fmt.Errorf("%w: the equilibrium is unstable (a preload rate overcomes the contacts' stiffness)", ErrRange)}
			}
			lam = math.Max(lam*10, 1e-12*scale/s.L)
		}
		// Backtracking (Armijo) line search on Π.
		slope := dot6(&grad, &step)
		t := 1.0
		var y [6]float64
		for k := 0; ; k++ {
			for i := range y {
				y[i] = s.y[i] + t*step[i]
			}
			var g2 [6]float64
			if p := s.state(&y, &g2, nil); p <= pi+1e-4*t*slope || k >= 60 {
				break
			}
			t /= 2
		}
		if math.Sqrt(dot6(&y, &y)) > escapeLimit*s.L {
			return it, &InputError{Field: "lc", Err: fmt.Errorf(
				"%w: the contacts cannot hold the load: the body leaves its seats (more preload, or a contact against the load, is needed)", ErrRange)}
		}
		s.y = y
	}
}
