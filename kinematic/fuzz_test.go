package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/screw"
)

// contactBytes encodes contacts as float64s, seven per contact: point,
// normal, radius; a contact with a radius has its ball centre at
// Point + Radius·Normal.
func contactBytes(cs []Contact) []byte {
	var b []byte
	for _, c := range cs {
		b = fuzzdata.Append(b, c.Point.X, c.Point.Y, c.Point.Z, c.Normal.X, c.Normal.Y, c.Normal.Z, c.Radius)
	}
	return b
}

func bytesContacts(b []byte) []Contact {
	var cs []Contact
	for _, x := range fuzzdata.Floats(b, 7) {
		c := Contact{Point: r3.Vec{X: x[0], Y: x[1], Z: x[2]}, Normal: r3.Vec{X: x[3], Y: x[4], Z: x[5]}, Radius: x[6]}
		c.Centre = r3.Add(c.Point, r3.Scale(c.Radius, c.Normal))
		cs = append(cs, c)
	}
	return cs
}

// FuzzAnalyze checks that Analyze and Stability never panic, and that what
// they return without an error is consistent: DOF = 6 − Rank, Maxwell
// indices in [0, 1], and freed twists with power δᵢⱼ against the contacts
// when the set is not near-singular.
func FuzzAnalyze(f *testing.F) {
	for _, c := range []Coupling{threeVeesF(f), svfF(f)} {
		cs, err := c.Contacts()
		if err != nil {
			f.Fatal(err)
		}
		f.Add(contactBytes(cs))
	}
	f.Add(contactBytes([]Contact{{Point: r3.Vec{X: 1}, Normal: up}, {Point: r3.Vec{Y: 1}, Normal: up}}))
	// Subnormal normals, and a coupling 10 km from the origin.
	f.Add(contactBytes([]Contact{{Point: r3.Vec{X: 1}, Normal: r3.Vec{Z: 5e-324}}, {Point: r3.Vec{Y: 1}, Normal: r3.Vec{X: -5e-324, Y: 5e-324}}}))
	far, err := moved(threeVeesF(f), 1, 0.3, up, r3.Vec{X: 1e4, Y: -3e3}).Contacts()
	if err != nil {
		f.Fatal(err)
	}
	f.Add(contactBytes(far))
	f.Fuzz(func(t *testing.T, b []byte) {
		cs := bytesContacts(b)
		if len(cs) > 16 {
			return
		}
		an, err := Analyze(cs)
		if err != nil {
			return
		}
		if an.DOF != 6-an.Rank || len(an.Free) != an.DOF || len(an.Participants) != len(an.Redundant) {
			t.Fatalf("DOF %d, rank %d, %d free, %d participants for %d redundancies", an.DOF, an.Rank, len(an.Free), len(an.Participants), len(an.Redundant))
		}
		st, err := an.Stability()
		if err != nil {
			if !errors.Is(err, ErrNotExact) {
				t.Fatalf("stability: %v", err)
			}
			return
		}
		// An index is 1 at most, to rounding of the coordinates: ε times
		// their magnitude, relative to the size of the set.
		var far float64
		for _, c := range cs {
			far = max(far, r3.Norm(c.Point), r3.Norm(c.Centre))
		}
		tol := 1e-12 + 1e-14*far/an.Length
		for i, m := range st.Contacts {
			if !(m.Index >= 0 && m.Index <= 1+tol) || !(m.CentreIndex >= 0 && m.CentreIndex <= 1+tol) {
				t.Fatalf("%d: index %g, centre index %g", i, m.Index, m.CentreIndex)
			}
			if st.Contacts[st.Weakest].Index > m.Index+tieTol {
				t.Fatalf("weakest %d has index %g above %d's %g", st.Weakest, st.Contacts[st.Weakest].Index, i, m.Index)
			}
		}
		if an.NearSingular {
			return
		}
		for i, m := range st.Contacts {
			for j, c := range cs {
				w, err := screw.Line(c.Point, c.Normal)
				if err != nil {
					t.Fatal(err)
				}
				want := 0.0
				if i == j {
					want = 1
				}
				// Power relative to its terms, and to moving the twist
				// from the contacts to the origin (see screw's tests).
				scale := 1 + r3.Norm(m.Freed.W)*(r3.Norm(w.M)+r3.Norm(an.Centre)+an.Length) + r3.Norm(m.Freed.V)
				if p := screw.Power(m.Freed, w); math.Abs(p-want) > 1e-10*an.Condition*scale {
					t.Fatalf("freed %d with contact %d: power %g, want %g (scale %g)", i, j, p, want, scale)
				}
			}
		}
	})
}

func threeVeesF(f *testing.F) Coupling {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		f.Fatal(err)
	}
	return c
}

func svfF(f *testing.F) Coupling {
	c, err := SocketVeeFlat(isosceles(), cube, vee45, flatUp)
	if err != nil {
		f.Fatal(err)
	}
	return c
}

// FuzzGeometry builds a three-ball coupling from fuzzed numbers (ball
// centres, radius, and each seat's Up, Direction and half-angle; seat C a
// flat when its half-angle is negative) and checks that Contacts and
// Geometry never panic and return finite numbers whenever they return no
// error: unit normals, contact points a radius from the centres, angles in
// range.
func FuzzGeometry(f *testing.F) {
	seed := func(bs [3]Ball, vs [3]Vee) []byte {
		var b []byte
		for i := range bs {
			c, v := bs[i].Centre, vs[i]
			b = fuzzdata.Append(b, c.X, c.Y, c.Z, bs[i].Radius, v.Up.X, v.Up.Y, v.Up.Z, v.Direction.X, v.Direction.Y, v.Direction.Z, v.HalfAngle)
		}
		return b
	}
	bis := threeVeesF(f)
	var bs [3]Ball
	var vs [3]Vee
	for i, p := range bis.Pairs {
		bs[i], vs[i] = p.Ball, p.Seat.(Vee)
	}
	f.Add(seed(bs, vs))
	sub := vs
	sub[0].Up, sub[1].Direction = r3.Vec{Z: 5e-324}, r3.Vec{X: 5e-324}
	f.Add(seed(bs, sub))
	line := [3]Ball{ball(-50, 0, 0), ball(0, 0, 0), ball(50, 0, 0)}
	f.Add(seed(line, vs))
	// A millimetre design read as metres: radius 6.35 "m", centres 0.1 m
	// apart (refused: the balls overlap).
	slip := [3]Ball{{Centre: r3.Vec{X: 0.1}, Radius: 6.35}, {Centre: r3.Vec{Y: 0.1}, Radius: 6.35}, {Centre: r3.Vec{X: -0.1}, Radius: 6.35}}
	f.Add(seed(slip, vs))
	// One radius mistyped (5 for 5 mm): the larger ball is named.
	one := bs
	one[0].Radius = 5
	f.Add(seed(one, vs))
	// Touching balls (accepted) and the coupling 1e300 m away (refused).
	touch := [3]Ball{{Centre: r3.Vec{X: -0.05}, Radius: 0.025}, {Centre: r3.Vec{}, Radius: 0.025}, {Centre: r3.Vec{Y: 0.05}, Radius: 0.025}}
	f.Add(seed(touch, vs))
	far := bs
	for i := range far {
		far[i].Centre.X += 1e300
	}
	f.Add(seed(far, vs))
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 11)
		if len(xs) != 3 {
			return
		}
		var c Coupling
		for i, x := range xs {
			bl := Ball{Centre: r3.Vec{X: x[0], Y: x[1], Z: x[2]}, Radius: x[3]}
			var s Seat = Vee{Up: r3.Vec{X: x[4], Y: x[5], Z: x[6]}, Direction: r3.Vec{X: x[7], Y: x[8], Z: x[9]}, HalfAngle: x[10]}
			if i == 2 && x[10] < 0 {
				s = Flat{Up: r3.Vec{X: x[4], Y: x[5], Z: x[6]}}
			}
			c.Pairs = append(c.Pairs, Pair{Ball: bl, Seat: s})
		}
		cs, err := c.Contacts()
		if err != nil {
			return
		}
		for _, ct := range cs {
			if !linalgFinite(ct.Point) || math.Abs(r3.Norm(ct.Normal)-1) > 1e-12 {
				t.Fatalf("contact %s: point %v, normal %v", ct.Label, ct.Point, ct.Normal)
			}
		}
		// Accepted geometry can exist: no two balls overlap, and no
		// contact lies inside another ball (slack 2e-6 beyond overlapTol
		// for rounding).
		for i, p := range c.Pairs {
			for j := 0; j < i; j++ {
				q := c.Pairs[j].Ball
				if d := r3.Norm(r3.Sub(p.Ball.Centre, q.Centre)); d < (p.Ball.Radius+q.Radius)*(1-2e-6) {
					t.Fatalf("balls %d and %d overlap: %g apart, radii %g %g", i, j, d, p.Ball.Radius, q.Radius)
				}
			}
		}
		g, err := c.Geometry()
		if err != nil {
			t.Fatalf("Geometry after Contacts succeeded: %v", err)
		}
		for _, gr := range g.Grooves {
			for _, a := range []float64{gr.Azimuth, gr.FrameAzimuth} {
				if !(a > -math.Pi/2-1e-12 && a <= math.Pi/2+1e-12) {
					t.Fatalf("groove %d azimuth %g", gr.Pair, a)
				}
			}
			for _, a := range []float64{gr.OffBisector, gr.OffSocket} {
				if !(a >= 0 && a <= math.Pi/2+1e-12) {
					t.Fatalf("groove %d off-angle %g", gr.Pair, a)
				}
			}
		}
		if g.HasCentre && (!linalgFinite(g.Centre) || math.IsNaN(g.Spread)) {
			t.Fatalf("centre %v spread %g", g.Centre, g.Spread)
		}
	})
}

// FuzzLoads builds a load case and a payload from fuzzed numbers (preload
// factor, gravity, base acceleration, an applied wrench, payload mass and
// centre, a gap for one contact) on a preloaded three-vee coupling, and
// checks that Statics, Shock, Equilibrium and Stiffness never panic and,
// without an error, return finite numbers: rigid forces that balance the
// load, a non-negative shock level, non-negative elastic forces with a
// small residual.
func FuzzLoads(f *testing.F) {
	add := func(x ...float64) { f.Add(fuzzdata.Append(nil, x...)) }
	add(1, 0, 0, -9.80665, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0.8, 0, 0, 0.03, 0)
	add(2, 0, 3, -9.8, 30, 0, 0, 1, -2, 3, 0.1, 0, 0, 0.5, 0.01, 0, 0.05, -1e-6)
	add(0, 0, 0, 9.8, 0, 0, 0, 0, 0, 5, 0, 0, 0, 1, 0, 0, 0, 1e-6)
	add(1, 5e-324, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1e-300, 0, 0, 0, 0)
	add(1e300, 0, 0, -1e300, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1e300, 0, 0, 0, 0)
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		f.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		f.Fatal(err)
	}
	pre := []Preload{{Point: r3.Vec{Y: 0.01, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 18)
		if len(xs) != 1 {
			return
		}
		x := xs[0]
		lc := LoadCase{
			PreloadFactor: x[0],
			Gravity:       r3.Vec{X: x[1], Y: x[2], Z: x[3]},
			Acceleration:  r3.Vec{X: x[4], Y: x[5], Z: x[6]},
			Applied:       []screw.Wrench{{F: r3.Vec{X: x[7], Y: x[8], Z: x[9]}, M: r3.Vec{X: x[10], Y: x[11], Z: x[12]}}},
		}
		m, err := NewModel(cs, pre, Payload{Mass: x[13], Centre: r3.Vec{X: x[14], Y: x[15], Z: x[16]}})
		if err != nil {
			return
		}
		s, err := m.Statics(lc)
		if err == nil {
			for _, cl := range s.Contacts {
				if math.IsNaN(cl.Force) || math.IsInf(cl.Force, 0) || math.IsNaN(cl.Hertz.PeakPressure) || math.IsNaN(cl.PressureRatio) {
					t.Fatalf("statics: %+v", cl)
				}
			}
		}
		if sh, err := m.Shock(lc, 9.8); err == nil {
			if math.IsNaN(sh.Unload) || sh.Unload < 0 {
				t.Fatalf("shock level %g", sh.Unload)
			}
		}
		opt := &EquilibriumOptions{Gaps: map[string]float64{"A+": x[17]}}
		if eq, err := m.Equilibrium(lc, opt); err == nil {
			for _, cl := range eq.Contacts {
				if !(cl.Force >= 0) || math.IsInf(cl.Force, 0) {
					t.Fatalf("equilibrium force %g", cl.Force)
				}
			}
			if !(eq.Residual <= 1e-9) {
				t.Fatalf("equilibrium residual %g", eq.Residual)
			}
			if !linalgFinite(eq.Displacement.W) || !linalgFinite(eq.Displacement.V) {
				t.Fatalf("displacement %+v", eq.Displacement)
			}
		}
		if st, err := m.Stiffness(lc, nil); err == nil {
			k := st.Matrix(r3.Vec{})
			for i := range k {
				for j := range k[i] {
					if math.IsNaN(k[i][j]) || math.IsInf(k[i][j], 0) {
						t.Fatalf("stiffness %v", k)
					}
				}
			}
			if md, err := st.Modes(); err == nil {
				for _, mo := range md {
					if !(mo.Frequency > 0) || math.IsInf(mo.Frequency, 0) {
						t.Fatalf("frequency %g", mo.Frequency)
					}
				}
			}
		}
	})
}

// FuzzSeat seats a three-vee assembly (one gothic-arch vee) with fuzzed
// deviations of its first dimensions and checks that Seat never panics
// and, without an error, returns a finite pose whose contacts are closed
// to the tolerance: every gap, recomputed here from the pose, within
// 1e-12 of the size.
func FuzzSeat(f *testing.F) {
	f.Add(fuzzdata.Append(nil, 1e-6, -2e-6, 3e-6, 0, 1e-4, 0, 0, 0))
	f.Add(fuzzdata.Append(nil, 0, 0, 0, 0, 0, 0, 0, 0))
	f.Add(fuzzdata.Append(nil, 5e-324, -5e-324, 1e300, 0, 0, 0, 0, 0))
	f.Add(fuzzdata.Append(nil, -6e-3, 0, 0, 0, 0, 0, 0, 0))
	a := generalAssemblies(f)["three-vee"]
	dims := a.Dimensions()
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 1)
		if len(xs) == 0 || len(xs) > len(dims) {
			return
		}
		devs := make([]Deviation, len(xs))
		for i, x := range xs {
			// Spread over every dimension by a stride.
			devs[i] = Deviation{dims[(7*i)%len(dims)], x[0]}
		}
		p, err := a.Pose(devs, nil)
		if err != nil {
			return
		}
		if !linalgFinite(p.Rotation) || !linalgFinite(p.Translation) {
			t.Fatalf("pose %+v", p)
		}
		g := a.nominal()
		for _, d := range devs {
			a.apply(&g, a.index[d.Dimension], d.Value)
		}
		for i := range g.c {
			w := r3.Sub(p.Apply(r3.Add(g.c[i], a.origin)), a.origin)
			gi, _, ok := g.surfs[i].gap(w, g.r[i])
			if !ok || math.Abs(gi) > 1e-12*a.size {
				t.Fatalf("contact %d: gap %g after seating (ok %v)", i, gi, ok)
			}
		}
	})
}

// FuzzSizePreload sizes three fuzzed preload elements on a three-vee
// coupling over two fuzzed load cases and checks that the sizing never
// panics and, without an error, returns non-negative factors that keep
// every contact at the minimum force in every case.
func FuzzSizePreload(f *testing.F) {
	f.Add(fuzzdata.Append(nil, 0, 0, -1, 10, 0.3, 0.1, -1, 5, 0, 0, -1, 5, 0, 0, -9.8, 2, 0, -9.8, 1))
	f.Add(fuzzdata.Append(nil, 0, 0, 1, 10, 0, 0, -1, 5, 0, 0, -1, 0, 0, 0, 9.8, 0, 0, 0, 0))
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		f.Fatal(err)
	}
	cs, err := c.Contacts()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 19)
		if len(xs) != 1 {
			return
		}
		x := xs[0]
		var pre []Preload
		for k := 0; k < 3; k++ {
			pre = append(pre, Preload{Point: cs[2*k].Centre, Direction: r3.Vec{X: x[4*k], Y: x[4*k+1], Z: x[4*k+2]}, Force: x[4*k+3]})
		}
		m, err := NewModel(cs, pre, Payload{Mass: 1, Centre: r3.Vec{Z: 0.02}})
		if err != nil {
			return
		}
		cases := []LoadCase{{Gravity: r3.Vec{X: x[12], Y: x[13], Z: x[14]}}, {Gravity: r3.Vec{X: x[15], Y: x[16], Z: x[17]}}}
		sz, err := m.SizePreload(cases, math.Abs(x[18]))
		if err != nil {
			return
		}
		for _, s := range sz.Factors {
			if !(s >= 0) || math.IsInf(s, 0) {
				t.Fatalf("factor %g", s)
			}
		}
	})
}
