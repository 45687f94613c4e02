package hertz

import "testing"

var (
	sinkContact Contact
	sinkPair    Pair
	sinkLoad    float64
)

// benchPairs are the regimes of the benchmarks: a circle (ball on flat),
// B/A = 10 and B/A = 1000 (a doubly curved body on a flat), with both
// bodies of one material (the stresses are searched once) and, for Solve,
// of two materials (searched per body).
var benchPairs = []struct {
	name   string
	b1, b2 Body
}{
	{"circle", Sphere(0.005, Steel52100), Flat(Steel52100)},
	{"BA=10", Toroid(0.05, 0.005, 0, Steel52100), Flat(Steel52100)},
	{"BA=1000", Toroid(5, 0.005, 0, Steel52100), Flat(Steel52100)},
	{"circle/2nu", Sphere(0.005, Steel52100), Flat(FusedSilica)},
	{"BA=10/2nu", Toroid(0.05, 0.005, 0, Steel52100), Flat(FusedSilica)},
	{"BA=1000/2nu", Toroid(5, 0.005, 0, Steel52100), Flat(FusedSilica)},
}

// BenchmarkSolve measures one package-level Solve, subsurface stresses
// included, per regime.
func BenchmarkSolve(b *testing.B) {
	for _, c := range benchPairs {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkContact, _ = Solve(c.b1, c.b2, 50)
			}
		})
	}
}

// BenchmarkPairSolve measures Pair.Solve, the stresses included, on a Pair
// made once.
func BenchmarkPairSolve(b *testing.B) {
	for _, c := range benchPairs {
		p, err := NewPair(c.b1, c.b2)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkContact, _ = p.Solve(50)
			}
		})
	}
}

// BenchmarkNewPairContact measures the contact-only path from the bodies:
// NewPair then Pair.Contact, per regime of B/A (the material does not
// matter without stresses).
func BenchmarkNewPairContact(b *testing.B) {
	for _, c := range benchPairs[:3] {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				p, _ := NewPair(c.b1, c.b2)
				sinkContact, _ = p.Contact(50)
			}
		})
	}
}

// BenchmarkPairContact measures Pair.Contact alone on a Pair made once: the
// cost per load in a loop over loads.
func BenchmarkPairContact(b *testing.B) {
	for _, c := range benchPairs[:3] {
		p, err := NewPair(c.b1, c.b2)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkContact, _ = p.Contact(50)
			}
		})
	}
}

// BenchmarkNewPair measures the validation and the load-independent solve.
func BenchmarkNewPair(b *testing.B) {
	for _, c := range benchPairs[:3] {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkPair, _ = NewPair(c.b1, c.b2)
			}
		})
	}
}

// BenchmarkLoadForPressure measures the inverse problem from the bodies,
// which needs the contact shape but no stresses.
func BenchmarkLoadForPressure(b *testing.B) {
	for _, c := range benchPairs[:3] {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkLoad, _ = LoadForPressure(c.b1, c.b2, 2e9)
			}
		})
	}
}
