package app

import (
	"errors"
	"fmt"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

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

// buttonIn is o as a button, or nil when it is none.
func buttonIn(o fyne.CanvasObject) *widget.Button {
	switch b := o.(type) {
	case *widget.Button:
		return b
	case *ringButton:
		return &b.Button
	case *dialogButton:
		return &b.Button
	}
	return nil
}

// tabOrder is every widget Tab (fyne's FocusNext) reaches on c from no
// focus, in the order it reaches them.
func tabOrder(c fyne.Canvas) []fyne.Focusable {
	c.Unfocus()
	var order []fyne.Focusable
	for range 500 {
		c.FocusNext()
		f := c.Focused()
		if f == nil || slices.Contains(order, f) {
			break
		}
		order = append(order, f)
	}
	return order
}

// tabTo presses Tab on c from no focus until f has the focus.
func tabTo(t *testing.T, c fyne.Canvas, f fyne.Focusable) {
	t.Helper()
	c.Unfocus()
	for range 500 {
		c.FocusNext()
		if c.Focused() == f {
			return
		}
	}
	t.Fatalf("Tab never reaches %s", nameOf(f.(fyne.CanvasObject)))
}

// escapeDialogs are the dialogs of the window, one of each kind: forms,
// custom dialogs with a Close or Cancel button and buttons of their own,
// questions, a confirmation, an error and a message. show opens the
// dialog and types into it what its affirmative button would take, so
// that the button, pressed, would change the project or, where it does
// not, makes affirmed true.
var escapeDialogs = []struct {
	name     string
	show     func(t *testing.T, w *Window)
	affirmed func(w *Window) bool
}{
	{"check limits", func(t *testing.T, w *Window) {
		w.showCheckLimits()
		_, entries, _, _ := dialogWidgets(t, w)
		entries[0].SetText("123")
	}, nil},
	{"add a load case", func(_ *testing.T, w *Window) { w.addCase() }, nil},
	{"rename the load case", func(t *testing.T, w *Window) {
		w.renameCase()
		_, entries, _, _ := dialogWidgets(t, w)
		entries[0].SetText("renamed")
	}, nil},
	{"adaptive refinement", func(_ *testing.T, w *Window) { w.runAdaptive() },
		func(w *Window) bool { return w.study != 0 || w.adaptNodes != nil }},
	{"the Add form", func(t *testing.T, w *Window) {
		w.showAddForm()
		_, entries, _, _ := dialogWidgets(t, w)
		entries[0].SetText("2 m") // the support's position comes first
	}, nil},
	{"the notes", func(t *testing.T, w *Window) {
		w.showNotesForm()
		_, entries, _, _ := dialogWidgets(t, w)
		entries[0].SetText("a note Escape must not keep")
	}, nil},
	{"section calculator", func(_ *testing.T, w *Window) { w.showSectionCalculator() }, nil},
	{"typical materials", func(t *testing.T, w *Window) {
		w.showMaterials()
		selects, _, _, _ := dialogWidgets(t, w)
		m := selects[len(selects)-1] // the material, after the segment
		m.SetSelectedIndex(len(m.Options) - 1)
	}, nil},
	{"combinations", func(t *testing.T, w *Window) {
		w.showCombinations()
		_, _, buttons, _ := dialogWidgets(t, w)
		test.Tap(buttonNamed(t, buttons, "Add typical templates"))
	}, nil},
	{"nodal loads table", func(_ *testing.T, w *Window) { w.showNodalTable() }, nil},
	{"an error", func(_ *testing.T, w *Window) { w.showError(errors.New("something went wrong")) }, nil},
	{"unsaved changes", func(t *testing.T, w *Window) {
		w.path = filepath.Join(t.TempDir(), "member.json") // so that Save saves at once, then starts the new member
		w.apply("move a support", func(m *fem.Model) error { m.Supports[0].X += 0.5; return nil })
		w.newProject()
	}, func(w *Window) bool { return !strings.Contains(w.status.Text, "kept working") }},
	{"saved but will not open", func(_ *testing.T, w *Window) {
		w.warnUnloadable("member.json", errors.New("something is wrong"), func() { w.newProject() })
	}, nil},
	{"saved but will not open, informing", func(_ *testing.T, w *Window) {
		w.warnUnloadable("member.json", errors.New("something is wrong"), nil)
	}, nil},
}

// Escape with the focus on any button of a dialog, where Tab puts it,
// closes the dialog as its Cancel or Close button does: the focused
// button took the key and ignored it, so Escape did nothing after Tab.
func TestEscapeOnAFocusedButton(t *testing.T) {
	for _, d := range escapeDialogs {
		for k := 0; ; k++ {
			w, c := dialogOnTwoSpans(t, d.name, func(w *Window) { d.show(t, w) })
			var buttons []fyne.Focusable
			for _, f := range tabOrder(c) {
				if buttonIn(f.(fyne.CanvasObject)) != nil {
					buttons = append(buttons, f)
				}
			}
			if k == 0 && len(buttons) == 0 {
				t.Fatalf("%s: Tab reaches no button", d.name)
			}
			if k >= len(buttons) {
				break
			}
			escapeCloses(t, w, c, d.name, d.affirmed, buttons[k])
		}
	}
}

// escapeCloses tabs to f in the dialog named name, types Escape and checks
// that the dialog closed without what affirmed says its affirmative
// action did (nil: the project alone is compared).
func escapeCloses(t *testing.T, w *Window, c fyne.Canvas, name string, affirmed func(w *Window) bool, f fyne.Focusable) {
	t.Helper()
	what := nameOf(f.(fyne.CanvasObject))
	tabTo(t, c, f)
	before := cloneProject(w.project)
	typeToFocused(t, w, fyne.KeyEscape)
	if c.Overlays().Top() != nil {
		t.Errorf("%s: Escape on its %s left the dialog open", name, what)
	}
	if !reflect.DeepEqual(w.project, before) || affirmed != nil && affirmed(w) {
		t.Errorf("%s: Escape on its %s did what the dialog's affirmative button does", name, what)
	}
	w.cancelStudy()
}

// Escape on a button of a dialog opened over another closes the top one
// only; the one below stays open, its Cancel not made, and takes Escape
// on its own buttons in turn.
func TestEscapeOnAFocusedButtonClosesTheTopDialogOnly(t *testing.T) {
	for _, d := range escapeDialogs {
		w, c := dialogOnTwoSpans(t, d.name, func(w *Window) { d.show(t, w) })
		below := c.Overlays().Top()
		w.showError(errors.New("a second dialog, over the first"))
		top := c.Overlays().Top()
		if top == below {
			t.Fatalf("%s: the error shows no dialog of its own", d.name)
		}
		before := cloneProject(w.project)
		tabToButton(t, c, "OK")
		typeToFocused(t, w, fyne.KeyEscape)
		if got := c.Overlays().Top(); got != below || len(c.Overlays().List()) != 1 {
			t.Errorf("%s: Escape on the OK of the error over it left %d dialogs, the top one the first %v, want the first alone",
				d.name, len(c.Overlays().List()), got == below)
			continue
		}
		if !reflect.DeepEqual(w.project, before) {
			t.Errorf("%s: Escape on the error over it changed the project", d.name)
		}
		if d.name == "unsaved changes" && strings.Contains(w.status.Text, "kept working") {
			t.Errorf("%s: Escape on the error over it cancelled the question below too", d.name)
		}
		tabToButton(t, c, "")
		typeToFocused(t, w, fyne.KeyEscape)
		if c.Overlays().Top() != nil {
			t.Errorf("%s: after the error, Escape on its own button left it open", d.name)
		}
		if !reflect.DeepEqual(w.project, before) || d.affirmed != nil && d.affirmed(w) {
			t.Errorf("%s: Escape on its own button, after the error, did what its affirmative button does", d.name)
		}
		w.cancelStudy()
	}
}

// tabToButton presses Tab on c from no focus until a button reading text
// (any button for "") has the focus.
func tabToButton(t *testing.T, c fyne.Canvas, text string) {
	t.Helper()
	for _, f := range tabOrder(c) {
		if b := buttonIn(f.(fyne.CanvasObject)); b != nil && (text == "" || b.Text == text) {
			tabTo(t, c, f)
			return
		}
	}
	t.Fatalf("Tab never reaches a button %q", text)
}

// Enter and Space on a focused button of a dialog press it: Space as
// fyne's button takes it, Enter (Return, or Enter on the keypad) as
// desktop dialogs commonly take it (common practice), where fyne's button
// ignored it.
func TestEnterAndSpacePressAFocusedDialogButton(t *testing.T) {
	presses := []struct {
		dialog, button string
		show           func(t *testing.T, w *Window)
		pressed        func(w *Window) bool
	}{
		{"check limits", "Apply", escapeDialogs[0].show, func(w *Window) bool {
			return w.project.View.DeflectionLimit == 123 && w.win.Canvas().Overlays().Top() == nil
		}},
		{"check limits", "Cancel", escapeDialogs[0].show, func(w *Window) bool {
			return w.project.View.DeflectionLimit != 123 && w.win.Canvas().Overlays().Top() == nil
		}},
		{"unsaved changes", "Discard changes", nil, func(w *Window) bool { return len(w.Model().Segments) == 0 }},
		{"combinations", "Add a row", nil, func(w *Window) bool {
			_, entries, _, _ := dialogWidgets(t, w)
			return len(entries) > 4*(2+len(w.Model().Cases)) // beyond the 4 rows the file's 2 combinations and the 2 templates make
		}},
		{"an error", "OK", nil, func(w *Window) bool { return w.win.Canvas().Overlays().Top() == nil }},
	}
	for _, p := range presses {
		show := p.show
		for _, d := range escapeDialogs {
			if show == nil && d.name == p.dialog {
				show = d.show
			}
		}
		for _, key := range []fyne.KeyName{fyne.KeySpace, fyne.KeyReturn, fyne.KeyEnter} {
			w, c := dialogOnTwoSpans(t, p.dialog, func(w *Window) { show(t, w) })
			tabToButton(t, c, p.button)
			typeToFocused(t, w, key)
			if !p.pressed(w) {
				t.Errorf("%s: %s on its focused button “%s” did not press it", p.dialog, key, p.button)
			}
		}
	}
}

// A form's confirm button is disabled while a field fails its validation,
// as in fyne's form dialog, and Enter in the field does not confirm it then.
func TestFormConfirmWaitsForValidFields(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	name := newEscEntry()
	name.Validator = func(s string) error {
		if strings.TrimSpace(s) == "" {
			return errors.New("type a name")
		}
		return nil
	}
	var answers []bool
	w.showForm("Name it", "Name", []*widget.FormItem{widget.NewFormItem("Name", name)}, func(ok bool) { answers = append(answers, ok) })
	_, _, buttons, _ := dialogWidgets(t, w)
	confirm := buttonNamed(t, buttons, "Name")
	if !confirm.Disabled() {
		t.Error("the confirm button is enabled with the name empty")
	}
	name.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if len(answers) != 0 || w.win.Canvas().Overlays().Top() == nil {
		t.Errorf("Enter with the name empty closed the form (%v)", answers)
	}
	name.SetText("beam")
	if confirm.Disabled() {
		t.Error("the confirm button stays disabled with a name typed")
	}
	name.SetText(" ")
	if !confirm.Disabled() {
		t.Error("the confirm button is enabled again with the name blank")
	}
	name.SetText("beam")
	name.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if !slices.Equal(answers, []bool{true}) || w.win.Canvas().Overlays().Top() != nil {
		t.Errorf("Enter with a name typed: the form answered %v and is open %v, want [true] and closed",
			answers, w.win.Canvas().Overlays().Top() != nil)
	}
}

// look is how a dialog looks: its title, the icon at its top right (""
// for none), its buttons from left to right and its size.
type look struct {
	title, icon string
	buttons     []string // text, icon, importance and whether enabled
	size        fyne.Size
}

// lookOf is the look of the dialog on top of c, laid out as fyne's
// dialogLayout lays it out (dialog/base.go, v2.7): the icon, a
// background, the content, the buttons and the title.
func lookOf(t *testing.T, c fyne.Canvas) look {
	t.Helper()
	p, ok := c.Overlays().Top().(*widget.PopUp)
	if !ok {
		t.Fatalf("the top of the window is %T, not a dialog", c.Overlays().Top())
	}
	parts := p.Content.(*fyne.Container).Objects
	l := look{title: parts[4].(*widget.Label).Text, size: p.Content.Size()}
	if img, ok := parts[0].(*fynecanvas.Image); ok {
		l.icon = img.Resource.Name()
	}
	for _, o := range test.LaidOutObjects(parts[3]) {
		if b := buttonIn(o); b != nil {
			icon := ""
			if b.Icon != nil {
				icon = b.Icon.Name()
			}
			l.buttons = append(l.buttons, fmt.Sprintf("%s|%s|%d|%v", b.Text, icon, b.Importance, !b.Disabled()))
		}
	}
	return l
}

// The dialogs whose buttons the window now makes itself look as fyne's
// own dialogs of their kind did: title, icon, the buttons' text, icon,
// importance and state, and size, on the same window.
func TestDialogsLookAsFynesOwn(t *testing.T) {
	const message = "something went wrong in a message long enough to wrap: the file member.json, line 12, names a support past the end of the member"
	nameItems := func() []*widget.FormItem {
		e := newEscEntry()
		e.SetText("case 3")
		return []*widget.FormItem{widget.NewFormItem("Name", e)}
	}
	content := func() fyne.CanvasObject { return widget.NewLabel("The member was saved, so no work is lost.") }
	for _, c := range []struct {
		name       string
		ours, fyne func(w *Window)
	}{
		{"an error", func(w *Window) { w.showError(errors.New(message)) },
			func(w *Window) { dialog.ShowError(errors.New(message), w.win) }},
		{"a message", func(w *Window) { w.showMessage("Saved", message, theme.InfoIcon()) },
			func(w *Window) { dialog.ShowInformation("Saved", message, w.win) }},
		{"a form", func(w *Window) { w.showForm("Add a load case", "Add", nameItems(), func(bool) {}) },
			func(w *Window) {
				dialog.ShowForm("Add a load case", "Add", "Cancel", nameItems(), func(bool) {}, w.win)
			}},
		{"a confirmation", func(w *Window) {
			d, _ := w.newDialog("Saved", content(), choice{label: "Stay and fix it", icon: theme.CancelIcon()},
				choice{label: "Go on anyway", icon: theme.ConfirmIcon(), importance: widget.HighImportance})
			w.showDialog(d)
		}, func(w *Window) {
			dialog.ShowCustomConfirm("Saved", "Go on anyway", "Stay and fix it", content(), nil, w.win)
		}},
		{"a dialog to close", func(w *Window) {
			d, _ := w.newDialog("Typical materials", content(), choice{label: "Close"})
			w.showDialog(d)
		}, func(w *Window) { dialog.ShowCustom("Typical materials", "Close", content(), w.win) }},
	} {
		ours, _ := newTestWindow(t, demoProject(t))
		c.ours(ours)
		theirs, _ := newTestWindow(t, demoProject(t))
		c.fyne(theirs)
		if got, want := lookOf(t, ours.win.Canvas()), lookOf(t, theirs.win.Canvas()); !reflect.DeepEqual(got, want) {
			t.Errorf("%s looks as\n%+v, fyne's as\n%+v", c.name, got, want)
		}
	}
}

// selectIn is o as a select, or nil when it is none.
func selectIn(o fyne.CanvasObject) *widget.Select {
	switch s := o.(type) {
	case *widget.Select:
		return s
	case *escSelect:
		return &s.Select
	}
	return nil
}

// isTable reports whether o is a table.
func isTable(o fyne.CanvasObject) bool {
	switch o.(type) {
	case *widget.Table, *escTable:
		return true
	}
	return false
}

// choosers are the selects and tables of the dialog on top of c that Tab
// reaches, in the order it reaches them.
func choosers(c fyne.Canvas) []fyne.Focusable {
	var cs []fyne.Focusable
	for _, f := range tabOrder(c) {
		if o := f.(fyne.CanvasObject); selectIn(o) != nil || isTable(o) {
			cs = append(cs, f)
		}
	}
	return cs
}

// dialogsWithChoosers are the dialogs with a select or a table.
var dialogsWithChoosers = []string{"check limits", "the Add form", "section calculator", "typical materials", "combinations", "nodal loads table"}

// Escape with the focus on any select or table of a dialog, where Tab
// puts it, closes the dialog as its Cancel or Close button does: the
// focused select or table took the key and ignored it, so Escape did
// nothing there.
func TestEscapeOnAFocusedSelectOrTable(t *testing.T) {
	for _, d := range escapeDialogs {
		for k := 0; ; k++ {
			w, c := dialogOnTwoSpans(t, d.name, func(w *Window) { d.show(t, w) })
			cs := choosers(c)
			if k == 0 && len(cs) == 0 && slices.Contains(dialogsWithChoosers, d.name) {
				t.Errorf("%s: Tab reaches no select or table", d.name)
			}
			if k >= len(cs) {
				break
			}
			escapeCloses(t, w, c, d.name, d.affirmed, cs[k])
		}
	}
}

// On a select of a dialog whose list is open, Escape closes the list
// alone, as fyne's pop-up menu takes it, leaving the focus on the select
// and its choice as it was; a second Escape closes the dialog. Space
// still opens the list, as in fyne's select.
func TestEscapeClosesAnOpenSelectListFirst(t *testing.T) {
	for _, d := range escapeDialogs {
		w, c := dialogOnTwoSpans(t, d.name, func(w *Window) { d.show(t, w) })
		for _, f := range choosers(c) {
			s := selectIn(f.(fyne.CanvasObject))
			if s == nil {
				continue
			}
			dialogs := len(c.Overlays().List())
			tabTo(t, c, f)
			chosen := s.Selected
			typeToFocused(t, w, fyne.KeySpace)
			if len(c.Overlays().List()) != dialogs+1 {
				t.Fatalf("%s: Space on its %s opened no list", d.name, nameOf(s))
			}
			typeToFocused(t, w, fyne.KeyEscape)
			if n := len(c.Overlays().List()); n != dialogs {
				t.Fatalf("%s: Escape in the open list of its %s left %d overlays, want the %d dialogs", d.name, nameOf(s), n, dialogs)
			}
			if c.Focused() != f || s.Selected != chosen {
				t.Errorf("%s: Escape in the open list of its %s left the focus on %v and the choice %q, want the select and %q",
					d.name, nameOf(s), c.Focused(), s.Selected, chosen)
			}
			before := cloneProject(w.project)
			typeToFocused(t, w, fyne.KeyEscape)
			if len(c.Overlays().List()) != dialogs-1 {
				t.Errorf("%s: a second Escape on its %s left the dialog open", d.name, nameOf(s))
			}
			if !reflect.DeepEqual(w.project, before) || d.affirmed != nil && d.affirmed(w) {
				t.Errorf("%s: a second Escape on its %s did what the dialog's affirmative button does", d.name, nameOf(s))
			}
			break // one select a dialog: the dialog is closed now
		}
	}
}

// The Escape-aware select and table keep fyne's other keys: Right and
// Left step the select's choice, Down opens its list (fyne's
// Select.TypedKey), as Enter does, and in the open list Down moves and
// Enter chooses (fyne's PopUpMenu.TypedKey); Down moves the table's
// focused cell and Space selects it (fyne's Table.TypedKey).
func TestEscapeAwareWidgetsKeepTheirKeys(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	c := w.win.Canvas()
	options := []string{"first", "second", "third"}
	for _, k := range []struct {
		keys []fyne.KeyName
		want string
	}{
		{[]fyne.KeyName{fyne.KeyRight}, "second"},
		{[]fyne.KeyName{fyne.KeyRight, fyne.KeyRight, fyne.KeyRight}, "first"}, // round past the last
		{[]fyne.KeyName{fyne.KeyLeft}, "third"},
	} {
		s := newEscSelect(options, nil)
		s.SetSelectedIndex(0)
		for _, key := range k.keys {
			s.TypedKey(&fyne.KeyEvent{Name: key})
		}
		if s.Selected != k.want {
			t.Errorf("%v on a select at %q chose %q, want %q", k.keys, options[0], s.Selected, k.want)
		}
	}
	s := newEscSelect(options, nil)
	w.win.SetContent(s)
	overlays := len(c.Overlays().List())
	s.TypedKey(&fyne.KeyEvent{Name: fyne.KeyDown})
	if len(c.Overlays().List()) != overlays+1 {
		t.Error("Down on a select opened no list")
	}
	c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
	s.SetSelectedIndex(0)
	c.Focus(s)
	for _, key := range []fyne.KeyName{fyne.KeyReturn, fyne.KeyDown, fyne.KeyDown, fyne.KeyReturn} {
		c.Focused().TypedKey(&fyne.KeyEvent{Name: key})
	}
	if s.Selected != "second" || len(c.Overlays().List()) != overlays {
		t.Errorf("Enter, Down, Down, Enter on a select at %q chose %q with %d lists open, want %q and none",
			options[0], s.Selected, len(c.Overlays().List())-overlays, "second")
	}

	var selected []widget.TableCellID
	tb := newEscTable(func() (int, int) { return 3, 2 }, func() fyne.CanvasObject { return widget.NewLabel("") },
		func(widget.TableCellID, fyne.CanvasObject) {})
	tb.OnSelected = func(id widget.TableCellID) { selected = append(selected, id) }
	for _, key := range []fyne.KeyName{fyne.KeyDown, fyne.KeyRight, fyne.KeySpace} {
		tb.TypedKey(&fyne.KeyEvent{Name: key})
	}
	if want := []widget.TableCellID{{Row: 1, Col: 1}}; !reflect.DeepEqual(selected, want) {
		t.Errorf("Down, Right, Space on a table selected %v, want %v", selected, want)
	}
}
