package fem

import (
	"errors"
	"fmt"
	"math"

	"stave/fem/band"
)

// The exact solution's equations, one problem (bar or beam) at a time, have
// per stretch its homogeneous constants and per restraint its reaction as
// unknowns. Neighbouring stretches meet only at their shared key point, so
// with the unknowns ordered along the member (at each key point the
// reactions there, then the next stretch's constants) and the equations key
// point by key point, the matrix is banded and its LU factorization costs
// time linear in the number of stretches (band.LU).

// exactEquations receives the equations row by row: add puts v into the
// matrix at (row, col), rhs adds v to the right-hand side of row.
type exactEquations interface {
	add(row, col int, v float64)
	rhs(row int, v float64)
}

// bandShape records the band an assembly touches: a dry run gives the
// widths before the matrix is allocated.
type bandShape struct{ lower, upper int }

func (s *bandShape) add(row, col int, _ float64) {
	s.lower = max(s.lower, row-col)
	s.upper = max(s.upper, col-row)
}

func (s *bandShape) rhs(int, float64) {}

// bandedEquations is the banded system a·x = b.
type bandedEquations struct {
	a *band.General
	b []float64
}

func (s *bandedEquations) add(row, col int, v float64) { s.a.Add(row, col, v) }
func (s *bandedEquations) rhs(row int, v float64)      { s.b[row] += v }

// equilibrationPasses is the number of Ruiz passes: each brings every row and
// column maximum closer to 1 (Ruiz 2001, converges linearly with rate 1/2);
// a few passes settle systems whose equations mix N, N·m and m.
const equilibrationPasses = 8

// maxCondition bounds the condition number of the equilibrated system; above
// it the integration constants would carry too few correct digits.
const maxCondition = 1e13

// solve equilibrates rows and columns to unit largest entry by alternating
// square-root scaling (Ruiz), so that equations in N and in m, and unknowns
// in m and in N, meet on equal terms, and solves by band LU with partial
// pivoting.
func (s *bandedEquations) solve() ([]float64, error) {
	rowScale, colScale := band.Equilibrate(s.a, equilibrationPasses)
	y := make([]float64, len(s.b))
	for i := range y {
		y[i] = s.b[i] * rowScale[i]
	}
	var lu band.LU
	if err := lu.Factorize(s.a); err != nil {
		var se *band.SingularError
		if errors.As(err, &se) {
			return nil, errExactSingular(math.Inf(1))
		}
		return nil, fmt.Errorf("the exact solution cannot be found: %v", err)
	}
	if c := lu.Cond(s.a); !(c < maxCondition) {
		return nil, errExactSingular(c)
	}
	if err := lu.SolveTo(y, y); err != nil {
		return nil, fmt.Errorf("the exact solution cannot be found: %v", err)
	}
	for j := range y {
		y[j] *= colScale[j]
	}
	return y, nil
}

// errExactSingular says the exact solution's equations cannot be trusted.
func errExactSingular(cond float64) error {
	return fmt.Errorf("the exact solution cannot be found: its equations are singular or nearly so (condition number %.3g after scaling); look for springs of extreme stiffness, supports or loads very close together, or very different sections side by side", cond)
}
