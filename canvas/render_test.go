package canvas

import (
	"bytes"
	"image"
	"image/png"
	"regexp"
	"strings"
	"testing"

	"stave/fem/units"
)

func demoScene(t *testing.T) (*Scene, Input) {
	t.Helper()
	m := demoModel(16)
	in := solved(t, m)
	v := NewView(900, 800)
	v.Fit(m)
	return Build(in, v), in
}

func isWhite(c interface{ RGBA() (r, g, b, a uint32) }) bool {
	r, g, b, _ := c.RGBA()
	return r > 0xf000 && g > 0xf000 && b > 0xf000
}

// darkNear reports whether any pixel within 2 px of (x, y) is not white.
func darkNear(img image.Image, x, y int) bool {
	for dy := -2; dy <= 2; dy++ {
		for dx := -2; dx <= 2; dx++ {
			if !isWhite(img.At(x+dx, y+dy)) {
				return true
			}
		}
	}
	return false
}

func TestPNGSizeAndPlaces(t *testing.T) {
	s, in := demoScene(t)
	var buf bytes.Buffer
	if err := WritePNG(&buf, s, 2); err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(&buf)
	if err != nil {
		t.Fatalf("the PNG does not decode: %v", err)
	}
	if b := img.Bounds(); b.Dx() != 1800 || b.Dy() != 1600 {
		t.Fatalf("PNG is %d × %d, want 1800 × 1600 (900 × 800 at scale 2)", b.Dx(), b.Dy())
	}
	v := NewView(900, 800)
	v.Fit(in.Model)
	at := func(px, py float32) (int, int) { return int(px * 2), int(py * 2) }
	// The member line, and where the bending moment strip puts the peak under the 20 kN load.
	if x, y := at(v.ToScreenX(1.0), s.MemberY); !darkNear(img, x, y) {
		t.Errorf("no member drawn at pixel (%d, %d)", x, y)
	}
	var moment *Strip
	for i := range s.Strips {
		if s.Strips[i].Name == "Bending moment" {
			moment = &s.Strips[i]
		}
	}
	if moment == nil {
		t.Fatal("no bending moment strip in the scene")
	}
	peak := in.Solution.At(2, 1).BendingMoment
	py := moment.BaselineY - float32(peak/moment.UnitsPerPixel)
	if x, y := at(v.ToScreenX(2), py); !darkNear(img, x, y) {
		t.Errorf("no moment curve at pixel (%d, %d) where the scene puts M(2 m) = %g N·m", x, y, peak)
	}
	// Above the curve at the same x, inside the strip but outside the diagram, the page is blank.
	if x, y := at(v.ToScreenX(2), moment.BaselineY-30); darkNear(img, x, y) {
		t.Errorf("ink at pixel (%d, %d), above a sagging moment that is drawn below its axis", x, y)
	}
}

// extremeLabel is the label Build writes for the largest sagging moment,
// found here from the solution's own samples.
func extremeLabel(in Input) string {
	best := in.Solution.Sample(4)[0]
	for _, f := range in.Solution.Sample(4) {
		if f.BendingMoment > best.BendingMoment {
			best = f
		}
	}
	return units.SI.Format(units.Moment, best.BendingMoment) + " at " + units.SI.Format(units.Position, best.X)
}

func TestSVGParsesAndLabelsExtremes(t *testing.T) {
	s, in := demoScene(t)
	var buf bytes.Buffer
	if err := WriteSVG(&buf, s); err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, buf.Bytes())
	want := extremeLabel(in)
	if !strings.Contains(strings.Join(texts, "\n"), want) {
		t.Errorf("the SVG has no text %q labelling the largest bending moment", want)
	}
}

func TestPDFHasOnePage(t *testing.T) {
	s, _ := demoScene(t)
	var buf bytes.Buffer
	if err := WritePDF(&buf, s); err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(buf.Bytes(), []byte("%PDF")) {
		t.Fatalf("the PDF starts with %q", buf.Bytes()[:8])
	}
	if n := countPages(buf.Bytes()); n != 1 {
		t.Errorf("the PDF has %d pages, want 1", n)
	}
}

var pageObject = regexp.MustCompile(`/Type\s*/Page[^s]`)

func countPages(pdf []byte) int { return len(pageObject.FindAll(pdf, -1)) }

// The screen's raster holds every shape, not the text, on a transparent
// background, at the size the screen asks for.
func TestRasterize(t *testing.T) {
	s, _ := demoScene(t)
	img := Rasterize(s, int(s.Width), int(s.Height))
	if b := img.Bounds(); b.Dx() != int(s.Width) || b.Dy() != int(s.Height) {
		t.Errorf("raster is %d × %d, want the scene size %g × %g", b.Dx(), b.Dy(), s.Width, s.Height)
	}
	if !darkNear(img, int(s.Width/2), int(s.MemberY)) {
		t.Error("the raster has no member line at the scene's member y")
	}
	if _, _, _, a := img.At(3, int(s.MemberY)).RGBA(); a != 0 {
		t.Error("the raster background is not transparent")
	}
}
