package app

import (
	"slices"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/units"
)

// labelTexts are the texts of the labels laid out in o.
func labelTexts(o fyne.CanvasObject) []string {
	var out []string
	for _, c := range test.LaidOutObjects(o) {
		if l, ok := c.(*widget.Label); ok {
			out = append(out, l.Text)
		}
	}
	return out
}

// Study ▸ Nodal loads of the mesh adds their strip; a click on an element
// there shows its own load vector, each entry written out as the integral
// with the numbers put in; the table lists every node with the sums against
// the load's own; switched off, the element is no longer selected.
func TestNodalLoadsPanel(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	s := solved(t, w, q)
	w.toggleNodalLoads()
	if !w.draw.nodal.on || w.draw.scene == nil {
		t.Fatal("the nodal loads' switch did not turn on")
	}
	nl, err := fem.NodalLoadsOn(&s.Model, s.Mesh)
	if err != nil {
		t.Fatal(err)
	}
	// An element under the rising load, whose end forces differ.
	i := slices.IndexFunc(nl.Elements, func(e fem.ElementLoad) bool { return e.Transverse[0] != e.Transverse[1] })
	if i < 0 {
		t.Fatal("the demo has no element under a varying load; the test needs one")
	}
	ref := canvas.Ref{Kind: canvas.Element, Index: i}
	var at fyne.Position
	for _, h := range w.draw.scene.Handles {
		if h.Ref == ref {
			at = fyne.NewPos((h.Points[0].X+h.Points[1].X)/2, h.Points[0].Y)
		}
	}
	if at == (fyne.Position{}) {
		t.Fatalf("no handle for element %d in the nodal loads' strip", i+1)
	}
	click(w.draw, at)
	if w.selected != ref {
		t.Fatalf("a click on element %d selected %v", i+1, w.selected)
	}
	e := nl.Elements[i]
	shown := labelTexts(w.ui.properties)
	for _, want := range []string{
		"F₁ = h·(7q₁ + 3q₂)/20 = ", "= " + w.units.Format(units.Force, e.Beam[0]),
		"M₂ = −h²·(2q₁ + 3q₂)/60 = ", "= " + w.units.Format(units.Moment, e.Beam[3]),
		"h·(q₁ + q₂)/4 = " + w.units.Format(units.Force, e.Lumped[1]),
	} {
		if !slices.ContainsFunc(shown, func(s string) bool { return strings.Contains(s, want) }) {
			t.Errorf("the element's panel does not say %q; it says\n%s", want, strings.Join(shown, "\n"))
		}
	}
	rows := nodalTableRows(nl, w.units)
	if len(rows) != len(nl.Nodes)+3 {
		t.Fatalf("the table has %d rows for %d nodes and three sums", len(rows), len(nl.Nodes))
	}
	sums := rows[len(nl.Nodes):]
	if consistent, load := sums[0][1], sums[2][1]; consistent != load || consistent != w.units.Format(units.Force, nl.Resultant[fem.Transverse]) {
		t.Errorf("the table sums the consistent forces to %s, the load is %s", consistent, load)
	}
	w.toggleNodalLoads()
	if w.selected.Kind == canvas.Element {
		t.Error("the element stays selected with the nodal loads switched off")
	}
}
