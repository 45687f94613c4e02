package design

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// A quantity in a design file is a plain JSON number, in the SI unit of
// its field, or a string holding a number and a unit ("12.7 mm"). The
// units each kind of field accepts are listed in doc.go; this file holds
// the table. Conversion happens here, at the edge: a Design holds SI
// values only.

// unit is one accepted spelling of a unit: a value in it is
// mantissa·10^pow10·factor in the SI unit. Decimal multiples (factor 1)
// are converted by shifting the decimal exponent of the number as
// written, so "12.7 mm" reads as the float64 nearest to 0.0127, the same
// as the plain number 0.0127.
type unit struct {
	name   string
	pow10  int
	factor float64 // 0 means 1
}

// quantityKind is what a field measures: its SI unit and the units it
// accepts.
type quantityKind struct {
	what  string // "a length"
	si    string // "m"
	units []unit
	hints []string // the units a bare number most likely meant, for messages
}

// suggest returns the number num written with the kind's likely units,
// for a message about a bare number: "\"45 deg\" or \"45 rad\"".
func (k *quantityKind) suggest(num string) string {
	hints := k.hints
	if len(hints) == 0 {
		hints = []string{k.si}
	}
	q := make([]string, len(hints))
	for i, h := range hints {
		q[i] = strconv.Quote(num + " " + h)
	}
	return strings.Join(q, " or ")
}

// deg, arcmin and arcsec are in radians: the SI Brochure, 9th ed. (2019),
// Table 8, defines 1° = (π/180) rad, 1′ = (1/60)°, 1″ = (1/60)′.
const (
	radPerDeg    = math.Pi / 180
	radPerArcmin = math.Pi / (180 * 60)
	radPerArcsec = math.Pi / (180 * 3600)
)

// The kinds of quantity. Prefixes are those of the SI Brochure, 9th ed.
// (2019), Table 7: c 10⁻², m 10⁻³, µ 10⁻⁶ (written u, µ U+00B5 or
// μ U+03BC), n 10⁻⁹, k 10³, M 10⁶, G 10⁹.
var (
	length = &quantityKind{what: "a length", si: "m", hints: []string{"mm", "m"}, units: []unit{
		{name: "m"}, {name: "cm", pow10: -2}, {name: "mm", pow10: -3},
		{name: "um", pow10: -6}, {name: "µm", pow10: -6}, {name: "μm", pow10: -6},
		{name: "nm", pow10: -9},
	}}
	angle = &quantityKind{what: "an angle", si: "rad", hints: []string{"deg", "rad"}, units: []unit{
		{name: "rad"}, {name: "mrad", pow10: -3},
		{name: "urad", pow10: -6}, {name: "µrad", pow10: -6}, {name: "μrad", pow10: -6},
		{name: "deg", factor: radPerDeg}, {name: "°", factor: radPerDeg},
		{name: "arcmin", factor: radPerArcmin}, {name: "arcsec", factor: radPerArcsec},
	}}
	force = &quantityKind{what: "a force", si: "N", hints: []string{"N"}, units: []unit{
		{name: "N"}, {name: "mN", pow10: -3}, {name: "kN", pow10: 3},
	}}
	rate = &quantityKind{what: "a spring rate", si: "N/m", hints: []string{"N/mm", "N/m"}, units: []unit{
		{name: "N/m"}, {name: "kN/m", pow10: 3}, {name: "N/mm", pow10: 3},
		{name: "kN/mm", pow10: 6}, {name: "N/um", pow10: 6}, {name: "N/µm", pow10: 6}, {name: "N/μm", pow10: 6},
	}}
	moment = &quantityKind{what: "a moment", si: "N m", hints: []string{"N mm", "N m"}, units: []unit{
		{name: "N m"}, {name: "N mm", pow10: -3}, {name: "kN m", pow10: 3},
	}}
	pressure = &quantityKind{what: "a pressure or modulus", si: "Pa", hints: []string{"MPa", "GPa"}, units: []unit{
		{name: "Pa"}, {name: "kPa", pow10: 3}, {name: "MPa", pow10: 6}, {name: "GPa", pow10: 9},
	}}
	mass = &quantityKind{what: "a mass", si: "kg", hints: []string{"g", "kg"}, units: []unit{
		{name: "kg"}, {name: "g", pow10: -3}, {name: "mg", pow10: -6},
	}}
	inertia = &quantityKind{what: "a moment of inertia", si: "kg m^2", hints: []string{"kg mm^2", "kg m^2"}, units: []unit{
		{name: "kg m^2"}, {name: "kg cm^2", pow10: -4}, {name: "kg mm^2", pow10: -6},
		{name: "g cm^2", pow10: -7}, {name: "g mm^2", pow10: -9},
	}}
	// The standard acceleration of free fall, g = 9.80665 m/s² exactly,
	// was declared by the 3rd CGPM (1901); kinematic.StandardGravity.
	acceleration = &quantityKind{what: "an acceleration", si: "m/s^2", hints: []string{"g", "m/s^2"}, units: []unit{
		{name: "m/s^2"}, {name: "mm/s^2", pow10: -3}, {name: "g", factor: kinematic.StandardGravity},
	}}
	temperature = &quantityKind{what: "a temperature difference", si: "K", hints: []string{"K"}, units: []unit{
		{name: "K"}, {name: "mK", pow10: -3},
	}}
	// ppm/K is 10⁻⁶/K; the SI Brochure (9th ed., §5.4.7) advises against
	// "ppm", but data sheets give expansion coefficients in it.
	expansion = &quantityKind{what: "an expansion coefficient", si: "1/K", hints: []string{"ppm/K", "1/K"}, units: []unit{
		{name: "1/K"}, {name: "/K"}, {name: "ppm/K", pow10: -6},
	}}
	frequency = &quantityKind{what: "a frequency", si: "Hz", hints: []string{"Hz"}, units: []unit{
		{name: "Hz"}, {name: "kHz", pow10: 3},
	}}
)

// unitNames returns the kind's unit spellings, for messages.
func (k *quantityKind) unitNames() string {
	names := make([]string, len(k.units))
	for i, u := range k.units {
		names[i] = u.name
	}
	return strings.Join(names, ", ")
}

// maxExponent bounds the decimal exponent of a number in a quantity
// string: far beyond float64's range (about 1e±308, 1e-324 subnormal),
// small enough that the arithmetic on it cannot overflow an int.
const maxExponent = 10000

// parseQuantity returns the SI value of the quantity string s ("12.7 mm")
// of kind k. It returns an error wrapping ErrUnit for a string it cannot
// read or a unit that is not one of k's, and ErrNonFinite for a value
// beyond float64.
func parseQuantity(s string, k *quantityKind) (float64, error) {
	mant, exp, rest, ok := scanNumber(s)
	if !ok {
		u := exampleUnit(k)
		return 0, fmt.Errorf("%w: %q does not start with a number (write, for example, \"12.7 %s\", which is %.6g %s)", ErrUnit, s, u.name, u.si(12.7), k.si)
	}
	name := normaliseUnit(rest)
	if name == "" {
		return 0, fmt.Errorf("%w: %q has no unit; a string needs one (%s), or write a plain number in %s", ErrUnit, s, k.unitNames(), k.si)
	}
	var u *unit
	for i := range k.units {
		if k.units[i].name == name {
			u = &k.units[i]
			break
		}
	}
	if u == nil {
		return 0, fmt.Errorf("%w: %q: %q is not %s unit (accepted: %s)", ErrUnit, s, strings.TrimSpace(rest), k.what, k.unitNames())
	}
	if exp+u.pow10 > maxExponent || exp+u.pow10 < -maxExponent {
		return 0, fmt.Errorf("%w: %q is beyond float64", ErrNonFinite, s)
	}
	// A syntax error cannot happen (scanNumber checked the syntax); a
	// range error comes back as ±Inf, rejected below.
	v, _ := strconv.ParseFloat(mant+"e"+strconv.Itoa(exp+u.pow10), 64)
	if u.factor != 0 {
		v *= u.factor
	}
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("%w: %q is beyond float64", ErrNonFinite, s)
	}
	return v, nil
}

// exampleUnit returns a typical unit of the kind, for messages.
func exampleUnit(k *quantityKind) unit {
	for _, u := range k.units {
		if len(k.hints) > 0 && u.name == normaliseUnit(k.hints[0]) {
			return u
		}
	}
	if len(k.units) > 2 {
		return k.units[2]
	}
	return k.units[0]
}

// si returns the value v of the unit in SI units (for messages).
func (u unit) si(v float64) float64 {
	f := u.factor
	if f == 0 {
		f = 1
	}
	v *= f
	// Scale by the power of ten through a decimal string, so that 12.7 mm
	// prints as 0.0127 m and not 0.012700000000000001 m.
	x, _ := strconv.ParseFloat(fmt.Sprintf("%se%d", strconv.FormatFloat(v, 'g', -1, 64), u.pow10), 64)
	return x
}

// scanNumber splits s into the number it starts with, written as a JSON
// number (-?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?), and the rest.
// It returns the number without its exponent (mant), the exponent, and
// whether s starts with a number at all.
func scanNumber(s string) (mant string, exp int, rest string, ok bool) {
	s = strings.TrimLeft(s, " \t")
	i := 0
	if i < len(s) && s[i] == '-' {
		i++
	}
	switch {
	case i < len(s) && s[i] == '0':
		i++
	case i < len(s) && s[i] >= '1' && s[i] <= '9':
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
		}
	default:
		return "", 0, "", false
	}
	if i < len(s) && s[i] == '.' {
		j := i + 1
		for j < len(s) && s[j] >= '0' && s[j] <= '9' {
			j++
		}
		if j == i+1 {
			return "", 0, "", false
		}
		i = j
	}
	mant = s[:i]
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			digits := s[j:k]
			if len(digits) > 6 {
				// Far beyond any float64; keep the sign of the exponent.
				exp = maxExponent + 1
			} else {
				exp, _ = strconv.Atoi(digits)
			}
			if s[i+1] == '-' {
				exp = -exp
			}
			i = k
		}
		// "5 e" or "2em" is a number followed by a unit that starts
		// with e; the unit lookup rejects it.
	}
	return mant, exp, s[i:], true
}

// normaliseUnit returns the unit text u with its spacing made canonical:
// surrounding space trimmed, runs of spaces and the product signs "·"
// (U+00B7), "⋅" (U+22C5) and "*" made one space, and "²" written "^2".
func normaliseUnit(u string) string {
	return strings.Join(strings.Fields(unitSigns.Replace(u)), " ")
}

var unitSigns = strings.NewReplacer("·", " ", "⋅", " ", "*", " ", "²", "^2")
