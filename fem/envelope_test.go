package fem

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// solveCombinations prepares m and solves its envelope's load sets, FE and
// exact.
func solveCombinations(t *testing.T, m *Model) (*Member, *CombinationSolutions) {
	t.Helper()
	p, err := Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	cs, err := p.SolveCombinations(p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	if err := cs.SolveExact(p); err != nil {
		t.Fatal(err)
	}
	return p, cs
}

// The loads always on of a combination, solved as one load set, give what
// combining its cases' solutions gives (superposition), for the finite
// element answer and the exact one (random continuous beams).
func TestCombinedLoadsAreCombinedResults(t *testing.T) {
	rnd := rand.New(rand.NewPCG(41, 42))
	for trial := range 15 {
		m := randomTwoCases(rnd)
		if len(m.Cases[0].PointLoads) == 0 && m.Gravity == [2]float64{} {
			m.Cases[0].PointLoads = []PointLoad{{X: m.Length() / 3, Transverse: -1e3}}
		}
		factors := []float64{1.35 + rnd.Float64(), -0.5 + 2*rnd.Float64()}
		m.Combinations = []Combination{{Name: "c", Factors: []CaseFactor{{0, factors[0]}, {1, factors[1]}}}}
		m.Mesh = MeshSettings{Elements: 40}
		p, cs := solveCombinations(t, &m)
		fe, ex := combineCases(t, p, factors)
		got, gotEx := cs.Fixed[0], cs.FixedExact[0]
		scale := 0.0
		for _, d := range fe.Displacement {
			scale = max(scale, math.Abs(d[0]), math.Abs(d[1]), math.Abs(d[2]))
		}
		for i, d := range fe.Displacement {
			for j := range d {
				if math.Abs(got.Displacement[i][j]-d[j]) > 1e-9*scale {
					t.Fatalf("trial %d: node %d %s %.12g from the combined loads, %.12g combined from the cases", trial, i, Dof(j), got.Displacement[i][j], d[j])
				}
			}
		}
		for _, x := range []float64{0.13, 0.5, 0.77} {
			x *= m.Length()
			a, b := got.At(x, Right), fe.At(x, Right)
			c, d := gotEx.At(x, Right), ex.At(x, Right)
			for _, q := range []Quantity{QBendingMoment, QShearForce, QAxialForce} {
				tol := 1e-8 * (math.Abs(q.Of(&b)) + math.Abs(q.Of(&d)) + 1)
				if math.Abs(q.Of(&a)-q.Of(&b)) > tol || math.Abs(q.Of(&c)-q.Of(&d)) > tol {
					t.Errorf("trial %d: %s at %.3g m: FE %.9g against %.9g, exact %.9g against %.9g", trial, q, x, q.Of(&a), q.Of(&b), q.Of(&c), q.Of(&d))
				}
			}
		}
	}
}

// The envelope equals the largest and smallest extremes over the
// combinations, each found on its own by fem.Summarize (brute force), and
// names the combination that has them: the exact extremes, where every
// load set's exact solution is a polynomial (no foundation).
func TestEnvelopeIsWorstCombination(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 8))
	for trial := range 10 {
		m := randomTwoCases(rnd)
		m.Cases = []LoadCase{
			{Name: "a", PointLoads: []PointLoad{{X: 0.3 * m.Length(), Transverse: -8e3, Axial: 2e3}}, SelfWeight: m.Gravity != [2]float64{}},
			{Name: "b", PointLoads: []PointLoad{{X: 0.7 * m.Length(), Transverse: 5e3, Moment: 1e3}}},
			{Name: "c", DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -3e3}, {m.Length(), 1e3}}}}},
		}
		for k := range 4 {
			cb := Combination{Name: string(rune('p' + k))}
			for c := range m.Cases {
				if f := 2*rnd.Float64() - 0.5; rnd.IntN(3) > 0 {
					cb.Factors = append(cb.Factors, CaseFactor{c, f})
				}
			}
			if len(cb.Factors) == 0 {
				cb.Factors = []CaseFactor{{k % 3, 1}}
			}
			m.Combinations = append(m.Combinations, cb)
		}
		m.Mesh = MeshSettings{Elements: 30}
		_, cs := solveCombinations(t, &m)
		env := cs.Envelope()
		if !env.Exact && len(m.Foundations) == 0 {
			t.Errorf("trial %d: the envelope is of the finite element solutions, though every exact one is a polynomial", trial)
		}
		var sums []Summary
		for c := range m.Combinations {
			s, err := cs.Solution(c)
			if err != nil {
				t.Fatal(err)
			}
			e, err := cs.Exact(c)
			if err != nil {
				t.Fatal(err)
			}
			if !env.Exact {
				e = nil
			}
			sums = append(sums, Summarize(s, e))
		}
		for qi, qe := range env.Quantities {
			q := qe.Quantity
			hi, lo := math.Inf(-1), math.Inf(1)
			var hiBy, loBy int
			for c, s := range sums {
				e := s.Extremes[qi]
				if q == QCombinedStress {
					continue
				}
				if e.Max > hi {
					hi, hiBy = e.Max, c
				}
				if e.Min < lo {
					lo, loBy = e.Min, c
				}
			}
			if q == QCombinedStress {
				continue
			}
			if !closeTo(qe.Max.Value, hi) || !closeTo(qe.Min.Value, lo) {
				t.Errorf("trial %d, %s: envelope %.9g to %.9g, brute force %.9g to %.9g", trial, q, qe.Min.Value, qe.Max.Value, lo, hi)
			}
			if qe.Max.Value != sums[qe.Max.Combination].Extremes[qi].Max && qe.Max.Combination != hiBy {
				t.Errorf("trial %d, %s: largest governed by combination %d, brute force %d", trial, q, qe.Max.Combination, hiBy)
			}
			if !closeTo(sums[qe.Min.Combination].Extremes[qi].Min, lo) {
				t.Errorf("trial %d, %s: smallest governed by combination %d, brute force %d", trial, q, qe.Min.Combination, loBy)
			}
		}
	}
}

// close compares results of different sums of the same terms: to 1e-9 of
// their size, with an absolute floor for values that vanish.
func closeTo(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*max(math.Abs(a), math.Abs(b))+1e-12
}

// threeSpans is a continuous beam of three equal spans L on a pinned and
// three roller supports, with a permanent uniform load g and an imposed
// uniform load q placed by span.
func threeSpans(L, g, q float64) *Model {
	uniform := func(w float64) []DistributedLoad {
		return []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, w}, {3 * L, w}}}}
	}
	return &Model{
		Segments: []Segment{testSegment(0, 3*L)},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}, {X: 3 * L, Kind: Roller}},
		Cases: []LoadCase{
			{Name: "permanent", DistributedLoad: uniform(g)},
			{Name: "imposed", DistributedLoad: uniform(q), BySpan: true},
		},
		Mesh: MeshSettings{Elements: 60},
	}
}

// arrangement is the three-span beam with the imposed load on the spans of
// mask only, placed by hand as plain loads: the brute force's model.
func arrangement(L, g, q float64, mask int, factors [2]float64) *Model {
	m := threeSpans(L, g, q)
	c := m.LoadSet(0)
	c.DistributedLoad[0].Points[0].Intensity *= factors[0]
	c.DistributedLoad[0].Points[1].Intensity *= factors[0]
	for s := range 3 {
		if mask&(1<<s) != 0 {
			c.DistributedLoad = append(c.DistributedLoad, DistributedLoad{Direction: Transverse,
				Points: []LoadPoint{{float64(s) * L, factors[1] * q}, {float64(s+1) * L, factors[1] * q}}})
		}
	}
	return &c
}

// Pattern loading on three equal spans: the envelope against the worst of
// all 2³ arrangements of the imposed load, each solved on its own as a
// model of plain loads (brute force), and the governing arrangements
// against the continuous-beam coefficients (three equal spans, uniform
// load, from memory, e.g. the AISC Manual's beam diagrams; checked here by
// the three-moment equation): imposed load alone, the largest span moment
// 0.10125·qL² with the end spans loaded (alternate spans, support moments
// −qL²/20), the largest support moment −7qL²/60 with two adjacent spans
// loaded.
func TestThreeSpanPattern(t *testing.T) {
	const L, g, q = 4.0, -6e3, -10e3
	factors := [2]float64{1.35, 1.5}
	m := threeSpans(L, g, q)
	m.Combinations = []Combination{{Name: "strength", Factors: []CaseFactor{{0, factors[0]}, {1, factors[1]}}}}
	_, cs := solveCombinations(t, m)
	env := cs.Envelope()
	if !env.Exact {
		t.Fatal("the envelope is of the finite element solutions, though every exact one is a polynomial")
	}
	var brute [8]Summary
	for mask := range 8 {
		s, e := solveBoth(t, arrangement(L, g, q, mask, factors))
		brute[mask] = Summarize(s, e)
	}
	for qi, qe := range env.Quantities {
		hi, lo := math.Inf(-1), math.Inf(1)
		hiMask, loMask := 0, 0
		for mask, s := range brute {
			e := s.Extremes[qi]
			if qe.Quantity == QCombinedStress {
				e.Max, e.Min = fibreExtremes(s, qi)
			}
			if e.Max > hi+1e-9*math.Abs(hi) {
				hi, hiMask = e.Max, mask
			}
			if e.Min < lo-1e-9*math.Abs(lo) {
				lo, loMask = e.Min, mask
			}
		}
		if !near(qe.Max.Value, hi) || !near(qe.Min.Value, lo) {
			t.Errorf("%s: envelope %.9g to %.9g, worst arrangements %.9g (spans %03b) to %.9g (spans %03b)",
				qe.Quantity, qe.Min.Value, qe.Max.Value, lo, loMask, hi, hiMask)
		}
		// The governing arrangement, solved on its own, reaches the value.
		for _, gv := range []Governing{qe.Max, qe.Min} {
			mask := 0
			for _, s := range gv.Loaded {
				mask |= 1 << s.Span
			}
			_, sol := solveBoth(t, arrangement(L, g, q, mask, factors))
			f := sol.At(gv.X, Right)
			fl := sol.At(gv.X, Left)
			v := qe.Quantity.Of(&f)
			if qe.Quantity == QCombinedStress {
				v = gv.Value // fibre of either side: checked above
			}
			if !near(v, gv.Value) && !near(qe.Quantity.Of(&fl), gv.Value) {
				t.Errorf("%s: %.9g at %.4g m with spans %03b loaded, which give %.9g there", qe.Quantity, gv.Value, gv.X, mask, v)
			}
		}
	}
	// The imposed load alone, against the coefficients.
	m.Combinations = []Combination{{Name: "imposed", Factors: []CaseFactor{{1, 1}}}}
	_, cs = solveCombinations(t, m)
	env = cs.Envelope()
	moment := env.Quantities[QBendingMoment]
	W := -q
	// The values from the exact solutions' envelope (the finite element
	// moment is off by about q·h²/12 between nodes); the arrangements from
	// the finite element one.
	if got, want := cs.At(0.45*L, Right, true).Hi.BendingMoment, 0.10125*W*L*L; math.Abs(got-want) > 1e-9*W*L*L {
		t.Errorf("largest span moment %.9g, want 0.10125·qL² = %.9g", got, want)
	}
	if math.Abs(moment.Max.X-0.45*L) > L/60 {
		t.Errorf("largest span moment at %.4g m, want 0.45·L = %.4g m within an element", moment.Max.X, 0.45*L)
	}
	if spans := spansOf(moment.Max.Loaded); spans != 0b101 {
		t.Errorf("largest span moment with spans %03b loaded, want the end spans (101)", spans)
	}
	if got, want := cs.At(L, Left, true).Lo.BendingMoment, -7*W*L*L/60; math.Abs(got-want) > 1e-9*W*L*L {
		t.Errorf("largest support moment %.9g, want −7qL²/60 = %.9g", got, want)
	}
	if moment.Min.X != L && moment.Min.X != 2*L {
		t.Errorf("largest support moment at %.6g m, want over an inner support", moment.Min.X)
	}
	if spans := spansOf(moment.Min.Loaded); spans != 0b011 && spans != 0b110 {
		t.Errorf("largest support moment with spans %03b loaded, want two adjacent spans", spans)
	}
	// The support reactions: the middle ones largest with the adjacent
	// spans loaded, the brute force's largest.
	for i, re := range env.Reactions {
		hi := math.Inf(-1)
		for mask := range 8 {
			sol, _ := Solve(arrangement(L, 0, q, mask, [2]float64{0, 1}))
			hi = max(hi, sol.Reactions[i].Force[Transverse])
		}
		if !near(re.Max[Transverse].Value, hi) {
			t.Errorf("support %d: largest reaction %.9g, brute force %.9g", i+1, re.Max[Transverse].Value, hi)
		}
	}
}

// fibreExtremes are the largest and smallest stress of either fibre along
// the member in summary s of a beam without axial force, whose fibres
// carry ±σb.
func fibreExtremes(s Summary, _ int) (hi, lo float64) {
	b := s.Extremes[QBendingStress]
	return max(b.Max, -b.Min), min(b.Min, -b.Max)
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-7*max(math.Abs(a), math.Abs(b))+1e-9 }

func spansOf(loaded []Share) int {
	mask := 0
	for _, s := range loaded {
		mask |= 1 << s.Span
	}
	return mask
}

// The envelope sampled at a point is the worst over the combinations and
// the arrangements there, FE and exact, and names the combination that
// gives it.
func TestEnvelopeAt(t *testing.T) {
	const L, g, q = 3.0, -4e3, -7e3
	m := threeSpans(L, g, q)
	m.Combinations = []Combination{
		{Name: "one", Factors: []CaseFactor{{0, 1.35}, {1, 1.5}}},
		{Name: "two", Factors: []CaseFactor{{0, 1}}},
	}
	_, cs := solveCombinations(t, m)
	for _, x := range []float64{0.4, 1.1, 3.0, 4.7, 7.9} {
		for _, exact := range []bool{false, true} {
			got := cs.At(x, Right, exact)
			hi, lo := math.Inf(-1), math.Inf(1)
			hiBy := -1
			for c, f := range [][2]float64{{1.35, 1.5}, {1, 0}} {
				for mask := range 8 {
					mm := arrangement(L, g, q, mask, f)
					var v float64
					if exact {
						e, _ := SolveExact(mm)
						v = e.At(x, Right).BendingMoment
					} else {
						s, _ := Solve(mm)
						v = s.At(x, Right).BendingMoment
					}
					if v > hi {
						hi, hiBy = v, c
					}
					lo = min(lo, v)
				}
			}
			if !near(got.Hi.BendingMoment, hi) || !near(got.Lo.BendingMoment, lo) {
				t.Errorf("x = %g m, exact %v: M from %.9g to %.9g, brute force %.9g to %.9g", x, exact, got.Lo.BendingMoment, got.Hi.BendingMoment, lo, hi)
			}
			if got.HiBy[QBendingMoment] != hiBy {
				t.Errorf("x = %g m, exact %v: largest M governed by %d, brute force %d", x, exact, got.HiBy[QBendingMoment], hiBy)
			}
		}
	}
}

// A model without cases has one combination, its own loads, whose
// envelope is its solution's exact extremes.
func TestEnvelopeWithoutCases(t *testing.T) {
	m := twoSpans(4, -5e3)
	m.DistributedLoad, m.Cases = m.Cases[0].DistributedLoad, nil
	_, cs := solveCombinations(t, m)
	cbs := m.EnvelopeCombinations()
	if len(cbs) != 1 || cbs[0].Name != "loads" {
		t.Fatalf("combinations %+v, want one named loads", cbs)
	}
	want := Summarize(solveBoth(t, m))
	env := cs.Envelope()
	for i, qe := range env.Quantities {
		if qe.Quantity == QCombinedStress {
			continue
		}
		if !closeTo(qe.Max.Value, want.Extremes[i].Max) || !closeTo(qe.Min.Value, want.Extremes[i].Min) {
			t.Errorf("%s: %.9g to %.9g, the solution's %.9g to %.9g", qe.Quantity, qe.Min.Value, qe.Max.Value, want.Extremes[i].Min, want.Extremes[i].Max)
		}
	}
}

// A member that is free to expand takes no axial reaction whatever the
// temperature (statics: a pinned and a roller support, nothing else holds
// it along its axis), so the envelope's axial reactions are 0, not the
// round-off of the thermal force α·ΔT·EA the exact solution cancels, which
// the reports printed ("-5.821e-14 kN") and named a combination for.
func TestReactionEnvelopeWithoutRoundOff(t *testing.T) {
	m := &Model{
		Segments: []Segment{{Start: 0, End: 10, Section: Section{Area: 0.004, SecondMoment: 1.6e-5, FibreDistance: 0.1},
			Material: Material{Elastic: 2e11, ThermalExpansion: 1.2e-5}}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: 4, Kind: Roller}, {X: 10, Kind: Roller}},
		Cases: []LoadCase{
			{Name: "dead", DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -5e3}, {10, -5e3}}}}},
			{Name: "warm", TemperatureChange: 30},
		},
		Combinations: []Combination{
			{Name: "A", Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1.35}}},
			{Name: "B", Kind: Serviceability, Factors: []CaseFactor{{Case: 0, Factor: 1}, {Case: 1, Factor: 1}}},
			{Name: "C", Kind: OtherCombination, Factors: []CaseFactor{{Case: 1, Factor: 1}}},
		},
	}
	_, cs := solveCombinations(t, m)
	for _, r := range cs.Envelope().Reactions {
		if hi, lo := r.Max[Axial].Value, r.Min[Axial].Value; hi != 0 || lo != 0 {
			t.Errorf("support %d: axial reaction from %g to %g N, want 0", r.Support+1, lo, hi)
		}
		if r.Max[Transverse].Value <= 0 {
			t.Errorf("support %d: largest transverse reaction %g N, want the loads' share", r.Support+1, r.Max[Transverse].Value)
		}
	}
}

// A hinged (Gerber) beam, supports at 0, 6 and 10 m and a hinge at 7.5 m,
// under an imposed load placed by span: the part beyond the hinge is a
// simple beam on the hinge and the last support, so a load on the first
// span gives the last support nothing (statics). Its largest reaction,
// q·2.5/2 = 12.5 kN, comes from the second span alone, and the
// arrangement names that span alone, not the first span too for the
// round-off its share leaves there; the smallest loads no span.
func TestGoverningSpansLeaveRoundOffOut(t *testing.T) {
	m := &Model{
		Segments: []Segment{{Start: 0, End: 10, Section: Section{Area: 0.004, SecondMoment: 1.6e-5, FibreDistance: 0.1},
			Material: Material{Elastic: 2e11}}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}, {X: 10, Kind: Roller}},
		Hinges:   []Hinge{{X: 7.5}},
		Cases: []LoadCase{{Name: "imposed", BySpan: true,
			DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -10e3}, {10, -10e3}}}}}},
	}
	_, cs := solveCombinations(t, m)
	r := cs.Envelope().Reactions[2]
	hi, lo := r.Max[Transverse], r.Min[Transverse]
	if math.Abs(hi.Value-12.5e3) > 1e-9*12.5e3 || !slices.Equal(hi.Loaded, []Share{{Case: 0, Span: 1}}) {
		t.Errorf("largest reaction at 10 m: %.12g N with %+v loaded, want 12500 with span 2 alone", hi.Value, hi.Loaded)
	}
	if lo.Value != 0 || len(lo.Loaded) != 0 {
		t.Errorf("smallest reaction at 10 m: %g N with %+v loaded, want 0 with none", lo.Value, lo.Loaded)
	}
}

// A simply supported beam under two combinations of a uniform and a point
// load, all acting down: its deflection is nowhere above zero and its
// moment nowhere below it (statics), so the envelope's largest deflection
// and smallest moment are 0, at the first support, x = 0 — not round-off
// (3.5e-18 m, −2.9e-11 N·m) at the far support, named at x = L plus a unit
// in the last place; and every extreme lies on the member.
func TestEnvelopeZeroAtTheFirstPlace(t *testing.T) {
	const L = 7.3
	m := &Model{
		Segments: []Segment{{Start: 0, End: L, Section: Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.2},
			Material: Material{Elastic: 2e11}}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		Cases: []LoadCase{
			{Name: "a", DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -10e3}, {L, -10e3}}}}},
			{Name: "b", PointLoads: []PointLoad{{X: 2.9, Transverse: -13e3}}},
		},
		Combinations: []Combination{
			{Name: "c1", Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1.35}, {Case: 1, Factor: 1.5}}},
			{Name: "c2", Kind: Serviceability, Factors: []CaseFactor{{Case: 0, Factor: 1}, {Case: 1, Factor: 1}}},
		},
	}
	_, cs := solveCombinations(t, m)
	for _, q := range cs.Envelope().Quantities {
		for _, g := range [2]Governing{q.Max, q.Min} {
			if g.X < 0 || g.X > L {
				t.Errorf("%s: extreme %g at x = %.17g m, off the member", q.Quantity, g.Value, g.X)
			}
		}
		switch q.Quantity {
		case QDeflection:
			if q.Max.Value != 0 || q.Max.X != 0 {
				t.Errorf("largest deflection %g m at x = %g m, want 0 at x = 0", q.Max.Value, q.Max.X)
			}
		case QBendingMoment:
			if q.Min.Value != 0 || q.Min.X != 0 {
				t.Errorf("smallest moment %g N·m at x = %g m, want 0 at x = 0", q.Min.Value, q.Min.X)
			}
		}
	}
}

// The envelope names an extreme at a stationary end at the end exactly, as
// the summary does (TestSummaryNamesAStationaryEndAtTheEnd): a beam
// continuous over two spans L = 4 m under a uniform load w placed by span
// turns most at its far end with the second span alone loaded, by
// wL³/(32EI) (three-moment equation, M = −wL²/16 over the middle support;
// beam tables, from memory); the pattern envelope named it at
// x = 7.999999999999999 m.
func TestEnvelopeNamesAStationaryEndAtTheEnd(t *testing.T) {
	const L, w, E, I = 4.0, 10e3, 200e9, 1.6e-5
	m := twoEqualSpans(L, E, I)
	m.Cases = []LoadCase{{Name: "imposed", BySpan: true,
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -w}, {2 * L, -w}}}}}}
	m.Combinations = []Combination{{Name: "pattern", Factors: []CaseFactor{{Case: 0, Factor: 1}}}}
	m.Mesh.Elements = 64
	_, cs := solveCombinations(t, m)
	r := cs.Envelope().Quantities[QRotation].Max
	if want := w * L * L * L / (32 * E * I); math.Abs(r.Value-want) > 1e-9*want || r.X != 2*L {
		t.Errorf("largest rotation %.12g at x = %.17g m; want %.12g at %g m", r.Value, r.X, want, 2*L)
	}
}

// A free bar on an elastic bed along it and across it, held along its axis
// at mid-length, warmed and cooled: by symmetry the support takes nothing,
// and with no load along the member the ground's forces along it add up to
// nothing (statics), so the ground's envelope along the member is 0, not
// the round-off of the thermal force α·ΔT·EA of some hundred kN that its
// integral of kₐ·u cancels, which the reports printed ("5.813e-10 kN") and
// named a combination for.
func TestFoundationEnvelopeWithoutRoundOff(t *testing.T) {
	const L = 12.0
	m := &Model{
		Segments: []Segment{{Start: 0, End: L, Section: Section{Area: 0.48, SecondMoment: 0.0256, FibreDistance: 0.4},
			Material: Material{Elastic: 3e10, ThermalExpansion: 1e-5}}},
		Supports:    []Support{{X: L / 2, Kind: AxialOnly}},
		Foundations: []Foundation{{Start: 0, End: L, Modulus: 2.4e7, AxialModulus: 1e7}},
		Cases: []LoadCase{
			{Name: "dead", DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -5e4}, {L, -5e4}}}}},
			{Name: "warm", TemperatureChange: 30},
		},
		Combinations: []Combination{
			{Name: "A", Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1.35}, {Case: 1, Factor: 0.6}}},
			{Name: "B", Kind: Strength, Factors: []CaseFactor{{Case: 0, Factor: 1}, {Case: 1, Factor: -1}}},
		},
	}
	_, cs := solveCombinations(t, m)
	env := cs.Envelope()
	if len(env.Foundations) != 1 {
		t.Fatalf("%d foundations in the envelope, want 1", len(env.Foundations))
	}
	f := env.Foundations[0]
	if hi, lo := f.Max[0].Value, f.Min[0].Value; hi != 0 || lo != 0 {
		t.Errorf("the ground's resultant along the member runs from %g to %g N, want 0", lo, hi)
	}
	if hi := f.Max[1].Value; !closeTo(hi, 1.35*5e4*L) {
		t.Errorf("the ground's largest resultant across the member is %g N, want the loads' %g N", hi, 1.35*5e4*L)
	}
}

// A stress in the envelope is measured against the section it acts on: an
// unloaded overhang of an absurdly weak section (I = 8e-20 m⁴ beside the
// span's 8e-6 m⁴) made the span's stresses round-off, and the envelope's
// combined stress read 0 with no span loaded. A simply supported 4 m span
// under q = 10 kN/m always on and the same placed by span has
// M = 2·qL²/8 = 40 kN·m at midspan with the span loaded (Gere & Goodno,
// Mechanics of Materials, Appendix D, from memory), so σ = M·c/I =
// 40e3 · 0.1 / 8e-6 = 500 MPa in tension and compression (flexure formula,
// same book), with span 1 (share 0) loaded.
func TestEnvelopeStressAgainstItsOwnSection(t *testing.T) {
	section := func(I float64) Section { return Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1} }
	steel := Material{Elastic: 200e9}
	uniform := []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -10e3}, {4, -10e3}}}}
	m := &Model{
		Segments: []Segment{{Start: 0, End: 4, Section: section(8e-6), Material: steel},
			{Start: 4, End: 5, Section: section(8e-20), Material: steel}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: 4, Kind: Roller}},
		Cases: []LoadCase{{Name: "dead", DistributedLoad: uniform},
			{Name: "imposed", DistributedLoad: slices.Clone(uniform), BySpan: true}},
		Combinations: []Combination{{Name: "all", Factors: []CaseFactor{{0, 1}, {1, 1}}}},
		Mesh:         MeshSettings{Elements: 8},
	}
	_, cs := solveCombinations(t, m)
	const sigma = 500e6
	for _, q := range cs.Envelope().Quantities {
		if q.Quantity != QCombinedStress {
			continue
		}
		for _, g := range []struct {
			got  Governing
			want float64
		}{{q.Max, sigma}, {q.Min, -sigma}} {
			if math.Abs(g.got.Value-g.want) > 1e-9*sigma || !slices.Equal(g.got.Loaded, []Share{{Case: 1, Span: 0}}) {
				t.Errorf("combined stress %g Pa at x = %g with %+v loaded, want %g with span 1", g.got.Value, g.got.X, g.got.Loaded, g.want)
			}
		}
	}
	at := cs.At(2, Right, true)
	if math.Abs(at.Hi.CombinedStress-sigma) > 1e-9*sigma {
		t.Errorf("envelope at x = 2 m: largest combined stress %g Pa, want %g", at.Hi.CombinedStress, sigma)
	}
}

// A displacement in the envelope is measured against the deformations of
// the load sets, not against what their loads would do to the weakest
// section: an unloaded overhang of I = 8e-20 m⁴ beside a span of
// 8e-6 m⁴ made every displacement round-off, and the envelope's deflection
// read 0 with no span loaded. A simply supported span L = 4 m under
// q = 10 kN/m always on and the same placed by span (2q with the span
// loaded) sags 5·2q·L⁴/(384EI) = 41.67 mm at midspan and turns
// 2q·L³/(24EI) at its end (AISC Manual, Beam Diagrams and Formulas, simple
// beam – uniformly distributed load), which lifts the unloaded overhang's
// tip a = 1 m out by that slope times a, 33.33 mm (statics: the overhang
// carries nothing).
func TestEnvelopeDeflectionBesideAWeakOverhang(t *testing.T) {
	const E, I, L, a, q = 200e9, 8e-6, 4.0, 1.0, 10e3
	section := func(I float64) Section { return Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1} }
	steel := Material{Elastic: E}
	uniform := []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -q}, {L, -q}}}}
	m := &Model{
		Segments: []Segment{{Start: 0, End: L, Section: section(I), Material: steel},
			{Start: L, End: L + a, Section: section(8e-20), Material: steel}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		Cases: []LoadCase{{Name: "dead", DistributedLoad: uniform},
			{Name: "imposed", DistributedLoad: slices.Clone(uniform), BySpan: true}},
		Combinations: []Combination{{Name: "all", Factors: []CaseFactor{{0, 1}, {1, 1}}}},
		Mesh:         MeshSettings{Elements: 8},
	}
	_, cs := solveCombinations(t, m)
	sag, rise := 5*2*q*L*L*L*L/(384*E*I), 2*q*L*L*L/(24*E*I)*a
	for _, qe := range cs.Envelope().Quantities {
		if qe.Quantity != QDeflection {
			continue
		}
		for _, g := range []struct {
			got     Governing
			want, x float64
		}{{qe.Max, rise, L + a}, {qe.Min, -sag, L / 2}} {
			if !relNear(g.got.Value, g.want, 1e-6) || math.Abs(g.got.X-g.x) > 1e-6 || !slices.Equal(g.got.Loaded, []Share{{Case: 1, Span: 0}}) {
				t.Errorf("deflection %g m at x = %g with %+v loaded, want %g at x = %g with span 1", g.got.Value, g.got.X, g.got.Loaded, g.want, g.x)
			}
		}
	}
}
