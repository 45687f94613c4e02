package design

import (
	"context"
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// TestReadLaws checks what the design file's gap-dependent elements read
// as: sizes in full edges converted from mm, the grade's remanence (the
// kinematic constant), the second magnet and offset, the plate and the
// table; and that the built model takes each element's force from its
// law at the gap.
func TestReadLaws(t *testing.T) {
	d, err := Parse(readFile(t, "testdata/magnets.json"))
	if err != nil {
		t.Fatal(err)
	}
	pair, ok := d.Preloads[0].Law.(kinematic.MagnetPair)
	want := kinematic.MagnetPair{
		Moving: kinematic.Magnet{Size: [3]float64{0.012, 0.012, 0.004}, Remanence: kinematic.RemanenceN42},
		Base:   kinematic.Magnet{Size: [3]float64{0.015, 0.010, 0.005}, Remanence: 1.1},
		Offset: [2]float64{0.0005, 0},
	}
	if !ok || pair != want || d.Preloads[0].Gap != 0.0006 {
		t.Errorf("magnet: %+v gap %g; want %+v gap 0.0006", d.Preloads[0].Law, d.Preloads[0].Gap, want)
	}
	plate, ok := d.Preloads[1].Law.(kinematic.MagnetPlate)
	if !ok || plate.Magnet.Remanence != kinematic.RemanenceSmCo || plate.Magnet.Size != [3]float64{0.006, 0.006, 0.003} {
		t.Errorf("plate: %+v", d.Preloads[1].Law)
	}
	tb, ok := d.Preloads[2].Law.(*kinematic.ForceTable)
	if !ok || len(tb.Points) != 3 || tb.Points[2] != (kinematic.TablePoint{Gap: 0.003, Force: 14}) {
		t.Errorf("table: %+v", d.Preloads[2].Law)
	}
	b, err := d.Build()
	if err != nil {
		t.Fatal(err)
	}
	e, err := b.Evaluate(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	// The vertical balance of the seated case: the six contact forces'
	// vertical parts (sin 45° each) carry the three elements' forces and
	// the weight.
	var sum float64
	for _, p := range d.Preloads {
		f, _, err := p.Law.Force(p.Gap)
		if err != nil {
			t.Fatal(err)
		}
		sum += f
	}
	sum += 0.5 * kinematic.StandardGravity
	var vert float64
	for _, c := range e.Cases[0].Contacts {
		vert += c.Force * math.Sin(math.Pi/4)
	}
	if math.Abs(vert/sum-1) > 1e-9 {
		t.Errorf("vertical balance: contacts carry %g N, elements and weight %g N", vert, sum)
	}
	vs := e.Verdicts()
	found := false
	for _, v := range vs {
		if strings.Contains(v.Note, "runs away") || strings.Contains(v.Note, "runaway") {
			found = true
		}
	}
	if !found {
		t.Errorf("no verdict mentions the runaway: %+v", vs)
	}
}

// TestLawErrors checks that bad law members are named at their path in
// the file.
func TestLawErrors(t *testing.T) {
	for _, c := range []struct {
		change func(m map[string]any)
		path   string
		want   error
	}{
		{set("preloads[0].gap", "0.6 mm"), "preloads[0].gap", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].magnet", map[string]any{"size": []any{"12 mm", "12 mm", "4 mm"}, "grade": "N42"})(m)
			del("preloads[0].force")(m)
		}, "preloads[0].gap", ErrMissing},
		{func(m map[string]any) {
			set("preloads[0].magnet", map[string]any{"size": []any{"12 mm", "0 mm", "4 mm"}, "grade": "N42"})(m)
			set("preloads[0].gap", "0.6 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].magnet.size[1]", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].magnet", map[string]any{"size": []any{"12 mm", "12 mm", "4 mm"}, "grade": "N43"})(m)
			set("preloads[0].gap", "0.6 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].magnet.grade", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].magnet", map[string]any{"size": []any{"12 mm", "12 mm", "4 mm"}, "grade": "N42"})(m)
			set("preloads[0].gap", "0.6 mm")(m)
		}, "preloads[0].force", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].table", []any{[]any{"0 mm", "5 N"}, []any{"1 mm", "-8 N"}})(m)
			set("preloads[0].gap", "0.5 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].table[1][1]", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].table", []any{[]any{"1 mm", "5 N"}, []any{"1 mm", "8 N"}})(m)
			set("preloads[0].gap", "0.5 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].table[1][0]", ErrRange},
		{func(m map[string]any) {
			set("preloads[0].magnet_plate", map[string]any{"size": []any{"12 mm", "12 mm", "4 mm"}, "remanence": "1.2 T"})(m)
			set("preloads[0].gap", "0 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].gap", ErrRange},
		// A magnet typed in metres where millimetres were meant.
		{func(m map[string]any) {
			set("preloads[0].magnet", map[string]any{"size": []any{"12 m", "12 m", "4 m"}, "grade": "N42"})(m)
			set("preloads[0].gap", "0.6 mm")(m)
			del("preloads[0].force")(m)
		}, "preloads[0].magnet", ErrRange},
	} {
		d, err := Parse([]byte(edit(t, c.change)))
		if err == nil {
			_, err = d.Build()
		}
		var e *Error
		if !errors.As(err, &e) || e.Path != c.path || !errors.Is(err, c.want) {
			t.Errorf("%v; want %s wrapping %v", err, c.path, c.want)
		}
	}
}
