package constraint

import (
	"math/rand/v2"

	"gonum.org/v1/gonum/spatial/r3"
)

func randVec(rng *rand.Rand) r3.Vec {
	return r3.Vec{X: 2*rng.Float64() - 1, Y: 2*rng.Float64() - 1, Z: 2*rng.Float64() - 1}
}
