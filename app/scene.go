package app

import (
	"image"
	"image/color"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"

	"stave/canvas"
)

// drawScene turns the scene into Fyne canvas objects placed in scene pixels: a
// white background, one raster holding every line, polygon and circle
// (painted by the same code as the PNG, at the screen's own pixel density)
// and one text object per label. The number of objects is therefore 2 + the
// number of labels, whatever the size of the mesh.
func drawScene(s *canvas.Scene) []fyne.CanvasObject {
	bg := fynecanvas.NewRectangle(color.White)
	bg.Resize(fyne.NewSize(s.Width, s.Height))
	r := fynecanvas.NewRaster(func(w, h int) image.Image { return canvas.Rasterize(s, w, h) })
	r.Resize(fyne.NewSize(s.Width, s.Height))
	objs := []fyne.CanvasObject{bg, r}
	for _, it := range s.Items {
		if it.Kind != canvas.Text {
			continue
		}
		style := fyne.TextStyle{Bold: it.Bold}
		t := fynecanvas.NewText(it.Text, it.Stroke)
		t.TextStyle = style
		// The screen font is a little wider than the one the scene was laid
		// out with: shrink it to the measured width so labels keep their
		// places. Fyne measures in steps of size, so a size scaled in
		// proportion can measure as wide as before: step on until it fits.
		size := it.Size
		m := fyne.MeasureText(it.Text, size, style)
		for i := 0; i < 8 && m.Width > it.Width && it.Width > 0; i++ {
			size = min(size*it.Width/m.Width, size-0.25)
			m = fyne.MeasureText(it.Text, size, style)
		}
		t.TextSize = size
		t.Move(fyne.NewPos(it.At.X, it.At.Y+(canvas.TextHeight(it.Size)-m.Height)/2))
		t.Resize(m)
		objs = append(objs, t)
	}
	return objs
}
