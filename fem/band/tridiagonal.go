package band

// A tridiagonal matrix, half-bandwidth 1 (the bar), is factorized from both
// ends at once, as the scalar half-bandwidth-3 kernel does (twisted3.go):
// rows 0..t−1 downwards, rows n−1..t+1 upwards, row t last. Each direction's
// pivot waits for the division before it; two chains in one loop let the
// processor overlap them.
//
// Storage stays in Symmetric's layout: A[r][r+1] holds the multiplier of
// pivot r when r < t and of pivot r+1 when r ≥ t; diagonals hold 1/pivot.

// twistRow1 is the row an n×n band-1 matrix eliminates last.
func twistRow1(n int) int { return (n - 1) / 2 }

// factorTridiagonal factorizes orig (n ≥ 1, half-bandwidth 1) into d. With b
// not nil it solves into x as well, the forward substitution riding in the
// factorization's sweep beside the pivots' chains.
func factorTridiagonal(d, orig []float64, n int, x, b []float64) error {
	t := twistRow1(n)
	rhs := b != nil
	// What the last pivot of each chain takes off the next diagonal,
	// and the forward substitution's y with the multiplier that passes it on.
	var down, up float64
	var yd, ld, yu, lu float64
	for i := range n - 1 - t {
		if i < t {
			o := orig[2*i : 2*i+2 : 2*i+2]
			piv, inv, l, next, ok := eliminate1(o[0], down, o[1])
			if !ok {
				return &PivotError{Row: i, Pivot: piv, Diagonal: o[0]}
			}
			down = next
			r := d[2*i : 2*i+2 : 2*i+2]
			r[0], r[1] = inv, l
			if rhs {
				y := b[i] - ld*yd
				x[i] = y * inv
				yd, ld = y, l
			}
		}
		// The upward row j: its link A[j−1][j] and its diagonal.
		j := n - 1 - i
		o := orig[2*j-1 : 2*j+1 : 2*j+1]
		piv, inv, l, next, ok := eliminate1(o[1], up, o[0])
		if !ok {
			return &PivotError{Row: j, Pivot: piv, Diagonal: o[1]}
		}
		up = next
		r := d[2*j-1 : 2*j+1 : 2*j+1]
		r[0], r[1] = l, inv
		if rhs {
			z := b[j] - lu*yu
			x[j] = z * inv
			yu, lu = z, l
		}
	}
	piv := orig[2*t] - down - up
	if !pivotOK(piv, orig[2*t]) {
		return &PivotError{Row: t, Pivot: piv, Diagonal: orig[2*t]}
	}
	d[2*t] = 1 / piv
	if rhs {
		x[t] = (b[t] - ld*yd - lu*yu) * d[2*t]
		backwardTridiagonal(d, x, n)
	}
	return nil
}

// eliminate1 eliminates one row of a chain: its diagonal less what the row
// before took off it, and its link a to the next row. It returns the pivot,
// 1/pivot, the multiplier a/pivot and what the next row loses, (a/pivot)·a,
// never a², which would overflow or underflow for entries beyond 1e±154;
// ok is false when the pivot fails pivotOK.
func eliminate1(diag, take, a float64) (piv, inv, l, next float64, ok bool) {
	piv = diag - take
	l = a / piv
	return piv, 1 / piv, l, l * a, pivotOK(piv, diag)
}

// solveTridiagonal solves with a factorization from factorTridiagonal; x and b may
// be the same slice. Each chain takes two rows a step: with multipliers l₀,
// l₁ the second row's value is (b₁ − l₁·b₀) + (l₁·l₀)·y, one multiply-add
// after the carried y instead of two, the rest computed beside the chain.
func solveTridiagonal(d, x, b []float64, n int) {
	t := twistRow1(n)
	upRows := n - 1 - t // t or t+1
	// Forward: y carried down from row i and up from row j, with the
	// multiplier that passes it to the next row.
	var yd, ld, yu, lu float64
	i := 0
	for ; i+1 < t; i += 2 {
		r := d[2*i : 2*i+4 : 2*i+4] // 1/piv_i, l_i, 1/piv_{i+1}, l_{i+1}
		b0, b1 := b[i], b[i+1]
		y0 := b0 - ld*yd
		y1 := (b1 - r[1]*b0) + (r[1]*ld)*yd
		x[i], x[i+1] = y0*r[0], y1*r[2]
		yd, ld = y1, r[3]

		j := n - 1 - i
		q := d[2*j-3 : 2*j+1 : 2*j+1] // u_{j−1}, 1/piv_{j−1}, u_j, 1/piv_j
		c0, c1 := b[j], b[j-1]
		z0 := c0 - lu*yu
		z1 := (c1 - q[2]*c0) + (q[2]*lu)*yu
		x[j], x[j-1] = z0*q[3], z1*q[1]
		yu, lu = z1, q[0]
	}
	for ; i < upRows; i++ {
		if i < t {
			y := b[i] - ld*yd
			x[i] = y * d[2*i]
			yd, ld = y, d[2*i+1]
		}
		j := n - 1 - i
		z := b[j] - lu*yu
		x[j] = z * d[2*j]
		yu, lu = z, d[2*j-1]
	}
	x[t] = (b[t] - ld*yd - lu*yu) * d[2*t]
	backwardTridiagonal(d, x, n)
}

// backwardTridiagonal is the back substitution of solveTridiagonal, from row t
// outwards both ways, on the forward solution in x: x_i = z_i − l_i·x_{i+1}
// below, x_j = z_j − u_j·x_{j−1} above.
func backwardTridiagonal(d, x []float64, n int) {
	t := twistRow1(n)
	upRows := n - 1 - t
	xd, xu := x[t], x[t]
	k := 0
	for ; k+1 < t; k += 2 {
		i := t - 1 - k
		l0, l1 := d[2*i+1], d[2*i-1] // l_i, l_{i−1}
		z0, z1 := x[i], x[i-1]
		x[i] = z0 - l0*xd
		xd = (z1 - l1*z0) + (l1*l0)*xd
		x[i-1] = xd

		j := t + 1 + k
		u0, u1 := d[2*j-1], d[2*j+1] // u_j, u_{j+1}
		w0, w1 := x[j], x[j+1]
		x[j] = w0 - u0*xu
		xu = (w1 - u1*w0) + (u1*u0)*xu
		x[j+1] = xu
	}
	for ; k < upRows; k++ {
		if k < t {
			i := t - 1 - k
			xd = x[i] - d[2*i+1]*xd
			x[i] = xd
		}
		j := t + 1 + k
		xu = x[j] - d[2*j-1]*xu
		x[j] = xu
	}
}
