package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/internal/masing"
	"github.com/sixfold-dev/sixfold/screw"
)

// CycleStep is one step of a load cycle: the load added to the load case
// when the step is reached. Steps are applied in order, each reached from
// the one before along a straight path in load.
type CycleStep struct {
	Force  r3.Vec // N, on the moving body
	Point  r3.Vec // m, a point of the force's line
	Moment r3.Vec // N·m, a couple added to the force
}

// Hysteresis is the response of the point of interest to a load cycle
// with micro-slip at the contacts: the path, the residual displacement
// after the cycle and the energy lost per cycle.
type Hysteresis struct {
	Case  string
	Point r3.Vec
	Mu    float64

	// Path holds the state after each step of the first cycle, which
	// starts from the seated pose with no tangential load at any
	// contact.
	Path []HysteresisStep

	// Residual is the displacement of Point after the cycle, m, and
	// ResidualTilt the rotation of the body, rad (a rotation vector):
	// the hysteresis the cycle leaves behind.
	Residual     r3.Vec
	ResidualTilt r3.Vec

	// Energy is the energy dissipated by micro-slip per cycle, J, once
	// the cycle repeats: the work of the cycle's loads around the second
	// cycle (trapezoid rule over the steps), whose path is a closed loop
	// by Masing's rules when the normal forces stay constant.
	Energy float64
}

// HysteresisStep is the state of the coupling after one step of a cycle.
type HysteresisStep struct {
	Force, Moment r3.Vec // the step's added load, as given (Moment about the step's Point)
	Point         r3.Vec // the step's Point

	Displacement r3.Vec // of the point of interest from the seated pose, m
	Tilt         r3.Vec // rotation of the body from the seated pose, rad

	// SlipRatio is the largest |Q|/(μP) of the contacts: how close the
	// most loaded contact is to sliding (1: it slides).
	SlipRatio float64
}

// hysteresisTol is the relative residual of the force balance at which a
// step's Newton iteration stops, against the sum of the seated contact
// forces and the step's load: the forces are sums of six terms formed to
// about 1e-16 relative, so 1e-12 is reached by every converged step and
// leaves the displacements good to about 1e-12 of their size.
const hysteresisTol = 1e-12

// Hysteresis applies the load cycle steps to the coupling seated under the
// load case lc and follows the point p of the moving body, with micro-slip
// at the contacts for the coefficient of friction mu (a
// coefficient: 0.15, not 15; any μ > 0 is taken, so that the no-slip
// limit can be approached, and a design file refuses one above 3).
//
// Each step's added load is a force through its Point plus a couple; the
// cycle starts from the seated pose and must end with zero added load (the
// last step's Force and Moment zero), so that Residual is the hysteresis.
// At each step the normal force P of every contact is the rigid-statics
// force under the case plus the step's load; the body's small pose change
// balances the loads against the contacts' Hertz normal springs (about
// their seated approach) and their tangential tractions, solved by
// Newton's method from the step before. Each contact's tangential traction
// along one direction in its tangent plane follows Mindlin's partial-slip
// law with Mindlin & Deresiewicz's unloading and the exact memory of the
// load path by Masing's rules (hertz.Contact.Slip); the direction is that
// of the contact's tangential displacement, with no slip anywhere, under
// the cycle's largest step, and the traction across it follows the same
// law independently. Each step is predicted from the last one's tangent
// stiffness and solved by Newton's method with backtracking. The package
// documentation states the model and its limits.
//
// Errors are [*InputError]s: those of [Model.Stiffness] for the seated
// case; "mu" when not finite and > 0, or above 3 (a percentage: 15% is
// 0.15); "p" when not finite; "steps" when
// empty; "steps[k].Force", ".Point" or ".Moment" when not finite (or, for
// the last step, when the force or moment is not zero); "steps[k]"
// wrapping [ErrRange] when a contact opens under the step (P ≤ 0, outside
// the model), when the solution does not converge or overflows; and
// [ErrNotExact] for a model that is not exactly constrained.
func (m *Model) Hysteresis(lc LoadCase, steps []CycleStep, mu float64, p r3.Vec) (Hysteresis, error) {
	if err := checkMu(mu); err != nil {
		return Hysteresis{}, err
	}
	return m.hysteresis(lc, steps, mu, p)
}

// hysteresis is Hysteresis without the bound on mu above (the no-slip
// limit μ → ∞ of the tests).
func (m *Model) hysteresis(lc LoadCase, steps []CycleStep, mu float64, p r3.Vec) (Hysteresis, error) {
	if err := m.check(); err != nil {
		return Hysteresis{}, err
	}
	if !m.exact {
		return Hysteresis{}, m.errNotExact()
	}
	if err := checkMuLow(mu, false); err != nil {
		return Hysteresis{}, err
	}
	if !linalg.Finite3(p) {
		return Hysteresis{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	if len(steps) == 0 {
		return Hysteresis{}, &InputError{Field: "steps", Err: fmt.Errorf("%w: a cycle needs at least one step", ErrRange)}
	}
	dw := make([]screw.Wrench, len(steps))
	for k, s := range steps {
		for _, v := range [...]struct {
			name string
			v    r3.Vec
		}{{"Force", s.Force}, {"Point", s.Point}, {"Moment", s.Moment}} {
			if !linalg.Finite3(v.v) {
				return Hysteresis{}, &InputError{Field: indexed("steps", k) + "." + v.name, Err: fmt.Errorf("%w: %v", ErrNonFinite, v.v)}
			}
		}
		w := screw.Wrench{F: s.Force, M: r3.Add(s.Moment, r3.Cross(r3.Sub(s.Point, m.origin), s.Force))}
		if !linalg.Finite3(w.M) {
			return Hysteresis{}, &InputError{Field: indexed("steps", k) + ".Point", Err: fmt.Errorf("%w: the moment of the force about the contacts overflows", ErrRange)}
		}
		dw[k] = w
	}
	if last := steps[len(steps)-1]; last.Force != (r3.Vec{}) || last.Moment != (r3.Vec{}) {
		f := indexed("steps", len(steps)-1) + ".Force"
		if last.Force == (r3.Vec{}) {
			f = indexed("steps", len(steps)-1) + ".Moment"
		}
		return Hysteresis{}, &InputError{Field: f, Err: fmt.Errorf("%w: a cycle ends where it began, with zero added load (add a last step with zero force and moment)", ErrRange)}
	}
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		return Hysteresis{}, err
	}
	w0, _ := m.wrench(&lc) // checked by Stiffness
	h := hysteresisSolver{m: m, mu: mu, L: m.size, w0: w0}
	if err := h.prepare(st.Forces, dw, &lc); err != nil {
		return Hysteresis{}, err
	}
	r := Hysteresis{Case: lc.Name, Point: p, Mu: mu, Path: make([]HysteresisStep, len(steps))}
	arm := r3.Sub(p, m.origin)
	for k := range steps {
		ratio, err := h.step(k, dw[k])
		if err != nil {
			return Hysteresis{}, err
		}
		v, w := h.pose()
		r.Path[k] = HysteresisStep{Force: steps[k].Force, Moment: steps[k].Moment, Point: steps[k].Point,
			Displacement: r3.Add(v, r3.Cross(w, arm)), Tilt: w, SlipRatio: ratio}
		if !allFinite3(r.Path[k].Displacement, w) {
			return Hysteresis{}, &InputError{Field: indexed("steps", k), Err: fmt.Errorf("%w: the displacement overflows", ErrRange)}
		}
	}
	r.Residual, r.ResidualTilt = r.Path[len(steps)-1].Displacement, r.Path[len(steps)-1].Tilt
	// The second cycle, for the energy: the work of the added load by the
	// trapezoid rule, from the end of the first cycle (zero added load).
	prevY, prevW := h.y, [6]float64{}
	for k := range steps {
		if _, err := h.step(k, dw[k]); err != nil {
			return Hysteresis{}, err
		}
		wk := scaledWrench(dw[k], h.L)
		for a := range 6 {
			r.Energy += 0.5 * (wk[a] + prevW[a]) * (h.y[a] - prevY[a])
		}
		prevY, prevW = h.y, wk
	}
	if !allFinite(r.Energy) {
		return Hysteresis{}, &InputError{Field: "steps", Err: fmt.Errorf("%w: the energy overflows", ErrRange)}
	}
	return r, nil
}

// slipContact is one contact of the hysteresis solver.
type slipContact struct {
	gn     [6]float64    // scaled line of the normal
	gt     [2][6]float64 // scaled lines of the slip direction and the one across it
	k      float64       // Hertz constant, N/m^(3/2)
	delta0 float64       // seated approach, m
	mem    [2]*masing.Memory
	// at the present step
	limit, ds float64 // μP, N; sliding displacement 3μP/(2k0), m
	p0, k00   float64 // seated normal force, N, and no-slip stiffness there, N/m
}

// hysteresisSolver holds the state of the coupling through a cycle.
type hysteresisSolver struct {
	m   *Model
	mu  float64
	L   float64
	w0  screw.Wrench
	ref float64 // force scale of the residual, N
	cs  [6]slipContact
	y   [6]float64 // scaled pose change (V, W·L) about origin

	// The tangent stiffness (lower triangle) and the scaled load at the
	// end of the last step, for the next step's first-order prediction.
	kMat     [36]float64
	bLast    [6]float64
	havePred bool
}

// prepare sets up the contacts from their seated forces f0 and chooses
// each contact's slip direction from the no-slip solution under the
// largest step of dw.
func (h *hysteresisSolver) prepare(f0 []float64, dw []screw.Wrench, lc *LoadCase) error {
	m := h.m
	var kl [36]float64
	var t1s, t2s [6][6]float64
	var tan [6][2]r3.Vec // each contact's tangent pair
	for i, l := range m.lines {
		c := &h.cs[i]
		s := &m.surf[i]
		c.k = s.k
		c.delta0 = hertzApproach(s.k, f0[i])
		c.gn = scaledWrench(screw.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}, h.L)
		hc, err := s.pair.Contact(f0[i])
		if err != nil {
			return fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
		}
		k0, err := hc.TangentialStiffness(1, 0)
		if err != nil {
			return fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
		}
		c.p0, c.k00 = f0[i], k0
		addOuter(&kl, normalStiffness(s.k, f0[i]), &c.gn)
		t1 := linalg.AnyNormal(l.n)
		t2 := r3.Cross(l.n, t1)
		tan[i] = [2]r3.Vec{t1, t2}
		t1s[i] = scaledWrench(screw.Wrench{F: t1, M: r3.Cross(l.p, t1)}, h.L)
		t2s[i] = scaledWrench(screw.Wrench{F: t2, M: r3.Cross(l.p, t2)}, h.L)
		addOuter(&kl, k0, &t1s[i])
		addOuter(&kl, k0, &t2s[i])
		c.mem = [2]*masing.Memory{masing.New(masing.Mindlin, 8), masing.New(masing.Mindlin, 8)}
		h.ref += f0[i]
	}
	big, kmax := -1.0, 0
	for k, w := range dw {
		g := scaledWrench(w, h.L)
		if n := dot6(&g, &g); n > big {
			big, kmax = n, k
		}
	}
	y := scaledWrench(dw[kmax], h.L)
	if !linalg.Cholesky6(&kl, 1e-14) {
		return &InputError{Field: "lc", Err: fmt.Errorf("%w: the coupling's stiffness is singular under %s", ErrDegenerate, caseName(lc))}
	}
	linalg.CholeskySolve6(&kl, &y)
	for i, l := range m.lines {
		c := &h.cs[i]
		a, b := dot6(&t1s[i], &y), dot6(&t2s[i], &y)
		t1, t2 := tan[i][0], tan[i][1]
		e1 := t1
		if n := math.Hypot(a, b); n > 0 {
			e1 = r3.Add(r3.Scale(a/n, t1), r3.Scale(b/n, t2))
		}
		e2 := r3.Cross(l.n, e1)
		c.gt[0] = scaledWrench(screw.Wrench{F: e1, M: r3.Cross(l.p, e1)}, h.L)
		c.gt[1] = scaledWrench(screw.Wrench{F: e2, M: r3.Cross(l.p, e2)}, h.L)
	}
	return nil
}

// step solves the pose under the added load w (step k) from the present
// state, commits the contacts' memories and returns the largest |Q|/(μP).
func (h *hysteresisSolver) step(k int, w screw.Wrench) (float64, error) {
	m := h.m
	wk := h.w0.Add(w)
	b := scaledWrench(wk, h.L)
	for i := range m.lines {
		c := &h.cs[i]
		P := contactForce(m.freed[i], wk)
		if !(P > 0) {
			return 0, &InputError{Field: indexed("steps", k), Err: fmt.Errorf(
				"%w: contact %s opens under this step (rigid-statics force %.4g N): the micro-slip model needs every contact closed; lower the step's load or raise the preload",
				ErrRange, labelOf(m.lines[i].label, i), P)}
		}
		// The no-slip stiffness grows as the contact's size, a ∝ P^(1/3)
		// at a fixed shape of the ellipse (Hertz: Johnson 1985, §4.2).
		k0 := c.k00 * math.Cbrt(P/c.p0)
		c.limit = h.mu * P
		c.ds = 1.5 * c.limit / k0
		if !allFinite(c.limit, c.ds) || c.ds == 0 {
			return 0, &InputError{Field: "mu", Err: fmt.Errorf("%w: the sliding limit of contact %s overflows or vanishes with μ = %g", ErrRange, labelOf(m.lines[i].label, i), h.mu)}
		}
	}
	ref := h.ref + math.Sqrt(dot6(&b, &b))
	var r, dy [6]float64
	var K [36]float64
	if h.havePred {
		// Predict the step from the last step's tangent stiffness: the
		// Newton iteration then starts within the step's curvature.
		K = h.kMat
		if linalg.Cholesky6(&K, 1e-15) {
			for a := range 6 {
				dy[a] = b[a] - h.bLast[a]
			}
			linalg.CholeskySolve6(&K, &dy)
			for a := range 6 {
				h.y[a] += dy[a]
			}
		}
	}
	norm := h.residual(&h.y, &b, &r, &K)
	for it := 0; ; it++ {
		if norm <= hysteresisTol*ref {
			break
		}
		if it == 100 || !allFinite(norm) {
			return 0, &InputError{Field: indexed("steps", k), Err: fmt.Errorf(
				"%w: the balance of the coupling under this step did not converge (residual %.3g N)", ErrRange, norm)}
		}
		dy = r
		if !linalg.Cholesky6(&K, 1e-15) {
			return 0, &InputError{Field: indexed("steps", k), Err: fmt.Errorf("%w: the coupling loses its stiffness under this step (a contact opens)", ErrRange)}
		}
		linalg.CholeskySolve6(&K, &dy)
		// Backtrack until the residual falls: the tangential law has
		// kinks at reversals, where a full Newton step can overshoot.
		lam := 1.0
		var yt [6]float64
		for range 40 {
			for a := range 6 {
				yt[a] = h.y[a] + lam*dy[a]
			}
			if n := h.residual(&yt, &b, &r, &K); n < norm {
				norm = n
				break
			}
			lam /= 2
		}
		if lam < 1e-12 {
			// No descent along the Newton direction at rounding level:
			// accept the point if its residual is small enough.
			norm = h.residual(&h.y, &b, &r, &K)
			if norm <= 1e-9*ref {
				break
			}
			return 0, &InputError{Field: indexed("steps", k), Err: fmt.Errorf(
				"%w: the balance of the coupling under this step did not converge (residual %.3g N)", ErrRange, norm)}
		}
		h.y = yt
	}
	h.kMat, h.bLast, h.havePred = K, b, true
	ratio := 0.0
	for i := range m.lines {
		c := &h.cs[i]
		var q2 float64
		for j := range c.gt {
			pt, _ := c.mem[j].MoveX(dot6(&c.gt[j], &h.y) / c.ds)
			q2 += pt.Y * pt.Y
		}
		ratio = math.Max(ratio, math.Sqrt(q2))
	}
	return ratio, nil
}

// residual sets r to the out-of-balance load on the body at the scaled
// pose y under the scaled total load b, and K to the tangent stiffness
// −dr/dy, and returns the largest |r|.
func (h *hysteresisSolver) residual(y, b, r *[6]float64, K *[36]float64) float64 {
	*r = *b
	*K = [36]float64{}
	for i := range h.m.lines {
		c := &h.cs[i]
		if d := c.delta0 - dot6(&c.gn, y); d > 0 {
			n := hertzForce(c.k, d)
			for a := range 6 {
				r[a] += n * c.gn[a]
			}
			addLower(K, 1.5*c.k*math.Sqrt(d), &c.gn)
		}
		for j := range c.gt {
			pt, slope := c.mem[j].PeekX(dot6(&c.gt[j], y) / c.ds)
			q := c.limit * pt.Y
			for a := range 6 {
				r[a] -= q * c.gt[j][a]
			}
			addLower(K, c.limit/c.ds*slope, &c.gt[j])
		}
	}
	var n float64
	for _, v := range r {
		n = math.Max(n, math.Abs(v))
	}
	return n
}

// pose returns the translation of the origin, m, and the rotation, rad,
// of the present pose about the model's origin.
func (h *hysteresisSolver) pose() (r3.Vec, r3.Vec) {
	return r3.Vec{X: h.y[0], Y: h.y[1], Z: h.y[2]}, r3.Vec{X: h.y[3] / h.L, Y: h.y[4] / h.L, Z: h.y[5] / h.L}
}

// addLower adds k·g·gᵀ to the lower triangle of the row-major 6×6 matrix
// a, all that linalg.Cholesky6 reads.
func addLower(a *[36]float64, k float64, g *[6]float64) {
	for r := range 6 {
		kr := k * g[r]
		row := a[6*r : 6*r+r+1]
		for c := range row {
			row[c] += kr * g[c]
		}
	}
}
