package canvas

import (
	"image"
	"image/color"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
)

// Draw turns the scene into Fyne canvas objects placed in scene pixels: a
// white background, one raster holding every line, polygon and circle
// (painted by the same code as the PNG, at the screen's own pixel density)
// and one text object per label. The number of objects is therefore 2 + the
// number of labels, whatever the size of the mesh.
func Draw(s *Scene) []fyne.CanvasObject {
	bg := fynecanvas.NewRectangle(color.White)
	bg.Resize(fyne.NewSize(s.Width, s.Height))
	r := fynecanvas.NewRaster(func(w, h int) image.Image { return rasterize(s, w, h) })
	r.Resize(fyne.NewSize(s.Width, s.Height))
	objs := []fyne.CanvasObject{bg, r}
	for _, it := range s.Items {
		if it.Kind != Text {
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
		t.Move(fyne.NewPos(it.At.X, it.At.Y+(textHeight(it.Size)-m.Height)/2))
		t.Resize(m)
		objs = append(objs, t)
	}
	return objs
}

// rasterize paints the scene's shapes, without text, into a w × h image on a
// transparent background.
func rasterize(s *Scene, w, h int) image.Image {
	if w <= 0 || h <= 0 || s.Width <= 0 {
		return image.NewNRGBA(image.Rect(0, 0, 1, 1))
	}
	c := vgimg.NewWith(vgimg.UseWH(vg.Length(w), vg.Length(h)), vgimg.UseDPI(72), vgimg.UseBackgroundColor(color.Transparent))
	k := float64(w) / float64(s.Width)
	drawScene(c, s, vg.Point{Y: vg.Length(h)}, k, noText)
	return c.Image()
}
