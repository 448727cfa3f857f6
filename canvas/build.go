package canvas

import (
	"cmp"
	"image/color"
	"math"
	"slices"
	"strings"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// Colours, chosen to read on white paper and on the white drawing area.
var (
	inkColour       = rgb(0x1f, 0x23, 0x28)
	supportColour   = rgb(0x3a, 0x4a, 0x58)
	hatchColour     = rgb(0x7a, 0x86, 0x90)
	loadColour      = rgb(0xb0, 0x2a, 0x1e)
	deformedColour  = rgb(0x19, 0x5f, 0xc0)
	dimensionColour = rgb(0x50, 0x55, 0x5a)
	faintColour     = rgb(0x8a, 0x90, 0x96)
	selectedColour  = rgb(0xe0, 0x85, 0x00)
	problemColour   = rgb(0xc0, 0x1c, 0x1c)
	exactColour     = rgb(0x10, 0x10, 0x10)
	highlightColour = rgba(0xff, 0xc4, 0x2e, 0x50)
	hoverColour     = rgb(0x40, 0x40, 0x40)
	white           = rgb(0xff, 0xff, 0xff)
)

func rgb(r, g, b uint8) color.NRGBA                { return color.NRGBA{r, g, b, 0xff} }
func rgba(r, g, b, a uint8) color.NRGBA            { return color.NRGBA{r, g, b, a} }
func withAlpha(c color.NRGBA, a uint8) color.NRGBA { c.A = a; return c }

// Sizes in pixels.
const (
	memberWidth   = 5
	labelSize     = 11
	smallSize     = 10
	titleSize     = 12
	problemSize   = 15
	supportHeight = 26
	// foundationDepth is the height of a foundation's bed under the member.
	foundationDepth = 12
	arrowLength     = 44
)

// builder accumulates a scene.
type builder struct {
	in Input
	v  View
	s  *Scene
	u  units.System
	// boxes are the places labels must keep off (see place); curves the
	// lines they keep clear of where they can.
	boxes []box
	// boxGrid finds the boxes near a place (see occupy).
	boxGrid boxGrid
	// crowd are the crowd labels waiting for the others (see placeCrowd),
	// until crowdLast.
	crowd     []label
	crowdLast bool
	// full are the cells around which a label found no place (see fullCell).
	full map[[2]int32]fullCell
	// widths are the texts measured so far (see textWidth), formats the
	// values written (see format).
	widths  map[textKey]float32
	formats map[formatKey]string
	curves  [][]Point
	// band bounds the labels placed while a band (the sketch, a strip) is
	// drawn; zero for the whole scene.
	band rect
	// texts are the labels, added to the scene after every other item,
	// over their light backings and leader lines.
	texts, backings, leaders []Item
	// clear are the boxes of labels that sit where the deflected shape may
	// pass (the segment names on the member): the curve breaks around them
	// instead of running through the glyphs.
	clear []rect
	// Finite element curves: the deflection, and one per strip in layout
	// order, with each strip's largest gap to the exact solution when shown.
	deflection *curve
	feCurves   []*curve
	gaps       []gap
}

// Build lays out the drawing of in for the view v. The memory the layout
// needs only while it works goes back to in.Cache for the next build.
func Build(in Input, v View) *Scene {
	b := build(in, v)
	s := b.scene()
	in.Cache.keep(b)
	return s
}

// build lays out the drawing in a builder, which keeps what was placed
// where (its boxes) beside the scene.
func build(in Input, v View) *builder {
	b := &builder{in: in, v: v, u: in.Units, s: &Scene{Width: v.Width, Height: v.Height}}
	if b.u.Name == "" {
		b.u = units.SI
	}
	in.Cache.lend(b)
	if in.Model == nil {
		return b
	}
	o := in.Overlays
	if len(in.Model.Segments) == 0 {
		o = storage.Overlays{} // a new sketch: no member, nothing to plot yet
	}
	lay := layout(o, v, reactionRows(in), in.NodalLoads != nil && len(in.Model.Segments) > 0)
	b.s.SketchBottom = lay.sketchBottom
	b.s.MemberY = lay.memberY
	if in.Highlight != [2]float64{} {
		x0, x1 := b.sx(in.Highlight[0]), b.sx(in.Highlight[1])
		if x1-x0 < 3 {
			x0, x1 = x0-1.5, x1+1.5
		}
		b.rectangle(x0, 0, x1, v.Height, highlightColour)
	}
	// A walk over the visible elements reads the deflection and every
	// strip; one over them all with the exact solution, when it is shown,
	// finds each strip's largest gap; one walk reads both when it can
	// (Cache.read).
	if in.Solution != nil {
		qs := append([]fem.Quantity{fem.QDeflection}, stripQuantities(lay)...)
		var e *fem.Exact
		if len(lay.strips) > 0 {
			e = b.exact()
		}
		var cs []*curve
		cs, b.gaps = in.Cache.read(in.Solution, v, qs, e, qs[1:])
		b.deflection, b.feCurves = cs[0], cs[1:]
	}
	exact := b.startExactCurves(lay)
	defer exact.wait() // should the sketch fail before diagrams waits
	b.sketch(lay)
	if lay.nodal != nil {
		b.nodalStrip(*lay.nodal)
	}
	b.diagrams(lay, exact)
	if in.Hovering {
		b.hoverLine(b.sx(in.HoverX), lay.top, v.Height)
	}
	return b
}

// hoverLine draws the dashed line under the mouse from y0 to y1, broken
// where it would cross a label: through the gaps of the glyphs a dash
// turned the 5 of "2.500 m" into a 9.
func (b *builder) hoverLine(x, y0, y1 float32) {
	var gaps [][2]float32
	for _, t := range b.texts {
		if x >= t.At.X-2 && x <= t.At.X+t.Width+2 {
			gaps = append(gaps, [2]float32{t.At.Y - 1, t.At.Y + TextHeight(t.Size) + 1})
		}
	}
	slices.SortFunc(gaps, func(a, b [2]float32) int { return cmp.Compare(a[0], b[0]) })
	from := y0
	for _, g := range append(gaps, [2]float32{y1, y1}) {
		if g[0] > from {
			b.s.Items = append(b.s.Items, Item{Kind: Polyline, Points: []Point{{x, from}, {x, min(g[0], y1)}},
				Stroke: hoverColour, StrokeWidth: 1, Dash: true})
		}
		from = max(from, g[1])
	}
}

// exact is the exact solution when the drawing shows it, else nil.
func (b *builder) exact() *fem.Exact {
	if b.in.Overlays.ExactBand {
		return b.in.Exact
	}
	return nil
}

// scene returns the items built with the labels on top of every other
// item, each over its backing.
func (b *builder) scene() *Scene {
	b.s.Items = slices.Grow(b.s.Items, len(b.leaders)+len(b.backings)+len(b.texts))
	b.s.Items = append(append(append(b.s.Items, b.leaders...), b.backings...), b.texts...)
	b.texts, b.backings, b.leaders = b.texts[:0], b.backings[:0], b.leaders[:0]
	return b.s
}

// around cuts the polyline pts where it passes through any of boxes (each
// grown by pad) and returns the pieces outside them, each a polyline of its
// own, so that a dash pattern runs on along each piece.
func around(pts []Point, boxes []rect, pad float32) [][]Point {
	if len(boxes) == 0 && len(pts) > 1 {
		return [][]Point{pts} // nothing to cut: no copy
	}
	var pieces [][]Point
	var cur []Point
	add := func(p Point) {
		if n := len(cur); n == 0 || cur[n-1] != p {
			cur = append(cur, p)
		}
	}
	end := func() {
		if len(cur) > 1 {
			pieces = append(pieces, cur)
		}
		cur = nil
	}
	for i := 0; i+1 < len(pts); i++ {
		p, q := pts[i], pts[i+1]
		at := func(t float32) Point { return Point{p.X + t*(q.X-p.X), p.Y + t*(q.Y-p.Y)} }
		t := float32(0)
		for _, in := range insideSpans(p, q, boxes, pad) {
			if in[0] > t {
				add(at(t))
				add(at(in[0]))
			}
			end()
			t = max(t, in[1])
		}
		if t < 1 {
			add(at(t))
			add(q)
		}
	}
	end()
	return pieces
}

// insideSpans returns the parameter spans [t0, t1] ⊂ [0, 1], in order and
// merged, where the segment p→q lies inside a box grown by pad (Liang and
// Barsky's clipping of a segment against a rectangle).
func insideSpans(p, q Point, boxes []rect, pad float32) [][2]float32 {
	var spans [][2]float32
	d := Point{q.X - p.X, q.Y - p.Y}
	for _, r := range boxes {
		t0, t1 := float32(0), float32(1)
		for _, c := range [4][2]float32{
			{-d.X, p.X - (r.x0 - pad)}, {d.X, (r.x1 + pad) - p.X},
			{-d.Y, p.Y - (r.y0 - pad)}, {d.Y, (r.y1 + pad) - p.Y},
		} {
			switch {
			case c[0] == 0 && c[1] < 0:
				t0 = 2 // parallel to this edge and outside it
			case c[0] < 0:
				t0 = max(t0, c[1]/c[0])
			case c[0] > 0:
				t1 = min(t1, c[1]/c[0])
			}
		}
		if t0 < t1 {
			spans = append(spans, [2]float32{t0, t1})
		}
	}
	slices.SortFunc(spans, func(a, b [2]float32) int { return cmp.Compare(a[0], b[0]) })
	merged := spans[:0]
	for _, sp := range spans {
		if n := len(merged); n > 0 && sp[0] <= merged[n-1][1] {
			merged[n-1][1] = max(merged[n-1][1], sp[1])
			continue
		}
		merged = append(merged, sp)
	}
	return merged
}

// layoutBands is the vertical layout of a scene.
type layoutBands struct {
	top, sketchBottom, memberY float32
	strips                     []stripPlace
	nodal                      *stripPlace // the nodal loads' strip, when shown
}

type stripPlace struct {
	diagram     diagram
	top, bottom float32
}

// layout places the sketch band and the strips: the nodal loads' first
// when nodal, then each diagram l switches on.
func layout(l storage.Overlays, v View, rows int, nodal bool) layoutBands {
	var on []diagram
	for _, d := range diagramsList {
		if d.enabled(l) {
			on = append(on, d)
		}
	}
	n := len(on)
	if nodal {
		n++
	}
	top := v.PanY
	sketch := v.Height
	if n > 0 {
		sketch = max(230, 0.38*v.Height)
		if v.Height-sketch < float32(n)*90 {
			sketch = max(200, v.Height-float32(n)*90)
		}
	}
	lay := layoutBands{top: top, sketchBottom: top + sketch}
	// Below the member: support symbols, rows of reactions and two dimension lines.
	lay.memberY = top + max(sketch*0.5, sketch-belowMember(rows)-40)
	if n > 0 {
		// Two or more strips share what the sketch leaves down to 72 px
		// each (a laptop's drawing of 365 px holds the sketch and two),
		// one keeps 90 px; below that they run on past the edge, to be
		// panned to (an export scales them into its box).
		floor := float32(90)
		if n > 1 {
			floor = 72
		}
		stripH := max(floor, (v.Height-sketch)/float32(n))
		y := lay.sketchBottom
		if nodal {
			lay.nodal = &stripPlace{top: y, bottom: y + stripH}
			y += stripH
		}
		for _, d := range on {
			lay.strips = append(lay.strips, stripPlace{diagram: d, top: y, bottom: y + stripH})
			y += stripH
		}
	}
	return lay
}

func (b *builder) sx(x float64) float32 { return b.v.ToScreenX(x) }

// clampX keeps far off-screen coordinates finite and small for the renderers.
func (b *builder) clampX(px float32) float32 { return max(-50, min(b.v.Width+50, px)) }

func (b *builder) line(c color.NRGBA, width float32, pts ...Point) {
	b.s.Items = append(b.s.Items, Item{Kind: Polyline, Points: pts, Stroke: c, StrokeWidth: width})
}

func (b *builder) polygon(fill, stroke color.NRGBA, width float32, pts ...Point) {
	b.s.Items = append(b.s.Items, Item{Kind: Polygon, Points: pts, Fill: fill, Stroke: stroke, StrokeWidth: width})
}

func (b *builder) rectangle(x0, y0, x1, y1 float32, fill color.NRGBA) {
	b.polygon(fill, color.NRGBA{}, 0, Point{x0, y0}, Point{x1, y0}, Point{x1, y1}, Point{x0, y1})
}

func (b *builder) circle(c Point, r float32, fill, stroke color.NRGBA, width float32) {
	b.s.Items = append(b.s.Items, Item{Kind: Circle, Center: c, Radius: r, Fill: fill, Stroke: stroke, StrokeWidth: width})
}

// text places s with its anchor point at (x, y); ax and ay are the anchor's
// fraction of the box (0 = left/top, 0.5 = centre, 1 = right/bottom). The box
// is kept inside the scene width. It returns the box.
func (b *builder) text(s string, x, y float32, size float32, ax, ay float32, c color.NRGBA, bold bool) rect {
	w := b.textWidth(s, size, bold)
	h := TextHeight(size)
	left := x - ax*w
	left = max(2, min(b.v.Width-w-2, left))
	top := y - ay*h
	b.texts = append(b.texts, Item{Kind: Text, Text: s, At: Point{left, top}, Size: size, Bold: bold, Stroke: c, Width: w})
	return rect{left, top, left + w, top + h}
}

func (b *builder) handle(ref Ref, radius float32, pts ...Point) {
	b.s.Handles = append(b.s.Handles, Handle{Ref: ref, Points: pts, Radius: radius})
}

func (b *builder) colourFor(ref Ref, normal color.NRGBA) color.NRGBA {
	if b.in.Selected == ref {
		return selectedColour
	}
	return normal
}

// arrow draws a shaft from tail to tip with a filled head at tip.
func (b *builder) arrow(tail, tip Point, c color.NRGBA, width, head float32) {
	dx, dy := tip.X-tail.X, tip.Y-tail.Y
	l := float32(math.Hypot(float64(dx), float64(dy)))
	if l == 0 {
		return
	}
	ux, uy := dx/l, dy/l
	base := Point{tip.X - ux*head, tip.Y - uy*head}
	b.line(c, width, tail, base)
	half := head * 0.45
	b.polygon(c, color.NRGBA{}, 0, tip, Point{base.X - uy*half, base.Y + ux*half}, Point{base.X + uy*half, base.Y - ux*half})
}

// format writes an SI value in the chosen unit system, to be read
// (units.System.Show: "80.00 × 10⁶ mm⁴", not "80.00 10⁶ mm⁴").
//
// Each value is written once per drawing and unit system, and kept in the
// Cache for the next drawing: a drag step writes the forces of 1,000 loads
// again, most of them alike.
func (b *builder) format(q units.Kind, v float64) string {
	k := formatKey{q, math.Float64bits(v)}
	if s, ok := b.formats[k]; ok {
		return s
	}
	s := b.u.Show(q, v)
	if b.formats == nil {
		b.formats = map[formatKey]string{}
	}
	b.formats[k] = s
	return s
}

// formatKey is a value as format writes it: its kind and its bits (−0 is
// not 0 to it).
type formatKey struct {
	q    units.Kind
	bits uint64
}

// wrap breaks s into lines no wider than w pixels, measuring texts with
// measure (textWidth, or a builder's, which remembers the widths for the
// next drawing). A line's width is taken as the sum of its words' and
// spaces' widths, each measured once: the kerning between a space and a
// word is far below a pixel.
func wrap(s string, size float32, bold bool, w float32, measure func(s string, size float32, bold bool) float32) []string {
	var lines []string
	cur, curW := "", float32(0)
	space := measure(" ", size, bold)
	for _, word := range strings.Fields(s) {
		ww := measure(word, size, bold)
		if cur != "" && curW+space+ww > w {
			lines = append(lines, cur)
			cur, curW = "", 0
		}
		if cur != "" {
			cur, curW = cur+" "+word, curW+space+ww
			continue
		}
		cur, curW = word, ww
	}
	if cur != "" {
		lines = append(lines, cur)
	}
	return lines
}

// niceBelow is the largest 1, 2 or 5 × 10ⁿ not above v (v > 0).
func niceBelow(v float64) float64 {
	if v <= 0 || math.IsInf(v, 0) || math.IsNaN(v) {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(v)))
	for _, m := range []float64{5, 2, 1} {
		if m*p <= v*(1+1e-12) {
			return m * p
		}
	}
	return p
}

// reactionRowHeight is the height of one line of reaction labels.
const reactionRowHeight = smallSize*1.2 + 2

// belowMember is the height the support symbols, rows lines of reactions and
// the chain dimension take under the member axis.
func belowMember(rows int) float32 {
	return supportHeight + 10 + float32(rows)*reactionRowHeight + 30
}

// reactionRows is the largest number of reaction labels under one support.
func reactionRows(in Input) int {
	if in.Solution == nil || in.Model == nil {
		return 0
	}
	b := builder{in: in}
	rows := 0
	for _, r := range in.Solution.Reactions {
		n := 0
		for d := range 3 {
			if r.Force[d] != 0 && b.supportHolds(r.Support, fem.Dof(d)) {
				n++
			}
		}
		rows = max(rows, n)
	}
	return rows
}
