package kinematic

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/optimize"
	"gonum.org/v1/gonum/spatial/r3"
)

// generalAssembly returns an assembly of three vees aimed off-centre, on
// balls at different heights (one with gothic-arch flanks), and a
// socket–vee–flat on the same balls with rods for the vee.
func generalAssemblies(t testing.TB) map[string]*Assembly {
	t.Helper()
	bs := [3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}
	arch := vee45
	arch.FlankRadius = 5.4e-3
	tv, err := AimedVees(bs, r3.Vec{X: 0.01, Y: 0.02}, [3]Vee{vee45, arch, vee45})
	if err != nil {
		t.Fatal(err)
	}
	svf, err := SocketVeeFlat(bs, cube, vee45, flatUp)
	if err != nil {
		t.Fatal(err)
	}
	rods := Rods{Direction: r3.Sub(bs[0].Centre, bs[1].Centre), Up: up, HalfAngle: math.Pi / 4, RodRadius: 3e-3}
	cone := Cone{Up: up, HalfAngle: 0.6}
	svr := Coupling{Pairs: []Pair{{Ball: bs[0], Seat: cone}, {Ball: bs[1], Seat: rods}, {Ball: bs[2], Seat: flatUp}}}
	out := map[string]*Assembly{}
	for name, c := range map[string]Coupling{"three-vee": tv, "socket-vee-flat": svf, "cone-rods-flat": svr} {
		a, err := c.Assembly()
		if err != nil {
			t.Fatal(err)
		}
		out[name] = a
	}
	return out
}

// TestSeatNominal: a perfect coupling seats at the nominal pose, to 1e-12
// of its size.
func TestSeatNominal(t *testing.T) {
	for name, a := range generalAssemblies(t) {
		p, err := a.Pose(nil, nil)
		if err != nil {
			t.Fatal(err)
		}
		if r3.Norm(p.Rotation) > 1e-12 || r3.Norm(p.Translation) > 1e-12*a.size {
			t.Errorf("%s: nominal pose %+v", name, p)
		}
	}
}

// TestSeatBallRadius: a ball larger by Δr in a vee of half-angle θ sits
// with its centre Δr/sin θ higher along Up, still in the vee's plane of
// symmetry: the centre lies r + Δr from both flanks, which meet at the
// root line with normals leaning θ from the horizontal, so its height
// above the root is (r + Δr)/sin θ (geometry, exact for any Δr).
func TestSeatBallRadius(t *testing.T) {
	for _, deg := range []float64{30, 45, 60} {
		v := vee45
		v.HalfAngle = deg * math.Pi / 180
		c, err := BisectorVees(isosceles(), three(v))
		if err != nil {
			t.Fatal(err)
		}
		a, err := c.Assembly()
		if err != nil {
			t.Fatal(err)
		}
		for _, dr := range []float64{1e-6, -2e-5, 1e-4} {
			p, err := a.Pose([]Deviation{{"A.Ball.Radius", dr}}, nil)
			if err != nil {
				t.Fatal(err)
			}
			c0 := c.Pairs[0].Ball.Centre
			moved := r3.Sub(p.Apply(c0), c0)
			want := dr / math.Sin(v.HalfAngle)
			if math.Abs(moved.Z-want) > 1e-12*math.Abs(want)+1e-13*0.1 { // the seat converges to 1e-13 of the size
				t.Errorf("θ = %g°, Δr = %g: centre rises %.15g, want Δr/sin θ = %.15g", deg, dr, moved.Z, want)
			}
			side := r3.Cross(up, c.Pairs[0].Seat.(Vee).Direction)
			if s := r3.Dot(moved, side) / r3.Norm(side); math.Abs(s) > 1e-12*math.Abs(want)+1e-13*0.1 { // the seat converges to 1e-13 of the size
				t.Errorf("θ = %g°, Δr = %g: centre leaves the vee's plane by %g", deg, dr, s)
			}
		}
	}
}

// TestSeatSecondOrder: the linear model (Sensitivities) and the exact
// seat agree to second order: halving every deviation quarters their
// difference at the point of interest (the ratio tends to 4 as the
// deviations shrink; 3.6 to 4.4 allows for the third-order term at
// these sizes).
func TestSeatSecondOrder(t *testing.T) {
	poi := r3.Vec{X: 0.01, Y: 0.02, Z: 0.05}
	for name, a := range generalAssemblies(t) {
		sens, err := a.Sensitivities(poi)
		if err != nil {
			t.Fatal(err)
		}
		dims := a.Dimensions()
		devs := make([]Deviation, len(dims))
		for i, d := range dims {
			// Deterministic, mixed signs, a few µm and mrad.
			devs[i] = Deviation{d, 2e-5 * math.Sin(float64(3*i+1))}
		}
		diff := func(scale float64) float64 {
			ds := make([]Deviation, len(devs))
			var lin r3.Vec
			for i, d := range devs {
				ds[i] = Deviation{d.Dimension, d.Value * scale}
				lin = r3.Add(lin, r3.Scale(d.Value*scale, sens[i].Displacement))
			}
			p, err := a.Pose(ds, nil)
			if err != nil {
				t.Fatal(err)
			}
			exact := r3.Sub(p.Apply(poi), poi)
			return r3.Norm(r3.Sub(exact, lin))
		}
		d1, d2 := diff(1), diff(0.5)
		if r := d1 / d2; r < 3.6 || r > 4.4 {
			t.Errorf("%s: difference %g at full, %g at half size: ratio %g, want about 4", name, d1, d2, r)
		}
	}
}

// TestSeatAgainstMinimiser: the exact seat agrees with an independent
// solve of the tangency equations, a gonum optimize minimisation
// (Nelder–Mead from the nominal, with a simplex of the deviations' size so
// that it stays on the physical branch: a ball in a gothic arch also
// touches both flank cylinders at a mirror point where the flanks do not
// exist) of the sum of squared gaps over the six pose coordinates
// (rotation vector and translation, scaled to the size), to 1e-10 of the
// size.
func TestSeatAgainstMinimiser(t *testing.T) {
	poi := r3.Vec{X: 0.01, Y: 0.02, Z: 0.05}
	for name, a := range generalAssemblies(t) {
		dims := a.Dimensions()
		var devs []Deviation
		for i, d := range dims {
			devs = append(devs, Deviation{d, 3e-5 * math.Cos(float64(5*i+2))})
		}
		p, err := a.Pose(devs, nil)
		if err != nil {
			t.Fatal(err)
		}
		g := a.nominal()
		for _, d := range devs {
			a.apply(&g, a.index[d.Dimension], d.Value)
		}
		L := a.size
		gaps := func(x []float64) float64 {
			rot := rodrigues(r3.Vec{X: x[0], Y: x[1], Z: x[2]})
			t := r3.Scale(L, r3.Vec{X: x[3], Y: x[4], Z: x[5]})
			var s float64
			for i := range g.c {
				gi, _, _ := g.surfs[i].gap(r3.Add(mulMat(&rot, g.c[i]), t), g.r[i])
				s += (gi / L) * (gi / L)
			}
			return s
		}
		res, err := optimize.Minimize(optimize.Problem{Func: gaps}, make([]float64, 6), &optimize.Settings{
			Converger: &optimize.FunctionConverge{Absolute: 1e-30, Iterations: 200},
		}, &optimize.NelderMead{SimplexSize: 1e-4})
		if err != nil && res == nil {
			t.Fatal(err)
		}
		// Polish with a second run from the simplex's answer.
		res2, _ := optimize.Minimize(optimize.Problem{Func: gaps}, res.X, &optimize.Settings{
			Converger: &optimize.FunctionConverge{Absolute: 1e-32, Iterations: 400},
		}, &optimize.NelderMead{SimplexSize: 1e-6})
		if res2 != nil && res2.F < res.F {
			res = res2
		}
		x := res.X
		rot := rodrigues(r3.Vec{X: x[0], Y: x[1], Z: x[2]})
		tl := r3.Scale(L, r3.Vec{X: x[3], Y: x[4], Z: x[5]})
		// The minimiser's pose maps local points; compare where the point
		// of interest goes.
		want := r3.Add(r3.Add(a.origin, mulMat(&rot, r3.Sub(poi, a.origin))), tl)
		if d := r3.Norm(r3.Sub(p.Apply(poi), want)); d > 1e-10*L {
			t.Errorf("%s: Seat puts the point of interest %g m from the minimiser's (residual of the minimiser %g)", name, d, math.Sqrt(res.F)*L)
		}
	}
}

// TestSeatScale: the design ×1/1000 gives displacements ×1/1000 and the
// same rotations (scaled down: a design ×1000 has whole balls of metres,
// which are refused as millimetres).
func TestSeatScale(t *testing.T) {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	big := moved(c, 1e-3, 0, up, r3.Vec{})
	a1, _ := c.Assembly()
	a2, err := big.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	devs := []Deviation{{"A.Ball.Radius", 3e-6}, {"B.Seat.Turn", 2e-4}, {"C.Seat.Flank+", -4e-6}, {"B.Seat.HalfAngle", 1e-4}}
	devs2 := make([]Deviation, len(devs))
	for i, d := range devs {
		devs2[i] = d
		if d.Dimension != "B.Seat.Turn" && d.Dimension != "B.Seat.HalfAngle" {
			devs2[i].Value *= 1e-3
		}
	}
	p1, err := a1.Pose(devs, nil)
	if err != nil {
		t.Fatal(err)
	}
	p2, err := a2.Pose(devs2, nil)
	if err != nil {
		t.Fatal(err)
	}
	if d := r3.Norm(r3.Sub(p2.Rotation, p1.Rotation)); d > 1e-12*r3.Norm(p1.Rotation) {
		t.Errorf("rotations %v and %v", p1.Rotation, p2.Rotation)
	}
	if d := r3.Norm(r3.Sub(p2.Translation, r3.Scale(1e-3, p1.Translation))); d > 1e-9*r3.Norm(p2.Translation) {
		t.Errorf("translations %v and %v (×1/1000)", p1.Translation, p2.Translation)
	}
}

// TestSeatErrors: bad deviations name their field; a ball that cannot
// reach its seat is reported.
func TestSeatErrors(t *testing.T) {
	a := generalAssemblies(t)["three-vee"]
	var ie *InputError
	if _, err := a.Pose([]Deviation{{"A.Ball.Radius", 1e-6}, {"Z.Ball.Radius", 1e-6}}, nil); !errors.As(err, &ie) || ie.Field != "devs[1].Dimension" {
		t.Errorf("unknown dimension: %v", err)
	}
	// The unknown name's message lists what the caller could have meant,
	// for a reader without an Assembly to ask (a design file's): the
	// pair's dimensions, or the pairs when the pair is unknown. The
	// three-vee's pairs are A, B and C; every pair has a ball radius.
	if _, err := a.Pose([]Deviation{{"A.Seat.Face1", 1e-6}}, nil); err == nil || !strings.Contains(err.Error(), "(pair A has A.Ball.Radius, ") || strings.Contains(err.Error(), "B.Ball.Radius") {
		t.Errorf("unknown dimension of pair A: %v", err)
	}
	if _, err := a.Pose([]Deviation{{"Z.Ball.Radius", 1e-6}}, nil); err == nil || !strings.Contains(err.Error(), "with the pairs A, B, C)") {
		t.Errorf("unknown pair Z: %v", err)
	}
	if _, err := a.Pose([]Deviation{{"A.Ball.Radius", math.NaN()}}, nil); !errors.Is(err, ErrNonFinite) {
		t.Errorf("NaN deviation: %v", err)
	}
	// A ball that cannot reach its seat is named in the reason; the field
	// names the deviations the caller wrote that moved it (the Pairs of
	// the coupling are not Pose's input).
	if _, err := a.Pose([]Deviation{{"A.Ball.Radius", -6e-3}}, nil); !errors.As(err, &ie) || ie.Field != "devs[0].Value" || !strings.Contains(err.Error(), "ball A cannot reach its seat") {
		t.Errorf("negative radius: %v", err)
	}
	// 10 m for 10 µm: the seat of ball A moves 10 m.
	if _, err := a.Pose([]Deviation{{"A.Seat.X", 10}}, nil); !errors.As(err, &ie) || ie.Field != "devs[0].Value" || !errors.Is(err, ErrRange) {
		t.Errorf("a seat 10 m off: %v", err)
	}
	// The largest input is named, measured for its kind (a length over
	// its ball's radius, 5 mm here; an angle in radians): 10 m of A's
	// seat, not 3 m of A's ball, 1 µm of B's ball or the zero.
	devs := []Deviation{{"B.Ball.X", 1e-6}, {"A.Seat.Y", 10}, {"A.Ball.Z", 0}, {"A.Ball.X", -3}}
	if _, err := a.Pose(devs, nil); !errors.As(err, &ie) || ie.Field != "devs[1].Value" {
		t.Errorf("ball A's deviations 3 m and 10 m: %v", err)
	}
	// A seat moved far can push another ball off first: then that
	// ball's own small deviation is not blamed (1 µm of A's seat beside
	// 10 mm of B's, 2 ball radii).
	devs = []Deviation{{"A.Seat.Z", 1e-6}, {"B.Seat.X", 0.01}}
	if _, err := a.Pose(devs, nil); !errors.As(err, &ie) || ie.Field != "devs[1].Value" || !errors.Is(err, ErrRange) {
		t.Errorf("1 µm at A, 10 mm at B: %v; want devs[1].Value", err)
	}
	// An angle is measured in radians against lengths over the radius:
	// a seat turned 1.2 rad beside a ball moved 0.3 mm (0.06 radii).
	devs = []Deviation{{"C.Ball.X", 3e-4}, {"B.Seat.Turn", 1.2}}
	if _, err := a.Pose(devs, nil); !errors.As(err, &ie) || ie.Field != "devs[1].Value" || !errors.Is(err, ErrRange) {
		t.Errorf("0.06 radii beside 1.2 rad: %v; want devs[1].Value", err)
	}
	// An approach of 10 mm at the first contact of pair B (contacts A+,
	// A-, B+, ...), the only input: it is named, whichever ball is pushed
	// off its seat (the reason names that ball).
	appr := []float64{0, 0, 10e-3, 0, 0, 0}
	if _, err := a.Pose(nil, &PoseOptions{Approach: appr}); !errors.As(err, &ie) || !errors.Is(err, ErrRange) || ie.Field != "opt.Approach[2]" {
		t.Errorf("an approach of 10 mm at B+: %v; want opt.Approach[2]", err)
	}
	if _, err := a.Pose([]Deviation{{"B.Seat.Flank+", 4e-3}}, nil); !errors.Is(err, ErrRange) {
		t.Errorf("a flank 4 mm high: %v", err)
	}
	if _, err := a.Pose(nil, &PoseOptions{Approach: []float64{1}}); !errors.As(err, &ie) || ie.Field != "opt.Approach" {
		t.Errorf("short approach list: %v", err)
	}
	v := vee45
	v.Direction = r3.Vec{X: 1}
	if _, err := (Coupling{Pairs: []Pair{{Ball: ball(0, 0, 0), Seat: flatUp}, {Ball: ball(50, 0, 0), Seat: v}}}).Assembly(); !errors.Is(err, ErrNotExact) {
		t.Errorf("a flat and a vee: %v", err)
	}
}
