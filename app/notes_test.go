package app

import (
	"path/filepath"
	"strings"
	"testing"

	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/storage"
)

// The notes typed in the form are kept in the project, saved in the file
// and shown again when it is opened.
func TestNotesRoundTrip(t *testing.T) {
	want := storage.Notes{Project: "Footbridge 7", Member: "J-3", Engineer: "A. N. Engineer", Date: "2025-03-14",
		Text: "Loads from the brief.\n\tSection: typical values."}
	w, _ := newTestWindow(t, demoProject(t))
	w.showNotesForm()
	_, entries, buttons, _ := dialogWidgets(t, w)
	if len(entries) != len(notesFields) {
		t.Fatalf("the notes form has %d entries, want %d", len(entries), len(notesFields))
	}
	for i, text := range []string{want.Project, want.Member, want.Engineer, want.Date, want.Text} {
		entries[i].SetText(text)
	}
	test.Tap(buttonNamed(t, buttons, "Keep"))
	if w.project.Notes != want || !w.dirty() {
		t.Fatalf("the project's notes are %+v (unsaved changes %v), want %+v", w.project.Notes, w.dirty(), want)
	}
	path := filepath.Join(t.TempDir(), "notes.json")
	w.writeProject(path, nil)
	p, err := storage.Load(path)
	if err != nil || p.Notes != want {
		t.Fatalf("the saved file has notes %+v (%v), want %+v", p.Notes, err, want)
	}
	other, _ := newTestWindow(t, nil)
	other.openPath(path)
	other.showNotesForm()
	_, entries, _, _ = dialogWidgets(t, other)
	for i, nf := range notesFields {
		if got := entries[i].Text; got != *nf.text(&want) {
			t.Errorf("reopened, %s reads %q, want %q", nf.label, got, *nf.text(&want))
		}
	}
	if src := other.exportSource().src; src.Project.Notes != want {
		t.Errorf("the sheet is made from notes %+v, want %+v", src.Project.Notes, want)
	}
}

// Texts a file must not hold are refused where they are typed, with the
// name of the field and what to do, and nothing changes.
func TestNotesRefuseWhatAFileCannotHold(t *testing.T) {
	for _, c := range []struct {
		name  string
		field int // index into notesFields
		text  string
		want  string // in the message
	}{
		{"a control character", 2, "A. N.\aEngineer", `Engineer: "A. N.\aEngineer" holds the control character U+0007`},
		{"a direction override", 0, "Bridge \u202e7", `Project: "Bridge \u202e7" holds U+202E`},
		{"a label too long", 1, strings.Repeat("J", storage.MaxLabelLength+1), `Member mark: "` + strings.Repeat("J", 40) + `… (1001 bytes in all)" is 1001 characters long`},
		{"a tab in a label", 3, "2025\t03", `Date: "2025\t03" holds the control character U+0009`},
		{"remarks too long", 4, strings.Repeat("x", storage.MaxNotesLength+1), `Remarks: "` + strings.Repeat("x", 40) + `… (100001 bytes in all)" is 100001 characters long`},
		{"control: tabs and lines in the remarks", 4, "line one\n\tline two", ""},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		before := w.project.Notes
		w.showNotesForm()
		_, entries, buttons, labels := dialogWidgets(t, w)
		entries[c.field].SetText(c.text)
		test.Tap(buttonNamed(t, buttons, "Keep"))
		var message string
		for _, l := range labels {
			if strings.Contains(l.Text, ": ") && l.Text != "" {
				message += l.Text
			}
		}
		if c.want == "" {
			if w.project.Notes.Text != c.text {
				t.Errorf("%s: refused (%s)", c.name, message)
			}
			continue
		}
		if w.project.Notes != before || w.win.Canvas().Overlays().Top() == nil {
			t.Errorf("%s: the notes changed or the form closed", c.name)
		}
		if !strings.Contains(message, c.want) {
			t.Errorf("%s: message %q, want it to say %q", c.name, message, c.want)
		}
	}
}

// A material name is held to the same rules.
func TestMaterialNameRefusesControlCharacters(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.selectItem(canvas.Ref{Kind: canvas.Segment, Index: 0})
	before := w.Model().Segments[0].Material.Name
	var name func(string)
	for _, o := range test.LaidOutObjects(w.ui.properties) {
		if e, ok := o.(*escEntry); ok && e.Text == before {
			name = e.OnSubmitted
		}
	}
	if name == nil {
		t.Fatal("no material name entry under Properties")
	}
	name("oak\x1b[31m")
	if got := w.Model().Segments[0].Material.Name; got != before {
		t.Errorf("the material was renamed to %q", got)
	}
	name("oak, sawn")
	if got := w.Model().Segments[0].Material.Name; got != "oak, sawn" {
		t.Errorf("a good name was refused: %q", got)
	}
}
