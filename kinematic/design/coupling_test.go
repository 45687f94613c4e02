package design

import (
	"bytes"
	"errors"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// changed returns the seat with every field the optimiser can change
// set to new values: a groove turned by 0.1 rad about its up (Rodrigues'
// rotation, r3.Rotate) and 2° less steep; a socket's first contact turned
// likewise and its half-angle 1° smaller; a flat's up tilted.
func changed(s kinematic.Seat) kinematic.Seat {
	const deg = math.Pi / 180
	switch k := s.(type) {
	case kinematic.Vee:
		k.Direction, k.HalfAngle = r3.Rotate(k.Direction, 0.1, k.Up), k.HalfAngle-2*deg
		return k
	case kinematic.Rods:
		k.Direction, k.HalfAngle = r3.Rotate(k.Direction, 0.1, k.Up), k.HalfAngle-2*deg
		return k
	case kinematic.Trihedral:
		k.Azimuth, k.HalfAngle = r3.Rotate(k.Azimuth, 0.1, k.Up), k.HalfAngle-deg
		return k
	case kinematic.Cone:
		k.Azimuth, k.HalfAngle = r3.Rotate(r3.Vec{X: 1}, 0.1, k.Up), k.HalfAngle-deg
		return k
	case kinematic.Flat:
		k.Up = r3.Add(k.Up, r3.Vec{X: 0.01})
		return k
	}
	return s
}

// TestWithCouplingRoundTrip: for every seat type, a coupling with its
// seats changed and its balls moved, written back into the design, goes
// through the canonical writer and the reader and builds the same
// coupling again.
func TestWithCouplingRoundTrip(t *testing.T) {
	seen := map[SeatType]bool{}
	for _, f := range []string{"testdata/equilateral.json", "testdata/socket.json", "testdata/cone.json"} {
		t.Run(f, func(t *testing.T) {
			d, err := Parse(readFile(t, f))
			if err != nil {
				t.Fatal(err)
			}
			b, err := d.Build()
			if err != nil {
				t.Fatal(err)
			}
			c := b.Coupling()
			for i := range c.Pairs {
				c.Pairs[i].Seat = changed(c.Pairs[i].Seat)
				c.Pairs[i].Ball.Centre = r3.Add(c.Pairs[i].Ball.Centre, r3.Vec{X: 1e-4 * float64(i+1), Y: -2e-4})
				seen[d.Seats[i].Type] = true
			}
			nd, err := d.WithCoupling(c)
			if err != nil {
				t.Fatal(err)
			}
			var buf bytes.Buffer
			if err := nd.Write(&buf); err != nil {
				t.Fatal(err)
			}
			back, err := Read(&buf)
			if err != nil {
				t.Fatal(err)
			}
			b2, err := back.Build()
			if err != nil {
				t.Fatal(err)
			}
			if diff := cmp.Diff(c, b2.Coupling()); diff != "" {
				t.Errorf("coupling after write and read (-want +got):\n%s", diff)
			}
			for i, s := range back.Seats {
				if s.Azimuth != 0 || s.Reference != kinematic.Radial {
					t.Errorf("seats[%d] keeps azimuth %g, reference %v beside its direction", i, s.Azimuth, s.Reference)
				}
			}
		})
	}
	for _, st := range []SeatType{Vee, Rods, Flat, Trihedral, Cone} {
		if !seen[st] {
			t.Errorf("no round trip of a %v seat", st)
		}
	}
}

// TestWithCouplingOptimized: the layout kinematic.Optimize chooses for a
// design with a rods seat (its groove turned, its half-angle chosen from
// a list) is not lost on the way back into the design.
func TestWithCouplingOptimized(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/cone.json"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	const deg = math.Pi / 180
	best, err := kinematic.Optimize(b.Coupling(), b.Scenario(), &kinematic.OptimizeOptions{HalfAngles: []float64{30 * deg, 50 * deg}})
	if err != nil {
		t.Fatal(err)
	}
	rods := best.Coupling.Pairs[1].Seat.(kinematic.Rods)
	if rods.HalfAngle != 30*deg && rods.HalfAngle != 50*deg {
		t.Fatalf("the optimiser chose half-angle %g rad, not one of the list", rods.HalfAngle)
	}
	nd, err := d.WithCoupling(best.Coupling)
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := nd.Write(&buf); err != nil {
		t.Fatal(err)
	}
	back, err := Read(&buf)
	if err != nil {
		t.Fatal(err)
	}
	if s := back.Seats[1]; s.HalfAngle != rods.HalfAngle || s.Direction != rods.Direction {
		t.Errorf("seats[1] read back as half-angle %g, direction %v; the optimum has %g, %v", s.HalfAngle, s.Direction, rods.HalfAngle, rods.Direction)
	}
}

// TestWithCouplingMismatch: a coupling that is not the design's is
// refused with the entry it disagrees on.
func TestWithCouplingMismatch(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/socket.json"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	c := b.Coupling()
	c.Pairs[2].Seat = kinematic.Vee{Up: r3.Vec{Z: 1}, Direction: r3.Vec{X: 1}, HalfAngle: 0.7}
	var e *Error
	if _, err := d.WithCoupling(c); !errors.As(err, &e) || e.Path != "seats[2].type" || !errors.Is(err, ErrRange) {
		t.Errorf("a vee for a flat: %v", err)
	}
	c.Pairs = c.Pairs[:2]
	if _, err := d.WithCoupling(c); !errors.As(err, &e) || e.Path != "seats" {
		t.Errorf("two pairs for three balls: %v", err)
	}
	c = b.Coupling()
	c.Pairs[0].Ball.Radius = -1
	nd, err := d.WithCoupling(c)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := nd.Build(); !errors.As(err, &e) || e.Path != "balls[0].radius" {
		t.Errorf("a negative radius: %v", err)
	}
}
