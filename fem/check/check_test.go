package check

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
)

// beam builds a one-segment member of a 100 × 200 mm rectangle in a steel
// with E = 200 GPa: A = 0.02 m², I = b·h³/12 = 6.667e-5 m⁴, c = 0.1 m.
func beam(length float64, supports []fem.Support, allowable float64) fem.Model {
	return fem.Model{
		Segments: []fem.Segment{{Start: 0, End: length,
			Section:  fem.Section{Area: 0.02, SecondMoment: 0.1 * 0.008 / 12, FibreDistance: 0.1},
			Material: fem.Material{Name: "steel", Elastic: 200e9, Density: 7850, ThermalExpansion: 12e-6, Allowable: allowable}}},
		Supports: supports,
		Mesh:     fem.MeshSettings{Elements: 8},
	}
}

func uniform(q, a, b float64) fem.DistributedLoad {
	return fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: a, Intensity: q}, {X: b, Intensity: q}}}
}

func solveBoth(t testing.TB, m *fem.Model) (*fem.Solution, *fem.Exact) {
	t.Helper()
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatalf("solve: %v", err)
	}
	e, err := fem.SolveExact(m)
	if err != nil {
		t.Fatalf("exact: %v", err)
	}
	return s, e
}

func find(t *testing.T, results []Result, prefix string) Result {
	t.Helper()
	for _, r := range results {
		if strings.HasPrefix(r.Name, prefix) {
			return r
		}
	}
	t.Fatalf("no result named %q in %v", prefix, names(results))
	return Result{}
}

func names(results []Result) []string {
	var out []string
	for _, r := range results {
		out = append(out, r.Name)
	}
	return out
}

func near(got, want, relative float64) bool { return math.Abs(got-want) <= relative*math.Abs(want) }

// Simply supported, 4 m, P = −20 kN at midspan: M = PL/4 = 20 kN·m and
// δ = PL³/(48EI) = 2.0 mm (Roark's Table 8.1 case 1e, from memory);
// S = bh²/6 = 6.667e-4 m³ so σ = 30 MPa. With 200 MPa allowable and a safety
// factor of 1.5 the limit is 133.3 MPa and the utilisation 0.225.
func TestHandComputedUtilisation(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 200e6)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -20e3}}
	s, e := solveBoth(t, &m)
	results := Run(&m, s, e, Options{SafetyFactor: 1.5, SpanRatio: 360})
	for _, r := range results {
		t.Logf("%-40s %-5v %s", r.Name, r.Status, r.Message)
	}

	stress := find(t, results, "Stress, segment 1")
	if !near(stress.Value, 30e6, 1e-9) || !near(stress.Limit, 200e6/1.5, 1e-12) || !near(stress.X, 2, 1e-9) || stress.Status != Pass {
		t.Errorf("stress: value %g at x = %g, limit %g, status %v; want 30 MPa at 2 m, 133.3 MPa, pass", stress.Value, stress.X, stress.Limit, stress.Status)
	}
	if !strings.Contains(stress.Message, "Utilisation 0.23") {
		t.Errorf("stress message %q should state utilisation 0.225", stress.Message)
	}

	deflection := find(t, results, "Deflection, span")
	if !near(deflection.Value, 2.0e-3, 1e-9) || !near(deflection.Limit, 4.0/360, 1e-12) || deflection.Status != Pass {
		t.Errorf("deflection: %g (limit %g) %v, want 2.0 mm against 11.1 mm, pass", deflection.Value, deflection.Limit, deflection.Status)
	}
	// A 1.6 mm limit (span/2500) must fail.
	strict := find(t, Run(&m, s, e, Options{SpanRatio: 2500}), "Deflection, span")
	if strict.Status != Fail {
		t.Errorf("span/2500 = 1.6 mm against 2.0 mm: status %v, want fail", strict.Status)
	}
	// Overstressed when the allowable drops below 30 MPa.
	m2 := m
	m2.Segments = append([]fem.Segment(nil), m.Segments...)
	m2.Segments[0].Material.Allowable = 25e6
	s2, e2 := solveBoth(t, &m2)
	if r := find(t, Run(&m2, s2, e2, Options{}), "Stress"); r.Status != Fail || !near(r.Value/r.Limit, 1.2, 1e-9) {
		t.Errorf("30 MPa against 25 MPa: status %v, utilisation %g, want fail and 1.2", r.Status, r.Value/r.Limit)
	}

	for _, prefix := range []string{"Equilibrium, axial", "Equilibrium, transverse", "Equilibrium, moments"} {
		if r := find(t, results, prefix); r.Status != Pass || !near(r.Value, r.Limit, 1e-9) && math.Abs(r.Value-r.Limit) > 1e-6 {
			t.Errorf("%s: applied %g vs reactions %g, status %v", prefix, r.Value, -r.Limit, r.Status)
		}
	}
	if r := find(t, results, "Equilibrium, transverse"); !near(r.Value, -20e3, 1e-12) {
		t.Errorf("applied transverse load %g, want −20 kN", r.Value)
	}
	if r := find(t, results, "Handbook: deflection at midspan"); r.Status != Pass {
		t.Errorf("handbook: %v: %s", r.Status, r.Message)
	}
	for _, r := range results {
		if r.Caution != Caution {
			t.Errorf("%s carries no caution", r.Name)
		}
	}
}

// A cantilever: the deflection limit uses its own length over the
// cantilever ratio, and says so.
func TestCantileverDeflectionLimit(t *testing.T) {
	m := beam(2, []fem.Support{{X: 0, Kind: fem.Fixed}}, 0)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -5e3}}
	s, e := solveBoth(t, &m)
	r := find(t, Run(&m, s, e, Options{}), "Deflection, cantilever")
	// δ = PL³/(3EI) = 5000·8/(3·1.3333e7) = 1.0 mm (Gere & Goodno, Table G-1, from memory).
	if !near(r.Value, 1e-3, 1e-9) || !near(r.Limit, 2.0/180, 1e-12) || !near(r.X, 2, 1e-12) {
		t.Errorf("cantilever: %g at %g against %g; want 1 mm at 2 m against L/180", r.Value, r.X, r.Limit)
	}
	if !strings.Contains(r.Message, "uses its own length") {
		t.Errorf("cantilever message should explain the length used: %q", r.Message)
	}
	if r := find(t, Run(&m, s, e, Options{}), "Stress"); r.Status != Info {
		t.Errorf("no allowable given: status %v, want info", r.Status)
	}
	// A stricter limit for spans leaves a cantilever at length/180: the
	// message must say so rather than call that limit the user's choice.
	strict := find(t, Run(&m, s, e, Options{SpanRatio: 500}), "Deflection, cantilever")
	if !near(strict.Limit, 2.0/180, 1e-12) || strings.Contains(strict.Message, "user choice") || !strings.Contains(strict.Message, "span/500") {
		t.Errorf("span/500 set: cantilever limit %g; want L/180, with a message that names span/500 as not applying: %q", strict.Limit, strict.Message)
	}
}

// A settlement moves an overhang or a cantilever as a rigid body, which the
// deflection check leaves out as it does in a span: with or without it the
// tip of an overhang a beyond a span L under P at the tip deflects
// P·a²·(L + a)/(3EI) (Roark's Formulas for Stress and Strain, Table 8.1,
// overhanging beam, from memory), and a cantilever P·L³/(3EI) (Gere &
// Goodno, Table G-1, from memory). EI = 1.3333e7 N·m² (beam above).
func TestDeflectionLeavesSettlementOut(t *testing.T) {
	const ei = 200e9 * 0.1 * 0.008 / 12
	settled := func(kind fem.SupportKind, x, w, theta float64) fem.Support {
		return fem.Support{X: x, Kind: kind, Settlement: [3]float64{0, w, theta}}
	}
	overhang := 5e3 * 1 * 1 * (5 + 1) / (3 * ei)
	// The span between the supports bows up by P·a·L²/(9·√3·EI) at
	// x = L/√3 (AISC Manual, beam overhanging one support, from memory).
	spanUp := 5e3 * 1 * 25 / (9 * math.Sqrt(3) * ei)
	tests := []struct {
		name     string
		length   float64
		supports []fem.Support
		check    string
		want     float64
	}{
		{"overhang, no settlement", 6, []fem.Support{settled(fem.Pinned, 0, 0, 0), settled(fem.Roller, 5, 0, 0)}, "Deflection, cantilever", overhang},
		{"overhang, its own support settles", 6, []fem.Support{settled(fem.Pinned, 0, 0, 0), settled(fem.Roller, 5, -0.01, 0)}, "Deflection, cantilever", overhang},
		{"overhang, the far support settles", 6, []fem.Support{settled(fem.Pinned, 0, -0.01, 0), settled(fem.Roller, 5, 0, 0)}, "Deflection, cantilever", overhang},
		{"span beside it, a support settles", 6, []fem.Support{settled(fem.Pinned, 0, -0.01, 0), settled(fem.Roller, 5, 0, 0)}, "Deflection, span", spanUp},
		{"cantilever settled across and in rotation", 2, []fem.Support{settled(fem.Fixed, 0, -0.01, -0.002)}, "Deflection, cantilever", 5e3 * 8 / (3 * ei)},
		// A support that holds rotation keeps its overhang from tilting when
		// the far support settles: the overhang deflects as a cantilever of
		// length a fixed there, P·a³/(3EI) (Gere & Goodno, Table G-1, from memory).
		{"overhang at a fixed support, the far support settles", 6, []fem.Support{settled(fem.Pinned, 0, -0.01, 0), settled(fem.Fixed, 5, 0, 0)}, "Deflection, cantilever", 5e3 / (3 * ei)},
		{"overhang at a fixed support turned by a settlement, the far support settles", 6, []fem.Support{settled(fem.Pinned, 0, -0.01, 0), settled(fem.Fixed, 5, 0, 0.003)}, "Deflection, cantilever", 5e3 / (3 * ei)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			tipLoadDeflection(t, tt.length, tt.supports, tt.check, tt.want)
		})
	}
}

// tipLoadDeflection is the deflection check named check of a member of
// the given length (beam) on supports under 5 kN down at its end, after
// testing that the exact and the finite element values are want.
func tipLoadDeflection(t *testing.T, length float64, supports []fem.Support, check string, want float64) Result {
	t.Helper()
	m := beam(length, supports, 0)
	m.PointLoads = []fem.PointLoad{{X: length, Transverse: -5e3}}
	s, e := solveBoth(t, &m)
	r := find(t, Run(&m, s, e, Options{}), check)
	if !near(r.Value, want, 1e-9) || !near(r.FE, want, 1e-9) {
		t.Errorf("%s: exact %g, FE %g; want %g", check, r.Value, r.FE, want)
	}
	return r
}

// Theoretical effective length factors are the roots of the buckling
// equations of an elastic column (Timoshenko & Gere, Theory of Elastic
// Stability, ch. 2, from memory): with k² = P/EI, fixed–pinned has
// tan(kL) = kL, fixed–fixed sin(kL/2) = 0, fixed–free and pinned–guided
// cos(kL) = 0, pinned–pinned and fixed–guided sin(kL) = 0. K = π/(kL).
func TestTheoreticalEffectiveLengths(t *testing.T) {
	cases := []struct {
		a, b           EndCondition
		characteristic func(kl float64) float64
		design         float64 // AISC Table C-A-7.1 recommended value, from memory
	}{
		{Fixed, Pinned, func(kl float64) float64 { return math.Tan(kl) - kl }, 0.8},
		{Fixed, Fixed, func(kl float64) float64 { return math.Sin(kl / 2) }, 0.65},
		{Fixed, Free, func(kl float64) float64 { return math.Cos(kl) }, 2.1},
		{Pinned, Guided, func(kl float64) float64 { return math.Cos(kl) }, 2.0},
		{Pinned, Pinned, func(kl float64) float64 { return math.Sin(kl) }, 1.0},
		{Guided, Fixed, func(kl float64) float64 { return math.Sin(kl) }, 1.2},
	}
	for _, c := range cases {
		k, ok := LookUpEffectiveLength(c.a, c.b)
		if !ok {
			t.Errorf("%v–%v not recognised", c.a, c.b)
			continue
		}
		kl := math.Pi / k.Theoretical
		// The factor is rounded to three figures: the residual of the
		// characteristic equation must vanish to that accuracy.
		if r := c.characteristic(kl); math.Abs(r) > 5e-3*math.Max(1, kl) {
			t.Errorf("%v–%v: K = %g gives kL = %g, residual %g", c.a, c.b, k.Theoretical, kl, r)
		}
		if k.Design != c.design || k.Design < k.Theoretical {
			t.Errorf("%v–%v: design K = %g, want %g (not below theoretical %g)", c.a, c.b, k.Design, c.design, k.Theoretical)
		}
		if !strings.Contains(k.Source, "C-A-7.1") {
			t.Errorf("%v–%v: source %q", c.a, c.b, k.Source)
		}
	}
	for _, pair := range [][2]EndCondition{{Free, Free}, {Pinned, Free}, {Elastic, Fixed}} {
		if _, ok := LookUpEffectiveLength(pair[0], pair[1]); ok {
			t.Errorf("%v–%v recognised, but it is no standard case", pair[0], pair[1])
		}
	}
}

// Euler load π²EI/(KL)² of a column under an end load, through Run.
func TestEulerBuckling(t *testing.T) {
	const L, P = 3.0, 5e6
	ei := 200e9 * 0.1 * 0.008 / 12
	cases := []struct {
		name        string
		supports    []fem.Support
		at          float64 // where the load −P acts
		compression float64 // largest compression, N
		factor      float64 // recommended design K, AISC Table C-A-7.1 (from memory)
	}{
		{"fixed–free", []fem.Support{{X: 0, Kind: fem.Fixed}}, L, P, 2.1},
		{"pinned–pinned", []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}, L, P, 1.0},
		{"fixed–pinned", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}}, L, P, 0.8},
		// Where both ends are held axially a load at mid-height is shared, half in compression.
		{"fixed–guided", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Guided}}, L / 2, P / 2, 1.2},
		{"fixed–fixed", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}}, L / 2, P / 2, 0.65},
	}
	for _, c := range cases {
		m := beam(L, c.supports, 0)
		m.PointLoads = []fem.PointLoad{{X: c.at, Axial: -P}}
		s, e := solveBoth(t, &m)
		r := find(t, Run(&m, s, e, Options{}), "Buckling")
		want := math.Pi * math.Pi * ei / (c.factor * L * c.factor * L)
		if !near(r.Limit, want, 1e-12) || !near(r.Value, c.compression, 1e-9) {
			t.Errorf("%s: Pcr %g, N %g; want %g and %g", c.name, r.Limit, r.Value, want, c.compression)
		}
		status := Pass
		if c.compression > want {
			status = Fail
		}
		if r.Status != status {
			t.Errorf("%s: N/Pcr = %.3f, status %v, want %v", c.name, c.compression/want, r.Status, status)
		}
		t.Logf("%s: Pcr = %.4g N, utilisation %.3f, %v", c.name, r.Limit, c.compression/r.Limit, r.Status)
	}
}

// A member on three supports: each span is taken as pinned–pinned, and a
// thinner segment governs with its own EI.
func TestBucklingOfSpansAndSteps(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 1, Kind: fem.Roller}, {X: 4, Kind: fem.Roller}}, 0)
	thin := m.Segments[0]
	thin.Start, thin.End = 2, 4
	thin.Section.SecondMoment /= 2
	m.Segments[0].End = 2
	m.Segments = append(m.Segments, thin)
	m.PointLoads = []fem.PointLoad{{X: 4, Axial: -50e3}}
	// The pinned support at 0 carries the axial load, so both spans are in compression.
	s, e := solveBoth(t, &m)
	results := Run(&m, s, e, Options{})
	long := find(t, results, "Buckling, 1.000 m to 4.000 m")
	want := math.Pi * math.Pi * 200e9 * thin.Section.SecondMoment / 9
	if !near(long.Limit, want, 1e-12) || !strings.Contains(long.Message, "smallest EI") {
		t.Errorf("stepped span: Pcr %g, want π²·EI_min/3² = %g; message %q", long.Limit, want, long.Message)
	}
	short := find(t, results, "Buckling, 0 m to 1.000 m")
	if want := math.Pi * math.Pi * 200e9 * m.Segments[0].Section.SecondMoment; !near(short.Limit, want, 1e-12) {
		t.Errorf("short span: Pcr %g, want %g", short.Limit, want)
	}
}

func TestNothingToCheck(t *testing.T) {
	r := Run(nil, nil, nil, Options{})
	if len(r) != 1 || r[0].Status != Info || r[0].Caution != Caution {
		t.Errorf("no solution: %+v", r)
	}
}

// On a mesh set coarse on purpose the design checks judge the exact
// solution and give the finite element value beside it; without an exact
// solution they judge the finite element one. Simply supported, L = 4 m,
// q = −10 kN/m, one element: exact M = qL²/8 = 20 kN·m at midspan, so σ =
// M·c/I = 30 MPa, and δ = 5qL⁴/(384EI) = 2.5 mm (Roark's Table 8.1 case 2e,
// from memory). The finite element nodal rotations are exact (nodal
// exactness in one dimension, Hughes, The Finite Element Method, ch. 1,
// from memory), so its Hermite cubic between them deflects qL⁴/(96EI) =
// 2.0 mm at midspan, and its moment is the end moment qL²/12 of the
// consistent load: σ_h = 20 MPa, at the start of the element.
func TestDesignChecksReadTheExactSolution(t *testing.T) {
	const L, q = 4.0, -10e3
	m := beam(L, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}, 25e6)
	m.DistributedLoad = []fem.DistributedLoad{uniform(q, 0, L)}
	m.Mesh.Elements = 1
	s, e := solveBoth(t, &m)
	I, c := m.Segments[0].Section.SecondMoment, m.Segments[0].Section.FibreDistance
	ei := m.Segments[0].Material.Elastic * I
	exactStress, feStress := -q*L*L/8*c/I, -q*L*L/12*c/I
	exactDeflection, feDeflection := -5*q*L*L*L*L/(384*ei), -q*L*L*L*L/(96*ei)

	results := Run(&m, s, e, Options{})
	stress := find(t, results, "Stress, segment 1")
	if !stress.Exact || !near(stress.Value, exactStress, 1e-9) || !near(stress.X, L/2, 1e-9) ||
		!stress.HasFE || !near(stress.FE, feStress, 1e-9) || stress.Status != Fail {
		t.Errorf("stress: %+v; want exact %g at %g (fail against 25 MPa), FE %g beside", stress, exactStress, L/2, feStress)
	}
	if !strings.Contains(stress.Message, "exact solution") || !strings.Contains(stress.Message, "finite element solution on this mesh gives 20.00 MPa") {
		t.Errorf("stress message does not give both: %q", stress.Message)
	}
	deflection := find(t, results, "Deflection, span")
	if !deflection.Exact || !near(deflection.Value, exactDeflection, 1e-9) || !near(deflection.FE, feDeflection, 1e-9) {
		t.Errorf("deflection %g (FE %g), want exact %g with FE %g beside", deflection.Value, deflection.FE, exactDeflection, feDeflection)
	}

	alone := find(t, Run(&m, s, nil, Options{}), "Stress, segment 1")
	if alone.Exact || alone.HasFE || !near(alone.Value, feStress, 1e-9) || alone.Status == Fail {
		t.Errorf("without an exact solution: %+v; want the finite element %g, within the 25 MPa limit", alone, feStress)
	}
	if !strings.Contains(alone.Message, "no exact solution") {
		t.Errorf("without an exact solution the message must say so: %q", alone.Message)
	}
}

// A transverse spring is a support: the deflection check measures the
// span between it and the next support against span/n, as between rigid
// supports (IBC Table 1604.3 takes l as the span between supports, from
// memory), never as one long cantilever. The spring's give is part of the
// member's deflection under the loads and is counted. A beam pinned at 0
// and on a spring k at L under a uniform load q is statically determinate:
// the spring carries qL/2 and gives δ = qL/(2k) (statics), and the beam
// turns about the pin as a rigid body on top of the simple beam's
// 5qL⁴/(384EI) (AISC Manual, beam diagrams, simple beam under a uniform
// load, from memory). With δ above qL⁴/(24EI), the simple beam's end slope
// times L, the largest deflection is δ at the spring; with a spring as
// stiff as a roller, the simple beam's at midspan.
func TestSpringSupportBoundsASpan(t *testing.T) {
	const L, q = 5.0, -10e3
	ei := 200e9 * 0.1 * 0.008 / 12
	tests := []struct {
		k, want, at float64
	}{
		{5e5, -q * L / (2 * 5e5), L},
		{1e13, -5 * q * L * L * L * L / (384 * ei), L / 2},
	}
	for _, tt := range tests {
		m := beam(L, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Spring, Stiffness: [3]float64{0, tt.k, 0}}}, 0)
		m.DistributedLoad = []fem.DistributedLoad{uniform(q, 0, L)}
		s, e := solveBoth(t, &m)
		r := find(t, Run(&m, s, e, Options{}), "Deflection")
		if !strings.HasPrefix(r.Name, "Deflection, span 0 m to 5") || r.Span != [2]float64{0, L} || !near(r.Limit, L/360, 1e-12) {
			t.Errorf("k = %g: %q over %v against %g m, want the span 0 to %g m against L/360", tt.k, r.Name, r.Span, r.Limit, L)
		}
		if !near(r.Value, tt.want, 1e-5) || math.Abs(r.X-tt.at) > 1e-3 {
			t.Errorf("k = %g: deflection %g m at x = %g m, want %g m at %g m", tt.k, r.Value, r.X, tt.want, tt.at)
		}
		if !strings.Contains(r.Message, "spring") {
			t.Errorf("k = %g: the message does not say how the spring's give is taken: %q", tt.k, r.Message)
		}
	}
}

// A stretch an elastic foundation carries is checked as its supports make
// it (a cantilever from its one support here: length/180, common practice),
// and the check's name and message say that the stretch lies on a
// foundation and that its deflection includes the ground's settlement.
func TestDeflectionOnAFoundationSaysSo(t *testing.T) {
	m := beam(10, []fem.Support{{X: 5, Kind: fem.Pinned}}, 0)
	m.Foundations = []fem.Foundation{{Start: 0, End: 10, Modulus: 2e6}}
	m.DistributedLoad = []fem.DistributedLoad{uniform(-10e3, 0, 10)}
	s, e := solveBoth(t, &m)
	for _, r := range Run(&m, s, e, Options{}) {
		if r.Code != CodeDeflection {
			continue
		}
		if !strings.Contains(r.Name, "on a foundation") || !near(r.Limit, 5.0/180, 1e-12) ||
			!strings.Contains(r.Message, "settlement of the ground") {
			t.Errorf("%q against %g m: %q", r.Name, r.Limit, r.Message)
		}
	}
}

// A hinge inside a column frees it to turn there, which no end condition
// of Table C-A-7.1 allows for, and lowers its buckling load below the
// tabled case of its ends. A column fixed at the base and pinned at the
// top with a pure hinge at mid-height buckles when tan z = 2z, z = kL/2 ≈
// 1.166, k² = P/EI: the lower half is a cantilever under the end load P
// and a tip force P·δ/(L/2) from the upper half, a link, whose tip
// deflection is H·(tan ka − ka)/(P·k) (the cantilever under an axial and a
// lateral end load, Timoshenko & Gere, Theory of Elastic Stability, ch. 1,
// from memory). So Pcr = 4z²·EI/L² ≈ 5.43·EI/L², a third of the 15.4·EI/L²
// of K = 0.8. Fixed at both ends with a hinge at mid-length, each half
// sways as a cantilever: Pcr = π²EI/L² (K = 1, against 0.65). The check
// must not use the tabled factor of the ends: it reports the compression
// and asks for the effective length by hand, naming the hinge.
func TestBucklingOfAColumnWithAHinge(t *testing.T) {
	const L = 4.0
	cases := []struct {
		name     string
		supports []fem.Support
		hinges   []fem.Hinge
		at       float64
	}{
		{"fixed–hinge–pinned", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}}, []fem.Hinge{{X: L / 2}}, L},
		{"fixed–hinge–fixed", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}}, []fem.Hinge{{X: L / 2}}, L / 4},
		{"semi-rigid joint", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}}, []fem.Hinge{{X: L / 2, Stiffness: 1e6}}, L / 4},
		{"a span with a hinge", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}, {X: 2 * L, Kind: fem.Roller}}, []fem.Hinge{{X: 1.5 * L}}, 2 * L},
	}
	for _, c := range cases {
		m := beam(c.supports[len(c.supports)-1].X, c.supports, 0)
		m.Hinges = c.hinges
		m.PointLoads = []fem.PointLoad{{X: c.at, Axial: -10e3}}
		s, e := solveBoth(t, &m)
		for _, r := range Run(&m, s, e, Options{}) {
			if r.Code != CodeBuckling || r.Span[0] >= c.hinges[0].X || r.Span[1] <= c.hinges[0].X {
				continue
			}
			if r.Status != Info || r.Limit != 0 || !strings.Contains(r.Message, "hinge") {
				t.Errorf("%s: %s: %v, limit %g: %s", c.name, r.Name, r.Status, r.Limit, r.Message)
			}
		}
	}
}

// A column that deforms in shear buckles below its Euler load: with the
// shear stiffness G·As the critical load is Pe/(1 + Pe/(G·As)) (Engesser's
// formula; Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §2.16,
// effect of shearing force on the critical load, from memory). A column of
// segments takes the smallest EI and the smallest G·As of those that
// deform in shear, which is conservative as the stepped column's EI is; a
// segment without shear deformation is rigid in shear.
func TestBucklingOfAColumnThatDeformsInShear(t *testing.T) {
	const L, G, P = 3.0, 80e9, 2e6
	cases := []struct {
		name  string
		shear []float64 // the shear area of each of the two halves, m²; 0: no shear deformation
		gas   float64   // G·As the critical load takes, N; 0: none
	}{
		{"no shear deformation", []float64{0, 0}, 0},
		{"a laced column", []float64{2e-5, 2e-5}, G * 2e-5},
		{"one half shear-flexible", []float64{0, 1e-4}, G * 1e-4},
		{"two shear areas", []float64{3e-4, 1e-4}, G * 1e-4},
	}
	for _, c := range cases {
		m := beam(L, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}, 0)
		upper := m.Segments[0]
		m.Segments[0].End, upper.Start = L/2, L/2
		m.Segments = append(m.Segments, upper)
		for i, as := range c.shear {
			if as > 0 {
				m.Segments[i].ShearDeformation = true
				m.Segments[i].Section.ShearArea = as
				m.Segments[i].Material.ShearModulus = G
			}
		}
		m.PointLoads = []fem.PointLoad{{X: L, Axial: -P}}
		s, e := solveBoth(t, &m)
		r := find(t, Run(&m, s, e, Options{}), "Buckling")
		euler := math.Pi * math.Pi * 200e9 * m.Segments[0].Section.SecondMoment / (L * L) // K = 1
		want := euler
		if c.gas > 0 {
			want = euler / (1 + euler/c.gas)
		}
		if !near(r.Limit, want, 1e-12) {
			t.Errorf("%s: Pcr %g N, want %g N (Pe = %g N)", c.name, r.Limit, want, euler)
		}
		if got := strings.Contains(r.Message, "shear"); got != (c.gas > 0) {
			t.Errorf("%s: the message speaks of shear: %v, want %v: %s", c.name, got, c.gas > 0, r.Message)
		}
		// The bound it closes with is the load it checked against.
		if got := strings.Contains(r.Message, "The Euler load is an upper bound"); got == (c.gas > 0) {
			t.Errorf("%s: the message calls the Euler load the bound: %v, want %v: %s", c.name, got, c.gas == 0, r.Message)
		}
		if status := map[bool]Status{true: Fail, false: Pass}[P > want]; r.Status != status {
			t.Errorf("%s: N/Pcr = %.3f, status %v, want %v", c.name, P/want, r.Status, status)
		}
	}
}

// A column whose compression varies along it, as a standing column's under
// its own weight, is checked with its largest compression against the
// Euler load of a constant force, which is conservative (a flagpole fixed
// at its foot buckles under its own weight when the whole weight reaches
// 7.84·EI/L², 3.2 times π²EI/(2L)²: Timoshenko & Gere, Theory of Elastic
// Stability, ch. 2, buckling of a bar under distributed axial load, from
// memory), and the message must say so; a column under an end load alone,
// whose compression is the same all along, must not.
func TestBucklingSaysWhenTheCompressionVaries(t *testing.T) {
	const L, g = 3.0, 9.80665
	cases := []struct {
		name    string
		gravity [2]float64
		load    float64
		varies  bool
	}{
		{"own weight", [2]float64{-g, 0}, 0, true},
		{"own weight and an end load", [2]float64{-g, 0}, -10e3, true},
		{"an end load", [2]float64{}, -10e3, false},
	}
	for _, c := range cases {
		m := beam(L, []fem.Support{{X: 0, Kind: fem.Fixed}}, 0)
		m.Gravity = c.gravity
		if c.load != 0 {
			m.PointLoads = []fem.PointLoad{{X: L, Axial: c.load}}
		}
		s, e := solveBoth(t, &m)
		r := find(t, Run(&m, s, e, Options{}), "Buckling")
		want := -c.load + 7850*g*0.02*L*math.Abs(c.gravity[0])/g // the weight ρgAL at the foot, and the end load
		if !near(r.Value, want, 1e-9) {
			t.Errorf("%s: compression %g N, want %g N", c.name, r.Value, want)
		}
		if got := strings.Contains(r.Message, "varies along this part"); got != c.varies {
			t.Errorf("%s: says the compression varies: %v, want %v: %s", c.name, got, c.varies, r.Message)
		}
	}
}

// A utilisation is the checked value over its limit and fails above 1
// (Status Fail when utilisation > 1): its text must stay on the side of 1
// its status is on. A deflection 0.4 % over span/360 printed "1.00" beside
// "fail" in `stave check` and "Utilisation 1.00" in the overstress
// message; it reads 1.004.
func TestUtilisationTextKeepsTheSideOfOne(t *testing.T) {
	for _, c := range []struct {
		u    float64
		want string
	}{
		{0.0784, "0.08"},
		{0.99999, "1.00"}, // passes, at the limit to two decimals
		{1, "1.00"},
		{1.004, "1.004"},
		{1.0000001, "1.0000001"},
		{1 + 0x1p-52, "1.0000000000000002"},
		{1.875, "1.88"},
		{999999.994, "999999.99"},
		{1e6, "1e+06"},
		{1e300, "1e+300"},
		// A limit that underflows (an allowable of 1e-5 Pa over a safety
		// factor of 1e300) overflows the utilisation, which read "+Inf".
		{math.Inf(1), "infinite"},
	} {
		if got := UtilisationText(c.u); got != c.want {
			t.Errorf("UtilisationText(%v) = %q, want %q", c.u, got, c.want)
		}
	}
}

// A failed check never prints its value equal to its limit: 0.01 % over
// the limit, four figures print both alike ("11.11 mm" beside a limit of
// 11.11 mm, and fail), so both get as many more figures as show the value
// above its limit, as UtilisationText keeps a failure above 1.00. The beam
// of TestHandComputedUtilisation (simply supported, 4 m, −20 kN at
// midspan: δ = PL³/48EI = 2.000 mm and σ = PL/4 over bh²/6 = 30.00 MPa,
// Roark's Table 8.1 case 1e, from memory) with limits set 1.0001 times
// under those, and the pinned–pinned 3 m column of TestEulerBuckling
// under 1.0001 times its Euler load π²EI/L² = 14 621.6 kN (Euler's
// formula, from memory).
func TestFailedValueExceedsItsLimitInPrint(t *testing.T) {
	const over = 1.0001
	simple := []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}
	bent := beam(4, simple, 30e6/over)
	bent.PointLoads = []fem.PointLoad{{X: 2, Transverse: -20e3}}
	column := beam(3, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 3, Kind: fem.Roller}}, 0)
	euler := math.Pi * math.Pi * 200e9 * (0.1 * 0.008 / 12) / 9
	column.PointLoads = []fem.PointLoad{{X: 3, Axial: -over * euler}}
	for _, c := range []struct {
		name        string
		m           fem.Model
		opts        Options
		check       string
		value, want string // the value's and the limit's text
	}{
		{"deflection", bent, Options{SpanRatio: 4 * over / 2e-3}, "Deflection, span", "is 2.0000 mm", "= 1.9998 mm"},
		{"stress", bent, Options{SafetyFactor: 1}, "Stress", "is 30.000 MPa", "= 29.997 MPa"},
		{"allowable", bent, Options{SafetyFactor: 1}, "Stress", "is 30.000 MPa", "the allowable 29.997 MPa"},
		{"buckling", column, Options{}, "Buckling", "compression 14623 kN", "= 14622 kN"},
	} {
		s, e := solveBoth(t, &c.m)
		r := find(t, Run(&c.m, s, e, c.opts), c.check)
		if r.Status != Fail || !near(r.Value/r.Limit, over, 1e-6) {
			t.Errorf("%s: %v at utilisation %.6f, want fail at %g", c.name, r.Status, r.Value/r.Limit, over)
		}
		if !strings.Contains(r.Message, c.value) || !strings.Contains(r.Message, c.want) {
			t.Errorf("%s: want %q and %q in %q", c.name, c.value, c.want, r.Message)
		}
	}
}

// LimitFigures keeps four figures unless a value above its limit prints
// alike or below it; then it takes the fewest that show it above, up to
// the 17 that tell any two float64 apart (IEEE 754, from memory).
func TestLimitFigures(t *testing.T) {
	for _, c := range []struct {
		value, limit float64
		want         int
	}{
		{0.011112, 4.0 / 360, 5},       // 11.112 mm over 11.111 mm
		{4.0 / 360, 0.011112, 4},       // passes: four figures whatever they show
		{0.02, 4.0 / 360, 4},           // 20.00 mm over 11.11 mm
		{0.0111111111, 0.011111111, 9}, // 11.1111111 over 11.1111110 mm
		{1 + 0x1p-52, 1, 17},           // the next float64 above 1 m
		{math.NaN(), 1, 4},
	} {
		if got := LimitFigures(units.SI, units.Deflection, c.value, c.limit); got != c.want {
			t.Errorf("LimitFigures(%v, %v) = %d, want %d", c.value, c.limit, got, c.want)
		}
	}
}

// A spring (across the member or in rotation) only stiffens a column: its
// strain energy adds to the numerator of the Rayleigh quotient of the
// buckling load, so the column without it buckles first (Timoshenko & Gere,
// Theory of Elastic Stability, 2nd ed., ch. 2, energy method, from
// memory). Leaving the springs out gives a conservative check with the
// factor of the rigid restraints alone (AISC Specification Commentary,
// Table C-A-7.1, recommended design values, from memory): a column fixed
// at its foot with a spring across it higher up is at least a fixed–free
// column (K = 2.1), a pinned end with a rotational spring at least pinned
// (K = 1). A column fixed at a support and free beyond it is a cantilever
// whatever holds the member on the support's other side, so an overhang
// from a fixed support is fixed–free too.
func TestBucklingLeavesSpringsOutConservatively(t *testing.T) {
	const L, P = 4.0, 10e3
	ei := 200e9 * 0.1 * 0.008 / 12
	cases := []struct {
		name     string
		supports []fem.Support
		span     [2]float64
		factor   float64 // design K of the rigid restraints alone
	}{
		{"fixed foot, spring across higher up", []fem.Support{{X: 0, Kind: fem.Fixed},
			{X: L / 2, Kind: fem.Spring, Stiffness: [3]float64{0, 1e5, 0}}}, [2]float64{0, L}, 2.1},
		{"fixed foot, spring across at the top", []fem.Support{{X: 0, Kind: fem.Fixed},
			{X: L, Kind: fem.Spring, Stiffness: [3]float64{0, 1e5, 0}}}, [2]float64{0, L}, 2.1},
		{"pinned foot with a rotational spring, roller at the top", []fem.Support{{X: 0, Kind: fem.Pinned, Stiffness: [3]float64{0, 0, 1e6}},
			{X: L, Kind: fem.Roller}}, [2]float64{0, L}, 1.0},
		{"overhang from a fixed support", []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L / 2, Kind: fem.Fixed}},
			[2]float64{L / 2, L}, 2.1},
	}
	for _, c := range cases {
		m := beam(L, c.supports, 0)
		m.PointLoads = []fem.PointLoad{{X: L, Axial: -P}}
		s, e := solveBoth(t, &m)
		r := bucklingOver(t, c.name, Run(&m, s, e, Options{}), c.span)
		if r == nil {
			continue
		}
		length := c.span[1] - c.span[0]
		want := math.Pi * math.Pi * ei / (c.factor * length * c.factor * length)
		if r.Status != Pass || !near(r.Limit, want, 1e-12) || !near(r.Value, P, 1e-9) {
			t.Errorf("%s: %v, Pcr %g, N %g; want pass, %g and %g: %s", c.name, r.Status, r.Limit, r.Value, want, P, r.Message)
		}
	}
}

// A safety factor divides the allowable stress; one below 1 raises the
// limit above the allowable entered, which is no margin at all and is most
// often a resistance factor φ (0.9, say: AISC Specification §B3.1, from
// memory) typed where Stave divides, so the check asks to be looked at.
// Simply supported, 4 m, P = −20 kN at midspan: σ = PL/4·c/I = 30 MPa
// (Roark's Table 8.1 case 1e, from memory).
func TestSafetyFactorBelowOneAsksToBeLookedAt(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 30e6)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -20e3}}
	s, e := solveBoth(t, &m)
	cases := []struct {
		allowable, factor float64 // Pa, –
		status            Status
	}{
		{30e6, 0.9, Warn},  // 30 MPa against 33.3 MPa
		{30e6, 1, Pass},    // 30 MPa against 30 MPa: utilisation 1 passes
		{30e6, 0.5, Warn},  // 30 MPa against 60 MPa
		{15e6, 0.75, Fail}, // 30 MPa against 20 MPa fails whatever the factor
	}
	for _, c := range cases {
		m.Segments[0].Material.Allowable = c.allowable
		r := find(t, Run(&m, s, e, Options{SafetyFactor: c.factor}), "Stress, segment 1")
		if r.Status != c.status || !near(r.Limit, c.allowable/c.factor, 1e-12) {
			t.Errorf("safety factor %g: %v, limit %g; want %v, %g", c.factor, r.Status, r.Limit, c.status, c.allowable/c.factor)
		}
		if below := strings.Contains(r.Message, "below 1"); below != (c.factor < 1) {
			t.Errorf("safety factor %g: message says below 1: %v: %s", c.factor, below, r.Message)
		}
	}
}

// A stress check of nothing acting against a limit of 0 has no
// utilisation, 0/0 (IEEE 754 arithmetic, from memory: 1e-30 Pa over a
// safety factor of 1e300 rounds to 0, below 4.9e-324), so it can say
// neither that the stress is within its limit nor beyond it: it asks to be
// looked at (Warn, as a safety factor below 1 does) and says why, never
// "within limit" beside "Utilisation undefined". The overhang 4 m to 5 m of
// a beam on supports at 0 and 4 m, loaded on its span alone, carries no
// moment or force (statics, from memory: nothing acts beyond the support);
// a stress beside a limit of 0 still fails, its utilisation infinite.
func TestStressOverALimitOfZero(t *testing.T) {
	m := beam(5, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 1e-30)
	overhang := m.Segments[0]
	m.Segments[0].End, overhang.Start = 4, 4
	m.Segments = append(m.Segments, overhang)
	m.DistributedLoad = []fem.DistributedLoad{uniform(-10e3, 0, 4)}
	s, e := solveBoth(t, &m)
	results := Run(&m, s, e, Options{SafetyFactor: 1e300})
	for _, c := range []struct {
		name   string
		status Status
		words  []string
	}{
		{"Stress, segment 1", Fail, []string{"Utilisation infinite", "The limit is 0"}},
		{"Stress, segment 2", Warn, []string{"Utilisation undefined", "The limit is 0", "neither within its limit nor beyond it"}},
	} {
		r := find(t, results, c.name)
		if r.Limit != 0 || r.Status != c.status {
			t.Errorf("%s: %v against a limit of %g; want %v against 0: %s", c.name, r.Status, r.Limit, c.status, r.Message)
		}
		for _, w := range c.words {
			if !strings.Contains(r.Message, w) {
				t.Errorf("%s: the message lacks %q: %s", c.name, w, r.Message)
			}
		}
	}
}

// The stresses are first-order, taken on the straight member; compression
// amplifies the bending moment of a beam-column by about 1/(1 − P/Pe)
// (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., ch. 1,
// beam-columns, from memory), so a stress check of a compressed segment
// must say it leaves that out, and one in tension must not. Simply
// supported, 6 m, q = −10 kN/m and an end load of ∓200 kN: σ = N/A + M·c/I
// = 10 + 67.5 MPa with M = qL²/8 (Roark's Table 8.1 case 2e, from memory).
// A strut (axial only) bends under nothing: its σ = N/A = 10 MPa is the
// whole stress, with no moment for compression to amplify, so its check
// must not say that one is left out.
func TestStressOfACompressedSegmentSaysItIsFirstOrder(t *testing.T) {
	for _, c := range []struct {
		axial      float64
		strut      bool
		firstOrder bool
		want       float64 // |N|/A + M·c/I, Pa
	}{
		{-200e3, false, true, 10e6 + 45e3*0.1/(0.1*0.008/12)},
		{200e3, false, false, 10e6 + 45e3*0.1/(0.1*0.008/12)},
		{-200e3, true, false, 10e6},
	} {
		m := beam(6, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}}, 250e6)
		if c.strut {
			m.AxialOnly = true
		} else {
			m.DistributedLoad = []fem.DistributedLoad{uniform(-10e3, 0, 6)}
		}
		m.PointLoads = []fem.PointLoad{{X: 6, Axial: c.axial}}
		s, e := solveBoth(t, &m)
		r := find(t, Run(&m, s, e, Options{}), "Stress, segment 1")
		if !near(r.Value, c.want, 1e-9) {
			t.Errorf("axial %g, strut %v: stress %g, want %g", c.axial, c.strut, r.Value, c.want)
		}
		if got := strings.Contains(r.Message, "first-order"); got != c.firstOrder {
			t.Errorf("axial %g, strut %v: says first-order: %v, want %v: %s", c.axial, c.strut, got, c.firstOrder, r.Message)
		}
	}
}

// A column fixed at one end and free at the other whose compression varies
// along it buckles when the compression as it is, multiplied by a factor,
// satisfies (EI·θ')' + N·θ = 0 with θ = 0 at the fixed end and θ' = 0 at
// the free one (θ the slope; the free end takes no force across, so the
// column's equation integrates once). Under its own weight alone the
// whole weight buckles it at Greenhill's (qL)cr = 7.837·EI/L²
// (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §2.10,
// buckling of a bar under distributed axial load, from memory); with an end
// load and a weight that is nearly nothing, at π²EI/(2L)² (Euler). The
// check takes the design factor K = 2.1 for the theoretical 2 (AISC
// Specification Commentary, Table C-A-7.1 case (d), from memory), so its
// limit is the critical compression at the foot times (2/2.1)². The column
// may stand on its foot at either end of the member, and it may be an
// overhang from a fixed support.
func TestBucklingOfAColumnUnderItsOwnWeight(t *testing.T) {
	const L, g = 3.0, 9.80665
	ei := 200e9 * 0.1 * 0.008 / 12
	weight := 7850 * g * 0.02 * L // ρgAL, N
	design := (2 / 2.1) * (2 / 2.1)
	cases := []struct {
		name     string
		supports []fem.Support
		gravity  float64 // along x, m/s²
		load     fem.PointLoad
		length   float64 // of the member
		span     [2]float64
		critical float64 // compression at the foot at buckling, N
		relative float64
	}{
		{"own weight, foot at x = 0", []fem.Support{{X: 0, Kind: fem.Fixed}}, -g, fem.PointLoad{}, L,
			[2]float64{0, L}, 7.837 * ei / (L * L), 1e-4},
		{"own weight, foot at x = L", []fem.Support{{X: L, Kind: fem.Fixed}}, g, fem.PointLoad{}, L,
			[2]float64{0, L}, 7.837 * ei / (L * L), 1e-4},
		{"overhang above a fixed support", []fem.Support{{X: 0, Kind: fem.Roller}, {X: 2, Kind: fem.Fixed}}, -g, fem.PointLoad{}, 2 + L,
			[2]float64{2, 2 + L}, 7.837 * ei / (L * L), 1e-4},
		// (P + 0.3·qL)cr = π²EI/(2L)² (Timoshenko & Gere, §2.10, from
		// memory): with qL = 46 N beside P = 1000 kN the foot's critical
		// compression is 3e-5 above Euler's.
		{"end load, a weight of nearly nothing", []fem.Support{{X: 0, Kind: fem.Fixed}}, -g * 1e-2, fem.PointLoad{X: L, Axial: -1e6}, L,
			[2]float64{0, L}, math.Pi * math.Pi * ei / (4 * L * L), 1e-4},
	}
	for _, c := range cases {
		m := beam(c.length, c.supports, 0)
		m.Gravity = [2]float64{c.gravity, 0}
		if c.load.Axial != 0 {
			m.PointLoads = []fem.PointLoad{c.load}
		}
		s, e := solveBoth(t, &m)
		r := bucklingOver(t, c.name, Run(&m, s, e, Options{}), c.span)
		if r == nil {
			continue
		}
		foot := -c.load.Axial + weight*math.Abs(c.gravity)/g
		if !near(r.Value, foot, 1e-9) || !near(r.Limit, c.critical*design, c.relative) {
			t.Errorf("%s: compression %g, limit %g; want %g and %g (%.6f of it)", c.name, r.Value, r.Limit, foot, c.critical*design, r.Limit/(c.critical*design))
		}
		if r.Status != Pass || !strings.Contains(r.Message, "as it varies") {
			t.Errorf("%s: %v: %s", c.name, r.Status, r.Message)
		}
	}
}

// Loads that act at a support go straight into it, and the member carries
// nothing (statics, from memory): a moment at a fixed end, a pull at a
// pinned end of a tie. The exact stresses are round-off then (1e-13 Pa
// beside the loads' 1 kPa), and the stress check read them as a stress,
// "2.691e-18 MPa ... (FE − exact -2.691e-18 MPa, -100 %)". Against the
// loads' scale they are zero, as the summary's extremes say.
func TestLoadsIntoSupportsStressNothing(t *testing.T) {
	member := func(L float64, supports []fem.Support, load fem.PointLoad, axialOnly bool) fem.Model {
		return fem.Model{Segments: []fem.Segment{{Start: 0, End: L,
			Section:  fem.Section{Area: 0.0033, SecondMoment: 3.3e-5, FibreDistance: 0.1},
			Material: fem.Material{Name: "steel", Elastic: 200e9, ThermalExpansion: 12e-6, Allowable: 160e6}}},
			Supports: supports, PointLoads: []fem.PointLoad{load}, AxialOnly: axialOnly}
	}
	for _, c := range []struct {
		name string
		m    fem.Model
	}{
		{"moment at the fixed end of a beam on three supports", member(3.7,
			[]fem.Support{{X: 0, Kind: fem.Pinned}, {X: 1.591, Kind: fem.Roller}, {X: 3.7, Kind: fem.Fixed}}, fem.PointLoad{X: 3.7, Moment: 3.3}, false)},
		{"pull at a pinned end of a tie", member(3.7,
			[]fem.Support{{X: 0, Kind: fem.Pinned}, {X: 3.7, Kind: fem.Pinned}}, fem.PointLoad{X: 3.7, Axial: 3.3}, true)},
	} {
		s, e := solveBoth(t, &c.m)
		for _, r := range Run(&c.m, s, e, DefaultOptions()) {
			if r.Code != CodeStress && r.Code != CodeDeflection {
				continue
			}
			if r.Value != 0 || r.FE != 0 || strings.Contains(r.Message, "%)") {
				t.Errorf("%s: %s reads %g (FE %g), want 0 and no share of it: %s", c.name, r.Name, r.Value, r.FE, r.Message)
			}
		}
	}
}

// bucklingOver is the buckling check of span among results, nil (and an
// error of the test named name) when there is none.
func bucklingOver(t *testing.T, name string, results []Result, span [2]float64) *Result {
	t.Helper()
	for i := range results {
		if results[i].Code == CodeBuckling && results[i].Span == span {
			return &results[i]
		}
	}
	t.Errorf("%s: no buckling check of %v in %v", name, span, names(results))
	return nil
}

// Each segment's stress is judged against its own section: a segment whose
// section is absurdly weak (I = 8e-20 m⁴ beside 8e-6 m⁴) set the scale of
// round-off for the whole member, and segment 1's combined stress of
// 250 MPa read "0 MPa". A simply supported 4 m span under q = 10 kN/m has
// M = qL²/8 = 20 kN·m at midspan whatever its sections (statics; beam
// tables, from memory), so σ = M·c/I = 20e3 · 0.1 / 8e-6 = 250 MPa at
// x = 2 m (flexure formula, Gere & Goodno, Mechanics of Materials). An
// unloaded overhang carries no moment (statics), so its stress is zero.
func TestStressOfEachSegmentAgainstItsOwnSection(t *testing.T) {
	segment := func(a, b, I float64) fem.Segment {
		return fem.Segment{Start: a, End: b, Section: fem.Section{Area: 0.004, SecondMoment: I, FibreDistance: 0.1},
			Material: fem.Material{Name: "steel", Elastic: 200e9}}
	}
	for _, c := range []struct {
		name string
		segs []fem.Segment
		want []float64
	}{
		// No exact solution (its equations are near-singular): the FE
		// moment at x = 2 m is within 0.2 % of 20 kN·m; segment 2 reaches
		// 20e3 · 0.1 / 8e-20 = 2.5e22 Pa there.
		{"weak second half of the span", []fem.Segment{segment(0, 2, 8e-6), segment(2, 4, 8e-20)}, []float64{250e6, 2.5e22}},
		{"weak unloaded overhang", []fem.Segment{segment(0, 4, 8e-6), segment(4, 5, 8e-20)}, []float64{250e6, 0}},
	} {
		m := fem.Model{Segments: c.segs,
			Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}},
			DistributedLoad: []fem.DistributedLoad{uniform(-10e3, 0, 4)},
			Mesh:            fem.MeshSettings{Elements: 8}}
		s, err := fem.Solve(&m)
		if err != nil {
			t.Fatalf("%s: solve: %v", c.name, err)
		}
		e, _ := fem.SolveExact(&m) // nil where it cannot be found
		for i, want := range c.want {
			r := find(t, Run(&m, s, e, DefaultOptions()), fmt.Sprintf("Stress, segment %d", i+1))
			if want == 0 && r.Value != 0 || want != 0 && !near(r.Value, want, 0.01) {
				t.Errorf("%s: segment %d stress %g Pa at x = %g, want %g (σ = M·c/I)", c.name, i+1, r.Value, r.X, want)
			}
		}
	}
}

// Values a check computes that overflow read in words, not as fmt writes
// them ("+Inf", Go's fmt documentation, from memory): the beam of
// TestHandComputedUtilisation (σ = 30 MPa) checked against an allowable of
// 1e-5 Pa over a safety factor of 1e300 has a utilisation beyond the
// floating-point range, "Utilisation +Inf"; a safety factor of 5e-324, the
// least above zero, is read as a resistance factor whose inverse
// overflows, "enter 1/φ = +Inf".
func TestCheckMessagesSayOverflowInWords(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 1e-5)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -20e3}}
	s, e := solveBoth(t, &m)
	for _, c := range []struct {
		allowable, factor float64
		want              string
	}{
		{1e-5, 1e300, "Utilisation infinite"},
		{30e6, 5e-324, "enter 1/φ = infinite"},
	} {
		m.Segments[0].Material.Allowable = c.allowable
		r := find(t, Run(&m, s, e, Options{SafetyFactor: c.factor}), "Stress, segment 1")
		if strings.Contains(r.Message, "Inf") || !strings.Contains(r.Message, c.want) {
			t.Errorf("allowable %g Pa, safety factor %g: %q, want %q and no Inf", c.allowable, c.factor, r.Message, c.want)
		}
	}
}

// A deflection is judged against the deformations the member has, not
// against what its loads would do to its weakest section: beside an
// unloaded overhang of I = 8e-20 m⁴ the span's 20.83 mm and the
// overhang's 16.67 mm read "0 mm, within limit". A simply supported
// span L = 4 m under q = 10 kN/m (E = 200 GPa, I = 8e-6 m⁴) sags
// 5qL⁴/(384EI) = 20.83 mm at midspan and turns qL³/(24EI) at its end (AISC
// Manual, Beam Diagrams and Formulas, simple beam – uniformly distributed
// load); the overhang carries no moment (statics), so its tip a = 1 m out
// moves by that slope times a, 16.67 mm. Both are beyond their limits,
// L/360 = 11.1 mm and 2a/360 = 5.6 mm (common practice). Without an exact
// solution the finite element one is judged: its Hermite nodal values are
// exact here (from memory) and the mesh has nodes at 2 m and 5 m.
func TestDeflectionBesideAWeakOverhang(t *testing.T) {
	const E, I, L, a, q = 200e9, 8e-6, 4.0, 1.0, 10e3
	segment := func(x0, x1, I float64) fem.Segment {
		return fem.Segment{Start: x0, End: x1, Section: fem.Section{Area: 0.004, SecondMoment: I, FibreDistance: 0.1},
			Material: fem.Material{Name: "steel", Elastic: E}}
	}
	m := fem.Model{Segments: []fem.Segment{segment(0, L, I), segment(L, L+a, 8e-20)},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{uniform(-q, 0, L)},
		Mesh:            fem.MeshSettings{Elements: 8}}
	s, e := solveBoth(t, &m)
	span := 5 * q * L * L * L * L / (384 * E * I)
	tip := q * L * L * L / (24 * E * I) * a
	for _, exact := range []*fem.Exact{e, nil} {
		results := Run(&m, s, exact, DefaultOptions())
		for _, c := range []struct {
			name string
			want float64
		}{{"Deflection, span", span}, {"Deflection, cantilever", tip}} {
			r := find(t, results, c.name)
			if !near(r.Value, c.want, 1e-6) || r.Status != Fail {
				t.Errorf("exact solution %t: %s: %g m, %s, want %g m, %s", exact != nil, r.Name, r.Value, r.Status, c.want, Fail)
			}
		}
	}
}

// A weak segment that carries no load of its own is still bent or
// stretched by its neighbours, and its stress σ = E·(ε + κ·c) does not
// depend on its I or A, so its check reads it, not 0: it was judged
// against the loads' force on its area and moment on its section
// modulus (2e4 N · 6 m · 0.1 m / 8e-20 m⁴), which its own force and
// moment (EI·κ, EA·ε) are round-off against.
//
// Bent: two propped cantilevers of l = 2 m (fixed at x = 0 and 6 m,
// propped at 2 and 4 m) under q = 10 kN/m (EI = 200 GPa · 8e-6 m⁴),
// joined by an unloaded segment of I = 8e-20 m⁴, far too weak to restrain
// them: each turns at its prop by θ = q·l³/(48EI) = 1.0417e-3 rad (AISC
// Manual, Beam Diagrams and Formulas, beam fixed at one end, supported at
// other – uniformly distributed load, slope at the supported end, from
// memory), so the weak segment's ends turn by θ and −θ; unloaded, its
// moment is linear, here constant: κ = 2θ/2 m and σ = E·κ·c = 200 GPa ·
// 1.0417e-3 /m · 0.1 m = 20.83 MPa. Each outer segment's largest is
// q·l²/8 · c/I = 62.5 MPa at its fixed end (the same beam diagram).
//
// Stretched: a bar fixed at both ends, P = 100 kN along it at x = 1 m, its
// middle 2 m of A = 4e-20 m²: the left part takes P into x = 0 and moves
// x = 1 m to 2 m by P·1 m/EA = 0.125 mm (EA = 200 GPa · 4e-3 m², Gere &
// Goodno, Mechanics of Materials, axially loaded members, from memory),
// which the weak part shortens by over 2 m: σ = E·0.125 mm/2 m =
// 12.5 MPa; the left part's P/A = 25 MPa, the right part's nothing
// (statics: the weak part's force EA·ε is 1e-17 of P).
//
// Pulled: a weakness in bending hid a plain axial stress too. A span of
// 3 m fixed at x = 0 and propped at 3 m under q = 10 kN/m, and an overhang
// to 6 m of I = 8e-14 m⁴ pulled at its tip by 1 kN: the overhang's stress
// is N/A = 1 kN/4e-3 m² = 0.25 MPa (statics), which read 0 MPa; the
// span's is q·l²/8 · c/I + N/A = 140.625 + 0.25 MPa at the fixed end (the
// beam diagram above).
func TestStressOfAWeakSegmentMovedByItsNeighbours(t *testing.T) {
	segment := func(a, b, A, I float64) fem.Segment {
		return fem.Segment{Start: a, End: b, Section: fem.Section{Area: A, SecondMoment: I, FibreDistance: 0.1},
			Material: fem.Material{Name: "steel", Elastic: 200e9}}
	}
	theta := 10e3 * 8 / (48 * 200e9 * 8e-6)
	for _, c := range []struct {
		name string
		m    fem.Model
		want []float64
	}{
		{"bent", fem.Model{Segments: []fem.Segment{segment(0, 2, 4e-3, 8e-6), segment(2, 4, 4e-3, 8e-20), segment(4, 6, 4e-3, 8e-6)},
			Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 2, Kind: fem.Roller}, {X: 4, Kind: fem.Roller}, {X: 6, Kind: fem.Fixed}},
			DistributedLoad: []fem.DistributedLoad{uniform(-10e3, 0, 2), uniform(-10e3, 4, 6)},
			Mesh:            fem.MeshSettings{Elements: 12}},
			[]float64{62.5e6, 200e9 * theta * 0.1, 62.5e6}},
		{"stretched", fem.Model{Segments: []fem.Segment{segment(0, 2, 4e-3, 8e-6), segment(2, 4, 4e-20, 8e-20), segment(4, 6, 4e-3, 8e-6)},
			Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Fixed}},
			PointLoads: []fem.PointLoad{{X: 1, Axial: 100e3}},
			Mesh:       fem.MeshSettings{Elements: 12}},
			[]float64{25e6, 200e9 * (100e3 / (200e9 * 4e-3)) / 2, 0}},
		{"pulled", fem.Model{Segments: []fem.Segment{segment(0, 3, 4e-3, 8e-6), segment(3, 6, 4e-3, 8e-14)},
			Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 3, Kind: fem.Roller}},
			DistributedLoad: []fem.DistributedLoad{uniform(-10e3, 0, 3)},
			PointLoads:      []fem.PointLoad{{X: 6, Axial: 1e3}},
			Mesh:            fem.MeshSettings{Elements: 12}},
			[]float64{10e3*9/8*0.1/8e-6 + 1e3/4e-3, 1e3 / 4e-3}},
	} {
		s, e := solveBoth(t, &c.m)
		results := Run(&c.m, s, e, DefaultOptions())
		for i, want := range c.want {
			r := find(t, results, fmt.Sprintf("Stress, segment %d", i+1))
			if want == 0 && (r.Value != 0 || r.FE != 0) || want != 0 && (!near(r.Value, want, 1e-6) || !near(r.FE, want, 0.05)) {
				t.Errorf("%s: segment %d stress %g Pa (exact), %g (FE) at x = %g, want %g", c.name, i+1, r.Value, r.FE, r.X, want)
			}
		}
	}
}

// A finite element value equal to the exact one differs from it by 0 %,
// not "+0 %": Hermite beam elements give a cantilever's tip deflection
// under a tip load exactly, P·L³/(3EI) = 10e3 · 4³ / (3 · 200e9 · 8e-6) =
// 133.3 mm (nodal exactness of cubic elements for loads at the nodes, and
// the cantilever formula of beam tables, from memory), and the deflection
// check read "(FE − exact 0 mm, +0 %)", a sign on nothing.
func TestNoSignOnAZeroShare(t *testing.T) {
	m := fem.Model{Segments: []fem.Segment{{Start: 0, End: 4,
		Section:  fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1},
		Material: fem.Material{Name: "steel", Elastic: 200e9}}},
		Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 4, Transverse: -10e3}},
		Mesh:       fem.MeshSettings{Elements: 4}}
	s, e := solveBoth(t, &m)
	found := false
	for _, r := range Run(&m, s, e, DefaultOptions()) {
		if r.Code != CodeDeflection {
			continue
		}
		found = true
		if want := "(FE − exact 0 mm, 0 %)"; r.FE == r.Value && !strings.Contains(r.Message, want) {
			t.Errorf("%s: FE %g equals exact %g, want %q in: %s", r.Name, r.FE, r.Value, want, r.Message)
		}
		if strings.Contains(r.Message, "+0 %") || strings.Contains(r.Message, "-0 %") {
			t.Errorf("%s: a sign on a zero share: %s", r.Name, r.Message)
		}
	}
	if !found {
		t.Error("no deflection check of the cantilever")
	}
}

// The deflection check says what it measures from: a span from the line
// through its supports; a cantilever fixed at its support from the
// member's tangent there (a cantilever has one support, and its tangent
// does not turn under the loads); an overhang beyond a pin from the line
// through its support at the slope settlement alone gives it, so the turn
// over the support counts; a cantilever on a spring support from where
// the spring stands unloaded. The values are those of
// TestDeflectionLeavesSettlementOut; the spring's, by superposition of the
// cantilever's P·L³/(3EI) (Gere & Goodno, Table G-1, from memory), the
// spring's give P/k and its turn P·L/k_r carried over the length L
// (statics).
func TestDeflectionSaysWhatItMeasuresFrom(t *testing.T) {
	const ei = 200e9 * 0.1 * 0.008 / 12
	const k, kr = 1e7, 1e7
	spring := fem.Support{X: 0, Kind: fem.Spring, Stiffness: [3]float64{1e9, k, kr}}
	tests := []struct {
		name      string
		length    float64
		supports  []fem.Support
		check     string
		want      float64
		says, not []string
	}{
		{"cantilever", 2, []fem.Support{{X: 0, Kind: fem.Fixed}}, "Deflection, cantilever", 5e3 * 8 / (3 * ei),
			[]string{"measured from the member's tangent at its fixed support (settlement not counted)"}, []string{"supports", "tilt"}},
		{"overhang beyond a roller", 6, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 5, Kind: fem.Roller}}, "Deflection, cantilever", 5e3 * 1 * 1 * (5 + 1) / (3 * ei),
			[]string{"measured from the line through its support at the slope settlement alone gives it (settlement not counted), so the member's turn over the support counts", "the deflection includes the tilt of the beam over the support"}, []string{"the supports"}},
		{"span beside the overhang", 6, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 5, Kind: fem.Roller}}, "Deflection, span", 5e3 * 1 * 25 / (9 * math.Sqrt(3) * ei),
			[]string{"measured from the line through the supports (settlement not counted)"}, []string{"tangent"}},
		{"cantilever on a spring support", 2, []fem.Support{spring}, "Deflection, cantilever", 5e3*8/(3*ei) + 5e3/k + 5e3*2*2/kr,
			[]string{"measured from the line through its support at the slope settlement alone gives it (settlement not counted), taken where the spring support stands unloaded, so the spring's give counts as deflection"}, []string{"the supports"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r := tipLoadDeflection(t, tt.length, tt.supports, tt.check, tt.want)
			for _, s := range tt.says {
				if !strings.Contains(r.Message, s) {
					t.Errorf("the message does not say %q: %s", s, r.Message)
				}
			}
			for _, s := range tt.not {
				if strings.Contains(r.Message, s) {
					t.Errorf("the message says %q: %s", s, r.Message)
				}
			}
		})
	}
}
