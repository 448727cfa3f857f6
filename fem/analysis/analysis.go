// Package analysis works out everything Stave reports for one model: the
// finite element solution (on the model's own mesh or on given nodes), the
// exact solution of the same model, the checks of package check, the
// handbook case the model matches and the summary, and it turns them into
// the findings every output lists. The window, the exports and the command
// line all analyse through it, so none of them can leave a step out.
//
// An analysis runs in two stages: Solve gives the finite element result,
// which is all a drawing needs, and Finish adds the exact solution and the
// checks, which cost more; Run does both. The window shows the first stage
// while the user drags and the second when the mouse rests. Where Finish
// will follow (Request.ExactAhead; Run), Solve starts the exact solution on
// a goroutine of its own beside the finite element solve, and Finish waits
// for it.
package analysis

import (
	"context"
	"errors"
	"fmt"
	"slices"
	"sync/atomic"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/units"
)

// Request is one model to analyse.
type Request struct {
	// Model is the model, owned by the analysis: pass a copy (fem.Model.Clone)
	// of one that may change meanwhile.
	Model fem.Model
	// Nodes is a mesh to solve on (an adaptive one); nil for the model's own.
	Nodes []float64
	// Checks are the limits of the checks, messages in their display units.
	Checks check.Options
	// Show is what to show of a model with load cases (cases.go).
	Show Show
	// TrainLabels name the project's moving load trains, by index, as
	// moving.Train.Label does, for the findings on the combinations that
	// take them (fem.Combination.Trains); nil names them by number.
	TrainLabels []string
	// ExactAhead asks Solve to start the exact solution beside the finite
	// element solve, for a Finish that will follow (Run sets it). A caller
	// that may drop the first stage unfinished (a window during a drag)
	// leaves it unset while it does, or the work would be thrown away.
	ExactAhead bool
}

// Analysis is what the stages found for one model.
type Analysis struct {
	Model fem.Model
	Nodes []float64 // the mesh solved on; nil for the model's own
	// Solution is the finite element solution; nil when Err says why not.
	Solution *fem.Solution
	Err      error
	// Exact is the exact solution; nil when ExactErr says why not, or before
	// Finish.
	Exact    *fem.Exact
	ExactErr error
	Checks   []check.Result // nil when there is no solution
	Handbook *check.Case    // the handbook case the model matches, if any
	// Cases are the combinations and the envelope of a model with load
	// cases (cases.go); nil for a model without.
	Cases *Cases
	// Complete says Finish has run to its end.
	Complete bool
	// Units are the display units of the findings' messages (the checks'
	// Options.Units; SI when they name none).
	Units units.System
	// TrainLabels are the request's (Request.TrainLabels).
	TrainLabels []string
	// summary is what Finish's walk gathered for Summary; shared by the
	// copies of a, never changed.
	summary *fem.Summary
	// prepared is the model as Solve prepared it, whose exact solution
	// Finish takes; nil where Solve prepared none (cases, a refused model)
	// and after Finish.
	prepared *prepared
}

// prepared is a member prepared by Solve, with the work of its exact
// solution started ahead of Finish where Solve could start it: on a mesh
// of its own (given nodes, or the model's element counts) the finite
// element solve needs nothing of the exact solution, so the two share the
// cores, and Finish waits for it. (The automatic mesh is chosen from the
// exact solution, so there the finite element solve waits for it.)
type prepared struct {
	member *fem.Member
	ahead  *ahead // nil when Solve started none
}

// exact is the member's exact solution, once the work ahead has ended
// (fem.Member works it out once and keeps it, or the panic it met, which
// it raises again here, in the caller's goroutine, where a caller may
// recover it: a batch check does).
func (pr *prepared) exact() (*fem.Exact, error) {
	pr.ahead.wait()
	return pr.member.Exact()
}

// aheadToken is held while one piece of work runs ahead (startAhead).
var aheadToken atomic.Bool

// ahead is work running on a goroutine of its own; done is closed when it
// ends.
type ahead struct{ done chan struct{} }

// startAhead runs work on a goroutine of its own, unless other work is
// running ahead: then it returns nil and the caller does the work when it
// needs it. Only one runs at a time, so that work nobody waits for any
// more cannot pile up. A panic of work ends the work alone: work must keep
// it for whoever needs its result (fem.Member does).
func startAhead(work func()) *ahead {
	if !aheadToken.CompareAndSwap(false, true) {
		return nil
	}
	w := &ahead{done: make(chan struct{})}
	go func() {
		defer func() {
			_ = recover()           // kept by work and raised again where it is needed
			aheadToken.Store(false) // free before the waiter wakes
			close(w.done)
		}()
		work()
	}()
	return w
}

// wait waits for the work to end; nothing to wait for on a nil w.
func (w *ahead) wait() {
	if w != nil {
		<-w.done
	}
}

// Solve is the first stage: r's model solved by finite elements, on r's
// nodes when given. It returns ctx's error, and no analysis, when ctx is
// done before it starts; once started the solve runs to its end.
func Solve(ctx context.Context, r Request) (Analysis, error) {
	if err := ctx.Err(); err != nil {
		return Analysis{}, err
	}
	a := Analysis{Model: r.Model, Nodes: r.Nodes, Units: r.Checks.Units, TrainLabels: r.TrainLabels}
	if a.Units.Name == "" {
		a.Units = units.SI
	}
	if len(r.Model.Segments) == 0 {
		a.Err = errors.New("no member yet: drag along the drawing with the Member tool, or type a length")
		return a, nil
	}
	if len(r.Model.Cases) > 0 {
		solveCases(&a, r)
		return a, nil
	}
	p, err := fem.PrepareIn(&a.Model, a.Units)
	if err != nil {
		a.Err = err
		return a, nil
	}
	a.prepared = &prepared{member: p}
	if r.ExactAhead {
		a.prepared.ahead = startAhead(func() { p.Exact() })
	}
	mesh, err := meshFor(p, r.Nodes)
	if err != nil {
		a.Err = err
		return a, nil
	}
	a.Solution, a.Err = p.Solve(mesh)
	return a, nil
}

// meshFor is the mesh to solve p on: on nodes (an adaptive mesh) when not
// nil, else the model's own.
func meshFor(p *fem.Member, nodes []float64) (fem.Mesh, error) {
	if nodes == nil {
		return p.Mesh(), nil
	}
	mesh, err := p.MeshOn(nodes)
	if err != nil {
		return fem.Mesh{}, fmt.Errorf("the refined mesh does not fit the model: %w", err)
	}
	return mesh, nil
}

// Finish is the second stage: a copy of a, the first stage of r, with the
// exact solution, the checks and the handbook case. It leaves a itself
// alone, since a window may be showing it. When ctx is done between its
// steps it returns ctx's error.
func Finish(ctx context.Context, r Request, a Analysis) (Analysis, error) {
	if len(a.Model.Segments) == 0 {
		a.Complete = true
		return a, nil
	}
	if err := ctx.Err(); err != nil {
		return a, err
	}
	if a.Cases != nil {
		a.Cases = a.Cases.clone()
		a.Exact, a.ExactErr = a.Cases.exact()
	} else if a.prepared != nil {
		a.Exact, a.ExactErr = a.prepared.exact()
		a.prepared = nil
	} else if p, err := fem.PrepareIn(&a.Model, a.Units); err != nil {
		a.ExactErr = err // the model's own fault, as Solve found it
	} else {
		a.Exact, a.ExactErr = p.Exact()
	}
	if err := ctx.Err(); err != nil {
		return a, err
	}
	if a.Solution != nil {
		// One walk over the elements feeds the summary and the checks.
		z := fem.NewSummarizer(a.Solution, a.Exact)
		p := check.NewProbe(&a.Model, a.Solution, a.Exact)
		fem.Walk(a.Solution, a.Exact, z, p)
		a.Checks = p.Results(z.Comparison(), r.Checks)
		sum := z.Summary()
		a.summary = &sum
		if a.Cases != nil {
			a.Cases.finish(&a, r.Checks)
		}
	}
	if c, ok := check.Handbook(&a.Model); ok {
		a.Handbook = &c
	}
	a.Complete = true
	return a, nil
}

// Run runs both stages, the exact solution started beside the finite
// element solve (Request.ExactAhead).
func Run(ctx context.Context, r Request) (Analysis, error) {
	r.ExactAhead = true
	a, err := Solve(ctx, r)
	if err != nil {
		return a, err
	}
	return Finish(ctx, r, a)
}

// Problem is the one-line summary of why there are no results; "" when
// there are.
func (a *Analysis) Problem() string {
	if a.Err == nil {
		return ""
	}
	var mech *fem.MechanismError
	if errors.As(a.Err, &mech) {
		return fmt.Sprintf("free motion: %v", a.Err)
	}
	return a.Err.Error()
}

// Summary is fem.Summarize of the solution against the exact one, as
// Finish's walk gathered it (worked out here before Finish); a must have a
// Solution. It is a copy: the caller may change it.
func (a *Analysis) Summary() fem.Summary {
	var sum fem.Summary
	if a.summary == nil {
		sum = fem.Summarize(a.Solution, a.Exact)
	} else {
		sum = *a.summary
		sum.Reactions = slices.Clone(sum.Reactions)
		sum.Extremes = slices.Clone(sum.Extremes)
		sum.Supports = slices.Clone(sum.Supports)
		if e := sum.ExactError; e != nil {
			norms := *e
			sum.ExactError = &norms
		}
	}
	return sum
}
