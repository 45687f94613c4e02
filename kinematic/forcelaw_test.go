package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

var cube10 = Magnet{Size: [3]float64{0.01, 0.01, 0.01}, Remanence: 1}

// TestMagnetDipoleLimit checks the closed form against the point-dipole
// limit of two coaxial magnets, F = 3μ0 m1 m2/(2π z⁴) with m = Br·V/μ0
// (Jackson, Classical Electrodynamics, 3rd ed., 1999, §5.6–5.7: the field
// of a dipole, eq. 5.56, and the force ∇(m·B)), for unequal, non-cubic
// magnets at 15 sizes (still the corner sum): the magnets' finite size
// changes the force by a multiple of (L/z)² (the next term of the
// multipole expansion), L the largest edge.
func TestMagnetDipoleLimit(t *testing.T) {
	a := Magnet{Size: [3]float64{0.012, 0.008, 0.004}, Remanence: RemanenceN42}
	b := Magnet{Size: [3]float64{0.006, 0.010, 0.005}, Remanence: RemanenceSmCo}
	L := 0.012
	for _, d := range []float64{8, 12, 15, 19} {
		z := d * L
		gap := z - (a.Size[2]+b.Size[2])/2
		f, _, err := MagnetPair{Moving: b, Base: a}.Force(gap)
		if err != nil {
			t.Fatal(err)
		}
		m1 := a.Remanence * a.volume() / mu0
		m2 := b.Remanence * b.volume() / mu0
		want := 3 * mu0 * m1 * m2 / (2 * math.Pi * math.Pow(z, 4))
		if rel := math.Abs(f/want - 1); rel > 2/(d*d) {
			t.Errorf("at %g sizes: F = %.8g N, dipole %.8g N, relative %.3g > 2(L/z)²", d, f, want, rel)
		}
	}
}

// TestMagnetCrossover checks the switch from the corner sum to the dipole
// limit at 20 sizes: the force and its slope on either side agree to the
// dipole's truncation, a multiple of (L/z)² = 1/400 (see
// TestMagnetDipoleLimit), and the corner sum just inside still agrees with
// the dipole to that order (it has not yet lost its digits).
func TestMagnetCrossover(t *testing.T) {
	a := Magnet{Size: [3]float64{0.012, 0.008, 0.004}, Remanence: 1.2}
	b := Magnet{Size: [3]float64{0.006, 0.010, 0.005}, Remanence: 1.1}
	p := MagnetPair{Moving: b, Base: a, Offset: [2]float64{0.003, -0.002}}
	L := 0.012
	z := math.Sqrt(math.Pow(dipoleFar*L, 2) - 0.003*0.003 - 0.002*0.002)
	g := z - (a.Size[2]+b.Size[2])/2
	fin, din, _ := p.Force(g * (1 - 1e-9))
	fout, dout, _ := p.Force(g * (1 + 1e-9))
	if rel := math.Abs(fin/fout - 1); rel > 2.0/400 {
		t.Errorf("force jumps by %.3g at the crossover", rel)
	}
	if rel := math.Abs(din/dout - 1); rel > 4.0/400 {
		t.Errorf("slope jumps by %.3g at the crossover", rel)
	}
	// Far beyond, the law is exactly the dipole's: z⁻⁴ on the axis.
	q := MagnetPair{Moving: b, Base: a}
	h := (a.Size[2] + b.Size[2]) / 2
	f1, _, _ := q.Force(1)
	f2, _, _ := q.Force(2*(1+h) - h)
	if rel := math.Abs(f1/f2/16 - 1); rel > 1e-12 {
		t.Errorf("far field not z⁻⁴: relative %.3g", rel)
	}
}

// TestMagnetQuadrature checks the closed form against an independent
// computation of the same model: the Coulombian (surface-charge) model
// of two uniformly magnetised cuboids, charges σ = ±Br/μ0 on the pole
// faces, F_z = Br1·Br2/(4π μ0) Σ ± ∬∬ Δz/|Δr|³ dA1 dA2 (Furlani, Permanent
// Magnet and Electromechanical Devices, 2001, the charge model of §2–3,
// from memory), integrated by tensor Gauss–Legendre quadrature (gonum's
// quad.Legendre) at a gap where the integrand is smooth.
func TestMagnetQuadrature(t *testing.T) {
	a := Magnet{Size: [3]float64{0.012, 0.008, 0.004}, Remanence: 1.3}
	b := Magnet{Size: [3]float64{0.006, 0.010, 0.005}, Remanence: 1.1}
	for _, c := range []struct{ gap, ox, oy float64 }{{0.004, 0, 0}, {0.003, 0.002, -0.001}} {
		p := MagnetPair{Moving: b, Base: a, Offset: [2]float64{c.ox, c.oy}}
		f, _, err := p.Force(c.gap)
		if err != nil {
			t.Fatal(err)
		}
		want := chargeModel(a, b, c.ox, c.oy, c.gap, 20)
		if rel := math.Abs(f/want - 1); rel > 1e-6 {
			t.Errorf("gap %g offset (%g, %g): closed form %.10g N, quadrature %.10g N, relative %.3g", c.gap, c.ox, c.oy, f, want, rel)
		}
	}
}

// chargeModel integrates the attraction of magnet b (above) by a (below)
// across the gap in the charge model by n-point Gauss–Legendre quadrature
// in each of the four face coordinates.
func chargeModel(a, b Magnet, ox, oy, gap float64, n int) float64 {
	za := [2]float64{a.Size[2] / 2, -a.Size[2] / 2} // top (+σ), bottom (−σ)
	zc := a.Size[2]/2 + gap + b.Size[2]/2
	zb := [2]float64{zc + b.Size[2]/2, zc - b.Size[2]/2}
	sign := [2]float64{1, -1}
	var fz float64
	for i, z1 := range za {
		for j, z2 := range zb {
			dz := z2 - z1
			g := func(x2, y2 float64) float64 {
				return quad.Fixed(func(x1 float64) float64 {
					return quad.Fixed(func(y1 float64) float64 {
						dx, dy := x2-x1, y2-y1
						r2 := dx*dx + dy*dy + dz*dz
						return dz / (r2 * math.Sqrt(r2))
					}, -a.Size[1]/2, a.Size[1]/2, n, quad.Legendre{}, 0)
				}, -a.Size[0]/2, a.Size[0]/2, n, quad.Legendre{}, 0)
			}
			v := quad.Fixed(func(x2 float64) float64 {
				return quad.Fixed(func(y2 float64) float64 { return g(x2, y2) },
					oy-b.Size[1]/2, oy+b.Size[1]/2, n, quad.Legendre{}, 0)
			}, ox-b.Size[0]/2, ox+b.Size[0]/2, n, quad.Legendre{}, 0)
			fz += sign[i] * sign[j] * v
		}
	}
	return -a.Remanence * b.Remanence / (4 * math.Pi * mu0) * fz
}

// TestMagnetIdentities checks Newton's third law (swapping the magnets),
// the mirror symmetries of the offset, the exact scaling of the charge
// model (all lengths ×s: the force ×s², its slope ×s; the same force with
// the magnets in millimetres and metres), the touching limit (finite,
// larger than any gap's force, the slope −Inf for faces with a common
// edge) and the monotone fall with the gap, with the slope agreeing with
// a central difference.
func TestMagnetIdentities(t *testing.T) {
	a := Magnet{Size: [3]float64{0.012, 0.008, 0.004}, Remanence: 1.3}
	b := Magnet{Size: [3]float64{0.006, 0.010, 0.005}, Remanence: 1.1}
	p := MagnetPair{Moving: b, Base: a, Offset: [2]float64{0.002, 0.001}}
	q := MagnetPair{Moving: a, Base: b, Offset: [2]float64{-0.002, -0.001}}
	for _, g := range []float64{0, 1e-4, 0.002, 0.02} {
		f1, d1, _ := p.Force(g)
		f2, d2, _ := q.Force(g)
		if math.Abs(f1/f2-1) > 1e-12 || (g > 0 && math.Abs(d1/d2-1) > 1e-9) {
			t.Errorf("gap %g: swapped magnets give %.15g, %.15g N", g, f1, f2)
		}
		r := p
		r.Offset[1] = -r.Offset[1]
		f3, _, _ := r.Force(g)
		if math.Abs(f3/f1-1) > 1e-12 {
			t.Errorf("gap %g: mirrored offset gives %.15g, %.15g N", g, f3, f1)
		}
	}
	const s = 1000
	big := MagnetPair{Moving: Magnet{Size: [3]float64{6, 10, 5}, Remanence: 1.1}, Base: Magnet{Size: [3]float64{12, 8, 4}, Remanence: 1.3}, Offset: [2]float64{2, 1}}
	for _, g := range []float64{0, 0.0005, 0.003} {
		f, d, _ := p.Force(g)
		fb, db, _ := big.Force(g * s)
		if math.Abs(fb/(f*s*s)-1) > 1e-11 {
			t.Errorf("gap %g: scaled force %.15g, want %.15g", g, fb, f*s*s)
		}
		if g > 0 && math.Abs(db/(d*s)-1) > 1e-9 {
			t.Errorf("gap %g: scaled slope %.15g, want %.15g", g, db, d*s)
		}
	}
	eq := MagnetPair{Moving: cube10, Base: cube10}
	f0, d0, err := eq.Force(0)
	if err != nil || !allFinite(f0) || f0 <= 0 || !math.IsInf(d0, -1) {
		t.Errorf("touching cubes: %g N, slope %g, %v; want finite force, slope −Inf", f0, d0, err)
	}
	prev := math.Inf(1)
	for k := range 60 {
		g := 1e-7 * math.Pow(1.3, float64(k))
		f, d, err := p.Force(g)
		if err != nil {
			t.Fatal(err)
		}
		if !(f < prev) || !(d < 0) {
			t.Errorf("gap %g: force %g (before %g), slope %g: not falling", g, f, prev, d)
		}
		prev = f
		if g > 0.01 {
			continue // the corner sum keeps too few digits for a difference quotient
		}
		h := g * 1e-4
		fp, _, _ := p.Force(g + h)
		fm, _, _ := p.Force(g - h)
		if fd := (fp - fm) / (2 * h); math.Abs(fd/d-1) > 1e-5 {
			t.Errorf("gap %g: slope %g, central difference %g", g, d, fd)
		}
	}
}

// TestMagnetPlate checks the image law: the plate's force at the gap g is
// the pair's with an identical magnet at 2g, its slope twice the pair's
// (chain rule), and at large gaps the dipole limit with the image:
// F = 3μ0 m²/(2π (2g + c)⁴) for a magnet of height c (Jackson, as above).
func TestMagnetPlate(t *testing.T) {
	m := Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: RemanenceN42}
	pl := MagnetPlate{Magnet: m}
	pr := MagnetPair{Moving: m, Base: m}
	for _, g := range []float64{0, 0.0006, 0.003} {
		f, d, _ := pl.Force(g)
		fp, dp, _ := pr.Force(2 * g)
		if f != fp || (g > 0 && d != 2*dp) {
			t.Errorf("gap %g: plate %g N %g N/m, pair at 2g %g N %g N/m", g, f, d, fp, dp)
		}
	}
	g := 0.5
	f, _, _ := pl.Force(g)
	mm := m.Remanence * m.volume() / mu0
	z := 2*g + m.Size[2]
	if want := 3 * mu0 * mm * mm / (2 * math.Pi * math.Pow(z, 4)); math.Abs(f/want-1) > 1e-9 {
		t.Errorf("far plate: %g N, dipole with its image %g N", f, want)
	}
}

// TestForceTable checks the Fritsch–Carlson interpolant against values
// worked by hand from the paper's steps (SIAM J. Numer. Anal. 17(2), 1980:
// tangents the average of the secants, zero at an extremum or a flat,
// scaled by τ = 3/√(α² + β²) when α² + β² > 9), the points reproduced,
// monotone data giving a monotone curve, and the ends held flat.
func TestForceTable(t *testing.T) {
	// (0, 0), (1, 1), (2, 1): secants 1, 0; tangents 1, 0, 0. At 0.5 the
	// Hermite basis (0.5, 0.125, 0.5, −0.125) gives 0.125·1 + 0.5·1 = 0.625,
	// slope (−1.5·0 + 1.5·1) + (−0.25)·1 + 0 = 1.25.
	tb, err := NewForceTable([]TablePoint{{0, 0}, {1, 1}, {2, 1}})
	if err != nil {
		t.Fatal(err)
	}
	if f, d, _ := tb.Force(0.5); math.Abs(f-0.625) > 1e-15 || math.Abs(d-1.25) > 1e-15 {
		t.Errorf("F(0.5) = %g, slope %g; want 0.625, 1.25", f, d)
	}
	// (0, 0), (1, 1), (2, 11): secants 1, 10; tangents 1, 5.5, 10; on the
	// first interval α = 1, β = 5.5, α² + β² = 31.25 > 9, τ = 3/√31.25 =
	// 0.536656315, tangents 0.536656315 and 2.951609734; the second
	// (α = 0.29516, β = 1) is inside. At 0.5: 0.5 + 0.125·(0.536656315 −
	// 2.951609734) = 0.198130823.
	tb, err = NewForceTable([]TablePoint{{0, 0}, {1, 1}, {2, 11}})
	if err != nil {
		t.Fatal(err)
	}
	if f, _, _ := tb.Force(0.5); math.Abs(f-0.198130823) > 1e-9 {
		t.Errorf("F(0.5) = %.10g; want 0.198130823", f)
	}
	// A magnet-like falling table: monotone, through its points, flat
	// beyond them; the same table written as a literal (no NewForceTable)
	// gives the same values.
	pts := []TablePoint{{0, 40}, {0.0005, 30}, {0.001, 24}, {0.002, 12}, {0.004, 4}, {0.008, 0.5}}
	tb, _ = NewForceTable(pts)
	lit := &ForceTable{Points: pts}
	prev := math.Inf(1)
	for k := 0; k <= 1000; k++ {
		g := 0.008 * float64(k) / 1000
		f, d, _ := tb.Force(g)
		fl, _, _ := lit.Force(g)
		if f > prev || d > 1e-12 || f != fl {
			t.Fatalf("gap %g: %g N slope %g (before %g N, literal %g N)", g, f, d, prev, fl)
		}
		prev = f
	}
	for _, p := range pts {
		if f, _, _ := tb.Force(p.Gap); math.Abs(f-p.Force) > 1e-12 {
			t.Errorf("gap %g: %g N, table %g N", p.Gap, f, p.Force)
		}
	}
	if f, d, _ := tb.Force(1); f != 0.5 || d != 0 {
		t.Errorf("beyond the table: %g N slope %g", f, d)
	}
}

// TestForceLawErrors checks that bad laws and gaps name their field.
func TestForceLawErrors(t *testing.T) {
	for _, c := range []struct {
		law   ForceLaw
		gap   float64
		field string
		want  error
	}{
		{&ForceTable{Points: []TablePoint{{0, 1}}}, 0, "Points", ErrDegenerate},
		{&ForceTable{Points: []TablePoint{{0, 1}, {0, 2}}}, 0, "Points[1].Gap", ErrRange},
		{&ForceTable{Points: []TablePoint{{0, 1}, {1, -2}}}, 0, "Points[1].Force", ErrRange},
		{&ForceTable{Points: []TablePoint{{0, 1}, {math.NaN(), 2}}}, 0, "Points[1].Gap", ErrNonFinite},
		{&ForceTable{Points: []TablePoint{{0, 1}, {1, 2}}}, -1, "gap", ErrRange},
		{MagnetPair{Moving: cube10}, 0, "Base.Size[0]", ErrRange},
		{MagnetPair{Moving: cube10, Base: Magnet{Size: cube10.Size}}, 0, "Base.Remanence", ErrRange},
		{MagnetPair{Moving: cube10, Base: cube10, Offset: [2]float64{0, math.Inf(1)}}, 0, "Offset[1]", ErrNonFinite},
		{MagnetPair{Moving: cube10, Base: cube10}, math.NaN(), "gap", ErrNonFinite},
		{MagnetPlate{Magnet: Magnet{Size: [3]float64{1, 0, 1}, Remanence: 1}}, 0, "Magnet.Size[1]", ErrRange},
		{MagnetPair{Moving: Magnet{Size: [3]float64{1e200, 1e200, 1e200}, Remanence: 1}, Base: cube10}, 0, "gap", ErrRange},
	} {
		_, _, err := c.law.Force(c.gap)
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !errors.Is(err, c.want) {
			t.Errorf("%+v at %g: %v; want %s wrapping %v", c.law, c.gap, err, c.field, c.want)
		}
	}
}

// FuzzForceLaw checks that the laws never panic and return either an
// error naming a field or a finite force (non-negative but for an offset
// magnet pair, which may repel) with a slope that is not NaN.
// The bytes are float64s: kind (table, pair, plate), gap, and the rest
// as the table's points or the magnets' sizes, remanences and offset.
func FuzzForceLaw(f *testing.F) {
	f.Add(fuzzdata.Append(nil, 0, 0.001, 0, 40, 0.001, 24, 0.004, 4))
	f.Add(fuzzdata.Append(nil, 0, 0.001, 0, 40, 0.002, 50, 0.001, 4))
	f.Add(fuzzdata.Append(nil, 0, 0.001, 0, -1, 0.002, 5))
	f.Add(fuzzdata.Append(nil, 1, 0.0006, 0.012, 0.012, 0.004, 1.3, 0.012, 0.012, 0.004, 1.3, 0, 0))
	f.Add(fuzzdata.Append(nil, 1, 0, 0, 0.012, 0.004, 1.3, 0.012, 0.012, 0.004, 1.3, 0, 0))
	f.Add(fuzzdata.Append(nil, 2, math.NaN(), 0.012, 0.012, 0.004, 1.3))
	f.Add(fuzzdata.Append(nil, 2, 0, 0.012, 0.012, 0.004, 1.45))
	f.Fuzz(func(t *testing.T, b []byte) {
		x := fuzzdata.Floats(b, 1)
		if len(x) < 2 {
			return
		}
		v := make([]float64, len(x))
		for i := range x {
			v[i] = x[i][0]
		}
		gap, rest := v[1], v[2:]
		var law ForceLaw
		switch k := v[0]; {
		case k < 0.5:
			var pts []TablePoint
			for i := 0; i+1 < len(rest) && i < 64; i += 2 {
				pts = append(pts, TablePoint{rest[i], rest[i+1]})
			}
			law = &ForceTable{Points: pts}
		case k < 1.5:
			if len(rest) < 10 {
				return
			}
			law = MagnetPair{Moving: Magnet{[3]float64{rest[0], rest[1], rest[2]}, rest[3]},
				Base: Magnet{[3]float64{rest[4], rest[5], rest[6]}, rest[7]}, Offset: [2]float64{rest[8], rest[9]}}
		default:
			if len(rest) < 4 {
				return
			}
			law = MagnetPlate{Magnet{[3]float64{rest[0], rest[1], rest[2]}, rest[3]}}
		}
		force, slope, err := law.Force(gap)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field == "" {
				t.Fatalf("error without a field: %v", err)
			}
			return
		}
		_, pair := law.(MagnetPair)
		if !allFinite(force) || (force < 0 && !pair) || math.IsNaN(slope) {
			t.Fatalf("%+v at %g: force %g, slope %g", law, gap, force, slope)
		}
	})
}

// BenchmarkMagnetPair is one force and slope of two N42 12×12×4 mm
// magnets: coaxial at 0.6 mm, offset laterally, and in the dipole range.
func BenchmarkMagnetPair(b *testing.B) {
	m := Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: RemanenceN42}
	for _, c := range []struct {
		name string
		p    MagnetPair
		gap  float64
	}{
		{"coaxial", MagnetPair{Moving: m, Base: m}, 0.0006},
		{"offset", MagnetPair{Moving: m, Base: m, Offset: [2]float64{0.001, 0.0005}}, 0.0006},
		{"dipole", MagnetPair{Moving: m, Base: m}, 0.5},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, _, err := c.p.Force(c.gap); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// TestRemanenceGrades checks each grade constant against the range its
// source gives (Shanghai Magnet, NdFeB Performance Parameter Table: N42
// 1.28–1.32 T, N52 1.42–1.46 T; Magnetsearcher, typical properties of
// samarium cobalt magnets: YXG30H 1.08–1.10 T).
func TestRemanenceGrades(t *testing.T) {
	for _, g := range []struct {
		name       string
		br, lo, hi float64
	}{{"N42", RemanenceN42, 1.28, 1.32}, {"N52", RemanenceN52, 1.42, 1.46}, {"SmCo", RemanenceSmCo, 1.08, 1.10}} {
		if g.br < g.lo || g.br > g.hi {
			t.Errorf("%s: %g T outside the published %g–%g T", g.name, g.br, g.lo, g.hi)
		}
	}
}
