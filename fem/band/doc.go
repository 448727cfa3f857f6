// Package band stores symmetric band matrices and solves symmetric positive
// definite band systems by an LDLᵀ factorization, in time linear in the order.
//
// # Storage
//
// A Symmetric of order N and half-bandwidth K keeps the upper triangle of its
// band by rows, K+1 entries a row: Data[i*(K+1)+j-i] = A[i][j] for
// i ≤ j ≤ i+K. It is gonum's blas64.SymmetricBand, upper, with Stride K+1, so
// the same array can be handed to lapack64.Pbtrf. Assemble with Add(i, j, v),
// which adds v to A[i][j] and so to A[j][i].
//
// # Life cycle
//
// An LDL is a factorization with the life cycle of gonum's mat.BandCholesky:
// factorize once, solve many times into destinations the caller owns.
//
//	var f band.LDL
//	if err := f.Factorize(a); err != nil {
//		// a *PivotError: a is singular, indefinite or too badly conditioned
//	}
//	for _, b := range loadCases {
//		f.SolveTo(x, b) // reads the factor, never changes it
//	}
//	cond := f.Cond(a, scale)
//
// FactorizeSolve is Factorize and one SolveTo in a single call; for the
// tridiagonal and the node-block kernels the forward substitution runs inside
// the factorization's sweep, one pass over the factor less (the node blocks
// give the same bits as Factorize followed by SolveTo, the tridiagonal
// kernel the same answer to round-off). The factorization
// copies the band into storage of its own and leaves a untouched; once an LDL
// has held a matrix of the same size, neither Factorize nor SolveTo
// allocates. In SolveTo and FactorizeSolve the destination and the
// right-hand side may be the same slice, but must not overlap otherwise.
//
// # Kernels
//
// Factorize picks the kernel from the shape of the matrix; each lives in its
// own file.
//
//   - tridiagonal.go, K = 1 (a bar's system): eliminates from both ends at
//     once, two independent chains of divisions in one loop, the twisted
//     factorization.
//   - nodeblocks.go, K = 3, N even and at least 6, and the band block
//     tridiagonal by nodes of two unknowns (A[2i+1][2i+4] = 0, a beam's
//     system) with every diagonal entry within 1e±80: 2×2 pivot blocks node
//     by node, from both ends, one division per node. A matrix that turns out
//     not to be so is handed to the next kernel.
//   - twisted3.go, K = 3 and N at least 5 otherwise: the scalar twisted
//     factorization, row by row from both ends.
//   - general.go, every other shape (K = 0, 2, 4 and more, small N): the
//     right-looking elimination from the top down.
//
// The kernels differ in speed and in the order of elimination; each tests
// every pivot against the same tolerance.
//
// # Stability
//
// No pivoting is done: LDLᵀ of a symmetric positive definite matrix is
// backward stable without it (Higham, Accuracy and Stability of Numerical
// Algorithms, ch. 10, from memory). Eliminating from both ends is a symmetric
// permutation of the rows, so the twisted kernels are the plain factorization
// of a permuted matrix and as stable. Every pivot must exceed 1e−14 times the
// original diagonal entry of its row; a smaller or negative one stops the
// factorization with a *PivotError naming the row, the pivot and that
// diagonal entry, and leaves the LDL holding nothing to solve with (SolveTo
// then reports an error). No kernel squares an entry, and the node blocks,
// which multiply three, take only diagonals within 1e±80, so no product
// leaves float64's range: scaling the matrix by c scales the solution by 1/c
// to round-off for c from 1e−300 to 1e300.
//
// Cond, given the matrix that was factorized, estimates the 1-norm condition
// number of that matrix or of S·A·S for a diagonal scaling S, by the
// Hager–Higham estimator: a handful of solves, linear in N. Round-off can
// grow to a relative error of about Cond·ε in the solution.
package band
