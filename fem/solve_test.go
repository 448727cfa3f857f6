package fem

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"strings"
	"testing"
)

// Section and material of a steel test member (invented, typical values).
const (
	testE = 200e9  // Pa
	testA = 5e-3   // m²
	testI = 8e-5   // m⁴
	testC = 0.15   // m
	testL = 6.0    // m
	testP = -10e3  // N
	testQ = -4e3   // N/m
	testα = 1.2e-5 // 1/K
)

func testSegment(start, end float64) Segment {
	return Segment{
		Start: start, End: end,
		Section:  Section{Area: testA, SecondMoment: testI, FibreDistance: testC},
		Material: Material{Elastic: testE, Density: 7850, ThermalExpansion: testα},
	}
}

func testModel(supports ...Support) *Model {
	return &Model{Segments: []Segment{testSegment(0, testL)}, Supports: supports, Mesh: MeshSettings{Elements: 8}}
}

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

func mustSolve(t *testing.T, m *Model) *Solution {
	t.Helper()
	s, err := Solve(m)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	return s
}

// Hermite beam elements with consistent loads give nodal values exact to
// round-off (Hughes, The Finite Element Method, §1.10, from memory), so the
// handbook values below are checked tightly at nodes.
func TestHandbookBeams(t *testing.T) {
	EI := testE * testI
	L, P, q := testL, testP, testQ
	// With nodal values exact, the element's moment is the exact moment less the
	// fixed-end moment diagram of its own load, which is q·h²/12 (hogging) at
	// its ends (fixed-end moment tables, e.g. AISC beam diagrams case 15, from
	// memory); testModel uses 8 elements.
	h := L / 8
	cases := []struct {
		name     string
		model    *Model
		x        float64
		side     Side
		want     func(f Fields) float64
		expected float64
	}{
		{
			// Cantilever, end load: tip deflection P·L³/(3EI).
			// Source: Gere & Goodno, Mechanics of Materials, app. G table G-1 case 4, from memory.
			name:     "cantilever tip load: tip deflection",
			model:    withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: L, Transverse: P}),
			x:        L,
			want:     func(f Fields) float64 { return f.Deflection },
			expected: P * L * L * L / (3 * EI),
		},
		{
			// Same case: tip rotation P·L²/(2EI) (Gere & Goodno, table G-1, from memory).
			name:     "cantilever tip load: tip rotation",
			model:    withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: L, Transverse: P}),
			x:        L,
			want:     func(f Fields) float64 { return f.Rotation },
			expected: P * L * L / (2 * EI),
		},
		{
			// Cantilever: root moment P·L, hogging (< 0) for a downward P (statics).
			// M is linear here, so the element reproduces it exactly.
			name:     "cantilever tip load: root moment",
			model:    withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: L, Transverse: P}),
			x:        0,
			side:     Right,
			want:     func(f Fields) float64 { return f.BendingMoment },
			expected: P * L,
		},
		{
			// Simply supported, uniform load: midspan deflection 5qL⁴/(384EI).
			// Source: AISC Manual beam diagrams case 1; Roark table 8.1 case 2e; from memory.
			name:     "simply supported uniform load: midspan deflection",
			model:    withUniform(testModel(Support{X: 0, Kind: Pinned}, Support{X: L, Kind: Roller}), q),
			x:        L / 2,
			want:     func(f Fields) float64 { return f.Deflection },
			expected: 5 * q * L * L * L * L / (384 * EI),
		},
		{
			// Same case: midspan moment |q|L²/8 sagging, so −q·L²/8 here (AISC beam
			// diagrams case 1, from memory), less the element's fixed-end moment.
			name:     "simply supported uniform load: midspan moment",
			model:    withUniform(testModel(Support{X: 0, Kind: Pinned}, Support{X: L, Kind: Roller}), q),
			x:        L / 2,
			want:     func(f Fields) float64 { return f.BendingMoment },
			expected: -q*L*L/8 - q*h*h/12,
		},
		{
			// Fixed-fixed, uniform load: end moment |q|L²/12 hogging (AISC case 15,
			// from memory), less the element's fixed-end moment.
			name:     "fixed-fixed uniform load: end moment",
			model:    withUniform(testModel(Support{X: 0, Kind: Fixed}, Support{X: L, Kind: Fixed}), q),
			x:        0,
			side:     Right,
			want:     func(f Fields) float64 { return f.BendingMoment },
			expected: q*L*L/12 - q*h*h/12,
		},
		{
			// Simply supported, downward uniform load: V = dM/dx = −q·(L/2 − x) > 0 at
			// the left end (statics). The element's constant V is the exact V at its
			// middle, x = h/2.
			name:     "simply supported uniform load: left shear",
			model:    withUniform(testModel(Support{X: 0, Kind: Pinned}, Support{X: L, Kind: Roller}), q),
			x:        0,
			side:     Right,
			want:     func(f Fields) float64 { return f.ShearForce },
			expected: -q * (L/2 - h/2),
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			s := mustSolve(t, c.model)
			side := c.side
			if side == 0 {
				side = Left
			}
			got := c.want(s.At(c.x, side))
			if relErr(got, c.expected) > 1e-9 {
				t.Errorf("got %.10g, want %.10g (rel. error %.2g)", got, c.expected, relErr(got, c.expected))
			}
		})
	}
}

func withPointLoad(m *Model, p PointLoad) *Model {
	m.PointLoads = append(m.PointLoads, p)
	return m
}

func withUniform(m *Model, q float64) *Model {
	m.DistributedLoad = append(m.DistributedLoad, DistributedLoad{Direction: Transverse, Points: []LoadPoint{{0, q}, {m.Length(), q}}})
	return m
}

// A bar fixed at both ends and heated by ΔT carries N = −EA·α·ΔT and does not
// move (Gere & Goodno, Mechanics of Materials, §2.5 thermal effects, from memory).
func TestThermalBarFixedBothEnds(t *testing.T) {
	for _, order := range []ElementOrder{LinearBar, QuadraticBar} {
		m := testModel(Support{X: 0, Kind: Fixed}, Support{X: testL, Kind: Fixed})
		m.TemperatureChange = 40
		m.Mesh.BarOrder = order
		s := mustSolve(t, m)
		want := -testE * testA * testα * 40
		for _, f := range s.Sample(3) {
			if relErr(f.AxialForce, want) > 1e-12 || math.Abs(f.AxialDisplacement) > 1e-15 {
				t.Fatalf("order %d at x = %g: N = %g, u = %g; want N = %g, u = 0", order, f.X, f.AxialForce, f.AxialDisplacement, want)
			}
		}
		// The support at x = 0 pushes the member towards +x: R = −N.
		if relErr(s.Reactions[0].Force[Axial], -want) > 1e-12 {
			t.Errorf("order %d: left axial reaction %g, want %g", order, s.Reactions[0].Force[Axial], -want)
		}
		if s.StrainEnergy <= 0 || relErr(s.StrainEnergy, 0.5*want*want/(testE*testA)*testL) > 1e-12 {
			t.Errorf("order %d: strain energy %g, want N²L/(2EA) = %g", order, s.StrainEnergy, 0.5*want*want/(testE*testA)*testL)
		}
	}
}

// A free bar heated by ΔT (held only at x = 0) lengthens by αΔT·L with no force.
func TestThermalBarFree(t *testing.T) {
	m := testModel(Support{X: 0, Kind: Fixed})
	m.TemperatureChange = 25
	s := mustSolve(t, m)
	f := s.At(testL, Left)
	if relErr(f.AxialDisplacement, testα*25*testL) > 1e-12 || math.Abs(f.AxialForce) > 1e-6 {
		t.Errorf("u(L) = %g, N = %g; want %g, 0", f.AxialDisplacement, f.AxialForce, testα*25*testL)
	}
	if s.StrainEnergy > 1e-20 {
		t.Errorf("strain energy %g of a freely expanding bar, want 0", s.StrainEnergy)
	}
}

// A settlement δ of the right support of a propped cantilever gives the
// reaction 3EIδ/L³, pulling the member the way it settles (Roark, table 8.1 case 1c with an end displacement,
// from memory; equivalently the tip stiffness 3EI/L³ of a cantilever).
func TestSettlement(t *testing.T) {
	delta := -0.01
	m := testModel(Support{X: 0, Kind: Fixed}, Support{X: testL, Kind: Roller, Settlement: [3]float64{0, delta, 0}})
	s := mustSolve(t, m)
	want := 3 * testE * testI * delta / (testL * testL * testL)
	if got := s.Reactions[1].Force[Transverse]; relErr(got, want) > 1e-9 {
		t.Errorf("reaction at the settled support %g, want %g", got, want)
	}
	if got := s.At(testL, Left).Deflection; relErr(got, delta) > 1e-12 {
		t.Errorf("deflection at the settled support %g, want %g", got, delta)
	}
	checkEquilibrium(t, s)
}

// A cantilever on a spring at its tip: the tip deflection is P/(k + 3EI/L³)
// (springs in parallel with the cantilever tip stiffness, Roark ch. 8, from memory).
func TestSpringSupport(t *testing.T) {
	k := 2e6
	m := withPointLoad(testModel(Support{X: 0, Kind: Fixed}, Support{X: testL, Kind: Spring, Stiffness: [3]float64{0, k, 0}}), PointLoad{X: testL, Transverse: testP})
	s := mustSolve(t, m)
	want := testP / (k + 3*testE*testI/(testL*testL*testL))
	if got := s.Displacement[len(s.Displacement)-1][Transverse]; relErr(got, want) > 1e-9 {
		t.Errorf("tip deflection %g, want %g", got, want)
	}
	if got := s.Reactions[1].Force[Transverse]; relErr(got, -k*want) > 1e-9 {
		t.Errorf("spring reaction %g, want %g", got, -k*want)
	}
	checkEquilibrium(t, s)
}

func checkEquilibrium(t *testing.T, s *Solution) {
	t.Helper()
	scale := 0.0
	for _, v := range s.Equilibrium.Applied {
		scale = max(scale, math.Abs(v))
	}
	for _, r := range s.Reactions {
		for _, v := range r.Force {
			scale = max(scale, math.Abs(v))
		}
	}
	scale = max(scale, 1)
	for i, r := range s.Equilibrium.Residual {
		if math.Abs(r) > 1e-11*scale*max(1, s.Model.Length()) {
			t.Errorf("equilibrium residual[%d] = %g (applied %v, reactions %v)", i, r, s.Equilibrium.Applied, s.Equilibrium.Reactions)
		}
	}
}

// A model with every kind of load on three segments must balance to round-off.
func TestEquilibriumMixedModel(t *testing.T) {
	for _, order := range []ElementOrder{LinearBar, QuadraticBar} {
		m := mixedModel(40)
		m.Mesh.BarOrder = order
		s := mustSolve(t, m)
		checkEquilibrium(t, s)
		if s.Equilibrium.Applied[1] == 0 || s.Equilibrium.Applied[0] == 0 || s.Equilibrium.Applied[2] == 0 {
			t.Errorf("mixed model applies no load in some direction: %v", s.Equilibrium.Applied)
		}
	}
}

// mixedModel is a three-span member with every kind of load and support.
func mixedModel(elements int) *Model {
	a, b := testSegment(0, 2.5), testSegment(2.5, 4)
	b.Section.SecondMoment *= 2
	c := testSegment(4, 7)
	c.Material.Elastic = 70e9
	return &Model{
		Segments: []Segment{a, b, c},
		Supports: []Support{
			{X: 0, Kind: Pinned},
			{X: 3.2, Kind: Spring, Stiffness: [3]float64{1e7, 5e6, 1e5}},
			{X: 5.5, Kind: Roller, Settlement: [3]float64{0, -0.002, 0}},
			{X: 7, Kind: Guided},
		},
		PointLoads: []PointLoad{{X: 1.3, Axial: 2e3, Transverse: -8e3, Moment: 1.5e3}, {X: 6.1, Transverse: 3e3}},
		DistributedLoad: []DistributedLoad{
			{Direction: Transverse, Points: []LoadPoint{{0.5, -2e3}, {2, -5e3}, {4.5, -1e3}}},
			{Direction: Axial, Points: []LoadPoint{{1, 500}, {6, -300}}},
		},
		Gravity:           [2]float64{-1.0, -StandardGravity},
		TemperatureChange: 15,
		Mesh:              MeshSettings{Elements: elements},
	}
}

func TestMechanisms(t *testing.T) {
	cases := []struct {
		name     string
		supports []Support
		motion   string
		message  string
	}{
		{"no supports", nil, "axial", "the member can slide along its axis: add an axial restraint (pinned, fixed, axial or spring support)"},
		{"two rollers", []Support{{X: 0, Kind: Roller}, {X: 6, Kind: Roller}}, "axial", "the member can slide along its axis: add an axial restraint (pinned, fixed, axial or spring support)"},
		{"axial only", []Support{{X: 0, Kind: AxialOnly}}, "transverse", "the member can move sideways: add a support that restrains deflection"},
		{"guided only: rotation restraint alone", []Support{{X: 2, Kind: Guided}}, "transverse", "the member can move sideways: add a support that restrains deflection"},
		{"one pin", []Support{{X: 2, Kind: Pinned}}, "rotation", "the member can rotate about the support at x = 2.0 m: add a second support or fix one end"},
		{"pin and axial spring", []Support{{X: 2, Kind: Pinned}, {X: 5, Kind: Spring, Stiffness: [3]float64{1e6, 0, 0}}}, "rotation", "the member can rotate about the support at x = 2.0 m: add a second support or fix one end"},
		{"spring in deflection only", []Support{{X: 1.5, Kind: Spring, Stiffness: [3]float64{1e6, 1e6, 0}}}, "rotation", "the member can rotate about the support at x = 1.5 m: add a second support or fix one end"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			// A load across the member: one with nothing across it at all is
			// solved as a bar alone (TestTieOnAxialSupports).
			_, err := Solve(withPointLoad(testModel(c.supports...), PointLoad{X: 3, Transverse: -1}))
			var me *MechanismError
			if !errors.As(err, &me) {
				t.Fatalf("got error %v, want a *MechanismError", err)
			}
			if me.Motion != c.motion || me.Message != c.message {
				t.Errorf("got (%q, %q), want (%q, %q)", me.Motion, me.Message, c.motion, c.message)
			}
		})
	}
	// Stable arrangements must solve.
	for _, sup := range [][]Support{
		{{X: 0, Kind: Fixed}},
		{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}},
		{{X: 0, Kind: Roller}, {X: 6, Kind: Guided}},
		{{X: 3, Kind: Spring, Stiffness: [3]float64{1e6, 1e6, 1e6}}},
	} {
		if _, err := Solve(withUniform(testModel(sup...), testQ)); err != nil {
			t.Errorf("supports %v: %v", sup, err)
		}
	}
}

// BenchmarkSolve shows how Solve scales with the element count (it should be
// linear) on a three-span member with every kind of load and support; it
// reports the bytes allocated per element and the heap in use, per element,
// with the last solution alive.
func BenchmarkSolve(b *testing.B) {
	for _, n := range []int{1_000, 10_000, 100_000, 1_000_000} {
		b.Run(fmt.Sprintf("elements=%d", n), func(b *testing.B) {
			m := mixedModel(n)
			var s *Solution
			var before, after runtime.MemStats
			runtime.GC()
			runtime.ReadMemStats(&before)
			for b.Loop() {
				var err error
				if s, err = Solve(m); err != nil {
					b.Fatal(err)
				}
			}
			runtime.ReadMemStats(&after)
			elements := float64(len(s.Mesh.Elements))
			b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/elements, "B/element")
			runtime.GC()
			runtime.ReadMemStats(&after)
			b.ReportMetric(float64(after.HeapInuse-before.HeapInuse)/elements, "heap-B/element")
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/elements, "ns/element")
			runtime.KeepAlive(s)
		})
	}
}

// BenchmarkSample evaluates 10 points in each of 100,000 elements.
func BenchmarkSample(b *testing.B) {
	s, err := Solve(mixedModel(100_000))
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		_ = s.Sample(10)
	}
}

// The hierarchical solve keeps fine meshes as accurate as coarse ones, so
// many elements raise no warning, nor do point loads or a patch load a
// fraction of a millimetre long (loads stay out of the key-point system,
// pieces.go). What remains ill-conditioned is a key-point system with a very
// short stretch free to deform, here a stiffer segment a fraction of a
// millimetre long; there the warning must appear, and its bound Condition·ε
// must cover the error measured against the exact solution.
func TestConditionWarning(t *testing.T) {
	for _, n := range []int{20, 100_000} {
		m := withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: testL, Transverse: testP})
		m.Mesh.Elements = n
		s := mustSolve(t, m)
		if len(s.Warnings) != 0 || s.Condition > 1e3 {
			t.Errorf("%d elements: condition %.3g, warnings %v; want below 1e3 and none", n, s.Condition, s.Warnings)
		}
	}
	for _, c := range []struct {
		name string
		gap  float64 // relative to L
		warn bool
	}{{"point loads", 1e-6, false}, {"patch load", 1e-3, false}, {"patch load", 1e-6, false}, {"stiffer segment", 1e-4, true}} {
		m := withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: 3, Transverse: testP})
		switch c.name {
		case "patch load":
			m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{3, testQ}, {3 + c.gap*testL, testQ}}}}
		case "stiffer segment":
			stiff := testSegment(3, 3+c.gap*testL)
			stiff.Section.SecondMoment *= 2
			m.Segments = []Segment{testSegment(0, 3), stiff, testSegment(3+c.gap*testL, testL)}
		default:
			m = withPointLoad(m, PointLoad{X: 3 + c.gap*testL, Transverse: -testP / 2})
		}
		m.Mesh.Elements = 1000
		s := mustSolve(t, m)
		warned := len(s.Warnings) == 1 && strings.Contains(s.Warnings[0], "beam stiffness matrix is ill-conditioned")
		if warned != c.warn {
			t.Errorf("%s %g·L apart: condition %.3g, warnings %v; want a warning: %v", c.name, c.gap, s.Condition, s.Warnings, c.warn)
		}
		ex, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		var worst, largest float64
		for i, x := range s.Mesh.X {
			e := ex.At(x, Right)
			worst = max(worst, math.Abs(s.Displacement[i][Transverse]-e.Deflection))
			largest = max(largest, math.Abs(e.Deflection))
		}
		t.Logf("%s %g·L apart: condition %.3g, nodal deflection error %.2g", c.name, c.gap, s.Condition, worst/largest)
		if bound := max(1e-12, s.Condition*0x1p-52); worst/largest > bound {
			t.Errorf("%s %g·L apart: nodal deflection error %.3g of the largest, above max(1e-12, Condition·ε) = %.3g", c.name, c.gap, worst/largest, bound)
		}
	}
	if w := conditionWarning("beam", 1e17); !strings.Contains(w, "meaningless") {
		t.Errorf("condition 1e17: %q", w)
	}
}

// A stiffer segment a nanometre long cannot be solved to working precision:
// the refusal names that stretch and its length instead of blaming springs.
func TestShortStiffStretchNamed(t *testing.T) {
	m := withPointLoad(testModel(Support{X: 0, Kind: Fixed}), PointLoad{X: testL, Transverse: testP})
	stiff := testSegment(3, 3+1e-9)
	stiff.Section.SecondMoment *= 2
	m.Segments = []Segment{testSegment(0, 3), stiff, testSegment(3+1e-9, testL)}
	_, err := Solve(m)
	if err == nil || !strings.Contains(err.Error(), "from x = 3.0 m to 3.000000001 m, only 1e-09 m long") {
		t.Errorf("got %v, want a refusal naming the stretch from x = 3.0 m to 3.000000001 m, only 1e-09 m long", err)
	}
}
