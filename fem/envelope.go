package fem

import (
	"fmt"
	"math"
	"slices"
)

// Envelopes. The envelope of a member is, at every x and for every
// quantity, the largest and the smallest value over its combinations (and,
// for the cases placed by span, over every arrangement of loaded spans),
// with the combination that governs each: where combinations tie to
// round-off, the first in the file's order (Supersedes).
//
// Everything is superposition on one structure. A combination is split
// into the loads it always applies (its cases with their factors, and the
// self-weight, temperature and settlements of its cases placed by span) and
// the span shares of its cases placed by span (Model.SpanLoads), each of
// which an arrangement switches on or off. Both kinds are load sets solved
// on the one factorization; the loads always on are the combined load of
// the cases (CombineLoads), which by superposition has the combination of
// the cases' results as its result (the tests check the two agree) and
// costs one substitution per combination instead of one per case.
//
// Pattern loading needs no list of arrangements: at each x, share j adds
// f·s_j(x) when loaded, so the worst arrangement there loads exactly the
// spans whose share pushes the value the worst way,
//
//	max = a(x) + Σ_j max(0, f·s_j(x)),   min = a(x) + Σ_j min(0, f·s_j(x)),
//
// with a the loads always on. That is the maximum over all 2^spans on/off
// arrangements exactly, with no cap on the number of spans. Inside an
// element every s_j is a polynomial, so the envelope is a polynomial
// between the roots of the s_j, and its extremes come in closed form from
// the pieces' ends and the roots of their derivatives.

// Share is the part of a case placed by span that lies on one span.
type Share struct {
	Case int // index into Model.Cases
	Span int // index into Model.Spans()
}

// EnvelopeCombinations are the combinations an envelope is taken over: the
// model's own; each case alone with factor 1 when it has cases but no
// combinations; and one combination "loads" of its own loads when it has
// no cases.
func (m *Model) EnvelopeCombinations() []Combination {
	if len(m.Combinations) > 0 {
		return m.Combinations
	}
	out := make([]Combination, m.LoadSetCount())
	for k := range out {
		out[k] = Combination{Name: m.LoadSetName(k), Kind: OtherCombination, Factors: []CaseFactor{{Case: k, Factor: 1}}}
	}
	return out
}

// CombineLoads is Σ factors[i]·sets[i] for load sets gathered on the same
// key points: line loads, point loads (listed one by one, scaled),
// temperature changes and differences, and settlements.
func CombineLoads(sets []Loads, factors []float64) (Loads, error) {
	if len(sets) == 0 || len(sets) != len(factors) {
		return Loads{}, fmt.Errorf("fem: %d load sets for %d factors: give one factor per load set", len(sets), len(factors))
	}
	first := &sets[0]
	out := Loads{
		Keys:       first.Keys,
		Axial:      make([][2]float64, len(first.Axial)),
		Transverse: make([][2]float64, len(first.Transverse)),
		Settlement: make([][3]float64, len(first.Settlement)),
	}
	for k := range sets {
		l, f := &sets[k], factors[k]
		if len(l.Axial) != len(out.Axial) || len(l.Settlement) != len(out.Settlement) {
			return Loads{}, fmt.Errorf("fem: load set %d was gathered for another member: gather every set on the same key points", k+1)
		}
		if f == 0 {
			continue
		}
		for j := range l.Axial {
			for e := range 2 {
				out.Axial[j][e] += f * l.Axial[j][e]
				out.Transverse[j][e] += f * l.Transverse[j][e]
			}
		}
		for _, p := range l.Points {
			out.Points = append(out.Points, PointLoad{X: p.X, Axial: f * p.Axial, Transverse: f * p.Transverse, Moment: f * p.Moment})
		}
		out.TemperatureChange += f * l.TemperatureChange
		if l.TemperatureDifference != nil {
			if out.TemperatureDifference == nil {
				out.TemperatureDifference = make([]float64, len(l.TemperatureDifference))
			}
			for i, dt := range l.TemperatureDifference {
				out.TemperatureDifference[i] += f * dt
			}
		}
		for i, s := range l.Settlement {
			for d := range s {
				out.Settlement[i][d] += f * s[d]
			}
		}
	}
	return out, nil
}

// CombinationLoads are the load sets of a member's envelope.
type CombinationLoads struct {
	Combinations []Combination // as EnvelopeCombinations gives them
	Spans        [][2]float64  // Model.Spans
	// Fixed holds, per combination, the loads it always applies.
	Fixed []Loads
	// Shares are the span shares that some combination switches, each with
	// its loads at factor 1 in ShareLoads.
	Shares     []Share
	ShareLoads []Loads
	// Factors[c][j] is combination c's factor on share j, 0 when it does
	// not take that share's case.
	Factors [][]float64
}

// CombinationLoads gathers the load sets of the member's envelope on its
// key points.
func (p *Member) CombinationLoads() (*CombinationLoads, error) {
	m := &p.model
	cl := &CombinationLoads{Combinations: m.EnvelopeCombinations(), Spans: m.Spans()}
	// The cases placed by span: their loads always on (the rest of the
	// case) and their shares.
	rest := map[int]Loads{}
	share := map[Share]int{}
	for k, lc := range m.Cases {
		if !lc.BySpan {
			continue
		}
		r := m.LoadSet(k)
		r.PointLoads, r.DistributedLoad = nil, nil
		rest[k] = GatherLoads(&r, p.keys)
		for j, s := range m.SpanLoads(k) {
			if len(s.PointLoads) == 0 && len(s.DistributedLoad) == 0 {
				continue
			}
			share[Share{k, j}] = len(cl.Shares)
			cl.Shares = append(cl.Shares, Share{k, j})
			cl.ShareLoads = append(cl.ShareLoads, GatherLoads(&s, p.keys))
		}
	}
	for _, cb := range cl.Combinations {
		sets := make([]Loads, 0, len(cb.Factors))
		factors := make([]float64, 0, len(cb.Factors))
		row := make([]float64, len(cl.Shares))
		for _, cf := range cb.Factors {
			if r, ok := rest[cf.Case]; ok {
				sets = append(sets, r)
				for j, s := range cl.Shares {
					if s.Case == cf.Case {
						row[j] = cf.Factor
					}
				}
			} else {
				sets = append(sets, p.loadSets[cf.Case])
			}
			factors = append(factors, cf.Factor)
		}
		fixed, err := CombineLoads(sets, factors)
		if err != nil {
			return nil, fmt.Errorf("combination %q: %w", cb.Name, err)
		}
		cl.Fixed = append(cl.Fixed, fixed)
		cl.Factors = append(cl.Factors, row)
	}
	return cl, nil
}

// CombinationSolutions are the load sets of CombinationLoads solved on one
// structure: the finite element solutions, and the exact ones once
// SolveExact has run.
type CombinationSolutions struct {
	Loads                   *CombinationLoads
	Fixed, Shares           []*Solution
	FixedExact, SharesExact []*Exact
	// structure and exactStructure solved them: a combination with every
	// span loaded is solved on them from its combined loads (Solution,
	// Exact).
	structure      *Structure
	exactStructure *ExactStructure
	// floors are forceFloor of each of Shares, worked out with them
	// (SolveCombinations), which their round-off is judged against
	// (shareTolerance).
	floors []floorSizes
}

// shareFloors are forceFloor of each of cs.Shares: those worked out with
// them, or worked out now where cs was made otherwise.
func (cs *CombinationSolutions) shareFloors() []floorSizes {
	if cs.floors == nil {
		return shareFloors(cs.Shares)
	}
	return cs.floors
}

// SolveCombinations solves the member's envelope on mesh with one
// factorization: one substitution per combination and per span share.
func (p *Member) SolveCombinations(mesh Mesh) (*CombinationSolutions, error) {
	cl, err := p.CombinationLoads()
	if err != nil {
		return nil, err
	}
	st, err := p.Structure(mesh)
	if err != nil {
		return nil, err
	}
	cs := &CombinationSolutions{Loads: cl, structure: st}
	if cs.Fixed, err = solveAll(cl.Fixed, st.Solve, p.fixedName(cl)); err == nil {
		cs.Shares, err = solveAll(cl.ShareLoads, st.Solve, p.shareName(cl))
	}
	if err == nil {
		cs.floors = shareFloors(cs.Shares)
	}
	return cs, err
}

// SolveExact adds the exact solutions of every load set, from the member's
// exact structure (one factorization).
func (cs *CombinationSolutions) SolveExact(p *Member) error {
	es, err := p.ExactStructure()
	if err != nil {
		return err
	}
	if cs.FixedExact, err = solveAll(cs.Loads.Fixed, es.Solve, p.fixedName(cs.Loads)); err != nil {
		return err
	}
	cs.exactStructure = es
	cs.SharesExact, err = solveAll(cs.Loads.ShareLoads, es.Solve, p.shareName(cs.Loads))
	return err
}

// solveAll solves every load set of sets, and names set i (name(i)) in the
// error of one that does not solve: a combination's factor or a case's
// loads may make results that overflow or underflow, and a file has many.
func solveAll[S any](sets []Loads, solve func(*Loads) (S, error), name func(int) string) ([]S, error) {
	out := make([]S, len(sets))
	for i := range sets {
		var err error
		if out[i], err = solve(&sets[i]); err != nil {
			return nil, fmt.Errorf("%s: %w", name(i), err)
		}
	}
	return out, nil
}

// fixedName names the loads always on of each combination of cl: a load
// case of a model without combinations, whose envelope takes each case
// alone.
func (p *Member) fixedName(cl *CombinationLoads) func(int) string {
	what := "combination"
	if len(p.model.Combinations) == 0 {
		what = "load case"
	}
	return func(c int) string { return fmt.Sprintf("%s %q", what, cl.Combinations[c].Name) }
}

// shareName names the span shares of cl.
func (p *Member) shareName(cl *CombinationLoads) func(int) string {
	return func(j int) string {
		sh := cl.Shares[j]
		return fmt.Sprintf("load case %q, span %d", p.model.Cases[sh.Case].Name, sh.Span+1)
	}
}

// terms are combination c's solutions with every span loaded and their
// factors: the loads always on, then the shares it takes.
func terms[S any](cs *CombinationSolutions, fixed, shares []S, c int) ([]S, []float64) {
	sols, factors := []S{fixed[c]}, []float64{1}
	for j, f := range cs.Loads.Factors[c] {
		if f != 0 {
			sols, factors = append(sols, shares[j]), append(factors, f)
		}
	}
	return sols, factors
}

// EverySpan is combination c's loads with every span of its cases loaded,
// as they are given, and whether it places a case by span at all (when it
// does not, its loads are cs.Loads.Fixed[c]).
func (cs *CombinationSolutions) EverySpan(c int) (Loads, bool, error) {
	sets, factors := terms(cs, cs.Loads.Fixed, cs.Loads.ShareLoads, c)
	if len(sets) == 1 {
		return sets[0], false, nil
	}
	l, err := CombineLoads(sets, factors)
	return l, true, err
}

// Solution is combination c with every span of its cases loaded, as they
// are given. Its loads are combined first and solved once, as those of a
// combination without a case placed by span are, so that loads that
// cancel leave no round-off of their parts' solutions behind (1 × a load
// − 1 × the same placed by span carries nothing).
func (cs *CombinationSolutions) Solution(c int) (*Solution, error) {
	l, patterned, err := cs.EverySpan(c)
	if err != nil {
		return nil, err
	}
	if !patterned {
		return cs.Fixed[c], nil
	}
	return cs.structure.Solve(&l)
}

// Exact is the exact solution of combination c with every span loaded,
// solved as Solution is; nil before SolveExact.
func (cs *CombinationSolutions) Exact(c int) (*Exact, error) {
	if cs.FixedExact == nil {
		return nil, nil
	}
	l, patterned, err := cs.EverySpan(c)
	if err != nil {
		return nil, err
	}
	if !patterned {
		return cs.FixedExact[c], nil
	}
	return cs.exactStructure.Solve(&l)
}

// Governing is one extreme value of an envelope, where it is, and what
// gives it: the combination and, for its cases placed by span, the span
// shares loaded in the worst arrangement (the others unloaded).
type Governing struct {
	X, Value    float64 // m, SI
	Combination int     // index into CombinationLoads.Combinations
	Loaded      []Share
	// Side is the side of X that Value is read on where the field of the
	// combination and arrangement jumps at X, a key point of the member
	// (the shear force at a support or under a point force, the moment
	// under a couple): Left for the limit just left of X. It is 0 where
	// the field does not jump, and for reactions and foundations.
	Side Side
}

// QuantityEnvelope is the largest and smallest value of one quantity over
// the member and over every combination and arrangement. For the combined
// stress it is the envelope of both extreme fibres: the largest tension
// and the largest compression in either.
type QuantityEnvelope struct {
	Quantity Quantity
	Max, Min Governing
}

// ReactionEnvelope is the largest and smallest value of each component of
// one support's reaction over every combination and arrangement.
type ReactionEnvelope struct {
	Support  int // index into Model.Supports
	X        float64
	Max, Min [3]Governing // axial N, transverse N, moment N·m; X is the support's
}

// FoundationEnvelope is the largest and smallest resultant of the ground's
// forces under one foundation, along and across the member, over every
// combination and arrangement.
type FoundationEnvelope struct {
	Foundation int     // index into Model.Foundations
	Start, End float64 // m
	// Max and Min are along N and across N; their X is the middle of the
	// foundation.
	Max, Min [2]Governing
}

// Envelope is what a walk over the combinations found.
type Envelope struct {
	// Exact says the quantities' envelope is of the exact solutions (after
	// SolveExact, where every stretch of every load set is polynomial); it
	// is of the finite element solutions otherwise (a member on an elastic
	// foundation, or before SolveExact). Reactions are the same in both:
	// the finite element reactions are exact.
	Exact       bool
	Quantities  []QuantityEnvelope // in report order
	Reactions   []ReactionEnvelope
	Foundations []FoundationEnvelope // nil without foundations
}

// envelopeValues are the values an envelope takes of each solution: the
// polynomial quantities, then the stresses of the bottom and the top fibre
// (σa + σb and σa − σb), which are linear in the loads as the combined
// stress is not.
const (
	bottomFibre    = polynomialQuantities
	topFibre       = polynomialQuantities + 1
	envelopeValues = polynomialQuantities + 2
)

// envelopeWalk gathers the envelope element by element.
type envelopeWalk struct {
	cs            *CombinationSolutions
	fixed, shares []Interval
	// exact walks the exact solutions, read through the cursors; else the
	// finite element ones.
	exact             bool
	fixedOn, sharesOn []exactCursor
	degrees           [polynomialQuantities]int
	degree            [envelopeValues]int
	lo, hi            [envelopeValues]envelopePoint
	// size is, per value, the largest magnitude of its extremes so far:
	// a later value ties with an extreme to round-off against it
	// (supersedes), so that of the places where a field is zero (the
	// supports' deflection, an end's moment) the first is named.
	size [envelopeValues]float64
	// The polynomials of one element: the shares', and one combination's
	// shares with its factors.
	sharePoly [][envelopeValues]Polynomial
	// floors are the sizes the shares' round-off is judged against
	// (shareTolerance).
	floors []floorSizes
	parts  []Polynomial
	cuts   []float64
	// patterned says which combinations switch span shares.
	patterned []bool
	// chord, when set, is taken off the deflection of the loads always
	// on (Within).
	chord func(x float64) float64
}

// envelopePoint is an extreme found so far: where (the element, or the
// interval between neighbouring key points of the exact solutions, from
// start to end; ξ and x), its value and its combination.
type envelopePoint struct {
	element     int
	start, end  float64 // m
	xi, x       float64
	value       float64
	combination int
}

func newEnvelopeWalk(cs *CombinationSolutions) *envelopeWalk {
	w := &envelopeWalk{cs: cs, fixed: make([]Interval, len(cs.Fixed)), shares: make([]Interval, len(cs.Shares)),
		sharePoly: make([][envelopeValues]Polynomial, len(cs.Shares)), floors: cs.shareFloors()}
	w.degrees = cs.Fixed[0].degrees()
	if cs.polynomialExact() {
		w.exact = true
		w.degrees = exactDegrees
		w.fixedOn, w.sharesOn = cursors(cs.FixedExact), cursors(cs.SharesExact)
	}
	copy(w.degree[:], w.degrees[:])
	w.degree[bottomFibre] = max(w.degrees[QAxialStress], w.degrees[QBendingStress])
	w.degree[topFibre] = w.degree[bottomFibre]
	for i := range w.lo {
		w.lo[i].value, w.hi[i].value = math.Inf(1), math.Inf(-1)
	}
	for _, row := range cs.Loads.Factors {
		w.patterned = append(w.patterned, slices.ContainsFunc(row, func(f float64) bool { return f != 0 }))
	}
	return w
}

// polynomialExact reports whether every load set has its exact solution
// and each is a polynomial on every stretch.
func (cs *CombinationSolutions) polynomialExact() bool {
	if cs.FixedExact == nil {
		return false
	}
	for _, e := range slices.Concat(cs.FixedExact, cs.SharesExact) {
		for j := range e.stretches {
			if !e.stretches[j].polynomial() {
				return false
			}
		}
	}
	return true
}

// cursors are cursors at the start of each of es.
func cursors(es []*Exact) []exactCursor {
	out := make([]exactCursor, len(es))
	for k, e := range es {
		out[k].exact = e
	}
	return out
}

// endValue is value i at an end f of an interval.
func endValue(f *Fields, i int) float64 {
	switch i {
	case bottomFibre:
		return f.AxialStress + f.BendingStress
	case topFibre:
		return f.AxialStress - f.BendingStress
	}
	return Quantity(i).Of(f)
}

// polynomialOf is value i of interval v as a polynomial in ξ.
func polynomialOf(v *Interval, i int) Polynomial {
	switch i {
	case bottomFibre:
		return combine(1, &v.poly[QAxialStress], 1, &v.poly[QBendingStress])
	case topFibre:
		return combine(1, &v.poly[QAxialStress], -1, &v.poly[QBendingStress])
	}
	return v.poly[i]
}

// visit takes into the envelope element e of the finite element
// solutions, or of the exact ones the interval from start to end (m)
// between neighbouring key points of them all.
func (w *envelopeWalk) visit(e int, start, end float64) {
	for k, s := range w.cs.Fixed {
		if w.exact {
			w.fixedOn[k].interval(start, end, &w.fixed[k])
		} else {
			s.elementInterval(e, &w.fixed[k])
		}
	}
	for k, s := range w.cs.Shares {
		if w.exact {
			w.sharesOn[k].interval(start, end, &w.shares[k])
		} else {
			s.elementInterval(e, &w.shares[k])
		}
		for i := range envelopeValues {
			w.sharePoly[k][i] = polynomialOf(&w.shares[k], i)
		}
	}
	x0, h := w.fixed[0].Start, w.fixed[0].Length
	for c := range w.fixed {
		factors := w.cs.Loads.Factors[c]
		f := &w.fixed[c]
		for i := range envelopeValues {
			d := w.degree[i]
			var off Polynomial // the chord, taken off the deflection
			if w.chord != nil && i == int(QDeflection) {
				off[0] = w.chord(x0)
				off[1] = w.chord(x0+h) - off[0]
			}
			if d <= 1 && !w.patterned[c] {
				// Linear: the element's own end values, start first.
				v0, v1 := endValue(f.End(0), i)-off[0], endValue(f.End(1), i)-off[0]-off[1]
				lo, hi := extremum{0, v0}, extremum{0, v0}
				lo.least(1, v1)
				hi.most(1, v1)
				w.take(i, e, c, lo, hi)
				continue
			}
			a := polynomialOf(f, i)
			a = combine(1, &a, -1, &off)
			w.parts = w.parts[:0]
			for j, f := range factors {
				if f != 0 {
					w.parts = append(w.parts, combine(f, &w.sharePoly[j][i], 0, &a))
				}
			}
			var lo, hi extremum
			if len(w.parts) > 0 {
				lo, hi = w.patternRange(&a, d)
			} else {
				lo, hi = rangeOn(&a, d, endValue(f.End(0), i)-off[0], endValue(f.End(1), i)-off[0]-off[1])
			}
			w.take(i, e, c, lo, hi)
		}
	}
}

// take keeps l and u, the smallest and largest of value i found on
// element e (or the interval of the exact solutions, w.fixed[0]) for
// combination c, where they supersede the extremes so far (supersedes:
// a tie, to round-off against the field's size so far, goes to the
// first combination in the file, then to the first place along the
// member).
func (w *envelopeWalk) take(i, e, c int, l, u extremum) {
	v := &w.fixed[0]
	w.size[i] = max(w.size[i], math.Abs(l.value), math.Abs(u.value))
	if lo := (envelopePoint{e, v.Start, v.X(1), l.xi, v.X(l.xi), l.value, c}); lo.supersedes(&w.lo[i], w.size[i], false) {
		w.lo[i] = lo
	}
	if hi := (envelopePoint{e, v.Start, v.X(1), u.xi, v.X(u.xi), u.value, c}); hi.supersedes(&w.hi[i], w.size[i], true) {
		w.hi[i] = hi
	}
}

// Supersedes reports whether a takes the place of b as the largest value
// of an envelope: a exceeds b by more than a tie (Beyond: extremeTie of
// the smaller, and by more than tolerance, the round-off of the field),
// or the two tie and first says a comes first (its combination before
// b's in the file). Of the smallest, Supersedes(−a, −b, tolerance, first).
//
// So where combinations give one extreme to round-off, which of them is
// named is no accident of round-off: it is the first in the file's order
// (docs/format.md, combinations), in the envelope's quantities, its
// reactions and foundations, the checks the envelope takes from the
// combinations, and the drawing's readout.
func Supersedes(a, b, tolerance float64, first bool) bool {
	switch {
	case Beyond(a, b) && a-b > tolerance:
		return true
	case Beyond(b, a) && b-a > tolerance:
		return false
	}
	return first
}

// supersedes reports whether p takes the place of q as the largest
// (upper) or the smallest value of a field whose largest magnitude is
// size: by Supersedes, a tie going to the first combination in the file,
// then, of one combination's, to the first place along the member.
func (p *envelopePoint) supersedes(q *envelopePoint, size float64, upper bool) bool {
	a, b := p.value, q.value
	if !upper {
		a, b = -a, -b
	}
	return Supersedes(a, b, extremeTie*size, p.combination < q.combination || p.combination == q.combination && p.x < q.x)
}

// patternRange is the smallest and the largest value on [0, 1] of
// a + Σ min(0, g) and a + Σ max(0, g) over the parts g, all of degree d at
// most: on each piece between the parts' roots both are one polynomial.
func (w *envelopeWalk) patternRange(a *Polynomial, d int) (lo, hi extremum) {
	if len(w.parts) == 0 {
		return rangeOn(a, d, a[0], a.at(d, 1))
	}
	w.cuts = append(w.cuts[:0], 0, 1)
	var r [polynomialTerms - 1]float64
	for k := range w.parts {
		w.cuts = append(w.cuts, r[:w.parts[k].roots(&r)]...)
	}
	slices.Sort(w.cuts)
	lo, hi = extremum{0, math.Inf(1)}, extremum{0, math.Inf(-1)}
	for i := 1; i < len(w.cuts); i++ {
		x0, x1 := w.cuts[i-1], w.cuts[i]
		if !(x1 > x0) {
			continue
		}
		mid := (x0 + x1) / 2
		upper, lower := *a, *a
		for k := range w.parts {
			g := &w.parts[k]
			if v := g.at(d, mid); v > 0 {
				upper = combine(1, &upper, 1, g)
			} else if v < 0 {
				lower = combine(1, &lower, 1, g)
			}
		}
		l, _ := rangeBetween(&lower, d, x0, x1)
		_, u := rangeBetween(&upper, d, x0, x1)
		lo.least(l.xi, l.value)
		hi.most(u.xi, u.value)
	}
	return lo, hi
}

// rangeBetween is rangeOn on [a, b] ⊂ [0, 1], roots within endSlack of a
// or b taken as there.
func rangeBetween(p *Polynomial, d int, a, b float64) (lo, hi extremum) {
	va, vb := p.at(d, a), p.at(d, b)
	lo, hi = extremum{a, va}, extremum{a, va}
	lo.least(b, vb)
	hi.most(b, vb)
	if d >= 2 {
		dp := p.Derivative()
		var r [polynomialTerms - 1]float64
		for _, xi := range r[:dp.roots(&r)] {
			if within(xi, a, b) {
				turn(&lo, &hi, xi, p.at(d, xi))
			}
		}
	}
	return lo, hi
}

// join takes later, a walk over elements after w's, into w: a tie goes
// to the first combination, then to w's, the earlier place.
func (w *envelopeWalk) join(later *envelopeWalk) {
	for i := range w.lo {
		size := max(w.size[i], later.size[i])
		if later.lo[i].supersedes(&w.lo[i], size, false) {
			w.lo[i] = later.lo[i]
		}
		if later.hi[i].supersedes(&w.hi[i], size, true) {
			w.hi[i] = later.hi[i]
		}
		w.size[i] = size
	}
}

// Envelope is the envelope of each quantity with its governing combination
// and arrangement, and the reactions' envelope: of the exact solutions when
// they are polynomials (Envelope.Exact), walked between neighbouring key
// points of them all, else of the finite element ones, walked element by
// element once for every combination and span share.
func (cs *CombinationSolutions) Envelope() *Envelope {
	w := newEnvelopeWalk(cs)
	if w.exact {
		// Every exact solution is one polynomial between neighbouring key
		// points of them all: the envelope walks those intervals, not the
		// elements.
		keys := cs.exactKeys()
		for i := 1; i < len(keys); i++ {
			w.visit(i-1, keys[i-1], keys[i])
		}
	} else {
		w.walkElements()
	}
	qs := w.quantities()
	zeroRoundOff(qs, &cs.Fixed[0].Model, slices.Concat(cs.fixedFloors(), cs.shareFloors()))
	cs.readSides(qs, w.exact)
	return &Envelope{Exact: w.exact, Quantities: qs, Reactions: cs.reactionEnvelope(), Foundations: cs.foundationEnvelope()}
}

// readSides sets the Side of each extreme of qs where the field of its
// combination and arrangement jumps (sideOfJump): the side whose limit, in
// the solutions the envelope is of (the exact ones when exact is true), is
// nearer the extreme's value. Whether the field jumps is read from the
// exact solutions where there are any.
func (cs *CombinationSolutions) readSides(qs []QuantityEnvelope, exact bool) {
	keys := cs.Loads.Fixed[0].Keys
	L := cs.Fixed[0].Model.Length()
	judge := cs.FixedExact != nil
	for i := range qs {
		q := &qs[i]
		size := max(math.Abs(q.Max.Value), math.Abs(q.Min.Value))
		for _, g := range [2]*Governing{&q.Max, &q.Min} {
			read := func(exact bool) func(Side) float64 {
				return func(side Side) float64 { return cs.arrangedValue(g, q.Quantity, side, exact, g == &q.Max) }
			}
			g.Side = sideOfJump(keys, L, g.X, g.Value, size, read(judge), read(exact))
		}
	}
}

// arrangedValue is quantity q at g.X, read on side, of g's combination
// with the span shares g loads: of the exact solutions when exact is
// true. Of the combined stress it is the larger of the fibres' (upper)
// or the smaller.
func (cs *CombinationSolutions) arrangedValue(g *Governing, q Quantity, side Side, exact bool, upper bool) float64 {
	at := func(fe *Solution, ex []*Exact, k int) [envelopeValues]float64 {
		var f Fields
		if exact {
			f = ex[k].At(g.X, side)
		} else {
			f = fe.At(g.X, side)
		}
		return sampleValues(&f)
	}
	v := at(cs.Fixed[g.Combination], cs.FixedExact, g.Combination)
	for j, f := range cs.Loads.Factors[g.Combination] {
		if f != 0 && slices.Contains(g.Loaded, cs.Loads.Shares[j]) {
			s := at(cs.Shares[j], cs.SharesExact, j)
			for i := range v {
				v[i] += f * s[i]
			}
		}
	}
	return valueOf(&v, q, upper)
}

// fixedFloors are forceFloor of each of cs.Fixed, with its exact solution
// where there is one.
func (cs *CombinationSolutions) fixedFloors() []floorSizes {
	out := make([]floorSizes, len(cs.Fixed))
	for c, s := range cs.Fixed {
		var e *Exact
		if c < len(cs.FixedExact) {
			e = cs.FixedExact[c]
		}
		out[c] = forceFloor(s, e)
	}
	return out
}

// zeroRoundOff sets to zero the extremes of qs, of a member of model m,
// that are round-off against their field's size (fieldScale, as the
// summary measures it, with the largest of floors, forceFloor of every
// load set, as the floor, a stress's of the segments where it lies): a
// deflection of 3e-18 m beside one of 30 mm is 0.
func zeroRoundOff(qs []QuantityEnvelope, m *Model, floors []floorSizes) {
	var largest [quantityCount]float64
	for _, q := range qs {
		largest[q.Quantity] = max(math.Abs(q.Max.Value), math.Abs(q.Min.Value))
	}
	floor := floorSizes{segments: make([][2]float64, len(m.Segments))}
	for _, f := range floors {
		for k := range 3 {
			floor.all[k], floor.axial[k] = max(floor.all[k], f.all[k]), max(floor.axial[k], f.axial[k])
		}
		for k, sg := range f.segments {
			floor.segments[k] = [2]float64{max(floor.segments[k][0], sg[0]), max(floor.segments[k][1], sg[1])}
		}
	}
	L := m.Length()
	for i := range qs {
		near := floor
		switch qs[i].Quantity {
		case QAxialStress, QBendingStress, QCombinedStress:
			near = floor.stressNear(m, qs[i].Max.X, qs[i].Min.X)
		}
		scale := fieldScale(qs[i].Quantity, &largest, L, near)
		for _, v := range [2]*float64{&qs[i].Max.Value, &qs[i].Min.Value} {
			if math.Abs(*v) <= negligible*scale {
				*v = 0
			}
		}
	}
}

// Within is the envelope of combination c alone over the stretch from
// from to to (m, key points of the member, such as a segment's ends or a
// span's supports): each quantity's largest and smallest value there,
// with the span shares loaded for each (Governing.Loaded). chord, a line
// through (from, chord[0]) and (to, chord[1]), is taken off the
// deflection of the loads the combination always applies, so that a
// deflection check measured from such a line (through the span's ends
// where its supports settle) finds its worst arrangement: the shares'
// deflections are taken as they are.
//
// It walks the shares combination c takes alone, and the key points of
// their exact solutions alone: the checks ask it for every combination,
// and a walk over the shares of every case placed by span (and between
// the key points of them all) made a model of 300 combinations walk each
// share 300 times.
func (cs *CombinationSolutions) Within(c int, from, to float64, chord [2]float64) []QuantityEnvelope {
	floors := cs.shareFloors()
	one := &CombinationSolutions{
		Loads: &CombinationLoads{Combinations: cs.Loads.Combinations[c : c+1], Spans: cs.Loads.Spans,
			Fixed: cs.Loads.Fixed[c : c+1], Factors: [][]float64{nil}},
		Fixed: cs.Fixed[c : c+1], floors: []floorSizes{}}
	if cs.FixedExact != nil {
		one.FixedExact = cs.FixedExact[c : c+1]
	}
	for j, f := range cs.Loads.Factors[c] {
		if f == 0 {
			continue
		}
		l := one.Loads
		l.Shares, l.ShareLoads, l.Factors[0] = append(l.Shares, cs.Loads.Shares[j]), append(l.ShareLoads, cs.Loads.ShareLoads[j]), append(l.Factors[0], f)
		one.Shares, one.floors = append(one.Shares, cs.Shares[j]), append(one.floors, floors[j])
		if cs.FixedExact != nil {
			one.SharesExact = append(one.SharesExact, cs.SharesExact[j])
		}
	}
	w := newEnvelopeWalk(one)
	w.chord = func(x float64) float64 { return chord[0] + (chord[1]-chord[0])*(x-from)/(to-from) }
	tol := mergeTolerance * cs.Fixed[0].Model.Length()
	inside := func(a, b float64) bool { return a >= from-tol && b <= to+tol }
	if w.exact {
		keys := one.exactKeys()
		for i := 1; i < len(keys); i++ {
			if inside(keys[i-1], keys[i]) {
				w.visit(i-1, keys[i-1], keys[i])
			}
		}
	} else {
		for e, el := range cs.Fixed[0].Mesh.Elements {
			if inside(el.Start, el.End) {
				w.visit(e, el.Start, el.End)
			}
		}
	}
	out := w.quantities()
	for i := range out {
		out[i].Max.Combination, out[i].Min.Combination = c, c
	}
	return out
}

// quantities are the envelopes the walk found, in report order.
func (w *envelopeWalk) quantities() []QuantityEnvelope {
	var out []QuantityEnvelope
	for _, q := range Quantities() {
		var lo, hi Governing
		if q == QCombinedStress {
			lo, hi = w.governing(&w.lo[bottomFibre], bottomFibre, false), w.governing(&w.hi[bottomFibre], bottomFibre, true)
			size := max(w.size[bottomFibre], w.size[topFibre])
			if w.lo[topFibre].supersedes(&w.lo[bottomFibre], size, false) {
				lo = w.governing(&w.lo[topFibre], topFibre, false)
			}
			if w.hi[topFibre].supersedes(&w.hi[bottomFibre], size, true) {
				hi = w.governing(&w.hi[topFibre], topFibre, true)
			}
		} else {
			lo, hi = w.governing(&w.lo[q], int(q), false), w.governing(&w.hi[q], int(q), true)
		}
		out = append(out, QuantityEnvelope{Quantity: q, Max: hi, Min: lo})
	}
	return out
}

// walkElements visits every element of the finite element solutions;
// from parallelWalk elements on the second half of the member goes to a
// second goroutine, cut as Walk cuts it.
func (w *envelopeWalk) walkElements() {
	els := w.cs.Fixed[0].Mesh.Elements
	n := len(els)
	visit := func(w *envelopeWalk, from, to int) {
		for e := from; e < to; e++ {
			w.visit(e, els[e].Start, els[e].End)
		}
	}
	if n < parallelWalk {
		visit(w, 0, n)
		return
	}
	later := newEnvelopeWalk(w.cs)
	done := make(chan struct{})
	go func() {
		visit(later, n/2, n)
		close(done)
	}()
	visit(w, 0, n/2)
	<-done
	w.join(later)
}

// exactKeys are the key points of every load set's exact solution, in
// order, with the member's ends.
func (cs *CombinationSolutions) exactKeys() []float64 {
	var keys []float64
	for _, e := range slices.Concat(cs.FixedExact, cs.SharesExact) {
		keys = append(keys, e.keys...)
	}
	slices.Sort(keys)
	return slices.Compact(keys)
}

// governing is the extreme p of value i as a Governing: the spans its
// combination loads there are those whose share pushes value i up (upper)
// or down at p.
func (w *envelopeWalk) governing(p *envelopePoint, i int, upper bool) Governing {
	cs := w.cs
	g := Governing{X: p.x, Value: p.value, Combination: p.combination}
	var iv Interval
	for j, f := range cs.Loads.Factors[p.combination] {
		if f == 0 {
			continue
		}
		if w.exact {
			on := exactCursor{exact: cs.SharesExact[j]}
			on.interval(p.start, p.end, &iv)
		} else {
			cs.Shares[j].elementInterval(p.element, &iv)
		}
		poly := polynomialOf(&iv, i)
		v := f * poly.At(p.xi)
		if math.Abs(v) <= math.Abs(f)*shareTolerance(w.floors[j], &cs.Shares[j].Model, i, p.x) {
			continue // round-off where the share does nothing
		}
		if upper && v > 0 || !upper && v < 0 {
			g.Loaded = append(g.Loaded, cs.Loads.Shares[j])
		}
	}
	return g
}

// shareTolerance is the size below which a share's value i (an index of
// envelopeValues) at x (m) is round-off: negligible against the size of
// the share's own forces (its forceFloor f: its loads, reactions and
// imposed deformations), in the unit of value i; a stress against the
// sections at x (floorSizes.stressNear). m is the share's model.
func shareTolerance(f floorSizes, m *Model, i int, x float64) float64 {
	floor := f.all
	L := m.Length()
	size := f.stressNear(m, x).all[1] // the stresses, and the fibres' after the quantities
	if i < polynomialQuantities {
		switch Quantity(i) {
		case QAxialDisplacement, QDeflection:
			size = floor[2]
		case QRotation:
			size = floor[2] / L
		case QAxialForce, QShearForce:
			size = floor[0]
		case QBendingMoment:
			size = floor[0] * L
		}
	}
	return negligible * size
}

// shareFloors are forceFloor of every share, from its finite element
// solution (the shares' exact ones are found later, if at all).
func shareFloors(shares []*Solution) []floorSizes {
	out := make([]floorSizes, len(shares))
	for j, s := range shares {
		out[j] = forceFloor(s, nil)
	}
	return out
}

// reactionEnvelope is the envelope of every support's reaction. A
// reaction negligible against the size of the forces of every load set
// (loadForces: their loads, reactions and imposed deformations fully
// restrained) is round-off, such as the axial reaction of a member free to
// expand, and reads as zero.
func (cs *CombinationSolutions) reactionEnvelope() []ReactionEnvelope {
	force := cs.forceSize()
	L := cs.Fixed[0].Model.Length()
	out := make([]ReactionEnvelope, len(cs.Fixed[0].Reactions))
	for i, r := range cs.Fixed[0].Reactions {
		re := ReactionEnvelope{Support: r.Support, X: r.X}
		for d := range 3 {
			size := force
			if Dof(d) == Rotation {
				size *= L
			}
			re.Min[d], re.Max[d] = cs.linearEnvelope(r.X, func(s *Solution) float64 { return s.Reactions[i].Force[d] }, Dof(d) == Rotation, size)
			dropRoundOff(size, &re.Min[d], &re.Max[d])
		}
		out[i] = re
	}
	return out
}

// forceSize is the size of the forces of every load set of cs
// (loadForces: their loads, reactions and imposed deformations fully
// restrained), N: a resultant negligible against it is round-off.
func (cs *CombinationSolutions) forceSize() float64 {
	force := 0.0
	for _, s := range slices.Concat(cs.Fixed, cs.Shares) {
		axial, across := loadForces(s)
		force = max(force, axial, across)
	}
	return force
}

// dropRoundOff sets to zero the values of gs negligible against size.
func dropRoundOff(size float64, gs ...*Governing) {
	for _, g := range gs {
		if math.Abs(g.Value) <= negligible*size {
			g.Value = 0
		}
	}
}

// foundationEnvelope is the envelope of what every foundation carries;
// nil without foundations. A resultant negligible against the size of the
// forces of every load set is round-off, such as the ground's force along
// a warmed member that nothing loads along it, and reads as zero.
func (cs *CombinationSolutions) foundationEnvelope() []FoundationEnvelope {
	if len(cs.Fixed[0].Foundations) == 0 {
		return nil
	}
	force := cs.forceSize()
	out := make([]FoundationEnvelope, len(cs.Fixed[0].Foundations))
	for i, r := range cs.Fixed[0].Foundations {
		fe := FoundationEnvelope{Foundation: r.Foundation, Start: r.Start, End: r.End}
		for d := range 2 {
			fe.Min[d], fe.Max[d] = cs.linearEnvelope(0.5*(r.Start+r.End), func(s *Solution) float64 { return s.Foundations[i].Force[d] }, false, force)
			dropRoundOff(force, &fe.Min[d], &fe.Max[d])
		}
		out[i] = fe
	}
	return out
}

// linearEnvelope is the smallest and largest over every combination and
// arrangement of a result that is linear in the loads, read from each
// solution by value, placed at x; size is the size of such results (of
// the forces of every load set), against which values that differ by
// round-off tie, and a tie goes to the first combination (Supersedes).
func (cs *CombinationSolutions) linearEnvelope(x float64, value func(*Solution) float64, moment bool, size float64) (lo, hi Governing) {
	shares := make([]float64, len(cs.Shares))
	tolerances := make([]float64, len(cs.Shares))
	floors := cs.shareFloors()
	for j, sh := range cs.Shares {
		shares[j] = value(sh)
		q := QShearForce
		if moment {
			q = QBendingMoment
		}
		tolerances[j] = shareTolerance(floors[j], &sh.Model, int(q), x)
	}
	tie := extremeTie * size
	for c, s := range cs.Fixed {
		l, h := cs.worst(c, value(s), shares, tolerances)
		if c == 0 || Supersedes(-l.Value, -lo.Value, tie, false) {
			lo = l
		}
		if c == 0 || Supersedes(h.Value, hi.Value, tie, false) {
			hi = h
		}
	}
	lo.X, hi.X = x, x
	return lo, hi
}

// worst is the smallest and largest value of combination c at one place,
// where its loads always on give a and the shares give shares (at factor
// 1), with the spans loaded for each. A share whose value is within its
// tolerance (shareTolerance) of zero does nothing there: its round-off
// loads no span.
func (cs *CombinationSolutions) worst(c int, a float64, shares, tolerances []float64) (lo, hi Governing) {
	lo, hi = Governing{Value: a, Combination: c}, Governing{Value: a, Combination: c}
	for j, f := range cs.Loads.Factors[c] {
		if math.Abs(shares[j]) <= tolerances[j] {
			continue
		}
		switch v := f * shares[j]; {
		case v > 0:
			hi.Value += v
			hi.Loaded = append(hi.Loaded, cs.Loads.Shares[j])
		case v < 0:
			lo.Value += v
			lo.Loaded = append(lo.Loaded, cs.Loads.Shares[j])
		}
	}
	return lo, hi
}

// Arranged is combination c's smallest and largest value of each of qs
// (polynomial quantities) at x, read on side where a field jumps, over the
// arrangements of its cases placed by span, from the exact solutions
// (SolveExact), with the spans loaded for each: what a moving load train
// taken with the combination adds to, point by point, for the worst of
// both (every span loaded can fall short of it).
func (cs *CombinationSolutions) Arranged(c int, qs []Quantity, x float64, side Side) (lo, hi []Governing) {
	n := len(cs.SharesExact)
	shares := make([]Fields, n)
	for j, e := range cs.SharesExact {
		shares[j] = e.At(x, side)
	}
	fixed := cs.FixedExact[c].At(x, side)
	floors := cs.shareFloors()
	column, tolerance := make([]float64, n), make([]float64, n)
	lo, hi = make([]Governing, len(qs)), make([]Governing, len(qs))
	for k, q := range qs {
		for j := range shares {
			column[j], tolerance[j] = q.Of(&shares[j]), shareTolerance(floors[j], &cs.Shares[j].Model, int(q), x)
		}
		lo[k], hi[k] = cs.worst(c, q.Of(&fixed), column, tolerance)
		lo[k].X, hi[k].X = x, x
	}
	return lo, hi
}

// ArrangedReaction is combination c's smallest and largest reaction of
// support i (an index into Model.Supports) in motion d over the
// arrangements of its cases placed by span, from the exact solutions, with
// the spans loaded for each.
func (cs *CombinationSolutions) ArrangedReaction(c, i int, d Dof) (lo, hi Governing) {
	q := QShearForce
	if d == Rotation {
		q = QBendingMoment
	}
	shares, tolerances := make([]float64, len(cs.SharesExact)), make([]float64, len(cs.SharesExact))
	floors := cs.shareFloors()
	x := cs.Fixed[0].Model.Supports[i].X
	for j, e := range cs.SharesExact {
		shares[j], tolerances[j] = e.reactions[i].Force[d], shareTolerance(floors[j], &cs.Shares[j].Model, int(q), x)
	}
	lo, hi = cs.worst(c, cs.FixedExact[c].reactions[i].Force[d], shares, tolerances)
	lo.X, hi.X = x, x
	return lo, hi
}

// EnvelopeSample is the envelope at one x: every quantity's smallest and
// largest value over the combinations and arrangements (the combined
// stress over both fibres), and the combination governing each.
type EnvelopeSample struct {
	Lo, Hi     Fields
	LoBy, HiBy [quantityCount]int // indices into CombinationLoads.Combinations
}

// At samples the envelope of the finite element solutions at x, on side
// of a point where fields jump, or of the exact solutions when exact is
// true (which needs SolveExact).
func (cs *CombinationSolutions) At(x float64, side Side, exact bool) EnvelopeSample {
	at := func(k int, share bool) Fields {
		switch {
		case exact && share:
			return cs.SharesExact[k].At(x, side)
		case exact:
			return cs.FixedExact[k].At(x, side)
		case share:
			return cs.Shares[k].At(x, side)
		}
		return cs.Fixed[k].At(x, side)
	}
	shares := make([][envelopeValues]float64, len(cs.Shares))
	tolerances := make([][envelopeValues]float64, len(cs.Shares))
	floors := cs.shareFloors()
	for j := range shares {
		f := at(j, true)
		shares[j] = sampleValues(&f)
		for i := range envelopeValues {
			tolerances[j][i] = shareTolerance(floors[j], &cs.Shares[j].Model, i, x)
		}
	}
	var lo, hi [envelopeValues]float64
	var loBy, hiBy [envelopeValues]int
	column := make([]float64, len(cs.Shares))
	tolerance := make([]float64, len(cs.Shares))
	for c := range cs.Fixed {
		f := at(c, false)
		a := sampleValues(&f)
		for i := range envelopeValues {
			for j := range shares {
				column[j], tolerance[j] = shares[j][i], tolerances[j][i]
			}
			l, h := cs.worst(c, a[i], column, tolerance)
			if c == 0 || Supersedes(-l.Value, -lo[i], 0, false) {
				lo[i], loBy[i] = l.Value, c
			}
			if c == 0 || Supersedes(h.Value, hi[i], 0, false) {
				hi[i], hiBy[i] = h.Value, c
			}
		}
	}
	var s EnvelopeSample
	s.Lo, s.Hi = sampleFields(x, &lo), sampleFields(x, &hi)
	copy(s.LoBy[:], loBy[:polynomialQuantities])
	copy(s.HiBy[:], hiBy[:polynomialQuantities])
	s.Lo.CombinedStress, s.LoBy[QCombinedStress] = lo[bottomFibre], loBy[bottomFibre]
	if Supersedes(-lo[topFibre], -lo[bottomFibre], 0, loBy[topFibre] < loBy[bottomFibre]) {
		s.Lo.CombinedStress, s.LoBy[QCombinedStress] = lo[topFibre], loBy[topFibre]
	}
	s.Hi.CombinedStress, s.HiBy[QCombinedStress] = hi[bottomFibre], hiBy[bottomFibre]
	if Supersedes(hi[topFibre], hi[bottomFibre], 0, hiBy[topFibre] < hiBy[bottomFibre]) {
		s.Hi.CombinedStress, s.HiBy[QCombinedStress] = hi[topFibre], hiBy[topFibre]
	}
	return s
}

// sampleValues are the envelope's values of f.
func sampleValues(f *Fields) [envelopeValues]float64 {
	v := f.values()
	var out [envelopeValues]float64
	copy(out[:], v[:polynomialQuantities])
	out[bottomFibre] = f.AxialStress + f.BendingStress
	out[topFibre] = f.AxialStress - f.BendingStress
	return out
}

// sampleFields are fields at x with the polynomial quantities of v.
func sampleFields(x float64, v *[envelopeValues]float64) Fields {
	return Fields{X: x, AxialDisplacement: v[QAxialDisplacement], Deflection: v[QDeflection], Rotation: v[QRotation],
		AxialForce: v[QAxialForce], ShearForce: v[QShearForce], BendingMoment: v[QBendingMoment],
		AxialStress: v[QAxialStress], BendingStress: v[QBendingStress]}
}
