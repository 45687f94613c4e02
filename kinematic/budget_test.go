package kinematic

import (
	"context"
	"errors"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestBudgetRefusesNoTolerances: a budget or study of no toleranced
// dimension is refused, naming tols, rather than reported as zeros that
// read as a perfect part.
func TestBudgetRefusesNoTolerances(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"]
	for _, tols := range [][]Tolerance{nil, {}} {
		var ie *InputError
		if _, err := a.Budget(r3.Vec{}, tols); !errors.As(err, &ie) || ie.Field != "tols" || !errors.Is(err, ErrRange) {
			t.Errorf("Budget(%v): %v; want tols refused", tols, err)
		}
		for _, exact := range []bool{false, true} {
			if _, err := a.Study(context.Background(), r3.Vec{}, tols, &StudyOptions{Samples: 10, Exact: exact}); !errors.As(err, &ie) || ie.Field != "tols" || !errors.Is(err, ErrRange) {
				t.Errorf("Study(%v, exact %v): %v; want tols refused", tols, exact, err)
			}
		}
	}
}

// TestBudgetRefusesUnitSlips: a tolerance out of all proportion to the
// coupling is a unit slip and is refused, by Budget and by both kinds of
// Study, naming the field as written; the bounds are the pair's ball
// radius (5 mm here) for a length and 0.1 rad for an angle, both
// inclusive. The hints are hand conversions: 10 µm = 1e-05 m,
// 6 arcmin = 6π/10800 = 0.001745 rad, 2° = 2π/180 = 0.03491 rad; 6° is
// 0.1047 rad and 10 mm 0.01 m, beyond the bounds, so not offered.
func TestBudgetRefusesUnitSlips(t *testing.T) {
	a := generalAssemblies(t)["socket-vee-flat"] // A socket, B vee, C flat; balls of radius 5 mm
	ok := func(d string, hw, sigma float64) Tolerance {
		return Tolerance{Dimension: d, HalfWidth: hw, Sigma: sigma}
	}
	for _, tc := range []struct {
		tols    []Tolerance
		field   string // "" accepted
		want    []string
		notWant []string
	}{
		{tols: []Tolerance{ok("A.Seat.X", 10, 0)}, field: "tols[0].HalfWidth",
			want: []string{"10 m on A.Seat.X", "ball A's radius 0.005 m", "if that is µm, it is 1e-05 m"}, notWant: []string{"mm"}},
		{tols: []Tolerance{ok("A.Ball.X", 1e-6, 0), ok("C.Seat.Height", 5.01e-3, 0)}, field: "tols[1].HalfWidth"},
		{tols: []Tolerance{ok("C.Seat.Height", 5e-3, 0)}},
		{tols: []Tolerance{ok("B.Ball.Radius", 0, 1.7e-3)}, field: "tols[0].Sigma", want: []string{"σ 0.0017 m (3σ 0.0051 m)"}},
		{tols: []Tolerance{ok("B.Ball.Radius", 0, 1.6e-3)}},
		{tols: []Tolerance{ok("A.Ball.X", 1e-6, 0), ok("B.Seat.Turn", 6, 0)}, field: "tols[1].HalfWidth",
			want: []string{"6 rad on B.Seat.Turn", "at most 0.1 rad", "if that is arcminutes, it is 0.001745 rad"}, notWant: []string{"degrees"}},
		{tols: []Tolerance{ok("A.Seat.HalfAngle", 2, 0)}, field: "tols[0].HalfWidth",
			want: []string{"if that is degrees, it is 0.03491 rad", "if that is arcminutes, it is 0.0005818 rad"}},
		{tols: []Tolerance{ok("B.Seat.HalfAngle", 0.1001, 0)}, field: "tols[0].HalfWidth"},
		{tols: []Tolerance{ok("B.Seat.Tilt", 0.1, 0)}},
		{tols: []Tolerance{ok("C.Seat.Tilt1", 0, 0.04)}, field: "tols[0].Sigma"},
	} {
		check := func(what string, err error) {
			t.Helper()
			if tc.field == "" {
				if err != nil {
					t.Errorf("%s %+v: %v; want accepted", what, tc.tols, err)
				}
				return
			}
			var ie *InputError
			if !errors.As(err, &ie) || ie.Field != tc.field || !errors.Is(err, ErrRange) {
				t.Errorf("%s %+v: %v; want %s refused", what, tc.tols, err, tc.field)
				return
			}
			for _, w := range tc.want {
				if !strings.Contains(err.Error(), w) {
					t.Errorf("%s %+v: %q lacks %q", what, tc.tols, err, w)
				}
			}
			for _, w := range tc.notWant {
				if strings.Contains(err.Error(), w) {
					t.Errorf("%s %+v: %q should not offer %q", what, tc.tols, err, w)
				}
			}
		}
		_, err := a.Budget(r3.Vec{}, tc.tols)
		check("Budget", err)
		_, err = a.Study(context.Background(), r3.Vec{}, tc.tols, &StudyOptions{Samples: 10})
		check("Study", err)
		if tc.field != "" {
			_, err = a.Study(context.Background(), r3.Vec{}, tc.tols, &StudyOptions{Samples: 10, Exact: true})
			check("exact Study", err)
		}
	}
}
