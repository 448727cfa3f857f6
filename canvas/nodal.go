package canvas

import (
	"fmt"
	"math"
	"sort"

	"stave/fem"
	"stave/fem/units"
)

// The nodal loads' strip: what the solver applies at the nodes of the mesh
// in use for the line loads and self-weight, each node's consistent force
// and moment (solid) beside what lumping half of each element's load on
// each node would apply (hollow), with the sums against the load's own.

var (
	consistentColour = rgb(0x00, 0x7a, 0x78)
	lumpedColour     = rgb(0x80, 0x86, 0x8c)
)

// minNodeSpacing is the average spacing, px, of the visible nodes below
// which their arrows are not drawn: they would merge into a band.
const minNodeSpacing = 8

// nodalStrip draws the nodal loads in st.
func (b *builder) nodalStrip(st stripPlace) {
	nl := b.in.NodalLoads
	b.band = rect{0, st.top, b.v.Width, st.bottom}
	defer func() {
		b.band = rect{}
		b.line(faintColour, 0.75, Point{0, st.bottom}, Point{b.v.Width, st.bottom})
	}()
	force := b.u.Unit(units.Force).Symbol
	consistent := fmt.Sprintf("consistent: ∫N·q dx over each %s element, forces and moments", nl.Beam)
	if nl.Beam == "" { // a member solved as a bar alone: its axial loads only
		consistent = fmt.Sprintf("consistent: ∫N·p dx over each %s element, forces", nl.Bar)
	}
	header := []legendItem{
		{text: "Nodal loads of the line loads and self-weight [" + force + "]", size: titleSize, colour: consistentColour, bold: true},
		{width: 18, swatch: func(x, y float32) { b.nodeArrow(x+9, y+5, -10, 1, false) },
			text: consistent, size: smallSize, colour: inkColour},
		{width: 18, swatch: func(x, y float32) { b.nodeArrow(x+9, y+5, -10, 1, true) },
			text: "lumped: half of each element's load on each node, no moments", size: smallSize, colour: inkColour},
	}
	innerTop := b.legendRow(header, 8, st.top+4, b.v.Width-8) + 8
	f, m := func(v float64) string { return b.format(units.Force, v) }, func(v float64) string { return b.format(units.Moment, v) }
	sums := fmt.Sprintf("Sums across and moments about x = 0: consistent %s, %s; lumped %s, %s; the load itself %s, %s. Click an element for its load vector.",
		f(nl.Consistent[fem.Transverse]), m(nl.Consistent[2]), f(nl.Lumped[fem.Transverse]), m(nl.Lumped[2]),
		f(nl.Resultant[fem.Transverse]), m(nl.Resultant[2]))
	innerBottom := b.footer([]string{sums}, innerTop, st.bottom)
	base := (innerTop + innerBottom) / 2
	b.line(faintColour, 1, Point{b.clampX(b.sx(0)), base}, Point{b.clampX(b.sx(b.in.Model.Length())), base})
	b.selectedElement(innerTop, innerBottom)
	b.boundaries(innerTop-4, innerBottom+4)
	b.elementHandles(base, (innerBottom-innerTop)/2)

	first, last := visibleRange(nl.Nodes, b.v)
	if last-first > int(b.v.Width/minNodeSpacing) {
		b.place(text1(fmt.Sprintf("%d elements: too many to draw each node's loads at this zoom; zoom in", len(nl.Elements)),
			smallSize, faintColour, false, labelSpot{b.v.Width / 2, base - 3, 0.5, 1}))
		return
	}
	// One scale for every force: the largest fills half the plot.
	largest := 0.0
	for _, n := range nl.Nodes[first:last] {
		for _, d := range []fem.Dof{fem.Axial, fem.Transverse} {
			largest = max(largest, math.Abs(n.Consistent[d]), math.Abs(n.Lumped[d]))
		}
	}
	if largest == 0 {
		b.place(text1("no line load or self-weight", smallSize, faintColour, false, labelSpot{b.v.Width / 2, base - 3, 0.5, 1}))
		return
	}
	// Where each node's values are written, they take room at the arrows' tails.
	labelEach := last-first <= int(b.v.Width/70)
	room := (innerBottom-innerTop)/2 - 2
	if labelEach {
		room -= TextHeight(smallSize - 1)
	}
	perN := float64(max(room, 8)) / largest
	moments := 0.0
	for _, n := range nl.Nodes {
		moments = max(moments, math.Abs(n.Consistent[fem.Rotation]))
	}
	for _, n := range nl.Nodes[first:last] {
		x := b.sx(n.X)
		for k, loads := range [2][3]float64{n.Consistent, n.Lumped} {
			dx := float32(2*k-1) * 2.5 // consistent left of the node, lumped right
			if v := loads[fem.Transverse]; v != 0 {
				b.nodeArrow(x+dx, base, float32(v*perN), 1.6, k == 1)
			}
			if v := loads[fem.Axial]; v != 0 {
				b.axialArrow(x, base+dx, float32(v*perN), k == 1)
			}
		}
		// A moment's arc grows with it; one near zero against the largest is left out.
		if mo := math.Abs(n.Consistent[fem.Rotation]); mo > negligibleShare*moments {
			b.momentArrow(Point{x, base}, float32(4+6*mo/moments), n.Consistent[fem.Rotation] > 0, consistentColour)
		}
		if labelEach {
			b.nodeLabel(n, x, base, perN)
		}
	}
}

// visibleRange is the range [first, last) of the nodes inside the view.
func visibleRange(nodes []fem.NodeLoad, v View) (first, last int) {
	lo, hi := v.ToModelX(0), v.ToModelX(v.Width)
	first = sort.Search(len(nodes), func(i int) bool { return nodes[i].X >= lo })
	last = sort.Search(len(nodes), func(i int) bool { return nodes[i].X > hi })
	return first, max(first, last)
}

// nodeArrow draws a transverse force of length px (negative for a force
// downward) onto the baseline at (x, base): solid for a consistent load,
// an outline for a lumped one.
func (b *builder) nodeArrow(x, base, px, width float32, hollow bool) {
	if math.Abs(float64(px)) < 1 {
		return
	}
	tail, tip := Point{x, base + px}, Point{x, base}
	b.loadArrow(tail, tip, width, hollow)
	b.symbol(rect{x - 3, min(tail.Y, tip.Y), x + 3, max(tail.Y, tip.Y)})
}

// axialArrow draws an axial force of length px (negative toward −x) onto
// the node at (x, y).
func (b *builder) axialArrow(x, y, px float32, hollow bool) {
	if math.Abs(float64(px)) < 1 {
		return
	}
	b.loadArrow(Point{x - px, y}, Point{x, y}, 1.6, hollow)
}

// loadArrow is arrow in the consistent colour, or for a lumped load an
// open head in the lumped colour.
func (b *builder) loadArrow(tail, tip Point, width float32, hollow bool) {
	if !hollow {
		b.arrow(tail, tip, consistentColour, width, 6)
		return
	}
	dx, dy := tip.X-tail.X, tip.Y-tail.Y
	l := float32(math.Hypot(float64(dx), float64(dy)))
	ux, uy := dx/l, dy/l
	head := min(6, l)
	base := Point{tip.X - ux*head, tip.Y - uy*head}
	half := head * 0.45
	b.line(lumpedColour, 1, tail, base)
	b.polygon(white, lumpedColour, 1, tip, Point{base.X - uy*half, base.Y + ux*half}, Point{base.X + uy*half, base.Y - ux*half})
}

// nodeLabel writes a node's consistent force and moment beside its arrows.
func (b *builder) nodeLabel(n fem.NodeLoad, x, base float32, perN float64) {
	v := n.Consistent[fem.Transverse]
	if v == 0 && n.Consistent[fem.Rotation] == 0 {
		return
	}
	s := b.format(units.Force, v)
	if mo := n.Consistent[fem.Rotation]; mo != 0 {
		s += ", " + b.format(units.Moment, mo)
	}
	tail := base + float32(v*perN)
	ay, dy := float32(1), float32(-2)
	if tail > base {
		ay, dy = 0, 2
	}
	b.place(label{lines: []string{s}, size: smallSize - 1, colour: consistentColour, optional: true, at: Point{x, tail},
		spots: []labelSpot{{x, tail + dy, 0.5, ay}, {x + 5, tail + dy, 0, ay}, {x - 5, tail + dy, 1, ay}}})
}

// selectedElement shades the span of the selected element from y0 to y1.
func (b *builder) selectedElement(y0, y1 float32) {
	if b.in.Selected.Kind != Element || b.in.Selected.Index >= len(b.in.NodalLoads.Elements) {
		return
	}
	e := b.in.NodalLoads.Elements[b.in.Selected.Index]
	b.rectangle(b.clampX(b.sx(e.Start)), y0, b.clampX(b.sx(e.End)), y1, withAlpha(selectedColour, 0x40))
}

// elementHandles lets each visible element be pointed at, where elements
// are wide enough to tell apart.
func (b *builder) elementHandles(y, half float32) {
	els := b.in.NodalLoads.Elements
	lo, hi := b.v.ToModelX(0), b.v.ToModelX(b.v.Width)
	first := sort.Search(len(els), func(i int) bool { return els[i].End >= lo })
	last := sort.Search(len(els), func(i int) bool { return els[i].Start > hi })
	if last-first > int(b.v.Width/minNodeSpacing) {
		return
	}
	// Each handle is a capsule inside its element's rectangle: across a wide
	// element, up and down a narrow one.
	for i := first; i < last; i++ {
		x0, x1 := b.sx(els[i].Start), b.sx(els[i].End)
		mid, r := (x0+x1)/2, (x1-x0)/2-1
		if r >= half {
			b.handle(Ref{Kind: Element, Index: i}, half, Point{x0 + 1 + half, y}, Point{x1 - 1 - half, y})
		} else {
			b.handle(Ref{Kind: Element, Index: i}, max(r, 1), Point{mid, y - half + r}, Point{mid, y + half - r})
		}
	}
}
