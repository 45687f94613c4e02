package kinematic

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Homing is whether the load case slides the moving body home into its
// seats against Coulomb friction of coefficient Mu.
type Homing struct {
	Mu       float64
	Contacts [6]HomingContact

	// Home reports whether the body slides home from every slightly
	// unseated start (each contact open in turn); MaxMu is the largest
	// coefficient of friction at which it still does (0 when it does not
	// even without friction, because a contact carries no force).
	Home  bool
	MaxMu float64
}

// HomingContact is the homing of the body when contact Label is the one
// still open.
type HomingContact struct {
	Label string

	// Drive is the force in N with which the loads, net of friction at
	// the other five contacts, push the body towards closing this
	// contact: positive when it closes. Without friction it is the
	// contact's rigid-statics force.
	Drive float64

	// Margin is Drive relative to its frictionless value: 1 without
	// friction, 0 where friction balances the drive.
	Margin float64

	// Limit is the largest coefficient of friction at which this contact
	// still closes (+Inf when friction cannot stop it, 0 when it is not
	// driven at all).
	Limit float64
}

// pivotTol is the pivot, relative to the largest entry of its column,
// below which drive treats its 6×6 matrix as singular: the columns are
// unit contact lines less μ times unit friction lines, entries of order 1,
// and a pivot of 1e-12 is within the rounding of elimination (ε times its
// growth) of a singular matrix.
const pivotTol = 1e-12

// muMax bounds the search for the friction limit: a coefficient of 10 is
// far above any dry metallic or ceramic pair (0.1 to 1, common practice).
const muMax = 10

// Homing returns whether the load case (usually the preload with
// gravity) slides the moving body into its seats against friction mu.
//
// The criterion, derived here: start with contact i slightly open and the
// other five closed. The only motion that keeps those five closed is the
// twist −Tᵢ (Tᵢ has power δᵢⱼ with contact j, so −Tᵢ closes contact i at
// unit speed and slides the other contact points tangentially with
// velocities vⱼ = −Tᵢ(pⱼ)). Quasi-static sliding along it needs, at each of
// the five, a normal force Nⱼ ≥ 0 with a friction force μNⱼ opposing vⱼ,
// and a net load along the motion: Σⱼ≠ᵢ Nⱼ (lⱼ − μ fⱼ) + ρ lᵢ + w = 0, where
// lⱼ is contact j's unit line of force, fⱼ the unit force along v̂ⱼ
// through pⱼ and w the load; the six equations fix the five Nⱼ and ρ. The
// body moves home if ρ > 0 (the loads and friction, without contact i,
// push it towards i) with every Nⱼ ≥ 0. Without friction ρ is contact i's
// rigid-statics force. For one block on an incline of slope β held by a
// stop, ρ = mg(sin β − μ cos β): it slides home when μ < tan β, the
// textbook condition (checked in the tests). A contact that does not
// slide (vⱼ = 0) is taken to carry no friction. The model is rigid and
// quasi-static: it ignores the Hertz compliance and micro-slip that let a
// real coupling creep the last fraction of a micrometre (the subject of
// the error budget), and the friction of the ball against a vee's two
// flanks is that of two independent contacts.
//
// Homing returns an [*InputError] naming "mu" when it is negative or not
// finite, or above 3 ([ErrRange]: a percentage; 15% is 0.15), and the errors of [Model.Statics] without the Hertz ones.
func (m *Model) Homing(lc LoadCase, mu float64) (Homing, error) {
	if err := m.check(); err != nil {
		return Homing{}, err
	}
	if !m.exact {
		return Homing{}, m.errNotExact()
	}
	if err := checkMuLow(mu, true); err != nil {
		return Homing{}, err
	}
	if err := checkMu(mu); err != nil {
		return Homing{}, err
	}
	w, err := m.wrench(&lc)
	if err != nil {
		return Homing{}, err
	}
	s := Homing{Mu: mu, Home: true, MaxMu: math.Inf(1)}
	for i := range s.Contacts {
		sc := &s.Contacts[i]
		sc.Label = labelOf(m.lines[i].label, i)
		rho0, _ := m.drive(i, w, 0)
		rho, ok := m.drive(i, w, mu)
		sc.Drive = rho
		if rho0 > 0 {
			sc.Margin = rho / rho0
		}
		if !(rho0 > 0) {
			sc.Limit = 0
		} else {
			sc.Limit = m.frictionLimit(i, w)
		}
		if !ok || !(rho > 0) {
			s.Home = false
		}
		s.MaxMu = math.Min(s.MaxMu, sc.Limit)
		if !allFinite(sc.Drive, sc.Margin) {
			return Homing{}, &InputError{Field: "lc", Err: fmt.Errorf("%w: the drive at contact %s overflows", ErrRange, sc.Label)}
		}
	}
	return s, nil
}

// drive returns ρ for contact i open under the load w (about origin) with
// friction mu, and whether every other normal force is ≥ 0.
func (m *Model) drive(i int, w screw.Wrench, mu float64) (float64, bool) {
	L := m.size
	if !(L > 0) {
		L = 1
	}
	t := m.freed[i].Scale(-1)
	var a [36]float64 // column-major: column j is the wrench of unknown j
	for j, l := range m.lines {
		g := scaledWrench(screw.Wrench{F: l.n, M: r3.Cross(l.p, l.n)}, L)
		if j != i && mu != 0 {
			if v, ok := linalg.Unit3(t.At(l.p)); ok {
				f := scaledWrench(screw.Wrench{F: v, M: r3.Cross(l.p, v)}, L)
				for r := range g {
					g[r] -= mu * f[r]
				}
			}
		}
		copy(a[6*j:6*j+6], g[:])
	}
	if !linalg.Inverse6(&a, pivotTol) {
		return math.Inf(-1), false
	}
	// x = −A⁻¹ w; A⁻¹ is row-major in the column-major storage's
	// transpose: entry (r, c) of the inverse is a[6*c+r].
	b := scaledWrench(w, L)
	var x [6]float64
	for r := range x {
		var v float64
		for c := range b {
			v -= a[6*c+r] * b[c]
		}
		x[r] = v
	}
	ok := true
	for j := range x {
		// Normal forces within rounding of zero count as zero.
		if j != i && x[j] < -1e-12*math.Sqrt(dot6(&b, &b)) {
			ok = false
		}
	}
	return x[i], ok
}

// frictionLimit returns the largest μ ≤ muMax at which contact i still
// closes: the first μ at which ρ reaches zero or a normal force turns
// negative, found by a scan of 100 steps refined by bisection to 1e-12
// (ρ is a ratio of polynomials in μ, continuous away from its poles).
func (m *Model) frictionLimit(i int, w screw.Wrench) float64 {
	good := func(mu float64) bool {
		r, ok := m.drive(i, w, mu)
		return ok && r > 0
	}
	const steps = 100
	lo := 0.0
	for k := 1; k <= steps; k++ {
		hi := muMax * float64(k) / steps
		if !good(hi) {
			for hi-lo > 1e-12*math.Max(1, hi) {
				mid := (lo + hi) / 2
				if good(mid) {
					lo = mid
				} else {
					hi = mid
				}
			}
			return lo
		}
		lo = hi
	}
	return math.Inf(1)
}

// Repeatability is an estimate of how well the same part comes back to
// the same place, limited by friction at the contacts.
type Repeatability struct {
	Point    r3.Vec
	Mu       float64
	Contacts []SlipContact

	// Worst and RSS combine the contacts' displacements of the point, m:
	// their sum (every contact's friction locked in its worst direction
	// at once) and their root sum of squares (independent directions).
	// WorstTilt and RSSTilt are the same for the rotation, rad.
	Worst, RSS         float64
	WorstTilt, RSSTilt float64
}

// SlipContact is one contact's share of the friction estimate.
type SlipContact struct {
	Label        string
	Friction     float64 // N: μ times the contact's normal force, the largest tangential force it holds without sliding
	Displacement float64 // m: the largest displacement of the point that this friction force can hold, in any tangent direction
	Tilt         float64 // rad: the same for the rotation
}

// Repeatability estimates how far friction can leave the moving body from
// its frictionless seat, at the point p, under the load case (usually the
// preload with gravity) with the coefficient of friction mu.
//
// The model: as the part seats, each contact's tangential (Mindlin)
// stiffness holds whatever tangential force is locked in when it stops
// sliding, up to μN (hertz.Contact.TangentialStiffness; Johnson 1985,
// §7.2). A locked-in force Q at contact i is a self-balanced load on the
// coupling, so the body sits displaced by the coupling's compliance
// (normal and tangential contact stiffness, [StiffnessOptions.Tangential])
// times the wrench of Q at the contact. For each contact the worst
// direction of Q in its tangent plane gives the largest displacement of p
// (the largest singular value of the 3×2 map from the direction), and the
// contacts combine as a sum (Worst) or a root sum of squares (RSS). This
// is an estimate of the scale of the non-repeatability, not a prediction
// of its value: real contacts settle with vibration and micro-slip, and
// their friction is rarely known to better than a factor of two.
// Published measurements of carefully made ball-and-groove couplings
// report repeatability better than 0.1 µm under 1.5 kN preload (Schouten,
// Rosielle & Schellekens 1997, "Design of a kinematic coupling for
// precision applications", Precision Engineering 20(1), with groove
// surfaces made to self-adjust to reduce the friction hysteresis), and
// couplings of ordinary quality around a micrometre.
//
// The result is the repeatability of the same part ("how well does it come
// back"); the spread of different parts made to the same drawing is
// interchangeability, [Assembly.Study]'s answer.
//
// Errors are those of [Model.Stiffness] and [Stiffness.Compliance], and an
// [*InputError] naming "mu" when it is not finite and positive, above 3
// (a percentage; 15% is 0.15), or so large that a friction force or a displacement overflows ([ErrRange]), or
// "p" when it is not finite or so far away that the compliance there
// overflows.
func (m *Model) Repeatability(lc LoadCase, mu float64, p r3.Vec) (Repeatability, error) {
	if err := m.check(); err != nil {
		return Repeatability{}, err
	}
	if err := checkMuLow(mu, false); err != nil {
		return Repeatability{}, err
	}
	if err := checkMu(mu); err != nil {
		return Repeatability{}, err
	}
	if !linalg.Finite3(p) {
		return Repeatability{}, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	st, err := m.Stiffness(lc, &StiffnessOptions{Tangential: true})
	if err != nil {
		return Repeatability{}, err
	}
	c, err := st.Compliance(p)
	if err != nil {
		var ie *InputError
		if errors.As(err, &ie) && ie.Field == "at" {
			return Repeatability{}, &InputError{Field: "p", Err: ie.Err}
		}
		return Repeatability{}, err
	}
	r := Repeatability{Point: p, Mu: mu, Contacts: make([]SlipContact, len(m.lines))}
	for i, l := range m.lines {
		sc := &r.Contacts[i]
		sc.Label = labelOf(l.label, i)
		q := mu * st.Forces[i]
		sc.Friction = q
		if q <= 0 {
			continue
		}
		arm := r3.Sub(r3.Add(l.p, m.origin), p)
		t1 := linalg.AnyNormal(l.n)
		t2 := r3.Cross(l.n, t1)
		var dv, dw [2]r3.Vec
		for k, t := range [2]r3.Vec{t1, t2} {
			f := r3.Scale(q, t)
			w := [6]float64{f.X, f.Y, f.Z}
			mo := r3.Cross(arm, f)
			w[3], w[4], w[5] = mo.X, mo.Y, mo.Z
			var x [6]float64
			for a := range 6 {
				for b := range 6 {
					x[a] += c.Matrix[a][b] * w[b]
				}
			}
			dv[k] = r3.Vec{X: x[0], Y: x[1], Z: x[2]}
			dw[k] = r3.Vec{X: x[3], Y: x[4], Z: x[5]}
		}
		sc.Displacement, sc.Tilt = maxSingular2(dv), maxSingular2(dw)
		r.Worst += sc.Displacement
		r.RSS += sc.Displacement * sc.Displacement
		r.WorstTilt += sc.Tilt
		r.RSSTilt += sc.Tilt * sc.Tilt
	}
	r.RSS, r.RSSTilt = math.Sqrt(r.RSS), math.Sqrt(r.RSSTilt)
	ok := allFinite(r.Worst, r.RSS, r.WorstTilt, r.RSSTilt)
	for _, sc := range r.Contacts {
		ok = ok && allFinite(sc.Friction, sc.Displacement, sc.Tilt)
	}
	if !ok {
		return Repeatability{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: the friction forces or their displacements overflow with μ = %g", ErrRange, mu)}
	}
	return r, nil
}

// maxSingular2 returns the largest singular value of the 3×2 matrix with
// columns a[0], a[1]: max |cos φ a₀ + sin φ a₁| over φ, the root of the
// larger eigenvalue of the 2×2 Gram matrix, (p + q)/2 + √(((p − q)/2)² + r²)
// for p = |a₀|², q = |a₁|², r = a₀·a₁.
func maxSingular2(a [2]r3.Vec) float64 {
	p, q, r := r3.Norm2(a[0]), r3.Norm2(a[1]), r3.Dot(a[0], a[1])
	return math.Sqrt((p+q)/2 + math.Hypot((p-q)/2, r))
}
