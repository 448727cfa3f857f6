package storage

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"stave/fem"
)

// casesProject is the golden project with its loads moved into three
// cases (one placed by span, one with interleaved loads) and two
// combinations.
func casesProject() *Project {
	p := goldenProject()
	m := &p.Model
	m.Cases = []fem.LoadCase{
		{Name: "permanent", PointLoads: m.PointLoads, SelfWeight: true, Settlements: true, ThermalGradient: true},
		{Name: "imposed", DistributedLoad: m.DistributedLoad, BySpan: true},
		{Name: "thermal", TemperatureChange: m.TemperatureChange},
	}
	m.PointLoads, m.DistributedLoad, m.TemperatureChange, p.LoadOrder = nil, nil, 0, nil
	m.Cases[0].DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -500}, {X: 4, Intensity: -500}}}}
	m.Cases[0].PointLoads = append(m.Cases[0].PointLoads, fem.PointLoad{X: 3, Transverse: -700})
	p.CaseLoadOrder = [][]LoadKind{{PointLoad, DistributedLoad, PointLoad}}
	m.Combinations = []fem.Combination{
		{Name: "ULS 1", Kind: fem.Strength, Label: "fundamental (typical factors)", Factors: []fem.CaseFactor{{Case: 0, Factor: 1.35}, {Case: 1, Factor: 1.5}, {Case: 2, Factor: 0}}},
		{Name: "SLS", Kind: fem.Serviceability, Factors: []fem.CaseFactor{{Case: 1, Factor: 1}, {Case: 0, Factor: 1}}},
	}
	return p
}

// Cases and combinations survive saving and loading, loads in their order
// within each case, and saving again gives the same bytes.
func TestCasesRoundTrip(t *testing.T) {
	p := casesProject()
	data := mustMarshal(t, p)
	back, err := Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(back.Model.Cases, p.Model.Cases) || !reflect.DeepEqual(back.Model.Combinations, p.Model.Combinations) {
		t.Errorf("read back cases %+v\ncombinations %+v", back.Model.Cases, back.Model.Combinations)
	}
	if again := mustMarshal(t, back); string(again) != string(data) {
		t.Errorf("saving the loaded project changed the file:\n%s", lineDiff(data, again))
	}
	for _, want := range []string{`"by_span": true`, `"case": "imposed"`, `"kind": "serviceability"`, `"factor": 0`, `"settlements": true`, `"temperature_differences": true`} {
		if !strings.Contains(string(data), want) {
			t.Errorf("the file lacks %s", want)
		}
	}
	// The first case's loads in the order given: point, distributed, point.
	if i, j := strings.Index(string(data), `"x": 1,`), strings.Index(string(data), `[0, -500]`); !(i >= 0 && j > i) {
		t.Error("the first case's loads are not in their order")
	}
}

// A file's mistakes in cases and combinations are refused with their place
// and what to do.
func TestCasesLocatedMessages(t *testing.T) {
	good := string(mustMarshal(t, casesProject()))
	tests := []struct {
		name, from, to, path, says string
	}{
		{"unknown case", `"case": "imposed"`, `"case": "snow"`, "combinations[0].factors[1].case", `"snow" is not a load case of this file; use one of "permanent", "imposed", "thermal"`},
		{"factor too large", `"factor": 1.35`, `"factor": 1e999`, "combinations[0].factors[0].factor", "too large"},
		{"factor not a number", `"factor": 1.35`, `"factor": "x"`, "combinations[0].factors[0].factor", "expected a number"},
		{"unknown kind", `"kind": "serviceability"`, `"kind": "quasi"`, "combinations[1].kind", `"quasi" is not a kind of combination`},
		{"empty case", `"temperature_change": -15`, `"temperature_change": 0`, "cases[2]", `load case "thermal" is empty`},
		{"duplicate case", `"name": "thermal"`, `"name": "Imposed"`, "cases[2].name", `load cases 2 and 3 are named "imposed" and "Imposed", one name to Stave`},
		{"case unnamed", `"name": "thermal"`, `"name": ""`, "cases[2].name", "has no name"},
		{"load in a case", `[0, -500]`, `[0, -500], [9, -500]`, "cases[0].loads[1].points[1][0]", "outside the member"},
		{"case unknown key", `"by_span": true`, `"by_spans": true`, "cases[1].by_spans", "unknown key"},
		{"no factors", `"factors": [`, `"factors": [], "x": [`, "combinations[0].factors", "combines no load cases"},
		{"case and train in one factor", `"case": "imposed"`, `"case": "imposed", "train": "hoist"`, "combinations[0].factors[1].case", `factor 2 of combination 1 names both a load case and a moving load train: give each its own entry, {"case": NAME, "factor": F} or {"train": NAME, "factor": F}`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			if !strings.Contains(good, tt.from) {
				t.Fatalf("the file has no %s", tt.from)
			}
			_, err := Unmarshal([]byte(strings.Replace(good, tt.from, tt.to, 1)))
			var le *LoadError
			if !errors.As(err, &le) {
				t.Fatalf("error %v, want a *LoadError", err)
			}
			for _, p := range le.Problems {
				if p.Path == tt.path && strings.Contains(p.Message, tt.says) {
					return
				}
			}
			t.Errorf("no problem at %s saying %q; got:\n%s", tt.path, tt.says, listProblems(le.Problems))
		})
	}
}

// A case that takes the self-weight needs the file's gravity; top-level
// loads beside cases are refused where they are.
func TestCasesFileRules(t *testing.T) {
	p := casesProject()
	p.Model.Gravity = [2]float64{}
	problems := check(p)
	if !hasProblem(problems, "cases[0].self_weight", "no gravity") {
		t.Errorf("no problem at cases[0].self_weight; got:\n%s", listProblems(problems))
	}
	p = casesProject()
	p.Model.PointLoads = []fem.PointLoad{{X: 1, Transverse: -1}}
	p.Model.TemperatureChange = 4
	problems = check(p)
	if !hasProblem(problems, "loads[0]", "outside the load cases") || !hasProblem(problems, "temperature_change", "outside the load cases") {
		t.Errorf("no problem at loads[0] and temperature_change; got:\n%s", listProblems(problems))
	}
}

func hasProblem(problems []Problem, path, says string) bool {
	for _, p := range problems {
		if p.Path == path && strings.Contains(p.Message, says) {
			return true
		}
	}
	return false
}

// Saving never drops what a project holds: a model that would not open
// (an empty case) is still written whole, and what no file can hold is
// refused at its place.
func TestCasesSaveKeepsEverything(t *testing.T) {
	p := casesProject()
	p.Model.Cases = append(p.Model.Cases, fem.LoadCase{Name: "wind (to do)"})
	data := mustMarshal(t, p)
	if !strings.Contains(string(data), `"name": "wind (to do)"`) {
		t.Error("the empty case was not written")
	}
	if err := Validate(p); err == nil || !strings.Contains(err.Error(), "cases[3]") {
		t.Errorf("Validate: %v, want the empty case named at cases[3]", err)
	}
	p.Model.Combinations[1].Factors[0].Factor = math.NaN()
	p.Model.Combinations[0].Factors[2].Case = 7
	_, err := Marshal(p)
	var se *SaveError
	if !errors.As(err, &se) || !hasProblem(se.Problems, "combinations[1].factors[0].factor", "finite") || !hasProblem(se.Problems, "combinations[0].factors[2].case", "there are 4") {
		t.Errorf("Marshal: %v, want the NaN factor and the unknown case named", err)
	}
}

// A version 1 file, whose loads lie at the top level, opens as a model
// without cases: one load set, shown as the one case "loads". Saved, it is
// a version 2 file with its loads still at the top level and no "cases".
func TestVersion1OpensAsOneCase(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("testdata", "version1", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	p, err := Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	m := &p.Model
	if m.LoadSetCount() != 1 || m.LoadSetName(0) != "loads" || len(m.Cases) != 0 {
		t.Errorf("%d load sets named %q, %d cases; want one, \"loads\", none", m.LoadSetCount(), m.LoadSetName(0), len(m.Cases))
	}
	if len(m.PointLoads)+len(m.DistributedLoad) == 0 || m.Gravity == [2]float64{} {
		t.Error("the version 1 loads were not read")
	}
	saved := string(mustMarshal(t, p))
	if !strings.Contains(saved, `"version": 2`) || strings.Contains(saved, `"cases"`) || !strings.Contains(saved, `"loads": [`) {
		t.Errorf("saved as:\n%s", saved)
	}
}
