package band

import "errors"

// A beam's system, with the deflection and rotation of each node in turn, is
// block tridiagonal: half-bandwidth 3 with A[2i+1][2i+4] = 0, nodes coupled
// only to their neighbours through 2×2 blocks. Such a matrix is factorized
// node by node, A = L·D·Lᵀ with 2×2 diagonal blocks D: each node costs one
// division, where the row-by-row kernel (twisted3.go) pays two per row, and
// about a third fewer other operations. As there, the nodes are eliminated
// from both ends at once: nodes 0..m−1 downwards, N−1..m+1 upwards, node m
// last, two independent chains in one loop.
//
// With A_i the diagonal block of node i and B_i its coupling to node i+1,
// the downward chain carries S_{i+1} = A_{i+1} − B_iᵀ·S_i⁻¹·B_i and the upward
// one T_{i−1} = A_{i−1} − B_{i−1}·T_i⁻¹·B_{i−1}ᵀ. The factor keeps, in the 8
// entries of node i's two rows: the inverse of its pivot block (3 entries of
// the symmetric 2×2), then the 2×2 multiplier S_i⁻¹·B_i (downward) or
// T_i⁻¹·B_{i−1}ᵀ (upward), by rows. FactorizeSolve runs the forward
// substitution in the same sweep, carrying the multiplier's Wᵀ·z (Vᵀ·z
// upwards) to the next node, as SolveTo does.

// errNotNodeBlocked says the node-block kernel does not apply: the matrix
// couples a rotation to the node after next, or a diagonal entry lies outside
// nodeRange.
var errNotNodeBlocked = errors.New("band: the band is not block tridiagonal by nodes of moderate size")

// nodeRange bounds the diagonal entries the node-block kernel takes. It
// multiplies three entries together (Cᵀ·adj(S)·C); with every diagonal, and
// so every entry of a positive definite matrix, within 1e±80, and the pivots
// no smaller than 1e−14 of their diagonal, no product leaves float64's range.
// Other matrices take the row-by-row kernel, which multiplies only two.
const nodeRange = 1e80

// moderate reports whether two diagonal entries lie within nodeRange.
func moderate(a, b float64) bool {
	return a >= 1/nodeRange && a <= nodeRange && b >= 1/nodeRange && b <= nodeRange
}

// nodeBlockMin is the smallest order the node-block kernel takes: three
// nodes, one each way around the middle.
const nodeBlockMin = 6

// middleNode is the node an n×n node-blocked matrix eliminates last.
func middleNode(n int) int { return (n/2 - 1) / 2 }

// The elimination of one pivot block S = [s11 s12; s12 s22], coupled to the
// next node by C (row-major c11 c12; c21 c22, the next node's unknowns in
// its columns), is split into helpers small enough for the compiler to
// inline: a call would spill both chains' state at every node.
//
// pivotAdj returns det S and adj(S)·C, both free of the division.
func pivotAdj(s11, s12, s22, c11, c12, c21, c22 float64) (det, a11, a12, a21, a22 float64) {
	return s11*s22 - s12*s12, s22*c11 - s12*c21, s22*c12 - s12*c22, s11*c21 - s12*c11, s11*c22 - s12*c12
}

// congruence returns the symmetric Cᵀ·A for A = adj(S)·C: det S times what
// the next node's block loses.
func congruence(c11, c12, c21, c22, a11, a12, a21, a22 float64) (p11, p12, p22 float64) {
	return c11*a11 + c21*a21, c11*a12 + c21*a22, c12*a12 + c22*a22
}

// storeNode writes a node's factor, S⁻¹ and W = S⁻¹·C, from adj(S)·C and
// inv = 1/det S.
func storeNode(f []float64, inv, s11, s12, s22, a11, a12, a21, a22 float64) {
	f[0], f[1], f[2], f[3], f[4], f[5], f[6] = s22*inv, -s12*inv, s11*inv, a11*inv, a12*inv, a21*inv, a22*inv
}

// forwardStep is one node of the forward substitution, in the
// factorization's sweep (factorNodes) or after it (solveNodes), in the same
// arithmetic: z = b − g, g what the node before took off; x = S⁻¹·z from the
// node's factor f; and what this node takes off the next, Wᵀ·z.
func forwardStep(f, b, x []float64, g1, g2 float64) (float64, float64) {
	z1, z2 := b[0]-g1, b[1]-g2
	x[0], x[1] = f[0]*z1+f[1]*z2, f[1]*z1+f[2]*z2
	return f[3]*z1 + f[5]*z2, f[4]*z1 + f[6]*z2
}

// pivotBlockOK tests a 2×2 pivot block as the row-by-row factorization would
// test its two pivots, s11 and det/s11, against the original diagonal
// entries o1 and o2; it returns the failing row (0 or 1) and its pivot.
func pivotBlockOK(s11, det, o1, o2 float64) (ok bool, row int, pivot float64) {
	if !pivotOK(s11, o1) {
		return false, 0, s11
	}
	if p := det / s11; !pivotOK(p, o2) {
		return false, 1, p
	}
	return true, 0, 0
}

// blockSplit bounds how nearly singular a pivot block the node-block
// kernel takes: det S at least blockSplit·s11·s22, an off-diagonal entry
// below √(1 − blockSplit) of the geometric mean of the diagonal ones. A
// block nearer singular, such as the one a very short element beyond a
// hinge leaves (its stiffness, pinned at one end, has rank one), makes the
// adjugate's products cancel to a few digits, and the solve's residual
// grows far past the round-off of the row-by-row kernel, which such
// matrices take instead. A beam element's own block has det = s11·s22/4,
// and a foundation's or a spring's adds to the diagonal, so ordinary beams
// stay on this kernel.
const blockSplit = 1.0 / 16

// wellSplit reports whether the pivot block with diagonal s11, s22 and
// determinant det is far enough from singular for the node-block kernel
// (blockSplit).
func wellSplit(s11, s22, det float64) bool { return det >= blockSplit*s11*s22 }

// factorNodes factorizes orig (n even, n ≥ nodeBlockMin, half-bandwidth 3)
// into d, or returns errNotNodeBlocked, with d spoilt, when orig is not block
// tridiagonal by nodes, has a diagonal entry beyond nodeRange or meets a
// pivot block near singular (wellSplit). With b not nil it solves into x as
// well, the forward substitution riding in the factorization's sweep.
func factorNodes(d, orig []float64, n int, x, b []float64) error {
	rhs := b != nil
	nodes := n / 2
	m := middleNode(n)
	// The next pivot block each way.
	s11, s12, s22 := orig[0], orig[1], orig[4]
	e := 8 * (nodes - 1)
	t11, t12, t22 := orig[e], orig[e+1], orig[e+4]
	// What the forward substitution's last node takes off the next one's
	// right-hand side, down and up.
	var g1, g2, h1, h2 float64
	for k := range nodes - 1 - m {
		if k < m {
			i := k
			o := orig[8*i : 8*i+13 : 8*i+13] // node i's rows and the next diagonal block
			if o[7] != 0 || !moderate(o[0], o[4]) {
				return errNotNodeBlocked
			}
			c11, c12, c21, c22 := o[2], o[3], o[5], o[6]
			det, a11, a12, a21, a22 := pivotAdj(s11, s12, s22, c11, c12, c21, c22)
			p11, p12, p22 := congruence(c11, c12, c21, c22, a11, a12, a21, a22)
			inv := 1 / det
			if ok, r, p := pivotBlockOK(s11, det, o[0], o[4]); !ok {
				return &PivotError{Row: 2*i + r, Pivot: p, Diagonal: o[4*r]}
			}
			if !wellSplit(s11, s22, det) {
				return errNotNodeBlocked
			}
			f := d[8*i : 8*i+8 : 8*i+8]
			storeNode(f, inv, s11, s12, s22, a11, a12, a21, a22)
			s11, s12, s22 = o[8]-p11*inv, o[9]-p12*inv, o[12]-p22*inv
			if rhs {
				g1, g2 = forwardStep(f, b[2*i:2*i+2:2*i+2], x[2*i:2*i+2:2*i+2], g1, g2)
			}
		}
		// The upward node j is coupled to j−1 by B_{j−1}ᵀ.
		j := nodes - 1 - k
		o := orig[8*j-8 : 8*j+5 : 8*j+5] // node j−1's rows, then node j's block
		// o[7] couples node j−1 to j+1; past the last node it is no entry.
		if o[7] != 0 && j+1 < nodes || !moderate(o[8], o[12]) {
			return errNotNodeBlocked
		}
		c11, c12, c21, c22 := o[2], o[5], o[3], o[6]
		det, a11, a12, a21, a22 := pivotAdj(t11, t12, t22, c11, c12, c21, c22)
		p11, p12, p22 := congruence(c11, c12, c21, c22, a11, a12, a21, a22)
		inv := 1 / det
		if ok, r, p := pivotBlockOK(t11, det, o[8], o[12]); !ok {
			return &PivotError{Row: 2*j + r, Pivot: p, Diagonal: o[8+4*r]}
		}
		if !wellSplit(t11, t22, det) {
			return errNotNodeBlocked
		}
		f := d[8*j : 8*j+8 : 8*j+8]
		storeNode(f, inv, t11, t12, t22, a11, a12, a21, a22)
		t11, t12, t22 = o[0]-p11*inv, o[1]-p12*inv, o[4]-p22*inv
		if rhs {
			h1, h2 = forwardStep(f, b[2*j:2*j+2:2*j+2], x[2*j:2*j+2:2*j+2], h1, h2)
		}
	}
	// The middle node takes what both chains took off it: each of s and t
	// is its block less one chain's part.
	o := orig[8*m : 8*m+5 : 8*m+5]
	if !moderate(o[0], o[4]) {
		return errNotNodeBlocked
	}
	s11, s12, s22 = s11+t11-o[0], s12+t12-o[1], s22+t22-o[4]
	det := s11*s22 - s12*s12
	if ok, r, p := pivotBlockOK(s11, det, o[0], o[4]); !ok {
		return &PivotError{Row: 2*m + r, Pivot: p, Diagonal: o[4*r]}
	}
	if !wellSplit(s11, s22, det) {
		return errNotNodeBlocked
	}
	inv := 1 / det
	f := d[8*m : 8*m+8 : 8*m+8]
	f[0], f[1], f[2] = s22*inv, -s12*inv, s11*inv
	if rhs {
		finishNodes(d, x, b, n, g1, g2, h1, h2)
	}
	return nil
}

// solveNodes solves with a factorization from factorNodes; x and b may be
// the same slice. It is the factorization's own forward substitution
// (forwardStep) and back substitution, on the stored factor.
func solveNodes(d, x, b []float64, n int) {
	nodes := n / 2
	m := middleNode(n)
	var g1, g2, h1, h2 float64 // what the last node each way takes off the next
	for k := range nodes - 1 - m {
		if k < m {
			i := k
			g1, g2 = forwardStep(d[8*i:8*i+8:8*i+8], b[2*i:2*i+2:2*i+2], x[2*i:2*i+2:2*i+2], g1, g2)
		}
		j := nodes - 1 - k
		h1, h2 = forwardStep(d[8*j:8*j+8:8*j+8], b[2*j:2*j+2:2*j+2], x[2*j:2*j+2:2*j+2], h1, h2)
	}
	finishNodes(d, x, b, n, g1, g2, h1, h2)
}

// finishNodes solves for the middle node, which both forward chains reach
// with what they take off its right-hand side, then substitutes back.
func finishNodes(d, x, b []float64, n int, g1, g2, h1, h2 float64) {
	m := middleNode(n)
	f := d[8*m : 8*m+3 : 8*m+3]
	bb := b[2*m : 2*m+2 : 2*m+2]
	z1, z2 := bb[0]-g1-h1, bb[1]-g2-h2
	x[2*m], x[2*m+1] = f[0]*z1+f[1]*z2, f[1]*z1+f[2]*z2
	backwardNodes(d, x, n)
}

// backwardNodes is the back substitution of solveNodes, from the middle node
// outwards, on the forward solution in x: x_i −= W_i·x_{i+1} below,
// x_j −= V_j·x_{j−1} above.
func backwardNodes(d, x []float64, n int) {
	nodes := n / 2
	m := middleNode(n)
	a1, a2 := x[2*m], x[2*m+1]
	c1, c2 := a1, a2
	for k := range nodes - 1 - m {
		if k < m {
			i := m - 1 - k
			a1, a2 = backwardNode(d[8*i:8*i+8:8*i+8], x[2*i:2*i+2:2*i+2], a1, a2)
		}
		j := m + 1 + k
		c1, c2 = backwardNode(d[8*j:8*j+8:8*j+8], x[2*j:2*j+2:2*j+2], c1, c2)
	}
}

// backwardNode is one node of the back substitution: x −= W·a, W the node's
// multiplier and a the x of the node before it in the sweep. It returns x.
func backwardNode(f, x []float64, a1, a2 float64) (float64, float64) {
	x[0], x[1] = x[0]-(f[3]*a1+f[4]*a2), x[1]-(f[5]*a1+f[6]*a2)
	return x[0], x[1]
}
