package report

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// foundationDoc is what these tests read of the results document.
type foundationDoc struct {
	Mesh struct {
		AccuracyReached float64 `json:"accuracy_reached"`
	}
	Reactions []struct {
		Transverse *struct{ Value float64 }
	}
	Foundations []struct {
		Foundation                        int
		Start, End                        float64
		Axial, Transverse, Moment, Centre *struct {
			Value, FE float64
			Exact     *float64
		}
	}
	Extremes []struct {
		Quantity string
		Min      struct{ Value, X float64 }
	}
	Equilibrium struct {
		Applied struct{ Transverse, Moment float64 }
		Exact   struct {
			Reactions, Ground struct{ Transverse, Moment float64 }
			Relative          float64
		}
		FE struct {
			Ground *struct{ Transverse float64 }
		}
	}
}

// solveProject analyses p and returns its results document, decoded, and
// its solve text.
func solveProject(t *testing.T, p *storage.Project) (foundationDoc, string) {
	t.Helper()
	var doc foundationDoc
	src := solveInto(t, p, &doc)
	if src.Analysis.Solution == nil {
		t.Fatalf("not solved: %v", src.Findings)
	}
	var text bytes.Buffer
	WriteSolveText(&text, "model.json", src)
	return doc, text.String()
}

// solveInto analyses p and reads its solve --json document into doc.
func solveInto(t *testing.T, p *storage.Project, doc any) Source {
	t.Helper()
	src, err := Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	var js bytes.Buffer
	if err := WriteSolveJSON(&js, "model.json", src); err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(js.Bytes(), doc); err != nil {
		t.Fatal(err)
	}
	return src
}

// groundProject is a free beam of length L and bending stiffness EI
// (E 30 GPa) on a foundation of modulus k along its whole length, held
// along its axis at mid-length only, on mesh.
func groundProject(L, EI, k float64, mesh fem.MeshSettings) *storage.Project {
	concrete := fem.Material{Name: "concrete", Elastic: 30e9}
	return &storage.Project{View: storage.DefaultView(), Model: fem.Model{
		Segments:    []fem.Segment{{Start: 0, End: L, Section: fem.Section{Area: 0.3, SecondMoment: EI / 30e9, FibreDistance: 0.25}, Material: concrete}},
		Supports:    []fem.Support{{X: L / 2, Kind: fem.AxialOnly}},
		Foundations: []fem.Foundation{{Start: 0, End: L, Modulus: k}},
		Mesh:        mesh,
	}}
}

func near(got, want, tol float64) bool { return math.Abs(got-want) <= tol*math.Abs(want) }

// What the ground carries, in the results document, against closed forms.
func TestSolveReportsTheGround(t *testing.T) {
	const (
		q = -20e3  // N/m
		P = -100e3 // N
		k = 2e7    // N/m²
	)
	uniform := groundProject(10, 2e8, k, fem.MeshSettings{Elements: 20})
	uniform.Model.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: 10, Intensity: q}}}}
	// β = (k/4EI)^¼ = 0.3976 /m, so β·30 m = 11.9: the ends are far
	// enough from the load for the infinite beam's closed form
	// (e^(−11.9) ≈ 7e-6).
	const EI, L, a = 2e8, 80.0, 30.0
	long := groundProject(L, EI, k, fem.MeshSettings{Elements: 320})
	long.Model.PointLoads = []fem.PointLoad{{X: a, Transverse: P}}
	beta := math.Pow(k/(4*EI), 0.25)

	for _, c := range []struct {
		name      string
		p         *storage.Project
		resultant float64 // N, up
		centre    float64 // m
		tolFE     float64 // relative, of the FE resultant against the exact one
		// deflection is the largest downward deflection, m, 0 when not checked.
		deflection float64
	}{
		// A free beam on a uniform foundation under a uniform load sinks
		// evenly, w = q/k: the ground returns q·L at mid-length (statics).
		// The FE's cubic holds a constant exactly: round-off.
		{"uniform load on a free beam", uniform, -q * 10, 5, 1e-9, q / k},
		// A point load on a long beam: the ground returns P, acting under
		// the load (statics: nothing else holds the beam across); the
		// deflection under the load is P·β/(2k) (Hetényi, Beams on Elastic
		// Foundation, 1946, from memory).
		{"point load on a long beam", long, -P, a, 1e-6, P * beta / (2 * k)},
	} {
		t.Run(c.name, func(t *testing.T) {
			doc, text := solveProject(t, c.p)
			if len(doc.Foundations) != 1 {
				t.Fatalf("%d foundations in the document, want 1", len(doc.Foundations))
			}
			f := doc.Foundations[0]
			if f.Foundation != 1 || f.Axial != nil || f.Transverse == nil || f.Transverse.Exact == nil || f.Centre == nil {
				t.Fatalf("foundation %+v: want number 1, no axial component, a transverse one beside the exact value, and a centre", f)
			}
			if !near(f.Transverse.Value, c.resultant, 1e-9) || !near(f.Transverse.FE, c.resultant, c.tolFE) {
				t.Errorf("the ground carries %g N exact, %g N FE; want %g N", f.Transverse.Value, f.Transverse.FE, c.resultant)
			}
			if !near(f.Centre.Value, c.centre, 1e-9) || !near(f.Moment.Value, c.resultant*c.centre, 1e-9) {
				t.Errorf("the ground's resultant acts at %g m with moment %g N·m; want %g m and %g N·m", f.Centre.Value, f.Moment.Value, c.centre, c.resultant*c.centre)
			}
			// The ground is all the reaction across: equilibrium says so.
			eq := doc.Equilibrium
			if !near(eq.Exact.Ground.Transverse, -eq.Applied.Transverse, 1e-9) || eq.Exact.Ground != eq.Exact.Reactions || eq.FE.Ground == nil {
				t.Errorf("equilibrium %+v: want the ground to balance the loads, as all the reactions", eq)
			}
			for _, e := range doc.Extremes {
				if e.Quantity == "deflection" && !near(e.Min.Value, c.deflection, 1e-4) {
					t.Errorf("largest deflection %g m, want %g m", e.Min.Value, c.deflection)
				}
			}
			for _, want := range []string{"Foundations (resultant of the ground's forces", "acts at x", "of which ground",
				units.SI.Format(units.Force, c.resultant)} {
				if !strings.Contains(text, want) {
					t.Errorf("the solve text does not say %q:\n%s", want, text)
				}
			}
		})
	}
}

// The shipped ground beam: the supports and the ground together balance
// the loads (statics), the ground carrying every load across the member,
// and the FE resultant is the exact one within the accuracy the mesh
// reports.
func TestGroundBeamBalances(t *testing.T) {
	p, err := storage.Load("../../testdata/ground_beam_foundation.json")
	if err != nil {
		t.Fatal(err)
	}
	doc, _ := solveProject(t, p)
	if len(doc.Foundations) != 1 || doc.Foundations[0].Transverse == nil {
		t.Fatalf("foundations %+v: want one carrying load across the member", doc.Foundations)
	}
	supports := 0.0
	for _, r := range doc.Reactions {
		if r.Transverse != nil {
			supports += r.Transverse.Value
		}
	}
	g := doc.Foundations[0].Transverse
	applied := doc.Equilibrium.Applied.Transverse
	if !near(supports+g.Value, -applied, 1e-9) || supports != 0 {
		t.Errorf("supports %g N + ground %g N against loads %g N: want the ground alone to balance them", supports, g.Value, applied)
	}
	if d := math.Abs(g.FE - g.Value); d > doc.Mesh.AccuracyReached*math.Abs(g.Value) {
		t.Errorf("FE ground %g N against exact %g N: off by %g, beyond the reported accuracy %g", g.FE, g.Value, d/math.Abs(g.Value), doc.Mesh.AccuracyReached)
	}
}

// A free beam on a foundation turned by a moment C at its end: the ground
// returns −C as a couple and no force across (statics), so the document
// gives its moment and no line of action (centre null), and the text says
// why, where both printed M/F of round-off, 1.2e31 m.
func TestGroundCarryingACouple(t *testing.T) {
	const C = 30e3 // N·m, counter-clockwise
	p := groundProject(20, 2e8, 2e7, fem.MeshSettings{Elements: 80})
	p.Model.PointLoads = []fem.PointLoad{{X: 0, Moment: C}}
	doc, text := solveProject(t, p)
	f := doc.Foundations[0]
	if f.Centre != nil || f.Moment == nil || !near(f.Moment.Value, -C, 1e-9) {
		t.Errorf("the ground: centre %+v, moment %+v; want no centre and a moment of %g N·m", f.Centre, f.Moment, -C)
	}
	if !strings.Contains(text, "nowhere: the forces across add up to nothing, a couple") {
		t.Errorf("the solve text does not say the ground carries a couple:\n%s", text)
	}
}

// With load cases, each case and combination reports what the ground
// carries, and the envelope holds its largest and smallest. A free beam on
// a full-length foundation returns every load across it through the
// ground (statics), so each combination's ground is Σ factor × case load.
func TestCasesReportTheGround(t *testing.T) {
	const L, g, q = 10.0, -10e3, -50e3 // m, N/m permanent, N imposed
	p := groundProject(L, 2e8, 2e7, fem.MeshSettings{Elements: 40})
	p.Model.Cases = []fem.LoadCase{
		{Name: "permanent", DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: g}, {X: L, Intensity: g}}}}},
		{Name: "imposed", PointLoads: []fem.PointLoad{{X: 3, Transverse: q}}},
	}
	p.Model.Combinations = []fem.Combination{
		{Name: "ULS", Kind: fem.Strength, Factors: []fem.CaseFactor{{Case: 0, Factor: 1.35}, {Case: 1, Factor: 1.5}}},
		{Name: "G only", Kind: fem.Strength, Factors: []fem.CaseFactor{{Case: 0, Factor: 1}}},
	}
	type ground struct {
		Foundations []struct{ Transverse struct{ Value, FE float64 } }
	}
	var doc struct {
		Cases, Combinations []ground
		Envelope            struct {
			Foundations []struct {
				Foundation int
				Max, Min   map[string]struct {
					Value       float64
					Combination string
				}
			}
		}
	}
	src := solveInto(t, p, &doc)
	for _, c := range []struct {
		name string
		got  []ground
		want []float64 // N, up
	}{
		{"cases", doc.Cases, []float64{-g * L, -q}},
		{"combinations", doc.Combinations, []float64{-1.35*g*L - 1.5*q, -g * L}},
	} {
		if len(c.got) != len(c.want) {
			t.Fatalf("%d %s, want %d", len(c.got), c.name, len(c.want))
		}
		for i, r := range c.got {
			if len(r.Foundations) != 1 || !near(r.Foundations[0].Transverse.Value, c.want[i], 1e-9) || !near(r.Foundations[0].Transverse.FE, c.want[i], 1e-6) {
				t.Errorf("%s %d: the ground carries %+v, want %g N", c.name, i+1, r.Foundations, c.want[i])
			}
		}
	}
	env := doc.Envelope.Foundations
	if len(env) != 1 || env[0].Foundation != 1 {
		t.Fatalf("envelope of the ground %+v: want foundation 1", env)
	}
	hi, lo := env[0].Max["transverse"], env[0].Min["transverse"]
	if !near(hi.Value, -1.35*g*L-1.5*q, 1e-6) || hi.Combination != "ULS" || !near(lo.Value, -g*L, 1e-6) || lo.Combination != "G only" {
		t.Errorf("the ground's envelope runs from %+v to %+v: want %g N (G only) to %g N (ULS)", lo, hi, -g*L, -1.35*g*L-1.5*q)
	}
	cases, err := CasesResults(src.Analysis)
	if err != nil {
		t.Fatal(err)
	}
	var text bytes.Buffer
	WriteCasesText(&text, "model.json", cases, units.SI)
	if want := "Ground envelope"; !strings.Contains(text.String(), want) || !strings.Contains(text.String(), units.SI.Format(units.Force, hi.Value)) {
		t.Errorf("the cases text lacks %q or the largest ground resultant:\n%s", want, text.String())
	}
	if all := strings.Join(sheetCaseLines(src), "\n"); !strings.Contains(all, "Ground's resultant across the member, foundation 1: ") {
		t.Errorf("the sheet's case lines do not give the ground's envelope:\n%s", all)
	}
}

// A ground beam that no support holds still has the envelope's reactions
// as a list: docs/json.md promises that lists are always lists, empty when
// there is nothing to list.
func TestEnvelopeOfNoSupportsIsAnEmptyList(t *testing.T) {
	const L = 10.0 // m
	p := groundProject(L, 2e8, 2e7, fem.MeshSettings{Elements: 20})
	p.Model.Supports = nil
	p.Model.Cases = []fem.LoadCase{
		{Name: "permanent", DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: L, Intensity: -10e3}}}}},
		{Name: "imposed", PointLoads: []fem.PointLoad{{X: 3, Transverse: -50e3}}},
	}
	var doc struct {
		Reactions json.RawMessage
		Envelope  struct{ Reactions, Foundations json.RawMessage }
	}
	solveInto(t, p, &doc)
	for _, c := range []struct {
		key string
		got json.RawMessage
	}{{"reactions", doc.Reactions}, {"envelope.reactions", doc.Envelope.Reactions}} {
		if string(c.got) != "[]" {
			t.Errorf("%s is %s, want [] (no supports)", c.key, c.got)
		}
	}
	if len(doc.Envelope.Foundations) < 2 || doc.Envelope.Foundations[0] != '[' {
		t.Errorf("envelope.foundations is %s, want a list of one foundation", doc.Envelope.Foundations)
	}
}

// A beam the ground alone holds: the solve text and the cases text say
// there are no supports and point to the ground's resultant, rather than
// print a reactions table's headings over no rows. The JSON keeps its
// empty lists (TestEnvelopeOfNoSupportsIsAnEmptyList).
func TestTextOfNoSupportsPointsToTheGround(t *testing.T) {
	const L = 10.0 // m
	load := []fem.PointLoad{{X: 3, Transverse: -50e3}}
	alone := groundProject(L, 2e8, 2e7, fem.MeshSettings{Elements: 20})
	alone.Model.Supports = nil
	alone.Model.PointLoads = load
	withCases := groundProject(L, 2e8, 2e7, fem.MeshSettings{Elements: 20})
	withCases.Model.Supports = nil
	withCases.Model.Cases = []fem.LoadCase{{Name: "imposed", PointLoads: load}}

	_, solveText := solveProject(t, alone)
	cases := casesResults(t, withCases)
	var casesText bytes.Buffer
	WriteCasesText(&casesText, "model.json", cases, units.SI)

	for _, c := range []struct {
		name, text, heading, says string
	}{
		{"solve", solveText, "  support  kind", "Reactions: none, the member has no supports: the ground carries every load (its resultant: Foundations, below)"},
		{"cases", casesText.String(), "  support  x", "Reaction envelope: none, the member has no supports: the ground carries every load (its resultant: Ground envelope, below)"},
	} {
		t.Run(c.name, func(t *testing.T) {
			if strings.Contains(c.text, c.heading) {
				t.Errorf("the text prints the reactions' headings %q with no support under them:\n%s", c.heading, c.text)
			}
			if !strings.Contains(c.text, c.says) {
				t.Errorf("the text does not say %q:\n%s", c.says, c.text)
			}
		})
	}
}

// The envelope of a member on a foundation holds finite element values
// (envelope.solution "finite element"), so it must say how far to trust
// them: envelope.accuracy is the largest mesh accuracy over the
// combinations, with the field and the combination, and the cases text says
// the same. Two combinations on the default mesh: a uniform load, which the
// bed takes up without bending (solved exactly by any mesh), then a point
// load P in the middle of a long beam, whose shear force beside the load
// is P/2 (Hetényi, Beams on Elastic Foundation, 1946, the infinite beam,
// from memory) and converges slowest: the envelope's largest shear force
// misses P/2 by about the accuracy stated. mesh.accuracy_reached, of the
// first combination alone, is round-off and says nothing of it.
func TestFiniteElementEnvelopeSaysHowFarToTrustIt(t *testing.T) {
	const L, P = 20.0, 1e5
	p := groundProject(L, 1e8, 4e8, fem.MeshSettings{}) // β = 1/m
	p.Model.Cases = []fem.LoadCase{
		{Name: "uniform", DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e4}, {X: L, Intensity: -1e4}}}}},
		{Name: "column", PointLoads: []fem.PointLoad{{X: L / 2, Transverse: -P}}},
	}
	type accuracy struct {
		Ratio       float64
		Quantity    string
		Combination string
	}
	var doc struct {
		Combinations []struct {
			Name     string
			Extremes []struct {
				Quantity string
				Accuracy float64
			}
		}
		Envelope struct {
			Solution   string
			Accuracy   *accuracy
			Quantities []struct {
				Quantity string
				Max      struct{ Value float64 }
			}
		}
	}
	src := solveInto(t, p, &doc)
	if doc.Envelope.Solution != "finite element" {
		t.Fatalf("envelope.solution %q: the test needs a finite element envelope", doc.Envelope.Solution)
	}
	var want accuracy
	for _, c := range doc.Combinations {
		for _, e := range c.Extremes {
			if e.Accuracy > want.Ratio {
				want = accuracy{e.Accuracy, e.Quantity, c.Name}
			}
		}
	}
	got := doc.Envelope.Accuracy
	if got == nil || *got != want || want.Combination != "column" || want.Quantity != "shear_force" {
		t.Fatalf("envelope.accuracy is %+v, want %+v (the column's shear force)", got, want)
	}
	for _, q := range doc.Envelope.Quantities {
		if q.Quantity == "shear_force" {
			if off := math.Abs(q.Max.Value-P/2) / (P / 2); off > got.Ratio*(1+1e-9) || off < got.Ratio/2 {
				t.Errorf("the envelope's shear force %.6g N misses P/2 by %.3g %%, not within the %.3g %% stated", q.Max.Value, 100*off, 100*got.Ratio)
			}
		}
	}
	cases, err := CasesResults(src.Analysis)
	if err != nil {
		t.Fatal(err)
	}
	var text bytes.Buffer
	WriteCasesText(&text, "model.json", cases, units.SI)
	if says := fmt.Sprintf("within %.3g %% of a field's largest magnitude of their exact ones (worst: shear force in column)", 100*got.Ratio); !strings.Contains(text.String(), says) {
		t.Errorf("the cases text does not say %q:\n%s", says, text.String())
	}
	if says := fmt.Sprintf("within %.3g %% of a field's largest magnitude", 100*got.Ratio); !strings.Contains(strings.Join(sheetCaseLines(src), "\n"), says) {
		t.Errorf("the sheet's case lines do not say %q:\n%s", says, strings.Join(sheetCaseLines(src), "\n"))
	}
}
