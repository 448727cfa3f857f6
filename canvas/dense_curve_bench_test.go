package canvas

import (
	"fmt"
	"io"
	"testing"
)

// BenchmarkWritePNGOscillatingCurve draws one diagram curve as curve.points
// gives it for a result that swings from its lowest to its highest within
// every pixel column (a continuous beam over thousands of supports: three
// points per column, 400 px apart), alone and, as a diagram draws it, over
// the filled area between it and its baseline, beside a smooth curve of as
// many points. The rasterizer keeps each pixel row's cells in a list it
// walks from the left for every cell it touches, so drawn whole the zigzag
// cost time growing with the square of the columns it covers (a full-width
// one took minutes; see "Hostile sizes" in docs/performance.md); drawn in
// pieces (dense.go), it costs time in proportion, like the smooth curve.
//
//	go test -run '^$' -bench WritePNGOscillatingCurve -benchtime 1x ./canvas
func BenchmarkWritePNGOscillatingCurve(b *testing.B) {
	for _, columns := range []int{50, 100, 200, 400, 1200} {
		var zigzag, smooth []Point
		for k := range columns {
			x := float32(k)
			zigzag = append(zigzag, Point{x, 100}, Point{x + 0.3, 500}, Point{x + 0.6, 100})
			smooth = append(smooth, Point{x, 300}, Point{x + 0.3, 300.5}, Point{x + 0.6, 301})
		}
		line := func(pts []Point) Item { return Item{Kind: Polyline, Points: pts, Stroke: inkColour, StrokeWidth: 2} }
		area := Item{Kind: Polygon, Points: append(append([]Point{}, zigzag...), Point{zigzag[len(zigzag)-1].X, 300}, Point{0, 300}), Fill: withAlpha(inkColour, 0x38)}
		for _, c := range []struct {
			name  string
			items []Item
		}{{"zigzag", []Item{line(zigzag)}}, {"zigzag-area", []Item{area, line(zigzag)}}, {"smooth", []Item{line(smooth)}}} {
			s := &Scene{Width: 1200, Height: 800, Items: c.items}
			b.Run(fmt.Sprintf("%s/columns=%d", c.name, columns), func(b *testing.B) {
				for b.Loop() {
					if err := WritePNG(io.Discard, s, 96.0/72); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}
