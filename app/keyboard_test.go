package app

import (
	"image/color"
	"math"
	"reflect"
	"slices"
	"strconv"
	"testing"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
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
		if f, ok := c.Focused().(fyne.CanvasObject); ok {
			if b := buttonIn(f); b != nil && b.Text == text {
				return
			}
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

// The focus shows on a button of high importance (the active tool, the
// properties' Apply): fyne shades a focused button with its focus colour,
// blue at a sixth of full strength, which on a blue button changed its
// colour from (41, 111, 246) to (34, 111, 247) in a screenshot of the
// window, so the first stop of Tab, the Pick tool, looked unfocused. Such
// a button draws a ring in the text colour while it has the focus, in
// contrast with the button of at least 3:1 (WCAG 2.1, success criterion
// 1.4.11, non-text contrast; from memory).
func TestFocusShowsOnStrongButtons(t *testing.T) {
	w, _ := openTestdata(t, "two_span_cases.json", laptop)
	c := w.win.Canvas()
	c.Unfocus()
	c.FocusNext()
	pick, ok := c.Focused().(*ringButton)
	if !ok || pick.Text != "Pick  (Q)" {
		t.Fatalf("the first stop of Tab is %T, want the Pick tool", c.Focused())
	}
	w.selectItem(canvas.Ref{Kind: canvas.Member})
	var apply *ringButton
	for _, o := range test.LaidOutObjects(w.ui.properties) {
		if b, ok := o.(*ringButton); ok && b.Text == "Apply" {
			apply = b
		}
	}
	if apply == nil {
		t.Fatal("no Apply button of high importance in the properties")
	}
	// In the window's themes, dark and light (the test app has a theme
	// of its own).
	for _, v := range []fyne.ThemeVariant{theme.VariantDark, theme.VariantLight} {
		fyne.CurrentApp().Settings().SetTheme(variantTheme{theme.DefaultTheme(), v})
		for _, b := range []*ringButton{pick, apply} {
			c.Focus(b)
			if !slices.Contains(test.WidgetRenderer(b).Objects(), fyne.CanvasObject(b.ring)) {
				t.Errorf("%q: its ring is not drawn", b.Text)
			}
			for _, n := range []fyne.ThemeColorName{theme.ColorNamePrimary, theme.ColorNameBackground} {
				if r := contrast(b.ring.StrokeColor, theme.Color(n)); b.ring.StrokeWidth < 1 || r < 3 {
					t.Errorf("variant %d, %q in focus: a ring %v px wide, contrast %.2f:1 with the colour %s", v, b.Text, b.ring.StrokeWidth, r, n)
				}
			}
			c.Unfocus()
			if _, _, _, a := b.ring.StrokeColor.RGBA(); a != 0 {
				t.Errorf("%q out of focus keeps its ring", b.Text)
			}
		}
	}
}

// variantTheme is a theme in one variant, whatever the settings say.
type variantTheme struct {
	fyne.Theme
	variant fyne.ThemeVariant
}

func (t variantTheme) Color(n fyne.ThemeColorName, _ fyne.ThemeVariant) color.Color {
	return t.Theme.Color(n, t.variant)
}

// contrast is the contrast ratio of two colours, (L1 + 0.05)/(L2 + 0.05)
// of their relative luminances (WCAG 2.1, definitions of contrast ratio
// and relative luminance; from memory), alpha ignored.
func contrast(a, b color.Color) float64 {
	lum := func(c color.Color) float64 {
		r, g, bl, _ := c.RGBA()
		lin := func(v uint32) float64 {
			s := float64(v) / 0xffff
			if s <= 0.03928 {
				return s / 12.92
			}
			return math.Pow((s+0.055)/1.055, 2.4)
		}
		return 0.2126*lin(r) + 0.7152*lin(g) + 0.0722*lin(bl)
	}
	la, lb := lum(a), lum(b)
	return (max(la, lb) + 0.05) / (min(la, lb) + 0.05)
}

// The drawing and the moving loads picture, white, show the focus with a
// frame that stands out from them and from the window round them, at
// least 3:1 (WCAG 2.1, success criterion 1.4.11; from memory), in the
// window's themes. The frame was in fyne's focus colour, a blue at a
// sixth of full strength: about 1.2:1 on white.
func TestPicturesShowTheFocus(t *testing.T) {
	w, q, mw := runwayWindow(t)
	finished(t, w, q)
	white := color.NRGBA{R: 0xfb, G: 0xfb, B: 0xf8, A: 0xff} // the drawing's paper
	for _, v := range []fyne.ThemeVariant{theme.VariantDark, theme.VariantLight} {
		fyne.CurrentApp().Settings().SetTheme(variantTheme{theme.DefaultTheme(), v})
		for name, f := range map[string]struct {
			c     fyne.Canvas
			o     fyne.Focusable
			frame *fynecanvas.Rectangle
		}{"drawing": {w.win.Canvas(), w.draw, w.draw.frame}, "moving loads picture": {mw.win.Canvas(), mw.pic, mw.pic.frame}} {
			f.c.Focus(f.o)
			seen := over(f.frame.StrokeColor, white)
			for _, against := range []color.Color{white, theme.Color(theme.ColorNameBackground)} {
				if r := contrast(seen, against); r < 3 {
					t.Errorf("variant %d, the %s in focus: a frame of %v (%v on the paper), contrast %.2f:1 with %v", v, name, f.frame.StrokeColor, seen, r, against)
				}
			}
			f.c.Unfocus()
		}
	}
}

// over is a drawn over b, as a translucent a shows.
func over(a, b color.Color) color.Color {
	ar, ag, ab, aa := a.RGBA() // premultiplied
	br, bg, bb, _ := b.RGBA()
	mix := func(x, y uint32) uint8 { return uint8((x + y*(0xffff-aa)/0xffff) >> 8) }
	return color.NRGBA{R: mix(ar, br), G: mix(ag, bg), B: mix(ab, bb), A: 0xff}
}

// The strong buttons of the window's own dialogs (Add, Fill, Keep these
// notes, Save, Discard changes) show the focus with the ring, as Apply and
// the tools do: fyne's focus shading does not show on a blue or red
// button, so Tab reached them unseen.
func TestDialogsStrongButtonsShowTheFocus(t *testing.T) {
	dialogs := []struct {
		name string
		show func(w *Window)
	}{
		{"the Add form", func(w *Window) { w.showAddForm() }},
		{"the section calculator", func(w *Window) { w.showSectionCalculator() }},
		{"the typical materials", func(w *Window) { w.showMaterials() }},
		{"the notes", func(w *Window) { w.showNotesForm() }},
		{"unsaved changes", func(w *Window) {
			w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.5; return nil })
			w.newProject()
		}},
	}
	for _, d := range dialogs {
		w, _ := newTestWindow(t, demoProject(t))
		d.show(w)
		top := w.win.Canvas().Overlays().Top()
		if top == nil {
			t.Fatalf("%s: no dialog showing", d.name)
		}
		strong := 0
		for _, o := range test.LaidOutObjects(top) {
			switch b := o.(type) {
			case *ringButton, *dialogButton:
				strong++
			case *widget.Button:
				if b.Importance == widget.HighImportance || b.Importance == widget.DangerImportance {
					t.Errorf("%s: the button %q shows no ring in focus", d.name, b.Text)
				}
			}
		}
		if strong == 0 {
			t.Errorf("%s: no button with a focus ring", d.name)
		}
	}
}

// selectsOf are the selects Tab reaches on c from no focus.
func selectsOf(c fyne.Canvas) []fyne.Focusable {
	var ss []fyne.Focusable
	for _, f := range tabOrder(c) {
		if selectIn(f.(fyne.CanvasObject)) != nil {
			ss = append(ss, f)
		}
	}
	return ss
}

// Enter (Return, or Enter on the keypad) on a select where Tab puts it
// opens its list, as Space does, and the list takes the focus: fyne's
// select ignored Enter, so a keyboard user got a list only by Space or an
// arrow. Every select of the window's panels (a support selected, so that
// its kind is offered), of its dialogs and of the moving-loads window.
func TestEnterOpensASelectsList(t *testing.T) {
	places := []struct {
		name string
		open func(t *testing.T) fyne.Canvas
	}{
		{"the panels", func(t *testing.T) fyne.Canvas {
			w, _ := openTestdata(t, "two_span_cases.json", laptop)
			w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 0})
			return w.win.Canvas()
		}},
		{"the moving-loads window", func(t *testing.T) fyne.Canvas {
			_, _, mw := runwayWindow(t)
			return mw.win.Canvas()
		}},
	}
	for _, d := range escapeDialogs {
		if slices.Contains(dialogsWithChoosers, d.name) && d.name != "nodal loads table" { // a table alone
			places = append(places, struct {
				name string
				open func(t *testing.T) fyne.Canvas
			}{"the dialog " + d.name, func(t *testing.T) fyne.Canvas {
				_, c := dialogOnTwoSpans(t, d.name, func(w *Window) { d.show(t, w) })
				return c
			}})
		}
	}
	for _, p := range places {
		c := p.open(t)
		selects := selectsOf(c)
		if len(selects) == 0 {
			t.Errorf("%s: Tab reaches no select", p.name)
		}
		for _, f := range selects {
			for _, key := range []fyne.KeyName{fyne.KeyReturn, fyne.KeyEnter} {
				tabTo(t, c, f)
				overlays := len(c.Overlays().List())
				f.TypedKey(&fyne.KeyEvent{Name: key})
				if len(c.Overlays().List()) != overlays+1 || c.Focused() == f {
					t.Errorf("%s: %s on its %s opened no list", p.name, key, nameOf(f.(fyne.CanvasObject)))
					continue
				}
				c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape}) // closes the list alone
			}
		}
	}
}

// Escape on any widget of the panels where Tab puts it (a select, a
// table, a field, a switch, the slider, a button) gives the focus back to
// the drawing, as Escape in the properties' numbers did already
// (Window.escape), and leaves the selection and the member as they were;
// a second Escape, on the drawing, selects nothing (keyNothing). Every one
// of them but those numbers took the key and ignored it, so the focus
// stayed where it was. With a support and with a segment selected, whose
// properties differ.
func TestEscapeInThePanelsGoesToTheDrawing(t *testing.T) {
	for _, selected := range []canvas.Ref{{Kind: canvas.Support, Index: 0}, {Kind: canvas.Segment, Index: 0}} {
		w, _ := openTestdata(t, "two_span_cases.json", laptop)
		c := w.win.Canvas()
		w.selectItem(selected)
		kinds := map[string]int{}
		for _, f := range tabOrder(c) {
			o := f.(fyne.CanvasObject)
			var kind string
			switch o.(type) {
			case *drawing:
				continue
			case *escSelect, *widget.Select:
				kind = "select"
			case *escTable, *widget.Table:
				kind = "table"
			case *escEntry, *widget.Entry:
				kind = "entry"
			case *escCheck, *widget.Check:
				kind = "switch"
			case *escSlider, *widget.Slider:
				kind = "slider"
			default:
				kind = "button"
			}
			kinds[kind]++
			tabTo(t, c, f)
			before := cloneProject(w.project)
			f.TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
			if any(c.Focused()) != any(w.draw) {
				t.Errorf("%s selected: Escape on the %s left the focus on %s, want the drawing", selected.Kind, nameOf(o), focusName(c))
			}
			if w.selected != selected || !reflect.DeepEqual(w.project, before) || c.Overlays().Top() != nil {
				t.Errorf("%s selected: Escape on the %s changed the selection to %+v, or the member, or opened a dialog", selected.Kind, nameOf(o), w.selected)
				w.selectItem(selected)
			}
		}
		for _, kind := range []string{"select", "table", "entry", "switch", "slider", "button"} {
			if kinds[kind] == 0 {
				t.Errorf("%s selected: Tab reaches no %s in the panels", selected.Kind, kind)
			}
		}
		typeToFocused(t, w, fyne.KeyEscape)
		if w.selected != canvasNone {
			t.Errorf("%s selected: a second Escape, on the drawing, left %+v selected, want nothing", selected.Kind, w.selected)
		}
	}
}

// focusName names what has the focus on c, to name it in a failure.
func focusName(c fyne.Canvas) string {
	if f := c.Focused(); f != nil {
		return nameOf(f.(fyne.CanvasObject))
	}
	return "nothing"
}

// Escape closes the moving-loads window, as it closes a dialog of the
// main window, with the focus nowhere and with it on any widget Tab
// reaches there (the picture too), leaving the project's trains as they
// were though a field holds a change not applied; on a select whose list
// is open, the first Escape closes the list alone. Escape did nothing
// there: the window's canvas had no keys of its own, and fyne's entries,
// selects, check boxes and buttons ignore Escape.
func TestEscapeClosesTheMovingLoadsWindow(t *testing.T) {
	for k := -1; ; k++ {
		w, _, mw := runwayWindow(t)
		c := mw.win.Canvas()
		order := tabOrder(c)
		if k == 0 && len(order) == 0 {
			t.Fatal("Tab reaches nothing in the moving-loads window")
		}
		if k >= len(order) {
			break
		}
		mw.name.SetText("a name not applied")
		before := cloneProject(w.project)
		what := "with the focus nowhere"
		if k < 0 {
			c.Unfocus()
			if typed := c.OnTypedKey(); typed != nil { // as the driver gives the canvas a key no widget takes
				typed(&fyne.KeyEvent{Name: fyne.KeyEscape})
			}
		} else {
			f := order[k]
			what = "on its " + nameOf(f.(fyne.CanvasObject))
			tabTo(t, c, f)
			if selectIn(f.(fyne.CanvasObject)) != nil {
				f.TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace})
				c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
				if w.moving == nil || c.Focused() != f {
					t.Errorf("the moving-loads window: Escape in the open list of its %s closed the window, or left the focus off the select", nameOf(f.(fyne.CanvasObject)))
					continue
				}
			}
			f.TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
		}
		if w.moving != nil {
			t.Errorf("the moving-loads window: Escape %s left it open", what)
		}
		if !reflect.DeepEqual(w.project, before) {
			t.Errorf("the moving-loads window: Escape %s changed the project", what)
		}
	}
}

// inSight reports whether o, in the content of s, lies whole in the view of s.
func inSight(s *container.Scroll, o fyne.CanvasObject) bool {
	d := fyne.CurrentApp().Driver()
	at := d.AbsolutePositionForObject(o).Subtract(d.AbsolutePositionForObject(s))
	return at.Y >= -0.5 && at.Y+o.Size().Height <= s.Size().Height+0.5
}

// scrollOf is the first scroll among the objects under root.
func scrollOf(t *testing.T, root fyne.CanvasObject) *container.Scroll {
	t.Helper()
	for _, o := range test.LaidOutObjects(root) {
		if s, ok := o.(*container.Scroll); ok {
			return s
		}
	}
	t.Fatal("no scroll")
	return nil
}

// Tab and Shift+Tab bring the widget they put the focus on into sight in
// a pane that scrolls: on a laptop's screen the properties of a support
// show its kind and three of its four numbers, and the moving-loads form
// stops above its Apply, and Tab put the focus (and what was typed) out of
// sight, as a screenshot of the window at 1280 × 720 showed.
func TestTabScrollsTheFocusIntoSight(t *testing.T) {
	for _, p := range []struct {
		name string
		open func(t *testing.T) (fyne.Canvas, *container.Scroll)
	}{
		{"the properties of a support", func(t *testing.T) (fyne.Canvas, *container.Scroll) {
			w, _ := openTestdata(t, "two_span_cases.json", laptop)
			w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 0})
			return w.win.Canvas(), scrollOf(t, w.ui.properties)
		}},
		{"the moving-loads form", func(t *testing.T) (fyne.Canvas, *container.Scroll) {
			_, _, mw := runwayWindow(t)
			mw.win.Resize(laptop)
			return mw.win.Canvas(), mw.formScroll
		}},
	} {
		c, s := p.open(t)
		var inside []fyne.Focusable
		for _, f := range tabOrder(c) {
			if slices.Contains(test.LaidOutObjects(s.Content), f.(fyne.CanvasObject)) {
				inside = append(inside, f)
			}
		}
		hidden := 0
		for _, f := range inside {
			if !inSight(s, f.(fyne.CanvasObject)) {
				hidden++
			}
		}
		if hidden == 0 {
			t.Fatalf("%s: every one of its %d widgets is in sight already; the test needs one out of sight", p.name, len(inside))
		}
		c.Focus(inside[0])
		for i, f := range inside {
			if i > 0 {
				c.FocusNext()
			}
			if c.Focused() != f || !inSight(s, f.(fyne.CanvasObject)) {
				t.Errorf("%s: Tab to its %s left it out of sight", p.name, nameOf(f.(fyne.CanvasObject)))
			}
		}
		for i := len(inside) - 2; i >= 0; i-- {
			c.FocusPrevious()
			if f := inside[i]; c.Focused() != f || !inSight(s, f.(fyne.CanvasObject)) {
				t.Errorf("%s: Shift+Tab back to its %s left it out of sight", p.name, nameOf(f.(fyne.CanvasObject)))
			}
		}
	}
}

// A form opens with the text of its first field selected, so that what
// is typed replaces it: "wind" typed into a new load case's name read
// "windcase 1", and 250 typed into the deflection limit read "250360.0".
func TestFormsTypeOverTheirFirstField(t *testing.T) {
	for _, c := range []struct {
		name  string
		open  func(w *Window)
		typed string
		got   func(w *Window) string
		want  string
	}{
		{"a new load case", (*Window).addCase, "wind",
			func(w *Window) string { m := w.Model(); return m.Cases[len(m.Cases)-1].Name }, "wind"},
		{"a renamed load case", (*Window).renameCase, "dead",
			func(w *Window) string { return w.Model().Cases[w.editCase].Name }, "dead"},
		{"the deflection limit", (*Window).showCheckLimits, "250",
			func(w *Window) string { return strconv.FormatFloat(w.project.View.DeflectionLimit, 'g', -1, 64) }, "250"},
	} {
		w, _ := openTestdata(t, "two_span_cases.json", laptop)
		cv := w.win.Canvas()
		c.open(w)
		f := cv.Focused()
		if f == nil {
			t.Fatalf("%s: the form opened with nothing in focus", c.name)
		}
		test.Type(f, c.typed)
		f.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
		if cv.Overlays().Top() != nil {
			t.Fatalf("%s: Enter left the form open", c.name)
		}
		if got := c.got(w); got != c.want {
			t.Errorf("%s: typing %q into the form gave %q, want %q", c.name, c.typed, got, c.want)
		}
	}
}
