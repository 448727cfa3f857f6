package band

import "math"

// Symmetric is a symmetric band matrix of order N with half-bandwidth K,
// stored by rows of its upper triangle: Data[i*(K+1)+j-i] = A[i][j] for
// i ≤ j ≤ i+K. This is the row-major upper layout of gonum's
// blas64.SymmetricBand with Stride = K+1. Entries of the last rows that fall
// outside the matrix are unused.
type Symmetric struct {
	N, K int
	Data []float64
}

// NewSymmetric returns a zero n×n band matrix with half-bandwidth k.
func NewSymmetric(n, k int) *Symmetric {
	return &Symmetric{N: n, K: k, Data: make([]float64, n*(k+1))}
}

// At returns A[i][j]; entries outside the band are zero.
func (a *Symmetric) At(i, j int) float64 {
	if i > j {
		i, j = j, i
	}
	if j-i > a.K {
		return 0
	}
	return a.Data[i*(a.K+1)+j-i]
}

// Add adds v to A[i][j] (and so to A[j][i]); i ≤ j ≤ i+K.
func (a *Symmetric) Add(i, j int, v float64) { a.Data[i*(a.K+1)+j-i] += v }

// Norm1 returns the 1-norm (largest column sum of magnitudes) of S·A·S with
// S = diag(scale), or of A when scale is nil.
func (a *Symmetric) Norm1(scale []float64) float64 {
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
