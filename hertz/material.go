package hertz

import (
	"fmt"
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Material is an isotropic linear-elastic solid.
type Material struct {
	Name      string
	E         float64 // Young's modulus, Pa, at least 1e4 (208 GPa is 208e9); math.Inf(1) for a rigid body
	Nu        float64 // Poisson's ratio, in (−1, 0.5]
	Alpha     float64 // linear thermal expansion coefficient near 20 °C, 1/K (not used by Solve; for error budgets)
	Allowable float64 // allowable static peak contact pressure, Pa, where a published figure or a cited strength supports one; 0 means no allowable on file
	Source    string  // where each value comes from: a document named with its table or clause, or "from memory"
}

// Reference materials. The values are room-temperature figures for the named
// grade; real stock varies by a few per cent (E) and more (α), so use
// certified data for a final design. Each Source says, value by value, where
// the figure comes from: a standard or a data sheet named with its table or
// clause; or "from memory" for a handbook figure recalled and not found in a
// document at hand, with the range the documents read do give, so the reader
// knows what was and was not checked.
//
// Allowable is the peak Hertz pressure p0 a contact on the material may
// carry statically, set only where a published figure or a published
// strength supports one. Two criteria are used, and each Source says which:
//
//   - ISO 76:2006 (Rolling bearings — Static load ratings), clause 3: the
//     basic static load rating of ball bearings other than self-aligning
//     ones is the load that produces a calculated contact stress of 4200 MPa
//     at the centre of the most heavily loaded contact (4600 MPa for
//     self-aligning ball bearings, 4000 MPa for roller bearings), at which
//     the total permanent deformation of rolling element and raceway is about
//     0.0001 of the rolling-element diameter. Its scope is hardened bearing
//     steel; it is used for the bearing steels.
//   - First yield: for the other metals, Allowable is the p0 at which the
//     material first yields under the surface of a circular contact,
//     p0 = Y/max|σz − σr| over depth on the load axis, with Y the uniaxial
//     yield (0.2 % proof) strength and the axis stresses of Johnson (1985)
//     eq. 3.45 for the material's ν (on the axis σr = σθ, so Tresca and von
//     Mises give the same value there): 1.589 Y at ν = 0.28, 1.613 Y at
//     ν = 0.30, 1.649 Y at ν = 0.33, 1.664 Y at ν = 0.342. The figure is
//     rounded down to three digits. For ν up to 0.342 the circle has the
//     largest peak shear per p0 (a line contact has 0.300 p0, Johnson 1985
//     §4.2, from memory), so the factor holds for elongated contacts too.
//     First yield is a stricter criterion than ISO 76's small permanent
//     set: a bearing steel at 4200 MPa is past first yield.
//
// The brittle materials (silicon nitride, tungsten carbide, sapphire, fused
// silica) have no allowable on file: they do not yield but crack at the edge
// of the contact under the radial tension there, and no standard or
// handbook figure for a static contact pressure was found; each Source says
// what was found. The other body's allowable says nothing of the brittle
// one, so a pair with such a body has no allowable to be judged by.
var (
	// Steel52100 is through-hardened bearing steel AISI 52100 (100Cr6).
	Steel52100 = Material{
		Name: "AISI 52100 bearing steel", E: 208e9, Nu: 0.30, Alpha: 11.9e-6,
		Allowable: 4200e6,
		Source: "E: 208 GPa from memory, inside the 190–210 GPa of the 52100 data sheets read (Stindia, " +
			"'Differences between 52100 & E52100 steel'; Lucefin '100Cr6 technical card' (EN ISO 683-17, 1.3505): " +
			"210 GPa; a ball maker's 'AISI 52100 Chrome Steel' sheet: 29.5e6 psi = 203 GPa); ν: 0.30, Lucefin " +
			"'100Cr6 technical card'; α: 11.9e-6/K from memory, unchecked: the Lucefin card gives 11.4e-6/K, in a " +
			"temperature column not legible in the copy read; Allowable: 4200 MPa, ISO 76:2006 " +
			"clause 3, basic static load rating of ball bearings other than self-aligning (calculated contact stress " +
			"4200 MPa; total permanent deformation about 0.0001 of the ball diameter, per the note there)",
	}
	// Steel440C is hardened martensitic stainless steel AISI 440C
	// (X105CrMo17, 1.4125).
	Steel440C = Material{
		Name: "AISI 440C stainless steel", E: 200e9, Nu: 0.28, Alpha: 10.1e-6,
		Allowable: 4200e6,
		Source: "E: 200 GPa, MakeItFrom.com 'Annealed 440C Stainless Steel' and Qinghe Steels '440C stainless " +
			"steel' (physical properties table); ν: 0.28, MakeItFrom.com 'Annealed 440C Stainless Steel'; α: 10.1e-6/K " +
			"(0–100 °C), Qinghe Steels (same table; Rolled Alloys '440C Stainless' data sheet: 5.6e-6/°F from " +
			"70 °F = 10.1e-6/K); Allowable: 4200 MPa, ISO 76:2006 clause 3 as for " +
			"AISI 52100, whose scope is hardened bearing steel; ISO 683-17:2014 (ball and roller bearing steels) " +
			"counts stainless bearing steels among its five groups (scope), but whether it lists the 440C grade " +
			"by name was not checked. Vendors rate 440C bearings about 20 % below chrome steel in load capacity " +
			"(Tarso, 'steel bearing material'), which is about 7 % in contact stress (load ∝ p0³)",
	}
	// SiliconNitride is hot-isostatically-pressed bearing-grade Si3N4.
	SiliconNitride = Material{
		Name: "silicon nitride (HIP, bearing grade)", E: 310e9, Nu: 0.27, Alpha: 3.2e-6,
		Source: "E, ν, α: 310 GPa, 0.27, 3.2e-6/K from memory (ASTM F2094 class material; the standard's " +
			"property table was not read), inside the ranges read (MakeItFrom.com 'Silicon Nitride (Si3N4)': " +
			"140–310 GPa over its variants, ν 0.24–0.27, α 2.5–3.2e-6/K; Lily Bearing 'Ceramic Materials and " +
			"Their Properties', bearing-grade Si3N4: 300–315 GPa, but α 2.2–3.0e-6/K); Allowable: none on file. ISO " +
			"20056-2:2017 (hybrid bearings, Si3N4 rolling elements on steel rings) sets a permissible Hertzian " +
			"stress slightly above ISO 76's, because the ceramic element does not deform plastically (its abstract, " +
			"DIN ISO 20056-2:2019); that figure was not at hand and rates the steel raceway, not the ceramic; no " +
			"source was found for Si3N4 on Si3N4",
	}
	// TungstenCarbide is cemented tungsten carbide with about 6 % cobalt.
	TungstenCarbide = Material{
		Name: "tungsten carbide (WC–6%Co)", E: 620e9, Nu: 0.22, Alpha: 5.0e-6,
		Source: "E, ν, α: 620 GPa, 0.22, 5.0e-6/K from memory, unchecked for WC–6%Co: the pages read give " +
			"530–700 GPa for tungsten carbide (Matmake), and 630 GPa, 0.24, 5.4e-6/K for WC without binder " +
			"(MakeItFrom.com 'Tungsten Carbide (WC)'); Allowable: none on file (no standard or handbook contact " +
			"allowable found; the compressive strengths quoted, 2.7–4.8 GPa, disagree and are not contact figures)",
	}
	// Sapphire is single-crystal alumina treated as isotropic: its modulus
	// varies with direction and α differs along and across the c axis; the
	// figures are a direction average. Ruby, alumina doped with chromium, is
	// listed with the same figures by its makers.
	Sapphire = Material{
		Name: "sapphire (isotropic approximation)", E: 400e9, Nu: 0.27, Alpha: 5.3e-6,
		Source: "E: 400 GPa from memory, a direction average; data sheets read give 335 GPa (Uni-Optics " +
			"'Sapphire Crystals'), 345 GPa (Roditi 'Sapphire Properties'; Valley Design) and 450 GPa " +
			"(MakeItFrom.com 'Synthetic Sapphire'); ν: 0.27 from memory, inside the 0.25–0.30 read (Uni-Optics " +
			"0.25, Valley Design 0.29); α: 5.3e-6/K, MakeItFrom.com 'Synthetic Sapphire' (5.0e-6/K across and " +
			"6.66e-6/K along the c axis at 323 K, SPI Supplies sapphire substrate sheet); Allowable: none on " +
			"file (brittle; the 2.0 GPa compressive strength of the data sheets is not a contact figure)",
	}
	// FusedSilica is synthetic fused silica (amorphous SiO2).
	FusedSilica = Material{
		Name: "fused silica", E: 72.7e9, Nu: 0.16, Alpha: 0.52e-6,
		Source: "E, ν: 72.7 GPa, 0.16 from memory (MakeItFrom.com 'Fused Silica' gives 73 GPa, 0.17); α: " +
			"0.52e-6/K over 5–35 °C, Präzisions Glas & Optik as quoted by Translume 'Fused Silica Material " +
			"Properties' (0.57e-6/K over 0–200 °C); Allowable: none on file (brittle; no contact figure found)",
	}
	// Aluminium6061T6 is aluminium alloy 6061 in the T6 temper.
	Aluminium6061T6 = Material{
		Name: "aluminium 6061-T6", E: 68.9e9, Nu: 0.33, Alpha: 23.6e-6,
		Allowable: 397e6,
		Source: "E, ν, α: 68.9 GPa, 0.33, 23.6e-6/K (20–100 °C), MatWeb data sheet 'Aluminum 6061-T6; " +
			"6061-T651' (E and α marked 'AA; Typical', ν 'estimated from trends'), read as reproduced by Glemco " +
			"and MFG Proto; Allowable: 397 MPa derived, first yield 1.649 Y at ν = 0.33 (Johnson 1985 eq. 3.45) " +
			"with Y = 35 000 psi = 241 MPa, the minimum yield of 6061-T6 in 49 CFR §178.46 Table 2; the " +
			"typical 276 MPa of the MatWeb sheet would give 455 MPa",
	}
	// Invar36 is the low-expansion iron–36 % nickel alloy (annealed).
	Invar36 = Material{
		Name: "Invar 36", E: 141e9, Nu: 0.26, Alpha: 1.3e-6,
		Source: "E: 20.5e6 psi = 141 GPa, 'INVAR 36 Technical Data Sheet' (as read on Scribd); ν: 0.26 from " +
			"memory, unchecked; α: 1.3e-6/K from memory, inside the spread of the sheets read (1.18e-6/K " +
			"25–100 °C, same sheet; 1.5e-6/K 20–100 °C, Nilo 36; 1.93e-6/K 30–100 °C, CarTech via Efinea), " +
			"which depends on heat treatment; Allowable: none on file (annealed Invar is soft, yield 230–350 MPa " +
			"per Efinea; a first-yield figure could be derived as for the aluminium, but ν is unchecked)",
	}
	// Ti6Al4V is titanium alloy Ti-6Al-4V (grade 5, annealed).
	Ti6Al4V = Material{
		Name: "titanium Ti-6Al-4V", E: 113.8e9, Nu: 0.342, Alpha: 8.6e-6,
		Allowable: 1310e6,
		Source: "E, ν: 113.8 GPa, 0.342, MatWeb (ASM) data sheet 'Titanium Ti-6Al-4V (Grade 5), ELI, " +
			"Annealed'; α: 8.6e-6/K (20–100 °C), MatWeb (ASM) 'Titanium Ti6Al4V (Grade 5), STA Bar'; Allowable: " +
			"1310 MPa derived, first yield 1.664 Y at ν = 0.342 (Johnson 1985 eq. 3.45) with Y = 790 MPa, the " +
			"tensile yield of the ELI annealed sheet (the grade 5 annealed bar sheet gives 830 MPa)",
	}
	// SteelD2 is cold-work tool steel AISI D2 (1.2379) hardened to 60 HRC,
	// for balls, vee blocks and flats ground from tool steel.
	SteelD2 = Material{
		Name: "AISI D2 tool steel, 60 HRC", E: 210e9, Nu: 0.28, Alpha: 10.4e-6,
		Allowable: 3410e6,
		Source: "E: 210 GPa at 20 °C and compressive yield Rc0.2 = 2150 MPa at 60 HRC, 'AISI D2 cold work " +
			"tool steel' data sheet (W.-Nr. 1.2379; as read on Scribd, its compressive strength table); ν: 0.28, " +
			"MakeItFrom.com 'SAE-AISI D2'; α: 10.4e-6/K (20–100 °C), AZoM 'D2 Tool Steel (UNS T30402)'; " +
			"Allowable: 3410 MPa derived, first yield 1.589 Y at ν = 0.28 (Johnson 1985 eq. 3.45) with " +
			"Y = 2150 MPa",
	}
)

// Materials returns a fresh copy of the reference materials, in the order
// of their declaration; changing it does not change the package variables.
func Materials() []Material {
	return []Material{
		Steel52100, Steel440C, SiliconNitride, TungstenCarbide, Sapphire,
		FusedSilica, Aluminium6061T6, Invar36, Ti6Al4V, SteelD2,
	}
}

// minModulus is the smallest Young's modulus accepted, Pa. Soft silicones
// and gels that could still carry a ball lie down to about 1e5 Pa and
// below (common practice, not a cited value), and the balls and seats of a
// kinematic coupling (steels, ceramics, glasses, aluminium, polymers of a
// few GPa) far above, so a figure under 1e4 Pa is no solid that could seat
// a ball: it is a modulus written in GPa or MPa as if it were in Pa (208
// for 208 GPa).
const minModulus = 1e4

// checkMaterial validates a material; name is the body's field ("b1").
func checkMaterial(m *Material, name string) error {
	// The common case in one test: x − x == 0 holds exactly for finite x.
	if m.E >= minModulus && m.Nu > -1 && m.Nu <= 0.5 && m.Alpha-m.Alpha == 0 && m.Allowable >= 0 && m.Allowable-m.Allowable == 0 {
		return nil
	}
	switch {
	case math.IsNaN(m.E):
		return nonFiniteErr(name+".Material.E", "Young's modulus is NaN")
	case !(m.E > 0):
		return rangeErr(name+".Material.E", "Young's modulus must be positive (or +Inf for a rigid body), got %g", m.E)
	case m.E < minModulus:
		// A reading is offered only where it is a plausible modulus: from
		// 1 to 1000 the figure read as GPa is 1 GPa to 1 TPa (polymers to
		// diamond, about 1200 GPa, from memory); from 1000 to 1e4 read as
		// MPa it is 1 to 10 GPa (polymers). Below 1 it is no modulus in
		// either.
		hint := ""
		switch {
		case m.E > 1000:
			hint = fmt.Sprintf(": a modulus in MPa? %g MPa is %g Pa", m.E, m.E*1e6)
		case m.E >= 1:
			hint = fmt.Sprintf(": a modulus in GPa? %g GPa is %g Pa", m.E, m.E*1e9)
		}
		return rangeErr(name+".Material.E", "%g Pa%s; Young's modulus is in Pa, at least %g Pa (softer than any solid that could seat a ball)", m.E, hint, float64(minModulus))
	case !linalg.Finite(m.Nu):
		return nonFiniteErr(name+".Material.Nu", "Poisson's ratio must be finite, in (-1, 0.5], got %g", m.Nu)
	case !(m.Nu > -1 && m.Nu <= 0.5):
		return rangeErr(name+".Material.Nu", "Poisson's ratio must be in (-1, 0.5], got %g", m.Nu)
	case !linalg.Finite(m.Alpha):
		return nonFiniteErr(name+".Material.Alpha", "expansion coefficient must be finite, got %g", m.Alpha)
	case !linalg.Finite(m.Allowable):
		return nonFiniteErr(name+".Material.Allowable", "allowable pressure must be finite and ≥ 0, got %g", m.Allowable)
	case m.Allowable < 0:
		return rangeErr(name+".Material.Allowable", "allowable pressure must be finite and ≥ 0, got %g", m.Allowable)
	}
	return nil
}

// compliance returns (1−ν²)/E and (2−ν)/G = 2(2−ν)(1+ν)/E; both are 0 for a
// rigid body. 1 − ν² is formed as (1 − ν)(1 + ν), exact to a rounding for
// ν near −1, where 1 − ν·ν would cancel (to 5e-14 relative at ν = −0.999).
func compliance(m *Material) (normal, shear float64) {
	if math.IsInf(m.E, 1) {
		return 0, 0
	}
	return (1 - m.Nu) * (1 + m.Nu) / m.E, 2 * (2 - m.Nu) * (1 + m.Nu) / m.E
}
