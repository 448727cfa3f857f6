package app

import (
	"unicode"
	"unicode/utf8"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/lang"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
)

// dialogButton is a button of a dialog of the window. A focused widget
// takes every key, and fyne's button ignores Escape, so with the focus on
// a dialog's button (after Tab) Escape did nothing; this one hands Escape
// to onEscape (the window's escape, which closes the dialog on top as its
// Cancel or Close button does), as escEntry does in a field. Enter presses
// it, as Space does. The moving-loads window has such buttons too, whose
// onEscape closes that window (movingWindow.newButton).
type dialogButton struct {
	ringButton
}

// newDialogButton is a button of a dialog of w reading label that runs
// tapped, with a ring round it in focus (ringButton).
func (w *Window) newDialogButton(label string, tapped func()) *dialogButton {
	b := &dialogButton{}
	b.setUp(label, tapped)
	b.onEscape = w.escape
	b.ExtendBaseWidget(b)
	return b
}

// TypedKey is part of fyne.Focusable.
func (b *dialogButton) TypedKey(k *fyne.KeyEvent) {
	switch k.Name {
	case fyne.KeyEscape:
		b.onEscape()
	case fyne.KeyReturn, fyne.KeyEnter:
		b.Tapped(nil) // which does nothing while the button is disabled
	default:
		b.Button.TypedKey(k)
	}
}

// choice is one button of a dialog's row.
type choice struct {
	label      string
	icon       fyne.Resource // none when nil
	importance widget.Importance
	run        func() // what the button does besides closing the dialog; may be nil
	// stays is true for a button that leaves the dialog open: its run
	// closes the dialog once it has done its work (Add, Keep these notes).
	stays bool
}

// newDialog makes a dialog of the window with title and content and a row
// of buttons, a dialogButton per choice from left to right, which it
// returns too. Every dialog of the window gets its buttons here, so that
// Escape works with the focus on one of them; only fyne's file dialogs,
// the fallback for the system's (chooseFile), have fyne's own buttons.
// A button closes the dialog and runs its choice; closing it in any other
// way (Escape) runs the first choice, the cautious one (Cancel, Close,
// Not now).
func (w *Window) newDialog(title string, content fyne.CanvasObject, choices ...choice) (*dialog.CustomDialog, []*dialogButton) {
	d := dialog.NewCustomWithoutButtons(title, content, w.win)
	chosen, closed := false, false
	d.SetOnClosed(func() {
		closed = true
		if !chosen && choices[0].run != nil {
			choices[0].run()
		}
	})
	buttons := make([]*dialogButton, len(choices))
	row := make([]fyne.CanvasObject, len(choices))
	for i, c := range choices {
		b := w.newDialogButton(c.label, func() {
			chosen = true
			if !c.stays {
				d.Hide()
			}
			if c.run != nil {
				c.run()
			}
			if !closed { // a button that left the dialog open leaves Escape to cancel
				chosen = false
			}
		})
		b.Icon, b.Importance = c.icon, c.importance
		buttons[i], row[i] = b, b
	}
	d.SetButtons(row)
	return d, buttons
}

// dialogPadWidth is the width, px, a dialog takes beside its content, to
// which its pop-up adds the theme's inner padding (fyne's dialog padWidth
// and popUpBaseRenderer.padding, v2.7).
const dialogPadWidth = 32

// The widest a message dialog grows, px, and at most this fraction of the
// window's width (fyne's maxTextDialogAbsoluteWidth and
// maxTextDialogWinPcntWidth, dialog/text.go, v2.7).
const (
	messageMaxWidth       = 600
	messageMaxWindowShare = 0.9
)

// showMessage shows message under title in a dialog with icon at its top
// right and an OK button, as fyne's information and error dialogs look:
// the text centred and wrapped, the dialog as wide as the text needs on
// one line as far as messageMaxWidth and messageMaxWindowShare allow.
func (w *Window) showMessage(title, message string, icon fyne.Resource) {
	label := &widget.Label{Text: message, Alignment: fyne.TextAlignCenter, Wrapping: fyne.TextWrapWord}
	d, _ := w.newDialog(title, label, choice{label: lang.L("OK")})
	d.SetIcon(icon)
	oneLine := widget.NewLabel(message).MinSize().Width + dialogPadWidth + 2*theme.Padding()
	width := min(oneLine, messageMaxWidth, messageMaxWindowShare*w.win.Canvas().Size().Width)
	// The height is the dialog's with the label not yet laid out, a line
	// high, as fyne measures it; setting the buttons and the icon laid
	// it out in a dialog yet unsized, a word a line, far too high.
	label.Resize(fyne.Size{})
	d.Resize(fyne.NewSize(width, d.MinSize().Height))
	w.showDialog(d)
}

// showError shows err in a dialog, its first letter a capital, as fyne's
// error dialog does.
func (w *Window) showError(err error) {
	text := err.Error()
	if r, size := utf8.DecodeRuneInString(text); r != utf8.RuneError {
		text = string(unicode.ToUpper(r)) + text[size:]
	}
	w.showMessage(lang.L("Error"), text, theme.ErrorIcon())
}

// showForm shows a dialog of a few fields, laid out as fyne's form dialog
// lays them out, with Cancel and confirm buttons and the focus in its
// first field; done gets whether confirm was pressed. The confirm button
// is disabled while a field fails its validation. Enter in any field
// confirms it, as the confirm button does, as Enter does in the Add form
// and the properties, and Escape, in a field or on a choice, cancels it.
func (w *Window) showForm(title, confirm string, items []*widget.FormItem, done func(bool)) *dialog.CustomDialog {
	form := widget.NewForm(items...)
	d, buttons := w.newDialog(title, form,
		choice{label: "Cancel", icon: theme.CancelIcon(), run: func() { done(false) }},
		choice{label: confirm, icon: theme.ConfirmIcon(), importance: widget.HighImportance, run: func() { done(true) }})
	submit := buttons[1]
	validated := func(err error) {
		if err != nil {
			submit.Disable()
			return
		}
		submit.Enable()
	}
	validated(form.Validate())
	form.SetOnValidationChanged(validated)
	var first *escEntry
	for _, it := range items {
		switch e := it.Widget.(type) {
		case *escEntry:
			e.OnSubmitted = func(string) { submit.Tapped(nil) }
			e.OnEscape = w.escape
			if first == nil {
				first = e
			}
		case *escSelect:
			e.OnEscape = w.escape
		}
	}
	w.showDialog(d)
	if first != nil {
		w.win.Canvas().Focus(first)
	}
	return d
}
