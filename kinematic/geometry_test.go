package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestGeometryCollinear: three balls in a line with a vee under the middle
// one have no triangle, so no bisector: Triangle is false and nothing is
// NaN.
func TestGeometryCollinear(t *testing.T) {
	v := vee45
	v.Direction = r3.Vec{X: 1, Y: 1}
	c := Coupling{Pairs: []Pair{
		{Ball: ball(-50, 0, 0), Seat: flatUp},
		{Ball: ball(0, 0, 0), Seat: v},
		{Ball: ball(50, 0, 0), Seat: flatUp},
	}}
	g, err := c.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	if g.Triangle || g.HasCentre || len(g.Grooves) != 1 {
		t.Fatalf("collinear: Triangle %v, HasCentre %v, %d grooves; want false, false, 1", g.Triangle, g.HasCentre, len(g.Grooves))
	}
	gr := g.Grooves[0]
	if gr.OffBisector != 0 || math.IsNaN(gr.Azimuth) || math.IsNaN(gr.FrameAzimuth) {
		t.Errorf("collinear groove %+v", gr)
	}
	// The middle ball sits on the centroid: radial is undefined, Azimuth
	// 0; the frame azimuth of (1, 1, 0) is 45° (by hand).
	if gr.Azimuth != 0 || math.Abs(gr.FrameAzimuth-math.Pi/4) > 1e-15 {
		t.Errorf("azimuths %g, %g; want 0 and π/4", gr.Azimuth, gr.FrameAzimuth)
	}
}

// TestGeometrySocketVeeFlat: a socket–vee–flat coupling has one groove;
// SocketVeeFlat aims it at the socket's ball, so OffSocket is zero, and
// turning it by 10° makes OffSocket 10° (by construction).
func TestGeometrySocketVeeFlat(t *testing.T) {
	c := mustSVF(t)
	g, err := c.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	if g.Socket != 0 || len(g.Grooves) != 1 || g.HasCentre {
		t.Fatalf("socket %d, %d grooves, HasCentre %v; want 0, 1, false", g.Socket, len(g.Grooves), g.HasCentre)
	}
	if off := g.Grooves[0].OffSocket; off > 1e-15 {
		t.Errorf("vee aimed at the socket is %g rad off it", off)
	}
	// Ball B at (60, 0) mm, socket A at (−60, 0): the groove points along
	// −x, frame azimuth 0 (a line) and radial azimuth atan(10/60) about z
	// from the radial direction towards the centroid (0, 10) (by hand).
	if gr := g.Grooves[0]; math.Abs(gr.FrameAzimuth) > 1e-15 || math.Abs(gr.Azimuth-math.Atan(10.0/60)) > 1e-15 {
		t.Errorf("frame azimuth %g, radial azimuth %g; want 0 and %g", gr.FrameAzimuth, gr.Azimuth, math.Atan(10.0/60))
	}
	turned, err := c.WithGroove(1, 10*math.Pi/180, FrameX)
	if err != nil {
		t.Fatal(err)
	}
	g, _ = turned.Geometry()
	if off := g.Grooves[0].OffSocket; math.Abs(off-10*math.Pi/180) > 1e-14 {
		t.Errorf("turned 10°: OffSocket %g rad", off)
	}
}

// TestBisectorNonPlanar: balls at different heights (0, 14 and −9 mm on a
// 150 mm triangle) and a tilted seat: BisectorVees lays each groove on the
// bisector projected into its seat's plane, and Geometry measures against
// the same definition, so the library's own bisector layout is 0° off its
// bisectors.
func TestBisectorNonPlanar(t *testing.T) {
	bs := [3]Ball{ball(-75, -43.3, 0), ball(75, -43.3, 14), ball(0, 86.6, -9)}
	tilted := vee45
	tilted.Up = r3.Vec{X: 0.1, Y: -0.05, Z: 1}
	for name, vs := range map[string][3]Vee{
		"vertical seats": three(vee45),
		"one tilted":     {vee45, tilted, vee45},
	} {
		c, err := BisectorVees(bs, vs)
		if err != nil {
			t.Fatal(err)
		}
		g, err := c.Geometry()
		if err != nil {
			t.Fatal(err)
		}
		for _, gr := range g.Grooves {
			if gr.OffBisector > 1e-15 {
				t.Errorf("%s: groove %d is %g rad off its bisector", name, gr.Pair, gr.OffBisector)
			}
		}
		if up := c.Pairs[1].Seat.(Vee).Up; up != vs[1].Up {
			t.Errorf("%s: seat B's Up %v, want %v kept", name, up, vs[1].Up)
		}
	}
}

// TestWithGroove: a groove set by azimuth reads back as that azimuth from
// either reference, and the two references differ by the frame angle of
// the radial direction (by hand: ball C of the isosceles triangle at
// (0, 30) mm looks at the centroid (0, 10) along −y, frame angle −90°).
func TestWithGroove(t *testing.T) {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		ref            Reference
		angle          float64
		radial, frameX float64
	}{
		{Radial, 0.3, 0.3, wrapAzimuth(0.3 - math.Pi/2)},
		{FrameX, 0.3, wrapAzimuth(0.3 + math.Pi/2), 0.3},
	} {
		got, err := c.WithGroove(2, tc.angle, tc.ref)
		if err != nil {
			t.Fatal(err)
		}
		g, _ := got.Geometry()
		gr := g.Grooves[2]
		if math.Abs(gr.Azimuth-tc.radial) > 1e-14 || math.Abs(gr.FrameAzimuth-tc.frameX) > 1e-14 {
			t.Errorf("%v %g: azimuths %g (radial), %g (frame); want %g, %g", tc.ref, tc.angle, gr.Azimuth, gr.FrameAzimuth, tc.radial, tc.frameX)
		}
	}
	if _, err := c.WithGroove(3, 0, Radial); err == nil {
		t.Error("pair 3 of 3 accepted")
	}
	svf := mustSVF(t)
	if _, err := svf.WithGroove(0, 0, Radial); err == nil {
		t.Error("a socket turned as a groove")
	}
	if _, err := c.WithGroove(0, math.NaN(), Radial); err == nil {
		t.Error("NaN angle accepted")
	}
	if _, err := c.WithGroove(0, 0, Reference(7)); err == nil {
		t.Error("unknown reference accepted")
	}
}

// TestConeAnyAzimuth: a cone is axisymmetric, so the zero Azimuth is
// accepted and the constraint verdicts are those of any azimuth.
func TestConeAnyAzimuth(t *testing.T) {
	cone := Cone{Up: up, HalfAngle: math.Pi / 4, Material: hertz.Steel440C}
	bs := isosceles()
	v := vee45
	v.Direction = r3.Sub(bs[0].Centre, bs[1].Centre)
	for _, az := range []r3.Vec{{}, {X: 1}, {X: 1, Y: 3}} {
		cone.Azimuth = az
		c := Coupling{Pairs: []Pair{{Ball: bs[0], Seat: cone}, {Ball: bs[1], Seat: v}, {Ball: bs[2], Seat: flatUp}}}
		an := mustAnalyze(t, mustContacts(t, c))
		if an.Rank != 6 {
			t.Errorf("cone azimuth %v: rank %d, want 6", az, an.Rank)
		}
	}
}
