package canvas

import (
	"fmt"
	"io"
	"strings"

	"stave/fem/units"
)

// Small multiples: the same member drawn once per mesh, one drawing under
// the other at the same scale, each headed by its mesh and its largest gap
// to the exact solution in every diagram shown, so the eye follows the gap
// as the mesh is refined.

// Multiple is one drawing of a set of small multiples.
type Multiple struct {
	Input Input
	// Mesh says which mesh it is, in words: "2 elements per stretch".
	Mesh string
}

// WriteMultiples draws ms one under the other, each width × height points,
// with the exact curve and the gap shown, as "png" (scale pixels per
// point), "svg" or "pdf", with the caution in a footer.
func WriteMultiples(w io.Writer, format string, ms []Multiple, width, height float32, scale float64) error {
	if len(ms) == 0 {
		return fmt.Errorf("canvas: no drawings to set side by side")
	}
	const head = 20 // the heading line of each drawing
	page := &Scene{Width: width, Height: float32(len(ms))*(height+head) + footerHeight}
	for i, m := range ms {
		if m.Input.Model == nil {
			return fmt.Errorf("canvas: drawing %d of the small multiples has no model", i+1)
		}
		in := m.Input
		in.Overlays.ExactBand = true
		in.Selected, in.Hovering, in.Highlight, in.Cache = Ref{}, false, [2]float64{}, nil
		v := NewView(width, height)
		v.Fit(in.Model)
		b := build(in, v)
		top := float32(i) * (height + head)
		heading := m.Mesh + ": " + b.gapWords()
		page.Items = append(page.Items, Item{Kind: Text, Text: heading, At: Point{8, top + 3}, Size: labelSize, Bold: true,
			Stroke: inkColour, Width: textWidth(heading, labelSize, true)})
		appendScene(page, b.scene(), 0, top+head, 1)
		page.Items = append(page.Items, Item{Kind: Polyline, Points: []Point{{0, top + head + height}, {width, top + head + height}},
			Stroke: inkColour, StrokeWidth: 1.5})
	}
	page.Items = append(page.Items, Item{Kind: Text, Text: Caution, At: Point{8, page.Height - footerHeight + 4},
		Size: smallSize, Stroke: dimensionColour, Width: textWidth(Caution, smallSize, false)})
	return writeScene(w, page, format, scale)
}

// gapWords names the largest gap of each diagram built, or says why there
// is none.
func (b *builder) gapWords() string {
	switch {
	case b.in.Solution == nil:
		return "not solved"
	case b.in.Exact == nil:
		return "no exact solution to compare with"
	case len(b.gaps) == 0:
		return "no diagram shown"
	}
	var parts []string
	i := 0
	for _, d := range diagramsList {
		if !d.enabled(b.in.Overlays) {
			continue
		}
		g := b.gaps[i].at
		i++
		parts = append(parts, fmt.Sprintf("%s %s at %s", quantityWords(d.quantity), b.format(d.quantity.Info().Unit, g.value), b.format(units.Position, g.x)))
	}
	return "largest gap " + strings.Join(parts, ", ")
}
