package app

import (
	"context"
	"image/png"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// A job runs until cancelled, its result reaches the UI goroutine, and a
// runner stopped starts nothing more and drops what ends after.
func TestJobs(t *testing.T) {
	q := &uiQueue{}
	j := newJobs(q.post)
	release := make(chan struct{})
	done := false
	id := j.start("waits", func(ctx context.Context) func() {
		<-ctx.Done()
		return func() { done = true }
	})
	j.start("blocks", func(ctx context.Context) func() {
		<-release
		return func() {}
	})
	if got := strings.Join(j.names(), ", "); got != "waits, blocks" {
		t.Errorf("running %q, want \"waits, blocks\"", got)
	}
	if !j.cancel(id) {
		t.Fatal("cancel did not find the running job")
	}
	q.waitFor(t, "the cancelled job's result", func() bool { return done })
	if j.cancel(id) {
		t.Error("a finished job was cancelled again")
	}
	if j.stop(50 * time.Millisecond) {
		t.Error("stop reported every job ended while one still blocks")
	}
	close(release)
	q.waitFor(t, "the blocked job to end", func() bool { return len(j.names()) == 0 })
	q.drain()
	if len(q.funcs) != 0 {
		t.Error("a job that ended after stop posted its result")
	}
	if j.start("late", func(context.Context) func() { return nil }) != 0 || len(j.names()) != 0 {
		t.Error("a stopped runner started a job")
	}
}

// A study started from the window stops when cancelled: the status says so
// and nothing of it is applied.
func TestStudyCancelled(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	w.startAdaptive(1e-9) // far below what the element limit reaches: runs for long
	if w.study == 0 {
		t.Fatal("no study started")
	}
	w.cancelStudy()
	q.waitFor(t, "the study to stop", func() bool { return w.study == 0 })
	if !strings.Contains(w.status.Text, "cancelled") {
		t.Errorf("status %q does not say the study was cancelled", w.status.Text)
	}
	if w.adaptNodes != nil {
		t.Error("a cancelled refinement changed the mesh")
	}
	if len(w.jobs.names()) != 0 {
		t.Errorf("still running: %v", w.jobs.names())
	}
}

// Closing the window with an export running cancels it and waits for it:
// nothing runs after, no file is left half written, no dialog opens.
func TestQuitWithExportRunning(t *testing.T) {
	p := demoProject(t)
	p.Model.Mesh.Elements = 200000 // the export solves the model anew: it takes a while
	w, q := newTestWindow(t, p)
	path := filepath.Join(t.TempDir(), "drawing.png")
	w.startExport(path, "png")
	if len(w.jobs.names()) != 1 {
		t.Fatalf("running %v, want the export", w.jobs.names())
	}
	w.shutdown()
	if n := w.jobs.names(); len(n) != 0 {
		t.Errorf("still running after the window closed: %v", n)
	}
	q.drain()
	// The export may have finished before the window closed (the machine
	// decides); then its file must be whole. Cancelled, it writes nothing.
	if f, err := os.Open(path); err == nil {
		defer f.Close()
		if _, err := png.Decode(f); err != nil {
			t.Errorf("the export left %s half written: %v", path, err)
		}
	} else if !os.IsNotExist(err) {
		t.Errorf("the export left %s unreadable: %v", path, err)
	}
	if top := w.win.Canvas().Overlays().Top(); top != nil {
		t.Error("a dialog opened after the window closed")
	}
}
