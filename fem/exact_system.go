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

// solve equilibrates the columns and then the rows to unit largest entry, so
// that equations in N and in m, and unknowns in m and in N, meet on equal
// terms, and solves by LU with partial pivoting.
func (s *denseSystem) solve() ([]float64, error) {
	n := len(s.b)
	if s.row != n {
		return nil, fmt.Errorf("fem: exact solution assembled %d equations for %d unknowns", s.row, n)
	}
	colScale := make([]float64, n)
	for j := range colScale {
		colScale[j] = 1 / largestAbs(mat.Col(nil, j, s.a))
	}
	scaled := mat.NewDense(n, n, nil)
	rhs := mat.NewVecDense(n, nil)
	for i := 0; i < n; i++ {
		row := s.a.RawRowView(i)
		big := 0.0
		for j, v := range row {
			big = math.Max(big, math.Abs(v*colScale[j]))
		}
		for j, v := range row {
			scaled.Set(i, j, v*colScale[j]/big)
		}
		rhs.SetVec(i, s.b[i]/big)
	}
	var lu mat.LU
	lu.Factorize(scaled)
	if c := lu.Cond(); !(c < maxCondition) {
		return nil, fmt.Errorf("the exact solution cannot be found: its equations are singular or nearly so (condition number %.3g); check for springs of extreme stiffness or a support arrangement that lets the member move", c)
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

func largestAbs(v []float64) float64 {
	big := 0.0
	for _, x := range v {
		big = math.Max(big, math.Abs(x))
	}
	return big
}
