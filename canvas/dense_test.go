package canvas

import (
	"image"
	"image/color"
	"math"
	"testing"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
)

// wholePaths hides the raster canvas under it from drawScene, which then
// draws every path whole, as it did before dense paths were cut up.
type wholePaths struct{ vg.Canvas }

// paintBoth draws s onto white w × h images, once as the raster renderer
// does and once with every path whole.
func paintBoth(s *Scene, w, h int) (pieces, whole *image.RGBA) {
	draw := func(wrap func(vg.Canvas) vg.Canvas) *image.RGBA {
		c := vgimg.NewWith(vgimg.UseWH(vg.Length(w), vg.Length(h)), vgimg.UseDPI(72), vgimg.UseBackgroundColor(color.White))
		drawScene(wrap(c), s, vg.Point{Y: vg.Length(h)}, float64(w)/float64(s.Width), noText)
		return c.Image().(*image.RGBA)
	}
	return draw(func(c vg.Canvas) vg.Canvas { return c }), draw(func(c vg.Canvas) vg.Canvas { return wholePaths{c} })
}

// imageDifference is the largest difference of one channel between a and
// b and the mean over pixels of each pixel's largest, in 1/255.
func imageDifference(a, b *image.RGBA) (largest int, mean float64) {
	sum := 0
	for i := 0; i < len(a.Pix); i += 4 {
		worst := 0
		for k := range 4 {
			worst = max(worst, int(a.Pix[i+k])-int(b.Pix[i+k]), int(b.Pix[i+k])-int(a.Pix[i+k]))
		}
		largest, sum = max(largest, worst), sum+worst
	}
	return largest, float64(sum) / float64(len(a.Pix)/4)
}

// zigzag is a curve that swings between y = 20 and y = 100 within each of
// its columns, as curve.points gives it for a beam over many supports.
func zigzag(columns int, step float32) []Point {
	var pts []Point
	for k := range columns {
		x := 10 + step*float32(k)
		pts = append(pts, Point{x, 20 + float32(k%3)}, Point{x + 0.3*step, 100 - float32(k%5)}, Point{x + 0.6*step, 30})
	}
	return pts
}

// A path that crosses pixel rows many times is drawn in pieces on a raster
// canvas; the picture is the one the whole path gives, to rounding. Fills
// are cut at whole pixels, so each pixel is painted once with the same
// coverage; a stroked piece reaches back over the one before it, which
// paints the edge pixels of that overlap twice, a little darker (the
// largest differences, at the tips of the swings), but leaves no light
// seam inside the band.
func TestDensePathsLookAsWhole(t *testing.T) {
	curve := zigzag(80, 2.5)
	area := append(append([]Point{}, curve...), Point{curve[len(curve)-1].X, 60}, Point{curve[0].X, 60})
	blue := color.NRGBA{0x1f, 0x4e, 0x9a, 0xff}
	tests := []struct {
		name       string
		item       Item
		largest    int     // per channel, in 1/255
		mean       float64 // of each pixel's largest, in 1/255
		closedPath bool
	}{
		{"filled area under the curve", Item{Kind: Polygon, Points: area, Fill: withAlpha(blue, 0x38)}, 2, 0.1, true},
		{"opaque fill", Item{Kind: Polygon, Points: area, Fill: blue}, 4, 0.1, true},
		{"stroked curve", Item{Kind: Polyline, Points: curve, Stroke: blue, StrokeWidth: 1.8}, 64, 4, false},
		{"dashed curve", Item{Kind: Polyline, Points: curve, Stroke: blue, StrokeWidth: 2, Dash: true}, 64, 4, false},
		{"filled and stroked", Item{Kind: Polygon, Points: area, Fill: withAlpha(blue, 0x38), Stroke: blue, StrokeWidth: 1}, 64, 4, true},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s := &Scene{Width: 220, Height: 120, Items: []Item{tc.item}}
			pieces, whole := paintBoth(s, 330, 180)
			c := vgimg.NewWith(vgimg.UseWH(330, 180), vgimg.UseDPI(72))
			grid, _ := rasterGridOf(c)
			pts := make([]vg.Point, len(tc.item.Points))
			for i, p := range tc.item.Points {
				pts[i] = vg.Point{X: vg.Length(p.X * 1.5), Y: vg.Length(180 - p.Y*1.5)}
			}
			if !grid.dense(pts, tc.closedPath) {
				t.Fatal("the test's path is not dense enough to be drawn in pieces")
			}
			largest, mean := imageDifference(pieces, whole)
			if largest > tc.largest || mean > tc.mean {
				t.Errorf("drawn in pieces, the picture differs from the whole path's by up to %d/255 (mean %.3f/255), want at most %d/255 (mean %.3g/255)",
					largest, mean, tc.largest, tc.mean)
			}
			t.Logf("largest difference %d/255, mean %.3f/255", largest, mean)
		})
	}
}

// Curves a drawing usually holds are drawn whole, exactly as before: a
// moment diagram over twenty spans sampled at every pixel, a straight line
// of many points, a curve whose points are fewer than the threshold.
func TestOrdinaryPathsAreNotDense(t *testing.T) {
	c := vgimg.NewWith(vgimg.UseWH(1200, 800), vgimg.UseDPI(72))
	grid, ok := rasterGridOf(c)
	if !ok {
		t.Fatal("a vgimg canvas is not taken for a raster one")
	}
	spans := make([]vg.Point, 0, 4*1200)
	flat := make([]vg.Point, 0, 4*1200)
	for k := range 4 * 1200 {
		x := float64(k) / 4
		spans = append(spans, vg.Point{X: vg.Length(x), Y: vg.Length(400 + 300*math.Abs(math.Sin(20*math.Pi*x/1200)))})
		flat = append(flat, vg.Point{X: vg.Length(x), Y: 300})
	}
	few := make([]vg.Point, denseCrossings)
	for k := range few {
		few[k] = vg.Point{X: vg.Length(k), Y: vg.Length(100 + 500*(k%2))}
	}
	for _, tc := range []struct {
		name string
		pts  []vg.Point
	}{{"twenty spans", spans}, {"flat", flat}, {"few points", few}} {
		if grid.dense(tc.pts, false) {
			t.Errorf("%s: taken for a dense path", tc.name)
		}
		if grid.dense(tc.pts, true) {
			t.Errorf("%s, closed: taken for a dense path", tc.name)
		}
	}
	if _, ok := rasterGridOf(wholePaths{c}); ok {
		t.Error("a wrapped canvas is taken for a raster one")
	}
}

// The pieces of a dense path cover it: each piece starts at a point of
// the path at most pieceSegments/4 points back from where the last one
// ended and at least leadIn pixels to its left where it can, goes on along
// the path, and carries the length of the path before it as dash offset;
// the last one ends at the path's end.
func TestStrokePiecesCoverThePath(t *testing.T) {
	grid := rasterGrid{perUnit: 1, width: 400, height: 200}
	var pts []vg.Point
	for _, p := range zigzag(100, 3) {
		pts = append(pts, vg.Point{X: vg.Length(p.X), Y: vg.Length(p.Y)})
	}
	index := map[vg.Point]int{}
	along := []vg.Length{0} // length of the path up to each point
	for i, p := range pts {
		index[p] = i
		if i > 0 {
			along = append(along, along[i-1]+segmentLength(pts[i-1], p))
		}
	}
	pieces, end := 0, 0
	grid.strokePieces(pts, []vg.Length{5, 3}, func(p vg.Path, offset vg.Length) {
		pieces++
		first, ok := index[p[0].Pos]
		if !ok {
			t.Fatalf("piece %d starts at %v, not a point of the path", pieces, p[0].Pos)
		}
		switch {
		case pieces == 1 && first != 0:
			t.Errorf("the first piece starts at point %d", first)
		case pieces > 1 && (first >= end || end-first > pieceSegments/4 ||
			(end-first < pieceSegments/4 && first > 0 && pts[end].X-pts[first].X < leadIn)):
			t.Errorf("piece %d starts at point %d, %v px left of the last piece's end at point %d", pieces, first, pts[end].X-pts[first].X, end)
		}
		for k, c := range p {
			if c.Pos != pts[first+k] {
				t.Fatalf("piece %d leaves the path at its point %d", pieces, k)
			}
		}
		if offset != along[first] {
			t.Errorf("piece %d has dash offset %v, want %v, the length of the path before it", pieces, offset, along[first])
		}
		end = first + len(p) - 1
	})
	if end != len(pts)-1 {
		t.Errorf("the pieces end at point %d of %d", end, len(pts)-1)
	}
	if pieces < 2 {
		t.Errorf("%d pieces: the dense path was not cut", pieces)
	}
}
