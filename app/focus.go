package app

import (
	"image/color"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
)

// newFocusFrame is the frame a picture that takes the focus draws over
// itself: in the theme's primary colour while it has the focus
// (showFocus), clear otherwise, leaving the picture as it is. The focus
// colour, a blue at a sixth of full strength, hardly showed on the white
// of a picture.
func newFocusFrame() *fynecanvas.Rectangle {
	f := fynecanvas.NewRectangle(color.Transparent)
	f.StrokeWidth = 2
	return f
}

// showFocus colours the focus frame f for focus on or off.
func showFocus(f *fynecanvas.Rectangle, on bool) {
	f.StrokeColor = color.Transparent
	if on {
		f.StrokeColor = theme.Color(theme.ColorNamePrimary)
	}
	f.Refresh()
}

// ringButton is a button that may stand out (of high importance: the
// active tool, Apply) and shows the focus all the same: fyne shades a
// focused button with its focus colour, a faint blue, which does not show
// on a blue button. It draws a ring round itself while it has the focus,
// black on a light theme and white on a dark one (ringColour).
type ringButton struct {
	widget.Button
	ring *fynecanvas.Rectangle
}

func newRingButton(label string, tapped func()) *ringButton {
	b := &ringButton{}
	b.setUp(label, tapped)
	b.ExtendBaseWidget(b)
	return b
}

// setUp makes b a button reading label that runs tapped, with its ring.
// The caller extends the base widget with b, or with the widget that
// holds b (dialogButton), which fyne then draws and sends the keys to.
func (b *ringButton) setUp(label string, tapped func()) {
	b.ring = fynecanvas.NewRectangle(color.Transparent)
	b.Text, b.OnTapped = label, tapped
	b.ring.StrokeWidth = 2
	b.ring.CornerRadius = theme.InputRadiusSize()
}

// CreateRenderer is part of fyne.Widget: the button's own, with the ring
// over it.
func (b *ringButton) CreateRenderer() fyne.WidgetRenderer {
	return ringRenderer{b.Button.CreateRenderer(), b.ring}
}

// FocusGained is part of fyne.Focusable.
func (b *ringButton) FocusGained() {
	b.Button.FocusGained()
	b.ring.StrokeColor = ringColour()
	b.ring.Refresh()
}

// FocusLost is part of fyne.Focusable.
func (b *ringButton) FocusLost() {
	b.Button.FocusLost()
	b.ring.StrokeColor = color.Transparent
	b.ring.Refresh()
}

// ringColour is black or white, whichever stands out more from the
// theme's background: either stands out from a blue button too.
func ringColour() color.Color {
	r, g, b, _ := theme.Color(theme.ColorNameBackground).RGBA()
	if 2126*r+7152*g+722*b > 10000*0x7fff { // a light background
		return color.Black
	}
	return color.White
}

// ringRenderer draws a button and its focus ring over it.
type ringRenderer struct {
	fyne.WidgetRenderer
	ring *fynecanvas.Rectangle
}

func (r ringRenderer) Layout(size fyne.Size) {
	r.WidgetRenderer.Layout(size)
	r.ring.Resize(size)
}

func (r ringRenderer) Objects() []fyne.CanvasObject {
	return append(r.WidgetRenderer.Objects(), r.ring)
}
