package kinematic

import (
	"errors"
	"math"
	"slices"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
)

// bruteForce returns the best cost over a grid of m azimuths per groove
// (from radial, over [−π/2, π/2) or the windows given), evaluated through
// the public Score of each layout built with WithGroove: an independent
// route from the optimiser's own variables.
func bruteForce(t *testing.T, c Coupling, s Scenario, obj Objective, wins []Window, m int) (float64, []float64) {
	t.Helper()
	best, bestAz := math.Inf(1), make([]float64, 3)
	az := make([]float64, 3)
	lo, hi := [3]float64{-math.Pi / 2, -math.Pi / 2, -math.Pi / 2}, [3]float64{math.Pi / 2, math.Pi / 2, math.Pi / 2}
	for i, w := range wins {
		lo[i], hi[i] = w.Min, w.Max
	}
	for i := 0; i < m; i++ {
		for j := 0; j < m; j++ {
			for k := 0; k < m; k++ {
				az[0] = lo[0] + (float64(i)+0.5)/float64(m)*(hi[0]-lo[0])
				az[1] = lo[1] + (float64(j)+0.5)/float64(m)*(hi[1]-lo[1])
				az[2] = lo[2] + (float64(k)+0.5)/float64(m)*(hi[2]-lo[2])
				cc := c
				var err error
				for q := 0; q < 3 && err == nil; q++ {
					cc, err = cc.WithGroove(q, az[q], Radial)
				}
				if err != nil {
					t.Fatal(err)
				}
				card, err := cc.Score(s)
				if err != nil {
					continue // a singular layout
				}
				if v := cost(obj, &card); v < best {
					best = v
					copy(bestAz, az)
				}
			}
		}
	}
	return best, bestAz
}

// TestOptimizeAgainstGrid: for each objective, the optimum is at least as
// good as the best of a 24³ brute-force grid over the same azimuths (the
// grid is the independent check; the optimiser refines, so it may be
// better), and not better than the grid by more than the grid's
// resolution allows (a smooth figure changes by at most its slope times
// half a grid step, π/48): checked loosely as 30 %.
func TestOptimizeAgainstGrid(t *testing.T) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	for _, obj := range []Objective{MinAmplification, MinDrift, MaxShockLevel, MaxFirstFrequency, MaxContactIndex, MinCompliance} {
		res, err := Optimize(c, s, &OptimizeOptions{Objective: obj})
		if err != nil {
			t.Fatal(err)
		}
		grid, _ := bruteForce(t, c, s, obj, nil, 24)
		got := cost(obj, &res.Score)
		if got > grid+1e-9*math.Abs(grid) {
			t.Errorf("%v: optimum %g worse than the grid's %g", obj, got, grid)
		}
		if math.Abs(got-grid) > 0.3*math.Abs(grid) {
			t.Errorf("%v: optimum %g far from the grid's %g", obj, got, grid)
		}
		if res.BisectorFeasible && got > cost(obj, &res.Bisector)+1e-12*math.Abs(got) {
			t.Errorf("%v: optimum %g worse than the bisector layout %g", obj, got, cost(obj, &res.Bisector))
		}
		if math.Abs(res.Value-figure(obj, &res.Score)) > 0 {
			t.Errorf("%v: Value %g, figure %g", obj, res.Value, figure(obj, &res.Score))
		}
		// The returned coupling scores what the result says.
		again, err := res.Coupling.Score(s)
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(cost(obj, &again) - got); d > 1e-9*math.Abs(got) {
			t.Errorf("%v: the returned coupling scores %g, the result says %g", obj, cost(obj, &again), got)
		}
	}
}

// TestOptimizeSymmetric: on the equilateral triangle with the point of
// interest on the axis of symmetry, the error-amplification optimum is
// symmetric: all three grooves at the same azimuth from radial (the
// threefold symmetry maps the layout with azimuths (a, b, c) to
// (b, c, a), which scores the same, and the optimum is unique up to the
// reflection a → −a).
func TestOptimizeSymmetric(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	s.Point = r3.Vec{Z: 0.05}
	res, err := Optimize(c, s, nil)
	if err != nil {
		t.Fatal(err)
	}
	a := res.Azimuths
	if math.Abs(wrapAzimuth(a[0]-a[1])) > 1e-4 || math.Abs(wrapAzimuth(a[1]-a[2])) > 1e-4 {
		t.Errorf("azimuths %v, want all equal by symmetry", a)
	}
}

// TestOptimizeBinding: a window that keeps groove B away from where the
// unconstrained optimum puts it makes the window's edge bind, and the
// optimum sits on it; a Maxwell floor above what the unconstrained
// optimum reaches binds too.
func TestOptimizeBinding(t *testing.T) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	// Without the default screen (MaxCondition +Inf) nothing binds: this
	// layout's best grooves for the point of interest make a contact
	// matrix of condition about 29.
	free, err := Optimize(c, s, &OptimizeOptions{MaxCondition: math.Inf(1)})
	if err != nil {
		t.Fatal(err)
	}
	if len(free.Binding) != 0 || free.Status != Converged {
		t.Errorf("unconstrained: binding %v, status %v", free.Binding, free.Status)
	}
	// With the default screen (condition ≤ DesignCondition = 10) the
	// screen holds the optimum back, and the result says so.
	if free.Score.Condition <= DesignCondition {
		t.Fatalf("the free optimum's condition is %g: the screen cannot be tested on this layout", free.Score.Condition)
	}
	screened, err := Optimize(c, s, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Contains(screened.Binding, "MaxCondition") || screened.Status != Constrained ||
		screened.Score.Condition > DesignCondition*(1+1e-9) || screened.Score.Amplification < free.Score.Amplification {
		t.Errorf("default screen: binding %v, status %v, condition %g, amplification %g (free %g)",
			screened.Binding, screened.Status, screened.Score.Condition, screened.Score.Amplification, free.Score.Amplification)
	}
	b := free.Azimuths[1]
	all := Window{Min: -math.Pi / 2, Max: math.Pi / 2}
	wins := []Window{all, {Min: b + 0.2, Max: b + 1}, all}
	res, err := Optimize(c, s, &OptimizeOptions{Windows: wins})
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, bd := range res.Binding {
		found = found || bd == "Windows[1].Min"
	}
	if res.Status != Constrained {
		t.Errorf("window excluding the optimum: status %v, want Constrained", res.Status)
	}
	if !found || math.Abs(wrapAzimuth(res.Azimuths[1]-(b+0.2))) > 1e-6 {
		t.Errorf("window excluding the optimum: binding %v, groove B at %g (edge %g)", res.Binding, res.Azimuths[1], b+0.2)
	}
	if res.Score.Amplification < free.Score.Amplification {
		t.Errorf("windowed optimum %g better than the free one %g", res.Score.Amplification, free.Score.Amplification)
	}
	floor := math.Min(0.999, free.Score.WeakestCentreIndex+0.5*(1-free.Score.WeakestCentreIndex))
	if free.Score.WeakestCentreIndex < 0.999 {
		res, err = Optimize(c, s, &OptimizeOptions{MinCentreIndex: floor})
		if err != nil {
			t.Fatal(err)
		}
		found = false
		for _, bd := range res.Binding {
			found = found || bd == "MinCentreIndex"
		}
		if !found || res.Score.WeakestCentreIndex < floor*(1-1e-9) {
			t.Errorf("Maxwell floor %g: binding %v, weakest centre index %g", floor, res.Binding, res.Score.WeakestCentreIndex)
		}
	}
}

// TestOptimizeRegionsAndAngles: letting the balls move in 10 mm discs can
// only help the objective, the balls stay in their discs, and with a
// half-angle list every groove gets one of the listed values.
func TestOptimizeRegionsAndAngles(t *testing.T) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	fixed, err := Optimize(c, s, nil)
	if err != nil {
		t.Fatal(err)
	}
	regs := []Region{{Radius: 0.01}, {Radius: 0.01}, {HalfWidth: [2]float64{0.005, 0.01}}}
	moved, err := Optimize(c, s, &OptimizeOptions{Regions: regs, HalfAngles: []float64{math.Pi / 4, math.Pi / 3}})
	if err != nil {
		t.Fatal(err)
	}
	if moved.Score.Amplification > fixed.Score.Amplification*(1+1e-9) {
		t.Errorf("free balls %g worse than fixed %g", moved.Score.Amplification, fixed.Score.Amplification)
	}
	for i, p := range moved.Coupling.Pairs {
		d := r3.Sub(p.Ball.Centre, c.Pairs[i].Ball.Centre)
		if i < 2 && r3.Norm(d) > 0.01*(1+1e-9) || i == 2 && (math.Abs(d.X) > 0.005*(1+1e-9) || math.Abs(d.Y) > 0.01*(1+1e-9)) || math.Abs(d.Z) > 1e-15 {
			t.Errorf("ball %d moved by %v, outside its region", i, d)
		}
		h := p.Seat.(Vee).HalfAngle
		if h != math.Pi/4 && h != math.Pi/3 {
			t.Errorf("groove %d half-angle %g, not in the list", i, h)
		}
	}
}

// TestOptimizeTradeOff: the trade-off curve between error amplification
// and thermal drift runs from the amplification optimum to the drift
// optimum, and no point on it is dominated by another.
func TestOptimizeTradeOff(t *testing.T) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	s := scenario()
	res, err := Optimize(c, s, &OptimizeOptions{TradeOff: &TradeOff{Objective: MinDrift, Points: 6}})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Front) < 2 {
		t.Fatalf("%d points on the front", len(res.Front))
	}
	first, last := res.Front[0], res.Front[len(res.Front)-1]
	if first.First > last.First || first.Second < last.Second {
		t.Errorf("front from (%g, %g) to (%g, %g): want amplification rising and drift falling", first.First, first.Second, last.First, last.Second)
	}
	for i, p := range res.Front {
		for j, q := range res.Front {
			if i != j && q.First < p.First*(1-1e-9) && q.Second < p.Second*(1-1e-9) {
				t.Errorf("point %d (%g, %g) dominated by %d (%g, %g)", i, p.First, p.Second, j, q.First, q.Second)
			}
		}
	}
}

// TestOptimizeErrors: objectives the scenario cannot give, bad windows,
// regions, half-angles and floors are named.
func TestOptimizeErrors(t *testing.T) {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	bare := Scenario{Point: r3.Vec{Z: 0.05}}
	var ie *InputError
	for _, tc := range []struct {
		name  string
		s     Scenario
		opt   *OptimizeOptions
		field string
	}{
		{"shock without payload", bare, &OptimizeOptions{Objective: MaxShockLevel}, "opt.Objective"},
		{"frequency without inertia", bare, &OptimizeOptions{Objective: MaxFirstFrequency}, "opt.Objective"},
		{"unknown objective", bare, &OptimizeOptions{Objective: 42}, "opt.Objective"},
		{"windows length", bare, &OptimizeOptions{Windows: []Window{{}}}, "opt.Windows"},
		{"inverted window", bare, &OptimizeOptions{Windows: []Window{{Min: 1, Max: 0}, {}, {}}}, "opt.Windows[0]"},
		{"NaN window", bare, &OptimizeOptions{Windows: []Window{{}, {Min: math.NaN()}, {}}}, "opt.Windows[1]"},
		{"negative region", bare, &OptimizeOptions{Regions: []Region{{}, {Radius: -1}, {}}}, "opt.Regions[1]"},
		{"half-angle 95°", bare, &OptimizeOptions{HalfAngles: []float64{math.Pi / 4, 95 * math.Pi / 180}}, "opt.HalfAngles[1]"},
		{"Maxwell floor 1", bare, &OptimizeOptions{MinCentreIndex: 1}, "opt.MinCentreIndex"},
		{"contact floor 1", bare, &OptimizeOptions{MinContactIndex: 1}, "opt.MinContactIndex"},
		{"NaN contact floor", bare, &OptimizeOptions{MinContactIndex: math.NaN()}, "opt.MinContactIndex"},
		{"condition ceiling below 1", bare, &OptimizeOptions{MaxCondition: 0.5}, "opt.MaxCondition"},
		{"one trade-off point", bare, &OptimizeOptions{TradeOff: &TradeOff{Points: 1}}, "opt.TradeOff.Points"},
	} {
		if _, err := Optimize(c, tc.s, tc.opt); !errors.As(err, &ie) || ie.Field != tc.field {
			t.Errorf("%s: err = %v, want field %q", tc.name, err, tc.field)
		}
	}
	// A pressure ceiling no layout can meet.
	s := scenario()
	if _, err := Optimize(c, s, &OptimizeOptions{MaxPressureRatio: 1e-3}); !errors.Is(err, ErrRange) {
		t.Errorf("impossible pressure ceiling: %v", err)
	}
	if _, err := Optimize(Coupling{Pairs: c.Pairs[:2]}, s, nil); !errors.Is(err, ErrNotExact) {
		t.Errorf("four contacts: %v", err)
	}
}

// cantedVees returns the equilateral balls in 90° vees whose Up leans
// tilt towards the triangle's centre, grooves radial.
func cantedVees(tilt float64) Coupling {
	var c Coupling
	for _, b := range equilateral() {
		in := r3.Unit(r3.Scale(-1, r3.Vec{X: b.Centre.X, Y: b.Centre.Y}))
		v := vee45
		v.Up = r3.Add(r3.Scale(math.Cos(tilt), up), r3.Scale(math.Sin(tilt), in))
		v.Direction = in
		c.Pairs = append(c.Pairs, Pair{Ball: b, Seat: v})
	}
	return c
}

// TestOptimizeDefaultScreen: on vees canted 30° inwards with the point of
// interest 20 mm below the balls, MinAmplification alone finds layouts
// whose loose motion pivots about the point (the error there stays small
// however loose the coupling is), so without a screen it returns a
// near-mechanism: a condition far above DesignCondition. The default
// screen holds the condition at DesignCondition and says so (Binding
// "MaxCondition", Status Constrained); the radial start (condition below
// 10, so feasible) bounds the objective.
func TestOptimizeDefaultScreen(t *testing.T) {
	c := cantedVees(30 * math.Pi / 180)
	s := Scenario{Point: r3.Vec{Z: -0.02}}
	free, err := Optimize(c, s, &OptimizeOptions{MaxCondition: math.Inf(1)})
	if err != nil {
		t.Fatal(err)
	}
	if free.Score.Condition <= 10*DesignCondition || slices.Contains(free.Binding, "MaxCondition") {
		t.Fatalf("unscreened: condition %g, binding %v; want a near-mechanism (condition above %g) and no screen", free.Score.Condition, free.Binding, 10.0*DesignCondition)
	}
	res, err := Optimize(c, s, nil)
	if err != nil {
		t.Fatal(err)
	}
	if res.Start.Condition > DesignCondition {
		t.Fatalf("start condition %g: the radial start should pass the screen", res.Start.Condition)
	}
	if res.Score.Condition > DesignCondition*(1+1e-9) || res.Score.Poor {
		t.Errorf("default: condition %g (poor %v), want at most %d", res.Score.Condition, res.Score.Poor, DesignCondition)
	}
	if !slices.Contains(res.Binding, "MaxCondition") || res.Status != Constrained {
		t.Errorf("default: binding %v, status %v; want MaxCondition, Constrained", res.Binding, res.Status)
	}
	if res.Score.Amplification > res.Start.Amplification*(1+1e-12) {
		t.Errorf("default: amplification %g worse than the start's %g", res.Score.Amplification, res.Start.Amplification)
	}
}

// TestOptimizeRefusesUnavailableFigures: a ceiling on the pressure ratio,
// or an objective, that the scenario cannot compute for the coupling is an
// error naming the option, not a constraint silently dropped. Silicon
// nitride has no contact allowable on file (hertz.SiliconNitride.Source),
// so no contact of a silicon nitride ball can be judged; without
// materials no stiffness can be computed.
func TestOptimizeRefusesUnavailableFigures(t *testing.T) {
	bs := equilateral()
	for i := range bs {
		bs[i].Material = hertz.SiliconNitride
	}
	c, err := BisectorVees(bs, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	var ie *InputError
	_, err = Optimize(c, scenario(), &OptimizeOptions{MaxPressureRatio: 0.5})
	if !errors.As(err, &ie) || ie.Field != "opt.MaxPressureRatio" || !errors.Is(err, ErrDegenerate) {
		t.Errorf("pressure ceiling without allowables: %v", err)
	}
	bare := vee45
	bare.Material = hertz.Material{}
	c, err = BisectorVees(equilateral(), three(bare))
	if err != nil {
		t.Fatal(err)
	}
	for _, obj := range []Objective{MaxFirstFrequency, MinCompliance} {
		_, err = Optimize(c, scenario(), &OptimizeOptions{Objective: obj})
		if !errors.As(err, &ie) || ie.Field != "opt.Objective" || !errors.Is(err, ErrDegenerate) {
			t.Errorf("%v without seat materials: %v", obj, err)
		}
	}
}

// TestOptimizeWindowInDegrees: a window written in degrees (20 to 160,
// meant as 20° to 160°) is wider than π radians, which would allow every
// azimuth; a limit beyond one turn is refused as the slip it is.
func TestOptimizeWindowInDegrees(t *testing.T) {
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	all := Window{Min: -math.Pi / 2, Max: math.Pi / 2}
	_, err = Optimize(c, scenario(), &OptimizeOptions{Windows: []Window{all, {Min: 20, Max: 160, From: FrameX}, all}})
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "opt.Windows[1].Min" || !errors.Is(err, ErrRange) {
		t.Errorf("window in degrees: %v", err)
	}
}
