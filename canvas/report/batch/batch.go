// Package batch checks a schedule of members, one model file each: it loads
// and analyses the files on a pool of workers (one per core by default),
// boils each analysis down to one line (the member's mark, the governing
// check and its utilisation, the largest deflection as span/n, the warnings)
// and hands the lines back in the order of the files, whatever the number of
// workers. A file that cannot be loaded or solved gets a line saying why;
// the batch goes on.
//
// Memory is bounded by the workers, not by the batch: a worker keeps one
// analysis at a time and drops it once its line is made, and a line waits
// for the ones before it in a window of a few lines per worker. The writers
// (WriteText aside, which aligns its columns) stream the lines as they come.
//
// Each member is analysed exactly as `stave solve` and the window analyse
// one file (report.Request and package fem/analysis), so the batch cannot
// drift from them. It imports no GUI toolkit.
package batch

import (
	"context"
	"fmt"
	"runtime"
	"strings"
	"sync"

	"stave/canvas/report"
	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// Status grades a member, from best to worst.
type Status int

// Statuses of a member, best first.
const (
	OK      Status = iota // solved, no check failed, nothing to look at
	Caution               // solved, no check failed, but a finding asks for a look
	Failed                // solved, but a check failed or the results are unreliable (analysis.Failed)
	Refused               // the file could not be loaded, or its model not solved
)

var statusWords = [...]string{"ok", "caution", "fail", "refused"}

// String is the status as the outputs write it.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusWords) {
		return "unknown"
	}
	return statusWords[s]
}

// MarshalText writes the status as its word, in JSON too.
func (s Status) MarshalText() ([]byte, error) { return []byte(s.String()), nil }

// StatusOf grades the findings of a solved model: Failed when any is a
// failure or marks the results as unreliable (analysis.Failed: `stave
// solve` then exits 3), Caution when any asks for caution, OK otherwise.
func StatusOf(fs []analysis.Finding) Status {
	if analysis.Failed(fs) {
		return Failed
	}
	for _, f := range fs {
		if f.Severity == analysis.Caution {
			return Caution
		}
	}
	return OK
}

// Load reads one member's project from its name in the batch.
type Load func(name string) (*storage.Project, error)

// Options tune Run. The zero value checks files on one worker per core.
type Options struct {
	// Workers is how many members are analysed at once; 0 or less means
	// one per core (runtime.GOMAXPROCS).
	Workers int
	// Load reads a member; nil reads the named file (storage.Load).
	Load Load
	// Units are the units the checks name their places and values in; the
	// zero value takes each file's display units, as `stave solve` does.
	Units units.System
}

// linesPerWorker is how far a finished line may run ahead of the first
// unfinished one, per worker: enough that one slow member does not idle the
// others, little enough that waiting lines stay a few kilobytes.
const linesPerWorker = 8

// Run checks the members named in order, on opts.Workers workers, and hands
// each line to emit in the order of names, from the calling goroutine. It
// returns the summary of the lines handed over. When emit returns an error,
// Run stops the batch and returns that error; when ctx is done, ctx's.
func Run(ctx context.Context, names []string, opts Options, emit func(Member) error) (Summary, error) {
	workers := opts.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	load := opts.Load
	if load == nil {
		load = storage.Load
	}
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()

	// A slot is taken before a member is handed out and given back when its
	// line is emitted, so at most window lines exist at once.
	window := workers * linesPerWorker
	slots := make(chan struct{}, window)
	jobs := make(chan int)
	go func() {
		defer close(jobs)
		for i := range names {
			select {
			case slots <- struct{}{}:
			case <-ctx.Done():
				return
			}
			select {
			case jobs <- i:
			case <-ctx.Done():
				return
			}
		}
	}()
	type done struct {
		index int
		line  Member
	}
	results := make(chan done, workers)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				results <- done{i, checkOne(ctx, names[i], load, opts.Units)}
			}
		}()
	}
	go func() {
		wg.Wait()
		close(results)
	}()

	var sum Summary
	var stop error
	waiting := make([]*Member, window)
	next := 0
	for r := range results {
		if stop != nil {
			continue // drain, so the workers can finish
		}
		waiting[r.index%window] = &r.line
		for stop == nil && next < len(names) && waiting[next%window] != nil {
			if err := ctx.Err(); err != nil {
				stop = err // lines made after the cancellation say only that
				break
			}
			m := waiting[next%window]
			waiting[next%window] = nil
			if err := emit(*m); err != nil {
				stop = err
				cancel()
				break
			}
			sum.add(m)
			next++
			<-slots
		}
	}
	if stop == nil && next < len(names) {
		stop = ctx.Err()
	}
	return sum, stop
}

// checkOne loads and analyses one member and makes its line, its checks
// in units sys (the file's display units when sys is the zero value). A
// model that makes Stave fail is reported in its line, so the batch goes on.
func checkOne(ctx context.Context, name string, load Load, sys units.System) (m Member) {
	defer func() {
		if r := recover(); r != nil {
			m = refused(name, "", fmt.Errorf("Stave failed on this model (an internal error, please report it with the file): %v", r))
		}
	}()
	p, err := load(name)
	if err != nil {
		return refused(name, "", err)
	}
	r := report.Request(p, nil)
	if sys.Name != "" {
		r.Checks.Units = sys
	}
	a, err := analysis.Run(ctx, r)
	if err != nil {
		return refused(name, p.Notes.Member, err)
	}
	return Line(name, p, &a)
}

// refused is the line of a member that could not be checked, the reason
// on one line.
func refused(file, mark string, err error) Member {
	return Member{File: file, Mark: mark, Status: Refused, Problem: oneLine(err.Error())}
}

// oneLine joins the lines of a message (a load error lists its problems one
// a line) with "; ".
func oneLine(s string) string {
	parts := strings.Split(strings.TrimSpace(s), "\n")
	for i, p := range parts {
		parts[i] = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(p), "- "))
	}
	return strings.Join(parts, "; ")
}
