package app

import (
	"errors"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/widget"

	"stave/storage"
)

// textProblems are the problems storage finds in p at path or below it:
// the window checks texts typed into it by the rules a file must meet
// (length, no control or direction-changing characters) before it takes them.
func textProblems(p *storage.Project, path string) []storage.Problem {
	var le *storage.LoadError
	if !errors.As(storage.Validate(p), &le) {
		return nil
	}
	var out []storage.Problem
	for _, q := range le.Problems {
		if q.Path == path || strings.HasPrefix(q.Path, path+".") {
			out = append(out, q)
		}
	}
	return out
}

// notesField is one text of the notes form: its label, the file's path
// of it, and where it lives in storage.Notes.
type notesField struct {
	label, path string
	text        func(n *storage.Notes) *string
	placeHolder string
}

var notesFields = []notesField{
	{"Project", "notes.project", func(n *storage.Notes) *string { return &n.Project }, "name or number"},
	{"Member mark", "notes.member", func(n *storage.Notes) *string { return &n.Member }, "e.g. J-3"},
	{"Engineer", "notes.engineer", func(n *storage.Notes) *string { return &n.Engineer }, ""},
	{"Date", "notes.date", func(n *storage.Notes) *string { return &n.Date }, "e.g. 2025-03-14"},
	{"Remarks", "notes.text", func(n *storage.Notes) *string { return &n.Text }, "assumptions, sources of values…"},
}

// notesForm is the content of the notes dialog.
type notesForm struct {
	entries []*escEntry
	labels  []*widget.Label
	message *widget.Label
	content fyne.CanvasObject
}

func newNotesForm(n storage.Notes) *notesForm {
	f := &notesForm{message: widget.NewLabel("")}
	f.message.Wrapping = fyne.TextWrapWord
	f.message.Importance = widget.DangerImportance
	form := container.New(layout.NewFormLayout())
	for _, nf := range notesFields {
		e := newEscEntry()
		if nf.path == "notes.text" {
			// Lines as typed: wrapping a long text in an entry takes the
			// toolkit seconds per few thousand characters.
			e.MultiLine = true
			e.Wrapping = fyne.TextWrapOff
			e.SetMinRowsVisible(5)
		}
		e.SetText(*nf.text(&n))
		e.SetPlaceHolder(nf.placeHolder)
		l := widget.NewLabel(nf.label)
		f.entries, f.labels = append(f.entries, e), append(f.labels, l)
		form.Add(l)
		form.Add(e)
	}
	note := widget.NewLabel("The project, member mark, engineer and date head the calculation sheet; all five are saved in the file.")
	note.Wrapping = fyne.TextWrapWord
	note.Importance = widget.LowImportance
	f.content = container.NewVBox(form, note, f.message)
	return f
}

// notes returns the typed notes, or shows what is wrong with them, each
// problem under the name of its field, and returns false.
func (f *notesForm) notes(p storage.Project) (storage.Notes, bool) {
	for i, nf := range notesFields {
		*nf.text(&p.Notes) = f.entries[i].Text
	}
	var lines []string
	for i, nf := range notesFields {
		problems := textProblems(&p, nf.path)
		f.labels[i].Importance = widget.MediumImportance
		if len(problems) > 0 {
			f.labels[i].Importance = widget.DangerImportance
			lines = append(lines, nf.label+": "+problems[0].Message)
		}
		f.labels[i].Refresh()
	}
	f.message.SetText(strings.Join(lines, "\n"))
	return p.Notes, len(lines) == 0
}

// showNotesForm edits the notes of the project.
func (w *Window) showNotesForm() {
	f := newNotesForm(w.project.Notes)
	var d *dialog.CustomDialog
	keep := func() {
		n, ok := f.notes(cloneProject(w.project))
		if !ok {
			return
		}
		d.Hide()
		if n != w.project.Notes {
			w.project.Notes = n
			w.updateTitle()
			w.setStatus("notes changed: they are saved with the member and head the calculation sheet")
		}
	}
	d, _ = w.newDialog("Notes for the calculation sheet", f.content, choice{label: "Cancel"},
		choice{label: "Keep these notes", importance: widget.HighImportance, run: keep, stays: true})
	d.Resize(fyne.NewSize(620, 460))
	for _, e := range f.entries {
		e.OnEscape = w.escape
	}
	w.showDialog(d)
	w.win.Canvas().Focus(f.entries[0])
}
