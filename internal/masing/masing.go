// Package masing keeps the exact memory of a hysteretic element that obeys
// Masing's rules, for any odd, increasing backbone curve y = f(x).
//
// The rules (Masing 1926, as extended for irregular load paths; stated
// from memory):
//
//   - from the virgin state (0, 0) the element follows the backbone
//     y = f(x);
//   - at each reversal (xr, yr) a new branch starts, the backbone scaled by
//     two about that point: y = yr + 2 f((x − xr)/2);
//   - a branch that meets an earlier branch (it reaches the reversal point
//     where the branch before it began) closes that loop and the path
//     continues on the earlier branch, as if the loop had not happened;
//   - the first branch after the virgin curve meets the backbone again at
//     the mirror point (−xr, −yr) and continues on it.
//
// The memory is the stack of open reversal points, so any load path is
// followed exactly: no sliders, no discretisation. A Memory moves in x
// (MoveX) or in y (MoveY, for a backbone whose inverse is given); Peek
// variants evaluate a move without making it. Both variables are
// dimensionless: the caller scales them.
package masing

import "math"

// Curve is an odd, continuous, non-decreasing backbone y = F(x) with its
// slope dF/dx and its inverse x = Inv(y), which may return ±Inf where the
// backbone saturates (|y| at its limit).
type Curve struct {
	F     func(x float64) float64
	Slope func(x float64) float64
	Inv   func(y float64) float64
}

// Point is a state (x, y) of the element.
type Point struct{ X, Y float64 }

// reversal is an open reversal point and the sign of the branch that
// starts there.
type reversal struct {
	p   Point
	dir float64
}

// Memory is the state of one element: where it is and the open reversal
// points of its load path. The zero Memory with a Curve set is virgin.
type Memory struct {
	c   Curve
	rev []reversal
	cur Point
}

// New returns a virgin memory on the backbone c with room for n reversals
// before it allocates.
func New(c Curve, n int) *Memory {
	return &Memory{c: c, rev: make([]reversal, 0, n)}
}

// Reset returns m to the virgin state, keeping its storage.
func (m *Memory) Reset() { m.rev, m.cur = m.rev[:0], Point{} }

// State returns the current point.
func (m *Memory) State() Point { return m.cur }

// Open returns the number of open reversal points.
func (m *Memory) Open() int { return len(m.rev) }

// MoveX moves the element monotonically from its state to x and returns
// the new state and the slope dy/dx there (taken on the side the move
// arrived from).
func (m *Memory) MoveX(x float64) (Point, float64) { return m.move(x, false, true) }

// PeekX returns what MoveX(x) would return, leaving m unchanged.
func (m *Memory) PeekX(x float64) (Point, float64) { return m.move(x, false, false) }

// MoveY moves the element monotonically to y and returns the new state and
// the slope dy/dx. A y the path cannot reach (beyond the saturation of the
// branch it is on) gives a state with X = ±Inf; the memory is then left
// unchanged.
func (m *Memory) MoveY(y float64) (Point, float64) { return m.move(y, true, true) }

// PeekY returns what MoveY(y) would return, leaving m unchanged.
func (m *Memory) PeekY(y float64) (Point, float64) { return m.move(y, true, false) }

// coord returns the driving coordinate of p.
func coord(p Point, byY bool) float64 {
	if byY {
		return p.Y
	}
	return p.X
}

// move is MoveX, MoveY and their Peek forms. The stack is viewed as rev
// plus at most one pushed point, of which the first k are open.
func (m *Memory) move(t float64, byY, commit bool) (Point, float64) {
	n := len(m.rev)
	var pushed reversal
	k, cur := n, m.cur
	c := coord(cur, byY)
	if t != c {
		s := math.Copysign(1, t-c)
		var dir float64
		if k == 0 {
			dir = sign(c)
		} else {
			dir = m.at(k-1, n, &pushed).dir
		}
		if dir != 0 && s != dir {
			pushed = reversal{p: cur, dir: s}
			k++
		}
		// Close the loops the move passes through.
		for k > 0 {
			var lim Point
			if k >= 2 {
				lim = m.at(k-2, n, &pushed).p
			} else {
				r := m.at(0, n, &pushed).p
				lim = Point{-r.X, -r.Y}
			}
			if s*(t-coord(lim, byY)) < 0 {
				break
			}
			cur = lim
			if k >= 2 {
				k -= 2
			} else {
				k = 0
			}
		}
	}
	var p Point
	var slope float64
	if k == 0 {
		if byY {
			p = Point{m.c.Inv(t), t}
		} else {
			p = Point{t, m.c.F(t)}
		}
		slope = m.c.Slope(p.X)
	} else {
		b := m.at(k-1, n, &pushed).p
		if byY {
			p = Point{b.X + 2*m.c.Inv((t-b.Y)/2), t}
		} else {
			p = Point{t, b.Y + 2*m.c.F((t-b.X)/2)}
		}
		slope = m.c.Slope((p.X - b.X) / 2)
	}
	if math.IsNaN(p.X) || math.IsInf(p.X, 0) {
		// Beyond the saturation of the branch (an inverse that returns
		// NaN outside its domain is read the same way).
		return Point{math.Copysign(math.Inf(1), t-coord(m.cur, byY)), t}, 0
	}
	if commit {
		switch {
		case k > n:
			m.rev = append(m.rev, pushed)
		default:
			m.rev = m.rev[:k]
		}
		m.cur = p
	}
	return p, slope
}

// at returns open reversal i of the stack viewed as the n stored points
// and then pushed.
func (m *Memory) at(i, n int, pushed *reversal) reversal {
	if i < n {
		return m.rev[i]
	}
	return *pushed
}

func sign(x float64) float64 {
	switch {
	case x > 0:
		return 1
	case x < 0:
		return -1
	}
	return 0
}

// Mindlin is the backbone of a Hertz contact under a tangential load at
// constant normal load P (Mindlin 1949; Johnson, Contact Mechanics, 1985,
// §7.2), in the variables x = δ/δs, δs = 3μP/(2k0) the displacement at
// which the contact slides on first loading, and y = Q/(μP):
//
//	y = 1 − (1 − x)^(3/2) for 0 ≤ x ≤ 1, y = 1 beyond (gross sliding),
//
// odd in x; its inverse x = 1 − (1 − y)^(2/3) is Johnson's loading curve
// δ = 3μP/(16G*a)[1 − (1 − Q/μP)^(2/3)] for k0 = 8G*a. Both are formed
// without cancellation for small arguments: with u = 1 − x,
// 1 − u^(3/2) = (1 − u³)/(1 + u^(3/2)) = x(1 + u + u²)/(1 + u√u), and with
// v = 1 − y, 1 − v^(2/3) = (1 − v²)/(1 + v^(2/3) + v^(4/3)) = y(1 + v)/(1 + c + c²), c = v^(2/3).
var Mindlin = Curve{
	F: func(x float64) float64 {
		a := math.Abs(x)
		if a >= 1 {
			return math.Copysign(1, x)
		}
		u := 1 - a
		return math.Copysign(a*(1+u+u*u)/(1+u*math.Sqrt(u)), x)
	},
	Slope: func(x float64) float64 {
		a := math.Abs(x)
		if a >= 1 {
			return 0
		}
		return 1.5 * math.Sqrt(1-a)
	},
	Inv: func(y float64) float64 {
		a := math.Abs(y)
		if a >= 1 {
			return math.Copysign(math.Inf(1), y)
		}
		v := 1 - a
		c := math.Cbrt(v * v)
		return math.Copysign(a*(1+v)/(1+c+c*c), y)
	},
}
