package band

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// randomNodeBand returns a symmetric positive definite matrix that is block
// tridiagonal by nodes of two unknowns, as a beam's system is: BᵀB for a
// random block upper bidiagonal B with dominant diagonal blocks.
func randomNodeBand(rnd *rand.Rand, nodes int) *Symmetric {
	n := 2 * nodes
	b := mat.NewDense(n, n, nil)
	for i := range nodes {
		for r := range 2 {
			for c := range 2 {
				v := 2*rnd.Float64() - 1
				if r == c {
					v = 3 + rnd.Float64()
				}
				b.Set(2*i+r, 2*i+c, v)
				if i+1 < nodes {
					b.Set(2*i+r, 2*i+2+c, 2*rnd.Float64()-1)
				}
			}
		}
	}
	var full mat.Dense
	full.Mul(b.T(), b)
	a := NewSymmetric(n, 3)
	for i := range n {
		for j := i; j <= min(i+3, n-1); j++ {
			a.Add(i, j, full.At(i, j))
		}
	}
	return a
}

// The node-block kernel (nodeblocks.go) against gonum's dense LU solve, at every
// size from its smallest, odd and even numbers of nodes around the middle.
func TestNodeBlocksAgainstGonumDense(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 8))
	for nodes := nodeBlockMin / 2; nodes <= 24; nodes++ {
		a := randomNodeBand(rnd, nodes)
		n := a.N
		b := make([]float64, n)
		for i := range b {
			b[i] = 2*rnd.Float64() - 1
		}
		var want mat.VecDense
		if err := want.SolveVec(dense(a), mat.NewVecDense(n, b)); err != nil {
			t.Fatal(err)
		}
		var f LDL
		if err := f.Factorize(a); err != nil {
			t.Fatal(err)
		}
		if f.kernel != nodeBlocks {
			t.Fatalf("%d nodes: factorized by kernel %d, not by node blocks", nodes, f.kernel)
		}
		got := make([]float64, n)
		fused := make([]float64, n)
		if err := f.SolveTo(got, b); err != nil {
			t.Fatal(err)
		}
		if err := f.FactorizeSolve(a, fused, b); err != nil {
			t.Fatal(err)
		}
		for i := range got {
			tol := 1e-12 * max(1, math.Abs(want.AtVec(i)))
			if !(math.Abs(got[i]-want.AtVec(i)) <= tol && math.Abs(fused[i]-want.AtVec(i)) <= tol) {
				t.Fatalf("%d nodes: x[%d] = %.15g (FactorizeSolve %.15g), gonum %.15g", nodes, i, got[i], fused[i], want.AtVec(i))
			}
		}
		// The forward substitution in the sweep does the arithmetic of the
		// separate one: the same bits, whichever way the caller solves.
		if !slices.Equal(fused, got) {
			t.Fatalf("%d nodes: FactorizeSolve %v differs from Factorize and SolveTo %v", nodes, fused, got)
		}
		if err := f.SolveTo(b, b); err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(b, got) {
			t.Fatalf("%d nodes: in-place solve differs", nodes)
		}
	}
	// A coupling to the node after next, found after the first nodes: the
	// row-by-row kernel takes over, with the right answer, also when the
	// node kernel had begun solving, and in place.
	a := randomNodeBand(rnd, 9)
	a.Add(9, 12, 0.25)
	b := make([]float64, a.N)
	for i := range b {
		b[i] = 2*rnd.Float64() - 1
	}
	var want mat.VecDense
	if err := want.SolveVec(dense(a), mat.NewVecDense(a.N, b)); err != nil {
		t.Fatal(err)
	}
	var f LDL
	x, inPlace := make([]float64, a.N), slices.Clone(b)
	for _, solve := range []func() error{
		func() error { return f.Factorize(a) },
		func() error { return f.FactorizeSolve(a, x, b) },
		func() error { return f.FactorizeSolve(a, inPlace, inPlace) },
	} {
		if err := solve(); err != nil || f.kernel != twisted3 {
			t.Fatalf("a band not block tridiagonal: kernel %d, error %v; want the row-by-row kernel", f.kernel, err)
		}
	}
	for i := range x {
		if !(math.Abs(x[i]-want.AtVec(i)) <= 1e-12*max(1, math.Abs(want.AtVec(i)))) || inPlace[i] != x[i] {
			t.Fatalf("a band not block tridiagonal: x[%d] = %.15g (in place %.15g), gonum %.15g", i, x[i], inPlace[i], want.AtVec(i))
		}
	}
}

// A beam on two free nodes and more, unsupported: singular. Node blocks
// report the pivot eliminated last, the second row of the middle node, as
// the row-by-row kernel reports its own last.
func TestNodeBlocksSingular(t *testing.T) {
	const nodes, h = 7, 0.5
	a := NewSymmetric(2*nodes, 3)
	k := [4][4]float64{{12, 6 * h, -12, 6 * h}, {6 * h, 4 * h * h, -6 * h, 2 * h * h}, {-12, -6 * h, 12, -6 * h}, {6 * h, 2 * h * h, -6 * h, 4 * h * h}}
	for e := range nodes - 1 {
		for r := range 4 {
			for c := r; c < 4; c++ {
				a.Add(2*e+r, 2*e+c, k[r][c])
			}
		}
	}
	var f LDL
	err := f.Factorize(a)
	var pe *PivotError
	if !errors.As(err, &pe) || pe.Row/2 != middleNode(2*nodes) {
		t.Fatalf("got %v, want a *PivotError at node %d", err, middleNode(2*nodes))
	}
}

// A beam on an elastic foundation (modulus k = EI/2 per m⁴, free ends), on
// elements about 1 m long but one of 1 mm beyond a pure hinge at node p, under a
// point load at that element's far node: the short element, pinned at the
// hinge, adds a block of rank one, 3EI/h³·[1, h; h, h²], to the next node's
// diagonal block, which the elimination from the far end meets nearly
// singular. The residual of the solve must stay at the round-off of a
// backward stable factorization, a few ε·‖A‖·‖x‖ (Higham, Accuracy and
// Stability of Numerical Algorithms, ch. 10, from memory), wherever the
// hinge lies.
func TestNodeBlocksShortElementBeyondAHinge(t *testing.T) {
	const nodes, short, k = 101, 1e-3, 0.5
	// element returns the Hermite element's stiffness (EI = 1) with the
	// foundation's consistent stiffness k·h/420·[156, 22h, 54, −13h; …],
	// its start rotation condensed out when it starts at the hinge.
	element := func(h float64, hinged bool) [4][4]float64 {
		var m [4][4]float64
		s := [4][4]float64{{12, 6 * h, -12, 6 * h}, {6 * h, 4 * h * h, -6 * h, 2 * h * h}, {-12, -6 * h, 12, -6 * h}, {6 * h, 2 * h * h, -6 * h, 4 * h * h}}
		g := [4][4]float64{{156, 22 * h, 54, -13 * h}, {22 * h, 4 * h * h, 13 * h, -3 * h * h}, {54, 13 * h, 156, -22 * h}, {-13 * h, -3 * h * h, -22 * h, 4 * h * h}}
		for r := range 4 {
			for c := range 4 {
				m[r][c] = s[r][c]/(h*h*h) + k*h/420*g[r][c]
			}
		}
		if hinged {
			a := m[1][1]
			for r := range 4 {
				for c := range 4 {
					if r != 1 && c != 1 {
						m[r][c] -= m[r][1] * m[c][1] / a
					}
				}
			}
			for i := range 4 {
				m[1][i], m[i][1] = 0, 0
			}
		}
		return m
	}
	for _, p := range []int{20, 49, 50, 70} {
		a := NewSymmetric(2*nodes, 3)
		for e := range nodes - 1 {
			h := 1 + 0.1*math.Sin(float64(e)) // lengths no power of two divides
			if e == p {
				h = short
			}
			m := element(h, e == p)
			for r := range 4 {
				for c := r; c < 4; c++ {
					a.Add(2*e+r, 2*e+c, m[r][c])
				}
			}
		}
		b := make([]float64, a.N)
		b[2*p+2] = -1
		var f LDL
		if err := f.Factorize(a); err != nil {
			t.Fatal(err)
		}
		x := make([]float64, a.N)
		if err := f.SolveTo(x, b); err != nil {
			t.Fatal(err)
		}
		normA, normX, worst := 0.0, 0.0, 0.0
		for i := range a.N {
			r, row := -b[i], 0.0
			for j := max(0, i-3); j <= min(a.N-1, i+3); j++ {
				r += a.At(i, j) * x[j]
				row += math.Abs(a.At(i, j))
			}
			normA, normX, worst = max(normA, row), max(normX, math.Abs(x[i])), max(worst, math.Abs(r))
		}
		if bound := 16 * 0x1p-52 * normA * normX; worst > bound {
			t.Errorf("hinge at node %d: largest residual %.3g, beyond the round-off %.3g of a backward stable solve (kernel %d)", p, worst, bound, f.kernel)
		}
	}
}
