package canvas

import (
	"math"
	"sort"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
)

// The raster canvas (vgimg, through gg and the freetype rasterizer) keeps
// each pixel row's cells in a list that it walks from the left for every
// cell a path adds, so a path that crosses the same rows in many columns
// (a moment diagram over thousands of spans swings from its lowest to its
// highest within every pixel column) costs time growing with the square of
// its width. Such a path is drawn in pieces, each one rasterizer pass that
// touches few cells of any row; any other path is drawn whole, as before.

// denseCrossings is how many segments of one path may cross one pixel row
// before the path is drawn in pieces. A curve over a few dozen spans stays
// below it and is drawn exactly as before.
const denseCrossings = 128

// pieceSegments caps the segments of one stroked piece.
const pieceSegments = 64

// rasterGrid is the device pixel grid of a raster canvas.
type rasterGrid struct {
	perUnit       float64 // device pixels per vg length
	width, height float64 // in device pixels
}

// rasterGridOf returns the pixel grid when c draws into an image; vector
// canvases draw any path in linear time.
func rasterGridOf(c vg.Canvas) (rasterGrid, bool) {
	var img *vgimg.Canvas
	switch c := c.(type) {
	case *vgimg.Canvas:
		img = c
	case vgimg.PngCanvas:
		img = c.Canvas
	default:
		return rasterGrid{}, false
	}
	k := img.DPI() / 72
	w, h := img.Size()
	return rasterGrid{perUnit: k, width: float64(w) * k, height: float64(h) * k}, true
}

// dense reports whether the path through pts (closed when asked) crosses
// one line between pixel rows of the grid more than denseCrossings times.
func (g rasterGrid) dense(pts []vg.Point, closed bool) bool {
	if len(pts) <= denseCrossings {
		return false
	}
	rows := int(g.height) + 3
	row := func(y vg.Length) int { return int(math.Floor(max(-1, min(g.height+1, float64(y)*g.perUnit)))) + 1 }
	crossings := make([]int32, rows+1)
	for i, p := range pts {
		var q vg.Point
		switch {
		case i+1 < len(pts):
			q = pts[i+1]
		case closed:
			q = pts[0]
		default:
			continue
		}
		if !finite(p) || !finite(q) {
			return false // the renderer copes; do not second-guess it
		}
		a, b := row(p.Y), row(q.Y) // the segment crosses the lines above rows a+1 … b
		if a > b {
			a, b = b, a
		}
		crossings[a+1]++
		crossings[b+1]--
	}
	var n int32
	for _, d := range crossings {
		if n += d; n > denseCrossings {
			return true
		}
	}
	return false
}

func finite(p vg.Point) bool {
	return !math.IsInf(float64(p.X), 0) && !math.IsNaN(float64(p.X)) && !math.IsInf(float64(p.Y), 0) && !math.IsNaN(float64(p.Y))
}

// verticalExtent is the height of pts in device pixels, at least one.
func (g rasterGrid) verticalExtent(pts []vg.Point) float64 {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		lo, hi = min(lo, float64(p.Y)), max(hi, float64(p.Y))
	}
	return max(1, (hi-lo)*g.perUnit)
}

// strokePieces strokes the polyline pts as consecutive pieces, each at most
// pieceSegments segments long and travelling up and down at most four times
// the polyline's height, so that each pass crosses any pixel row a few
// times. A piece starts a few points back, at least leadIn device pixels
// to the left of the last piece's end where it can, so that the pixels
// about the seam are covered by one pass (two passes each covering part of
// a pixel leave it lighter than one covering it all) and the join there is
// drawn; dashes continue across pieces through the dash offset.
func (g rasterGrid) strokePieces(pts []vg.Point, dash []vg.Length, stroke func(p vg.Path, dashOffset vg.Length)) {
	budget := 4 * g.verticalExtent(pts)
	along := make([]vg.Length, len(pts)) // length of the polyline up to each point
	for i := 1; i < len(pts); i++ {
		along[i] = along[i-1] + segmentLength(pts[i-1], pts[i])
	}
	start, travel := 0, 0.0
	for i := 1; i < len(pts); i++ {
		travel += math.Abs(float64(pts[i].Y-pts[i-1].Y)) * g.perUnit
		if travel < budget && i-start < pieceSegments && i+1 < len(pts) {
			continue
		}
		from := start
		for from > 0 && start-from < pieceSegments/4 && float64(pts[start].X-pts[from].X)*g.perUnit < leadIn {
			from--
		}
		var p vg.Path
		p.Move(pts[from])
		for _, q := range pts[from+1 : i+1] {
			p.Line(q)
		}
		offset := along[from]
		if len(dash) == 0 {
			offset = 0
		}
		stroke(p, offset)
		start, travel = i, 0
	}
}

// leadIn is how far, in device pixels, a stroked piece reaches back over
// the one before it.
const leadIn = 2

func segmentLength(a, b vg.Point) vg.Length {
	return vg.Length(math.Hypot(float64(b.X-a.X), float64(b.Y-a.Y)))
}

// fillSlabs fills the closed polygon pts as vertical slabs cut at whole
// device pixels, each one rasterizer pass. A slab's polygon is the
// polygon's edges clipped to the slab, joined along the slab's sides where
// the outline leaves and comes back, which encloses every point of the slab
// as often as the whole polygon does; since every pixel lies in one slab,
// it is painted once with the coverage the whole polygon gives it (to the
// rounding of the cut points). Slabs are as narrow as one column where the
// outline travels up and down a lot and wide where it does not.
func (g rasterGrid) fillSlabs(pts []vg.Point, fill func(vg.Path)) {
	cuts := g.slabCuts(pts)
	slabOf := func(x float64) int { return sort.SearchFloat64s(cuts, x*g.perUnit) } // slab i lies between cuts[i-1] and cuts[i]
	slabs := make([][]vg.Point, len(cuts)+1)
	add := func(s int, a, b vg.Point) {
		if n := len(slabs[s]); n == 0 || slabs[s][n-1] != a {
			slabs[s] = append(slabs[s], a)
		}
		slabs[s] = append(slabs[s], b)
	}
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		a, b := slabOf(float64(p.X)), slabOf(float64(q.X))
		if a == b {
			add(a, p, q)
			continue
		}
		step, side := 1, 0 // side: the cut a step crosses, from the slab's index
		if b < a {
			step, side = -1, -1
		}
		from := p
		for s := a; s != b; s += step {
			cut := cuts[s+side]
			x := vg.Length(cut / g.perUnit)
			t := (x - p.X) / (q.X - p.X)
			to := vg.Point{X: x, Y: p.Y + t*(q.Y-p.Y)}
			add(s, from, to)
			from = to
		}
		add(b, from, q)
	}
	for _, s := range slabs {
		if len(s) < 3 {
			continue
		}
		var p vg.Path
		p.Move(s[0])
		for _, q := range s[1:] {
			p.Line(q)
		}
		p.Close()
		fill(p)
	}
}

// slabCuts returns the device x of the cuts between slabs, increasing:
// whole pixels inside the grid, placed after a column once the outline has
// travelled up and down four times the polygon's height since the last cut.
func (g rasterGrid) slabCuts(pts []vg.Point) []float64 {
	columns := int(g.width) + 1
	travel := make([]float64, columns)
	column := func(x float64) int { return max(0, min(columns-1, int(math.Floor(x)))) }
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		mid := float64(p.X+q.X) / 2 * g.perUnit
		travel[column(mid)] += math.Abs(float64(q.Y-p.Y)) * g.perUnit
	}
	budget := 4 * g.verticalExtent(pts)
	var cuts []float64
	sum := 0.0
	for c := range columns - 1 {
		if sum += travel[c]; sum >= budget {
			cuts = append(cuts, float64(c+1))
			sum = 0
		}
	}
	return cuts
}
