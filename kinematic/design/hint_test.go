package design

import (
	"errors"
	"strings"
	"testing"
)

// TestUnitHint: a quantity string that does not start with a number is
// refused with an example in the field's usual unit and that example's
// value in SI units, converted by hand: 12.7 mm = 0.0127 m; 12.7 deg =
// 12.7·π/180 = 0.2216568 rad (printed to six digits); 12.7 g = 0.0127 kg; 12.7 N is
// already SI.
func TestUnitHint(t *testing.T) {
	for _, tc := range []struct {
		kind *quantityKind
		want string
	}{
		{length, `"12.7 mm", which is 0.0127 m`},
		{angle, `"12.7 deg", which is 0.221657 rad`},
		{mass, `"12.7 g", which is 0.0127 kg`},
		{force, `"12.7 N", which is 12.7 N`},
	} {
		_, err := parseQuantity("about five", tc.kind)
		if !errors.Is(err, ErrUnit) || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: %v, want the hint %s", tc.kind.what, err, tc.want)
		}
	}
}

// TestNotesUseThePointName: a verdict about the point of interest names it
// as the file does ("point_name"), and says "point of interest" without it.
func TestNotesUseThePointName(t *testing.T) {
	for _, tc := range []struct {
		name, want string
	}{{"", "at the point of interest"}, {"mirror vertex", "at the mirror vertex"}} {
		d := editFixture(t, "testdata/equilateral.json", set("monte_carlo.samples", 1000))
		d.PointName = tc.name
		_, v := verdict(t, d, "requirements.max_error.worst_case")
		if !strings.HasPrefix(v.Note, tc.want) {
			t.Errorf("point_name %q: note %q, want it to start %q", tc.name, v.Note, tc.want)
		}
	}
}
