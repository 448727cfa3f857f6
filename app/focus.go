package app

import (
	"image/color"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
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
	focusHook
	ring *fynecanvas.Rectangle
	// onEscape, when set, takes Escape, which fyne's button ignores: a
	// button of the panels hands it to the window's escape, as the
	// panels' fields do.
	onEscape func()
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

// TypedKey is part of fyne.Focusable.
func (b *ringButton) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && b.onEscape != nil {
		b.onEscape()
		return
	}
	b.Button.TypedKey(k)
}

// newButton is a button of the window's panels reading label, with icon
// (none when nil), that runs tapped; Escape on it gives the focus back to
// the drawing (escape), as on the panels' fields.
func (w *Window) newButton(label string, icon fyne.Resource, tapped func()) *ringButton {
	b := newRingButton(label, tapped)
	b.Icon, b.onEscape = icon, w.escape
	return b
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
	b.focused()
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

// focusHook is part of a widget that runs onFocus, when set, as the
// widget gains the focus: a pane that scrolls sets it (followFocus) to
// bring the widget into sight.
type focusHook struct{ onFocus func() }

func (h *focusHook) setOnFocus(f func()) { h.onFocus = f }

// focused runs onFocus, if set; the widget's FocusGained calls it.
func (h *focusHook) focused() {
	if h.onFocus != nil {
		h.onFocus()
	}
}

// followFocus makes s scroll to each widget of its content that has a
// focusHook as it gains the focus, so that Tab does not put the focus on
// a field out of sight, where what is typed goes unseen: fyne's scroll
// does not follow the focus, and at 1280 × 720 the properties panel shows
// four fields and the moving-loads form stops above its Apply. Call it
// again when the content gains widgets. It looks into containers (and
// theme overrides), not into other widgets or an inner scroll.
func followFocus(s *container.Scroll) {
	var walk func(o fyne.CanvasObject)
	walk = func(o fyne.CanvasObject) {
		switch v := o.(type) {
		case interface{ setOnFocus(func()) }:
			v.setOnFocus(func() { scrollIntoView(s, o) })
		case *fyne.Container:
			for _, c := range v.Objects {
				walk(c)
			}
		case *container.ThemeOverride:
			walk(v.Content)
		}
	}
	walk(s.Content)
}

// scrollIntoView scrolls s the least that shows o, which lies in its
// content, whole (or its start, when o is larger than s), along the
// directions s scrolls.
func scrollIntoView(s *container.Scroll, o fyne.CanvasObject) {
	d := fyne.CurrentApp().Driver()
	at := d.AbsolutePositionForObject(o).Subtract(d.AbsolutePositionForObject(s.Content)) // o in the content
	view, size := s.Size(), o.Size()
	offset := s.Offset
	if s.Direction == container.ScrollBoth || s.Direction == container.ScrollVerticalOnly {
		offset.Y = showSpan(at.Y, size.Height, offset.Y, view.Height)
	}
	if s.Direction == container.ScrollBoth || s.Direction == container.ScrollHorizontalOnly {
		offset.X = showSpan(at.X, size.Width, offset.X, view.Width)
	}
	s.ScrollToOffset(offset)
}

// showSpan is the scroll offset nearest offset at which a view of length
// view shows the span of length n from start, or its start when it is
// longer than the view.
func showSpan(start, n, offset, view float32) float32 {
	if start+n > offset+view {
		offset = start + n - view
	}
	return min(offset, start)
}
