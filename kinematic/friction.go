package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Seating is whether the load case slides the moving body home into its
// seats against Coulomb friction of coefficient Mu.
type Seating struct {
	Mu       float64
	Contacts [6]SeatingContact

	// Seats reports whether the body seats from every slightly unseated
	// start (each contact open in turn); MaxMu is the largest coefficient
	// of friction at which it still does (0 when it does not seat even
	// without friction, because a contact carries no force).
	Seats bool
	MaxMu float64
}

// SeatingContact is the seating of the body when contact Label is the one
// still open.
type SeatingContact struct {
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

// Seating returns whether the load case (usually the preload with
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
// Seating returns an [*InputError] naming "mu" when it is negative or not
// finite, and the errors of [Model.Statics] without the Hertz ones.
func (m *Model) Seating(lc LoadCase, mu float64) (Seating, error) {
	if !m.exact {
		return Seating{}, m.errNotExact()
	}
	if math.IsNaN(mu) || math.IsInf(mu, 0) {
		return Seating{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: %g", ErrNonFinite, mu)}
	}
	if mu < 0 {
		return Seating{}, &InputError{Field: "mu", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, mu)}
	}
	w, err := m.wrench(&lc)
	if err != nil {
		return Seating{}, err
	}
	s := Seating{Mu: mu, Seats: true, MaxMu: math.Inf(1)}
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
			s.Seats = false
		}
		s.MaxMu = math.Min(s.MaxMu, sc.Limit)
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
