package hertz

import "testing"

var sinkContact Contact

// BenchmarkSolve measures one Solve, subsurface stresses included, per
// regime of B/A: a circle (ball on flat), B/A = 10 and B/A = 1000 (a
// doubly curved body on a flat), with both bodies of one material (the
// stresses are searched once) and of two materials (searched per body).
func BenchmarkSolve(b *testing.B) {
	steel, glass := Steel52100, FusedSilica
	for _, c := range []struct {
		name   string
		b1, b2 Body
	}{
		{"circle", Sphere(0.005, steel), Flat(steel)},
		{"BA=10", Toroid(0.05, 0.005, 0, steel), Flat(steel)},
		{"BA=1000", Toroid(5, 0.005, 0, steel), Flat(steel)},
		{"circle/2nu", Sphere(0.005, steel), Flat(glass)},
		{"BA=10/2nu", Toroid(0.05, 0.005, 0, steel), Flat(glass)},
		{"BA=1000/2nu", Toroid(5, 0.005, 0, steel), Flat(glass)},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkContact, _ = Solve(c.b1, c.b2, 50)
			}
		})
	}
}

var sinkLoad float64

// BenchmarkLoadForPressure measures the inverse problem, which needs the
// contact shape but no stresses.
func BenchmarkLoadForPressure(b *testing.B) {
	for _, c := range []struct {
		name   string
		b1, b2 Body
	}{
		{"circle", Sphere(0.005, Steel52100), Flat(Steel52100)},
		{"BA=10", Toroid(0.05, 0.005, 0, Steel52100), Flat(Steel52100)},
		{"BA=1000", Toroid(5, 0.005, 0, Steel52100), Flat(Steel52100)},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				sinkLoad, _ = LoadForPressure(c.b1, c.b2, 2e9)
			}
		})
	}
}
