package fem

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// validModel is a small model that passes validation; each table row breaks one thing.
func validModel() *Model {
	return &Model{
		Segments:        []Segment{testSegment(0, 1), testSegment(1, 3)},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: 3, Kind: Roller}},
		PointLoads:      []PointLoad{{X: 1.5, Transverse: -1e3}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -1e3}, {3, -2e3}}}},
		Mesh:            MeshSettings{Elements: 10},
	}
}

func TestValidate(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name  string
		edit  func(m *Model)
		item  string
		index int
		field string
		text  string // part of the message
	}{
		{"no segments", func(m *Model) { m.Segments = nil }, "model", -1, "segments", "the member has no segments"},
		{"zero length segment", func(m *Model) { m.Segments[1].End = 1 }, "segment", 1, "end", "segment 2 runs from x = 1.0 m to x = 1.0 m"},
		{"negative E", func(m *Model) { m.Segments[0].Material.Elastic = -2e11 }, "segment", 0, "elastic", "segment 1: Young's modulus E is -2e+11 Pa: it must be positive"},
		{"zero area", func(m *Model) { m.Segments[0].Section.Area = 0 }, "segment", 0, "area", "the area A is 0.0 m²"},
		{"zero I", func(m *Model) { m.Segments[1].Section.SecondMoment = 0 }, "segment", 1, "second moment", "segment 2: the second moment of area I"},
		{"negative c", func(m *Model) { m.Segments[1].Section.FibreDistance = -0.1 }, "segment", 1, "fibre distance", "extreme fibre distance c is -0.1 m"},
		{"NaN E", func(m *Model) { m.Segments[0].Material.Elastic = nan }, "segment", 0, "elastic", "is NaN: enter a finite value in Pa"},
		{"negative density", func(m *Model) { m.Segments[0].Material.Density = -1 }, "segment", 0, "density", "must be zero or positive"},
		{"negative allowable", func(m *Model) { m.Segments[0].Material.Allowable = -1 }, "segment", 0, "allowable", "the allowable stress is -1.0 Pa"},
		{"infinite expansion", func(m *Model) { m.Segments[0].Material.ThermalExpansion = inf }, "segment", 0, "thermal expansion", "thermal expansion coefficient is +Inf"},
		{"does not start at 0", func(m *Model) { m.Segments[0].Start = 0.5 }, "segment", 0, "start", "segment 1 starts at x = 0.5 m: the member must start at x = 0"},
		{"gap", func(m *Model) { m.Segments[1].Start = 1.2 }, "segment", 1, "start", "there is a gap between segment 1"},
		{"overlap", func(m *Model) { m.Segments[1].Start = 0.8 }, "segment", 1, "start", "segment 2 (starts at x = 0.8 m) overlaps segment 1"},
		{"segment end NaN", func(m *Model) { m.Segments[0].End = nan }, "segment", 0, "end", "segment 1: its end is NaN"},
		{"support outside", func(m *Model) { m.Supports[1].X = 3.2 }, "support", 1, "x", "support 2 at x = 3.2 m lies outside the member (length 3.0 m)"},
		{"support NaN", func(m *Model) { m.Supports[0].X = nan }, "support", 0, "x", "support 1: its position is NaN"},
		{"two supports at one point", func(m *Model) { m.Supports[1].X = 0 }, "support", 1, "x", "supports 1 and 2 are both at x = 0.0 m"},
		{"unknown kind", func(m *Model) { m.Supports[0].Kind = 17 }, "support", 0, "kind", "support 1 has an unknown kind (17)"},
		{"negative spring", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{0, -5, 0}} }, "support", 1, "stiffness[1]", "transverse spring stiffness is -5.0 N/m"},
		{"spring without stiffness", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring} }, "support", 1, "stiffness", "support 2 is a spring with no stiffness"},
		{"NaN settlement", func(m *Model) { m.Supports[0].Settlement[Transverse] = nan }, "support", 0, "settlement[1]", "the transverse settlement is NaN"},
		{"point load outside", func(m *Model) { m.PointLoads[0].X = -1 }, "point load", 0, "x", "point load 1 at x = -1.0 m lies outside the member"},
		{"point load infinite", func(m *Model) { m.PointLoads[0].Moment = inf }, "point load", 0, "moment", "the moment is +Inf"},
		{"one load point", func(m *Model) { m.DistributedLoad[0].Points = m.DistributedLoad[0].Points[:1] }, "distributed load", 0, "points", "distributed load 1 has 1 point(s)"},
		{"zero span", func(m *Model) { m.DistributedLoad[0].Points[1].X = 0 }, "distributed load", 0, "points", "starts and ends at x = 0.0 m"},
		{"unsorted points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {2, 1}, {1, 1}, {3, 1}}
		}, "distributed load", 0, "points[2].x", "point 3 (x = 1.0 m) does not lie beyond point 2"},
		{"duplicate points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {1, 1}, {1, 2}, {3, 1}}
		}, "distributed load", 0, "points[2].x", "list the points in increasing x without repeats"},
		{"load point outside", func(m *Model) { m.DistributedLoad[0].Points[1].X = 4 }, "distributed load", 0, "points[1].x", "point 2 at x = 4.0 m lies outside"},
		{"load intensity NaN", func(m *Model) { m.DistributedLoad[0].Points[0].Intensity = nan }, "distributed load", 0, "points[0].intensity", "intensity NaN"},
		{"bad direction", func(m *Model) { m.DistributedLoad[0].Direction = Rotation }, "distributed load", 0, "direction", "choose axial or transverse"},
		{"gravity NaN", func(m *Model) { m.Gravity[1] = nan }, "model", -1, "gravity[1]", "the gravity component 2 is NaN"},
		{"temperature infinite", func(m *Model) { m.TemperatureChange = -inf }, "model", -1, "temperature change", "temperature change is -Inf"},
		{"negative element count", func(m *Model) { m.Mesh.Elements = -3 }, "mesh", -1, "elements", "the mesh asks for -3 elements"},
		{"negative element length", func(m *Model) { m.Mesh.MaxElementLength = -0.1 }, "mesh", -1, "max element length", "maximum element length is -0.1 m"},
		{"bad bar order", func(m *Model) { m.Mesh.BarOrder = 3 }, "mesh", -1, "bar order", "the bar element order is 3"},
		{"too many elements", func(m *Model) { m.Mesh.Elements = 2_000_000_000 }, "mesh", -1, "elements", "the mesh would need about 800.0 GB"},
		{"too short elements", func(m *Model) { m.Mesh.MaxElementLength = 1e-9 }, "mesh", -1, "elements", "ask for fewer elements or a longer maximum element length"},
	}
	if err := validModel().Validate(); err != nil {
		t.Fatalf("the base model is invalid: %v", err)
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := validModel()
			c.edit(m)
			err := m.Validate()
			var ve *ValidationError
			if !errors.As(err, &ve) {
				t.Fatalf("got %v, want a *ValidationError", err)
			}
			for _, p := range ve.Problems {
				if p.Item == c.item && p.Index == c.index && p.Field == c.field && strings.Contains(p.Message, c.text) {
					return
				}
			}
			t.Errorf("no problem (%s %d %q ~ %q) in\n%v", c.item, c.index, c.field, c.text, err)
		})
	}
}

// All problems come back at once, each in the error text.
func TestValidateReportsAll(t *testing.T) {
	m := validModel()
	m.Segments[0].Section.Area = -1
	m.Supports[1].X = 9
	m.PointLoads[0].X = math.NaN()
	err := m.Validate()
	var ve *ValidationError
	if !errors.As(err, &ve) || len(ve.Problems) != 3 {
		t.Fatalf("got %v, want three problems", err)
	}
	text := err.Error()
	if !strings.HasPrefix(text, "the model has 3 problems:") || strings.Count(text, "\n- ") != 3 {
		t.Errorf("error text does not list the three problems:\n%s", text)
	}
	var nilModel *Model
	if err := nilModel.Validate(); err == nil {
		t.Errorf("a nil model passed validation")
	}
	if _, err := Solve(nil); err == nil {
		t.Errorf("Solve(nil) succeeded")
	}
	if _, err := Solve(&Model{}); err == nil {
		t.Errorf("Solve of an empty model succeeded")
	}
}
