package app

import (
	"slices"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"
)

// dialogStack holds the dialogs open on a window, the last shown on top,
// so that Escape can close the top one. Every dialog of the window is
// shown through show.
type dialogStack struct {
	open []dialog.Dialog
}

// show shows d; until it closes, Escape dismisses it as its Cancel or
// Close button does (dismiss).
func (s *dialogStack) show(d dialog.Dialog) {
	s.open = append(s.open, d)
	d.SetOnClosed(func() {
		s.open = slices.DeleteFunc(s.open, func(o dialog.Dialog) bool { return o == d })
	})
	d.Show()
}

// dismiss closes the top dialog without its affirmative action, and
// reports whether one was open.
func (s *dialogStack) dismiss() bool {
	if len(s.open) == 0 {
		return false
	}
	s.open[len(s.open)-1].Dismiss()
	return true
}

// showDialog shows d on the window: every dialog of the window goes
// through it, so that Escape closes it.
func (w *Window) showDialog(d dialog.Dialog) { w.dialogs.show(d) }

// escape is what Escape does in an entry of the window: it closes the
// dialog on top as its Cancel button does, leaving what was typed there
// unused, or, with no dialog open (in the properties panel), gives the
// focus back to the drawing, where the keys of the menus act, leaving
// what was typed and not applied in the entry.
func (w *Window) escape() {
	if !w.dialogs.dismiss() {
		w.win.Canvas().Focus(w.draw)
	}
}

// escEntry is an entry that hands Escape to OnEscape (which the window
// sets to its escape): a focused widget takes every key, so without it
// Escape in a field of a dialog did nothing. A single-line one selects
// its text when it gains the focus, so that what is typed replaces it:
// fyne leaves the cursor at the start, and 5 typed into a settlement of
// "0" reached by Tab read 50 mm. A click places the cursor all the same
// (fyne's MouseDown drops the selection after taking the focus).
type escEntry struct {
	widget.Entry
	focusHook
	OnEscape func()
}

// FocusGained is part of fyne.Focusable.
func (e *escEntry) FocusGained() {
	e.Entry.FocusGained()
	if !e.MultiLine {
		e.TypedShortcut(&fyne.ShortcutSelectAll{})
	}
	e.focused()
}

// newEscEntry is an empty single-line escEntry.
func newEscEntry() *escEntry {
	e := &escEntry{}
	e.ExtendBaseWidget(e)
	return e
}

// TypedKey is part of fyne.Focusable.
func (e *escEntry) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && e.OnEscape != nil {
		e.OnEscape()
		return
	}
	e.Entry.TypedKey(k)
}

// escSelect is a select that hands Escape to OnEscape (which the window
// sets to its escape), as escEntry does in a field: fyne's select ignores
// Escape, so with the focus on a select of a dialog Escape did nothing.
// Enter (Return, or Enter on the keypad) opens its list, as Space does:
// fyne's select ignored it, where a keyboard user expects a closed list
// to open (common practice). Its other keys are fyne's: Space, Up and
// Down open its list, Left and Right step its choice. With the list open
// the list has the focus and takes the keys itself: Up and Down move in
// it, Enter or Space chooses, Escape closes the list alone (fyne's
// PopUpMenu.TypedKey), so that a second Escape closes the dialog.
type escSelect struct {
	widget.Select
	focusHook
	OnEscape func()
}

// FocusGained is part of fyne.Focusable.
func (s *escSelect) FocusGained() {
	s.Select.FocusGained()
	s.focused()
}

// newEscSelect is an escSelect of options calling changed on a change,
// as widget.NewSelect makes a select (fyne gives it its placeholder as it
// draws it).
func newEscSelect(options []string, changed func(string)) *escSelect {
	s := &escSelect{Select: widget.Select{Options: options, OnChanged: changed}}
	s.ExtendBaseWidget(s)
	return s
}

// TypedKey is part of fyne.Focusable.
func (s *escSelect) TypedKey(k *fyne.KeyEvent) {
	switch {
	case k.Name == fyne.KeyEscape && s.OnEscape != nil:
		s.OnEscape()
	case k.Name == fyne.KeyReturn || k.Name == fyne.KeyEnter:
		s.Select.TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace, Physical: k.Physical})
	default:
		s.Select.TypedKey(k)
	}
}

// newSelect is a select of the window's panels (newEscSelect) on which
// Escape does what it does in the panels' entries (escape): it gives the
// focus back to the drawing, where it did nothing before.
func (w *Window) newSelect(options []string, changed func(string)) *escSelect {
	s := newEscSelect(options, changed)
	s.OnEscape = w.escape
	return s
}

// escTable is a table that hands Escape to OnEscape (which the window
// sets to its escape): fyne's table takes the focus and ignores Escape.
// Its other keys are fyne's: the arrows move its focused cell, Space
// selects it.
type escTable struct {
	widget.Table
	OnEscape func()
}

// newEscTable is an escTable as widget.NewTable makes a table.
func newEscTable(length func() (rows, cols int), create func() fyne.CanvasObject, update func(widget.TableCellID, fyne.CanvasObject)) *escTable {
	t := &escTable{Table: widget.Table{Length: length, CreateCell: create, UpdateCell: update}}
	t.ExtendBaseWidget(t)
	return t
}

// TypedKey is part of fyne.Focusable.
func (t *escTable) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && t.OnEscape != nil {
		t.OnEscape()
		return
	}
	t.Table.TypedKey(k)
}

// escCheck is a check box that hands Escape to OnEscape, as escEntry does
// in a field: fyne's check ignores Escape. Its other keys are fyne's:
// Space ticks it or clears it.
type escCheck struct {
	widget.Check
	focusHook
	OnEscape func()
}

// FocusGained is part of fyne.Focusable.
func (c *escCheck) FocusGained() {
	c.Check.FocusGained()
	c.focused()
}

// newEscCheck is an escCheck reading label, calling changed on a change,
// as widget.NewCheck makes a check box.
func newEscCheck(label string, changed func(bool)) *escCheck {
	c := &escCheck{Check: widget.Check{Text: label, OnChanged: changed}}
	c.ExtendBaseWidget(c)
	return c
}

// TypedKey is part of fyne.Focusable.
func (c *escCheck) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && c.OnEscape != nil {
		c.OnEscape()
		return
	}
	c.Check.TypedKey(k)
}

// newCheck is a check box of the window's panels on which Escape gives the
// focus back to the drawing (escape), as on the panels' fields.
func (w *Window) newCheck(label string, changed func(bool)) *escCheck {
	c := newEscCheck(label, changed)
	c.OnEscape = w.escape
	return c
}

// escSlider is a slider that hands Escape to OnEscape, as escEntry does in
// a field: fyne's slider ignores Escape. Its other keys are fyne's: the
// arrows move it.
type escSlider struct {
	widget.Slider
	OnEscape func()
}

// newSlider is a slider of the window's panels from lowest to highest, as
// widget.NewSlider makes one, on which Escape gives the focus back to the
// drawing (escape).
func (w *Window) newSlider(lowest, highest float64) *escSlider {
	s := &escSlider{Slider: widget.Slider{Min: lowest, Max: highest, Step: 1, Orientation: widget.Horizontal}, OnEscape: w.escape}
	s.ExtendBaseWidget(s)
	return s
}

// TypedKey is part of fyne.Focusable.
func (s *escSlider) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && s.OnEscape != nil {
		s.OnEscape()
		return
	}
	s.Slider.TypedKey(k)
}
