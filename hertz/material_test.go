package hertz

import (
	"strings"
	"testing"
)

// TestMaterials checks the reference table: every entry named, sourced and
// usable by Solve; ISO 76:2006's 4200 MPa for the bearing steel; and that
// Materials returns a fresh copy.
func TestMaterials(t *testing.T) {
	ms := Materials()
	if len(ms) != 9 {
		t.Fatalf("Materials() has %d entries, want 9", len(ms))
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
