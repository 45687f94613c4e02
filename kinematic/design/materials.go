package design

import (
	"sort"
	"strings"

	"github.com/sixfold-dev/sixfold/hertz"
)

// materialKeys maps the file's material keys to the names of the
// reference materials of package hertz (hertz.Materials); the values
// themselves come from that table, so they are kept in one place.
var materialKeys = map[string]string{
	"steel-52100":       hertz.Steel52100.Name,
	"steel-440c":        hertz.Steel440C.Name,
	"silicon-nitride":   hertz.SiliconNitride.Name,
	"tungsten-carbide":  hertz.TungstenCarbide.Name,
	"sapphire":          hertz.Sapphire.Name,
	"fused-silica":      hertz.FusedSilica.Name,
	"aluminium-6061-t6": hertz.Aluminium6061T6.Name,
	"invar-36":          hertz.Invar36.Name,
	"ti-6al-4v":         hertz.Ti6Al4V.Name,
	"steel-d2":          hertz.SteelD2.Name,
}

// lookupMaterial returns the reference material of the key.
func lookupMaterial(key string) (hertz.Material, bool) {
	name, ok := materialKeys[key]
	if !ok {
		return hertz.Material{}, false
	}
	for _, m := range hertz.Materials() {
		if m.Name == name {
			return m, true
		}
	}
	return hertz.Material{}, false
}

// keyOf returns the key of a material equal to a reference material in
// every field, for the canonical writer.
func keyOf(m hertz.Material) (string, bool) {
	for key := range materialKeys {
		if t, ok := lookupMaterial(key); ok && t == m {
			return key, true
		}
	}
	return "", false
}

// keyList returns the material keys, sorted, for messages.
func keyList() string {
	keys := make([]string, 0, len(materialKeys))
	for k := range materialKeys {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	return strings.Join(keys, ", ")
}
