package fem

import (
	"errors"
	"fmt"
	"math"
)

// SymBand is a symmetric band matrix of order N with half-bandwidth K, stored
// by rows of its upper triangle: Data[i*(K+1)+j-i] = A[i][j] for i ≤ j ≤ i+K.
// This is the row-major upper layout of gonum's blas64.SymmetricBand with
// Stride = K+1. Entries of the last rows that fall outside the matrix are unused.
type SymBand struct {
	N, K int
	Data []float64
}

// NewSymBand returns a zero n×n band matrix with half-bandwidth k.
func NewSymBand(n, k int) *SymBand {
	return &SymBand{N: n, K: k, Data: make([]float64, n*(k+1))}
}

// At returns A[i][j]; entries outside the band are zero.
func (a *SymBand) At(i, j int) float64 {
	if i > j {
		i, j = j, i
	}
	if j-i > a.K {
		return 0
	}
	return a.Data[i*(a.K+1)+j-i]
}

// add adds v to A[i][j] (and so to A[j][i]); i ≤ j ≤ i+K.
func (a *SymBand) add(i, j int, v float64) { a.Data[i*(a.K+1)+j-i] += v }

// Norm1 returns the 1-norm (largest column sum of magnitudes) of S·A·S with
// S = diag(scale), or of A when scale is nil.
func (a *SymBand) Norm1(scale []float64) float64 {
	w := a.K + 1
	sums := make([]float64, a.N)
	for i := range a.N {
		si := 1.0
		if scale != nil {
			si = scale[i]
		}
		for j := i; j < min(i+w, a.N); j++ {
			v := math.Abs(a.Data[i*w+j-i]) * si
			if scale != nil {
				v *= scale[j]
			}
			sums[j] += v
			if j != i {
				sums[i] += v
			}
		}
	}
	norm := 0.0
	for _, s := range sums {
		norm = max(norm, s)
	}
	return norm
}

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
	return fmt.Sprintf("fem: the matrix is singular to working precision at row %d (pivot %.3g, diagonal %.3g)", e.Row, e.Pivot, e.Diagonal)
}

// bandKernel names the factorization a BandLDL holds.
type bandKernel int

const (
	generalRows bandKernel = iota // factorRows, any half-bandwidth
	twisted1                      // half-bandwidth 1 from both ends (band1.go)
	twisted3                      // half-bandwidth 3 from both ends (band3.go)
	nodeBlocks                    // 2×2 node blocks from both ends (band2.go)
)

// BandLDL is the factorization A = Uᵀ·D·U of a symmetric positive definite
// band matrix, U unit upper triangular with the band of A. Use it as
//
//	var f BandLDL
//	if err := f.Factorize(a); err != nil { ... }
//	f.SolveTo(x, b)
//
// Factorize costs O(N·K²) and SolveTo O(N·K); neither allocates once the
// receiver has been used for a matrix of the same size. Half-bandwidths 1
// (linear bar) and 3 (beam) have unrolled kernels that factorize from both
// ends at once (band1.go, band3.go), and a beam's system, block tridiagonal
// by nodes, is factorized node by node (band2.go).
type BandLDL struct {
	n, k int
	// f holds the factor in the layout of its kernel: U above the diagonal
	// and D⁻¹ on it, in SymBand layout, but for the node blocks (band2.go);
	// the solves multiply instead of divide.
	f []float64
	// kernel is the factorization in f.
	kernel bandKernel
	// work is scratch for the condition estimate.
	work [3][]float64
}

// Factorize computes the factorization of a, which it does not modify. It
// returns a *PivotError, and leaves the receiver unusable, when a pivot is not
// positive enough: a is then singular, not positive definite, or too badly
// conditioned to solve in float64.
func (f *BandLDL) Factorize(a *SymBand) error {
	_, err := f.factorize(a, nil, nil)
	return err
}

// FactorizeSolve is Factorize followed by SolveTo(x, b), with the forward
// substitution done in the factorization's sweep by the bar's and the
// node-block kernels: one pass over the factor less. x and b may be the same
// slice but must not overlap otherwise. On error x holds no solution.
func (f *BandLDL) FactorizeSolve(a *SymBand, x, b []float64) error {
	if len(x) != a.N || len(b) != a.N {
		return fmt.Errorf("fem: solve with vectors of length %d and %d for a matrix of order %d", len(x), len(b), a.N)
	}
	solved, err := f.factorize(a, x, b)
	if err != nil || solved {
		return err
	}
	return f.SolveTo(x, b)
}

// factorize is Factorize; with b not nil the bar's and the node-block
// kernels also solve into x, and solved says whether they did.
func (f *BandLDL) factorize(a *SymBand, x, b []float64) (solved bool, err error) {
	n, k := a.N, a.K
	w := k + 1
	if n < 0 || k < 0 || len(a.Data) < n*w {
		return false, errors.New("fem: band matrix storage is smaller than its size")
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
		f.kernel, err = twisted1, factorTwisted1(d, orig, n, x, b)
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

// pivotOK is the singularity test of one pivot against its original diagonal.
func pivotOK(piv, diag float64) bool { return piv > pivotTolerance*math.Abs(diag) }

// factorRows is the general right-looking elimination, in place in d.
func factorRows(d, orig []float64, n, k int) error {
	w := k + 1
	for i := range n {
		row := d[i*w : i*w+w]
		piv := row[0]
		if !pivotOK(piv, orig[i*w]) {
			return &PivotError{Row: i, Pivot: piv, Diagonal: orig[i*w]}
		}
		m := min(k, n-1-i)
		inv := 1 / piv
		// The rows below are updated with the unscaled row i.
		for j := 1; j <= m; j++ {
			t := row[j]
			if t == 0 {
				continue
			}
			l := t * inv
			r := d[(i+j)*w : (i+j)*w+m-j+1]
			src := row[j : m+1]
			for q := range r {
				r[q] -= l * src[q]
			}
		}
		for j := 1; j <= m; j++ {
			row[j] *= inv
		}
		row[0] = inv
	}
	return nil
}

// SolveTo solves A·x = b into dst using the factorization; dst and b may be
// the same slice but must not overlap otherwise.
func (f *BandLDL) SolveTo(dst, b []float64) error {
	n, k := f.n, f.k
	if len(dst) != n || len(b) != n {
		return fmt.Errorf("fem: solve with vectors of length %d and %d for a factorization of order %d", len(dst), len(b), n)
	}
	d, x := f.f, dst
	switch f.kernel {
	case twisted1:
		solveTwisted1(d, x, b, n)
		return nil
	case twisted3:
		solveTwisted3(d, x, b, n)
		return nil
	case nodeBlocks:
		solveNodes(d, x, b, n)
		return nil
	}
	// Uᵀ·y = b and z = D⁻¹·y, by columns of U.
	copy(x, b)
	w := k + 1
	for i := range n {
		row := d[i*w : i*w+w]
		y := x[i]
		rest := x[i+1 : i+1+min(k, n-1-i)]
		for j := range rest {
			rest[j] -= row[j+1] * y
		}
		x[i] = y * row[0]
	}
	// U·x = z, by rows of U.
	for i := n - 1; i >= 0; i-- {
		row := d[i*w : i*w+w]
		s := x[i]
		rest := x[i+1 : i+1+min(k, n-1-i)]
		for j := range rest {
			s -= row[j+1] * rest[j]
		}
		x[i] = s
	}
	return nil
}

// Cond estimates the 1-norm condition number of S·A·S, S = diag(scale) (of A
// when scale is nil), where a is the matrix that was factorized. It uses the
// Hager–Higham estimator (Higham, Accuracy and Stability of Numerical
// Algorithms, §15.3, from memory), a handful of solves, so its cost is linear
// in N. The estimate is a lower bound, in practice within a small factor.
func (f *BandLDL) Cond(a *SymBand, scale []float64) float64 {
	n := f.n
	if n == 0 {
		return 0
	}
	for i := range f.work {
		if cap(f.work[i]) < n {
			f.work[i] = make([]float64, n)
		}
		f.work[i] = f.work[i][:n]
	}
	x, y, z := f.work[0], f.work[1], f.work[2]
	// applyInv sets dst = (S·A·S)⁻¹·src = S⁻¹·A⁻¹·S⁻¹·src.
	applyInv := func(dst, src []float64) {
		for i := range src {
			dst[i] = src[i]
			if scale != nil {
				dst[i] /= scale[i]
			}
		}
		_ = f.SolveTo(dst, dst)
		if scale != nil {
			for i := range dst {
				dst[i] /= scale[i]
			}
		}
	}
	for i := range x {
		x[i] = 1 / float64(n)
	}
	est := 0.0
	for iter := range 5 {
		applyInv(y, x)
		e := norm1(y)
		if iter > 0 && e <= est {
			break
		}
		est = e
		for i, v := range y {
			z[i] = 1
			if v < 0 {
				z[i] = -1
			}
		}
		applyInv(z, z) // the matrix is symmetric: no transposed solve needed
		jmax, zx := 0, 0.0
		for i, v := range z {
			if math.Abs(v) > math.Abs(z[jmax]) {
				jmax = i
			}
			zx += v * x[i]
		}
		if iter > 0 && math.Abs(z[jmax]) <= zx {
			break
		}
		clear(x)
		x[jmax] = 1
	}
	// Higham's extra vector guards against the rare matrices that fool Hager's iteration.
	for i := range x {
		x[i] = 1 + float64(i)/float64(max(n-1, 1))
		if i%2 == 1 {
			x[i] = -x[i]
		}
	}
	applyInv(y, x)
	est = max(est, 2*norm1(y)/(3*float64(n)))
	return est * a.Norm1(scale)
}

func norm1(v []float64) float64 {
	s := 0.0
	for _, x := range v {
		s += math.Abs(x)
	}
	return s
}
