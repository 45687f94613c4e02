package design

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
	"github.com/sixfold-dev/sixfold/screw"
)

// Bounds on the counts of a design, so that a hostile file cannot make
// the reader or an evaluation allocate without limit.
const (
	maxBalls      = 64
	maxPreloads   = 64
	maxCases      = 256
	maxApplied    = 64
	maxTolerances = 10_000
	maxSamples    = 10_000_000 // kinematic.StudyOptions.Samples' own bound
	maxName       = 64         // bytes of a name
	maxText       = 4096       // bytes of a description or a material's source
)

// Read returns the design in the file read from r, checked as by
// [Design.Validate]. It reads at most [MaxSize] bytes; a longer input is
// an error wrapping [ErrTooLarge]. Every error is an [*Error] naming the
// JSON path of the entry at fault.
func Read(r io.Reader) (*Design, error) {
	b, err := io.ReadAll(io.LimitReader(r, MaxSize+1))
	if err != nil {
		return nil, &Error{Err: err}
	}
	if len(b) > MaxSize {
		return nil, errorf("", ErrTooLarge, "the file is longer than %d bytes (%d MiB), the most that is read", MaxSize, MaxSize>>20)
	}
	return Parse(b)
}

// Parse returns the design in the file b, checked as by
// [Design.Validate]. b must hold at most [MaxSize] bytes. Every error is
// an [*Error] naming the JSON path of the entry at fault.
func Parse(b []byte) (*Design, error) {
	root, err := parseTree(b)
	if err != nil {
		return nil, err
	}
	d, err := walk(root)
	if err != nil {
		return nil, err
	}
	if err := d.Validate(); err != nil {
		return nil, err
	}
	return d, nil
}

// fields checks that n is an object whose members are all among allowed;
// what names the object in messages ("a ball").
func fields(n *node, path, what string, allowed ...string) error {
	if n.kind != objectNode {
		return errorf(path, ErrType, "%s is an object, got %s", what, n.kind)
	}
next:
	for _, k := range n.keys {
		for _, a := range allowed {
			if k == a {
				continue next
			}
		}
		return errorf(join(path, k), ErrUnknownField, "%s has the fields %s", what, strings.Join(allowed, ", "))
	}
	return nil
}

// number returns the value of a plain JSON number.
func number(n *node, path string) (float64, error) {
	if n.kind != numberNode {
		return 0, errorf(path, ErrType, "must be a plain number, got %s", n.kind)
	}
	return literal(n.text, path)
}

// literal returns the value of a JSON number literal.
func literal(s, path string) (float64, error) {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsInf(v, 0) {
		return 0, errorf(path, ErrNonFinite, "%s is beyond float64", s)
	}
	return v, nil
}

// quantity returns the SI value of a quantity: a plain number in k's SI
// unit, or a string with a unit.
func (r *reader) quantity(n *node, path string, k *quantityKind) (float64, error) {
	switch n.kind {
	case numberNode:
		v, err := literal(n.text, path)
		if err != nil || v == 0 || r.plainSI {
			return v, err
		}
		return 0, errorf(path, ErrUnit, "%s has no unit: write %s, or declare \"units\": \"si\" at the top of the file to read plain numbers in SI units (%s)",
			n.text, k.suggest(n.text), k.si)
	case stringNode:
		v, err := parseQuantity(n.text, k)
		if err != nil {
			return 0, &Error{Path: path, Err: err}
		}
		return v, nil
	}
	return 0, errorf(path, ErrType, "must be %s: a number in %s or a string such as \"12.7 %s\", got %s", k.what, k.si, exampleUnit(k).name, n.kind)
}

// vector returns a vector of three quantities of kind k, or of three
// plain numbers when k is nil (a direction).
func (r *reader) vector(n *node, path string, k *quantityKind) (r3.Vec, error) {
	if n.kind != arrayNode || len(n.vals) != 3 {
		what := "three numbers"
		if k != nil {
			what = "three quantities (" + k.what + " each)"
		}
		got := n.kind.String()
		if n.kind == arrayNode {
			got = fmt.Sprintf("%d entries", len(n.vals))
		}
		return r3.Vec{}, errorf(path, ErrType, "must be an array of %s [x, y, z], got %s", what, got)
	}
	var c [3]float64
	for i, e := range n.vals {
		var err error
		if k == nil {
			c[i], err = number(e, index(path, i))
		} else {
			c[i], err = r.quantity(e, index(path, i), k)
		}
		if err != nil {
			return r3.Vec{}, err
		}
	}
	return r3.Vec{X: c[0], Y: c[1], Z: c[2]}, nil
}

// text returns a string of at most max bytes.
func text(n *node, path string, max int) (string, error) {
	if n.kind != stringNode {
		return "", errorf(path, ErrType, "must be a string, got %s", n.kind)
	}
	if len(n.text) > max {
		return "", errorf(path, ErrTooLarge, "%d bytes; at most %d", len(n.text), max)
	}
	return n.text, nil
}

// boolean returns a JSON boolean.
func boolean(n *node, path string) (bool, error) {
	if n.kind != boolNode {
		return false, errorf(path, ErrType, "must be true or false, got %s", n.kind)
	}
	return n.b, nil
}

// list returns the elements of an array of at most max entries.
func list(n *node, path string, max int) ([]*node, error) {
	if n.kind != arrayNode {
		return nil, errorf(path, ErrType, "must be an array, got %s", n.kind)
	}
	if len(n.vals) > max {
		return nil, errorf(path, ErrTooLarge, "%d entries; at most %d", len(n.vals), max)
	}
	return n.vals, nil
}

// The optional-member helpers leave *dst alone when the member is absent.

func (r *reader) optQuantity(o *node, path, key string, k *quantityKind, dst *float64) error {
	if n := o.get(key); n != nil {
		v, err := r.quantity(n, join(path, key), k)
		*dst = v
		return err
	}
	return nil
}

func (r *reader) reqQuantity(o *node, path, key string, k *quantityKind, dst *float64) error {
	if o.get(key) == nil {
		return errorf(join(path, key), ErrMissing, "%s in %s", k.what, k.si)
	}
	return r.optQuantity(o, path, key, k, dst)
}

// radiansAsDegrees refuses a half-angle v, rad, that the file wrote in
// degrees ("deg" or "°") with a number of at most π/2: radians given the
// unit of degrees ("0.785 deg" for π/4 rad). A half-angle that small (at
// most 1.57°) leans the contact normals almost into the plane normal to
// Up: the walls of a slot, not a seat that carries the part; seats lean
// 30° to 60° (common practice). The message gives the radian reading only
// up to 1.2 (69°), where it is a usual half-angle. Only half-angles: a
// tilt or an azimuth of 1° is legitimate.
func radiansAsDegrees(n *node, path string, v float64) error {
	if n == nil || n.kind != stringNode {
		return nil
	}
	_, _, rest, ok := scanNumber(n.text)
	if u := normaliseUnit(rest); !ok || (u != "deg" && u != "°") {
		return nil
	}
	deg := v / radPerDeg
	if !(deg > 0 && deg <= math.Pi/2) {
		return nil
	}
	// The radian reading is offered only where it is a usual half-angle
	// (at most 1.2 rad, 69°): at 1.57 it would be 90°, which the field
	// refuses too.
	hint := ""
	if deg <= 1.2 {
		hint = fmt.Sprintf(": if that is radians, it is %.3g deg;", deg*180/math.Pi)
	} else {
		hint = ":"
	}
	return errorf(path, ErrRange, "%s%s a half-angle of %.3g° leans the contact normals within %.3g° of horizontal, the walls of a slot rather than a seat (vee and cone half-angles are usually 30 to 60 deg)",
		n.text, hint, deg, deg)
}

func (r *reader) optVector(o *node, path, key string, k *quantityKind, dst *r3.Vec) error {
	if n := o.get(key); n != nil {
		v, err := r.vector(n, join(path, key), k)
		*dst = v
		return err
	}
	return nil
}

// optDirection reads the optional direction key of o: three plain
// numbers, not all zero (a zero direction given in the file is a slip;
// leaving the member out gives its default).
func optDirection(o *node, path, key string, dst *r3.Vec) error {
	n := o.get(key)
	if n == nil {
		return nil
	}
	p := join(path, key)
	v, err := (&reader{}).vector(n, p, nil)
	if err != nil {
		return err
	}
	if v == zeroVec {
		return errorf(p, ErrDegenerate, "a zero vector is no direction; give a direction of any length, or leave %s out", key)
	}
	*dst = v
	return nil
}

func optNumber(o *node, path, key string, dst *float64) error {
	if n := o.get(key); n != nil {
		v, err := number(n, join(path, key))
		*dst = v
		return err
	}
	return nil
}

func optText(o *node, path, key string, max int, dst *string) error {
	if n := o.get(key); n != nil {
		v, err := text(n, join(path, key), max)
		*dst = v
		return err
	}
	return nil
}

// positive returns an error unless v, a requirement's limit as given in
// the file, is > 0 (a zero limit would mean "not set" in a Design).
func positive(v float64, path string) error {
	if !(v > 0) {
		return errorf(path, ErrRange, "a limit must be > 0, got %g; leave the requirement out to not check it", v)
	}
	return nil
}

// reader reads one design file's tree.
type reader struct {
	// plainSI reports whether a plain JSON number for a dimensioned
	// quantity is read in its SI unit: always in format version 1, and
	// in version 2 when the file declares "units": "si". Otherwise only
	// a plain 0 is (it is zero in every unit).
	plainSI bool
}

// topFields are the members of a design file, in the documented order.
var topFields = []string{"format", "units", "name", "description", "balls", "seats",
	"preloads", "payload", "cases", "tolerances", "point_of_interest", "point_name", "axis",
	"thermal", "friction", "monte_carlo", "vibration", "cycles", "packaging", "optimize", "requirements"}

// walk returns the design in the tree, reading it member by member in
// the documented order.
func walk(root *node) (*Design, error) {
	r, err := header(root)
	if err != nil {
		return nil, err
	}
	d := &Design{}
	for _, step := range []func(*node, *Design) error{
		r.readTexts, r.readCoupling, r.readLoads, r.readTolerances, r.readPoint,
		r.readEnvironment, r.readVibration, r.readCycles, r.readStudy, r.readRequirementsOf,
	} {
		if err := step(root, d); err != nil {
			return nil, err
		}
	}
	return d, nil
}

// header checks the root, the format and the units declaration, and
// returns the reader for the file's version.
func header(root *node) (*reader, error) {
	if root.kind != objectNode {
		return nil, errorf("", ErrType, "a design file is a JSON object, got %s", root.kind)
	}
	f := root.get("format")
	if f == nil {
		return nil, errorf("format", ErrMissing, "a design file names its format: \"format\": %q", Format)
	}
	if f.kind != stringNode {
		return nil, errorf("format", ErrType, "must be a string such as %q, got %s", Format, f.kind)
	}
	r := &reader{}
	switch f.text {
	case Format:
	case formatV1:
		r.plainSI = true
	default:
		return nil, errorf("format", ErrVersion, "%q; this package reads %q and %q", f.text, Format, formatV1)
	}
	if err := fields(root, "", "a design", topFields...); err != nil {
		return nil, err
	}
	if u := root.get("units"); u != nil {
		if u.kind != stringNode {
			return nil, errorf("units", ErrType, "must be the string \"si\", got %s", u.kind)
		}
		if u.text != "si" {
			return nil, errorf("units", ErrRange, "%q; the only declaration is \"si\" (plain numbers in SI units: m, rad, N, Pa, kg, ...); "+
				"for other units write each quantity with its unit, such as \"6.35 mm\"", u.text)
		}
		r.plainSI = true
	}
	return r, nil
}

// readTexts reads the name and the description.
func (r *reader) readTexts(root *node, d *Design) error {
	if err := optText(root, "", "name", maxText, &d.Name); err != nil {
		return err
	}
	return optText(root, "", "description", maxText, &d.Description)
}

// readCoupling reads the balls and their seats.
func (r *reader) readCoupling(root *node, d *Design) error {
	bs := root.get("balls")
	if bs == nil {
		return errorf("balls", ErrMissing, "a design needs its balls")
	}
	elems, err := list(bs, "balls", maxBalls)
	if err != nil {
		return err
	}
	for i, n := range elems {
		b, err := r.readBall(n, index("balls", i))
		if err != nil {
			return err
		}
		d.Balls = append(d.Balls, b)
	}
	ss := root.get("seats")
	if ss == nil {
		return errorf("seats", ErrMissing, "a design needs a seat for every ball")
	}
	if elems, err = list(ss, "seats", maxBalls); err != nil {
		return err
	}
	for i, n := range elems {
		s, err := r.readSeat(n, index("seats", i))
		if err != nil {
			return err
		}
		d.Seats = append(d.Seats, s)
	}
	return nil
}

// readLoads reads the preloads, the payload and the load cases.
func (r *reader) readLoads(root *node, d *Design) error {
	if n := root.get("preloads"); n != nil {
		elems, err := list(n, "preloads", maxPreloads)
		if err != nil {
			return err
		}
		for i, n := range elems {
			p, err := r.readPreload(n, index("preloads", i))
			if err != nil {
				return err
			}
			d.Preloads = append(d.Preloads, p)
		}
	}
	if n := root.get("payload"); n != nil {
		var err error
		if d.Payload, err = r.readPayload(n, "payload"); err != nil {
			return err
		}
	}
	if n := root.get("cases"); n != nil {
		elems, err := list(n, "cases", maxCases)
		if err != nil {
			return err
		}
		for i, n := range elems {
			c, err := r.readCase(n, index("cases", i))
			if err != nil {
				return err
			}
			d.Cases = append(d.Cases, c)
		}
	}
	return nil
}

// readTolerances reads the tolerances.
func (r *reader) readTolerances(root *node, d *Design) error {
	n := root.get("tolerances")
	if n == nil {
		return nil
	}
	elems, err := list(n, "tolerances", maxTolerances)
	if err != nil {
		return err
	}
	if len(elems) > 0 {
		d.Tolerances = make([]kinematic.Tolerance, 0, len(elems))
	}
	for i, n := range elems {
		t, err := r.readTolerance(n, index("tolerances", i))
		if err != nil {
			return err
		}
		d.Tolerances = append(d.Tolerances, t)
	}
	return nil
}

// readPoint reads the point of interest and its axis.
func (r *reader) readPoint(root *node, d *Design) error {
	if err := r.optVector(root, "", "point_of_interest", length, &d.Point); err != nil {
		return err
	}
	return optDirection(root, "", "axis", &d.Axis)
}

// readEnvironment reads the thermal change, the friction and the Monte
// Carlo study.
func (r *reader) readEnvironment(root *node, d *Design) error {
	var err error
	if n := root.get("thermal"); n != nil {
		if d.Thermal, err = r.readThermal(n, "thermal"); err != nil {
			return err
		}
	}
	if n := root.get("friction"); n != nil {
		if err := fields(n, "friction", "friction", "mu"); err != nil {
			return err
		}
		d.Friction = &Friction{}
		m := n.get("mu")
		if m == nil {
			return errorf("friction.mu", ErrMissing, "the coefficient of friction, a plain number")
		}
		if d.Friction.Mu, err = number(m, "friction.mu"); err != nil {
			return err
		}
	}
	if n := root.get("monte_carlo"); n != nil {
		if d.MonteCarlo, err = readMonteCarlo(n, "monte_carlo"); err != nil {
			return err
		}
	}
	return nil
}

// readRequirementsOf reads the requirements.
func (r *reader) readRequirementsOf(root *node, d *Design) error {
	n := root.get("requirements")
	if n == nil {
		return nil
	}
	var err error
	d.Requirements, err = r.readRequirements(n, "requirements")
	return err
}

func (r *reader) readBall(n *node, path string) (Ball, error) {
	var b Ball
	if err := fields(n, path, "a ball", "name", "centre", "radius", "material", "canoe"); err != nil {
		return b, err
	}
	if err := optText(n, path, "name", maxName, &b.Name); err != nil {
		return b, err
	}
	if n.get("centre") == nil {
		return b, errorf(join(path, "centre"), ErrMissing, "the ball's centre [x, y, z], lengths")
	}
	if err := r.optVector(n, path, "centre", length, &b.Centre); err != nil {
		return b, err
	}
	if err := r.reqQuantity(n, path, "radius", length, &b.Radius); err != nil {
		return b, err
	}
	var err error
	if c := n.get("canoe"); c != nil {
		if b.Canoe, err = boolean(c, join(path, "canoe")); err != nil {
			return b, err
		}
	}
	b.Material, err = r.readMaterialOf(n, path)
	return b, err
}

// readMaterialOf reads the required member "material" of n.
func (r *reader) readMaterialOf(n *node, path string) (hertz.Material, error) {
	m := n.get("material")
	path = join(path, "material")
	if m == nil {
		return hertz.Material{}, errorf(path, ErrMissing, "a material key (%s) or an object {\"e\", \"nu\", ...}", keyList())
	}
	switch m.kind {
	case stringNode:
		mat, ok := lookupMaterial(m.text)
		if !ok {
			return hertz.Material{}, errorf(path, ErrRange, "no material %q in the table (%s); give other materials inline", m.text, keyList())
		}
		return mat, nil
	case objectNode:
		var mat hertz.Material
		if err := fields(m, path, "a material", "name", "e", "nu", "alpha", "allowable", "source"); err != nil {
			return mat, err
		}
		if err := optText(m, path, "name", maxText, &mat.Name); err != nil {
			return mat, err
		}
		if err := r.reqQuantity(m, path, "e", pressure, &mat.E); err != nil {
			return mat, err
		}
		if m.get("nu") == nil {
			return mat, errorf(join(path, "nu"), ErrMissing, "Poisson's ratio, a plain number")
		}
		if err := optNumber(m, path, "nu", &mat.Nu); err != nil {
			return mat, err
		}
		if err := r.optQuantity(m, path, "alpha", expansion, &mat.Alpha); err != nil {
			return mat, err
		}
		if err := r.optQuantity(m, path, "allowable", pressure, &mat.Allowable); err != nil {
			return mat, err
		}
		if err := optText(m, path, "source", maxText, &mat.Source); err != nil {
			return mat, err
		}
		return mat, nil
	}
	return hertz.Material{}, errorf(path, ErrType, "must be a material key (a string) or an object, got %s", m.kind)
}

// seatFields lists the members of each seat type.
var seatFields = map[SeatType][]string{
	Vee:       {"type", "up", "material", "half_angle", "flank_radius", "direction", "azimuth", "reference"},
	Rods:      {"type", "up", "material", "half_angle", "rod_radius", "direction", "azimuth", "reference"},
	Flat:      {"type", "up", "material"},
	Trihedral: {"type", "up", "material", "half_angle", "toward"},
	Cone:      {"type", "up", "material", "half_angle", "toward"},
}

func (r *reader) readSeat(n *node, path string) (Seat, error) {
	s := Seat{Up: r3.Vec{Z: 1}}
	if n.kind != objectNode {
		return s, errorf(path, ErrType, "a seat is an object, got %s", n.kind)
	}
	tn := n.get("type")
	if tn == nil {
		return s, errorf(join(path, "type"), ErrMissing, "one of \"vee\", \"rods\", \"flat\", \"trihedral\", \"cone\"")
	}
	tv, err := text(tn, join(path, "type"), maxName)
	if err != nil {
		return s, err
	}
	for t, name := range seatTypeNames {
		if name != "" && name == tv {
			s.Type = SeatType(t)
		}
	}
	if s.Type == 0 {
		return s, errorf(join(path, "type"), ErrRange, "%q; must be one of \"vee\", \"rods\", \"flat\", \"trihedral\", \"cone\"", tv)
	}
	if err := fields(n, path, "a "+tv+" seat", seatFields[s.Type]...); err != nil {
		return s, err
	}
	if err := optDirection(n, path, "up", &s.Up); err != nil {
		return s, err
	}
	if s.Type != Flat {
		if err := r.reqQuantity(n, path, "half_angle", angle, &s.HalfAngle); err != nil {
			return s, err
		}
		if err := radiansAsDegrees(n.get("half_angle"), join(path, "half_angle"), s.HalfAngle); err != nil {
			return s, err
		}
	}
	switch s.Type {
	case Vee:
		if err := r.optQuantity(n, path, "flank_radius", length, &s.FlankRadius); err != nil {
			return s, err
		}
	case Rods:
		if err := r.reqQuantity(n, path, "rod_radius", length, &s.RodRadius); err != nil {
			return s, err
		}
	case Trihedral:
		if n.get("toward") == nil {
			return s, errorf(join(path, "toward"), ErrMissing, "the direction [x, y, z] of the socket's first contact")
		}
		fallthrough
	case Cone:
		if err := optDirection(n, path, "toward", &s.Toward); err != nil {
			return s, err
		}
	}
	if s.Type == Vee || s.Type == Rods {
		dir, az, ref := n.get("direction"), n.get("azimuth"), n.get("reference")
		switch {
		case dir != nil && az != nil:
			return s, errorf(join(path, "azimuth"), ErrRange, "give the groove's direction or its azimuth, not both")
		case dir == nil && az == nil:
			return s, errorf(join(path, "direction"), ErrMissing, "a groove needs its direction [x, y, z] or an azimuth (with its reference)")
		case dir != nil && ref != nil:
			return s, errorf(join(path, "reference"), ErrRange, "a reference goes with an azimuth, not with a direction")
		case dir != nil:
			if err := optDirection(n, path, "direction", &s.Direction); err != nil {
				return s, err
			}
		default:
			if err := r.optQuantity(n, path, "azimuth", angle, &s.Azimuth); err != nil {
				return s, err
			}
			if ref != nil {
				rv, err := text(ref, join(path, "reference"), maxName)
				if err != nil {
					return s, err
				}
				switch rv {
				case "radial":
					s.Reference = kinematic.Radial
				case "frame_x":
					s.Reference = kinematic.FrameX
				default:
					return s, errorf(join(path, "reference"), ErrRange, "%q; must be \"radial\" or \"frame_x\"", rv)
				}
			}
		}
	}
	s.Material, err = r.readMaterialOf(n, path)
	return s, err
}

func (r *reader) readPreload(n *node, path string) (kinematic.Preload, error) {
	var p kinematic.Preload
	if err := fields(n, path, "a preload", "name", "point", "direction", "force", "rate", "couple", "magnet", "magnet_plate", "table", "gap"); err != nil {
		return p, err
	}
	if err := optText(n, path, "name", maxName, &p.Name); err != nil {
		return p, err
	}
	if err := r.optVector(n, path, "point", length, &p.Point); err != nil {
		return p, err
	}
	if err := optDirection(n, path, "direction", &p.Direction); err != nil {
		return p, err
	}
	if err := r.optQuantity(n, path, "force", force, &p.Force); err != nil {
		return p, err
	}
	if err := r.optQuantity(n, path, "rate", rate, &p.Rate); err != nil {
		return p, err
	}
	if err := r.readLaw(n, path, &p); err != nil {
		return p, err
	}
	return p, r.optVector(n, path, "couple", moment, &p.Couple)
}

var inertiaKeys = [6]string{"xx", "yy", "zz", "xy", "xz", "yz"}

func (r *reader) readPayload(n *node, path string) (kinematic.Payload, error) {
	var p kinematic.Payload
	if err := fields(n, path, "a payload", "mass", "centre", "inertia"); err != nil {
		return p, err
	}
	if err := r.optQuantity(n, path, "mass", mass, &p.Mass); err != nil {
		return p, err
	}
	if err := r.optVector(n, path, "centre", length, &p.Centre); err != nil {
		return p, err
	}
	in := n.get("inertia")
	if in == nil {
		return p, nil
	}
	ip := join(path, "inertia")
	if err := fields(in, ip, "an inertia tensor", inertiaKeys[:]...); err != nil {
		return p, err
	}
	for _, k := range inertiaKeys {
		var v float64
		if err := r.optQuantity(in, ip, k, inertia, &v); err != nil {
			return p, err
		}
		r, c := strings.IndexByte("xyz", k[0]), strings.IndexByte("xyz", k[1])
		p.Inertia[r][c], p.Inertia[c][r] = v, v
	}
	return p, nil
}

func (r *reader) readCase(n *node, path string) (kinematic.LoadCase, error) {
	lc := kinematic.LoadCase{PreloadFactor: 1}
	if err := fields(n, path, "a load case", "name", "preload", "gravity", "acceleration", "applied"); err != nil {
		return lc, err
	}
	if n.get("name") == nil {
		return lc, errorf(join(path, "name"), ErrMissing, "a load case needs a name")
	}
	if err := optText(n, path, "name", maxName, &lc.Name); err != nil {
		return lc, err
	}
	if err := optNumber(n, path, "preload", &lc.PreloadFactor); err != nil {
		return lc, err
	}
	if lc.PreloadFactor == 0 {
		lc.NoPreload = true // "preload": 0 switches the preload off
	}
	if err := r.optVector(n, path, "gravity", acceleration, &lc.Gravity); err != nil {
		return lc, err
	}
	if err := r.optVector(n, path, "acceleration", acceleration, &lc.Acceleration); err != nil {
		return lc, err
	}
	an := n.get("applied")
	if an == nil {
		return lc, nil
	}
	ap := join(path, "applied")
	elems, err := list(an, ap, maxApplied)
	if err != nil {
		return lc, err
	}
	for i, e := range elems {
		p := index(ap, i)
		if err := fields(e, p, "an applied load", "force", "point", "moment"); err != nil {
			return lc, err
		}
		var f, at, m r3.Vec
		if err := r.optVector(e, p, "force", force, &f); err != nil {
			return lc, err
		}
		if err := r.optVector(e, p, "point", length, &at); err != nil {
			return lc, err
		}
		if err := r.optVector(e, p, "moment", moment, &m); err != nil {
			return lc, err
		}
		// A force f through the point at and a couple m: the wrench
		// (f, at × f + m) about the origin.
		w := screw.Wrench{F: f, M: r3.Add(r3.Cross(at, f), m)}
		if !finite(w.M) {
			return lc, errorf(p, ErrNonFinite, "the moment of the force about the origin overflows")
		}
		lc.Applied = append(lc.Applied, w)
	}
	return lc, nil
}

// angleParts are the dimensions of kinematic.Assembly that are angles;
// every other dimension is a length.
var angleParts = []string{"Turn", "Tilt", "Tilt1", "Tilt2", "HalfAngle"}

// dimensionKind returns the kind of quantity of the named dimension.
func dimensionKind(dim string) *quantityKind {
	part := dim[strings.LastIndexByte(dim, '.')+1:]
	for _, a := range angleParts {
		if part == a {
			return angle
		}
	}
	return length
}

func (r *reader) readTolerance(n *node, path string) (kinematic.Tolerance, error) {
	var t kinematic.Tolerance
	if err := fields(n, path, "a tolerance", "dimension", "value", "distribution"); err != nil {
		return t, err
	}
	dn := n.get("dimension")
	if dn == nil {
		return t, errorf(join(path, "dimension"), ErrMissing, "a dimension name such as \"A.Ball.Radius\"")
	}
	var err error
	if t.Dimension, err = text(dn, join(path, "dimension"), maxName); err != nil {
		return t, err
	}
	k := dimensionKind(t.Dimension)
	if n.get("value") == nil {
		return t, errorf(join(path, "value"), ErrMissing, "%s of %s in %s", t.Dimension, k.what, k.si)
	}
	var value float64
	if err := r.optQuantity(n, path, "value", k, &value); err != nil {
		var e *Error
		if errors.As(err, &e) && errors.Is(err, ErrUnit) {
			e.Err = fmt.Errorf("%w (%s is %s)", e.Err, t.Dimension, k.what)
		}
		return t, err
	}
	t.HalfWidth = value
	if dist := n.get("distribution"); dist != nil {
		v, err := text(dist, join(path, "distribution"), maxName)
		if err != nil {
			return t, err
		}
		switch v {
		case "uniform":
		case "normal":
			t.HalfWidth, t.Sigma = 0, value
		default:
			return t, errorf(join(path, "distribution"), ErrRange, "%q; must be \"uniform\" or \"normal\"", v)
		}
	}
	return t, nil
}

func (r *reader) readThermal(n *node, path string) (*kinematic.Thermal, error) {
	th := &kinematic.Thermal{}
	if err := fields(n, path, "a thermal change", "delta_t", "moving_alpha", "base_alpha", "base_ref"); err != nil {
		return nil, err
	}
	if err := r.reqQuantity(n, path, "delta_t", temperature, &th.DeltaT); err != nil {
		return nil, err
	}
	if err := r.optQuantity(n, path, "moving_alpha", expansion, &th.Moving); err != nil {
		return nil, err
	}
	if err := r.optQuantity(n, path, "base_alpha", expansion, &th.Base); err != nil {
		return nil, err
	}
	if err := r.optVector(n, path, "base_ref", length, &th.BaseRef); err != nil {
		return nil, err
	}
	return th, nil
}

func readMonteCarlo(n *node, path string) (*MonteCarlo, error) {
	mc := &MonteCarlo{}
	if err := fields(n, path, "a Monte Carlo study", "samples", "seed", "exact"); err != nil {
		return nil, err
	}
	sn := n.get("samples")
	if sn == nil {
		return nil, errorf(join(path, "samples"), ErrMissing, "the number of parts drawn, 1 to %d", maxSamples)
	}
	sp := join(path, "samples")
	v, err := number(sn, sp)
	if err != nil {
		return nil, err
	}
	if v != math.Trunc(v) || v < 1 || v > maxSamples {
		return nil, errorf(sp, ErrRange, "must be a whole number in [1, %d], got %s", maxSamples, sn.text)
	}
	mc.Samples = int(v)
	if s := n.get("seed"); s != nil {
		p := join(path, "seed")
		if s.kind != numberNode {
			return nil, errorf(p, ErrType, "must be a whole number in [0, 2^64), got %s", s.kind)
		}
		if mc.Seed, err = strconv.ParseUint(s.text, 10, 64); err != nil {
			return nil, errorf(p, ErrRange, "must be a whole number in [0, 2^64) written without a fraction or exponent, got %s", s.text)
		}
	}
	if e := n.get("exact"); e != nil {
		if mc.Exact, err = boolean(e, join(path, "exact")); err != nil {
			return nil, err
		}
	}
	return mc, nil
}

// caseRef reads the optional member "case" of a requirement object.
func caseRef(n *node, path string, dst *string) error {
	return optText(n, path, "case", maxName, dst)
}

// limit is a requirement's number: a quantity of kind, or a plain
// number when kind is nil.
type limit struct {
	key  string
	kind *quantityKind
	dst  *float64
}

// readLimit reads the limit l of the object n at path, if present; it
// must be > 0.
func (r *reader) readLimit(n *node, path string, l limit) error {
	m := n.get(l.key)
	if m == nil {
		return nil
	}
	p := join(path, l.key)
	var err error
	if l.kind == nil {
		*l.dst, err = number(m, p)
	} else {
		*l.dst, err = r.quantity(m, p, l.kind)
	}
	if err != nil {
		return err
	}
	return positive(*l.dst, p)
}

func (r *reader) readRequirements(n *node, path string) (Requirements, error) {
	var q Requirements
	if err := fields(n, path, "a requirements object", "min_centre_index", "min_contact_index", "min_maxwell_index", "max_pressure_ratio", "min_contact_force",
		"min_shock", "min_frequency", "max_error", "max_study", "max_thermal_drift", "seating",
		"max_tilt", "min_stiffness", "min_preload_margin", "max_repeatability", "min_random_margin", "max_random_displacement", "max_random_openings", "max_hysteresis"); err != nil {
		return q, err
	}
	// "min_maxwell_index" is the first name of "min_centre_index" (the
	// index at the ball centres), still read in this format version.
	if n.get("min_maxwell_index") != nil && n.get("min_centre_index") != nil {
		return q, errorf(join(path, "min_maxwell_index"), ErrRange, "the old name of min_centre_index, which is given too")
	}
	if m := n.get("min_maxwell_index"); m != nil {
		if v, err := number(m, join(path, "min_maxwell_index")); err == nil && v >= 1 {
			return q, errorf(join(path, "min_maxwell_index"), ErrRange, "%s", indexFloor(v))
		}
	}
	for _, l := range []limit{
		{"min_centre_index", nil, &q.MinCentreIndex},
		{"min_contact_index", nil, &q.MinContactIndex},
		{"min_maxwell_index", nil, &q.MinCentreIndex}, // the old name of min_centre_index
		{"max_pressure_ratio", nil, &q.MaxPressureRatio},
		{"max_thermal_drift", length, &q.MaxThermalDrift},
		{"min_random_margin", nil, &q.MinRandomMargin},
		{"max_random_displacement", length, &q.MaxRandomDisplacement},
		{"max_random_openings", nil, &q.MaxRandomOpenings},
	} {
		if err := r.readLimit(n, path, l); err != nil {
			return q, err
		}
	}
	for _, step := range []func(*node, string, *Requirements) error{
		r.readShock, r.readFrequency, r.readMaxError, r.readMaxStudy, readSeating,
		r.readContactForce, r.readMaxTilt, r.readMinStiffness, r.readPreloadMargin, r.readRepeatability, r.readHysteresis,
	} {
		if err := step(n, path, &q); err != nil {
			return q, err
		}
	}
	return q, nil
}

// readLimitCase reads a requirement object {key: limit, "case": name}
// of the requirements at path.
func (r *reader) readLimitCase(n *node, path, name, what, key string, k *quantityKind, dst *float64, c *string, cs *Cases, extra ...string) error {
	m := n.get(name)
	if m == nil {
		return nil
	}
	p := join(path, name)
	if err := fields(m, p, what, append([]string{key, "case", "cases"}, extra...)...); err != nil {
		return err
	}
	if m.get(key) == nil {
		return errorf(join(p, key), ErrMissing, "%s in %s", k.what, k.si)
	}
	if err := r.readLimit(m, p, limit{key, k, dst}); err != nil {
		return err
	}
	return readCases(m, p, c, cs)
}

func (r *reader) readShock(n *node, path string, q *Requirements) error {
	if err := r.readLimitCase(n, path, "min_shock", "a shock requirement", "level", acceleration, &q.MinShock, &q.ShockCase, &q.ShockCases, "gravity_any_orientation"); err != nil {
		return err
	}
	if m := n.get("min_shock"); m != nil {
		return optBool(m, join(path, "min_shock"), "gravity_any_orientation", &q.ShockAnyGravity)
	}
	return nil
}

func (r *reader) readFrequency(n *node, path string, q *Requirements) error {
	return r.readLimitCase(n, path, "min_frequency", "a frequency requirement", "limit", frequency, &q.MinFrequency, &q.FrequencyCase, &q.FrequencyCases)
}

func (r *reader) readMaxError(n *node, path string, q *Requirements) error {
	m := n.get("max_error")
	if m == nil {
		return nil
	}
	p := join(path, "max_error")
	if err := fields(m, p, "an error requirement", "worst_case", "rss", "along_axis"); err != nil {
		return err
	}
	if m.get("worst_case") == nil && m.get("rss") == nil {
		return errorf(join(p, "worst_case"), ErrMissing, "an error requirement needs worst_case, rss or both (lengths)")
	}
	for _, l := range []limit{{"worst_case", length, &q.MaxWorst}, {"rss", length, &q.MaxRSS}} {
		if err := r.readLimit(m, p, l); err != nil {
			return err
		}
	}
	if a := m.get("along_axis"); a != nil {
		var err error
		if q.AlongAxis, err = boolean(a, join(p, "along_axis")); err != nil {
			return err
		}
	}
	return nil
}

func (r *reader) readMaxStudy(n *node, path string, q *Requirements) error {
	m := n.get("max_study")
	if m == nil {
		return nil
	}
	p := join(path, "max_study")
	if err := fields(m, p, "a Monte Carlo requirement", "limit", "percentile"); err != nil {
		return err
	}
	if m.get("limit") == nil {
		return errorf(join(p, "limit"), ErrMissing, "%s in %s", length.what, length.si)
	}
	if err := r.readLimit(m, p, limit{"limit", length, &q.MaxStudy}); err != nil {
		return err
	}
	pn := m.get("percentile")
	if pn == nil {
		return nil
	}
	v, err := text(pn, join(p, "percentile"), maxName)
	if err != nil {
		return err
	}
	for i, name := range percentileNames {
		if name == v {
			q.StudyPercentile = Percentile(i)
			return nil
		}
	}
	return errorf(join(p, "percentile"), ErrRange, "%q; must be one of \"p50\", \"p95\", \"p99\", \"p99.73\"", v)
}

func readSeating(n *node, path string, q *Requirements) error {
	m := n.get("seating")
	if m == nil {
		return nil
	}
	p := join(path, "seating")
	if err := fields(m, p, "a seating requirement", "case", "cases"); err != nil {
		return err
	}
	q.Homing = true
	return readCases(m, p, &q.HomingCase, &q.HomingCases)
}

// finite reports whether every component of v is finite.
func finite(v r3.Vec) bool {
	return !math.IsNaN(v.X) && !math.IsInf(v.X, 0) && !math.IsNaN(v.Y) && !math.IsInf(v.Y, 0) &&
		!math.IsNaN(v.Z) && !math.IsInf(v.Z, 0)
}
