package canvas

import (
	"fmt"
	"image/color"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// whose says whose deflection and reactions the sketch draws, when that
// is not plain: under an envelope (its strips show every combination, the
// sketch the first's), and when they are not of the loads drawn. "" when
// the sketch shows the results of the loads it draws.
func (b *builder) whose() string {
	results := b.in.Showing
	env := b.in.Envelope
	if env != nil && len(env.Names) > 0 {
		results = "combination " + env.Names[0]
	}
	if b.in.Solution == nil || results == "" {
		return ""
	}
	text := "deflection and reactions: " + results
	switch {
	case b.in.LoadsOf != "" && b.in.LoadsOf != results:
		return "loads drawn: " + b.in.LoadsOf + "; " + text
	case env != nil:
		return text
	}
	return ""
}

// sketch draws the top band: member, supports, loads, deformed shape,
// dimensions, scale bar and the problem text.
func (b *builder) sketch(lay layoutBands) {
	m := b.in.Model
	y := lay.memberY
	l := m.Length()
	x0, x1 := b.clampX(b.sx(0)), b.clampX(b.sx(l))
	b.band = rect{0, lay.top, b.v.Width, lay.sketchBottom}
	defer func() { b.band = rect{} }()
	title := text1("Member, supports and loads", titleSize, inkColour, true, labelSpot{8, lay.top + 6, 0, 0})
	title.plain = true
	b.place(title)
	if len(m.Segments) == 0 { // a new sketch: what to do first
		b.place(text1("No member yet: drag along the drawing with the Member tool, or type a length under Properties.",
			labelSize, faintColour, false, labelSpot{b.v.Width / 2, lay.memberY, 0.5, 0.5}))
		return
	}
	// What must be read comes first, so the labels placed later avoid it.
	if b.in.Unreliable {
		b.place(text1("UNRELIABLE RESULTS: read the warnings", labelSize, problemColour, true, labelSpot{b.v.Width - 8, lay.top + 26, 1, 0}))
	}
	if b.in.Problem != "" {
		defer b.problem(lay)()
	}
	if b.in.Dimensions {
		b.scaleBar(lay.top)
	}
	if whose := b.whose(); whose != "" {
		b.place(text1(whose, smallSize, inkColour, false, labelSpot{8, lay.top + 26 + TextHeight(smallSize), 0, 0}))
	}
	var deflected *deflectedShape
	if b.in.Overlays.DeformedShape && b.in.Solution != nil {
		deflected = b.deflected(lay)
	}

	// Foundations and supports first: their boxes keep labels away from
	// them, and a support's handle lies over the bed it stands in.
	var beds []label
	for i, f := range m.Foundations {
		if l, ok := b.foundation(i, f, y); ok {
			beds = append(beds, l)
		}
	}
	for i, sp := range m.Supports {
		b.support(i, sp, y)
	}
	for _, l := range beds { // clear of the supports standing in the beds
		b.place(l)
	}
	memberColour := b.colourFor(Ref{Kind: Member}, inkColour)
	b.line(memberColour, memberWidth, Point{x0, y}, Point{x1, y})
	b.handle(Ref{Kind: Member}, memberWidth/2, Point{x0, y}, Point{x1, y})
	b.symbol(rect{x0, y - memberWidth/2, x1, y + memberWidth/2})
	if b.in.Overlays.Nodes && b.in.Solution != nil {
		b.nodeTicks(y, lay.top)
	}
	end := Point{b.sx(l), y}
	if b.in.Handles {
		b.circle(end, 4, white, b.colourFor(Ref{Kind: MemberEnd}, inkColour), 1.5)
		b.symbol(rect{end.X - 5, end.Y - 5, end.X + 5, end.Y + 5})
	}
	b.handle(Ref{Kind: MemberEnd}, 6, end)
	for i, h := range m.Hinges {
		b.hinge(i, h, y)
	}

	b.distributedLoads(lay)
	// The forces' arrows before their labels, so that no label lies on an
	// arrow drawn after it.
	forces := b.forceColumns(y)
	for _, col := range forces.columns {
		b.arrow(col.tail, col.tip, col.colour, 2, 10)
		b.symbol(rect{col.tail.X - 5, min(col.tail.Y, col.tip.Y), col.tail.X + 5, max(col.tail.Y, col.tip.Y)})
	}
	for i, p := range m.PointLoads {
		b.pointLoad(i, p, y, forces)
	}
	b.segments(y) // the names where the loads leave room
	b.marks(lay.sketchBottom - 4)
	// Fixed-place labels first, so the movable ones avoid them.
	if b.in.Dimensions {
		b.dimensions(y)
	}
	if b.in.Solution != nil {
		b.reactions(y)
	}
	if deflected != nil {
		b.deformed(deflected)
	}
	b.placeCrowd()
	b.line(faintColour, 0.75, Point{0, lay.sketchBottom}, Point{b.v.Width, lay.sketchBottom})
}

// marks draws a small triangle pointing up at each marked check, its tip
// at y − 9 and its base on y, with a CheckMark handle.
func (b *builder) marks(y float32) {
	for _, mk := range b.in.Marks {
		x := b.sx(mk.X)
		if x < -10 || x > b.v.Width+10 {
			continue
		}
		c := rgb(0xc8, 0x8a, 0x00) // amber: a warning
		if mk.Severe {
			c = problemColour
		}
		ref := Ref{Kind: CheckMark, Index: mk.Index}
		if b.in.Selected == ref {
			c = selectedColour
		}
		b.polygon(c, white, 1, Point{x, y - 9}, Point{x + 6, y}, Point{x - 6, y})
		b.handle(ref, 7, Point{x, y - 4})
		b.symbol(rect{x - 6, y - 9, x + 6, y})
		if mk.Name != "" {
			at := Point{x, y - 4}
			b.place(label{lines: []string{mk.Name}, size: smallSize, colour: c, at: at,
				spots: []labelSpot{{x + 9, y - 4, 0, 0.5}, {x - 9, y - 4, 1, 0.5}, {x, y - 11, 0.5, 1}}})
		}
	}
}

// segments marks segment breaks across the member and labels each segment.
func (b *builder) segments(y float32) {
	m := b.in.Model
	for i, sg := range m.Segments {
		if i > 0 {
			x := b.sx(sg.Start)
			b.line(inkColour, 1.5, Point{x - 4, y - 9}, Point{x + 4, y + 9})
		}
		if len(m.Segments) == 1 && sg.Material.Name == "" {
			continue
		}
		name := fmt.Sprintf("S%d", i+1)
		if sg.Material.Name != "" {
			name += " " + sg.Material.Name
		}
		// Under the member (clear of the node ticks) or over it, in the
		// middle or, where a load is there, a quarter in from either end.
		var spots []labelSpot
		for _, at := range []float64{0.5, 0.25, 0.75} {
			x := b.sx(sg.Start + at*(sg.End-sg.Start))
			spots = append(spots, labelSpot{x, y + 9, 0.5, 0}, labelSpot{x, y - 8, 0.5, 1})
		}
		c := b.colourFor(Ref{Kind: Segment, Index: i}, faintColour)
		if r, ok := b.place(label{lines: []string{name}, size: smallSize, colour: c, optional: true, spots: spots}); ok {
			b.clear = append(b.clear, r)
			cy := (r.y0 + r.y1) / 2
			b.handle(Ref{Kind: Segment, Index: i}, (r.y1-r.y0)/2, Point{r.x0, cy}, Point{r.x1, cy})
		}
	}
}

// nodeTicks marks the mesh nodes under the member, where no load arrow
// hides them, at most one tick per pixel column: after each tick the next
// is the first node at least two pixels on, found by bisection, so the
// work grows with the width and not with the mesh.
func (b *builder) nodeTicks(y, top float32) {
	mesh := b.in.Solution.Mesh
	xs := visibleNodes(mesh.X, b.v)
	below := y + memberWidth/2
	for i := 0; i < len(xs); {
		px := b.sx(xs[i])
		b.line(inkColour, 1, Point{px, below}, Point{px, below + 5})
		rest := xs[i+1:]
		i += 1 + sort.Search(len(rest), func(k int) bool { return b.sx(rest[k])-px >= 2 })
	}
	if len(xs) > 0 {
		b.symbol(rect{b.sx(xs[0]), below, b.sx(xs[len(xs)-1]), below + 5})
	}
	n := len(mesh.Elements)
	b.place(text1(fmt.Sprintf("mesh: %d elements, nodes ticked under the member", n), smallSize, faintColour, false, labelSpot{8, top + 38, 0, 0}))
}

// visibleNodes returns the node positions inside the view.
func visibleNodes(xs []float64, v View) []float64 {
	lo, hi := v.ToModelX(0), v.ToModelX(v.Width)
	i := lowerBound(xs, lo)
	j := lowerBound(xs, hi)
	if j < len(xs) {
		j++
	}
	return xs[i:j]
}

func lowerBound(xs []float64, x float64) int {
	lo, hi := 0, len(xs)
	for lo < hi {
		mid := (lo + hi) / 2
		if xs[mid] < x {
			lo = mid + 1
		} else {
			hi = mid
		}
	}
	return lo
}

// support draws one support symbol under (or beside) the member at its x.
func (b *builder) support(i int, sp fem.Support, y float32) {
	ref := Ref{Kind: Support, Index: i}
	c := b.colourFor(ref, supportColour)
	x := b.sx(sp.X)
	top := y + memberWidth/2
	// Wall-type symbols face outwards at the right end, otherwise left.
	dir := float32(-1)
	if sp.X >= b.in.Model.Length()/2 && sp.X > 0 {
		dir = 1
	}
	switch sp.Kind {
	case fem.Fixed:
		b.wall(x, y, dir, c)
	case fem.Pinned:
		b.triangle(x, top, c)
		b.ground(x, top+supportHeight-6, c)
	case fem.Roller:
		b.triangle(x, top, c)
		base := top + supportHeight - 8
		b.circle(Point{x - 6, base + 3.5}, 3, white, c, 1.3)
		b.circle(Point{x + 6, base + 3.5}, 3, white, c, 1.3)
		b.ground(x, base+7, c)
	case fem.AxialOnly:
		// A pin on the axis, linked to a block that slides in a transverse slot:
		// axial motion held, deflection and rotation free.
		b.circle(Point{x, y}, 3.5, white, c, 1.5)
		link := x + dir*18
		b.line(c, 1.5, Point{x + dir*3.5, y}, Point{link, y})
		b.polygon(white, c, 1.5, Point{link, y - 5}, Point{link + dir*8, y - 5}, Point{link + dir*8, y + 5}, Point{link, y + 5})
		b.line(c, 1.2, Point{link - dir*2, y - 16}, Point{link - dir*2, y + 16})
		b.line(c, 1.2, Point{link + dir*10, y - 16}, Point{link + dir*10, y + 16})
		b.hatch(link+dir*10, y-16, y+16, dir, c)
	case fem.Guided:
		// A plate fixed to the member riding on rollers against a wall:
		// axial motion and rotation held, deflection free.
		plate := x + dir*2
		b.line(c, 3, Point{plate, y - 14}, Point{plate, y + 14})
		b.circle(Point{plate + dir*4, y - 8}, 3, white, c, 1.3)
		b.circle(Point{plate + dir*4, y + 8}, 3, white, c, 1.3)
		wall := plate + dir*8
		b.line(c, 1.5, Point{wall, y - 18}, Point{wall, y + 18})
		b.hatch(wall, y-18, y+18, dir, c)
	}
	// Springs on the motions the kind leaves free: all of a spring support's,
	// or those a rigid kind adds (a roller's rotational spring, say).
	var elastic [3]float64
	for d := range elastic {
		if sp.Elastic(fem.Dof(d)) {
			elastic[d] = sp.Stiffness[d]
		}
	}
	b.springs(x, y, dir, elastic, c)
	b.handle(ref, 16, Point{x, y + 14})
	b.symbol(rect{x - 22, y - 20, x + 22, y + supportHeight + 4})
	b.settlement(sp, x, y, c)
}

// settlement marks the prescribed displacements of a support beside its
// symbol: an arrow in the direction of each settled translation, then the
// values.
func (b *builder) settlement(sp fem.Support, x, y float32, c color.NRGBA) {
	var parts []string
	names := [3]string{"settles along ", "settles ", "turns "}
	qs := [3]units.Kind{units.Deflection, units.Deflection, units.Rotation}
	for d := range 3 {
		v := sp.Settlement[d]
		if v == 0 || !sp.Kind.Restrains(fem.Dof(d)) {
			continue
		}
		parts = append(parts, names[d]+b.format(qs[d], v))
		switch fem.Dof(d) {
		case fem.Transverse:
			dy := float32(-14) // up is positive
			if v < 0 {
				dy = 14
			}
			tail := Point{x + 26, y + 10 - dy/2}
			b.arrow(tail, Point{tail.X, tail.Y + dy}, c, 1.3, 5)
		case fem.Axial:
			dx := float32(14)
			if v < 0 {
				dx = -14
			}
			tail := Point{x - dx/2, y + supportHeight + 2}
			b.arrow(tail, Point{tail.X + dx, tail.Y}, c, 1.3, 5)
		}
	}
	if len(parts) > 0 {
		b.place(label{lines: []string{strings.Join(parts, ", ")}, size: smallSize, colour: c, at: Point{x, y + 10},
			spots: []labelSpot{{x + 32, y + 10, 0, 0.5}, {x - 32, y + 10, 1, 0.5}, {x + 32, y - 12, 0, 0.5}}})
	}
}

func (b *builder) triangle(x, top float32, c color.NRGBA) {
	h := float32(supportHeight - 8)
	b.polygon(white, c, 1.5, Point{x, top}, Point{x - 10, top + h}, Point{x + 10, top + h})
}

// ground draws a base line with hatching under it.
func (b *builder) ground(x, y float32, c color.NRGBA) {
	b.line(c, 1.5, Point{x - 15, y}, Point{x + 15, y})
	for k := float32(-12); k <= 12; k += 6 {
		b.line(hatchColour, 1, Point{x + k, y}, Point{x + k - 5, y + 5})
	}
}

// wall draws a fixed end: a wall line across the member hatched on its far side.
func (b *builder) wall(x, y, dir float32, c color.NRGBA) {
	b.line(c, 2.5, Point{x, y - 20}, Point{x, y + 20})
	b.hatch(x, y-20, y+20, dir, c)
}

// hatch draws short oblique strokes on the dir side of a vertical line.
func (b *builder) hatch(x, y0, y1, dir float32, _ color.NRGBA) {
	for y := y0 + 3; y <= y1; y += 6 {
		b.line(hatchColour, 1, Point{x, y}, Point{x + dir*6, y - 6})
	}
}

// springs draws a zig-zag for each translational spring and a coil for the
// rotational one; a zero stiffness leaves that motion free and draws nothing.
func (b *builder) springs(x, y, dir float32, k [3]float64, c color.NRGBA) {
	if k[fem.Transverse] != 0 {
		top := y + memberWidth/2
		pts := []Point{{x, top}, {x, top + 4}}
		for i := 0; i < 6; i++ {
			off := float32(5)
			if i%2 == 1 {
				off = -5
			}
			pts = append(pts, Point{x + off, top + 6 + float32(i)*2.5})
		}
		pts = append(pts, Point{x, top + 21}, Point{x, top + 24})
		b.line(c, 1.3, pts...)
		b.ground(x, top+24, c)
	}
	if k[fem.Axial] != 0 {
		pts := []Point{{x, y}, {x + dir*4, y}}
		for i := 0; i < 6; i++ {
			off := float32(5)
			if i%2 == 1 {
				off = -5
			}
			pts = append(pts, Point{x + dir*(6+float32(i)*2.5), y + off})
		}
		pts = append(pts, Point{x + dir*21, y}, Point{x + dir*24, y})
		b.line(c, 1.3, pts...)
		b.line(c, 1.5, Point{x + dir*24, y - 10}, Point{x + dir*24, y + 10})
		b.hatch(x+dir*24, y-10, y+10, dir, c)
	}
	if k[fem.Rotation] != 0 {
		var pts []Point
		for t := 0.0; t <= 4*math.Pi; t += 0.25 {
			r := float32(2 + 1.2*t)
			pts = append(pts, Point{x + r*float32(math.Cos(t)), y - 14 - r*float32(math.Sin(t))*0.8})
		}
		b.line(c, 1.2, pts...)
	}
}

// pointLoad labels the arrow of a transverse force (drawn with the others
// by sketch), when it is the first of those that share it (see
// forceColumns), and draws axial forces as arrows along the member and a
// moment as a curved arrow showing its sense. Every force keeps its own
// handle.
func (b *builder) pointLoad(i int, p fem.PointLoad, y float32, forces forceArrows) {
	ref := Ref{Kind: PointLoad, Index: i}
	c := b.colourFor(ref, loadColour)
	x := b.sx(p.X)
	if p.Transverse != 0 {
		tip, tail, ay := forceArrow(x, y, p.Transverse)
		if col, ok := forces.drawnBy(i); ok {
			text := b.format(units.Force, math.Abs(p.Transverse))
			if col.count > 1 && col.equal {
				text = fmt.Sprintf("%d × %s", col.count, text)
			} else if col.count > 1 {
				text = fmt.Sprintf("%d loads, %s in all", col.count, b.format(units.Force, math.Abs(col.total)))
			}
			b.pointLabel(text, tail, ay)
		}
		b.handle(ref, 6, tail, tip)
	}
	if p.Axial != 0 {
		dir := float32(1)
		if p.Axial < 0 {
			dir = -1
		}
		ay := y - 9
		tail := Point{x, ay}
		tip := Point{x + dir*arrowLength*0.8, ay}
		b.arrow(tail, tip, c, 2, 9)
		b.symbol(rect{min(tail.X, tip.X), ay - 4, max(tail.X, tip.X), ay + 4})
		b.place(label{lines: []string{b.format(units.Force, math.Abs(p.Axial))}, size: smallSize, colour: c, at: tip,
			spots: []labelSpot{{tip.X + dir*3, ay, (1 - dir) / 2, 0.5}, {(tail.X + tip.X) / 2, ay - 4, 0.5, 1}}})
		b.handle(ref, 6, tail, tip)
	}
	if p.Moment != 0 {
		b.momentArrow(Point{x, y}, 16, p.Moment > 0, c)
		b.symbol(rect{x - 18, y - 18, x + 18, y + 18})
		b.place(label{lines: []string{b.format(units.Moment, math.Abs(p.Moment))}, size: smallSize, colour: c, at: Point{x, y - 18},
			spots: []labelSpot{{x + 20, y - 18, 0, 1}, {x - 20, y - 18, 1, 1}, {x, min(y-18, b.loadTop(p.X)-4), 0.5, 1}}})
		b.handle(ref, 16, Point{x, y})
	}
}

// forceArrows are the arrows of the transverse point forces: those that
// stand in one pixel column and point the same way share one arrow and one
// label, so that the arrows, and the labels looking for a place, are at
// most two a column however many forces there are. A force more than 20 px
// off the view draws nothing; the selected one draws its own arrow.
type forceArrows struct {
	// of is, per point load, 1 + the index of its arrow in columns; 0 when
	// it draws none.
	of      []int32
	columns []forceColumn
}

// forceColumn is one drawn arrow of transverse forces.
type forceColumn struct {
	first     int     // the load that draws it: the first of them in the model
	count     int     // the forces it stands for
	total     float64 // their sum, N
	equal     bool    // whether they are all alike
	tail, tip Point
	colour    color.NRGBA
}

// forceArrow returns the tail and tip of the arrow of a transverse force
// at x on the member at y, and where its label hangs from the tail (1:
// above it, 0: below).
func forceArrow(x, y float32, force float64) (tip, tail Point, ay float32) {
	if force > 0 {
		tip = Point{x, y + memberWidth/2 + 1}
		return tip, Point{x, tip.Y + arrowLength}, 0
	}
	tip = Point{x, y - memberWidth/2 - 1}
	return tip, Point{x, tip.Y - arrowLength}, 1
}

// drawnBy returns the arrow of load i when i draws it.
func (f forceArrows) drawnBy(i int) (forceColumn, bool) {
	if f.of[i] == 0 {
		return forceColumn{}, false
	}
	c := f.columns[f.of[i]-1]
	return c, c.first == i
}

// forceColumns gathers the transverse point forces on the member at y
// into their arrows.
func (b *builder) forceColumns(y float32) forceArrows {
	loads := b.in.Model.PointLoads
	f := forceArrows{of: make([]int32, len(loads))}
	const margin = 20
	width := int(b.v.Width) + 2*margin + 1
	at := make([]int32, 2*width) // per column and way, 1 + its arrow's index
	for i, p := range loads {
		x := b.sx(p.X)
		if p.Transverse == 0 || !(x >= -margin && x <= b.v.Width+margin) {
			continue
		}
		k := int(math.Floor(float64(x))) + margin
		if p.Transverse > 0 {
			k += width
		}
		if b.in.Selected == (Ref{Kind: PointLoad, Index: i}) || at[k] == 0 {
			tip, tail, _ := forceArrow(x, y, p.Transverse)
			c := b.colourFor(Ref{Kind: PointLoad, Index: i}, loadColour)
			f.columns = append(f.columns, forceColumn{first: i, count: 1, total: p.Transverse, equal: true, tail: tail, tip: tip, colour: c})
			f.of[i] = int32(len(f.columns))
			if b.in.Selected != (Ref{Kind: PointLoad, Index: i}) {
				at[k] = f.of[i]
			}
			continue
		}
		c := &f.columns[at[k]-1]
		c.count++
		c.total += p.Transverse
		c.equal = c.equal && p.Transverse == loads[c.first].Transverse
		f.of[i] = at[k]
	}
	return f
}

// pointLabel labels a force arrow at its tail, or, when the arrows of a
// distributed load are in the way, above the load's outline.
func (b *builder) pointLabel(s string, tail Point, ay float32) {
	off := float32(-3)
	if ay == 0 {
		off = 3
	}
	spots := []labelSpot{{tail.X, tail.Y + off, 0.5, ay}, {tail.X + 4, tail.Y + off, 0, ay}, {tail.X - 4, tail.Y + off, 1, ay}}
	if top := b.loadTop(b.v.ToModelX(tail.X)); ay == 1 && top < tail.Y {
		spots = append(spots, labelSpot{tail.X, top - 4, 0.5, 1})
	}
	b.place(label{lines: []string{s}, size: smallSize, colour: loadColour, at: tail, spots: spots, crowd: true})
}

// loadTop is the highest screen y of the distributed loads drawn at x, or
// LoadBaseY where there are none.
func (b *builder) loadTop(x float64) float32 {
	top := b.s.LoadBaseY
	for _, d := range b.in.Model.DistributedLoad {
		if len(d.Points) < 2 || x < d.Points[0].X || x > d.Points[len(d.Points)-1].X {
			continue
		}
		sign := 1.0
		if d.Direction == fem.Axial {
			sign = -1
		}
		top = min(top, b.s.LoadBaseY+float32(sign*intensityAt(d.Points, x)/b.s.LoadScale))
	}
	return top
}

// momentArrow draws a 270° arc around c with a head at its end; the arc opens
// downwards so the member does not hide it. ccw picks the sense.
func (b *builder) momentArrow(c Point, r float32, ccw bool, col color.NRGBA) {
	// Angles in the usual maths sense (counter-clockwise, y up), start at -45°.
	start, sweep := -math.Pi/4, 1.5*math.Pi
	if !ccw {
		start, sweep = math.Pi*5/4, -1.5*math.Pi
	}
	var pts []Point
	const n = 30
	for k := 0; k <= n; k++ {
		a := start + sweep*float64(k)/n
		pts = append(pts, Point{c.X + r*float32(math.Cos(a)), c.Y - r*float32(math.Sin(a))})
	}
	b.line(col, 2, pts[:n-2]...)
	b.arrow(pts[n-4], pts[n], col, 2, 8)
}

// distributedLoads draws each load as an outline with arrows under it. The
// ordinate of a transverse load is drawn from LoadBaseY, downward loads above
// the member; an axial load uses the same scale with its arrows along x.
func (b *builder) distributedLoads(lay layoutBands) {
	m := b.in.Model
	base := lay.memberY - memberWidth/2 - 2
	room := base - lay.top - 50
	maxPx := max(16, min(90, room*0.6))
	peak := 0.0
	for _, d := range m.DistributedLoad {
		for _, p := range d.Points {
			peak = max(peak, math.Abs(p.Intensity))
		}
	}
	if peak == 0 {
		peak = 1000 // 1 kN/m per band so drags still mean something on an empty load
	}
	scale := peak / float64(maxPx)
	b.s.LoadScale = scale
	b.s.LoadBaseY = base
	for i, d := range m.DistributedLoad {
		if len(d.Points) < 2 {
			continue
		}
		ref := Ref{Kind: DistributedLoad, Index: i}
		selected := b.in.Selected.Kind != None && (b.in.Selected == ref ||
			(b.in.Selected.Kind == LoadVertex && b.in.Selected.Index == i))
		c := loadColour
		if selected {
			c = selectedColour
		}
		sign := 1.0 // screen y = base + sign·intensity/scale
		if d.Direction == fem.Axial {
			sign = -1
		}
		ordinate := func(q float64) float32 { return base + float32(sign*q/scale) }
		outline := make([]Point, 0, len(d.Points)+2)
		outline = append(outline, Point{b.sx(d.Points[0].X), base})
		for _, p := range d.Points {
			outline = append(outline, Point{b.sx(p.X), ordinate(p.Intensity)})
		}
		outline = append(outline, Point{b.sx(d.Points[len(d.Points)-1].X), base})
		b.polygon(withAlpha(c, 0x22), c, 1.3, outline...)
		b.loadArrows(d, base, ordinate, c)
		b.handle(ref, 3, outline...)
		// Label both ends, every vertex when selected; one label for a uniform load.
		for j, p := range d.Points {
			inner := j > 0 && j < len(d.Points)-1
			if inner && !selected || j > 0 && p.Intensity == d.Points[j-1].Intensity && len(d.Points) == 2 {
				continue
			}
			pk := outline[j+1]
			ay := float32(1)
			if pk.Y > base {
				ay = 0
			}
			dy := float32(-3)
			if ay == 0 {
				dy = 3
			}
			b.place(label{lines: []string{b.format(units.LineLoad, math.Abs(p.Intensity))}, size: smallSize, colour: c, at: pk,
				spots: []labelSpot{{pk.X, pk.Y + dy, 0.5, ay}, {pk.X + 4, pk.Y + dy, 0, ay}, {pk.X - 4, pk.Y + dy, 1, ay}}})
		}
		for j := range d.Points {
			vp := outline[j+1]
			vref := Ref{Kind: LoadVertex, Index: i, Vertex: j}
			if selected {
				vc := b.colourFor(vref, loadColour)
				b.polygon(white, vc, 1.5, Point{vp.X - 4, vp.Y - 4}, Point{vp.X + 4, vp.Y - 4}, Point{vp.X + 4, vp.Y + 4}, Point{vp.X - 4, vp.Y + 4})
			}
			b.s.Handles = append(b.s.Handles, Handle{Ref: vref, Points: []Point{vp}, Radius: 5, PerPixel: sign * scale})
		}
	}
}

// loadArrows fills a load outline with arrows about every 22 pixels.
func (b *builder) loadArrows(d fem.DistributedLoad, base float32, ordinate func(float64) float32, c color.NRGBA) {
	x0, x1 := b.sx(d.Points[0].X), b.sx(d.Points[len(d.Points)-1].X)
	lo, hi := max(x0, -20), min(x1, b.v.Width+20)
	if hi <= lo {
		return
	}
	n := max(1, int((hi-lo)/22))
	for k := 0; k <= n; k++ {
		px := lo + (hi-lo)*float32(k)/float32(n)
		q := intensityAt(d.Points, b.v.ToModelX(px))
		oy := ordinate(q)
		if math.Abs(float64(oy-base)) < 5 {
			continue
		}
		if d.Direction == fem.Axial {
			dir := float32(1)
			if q < 0 {
				dir = -1
			}
			my := (oy + base) / 2
			b.arrow(Point{px - dir*5, my}, Point{px + dir*5, my}, c, 1, 5)
			continue
		}
		if q < 0 {
			b.arrow(Point{px, oy}, Point{px, base}, c, 1, 6)
			b.symbol(rect{px - 3, oy, px + 3, base})
		} else {
			b.arrow(Point{px, base + 2*memberWidth}, Point{px, base + memberWidth + 2}, c, 1, 6)
		}
	}
}

// intensityAt interpolates a piecewise-linear load at x.
func intensityAt(pts []fem.LoadPoint, x float64) float64 {
	for j := 1; j < len(pts); j++ {
		a, c := pts[j-1], pts[j]
		if x <= c.X || j == len(pts)-1 {
			if c.X == a.X {
				return c.Intensity
			}
			t := max(0, min(1, (x-a.X)/(c.X-a.X)))
			return a.Intensity + t*(c.Intensity-a.Intensity)
		}
	}
	return 0
}

// problem shows the solver's complaint in the sketch band: its lines now,
// so later labels keep off them, and the box behind them when the
// returned function is called, after the rest of the sketch.
func (b *builder) problem(lay layoutBands) (box func()) {
	lines := wrap(b.in.Problem, problemSize, true, b.v.Width-60, b.textWidth)
	h := TextHeight(problemSize)
	y := lay.top + 30
	if b.in.Unreliable { // below the "UNRELIABLE RESULTS" line, not over it
		y += TextHeight(labelSize) + 4
	}
	wmax := float32(0)
	for _, ln := range lines {
		wmax = max(wmax, b.textWidth(ln, problemSize, true))
	}
	cx := b.v.Width / 2
	r := rect{cx - wmax/2 - 10, y - 4, cx + wmax/2 + 10, y + h*float32(len(lines)) + 4}
	b.place(label{lines: lines, size: problemSize, colour: problemColour, bold: true, at: Point{cx, y},
		spots: []labelSpot{{cx, y, 0.5, 0}}, plain: true})
	// The box's margins keep labels off; its lines are placed already.
	b.symbol(rect{r.x0, r.y0, r.x1, y})
	b.symbol(rect{r.x0, r.y1 - 4, r.x1, r.y1})
	b.symbol(rect{r.x0, r.y0, cx - wmax/2, r.y1})
	b.symbol(rect{cx + wmax/2, r.y0, r.x1, r.y1})
	return func() {
		b.polygon(rgba(0xff, 0xee, 0xee, 0xf0), problemColour, 1.5, Point{r.x0, r.y0}, Point{r.x1, r.y0}, Point{r.x1, r.y1}, Point{r.x0, r.y1})
	}
}

// reactions labels each support with the force it exerts.
func (b *builder) reactions(y float32) {
	rs := b.in.Solution.Reactions
	// A support within crowdedSupports pixels of its neighbour on either
	// side, along the member (the file lists supports in any order), is
	// labelled at its own spots or not at all: a thousand supports in a
	// few pixels each searched the drawing for room (40,000 supports took
	// 52 s to export as a sheet).
	along := make([]float32, len(rs))
	for k, r := range rs {
		along[k] = b.sx(r.X)
	}
	slices.Sort(along)
	for _, r := range rs {
		x := b.sx(r.X)
		i, _ := slices.BinarySearch(along, x) // its own place, the first at x
		crowded := i > 0 && x-along[i-1] < crowdedSupports || i+1 < len(along) && along[i+1]-x < crowdedSupports
		var parts []string
		names := [3]string{"Rx ", "Ry ", "Mr "}
		qs := [3]units.Kind{units.Force, units.Force, units.Moment}
		for d := range 3 {
			if r.Force[d] != 0 && b.supportHolds(r.Support, fem.Dof(d)) {
				parts = append(parts, names[d]+b.format(qs[d], r.Force[d]))
			}
		}
		ly := y + supportHeight + 6
		for _, p := range parts {
			rr, ok := b.place(label{lines: []string{p}, size: smallSize, colour: supportColour, at: Point{x, ly},
				spots: []labelSpot{{x, ly, 0.5, 0}, {x + 24, ly, 0, 0}, {x - 24, ly, 1, 0}}, optional: crowded})
			if !ok {
				break
			}
			ly = rr.y1 + 2
		}
	}
}

// crowdedSupports is the distance, px, below which neighbouring supports
// stand too close for each reaction to look for room away from its own.
const crowdedSupports = 2

func (b *builder) supportHolds(i int, d fem.Dof) bool {
	if i < 0 || i >= len(b.in.Model.Supports) {
		return true
	}
	return b.in.Model.Supports[i].Holds(d)
}

// dimensions draws a chain of dimensions between the ends and supports and,
// when there is more than one link, the overall span below it.
func (b *builder) dimensions(y float32) {
	m := b.in.Model
	l := m.Length()
	xs := []float64{0, l}
	for _, s := range m.Supports {
		xs = append(xs, s.X)
	}
	xs = uniqueSorted(xs)
	chainY := y + belowMember(reactionRows(b.in)) - 16
	for k := 1; k < len(xs); k++ {
		b.dimension(xs[k-1], xs[k], chainY, "")
	}
	if len(xs) > 2 {
		b.dimension(0, l, chainY+20, "L = ")
	}
}

func (b *builder) dimension(xa, xb float64, y float32, prefix string) {
	pa, pb := b.sx(xa), b.sx(xb)
	b.line(dimensionColour, 0.8, Point{b.clampX(pa), y}, Point{b.clampX(pb), y})
	b.symbol(rect{b.clampX(pa), y - 0.5, b.clampX(pb), y + 0.5})
	for _, p := range []float32{pa, pb} {
		b.line(dimensionColour, 0.8, Point{p, y - 6}, Point{p, y + 6})
		b.line(dimensionColour, 1.4, Point{p - 3, y + 3}, Point{p + 3, y - 3})
		b.symbol(rect{p - 3, y - 4, p + 3, y + 4})
	}
	s := prefix + b.format(units.Position, xb-xa)
	if b.textWidth(s, smallSize, false)+6 < pb-pa {
		b.place(label{lines: []string{s}, size: smallSize, colour: dimensionColour, at: Point{(pa + pb) / 2, y},
			spots: []labelSpot{{(pa + pb) / 2, y - 2, 0.5, 1}}})
	}
}

func uniqueSorted(xs []float64) []float64 {
	for i := 1; i < len(xs); i++ {
		for j := i; j > 0 && xs[j] < xs[j-1]; j-- {
			xs[j], xs[j-1] = xs[j-1], xs[j]
		}
	}
	out := xs[:0]
	for _, x := range xs {
		if len(out) == 0 || x != out[len(out)-1] {
			out = append(out, x)
		}
	}
	return out
}

// scaleBar draws a bar of a round length in display units at the top right.
func (b *builder) scaleBar(top float32) {
	perSI := b.u.ToDisplay(units.Position, 1) // display units per metre
	if perSI <= 0 {
		return
	}
	target := 110 / b.v.Scale * perSI // display units in ~110 px
	nice := niceBelow(target)         // the label, in display units
	length := nice / perSI
	px := float32(length * b.v.Scale)
	x1 := b.v.Width - 14
	x0 := x1 - px
	y := top + 26
	b.line(inkColour, 2, Point{x0, y}, Point{x1, y})
	b.line(inkColour, 1, Point{x0, y - 4}, Point{x0, y + 4})
	b.line(inkColour, 1, Point{x1, y - 4}, Point{x1, y + 4})
	// Written from nice, not converted back from length: 1.524 m / 0.3048 is
	// 5.000000000000001 in floating point.
	s := strconv.FormatFloat(nice, 'g', -1, 64) + " " + b.u.Unit(units.Position).Symbol
	b.symbol(rect{x0, y - 4, x1, y + 4})
	l := text1(s, smallSize, inkColour, false, labelSpot{(x0 + x1) / 2, y - 5, 0.5, 1})
	l.plain = true
	b.place(l)
}

// deflectedShape is the magnified deflection: its line, and the label of
// its peak to place once the fixed labels of the sketch are down.
type deflectedShape struct {
	pts  []Point
	peak label
}

// deflected works out the deflected shape and marks its peak, beside the
// exact solution's when shown; the line and the marks keep the labels
// placed from now on clear. Nil when the member does not deflect. It sets
// the scene's magnification.
func (b *builder) deflected(lay layoutBands) *deflectedShape {
	// The scale and the label come from where the curve has zero slope, as
	// the results table finds the peak, not from a pixel column's sample.
	peak := b.deflection.peak()
	if peak.value == 0 {
		return nil
	}
	band := float64(lay.sketchBottom - lay.top)
	mag := b.in.Magnification
	if mag <= 0 {
		mag = niceBelow(0.15 * band / (math.Abs(peak.value) * b.v.Scale))
	}
	b.s.Magnification = mag
	pxPerM := mag * b.v.Scale
	toY := func(w float64) float32 { return lay.memberY - float32(w*pxPerM) }
	b.place(text1(fmt.Sprintf("deflection × %s (FE, dashed)", trimFloat(mag)), smallSize, deformedColour, false, labelSpot{8, lay.top + 24, 0, 0}))
	d := &deflectedShape{pts: b.deflection.points(toY)}
	b.avoid(d.pts)
	at := Point{b.sx(peak.x), toY(peak.value)}
	b.marker(at, 2.5, deformedColour, false)
	var exact *extreme
	if e := b.in.Exact; e != nil {
		lo, hi := exactExtremes(e, b.v, []fem.Quantity{fem.QDeflection}, []*curve{b.deflection})
		exact = &hi[0]
		if peak.value < 0 {
			exact = &lo[0]
		}
		if b.exact() != nil {
			b.marker(Point{b.sx(exact.x), toY(exact.value)}, 3, exactColour, true)
		}
	}
	// The deflection is continuous: it has no side to say.
	d.peak = b.extremeLabel("w ", units.Deflection, peak, exact, [2]fem.Side{}, at, peak.value > 0, deformedColour)
	return d
}

// deformed draws the deflected line, broken around the segment names, and
// labels its peak.
func (b *builder) deformed(d *deflectedShape) {
	for _, piece := range around(d.pts, b.clear, 1) {
		b.s.Items = append(b.s.Items, Item{Kind: Polyline, Points: piece, Stroke: deformedColour, StrokeWidth: 2, Dash: true})
	}
	b.place(d.peak)
}

// trimFloat prints a magnification without trailing zeros.
func trimFloat(v float64) string {
	if v >= 1 && v == math.Trunc(v) && v < 1e15 {
		return fmt.Sprintf("%.0f", v)
	}
	return fmt.Sprintf("%.3g", v)
}

// hinge draws a moment release: an open ring on the member axis that the
// member passes through, and for a semi-rigid joint a small coil above it.
func (b *builder) hinge(i int, h fem.Hinge, y float32) {
	ref := Ref{Kind: Hinge, Index: i}
	c := b.colourFor(ref, inkColour)
	x := b.sx(h.X)
	b.circle(Point{x, y}, 5, white, c, 1.6)
	if h.Stiffness > 0 {
		var pts []Point
		for t := 0.0; t <= 3*math.Pi; t += 0.25 {
			r := float32(1.5 + t)
			pts = append(pts, Point{x + r*float32(math.Cos(t)), y - 12 - r*float32(math.Sin(t))*0.7})
		}
		b.line(c, 1.1, pts...)
	}
	b.handle(ref, 6, Point{x, y})
	b.symbol(rect{x - 8, y - 24, x + 8, y + 7})
}

// foundation draws an elastic bed under the stretch it carries: short
// springs standing on a hatched base line, with a slanted end post at
// each end. It returns the label that names its modulus and what it
// carries, to be placed under the base where there is room; false when
// the bed is out of view.
func (b *builder) foundation(i int, f fem.Foundation, y float32) (label, bool) {
	ref := Ref{Kind: Foundation, Index: i}
	c := b.colourFor(ref, supportColour)
	x0, x1 := b.clampX(b.sx(f.Start)), b.clampX(b.sx(f.End))
	if x1-x0 < 1 {
		return label{}, false
	}
	top := y + memberWidth/2
	base := top + foundationDepth
	b.line(c, 1.5, Point{x0, base}, Point{x1, base})
	b.line(c, 1.2, Point{x0, top}, Point{x0 - 4, base})
	b.line(c, 1.2, Point{x1, top}, Point{x1 + 4, base})
	for x := x0 + 3; x <= x1; x += 6 {
		b.line(hatchColour, 1, Point{x, base}, Point{x - 5, base + 5})
	}
	// Springs about 16 px apart, spread evenly across the stretch.
	n := max(1, int((x1-x0)/16))
	step := (x1 - x0) / float32(n)
	for k := 0; k < n; k++ {
		x := x0 + step*(float32(k)+0.5)
		pts := []Point{{x, top}, {x, top + 2}}
		for j := range 4 {
			off := float32(3)
			if j%2 == 1 {
				off = -3
			}
			pts = append(pts, Point{x + off, top + 3.5 + float32(j)*1.8})
		}
		pts = append(pts, Point{x, base - 1.5}, Point{x, base})
		b.line(c, 1, pts...)
	}
	mid := base - foundationDepth/2
	b.handle(ref, foundationDepth/2+2, Point{x0, mid}, Point{x1, mid})
	b.symbol(rect{x0 - 4, top, x1 + 4, base + 5})
	text := "bed " + b.format(units.FoundationModulus, f.Modulus)
	if f.AxialModulus > 0 {
		text += ", along " + b.format(units.FoundationModulus, f.AxialModulus)
	}
	if sol := b.in.Solution; sol != nil && i < len(sol.Foundations) {
		text += ", Ry " + b.format(units.Force, sol.Foundations[i].Force[fem.Transverse]) // as the supports label theirs
	}
	cx := (x0 + x1) / 2
	return label{lines: []string{text}, size: smallSize, colour: c, optional: true, at: Point{cx, base + 5},
		spots: []labelSpot{{cx, base + 7, 0.5, 0}, {x0 + 4, base + 7, 0, 0}, {x1 - 4, base + 7, 1, 0}}}, true
}
