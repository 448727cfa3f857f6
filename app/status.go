package app

import (
	"errors"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
)

// statusLine is the window's message line. When its message names a
// problem of one item of the model, a click on it selects that item.
type statusLine struct {
	widget.Label
	at canvas.Ref // the item the message is about; Kind None for none
	w  *Window
}

func newStatusLine(w *Window) *statusLine {
	s := &statusLine{w: w}
	s.Truncation = fyne.TextTruncateEllipsis
	s.ExtendBaseWidget(s)
	return s
}

// Tapped selects the item the message is about, if it is still there.
func (s *statusLine) Tapped(*fyne.PointEvent) {
	if r := s.at; r.Kind != canvas.None && r.Index < count(&s.w.project.Model, r.Kind) {
		s.w.selectItem(r)
	}
}

// locate points the message line at the item of the first problem in
// err, the validation error of cand, an edit of the window's model that
// was refused, and says that a click selects it. An item is pointed at
// only where the edit kept the number of its kind, so that its index
// names the same item in the model the window keeps.
func (s *statusLine) locate(err error, cand *fem.Model) {
	var invalid *fem.ValidationError
	if !errors.As(err, &invalid) {
		return
	}
	for _, p := range invalid.Problems {
		r := refOf(p.Item)
		if r.Kind != canvas.None && r.Index < count(cand, r.Kind) && count(cand, r.Kind) == count(&s.w.project.Model, r.Kind) {
			s.at = r
			// First, where a long message's end would be cut off.
			s.SetText("Click here to select " + describe(r) + " — " + s.Text)
			return
		}
	}
}

// refKinds are the kinds of drawn part that show the kinds of model item.
var refKinds = map[fem.ItemKind]canvas.RefKind{
	fem.SegmentItem: canvas.Segment, fem.SupportItem: canvas.Support,
	fem.HingeItem: canvas.Hinge, fem.FoundationItem: canvas.Foundation,
	fem.PointLoadItem: canvas.PointLoad, fem.DistributedLoadItem: canvas.DistributedLoad,
}

// refOf is the part of the drawing that shows item it, Kind None for an
// item the drawing does not show by itself (the model, the mesh, a case, a
// combination, a load of a case not being edited).
func refOf(it fem.Item) canvas.Ref {
	k, ok := refKinds[it.Kind]
	load := it.Kind == fem.PointLoadItem || it.Kind == fem.DistributedLoadItem
	if !ok || it.Index < 0 || load && it.Case != 0 {
		return canvas.Ref{}
	}
	return canvas.Ref{Kind: k, Index: it.Index}
}
