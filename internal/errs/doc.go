// Package errs holds the error meanings that every public package of the
// module shares. Each package re-exports them under its own names
// (screw.ErrNonFinite, hertz.ErrNonFinite and kinematic.ErrNonFinite are the
// same value), so that errors.Is gives the same answer whichever package's
// sentinel a caller tests for, and an error translated from one package's
// vocabulary into another's still matches both.
//
// It also holds the plausibility screens more than one package applies
// alike (CheckMu), so that the bound and its wording are written once.
package errs
