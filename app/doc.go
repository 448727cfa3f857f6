// Package app is Stave's sketch-and-solve window.
//
// The window holds one storage.Project. Every change to the member goes
// through an edit: the model before and after, kept on an undo stack, so a
// drag on the drawing (applied live while the mouse moves) is one step to
// undo. Everything the mouse places can be typed as well: the Add form
// (add.go) places supports, loads and segment breaks in display units, and
// the properties panel edits what is selected. The arrow keys select the
// items one by one from left to right, Enter goes to the selection's
// numbers and Escape back to the drawing (keys.go). After each change a deep
// copy of the model goes to a background solver (solver.go) that keeps only
// the newest request; its results come back on the UI goroutine and feed
// the drawing (package canvas), the readout at the mouse position and the
// list of checks (results.go).
//
// The main menu is the one table of keyboard commands (keys.go): its items
// show their keys, and no key or menu command acts while a dialog is open.
//
// Data flows one way: edit -> model -> solver -> results -> scene -> screen.
// Results are an aid for checking only; the status line says so at all times.
package app
