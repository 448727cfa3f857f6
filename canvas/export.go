package canvas

import (
	"fmt"
	"io"
)

// footerHeight is the band under an exported drawing that carries the caution.
const footerHeight = 18

// footerError refuses a drawing height that leaves no room above its
// footer, footer points high, which holds what.
func footerError(height, footer float32, what string) error {
	return &SizeError{fmt.Sprintf("canvas: a drawing %g points high leaves no room above its %g-point footer (%s): give a height above %g points", height, footer, what, footer)}
}

// WriteImage draws in with its overlays, fitted to width × height
// points, as "png" (scale pixels per point), "svg" or "pdf", with a footer:
// note, when given (how far to trust the finite element answer), over the
// caution, since an exported drawing travels without the window around it.
// The hover cursor, the selection and the highlight are left out.
func WriteImage(w io.Writer, format string, in Input, width, height float32, scale float64, note string) error {
	if in.Model == nil {
		return fmt.Errorf("canvas: there is no model to export")
	}
	lines := []string{Caution}
	if note != "" {
		// Wrapped to the drawing, but no narrower than the caution's one
		// line: a drawing too narrow for that has no room for either.
		lines = append(wrap(note, smallSize, false, max(width-16, textWidth(Caution, smallSize, false)), textWidth), lines...)
	}
	footer := float32(len(lines)) * footerHeight
	if err := checkSize(&Scene{Width: width, Height: height}, rasterScale(format, scale)); err != nil {
		return err // a size no PNG can have, whatever the footer
	}
	if height <= footer {
		what := "the caution"
		if note != "" {
			what = "the mesh's accuracy and the caution"
		}
		return footerError(height, footer, what)
	}
	in.Selected, in.Hovering, in.Highlight = Ref{}, false, [2]float64{}
	v := NewView(width, height-footer)
	v.Fit(in.Model)
	s := Build(in, v)
	s.Height = height
	for i, ln := range lines {
		s.Items = append(s.Items, Item{Kind: Text, Text: ln, At: Point{8, height - footer + float32(i)*footerHeight + 4},
			Size: smallSize, Stroke: dimensionColour, Width: textWidth(ln, smallSize, false)})
	}
	return writeScene(w, s, format, scale)
}
