package main

import (
	"encoding/json"
	"math"
	"testing"
)

// nodalJSON is what the tests read of solve --json's nodal_loads.
type nodalJSON struct {
	NodalLoads *struct {
		LoadedNodes int  `json:"loaded_nodes"`
		Listed      bool `json:"nodes_listed"`
		Nodes       []struct {
			X, Axial, Transverse, Moment float64
			Middle                       bool   `json:"middle_node"`
			XUnit                        string `json:"x_unit"`
			ForceUnit                    string `json:"force_unit"`
			MomentUnit                   string `json:"moment_unit"`
		} `json:"nodes"`
		Sum, Resultant struct{ Axial, Transverse, Moment float64 }
	} `json:"nodal_loads"`
}

// solveNodal runs solve --json on the simply supported beam of L = 4 m
// under q = −10 kN/m (testdata) as edit changes it and returns its nodal
// loads.
func solveNodal(t *testing.T, edit func(m map[string]any)) nodalJSON {
	t.Helper()
	path := variant(t, t.TempDir(), "beam", edit)
	_, out, stderr := runStave(t, "solve", "--json", path)
	var doc nodalJSON
	if err := json.Unmarshal([]byte(out), &doc); err != nil || doc.NodalLoads == nil {
		t.Fatalf("solve --json: nodal_loads %v, error %v, stderr %q", doc.NodalLoads, err, stderr)
	}
	return doc
}

// elements sets the mesh to n elements.
func elements(n int) func(m map[string]any) {
	return func(m map[string]any) { m["mesh"] = map[string]any{"elements": n} }
}

// solve --json lists the consistent nodal loads the window's strip shows:
// on 8 Hermite elements of h = 0.5 m under q = −10 kN/m, q·h/2 = −2.5 kN
// and ±q·h²/12 = ∓208.3 N·m at the ends, q·h = −5 kN and no moment inside
// (the consistent load vector of a uniformly loaded Hermite beam element,
// [qh/2, qh²/12, qh/2, −qh²/12], a textbook closed form, from memory); they
// add up to the load's resultant q·L = −40 kN and its moment about x = 0,
// q·L²/2 = −80 kN·m.
func TestSolveJSONNodalLoads(t *testing.T) {
	const q, h, L = -10e3, 0.5, 4.0
	nl := solveNodal(t, elements(8)).NodalLoads
	if !nl.Listed || nl.LoadedNodes != 9 || len(nl.Nodes) != 9 {
		t.Fatalf("listed %v, %d loaded nodes, %d in the list; want all 9", nl.Listed, nl.LoadedNodes, len(nl.Nodes))
	}
	near := func(got, want float64) bool { return math.Abs(got-want) <= 1e-9*math.Abs(q*L*L) }
	for i, n := range nl.Nodes {
		force, moment := q*h, 0.0
		switch i {
		case 0:
			force, moment = q*h/2, q*h*h/12
		case 8:
			force, moment = q*h/2, -q*h*h/12
		}
		if n.XUnit != "m" || n.ForceUnit != "N" || n.MomentUnit != "N·m" {
			t.Errorf("node %d: units %q, %q, %q; want SI: m, N, N·m", i, n.XUnit, n.ForceUnit, n.MomentUnit)
		}
		if !near(n.X, float64(i)*h) || !near(n.Transverse, force) || !near(n.Moment, moment) || n.Axial != 0 {
			t.Errorf("node %d: %+v, want x = %g, transverse %g, moment %g, axial 0", i, n, float64(i)*h, force, moment)
		}
	}
	for _, s := range []struct{ Axial, Transverse, Moment float64 }{nl.Sum, nl.Resultant} {
		if s.Axial != 0 || !near(s.Transverse, q*L) || !near(s.Moment, q*L*L/2) {
			t.Errorf("sum %+v, want transverse %g and moment %g about x = 0", s, q*L, q*L*L/2)
		}
	}
}

// Quadratic bar elements put h·p/6 on each end node and 2·h·p/3 on their
// middle node under a uniform axial load p (the consistent load vector of
// the three-node bar, p·h·[1/6, 2/3, 1/6], a textbook closed form, from
// memory): the list holds the middle nodes too, marked, so that it adds up
// to the load.
func TestSolveJSONNodalLoadsQuadraticBar(t *testing.T) {
	const p, h, L = 3e3, 1.0, 4.0
	nl := solveNodal(t, func(m map[string]any) {
		m["mesh"] = map[string]any{"elements": 4, "bar_order": 2}
		m["loads"] = []any{map[string]any{"kind": "distributed", "direction": "axial", "points": []any{[]any{0, p}, []any{L, p}}}}
	}).NodalLoads
	if len(nl.Nodes) != 9 {
		t.Fatalf("%d nodes listed, want 5 end nodes and 4 middle ones: %+v", len(nl.Nodes), nl.Nodes)
	}
	sum := 0.0
	for i, n := range nl.Nodes {
		want := p * h / 3 // two elements' ends meet
		switch {
		case i%2 == 1:
			want = 2 * p * h / 3
		case i == 0 || i == 8:
			want = p * h / 6
		}
		if n.Middle != (i%2 == 1) || math.Abs(n.X-float64(i)*h/2) > 1e-12 || math.Abs(n.Axial-want) > 1e-9*p*L || n.Transverse != 0 || n.Moment != 0 {
			t.Errorf("node %d: %+v, want x = %g, middle %v, axial %g", i, n, float64(i)*h/2, i%2 == 1, want)
		}
		sum += n.Axial
	}
	if math.Abs(sum-p*L) > 1e-9*p*L || math.Abs(nl.Sum.Axial-p*L) > 1e-9*p*L || math.Abs(nl.Resultant.Axial-p*L) > 1e-9*p*L {
		t.Errorf("the list adds up to %g, sum %g, resultant %g; want p·L = %g", sum, nl.Sum.Axial, nl.Resultant.Axial, p*L)
	}
}

// A mesh with more loaded nodes than the list holds gives their count and
// the sums, not a document of megabytes: 10,000 elements under the uniform
// load load 10,001 nodes.
func TestSolveJSONNodalLoadsBounded(t *testing.T) {
	const q, L = -10e3, 4.0
	nl := solveNodal(t, elements(10000)).NodalLoads
	if nl.Listed || nl.LoadedNodes != 10001 || len(nl.Nodes) != 0 {
		t.Errorf("listed %v, %d loaded nodes, %d in the list; want 10001 loaded and none listed", nl.Listed, nl.LoadedNodes, len(nl.Nodes))
	}
	if math.Abs(nl.Sum.Transverse-q*L) > 1e-9*math.Abs(q*L) {
		t.Errorf("sum %+v, want transverse %g", nl.Sum, q*L)
	}
}

// On a mesh of more elements than the list holds, the nodal loads are not
// worked out at all (their table took 0.7 s and 500 MB on 10⁶ elements,
// more than the whole solve): the key names the formulations, says the
// nodes are not listed and gives no count or sums.
func TestSolveJSONNodalLoadsNotWorkedOutOnAFineMesh(t *testing.T) {
	path := variant(t, t.TempDir(), "beam", elements(10001))
	_, out, stderr := runStave(t, "solve", "--json", path)
	var doc struct {
		NodalLoads map[string]any `json:"nodal_loads"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || doc.NodalLoads == nil {
		t.Fatalf("solve --json: nodal_loads %v, error %v, stderr %q", doc.NodalLoads, err, stderr)
	}
	nl := doc.NodalLoads
	if nl["bar"] != "linear bar" || nl["beam"] != "Hermite beam" || nl["nodes_listed"] != false {
		t.Errorf("nodal_loads %v: want the formulations and nodes_listed false", nl)
	}
	for _, k := range []string{"loaded_nodes", "sum", "resultant"} {
		if v, ok := nl[k]; !ok || v != nil {
			t.Errorf("nodal_loads.%s = %v, want null (not worked out)", k, v)
		}
	}
	if nodes, _ := nl["nodes"].([]any); nodes == nil || len(nodes) != 0 {
		t.Errorf("nodal_loads.nodes = %v, want an empty list", nl["nodes"])
	}
}

// A model with load cases has no nodal_loads: it has a set of loads per
// case and combination, not one for the document (two spans under
// −10 kN/m in every case, testdata).
func TestSolveJSONNodalLoadsOfCases(t *testing.T) {
	for _, show := range []string{"envelope", "both spans"} {
		_, out, stderr := runStave(t, "solve", "--json", "--show", show, "../../testdata/two_span_cases.json")
		var doc map[string]any
		if err := json.Unmarshal([]byte(out), &doc); err != nil || doc["solved"] != true {
			t.Fatalf("--show %s: %v, stderr %q", show, err, stderr)
		}
		if nl, ok := doc["nodal_loads"]; ok {
			t.Errorf("--show %s: nodal_loads %v, want none for a model with load cases", show, nl)
		}
	}
}

// solve --json names the elements solved: the beam of testdata under its
// uniform load names its Hermite beam; the same member declared axial-only
// under a load along it (the beam's loads taken off) has none, and its beam
// is null, on a mesh whose loads are listed and on one too fine to list
// them. It said "Hermite beam", a formulation that was not solved.
func TestSolveJSONNodalLoadsNameOnlyTheElementsSolved(t *testing.T) {
	tie := func(n int) func(m map[string]any) {
		return func(m map[string]any) {
			m["member"].(map[string]any)["axial_only"] = true
			m["supports"] = []any{map[string]any{"x": 0, "kind": "pinned"}}
			m["loads"] = []any{map[string]any{"kind": "distributed", "direction": "axial", "points": []any{[]any{0, 1e3}, []any{4, 1e3}}}}
			elements(n)(m)
		}
	}
	for _, c := range []struct {
		name string
		edit func(m map[string]any)
		beam any
	}{
		{"beam", elements(8), "Hermite beam"},
		{"tie", tie(8), nil},
		{"tie on a fine mesh", tie(10001), nil},
	} {
		t.Run(c.name, func(t *testing.T) {
			path := variant(t, t.TempDir(), "member", c.edit)
			_, out, stderr := runStave(t, "solve", "--json", path)
			var doc struct {
				NodalLoads map[string]any `json:"nodal_loads"`
			}
			if err := json.Unmarshal([]byte(out), &doc); err != nil || doc.NodalLoads == nil {
				t.Fatalf("solve --json: nodal_loads %v, error %v, stderr %q", doc.NodalLoads, err, stderr)
			}
			if beam, ok := doc.NodalLoads["beam"]; !ok || beam != c.beam || doc.NodalLoads["bar"] != "linear bar" {
				t.Errorf("nodal_loads bar %v, beam %v; want linear bar, %v", doc.NodalLoads["bar"], beam, c.beam)
			}
		})
	}
}
