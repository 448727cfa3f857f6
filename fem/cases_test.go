package fem

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"
)

// twoSpans is a continuous beam of two equal spans L on pinned and roller
// supports with two cases: a uniform load w on both spans ("both") and on
// the first only ("first").
func twoSpans(L, w float64) *Model {
	uniform := func(a, b float64) DistributedLoad {
		return DistributedLoad{Direction: Transverse, Points: []LoadPoint{{a, w}, {b, w}}}
	}
	return &Model{
		Segments: []Segment{testSegment(0, 2*L)},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}},
		Cases: []LoadCase{
			{Name: "both", DistributedLoad: []DistributedLoad{uniform(0, 2*L)}},
			{Name: "first", DistributedLoad: []DistributedLoad{uniform(0, L)}},
		},
		Mesh: MeshSettings{Elements: 64},
	}
}

// Two equal spans under a uniform load w (w < 0 is downward), case by case
// on one factorization, against the continuous-beam tables (AISC Manual,
// beam diagrams and formulas, two equal spans: uniform load on both spans,
// case 29, and on one span, case 30; from memory): both spans loaded, end
// reactions 3wL/8, middle 10wL/8, moment over the middle support −wL²/8,
// largest span moment 9wL²/128 at 3L/8 from the ends; one span loaded,
// reactions 7wL/16, 10wL/16 and −wL/16, moment over the middle −wL²/16,
// largest span moment 49wL²/512 at 7L/16.
func TestTwoSpanCases(t *testing.T) {
	const L, w = 5.0, -12e3
	m := twoSpans(L, w)
	p, err := Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	mesh := p.Mesh()
	sols, err := p.SolveLoadSets(mesh)
	if err != nil {
		t.Fatal(err)
	}
	exacts, err := p.ExactLoadSets()
	if err != nil {
		t.Fatal(err)
	}
	W := -w // the load's size, N/m
	for _, c := range []struct {
		set          int
		reactions    [3]float64
		middleMoment float64
		spanMoment   float64
		spanAt       float64
	}{
		{0, [3]float64{3 * W * L / 8, 10 * W * L / 8, 3 * W * L / 8}, -W * L * L / 8, 9 * W * L * L / 128, 3 * L / 8},
		{1, [3]float64{7 * W * L / 16, 10 * W * L / 16, -W * L / 16}, -W * L * L / 16, 49 * W * L * L / 512, 7 * L / 16},
	} {
		name := m.LoadSetName(c.set)
		for i, want := range c.reactions {
			for src, r := range map[string][]Reaction{"FE": sols[c.set].Reactions, "exact": exacts[c.set].Reactions()} {
				if got := r[i].Force[Transverse]; math.Abs(got-want) > 1e-9*W*L {
					t.Errorf("%s, %s reaction %d: %.9g, want %.9g", name, src, i+1, got, want)
				}
			}
		}
		if got := exacts[c.set].At(L, Left).BendingMoment; math.Abs(got-c.middleMoment) > 1e-9*W*L*L {
			t.Errorf("%s: moment over the middle support %.9g, want %.9g", name, got, c.middleMoment)
		}
		// The largest span moment, where V = 0.
		if got := exacts[c.set].At(c.spanAt, Right); math.Abs(got.BendingMoment-c.spanMoment) > 1e-9*W*L*L || math.Abs(got.ShearForce) > 1e-9*W*L {
			t.Errorf("%s: at x = %.4g m, M %.9g and V %.3g, want M %.9g and V 0", name, c.spanAt, got.BendingMoment, got.ShearForce, c.spanMoment)
		}
	}
}

// Superposition: a combination of the case solutions equals the solution
// of the combined loads, for the finite element answer and the exact one;
// the cases' spans add up to the case (random continuous beams, the
// combined model solved on its own as the reference).
func TestCombinationIsSuperposition(t *testing.T) {
	rnd := rand.New(rand.NewPCG(31, 32))
	for trial := range 20 {
		m := randomTwoCases(rnd)
		factors := []float64{1.35, 1.5}
		combined := m.LoadSet(0)
		scaleLoads(&combined, factors[0])
		for i := range combined.Supports {
			combined.Supports[i].Settlement[Transverse] *= factors[0]
		}
		imposed := m.LoadSet(1)
		scaleLoads(&imposed, factors[1])
		combined.PointLoads = append(combined.PointLoads, imposed.PointLoads...)
		combined.DistributedLoad = append(combined.DistributedLoad, imposed.DistributedLoad...)
		combined.TemperatureChange = factors[1] * imposed.TemperatureChange
		combined.Gravity[1] *= factors[0]
		combined.Mesh = MeshSettings{Elements: 40}
		m.Mesh = combined.Mesh

		p, err := Prepare(&m)
		if err != nil {
			t.Fatal(err)
		}
		fe, ex := combineCases(t, p, factors)
		refEx, err := SolveExact(&combined)
		if err != nil {
			t.Fatal(err)
		}
		for i, r := range refEx.Reactions() {
			for d, want := range r.Force {
				scale := 1e-9 * (math.Abs(refEx.Reactions()[0].Force[Transverse]) + 1e3)
				if got := fe.Reactions[i].Force[d]; math.Abs(got-want) > scale {
					t.Errorf("trial %d: FE combination's reaction %d %s %.9g, combined model's %.9g", trial, i+1, Dof(d), got, want)
				}
				if got := ex.Reactions()[i].Force[d]; math.Abs(got-want) > scale {
					t.Errorf("trial %d: exact combination's reaction %d %s %.9g, combined model's %.9g", trial, i+1, Dof(d), got, want)
				}
			}
		}
		for _, x := range []float64{0.1, 0.37, 0.5, 0.81} {
			x *= m.Length()
			g, want := ex.At(x, Right), refEx.At(x, Right)
			f := fe.At(x, Right)
			for _, q := range []Quantity{QDeflection, QBendingMoment, QAxialForce} {
				tol := 1e-8 * (math.Abs(q.Of(&want)) + 1e-3)
				if math.Abs(q.Of(&g)-q.Of(&want)) > tol {
					t.Errorf("trial %d: exact combination's %s at %.3g m: %.9g, combined model's %.9g", trial, q, x, q.Of(&g), q.Of(&want))
				}
			}
			if math.Abs(f.Deflection-want.Deflection) > 1e-3*math.Abs(want.Deflection)+1e-9 {
				t.Errorf("trial %d: FE combination's deflection at %.3g m %.6g, far from the exact %.6g", trial, x, f.Deflection, want.Deflection)
			}
		}
	}
}

// combineCases solves every load set of p, FE and exact, and combines
// them with factors.
func combineCases(t *testing.T, p *Member, factors []float64) (*Solution, *Exact) {
	t.Helper()
	sols, err := p.SolveLoadSets(p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	exacts, err := p.ExactLoadSets()
	if err != nil {
		t.Fatal(err)
	}
	fe, err := CombineSolutions(sols, factors)
	if err != nil {
		t.Fatal(err)
	}
	ex, err := CombineExact(exacts, factors)
	if err != nil {
		t.Fatal(err)
	}
	return fe, ex
}

// randomTwoCases is a random continuous beam with its loads in two cases:
// "dead", half its point loads with its self-weight and settlements, and
// "imposed", the rest.
func randomTwoCases(rnd *rand.Rand) Model {
	base := randomKeyPointModel(rnd)
	m := base.Clone()
	m.PointLoads, m.DistributedLoad, m.TemperatureChange = nil, nil, 0
	half := len(base.PointLoads) / 2
	m.Cases = []LoadCase{
		{Name: "dead", PointLoads: base.PointLoads[:half], SelfWeight: true, Settlements: true},
		{Name: "imposed", PointLoads: base.PointLoads[half:], DistributedLoad: base.DistributedLoad, TemperatureChange: base.TemperatureChange},
	}
	return m
}

// scaleLoads multiplies the point and distributed loads of m by f.
func scaleLoads(m *Model, f float64) {
	for i := range m.PointLoads {
		p := &m.PointLoads[i]
		p.Axial, p.Transverse, p.Moment = f*p.Axial, f*p.Transverse, f*p.Moment
	}
	for i := range m.DistributedLoad {
		for k := range m.DistributedLoad[i].Points {
			m.DistributedLoad[i].Points[k].Intensity *= f
		}
	}
}

// A case placed by span splits into its spans' shares, which add up to it:
// reactions of the shares sum to the case's (statics of superposition).
func TestSpanLoadsAddUp(t *testing.T) {
	const L, w = 4.0, -9e3
	m := twoSpans(L, w)
	m.Supports = append(m.Supports, Support{X: 2*L + 1, Kind: Roller})
	m.Segments = []Segment{testSegment(0, 3*L)} // a third span and an overhang
	m.Cases[0].DistributedLoad[0].Points = []LoadPoint{{0, w}, {1.5 * L, 2 * w}, {3 * L, w}}
	m.Cases[0].PointLoads = []PointLoad{{X: L, Transverse: -5e3}, {X: 3 * L, Transverse: -2e3}}
	shares := m.SpanLoads(0)
	if len(shares) != 4 {
		t.Fatalf("%d spans, want 4 (three spans and an overhang)", len(shares))
	}
	whole := m.LoadSet(0)
	wholeLoads := GatherLoads(&whole, KeyPoints(&whole))
	total := wholeLoads.Resultant()
	var sum [3]float64
	for _, s := range shares {
		l := GatherLoads(&s, KeyPoints(&s))
		r := l.Resultant()
		for i := range sum {
			sum[i] += r[i]
		}
	}
	for i := range sum {
		if math.Abs(sum[i]-total[i]) > 1e-9*math.Abs(total[1])*3*L {
			t.Errorf("resultant %d of the shares %.9g, of the case %.9g", i, sum[i], total[i])
		}
	}
}

// Superposition (linear elasticity: small displacements and Hooke's law
// make the response to Σ fₖ·loadsₖ equal to Σ fₖ·responseₖ; any mechanics
// of materials text, from memory): on a mesh refined on two goroutines,
// with ramps, steps, self-weight, temperature and settlements among the
// cases, each combination's fields as the envelope solves them
// (CombinationSolutions.Solution, one load set per combination) equal the
// factor-weighted sum of its cases' fields (CombineSolutions) and the
// fields of the combined loads solved directly as a model of their own, at
// both ends and the middle of every element, to round-off.
func TestCombinationFieldsAreSumOfCaseFields(t *testing.T) {
	const L = 12.0
	ramp := DistributedLoad{Direction: Transverse, Points: []LoadPoint{{0, -2e3}, {L, -9e3}}}
	step := DistributedLoad{Direction: Transverse, Points: []LoadPoint{{2.5, -6e3}, {7, -6e3}}}
	pull := DistributedLoad{Direction: Axial, Points: []LoadPoint{{1, 3e3}, {11, 0}}}
	m := Model{
		Segments: []Segment{testSegment(0, 5), testSegment(5, L)},
		Supports: []Support{{X: 0, Kind: Pinned, Settlement: [3]float64{0, -2e-3, 0}}, {X: 5, Kind: Roller}, {X: L, Kind: Fixed}},
		Cases: []LoadCase{
			{Name: "permanent", DistributedLoad: []DistributedLoad{ramp}, SelfWeight: true},
			{Name: "imposed", DistributedLoad: []DistributedLoad{step, pull}, PointLoads: []PointLoad{{X: 3.3, Transverse: -20e3}, {X: 9.1, Moment: 8e3}}},
			{Name: "thermal", TemperatureChange: 25, PointLoads: []PointLoad{{X: 6.4, Axial: 15e3}}},
			{Name: "settlement", Settlements: true},
		},
		Gravity: [2]float64{0, -StandardGravity},
		Mesh:    MeshSettings{Elements: 2 * parallelRefine},
	}
	m.Segments[1].Section.SecondMoment *= 1.7
	m.Combinations = []Combination{
		{Name: "strength", Factors: []CaseFactor{{0, 1.35}, {1, 1.5}, {2, 0.9}, {3, 1}}},
		{Name: "uplift", Factors: []CaseFactor{{0, 0.9}, {2, -1.2}, {3, -0.5}}},
	}
	p, err := Prepare(&m)
	if err != nil {
		t.Fatal(err)
	}
	mesh := p.Mesh()
	cs, err := p.SolveCombinations(mesh)
	if err != nil {
		t.Fatal(err)
	}
	cases, err := p.SolveLoadSets(mesh)
	if err != nil {
		t.Fatal(err)
	}
	for c, cb := range m.Combinations {
		factors := make([]float64, len(cases))
		for _, cf := range cb.Factors {
			factors[cf.Case] = cf.Factor
		}
		sum, err := CombineSolutions(cases, factors)
		if err != nil {
			t.Fatal(err)
		}
		combined := combinedModel(&m, factors)
		direct, err := SolveOnMesh(&combined, mesh)
		if err != nil {
			t.Fatal(err)
		}
		got, err := cs.Solution(c)
		if err != nil {
			t.Fatal(err)
		}
		var scale [quantityCount]float64
		for _, e := range mesh.Elements {
			f := direct.At(e.Start, Right)
			for _, q := range Quantities() {
				scale[q] = max(scale[q], math.Abs(q.Of(&f)))
			}
		}
		for i, e := range mesh.Elements {
			for _, at := range []struct {
				x    float64
				side Side
			}{{e.Start, Right}, {0.5 * (e.Start + e.End), Right}, {e.End, Left}} {
				want, g, s := direct.At(at.x, at.side), got.At(at.x, at.side), sum.At(at.x, at.side)
				for _, q := range Quantities() {
					tol := 1e-9 * scale[q]
					if d1, d2 := math.Abs(q.Of(&g)-q.Of(&want)), math.Abs(q.Of(&s)-q.Of(&want)); d1 > tol || d2 > tol {
						t.Fatalf("%s, element %d, x = %.6g m: %s %.12g (combination) and %.12g (sum of cases), %.12g solved directly", cb.Name, i, at.x, q, q.Of(&g), q.Of(&s), q.Of(&want))
					}
				}
			}
		}
	}
}

// combinedModel is the loads of m's cases with factors (one per case)
// as one model without cases. It takes at most one case of self-weight
// and one of settlements, as TestCombinationFieldsAreSumOfCaseFields has.
func combinedModel(m *Model, factors []float64) Model {
	out := m.LoadSet(0)
	out.PointLoads, out.DistributedLoad, out.TemperatureChange = nil, nil, 0
	out.Gravity = [2]float64{}
	for i := range out.Supports {
		out.Supports[i].Settlement = [3]float64{}
	}
	for k, lc := range m.Cases {
		f := factors[k]
		set := m.LoadSet(k)
		scaleLoads(&set, f)
		out.PointLoads = append(out.PointLoads, set.PointLoads...)
		out.DistributedLoad = append(out.DistributedLoad, set.DistributedLoad...)
		out.TemperatureChange += f * lc.TemperatureChange
		if lc.SelfWeight {
			out.Gravity = [2]float64{f * m.Gravity[0], f * m.Gravity[1]}
		}
		if lc.Settlements {
			for i, s := range m.Supports {
				for d := range s.Settlement {
					out.Supports[i].Settlement[d] = f * s.Settlement[d]
				}
			}
		}
	}
	return out
}

// A combination is one load set: when its factor makes results that
// overflow, it must be refused as Solve refuses the same loads applied at
// once (errNotFinite), not combined into values whose squares are
// infinite (the energy error read NaN, and `stave solve --json` failed
// with "json: unsupported value: NaN" on two spans with 1e300 times a
// case placed by span).
func TestCombinationThatOverflowsIsRefused(t *testing.T) {
	const L, w, f = 4.0, -1e4, 1e300
	m := twoSpans(L, w)
	scaled := twoSpans(L, w) // its own loads, which scaling leaves m's alone
	scaled.DistributedLoad, scaled.Cases = scaled.Cases[0].DistributedLoad, nil
	scaleLoads(scaled, f)
	if _, err := Solve(scaled); !errors.Is(err, errNotFinite) {
		t.Fatalf("Solve of the loads times %g: %v, want the refusal of results too large for floating point", f, err)
	}
	p, err := Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	sols, err := p.SolveLoadSets(p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	if _, err := CombineSolutions(sols[:1], []float64{f}); !errors.Is(err, errNotFinite) {
		t.Errorf("CombineSolutions of the case times %g: %v, want the same refusal", f, err)
	}
	// A large factor that stays finite combines.
	if _, err := CombineSolutions(sols, []float64{1e100, 1}); err != nil {
		t.Errorf("CombineSolutions with a factor of 1e100: %v", err)
	}
}

// The strain energy of a combination is found again from its fields
// (CombineSolutions): a load set alone at factor f stores f² times its own
// (the energy is quadratic in the loads, linear elasticity, from memory),
// on random members with hinges, springs, settlements, self-weight and
// temperature.
func TestCombinationStrainEnergy(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 11))
	solved := 0
	for trial := range 20 {
		m := randomTwoCases(rnd)
		p, err := Prepare(&m)
		if err != nil {
			continue // a random model Prepare refuses is another test's business
		}
		solved++
		sols, err := p.SolveLoadSets(p.Mesh())
		if err != nil {
			t.Fatal(err)
		}
		for k, s := range sols {
			for _, f := range []float64{1, -2.5} {
				c, err := CombineSolutions([]*Solution{s}, []float64{f})
				if err != nil {
					t.Fatal(err)
				}
				if want := f * f * s.StrainEnergy; math.Abs(c.StrainEnergy-want) > 1e-9*math.Abs(want) {
					t.Errorf("trial %d, load set %d × %g: strain energy %g J, want %g J", trial, k, f, c.StrainEnergy, want)
				}
			}
		}
	}
	if solved < 10 {
		t.Fatalf("%d of 20 random members solved; the test needs 10", solved)
	}
}
