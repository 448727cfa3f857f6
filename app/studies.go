package app

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"reflect"
	"strings"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/study"
)

// Limits of the studies run from the window: enough to see the rates
// settle, small enough to finish in well under a second.
const (
	convergencePerStretch = 64     // finest mesh of a convergence study, elements per stretch
	adaptMaxElements      = 20000  // largest adaptive mesh
	adaptMaxUniform       = 400000 // largest uniform mesh searched for the same error
)

// convergenceStudy is a finished convergence study and the model it was made for.
type convergenceStudy struct {
	model fem.Model
	table study.Table
}

// background runs work off the UI goroutine and then done on it, saying in
// the status line what runs meanwhile; one study at a time.
func (w *Window) background(what string, work func(m fem.Model) func()) {
	if w.studying {
		w.setStatus("a study is still running: wait for its result")
		return
	}
	if len(w.project.Model.Segments) == 0 {
		w.setStatus("%s needs a member: draw one first", what)
		return
	}
	w.studying = true
	w.setStatus("%s running…", what)
	m := w.project.Model.Clone()
	go func() {
		done := work(m)
		w.post(func() {
			w.studying = false
			done()
		})
	}()
}

// runConvergence solves the model on meshes refined step by step and shows
// the errors against the exact solution with the observed rates.
func (w *Window) runConvergence() {
	w.background("convergence study", func(m fem.Model) func() {
		t, err := study.Convergence(&m, convergencePerStretch)
		return func() {
			if err != nil {
				dialog.ShowError(err, w.win)
				w.setStatus("convergence study: %v", err)
				return
			}
			w.convergence = &convergenceStudy{model: m, table: t}
			w.win.SetMainMenu(w.mainMenu()) // enables the chart export
			w.setStatus("convergence study done: %d meshes", len(t.Rows))
			w.showConvergence()
		}
	})
}

// convergenceRows are the study's rows as the chart plots them.
func convergenceRows(t study.Table) []canvas.ConvergenceRow {
	rows := make([]canvas.ConvergenceRow, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = canvas.ConvergenceRow{Elements: r.Elements,
			Errors: fem.ErrorNorms{MaxStressRelative: r.MaxStress, RelativeL2: r.L2, RelativeEnergy: r.Energy}}
	}
	return rows
}

// writeConvergenceChart writes the chart of the last study as PNG.
func (w *Window) writeConvergenceChart(f io.Writer) error {
	if w.convergence == nil {
		return fmt.Errorf("no convergence study yet: run Study ▸ Convergence study first")
	}
	return canvas.WriteConvergenceChart(f, "png", convergenceRows(w.convergence.table))
}

// percent writes a relative error, "exact" at round-off.
func percent(v float64) string {
	if v < 1e-10 {
		return "exact"
	}
	return fmt.Sprintf("%.3g %%", 100*v)
}

// rateText writes an observed rate, a dash where there is none.
func rateText(v float64) string {
	if math.IsNaN(v) {
		return "—"
	}
	return fmt.Sprintf("%.2f", v)
}

// convergenceTable is the study as a fixed-width table.
func convergenceTable(t study.Table) string {
	var b strings.Builder
	row := func(cols ...string) {
		fmt.Fprintf(&b, "%8s %11s %11s %11s %7s %7s %7s\n", cols[0], cols[1], cols[2], cols[3], cols[4], cols[5], cols[6])
	}
	row("elements", "max stress", "L2", "energy", "rate σ", "rate L2", "rate E")
	for _, r := range t.Rows {
		row(fmt.Sprint(r.Elements), percent(r.MaxStress), percent(r.L2), percent(r.Energy),
			rateText(r.StressRate), rateText(r.L2Rate), rateText(r.EnergyRate))
	}
	return strings.TrimSuffix(b.String(), "\n")
}

// convergenceNotes gives the fitted rates beside those theory predicts.
func convergenceNotes(c *convergenceStudy) string {
	t := c.table
	bar := "linear bars 1 and 2"
	if c.model.Mesh.BarOrder == fem.QuadraticBar {
		bar = "quadratic bars 2 and 3"
	}
	return fmt.Sprintf("Fitted rates (error ∝ h^rate, h the element length): stress %s, L2 %s, energy %s.\n\n"+
		"Theory for smooth solutions (Strang & Fix; Hughes; from memory), energy and stress, then L2: "+
		"cubic beams 2 and 4, %s. A member loaded both ways converges at the slower rate.\n\n"+
		"\"exact\" means at round-off: one-dimensional elements are often exact at the nodes, and a rate needs two errors above round-off.",
		rateText(t.StressRate), rateText(t.L2Rate), rateText(t.EnergyRate), bar)
}

// showConvergence shows the last convergence study: table, rates and chart.
func (w *Window) showConvergence() {
	c := w.convergence
	wrapped := func(s string) *widget.Label {
		l := widget.NewLabel(s)
		l.Wrapping = fyne.TextWrapWord
		return l
	}
	table := widget.NewTextGrid()
	table.SetText(convergenceTable(c.table))
	left := container.NewVBox(table, wrapped(convergenceNotes(c)))
	if !reflect.DeepEqual(c.model, w.project.Model) {
		left.Add(wrapped("The model has changed since this study: run it again to see the current one."))
	}
	var right fyne.CanvasObject
	var chart bytes.Buffer
	if err := canvas.WriteConvergenceChart(&chart, "png", convergenceRows(c.table)); err == nil {
		img := fynecanvas.NewImageFromResource(fyne.NewStaticResource("convergence.png", chart.Bytes()))
		img.FillMode = fynecanvas.ImageFillContain
		img.SetMinSize(fyne.NewSize(500, 344))
		right = img
	} else {
		right = wrapped("No chart: " + err.Error())
	}
	content := container.NewBorder(
		wrapped("Relative errors against the exact solution on meshes with 1, 2, 4, … elements between key points."),
		nil, nil, right, left)
	d := dialog.NewCustom("Convergence study", "Close", content, w.win)
	d.Resize(fyne.NewSize(1160, 520))
	d.Show()
}

// runAdaptive asks for a target error, refines the mesh where the estimated
// error is largest, compares with uniform refinement, and then solves on the
// refined mesh until the model changes.
func (w *Window) runAdaptive() {
	target := widget.NewEntry()
	target.SetText("1 %")
	form := dialog.NewForm("Adaptive refinement", "Refine", "Cancel",
		[]*widget.FormItem{widget.NewFormItem("Target error (energy norm)", target)},
		func(ok bool) {
			if !ok {
				return
			}
			t, err := parseFraction(target.Text)
			if err != nil {
				w.setStatus("adaptive refinement: %v", err)
				return
			}
			w.startAdaptive(t)
		}, w.win)
	form.Resize(fyne.NewSize(460, 180))
	form.Show()
}

// startAdaptive refines towards target in the background.
func (w *Window) startAdaptive(target float64) {
	w.background("adaptive refinement", func(m fem.Model) func() {
		v, err := study.AgainstUniform(&m, target, adaptMaxElements, adaptMaxUniform)
		return func() { w.adaptiveDone(m, target, v, err) }
	})
}

// parseFraction reads "1 %", "0.5%" or "0.01" as a fraction between 0 and 1.
func parseFraction(text string) (float64, error) {
	t := strings.TrimSpace(text)
	scale := 1.0
	if strings.HasSuffix(t, "%") {
		t, scale = strings.TrimSpace(strings.TrimSuffix(t, "%")), 0.01
	}
	var v float64
	if _, err := fmt.Sscanf(t, "%g", &v); err != nil || !(v*scale > 0) || v*scale >= 1 {
		return 0, fmt.Errorf("type a target error between 0 and 100 %%, such as 1 %% or 0.01; got %q", text)
	}
	return v * scale, nil
}

// adaptiveDone shows the refinement history and puts the refined mesh on
// the drawing, if the model is still the one refined.
func (w *Window) adaptiveDone(m fem.Model, target float64, v study.Versus, err error) {
	if err != nil && len(v.Adaptive.Iterations) == 0 {
		dialog.ShowError(err, w.win)
		w.setStatus("adaptive refinement: %v", err)
		return
	}
	text := adaptiveText(target, v, err)
	current := reflect.DeepEqual(m, w.project.Model)
	if current {
		w.adaptNodes = v.Adaptive.Nodes
		w.project.View.Overlays.Nodes = true
		w.ui.showLayers()
		w.resubmit()
		w.setStatus("solving on the adaptive mesh of %d elements; any edit of the model goes back to uniform meshing", len(v.Adaptive.Nodes)-1)
		w.ui.showMesh()
	} else {
		text += "\n\nThe model changed while the mesh was refined: the drawing keeps the uniform mesh."
	}
	grid := widget.NewTextGrid()
	grid.SetText(text)
	d := dialog.NewCustom("Adaptive refinement", "Close", container.NewScroll(grid), w.win)
	d.Resize(fyne.NewSize(760, 480))
	d.Show()
}

// adaptiveText tabulates the iterations and the comparison with uniform refinement.
func adaptiveText(target float64, v study.Versus, err error) string {
	var b strings.Builder
	fmt.Fprintf(&b, "Target: estimated relative energy-norm error ≤ %s\n\n", percent(target))
	fmt.Fprintf(&b, "%9s %14s %14s %12s\n", "elements", "estimated", "true", "effectivity")
	for _, it := range v.Adaptive.Iterations {
		fmt.Fprintf(&b, "%9d %14s %14s %12s\n", it.Elements, percent(it.Estimated), percent(it.True), rateText(it.Effectivity))
	}
	last := v.Adaptive.Iterations[len(v.Adaptive.Iterations)-1]
	if !v.Adaptive.Reached {
		fmt.Fprintf(&b, "\nThe target was not reached within %d elements.\n", adaptMaxElements)
	}
	b.WriteString("\nEffectivity = estimated / true error: near 1 means the estimate can be trusted\n" +
		"where no exact solution exists (recovery estimate after Zienkiewicz & Zhu).\n")
	switch {
	case err != nil:
		fmt.Fprintf(&b, "\nUniform comparison: %v\n", err)
	case v.UniformElements > 0:
		fmt.Fprintf(&b, "\nA uniform mesh needs %d elements to reach the same true error (%s); the adaptive mesh has %d.\n",
			v.UniformElements, percent(v.UniformTrue), last.Elements)
	}
	return b.String()
}

// uniformMesh leaves the adaptive mesh for the uniform one.
func (w *Window) uniformMesh() {
	if w.adaptNodes == nil {
		w.setStatus("the mesh is already uniform")
		return
	}
	w.adaptNodes = nil
	w.resubmit()
	w.ui.showMesh()
	w.setStatus("back to %d uniform elements", w.project.Model.Mesh.Elements)
}
