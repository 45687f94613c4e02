package linalg

import (
	"math/rand/v2"
	"testing"
)

func BenchmarkJacobi6(b *testing.B) {
	rng := rand.New(rand.NewPCG(9, 9))
	src := randMatrix(rng, 6, 6, 6)
	var a [36]float64
	b.ReportAllocs()
	for b.Loop() {
		copy(a[:], src)
		Jacobi6(&a, 6)
	}
}

func BenchmarkJacobi(b *testing.B) {
	rng := rand.New(rand.NewPCG(9, 9))
	src := randMatrix(rng, 6, 6, 6)
	var a [36]float64
	b.ReportAllocs()
	for b.Loop() {
		copy(a[:], src)
		Jacobi(a[:], 6, 6, nil)
	}
}

func BenchmarkQRJacobi6(b *testing.B) {
	rng := rand.New(rand.NewPCG(9, 9))
	src := randMatrix(rng, 6, 6, 6)
	var a [36]float64
	var rt [36]float64
	var perm [6]int
	b.ReportAllocs()
	for b.Loop() {
		copy(a[:], src)
		QRPivot(a[:], 6, &rt, &perm)
		Jacobi6(&rt, 6)
	}
}

func BenchmarkQRPivot(b *testing.B) {
	rng := rand.New(rand.NewPCG(9, 9))
	src := randMatrix(rng, 6, 6, 6)
	var a [36]float64
	var rt [36]float64
	var perm [6]int
	b.ReportAllocs()
	for b.Loop() {
		copy(a[:], src)
		QRPivot(a[:], 6, &rt, &perm)
	}
}

func BenchmarkJacobi6Converged(b *testing.B) {
	var src [36]float64
	for i := 0; i < 6; i++ {
		src[i*6+i] = float64(i + 1)
	}
	var a [36]float64
	b.ReportAllocs()
	for b.Loop() {
		a = src
		Jacobi6(&a, 6)
	}
}

func BenchmarkInverse6(b *testing.B) {
	rng := rand.New(rand.NewPCG(9, 9))
	src := randMatrix(rng, 6, 6, 6)
	var a [36]float64
	b.ReportAllocs()
	for b.Loop() {
		copy(a[:], src)
		Inverse6(&a, 0)
	}
}
