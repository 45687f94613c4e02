package kinematic

import (
	"context"
	"errors"
	"math"
	"reflect"
	"strconv"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/screw"
)

// wantField checks that err is an *InputError naming field and wrapping
// sentinel.
func wantField(t *testing.T, what string, err error, field string, sentinel error) {
	t.Helper()
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != field || !errors.Is(err, sentinel) {
		t.Errorf("%s: got %v, want an *InputError naming %q wrapping %v", what, err, field, sentinel)
	}
}

// TestOverflowNamesTheInput: finite inputs whose results leave the
// floating-point range return ErrRange naming the input (the slips of
// issue 15, item 2). Each input is chosen so that a product of it with the
// design's own magnitudes (forces of tens of newtons, lengths of tens of
// millimetres, levers of order 1/size) exceeds math.MaxFloat64 ≈ 1.8e308
// (IEEE 754-2019 binary64) or, for the mass, its reciprocal does.
func TestOverflowNamesTheInput(t *testing.T) {
	far := r3.Vec{X: 1e300}

	// A payload of 5e-324 kg (the smallest subnormal): a contact of tens
	// of newtons unloads at f/(m·|T|) ≈ 1e325 m/s².
	m, err := NewModel(mustContacts(t, mustBisector(t)), []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}},
		Payload{Mass: 5e-324, Centre: r3.Vec{Z: 0.03}})
	if err != nil {
		t.Fatal(err)
	}
	_, err = m.Shock(LoadCase{PreloadFactor: 1}, 9.8)
	wantField(t, "Shock with 5e-324 kg", err, "payload.Mass", ErrRange)

	mp, _ := equilateralModel(t, math.Pi/4, 60, 0.8, 0.03)
	st, err := mp.Stiffness(LoadCase{PreloadFactor: 1}, nil)
	if err != nil {
		t.Fatal(err)
	}
	// The compliance at r carries r² times the rotational compliance:
	// (1e300)² overflows.
	_, err = st.Compliance(far)
	wantField(t, "Compliance at 1e300 m", err, "at", ErrRange)

	stab := mustStability(t, mustBisector(t))
	_, err = stab.Amplification(r3.Vec{X: 1e300, Y: 1e300, Z: 1e300})
	wantField(t, "Amplification at 1e300 m", err, "p", ErrRange)

	a, err := mustBisector(t).Assembly()
	if err != nil {
		t.Fatal(err)
	}
	// The displacement V + W × p per unit of a ball radius has |W| of
	// about 1/(50 mm): 1e308 m times it overflows.
	_, err = a.Sensitivities(r3.Vec{X: 1e308, Y: 1e308, Z: 1e308})
	wantField(t, "Sensitivities at 1e300 m", err, "p", ErrRange)

	// μ = 1e300 times a contact force of about 14 N, times a compliance
	// of about 1e-8 m/N: the friction force is finite (1.4e301), its
	// square in the displacement's norm is not.
	_, err = mp.Repeatability(LoadCase{PreloadFactor: 1}, 1e300, r3.Vec{Z: 0.05})
	wantField(t, "Repeatability with μ = 1e300", err, "mu", ErrRange)

	// A tolerance of 1e300 m on a ball radius moves the point by about
	// 1e300 m per contact: the RSS squares it.
	p := r3.Vec{Z: 0.05}
	_, err = a.Budget(p, []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 1e300}})
	wantField(t, "Budget with 1e300 m", err, "tols[0].HalfWidth", ErrRange)

	// 3σ of 1e308 is 3e308 > MaxFloat64.
	_, err = a.Budget(p, []Tolerance{{Dimension: "A.Ball.Radius", Sigma: 1e308}})
	wantField(t, "Budget with σ = 1e308", err, "tols[0].Sigma", ErrRange)

	_, err = a.Study(context.Background(), p, []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 1e300}}, &StudyOptions{Samples: 10})
	wantField(t, "Study with 1e300 m", err, "tols[0].HalfWidth", ErrRange)

	s := scenario()
	s.Point = r3.Vec{X: 1e300}
	_, err = mustBisector(t).Score(s)
	wantField(t, "Score with Point.X = 1e300", err, "s.Point", ErrRange)

	_, err = mp.LiftOff(LoadCase{PreloadFactor: 1}, r3.Vec{Z: 1}, []r3.Vec{{}, {X: 1e308, Y: 1e308}})
	wantField(t, "LiftOff at 1e300 m", err, "points[1]", ErrRange)

	// 1e300 N at 1e300 m: a moment of 1e600 N·m.
	_, err = NewModel(mustContacts(t, mustBisector(t)), []Preload{{Point: r3.Vec{X: 1e300}, Direction: r3.Vec{Z: -1}, Force: 1e300}}, Payload{})
	wantField(t, "NewModel with a moment of 1e600 N·m", err, "preloads[0].Force", ErrRange)

	_, err = mp.WrenchLimit(LoadCase{PreloadFactor: 1}, screwWrench(5e-324))
	wantField(t, "WrenchLimit of a subnormal wrench", err, "w", ErrRange)
}

// TestShockDirectionOfALightPayload: the worst direction is a unit vector
// whatever the mass (it does not depend on it: u = −Tᵢ(c)/|Tᵢ(c)|), even
// where the gain m·|Tᵢ(c)| is subnormal.
func TestShockDirectionOfALightPayload(t *testing.T) {
	cs := mustContacts(t, mustBisector(t))
	pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}
	heavy, _ := NewModel(cs, pre, Payload{Mass: 1, Centre: r3.Vec{Z: 0.03}})
	light, _ := NewModel(cs, pre, Payload{Mass: 1e-310, Centre: r3.Vec{Z: 0.03}})
	sh, err := heavy.Shock(LoadCase{NoPreload: true}, 1)
	if err != nil {
		t.Fatal(err)
	}
	// With no base load every contact is open (Unload 0), which is finite.
	sl, err := light.Shock(LoadCase{NoPreload: true}, 1)
	if err != nil {
		t.Fatal(err)
	}
	for i := range sh.Contacts {
		if !near(sh.Contacts[i].Direction, sl.Contacts[i].Direction, 1e-12) {
			t.Errorf("%s: direction %v with 1 kg, %v with 1e-310 kg", sh.Contacts[i].Label, sh.Contacts[i].Direction, sl.Contacts[i].Direction)
		}
	}
}

func mustBisector(t testing.TB) Coupling {
	t.Helper()
	c, err := BisectorVees(equilateral(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// unbounded lists the result fields documented as possibly +Inf (an
// unbounded figure with its meaning in its doc): the shock level and
// unloading acceleration of a massless payload or a contact no load
// reaches, the scale or force at which nothing unloads, the friction
// limit of a contact friction cannot stop, and a preload factor that no
// value meets.
var unbounded = map[string]bool{
	"Shock.Unload": true, "ShockContact.Unload": true, "Limit.Scale": true, "LiftOff.Force": true,
	"Homing.MaxMu": true, "HomingContact.Limit": true, "Scorecard.ShockLevel": true, "Scorecard.PreloadMin": true, "Scorecard.PreloadMax": true,
	"Scorecard.MaxwellRatio": true, "PreloadSizing.MaxScale": true,
}

// nonFinite returns the path of the first float in v that is NaN or
// infinite (other than a +Inf in a field listed in unbounded), or "".
func nonFinite(v reflect.Value, path, owner string) string {
	switch v.Kind() {
	case reflect.Float64:
		x := v.Float()
		if math.IsNaN(x) || math.IsInf(x, -1) || (math.IsInf(x, 1) && !unbounded[owner]) {
			return path
		}
	case reflect.Struct:
		for i := range v.NumField() {
			f := v.Type().Field(i)
			if !f.IsExported() {
				continue
			}
			if p := nonFinite(v.Field(i), path+"."+f.Name, v.Type().Name()+"."+f.Name); p != "" {
				return p
			}
		}
	case reflect.Array, reflect.Slice:
		for i := range v.Len() {
			if p := nonFinite(v.Index(i), path+"["+itoa(i)+"]", owner); p != "" {
				return p
			}
		}
	case reflect.Pointer:
		if !v.IsNil() {
			return nonFinite(v.Elem(), path, owner)
		}
	}
	return ""
}

func itoa(i int) string { return strconv.Itoa(i) }

// screwWrench returns a wrench of scale s: a force s along x and z and a
// moment s·(1 m) about y.
func screwWrench(s float64) screw.Wrench {
	return screw.Wrench{F: r3.Vec{X: s, Z: s}, M: r3.Vec{Y: s}}
}

// sentinels are the errors every refusal wraps.
var sentinels = []error{ErrNonFinite, ErrRange, ErrDegenerate, ErrNotExact}

// checkResult fails unless err wraps a sentinel inside an *InputError or
// every float of res is finite (documented +Inf fields excepted).
func checkResult(t *testing.T, what string, res any, err error) {
	t.Helper()
	if err != nil {
		var ie *InputError
		ok := errors.As(err, &ie)
		for _, s := range sentinels {
			if ok && errors.Is(err, s) {
				return
			}
		}
		t.Fatalf("%s: error %v wraps no sentinel", what, err)
	}
	if p := nonFinite(reflect.ValueOf(res), what, ""); p != "" {
		t.Fatalf("%s: non-finite %s in %+v", what, p, res)
	}
}

// FuzzExtremes feeds extreme finite values (a point of interest, a
// payload mass, a coefficient of friction, a tolerance, a preload force,
// a shock magnitude, an applied wrench) to every exported entry point that
// takes a magnitude, and checks that each either refuses with an
// *InputError wrapping a sentinel or returns only finite numbers (the
// documented +Inf fields excepted).
func FuzzExtremes(f *testing.F) {
	add := func(x ...float64) { f.Add(fuzzdata.Append(nil, x...)) }
	add(0.01, 0.005, 0.05, 0.8, 0.3, 2e-6, 60, 9.8, 1)
	add(1e300, 0, 0, 5e-324, 1e300, 1e300, 60, 9.8, 1)
	add(0, 0, 1e155, 1e-300, 1e-300, 1e308, 1e300, 1e300, 1e300)
	add(-1e200, 1e200, 0, 1e300, 1e10, 5e-324, 5e-324, 1e-300, 5e-324)
	c := mustBisector(f)
	cs := mustContacts(f, c)
	a, err := c.Assembly()
	if err != nil {
		f.Fatal(err)
	}
	stab := mustStability(f, c)
	f.Fuzz(func(t *testing.T, b []byte) {
		xs := fuzzdata.Floats(b, 9)
		if len(xs) != 1 {
			return
		}
		x := xs[0]
		p := r3.Vec{X: x[0], Y: x[1], Z: x[2]}
		mass, mu, tol, force, mag, wscale := x[3], x[4], x[5], x[6], x[7], x[8]
		pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: force}}
		pay := Payload{Mass: mass, Centre: r3.Vec{Z: 0.03}, Inertia: [3][3]float64{{2e-3, 0, 0}, {0, 2e-3, 0}, {0, 0, 3e-3}}}
		lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}

		amp, err := stab.Amplification(p)
		checkResult(t, "Amplification", amp, err)
		sens, err := a.Sensitivities(p)
		checkResult(t, "Sensitivities", sens, err)
		tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: tol}, {Dimension: "B.Seat.Y", Sigma: tol}}
		bud, err := a.Budget(p, tols)
		checkResult(t, "Budget", bud, err)
		sr, err := a.Study(context.Background(), p, tols, &StudyOptions{Samples: 20, Workers: 1})
		checkResult(t, "Study", sr, err)
		pose, err := a.Pose([]Deviation{{Dimension: "A.Ball.Radius", Value: tol}}, nil)
		checkResult(t, "Pose", pose, err)

		m, err := NewModel(cs, pre, pay)
		if err != nil {
			checkResult(t, "NewModel", nil, err)
			return
		}
		s, err := m.Statics(lc)
		checkResult(t, "Statics", s, err)
		sh, err := m.Shock(lc, mag)
		checkResult(t, "Shock", sh, err)
		wl, err := m.WrenchLimit(lc, screwWrench(wscale))
		checkResult(t, "WrenchLimit", wl, err)
		lo, err := m.LiftOff(lc, r3.Vec{Z: 1}, []r3.Vec{p})
		checkResult(t, "LiftOff", lo, err)
		ho, err := m.Homing(lc, mu)
		checkResult(t, "Homing", ho, err)
		st, err := m.Stiffness(lc, nil)
		checkResult(t, "Stiffness", st, err)
		if err == nil {
			co, err := st.Compliance(p)
			checkResult(t, "Compliance", co, err)
			md, err := st.Modes()
			checkResult(t, "Modes", md, err)
		}
		rp, err := m.Repeatability(lc, mu, p)
		checkResult(t, "Repeatability", rp, err)
		sz, err := m.SizePreload([]LoadCase{lc}, wscale)
		checkResult(t, "SizePreload", sz, err)

		sc := scenario()
		sc.Point, sc.Preloads, sc.Payload, sc.Shock = p, pre, pay, mag
		card, err := c.Score(sc)
		checkResult(t, "Score", card, err)
	})
}

// TestFarPointBlamedNotTolerance: a micrometre tolerance is not out of
// range because the point of interest is 1e300 m away; the point is. At
// that distance the displacement per unit deviation is of the order of
// the distance over the coupling's size, and its square overflows.
func TestFarPointBlamedNotTolerance(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"]
	tols := []Tolerance{{Dimension: "A.Ball.Radius", HalfWidth: 1e-6}}
	far := r3.Vec{X: 1e300}
	var ie *InputError
	if _, err := a.Budget(far, tols); !errors.As(err, &ie) || ie.Field != "p" || !errors.Is(err, ErrRange) {
		t.Errorf("Budget at 1e300 m: %v", err)
	}
	if _, err := a.Study(context.Background(), far, tols, &StudyOptions{Samples: 10}); !errors.As(err, &ie) || ie.Field != "p" || !errors.Is(err, ErrRange) {
		t.Errorf("Study at 1e300 m: %v", err)
	}
}
