// Package draw holds what package drawing needs and gonum.org/v1/plot
// lacks: a label placer that sets each label clear of the drawn items and
// of the labels placed before it, and a number format. It knows nothing of
// couplings (it never imports kinematic).
//
// Coordinates are the caller's, with y down for the order of preference
// (right, above right, below right, left, ...); package drawing passes
// canvas points with y negated.
package draw
