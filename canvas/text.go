package canvas

import (
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

// textWidth is the width in pixels of s at the given pixel size.
func textWidth(s string, size float32, bold bool) float32 {
	f := textFace(size, bold)
	return float32(f.Width(s))
}

// textHeight is the height of a text box of the given pixel size.
func textHeight(size float32) float32 { return size * 1.2 }
