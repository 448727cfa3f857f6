package analysis

import (
	"context"
	"errors"
	"math"
	"os"
	"reflect"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/units"
	"stave/storage"
)

func load(t testing.TB, name string) fem.Model {
	t.Helper()
	p, err := storage.Load("../../testdata/" + name)
	if err != nil {
		t.Fatal(err)
	}
	return p.Model
}

// A cantilever of the shipped test data through both stages: the solution,
// the exact solution, the checks and the handbook case, the tip deflection
// of each equal to the handbook's P·L³/(3·E·I).
func TestRunCantilever(t *testing.T) {
	m := load(t, "cantilever_tip_load.json")
	a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions()})
	if err != nil {
		t.Fatal(err)
	}
	if a.Solution == nil || a.Exact == nil || !a.Complete || len(a.Checks) == 0 || a.Handbook == nil {
		t.Fatalf("incomplete analysis: solution %v, exact %v (%v), complete %v, %d checks, handbook %v",
			a.Solution != nil, a.Exact != nil, a.ExactErr, a.Complete, len(a.Checks), a.Handbook != nil)
	}
	// Cantilever, L = 4 m, tip force P = 10 kN down, E = 200 GPa, I = 8e-6 m⁴:
	// tip deflection P·L³/(3·E·I) = 0.1333 m down.
	// Source: Gere & Goodno, Mechanics of Materials, Appendix D (cantilever beams), from memory.
	const P, L, E, I = 10e3, 4.0, 200e9, 8e-6
	want := -P * L * L * L / (3 * E * I)
	for name, w := range map[string]float64{
		"finite element": a.Solution.At(L, fem.Left).Deflection,
		"exact":          a.Exact.At(L, fem.Left).Deflection,
	} {
		if math.Abs(w-want) > 1e-9*math.Abs(want) {
			t.Errorf("%s tip deflection %g, want %g", name, w, want)
		}
	}
	if !strings.Contains(a.HandbookText(units.SI), "Cantilever") {
		t.Errorf("handbook text %q does not name the case", a.HandbookText(units.SI))
	}
	if a.Problem() != "" || Unreliable(a.Findings()) {
		t.Errorf("a sound cantilever is reported as a problem (%q) or unreliable", a.Problem())
	}
}

func TestFindings(t *testing.T) {
	free := load(t, "cantilever_tip_load.json")
	free.Supports[0].Kind = fem.Roller
	cases := []struct {
		name      string
		model     fem.Model
		firstOnly bool // Solve without Finish
		severity  Severity
		status    string // status of the first finding
		nameHas   string // in the first finding's name
		doubtful  bool
	}{
		{"no member", fem.Model{}, false, Fail, "FAIL", "no results", true},
		{"free motion", free, false, Fail, "FAIL", "free motion", true},
		{"first stage only", load(t, "cantilever_tip_load.json"), true, Pending, "…", "exact solution and checks follow", false},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := Request{Model: c.model, Checks: check.DefaultOptions()}
			a, err := Solve(context.Background(), r)
			if err == nil && !c.firstOnly {
				a, err = Finish(context.Background(), r, a)
			}
			if err != nil {
				t.Fatal(err)
			}
			fs := a.Findings()
			if len(fs) == 0 {
				t.Fatal("no findings")
			}
			f := fs[0]
			if f.Severity != c.severity || f.Status != c.status || !strings.Contains(f.Name, c.nameHas) {
				t.Errorf("first finding %v %q %q, want %v %q with %q", f.Severity, f.Status, f.Name, c.severity, c.status, c.nameHas)
			}
			if Unreliable(fs) != c.doubtful {
				t.Errorf("unreliable = %v, want %v", Unreliable(fs), c.doubtful)
			}
		})
	}
}

// Design checks that pass say "within limit", never "ok": a finding about
// the member, not an approval; failures come before passes.
func TestCheckFindingsWords(t *testing.T) {
	a := Analysis{Model: load(t, "cantilever_tip_load.json"), Checks: []check.Result{
		{Kind: check.Design, Status: check.Pass, Name: "deflection"},
		{Kind: check.Verification, Status: check.Pass, Name: "equilibrium"},
		{Kind: check.Design, Status: check.Fail, Name: "stress", X: 1},
		{Kind: check.Verification, Status: check.Info, Name: "error"},
	}}
	got := a.checkFindings()
	want := []struct {
		status string
		marked bool
	}{{"FAIL", true}, {"note", false}, {"within limit", false}, {"ok", false}}
	for i, w := range want {
		if got[i].Status != w.status || got[i].Marked != w.marked {
			t.Errorf("finding %d (%s) is %q marked %v, want %q marked %v", i, got[i].Name, got[i].Status, got[i].Marked, w.status, w.marked)
		}
	}
	if got[0].Span == [2]float64{} {
		t.Error("a failed check at a point has no span to highlight")
	}
}

func TestFlagged(t *testing.T) {
	fs := []Finding{
		finding(CodeMaterial, "material", "odd"),
		finding(CodeVerified, "equilibrium", "fine"),
		finding(CodeDesignFail, "stress", "too high"),
		finding(CodeDesignNotChecked, "exact", "none"),
	}
	got := Flagged(fs)
	want := []string{"FAIL — stress: too high", "caution — material: odd"}
	if strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("flagged %q, want %q", got, want)
	}
}

// A cancelled context stops an analysis before each stage.
func TestCancelled(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	r := Request{Model: load(t, "cantilever_tip_load.json")}
	if _, err := Solve(ctx, r); !errors.Is(err, context.Canceled) {
		t.Errorf("Solve on a cancelled context: %v", err)
	}
	first, err := Solve(context.Background(), r)
	if err != nil {
		t.Fatal(err)
	}
	a, err := Finish(ctx, r, first)
	if !errors.Is(err, context.Canceled) || a.Complete || a.Exact != nil {
		t.Errorf("Finish on a cancelled context: err %v, complete %v, exact %v", err, a.Complete, a.Exact != nil)
	}
}

// Finish walks the elements once for the summary and the checks together;
// what it gives is what fem.Summarize and check.Run give each on its own
// walk, on a mesh large enough to be walked in two halves at once. The
// summary handed out is a copy: changing it leaves the analysis alone.
func TestFinishOneWalkForSummaryAndChecks(t *testing.T) {
	m := load(t, "demo.json")
	m.Mesh = fem.MeshSettings{Elements: 6000}
	r := Request{Model: m, Checks: check.DefaultOptions()}
	a, err := Run(context.Background(), r)
	if err != nil || a.Solution == nil || a.Exact == nil {
		t.Fatalf("analysis: %v, %v, %v", err, a.Err, a.ExactErr)
	}
	got, want := a.Summary(), fem.Summarize(a.Solution, a.Exact)
	if !reflect.DeepEqual(got, want) {
		t.Errorf("summary of the shared walk\n%+v\nsummarized alone\n%+v", got, want)
	}
	if want := check.Run(&a.Model, a.Solution, a.Exact, r.Checks); !reflect.DeepEqual(a.Checks, want) {
		t.Errorf("checks of the shared walk differ from check.Run's")
	}
	got.Extremes[0].Max, got.ExactError.MaxStress = 1e300, 1e300
	if again := a.Summary(); again.Extremes[0].Max == 1e300 || again.ExactError.MaxStress == 1e300 {
		t.Error("changing a summary changed the analysis's")
	}
}

// Every code is in the table once, and docs/json.md, which programs read,
// lists every one.
func TestCodes(t *testing.T) {
	doc, err := os.ReadFile("../../docs/json.md")
	if err != nil {
		t.Fatal(err)
	}
	seen := map[Code]bool{}
	for _, c := range Codes {
		if seen[c.Code] || c.Code != Code(strings.ToLower(string(c.Code))) || c.Meaning == "" {
			t.Errorf("code %q: twice, not lower case, or without a meaning", c.Code)
		}
		seen[c.Code] = true
		if !strings.Contains(string(doc), "`"+string(c.Code)+"`") {
			t.Errorf("docs/json.md does not list the code %q", c.Code)
		}
	}
}

// beam is the shipped simple beam (L = 4 m, w = 10 kN/m down) on mesh.
func beam(t *testing.T, mesh fem.MeshSettings) Analysis {
	t.Helper()
	m := load(t, "simply_supported_uniform.json")
	m.Mesh = mesh
	a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions()})
	if err != nil || a.Solution == nil || a.Exact == nil {
		t.Fatalf("analysis: %v, %v, %v", err, a.Err, a.ExactErr)
	}
	return a
}

func codes(fs []Finding) []Code {
	var out []Code
	for _, f := range fs {
		out = append(out, f.Code)
	}
	return out
}

// A mesh set coarse on purpose keeps its finite element values, and the
// findings say plainly how far they are from the exact ones and which is
// which; the default mesh needs no such word.
func TestCoarseMeshFinding(t *testing.T) {
	coarse := beam(t, fem.MeshSettings{Elements: 1})
	fs := coarse.Findings()
	var f Finding
	for _, g := range fs {
		if g.Code == CodeCoarseMesh {
			f = g
		}
	}
	// One element: the finite element shear is zero where the exact one
	// is wL/2 = 20 kN at the supports (Gere & Goodno, Appendix D, from memory).
	if f.Code != CodeCoarseMesh || f.Severity != Caution || f.Doubtful || !f.Located || f.At != 0 {
		t.Fatalf("coarse mesh finding %+v among %v", f, codes(fs))
	}
	for _, want := range []string{"differ by 100 % of the largest shear force", "20.00 kN at x = 0 m exactly", "in the finite element (FE) solution",
		"Also beyond 0.5 %: deflection 20 %, bending moment 66.7 %", "headline values", "set in the model"} {
		if !strings.Contains(f.Message, want) {
			t.Errorf("coarse mesh message lacks %q: %s", want, f.Message)
		}
	}
	if Failed(fs) && !slices.Contains(codes(fs), CodeDesignFail) {
		t.Errorf("a coarse mesh alone fails: %v", codes(fs))
	}
	if auto := beam(t, fem.MeshSettings{}); slices.Contains(codes(auto.Findings()), CodeCoarseMesh) {
		t.Errorf("the default mesh is called coarse: %v", codes(auto.Findings()))
	}
}

// Reactions that do not balance the loads fail the equilibrium check,
// mark the results unreliable and make a command exit 3; without an exact
// solution the values are the finite element ones, and the findings say so.
func TestEquilibriumAndNoExactFindings(t *testing.T) {
	a := beam(t, fem.MeshSettings{})
	broken := *a.Solution
	broken.Equilibrium.Reactions[1] += 1e3
	broken.Equilibrium.Residual[1] += 1e3
	a.Solution = &broken
	a.Checks = check.Run(&a.Model, a.Solution, a.Exact, check.DefaultOptions())
	fs := a.Findings()
	if !Failed(fs) || !Unreliable(fs) || !slices.Contains(codes(Warnings(fs)), CodeEquilibrium) {
		t.Errorf("unbalanced reactions: failed %v, unreliable %v, warnings %v", Failed(fs), Unreliable(fs), codes(Warnings(fs)))
	}

	b := beam(t, fem.MeshSettings{})
	b.Exact, b.ExactErr, b.summary = nil, errors.New("its equations are singular"), nil
	b.Checks = check.Run(&b.Model, b.Solution, nil, check.DefaultOptions())
	fs = b.Findings()
	if !slices.Contains(codes(fs), CodeNoExact) || slices.Contains(codes(fs), CodeNotVerified) {
		t.Errorf("no exact solution: findings %v", codes(fs))
	}
	if sum := b.Summary(); sum.Exact || sum.Extremes[0].Max != sum.Extremes[0].FEMax {
		t.Errorf("without an exact solution the headline values must be the finite element ones: %+v", sum.Extremes[0])
	}
}

// A hinge a nanometre from a roller. The finite element answer rests on
// the near-coincident key points: it gives a shear force of 240,000 kN in
// the 1e-9 m element beside the support, where there are 20 kN, q·4 m/2
// of the part beyond the hinge, simply supported on the hinge and the
// roller at 10 m (statics). The exact solution once refused the model as
// near singular, so that answer was the headline and was marked
// unreliable; the short stretch's Taylor unknowns solve it now (with
// condition 1e3 or so), the headline is exact, and the finite element
// shear force is flagged as the mesh's error (coarse_mesh) beside it. A
// millimetre away both solutions are sound and nothing is flagged.
func TestHingeNearRollerFindings(t *testing.T) {
	const q = -1e4 // N/m
	for _, c := range []struct {
		name  string
		gap   float64 // m, between the roller and the hinge
		feOff bool    // the finite element shear force is far off
	}{
		{"hinge a nanometre from the roller", 1e-9, true},
		{"hinge a millimetre from the roller", 1e-3, false},
	} {
		seg := fem.Segment{Start: 0, End: 10, Section: fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15}, Material: fem.Material{Elastic: 2e11}}
		m := fem.Model{
			Segments:        []fem.Segment{seg},
			Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}, {X: 10, Kind: fem.Roller}},
			Hinges:          []fem.Hinge{{X: 6 + c.gap}},
			DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: 10, Intensity: q}}}},
		}
		a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions()})
		if err != nil {
			t.Fatal(err)
		}
		fs := a.Findings()
		if a.ExactErr != nil || Unreliable(fs) || slices.Contains(codes(fs), CodeCondition) || slices.Contains(codes(fs), CodeCoarseMesh) != c.feOff {
			t.Errorf("%s: exact error %v; unreliable %v, findings %v; want an exact solution, no condition finding, coarse_mesh %v", c.name, a.ExactErr, Unreliable(fs), codes(fs), c.feOff)
			continue
		}
		// Just right of the roller: the hinge's share of the part beyond it,
		// −q·(10 m − 6 m)/2 less the load on the gap.
		if got, want := a.Exact.At(6, fem.Right).ShearForce, -q*(4-c.gap)/2-q*c.gap; math.Abs(got-want) > 1e-9*math.Abs(want) {
			t.Errorf("%s: exact shear force right of the roller %.12g N, statics %.12g N", c.name, got, want)
		}
	}
}

// A temperature load on a segment without a coefficient of thermal
// expansion does nothing (N = −EA·α·ΔT = 0 in a bar held at both ends):
// the findings say so, for a uniform change at the top level or in a case
// and for a temperature difference through the depth, and only for the
// segments that lack α.
func TestTemperatureWithoutExpansion(t *testing.T) {
	segment := func(start, end, alpha, difference float64) fem.Segment {
		return fem.Segment{Start: start, End: end, TemperatureDifference: difference,
			Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15},
			Material: fem.Material{Elastic: 210e9, ThermalExpansion: alpha}}
	}
	held := []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Fixed}}
	for _, c := range []struct {
		name string
		m    fem.Model
		want []string // the names of the findings of code material
	}{
		{"warmed, no α", fem.Model{Segments: []fem.Segment{segment(0, 6, 0, 0)}, Supports: held, TemperatureChange: 30},
			[]string{"thermal expansion of segment 1"}},
		{"warmed, with α", fem.Model{Segments: []fem.Segment{segment(0, 6, 12e-6, 0)}, Supports: held, TemperatureChange: 30}, nil},
		{"a difference on the segment without α", fem.Model{Segments: []fem.Segment{segment(0, 3, 12e-6, 0), segment(3, 6, 0, 20)}, Supports: held},
			[]string{"thermal expansion of segment 2"}},
		{"no temperature load, no α", fem.Model{Segments: []fem.Segment{segment(0, 6, 0, 0)}, Supports: held,
			PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}}, nil},
		{"warmed in a load case", fem.Model{Segments: []fem.Segment{segment(0, 3, 0, 0), segment(3, 6, 0, 0)}, Supports: held,
			Cases: []fem.LoadCase{{Name: "summer", TemperatureChange: 25}}},
			[]string{"thermal expansion of segment 1", "thermal expansion of segment 2"}},
	} {
		t.Run(c.name, func(t *testing.T) {
			var got []string
			for _, f := range materialFindings(t, c.m) {
				got = append(got, f.Name)
				if f.Severity != Caution || !strings.Contains(f.Message, "does nothing to it") {
					t.Errorf("finding %q: severity %v, message %q", f.Name, f.Severity, f.Message)
				}
			}
			if !slices.Equal(got, c.want) {
				t.Errorf("findings of code material %q, want %q", got, c.want)
			}
		})
	}
}

// A segment deforming in shear whose shear area exceeds its cross-section
// area (κ above 1, or As given in the wrong units) is a caution: As = κ·A
// with κ below 1 for every section (Timoshenko's shear coefficient, from
// memory). Only such segments are named, and those that give a shear area
// or κ without deforming in shear (they are not used).
func TestShearAreaAboveTheArea(t *testing.T) {
	segment := func(start, end, kappa, shearArea float64) fem.Segment {
		return fem.Segment{Start: start, End: end, ShearDeformation: true,
			Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15, ShearCoefficient: kappa, ShearArea: shearArea},
			Material: fem.Material{Elastic: 210e9, Poisson: 0.3}}
	}
	// rigid turns shear deformation off, leaving the shear properties.
	rigid := func(s fem.Segment) fem.Segment {
		s.ShearDeformation = false
		return s
	}
	held := []fem.Support{{X: 0, Kind: fem.Fixed}}
	load := []fem.PointLoad{{X: 3, Transverse: -1e4}}
	for _, c := range []struct {
		name string
		segs []fem.Segment
		want []string
	}{
		{"κ 5/6", []fem.Segment{segment(0, 3, 5.0/6, 0)}, nil},
		{"κ 2", []fem.Segment{segment(0, 3, 2, 0)}, []string{"shear area of segment 1"}},
		{"As in cm² as if m²", []fem.Segment{segment(0, 1, 5.0/6, 0), segment(1, 3, 0, 80)}, []string{"shear area of segment 2"}},
		{"κ given, shear deformation off", []fem.Segment{rigid(segment(0, 3, 5.0/6, 0))}, []string{"shear area of segment 1"}},
		{"neither", []fem.Segment{rigid(segment(0, 3, 0, 0))}, nil},
	} {
		var got []string
		for _, f := range materialFindings(t, fem.Model{Segments: c.segs, Supports: held, PointLoads: load}) {
			got = append(got, f.Name)
		}
		if !slices.Equal(got, c.want) {
			t.Errorf("%s: findings of code material %q, want %q", c.name, got, c.want)
		}
	}
}

// A depth that the extreme fibre distance c cannot belong to is a caution,
// and the model is still solved as entered: c runs to the farther face, so
// c ≤ h ≤ 2c (the extreme fibre of S = I/c; Gere & Goodno, Mechanics of
// Materials, ch. 5, from memory). c = 0.15 m here.
func TestDepthAgainstTheFibreDistance(t *testing.T) {
	held := []fem.Support{{X: 0, Kind: fem.Fixed}}
	load := []fem.PointLoad{{X: 3, Transverse: -1e4}}
	for _, c := range []struct {
		name  string
		depth float64
		want  []string
	}{
		{"left out (2c)", 0, nil},
		{"symmetric", 0.3, nil},
		{"unsymmetric", 0.2, nil},
		{"below c", 0.1, []string{"depth of segment 1"}},
		{"beyond 2c", 0.4, []string{"depth of segment 1"}},
	} {
		seg := fem.Segment{Start: 0, End: 3, TemperatureDifference: 10,
			Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15, Depth: c.depth},
			Material: fem.Material{Elastic: 210e9, ThermalExpansion: 12e-6}}
		var got []string
		for _, f := range materialFindings(t, fem.Model{Segments: []fem.Segment{seg}, Supports: held, PointLoads: load}) {
			got = append(got, f.Name)
		}
		if !slices.Equal(got, c.want) {
			t.Errorf("%s: findings of code material %q, want %q", c.name, got, c.want)
		}
	}
}

// A foundation so stiff that the member on it would bend over a sliver of
// its depth is a caution (the model is solved as entered): β = (k/4EI)^¼
// (Hetényi, Beams on Elastic Foundation, 1946, from memory), and the
// caution comes once 1/β is below a tenth of the depth (stiffBed, common
// practice). The section: E·I = 200e9 · 8e-5 = 1.6e7 N·m², depth 0.3 m
// (twice c = 0.15 m, or given), or √(12·I/A) = 0.3098 m for A = 0.01 m²
// when neither is given; the modulus for β·d = r is k = 4EI·(r/d)⁴.
func TestFoundationFarTooStiff(t *testing.T) {
	const ei, d = 200e9 * 8e-5, 0.3
	at := func(r, depth float64) float64 { return 4 * ei * math.Pow(r/depth, 4) }
	for _, c := range []struct {
		name          string
		k, c, depth   float64 // N/m², m, m
		want          bool
		wantInMessage string
	}{
		{"a stiff soil", 1e8, 0.15, 0, false, ""},
		{"rock, far below the threshold", 1e10, 0.15, 0, false, ""},
		{"just within (β·d = 9.9)", at(9.9, d), 0.15, 0, false, ""},
		{"just beyond (β·d = 10.1)", at(10.1, d), 0.15, 0, true, "a small part of its depth of 300.0 mm"},
		{"depth given", at(10.1, 0.25), 0.15, 0.25, true, "depth of 250.0 mm"},
		{"no depth, rectangle of A and I", at(10.1, math.Sqrt(12*8e-5/0.01)), 0, 0, true, "depth of 309.8 mm"},
		// β = (1e149/6.4e7)^¼ = 1.988e35 /m: 1/β = 5.030e-33 mm.
		{"1e149 N/m²", 1e149, 0.15, 0, true, "1/β = (4·E·I/k)^¼ of 5.030e-33 mm"},
	} {
		seg := fem.Segment{Start: 0, End: 10,
			Section:  fem.Section{Area: 0.01, SecondMoment: 8e-5, FibreDistance: c.c, Depth: c.depth},
			Material: fem.Material{Elastic: 200e9}}
		m := fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 5, Kind: fem.AxialOnly}},
			Foundations: []fem.Foundation{{Start: 0, End: 10, Modulus: c.k}},
			PointLoads:  []fem.PointLoad{{X: 5, Transverse: -1e4}}}
		fs := materialFindings(t, m)
		said := messagesOf(fs, "modulus of foundation 1")
		switch {
		case c.want && !strings.Contains(said, c.wantInMessage):
			t.Errorf("%s: caution %q, want one saying %q (findings %+v)", c.name, said, c.wantInMessage, fs)
		case !c.want && said != "":
			t.Errorf("%s: caution %q, want none", c.name, said)
		}
		if c.want && len(fs) > 0 && fs[0].Span != [2]float64{0, 10} {
			t.Errorf("%s: the caution spans %v, want the foundation's 0 to 10 m", c.name, fs[0].Span)
		}
	}
}

// materialFindings are the findings of code material of m, analysed in full.
func materialFindings(t *testing.T, m fem.Model) []Finding {
	t.Helper()
	return materialFindingsIn(t, m, check.DefaultOptions().Units)
}

// materialFindingsIn is materialFindings with the messages in units u.
func materialFindingsIn(t *testing.T, m fem.Model, u units.System) []Finding {
	t.Helper()
	opts := check.DefaultOptions()
	opts.Units = u
	a, err := Run(context.Background(), Request{Model: m, Checks: opts})
	if err != nil {
		t.Fatal(err)
	}
	var out []Finding
	for _, f := range a.Findings() {
		if f.Code == CodeMaterial {
			out = append(out, f)
		}
	}
	return out
}

// A displacement or rotation far beyond what small-displacement theory
// covers draws a caution of its own, naming the value, where, and which
// combination; a member that moves within it draws none. The thresholds,
// a tenth of the member's length and 0.1 rad, are common practice.
func TestLargeDisplacementFinding(t *testing.T) {
	scaleLoads := func(m *fem.Model, by float64) {
		for i := range m.PointLoads {
			m.PointLoads[i].Transverse *= by
		}
		for i := range m.DistributedLoad {
			for j := range m.DistributedLoad[i].Points {
				m.DistributedLoad[i].Points[j].Intensity *= by
			}
		}
	}
	for _, c := range []struct {
		name  string
		model string
		edit  func(m *fem.Model)
		show  Show
		says  []string // nil: no finding
	}{
		// Cantilever, L = 4 m, P = 10 kN: tip deflection PL³/(3EI) =
		// 0.1333 m = L/30, tip rotation PL²/(2EI) = 0.05 rad (Gere &
		// Goodno, Appendix D, from memory): within both.
		{"cantilever as shipped", "cantilever_tip_load.json", func(*fem.Model) {}, Show{}, nil},
		// ×1.9: 0.2533 m = L/15.8 and 0.095 rad, still within both.
		{"cantilever just within", "cantilever_tip_load.json", func(m *fem.Model) { scaleLoads(m, 1.9) }, Show{}, nil},
		// E in kPa typed as Pa (÷1000): a tip deflection of 133.3 m on a
		// 4 m member, far beyond a tenth of it.
		{"cantilever in wrong units", "cantilever_tip_load.json", func(m *fem.Model) { m.Segments[0].Material.Elastic /= 1000 }, Show{},
			[]string{"largest deflection is -133.3 m at x = 4.000 m", "a tenth of the member's length (0.4000 m)", "small-displacement", "units"}},
		// Simple beam, L = 4 m: end rotation wL³/(24EI) = 0.01667 rad
		// and mid-span deflection 5wL⁴/(384EI) = 0.02083 m (Gere &
		// Goodno, Appendix D, from memory); ×9 turns the ends 0.15 rad
		// while the deflection, 0.1875 m = L/21, stays within a tenth.
		{"simple beam turned beyond 0.1 rad", "simply_supported_uniform.json", func(m *fem.Model) { scaleLoads(m, 9) }, Show{},
			[]string{"largest rotation is -0.1500 rad at x = 0 m", "0.1 rad", "small-displacement"}},
		// Two spans, every case's E ÷ 1e4: the combination "both" sags
		// 73 m on an 8 m member (0.00732 m × 1e4, as shipped).
		{"two spans in wrong units", "two_span_cases.json", func(m *fem.Model) {
			for i := range m.Segments {
				m.Segments[i].Material.Elastic /= 1e4
			}
		}, Show{Kind: ShowEnvelope}, []string{"largest deflection is", `in combination "`, "a tenth of the member's length (0.8000 m)"}},
		// The same without combinations: the envelope is over the load
		// cases, each at factor 1 (docs/format.md), and the finding names
		// a load case, not a combination the file does not have: "first
		// span", one span loaded, sags most: 0.0092·qL⁴/EI = 73.6 m with
		// q = 10 kN/m, L = 4 m, EI = 320 N·m² (continuous beam, two equal
		// spans, one loaded; AISC Manual beam diagrams, from memory, the
		// coefficient rounded), where both spans loaded hold each other
		// back to 0.0054·qL⁴/EI.
		{"two spans in wrong units, cases alone", "two_span_cases.json", func(m *fem.Model) {
			m.Combinations = nil
			for i := range m.Segments {
				m.Segments[i].Material.Elastic /= 1e4
			}
		}, Show{Kind: ShowEnvelope}, []string{"largest deflection is -73.20 m", `in load case "first span"`}},
	} {
		t.Run(c.name, func(t *testing.T) {
			m := load(t, c.model)
			c.edit(&m)
			a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions(), Show: c.show})
			if err != nil || a.Solution == nil {
				t.Fatalf("analysis: %v, %v", err, a.Err)
			}
			var found []Finding
			for _, f := range a.Findings() {
				if f.Code == CodeLargeDisplacement {
					found = append(found, f)
				}
			}
			if c.says == nil {
				if len(found) > 0 {
					t.Errorf("a member within small-displacement theory draws %+v", found)
				}
				return
			}
			if len(found) != 1 {
				t.Fatalf("%d large_displacement findings, want 1: %v", len(found), codes(a.Findings()))
			}
			f := found[0]
			if f.Severity != Caution || f.Doubtful || !f.Located {
				t.Errorf("finding %+v: want a located caution that leaves the results as computed", f)
			}
			for _, want := range c.says {
				if !strings.Contains(f.Message, want) {
					t.Errorf("the message lacks %q: %s", want, f.Message)
				}
			}
			if len(m.Combinations) == 0 && strings.Contains(f.Message, "combination") {
				t.Errorf("a model without combinations: the message names one: %s", f.Message)
			}
		})
	}
}

// The mesh line names the worst field only when a finite element extreme
// is off the exact one by more than round-off: a fixed-fixed bar under a
// uniform temperature change has a constant axial force −E·A·α·ΔT, which
// linear bar elements reproduce exactly (closed form of the restrained bar,
// from memory), and a field 2 % off is named.
func TestMeshChoiceNamesAWorstFieldOnlyWhenOneIsOff(t *testing.T) {
	a, err := Run(context.Background(), Request{Model: load(t, "fixed_fixed_thermal.json"), Checks: check.DefaultOptions()})
	if err != nil || a.Solution == nil {
		t.Fatalf("fixed_fixed_thermal: %v, %v", err, a.Err)
	}
	exact := fem.Summary{Exact: true, Extremes: []fem.Extreme{{Quantity: fem.QAxialDisplacement}, {Quantity: fem.QShearForce, Accuracy: 1e-13}}}
	off := fem.Summary{Exact: true, Extremes: []fem.Extreme{{Quantity: fem.QAxialDisplacement}, {Quantity: fem.QShearForce, Accuracy: 0.02}}}
	for _, c := range []struct {
		name       string
		sum        fem.Summary
		want, lack string
	}{
		{"fixed_fixed_thermal", a.Summary(), "extremes equal the exact ones (to round-off)", "worst"},
		{"round-off alone", exact, "extremes equal the exact ones (to round-off)", "worst"},
		{"one field 2 % off", off, "up to 2 % of a field's largest magnitude from the exact ones (worst: shear force), beyond", "round-off"},
	} {
		got := MeshChoice(c.sum)
		if !strings.Contains(got, c.want) || strings.Contains(got, c.lack) {
			t.Errorf("%s: %q, want %q and no %q", c.name, got, c.want, c.lack)
		}
	}
}
