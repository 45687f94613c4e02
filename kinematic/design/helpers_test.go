package design

import (
	"encoding/json"
	"os"
	"strconv"
	"strings"
	"testing"
)

// baseJSON is a small valid design that the malformed-file tests change
// one entry at a time: an equilateral three-vee coupling (see
// testdata/equilateral.json for the same layout with its closed forms).
const baseJSON = `{
  "format": "sixfold.design/1",
  "balls": [
    {"name": "A", "centre": ["0 mm", "50 mm", 0], "radius": "6.35 mm", "material": "steel-52100"},
    {"name": "B", "centre": ["-43.30127018922193 mm", "-25 mm", 0], "radius": "6.35 mm", "material": "steel-52100"},
    {"name": "C", "centre": ["43.30127018922193 mm", "-25 mm", 0], "radius": "6.35 mm", "material": "steel-52100"}
  ],
  "seats": [
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-52100"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-52100"},
    {"type": "vee", "half_angle": "45 deg", "azimuth": 0, "material": "steel-52100"}
  ],
  "preloads": [{"point": [0, 0, "20 mm"], "direction": [0, 0, -1], "force": "300 N"}],
  "payload": {"mass": "2 kg", "inertia": {"xx": 4e-3, "yy": 4e-3, "zz": 6e-3}},
  "cases": [{"name": "seated", "gravity": [0, 0, "-1 g"]}],
  "tolerances": [{"dimension": "A.Ball.Radius", "value": "1 um"}],
  "requirements": {"min_shock": {"level": "5 g"}}
}`

// edit returns baseJSON with change applied to its decoded form.
func edit(t *testing.T, change func(m map[string]any)) string {
	t.Helper()
	var m map[string]any
	if err := json.Unmarshal([]byte(baseJSON), &m); err != nil {
		t.Fatal(err)
	}
	change(m)
	b, err := json.Marshal(m)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// at returns the container holding the last element of path
// ("seats[2].half_angle", "payload.inertia.xx") and that element's key
// or index, creating objects on the way.
func at(m map[string]any, path string) (container any, key string) {
	var cur any = m
	parts := splitPath(path)
	for _, p := range parts[:len(parts)-1] {
		next := child(cur, p)
		if next == nil {
			next = map[string]any{}
			setChild(cur, p, next)
		}
		cur = next
	}
	return cur, parts[len(parts)-1]
}

// splitPath splits "a.b[2].c" into "a", "b", "2", "c".
func splitPath(path string) []string {
	path = strings.ReplaceAll(path, "[", ".")
	path = strings.ReplaceAll(path, "]", "")
	return strings.Split(path, ".")
}

func child(c any, k string) any {
	switch c := c.(type) {
	case map[string]any:
		return c[k]
	case []any:
		i, _ := strconv.Atoi(k)
		return c[i]
	}
	return nil
}

func setChild(c any, k string, v any) {
	switch c := c.(type) {
	case map[string]any:
		c[k] = v
	case []any:
		i, _ := strconv.Atoi(k)
		c[i] = v
	}
}

// set returns a change that sets the entry at path to v.
func set(path string, v any) func(map[string]any) {
	return func(m map[string]any) {
		c, k := at(m, path)
		setChild(c, k, v)
	}
}

// del returns a change that removes the member at path.
func del(path string) func(map[string]any) {
	return func(m map[string]any) {
		c, k := at(m, path)
		if o, ok := c.(map[string]any); ok {
			delete(o, k)
		}
	}
}

// both returns a change that applies every change in turn.
func both(changes ...func(map[string]any)) func(map[string]any) {
	return func(m map[string]any) {
		for _, c := range changes {
			c(m)
		}
	}
}

// readFile returns the bytes of a test file.
func readFile(t testing.TB, name string) []byte {
	t.Helper()
	b, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

func jsonUnmarshal(s string, v any) error { return json.Unmarshal([]byte(s), v) }
