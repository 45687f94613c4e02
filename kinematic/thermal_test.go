package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// lateral returns the part of v normal to z.
func lateral(v r3.Vec) r3.Vec { return r3.Vec{X: v.X, Y: v.Y} }

// TestDriftThermalCentre: when the moving body and the base expand about
// the point G where the groove lines meet, every ball centre moves along
// its own groove line (a scaling about G maps lines through G to
// themselves), so the body need not turn and G stays put laterally: the
// thermal centre is where the groove lines meet (common practice, and this
// geometry). Checked for radial grooves on an equilateral triangle (G the
// centroid, by symmetry) and bisector grooves on the isosceles triangle (G
// the incentre), with aluminium on steel (23.6e-6 and 11.9e-6 1/K) over
// 10 K: a point of the body moves laterally by exactly α_moving ΔT times
// its lateral offset from G (the body is seated by the translation −αΔT·G
// of its own expansion, which keeps each ball on its groove line).
func TestDriftThermalCentre(t *testing.T) {
	for name, bs := range map[string][3]Ball{"equilateral": equilateral(), "isosceles": isosceles()} {
		c, err := BisectorVees(bs, three(vee45))
		if err != nil {
			t.Fatal(err)
		}
		a, err := c.Assembly()
		if err != nil {
			t.Fatal(err)
		}
		g := incentre(bs[0].Centre, bs[1].Centre, bs[2].Centre)
		th := Thermal{DeltaT: 10, Moving: 23.6e-6, Base: 11.9e-6, BaseRef: g}
		for _, p := range []r3.Vec{g, r3.Add(g, r3.Vec{X: 0.04, Z: 0.03})} {
			d, err := a.Drift(th, p)
			if err != nil {
				t.Fatal(err)
			}
			want := r3.Scale(th.Moving*th.DeltaT, lateral(r3.Sub(p, g)))
			for _, got := range []r3.Vec{d.WorldLinear, d.World} {
				if e := r3.Norm(r3.Sub(lateral(got), want)); e > 1e-12*0.05 {
					t.Errorf("%s, point %v: lateral drift in the frame %v, want %v", name, p, lateral(got), want)
				}
			}
			// Relative to the base, whose point at p moves by
			// α_base ΔT (p − g): (α_moving − α_base) ΔT (p − g) laterally,
			// (23.6 − 11.9)e-6 · 10 · 0.04 = 4.68e-6 m at the second point.
			wantRel := r3.Scale((th.Moving-th.Base)*th.DeltaT, lateral(r3.Sub(p, g)))
			for _, got := range []r3.Vec{d.RelativeLinear, d.Relative} {
				if e := r3.Norm(r3.Sub(lateral(got), wantRel)); e > 1e-12*0.05 {
					t.Errorf("%s, point %v: lateral drift relative to the base %v, want %v", name, p, lateral(got), wantRel)
				}
			}
			if !d.HasCentre || r3.Norm(lateral(r3.Sub(d.Centre, g))) > 1e-9 {
				t.Errorf("%s: thermal centre %v (has %v), want where the grooves meet, %v", name, d.Centre, d.HasCentre, g)
			}
			if r3.Norm(d.Tilt) > 1e-15 || r3.Norm(d.LinearTilt) > 1e-15 {
				t.Errorf("%s: tilt %v / %v, want none", name, d.Tilt, d.LinearTilt)
			}
		}
	}
}

// TestDriftSocketVeeFlat: a socket–vee–flat whose vee points at the
// socket expands about the socket without turning (ball B slides along its
// groove); turn the vee off the socket and the body must turn about Up to
// keep ball B in its groove. The exact and linear drifts agree to second
// order in ΔT: the difference at 20 K is about four times that at 10 K.
func TestDriftSocketVeeFlat(t *testing.T) {
	c := mustSVF(t)
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	th := Thermal{DeltaT: 10, Moving: 23.6e-6, Base: 11.9e-6, BaseRef: c.Pairs[0].Ball.Centre}
	d, err := a.Drift(th, r3.Vec{Z: 0.03})
	if err != nil {
		t.Fatal(err)
	}
	if r3.Norm(d.Tilt) > 1e-14 || r3.Norm(d.LinearTilt) > 1e-14 {
		t.Errorf("vee at the socket: tilt %v, %v; want none", d.Tilt, d.LinearTilt)
	}
	off, err := c.WithGroove(1, 0.3, FrameX)
	if err != nil {
		t.Fatal(err)
	}
	ao, err := off.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	diff := func(dt float64) (float64, r3.Vec) {
		th := th
		th.DeltaT = dt
		d, err := ao.Drift(th, r3.Vec{Z: 0.03})
		if err != nil {
			t.Fatal(err)
		}
		return r3.Norm(r3.Sub(d.Relative, d.RelativeLinear)), d.LinearTilt
	}
	d10, tilt := diff(10)
	d20, _ := diff(20)
	if math.Abs(tilt.Z) < 1e-7 {
		t.Errorf("vee 0.3 rad off the socket: turn about Up %g rad, want a visible one", tilt.Z)
	}
	if r := d20 / d10; r < 3.5 || r > 4.5 {
		t.Errorf("exact − linear: %g at 10 K, %g at 20 K (ratio %g, want about 4)", d10, d20, r)
	}
	if _, err := ao.Drift(Thermal{DeltaT: math.NaN()}, r3.Vec{}); !errors.Is(err, ErrNonFinite) {
		t.Errorf("NaN ΔT: %v", err)
	}
}

// TestThermalCentreIndependentOfBaseRef: the thermal centre is a property
// of the coupling. Three radial vees on the equilateral triangle (groove
// lines meeting at the origin, by symmetry) with the base held 100 mm
// away, at (100, 0, 0) mm, as before at the origin: the centre stays where
// the groove lines meet (the closed form of TestDriftThermalCentre), the
// drift relative to the base does not change, and the drift in the frame
// changes by exactly α_base ΔT times the 100 mm shift (the seats, and so
// the body, translate by −α_base ΔT δ): 11.9e-6 · 10 · 0.1 = 1.19e-5 m.
func TestThermalCentreIndependentOfBaseRef(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	p := r3.Vec{X: 0.02, Y: -0.01, Z: 0.03}
	th := Thermal{DeltaT: 10, Moving: 23.6e-6, Base: 11.9e-6}
	d0, err := a.Drift(th, p)
	if err != nil {
		t.Fatal(err)
	}
	th.BaseRef = r3.Vec{X: 0.1}
	d1, err := a.Drift(th, p)
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range []Drift{d0, d1} {
		if !d.HasCentre || r3.Norm(lateral(d.Centre)) > 1e-12 {
			t.Errorf("BaseRef %v: thermal centre %v (has %v), want the origin", th.BaseRef, d.Centre, d.HasCentre)
		}
	}
	if e := r3.Norm(r3.Sub(d1.Relative, d0.Relative)); e > 1e-15 {
		t.Errorf("exact drift relative to the base: %v then %v, want the same", d0.Relative, d1.Relative)
	}
	if e := r3.Norm(r3.Sub(d1.RelativeLinear, d0.RelativeLinear)); e > 1e-17 {
		t.Errorf("linear drift relative to the base: %v then %v, want the same", d0.RelativeLinear, d1.RelativeLinear)
	}
	shift := r3.Vec{X: -11.9e-6 * 10 * 0.1}
	for _, got := range []r3.Vec{r3.Sub(d1.World, d0.World), r3.Sub(d1.WorldLinear, d0.WorldLinear)} {
		if e := r3.Norm(r3.Sub(got, shift)); e > 1e-15 {
			t.Errorf("world drift changed by %v, want %v", got, shift)
		}
	}
}

// TestThermalCentreSocket: a socket holds its ball's centre laterally
// fixed to the base (its three faces expand symmetrically about the
// socket axis), and a vee aimed at the socket lets the body grow along the
// groove line without turning, so the thermal centre of a
// socket–vee–flat is the socket's ball centre (closed form), wherever the
// base is held.
func TestThermalCentreSocket(t *testing.T) {
	c := mustSVF(t)
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	s := c.Pairs[0].Ball.Centre
	for _, ref := range []r3.Vec{{}, s, {X: 0.1, Y: -0.05}} {
		d, err := a.Drift(Thermal{DeltaT: 10, Moving: 23.6e-6, Base: 11.9e-6, BaseRef: ref}, r3.Vec{Z: 0.03})
		if err != nil {
			t.Fatal(err)
		}
		if !d.HasCentre || r3.Norm(lateral(r3.Sub(d.Centre, s))) > 1e-12 {
			t.Errorf("BaseRef %v: thermal centre %v (has %v), want the socket's ball centre %v", ref, d.Centre, d.HasCentre, s)
		}
	}
}

// TestThermalCentreNoneWithoutLateralField: a thermal centre needs a
// lateral relative motion that turns or strains across the plane; when
// there is none, HasCentre is false (not a point computed from rounding)
// and the scorecard marks the distance unavailable. Worked by hand:
//
// Symmetric three-vee (radial 90° grooves on the equilateral triangle,
// Up vertical, 5 mm steel balls). The layout has a mirror plane through
// each ball and the z axis; a rotation about z changes sign under a
// mirror, so the first-order motion has none, and with the body and the
// base expanding alike (or not at all) there is no strain either: the
// lateral relative motion is zero everywhere. What is left is the balls'
// growth: a ball grown by Δr = α_ball r ΔT in a 90° vee, whose flanks keep
// their planes through the root, rises by Δr/cos 45° = √2 Δr; the body
// and the base scaled alike by α ΔT are a similarity, in which the ball
// should have grown by α r ΔT, so relative to the base the body rises by
// √2 (α_ball − α) r ΔT, the same at every point (no tilt).
//
// Socket–vee–flat with its vee aimed at the socket (mustSVF): each seat
// is symmetric about its vertical Up (the socket's three faces, the vee's
// two flanks, the flat), so the balls' growth lifts each ball centre
// straight up, by different amounts (the body tilts about a horizontal
// axis); no ball centre moves laterally, and the tilt moves points of
// the balls' plane (z = 0) only vertically: the lateral field in that
// plane is zero, and there is no centre, although a point 30 mm above it
// drifts laterally with the tilt.
func TestThermalCentreNoneWithoutLateralField(t *testing.T) {
	three, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	al := hertz.Aluminium6061T6.Alpha
	p := r3.Vec{X: 0.02, Y: -0.01, Z: 0.03}
	for _, tc := range []struct {
		name string
		c    Coupling
		th   Thermal
		rise float64 // the hand value of Relative.Z for the three-vee, m; 0: not checked
	}{
		{"three-vee, body and base alike", three, Thermal{DeltaT: 5, Moving: al, Base: al, BaseRef: r3.Vec{X: 0.1}},
			math.Sqrt2 * (hertz.Steel52100.Alpha - al) * 5e-3 * 5},
		{"three-vee, the balls' own expansion only", three, Thermal{DeltaT: 5},
			math.Sqrt2 * hertz.Steel52100.Alpha * 5e-3 * 5},
		{"socket-vee-flat, body and base alike", mustSVF(t), Thermal{DeltaT: 5, Moving: al, Base: al}, 0},
		{"socket-vee-flat, the balls' own expansion only", mustSVF(t), Thermal{DeltaT: 5}, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			a, err := tc.c.Assembly()
			if err != nil {
				t.Fatal(err)
			}
			d, err := a.Drift(tc.th, p)
			if err != nil {
				t.Fatal(err)
			}
			if d.HasCentre || d.Centre != (r3.Vec{}) || d.Distance != 0 {
				t.Errorf("thermal centre %v (has %v, distance %g), want none", d.Centre, d.HasCentre, d.Distance)
			}
			if tc.rise != 0 {
				want := r3.Vec{Z: tc.rise}
				for _, got := range []r3.Vec{d.RelativeLinear, d.Relative} {
					if !near(got, want, 1e-9*math.Abs(tc.rise)) {
						t.Errorf("drift relative to the base %v, want %v", got, want)
					}
				}
			} else {
				// No ball centre moves laterally.
				for _, pr := range tc.c.Pairs {
					db, err := a.Drift(tc.th, pr.Ball.Centre)
					if err != nil {
						t.Fatal(err)
					}
					if l := r3.Norm(lateral(db.RelativeLinear)); l > 1e-9*r3.Norm(db.RelativeLinear) {
						t.Errorf("ball %s moves laterally by %v", pr.Name, lateral(db.RelativeLinear))
					}
				}
			}
			// The scorecard reads the same drift per kelvin and marks the
			// centre distance unavailable.
			s := Scenario{Point: p, Thermal: tc.th}
			card, err := tc.c.Score(s)
			if err != nil {
				t.Fatal(err)
			}
			if !card.Unavailable.Has(FigureThermalCentreDistance) || card.ThermalCentreDistance != 0 {
				t.Errorf("scorecard: thermal centre distance %g, unavailable %v; want it unavailable", card.ThermalCentreDistance, card.Unavailable)
			}
			if card.Unavailable.Has(FigureDrift) {
				t.Errorf("scorecard: drift unavailable (%v)", card.Unavailable)
			}
			if want := r3.Norm(d.RelativeLinear) / tc.th.DeltaT; math.Abs(card.Drift-want) > 1e-9*want {
				t.Errorf("scorecard drift %g m/K, Drift %g m/K", card.Drift, want)
			}
		})
	}
}

// TestThermalCentreCantedVeesBallsOnly: three 90° vees on the equilateral
// triangle with radial grooves, each seat's Up canted by 20° about its
// groove line (towards +θ), and no body or base expansion: a ball grown
// by Δr is pushed along its seat's Up, which has a tangential component,
// so each ball centre moves by the same amount perpendicular to its
// groove, in the same sense about z. The layout is symmetric under turns
// of 120° about z, so the motion is a turn about z and a lift along it,
// and the lateral field is a rotation about the z axis: the thermal
// centre is the origin, where the groove lines meet, although only the
// balls expand. The scorecard's distance is Drift's, the lateral distance
// from the point to the origin, √(0.02² + 0.01²) m.
func TestThermalCentreCantedVeesBallsOnly(t *testing.T) {
	bs := equilateral()
	var vs [3]Vee
	const cant = 20 * math.Pi / 180
	for i, b := range bs {
		v := vee45
		tang := r3.Unit(r3.Cross(up, b.Centre))
		v.Up = r3.Add(r3.Scale(math.Cos(cant), up), r3.Scale(math.Sin(cant), tang))
		vs[i] = v
	}
	c, err := AimedVees(bs, r3.Vec{}, vs)
	if err != nil {
		t.Fatal(err)
	}
	a, err := c.Assembly()
	if err != nil {
		t.Fatal(err)
	}
	p := r3.Vec{X: 0.02, Y: -0.01, Z: 0.03}
	d, err := a.Drift(Thermal{DeltaT: 1}, p)
	if err != nil {
		t.Fatal(err)
	}
	want := math.Hypot(0.02, 0.01)
	if !d.HasCentre || r3.Norm(lateral(d.Centre)) > 1e-12 || math.Abs(d.Distance-want) > 1e-12 {
		t.Errorf("thermal centre %v (has %v), distance %g; want the origin, %g", d.Centre, d.HasCentre, d.Distance, want)
	}
	if math.Abs(d.LinearTilt.Z) == 0 {
		t.Errorf("turn about z %g, want one", d.LinearTilt.Z)
	}
	card, err := c.Score(Scenario{Point: p})
	if err != nil {
		t.Fatal(err)
	}
	if card.Unavailable.Has(FigureThermalCentreDistance) || math.Abs(card.ThermalCentreDistance-want) > 1e-12 {
		t.Errorf("scorecard: thermal centre distance %g (unavailable %v), want %g", card.ThermalCentreDistance, card.Unavailable, want)
	}
}
