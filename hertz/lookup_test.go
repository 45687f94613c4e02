package hertz

import "testing"

// TestMaterialKeys checks that every key finds a reference material, that
// no two keys find the same one, and that every reference material has a
// key: one table of short names, for design files and command lines.
func TestMaterialKeys(t *testing.T) {
	keys := MaterialKeys()
	found := map[string]string{}
	for i, k := range keys {
		if i > 0 && keys[i-1] >= k {
			t.Errorf("MaterialKeys not sorted: %q before %q", keys[i-1], k)
		}
		m, ok := MaterialByKey(k)
		if !ok {
			t.Errorf("MaterialByKey(%q) finds nothing", k)
			continue
		}
		if other, dup := found[m.Name]; dup {
			t.Errorf("%q and %q both find %s", other, k, m.Name)
		}
		found[m.Name] = k
	}
	for _, m := range Materials() {
		if _, ok := found[m.Name]; !ok {
			t.Errorf("reference material %q has no key in lookup.go", m.Name)
		}
	}
	// Two entries by value: the key names the grade.
	if m, _ := MaterialByKey("steel-52100"); m != Steel52100 {
		t.Errorf("steel-52100 = %+v, want Steel52100", m)
	}
	if m, _ := MaterialByKey("steel-440c"); m != Steel440C {
		t.Errorf("steel-440c = %+v, want Steel440C", m)
	}
	for _, bad := range []string{"", "52100", "Steel-52100", "steel-52100 ", "unobtainium"} {
		if _, ok := MaterialByKey(bad); ok {
			t.Errorf("MaterialByKey(%q) finds a material", bad)
		}
	}
}
