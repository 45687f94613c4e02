package hertz

import "math"

// ellipseShape holds the load-independent shape of the contact ellipse:
// t = ln(a/b) and the complete elliptic integrals of the eccentricity.
type ellipseShape struct {
	t  float64 // ln(a/b) ≥ 0
	kp float64 // k' = b/a = exp(-t), in (0, 1]
	m  float64 // parameter m = e² = 1 − k'², computed without cancellation
	K  float64 // K(m), complete elliptic integral of the first kind
	E  float64 // E(m), complete elliptic integral of the second kind
	P  float64 // (K − E)/m, finite at m = 0 (π/4)
	Q  float64 // (E − k'²K)/m, finite at m = 0 (π/4)
}

// agm returns K(m) and the tail sum V(m) = Σ_{n≥1} 2^(n−1) (c_n/m)² of the
// arithmetic–geometric mean of 1 and k' (Abramowitz & Stegun 1964, §17.6:
// K = π/(2 a_N), (K − E)/K = Σ_{n≥0} 2^(n−1) c_n²).
// The c_n are carried divided by m through c_{n+1} = c_n²/(4 a_{n+1}), so
// V stays finite and exact as m → 0 (V(0) = 1/16). Then
//
//	E/K = 1 − m/2 − m² V,
//	(K − E)/m = K (1/2 + m V),
//	(E − k'² K)/m = K (1/2 − m V).
//
// kp = k' must be in (0, 1] and m = 1 − kp² supplied accurately.
func agm(kp, m float64) (K, V float64) {
	a := (1 + kp) / 2  // a_1
	g := math.Sqrt(kp) // g_1
	ch := 1 / (4 * a)  // c_1/m = (1 − k')/(2m) = 1/(2(1 + k'))
	V = ch * ch
	w := 1.0 // 2^(n−1)
	// Stop when c_n/a_n < 2^-27: the next c is below 2^-54 a and the
	// mean a_{n+1} is then correct to the last bit.
	for m*ch > 0x1p-27*a {
		a1 := (a + g) / 2
		g = math.Sqrt(a * g)
		ch = m * ch * ch / (4 * a1) // c_{n+1} = c_n²/(4 a_{n+1})
		a = a1
		w *= 2
		V += w * ch * ch
	}
	a = (a + g) / 2
	return math.Pi / (2 * a), V
}

// shapeAt evaluates the shape at t = ln(a/b) and returns it with the AGM
// tail sum V.
func shapeAt(t float64) (ellipseShape, float64) {
	kp := math.Exp(-t)
	m := (1 - kp) * (1 + kp)
	if kp > 0.5 {
		m = -math.Expm1(-2 * t) // 1 − k' would cancel
	}
	K, V := agm(kp, m)
	return ellipseShape{
		t: t, kp: kp, m: m, K: K,
		E: K * (1 - m/2 - m*m*V),
		P: K * (0.5 + m*V),
		Q: K * (0.5 - m*V),
	}, V
}

// solveShape returns the contact-ellipse shape for the curvature ratio
// B/A = 1 + d, d = (B − A)/A ≥ 0, given as d so that the near-circular case
// keeps its relative accuracy.
//
// Hertz's condition (Johnson 1985, §3.5, with A = M/(πE*), B = N/(πE*)
// for the displacement coefficients L, M, N of the ellipsoidal pressure)
// is
//
//	B/A = [(a/b)² E(e) − K(e)] / [K(e) − E(e)],   e² = m = 1 − b²/a².
//
// With the AGM tail sum V of agm it reads, after dividing numerator and
// denominator by m (which removes the 0/0 of the circle),
//
//	B/A = (1/2 − mV) / (k'² (1/2 + mV)),
//
// and is solved by Newton's method for t = ln(a/b) on
//
//	φ(t) = 2t − 2 atanh(2mV) − ln(B/A) = 0,
//
// whose exact derivative φ'(t) = 3 − 4h/(1 − 4m²V²), h = 1/2 − (2 − m)V,
// follows from dK/dm = (E − k'²K)/(2mk'²) and dE/dm = (E − K)/(2m)
// (DLMF 19.4.1 with m = k²). φ' rises monotonically from 3/2 at the circle
// towards 2 (1.95 at t = 20), so φ is nearly linear and Newton converges
// from the start below in one or two steps.
func solveShape(d float64) ellipseShape {
	if !(d > 0) {
		return ellipseShape{kp: 1, K: math.Pi / 2, E: math.Pi / 2, P: math.Pi / 4, Q: math.Pi / 4}
	}
	x := math.Log1p(d) // ln(B/A)
	t := initialT(x)
	var s ellipseShape
	for i := 0; ; i++ {
		var V float64
		s, V = shapeAt(t)
		u := 2 * s.m * V
		phi := 2*t - 2*math.Atanh(u) - x
		h := 0.5 - (2-s.m)*V
		dphi := 3 - 4*h/(1-u*u)
		dt := phi / dphi
		t -= dt
		if math.Abs(dt) <= shapeStepTol*math.Min(t, 1) || i >= maxShapeIter {
			// Carry the integrals to the final t to first order (the
			// step is below 1e-6·min(t, 1), so the neglected term is
			// below 1e-12 relative): dK/dt = Q, dE/dt = −k'²P, dP/dt = Kh,
			// dQ/dt = Q − Kh.
			kh := s.K * h
			s.K, s.E, s.P, s.Q = s.K-dt*s.Q, s.E+dt*s.kp*s.kp*s.P, s.P-dt*kh, s.Q-dt*(s.Q-kh)
			// k'(t − dt) = k' e^dt and m = 1 − k'², to second order
			// in dt (the next term is below 1e-19).
			e := dt * (1 + dt/2)
			s.t = t
			s.m -= s.kp * s.kp * (2*e + e*e)
			s.kp += s.kp * e
			return s
		}
	}
}

const (
	maxShapeIter = 20
	shapeStepTol = 1e-6
)

// initialT is a starting value for t = ln(a/b) given x = ln(B/A) ≥ 0:
// cubic Hermite interpolation in u = √x of the converged solution at
// u = 0, 0.25, …, 6 (shapeTable), accurate to about 1e-6; beyond the table
// (B/A > e³⁶, past the line-contact limit of Solve) the asymptote
// x = 2t − ln(t + ln 4 − 1) of K ≈ ln(4/k') is iterated twice.
func initialT(x float64) float64 {
	if x < shapeStep*shapeStep {
		// Near-circular: t = 2x/3 − x³/324 + O(x⁵) (the cubic term
		// read off converged solutions), error below 1e-8 t here.
		return x * (2.0/3 - x*x/324)
	}
	u := math.Sqrt(x) / shapeStep
	if last := len(shapeTable) - 1; u >= float64(last) {
		if u == float64(last) {
			return shapeTable[last][0]
		}
		t := x / 2
		for range 2 {
			t = (x + math.Log(t+2*math.Ln2-1)) / 2
		}
		return t
	}
	i := int(u)
	s := u - float64(i)
	p, q := shapeTable[i], shapeTable[i+1]
	h00 := (1 + 2*s) * (1 - s) * (1 - s)
	h10 := s * (1 - s) * (1 - s)
	h01 := s * s * (3 - 2*s)
	h11 := s * s * (s - 1)
	return h00*p[0] + h10*shapeStep*p[1] + h01*q[0] + h11*shapeStep*q[1]
}

// shapeStep is the spacing in u = √(ln(B/A)) of shapeTable.
const shapeStep = 0.25

// shapeTable holds t = ln(a/b) and dt/du at u = i·shapeStep, computed with
// solveShape itself (converged to rounding from the start 2x/3) and
// verified by TestShapeTable. Only a starting value: the Newton iteration
// of solveShape makes the result independent of it.
var shapeTable = [...][2]float64{
	{0, 0},
	{0.041665913268837826, 0.33331525374694637},
	{0.16661856654284377, 0.66609046345542688},
	{0.37445780989823713, 0.9956998802400866},
	{0.66370259568509271, 1.31601463875147},
	{1.0309586206052874, 1.6183069736519891},
	{1.4707582341086309, 1.8956774261659979},
	{1.9766946551031781, 2.148072612342105},
	{2.5432852957489986, 2.3824266743657461},
	{3.1671748293180619, 2.6078942888141787},
	{3.8470829655447241, 2.8314478219418464},
	{4.5830470441017717, 3.0566994184219838},
	{5.375675439050462, 3.2848267686394848},
	{6.2257000374966891, 3.5158183536500029},
	{7.1337900244724839, 3.749274595131237},
	{8.1005062612367897, 3.9847606005433063},
	{9.1263088157247836, 4.2219112053795511},
	{10.211576566424249, 4.4604403653710643},
	{11.356625236182916, 4.7001259490036906},
	{12.561721271753397, 4.9407934617677949},
	{13.827092115066813, 5.1823036201753032},
	{15.152933839172944, 5.42454353142287},
	{16.539416921745413, 5.6674204515493329},
	{17.986690691030141, 5.9108572933738284},
	{19.494886807184024, 6.1547893275414101},
}
