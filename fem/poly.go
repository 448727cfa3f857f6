package fem

// derivativeAt evaluates the d-th derivative of the polynomial Σ c[k]·t^k at t.
func derivativeAt(c []float64, d int, t float64) float64 {
	sum := 0.0
	for k := len(c) - 1; k >= d; k-- {
		sum = sum*t + c[k]*fallingFactorial(k, d)
	}
	return sum
}

// fallingFactorial is k·(k−1)···(k−d+1), the factor d-fold differentiation puts on t^k.
func fallingFactorial(k, d int) float64 {
	f := 1.0
	for i := 0; i < d; i++ {
		f *= float64(k - i)
	}
	return f
}

// monomialDerivative is the d-th derivative of t^k at t.
func monomialDerivative(k, d int, t float64) float64 {
	if d > k {
		return 0
	}
	p := 1.0
	for i := 0; i < k-d; i++ {
		p *= t
	}
	return fallingFactorial(k, d) * p
}
