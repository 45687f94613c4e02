package kinematic

import (
	"fmt"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// StiffnessOptions holds options for [Model.Stiffness]; the zero value and
// a nil pointer mean defaults.
type StiffnessOptions struct {
	// Tangential adds each contact's tangential (Mindlin, no-slip)
	// stiffness in its tangent plane to the normal stiffness: an upper
	// bound for small vibrations below the friction limit. The default
	// is normal stiffness only, the usual model of a kinematic coupling
	// whose contacts can slip.
	Tangential bool

	// Equilibrium sets the options of the nonlinear equilibrium that
	// finds the contact forces when the model is not exactly constrained
	// (an exactly constrained model uses rigid statics).
	Equilibrium *EquilibriumOptions
}

// Stiffness is the 6×6 stiffness of a preloaded coupling: the restoring
// load on the moving body per unit small displacement.
type Stiffness struct {
	Case string

	// Forces holds the contact force used at each contact, N; their
	// normal stiffnesses are dF/dδ = (3/2)·F/δ at those forces (Hertz).
	Forces []float64

	// Normal holds each contact's normal stiffness dF/dδ in N/m.
	Normal []float64

	k       [36]float64 // scaled (V, W·L) → (F, M/L) about origin
	origin  r3.Vec
	length  float64
	payload Payload // Centre about origin
}

// Stiffness returns the stiffness of the coupling under the load case:
// the contacts act as springs in parallel, K = Σ kᵢ lᵢ lᵢᵀ with kᵢ the
// Hertz normal stiffness of contact i at its force and lᵢ its unit line of
// force (the model of Hale & Slocum 2001, "Optimal design techniques for
// kinematic couplings", Precision Engineering 25(2)), plus, with
// opt.Tangential, the Mindlin no-slip tangential stiffness in each tangent
// plane (hertz.Contact.TangentialStiffness), minus each preload element's
// Rate along its line (a force that grows as the body moves along it
// destabilises). The forces come from rigid statics on an exactly
// constrained model and from [Model.Equilibrium] otherwise; an open
// contact adds nothing.
//
// An unloaded Hertz contact has no stiffness (dF/dδ = (3/2)k^(2/3)F^(1/3)
// is 0 at F = 0), so an exactly constrained model needs every contact in
// compression, and any model needs six loaded contacts.
//
// Errors are those of [Model.Statics] or [Model.Equilibrium]; an
// [*InputError] wrapping [ErrRange] naming the input that pulls hardest
// ("preloads[0]", "lc.Gravity") when a contact would be in tension under
// rigid statics; and one wrapping [ErrDegenerate] naming "lc.NoPreload"
// (the preload switched off), "preloads" (a model without preload) or "lc"
// when contacts carry no force, listing them.
func (m *Model) Stiffness(lc LoadCase, opt *StiffnessOptions) (Stiffness, error) {
	if err := m.check(); err != nil {
		return Stiffness{}, err
	}
	var o StiffnessOptions
	if opt != nil {
		o = *opt
	}
	n := len(m.lines)
	forces := make([]float64, n)
	if m.exact {
		w, err := m.wrench(&lc)
		if err != nil {
			return Stiffness{}, err
		}
		var f [6]float64
		m.forces(w, &f)
		for i := range f {
			if !allFinite(f[i]) {
				return Stiffness{}, &InputError{Field: "lc", Err: fmt.Errorf("%w: the force at contact %s overflows", ErrRange, labelOf(m.lines[i].label, i))}
			}
			if f[i] < 0 {
				field, pull := m.puller(i, &lc)
				return Stiffness{}, &InputError{Field: field, Other: "lc", Err: fmt.Errorf(
					"%w: contact %s is in tension (%.4g N) under %s; this input alone pulls it with %.4g N: the part lifts off its seats and the contact has no stiffness; reverse or move the preload, add preload, or use Equilibrium",
					ErrRange, labelOf(m.lines[i].label, i), f[i], caseName(&lc), -pull)}
			}
		}
		copy(forces, f[:])
	} else {
		eq, err := m.Equilibrium(lc, o.Equilibrium)
		if err != nil {
			return Stiffness{}, renamed(err, rename{"opt", "opt.Equilibrium"})
		}
		for i, c := range eq.Contacts {
			forces[i] = c.Force
		}
	}
	if err := m.unloaded(forces, &lc); err != nil {
		return Stiffness{}, err
	}
	normal := make([]float64, n)
	for i, l := range m.lines {
		f := forces[i]
		if f <= 0 {
			continue
		}
		s := &m.surf[i]
		if s.err != nil {
			return Stiffness{}, s.err
		}
		normal[i] = normalStiffness(s.k, f)
		if !linalg.Finite(normal[i]) {
			return Stiffness{}, &InputError{Field: "lc", Err: fmt.Errorf("%w: the stiffness of contact %s at %g N is outside the floating-point range", ErrRange, labelOf(l.label, i), f)}
		}
	}
	var rates []preloadLine
	if lc.factor() != 0 {
		rates = m.preloads
	}
	st := stiffnessOf(m.lines, normal, rates, m.origin, m.size, m.payload)
	st.Case, st.Forces, st.Normal = lc.Name, forces, normal
	if !o.Tangential {
		return st, nil
	}
	for i, l := range m.lines {
		f := forces[i]
		if f <= 0 {
			continue
		}
		s := &m.surf[i]
		h, err := s.pair.Contact(f)
		if err != nil {
			return Stiffness{}, fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
		}
		kt, err := h.TangentialStiffness(1, 0) // at zero tangential load the result does not depend on μ
		if err != nil {
			return Stiffness{}, fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
		}
		t1 := linalg.AnyNormal(l.n)
		t2 := r3.Cross(l.n, t1)
		for _, t := range [2]r3.Vec{t1, t2} {
			g := scaledWrench(screw.Wrench{F: t, M: r3.Cross(l.p, t)}, st.length)
			addOuter(&st.k, kt, &g)
		}
	}
	return st, nil
}

// unloaded returns an error listing the contacts that carry no force when
// the stiffness needs them: every contact of an exactly constrained
// model, six contacts of any other.
func (m *Model) unloaded(forces []float64, lc *LoadCase) error {
	var open []string
	for i, f := range forces {
		if !(f > 0) {
			open = append(open, labelOf(m.lines[i].label, i))
		}
	}
	if len(open) == 0 || (!m.exact && len(forces)-len(open) >= 6) {
		return nil
	}
	field, hint := "lc", "load the coupling"
	switch {
	case len(m.preloads) == 0:
		field, hint = "preloads", "add a preload element"
	case lc.NoPreload:
		field, hint = "lc.NoPreload", "apply the preload (NoPreload false)"
	}
	return &InputError{Field: field, Err: fmt.Errorf(
		"%w: contacts %s carry no force under %s, and an unloaded Hertz contact has no stiffness (dF/dδ = 0 at F = 0); %s",
		ErrDegenerate, strings.Join(open, ", "), caseName(lc), hint)}
}

// caseName returns `case "name"`, or "the load case" when it has no name.
func caseName(lc *LoadCase) string {
	if lc.Name == "" {
		return "the load case"
	}
	return fmt.Sprintf("case %q", lc.Name)
}

// stiffnessOf returns the stiffness of contacts acting as springs in
// parallel with preload elements: K = Σ kᵢ lᵢ lᵢᵀ − Σ rateⱼ pⱼ pⱼᵀ, with
// kn[i] the normal stiffness of the contact line ls[i] (N/m; 0 adds
// nothing) and pⱼ the unit line of preload element j, whose force grows by
// rateⱼ per metre along it (a force that grows as the body moves along it
// destabilises). Lines and the origin of the result are about origin, L is
// the length that scales moments (1 when not positive), payload the
// payload with its centre about origin. It is the one assembly of the
// stiffness: [Model.Stiffness] and the scorecard call it.
func stiffnessOf(ls []line, kn []float64, ps []preloadLine, origin r3.Vec, L float64, payload Payload) Stiffness {
	if !(L > 0) {
		L = 1
	}
	st := Stiffness{origin: origin, length: L, payload: payload}
	for i := range ls {
		if kn[i] == 0 {
			continue
		}
		l := &ls[i]
		g := scaledWrench(screw.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}, L)
		addOuter(&st.k, kn[i], &g)
	}
	for _, p := range ps {
		if p.rate != 0 {
			g := scaledWrench(screw.Wrench{F: p.dir, M: r3.Cross(p.p, p.dir)}, L)
			addOuter(&st.k, -p.rate, &g)
		}
	}
	return st
}

// addOuter adds k·g·gᵀ to the row-major 6×6 matrix a.
func addOuter(a *[36]float64, k float64, g *[6]float64) {
	for r := range 6 {
		kr := k * g[r]
		for c := range 6 {
			a[6*r+c] += kr * g[c]
		}
	}
}

// Matrix returns the stiffness about the point about: the restoring load
// (F in N, M in N·m about that point) per unit small displacement (V in m,
// the translation of the body point at about, and W in rad), ordered
// (Vx, Vy, Vz, Wx, Wy, Wz) → (Fx, Fy, Fz, Mx, My, Mz). It is symmetric.
// The entries about a point at distance r from the contacts grow as r²;
// about a point so far away that they overflow (r near 1e150 m for a
// coupling of tens of millimetres) they are ±Inf: Matrix returns no
// error, so check [Stiffness.Compliance] there, which refuses. The zero
// Stiffness gives the zero matrix.
func (s Stiffness) Matrix(about r3.Vec) [6][6]float64 {
	// Shift: with o the origin of k, r = about − o, a twist with V at
	// about has V_o = V − W × r, and a wrench about o has M_about =
	// M_o − r × F. Build the 6×6 map T (V, W at about) → (V_o, W) and
	// return Tᵀ K_o T (the wrench shift is the transpose).
	r := r3.Sub(about, s.origin)
	var t [6][6]float64 // unscaled
	for i := range 6 {
		t[i][i] = 1
	}
	// V_o = V − W × r = V + r × W: the block [r]×.
	t[0][4], t[0][5] = -r.Z, r.Y
	t[1][3], t[1][5] = r.Z, -r.X
	t[2][3], t[2][4] = -r.Y, r.X
	var k [6][6]float64
	for a := range 6 {
		for b := range 6 {
			// Undo the scaling: K = D⁻¹ Ks D⁻¹ with D = diag(1, 1, 1, 1/L...)
			// for y = (V, W·L), g = (F, M/L).
			f := 1.0
			if a >= 3 {
				f *= s.length
			}
			if b >= 3 {
				f *= s.length
			}
			k[a][b] = s.k[6*a+b] * f
		}
	}
	var out [6][6]float64
	for a := range 6 {
		for b := range 6 {
			var v float64
			for c := range 6 {
				for d := range 6 {
					v += t[c][a] * k[c][d] * t[d][b]
				}
			}
			out[a][b] = v
		}
	}
	for a := range 6 {
		for b := range a {
			out[a][b] = (out[a][b] + out[b][a]) / 2
			out[b][a] = out[a][b]
		}
	}
	return out
}

// Compliance is the flexibility of the coupling seen at one point of the
// moving body.
type Compliance struct {
	Point r3.Vec // m

	// Matrix maps a load at Point (F in N, M in N·m about Point) to the
	// small displacement it causes (V in m, the translation of the body
	// point at Point, and W in rad), ordered (Fx, Fy, Fz, Mx, My, Mz) →
	// (Vx, Vy, Vz, Wx, Wy, Wz): m/N, m/(N·m), rad/N and rad/(N·m). It is
	// the inverse of Stiffness.Matrix(Point).
	Matrix [6][6]float64
}

// Along returns the displacement of the point, in m, along the unit
// direction of u per newton applied there along u: uᵀ C_VF u. It returns
// an [*InputError] naming "u" when u is zero or not finite.
func (c Compliance) Along(u r3.Vec) (float64, error) {
	d, err := unitOf(u, "u")
	if err != nil {
		return 0, err
	}
	v := [3]float64{d.X, d.Y, d.Z}
	var s float64
	for a := range 3 {
		for b := range 3 {
			s += v[a] * c.Matrix[a][b] * v[b]
		}
	}
	return s, nil
}

// singularStiffness is the pivot, relative to the largest diagonal entry
// of the scaled stiffness (all entries in N/m), below which the stiffness
// is singular: the coupling does not resist some motion (an open contact,
// or a preload rate that cancels a contact) to within rounding.
const singularStiffness = 1e-13

// Compliance returns the compliance at the point at of the moving body.
// It returns an [*InputError] naming "at" when the point is not finite or
// so far away that the compliance there overflows ([ErrRange]), one
// naming "s" for the zero Stiffness (not made by [Model.Stiffness]), and
// one wrapping [ErrDegenerate] when the stiffness is singular or not
// positive definite.
func (s Stiffness) Compliance(at r3.Vec) (Compliance, error) {
	if !linalg.Finite3(at) {
		return Compliance{}, &InputError{Field: "at", Err: fmt.Errorf("%w: %v", ErrNonFinite, at)}
	}
	if s.length == 0 {
		return Compliance{}, errZeroStiffness
	}
	// Invert the scaled matrix about its own origin, then shift.
	l := s.k
	if !linalg.Cholesky6(&l, singularStiffness) {
		return Compliance{}, &InputError{Field: "cs", Err: fmt.Errorf("%w: the stiffness is singular or not positive definite: some motion is not resisted", ErrDegenerate)}
	}
	var cs [6][6]float64 // scaled compliance: g → y
	for j := range 6 {
		var b [6]float64
		b[j] = 1
		linalg.CholeskySolve6(&l, &b)
		for i := range 6 {
			cs[i][j] = b[i]
		}
	}
	// Unscale: y = (V, W·L) and g = (F, M/L): C = D Cs D with
	// D = diag(1, 1, 1, 1/L, 1/L, 1/L).
	var co [6][6]float64
	for a := range 6 {
		for b := range 6 {
			f := 1.0
			if a >= 3 {
				f /= s.length
			}
			if b >= 3 {
				f /= s.length
			}
			co[a][b] = cs[a][b] * f
		}
	}
	// Shift from the origin o to at (r = at − o): a load (F, M_at) is
	// (F, M_at + r × F) about o; the displacement (V_o, W) gives
	// V_at = V_o + W × r. So C_at = S C_o Sᵀ with S the map of twists
	// (V_o, W) → (V_at, W), whose transpose maps wrenches at `at` to o.
	r := r3.Sub(at, s.origin)
	var sm [6][6]float64
	for i := range 6 {
		sm[i][i] = 1
	}
	// V_at = V_o + W × r = V_o − r × W: the block −[r]×.
	sm[0][4], sm[0][5] = r.Z, -r.Y
	sm[1][3], sm[1][5] = -r.Z, r.X
	sm[2][3], sm[2][4] = r.Y, -r.X
	c := Compliance{Point: at}
	var sc [6][6]float64 // S C_o
	for a := range 6 {
		for q := range 6 {
			var v float64
			for p := range 6 {
				v += sm[a][p] * co[p][q]
			}
			sc[a][q] = v
		}
	}
	for a := range 6 {
		for b := range 6 {
			var v float64
			for q := range 6 {
				v += sc[a][q] * sm[b][q]
			}
			c.Matrix[a][b] = v
		}
	}
	for a := range 6 {
		for b := range a {
			c.Matrix[a][b] = (c.Matrix[a][b] + c.Matrix[b][a]) / 2
			c.Matrix[b][a] = c.Matrix[a][b]
		}
	}
	for a := range 6 {
		if !allFinite(c.Matrix[a][:]...) {
			return Compliance{}, &InputError{Field: "at", Err: fmt.Errorf("%w: the compliance at %v overflows: the point is too far from the coupling", ErrRange, at)}
		}
	}
	return c, nil
}

// errZeroStiffness is returned by the methods of the zero Stiffness.
var errZeroStiffness = &InputError{Field: "s", Err: fmt.Errorf("%w: the zero Stiffness: make one with Model.Stiffness", ErrDegenerate)}
