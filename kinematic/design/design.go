package design

import (
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// Format is the version of the file format that this package writes,
// the value of a file's "format" member. The package reads it and the
// previous version, "sixfold.design/1", whose plain numbers are SI.
const Format = "sixfold.design/2"

// formatV1 is the first version of the format: the same members, every
// plain number in its SI unit (as a version 2 file that declares
// "units": "si").
const formatV1 = "sixfold.design/1"

// Design is a whole coupling design: the Go form of a design file, with
// every quantity in SI units (m, rad, N, Pa, kg, K, Hz). [Read] and
// [Parse] make one from a file and [Design.Write] writes one; a Design
// built in Go is checked by [Design.Validate] (Write and Evaluate call it).
//
// Balls[i] sits in Seats[i]; the two lists have the same length. A zero
// optional part (a nil Thermal, a zero Requirements field) means that part
// is not given.
type Design struct {
	Name        string // a title, optional
	Description string // free text, optional

	Balls []Ball
	Seats []Seat

	Preloads []kinematic.Preload
	Payload  kinematic.Payload

	// Cases are the load cases; each needs a Name, unique in the design,
	// that requirements refer to.
	Cases []kinematic.LoadCase

	// Tolerances name dimensions as kinematic.Assembly documents them
	// ("A.Ball.Radius", "B.Seat.Turn"), with values in m or rad.
	Tolerances []kinematic.Tolerance

	// Point is the point of interest on the moving body, m; Axis an
	// optional direction there (an optical axis), zero when not given.
	Point r3.Vec
	Axis  r3.Vec

	// PointName names the point of interest in reports and drawings
	// ("mirror vertex"); "" means "point of interest".
	PointName string

	Thermal    *kinematic.Thermal
	Friction   *Friction
	MonteCarlo *MonteCarlo

	// Vibration is a random vibration test or transport the design
	// must survive; nil when not given.
	Vibration *Vibration

	// Cycles are named load cycles (operator pushes, cable pulls,
	// shocks as equivalent loads) for the hysteresis of micro-slip at
	// the contacts; nil when not given.
	Cycles []Cycle

	// Packaging and Optimize are what the optimiser may change and how
	// ([Built.Optimize]); nil when not given. Neither changes the
	// evaluation of the design as written.
	Packaging *Packaging
	Optimize  *OptimizeSettings

	Requirements Requirements
}

// Ball is one ball on the moving body.
type Ball struct {
	// Name labels the ball's pair, its contacts ("A+", "A-") and its
	// dimensions ("A.Ball.Radius"): letters, digits and "_", starting
	// with a letter; "" means a letter by position ("A", "B", ...).
	Name     string
	Centre   r3.Vec  // m
	Radius   float64 // m, > 0
	Material hertz.Material

	// Canoe marks a canoe ball (kinematic.Ball.Canoe): Radius and Centre
	// are those of the spherical segment's sphere, which may reach
	// through other balls.
	Canoe bool
}

// SeatType is the kind of a [Seat].
type SeatType int

// The seat types, as kinematic defines them. The zero SeatType is not a
// seat.
const (
	Vee       SeatType = iota + 1 // a groove of two flanks (kinematic.Vee)
	Rods                          // a groove of two parallel rods (kinematic.Rods)
	Flat                          // a plane pad (kinematic.Flat)
	Trihedral                     // a socket of three planes (kinematic.Trihedral)
	Cone                          // a conical seat (kinematic.Cone)
)

var seatTypeNames = [...]string{Vee: "vee", Rods: "rods", Flat: "flat", Trihedral: "trihedral", Cone: "cone"}

// String returns the type's name in the file: "vee", "rods", "flat",
// "trihedral" or "cone".
func (t SeatType) String() string {
	if t > 0 && int(t) < len(seatTypeNames) {
		return seatTypeNames[t]
	}
	return fmt.Sprintf("SeatType(%d)", int(t))
}

// Seat is the seat of one ball on the base. Which fields apply depends on
// Type; the others must be zero.
type Seat struct {
	Type SeatType

	// Up points out of the seat towards its ball (every type).
	Up r3.Vec

	// HalfAngle is the lean of each contact normal from the plane normal
	// to Up, rad in (0, π/2) (vee, rods, trihedral, cone).
	HalfAngle float64

	// FlankRadius is a vee's flank radius, m: 0 for flat flanks, else
	// greater than the ball's radius (a gothic arch). RodRadius is the
	// radius of a rods seat's rods, m, > 0.
	FlankRadius float64
	RodRadius   float64

	// Direction is a groove's direction (vee, rods). When it is zero the
	// groove lies at Azimuth, rad, about Up from the Reference direction
	// (kinematic.Coupling.WithGroove).
	Direction r3.Vec
	Azimuth   float64
	Reference kinematic.Reference

	// Toward is the direction in which a socket's first contact lies
	// (kinematic.Trihedral.Azimuth): required for a trihedral, optional
	// for a cone (zero: any direction).
	Toward r3.Vec

	Material hertz.Material
}

// Friction is the friction at the contacts.
type Friction struct {
	Mu float64 // Coulomb coefficient, ≥ 0
}

// MonteCarlo sets the Monte Carlo tolerance study
// (kinematic.Assembly.Study).
type MonteCarlo struct {
	Samples int    // parts drawn, in [1, 1e7]
	Seed    uint64 // the same seed gives the same result
	Exact   bool   // seat every sample exactly instead of to first order
}

// Percentile names a percentile of the Monte Carlo study's radial
// displacement (kinematic.Stats). The zero value is P99.
type Percentile int

// The percentiles of kinematic.Stats.
const (
	P99   Percentile = iota // "p99"
	P50                     // "p50"
	P95                     // "p95"
	P9973                   // "p99.73"
)

var percentileNames = [...]string{P99: "p99", P50: "p50", P95: "p95", P9973: "p99.73"}

// String returns the percentile's name in the file: "p50", "p95", "p99"
// or "p99.73".
func (p Percentile) String() string {
	if p >= 0 && int(p) < len(percentileNames) {
		return percentileNames[p]
	}
	return fmt.Sprintf("Percentile(%d)", int(p))
}

// of returns the percentile of s.
func (p Percentile) of(s kinematic.Stats) float64 {
	switch p {
	case P50:
		return s.P50
	case P95:
		return s.P95
	case P9973:
		return s.P9973
	}
	return s.P99
}

// Requirements are the limits a design must meet, each checked by
// [Evaluation.Verdicts]. A zero limit means that requirement is not set;
// a case name "" (with the zero [Cases]) means the first load case. The
// file's keys, units and defaults are in the package documentation.
type Requirements struct {
	// MinCentreIndex is the least allowed Maxwell index at the ball
	// centres (kinematic.Maxwell.CentreIndex of the weakest contact,
	// kinematic.Scorecard.WeakestCentreIndex), and MinContactIndex the
	// least allowed index at the contact points (kinematic.Maxwell.Index,
	// Scorecard.WeakestContactIndex); each in (0, 1), 0 not set.
	MinCentreIndex, MinContactIndex float64

	// MaxPressureRatio is the largest allowed ratio of peak Hertz
	// pressure to allowable pressure at any contact in any case.
	MaxPressureRatio float64

	// MinContactForce is the least allowed contact force, N, at any
	// contact in any case.
	MinContactForce float64

	// MinShock is the least shock level, m/s², that every contact must
	// survive closed, in the worst direction, added to case ShockCase.
	MinShock  float64
	ShockCase string

	// MinFrequency is the least first natural frequency, Hz, of the
	// payload on the coupling preloaded as in FrequencyCase.
	MinFrequency  float64
	FrequencyCase string

	// MaxWorst and MaxRSS bound the first-order error budget of the
	// point of interest, m (kinematic.Budget Worst and RSS; along Axis
	// with AlongAxis).
	MaxWorst  float64
	MaxRSS    float64
	AlongAxis bool

	// MaxStudy bounds the Monte Carlo study's radial displacement of the
	// point of interest at StudyPercentile, m.
	MaxStudy        float64
	StudyPercentile Percentile

	// MaxThermalDrift bounds the exact thermal drift of the point of
	// interest over Thermal.DeltaT, m.
	MaxThermalDrift float64

	// Homing requires the body to seat against the friction Friction.Mu
	// under case SeatingCase (kinematic.Model.Homing).
	Homing     bool
	HomingCase string

	// ShockCases, FrequencyCases and HomingCases check the shock, the
	// frequency and the seating in several load cases, one verdict per
	// case, in place of the single ShockCase, FrequencyCase or
	// HomingCase (which must then be ""). The zero Cases is the single
	// case.
	ShockCases, FrequencyCases, HomingCases Cases

	// ShockAnyGravity and ForceAnyGravity turn the gravity of each case
	// to its worst direction on the sphere of directions (the
	// instrument tilted or turned over), keeping its magnitude, for
	// MinShock and MinContactForce. The contact forces are linear in the
	// gravity direction, so the worst is found in closed form (see the
	// package documentation, "Gravity in any orientation").
	ShockAnyGravity, ForceAnyGravity bool

	// MaxTiltWorst and MaxTiltRSS bound the first-order error budget's
	// tilt of the moving body, rad (kinematic.Budget WorstTilt and
	// RSSTilt); MaxTiltStudy the Monte Carlo study's tilt, rad, at
	// TiltPercentile (kinematic.StudyResult.Tilt).
	MaxTiltWorst, MaxTiltRSS, MaxTiltStudy float64
	TiltPercentile                         Percentile

	// MinStiffnessAlong and MinStiffnessAcross bound the stiffness at
	// the point of interest, N/m, along Axis (1/Compliance.Along(Axis))
	// and across it (the least over the directions normal to Axis),
	// under StiffnessCases (the zero Cases: the first case).
	MinStiffnessAlong, MinStiffnessAcross float64
	StiffnessCases                        Cases

	// MinPreloadMargin is the least factor, ≥ 1, by which the preload as
	// given must sit inside its window (kinematic.Model.SizePreload):
	// MinScale·factor ≤ 1 and factor ≤ MaxScale. PreloadMinForce is the
	// least contact force, N, that defines the window's lower edge, and
	// PreloadCases the cases sized together (the zero Cases: every
	// case).
	MinPreloadMargin float64
	PreloadMinForce  float64
	PreloadCases     Cases

	// MaxRepeatWorst and MaxRepeatRSS bound the friction repeatability
	// of the point of interest, m (kinematic.Model.Repeatability Worst
	// and RSS with Friction.Mu), under RepeatCases (the zero Cases: the
	// first case).
	MaxRepeatWorst, MaxRepeatRSS float64
	RepeatCases                  Cases

	// MinRandomMargin is the least margin of every contact in the
	// design's Vibration along each of its axes: static force over RMS
	// dynamic force, the number of standard deviations at which the
	// contact opens (kinematic.RandomContact.Margin); a pure number > 0.
	// MaxRandomDisplacement bounds the RMS displacement of the point of
	// interest relative to the base along each axis, m
	// (kinematic.Random.Displacement). MaxRandomOpenings bounds, along
	// each axis, the expected number of times the most exposed contact
	// opens during the test (kinematic.RandomContact.Openings, Rice's
	// down-crossings of zero force in Vibration.Duration); a pure
	// number > 0, for example 0.01 for about a 1 % chance that a contact
	// opens at all. A margin of 3 alone does not keep a contact shut:
	// with modes near 1 kHz and a ten-minute test, 3 σ is crossed
	// hundreds of times. All three need Vibration.
	MinRandomMargin, MaxRandomDisplacement, MaxRandomOpenings float64

	// MaxHysteresis bounds the residual displacement of the point of
	// interest after load cycle HysteresisCycle ("" the first) added to
	// case HysteresisCase ("" the first), m, and MaxHysteresisTilt the
	// residual tilt, rad (kinematic.Model.Hysteresis with Friction.Mu).
	MaxHysteresis, MaxHysteresisTilt float64
	HysteresisCycle, HysteresisCase  string
}

// Cases names the load cases a requirement is checked in: every case of
// the design when All is set, else the cases Names lists, each once. The
// zero Cases means the requirement's default, which its documentation
// states.
type Cases struct {
	All   bool
	Names []string
}

// zero reports whether c is the zero Cases.
func (c Cases) zero() bool { return !c.All && len(c.Names) == 0 }

var zeroVec r3.Vec

// pointLabel returns the point of interest's name for notes and reports:
// PointName, or "point of interest".
func (d *Design) pointLabel() string {
	if d.PointName != "" {
		return d.PointName
	}
	return "point of interest"
}
