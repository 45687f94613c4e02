// Package linalg holds the small dense linear algebra that the module's
// packages share, written for the fixed sizes of rigid-body constraint
// analysis: six-component wrenches and twists, 3×3 symmetric systems.
//
// # Contents
//
//   - Singular value decomposition by one-sided Jacobi rotations: [Jacobi]
//     for an m×k matrix (optionally accumulating V), [Jacobi6] for six
//     rows and up to six columns (the hot path), [SortColumns] and
//     [Sort6] to read off the singular values in descending order.
//   - [QRPivot]: Householder QR with column pivoting of an m×6 matrix,
//     returning Rᵀ, the preconditioner that lets Jacobi6 decompose a 6×n
//     matrix for any n in a 6×6 array.
//   - [Complete]: completion of r orthonormal columns to an orthonormal
//     basis of Rⁿ (used with n = 6).
//   - [Inverse6]: Gauss–Jordan inverse of a 6×6 matrix with a scale-free
//     singularity test.
//   - [FactorPSD3], [PSD3.Solve] and [SolvePSD3]: pseudo-inverse solutions of
//     3×3 symmetric positive semi-definite systems with an eigenvalue
//     cut-off.
//   - Vector helpers: [Norm] and [Norm3] (no overflow or underflow for
//     finite input), [Dot], [Axpy], [Finite3], and [Unit3] (a unit vector
//     for any finite non-zero vector, subnormal components included).
//
// # Conventions
//
// Matrices are dense and column-major: element (i, j) of an m×k matrix a
// is a[j*m+i]. Six-row matrices live in [36]float64 arrays, column j in
// a[6j : 6j+6]; only the first k columns are used when there are fewer.
// 3×3 matrices live in [9]float64 arrays. The caller passes all storage:
// no function allocates at the sizes the module uses (Jacobi allocates
// only for more than eight columns). Functions that overwrite their input
// say so; the others leave it unchanged.
//
// # Accuracy
//
// One-sided Jacobi computes every singular value with a relative error of
// a small multiple of ε ≈ 2.2e-16 times the condition number of the matrix
// with its columns scaled to unit norm (Demmel & Veselić 1992, "Jacobi's
// method is more accurate than QR", SIAM J. Matrix Anal. Appl. 13(4)): for
// the normalised constraint matrices of the callers, whose columns have
// unit norm, the singular values are as accurate as the data. The
// Householder factorisations (QRPivot) and Gauss–Jordan elimination with
// partial pivoting (Inverse6) are backward stable (Golub & Van Loan,
// Matrix Computations, 4th ed., 2013, §5.2 and §3.4): their results are
// exact for data perturbed by a small multiple of ε, so the error of an
// inverse is of the order of ε times the condition number. Each function
// states its own thresholds; every threshold is relative to the data's own
// scale (a singular value to the largest, a pivot to its column), never an
// absolute number.
//
// Input is expected finite. Callers validate user numbers first; on NaN
// or infinite input the functions return without panicking, with results
// that are not meaningful (Jacobi reports that it did not converge).
package linalg
