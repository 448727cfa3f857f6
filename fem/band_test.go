package fem

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack/lapack64"
	"gonum.org/v1/gonum/mat"
)

// randomSPDBand returns a symmetric positive definite band matrix: BᵀB for a
// random upper band B with a dominant diagonal, so its condition is moderate
// but it is not diagonally dominant itself.
func randomSPDBand(rnd *rand.Rand, n, k int) *SymBand {
	b := mat.NewDense(n, n, nil)
	for i := range n {
		b.Set(i, i, 1+float64(k)+rnd.Float64())
		for j := i + 1; j <= min(i+k, n-1); j++ {
			b.Set(i, j, 2*rnd.Float64()-1)
		}
	}
	var full mat.Dense
	full.Mul(b.T(), b)
	a := NewSymBand(n, k)
	for i := range n {
		for j := i; j <= min(i+k, n-1); j++ {
			a.add(i, j, full.At(i, j))
		}
	}
	return a
}

// randomNodeBand returns a symmetric positive definite matrix that is block
// tridiagonal by nodes of two unknowns, as a beam's system is: BᵀB for a
// random block upper bidiagonal B with dominant diagonal blocks.
func randomNodeBand(rnd *rand.Rand, nodes int) *SymBand {
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
	a := NewSymBand(n, 3)
	for i := range n {
		for j := i; j <= min(i+3, n-1); j++ {
			a.add(i, j, full.At(i, j))
		}
	}
	return a
}

func dense(a *SymBand) *mat.Dense {
	d := mat.NewDense(a.N, a.N, nil)
	for i := range a.N {
		for j := range a.N {
			d.Set(i, j, a.At(i, j))
		}
	}
	return d
}

// BandLDL against gonum's dense LU solve (mat.Dense.Solve), used as an
// independent reference.
func TestBandLDLAgainstGonumDense(t *testing.T) {
	rnd := rand.New(rand.NewPCG(1, 2))
	for _, k := range []int{0, 1, 2, 3, 5} {
		for _, n := range []int{1, 2, 4, 5, 6, 7, 8, 9, 40, 41} {
			t.Run(fmt.Sprintf("n=%d,k=%d", n, k), func(t *testing.T) {
				a := randomSPDBand(rnd, n, k)
				b := make([]float64, n)
				for i := range b {
					b[i] = 2*rnd.Float64() - 1
				}
				var f BandLDL
				if err := f.Factorize(a); err != nil {
					t.Fatal(err)
				}
				got := make([]float64, n)
				if err := f.SolveTo(got, b); err != nil {
					t.Fatal(err)
				}
				var want mat.VecDense
				if err := want.SolveVec(dense(a), mat.NewVecDense(n, b)); err != nil {
					t.Fatal(err)
				}
				for i := range got {
					if math.Abs(got[i]-want.AtVec(i)) > 1e-12*max(1, math.Abs(want.AtVec(i))) {
						t.Fatalf("x[%d] = %.15g, gonum %.15g", i, got[i], want.AtVec(i))
					}
				}
				// Factorized and solved in one sweep, the same answer to
				// round-off, in place too.
				fused := make([]float64, n)
				if err := f.FactorizeSolve(a, fused, b); err != nil {
					t.Fatal(err)
				}
				for i := range fused {
					if math.Abs(fused[i]-want.AtVec(i)) > 1e-12*max(1, math.Abs(want.AtVec(i))) {
						t.Fatalf("FactorizeSolve: x[%d] = %.15g, gonum %.15g", i, fused[i], want.AtVec(i))
					}
				}
				inPlace := slices.Clone(b)
				if err := f.FactorizeSolve(a, inPlace, inPlace); err != nil {
					t.Fatal(err)
				}
				if !slices.Equal(inPlace, fused) {
					t.Fatalf("in-place FactorizeSolve differs: %v vs %v", inPlace, fused)
				}
				// In place, the same answer.
				if err := f.SolveTo(b, b); err != nil {
					t.Fatal(err)
				}
				for i := range b {
					if b[i] != got[i] {
						t.Fatalf("in-place solve differs at %d: %g vs %g", i, b[i], got[i])
					}
				}
			})
		}
	}
}

// The node-block kernel (band2.go) against gonum's dense LU solve, at every
// size from its smallest, odd and even numbers of nodes around the middle.
func TestBandLDLNodeBlocks(t *testing.T) {
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
		var f BandLDL
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
			if math.Abs(got[i]-want.AtVec(i)) > tol || math.Abs(fused[i]-want.AtVec(i)) > tol {
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
	a.add(9, 12, 0.25)
	b := make([]float64, a.N)
	for i := range b {
		b[i] = 2*rnd.Float64() - 1
	}
	var want mat.VecDense
	if err := want.SolveVec(dense(a), mat.NewVecDense(a.N, b)); err != nil {
		t.Fatal(err)
	}
	var f BandLDL
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
		if math.Abs(x[i]-want.AtVec(i)) > 1e-12*max(1, math.Abs(want.AtVec(i))) || inPlace[i] != x[i] {
			t.Fatalf("a band not block tridiagonal: x[%d] = %.15g (in place %.15g), gonum %.15g", i, x[i], inPlace[i], want.AtVec(i))
		}
	}
}

// A beam on two free nodes and more, unsupported: singular. Node blocks
// report the pivot eliminated last, the second row of the middle node, as
// the row-by-row kernel reports its own last.
func TestNodeBlocksSingular(t *testing.T) {
	const nodes, h = 7, 0.5
	a := NewSymBand(2*nodes, 3)
	k := [4][4]float64{{12, 6 * h, -12, 6 * h}, {6 * h, 4 * h * h, -6 * h, 2 * h * h}, {-12, -6 * h, 12, -6 * h}, {6 * h, 2 * h * h, -6 * h, 4 * h * h}}
	for e := range nodes - 1 {
		for r := range 4 {
			for c := r; c < 4; c++ {
				a.add(2*e+r, 2*e+c, k[r][c])
			}
		}
	}
	var f BandLDL
	err := f.Factorize(a)
	var pe *PivotError
	if !errors.As(err, &pe) || pe.Row/2 != middleNode(2*nodes) {
		t.Fatalf("got %v, want a *PivotError at node %d", err, middleNode(2*nodes))
	}
}

// Scaling the matrix by c scales the solution by 1/c: every kernel must keep
// to that across float64's range, where products of three entries, or the
// square of one, would overflow or underflow (a review found the node blocks
// silently wrong at 1e−110 and refusing at 1e+104, the bar kernel at 1e∓160).
func TestBandLDLScaleInvariance(t *testing.T) {
	rnd := rand.New(rand.NewPCG(9, 10))
	cases := []struct {
		name string
		a    *SymBand
	}{
		{"bar", randomSPDBand(rnd, 21, 1)},
		{"general band 3", randomSPDBand(rnd, 21, 3)},
		{"node blocks", randomNodeBand(rnd, 11)},
	}
	for _, c := range cases {
		n := c.a.N
		b := make([]float64, n)
		for i := range b {
			b[i] = 2*rnd.Float64() - 1
		}
		var f BandLDL
		want := make([]float64, n)
		if err := f.FactorizeSolve(c.a, want, b); err != nil {
			t.Fatal(err)
		}
		for _, scale := range []float64{1e-300, 1e-170, 1e-120, 1e-100, 1e-60, 1e60, 1e100, 1e120, 1e170, 1e300} {
			scaled := &SymBand{N: n, K: c.a.K, Data: slices.Clone(c.a.Data)}
			for i := range scaled.Data {
				scaled.Data[i] *= scale
			}
			got := make([]float64, n)
			if err := f.FactorizeSolve(scaled, got, b); err != nil {
				t.Errorf("%s scaled by %g: %v", c.name, scale, err)
				continue
			}
			for i := range got {
				if math.Abs(got[i]*scale-want[i]) > 1e-12*max(1, math.Abs(want[i])) {
					t.Errorf("%s scaled by %g: x[%d]·scale = %.15g, want %.15g", c.name, scale, i, got[i]*scale, want[i])
					break
				}
			}
		}
	}
}

// The estimate is a lower bound of the true 1-norm condition number and, for
// these matrices, within a factor 3 of it (Higham reports it is usually
// within a factor 3; from memory). Truth: gonum mat.Cond(·, 1) on the dense matrix.
func TestCondEstimate(t *testing.T) {
	rnd := rand.New(rand.NewPCG(3, 4))
	for _, k := range []int{1, 2, 3} {
		for _, n := range []int{5, 30, 80} {
			a := randomSPDBand(rnd, n, k)
			// Spread the scales so the scaled and unscaled numbers differ.
			scale := make([]float64, n)
			for i := range n {
				scale[i] = math.Pow(10, -float64(i%4))
			}
			for i := range n {
				for j := i; j <= min(i+k, n-1); j++ {
					a.Data[i*(k+1)+j-i] /= scale[i] * scale[j]
				}
			}
			var f BandLDL
			if err := f.Factorize(a); err != nil {
				t.Fatal(err)
			}
			d := dense(a)
			for _, sc := range [][]float64{nil, scale} {
				m := d
				if sc != nil {
					m = mat.NewDense(n, n, nil)
					m.Apply(func(i, j int, v float64) float64 { return v * sc[i] * sc[j] }, d)
				}
				want := mat.Cond(m, 1)
				got := f.Cond(a, sc)
				if got > want*(1+1e-9) || got < want/3 {
					t.Errorf("n=%d k=%d scaled=%v: estimate %.4g, true %.4g", n, k, sc != nil, got, want)
				}
			}
		}
	}
}

func TestBandLDLSingular(t *testing.T) {
	// A free chain of springs: the stiffness matrix of a bar with no support is singular.
	n := 6
	a := NewSymBand(n, 1)
	for i := range n - 1 {
		a.add(i, i, 1)
		a.add(i+1, i+1, 1)
		a.add(i, i+1, -1)
	}
	// Every leading block is positive definite; the pivot eliminated last,
	// the middle row's of the twisted kernel (band1.go), is zero.
	var f BandLDL
	err := f.Factorize(a)
	var pe *PivotError
	if !errors.As(err, &pe) || pe.Row != twistRow1(n) {
		t.Fatalf("got %v, want a *PivotError at row %d", err, twistRow1(n))
	}
	// An indefinite matrix fails at once.
	b := NewSymBand(2, 1)
	b.add(0, 0, -1)
	b.add(1, 1, 1)
	if err := f.Factorize(b); !errors.As(err, &pe) || pe.Row != 0 {
		t.Fatalf("indefinite matrix: got %v, want a *PivotError at row 0", err)
	}
	if err := f.SolveTo(make([]float64, 2), make([]float64, 2)); err == nil {
		t.Errorf("solve after a failed factorization succeeded")
	}
}

// benchBand is the beam's band shape: half-bandwidth 3.
func benchBand(n int) (*SymBand, []float64) {
	rnd := rand.New(rand.NewPCG(5, 6))
	a := randomSPDBand(rnd, 200, 3)
	big := NewSymBand(n, 3)
	for i := range big.Data {
		big.Data[i] = a.Data[i%len(a.Data)]
	}
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	return big, b
}

func BenchmarkBandLDL(b *testing.B) {
	a, rhs := benchBand(200_000)
	x := make([]float64, len(rhs))
	var f BandLDL
	for b.Loop() {
		if err := f.FactorizeSolve(a, x, rhs); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkGonumPbtrf is the same work with gonum's LAPACK band Cholesky, for comparison.
func BenchmarkGonumPbtrf(b *testing.B) {
	a, rhs := benchBand(200_000)
	work := make([]float64, len(a.Data))
	x := make([]float64, len(rhs))
	for b.Loop() {
		copy(work, a.Data)
		t, ok := lapack64.Pbtrf(blas64.SymmetricBand{Uplo: blas.Upper, N: a.N, K: a.K, Data: work, Stride: a.K + 1})
		if !ok {
			b.Fatal("Pbtrf failed")
		}
		copy(x, rhs)
		lapack64.Pbtrs(t, blas64.General{Rows: a.N, Cols: 1, Data: x, Stride: 1})
	}
}

// BenchmarkBandCopy is the floor BandLDL is measured against: one copy of
// the band array it factorizes.
func BenchmarkBandCopy(b *testing.B) {
	a, _ := benchBand(200_000)
	work := make([]float64, len(a.Data))
	for b.Loop() {
		copy(work, a.Data)
	}
}
