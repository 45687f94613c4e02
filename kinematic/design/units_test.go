package design

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// TestParseQuantity checks the conversion of quantity strings into SI
// values. Sources of the factors:
//
//	[SI7]  SI Brochure, 9th ed. (BIPM, 2019), Table 7: the SI prefixes
//	       (c 1e-2, m 1e-3, µ 1e-6, n 1e-9, k 1e3, M 1e6, G 1e9).
//	[SI8]  SI Brochure, 9th ed. (2019), Table 8: non-SI units accepted for
//	       use with the SI: 1° = (π/180) rad, 1′ = (1/60)°, 1″ = (1/60)′.
//	[SI2]  SI Brochure, 9th ed. (2019), §2.3.4 and Table 4: derived units
//	       (N, Pa, Hz; N·m; the kelvin difference).
//	[CGPM] 3rd CGPM (1901), declaration on the unit of mass and the
//	       definition of weight: standard gravity g_n = 980.665 cm/s²,
//	       that is 9.80665 m/s².
//	[ppm]  common practice on data sheets: 1 ppm/K = 1e-6/K (the SI
//	       Brochure, §5.4.7, advises against "ppm").
//
// A decimal multiple must come out as the float64 nearest to the decimal
// value (the plain number written in SI), so those are compared exactly;
// the others to 1 ulp.
func TestParseQuantity(t *testing.T) {
	tests := []struct {
		in     string
		kind   *quantityKind
		want   float64
		exact  bool
		source string
	}{
		{"12.7 mm", length, 0.0127, true, "SI7"},
		{"12.7mm", length, 0.0127, true, "SI7"},
		{"0.5 µm", length, 0.5e-6, true, "SI7 (µ U+00B5)"},
		{"0.5 μm", length, 0.5e-6, true, "SI7 (μ U+03BC)"},
		{"0.5 um", length, 0.5e-6, true, "SI7"},
		{"3 cm", length, 0.03, true, "SI7"},
		{"250 nm", length, 250e-9, true, "SI7"},
		{"1.5e3 mm", length, 1.5, true, "SI7"},
		{"-2E-1 m", length, -0.2, true, "SI7"},
		{"  7  m ", length, 7, true, "SI base unit"},
		{"45 deg", angle, math.Pi / 4, false, "SI8"},
		{"90°", angle, math.Pi / 2, false, "SI8"},
		{"3 mrad", angle, 3e-3, true, "SI7"},
		{"20 urad", angle, 20e-6, true, "SI7"},
		{"30 arcmin", angle, math.Pi / 360, false, "SI8: 30′ = 0.5°"},
		{"3600 arcsec", angle, math.Pi / 180, false, "SI8: 3600″ = 1°"},
		{"10 N", force, 10, true, "SI2"},
		{"1.5 kN", force, 1500, true, "SI7"},
		{"250 mN", force, 0.25, true, "SI7"},
		{"200 GPa", pressure, 200e9, true, "SI7"},
		{"4200 MPa", pressure, 4.2e9, true, "SI7"},
		{"101.325 kPa", pressure, 101325, true, "SI7"},
		{"9.81 m/s^2", acceleration, 9.81, true, "SI2"},
		{"9.81 m/s²", acceleration, 9.81, true, "SI2"},
		{"5 g", acceleration, 5 * 9.80665, false, "CGPM"},
		{"1 g", acceleration, 9.80665, true, "CGPM"},
		{"-1 g", acceleration, -9.80665, true, "CGPM"},
		{"500 mm/s^2", acceleration, 0.5, true, "SI7"},
		{"320 g", mass, 0.32, true, "SI7 (gram)"},
		{"2 kg", mass, 2, true, "SI base unit"},
		{"427 kg mm^2", inertia, 427e-6, true, "SI7: (1e-3 m)² = 1e-6 m²"},
		{"427 kg·mm²", inertia, 427e-6, true, "SI7, product sign"},
		{"4e-3 kg*m^2", inertia, 4e-3, true, "SI2"},
		{"12 g cm^2", inertia, 12e-7, true, "SI7: 1e-3 kg·(1e-2 m)²"},
		{"6 N/mm", rate, 6000, true, "SI7"},
		{"2 N/µm", rate, 2e6, true, "SI7"},
		{"3 N m", moment, 3, true, "SI2"},
		{"3 N·mm", moment, 3e-3, true, "SI7"},
		{"10 K", temperature, 10, true, "SI2"},
		{"250 mK", temperature, 0.25, true, "SI7"},
		{"23.6 ppm/K", expansion, 23.6e-6, true, "ppm"},
		{"1.2e-5 1/K", expansion, 1.2e-5, true, "SI2"},
		{"1.2e-5 /K", expansion, 1.2e-5, true, "SI2"},
		{"1.5 kHz", frequency, 1500, true, "SI7"},
		{"-0 mm", length, 0, true, "negative zero"},
		{"1e-400 mm", length, 0, true, "underflow to zero"},
	}
	for _, tc := range tests {
		got, err := parseQuantity(tc.in, tc.kind)
		if err != nil {
			t.Errorf("%q: %v", tc.in, err)
			continue
		}
		if tc.exact && got != tc.want || !tc.exact && math.Abs(got-tc.want) > math.Abs(tc.want)*0x1p-52 {
			t.Errorf("%q = %.17g %s, want %.17g (%s)", tc.in, got, tc.kind.si, tc.want, tc.source)
		}
	}
}

func TestParseQuantityErrors(t *testing.T) {
	tests := []struct {
		in     string
		kind   *quantityKind
		is     error
		reason string
	}{
		{"12.7", length, ErrUnit, "has no unit"},
		{"12.7 furlong", length, ErrUnit, `"furlong" is not a length unit`},
		{"12.7 MM", length, ErrUnit, "is not a length unit"},
		{"5 g", mass, nil, ""},
		{"5 g", length, ErrUnit, "is not a length unit"},
		{"5 deg", length, ErrUnit, "accepted: m, cm, mm"},
		{".5 mm", length, ErrUnit, "does not start with a number"},
		{"1. mm", length, ErrUnit, "does not start with a number"},
		{"+1 mm", length, ErrUnit, "does not start with a number"},
		{"mm", length, ErrUnit, "does not start with a number"},
		{"", length, ErrUnit, "does not start with a number"},
		{"NaN mm", length, ErrUnit, "does not start with a number"},
		{"Inf mm", length, ErrUnit, "does not start with a number"},
		{"1e400 mm", length, ErrNonFinite, "beyond float64"},
		{"1e99999999 mm", length, ErrNonFinite, "beyond float64"},
		{"1e308 kN", force, ErrNonFinite, "beyond float64"},
		{"1e308 g", acceleration, ErrNonFinite, "beyond float64"},
		{"2em", length, ErrUnit, `"em" is not a length unit`},
		{"1 N m", length, ErrUnit, "is not a length unit"},
	}
	for _, tc := range tests {
		_, err := parseQuantity(tc.in, tc.kind)
		if tc.is == nil {
			if err != nil {
				t.Errorf("%q as %s: %v", tc.in, tc.kind.what, err)
			}
			continue
		}
		if !errors.Is(err, tc.is) || !strings.Contains(err.Error(), tc.reason) {
			t.Errorf("%q as %s: error %v, want %v with %q", tc.in, tc.kind.what, err, tc.is, tc.reason)
		}
	}
}

// TestPlainNumbersAreSI checks that a plain number in a file is taken in
// the field's SI unit and that it reads the same as the string with the
// unit: 0.0127 and "12.7 mm" give the same float64.
func TestPlainNumbersAreSI(t *testing.T) {
	a, err := Parse([]byte(edit(t, set("balls[0].radius", 0.00635))))
	if err != nil {
		t.Fatal(err)
	}
	b, err := Parse([]byte(edit(t, set("balls[0].radius", "6.35 mm"))))
	if err != nil {
		t.Fatal(err)
	}
	if a.Balls[0].Radius != 0.00635 || b.Balls[0].Radius != 0.00635 {
		t.Errorf("radius %v and %v, want 0.00635 m from both", a.Balls[0].Radius, b.Balls[0].Radius)
	}
}
