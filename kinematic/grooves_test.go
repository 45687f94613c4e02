package kinematic

import (
	"math"
	"testing"
)

// TestOptimizeGrooves: the optimiser never does worse than the bisector
// layout when the bisectors are allowed, keeps every groove inside its
// window, and reports a coupling whose weakest index is what it says.
func TestOptimizeGrooves(t *testing.T) {
	bis, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	res, err := OptimizeGrooves(bis, nil)
	if err != nil {
		t.Fatal(err)
	}
	sb := mustStability(t, bis)
	if !res.BisectorAllowed || math.Abs(res.Bisector-sb.Contacts[sb.Weakest].Index) > 1e-12 {
		t.Errorf("bisector index %g (allowed %v), stability says %g", res.Bisector, res.BisectorAllowed, sb.Contacts[sb.Weakest].Index)
	}
	if res.Weakest < res.Bisector {
		t.Errorf("optimum %g below the bisector layout %g", res.Weakest, res.Bisector)
	}
	so := mustStability(t, res.Coupling)
	if math.Abs(so.Contacts[so.Weakest].Index-res.Weakest) > 1e-12 {
		t.Errorf("reported weakest %g, the returned coupling has %g", res.Weakest, so.Contacts[so.Weakest].Index)
	}

	// Windows that keep every groove at least 0.3 rad off radial, on one
	// side: the bisectors are outside. By hand: at A = (−60, 0) the angle
	// of the triangle is atan(30/60) = 26.57°, so its bisector lies 13.28°
	// above AB, while radial (towards the centroid (0, 10)) lies
	// atan(10/60) = 9.46° above it: 3.82° = 0.067 rad apart; B mirrors A,
	// and C's bisector is radial.
	wins := []Window{{Min: 0.3, Max: 1.2}, {Min: 0.3, Max: 1.2}, {Min: 0.3, Max: 1.2}}
	res, err = OptimizeGrooves(bis, &GrooveOptions{Windows: wins})
	if err != nil {
		t.Fatal(err)
	}
	if res.BisectorAllowed {
		t.Error("bisectors reported inside windows that exclude them")
	}
	g, err := res.Coupling.Geometry()
	if err != nil {
		t.Fatal(err)
	}
	for i, gr := range g.Grooves {
		if gr.Azimuth < 0.3-1e-9 || gr.Azimuth > 1.2+1e-9 || math.Abs(gr.Azimuth-res.Azimuths[i]) > 1e-12 {
			t.Errorf("groove %d at azimuth %g (reported %g), window [0.3, 1.2]", i, gr.Azimuth, res.Azimuths[i])
		}
	}
	if !(res.Weakest > 0) || res.Weakest > res.Bisector {
		t.Errorf("windowed optimum %g; want positive and below the unrestricted bisector %g", res.Weakest, res.Bisector)
	}
}

// TestOptimizerFindsExcentre: when a window keeps ball B's groove off its
// internal bisector, the excentre layout (B and C on external bisectors)
// is inside the windows and is as good as the bisector layout; the
// optimiser, which does not start from it, should find a layout at least
// as good to within the search's resolution.
func TestOptimizerFindsExcentre(t *testing.T) {
	bs := [3]Ball{ball(-60, -35, 0), ball(65, -30, 0), ball(10, 55, 0)}
	ex := excentreLayout(t, bs, math.Pi/4)
	se := mustStability(t, ex)
	want := se.Contacts[se.Weakest].Index
	bis, err := BisectorVees(bs, three(vee45))
	if err != nil {
		t.Fatal(err)
	}
	all := Window{Min: -math.Pi / 2, Max: math.Pi / 2}
	res, err := OptimizeGrooves(bis, &GrooveOptions{Windows: []Window{all, {Min: 25 * math.Pi / 180, Max: math.Pi / 2}, all}})
	if err != nil {
		t.Fatal(err)
	}
	if res.Weakest < want-1e-6 {
		t.Errorf("optimum %.6f below the excentre layout's %.6f", res.Weakest, want)
	}
}
