package app

import (
	"math"
	"slices"
	"sort"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"

	"stave/canvas"
	"stave/fem"
)

// The keys of the menu items. Ctrl+Z and Ctrl+Y reach a window as Fyne's
// own undo and redo shortcuts, not as custom ones, so those are what is bound.
var (
	keyUndo         fyne.Shortcut = &fyne.ShortcutUndo{}
	keyRedo         fyne.Shortcut = &fyne.ShortcutRedo{}
	keyRedoShift                  = ctrl(fyne.KeyZ, fyne.KeyModifierShift)
	keyNew                        = ctrl(fyne.KeyN, 0)
	keyOpen                       = ctrl(fyne.KeyO, 0)
	keySave                       = ctrl(fyne.KeyS, 0)
	keySaveAs                     = ctrl(fyne.KeyS, fyne.KeyModifierShift)
	keyQuit                       = ctrl(fyne.KeyQ, 0)
	keyAdd                        = plain(fyne.KeyA)
	keyDelete                     = plain(fyne.KeyDelete)
	keyNothing                    = plain(fyne.KeyEscape)
	keyNextItem                   = plain(fyne.KeyRight)
	keyPreviousItem               = plain(fyne.KeyLeft)
	keyEditItem                   = plain(fyne.KeyReturn)
	keyFit                        = plain(fyne.KeyF)
	keyZoomIn                     = plain(fyne.KeyPlus)
	keyZoomOut                    = plain(fyne.KeyMinus)
)

// ctrl is Ctrl (Cmd on macOS) with key and the extra modifiers.
func ctrl(key fyne.KeyName, extra fyne.KeyModifier) fyne.Shortcut {
	return &desktop.CustomShortcut{KeyName: key, Modifier: fyne.KeyModifierShortcutDefault | extra}
}

// plain is a key pressed alone. The window reads such keys itself when no
// entry has the focus (bindKeys); as a menu item's shortcut it only shows
// the key, since the toolkit makes shortcuts of modified keys only.
func plain(key fyne.KeyName) fyne.Shortcut { return &desktop.CustomShortcut{KeyName: key} }

// dialogOpen reports whether a dialog (or any pop-up) covers the window.
// Keys and menu commands then leave the model alone: the dialog has the
// user's attention, and what is behind it is not in view.
func (w *Window) dialogOpen() bool {
	return len(w.win.Canvas().Overlays().List()) > 0
}

// guarded runs f only while no dialog is open.
func (w *Window) guarded(f func()) func() {
	return func() {
		if !w.dialogOpen() {
			f()
		}
	}
}

// item is a menu item that runs run while no dialog is open, with its key shown.
func (w *Window) item(label string, key fyne.Shortcut, run func()) *fyne.MenuItem {
	it := fyne.NewMenuItem(label, w.guarded(run))
	it.Shortcut = key
	return it
}

func (w *Window) mainMenu() *fyne.MainMenu {
	recent := fyne.NewMenuItem("Open recent", nil)
	recent.ChildMenu = fyne.NewMenu("")
	w.fillRecent(recent.ChildMenu)
	exports := fyne.NewMenuItem("Export", nil)
	exports.ChildMenu = w.exportMenu()
	quit := w.item("Quit", keyQuit, w.closeRequested)
	quit.IsQuit = true // the toolkit adds no Quit of its own that would skip the question about unsaved work
	file := fyne.NewMenu("File",
		w.item("New", keyNew, w.newProject),
		w.item("Open…", keyOpen, w.openDialog),
		recent,
		fyne.NewMenuItemSeparator(),
		w.item("Save", keySave, func() { w.save(nil) }),
		w.item("Save as…", keySaveAs, func() { w.saveAs(nil) }),
		fyne.NewMenuItemSeparator(),
		w.item("Notes for the sheet…", nil, w.showNotesForm),
		exports,
		fyne.NewMenuItemSeparator(),
		quit,
	)
	edit := fyne.NewMenu("Edit",
		w.item("Undo", keyUndo, w.undo),
		w.item("Redo", keyRedo, w.redo),
		fyne.NewMenuItemSeparator(),
		w.item("Add a support, load or break…", keyAdd, w.showAddForm),
		w.item("Delete selected", keyDelete, w.deleteSelected),
		w.item("Select nothing", keyNothing, w.selectNothing),
		w.item("Select the next item", keyNextItem, func() { w.stepSelection(1) }),
		w.item("Select the previous item", keyPreviousItem, func() { w.stepSelection(-1) }),
		w.item("Type the selection's numbers", keyEditItem, w.editSelection),
	)
	toolMenu := fyne.NewMenu("Tools")
	for _, t := range tools {
		toolMenu.Items = append(toolMenu.Items, w.item(t.label, plain(fyne.KeyName(string(t.key-'a'+'A'))), func() { w.setTool(t.tool) }))
	}
	studies := fyne.NewMenu("Study",
		w.item("Convergence study", nil, w.runConvergence),
		w.item("Adaptive refinement…", nil, w.runAdaptive),
		w.item("Back to the uniform mesh", nil, w.uniformMesh),
		w.item("Cancel the running study", nil, w.cancelStudy),
		fyne.NewMenuItemSeparator(),
		w.nodalMenuItem(),
		w.item("Table of the nodal loads…", nil, w.showNodalTable),
		fyne.NewMenuItemSeparator(),
		w.item("Check limits…", nil, w.showCheckLimits),
		fyne.NewMenuItemSeparator(),
		w.item("Moving loads…", nil, w.showMovingLoads),
	)
	member := fyne.NewMenu("Member",
		w.item("Section calculator…", nil, w.showSectionCalculator),
		w.item("Typical materials…", nil, w.showMaterials),
	)
	view := fyne.NewMenu("View",
		w.item("Fit member", keyFit, w.draw.fit),
		w.item("Zoom in", keyZoomIn, func() { w.zoomCentre(zoomStep) }),
		w.item("Zoom out", keyZoomOut, func() { w.zoomCentre(1 / zoomStep) }),
	)
	return fyne.NewMainMenu(file, edit, toolMenu, member, studies, view)
}

// setMainMenu shows the main menu and binds its keys.
func (w *Window) setMainMenu() {
	m := w.mainMenu()
	w.win.SetMainMenu(m)
	w.bindKeys(m)
}

// bindKeys binds the keyboard to the items of the main menu m, whose
// actions do nothing while a dialog is open. Modified keys become
// shortcuts of the canvas too: on the desktop the toolkit offers a
// shortcut to the main menu first, so they work wherever the focus is, and
// the canvas takes them where there is no menu bar. Ctrl+Shift+Z redoes as
// well as Ctrl+Y. Plain keys (tool letters, Delete, Escape) act when
// nothing or the drawing has the focus (Tab reaches the drawing); a widget
// in focus has them otherwise. Escape closes the dialog on top, if any.
func (w *Window) bindKeys(m *fyne.MainMenu) {
	c := w.win.Canvas()
	plainKeys := map[fyne.KeyName]func(){}
	var bind func(items []*fyne.MenuItem)
	bind = func(items []*fyne.MenuItem) {
		for _, it := range items {
			if it.ChildMenu != nil {
				bind(it.ChildMenu.Items)
			}
			k, ok := it.Shortcut.(fyne.KeyboardShortcut)
			switch {
			case it.Action == nil || it.Shortcut == nil:
			case ok && k.Mod() == 0:
				plainKeys[k.Key()] = it.Action
			default:
				run := it.Action
				c.AddShortcut(it.Shortcut, func(fyne.Shortcut) { run() })
			}
		}
	}
	for _, menu := range m.Items {
		bind(menu.Items)
	}
	redo := w.guarded(w.redo)
	c.AddShortcut(keyRedoShift, func(fyne.Shortcut) { redo() })
	for key, same := range keyAliases {
		plainKeys[key] = plainKeys[same]
	}
	// A printable key arrives both as a key and as a character: the
	// character is what counts, so = and + zoom alike on any keyboard.
	c.SetOnTypedKey(func(k *fyne.KeyEvent) {
		if k.Name == fyne.KeyEscape && w.dialogOpen() && w.dialogs.dismiss() {
			return
		}
		if f := plainKeys[k.Name]; f != nil && len(k.Name) > 1 {
			f()
		}
	})
	c.SetOnTypedRune(func(r rune) {
		if f := plainKeys[fyne.KeyName(strings.ToUpper(string(r)))]; f != nil {
			f()
		}
	})
}

// keyAliases are keys that do what another key of the menus does.
var keyAliases = map[fyne.KeyName]fyne.KeyName{
	fyne.KeyBackspace: fyne.KeyDelete,
	fyne.KeyEqual:     fyne.KeyPlus,
	fyne.KeyEnter:     fyne.KeyReturn,
}

// selectNothing drops the selection and goes back to the Pick tool.
func (w *Window) selectNothing() {
	w.selectItem(canvasNone)
	w.setTool(toolPick)
}

// items lists the items of m a keyboard user steps through, from left
// to right by where they start; at one place segments come first, then
// supports, hinges, foundations, distributed and point loads.
func items(m *fem.Model) []canvas.Ref {
	type item struct {
		ref canvas.Ref
		x   float64
	}
	var all []item
	add := func(k canvas.RefKind, n int, x func(i int) float64) {
		for i := range n {
			all = append(all, item{canvas.Ref{Kind: k, Index: i}, x(i)})
		}
	}
	add(canvas.Segment, len(m.Segments), func(i int) float64 { return m.Segments[i].Start })
	add(canvas.Support, len(m.Supports), func(i int) float64 { return m.Supports[i].X })
	add(canvas.Hinge, len(m.Hinges), func(i int) float64 { return m.Hinges[i].X })
	add(canvas.Foundation, len(m.Foundations), func(i int) float64 { return m.Foundations[i].Start })
	add(canvas.DistributedLoad, len(m.DistributedLoad), func(i int) float64 { return m.DistributedLoad[i].Points[0].X })
	add(canvas.PointLoad, len(m.PointLoads), func(i int) float64 { return m.PointLoads[i].X })
	sort.SliceStable(all, func(a, b int) bool { return all[a].x < all[b].x })
	refs := make([]canvas.Ref, len(all))
	for i, it := range all {
		refs[i] = it.ref
	}
	return refs
}

// stepSelection selects the item by after the selected one in the order of
// items, round from the last to the first; with none selected (or what the
// order does not hold) the first going right, the last going left.
func (w *Window) stepSelection(by int) {
	refs := items(&w.project.Model)
	if len(refs) == 0 {
		w.setStatus("nothing to select: draw the member first (choose Member, or A to add by typing)")
		return
	}
	cur := w.selected
	if cur.Kind == canvas.LoadVertex {
		cur = canvas.Ref{Kind: canvas.DistributedLoad, Index: cur.Index}
	}
	next := 0
	if by < 0 {
		next = len(refs) - 1
	}
	if k := slices.Index(refs, cur); k >= 0 {
		next = (k + by + len(refs)) % len(refs)
	}
	w.selectItem(refs[next])
	w.setStatus("selected %s: → and ← step on, Enter types its numbers, Delete removes it", describe(refs[next]))
}

// editSelection puts the focus on the first number of the properties
// panel with its text selected, so that what is typed replaces it: with
// the cursor at its start, 2.9 typed over "3.000 m" read "2.93.000 m".
func (w *Window) editSelection() {
	if p := &w.ui.panel; len(p.entries) > 0 {
		w.win.Canvas().Focus(p.entries[0])
		p.entries[0].TypedShortcut(&fyne.ShortcutSelectAll{})
	}
}

// Zooming: one step of a key or a wheel notch, and how far the view may
// zoom from showing the whole member.
const (
	zoomStep = 1.18
	// wheelNotch is the scroll distance the desktop toolkit reports for one
	// notch of a mouse wheel (Fyne's scrollSpeed outside macOS and the web).
	wheelNotch  = 25
	zoomOutMost = 1.0 / 20 // the member shrinks to a twentieth of the fitted width
	zoomInMost  = 5000.0   // a 5 m member fitted to 1000 px then shows 1 mm over 1000 px
)

// zoomCentre zooms about the middle of the drawing.
func (w *Window) zoomCentre(f float64) { w.zoom(f, w.draw.view.Width/2) }

// zoom scales the view by f about the screen x aroundX, kept between
// zoomOutMost and zoomInMost of the scale that fits the member.
func (w *Window) zoom(f float64, aroundX float32) {
	v := &w.draw.view
	fitted := w.draw.fittedView().Scale
	target := math.Max(fitted*zoomOutMost, math.Min(fitted*zoomInMost, v.Scale*f))
	if target == v.Scale {
		return
	}
	v.Zoom(float32(target/v.Scale), aroundX)
	w.draw.Refresh()
}

// wheelZoom is the zoom factor of a wheel turned by dy (positive away from
// the user): zoomStep per notch, at most one notch per event so a fast
// spin or a touchpad's large deltas do not jump.
func wheelZoom(dy float32) float64 {
	notches := math.Max(-1, math.Min(1, float64(dy)/wheelNotch))
	return math.Pow(zoomStep, notches)
}
