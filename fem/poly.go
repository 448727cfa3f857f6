package fem

import "math"

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

// derivativeMagnitude is Σ |c[k]·(d-th derivative of t^k)| at t: the size of
// the terms derivativeAt adds, hence the scale of its round-off.
func derivativeMagnitude(c []float64, d int, t float64) float64 {
	sum := 0.0
	for k := d; k < len(c); k++ {
		sum += math.Abs(c[k] * monomialDerivative(k, d, t))
	}
	return sum
}
