package app

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem/check"
	"stave/fem/units"
	"stave/storage"
)

// ExportOptions shape an export. Zero fields take the defaults.
type ExportOptions struct {
	// Width and Height of a drawing, in points (1/72 inch) as in the PDF and
	// SVG files; default 1200 × 800.
	Width, Height float32
	// DPI is the pixel density of a PNG drawing: it has Width·DPI/72 ×
	// Height·DPI/72 pixels, so the default 96 (a common screen density)
	// gives 1600 × 1067 pixels for the default size. Calculation sheets keep
	// their own A4 layout and density (canvas.WriteSheet).
	DPI float64
}

// Export defaults.
const (
	defaultExportWidth  = 1200
	defaultExportHeight = 800
	defaultExportDPI    = 96
	// csvPointsPerElement is how many intervals of each element the results table samples.
	csvPointsPerElement = 4
)

// exportKinds are the products of Export and of the window's File ▸ Export,
// with the file extension each is written to.
var exportKinds = []struct{ kind, ext, menu string }{
	{"png", "png", "Export drawing as PNG…"},
	{"svg", "svg", "Export drawing as SVG…"},
	{"pdf", "pdf", "Export drawing as PDF…"},
	{"sheet-pdf", "pdf", "Export calculation sheet as PDF…"},
	{"sheet-png", "png", "Export calculation sheet as PNG…"},
	{"csv", "csv", "Export results table (CSV)…"},
}

// exportExt returns the file extension of kind, or false for an unknown kind.
func exportExt(kind string) (string, bool) {
	for _, k := range exportKinds {
		if k.kind == kind {
			return k.ext, true
		}
	}
	return "", false
}

// Export solves p (finite elements, exact solution and checks, with the
// project's check limits) and writes one product of it to w: a drawing
// ("png", "svg", "pdf"), a calculation sheet ("sheet-pdf", "sheet-png") or
// the results table ("csv"), in the project's units and with its overlays.
// A model that cannot be solved still gives a drawing or sheet, with the
// problem written on it, and Export returns nil; the results table then
// cannot be written and Export returns why. The window's File ▸ Export
// writes through the same code.
func Export(w io.Writer, p *storage.Project, kind string, opts ExportOptions) error {
	if _, ok := exportExt(kind); !ok {
		return fmt.Errorf("cannot export %q: choose one of %s", kind, exportKindList())
	}
	u := unitSystem(p.View.Units)
	a := analyse(request{model: p.Model.Clone(), opts: checkOptionsFor(p.View, u)})
	return writeExport(w, exportSource{project: p, analysis: &a, rows: checkRows(&a), dimensions: true, units: u}, kind, opts)
}

func exportKindList() string {
	names := make([]string, len(exportKinds))
	for i, k := range exportKinds {
		names[i] = k.kind
	}
	return strings.Join(names, ", ")
}

// exportSource is what every export draws from: a project, a complete
// analysis of its model, the check rows of that analysis, and how the
// results are shown.
type exportSource struct {
	project  *storage.Project
	analysis *analysis
	pending  *request // the analysis still to run when analysis is nil (see finish)
	rows     []checkRow
	// dimensions draws the dimension lines (see Window.dimensions).
	dimensions bool
	units      units.System
}

// resultInput is the drawing of project p with analysis a (nil before the
// first result) and its check rows: the one place where results become a
// canvas.Input, for the window and for exports.
func resultInput(p *storage.Project, a *analysis, rows []checkRow, dimensions bool, u units.System) canvas.Input {
	in := canvas.Input{Model: &p.Model, Overlays: p.View.Overlays, Dimensions: dimensions, Magnification: p.View.Magnification, Units: u}
	if a != nil && len(p.Model.Segments) > 0 {
		in.Solution, in.Exact = a.solution, a.exact
		in.Problem = a.problem()
		in.Unreliable = unreliable(rows)
		in.Marks = marks(rows)
	}
	return in
}

// checkOptionsFor are the check limits of view v, messages in units u.
func checkOptionsFor(v storage.View, u units.System) check.Options {
	return check.Options{SpanRatio: v.DeflectionLimit, SafetyFactor: v.SafetyFactor, Units: u}
}

// writeExport writes one product of src to w (see Export).
func writeExport(w io.Writer, src exportSource, kind string, opts ExportOptions) error {
	opts, err := opts.withDefaults()
	if err != nil {
		return err
	}
	in := resultInput(src.project, src.analysis, src.rows, src.dimensions, src.units)
	if len(src.project.Model.Segments) == 0 {
		return fmt.Errorf("the project has no member to export: draw one first")
	}
	switch kind {
	case "png", "svg", "pdf":
		return writeDrawing(w, kind, in, opts)
	case "sheet-pdf", "sheet-png":
		n := src.project.Notes
		return canvas.WriteSheet(w, strings.TrimPrefix(kind, "sheet-"), canvas.SheetInput{
			Input:  in,
			Notes:  canvas.SheetNotes{Project: n.Project, Mark: n.Member, Engineer: n.Engineer, Date: n.Date, Version: Version},
			Checks: flaggedChecks(src.rows),
		})
	case "csv":
		if in.Solution == nil {
			return fmt.Errorf("there are no results to tabulate: %s", src.analysis.problem())
		}
		return canvas.WriteCSV(w, in.Solution, in.Exact, src.units, csvPointsPerElement)
	}
	return fmt.Errorf("cannot export %q: choose one of %s", kind, exportKindList())
}

func (o ExportOptions) withDefaults() (ExportOptions, error) {
	if o.Width < 0 || o.Height < 0 || o.DPI < 0 {
		return o, fmt.Errorf("export size %g × %g points at %g dpi: give positive numbers (or 0 for the defaults)", o.Width, o.Height, o.DPI)
	}
	if o.Width == 0 {
		o.Width = defaultExportWidth
	}
	if o.Height == 0 {
		o.Height = defaultExportHeight
	}
	if o.DPI == 0 {
		o.DPI = defaultExportDPI
	}
	return o, nil
}

// writeDrawing draws in with its overlays fitted to the page, without
// the selection, the mouse position or a highlighted check.
func writeDrawing(w io.Writer, format string, in canvas.Input, opts ExportOptions) error {
	return canvas.WriteImage(w, format, in, opts.Width, opts.Height, opts.DPI/72)
}

// flaggedChecks are the failed and warned rows, one sentence each, the worst first.
func flaggedChecks(rows []checkRow) []string {
	var out []string
	for _, r := range rows {
		if r.importance == widget.DangerImportance || r.importance == widget.WarningImportance {
			out = append(out, r.status+" — "+r.name+": "+r.message)
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return strings.HasPrefix(out[i], "FAIL") && !strings.HasPrefix(out[j], "FAIL") })
	return out
}
