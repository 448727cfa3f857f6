package canvas

import (
	"fmt"
	"io"
)

// footerHeight is the band under an exported drawing that carries the caution.
const footerHeight = 18

// footerError refuses a drawing height that leaves no room above the footer.
func footerError(height float32) error {
	return &SizeError{fmt.Sprintf("canvas: a drawing %g points high leaves no room above its %d-point footer: give a height above %d points", height, footerHeight, footerHeight)}
}

// WriteImage draws in with its overlays, fitted to width × height
// points, as "png" (scale pixels per point), "svg" or "pdf", with the caution
// in a footer: an exported drawing travels without the window around it.
// The hover cursor, the selection and the highlight are left out.
func WriteImage(w io.Writer, format string, in Input, width, height float32, scale float64) error {
	if in.Model == nil {
		return fmt.Errorf("canvas: there is no model to export")
	}
	if height <= footerHeight {
		return footerError(height)
	}
	in.Selected, in.Hovering, in.Highlight = Ref{}, false, [2]float64{}
	v := NewView(width, height-footerHeight)
	v.Fit(in.Model)
	s := Build(in, v)
	s.Height = height
	s.Items = append(s.Items, Item{Kind: Text, Text: Caution, At: Point{8, height - footerHeight + 4},
		Size: smallSize, Stroke: dimensionColour, Width: textWidth(Caution, smallSize, false)})
	return writeScene(w, s, format, scale)
}
