package storage

import (
	"errors"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"stave/fem"
)

func readDemo(t *testing.T) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	return string(data)
}

// One row per kind of problem a file can have. Each row edits the demo file
// once and expects a problem at path whose message holds phrase.
func TestDecodeReportsEachKindOfProblem(t *testing.T) {
	demo := readDemo(t)
	tests := []struct {
		name         string
		old, new     string // the edit of the demo file
		whole        string // or instead the whole file
		suffix       string // or text added after the demo file
		path, phrase string
	}{
		{name: "not JSON", old: `"version": 2,`, new: `"version": 2,,`, path: "", phrase: "line 3"},
		{name: "cut off", whole: `{"format": "stave-member", "version": 1`, path: "", phrase: "ends too early"},
		{name: "text after the project", suffix: "}\n", path: "", phrase: "more text follows"},
		{name: "duplicate key", old: `"format": "stave-member",`, new: `"format": "stave-member", "format": "stave-member",`, path: "", phrase: "appears twice"},
		{name: "not an object", whole: "[1, 2]\n", path: "", phrase: "not a Stave project"},
		{name: "format missing", old: `"format": "stave-member",`, new: ``, path: "format", phrase: "missing"},
		{name: "format of another program", old: `"format": "stave-member"`, new: `"format": "spreadsheet"`, path: "format", phrase: "not a Stave project file"},
		{name: "newer version", old: `"version": 2`, new: `"version": 3`, path: "version", phrase: "newer Stave (format version 3); this version reads up to 2 — update Stave"},
		{name: "older version without migration", old: `"version": 2`, new: `"version": 0`, path: "version", phrase: "older than any"},
		{name: "version not whole", old: `"version": 2`, new: `"version": 1.5`, path: "version", phrase: "whole number"},
		{name: "units other than SI", old: `"length": "m"`, new: `"length": "mm"`, path: "units.length", phrase: `SI base units only; convert the values to m`},
		{name: "unit declaration missing", old: `"moment": "N·m",`, new: ``, path: "units.moment", phrase: `missing; add "moment": "N·m"`},
		{name: "unknown key at the top", old: `"mesh": {`, new: `"colour": "red", "mesh": {`, path: "colour", phrase: "unknown key"},
		{name: "unknown key in a section", old: `"area": 0.0243,`, new: `"area": 0.0243, "height": 0.27,`, path: "member.segments[0].section.height", phrase: "keys allowed here: area, second_moment, fibre_distance, depth"},
		{name: "wrong type", old: `"area": 0.0243,`, new: `"area": "0.0243",`, path: "member.segments[0].section.area", phrase: "expected a number in m², found text"},
		{name: "number of no unit as text", old: `"safety_factor": 1`, new: `"safety_factor": "1"`, path: "view.safety_factor", phrase: "expected a number (no unit), found text"},
		{name: "count as text", old: `"elements": 22,`, new: `"elements": "22",`, path: "mesh.elements", phrase: "expected a number (a count), found text"},
		{name: "limit too large", old: `"deflection_limit": 360`, new: `"deflection_limit": 1e999`, path: "view.deflection_limit", phrase: "1e999 is too large for a number; enter a value (n in span/n)"},
		{name: "null", old: `"density": 420,`, new: `"density": null,`, path: "member.segments[0].material.density", phrase: "found null"},
		{name: "required value missing", old: `"second_moment": 8.54296875e-5,`, new: ``, path: "member.segments[1].section.second_moment", phrase: "missing"},
		{name: "number too large", old: `"elastic_modulus": 1.15e10,`, new: `"elastic_modulus": 1e999,`, path: "member.segments[0].material.elastic_modulus", phrase: "too large"},
		{name: "unknown support kind", old: `"kind": "pinned"`, new: `"kind": "hinge"`, path: "supports[0].kind", phrase: `"hinge" is not a support kind`},
		{name: "stiffness on a rigid support", old: `"kind": "pinned"`, new: `"kind": "pinned", "stiffness": {"axial": 1}`, path: "supports[0].stiffness.axial", phrase: "support 1 is a pinned support, which holds the axial motion rigidly, so a stiffness for that motion has no effect"},
		{name: "roller with a rotational spring", old: `"kind": "roller"`, new: `"kind": "roller", "stiffness": {"rotation": -5}`, path: "supports[1].stiffness.rotation", phrase: "must not be negative"},
		{name: "spring without stiffness", old: `"kind": "pinned"`, new: `"kind": "spring"`, path: "supports[0].stiffness", phrase: "missing"},
		{name: "settlement of a free motion", old: `"kind": "pinned"`, new: `"kind": "pinned", "settlement": {"rotation": 0.01}`, path: "supports[0].settlement.rotation", phrase: "leaves the rotation motion free"},
		{name: "unknown load kind", old: `"kind": "point"`, new: `"kind": "pont"`, path: "loads[0].kind", phrase: `"pont" is not a load kind`},
		{name: "unknown load direction", old: `"direction": "transverse"`, new: `"direction": "sideways"`, path: "loads[1].direction", phrase: "not a load direction"},
		{name: "load point not a pair", old: `[0.5, -1500]`, new: `[0.5]`, path: "loads[1].points[0]", phrase: "expected a pair"},
		{name: "element count not whole", old: `"elements": 22,`, new: `"elements": 22.5,`, path: "mesh.elements", phrase: "not a whole number"},
		{name: "flag not true or false", old: `"nodes": false`, new: `"nodes": 0`, path: "view.overlays.nodes", phrase: "expected true or false"},
		{name: "point load off the member", old: `"x": 4.2,`, new: `"x": 6.2,`, path: "loads[0].x", phrase: "lies outside the member"},
		{name: "load points out of order", old: `[2.8, -3000]`, new: `[0.4, -3000]`, path: "loads[1].points[1][0]", phrase: "increasing x"},
		{name: "segments with a gap", old: `"start": 3,`, new: `"start": 3.1,`, path: "member.segments[1].start", phrase: "gap"},
		{name: "zero area", old: `"area": 0.02025,`, new: `"area": 0,`, path: "member.segments[1].section.area", phrase: "must be positive"},
		{name: "two supports at one point", old: `"x": 3,`, new: `"x": 5.5,`, path: "supports[2].x", phrase: "both at x = 5.5 m"},
		{name: "display units unknown", old: `"units": "SI"`, new: `"units": "imperial"`, path: "view.units", phrase: `use "SI" or "US"`},
		{name: "safety factor zero", old: `"safety_factor": 1`, new: `"safety_factor": 0`, path: "view.safety_factor", phrase: "above zero"},
		{name: "segments a nanometre apart", old: `"start": 3,`, new: `"start": 3.000000001,`, path: "member.segments[1].start", phrase: "(ends at x = 3.0 m) and segment 2 (starts at x = 3.000000001 m)"},
		{name: "modulus of 5e-324", old: `"elastic_modulus": 1.15e10,`, new: `"elastic_modulus": 5e-324,`, path: "member.segments[0]", phrase: "(E = 5e-324 Pa, A = 0.0243 m², ℓ = 3.0 m), outside the range the solvers work in (1e-150 to 1e+150 N/m)"},
		{name: "member 1e300 m long", old: `"end": 5.5,`, new: `"end": 1e300,`, path: "member.segments[1]", phrase: "ℓ = 1e+300 m), outside the range the solvers work in"},
		{name: "spring of 1e200", old: `"kind": "roller"`, new: `"kind": "spring", "stiffness": {"transverse": 1e200}`, path: "supports[1].stiffness.transverse", phrase: "1e+200 N/m, outside the range the solvers work in"},
		{name: "a billion elements", old: `"elements": 22,`, new: `"elements": 1000000000,`, path: "mesh.elements", phrase: "more than the 4.3 GB allowed: ask for fewer elements or a longer maximum element length (up to about 1.07e+07 elements fit)"},
		{name: "element length of 5e-324", old: `"max_element_length": 0.25`, new: `"max_element_length": 5e-324`, path: "mesh.elements", phrase: "the mesh would need more than 1e+299 GB of memory"},
		{name: "area that underflows", old: `"area": 0.0243,`, new: `"area": 1e-400,`, path: "member.segments[0].section.area", phrase: "1e-400 is too small for a number and would read as 0"},
		{name: "bar order 0", old: `"elements": 22,`, new: `"elements": 22, "bar_order": 0,`, path: "mesh.bar_order", phrase: "0 is not a bar element order; enter 1 (linear) or 2 (quadratic), or leave bar_order out for linear"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			text := tt.whole
			if text == "" {
				if !strings.Contains(demo, tt.old) {
					t.Fatalf("the demo file has no %q to edit", tt.old)
				}
				text = strings.Replace(demo, tt.old, tt.new, 1) + tt.suffix
			}
			p, err := Unmarshal([]byte(text))
			if p != nil {
				t.Errorf("a file with a problem gave a project")
			}
			var le *LoadError
			if !errors.As(err, &le) {
				t.Fatalf("error %v is not a *LoadError", err)
			}
			for _, q := range le.Problems {
				if q.Path == tt.path && strings.Contains(q.Message, tt.phrase) {
					return
				}
			}
			t.Errorf("no problem at %q saying %q; got:\n%v", tt.path, tt.phrase, err)
		})
	}
}

// A file with several problems reports them all, each once, in one error.
func TestDecodeReportsAllProblemsAtOnce(t *testing.T) {
	text := readDemo(t)
	for _, edit := range [][2]string{
		{`"area": 0.0243,`, `"area": "big",`},
		{`"kind": "roller"`, `"kind": "wheel"`},
		{`"x": 4.2,`, `"x": 9,`},
		{`"elements": 22,`, `"elements": 22, "refine": true,`},
	} {
		text = strings.Replace(text, edit[0], edit[1], 1)
	}
	_, err := Unmarshal([]byte(text))
	var le *LoadError
	if !errors.As(err, &le) {
		t.Fatalf("error %v is not a *LoadError", err)
	}
	want := []string{"member.segments[0].section.area", "supports[1].kind", "loads[0].x", "mesh.refine"}
	var got []string
	for _, q := range le.Problems {
		got = append(got, q.Path)
	}
	slices.Sort(got)
	slices.Sort(want)
	if !slices.Equal(got, want) {
		t.Errorf("problems at %v, want exactly %v; error:\n%v", got, want, err)
	}
	for _, w := range want {
		if !strings.Contains(err.Error(), w+": ") {
			t.Errorf("the message does not name %s:\n%v", w, err)
		}
	}
}

// migrate applies the steps of its table in order and stamps the version.
func TestMigrateAppliesStepsInOrder(t *testing.T) {
	var applied []int
	step := func(from int) migration {
		return func(top *node) error {
			applied = append(applied, from)
			top.fields["step"] = &node{kind: numberNode, text: "x"}
			return nil
		}
	}
	table := map[int]migration{1: step(1), 2: step(2), 3: step(3)}
	top := &node{kind: objectNode, fields: map[string]*node{"version": {kind: numberNode, text: "1"}}}
	if err := migrate(top, 1, 4, table); err != nil {
		t.Fatal(err)
	}
	if len(applied) != 3 || applied[0] != 1 || applied[1] != 2 || applied[2] != 3 {
		t.Errorf("steps applied %v, want [1 2 3]", applied)
	}
	if v := top.fields["version"].text; v != "4" {
		t.Errorf("version after migrating is %s, want 4", v)
	}

	applied = nil
	delete(table, 2)
	err := migrate(top, 1, 4, table)
	if err == nil || !strings.Contains(err.Error(), "reads versions 3 to 4") {
		t.Errorf("migrating from a version the table does not reach: %v", err)
	}
	if len(applied) != 0 {
		t.Errorf("steps %v ran before the missing one was found", applied)
	}
}

// Every place a fem.Problem can name maps to the file's key for it, with the
// loads numbered in file order (docs/format.md).
func TestModelPathOfEveryProperty(t *testing.T) {
	// File order: distributed load 0, point load 0, point load 1.
	// Case 1's loads: point load 0 second, distributed load 0 first.
	loads := [][2][]string{
		{PointLoad: {"loads[1]", "loads[2]"}, DistributedLoad: {"loads[0]"}},
		{PointLoad: {"cases[0].loads[1]"}, DistributedLoad: {"cases[0].loads[0]"}},
	}
	at := func(kind fem.ItemKind, i int, p fem.Property) fem.Place {
		return fem.Place{Item: fem.Item{Kind: kind, Index: i}, Property: p}
	}
	model, mesh := func(p fem.Property) fem.Place { return at(fem.ModelItem, -1, p) }, func(p fem.Property) fem.Place { return at(fem.MeshItem, -1, p) }
	spring := at(fem.SupportItem, 2, fem.MotionStiffnessProperty)
	spring.Dof = fem.Rotation
	settlement := at(fem.SupportItem, 0, fem.SettlementProperty)
	settlement.Dof = fem.Transverse
	gravityX, gravityY := model(fem.GravityProperty), model(fem.GravityProperty)
	gravityY.Dof = fem.Transverse
	pointX, intensity := at(fem.DistributedLoadItem, 0, fem.PointXProperty), at(fem.DistributedLoadItem, 0, fem.PointIntensityProperty)
	pointX.Vertex, intensity.Vertex = 2, 3
	inCase := func(p fem.Place) fem.Place { p.Item.Case = 1; return p }
	factorCase, factor := at(fem.CombinationItem, 2, fem.FactorCaseProperty), at(fem.CombinationItem, 2, fem.FactorProperty)
	factorCase.Vertex, factor.Vertex = 1, 1
	tests := []struct {
		place fem.Place
		path  string
	}{
		{model(fem.NoProperty), ""},
		{model(fem.SegmentsProperty), "member.segments"},
		{gravityX, "self_weight.gravity_x"},
		{gravityY, "self_weight.gravity_y"},
		{model(fem.TemperatureChangeProperty), "temperature_change"},
		{at(fem.SegmentItem, 1, fem.NoProperty), "member.segments[1]"},
		{at(fem.SegmentItem, 1, fem.StartProperty), "member.segments[1].start"},
		{at(fem.SegmentItem, 0, fem.EndProperty), "member.segments[0].end"},
		{at(fem.SegmentItem, 0, fem.AreaProperty), "member.segments[0].section.area"},
		{at(fem.SegmentItem, 0, fem.SecondMomentProperty), "member.segments[0].section.second_moment"},
		{at(fem.SegmentItem, 0, fem.FibreDistanceProperty), "member.segments[0].section.fibre_distance"},
		{at(fem.SegmentItem, 0, fem.ElasticProperty), "member.segments[0].material.elastic_modulus"},
		{at(fem.SegmentItem, 0, fem.DensityProperty), "member.segments[0].material.density"},
		{at(fem.SegmentItem, 0, fem.ThermalExpansionProperty), "member.segments[0].material.thermal_expansion"},
		{at(fem.SegmentItem, 0, fem.AllowableProperty), "member.segments[0].material.allowable_stress"},
		{at(fem.SegmentItem, 0, fem.DepthProperty), "member.segments[0].section.depth"},
		{at(fem.SegmentItem, 0, fem.TemperatureDifferenceProperty), "member.segments[0].temperature_difference"},
		{at(fem.SegmentItem, 0, fem.ShearAreaProperty), "member.segments[0].section.shear_area"},
		{at(fem.SegmentItem, 0, fem.ShearCoefficientProperty), "member.segments[0].section.shear_coefficient"},
		{at(fem.SegmentItem, 0, fem.ShearModulusProperty), "member.segments[0].material.shear_modulus"},
		{at(fem.SegmentItem, 0, fem.PoissonProperty), "member.segments[0].material.poisson"},
		{at(fem.SupportItem, 2, fem.PositionProperty), "supports[2].x"},
		{at(fem.SupportItem, 2, fem.KindProperty), "supports[2].kind"},
		{at(fem.SupportItem, 2, fem.StiffnessProperty), "supports[2].stiffness"},
		{spring, "supports[2].stiffness.rotation"},
		{settlement, "supports[0].settlement.transverse"},
		{at(fem.PointLoadItem, 1, fem.PositionProperty), "loads[2].x"},
		{at(fem.PointLoadItem, 0, fem.AxialForceProperty), "loads[1].axial"},
		{at(fem.PointLoadItem, 0, fem.TransverseForceProperty), "loads[1].transverse"},
		{at(fem.PointLoadItem, 0, fem.MomentProperty), "loads[1].moment"},
		{at(fem.DistributedLoadItem, 0, fem.DirectionProperty), "loads[0].direction"},
		{at(fem.DistributedLoadItem, 0, fem.PointsProperty), "loads[0].points"},
		{pointX, "loads[0].points[2][0]"},
		{intensity, "loads[0].points[3][1]"},
		{mesh(fem.NoProperty), "mesh"},
		{mesh(fem.ElementsProperty), "mesh.elements"},
		{mesh(fem.MaxElementLengthProperty), "mesh.max_element_length"},
		{mesh(fem.BarOrderProperty), "mesh.bar_order"},
		{at(fem.HingeItem, 1, fem.PositionProperty), "hinges[1].x"},
		{at(fem.HingeItem, 0, fem.StiffnessProperty), "hinges[0].stiffness"},
		{at(fem.FoundationItem, 1, fem.StartProperty), "foundations[1].start"},
		{at(fem.FoundationItem, 0, fem.EndProperty), "foundations[0].end"},
		{at(fem.FoundationItem, 0, fem.ModulusProperty), "foundations[0].modulus"},
		{at(fem.FoundationItem, 2, fem.AxialModulusProperty), "foundations[2].axial_modulus"},
		{inCase(at(fem.PointLoadItem, 0, fem.PositionProperty)), "cases[0].loads[1].x"},
		{inCase(pointX), "cases[0].loads[0].points[2][0]"},
		{at(fem.CaseItem, 1, fem.NoProperty), "cases[1]"},
		{at(fem.CaseItem, 1, fem.NameProperty), "cases[1].name"},
		{at(fem.CaseItem, 0, fem.TemperatureChangeProperty), "cases[0].temperature_change"},
		{at(fem.CombinationItem, 2, fem.NameProperty), "combinations[2].name"},
		{at(fem.CombinationItem, 2, fem.FactorsProperty), "combinations[2].factors"},
		{at(fem.CombinationItem, 2, fem.CombinationKindProperty), "combinations[2].kind"},
		{factorCase, "combinations[2].factors[1].case"},
		{factor, "combinations[2].factors[1].factor"},
	}
	covered := map[fem.Property]bool{}
	for _, tt := range tests {
		covered[tt.place.Property] = true
		if got := modelPath(tt.place, loads); got != tt.path {
			t.Errorf("%+v: path %q, want %q", tt.place, got, tt.path)
		}
	}
	for p := fem.NoProperty; p <= fem.AxialModulusProperty; p++ {
		if !covered[p] {
			t.Errorf("property %d has no row in this table", p)
		}
	}
}

// A file with several problems lists them in the file's order, top to
// bottom, loads by their place in the list whatever their kind, the
// problems the reader finds (a value of the wrong type) among those the
// model's checks find; the sentences number point and distributed loads
// each on their own, as the window's drawing and properties do, and the
// path gives the load's place in the file's list.
func TestDecodeListsProblemsInFileOrder(t *testing.T) {
	text := readDemo(t)
	start := strings.Index(text, `"loads": [`)
	end := strings.Index(text, `"self_weight"`)
	if start < 0 || end < start {
		t.Fatal("the demo file has no loads before its self-weight")
	}
	loads := `"loads": [
		{"kind": "distributed", "direction": "transverse", "points": [[1, -5], [1, -5]]},
		{"kind": "point", "x": 99, "transverse": -1},
		{"kind": "point", "x": 1, "moment": "big"},
		{"kind": "distributed", "direction": "axial", "points": [[0, -5], [99, -5]]},
		{"kind": "point", "x": -5}
	],
	`
	text = text[:start] + loads + text[end:]
	for _, edit := range [][2]string{
		{`"area": 0.0243,`, `"area": 0,`},
		{`"elements": 22,`, `"elements": -1,`},
	} {
		text = strings.Replace(text, edit[0], edit[1], 1)
	}
	_, err := Unmarshal([]byte(text))
	var le *LoadError
	if !errors.As(err, &le) {
		t.Fatalf("error %v is not a *LoadError", err)
	}
	want := []struct{ path, phrase string }{
		{"member.segments[0].section.area", "segment 1"},
		{"loads[0].points", "distributed load 1 starts and ends"},
		{"loads[1].x", "point load 1 at x = 99.0 m"},
		{"loads[2].moment", "expected a number"},
		{"loads[3].points[1][0]", "distributed load 2: point 2 at x = 99.0 m"},
		{"loads[4].x", "point load 3 at x = -5.0 m"},
		{"mesh.elements", "-1 elements"},
	}
	if len(le.Problems) != len(want) {
		t.Fatalf("%d problems, want %d:\n%v", len(le.Problems), len(want), err)
	}
	for i, w := range want {
		if q := le.Problems[i]; q.Path != w.path || !strings.Contains(q.Message, w.phrase) {
			t.Errorf("problem %d is %s: %s; want %s: …%s…\nall:\n%v", i+1, q.Path, q.Message, w.path, w.phrase, err)
		}
	}
}
