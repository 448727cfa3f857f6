package band

import (
	"errors"
	"fmt"
	"math"
)

// luTolerance: a pivot at or below this fraction of the largest magnitude in
// its column of A means the matrix is singular to working precision.
const luTolerance = 1e-14

// SingularError reports an LU factorization that found no usable pivot: after
// eliminating the columns before it, column Column of A is, to working
// precision, a combination of those columns.
type SingularError struct {
	Column int     // column (and row of U) of the failing pivot
	Pivot  float64 // the largest candidate left in that column, the pivot refused
	Scale  float64 // the largest magnitude in that column of A
}

func (e *SingularError) Error() string {
	return fmt.Sprintf("band: the matrix is singular to working precision at column %d (largest pivot %.3g against the column's largest entry %.3g)", e.Column, e.Pivot, e.Scale)
}

// LU is the factorization P·A = L·U of a general band matrix by Gaussian
// elimination with partial pivoting within the band, after LAPACK's
// dgbtrf/dgbtrs: L unit lower triangular with KL subdiagonals, U upper
// triangular with KL+KU superdiagonals, P the row interchanges. Factorize
// once, then SolveTo as many right-hand sides as needed:
//
//	var f band.LU
//	if err := f.Factorize(a); err != nil { ... }
//	f.SolveTo(x, b)
//
// Factorize costs O(N·KL·(KL+KU)) and SolveTo O(N·(2·KL+KU)); neither
// allocates once the receiver has held a matrix of the same size.
type LU struct {
	n, kl, ku int
	// f is the factor in General's layout: U on the diagonal and the KL+KU
	// places right of it, and in the KL places left of it the multipliers
	// of L, where elimination left them: the multiplier that cleared A[r][i]
	// at step i stays at (r, i), whatever later steps interchange (dgbtrf's
	// convention), and the solves apply the interchanges in the same order.
	f []float64
	// pivots[i] is the row interchanged with row i at step i.
	pivots []int
	// reach[i] is how many places right of the diagonal row i of U holds
	// up to its last nonzero: pivoting fills the KL places of fill only
	// here and there, and the solves skip the zeros past it. Subtracting a
	// zero product changes no number but −0, so they give the full width's
	// answer to the bit, but perhaps for the sign of a zero.
	reach []int
	// valid says f holds a factorization to solve with.
	valid bool
	// work is scratch for the condition estimate.
	work [2][]float64
	// scale is the largest magnitude in each column of A, colSum the sum
	// of their magnitudes, and norm1 the largest sum, ‖A‖₁.
	scale, colSum []float64
	norm1         float64
}

// Factorize computes the factorization of a, which it does not modify. At
// every step the pivot is the entry of largest magnitude in its column on or
// below the diagonal, and it must exceed 1e−14 times the largest magnitude in
// the same column of A; otherwise Factorize returns a *SingularError naming
// the column and leaves the receiver with nothing to solve with. A refusal
// means the 2-norm condition number of A is at least 1e14/√(KL+1): the
// column left after elimination, of length at most KL+1, is a column of the
// Schur complement, whose inverse is a block of A⁻¹ permuted. A matrix with
// a NaN or an infinite entry, or whose elimination overflows, is refused too.
func (f *LU) Factorize(a *General) error { return f.factorize(a, false) }

// FactorizeInPlace is Factorize working in a's own storage instead of a
// copy: a.Data then holds the factorization, belongs to the receiver, and
// is no matrix to read, change or factorize again. It spares a matrix too
// large to copy cheaply, and Cond(a) still estimates a's condition.
func (f *LU) FactorizeInPlace(a *General) error { return f.factorize(a, true) }

// factorize is Factorize, in a.Data itself when inPlace.
func (f *LU) factorize(a *General, inPlace bool) error {
	n, kl, ku := a.N, a.KL, a.KU
	s := a.Stride()
	f.valid = false
	if n < 0 || kl < 0 || ku < 0 || len(a.Data) < n*s {
		return errors.New("band: band matrix storage is smaller than its size")
	}
	f.n, f.kl, f.ku = n, kl, ku
	f.pivots, f.reach = resized(f.pivots, n), resized(f.reach, n)
	f.scale, f.colSum = resized(f.scale, n), resized(f.colSum, n)
	if inPlace {
		f.f = a.Data[:n*s]
	} else {
		f.f = resized(f.f, n*s)
	}
	d, piv, scale := f.f, f.pivots, f.scale
	// The columns' largest magnitudes and their sums (down each column, as
	// a walk down it would add them) gathered row by row, in memory's
	// order, before the band of the row goes to d with zeros in its fill,
	// whatever a's fill holds.
	w := kl + ku + 1
	clear(scale)
	clear(f.colSum)
	for i := range n {
		first := max(0, i-kl)
		cols, sums := scale[first:], f.colSum[first:]
		for c, v := range a.row(i) {
			cols[c] = max(cols[c], math.Abs(v))
			sums[c] += math.Abs(v)
		}
		if !inPlace {
			copy(d[i*s:i*s+w], a.Data[i*s:i*s+w])
		}
		clear(d[i*s+w : i*s+s])
	}
	f.norm1 = 0
	for _, sum := range f.colSum {
		f.norm1 = max(f.norm1, sum)
	}
	// ju is the last column the rows of U so far reach (dgbtf2's JU): rows
	// below need no update right of it.
	ju := 0
	for i := range n {
		km := min(kl, n-1-i) // rows below the diagonal in column i
		// Column i from row i down sits at offsets kl, kl-1, ... of its rows.
		p, best := i, math.Abs(d[i*s+kl])
		for r := 1; r <= km; r++ {
			if v := math.Abs(d[(i+r)*s+kl-r]); v > best {
				p, best = i+r, v
			}
		}
		// A NaN compares false and an overflow is infinite: both refused.
		if !(best > luTolerance*scale[i]) || best > math.MaxFloat64 {
			return &SingularError{Column: i, Pivot: d[p*s+kl-(p-i)], Scale: scale[i]}
		}
		piv[i] = p
		ju = max(ju, min(p+ku, n-1))
		u := d[i*s+kl : i*s+kl+ju-i+1] // row i of U, columns i to ju
		if p != i {
			q := p*s + kl - (p - i)
			other := d[q : q+len(u)]
			for c := range u {
				u[c], other[c] = other[c], u[c]
			}
		}
		pivot, right := u[0], u[1:]
		// Row i of U is final: no later step changes it.
		m := len(right)
		for m > 0 && right[m-1] == 0 {
			m--
		}
		f.reach[i] = m
		// Zero multipliers are not skipped: a NaN or an infinity right of
		// the pivot then spreads down to a later pivot and is refused there.
		for r := 1; r <= km; r++ {
			q := (i+r)*s + kl - r
			l := d[q] / pivot
			d[q] = l
			row := d[q+1 : q+1+len(right)]
			for c, v := range right {
				row[c] -= l * v
			}
		}
	}
	f.valid = true
	return nil
}

// SolveTo solves A·x = b into dst using the factorization; dst and b may be
// the same slice but must not overlap otherwise. It reads the factor and
// never changes it, so any number of right-hand sides may be solved after
// one Factorize.
func (f *LU) SolveTo(dst, b []float64) error {
	if !f.valid {
		return errors.New("band: no LU factorization to solve with (Factorize failed or was not called)")
	}
	if len(dst) != f.n || len(b) != f.n {
		return fmt.Errorf("band: solve with vectors of length %d and %d for a factorization of order %d", len(dst), len(b), f.n)
	}
	copy(dst, b)
	f.solve(dst)
	return nil
}

// resized returns v with length n, reusing its storage when it has room.
func resized[T any](v []T, n int) []T {
	if cap(v) < n {
		return make([]T, n)
	}
	return v[:n]
}

// solve overwrites x with A⁻¹·x.
func (f *LU) solve(x []float64) {
	n, kl, s := f.n, f.kl, 2*f.kl+f.ku+1
	d := f.f
	// L⁻¹·P: the interchange and the multipliers of each step, in order.
	// Going down column i of L, the place in d moves on by s−1 a row.
	for i := range n {
		if p := f.pivots[i]; p != i {
			x[i], x[p] = x[p], x[i]
		}
		xi, q := x[i], i*s+kl
		below := x[i+1 : i+1+min(kl, n-1-i)]
		for r := range below {
			q += s - 1
			below[r] -= d[q] * xi
		}
	}
	// U⁻¹, by rows from the bottom up.
	for i := n - 1; i >= 0; i-- {
		u := d[i*s+kl+1 : i*s+kl+1+f.reach[i]]
		rest := x[i+1 : i+1+len(u)]
		sum := x[i]
		for c, v := range u {
			sum -= v * rest[c]
		}
		x[i] = sum / d[i*s+kl]
	}
}

// solveTransposed overwrites x with A⁻ᵀ·x: the steps of solve transposed, in
// reverse order.
func (f *LU) solveTransposed(x []float64) {
	n, kl, s := f.n, f.kl, 2*f.kl+f.ku+1
	d := f.f
	// U⁻ᵀ: the rows of U are the columns of Uᵀ.
	for i := range n {
		u := d[i*s+kl+1 : i*s+kl+1+f.reach[i]]
		rest := x[i+1 : i+1+len(u)]
		xi := x[i] / d[i*s+kl]
		x[i] = xi
		for c, v := range u {
			rest[c] -= v * xi
		}
	}
	// Pᵀ·L⁻ᵀ: each step's multipliers, then its interchange, last step first.
	for i := n - 1; i >= 0; i-- {
		sum, q := x[i], i*s+kl
		for _, v := range x[i+1 : i+1+min(kl, n-1-i)] {
			q += s - 1
			sum -= d[q] * v
		}
		x[i] = sum
		if p := f.pivots[i]; p != i {
			x[i], x[p] = x[p], x[i]
		}
	}
}
