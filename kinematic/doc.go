// Package kinematic designs kinematic couplings: balls on a moving body
// seated in vees, flats, trihedral sockets and cones on a base.
//
// It is under construction. It will turn a coupling into its point
// contacts, each with the two Hertz surfaces that touch there, and answer
// for any 3D contact set: how many freedoms it constrains and which are left
// free; which constraints are redundant; how stable each contact is
// (Maxwell's criterion, generalised to 3D); the best groove orientations for
// given ball positions; and, later, contact loads under preload, stiffness
// and the error budget of the seated position.
//
// # Units, frame and signs
//
// SI units throughout (m, N, Pa, rad, K). One right-handed global frame. The
// moving body is the part being located; the base is fixed. A contact is a
// point p and a unit normal n along which the base can push the moving body
// (into the moving body); contacts are unilateral, compression only.
//
// # Tolerances
//
// Rank and degeneracy decisions are scale-invariant: lengths are normalised
// by a characteristic length of the design before any threshold, so a
// design in millimetres and the same design in metres give the same
// verdicts.
package kinematic
