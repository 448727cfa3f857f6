package app

import (
	"bytes"
	"fmt"
	"math"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/material"
	"stave/fem/units"
)

// TestConvergenceStudy runs the study from the window: the table shows
// every mesh with the fitted rates, and the chart can be exported.
func TestConvergenceStudy(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	var chart bytes.Buffer
	if err := w.writeConvergenceChart(&chart); err == nil {
		t.Error("a chart was written before any study ran")
	}
	w.runConvergence()
	q.waitFor(t, "the convergence study", func() bool { return w.convergence != nil })
	rows := w.convergence.table.Rows
	if len(rows) < 3 || rows[len(rows)-1].Elements <= rows[0].Elements {
		t.Fatalf("convergence table %+v: want at least three meshes, growing", rows)
	}
	text := w.convergenceText()
	for _, r := range rows {
		if !strings.Contains(text, fmt.Sprintf("%.3e", r.L2)) {
			t.Errorf("the convergence text lacks the L2 error %.3e of %d elements:\n%s", r.L2, r.Elements, text)
		}
	}
	for _, want := range []string{"Rates: stress", "last step", "Hermite beams 4 and 2", "Caution"} {
		if !strings.Contains(text, want) {
			t.Errorf("the convergence text lacks %q:\n%s", want, text)
		}
	}
	// The dialog shows the caution whole, wrapped under the table, whose
	// lines run past its pane: there it was cut at "must revi".
	var whole bool
	_, _, _, labels := dialogWidgets(t, w)
	for _, l := range labels {
		whole = whole || strings.Contains(l.Text, fem.Caution) && l.Wrapping == fyne.TextWrapWord && l.Visible()
	}
	if !whole {
		t.Error("the convergence study's dialog shows no wrapped caution")
	}
	if err := w.writeConvergenceChart(&chart); err != nil || !bytes.HasPrefix(chart.Bytes(), []byte("\x89PNG")) {
		t.Errorf("convergence chart: %v, starts %q", err, chart.Bytes()[:min(chart.Len(), 4)])
	}
}

// TestAdaptiveMeshUntilEdit: after adaptive refinement the window solves on
// the refined nodes; the next edit goes back to the uniform mesh and says so.
func TestAdaptiveMeshUntilEdit(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	w.startAdaptive(0.02)
	q.waitFor(t, "the adaptive refinement", func() bool { return w.adaptNodes != nil })
	s := solved(t, w, q)
	if len(s.Mesh.X) != len(w.adaptNodes) {
		t.Fatalf("solution has %d nodes, the adaptive mesh %d", len(s.Mesh.X), len(w.adaptNodes))
	}
	if got := w.ui.elementsUsed.Text; !strings.Contains(got, "adaptive") {
		t.Errorf("element count reads %q, want it to say the mesh is adaptive", got)
	}
	w.apply("move the load", func(m *fem.Model) error { m.PointLoads[0].X += 0.1; return nil })
	if w.adaptNodes != nil {
		t.Fatal("an edit kept the adaptive mesh")
	}
	if !strings.Contains(w.status.Text, "uniform") {
		t.Errorf("status after the edit: %q; want it to say the mesh is uniform again", w.status.Text)
	}
	s = solved(t, w, q)
	if want := w.Model().Mesh.Elements; len(s.Mesh.Elements) < want {
		t.Errorf("after the edit %d elements were solved, want at least the %d requested", len(s.Mesh.Elements), want)
	}
}

// dialogWidgets lists the widgets of the topmost dialog.
func dialogWidgets(t *testing.T, w *Window) (selects []*widget.Select, entries []*widget.Entry, buttons []*widget.Button, labels []*widget.Label) {
	t.Helper()
	top := w.win.Canvas().Overlays().Top()
	if top == nil {
		t.Fatal("no dialog is showing")
	}
	for _, o := range test.LaidOutObjects(top) {
		switch v := o.(type) {
		case *widget.Select:
			selects = append(selects, v)
		case *escSelect:
			selects = append(selects, &v.Select)
		case *widget.Entry:
			entries = append(entries, v)
		case *escEntry:
			entries = append(entries, &v.Entry)
		case *widget.Label:
			labels = append(labels, v)
		default:
			if b := buttonIn(o); b != nil {
				buttons = append(buttons, b)
			}
		}
	}
	return
}

func buttonNamed(t *testing.T, buttons []*widget.Button, prefix string) *widget.Button {
	t.Helper()
	for _, b := range buttons {
		if strings.HasPrefix(b.Text, prefix) {
			return b
		}
	}
	t.Fatalf("no button %q in the dialog", prefix)
	return nil
}

// TestSectionCalculatorFills types a rectangle's dimensions with units and
// fills the segment: A = b·h and I = b·h³/12 (Gere & Goodno, Mechanics of
// Materials, appendix of plane areas; from memory), c = h/2.
func TestSectionCalculatorFills(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.showSectionCalculator()
	selects, entries, buttons, _ := dialogWidgets(t, w)
	if len(selects) != 2 || len(entries) != 2 {
		t.Fatalf("section calculator shows %d choices and %d entries, want 2 and 2 (segment, shape; b, h)", len(selects), len(entries))
	}
	entries[0].SetText("100 mm")
	entries[1].SetText("0.3 m")
	test.Tap(buttonNamed(t, buttons, "Fill"))
	got := w.Model().Segments[0].Section
	b, h := 0.1, 0.3
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"A", got.Area, b * h}, {"I", got.SecondMoment, b * h * h * h / 12}, {"c", got.FibreDistance, h / 2},
	} {
		if math.Abs(c.got-c.want) > 1e-12*c.want {
			t.Errorf("%s = %g, want %g", c.name, c.got, c.want)
		}
	}
}

// TestMaterialsPickerFills fills a segment from the first typical material
// with the caution in view.
func TestMaterialsPickerFills(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	w.win.Resize(fyne.NewSize(1280, 800))
	w.showMaterials()
	_, _, buttons, labels := dialogWidgets(t, w)
	cautioned := false
	for _, l := range labels {
		cautioned = cautioned || l.Text == material.Caution
	}
	if !cautioned {
		t.Error("the materials dialog does not show the caution about typical values")
	}
	test.Tap(buttonNamed(t, buttons, "Fill"))
	if got, want := w.Model().Segments[0].Material, material.Typical()[0].Material; got != want {
		t.Errorf("segment 1 material %+v, want %+v", got, want)
	}
}

// The Check limits dialog offers the typical span/n values of
// check.DeflectionLimits; picking one fills the limit, which Apply then uses.
func TestCheckLimitsOfferTypicalValues(t *testing.T) {
	v := demoProject(t).View
	f := newCheckLimitsForm(v)
	if got, want := len(f.typical.Options), len(check.DeflectionLimits()); got != want || want == 0 {
		t.Fatalf("%d typical limits offered, want %d", got, want)
	}
	for i, l := range check.DeflectionLimits() {
		f.typical.SetSelected(f.typical.Options[i])
		if got, want := f.ratio.Text, units.FormatNumber(l.Ratio); got != want {
			t.Errorf("picking %q set the limit to %q, want %q", f.typical.Options[i], got, want)
		}
	}
	if f.factor.Text != units.FormatNumber(v.SafetyFactor) {
		t.Errorf("safety factor field %q, want the project's %g", f.factor.Text, v.SafetyFactor)
	}
}

// The tables of the studies draw within their panes, on a laptop's screen
// and a small one: the convergence table ran on under its chart, which hid
// its last columns and the ends of its lines, and the adaptive
// refinement's widest line ended behind its pane's edge.
func TestStudyTablesDrawInTheirPanes(t *testing.T) {
	for _, size := range []fyne.Size{smallLaptop, laptop} {
		w, q := openTestdata(t, "demo.json", size)
		solved(t, w, q)
		w.runConvergence()
		q.waitFor(t, "the convergence study", func() bool { return w.convergence != nil })
		textGridsFit(t, w, fmt.Sprintf("convergence study at %.0f px", size.Width), false)
		w.win.Canvas().Overlays().Remove(w.win.Canvas().Overlays().Top())
		w.startAdaptive(0.01)
		q.waitFor(t, "the adaptive refinement", func() bool { return w.adaptNodes != nil })
		textGridsFit(t, w, fmt.Sprintf("adaptive refinement at %.0f px", size.Width), size == laptop)
	}
}

// textGridsFit checks that each text grid of the dialog on top of w is
// laid out at least at its own size, so it draws within its bounds, in a
// pane that scrolls when it is smaller; with whole, the pane shows its
// every column.
func textGridsFit(t *testing.T, w *Window, what string, whole bool) {
	t.Helper()
	top := w.win.Canvas().Overlays().Top()
	if top == nil {
		t.Fatalf("%s: no dialog showing", what)
	}
	scrolls := map[fyne.CanvasObject]*container.Scroll{}
	grids := 0
	for _, o := range test.LaidOutObjects(top) {
		if s, ok := o.(*container.Scroll); ok {
			for _, in := range test.LaidOutObjects(s.Content) {
				scrolls[in] = s
			}
		}
		g, ok := o.(*widget.TextGrid)
		if !ok {
			continue
		}
		grids++
		if need := g.MinSize().Width; g.Size().Width < need-0.5 {
			t.Errorf("%s: the table is laid out %.0f px wide and draws %.0f, over what is beside it", what, g.Size().Width, need)
		}
		s := scrolls[g]
		if s == nil {
			t.Errorf("%s: the table is in no scrolling pane", what)
			continue
		}
		if whole && s.Size().Width < g.MinSize().Width-0.5 {
			t.Errorf("%s: the pane shows %.0f px of the table's %.0f", what, s.Size().Width, g.MinSize().Width)
		}
	}
	if grids == 0 {
		t.Errorf("%s: no table in the dialog", what)
	}
}
