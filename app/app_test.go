package app

import (
	"context"
	"fmt"
	"math"
	"runtime"
	"slices"
	"sync"
	"testing"
	"time"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// uiQueue stands in for fyne.Do: the solver posts results here and the test
// goroutine, playing the UI goroutine, runs them while it waits.
type uiQueue struct {
	mu    sync.Mutex
	funcs []func()
}

func (q *uiQueue) post(f func()) {
	q.mu.Lock()
	q.funcs = append(q.funcs, f)
	q.mu.Unlock()
}

func (q *uiQueue) drain() {
	q.mu.Lock()
	fs := q.funcs
	q.funcs = nil
	q.mu.Unlock()
	for _, f := range fs {
		f()
	}
}

// waitFor runs posted UI work until cond holds, failing after a generous
// bound so a lost result shows as a failure, not a hang.
func (q *uiQueue) waitFor(t testing.TB, what string, cond func() bool) {
	t.Helper()
	deadline := time.Now().Add(60 * time.Second)
	for !cond() {
		if time.Now().After(deadline) {
			t.Fatalf("timed out waiting for %s", what)
		}
		q.drain()
		time.Sleep(2 * time.Millisecond)
	}
}

func newTestWindow(t testing.TB, p *storage.Project) (*Window, *uiQueue) {
	t.Helper()
	a := test.NewApp()
	q := &uiQueue{}
	w := newWindow(a, p, "", options{post: q.post})
	w.win.Resize(fyne.NewSize(1280, 800))
	w.win.Show()
	t.Cleanup(func() { w.solver.stop(); w.jobs.stop(quitWait); a.Quit() })
	return w, q
}

// finished waits until both stages of the current model's analysis are shown.
func finished(t testing.TB, w *Window, q *uiQueue) {
	t.Helper()
	q.waitFor(t, "the solver", func() bool { return w.result != nil && w.result.seq == w.pending && w.result.Complete })
}

// solved waits until the current model has all its results.
func solved(t testing.TB, w *Window, q *uiQueue) *fem.Solution {
	t.Helper()
	finished(t, w, q)
	if w.result.Solution == nil {
		t.Fatalf("no solution: %v", w.result.Err)
	}
	return w.result.Solution
}

// drag presses at from, moves to to in steps, and releases, as the window
// system would.
func drag(d *drawing, from, to fyne.Position, steps int) {
	d.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: from}, Button: desktop.MouseButtonPrimary})
	prev := from
	for i := 1; i <= steps; i++ {
		f := float32(i) / float32(steps)
		p := fyne.NewPos(from.X+(to.X-from.X)*f, from.Y+(to.Y-from.Y)*f)
		d.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: p}, Dragged: fyne.NewDelta(p.X-prev.X, p.Y-prev.Y)})
		prev = p
	}
	d.DragEnd()
	d.MouseUp(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: to}, Button: desktop.MouseButtonPrimary})
}

func click(d *drawing, p fyne.Position) {
	d.lastTap = time.Time{} // never a double click
	d.Tapped(&fyne.PointEvent{Position: p})
}

func handle(t testing.TB, d *drawing, r canvas.Ref) fyne.Position {
	t.Helper()
	for _, h := range d.scene.Handles {
		if h.Ref == r {
			return fyne.NewPos(h.Points[0].X, h.Points[0].Y)
		}
	}
	t.Fatalf("no handle for %v in the scene", r)
	return fyne.Position{}
}

// TestSketchAMember draws a member, supports it, loads it, and checks the
// solved reactions, then undoes and redoes the last step.
func TestSketchAMember(t *testing.T) {
	w, q := newTestWindow(t, nil)
	d := w.draw
	w.setTool(toolMember)
	y := d.scene.MemberY
	drag(d, fyne.NewPos(100, y), fyne.NewPos(500, y), 10)
	m := w.Model()
	if len(m.Segments) != 1 || !(m.Length() > 0) {
		t.Fatalf("after dragging a member: %d segments, length %g m", len(m.Segments), m.Length())
	}
	L := m.Length()
	if len(w.hist.done) != 1 {
		t.Fatalf("the member drag made %d undo steps, want 1", len(w.hist.done))
	}

	w.kind = fem.Pinned
	w.setTool(toolSupport)
	click(d, fyne.NewPos(d.view.ToScreenX(0), d.scene.MemberY))
	w.kind = fem.Roller
	click(d, fyne.NewPos(d.view.ToScreenX(L), d.scene.MemberY))
	w.setTool(toolForce)
	click(d, fyne.NewPos(d.view.ToScreenX(L/4), d.scene.MemberY))
	m = w.Model()
	if len(m.Supports) != 2 || len(m.PointLoads) != 1 {
		t.Fatalf("want 2 supports and 1 point load, got %d and %d", len(m.Supports), len(m.PointLoads))
	}
	a := m.PointLoads[0].X
	s := solved(t, w, q)
	// Simply supported beam, point load P at a: reactions P(L−a)/L and P·a/L.
	// Source: statics (Gere & Goodno, Mechanics of Materials), from memory.
	P := -m.PointLoads[0].Transverse
	want := []float64{P * (L - a) / L, P * a / L}
	for i, r := range s.Reactions {
		if math.Abs(r.Force[1]-want[r.Support]) > 1e-6*P {
			t.Errorf("reaction %d = %g N, want %g N", i, r.Force[1], want[r.Support])
		}
	}

	w.undo()
	if len(w.Model().PointLoads) != 0 {
		t.Fatalf("undo left %d point loads", len(w.Model().PointLoads))
	}
	s = solved(t, w, q)
	if len(s.Reactions) != 2 || math.Abs(s.Reactions[0].Force[1]) > 1e-9 {
		t.Errorf("after undo the unloaded beam has reactions %v", s.Reactions)
	}
	w.redo()
	if len(w.Model().PointLoads) != 1 || w.Model().PointLoads[0].X != a {
		t.Fatalf("redo did not restore the force at x = %g m: %+v", a, w.Model().PointLoads)
	}
	solved(t, w, q)
}

func demoProject(t testing.TB) *storage.Project {
	t.Helper()
	p, err := storage.Demo()
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestDragLoadHandle drags the right end of a uniform load up: the load
// becomes trapezoidal, the results change, and one undo restores it.
func TestDragLoadHandle(t *testing.T) {
	p := &storage.Project{View: storage.DefaultView(), Model: newMember(6)}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}}
	w, q := newTestWindow(t, p)
	d := w.draw
	w.setTool(toolLineLoad)
	drag(d, fyne.NewPos(d.view.ToScreenX(1), d.scene.MemberY), fyne.NewPos(d.view.ToScreenX(5), d.scene.MemberY), 8)
	m := w.Model()
	if len(m.DistributedLoad) != 1 {
		t.Fatalf("line load drag made %d loads", len(m.DistributedLoad))
	}
	pts := m.DistributedLoad[0].Points
	if math.Abs(pts[0].X-1) > 0.05 || math.Abs(pts[1].X-5) > 0.05 {
		t.Fatalf("line load spans %g..%g m, want about 1..5 m", pts[0].X, pts[1].X)
	}
	before := solved(t, w, q).Reactions
	uniform := w.Model()

	w.setTool(toolPick)
	right := canvas.Ref{Kind: canvas.LoadVertex, Index: 0, Vertex: 1}
	h := handle(t, d, right)
	drag(d, h, h.Add(fyne.NewPos(0, -30)), 6)
	m = w.Model()
	pts = m.DistributedLoad[0].Points
	if pts[1].Intensity == pts[0].Intensity || pts[1].X != uniform.DistributedLoad[0].Points[1].X {
		t.Fatalf("dragging the right handle up gave %+v; want a changed right intensity at the same x", pts)
	}
	after := solved(t, w, q).Reactions
	if after[1].Force[1] == before[1].Force[1] {
		t.Errorf("the right reaction did not change: %g N", after[1].Force[1])
	}
	w.undo()
	if got := w.Model().DistributedLoad[0].Points[1].Intensity; got != uniform.DistributedLoad[0].Points[1].Intensity {
		t.Errorf("one undo after the drag gave intensity %g, want %g", got, uniform.DistributedLoad[0].Points[1].Intensity)
	}
}

// TestBadValueLeavesModel types values that do not parse or do not
// validate into the properties panel; the model must not change.
func TestBadValueLeavesModel(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 0})
	before := w.Model()
	var entries []*escEntry
	for _, o := range test.LaidOutObjects(w.ui.properties) {
		if e, ok := o.(*escEntry); ok {
			entries = append(entries, e)
		}
	}
	if len(entries) == 0 {
		t.Fatal("no entries in the properties panel of a support")
	}
	for _, text := range []string{"twelve", "3 kN", "-40 m"} {
		test.Type(entries[0], "")
		entries[0].SetText(text)
		entries[0].OnSubmitted(text)
		if got := w.Model(); got.Supports[0].X != before.Supports[0].X {
			t.Errorf("typing %q moved the support to %g m", text, got.Supports[0].X)
		}
	}
	entries[0].SetText("0.5 m")
	entries[0].OnSubmitted("0.5 m")
	if got := w.Model().Supports[0].X; got != 0.5 {
		t.Errorf("typing 0.5 m put the support at %g m", got)
	}
}

// TestManyEditsLatestWins pushes thousands of edits through the solver as
// fast as they come: the last result shown must belong to the last edit, and
// memory must not grow with the number of edits.
func TestManyEditsLatestWins(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	var ms runtime.MemStats
	measure := func() uint64 {
		runtime.GC()
		runtime.ReadMemStats(&ms)
		return ms.HeapAlloc
	}
	start := measure()
	const edits = 3000
	for i := 1; i <= edits; i++ {
		f := -1000 * float64(i)
		w.apply("change the load", func(m *fem.Model) error { m.PointLoads[0].Transverse = f; return nil })
		if i%97 == 0 {
			q.drain() // the UI goroutine gets to run now and then, as it would
		}
	}
	solved(t, w, q)
	if w.result.seq != w.pending {
		t.Fatalf("shown result %d, last edit %d", w.result.seq, w.pending)
	}
	if got := w.result.Model.PointLoads[0].Transverse; got != -1000*edits {
		t.Fatalf("shown result is for a load of %g N, want %g N", got, -1000.0*edits)
	}
	// Bound: the undo stack keeps at most maxHistory models of a few kB
	// each; 50 MB is far above that and far below 3000 kept solutions.
	grown := int64(measure()) - int64(start)
	t.Logf("heap after GC grew by %.1f MB over %d edits", float64(grown)/(1<<20), edits)
	if grown > 50<<20 {
		t.Errorf("heap grew by %d MB over %d edits", grown>>20, edits)
	}
}

// benchmarkElements is the mesh of the interactive budget (issue 8): one
// edit, its solve and the scene rebuilt within a median of 4 ms.
const benchmarkElements = 10000

// benchmarkProject is the demo at benchmarkElements elements.
func benchmarkProject(b *testing.B) *storage.Project {
	p := demoProject(b)
	p.Model.Mesh.Elements = benchmarkElements
	return p
}

// reportMedian reports the median of times in milliseconds: single slow
// iterations (garbage collection, other processes) do not move it.
func reportMedian(b *testing.B, times []time.Duration) {
	slices.Sort(times)
	b.ReportMetric(float64(times[len(times)/2])/float64(time.Millisecond), "median-ms")
}

// BenchmarkEditSolveScene measures what a drag costs per mouse event at
// 10,000 elements: the edit (a copy of the model with a load moved), the
// finite element solve, and the drawing's scene built from the result.
func BenchmarkEditSolveScene(b *testing.B) {
	p := benchmarkProject(b)
	m := p.Model
	view := canvas.NewView(1000, 600)
	view.Fit(&m)
	times := make([]time.Duration, 0, b.N)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		start := time.Now()
		p.Model = m.Clone()
		p.Model.PointLoads[0].X += 1e-3 * float64(i%100)
		a, _ := analysis.Solve(context.Background(), analysis.Request{Model: p.Model})
		if a.Solution == nil {
			b.Fatal(a.Err)
		}
		canvas.Build(report.Input(report.NewSource(p, &a)), view)
		times = append(times, time.Since(start))
	}
	reportMedian(b, times)
}

// BenchmarkFinishStage measures the second stage at 10,000 elements: the
// exact solution and the checks, which run once edits pause.
func BenchmarkFinishStage(b *testing.B) {
	p := benchmarkProject(b)
	r := analysis.Request{Model: p.Model, Checks: report.CheckOptions(p.View, units.SI)}
	a, _ := analysis.Solve(context.Background(), r)
	if a.Solution == nil {
		b.Fatal(a.Err)
	}
	times := make([]time.Duration, 0, b.N)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		start := time.Now()
		full, _ := analysis.Finish(context.Background(), r, a)
		if full.Exact == nil || len(full.Checks) == 0 {
			b.Fatalf("second stage found no exact solution (%v) or no checks", full.ExactErr)
		}
		times = append(times, time.Since(start))
	}
	reportMedian(b, times)
}

// TestUnitSwitchRoundsTheSnapStep: 0.1 m becomes 0.25 ft (3 in, the round
// step nearest 0.3281 ft) and back to 0.1 m.
func TestUnitSwitchRoundsTheSnapStep(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.project.View.GridStep = 0.1
	w.setUnits(units.USCustomary)
	if got, want := w.project.View.GridStep, 0.25*0.3048; math.Abs(got-want) > 1e-12 { // 1 ft = 0.3048 m, NIST SP 811
		t.Errorf("snap step in US units %g m, want %g m (0.25 ft)", got, want)
	}
	w.setUnits(units.SI)
	if got := w.project.View.GridStep; math.Abs(got-0.1) > 1e-12 {
		t.Errorf("snap step back in SI %g m, want 0.1 m", got)
	}
}

// BenchmarkChecksList measures showing the checks of a member with many
// spans for the first time, a row each: with the rows added one by one the
// list laid itself out on every one, and 2,000 rows took 2.9 s.
func BenchmarkChecksList(b *testing.B) {
	for _, n := range []int{200, 2000} {
		checks := make([]analysis.Finding, n)
		for i := range checks {
			checks[i] = analysis.Finding{Status: "within limit", Name: fmt.Sprintf("Deflection, span %d", i+1)}
		}
		b.Run(fmt.Sprintf("checks=%d", n), func(b *testing.B) {
			for b.Loop() {
				b.StopTimer()
				w, _ := newTestWindow(b, demoProject(b))
				w.checks = checks
				b.StartTimer()
				w.ui.checks.show()
			}
		})
	}
}
