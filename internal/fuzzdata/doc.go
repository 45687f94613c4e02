// Package fuzzdata encodes the inputs of the project's fuzz targets: runs of
// float64 values as little-endian bytes, so that a target taking []byte can
// be seeded with real designs and the fuzzer can reach every bit pattern,
// NaN and infinities included.
package fuzzdata
