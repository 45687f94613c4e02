package design

import (
	"strings"

	"github.com/sixfold-dev/sixfold/hertz"
)

// The file's material keys are package hertz's short keys
// (hertz.MaterialKeys), the same names the example programs take on the
// command line; the values come from hertz's table.

// lookupMaterial returns the reference material of the key.
func lookupMaterial(key string) (hertz.Material, bool) {
	return hertz.MaterialByKey(key)
}

// keyOf returns the key of a material equal to a reference material in
// every field, for the canonical writer.
func keyOf(m hertz.Material) (string, bool) {
	for _, key := range hertz.MaterialKeys() {
		if t, ok := hertz.MaterialByKey(key); ok && t == m {
			return key, true
		}
	}
	return "", false
}

// keyList returns the material keys, sorted, for messages.
func keyList() string {
	return strings.Join(hertz.MaterialKeys(), ", ")
}
