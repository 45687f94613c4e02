package main

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/sixfold-dev/sixfold/hertz"
)

// caution is printed under every report and in the help.
const caution = `Caution: these are engineering estimates from Hertz theory, which assumes
smooth, frictionless, linear-elastic, non-conforming surfaces whose contact is
small against their radii. Verify them by test before relying on them, and
defer to the applicable codes and standards and to a qualified engineer for
any decision about a design.`

// report holds what the program prints.
type report struct {
	inputs      [][2]string // each flag and its value as read, with its unit
	b1, b2      hertz.Body
	d1, d2      string // descriptions of the bodies
	angle, load float64
	mu, q       float64
	c           hertz.Contact
	kt, slide   float64 // tangential stiffness N/m, sliding limit N
}

// num formats v with four significant figures, in fixed notation from
// 1e-3 to 1e7 and in exponent notation outside; never NaN or Inf (the
// callers pass only finite values, and a non-finite one prints as "?").
func num(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "?"
	}
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e7 {
		d := max(0, 3-int(math.Floor(math.Log10(a))))
		s := strconv.FormatFloat(v, 'f', d, 64)
		if strings.Contains(s, ".") {
			s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
		}
		return s
	}
	return strconv.FormatFloat(v, 'e', 3, 64)
}

// write prints the report.
func (r report) write(w io.Writer) error {
	var b strings.Builder
	c := r.c
	line := func(label, format string, args ...any) {
		fmt.Fprintf(&b, "  %-34s %s\n", label+":", fmt.Sprintf(format, args...))
	}
	b.WriteString("Hertz contact\n=============\n")
	b.WriteString("Inputs, as read\n")
	for _, in := range r.inputs {
		fmt.Fprintf(&b, "  %-14s %s\n", in[0], in[1])
	}
	b.WriteString("\n")
	fmt.Fprintf(&b, "First body:  %s\n", r.d1)
	fmt.Fprintf(&b, "Second body: %s\n", r.d2)
	fmt.Fprintf(&b, "Angle between principal planes: %s °\n", num(r.angle*180/math.Pi))
	fmt.Fprintf(&b, "Normal load: %s N\n\n", num(r.load))

	b.WriteString("Contact\n")
	line("effective modulus E*", "%s GPa", num(c.EStar/1e9))
	line("effective shear modulus G*", "%s GPa", num(c.GStar/1e9))
	line("half relative curvatures A, B", "%s 1/m, %s 1/m", num(c.A), num(c.B))
	line("semi-major axis a", "%s mm", num(c.SemiMajor*1e3))
	line("semi-minor axis b", "%s mm", num(c.SemiMinor*1e3))
	if c.B-c.A <= 1e-12*c.B {
		line("major axis", "none: the contact is a circle")
	} else {
		line("major axis", "%s ° from the first body's principal plane", num(c.MajorAngle*180/math.Pi))
	}
	line("peak pressure p0", "%s MPa", num(c.PeakPressure/1e6))
	line("mean pressure", "%s MPa", num(c.MeanPressure/1e6))
	line("approach δ", "%s µm", num(c.Approach*1e6))
	line("normal stiffness dF/dδ", "%s N/µm", num(c.Stiffness*1e-6))
	line("tangential stiffness (Mindlin)", "%s N/µm at a tangential load of %s N, μ = %s", num(r.kt*1e-6), num(r.q), num(r.mu))
	line("sliding limit μN", "%s N", num(r.slide))

	b.WriteString("\nBelow the surface, on the load axis\n")
	names := [2]string{"first body", "second body"}
	for i, s := range c.Stress {
		line(names[i], "max shear %s MPa at %s mm deep; max von Mises %s MPa at %s mm deep",
			num(s.MaxShear/1e6), num(s.MaxShearDepth*1e3), num(s.MaxVonMises/1e6), num(s.MaxVonMisesDepth*1e3))
	}

	b.WriteString("\nAllowable peak pressure\n")
	var sources []string
	for i, m := range []hertz.Material{r.b1.Material, r.b2.Material} {
		if m.Allowable <= 0 {
			line(names[i], "no allowable on file for %s", m.Name)
			continue
		}
		margin := 100 * (m.Allowable - c.PeakPressure) / m.Allowable
		verdict := "within"
		if margin < 0 {
			verdict = "EXCEEDS"
		}
		fAllow, err := hertz.LoadForPressure(r.b1, r.b2, m.Allowable)
		if err != nil {
			return &FlagError{fmt.Sprintf("-material%d", i+1), err}
		}
		line(names[i], "%s MPa; p0 %s it, margin %s %% (p0 is %s %% of it); it is reached at a load of %s N",
			num(m.Allowable/1e6), verdict, num(margin), num(100*c.PeakPressure/m.Allowable), num(fAllow))
		sources = append(sources, fmt.Sprintf("    source: %s: %s\n", m.Name, m.Source))
	}
	for _, s := range sources {
		b.WriteString(s)
	}

	minR := math.Inf(1)
	for _, body := range []hertz.Body{r.b1, r.b2} {
		for _, x := range []float64{body.R1, body.R2} {
			if !math.IsInf(x, 0) {
				minR = math.Min(minR, math.Abs(x))
			}
		}
	}
	valid := "holds"
	if !c.Valid {
		valid = "DOES NOT HOLD: the contact is too large for Hertz theory; treat the results as rough"
	}
	fmt.Fprintf(&b, "\nHalf-space assumption (Valid), a at most 10 %% of the smallest radius: %s\n", valid)
	line("a / smallest radius", "%s %% (smallest radius %s mm)", num(100*c.SemiMajor/minR), num(minR*1e3))
	b.WriteString("\n" + caution + "\n")
	_, err := io.WriteString(w, b.String())
	return err
}
