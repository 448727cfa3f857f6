package app

import (
	"image/color"
	"math"
	"time"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
)

// tool is what a click or drag on the drawing does.
type tool int

// Tools of the tool strip.
const (
	toolPick     tool = iota // select and move items
	toolPan                  // drag the view
	toolMember               // drag the member's length
	toolSplit                // click to break a segment in two
	toolVertex               // click on a distributed load to add a vertex
	toolSupport              // click to place a support of the chosen kind
	toolForce                // click to place a point force
	toolMoment               // click to place a point moment
	toolLineLoad             // drag a distributed load's span
)

// hitPixels is how far from a handle, in pixels, a click still picks it.
const hitPixels = 5

// doubleClick is the longest pause between the two clicks of a double click.
const doubleClick = 400 * time.Millisecond

// gesture is one press-drag-release on the drawing.
type gesture struct {
	button  desktop.MouseButton
	start   fyne.Position
	started bool // the first Dragged event has been seen
	kind    gestureKind
	target  canvas.Ref
	before  fem.Model // the model when the drag began
	axis    int       // load vertex drags: 0 undecided, 1 sideways, 2 up/down
	// perPixel is the intensity change for one pixel down (load vertex drags).
	perPixel float64
}

type gestureKind int

const (
	gesturePan gestureKind = iota
	gestureMove
	gestureMember
	gestureLineLoad
)

// drawing is the member drawing: it holds the view and the current scene and
// turns mouse input into edits of its window's model.
type drawing struct {
	widget.BaseWidget
	w     *Window
	view  canvas.View
	scene *canvas.Scene
	cache canvas.Cache // sampled results, kept while only the mouse moves
	nodal nodalLoads   // the nodal loads' strip

	gesture  *gesture
	button   desktop.MouseButton // button held since MouseDown
	hoverX   float64
	hovering bool
	lastTap  time.Time
	lastPos  fyne.Position
	frame    *fynecanvas.Rectangle // newFocusFrame
}

var (
	_ fyne.Draggable    = (*drawing)(nil)
	_ fyne.Tappable     = (*drawing)(nil)
	_ fyne.Scrollable   = (*drawing)(nil)
	_ desktop.Mouseable = (*drawing)(nil)
	_ desktop.Hoverable = (*drawing)(nil)
	_ fyne.Focusable    = (*drawing)(nil)
)

func newDrawing(w *Window) *drawing {
	d := &drawing{w: w, view: canvas.NewView(800, 500), frame: newFocusFrame()}
	d.ExtendBaseWidget(d)
	return d
}

// CreateRenderer is part of fyne.Widget.
func (d *drawing) CreateRenderer() fyne.WidgetRenderer {
	bg := fynecanvas.NewRectangle(color.NRGBA{R: 0xfb, G: 0xfb, B: 0xf8, A: 0xff})
	return &drawingRenderer{d: d, background: bg}
}

// MinSize keeps the drawing usable when the window is small.
func (d *drawing) MinSize() fyne.Size { return fyne.NewSize(360, 260) }

// fit shows the whole member; an empty sketch shows 0 to 10 m to draw in.
func (d *drawing) fit() {
	d.view = d.fittedView()
	d.Refresh()
}

// fittedView is the view of the drawing's size that fits the member.
func (d *drawing) fittedView() canvas.View {
	v := canvas.NewView(d.view.Width, d.view.Height)
	m := &d.w.project.Model
	if m.Length() > 0 {
		v.Fit(m)
	} else {
		empty := newMember(10)
		v.Fit(&empty)
	}
	return v
}

// metresPerPixel at the current zoom.
func (d *drawing) metresPerPixel() float64 { return 1 / d.view.Scale }

// snapX converts a screen x to a snapped model x, ignoring the item moving.
func (d *drawing) snapX(px float32, moving canvas.Ref) float64 {
	s := newSnapper(&d.w.project.Model, moving, d.w.gridStep(d.metresPerPixel()), d.metresPerPixel())
	return s.snap(d.view.ToModelX(px))
}

func (d *drawing) hit(p fyne.Position) canvas.Ref {
	if d.scene == nil {
		return canvas.Ref{}
	}
	return d.scene.HitTest(p.X, p.Y, hitPixels)
}

// MouseDown is part of desktop.Mouseable.
func (d *drawing) MouseDown(ev *desktop.MouseEvent) {
	d.button = ev.Button
	if c := fyne.CurrentApp().Driver().CanvasForObject(d); c != nil {
		c.Focus(d) // so tool letters and Delete reach the window
	}
}

// The drawing takes the focus, by a click or by Tab, so a keyboard user
// who tabbed into the panels can come back to it: there the keys the
// window reads with nothing in focus (bindKeys) act as well. A frame in
// the theme's primary colour shows it has the focus.

// FocusGained is part of fyne.Focusable.
func (d *drawing) FocusGained() { showFocus(d.frame, true) }

// FocusLost is part of fyne.Focusable.
func (d *drawing) FocusLost() { showFocus(d.frame, false) }

// TypedRune is part of fyne.Focusable: the window's plain keys.
func (d *drawing) TypedRune(r rune) {
	if f := d.w.win.Canvas().OnTypedRune(); f != nil {
		f(r)
	}
}

// TypedKey is part of fyne.Focusable: the window's plain keys.
func (d *drawing) TypedKey(k *fyne.KeyEvent) {
	if f := d.w.win.Canvas().OnTypedKey(); f != nil {
		f(k)
	}
}

// MouseUp is part of desktop.Mouseable.
func (d *drawing) MouseUp(*desktop.MouseEvent) { d.button = 0 }

// Tapped is part of fyne.Tappable: a click applies the current tool.
func (d *drawing) Tapped(ev *fyne.PointEvent) {
	double := time.Since(d.lastTap) < doubleClick &&
		math.Abs(float64(ev.Position.X-d.lastPos.X)) < hitPixels && math.Abs(float64(ev.Position.Y-d.lastPos.Y)) < hitPixels
	d.lastTap, d.lastPos = time.Now(), ev.Position
	d.w.click(ev.Position, double)
}

// Dragged is part of fyne.Draggable.
func (d *drawing) Dragged(ev *fyne.DragEvent) {
	if d.gesture == nil {
		start := ev.Position.Subtract(fyne.NewPos(ev.Dragged.DX, ev.Dragged.DY))
		button := d.button
		if button == 0 {
			button = desktop.MouseButtonPrimary
		}
		d.gesture = d.w.beginDrag(start, button)
	}
	d.w.dragTo(d.gesture, ev)
}

// DragEnd is part of fyne.Draggable.
func (d *drawing) DragEnd() {
	if d.gesture != nil {
		d.w.endDrag(d.gesture)
	}
	d.gesture = nil
}

// Scrolled is part of fyne.Scrollable: the wheel zooms about the mouse.
func (d *drawing) Scrolled(ev *fyne.ScrollEvent) {
	d.w.zoom(wheelZoom(ev.Scrolled.DY), ev.Position.X)
}

// MouseIn is part of desktop.Hoverable.
func (d *drawing) MouseIn(ev *desktop.MouseEvent) { d.MouseMoved(ev) }

// MouseMoved is part of desktop.Hoverable: the readout follows the mouse.
func (d *drawing) MouseMoved(ev *desktop.MouseEvent) {
	d.hoverX, d.hovering = d.view.ToModelX(ev.Position.X), true
	d.w.hoverChanged()
	d.Refresh()
}

// MouseOut is part of desktop.Hoverable.
func (d *drawing) MouseOut() {
	d.hovering = false
	d.w.hoverChanged()
	d.Refresh()
}

type drawingRenderer struct {
	d          *drawing
	background *fynecanvas.Rectangle
	objects    []fyne.CanvasObject
	size       fyne.Size
}

func (r *drawingRenderer) Layout(size fyne.Size) {
	r.background.Resize(size)
	r.d.frame.Resize(size)
	if size != r.size {
		r.size = size
		r.d.view.Resize(size.Width, size.Height)
		r.Refresh()
	}
}

func (r *drawingRenderer) MinSize() fyne.Size { return r.d.MinSize() }

// Refresh rebuilds the scene from the window's current state; with the
// nodal loads of a new solution, the selected element's panel too, and
// with a new automatic deflection scale, its label.
func (r *drawingRenderer) Refresh() {
	w := r.d.w
	in := w.sceneInput()
	if r.d.nodal.on {
		nl, fresh := r.d.nodal.of(w.shownSolution())
		in.NodalLoads = nl
		if fresh && w.selected.Kind == canvas.Element {
			defer w.ui.showProperties()
		}
	}
	before := r.d.scene
	r.d.scene = canvas.Build(in, r.d.view)
	// The automatic deflection scale follows the view: a zoom or a new
	// size of the drawing changes it, and the label beside the slider says it.
	if before != nil && before.Magnification != r.d.scene.Magnification && w.ui != nil {
		defer w.ui.showMagnification()
	}
	r.objects = append([]fyne.CanvasObject{r.background}, drawScene(r.d.scene)...)
	r.objects = append(r.objects, r.d.frame)
	r.background.Refresh()
}

func (r *drawingRenderer) Objects() []fyne.CanvasObject { return r.objects }

func (r *drawingRenderer) Destroy() {}
