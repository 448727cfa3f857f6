package canvas

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// What a drawing says about itself: each strip's swatch legend (the finite
// element curve with its element type and count, the exact curve, the gap
// between them), one sentence on how the finite element field behaves
// inside an element, and the words of a labelled extreme with the finite
// element and the exact value side by side. The words come from the
// solution's formulations (Formulation.Name, Solution.Varies), not from a
// table per kind of diagram.

// legendItem is one entry of a legend row: a swatch, drawn by swatch with
// its left edge at x and the row's middle at y, followed by text.
type legendItem struct {
	width  float32 // of the swatch, px; 0 for none
	swatch func(x, y float32)
	text   string
	size   float32
	colour color.NRGBA
	bold   bool
}

// legendRow lays items out left to right from x0 at y (the top of the row)
// up to x1, starting a new row when one is full, and returns the bottom of
// the last row. Swatches keep labels off; texts go through the placer,
// which leaves out one with no room.
func (b *builder) legendRow(items []legendItem, x0, y, x1 float32) float32 {
	x := x0
	rowH := float32(0)
	for _, it := range items {
		w := it.width + b.textWidth(it.text, it.size, it.bold)
		if it.width > 0 {
			w += 4
		}
		if x > x0 && x+w > x1 {
			x, y, rowH = x0, y+rowH+2, 0
		}
		h := TextHeight(it.size)
		rowH = max(rowH, h)
		if it.width > 0 {
			it.swatch(x, y+h/2)
			b.symbol(rect{x, y + 1, x + it.width, y + h - 1})
			x += it.width + 4
		}
		l := text1(it.text, it.size, it.colour, it.bold, labelSpot{x, y, 0, 0})
		l.plain, l.optional = true, true
		b.place(l)
		x += b.textWidth(it.text, it.size, it.bold) + 12
	}
	return y + rowH
}

// paragraph places lines from x0 down, the last one ending at bottom, and
// returns the top of the first; nothing when they have no room.
func (b *builder) paragraph(lines []string, x0, bottom, size float32, c color.NRGBA) float32 {
	top := bottom - TextHeight(size)*float32(len(lines))
	b.place(label{lines: lines, size: size, colour: c, at: Point{x0, top}, spots: []labelSpot{{x0, top, 0, 0}}, plain: true, optional: true})
	return top
}

// gapFill is the colour of the gap between the finite element and the
// exact curves: opaque, drawn over the finite element area, so the gap
// reads in one colour wherever it lies.
var gapFill = rgb(0xf2, 0xa7, 0xc6)

// stripLegend is the legend of a strip with the finite element curve fe
// and the exact curve when exact: swatches for each and for the gap.
func (b *builder) stripLegend(d diagram, exact bool) []legendItem {
	feSwatch := func(x, y float32) {
		b.rectangle(x, y-4, x+18, y+4, withAlpha(d.colour, 0x38))
		b.line(d.colour, 1.8, Point{x, y - 4}, Point{x + 18, y - 4})
	}
	items := []legendItem{{width: 18, swatch: feSwatch, text: b.elementWords(d.quantity), size: smallSize, colour: inkColour}}
	if exact {
		items = append(items,
			legendItem{width: 18, swatch: func(x, y float32) { b.line(exactColour, 0.9, Point{x, y}, Point{x + 18, y}) },
				text: "exact", size: smallSize, colour: inkColour},
			legendItem{width: 18, swatch: func(x, y float32) { b.rectangle(x, y-4, x+18, y+4, gapFill) },
				text: "gap between them", size: smallSize, colour: inkColour})
	}
	return items
}

// formulations are the names of the element formulations of the solution
// that carry q, or a part of it (the combined stress is made of the bar's
// axial stress and the beam's bending stress).
func (b *builder) formulations(q fem.Quantity) []string {
	bar, beam := b.in.Solution.Model.Formulations()
	solved := []fem.Formulation{bar, beam}
	if b.in.Solution.AxialOnly {
		solved = solved[:1] // its bending is not solved
	}
	var names []string
	for _, f := range solved {
		for _, p := range parts(q) {
			if f.Varies(p).Degree >= 0 {
				names = append(names, f.Name())
				break
			}
		}
	}
	return names
}

// parts are the quantities q is made of: the axial and the bending stress
// for the combined stress, else q itself.
func parts(q fem.Quantity) []fem.Quantity {
	if q == fem.QCombinedStress {
		return []fem.Quantity{fem.QAxialStress, fem.QBendingStress}
	}
	return []fem.Quantity{q}
}

// elementWords names the finite element curve of q: "FE, 8 Hermite beam
// elements", or "FE, 8 elements" for a quantity no element solved gives
// (the bending of a member solved as a bar alone, zero).
func (b *builder) elementWords(q fem.Quantity) string {
	n := len(b.in.Solution.Mesh.Elements)
	plural := "s"
	if n == 1 {
		plural = ""
	}
	kinds := strings.Join(b.formulations(q), " + ")
	if kinds != "" {
		kinds += " "
	}
	return fmt.Sprintf("FE, %d %selement%s", n, kinds, plural)
}

// degreeWords names the degree of a polynomial.
func degreeWords(d int) string {
	if d >= 0 && d < 4 {
		return [...]string{"constant", "linear", "quadratic", "cubic"}[d]
	}
	return fmt.Sprintf("of degree %d", d)
}

// insideElement is one plain sentence on how the finite element q behaves
// inside an element and across its nodes, from Solution.Varies; of the
// combined stress of an envelope, both fibres (fibreWords).
func (b *builder) insideElement(q fem.Quantity, envelope bool) string {
	s := b.in.Solution
	name := q.Info().Name
	if bar, _ := s.Model.Formulations(); s.AxialOnly && bar.Varies(q).Degree < 0 && q != fem.QCombinedStress {
		return fmt.Sprintf("Nothing bends this member: it is solved as a bar alone, so its %s is zero.", name)
	}
	if ps := parts(q); len(ps) > 1 {
		var each []string
		for _, p := range ps {
			each = append(each, fmt.Sprintf("the %s (%s)", p.Info().Name, degreeWords(s.Varies(p).Degree)))
		}
		fibre := "the larger fibre of"
		if envelope {
			fibre = "taken in both fibres from"
		}
		return fmt.Sprintf("Inside each element the FE %s is %s %s, so it may jump inside an element and at the nodes.",
			name, fibre, strings.Join(each, " and "))
	}
	v := s.Varies(q)
	if v.Nodal {
		return fmt.Sprintf("Inside each element the FE %s is %s, and continuous at the nodes.", name, degreeWords(v.Degree))
	}
	return fmt.Sprintf("Inside each element the FE %s is %s and may jump at the nodes, so next to a support it need not equal the reaction.",
		name, degreeWords(v.Degree))
}

// negligibleShare is the size, relative to the largest magnitude of a
// field, below which an extreme is not labelled: in a strip 100 px high it
// lies within two pixels of the axis, and its label would sit on the curve.
const negligibleShare = 0.02

// extremeWords words an extreme fe of the finite element solution and, with
// exact, the same extreme of the exact solution and how far the finite
// element value is off it, a line each; one line where the two agree to
// the digits shown. Each says its side of a jump, sides[0] of fe's place
// and sides[1] of exact's, as the results table does (fem.Side.At). what
// names the quantity ("w ") or is empty where the strip's title names it.
func (b *builder) extremeWords(what string, q units.Kind, fe extreme, exact *extreme, sides [2]fem.Side) []string {
	value, at := b.format(q, fe.value), b.format(units.Position, fe.x)
	if exact == nil {
		return []string{fmt.Sprintf("FE %s%s %s", what, value, sides[0].At(at))}
	}
	exValue, exAt := b.format(q, exact.value), b.format(units.Position, exact.x)
	switch {
	case value == exValue && at == exAt && sides[0] == sides[1]:
		return []string{fmt.Sprintf("FE and exact %s%s %s", what, value, sides[0].At(at))}
	case value == exValue:
		return []string{fmt.Sprintf("FE and exact %s%s, %s and %s", what, value, sides[0].At(at), sides[1].Place(exAt))}
	}
	off := b.format(q, fe.value-exact.value)
	if fe.value > exact.value {
		off = "+" + off
	}
	return []string{fmt.Sprintf("FE %s%s %s", what, value, sides[0].At(at)), fmt.Sprintf("exact %s%s %s, FE off by %s", what, exValue, sides[1].At(exAt), off)}
}

// extremeLabel is the label of an extreme at the point at of a curve drawn
// toward the top when up (see extremeWords), in colour c; one line when its
// lines find no place.
func (b *builder) extremeLabel(what string, q units.Kind, fe extreme, exact *extreme, sides [2]fem.Side, at Point, up bool, c color.NRGBA) label {
	lines := b.extremeWords(what, q, fe, exact, sides)
	return label{lines: lines, compact: strings.Join(lines, "; "), size: smallSize, colour: c, at: at, spots: besideSpots(at, up)}
}

// labelled reports whether an extreme pair (finite element value fe, exact
// value ex) is worth a label in a field whose largest magnitude is size.
func labelled(fe, ex, size float64) bool {
	return max(math.Abs(fe), math.Abs(ex)) > negligibleShare*size
}
