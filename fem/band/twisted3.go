package band

// Half-bandwidth 3 (the beam) is factorized from both ends at once, a
// twisted factorization: rows 0..t−1 are eliminated downwards, rows
// n−1..t+3 upwards, and the 3×3 block of rows t..t+2 last. Each pivot waits
// for the division of the one before it; two independent chains in one loop
// let the processor overlap them, and the solves gain the same way. The
// elimination order is a symmetric permutation of the rows, so the result is
// the LDLᵀ factorization of the permuted matrix, as stable as the plain one.
//
// Storage stays in Symmetric's layout: an entry A[r][c] (r < c) holds the
// multiplier of pivot r when r < t (downward rows and their links into the
// block), of pivot c when c ≥ t+3 (upward rows and theirs), and the block's
// own factor inside the block; diagonals hold 1/pivot.

// twistedMin is the smallest order factorized from both ends: one row each
// way around the block.
const twistedMin = 5

// twistRow is the first row of the middle block of an n×n band-3 matrix.
func twistRow(n int) int { return (n - 3) / 2 }

// eliminate3 takes the pivot piv with links a1..a3 and the updates pending
// on the next rows, seen from the chain's direction: p0..p2 on the next
// pivot's diagonal and its two links, q0 and q1 on the row after, s0 on the
// third row's diagonal (p1 and p2 are already in a1 and a2). It returns
// 1/piv, the multipliers and the new pending updates. Plain scalars, so the
// chains stay in registers.
func eliminate3(piv, a1, a2, a3, q0, q1, s0, next float64) (inv, l1, l2, l3, nextPiv, p0, p1, p2, nq0, nq1, ns0 float64) {
	// The next pivot is (its diagonal + q0) − (a1/piv)·a1: a division, a
	// multiplication and a subtraction after this pivot, the sum being ready
	// before; never a1², which would overflow or underflow for entries beyond
	// 1e±154. 1/piv, a second division, is not on that path.
	l1 = a1 / piv
	t := l1 * a1
	inv = 1 / piv
	l2, l3 = a2*inv, a3*inv
	return inv, l1, l2, l3, (next + q0) - t, q0 - t, q1 - l1*a2, -l1 * a3, s0 - l2*a2, -l2 * a3, -l3 * a3
}

// factorTwisted3 factorizes orig (n ≥ twistedMin, half-bandwidth 3) into d.
func factorTwisted3(d, orig []float64, n int) error {
	t := twistRow(n)
	// Pending updates of the downward (p, q, s) and upward (u, v, w) chains,
	// and the next pivot of each.
	var p0, p1, p2, q0, q1, s0 float64
	var u0, u1, u2, v0, v1, w0 float64
	down, up := orig[0], orig[4*(n-1)]
	// Rows t+3..n−1 go upwards: as many as go downwards, or one more.
	for i := range n - 3 - t {
		if i < t {
			o := orig[4*i : 4*i+5 : 4*i+5]
			piv := down
			if !pivotOK(piv, o[0]) {
				return &PivotError{Row: i, Pivot: piv, Diagonal: o[0]}
			}
			r := d[4*i : 4*i+4 : 4*i+4]
			r[0], r[1], r[2], r[3], down, p0, p1, p2, q0, q1, s0 = eliminate3(piv, o[1]+p1, o[2]+p2, o[3], q0, q1, s0, o[4])
		}
		// The upward row j has links A[j−1][j], A[j−2][j], A[j−3][j].
		j := n - 1 - i
		piv := up
		if !pivotOK(piv, orig[4*j]) {
			return &PivotError{Row: j, Pivot: piv, Diagonal: orig[4*j]}
		}
		d[4*j], d[4*j-3], d[4*j-6], d[4*j-9], up, u0, u1, u2, v0, v1, w0 = eliminate3(piv, orig[4*j-3]+u1, orig[4*j-6]+u2, orig[4*j-9], v0, v1, w0, orig[4*j-4])
	}
	// The block gets both chains' updates: downward ones counted from row
	// t, upward ones from row t+2.
	m := d[4*t : 4*t+12 : 4*t+12]
	o := orig[4*t : 4*t+12 : 4*t+12]
	block := [3][3]float64{
		{o[0] + p0 + w0, o[1] + p1 + v1, o[2] + p2 + u2},
		{0, o[4] + q0 + v0, o[5] + q1 + u1},
		{0, 0, o[8] + s0 + u0},
	}
	for r := range 3 {
		piv := block[r][r]
		if !pivotOK(piv, o[4*r]) {
			return &PivotError{Row: t + r, Pivot: piv, Diagonal: o[4*r]}
		}
		inv := 1 / piv
		for c := r + 1; c < 3; c++ {
			l := block[r][c] * inv
			for cc := c; cc < 3; cc++ {
				block[c][cc] -= l * block[r][cc]
			}
			m[4*r+c-r] = l
		}
		m[4*r] = inv
	}
	return nil
}

// solveTwisted3 solves with a factorization from factorTwisted3; dst and b
// may be the same slice.
func solveTwisted3(d, x, b []float64, n int) {
	t := twistRow(n)
	// Forward: both chains push their y down the rows they updated.
	var p0, p1, p2, u0, u1, u2 float64
	for i := range n - 3 - t {
		if i < t {
			r := d[4*i : 4*i+4 : 4*i+4]
			y := b[i] + p0
			p0, p1, p2 = p1-r[1]*y, p2-r[2]*y, -r[3]*y
			x[i] = y * r[0]
		}
		j := n - 1 - i
		z := b[j] + u0
		u0, u1, u2 = u1-d[4*j-3]*z, u2-d[4*j-6]*z, -d[4*j-9]*z
		x[j] = z * d[4*j]
	}
	m := d[4*t : 4*t+12 : 4*t+12]
	y0 := b[t] + p0 + u2
	y1 := b[t+1] + p1 + u1 - m[1]*y0
	y2 := b[t+2] + p2 + u0 - m[2]*y0 - m[5]*y1
	x2 := y2 * m[8]
	x1 := y1*m[4] - m[5]*x2
	x0 := y0*m[0] - m[1]*x1 - m[2]*x2
	x[t], x[t+1], x[t+2] = x0, x1, x2
	// Backward: from the block outwards, both ways in one loop.
	down1, down2, down3 := x0, x1, x2
	up1, up2, up3 := x2, x1, x0
	for k := range n - 3 - t {
		if k < t {
			i := t - 1 - k
			r := d[4*i : 4*i+4 : 4*i+4]
			down1, down2, down3 = x[i]-r[3]*down3-r[2]*down2-r[1]*down1, down1, down2
			x[i] = down1
		}
		j := t + 3 + k
		up1, up2, up3 = x[j]-d[4*j-9]*up3-d[4*j-6]*up2-d[4*j-3]*up1, up1, up2
		x[j] = up1
	}
}
