package draw

// xAxis draws a horizontal axis at y from px x0 to x1 for values lo..hi,
// with ticks and values below and the label centred under them, registers
// the texts with the placer, and returns the box of everything drawn.
func (s *scene) xAxis(x0, x1, y, lo, hi float64, label string) box {
	s.add(line{x0, y, x1, y, "axis", axisLineStyle})
	bb := box{x0, y, x1, y}
	step := niceStep(hi-lo, 6)
	px := func(v float64) float64 { return x0 + (x1-x0)*fraction(v, lo, hi) }
	last := x0 - 1e9
	for _, v := range ticks(lo, hi, step) {
		x := px(v)
		s.add(line{x, y, x, y + 5, "tick", axisLineStyle})
		t := tickText(v, step)
		tb := textBox(t, x, y+8+ascent*fontSize, fontSize, "middle")
		if tb.x0 < last+4 { // the ticks' values would touch: skip this one's text
			continue
		}
		last = tb.x1
		s.add(text{x, y + 8 + ascent*fontSize, fontSize, "middle", "tick", `fill="` + inkColour + `"`, t})
		s.place.boxes = append(s.place.boxes, tb)
		bb = bb.union(tb)
	}
	ly := bb.y1 + 6 + ascent*fontSize
	s.add(text{(x0 + x1) / 2, ly, fontSize, "middle", "axis-label", `fill="` + inkColour + `"`, label})
	lb := textBox(label, (x0+x1)/2, ly, fontSize, "middle")
	s.place.boxes = append(s.place.boxes, lb)
	return bb.union(lb)
}

// yAxis draws a vertical axis at x from px y0 (bottom, value lo) to y1
// (top, value hi), with ticks and values to the left and the label above
// the top, left-aligned with the values, and returns the box of all of it.
// step ≤ 0 chooses a round step.
func (s *scene) yAxis(x, y0, y1, lo, hi, step float64, label string) box {
	s.add(line{x, y0, x, y1, "axis", axisLineStyle})
	bb := box{x, y1, x, y0}
	if step <= 0 {
		step = niceStep(hi-lo, 5)
	}
	for _, v := range ticks(lo, hi, step) {
		y := y0 + (y1-y0)*fraction(v, lo, hi)
		s.add(line{x - 5, y, x, y, "tick", axisLineStyle})
		t := tickText(v, step)
		tb := textBox(t, x-8, y+0.35*fontSize, fontSize, "end")
		s.add(text{x - 8, y + 0.35*fontSize, fontSize, "end", "tick", `fill="` + inkColour + `"`, t})
		s.place.boxes = append(s.place.boxes, tb)
		bb = bb.union(tb)
	}
	ly := bb.y0 - 10
	s.add(text{bb.x0, ly, fontSize, "start", "axis-label", `fill="` + inkColour + `"`, label})
	lb := textBox(label, bb.x0, ly, fontSize, "start")
	s.place.boxes = append(s.place.boxes, lb)
	return bb.union(lb)
}
