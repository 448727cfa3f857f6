package app

import (
	"context"
	"sort"
	"sync"
	"time"
)

// jobs knows every piece of background work of a window other than the
// solver (exports and studies): each runs on its own goroutine with a
// context that cancel ends, and stop cancels them all and waits for them
// when the window closes. A job's result reaches the UI goroutine through
// post, unless the jobs were stopped meanwhile: then no one is there to
// read it.
type jobs struct {
	post func(func())

	mu      sync.Mutex
	next    int
	running map[int]*job
	stopped bool
	wg      sync.WaitGroup
}

// job is one running piece of background work.
type job struct {
	what   string
	cancel context.CancelFunc
}

func newJobs(post func(func())) *jobs {
	return &jobs{post: post, running: map[int]*job{}}
}

// start runs work in the background as a job called what and returns its
// number. work returns what is to be done on the UI goroutine with its
// result (nil for nothing); it should stop soon after ctx is done. After
// stop, start runs nothing and returns 0.
func (j *jobs) start(what string, work func(ctx context.Context) func()) int {
	j.mu.Lock()
	defer j.mu.Unlock()
	if j.stopped {
		return 0
	}
	j.next++
	id := j.next
	ctx, cancel := context.WithCancel(context.Background())
	j.running[id] = &job{what: what, cancel: cancel}
	j.wg.Add(1)
	go func() {
		defer j.wg.Done()
		done := work(ctx)
		j.mu.Lock()
		delete(j.running, id)
		stopped := j.stopped
		j.mu.Unlock()
		cancel()
		if done != nil && !stopped {
			j.post(done)
		}
	}()
	return id
}

// cancel asks job id to stop; it reports whether the job was still running.
func (j *jobs) cancel(id int) bool {
	j.mu.Lock()
	defer j.mu.Unlock()
	r, ok := j.running[id]
	if ok {
		r.cancel()
	}
	return ok
}

// names lists what runs, in the order started.
func (j *jobs) names() []string {
	j.mu.Lock()
	defer j.mu.Unlock()
	ids := make([]int, 0, len(j.running))
	for id := range j.running {
		ids = append(ids, id)
	}
	sort.Ints(ids)
	out := make([]string, len(ids))
	for i, id := range ids {
		out[i] = j.running[id].what
	}
	return out
}

// stop cancels every job, starts no more, and waits up to wait for the
// running ones to end; it reports whether they all did. Their results are
// dropped.
func (j *jobs) stop(wait time.Duration) bool {
	j.mu.Lock()
	j.stopped = true
	for _, r := range j.running {
		r.cancel()
	}
	j.mu.Unlock()
	ended := make(chan struct{})
	go func() {
		j.wg.Wait()
		close(ended)
	}()
	select {
	case <-ended:
		return true
	case <-time.After(wait):
		return false
	}
}
