// Package band stores band matrices and solves band systems in time linear in
// the order: symmetric positive definite ones by an LDLᵀ factorization
// without pivoting, general (unsymmetric) ones by an LU factorization with
// partial pivoting.
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
//     system) with every diagonal entry within 1e±80 and no pivot block
//     near singular (blockSplit): 2×2 pivot blocks node by node, from both
//     ends, one division per node. A matrix that turns out not to be so is
//     handed to the next kernel.
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
//
// # General band matrices
//
// A General of order N has KL subdiagonals and KU superdiagonals, with no
// symmetry: the system of the closed-form exact solution's integration
// constants, whose equations (continuity, jumps, support conditions) give
// no symmetric positive definite matrix, or any other unsymmetric band
// system. It is stored by rows, each with room for the fill of the
// factorization: Data[i*Stride+j-i+KL] = A[i][j], Stride = 2·KL+KU+1, the
// last KL places of every row zero (generalmatrix.go). Set and Add take
// entries in the band only; outside it they panic, as an index out of range
// does.
//
// An LU (lu.go) factorizes it as LAPACK's dgbtrf does: Gaussian elimination
// with partial pivoting, each step taking as pivot the largest entry of its
// column among the KL+1 rows that can hold one, so every multiplier is at
// most 1 and U gains up to KL more superdiagonals, into the fill. Each
// step's multipliers stay where that step left them and the solves replay
// the interchanges in order, as dgbtrs does. The life cycle is LDL's:
//
//	var f band.LU
//	if err := f.Factorize(a); err != nil {
//		// a *SingularError: a column of a is, to working precision, a
//		// combination of the columns before it
//	}
//	for _, b := range rightHandSides {
//		f.SolveTo(x, b)
//	}
//	cond := f.Cond(a)
//
// Factorize costs O(N·KL·(KL+KU)), SolveTo O(N·(2·KL+KU)), and neither
// allocates once the LU has held a matrix of the same size;
// FactorizeInPlace factorizes in a's own storage, for a matrix not needed
// afterwards. A pivot must
// exceed 1e−14 times the largest magnitude in its column of A; a refusal
// means the 2-norm condition number of A is at least about 1e14/√(KL+1).
// Partial pivoting is backward stable in practice, and in a band its growth
// factor is bounded by a power of 2 in the bandwidth, whatever N (Bohte
// 1975, as cited in Higham, Accuracy and Stability of Numerical Algorithms,
// ch. 9, from memory). Cond (lucond.go) estimates the 1-norm condition
// number as dgbcon does, by Hager–Higham with solves by A and Aᵀ, in
// O(N·(KL+KU)).
//
// Equations in different units (N, N·m) and unknowns in different units (m,
// rad, N) make A badly scaled, and the condition number then says more
// about the units than about the structure. Equilibrate (equilibrate.go)
// scales rows and columns in place, within the band, towards unit largest
// entry by Ruiz's square-root scaling, and returns the scales R and C:
// factorize R·A·C, solve (R·A·C)·y = R·b and take x = C·y.
package band
