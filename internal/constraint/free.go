package constraint

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/linalg"
)

// freeTwists writes the canonical basis of the free twists spanned by
// columns rank..5 of the 6×6 column-major v, whose columns are
// (V at c, W·used) in normalised coordinates, into free[:6−rank]. Twists
// whose rotation part is at most transTol are pure translations.
func freeTwists(v *[36]float64, rank int, fr *frame, transTol float64, free *[6]Twist) {
	k := 6 - rank
	// Ω: the rotation parts, 3×k. Its right singular vectors Y order the
	// free space by rotation; null columns are pure translations.
	var omega [18]float64
	var y [36]float64
	var sig [6]float64
	for j := 0; j < k; j++ {
		copy(omega[j*3:j*3+3], v[(rank+j)*6+3:(rank+j)*6+6])
	}
	linalg.Jacobi(omega[:3*k], 3, k, y[:k*k])
	linalg.SortColumns(omega[:3*k], 3, k, y[:k*k], sig[:k])

	var z [6][6]float64 // the combined twists, one per row
	for j := 0; j < k; j++ {
		for l := 0; l < k; l++ {
			linalg.Axpy(y[j*k+l], v[(rank+l)*6:(rank+l)*6+6], z[j][:])
		}
	}
	nrot := 0
	for nrot < k && sig[nrot] > transTol {
		nrot++
	}
	// Orthonormalise the translations (W = 0) and remove them from the
	// twists with a rotation.
	for j := nrot; j < k; j++ {
		t := z[j][:3]
		for pass := 0; pass < 2; pass++ {
			for i := nrot; i < j; i++ {
				linalg.Axpy(-linalg.Dot(z[i][:3], t), z[i][:3], t)
			}
		}
		s := 1 / linalg.Norm(t)
		for i := range t {
			t[i] *= s
		}
		z[j][3], z[j][4], z[j][5] = 0, 0, 0
	}
	for j := 0; j < nrot; j++ {
		for i := nrot; i < k; i++ {
			linalg.Axpy(-linalg.Dot(z[i][:3], z[j][:3]), z[i][:3], z[j][:3])
		}
	}

	for j := 0; j < k; j++ {
		vc := r3.Vec{X: z[j][0], Y: z[j][1], Z: z[j][2]}
		if j < nrot {
			// W in normalised coordinates has norm above transTol, so
			// neither the division nor the normalisation can overflow.
			w := r3.Scale(1/fr.used, r3.Vec{X: z[j][3], Y: z[j][4], Z: z[j][5]})
			v := r3.Scale(fr.unit, r3.Sub(vc, r3.Cross(w, fr.c)))
			f := signOf(w) / linalg.Norm3(w)
			free[j] = Twist{W: r3.Scale(f, w), V: r3.Scale(f, v)}
		} else {
			free[j] = Twist{V: r3.Scale(signOf(vc)/linalg.Norm3(vc), vc)}
		}
	}
}

// signOf returns +1 or −1, the sign of the component of v largest in
// magnitude (the first of equals).
func signOf(v r3.Vec) float64 {
	x := v.X
	if math.Abs(v.Y) > math.Abs(x) {
		x = v.Y
	}
	if math.Abs(v.Z) > math.Abs(x) {
		x = v.Z
	}
	if x < 0 {
		return -1
	}
	return 1
}
