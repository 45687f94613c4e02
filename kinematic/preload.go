package kinematic

import (
	"fmt"
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/internal/lp"
)

// Bound names a load case and a contact: where a requirement binds or
// cannot be met.
type Bound struct {
	Case    string // the load case's Name, or "cases[i]" if it has none
	Contact string // the contact's label
}

// PreloadSizing is the window of preload that keeps a coupling closed and
// within its allowable contact pressures over a list of load cases.
type PreloadSizing struct {
	// Factors holds, per preload element, the factor on its Force (and
	// Couple) that meets MinForce at every contact in every case with the
	// smallest total force, Total = Σ Factors[j]·Force[j], in N. With one
	// element this is the closed form; with several, the optimum of a
	// linear program. Binding lists the case and contact pairs that sit
	// at MinForce there.
	Factors []float64
	Total   float64
	Binding []Bound

	// MinScale and MaxScale bound one common factor s on every element
	// (the preload as given, scaled): at MinScale the first contact
	// reaches MinForce in its worst case (MinBinding), at MaxScale the
	// first contact's peak pressure reaches its allowable (MaxBinding);
	// MaxScale is +Inf when no compressed contact has an allowable on
	// file. A design is feasible with a common scale when
	// MinScale ≤ MaxScale.
	MinScale, MaxScale     float64
	MinBinding, MaxBinding Bound

	// Gaps holds, per preload element, the window of an element with a
	// [ForceLaw] in force and in seated gap at the common scale (the
	// zero GapWindow for an element without a law): the gap is how a
	// magnet's preload is sized, and MinScale rounded up is the number of
	// such elements, side by side, that the smallest preload needs.
	Gaps []GapWindow
}

// GapWindow is the preload window of an element with a force law.
type GapWindow struct {
	// MinForce and MaxForce are the element's force in N at MinScale and
	// at MaxScale (+Inf when MaxScale is).
	MinForce, MaxForce float64

	// MinGap and MaxGap bound the seated gaps in m at which the law's
	// force lies in [MinForce, MaxForce] (MaxGap +Inf when the force never
	// falls below MinForce within ten times the law's reach); Met reports
	// whether there is such a gap. They are computed for a law that is
	// monotone over that range (a magnet, a spring's table) and left zero,
	// with Met false, for one that is not. MinGap 0 with Met means that
	// the window sets no lower limit (the force at touching lies within
	// it), not that a seated gap of 0 is allowed: a law needs a gap > 0.
	MinGap, MaxGap float64
	Met            bool
}

// bindTol is the relative margin within which a contact counts as binding
// at the optimum: the simplex solution is accurate to about 1e-10 of the
// forces involved.
const bindTol = 1e-7

// SizePreload returns the preload window for the load cases: the
// smallest preload that keeps every contact's force at or above minForce
// (N, ≥ 0) in every case, and the largest that keeps every peak pressure at
// or below its allowable. The cases' own PreloadFactor and NoPreload are ignored: the
// sizing chooses them. Rigid statics: the forces are linear in each
// element's factor, fᵢₖ = Σⱼ sⱼ aᵢⱼ + eᵢₖ (aᵢⱼ from element j at factor 1,
// eᵢₖ from the rest of case k), so with one element the smallest factor is
// maxᵢₖ (minForce − eᵢₖ)/aᵢ over the contacts it pushes closed (aᵢ > 0), and
// with several the smallest total force Σ sⱼ Fⱼ subject to fᵢₖ ≥ minForce,
// s ≥ 0 is a linear program, solved through its dual by the module's
// two-phase revised simplex (internal/lp: Harris's ratio test, Bland's rule
// on stalling, an iteration limit; Chvátal, Linear Programming, 1983).
//
// The largest common scale uses the load at which each contact reaches its
// allowable, p₀ ∝ F^(1/3) (hertz.LoadForPressure), so it is exact for the
// Hertz model.
//
// Errors are [*InputError]s: "preloads" wrapping [ErrDegenerate] when the
// model has no preload element, "cases" when it is empty, "minForce" when
// negative or not finite, the load cases' fields as "cases[k].Gravity",
// [ErrNotExact] as for [Model.Statics]; and [ErrRange] with the case and
// contact named when the requirement cannot be met: a contact that no
// element pushes closed but whose case leaves it below minForce, or (with
// several elements) a linear program that is infeasible; and [ErrRange]
// naming "preloads" when a factor overflows (an element of 5e-324 N).
func (m *Model) SizePreload(cases []LoadCase, minForce float64) (PreloadSizing, error) {
	if err := m.check(); err != nil {
		return PreloadSizing{}, err
	}
	if !m.exact {
		return PreloadSizing{}, m.errNotExact()
	}
	if len(m.preloads) == 0 {
		return PreloadSizing{}, &InputError{Field: "preloads", Err: fmt.Errorf("%w: the model has no preload element to size", ErrDegenerate)}
	}
	if len(cases) == 0 {
		return PreloadSizing{}, &InputError{Field: "cases", Err: fmt.Errorf("%w: no load cases", ErrDegenerate)}
	}
	if !linalg.Finite(minForce) {
		return PreloadSizing{}, &InputError{Field: "minForce", Err: fmt.Errorf("%w: %g", ErrNonFinite, minForce)}
	}
	if minForce < 0 {
		return PreloadSizing{}, &InputError{Field: "minForce", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, minForce)}
	}
	nj := len(m.preloads)
	a, e, names, err := m.sizingForces(cases)
	if err != nil {
		return PreloadSizing{}, err
	}
	bound := func(k, i int) Bound { return Bound{Case: names[k], Contact: labelOf(m.lines[i].label, i)} }

	var sz PreloadSizing
	if err := m.scaleWindow(&sz, a, e, minForce, names, bound); err != nil {
		return PreloadSizing{}, err
	}

	// The smallest total preload, element by element.
	if nj == 1 {
		sz.Factors = []float64{sz.MinScale}
	} else {
		f, err := m.sizeLP(a, e, minForce)
		if err != nil {
			return PreloadSizing{}, err
		}
		sz.Factors = f
	}
	for j, s := range sz.Factors {
		sz.Total += s * linalg.Norm3(m.preloads[j].w.F)
	}
	if !allFinite(sz.Total) || !allFinite(sz.Factors...) {
		return PreloadSizing{}, &InputError{Field: "preloads", Err: fmt.Errorf("%w: the sized preload overflows", ErrRange)}
	}
	sz.Binding = bindings(sz.Factors, a, e, minForce, bound)
	sz.Gaps = make([]GapWindow, nj)
	for j, p := range m.preloads {
		if p.law != nil {
			f := linalg.Norm3(p.w.F)
			sz.Gaps[j] = gapWindow(p.law, sz.MinScale*f, sz.MaxScale*f)
		}
	}
	return sz, nil
}

// gapWindow returns the window of the law for forces in [lo, hi], by
// bisection on the gap over [0, 10·reach] for a law that is monotone
// there (checked on 200 points).
func gapWindow(law ForceLaw, lo, hi float64) GapWindow {
	w := GapWindow{MinForce: lo, MaxForce: hi}
	if math.IsNaN(hi) {
		w.MaxForce = math.Inf(1)
		hi = w.MaxForce
	}
	end := 10 * law.reach()
	force := func(g float64) float64 {
		f, _, err := law.Force(g)
		if err != nil {
			return math.NaN()
		}
		return f
	}
	const n = 200
	f0, fe := force(0), force(end)
	falling := fe <= f0
	prev := f0
	for k := 1; k <= n; k++ {
		f := force(end * float64(k) / n)
		if math.IsNaN(f) || (falling && f > prev) || (!falling && f < prev) {
			return w
		}
		prev = f
	}
	// solve returns the gap at which the force crosses v, between 0 and
	// end, where force(0) and force(end) lie on either side of v.
	solve := func(v float64) float64 {
		a, b := 0.0, end
		for range 100 {
			c := (a + b) / 2
			if (force(c) >= v) == falling {
				a = c
			} else {
				b = c
			}
			if b-a <= 1e-15*end {
				break
			}
		}
		return (a + b) / 2
	}
	fmax, fmin := math.Max(f0, fe), math.Min(f0, fe)
	w.Met = lo <= fmax && hi >= fmin && lo <= hi
	if !w.Met {
		return w
	}
	w.MinGap, w.MaxGap = 0, math.Inf(1)
	if falling {
		if hi < f0 {
			w.MinGap = solve(hi)
		}
		if lo > fe {
			w.MaxGap = solve(lo)
		}
	} else {
		if lo > f0 {
			w.MinGap = solve(lo)
		}
		if hi < fe {
			w.MaxGap = solve(hi)
		}
	}
	return w
}

// sizingForces returns the contact forces of the sizing: a[j][i], the
// force at contact i from preload element j at factor 1, and e[k][i], from
// the rest of case k; and the cases' names.
func (m *Model) sizingForces(cases []LoadCase) (a, e [][6]float64, names []string, err error) {
	a = make([][6]float64, len(m.preloads))
	for j, p := range m.preloads {
		m.forces(p.w, &a[j])
	}
	e = make([][6]float64, len(cases))
	names = make([]string, len(cases))
	for k := range cases {
		lc := cases[k]
		lc.NoPreload = true
		w, err := m.wrench(&lc)
		if err != nil {
			if ie, ok := err.(*InputError); ok {
				ie.Field = indexed("cases", k) + ie.Field[len("lc"):]
			}
			return nil, nil, nil, err
		}
		m.forces(w, &e[k])
		names[k] = cases[k].Name
		if names[k] == "" {
			names[k] = indexed("cases", k)
		}
	}
	return a, e, names, nil
}

// scaleWindow sets sz's common scale window, MinScale and MaxScale with
// their binding pairs, for the forces a and e of sizingForces.
func (m *Model) scaleWindow(sz *PreloadSizing, a, e [][6]float64, minForce float64, names []string, bound func(k, i int) Bound) error {
	// The common scale: every element at the same factor s.
	var sum [6]float64
	for j := range a {
		for i := range sum {
			sum[i] += a[j][i]
		}
	}
	sz.MinScale = math.Inf(-1)
	for k := range e {
		for i := range sum {
			need := minForce - e[k][i]
			switch {
			case sum[i] > 0:
				s := need / sum[i]
				if !allFinite(s) {
					return errTinyPreload(labelOf(m.lines[i].label, i))
				}
				if s > sz.MinScale {
					sz.MinScale, sz.MinBinding = s, bound(k, i)
				}
			case need > 0:
				return &InputError{Field: "cases", Err: fmt.Errorf(
					"%w: case %q leaves contact %s at %.6g N, below minForce %g N, and the preload does not push it closed",
					ErrRange, names[k], labelOf(m.lines[i].label, i), e[k][i], minForce)}
			}
		}
	}
	if sz.MinScale < 0 {
		// Every contact meets minForce without preload.
		sz.MinScale, sz.MinBinding = 0, Bound{}
	}
	sz.MaxScale = math.Inf(1)
	for i := range sum {
		s := &m.surf[i]
		if s.err != nil || s.allow == 0 || sum[i] <= 0 {
			continue
		}
		fa, err := s.pair.LoadForPressure(s.allow)
		if err != nil {
			return fromHertz(err, indexed("cs", i)+".Moving", indexed("cs", i)+".Base", nil)
		}
		for k := range e {
			v := (fa - e[k][i]) / sum[i]
			if !allFinite(v) {
				return errTinyPreload(labelOf(m.lines[i].label, i))
			}
			if v < sz.MaxScale {
				sz.MaxScale, sz.MaxBinding = v, bound(k, i)
			}
		}
	}
	return nil
}

// errTinyPreload reports a preload whose factor at a contact leaves the
// floating-point range.
func errTinyPreload(label string) error {
	return &InputError{Field: "preloads", Err: fmt.Errorf(
		"%w: the preload pushes contact %s so little that the factor it needs overflows", ErrRange, label)}
}

// bindings returns the case and contact pairs at minForce, within bindTol,
// under the preload factors.
func bindings(factors []float64, a, e [][6]float64, minForce float64, bound func(k, i int) Bound) []Bound {
	var out []Bound
	scale := math.Max(minForce, 1e-300)
	for k := range e {
		for i := 0; i < 6; i++ {
			f := e[k][i]
			var mag float64
			for j, s := range factors {
				f += s * a[j][i]
				mag = math.Max(mag, math.Abs(s*a[j][i]))
			}
			if math.Abs(f-minForce) <= bindTol*math.Max(scale, math.Max(mag, math.Abs(e[k][i]))) {
				out = append(out, bound(k, i))
			}
		}
	}
	return out
}

// sizeLP solves min Σ sⱼ Fⱼ subject to Σⱼ sⱼ aᵢⱼ + eᵢₖ ≥ minForce, s ≥ 0:
// one row per case and contact (6·len(e)), one column per element. It
// solves the dual program instead (Chvátal, Linear Programming, 1983, ch. 5,
// the duality theorem), which has one row per element, so that the basis
// stays as small as the number of elements however many cases there are:
// with βᵢₖ = minForce − eᵢₖ,
//
//	maximise Σ βᵢₖ yᵢₖ subject to Σᵢₖ aᵢⱼ yᵢₖ ≤ Fⱼ for every element j, y ≥ 0,
//
// in the standard form of lp.Solve with a slack tⱼ ≥ 0 per element and
// each row divided by Fⱼ (sizeDual): minimise −βᵀy subject to
// Σᵢₖ (aᵢⱼ/Fⱼ) yᵢₖ + tⱼ = 1. Its optimal multipliers π give the factors,
// sⱼ = −πⱼ/Fⱼ: the reduced costs of the y columns are
// −βᵢₖ + Σⱼ aᵢⱼ sⱼ ≥ 0 (every contact at minForce), those of the slacks
// sⱼ ≥ 0, and Σ sⱼ Fⱼ equals the dual optimum. The dual is feasible at
// y = 0 (F ≥ 0), so it is either optimal or unbounded, and unbounded
// exactly when the sizing program is infeasible.
func (m *Model) sizeLP(a [][6]float64, e [][6]float64, minForce float64) ([]float64, error) {
	// An element that pushes no contact has an all-zero column: it is left
	// out (its factor is 0).
	var used []int
	for j := range a {
		for i := range 6 {
			if a[j][i] != 0 {
				used = append(used, j)
				break
			}
		}
	}
	out := make([]float64, len(a))
	if len(used) == 0 {
		return out, nil // no element pushes: SizePreload checked that none is needed
	}
	A, b, c := m.sizeDual(a, e, minForce, used)
	sol, err := lp.Solve(c, A, b, nil)
	if err == nil && sol.Status == lp.Unbounded {
		return nil, &InputError{Field: "cases", Err: fmt.Errorf(
			"%w: no combination of the %d preload elements keeps every contact at minForce %g N in every case", ErrRange, len(a), minForce)}
	}
	if err == nil && sol.Status != lp.Optimal {
		err = fmt.Errorf("the dual program is %v, though y = 0 is feasible", sol.Status)
	}
	if err != nil {
		return nil, &InputError{Field: "cases", Err: fmt.Errorf("%w: the preload linear program failed: %v", ErrRange, err)}
	}
	f := m.sizeWeights(used)
	for jj, j := range used {
		out[j] = math.Max(0, -sol.Y[jj]/f[jj])
	}
	return out, nil
}

// sizeDual returns the dual program of sizeLP for the elements used, in the
// form of lp.Solve: the nu×(6·len(e)+nu) column-major matrix (columns y,
// then the slacks t), the right-hand side and the costs −β. Row j is
// divided by Fⱼ (sizeWeights): its entries aᵢⱼ/Fⱼ are contact forces per
// newton of the element's force, dimensionless and near 1 whatever the
// element's size, and its right-hand side is 1. (Without it a row of
// tiny forces would be dwarfed by its own slack's 1 and solved only to
// the tolerance of that 1.) The multipliers are then −Fⱼsⱼ.
func (m *Model) sizeDual(a [][6]float64, e [][6]float64, minForce float64, used []int) (A, b, c []float64) {
	f := m.sizeWeights(used)
	nu, np := len(used), 6*len(e)
	A = make([]float64, nu*(np+nu))
	b = make([]float64, nu)
	c = make([]float64, np+nu)
	for jj := range used {
		b[jj] = 1
		A[nu*(np+jj)+jj] = 1
	}
	for k := range e {
		for i := range 6 {
			p := 6*k + i
			c[p] = -(minForce - e[k][i])
			for jj, j := range used {
				A[nu*p+jj] = a[j][i] / f[jj]
			}
		}
	}
	return A, b, c
}

// sizeWeights returns the weight Fⱼ of each element used in the total:
// the magnitude of its force, or 1 for a pure couple (its factor counts).
func (m *Model) sizeWeights(used []int) []float64 {
	f := make([]float64, len(used))
	for jj, j := range used {
		f[jj] = linalg.Norm3(m.preloads[j].w.F)
		if f[jj] == 0 {
			f[jj] = 1
		}
	}
	return f
}
