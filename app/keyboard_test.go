package app

import (
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"stave/fem/moving"
)

// tabReaches walks Tab (fyne's FocusNext) round c from no focus and
// reports every enabled, visible widget under root that takes the focus
// and that Tab never reached.
func tabReaches(t *testing.T, c fyne.Canvas, root fyne.CanvasObject) {
	t.Helper()
	reached := map[fyne.Focusable]bool{}
	c.Unfocus()
	for range 500 {
		c.FocusNext()
		f := c.Focused()
		if f == nil || reached[f] {
			break
		}
		reached[f] = true
	}
	n := 0
	for _, o := range test.LaidOutObjects(root) {
		f, ok := o.(fyne.Focusable)
		if !ok || !o.Visible() {
			continue
		}
		if d, ok := o.(fyne.Disableable); ok && d.Disabled() {
			continue
		}
		n++
		if !reached[f] {
			t.Errorf("Tab never reaches %s", nameOf(o))
		}
	}
	if n == 0 {
		t.Error("no widget to reach")
	}
}

// pressSpace activates the focused widget as the Space key does.
func pressSpace(t *testing.T, c fyne.Canvas) {
	t.Helper()
	f := c.Focused()
	if f == nil {
		t.Fatal("nothing has the focus")
	}
	f.TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace})
}

// focusButton tabs round c to the button reading text.
func focusButton(t *testing.T, c fyne.Canvas, text string) {
	t.Helper()
	c.Unfocus()
	for range 500 {
		c.FocusNext()
		if b, ok := c.Focused().(*widget.Button); ok && b.Text == text {
			return
		}
	}
	t.Fatalf("Tab never reaches the button %q", text)
}

// The load cases and their combinations are edited by keyboard alone:
// Tab reaches every field and button of the dialogs, and Space on a
// button does what a click does.
func TestCasesByKeyboard(t *testing.T) {
	w, _ := openTestdata(t, "two_span_cases.json", laptop)
	c := w.win.Canvas()
	n := len(w.Model().Cases)

	focusButton(t, c, "Add…")
	pressSpace(t, c)
	top := c.Overlays().Top()
	if top == nil {
		t.Fatal("Add… opened no dialog")
	}
	tabReaches(t, c, top)
	focusButton(t, c, "Add")
	pressSpace(t, c)
	if got := len(w.Model().Cases); got != n+1 {
		t.Fatalf("Space on Add left %d cases, want %d", got, n+1)
	}

	c.Overlays().Remove(c.Overlays().Top())
	focusButton(t, c, "Combinations…")
	pressSpace(t, c)
	top = c.Overlays().Top()
	if top == nil {
		t.Fatal("Combinations… opened no dialog")
	}
	tabReaches(t, c, top)
	rows := len(w.Model().Combinations)
	focusButton(t, c, "Add typical templates")
	pressSpace(t, c)
	focusButton(t, c, "Keep these combinations")
	pressSpace(t, c)
	if got := len(w.Model().Combinations); got != rows+2 {
		t.Errorf("the templates and Keep by keyboard left %d combinations, want %d", got, rows+2)
	}
}

// The moving-loads window is worked by keyboard alone: Tab reaches every
// field and button, and the train moves without the mouse.
func TestMovingLoadsByKeyboard(t *testing.T) {
	_, _, mw := runwayWindow(t)
	c := mw.win.Canvas()
	tabReaches(t, c, mw.win.Content())
	c.Unfocus()
	for range 500 {
		c.FocusNext()
		if any(c.Focused()) == any(mw.pic) {
			break
		}
	}
	if any(c.Focused()) != any(mw.pic) {
		t.Fatal("Tab never reaches the picture, where the train is moved")
	}
	mw.toWorst()
	for _, c := range []struct {
		key   fyne.KeyName
		steps float64
	}{{fyne.KeyRight, 1}, {fyne.KeyLeft, -1}, {fyne.KeyLeft, -1}} {
		before := mw.at
		want := mw.env.Nearest(moving.Placement{Direction: before.Direction, Front: before.Front + c.steps*mw.env.Step})
		mw.pic.TypedKey(&fyne.KeyEvent{Name: c.key})
		if mw.at != want || want == before {
			t.Errorf("%s moved the train from %+v to %+v, want one position on, %+v", c.key, before, mw.at, want)
		}
	}
}
