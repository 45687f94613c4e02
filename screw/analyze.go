package screw

import (
	"errors"
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/constraint"
)

// RankTol is the rank threshold of [Analyze] for sets near the origin: a
// singular value at or below RankTol times the largest counts as zero.
//
// The singular values are those of the normalised constraint matrix, whose
// columns have unit norm, so the smallest one measures how far the set is
// from losing a constraint: a relative misalignment of the lines in radians,
// or a relative offset as a fraction of the characteristic length. Input in
// float64 carries relative errors of a few ε ≈ 2.2e-16 per entry, and the
// decomposition adds a small multiple of ε: below 1e-10 nothing is left that
// arithmetic can tell from zero. Above it, nothing is lost that matters: no
// part is made to better than 1e-7 of its size. Far from the origin the
// threshold rises to the rounding that the moments carry, 32ε·far/Length
// (see the package's tolerance policy).
const RankTol = constraint.RankTol

// NearSingularRatio is the ratio of the smallest retained singular value to
// the largest below which [Analyze] flags a set as near-singular.
//
// A set with a smaller ratio keeps its rank only if its geometry is known to
// better than 0.1 % of its characteristic length (10 µm on a 10 mm
// coupling), and it amplifies geometry errors into errors of the located
// body by more than a factor of 1000.
const NearSingularRatio = constraint.NearSingularRatio

// Analysis is the constraint analysis of a set of wrenches.
type Analysis struct {
	// Rank is the number of independent constraints, 1 to 6.
	Rank int

	// Singular holds the min(6, len(ws)) singular values of the normalised
	// constraint matrix, dimensionless, in descending order. Their squares
	// sum to len(ws).
	Singular []float64

	// Condition is the ratio of the largest singular value to the smallest
	// retained one (index Rank−1), at least 1.
	Condition float64

	// NearSingular reports whether the smallest retained singular value is
	// below NearSingularRatio times the largest: the set is exactly
	// constrained in arithmetic, but barely.
	NearSingular bool

	// Free is a basis of the twists reciprocal to every wrench: 6 − Rank
	// twists, each free to first order. Twists with a rotation come first,
	// scaled to |W| = 1 rad/s with orthogonal W; pure translations come last,
	// scaled to |V| = 1 m/s, and the translations are removed from the
	// twists with a rotation. Each twist's largest component of W (of V for
	// a translation) is positive.
	Free []Twist

	// Redundant is a basis of the redundant combinations: len(ws) − Rank
	// vectors of weights c, one per wrench, with Σ cᵢwᵢ = 0. The basis is in
	// reduced echelon form, so each combination has a wrench of its own;
	// each is scaled so that its largest weight is +1. Weights at rounding
	// level (see weightTol) are exactly zero.
	Redundant [][]float64

	// Centre is the reference point in metres: the point nearest to all
	// lines of force in least squares.
	Centre r3.Vec

	// Length is the characteristic length in metres by which moments about
	// Centre were divided: the RMS distance of the lines of force from
	// Centre. It is zero when no wrench has a force, or when the lines
	// meet at Centre to within the rounding their moments carry (32ε, about
	// 7e-15, times the largest distance of a line or of Centre from the
	// origin); the set is then analysed as concurrent and no length enters
	// the rank.
	Length float64
}

// Wrenches and twists have the layout of the internal ones.
var (
	_ = constraint.Wrench(Wrench{})
	_ = Twist(constraint.Twist{})
)

// Analyze returns the constraint analysis of the wrenches ws.
// Each wrench stands for a constraint along its line (or, for a pure
// moment, about its direction); its magnitude does not matter.
//
// Analyze returns an [*InputError] wrapping [ErrDegenerate] if ws is empty
// (field "ws") or a wrench is zero ("ws[i]"), [ErrNonFinite] if a
// component is NaN or infinite ("ws[i].F", "ws[i].M"), and [ErrRange] if
// the magnitudes are too far apart for float64: two wrenches whose
// magnitudes differ by more than 1e150 times, a wrench whose moment exceeds
// 1e100 times its force (a line farther than 1e100 m from the origin),
// lines too far apart for their distances to be squared, or lines that do
// not meet in one point but lie closer together than 7.1e-12 times their
// distance from the origin, where the rounding of their moments hides the
// rank (field "ws" for these two), or a redundant set whose weights would
// span more than 2¹⁰⁰⁰ ≈ 1e301 (a couple whose moment over the
// characteristic length is that much larger than a force; field "ws[i]"
// names the couple).
func Analyze(ws []Wrench) (Analysis, error) {
	var stack [12]constraint.Wrench
	var cw []constraint.Wrench
	if len(ws) <= len(stack) {
		cw = stack[:len(ws)]
	} else {
		cw = make([]constraint.Wrench, len(ws))
	}
	for i, w := range ws {
		cw[i] = constraint.Wrench(w)
	}
	var r constraint.Result
	if err := constraint.Analyze(cw, &r); err != nil {
		return Analysis{}, inputError(err)
	}
	an := Analysis{
		Rank:         r.Rank,
		Singular:     append([]float64(nil), r.Singular[:r.K]...),
		Condition:    r.Condition,
		NearSingular: r.NearSingular,
		Redundant:    r.Redundant,
		Centre:       r.Centre,
		Length:       r.Length,
	}
	if r.Rank < 6 {
		an.Free = make([]Twist, 6-r.Rank)
		for i := range an.Free {
			an.Free[i] = Twist(r.Free[i])
		}
	}
	return an, nil
}

// inputError translates an error of package constraint into an
// [*InputError] naming the field as the caller of [Analyze] wrote it.
func inputError(err error) error {
	var ce *constraint.Error
	if !errors.As(err, &ce) {
		return err
	}
	field := "ws"
	if ce.Index >= 0 {
		field = fmt.Sprintf("ws[%d]", ce.Index)
		if ce.Part != "" {
			field += "." + ce.Part
		}
	}
	return &InputError{Field: field, Err: ce.Err}
}
