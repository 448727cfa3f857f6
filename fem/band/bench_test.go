package band

import (
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack/lapack64"
)

// benchBand is the beam's band shape: half-bandwidth 3.
func benchBand(n int) (*Symmetric, []float64) {
	rnd := rand.New(rand.NewPCG(5, 6))
	a := randomSPDBand(rnd, 200, 3)
	big := NewSymmetric(n, 3)
	for i := range big.Data {
		big.Data[i] = a.Data[i%len(a.Data)]
	}
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	return big, b
}

// BenchmarkBandLDL times LDL.FactorizeSolve on a beam's band shape (the
// name is from when the type was fem.BandLDL, kept so runs before and after
// the move compare).
func BenchmarkBandLDL(b *testing.B) {
	a, rhs := benchBand(200_000)
	x := make([]float64, len(rhs))
	var f LDL
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

// BenchmarkBandCopy is the floor LDL is measured against: one copy of
// the band array it factorizes.
func BenchmarkBandCopy(b *testing.B) {
	a, _ := benchBand(200_000)
	work := make([]float64, len(a.Data))
	for b.Loop() {
		copy(work, a.Data)
	}
}
