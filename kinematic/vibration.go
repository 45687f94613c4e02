package kinematic

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
	"github.com/sixfold-dev/sixfold/screw"
)

// Mode is one natural mode of the payload on the coupling.
type Mode struct {
	// Frequency is the natural frequency in Hz.
	Frequency float64

	// Shape is the mode shape as a small-displacement twist (W in rad, V
	// in m at the origin), scaled so that the larger of the centre of
	// mass's translation and the rotation times the contact set's size
	// is 1, with its largest component positive.
	Shape screw.Twist
}

// Modes returns the six natural modes of the model's payload on the
// coupling, lowest first: the generalised symmetric eigenproblem
// K φ = ω² M φ with M the payload's rigid-body mass matrix, solved by a
// Cholesky factorisation M = LLᵀ and the symmetric eigenproblem of
// L⁻¹KL⁻ᵀ (Golub & Van Loan, 4th ed., §8.7.2), on a fixed-size Jacobi
// kernel checked against gonum's mat.EigenSym. Frequencies are
// f = ω/(2π).
//
// Modes returns an [*InputError] naming "payload.Mass" or
// "payload.Inertia" when the payload has no mass or no positive-definite
// inertia, and one wrapping [ErrDegenerate] when the stiffness is not
// positive definite (an unresisted or unstable motion), one naming "s"
// for the zero Stiffness, and one wrapping [ErrRange] naming
// "payload.Mass" when a frequency or a mode shape overflows (a payload
// of 5e-324 kg).
func (s Stiffness) Modes() ([6]Mode, error) {
	var modes [6]Mode
	if s.length == 0 {
		return modes, errZeroStiffness
	}
	p := s.payload
	if !(p.Mass > 0) {
		return modes, &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: natural frequencies need a payload with mass", ErrDegenerate)}
	}
	if p.Inertia == ([3][3]float64{}) {
		return modes, &InputError{Field: "payload.Inertia", Err: fmt.Errorf("%w: natural frequencies need the payload's inertia tensor", ErrDegenerate)}
	}
	b, l, err := s.reduced()
	if err != nil {
		return modes, err
	}
	L, c := s.length, p.Centre
	var v [36]float64
	var w [6]float64
	linalg.EigenSym6(&b, &v, &w)
	var big float64
	for i := range 6 {
		big = math.Max(big, math.Abs(w[i]))
	}
	for j := range 6 {
		if !(w[j] > singularStiffness*big) {
			return modes, &InputError{Field: "cs", Err: fmt.Errorf("%w: the stiffness is singular or not positive definite: some motion is not resisted", ErrDegenerate)}
		}
		// φ = L⁻ᵀ ψ.
		var phi [6]float64
		for i := 5; i >= 0; i-- {
			s := v[6*i+j]
			for k := i + 1; k < 6; k++ {
				s -= l[6*k+i] * phi[k]
			}
			phi[i] = s / l[7*i]
		}
		t := screw.Twist{V: r3.Vec{X: phi[0], Y: phi[1], Z: phi[2]}, W: r3.Vec{X: phi[3] / L, Y: phi[4] / L, Z: phi[5] / L}}
		size := math.Max(linalg.Norm3(t.At(c)), linalg.Norm3(t.W)*L)
		t = t.Scale(signOfTwist(t, L) / size)
		modes[j] = Mode{Frequency: math.Sqrt(w[j]) / (2 * math.Pi), Shape: global(t, s.origin)}
		if !allFinite(modes[j].Frequency) || !finiteTwist(modes[j].Shape) {
			return [6]Mode{}, &InputError{Field: "payload.Mass", Err: fmt.Errorf("%w: a natural frequency or mode shape overflows", ErrRange)}
		}
	}
	return modes, nil
}

// reduced returns the symmetric matrix B = L⁻¹ K L⁻ᵀ whose eigenvalues
// are the squared angular frequencies (scaled coordinates y = (V, W·L) at
// the origin), and the Cholesky factor L of the scaled mass matrix, for a
// stiffness of non-zero length and a payload with mass and inertia.
func (s Stiffness) reduced() (b, l [36]float64, err error) {
	L, p := s.length, s.payload
	// Scaled mass matrix for y = (V, W·L), V at the origin o, centre
	// c = com − o: the kinetic energy ½m|V + W × c|² + ½WᵀJW gives
	// M_VV = mI, M_VW = −m[c]×, M_WW = J − m[c]×², then D M D.
	c := p.Centre
	cx := [3][3]float64{{0, -c.Z, c.Y}, {c.Z, 0, -c.X}, {-c.Y, c.X, 0}}
	var mm [36]float64
	for a := range 3 {
		mm[6*a+a] = p.Mass
		for b := range 3 {
			mm[6*a+3+b] = -p.Mass * cx[a][b] / L
			mm[6*(3+b)+a] = mm[6*a+3+b]
			var c2 float64
			for k := range 3 {
				c2 += cx[a][k] * cx[k][b]
			}
			mm[6*(3+a)+3+b] = (p.Inertia[a][b] - p.Mass*c2) / (L * L)
		}
	}
	l = mm
	if !linalg.Cholesky6(&l, 1e-14) {
		return b, l, &InputError{Field: "payload.Inertia", Err: fmt.Errorf("%w: the mass matrix is not positive definite", ErrDegenerate)}
	}
	// B = L⁻¹ K L⁻ᵀ: solve column by column.
	var x [36]float64 // L⁻¹ K
	for j := range 6 {
		for i := range 6 {
			v := s.k[6*i+j]
			for k := range i {
				v -= l[6*i+k] * x[6*k+j]
			}
			x[6*i+j] = v / l[7*i]
		}
	}
	// b = (L⁻¹ (L⁻¹ K)ᵀ) = L⁻¹ K L⁻ᵀ, K symmetric
	for j := range 6 {
		for i := range 6 {
			v := x[6*j+i]
			for k := range i {
				v -= l[6*i+k] * b[6*k+j]
			}
			b[6*i+j] = v / l[7*i]
		}
	}
	for i := range 6 {
		for j := range i {
			b[6*i+j] = (b[6*i+j] + b[6*j+i]) / 2
			b[6*j+i] = b[6*i+j]
		}
	}
	return b, l, nil
}

// signOfTwist returns the sign that makes the largest component of the
// twist, in the scaled coordinates (V, W·L), positive.
func signOfTwist(t screw.Twist, L float64) float64 {
	best, sgn := 0.0, 1.0
	for _, x := range [6]float64{t.V.X, t.V.Y, t.V.Z, t.W.X * L, t.W.Y * L, t.W.Z * L} {
		if math.Abs(x) > best {
			best = math.Abs(x)
			sgn = math.Copysign(1, x)
		}
	}
	return sgn
}
