package band

import "math"

// Cond estimates the 1-norm condition number of S·A·S, S = diag(scale) (of A
// when scale is nil), where a is the matrix that was factorized. It uses the
// Hager–Higham estimator (Higham, Accuracy and Stability of Numerical
// Algorithms, §15.3, from memory), a handful of solves, so its cost is linear
// in N. The estimate is a lower bound, in practice within a small factor.
func (f *LDL) Cond(a *Symmetric, scale []float64) float64 {
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
