package app

import (
	"fmt"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/units"
)

// The nodal loads, made visible: a switch in the Study menu adds a strip of
// what the solver applies at the nodes of the mesh in use for the line
// loads and self-weight, consistent beside lumped; a click on an element
// there shows its own load vector and the integral it came from, and a
// table lists every node.

// nodalLoads is the switch and the nodal loads of the solution shown,
// worked out once per solution.
type nodalLoads struct {
	on       bool
	solution *fem.Solution
	loads    *fem.NodalLoads
}

// of is the nodal loads of s, nil without a solution, and whether they
// are new since the last call.
func (n *nodalLoads) of(s *fem.Solution) (nl *fem.NodalLoads, fresh bool) {
	if s == nil {
		return nil, false
	}
	if s != n.solution {
		n.solution, n.loads, fresh = s, s.NodalLoads(), true
	}
	return n.loads, fresh
}

// nodalMenuItem switches the nodal loads' strip, ticked while it is shown.
func (w *Window) nodalMenuItem() *fyne.MenuItem {
	it := w.item("Nodal loads of the mesh", nil, w.toggleNodalLoads)
	it.Checked = w.draw.nodal.on
	return it
}

// toggleNodalLoads shows or hides the nodal loads' strip; hidden, it drops
// the selection of an element.
func (w *Window) toggleNodalLoads() {
	w.draw.nodal.on = !w.draw.nodal.on
	if !w.draw.nodal.on && w.selected.Kind == canvas.Element {
		w.selectItem(canvas.Ref{})
	}
	w.setMainMenu() // the tick
	w.draw.Refresh()
	if w.draw.nodal.on {
		w.setStatus("nodal loads of the mesh shown under the sketch: click an element there for its load vector")
	}
}

// shownSolution is the finite element solution the drawing shows, or nil.
func (w *Window) shownSolution() *fem.Solution {
	if w.result == nil {
		return nil
	}
	return w.result.Solution
}

// showElementLoads fills the properties pane with element i's load vectors
// and the integrals they come from.
func (c *controls) showElementLoads(i int) {
	w := c.w
	nl, _ := w.draw.nodal.of(w.shownSolution())
	c.panel.key = "" // the next item rebuilds the pane
	var body []fyne.CanvasObject
	if nl == nil || i >= len(nl.Elements) {
		body = append(body, widget.NewLabel("No element of the solved mesh is selected: click one in the nodal loads' strip."))
	} else {
		for _, s := range elementLoadLines(nl, i, w.units) {
			l := widget.NewLabel(s)
			l.Wrapping = fyne.TextWrapWord
			body = append(body, l)
		}
	}
	table := w.newButton("Every node…", nil, w.showNodalTable)
	c.properties.Objects = []fyne.CanvasObject{container.NewBorder(heading(fmt.Sprintf("Properties — element %d", i+1)),
		table, nil, nil, container.NewVScroll(container.NewVBox(body...)))}
	c.properties.Refresh()
}

// elementLoadLines says what element i of nl applies at its nodes, each
// vector written out as the integral of its shape functions times the load
// with the numbers put in, beside the lumped alternative, in units u.
func elementLoadLines(nl *fem.NodalLoads, i int, u units.System) []string {
	e := nl.Elements[i]
	f := u.Format
	num := func(q units.Kind, v float64) string { return units.FormatNumber(u.ToDisplay(q, v)) }
	h := e.End - e.Start
	hs, q1, q2 := num(units.Position, h), num(units.LineLoad, e.Transverse[0]), num(units.LineLoad, e.Transverse[1])
	lengthU, loadU := u.Unit(units.Position).Symbol, u.Unit(units.LineLoad).Symbol
	lines := []string{
		fmt.Sprintf("Element %d of %d, from %s to %s: h = %s.", i+1, len(nl.Elements), f(units.Position, e.Start), f(units.Position, e.End), f(units.Position, h)),
		fmt.Sprintf("Line load across it, self-weight included: q₁ = %s at its start, q₂ = %s at its end, linear between.",
			f(units.LineLoad, e.Transverse[0]), f(units.LineLoad, e.Transverse[1])),
	}
	if e.Shear == 0 {
		lines = append(lines,
			// The element of a segment without shear deformation, also in
			// a member whose other segments have it (nl.Beam names both).
			"Hermite beam element, consistent loads fᵢ = ∫₀ʰ Nᵢ(x)·q(x) dx with the cubic Hermite shape functions Nᵢ:",
			fmt.Sprintf("F₁ = h·(7q₁ + 3q₂)/20 = %s %s × (7 × %s + 3 × %s) %s / 20 = %s", hs, lengthU, q1, q2, loadU, f(units.Force, e.Beam[0])),
			fmt.Sprintf("M₁ = h²·(3q₁ + 2q₂)/60 = (%s %s)² × (3 × %s + 2 × %s) %s / 60 = %s", hs, lengthU, q1, q2, loadU, f(units.Moment, e.Beam[1])),
			fmt.Sprintf("F₂ = h·(3q₁ + 7q₂)/20 = %s %s × (3 × %s + 7 × %s) %s / 20 = %s", hs, lengthU, q1, q2, loadU, f(units.Force, e.Beam[2])),
			fmt.Sprintf("M₂ = −h²·(2q₁ + 3q₂)/60 = −(%s %s)² × (2 × %s + 3 × %s) %s / 60 = %s", hs, lengthU, q1, q2, loadU, f(units.Moment, e.Beam[3])))
	} else {
		// The interdependent interpolation element of a segment with shear
		// deformation (fem.ElementLoad.Shear): its shape functions' integrals
		// against the linear load, which φ = 0 takes back to the Hermite ones.
		phi := units.FormatNumber(e.Shear)
		lines = append(lines,
			fmt.Sprintf("Beam element with shear deformation (interdependent interpolation), φ = 12·EI/(G·As·h²) = %s; consistent loads fᵢ = ∫₀ʰ Nᵢ(x)·q(x) dx with its shape functions Nᵢ (φ = 0 gives the Hermite ones):", phi),
			fmt.Sprintf("F₁ = h·((21 + 20φ)q₁ + (9 + 10φ)q₂)/(60(1 + φ)) = %s %s × ((21 + 20 × %s) × %s + (9 + 10 × %s) × %s) %s / (60 × (1 + %s)) = %s",
				hs, lengthU, phi, q1, phi, q2, loadU, phi, f(units.Force, e.Beam[0])),
			fmt.Sprintf("M₁ = h²·((6 + 5φ)q₁ + (4 + 5φ)q₂)/(120(1 + φ)) = (%s %s)² × ((6 + 5 × %s) × %s + (4 + 5 × %s) × %s) %s / (120 × (1 + %s)) = %s",
				hs, lengthU, phi, q1, phi, q2, loadU, phi, f(units.Moment, e.Beam[1])),
			fmt.Sprintf("F₂ = h·((9 + 10φ)q₁ + (21 + 20φ)q₂)/(60(1 + φ)) = %s %s × ((9 + 10 × %s) × %s + (21 + 20 × %s) × %s) %s / (60 × (1 + %s)) = %s",
				hs, lengthU, phi, q1, phi, q2, loadU, phi, f(units.Force, e.Beam[2])),
			fmt.Sprintf("M₂ = −h²·((4 + 5φ)q₁ + (6 + 5φ)q₂)/(120(1 + φ)) = −(%s %s)² × ((4 + 5 × %s) × %s + (6 + 5 × %s) × %s) %s / (120 × (1 + %s)) = %s",
				hs, lengthU, phi, q1, phi, q2, loadU, phi, f(units.Moment, e.Beam[3])))
	}
	lines = append(lines, fmt.Sprintf("Lumped instead: h·(q₁ + q₂)/4 = %s on each node and no moments. The moments M₁ and M₂ are what lumping loses; under a load that varies along the element the forces differ too.",
		f(units.Force, e.Lumped[1])))
	if e.Axial != [2]float64{} {
		p1, p2 := num(units.LineLoad, e.Axial[0]), num(units.LineLoad, e.Axial[1])
		lines = append(lines, fmt.Sprintf("Along the axis p₁ = %s, p₂ = %s; %s, fᵢ = ∫₀ʰ Nᵢ(x)·p(x) dx:",
			f(units.LineLoad, e.Axial[0]), f(units.LineLoad, e.Axial[1]), nl.Bar))
		if nl.BarOrder == fem.LinearBar {
			lines = append(lines,
				fmt.Sprintf("N₁ = h·(2p₁ + p₂)/6 = %s %s × (2 × %s + %s) %s / 6 = %s", hs, lengthU, p1, p2, loadU, f(units.Force, e.Bar[0])),
				fmt.Sprintf("N₂ = h·(p₁ + 2p₂)/6 = %s %s × (%s + 2 × %s) %s / 6 = %s", hs, lengthU, p1, p2, loadU, f(units.Force, e.Bar[1])))
		} else {
			lines = append(lines,
				fmt.Sprintf("N₁ = h·p₁/6 = %s, at the middle node h·(p₁ + p₂)/3 = %s, N₂ = h·p₂/6 = %s",
					f(units.Force, e.Bar[0]), f(units.Force, e.BarMiddle), f(units.Force, e.Bar[1])))
		}
		lines = append(lines, fmt.Sprintf("Lumped: h·(p₁ + p₂)/4 = %s on each end node.", f(units.Force, e.Lumped[0])))
	}
	return lines
}

// capitalize is s with its first letter in upper case.
func capitalize(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

// nodalColumns are the columns of the table of every node.
var nodalColumns = []struct {
	title string
	q     units.Kind
	value func(n fem.NodeLoad) float64
}{
	{"x", units.Position, func(n fem.NodeLoad) float64 { return n.X }},
	{"consistent force", units.Force, func(n fem.NodeLoad) float64 { return n.Consistent[fem.Transverse] }},
	{"consistent moment", units.Moment, func(n fem.NodeLoad) float64 { return n.Consistent[fem.Rotation] }},
	{"lumped force", units.Force, func(n fem.NodeLoad) float64 { return n.Lumped[fem.Transverse] }},
	{"consistent axial", units.Force, func(n fem.NodeLoad) float64 { return n.Consistent[fem.Axial] }},
	{"lumped axial", units.Force, func(n fem.NodeLoad) float64 { return n.Lumped[fem.Axial] }},
}

// nodalTableRows are the rows of the table of every node, in units u: one
// per node, then the sums and the load's own resultant.
func nodalTableRows(nl *fem.NodalLoads, u units.System) [][]string {
	rows := make([][]string, 0, len(nl.Nodes)+3)
	for _, n := range nl.Nodes {
		row := make([]string, len(nodalColumns))
		for k, c := range nodalColumns {
			row[k] = u.Format(c.q, c.value(n))
		}
		rows = append(rows, row)
	}
	sum := func(name string, s [3]float64, lumped bool) []string {
		row := []string{name, u.Format(units.Force, s[fem.Transverse]), u.Format(units.Moment, s[2]) + " about x = 0", "", u.Format(units.Force, s[fem.Axial]), ""}
		if lumped {
			row = []string{name, "", u.Format(units.Moment, s[2]) + " about x = 0", u.Format(units.Force, s[fem.Transverse]), "", u.Format(units.Force, s[fem.Axial])}
		}
		return row
	}
	return append(rows, sum("consistent, sum", nl.Consistent, false), sum("lumped, sum", nl.Lumped, true), sum("the load itself", nl.Resultant, false))
}

// showNodalTable opens a table of every node's consistent and lumped loads
// with their sums against the load's own resultant.
func (w *Window) showNodalTable() {
	nl, _ := w.draw.nodal.of(w.shownSolution())
	if nl == nil {
		w.setStatus("no nodal loads to list: the member is not solved yet")
		return
	}
	rows := nodalTableRows(nl, w.units)
	t := newEscTable(func() (int, int) { return len(rows), len(nodalColumns) },
		func() fyne.CanvasObject { return widget.NewLabel("") },
		func(id widget.TableCellID, o fyne.CanvasObject) { o.(*widget.Label).SetText(rows[id.Row][id.Col]) })
	t.ShowHeaderRow = true
	t.OnEscape = w.escape
	t.UpdateHeader = func(id widget.TableCellID, o fyne.CanvasObject) {
		if id.Col >= 0 {
			o.(*widget.Label).SetText(nodalColumns[id.Col].title)
		}
	}
	for k := range nodalColumns {
		t.SetColumnWidth(k, 150)
	}
	kinds := nl.Bar // a member solved as a bar alone has no beam element
	if nl.Beam != "" {
		kinds = nl.Beam + " and " + nl.Bar
	}
	note := widget.NewLabel(fmt.Sprintf("%d nodes of %d %s elements. Consistent loads keep the resultant and its moment; lumped loads keep the forces only.",
		len(nl.Nodes), len(nl.Elements), kinds))
	note.Wrapping = fyne.TextWrapWord
	d, _ := w.newDialog("Nodal loads of the line loads and self-weight", container.NewBorder(note, nil, nil, nil, t), choice{label: "Close"})
	d.Resize(fyne.NewSize(960, 520))
	w.showDialog(d)
}
