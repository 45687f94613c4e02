package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

func TestRandomDensityTransmissibility(t *testing.T) {
	// Along Z the symmetric coupling's vertical mode alone responds (it
	// carries the whole vertical mass), so the point on the axis is a
	// single-degree-of-freedom oscillator on a moving base. Its absolute
	// acceleration over the base's is the transmissibility
	// T² = (1 + (2ζr)²)/((1 − r²)² + (2ζr)²), r = f/fn, and its
	// displacement relative to the base is |h|² = 1/((ωn² − ω²)² + (2ζωnω)²)
	// times the base acceleration (W. T. Thomson, Theory of Vibration with
	// Applications, base excitation and transmissibility; from memory).
	m := symmetricModel(t)
	const zeta = 0.03
	flat := Spectrum{Points: []Breakpoint{{Frequency: 10, ASD: 0.02}, {Frequency: 5000, ASD: 0.02}}}
	opt := &RandomOptions{Damping: []float64{zeta}, Point: r3.Vec{Z: 0.05}}
	r, err := m.Random(gravityDown, flat, opt)
	if err != nil {
		t.Fatal(err)
	}
	fn := verticalMode(t, r)
	ratios := []float64{0.3, 0.9, 1, 1.1, 2.5}
	f := make([]float64, len(ratios))
	for i, x := range ratios {
		f[i] = x * fn
	}
	ds, err := m.RandomDensity(gravityDown, flat, opt, f)
	if err != nil {
		t.Fatal(err)
	}
	S := 0.02 * StandardGravity * StandardGravity
	wn := 2 * math.Pi * fn
	for i, x := range ratios {
		d := ds[i]
		if d.Frequency != f[i] || math.Abs(d.Input/S-1) > 1e-15 {
			t.Errorf("r = %g: frequency %g, input %g, want %g and %g", x, d.Frequency, d.Input, f[i], S)
		}
		den := (1-x*x)*(1-x*x) + 4*zeta*zeta*x*x
		if T2 := (1 + 4*zeta*zeta*x*x) / den; math.Abs(d.Acceleration/(S*T2)-1) > 1e-6 {
			t.Errorf("r = %g: acceleration density %g, want S·T² = %g", x, d.Acceleration, S*T2)
		}
		w := 2 * math.Pi * f[i]
		h2 := 1 / ((wn*wn-w*w)*(wn*wn-w*w) + 4*zeta*zeta*wn*wn*w*w)
		if math.Abs(d.Displacement/(S*h2)-1) > 1e-6 {
			t.Errorf("r = %g: displacement density %g, want S|h|² = %g", x, d.Displacement, S*h2)
		}
	}
	// Outside the band the input and the response are zero.
	out, err := m.RandomDensity(gravityDown, flat, opt, []float64{0, 5, 6000})
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range out {
		if d.Input != 0 || d.Acceleration != 0 || d.Displacement != 0 {
			t.Errorf("%g Hz, outside the band: %+v, want zeros", d.Frequency, d)
		}
	}
}

func TestRandomDensityIntegral(t *testing.T) {
	// Property: the densities integrate to the squares of Random's RMS
	// figures, on a canted payload whose six modes all respond along a
	// skew direction (trapezoids on 2e5 log-spaced points across the GEVS
	// band; the quadrature error at ζ = 0.02 is below 1e-4).
	m, err := NewModel(mustContacts(t, mustBisector(t)), []Preload{{Point: r3.Vec{X: 0.01, Z: 0.02}, Direction: r3.Vec{Z: -1}, Force: 60}},
		Payload{Mass: 0.8, Centre: r3.Vec{X: 0.012, Y: -0.004, Z: 0.03}, Inertia: [3][3]float64{{1e-3, 1e-4, 0}, {1e-4, 1.1e-3, 0}, {0, 0, 1.6e-3}}})
	if err != nil {
		t.Fatal(err)
	}
	opt := &RandomOptions{Direction: r3.Vec{X: 1, Y: 0.3, Z: 0.5}, Point: r3.Vec{X: 0.02, Y: 0.01, Z: 0.06}}
	r, err := m.Random(gravityDown, gevs, opt)
	if err != nil {
		t.Fatal(err)
	}
	const n = 200000
	f := make([]float64, n)
	for i := range f {
		f[i] = 20 * math.Pow(100, float64(i)/(n-1))
	}
	ds, err := m.RandomDensity(gravityDown, gevs, opt, f)
	if err != nil {
		t.Fatal(err)
	}
	var in, acc, disp float64
	for i := 1; i < n; i++ {
		h := (f[i] - f[i-1]) / 2
		in += h * (ds[i].Input + ds[i-1].Input)
		acc += h * (ds[i].Acceleration + ds[i-1].Acceleration)
		disp += h * (ds[i].Displacement + ds[i-1].Displacement)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"input", in, r.Input * r.Input},
		{"acceleration", acc, r.Point.RMS * r.Point.RMS},
		{"displacement", disp, r.Displacement.RMS * r.Displacement.RMS},
	} {
		if math.Abs(c.got/c.want-1) > 1e-4 {
			t.Errorf("%s: ∫ density = %g, Random gives %g", c.name, c.got, c.want)
		}
	}
}

func TestRandomDensityErrors(t *testing.T) {
	m := symmetricModel(t)
	for _, c := range []struct {
		f     []float64
		field string
		err   error
	}{
		{[]float64{10, math.NaN()}, "f[1]", ErrNonFinite},
		{[]float64{-1}, "f[0]", ErrRange},
		{[]float64{math.Inf(1)}, "f[0]", ErrNonFinite},
	} {
		_, err := m.RandomDensity(gravityDown, gevs, nil, c.f)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.err) {
			t.Errorf("f = %v: error %v, want an InputError naming %s wrapping %v", c.f, err, c.field, c.err)
		}
	}
	_, err := m.RandomDensity(gravityDown, Spectrum{}, nil, []float64{1})
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "s.Points" {
		t.Errorf("empty spectrum: %v, want an error naming s.Points", err)
	}
	_, err = m.RandomDensity(gravityDown, gevs, &RandomOptions{Q: []float64{0.4}}, []float64{1})
	if !errors.As(err, &ie) || ie.Field != "opt.Q[0]" {
		t.Errorf("Q = 0.4: %v, want an error naming opt.Q[0]", err)
	}
}
