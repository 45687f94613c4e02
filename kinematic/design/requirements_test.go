package design

import (
	"context"
	"encoding/json"
	"math"
	"strings"
	"testing"
)

// editFixture returns the design file name with change applied to its
// decoded form, parsed.
func editFixture(t *testing.T, name string, change func(m map[string]any)) *Design {
	t.Helper()
	var m map[string]any
	if err := json.Unmarshal(readFile(t, name), &m); err != nil {
		t.Fatal(err)
	}
	change(m)
	b, err := json.Marshal(m)
	if err != nil {
		t.Fatal(err)
	}
	d, err := Parse(b)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

// verdict evaluates d and returns the evaluation and its verdict on the
// requirement req.
func verdict(t *testing.T, d *Design, req string) (Evaluation, Verdict) {
	t.Helper()
	ev, err := d.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	for _, v := range ev.Verdicts() {
		if v.Requirement == req {
			return ev, v
		}
	}
	t.Fatalf("no verdict on %s", req)
	return ev, Verdict{}
}

// TestStudyPercentiles asks the equilateral fixture's Monte Carlo
// requirement for percentiles "p50" and "p99.73" and reads P95 and P99 off
// the same study, against closed forms. By item 8 of
// TestEquilateralEndToEnd's derivation, O moves by (√2/3) e S with S the
// sum of three uniforms on ±1 (e = 1 µm). The density of S is (3 − s²)/8
// for |s| ≤ 1 (the n = 3 Irwin–Hall density (−2x² + 6x − 3)/2 on [1, 2],
// with x = (s + 3)/2 and a factor 1/2), so P(|S| ≤ s) = (9s − s³)/12 there,
// and P(|S| > s) = (3 − s)³/24 for 1 ≤ s ≤ 3. Hence, by hand:
//
//	p50:    s³ − 9s + 6 = 0 in (0, 1): s = 2√3 cos((arccos(−1/√3) − 2π)/3) = 0.70575
//	p95:    (3 − s)³ = 24·0.05:   s = 3 − 1.2^(1/3)
//	p99:    (3 − s)³ = 24·0.01:   s = 3 − 0.24^(1/3)
//	p99.73: (3 − s)³ = 24·0.0027: s = 3 − 0.0648^(1/3)
//
// Sampling errors at N = 200 000, √(q(1 − q)/N)/f(s) with the density of
// |S| f = (3 − s²)/4 or (3 − s)²/8: 0.25 %, 0.18 %, 0.2 %, 0.22 % of s;
// each is checked within 1.5 % (six of them or more).
func TestStudyPercentiles(t *testing.T) {
	const e = 1e-6
	hand := map[string]float64{
		"p50":    2 * math.Sqrt(3) * math.Cos((math.Acos(-1/math.Sqrt(3))-2*math.Pi)/3),
		"p95":    3 - math.Cbrt(1.2),
		"p99":    3 - math.Cbrt(0.24),
		"p99.73": 3 - math.Cbrt(0.0648),
	}
	check := func(name string, got float64) {
		t.Helper()
		if want := math.Sqrt2 / 3 * hand[name] * e; math.Abs(got-want) > 0.015*want {
			t.Errorf("%s: %g m, want %g m", name, got, want)
		}
	}
	// Asked for in the file: p50 and p99.73 (p99 is the fixture's own,
	// checked by TestEquilateralEndToEnd); p95 read off the same study.
	for _, name := range []string{"p50", "p99.73"} {
		d := editFixture(t, "testdata/equilateral.json", set("requirements.max_study", map[string]any{"limit": "1 um", "percentile": name}))
		if d.Requirements.StudyPercentile.String() != name {
			t.Errorf("%s: read as %v", name, d.Requirements.StudyPercentile)
		}
		ev, v := verdict(t, d, "requirements.max_study")
		check(name, v.Value)
		if !strings.Contains(v.Note, "radial "+name+" of 200000 samples") || v.Pass != (v.Value <= 1e-6) {
			t.Errorf("%s: verdict %+v", name, v)
		}
		if name == "p50" {
			check("p95", ev.Study.Radial.P95)
			check("p99", ev.Study.Radial.P99)
		}
	}
	// The hand value of p50 solves its cubic.
	s := hand["p50"]
	if r := s*s*s - 9*s + 6; math.Abs(r) > 1e-12 || s < 0.7 || s > 0.71 {
		t.Errorf("p50 of |S|: s = %g, cubic residual %g", s, r)
	}
}

// TestWeakestContact: with vee A of the equilateral fixture narrowed to a
// half-angle of 30° (a 120° vee) and B and C kept at 45°, the weakest
// Maxwell centre index is A's. Removing one of A's flanks frees one
// motion: B's and C's centres may only slide along their groove axes
// (whatever their half-angles), and A's centre must stay normal to A's other
// flank; that is the motion of a coupling with every vee at 30°, where the
// grooves on the bisectors make every centre index |sin 2θ| (the closed form
// in DEVELOPERS.md). So A's two contacts have sin 60° = √3/2, B's and C's
// sin 90° = 1, and a floor of 0.9 fails at contact A+ or A− (equal but
// for rounding) with the value √3/2.
func TestWeakestContact(t *testing.T) {
	d := editFixture(t, "testdata/equilateral.json", both(
		set("seats[0].half_angle", "30 deg"),
		set("requirements.min_maxwell_index", 0.9),
		set("monte_carlo.samples", 1000))) // the study plays no part here
	ev, v := verdict(t, d, "requirements.min_centre_index") // the old key reads as min_centre_index
	if want := math.Sqrt(3) / 2; math.Abs(v.Value-want) > 1e-12 || v.Pass || !(strings.HasSuffix(v.Note, "weakest at contact A+") || strings.HasSuffix(v.Note, "weakest at contact A-")) {
		t.Errorf("verdict %+v, want %.15g failing at contact A+ or A-", v, want)
	}
	for _, m := range ev.Stability.Contacts {
		want := 1.0
		if strings.HasPrefix(m.Label, "A") {
			want = math.Sqrt(3) / 2
		}
		if math.Abs(m.CentreIndex-want) > 1e-12 {
			t.Errorf("contact %s: centre index %.15g, want %.15g", m.Label, m.CentreIndex, want)
		}
	}
}
