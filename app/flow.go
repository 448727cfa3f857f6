package app

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
)

// flowLayout lays its objects out at their minimum sizes in rows, left to
// right, and starts a new row where the next one would not fit: a bar of
// controls too wide for a small window wraps instead of being cut off.
//
// Its height depends on its width, which a layout learns only when it lays
// out. MinSize answers for the width last laid out (one row before the
// first layout); when a new width needs another height, Layout asks the
// canvas to refresh the container, and the canvas lays out again whatever
// holds an object whose minimum size changed.
type flowLayout struct {
	box      *fyne.Container
	width    float32 // the width last laid out; 0 before the first layout
	reported float32 // the height MinSize last answered
}

// newFlow is a container that flows objects into rows.
func newFlow(objects ...fyne.CanvasObject) *fyne.Container {
	l := &flowLayout{}
	l.box = container.New(l, objects...)
	return l.box
}

// arrange works out the rows for width, placing the objects when place is
// set, and returns the height they take.
func (l *flowLayout) arrange(objects []fyne.CanvasObject, width float32, place bool) float32 {
	pad := theme.Padding()
	var x, y, row float32
	for _, o := range objects {
		if !o.Visible() {
			continue
		}
		s := o.MinSize()
		if x > 0 && x+s.Width > width {
			x, y, row = 0, y+row+pad, 0
		}
		if place {
			o.Move(fyne.NewPos(x, y))
			o.Resize(s)
		}
		x += s.Width + pad
		row = max(row, s.Height)
	}
	return y + row
}

// MinSize is the widest object across and the rows at the last width down.
func (l *flowLayout) MinSize(objects []fyne.CanvasObject) fyne.Size {
	var widest, oneRow float32
	for _, o := range objects {
		if o.Visible() {
			w := o.MinSize().Width
			widest = max(widest, w)
			oneRow += w + theme.Padding()
		}
	}
	width := l.width
	if width == 0 {
		width = oneRow
	}
	l.reported = l.arrange(objects, max(width, widest), false)
	return fyne.NewSize(widest, l.reported)
}

// Layout places the objects in rows across size.Width.
func (l *flowLayout) Layout(objects []fyne.CanvasObject, size fyne.Size) {
	l.width = size.Width
	if h := l.arrange(objects, size.Width, true); h != l.reported {
		if c := fyne.CurrentApp().Driver().CanvasForObject(l.box); c != nil {
			c.Refresh(l.box) // the height changed with the width: lay out the window again
		}
	}
}
