package band

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

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
			var f LDL
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
