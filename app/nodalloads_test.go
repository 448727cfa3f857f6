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

// An element of a segment with shear deformation writes out the vector of
// the interdependent interpolation element it was solved with, with its φ,
// not the Hermite formulas beside numbers they do not give: under q₁ = −2 kN/m,
// q₂ = −5 kN/m over h = 1.5 m with φ = 16/15, F₁ = μh((21 + 20φ)q₁ +
// (9 + 10φ)q₂)/60 = −2.214 kN where h(7q₁ + 3q₂)/20 is −2.175 kN (the
// integral of the element's shape functions against the load, derived in
// fem's TestNodalLoadsShearDeformation).
func TestElementLoadLinesShearDeformation(t *testing.T) {
	const h, q1, q2, phi = 1.5, -2000.0, -5000.0, 16.0 / 15
	mu := 1 / (1 + phi)
	beam := [4]float64{
		mu * h * ((21+20*phi)*q1 + (9+10*phi)*q2) / 60,
		mu * h * h * ((6+5*phi)*q1 + (4+5*phi)*q2) / 120,
		mu * h * ((9+10*phi)*q1 + (21+20*phi)*q2) / 60,
		-mu * h * h * ((4+5*phi)*q1 + (6+5*phi)*q2) / 120,
	}
	nl := &fem.NodalLoads{Bar: "linear bar", Beam: "Hermite beam", BarOrder: fem.LinearBar,
		Elements: []fem.ElementLoad{{Start: 1, End: 1 + h, Transverse: [2]float64{q1, q2}, Beam: beam, Shear: phi,
			Lumped: [2]float64{0, h * (q1 + q2) / 4}}}}
	u := units.SI
	text := strings.Join(elementLoadLines(nl, 0, u), "\n")
	for _, want := range []string{
		"φ = 12·EI/(G·As·h²) = " + units.FormatNumber(phi),
		"F₁ = h·((21 + 20φ)q₁ + (9 + 10φ)q₂)/(60(1 + φ)) = ", "= " + u.Format(units.Force, beam[0]),
		"M₁ = h²·((6 + 5φ)q₁ + (4 + 5φ)q₂)/(120(1 + φ)) = ", "= " + u.Format(units.Moment, beam[1]),
		"F₂ = h·((9 + 10φ)q₁ + (21 + 20φ)q₂)/(60(1 + φ)) = ", "= " + u.Format(units.Force, beam[2]),
		"M₂ = −h²·((4 + 5φ)q₁ + (6 + 5φ)q₂)/(120(1 + φ)) = ", "= " + u.Format(units.Moment, beam[3]),
	} {
		if !strings.Contains(text, want) {
			t.Errorf("the element's lines do not say %q; they say\n%s", want, text)
		}
	}
	for _, wrong := range []string{"(7q₁ + 3q₂)/20", "cubic Hermite shape functions"} {
		if strings.Contains(text, wrong) {
			t.Errorf("an element with shear deformation is written out with %q:\n%s", wrong, text)
		}
	}
}

// In a member of segments with and without shear deformation (its beam
// element named "Hermite and Timoshenko beam"), an element without it is
// written out as the Hermite element it is: the Hermite formulas were put
// under the name of both elements. (The window's own wording; no check
// value of its own.)
func TestElementLoadLinesNameTheElementOfTheirSegment(t *testing.T) {
	const h, q = 1.5, -2000.0
	for _, beam := range []string{"Hermite beam", "Hermite and Timoshenko beam"} {
		nl := &fem.NodalLoads{Bar: "linear bar", Beam: beam, BarOrder: fem.LinearBar,
			Elements: []fem.ElementLoad{{Start: 0, End: h, Transverse: [2]float64{q, q},
				Beam: [4]float64{q * h / 2, q * h * h / 12, q * h / 2, -q * h * h / 12}, Lumped: [2]float64{0, q * h / 2}}}}
		text := strings.Join(elementLoadLines(nl, 0, units.SI), "\n")
		if !strings.Contains(text, "Hermite beam element, consistent loads") || strings.Contains(text, "Timoshenko") {
			t.Errorf("member of %ss: an element without shear deformation is written out as\n%s", beam, text)
		}
	}
}
