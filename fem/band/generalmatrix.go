package band

import "fmt"

// General is an n×n band matrix with KL subdiagonals and KU superdiagonals,
// not necessarily symmetric. It is stored by rows with room for the fill of
// an LU factorization with row interchanges, whose U has KL+KU
// superdiagonals:
//
//	Data[i*Stride + j-i+KL] = A[i][j] for i-KL ≤ j ≤ i+KU, Stride = 2·KL+KU+1.
//
// Offsets KL+KU+1 to Stride-1 of every row are the fill columns, zero in a
// matrix, and entries of the first and last rows that fall outside the
// matrix are unused. This is the row-major layout of gonum's blas64.Band
// with KL subdiagonals and KL+KU superdiagonals, the row-major counterpart
// of LAPACK's dgbtrf storage, so a factorization works in a copy of Data
// laid out the same way.
type General struct {
	N, KL, KU int
	Data      []float64
}

// NewGeneral returns a zero n×n band matrix with kl subdiagonals and ku
// superdiagonals.
func NewGeneral(n, kl, ku int) *General {
	return &General{N: n, KL: kl, KU: ku, Data: make([]float64, n*(2*kl+ku+1))}
}

// Stride is the length of a row of Data.
func (a *General) Stride() int { return 2*a.KL + a.KU + 1 }

// At returns A[i][j]; entries outside the band are zero.
func (a *General) At(i, j int) float64 {
	if j-i > a.KU || i-j > a.KL {
		return 0
	}
	return a.Data[i*a.Stride()+j-i+a.KL]
}

// Set sets A[i][j] to v. (i, j) must lie in the matrix and in its band,
// i-KL ≤ j ≤ i+KU; anything else is a programming error and panics, as an
// index out of range does.
func (a *General) Set(i, j int, v float64) { a.Data[a.index(i, j)] = v }

// Add adds v to A[i][j]; (i, j) must lie in the band, as for Set.
func (a *General) Add(i, j int, v float64) { a.Data[a.index(i, j)] += v }

// AddRow adds v[k] to A[i][j+k] for every k: a run of entries of row i,
// all of which must lie in the band, as for Set. The run is contiguous in
// Data, so its ends alone are checked.
func (a *General) AddRow(i, j int, v []float64) {
	if len(v) == 0 {
		return
	}
	p := a.index(i, j)
	a.index(i, j+len(v)-1)
	row := a.Data[p : p+len(v)]
	for k := range row {
		row[k] += v[k]
	}
}

// index is the place of A[i][j] in Data; it panics outside the band, where a
// bare offset would write silently into another row or the fill.
func (a *General) index(i, j int) int {
	if i < 0 || j < 0 || i >= a.N || j >= a.N || j-i > a.KU || i-j > a.KL {
		panic(fmt.Sprintf("band: entry (%d, %d) outside the band of a %d×%d matrix with %d subdiagonals and %d superdiagonals", i, j, a.N, a.N, a.KL, a.KU))
	}
	return i*a.Stride() + j - i + a.KL
}

// row returns the entries of row i that lie in the matrix and its band,
// columns max(0, i-KL) to min(N-1, i+KU).
func (a *General) row(i int) []float64 {
	s := a.Stride()
	lo, hi := max(0, i-a.KL), min(a.N, i+a.KU+1)
	return a.Data[i*s+lo-i+a.KL : i*s+hi-i+a.KL]
}

// column returns where the band of column j starts in Data, how many entries
// it has, and the step from one to the next: going down a column, the
// offset from the diagonal drops by one a row.
func (a *General) column(j int) (first, count, step int) {
	s := a.Stride()
	lo, hi := max(0, j-a.KU), min(a.N, j+a.KL+1)
	return lo*s + j - lo + a.KL, hi - lo, s - 1
}
