package main

import (
	"strconv"
	"strings"
	"testing"
)

// FuzzRun feeds arbitrary flag values to the program: it must either
// return an error or print a report with no NaN or Inf and a unit after
// every number.
func FuzzRun(f *testing.F) {
	f.Add("sphere", "5mm", "", "groove", "5.2mm", "", "30deg", "50N", "0")
	f.Add("toroid", "20mm", "-6mm", "sphere", "5 mm", "", "0.3rad", "1kN", "1 N")
	f.Add("sphere", "5", "", "groove", "5.2", "", "30", "50", "1") // bare numbers: refused
	f.Add("cylinder", "0.003", "", "cylinder", "4mm", "", "90deg", "1e-9", "0")
	f.Add("socket", "5mm", "", "sphere", "4.99mm", "", "0", "1e6", "0")
	f.Fuzz(func(t *testing.T, s1, r1, r1b, s2, r2, r2b, angle, load, q string) {
		args := []string{"-shape1", s1, "-shape2", s2, "-angle", angle, "-load", load, "-tangential", q}
		for _, kv := range [][2]string{{"-radius1", r1}, {"-radius1b", r1b}, {"-radius2", r2}, {"-radius2b", r2b}} {
			if kv[1] != "" {
				args = append(args, kv[0], kv[1])
			}
		}
		var b strings.Builder
		if err := run(args, &b); err != nil {
			return
		}
		if ps := problems(b.String()); len(ps) != 0 {
			t.Fatalf("run(%q): %q\n%s", args, ps, b.String())
		}
	})
}

// FuzzRunNumbers drives the program with numbers rather than text, so the
// fuzzer reaches the solver: every shape pair, any radii, angle and load.
func FuzzRunNumbers(f *testing.F) {
	f.Add(uint8(0), 5e-3, 0.0, uint8(4), 5.2e-3, 0.0, 30.0, 50.0)
	f.Add(uint8(5), 0.02, -0.006, uint8(0), 0.005, 0.0, 10.0, 1e3)
	f.Add(uint8(2), 3e-3, 0.0, uint8(2), 3e-3, 0.0, 89.999, 1e-6)
	f.Add(uint8(0), 5e-3, 0.0, uint8(3), 5.0000001e-3, 0.0, 0.0, 1e4)
	f.Fuzz(func(t *testing.T, s1 uint8, r1, r1b float64, s2 uint8, r2, r2b, angle, load float64) {
		g := func(v float64, unit string) string { return strconv.FormatFloat(v, 'g', -1, 64) + " " + unit }
		args := []string{"-shape1", shapes[int(s1)%len(shapes)].name, "-shape2", shapes[int(s2)%len(shapes)].name, "-angle", g(angle, "deg"), "-load", g(load, "N")}
		if shapes[int(s1)%len(shapes)].name != "flat" {
			args = append(args, "-radius1", g(r1, "m"))
		}
		if shapes[int(s1)%len(shapes)].name == "toroid" {
			args = append(args, "-radius1b", g(r1b, "m"))
		}
		if shapes[int(s2)%len(shapes)].name != "flat" {
			args = append(args, "-radius2", g(r2, "m"))
		}
		if shapes[int(s2)%len(shapes)].name == "toroid" {
			args = append(args, "-radius2b", g(r2b, "m"))
		}
		var b strings.Builder
		if err := run(args, &b); err != nil {
			return
		}
		if ps := problems(b.String()); len(ps) != 0 {
			t.Fatalf("run(%q): %q\n%s", args, ps, b.String())
		}
	})
}
