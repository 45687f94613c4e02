package kinematic

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// RandomOptions holds the options of [Model.Random]; the zero value and a
// nil pointer mean defaults.
type RandomOptions struct {
	// Damping is the modal viscous damping ratio ζ: one value for every
	// mode, or six, one per mode from the lowest. Empty means 0.02
	// (Q = 25), common practice for bolted and contact-dominated
	// assemblies when nothing is measured. Each ζ must lie in (0, 1).
	Damping []float64

	// Q is the amplification factor Q = 1/(2ζ) in place of Damping: one
	// value or six; each must exceed 0.5. Give Damping or Q, not both.
	Q []float64

	// Direction is the direction of the base acceleration; zero means +Z.
	// It need not be unit.
	Direction r3.Vec

	// Duration is the time of the test (or the transport) in s; zero
	// means 120 s, the qualification time per axis of common practice.
	Duration float64

	// Sigma is the k of the k-σ peaks and of the preload for a margin;
	// zero means 3.
	Sigma float64

	// Point is the point of interest on the payload, m, in the global
	// frame (the zero value is the global origin).
	Point r3.Vec
}

// Amplitude is an RMS level and its k-σ peak, in the unit of the
// quantity (m/s² for an acceleration).
type Amplitude struct {
	RMS  float64
	Peak float64 // k·RMS, k = RandomOptions.Sigma
}

// RandomContact is the response of one contact to random vibration.
type RandomContact struct {
	Label string

	// Static is the contact force under the load case (preload and
	// gravity), N.
	Static float64

	// Dynamic is the RMS of the force's fluctuation about Static, N: the
	// normal stiffness times the RMS relative normal displacement.
	Dynamic float64

	// Margin is Static/Dynamic: the number of standard deviations at
	// which the contact opens (its force reaches zero).
	Margin float64

	// Rate is the mean rate of zero down-crossings of the force in 1/s
	// (Rice): (1/2π)(σ_ḟ/σ_f)·exp(−Static²/(2σ_f²)).
	Rate float64

	// Openings is the expected number of openings in the test, Rate·T.
	Openings float64

	// Probability is the probability that the contact opens at least
	// once during the test, 1 − exp(−Openings) (openings as a Poisson
	// process).
	Probability float64
}

// Random is the response of the payload on the coupling to a stationary
// Gaussian base acceleration with a given spectrum along one direction.
type Random struct {
	Direction r3.Vec     // unit
	Modes     [6]float64 // natural frequencies, Hz, lowest first
	Damping   [6]float64 // ζ of each mode

	// EffectiveMass holds each mode's effective mass along X, Y and Z in
	// kg: Γ² with Γ = φᵀ M r the participation of the mass-normalised
	// mode φ for a unit base translation r. Over the six modes they sum
	// to the payload's mass along each axis.
	EffectiveMass [6]r3.Vec

	// Input is the spectrum's overall level in m/s² RMS.
	Input float64

	// Centre and Point are the absolute acceleration (what an
	// accelerometer on the payload reads) of the centre of mass and of the
	// point of interest in m/s²: the RMS of the vector's magnitude.
	Centre, Point Amplitude

	// Displacement is the RMS magnitude of the point's displacement
	// relative to the base, m; Tilt the RMS magnitude of the payload's
	// rotation relative to the base, rad.
	Displacement, Tilt Amplitude

	Contacts []RandomContact

	// Least is the index in Contacts of the least margin.
	Least int
}

// randomGrid is the number of log-spaced subintervals per decade of the
// quadrature, besides those refined around each mode.
const randomGrid = 12

// modeSteps are the ends of the subintervals around a mode at f_r, in
// half-power bandwidths ζ_r f_r on either side.
var modeSteps = [...]float64{0.5, 1, 2, 3, 5, 8, 13, 25}

// gauss4 holds the nodes and weights of 4-point Gauss–Legendre on [−1, 1]
// (Abramowitz & Stegun, Table 25.4).
var gauss4 = [2][4]float64{
	{-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526},
	{0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538},
}

// randomModel is what the response needs of the model: the modes in
// coordinates (translation of the centre of mass, rotation), mass
// normalised, and the integrals of the spectrum against the modal
// transfer functions.
type randomModel struct {
	st    Stiffness
	omega [6]float64
	zeta  [6]float64
	v, w  [6]r3.Vec   // mass-normalised mode shapes: translation of the centre, rotation
	g     [6]r3.Vec   // Γ_r(u) = g_r · u
	i0    [36]float64 // ∫ S Re(h_r h_s*) df, with S in (m/s²)²/Hz
	i2    [36]float64 // ∫ S ω² Re(h_r h_s*) df
	ia    [36]float64 // ∫ S Re(e_r e_s*) df, e_r = (ω_r² + 2iζ_rω_rω) h_r
	input float64     // ∫ S df, (m/s²)²
	cg    r3.Vec      // the centre of mass, global
}

// dampingOf returns the six damping ratios from the options.
func dampingOf(o *RandomOptions) ([6]float64, error) {
	var z [6]float64
	if len(o.Damping) > 0 && len(o.Q) > 0 {
		return z, &InputError{Field: "opt.Q", Other: "opt.Damping", Err: fmt.Errorf("%w: give the damping as ζ or as Q, not both", ErrRange)}
	}
	vals, field := o.Damping, "opt.Damping"
	if len(o.Q) > 0 {
		vals, field = o.Q, "opt.Q"
	}
	if len(vals) == 0 {
		for r := range z {
			z[r] = 0.02
		}
		return z, nil
	}
	if len(vals) != 1 && len(vals) != 6 {
		return z, &InputError{Field: field, Err: fmt.Errorf("%w: one value or six (one per mode), got %d", ErrRange, len(vals))}
	}
	for r := range z {
		i := r
		if len(vals) == 1 {
			i = 0
		}
		x := vals[i]
		f := indexed(field, i)
		switch {
		case !allFinite(x):
			return z, &InputError{Field: f, Err: fmt.Errorf("%w: %g", ErrNonFinite, x)}
		case field == "opt.Q" && !(x > 0.5):
			return z, &InputError{Field: f, Err: fmt.Errorf("%w: Q = %g: an oscillating mode needs Q > 0.5 (ζ < 1)", ErrRange, x)}
		case field == "opt.Damping" && !(x > 0 && x < 1):
			return z, &InputError{Field: f, Err: fmt.Errorf("%w: ζ = %g: a damping ratio lies in (0, 1)", ErrRange, x)}
		}
		if field == "opt.Q" {
			x = 1 / (2 * x)
		}
		z[r] = x
	}
	return z, nil
}

// prepareRandom builds the modal model at the load case and integrates
// the spectrum against the modal transfer functions.
func (m *Model) prepareRandom(lc LoadCase, sp *spectrum, zeta [6]float64) (randomModel, error) {
	rm, err := m.modalRandom(lc, zeta)
	if err != nil {
		return rm, err
	}
	rm.integrate(sp)
	return rm, nil
}

// modalRandom builds the modal model at the load case: the stiffness,
// the mass-normalised modes and their participation vectors.
func (m *Model) modalRandom(lc LoadCase, zeta [6]float64) (randomModel, error) {
	var rm randomModel
	st, err := m.Stiffness(lc, nil)
	if err != nil {
		return rm, err
	}
	modes, err := st.Modes()
	if err != nil {
		return rm, err
	}
	rm.st, rm.zeta = st, zeta
	p := m.payload
	rm.cg = r3.Add(p.Centre, m.origin)
	for r, md := range modes {
		v := md.Shape.At(rm.cg)
		w := md.Shape.W
		jw := r3.Vec{
			X: p.Inertia[0][0]*w.X + p.Inertia[0][1]*w.Y + p.Inertia[0][2]*w.Z,
			Y: p.Inertia[1][0]*w.X + p.Inertia[1][1]*w.Y + p.Inertia[1][2]*w.Z,
			Z: p.Inertia[2][0]*w.X + p.Inertia[2][1]*w.Y + p.Inertia[2][2]*w.Z,
		}
		mu := p.Mass*r3.Dot(v, v) + r3.Dot(w, jw)
		s := 1 / math.Sqrt(mu)
		rm.v[r], rm.w[r] = r3.Scale(s, v), r3.Scale(s, w)
		rm.g[r] = r3.Scale(p.Mass, rm.v[r])
		rm.omega[r] = 2 * math.Pi * md.Frequency
	}
	return rm, nil
}

// integrate fills i0, i2, ia and input by Gauss–Legendre quadrature (4
// points) on subintervals of the band whose ends are the breakpoints,
// randomGrid log-spaced points per decade and, around each mode, the
// points f_r ± t·ζ_r f_r for t in modeSteps, so that the half-power
// band of every mode spans four subintervals. Ends closer than a
// relative 1e-9 (those of repeated modes) are merged.
func (rm *randomModel) integrate(sp *spectrum) {
	lo, hi := sp.f[0], sp.f[len(sp.f)-1]
	ends := make([]float64, 0, 64+len(sp.f)+6*(2*len(modeSteps)+1))
	ends = append(ends, sp.f...)
	dec := math.Log10(hi / lo)
	nlog := int(math.Ceil(dec * randomGrid))
	for i := 1; i < nlog; i++ {
		ends = append(ends, lo*math.Pow(hi/lo, float64(i)/float64(nlog)))
	}
	add := func(f float64) {
		if f > lo && f < hi {
			ends = append(ends, f)
		}
	}
	for r := range 6 {
		fr := rm.omega[r] / (2 * math.Pi)
		b := rm.zeta[r] * fr
		add(fr)
		for _, t := range modeSteps {
			add(fr - t*b)
			add(fr + t*b)
		}
	}
	sort.Float64s(ends)
	g2 := StandardGravity * StandardGravity
	var hre, him, ere, eim [6]float64
	prev := ends[0]
	for _, b := range ends[1:] {
		a := prev
		if !(b > a*(1+1e-9)) { // ends of repeated modes coincide
			continue
		}
		prev = b
		c, d := (a+b)/2, (b-a)/2
		seg := sort.SearchFloat64s(sp.f, c) - 1 // the segment holding the subinterval
		as, fs, ns := sp.a[seg]*g2, sp.f[seg], sp.n[seg]
		for j := range 4 {
			f := c + d*gauss4[0][j]
			level := as
			if ns != 0 { // a flat segment needs no power
				level = as * math.Exp(ns*math.Log(f/fs))
			}
			wt := d * gauss4[1][j] * level
			if wt == 0 {
				continue
			}
			om := 2 * math.Pi * f
			om2 := om * om
			for r := range 6 {
				or := rm.omega[r]
				// h = 1/(x + iy) = (x − iy)/(x² + y²); e = (ω_r² + iy)·h.
				x, y := or*or-om2, 2*rm.zeta[r]*or*om
				inv := 1 / (x*x + y*y)
				hre[r], him[r] = x*inv, -y*inv
				ere[r], eim[r] = or*or*hre[r]-y*him[r], or*or*him[r]+y*hre[r]
			}
			rm.input += wt
			for r := range 6 {
				hr, hi, er, ei := wt*hre[r], wt*him[r], wt*ere[r], wt*eim[r]
				for s := r; s < 6; s++ {
					hh := hr*hre[s] + hi*him[s]
					rm.i0[6*r+s] += hh
					rm.i2[6*r+s] += om2 * hh
					rm.ia[6*r+s] += er*ere[s] + ei*eim[s]
				}
			}
		}
	}
	for r := range 6 {
		for s := range r {
			rm.i0[6*r+s], rm.i2[6*r+s], rm.ia[6*r+s] = rm.i0[6*s+r], rm.i2[6*s+r], rm.ia[6*s+r]
		}
	}
}

// covariance returns the 3×3 matrix C of a scalar response y = Σ c_r q_r
// per direction: var(y) = uᵀ C u for a unit base acceleration direction
// u, with q_r = −Γ_r h_r A, Γ_r = g_r·u and I the modal integrals.
func (rm *randomModel) covariance(c *[6]float64, I *[36]float64) [9]float64 {
	var cv [9]float64
	var a [6]r3.Vec // c_r g_r
	for r := range 6 {
		a[r] = r3.Scale(c[r], rm.g[r])
	}
	for r := range 6 {
		for s := range 6 {
			x := I[6*r+s]
			if x == 0 {
				continue
			}
			ar, as := [3]float64{a[r].X, a[r].Y, a[r].Z}, [3]float64{a[s].X, a[s].Y, a[s].Z}
			for i := range 3 {
				for j := range 3 {
					cv[3*i+j] += x * ar[i] * as[j]
				}
			}
		}
	}
	return cv
}

// variance returns var(Σ c_r q_r) along u.
func (rm *randomModel) variance(c [6]float64, I *[36]float64, u r3.Vec) float64 {
	var s float64
	for r := range 6 {
		gr := c[r] * r3.Dot(rm.g[r], u)
		if gr == 0 {
			continue
		}
		for q := range 6 {
			s += gr * c[q] * r3.Dot(rm.g[q], u) * I[6*r+q]
		}
	}
	return math.Max(s, 0)
}

// vectorVariance returns the summed variance of the three components of a
// vector response Σ x_r q_r.
func (rm *randomModel) vectorVariance(x *[6]r3.Vec, I *[36]float64, u r3.Vec) float64 {
	var s float64
	for _, comp := range [3]func(r3.Vec) float64{func(v r3.Vec) float64 { return v.X }, func(v r3.Vec) float64 { return v.Y }, func(v r3.Vec) float64 { return v.Z }} {
		var c [6]float64
		for r := range 6 {
			c[r] = comp(x[r])
		}
		s += rm.variance(c, I, u)
	}
	return s
}

// contactCoefficients returns c_ir: the relative normal displacement of
// contact i per unit modal coordinate r.
func (m *Model) contactCoefficients(rm *randomModel, i int) [6]float64 {
	l := &m.lines[i]
	arm := r3.Sub(r3.Add(l.p, m.origin), rm.cg)
	var c [6]float64
	for r := range 6 {
		c[r] = r3.Dot(l.n, r3.Add(rm.v[r], r3.Cross(rm.w[r], arm)))
	}
	return c
}

// Random returns the response of the payload on the coupling to a
// stationary Gaussian base acceleration of spectrum s (g²/Hz) along
// opt.Direction, in linear theory about the load case lc: the 6×6
// stiffness of [Model.Stiffness] at lc (normal contact stiffness only:
// tangential stiffness is neglected, the contacts being free to slip),
// the payload's rigid-body mass matrix, and viscous modal damping
// C = M Φ diag(2ζ_r ω_r) Φᵀ M with Φ the mass-normalised modes of
// [Stiffness.Modes]. All six modes and the cross terms between them
// enter: the response spectra are integrated by quadrature of the modal
// transfer functions over the band (see the package doc, "Random
// vibration", for the grid and its accuracy), so that close modes are
// right and the answer does not depend on the eigenvectors chosen for a
// repeated frequency with one damping ratio.
//
// Errors are those of [Model.Stiffness] and [Stiffness.Modes], those of
// [Spectrum.GRMS] with the field prefixed "s." ("s.Points[2].Frequency"),
// and [*InputError]s naming the option ("opt.Damping[3]", "opt.Q",
// "opt.Direction", "opt.Duration", "opt.Sigma", "opt.Point"), and one
// naming "s" wrapping [ErrRange] when the response overflows.
func (m *Model) Random(lc LoadCase, s Spectrum, opt *RandomOptions) (Random, error) {
	if err := m.check(); err != nil {
		return Random{}, err
	}
	var o RandomOptions
	if opt != nil {
		o = *opt
	}
	sp, err := s.prepare()
	if err != nil {
		return Random{}, renamed(err, rename{"Points", "s.Points"})
	}
	zeta, err := dampingOf(&o)
	if err != nil {
		return Random{}, err
	}
	u, T, k, err := randomInputs(&o)
	if err != nil {
		return Random{}, err
	}
	rm, err := m.prepareRandom(lc, &sp, zeta)
	if err != nil {
		return Random{}, err
	}
	return finiteRandom(m.respond(&rm, u, T, k, o.Point))
}

// finiteRandom returns r, or an error naming the spectrum when a figure
// leaves the floating-point range (a level of 1e300 g²/Hz).
func finiteRandom(r Random) (Random, error) {
	ok := allFinite(r.Input, r.Centre.RMS, r.Point.RMS, r.Displacement.RMS, r.Tilt.RMS)
	for _, c := range r.Contacts {
		ok = ok && allFinite(c.Dynamic, c.Rate, c.Openings) && !math.IsNaN(c.Margin)
	}
	if !ok {
		return Random{}, &InputError{Field: "s", Err: fmt.Errorf("%w: the response overflows", ErrRange)}
	}
	return r, nil
}

// randomInputs validates and defaults the direction, duration and k.
func randomInputs(o *RandomOptions) (u r3.Vec, T, k float64, err error) {
	u = r3.Vec{Z: 1}
	if o.Direction != (r3.Vec{}) {
		if u, err = unitOf(o.Direction, "opt.Direction"); err != nil {
			return
		}
	}
	T, k = 120, 3
	switch {
	case !allFinite(o.Duration):
		err = &InputError{Field: "opt.Duration", Err: fmt.Errorf("%w: %g s", ErrNonFinite, o.Duration)}
	case o.Duration < 0:
		err = &InputError{Field: "opt.Duration", Err: fmt.Errorf("%w: %g s: a duration is not negative", ErrRange, o.Duration)}
	case !allFinite(o.Sigma):
		err = &InputError{Field: "opt.Sigma", Err: fmt.Errorf("%w: %g", ErrNonFinite, o.Sigma)}
	case o.Sigma < 0:
		err = &InputError{Field: "opt.Sigma", Err: fmt.Errorf("%w: k = %g: a number of standard deviations is not negative", ErrRange, o.Sigma)}
	case !linalg.Finite3(o.Point):
		err = &InputError{Field: "opt.Point", Err: fmt.Errorf("%w: %v", ErrNonFinite, o.Point)}
	}
	if o.Duration > 0 {
		T = o.Duration
	}
	if o.Sigma > 0 {
		k = o.Sigma
	}
	return
}

// respond evaluates the response along the unit direction u.
func (m *Model) respond(rm *randomModel, u r3.Vec, T, k float64, point r3.Vec) Random {
	res := Random{Direction: u, Damping: rm.zeta, Input: math.Sqrt(rm.input)}
	for r := range 6 {
		res.Modes[r] = rm.omega[r] / (2 * math.Pi)
		gr := rm.g[r]
		res.EffectiveMass[r] = r3.Vec{X: gr.X * gr.X, Y: gr.Y * gr.Y, Z: gr.Z * gr.Z}
	}
	arm := r3.Sub(point, rm.cg)
	var at [6]r3.Vec
	for r := range 6 {
		at[r] = r3.Add(rm.v[r], r3.Cross(rm.w[r], arm))
	}
	amp := func(v2 float64) Amplitude { s := math.Sqrt(v2); return Amplitude{RMS: s, Peak: k * s} }
	res.Centre = amp(rm.vectorVariance(&rm.v, &rm.ia, u))
	res.Point = amp(rm.vectorVariance(&at, &rm.ia, u))
	res.Displacement = amp(rm.vectorVariance(&at, &rm.i0, u))
	res.Tilt = amp(rm.vectorVariance(&rm.w, &rm.i0, u))
	res.Contacts = make([]RandomContact, len(m.lines))
	least := math.Inf(1)
	for i := range m.lines {
		kn := rm.st.Normal[i]
		c := m.contactCoefficients(rm, i)
		sf := kn * math.Sqrt(rm.variance(c, &rm.i0, u))
		sd := kn * math.Sqrt(rm.variance(c, &rm.i2, u))
		res.Contacts[i] = contactResponse(labelOf(m.lines[i].label, i), rm.st.Forces[i], sf, sd, T)
		if res.Contacts[i].Margin < least {
			least, res.Least = res.Contacts[i].Margin, i
		}
	}
	return res
}

// contactResponse returns the figures of one contact from its static
// force F, the RMS sf of its dynamic force and the RMS sd of its rate, in
// a test of T seconds: Rice's down-crossing rate of the level −F by the
// fluctuation, ν = (1/2π)(sd/sf)·exp(−F²/(2 sf²)) (S. O. Rice,
// "Mathematical analysis of random noise", Bell System Technical Journal
// 23 (1944) and 24 (1945)).
func contactResponse(label string, F, sf, sd, T float64) RandomContact {
	c := RandomContact{Label: label, Static: F, Dynamic: sf, Margin: math.Inf(1)}
	if sf > 0 {
		c.Margin = F / sf
		c.Rate = sd / sf / (2 * math.Pi) * math.Exp(-c.Margin*c.Margin/2)
		c.Openings = c.Rate * T
		c.Probability = -math.Expm1(-c.Openings)
	}
	return c
}

// RandomWorst returns the response along the worst direction of base
// acceleration over the sphere: the one that gives the least contact
// margin, with opt.Direction ignored. The variance of contact i's force
// is a quadratic form in the unit direction u, σᵢ²(u) = uᵀ Cᵢ u with Cᵢ
// the 3×3 matrix Σ_rs c_ir c_is I_rs g_r g_sᵀ (the modal integrals I and
// participation vectors g of [Model.Random]), while its static force Fᵢ
// does not depend on u; so the least margin of contact i, Fᵢ/σᵢ, is
// Fᵢ/√λmax(Cᵢ) along the eigenvector of the largest eigenvalue, and the
// worst direction is that of the contact whose least margin is smallest.
// The direction's sign is immaterial; the one returned has its largest
// component positive. Errors are those of [Model.Random].
func (m *Model) RandomWorst(lc LoadCase, s Spectrum, opt *RandomOptions) (Random, error) {
	if err := m.check(); err != nil {
		return Random{}, err
	}
	var o RandomOptions
	if opt != nil {
		o = *opt
	}
	sp, err := s.prepare()
	if err != nil {
		return Random{}, renamed(err, rename{"Points", "s.Points"})
	}
	zeta, err := dampingOf(&o)
	if err != nil {
		return Random{}, err
	}
	_, T, k, err := randomInputs(&o)
	if err != nil {
		return Random{}, err
	}
	rm, err := m.prepareRandom(lc, &sp, zeta)
	if err != nil {
		return Random{}, err
	}
	best, dir := math.Inf(1), r3.Vec{Z: 1}
	for i := range m.lines {
		c := m.contactCoefficients(&rm, i)
		cv := rm.covariance(&c, &rm.i0)
		a := cv
		var v [9]float64
		var sig [3]float64
		linalg.Jacobi(a[:], 3, 3, v[:])
		linalg.SortColumns(a[:], 3, 3, v[:], sig[:])
		if !(sig[0] > 0) {
			continue
		}
		margin := rm.st.Forces[i] / (rm.st.Normal[i] * math.Sqrt(sig[0]))
		if margin < best {
			best, dir = margin, r3.Vec{X: v[0], Y: v[1], Z: v[2]}
		}
	}
	dir = r3.Scale(signOf3(dir), r3.Unit(dir))
	return finiteRandom(m.respond(&rm, dir, T, k, o.Point))
}

// signOf3 returns the sign that makes the largest component of v positive.
func signOf3(v r3.Vec) float64 {
	best, sgn := 0.0, 1.0
	for _, x := range [3]float64{v.X, v.Y, v.Z} {
		if math.Abs(x) > best {
			best, sgn = math.Abs(x), math.Copysign(1, x)
		}
	}
	return sgn
}

// RandomPreload is the factor on the preload elements that gives every
// contact a margin of k standard deviations in random vibration.
type RandomPreload struct {
	// FirstOrder is the factor with every contact's stiffness, and so
	// every RMS dynamic force, held at its value in the load case given:
	// the static forces are linear in the factor, Fᵢ(φ) = Gᵢ + φ Pᵢ, and
	// φ = maxᵢ (k σᵢ − Gᵢ)/Pᵢ.
	FirstOrder float64

	// Hertz is the factor with every contact stiffness following Hertz
	// (k ∝ F^(1/3)) at the forces of that factor, so that the modes and
	// dynamic forces move with it: the root of min_i Fᵢ/σᵢ = k, bracketed
	// from FirstOrder and found by bisection on log φ to a relative 1e-6.
	Hertz float64

	// Margin is the least margin at the load case given.
	Margin float64
}

// RandomPreload returns the factor on the preload elements (the load
// case's PreloadFactor; gravity and the other loads unchanged) that gives
// every contact a margin of opt.Sigma standard deviations along
// opt.Direction, to first order and with Hertz stiffness solved exactly.
// The split of each static force into its part from the preload elements
// and the rest comes from the forces at the case's factor and at twice it
// (exact under rigid statics, where forces are linear in the loads; a
// secant for a model that is not exactly constrained).
//
// Errors are those of [Model.Random]; an [*InputError] naming "lc.NoPreload"
// when the preload is off or "lc.PreloadFactor" when it is reversed, and one wrapping [ErrRange] naming "preloads"
// when a contact's margin cannot reach k because the preload does not
// press it (or no factor up to 1e6 times the given one does).
func (m *Model) RandomPreload(lc LoadCase, s Spectrum, opt *RandomOptions) (RandomPreload, error) {
	if lc.NoPreload {
		return RandomPreload{}, &InputError{Field: "lc.NoPreload", Err: fmt.Errorf("%w: the preload is switched off, so no factor on it helps", ErrRange)}
	}
	if lc.PreloadFactor < 0 {
		return RandomPreload{}, &InputError{Field: "lc.PreloadFactor", Err: fmt.Errorf("%w: %g: a reversed preload cannot be scaled up to seat the contacts", ErrRange, lc.PreloadFactor)}
	}
	var o RandomOptions
	if opt != nil {
		o = *opt
	}
	r0, err := m.Random(lc, s, opt)
	if err != nil {
		return RandomPreload{}, err
	}
	k := o.Sigma
	if k == 0 {
		k = 3
	}
	phi0 := lc.factor()
	lc2 := lc
	lc2.PreloadFactor = 2 * phi0
	st2, err := m.Stiffness(lc2, nil)
	if err != nil {
		return RandomPreload{}, err
	}
	res := RandomPreload{Margin: r0.Contacts[r0.Least].Margin, FirstOrder: math.Inf(-1)}
	for i, c := range r0.Contacts {
		P := (st2.Forces[i] - c.Static) / phi0
		G := c.Static - phi0*P
		if !(P > 0) {
			if G < k*c.Dynamic {
				return RandomPreload{}, &InputError{Field: "preloads", Err: fmt.Errorf("%w: the preload does not press contact %s, whose margin %.3g stays below %g", ErrRange, c.Label, c.Margin, k)}
			}
			continue
		}
		res.FirstOrder = math.Max(res.FirstOrder, (k*c.Dynamic-G)/P)
	}
	// Hertz: margin(φ) − k, increasing in φ (the static forces grow as φ,
	// the dynamic ones about as φ^(1/6)).
	g := func(phi float64) (float64, error) {
		l := lc
		l.PreloadFactor = phi
		r, err := m.Random(l, s, opt)
		if err != nil {
			return 0, err
		}
		return r.Contacts[r.Least].Margin - k, nil
	}
	lo, hi := phi0, math.Max(res.FirstOrder, phi0)
	glo := res.Margin - k
	for glo > 0 && lo > phi0*1e-6 {
		hi, lo = lo, lo/2
		if glo, err = g(lo); err != nil {
			glo = -1 // too little preload to seat the contacts: below the root
		}
	}
	ghi, err := g(hi)
	if err != nil {
		return RandomPreload{}, err
	}
	for ghi < 0 {
		if hi > phi0*1e6 {
			return RandomPreload{}, &InputError{Field: "preloads", Err: fmt.Errorf("%w: no factor up to %g gives a margin of %g", ErrRange, hi, k)}
		}
		lo, hi = hi, 2*hi
		if ghi, err = g(hi); err != nil {
			return RandomPreload{}, err
		}
	}
	for hi-lo > 1e-6*hi {
		mid := math.Sqrt(lo * hi)
		gm, err := g(mid)
		if err != nil {
			lo = mid
			continue
		}
		if gm < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	res.Hertz = hi
	return res, nil
}

// RandomDensity is the power spectral density of the response at the
// point of interest at one frequency, as [Model.RandomDensity] gives it.
type RandomDensity struct {
	Frequency float64 // Hz

	// Input is the density of the base acceleration, (m/s²)²/Hz: the
	// spectrum's level in g²/Hz times [StandardGravity]², zero outside
	// its band.
	Input float64

	// Acceleration is the density of the point's absolute acceleration,
	// (m/s²)²/Hz, summed over its three components: its integral over
	// the band is the square of [Random] Point.RMS.
	Acceleration float64

	// Displacement is the density of the point's displacement relative
	// to the base, m²/Hz, summed over its three components: its integral
	// is the square of [Random] Displacement.RMS.
	Displacement float64
}

// RandomDensity returns the power spectral densities of the base
// acceleration and of the response at the point of interest opt.Point
// at each frequency of f (Hz), for the base acceleration of spectrum s
// along opt.Direction, in the model of [Model.Random] (the same modes,
// damping and conventions): with Γ_r the participation of mode r along
// the direction, h_r its transfer function and e_r = (ω_r² + 2iζ_r ω_r ω) h_r,
// the displacement's density is S(f)·Σ_xyz |Σ_r x_r Γ_r h_r|² and the
// acceleration's S(f)·Σ_xyz |Σ_r x_r Γ_r e_r|², x_r the point's motion in
// mode r, cross terms between modes included. It is what a plot of the
// response beside the spectrum needs; the RMS figures come from
// [Model.Random], which integrates these densities with a quadrature
// refined about each mode.
//
// Errors are those of [Model.Random], and an [*InputError] naming "f[i]"
// for a frequency that is negative or not finite.
func (m *Model) RandomDensity(lc LoadCase, s Spectrum, opt *RandomOptions, f []float64) ([]RandomDensity, error) {
	if err := m.check(); err != nil {
		return nil, err
	}
	var o RandomOptions
	if opt != nil {
		o = *opt
	}
	sp, err := s.prepare()
	if err != nil {
		return nil, renamed(err, rename{"Points", "s.Points"})
	}
	zeta, err := dampingOf(&o)
	if err != nil {
		return nil, err
	}
	u, _, _, err := randomInputs(&o)
	if err != nil {
		return nil, err
	}
	for i, x := range f {
		switch {
		case !allFinite(x):
			return nil, &InputError{Field: indexed("f", i), Err: fmt.Errorf("%w: %g Hz", ErrNonFinite, x)}
		case x < 0:
			return nil, &InputError{Field: indexed("f", i), Err: fmt.Errorf("%w: %g Hz: a frequency is not negative", ErrRange, x)}
		}
	}
	rm, err := m.modalRandom(lc, zeta)
	if err != nil {
		return nil, err
	}
	arm := r3.Sub(o.Point, rm.cg)
	var at [6]r3.Vec // the point's motion in mode r times Γ_r
	for r := range 6 {
		at[r] = r3.Scale(r3.Dot(rm.g[r], u), r3.Add(rm.v[r], r3.Cross(rm.w[r], arm)))
	}
	g2 := StandardGravity * StandardGravity
	out := make([]RandomDensity, len(f))
	for i, fi := range f {
		d := RandomDensity{Frequency: fi, Input: sp.at(fi) * g2}
		om := 2 * math.Pi * fi
		var dre, dim, are, aim r3.Vec
		for r := range 6 {
			or := rm.omega[r]
			// h = 1/(x + iy) = (x − iy)/(x² + y²); e = (ω_r² + iy)·h.
			x, y := or*or-om*om, 2*rm.zeta[r]*or*om
			inv := 1 / (x*x + y*y)
			hre, him := x*inv, -y*inv
			ere, eim := or*or*hre-y*him, or*or*him+y*hre
			dre, dim = r3.Add(dre, r3.Scale(hre, at[r])), r3.Add(dim, r3.Scale(him, at[r]))
			are, aim = r3.Add(are, r3.Scale(ere, at[r])), r3.Add(aim, r3.Scale(eim, at[r]))
		}
		d.Displacement = d.Input * (r3.Dot(dre, dre) + r3.Dot(dim, dim))
		d.Acceleration = d.Input * (r3.Dot(are, are) + r3.Dot(aim, aim))
		if !allFinite(d.Input, d.Displacement, d.Acceleration) {
			return nil, &InputError{Field: "s", Err: fmt.Errorf("%w: the response density at %g Hz overflows", ErrRange, fi)}
		}
		out[i] = d
	}
	return out, nil
}
