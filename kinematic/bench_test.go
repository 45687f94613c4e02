package kinematic

import "testing"

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
	for _, bc := range []struct {
		name string
		c    Coupling
	}{{"three-vee", bis}, {"socket-vee-flat", svf}} {
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

var sinkGrooves GrooveResult

// BenchmarkOptimizeGrooves measures the groove optimiser on a three-vee
// coupling, with and without azimuth windows.
func BenchmarkOptimizeGrooves(b *testing.B) {
	bis, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		b.Fatal(err)
	}
	for _, bc := range []struct {
		name string
		opt  *GrooveOptions
	}{
		{"free", nil},
		{"windows", &GrooveOptions{Windows: []Window{{Min: 0.3, Max: 1.2}, {Min: -0.5, Max: 0.1}, {Min: -1, Max: 1}}}},
	} {
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				r, err := OptimizeGrooves(bis, bc.opt)
				if err != nil {
					b.Fatal(err)
				}
				sinkGrooves = r
			}
		})
	}
}
