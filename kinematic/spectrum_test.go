package kinematic

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// gevs is the generalised random vibration qualification level for
// components of GSFC-STD-7000 (General Environmental Verification
// Standard), Table 2.4-3: 20 Hz 0.026 g²/Hz, +6 dB/octave to 50 Hz,
// 0.16 g²/Hz to 800 Hz, −6 dB/octave to 2000 Hz (0.026 g²/Hz), overall
// 14.1 grms. From memory: the search tool did not find the standard's
// text, so the revision (A or B) and table number are not checked.
var gevs = Spectrum{Points: []Breakpoint{
	{Frequency: 20},
	{Frequency: 50, ASD: 0.16, Slope: 6},
	{Frequency: 800, ASD: 0.16},
	{Frequency: 2000, Slope: -6},
}}

func TestSpectrumGEVS(t *testing.T) {
	g, err := gevs.GRMS()
	if err != nil {
		t.Fatal(err)
	}
	// The standard states 14.1 grms to three figures (from memory, see gevs).
	if math.Abs(g-14.1) > 0.05 {
		t.Errorf("GEVS qualification grms = %.4f, want 14.1", g)
	}
	// Hand integration (closed form derived by hand): with
	// n = 6/(10 log10 2) = 1.99316, the rise gives 0.16·50/(n+1)·(1 − 0.4^(n+1)),
	// the plateau 0.16·750 = 120, the fall 0.16·800/(n−1)·(1 − 2.5^(1−n)).
	n := 6 / (10 * math.Log10(2))
	want := 0.16*50/(n+1)*(1-math.Pow(0.4, n+1)) + 120 + 0.16*800/(n-1)*(1-math.Pow(2.5, 1-n))
	if math.Abs(g*g-want) > 1e-12*want {
		t.Errorf("mean square = %.15g, want %.15g (hand integration)", g*g, want)
	}
	// The level at 20 Hz carried back from 50 Hz by 6 dB/octave:
	// 0.16·0.4^1.99316 = 0.02576 g²/Hz, which the standard rounds to 0.026.
	a, err := gevs.Level(20)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(a-0.026) > 0.0005 {
		t.Errorf("level at 20 Hz = %g, want 0.026 (GSFC-STD-7000, from memory)", a)
	}
	if math.Abs(a-0.16*math.Pow(0.4, n)) > 1e-15 {
		t.Errorf("level at 20 Hz = %.16g, want 0.16·0.4^n (by hand)", a)
	}
	for _, f := range []float64{19.999, 2000.001, 1e5} {
		if a, _ := gevs.Level(f); a != 0 {
			t.Errorf("At(%g) = %g outside the band, want 0", f, a)
		}
	}
}

func TestSpectrumSlopeMinusOne(t *testing.T) {
	// On log axes a slope of −1 (−10 log10 2 = −3.0103 dB/octave): the
	// integral of A·(f1/f) from f1 to f2 is A f1 ln(f2/f1) (by hand).
	s := Spectrum{Points: []Breakpoint{{Frequency: 100, ASD: 0.04}, {Frequency: 1000, Slope: -10 * math.Log10(2)}}}
	g, err := s.GRMS()
	if err != nil {
		t.Fatal(err)
	}
	want := 0.04 * 100 * math.Log(10)
	if math.Abs(g*g-want) > 1e-13*want {
		t.Errorf("mean square = %.16g, want %.16g", g*g, want)
	}
	// Levels given at both ends (0.04 and 0.004): the same segment.
	s2 := Spectrum{Points: []Breakpoint{{Frequency: 100, ASD: 0.04}, {Frequency: 1000, ASD: 0.004}}}
	g2, err := s2.GRMS()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(g2*g2-want) > 1e-13*want {
		t.Errorf("mean square = %.16g, want %.16g", g2*g2, want)
	}
	// A flat spectrum: A·(f2 − f1) (by hand).
	flat := Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 2000, ASD: 0.01}}}
	if g, _ := flat.GRMS(); math.Abs(g*g-0.01*1980) > 1e-12 {
		t.Errorf("flat mean square = %g, want 19.8", g*g)
	}
}

func TestSpectrumErrors(t *testing.T) {
	for _, c := range []struct {
		name  string
		s     Spectrum
		field string
		want  error
	}{
		{"one point", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1}}}, "Points", ErrDegenerate},
		{"no level", Spectrum{Points: []Breakpoint{{Frequency: 20}, {Frequency: 30, Slope: 3}}}, "Points", ErrDegenerate},
		{"non-increasing", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1}, {Frequency: 50, ASD: 1}, {Frequency: 50, ASD: 1}}}, "Points[2].Frequency", ErrRange},
		{"decreasing", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 1}, {Frequency: 10, ASD: 1}}}, "Points[1].Frequency", ErrRange},
		{"zero frequency", Spectrum{Points: []Breakpoint{{Frequency: 0, ASD: 1}, {Frequency: 10, ASD: 1}}}, "Points[0].Frequency", ErrRange},
		{"NaN frequency", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: 1}, {Frequency: math.NaN(), ASD: 1}}}, "Points[1].Frequency", ErrNonFinite},
		{"negative level", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: 1}, {Frequency: 2, ASD: -1}}}, "Points[1].ASD", ErrRange},
		{"Inf level", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: math.Inf(1)}, {Frequency: 2, ASD: 1}}}, "Points[0].ASD", ErrNonFinite},
		{"contradicting slope", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: 1}, {Frequency: 2, ASD: 1, Slope: 3}}}, "Points[1].Slope", ErrRange},
		{"first slope", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: 1, Slope: 3}, {Frequency: 2, ASD: 1}}}, "Points[0].Slope", ErrRange},
		{"overflowing slope", Spectrum{Points: []Breakpoint{{Frequency: 1, ASD: 1}, {Frequency: 1e6, Slope: 1e4}}}, "Points[1].Slope", ErrRange},
		// A level of 0 carried by a slope of 0, forward, after a slope,
		// and backward: each was read as a flat segment.
		{"zero level, no slope", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 2000}}}, "Points[1].Slope", ErrRange},
		{"zero level after a slope, no slope", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 80, Slope: 3}, {Frequency: 2000}}}, "Points[2].Slope", ErrRange},
		{"zero first level, no slope after it", Spectrum{Points: []Breakpoint{{Frequency: 20}, {Frequency: 80, ASD: 0.04}, {Frequency: 2000, ASD: 0.04}}}, "Points[1].Slope", ErrRange},
	} {
		_, err := c.s.GRMS()
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.want) {
			t.Errorf("%s: err = %v, want an InputError naming %s wrapping %v", c.name, err, c.field, c.want)
		}
	}
}

func FuzzSpectrum(f *testing.F) {
	f.Add(20.0, 0.026, 50.0, 0.16, 6.0, 2000.0, -6.0)
	f.Add(1.0, 0.0, 2.0, 0.0, 0.0, 3.0, 0.0)
	f.Fuzz(func(t *testing.T, f0, a0, f1, a1, s1, f2, s2 float64) {
		s := Spectrum{Points: []Breakpoint{{Frequency: f0, ASD: a0}, {Frequency: f1, ASD: a1, Slope: s1}, {Frequency: f2, Slope: s2}}}
		g, err := s.GRMS()
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error %v is not an InputError naming a field", err)
			}
			if !errors.Is(err, ErrRange) && !errors.Is(err, ErrNonFinite) && !errors.Is(err, ErrDegenerate) {
				t.Fatalf("error %v wraps no sentinel", err)
			}
			return
		}
		if !(g > 0) || math.IsInf(g, 0) {
			t.Fatalf("GRMS = %g for %+v", g, s)
		}
	})
}

func TestSpectrumWorkmanship(t *testing.T) {
	// The minimum workmanship random vibration level of NASA-STD-7001A
	// (2011): overall 6.8 grms, as stated on
	// http://www.thermaxtesting.com/test-specs/nasa-std-7001a-testing/
	// (found with the search tool); its breakpoints from memory: 20 Hz
	// 0.01 g²/Hz, +3 dB/octave to 80 Hz, 0.04 g²/Hz to 500 Hz,
	// −3 dB/octave to 2000 Hz.
	s := Spectrum{Points: []Breakpoint{
		{Frequency: 20},
		{Frequency: 80, ASD: 0.04, Slope: 3},
		{Frequency: 500, ASD: 0.04},
		{Frequency: 2000, Slope: -3},
	}}
	g, err := s.GRMS()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(g-6.8) > 0.05 {
		t.Errorf("workmanship grms = %.4f, want 6.8 (NASA-STD-7001A)", g)
	}
	// The −3 dB/octave fall is an exponent of −0.99658, next to the
	// slope −1 case: by hand, 0.04·500/(n+1)·(4^(n+1) − 1) with n + 1 =
	// 0.0034...; the closed form with expm1 keeps it exact.
	n := 3 / (10 * math.Log10(2))
	want := 0.04*80/(n+1)*(1-math.Pow(0.25, n+1)) + 0.04*420 + 0.04*500/(1-n)*(math.Pow(4, 1-n)-1)
	if math.Abs(g*g-want) > 1e-12*want {
		t.Errorf("mean square = %.15g, want %.15g (hand integration)", g*g, want)
	}
}

func TestSpectrumPublishedLevels(t *testing.T) {
	// Two published test levels given by breakpoints in g²/Hz with their
	// stated overall levels, found with the search tool:
	//   - Intel, Thermal and Mechanical Design Guidelines for the Pentium
	//     Dual-Core E2000 series (BTX chapter), §5.2.1.1 "Random Vibration
	//     Test Procedure", p. 47: 5 Hz 0.001 g²/Hz rising to 20 Hz
	//     0.01 g²/Hz, flat 0.01 g²/Hz to 500 Hz, "2.2 G RMS", 10 min per
	//     axis (a system-level test of a desktop computer);
	//   - SpaceX, Rideshare Payload User's Guide (October 2022), Table 3-7
	//     "Random Vibration MPE": 20 Hz 0.01, 50 Hz 0.015, 700 Hz 0.015,
	//     800 Hz 0.03, 925 Hz 0.03, 2000 Hz 0.00644 g²/Hz, 5.57 grms.
	// The stated levels are rounded to 2 and 3 figures: the tolerances are
	// half a unit of the last figure.
	for _, c := range []struct {
		name string
		s    Spectrum
		grms float64
		tol  float64
	}{
		{"Intel §5.2.1.1", Spectrum{Points: []Breakpoint{{Frequency: 5, ASD: 0.001}, {Frequency: 20, ASD: 0.01}, {Frequency: 500, ASD: 0.01}}}, 2.2, 0.05},
		{"SpaceX Table 3-7", Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 50, ASD: 0.015}, {Frequency: 700, ASD: 0.015},
			{Frequency: 800, ASD: 0.03}, {Frequency: 925, ASD: 0.03}, {Frequency: 2000, ASD: 0.00644}}}, 5.57, 0.005},
	} {
		g, err := c.s.GRMS()
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(g-c.grms) > c.tol {
			t.Errorf("%s: grms = %.4f, want %g (stated)", c.name, g, c.grms)
		}
	}
}

// TestSpectrumFirstSlope: a slope on the first breakpoint (a table's "20
// Hz, +3 dB/octave", the trial's GEVS-style spectrum) is refused on it,
// saying where the slope goes: the next breakpoint's slope, the segment
// from 20 Hz to 50 Hz, named as the caller wrote it (Points[1].Slope for
// Spectrum, s.Points[1].Slope from Random).
func TestSpectrumFirstSlope(t *testing.T) {
	bad := Spectrum{Points: []Breakpoint{{Frequency: 20, Slope: 3}, {Frequency: 50, ASD: 0.16}, {Frequency: 800, ASD: 0.16}, {Frequency: 2000, Slope: -3}}}
	_, err := bad.GRMS()
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "Points[0].Slope" || ie.Other != "Points[1].Slope" || !errors.Is(err, ErrRange) ||
		!strings.Contains(err.Error(), "give it on the next breakpoint (the segment from 20 Hz to 50 Hz); see Points[1].Slope") {
		t.Errorf("err = %v, want Points[0].Slope refused, pointing to Points[1].Slope and the segment from 20 Hz to 50 Hz", err)
	}
	if _, err := symmetricModel(t).Random(gravityDown, bad, nil); !errors.As(err, &ie) || ie.Field != "s.Points[0].Slope" || ie.Other != "s.Points[1].Slope" {
		t.Errorf("Random: err = %v, want s.Points[0].Slope, see s.Points[1].Slope", err)
	}
}

// TestSpectrumZeroLevelZeroSlope: a breakpoint with no level whose
// segment has no slope is refused, naming the slope and the level, with
// the fix in the message; Random names it as its caller wrote it. The
// same level written out, or a real slope, is accepted: the GEVS-like
// spectrum's first breakpoint has no level and takes it back through the
// +6 dB/octave of the next segment.
func TestSpectrumZeroLevelZeroSlope(t *testing.T) {
	bad := Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 2000, ASD: 0}}}
	_, err := bad.GRMS()
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "Points[1].Slope" || ie.Other != "Points[1]" || !errors.Is(err, ErrRange) {
		t.Fatalf("err = %v, want an InputError on Points[1].Slope, see Points[1]", err)
	}
	for _, want := range []string{"repeat the level, 0.01 g²/Hz, at 2000 Hz", "give the slope in dB/octave"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("%v: no %q", err, want)
		}
	}
	if _, err := symmetricModel(t).Random(gravityDown, bad, nil); !errors.As(err, &ie) || ie.Field != "s.Points[1].Slope" || ie.Other != "s.Points[1]" {
		t.Errorf("Random: err = %v, want an InputError on s.Points[1].Slope, see s.Points[1]", err)
	}
	// 0.01 g²/Hz flat from 20 Hz to 2000 Hz: 0.01·1980 = 19.8 g², 4.450 grms.
	flat := Spectrum{Points: []Breakpoint{{Frequency: 20, ASD: 0.01}, {Frequency: 2000, ASD: 0.01}}}
	if g, err := flat.GRMS(); err != nil || math.Abs(g-math.Sqrt(19.8)) > 1e-12 {
		t.Errorf("flat written out: %v, %v; want %v grms", g, err, math.Sqrt(19.8))
	}
	if _, err := gevs.GRMS(); err != nil {
		t.Errorf("a first breakpoint without a level, carried back by +6 dB/octave: %v", err)
	}
}
