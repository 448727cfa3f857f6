package app

import (
	"sync"
	"sync/atomic"

	"stave/fem"
	"stave/fem/check"
)

// request is one model to analyse, numbered in the order of the edits.
type request struct {
	seq   uint64
	model fem.Model // a deep copy owned by the solver
	opts  check.Options
}

// solver analyses models on its own goroutine. Requests go through a
// one-place mailbox in which a newer request replaces one not yet taken, so
// a drag that produces hundreds of edits costs only as many analyses as the
// solver can finish meanwhile. A result older than the newest request is
// dropped before it reaches the UI.
type solver struct {
	mailbox chan request
	quit    chan struct{}
	done    sync.WaitGroup
	latest  atomic.Uint64 // number of the newest request submitted
	next    uint64        // owned by the submitting (UI) goroutine

	analyse func(request) analysis
	// post runs a function on the UI goroutine: fyne.Do in the application,
	// a queue the test drains in tests.
	post    func(func())
	deliver func(analysis) // runs on the UI goroutine
}

// newSolver starts the worker goroutine.
func newSolver(analyse func(request) analysis, post func(func()), deliver func(analysis)) *solver {
	s := &solver{
		mailbox: make(chan request, 1),
		quit:    make(chan struct{}),
		analyse: analyse,
		post:    post,
		deliver: deliver,
	}
	s.done.Add(1)
	go s.run()
	return s
}

// submit queues a copy of m and returns its sequence number. It never blocks.
// It must be called from one goroutine only (the UI's).
func (s *solver) submit(m fem.Model, opts check.Options) uint64 {
	s.next++
	r := request{seq: s.next, model: cloneModel(m), opts: opts}
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

// stop ends the worker and waits for it; results still in flight are dropped.
func (s *solver) stop() {
	close(s.quit)
	s.done.Wait()
}

func (s *solver) run() {
	defer s.done.Done()
	for {
		select {
		case <-s.quit:
			return
		case r := <-s.mailbox:
			a := s.analyse(r)
			if a.seq < s.latest.Load() {
				continue // a newer edit is already waiting
			}
			s.post(func() {
				if a.seq == s.latest.Load() {
					s.deliver(a)
				}
			})
		}
	}
}
