package band

import "math"

// Cond estimates the 1-norm condition number ‖A‖₁·‖A⁻¹‖₁ of a, the matrix
// that was factorized, as LAPACK's dgbcon does: ‖A‖₁ as Factorize found it
// in a's band (a must not have changed since; after FactorizeInPlace a's
// order alone is read), ‖A⁻¹‖₁
// by Hager's method with Higham's refinements (LAPACK's dlacn2; Higham,
// Accuracy and Stability of Numerical Algorithms, §15.3, from memory), at
// most a dozen solves with A and Aᵀ, so its cost is O(N·(KL+KU)). The
// estimate is a lower bound, in practice within a small factor. Cond
// returns +Inf when the receiver holds no factorization of a matrix of a's
// order, and 0 for an empty matrix.
func (f *LU) Cond(a *General) float64 {
	n := f.n
	if !f.valid || a.N != n {
		return math.Inf(1)
	}
	if n == 0 {
		return 0
	}
	f.work[0], f.work[1] = resized(f.work[0], n), resized(f.work[1], n)
	return f.norm1 * f.inverseNorm1(f.work[0], f.work[1])
}

// inverseNorm1 estimates ‖A⁻¹‖₁ in the steps of dlacn2, with x and sign as
// scratch. Every value it takes is ‖A⁻¹·v‖₁/‖v‖₁ for some v, so the largest
// is kept (dlacn2 keeps the last).
func (f *LU) inverseNorm1(x, sign []float64) float64 {
	n := len(x)
	for i := range x {
		x[i] = 1 / float64(n)
	}
	f.solve(x)
	est := norm1(x)
	if n == 1 {
		return est // exact
	}
	setSigns(sign, x)
	copy(x, sign)
	f.solveTransposed(x)
	j := argmaxAbs(x)
	for iter := 2; ; iter++ {
		clear(x)
		x[j] = 1
		f.solve(x)
		e := norm1(x)
		if sameSigns(sign, x) || e <= est {
			// A repeated sign vector has converged; a smaller value cycles.
			est = max(est, e)
			break
		}
		est = e
		setSigns(sign, x)
		copy(x, sign)
		f.solveTransposed(x)
		last := j
		j = argmaxAbs(x)
		if x[last] == math.Abs(x[j]) || iter == 5 {
			break
		}
	}
	// Higham's alternating vector guards against matrices that fool the
	// iteration.
	for i := range x {
		x[i] = 1 + float64(i)/float64(n-1)
		if i%2 == 1 {
			x[i] = -x[i]
		}
	}
	f.solve(x)
	return max(est, 2*norm1(x)/(3*float64(n)))
}

// setSigns sets sign[i] to the sign of v[i], +1 for zero.
func setSigns(sign, v []float64) {
	for i, x := range v {
		sign[i] = 1
		if x < 0 {
			sign[i] = -1
		}
	}
}

// sameSigns says whether sign holds the signs of v, as setSigns would set them.
func sameSigns(sign, v []float64) bool {
	for i, x := range v {
		if (x < 0) != (sign[i] < 0) {
			return false
		}
	}
	return true
}

// argmaxAbs returns the first index of largest magnitude in v.
func argmaxAbs(v []float64) int {
	j := 0
	for i, x := range v {
		if math.Abs(x) > math.Abs(v[j]) {
			j = i
		}
	}
	return j
}
