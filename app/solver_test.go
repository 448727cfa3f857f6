package app

import (
	"context"
	"sync"
	"testing"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
)

// quickStages are analysis stages that solve nothing, for solver tests.
func quickStages(solve func(r request)) stages {
	return stages{
		solve: func(_ context.Context, r request) (result, error) {
			if solve != nil {
				solve(r)
			}
			return result{seq: r.seq, Analysis: analysis.Analysis{Model: r.Model}}, nil
		},
		finish: func(_ context.Context, r request, a result) (result, error) { a.Complete = true; return a, nil },
	}
}

// TestSolverKeepsOnlyTheNewest holds the worker busy on the first request
// while 999 more arrive: it must solve only the first and the last, and
// deliver only the last, first without and then with its second stage.
// The exact solution is asked to start beside the first stage only while
// the stages keep up: for the first request, not for the one after a
// request dropped unfinished, and again once one is finished.
func TestSolverKeepsOnlyTheNewest(t *testing.T) {
	release := make(chan struct{})
	started := make(chan uint64, 10)
	var analysed []uint64 // written by the worker, read after stop
	ahead := map[uint64]bool{}
	q := &uiQueue{}
	var delivered []result
	s := newSolver(quickStages(func(r request) {
		started <- r.seq
		if r.seq == 1 {
			<-release
		}
		analysed = append(analysed, r.seq)
		ahead[r.seq] = r.ExactAhead
	}), q.post, func(a result) { delivered = append(delivered, a) })

	m := newMember(1)
	s.submit(m, nil, check.Options{})
	if first := <-started; first != 1 {
		t.Fatalf("worker started on request %d, want 1", first)
	}
	for i := 2; i <= 1000; i++ {
		m.Mesh.Elements = i
		s.submit(m, nil, check.Options{})
	}
	close(release)
	q.waitFor(t, "the newest complete result", func() bool { return len(delivered) > 0 && delivered[len(delivered)-1].Complete })
	<-started
	s.submit(m, nil, check.Options{})
	<-started
	q.waitFor(t, "the next complete result", func() bool { return delivered[len(delivered)-1].seq == 1001 && delivered[len(delivered)-1].Complete })
	s.stop()
	q.drain()
	if !ahead[1] || ahead[1000] || !ahead[1001] {
		t.Errorf("exact solution asked ahead for requests 1, 1000, 1001: %v, %v, %v; want true, false, true", ahead[1], ahead[1000], ahead[1001])
	}
	delivered, analysed = delivered[:len(delivered)-2], analysed[:len(analysed)-1]
	if len(delivered) != 2 || delivered[0].seq != 1000 || delivered[1].seq != 1000 || delivered[0].Complete || delivered[1].Model.Mesh.Elements != 1000 {
		t.Errorf("delivered %+v; want request 1000 (1000 elements) twice, first without its second stage", delivered)
	}
	if len(analysed) != 2 || analysed[1] != 1000 {
		t.Errorf("solved requests %v, want [1 1000]", analysed)
	}
}

// TestSecondStageSkippedWhenNewerWaits: when an edit arrives while the
// finite element result of the previous one is on its way to the UI, the
// exact solution and checks of the previous one are never computed.
func TestSecondStageSkippedWhenNewerWaits(t *testing.T) {
	q := &uiQueue{}
	posted, proceed := make(chan struct{}), make(chan struct{})
	var once sync.Once
	post := func(f func()) {
		q.post(f)
		once.Do(func() { posted <- struct{}{}; <-proceed })
	}
	st := quickStages(nil)
	var finished []uint64 // written by the worker, read after stop
	finish := st.finish
	st.finish = func(ctx context.Context, r request, a result) (result, error) {
		finished = append(finished, r.seq)
		return finish(ctx, r, a)
	}
	var delivered []result
	s := newSolver(st, post, func(a result) { delivered = append(delivered, a) })
	m := newMember(1)
	s.submit(m, nil, check.Options{})
	<-posted // the first result is posted; the worker waits
	s.submit(m, nil, check.Options{})
	close(proceed)
	q.waitFor(t, "the complete second result", func() bool { return len(delivered) > 0 && delivered[len(delivered)-1].Complete })
	s.stop()
	q.drain()
	if len(finished) != 1 || finished[0] != 2 {
		t.Errorf("second stage ran for requests %v, want only [2]", finished)
	}
	for _, a := range delivered {
		if a.seq != 2 {
			t.Errorf("delivered request %d, which was stale", a.seq)
		}
	}
}

// TestSubmitCopiesTheModel: changing the caller's model or nodes after
// submitting must not change what the solver sees.
func TestSubmitCopiesTheModel(t *testing.T) {
	got := make(chan request, 1)
	s := newSolver(quickStages(func(r request) { got <- r }), func(func()) {}, func(result) {})
	defer s.stop()
	m := newMember(2)
	m.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}}
	nodes := []float64{0, 1, 2}
	s.submit(m, nodes, check.Options{})
	m.Supports[0].X = 1
	m.Segments[0].Section.Area = 7
	nodes[1] = 1.5
	if r := <-got; r.Model.Supports[0].X != 0 || r.Model.Segments[0].Section.Area == 7 || r.Nodes[1] != 1 {
		t.Errorf("the solver saw a change made after submitting: %+v", r)
	}
}
