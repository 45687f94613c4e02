package design

import (
	"context"
	"errors"
	"strings"
	"testing"
)

// TestMaxwellKeys: the two Maxwell floors have keys of their own, the old
// key min_maxwell_index is read as min_centre_index, a floor of 1 is
// refused under every key, and the verdicts name the index they compare.
func TestMaxwellKeys(t *testing.T) {
	src := string(readFile(t, "testdata/cassette.json"))
	if !strings.Contains(src, `"min_centre_index": 0.9`) {
		t.Fatal("testdata/cassette.json no longer has min_centre_index 0.9")
	}
	with := func(repl string) string { return strings.Replace(src, `"min_centre_index": 0.9`, repl, 1) }
	for _, tc := range []struct{ name, repl string }{
		{"new key", `"min_centre_index": 0.9`},
		{"old key", `"min_maxwell_index": 0.9`},
	} {
		d, err := Parse([]byte(with(tc.repl)))
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if d.Requirements.MinCentreIndex != 0.9 || d.Requirements.MinContactIndex != 0 {
			t.Errorf("%s: centre %g contact %g, want 0.9 and 0", tc.name, d.Requirements.MinCentreIndex, d.Requirements.MinContactIndex)
		}
	}
	for _, tc := range []struct{ name, repl, path string }{
		{"centre floor 1", `"min_centre_index": 1`, "requirements.min_centre_index"},
		{"contact floor 1", `"min_centre_index": 0.9, "min_contact_index": 1`, "requirements.min_contact_index"},
		{"old key floor 1", `"min_maxwell_index": 1`, "requirements.min_maxwell_index"},
		{"both names", `"min_centre_index": 0.9, "min_maxwell_index": 0.9`, "requirements.min_maxwell_index"},
	} {
		_, err := Parse([]byte(with(tc.repl)))
		var e *Error
		if !errors.As(err, &e) || e.Path != tc.path || !errors.Is(err, ErrRange) {
			t.Errorf("%s: %v, want an Error on %q wrapping ErrRange", tc.name, err, tc.path)
		}
	}
	d, err := Parse([]byte(with(`"min_centre_index": 0.9, "min_contact_index": 0.5`)))
	if err != nil {
		t.Fatal(err)
	}
	d.MonteCarlo = nil
	d.Requirements.MaxStudy = 0
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	// The verdicts carry the weakest index of each kind, as the
	// stability analysis reports it.
	minIdx, minCen := 2.0, 2.0
	for _, m := range ev.Stability.Contacts {
		minIdx, minCen = min(minIdx, m.Index), min(minCen, m.CentreIndex)
	}
	seen := 0
	for _, v := range ev.Verdicts() {
		switch v.Requirement {
		case "requirements.min_centre_index":
			seen++
			if v.Value != minCen || !strings.Contains(v.Note, "ball centre") {
				t.Errorf("centre verdict %+v, want value %g", v, minCen)
			}
		case "requirements.min_contact_index":
			seen++
			if v.Value != minIdx || !strings.Contains(v.Note, "contact point") {
				t.Errorf("contact verdict %+v, want value %g", v, minIdx)
			}
		}
	}
	if seen != 2 {
		t.Errorf("%d Maxwell verdicts, want 2", seen)
	}
}
