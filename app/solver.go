package app

import (
	"context"
	"sync"
	"sync/atomic"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
)

// request is one model to analyse, numbered in the order of the edits. Its
// model is a deep copy owned by the solver.
type request struct {
	seq uint64
	analysis.Request
}

// result is the analysis of request seq, as far as it has got.
type result struct {
	seq uint64
	analysis.Analysis
}

// stages are the two steps of an analysis (see package fem/analysis); each
// returns ctx's error when the solver stops first.
type stages struct {
	solve  func(context.Context, request) (result, error)
	finish func(context.Context, request, result) (result, error)
}

// analysisStages are the stages the window uses.
var analysisStages = stages{
	solve: func(ctx context.Context, r request) (result, error) {
		a, err := analysis.Solve(ctx, r.Request)
		return result{r.seq, a}, err
	},
	finish: func(ctx context.Context, r request, first result) (result, error) {
		a, err := analysis.Finish(ctx, r.Request, first.Analysis)
		return result{r.seq, a}, err
	},
}

// solver analyses models on its own goroutine. Requests go through a
// one-place mailbox in which a newer request replaces one not yet taken, so
// a drag that produces hundreds of edits costs only as many analyses as the
// solver can finish meanwhile. Each request is delivered twice: first the
// finite element result, then the same with the exact solution and the
// checks. The second stage is skipped when a newer request is already
// waiting, so during a drag only finite element solves run, and it catches
// up when the mouse rests. A result older than the newest request is
// dropped before it reaches the UI.
type solver struct {
	mailbox chan request
	ctx     context.Context // done when the solver stops
	stopNow context.CancelFunc
	done    sync.WaitGroup
	latest  atomic.Uint64 // number of the newest request submitted
	next    uint64        // owned by the submitting (UI) goroutine

	stages stages
	// show is what the next request shows of a model with cases, and
	// trains the labels of the project's trains; set by the submitting
	// goroutine.
	show   analysis.Show
	trains []string
	// post runs a function on the UI goroutine: fyne.Do in the application,
	// a queue the test drains in tests.
	post    func(func())
	deliver func(result) // runs on the UI goroutine
}

// newSolver starts the worker goroutine.
func newSolver(st stages, post func(func()), deliver func(result)) *solver {
	s := &solver{
		mailbox: make(chan request, 1),
		stages:  st,
		post:    post,
		deliver: deliver,
	}
	s.ctx, s.stopNow = context.WithCancel(context.Background())
	s.done.Add(1)
	go s.run()
	return s
}

// submit queues a copy of m (to be solved on nodes when not nil) and returns
// its sequence number. It never blocks. It must be called from one goroutine
// only (the UI's).
func (s *solver) submit(m fem.Model, nodes []float64, opts check.Options) uint64 {
	s.next++
	r := request{s.next, analysis.Request{Model: m.Clone(), Nodes: append([]float64(nil), nodes...), Checks: opts, Show: s.show, TrainLabels: s.trains}}
	if nodes == nil {
		r.Nodes = nil
	}
	s.latest.Store(r.seq)
	for {
		select {
		case s.mailbox <- r:
			return r.seq
		default:
		}
		select { // the mailbox holds an older request: take it out
		case <-s.mailbox:
		default:
		}
	}
}

// stop ends the worker, cancelling the stage it runs between its steps, and
// waits for it; results still in flight are dropped.
func (s *solver) stop() {
	s.stopNow()
	s.done.Wait()
}

// stale reports whether a newer request than seq has been submitted.
func (s *solver) stale(seq uint64) bool { return seq < s.latest.Load() }

// send posts a to the UI goroutine, which delivers it if it is still the newest.
func (s *solver) send(a result) {
	s.post(func() {
		if a.seq == s.latest.Load() {
			s.deliver(a)
		}
	})
}

func (s *solver) run() {
	defer s.done.Done()
	keepingUp := true // the last request got both stages
	for {
		select {
		case <-s.ctx.Done():
			return
		case r := <-s.mailbox:
			// The exact solution is started beside the finite element
			// solve only while both stages keep up with the edits: in a
			// drag that outruns them the second stage is skipped, and the
			// work would be thrown away.
			r.ExactAhead = keepingUp
			keepingUp = false // until this request is finished
			a, err := s.stages.solve(s.ctx, r)
			if err != nil {
				return // stopped
			}
			if s.stale(a.seq) {
				continue // a newer edit is already waiting
			}
			s.send(a)
			if s.stale(a.seq) {
				continue
			}
			full, err := s.stages.finish(s.ctx, r, a)
			if err != nil {
				return
			}
			if s.stale(full.seq) {
				continue
			}
			s.send(full)
			keepingUp = true
		}
	}
}
