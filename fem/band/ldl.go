package band

import (
	"errors"
	"fmt"
	"math"
)

// pivotTolerance: a pivot at or below this fraction of its original diagonal
// entry means the matrix is singular to working precision.
const pivotTolerance = 1e-14

// PivotError reports a factorization that met a pivot too small to trust.
type PivotError struct {
	Row      int     // row of the failing pivot
	Pivot    float64 // its value
	Diagonal float64 // the original diagonal entry of that row
}

func (e *PivotError) Error() string {
	return fmt.Sprintf("band: the matrix is singular to working precision at row %d (pivot %.3g, diagonal %.3g)", e.Row, e.Pivot, e.Diagonal)
}

// pivotOK is the singularity test of one pivot against its original diagonal.
func pivotOK(piv, diag float64) bool { return piv > pivotTolerance*math.Abs(diag) }

// kernel names the factorization an LDL holds.
type kernel int

const (
	generalRows kernel = iota // any half-bandwidth, row by row (general.go)
	tridiagonal               // half-bandwidth 1 from both ends (tridiagonal.go)
	twisted3                  // half-bandwidth 3 from both ends (twisted3.go)
	nodeBlocks                // 2×2 node blocks from both ends (nodeblocks.go)
)

// LDL is the factorization A = Uᵀ·D·U of a symmetric positive definite band
// matrix, U unit upper triangular with the band of A. Factorize once, then
// SolveTo as many right-hand sides as needed:
//
//	var f band.LDL
//	if err := f.Factorize(a); err != nil { ... }
//	f.SolveTo(x, b)
//
// Factorize costs O(N·K²) and SolveTo O(N·K); neither allocates once the
// receiver has been used for a matrix of the same size. The package doc
// says which kernel factorizes which matrix.
type LDL struct {
	n, k int
	// f holds the factor in the layout of its kernel: U above the diagonal
	// and D⁻¹ on it, in Symmetric's layout, but for the node blocks
	// (nodeblocks.go); the solves multiply instead of divide.
	f []float64
	// kernel is the factorization in f.
	kernel kernel
	// work is scratch for the condition estimate.
	work [3][]float64
}

// Factorize computes the factorization of a, which it does not modify. It
// returns a *PivotError, and leaves the receiver unusable, when a pivot is not
// positive enough: a is then singular, not positive definite, or too badly
// conditioned to solve in float64.
func (f *LDL) Factorize(a *Symmetric) error {
	_, err := f.factorize(a, nil, nil)
	return err
}

// FactorizeSolve is Factorize followed by SolveTo(x, b), with the forward
// substitution done in the factorization's sweep by the tridiagonal and the
// node-block kernels: one pass over the factor less. x and b may be the same
// slice but must not overlap otherwise. On error x holds no solution.
func (f *LDL) FactorizeSolve(a *Symmetric, x, b []float64) error {
	if len(x) != a.N || len(b) != a.N {
		return fmt.Errorf("band: solve with vectors of length %d and %d for a matrix of order %d", len(x), len(b), a.N)
	}
	solved, err := f.factorize(a, x, b)
	if err != nil || solved {
		return err
	}
	return f.SolveTo(x, b)
}

// factorize is Factorize; with b not nil the tridiagonal and the node-block
// kernels also solve into x, and solved says whether they did.
func (f *LDL) factorize(a *Symmetric, x, b []float64) (solved bool, err error) {
	n, k := a.N, a.K
	w := k + 1
	if n < 0 || k < 0 || len(a.Data) < n*w {
		return false, errors.New("band: band matrix storage is smaller than its size")
	}
	f.n, f.k, f.kernel = 0, 0, generalRows
	if cap(f.f) < n*w {
		f.f = make([]float64, n*w)
	}
	f.f = f.f[:n*w]
	d, orig := f.f, a.Data
	// The unrolled kernels read a and write the factor in one pass; the
	// general loop works in place on a copy.
	switch {
	case k == 1 && n >= 1:
		f.kernel, err = tridiagonal, factorTridiagonal(d, orig, n, x, b)
		solved = b != nil
	case k == 3 && n >= nodeBlockMin && n%2 == 0:
		// The node kernel can find midway that the band is not block
		// tridiagonal; it solves only when b survives its writes to x.
		if b != nil && &x[0] == &b[0] {
			x, b = nil, nil
		}
		f.kernel, err = nodeBlocks, factorNodes(d, orig, n, x, b)
		solved = b != nil
		if err == errNotNodeBlocked {
			f.kernel, err = twisted3, factorTwisted3(d, orig, n)
			solved = false
		}
	case k == 3 && n >= twistedMin:
		f.kernel, err = twisted3, factorTwisted3(d, orig, n)
	default:
		copy(d, orig[:n*w])
		err = factorRows(d, orig, n, k)
	}
	if err != nil {
		f.kernel = generalRows
		return false, err
	}
	f.n, f.k = n, k
	return solved, nil
}

// SolveTo solves A·x = b into dst using the factorization; dst and b may be
// the same slice but must not overlap otherwise. It reads the factor and
// never changes it, so any number of right-hand sides may be solved after one
// Factorize.
func (f *LDL) SolveTo(dst, b []float64) error {
	n := f.n
	if len(dst) != n || len(b) != n {
		return fmt.Errorf("band: solve with vectors of length %d and %d for a factorization of order %d", len(dst), len(b), n)
	}
	switch f.kernel {
	case tridiagonal:
		solveTridiagonal(f.f, dst, b, n)
	case twisted3:
		solveTwisted3(f.f, dst, b, n)
	case nodeBlocks:
		solveNodes(f.f, dst, b, n)
	default:
		solveRows(f.f, dst, b, n, f.k)
	}
	return nil
}
