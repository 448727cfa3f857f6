package canvas

import (
	"fmt"
	"io"
)

// footerHeight is the band under an exported drawing that carries the caution.
const footerHeight = 18

// footerError refuses a drawing height that leaves no room above its
// footer, footer points high.
func footerError(height, footer float32) error {
	return &SizeError{fmt.Sprintf("canvas: a drawing %g points high leaves no room above its %g-point footer: give a height above %g points", height, footer, footer)}
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
		lines = append(wrap(note, smallSize, false, width-16), lines...)
	}
	footer := float32(len(lines)) * footerHeight
	if height <= footer {
		return footerError(height, footer)
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
