// Package app is Stave's sketch-and-solve window.
//
// The window holds one storage.Project. Every change to the member goes
// through an edit: the model before and after, kept on an undo stack, so a
// drag on the drawing (applied live while the mouse moves) is one step to
// undo. After each change a deep copy of the model goes to a background
// solver (solver.go) that keeps only the newest request; its results come
// back on the UI goroutine and feed the drawing (package canvas), the
// readout at the mouse position and the list of checks.
//
// Data flows one way: edit -> model -> solver -> results -> scene -> screen.
// Results are an aid for checking only; the status line says so at all times.
package app
