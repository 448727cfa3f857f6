package fem

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

// A temperature difference ΔT through the depth h curves a free member by
// κ = α·ΔT/h (bottom warmer: sagging). Restrained at both ends (fixed–
// fixed) the member stays straight and carries the moment M = −EI·κ along
// its whole length, with no reactions but the end moments; simply
// supported it carries no moment and sags by κL²/8 at midspan; a cantilever
// turns by κL and its tip moves by κL²/2 (thermal bending of beams,
// Roark's Formulas for Stress and Strain, beams under a linear temperature
// gradient through the depth, from memory). FE and exact must both give
// them.
func TestTemperatureDifferenceThroughDepth(t *testing.T) {
	const L, dT, depth = 6.0, 30.0, 0.3
	kappa := testα * dT / depth
	ei := testE * testI
	for _, c := range []struct {
		name     string
		supports []Support
		check    func(t *testing.T, name string, f Field, r []Reaction)
	}{
		{"fixed at both ends", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}}, func(t *testing.T, name string, f Field, r []Reaction) {
			for _, x := range []float64{0, 1.7, L / 2, L} {
				g := f.At(x, Right)
				if math.Abs(g.BendingMoment+ei*kappa) > 1e-9*ei*kappa || math.Abs(g.Deflection) > 1e-12 {
					t.Errorf("%s at x = %g: M %.9g, w %.3g; want M = −EI·κ = %.9g and w = 0", name, x, g.BendingMoment, g.Deflection, -ei*kappa)
				}
			}
			if math.Abs(r[0].Force[Transverse]) > 1e-9*ei*kappa/L || math.Abs(math.Abs(r[0].Force[Rotation])-ei*kappa) > 1e-9*ei*kappa {
				t.Errorf("%s: reactions %v, want no force and end moments of EI·κ = %.9g", name, r[0].Force, ei*kappa)
			}
		}},
		{"simply supported", []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}}, func(t *testing.T, name string, f Field, r []Reaction) {
			g := f.At(L/2, Right)
			if math.Abs(g.BendingMoment) > 1e-9*ei*kappa || math.Abs(g.Deflection+kappa*L*L/8) > 1e-9*kappa*L*L {
				t.Errorf("%s at midspan: M %.3g, w %.9g; want 0 and −κL²/8 = %.9g", name, g.BendingMoment, g.Deflection, -kappa*L*L/8)
			}
		}},
		{"cantilever", []Support{{X: 0, Kind: Fixed}}, func(t *testing.T, name string, f Field, r []Reaction) {
			g := f.At(L, Left)
			if math.Abs(g.Rotation-kappa*L) > 1e-9*kappa*L || math.Abs(g.Deflection-kappa*L*L/2) > 1e-9*kappa*L*L {
				t.Errorf("%s at the tip: θ %.9g, w %.9g; want κL = %.9g and κL²/2 = %.9g", name, g.Rotation, g.Deflection, kappa*L, kappa*L*L/2)
			}
		}},
	} {
		t.Run(c.name, func(t *testing.T) {
			seg := testSegment(0, L)
			seg.Section.Depth = depth
			seg.TemperatureDifference = dT
			seg.Material.Density = 0
			m := &Model{Segments: []Segment{seg}, Supports: c.supports, Mesh: MeshSettings{Elements: 12}}
			s := mustSolve(t, m)
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			c.check(t, "FE", s, s.Reactions)
			c.check(t, "exact", e, e.Reactions())
		})
	}
}

// A temperature difference on a member declared axial-only is refused at
// the segment, and one with no depth to spread over at the depth.
func TestTemperatureDifferenceRefused(t *testing.T) {
	for _, c := range []struct {
		edit  func(*Model)
		place Place
	}{
		{func(m *Model) { m.AxialOnly = true; m.Segments[0].TemperatureDifference = 10 }, Place{Item: Item{Kind: SegmentItem}, Property: TemperatureDifferenceProperty}},
		{func(m *Model) { m.Segments[0].TemperatureDifference = 10; m.Segments[0].Section.FibreDistance = 0 }, Place{Item: Item{Kind: SegmentItem}, Property: DepthProperty}},
	} {
		m := testModel(Support{X: 0, Kind: Fixed})
		c.edit(m)
		err := m.Validate()
		found := false
		if v, ok := err.(*ValidationError); ok {
			for _, p := range v.Problems {
				found = found || p.Place == c.place
			}
		}
		if !found {
			t.Errorf("%s: got %v, want a problem at %+v", fmt.Sprint(c.place.Property), err, c.place)
		}
	}
}

// A member restrained against what the temperature would do stays where it
// is: its displacements are zero (the fixed-ended beam of
// TestTemperatureDifferenceThroughDepth; a bar pinned at both ends warmed
// uniformly, N = −EA·α·ΔT, restrained bar, textbook closed form), so FE
// and exact agree on them up to round-off. Their extremes' accuracy must
// say so, not measure one solution's round-off against the other's as a
// 100 % difference (which the summary did for the fixed-ended beam on
// Stave's own mesh, and called the mesh too coarse).
func TestRestrainedDisplacementsAtRoundOff(t *testing.T) {
	const L, dT = 5.0, 20.0
	for _, c := range []struct {
		name     string
		supports []Support
		edit     func(s *Segment, m *Model)
	}{
		{"fixed-ended beam, warmer below", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}}, func(s *Segment, m *Model) {
			s.TemperatureDifference = dT
		}},
		{"fixed-ended beam, warmer above and through", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}}, func(s *Segment, m *Model) {
			s.TemperatureDifference = -dT
			m.TemperatureChange = dT
		}},
		{"bar pinned at both ends, warmed", []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Pinned}}, func(s *Segment, m *Model) {
			m.TemperatureChange = dT
		}},
	} {
		t.Run(c.name, func(t *testing.T) {
			seg := Segment{Start: 0, End: L,
				Section:  Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15},
				Material: Material{Elastic: 2e11, ThermalExpansion: testα}}
			m := &Model{Supports: c.supports} // Stave's own mesh
			c.edit(&seg, m)
			m.Segments = []Segment{seg}
			s := mustSolve(t, m)
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			for _, x := range Summarize(s, e).Extremes {
				switch x.Quantity {
				case QAxialDisplacement, QDeflection, QRotation:
					if x.Accuracy > 1e-9 {
						t.Errorf("%v: accuracy %.3g (exact %.3g..%.3g, FE %.3g..%.3g), want round-off", x.Quantity, x.Accuracy, x.Min, x.Max, x.FEMin, x.FEMax)
					}
				}
			}
		})
	}
}

// In a model with load cases a segment's temperature difference acts in
// the cases that take it (LoadCase.ThermalGradient). One no case takes
// would act in none, and the file format had no way to give it to one, so
// it was dropped without a word: such a model is refused at the segment.
// Taken by a case, it gives that case alone the fixed-ended beam's
// M = −EI·κ, end moments ±EI·κ (Roark's, thermal bending of beams, from
// memory), and the other case none of it.
func TestTemperatureDifferenceInLoadCases(t *testing.T) {
	const L, dT, depth = 6.0, 30.0, 0.3
	ei := testE * testI
	kappa := testα * dT / depth
	build := func(takes bool) *Model {
		seg := testSegment(0, L)
		seg.Section.Depth, seg.TemperatureDifference = depth, dT
		return &Model{
			Segments: []Segment{seg},
			Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}},
			Cases: []LoadCase{
				{Name: "imposed", PointLoads: []PointLoad{{X: L / 2, Transverse: -1e3}}},
				{Name: "sun", TemperatureChange: 10, ThermalGradient: takes},
			},
			Mesh: MeshSettings{Elements: 8},
		}
	}
	var ve *ValidationError
	err := build(false).Validate()
	if want := (Place{Item: Item{Kind: SegmentItem}, Property: TemperatureDifferenceProperty}); !errors.As(err, &ve) || len(ve.Problems) != 1 || ve.Problems[0].Place != want {
		t.Fatalf("no case takes the temperature difference: got %v, want one refusal at %+v", err, want)
	}
	m := build(true)
	for _, c := range []struct {
		name   string
		set    int
		moment float64 // the left end's reaction moment, N·m
	}{
		{"imposed", 0, 1e3 * L / 8}, // P·L/8 (fixed-ended beam, central load; AISC beam diagrams, from memory)
		{"sun", 1, ei * kappa},
	} {
		set := m.LoadSet(c.set)
		e, err := SolveExact(&set)
		if err != nil {
			t.Fatal(err)
		}
		if got := e.Reactions()[0].Force[Rotation]; relErr(got, c.moment) > 1e-9 {
			t.Errorf("%s: left end moment %.9g, want %.9g", c.name, got, c.moment)
		}
	}
}

// A combination takes a case's temperature difference with the case's
// factor, as it takes the case's loads. A beam fixed at both ends with a
// central load P in one case and the temperature difference in another:
// the combination 1.35·imposed + 1.5·sun has the left end's reaction
// moment 1.35·P·L/8 + 1.5·EI·κ and the end reactions 1.35·P/2 (the
// temperature difference of a fixed-ended beam bends it by end moments
// alone, M = −EI·κ; Roark's, thermal bending of beams; P·L/8 and P/2 from
// the AISC beam diagrams; from memory). The combinations' loads left the
// temperature difference out, so the combination had the imposed case's
// moment alone.
func TestTemperatureDifferenceInCombinations(t *testing.T) {
	const L, dT, depth, P = 6.0, 30.0, 0.3, -1e3
	ei := testE * testI
	kappa := testα * dT / depth
	seg := testSegment(0, L)
	seg.Section.Depth, seg.TemperatureDifference = depth, dT
	m := &Model{
		Segments: []Segment{seg},
		Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}},
		Cases: []LoadCase{
			{Name: "imposed", PointLoads: []PointLoad{{X: L / 2, Transverse: P}}},
			{Name: "sun", ThermalGradient: true},
		},
		Combinations: []Combination{{Name: "ULS", Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1.35}, {Case: 1, Factor: 1.5}}}},
		Mesh:         MeshSettings{Elements: 8},
	}
	_, cs := solveCombinations(t, m)
	fe, err := cs.Solution(0)
	if err != nil {
		t.Fatal(err)
	}
	ex, err := cs.Exact(0)
	if err != nil {
		t.Fatal(err)
	}
	wantMoment, wantShear := -1.35*P*L/8+1.5*ei*kappa, -1.35*P/2
	for name, rs := range map[string][]Reaction{"FE": fe.Reactions, "exact": ex.Reactions()} {
		if got := rs[0].Force[Rotation]; relErr(got, wantMoment) > 1e-9 {
			t.Errorf("%s: left end moment %.9g, want %.9g", name, got, wantMoment)
		}
		if got := rs[0].Force[Transverse]; relErr(got, wantShear) > 1e-9 {
			t.Errorf("%s: left end reaction %.9g, want %.9g", name, got, wantShear)
		}
	}
	// The moment at midspan: 1.35·P·L/8 sagging less 1.5·EI·κ.
	if got, want := ex.At(L/2, Right).BendingMoment, -1.35*P*L/8-1.5*ei*kappa; relErr(got, want) > 1e-9 {
		t.Errorf("exact midspan moment %.9g, want %.9g", got, want)
	}
}

// A beam fixed at both ends whose segments, alike in stiffness, are
// curved differently by their temperature differences: free curvatures κᵢ
// on stretches [aᵢ, bᵢ]. The moment is linear, M = M₀ + V·x, and the end
// rotations and deflections vanish (the moment-area theorems, from
// memory): M₀·L + V·L²/2 = −EI·∫κ dx and M₀·L²/2 + V·L³/3 = −EI·∫x·κ dx.
// The key-point system merged the breaks between segments of equal EA, EI
// and α, so the finite element solution took one segment's curvature for
// both (zero reactions with the difference on the first half only); the
// exact solution was right.
func TestTemperatureDifferencesOfSegmentsAlike(t *testing.T) {
	const L = 6.0
	ei := testE * testI
	for _, c := range []struct {
		name       string
		difference [2]float64 // K, of the segments [0, 3] and [3, 6]
		depth      [2]float64 // m
	}{
		{"first half warmer below", [2]float64{30, 0}, [2]float64{0.3, 0.3}},
		{"second half warmer below", [2]float64{0, 30}, [2]float64{0.3, 0.3}},
		{"both, unequal", [2]float64{30, -10}, [2]float64{0.3, 0.3}},
		{"both the same, different depths", [2]float64{30, 30}, [2]float64{0.3, 0.6}},
	} {
		var segs []Segment
		var integral, moment float64 // ∫κ dx, ∫x·κ dx
		for i := range 2 {
			s := testSegment(3*float64(i), 3*float64(i+1))
			s.Section.Depth, s.TemperatureDifference = c.depth[i], c.difference[i]
			segs = append(segs, s)
			k := testα * c.difference[i] / c.depth[i]
			integral += k * 3
			moment += k * (s.End*s.End - s.Start*s.Start) / 2
		}
		// Solve the two compatibility equations for M₀ and V.
		a, b, d := L, L*L/2, L*L*L/3
		det := a*d - b*b
		m0 := (-ei*integral*d + b*ei*moment) / det
		v := (-a*ei*moment + b*ei*integral) / det
		m := &Model{Segments: segs, Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}}, Mesh: MeshSettings{Elements: 8}}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		want := [2][2]float64{{v, -m0}, {-v, m0 + v*L}} // transverse and moment reactions at 0 and L
		scale := math.Abs(m0) + math.Abs(v)*L
		for name, rs := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
			for i, r := range rs {
				if math.Abs(r.Force[Transverse]-want[i][0])*L > 1e-9*scale || math.Abs(r.Force[Rotation]-want[i][1]) > 1e-9*scale {
					t.Errorf("%s, %s: support %d takes %.9g N, %.9g N·m; want %.9g N, %.9g N·m", c.name, name, i+1, r.Force[Transverse], r.Force[Rotation], want[i][0], want[i][1])
				}
			}
		}
		if w := s.At(1.5, Right).Deflection - e.At(1.5, Right).Deflection; math.Abs(w) > 1e-9*testα*30/0.3*L*L {
			t.Errorf("%s: FE deflection at 1.5 m off the exact one by %.3g m", c.name, w)
		}
	}
}
