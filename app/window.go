package app

import (
	"fmt"
	"math"
	"path/filepath"
	"reflect"
	"strconv"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// caution is shown in the status line at all times.
const caution = fem.Caution

// The size a window opens at: it fits a screen of 1280 × 720 pixels, the
// smallest the layout is made for; a larger screen can maximize it.
const (
	startWidth  = 1280
	startHeight = 720
)

// Titles of projects that have no file.
const (
	untitled  = "untitled"
	demoTitle = "Demo member (invented scenario)"
)

// Window is one sketch-and-solve window on one project.
type Window struct {
	app fyne.App
	win fyne.Window

	project storage.Project // the live project; Model is replaced, never changed in place
	saved   storage.Project // the project as last opened or saved, to tell unsaved changes
	path    string          // file of the project; "" until saved
	// name is the title of a project with no file: "untitled", or what
	// the window was started on (the demo).
	name string

	hist     history
	solver   *solver
	post     func(func())
	pending  uint64             // sequence number of the newest model sent to the solver
	result   *result            // newest delivered analysis; nil before the first
	checks   []analysis.Finding // the findings of result
	selected canvas.Ref
	tool     tool
	kind     fem.SupportKind // support kind the support tool places
	// dimensions switches the dimension lines and the scale bar: a switch
	// of the window only, which files do not keep (exports draw them).
	dimensions bool
	units      units.System
	// highlight is the x range of the selected check, m.
	highlight [2]float64
	// adaptNodes is the mesh of the last adaptive refinement, solved on
	// until the model changes; nil for the uniform mesh of Mesh.Elements.
	adaptNodes []float64
	// convergence is the last convergence study, for its chart export; nil before one runs.
	convergence *convergenceStudy
	study       int // the job number of the study running in the background; 0 for none
	jobs        *jobs
	// note is added to the next status message, which may come from the
	// caller of the function that set it (the name of an edit, say).
	note string
	// editCase is the load case being edited, and show what the analysis
	// shows of a model with cases (cases.go).
	editCase int
	show     analysis.Show

	draw   *drawing
	ui     *controls
	status *statusLine

	recoveryDir  string
	stopAutosave func()
	// autosaved reports that the recovery folder holds this window's
	// unsaved work (and not a previous run's, still to be offered).
	autosaved bool
	// earlierKept reports that the user kept a previous run's autosave for
	// the next start: this window does not autosave over it.
	earlierKept bool
	// moving is the moving-loads window (train.go) while it is open.
	moving *movingWindow
	// dialogs are the dialogs open on the window, for Escape (escape.go).
	dialogs dialogStack
}

// options are the parts of a window that tests replace.
type options struct {
	post        func(func()) // how results reach the UI goroutine
	recoveryDir string       // "" disables autosave and recovery
	autosave    bool
}

// NewWindow opens a window on p (a new empty project when p is nil); path is
// the file p came from, or "".
func NewWindow(a fyne.App, p *storage.Project, path string) *Window {
	return newWindow(a, p, path, options{post: fyne.Do, recoveryDir: defaultRecoveryDir(), autosave: true})
}

func newWindow(a fyne.App, p *storage.Project, path string, o options) *Window {
	w := &Window{app: a, post: o.post, recoveryDir: o.recoveryDir, path: path, name: untitled, kind: fem.Pinned}
	if p == nil {
		p = &storage.Project{View: storage.DefaultView()}
	}
	w.project = cloneProject(*p)
	w.project.Model = w.project.Model.CaseLifted(0)
	w.saved = cloneProject(*p)
	w.units = report.UnitSystem(w.project.View.Units)
	w.dimensions = true
	w.jobs = newJobs(w.post)
	w.win = a.NewWindow("Stave")
	w.draw = newDrawing(w)
	w.solver = newSolver(analysisStages, w.post, w.deliver)
	w.build()
	w.win.Resize(fyne.NewSize(startWidth, startHeight))
	w.win.SetCloseIntercept(w.closeRequested)
	w.draw.fit()
	w.setModel(w.project.Model)
	if o.autosave && w.recoveryDir != "" {
		w.startAutosave()
	}
	return w
}

// Show shows the window.
//
// The window is created under the plain title "Stave": the desktop's window
// manager takes the window's class from its first title, and the menu entry
// the Linux package installs (StartupWMClass=Stave) finds its windows by it.
func (w *Window) Show() {
	title := w.win.Title()
	w.win.SetTitle("Stave")
	w.win.Show()
	w.win.SetTitle(title)
}

// Model returns the current model, every load in its case (not to be
// changed by the caller).
func (w *Window) Model() fem.Model { return w.canonicalModel() }

// cloneProject copies p so the copy shares no slices with p.
func cloneProject(p storage.Project) storage.Project {
	c := p
	c.Model = p.Model.Clone()
	c.LoadOrder = append([]storage.LoadKind(nil), p.LoadOrder...)
	c.CaseLoadOrder = append([][]storage.LoadKind(nil), p.CaseLoadOrder...)
	c.Trains = moving.CloneTrains(p.Trains)
	return c
}

// dirty reports unsaved changes.
func (w *Window) dirty() bool {
	return !reflect.DeepEqual(w.canonical(), w.saved)
}

func (w *Window) updateTitle() {
	name := w.name
	if w.path != "" {
		name = filepath.Base(w.path)
	}
	mark := ""
	if w.dirty() {
		mark = " •"
	}
	w.win.SetTitle("Stave — " + name + mark)
}

// setStatus shows a message beside the caution, followed by a pending note.
func (w *Window) setStatus(format string, args ...any) {
	w.status.at = canvas.Ref{}
	w.status.SetText(fmt.Sprintf(format, args...) + w.note)
	w.note = ""
}

// validate accepts an empty sketch and otherwise asks fem, whose messages
// quote values in u, the units the window shows.
func validate(m *fem.Model, u units.System) error {
	if len(m.Segments) == 0 {
		return nil
	}
	return m.ValidateIn(u)
}

// apply runs change on a copy of the model and, when the result is a valid
// model, makes it current as one undoable edit. A failing change leaves the
// model as it was and says why in the status line.
func (w *Window) apply(name string, change func(m *fem.Model) error) error {
	cand := w.project.Model.Clone()
	editing, selected := w.editCase, w.selected // a change of the cases may edit another
	if err := change(&cand); err != nil {
		w.setStatus("%s: %v", name, err)
		return err
	}
	if err := w.validate(&cand); err != nil {
		w.setStatus("%s not applied: %v", name, err)
		w.status.locate(err, &cand)
		return err
	}
	before := w.project.Model
	w.setModel(cand)
	w.hist.push(edit{name: name, before: lowerCase(before, editing), after: w.canonicalModel(), selected: selected, editCase: editing})
	w.refitIfLengthChanged(before)
	w.setStatus("%s", name)
	return nil
}

// refitIfLengthChanged fits the view to the member when its length is no
// longer what it was in before: a member much longer or shorter than the
// view would run off the drawing or fill a corner of it.
func (w *Window) refitIfLengthChanged(before fem.Model) {
	if before.Length() != w.project.Model.Length() {
		w.draw.fit()
	}
}

// setModel makes m current and sends it to the solver; m must not be changed
// afterwards. A new model drops an adaptive mesh, which was refined for the old one.
func (w *Window) setModel(m fem.Model) {
	w.project.Model = m
	dropped := w.adaptNodes != nil
	w.adaptNodes = nil
	w.resubmit()
	w.keepSelectionValid()
	w.modelChanged()
	if dropped {
		w.note = fmt.Sprintf(" — the adaptive mesh was made for the model before this edit: back to %d uniform elements", m.Mesh.Elements)
	}
}

// resubmit sends the current model to the solver again.
func (w *Window) resubmit() {
	w.solver.show, w.solver.trains = w.show, report.TrainLabels(&w.project)
	w.pending = w.solver.submit(w.canonicalModel(), w.adaptNodes, w.checkOptions())
}

// trainsChanged follows an edit of the project's trains: the title says
// there are unsaved changes, and the analysis runs again, since its
// cautions name the trains the combinations take.
func (w *Window) trainsChanged() {
	w.updateTitle()
	w.resubmit()
}

// modelChanged brings everything that shows the model up to date.
func (w *Window) modelChanged() {
	w.draw.Refresh()
	w.ui.showProperties()
	w.ui.showMesh()
	w.ui.cases.refresh()
	w.updateTitle()
	if w.moving != nil {
		w.moving.modelChanged()
	}
}

func (w *Window) undo() {
	if e, ok := w.hist.undo(); ok {
		m := w.fromHistory(e.before)
		w.reselect(&m, e.selected, e.editCase)
		w.setModel(m)
		w.refitIfLengthChanged(e.after)
		w.setStatus("undid %s", e.name)
	} else {
		w.setStatus("nothing to undo")
	}
}

func (w *Window) redo() {
	if e, ok := w.hist.redo(); ok {
		m := w.fromHistory(e.after)
		w.reselect(&m, canvas.Ref{}, -1)
		w.setModel(m)
		w.refitIfLengthChanged(e.before)
		w.setStatus("redid %s", e.name)
	} else {
		w.setStatus("nothing to redo")
	}
}

// reselect sets the selection for m, the model an undo or redo restores:
// r, the item selected when the edit was made, when m is in the editing
// form of case editCase it was selected in (the item a delete removed is
// back, and selected); else none when m has more or fewer items of the
// kind selected, whose index may then name another item.
func (w *Window) reselect(m *fem.Model, r canvas.Ref, editCase int) {
	if r.Kind != canvas.None && r.Kind != canvas.CheckMark && w.editCase == editCase {
		w.selected = r
		return
	}
	now, s := &w.project.Model, w.selected
	shifted := count(now, s.Kind) != count(m, s.Kind)
	if s.Kind == canvas.LoadVertex {
		shifted = len(now.DistributedLoad) != len(m.DistributedLoad) ||
			s.Index < len(m.DistributedLoad) && len(now.DistributedLoad[s.Index].Points) != len(m.DistributedLoad[s.Index].Points)
	}
	if shifted {
		w.selected = canvas.Ref{}
	}
}

// keepSelectionValid drops a selection whose item no longer exists.
func (w *Window) keepSelectionValid() {
	r := w.selected
	ok := true
	switch r.Kind {
	case canvas.LoadVertex:
		m := &w.project.Model
		ok = r.Index < len(m.DistributedLoad) && r.Vertex < len(m.DistributedLoad[r.Index].Points)
	case canvas.Member, canvas.MemberEnd:
		ok = len(w.project.Model.Segments) > 0
	case canvas.Element:
		ok = w.draw.nodal.on
	case canvas.None, canvas.CheckMark:
	default:
		ok = r.Index < count(&w.project.Model, r.Kind)
	}
	if !ok {
		w.selected = canvas.Ref{}
	}
}

// count is the number of items of kind k (one of the kinds a model lists:
// segments, supports, hinges, foundations, point and distributed loads) in m.
func count(m *fem.Model, k canvas.RefKind) int {
	switch k {
	case canvas.Segment:
		return len(m.Segments)
	case canvas.Support:
		return len(m.Supports)
	case canvas.Hinge:
		return len(m.Hinges)
	case canvas.Foundation:
		return len(m.Foundations)
	case canvas.PointLoad:
		return len(m.PointLoads)
	case canvas.DistributedLoad:
		return len(m.DistributedLoad)
	}
	return 0
}

func (w *Window) selectItem(r canvas.Ref) {
	if r.Kind == canvas.CheckMark {
		w.selectCheck(r.Index) // shows the check and highlights its place
		return
	}
	w.selected = r
	w.draw.Refresh()
	w.ui.showProperties()
}

func (w *Window) deleteSelected() {
	r := w.selected
	if r.Kind == canvas.None {
		w.setStatus("nothing selected to delete: click an item with the Pick tool first")
		return
	}
	if w.apply("delete "+describe(r), func(m *fem.Model) error { return remove(m, r) }) == nil {
		w.selected = canvas.Ref{}
		w.modelChanged()
	}
}

// deliver takes a finished analysis on the UI goroutine.
func (w *Window) deliver(a result) {
	if a.seq != w.pending {
		return // stale: the model changed since
	}
	w.result = &a
	w.checks = append(a.Findings(), report.UncheckedTrains(&w.project)...)
	if len(a.Model.Segments) == 0 {
		w.checks = nil // a new sketch fails nothing: the checks panel says what to do first
	}
	w.draw.Refresh() // first: the results panel reads the scene's magnification
	w.ui.showResults()
}

// checkOptions are the check limits of the project, messages in the display units.
func (w *Window) checkOptions() check.Options {
	return report.CheckOptions(w.project.View, w.units)
}

// sceneInput gathers what the drawing shows.
func (w *Window) sceneInput() canvas.Input {
	src := report.Source{Project: &w.project, Findings: w.checks, Units: w.units, Dimensions: w.dimensions}
	if w.result != nil {
		src.Analysis = &w.result.Analysis
	}
	in := report.Input(src)
	if a := w.result; a != nil && a.seq != w.pending {
		// Results of a slightly older model while the new one is solved:
		// they follow the drag smoothly and are replaced within moments.
		in.Problem, in.Unreliable = "", false
	}
	in.Selected, in.HoverX, in.Hovering, in.Highlight = w.selected, w.draw.hoverX, w.draw.hovering, w.highlight
	if m := &w.project.Model; len(m.Cases) > 0 {
		in.LoadsOf = analysis.Show{Kind: analysis.ShowCase, Index: w.editCase}.Title(m)
	}
	in.Cache, in.Handles = &w.draw.cache, true
	return in
}

// gridStep is the snapping step, m: the user's grid, or with none a round
// step of about ten pixels so dragged positions come out as tidy numbers.
func (w *Window) gridStep(metresPerPixel float64) float64 {
	if g := w.project.View.GridStep; g > 0 {
		return g
	}
	return math.Pow(10, math.Floor(math.Log10(metresPerPixel*10)))
}

// position shows a position along the member in display units, in plain
// decimals to the precision of the view (one pixel), so a position near the
// left end reads 0.001 m rather than 6.798e-04 m.
func (w *Window) position(x float64) string {
	u := w.units.Unit(units.Position)
	step := w.draw.metresPerPixel() / u.ToSI
	decimals := 0
	if step > 0 {
		decimals = max(0, min(6, int(math.Ceil(-math.Log10(step)))))
	}
	v := x / u.ToSI
	if math.Abs(v) < 0.5*math.Pow(10, -float64(decimals)) {
		v = 0 // no "-0.00 m"
	}
	return strconv.FormatFloat(v, 'f', decimals, 64) + " " + u.Symbol
}

// click applies the current tool at p.
func (w *Window) click(p fyne.Position, double bool) {
	hit := w.draw.hit(p)
	x := w.draw.snapX(p.X, canvas.Ref{})
	noMember := len(w.project.Model.Segments) == 0
	switch w.tool {
	case toolPick, toolPan:
		if double && (hit.Kind == canvas.DistributedLoad || hit.Kind == canvas.LoadVertex) {
			w.addVertex(hit.Index, w.draw.view.ToModelX(p.X))
			return
		}
		w.selectItem(hit)
	case toolMember:
		w.setStatus("drag along the drawing to give the member its length, or type it under Properties")
	case toolSplit:
		w.apply(fmt.Sprintf("split the member at x = %s", w.position(x)),
			func(m *fem.Model) error { return splitSegment(m, x) })
	case toolVertex:
		if hit.Kind != canvas.DistributedLoad && hit.Kind != canvas.LoadVertex {
			w.setStatus("click on a distributed load to add a vertex to it")
			return
		}
		w.addVertex(hit.Index, w.draw.view.ToModelX(p.X))
	case toolSupport, toolForce, toolMoment:
		if noMember {
			w.setStatus("draw the member first: choose Member and drag along the drawing")
			return
		}
		w.place(x)
	case toolLineLoad:
		w.setStatus("drag along the member to give the line load its span")
	}
}

// place puts a support or point load at x and selects it.
func (w *Window) place(x float64) {
	at := w.position(x)
	var err error
	switch w.tool {
	case toolSupport:
		k := w.kind
		err = w.apply(fmt.Sprintf("place a %s support at x = %s", k, at), func(m *fem.Model) error { addSupport(m, k, x); return nil })
		if err == nil {
			w.selectItem(canvas.Ref{Kind: canvas.Support, Index: len(w.project.Model.Supports) - 1})
		}
	case toolForce:
		err = w.apply("place a force at x = "+at, func(m *fem.Model) error { addPointForce(m, x); return nil })
	case toolMoment:
		err = w.apply("place a moment at x = "+at, func(m *fem.Model) error { addPointMoment(m, x); return nil })
	}
	if err == nil && w.tool != toolSupport {
		w.selectItem(canvas.Ref{Kind: canvas.PointLoad, Index: len(w.project.Model.PointLoads) - 1})
	}
}

func (w *Window) addVertex(load int, x float64) {
	x = w.draw.snapX(w.draw.view.ToScreenX(x), canvas.Ref{Kind: canvas.DistributedLoad, Index: load})
	var k int
	err := w.apply(fmt.Sprintf("add a vertex to distributed load %d at x = %s", load+1, w.position(x)), func(m *fem.Model) error {
		var err error
		k, err = addLoadVertex(m, load, x)
		return err
	})
	if err == nil {
		w.selectItem(canvas.Ref{Kind: canvas.LoadVertex, Index: load, Vertex: k})
	}
}

// beginDrag decides what a drag starting at p does.
func (w *Window) beginDrag(p fyne.Position, button desktop.MouseButton) *gesture {
	g := &gesture{button: button, start: p, before: w.project.Model}
	if button == desktop.MouseButtonTertiary || w.tool == toolPan {
		return g
	}
	switch w.tool {
	case toolMember:
		g.kind = gestureMember
		if len(w.project.Model.Segments) == 0 {
			// The member starts where the drag starts.
			w.draw.view.X0 = -float64(p.X) / w.draw.view.Scale
		}
		return g
	case toolLineLoad:
		if len(w.project.Model.Segments) > 0 {
			g.kind = gestureLineLoad
		}
		return g
	}
	if hit := w.draw.hit(p); hit.Kind != canvas.None && hit.Kind != canvas.Member && hit.Kind != canvas.CheckMark && hit.Kind != canvas.Element {
		g.kind, g.target = gestureMove, hit
		if hit.Kind == canvas.LoadVertex {
			g.perPixel = w.draw.scene.IntensityPerPixel(hit)
			if g.perPixel == 0 {
				g.perPixel = -w.draw.scene.LoadScale
			}
		}
		w.selectItem(hit)
	}
	return g
}

// dragTo applies the drag so far to the model as it was when the drag began,
// and shows the result live if it is a valid model.
func (w *Window) dragTo(g *gesture, ev *fyne.DragEvent) {
	if g.kind == gesturePan {
		w.draw.view.Pan(ev.Dragged.DX, ev.Dragged.DY)
		w.draw.Refresh()
		return
	}
	cand := g.before.Clone()
	if err := w.dragModel(&cand, g, ev.Position); err != nil {
		w.setStatus("%v", err)
		return
	}
	if err := w.validate(&cand); err != nil {
		w.setStatus("cannot go there: %v", err)
		w.status.locate(err, &cand)
		return
	}
	w.setModel(cand)
}

func (w *Window) dragModel(m *fem.Model, g *gesture, p fyne.Position) error {
	d := w.draw
	switch g.kind {
	case gestureMember:
		s := snapper{grid: w.gridStep(d.metresPerPixel())}
		return setLength(m, s.snap(d.view.ToModelX(p.X)))
	case gestureLineLoad:
		return addLineLoad(m, d.snapX(g.start.X, canvas.Ref{}), d.snapX(p.X, canvas.Ref{}))
	}
	r := g.target
	x := d.snapX(p.X, r)
	switch r.Kind {
	case canvas.Support:
		m.Supports[r.Index].X = x
	case canvas.PointLoad:
		m.PointLoads[r.Index].X = x
	case canvas.Hinge:
		m.Hinges[r.Index].X = x
	case canvas.Foundation:
		// Sideways, its start snapped, its length kept.
		was := g.before.Foundations[r.Index]
		shift := d.sideways(g, p, was.Start, r)
		m.Foundations[r.Index].Start, m.Foundations[r.Index].End = was.Start+shift, was.End+shift
	case canvas.MemberEnd:
		s := snapper{grid: w.gridStep(d.metresPerPixel())}
		return setLength(m, s.snap(d.view.ToModelX(p.X)))
	case canvas.Segment:
		if r.Index == len(m.Segments)-1 {
			return setLength(m, x)
		}
		m.Segments[r.Index].End, m.Segments[r.Index+1].Start = x, x
	case canvas.DistributedLoad:
		pts := m.DistributedLoad[r.Index].Points
		shift := d.sideways(g, p, g.before.DistributedLoad[r.Index].Points[0].X, r)
		for i := range pts {
			pts[i].X += shift
		}
	case canvas.LoadVertex:
		dx, dy := p.X-g.start.X, p.Y-g.start.Y
		if g.axis == 0 && math.Hypot(float64(dx), float64(dy)) > 4 {
			g.axis = 2
			if math.Abs(float64(dx)) > math.Abs(float64(dy)) {
				g.axis = 1
			}
		}
		pt := &m.DistributedLoad[r.Index].Points[r.Vertex]
		switch g.axis {
		case 1:
			pt.X = x
		case 2:
			pt.Intensity = roundLoad(pt.Intensity + float64(dy)*g.perPixel)
		}
	}
	return nil
}

// sideways is how far, m, the drag g to p carries an item whose start was
// at x when it began, with the start snapped (r, the item, snaps to none of
// its own points).
func (d *drawing) sideways(g *gesture, p fyne.Position, x float64, r canvas.Ref) float64 {
	return d.snapX(d.view.ToScreenX(x)+p.X-g.start.X, r) - x
}

// roundLoad keeps dragged intensities to three significant figures: a drag
// cannot be more precise than that and tidy numbers read better.
func roundLoad(q float64) float64 {
	if q == 0 {
		return 0
	}
	step := math.Pow(10, math.Floor(math.Log10(math.Abs(q)))-2)
	return math.Round(q/step) * step
}

// endDrag commits a drag as one undoable edit.
func (w *Window) endDrag(g *gesture) {
	if g.kind == gesturePan {
		return
	}
	if reflect.DeepEqual(g.before, w.project.Model) {
		return
	}
	name := "drag"
	switch g.kind {
	case gestureMember:
		name = "set the member length to " + w.position(w.project.Model.Length())
	case gestureLineLoad:
		name = "add a distributed load"
		w.selectItem(canvas.Ref{Kind: canvas.DistributedLoad, Index: len(w.project.Model.DistributedLoad) - 1})
	case gestureMove:
		name = "move " + describe(g.target)
	}
	w.hist.push(edit{name: name, before: lowerCase(g.before, w.editCase), after: w.canonicalModel()})
	w.refitIfLengthChanged(g.before)
	w.setStatus("%s", name)
	w.updateTitle()
}

// canvasNone is the empty selection.
var canvasNone = canvas.Ref{}
