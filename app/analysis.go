package app

import (
	"errors"
	"fmt"

	"stave/fem"
	"stave/fem/check"
)

// analysis is everything the solver found for one model.
type analysis struct {
	seq      uint64
	model    fem.Model
	solution *fem.Solution // nil when the solve failed
	err      error         // why the finite element solve failed
	exact    *fem.Exact    // nil when no closed form was found
	exactErr error
	checks   []check.Result // nil when there is no solution
}

// analyse solves r's model by finite elements and in closed form.
func analyse(r request) analysis {
	a := analysis{seq: r.seq, model: r.model}
	if len(r.model.Segments) == 0 {
		a.err = errors.New("no member yet: drag along the drawing with the Member tool, or type a length")
		return a
	}
	a.solution, a.err = fem.Solve(&a.model)
	a.exact, a.exactErr = fem.SolveExact(&a.model)
	if a.solution != nil {
		a.checks = check.Run(&a.model, a.solution, a.exact, r.opts)
	}
	return a
}

// problem is the one-line summary of why there are no results.
func (a *analysis) problem() string {
	if a.err == nil {
		return ""
	}
	var mech *fem.MechanismError
	if errors.As(a.err, &mech) {
		return fmt.Sprintf("free motion: %v", a.err)
	}
	return a.err.Error()
}
