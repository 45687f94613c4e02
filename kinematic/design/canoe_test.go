package design

import (
	"bytes"
	"errors"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestOverlapAndCanoe: the cassette's balls given a radius of 0.2 m (a
// length meant in other units) overlap, since its balls lie less than
// 0.4 m apart: Build refuses the design naming both balls in the file's
// terms. Marked as canoe balls (segments of 0.2 m spheres), the same
// geometry can exist and builds; "canoe" survives Write and Parse.
func TestOverlapAndCanoe(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/cassette.json"))
	if err != nil {
		t.Fatal(err)
	}
	for i := range d.Balls {
		d.Balls[i].Radius = 0.2
	}
	_, err = d.Build()
	var e *Error
	if !errors.As(err, &e) || e.Path != "balls[1]" || e.Other != "balls[0]" || !errors.Is(err, kinematic.ErrRange) {
		t.Fatalf("overlapping balls: %v; want an Error on balls[1], other balls[0], wrapping ErrRange", err)
	}
	for i := range d.Balls {
		d.Balls[i].Canoe = true
	}
	if _, err := d.Build(); err != nil {
		t.Fatalf("canoe balls: %v", err)
	}
	var buf bytes.Buffer
	if err := d.Write(&buf); err != nil {
		t.Fatal(err)
	}
	back, err := Parse(buf.Bytes())
	if err != nil {
		t.Fatal(err)
	}
	for i, b := range back.Balls {
		if !b.Canoe {
			t.Errorf("balls[%d]: canoe lost in Write and Parse", i)
		}
	}
}
