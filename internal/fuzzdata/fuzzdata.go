package fuzzdata

import (
	"encoding/binary"
	"math"
)

// Append appends the values xs to b, eight bytes each.
func Append(b []byte, xs ...float64) []byte {
	for _, x := range xs {
		b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x))
	}
	return b
}

// Floats returns the values encoded in b in groups of n: as many whole
// groups as b holds; trailing bytes are ignored.
func Floats(b []byte, n int) [][]float64 {
	groups := make([][]float64, len(b)/(8*n))
	for i := range groups {
		g := make([]float64, n)
		for j := range g {
			g[j] = math.Float64frombits(binary.LittleEndian.Uint64(b[8*(n*i+j):]))
		}
		groups[i] = g
	}
	return groups
}
