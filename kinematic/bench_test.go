package kinematic

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"
)

var (
	sinkSVD   mat.SVD
	sinkDense mat.Dense
)

// BenchmarkRef measures two references in the same process as the
// library's benchmarks, so that speed can be stated as ratios that the
// load of a shared machine moves little: gonum's SVD of a 6×6 matrix with
// the full U and V, and gonum's inverse of the same matrix (.ci/speed.sh
// divides by them).
func BenchmarkRef(b *testing.B) {
	rng := rand.New(rand.NewPCG(6, 6))
	data := make([]float64, 36)
	for i := range data {
		data[i] = 2*rng.Float64() - 1
	}
	a := mat.NewDense(6, 6, data)
	b.Run("svd", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if !sinkSVD.Factorize(a, mat.SVDFull) {
				b.Fatal("SVD did not converge")
			}
		}
	})
	b.Run("inverse", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := sinkDense.Inverse(a); err != nil {
				b.Fatal(err)
			}
		}
	})
}

var sinkStability Stability

// BenchmarkAnalyzeStability measures the constraint report and the
// Maxwell stability of a six-contact coupling, from its contacts.
func BenchmarkAnalyzeStability(b *testing.B) {
	bis, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		b.Fatal(err)
	}
	svf, err := SocketVeeFlat(isosceles(), cube, vee45, flatUp)
	if err != nil {
		b.Fatal(err)
	}
	// Six general contacts: vees aimed off-centre on balls at different
	// heights, one with gothic-arch flanks (no symmetry to exploit).
	arch := vee45
	arch.FlankRadius = 5.4e-3
	gen, err := AimedVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 8), ball(10, 55, -4)}, r3.Vec{X: 0.01, Y: 0.02}, [3]Vee{vee45, arch, vee45})
	if err != nil {
		b.Fatal(err)
	}
	for _, bc := range []struct {
		name string
		c    Coupling
	}{{"general", gen}, {"three-vee", bis}, {"socket-vee-flat", svf}} {
		cs := mustContacts(b, bc.c)
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				an, err := Analyze(cs)
				if err != nil {
					b.Fatal(err)
				}
				st, err := an.Stability()
				if err != nil {
					b.Fatal(err)
				}
				sinkStability = st
			}
		})
	}
}

var (
	sinkOptimum Optimum
	sinkCard    Scorecard
)

// BenchmarkScore measures one evaluation of every design figure of a
// layout, on the optimiser's path (contacts already set); a sub-benchmark
// so that .ci/speed.sh can select it beside the others.
func BenchmarkScore(b *testing.B) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		b.Fatal(err)
	}
	sc, err := newScorer(c, scenario())
	if err != nil {
		b.Fatal(err)
	}
	b.Run("all", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := sc.score(&sinkCard, allFigures); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// BenchmarkOptimize measures the optimiser: groove azimuths only, with
// ball regions and two half-angles, and a trade-off curve of 20 layouts.
func BenchmarkOptimize(b *testing.B) {
	c, err := BisectorVees([3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}, three(vee45))
	if err != nil {
		b.Fatal(err)
	}
	s := scenario()
	for _, bc := range []struct {
		name string
		opt  *OptimizeOptions
	}{
		{"azimuths", nil},
		{"windows", &OptimizeOptions{Windows: []Window{{Min: 0.3, Max: 1.2}, {Min: -0.5, Max: 0.1}, {Min: -1, Max: 1}}}},
		{"regions-and-angles", &OptimizeOptions{Regions: []Region{{Radius: 0.01}, {Radius: 0.01}, {Radius: 0.01}}, HalfAngles: []float64{math.Pi / 4, math.Pi / 3}}},
		{"trade-off-20", &OptimizeOptions{TradeOff: &TradeOff{Objective: MinDrift, Points: 20}}},
	} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				r, err := Optimize(c, s, bc.opt)
				if err != nil {
					b.Fatal(err)
				}
				sinkOptimum = r
			}
		})
	}
}

var (
	sinkStatics  Statics
	sinkShock    Shock
	sinkEq       Equilibrium
	sinkModes    [6]Mode
	sinkStiffErr error
)

// BenchmarkStatics measures rigid statics with the Hertz contact, and
// subsurface stresses, at all six contacts of a preloaded three-vee
// coupling: flat flanks (circular contacts) and gothic-arch flanks
// (elliptical).
func BenchmarkStatics(b *testing.B) {
	arch := vee45
	arch.FlankRadius = 5.3e-3
	for _, bc := range []struct {
		name string
		v    Vee
	}{{"flat-flanks", vee45}, {"gothic-arch", arch}} {
		c, err := BisectorVees(isosceles(), three(bc.v))
		if err != nil {
			b.Fatal(err)
		}
		m, err := NewModel(mustContacts(b, c), []Preload{{Point: r3.Vec{Y: 0.01, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}, Payload{Mass: 0.8, Centre: r3.Vec{Y: 0.01, Z: 0.03}})
		if err != nil {
			b.Fatal(err)
		}
		lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				s, err := m.Statics(lc)
				if err != nil {
					b.Fatal(err)
				}
				sinkStatics = s
			}
		})
	}
}

// BenchmarkShock measures the worst-direction shock check.
func BenchmarkShock(b *testing.B) {
	m, _ := equilateralModel(b, math.Pi/4, 60, 0.8, 0.03)
	lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	b.ReportAllocs()
	for b.Loop() {
		s, err := m.Shock(lc, 5*StandardGravity)
		if err != nil {
			b.Fatal(err)
		}
		sinkShock = s
	}
}

// BenchmarkEquilibrium measures the nonlinear Hertz equilibrium of three
// vees and a hold-down pad set 2 µm into the body (seven contacts), and of
// the six contacts alone.
func BenchmarkEquilibrium(b *testing.B) {
	_, cs := equilateralModel(b, math.Pi/4, 60, 0, 0)
	pad := mustContacts(b, Coupling{Pairs: []Pair{{Name: "pad", Ball: ball(0, 0, 20), Seat: Flat{Up: r3.Vec{Z: -1}, Material: vee45.Material}}}})
	seven := append(append([]Contact(nil), cs...), pad...)
	pre := []Preload{{Point: r3.Vec{Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}}
	for _, bc := range []struct {
		name string
		cs   []Contact
		opt  *EquilibriumOptions
	}{
		{"six", cs, nil},
		{"seven-with-pad", seven, &EquilibriumOptions{Gaps: map[string]float64{"pad": -2e-6}}},
	} {
		m, err := NewModel(bc.cs, pre, Payload{})
		if err != nil {
			b.Fatal(err)
		}
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				e, err := m.Equilibrium(LoadCase{PreloadFactor: 1}, bc.opt)
				if err != nil {
					b.Fatal(err)
				}
				sinkEq = e
			}
		})
	}
}

// BenchmarkStiffnessModes measures the stiffness of a preloaded coupling
// and the six natural frequencies of its payload.
func BenchmarkStiffnessModes(b *testing.B) {
	m, _ := equilateralModel(b, math.Pi/4, 60, 0.8, 0.03)
	lc := LoadCase{PreloadFactor: 1, Gravity: r3.Vec{Z: -StandardGravity}}
	b.ReportAllocs()
	for b.Loop() {
		st, err := m.Stiffness(lc, nil)
		if err != nil {
			b.Fatal(err)
		}
		sinkModes, sinkStiffErr = st.Modes()
	}
}

var (
	sinkPose   Pose
	sinkSample r3.Vec
)

// BenchmarkSeat measures the exact seated pose of a three-vee assembly
// with every dimension deviating by a few micrometres.
func BenchmarkSeat(b *testing.B) {
	a := generalAssemblies(b)["three-vee"]
	var devs []Deviation
	for i, d := range a.Dimensions() {
		devs = append(devs, Deviation{d, 2e-6 * math.Sin(float64(i+1))})
	}
	b.ReportAllocs()
	for b.Loop() {
		p, err := a.Pose(devs, nil)
		if err != nil {
			b.Fatal(err)
		}
		sinkPose = p
	}
}

// BenchmarkStudySample measures one Monte Carlo sample (eleven toleranced
// dimensions drawn, then seated), linear and exact, without the study's
// bookkeeping.
func BenchmarkStudySample(b *testing.B) {
	a := generalAssemblies(b)["three-vee"]
	tols := studyTolerances()
	idx, _ := a.checkTolerances(tols)
	p := r3.Vec{X: 0.01, Y: 0.02, Z: 0.05}
	for _, exact := range []bool{false, true} {
		s := &sampler{a: a, p: p, pl: r3.Sub(p, a.origin), idx: idx, exact: exact, base: a.nominal()}
		s.lim = make([]float64, len(tols))
		s.normal = make([]bool, len(tols))
		s.jd = make([]r3.Vec, len(tols))
		s.jw = make([]r3.Vec, len(tols))
		for i, k := range idx {
			s.lim[i], s.normal[i] = tols[i].Sigma, true
			x := a.sensitivity(k)
			s.jd[i], s.jw[i] = x.At(s.pl), x.W
		}
		s.prepareLinear()
		name := "linear"
		if exact {
			name = "exact"
		}
		rng := rand.New(rand.NewPCG(1, 2))
		dev := make([]float64, len(tols))
		if !exact {
			// The draw alone: the linear sample's target is its cost
			// plus at most 10 ns.
			b.Run("draw", func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					s.draw(rng, dev)
				}
				sinkSample.X = dev[0]
			})
			// The linear sample alone, on deviations already drawn: 66
			// multiplications and 66 additions in scalar instructions
			// (eleven rows of six), the floor of its cost over the draw.
			s.draw(rng, dev)
			b.Run("linear-alone", func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					d, _, _ := s.sample(dev)
					sinkSample = d
				}
			})
		}
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				s.draw(rng, dev)
				d, _, _ := s.sample(dev)
				sinkSample = d
			}
		})
	}
}
