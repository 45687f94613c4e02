package kinematic

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Assembly is a coupling described by its real geometry: the balls on the
// moving body and every seat surface in the base frame, with the named
// dimensions that an error budget varies. Make one with
// [Coupling.Assembly]; it is not modified by its methods, which may be
// called from several goroutines at once.
//
// # Dimensions
//
// A dimension is a deviation from the nominal geometry, in m or rad, named
// "<pair>.<part>" with the pair's name (its letter by default):
//
//	A.Ball.Radius          the ball's radius
//	A.Ball.X, .Y, .Z       the ball's centre on the moving body
//	A.Seat.X, .Y, .Z       the whole seat moved in the base frame
//	A.Seat.Turn            a vee or rods turned about Up through the ball's nominal centre (rad)
//	A.Seat.Tilt            a vee or rods pitched about the horizontal normal to the groove, through its root (rad)
//	A.Seat.HalfAngle       a vee's flanks, or a socket's faces, each turned about its root line to widen the half-angle (rad)
//	A.Seat.Flank+, Flank-  one flank of a vee moved along its normal towards the ball
//	A.Seat.FlankRadius+, - a gothic-arch flank's radius
//	A.Seat.Rod+, Rod-      one rod moved along its contact normal towards the ball
//	A.Seat.RodRadius+, -   one rod's radius
//	A.Seat.Height          a flat moved along its Up
//	A.Seat.Tilt1, Tilt2    a flat tilted about two horizontal axes through its contact point (rad; no first-order effect)
//	A.Seat.Face1, 2, 3     one face of a socket moved along its normal towards the ball
//
// A cone stands as its three tangent planes, which seat a ball exactly as
// the cone does (the ball's centre lies on the axis, r/sin α from the
// apex, either way); a socket's root is its apex. "Towards the ball" is
// positive: a flank moved by +e stands e high, and the gap it makes is e.
type Assembly struct {
	pairs  []assemblyPair
	conts  []assemblyContact
	dims   []dimension
	index  map[string]int
	origin r3.Vec  // the contacts' centroid
	size   float64 // their RMS distance from it
	nom    Analysis
	freed  [6]screw.Twist // at nominal, about origin
	lines  [6]line        // at nominal, about origin
}

type assemblyPair struct {
	name  string
	ball  Ball
	surfs []seatSurface
	root  r3.Vec  // the seat's reference point in the base frame: a groove's root under the ball, a socket's apex, a flat's contact point
	alpha float64 // the seat's expansion coefficient, 1/K
}

type assemblyContact struct {
	pair, surf int
	label      string
}

// Assembly returns the coupling's real geometry with its named
// dimensions, at the nominal (every ball seated as drawn). The coupling
// must be exactly constrained: six independent contacts. Errors are those
// of [Coupling.Contacts] and [Analyze], and an [*InputError] wrapping
// [ErrNotExact] otherwise.
func (c Coupling) Assembly() (*Assembly, error) {
	cs, err := c.Contacts()
	if err != nil {
		return nil, err
	}
	an, err := Analyze(cs)
	if err != nil {
		return nil, c.inPairTerms(err, cs)
	}
	if len(cs) != 6 || an.Rank != 6 {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf(
			"%w: %d contacts of rank %d; an assembly's seated pose needs six independent contacts", ErrNotExact, len(cs), an.Rank)}
	}
	a := &Assembly{index: map[string]int{}, origin: an.origin, nom: an}
	if !freedOf(an.contacts(), &a.freed) {
		return nil, &InputError{Field: "Pairs", Err: fmt.Errorf("%w: the six contacts are singular to working precision", ErrNotExact)}
	}
	copy(a.lines[:], an.contacts())
	var s2 float64
	for _, l := range a.lines {
		s2 += r3.Norm2(l.p)
	}
	a.size = math.Sqrt(s2 / 6)
	k := 0
	for i, p := range c.Pairs {
		name := pairName(p.Name, i)
		surfs, dims, root, alpha := p.Seat.surfaces(p.Ball, cs[k:k+p.Seat.count()])
		ap := assemblyPair{name: name, ball: p.Ball, surfs: surfs, root: root, alpha: alpha}
		for j := range surfs {
			a.conts = append(a.conts, assemblyContact{pair: i, surf: j, label: cs[k+j].Label})
		}
		k += p.Seat.count()
		a.pairs = append(a.pairs, ap)
		for _, d := range ballDimensions(name) {
			d.pair = i
			a.add(d)
		}
		for _, d := range dims {
			d.name = name + ".Seat." + d.name
			d.pair = i
			a.add(d)
		}
	}
	return a, nil
}

// check returns an error for a nil Assembly or the zero Assembly (one not
// made by [Coupling.Assembly]), which has no contacts to seat.
func (a *Assembly) check() error {
	if a == nil || len(a.conts) != 6 {
		return &InputError{Field: "a", Err: fmt.Errorf("%w: the zero Assembly has no geometry: make an Assembly with Coupling.Assembly", ErrDegenerate)}
	}
	return nil
}

func (a *Assembly) add(d dimension) {
	a.index[d.name] = len(a.dims)
	a.dims = append(a.dims, d)
}

func ballDimensions(name string) []dimension {
	return []dimension{
		{name: name + ".Ball.Radius", kind: ballRadius},
		{name: name + ".Ball.X", kind: ballCentre, axis: r3.Vec{X: 1}},
		{name: name + ".Ball.Y", kind: ballCentre, axis: r3.Vec{Y: 1}},
		{name: name + ".Ball.Z", kind: ballCentre, axis: r3.Vec{Z: 1}},
	}
}

// Dimensions returns the names of the assembly's dimensions, pair by
// pair: the ball's, then the seat's; nil for a nil or zero Assembly.
func (a *Assembly) Dimensions() []string {
	if a.check() != nil {
		return nil
	}
	out := make([]string, len(a.dims))
	for i, d := range a.dims {
		out[i] = d.name
	}
	return out
}

// Deviation is the deviation of one named dimension from nominal, in m or
// rad (see [Assembly]).
type Deviation struct {
	Dimension string
	Value     float64
}

// lookup returns the index of a dimension, or an error naming field.
func (a *Assembly) lookup(name, field string) (int, error) {
	i, ok := a.index[name]
	if !ok {
		// The names a caller could have meant: the pair's dimensions, or
		// the pairs when the pair itself is unknown (a design file's
		// reader has no Assembly to ask).
		pair, _, _ := strings.Cut(name, ".")
		var names []string
		for _, d := range a.dims {
			if a.pairs[d.pair].name == pair {
				names = append(names, d.name)
			}
		}
		hint := fmt.Sprintf(" (pair %s has %s)", pair, strings.Join(names, ", "))
		if len(names) == 0 {
			pairs := make([]string, len(a.pairs))
			for k := range a.pairs {
				pairs[k] = a.pairs[k].name
			}
			hint = fmt.Sprintf(" (a dimension is named pair.part.quantity, with the pairs %s)", strings.Join(pairs, ", "))
		}
		return 0, &InputError{Field: field, Err: fmt.Errorf("%w: no dimension %q%s", ErrRange, name, hint)}
	}
	return i, nil
}

// effects returns ∂gᵢ/∂v for the six contacts: how far each contact's gap
// opens per unit of dimension d, at the nominal.
func (a *Assembly) effects(d *dimension, out *[6]float64) {
	*out = [6]float64{}
	for i, c := range a.conts {
		if c.pair != d.pair {
			continue
		}
		l := &a.lines[i]
		switch d.kind {
		case ballRadius:
			out[i] = -1
		case ballCentre:
			out[i] = r3.Dot(l.n, d.axis)
		case surfaceRadius:
			if c.surf == d.surf {
				if a.pairs[c.pair].surfs[c.surf].kind == convexCylinder {
					out[i] = -1
				} else {
					out[i] = 1
				}
			}
		case seatMotion:
			p := r3.Add(l.p, a.origin) // the contact point in the base frame
			for _, m := range d.motions {
				if m.surf != c.surf {
					continue
				}
				v := m.axis
				if m.rot {
					v = r3.Cross(m.axis, r3.Sub(p, m.point))
				}
				// The surface moving by v at the contact closes the gap
				// by its normal component.
				out[i] -= r3.Dot(l.n, v)
			}
		}
	}
}

// Effect is the first-order effect of one unit cause on the moving body
// and on a point of interest: a unit deviation of one dimension
// ([Assembly.Sensitivities], per m or per rad) or a unit gap error at one
// contact ([Amplification], per m).
type Effect struct {
	// Name is the dimension's name or the contact's label.
	Name string

	// Pose is the small displacement of the moving body per unit of the
	// cause (rad and m per m or per rad), V at the origin.
	Pose screw.Twist

	// Displacement is the point of interest's displacement per unit
	// (m/m or m/rad); Tilt is Pose.W.
	Displacement r3.Vec
	Tilt         r3.Vec
}

// Sensitivities returns the first-order effect of every dimension on the
// pose and on the point p of the moving body, in the order of
// [Assembly.Dimensions]. A dimension that opens gap i by ∂gᵢ/∂v per unit
// moves the body by x = −Σᵢ (∂gᵢ/∂v) Tᵢ, with Tᵢ the twists of power δᵢⱼ
// with contact j, so that every gap stays closed: moving the body by x
// opens gap j by Power(x, lⱼ) (the normal velocity of its contact point).
// It returns an [*InputError] naming "p" when p is not finite, or
// wrapping [ErrRange] when it is so far away that its displacement
// overflows, and one naming "a" for a nil or zero Assembly.
func (a *Assembly) Sensitivities(p r3.Vec) ([]Effect, error) {
	if err := a.check(); err != nil {
		return nil, err
	}
	if !linalg.Finite3(p) {
		return nil, &InputError{Field: "p", Err: fmt.Errorf("%w: %v", ErrNonFinite, p)}
	}
	out := make([]Effect, len(a.dims))
	pl := r3.Sub(p, a.origin)
	for k := range a.dims {
		x := a.sensitivity(k)
		out[k] = Effect{Name: a.dims[k].name, Pose: global(x, a.origin), Displacement: x.At(pl), Tilt: x.W}
		if !allFinite3(out[k].Displacement) || !finiteTwist(out[k].Pose) {
			return nil, &InputError{Field: "p", Err: fmt.Errorf("%w: the displacement of %v per unit of %s overflows: the point is too far from the coupling", ErrRange, p, out[k].Name)}
		}
	}
	return out, nil
}

// sensitivity returns the pose twist per unit of dimension k, about the
// origin.
func (a *Assembly) sensitivity(k int) screw.Twist {
	var e [6]float64
	a.effects(&a.dims[k], &e)
	var x screw.Twist
	for i := range e {
		if e[i] != 0 {
			x = x.Add(a.freed[i].Scale(-e[i]))
		}
	}
	return x
}
