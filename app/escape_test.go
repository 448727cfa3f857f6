package app

import (
	"errors"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"stave/fem"
)

// dialogEntries are the entries of the dialog on top of w's window.
func dialogEntries(w *Window) []fyne.Focusable {
	type entry interface {
		fyne.Focusable
		SetPlaceHolder(string)
	}
	var es []fyne.Focusable
	if top := w.win.Canvas().Overlays().Top(); top != nil {
		for _, o := range test.LaidOutObjects(top) {
			if e, ok := o.(entry); ok {
				es = append(es, e)
			}
		}
	}
	return es
}

// Escape closes every dialog as its Cancel or Close button does, with the
// focus nowhere and with it in any of the dialog's entries, and leaves the
// member as it was; Enter still confirms (TestFormDialogsByKeyboard).
func TestEscapeClosesDialogs(t *testing.T) {
	dialogs := []struct {
		name string
		show func(w *Window)
	}{
		{"check limits", func(w *Window) { w.showCheckLimits() }},
		{"add a load case", func(w *Window) { w.addCase() }},
		{"rename the load case", func(w *Window) { w.renameCase() }},
		{"adaptive refinement", func(w *Window) { w.runAdaptive() }},
		{"the Add form", func(w *Window) { w.showAddForm() }},
		{"the notes", func(w *Window) { w.showNotesForm() }},
		{"section calculator", func(w *Window) { w.showSectionCalculator() }},
		{"typical materials", func(w *Window) { w.showMaterials() }},
		{"combinations", func(w *Window) { w.showCombinations() }},
		{"nodal loads table", func(w *Window) { w.showNodalTable() }},
		{"an error", func(w *Window) { w.showError(errors.New("something went wrong")) }},
		{"unsaved changes", func(w *Window) {
			w.apply("move a support", func(m *fem.Model) error { m.Supports[0].X += 0.5; return nil })
			w.newProject()
		}},
		{"saved but will not open", func(w *Window) {
			w.warnUnloadable("member.json", errors.New("something is wrong"), func() { w.newProject() })
		}},
		{"saved but will not open, informing", func(w *Window) {
			w.warnUnloadable("member.json", errors.New("something is wrong"), nil)
		}},
	}
	for _, d := range dialogs {
		// where is -1 for Escape with the focus nowhere, k for Escape in
		// the dialog's entry k.
		for where := -1; ; where++ {
			w, c := dialogOnTwoSpans(t, d.name, d.show)
			entries := dialogEntries(w)
			if where >= len(entries) {
				break
			}
			before := cloneProject(w.project)
			how := "with the focus nowhere"
			if where < 0 {
				c.Unfocus()
				typeKey(w, fyne.KeyEscape)
			} else {
				how = "in its entry " + strconv.Itoa(where+1)
				c.Focus(entries[where])
				typeToFocused(t, w, fyne.KeyEscape)
			}
			if c.Overlays().Top() != nil {
				t.Errorf("%s: Escape %s left the dialog open", d.name, how)
			}
			if !reflect.DeepEqual(w.project, before) {
				t.Errorf("%s: Escape %s changed the project", d.name, how)
			}
		}
	}
}

// Escape on the unsaved-changes question keeps the work, as Cancel does
// (TestRecoveryQuestion has Escape on the restore question).
func TestEscapeOnUnsavedChangesCancels(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
	w.newProject()
	typeKey(w, fyne.KeyEscape)
	if open := w.win.Canvas().Overlays().Top() != nil; open || !w.dirty() || !strings.Contains(w.status.Text, "kept working") {
		t.Errorf("Escape on unsaved changes: dialog open %v, unsaved changes %v, status %q", open, w.dirty(), w.status.Text)
	}
}

// dialogOnTwoSpans opens the window on the two spans with cases on a
// laptop's screen, solved, and shows the dialog named name by show.
func dialogOnTwoSpans(t *testing.T, name string, show func(w *Window)) (*Window, fyne.Canvas) {
	t.Helper()
	w, q := openTestdata(t, "two_span_cases.json", laptop)
	finished(t, w, q)
	c := w.win.Canvas()
	show(w)
	if c.Overlays().Top() == nil {
		t.Fatalf("%s: no dialog showing", name)
	}
	return w, c
}
