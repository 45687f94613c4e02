package drawing

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/kinematic"
)

// Options are the words and settings of a drawing. The zero value, and a
// nil *Options, draw with the defaults each field names.
type Options struct {
	// Title is the drawing's title; "" gives one that names what it
	// shows.
	Title string

	// Notes are lines of text under the drawing, after its own.
	Notes []string

	// PointName names the point of interest in labels and legends, for
	// example "mirror vertex"; "" means "point of interest".
	PointName string

	// FaceHeight is the height, m, above the highest ball centre of the
	// face that a lift-off map pushes on; 0 means the height of the
	// point of interest.
	FaceHeight float64

	// Format is the output format of a ready figure: "svg" (also ""),
	// "png" or "pdf".
	Format string

	// KeepOuts are packaging obstacles a plan draws, each with the
	// directions from every ball within its Reach that its Clearance
	// forbids; Windows are the allowed groove azimuths, one per pair in
	// the coupling's order (kinematic.KeepOutWindows gives both), drawn
	// as fans at the balls. Plan only; nil draws none.
	KeepOuts []kinematic.KeepOut
	Windows  []kinematic.Window

	// OffAxes lists in a plan's notes the instantaneous axes of seat
	// pairs that cross the plan far off the drawing; false leaves them
	// out.
	OffAxes bool

	// Limit is a requirement's limit on the drawn quantity in SI units
	// (m for a histogram of displacement), drawn as a line; 0 draws none.
	// LimitName labels it; "" means "limit".
	Limit     float64
	LimitName string
}

// orDefault returns *o, or the zero Options for nil.
func (o *Options) orDefault() Options {
	if o == nil {
		return Options{}
	}
	return *o
}

// pointName returns the name of the point of interest.
func (o Options) pointName() string {
	if o.PointName == "" {
		return "point of interest"
	}
	return o.PointName
}

// limitName returns the name of the limit.
func (o Options) limitName() string {
	if o.LimitName == "" {
		return "limit"
	}
	return o.LimitName
}

// title returns the title, or def when none is set.
func (o Options) title(def string) string {
	if o.Title == "" {
		return def
	}
	return o.Title
}

// notes returns the drawing's own notes followed by the caller's.
func (o Options) notes(own ...string) []string {
	return append(own, o.Notes...)
}

// bounds returns the lower-left and upper-right corners of the ball
// centres in plan.
func bounds(c kinematic.Coupling) (lo, hi r3.Vec) {
	lo, hi = r3.Vec{X: math.Inf(1), Y: math.Inf(1)}, r3.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, p := range c.Pairs {
		lo.X, lo.Y = math.Min(lo.X, p.Ball.Centre.X), math.Min(lo.Y, p.Ball.Centre.Y)
		hi.X, hi.Y = math.Max(hi.X, p.Ball.Centre.X), math.Max(hi.Y, p.Ball.Centre.Y)
	}
	return lo, hi
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// pairName returns the name of pair i, or a letter by position ("A",
// "B", ..., then "P27", ...) as package kinematic labels an unnamed pair.
func pairName(c kinematic.Coupling, i int) string {
	if n := c.Pairs[i].Name; n != "" {
		return n
	}
	if i < 26 {
		return string(rune('A' + i))
	}
	return fmt.Sprintf("P%d", i+1)
}
