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

// place is the place of property p of item i of a kind.
func place(kind ItemKind, i int, p Property) Place { return Place{Item: Item{kind, i}, Property: p} }

// validationCase edits validModel and expects a problem at place whose message holds text.
type validationCase struct {
	name  string
	edit  func(m *Model)
	place Place
	text  string // part of the message
}

func TestValidate(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	checkValidation(t, []validationCase{
		{"no segments", func(m *Model) { m.Segments = nil }, place(ModelItem, -1, SegmentsProperty), "the member has no segments"},
		{"zero length segment", func(m *Model) { m.Segments[1].End = 1 }, place(SegmentItem, 1, EndProperty), "segment 2 runs from x = 1.0 m to x = 1.0 m"},
		{"negative E", func(m *Model) { m.Segments[0].Material.Elastic = -2e11 }, place(SegmentItem, 0, ElasticProperty), "segment 1: Young's modulus E is -2e+11 Pa: it must be positive"},
		{"zero area", func(m *Model) { m.Segments[0].Section.Area = 0 }, place(SegmentItem, 0, AreaProperty), "the area A is 0.0 m²"},
		{"zero I", func(m *Model) { m.Segments[1].Section.SecondMoment = 0 }, place(SegmentItem, 1, SecondMomentProperty), "segment 2: the second moment of area I"},
		{"negative c", func(m *Model) { m.Segments[1].Section.FibreDistance = -0.1 }, place(SegmentItem, 1, FibreDistanceProperty), "extreme fibre distance c is -0.1 m"},
		{"NaN E", func(m *Model) { m.Segments[0].Material.Elastic = nan }, place(SegmentItem, 0, ElasticProperty), "is NaN: enter a finite value in Pa"},
		{"negative density", func(m *Model) { m.Segments[0].Material.Density = -1 }, place(SegmentItem, 0, DensityProperty), "must be zero or positive"},
		{"negative allowable", func(m *Model) { m.Segments[0].Material.Allowable = -1 }, place(SegmentItem, 0, AllowableProperty), "the allowable stress is -1.0 Pa"},
		{"infinite expansion", func(m *Model) { m.Segments[0].Material.ThermalExpansion = inf }, place(SegmentItem, 0, ThermalExpansionProperty), "thermal expansion coefficient is +Inf"},
		{"does not start at 0", func(m *Model) { m.Segments[0].Start = 0.5 }, place(SegmentItem, 0, StartProperty), "segment 1 starts at x = 0.5 m: the member must start at x = 0"},
		{"gap", func(m *Model) { m.Segments[1].Start = 1.2 }, place(SegmentItem, 1, StartProperty), "there is a gap between segment 1"},
		{"overlap", func(m *Model) { m.Segments[1].Start = 0.8 }, place(SegmentItem, 1, StartProperty), "segment 2 (starts at x = 0.8 m) overlaps segment 1"},
		{"segment end NaN", func(m *Model) { m.Segments[0].End = nan }, place(SegmentItem, 0, EndProperty), "segment 1: its end is NaN"},
		{"support outside", func(m *Model) { m.Supports[1].X = 3.2 }, place(SupportItem, 1, PositionProperty), "support 2 at x = 3.2 m lies outside the member (length 3.0 m)"},
		{"support NaN", func(m *Model) { m.Supports[0].X = nan }, place(SupportItem, 0, PositionProperty), "support 1: its position is NaN"},
		{"two supports at one point", func(m *Model) { m.Supports[1].X = 0 }, place(SupportItem, 1, PositionProperty), "supports 1 and 2 are both at x = 0.0 m"},
		{"unknown kind", func(m *Model) { m.Supports[0].Kind = 17 }, place(SupportItem, 0, KindProperty), "support 1 has an unknown kind (17)"},
		{"negative spring", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{0, -5, 0}} }, Place{Item: Item{SupportItem, 1}, Property: MotionStiffnessProperty, Dof: Transverse}, "transverse spring stiffness is -5.0 N/m"},
		{"spring without stiffness", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring} }, place(SupportItem, 1, StiffnessProperty), "support 2 is a spring with no stiffness"},
		{"NaN settlement", func(m *Model) { m.Supports[0].Settlement[Transverse] = nan }, Place{Item: Item{SupportItem, 0}, Property: SettlementProperty, Dof: Transverse}, "the transverse settlement is NaN"},
		{"point load outside", func(m *Model) { m.PointLoads[0].X = -1 }, place(PointLoadItem, 0, PositionProperty), "point load 1 at x = -1.0 m lies outside the member"},
		{"point load infinite", func(m *Model) { m.PointLoads[0].Moment = inf }, place(PointLoadItem, 0, MomentProperty), "the moment is +Inf"},
		{"one load point", func(m *Model) { m.DistributedLoad[0].Points = m.DistributedLoad[0].Points[:1] }, place(DistributedLoadItem, 0, PointsProperty), "distributed load 1 has 1 point(s)"},
		{"zero span", func(m *Model) { m.DistributedLoad[0].Points[1].X = 0 }, place(DistributedLoadItem, 0, PointsProperty), "starts and ends at x = 0.0 m"},
		{"unsorted points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {2, 1}, {1, 1}, {3, 1}}
		}, Place{Item: Item{DistributedLoadItem, 0}, Property: PointXProperty, Vertex: 2}, "point 3 (x = 1.0 m) does not lie beyond point 2"},
		{"duplicate points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {1, 1}, {1, 2}, {3, 1}}
		}, Place{Item: Item{DistributedLoadItem, 0}, Property: PointXProperty, Vertex: 2}, "list the points in increasing x without repeats"},
		{"load point outside", func(m *Model) { m.DistributedLoad[0].Points[1].X = 4 }, Place{Item: Item{DistributedLoadItem, 0}, Property: PointXProperty, Vertex: 1}, "point 2 at x = 4.0 m lies outside"},
		{"load intensity NaN", func(m *Model) { m.DistributedLoad[0].Points[0].Intensity = nan }, Place{Item: Item{DistributedLoadItem, 0}, Property: PointIntensityProperty, Vertex: 0}, "intensity NaN"},
		{"bad direction", func(m *Model) { m.DistributedLoad[0].Direction = Rotation }, place(DistributedLoadItem, 0, DirectionProperty), "choose axial or transverse"},
		{"gravity NaN", func(m *Model) { m.Gravity[1] = nan }, Place{Item: Item{ModelItem, -1}, Property: GravityProperty, Dof: Transverse}, "the gravity component 2 is NaN"},
		{"temperature infinite", func(m *Model) { m.TemperatureChange = -inf }, place(ModelItem, -1, TemperatureChangeProperty), "temperature change is -Inf"},
		{"negative element count", func(m *Model) { m.Mesh.Elements = -3 }, place(MeshItem, -1, ElementsProperty), "the mesh asks for -3 elements"},
		{"negative element length", func(m *Model) { m.Mesh.MaxElementLength = -0.1 }, place(MeshItem, -1, MaxElementLengthProperty), "maximum element length is -0.1 m"},
		{"bad bar order", func(m *Model) { m.Mesh.BarOrder = 3 }, place(MeshItem, -1, BarOrderProperty), "the bar element order is 3"},
		{"too many elements", func(m *Model) { m.Mesh.Elements = 2_000_000_000 }, place(MeshItem, -1, ElementsProperty), "the mesh would need about 800.0 GB"},
		{"too short elements", func(m *Model) { m.Mesh.MaxElementLength = 1e-9 }, place(MeshItem, -1, ElementsProperty), "ask for fewer elements or a longer maximum element length"},
	})
}

// Hostile but finite input: numbers that print alike, values at the edges
// of float64, requests beyond the machine.
func TestValidateHostileInput(t *testing.T) {
	checkValidation(t, []validationCase{
		// A gap of 1e-9 m shows in the digits printed.
		{"gap of a nanometre", func(m *Model) { m.Segments[1].Start = 1 + 1e-9 }, place(SegmentItem, 1, StartProperty),
			"there is a gap between segment 1 (ends at x = 1.0 m) and segment 2 (starts at x = 1.000000001 m)"},
		{"overlap of a nanometre", func(m *Model) { m.Segments[1].Start = 1 - 1e-9 }, place(SegmentItem, 1, StartProperty),
			"segment 2 (starts at x = 0.999999999 m) overlaps segment 1 (ends at x = 1.0 m)"},
		{"segment ending a nanometre before its start", func(m *Model) {
			m.Segments[0].End, m.Segments[1].Start = 2, 2
			m.Segments[1].End = 2 - 1e-9
		}, place(SegmentItem, 1, EndProperty), "segment 2 runs from x = 2.0 m to x = 1.999999999 m"},
		{"support a nanometre past the end", func(m *Model) { m.Supports[1].X = 3 + 1e-9 }, place(SupportItem, 1, PositionProperty),
			"support 2 at x = 3.000000001 m lies outside the member (length 3.0 m)"},
		{"load point a nanometre past the end", func(m *Model) { m.DistributedLoad[0].Points[1].X = 3 + 1e-9 },
			Place{Item: Item{DistributedLoadItem, 0}, Property: PointXProperty, Vertex: 1}, "point 2 at x = 3.000000001 m lies outside the member (length 3.0 m)"},
		{"load points a nanometre out of order", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {2, 1}, {2 - 1e-9, 1}, {3, 1}}
		}, Place{Item: Item{DistributedLoadItem, 0}, Property: PointXProperty, Vertex: 2}, "point 3 (x = 1.999999999 m) does not lie beyond point 2 (x = 2.0 m)"},
		// The smallest float64 prints as the value it reads back as.
		{"negative subnormal area", func(m *Model) { m.Segments[0].Section.Area = -math.SmallestNonzeroFloat64 }, place(SegmentItem, 0, AreaProperty),
			"the area A is -5e-324 m²: it must be positive"},
		{"negative subnormal spring", func(m *Model) {
			m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, -math.SmallestNonzeroFloat64, 0}}
		}, Place{Item: Item{SupportItem, 1}, Property: MotionStiffnessProperty, Dof: Transverse}, "the transverse spring stiffness is -5e-324 N/m"},
		// Stiffnesses that underflow or overflow are refused before a solver
		// finds its matrix singular and blames springs or close supports.
		// By hand: 2e11·0.005/1e300 = 1e-291; 4.94e-324·0.005/1 = 2.5e-326;
		// 2e11·1e160/2³ = 2.5e170.
		{"member 1e300 m long", func(m *Model) { m.Segments[1].End = 1e300 }, place(SegmentItem, 1, NoProperty),
			"segment 2: its axial stiffness EA/ℓ is about 1e-291 N/m (E = 2e+11 Pa, A = 0.005 m², ℓ = 1e+300 m), outside the range the solvers work in (1e-150 to 1e+150 N/m): check these values and their units"},
		{"E of 5e-324 Pa", func(m *Model) { m.Segments[0].Material.Elastic = math.SmallestNonzeroFloat64 }, place(SegmentItem, 0, NoProperty),
			"segment 1: its axial stiffness EA/ℓ is about 2.5e-326 N/m (E = 5e-324 Pa, A = 0.005 m², ℓ = 1.0 m), outside the range the solvers work in (1e-150 to 1e+150 N/m): check these values and their units"},
		{"I of 1e160 m⁴", func(m *Model) { m.Segments[1].Section.SecondMoment = 1e160 }, place(SegmentItem, 1, NoProperty),
			"segment 2: its bending stiffness EI/ℓ³ is about 2.5e+170 N/m (E = 2e+11 Pa, I = 1e+160 m⁴, ℓ = 2.0 m)"},
		{"spring of 5e-324 N/m", func(m *Model) {
			m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, math.SmallestNonzeroFloat64, 0}}
		},
			Place{Item: Item{SupportItem, 1}, Property: MotionStiffnessProperty, Dof: Transverse},
			"support 2: the transverse spring stiffness is 5e-324 N/m, outside the range the solvers work in (1e-150 to 1e+150 N/m): enter a stiffness in that range, 0 to leave the motion free, or a rigid support kind to hold it"},
		{"spring of 1e200 N·m/rad", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, 1e6, 1e200}} },
			Place{Item: Item{SupportItem, 1}, Property: MotionStiffnessProperty, Dof: Rotation},
			"support 2: the rotation spring stiffness is 1e+200 N·m/rad, outside the range the solvers work in (1e-150 to 1e+150 N·m/rad)"},
	})
}

// checkValidation runs each case on its own copy of validModel.
func checkValidation(t *testing.T, cases []validationCase) {
	t.Helper()
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
				if p.Place == c.place && strings.Contains(p.Message, c.text) {
					return
				}
			}
			t.Errorf("no problem at %+v saying %q in\n%v", c.place, c.text, err)
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

// Two different numbers never print alike, and a number prints no more
// digits than it needs to read back.
func TestFmtPair(t *testing.T) {
	cases := []struct {
		a, b         float64
		wantA, wantB string
	}{
		{2, 2 + 1e-9, "2.0", "2.000000001"},
		{1, math.Nextafter(1, 2), "1.0", "1.0000000000000002"},
		{math.SmallestNonzeroFloat64, 2 * math.SmallestNonzeroFloat64, "5e-324", "1e-323"},
		{1.0 / 3, 1.0 / 3, "0.333333", "0.333333"},
		{1.0 / 3, math.Nextafter(1.0/3, 1), "0.3333333333333333", "0.3333333333333334"},
		{-2e11, 3.2, "-2e+11", "3.2"},
	}
	for _, c := range cases {
		if a, b := fmtPair(c.a, c.b); a != c.wantA || b != c.wantB {
			t.Errorf("fmtPair(%v, %v) = %q, %q; want %q, %q", c.a, c.b, a, b, c.wantA, c.wantB)
		}
	}
}
