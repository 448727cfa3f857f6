package report

import (
	"bytes"
	"context"
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// The calculation sheet of a model with cases lists what is shown, the
// cases, the combinations with their factors, the envelope's governing
// moments and reactions, and the caution on combined results; a model
// without cases gets none of it.
func TestSheetCaseLines(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	src, err := Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	all := strings.Join(sheetCaseLines(src), "\n")
	for _, want := range []string{"envelope of 3 combinations", "pattern (typical; use the factors your local code gives) = 1 × imposed",
		"at 4.000 m, both", "(pattern (imposed on span 2))", "Stave builds in no code's factors"} {
		if !strings.Contains(all, want) {
			t.Errorf("the sheet's lines lack %q:\n%s", want, all)
		}
	}
	demo, err := storage.Load("../../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	if src, err = Analyse(context.Background(), demo); err != nil || sheetCaseLines(src) != nil {
		t.Errorf("a model without cases: %v, lines %q", err, sheetCaseLines(src))
	}
}

// Exports show a case, a combination or the envelope: each drawing
// differs from the others.
func TestExportShows(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	var outs []string
	for _, s := range []analysis.Show{{Kind: analysis.ShowEnvelope}, {Kind: analysis.ShowCase, Index: 1}, {Kind: analysis.ShowCombination, Index: 2}} {
		var b bytes.Buffer
		if _, err := Export(context.Background(), &b, p, "svg", Options{Show: s}); err != nil {
			t.Fatal(err)
		}
		outs = append(outs, b.String())
	}
	if !strings.Contains(outs[0], "envelope of the combinations") || strings.Contains(outs[1], "envelope of the combinations") {
		t.Error("the envelope's drawing does not say so, or a case's does")
	}
	if outs[1] == outs[2] || outs[0] == outs[1] {
		t.Error("a case, a combination and the envelope draw the same")
	}
}

// The envelope's quantities are of the exact solutions, whatever the mesh:
// two equal spans L = 4 m under w = 10 kN/m on both (the shipped model
// sets a coarse mesh of its own). Textbook closed forms for a two-span
// continuous beam (three-moment equation, derived): shear beside the
// middle support 5wL/8 = 25 kN, moment there −wL²/8 = −20 kN·m; one span
// loaded, the largest span moment R²/(2w) with R = 7wL/16 = 17.5 kN, so
// 15.3125 kN·m at x = R/w = 1.75 m.
func TestEnvelopeIsExact(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	r := casesResults(t, p)
	if r.Envelope.Solution != "exact" {
		t.Errorf("envelope of the %q solution, want exact", r.Envelope.Solution)
	}
	want := map[string][2]float64{ // quantity: largest, smallest
		"shear_force":    {25e3, -25e3},
		"bending_moment": {15312.5, -20e3},
	}
	for _, q := range r.Envelope.Quantities {
		w, ok := want[q.Name]
		if !ok {
			continue
		}
		if math.Abs(q.Max.Value-w[0]) > 1e-9*math.Abs(w[0]) || math.Abs(q.Min.Value-w[1]) > 1e-9*math.Abs(w[1]) {
			t.Errorf("%s: envelope %.10g to %.10g, want %.10g to %.10g", q.Name, q.Min.Value, q.Max.Value, w[1], w[0])
		}
	}
	var text bytes.Buffer
	WriteCasesText(&text, "two_span_cases.json", r, units.SI)
	if !strings.Contains(text.String(), "(exact solution)") {
		t.Errorf("the envelope's heading does not say whose values it holds:\n%s", text.String())
	}
}

// A combination's factors in words, a negative factor subtracted.
func TestFactorsText(t *testing.T) {
	for _, c := range []struct {
		factors []FactorJSON
		want    string
	}{
		{[]FactorJSON{{Case: "permanent", Factor: 1.35}, {Case: "imposed", Factor: 1.5}}, "1.35 × permanent + 1.5 × imposed"},
		{[]FactorJSON{{Case: "permanent", Factor: 1}, {Case: "wind", Factor: -0.5}, {Train: "cart", Factor: 1.5}}, `1 × permanent − 0.5 × wind + 1.5 × train "cart"`},
		{[]FactorJSON{{Case: "uplift", Factor: -1}, {Case: "permanent", Factor: 0}}, "−1 × uplift + 0 × permanent"},
		// A factor of −0 (a file may write "-0") is a plain 0 term, first or later.
		{[]FactorJSON{{Case: "permanent", Factor: 1.35}, {Case: "imposed", Factor: math.Copysign(0, -1)}}, "1.35 × permanent + 0 × imposed"},
		{[]FactorJSON{{Case: "permanent", Factor: math.Copysign(0, -1)}, {Case: "imposed", Factor: 1}}, "0 × permanent + 1 × imposed"},
	} {
		if got := FactorsText(CombinationJSON{Factors: c.factors}); got != c.want {
			t.Errorf("got %q, want %q", got, c.want)
		}
	}
}

// A factor written "-0" in the file, of a case or of a moving load train,
// is 0 in the results document as in the text: "factor": 0, not -0, and
// "+ 0 × imposed", not "− 0 × imposed".
func TestNegativeZeroFactorIsPlainZero(t *testing.T) {
	p, err := storage.Load("../../testdata/three_span_pattern.json")
	if err != nil {
		t.Fatal(err)
	}
	negativeZero := math.Copysign(0, -1)
	p.Model.Combinations[0].Factors[1].Factor = negativeZero
	p.Trains = []moving.Train{{Name: "trolley", Axles: []moving.Axle{{Load: 12e3}}, Step: 0.5}}
	p.Model.Combinations[0].Trains = []fem.TrainFactor{{Train: 0, Factor: negativeZero}}
	r, trains := casesWithTrains(t, p)
	factors := map[string]float64{}
	for _, f := range r.Combinations[0].Factors {
		factors[f.Case+f.Train] = f.Factor
	}
	for _, tr := range TrainsJSON(&p.Model, trains, false) {
		for _, c := range tr.Combinations {
			factors[tr.Train+" in "+c.Combination] = c.Factor
		}
	}
	for _, name := range []string{"imposed", "trolley", "trolley in strength"} {
		if f, ok := factors[name]; !ok || f != 0 || math.Signbit(f) {
			t.Errorf("factor of %s: %g (found %v, sign bit %v), want 0", name, f, ok, math.Signbit(f))
		}
	}
	var text bytes.Buffer
	WriteCasesText(&text, "three_span_pattern.json", r, units.SI)
	if !strings.Contains(text.String(), `1.35 × permanent + 0 × imposed + 0 × train "trolley"`) {
		t.Errorf("the text does not give the factors as a plain 0:\n%s", text.String())
	}
}

// The envelope's extreme where the field jumps says on which side of the
// point it is read, in the document ("side") and the text ("just left of
// 4.000 m"), as support_actions give both sides; elsewhere it says none.
// testdata/three_span_pattern.json, three spans of 4 m under 1.35 × 6
// kN/m and 1.5 × 10 kN/m placed by span: the shear force is most negative
// just left of the support at 4 m with spans 1 and 2 loaded,
// −(1.35·0.6·6 + 1.5·(37/60)·10)·4 = −56.44 kN, its mirror +56.44 kN just
// right of the support at 8 m (continuous-beam coefficients 0.600 and
// 0.617 for three equal spans, three-moment equation; AISC Manual, Beam
// Diagrams and Formulas, from memory). The moment is continuous and says
// no side: over the support at 4 m it is −(0.1·8.1 + (7/60)·15)·4² =
// −40.96 kN·m with spans 1 and 2 loaded, and in the first span R²/(2w) at
// x = R/w with spans 1 and 3 loaded, w = 23.1 kN/m on it, M_B =
// −(0.1·8.1 + 0.05·15)·4² and R = w·4/2 + M_B/4 (the same coefficients).
func TestEnvelopeSaysTheSideOfAJump(t *testing.T) {
	p, err := storage.Load("../../testdata/three_span_pattern.json")
	if err != nil {
		t.Fatal(err)
	}
	r := casesResults(t, p)
	const w, mB = 23.1e3, -(0.1*8.1e3 + 0.05*15e3) * 16
	const rA, v = w*4/2 + mB/4, (1.35*0.6*6e3 + 1.5*37.0/60*10e3) * 4
	want := map[string][2]GoverningJSON{ // quantity: largest, smallest
		"shear_force":    {{Value: v, X: 8, Side: "right"}, {Value: -v, X: 4, Side: "left"}},
		"bending_moment": {{Value: rA * rA / (2 * w), X: rA / w}, {Value: -(0.1*8.1e3 + 7.0/60*15e3) * 16, X: 4}},
	}
	for _, q := range r.Envelope.Quantities {
		w, ok := want[q.Name]
		if !ok {
			continue
		}
		for k, g := range []GoverningJSON{q.Max, q.Min} {
			if math.Abs(g.Value-w[k].Value) > 1e-9*math.Abs(w[k].Value) || math.Abs(g.X-w[k].X) > 1e-9 || g.Side != w[k].Side {
				t.Errorf("%s: %.10g at x = %g m, side %q; want %.10g at %g m, side %q", q.Name, g.Value, g.X, g.Side, w[k].Value, w[k].X, w[k].Side)
			}
		}
	}
	var text bytes.Buffer
	WriteCasesText(&text, "three_span_pattern.json", r, units.SI)
	for _, line := range strings.Split(text.String(), "\n") {
		if strings.HasPrefix(line, "  shear force ") && !(strings.Contains(line, "just right of 8.000 m") && strings.Contains(line, "just left of 4.000 m")) {
			t.Errorf("the text does not say the sides of the shear force's extremes:\n%s", line)
		}
		if strings.HasPrefix(line, "  bending moment ") && strings.Contains(line, "just ") {
			t.Errorf("the text gives a side of the moment, which does not jump:\n%s", line)
		}
	}
	// The drawing's labels of the envelope's extremes say it too.
	var drawing bytes.Buffer
	if _, err := Export(context.Background(), &drawing, p, "svg", Options{Show: analysis.Show{Kind: analysis.ShowEnvelope}}); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"just left of 4.000 m", "just right of 8.000 m"} {
		if !strings.Contains(drawing.String(), want) {
			t.Errorf("the drawing's labels lack %q", want)
		}
	}
}

// loaded_spans has one entry for each case the governing combination
// places by span and that has loads to place, in the order of the file's
// cases, as the checks' words name them: its spans loaded, [] for none
// ("up on no span"). A case placed by span with nothing to place (its
// self-weight, which always acts) got an entry "on no span"; and a case
// loading no span came after those loading some, whatever their order.
// Two spans of 4 m under an uplift "up" of 5 kN/m and a load "down" of
// 10 kN/m, each placed by span, and a self-weight case placed by span:
// the moment over the middle support is most negative with "down" on
// both spans and "up" on none (it lowers it on either); invented loads.
func TestLoadedSpansOfEveryCasePlacedBySpan(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	uniform := func(w float64) []fem.DistributedLoad {
		return []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: w}, {X: 8, Intensity: w}}}}
	}
	m := &p.Model
	m.Gravity = [2]float64{0, -fem.StandardGravity}
	m.Segments[0].Material.Density = 7850
	m.Cases = []fem.LoadCase{
		{Name: "up", DistributedLoad: uniform(5e3), BySpan: true},
		{Name: "down", DistributedLoad: uniform(-10e3), BySpan: true},
		{Name: "weight", SelfWeight: true, BySpan: true},
	}
	m.Combinations = []fem.Combination{{Name: "all", Kind: fem.Strength, Factors: []fem.CaseFactor{{Case: 2, Factor: 1}, {Case: 1, Factor: 1}, {Case: 0, Factor: 1}}}}
	r := casesResults(t, p)
	var got GoverningJSON
	for _, q := range r.Envelope.Quantities {
		if q.Quantity == fem.QBendingMoment {
			got = q.Min
		}
	}
	want := []LoadedSpansJSON{{Case: "up", Spans: []int{}}, {Case: "down", Spans: []int{1, 2}}}
	if !slices.EqualFunc(got.LoadedSpans, want, func(a, b LoadedSpansJSON) bool { return a.Case == b.Case && slices.Equal(a.Spans, b.Spans) }) {
		t.Errorf("smallest moment %g N·m at x = %g m: loaded spans %+v, want %+v", got.Value, got.X, got.LoadedSpans, want)
	}
	if words := got.Arrangement(units.SI); words != "up on no span; down on spans 1, 2" {
		t.Errorf("the arrangement reads %q", words)
	}
}

// A case that takes the segments' temperature differences says so, in the
// document and in the text, where it read like an empty case; and the
// combination takes it with its factor: a beam fixed at both ends, 30 K
// warmer below (α = 12e-6 /K, depth 0.3 m, EI = 2e7 N·m²), has end
// moments ±EI·α·ΔT/h = ±24 kN·m (Roark's, thermal bending of beams, from
// memory), 36 kN·m with the factor 1.5.
func TestCaseTakingTemperatureDifferences(t *testing.T) {
	seg := fem.Segment{Start: 0, End: 5, TemperatureDifference: 30,
		Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15},
		Material: fem.Material{Elastic: 2e11, ThermalExpansion: 12e-6}}
	p := &storage.Project{View: storage.DefaultView(), Model: fem.Model{
		Segments: []fem.Segment{seg},
		Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 5, Kind: fem.Fixed}},
		Cases: []fem.LoadCase{
			{Name: "imposed", PointLoads: []fem.PointLoad{{X: 2.5, Transverse: -1e4}}},
			{Name: "sun", ThermalGradient: true},
		},
		Combinations: []fem.Combination{{Name: "C", Kind: fem.Strength, Factors: []fem.CaseFactor{{Case: 1, Factor: 1.5}}}},
	}}
	r := casesResults(t, p)
	if r.Cases[0].TemperatureDifferences || !r.Cases[1].TemperatureDifferences {
		t.Errorf("cases take temperature differences: %v and %v, want false and true", r.Cases[0].TemperatureDifferences, r.Cases[1].TemperatureDifferences)
	}
	if m := r.Combinations[0].Reactions[0].Moment; m == nil || math.Abs(m.Value-1.5*24e3) > 1e-6 {
		t.Errorf("combination C's moment at x = 0: %+v, want 36 kN·m", m)
	}
	var text bytes.Buffer
	WriteCasesText(&text, "model.json", r, units.SI)
	if !slices.ContainsFunc(strings.Split(text.String(), "\n"), func(l string) bool {
		return strings.HasPrefix(strings.TrimSpace(l), "sun ") && strings.HasSuffix(l, "temperature differences through the depth")
	}) {
		t.Errorf("the text does not say case sun takes the temperature differences:\n%s", text.String())
	}
}

// analysedCases analyses p and returns the analysis and its cases' results.
func analysedCases(t *testing.T, p *storage.Project) (Source, *CasesJSON) {
	t.Helper()
	src, err := Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	r, err := CasesResults(src.Analysis)
	if err != nil {
		t.Fatal(err)
	}
	return src, r
}

// casesWithTrains analyses p and returns its cases' results with its
// trains taken in (CasesJSON.WithTrains), and the trains' results.
func casesWithTrains(t *testing.T, p *storage.Project) (*CasesJSON, []TrainResult) {
	t.Helper()
	src, r := analysedCases(t, p)
	return r, r.WithTrains(src)
}

// casesResults analyses p and returns its cases' results.
func casesResults(t *testing.T, p *storage.Project) *CasesJSON {
	t.Helper()
	_, r := analysedCases(t, p)
	return r
}

// The results table of a model with cases names the case or combination
// its rows hold: the table holds one solution, the first combination's
// for the envelope. Two equal spans L = 4 m under q = 10 kN/m: both spans
// loaded, the end reaction is 3qL/8 = 15 kN; the first span alone,
// 7qL/16 = 17.5 kN (continuous beam tables, AISC Manual "Beam Diagrams and
// Formulas", cases 29 and 30, from memory).
func TestCSVNamesWhatItTabulates(t *testing.T) {
	const q, L = 10.0, 4.0 // kN/m, m
	for _, c := range []struct {
		show, says string
		r1         float64 // kN, the end reaction at x = 0
	}{
		{"", "Shown: envelope of 3 combinations; the table and the results below are those of combination both", 3 * q * L / 8},
		{"first", "Shown: combination first; the table and the results below are those of combination first", 7 * q * L / 16},
		{"first span", "Shown: load case first span; the table and the results below are those of load case first span", 7 * q * L / 16},
	} {
		t.Run(c.show, func(t *testing.T) {
			p, err := storage.Load("../../testdata/two_span_cases.json")
			if err != nil {
				t.Fatal(err)
			}
			var opts Options
			if c.show != "" {
				var ok bool
				if opts.Show, ok = analysis.ShowNamed(&p.Model, c.show); !ok {
					t.Fatalf("no case or combination %q", c.show)
				}
			}
			var out bytes.Buffer
			if _, err := Export(context.Background(), &out, p, "csv", opts); err != nil {
				t.Fatal(err)
			}
			text := out.String()
			if !strings.Contains(text, "\n# "+c.says) {
				t.Errorf("the table does not say %q:\n%s", c.says, text[:min(len(text), 1500)])
			}
			// The shear force just right of x = 0 is the end reaction.
			rows := strings.Split(text, "\n")
			for i, row := range rows {
				if strings.HasPrefix(row, "x [m],") {
					cells := strings.Split(rows[i+1], ",")
					if v, err := strconv.ParseFloat(cells[10], 64); err != nil || !near(v, c.r1, 1e-9) {
						t.Errorf("V exact at x = 0 is %s kN, want %g", cells[10], c.r1)
					}
				}
			}
		})
	}
}

// The drawn envelope takes each combination's cases alone, without the
// moving load trains a combination takes (format.md, combinations): the
// drawing says so, or its extremes read as the combination's. Two spans
// of 4 m: both loaded, −wL²/8 = −20 kN·m over the middle support, drawn as
// the envelope's least while the combination with two 42 kN axles there
// reaches −52.26 kN·m (stave solve).
func TestEnvelopeSaysItLeavesTheTrainsOut(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	plain := envelopeSVG(t, p)
	p.Trains = []moving.Train{{Name: "pair", Axles: []moving.Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}}
	p.Model.Combinations[0].Trains = []fem.TrainFactor{{Train: 0, Factor: 1}}
	with := envelopeSVG(t, p)
	const note = "trains left out"
	if strings.Contains(plain, note) || !strings.Contains(with, note) {
		t.Errorf("the envelope says %q: without trains %v, with a combination taking one %v", note, strings.Contains(plain, note), strings.Contains(with, note))
	}
}

// envelopeSVG is p's envelope drawn as SVG.
func envelopeSVG(t *testing.T, p *storage.Project) string {
	t.Helper()
	var b bytes.Buffer
	if _, err := Export(context.Background(), &b, p, "svg", Options{Show: analysis.Show{Kind: analysis.ShowEnvelope}}); err != nil {
		t.Fatal(err)
	}
	return b.String()
}

// A drawing of a model with load cases draws the loads of one case, as the
// window draws the case it edits (docs/window.md, the drawing): the case
// shown, or for a combination or the envelope the first case the
// (first) combination takes, with the line that says whose loads and
// whose results each are when they differ. The two-span model's first
// span case is set to 7 kN/m here so its label tells it from the 10 kN/m
// of both spans; the labels are the file's intensities, read back.
func TestExportDrawsTheLoadsOfACase(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	for i := range p.Model.Cases[1].DistributedLoad[0].Points {
		p.Model.Cases[1].DistributedLoad[0].Points[i].Intensity = -7e3
	}
	seven, ten := units.SI.Format(units.LineLoad, 7e3), units.SI.Format(units.LineLoad, 10e3)
	for _, c := range []struct {
		name      string
		show      analysis.Show
		load, not string
		whose     string // "" for no line
	}{
		{"case first span", analysis.Show{Kind: analysis.ShowCase, Index: 1}, seven, ten, ""},
		{"combination first", analysis.Show{Kind: analysis.ShowCombination, Index: 1}, seven, ten,
			"loads drawn: load case first span; deflection and reactions: combination first"},
		{"envelope", analysis.Show{Kind: analysis.ShowEnvelope}, ten, seven,
			"loads drawn: load case both spans; deflection and reactions: combination both"},
	} {
		var b bytes.Buffer
		if _, err := Export(context.Background(), &b, p, "svg", Options{Units: units.SI, Show: c.show}); err != nil {
			t.Fatal(err)
		}
		texts := svgTexts(t, b.Bytes())
		all := strings.Join(texts, "\n")
		if !slices.Contains(texts, c.load) || slices.Contains(texts, c.not) {
			t.Errorf("%s: load labels %q present %v, %q present %v; want the first, not the second",
				c.name, c.load, slices.Contains(texts, c.load), c.not, slices.Contains(texts, c.not))
		}
		if has := strings.Contains(all, "loads drawn"); c.whose == "" && has || c.whose != "" && !strings.Contains(all, c.whose) {
			t.Errorf("%s: want the line %q, the drawing says:\n%s", c.name, c.whose, all)
		}
	}
}

// A case that warms the member says by how much as a change of
// temperature, in the display units: -20 °F is a change of -100/9 K (a
// change of 1 °F is 5/9 K, no offset: NIST SP 811, Appendix B), and
// "temperature -20.00 °F" would read as the air's temperature.
func TestCasesTextNamesTheTemperatureChange(t *testing.T) {
	r := &CasesJSON{Cases: []CaseJSON{{Name: "winter", TemperatureChange: -20 * 5.0 / 9}}}
	var text bytes.Buffer
	WriteCasesText(&text, "model.json", r, units.USCustomary)
	if !slices.ContainsFunc(strings.Split(text.String(), "\n"), func(l string) bool {
		return strings.HasPrefix(strings.TrimSpace(l), "winter ") && strings.HasSuffix(l, "temperature change -20.00 °F")
	}) {
		t.Errorf("the text does not give case winter's temperature change as -20.00 °F:\n%s", text.String())
	}
}

// Each case's line in the cases text says what the case holds, its own
// loads counted first ("2 point loads, 1 distributed load"), then what
// else acts in it; a case of loads alone is not left blank.
func TestCasesTextSaysWhatEachCaseHolds(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	m := &p.Model
	m.Gravity = [2]float64{0, -9.80665}
	m.Segments[0].Material.Density = 7850
	point := func(x float64) fem.PointLoad { return fem.PointLoad{X: x, Transverse: -5e3} }
	m.Cases[0].PointLoads = []fem.PointLoad{point(2), point(6)}
	m.Cases[1].PointLoads = []fem.PointLoad{point(1)}
	m.Cases[1].DistributedLoad = append(m.Cases[1].DistributedLoad, m.Cases[0].DistributedLoad...)
	m.Cases = append(m.Cases, fem.LoadCase{Name: "own weight", SelfWeight: true})
	want := map[string]string{ // case: its description
		"both spans": "2 point loads, 1 distributed load",
		"first span": "1 point load, 2 distributed loads",
		"imposed":    "1 distributed load, placed by span",
		"own weight": "self-weight",
	}
	r := casesResults(t, p)
	var text bytes.Buffer
	WriteCasesText(&text, "model.json", r, units.SI)
	lines := strings.Split(text.String(), "\n")
	for name, says := range want {
		if !slices.ContainsFunc(lines, func(l string) bool {
			return strings.HasPrefix(l, "  "+name+"  ") && strings.TrimSpace(strings.TrimPrefix(l, "  "+name)) == says
		}) {
			t.Errorf("case %q is not described as %q:\n%s", name, says, text.String())
		}
	}
}
