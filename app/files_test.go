package app

import (
	"bytes"
	"context"
	"errors"
	"io"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/storage"
)

// TestSaveMarksTitleAndReopens saves, edits (the title shows unsaved
// changes), and opens the saved file again.
func TestSaveMarksTitleAndReopens(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	path := filepath.Join(t.TempDir(), "joist.json")
	w.writeProject(path, nil)
	if title := w.win.Title(); title != "Stave — joist.json" {
		t.Fatalf("title after saving is %q", title)
	}
	x0 := w.Model().PointLoads[0].X
	w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
	if title := w.win.Title(); !strings.HasSuffix(title, "•") {
		t.Errorf("title after an edit is %q, want a mark for unsaved changes", title)
	}
	w.undo()
	if title := w.win.Title(); strings.HasSuffix(title, "•") {
		t.Errorf("title after undoing back to the saved state is %q", title)
	}
	w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
	w.openPath(path)
	if got := w.Model().PointLoads[0].X; got != x0 {
		t.Errorf("reopened file has the load at %g m, want %g m", got, x0)
	}
	if len(w.hist.done) != 0 {
		t.Errorf("opening a file kept %d undo steps of the previous project", len(w.hist.done))
	}
	solved(t, w, q)
}

// A member that does not validate is still saved, so no work is lost, and
// the window says the file will not open until it is fixed.
func TestSaveWarnsWhenTheFileWouldNotOpen(t *testing.T) {
	p := demoProject(t)
	p.Model.Supports[1].X = 9 // beyond the 5.5 m member
	w, _ := newTestWindow(t, p)
	path := filepath.Join(t.TempDir(), "draft.json")
	w.writeProject(path, nil)
	if _, err := os.Stat(path); err != nil {
		t.Fatalf("the member was not saved: %v", err)
	}
	if got := w.status.Text; !strings.Contains(got, "will not open again") {
		t.Errorf("status after saving an invalid member is %q", got)
	}
	if _, err := storage.Load(path); err == nil {
		t.Errorf("the saved draft loads; the test needs a member that does not validate")
	}
	// Saved on the way to closing or opening another member, the next step
	// waits for the user: the warning must not vanish with the window.
	ran := false
	w.writeProject(path, func() { ran = true })
	if ran {
		t.Fatal("the next step ran while the warning that the file will not open was showing")
	}
	_, _, buttons, _ := dialogWidgets(t, w)
	test.Tap(buttonNamed(t, buttons, "Go on anyway"))
	if !ran {
		t.Error("going on from the warning did not run the next step")
	}
	// A valid member saves without the warning, and goes straight on.
	w.project = *demoProject(t)
	ran = false
	w.writeProject(path, func() { ran = true })
	if got := w.status.Text; strings.Contains(got, "will not open") || !ran {
		t.Errorf("status after saving a valid member is %q; next step ran: %v", got, ran)
	}
}

// TestExports writes every product through the window's path, and checks
// each starts the way its format requires.
func TestExports(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	dir := t.TempDir()
	starts := map[string]string{"png": "\x89PNG", "svg": "<?xml", "pdf": "%PDF", "sheet-pdf": "%PDF", "sheet-png": "\x89PNG", "csv": "# Stave results."}
	for _, p := range report.Products {
		path := filepath.Join(dir, p.Name+"."+p.Ext)
		if err := w.writeExport(context.Background(), path, w.exportSource(), p.Name); err != nil {
			t.Errorf("window export %s: %v", p.Name, err)
			continue
		}
		data, err := os.ReadFile(path)
		if err != nil || !bytes.HasPrefix(data, []byte(starts[p.Name])) {
			t.Errorf("window export %s starts with %q, want %q", p.Name, data[:min(len(data), 8)], starts[p.Name])
		}
	}
}

// TestChecksShowFreeMotionAndHighlight: a member on one roller can move;
// the checks list says so. Selecting a check with a place highlights it.
func TestChecksShowFreeMotionAndHighlight(t *testing.T) {
	p := &storage.Project{View: storage.DefaultView(), Model: newMember(4)}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Roller}}
	w, q := newTestWindow(t, p)
	finished(t, w, q)
	if len(w.checks) == 0 || w.checks[0].Status != "FAIL" || !strings.HasPrefix(w.checks[0].Name, "free motion") {
		t.Fatalf("checks of a member on one roller: %+v", w.checks)
	}
	if !w.sceneInput().Unreliable {
		t.Error("results of a mechanism are not marked unreliable")
	}

	w.apply("add a pinned support", func(m *fem.Model) error { addSupport(m, fem.Pinned, 4); return nil })
	solved(t, w, q)
	for i, r := range w.checks {
		if r.Span != [2]float64{} {
			w.selectCheck(i)
			if w.sceneInput().Highlight != r.Span {
				t.Errorf("selecting check %q highlights %v, want %v", r.Name, w.sceneInput().Highlight, r.Span)
			}
			return
		}
	}
	t.Errorf("no check of a loaded simply supported member names a place: %+v", w.checks)
}

// TestStartWithoutFileOpensTheDemo: with no file the window opens the
// built-in demo wherever the program was started from.
func TestStartWithoutFileOpensTheDemo(t *testing.T) {
	t.Chdir(t.TempDir())
	o, err := startProject("")
	if err != nil || o.problem != "" {
		t.Fatalf("startProject(\"\") in an empty folder: %v, %q", err, o.problem)
	}
	want, _ := storage.Demo()
	if o.project.Notes != want.Notes || len(o.project.Model.Supports) != len(want.Model.Supports) {
		t.Errorf("started on %+v, want the demo %+v", o.project.Notes, want.Notes)
	}
}

// TestDesignFailureIsNotUnreliable: a member too weak for its allowable stress
// fails a design check, which is marked on the drawing, but the numbers
// themselves are sound and must not be flagged as unreliable; clicking the
// marker selects the check.
func TestDesignFailureIsNotUnreliable(t *testing.T) {
	p := &storage.Project{View: storage.DefaultView(), Model: newMember(4)}
	p.Model.Segments[0].Material.Allowable = 1e3 // 1 kPa: any load fails it
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}
	p.Model.PointLoads = []fem.PointLoad{{X: 2, Transverse: -1e4}}
	w, q := newTestWindow(t, p)
	solved(t, w, q)
	failed := -1
	for i, r := range w.checks {
		if r.Status == "FAIL" && strings.HasPrefix(r.Name, "Stress") {
			failed = i
		}
	}
	if failed < 0 {
		t.Fatalf("no failed stress check: %+v", w.checks)
	}
	in := w.sceneInput()
	if in.Unreliable {
		t.Error("a failed design check marks the results unreliable")
	}
	var mark *canvas.Mark
	for i := range in.Marks {
		if in.Marks[i].Index == failed {
			mark = &in.Marks[i]
		}
	}
	if mark == nil || !mark.Severe {
		t.Fatalf("failed stress check has no severe marker: %+v", in.Marks)
	}
	w.selectItem(canvas.Ref{Kind: canvas.CheckMark, Index: failed})
	if w.sceneInput().Highlight != w.checks[failed].Span {
		t.Errorf("clicking the marker highlights %v, want the check's place %v", w.sceneInput().Highlight, w.checks[failed].Span)
	}
}

// newRecoveringWindow is a test window that keeps its autosave in dir; the
// test calls autosave itself instead of waiting for the timer.
func newRecoveringWindow(t *testing.T, p *storage.Project, dir string) (*Window, *uiQueue) {
	t.Helper()
	a := test.NewApp()
	q := &uiQueue{}
	w := newWindow(a, p, "", options{post: q.post, recoveryDir: dir})
	w.win.Show()
	t.Cleanup(func() { w.solver.stop(); w.jobs.stop(quitWait); a.Quit() })
	return w, q
}

// Every question about unsaved work offers Save, Discard changes and
// Cancel; Cancel keeps the work, the window and its autosave.
func TestUnsavedChangesCanBeCancelled(t *testing.T) {
	for _, c := range []struct {
		name   string
		action func(w *Window)
	}{
		{"New", func(w *Window) { w.newProject() }},
		{"Open", func(w *Window) { w.openDialog() }},
		{"Quit", func(w *Window) { w.closeRequested() }},
	} {
		dir := t.TempDir()
		w, _ := newRecoveringWindow(t, demoProject(t), dir)
		closed := false
		w.win.SetOnClosed(func() { closed = true })
		w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
		edited := w.Model()
		w.autosave()
		c.action(w)
		_, _, buttons, _ := dialogWidgets(t, w)
		for _, b := range []string{"Save", "Discard changes", "Cancel"} {
			buttonNamed(t, buttons, b)
		}
		test.Tap(buttonNamed(t, buttons, "Cancel"))
		if closed || !reflect.DeepEqual(w.Model(), edited) || !w.dirty() || w.win.Canvas().Overlays().Top() != nil {
			t.Errorf("%s, Cancel: window closed %v, model kept %v, unsaved %v", c.name, closed, reflect.DeepEqual(w.Model(), edited), w.dirty())
		}
		if r, err := storage.FindRecovery(dir); r == nil || err != nil {
			t.Errorf("%s, Cancel: the autosave of the work is gone (%v)", c.name, err)
		}
	}
}

// Work the user discards is not offered again at the next start; work
// cancelled, kept or left by a crash is.
func TestRecoveryOffersOnlyKeptWork(t *testing.T) {
	dir := t.TempDir()
	sketch := &storage.Project{View: storage.DefaultView(), Model: newMember(4)}
	w, _ := newRecoveringWindow(t, sketch, dir)
	w.apply("add a support", func(m *fem.Model) error { addSupport(m, fem.Pinned, 0); return nil })
	w.autosave()
	if r, _ := storage.FindRecovery(dir); r == nil {
		t.Fatal("the unsaved sketch was not autosaved")
	}
	// Discard it for a new member, then open another file: the window is
	// clean, so its autosave must be gone for good.
	w.newProject()
	_, _, buttons, _ := dialogWidgets(t, w)
	test.Tap(buttonNamed(t, buttons, "Discard changes"))
	path := filepath.Join(t.TempDir(), "other.json")
	if err := storage.Save(path, demoProject(t)); err != nil {
		t.Fatal(err)
	}
	w.openPath(path)
	w.autosave()
	if r, err := storage.FindRecovery(dir); r != nil || err != nil {
		t.Fatalf("after Discard changes the autosave still holds %d supports (%v)", len(r.Project.Model.Supports), err)
	}
	next, _ := newRecoveringWindow(t, demoProject(t), dir)
	next.offerRecovery()
	if next.win.Canvas().Overlays().Top() != nil {
		t.Error("the next start offers to restore discarded work")
	}

	// Undoing back to the saved state takes the autosave away too.
	w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
	w.autosave()
	w.undo()
	w.autosave()
	if r, _ := storage.FindRecovery(dir); r != nil {
		t.Error("an autosave of no unsaved changes is left behind")
	}
}

// The recovery question: Not now keeps the copy for the next start (and
// the window does not autosave over it), Discard deletes it, Restore
// shows the work as unsaved changes. Escape answers as Not now does.
func TestRecoveryQuestion(t *testing.T) {
	kept := demoProject(t)
	kept.Model.PointLoads[0].X = 1.25
	for _, c := range []struct {
		answer   string
		wantFile bool
		wantX    float64 // the load's x in the window afterwards
	}{
		{"Not now", true, 4.2},
		{"Escape", true, 4.2},
		{"Discard", false, 4.2},
		{"Restore", true, 1.25},
	} {
		dir := t.TempDir()
		if err := storage.WriteRecovery(dir, kept, ""); err != nil {
			t.Fatal(err)
		}
		w, _ := newRecoveringWindow(t, demoProject(t), dir)
		w.offerRecovery()
		_, _, buttons, _ := dialogWidgets(t, w)
		buttonNamed(t, buttons, "Save as…")
		if c.answer == "Escape" {
			typeKey(w, fyne.KeyEscape)
		} else {
			test.Tap(buttonNamed(t, buttons, c.answer))
		}
		if got := w.Model().PointLoads[0].X; got != c.wantX {
			t.Errorf("%s: the load is at %g m, want %g m", c.answer, got, c.wantX)
		}
		if c.answer == "Restore" && !w.dirty() {
			t.Error("restored work shows as saved")
		}
		if r, _ := storage.FindRecovery(dir); (r != nil) != c.wantFile {
			t.Errorf("%s: an autosave is there: %v, want %v", c.answer, r != nil, c.wantFile)
		}
		w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X = 2; return nil })
		w.autosave()
		r, _ := storage.FindRecovery(dir)
		if r == nil {
			t.Errorf("%s: unsaved work after the answer is not autosaved", c.answer)
		} else if want := map[bool]float64{true: 1.25, false: 2}[c.answer == "Not now" || c.answer == "Escape"]; r.Project.Model.PointLoads[0].X != want {
			t.Errorf("%s: the autosave has the load at %g m, want %g m", c.answer, r.Project.Model.PointLoads[0].X, want)
		}
	}
}

// A file that cannot be opened is named once in the message, with the
// place in it; the message does not wrap storage's own.
func TestOpenErrorNamesTheFileOnce(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	path := filepath.Join(t.TempDir(), "broken.json")
	p := demoProject(t)
	p.Model.Segments[0].Material.Name = "bell\a"
	if err := storage.Save(path, p); err != nil {
		t.Fatal(err)
	}
	w.openPath(path)
	_, _, _, labels := dialogWidgets(t, w)
	var text string
	for _, l := range labels {
		text += l.Text + "\n"
	}
	if n := strings.Count(text, path); n != 1 {
		t.Errorf("the message names the file %d times:\n%s", n, text)
	}
	if !strings.Contains(text, "member.segments[0].material.name") || strings.Contains(text, "cannot open") {
		t.Errorf("the message does not name the place once, plainly:\n%s", text)
	}
}

// With no file the window shows the demo under the demo's name; New makes
// an untitled member.
func TestDemoTitle(t *testing.T) {
	t.Chdir(t.TempDir())
	o, err := startProject("")
	if err != nil || !o.demo {
		t.Fatalf("startProject(\"\"): demo %v, %v", o.demo, err)
	}
	w, _ := newTestWindow(t, o.project)
	w.startedOn(o)
	if got := w.win.Title(); !strings.Contains(got, demoTitle) {
		t.Errorf("title of the demo is %q", got)
	}
	w.newProject()
	if got := w.win.Title(); !strings.Contains(got, "untitled") {
		t.Errorf("title of a new member is %q", got)
	}
}

// An export that fails half way leaves the previous file as it was, and
// no file where there was none.
func TestWriteFileFailingHalfWay(t *testing.T) {
	dir := t.TempDir()
	fail := func(w io.Writer) error {
		if _, err := w.Write([]byte("half a picture")); err != nil {
			return err
		}
		return errors.New("the drawing failed")
	}
	fresh := filepath.Join(dir, "new.png")
	if err := writeFile(fresh, fail); err == nil {
		t.Fatal("a failed export reported no error")
	}
	if _, err := os.Stat(fresh); !os.IsNotExist(err) {
		t.Errorf("a failed export left %s behind (%v)", fresh, err)
	}
	old := filepath.Join(dir, "old.png")
	if err := os.WriteFile(old, []byte("the previous picture"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := writeFile(old, fail); err == nil {
		t.Fatal("a failed export reported no error")
	}
	if b, err := os.ReadFile(old); err != nil || string(b) != "the previous picture" {
		t.Errorf("the previous file reads %q (%v) after a failed export", b, err)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("%d files in the folder after the failed exports, want only the previous one", len(entries))
	}
}

// An export made while the solver still works on what the window shows
// (its analysis then runs for the export) shows what the window shows:
// its request took no Show, so a case or combination chosen a moment
// before an export came out as the envelope.
func TestExportWhileSolvingShowsWhatIsShown(t *testing.T) {
	p, err := storage.Load(filepath.Join("..", "testdata", "two_span_cases.json"))
	if err != nil {
		t.Fatal(err)
	}
	w, q := newTestWindow(t, p)
	finished(t, w, q)
	want := analysis.Show{Kind: analysis.ShowCase, Index: 1}
	w.setShow(want) // not delivered until the queue is drained
	e := w.exportSource()
	if e.pending == nil {
		t.Fatal("the export took the analysis of what was shown before")
	}
	src, err := e.finish(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	if got := src.Analysis.Cases.Show; got != want {
		t.Errorf("the export shows %s, the window %s", got.Title(&p.Model), want.Title(&p.Model))
	}
}
