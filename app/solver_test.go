package app

import (
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// TestSolverKeepsOnlyTheNewest holds the worker busy on the first request
// while 999 more arrive: it must analyse only the first and the last, and
// deliver only the last.
func TestSolverKeepsOnlyTheNewest(t *testing.T) {
	release := make(chan struct{})
	started := make(chan uint64, 10)
	var analysed []uint64 // written by the worker, read after stop
	q := &uiQueue{}
	var delivered []analysis
	s := newSolver(func(r request) analysis {
		started <- r.seq
		if r.seq == 1 {
			<-release
		}
		analysed = append(analysed, r.seq)
		return analysis{seq: r.seq, model: r.model}
	}, q.post, func(a analysis) { delivered = append(delivered, a) })

	m := newMember(1)
	s.submit(m, check.Options{})
	if first := <-started; first != 1 {
		t.Fatalf("worker started on request %d, want 1", first)
	}
	for i := 2; i <= 1000; i++ {
		m.Mesh.Elements = i
		s.submit(m, check.Options{})
	}
	close(release)
	q.waitFor(t, "the newest result", func() bool { return len(delivered) > 0 })
	s.stop()
	q.drain()
	if len(delivered) != 1 || delivered[0].seq != 1000 || delivered[0].model.Mesh.Elements != 1000 {
		t.Errorf("delivered %d results, the first numbered %d with %d elements; want one, number 1000 with 1000 elements",
			len(delivered), delivered[0].seq, delivered[0].model.Mesh.Elements)
	}
	if len(analysed) != 2 || analysed[1] != 1000 {
		t.Errorf("analysed requests %v, want [1 1000]", analysed)
	}
}

// TestSubmitCopiesTheModel: changing the caller's model after submitting
// must not change what the solver sees.
func TestSubmitCopiesTheModel(t *testing.T) {
	got := make(chan fem.Model, 1)
	s := newSolver(func(r request) analysis { got <- r.model; return analysis{seq: r.seq} }, func(func()) {}, func(analysis) {})
	defer s.stop()
	m := newMember(2)
	m.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}}
	s.submit(m, check.Options{})
	m.Supports[0].X = 1
	m.Segments[0].Section.Area = 7
	if r := <-got; r.Supports[0].X != 0 || r.Segments[0].Section.Area == 7 {
		t.Errorf("the solver saw a change made after submitting: %+v", r)
	}
}
