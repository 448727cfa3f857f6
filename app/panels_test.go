package app

import (
	"fmt"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/units"
)

// A new sketch with no member fails nothing: the checks say what to do
// first, and the drawing carries no problem or warning.
func TestBlankSketchIsNotAFailure(t *testing.T) {
	w, q := newTestWindow(t, nil)
	finished(t, w, q)
	if len(w.checks) != 0 {
		t.Errorf("a blank sketch lists checks %+v", w.checks)
	}
	if got := w.ui.checks.summary.Text; !strings.HasPrefix(got, "No member yet") {
		t.Errorf("the checks panel of a blank sketch says %q", got)
	}
	if in := w.sceneInput(); in.Problem != "" || in.Unreliable {
		t.Errorf("the drawing of a blank sketch shows problem %q, unreliable %v", in.Problem, in.Unreliable)
	}
	// Control: a member on one roller does fail.
	w.apply("draw a member", func(m *fem.Model) error {
		*m = newMember(4)
		addSupport(m, fem.Roller, 0)
		return nil
	})
	finished(t, w, q)
	if len(w.checks) == 0 || w.checks[0].Status != "FAIL" {
		t.Errorf("a member free to move lists %+v", w.checks)
	}
}

// Positions read in plain decimals to the precision of the view, in the
// display unit.
func TestPositionsInPlainDecimals(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	// The 5.5 m demo fitted to about 590 px: some 9 mm per pixel.
	for _, c := range []struct {
		x    float64
		us   bool
		want string
	}{
		{6.798e-4, false, "0.001 m"},
		{-1e-9, false, "0.000 m"},
		{2.5, false, "2.500 m"},
		{5.5, false, "5.500 m"},
		{3 * 0.3048, true, "3.00 ft"}, // 1 ft = 0.3048 m, NIST SP 811
	} {
		w.units = units.SI
		if c.us {
			w.units = units.USCustomary
		}
		if got := w.position(c.x); got != c.want {
			t.Errorf("position(%g m) in %s = %q, want %q", c.x, w.units.Name, got, c.want)
		}
	}
}

// The example in the properties panel's hint is in the display units.
func TestTypingHintFollowsUnits(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.selectItem(canvas.Ref{Kind: canvas.PointLoad, Index: 0})
	if got := w.typingHint(w.ui.panel.fields); !strings.Contains(got, "12 kN") {
		t.Errorf("SI hint %q", got)
	}
	w.setUnits(units.USCustomary)
	if got := w.typingHint(w.ui.panel.fields); !strings.Contains(got, "12 kip") || strings.Contains(got, "kN") {
		t.Errorf("US hint %q", got)
	}
	f := newAddForm(w)
	if got := f.hint.Text; !strings.Contains(got, "12 kip") || strings.Contains(got, "kN") || strings.Contains(got, "mm") {
		t.Errorf("US hint of the Add form %q", got)
	}
}

// The mesh bar names the elements as fem does and counts them in good English.
func TestMeshWords(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.setElements("1")
	if got := w.status.Text; !strings.HasPrefix(got, "use 1 element") || strings.HasPrefix(got, "use 1 elements") {
		t.Errorf("status after asking for one element: %q", got)
	}
	linear := fem.Model{Mesh: fem.MeshSettings{BarOrder: fem.LinearBar}}
	quadratic := fem.Model{Mesh: fem.MeshSettings{BarOrder: fem.QuadraticBar}}
	bar1, beam := linear.Formulations()
	bar2, _ := quadratic.Formulations()
	if got := w.ui.order.Options; len(got) != 2 || got[0] != bar1.Name() || got[1] != bar2.Name() {
		t.Errorf("bar element choices %q, want %q and %q", got, bar1.Name(), bar2.Name())
	}
	w.ui.order.SetSelected(bar2.Name())
	if w.Model().Mesh.BarOrder != fem.QuadraticBar || !strings.Contains(w.status.Text, "axial") {
		t.Errorf("choosing %q: bar order %d, status %q", bar2.Name(), w.Model().Mesh.BarOrder, w.status.Text)
	}
	found := false
	for _, o := range test.LaidOutObjects(w.win.Content()) {
		if l, ok := o.(*widget.Label); ok && strings.Contains(l.Text, beam.Name()) {
			found = true
		}
	}
	if !found {
		t.Errorf("no label names the beam element %q", beam.Name())
	}
}

// The readout is a table: one row per quantity with the exact value, the
// finite element one beside it and the unit, under the position in plain
// decimals; the checks list heads with the mesh, its accuracy and the
// exact values with the finite element ones beside.
func TestReadoutTable(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	d := w.draw
	x := 6.798e-4
	d.MouseMoved(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(d.view.ToScreenX(x), d.scene.MemberY)}})
	r := w.ui.readout
	if got := r.at.Text; strings.Contains(got, "e-") || !strings.Contains(got, " m") {
		t.Errorf("the readout reads at %q", got)
	}
	if len(r.rows) != len(fem.Quantities()) {
		t.Fatalf("the readout has %d rows, want one per quantity (%d)", len(r.rows), len(fem.Quantities()))
	}
	for i, qn := range fem.Quantities() {
		row := r.rows[i]
		if row[columnQuantity] != qn.Info().Label || row[columnFE] == "" || row[columnExact] == "" || row[columnUnit] != units.SI.Unit(qn.Info().Unit).Symbol {
			t.Errorf("row %d reads %q", i, row)
		}
	}
	// Values as small as the deflection this near the support are written
	// as the reports and the drawing write them (units.FormatNumber), with
	// a two-digit exponent: "4.258e-04", not "4.258e-4".
	powers := 0
	for _, row := range r.rows {
		for _, v := range []string{row[columnExact], row[columnFE]} {
			if _, exp, ok := strings.Cut(v, "e"); ok {
				powers++
				if len(strings.TrimLeft(exp, "+-")) != 2 {
					t.Errorf("the readout writes %q, the reports a two-digit exponent", v)
				}
			}
		}
	}
	if powers == 0 {
		t.Errorf("no readout value near the support has an exponent: %q", r.rows)
	}
	if readoutHeadings[columnExact] != "exact" || columnExact > columnFE {
		t.Errorf("the readout leads with %q, not the exact value", readoutHeadings[1])
	}
	d.MouseOut()
	if r.rows[0][columnFE] != "" {
		t.Errorf("the readout keeps values after the mouse left: %q", r.rows[0])
	}
	summary := w.ui.checks.summaryText()
	for _, want := range []string{"The mesh is", "Exact values, finite element (FE) beside", "• reaction 1", "• bending moment from"} {
		if !strings.Contains(summary, want) {
			t.Errorf("the checks list's summary lacks %q:\n%s", want, summary)
		}
	}
}

// The Checks panel's first line states the balance as the text output
// does, the largest residual relative to the loads (fem EquilibriumScales),
// where it read "out of balance 9.095e-16 kN, 3.638e-15 kN·m" on the demo:
// round-off printed in kilonewtons as if it were a result.
func TestChecksHeaderStatesTheBalanceAsTheTextDoes(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	var b strings.Builder
	report.WriteResultsText(&b, report.Source{Project: &w.project, Analysis: &w.result.Analysis, Units: w.units})
	const lead = "largest residual relative to the loads:"
	var relative string
	for _, line := range strings.Split(b.String(), "\n") {
		if _, after, ok := strings.Cut(line, lead); ok {
			f := strings.Fields(after)
			relative = f[len(f)-1] // the finite element one, last
		}
	}
	if relative == "" {
		t.Fatalf("the text output has no line %q:\n%s", lead, b.String())
	}
	first, _, _ := strings.Cut(w.ui.checks.summaryText(), "\n")
	if want := "residual " + relative + " of the loads"; !strings.Contains(first, want) {
		t.Errorf("the checks list's first line reads %q, want it to say %q", first, want)
	}
	if strings.Contains(first, " kN") {
		t.Errorf("the checks list's first line gives the residual in kN: %q", first)
	}
}

// The label beside the deflection scale says the automatic scale the
// drawing uses after a zoom: zoomed out three steps on the demo, the
// drawing read "deflection × 500" and the label still "×200.0 (auto)".
func TestAutoDeflectionScaleFollowsTheZoom(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	finished(t, w, q)
	w.draw.Refresh()
	first := w.draw.scene.Magnification
	for range 6 {
		w.zoomCentre(1 / zoomStep)
	}
	now := w.draw.scene.Magnification
	if now == first {
		t.Fatalf("six zoom steps out left the automatic deflection scale at %g: the test needs it to change", now)
	}
	if got, want := w.ui.magnifyText.Text, fmt.Sprintf("×%s (auto)", units.FormatNumber(now)); got != want {
		t.Errorf("after zooming out the drawing magnifies the deflection %g times and the label reads %q, want %q", now, got, want)
	}
}
