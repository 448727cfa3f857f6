package app

import (
	"stave/canvas"
	"stave/fem"
)

// maxHistory bounds the undo stack so a long session does not hold every
// model it ever had.
const maxHistory = 500

// edit is one undoable change of the model. Keeping whole copies of the
// model (a few hundred bytes to a few kilobytes: the mesh is not part of it)
// makes every command trivially exact to undo, including a drag that passed
// through many intermediate states.
type edit struct {
	name          string // what the user did, for the status line ("move support 2")
	before, after fem.Model
	// selected is the item selected when the edit was made (the one a
	// delete removed), in the editing form of case editCase; undo selects
	// it again. None when the edit keeps no selection.
	selected canvas.Ref
	editCase int
}

// history is the undo/redo stack.
type history struct {
	done, undone []edit
}

// push records an edit that has already been applied and forgets the redo branch.
func (h *history) push(e edit) {
	h.done = append(h.done, e)
	if len(h.done) > maxHistory {
		h.done = append(h.done[:0:0], h.done[len(h.done)-maxHistory:]...)
	}
	h.undone = nil
}

// undo takes the newest edit off the stack; the caller restores e.before.
func (h *history) undo() (edit, bool) { return shift(&h.done, &h.undone) }

// redo takes back the newest undone edit; the caller restores e.after.
func (h *history) redo() (edit, bool) { return shift(&h.undone, &h.done) }

// shift moves the newest edit of from onto to.
func shift(from, to *[]edit) (edit, bool) {
	if len(*from) == 0 {
		return edit{}, false
	}
	e := (*from)[len(*from)-1]
	*from = (*from)[:len(*from)-1]
	*to = append(*to, e)
	return e, true
}
