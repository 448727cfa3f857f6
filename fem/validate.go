package fem

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"stave/fem/units"
)

// Problem is one thing wrong with a model: where it lies, and a sentence for
// the user that numbers items from 1.
type Problem struct {
	Place
	Message string
}

// ValidationError lists every problem found in a model.
type ValidationError struct {
	Problems []Problem
}

func (e *ValidationError) Error() string {
	if len(e.Problems) == 1 {
		return e.Problems[0].Message
	}
	var b strings.Builder
	fmt.Fprintf(&b, "the model has %d problems:", len(e.Problems))
	for _, p := range e.Problems {
		b.WriteString("\n- ")
		b.WriteString(p.Message)
	}
	return b.String()
}

// MaxPatternSpans is the most spans a load case placed by span may cover:
// the checks solve and check whole each arrangement of loaded spans they
// try, for every span's check, work that grows with the cube of the spans
// (30 spans on the automatic mesh took 1.4 s for `stave solve`, 50 took
// 5.6 s, 200 more than 60 s).
const MaxPatternSpans = 30

// MaxTrainEntries is the most times the combinations may take moving load
// trains, counted over all of them: each train in each combination is an
// envelope of its own, worked out over every station and position with the
// combination's cases beside it (80 trains in each of 80 combinations of
// a 10 m span took 11 s and 1.3 GB; 10 in each of 10 over 30 spans with a
// case placed by span 31 s and 0.7 GB).
const MaxTrainEntries = 100

// Memory. Validate refuses a model whose analysis would need more than
// memoryLimit. The estimate counts what every stage allocates per element
// and per key point, measured by TestMemoryPerStage as the growth of
// runtime.MemStats.TotalAlloc from one model size to the next, times
// memoryHeadroom: Go's collector lets the heap grow to twice the live data
// (GOGC=100), and the application keeps the previous analysis while it
// solves the next.
const (
	memoryLimit    = 4 << 30 // bytes for the analysis of one model
	memoryHeadroom = 4

	// Per element, all stages: Solve, SolveExact, Summarize and Compare
	// allocated 96 B (the mesh, displacements and element results; from 10⁵
	// to 2·10⁵ elements, both bar orders). check.Run, outside this package,
	// allocated nothing per element when measured by hand.
	stagesBytesPerElement = 100
	// A model with load cases keeps more per element (TestMemoryPerLoadSet
	// in package analysis measures analysis.Run from 50,000 to 100,000
	// elements): each combination of the envelope beyond the first and
	// each span share of a case placed by span is a load set solved and
	// kept (56 B), and each combination that takes a case placed by span
	// solves arrangements of loaded spans for its checks (224 to 280 B with
	// its own set, 2 to 8 spans). The report summarises each case alone
	// (`stave solve` grew by 38 B of resident memory per element per case,
	// 200,000 elements, 5 December). Before, only the cases were counted,
	// each as one set: one case in eight combinations was counted as one.
	setBytesPerElement     = 60
	patternBytesPerElement = 230
	caseBytesPerElement    = 40
	// Per key point, with one element per stretch: Solve allocated at most
	// 2,454 B (key points from 1,000 to 2,000, made of segment breaks,
	// supports, point loads or load points; most for supports, whose
	// validation sorts their places; 2,620 B under the race detector,
	// 4 December), Summarize with the exact
	// solution at most 1,180 B (from 125 to 250 key points; most for
	// supports; 4 December, evening), and the banded
	// exact solution at most 2,952 B (from 1,000 to 2,000; most for supports,
	// whose reactions add unknowns). TestMemoryPerStage measures all three.
	solveBytesPerKeyPoint   = 3000
	summaryBytesPerKeyPoint = 1200
	exactBytesPerKeyPoint   = 4000

	bytesPerKeyPoint = memoryHeadroom * (solveBytesPerKeyPoint + summaryBytesPerKeyPoint + exactBytesPerKeyPoint)
)

// Stiffness range. The solvers factorize matrices of element stiffnesses
// (EA/h, 12·EI/h³, … for an element of length h) and spring stiffnesses,
// and divide loads by them. The band kernels keep their answers over scales
// of 1e±300 (TestBandLDLScaleInvariance), but a stiffness that underflows to
// zero or to a subnormal number makes the matrix singular or inexact, and
// one near overflow leaves no room for the loads and fields computed from
// it. So every segment's EA/ℓ and EI/ℓ³ (ℓ its length) and every spring
// stiffness must lie within 1e±150: an element lies within its segment, so
// its EA/h and EI/h³ are never smaller; stretches down to the merge
// tolerance (1e-12·L) make them at most 1e36 times larger. That leaves at
// least 120 decades to either end of float64's normal range (2.2e-308 to
// 1.8e308) for the arithmetic on them.
const (
	minStiffness = 1e-150
	maxStiffness = 1e150
)

// mergeTolerance is the distance, relative to L, below which key points are one node.
const mergeTolerance = 1e-12

var (
	modelItem = Item{Kind: ModelItem, Index: -1}
	meshItem  = Item{Kind: MeshItem, Index: -1}
)

// Validate checks the model and returns nil or a *ValidationError listing
// all problems, their values in SI base units (m, N, Pa...), as a file
// holds them.
func (m *Model) Validate() error { return m.ValidateIn(units.Base) }

// ValidateIn is Validate with the messages quoting values in the display
// units of u, those a window shows and its user types; units of no name
// (the zero System) are SI base units, as Validate's.
func (m *Model) ValidateIn(u units.System) error {
	v := validator{u: messageUnits(u)}
	if m == nil {
		v.add(Place{Item: modelItem}, "there is no model")
		return v.err()
	}
	if len(m.Segments) == 0 {
		v.add(Place{Item: modelItem, Property: SegmentsProperty}, "the member has no segments: add at least one segment")
		return v.err()
	}
	L := m.Length()
	v.L = L
	v.tol = mergeTolerance * math.Abs(L)
	v.modelHinges = m.Hinges
	v.segments(m.Segments)
	lengthKnown := isFinite(L) && L > 0
	v.supports(m.Supports, lengthKnown)
	v.hinges(m, lengthKnown)
	v.foundations(m, lengthKnown)
	v.pointLoads(m.PointLoads, lengthKnown)
	v.distributedLoads(m.DistributedLoad, lengthKnown)
	for i, g := range m.Gravity {
		if !isFinite(g) {
			v.add(Place{Item: modelItem, Property: GravityProperty, Dof: Dof(i)}, fmt.Sprintf("the gravity component %d is %v: enter a finite value in %s", i+1, g, v.unit(units.Acceleration)))
		}
	}
	if !isFinite(m.TemperatureChange) {
		v.add(Place{Item: modelItem, Property: TemperatureChangeProperty}, fmt.Sprintf("the temperature change is %v: enter a finite value in %s", m.TemperatureChange, v.unit(units.TemperatureChange)))
	}
	v.cases(m, lengthKnown)
	if m.AxialOnly {
		v.axialOnly(m)
	}
	v.mesh(m, lengthKnown)
	return v.err()
}

// axialOnly refuses what would bend a member declared to carry axial force
// only.
func (v *validator) axialOnly(m *Model) {
	v.axialOnlyLoads(m.PointLoads, m.DistributedLoad)
	for i, s := range m.Segments {
		if s.TemperatureDifference != 0 {
			v.add(Place{Item: Item{Kind: SegmentItem, Index: i}, Property: TemperatureDifferenceProperty}, fmt.Sprintf("segment %d is warmer on one face than the other, which bends it, but %s: remove the temperature difference, or let the member bend", i+1, axialOnlyWhy))
		}
	}
	if m.Gravity[1] != 0 {
		for _, s := range m.Segments {
			if s.Material.Density > 0 {
				v.add(Place{Item: modelItem, Property: GravityProperty, Dof: Transverse}, fmt.Sprintf("self-weight acts across the member (gravity %s across it), but %s: turn the member along gravity, or let it bend", v.num(units.Acceleration, m.Gravity[1]), axialOnlyWhy))
				break
			}
		}
	}
	for i, s := range m.Supports {
		for _, c := range []struct {
			d     Dof
			moves string
		}{{Transverse, "settles across the member"}, {Rotation, "turns by a settlement"}} {
			if s.Kind.Restrains(c.d) && s.Settlement[c.d] != 0 {
				v.add(Place{Item: Item{Kind: SupportItem, Index: i}, Property: SettlementProperty, Dof: c.d}, fmt.Sprintf("support %d %s, but %s: remove the settlement, or let the member bend", i+1, c.moves, axialOnlyWhy))
			}
		}
	}
}

const axialOnlyWhy = "the member is declared to carry axial force only (a tie or strut)"

// axialOnlyLoads refuses point and distributed loads that would bend an
// axial-only member: a transverse force, a moment, a transverse line load
// not zero everywhere. A zero transverse part carries nothing across, as
// for a member found axial-only without the declaration (bendsMember).
func (v *validator) axialOnlyLoads(points []PointLoad, lines []DistributedLoad) {
	const why = axialOnlyWhy
	for i, p := range points {
		it := Item{Kind: PointLoadItem, Index: i, Case: v.loadCase}
		if p.Transverse != 0 {
			v.add(Place{Item: it, Property: TransverseForceProperty}, fmt.Sprintf("point load %d pushes across the member, but %s: remove its transverse force, or let the member bend", i+1, why))
		}
		if p.Moment != 0 {
			v.add(Place{Item: it, Property: MomentProperty}, fmt.Sprintf("point load %d has a moment, but %s: remove the moment, or let the member bend", i+1, why))
		}
	}
	for i, d := range lines {
		if d.Direction == Transverse && slices.ContainsFunc(d.Points, func(p LoadPoint) bool { return p.Intensity != 0 }) {
			v.add(Place{Item: Item{Kind: DistributedLoadItem, Index: i, Case: v.loadCase}, Property: DirectionProperty}, fmt.Sprintf("distributed load %d acts across the member, but %s: make it axial, or let the member bend", i+1, why))
		}
	}
}

type validator struct {
	u           units.System // the units the messages quote values in
	problems    []Problem
	L, tol      float64
	modelHinges []Hinge // for the point loads: a moment at a hinge is refused
	// loadCase is the case whose loads are being checked (Item.Case), and
	// prefix opens their messages with the case's name.
	loadCase int
	prefix   string
}

func (v *validator) add(at Place, msg string) {
	v.problems = append(v.problems, Problem{Place: at, Message: v.prefix + msg})
}

// cases checks the load cases and combinations of m: names, the loads of
// each case (as the model's own are checked, each message opening with the
// case), and the factors.
func (v *validator) cases(m *Model, lengthKnown bool) {
	if len(m.Cases) > 0 {
		const move = "the model has load cases, so every load belongs to one: move this load into a case"
		for i := range m.PointLoads {
			v.add(Place{Item: Item{Kind: PointLoadItem, Index: i}}, fmt.Sprintf("point load %d is outside the load cases; %s", i+1, move))
		}
		for i := range m.DistributedLoad {
			v.add(Place{Item: Item{Kind: DistributedLoadItem, Index: i}}, fmt.Sprintf("distributed load %d is outside the load cases; %s", i+1, move))
		}
		if m.TemperatureChange != 0 {
			v.add(Place{Item: modelItem, Property: TemperatureChangeProperty}, "the temperature change is outside the load cases; the model has load cases, so give it to one of them")
		}
		takenBy := slices.IndexFunc(m.Cases, func(lc LoadCase) bool { return lc.ThermalGradient })
		for i, sg := range m.Segments {
			if sg.TemperatureDifference != 0 && takenBy < 0 {
				v.add(Place{Item: Item{Kind: SegmentItem, Index: i}, Property: TemperatureDifferenceProperty}, fmt.Sprintf("segment %d is warmer on one face than the other, but no load case takes the temperature differences, so they would act in none: mark the case they belong to, or remove the temperature difference", i+1))
			}
		}
	} else if len(m.Combinations) > 0 {
		v.add(Place{Item: Item{Kind: CombinationItem, Index: 0}}, "there are combinations but no load cases to combine: add load cases, or delete the combinations")
	}
	names := map[string]int{}
	spans := 0 // the member's spans, counted for the first case placed by span
	for c, lc := range m.Cases {
		it := Item{Kind: CaseItem, Index: c}
		switch prev, seen := names[strings.ToLower(lc.Name)]; {
		case strings.TrimSpace(lc.Name) == "":
			v.add(Place{Item: it, Property: NameProperty}, fmt.Sprintf("load case %d has no name: name it (permanent, imposed, snow...)", c+1))
		case seen:
			v.add(Place{Item: it, Property: NameProperty}, fmt.Sprintf("load cases %d and %d %s: give each case its own name", prev+1, c+1, namedAlike(m.Cases[prev].Name, lc.Name)))
		default:
			names[strings.ToLower(lc.Name)] = c
		}
		if len(lc.PointLoads) == 0 && len(lc.DistributedLoad) == 0 && !lc.SelfWeight && lc.TemperatureChange == 0 && !lc.Settlements && !lc.ThermalGradient {
			v.add(Place{Item: it}, fmt.Sprintf("load case %q is empty: add loads to it, or delete it", lc.Name))
		}
		if lc.BySpan && lengthKnown {
			if spans == 0 {
				spans = len(m.Spans())
			}
			if spans > MaxPatternSpans {
				v.add(Place{Item: it}, fmt.Sprintf("load case %q is placed by span over %d spans, more than the %d Stave arranges (each arrangement of loaded spans is solved and checked whole, so the work grows with the cube of the spans): place it on every span (turn by span off), or check the member in parts", lc.Name, spans, MaxPatternSpans))
			}
		}
		if !isFinite(lc.TemperatureChange) {
			v.add(Place{Item: it, Property: TemperatureChangeProperty}, fmt.Sprintf("load case %q: the temperature change is %v: enter a finite value in %s", lc.Name, lc.TemperatureChange, v.unit(units.TemperatureChange)))
		}
		v.loadCase, v.prefix = c+1, fmt.Sprintf("load case %q: ", lc.Name)
		v.pointLoads(lc.PointLoads, lengthKnown)
		v.distributedLoads(lc.DistributedLoad, lengthKnown)
		if m.AxialOnly {
			v.axialOnlyLoads(lc.PointLoads, lc.DistributedLoad)
		}
		v.loadCase, v.prefix = 0, ""
	}
	combos := map[string]int{}
	v.trainEntries(m.Combinations)
	for k, cb := range m.Combinations {
		it := Item{Kind: CombinationItem, Index: k}
		switch prev, seen := combos[strings.ToLower(cb.Name)]; {
		case strings.TrimSpace(cb.Name) == "":
			v.add(Place{Item: it, Property: NameProperty}, fmt.Sprintf("combination %d has no name: name it", k+1))
		case seen:
			v.add(Place{Item: it, Property: NameProperty}, fmt.Sprintf("combinations %d and %d %s: give each its own name", prev+1, k+1, namedAlike(m.Combinations[prev].Name, cb.Name)))
		default:
			combos[strings.ToLower(cb.Name)] = k
		}
		if cb.Kind < Strength || cb.Kind > OtherCombination {
			v.add(Place{Item: it, Property: CombinationKindProperty}, fmt.Sprintf("combination %q has an unknown kind (%d): choose strength, serviceability or other", cb.Name, int(cb.Kind)))
		}
		if len(cb.Factors) == 0 {
			v.add(Place{Item: it, Property: FactorsProperty}, fmt.Sprintf("combination %q combines no load cases: give it at least one case and factor", cb.Name))
		}
		used := map[int]bool{}
		for f, cf := range cb.Factors {
			switch {
			case cf.Case < 0 || cf.Case >= len(m.Cases):
				v.add(Place{Item: it, Property: FactorCaseProperty, Vertex: f}, fmt.Sprintf("combination %q, factor %d names load case %d, but there are %d: choose one of the cases", cb.Name, f+1, cf.Case+1, len(m.Cases)))
			case used[cf.Case]:
				v.add(Place{Item: it, Property: FactorCaseProperty, Vertex: f}, fmt.Sprintf("combination %q takes load case %q twice: give each case one factor", cb.Name, m.Cases[cf.Case].Name))
			}
			used[cf.Case] = true
			v.factor(Place{Item: it, Property: FactorProperty, Vertex: f}, fmt.Sprintf("combination %q, factor %d", cb.Name, f+1), cf.Factor)
		}
		for _, tf := range cb.Trains {
			v.factor(Place{Item: it, Property: FactorsProperty}, fmt.Sprintf("combination %q, the factor on moving load train %d", cb.Name, tf.Train+1), tf.Factor)
		}
		if len(cb.Factors) > 0 && appliesNothing(cb) {
			v.add(Place{Item: it, Property: FactorsProperty}, fmt.Sprintf("combination %q applies no load: every factor is 0 (its envelope would be zero everywhere and govern nothing): give a case a factor other than 0, or delete the combination", cb.Name))
		}
	}
}

// MaxFactor is the largest factor, in size, a combination takes on a load
// case or a moving load train. Results grow with the factor and the strain
// energy with its square, which overflows float64 (1.8e308) past about
// 1e150 times the energy of ordinary loads: a case factor of 1e300 was
// refused by the solve, while a train's was taken and gave deflections of
// 1e300 mm. Factors in codes are a few units.
const MaxFactor = 1e150

// factor checks one factor of a combination, what naming it: finite and
// at most MaxFactor in size.
func (v *validator) factor(at Place, what string, f float64) {
	switch {
	case !isFinite(f):
		v.add(at, fmt.Sprintf("%s is %v: enter a finite number", what, f))
	case math.Abs(f) > MaxFactor:
		v.add(at, fmt.Sprintf("%s is %s, larger in size than the %s Stave takes (results grow with the factor, and their squares would overflow floating point): enter the factor your local code gives", what, fmtNumber(f), fmtNumber(MaxFactor)))
	}
}

// namedAlike says that two items are named a and b, names that differ at
// most in letter case, which does not tell names apart: "are both named
// "snow"", or, where the letters' case differs, both names and why they
// count as one.
func namedAlike(a, b string) string {
	if a == b {
		return fmt.Sprintf("are both named %q", b)
	}
	return fmt.Sprintf("are named %q and %q, one name to Stave (it does not tell capitals from small letters)", a, b)
}

// appliesNothing says every factor of cb, on its cases and its trains, is 0.
func appliesNothing(cb Combination) bool {
	for _, cf := range cb.Factors {
		if cf.Factor != 0 {
			return false
		}
	}
	for _, tf := range cb.Trains {
		if tf.Factor != 0 {
			return false
		}
	}
	return true
}

// trainEntries refuses combinations that take moving load trains more than
// MaxTrainEntries times in all, at the combination that passes the limit.
func (v *validator) trainEntries(cbs []Combination) {
	total := 0
	for _, cb := range cbs {
		total += len(cb.Trains)
	}
	if total <= MaxTrainEntries {
		return
	}
	entries := 0
	for k, cb := range cbs {
		if entries += len(cb.Trains); entries > MaxTrainEntries {
			v.add(Place{Item: Item{Kind: CombinationItem, Index: k}, Property: FactorsProperty}, fmt.Sprintf("the combinations take moving load trains %d times in all (%d by combination %q), more than the %d Stave works out: each train in each combination is an envelope of its own; take fewer trains into fewer combinations, or check them in several models", total, entries, cb.Name, MaxTrainEntries))
			return
		}
	}
}

func (v *validator) err() error {
	if len(v.problems) == 0 {
		return nil
	}
	return &ValidationError{Problems: v.problems}
}

// label names an item as users count it, e.g. "support 3".
func label(it Item) string { return fmt.Sprintf("%s %d", it.Kind, it.Index+1) }

// property reports a property of kind k that must be finite and > 0 (or
// >= 0 when zero is allowed), and says whether it is.
func (v *validator) property(at Place, name string, value float64, k units.Kind, zeroAllowed bool) (ok bool) {
	switch {
	case !isFinite(value):
		v.add(at, fmt.Sprintf("%s: %s is %v: enter a finite %s", label(at.Item), name, value, v.valueIn(k)))
	case value < 0 || (value == 0 && !zeroAllowed):
		want := "positive"
		if zeroAllowed {
			want = "zero or positive"
		}
		v.add(at, fmt.Sprintf("%s: %s is %s: it must be %s", label(at.Item), name, v.num(k, value), want))
	default:
		return true
	}
	return false
}

// plain is the kind of a number with no unit (a coefficient).
const plain units.Kind = -1

// unit is the symbol of the unit the messages quote values of kind k in.
func (v *validator) unit(k units.Kind) string { return v.u.Unit(k).Symbol }

// valueIn asks for a value of kind k: "value in m", or "number" for plain.
func (v *validator) valueIn(k units.Kind) string {
	if k == plain {
		return "number"
	}
	return "value in " + v.unit(k)
}

// num prints x, an SI value of kind k, in the messages' units: "3.2 m".
func (v *validator) num(k units.Kind, x float64) string {
	if k == plain {
		return fmtNumber(x)
	}
	return quote(v.u, k, x)
}

// span is the range from a to b, SI values of kind k: "1e-150 to 1e+150 N/m".
func (v *validator) span(k units.Kind, a, b float64) string {
	da, db := fmtPair(v.u.ToDisplay(k, a), v.u.ToDisplay(k, b))
	return da + " to " + db + " " + v.unit(k)
}

// pair is num for two SI values of kind k, with the fewest digits that
// tell them apart (fmtPair).
func (v *validator) pair(k units.Kind, a, b float64) (string, string) { return quotePair(v.u, k, a, b) }

func (v *validator) segments(segs []Segment) {
	for i, s := range segs {
		it := Item{Kind: SegmentItem, Index: i}
		badEnds := false
		for _, e := range []struct {
			property Property
			name     string
			x        float64
		}{{StartProperty, "start", s.Start}, {EndProperty, "end", s.End}} {
			if !isFinite(e.x) {
				v.add(Place{Item: it, Property: e.property}, fmt.Sprintf("segment %d: its %s is %v: enter a finite position in %s", i+1, e.name, e.x, v.unit(units.Position)))
				badEnds = true
			}
		}
		if !badEnds {
			if s.End <= s.Start {
				start, end := v.pair(units.Position, s.Start, s.End)
				v.add(Place{Item: it, Property: EndProperty}, fmt.Sprintf("segment %d runs from x = %s to x = %s: its end must lie beyond its start", i+1, start, end))
			}
			prev := 0.0
			if i > 0 {
				prev = segs[i-1].End
			}
			start := Place{Item: it, Property: StartProperty}
			before, here := v.pair(units.Position, prev, s.Start)
			switch d := s.Start - prev; {
			case i == 0 && math.Abs(d) > v.tol:
				v.add(start, fmt.Sprintf("segment 1 starts at x = %s: the member must start at x = 0", v.num(units.Position, s.Start)))
			case i > 0 && d > v.tol:
				v.add(start, fmt.Sprintf("there is a gap between segment %d (ends at x = %s) and segment %d (starts at x = %s): make them meet", i, before, i+1, here))
			case i > 0 && d < -v.tol:
				v.add(start, fmt.Sprintf("segment %d (starts at x = %s) overlaps segment %d (ends at x = %s): make them meet", i+1, here, i, before))
			}
		}
		at := func(p Property) Place { return Place{Item: it, Property: p} }
		areaOK := v.property(at(AreaProperty), "the area A", s.Section.Area, units.Area, false)
		v.property(at(SecondMomentProperty), "the second moment of area I", s.Section.SecondMoment, units.SecondMoment, false)
		v.property(at(FibreDistanceProperty), "the extreme fibre distance c", s.Section.FibreDistance, units.Dimension, false)
		elasticOK := v.property(at(ElasticProperty), "Young's modulus E", s.Material.Elastic, units.Modulus, false)
		v.property(at(DensityProperty), "the density", s.Material.Density, units.Density, true)
		v.property(at(AllowableProperty), "the allowable stress", s.Material.Allowable, units.Stress, true)
		if a := s.Material.ThermalExpansion; !isFinite(a) {
			v.add(at(ThermalExpansionProperty), fmt.Sprintf("segment %d: the thermal expansion coefficient is %v: enter a finite value in %s", i+1, a, v.unit(units.ThermalExpansion)))
		}
		v.property(at(DepthProperty), "the depth", s.Section.Depth, units.Dimension, true)
		v.shearDeformation(i, s, areaOK, elasticOK)
		switch dt := s.TemperatureDifference; {
		case !isFinite(dt):
			v.add(at(TemperatureDifferenceProperty), fmt.Sprintf("segment %d: the temperature difference through the depth is %v: enter a finite value in %s", i+1, dt, v.unit(units.TemperatureChange)))
		case dt != 0 && !(s.Section.depth() > 0):
			v.add(at(DepthProperty), fmt.Sprintf("segment %d has a temperature difference through its depth but no depth to spread it over: enter the section's depth (or its extreme fibre distance, for a symmetric section)", i+1))
		}
		v.segmentStiffness(it, s)
		v.sectionModulus(it, s)
	}
}

// Section modulus range. Every bending moment is divided by I/c into a
// stress: I/c must lie within 1e±150 m³, as the stiffnesses must (see
// minStiffness), so that c/I neither overflows (a moment of 0 times it is
// then NaN) nor leaves the stresses no room; real members' lie near 1e-9
// to 10 m³.
const (
	minSectionModulus = 1e-150
	maxSectionModulus = 1e150
)

// sectionModulus keeps the segment's I/c within the section modulus range,
// in logarithms so that the check itself cannot overflow.
func (v *validator) sectionModulus(it Item, s Segment) {
	I, c := s.Section.SecondMoment, s.Section.FibreDistance
	if !isFinite(I) || !isFinite(c) || I <= 0 || c <= 0 {
		return // reported above
	}
	if e := log10(I) - log10(c); e < log10(minSectionModulus) || e > log10(maxSectionModulus) {
		v.add(Place{Item: it, Property: FibreDistanceProperty}, fmt.Sprintf("%s: its section modulus I/c is about %s %s (I = %s, c = %s), outside the range the solvers work in (%s): check these values and their units",
			label(it), fmtPowerOfTen(e-log10(v.u.Unit(units.SectionModulus).ToSI)), v.unit(units.SectionModulus), v.num(units.SecondMoment, I), v.num(units.Dimension, c),
			v.span(units.SectionModulus, minSectionModulus, maxSectionModulus)))
	}
}

// segmentStiffness keeps the segment's EA/ℓ and EI/ℓ³ within the stiffness
// range, working in logarithms so that the check itself cannot overflow.
func (v *validator) segmentStiffness(it Item, s Segment) {
	E, A, I, l := s.Material.Elastic, s.Section.Area, s.Section.SecondMoment, s.End-s.Start
	for _, x := range []float64{E, A, I, l} {
		if !isFinite(x) || x <= 0 {
			return // reported above
		}
	}
	for _, k := range []struct {
		name, symbol, factor string
		log10                float64
	}{
		{"axial stiffness", "EA/ℓ", "A = " + v.num(units.Area, A), log10(E) + log10(A) - log10(l)},
		{"bending stiffness", "EI/ℓ³", "I = " + v.num(units.SecondMoment, I), log10(E) + log10(I) - 3*log10(l)},
	} {
		if k.log10 < log10(minStiffness) || k.log10 > log10(maxStiffness) {
			// Both are a force per length, shown as a spring's stiffness.
			toSI := v.u.Unit(units.TranslationalStiffness).ToSI
			v.add(Place{Item: it}, fmt.Sprintf("%s: its %s %s is about %s %s (E = %s, %s, ℓ = %s), outside the range the solvers work in (%s): check these values and their units",
				label(it), k.name, k.symbol, fmtPowerOfTen(k.log10-log10(toSI)), v.unit(units.TranslationalStiffness), v.num(units.Modulus, E), k.factor, v.num(units.Position, l),
				v.span(units.TranslationalStiffness, minStiffness, maxStiffness)))
		}
	}
}

// log10 is math.Log10 that is right for subnormal x too: math.Log on amd64
// gives about −709 for every x below 2.2e-308 (Go 1.26), math.Log2 does not.
func log10(x float64) float64 { return math.Log2(x) * math.Log10(2) }

// position checks that x lies on the member; it returns false when x is unusable.
func (v *validator) position(at Place, what string, x float64, lengthKnown bool) bool {
	if !isFinite(x) {
		v.add(at, fmt.Sprintf("%s: %s is %v: enter a finite position in %s", label(at.Item), what, x, v.unit(units.Position)))
		return false
	}
	if lengthKnown && (x < -v.tol || x > v.L+v.tol) {
		here, length := v.pair(units.Position, x, v.L)
		v.add(at, fmt.Sprintf("%s at x = %s lies outside the member (length %s)", label(at.Item), here, length))
		return false
	}
	return true
}

func (v *validator) finite(at Place, what string, value float64, k units.Kind) {
	if !isFinite(value) {
		v.add(at, fmt.Sprintf("%s: %s is %v: enter a finite %s", label(at.Item), what, value, v.valueIn(k)))
	}
}

// The kinds of a support's settlements and spring stiffnesses, by Dof.
var (
	settlementKinds = [3]units.Kind{units.Deflection, units.Deflection, units.Rotation}
	springKinds     = [3]units.Kind{units.TranslationalStiffness, units.TranslationalStiffness, units.RotationalStiffness}
)

func (v *validator) supports(sups []Support, lengthKnown bool) {
	earlier := firstEarlierAtSamePoint(sups, v.tol)
	for i, s := range sups {
		it := Item{Kind: SupportItem, Index: i}
		if v.position(Place{Item: it, Property: PositionProperty}, "its position", s.X, lengthKnown) {
			if j := earlier[i]; j >= 0 {
				v.add(Place{Item: it, Property: PositionProperty}, fmt.Sprintf("supports %d and %d %s: keep one support per point and choose a kind that restrains all the motions you need", j+1, i+1, v.atOnePoint(sups[j].X, s.X)))
			}
		}
		if s.Kind < Fixed || s.Kind > Spring {
			v.add(Place{Item: it, Property: KindProperty}, fmt.Sprintf("support %d has an unknown kind (%d): choose fixed, pinned, roller, axial, guided or spring", i+1, int(s.Kind)))
			continue
		}
		// given: some stiffness is positive, or is refused by a message of
		// its own, so "no stiffness in any direction" would not be true.
		given := false
		for d, k := range s.Stiffness {
			at := Place{Item: it, Property: MotionStiffnessProperty, Dof: Dof(d)}
			switch {
			case k != 0 && s.Kind.Restrains(Dof(d)):
				v.add(at, fmt.Sprintf("support %d is a %s support, which holds the %s motion rigidly, so a stiffness for that motion has no effect: remove it, or choose a kind that leaves the motion free (such as %s) to hold it by a spring", i+1, s.Kind, Dof(d), freeKindFor(Dof(d))))
			case !isFinite(k):
				v.add(at, fmt.Sprintf("support %d: the %s spring stiffness is %v: enter a finite value in %s", i+1, Dof(d), k, v.unit(springKinds[d])))
				given = true
			case k < 0:
				v.add(at, fmt.Sprintf("support %d: the %s spring stiffness is %s: it must not be negative", i+1, Dof(d), v.num(springKinds[d], k)))
				given = true
			case k > 0 && (k < minStiffness || k > maxStiffness):
				v.add(at, fmt.Sprintf("support %d: the %s spring stiffness is %s, outside the range the solvers work in (%s): enter a stiffness in that range, 0 to leave the motion free, or a rigid support kind to hold it",
					i+1, Dof(d), v.num(springKinds[d], k), v.span(springKinds[d], minStiffness, maxStiffness)))
				given = true
			case k > 0:
				given = true
			}
		}
		if s.Kind == Spring && !given {
			v.add(Place{Item: it, Property: StiffnessProperty}, fmt.Sprintf("support %d is a spring with no stiffness in any direction: give at least one positive stiffness or remove it", i+1))
			continue
		}
		for d := Axial; d <= Rotation; d++ {
			if s.Kind.Restrains(d) {
				v.finite(Place{Item: it, Property: SettlementProperty, Dof: d}, fmt.Sprintf("the %s settlement", d), s.Settlement[d], settlementKinds[d])
			}
		}
	}
}

// firstEarlierAtSamePoint returns for each support the lowest index of an
// earlier support within tol of it, or −1, both at finite places.
func firstEarlierAtSamePoint(sups []Support, tol float64) []int {
	return firstEarlier(places(sups, func(s Support) (float64, bool) { return s.X, true }), tol)
}

// firstEarlier returns for each place in xs the lowest index of an earlier
// place within tol of it, or −1.
func firstEarlier(xs []float64, tol float64) []int {
	earlier := lowestWithin(xs, xs, tol)
	for i, j := range earlier {
		if j >= i {
			earlier[i] = -1
		}
	}
	return earlier
}

// places is the position of each item that keep takes, NaN for the others
// (which lowestWithin leaves out).
func places[T any](items []T, keep func(T) (float64, bool)) []float64 {
	out := make([]float64, len(items))
	for i, it := range items {
		x, ok := keep(it)
		if !ok {
			x = math.NaN()
		}
		out[i] = x
	}
	return out
}

// lowestWithin returns for each query the lowest index j of the places xs
// with |xs[j] − query| ≤ tol, or −1; places and queries that are not
// finite never match. Both are sorted once, and a window slides over the
// places with a queue of the candidates for its lowest index, so the work
// grows as n log n however many places lie together (a look at every pair
// took minutes for 20,000 hinges at one point).
func lowestWithin(xs, queries []float64, tol float64) []int {
	out := make([]int, len(queries))
	for i := range out {
		out[i] = -1
	}
	finite := func(s []float64) []int {
		order := make([]int, 0, len(s))
		for i, x := range s {
			if isFinite(x) {
				order = append(order, i)
			}
		}
		slices.SortFunc(order, func(a, b int) int { return cmp.Or(cmp.Compare(s[a], s[b]), a-b) })
		return order
	}
	order, asked := finite(xs), finite(queries)
	var queue []int // places in the window, in order, each with a lower index than every one after it
	next := 0       // the first place not yet in the window
	for _, qi := range asked {
		q := queries[qi]
		for ; next < len(order) && xs[order[next]]-q <= tol; next++ {
			j := order[next]
			for len(queue) > 0 && queue[len(queue)-1] > j {
				queue = queue[:len(queue)-1]
			}
			queue = append(queue, j)
		}
		for len(queue) > 0 && q-xs[queue[0]] > tol {
			queue = queue[1:]
		}
		if len(queue) > 0 {
			out[qi] = queue[0]
		}
	}
	return out
}

// shearDeformation checks what a Timoshenko segment needs: a shear area
// (given, or a coefficient of the area) and a shear modulus (given, or from
// Poisson's ratio). areaOK and elasticOK say that A and E passed their own
// checks: a shear area or modulus that comes out of a value already refused
// is not reported again as missing.
func (v *validator) shearDeformation(i int, s Segment, areaOK, elasticOK bool) {
	at := func(p Property) Place { return Place{Item: Item{Kind: SegmentItem, Index: i}, Property: p} }
	areaOK = v.property(at(ShearAreaProperty), "the shear area", s.Section.ShearArea, units.Area, true) && areaOK
	areaOK = v.property(at(ShearCoefficientProperty), "the shear coefficient", s.Section.ShearCoefficient, plain, true) && areaOK
	modulusOK := v.property(at(ShearModulusProperty), "the shear modulus", s.Material.ShearModulus, units.Modulus, true) && elasticOK
	if nu := s.Material.Poisson; !isFinite(nu) || nu <= -1 || nu > 0.5 {
		v.add(at(PoissonProperty), fmt.Sprintf("segment %d: Poisson's ratio is %s: enter a value above −1 and at most 0.5 (about 0.3 for steel)", i+1, fmtNumber(nu)))
		modulusOK = false
	}
	if !s.ShearDeformation {
		return
	}
	if areaOK && !(s.Section.shearArea() > 0) {
		v.add(at(ShearAreaProperty), fmt.Sprintf("segment %d deforms in shear but has no shear area: give the shear area, or the shear coefficient (5/6 for a solid rectangle)", i+1))
	}
	if modulusOK && !(s.Material.shearModulus() > 0) {
		v.add(at(ShearModulusProperty), fmt.Sprintf("segment %d deforms in shear but has no shear modulus: give G, or Poisson's ratio for G = E/(2(1+ν))", i+1))
	}
}

// hinges checks the moment releases: inside the member, one per point, not
// where a support holds the rotation (which side would it hold?), not as a
// pure hinge at a support that holds the deflection rigidly and lets the
// member turn (that support already frees the joint and cuts the member in
// two; a semi-rigid joint there is kept; a spring across or an axial
// support leaves the parts joined), a
// spring stiffness in range, and not on an axial-only member.
func (v *validator) hinges(m *Model, lengthKnown bool) {
	xs := places(m.Hinges, func(h Hinge) (float64, bool) { return h.X, true })
	earlier := firstEarlier(xs, v.tol)
	// The first support at each hinge that holds the rotation, and the
	// first that holds the deflection rigidly and lets the member turn.
	turning := lowestWithin(places(m.Supports, func(s Support) (float64, bool) { return s.X, s.Holds(Rotation) }), xs, v.tol)
	propping := lowestWithin(places(m.Supports, func(s Support) (float64, bool) { return s.X, !s.Holds(Rotation) && s.Kind.Restrains(Transverse) }), xs, v.tol)
	for i, h := range m.Hinges {
		it := Item{Kind: HingeItem, Index: i}
		at := Place{Item: it, Property: PositionProperty}
		if !v.position(at, "its position", h.X, lengthKnown) {
			continue
		}
		if lengthKnown && (h.X <= v.tol || h.X >= v.L-v.tol) {
			v.add(at, fmt.Sprintf("hinge %d is at an end of the member (x = %s), where there is nothing on the other side to release: move it inside the member or remove it", i+1, v.num(units.Position, h.X)))
			continue
		}
		if j := earlier[i]; j >= 0 {
			v.add(at, fmt.Sprintf("hinges %d and %d %s: keep one hinge per point", j+1, i+1, v.atOnePoint(m.Hinges[j].X, h.X)))
		}
		if k := turning[i]; k >= 0 {
			// A pure hinge over a support that lets the member turn is
			// refused too (below): only a semi-rigid joint may go there.
			advice := "move the hinge a little off the support, to the side the support is not to hold"
			if h.Stiffness > 0 {
				advice = "move the hinge off the support, or choose a support kind that lets the member turn (pinned, roller)"
			}
			v.add(at, fmt.Sprintf("hinge %d is at support %d (x = %s), which holds the rotation: it cannot say which side the support holds; %s", i+1, k+1, v.num(units.Position, h.X), advice))
		}
		if k := propping[i]; k >= 0 && h.Stiffness == 0 {
			v.add(at, fmt.Sprintf("hinge %d is at support %d (x = %s), a %s support that already lets the member turn there: a pure hinge would cut the member into separate spans; check each span as its own member, move the hinge into the span, or give it a rotational stiffness for a semi-rigid joint over the support", i+1, k+1, v.num(units.Position, h.X), m.Supports[k].Kind))
		}
		k := h.Stiffness
		stiff := Place{Item: it, Property: StiffnessProperty}
		switch {
		case !isFinite(k):
			v.add(stiff, fmt.Sprintf("hinge %d: the rotational stiffness is %v: enter a finite value in %s, or 0 for a pure hinge", i+1, k, v.unit(units.RotationalStiffness)))
		case k < 0:
			v.add(stiff, fmt.Sprintf("hinge %d: the rotational stiffness is %s: it must not be negative (0 makes a pure hinge)", i+1, v.num(units.RotationalStiffness, k)))
		case k > 0 && (k < minStiffness || k > maxStiffness):
			v.add(stiff, fmt.Sprintf("hinge %d: the rotational stiffness is %s, outside the range the solvers work in (%s): enter a stiffness in that range, 0 for a pure hinge, or remove the hinge for a rigid joint", i+1, v.num(units.RotationalStiffness, k), v.span(units.RotationalStiffness, minStiffness, maxStiffness)))
		}
		if m.AxialOnly {
			v.add(at, fmt.Sprintf("hinge %d releases the bending moment, but %s: remove the hinge, or let the member bend", i+1, axialOnlyWhy))
		}
	}
}

// foundations checks the elastic foundations: a stretch of the member,
// moduli in range with at least one of them, nothing across an axial-only
// member, and none under a segment with shear deformation or with quadratic
// bars along it (neither element takes a foundation yet).
func (v *validator) foundations(m *Model, lengthKnown bool) {
	for i, f := range m.Foundations {
		it := Item{Kind: FoundationItem, Index: i}
		at := func(p Property) Place { return Place{Item: it, Property: p} }
		ends := v.position(at(StartProperty), "its start", f.Start, lengthKnown)
		ends = v.position(at(EndProperty), "its end", f.End, lengthKnown) && ends
		if ends && f.End-f.Start <= v.tol {
			a, b := v.pair(units.Position, f.Start, f.End)
			v.add(at(EndProperty), fmt.Sprintf("foundation %d runs from x = %s to x = %s: its end must lie beyond its start", i+1, a, b))
			ends = false
		}
		moduli := [2]struct {
			property Property
			name     string
			k        float64
		}{{ModulusProperty, "the modulus across the member", f.Modulus}, {AxialModulusProperty, "the axial modulus", f.AxialModulus}}
		usable := true
		for _, k := range moduli {
			switch {
			case !isFinite(k.k):
				v.add(at(k.property), fmt.Sprintf("foundation %d: %s is %v: enter a finite value in %s (force per length of member per length of motion), or 0", i+1, k.name, k.k, v.unit(units.FoundationModulus)))
				usable = false
			case k.k < 0:
				v.add(at(k.property), fmt.Sprintf("foundation %d: %s is %s: it must not be negative (ground pushes back, it never pulls the member on)", i+1, k.name, v.num(units.FoundationModulus, k.k)))
				usable = false
			case k.k > 0 && (k.k < minStiffness || k.k > maxStiffness):
				v.add(at(k.property), fmt.Sprintf("foundation %d: %s is %s, outside the range the solvers work in (%s): check the value and its units", i+1, k.name, v.num(units.FoundationModulus, k.k), v.span(units.FoundationModulus, minStiffness, maxStiffness)))
				usable = false
			}
		}
		if usable && f.Modulus == 0 && f.AxialModulus == 0 {
			v.add(at(ModulusProperty), fmt.Sprintf("foundation %d has no stiffness across or along the member: give a modulus, or remove it", i+1))
		}
		if m.AxialOnly && f.Modulus > 0 {
			v.add(at(ModulusProperty), fmt.Sprintf("foundation %d holds the member across, but %s: set its modulus across to 0, or let the member bend", i+1, axialOnlyWhy))
		}
		if !ends {
			continue
		}
		if f.AxialModulus > 0 && m.Mesh.BarOrder == QuadraticBar {
			v.add(Place{Item: meshItem, Property: BarOrderProperty}, fmt.Sprintf("foundation %d holds the member along its axis, which the quadratic bar element does not take yet: choose linear bars", i+1))
		}
		for j, seg := range m.Segments {
			if f.Modulus > 0 && seg.ShearDeformation && seg.Start < f.End-v.tol && seg.End > f.Start+v.tol {
				a, b := v.pair(units.Position, max(seg.Start, f.Start), min(seg.End, f.End))
				v.add(at(ModulusProperty), fmt.Sprintf("foundation %d lies under segment %d from x = %s to %s, which deforms in shear: a Timoshenko beam on a foundation is not solved yet; turn the segment's shear deformation off there or end the foundation before it", i+1, j+1, a, b))
			}
		}
	}
}

// freeKindFor names a support kind that leaves motion d free, for messages.
func freeKindFor(d Dof) string {
	switch d {
	case Axial:
		return "roller"
	case Transverse:
		return "guided"
	}
	return "pinned"
}

func (v *validator) pointLoads(loads []PointLoad, lengthKnown bool) {
	// The first hinge at each point moment.
	hinge := lowestWithin(places(v.modelHinges, func(h Hinge) (float64, bool) { return h.X, true }),
		places(loads, func(p PointLoad) (float64, bool) { return p.X, p.Moment != 0 }), v.tol)
	for i, p := range loads {
		at := func(p Property) Place {
			return Place{Item: Item{Kind: PointLoadItem, Index: i, Case: v.loadCase}, Property: p}
		}
		v.position(at(PositionProperty), "its position", p.X, lengthKnown)
		v.finite(at(AxialForceProperty), "the axial force", p.Axial, units.Force)
		v.finite(at(TransverseForceProperty), "the transverse force", p.Transverse, units.Force)
		v.finite(at(MomentProperty), "the moment", p.Moment, units.Moment)
		// A moment at a hinge turns one of the two parts the hinge joins,
		// and the model cannot say which (the solutions would each pick a
		// side, and not the same one).
		if j := hinge[i]; j >= 0 {
			v.add(at(PositionProperty), fmt.Sprintf("point load %d puts a moment on hinge %d (x = %s), which turns only one of the two parts the hinge joins, and the model cannot say which: move the load a little to the left or the right of the hinge, onto the part it turns", i+1, j+1, v.num(units.Position, v.modelHinges[j].X)))
		}
	}
}

func (v *validator) distributedLoads(loads []DistributedLoad, lengthKnown bool) {
	for i, d := range loads {
		it := Item{Kind: DistributedLoadItem, Index: i, Case: v.loadCase}
		if d.Direction != Axial && d.Direction != Transverse {
			v.add(Place{Item: it, Property: DirectionProperty}, fmt.Sprintf("distributed load %d acts in direction %d: choose axial or transverse", i+1, int(d.Direction)))
		}
		points := Place{Item: it, Property: PointsProperty}
		if len(d.Points) < 2 {
			v.add(points, fmt.Sprintf("distributed load %d has %d point(s): give at least a start and an end point", i+1, len(d.Points)))
			continue
		}
		usable := true
		for j, p := range d.Points {
			x := Place{Item: it, Property: PointXProperty, Vertex: j}
			if !isFinite(p.X) {
				v.add(x, fmt.Sprintf("distributed load %d: point %d has position %v: enter a finite position in %s", i+1, j+1, p.X, v.unit(units.Position)))
				usable = false
			} else if lengthKnown && (p.X < -v.tol || p.X > v.L+v.tol) {
				here, length := v.pair(units.Position, p.X, v.L)
				v.add(x, fmt.Sprintf("distributed load %d: point %d at x = %s lies outside the member (length %s)", i+1, j+1, here, length))
			}
			if !isFinite(p.Intensity) {
				v.add(Place{Item: it, Property: PointIntensityProperty, Vertex: j}, fmt.Sprintf("distributed load %d: point %d has intensity %v: enter a finite value in %s", i+1, j+1, p.Intensity, v.unit(units.LineLoad)))
			}
		}
		if !usable {
			continue
		}
		first, last := d.Points[0].X, d.Points[len(d.Points)-1].X
		if math.Abs(last-first) <= v.tol {
			v.add(points, fmt.Sprintf("distributed load %d starts and ends at x = %s: give it a length", i+1, v.num(units.Position, first)))
			continue
		}
		for j := 1; j < len(d.Points); j++ {
			if d.Points[j].X-d.Points[j-1].X <= v.tol {
				here, before := v.pair(units.Position, d.Points[j].X, d.Points[j-1].X)
				where := fmt.Sprintf("does not lie beyond point %d (x = %s)", j, before)
				if d.Points[j].X > d.Points[j-1].X {
					where = fmt.Sprintf("lies beyond point %d (x = %s) by less than %g of the member's length, so they count as one point", j, before, mergeTolerance)
				}
				v.add(Place{Item: it, Property: PointXProperty, Vertex: j}, fmt.Sprintf("distributed load %d: point %d (x = %s) %s: list the points in increasing x without repeats", i+1, j+1, here, where))
				break
			}
		}
	}
}

func (v *validator) mesh(m *Model, lengthKnown bool) {
	ms := m.Mesh
	if ms.Elements < 0 {
		v.add(Place{Item: meshItem, Property: ElementsProperty}, fmt.Sprintf("the mesh asks for %d elements: give zero (automatic) or a positive number", ms.Elements))
	}
	if h := ms.MaxElementLength; !isFinite(h) || h < 0 {
		v.add(Place{Item: meshItem, Property: MaxElementLengthProperty}, fmt.Sprintf("the maximum element length is %s: give zero (no limit) or a positive length", v.num(units.Position, h)))
	}
	if ms.BarOrder != 0 && ms.BarOrder != LinearBar && ms.BarOrder != QuadraticBar {
		v.add(Place{Item: meshItem, Property: BarOrderProperty}, fmt.Sprintf("the bar element order is %d: choose 1 (linear) or 2 (quadratic)", int(ms.BarOrder)))
	}
	if lengthKnown {
		v.memory(m)
	}
}

// memory refuses a model whose analysis would not fit in memoryLimit:
// blaming the key points when they do not fit even with one element per
// stretch, else the elements.
func (v *validator) memory(m *Model) {
	elements, keys := m.meshBound(v.L)
	sets, perElement := m.memoryPerElement()
	elementBytes, keyBytes := elements*perElement, sets*keys*bytesPerKeyPoint
	need := elementBytes + keyBytes
	if need <= memoryLimit {
		return
	}
	limit := fmtGigabytes(memoryLimit)
	// With cases, what fits is shared among their load sets: 500 cases of
	// 507 key points were told 138,000 key points fit.
	solved, fewer := "", ""
	if len(m.Cases) > 0 {
		solved, fewer = ", solved for "+m.loadSetWords(), ", or take fewer load cases and combinations"
	}
	if least := keys * (sets*bytesPerKeyPoint + perElement); least > memoryLimit { // too much even with one element per stretch
		v.add(Place{Item: modelItem}, fmt.Sprintf("the model would need at least %s of memory for its %.3g key points (ends and breaks of segments, supports, point loads and load points)%s, more than the %s allowed: use fewer supports, point loads and load points%s, or split the member into several models (up to about %.3g key points fit)",
			fmtGigabytes(least), keys, solved, limit, fewer, math.Floor(memoryLimit/(sets*bytesPerKeyPoint+perElement))))
		return
	}
	fit := math.Floor((memoryLimit - keyBytes) / perElement)
	if !isFinite(need) {
		v.add(Place{Item: meshItem, Property: ElementsProperty}, fmt.Sprintf("the mesh would need more than %s of memory (over %s elements), far more than the %s allowed: ask for fewer elements or a longer maximum element length (up to about %.3g elements fit)",
			fmtGigabytes(floorPowerOfTen(math.MaxFloat64)), fmtNumber(floorPowerOfTen(math.MaxFloat64/perElement)), limit, fit))
		return
	}
	v.add(Place{Item: meshItem, Property: ElementsProperty}, fmt.Sprintf("the mesh would need about %s of memory (%.3g elements%s), more than the %s allowed: ask for fewer elements or a longer maximum element length%s (up to about %.3g elements fit)",
		fmtGigabytes(need), elements, solved, limit, fewer, fit))
}

// meshBound are upper bounds on the elements and key points of the mesh
// of m, of length L, before the key points are merged and the mesh is
// built: every end, break, support, point load and load point a key
// point, and every stretch between them at least one element more than
// its share. Each load set the analysis keeps (memoryPerElement) counts
// on its own.
func (m *Model) meshBound(L float64) (elements, keys float64) {
	keys = float64(featureCount(m) + 2)
	elements = float64(max(m.Mesh.Elements, 0)) + keys
	if h := m.Mesh.MaxElementLength; isFinite(h) && h > 0 {
		elements += math.Ceil(L / h) // +Inf when L/h overflows
	}
	// On a foundation every node is a key point of the factorized system
	// (hierarchy.go): count the elements there as key points too.
	covered := 0.0
	for _, f := range m.Foundations {
		if isFinite(f.Start) && isFinite(f.End) {
			covered += max(0, min(f.End, L)-max(f.Start, 0))
		}
	}
	if covered > 0 {
		keys += elements * min(1, covered/L)
	}
	return elements, keys
}

// trainBytesPerElement is what the envelope of one moving load train adds
// per element: `stave solve` of the runway example grew in resident
// memory by 965 to 1,030 B per element for its first train and 650 to
// 825 B for its second (100,000 and 400,000 elements, 5 December); a
// resident peak, it holds the collector's slack already, so with
// memoryHeadroom the estimate is about twice what it needs.
const trainBytesPerElement = 1000

// TrainsMemoryProblem is the problem of model m when its analysis, with
// trains moving load trains enveloped beside it (which live outside the
// model), would need more memory than Validate allows; ok is false when
// it fits or there are no trains. m must be valid (Validate returns nil).
func (m *Model) TrainsMemoryProblem(trains int) (p Problem, ok bool) {
	L := m.Length()
	if trains <= 0 || !isFinite(L) || L <= 0 {
		return Problem{}, false
	}
	elements, keys := m.meshBound(L)
	sets, perElement := m.memoryPerElement()
	own := elements*perElement + sets*keys*bytesPerKeyPoint
	perTrain := float64(memoryHeadroom * trainBytesPerElement)
	need := own + elements*perTrain*float64(trains)
	if !(own <= memoryLimit) || need <= memoryLimit {
		return Problem{}, false
	}
	fit := math.Floor((memoryLimit - sets*keys*bytesPerKeyPoint) / (perElement + perTrain*float64(trains)))
	return Problem{Place: Place{Item: meshItem, Property: ElementsProperty}, Message: fmt.Sprintf("the mesh would need about %s of memory (%.3g elements, with the envelopes of %s), more than the %s allowed: ask for fewer elements or a longer maximum element length, or take fewer trains (up to about %.3g elements fit)",
		fmtGigabytes(need), elements, units.Count(trains, "moving load train"), fmtGigabytes(memoryLimit), fit)}, true
}

// memoryPerElement are the load sets whose exact solutions m's analysis
// keeps (one without cases; with cases, the envelope's combinations, the
// span shares of the cases placed by span, and each case alone for the
// report's summaries) and the bytes it needs per element, headroom
// included. The member's length must be valid (Spans).
func (m *Model) memoryPerElement() (sets, bytes float64) {
	combos, shares, _ := m.loadSetCounts()
	sets = float64(combos + shares)
	if len(m.Cases) > 0 {
		sets += float64(len(m.Cases))
	}
	return sets, memoryHeadroom * m.AllocationPerElement()
}

// AllocationPerElement is the bytes the memory estimate takes m's analysis
// to allocate per element, before its headroom: for the stages of one load
// set, each further set kept, each combination that arranges loaded spans
// and each case. The member's length must be valid (Spans).
func (m *Model) AllocationPerElement() float64 {
	combos, shares, patterned := m.loadSetCounts()
	return stagesBytesPerElement + setBytesPerElement*float64(combos+shares-1) +
		patternBytesPerElement*float64(patterned) + caseBytesPerElement*float64(len(m.Cases))
}

// loadSetCounts are the combinations of m's envelope, the span shares of
// its cases placed by span (one per span each) and the combinations that
// take such a case.
func (m *Model) loadSetCounts() (combos, shares, patterned int) {
	if len(m.Cases) == 0 {
		return 1, 0, 0
	}
	spans := 0
	for _, lc := range m.Cases {
		if lc.BySpan {
			if spans == 0 {
				spans = len(m.Spans())
			}
			shares += spans
		}
	}
	cbs := m.EnvelopeCombinations()
	for _, cb := range cbs {
		if slices.ContainsFunc(cb.Factors, func(cf CaseFactor) bool {
			return cf.Case >= 0 && cf.Case < len(m.Cases) && m.Cases[cf.Case].BySpan
		}) {
			patterned++
		}
	}
	return len(cbs), shares, patterned
}

// loadSetWords says what m's load sets are: "each of 2 load cases and 3
// combinations", with ", and 2 span shares of cases placed by span" where
// there are such.
func (m *Model) loadSetWords() string {
	combos, shares, _ := m.loadSetCounts()
	words := fmt.Sprintf("each of %d load cases and %d combinations", len(m.Cases), combos)
	if shares > 0 {
		words += fmt.Sprintf(", and %d span shares of cases placed by span", shares)
	}
	return words
}

func isFinite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// fmtNumber prints a value with up to six significant digits and at least
// one decimal: the shortest form that reads back as x when it has six digits
// or fewer (5e-324, not 4.94066e-324), else x rounded to six.
func fmtNumber(x float64) string { return fmtDigits(x, 6) }

// fmtDigits is fmtNumber with up to digits significant digits; a negative
// zero (a typed -0) prints as zero.
func fmtDigits(x float64, digits int) string {
	if x == 0 {
		x = 0
	}
	s := strconv.FormatFloat(x, 'g', -1, 64)
	if significantDigits(s) > digits {
		s = strconv.FormatFloat(x, 'g', digits, 64)
	}
	if !strings.ContainsAny(s, ".eEnN") { // n, N: NaN, Inf
		s += ".0"
	}
	return s
}

// significantDigits counts the digits of a formatted number's mantissa,
// leading zeros left out.
func significantDigits(s string) int {
	if i := strings.IndexAny(s, "eE"); i >= 0 {
		s = s[:i]
	}
	s = strings.TrimLeft(s, "+-0.")
	return len(strings.ReplaceAll(s, ".", ""))
}

// fmtPair prints two values with the fewest significant digits, six or
// more, that tell them apart, so that a gap of 1e-9 m between 2 m and
// 2.000000001 m shows.
func fmtPair(a, b float64) (string, string) {
	digits := digitsApart([]float64{a, b})
	return fmtDigits(a, digits), fmtDigits(b, digits)
}

// digitsApart is the fewest significant digits, six or more, with which
// the distinct values of xs print apart (fmtDigits), as fmtPair does for two.
func digitsApart(xs []float64) int {
	xs = slices.Clone(xs)
	slices.Sort(xs)
	xs = slices.Compact(xs)
	digits := 6
	for i := 1; i < len(xs); i++ {
		for digits < 17 && fmtDigits(xs[i-1], digits) == fmtDigits(xs[i], digits) { // 17 tell any two float64 apart
			digits++
		}
	}
	return digits
}

// atOnePoint says that two items at a and b, within the merge tolerance of
// each other, stand at one point: "are both at x = 2.0 m", or, where their
// places print apart (0 and 1e-12 m), both places and why.
func (v *validator) atOnePoint(a, b float64) string {
	if pa, pb := v.num(units.Position, a), v.num(units.Position, b); pa != pb {
		return fmt.Sprintf("are at x = %s and x = %s, which count as one point (closer than %g of the member's length)", pa, pb, mergeTolerance)
	}
	return "are both at x = " + v.num(units.Position, b)
}

// fmtMetres prints a position in m, for the messages of the mesh checks,
// which tell a caller of the package what it got wrong, e.g. "3.2 m".
func fmtMetres(x float64) string { return quote(units.Base, units.Position, x) }

// messageUnits are the units messages quote values in: u, or SI base
// units, as a file holds them, for units of no name (the zero System).
func messageUnits(u units.System) units.System {
	if u.Name == "" {
		return units.Base
	}
	return u
}

// quote prints x, an SI value of kind k, in u's unit of k with up to six
// significant digits (fmtNumber): "3.2 m", "10.5 ft".
func quote(u units.System, k units.Kind, x float64) string {
	return quoteDigits(u, k, x, 6)
}

// quoteDigits is quote with up to digits significant digits (fmtDigits).
func quoteDigits(u units.System, k units.Kind, x float64, digits int) string {
	return fmtDigits(u.ToDisplay(k, x), digits) + " " + u.Unit(k).Symbol
}

// quotePair is quote for two SI values of kind k, with the fewest digits
// that tell them apart in u (fmtPair).
func quotePair(u units.System, k units.Kind, a, b float64) (string, string) {
	da, db := fmtPair(u.ToDisplay(k, a), u.ToDisplay(k, b))
	unit := " " + u.Unit(k).Symbol
	return da + unit, db + unit
}

// fmtPowerOfTen prints 10^e, for e = log10 of a value that may lie outside
// float64's range, with two significant digits, e.g. "1.6e-326".
func fmtPowerOfTen(e float64) string {
	exponent := math.Floor(e)
	mantissa := math.Round(math.Pow(10, e-exponent)*10) / 10
	if mantissa >= 10 {
		mantissa, exponent = 1, exponent+1
	}
	return strconv.FormatFloat(mantissa, 'g', -1, 64) + "e" + fmt.Sprintf("%+03.0f", exponent)
}

// floorPowerOfTen is the largest power of ten not above x > 0.
func floorPowerOfTen(x float64) float64 { return math.Pow(10, math.Floor(math.Log10(x))) }

// fmtGigabytes prints a number of bytes in GB (10⁹ bytes): one decimal up
// to 1,000 GB, then three significant digits.
func fmtGigabytes(bytes float64) string {
	gb := bytes / 1e9
	if gb < 1000 {
		return fmt.Sprintf("%.1f GB", gb)
	}
	return fmt.Sprintf("%.3g GB", gb)
}
