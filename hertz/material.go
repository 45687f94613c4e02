package hertz

import (
	"math"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// Material is an isotropic linear-elastic solid.
type Material struct {
	Name      string
	E         float64 // Young's modulus, Pa; math.Inf(1) for a rigid body
	Nu        float64 // Poisson's ratio, in (−1, 0.5]
	Alpha     float64 // linear thermal expansion coefficient near 20 °C, 1/K (not used by Solve; for error budgets)
	Allowable float64 // allowable static peak contact pressure, Pa, where a published source gives one; 0 means no allowable on file
	Source    string  // where the values come from
}

// Reference materials. The values are typical room-temperature figures for
// the named grade; real stock varies by a few per cent (E) and more (α), so
// use certified data for a final design. Every entry names its source;
// "from memory" marks handbook figures recalled rather than copied from a
// document at hand, which should be checked before they are relied on.
//
// Allowable is set only where a published source gives a figure for the
// material: ISO 76:2006 (Rolling bearings — Static load ratings), for
// bearings of "contemporary, commonly used, high quality, hardened bearing
// steel" (its scope), defines the basic static load rating of ball bearings
// other than self-aligning ones as the load that produces a calculated
// contact stress of 4200 MPa at the centre of the most heavily loaded
// contact (4600 MPa for self-aligning ball bearings, 4000 MPa for roller
// bearings), a level at which the permanent deformation of rolling element
// and raceway together is about 1/10 000 of the rolling-element diameter
// (stated in the abstract of ISO 20056-2:2017, as DIN ISO 20056-2:2019).
// The other entries leave Allowable at 0, no allowable on file; each
// Source says why.
var (
	// Steel52100 is through-hardened bearing steel AISI 52100 (100Cr6).
	Steel52100 = Material{
		Name: "AISI 52100 bearing steel", E: 208e9, Nu: 0.30, Alpha: 11.9e-6,
		Allowable: 4200e6,
		Source: "E, ν, α: typical bearing-steel data, from memory; Allowable: ISO 76:2006, basic static load rating of " +
			"ball bearings other than self-aligning (4200 MPa calculated contact stress; permanent deformation about " +
			"1/10 000 of the ball diameter per the abstract of ISO 20056-2:2017)",
	}
	// Steel440C is hardened martensitic stainless steel AISI 440C.
	Steel440C = Material{
		Name: "AISI 440C stainless steel", E: 200e9, Nu: 0.28, Alpha: 10.2e-6,
		Source: "E, ν, α: typical handbook data (ASM), from memory; Allowable: none on file (ISO 76:2006 covers " +
			"hardened bearing steel in general and names no figure for 440C; a bearing vendor's note rates 440C " +
			"bearings about 20 % below chrome steel in load capacity, common practice, without a contact stress)",
	}
	// SiliconNitride is hot-isostatically-pressed bearing-grade Si3N4.
	SiliconNitride = Material{
		Name: "silicon nitride (HIP, bearing grade)", E: 310e9, Nu: 0.27, Alpha: 3.2e-6,
		Source: "E, ν, α: typical bearing-grade Si3N4 data (ASTM F2094 class materials), from memory; Allowable: none " +
			"on file (ISO 20056-2:2017 rates hybrid bearings, Si3N4 rolling elements on steel rings, by a " +
			"permissible Hertzian stress slightly above ISO 76's, set by the steel raceway; its value was not at hand)",
	}
	// TungstenCarbide is cemented tungsten carbide with about 6 % cobalt.
	TungstenCarbide = Material{
		Name: "tungsten carbide (WC–6%Co)", E: 620e9, Nu: 0.22, Alpha: 5.0e-6,
		Source: "E, ν, α: typical cemented-carbide data, from memory; Allowable: none on file",
	}
	// Sapphire is single-crystal alumina treated as isotropic: its modulus
	// varies with direction (about 350–470 GPa) and α differs along and
	// across the c axis; the figures are a direction average.
	Sapphire = Material{
		Name: "sapphire (isotropic approximation)", E: 400e9, Nu: 0.27, Alpha: 5.3e-6,
		Source: "E, ν, α: isotropic approximation of single-crystal Al2O3, from memory; Allowable: none on file",
	}
	// FusedSilica is synthetic fused silica (amorphous SiO2).
	FusedSilica = Material{
		Name: "fused silica", E: 72.7e9, Nu: 0.16, Alpha: 0.55e-6,
		Source: "E, ν, α: typical synthetic fused silica data, from memory; Allowable: none on file",
	}
	// Aluminium6061T6 is aluminium alloy 6061 in the T6 temper.
	Aluminium6061T6 = Material{
		Name: "aluminium 6061-T6", E: 68.9e9, Nu: 0.33, Alpha: 23.6e-6,
		Source: "E, ν, α: typical handbook data (ASM), from memory; Allowable: none on file",
	}
	// Invar36 is the low-expansion iron–36 % nickel alloy (annealed).
	Invar36 = Material{
		Name: "Invar 36", E: 141e9, Nu: 0.26, Alpha: 1.3e-6,
		Source: "E, ν, α: typical handbook data (20–100 °C expansion), from memory; Allowable: none on file",
	}
	// Ti6Al4V is titanium alloy Ti-6Al-4V (grade 5, annealed).
	Ti6Al4V = Material{
		Name: "titanium Ti-6Al-4V", E: 113.8e9, Nu: 0.342, Alpha: 8.6e-6,
		Source: "E, ν, α: typical handbook data (ASM), from memory; Allowable: none on file",
	}
)

// Materials returns a fresh copy of the reference materials, in the order
// of their declaration; changing it does not change the package variables.
func Materials() []Material {
	return []Material{
		Steel52100, Steel440C, SiliconNitride, TungstenCarbide, Sapphire,
		FusedSilica, Aluminium6061T6, Invar36, Ti6Al4V,
	}
}

// checkMaterial validates a material; name is the body's field ("b1").
func checkMaterial(m *Material, name string) error {
	// The common case in one test: x − x == 0 holds exactly for finite x.
	if m.E > 0 && m.Nu > -1 && m.Nu <= 0.5 && m.Alpha-m.Alpha == 0 && m.Allowable >= 0 && m.Allowable-m.Allowable == 0 {
		return nil
	}
	switch {
	case math.IsNaN(m.E):
		return nonFiniteErr(name+".Material.E", "Young's modulus is NaN")
	case !(m.E > 0):
		return rangeErr(name+".Material.E", "Young's modulus must be positive (or +Inf for a rigid body), got %g", m.E)
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
