package kinematic

import (
	"fmt"
	"math"
)

// ForceLaw is the force of a gap-dependent preload element as a function
// of its gap: a table of measured forces ([*ForceTable]), two facing
// permanent magnets ([MagnetPair]) or a magnet attracting a steel plate
// ([MagnetPlate]). The set of laws is closed (the interface is sealed).
//
// The gap is a length in m, ≥ 0, that grows as the moving body lifts off
// its seats, that is as it moves against the element's Direction: the
// clearance between a magnet's pole face and what it faces, or for a
// spring any coordinate that grows as the part lifts. The force is the
// magnitude of the element's push or pull along Direction, in N, ≥ 0
// (a magnet's attraction). A magnet's force falls as the gap grows: its
// slope dF/dgap is negative, a negative spring along the line.
type ForceLaw interface {
	// Force returns the force in N at the gap in m and its slope dF/dgap
	// in N/m. The force is ≥ 0 except for a magnet pair offset so far
	// that it repels. It returns an [*InputError] naming the law's own field
	// ("Points[2].Gap", "Moving.Size[0]") when the law is invalid, and one
	// naming "gap" for a negative or non-finite gap.
	Force(gap float64) (force, slope float64, err error)

	// check validates the law; its errors name the law's fields.
	check() error
	// reach is a gap in m beyond which the law's force no longer changes
	// appreciably (the table's last gap; ten magnet sizes).
	reach() float64
}

// Remanence of common magnet grades, in T: the remanent flux density Br
// at 20 °C, the middle of the grade's range in a manufacturer's table. The
// grades follow the maximum energy product in MGOe (N42: 42 MGOe); IEC
// 60404-8-1 gives minimum values by its own designations. Sources: NdFeB
// from Shanghai Magnet, "NdFeB Performance Parameter Table"
// (en.shanghaimagnet.com, read 2026-12): N42 1.28–1.32 T, N52 1.42–1.46 T;
// Sm2Co17 from Magnetsearcher, "Typical magnetic properties of samarium
// cobalt magnets" (magnetsearcher.com, read 2026-12): YXG30H 1.08–1.10 T.
// Other suppliers' ranges differ by a few per cent: use the supplier's
// figure for a design.
const (
	RemanenceN42  = 1.30 // T, sintered NdFeB grade N42
	RemanenceN52  = 1.44 // T, sintered NdFeB grade N52
	RemanenceSmCo = 1.09 // T, sintered Sm2Co17, about 30 MGOe
)

// mu0 is the magnetic constant μ0 in H/m (CODATA 2018: 1.25663706212e-6;
// 4π·10⁻⁷ to within 1e-9, which is what matters here).
const mu0 = 1.25663706212e-6

// ForceTable is a force law given as points of force against gap,
// interpolated by a monotone piecewise cubic (Fritsch & Carlson,
// "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal. 17(2),
// 1980, pp. 238–246): between two points the force stays between their
// forces, a run of rising or falling forces stays rising or falling, and a
// peak of the data is a peak of the curve. Below the first gap and beyond
// the last the force is the end point's, with zero slope: give the table
// from the seated gap out to where the force no longer changes.
type ForceTable struct {
	// Points holds at least two points with strictly increasing gaps
	// (m, ≥ 0) and forces (N, ≥ 0).
	Points []TablePoint
}

// TablePoint is one point of a [ForceTable]: the force in N at the gap in
// m.
type TablePoint struct {
	Gap, Force float64
}

// NewForceTable returns the table of the points (copied), validated. Its
// errors are [*InputError]s naming
// "Points" (fewer than two) or "Points[i].Gap" and "Points[i].Force" (not
// finite, negative, or gaps not strictly increasing).
func NewForceTable(points []TablePoint) (*ForceTable, error) {
	t := &ForceTable{Points: append([]TablePoint(nil), points...)}
	if err := t.check(); err != nil {
		return nil, err
	}
	return t, nil
}

func (t *ForceTable) check() error {
	if t == nil || len(t.Points) < 2 {
		n := 0
		if t != nil {
			n = len(t.Points)
		}
		return &InputError{Field: "Points", Err: fmt.Errorf("%w: a force table needs at least two points, got %d", ErrDegenerate, n)}
	}
	for i, p := range t.Points {
		f := indexed("Points", i)
		if !allFinite(p.Gap) {
			return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: %g", ErrNonFinite, p.Gap)}
		}
		if !allFinite(p.Force) {
			return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: %g", ErrNonFinite, p.Force)}
		}
		if p.Gap < 0 {
			return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, p.Gap)}
		}
		if p.Force < 0 {
			return &InputError{Field: f + ".Force", Err: fmt.Errorf("%w: must be ≥ 0 (the element's Direction gives the sense), got %g", ErrRange, p.Force)}
		}
		if i > 0 && !(p.Gap > t.Points[i-1].Gap) {
			return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: gaps must increase strictly: %g after %g", ErrRange, p.Gap, t.Points[i-1].Gap)}
		}
		if q := t.Points[max(i-1, 0)]; i > 0 && !allFinite((p.Force-q.Force)/(p.Gap-q.Gap)) {
			return &InputError{Field: f + ".Gap", Err: fmt.Errorf("%w: the slope from the point before overflows (gaps %g and %g)", ErrRange, q.Gap, p.Gap)}
		}
	}
	return nil
}

// tangents returns the final Fritsch–Carlson tangents at the ends of
// interval lo: the initial tangents are the three-point average of the
// secants (the ends take their secant), zero where the data has a peak or
// a flat; then interval by interval from the first, a pair of tangents
// outside the circle α² + β² = 9 (α, β the tangents over the secant) is
// scaled onto it (Fritsch & Carlson 1980, §4, the sufficient condition of
// their Fig. 2 region). Interval k changes the tangents at k and k + 1
// only, so the tangent at k is final after interval k: the loop runs to
// interval lo + 1, without storage.
func tangents(p []TablePoint, lo int) (float64, float64) {
	n := len(p)
	sec := func(k int) float64 { return (p[k+1].Force - p[k].Force) / (p[k+1].Gap - p[k].Gap) }
	initial := func(k int) float64 {
		switch {
		case k == 0:
			return sec(0)
		case k == n-1:
			return sec(n - 2)
		}
		d0, d1 := sec(k-1), sec(k)
		if d0*d1 <= 0 {
			return 0
		}
		return (d0 + d1) / 2
	}
	carry := initial(0)
	var mlo float64
	for k := 0; k <= min(lo+1, n-2); k++ {
		a, b := carry, initial(k+1)
		if dk := sec(k); dk == 0 {
			a, b = 0, 0
		} else if al, be := a/dk, b/dk; al*al+be*be > 9 {
			tau := 3 / math.Sqrt(al*al+be*be)
			a, b = tau*al*dk, tau*be*dk
		}
		if k == lo {
			mlo = a
		}
		if k == lo+1 {
			return mlo, a
		}
		carry = b
	}
	return mlo, carry
}

// Force returns the interpolated force in N at the gap in m and its slope
// dF/dgap in N/m.
func (t *ForceTable) Force(gap float64) (float64, float64, error) {
	if err := t.check(); err != nil {
		return 0, 0, err
	}
	if err := checkGap(gap); err != nil {
		return 0, 0, err
	}
	p := t.Points
	n := len(p)
	switch {
	case gap <= p[0].Gap:
		return p[0].Force, 0, nil
	case gap >= p[n-1].Gap:
		return p[n-1].Force, 0, nil
	}
	lo, hi := 0, n-1
	for hi-lo > 1 {
		mid := (lo + hi) / 2
		if p[mid].Gap <= gap {
			lo = mid
		} else {
			hi = mid
		}
	}
	mlo, mhi := tangents(p, lo)
	h := p[hi].Gap - p[lo].Gap
	s := (gap - p[lo].Gap) / h
	// Cubic Hermite basis on [0, 1] and its derivative.
	h00, h10, h01, h11 := (1+2*s)*(1-s)*(1-s), s*(1-s)*(1-s), s*s*(3-2*s), s*s*(s-1)
	f := h00*p[lo].Force + h10*h*mlo + h01*p[hi].Force + h11*h*mhi
	d00, d10, d01, d11 := 6*s*(s-1), (1-s)*(1-3*s), 6*s*(1-s), s*(3*s-2)
	df := (d00*p[lo].Force+d01*p[hi].Force)/h + d10*mlo + d11*mhi
	if !allFinite(f, df) {
		return 0, 0, &InputError{Field: "gap", Err: fmt.Errorf("%w: the interpolated force at %g m overflows", ErrRange, gap)}
	}
	return math.Max(f, 0), df, nil
}

func (t *ForceTable) reach() float64 { return t.Points[len(t.Points)-1].Gap }

// checkGap returns an error naming "gap" for a negative or non-finite gap.
func checkGap(gap float64) error {
	if !allFinite(gap) {
		return &InputError{Field: "gap", Err: fmt.Errorf("%w: %g", ErrNonFinite, gap)}
	}
	if gap < 0 {
		return &InputError{Field: "gap", Err: fmt.Errorf("%w: must be ≥ 0, got %g", ErrRange, gap)}
	}
	return nil
}

// Magnet is a cuboid permanent magnet magnetised uniformly along its
// third edge, the axis of the law.
type Magnet struct {
	// Size holds the full edge lengths in m: the two lateral edges (x and
	// y of the law's frame) and the edge along the magnetisation (the
	// axis). Each > 0.
	Size [3]float64

	// Remanence is the remanent flux density Br in T, > 0
	// ([RemanenceN42] and the other grade constants).
	Remanence float64
}

// MagnetPair is two cuboid magnets facing each other across the gap, with
// parallel magnetisation along the common axis so that they attract, and
// edges parallel: a magnet on the moving body over one on the base. The
// force is the attraction along the axis on the moving body's magnet by
// the closed form of Akoun & Yonnet ("3D analytical calculation of the
// forces exerted between two cuboidal magnets", IEEE Trans. Magn. 20(5),
// 1984, pp. 1962–1964), a sum over the 64 corner combinations written with
// half edges; the magnets are rigid (relative permeability 1, no
// demagnetisation). Beyond a centre distance of 20 times the largest edge
// the corner sum cancels and the force is taken from the point-dipole
// limit with the magnets' moments m = Br·V/μ0. The lateral force of an
// offset pair is not part of the law; an offset beyond the magnets' faces
// turns the axial force into a repulsion, returned as a negative force.
type MagnetPair struct {
	Moving, Base Magnet

	// Offset is the lateral offset in m of the moving magnet's centre
	// from the base magnet's, along the law's x and y.
	Offset [2]float64
}

// dipoleFar is the centre distance, in largest edges, beyond which the
// magnet force is the dipole limit: the 64-term corner sum has terms of
// order D² and a sum of order L⁶/D⁴ (L the size, D the distance), so it
// keeps about 16 − 6·log10(D/L) digits, 8 at 20 sizes, where the dipole
// limit is within a few (L/D)² ≈ 2.5e-3 of it.
const dipoleFar = 20

func (m Magnet) check(field string) error {
	for k, s := range m.Size {
		if !allFinite(s) {
			return &InputError{Field: fmt.Sprintf("%s.Size[%d]", field, k), Err: fmt.Errorf("%w: %g", ErrNonFinite, s)}
		}
		if !(s > 0) {
			return &InputError{Field: fmt.Sprintf("%s.Size[%d]", field, k), Err: fmt.Errorf("%w: a magnet's edge must be > 0, got %g", ErrRange, s)}
		}
	}
	if !allFinite(m.Remanence) {
		return &InputError{Field: field + ".Remanence", Err: fmt.Errorf("%w: %g", ErrNonFinite, m.Remanence)}
	}
	if !(m.Remanence > 0) || m.Remanence > 10 {
		return &InputError{Field: field + ".Remanence", Err: fmt.Errorf("%w: must be > 0 and at most 10 T, got %g", ErrRange, m.Remanence)}
	}
	return nil
}

func (m Magnet) volume() float64 { return m.Size[0] * m.Size[1] * m.Size[2] }

func (m Magnet) largest() float64 { return math.Max(m.Size[0], math.Max(m.Size[1], m.Size[2])) }

func (p MagnetPair) check() error {
	if err := p.Moving.check("Moving"); err != nil {
		return err
	}
	if err := p.Base.check("Base"); err != nil {
		return err
	}
	for k, o := range p.Offset {
		if !allFinite(o) {
			return &InputError{Field: fmt.Sprintf("Offset[%d]", k), Err: fmt.Errorf("%w: %g", ErrNonFinite, o)}
		}
	}
	return nil
}

func (p MagnetPair) reach() float64 { return 10 * math.Max(p.Moving.largest(), p.Base.largest()) }

// Force returns the attraction in N on the moving magnet along the axis at
// the gap (m, between the facing pole faces) and its slope dF/dgap in N/m
// (negative where the force falls). At the touching limit, gap 0, the
// force is finite; the slope of two faces with a common edge is −Inf
// there (the field at the edge of a pole face is logarithmically
// singular), so a seated gap of zero has no stiffness.
func (p MagnetPair) Force(gap float64) (float64, float64, error) {
	if err := p.check(); err != nil {
		return 0, 0, err
	}
	if err := checkGap(gap); err != nil {
		return 0, 0, err
	}
	f, df := pairForce(&p.Base, &p.Moving, p.Offset[0], p.Offset[1], gap)
	if !allFinite(f) || math.IsNaN(df) {
		return 0, 0, &InputError{Field: "gap", Err: fmt.Errorf("%w: the magnet force at %g m overflows", ErrRange, gap)}
	}
	return f, df, nil
}

// pairForce returns the attraction on magnet b (above, centre at the
// offset (x, y)) by magnet a (below) across the gap, and its slope.
func pairForce(a, b *Magnet, x, y, gap float64) (float64, float64) {
	z := (a.Size[2]+b.Size[2])/2 + gap
	d := math.Sqrt(x*x + y*y + z*z)
	if d > dipoleFar*math.Max(a.largest(), b.largest()) {
		return dipoleForce(a, b, x, y, z)
	}
	// Akoun & Yonnet (1984): F_z on magnet 2 = J J'/(4π μ0) Σ (−1)^(i+j+k+l+p+q) φz(U, V, W)
	// with U = α + (−1)^j A − (−1)^i a (half edges a, b, c of magnet 1
	// at the origin; A, B, C of magnet 2 at (α, β, γ)), V and W alike, and
	// φz = −U W ln(r − U) − V W ln(r − V) + U V atan(U V/(r W)) − r W.
	// dφz/dW is summed alongside for the slope (γ = gap + const).
	// An axis with no offset has its corner values in pairs ±U of the
	// same sign, and φz's terms in U are odd in U: the pair is summed in
	// closed form (phiZ's fold), 16 terms in place of 64.
	us, su, nu, fu := cornerValues(x, b.Size[0]/2, a.Size[0]/2)
	vs, sv, nv, fv := cornerValues(y, b.Size[1]/2, a.Size[1]/2)
	ws, sw, _, _ := cornerValues(z, b.Size[2]/2, a.Size[2]/2)
	var sum, dsum float64
	for iu := range nu {
		for iv := range nv {
			for iw := range 4 {
				phi, dphi := phiZ(us[iu], vs[iv], ws[iw], fu, fv)
				s := su[iu] * sv[iv] * sw[iw]
				sum += s * phi
				dsum += s * dphi
			}
		}
	}
	k := a.Remanence * b.Remanence / (4 * math.Pi * mu0)
	// The sum is F_z on magnet 2 (positive pushes it up, away); the
	// attraction is its negative, and dF/dgap = d(−F_z)/dγ. Touching
	// faces with an edge in common have logarithmically infinite terms in
	// the slope, of both signs: the slope is −Inf there.
	if gap == 0 && !allFinite(dsum) {
		return -k * sum, math.Inf(-1)
	}
	return -k * sum, -k * dsum
}

// cornerValues returns Akoun & Yonnet's values c + (−1)^j B − (−1)^i A
// of one axis (B the moving magnet's half edge, A the base's, c the
// offset) with their signs (−1)^(i+j); for c = 0 and an axis that may be
// folded the two representatives of the pairs ±value (fold true).
func cornerValues(c, hb, ha float64) (v, s [4]float64, n int, fold bool) {
	if c == 0 {
		return [4]float64{hb - ha, -hb - ha}, [4]float64{1, -1}, 2, true
	}
	return [4]float64{c + hb - ha, c - hb - ha, c + hb + ha, c - hb + ha}, [4]float64{1, -1, -1, 1}, 4, false
}

// phiZ returns Akoun & Yonnet's φz(U, V, W) and its derivative in W,
// written so that r − U and r − V do not cancel and the limits W → 0⁺
// (touching faces) and r → 0 (a common corner) are taken. With fu (fv)
// it returns the sum over ±U (±V): the terms −U W ln(r − U) of the pair
// sum to 2 U W artanh(U/r), the others double.
func phiZ(u, v, w float64, fu, fv bool) (float64, float64) {
	r := math.Sqrt(u*u + v*v + w*w)
	if r == 0 {
		return 0, 0
	}
	mu, mv := 1.0, 1.0
	if fu {
		mu = 2
	}
	if fv {
		mv = 2
	}
	pu, du := logTerms(r, u, v, w, fu)
	pv, dv := logTerms(r, v, u, w, fv)
	uv := u * v
	// dφz/dW = −U ln(r−U) − U W²/(r(r−U)) − V ln(r−V) − V W²/(r(r−V))
	//          − U²V²(r²+W²)/(r (U²+W²)(V²+W²)) − (r² + W²)/r,
	// using r²W² + U²V² = (U²+W²)(V²+W²) for the derivative of the
	// arctangent.
	rest := -r * w
	drest := -(r*r + w*w) / r
	if uv != 0 {
		// W ≥ 0 (the gap is), and at W = 0 the limit W → 0⁺ is ±π/2.
		at := math.Copysign(math.Pi/2, uv)
		if w > 0 {
			at = math.Atan(uv / (r * w))
		}
		rest += uv * at
		drest -= uv * uv * (r*r + w*w) / (r * (u*u + w*w) * (v*v + w*w))
	}
	return mv*pu + mu*pv + mu*mv*rest, mv*du + mu*dv + mu*mv*drest
}

// logTerms returns −U W ln(r − U) and its derivative in W,
// −U ln(r − U) − U W²/(r(r − U)), or with fold their sums over ±U:
// 2 U W artanh(U/r) and 2 U artanh(U/r) − 2 U² W²/(r (V² + W²)), the
// artanh written as ln((r + |U|)/√(V² + W²)) with U's sign.
func logTerms(r, u, v, w float64, fold bool) (float64, float64) {
	if u == 0 {
		return 0, 0
	}
	if !fold {
		l, q := logDiff(r, u, v, w)
		var p float64
		if w != 0 {
			p = -u * w * l
		}
		return p, -u*l - u*q/r
	}
	t := v*v + w*w
	at := math.Log((r + math.Abs(u)) / math.Sqrt(t))
	if u < 0 {
		at = -at
	}
	var p float64
	if w != 0 {
		p = 2 * u * w * at
	}
	return p, 2*u*at - 2*u*u*w*w/(r*t)
}

// logDiff returns ln(r − u) and W²/(r − u) for r = √(u² + v² + w²),
// without the cancellation of r − u for u > 0 (r − u = (v² + w²)/(r + u));
// when v = w = 0 and u > 0 the log is −Inf and W²/(r − u) its limit r + u
// as w → 0 at v = 0.
func logDiff(r, u, v, w float64) (float64, float64) {
	if u <= 0 {
		return math.Log(r - u), w * w / (r - u)
	}
	t := v*v + w*w
	if t == 0 {
		return math.Inf(-1), r + u
	}
	return math.Log(t / (r + u)), w * w * (r + u) / t
}

// dipoleForce returns the attraction and its slope in z of two point
// dipoles of moments mᵢ = Brᵢ Vᵢ/μ0 along z, b at (x, y, z) from a:
// F_z = (μ0 m1 m2/4π)(9z/r⁵ − 15z³/r⁷) on b (Jackson, Classical
// Electrodynamics, 3rd ed., 1999, eq. 5.56 for the field of a dipole and
// the force ∇(m·B)), which on the axis is −3μ0 m1 m2/(2π z⁴).
func dipoleForce(a, b *Magnet, x, y, z float64) (float64, float64) {
	m1 := a.Remanence * a.volume() / mu0
	m2 := b.Remanence * b.volume() / mu0
	k := mu0 * m1 * m2 / (4 * math.Pi)
	r2 := x*x + y*y + z*z
	r := math.Sqrt(r2)
	r5 := r2 * r2 * r
	r7 := r5 * r2
	r9 := r7 * r2
	f := k * (15*z*z*z/r7 - 9*z/r5)
	df := k * (90*z*z/r7 - 105*z*z*z*z/r9 - 9/r5)
	return f, df
}

// MagnetPlate is a cuboid magnet, magnetised along the axis, attracting a
// thick flat steel plate across the gap. The plate is taken as infinitely
// permeable and unsaturated, so that by the method of images its surface
// acts as a mirror: the force is that of the magnet and its mirror image,
// an identical magnet magnetised the same way, across twice the gap
// (Furlani, Permanent Magnet and Electromechanical Devices, Academic
// Press, 2001, §3 on the method of images; section number from memory).
// A real plate saturates near a strong magnet at small gaps and has finite
// permeability, so the law overestimates the force there: an upper bound.
type MagnetPlate struct {
	Magnet Magnet
}

func (p MagnetPlate) check() error { return p.Magnet.check("Magnet") }

func (p MagnetPlate) reach() float64 { return 10 * p.Magnet.largest() }

// Force returns the attraction in N of the plate on the magnet at the gap
// in m and its slope dF/dgap in N/m: the pair force of the magnet and its
// image at twice the gap, whose slope is twice the pair's.
func (p MagnetPlate) Force(gap float64) (float64, float64, error) {
	if err := p.check(); err != nil {
		return 0, 0, err
	}
	if err := checkGap(gap); err != nil {
		return 0, 0, err
	}
	f, df := pairForce(&p.Magnet, &p.Magnet, 0, 0, 2*gap)
	if !allFinite(f) || math.IsNaN(df) {
		return 0, 0, &InputError{Field: "gap", Err: fmt.Errorf("%w: the magnet force at %g m overflows", ErrRange, gap)}
	}
	return f, 2 * df, nil
}
