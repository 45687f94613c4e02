package hertz

import "math"

// relDiff returns |got − want|/|want| (|got − want| when want is 0).
func relDiff(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// goldenMax returns the maximum of f on [lo, hi] and its location by
// golden-section search (Kiefer 1953), for a unimodal f. It is a test
// reference independent of the package's Halley search.
func goldenMax(f func(float64) float64, lo, hi float64) (fmax, xmax float64) {
	g := (math.Sqrt(5) - 1) / 2
	x1, x2 := hi-g*(hi-lo), lo+g*(hi-lo)
	f1, f2 := f(x1), f(x2)
	for hi-lo > 1e-12*(1+math.Abs(hi)) {
		if f1 < f2 {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + g*(hi-lo)
			f2 = f(x2)
		} else {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - g*(hi-lo)
			f1 = f(x1)
		}
	}
	x := (lo + hi) / 2
	return f(x), x
}

// circleAxis returns σr = σθ and σz over p0 on the axis of a circular Hertz
// contact at depth zeta = z/a: Johnson, Contact Mechanics (1985), §3.4,
// eq. 3.45 (equation number from memory).
func circleAxis(zeta, nu float64) (sr, sz float64) {
	sz = -1 / (1 + zeta*zeta)
	if zeta == 0 {
		return -(1 + 2*nu) / 2, sz
	}
	return -(1+nu)*(1-zeta*math.Atan(1/zeta)) + 0.5/(1+zeta*zeta), sz
}

// lineAxis returns σx (in the plane, across the strip), σz and the
// out-of-plane σy = ν(σx + σz) over p0 on the axis of a Hertz line contact
// of half-width b at depth zeta = z/b, in plane strain: McEwen (1949), as
// given in Johnson, Contact Mechanics (1985), §4.2, eq. 4.49 (equation
// number from memory).
func lineAxis(zeta, nu float64) (sx, sz, sy float64) {
	q := math.Sqrt(1 + zeta*zeta)
	sx = -((1+2*zeta*zeta)/q - 2*zeta)
	sz = -1 / q
	return sx, sz, nu * (sx + sz)
}
