package hertz

import "sort"

// materialKeys maps the short key of each reference material, the name a
// design file and a command line use for it, to the material's Name; the
// values themselves come from Materials, so they are kept in one place.
// Keys are lower case: letters, digits and "-".
var materialKeys = map[string]string{
	"steel-52100":       Steel52100.Name,
	"steel-440c":        Steel440C.Name,
	"silicon-nitride":   SiliconNitride.Name,
	"tungsten-carbide":  TungstenCarbide.Name,
	"sapphire":          Sapphire.Name,
	"fused-silica":      FusedSilica.Name,
	"aluminium-6061-t6": Aluminium6061T6.Name,
	"invar-36":          Invar36.Name,
	"ti-6al-4v":         Ti6Al4V.Name,
	"steel-d2":          SteelD2.Name,
}

// MaterialByKey returns the reference material whose short key is key
// ("steel-52100", "steel-440c", "silicon-nitride"; see MaterialKeys), and
// whether there is one. The match is exact: keys are lower case.
func MaterialByKey(key string) (Material, bool) {
	name, ok := materialKeys[key]
	if !ok {
		return Material{}, false
	}
	for _, m := range Materials() {
		if m.Name == name {
			return m, true
		}
	}
	return Material{}, false
}

// MaterialKeys returns the short keys of the reference materials, sorted;
// MaterialByKey finds the material of each.
func MaterialKeys() []string {
	keys := make([]string, 0, len(materialKeys))
	for k := range materialKeys {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	return keys
}
