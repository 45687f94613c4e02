package hertz

import "math"

// rdPair returns Carlson's symmetric integrals R_D(x, y, z) and R_D(x, z, y)
// for x ≥ 0, y, z > 0 (DLMF 19.16.5), sharing one duplication sequence.
//
// Method: Carlson (1995), "Numerical computation of real or complex elliptic
// integrals", Numer. Algorithms 10, 13–26, algorithm for R_D; the
// duplication step λ = √x√y + √y√z + √z√x is symmetric, so both integrals
// use the same sequence and differ only in the accumulated sum and in the
// final series (DLMF 19.36.2, the same truncation as gonum's
// mathext.EllipticRD, relative error about 1e-16).
func rdPair(x, y, z float64) (rdz, rdy float64) {
	// (ε/5)^(1/8) for the 7th-order series, as in gonum's EllipticRD.
	const tol = 9.0351169339315770474760122547068324993857488849382e-03
	az := (x + y + 3*z) / 5
	ay := (x + 3*y + z) / 5
	// Largest deviation of x, y, z from either mean (all are ≥ 0 and
	// finite, so plain comparisons serve).
	q := 0.0
	for _, d := range [...]float64{az - x, az - y, az - z, ay - x, ay - y, ay - z} {
		if d < 0 {
			d = -d
		}
		if d > q {
			q = d
		}
	}
	q /= tol
	xn, yn, zn := x, y, z
	mul, sz, sy := 1.0, 0.0, 0.0
	amin := az
	if ay < az {
		amin = ay
	}
	for q >= mul*amin {
		sx, syy, szz := math.Sqrt(xn), math.Sqrt(yn), math.Sqrt(zn)
		lam := sx*syy + syy*szz + szz*sx
		sz += 1 / (mul * szz * (zn + lam))
		sy += 1 / (mul * syy * (yn + lam))
		xn = (xn + lam) * 0.25
		yn = (yn + lam) * 0.25
		zn = (zn + lam) * 0.25
		mul *= 4
		amin = (amin + lam) * 0.25 // a lower bound kept with the same update
	}
	rdz = rdSeries(x, y, z, xn, yn, zn, mul) + 3*sz
	rdy = rdSeries(x, z, y, xn, zn, yn, mul) + 3*sy
	return rdz, rdy
}

// rdSeries is the tail of Carlson's R_D algorithm after the duplication
// has brought (xn, yn, zn) close together (DLMF 19.36.2).
func rdSeries(x, y, z, xn, yn, zn, mul float64) float64 {
	an := (xn + yn + 3*zn) / 5
	a0 := (x + y + 3*z) / 5
	X := (a0 - x) / (mul * an)
	Y := (a0 - y) / (mul * an)
	Z := -(X + Y) / 3
	E2 := X*Y - 6*Z*Z
	E3 := (3*X*Y - 8*Z*Z) * Z
	E4 := 3 * (X*Y - Z*Z) * Z * Z
	E5 := X * Y * Z * Z * Z
	return (1 - 3/14.0*E2 + 1/6.0*E3 + 9/88.0*E2*E2 - 3/22.0*E4 - 9/52.0*E2*E3 + 3/26.0*E5 - 1/16.0*E2*E2*E2 + 3/40.0*E3*E3 + 3/20.0*E2*E4 + 45/272.0*E2*E2*E3 - 9/68.0*(E3*E4+E2*E5)) / (mul * an * math.Sqrt(an))
}
