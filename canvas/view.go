package canvas

import "stave/fem"

// View is the transform between model x (m) and screen pixels, and the pixel
// size of the drawing area. The vertical layout is worked out by Build from
// Height and the switched-on layers; PanY shifts it as a whole.
type View struct {
	Width, Height float32
	// X0 is the model x (m) at the left edge; Scale is pixels per metre.
	X0, Scale float64
	// PanY shifts the whole drawing down by this many pixels.
	PanY float32
	// fitted remembers the member span while the view is still "fit to member",
	// so Resize can keep it fitted.
	fitted       bool
	fitX0, fitX1 float64
}

// Margins left and right of the fitted member, in pixels: room for support
// symbols and labels.
const (
	fitMarginLeft  = 70
	fitMarginRight = 90
)

// NewView returns a view of w × h pixels showing x from 0 to 1 m until Fit is called.
func NewView(w, h float32) View {
	v := View{Width: w, Height: h}
	v.fitRange(0, 1)
	return v
}

// Fit shows the whole member with margins.
func (v *View) Fit(m *fem.Model) {
	l := m.Length()
	if l <= 0 {
		l = 1
	}
	v.fitRange(0, l)
	v.PanY = 0
}

func (v *View) fitRange(x0, x1 float64) {
	left := float64(fitMarginLeft)
	avail := float64(v.Width) - fitMarginLeft - fitMarginRight
	if avail < 20 {
		avail = max(float64(v.Width)*0.8, 1)
		left = (float64(v.Width) - avail) / 2
	}
	v.Scale = avail / (x1 - x0)
	v.X0 = x0 - left/v.Scale
	v.fitted, v.fitX0, v.fitX1 = true, x0, x1
}

// Zoom scales the view by factor (> 1 zooms in) keeping the model point under
// the screen x aroundX in place.
func (v *View) Zoom(factor float32, aroundX float32) {
	if factor <= 0 {
		return
	}
	x := v.ToModelX(aroundX)
	v.Scale *= float64(factor)
	v.X0 = x - float64(aroundX)/v.Scale
	v.fitted = false
}

// Pan moves the drawing by dx, dy pixels (positive right and down).
func (v *View) Pan(dx, dy float32) {
	v.X0 -= float64(dx) / v.Scale
	v.PanY += dy
	if dx != 0 {
		v.fitted = false
	}
}

// Resize changes the pixel size; a fitted view stays fitted, otherwise the
// model point at the centre stays at the centre.
func (v *View) Resize(w, h float32) {
	if v.fitted {
		v.Width, v.Height = w, h
		v.fitRange(v.fitX0, v.fitX1)
		return
	}
	centre := v.ToModelX(v.Width / 2)
	v.Width, v.Height = w, h
	v.X0 = centre - float64(w)/2/v.Scale
}

// ToScreenX maps model x (m) to a screen x (pixels).
func (v View) ToScreenX(x float64) float32 { return float32((x - v.X0) * v.Scale) }

// ToModelX maps a screen x (pixels) to model x (m).
func (v View) ToModelX(px float32) float64 { return v.X0 + float64(px)/v.Scale }
