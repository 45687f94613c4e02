package kinematic

import (
	"errors"
	"fmt"
	"math"
	"os"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestImpossibleGeometry checks that Contacts refuses geometry that cannot
// exist and accepts the limiting cases that can. Every threshold is worked
// by hand in the case's comment.
func TestImpossibleGeometry(t *testing.T) {
	vee := func(dx, dy float64) Vee { return Vee{Direction: r3.Vec{X: dx, Y: dy}, Up: up, HalfAngle: math.Pi / 4} }
	at := func(x, y, z, r float64) Ball { return Ball{Centre: r3.Vec{X: x, Y: y, Z: z}, Radius: r} }
	rods := func(rr float64) Rods {
		return Rods{Direction: r3.Vec{X: 1}, Up: up, HalfAngle: math.Pi / 4, RodRadius: rr}
	}
	for _, tc := range []struct {
		name         string
		c            Coupling
		field, other string // "" field: accepted
		sentinel     error
	}{
		// A millimetre radius read as metres: 6.35 (meant mm), a whole
		// ball over 0.5 m, refused before any overlap is looked at.
		{"mm read as m", Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 6.35), Seat: vee(1, 0)},
			{Ball: at(0.1, 0, 0, 6.35), Seat: vee(0, 1)},
			{Ball: at(0, 0.1, 0, 6.35), Seat: vee(1, 1)}}},
			"Pairs[0].Ball.Radius", "", ErrRange},
		// Whole balls of 0.4 m, under that bound, with centres 0.1 apart
		// overlap: 0.1 < 0.4 + 0.4.
		{"large whole balls overlapping", Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 0.4), Seat: vee(1, 0)},
			{Ball: at(0.1, 0, 0, 0.4), Seat: vee(0, 1)},
			{Ball: at(0, 0.1, 0, 0.4), Seat: vee(1, 1)}}},
			"Pairs[1].Ball", "Pairs[0].Ball", ErrRange},
		// The same in metres: 0.1 ≥ 0.00635 + 0.00635.
		{"the same in metres", Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 6.35e-3), Seat: vee(1, 0)},
			{Ball: at(0.1, 0, 0, 6.35e-3), Seat: vee(0, 1)},
			{Ball: at(0, 0.1, 0, 6.35e-3), Seat: vee(1, 1)}}}, "", "", nil},
		// Touching balls: |c₀ − c₁| = 0.05 = 0.025 + 0.025 exactly.
		{"touching", Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 0.025), Seat: vee(1, 0)},
			{Ball: at(0.05, 0, 0, 0.025), Seat: vee(0, 1)},
			{Ball: at(0, 0.05, 0, 0.025), Seat: vee(1, 1)}}}, "", "", nil},
		// Overlap by 1 %: radii 0.02525, 2·0.02525 = 0.0505 > 0.05;
		// balls 0 and 2 overlap first in the order checked (pair 2
		// against 0: 0.05 apart too), but 1 against 0 comes first.
		{"overlap 1 %", Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 0.02525), Seat: vee(1, 0)},
			{Ball: at(0.05, 0, 0, 0.02525), Seat: vee(0, 1)},
			{Ball: at(0, 0.05, 0, 0.02525), Seat: vee(1, 1)}}},
			"Pairs[1].Ball", "Pairs[0].Ball", ErrRange},
		// Canoe balls of radius 0.25 m on a 0.1 m spacing: the spheres
		// overlap (0.1 < 0.5) but only the segments are solid.
		{"canoe balls", Coupling{Pairs: []Pair{
			{Ball: Ball{Centre: r3.Vec{Z: 0.25}, Radius: 0.25, Canoe: true}, Seat: vee(1, 0)},
			{Ball: Ball{Centre: r3.Vec{X: 0.1, Z: 0.25}, Radius: 0.25, Canoe: true}, Seat: vee(0, 1)},
			{Ball: Ball{Centre: r3.Vec{Y: 0.1, Z: 0.25}, Radius: 0.25, Canoe: true}, Seat: vee(1, 1)}}}, "", "", nil},
		// A canoe ball on a flat touches at (0, 0, 0), 0.005 m from the
		// centre of a whole ball of radius 0.01 m: inside it.
		{"contact inside a ball", Coupling{Pairs: []Pair{
			{Ball: Ball{Centre: r3.Vec{Z: 0.25}, Radius: 0.25, Canoe: true}, Seat: Flat{Up: up}},
			{Ball: at(0.005, 0, 0, 0.01), Seat: vee(0, 1)},
			{Ball: at(0, 0.1, 0, 0.01), Seat: vee(1, 1)}}},
			"Pairs[0].Seat", "Pairs[1].Ball", ErrRange},
		// Rods at 45° under a ball of radius 5 mm: the axes lie
		// 2(r + R)cos 45° apart. R = 20 mm: 2·25·0.7071 = 35.4 mm < 40 mm,
		// the rods overlap. R = 10 mm: 2·15·0.7071 = 21.2 mm > 20 mm.
		{"rods overlap", Coupling{Pairs: []Pair{{Ball: at(0, 0, 0, 5e-3), Seat: rods(20e-3)}}},
			"Pairs[0].Seat.RodRadius", "", ErrRange},
		{"rods clear", Coupling{Pairs: []Pair{{Ball: at(0, 0, 0, 5e-3), Seat: rods(10e-3)}}}, "", "", nil},
		// A gothic-arch flank no larger than the ball cannot touch it.
		{"flank radius", Coupling{Pairs: []Pair{{Ball: at(0, 0, 0, 5e-3),
			Seat: Vee{Direction: r3.Vec{X: 1}, Up: up, HalfAngle: math.Pi / 4, FlankRadius: 5e-3}}}},
			"Pairs[0].Seat.FlankRadius", "", ErrRange},
		// A 0.1 m coupling 1e300 m from the origin: 0.1/1e300 is far
		// below farTol, and the centres round to the same number.
		{"far away", Coupling{Pairs: []Pair{
			{Ball: at(1e300, 0, 0, 6.35e-3), Seat: vee(1, 0)},
			{Ball: at(1e300+0.1, 0, 0, 6.35e-3), Seat: vee(0, 1)},
			{Ball: at(1e300, 0.1, 0, 6.35e-3), Seat: vee(1, 1)}}},
			"Pairs[0].Ball.Centre", "", ErrRange},
	} {
		_, err := tc.c.Contacts()
		if tc.field == "" {
			if err != nil {
				t.Errorf("%s: %v, want accepted", tc.name, err)
			}
			continue
		}
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tc.field || ie.Other != tc.other || !errors.Is(err, tc.sentinel) {
			t.Errorf("%s: %v, want an InputError on %q (other %q) wrapping %v", tc.name, err, tc.field, tc.other, tc.sentinel)
		}
	}
}

// TestOverlapNamesLargerBall: when two whole balls overlap, the error
// names first the ball of the larger radius, the one a mistyped radius
// makes too large (0.2 m for 2 mm, under the 0.5 m that a whole ball is
// refused at as millimetres), and the other as Other, whichever comes
// first in Pairs. Balls 0.1 m apart: 0.1 < 0.2 + 0.005.
func TestOverlapNamesLargerBall(t *testing.T) {
	vee := func(dx, dy float64) Vee { return Vee{Direction: r3.Vec{X: dx, Y: dy}, Up: up, HalfAngle: math.Pi / 4} }
	at := func(x, y, z, r float64) Ball { return Ball{Centre: r3.Vec{X: x, Y: y, Z: z}, Radius: r} }
	for big := range 3 {
		c := Coupling{Pairs: []Pair{
			{Ball: at(0, 0, 0, 5e-3), Seat: vee(1, 0)},
			{Ball: at(0.1, 0, 0, 5e-3), Seat: vee(0, 1)},
			{Ball: at(0, 0.1, 0, 5e-3), Seat: vee(1, 1)}}}
		c.Pairs[big].Ball.Radius = 0.2
		// Pairs are checked 1 against 0, then 2 against 0 and 1: the
		// first overlap found involves ball 1 and ball 0, or, when ball 2
		// is the large one, ball 2 and ball 0.
		other := 1
		if big != 0 {
			other = 0
		}
		_, err := c.Contacts()
		var ie *InputError
		wantField, wantOther := fmt.Sprintf("Pairs[%d].Ball", big), fmt.Sprintf("Pairs[%d].Ball", other)
		if !errors.As(err, &ie) || ie.Field != wantField || ie.Other != wantOther || !errors.Is(err, ErrRange) {
			t.Errorf("ball %d of radius 0.2 m: %v; want %s, other %s", big, err, wantField, wantOther)
			continue
		}
		if want := fmt.Sprintf("balls %c and %c overlap: radii 0.2 m and 0.005 m", 'A'+big, 'A'+other); !strings.Contains(err.Error(), want) {
			t.Errorf("ball %d of radius 0.2 m: %q lacks %q", big, err, want)
		}
	}
}

// TestReadmeOverlapSlip: the README's table of slips quotes the error of
// its tour coupling with the first ball's 5 mm radius written as 5 (a
// whole ball over 0.5 m, refused as millimetres); the quote is what the
// code prints.
func TestReadmeOverlapSlip(t *testing.T) {
	b, err := os.ReadFile("../README.md")
	if err != nil {
		t.Fatal(err)
	}
	const row = "| a 5 mm ball radius written as `5` | `"
	i := strings.Index(string(b), row)
	if i < 0 {
		t.Fatalf("README.md has no row %q", row)
	}
	quoted, _, _ := strings.Cut(string(b)[i+len(row):], "`")
	balls := [3]Ball{
		{Centre: r3.Vec{X: -0.060, Y: -0.035}, Radius: 5, Material: hertz.Steel52100},
		{Centre: r3.Vec{X: 0.065, Y: -0.030}, Radius: 5e-3, Material: hertz.Steel52100},
		{Centre: r3.Vec{X: 0.010, Y: 0.055}, Radius: 5e-3, Material: hertz.Steel52100},
	}
	v := Vee{Up: r3.Vec{Z: 1}, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	_, err = BisectorVees(balls, [3]Vee{v, v, v})
	if err == nil || err.Error() != quoted {
		t.Errorf("README quotes\n%s\nthe code prints\n%v", quoted, err)
	}
}
