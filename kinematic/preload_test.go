package kinematic

import (
	"errors"
	"math"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// TestSizePreloadClosedForm: equilateral three-vee, one vertical preload
// element through the centroid, a payload of mass m on the axis. Under
// gravity down the flanks carry (P + mg)/(6 sin θ); turned upside down
// (gravity up) (P − mg)/(6 sin θ). Keeping every flank at fmin in both
// cases needs P = 6 fmin sin θ + mg (the upside-down case binds). The
// largest preload keeps p₀ at the allowable: for a ball on a flat,
// p₀ = 3F/(2πa²) and a³ = 3FR/(4E*) (Johnson 1985, eq. 4.22–4.23) give
// a = πp₀R/(2E*) and F = 2πp₀a²/3, and the gravity-down case binds there:
// P = 6 F sin θ − mg.
func TestSizePreloadClosedForm(t *testing.T) {
	const mass, fmin = 0.8, 2.0
	th := math.Pi / 4
	m, _ := equilateralModel(t, th, 50, mass, 0.03)
	g := StandardGravity
	cases := []LoadCase{
		{Name: "upright", Gravity: r3.Vec{Z: -g}},
		{Name: "inverted", Gravity: r3.Vec{Z: g}},
	}
	sz, err := m.SizePreload(cases, fmin)
	if err != nil {
		t.Fatal(err)
	}
	wantP := 6*fmin*math.Sin(th) + mass*g
	if got := sz.Total; math.Abs(got-wantP) > 1e-10*wantP {
		t.Errorf("minimum preload %.12g N, want 6 fmin sin θ + mg = %.12g N", got, wantP)
	}
	if math.Abs(sz.MinScale*50-wantP) > 1e-10*wantP || sz.MinBinding.Case != "inverted" {
		t.Errorf("min scale %g (binding %+v), want %g in the inverted case", sz.MinScale, sz.MinBinding, wantP/50)
	}
	if len(sz.Binding) != 6 {
		t.Errorf("binding %v; want the six flanks in the inverted case (symmetry)", sz.Binding)
	}
	b, f := hertz.Steel52100, hertz.Steel440C
	es := 1 / ((1-b.Nu*b.Nu)/b.E + (1-f.Nu*f.Nu)/f.E)
	a := math.Pi * 4200e6 * 5e-3 / (2 * es)
	fa := 2 * math.Pi * 4200e6 * a * a / 3
	wantMax := (6*fa*math.Sin(th) - mass*g) / 50
	if math.Abs(sz.MaxScale-wantMax) > 1e-9*wantMax || sz.MaxBinding.Case != "upright" {
		t.Errorf("max scale %.12g (binding %+v), want %.12g in the upright case", sz.MaxScale, sz.MaxBinding, wantMax)
	}
}

// TestSizePreloadLP: the linear program with one element gives the closed
// form (the two paths are independent: simplex against a maximum of
// ratios), and with three plungers (one over each ball) the smallest total
// for a lateral load, checked against the optimality conditions the
// solution must meet: every case feasible, and no element can be lowered
// without breaking a binding contact.
func TestSizePreloadLP(t *testing.T) {
	m, cs := equilateralModel(t, math.Pi/4, 50, 0.8, 0.03)
	// SizePreload ignores the cases' own preload; the hand check below
	// takes each case's load without it.
	cases := []LoadCase{
		{Name: "upright", Gravity: r3.Vec{Z: -StandardGravity}, NoPreload: true},
		{Name: "side", Gravity: r3.Vec{X: StandardGravity}, NoPreload: true},
	}
	sz, err := m.SizePreload(cases, 1)
	if err != nil {
		t.Fatal(err)
	}
	var a [][6]float64 = make([][6]float64, 1)
	m.forces(m.preloads[0].w, &a[0])
	e := make([][6]float64, len(cases))
	for k := range cases {
		w, _ := m.wrench(&cases[k])
		m.forces(w, &e[k])
	}
	lp, err := m.sizeLP(a, e, 1)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(lp[0]-sz.Factors[0]) > 1e-9*sz.Factors[0] {
		t.Errorf("one element: simplex %.12g, closed form %.12g", lp[0], sz.Factors[0])
	}

	// Three plungers, one over each ball.
	var pre []Preload
	for k := 0; k < 3; k++ {
		pre = append(pre, Preload{Name: "plunger", Point: cs[2*k].Centre, Direction: r3.Vec{Z: -1}, Force: 10})
	}
	m3, err := NewModel(cs, pre, Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}})
	if err != nil {
		t.Fatal(err)
	}
	s3, err := m3.SizePreload(cases, 1)
	if err != nil {
		t.Fatal(err)
	}
	force := func(fac []float64, k, i int) float64 {
		lc := cases[k]
		w, _ := m3.wrench(&lc)
		var f [6]float64
		m3.forces(w, &f)
		v := f[i]
		for j, s := range fac {
			var aj [6]float64
			m3.forces(m3.preloads[j].w.Scale(s), &aj)
			v += aj[i]
		}
		return v
	}
	for k := range cases {
		for i := 0; i < 6; i++ {
			if f := force(s3.Factors, k, i); f < 1-1e-7 {
				t.Errorf("case %d contact %d: %g N below 1 N at the optimum", k, i, f)
			}
		}
	}
	for j := range s3.Factors {
		if s3.Factors[j] == 0 {
			continue
		}
		lower := append([]float64(nil), s3.Factors...)
		lower[j] *= 1 - 1e-4
		ok := true
		for k := range cases {
			for i := 0; i < 6; i++ {
				if force(lower, k, i) < 1-1e-9 {
					ok = false
				}
			}
		}
		if ok {
			t.Errorf("element %d can be lowered below its optimum %g", j, s3.Factors[j])
		}
	}
	// A single central clamp can only be as good as the best plungers.
	if s3.Total > sz.Total*(1+1e-9) {
		t.Errorf("three plungers need %g N, one central clamp %g N", s3.Total, sz.Total)
	}
}

// TestSizePreloadErrors: a requirement that no preload can meet names the
// case and contact; bad numbers name their field.
func TestSizePreloadErrors(t *testing.T) {
	m, _ := equilateralModel(t, math.Pi/4, 50, 0.8, 0.03)
	if _, err := m.SizePreload(nil, 1); !errors.Is(err, ErrDegenerate) {
		t.Errorf("no cases: %v", err)
	}
	for _, f := range []float64{-1, math.NaN()} {
		var ie *InputError
		if _, err := m.SizePreload([]LoadCase{{}}, f); !errors.As(err, &ie) || ie.Field != "minForce" {
			t.Errorf("minForce %g: %v", f, err)
		}
	}
	var ie *InputError
	if _, err := m.SizePreload([]LoadCase{{}, {Gravity: r3.Vec{X: math.NaN()}}}, 1); !errors.As(err, &ie) || ie.Field != "cases[1].Gravity" {
		t.Errorf("NaN gravity in case 1: %v", err)
	}
	// A preload that pulls up cannot keep anything closed.
	_, cs := equilateralModel(t, math.Pi/4, 50, 0, 0)
	up, err := NewModel(cs, []Preload{{Point: r3.Vec{}, Direction: r3.Vec{Z: 1}, Force: 5}}, Payload{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := up.SizePreload([]LoadCase{{Name: "rest"}}, 1); !errors.Is(err, ErrRange) {
		t.Errorf("upward preload: %v", err)
	}
}

// sizingFuzzInput returns the model, load cases and minimum force of the
// FuzzSizePreload corpus file path, built as the fuzz target builds them.
func sizingFuzzInput(t *testing.T, path string) (*Model, []LoadCase, float64) {
	t.Helper()
	c0, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	cs, err := c0.Contacts()
	if err != nil {
		t.Fatal(err)
	}
	raw, _, _ := lpCorpus(t, path)
	x := fuzzdata.Floats(raw, 19)[0]
	var pre []Preload
	for k := 0; k < 3; k++ {
		pre = append(pre, Preload{Point: cs[2*k].Centre, Direction: r3.Vec{X: x[4*k], Y: x[4*k+1], Z: x[4*k+2]}, Force: x[4*k+3]})
	}
	m, err := NewModel(cs, pre, Payload{Mass: 1, Centre: r3.Vec{Z: 0.02}})
	if err != nil {
		t.Fatal(err)
	}
	cases := []LoadCase{{Gravity: r3.Vec{X: x[12], Y: x[13], Z: x[14]}}, {Gravity: r3.Vec{X: x[15], Y: x[16], Z: x[17]}}}
	return m, cases, math.Abs(x[18])
}

// TestSizePreloadDegenerate: on the inputs of the FuzzSizePreload corpus
// (the first made gonum's simplex panic: three elements of which one
// pushes two contacts with forces of 1e-76 N per unit factor, a minimum
// force of 6e116 N) the sizing succeeds and its factors keep every contact
// at minForce in every case, to the 1e-9 of the solver's tolerances
// (internal/lp: residuals of 1e-10 of the data), each force and its terms
// summed by hand here.
func TestSizePreloadDegenerate(t *testing.T) {
	paths, _ := filepath.Glob("testdata/fuzz/FuzzSizePreload/*")
	if len(paths) == 0 {
		t.Fatal("no corpus")
	}
	for _, path := range paths {
		m, cases, minForce := sizingFuzzInput(t, path)
		sz, err := m.SizePreload(cases, minForce)
		if err != nil {
			t.Fatalf("%s: %v", path, err)
		}
		a := make([][6]float64, len(m.preloads))
		for j, p := range m.preloads {
			m.forces(p.w, &a[j])
		}
		for k := range cases {
			w, err := m.wrench(&cases[k])
			if err != nil {
				t.Fatal(err)
			}
			var e [6]float64
			m.forces(w, &e)
			for i := range 6 {
				f, mag := e[i], math.Abs(e[i])
				for j, s := range sz.Factors {
					f += s * a[j][i]
					mag += math.Abs(s * a[j][i])
				}
				if f < minForce-1e-9*max(mag, minForce) {
					t.Errorf("%s: case %d contact %d at %g N, below minForce %g N", path, k, i, f, minForce)
				}
			}
		}
	}
}

// TestWriteLPSizingPrograms writes the sizing programs of the
// FuzzSizePreload corpus (see lpDataDir): the dual program that sizeLP
// solves, and the primal program in the form gonum's lp.Simplex was given
// (a surplus per case and contact, each row divided by its largest
// coefficient), on which gonum panicked.
func TestWriteLPSizingPrograms(t *testing.T) {
	if *lpDataDir == "" {
		t.Skip("writes files only with -lpdata")
	}
	paths, _ := filepath.Glob("testdata/fuzz/FuzzSizePreload/*")
	for _, path := range paths {
		m, cases, minForce := sizingFuzzInput(t, path)
		a := make([][6]float64, len(m.preloads))
		var used []int
		for j, p := range m.preloads {
			m.forces(p.w, &a[j])
			if a[j] != ([6]float64{}) {
				used = append(used, j)
			}
		}
		e := make([][6]float64, len(cases))
		for k := range cases {
			w, err := m.wrench(&cases[k])
			if err != nil {
				t.Fatal(err)
			}
			m.forces(w, &e[k])
		}
		src := "kinematic/" + filepath.ToSlash(path)
		A, b, c := m.sizeDual(a, e, minForce, used)
		lpWrite(t, "sizing-dual-"+filepath.Base(path), []string{
			"The dual of the preload sizing program of " + src + " (sizeDual), written by TestWriteLPSizingPrograms.",
		}, c, A, b)
		// The primal as gonum was given it.
		nu, rows := len(used), 6*len(e)
		Ap := make([]float64, rows*(nu+rows))
		bp := make([]float64, rows)
		cp := make([]float64, nu+rows)
		for jj, j := range used {
			cp[jj] = linalg.Norm3(m.preloads[j].w.F)
			if cp[jj] == 0 {
				cp[jj] = 1
			}
		}
		for k := range e {
			for i := range 6 {
				r := 6*k + i
				big := math.Abs(minForce - e[k][i])
				for _, j := range used {
					big = math.Max(big, math.Abs(a[j][i]))
				}
				if big == 0 {
					big = 1
				}
				for jj, j := range used {
					Ap[rows*jj+r] = a[j][i] / big
				}
				Ap[rows*(nu+r)+r] = -1 / big
				bp[r] = (minForce - e[k][i]) / big
			}
		}
		lpWrite(t, "sizing-primal-"+filepath.Base(path), []string{
			"The preload sizing program of " + src + " in the form gonum's lp.Simplex was given (it panicked: a singular initial basis),",
			"a surplus per case and contact, each row divided by its largest coefficient; written by TestWriteLPSizingPrograms.",
		}, cp, Ap, bp)
	}
}

var sinkSizing PreloadSizing

// BenchmarkSizePreload measures the sizing of one central clamp (closed
// form) and of three plungers, one over each ball (a linear program), over
// an upright and a sideways case, and of the three plungers over twelve
// cases (gravity turned about a cone).
func BenchmarkSizePreload(b *testing.B) {
	m, cs := equilateralModel(b, math.Pi/4, 50, 0.8, 0.03)
	var pre []Preload
	for k := 0; k < 3; k++ {
		pre = append(pre, Preload{Name: "plunger", Point: cs[2*k].Centre, Direction: r3.Vec{Z: -1}, Force: 10})
	}
	m3, err := NewModel(cs, pre, Payload{Mass: 0.8, Centre: r3.Vec{Z: 0.03}})
	if err != nil {
		b.Fatal(err)
	}
	two := []LoadCase{
		{Name: "upright", Gravity: r3.Vec{Z: -StandardGravity}},
		{Name: "side", Gravity: r3.Vec{X: StandardGravity}},
	}
	var twelve []LoadCase
	for k := range 12 {
		s, c := math.Sincos(2 * math.Pi * float64(k) / 12)
		twelve = append(twelve, LoadCase{Gravity: r3.Scale(StandardGravity, r3.Vec{X: 0.5 * c, Y: 0.5 * s, Z: -1})})
	}
	for _, bc := range []struct {
		name  string
		m     *Model
		cases []LoadCase
	}{{"clamp/2cases", m, two}, {"plungers/2cases", m3, two}, {"plungers/12cases", m3, twelve}} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sz, err := bc.m.SizePreload(bc.cases, 1)
				if err != nil {
					b.Fatal(err)
				}
				sinkSizing = sz
			}
		})
	}
}
