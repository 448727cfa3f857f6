package app

import (
	"errors"
	"fmt"

	"stave/fem"
	"stave/fem/check"
)

// analysis is everything the solver found for one model. It is filled in
// two stages: solveStage gives the finite element result, which is all the
// drawing needs; finishStage adds the exact solution and the checks, which
// cost more and can wait until the user stops dragging.
type analysis struct {
	seq      uint64
	model    fem.Model
	nodes    []float64     // the adaptive mesh solved on; nil for the uniform mesh
	solution *fem.Solution // nil when the solve failed
	err      error         // why the finite element solve failed
	exact    *fem.Exact    // nil when no closed form was found (or not yet sought)
	exactErr error
	checks   []check.Result // nil when there is no solution
	handbook *check.Case    // the handbook case the model matches, if any
	complete bool           // finishStage has run
}

// analyse runs both stages, for exports and tests that need everything at once.
func analyse(r request) analysis {
	a := solveStage(r)
	return finishStage(r, a)
}

// solveStage solves r's model by finite elements, on r's nodes when given.
func solveStage(r request) analysis {
	a := analysis{seq: r.seq, model: r.model, nodes: r.nodes}
	if len(r.model.Segments) == 0 {
		a.err = errors.New("no member yet: drag along the drawing with the Member tool, or type a length")
		return a
	}
	if r.nodes == nil {
		a.solution, a.err = fem.Solve(&a.model)
		return a
	}
	mesh, err := fem.MeshFromNodes(&a.model, r.nodes)
	if err != nil {
		a.err = fmt.Errorf("the refined mesh does not fit the model: %w", err)
		return a
	}
	a.solution, a.err = fem.SolveOnMesh(&a.model, mesh)
	return a
}

// finishStage returns a copy of a with the exact solution and the checks.
// It leaves a itself alone: the UI may be reading it.
func finishStage(r request, a analysis) analysis {
	a.complete = true
	if len(a.model.Segments) == 0 {
		return a
	}
	a.exact, a.exactErr = fem.SolveExact(&a.model)
	if a.solution != nil {
		a.checks = check.Run(&a.model, a.solution, a.exact, r.opts)
	}
	if c, ok := check.Handbook(&a.model); ok {
		a.handbook = &c
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
