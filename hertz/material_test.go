package hertz

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// TestMaterials checks the reference table: every entry named, sourced and
// usable by Solve; ISO 76:2006's 4200 MPa for the bearing steel; and that
// Materials returns a fresh copy.
func TestMaterials(t *testing.T) {
	ms := Materials()
	if len(ms) != 10 {
		t.Fatalf("Materials() has %d entries, want 10", len(ms))
	}
	for _, m := range ms {
		if m.Name == "" || m.Source == "" {
			t.Errorf("%+v: name or source missing", m)
		}
		// Every entry says where its allowable comes from, or why it
		// has none.
		if !strings.Contains(m.Source, "Allowable:") {
			t.Errorf("%s: Source %q does not account for Allowable", m.Name, m.Source)
		}
		if _, err := Solve(Sphere(0.005, m), Flat(m), 10); err != nil {
			t.Errorf("%s: %v", m.Name, err)
		}
	}
	// ISO 76:2006: basic static load rating of ball bearings at a
	// calculated contact pressure of 4200 MPa.
	if Steel52100.Allowable != 4200e6 {
		t.Errorf("52100 allowable = %g Pa, want 4200 MPa (ISO 76:2006)", Steel52100.Allowable)
	}
	ms[0].E = 1
	if Steel52100.E == 1 || Materials()[0].E == 1 {
		t.Error("Materials() aliases the package variables")
	}
}

// psi is one pound-force per square inch in pascals (NIST SP 811, 2008,
// Appendix B.8: 6.894 757 E+03 Pa).
const psi = 6894.757

// sourced is a check value and where it comes from. A point value from a
// document is checked to the rounding of the figure printed there (rel);
// a value recalled from memory is checked to lie in the range [lo, hi] the
// documents read give, which is all they support.
type sourced struct {
	want, rel float64 // a printed figure and its rounding, relative
	lo, hi    float64 // or a range (when hi > 0)
	src       string
}

// check reports whether got agrees with the source.
func (s sourced) check(got float64) bool {
	if s.hi > 0 {
		return got >= s.lo && got <= s.hi
	}
	return math.Abs(got-s.want) <= s.rel*math.Abs(s.want)
}

// value is a printed figure, rounded to half a unit of its last digit.
func value(want, rel float64, src string) sourced { return sourced{want: want, rel: rel, src: src} }

// within is a range printed in a source (or spanned by several).
func within(lo, hi float64, src string) sourced { return sourced{lo: lo, hi: hi, src: src} }

// firstYield returns p0/Y at first yield under a circular Hertz contact:
// 1/max over depth of |σz − σr|/p0 on the load axis, with the closed-form
// axis stresses of Johnson (1985) eq. 3.45 (ζ = z/a):
//
//	σz/p0 = −1/(1 + ζ²)
//	σr/p0 = −(1 + ν)(1 − ζ arctan(1/ζ)) + 1/(2(1 + ζ²))
//
// maximized here by a golden-section search on ζ in [0.2, 1] (the maximum
// lies near ζ = 0.48 for ν = 0.3, Johnson 1985 §3.4, from memory). This
// is the test's own evaluation of the closed form, not the package's
// stress code.
func firstYield(nu float64) float64 {
	f := func(z float64) float64 {
		sz := -1 / (1 + z*z)
		sr := -(1+nu)*(1-z*math.Atan(1/z)) + 0.5/(1+z*z)
		return math.Abs(sz - sr)
	}
	lo, hi := 0.2, 1.0
	g := (math.Sqrt(5) - 1) / 2
	for hi-lo > 1e-12 {
		a, b := hi-g*(hi-lo), lo+g*(hi-lo)
		if f(a) > f(b) {
			hi = b
		} else {
			lo = a
		}
	}
	return 1 / f((lo+hi)/2)
}

// TestFirstYield checks the test's own first-yield factor against the
// figure quoted for ν = 0.3: p0 = 1.60 Y, the maximum shear 0.31 p0 at a
// depth of 0.48a (Johnson 1985 §6.2, from memory; 1.61 to three digits).
func TestFirstYield(t *testing.T) {
	if got := firstYield(0.3); math.Abs(got-1.61) > 0.005 {
		t.Errorf("first yield at ν = 0.3: p0 = %.4f Y, want 1.61 Y", got)
	}
	// The factors quoted in the Material doc, to their three decimals.
	for _, c := range []struct{ nu, want float64 }{{0.28, 1.589}, {0.30, 1.613}, {0.33, 1.649}, {0.342, 1.664}} {
		if got := firstYield(c.nu); math.Abs(got-c.want) > 0.0005 {
			t.Errorf("first yield at ν = %g: p0 = %.4f Y, the doc says %.3f Y", c.nu, got, c.want)
		}
	}
	// The factor rises with ν (σr is more compressive): a closed-form
	// property of eq. 3.45, checked at the table's ν.
	if !(firstYield(0.28) < firstYield(0.33) && firstYield(0.33) < firstYield(0.342)) {
		t.Error("first-yield factor does not rise with ν")
	}
}

// TestMaterialValues checks every value of the reference table against the
// document its Source names, the source beside each value. Derived
// allowables are rebuilt here from the yield strength the Source names and
// the first-yield factor of Johnson's closed form, rounded down to three
// digits as the package doc says.
func TestMaterialValues(t *testing.T) {
	const GPa, MPa, perK = 1e9, 1e6, 1e-6
	rows := []struct {
		m            Material
		e, nu, alpha sourced
		allowable    sourced
		yield        float64  // Y for a first-yield allowable, Pa; 0 if none
		docs         []string // documents the Source must name
	}{
		{
			m:         Steel52100,
			e:         within(190*GPa, 210*GPa, "Stindia 52100 sheet: 190–210 GPa; Lucefin 100Cr6 card: 210 GPa; 208 GPa from memory"),
			nu:        value(0.30, 0.017, "Lucefin '100Cr6 technical card': Poisson number 0.30"),
			alpha:     within(11.4*perK, 11.9*perK, "Lucefin card: 11.4e-6/K (range not legible); 11.9e-6/K from memory"),
			allowable: value(4200*MPa, 0, "ISO 76:2006 clause 3: 4200 MPa, ball bearings other than self-aligning"),
			docs:      []string{"ISO 76:2006", "Lucefin '100Cr6 technical card'", "from memory"},
		},
		{
			m:         Steel440C,
			e:         value(200*GPa, 0.0025, "MakeItFrom 'Annealed 440C'; Qinghe 440C table: 200 GPa"),
			nu:        value(0.28, 0.018, "MakeItFrom 'Annealed 440C': 0.28"),
			alpha:     value(10.1*perK, 0.005, "Qinghe 440C table: 10.1 µm/m·°C, 0–100 °C; Rolled Alloys: 5.6e-6/°F"),
			allowable: value(4200*MPa, 0, "ISO 76:2006 clause 3 (hardened bearing steel): 4200 MPa"),
			docs:      []string{"ISO 76:2006", "ISO 683-17:2014", "MakeItFrom.com 'Annealed 440C", "Rolled Alloys"},
		},
		{
			m:         SiliconNitride,
			e:         within(300*GPa, 310*GPa, "Lily Bearing: 300–315 GPa; MakeItFrom 'Silicon Nitride': 140–310 GPa; 310 GPa from memory"),
			nu:        within(0.24, 0.27, "MakeItFrom 'Silicon Nitride': 0.24–0.27; 0.27 from memory"),
			alpha:     within(2.5*perK, 3.2*perK, "MakeItFrom 'Silicon Nitride': 2.5–3.2e-6/K; 3.2 from memory"),
			allowable: value(0, 0, "none on file: ISO 20056-2:2017 figure not at hand"),
			docs:      []string{"ISO 20056-2:2017", "ASTM F2094", "MakeItFrom.com 'Silicon Nitride", "Lily Bearing"},
		},
		{
			m:         TungstenCarbide,
			e:         within(530*GPa, 700*GPa, "Matmake tungsten carbide: 530–700 GPa; 620 GPa from memory"),
			nu:        value(0.22, 0, "from memory, unchecked for WC–6%Co"),
			alpha:     value(5.0*perK, 0, "from memory, unchecked for WC–6%Co"),
			allowable: value(0, 0, "none on file: no contact allowable found"),
			docs:      []string{"Matmake", "MakeItFrom.com 'Tungsten Carbide"},
		},
		{
			m:         Sapphire,
			e:         within(335*GPa, 450*GPa, "Uni-Optics 335, Roditi 345, MakeItFrom 450 GPa; 400 GPa from memory"),
			nu:        within(0.25, 0.30, "Uni-Optics 0.25, Valley Design 0.29, SPI 0.25–0.30; 0.27 from memory"),
			alpha:     value(5.3*perK, 0.0095, "MakeItFrom 'Synthetic Sapphire': 5.3 µm/m·K"),
			allowable: value(0, 0, "none on file: brittle"),
			docs:      []string{"Roditi", "Uni-Optics", "MakeItFrom.com 'Synthetic Sapphire"},
		},
		{
			m:         FusedSilica,
			e:         value(72.7*GPa, 0, "from memory (MakeItFrom 'Fused Silica': 73 GPa)"),
			nu:        value(0.16, 0, "from memory (MakeItFrom 'Fused Silica': 0.17)"),
			alpha:     value(0.52*perK, 0.0097, "Präzisions Glas & Optik via Translume: 0.52e-6/K, 5–35 °C"),
			allowable: value(0, 0, "none on file: brittle"),
			docs:      []string{"Translume", "MakeItFrom.com 'Fused Silica"},
		},
		{
			m:     Aluminium6061T6,
			e:     value(68.9*GPa, 0.00073, "MatWeb 'Aluminum 6061-T6; 6061-T651': 68.9 GPa (AA typical)"),
			nu:    value(0.33, 0.016, "MatWeb 'Aluminum 6061-T6; 6061-T651': 0.33"),
			alpha: value(23.6*perK, 0.0022, "MatWeb 'Aluminum 6061-T6; 6061-T651': 23.6 µm/m·°C, 20–100 °C"),
			yield: 35000 * psi, // 49 CFR §178.46 Table 2: 6061-T6 yield minimum 35 000 psi
			docs:  []string{"MatWeb", "49 CFR §178.46", "Johnson 1985 eq. 3.45"},
		},
		{
			m:         Invar36,
			e:         value(20.5e6*psi, 0.0025, "'INVAR 36 Technical Data Sheet': 20.5e6 psi"),
			nu:        value(0.26, 0, "from memory, unchecked"),
			alpha:     within(1.18*perK, 1.93*perK, "sheets read: 1.18 (25–100 °C) to 1.93 (30–100 °C); 1.3 from memory"),
			allowable: value(0, 0, "none on file: ν unchecked"),
			docs:      []string{"INVAR 36 Technical Data Sheet", "Nilo 36", "Efinea"},
		},
		{
			m:     Ti6Al4V,
			e:     value(113.8*GPa, 0.00044, "MatWeb (ASM) 'Ti-6Al-4V (Grade 5), ELI, Annealed': 113.8 GPa"),
			nu:    value(0.342, 0.0015, "MatWeb (ASM) 'Ti-6Al-4V (Grade 5), ELI, Annealed': 0.342"),
			alpha: value(8.6*perK, 0.0059, "MatWeb (ASM) 'Ti6Al4V (Grade 5), STA Bar': 8.6 µm/m·°C, 20–100 °C"),
			yield: 790 * MPa, // MatWeb (ASM) 'Ti-6Al-4V (Grade 5), ELI, Annealed': tensile yield 790 MPa
			docs:  []string{"MatWeb (ASM)", "ELI, Annealed", "STA Bar", "Johnson 1985 eq. 3.45"},
		},
		{
			m:     SteelD2,
			e:     value(210*GPa, 0.0024, "'AISI D2 cold work tool steel' data sheet: 210 000 MPa at 20 °C"),
			nu:    value(0.28, 0.018, "MakeItFrom 'SAE-AISI D2': 0.28"),
			alpha: value(10.4*perK, 0.0048, "AZoM 'D2 Tool Steel (UNS T30402)': 10.4e-6/°C, 20–100 °C"),
			yield: 2150 * MPa, // 'AISI D2' data sheet, compressive strength table: Rc0.2 = 2150 MPa at 60 HRC
			docs:  []string{"AISI D2 cold work tool steel", "AZoM", "Johnson 1985 eq. 3.45"},
		},
	}
	if len(rows) != len(Materials()) {
		t.Fatalf("%d rows for %d reference materials", len(rows), len(Materials()))
	}
	for _, r := range rows {
		m := r.m
		for _, v := range []struct {
			name string
			got  float64
			s    sourced
		}{{"E", m.E, r.e}, {"ν", m.Nu, r.nu}, {"α", m.Alpha, r.alpha}} {
			if !v.s.check(v.got) {
				t.Errorf("%s: %s = %g, not what the source gives (%s)", m.Name, v.name, v.got, v.s.src)
			}
			// A value recalled is marked so in the Source.
			if strings.Contains(v.s.src, "from memory") && !strings.Contains(m.Source, "from memory") {
				t.Errorf("%s: %s is from memory but the Source does not say so", m.Name, v.name)
			}
		}
		allow := r.allowable
		if r.yield > 0 {
			// First yield, rounded down to three significant digits.
			p := firstYield(m.Nu) * r.yield
			d := math.Pow(10, math.Floor(math.Log10(p))-2)
			allow = value(math.Floor(p/d)*d, 1e-12, "first yield of Johnson 1985 eq. 3.45 times the cited Y")
			if !strings.Contains(m.Source, "derived") {
				t.Errorf("%s: a derived allowable not said to be derived in %q", m.Name, m.Source)
			}
		}
		if !allow.check(m.Allowable) {
			t.Errorf("%s: Allowable = %g Pa, want %g Pa (%s)", m.Name, m.Allowable, allow.want, allow.src)
		}
		// Allowable > 0 exactly when the Source claims one.
		none := strings.Contains(m.Source, "Allowable: none on file")
		if none != (m.Allowable == 0) {
			t.Errorf("%s: Allowable %g Pa, but the Source says %q", m.Name, m.Allowable, m.Source)
		}
		for _, d := range r.docs {
			if !strings.Contains(m.Source, d) {
				t.Errorf("%s: Source does not name %q", m.Name, d)
			}
		}
	}
}

// TestModulusInPa: a Young's modulus below 1e4 Pa (softer than any solid
// that could seat a ball; common practice) is refused naming the body's
// field, with a reading only where it is a plausible modulus (hand
// conversions): 208 is steel's 208 GPa = 2.08e+11 Pa, 1000 read as GPa is
// 1e+12 Pa (about diamond), 3600 is PEEK's 3600 MPa = 3.6e+09 Pa, 9999 MPa
// is 9.999e+09 Pa; 0.5 reads as neither. 1e4 Pa and a soft silicone's
// 0.5 MPa = 5e5 Pa are accepted, with no hint offered on them.
func TestModulusInPa(t *testing.T) {
	for _, tc := range []struct {
		e     float64
		field string
		want  string
	}{
		{208, "b1.Material.E", "208 Pa: a modulus in GPa? 208 GPa is 2.08e+11 Pa"},
		{1000, "b1.Material.E", "1000 Pa: a modulus in GPa? 1000 GPa is 1e+12 Pa"},
		{3600, "b1.Material.E", "3600 Pa: a modulus in MPa? 3600 MPa is 3.6e+09 Pa"},
		{9999, "b1.Material.E", "9999 Pa: a modulus in MPa? 9999 MPa is 9.999e+09 Pa"},
		{0.5, "b1.Material.E", "0.5 Pa; Young's modulus is in Pa, at least 10000 Pa"},
	} {
		_, err := Solve(Sphere(0.003, Material{E: tc.e, Nu: 0.3}), Flat(Steel440C), 10)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, ErrRange) || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("E = %g Pa: %v; want %s refused with %q", tc.e, err, tc.field, tc.want)
		}
		_, err = Solve(Flat(Steel440C), Sphere(0.003, Material{E: tc.e, Nu: 0.3}), 10)
		if !errors.As(err, &ie) || ie.Field != "b2.Material.E" {
			t.Errorf("E = %g Pa as the second body: %v; want b2.Material.E", tc.e, err)
		}
	}
	for _, e := range []float64{1e4, 5e5} {
		if _, err := Solve(Sphere(0.003, Steel52100), Flat(Material{E: e, Nu: 0.49}), 1); err != nil {
			t.Errorf("E = %g Pa: %v; want accepted", e, err)
		}
	}
}
