package canvas

import (
	"fmt"
	"io"
)

// ExportPanels chooses what an exported image or sheet shows under the sketch
// of the member, which is always drawn.
type ExportPanels struct {
	Deformed, AxialForce, ShearForce, BendingMoment, Stress bool
}

// DefaultExportPanels is the shear force and bending moment with the deformed shape.
func DefaultExportPanels() ExportPanels {
	return ExportPanels{Deformed: true, ShearForce: true, BendingMoment: true}
}

// layers switches base's panels to the chosen ones, keeping its other layers.
func (p ExportPanels) layers(base Layers) Layers {
	base.Deformed, base.AxialForce, base.ShearForce, base.BendingMoment, base.Stress =
		p.Deformed, p.AxialForce, p.ShearForce, p.BendingMoment, p.Stress
	return base
}

// count is the number of diagram strips chosen.
func (p ExportPanels) count() int {
	n := 0
	for _, on := range []bool{p.AxialForce, p.ShearForce, p.BendingMoment, p.Stress} {
		if on {
			n++
		}
	}
	return n
}

// footerHeight is the band under an exported drawing that carries the caution.
const footerHeight = 18

// WriteImage draws in with the chosen panels, fitted to width × height
// points, as "png" (scale pixels per point), "svg" or "pdf", with the caution
// in a footer: an exported drawing travels without the window around it.
// The hover cursor, the selection and the highlight are left out.
func WriteImage(w io.Writer, format string, in Input, panels ExportPanels, width, height float32, scale float64) error {
	if in.Model == nil {
		return fmt.Errorf("canvas: there is no model to export")
	}
	if height <= footerHeight {
		return fmt.Errorf("canvas: an exported drawing must be taller than %d points, got %g", footerHeight, height)
	}
	in.Layers = panels.layers(in.Layers)
	in.Selected, in.Hovering, in.Highlight = Ref{}, false, [2]float64{}
	v := NewView(width, height-footerHeight)
	v.Fit(in.Model)
	s := Build(in, v)
	s.Height = height
	s.Items = append(s.Items, Item{Kind: Text, Text: Caution, At: Point{8, height - footerHeight + 4},
		Size: smallSize, Stroke: dimensionColour, Width: textWidth(Caution, smallSize, false)})
	return writeScene(w, s, format, scale)
}
