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

// bandKind says how testGeneral builds a matrix.
type bandKind int

const (
	// dominantRows: every row diagonally dominant; the pivot may stay on the
	// diagonal throughout.
	dominantRows bandKind = iota
	// mixedRows: dominant rows scaled by 1e−3 to 1e3, so a column's largest
	// entry is often below the diagonal; rows 0 and 1 are 1e−3 and 1e3, so
	// with a subdiagonal step 0 interchanges row 0 with another.
	mixedRows
	// shuffledRows: dominant rows (of a narrower band) shuffled by up to
	// min(KL, KU) places, rows 0 and 1 exchanged: zero and tiny (down to
	// 1e−10) entries on the diagonal, the dominant ones beside it.
	shuffledRows
)

func (k bandKind) String() string {
	return [...]string{"dominant rows", "mixed row scales", "shuffled rows"}[k]
}

// needsInterchange says whether step 0 of partial pivoting must interchange
// rows for a matrix testGeneral builds.
func (k bandKind) needsInterchange(n, kl int) bool { return k != dominantRows && n >= 2 && kl >= 1 }

// bandCase is one test matrix: its order, its band, its kind.
type bandCase struct {
	n, kl, ku int
	kind      bandKind
}

func (c bandCase) String() string { return fmt.Sprintf("%v,kl=%d,ku=%d,n=%d", c.kind, c.kl, c.ku, c.n) }

func (c bandCase) matrix(rnd *rand.Rand) *General { return testGeneral(rnd, c.n, c.kl, c.ku, c.kind) }

// testGeneral returns an n×n band matrix with kl subdiagonals and ku
// superdiagonals of the given kind. Each is a row permutation and a row
// scaling of a diagonally dominant matrix, so its condition number stays
// within what a solve can be checked against.
func testGeneral(rnd *rand.Rand, n, kl, ku int, kind bandKind) *General {
	shift := 0 // how far rows move
	if kind == shuffledRows {
		shift = min(kl, ku)
	}
	dl, du := kl-shift, ku-shift // the band of the dominant matrix
	perm := make([]int, n)       // row i of A is row perm[i] of the dominant matrix
	for i := range perm {
		perm[i] = i
	}
	if shift > 0 && n >= 2 {
		perm[0], perm[1] = 1, 0
		for lo := 2; lo < n; lo += shift + 1 {
			block := perm[lo:min(n, lo+shift+1)]
			rnd.Shuffle(len(block), func(i, j int) { block[i], block[j] = block[j], block[i] })
		}
	}
	a := NewGeneral(n, kl, ku)
	for i := range n {
		src := perm[i]
		magnitude := 1.0
		if kind == mixedRows {
			magnitude = math.Pow(10, 6*rnd.Float64()-3)
			if src < 2 {
				magnitude = []float64{1e-3, 1e3}[src]
			}
		}
		for j := max(0, src-dl); j <= min(n-1, src+du); j++ {
			v := 2*rnd.Float64() - 1
			switch {
			case j == src:
				v = math.Copysign(float64(kl+ku+1)+rnd.Float64(), v)
			case kind == mixedRows && src == 1 && j == 0:
				v = 0.5
			case kind == shuffledRows && rnd.IntN(3) == 0:
				v = 0
			case kind == shuffledRows:
				v *= math.Pow(10, -10*rnd.Float64())
			}
			a.Set(i, j, magnitude*v)
		}
	}
	return a
}

func denseGeneral(a *General) *mat.Dense {
	d := mat.NewDense(max(a.N, 1), max(a.N, 1), nil)
	for i := range a.N {
		for j := range a.N {
			d.Set(i, j, a.At(i, j))
		}
	}
	return d
}

// gamma is Higham's γ_k = k·u/(1−k·u), u the unit round-off.
func gamma(k int) float64 {
	u := 0x1p-53
	return float64(k) * u / (1 - float64(k)*u)
}

// luFactors returns the factorization f holds as dense matrices: row i of
// P·A is row perm[i] of A, and P·A = L·U. The band keeps each multiplier
// where its step left it (dgbtrf's convention); dense L takes every later
// interchange, as dgetrf's does.
func luFactors(f *LU) (perm []int, l, u *mat.Dense) {
	n, kl, s := f.n, f.kl, 2*f.kl+f.ku+1
	perm = make([]int, n)
	for i := range perm {
		perm[i] = i
	}
	l, u = mat.NewDense(n, n, nil), mat.NewDense(n, n, nil)
	for i := range n {
		p := f.pivots[i]
		perm[i], perm[p] = perm[p], perm[i]
		for j := range i {
			li, lp := l.At(i, j), l.At(p, j)
			l.Set(i, j, lp)
			l.Set(p, j, li)
		}
		l.Set(i, i, 1)
		for r := 1; r <= min(kl, n-1-i); r++ {
			l.Set(i+r, i, f.f[(i+r)*s+kl-r])
		}
		for j := i; j <= min(n-1, i+kl+f.ku); j++ {
			u.Set(i, j, f.f[i*s+kl+j-i])
		}
	}
	return perm, l, u
}

// checkFactors checks what Gaussian elimination with partial pivoting
// guarantees: every multiplier at most 1 in magnitude, and
// |P·A − L·U| ≤ γ_n·|L|·|U| entry by entry (Higham, Accuracy and Stability
// of Numerical Algorithms, Thm 9.3, from memory), doubled for the round-off
// of forming L·U here.
func checkFactors(t *testing.T, a *General, f *LU) {
	t.Helper()
	n := a.N
	perm, l, u := luFactors(f)
	for i := range n {
		for j := range i {
			if !(math.Abs(l.At(i, j)) <= 1) {
				t.Fatalf("multiplier L[%d][%d] = %g: the pivot was not the column's largest", i, j, l.At(i, j))
			}
		}
	}
	var lu, bound mat.Dense
	lu.Mul(l, u)
	abs := func(m *mat.Dense) *mat.Dense {
		var c mat.Dense
		c.Apply(func(_, _ int, v float64) float64 { return math.Abs(v) }, m)
		return &c
	}
	bound.Mul(abs(l), abs(u))
	for i := range n {
		for j := range n {
			diff := math.Abs(a.At(perm[i], j) - lu.At(i, j))
			if !(diff <= 2*gamma(n)*bound.At(i, j)) {
				t.Fatalf("(P·A)[%d][%d] = %.17g, (L·U)[%d][%d] = %.17g: differ by %.3g, bound %.3g",
					i, j, a.At(perm[i], j), i, j, lu.At(i, j), diff, 2*gamma(n)*bound.At(i, j))
			}
		}
	}
}

// LU against gonum's dense LU with partial pivoting (mat.LU, LAPACK's
// dgetrf/dgetrs), the reference library, for every band shape up to six
// sub- and superdiagonals. Each solution may be wrong by about κ·γ_3n, the
// condition number times the backward error of the solve (Higham, Accuracy
// and Stability of Numerical Algorithms, §7.1 and Thm 9.4, from memory), so
// the two must agree within 10·n·κ·u, κ gonum's estimate of the 1-norm
// condition number and u the unit round-off.
func TestLUAgainstGonumDense(t *testing.T) {
	rnd := rand.New(rand.NewPCG(21, 22))
	for _, kind := range []bandKind{dominantRows, mixedRows, shuffledRows} {
		for kl := range 7 {
			for ku := range 7 {
				if kind == shuffledRows && min(kl, ku) == 0 {
					continue // no room to move a row
				}
				for _, n := range []int{1, 2, 3, 7, 20, 200} {
					c := bandCase{n, kl, ku, kind}
					t.Run(c.String(), func(t *testing.T) {
						a := c.matrix(rnd)
						orig := slices.Clone(a.Data)
						b := make([]float64, n)
						for i := range b {
							b[i] = 2*rnd.Float64() - 1
						}
						var f LU
						if err := f.Factorize(a); err != nil {
							t.Fatal(err)
						}
						if !slices.Equal(a.Data, orig) {
							t.Fatal("Factorize changed the matrix")
						}
						if kind.needsInterchange(n, kl) && f.pivots[0] == 0 {
							t.Fatalf("step 0 kept row 0: |A[0][0]| = %g, |A[1][0]| = %g", math.Abs(a.At(0, 0)), math.Abs(a.At(1, 0)))
						}
						if n <= 20 {
							checkFactors(t, a, &f)
						}
						got := make([]float64, n)
						if err := f.SolveTo(got, b); err != nil {
							t.Fatal(err)
						}
						var ref mat.LU
						ref.Factorize(denseGeneral(a))
						var want mat.VecDense
						if err := ref.SolveVecTo(&want, false, mat.NewVecDense(n, b)); err != nil {
							t.Fatal(err)
						}
						agree(t, "SolveTo", got, want.RawVector().Data, solveTolerance(t, &ref, n))
					})
				}
			}
		}
	}
}

// solveTolerance is the agreement TestLUAgainstGonumDense explains, from the
// reference factorization's condition estimate; a test matrix too badly
// conditioned for it to check anything is a failure of the test.
func solveTolerance(t *testing.T, ref *mat.LU, n int) float64 {
	t.Helper()
	tol := 10 * float64(max(n, 1)) * ref.Cond() * 0x1p-53
	if !(tol < 1e-6) {
		t.Fatalf("test matrix too ill-conditioned to check a solve: gonum's condition estimate %.3g", ref.Cond())
	}
	return tol
}

// agree fails unless got is want to within tol·‖want‖∞.
func agree(t *testing.T, how string, got, want []float64, tol float64) {
	t.Helper()
	scale := 0.0
	for _, w := range want {
		scale = max(scale, math.Abs(w))
	}
	for i, g := range got {
		if !(math.Abs(g-want[i]) <= tol*scale) { // a NaN fails too
			t.Fatalf("%s: x[%d] = %.17g, gonum %.17g (tolerance %.3g·%.3g)", how, i, g, want[i], tol, scale)
		}
	}
}

// Factorize once, solve many: several right-hand sides from one
// factorization, each against gonum's dense LU (mat.LU.SolveTo of all of
// them at once) as the reference. The factor must come out of each solve,
// and of Cond, as it went in, and a solve must not depend on what its
// destination held before. The transposed solve Cond relies on is checked
// against gonum's transposed solve the same way.
func TestLUManyRightHandSides(t *testing.T) {
	rnd := rand.New(rand.NewPCG(23, 24))
	cases := []bandCase{
		{1, 2, 4, dominantRows},
		{5, 0, 0, dominantRows},
		{15, 0, 3, dominantRows},
		{15, 3, 0, mixedRows},
		{10, 1, 1, shuffledRows},
		{60, 5, 8, shuffledRows},
		{60, 5, 8, mixedRows},
		{200, 6, 6, shuffledRows},
	}
	const solves = 5
	for _, c := range cases {
		t.Run(c.String(), func(t *testing.T) {
			n := c.n
			a := c.matrix(rnd)
			rhs := mat.NewDense(n, solves, nil)
			for i := range n {
				for j := range solves {
					rhs.Set(i, j, 2*rnd.Float64()-1)
				}
			}
			var ref mat.LU
			ref.Factorize(denseGeneral(a))
			tol := solveTolerance(t, &ref, n)
			var want, wantT mat.Dense
			if err := ref.SolveTo(&want, false, rhs); err != nil {
				t.Fatal(err)
			}
			if err := ref.SolveTo(&wantT, true, rhs); err != nil {
				t.Fatal(err)
			}

			var f LU
			if err := f.Factorize(a); err != nil {
				t.Fatal(err)
			}
			factor := slices.Clone(f.f)
			checkSolves(t, &f, rhs, &want, tol)
			for j := range solves {
				x := mat.Col(nil, j, rhs)
				f.solveTransposed(x)
				agree(t, fmt.Sprintf("transposed solve, right-hand side %d", j), x, mat.Col(nil, j, &wantT), tol)
			}
			f.Cond(a)
			if !slices.Equal(f.f, factor) {
				t.Fatal("the factor changed in the solves or Cond")
			}
			checkSolves(t, &f, rhs, &want, tol)
		})
	}
}

// checkSolves solves every column of rhs with s, one destination for all,
// holding garbage at first and then the previous solution, and each column
// against want; then again, last column first and in place, which must give
// the same bits.
func checkSolves(t *testing.T, s interface{ SolveTo(dst, b []float64) error }, rhs, want *mat.Dense, tol float64) {
	t.Helper()
	n, solves := rhs.Dims()
	dst := make([]float64, n)
	for i := range dst {
		dst[i] = math.NaN()
	}
	first := make([][]float64, solves)
	for j := range solves {
		b := mat.Col(nil, j, rhs)
		if err := s.SolveTo(dst, b); err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(b, mat.Col(nil, j, rhs)) {
			t.Fatalf("right-hand side %d changed by the solve", j)
		}
		agree(t, fmt.Sprintf("SolveTo, right-hand side %d", j), dst, mat.Col(nil, j, want), tol)
		first[j] = slices.Clone(dst)
	}
	for j := solves - 1; j >= 0; j-- {
		x := mat.Col(nil, j, rhs)
		if err := s.SolveTo(x, x); err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(x, first[j]) {
			t.Fatalf("right-hand side %d solved again in place: %v, first %v", j, x, first[j])
		}
	}
}

// Scaling the matrix by c scales the solution by 1/c across float64's range:
// the pivot test is relative to each column, so no scale is refused.
func TestLUScaleInvariance(t *testing.T) {
	rnd := rand.New(rand.NewPCG(25, 26))
	cases := []bandCase{
		{20, 1, 1, shuffledRows},
		{40, 5, 8, shuffledRows},
		{30, 6, 2, dominantRows},
	}
	for _, c := range cases {
		a := c.matrix(rnd)
		b := make([]float64, c.n)
		for i := range b {
			b[i] = 2*rnd.Float64() - 1
		}
		var f LU
		want := make([]float64, c.n)
		if err := f.Factorize(a); err != nil {
			t.Fatal(err)
		}
		if err := f.SolveTo(want, b); err != nil {
			t.Fatal(err)
		}
		for _, scale := range []float64{1e-300, 1e-170, 1e-100, 1e100, 1e170, 1e300} {
			scaled := &General{N: a.N, KL: a.KL, KU: a.KU, Data: slices.Clone(a.Data)}
			for i := range scaled.Data {
				scaled.Data[i] *= scale
			}
			got := make([]float64, c.n)
			if err := f.Factorize(scaled); err != nil {
				t.Errorf("%v scaled by %g: %v", c, scale, err)
				continue
			}
			if err := f.SolveTo(got, b); err != nil {
				t.Fatal(err)
			}
			for i := range got {
				got[i] *= scale
			}
			agree(t, fmt.Sprintf("%v scaled by %g, x·scale", c, scale), got, want, 1e-12)
		}
	}
}

// generalFrom returns the n×n band matrix with the given rows, each listed
// from column 0.
func generalFrom(kl, ku int, rows [][]float64) *General {
	a := NewGeneral(len(rows), kl, ku)
	for i, row := range rows {
		for j, v := range row {
			if v != 0 {
				a.Set(i, j, v)
			}
		}
	}
	return a
}

// Singular matrices, and matrices that are singular to working precision,
// are refused with a *SingularError naming the column, and leave nothing to
// solve with.
func TestLUSingular(t *testing.T) {
	cases := []struct {
		name   string
		a      *General
		column int // -1: any column
	}{
		{"order 1, zero", generalFrom(0, 0, [][]float64{{0}}), 0},
		{"all zero", NewGeneral(3, 1, 1), 0},
		{"a zero column", generalFrom(1, 1, [][]float64{{2, 1, 0}, {1, 2, 0}, {0, 1, 0}}), 2},
		{"column 2 twice column 1", generalFrom(1, 1, [][]float64{
			{1, 0, 0, 0},
			{1, 3, 6, 0},
			{0, -1, -2, 1},
			{0, 0, 0, 1},
		}), 2},
		{"zero on the diagonal, no subdiagonal", generalFrom(0, 2, [][]float64{{1, 2, 3}, {0, 0, 4}, {0, 0, 5}}), 1},
		// Pivot 2⁻⁵⁰ ≈ 8.9e−16 against a column of ones: below 1e−14.
		{"tiny pivot", generalFrom(1, 1, [][]float64{{1, 1}, {1, 1 + 0x1p-50}}), 1},
		{"NaN", generalFrom(1, 1, [][]float64{{1, 2, 0}, {3, 4, math.NaN()}, {0, 5, 6}}), -1},
		{"infinity", generalFrom(1, 1, [][]float64{{1, math.Inf(1), 0}, {3, 4, 5}, {0, 5, 6}}), -1},
		// Finite entries whose elimination overflows: 1e308 + 1e308.
		{"overflow", generalFrom(1, 1, [][]float64{{1, 1e308}, {-1, 1e308}}), 1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var f LU
			err := f.Factorize(c.a)
			var se *SingularError
			if !errors.As(err, &se) || (c.column >= 0 && se.Column != c.column) {
				t.Fatalf("got %v, want a *SingularError at column %d", err, c.column)
			}
			x := make([]float64, c.a.N)
			if err := f.SolveTo(x, x); err == nil {
				t.Error("solve after a failed factorization succeeded")
			}
			if got := f.Cond(c.a); !math.IsInf(got, 1) {
				t.Errorf("Cond after a failed factorization: %g, want +Inf", got)
			}
		})
	}
}

// Vectors of the wrong length, and a matrix whose storage is too short, are
// errors.
func TestLUBadSizes(t *testing.T) {
	a := NewGeneral(4, 1, 2)
	for i := range 4 {
		a.Set(i, i, 2)
	}
	var f LU
	if err := f.Factorize(a); err != nil {
		t.Fatal(err)
	}
	if err := f.SolveTo(make([]float64, 4), make([]float64, 3)); err == nil {
		t.Error("solve with a right-hand side of length 3 for order 4 succeeded")
	}
	if err := f.SolveTo(make([]float64, 5), make([]float64, 4)); err == nil {
		t.Error("solve into a destination of length 5 for order 4 succeeded")
	}
	short := &General{N: 4, KL: 1, KU: 2, Data: a.Data[:len(a.Data)-1]}
	if err := f.Factorize(short); err == nil {
		t.Error("factorized a matrix whose storage is one entry short")
	}
	var empty LU
	if err := empty.Factorize(NewGeneral(0, 2, 3)); err != nil {
		t.Fatalf("empty matrix: %v", err)
	}
	if err := empty.SolveTo(nil, nil); err != nil {
		t.Fatalf("empty solve: %v", err)
	}
}

// Cond is a lower bound of the 1-norm condition number, within a factor 10
// of it. Truth: ‖A‖₁·‖A⁻¹‖₁ from gonum's dense inverse (mat.Dense.Inverse,
// mat.Norm), the reference library. It must also be within a factor 10 of
// gonum's own estimate (mat.LU.Cond, LAPACK's dgecon, an estimate too, from
// ‖L‖₁·‖U‖₁ rather than ‖A‖₁, so it may lie above the truth). Besides the
// test matrices of every kind, two bidiagonal ones, 1 on the diagonal and
// −2 beside it, whose inverse holds 2^|i−j| on one side: its largest column
// is the last (upper) or the first (lower), which neither the start vector
// of ones nor Higham's alternating vector finds within a factor 10 (both
// fall short by about n/2); only the step with Aᵀ does.
func TestLUCond(t *testing.T) {
	rnd := rand.New(rand.NewPCG(27, 28))
	var cases []*General
	for _, kind := range []bandKind{dominantRows, mixedRows, shuffledRows} {
		for _, s := range []struct{ kl, ku int }{{0, 0}, {1, 1}, {0, 4}, {3, 0}, {6, 2}, {5, 8}} {
			if kind == shuffledRows && min(s.kl, s.ku) == 0 {
				continue
			}
			for _, n := range []int{1, 2, 5, 12, 40, 200} {
				cases = append(cases, testGeneral(rnd, n, s.kl, s.ku, kind))
			}
		}
	}
	for _, s := range []struct{ kl, ku int }{{0, 1}, {1, 0}} {
		a := NewGeneral(30, s.kl, s.ku)
		for i := range a.N {
			a.Set(i, i, 1)
			if i > 0 {
				a.Set(i-s.ku, i-s.kl, -2)
			}
		}
		cases = append(cases, a)
	}
	for _, a := range cases {
		var f LU
		if err := f.Factorize(a); err != nil {
			t.Fatal(err)
		}
		got := f.Cond(a)
		d := denseGeneral(a)
		var inv mat.Dense
		if err := inv.Inverse(d); err != nil {
			t.Fatal(err)
		}
		exact := mat.Norm(d, 1) * mat.Norm(&inv, 1)
		var ref mat.LU
		ref.Factorize(d)
		if !(got <= exact*(1+1e-8) && got >= exact/10) {
			t.Errorf("kl=%d ku=%d n=%d: estimate %.4g, true %.4g", a.KL, a.KU, a.N, got, exact)
		}
		if !(got <= 10*ref.Cond() && got >= ref.Cond()/10) {
			t.Errorf("kl=%d ku=%d n=%d: estimate %.4g, gonum's %.4g", a.KL, a.KU, a.N, got, ref.Cond())
		}
	}
}

// Once the receiver has held a matrix of the same size, Factorize, SolveTo
// and Cond allocate nothing.
func TestLUNoAllocations(t *testing.T) {
	rnd := rand.New(rand.NewPCG(29, 30))
	a := bandCase{60, 5, 8, shuffledRows}.matrix(rnd)
	x := make([]float64, a.N)
	for i := range x {
		x[i] = 1
	}
	var f LU
	f.Factorize(a)
	f.Cond(a)
	allocs := testing.AllocsPerRun(10, func() {
		if err := f.Factorize(a); err != nil {
			t.Fatal(err)
		}
		if err := f.SolveTo(x, x); err != nil {
			t.Fatal(err)
		}
		f.Cond(a)
	})
	if allocs != 0 {
		t.Errorf("%v allocations a factorization, solve and condition estimate", allocs)
	}
}

// fuzzValue turns two bytes into a matrix entry: zero, a NaN, an infinity,
// or a mantissa of either sign times 10^e with e from −30 to 30, so that no
// product below overflows.
func fuzzValue(m, e byte) float64 {
	switch {
	case m == 0 || m == 128:
		return 0
	case m == 255:
		return math.NaN()
	case m == 254:
		return math.Inf(1)
	}
	return float64(int8(m)) / 16 * math.Pow(10, float64(int(e)%61-30))
}

// FuzzLU: on any small band matrix Factorize must not panic, must refuse a
// NaN or an infinity, and when it succeeds must hold a factorization with
// multipliers at most 1 and P·A = L·U to round-off (checkFactors), whose
// solve has the backward error Gaussian elimination guarantees: for
// r = b − A·x, |P·r| ≤ γ_3n·|L|·|U|·|x| (Higham, Accuracy and Stability of
// Numerical Algorithms, Thm 9.4, from memory), plus γ_n+1·(|b| + |A|·|x|)
// for the round-off of forming r here.
func FuzzLU(f *testing.F) {
	f.Add(byte(0), byte(0), byte(1), []byte{})
	f.Add(byte(3), byte(1), byte(1), []byte{10, 30, 0, 0, 20, 30, 30, 31, 5, 29, 40, 30, 9, 30})
	f.Add(byte(6), byte(2), byte(3), []byte{0, 0, 16, 30, 255, 30, 1, 2, 200, 60, 17, 30})
	f.Add(byte(16), byte(6), byte(6), []byte{1, 0, 2, 60, 3, 30, 129, 0, 254, 1, 77, 45})
	f.Fuzz(func(t *testing.T, n, kl, ku byte, data []byte) {
		a := NewGeneral(int(n%17), int(kl%7), int(ku%7))
		finite := true
		next := 0
		value := func() float64 {
			if next+1 >= len(data) {
				return 1
			}
			v := fuzzValue(data[next], data[next+1])
			next += 2
			return v
		}
		for i := range a.N {
			for j := max(0, i-a.KL); j <= min(a.N-1, i+a.KU); j++ {
				v := value()
				finite = finite && !math.IsNaN(v) && !math.IsInf(v, 0)
				a.Set(i, j, v)
			}
		}
		b := make([]float64, a.N)
		for i := range b {
			if b[i] = value(); math.IsNaN(b[i]) || math.IsInf(b[i], 0) {
				b[i] = 1
			}
		}
		var lu LU
		if err := lu.Factorize(a); err != nil {
			var se *SingularError
			if !errors.As(err, &se) {
				t.Fatalf("error %v is not a *SingularError", err)
			}
			return
		}
		if !finite {
			t.Fatal("factorized a matrix with a NaN or an infinity")
		}
		if a.N == 0 {
			return
		}
		checkFactors(t, a, &lu)
		x := make([]float64, a.N)
		if err := lu.SolveTo(x, b); err != nil {
			t.Fatal(err)
		}
		perm, l, u := luFactors(&lu)
		absX := make([]float64, a.N)
		for i, v := range x {
			absX[i] = math.Abs(v)
		}
		// |L|·(|U|·|x|)
		ux := make([]float64, a.N)
		for i := range a.N {
			for j := range a.N {
				ux[i] += math.Abs(u.At(i, j)) * absX[j]
			}
		}
		for i := range a.N {
			row := perm[i]
			r, ax := b[row], math.Abs(b[row])
			for j := range a.N {
				r -= a.At(row, j) * x[j]
				ax += math.Abs(a.At(row, j)) * absX[j]
			}
			lux := 0.0
			for j := range a.N {
				lux += math.Abs(l.At(i, j)) * ux[j]
			}
			bound := gamma(3*a.N)*lux + gamma(a.N+1)*ax
			if !(math.Abs(r) <= 1.01*bound) {
				t.Fatalf("residual of row %d: %.3g, bound %.3g", row, r, bound)
			}
		}
	})
}

// benchGeneral is the exact solver's band shape, 5 subdiagonals and 8
// superdiagonals, with row interchanges at every few steps.
func benchGeneral(n int) (*General, []float64) {
	rnd := rand.New(rand.NewPCG(7, 8))
	a := testGeneral(rnd, n, 5, 8, shuffledRows)
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	return a, b
}

// BenchmarkLU times Factorize and one SolveTo; ns/row shows the cost per
// unknown, constant when the cost is linear.
func BenchmarkLU(b *testing.B) {
	for _, n := range []int{4_000, 40_000, 400_000} {
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			a, rhs := benchGeneral(n)
			x := make([]float64, n)
			var f LU
			for b.Loop() {
				if err := f.Factorize(a); err != nil {
					b.Fatal(err)
				}
				if err := f.SolveTo(x, rhs); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/row")
		})
	}
}

// BenchmarkLUCond times the condition estimate after one factorization.
func BenchmarkLUCond(b *testing.B) {
	for _, n := range []int{4_000, 40_000, 400_000} {
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			a, _ := benchGeneral(n)
			var f LU
			if err := f.Factorize(a); err != nil {
				b.Fatal(err)
			}
			for b.Loop() {
				f.Cond(a)
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/row")
		})
	}
}

// fullWidthSolves are solve and solveTransposed as dgbtrs does them, over
// all KL+KU superdiagonals of U, zeros and all: the reference for the
// solves that stop at each row's last nonzero (LU.reach).
func fullWidthSolves(f *LU, x []float64, transposed bool) {
	n, kl, ku, s := f.n, f.kl, f.ku, 2*f.kl+f.ku+1
	at := func(i, j int) float64 { return f.f[i*s+j-i+kl] } // U, or L below the diagonal
	if !transposed {
		for i := range n {
			if p := f.pivots[i]; p != i {
				x[i], x[p] = x[p], x[i]
			}
			for r := 1; r <= min(kl, n-1-i); r++ {
				x[i+r] -= at(i+r, i) * x[i]
			}
		}
		for i := n - 1; i >= 0; i-- {
			sum := x[i]
			for j := i + 1; j <= min(n-1, i+kl+ku); j++ {
				sum -= at(i, j) * x[j]
			}
			x[i] = sum / at(i, i)
		}
		return
	}
	for i := range n {
		x[i] /= at(i, i)
		for j := i + 1; j <= min(n-1, i+kl+ku); j++ {
			x[j] -= at(i, j) * x[i]
		}
	}
	for i := n - 1; i >= 0; i-- {
		sum := x[i]
		for r := 1; r <= min(kl, n-1-i); r++ {
			sum -= at(i+r, i) * x[i+r]
		}
		x[i] = sum
		if p := f.pivots[i]; p != i {
			x[i], x[p] = x[p], x[i]
		}
	}
}

// The solves skip the zeros at the end of each row of U; subtracting a zero
// product leaves every sum they form as it was, so A⁻¹·b and A⁻ᵀ·b must be
// the full-width solves' to the bit, with interchanges (mixed and shuffled
// rows leave fill in some rows of U and not in others) and without.
func TestLUSolvesSkipOnlyZeros(t *testing.T) {
	rnd := rand.New(rand.NewPCG(51, 52))
	for _, c := range []bandCase{
		{60, 2, 3, dominantRows},
		{60, 3, 2, mixedRows},
		{80, 6, 6, mixedRows},
		{80, 4, 5, shuffledRows},
		{5, 0, 2, mixedRows},
	} {
		t.Run(c.String(), func(t *testing.T) {
			a := c.matrix(rnd)
			var f LU
			if err := f.Factorize(a); err != nil {
				t.Fatal(err)
			}
			trimmed := false
			for i, m := range f.reach {
				trimmed = trimmed || m < min(c.kl+c.ku, c.n-1-i)
			}
			if !trimmed && c.kl > 0 {
				t.Errorf("no row of U ends before its fill: the case does not test the skipping")
			}
			for _, transposed := range []bool{false, true} {
				b := make([]float64, c.n)
				for i := range b {
					b[i] = rnd.NormFloat64()
				}
				got, want := slices.Clone(b), slices.Clone(b)
				if transposed {
					f.solveTransposed(got)
				} else {
					f.solve(got)
				}
				fullWidthSolves(&f, want, transposed)
				for i := range got {
					if math.Float64bits(got[i]) != math.Float64bits(want[i]) {
						t.Fatalf("transposed %v: x[%d] = %.17g, full width %.17g", transposed, i, got[i], want[i])
					}
				}
			}
		})
	}
}

// FactorizeInPlace is Factorize without the copy: the same factor,
// interchanges, solves and condition estimate to the bit, the factor in
// a's own storage, and the same refusal of a singular matrix.
func TestLUFactorizeInPlace(t *testing.T) {
	rnd := rand.New(rand.NewPCG(61, 62))
	singular := generalFrom(1, 1, [][]float64{{1, 2, 0}, {2, 4, 0}, {0, 1, 1}})
	cases := []struct {
		name string
		a    *General
	}{
		{"dominant", bandCase{40, 2, 3, dominantRows}.matrix(rnd)},
		{"mixed", bandCase{60, 6, 6, mixedRows}.matrix(rnd)},
		{"shuffled", bandCase{50, 4, 5, shuffledRows}.matrix(rnd)},
		{"one", bandCase{1, 0, 0, dominantRows}.matrix(rnd)},
		{"singular", singular},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var copied, inPlace LU
			errCopied := copied.Factorize(c.a)
			a := &General{N: c.a.N, KL: c.a.KL, KU: c.a.KU, Data: slices.Clone(c.a.Data)}
			errInPlace := inPlace.FactorizeInPlace(a)
			if fmt.Sprint(errCopied) != fmt.Sprint(errInPlace) {
				t.Fatalf("Factorize: %v, in place: %v", errCopied, errInPlace)
			}
			if (errCopied != nil) != (c.name == "singular") {
				t.Fatalf("Factorize: %v", errCopied)
			}
			if errCopied != nil {
				return
			}
			if &inPlace.f[0] != &a.Data[0] {
				t.Errorf("the factorization is not in a's storage")
			}
			same := func(x, y []float64) bool {
				return slices.EqualFunc(x, y, func(u, v float64) bool { return math.Float64bits(u) == math.Float64bits(v) })
			}
			if !same(copied.f, inPlace.f) || !slices.Equal(copied.pivots, inPlace.pivots) {
				t.Fatalf("the factors or interchanges differ")
			}
			b := make([]float64, c.a.N)
			for i := range b {
				b[i] = rnd.NormFloat64()
			}
			x, y := make([]float64, len(b)), make([]float64, len(b))
			if err := copied.SolveTo(x, b); err != nil {
				t.Fatal(err)
			}
			if err := inPlace.SolveTo(y, b); err != nil {
				t.Fatal(err)
			}
			if !same(x, y) {
				t.Errorf("solves differ: %v and %v", x, y)
			}
			if p, q := copied.Cond(c.a), inPlace.Cond(a); math.Float64bits(p) != math.Float64bits(q) {
				t.Errorf("condition estimates %.17g and %.17g", p, q)
			}
		})
	}
}
