package kinematic

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestAllowableNeedsBothBodies: a contact's allowable peak pressure is the
// smaller of its two bodies' allowables, and a contact with one body that
// has none on file (a sapphire flank under a 52100 ball) is not judged by
// the steel's figure: Allowable and PressureRatio are 0, and the
// scorecard marks the pressure ratio unavailable.
func TestAllowableNeedsBothBodies(t *testing.T) {
	clamp := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 40}}
	lc := LoadCase{PreloadFactor: 1}
	for _, tc := range []struct {
		name string
		seat hertz.Material
		want float64 // Pa
	}{
		// ISO 76:2006, clause 3: 4200 MPa for ball bearings other than
		// self-aligning, the figure both steels carry.
		{"52100 on 440C", hertz.Steel440C, 4200e6},
		// No contact allowable for sapphire (hertz.Sapphire.Source).
		{"52100 on sapphire", hertz.Sapphire, 0},
	} {
		v := vee45
		v.Material = tc.seat
		c, err := BisectorVees(equilateral(), three(v))
		if err != nil {
			t.Fatal(err)
		}
		cs, err := c.Contacts()
		if err != nil {
			t.Fatal(err)
		}
		m, err := NewModel(cs, clamp, Payload{})
		if err != nil {
			t.Fatal(err)
		}
		st, err := m.Statics(lc)
		if err != nil {
			t.Fatal(err)
		}
		for _, cl := range st.Contacts {
			if cl.Allowable != tc.want {
				t.Errorf("%s: %s allowable %g Pa, want %g Pa", tc.name, cl.Label, cl.Allowable, tc.want)
			}
			if (cl.PressureRatio == 0) != (tc.want == 0) {
				t.Errorf("%s: %s pressure ratio %g with allowable %g", tc.name, cl.Label, cl.PressureRatio, cl.Allowable)
			}
		}
		card, err := c.Score(Scenario{Preloads: clamp})
		if err != nil {
			t.Fatal(err)
		}
		if got := card.Unavailable.Has(FigurePressureRatio); got != (tc.want == 0) {
			t.Errorf("%s: pressure ratio unavailable %v", tc.name, got)
		}
	}
}
