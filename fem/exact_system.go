package fem

import (
	"errors"
	"fmt"
	"math"

	"stave/fem/band"
	"stave/fem/units"
)

// The exact solution's equations, one problem (bar or beam) at a time, have
// per stretch its homogeneous constants and per restraint its reaction as
// unknowns. Neighbouring stretches meet only at their shared key point, so
// with the unknowns ordered along the member (at each key point the
// reactions there, then the next stretch's constants) and the equations key
// point by key point, the matrix is banded and its LU factorization costs
// time linear in the number of stretches (band.LU). The matrix depends on
// the member alone, the right-hand side on the loads: ExactStructure
// factorizes it once, and Solve answers any load set on the member's key
// points (load cases, unit loads) with one substitution each.

// exactEquations receives the equations row by row: add adds v[k] to the
// matrix at (row, col+k), rhs adds v to the right-hand side of row. parts
// says which of the two it keeps: the assembly works out only those values
// and passes zeros for a matrix no one reads.
type exactEquations interface {
	add(row, col int, v []float64)
	rhs(row int, v float64)
	parts() (matrix, rhs bool)
}

// bandShape records the band an assembly touches: a dry run gives the
// widths before the matrix is allocated.
type bandShape struct{ lower, upper int }

func (s *bandShape) add(row, col int, v []float64) {
	s.lower = max(s.lower, row-col)
	s.upper = max(s.upper, col+len(v)-1-row)
}

func (s *bandShape) rhs(int, float64)          {}
func (s *bandShape) parts() (matrix, rhs bool) { return false, false }

// systemEquations keeps the matrix of the equations and their right-hand
// side, rhsEquations the right-hand side alone.
type (
	systemEquations struct {
		a *band.General
		b []float64
	}
	rhsEquations struct{ b []float64 }
)

func (s *systemEquations) add(row, col int, v []float64) { s.a.AddRow(row, col, v) }
func (s *systemEquations) rhs(row int, v float64)        { s.b[row] += v }
func (s *systemEquations) parts() (matrix, rhs bool)     { return true, true }
func (s *rhsEquations) add(int, int, []float64)          {}
func (s *rhsEquations) rhs(row int, v float64)           { s.b[row] += v }
func (s *rhsEquations) parts() (matrix, rhs bool)        { return false, true }

// equilibrationPasses is the number of Ruiz passes at most: each brings
// every row and column maximum closer to 1 (Ruiz 2001, converges linearly
// with rate 1/2); a few passes settle systems whose equations mix N, N·m
// and m.
const equilibrationPasses = 8

// maxCondition bounds the condition number of the equilibrated system; above
// it the integration constants would carry too few correct digits.
const maxCondition = 1e13

// exactFactor is one problem's equations equilibrated and factorized.
type exactFactor struct {
	lu                 band.LU
	rowScale, colScale []float64
	cond               float64 // condition estimate of the equilibrated system
}

// factorize equilibrates a (in place) by alternating square-root scaling of
// rows and columns (Ruiz), so that equations in N and in m, and unknowns in
// m and in N, meet on equal terms, and factorizes it by band LU with
// partial pivoting, in a's storage: a is used up. The factorization is not
// to be trusted before estimate accepts it.
func (f *exactFactor) factorize(a *band.General) error {
	f.rowScale, f.colScale = band.Equilibrate(a, equilibrationPasses)
	if err := f.lu.FactorizeInPlace(a); err != nil {
		var se *band.SingularError
		if errors.As(err, &se) {
			return errExactSingular(math.Inf(1))
		}
		return fmt.Errorf("the exact solution cannot be found: %v", err)
	}
	return nil
}

// estimate sets the condition estimate of the equilibrated system a that
// factorize used up, and refuses it above maxCondition. It only reads the
// factorization, so solves may run beside it.
func (f *exactFactor) estimate(a *band.General) error {
	f.cond = f.lu.Cond(a)
	if !(f.cond < maxCondition) {
		return errExactSingular(f.cond)
	}
	return nil
}

// solve returns the unknowns for the right-hand side b, which it scales in
// place.
func (f *exactFactor) solve(b []float64) ([]float64, error) {
	for i := range b {
		b[i] *= f.rowScale[i]
	}
	if err := f.lu.SolveTo(b, b); err != nil {
		return nil, fmt.Errorf("the exact solution cannot be found: %v", err)
	}
	for j := range b {
		b[j] *= f.colScale[j]
	}
	return b, nil
}

// Warning says how far the exact solution can be trusted when its
// equations are ill-conditioned, or is "" when they are not: beyond
// conditionLimit, relative errors of Condition·ε may show in the digits an
// engineer reads, and the error of the finite element answer measured
// against it may be the exact solution's own.
func (e *Exact) Warning() string {
	const eps = 0x1p-52
	if e == nil || !(e.Condition > conditionLimit) {
		return ""
	}
	return fmt.Sprintf("the exact solution's equations are ill-conditioned (estimated condition number %.2g after scaling): its values may carry relative errors up to %.0e, and the finite element error measured against it may be its own; supports, loads or changes of section very close together cause this", e.Condition, e.Condition*eps)
}

// SingularError says the exact solution's equations are singular or so
// nearly singular that they cannot be trusted: the model itself is, so the
// finite element answer of the same model is in doubt too.
type SingularError struct {
	Condition float64 // estimated condition number after scaling; +Inf when singular
}

func (e *SingularError) Error() string {
	return fmt.Sprintf("the exact solution cannot be found: its equations are singular or nearly so (condition number %s after scaling); look for springs of extreme stiffness, supports or loads very close together, or very different sections side by side", units.FormatG("%.3g", e.Condition))
}

// errExactSingular says the exact solution's equations cannot be trusted.
func errExactSingular(cond float64) error { return &SingularError{Condition: cond} }
