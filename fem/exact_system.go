package fem

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// denseSystem is a square system a·x = b filled row by row.
type denseSystem struct {
	a   *mat.Dense
	b   []float64
	row int // the row being filled
}

func newDenseSystem(n int) *denseSystem {
	return &denseSystem{a: mat.NewDense(n, n, nil), b: make([]float64, n)}
}

// equilibrationPasses is the number of Ruiz passes: each brings every row and
// column maximum closer to 1 (Ruiz 2001, converges linearly with rate 1/2);
// a few passes settle systems whose equations mix N, N·m and m.
const equilibrationPasses = 8

// solve equilibrates rows and columns to unit largest entry by alternating
// square-root scaling (Ruiz), so that equations in N and in m, and unknowns
// in m and in N, meet on equal terms, and solves by LU with partial pivoting.
func (s *denseSystem) solve() ([]float64, error) {
	n := len(s.b)
	if s.row != n {
		return nil, fmt.Errorf("fem: exact solution assembled %d equations for %d unknowns", s.row, n)
	}
	scaled := mat.DenseCopyOf(s.a)
	rowScale, colScale := make([]float64, n), make([]float64, n)
	for i := range rowScale {
		rowScale[i], colScale[i] = 1, 1
	}
	for pass := 0; pass < equilibrationPasses; pass++ {
		for i := 0; i < n; i++ {
			if big := largestAbs(scaled.RawRowView(i)); big > 0 {
				f := 1 / math.Sqrt(big)
				rowScale[i] *= f
				scaleRow(scaled, i, f)
			}
		}
		for j := 0; j < n; j++ {
			if big := largestAbs(mat.Col(nil, j, scaled)); big > 0 {
				f := 1 / math.Sqrt(big)
				colScale[j] *= f
				scaleCol(scaled, j, f)
			}
		}
	}
	rhs := mat.NewVecDense(n, nil)
	for i := range s.b {
		rhs.SetVec(i, s.b[i]*rowScale[i])
	}
	var lu mat.LU
	lu.Factorize(scaled)
	if c := lu.Cond(); !(c < maxCondition) {
		return nil, fmt.Errorf("the exact solution cannot be found: its equations are singular or nearly so (condition number %.3g after scaling); look for springs of extreme stiffness, supports or loads very close together, or very different sections side by side", c)
	}
	var y mat.VecDense
	if err := lu.SolveVecTo(&y, false, rhs); err != nil {
		return nil, fmt.Errorf("the exact solution cannot be found: %v", err)
	}
	x := make([]float64, n)
	for j := range x {
		x[j] = y.AtVec(j) * colScale[j]
	}
	return x, nil
}

func scaleRow(a *mat.Dense, i int, f float64) {
	row := a.RawRowView(i)
	for j := range row {
		row[j] *= f
	}
}

func scaleCol(a *mat.Dense, j int, f float64) {
	r, _ := a.Dims()
	for i := 0; i < r; i++ {
		a.Set(i, j, a.At(i, j)*f)
	}
}

func largestAbs(v []float64) float64 {
	big := 0.0
	for _, x := range v {
		big = math.Max(big, math.Abs(x))
	}
	return big
}
