package band

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// randomSPDBand returns a symmetric positive definite band matrix: BᵀB for a
// random upper band B with a dominant diagonal, so its condition is moderate
// but it is not diagonally dominant itself.
func randomSPDBand(rnd *rand.Rand, n, k int) *Symmetric {
	b := mat.NewDense(n, n, nil)
	for i := range n {
		b.Set(i, i, 1+float64(k)+rnd.Float64())
		for j := i + 1; j <= min(i+k, n-1); j++ {
			b.Set(i, j, 2*rnd.Float64()-1)
		}
	}
	var full mat.Dense
	full.Mul(b.T(), b)
	a := NewSymmetric(n, k)
	for i := range n {
		for j := i; j <= min(i+k, n-1); j++ {
			a.Add(i, j, full.At(i, j))
		}
	}
	return a
}

func dense(a *Symmetric) *mat.Dense {
	d := mat.NewDense(a.N, a.N, nil)
	for i := range a.N {
		for j := range a.N {
			d.Set(i, j, a.At(i, j))
		}
	}
	return d
}

// LDL against gonum's dense LU solve (mat.Dense.Solve), used as an
// independent reference.
func TestLDLAgainstGonumDense(t *testing.T) {
	rnd := rand.New(rand.NewPCG(1, 2))
	for _, k := range []int{0, 1, 2, 3, 5} {
		for _, n := range []int{1, 2, 4, 5, 6, 7, 8, 9, 40, 41} {
			t.Run(fmt.Sprintf("n=%d,k=%d", n, k), func(t *testing.T) {
				a := randomSPDBand(rnd, n, k)
				b := make([]float64, n)
				for i := range b {
					b[i] = 2*rnd.Float64() - 1
				}
				var f LDL
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
					if !(math.Abs(got[i]-want.AtVec(i)) <= 1e-12*max(1, math.Abs(want.AtVec(i)))) {
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
					if !(math.Abs(fused[i]-want.AtVec(i)) <= 1e-12*max(1, math.Abs(want.AtVec(i)))) {
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

// Factorize once, solve many: every kernel solves several right-hand sides
// from one factorization, each against gonum's dense LU solve (mat.Dense.Solve
// of all of them at once) as the reference. The factor must come out of each
// solve, and of Cond, as it went in, and a solve must not depend on what its
// destination held before.
func TestLDLManyRightHandSides(t *testing.T) {
	rnd := rand.New(rand.NewPCG(11, 12))
	// A node-blocked band with a coupling to the node after next: not block
	// tridiagonal, so the scalar kernel factorizes it.
	coupled := randomNodeBand(rnd, 10)
	coupled.Add(9, 12, 0.25)
	cases := []struct {
		name   string
		a      *Symmetric
		kernel kernel
	}{
		{"half-bandwidth 1, n=1", randomSPDBand(rnd, 1, 1), tridiagonal},
		{"half-bandwidth 1, n=40", randomSPDBand(rnd, 40, 1), tridiagonal},
		{"half-bandwidth 1, n=41", randomSPDBand(rnd, 41, 1), tridiagonal},
		{"half-bandwidth 3, node blocks, 3 nodes", randomNodeBand(rnd, 3), nodeBlocks},
		{"half-bandwidth 3, node blocks, 20 nodes", randomNodeBand(rnd, 20), nodeBlocks},
		{"half-bandwidth 3, node blocks, 21 nodes", randomNodeBand(rnd, 21), nodeBlocks},
		{"half-bandwidth 3, scalar, n=5", randomSPDBand(rnd, 5, 3), twisted3},
		{"half-bandwidth 3, scalar, n=41", randomSPDBand(rnd, 41, 3), twisted3},
		{"half-bandwidth 3, scalar, not node-blocked", coupled, twisted3},
		{"half-bandwidth 3, general, n=4", randomSPDBand(rnd, 4, 3), generalRows},
		{"half-bandwidth 0, general", randomSPDBand(rnd, 9, 0), generalRows},
		{"half-bandwidth 2, general", randomSPDBand(rnd, 40, 2), generalRows},
		{"half-bandwidth 5, general", randomSPDBand(rnd, 41, 5), generalRows},
	}
	const solves = 5
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			n := c.a.N
			rhs := mat.NewDense(n, solves, nil)
			for i := range n {
				for j := range solves {
					rhs.Set(i, j, 2*rnd.Float64()-1)
				}
			}
			var want mat.Dense
			if err := want.Solve(dense(c.a), rhs); err != nil {
				t.Fatal(err)
			}
			check := func(how string, j int, got []float64) {
				t.Helper()
				for i, g := range got {
					w := want.At(i, j)
					if !(math.Abs(g-w) <= 1e-12*max(1, math.Abs(w))) { // a NaN fails too
						t.Fatalf("%s, right-hand side %d: x[%d] = %.15g, gonum %.15g", how, j, i, g, w)
					}
				}
			}

			var f LDL
			if err := f.Factorize(c.a); err != nil {
				t.Fatal(err)
			}
			if f.kernel != c.kernel {
				t.Fatalf("factorized by kernel %d, want %d", f.kernel, c.kernel)
			}
			// One destination for every solve, holding garbage at first and
			// then the previous solution.
			dst := make([]float64, n)
			for i := range dst {
				dst[i] = math.NaN()
			}
			first := make([][]float64, solves)
			for j := range solves {
				b := mat.Col(nil, j, rhs)
				if err := f.SolveTo(dst, b); err != nil {
					t.Fatal(err)
				}
				if !slices.Equal(b, mat.Col(nil, j, rhs)) {
					t.Fatalf("right-hand side %d changed by the solve", j)
				}
				check("SolveTo", j, dst)
				first[j] = slices.Clone(dst)
			}
			// The condition estimate solves with the factor too.
			f.Cond(c.a, nil)
			// Again, backwards and in place: the same bits.
			for j := solves - 1; j >= 0; j-- {
				x := mat.Col(nil, j, rhs)
				if err := f.SolveTo(x, x); err != nil {
					t.Fatal(err)
				}
				if !slices.Equal(x, first[j]) {
					t.Fatalf("right-hand side %d solved again in place: %v, first %v", j, x, first[j])
				}
			}

			// FactorizeSolve for the first right-hand side, SolveTo for the rest.
			var g LDL
			x := make([]float64, n)
			if err := g.FactorizeSolve(c.a, x, mat.Col(nil, 0, rhs)); err != nil {
				t.Fatal(err)
			}
			check("FactorizeSolve", 0, x)
			for j := 1; j < solves; j++ {
				if err := g.SolveTo(x, mat.Col(nil, j, rhs)); err != nil {
					t.Fatal(err)
				}
				if !slices.Equal(x, first[j]) {
					t.Fatalf("right-hand side %d after FactorizeSolve: %v, after Factorize %v", j, x, first[j])
				}
			}
		})
	}
}

// Scaling the matrix by c scales the solution by 1/c: every kernel must keep
// to that across float64's range, where products of three entries, or the
// square of one, would overflow or underflow (a review found the node blocks
// silently wrong at 1e−110 and refusing at 1e+104, the bar kernel at 1e∓160).
func TestLDLScaleInvariance(t *testing.T) {
	rnd := rand.New(rand.NewPCG(9, 10))
	cases := []struct {
		name string
		a    *Symmetric
	}{
		{"bar", randomSPDBand(rnd, 21, 1)},
		{"scalar band 3", randomSPDBand(rnd, 21, 3)},
		{"node blocks", randomNodeBand(rnd, 11)},
		{"general band 2", randomSPDBand(rnd, 21, 2)},
		{"general band 5", randomSPDBand(rnd, 21, 5)},
	}
	for _, c := range cases {
		n := c.a.N
		b := make([]float64, n)
		for i := range b {
			b[i] = 2*rnd.Float64() - 1
		}
		var f LDL
		want := make([]float64, n)
		if err := f.FactorizeSolve(c.a, want, b); err != nil {
			t.Fatal(err)
		}
		for _, scale := range []float64{1e-300, 1e-170, 1e-120, 1e-100, 1e-60, 1e60, 1e100, 1e120, 1e170, 1e300} {
			scaled := &Symmetric{N: n, K: c.a.K, Data: slices.Clone(c.a.Data)}
			for i := range scaled.Data {
				scaled.Data[i] *= scale
			}
			got := make([]float64, n)
			if err := f.FactorizeSolve(scaled, got, b); err != nil {
				t.Errorf("%s scaled by %g: %v", c.name, scale, err)
				continue
			}
			for i := range got {
				if !(math.Abs(got[i]*scale-want[i]) <= 1e-12*max(1, math.Abs(want[i]))) {
					t.Errorf("%s scaled by %g: x[%d]·scale = %.15g, want %.15g", c.name, scale, i, got[i]*scale, want[i])
					break
				}
			}
		}
	}
}

func TestLDLSingular(t *testing.T) {
	// A free chain of springs: the stiffness matrix of a bar with no support is singular.
	n := 6
	a := NewSymmetric(n, 1)
	for i := range n - 1 {
		a.Add(i, i, 1)
		a.Add(i+1, i+1, 1)
		a.Add(i, i+1, -1)
	}
	// Every leading block is positive definite; the pivot eliminated last,
	// the middle row's of the tridiagonal kernel (tridiagonal.go), is zero.
	var f LDL
	err := f.Factorize(a)
	var pe *PivotError
	if !errors.As(err, &pe) || pe.Row != twistRow1(n) {
		t.Fatalf("got %v, want a *PivotError at row %d", err, twistRow1(n))
	}
	// An indefinite matrix fails at once.
	b := NewSymmetric(2, 1)
	b.Add(0, 0, -1)
	b.Add(1, 1, 1)
	if err := f.Factorize(b); !errors.As(err, &pe) || pe.Row != 0 {
		t.Fatalf("indefinite matrix: got %v, want a *PivotError at row 0", err)
	}
	if err := f.SolveTo(make([]float64, 2), make([]float64, 2)); err == nil {
		t.Errorf("solve after a failed factorization succeeded")
	}
}
