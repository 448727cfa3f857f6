package canvas

import (
	"image/color"
	"math"
	"testing"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/recorder"
)

// In a PDF, superscript digits are written as ordinary characters, smaller
// and raised, right after the text before them: "cm⁴", not "cm^4" (the PDF
// writer's text knows only code page 1252, which lacks ⁴).
func TestPDFSuperscripts(t *testing.T) {
	const size = 20
	s := &Scene{Width: 400, Height: 100, Items: []Item{
		{Kind: Text, Text: "I = 8356 cm⁴ at 10⁻³", At: Point{X: 10, Y: 10}, Size: size, Stroke: color.NRGBA{A: 255}},
	}}
	var rec recorder.Canvas
	drawScene(&rec, s, vg.Point{Y: 100}, 1, forPDF)
	var got []*recorder.FillString
	for _, a := range rec.Actions {
		if f, ok := a.(*recorder.FillString); ok {
			got = append(got, f)
		}
	}
	want := []struct {
		text   string
		raised bool
	}{{"I = 8356 cm", false}, {"4", true}, {" at 10", false}, {"-3", true}}
	// ³ is in code page 1252 but is raised like ⁴, so "10⁻³" is one run.
	if len(got) != len(want) {
		t.Fatalf("%d strings drawn, want %d: %+v", len(got), len(want), got)
	}
	base := got[0].Point.Y
	x := got[0].Point.X
	for i, w := range want {
		g := got[i]
		if g.String != w.text {
			t.Errorf("string %d is %q, want %q", i, g.String, w.text)
		}
		wantSize, wantY := vg.Length(size), base
		if w.raised {
			wantSize, wantY = vg.Length(superscriptScale*size), base+vg.Length(superscriptRise*size)
		}
		if math.Abs(float64(g.Size-wantSize)) > 1e-5 || math.Abs(float64(g.Point.Y-wantY)) > 1e-9 { // the size goes through float32
			t.Errorf("%q drawn at size %v, height %v; want %v, %v", g.String, g.Size, g.Point.Y, wantSize, wantY)
		}
		// Each run starts where the one before ended.
		if math.Abs(float64(g.Point.X-x)) > 1e-9 {
			t.Errorf("%q starts at x = %v, want %v", g.String, g.Point.X, x)
		}
		f := textFace(float32(g.Size), false)
		x += f.Width(w.text)
	}
	// On screen, in PNG and SVG the text goes whole, with its own glyphs.
	var png recorder.Canvas
	drawScene(&png, s, vg.Point{Y: 100}, 1, allText)
	if n := len(png.Actions); n != 2 { // colour and one string
		t.Errorf("PNG/SVG: %d actions, want the colour and one string", n)
	}
}
