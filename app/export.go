package app

import (
	"context"
	"errors"
	"io"
	"strings"

	"fyne.io/fyne/v2"

	"stave/canvas/report"
	"stave/fem/analysis"
)

// exportMenu lists the exports; the convergence chart once a study has run.
func (w *Window) exportMenu() *fyne.Menu {
	m := fyne.NewMenu("")
	for _, p := range report.Products {
		m.Items = append(m.Items, fyne.NewMenuItem("Export "+p.Title+"…", func() { w.export(p.Name) }))
	}
	chart := fyne.NewMenuItem("Export convergence chart (PNG)…", func() {
		w.chooseFile(true, "Export the convergence chart", "PNG file", "png", func(path string) { w.exportTo(path, w.writeConvergenceChart) })
	})
	chart.Disabled = w.convergence == nil
	m.Items = append(m.Items, fyne.NewMenuItemSeparator(), chart)
	return m
}

// exportSource is what an export from the window writes from: a copy of
// the window's project with its complete analysis, the one shown when it is
// current and complete, otherwise one still to run, so an export never
// waits for the background solver nor shows a stale result. Make it on the
// UI goroutine; finish may run on any goroutine.
type exportSource struct {
	src     report.Source
	pending *analysis.Request // the analysis still to run when src has none
}

// exportSource copies the window's project and, when current and complete, its analysis.
func (w *Window) exportSource() exportSource {
	p := w.canonical()
	out := exportSource{src: report.Source{Project: &p, Units: w.units, Dimensions: w.dimensions}}
	if a := w.result; a != nil && a.seq == w.pending && a.Complete {
		out.src.Analysis, out.src.Findings = &a.Analysis, w.checks
	} else {
		r := report.Request(&p, append([]float64(nil), w.adaptNodes...))
		if w.adaptNodes == nil {
			r.Nodes = nil
		}
		r.Show = w.show
		out.pending = &r
	}
	return out
}

// finish runs the analysis of the source if the window had no complete one;
// the error is ctx's when it was cancelled.
func (e exportSource) finish(ctx context.Context) (report.Source, error) {
	if e.src.Analysis != nil {
		return e.src, nil
	}
	a, err := analysis.Run(ctx, *e.pending)
	if err != nil {
		return report.Source{}, err
	}
	e.src.Analysis, e.src.Findings = &a, a.Findings()
	return e.src, nil
}

// export writes one of report.Products to a file the user chooses, in the
// background: solving and drawing a fine mesh takes time.
func (w *Window) export(product string) {
	ext, ok := report.ProductExt(product)
	if !ok {
		w.setStatus("export of %s is not available in this build", product)
		return
	}
	w.chooseFile(true, "Export", strings.ToUpper(ext)+" file", ext, func(path string) { w.startExport(path, product) })
}

// startExport writes product to path as a background job and returns its number.
func (w *Window) startExport(path, product string) int {
	e := w.exportSource()
	w.setStatus("exporting %s…", path)
	return w.jobs.start("export of "+path, func(ctx context.Context) func() {
		err := w.writeExport(ctx, path, e, product)
		return func() { w.exported(path, err) }
	})
}

// writeExport finishes e and writes product to path; a cancelled export
// writes no file.
func (w *Window) writeExport(ctx context.Context, path string, e exportSource, product string) error {
	src, err := e.finish(ctx)
	if err != nil {
		return err
	}
	return writeFile(path, func(f io.Writer) error { return report.Write(f, src, product, report.Options{}) })
}

// exportTo writes a file with write and reports the outcome.
func (w *Window) exportTo(path string, write func(io.Writer) error) {
	w.exported(path, writeFile(path, write))
}

// exported reports the outcome of an export.
func (w *Window) exported(path string, err error) {
	switch {
	case errors.Is(err, context.Canceled):
		w.setStatus("export of %s cancelled: no file written", path)
	case err != nil:
		w.showError(err)
	default:
		w.setStatus("exported %s", path)
	}
}
