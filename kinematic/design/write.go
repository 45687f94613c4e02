package design

import (
	"bytes"
	"encoding/json"
	"io"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/hertz"
	"github.com/sixfold-dev/sixfold/kinematic"
)

// Write writes the design in the canonical form of the format: the
// current version with the declaration "units": "si" and plain SI numbers
// (each the shortest decimal that reads back as the same float64), members in the order of the format's documentation, material
// keys for materials equal to a table entry, optional members left out
// when they are zero, two-space indentation with short objects and
// vectors on one line. Reading what Write wrote
// gives a Design equal to d. Write checks d first as by
// [Design.Validate] and writes nothing if it is not valid.
func (d *Design) Write(w io.Writer) error {
	if err := d.Validate(); err != nil {
		return err
	}
	compact, err := json.Marshal(d.wire())
	if err != nil {
		return &Error{Err: err}
	}
	// The compact form is well formed and within the reader's bounds
	// (the design is), so it parses.
	root, err := parseTree(compact)
	if err != nil {
		return &Error{Err: err}
	}
	var buf bytes.Buffer
	layout(&buf, root, 0)
	buf.WriteByte('\n')
	if _, err := w.Write(buf.Bytes()); err != nil {
		return &Error{Err: err}
	}
	return nil
}

// The wire types give the canonical file's members and their order.

type vec [3]float64

func wireVec(v r3.Vec) vec { return vec{v.X, v.Y, v.Z} }

// optVec returns nil for a zero vector, which is then left out.
func optVec(v r3.Vec) *vec {
	if v == zeroVec {
		return nil
	}
	w := wireVec(v)
	return &w
}

type wireDesign struct {
	Format       string            `json:"format"`
	Units        string            `json:"units"`
	Name         string            `json:"name,omitempty"`
	Description  string            `json:"description,omitempty"`
	Balls        []wireBall        `json:"balls"`
	Seats        []wireSeat        `json:"seats"`
	Preloads     []wirePreload     `json:"preloads,omitempty"`
	Payload      *wirePayload      `json:"payload,omitempty"`
	Cases        []wireCase        `json:"cases,omitempty"`
	Tolerances   []wireTolerance   `json:"tolerances,omitempty"`
	Point        vec               `json:"point_of_interest"`
	PointName    string            `json:"point_name,omitempty"`
	Axis         *vec              `json:"axis,omitempty"`
	Thermal      *wireThermal      `json:"thermal,omitempty"`
	Friction     *wireFriction     `json:"friction,omitempty"`
	MonteCarlo   *wireMonteCarlo   `json:"monte_carlo,omitempty"`
	Vibration    *wireVibration    `json:"vibration,omitempty"`
	Cycles       []wireCycle       `json:"cycles,omitempty"`
	Packaging    *wirePackaging    `json:"packaging,omitempty"`
	Optimize     *wireOptimize     `json:"optimize,omitempty"`
	Requirements *wireRequirements `json:"requirements,omitempty"`
}

type wireBall struct {
	Name     string  `json:"name,omitempty"`
	Centre   vec     `json:"centre"`
	Radius   float64 `json:"radius"`
	Canoe    bool    `json:"canoe,omitempty"`
	Material any     `json:"material"`
}

type wireMaterial struct {
	Name      string  `json:"name,omitempty"`
	E         float64 `json:"e"`
	Nu        float64 `json:"nu"`
	Alpha     float64 `json:"alpha,omitempty"`
	Allowable float64 `json:"allowable,omitempty"`
	Source    string  `json:"source,omitempty"`
}

type wireSeat struct {
	Type        string   `json:"type"`
	Up          vec      `json:"up"`
	HalfAngle   *float64 `json:"half_angle,omitempty"`
	FlankRadius float64  `json:"flank_radius,omitempty"`
	RodRadius   *float64 `json:"rod_radius,omitempty"`
	Direction   *vec     `json:"direction,omitempty"`
	Azimuth     *float64 `json:"azimuth,omitempty"`
	Reference   string   `json:"reference,omitempty"`
	Toward      *vec     `json:"toward,omitempty"`
	Material    any      `json:"material"`
}

type wirePreload struct {
	Name      string  `json:"name,omitempty"`
	Point     vec     `json:"point"`
	Direction *vec    `json:"direction,omitempty"`
	Force     float64 `json:"force"`
	Rate      float64 `json:"rate,omitempty"`
	Couple    *vec    `json:"couple,omitempty"`

	Magnet      *wireMagnet  `json:"magnet,omitempty"`
	MagnetPlate *wireMagnet  `json:"magnet_plate,omitempty"`
	Table       [][2]float64 `json:"table,omitempty"`
	Gap         *float64     `json:"gap,omitempty"`
}

type wirePayload struct {
	Mass    float64      `json:"mass"`
	Centre  vec          `json:"centre"`
	Inertia *wireInertia `json:"inertia,omitempty"`
}

type wireInertia struct {
	XX float64 `json:"xx"`
	YY float64 `json:"yy"`
	ZZ float64 `json:"zz"`
	XY float64 `json:"xy"`
	XZ float64 `json:"xz"`
	YZ float64 `json:"yz"`
}

type wireCase struct {
	Name         string        `json:"name"`
	Preload      float64       `json:"preload"`
	Gravity      vec           `json:"gravity"`
	Acceleration *vec          `json:"acceleration,omitempty"`
	Applied      []wireApplied `json:"applied,omitempty"`
}

type wireApplied struct {
	Force  vec  `json:"force"`
	Moment *vec `json:"moment,omitempty"`
}

type wireTolerance struct {
	Dimension    string  `json:"dimension"`
	Value        float64 `json:"value"`
	Distribution string  `json:"distribution"`
}

type wireThermal struct {
	DeltaT  float64 `json:"delta_t"`
	Moving  float64 `json:"moving_alpha"`
	Base    float64 `json:"base_alpha"`
	BaseRef *vec    `json:"base_ref,omitempty"`
}

type wireFriction struct {
	Mu float64 `json:"mu"`
}

type wireMonteCarlo struct {
	Samples int    `json:"samples"`
	Seed    uint64 `json:"seed"`
	Exact   bool   `json:"exact,omitempty"`
}

type wireRequirements struct {
	MinCentreIndex   float64         `json:"min_centre_index,omitempty"`
	MinContactIndex  float64         `json:"min_contact_index,omitempty"`
	MaxPressureRatio float64         `json:"max_pressure_ratio,omitempty"`
	MinContactForce  any             `json:"min_contact_force,omitempty"`
	MinShock         *wireLimitCase  `json:"min_shock,omitempty"`
	MinFrequency     *wireLimitCase  `json:"min_frequency,omitempty"`
	MaxError         *wireMaxError   `json:"max_error,omitempty"`
	MaxStudy         *wireMaxStudy   `json:"max_study,omitempty"`
	MaxThermalDrift  float64         `json:"max_thermal_drift,omitempty"`
	Seating          *wireSeating    `json:"seating,omitempty"`
	MaxTilt          *wireMaxTilt    `json:"max_tilt,omitempty"`
	MinStiffness     *wireStiffness  `json:"min_stiffness,omitempty"`
	PreloadMargin    *wireMargin     `json:"min_preload_margin,omitempty"`
	Repeatability    *wireRepeat     `json:"max_repeatability,omitempty"`
	MinRandomMargin  float64         `json:"min_random_margin,omitempty"`
	MaxRandomDisp    float64         `json:"max_random_displacement,omitempty"`
	MaxRandomOpen    float64         `json:"max_random_openings,omitempty"`
	Hysteresis       *wireHysteresis `json:"max_hysteresis,omitempty"`
}

// wireLimitCase is min_shock ({level, case}) or min_frequency ({limit,
// case}); one of Level and Limit is set.
type wireLimitCase struct {
	Level float64 `json:"level,omitempty"`
	Limit float64 `json:"limit,omitempty"`
	Case  string  `json:"case,omitempty"`
	Cases any     `json:"cases,omitempty"`
	Any   bool    `json:"gravity_any_orientation,omitempty"`
}

type wireMaxError struct {
	WorstCase float64 `json:"worst_case,omitempty"`
	RSS       float64 `json:"rss,omitempty"`
	AlongAxis bool    `json:"along_axis,omitempty"`
}

type wireMaxStudy struct {
	Limit      float64 `json:"limit"`
	Percentile string  `json:"percentile"`
}

type wireSeating struct {
	Case  string `json:"case,omitempty"`
	Cases any    `json:"cases,omitempty"`
}

func wireMat(m hertz.Material) any {
	if k, ok := keyOf(m); ok {
		return k
	}
	return wireMaterial{Name: m.Name, E: m.E, Nu: m.Nu, Alpha: m.Alpha, Allowable: m.Allowable, Source: m.Source}
}

func ptr(v float64) *float64 { return &v }

// wire returns the canonical file of a valid design.
func (d *Design) wire() wireDesign {
	w := wireDesign{Format: Format, Units: "si", Name: d.Name, Description: d.Description, Point: wireVec(d.Point), Axis: optVec(d.Axis)}
	for _, b := range d.Balls {
		w.Balls = append(w.Balls, wireBall{Name: b.Name, Centre: wireVec(b.Centre), Radius: b.Radius, Canoe: b.Canoe, Material: wireMat(b.Material)})
	}
	for _, s := range d.Seats {
		ws := wireSeat{Type: s.Type.String(), Up: wireVec(s.Up), FlankRadius: s.FlankRadius, Toward: optVec(s.Toward), Material: wireMat(s.Material)}
		if s.Type != Flat {
			ws.HalfAngle = ptr(s.HalfAngle)
		}
		if s.Type == Rods {
			ws.RodRadius = ptr(s.RodRadius)
		}
		if s.Type == Vee || s.Type == Rods {
			if s.Direction != zeroVec {
				ws.Direction = optVec(s.Direction)
			} else {
				ws.Azimuth = ptr(s.Azimuth)
				ws.Reference = "radial"
				if s.Reference == kinematic.FrameX {
					ws.Reference = "frame_x"
				}
			}
		}
		w.Seats = append(w.Seats, ws)
	}
	for _, p := range d.Preloads {
		wp := wirePreload{Name: p.Name, Point: wireVec(p.Point), Direction: optVec(p.Direction),
			Force: p.Force, Rate: p.Rate, Couple: optVec(p.Couple)}
		wireLaw(&wp, p)
		w.Preloads = append(w.Preloads, wp)
	}
	if p := d.Payload; p != (kinematic.Payload{}) {
		wp := &wirePayload{Mass: p.Mass, Centre: wireVec(p.Centre)}
		if j := p.Inertia; j != ([3][3]float64{}) {
			wp.Inertia = &wireInertia{XX: j[0][0], YY: j[1][1], ZZ: j[2][2], XY: j[0][1], XZ: j[0][2], YZ: j[1][2]}
		}
		w.Payload = wp
	}
	for _, lc := range d.Cases {
		factor := lc.PreloadFactor
		switch {
		case lc.NoPreload:
			factor = 0
		case factor == 0:
			factor = 1
		}
		wc := wireCase{Name: lc.Name, Preload: factor, Gravity: wireVec(lc.Gravity), Acceleration: optVec(lc.Acceleration)}
		for _, a := range lc.Applied {
			wc.Applied = append(wc.Applied, wireApplied{Force: wireVec(a.F), Moment: optVec(a.M)})
		}
		w.Cases = append(w.Cases, wc)
	}
	for _, t := range d.Tolerances {
		dist, value := "uniform", t.HalfWidth
		if t.Sigma != 0 {
			dist, value = "normal", t.Sigma
		}
		w.Tolerances = append(w.Tolerances, wireTolerance{Dimension: t.Dimension, Value: value, Distribution: dist})
	}
	if th := d.Thermal; th != nil {
		w.Thermal = &wireThermal{DeltaT: th.DeltaT, Moving: th.Moving, Base: th.Base, BaseRef: optVec(th.BaseRef)}
	}
	if f := d.Friction; f != nil {
		w.Friction = &wireFriction{Mu: f.Mu}
	}
	if mc := d.MonteCarlo; mc != nil {
		w.MonteCarlo = &wireMonteCarlo{Samples: mc.Samples, Seed: mc.Seed, Exact: mc.Exact}
	}
	w.Vibration = d.wireVibration()
	w.Cycles = d.wireCycles()
	d.wireStudy(&w)
	if r := d.Requirements; !r.isZero() {
		wr := &wireRequirements{MinCentreIndex: r.MinCentreIndex, MinContactIndex: r.MinContactIndex, MaxPressureRatio: r.MaxPressureRatio,
			MaxThermalDrift: r.MaxThermalDrift, MinRandomMargin: r.MinRandomMargin, MaxRandomDisp: r.MaxRandomDisplacement,
			MaxRandomOpen: r.MaxRandomOpenings}
		if r.MinShock > 0 {
			wr.MinShock = &wireLimitCase{Level: r.MinShock, Case: r.ShockCase, Cases: wireCases(r.ShockCases), Any: r.ShockAnyGravity}
		}
		if r.MinFrequency > 0 {
			wr.MinFrequency = &wireLimitCase{Limit: r.MinFrequency, Case: r.FrequencyCase, Cases: wireCases(r.FrequencyCases)}
		}
		r.wireMore(wr)
		if r.MaxWorst > 0 || r.MaxRSS > 0 {
			wr.MaxError = &wireMaxError{WorstCase: r.MaxWorst, RSS: r.MaxRSS, AlongAxis: r.AlongAxis}
		}
		if r.MaxStudy > 0 {
			wr.MaxStudy = &wireMaxStudy{Limit: r.MaxStudy, Percentile: r.StudyPercentile.String()}
		}
		if r.Homing {
			wr.Seating = &wireSeating{Case: r.HomingCase, Cases: wireCases(r.HomingCases)}
		}
		w.Requirements = wr
	}
	return w
}

// lineWidth is the longest one-line rendering of an object or array of
// scalars that layout keeps on one line.
const lineWidth = 100

// layout writes n indented by depth levels of two spaces: objects and
// arrays one member a line, except those that hold only scalars (or
// arrays of scalars) and fit on one line.
func layout(b *bytes.Buffer, n *node, depth int) {
	if s, ok := oneLine(n); ok && (len(s)+2*depth <= lineWidth || n.kind != objectNode && n.kind != arrayNode) {
		b.WriteString(s)
		return
	}
	pad := strings.Repeat("  ", depth+1)
	open, close := "[", "]"
	if n.kind == objectNode {
		open, close = "{", "}"
	}
	b.WriteString(open + "\n")
	for i, v := range n.vals {
		b.WriteString(pad)
		if n.kind == objectNode {
			b.WriteString(quote(n.keys[i]) + ": ")
		}
		layout(b, v, depth+1)
		if i < len(n.vals)-1 {
			b.WriteByte(',')
		}
		b.WriteByte('\n')
	}
	b.WriteString(pad[2:] + close)
}

// oneLine returns n on one line, and whether it is simple enough for
// that: a scalar, or an object or array of scalars and arrays of scalars.
func oneLine(n *node) (string, bool) {
	switch n.kind {
	case nullNode:
		return "null", true
	case boolNode:
		if n.b {
			return "true", true
		}
		return "false", true
	case numberNode:
		return n.text, true
	case stringNode:
		return quote(n.text), true
	}
	parts := make([]string, len(n.vals))
	for i, v := range n.vals {
		if (v.kind == objectNode || v.kind == arrayNode) && (n.kind == arrayNode || v.kind == objectNode) {
			return "", false
		}
		s, ok := oneLine(v)
		if !ok {
			return "", false
		}
		if n.kind == objectNode {
			s = quote(n.keys[i]) + ": " + s
		}
		parts[i] = s
	}
	if n.kind == objectNode {
		return "{" + strings.Join(parts, ", ") + "}", true
	}
	return "[" + strings.Join(parts, ", ") + "]", true
}

// quote returns s as a JSON string, without escaping "<", ">" and "&".
func quote(s string) string {
	var b bytes.Buffer
	e := json.NewEncoder(&b)
	e.SetEscapeHTML(false)
	_ = e.Encode(s) // a string always encodes
	return strings.TrimSuffix(b.String(), "\n")
}
