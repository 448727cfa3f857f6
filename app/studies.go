package app

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"path/filepath"
	"reflect"
	"strings"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas/report"
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

// background runs a study as a background job and then done on the UI
// goroutine, saying in the status line what runs meanwhile; one study at a
// time. work returns done and the study's error: a study that stopped
// because it was cancelled says so and shows nothing.
func (w *Window) background(what string, work func(ctx context.Context, m fem.Model) (done func(), err error)) {
	if w.study != 0 {
		w.setStatus("a study is still running: wait for its result, or cancel it (Study ▸ Cancel the running study)")
		return
	}
	if len(w.project.Model.Segments) == 0 {
		w.setStatus("%s needs a member: draw one first", what)
		return
	}
	m := w.project.Model.Clone()
	var id int
	id = w.jobs.start(what, func(ctx context.Context) func() {
		done, err := work(ctx, m)
		return func() {
			if w.study == id {
				w.study = 0
			}
			if errors.Is(err, context.Canceled) {
				w.setStatus("%s cancelled", what)
				return
			}
			done()
		}
	})
	w.study = id
	w.setStatus("%s running… (Study ▸ Cancel the running study stops it)", what)
}

// cancelStudy stops the study running in the background.
func (w *Window) cancelStudy() {
	if w.study == 0 || !w.jobs.cancel(w.study) {
		w.setStatus("no study is running")
		return
	}
	w.setStatus("cancelling the study…")
}

// runConvergence solves the model on meshes refined step by step and shows
// the errors against the exact solution with the observed rates.
func (w *Window) runConvergence() {
	u := w.units // the messages' units, read here on the window's goroutine
	w.background("convergence study", func(ctx context.Context, m fem.Model) (func(), error) {
		t, err := study.Convergence(ctx, &m, convergencePerStretch, u)
		return func() {
			if err != nil {
				w.showError(err)
				w.setStatus("convergence study: %v", err)
				return
			}
			w.convergence = &convergenceStudy{model: m, table: t}
			w.setMainMenu() // enables the chart export
			w.setStatus("convergence study done: %d meshes", len(t.Rows))
			w.showConvergence()
		}, err
	})
}

// writeConvergenceChart writes the chart of the last study as PNG.
func (w *Window) writeConvergenceChart(f io.Writer) error {
	if w.convergence == nil {
		return fmt.Errorf("no convergence study yet: run Study ▸ Convergence study first")
	}
	return report.WriteConvergenceChart(f, "png", w.convergence.table)
}

// convergenceText is the study as the command line prints it.
func (w *Window) convergenceText() string {
	var b strings.Builder
	name := "the member"
	if w.path != "" {
		name = filepath.Base(w.path)
	}
	report.WriteConvergenceText(&b, name, w.convergence.table, nil, nil, nil)
	return strings.TrimSuffix(b.String(), "\n")
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
	// The caution closes the text, on a line wider than the pane, and ran
	// out of sight under the chart: it goes under the pane, wrapped.
	table.SetText(strings.TrimSuffix(w.convergenceText(), "\n\nCaution: "+fem.Caution))
	caution := wrapped("Caution: " + fem.Caution)
	caution.Importance = widget.WarningImportance
	// The table scrolls in its pane: its lines, wider than the room the
	// chart leaves, ran on under the chart.
	var left fyne.CanvasObject = container.NewScroll(table)
	if !reflect.DeepEqual(c.model, w.project.Model) {
		left = container.NewBorder(nil, wrapped("The model has changed since this study: run it again to see the current one."), nil, nil, left)
	}
	var right fyne.CanvasObject
	var chart bytes.Buffer
	if err := report.WriteConvergenceChart(&chart, "png", c.table); err == nil {
		img := fynecanvas.NewImageFromResource(fyne.NewStaticResource("convergence.png", chart.Bytes()))
		img.FillMode = fynecanvas.ImageFillContain
		img.SetMinSize(fyne.NewSize(500, 344))
		right = img
	} else {
		right = wrapped("No chart: " + err.Error())
	}
	content := container.NewBorder(
		wrapped("Relative errors against the exact solution on meshes with 1, 2, 4, … elements between key points."),
		caution, nil, right, left)
	d, _ := w.newDialog("Convergence study", content, choice{label: "Close"})
	d.Resize(fyne.NewSize(1160, 520))
	w.showDialog(d)
}

// runAdaptive asks for a target error, refines the mesh where the estimated
// error is largest, compares with uniform refinement, and then solves on the
// refined mesh until the model changes.
func (w *Window) runAdaptive() {
	target := newEscEntry()
	target.SetText("1 %")
	form := w.showForm("Adaptive refinement", "Refine",
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
		})
	form.Resize(fyne.NewSize(460, 180))
}

// startAdaptive refines towards target in the background.
func (w *Window) startAdaptive(target float64) {
	u := w.units // the messages' units, read here on the window's goroutine
	w.background("adaptive refinement", func(ctx context.Context, m fem.Model) (func(), error) {
		v, err := study.AgainstUniform(ctx, &m, target, adaptMaxElements, adaptMaxUniform, u)
		return func() { w.adaptiveDone(m, target, v, err) }, err
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
		w.showError(err)
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
	d, _ := w.newDialog("Adaptive refinement", container.NewScroll(grid), choice{label: "Close"})
	// As wide as the table's widest line, as far as the window allows:
	// at 760 px the comparison with uniform refinement ran out of sight.
	d.Resize(fyne.NewSize(min(grid.MinSize().Width+dialogPadWidth+theme.InnerPadding(), w.win.Canvas().Size().Width), 480))
	w.showDialog(d)
}

// adaptiveText tabulates the iterations and the comparison with uniform
// refinement, as the command line prints them, under the target.
func adaptiveText(target float64, v study.Versus, err error) string {
	var b strings.Builder
	fmt.Fprintf(&b, "Target: estimated relative energy-norm error ≤ %.3g %%\n\n", 100*target)
	report.WriteAdaptiveText(&b, v, err)
	b.WriteString("\nEffectivity = estimated / true error: near 1 means the estimate can be trusted\n" +
		"where no exact solution exists (recovery estimate after Zienkiewicz & Zhu).\n")
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
