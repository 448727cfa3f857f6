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
		{"general band 3", randomSPDBand(rnd, 21, 3)},
		{"node blocks", randomNodeBand(rnd, 11)},
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
				if math.Abs(got[i]*scale-want[i]) > 1e-12*max(1, math.Abs(want[i])) {
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
