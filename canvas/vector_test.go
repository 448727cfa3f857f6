package canvas

import (
	"bytes"
	"image/color"
	"math"
	"testing"

	"golang.org/x/text/encoding/charmap"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/recorder"
)

// Superscript digits are drawn as ordinary characters, smaller and raised,
// right after the text before them, in every export: "cm⁴", not "cm^4" (the
// PDF writer's text knows only code page 1252, which lacks ⁴), and not
// "10³" for "10⁻³" (the font has no ⁻). The runs end where the layout's
// measured width says.
func TestSuperscriptsInExports(t *testing.T) {
	const size = 20
	text := "I = 8356 cm⁴ at 10⁻³"
	s := &Scene{Width: 400, Height: 100, Items: []Item{
		{Kind: Text, Text: text, At: Point{X: 10, Y: 10}, Size: size, Stroke: color.NRGBA{A: 255}},
	}}
	want := []struct {
		text   string
		raised bool
	}{{"I = 8356 cm", false}, {"4", true}, {" at 10", false}, {"-3", true}}
	for _, style := range []paintStyle{allText, forPDF} {
		got := drawnStrings(s, style)
		if len(got) != len(want) {
			t.Fatalf("style %d: %d strings drawn, want %d: %+v", style, len(got), len(want), got)
		}
		base := got[0].Point.Y
		x := got[0].Point.X
		for i, w := range want {
			g := got[i]
			if g.String != w.text {
				t.Errorf("style %d: string %d is %q, want %q", style, i, g.String, w.text)
			}
			wantSize, wantY := vg.Length(size), base
			if w.raised {
				wantSize, wantY = vg.Length(superscriptScale*size), base+vg.Length(superscriptRise*size)
			}
			// The size goes through float32.
			if math.Abs(float64(g.Size-wantSize)) > 1e-5 || math.Abs(float64(g.Point.Y-wantY)) > 1e-9 {
				t.Errorf("style %d: %q drawn at size %v, height %v; want %v, %v", style, g.String, g.Size, g.Point.Y, wantSize, wantY)
			}
			// Each run starts where the one before ended.
			if math.Abs(float64(g.Point.X-x)) > 1e-9 {
				t.Errorf("style %d: %q starts at x = %v, want %v", style, g.String, g.Point.X, x)
			}
			f := textFace(float32(g.Size), false)
			x += f.Width(w.text)
		}
		if end := float64(x - got[0].Point.X); math.Abs(end-float64(textWidth(text, size, false))) > 1e-3 {
			t.Errorf("style %d: the runs take %v, the layout measured %v", style, end, textWidth(text, size, false))
		}
	}
}

// Items whose coordinates overflowed (a deflection magnified beyond
// float32, a diagram scaled by a denormal peak) are left out of every
// export: in SVG and PDF they were "NaN" and "Inf" text, and the PNG
// rasterizer never finished on them.
func TestNonFiniteItemsAreLeftOut(t *testing.T) {
	inf, nan := float32(math.Inf(1)), float32(math.NaN())
	blue := color.NRGBA{0x1f, 0x4e, 0x9a, 0xff}
	good := Item{Kind: Polyline, Points: []Point{{10, 10}, {90, 40}}, Stroke: blue, StrokeWidth: 1}
	for _, bad := range []Item{
		{Kind: Polyline, Points: []Point{{10, 10}, {inf, 40}}, Stroke: blue, StrokeWidth: 1},
		{Kind: Polygon, Points: []Point{{10, 10}, {50, nan}, {90, 10}}, Fill: blue},
		{Kind: Circle, Center: Point{50, 50}, Radius: inf, Stroke: blue, StrokeWidth: 1},
	} {
		for _, format := range []string{"svg", "png"} {
			var want, got bytes.Buffer
			if err := writeScene(&want, &Scene{Width: 100, Height: 60, Items: []Item{good}}, format, 1); err != nil {
				t.Fatal(err)
			}
			if err := writeScene(&got, &Scene{Width: 100, Height: 60, Items: []Item{good, bad}}, format, 1); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(got.Bytes(), want.Bytes()) {
				t.Errorf("%s with a %v item of non-finite coordinates differs from the drawing without it", format, bad.Kind)
			}
		}
	}
}

// The PDF's text is in code page 1252 (the PDF writer's only encoding),
// which lacks the minus sign U+2212 and the Greek letters (the Windows-1252
// code chart, from memory): the sheet's warnings read "FE ? exact 0 mm" and
// a Timoshenko segment "κ 0.4000, ν 0.3000" came out "? 0.4000, ? 0.3000".
// They are spelt in the characters the code page has, and the next run
// starts where the spelt text ends.
func TestPDFTextSpellsWhatCodePage1252Lacks(t *testing.T) {
	const size = 10
	s := &Scene{Width: 800, Height: 100, Items: []Item{
		{Kind: Text, Text: "FE − exact 0 mm; κ 0.4000, ν 0.3000; π²EI/(KL)²; δ ≤ L/360 at 10⁻³", At: Point{X: 10, Y: 10}, Size: size, Stroke: color.NRGBA{A: 255}},
	}}
	drawn := drawnStrings(s, forPDF)
	var got string
	for _, f := range drawn {
		got += f.String
	}
	const want = "FE - exact 0 mm; kappa 0.4000, nu 0.3000; pi2EI/(KL)2; delta <= L/360 at 10-3" // ² and ⁻³ are raised runs
	if got != want {
		t.Errorf("PDF text %q, want %q", got, want)
	}
	for i := 1; i < len(drawn); i++ {
		prev := drawn[i-1]
		f := textFace(float32(prev.Size), false)
		end := prev.Point.X + f.Width(decode1252(prev.String))
		if math.Abs(float64(drawn[i].Point.X-end)) > 1e-9 {
			t.Errorf("run %q starts at x = %v, the run before it ends at %v", drawn[i].String, drawn[i].Point.X, end)
		}
	}
}

func decode1252(s string) string {
	out, _ := charmap.Windows1252.NewDecoder().String(s)
	return out
}

// drawnStrings are the texts drawScene writes of s in style, in order, as
// a recording canvas keeps them.
func drawnStrings(s *Scene, style paintStyle) []*recorder.FillString {
	var rec recorder.Canvas
	drawScene(&rec, s, vg.Point{Y: 100}, 1, style)
	var out []*recorder.FillString
	for _, a := range rec.Actions {
		if f, ok := a.(*recorder.FillString); ok {
			out = append(out, f)
		}
	}
	return out
}
