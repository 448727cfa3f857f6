// Package report writes every product Stave makes without a window, from
// one analysis (package fem/analysis) of a project: the drawing as PNG, SVG
// or PDF, the one-page calculation sheet, the results table (CSV), and the
// text and JSON of the solve and converge commands. The window's File ▸
// Export and the command line write through it, so they cannot drift apart.
// It imports no GUI toolkit.
package report

import (
	"context"
	"fmt"
	"io"
	"strings"

	"stave/canvas"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/fem/units"
	"stave/storage"
)

// Version is the Stave release named on calculation sheets and in the
// solve text; the binary sets it at start-up.
var Version = "dev"

// Product is one thing Export writes.
type Product struct {
	Name  string // as Write takes it: "png", "sheet-pdf", ...
	Ext   string // the file extension it is written to
	Title string // what it is, for a menu: "drawing as PNG"
}

// Products are the products of Write, in menu order.
var Products = []Product{
	{"png", "png", "drawing as PNG"},
	{"svg", "svg", "drawing as SVG"},
	{"pdf", "pdf", "drawing as PDF"},
	{"sheet-pdf", "pdf", "calculation sheet as PDF"},
	{"sheet-png", "png", "calculation sheet as PNG"},
	{"csv", "csv", "results table (CSV)"},
	{"multiples-png", "png", "small multiples, 1 to 8 elements per stretch, as PNG"},
	{"multiples-pdf", "pdf", "small multiples, 1 to 8 elements per stretch, as PDF"},
}

// ProductExt returns the file extension of the product name, or false for
// an unknown one.
func ProductExt(name string) (string, bool) {
	for _, p := range Products {
		if p.Name == name {
			return p.Ext, true
		}
	}
	return "", false
}

func productList() string {
	names := make([]string, len(Products))
	for i, p := range Products {
		names[i] = p.Name
	}
	return strings.Join(names, ", ")
}

// Options shape a drawing. Zero fields take the defaults.
type Options struct {
	// Width and Height of a drawing, in points (1/72 inch) as in the PDF and
	// SVG files; default 1200 × 800.
	Width, Height float32
	// DPI is the pixel density of a PNG drawing: it has Width·DPI/72 ×
	// Height·DPI/72 pixels, so the default 96 (a common screen density)
	// gives 1600 × 1067 pixels for the default size. Calculation sheets keep
	// their own A4 layout and density (canvas.WriteSheet).
	DPI float64
	// CSVPoints is the number of intervals each element is sampled in by
	// the results table: CSVPoints+1 rows per element, both ends included;
	// 0 for canvas.DefaultCSVPoints of the mesh.
	CSVPoints int
	// Units is the unit system of every product; the zero System for the
	// project's display units (Export) or the source's (Write).
	Units units.System
	// Show is what to show of a model with load cases (Export).
	Show analysis.Show
}

// Defaults of Options and of the results table.
const (
	defaultWidth  = 1200
	defaultHeight = 800
	defaultDPI    = 96
)

func (o Options) withDefaults() (Options, error) {
	if err := CheckSize(float64(o.Width), float64(o.Height), o.DPI); err != nil {
		return o, err
	}
	if o.CSVPoints < 0 || o.CSVPoints > canvas.CSVMaxPoints {
		return o, fmt.Errorf("%d points per element for the results table: give 1 to %d (or 0 for the default)", o.CSVPoints, canvas.CSVMaxPoints)
	}
	if o.Width == 0 {
		o.Width = defaultWidth
	}
	if o.Height == 0 {
		o.Height = defaultHeight
	}
	if o.DPI == 0 {
		o.DPI = defaultDPI
	}
	return o, nil
}

// MaxSide is the longest side a drawing may have, in points; a PNG's sides
// come to at most as many pixels (canvas refuses more).
const MaxSide = 20000

// CheckSize refuses a drawing's width or height (points) or a PNG's density
// (dpi) that no drawing can have: not a number, infinite, negative, or a
// side outside 1 to MaxSide points or a density below 1 dpi (a density that
// makes a PNG larger than MaxSide pixels canvas refuses). 0 stands for the
// default. A side of 10⁹ points had the vector drawings sample their
// curves at every point until memory ran out.
func CheckSize(width, height, dpi float64) error {
	for _, side := range []struct {
		name  string
		value float64
	}{{"width", width}, {"height", height}} {
		if side.value != 0 && !(side.value >= 1 && side.value <= MaxSide) {
			return fmt.Errorf("a drawing %s of %g points: give 1 to %d points (or 0 for the default)", side.name, side.value, MaxSide)
		}
	}
	if dpi != 0 && !(dpi >= 1 && dpi <= MaxSide) {
		return fmt.Errorf("a density of %g dpi: give 1 to %d dpi (or 0 for the default 96)", dpi, MaxSide)
	}
	return nil
}

// Source is what every product is made from: a project, an analysis of its
// model (nil before the window has one), the findings of that analysis and
// how the results are shown.
type Source struct {
	Project  *storage.Project
	Analysis *analysis.Analysis
	Findings []analysis.Finding
	Units    units.System
	// Dimensions draws the dimension lines and the scale bar, which the
	// window can switch off; the project's overlays choose everything else.
	Dimensions bool
	// Trains are the project's moving load trains worked out
	// (CasesJSON.WithTrains) when a caller already has them; nil to work
	// them out where they are written.
	Trains []TrainResult
}

// trains are src's trains worked out: Trains, or solveTrains.
func (src Source) trains() []TrainResult {
	if src.Trains != nil {
		return src.Trains
	}
	return solveTrains(src.Project, src.Units)
}

// UnitSystem is the display unit system a project names, SI when it names none.
func UnitSystem(u storage.UnitSystem) units.System {
	if s, ok := units.ByName(string(u)); ok {
		return s
	}
	return units.SI
}

// CheckOptions are the check limits of view v, messages in units u.
func CheckOptions(v storage.View, u units.System) check.Options {
	return check.Options{SpanRatio: v.DeflectionLimit, SafetyFactor: v.SafetyFactor, Units: u}
}

// Request is the analysis of p's model (a copy), on nodes when not nil,
// with the project's check limits, its units for the messages and its
// trains' labels.
func Request(p *storage.Project, nodes []float64) analysis.Request {
	return analysis.Request{Model: p.Model.Clone(), Nodes: nodes, Checks: CheckOptions(p.View, UnitSystem(p.View.Units)), TrainLabels: TrainLabels(p)}
}

// TrainLabels name p's moving load trains, by index (moving.Train.Label).
func TrainLabels(p *storage.Project) []string {
	out := make([]string, len(p.Trains))
	for i := range p.Trains {
		out[i] = p.Trains[i].Label(i)
	}
	return out
}

// NewSource is p with analysis a and its findings, in p's units, with
// dimension lines.
func NewSource(p *storage.Project, a *analysis.Analysis) Source {
	return Source{Project: p, Analysis: a, Findings: a.Findings(), Units: UnitSystem(p.View.Units), Dimensions: true}
}

// Analyse runs the whole analysis of p; the error is ctx's when it was
// cancelled. A model that cannot be solved is no error here: the source
// carries why (Analysis.Err).
func Analyse(ctx context.Context, p *storage.Project) (Source, error) {
	a, err := analysis.Run(ctx, Request(p, nil))
	if err != nil {
		return Source{}, err
	}
	return NewSource(p, &a), nil
}

// Export analyses p (finite elements, exact solution and checks, with the
// project's check limits) and writes one product of it to w (see Write), in
// the project's display units unless opts.Units names others. It returns
// what it wrote from, whose analysis and findings say whether the model was
// solved and whether a check failed.
func Export(ctx context.Context, w io.Writer, p *storage.Project, product string, opts Options) (Source, error) {
	if _, ok := ProductExt(product); !ok {
		return Source{}, fmt.Errorf("cannot export %q: choose one of %s", product, productList())
	}
	r := Request(p, nil)
	r.Show = opts.Show
	if opts.Units.Name != "" {
		r.Checks.Units = opts.Units // the checks' messages too
	}
	a, err := analysis.Run(ctx, r)
	if err != nil {
		return Source{}, err
	}
	src := NewSource(p, &a)
	return src, Write(w, src, product, opts)
}

// shownLine says whose solution the results of a model with cases are (a
// table holds one: the first combination's for the envelope); "" for a
// model without cases.
func shownLine(a *analysis.Analysis) string {
	if a == nil || a.Cases == nil {
		return ""
	}
	m := &a.Model
	shown := a.Cases.Show.Title(m)
	if a.Cases.Show.Kind != analysis.ShowEnvelope {
		return fmt.Sprintf("Shown: %s; the table and the results below are those of %s.", shown, shown)
	}
	return fmt.Sprintf("Shown: %s; the table and the results below are those of %s, the first (the checks take every combination): choose a case or combination to tabulate another.",
		shown, analysis.Show{Kind: analysis.ShowCombination}.Title(m))
}

// TrainsLeftOut heads the moving load trains that a results table or a
// calculation sheet leaves out: they hold the member's own loads alone.
const TrainsLeftOut = "Moving load trains of the file, left out of these results and checks (stave solve and stave influence give each train's worst positions and envelope):"

// trainLines describe the moving load trains of src's project, one line
// each; nil when it has none.
func trainLines(src Source) []string {
	p := src.Project
	if p == nil || len(p.Trains) == 0 {
		return nil
	}
	out := make([]string, len(p.Trains))
	for i := range p.Trains {
		out[i] = describeTrain(&p.Trains[i], p.Trains[i].Label(i), p.Model.Length(), src.Units)
	}
	return out
}

// Input is the drawing of src: the one place where results become a
// canvas.Input, for the window and for every export.
func Input(src Source) canvas.Input {
	p := src.Project
	in := canvas.Input{Model: &p.Model, Overlays: p.View.Overlays, Dimensions: src.Dimensions,
		Magnification: p.View.Magnification, Units: src.Units}
	if a := src.Analysis; a != nil && len(p.Model.Segments) > 0 {
		in.Solution, in.Exact = a.Solution, a.Exact
		in.Problem = a.Problem()
		in.Unreliable = analysis.Unreliable(src.Findings)
		in.Marks = marks(src.Findings)
		in.Envelope = envelopeInput(a)
		if a.Cases != nil {
			in.Showing = a.Cases.Show.Title(&p.Model)
		}
	}
	return in
}

// drawing is Input(src) for a product written from src, whose model holds
// every load in its case: the drawing takes the loads of one case
// (drawnCase), as the window draws those of the case it edits, and names
// them when they are not what is shown.
func drawing(src Source) canvas.Input {
	in := Input(src)
	m := &src.Project.Model
	if len(m.Cases) == 0 {
		return in
	}
	k := drawnCase(src.Analysis)
	lifted := m.CaseLifted(k)
	in.Model = &lifted
	in.LoadsOf = analysis.Show{Kind: analysis.ShowCase, Index: k}.Title(m)
	return in
}

// drawnCase is the load case whose loads a drawing of analysis a draws:
// the case shown, or the first case the combination shown takes (under
// the envelope the first combination's, whose deflection and reactions
// the sketch draws); the first case when a has no cases solved.
func drawnCase(a *analysis.Analysis) int {
	if a == nil || a.Cases == nil {
		return 0
	}
	c := a.Cases
	show := c.Show
	if show.Kind == analysis.ShowEnvelope {
		show = analysis.Show{Kind: analysis.ShowCombination}
	}
	if show.Kind == analysis.ShowCase {
		return show.Index
	}
	if show.Index >= 0 && show.Index < len(c.Combinations) && len(c.Combinations[show.Index].Factors) > 0 {
		return c.Combinations[show.Index].Factors[0].Case
	}
	return 0
}

// meshNote says how far to trust the finite element answer of a: who
// chose the mesh and the accuracy its extremes reach against the exact
// ones; "" without results.
func meshNote(a *analysis.Analysis) string {
	if a == nil || a.Solution == nil {
		return ""
	}
	return analysis.MeshChoice(a.Summary())
}

// warningSentences are the warnings among fs for a one-page sheet, each
// with its code: failures and cautions in full, notes by their name alone.
func warningSentences(fs []analysis.Finding) []string {
	var out []string
	for _, f := range analysis.Warnings(fs) {
		text := f.Sentence()
		if !f.Severity.Flagged() {
			text = f.Status + " — " + f.Name
		}
		out = append(out, fmt.Sprintf("[%s] %s", f.Code, text))
	}
	return out
}

// marks are the drawing's markers for the findings that name a point.
func marks(fs []analysis.Finding) []canvas.Mark {
	var out []canvas.Mark
	for i, f := range fs {
		if f.Marked {
			out = append(out, canvas.Mark{X: f.At, Index: i, Severe: f.Severity == analysis.Fail, Name: f.Status + ": " + f.Name})
		}
	}
	return out
}

// Write writes one product of src to w, in src's units (or opts.Units) and
// with its project's overlays: a drawing ("png", "svg", "pdf"), a calculation sheet
// ("sheet-pdf", "sheet-png") or the results table ("csv"). A model that
// cannot be solved still gives a drawing or sheet, with the problem written
// on it; the results table then cannot be written and Write says why.
func Write(w io.Writer, src Source, product string, opts Options) error {
	opts, err := opts.withDefaults()
	if err != nil {
		return err
	}
	if opts.Units.Name != "" {
		src.Units = opts.Units
	}
	in := drawing(src)
	if len(src.Project.Model.Segments) == 0 {
		return fmt.Errorf("the project has no member to export: draw one first")
	}
	switch product {
	case "png", "svg", "pdf":
		// Without the selection, the mouse position or a highlighted check.
		return canvas.WriteImage(w, product, in, opts.Width, opts.Height, opts.DPI/72, meshNote(src.Analysis))
	case "sheet-pdf", "sheet-png":
		n := src.Project.Notes
		sheet := canvas.SheetInput{
			Input:  in,
			Notes:  canvas.SheetNotes{Project: n.Project, Mark: n.Member, Engineer: n.Engineer, Date: n.Date, Version: Version},
			Checks: warningSentences(src.Findings),
			Cases:  sheetCaseLines(src),
			Trains: trainLines(src),
		}
		sheet.Mesh = meshNote(src.Analysis)
		return canvas.WriteSheet(w, strings.TrimPrefix(product, "sheet-"), sheet)
	case "multiples-png", "multiples-pdf":
		return writeMultiples(context.Background(), w, src, strings.TrimPrefix(product, "multiples-"), opts)
	case "csv":
		if in.Solution == nil {
			return fmt.Errorf("there are no results to tabulate: %s", in.Problem)
		}
		points := opts.CSVPoints
		if points == 0 {
			points = canvas.DefaultCSVPoints(len(in.Solution.Mesh.Elements))
		}
		var results strings.Builder
		if line := shownLine(src.Analysis); line != "" {
			fmt.Fprintln(&results, line)
		}
		if trains := trainLines(src); trains != nil {
			fmt.Fprintln(&results, TrainsLeftOut)
			for _, l := range trains {
				fmt.Fprintln(&results, "  "+l)
			}
		}
		WriteResultsText(&results, src)
		return canvas.WriteCSV(w, in.Solution, in.Exact, src.Units, points, strings.Split(strings.TrimRight(results.String(), "\n"), "\n"))
	}
	return fmt.Errorf("cannot export %q: choose one of %s", product, productList())
}
