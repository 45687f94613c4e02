package draw

import (
	"testing"
)

// TestPlacerCrowded places many labels on one anchor and on a tight
// cluster of anchors, among discs and lines: no two boxes may overlap and
// none may touch an obstacle.
func TestPlacerCrowded(t *testing.T) {
	var p placer
	p.discs = []disc{{100, 100, 20}, {140, 100, 10}}
	p.segs = []seg{{0, 0, 300, 300, 1.5}, {0, 100, 300, 100, 1.5}}
	p.boxes = []box{{180, 60, 220, 90}}
	obstacles := p // a copy of the obstacles alone
	var got []box
	for i := range 60 {
		ax, ay := 100+3*float64(i%5), 100+2*float64(i/5)
		b, _ := p.place(ax, ay, 40+float64(i%7)*5, 14, 4)
		got = append(got, b)
	}
	for i := range got {
		for j := range i {
			if got[i].overlaps(got[j]) {
				t.Errorf("labels %d and %d overlap: %+v %+v", i, j, got[i], got[j])
			}
		}
		if !obstacles.free(got[i]) {
			t.Errorf("label %d at %+v touches an obstacle", i, got[i])
		}
	}
	if len(p.labels) != 60 {
		t.Errorf("%d labels registered, want 60", len(p.labels))
	}
}

// TestPlacerPrefersNear checks the first choice: with nothing in the way a
// label goes to the right of its anchor at the clearance, without leader;
// with a disc around the anchor it goes outside the disc.
func TestPlacerPrefersNear(t *testing.T) {
	var p placer
	b, leader := p.place(50, 50, 30, 10, 4)
	if want := (box{54, 45, 84, 55}); b != want || leader {
		t.Errorf("free placement %+v leader %v, want %+v without leader", b, leader, want)
	}
	q := placer{discs: []disc{{200, 200, 25}}}
	b, _ = q.place(200, 200, 30, 10, 28)
	if discHitsBox(disc{200, 200, 25}, b) {
		t.Errorf("label %+v covers the disc it names", b)
	}
}

// TestPlacerFallback walls the anchor in: every ring is blocked, so the
// label goes outside the extent of everything.
func TestPlacerFallback(t *testing.T) {
	p := placer{boxes: []box{{-1000, -1000, 1000, 1000}}}
	b, leader := p.place(0, 0, 30, 10, 4)
	if b.overlaps(p.boxes[0]) || !leader {
		t.Errorf("fallback %+v overlaps the wall or has no leader", b)
	}
	if b.x0 < 1000 {
		t.Errorf("fallback %+v not to the right of the wall", b)
	}
}

// TestSegHitsBox checks the clipping predicate on cases drawn by hand.
func TestSegHitsBox(t *testing.T) {
	b := box{0, 0, 10, 10}
	cases := []struct {
		x1, y1, x2, y2 float64
		want           bool
	}{
		{-5, 5, 15, 5, true},    // straight through
		{-5, -5, 15, 15, true},  // diagonal
		{-5, 12, 15, 12, false}, // passes above
		{2, 2, 3, 3, true},      // inside
		{-5, 0, 15, 0, false},   // along the edge: no interior
		{11, -5, 20, 5, false},  // misses the corner
		{5, 5, 5, 5, true},      // a point inside
		{-10, 5, -1, 5, false},  // stops short
		{12, -2, -2, 12, true},  // crosses near a corner
	}
	for _, c := range cases {
		if got := segHitsBox(c.x1, c.y1, c.x2, c.y2, b); got != c.want {
			t.Errorf("segHitsBox(%v,%v,%v,%v) = %v, want %v", c.x1, c.y1, c.x2, c.y2, got, c.want)
		}
	}
	x1, y1, x2, y2, ok := clipSeg(-10, 5, 20, 5, b)
	if !ok || x1 != 0 || x2 != 10 || y1 != 5 || y2 != 5 {
		t.Errorf("clipSeg = %v %v %v %v %v, want 0 5 10 5", x1, y1, x2, y2, ok)
	}
}

// TestSig checks the three-significant-figure format of label values
// (values by hand: a value that rounds up to the next decade keeps three
// figures).
func TestSig(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{{0.71, "0.710"}, {123.456, "123"}, {12.345, "12.3"}, {0, "0"}, {-3.333, "-3.33"}, {1.5e-5, "1.50e-05"}, {2.5e7, "2.50e+07"}, {99.99999999, "100"}, {0.099999999, "0.100"}} {
		if got := Sig(c.v); got != c.want {
			t.Errorf("Sig(%g) = %q, want %q", c.v, got, c.want)
		}
	}
}

// TestPlacerWithin: an anchor 10 px from the right edge of the canvas
// cannot take its label to the right (the first choice), which would run
// 60 px past the edge; Within keeps it inside, where moving it back
// afterwards would have covered the anchor's mark.
func TestPlacerWithin(t *testing.T) {
	var p Placer
	p.Within(Box{0, 0, 200, 200})
	b := p.Place(190, 100, 70, 10, 4)
	if b.X0 < 0 || b.Y0 < 0 || b.X1 > 200 || b.Y1 > 200 {
		t.Errorf("label %+v runs off the canvas (0, 0)–(200, 200)", b)
	}
	if b.X0 < 190 && b.X1 > 190 && b.Y0 < 100 && b.Y1 > 100 {
		t.Errorf("label %+v covers its anchor (190, 100)", b)
	}
}
