package kinematic

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// TestDriftCurvedSeats: the seat-material part of the thermal drift for
// seats whose surfaces are curved, rods and gothic-arch flanks, where the
// seat's own expansion changes the geometry the ball sits on. Three 10 mm
// steel balls (hertz.Steel52100, α_b = 11.9e-6/K) on the equilateral
// triangle, grooves radial (the bisectors), contact normals leaning
// θ = 0.6 rad from the horizontal, seats of aluminium 6061-T6
// (α_s = 23.6e-6/K), ΔT = 200 K (large, so that second-order terms show),
// the moving body and the base not expanding (Moving = Base = 0).
//
// The documented model expands a machined seat's material about its root,
// the point r/sin θ below the ball centre where the flank planes of a vee
// of the same half-angle meet, and a rod (a part of its own, located by the
// base) about its own axis. In the plane normal to a groove through its
// ball's centre c, with the root at the origin and y along Up,
// c = (0, r/sin θ) and one contact normal is n = (−cos θ, sin θ) (the other
// is its mirror image).
//
// Rods of radius ρ: the rod's axis is q = c − (r + ρ) n, and the ball
// touches it when |c − q| = r + ρ. After the change the axis stays where
// the base holds it (the base does not expand here), the radii are
// ρ(1 + ε_s) and r(1 + ε_b) (ε = α ΔT), and by symmetry the centre stays
// on the y axis, at
//
//	h' = q_y + √((r' + ρ')² − q_x²).
//
// Gothic arch of radius R: the flank's axis is q = c + (R − r) n, the ball
// touches it when |c − q| = R − r, and the centre lies below the axis:
//
//	h' = (1 + ε_s) q_y − √((R' − r')² − ((1 + ε_s) q_x)²).
//
// The three seats are alike, so the body rises by h' − r/sin θ without
// turning, at every point of it: that is the exact drift.
//
// To first order a rod growing by α_s ρ ΔT with its axis held pushes the
// ball out along n by that much and raises it by α_s ρ ΔT/sin θ; with the
// ball's growth (each gap closing by α_b r ΔT) the linear rise is
// (α_b r + α_s ρ) ΔT/sin θ. A gothic-arch flank machined in the seat
// expands with it about the root: its axis moves by ε_s (q − root), whose
// part along n is ε_s n·(q − root) = ε_s R (the tangent plane at the
// contact passes through the root, and the axis lies R in front of it),
// and its radius grows by ε_s R: the two cancel, and only the ball's
// growth is left, α_b r ΔT/sin θ.
// The exact drift differs from it at second order in ε (the closed forms
// above give −1.6e-7 m for the rods and +5.9e-7 m for the arch, whose
// R − r = 0.4 mm magnifies the change of shape, against 2.1e-5 m), so
// the exact check below, at 1e-14 m, resolves the second-order terms.
func TestDriftCurvedSeats(t *testing.T) {
	const (
		theta = 0.6
		rho   = 3e-3   // rod radius, m
		bigR  = 5.4e-3 // flank radius, m
		dT    = 200.0
	)
	mat := hertz.Aluminium6061T6
	bs := equilateral()
	r := bs[0].Radius
	eb, es := bs[0].Material.Alpha*dT, mat.Alpha*dT
	s, c := math.Sincos(theta)
	h := r / s
	n := [2]float64{-c, s}
	rodAxis := [2]float64{-(r + rho) * n[0], h - (r+rho)*n[1]}
	rodRise := rodAxis[1] + math.Sqrt(math.Pow(r*(1+eb)+rho*(1+es), 2)-math.Pow(rodAxis[0], 2)) - h
	archAxis := [2]float64{(bigR - r) * n[0], h + (bigR-r)*n[1]}
	archRise := (1+es)*archAxis[1] - math.Sqrt(math.Pow(bigR*(1+es)-r*(1+eb), 2)-math.Pow((1+es)*archAxis[0], 2)) - h
	linRise := eb * r / s
	rodLinRise := (eb*r + es*rho) / s

	var rods Coupling
	for i, b := range bs {
		rods.Pairs = append(rods.Pairs, Pair{Name: string(rune('A' + i)), Ball: b,
			Seat: Rods{Direction: b.Centre, Up: up, HalfAngle: theta, RodRadius: rho, Material: mat}})
	}
	arch := Vee{Up: up, HalfAngle: theta, FlankRadius: bigR, Material: mat}
	arches, err := BisectorVees(bs, three(arch))
	if err != nil {
		t.Fatal(err)
	}
	th := Thermal{DeltaT: dT}
	for _, tc := range []struct {
		name          string
		c             Coupling
		rise, linRise float64
	}{{"rods", rods, rodRise, rodLinRise}, {"gothic arch", arches, archRise, linRise}} {
		a, err := tc.c.Assembly()
		if err != nil {
			t.Fatal(err)
		}
		for _, p := range []r3.Vec{{}, {X: 0.03, Y: -0.02, Z: 0.04}} {
			d, err := a.Drift(th, p)
			if err != nil {
				t.Fatal(err)
			}
			if !near(d.Relative, r3.Vec{Z: tc.rise}, 1e-14) {
				t.Errorf("%s at %v: exact drift %.6g, want (0, 0, %.6g)", tc.name, p, d.Relative, tc.rise)
			}
			if !near(d.RelativeLinear, r3.Vec{Z: tc.linRise}, 1e-12*tc.linRise) {
				t.Errorf("%s at %v: linear drift %.6g, want (0, 0, %.6g)", tc.name, p, d.RelativeLinear, tc.linRise)
			}
			if r3.Norm(d.Tilt) > 1e-15 || r3.Norm(d.LinearTilt) > 1e-15 {
				t.Errorf("%s: tilt %v / %v, want none", tc.name, d.Tilt, d.LinearTilt)
			}
		}
	}
}
