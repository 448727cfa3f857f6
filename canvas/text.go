package canvas

import (
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"

	xfont "golang.org/x/image/font"
)

// textFace is the face every renderer draws text with. The scene measures
// text with it too, so label layout holds in every output. Importing plot
// registers the Liberation fonts in font.DefaultCache.
func textFace(size float32, bold bool) font.Face {
	fnt := font.Font{Typeface: plot.DefaultFont.Typeface, Variant: "Sans"}
	if bold {
		fnt.Weight = xfont.WeightBold
	}
	return font.DefaultCache.Lookup(fnt, vg.Length(size))
}

// textWidth is the width in pixels of s at the given pixel size, as drawScene
// draws it: superscripts smaller, in the regular face.
func textWidth(s string, size float32, bold bool) float32 {
	w := vg.Length(0)
	for _, run := range splitSuperscripts(s) {
		f := run.face(size, bold)
		w += f.Width(run.text)
	}
	return float32(w)
}

// textKey is a text as measured: its characters, size and weight.
type textKey struct {
	s    string
	size float32
	bold bool
}

// textWidth is the package's textWidth, measured once per drawing for each
// text: a drawing of many loads writes the same few values again and again.
func (b *builder) textWidth(s string, size float32, bold bool) float32 {
	k := textKey{s, size, bold}
	if w, ok := b.widths[k]; ok {
		return w
	}
	if b.widths == nil {
		b.widths = map[textKey]float32{}
	}
	w := textWidth(s, size, bold)
	b.widths[k] = w
	return w
}

// Superscript digits and minus are drawn in every export as ordinary
// characters, smaller and raised: "mm⁴" is "mm" and a raised "4". The PDF
// writer's text knows only code page 1252, which lacks ⁰ ⁴ … ⁹ ⁻, and the
// font has no ⁰ ⁹ ⁻, so PNG and SVG dropped them ("10⁻³" came out "10³");
// one way for all keeps "mm²" and "mm⁴" alike and the measured width true.
const (
	superscriptScale = 0.62 // of the text's size
	superscriptRise  = 0.36 // of the text's size, above the baseline
)

var superscriptDigits = map[rune]rune{'⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-'}

// textRun is a stretch of text drawn at one size and height.
type textRun struct {
	text   string
	raised bool
}

// face is the face a run is measured and drawn with at text size size:
// superscripts smaller and never bold.
func (r textRun) face(size float32, bold bool) font.Face {
	if r.raised {
		return textFace(superscriptScale*size, false)
	}
	return textFace(size, bold)
}

// splitSuperscripts cuts s into runs of ordinary text and of superscripts,
// the latter written as ordinary characters.
func splitSuperscripts(s string) []textRun {
	var runs []textRun
	var b strings.Builder
	raised := false
	flush := func() {
		if b.Len() > 0 {
			runs = append(runs, textRun{b.String(), raised})
			b.Reset()
		}
	}
	for _, r := range s {
		plain, sup := superscriptDigits[r]
		if sup != raised {
			flush()
			raised = sup
		}
		if sup {
			r = plain
		}
		b.WriteRune(r)
	}
	flush()
	return runs
}

// TextHeight is the height of a text box of the given pixel size.
func TextHeight(size float32) float32 { return size * 1.2 }
