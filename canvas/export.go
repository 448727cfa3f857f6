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

// WriteImage draws in with the chosen panels, fitted to width × height
// pixels (points for vector formats), as "png", "svg" or "pdf". The hover
// cursor is left out; the selection and highlight are kept.
func WriteImage(w io.Writer, format string, in Input, panels ExportPanels, width, height float32) error {
	if in.Model == nil {
		return fmt.Errorf("canvas: there is no model to export")
	}
	in.Layers = panels.layers(in.Layers)
	in.Hovering = false
	v := NewView(width, height)
	v.Fit(in.Model)
	return writeScene(w, Build(in, v), format, 1)
}
