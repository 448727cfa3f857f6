package band

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// badlyScaled returns a band matrix of testGeneral's kind with its rows and
// columns multiplied by random powers of ten from 1e−6 to 1e6, the way
// equations in N and in N·m and unknowns in m and in rad mix in one system.
func badlyScaled(rnd *rand.Rand, c bandCase) *General {
	n, kl, ku := c.n, c.kl, c.ku
	a := c.matrix(rnd)
	rows, cols := make([]float64, n), make([]float64, n)
	for i := range n {
		rows[i] = math.Pow(10, float64(rnd.IntN(13)-6))
		cols[i] = math.Pow(10, float64(rnd.IntN(13)-6))
	}
	for i := range n {
		for j := max(0, i-kl); j <= min(n-1, i+ku); j++ {
			a.Set(i, j, a.At(i, j)*rows[i]*cols[j])
		}
	}
	return a
}

// Ruiz's scaling converges in the ∞-norm linearly with rate 1/2 (Ruiz, "A
// scaling algorithm to equilibrate both rows and columns norms in
// matrices", 2001, from memory), so 8 passes bring every row and column
// maximum of these matrices, whose entries spread over up to 1e±15, within
// a factor 2 of 1. The scales returned must be the ones applied, and the
// band alone must change. The caller's recipe must give back the solution:
// with b = A·x for a chosen x, solving (R·A·C)·y = R·b by LU must give
// y = C⁻¹·x to within 10·n·κ·u (as in TestLUAgainstGonumDense), κ gonum's
// condition estimate (mat.LU.Cond) of R·A·C, which the scaling made small:
// gonum's estimate for A itself must be at least 1e6 times larger.
func TestEquilibrate(t *testing.T) {
	rnd := rand.New(rand.NewPCG(31, 32))
	cases := []bandCase{
		{1, 0, 0, dominantRows},
		{7, 1, 1, shuffledRows},
		{20, 0, 3, mixedRows},
		{20, 3, 0, mixedRows},
		{40, 5, 8, shuffledRows},
		{200, 5, 8, mixedRows},
		{200, 6, 6, shuffledRows},
	}
	for _, c := range cases {
		t.Run(c.String(), func(t *testing.T) {
			n := c.n
			a := badlyScaled(rnd, c)
			orig := &General{N: n, KL: c.kl, KU: c.ku, Data: slices.Clone(a.Data)}
			rowScale, colScale := Equilibrate(a, 8)
			s := a.Stride()
			for i := range n {
				for q := range s {
					j := i + q - c.kl
					p := i*s + q
					if j < max(0, i-c.kl) || j > min(n-1, i+c.ku) {
						if a.Data[p] != orig.Data[p] {
							t.Fatalf("Data[%d], outside the band, changed from %g to %g", p, orig.Data[p], a.Data[p])
						}
						continue
					}
					want := rowScale[i] * orig.At(i, j) * colScale[j]
					if a.At(i, j) != want { // powers of two: exact
						t.Fatalf("scaled A[%d][%d] = %.17g, rowScale·A·colScale = %.17g", i, j, a.At(i, j), want)
					}
				}
			}
			for i := range n {
				rowMax, colMax := 0.0, 0.0
				for j := range n {
					rowMax = max(rowMax, math.Abs(a.At(i, j)))
					colMax = max(colMax, math.Abs(a.At(j, i)))
				}
				// Factors rounded to powers of two settle every maximum in [1/2, 2].
				if !(rowMax >= 0.5 && rowMax <= 2 && colMax >= 0.5 && colMax <= 2) {
					t.Fatalf("after 8 passes row %d's largest entry is %g, column %d's %g", i, rowMax, i, colMax)
				}
			}

			// y is the solution of the scaled system, x = C·y that of A·x = b.
			y, x, b := make([]float64, n), make([]float64, n), make([]float64, n)
			for j := range n {
				y[j] = 2*rnd.Float64() - 1
				x[j] = colScale[j] * y[j]
			}
			for i := range n {
				for j := range n {
					b[i] += orig.At(i, j) * x[j]
				}
			}
			var f LU
			if err := f.Factorize(a); err != nil {
				t.Fatal(err)
			}
			got := make([]float64, n)
			for i := range got {
				got[i] = rowScale[i] * b[i]
			}
			if err := f.SolveTo(got, got); err != nil {
				t.Fatal(err)
			}
			var scaled, raw mat.LU
			scaled.Factorize(denseGeneral(a))
			raw.Factorize(denseGeneral(orig))
			agree(t, "y = C⁻¹·x", got, y, solveTolerance(t, &scaled, n))
			if n > 1 && !(raw.Cond() >= 1e6*scaled.Cond()) {
				t.Errorf("condition estimate %.3g before scaling, %.3g after: the test matrix is not badly scaled", raw.Cond(), scaled.Cond())
			}
		})
	}
}

// A zero row or column keeps unit scale, and no pass changes nothing. In a
// matrix with one entry a row and column, each half of a pass takes that
// entry's square root rounded to a power of two (inverseRoot), and a pass
// that finds every maximum in [1/2, 2) ends the scaling: 4 goes to 2, then
// 1; 9 to 9/4, then 9/8.
func TestEquilibrateEdges(t *testing.T) {
	a := generalFrom(1, 1, [][]float64{{4, 0, 0}, {0, 0, 0}, {0, 9, 0}})
	orig := slices.Clone(a.Data)
	rows, cols := Equilibrate(a, 0)
	if !slices.Equal(a.Data, orig) || !slices.Equal(rows, []float64{1, 1, 1}) || !slices.Equal(cols, []float64{1, 1, 1}) {
		t.Fatalf("no pass: matrix %v, scales %v %v", a.Data, rows, cols)
	}
	rows, cols = Equilibrate(a, 3)
	if rows[1] != 1 || cols[2] != 1 {
		t.Fatalf("zero row 1 scaled by %g, zero column 2 by %g", rows[1], cols[2])
	}
	for _, e := range []struct {
		i, j int
		v    float64
	}{{0, 0, 1}, {2, 1, 9.0 / 8}} {
		if got := a.At(e.i, e.j); got != e.v {
			t.Errorf("A[%d][%d] = %.17g after the passes, want %g", e.i, e.j, got, e.v)
		}
	}
}

// fullPasses is Ruiz's scaling as Equilibrate's doc comment states it,
// every row and every column of every pass read: the reference for the
// passes that skip what cannot have changed.
func fullPasses(a *General, passes int) (rowScale, colScale []float64) {
	n := a.N
	rowScale, colScale = make([]float64, n), make([]float64, n)
	for i := range n {
		rowScale[i], colScale[i] = 1, 1
	}
	band := func(i int) (lo, hi int) { return max(0, i-a.KL), min(n-1, i+a.KU) }
	for range passes {
		settled := true
		for i := range n {
			lo, hi := band(i)
			big := 0.0
			for j := lo; j <= hi; j++ {
				big = math.Max(big, math.Abs(a.At(i, j)))
			}
			if big > 0 {
				f := inverseRoot(big)
				settled = settled && f == 1
				rowScale[i] *= f
				for j := lo; j <= hi; j++ {
					a.Set(i, j, a.At(i, j)*f)
				}
			}
		}
		for j := range n {
			lo, hi := max(0, j-a.KU), min(n-1, j+a.KL)
			big := 0.0
			for i := lo; i <= hi; i++ {
				big = math.Max(big, math.Abs(a.At(i, j)))
			}
			if big > 0 {
				f := inverseRoot(big)
				settled = settled && f == 1
				colScale[j] *= f
				for i := lo; i <= hi; i++ {
					a.Set(i, j, a.At(i, j)*f)
				}
			}
		}
		if settled {
			break
		}
	}
	return rowScale, colScale
}

// Equilibrate skips the rows and columns no scaling has touched since they
// last needed none; that must change nothing: the matrix and the scales
// equal those of full passes to the bit, for every number of passes, on
// badly scaled matrices, on ones with a zero or a NaN row, and on one
// already equilibrated but for a single entry (the case skipping is for).
func TestEquilibrateSkipsNothingThatMatters(t *testing.T) {
	rnd := rand.New(rand.NewPCG(41, 42))
	straggler := func() *General {
		a := NewGeneral(60, 2, 3)
		for i := range 60 {
			for j := max(0, i-2); j <= min(59, i+3); j++ {
				a.Set(i, j, 0.75+0.5*rnd.Float64())
			}
		}
		a.Set(30, 31, 1e9)
		return a
	}
	cases := []struct {
		name string
		make func() *General
	}{
		{"n=200 kl=5 ku=8 mixed", func() *General { return badlyScaled(rnd, bandCase{200, 5, 8, mixedRows}) }},
		{"n=150 kl=6 ku=6 shuffled", func() *General { return badlyScaled(rnd, bandCase{150, 6, 6, shuffledRows}) }},
		{"n=50 kl=0 ku=3 mixed", func() *General { return badlyScaled(rnd, bandCase{50, 0, 3, mixedRows}) }},
		{"n=50 kl=4 ku=0 shuffled", func() *General { return badlyScaled(rnd, bandCase{50, 4, 0, shuffledRows}) }},
		{"zero row and NaN row", func() *General {
			a := badlyScaled(rnd, bandCase{40, 2, 2, mixedRows})
			for j := 8; j <= 12; j++ {
				a.Set(10, j, 0)
			}
			a.Set(20, 21, math.NaN())
			return a
		}},
		{"one straggler", straggler},
	}
	for _, c := range cases {
		for _, passes := range []int{1, 2, 3, 8, 30} {
			a := c.make()
			ref := &General{N: a.N, KL: a.KL, KU: a.KU, Data: slices.Clone(a.Data)}
			rows, cols := Equilibrate(a, passes)
			wantRows, wantCols := fullPasses(ref, passes)
			same := func(x, y []float64) bool {
				return slices.EqualFunc(x, y, func(u, v float64) bool { return math.Float64bits(u) == math.Float64bits(v) })
			}
			if !same(rows, wantRows) || !same(cols, wantCols) {
				t.Errorf("%s, %d passes: scales differ from full passes", c.name, passes)
			}
			for i := range a.N {
				for j := max(0, i-a.KL); j <= min(a.N-1, i+a.KU); j++ {
					if got, want := a.At(i, j), ref.At(i, j); math.Float64bits(got) != math.Float64bits(want) {
						t.Fatalf("%s, %d passes: A[%d][%d] = %.17g, full passes %.17g", c.name, passes, i, j, got, want)
					}
				}
			}
		}
	}
}

// BenchmarkEquilibrate scales a badly scaled band of the shape of the exact
// solution's beam system on a beam of 1,000 loads (4,033 equations, 6
// sub- and 6 superdiagonals), up to 8 passes, from a fresh copy each time.
func BenchmarkEquilibrate(b *testing.B) {
	rnd := rand.New(rand.NewPCG(7, 8))
	orig := badlyScaled(rnd, bandCase{4033, 6, 6, mixedRows})
	a := &General{N: orig.N, KL: orig.KL, KU: orig.KU, Data: make([]float64, len(orig.Data))}
	for b.Loop() {
		copy(a.Data, orig.Data)
		Equilibrate(a, 8)
	}
}
