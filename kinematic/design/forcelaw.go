package design

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// This file reads, writes and names the preload elements whose force
// depends on the gap: "magnet" (two cuboid magnets), "magnet_plate" (a
// magnet on a steel plate) and "table" (force against gap), each with the
// seated "gap".

// maxTable is the most points a force table may have.
const maxTable = 256

// fluxDensity is a remanence.
var fluxDensity = &quantityKind{what: "a flux density", si: "T", hints: []string{"T"}, units: []unit{
	{name: "T"}, {name: "mT", pow10: -3},
}}

// Grades are the magnet grades a design file may name for a magnet's
// remanence, with their remanence in T (kinematic.RemanenceN42 and the
// others, whose doc gives the source).
var grades = map[string]float64{
	"N42":     kinematic.RemanenceN42,
	"N52":     kinematic.RemanenceN52,
	"SmCo":    kinematic.RemanenceSmCo,
	"Sm2Co17": kinematic.RemanenceSmCo,
}

func gradeNames() string {
	var ns []string
	for n := range grades {
		ns = append(ns, `"`+n+`"`)
	}
	sort.Strings(ns)
	return strings.Join(ns, ", ")
}

// readLaw reads a preload's force law and its gap into p, if it has one.
func (r *reader) readLaw(n *node, path string, p *kinematic.Preload) error {
	var given []string
	for _, k := range []string{"magnet", "magnet_plate", "table"} {
		if n.get(k) != nil {
			given = append(given, k)
		}
	}
	if len(given) == 0 {
		if n.get("gap") != nil {
			return errorf(join(path, "gap"), ErrRange, "a gap belongs to a \"magnet\", \"magnet_plate\" or \"table\" element")
		}
		return nil
	}
	if len(given) > 1 {
		return errorf(join(path, given[1]), ErrRange, "a preload has one force law; %q is given too", given[0])
	}
	for _, k := range []struct {
		key string
		v   float64
	}{{"force", p.Force}, {"rate", p.Rate}} {
		if k.v != 0 {
			return errorf(join(path, k.key), ErrRange, "the %s gives the force and rate at the gap: leave %q out", given[0], k.key)
		}
	}
	if n.get("gap") == nil {
		return errorf(join(path, "gap"), ErrMissing, "the seated gap of the %s, a length", given[0])
	}
	if err := r.optQuantity(n, path, "gap", length, &p.Gap); err != nil {
		return err
	}
	lp := join(path, given[0])
	switch given[0] {
	case "magnet":
		pair, err := r.readMagnet(n.get("magnet"), lp, true)
		p.Law = pair
		return err
	case "magnet_plate":
		pair, err := r.readMagnet(n.get("magnet_plate"), lp, false)
		p.Law = kinematic.MagnetPlate{Magnet: pair.Moving}
		return err
	}
	rows, err := list(n.get("table"), lp, maxTable)
	if err != nil {
		return err
	}
	t := &kinematic.ForceTable{}
	for i, row := range rows {
		rp := index(lp, i)
		if row.kind != arrayNode || len(row.vals) != 2 {
			return errorf(rp, ErrType, "must be a pair [gap, force], got %s", row.kind)
		}
		g, err := r.quantity(row.vals[0], index(rp, 0), length)
		if err != nil {
			return err
		}
		f, err := r.quantity(row.vals[1], index(rp, 1), force)
		if err != nil {
			return err
		}
		t.Points = append(t.Points, kinematic.TablePoint{Gap: g, Force: f})
	}
	p.Law = t
	return nil
}

// readMagnet reads a magnet: its "size" and "grade" or "remanence", and
// with pair its "second" magnet (the base's; the same as the first when
// absent) and lateral "offset".
func (r *reader) readMagnet(n *node, path string, pair bool) (kinematic.MagnetPair, error) {
	var mp kinematic.MagnetPair
	keys := []string{"size", "grade", "remanence"}
	if pair {
		keys = append(keys, "second", "offset")
	}
	if err := fields(n, path, "a magnet", keys...); err != nil {
		return mp, err
	}
	m, err := r.readOneMagnet(n, path)
	if err != nil {
		return mp, err
	}
	mp.Moving, mp.Base = m, m
	if !pair {
		return mp, nil
	}
	if s := n.get("second"); s != nil {
		sp := join(path, "second")
		if err := fields(s, sp, "a magnet", "size", "grade", "remanence"); err != nil {
			return mp, err
		}
		if mp.Base, err = r.readOneMagnet(s, sp); err != nil {
			return mp, err
		}
	}
	if o := n.get("offset"); o != nil {
		op := join(path, "offset")
		if o.kind != arrayNode || len(o.vals) != 2 {
			return mp, errorf(op, ErrType, "must be an array of two lengths [x, y], got %s", o.kind)
		}
		for k, e := range o.vals {
			if mp.Offset[k], err = r.quantity(e, index(op, k), length); err != nil {
				return mp, err
			}
		}
	}
	return mp, nil
}

func (r *reader) readOneMagnet(n *node, path string) (kinematic.Magnet, error) {
	var m kinematic.Magnet
	s := n.get("size")
	if s == nil {
		return m, errorf(join(path, "size"), ErrMissing, "the magnet's full edge lengths [a, b, c], c along the magnetisation")
	}
	sp := join(path, "size")
	if s.kind != arrayNode || len(s.vals) != 3 {
		return m, errorf(sp, ErrType, "must be an array of three lengths [a, b, c], got %s", s.kind)
	}
	for k, e := range s.vals {
		var err error
		if m.Size[k], err = r.quantity(e, index(sp, k), length); err != nil {
			return m, err
		}
	}
	g, rem := n.get("grade"), n.get("remanence")
	switch {
	case g != nil && rem != nil:
		return m, errorf(join(path, "remanence"), ErrRange, "give the grade or the remanence, not both")
	case g != nil:
		name, err := text(g, join(path, "grade"), maxName)
		if err != nil {
			return m, err
		}
		br, ok := grades[name]
		if !ok {
			return m, errorf(join(path, "grade"), ErrRange, "unknown grade %q; known: %s, or give \"remanence\"", name, gradeNames())
		}
		m.Remanence = br
	case rem != nil:
		return m, r.optQuantity(n, path, "remanence", fluxDensity, &m.Remanence)
	default:
		return m, errorf(join(path, "remanence"), ErrMissing, "the magnet's \"grade\" (%s) or \"remanence\", a flux density in T", gradeNames())
	}
	return m, nil
}

// wireMagnet is a magnet as Write gives it: plain SI numbers.
type wireMagnet struct {
	Size      [3]float64  `json:"size"`
	Remanence float64     `json:"remanence"`
	Second    *wireMagnet `json:"second,omitempty"`
	Offset    *[2]float64 `json:"offset,omitempty"`
}

// wireLaw sets the law members of w from p.
func wireLaw(w *wirePreload, p kinematic.Preload) {
	if p.Law == nil {
		return
	}
	w.Force, w.Rate = 0, 0
	gap := p.Gap
	w.Gap = &gap
	switch l := p.Law.(type) {
	case kinematic.MagnetPair:
		m := &wireMagnet{Size: l.Moving.Size, Remanence: l.Moving.Remanence}
		if l.Base != l.Moving {
			m.Second = &wireMagnet{Size: l.Base.Size, Remanence: l.Base.Remanence}
		}
		if l.Offset != ([2]float64{}) {
			o := l.Offset
			m.Offset = &o
		}
		w.Magnet = m
	case kinematic.MagnetPlate:
		w.MagnetPlate = &wireMagnet{Size: l.Magnet.Size, Remanence: l.Magnet.Remanence}
	case *kinematic.ForceTable:
		w.Table = make([][2]float64, len(l.Points))
		for i, q := range l.Points {
			w.Table[i] = [2]float64{q.Gap, q.Force}
		}
	}
}

// clonePreloads returns a copy of ps whose force tables are copies too.
func clonePreloads(ps []kinematic.Preload) []kinematic.Preload {
	c := append([]kinematic.Preload(nil), ps...)
	for i, p := range c {
		if t, ok := p.Law.(*kinematic.ForceTable); ok && t != nil {
			c[i].Law = &kinematic.ForceTable{Points: append([]kinematic.TablePoint(nil), t.Points...)}
		}
	}
	return c
}

// lawField translates the rest of "preloads[i].rest" when it names the
// law or its gap ("Law.Moving.Size[0]" → "magnet.size[0]"), given the
// preload; ok is false for other fields.
func lawField(p kinematic.Preload, rest string) (string, bool) {
	if rest == "Gap" {
		return "gap", true
	}
	if rest == "Law" {
		switch p.Law.(type) {
		case kinematic.MagnetPair:
			return "magnet", true
		case kinematic.MagnetPlate:
			return "magnet_plate", true
		case *kinematic.ForceTable:
			return "table", true
		}
	}
	sub, ok := strings.CutPrefix(rest, "Law.")
	if !ok {
		return "", false
	}
	head, tail, _ := strings.Cut(sub, ".")
	switch l := p.Law.(type) {
	case kinematic.MagnetPair:
		switch {
		case head == "Moving":
			return join("magnet", snake(tail)), true
		case head == "Base" && l.Base == l.Moving:
			return join("magnet", snake(tail)), true
		case head == "Base":
			return join("magnet.second", snake(tail)), true
		}
		return join("magnet", snake(sub)), true
	case kinematic.MagnetPlate:
		return join("magnet_plate", snake(tail)), true
	case *kinematic.ForceTable:
		if name, i, ok := splitIndex(head); ok && name == "Points" {
			col := 0
			if tail == "Force" {
				col = 1
			}
			return index(index("table", i), col), true
		}
		return "table", true
	}
	return "", false
}

// runawayNote describes the shock's runaway level for a design with a
// gap-dependent preload, less g with the gravity turned; "" for a design
// without one.
func runawayNote(d *Design, s *kinematic.Shock, g float64) string {
	law := false
	for _, p := range d.Preloads {
		law = law || p.Law != nil
	}
	if !law {
		return ""
	}
	switch {
	case math.IsInf(s.Runaway, 1):
		return "; the preload grows as the part lifts: a contact may open but the part is held at any level (no runaway)"
	case s.Runaway > s.Unload*(1+1e-9):
		return fmt.Sprintf("; the preload grows as the part lifts: held to %.4g m/s² (runaway)", s.Runaway-g)
	}
	return "; the preload falls as the part lifts: it runs away where the first contact opens"
}
