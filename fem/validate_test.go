package fem

import (
	"errors"
	"math"
	"runtime"
	"strconv"
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
func place(kind ItemKind, i int, p Property) Place {
	return Place{Item: Item{Kind: kind, Index: i}, Property: p}
}

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
		// A typed -0 is echoed as zero, not "-0.0 m²".
		{"negative zero area", func(m *Model) { m.Segments[0].Section.Area = math.Copysign(0, -1) }, place(SegmentItem, 0, AreaProperty), "segment 1: the area A is 0.0 m²: it must be positive"},
		{"negative zero length", func(m *Model) { m.Segments[0].Start, m.Segments[0].End = math.Copysign(0, -1), math.Copysign(0, -1) }, place(SegmentItem, 0, EndProperty), "segment 1 runs from x = 0.0 m to x = 0.0 m"},
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
		{"negative spring", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{0, -5, 0}} }, Place{Item: Item{Kind: SupportItem, Index: 1}, Property: MotionStiffnessProperty, Dof: Transverse}, "transverse spring stiffness is -5.0 N/m"},
		{"spring without stiffness", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring} }, place(SupportItem, 1, StiffnessProperty), "support 2 is a spring with no stiffness"},
		{"NaN settlement", func(m *Model) { m.Supports[0].Settlement[Transverse] = nan }, Place{Item: Item{Kind: SupportItem, Index: 0}, Property: SettlementProperty, Dof: Transverse}, "the transverse settlement is NaN"},
		{"point load outside", func(m *Model) { m.PointLoads[0].X = -1 }, place(PointLoadItem, 0, PositionProperty), "point load 1 at x = -1.0 m lies outside the member"},
		{"point load infinite", func(m *Model) { m.PointLoads[0].Moment = inf }, place(PointLoadItem, 0, MomentProperty), "the moment is +Inf"},
		{"one load point", func(m *Model) { m.DistributedLoad[0].Points = m.DistributedLoad[0].Points[:1] }, place(DistributedLoadItem, 0, PointsProperty), "distributed load 1 has 1 point(s)"},
		{"zero span", func(m *Model) { m.DistributedLoad[0].Points[1].X = 0 }, place(DistributedLoadItem, 0, PointsProperty), "starts and ends at x = 0.0 m"},
		{"unsorted points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {2, 1}, {1, 1}, {3, 1}}
		}, Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointXProperty, Vertex: 2}, "point 3 (x = 1.0 m) does not lie beyond point 2"},
		{"duplicate points", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {1, 1}, {1, 2}, {3, 1}}
		}, Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointXProperty, Vertex: 2}, "list the points in increasing x without repeats"},
		{"load point outside", func(m *Model) { m.DistributedLoad[0].Points[1].X = 4 }, Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointXProperty, Vertex: 1}, "point 2 at x = 4.0 m lies outside"},
		{"load intensity NaN", func(m *Model) { m.DistributedLoad[0].Points[0].Intensity = nan }, Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointIntensityProperty, Vertex: 0}, "intensity NaN"},
		{"bad direction", func(m *Model) { m.DistributedLoad[0].Direction = Rotation }, place(DistributedLoadItem, 0, DirectionProperty), "choose axial or transverse"},
		{"gravity NaN", func(m *Model) { m.Gravity[1] = nan }, Place{Item: Item{Kind: ModelItem, Index: -1}, Property: GravityProperty, Dof: Transverse}, "the gravity component 2 is NaN"},
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
			Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointXProperty, Vertex: 1}, "point 2 at x = 3.000000001 m lies outside the member (length 3.0 m)"},
		{"load points a nanometre out of order", func(m *Model) {
			m.DistributedLoad[0].Points = []LoadPoint{{0, 1}, {2, 1}, {2 - 1e-9, 1}, {3, 1}}
		}, Place{Item: Item{Kind: DistributedLoadItem, Index: 0}, Property: PointXProperty, Vertex: 2}, "point 3 (x = 1.999999999 m) does not lie beyond point 2 (x = 2.0 m)"},
		// The smallest float64 prints as the value it reads back as.
		{"negative subnormal area", func(m *Model) { m.Segments[0].Section.Area = -math.SmallestNonzeroFloat64 }, place(SegmentItem, 0, AreaProperty),
			"the area A is -5e-324 m²: it must be positive"},
		{"negative subnormal spring", func(m *Model) {
			m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, -math.SmallestNonzeroFloat64, 0}}
		}, Place{Item: Item{Kind: SupportItem, Index: 1}, Property: MotionStiffnessProperty, Dof: Transverse}, "the transverse spring stiffness is -5e-324 N/m"},
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
			Place{Item: Item{Kind: SupportItem, Index: 1}, Property: MotionStiffnessProperty, Dof: Transverse},
			"support 2: the transverse spring stiffness is 5e-324 N/m, outside the range the solvers work in (1e-150 to 1e+150 N/m): enter a stiffness in that range, 0 to leave the motion free, or a rigid support kind to hold it"},
		{"spring of 1e200 N·m/rad", func(m *Model) { m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, 1e6, 1e200}} },
			Place{Item: Item{Kind: SupportItem, Index: 1}, Property: MotionStiffnessProperty, Dof: Rotation},
			"support 2: the rotation spring stiffness is 1e+200 N·m/rad, outside the range the solvers work in (1e-150 to 1e+150 N·m/rad)"},
		// Requests beyond the machine are refused with the estimate, the
		// limit and what fits. validModel has 12 key points at most (2 ends,
		// 4 segment ends, 2 supports, 1 point load, 2 load points, rounded
		// up by one end), so its elements dominate: 400 B each.
		{"element length of 5e-324 m", func(m *Model) { m.Mesh.MaxElementLength = math.SmallestNonzeroFloat64 }, place(MeshItem, -1, ElementsProperty),
			"the mesh would need more than 1e+299 GB of memory (over 1e+305 elements), far more than the 4.3 GB allowed: ask for fewer elements or a longer maximum element length (up to about 1.07e+07 elements fit)"},
		{"element length of 1e-300 m", func(m *Model) { m.Mesh.MaxElementLength = 1e-300 }, place(MeshItem, -1, ElementsProperty),
			"the mesh would need about 1.2e+294 GB of memory (3e+300 elements)"},
		{"a trillion elements", func(m *Model) { m.Mesh.Elements = 1e12 }, place(MeshItem, -1, ElementsProperty),
			"the mesh would need about 4e+05 GB of memory (1e+12 elements), more than the 4.3 GB allowed: ask for fewer elements or a longer maximum element length (up to about 1.07e+07 elements fit)"},
		// Key points count too, at 23,200 B each and one element (400 B) per
		// stretch: 300,000 point loads need at least 300,012 × 23,600 B =
		// 7.08 GB; 4,294,967,296 / 23,600 = 181,990 key points fit.
		{"300,000 point loads", func(m *Model) { m.PointLoads = manyPointLoads(300_000, 3) }, place(ModelItem, -1, NoProperty),
			"the model would need at least 10.0 GB of memory for its 3e+05 key points (ends and breaks of segments, supports, point loads and load points), more than the 4.3 GB allowed: use fewer supports, point loads and load points, or split the member into several models (up to about 1.29e+05 key points fit)"},
		// Each load case keeps its exact solution, alone and as a
		// combination (without combinations, each case alone is one), so
		// what fits for one case (1.29e+05 key points, the row above) is
		// shared among 2,000 load sets: 65 key points (it once said the one
		// case's figure). Per key point 2,000 × 32,800 B, and
		// 4 × (100 + 999 × 60 + 1,000 × 40) B for its element:
		// 4,294,967,296 / 66,000,160 = 65.
		{"1,000 load cases of 1,000 point loads", func(m *Model) {
			loads := manyPointLoads(1000, 3)
			m.PointLoads = nil
			for i, p := range loads {
				m.Cases = append(m.Cases, LoadCase{Name: "case " + strconv.Itoa(i+1), PointLoads: []PointLoad{p}})
			}
		}, place(ModelItem, -1, NoProperty),
			"key points (ends and breaks of segments, supports, point loads and load points), solved for each of 1000 load cases and 1000 combinations, more than the 4.3 GB allowed: use fewer supports, point loads and load points, or take fewer load cases and combinations, or split the member into several models (up to about 65 key points fit)"},
		// 100,000 point loads take 2.32 GB, which leaves room for
		// (4,294,967,296 − 100,012 × 23,200) / 400 = 4,936,722 elements.
		{"ten million elements and 100,000 point loads", func(m *Model) {
			m.PointLoads, m.Mesh.Elements = manyPointLoads(100_000, 3), 10_000_000
		}, place(MeshItem, -1, ElementsProperty),
			"the mesh would need about 7.3 GB of memory (1.01e+07 elements), more than the 4.3 GB allowed: ask for fewer elements or a longer maximum element length (up to about 2.54e+06 elements fit)"},
	})
}

// manyPointLoads spreads n point loads evenly inside a member of length L.
func manyPointLoads(n int, L float64) []PointLoad {
	loads := make([]PointLoad, n)
	for i := range loads {
		loads[i] = PointLoad{X: L * float64(i+1) / float64(n+1), Transverse: -1}
	}
	return loads
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

// The bytes per element and per key point that Validate's memory estimate
// uses must bound what the stages allocate, or the estimate would let
// through models that do not fit. Bytes are runtime.MemStats.TotalAlloc
// around each stage; the cost of one more element or key point is the
// slope between two sizes, so that fixed costs do not count.
func TestMemoryPerStage(t *testing.T) {
	if testing.Short() {
		t.Skip("allocates a large mesh")
	}
	// Per element: every stage, from 100,000 to 200,000 elements.
	for _, order := range []ElementOrder{LinearBar, QuadraticBar} {
		stages := func(elements int) (float64, int) {
			m := mixedModel(elements)
			m.Mesh.BarOrder = order
			var s *Solution
			bytes := allocated(t, func() error {
				var err error
				if s, err = Solve(m); err != nil {
					return err
				}
				e, err := SolveExact(m)
				if err != nil {
					return err
				}
				Summarize(s, e)
				Compare(s, e)
				return nil
			})
			return bytes, len(s.Mesh.Elements)
		}
		perElement := slope(stages(100_000))(stages(200_000))
		t.Logf("order %d: Solve, SolveExact, Summarize and Compare allocate %.0f B per element", order, perElement)
		if perElement > stagesBytesPerElement {
			t.Errorf("order %d: the stages allocate %.0f B per element, more than stagesBytesPerElement = %d", order, perElement, stagesBytesPerElement)
		}
	}
	// Per key point, one element per stretch: Solve and SolveExact from
	// 1,000 to 2,000 key points of each kind; Summarize with the exact
	// solution from 125 to 250.
	for _, kind := range []string{"segments", "supports", "point loads", "load points"} {
		solve := func(n int) (float64, int) {
			m := keyPointModel(kind, n)
			return allocated(t, func() error { _, err := Solve(m); return err }), len(KeyPoints(m))
		}
		exact := func(n int) (float64, int) {
			m := keyPointModel(kind, n)
			return allocated(t, func() error { _, err := SolveExact(m); return err }), len(KeyPoints(m))
		}
		summary := func(n int) (float64, int) {
			m := keyPointModel(kind, n)
			s, err := Solve(m)
			if err != nil {
				t.Fatal(err)
			}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			return allocated(t, func() error { Summarize(s, e); return nil }), len(KeyPoints(m))
		}
		if exactPerKey := slope(exact(1000))(exact(2000)); exactPerKey > exactBytesPerKeyPoint {
			t.Errorf("%s: SolveExact allocates %.0f B per key point, more than exactBytesPerKeyPoint = %d", kind, exactPerKey, exactBytesPerKeyPoint)
		} else {
			t.Logf("%s: SolveExact allocates %.0f B per key point", kind, exactPerKey)
		}
		solvePerKey, summaryPerKey := slope(solve(1000))(solve(2000)), slope(summary(125))(summary(250))
		t.Logf("%s: Solve allocates %.0f B per key point, Summarize %.0f", kind, solvePerKey, summaryPerKey)
		if solvePerKey > solveBytesPerKeyPoint {
			t.Errorf("%s: Solve allocates %.0f B per key point, more than solveBytesPerKeyPoint = %d", kind, solvePerKey, solveBytesPerKeyPoint)
		}
		if summaryPerKey > summaryBytesPerKeyPoint {
			t.Errorf("%s: Summarize allocates %.0f B per key point, more than summaryBytesPerKeyPoint = %d", kind, summaryPerKey, summaryBytesPerKeyPoint)
		}
	}
	// A billion elements are refused with the memory they would need.
	m := mixedModel(1_000_000_000)
	var ve *ValidationError
	if err := m.Validate(); !errors.As(err, &ve) || !strings.Contains(err.Error(), "the mesh would need about 400.0 GB of memory") {
		t.Errorf("10⁹ elements: got %v, want the memory refusal", err)
	}
}

// slope gives, from (bytes, count) at two sizes, the bytes per extra count.
func slope(bytes0 float64, count0 int) func(float64, int) float64 {
	return func(bytes1 float64, count1 int) float64 { return (bytes1 - bytes0) / float64(count1-count0) }
}

// allocated returns the bytes that run allocates: the least of three runs,
// since the count is the whole process's and a goroutine an earlier test
// left running (on a loaded machine, say) adds its own bytes to a run,
// never takes any away.
func allocated(t *testing.T, run func() error) float64 {
	t.Helper()
	least := math.Inf(1)
	for range 3 {
		var before, after runtime.MemStats
		runtime.GC()
		runtime.ReadMemStats(&before)
		if err := run(); err != nil {
			t.Fatal(err)
		}
		runtime.ReadMemStats(&after)
		least = min(least, float64(after.TotalAlloc-before.TotalAlloc))
	}
	return least
}

// keyPointModel is a simply supported member n m long with about n key
// points of one kind: segment breaks, supports, point loads or the points
// of one distributed load. It leaves the element count at zero, one
// element per stretch.
func keyPointModel(kind string, n int) *Model {
	L := float64(n)
	m := &Model{Segments: []Segment{testSegment(0, L)}, Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		Mesh: MeshSettings{Elements: 1}} // one element per stretch
	switch kind {
	case "segments":
		m.Segments = nil
		for i := range n {
			m.Segments = append(m.Segments, testSegment(float64(i), float64(i+1)))
		}
	case "supports":
		for i := 1; i < n; i++ {
			m.Supports = append(m.Supports, Support{X: float64(i) - 0.5, Kind: Roller})
		}
	case "point loads":
		for i := 1; i < n; i++ {
			m.PointLoads = append(m.PointLoads, PointLoad{X: float64(i) - 0.5, Axial: 10, Transverse: -1e3})
		}
	case "load points":
		points := make([]LoadPoint, n+1)
		for i := range points {
			points[i] = LoadPoint{float64(i), float64(-1000 - i%3)}
		}
		m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: points}}
	}
	return m
}

// A combination whose every factor is 0 applies no load: it was accepted
// without a word and its envelope row read "within 0 % (worst: axial
// displacement in Z)". One factor other than 0, on a case or on a moving
// load train, is a load.
func TestValidateCombinationOfZeroFactors(t *testing.T) {
	checkValidation(t, []validationCase{
		{"every factor 0", func(m *Model) { withCases(m, 0, 0) }, place(CombinationItem, 0, FactorsProperty), `combination "Z" applies no load: every factor is 0`},
	})
	for _, c := range []struct {
		name string
		edit func(m *Model)
	}{
		{"one factor not 0", func(m *Model) { withCases(m, 0, -0.5) }},
		{"a train's factor not 0", func(m *Model) {
			withCases(m, 0, 0)
			m.Combinations[0].Trains = []TrainFactor{{Train: 0, Factor: 1}}
		}},
	} {
		m := validModel()
		c.edit(m)
		if err := m.Validate(); err != nil {
			t.Errorf("%s: refused: %v", c.name, err)
		}
	}
}

// withCases moves m's loads into two cases, "permanent" and "imposed",
// and combines them in one combination "Z" with the factors given, in turn.
func withCases(m *Model, factors ...float64) {
	m.PointLoads, m.DistributedLoad = nil, nil
	m.Cases = []LoadCase{
		{Name: "permanent", PointLoads: []PointLoad{{X: 1.5, Transverse: -1e3}}},
		{Name: "imposed", PointLoads: []PointLoad{{X: 2, Transverse: -1e3}}},
	}
	cb := Combination{Name: "Z"}
	for k, f := range factors {
		cb.Factors = append(cb.Factors, CaseFactor{Case: k, Factor: f})
	}
	m.Combinations = []Combination{cb}
}

// Factors beyond sense are refused alike on cases and on trains: a case
// factor of 1e300 was refused (by the solve, its results overflowing)
// while a train's factor of 1e300 was taken and gave deflections of about
// 1e300 mm. Up to MaxFactor in size both are taken.
func TestValidateFactorSize(t *testing.T) {
	train := func(f float64) func(m *Model) {
		return func(m *Model) {
			withCases(m, 1.35, 1.5)
			m.Combinations[0].Trains = []TrainFactor{{Train: 0, Factor: 1}, {Train: 1, Factor: f}}
		}
	}
	caseFactor := Place{Item: Item{Kind: CombinationItem}, Property: FactorProperty, Vertex: 1}
	checkValidation(t, []validationCase{
		{"case factor 1e300", func(m *Model) { withCases(m, 1.35, 1e300) }, caseFactor, `combination "Z", factor 2 is 1e+300, larger in size than the 1e+150 Stave takes`},
		{"case factor -1e300", func(m *Model) { withCases(m, 1.35, -1e300) }, caseFactor, `combination "Z", factor 2 is -1e+300, larger in size`},
		{"case factor just over the most", func(m *Model) { withCases(m, 1.35, math.Nextafter(MaxFactor, math.Inf(1))) }, caseFactor, "larger in size than the 1e+150"},
		{"case factor infinite", func(m *Model) { withCases(m, 1.35, math.Inf(-1)) }, caseFactor, `combination "Z", factor 2 is -Inf: enter a finite number`},
		{"train factor 1e300", train(1e300), place(CombinationItem, 0, FactorsProperty), `combination "Z", the factor on moving load train 2 is 1e+300, larger in size than the 1e+150 Stave takes`},
		{"train factor -1e300", train(-1e300), place(CombinationItem, 0, FactorsProperty), `moving load train 2 is -1e+300, larger in size`},
		{"train factor NaN", train(math.NaN()), place(CombinationItem, 0, FactorsProperty), `moving load train 2 is NaN: enter a finite number`},
	})
	for name, edit := range map[string]func(m *Model){
		"case factors of the most": func(m *Model) { withCases(m, MaxFactor, -MaxFactor) },
		"train factor of the most": train(MaxFactor),
		"train factor of 0":        train(0),
	} {
		m := validModel()
		edit(m)
		if err := m.Validate(); err != nil {
			t.Errorf("%s: refused: %v", name, err)
		}
	}
}

// The memory estimate counts the combinations a model's analysis solves
// and keeps, not only its cases: two cases in eight combinations were
// counted as two load sets of 400 B per element, so 5.3 million elements
// passed. Worked by hand from the constants: 4 × (100 + 7 × 60 + 2 × 40) =
// 2,400 B per element; the few key points take 10 × 32,800 B each, so
// about (4,294,967,296 − 3 MB) / 2,400 = 1.79 million elements fit.
func TestValidateMemoryOfCombinations(t *testing.T) {
	model := func(elements int) *Model {
		m := validModel()
		withCases(m, 1.35, 1.5)
		for k := 2; k <= 8; k++ {
			m.Combinations = append(m.Combinations, Combination{Name: "Z" + strconv.Itoa(k), Factors: []CaseFactor{{Case: 0, Factor: 1}, {Case: 1, Factor: float64(k) / 10}}})
		}
		m.Mesh.Elements = elements
		return m
	}
	if err := model(1_780_000).Validate(); err != nil {
		t.Errorf("1.78 million elements, 8 combinations: refused: %v", err)
	}
	err := model(1_800_000).Validate()
	for _, says := range []string{
		"the mesh would need about 4.3 GB of memory (1.8e+06 elements, solved for each of 2 load cases and 8 combinations)",
		"ask for fewer elements or a longer maximum element length, or take fewer load cases and combinations (up to about 1.79e+06 elements fit)",
	} {
		if err == nil || !strings.Contains(err.Error(), says) {
			t.Errorf("1.8 million elements, 8 combinations: got %v, want it to say %q", err, says)
		}
	}
}

// A Timoshenko segment whose shear area or shear modulus comes out of a
// value already refused gets that one problem, not a second one saying the
// shear area or modulus is missing; one that gives neither still hears
// that it has none.
func TestValidateShearDeformationOneProblem(t *testing.T) {
	for _, c := range []struct {
		name  string
		edit  func(s *Segment)
		place Place
		text  string
	}{
		{"negative shear area", func(s *Segment) { s.Section.ShearArea, s.Section.ShearCoefficient = -0.01, 0 }, place(SegmentItem, 0, ShearAreaProperty), "the shear area is -0.01 m²: it must be zero or positive"},
		{"negative shear coefficient", func(s *Segment) { s.Section.ShearCoefficient = -0.8 }, place(SegmentItem, 0, ShearCoefficientProperty), "the shear coefficient is -0.8: it must be zero or positive"},
		{"NaN shear area", func(s *Segment) { s.Section.ShearArea, s.Section.ShearCoefficient = math.NaN(), 0 }, place(SegmentItem, 0, ShearAreaProperty), "the shear area is NaN"},
		{"negative area under a coefficient", func(s *Segment) { s.Section.Area = -testA }, place(SegmentItem, 0, AreaProperty), "the area A is"},
		{"Poisson's ratio below -1", func(s *Segment) { s.Material.Poisson = -1.5 }, place(SegmentItem, 0, PoissonProperty), "Poisson's ratio is -1.5"},
		{"negative E under Poisson's ratio", func(s *Segment) { s.Material.Elastic = -testE }, place(SegmentItem, 0, ElasticProperty), "Young's modulus E is"},
		{"no shear area given", func(s *Segment) { s.Section.ShearCoefficient = 0 }, place(SegmentItem, 0, ShearAreaProperty), "segment 1 deforms in shear but has no shear area"},
	} {
		t.Run(c.name, func(t *testing.T) {
			m := validModel()
			s := &m.Segments[0]
			s.ShearDeformation = true
			s.Section.ShearCoefficient = 5.0 / 6 // a solid rectangle's, from memory
			s.Material.Poisson = 0.3
			c.edit(s)
			err := m.Validate()
			var ve *ValidationError
			if !errors.As(err, &ve) {
				t.Fatalf("got %v, want a *ValidationError", err)
			}
			if len(ve.Problems) != 1 || ve.Problems[0].Place != c.place || !strings.Contains(ve.Problems[0].Message, c.text) {
				t.Errorf("want one problem at %+v saying %q, got\n%v", c.place, c.text, err)
			}
		})
	}
}

// A member declared axial-only (a tie or strut) is refused only what would
// bend it: a transverse force, a moment or a transverse line load that is
// not zero. A load whose transverse part is zero carries nothing across, as
// the members found axial-only without the declaration take it
// (Loads.bendsMember), whether a point load or a line load, in the model or
// in a load case. The accepted ones solve to the tie's axial force, the end
// load (statics).
func TestValidateAxialOnlyRefusesWhatBendsIt(t *testing.T) {
	tie := func() *Model {
		return &Model{
			Segments:   []Segment{testSegment(0, 3)},
			Supports:   []Support{{X: 0, Kind: AxialOnly}},
			PointLoads: []PointLoad{{X: 3, Axial: 1e3}},
			AxialOnly:  true,
		}
	}
	inCase := func(m *Model) {
		m.Cases = []LoadCase{{Name: "pull", PointLoads: m.PointLoads, DistributedLoad: m.DistributedLoad}}
		m.PointLoads, m.DistributedLoad = nil, nil
	}
	line := func(q0, q1 float64) func(m *Model) {
		return func(m *Model) {
			m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q0}, {3, q1}}}}
		}
	}
	tests := []struct {
		name   string
		edits  []func(m *Model)
		refuse string // "" for accepted
	}{
		{"point load of zero transverse force", []func(m *Model){func(m *Model) { m.PointLoads[0].Transverse = 0 }}, ""},
		{"transverse line load of zero intensity", []func(m *Model){line(0, 0)}, ""},
		{"transverse line load of zero intensity in a case", []func(m *Model){line(0, 0), inCase}, ""},
		{"transverse point load", []func(m *Model){func(m *Model) { m.PointLoads[0].Transverse = -1 }}, "point load 1 pushes across the member"},
		{"transverse line load zero at one end", []func(m *Model){line(0, -1)}, "distributed load 1 acts across the member"},
		{"transverse line load in a case", []func(m *Model){line(-1, -1), inCase}, `load case "pull": distributed load 1 acts across the member`},
	}
	for _, c := range tests {
		t.Run(c.name, func(t *testing.T) {
			m := tie()
			for _, edit := range c.edits {
				edit(m)
			}
			err := m.Validate()
			if c.refuse != "" {
				if err == nil || !strings.Contains(err.Error(), c.refuse+", but the member is declared to carry axial force only") {
					t.Errorf("got %v, want a refusal saying %q", err, c.refuse)
				}
				return
			}
			if err != nil {
				t.Fatalf("refused: %v", err)
			}
			if len(m.Cases) > 0 {
				return
			}
			s := mustSolve(t, m)
			if f := s.Reactions[0].Force[Axial]; math.Abs(f+1e3) > 1e-9 {
				t.Errorf("the support takes %g N along the tie, want -1000 N", f)
			}
		})
	}
}

// Names of cases and of combinations are told apart without regard to
// letter case; a refusal of two names that differ only so quotes both, as
// the user typed them, and says why they count as one.
func TestValidateNamesApartFromLetterCase(t *testing.T) {
	cased := func(first, second string) *Model {
		m := validModel()
		load := func() LoadCase {
			return LoadCase{PointLoads: []PointLoad{{X: 1.5, Transverse: -1e3}}}
		}
		a, b := load(), load()
		a.Name, b.Name = first, second
		m.Cases = []LoadCase{a, b}
		m.PointLoads, m.DistributedLoad = nil, nil
		m.Combinations = []Combination{
			{Name: first, Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1}}},
			{Name: second, Kind: Strength, Factors: []CaseFactor{{Case: 1, Factor: 1}}},
		}
		return m
	}
	tests := []struct {
		first, second string
		want          []string
	}{
		{"imposed", "imposed", []string{
			`load cases 1 and 2 are both named "imposed": give each case its own name`,
			`combinations 1 and 2 are both named "imposed": give each its own name`}},
		{"imposed", "Imposed", []string{
			`load cases 1 and 2 are named "imposed" and "Imposed", one name to Stave (it does not tell capitals from small letters): give each case its own name`,
			`combinations 1 and 2 are named "imposed" and "Imposed", one name to Stave (it does not tell capitals from small letters): give each its own name`}},
	}
	for _, c := range tests {
		err := cased(c.first, c.second).Validate()
		if err == nil {
			t.Errorf("%q and %q: accepted", c.first, c.second)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%q and %q: the refusal does not say %q:\n%v", c.first, c.second, w, err)
			}
		}
	}
}

// The section modulus I/c divides every bending moment into a stress: it
// must lie within the range the solvers work in, 1e±150 m³, as the
// stiffnesses must. A fibre distance of 1e308 m over I = 8e-5 m⁴ (I/c
// = 8e-313 m³, arithmetic) made c/I overflow, and a moment of 0 (a bar held at both ends and heated)
// times it NaN; the section moduli of real members lie near 1e-9 to 10 m³.
func TestValidateSectionModulusRange(t *testing.T) {
	fibre := func(c float64) func(m *Model) {
		return func(m *Model) { m.Segments[1].Section.FibreDistance = c }
	}
	checkValidation(t, []validationCase{
		{"fibre distance 1e308 m", fibre(1e308), place(SegmentItem, 1, FibreDistanceProperty),
			"segment 2: its section modulus I/c is about 8e-313 m³ (I = 8e-05 m⁴, c = 1e+308 m), outside the range the solvers work in (1e-150 to 1e+150 m³): check these values and their units"},
		{"fibre distance 1e-300 m", fibre(1e-300), place(SegmentItem, 1, FibreDistanceProperty),
			"its section modulus I/c is about 8e+295 m³"},
	})
	m := validModel()
	fibre(1e3)(m) // I/c = 8e-8 m³, within the range
	if err := m.Validate(); err != nil {
		t.Errorf("a section modulus of 8e-8 m³ refused: %v", err)
	}
}
