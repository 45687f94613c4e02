package design

// The writer of the requirements that reqs_read.go reads.

type wireMaxTilt struct {
	WorstCase  float64 `json:"worst_case,omitempty"`
	RSS        float64 `json:"rss,omitempty"`
	Study      float64 `json:"study,omitempty"`
	Percentile string  `json:"percentile,omitempty"`
}

type wireStiffness struct {
	Along  float64 `json:"along_axis,omitempty"`
	Across float64 `json:"across_axis,omitempty"`
	Cases  any     `json:"cases,omitempty"`
}

type wireMargin struct {
	Factor   float64 `json:"factor"`
	MinForce float64 `json:"min_force"`
	Cases    any     `json:"cases,omitempty"`
}

type wireRepeat struct {
	WorstCase float64 `json:"worst_case,omitempty"`
	RSS       float64 `json:"rss,omitempty"`
	Cases     any     `json:"cases,omitempty"`
}

type wireForce struct {
	Limit float64 `json:"limit"`
	Any   bool    `json:"gravity_any_orientation"`
}

// wireCases returns the file's form of cs: nil (left out) for the zero
// Cases, "all", or the names.
func wireCases(cs Cases) any {
	switch {
	case cs.All:
		return "all"
	case len(cs.Names) > 0:
		return cs.Names
	}
	return nil
}

// wireMore sets the members of wr for the requirements of reqs_read.go.
func (r Requirements) wireMore(wr *wireRequirements) {
	switch {
	case r.ForceAnyGravity:
		wr.MinContactForce = wireForce{Limit: r.MinContactForce, Any: true}
	case r.MinContactForce > 0:
		wr.MinContactForce = r.MinContactForce
	}
	if r.MaxTiltWorst > 0 || r.MaxTiltRSS > 0 || r.MaxTiltStudy > 0 {
		wt := &wireMaxTilt{WorstCase: r.MaxTiltWorst, RSS: r.MaxTiltRSS, Study: r.MaxTiltStudy}
		if r.MaxTiltStudy > 0 {
			wt.Percentile = r.TiltPercentile.String()
		}
		wr.MaxTilt = wt
	}
	if r.MinStiffnessAlong > 0 || r.MinStiffnessAcross > 0 {
		wr.MinStiffness = &wireStiffness{Along: r.MinStiffnessAlong, Across: r.MinStiffnessAcross, Cases: wireCases(r.StiffnessCases)}
	}
	if r.MinPreloadMargin > 0 {
		wr.PreloadMargin = &wireMargin{Factor: r.MinPreloadMargin, MinForce: r.PreloadMinForce, Cases: wireCases(r.PreloadCases)}
	}
	wr.Hysteresis = r.wireHysteresis()
	if r.MaxRepeatWorst > 0 || r.MaxRepeatRSS > 0 {
		wr.Repeatability = &wireRepeat{WorstCase: r.MaxRepeatWorst, RSS: r.MaxRepeatRSS, Cases: wireCases(r.RepeatCases)}
	}
}
