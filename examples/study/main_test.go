package main

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/kinematic/design"
)

const cassette = "../cassette/cassette.json"

// runCmd runs the command and returns its exit status, report and
// errors.
func runCmd(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errs bytes.Buffer
	code := run(t.Context(), args, strings.NewReader(stdin), &out, &errs)
	return code, out.String(), errs.String()
}

// svgElements parses an SVG file and returns its text and its number of
// elements.
func svgElements(t *testing.T, path string) (string, int) {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	dec := xml.NewDecoder(bytes.NewReader(b))
	elems := 0
	var text strings.Builder
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("%s: %v", path, err)
		}
		switch v := tok.(type) {
		case xml.StartElement:
			elems++
		case xml.CharData:
			text.Write(v)
		}
	}
	return text.String(), elems
}

// TestCassette runs the whole study on the cassette design and checks
// the report and the drawings.
func TestCassette(t *testing.T) {
	dir := t.TempDir()
	code, rep, errs := runCmd(t, "", "-out", dir, cassette)
	if code != exitPass {
		t.Fatalf("exit status %d, want 0; stderr: %s\n%s", code, errs, rep)
	}
	for _, want := range []string{"detector cassette on a benchtop spectrometer", "1. The coupling", "2. Constraint", "3. Loads", "4. Stiffness",
		"5. Error budget at the detector centre", "6. Random vibration", "7. Requirements", "8. Drawings", "Caution:", "verify it by test", "qualified engineer",
		"Monte Carlo, 100000 parts", "thermal change of +3 K", "friction seating", "Every requirement is met (22).", "preload for 3 σ at every contact", "Worst direction: along worst",
		"random-spectrum.svg", "random-margins.svg", "defer to the applicable codes and a qualified engineer"} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if m := regexp.MustCompile(`(?i)\bNaN\b|[+-]?Inf\b`).FindString(rep); m != "" {
		t.Errorf("report prints %q", m)
	}
	if strings.Contains(rep, "Optimisation") {
		t.Error("the report optimised without -optimize")
	}

	// Vertical balance of the seated case (statics, by hand): the six
	// flank normals of the 90° vees lean 45° from the horizontal, so
	// Σ fᵢ sin 45° = preload + weight = 110 N + 0.320 kg · 9.80665 m/s²,
	// Σ fᵢ = 160.001 N. The report prints each force to four figures,
	// 0.01 N at these forces.
	sec := rep[strings.Index(rep, `case "seated":`):]
	sec = sec[:strings.Index(sec, `case "cable pull"`)]
	var sum float64
	n := 0
	for _, m := range regexp.MustCompile(`(?m)^\s+[ABC][+-]\s+([0-9.]+)`).FindAllStringSubmatch(sec, -1) {
		f, _ := strconv.ParseFloat(m[1], 64)
		sum += f
		n++
	}
	want := (110 + 0.320*9.80665) / math.Sin(math.Pi/4)
	if n != 6 || math.Abs(sum-want) > 6*0.005 {
		t.Errorf("seated forces: %d sum to %.3f N, want 6 summing to %.3f N", n, sum, want)
	}

	for _, name := range []string{"plan.svg", "liftoff.svg", "histogram.svg"} {
		if _, elems := svgElements(t, filepath.Join(dir, name)); elems < 20 {
			t.Errorf("%s: only %d elements", name, elems)
		}
	}
	if _, err := os.Stat(filepath.Join(dir, "scorecards.svg")); err == nil {
		t.Error("scorecards.svg drawn without -optimize")
	}
	// The plan names the preload element as the file does.
	if text, _ := svgElements(t, filepath.Join(dir, "plan.svg")); !strings.Contains(text, "spring plunger: 110 N") {
		t.Error("plan.svg does not name the spring plunger with its force")
	}
	// So does the lift-off map, and it names each applied load by its
	// case with its magnitude: |(-4, 2, -1)| N = √21 = 4.58 N and 15 N
	// (cassette.json).
	text, _ := svgElements(t, filepath.Join(dir, "liftoff.svg"))
	for _, want := range []string{"spring plunger: 110 N", "cable pull: applied load, 4.58 N", "operator hand: applied load, 15.0 N"} {
		if !strings.Contains(text, want) {
			t.Errorf("liftoff.svg lacks %q", want)
		}
	}
	if strings.Contains(text, "load 1") || strings.Contains(text, "preload 1") {
		t.Error("liftoff.svg numbers a load or preload that the file names")
	}
}

// TestPercentileColumns reads the report's radial percentile columns and
// checks them against the percentile definition that kinematic.Stats
// documents, the nearest rank: the p-th percentile of n sorted
// magnitudes is the ⌈p·n⌉-th smallest (Hyndman and Fan 1996, "Sample
// quantiles in statistical packages", The American Statistician 50(4),
// definition 1, the inverse of the empirical distribution function),
// applied here to the study's own samples. Worked by hand for n = 10:
// the median is the 5th smallest, and 95, 99 and 99.73 % are all the
// largest (⌈9.5⌉ = ⌈9.9⌉ = ⌈9.973⌉ = 10); for n = 200 the ranks are
// 100, 190, 198 and 200 (⌈199.46⌉). The file's sample count is
// honoured as written.
func TestPercentileColumns(t *testing.T) {
	src, err := os.ReadFile(cassette)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		n     int
		ranks [4]int
	}{
		{10, [4]int{5, 10, 10, 10}},
		{200, [4]int{100, 190, 198, 200}},
	} {
		edited := strings.Replace(string(src), `"samples": 100000`, `"samples": `+strconv.Itoa(tc.n), 1)
		if edited == string(src) {
			t.Fatal("the cassette no longer asks for 100000 samples")
		}
		var out bytes.Buffer
		st := &study{w: &out, cfg: config{path: "-"}}
		if _, err := st.run(t.Context(), []byte(edited)); err != nil {
			t.Fatal(err)
		}
		if st.res == nil || len(st.res.Points) != tc.n {
			t.Fatalf("n = %d: the study kept no samples, or not the file's number", tc.n)
		}
		if !strings.Contains(out.String(), "Monte Carlo, "+strconv.Itoa(tc.n)+" parts") {
			t.Errorf("n = %d: the report does not say the file's sample count", tc.n)
		}
		m := regexp.MustCompile(`radial \(3-D magnitude\): median ([0-9.]+) µm, 95 % ([0-9.]+) µm, 99 % ([0-9.]+) µm, 99.73 % ([0-9.]+) µm`).FindStringSubmatch(out.String())
		if m == nil {
			t.Fatalf("n = %d: no radial percentiles in the report", tc.n)
		}
		r := make([]float64, tc.n)
		for i, p := range st.res.Points {
			r[i] = math.Sqrt(p.X*p.X + p.Y*p.Y + p.Z*p.Z)
		}
		sort.Float64s(r)
		for k, rank := range tc.ranks {
			if want := strconv.FormatFloat(r[rank-1]*1e6, 'f', 2, 64); m[k+1] != want {
				t.Errorf("n = %d: column %d prints %s µm, want %s µm (the %d-th smallest of %d)", tc.n, k+1, m[k+1], want, rank, tc.n)
			}
		}
	}
}

// TestOwnDesigns runs two designs of other seat types, a socket–vee–flat
// mirror cell and a canted three-vee probe head: each passes, names
// itself and its point in the report and the drawings, and mentions
// neither the cassette nor a detector anywhere.
func TestOwnDesigns(t *testing.T) {
	for _, tc := range []struct {
		file, name, point string
		figures           []string
	}{
		{"testdata/mirror.json", "Mirror cell M2", "mirror vertex", []string{"trihedral socket", "flat, up", "vee, 90.0° included"}},
		{"testdata/probe.json", "Probe head on a canted three-vee mount", "stylus tip", []string{"vee, 90.0° included", "groove (-0.940, 0.000, -0.342)"}},
	} {
		t.Run(tc.file, func(t *testing.T) {
			dir := t.TempDir()
			code, rep, errs := runCmd(t, "", "-out", dir, tc.file)
			if code != exitPass {
				t.Fatalf("exit status %d, want 0; stderr: %s\n%s", code, errs, rep)
			}
			if !strings.HasPrefix(rep, tc.name+"\n") {
				t.Errorf("the report is not headed by the design's name %q", tc.name)
			}
			for _, want := range append([]string{"Error budget at the " + tc.point, "error amplification at the " + tc.point,
				"Every requirement is met", "Caution:"}, tc.figures...) {
				if !strings.Contains(rep, want) {
					t.Errorf("report lacks %q", want)
				}
			}
			all := rep
			for _, name := range []string{"plan.svg", "liftoff.svg", "histogram.svg"} {
				text, elems := svgElements(t, filepath.Join(dir, name))
				if elems < 20 {
					t.Errorf("%s: only %d elements", name, elems)
				}
				all += text
				if name == "plan.svg" && !strings.Contains(text, tc.point) {
					t.Errorf("plan.svg does not label the %s", tc.point)
				}
			}
			if m := regexp.MustCompile(`(?i)cassette|detector`).FindString(all); m != "" {
				t.Errorf("the report or a drawing mentions %q", m)
			}
		})
	}
}

// TestExitStatus: 1 when a requirement fails, 2 for a bad file or
// command line, with the JSON path of the fault on standard error.
func TestExitStatus(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	// The mirror cell unloads its first contact at about 1.3 g (its
	// report): asking for 3 g fails.
	failing := strings.Replace(string(src), `"level": "1 g"`, `"level": "3 g"`, 1)
	if failing == string(src) {
		t.Fatal("mirror.json no longer asks for 1 g")
	}
	code, rep, _ := runCmd(t, failing, "-out", "none", "-")
	if code != exitFail || !strings.Contains(rep, "requirements.min_shock") || !strings.Contains(rep, "The design FAILS: 1 of 6") {
		t.Errorf("a failing requirement: exit status %d, want 1\n%s", code, rep)
	}
	if !strings.Contains(rep, "Caution:") {
		t.Error("a failing design's report lacks the caution")
	}

	for _, tc := range []struct {
		name, stdin string
		args        []string
		want        string // on standard error
	}{
		{"bad half-angle", strings.Replace(string(src), `"half_angle": "45 deg"`, `"half_angle": "95 deg"`, 1), []string{"-out", "none", "-"}, "seats[1].half_angle"},
		{"bare number", `{"format": "sixfold.design/2", "balls": [{"centre": [0, 0, 0], "radius": 6.35, "material": "steel-52100"}]}`, []string{"-out", "none", "-"}, "balls[0].radius"},
		{"not JSON", `{"format":`, []string{"-out", "none", "-"}, "design:"},
		{"bad keep-out", strings.Replace(string(src), `"optimize":`, `"packaging": {"keep_outs": [{"at": [0, 0, 0], "clearance": "95 deg"}]}, "optimize":`, 1), []string{"-out", "none", "-"}, "packaging.keep_outs[0].clearance"},
		{"no file", "", []string{"testdata/no-such-file.json"}, "no-such-file.json"},
		{"two files", "", []string{"a.json", "b.json"}, "one design file"},
		{"bad flag", "", []string{"-samples", "5", "a.json"}, "-samples"},
		{"-optimized alone", "", []string{"-optimized", "x.json", "a.json"}, "only with -optimize"},
	} {
		code, _, errs := runCmd(t, tc.stdin, tc.args...)
		if code != exitBad || !strings.Contains(errs, tc.want) {
			t.Errorf("%s: exit status %d, stderr %q; want 2 naming %q", tc.name, code, errs, tc.want)
		}
	}
}

// TestOptimize: -optimize writes the improved design beside the input
// through the canonical writer, leaves the input alone, keeps the exit
// status of the design as written, and the optimised grooves keep to the
// file's window and keep-out (checked here by plane geometry, not by the
// optimiser's own bookkeeping).
func TestOptimize(t *testing.T) {
	src, err := os.ReadFile("testdata/probe.json")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	in := filepath.Join(dir, "probe.json")
	if err := os.WriteFile(in, src, 0o644); err != nil {
		t.Fatal(err)
	}
	code, rep, errs := runCmd(t, "", "-optimize", "-out", filepath.Join(dir, "out"), in)
	if code != exitPass {
		t.Fatalf("exit status %d; stderr %s\n%s", code, errs, rep)
	}
	for _, want := range []string{"8. Optimisation (asked for with -optimize)", "as written", "optimised", "Requirements of the optimised design",
		"groove P: azimuth allowed from 140.0° to 220.0°", "keep-out \"cable gland\""} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	after, err := os.ReadFile(in)
	if err != nil || !bytes.Equal(after, src) {
		t.Fatalf("the input changed (%v)", err)
	}
	f, err := os.Open(filepath.Join(dir, "probe.optimized.json"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	d, err := design.Read(f)
	if err != nil {
		t.Fatal(err)
	}
	if d.Name != "Probe head on a canted three-vee mount" || d.PointName != "stylus tip" || d.Packaging == nil || d.Optimize == nil {
		t.Errorf("the optimised design lost its name, point name or study settings: %+v", d)
	}
	for _, name := range []string{"plan.svg", "plan-optimized.svg", "scorecards.svg"} {
		if _, err := os.Stat(filepath.Join(dir, "out", name)); err != nil {
			t.Error(err)
		}
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	c := b.Coupling()
	// The groove of a vee is normal to its Up; its angle to a direction u
	// in the seat's plane, as lines, is acos|g·û| with û = u projected
	// normal to Up.
	angle := func(i int, u r3.Vec) float64 {
		v := c.Pairs[i].Seat.(kinematic.Vee)
		up := r3.Unit(v.Up)
		u = r3.Unit(r3.Sub(u, r3.Scale(r3.Dot(u, up), up)))
		return math.Acos(math.Min(1, math.Abs(r3.Dot(r3.Unit(v.Direction), u))))
	}
	const tol = 1e-9
	// P's window: within 40° of the radial direction, from P at (40, 0, 0)
	// mm towards the centroid of the balls, the origin.
	if a := angle(0, r3.Vec{X: -1}); a > 40*deg+tol {
		t.Errorf("groove P lies %.3f° off radial, outside its ±40° window", a/deg)
	}
	// The cable gland at (-30, 0, 0) mm reaches Q and R (about 36 mm
	// away in plan, within the 50 mm reach; P is 70 mm away): their
	// grooves stay at least 25° off the line to it.
	gland := r3.Vec{X: -0.030}
	for i := 1; i <= 2; i++ {
		if a := angle(i, r3.Sub(gland, c.Pairs[i].Ball.Centre)); a < 25*deg-tol {
			t.Errorf("groove %s lies %.3f° off the cable gland, inside its 25° clearance", c.Pairs[i].Name, a/deg)
		}
	}
}

// TestOptimizeStdin: a design on standard input is optimised into the
// drawings' folder, named after "design".
func TestOptimizeStdin(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	code, rep, errs := runCmd(t, string(src), "-optimize", "-out", dir, "-")
	if code != exitPass {
		t.Fatalf("exit status %d; stderr %s\n%s", code, errs, rep)
	}
	if _, err := os.Stat(filepath.Join(dir, "design.optimized.json")); err != nil {
		t.Errorf("no optimised design in the drawings' folder: %v", err)
	}
	if m := regexp.MustCompile(`(?i)cassette|detector`).FindString(rep); m != "" {
		t.Errorf("the report mentions %q", m)
	}
}

// TestWrap checks the description's line breaking on a case worked by
// hand: "aa bbb cc" at width 6 is "aa bbb" (6 runes) and "cc".
func TestWrap(t *testing.T) {
	if got := wrap("aa bbb  cc", 6); got != "aa bbb\ncc" {
		t.Errorf("wrap = %q, want %q", got, "aa bbb\ncc")
	}
	if got := wrap("µµµµµµµ a", 3); got != "µµµµµµµ\na" {
		t.Errorf("a long word: %q", got)
	}
}

// TestUnnamedBalls: a design file that names no ball gets the report's
// ball column lettered by position, as the design format documents
// ("default "A", "B", ... by position") and as the contacts are labelled.
func TestUnnamedBalls(t *testing.T) {
	const file = `{"format": "sixfold.design/2",
  "balls": [
    {"centre": ["20 mm", "0 mm", "0 mm"], "radius": "3 mm", "material": "steel-52100"},
    {"centre": ["-10 mm", "17.32 mm", "0 mm"], "radius": "3 mm", "material": "steel-52100"},
    {"centre": ["-10 mm", "-17.32 mm", "0 mm"], "radius": "3 mm", "material": "steel-52100"}],
  "seats": [
    {"type": "trihedral", "half_angle": "35 deg", "toward": [1, 0, 0], "material": "steel-440c"},
    {"type": "vee", "half_angle": "45 deg", "direction": [0.866, -0.5, 0], "material": "steel-440c"},
    {"type": "flat", "material": "steel-440c"}]}`
	code, out, errs := runCmd(t, file, "-out", "none", "-")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, row := range []string{"\nA      (20.00, 0.00, 0.00) mm", "\nB      (-10.00, 17.32, 0.00) mm", "\nC      (-10.00, -17.32, 0.00) mm"} {
		if !strings.Contains(out, row) {
			t.Errorf("report lacks the row %q", row)
		}
	}
}

// TestOpeningsPreload: with the cassette's plunger at 55 N the worst
// direction's contact C+ is expected to open hundreds of times in the
// test; the report's margin for at most 0.01 openings follows Rice's
// formula from the table's own figures (openings = ν₀T·exp(−m²/2), so
// the margin is √(2 ln(openings·e^(m²/2)/0.01)), checked to the printed
// three figures), and the plunger force it prints, put back into the
// file, meets max_random_openings along every axis.
func TestOpeningsPreload(t *testing.T) {
	raw, err := os.ReadFile("../cassette/cassette.json")
	if err != nil {
		t.Fatal(err)
	}
	weak := strings.Replace(string(raw), `"force": "110 N"`, `"force": "55 N"`, 1)
	if weak == string(raw) {
		t.Fatal("the cassette's plunger is no longer 110 N: update the test")
	}
	_, out, _ := runCmd(t, weak, "-out", "none", "-")
	sec := out[strings.Index(out, "Along worst"):]
	row := regexp.MustCompile(`(?m)^\s+C\+\s+\S+\s+\S+\s+\S+\s+(\S+)\s+(\S+)`).FindStringSubmatch(sec)
	line := regexp.MustCompile(`at most 0\.01 expected openings: a margin of (\S+) σ at contact (\S+) .*\(spring plunger (\S+) N\)`).FindStringSubmatch(sec)
	if row == nil || line == nil {
		t.Fatalf("no C+ row or openings line in:\n%s", sec)
	}
	m, _ := strconv.ParseFloat(row[1], 64)
	n, _ := strconv.ParseFloat(row[2], 64)
	got, _ := strconv.ParseFloat(line[1], 64)
	want := math.Sqrt(2 * (math.Log(n) + m*m/2 - math.Log(0.01)))
	if line[2] != "C+" || math.Abs(got-want) > 0.01*want {
		t.Errorf("margin for 0.01 openings %g at %s, want %.3g at C+ (from m = %g, openings %g)", got, line[2], want, m, n)
	}
	fixed := strings.Replace(weak, `"force": "55 N"`, `"force": "`+line[3]+` N"`, 1)
	_, out, _ = runCmd(t, fixed, "-out", "none", "-")
	verdicts := 0
	for _, l := range strings.Split(out, "\n") {
		if strings.HasPrefix(l, "requirements.max_random_openings") {
			verdicts++
			if !strings.HasSuffix(l, "passes") {
				t.Errorf("with the plunger at %s N: %s", line[3], l)
			}
		}
	}
	if verdicts != 4 {
		t.Errorf("%d max_random_openings verdicts with the plunger at %s N, want 4 (x, y, z, worst)", verdicts, line[3])
	}
}

// TestNoThermalCentre: the mirror cell's three seats (socket, vee, flat)
// are each symmetric about a vertical Up, so the balls' growth only lifts
// them; with the cell and the base expanding alike (23.6e-6 1/K both) the
// motion relative to the base neither turns nor strains in the plane of
// the balls, and the report says there is no thermal centre instead of
// printing a point computed from rounding. With the file's own base
// (1.3e-6 1/K) the cell strains about the socket's ball, at the origin,
// and the report prints that point.
func TestNoThermalCentre(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name, base, want, not string
	}{
		{"alike", "23.6 ppm/K", "  no thermal centre: relative to the base the body neither turns nor strains", "thermal centre at"},
		{"the file's", "1.3 ppm/K", "  thermal centre at (0.00, 0.00, 0.00) mm", "no thermal centre"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s := strings.Replace(string(src), `"base_alpha": "1.3 ppm/K"`, `"base_alpha": "`+tc.base+`"`, 1)
			if !strings.Contains(s, `"base_alpha": "`+tc.base+`"`) {
				t.Fatal("testdata/mirror.json has no base_alpha of 1.3 ppm/K to change")
			}
			dir := t.TempDir()
			in := filepath.Join(dir, "mirror.json")
			if err := os.WriteFile(in, []byte(s), 0o644); err != nil {
				t.Fatal(err)
			}
			_, rep, errs := runCmd(t, "", "-out", filepath.Join(dir, "out"), in)
			if !strings.Contains(rep, "thermal change of +5 K") {
				t.Fatalf("no thermal section; stderr %s\n%s", errs, rep)
			}
			if !strings.Contains(rep, tc.want) || strings.Contains(rep, tc.not) {
				t.Errorf("report lacks %q or has %q:\n%s", tc.want, tc.not, rep[strings.Index(rep, "thermal change"):])
			}
		})
	}
}

// TestTensileRows: a contact in tension has no Hertz contact and no
// pressure, so its row says "open" instead of zeros and "no allowable"
// (both bodies of the mirror cell are 440C, which has an allowable on
// file), while the compressed contacts of the same case keep their
// figures.
func TestTensileRows(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	// The mirror cell's first contact unloads at about 1.3 g (its report);
	// 5 g sideways opens some contacts for certain.
	in := strings.Replace(string(src), `{"name": "on its side", "gravity": [0, "-1 g", 0]}`,
		`{"name": "on its side", "gravity": [0, "-1 g", 0]}, {"name": "thrown", "gravity": [0, 0, "-1 g"], "acceleration": ["5 g", 0, 0]}`, 1)
	if in == string(src) {
		t.Fatal("mirror.json no longer has the case \"on its side\"")
	}
	_, rep, errs := runCmd(t, in, "-out", "none", "-")
	i := strings.Index(rep, `case "thrown":`)
	if i < 0 {
		t.Fatalf("no case \"thrown\" in the report; stderr %s\n%s", errs, rep)
	}
	block := rep[i:]
	block = block[:strings.Index(block, "in tension")]
	open, closed := 0, 0
	for _, line := range strings.Split(block, "\n")[2:] {
		f := strings.Fields(line)
		if len(f) == 0 {
			continue
		}
		force, err := strconv.ParseFloat(f[1], 64)
		if err != nil {
			t.Fatalf("row %q: %v", line, err)
		}
		if force < 0 {
			open++
			if len(f) != 5 || f[2] != "open" || f[3] != "open" || f[4] != "open" {
				t.Errorf("a contact in tension: %q, want open in the a, p0 and ratio columns", line)
			}
		} else {
			closed++
			if r, err := strconv.ParseFloat(f[len(f)-1], 64); err != nil || r <= 0 {
				t.Errorf("a compressed 440C contact: %q, want a pressure ratio", line)
			}
		}
	}
	if open == 0 || closed == 0 {
		t.Errorf("%d open and %d closed contacts in\n%s", open, closed, block)
	}
	if strings.Contains(block, "no allowable") {
		t.Errorf("a 440C-on-440C case says no allowable:\n%s", block)
	}
}

// TestBudgetRows: the error budget prints a normal tolerance as the file
// wrote it (the cassette's seat half-angles: "2 arcmin", normal) beside
// its ±3σ limit, and its share is of the variance: a uniform ±a has
// σ² = a²/3 and a normal ±3σ = ±a has σ² = a²/9 (textbook variances of
// the two distributions), so share/effect² of a normal row is a third of
// that of a uniform one.
func TestBudgetRows(t *testing.T) {
	code, rep, errs := runCmd(t, "", "-out", "none", cassette)
	if code == exitBad {
		t.Fatalf("exit status %d: %s", code, errs)
	}
	if !strings.Contains(rep, "share: of the variance (σ²)") {
		t.Errorf("the budget's header does not say what share is:\n%s", rep)
	}
	row := regexp.MustCompile(`(?m)^(\S+)\s+([±σ])\s+(\S+) (µm|arcmin)\s+±\s+(\S+) (?:µm|arcmin)\s+(\S+)\s+(\S+)%$`)
	perUniform, perNormal := 0.0, 0.0
	normal := 0
	for _, m := range row.FindAllStringSubmatch(rep, -1) {
		tol, _ := strconv.ParseFloat(m[3], 64)
		lim, _ := strconv.ParseFloat(m[5], 64)
		eff, _ := strconv.ParseFloat(m[6], 64)
		share, _ := strconv.ParseFloat(m[7], 64)
		if eff < 1 { // too few digits for a ratio
			continue
		}
		if m[2] == "σ" {
			normal++
			if !strings.HasSuffix(m[1], ".Seat.HalfAngle") || tol != 2 || lim != 6 || m[4] != "arcmin" {
				t.Errorf("normal row %q: want σ 2.000 arcmin, limit ± 6.000 arcmin as cassette.json gives", m[0])
			}
			perNormal = share / (eff * eff)
		} else {
			if tol != lim {
				t.Errorf("uniform row %q: the tolerance and the limit differ", m[0])
			}
			perUniform = share / (eff * eff)
		}
	}
	if normal == 0 || perUniform == 0 {
		t.Fatalf("no normal or no uniform rows found in\n%s", rep)
	}
	if r := perNormal / perUniform; math.Abs(r-1.0/3) > 0.01 {
		t.Errorf("share per effect², normal over uniform: %.4f, want 1/3", r)
	}
}

// TestPreloadWindowErrorInFileTerms: with the mirror cell's leaf spring at
// 0 N, lying on its side leaves a contact in tension (its weight alone
// pulls it), so no preload window exists. The report says so in the
// design file's terms: the requirement's JSON path, the case by name and
// index, and the cause, a preload of 0 N, with the field to change; not
// the Go API's parameter names.
func TestPreloadWindowErrorInFileTerms(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	in := strings.Replace(string(src), `"force": "60 N"`, `"force": "0 N"`, 1)
	if in == string(src) {
		t.Fatal("mirror.json no longer has a 60 N preload")
	}
	_, rep, errs := runCmd(t, in, "-out", "none", "-")
	i := strings.Index(rep, "preload window:")
	if i < 0 {
		t.Fatalf("no preload window line; stderr %s\n%s", errs, rep)
	}
	line := rep[i : i+strings.Index(rep[i:], "\n")]
	for _, want := range []string{`case "on its side" (cases[1])`, "below requirements.min_contact_force 2 N", "the preload is 0 N (preloads[0].force)"} {
		if !strings.Contains(line, want) {
			t.Errorf("%q lacks %q", line, want)
		}
	}
	for _, bad := range []string{"minForce", "kinematic:", "does not push it closed"} {
		if strings.Contains(line, bad) {
			t.Errorf("%q uses the Go API's words %q", line, bad)
		}
	}
}

// TestUnknownDimensionListed: a design file's reader mistaking a socket
// for a vee (S.Seat.Turn on the mirror cell's trihedral socket S) is told
// the socket's dimensions, by the names the kinematic.Assembly
// documentation gives a ball and a socket (Ball.Radius, Ball.X/Y/Z,
// Seat.X/Y/Z, Seat.HalfAngle, Seat.Face1/2/3), not pointed to a Go method.
func TestUnknownDimensionListed(t *testing.T) {
	src, err := os.ReadFile("testdata/mirror.json")
	if err != nil {
		t.Fatal(err)
	}
	in := strings.Replace(string(src), `{"dimension": "V.Seat.Turn", "value": "1 mrad"}`, `{"dimension": "S.Seat.Turn", "value": "1 mrad"}`, 1)
	if in == string(src) {
		t.Fatal("mirror.json no longer tolerances V.Seat.Turn")
	}
	code, _, errs := runCmd(t, in, "-out", "none", "-")
	if code != exitBad {
		t.Fatalf("exit status %d, want %d; stderr %s", code, exitBad, errs)
	}
	want := "S.Ball.Radius, S.Ball.X, S.Ball.Y, S.Ball.Z, S.Seat.X, S.Seat.Y, S.Seat.Z, S.Seat.HalfAngle, S.Seat.Face1, S.Seat.Face2, S.Seat.Face3"
	if !strings.Contains(errs, "tolerances[3].dimension") || !strings.Contains(errs, want) || strings.Contains(errs, "Assembly.Dimensions") {
		t.Errorf("stderr %q: want tolerances[3].dimension and the list %s", errs, want)
	}
}

// TestTinyProbabilities: the random vibration tables and the
// max_random_openings verdict lines print expected openings and
// probabilities below 1e-12 as "< 1e-12", never as 5e-294.
// By Rice's formula the openings are ν₀T·exp(−m²/2) at margin m; the
// cassette's test lasts 600 s in a band that ends at 2000 Hz, so ν₀T is
// below 1.2e6 and a margin above 10 σ gives fewer than
// 1.2e6·exp(−50) = 2.3e-16 openings.
func TestTinyProbabilities(t *testing.T) {
	_, rep, _ := runCmd(t, "", "-out", "none", cassette)
	// The tables' rows and the requirement's verdict lines (the design
	// package's).
	lines := regexp.MustCompile(`(?m)^(?:  [ABC][+-] |requirements\.max_random_openings).*$`).FindAllString(rep, -1)
	for _, line := range lines {
		if m := regexp.MustCompile(`\de-(1[3-9]|[2-9]\d|\d{3})\b`).FindString(line); m != "" {
			t.Errorf("a table row prints %q, below 1e-12: %s", m, line)
		}
	}
	row := regexp.MustCompile(`(?m)^  [ABC][+-]\s+\S+\s+\S+\s+\S+\s+(\S+)\s+(< 1e-12|\S+)\s+(< 1e-12|\S+)$`)
	n := 0
	for _, m := range row.FindAllStringSubmatch(rep, -1) {
		margin, err := strconv.ParseFloat(m[1], 64)
		if err != nil || margin <= 10 {
			continue
		}
		n++
		if m[2] != "< 1e-12" || m[3] != "< 1e-12" {
			t.Errorf("margin %g σ: openings %q, P(open) %q; want < 1e-12", margin, m[2], m[3])
		}
	}
	if n == 0 {
		t.Errorf("no contact row with a margin above 10 σ in\n%s", rep)
	}
	verdict := regexp.MustCompile(`(?m)^requirements\.max_random_openings: (.*), needs at most 0\.01 \(.*margin (\S+) σ, chance of at least one ([^;]*);`)
	n = 0
	for _, m := range verdict.FindAllStringSubmatch(rep, -1) {
		if margin, err := strconv.ParseFloat(m[2], 64); err != nil || margin <= 10 {
			continue
		}
		n++
		if m[1] != "< 1e-12" || m[3] != "< 1e-12" {
			t.Errorf("verdict at margin %s σ: openings %q, chance %q; want < 1e-12", m[2], m[1], m[3])
		}
	}
	if n == 0 {
		t.Errorf("no max_random_openings verdict with a margin above 10 σ in\n%s", rep)
	}
}

// TestSearchText: the report says how the optimiser's search ended in
// plain words, never by the Go constant's name, and a search stopped at
// its budget says that it did not converge (kinematic.EvaluationLimit's
// documented meaning).
func TestSearchText(t *testing.T) {
	for _, c := range []struct {
		st   kinematic.Status
		want string
	}{
		{kinematic.Converged, "converged after 12 layouts"},
		{kinematic.Constrained, "ended on a constraint after 12 layouts"},
		{kinematic.EvaluationLimit, "stopped at its evaluation budget after 12 layouts evaluated, before the local search converged"},
	} {
		got := searchText(c.st, 12)
		if !strings.Contains(got, c.want) || strings.Contains(got, c.st.String()) {
			t.Errorf("%v: %q, want %q and not the Go name", c.st, got, c.want)
		}
	}
}

// TestVeeIncludedAngle: the report gives a vee's included angle, the
// angle between its two flanks, as twice its half-angle. From the
// geometry (kinematic.Vee, flankNormals in kinematic/seat.go): with up
// vertical and side horizontal across the groove, the flank normals are
// n± = sin h·up ∓ cos h·side, each h above the horizontal. A flank is
// perpendicular to its normal, so in the cross-section it runs along
// cos h·up ± sin h·side: h from the vertical mid-plane, one to each side
// of it. The flanks therefore open by 2h: a 30° half-angle is a 60° vee,
// 45° a 90° vee and 60° a 120° vee (the angle between the two normals is
// the supplement, 180° − 2h, which the report printed before).
func TestVeeIncludedAngle(t *testing.T) {
	for _, c := range []struct{ half, included float64 }{{30, 60}, {45, 90}, {60, 120}} {
		v := kinematic.Vee{Up: r3.Vec{Z: 1}, Direction: r3.Vec{X: 1}, HalfAngle: c.half * math.Pi / 180}
		want := fmt.Sprintf("vee, %.1f° included,", c.included)
		if got := seatText(v); !strings.Contains(got, want) {
			t.Errorf("half-angle %g°: %q, want %q", c.half, got, want)
		}
	}
}

// TestMicroscaleForces: a MEMS-scale design (testdata/mems.json, a 0.2 g
// bench on 0.25 mm balls, a 50 mN spring, at least 1 mN per contact)
// reads in significant figures, not fixed decimals that made 50 mN
// "0.1 N" and 1 mN "0.00 N". By hand (statics of the symmetric three-vee:
// six flank normals 45° from the horizontal share the vertical load
// equally): each contact carries (P + m g)/(6 sin 45°) with
// m g = 0.2e-3 kg · 9.80665 m/s² = 1.9613 mN, so at P = 50 mN it is
// 51.9613/4.24264 = 12.248 mN (0.01225 N in the table), and every
// contact reaches 1 mN from P = 4.24264 − 1.9613 = 2.281 mN up.
func TestMicroscaleForces(t *testing.T) {
	_, rep, errs := runCmd(t, "", "-out", "none", "testdata/mems.json")
	for _, want := range []string{
		"spring: 50 mN along (0.000, 0.000, -1.000)",
		"  A+          0.01225 ",
		"preload window (every contact ≥ 1 mN in every case, every p0 ≤ allowable): 2.281 mN to ",
		"; as given 50 mN\n",
		"requirements.min_contact_force: 0.01225 N, needs at least 0.001 N",
	} {
		if !strings.Contains(rep, want) {
			t.Errorf("report lacks %q; stderr %s\n%s", want, errs, rep)
		}
	}
	for _, bad := range []string{"0.1 N", "0.00 N", " 0.01 "} {
		if strings.Contains(rep, bad) {
			t.Errorf("report prints %q", bad)
		}
	}
}

// TestColumn: four significant figures with their trailing zeros, no
// exponent.
func TestColumn(t *testing.T) {
	for _, c := range []struct {
		x    float64
		want string
	}{{32.8, "32.80"}, {7.9, "7.900"}, {0.012248, "0.01225"}, {2949.9, "2950"}, {-8.944, "-8.944"}, {0, "0.000"}, {123456, "123456"}} {
		if got := column(c.x); got != c.want {
			t.Errorf("column(%g) = %q, want %q", c.x, got, c.want)
		}
	}
}
