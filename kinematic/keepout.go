package kinematic

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// KeepOut is an obstacle on the base that a groove must not point at, for
// example a cable pass-through or a coolant port: a groove whose line
// runs within Clearance of the direction from its ball to the obstacle
// would run into it. Directions are seen along the seat's Up, as
// [KeepOutWindows] documents.
type KeepOut struct {
	Name string // for the caller's report; not used here

	// At is the obstacle's position, m.
	At r3.Vec

	// Reach, m, limits the obstacle to the grooves of balls nearer to it
	// than Reach, measured normal to the seat's Up; 0 means every groove.
	Reach float64

	// Clearance is the least angle, rad, in [0, π/2), between a groove
	// and the direction from its ball to the obstacle.
	Clearance float64
}

// KeepOutWindows returns, for each pair of c, the largest window of
// groove azimuths, rad from [FrameX] about the seat's Up, that keeps the
// groove (a [Vee] or [Rods]) at least each obstacle's Clearance off the
// line from its ball to every obstacle within the obstacle's Reach. The
// windows are meant for [OptimizeOptions.Windows].
//
// The direction from a ball at b to an obstacle at q is q − b projected
// normal to Up, at azimuth θ = atan2(Up·(x × d), x·d) from the FrameX
// axis x. A groove is a line, so azimuths are taken modulo π: the
// obstacle forbids the arc [θ − Clearance, θ + Clearance] and the window
// is the longest arc of the circle of azimuths modulo π that no forbidden
// arc covers (of equals, the first counted from the forbidden arc that
// starts lowest, with θ in [0, π)). A window starts where a forbidden arc
// ends, Min in [0, 3π/2), and Max − Min is less than π. Seats that are
// not grooves, and grooves that no obstacle reaches, get the window of
// every azimuth, [−π/2, π/2]. An obstacle right above or below a ball (no direction
// normal to Up) forbids nothing.
//
// Errors are [*InputError] values: the coupling's, "obstacles[i].At"
// (ErrNonFinite), "obstacles[i].Reach" or "obstacles[i].Clearance"
// (ErrRange, ErrNonFinite), and "Pairs[i].Seat" with ErrRange when the
// obstacles leave a groove no azimuth.
func KeepOutWindows(c Coupling, obstacles []KeepOut) ([]Window, error) {
	if _, err := c.Contacts(); err != nil {
		return nil, err
	}
	for i, o := range obstacles {
		f := indexed("obstacles", i)
		switch {
		case !linalg.Finite3(o.At):
			return nil, &InputError{Field: f + ".At", Err: fmt.Errorf("%w: %v", ErrNonFinite, o.At)}
		case math.IsNaN(o.Reach) || math.IsInf(o.Reach, 0):
			return nil, &InputError{Field: f + ".Reach", Err: fmt.Errorf("%w: %g", ErrNonFinite, o.Reach)}
		case o.Reach < 0:
			return nil, &InputError{Field: f + ".Reach", Err: fmt.Errorf("%w: must be ≥ 0 (0: any distance), got %g m", ErrRange, o.Reach)}
		case !(o.Clearance >= 0 && o.Clearance < math.Pi/2):
			return nil, &InputError{Field: f + ".Clearance", Err: fmt.Errorf("%w: must be in [0, π/2) rad, got %g", ErrRange, o.Clearance)}
		}
	}
	wins := make([]Window, len(c.Pairs))
	for i, p := range c.Pairs {
		wins[i] = Window{Min: -math.Pi / 2, Max: math.Pi / 2, From: FrameX}
		var up r3.Vec
		switch s := p.Seat.(type) {
		case Vee:
			up = s.Up
		case Rods:
			up = s.Up
		default:
			continue
		}
		up, _ = linalg.Unit3(up) // Contacts checked it
		x := frameX(up)
		var arcs []arc
		for _, o := range obstacles {
			d := r3.Sub(o.At, p.Ball.Centre)
			d = r3.Sub(d, r3.Scale(r3.Dot(d, up), up))
			dist := linalg.Norm3(d)
			if dist == 0 || o.Reach > 0 && dist > o.Reach {
				continue
			}
			az := math.Atan2(r3.Dot(up, r3.Cross(x, d)), r3.Dot(x, d))
			az = math.Mod(az+2*math.Pi, math.Pi)
			arcs = append(arcs, arc{az - o.Clearance, az + o.Clearance})
		}
		if len(arcs) == 0 {
			continue
		}
		lo, width := largestGap(arcs)
		if !(width > 0) {
			return nil, &InputError{Field: pairField(i) + ".Seat", Err: fmt.Errorf("%w: the obstacles leave the groove no azimuth", ErrRange)}
		}
		wins[i] = Window{Min: lo, Max: lo + width, From: FrameX}
	}
	return wins, nil
}

// arc is a closed arc of azimuths [lo, hi], rad.
type arc struct{ lo, hi float64 }

// largestGap returns the start and length of the longest open arc of the
// circle of azimuths modulo π that none of arcs covers (length ≤ 0 when
// they cover it all). The arcs, each shorter than π, are laid out twice,
// the second time shifted by π, sorted by start and merged; every gap of
// the circle then shows once between merged arcs with its start in
// [s₀, s₀ + π), s₀ the lowest start.
func largestGap(arcs []arc) (lo, width float64) {
	all := make([]arc, 0, 2*len(arcs))
	for _, a := range arcs {
		all = append(all, a, arc{a.lo + math.Pi, a.hi + math.Pi})
	}
	sort.Slice(all, func(i, j int) bool { return all[i].lo < all[j].lo })
	s0 := all[0].lo
	width = math.Inf(-1)
	end := all[0].hi
	for _, a := range all[1:] {
		if a.lo > end && end < s0+math.Pi {
			if w := a.lo - end; w > width {
				lo, width = end, w
			}
		}
		end = math.Max(end, a.hi)
	}
	return lo, width
}
