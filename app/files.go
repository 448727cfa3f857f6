package app

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"time"

	"fyne.io/fyne/v2"
	fyneapp "fyne.io/fyne/v2/app"
	"fyne.io/fyne/v2/dialog"
	storagefilter "fyne.io/fyne/v2/storage"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
	native "github.com/sqweek/dialog"

	"stave/canvas/report"
	"stave/fem/analysis"
	"stave/storage"
)

// autosaveEvery is how often unsaved work is copied to the recovery folder.
const autosaveEvery = 30 * time.Second

// maxRecent is the length of the File ▸ Open recent list.
const maxRecent = 8

// Run opens the window on the project file at path (the built-in demo when
// path is "") and runs the application until the window closes.
func Run(path string) error {
	a := fyneapp.NewWithID("org.stave.member")
	p, err := startProject(path)
	if err != nil {
		return err
	}
	w := NewWindow(a, p.project, path)
	w.startedOn(p)
	w.win.SetMaster()
	w.Show()
	w.offerRecovery()
	a.Run()
	return nil
}

// opened is the project a run starts with, and what went wrong finding it.
type opened struct {
	project *storage.Project
	demo    bool // the project is the built-in demo
	problem string
}

// startProject reads path, or with no path the built-in demo; should the
// demo not load, the window starts on an empty sketch and says why.
func startProject(path string) (opened, error) {
	if path != "" {
		p, err := storage.Load(path)
		if err != nil {
			return opened{}, err // it names the file already
		}
		return opened{project: p}, nil
	}
	p, err := storage.Demo()
	if err != nil {
		empty := storage.Project{View: storage.DefaultView()}
		return opened{project: &empty, problem: err.Error() + "; starting with an empty sketch"}, nil
	}
	return opened{project: p, demo: true}, nil
}

// startedOn names the window after what it started on and says what went
// wrong finding it.
func (w *Window) startedOn(o opened) {
	if o.demo {
		w.name = demoTitle
		w.updateTitle()
	}
	if o.problem != "" {
		w.setStatus("%s", o.problem)
	}
}

// defaultRecoveryDir is where autosaved copies go.
func defaultRecoveryDir() string {
	dir, err := os.UserCacheDir()
	if err != nil {
		return ""
	}
	return filepath.Join(dir, "stave", "recovery")
}

// chooseFile asks for a file name with the system's dialog, run off the UI
// goroutine, and falls back to Fyne's own dialog when there is none (no GTK
// or no display). done runs on the UI goroutine with the chosen path.
func (w *Window) chooseFile(save bool, title, filterName, ext string, done func(path string)) {
	current := w.path // read here: the goroutine must not touch the window's state
	go func() {
		path, err := nativeFile(save, title, filterName, ext, current)
		w.post(func() {
			switch {
			case err == nil:
				done(path)
			case errors.Is(err, native.ErrCancelled):
			default:
				w.fyneFile(save, ext, done)
			}
		})
	}()
}

// nativeFile runs the system file dialog. The dialog package panics when
// GTK cannot start; that becomes an error so the caller falls back.
func nativeFile(save bool, title, filterName, ext, current string) (path string, err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("no system file dialog: %v", r)
		}
	}()
	b := native.File().Title(title).Filter(filterName, ext)
	if current != "" {
		b = b.SetStartDir(filepath.Dir(current))
	}
	if save {
		path, err = b.Save()
		if err == nil && !strings.HasSuffix(strings.ToLower(path), "."+ext) {
			path += "." + ext
		}
		return path, err
	}
	return b.Load()
}

func (w *Window) fyneFile(save bool, ext string, done func(string)) {
	finish := func(uc interface {
		URI() fyne.URI
		io.Closer
	}) {
		path := uc.URI().Path()
		uc.Close()
		done(path)
	}
	var d *dialog.FileDialog
	if save {
		d = dialog.NewFileSave(func(uc fyne.URIWriteCloser, err error) {
			if err == nil && uc != nil {
				finish(uc)
			}
		}, w.win)
		d.SetFileName("member." + ext)
	} else {
		d = dialog.NewFileOpen(func(uc fyne.URIReadCloser, err error) {
			if err == nil && uc != nil {
				finish(uc)
			}
		}, w.win)
	}
	d.SetFilter(storagefilter.NewExtensionFileFilter([]string{"." + ext}))
	d.Resize(fyne.NewSize(900, 600))
	w.showDialog(d)
}

// confirmDiscard runs then at once when there are no unsaved changes, and
// otherwise asks: Save runs it after a successful save, Discard changes
// drops the changes (and their autosave) and runs it, Cancel goes back to
// the work.
func (w *Window) confirmDiscard(action string, then func()) {
	if !w.dirty() {
		then()
		return
	}
	label := widget.NewLabel(fmt.Sprintf("The member has changes that are not saved. Save them before you %s?", action))
	label.Wrapping = fyne.TextWrapWord
	w.ask("Unsaved changes", label,
		choice{label: "Cancel", run: func() { w.setStatus("kept working: nothing was discarded") }},
		choice{label: "Discard changes", importance: widget.DangerImportance, run: func() {
			w.discardAutosave()
			then()
		}},
		choice{label: "Save", importance: widget.HighImportance, run: func() { w.save(then) }},
	)
}

// ask shows a question whose buttons close it and run their choice.
// The first choice is the cautious one (Cancel, Not now), which Escape
// makes too (newDialog).
func (w *Window) ask(title string, content fyne.CanvasObject, choices ...choice) {
	d, _ := w.newDialog(title, content, choices...)
	d.Resize(fyne.NewSize(min(560, d.MinSize().Width+80), d.MinSize().Height))
	w.showDialog(d)
}

func (w *Window) closeRequested() {
	w.confirmDiscard("close the window", func() {
		w.shutdown()
		w.win.Close()
	})
}

// quitWait is how long a closing window waits for its background jobs to
// notice they are cancelled; an export half drawn by then is left behind.
const quitWait = 2 * time.Second

// shutdown stops the background work of the window. The user has saved
// or discarded the work by now, so its autosave goes; a previous run's,
// not yet answered, stays to be offered next time.
func (w *Window) shutdown() {
	if w.stopAutosave != nil {
		w.stopAutosave()
	}
	w.solver.stop()
	w.jobs.stop(quitWait)
	w.discardAutosave()
}

func (w *Window) newProject() {
	w.confirmDiscard("start a new member", func() {
		w.replaceProject(&storage.Project{View: storage.DefaultView()}, "")
		w.name = untitled
		w.updateTitle()
		w.setStatus("new member: choose Member (M) and drag along the drawing, or type its length under Properties")
	})
}

func (w *Window) openDialog() {
	w.confirmDiscard("open another file", func() {
		w.chooseFile(false, "Open a member", "Stave member", "json", w.openPath)
	})
}

// openPath loads path into this window.
func (w *Window) openPath(path string) {
	p, err := storage.Load(path)
	if err != nil {
		w.showError(err) // it names the file and the place in it
		return
	}
	w.replaceProject(p, path)
	w.addRecent(path)
	w.setStatus("opened %s", path)
}

// replaceProject shows p (from path) with a fresh undo history.
func (w *Window) replaceProject(p *storage.Project, path string) {
	w.project, w.saved, w.path = cloneProject(*p), cloneProject(*p), path
	w.editCase, w.show = 0, analysis.Show{}
	w.project.Model = w.project.Model.CaseLifted(0)
	w.hist = history{}
	w.selected = canvasNone
	w.highlight = [2]float64{}
	w.units = report.UnitSystem(w.project.View.Units)
	w.dimensions = true
	w.build()
	w.setModel(w.project.Model)
	w.draw.fit()
}

// save writes to the project's file (asking for one when it has none) and
// runs then after a successful save.
func (w *Window) save(then func()) {
	if w.path == "" {
		w.saveAs(then)
		return
	}
	w.writeProject(w.path, then)
}

func (w *Window) saveAs(then func()) {
	w.chooseFile(true, "Save the member as", "Stave member", "json", func(path string) { w.writeProject(path, then) })
}

func (w *Window) writeProject(path string, then func()) {
	p := w.canonical()
	if err := storage.Save(path, &p); err != nil {
		w.showError(fmt.Errorf("the member was not saved: %w", err))
		return
	}
	w.path = path
	w.saved = p
	w.addRecent(path)
	w.discardAutosave()
	w.updateTitle()
	w.setStatus("saved %s", path)
	// Work in progress is saved as it is, so nothing is lost; say so when
	// the file would not open again as it stands, before closing the window
	// or leaving the member for another.
	if err := storage.Validate(&p); err != nil {
		w.warnUnloadable(path, err, then)
		return
	}
	if then != nil {
		then()
	}
}

// warnUnloadable says that the file just saved at path will not open again
// (err from storage.Validate). then, when there is a next step, waits for
// the user to go on; without one the warning just informs.
func (w *Window) warnUnloadable(path string, err error, then func()) {
	fix := "Fix it and save again."
	var le *storage.LoadError
	if errors.As(err, &le) {
		le.File = filepath.Base(path)
		if len(le.Problems) > 1 {
			fix = "Fix them and save again."
		}
	}
	w.setStatus("saved %s, but it will not open again until the problems listed are fixed", path)
	const title = "Saved, but it will not open as it is"
	msg := "The member was saved, so no work is lost, but " + err.Error() + "\n" + fix
	if then == nil {
		w.showMessage(title, msg, theme.InfoIcon())
		return
	}
	d, _ := w.newDialog(title, widget.NewLabel(msg),
		choice{label: "Stay and fix it", icon: theme.CancelIcon()},
		choice{label: "Go on anyway", icon: theme.ConfirmIcon(), importance: widget.HighImportance, run: then})
	w.showDialog(d)
}

// addRecent puts path at the top of the recent files.
func (w *Window) addRecent(path string) {
	prefs := w.app.Preferences()
	list := []string{path}
	for _, p := range prefs.StringList("recent") {
		if p != path && len(list) < maxRecent {
			list = append(list, p)
		}
	}
	prefs.SetStringList("recent", list)
	w.setMainMenu()
}

func (w *Window) fillRecent(m *fyne.Menu) {
	for _, p := range w.app.Preferences().StringList("recent") {
		m.Items = append(m.Items, fyne.NewMenuItem(p, func() {
			w.confirmDiscard("open another file", func() { w.openPath(p) })
		}))
	}
	if len(m.Items) == 0 {
		none := fyne.NewMenuItem("(none yet)", nil)
		none.Disabled = true
		m.Items = append(m.Items, none)
	}
}

// startAutosave copies unsaved work to the recovery folder every
// autosaveEvery. The ticker runs on its own goroutine; the copy is made on
// the UI goroutine, which owns the project.
func (w *Window) startAutosave() {
	t := time.NewTicker(autosaveEvery)
	quit := make(chan struct{})
	go func() {
		for {
			select {
			case <-quit:
				return
			case <-t.C:
				w.post(w.autosave)
			}
		}
	}()
	w.stopAutosave = func() { t.Stop(); close(quit) }
}

// autosave copies unsaved work to the recovery folder; once there is
// none (undone, saved), it removes the copy it made.
func (w *Window) autosave() {
	if w.earlierKept {
		return
	}
	if !w.dirty() {
		w.discardAutosave()
		return
	}
	p := w.canonical()
	if err := storage.WriteRecovery(w.recoveryDir, &p, w.path); err != nil {
		w.setStatus("autosave failed: %v", err)
		return
	}
	w.autosaved = true
}

// discardAutosave removes this window's autosave, so no later start
// offers work the user saved or chose to discard.
func (w *Window) discardAutosave() {
	if !w.autosaved || w.recoveryDir == "" {
		return
	}
	if err := storage.ClearRecovery(w.recoveryDir); err != nil {
		w.setStatus("%v", err)
		return
	}
	w.autosaved = false
}

// offerRecovery asks whether to restore unsaved work a previous run left.
func (w *Window) offerRecovery() {
	if w.recoveryDir == "" {
		return
	}
	r, err := storage.FindRecovery(w.recoveryDir)
	if err != nil {
		w.setStatus("%v", err)
		return
	}
	if r == nil {
		return
	}
	of := "an unsaved member"
	if r.Source != "" {
		of = r.Source
	}
	label := widget.NewLabel(fmt.Sprintf("Stave kept a copy of unsaved changes to %s from %s, when it last stopped without saving them.\n"+
		"Restore opens them here; Save as… writes them to a file and opens it; Discard deletes the copy; Not now asks again next time.",
		of, r.Written.Local().Format("2 Jan 2006 15:04")))
	label.Wrapping = fyne.TextWrapWord
	// restore shows the recovered work as this window's, belonging to
	// the file path; saved says the file holds it. The copy is then the
	// window's own: saving or discarding the work removes it.
	restore := func(path string, saved bool) {
		w.replaceProject(r.Project, path)
		w.autosaved = true
		if !saved {
			w.saved = storage.Project{}
		}
		w.updateTitle()
	}
	w.ask("Restore unsaved work?", label,
		choice{label: "Not now", run: func() {
			// There is one autosave: this window's own would replace the copy kept.
			w.earlierKept = true
			w.setStatus("the copy stays for the next start; autosave is paused meanwhile, so save your work (Ctrl+S) to keep it")
		}},
		choice{label: "Discard", importance: widget.DangerImportance, run: func() {
			if err := storage.ClearRecovery(w.recoveryDir); err != nil {
				w.setStatus("%v", err)
			}
		}},
		choice{label: "Save as…", run: func() {
			w.chooseFile(true, "Save the restored member as", "Stave member", "json", func(path string) {
				if err := storage.Save(path, r.Project); err != nil {
					w.showError(fmt.Errorf("the restored member was not saved: %w", err))
					return
				}
				restore(path, true)
				w.discardAutosave()
				w.addRecent(path)
				w.setStatus("saved the restored work as %s", path)
			})
		}},
		choice{label: "Restore", importance: widget.HighImportance, run: func() {
			restore(r.Source, false)
			w.setStatus("restored unsaved work; save it to keep it")
		}},
	)
}

// writeFile fills path with write through storage.WriteFile: a failure at
// any step leaves the previous file, if any, as it was and no half file.
func writeFile(path string, write func(io.Writer) error) error {
	if err := storage.WriteFile(path, write); err != nil {
		return fmt.Errorf("cannot export to %s: %w", path, err)
	}
	return nil
}
