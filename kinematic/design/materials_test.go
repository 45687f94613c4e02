package design

import (
	"testing"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestMaterialKeys checks that every reference material of package hertz
// has exactly one key, and that each key reads as that material with
// hertz's values (one place for the data).
func TestMaterialKeys(t *testing.T) {
	table := hertz.Materials()
	keys := hertz.MaterialKeys()
	if len(keys) != len(table) {
		t.Errorf("%d keys for %d reference materials", len(keys), len(table))
	}
	for _, m := range table {
		n := 0
		for _, key := range keys {
			got, ok := lookupMaterial(key)
			if ok && got.Name == m.Name {
				n++
				if got != m {
					t.Errorf("key %q reads %+v, want hertz's %+v", key, got, m)
				}
				if k, ok := keyOf(m); !ok || k != key {
					t.Errorf("keyOf(%s) = %q, %v; want %q", m.Name, k, ok, key)
				}
			}
		}
		if n != 1 {
			t.Errorf("%s has %d keys, want 1", m.Name, n)
		}
	}
	if _, ok := lookupMaterial("unobtainium"); ok {
		t.Error("an unknown key was found")
	}
	changed := hertz.Steel52100
	changed.E *= 1.01
	if _, ok := keyOf(changed); ok {
		t.Error("a material that differs from the table was given a key")
	}
}

// TestMaterialFromFile checks that a key and an inline object give the
// materials they name.
func TestMaterialFromFile(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/socket.json"))
	if err != nil {
		t.Fatal(err)
	}
	if d.Balls[0].Material != hertz.SiliconNitride || d.Seats[0].Material != hertz.TungstenCarbide {
		t.Errorf("table materials %+v, %+v", d.Balls[0].Material, d.Seats[0].Material)
	}
	want := hertz.Material{Name: "ball of a tool steel", E: 210e9, Nu: 0.29, Alpha: 11e-6, Allowable: 3.5e9, Source: "test fixture, invented"}
	if d.Balls[2].Material != want {
		t.Errorf("inline material %+v, want %+v", d.Balls[2].Material, want)
	}
}
