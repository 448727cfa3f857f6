package band

// The general kernel takes any half-bandwidth: a right-looking elimination
// row by row, from the top down, in place on a copy of the band. The factor
// keeps the band layout of Symmetric: U above the diagonal, 1/pivot on it.

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

// solveRows solves with a factorization from factorRows; x and b may be the
// same slice.
func solveRows(d, x, b []float64, n, k int) {
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
}
