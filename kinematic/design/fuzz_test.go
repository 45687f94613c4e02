package design

import (
	"bytes"
	"errors"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// FuzzRead reads arbitrary bytes as a design file. Invariants: no panic;
// an input that reads is valid, writes, and its canonical form reads back
// as an equal Design that writes the same bytes. The seed corpus is the
// test designs and malformed variants of them (more in
// testdata/fuzz/FuzzRead).
func FuzzRead(f *testing.F) {
	files, _ := filepath.Glob("testdata/*.json")
	for _, name := range files {
		f.Add(readFile(f, name))
	}
	f.Add([]byte(baseJSON))
	// Unit slips refused with a hint: a tolerance out of proportion.
	for _, r := range [][2]string{
		{`"value": "1 um"`, `"value": "10 mm"`},
		{`{"dimension": "A.Ball.Radius", "value": "1 um"}`, `{"dimension": "A.Seat.Turn", "value": "6 deg", "distribution": "normal"}`},
		// One ball radius in metres, meant in millimetres.
		{`"radius": "6.35 mm"`, `"radius": "3 m"`},
		// A half-angle in radians with a degree unit.
		{`"half_angle": "45 deg"`, `"half_angle": "0.785 deg"`},
		{`"half_angle": "45 deg"`, `"half_angle": "1.5708 °"`},
	} {
		f.Add([]byte(strings.Replace(baseJSON, r[0], r[1], 1)))
	}
	// The vibration section with bad spectra and damping.
	vib := string(readFile(f, "testdata/vibration.json"))
	for _, r := range [][2]string{
		{`"0.16 g^2/Hz"`, `"-1 g^2/Hz"`},
		{`"0.16 g^2/Hz", "slope": "6 dB/oct"`, `"0.16 g^2/Hz"`},
		{`"q": [25, 25, 20, 20, 15, 15]`, `"zeta": [0.5]`},
		{`"q": [25, 25, 20, 20, 15, 15]`, `"q": 0.5`},
		{`"20 Hz"`, `"1e400 Hz"`},
		{`"-6 dB/octave"`, `"-6000 dB/octave"`},
		{`"axes": ["z", "worst"]`, `"axes": ["worst", "worst"]`},
		{`"duration": "2 min"`, `"duration": "1e-320 s"`},
	} {
		f.Add([]byte(strings.Replace(vib, r[0], r[1], 1)))
	}
	// The cycles section with bad steps, substeps and requirement.
	cyc := string(readFile(f, "testdata/cycle.json"))
	for _, r := range [][2]string{
		{`"-20 N"`, `"-1e400 N"`},
		{`"substeps": 25`, `"substeps": 0`},
		{`{}
    ]}`, `{"force": ["1 N", 0, 0]}
    ]}`},
		{`"cycle": "operator push"`, `"cycle": ""`},
		{`"steps": [`, `"steps": [{"point": ["1e300 m", 0, 0], "force": ["1e300 N", "1e300 N", 0]}, `},
		{`"friction": {"mu": 0.1}`, `"friction": {"mu": 0}`},
	} {
		f.Add([]byte(strings.Replace(cyc, r[0], r[1], 1)))
	}
	for _, s := range []string{
		``,
		`{}`,
		`{"format": "sixfold.design/1"}`,
		`{"format": "sixfold.design/2", "balls": []}`,
		`{"format": "sixfold.design/1", "balls": [{"centre": [0, 0, 0], "radius": "1e400 mm", "material": "sapphire"}]}`,
		`{"format": "sixfold.design/1", "description": [[[[[[[[[[[[[[[[[[[[]]]]]]]]]]]]]]]]]]]]}`,
		`[1, 2, 3]`,
		// Bare numbers: refused in version 2, SI with the declaration or
		// in version 1.
		`{"format": "sixfold.design/2", "balls": [{"centre": [0, 0, 0], "radius": 6.35, "material": "sapphire"}]}`,
		`{"format": "sixfold.design/2", "units": "si", "balls": [{"centre": [0, 0, 0], "radius": 6.35, "material": "sapphire"}]}`,
		`{"format": "sixfold.design/2", "units": "mm"}`,
		`{"format": "sixfold.design/2", "axis": [0, 0, 0]}`,
		// Bytes that are not UTF-8, in a value and in a member name.
		"{\"format\": \"sixfold.design/2\", \"description\": \"ab\xffc\"}",
		"{\"format\": \"sixfold.design/2\", \"na\xe2\x82me\": 1}",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		d, err := Parse(b)
		if err != nil {
			if _, ok := err.(*Error); !ok {
				t.Fatalf("error %v is a %T, not a *design.Error", err, err)
			}
			return
		}
		if err := d.Validate(); err != nil {
			t.Fatalf("a design that read does not validate: %v", err)
		}
		var w1 bytes.Buffer
		if err := d.Write(&w1); err != nil {
			t.Fatalf("a design that read does not write: %v", err)
		}
		d2, err := Parse(w1.Bytes())
		if err != nil {
			t.Fatalf("the canonical form does not read: %v\n%s", err, w1.Bytes())
		}
		if diff := cmp.Diff(d, d2); diff != "" {
			t.Fatalf("Read(Write(d)) differs (-want +got):\n%s", diff)
		}
		var w2 bytes.Buffer
		if err := d2.Write(&w2); err != nil || !bytes.Equal(w1.Bytes(), w2.Bytes()) {
			t.Fatalf("the canonical form is not stable (%v)", err)
		}
	})
}

// FuzzVibration evaluates the vibration fixture (testdata/vibration.json)
// with an arbitrary spectrum (breakpoints of frequency, level and slope)
// and damping (one ζ, or six Q): either an *Error naming a path under
// vibration, or an evaluation whose random figures are finite; never a
// panic, a NaN or an error of another type.
func FuzzVibration(f *testing.F) {
	// frequency, asd, slope per group; the first group's slope is ζ (> 0)
	// or −Q (< 0), given to every mode.
	f.Add(fuzzdata.Append(nil, 20, 0.01, 0.02, 2000, 0.01, 0))
	f.Add(fuzzdata.Append(nil, 20, 0, -25, 50, 0.16, 6, 800, 0.16, 0, 2000, 0, -6))
	f.Add(fuzzdata.Append(nil, 1, 1e300, 0.5, 1e6, 1e300, 0))
	f.Add(fuzzdata.Append(nil, 5, 0.001, -0.5, 20, 0.01, 0, 500, 0.01, 0))
	f.Add(fuzzdata.Append(nil, 1e-300, 1e-300, 1e-9, 1e300, 0, -3.0103))
	base, err := Parse(readFile(f, "testdata/vibration.json"))
	if err != nil {
		f.Fatal(err)
	}
	b, err := base.Build()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		gs := fuzzdata.Floats(data, 3)
		if len(gs) < 1 || len(gs) > 8 {
			return
		}
		d := b.Design()
		v := d.Vibration
		v.Spectrum.Points = nil
		v.Damping, v.Q = nil, nil
		if z := gs[0][2]; z >= 0 {
			v.Damping = []float64{z}
		} else {
			v.Q = []float64{-z}
		}
		for i, g := range gs {
			bp := kinematic.Breakpoint{Frequency: g[0], ASD: g[1]}
			if i > 0 {
				bp.Slope = g[2]
			}
			v.Spectrum.Points = append(v.Spectrum.Points, bp)
		}
		ev, err := d.Evaluate(t.Context())
		if err != nil {
			var e *Error
			if !errors.As(err, &e) || !strings.HasPrefix(e.Path, "vibration") {
				t.Fatalf("error %v (%T) does not name the vibration section", err, err)
			}
			return
		}
		for _, ra := range ev.Random {
			r := ra.Response
			for _, x := range []float64{r.Input, r.Centre.RMS, r.Point.RMS, r.Displacement.RMS, r.Tilt.RMS} {
				if math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
					t.Fatalf("axis %v: a figure is %g", ra.Axis, x)
				}
			}
			for _, c := range r.Contacts {
				if math.IsNaN(c.Margin) || math.IsNaN(c.Openings) || math.IsInf(c.Openings, 0) || c.Probability < 0 || c.Probability > 1 {
					t.Fatalf("axis %v: contact %+v", ra.Axis, c)
				}
			}
		}
		for _, vd := range ev.Verdicts() {
			if math.IsNaN(vd.Value) {
				t.Fatalf("verdict %v is NaN", vd)
			}
		}
	})
}
