package canvas

import (
	"fmt"
	"image"
	"image/color"
	"io"
	"math"
	"strings"

	"golang.org/x/text/encoding/charmap"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgpdf"
	"gonum.org/v1/plot/vg/vgsvg"
)

// paintStyle says how drawScene treats text and colour.
type paintStyle int

const (
	allText paintStyle = iota
	noText             // the screen draws text natively
	// forPDF works around three vgpdf limits: it cannot select its own bold
	// face (bold is overprinted), it reads colours as unpremultiplied, and it
	// writes text in code page 1252.
	forPDF
)

// drawable says every coordinate and length of it is a finite number.
func drawable(it Item) bool {
	at := func(p Point) bool { return finite(vg.Point{X: vg.Length(p.X), Y: vg.Length(p.Y)}) }
	for _, p := range it.Points {
		if !at(p) {
			return false
		}
	}
	return at(it.Center) && at(it.At) && at(Point{it.Radius, 0})
}

// drawScene draws s onto c with its top-left corner at origin (in c's
// y-up coordinates, the top edge is origin.Y) and every length times k.
// PNG, SVG, PDF and the calculation sheet all go through here, so they
// cannot drift apart.
func drawScene(c vg.Canvas, s *Scene, origin vg.Point, k float64, style paintStyle) {
	pt := func(p Point) vg.Point {
		return vg.Point{X: origin.X + vg.Length(float64(p.X)*k), Y: origin.Y - vg.Length(float64(p.Y)*k)}
	}
	path := func(pts []Point, closed bool) vg.Path {
		var p vg.Path
		for i, q := range pts {
			if i == 0 {
				p.Move(pt(q))
			} else {
				p.Line(pt(q))
			}
		}
		if closed {
			p.Close()
		}
		return p
	}
	setColour := func(col color.NRGBA) {
		if style == forPDF {
			c.SetColor(straightAlpha(col))
			return
		}
		c.SetColor(col)
	}
	dashes := func(it Item) []vg.Length {
		if it.Dash {
			return []vg.Length{vg.Length(5 * k), vg.Length(3 * k)}
		}
		return nil
	}
	// strokeStyle sets the item's line and says whether it has one.
	strokeStyle := func(it Item) bool {
		if it.Stroke.A == 0 || it.StrokeWidth <= 0 {
			return false
		}
		setColour(it.Stroke)
		c.SetLineWidth(vg.Length(float64(it.StrokeWidth) * k))
		c.SetLineDash(dashes(it), 0)
		return true
	}
	stroke := func(it Item, p vg.Path) {
		if strokeStyle(it) {
			c.Stroke(p)
		}
	}
	fill := func(col color.NRGBA, p vg.Path) {
		if col.A == 0 {
			return
		}
		setColour(col)
		c.Fill(p)
	}
	grid, raster := rasterGridOf(c)
	// dense returns the item's points on the canvas when a raster canvas
	// must draw them in pieces (see denseCrossings).
	dense := func(it Item, closed bool) ([]vg.Point, bool) {
		if !raster || len(it.Points) <= denseCrossings {
			return nil, false
		}
		pts := make([]vg.Point, len(it.Points))
		for i, q := range it.Points {
			pts[i] = pt(q)
		}
		return pts, grid.dense(pts, closed)
	}
	strokePieces := func(it Item, pts []vg.Point) {
		if !strokeStyle(it) {
			return
		}
		dash := dashes(it)
		grid.strokePieces(pts, dash, func(p vg.Path, offset vg.Length) {
			if dash != nil {
				c.SetLineDash(dash, offset)
			}
			c.Stroke(p)
		})
	}
	items := s.Items
	if raster {
		items = clipItems(items, Point{-clipMargin, -clipMargin}, Point{s.Width + clipMargin, s.Height + clipMargin})
	}
	for _, it := range items {
		if !drawable(it) {
			continue // an overflowed curve: nothing to draw, and it hangs the rasterizer
		}
		switch it.Kind {
		case Polyline:
			if len(it.Points) < 2 {
				continue
			}
			if pts, ok := dense(it, false); ok {
				strokePieces(it, pts)
				continue
			}
			stroke(it, path(it.Points, false))
		case Polygon:
			if len(it.Points) < 3 {
				continue
			}
			if pts, ok := dense(it, true); ok {
				if it.Fill.A != 0 {
					setColour(it.Fill)
					grid.fillSlabs(pts, c.Fill)
				}
				strokePieces(it, append(pts, pts[0]))
				continue
			}
			p := path(it.Points, true)
			fill(it.Fill, p)
			stroke(it, p)
		case Circle:
			var p vg.Path
			ctr := pt(it.Center)
			r := vg.Length(float64(it.Radius) * k)
			p.Move(vg.Point{X: ctr.X + r, Y: ctr.Y})
			p.Arc(ctr, r, 0, 2*math.Pi)
			p.Close()
			fill(it.Fill, p)
			stroke(it, p)
		case Text:
			if style == noText {
				continue
			}
			overprint := it.Bold && style == forPDF
			face := textFace(it.Size*float32(k), it.Bold && !overprint)
			top := pt(it.At)
			baseline := top.Y - face.Extents().Ascent - vg.Length(0.04*float64(it.Size)*k)
			setColour(it.Stroke)
			at := vg.Point{X: top.X, Y: baseline}
			size := float64(it.Size) * k
			for _, run := range splitSuperscripts(it.Text) {
				f, y, rs := run.face(it.Size*float32(k), it.Bold && !overprint), at.Y, size
				if run.raised {
					rs = superscriptScale * size
					y += vg.Length(superscriptRise * size)
				}
				txt, shown := run.text, run.text
				if style == forPDF {
					shown = spellFor1252(txt)
					txt = codePage1252(shown)
				}
				c.FillString(f, vg.Point{X: at.X, Y: y}, txt)
				if overprint {
					c.FillString(f, vg.Point{X: at.X + vg.Length(0.045*rs), Y: y}, txt)
				}
				at.X += f.Width(shown)
			}
		}
	}
}

// paint fills the canvas white and draws the scene over it at 1 point per
// scene pixel times k.
func paint(c vg.Canvas, s *Scene, k float64, style paintStyle) {
	w, h := vg.Length(float64(s.Width)*k), vg.Length(float64(s.Height)*k)
	var bg vg.Path
	bg.Move(vg.Point{})
	bg.Line(vg.Point{X: w})
	bg.Line(vg.Point{X: w, Y: h})
	bg.Line(vg.Point{Y: h})
	bg.Close()
	c.SetColor(color.White)
	c.Fill(bg)
	drawScene(c, s, vg.Point{Y: h}, k, style)
}

// WritePNG writes the scene as a PNG of Width·scale × Height·scale pixels.
func WritePNG(w io.Writer, s *Scene, scale float64) error { return writeScene(w, s, "png", scale) }

// WriteSVG writes the scene as SVG, one point per scene pixel.
func WriteSVG(w io.Writer, s *Scene) error { return writeScene(w, s, "svg", 1) }

// WritePDF writes the scene as a one-page PDF, one point per scene pixel.
func WritePDF(w io.Writer, s *Scene) error { return writeScene(w, s, "pdf", 1) }

// writeScene writes s as "png" (scale pixels per scene pixel), "svg" or
// "pdf" (one point per scene pixel).
func writeScene(w io.Writer, s *Scene, format string, scale float64) error {
	scale = rasterScale(format, scale)
	if err := checkSize(s, scale); err != nil {
		return err
	}
	var c interface {
		vg.Canvas
		io.WriterTo
	}
	style := allText
	switch format {
	case "png":
		// At 72 dpi one point is one pixel.
		c = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(vg.Length(float64(s.Width)*scale), vg.Length(float64(s.Height)*scale)), vgimg.UseDPI(72))}
	case "svg":
		c = vgsvg.New(vg.Length(s.Width), vg.Length(s.Height))
	case "pdf":
		c = vgpdf.New(vg.Length(s.Width), vg.Length(s.Height))
		style = forPDF
	default:
		return fmt.Errorf("canvas: cannot write a drawing as %q: use \"png\", \"svg\" or \"pdf\"", format)
	}
	paint(c, s, scale, style)
	_, err := c.WriteTo(w)
	return err
}

// MaxPixels is the most pixels a side of a PNG may have.
const MaxPixels = 20000

// SizeError is the refusal of a drawing's size: a PNG that would not come
// to 1 to MaxPixels pixels a side at its density, or a drawing too low for
// its footer. A caller that takes the size and density from the user tells
// it apart from a failure to write.
type SizeError struct{ msg string }

func (e *SizeError) Error() string { return e.msg }

// rasterScale is the pixels per point a drawing of format is written at:
// scale for a PNG, 1 for the vector formats.
func rasterScale(format string, scale float64) float64 {
	if format != "png" {
		return 1
	}
	return scale
}

func checkSize(s *Scene, scale float64) error {
	if s == nil {
		return fmt.Errorf("canvas: no scene to write: call Build first")
	}
	w, h := float64(s.Width)*scale, float64(s.Height)*scale
	if s.Width < 1 || s.Height < 1 || !(w >= 1 && w <= MaxPixels && h >= 1 && h <= MaxPixels) {
		if scale == 1 {
			return &SizeError{fmt.Sprintf("canvas: a drawing of %g × %g points: each side must come to 1 to %d points", s.Width, s.Height, MaxPixels)}
		}
		lo, hi := 72/float64(min(s.Width, s.Height)), MaxPixels*72/float64(max(s.Width, s.Height))
		return &SizeError{fmt.Sprintf("canvas: a drawing of %g × %g points at %.6g dpi come to %s × %s pixels, and a PNG has 1 to %d pixels a side: give %g to %g dpi for this drawing",
			s.Width, s.Height, scale*72, pixels(w), pixels(h), MaxPixels, math.Ceil(lo*100)/100, math.Floor(hi))}
	}
	return nil
}

// pixels writes a count of pixels: whole from 10 up, to two figures below.
func pixels(v float64) string {
	if v >= 10 {
		return fmt.Sprintf("%.0f", v)
	}
	return fmt.Sprintf("%.2g", v)
}

// straightAlpha is a colour whose RGBA method returns unpremultiplied
// channels, which is what vgpdf expects: a premultiplied translucent colour
// would come out dark.
type straightAlpha color.NRGBA

func (c straightAlpha) RGBA() (r, g, b, a uint32) {
	return uint32(c.R) * 0x101, uint32(c.G) * 0x101, uint32(c.B) * 0x101, uint32(c.A) * 0x101
}

// codePage1252 re-encodes s for vgpdf's text, spelt as spellFor1252 spells
// it.
func codePage1252(s string) string {
	// spellFor1252 leaves nothing the code page lacks: no error.
	out, _ := charmap.Windows1252.NewEncoder().String(spellFor1252(s))
	return out
}

// spellFor1252 spells what code page 1252 lacks in the texts Stave writes
// in what it has (pdfSpelling), anything else as "?".
func spellFor1252(s string) string {
	enc := charmap.Windows1252.NewEncoder()
	if _, err := enc.String(s); err == nil {
		return s
	}
	var b strings.Builder
	for _, r := range s {
		if _, err := enc.String(string(r)); err == nil {
			b.WriteRune(r)
		} else if spelt, ok := pdfSpelling[r]; ok {
			b.WriteString(spelt)
		} else {
			b.WriteByte('?')
		}
	}
	return b.String()
}

// pdfSpelling spells the characters of Stave's texts that code page 1252
// lacks: the minus sign of "FE − exact", the Greek letters of section and
// material symbols (κ, ν) and of formulas (π²EI/(KL)², δ = PL³/(3EI)),
// comparisons and foot and inch marks. The PDF's "FE ? exact" read as a
// question.
var pdfSpelling = map[rune]string{
	'−': "-", '∓': "-/+", '≤': "<=", '≥': ">=", '≈': "~", '→': "->", '⋅': "·", '′': "'", '″': "\"", 'ℓ': "l",
	'α': "alpha", 'β': "beta", 'γ': "gamma", 'δ': "delta", 'Δ': "Delta", 'ε': "epsilon", 'η': "eta", 'θ': "theta",
	'κ': "kappa", 'λ': "lambda", 'ν': "nu", 'ξ': "xi", 'π': "pi", 'ρ': "rho", 'σ': "sigma", 'Σ': "Sigma",
	'τ': "tau", 'φ': "phi", 'ω': "omega",
}

// Rasterize paints the scene's shapes, without text, into a w × h image on a
// transparent background: the screen draws the text itself, in its own font.
func Rasterize(s *Scene, w, h int) image.Image {
	if w <= 0 || h <= 0 || s.Width <= 0 {
		return image.NewNRGBA(image.Rect(0, 0, 1, 1))
	}
	c := vgimg.NewWith(vgimg.UseWH(vg.Length(w), vg.Length(h)), vgimg.UseDPI(72), vgimg.UseBackgroundColor(color.Transparent))
	k := float64(w) / float64(s.Width)
	drawScene(c, s, vg.Point{Y: vg.Length(h)}, k, noText)
	return c.Image()
}
