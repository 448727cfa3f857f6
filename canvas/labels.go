package canvas

import (
	"image/color"
	"math"
	"sort"
)

// The label placer. Every text of a drawing goes through place: it tries
// the label's own spots around the thing it names, then rings farther out
// with a leader line back to it, and takes only a box that overlaps no
// placed label, no symbol and no marked extreme. Curves are a softer
// obstacle: a spot clear of them is taken before one that crosses them.
// What place refuses is never drawn on top of something else.

// boxKind is what an occupied box holds.
type boxKind int

const (
	labelBox  boxKind = iota // a placed label
	symbolBox                // a drawn symbol: support, arrow, swatch, the member
	markerBox                // a marked point of a curve: an extreme or the largest gap
)

// box is an occupied part of the scene.
type box struct {
	rect
	kind boxKind
}

// rect is a text or symbol box.
type rect struct{ x0, y0, x1, y1 float32 }

func (r rect) overlaps(o rect) bool {
	return r.x0 < o.x1 && o.x0 < r.x1 && r.y0 < o.y1 && o.y0 < r.y1
}

// grown is r grown by dx left and right and dy above and below.
func (r rect) grown(dx, dy float32) rect { return rect{r.x0 - dx, r.y0 - dy, r.x1 + dx, r.y1 + dy} }

// label is one text for place.
type label struct {
	lines  []string
	size   float32
	colour color.NRGBA
	bold   bool
	// at is the point the label names: where a leader line starts when the
	// label has to move away from its spots.
	at Point
	// spots are the places to try first, in order of preference.
	spots []labelSpot
	// optional labels are left out when none of their spots is free;
	// others move farther out, with a leader.
	optional bool
	// plain labels go without the light backing that keeps a label readable
	// over hatching and fills.
	plain bool
	// compact is the label in one line, tried where lines find no place.
	compact string
	// crowd is set for labels that may come by the hundred, the forces':
	// one that finds none of its own spots free waits until the labels
	// that are fewer and more to the point are placed (see placeCrowd),
	// then looks on the near rings only, and not even there around a
	// place where one of them found no room (see fullCell).
	crowd bool
	// taken marks the spots of a crowd label that waits (see placeCrowd)
	// that were not free when it first looked, in the band takenIn: boxes
	// are only ever added, so they are not free when it looks again.
	taken   uint64
	takenIn rect
}

// labelSpot puts a label's box with the point (ax, ay) of it, in fractions
// of its width and height from the top-left corner, at (x, y).
type labelSpot struct{ x, y, ax, ay float32 }

// text1 is a one-line label at a single spot, also its anchor.
func text1(s string, size float32, c color.NRGBA, bold bool, spot labelSpot, more ...labelSpot) label {
	return label{lines: []string{s}, size: size, colour: c, bold: bold, at: Point{spot.x, spot.y}, spots: append([]labelSpot{spot}, more...)}
}

// ringSteps are the distances, px, of the rings of spots tried around a
// label's point when its own spots are taken; the first nearRings of them
// are tried before a spot of the label's own that crosses a curve.
var ringSteps = []float32{10, 18, 28, 40, 56, 76, 100}

const nearRings = 5

// fullCell is the size of a crowd label whose ring search, from a point in
// one cell of gridCell pixels, found every spot taken, in the band then
// drawn.
//
// Where loads stand closer than their labels are wide, most of their
// labels find no place, and each looked at dozens of spots before giving
// up: the work grew with the loads, not with the pixels. The rings sample
// the space around a point no finer than gridCell pixels (8 px between
// the nearest rings, more farther out), so a search from another point
// of the same cell, for a label no smaller, would look at the same full
// places: it is skipped, and the label tries only its own spots. So at
// most one search fails per cell of the band and label size, however
// many loads stand in it. Labels that are not of the crowd, fewer and
// more to the point, always look.
type fullCell struct {
	w, h float32
	band rect
}

// ringDirections are the directions of a ring's spots, from the label's
// point, as unit steps: above, below, right, left, then the diagonals.
var ringDirections = [][2]float32{{0, -1}, {0, 1}, {1, 0}, {-1, 0}, {1, -1}, {-1, -1}, {1, 1}, {-1, 1}}

// place puts l where it overlaps nothing placed before, and where it can
// clear of the curves too: at one of its spots, else (unless optional) on a
// ring around l.at with a leader line. It returns the box and whether the
// label was placed.
func (b *builder) place(l label) (rect, bool) {
	w, h := float32(0), TextHeight(l.size)*float32(len(l.lines))
	for _, s := range l.lines {
		w = max(w, b.textWidth(s, l.size, l.bold))
	}
	within := b.band // the band being drawn, else the scene
	if within == (rect{}) {
		within = rect{0, 0, b.v.Width, b.s.Height}
	}
	// Nothing is placed while place looks, so each spot is tried once:
	// whether its box is free, and then whether it is clear of the curves.
	type try struct {
		r      rect
		ax     float32
		free   bool
		leader bool
	}
	look := func(s labelSpot, leader bool) try {
		if s.x < -20 || s.x > b.v.Width+20 {
			return try{} // the thing labelled is off screen
		}
		left := max(within.x0+2, min(within.x1-w-2, s.x-s.ax*w))
		r := rect{left, s.y - s.ay*h, left + w, s.y - s.ay*h + h}
		free := r.y0 >= within.y0 && r.y1 <= within.y1 && r.x0 >= within.x0 && r.x1 <= within.x1 && b.free(r)
		return try{r, s.ax, free, leader}
	}
	take := func(t try) (rect, bool) {
		b.put(l, t.r, t.ax, t.leader)
		return t.r, true
	}
	// A spot of its own clear of the curves; a near ring clear of them, with
	// a short leader; a spot of its own across a curve; any ring. An
	// optional label takes its own spots or nothing.
	own := make([]try, 0, 8)
	for k, s := range l.spots {
		if k < 64 && l.taken&(1<<k) != 0 && l.takenIn == within {
			own = append(own, try{})
			continue
		}
		t := look(s, false)
		if t.free && !b.crossesCurve(t.r) {
			return take(t)
		}
		own = append(own, t)
	}
	if l.crowd && !b.crowdLast {
		for k, t := range own[:min(len(own), 64)] {
			if !t.free {
				l.taken |= 1 << k
			}
		}
		l.takenIn = within
		b.crowd = append(b.crowd, l)
		return rect{}, false
	}
	ownFree := func() (rect, bool) {
		for _, t := range own {
			if t.free {
				return take(t)
			}
		}
		return rect{}, false
	}
	if l.optional {
		return ownFree()
	}
	ring := func(k, d int) labelSpot {
		dir := ringDirections[d]
		return labelSpot{l.at.X + ringSteps[k]*dir[0], l.at.Y + ringSteps[k]*dir[1], (1 - dir[0]) / 2, (1 - dir[1]) / 2}
	}
	cell := [2]int32{int32(math.Floor(float64(l.at.X / gridCell))), int32(math.Floor(float64(l.at.Y / gridCell)))}
	f, seen := b.full[cell]
	full := l.crowd && seen && f.band == within && w >= f.w && h >= f.h
	var near [nearRings * 8]try
	if !full {
		for k := range nearRings {
			for d := range ringDirections {
				t := look(ring(k, d), true)
				if t.free && !b.crossesCurve(t.r) {
					return take(t)
				}
				near[k*8+d] = t
			}
		}
	}
	if r, ok := ownFree(); ok {
		return r, true
	}
	if !full {
		for _, t := range near {
			if t.free {
				return take(t)
			}
		}
		far := len(ringSteps)
		if l.crowd {
			far = nearRings // no leader across the drawing to one of many
		}
		for k := nearRings; k < far; k++ {
			for d := range ringDirections {
				if t := look(ring(k, d), true); t.free {
					return take(t)
				}
			}
		}
		if l.crowd {
			if b.full == nil {
				b.full = map[[2]int32]fullCell{}
			}
			b.full[cell] = fullCell{w, h, within}
		}
	}
	if l.compact != "" && len(l.lines) > 1 {
		l.lines, l.compact = []string{l.compact}, ""
		return b.place(l)
	}
	return rect{}, false
}

// placeCrowd places the crowd labels that found none of their own spots
// free, now that the other labels of the band are placed: where forces
// stand closer than their labels are wide, their labels would otherwise
// take every place a reaction's or a check's label could have.
func (b *builder) placeCrowd() {
	b.crowdLast = true
	for _, l := range b.crowd {
		b.place(l)
	}
	b.crowd, b.crowdLast = b.crowd[:0], false
}

// free reports whether r, with a little space around it, overlaps no box.
func (b *builder) free(r rect) bool {
	padded := r.grown(3, 1)
	overlaps := func(i int32) bool { return padded.overlaps(b.boxes[i].rect) }
	return !b.boxGrid.any(padded, len(b.boxes), overlaps)
}

// occupy keeps labels off r from now on.
func (b *builder) occupy(r rect, kind boxKind) {
	if b.boxGrid.newest == nil {
		b.boxGrid = newBoxGrid(b.s.Width, b.s.Height)
	}
	b.boxGrid.add(r, int32(len(b.boxes)))
	b.boxes = append(b.boxes, box{r, kind})
}

// boxGrid lists each occupied box in the cells of gridCell pixels it
// touches, so that free looks at the boxes near a label, not at all of
// them: a drawing of thousands of supports has thousands of boxes and
// tries dozens of spots per label. A box that spans more than gridSpan
// cells, or whose corners are not numbers in order, is looked at always.
// The cells cover the scene and are a slice, not a map (looking cells up
// in a map was a tenth of a drawing with 1,000 point loads); a box or a
// rect off the scene counts in the cells at its edge, so two that overlap
// still share a cell.
type boxGrid struct {
	columns, rows int32
	// newest is, per cell, 1 + the index in entries of the cell's newest
	// entry, 0 for none; each entry links to the one before it in its cell.
	newest  []int32
	entries []gridEntry
	large   []int32
}

// gridEntry is a box in one cell, and 1 + the index of the cell's entry
// before it (0 for none).
type gridEntry struct{ box, before int32 }

// Beside a member on thousands of supports the support symbols pile up
// hundreds to a cell; at 8 px a PNG of 28,000 supports took 10 s, at
// 32 px 27 s, at 4 px no less than at 8.
const (
	gridCell = 8
	gridSpan = 64
)

// newBoxGrid covers a scene of width × height pixels, or of 8192 px along
// a longer side: past it, boxes share the cells at the edge.
func newBoxGrid(width, height float32) boxGrid {
	c, r := gridCells(width), gridCells(height)
	return boxGrid{columns: c, rows: r, newest: make([]int32, c*r)}
}

// gridCells is the number of cells of a grid along a side of px pixels.
func gridCells(px float32) int32 { return int32(max(0, min(8192, px))/gridCell) + 1 }

// cellSpan returns the cells from lo to hi along an axis of n cells;
// false when they are too many or lo and hi are not numbers in order.
// Far places are clamped: a box and a rect that overlap still share a
// cell.
func cellSpan(lo, hi float32, n int32) (int32, int32, bool) {
	if !(lo <= hi) {
		return 0, 0, false
	}
	const far = 1 << 20
	a := int32(math.Floor(float64(max(-far, min(far, lo)) / gridCell)))
	z := int32(math.Floor(float64(max(-far, min(far, hi)) / gridCell)))
	return max(0, min(n-1, a)), max(0, min(n-1, z)), z-a <= gridSpan
}

// cells returns the columns and rows of cells that r touches; false when
// r is to be looked at always.
func (g *boxGrid) cells(r rect) (x0, x1, y0, y1 int32, ok bool) {
	x0, x1, okx := cellSpan(r.x0, r.x1, g.columns)
	y0, y1, oky := cellSpan(r.y0, r.y1, g.rows)
	return x0, x1, y0, y1, okx && oky
}

func (g *boxGrid) add(r rect, i int32) {
	x0, x1, y0, y1, ok := g.cells(r)
	if !ok {
		g.large = append(g.large, i)
		return
	}
	for y := y0; y <= y1; y++ {
		for x := x0; x <= x1; x++ {
			c := y*g.columns + x
			g.entries = append(g.entries, gridEntry{i, g.newest[c]})
			g.newest[c] = int32(len(g.entries))
		}
	}
}

// any reports whether overlaps holds for a box that may overlap r, of the
// n boxes listed.
func (g *boxGrid) any(r rect, n int, overlaps func(int32) bool) bool {
	if g.newest == nil {
		return false // nothing added
	}
	x0, x1, y0, y1, ok := g.cells(r)
	if !ok {
		for i := range int32(n) {
			if overlaps(i) {
				return true
			}
		}
		return false
	}
	for y := y0; y <= y1; y++ {
		for x := x0; x <= x1; x++ {
			for e := g.newest[y*g.columns+x]; e != 0; e = g.entries[e-1].before {
				if overlaps(g.entries[e-1].box) {
					return true
				}
			}
		}
	}
	for _, i := range g.large {
		if overlaps(i) {
			return true
		}
	}
	return false
}

// crossesCurve reports whether any curve registered with avoid runs through r.
func (b *builder) crossesCurve(r rect) bool {
	box := []rect{r}
	for _, pts := range b.curves {
		// The curves run left to right: start at the first point past r's left edge.
		k := sort.Search(len(pts), func(i int) bool { return pts[i].X >= r.x0 })
		for i := max(k-1, 0); i+1 < len(pts) && pts[i].X <= r.x1; i++ {
			p, q := pts[i], pts[i+1]
			if max(p.Y, q.Y) < r.y0 || min(p.Y, q.Y) > r.y1 {
				continue // wholly above or below: most of a curve's segments
			}
			if len(insideSpans(p, q, box, 0)) > 0 {
				return true
			}
		}
	}
	return false
}

// put draws l in r, its lines aligned as ax says, with a leader line from
// l.at when it was moved away from its spots.
func (b *builder) put(l label, r rect, ax float32, leader bool) {
	b.occupy(r, labelBox)
	if leader {
		end := Point{max(r.x0, min(r.x1, l.at.X)), max(r.y0, min(r.y1, l.at.Y))}
		b.leaders = append(b.leaders, Item{Kind: Polyline, Points: []Point{l.at, end}, Stroke: withAlpha(l.colour, 0xa0), StrokeWidth: 0.8})
	}
	if !l.plain {
		b.backings = append(b.backings, Item{Kind: Polygon, Fill: rgba(0xff, 0xff, 0xff, 0xe6),
			Points: []Point{{r.x0 - 1, r.y0 + 1}, {r.x1 + 1, r.y0 + 1}, {r.x1 + 1, r.y1 - 1}, {r.x0 - 1, r.y1 - 1}}})
	}
	lh := TextHeight(l.size)
	for i, s := range l.lines {
		x := r.x0 + ax*(r.x1-r.x0)
		b.text(s, x, r.y0+float32(i)*lh, l.size, ax, 0, l.colour, l.bold)
	}
}

// symbol keeps labels off r, a drawn symbol.
func (b *builder) symbol(r rect) { b.occupy(r, symbolBox) }

// marker draws a dot of radius r at p, a marked point of a curve, and keeps
// labels off it; hollow draws a ring in c instead. A point off the view
// (zoomed in elsewhere) is not drawn.
func (b *builder) marker(p Point, r float32, c color.NRGBA, hollow bool) {
	if p.X < -r || p.X > b.v.Width+r {
		return
	}
	if hollow {
		b.circle(p, r, color.NRGBA{}, c, 1.5)
	} else {
		b.circle(p, r, c, color.NRGBA{}, 0)
	}
	b.occupy(rect{p.X - r, p.Y - r, p.X + r, p.Y + r}, markerBox)
}

// avoid asks labels to keep clear of the curve pts, which runs left to
// right, where they can.
func (b *builder) avoid(pts []Point) {
	if len(pts) > 1 {
		b.curves = append(b.curves, pts)
	}
}
