package app

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/fem"
)

// The shortcuts the desktop driver makes of these keys (fyne
// internal/driver/glfw, window.triggersShortcut): Ctrl+Z and Ctrl+Y become
// Fyne's own undo and redo shortcuts, any other Ctrl combination a custom one.
var (
	pressCtrlZ      fyne.Shortcut = &fyne.ShortcutUndo{}
	pressCtrlY      fyne.Shortcut = &fyne.ShortcutRedo{}
	pressCtrlShiftZ fyne.Shortcut = &desktop.CustomShortcut{KeyName: fyne.KeyZ, Modifier: fyne.KeyModifierShortcutDefault | fyne.KeyModifierShift}
)

// press delivers shortcut s the way the desktop driver does: to a main menu
// item with the same shortcut if there is one, else to the focused widget
// if it takes shortcuts, else to the canvas.
func press(t *testing.T, w *Window, s fyne.Shortcut) {
	t.Helper()
	if it := menuItemFor(w.win.MainMenu(), s); it != nil {
		it.Action()
		return
	}
	c := w.win.Canvas()
	if f, ok := c.Focused().(fyne.Shortcutable); ok {
		f.TypedShortcut(s)
		return
	}
	sc, ok := c.(fyne.Shortcutable)
	if !ok {
		t.Fatal("the test canvas takes no shortcuts")
	}
	sc.TypedShortcut(s)
}

// menuItemFor finds the item of m whose shortcut is s.
func menuItemFor(m *fyne.MainMenu, s fyne.Shortcut) *fyne.MenuItem {
	var find func(items []*fyne.MenuItem) *fyne.MenuItem
	find = func(items []*fyne.MenuItem) *fyne.MenuItem {
		for _, it := range items {
			if it.Shortcut != nil && it.Shortcut.ShortcutName() == s.ShortcutName() && it.Action != nil {
				return it
			}
			if it.ChildMenu != nil {
				if found := find(it.ChildMenu.Items); found != nil {
					return found
				}
			}
		}
		return nil
	}
	if m == nil {
		return nil
	}
	for _, menu := range m.Items {
		if it := find(menu.Items); it != nil {
			return it
		}
	}
	return nil
}

// typeKey and typeRune deliver a key pressed alone while no widget has the focus.
func typeKey(w *Window, k fyne.KeyName) { w.win.Canvas().OnTypedKey()(&fyne.KeyEvent{Name: k}) }
func typeRune(w *Window, r rune)        { w.win.Canvas().OnTypedRune()(r) }

// Ctrl+Z undoes, Ctrl+Y and Ctrl+Shift+Z redo. Ctrl+Z and Ctrl+Y are on
// the Edit menu, so they work with an entry focused too; Ctrl+Shift+Z is
// the canvas's alone, and an entry in focus keeps it.
func TestUndoRedoKeys(t *testing.T) {
	for _, c := range []struct {
		name       string
		focus      bool
		undo, redo fyne.Shortcut
	}{
		{"Ctrl+Z, Ctrl+Y", false, pressCtrlZ, pressCtrlY},
		{"Ctrl+Z, Ctrl+Shift+Z", false, pressCtrlZ, pressCtrlShiftZ},
		{"Ctrl+Z, Ctrl+Y in an entry", true, pressCtrlZ, pressCtrlY},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		n := len(w.Model().Supports)
		w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 1})
		typeKey(w, fyne.KeyDelete)
		if got := len(w.Model().Supports); got != n-1 {
			t.Fatalf("Delete left %d supports, want %d", got, n-1)
		}
		if c.focus {
			w.win.Canvas().Focus(w.ui.elements)
		}
		press(t, w, c.undo)
		if got := len(w.Model().Supports); got != n {
			t.Errorf("%s: undo after Delete left %d supports, want %d", c.name, got, n)
		}
		press(t, w, c.redo)
		if got := len(w.Model().Supports); got != n-1 {
			t.Errorf("%s: redo after undo left %d supports, want %d", c.name, got, n-1)
		}
	}
}

// The menus show the keys of their commands.
func TestMenusShowKeys(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	for _, c := range []struct {
		key  fyne.Shortcut
		want string
	}{
		{pressCtrlZ, "Undo"},
		{pressCtrlY, "Redo"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyS, Modifier: fyne.KeyModifierShortcutDefault}, "Save"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyN, Modifier: fyne.KeyModifierShortcutDefault}, "New"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyQ, Modifier: fyne.KeyModifierShortcutDefault}, "Quit"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyDelete}, "Delete selected"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyR}, "Support"},
		{&desktop.CustomShortcut{KeyName: fyne.KeyA}, "Add a support, load or break…"},
	} {
		it := menuItemFor(w.win.MainMenu(), c.key)
		if it == nil || it.Label != c.want {
			t.Errorf("the menu item with the key %s is %v, want %q", c.key.ShortcutName(), it, c.want)
		}
	}
}

// state is what a key must not change while a dialog is open.
type state struct {
	model    fem.Model
	selected canvas.Ref
	tool     tool
	undo     int
}

func stateOf(w *Window) state {
	return state{w.Model(), w.selected, w.tool, len(w.hist.done)}
}

func (s state) String() string {
	m := s.model
	return fmt.Sprintf("%d supports, %d point loads, %d line loads, selected %v, tool %d, %d undo steps",
		len(m.Supports), len(m.PointLoads), len(m.DistributedLoad), s.selected, s.tool, s.undo)
}

// No key reaches the model, the selection or the tool while a dialog is open
// (Escape closes the dialog: TestEscapeClosesDialogs).
func TestKeysDoNothingBehindDialogs(t *testing.T) {
	dialogs := []struct {
		name string
		show func(w *Window)
	}{
		{"check limits", func(w *Window) { w.showCheckLimits() }},
		{"an error", func(w *Window) { dialog.ShowError(errors.New("something went wrong"), w.win) }},
		{"unsaved changes", func(w *Window) {
			w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
			w.newProject()
		}},
		{"the Add form", func(w *Window) { w.showAddForm() }},
		{"the notes", func(w *Window) { w.showNotesForm() }},
	}
	keys := []struct {
		name  string
		press func(t *testing.T, w *Window)
	}{
		{"Delete", func(_ *testing.T, w *Window) { typeKey(w, fyne.KeyDelete) }},
		{"Backspace", func(_ *testing.T, w *Window) { typeKey(w, fyne.KeyBackspace) }},
		{"R", func(_ *testing.T, w *Window) { typeRune(w, 'r') }},
		{"A", func(_ *testing.T, w *Window) { typeRune(w, 'a') }},
		{"Ctrl+Z", func(t *testing.T, w *Window) { press(t, w, pressCtrlZ) }},
		{"Ctrl+Y", func(t *testing.T, w *Window) { press(t, w, pressCtrlY) }},
		{"Ctrl+Shift+Z", func(t *testing.T, w *Window) { press(t, w, pressCtrlShiftZ) }},
	}
	for _, d := range dialogs {
		w, _ := newTestWindow(t, demoProject(t))
		w.selectItem(canvas.Ref{Kind: canvas.PointLoad, Index: 0})
		w.setTool(toolMoment)
		w.win.Canvas().Unfocus()
		d.show(w)
		if w.win.Canvas().Overlays().Top() == nil {
			t.Fatalf("%s: no dialog showing", d.name)
		}
		w.win.Canvas().Unfocus() // keys go to the window, as when the dialog has no entry in focus
		before := stateOf(w)
		overlays := len(w.win.Canvas().Overlays().List())
		for _, k := range keys {
			k.press(t, w)
			if after := stateOf(w); !reflect.DeepEqual(after, before) {
				t.Errorf("with %s showing, %s changed the window: %v, was %v", d.name, k.name, after, before)
				before = after
			}
		}
		if got := len(w.win.Canvas().Overlays().List()); got != overlays {
			t.Errorf("with %s showing, the keys opened or closed dialogs: %d, was %d", d.name, got, overlays)
		}
	}
	// With the dialogs closed the same keys work: the test can tell.
	w, _ := newTestWindow(t, demoProject(t))
	w.selectItem(canvas.Ref{Kind: canvas.PointLoad, Index: 0})
	typeKey(w, fyne.KeyDelete)
	if len(w.Model().PointLoads) != len(demoProject(t).Model.PointLoads)-1 {
		t.Error("Delete with no dialog open did not delete the selected load")
	}
}

// The plain keys the menus show act when no widget has the focus, and
// type into an entry that has it.
func TestPlainKeys(t *testing.T) {
	for _, c := range []struct {
		key  rune
		want func(w *Window, fitted float64) bool
	}{
		{'r', func(w *Window, _ float64) bool { return w.tool == toolSupport }},
		{'L', func(w *Window, _ float64) bool { return w.tool == toolLineLoad }},
		{'a', func(w *Window, _ float64) bool { return w.win.Canvas().Overlays().Top() != nil }},
		{'+', func(w *Window, fitted float64) bool { return w.draw.view.Scale > fitted }},
		{'=', func(w *Window, fitted float64) bool { return w.draw.view.Scale > fitted }},
		{'-', func(w *Window, fitted float64) bool { return w.draw.view.Scale < fitted }},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		fitted := w.draw.view.Scale
		typeRune(w, c.key)
		if !c.want(w, fitted) {
			t.Errorf("%c did not do what the menus say", c.key)
		}
	}
	w, _ := newTestWindow(t, demoProject(t))
	w.zoomCentre(3)
	typeRune(w, 'f')
	if w.draw.view != w.draw.fittedView() {
		t.Error("F did not fit the member")
	}
	e := w.ui.elements
	w.win.Canvas().Focus(e)
	test.Type(e, "l")
	if w.tool != toolPick || !strings.Contains(e.Text, "l") {
		t.Errorf("typing L into the element count picked tool %d; the entry reads %q", w.tool, e.Text)
	}
}

// A wheel notch zooms by zoomStep, a fast spin by no more, and zooming
// stops at its bounds.
func TestWheelZoom(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	d := w.draw
	start := d.view.Scale
	scroll := func(dy float32) {
		d.Scrolled(&fyne.ScrollEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(d.view.Width/2, 100)}, Scrolled: fyne.NewDelta(0, dy)})
	}
	for range 6 {
		scroll(wheelNotch)
	}
	if got, want := d.view.Scale/start, 1.18*1.18*1.18*1.18*1.18*1.18; got > want*1.0001 || got < want*0.9999 {
		t.Errorf("six notches zoomed %.3g×, want %.3g×", got, want)
	}
	scroll(40 * wheelNotch) // a spin reported as one event
	if got := d.view.Scale / start; got > 1.18*1.18*1.18*1.18*1.18*1.18*1.18*1.0001 {
		t.Errorf("a fast spin zoomed to %.3g×, more than one notch further", got)
	}
	for range 1000 {
		scroll(wheelNotch)
	}
	if got := d.view.Scale / d.fittedView().Scale; got > zoomInMost*1.0001 {
		t.Errorf("zoomed in to %.3g× the fitted view, beyond %g×", got, zoomInMost)
	}
	for range 2000 {
		scroll(-wheelNotch)
	}
	if got := d.view.Scale / d.fittedView().Scale; got < zoomOutMost*0.9999 {
		t.Errorf("zoomed out to %.3g× the fitted view, beyond %g×", got, zoomOutMost)
	}
}

// typeToFocused delivers a key the way the desktop driver does while a
// widget has the focus: to that widget.
func typeToFocused(t *testing.T, w *Window, k fyne.KeyName) {
	t.Helper()
	f := w.win.Canvas().Focused()
	if f == nil {
		t.Fatalf("nothing has the focus to take %s", k)
	}
	f.TypedKey(&fyne.KeyEvent{Name: k})
}

// Tab (fyne's FocusNext) reaches the drawing from any widget, and there the
// plain keys of the menus act as with nothing in focus: a keyboard user who
// tabbed into the panels can get back to the tool letters and Delete.
func TestTabReachesTheDrawing(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	c := w.win.Canvas()
	c.Focus(w.ui.elements)
	reached := false
	for range 200 { // far more than the window's widgets
		c.FocusNext()
		if any(c.Focused()) == any(w.draw) {
			reached = true
			break
		}
	}
	if !reached {
		t.Fatal("Tab never put the focus on the drawing")
	}
	c.Focused().TypedRune('r')
	if w.tool != toolSupport {
		t.Errorf("R on the focused drawing left tool %d, want the support tool", w.tool)
	}
	n := len(w.Model().Supports)
	w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 1})
	typeToFocused(t, w, fyne.KeyDelete)
	if got := len(w.Model().Supports); got != n-1 {
		t.Errorf("Delete on the focused drawing left %d supports, want %d", got, n-1)
	}
}

// Clicking the drawing gives it the focus, so the keys act there.
func TestClickFocusesTheDrawing(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.win.Canvas().Focus(w.ui.elements)
	w.draw.MouseDown(&desktop.MouseEvent{Button: desktop.MouseButtonPrimary})
	if got := w.win.Canvas().Focused(); any(got) != any(w.draw) {
		t.Errorf("after a click on the drawing the focus is on %T, want the drawing", got)
	}
}

// The arrow keys step the selection through the member's items from left
// to right, each once, and round again; Enter puts the focus on the
// selection's first number, its text selected, so an item is moved by
// typing alone: what is typed replaces the number shown.
func TestSelectAndEditByKeyboard(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	m := w.Model()
	n := len(m.Segments) + len(m.Supports) + len(m.Hinges) + len(m.Foundations) + len(m.PointLoads) + len(m.DistributedLoad)
	seen := map[canvas.Ref]bool{}
	lastX := math.Inf(-1)
	var first canvas.Ref
	for i := range n {
		typeKey(w, fyne.KeyRight)
		r := w.selected
		if i == 0 {
			first = r
		}
		if r.Kind == canvas.None || seen[r] {
			t.Fatalf("Right no. %d selected %v (seen before: %v)", i+1, r, seen[r])
		}
		seen[r] = true
		x := itemX(t, &m, r)
		if x < lastX {
			t.Errorf("Right went from x = %g m back to %s at x = %g m", lastX, describe(r), x)
		}
		lastX = x
	}
	typeKey(w, fyne.KeyRight)
	if w.selected != first {
		t.Errorf("Right after the last item selected %v, want the first, %v", w.selected, first)
	}
	typeKey(w, fyne.KeyLeft)
	if itemX(t, &m, w.selected) != lastX {
		t.Errorf("Left from the first item selected %v, want the last item (x = %g m)", w.selected, lastX)
	}

	// Support 2 of the demo stands at x = 3 m: select it by keys, move it by typing.
	for w.selected != (canvas.Ref{Kind: canvas.Support, Index: 1}) {
		typeKey(w, fyne.KeyRight)
	}
	typeKey(w, fyne.KeyReturn)
	e, ok := w.win.Canvas().Focused().(*escEntry)
	if !ok || e != w.ui.panel.entries[0] {
		t.Fatalf("Enter put the focus on %T, want the support's x", w.win.Canvas().Focused())
	}
	test.Type(e, "2.9 m") // over what the field shows, which Enter selected
	e.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if got := w.Model().Supports[1].X; got != 2.9 {
		t.Errorf("typing 2.9 m moved support 2 to x = %g m (the field read %q)", got, e.Text)
	}
}

// itemX is where the item r of m starts, m.
func itemX(t *testing.T, m *fem.Model, r canvas.Ref) float64 {
	t.Helper()
	switch r.Kind {
	case canvas.Segment:
		return m.Segments[r.Index].Start
	case canvas.Support:
		return m.Supports[r.Index].X
	case canvas.Hinge:
		return m.Hinges[r.Index].X
	case canvas.Foundation:
		return m.Foundations[r.Index].Start
	case canvas.PointLoad:
		return m.PointLoads[r.Index].X
	case canvas.DistributedLoad:
		return m.DistributedLoad[r.Index].Points[0].X
	}
	t.Fatalf("%v is not an item of the member", r)
	return 0
}

// Escape in a number of the properties panel gives the focus back to the
// drawing, where the arrow keys select the next item.
func TestEscapeFromPropertiesToDrawing(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	typeKey(w, fyne.KeyRight)
	typeKey(w, fyne.KeyReturn)
	if w.win.Canvas().Focused() == nil {
		t.Fatal("Enter put the focus nowhere")
	}
	typeToFocused(t, w, fyne.KeyEscape)
	if got := w.win.Canvas().Focused(); any(got) != any(w.draw) {
		t.Fatalf("Escape in the properties left the focus on %T, want the drawing", got)
	}
	was := w.selected
	typeToFocused(t, w, fyne.KeyRight)
	if w.selected == was {
		t.Errorf("Right on the drawing after Escape kept the selection %v", was)
	}
}

// A dialog that asks for a few values opens with the focus in its first
// field, and Enter there confirms it, as its confirm button does, as Enter
// does in the Add form and the properties: the focus was nowhere and Enter
// did nothing, so the keyboard reached the confirm button only by Tab and
// Space.
func TestFormDialogsByKeyboard(t *testing.T) {
	// Each types into the first field (typed, "" to leave it), so that a
	// dialog that Enter closed without doing what its button does shows.
	dialogs := []struct {
		name  string
		show  func(w *Window)
		typed string
		done  func(w *Window) bool // what the confirm button does, done
	}{
		{"add a load case", func(w *Window) { w.addCase() }, "wind", func(w *Window) bool {
			cs := w.canonicalModel().Cases
			return len(cs) == 4 && cs[3].Name == "wind"
		}},
		{"rename the load case", func(w *Window) { w.renameCase() }, "renamed", func(w *Window) bool {
			return w.canonicalModel().Cases[w.editCase].Name == "renamed"
		}},
		{"check limits", func(w *Window) { w.showCheckLimits() }, "250", func(w *Window) bool { return w.project.View.DeflectionLimit == 250 }},
		{"adaptive refinement", func(w *Window) { w.runAdaptive() }, "", func(w *Window) bool { return w.study != 0 || w.adaptNodes != nil }},
	}
	for _, d := range dialogs {
		w, c := dialogOnTwoSpans(t, d.name, d.show)
		e, ok := c.Focused().(*escEntry)
		if !ok {
			t.Errorf("%s: the dialog opens with the focus on %T, want its first field", d.name, c.Focused())
			continue
		}
		if d.typed != "" {
			e.SetText(d.typed)
		}
		e.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
		if c.Overlays().Top() != nil || !d.done(w) {
			t.Errorf("%s: Enter in the field left the dialog open (%v) or did not do what its button does", d.name, c.Overlays().Top() != nil)
		}
		w.cancelStudy()
	}
}
