package fem

import (
	"fmt"
	"math"
	"sort"

	"stave/fem/units"
)

// A Summary leads with the exact solution of the model (the headline
// values) and gives the finite element value beside each: the exact
// solution is free of discretisation error, and the finite element one is
// what the mesh gives, so the difference between the two says how far the
// mesh is from the truth. Without an exact solution (it could not be
// found) the headline values are the finite element ones, and Exact says
// so.

// Extreme is the largest and smallest value of one result quantity along the
// member and where each occurs: the headline values (exact when the summary
// has an exact solution) and the finite element ones beside them.
type Extreme struct {
	Quantity Quantity
	Unit     string // SI unit of the values
	// Max and Min are the headline extremes, at XMax and XMin (m). Of the
	// combined stress they are those of both extreme fibres, σa + |σb| and
	// σa − |σb| (Interval.FibreRange): the greatest tension and the
	// greatest compression in either fibre.
	Max, XMax, Min, XMin float64
	// FEMax and FEMin are the finite element extremes, at FEXMax and FEXMin (m).
	FEMax, FEXMax, FEMin, FEXMin float64
	// SideMax, SideMin, FESideMax and FESideMin are the sides of XMax,
	// XMin, FEXMax and FEXMin that the extremes are read on where the field
	// jumps there (the shear force at an inner support or under a point
	// force, the moment under a couple): Left for the limit just left of
	// the point. They are 0 where the field does not jump, and at the
	// member's ends, which have one side only (sideOfJump).
	SideMax, SideMin, FESideMax, FESideMin Side
	// Accuracy is how far the finite element extremes are from the exact
	// ones: the larger of |FEMax − Max| and |FEMin − Min| over the field's
	// largest magnitude (fieldScale: its own, or the size of its kind where
	// it is zero to round-off); 0 without an exact solution.
	Accuracy float64
}

// MeshSummary describes the discretisation a solution was computed on.
type MeshSummary struct {
	Elements int
	Nodes    int
	BarOrder int
	// Kinds names the elements in the trade's words: "linear bar and
	// Hermite beam elements", or the bar's alone for a member solved as a
	// bar alone.
	Kinds     string
	Condition float64 // estimated condition number of the key-point systems
	// Automatic says Stave chose the mesh (the default mesh rule, for
	// MeshAccuracy), and Note how, in words.
	Automatic bool
	Note      string
}

// Words is the mesh as every output writes it: "16 elements, 17 nodes,
// linear bar and Hermite beam elements, condition estimate 18".
func (m MeshSummary) Words() string {
	return fmt.Sprintf("%s, %s, %s, condition estimate %s", units.Count(m.Elements, "element"), units.Count(m.Nodes, "node"),
		m.Kinds, units.FormatG("%.2g", m.Condition))
}

// EquilibriumSummary is Equilibrium with named components for reports.
type EquilibriumSummary struct {
	Applied   Components
	Reactions Components // of the supports and the ground
	Ground    Components // the part of Reactions the foundations carry
	Residual  Components
	// Relative is the largest residual component divided by the scale of
	// its kind (Solution.EquilibriumScales); it should be near round-off.
	Relative float64
}

// Components are the three resultants of a force system: forces in N and the
// moment about x = 0 in N·m.
type Components struct {
	Axial      float64 // N
	Transverse float64 // N
	Moment     float64 // N·m
}

// ReactionSummary is one support's reaction for reports: the headline
// components and the finite element ones.
type ReactionSummary struct {
	Support int    // 1-based, as users count
	Kind    string // the support's kind, as files name it
	X       float64
	// Holds says which components (by Dof) the support holds, rigidly or by
	// a spring; the others are zero and reports leave them out.
	Holds [3]bool
	Components
	FE Components
}

// FoundationSummary is what one foundation carries, for reports: the
// resultant of the ground's forces on the member, the headline one and the
// finite element one.
type FoundationSummary struct {
	Foundation int     // 1-based, as users count
	Start, End float64 // m
	// Holds says which resultants the foundation can carry: [0] along the
	// member (it has an axial modulus), [1] across it (a modulus).
	Holds        [2]bool
	Reaction, FE FoundationReaction
	// nothingAcross says the ground's forces across add up to nothing, to
	// the round-off of the model's forces (Solution.EquilibriumScales), and
	// couple that they make a couple (Reaction.Moment), which has no line
	// of action.
	nothingAcross, couple bool
}

// Centre is where the ground's resultant across the member acts, m, in the
// headline solution and in the finite element one (FoundationReaction.Centre),
// the middle of the foundation where it carries nothing across; ok is false
// where the ground carries a couple alone, which acts nowhere in particular.
func (f FoundationSummary) Centre() (headline, fe float64, ok bool) {
	if f.couple {
		return math.NaN(), math.NaN(), false
	}
	if f.nothingAcross {
		mid := 0.5 * (f.Start + f.End)
		return mid, mid, true
	}
	return f.Reaction.Centre(), f.FE.Centre(), true
}

// SupportActions are the shear force and the bending moment just left ([0])
// and just right ([1]) of a support inside the member, where they jump or
// peak: the headline values and the finite element ones.
type SupportActions struct {
	Support           int // 1-based
	Kind              string
	X                 float64    // m
	Shear, Moment     [2]float64 // N, N·m
	FEShear, FEMoment [2]float64
}

// Summary gathers what an engineer reads first from a solution.
type Summary struct {
	// Exact says the headline values are the exact solution's; false when
	// there is none, and then they are the finite element ones.
	Exact     bool
	Reactions []ReactionSummary
	// Foundations are what each foundation carries, in the model's order;
	// nil without foundations.
	Foundations []FoundationSummary
	Extremes    []Extreme
	// Supports are the actions at every support inside the member, in order along it.
	Supports []SupportActions
	// Equilibrium is the balance of the headline reactions with the loads,
	// FEEquilibrium that of the finite element reactions.
	Equilibrium, FEEquilibrium EquilibriumSummary
	ExactError                 *ErrorNorms // nil when the exact solution is not available
	Mesh                       MeshSummary
}

// Worst is the extreme whose finite element value is furthest from the
// exact one (the largest Accuracy); false without an exact solution.
func (s *Summary) Worst() (Extreme, bool) {
	if !s.Exact || len(s.Extremes) == 0 {
		return Extreme{}, false
	}
	worst := s.Extremes[0]
	for _, e := range s.Extremes[1:] {
		if e.Accuracy > worst.Accuracy {
			worst = e
		}
	}
	return worst, true
}

// extremes gathers the largest and smallest value of every quantity along
// the member from the finite element fields, in closed form element by
// element (Interval.Range); a Visitor. At a node where a field jumps each
// element's own side counts, so the extreme is reported on the side where
// it is reached.
type extremes struct {
	lo, hi [quantityCount]Point
	seen   bool
	// scale is, per quantity, the field's size against which a later value
	// ties with the extreme so far (BeyondField), beside Beyond's relative
	// tie (exactExtremes); zero in a walk.
	scale [quantityCount]float64
}

func newExtremes() *extremes {
	x := &extremes{}
	for q := range x.lo {
		x.lo[q].Value, x.hi[q].Value = math.Inf(1), math.Inf(-1)
	}
	return x
}

func (x *extremes) Visit(v *ElementView) {
	x.seen = true
	fe := &v.FE
	a, b := fe.End(0).values(), fe.End(1).values()
	x0, x1 := fe.Start, fe.X(1)
	for q := range Quantity(polynomialQuantities) {
		// Where no value inside can go beyond the extremes so far (a
		// quantity that is linear, say), the ends, as Range would give them.
		if fe.degree[q] >= 2 && x.insideBeyond(q, fe, a[q], b[q]) {
			lo, hi := fe.Range(q)
			x.take(q, lo, hi)
		} else {
			x.ends(q, x0, a[q], x1, b[q])
		}
	}
	// Both fibres: the greatest tension and compression anywhere.
	lo, hi := fe.FibreRange()
	x.take(QCombinedStress, lo, hi)
}

// ends takes the values a at x0 and b at x1 of q, the first winning a tie:
// take of each end in turn, where either lies outside the extremes so far.
func (x *extremes) ends(q Quantity, x0, a, x1, b float64) {
	lo, hi := &x.lo[q], &x.hi[q]
	if a < lo.Value || a > hi.Value || b < lo.Value || b > hi.Value {
		x.take(q, Point{x0, a}, Point{x0, a})
		x.take(q, Point{x1, b}, Point{x1, b})
	}
}

// insideBeyond reports whether a value inside fe of polynomial quantity q,
// of degree 2 or more and valued a and b at the ends, may lie beyond the
// extremes so far or the ends: not where the polynomial's Bernstein
// coefficients, whose hull holds it, lie within them (strictly within the
// ends, which Range would not prefer to a value inside on a tie).
func (x *extremes) insideBeyond(q Quantity, fe *Interval, a, b float64) bool {
	p := &fe.poly[q]
	lo, hi := x.lo[q].Value, x.hi[q].Value
	beyond := func(c float64) bool {
		return c < lo && c <= min(a, b) || c > hi && c >= max(a, b)
	}
	switch fe.degree[q] {
	case 2:
		return beyond(p[0] + p[1]/2)
	case 3:
		b1 := p[0] + p[1]*(1.0/3)
		return beyond(b1) || beyond(b1+(p[1]+p[2])*(1.0/3))
	}
	return true
}

// take keeps lo and hi where they are beyond the extremes of q so far by
// more than a tie (Beyond): of equal peaks the first along the member.
// Beyond is asked only past the plain comparison it starts with, which
// settles nearly every value of a walk at the cost of one comparison.
func (x *extremes) take(q Quantity, lo, hi Point) {
	if l := &x.lo[q]; lo.Value < l.Value && BeyondField(l.Value, lo.Value, x.scale[q]) {
		*l = lo
	}
	if h := &x.hi[q]; hi.Value > h.Value && BeyondField(hi.Value, h.Value, x.scale[q]) {
		*h = hi
	}
}

func (x *extremes) Fork() Visitor { return newExtremes() }

func (x *extremes) Join(later Visitor) {
	y := later.(*extremes)
	x.seen = x.seen || y.seen
	for q := range Quantity(quantityCount) {
		x.take(q, y.lo[q], y.hi[q])
	}
}

// list is the extremes in report order, as both headline and finite
// element values; all zero when no element was seen.
func (x *extremes) list() []Extreme {
	out := make([]Extreme, quantityCount)
	for i, q := range Quantities() {
		e := Extreme{Quantity: q, Unit: q.Info().SI}
		if x.seen {
			e.FEMax, e.FEXMax = x.hi[q].Value, x.hi[q].X
			e.FEMin, e.FEXMin = x.lo[q].Value, x.lo[q].X
		}
		e.Max, e.XMax, e.Min, e.XMin = e.FEMax, e.FEXMax, e.FEMin, e.FEXMin
		out[i] = e
	}
	return out
}

// ownExtremes are exactExtremes of e, worked out once and kept
// (Exact.extremes): summaries only read them.
func (e *Exact) ownExtremes() *extremes {
	e.extremesOnce.Do(func() { e.extremes = exactExtremes(e) })
	return e.extremes
}

// exactExtremes are the extremes of e, stretch by stretch in closed form
// (the stretches' ranges, Exact.stretchRanges, which the comparison, the
// checks and the drawing read too; with the fibres' ranges, in two halves
// at once from parallelStretches stretches on). A second pass takes values within extremeTie of
// each field's largest magnitude as ties, so that of the supports where a
// deflection is zero to round-off the first is named, as the finite
// element walk names it. The second pass takes the points the first
// worked out, in the same order (stretchTakes), rather than working them
// out again: on a beam of 1,000 loads the stretches' ranges were half of
// the summary.
func exactExtremes(e *Exact) *extremes {
	takes := make([]stretchTakes, len(e.stretches))
	ranges := e.stretchRanges()
	inHalves(len(takes), func(from, to int) {
		v := memoInterval()
		for j := from; j < to; j++ {
			e.stretchInterval(j, ranges, v)
			takes[j].of(v)
		}
	})
	first := newExtremes()
	for j := range takes {
		takes[j].into(first)
	}
	second := newExtremes()
	for q := range second.scale {
		second.scale[q] = max(math.Abs(first.lo[q].Value), math.Abs(first.hi[q].Value))
	}
	for j := range takes {
		takes[j].into(second)
	}
	return second
}

// stretchTakes are the points one stretch offers the extremes, in the
// order they are taken: per polynomial quantity its value at the stretch's
// start (so that a value later in it that ties with it to round-off, the
// two ends of a symmetric span, does not take its place), then its range;
// then the combined stress at the start, on both fibres, and its range.
type stretchTakes [2*polynomialQuantities + 2][2]Point

// of works out the points of the stretch v.
func (t *stretchTakes) of(v *Interval) {
	start := v.End(0)
	for q := range Quantity(polynomialQuantities) {
		at := Point{v.Start, q.Of(start)}
		t[2*q] = [2]Point{at, at}
		lo, hi := v.Range(q)
		t[2*q+1] = [2]Point{lo, hi}
	}
	bending := math.Abs(start.BendingStress)
	t[2*polynomialQuantities] = [2]Point{{v.Start, start.AxialStress - bending}, {v.Start, start.AxialStress + bending}}
	lo, hi := v.FibreRange()
	t[2*polynomialQuantities+1] = [2]Point{lo, hi}
}

// into takes the points into x, in order.
func (t *stretchTakes) into(x *extremes) {
	x.seen = true
	for k, p := range t {
		q := QCombinedStress
		if k < 2*polynomialQuantities {
			q = Quantity(k / 2)
		}
		x.take(q, p[0], p[1])
	}
}

// withExact makes the exact extremes ex the headline values of list and
// measures the finite element ones against them. A stress is measured
// against the stress sizes of the segments where the extremes lie
// (floorSizes.stressNear). scales are the sizes each quantity was
// measured against (fieldScale), 0 where it has none: a value of it
// negligible against its scale is round-off and reads 0.
func withExact(list []Extreme, ex *extremes, m *Model, floor floorSizes) (scales [quantityCount]float64) {
	exact := ex.list()
	var largest [quantityCount]float64
	for i, e := range exact {
		largest[i] = math.Max(math.Abs(e.FEMax), math.Abs(e.FEMin))
	}
	L := m.Length()
	for i := range list {
		e, x := &list[i], &exact[i]
		e.Max, e.XMax, e.Min, e.XMin = x.FEMax, x.FEXMax, x.FEMin, x.FEXMin
		off := math.Max(math.Abs(e.FEMax-e.Max), math.Abs(e.FEMin-e.Min))
		near := floor
		switch e.Quantity {
		case QAxialStress, QBendingStress, QCombinedStress:
			near = floor.stressNear(m, e.XMax, e.XMin, e.FEXMax, e.FEXMin)
		}
		if scale := fieldScale(e.Quantity, &largest, L, near); scale > 0 {
			scales[e.Quantity] = scale
			e.Accuracy = off / scale
			// A value that is round-off against the field's size (a moment
			// at a free end, 1e-14 kN·m) is zero, as the closed form says.
			dropRoundOffValues(scale, &e.Max, &e.Min, &e.FEMax, &e.FEMin)
		}
	}
	return scales
}

// dropRoundOffValues sets to zero each of vs negligible against scale.
func dropRoundOffValues(scale float64, vs ...*float64) {
	for _, v := range vs {
		if math.Abs(*v) <= negligible*scale {
			*v = 0
		}
	}
}

// floorSizes are the sizes forceFloor finds, each a force (N), a stress
// (Pa) and a displacement (m): of the whole model, and of its axial
// problem alone (the forces along the member and what they stretch). The
// stresses are the largest of any segment's; segments holds each
// segment's own, [0] of the whole model and [1] of the axial problem: a
// stress is round-off against the section it acts on, and a segment of a
// far weaker section than the rest does not make the others' stresses
// round-off.
type floorSizes struct {
	all, axial [3]float64
	segments   [][2]float64
}

// stressNear is f with the stress sizes of the segments holding the
// points xs (m) only, where stresses are read: at each point the smaller
// size of the segments that meet there, the largest over the points.
func (f floorSizes) stressNear(m *Model, xs ...float64) floorSizes {
	if len(f.segments) == 0 {
		return f
	}
	var all, axial float64
	for _, x := range xs {
		i := m.SegmentAt(x)
		a, b := f.segments[i][0], f.segments[i][1]
		if i > 0 && x <= m.Segments[i].Start {
			a, b = min(a, f.segments[i-1][0]), min(b, f.segments[i-1][1])
		}
		all, axial = max(all, a), max(axial, b)
	}
	f.all[1], f.axial[1] = all, axial
	return f
}

// forceFloor is the size the internal forces of s's model are at least
// measured against, N, its stresses, Pa, and its displacements, m. The
// force is the loads applied and the supports' actions (each, not their
// sum), and the imposed deformations fully restrained (Model.ImposedScales),
// a moment counted as a force by dividing by the length (loadForces); the
// stress, per segment the force on its area or the moment on its section
// modulus, but no more than the member's deformations make in its section
// (deformedStresses), and of the whole model the largest of these. The displacement
// is what the member's deformations make (Solution.deformations, from the
// exact solution e where it is not nil, else from s): a segment that
// carries nothing, however weak, makes no displacement, and does not make
// the real deflections beside it round-off. Where the member deforms not
// at all — the loads go straight into the supports — every displacement is
// round-off, and the size is then what the force would stretch or bend the
// most flexible segment over the member's length (F·L/EA, F·L³/EI), or over
// the shorter length a stiff foundation spreads it over (groundLengths).
// The forces along the member only stretch it and those across it and the
// moments only bend it (linear theory), so each sets only its own share of
// the stress and the displacement: a large axial force does not make a
// real deflection beside it round-off. The axial sizes are those of the
// forces along the member alone.
func forceFloor(s *Solution, e *Exact) floorSizes {
	m := &s.Model
	L := m.Length()
	axial, across := loadForces(s)
	f := floorSizes{segments: make([][2]float64, len(m.Segments))}
	f.all[0], f.axial[0] = max(axial, across), axial
	var stretched, bent float64 // what the force would do to the most flexible segment, m
	for _, sg := range m.Segments {
		if el := sg.Material.Elastic; el > 0 && sg.Section.Area > 0 && sg.Section.SecondMoment > 0 {
			ea, ei := el*sg.Section.Area, el*sg.Section.SecondMoment
			la, lb := groundLengths(m, ea, ei)
			stretched = max(stretched, axial*la/ea)
			bent = max(bent, across*lb*lb*lb/ei)
		}
	}
	along, aside := s.deformations(e, f.all[0])
	for i, sg := range m.Segments {
		if sg.Section.Area > 0 && sg.Section.SecondMoment > 0 {
			own, bending := axial/sg.Section.Area, across*L*sg.Section.FibreDistance/sg.Section.SecondMoment
			own, bending = s.deformedStresses(i, along, aside, own, bending)
			f.segments[i] = [2]float64{max(own, bending), own}
			f.axial[1] = max(f.axial[1], own)
			f.all[1] = max(f.all[1], f.segments[i][0])
		}
	}
	if along == 0 && aside == 0 {
		along, aside = stretched, bent
	}
	f.axial[2], f.all[2] = along, max(along, aside)
	return f
}

// deformedStresses are the axial and bending stress sizes of segment i of
// s's member (Pa), own and bending, the loads' force on its area and
// moment on its section modulus, at most what the member's deformations
// along and across it (m, Solution.deformations; 0 where it does not
// deform so) can make in its section, σ = E·(ε + κ·c) with its own
// thermal strain and curvature: the segment's ends move apart by at most
// twice along and turn by at most aside/L, and move across by at most
// aside, which bends a segment of length l by at most 6·θ/l + 12·w/l²
// (its end moments, slope-deflection, from memory). A weak segment the
// member's turns bend carries a moment that is round-off against the
// loads' (M = EI·κ), but a real stress E·κ·c, whatever its I.
func (s *Solution) deformedStresses(i int, along, aside, own, bending float64) (float64, float64) {
	m := &s.Model
	sg, sec := &m.Segments[i], &s.sections[i]
	E, l, L := sg.Material.Elastic, sg.End-sg.Start, m.Length()
	if !(E > 0 && l > 0 && L > 0) {
		return own, bending
	}
	if along > 0 {
		own = min(own, E*(2*along/l+math.Abs(sec.thermalStrain)))
	}
	if aside > 0 {
		bending = min(bending, E*sg.Section.FibreDistance*(6*aside/(L*l)+12*aside/(l*l)+math.Abs(sec.thermalCurvature)))
	}
	return own, bending
}

// loadForces are the sizes of the forces on s's member along it and
// across it, N: the loads applied, each support's action and the imposed
// deformations fully restrained (Model.imposedScales), a moment counted as
// a force across by dividing by the member's length.
func loadForces(s *Solution) (axial, across float64) {
	m := &s.Model
	axial, across, moment := m.imposedScales()
	a := s.Equilibrium.Applied
	axial = max(axial, math.Abs(a[Axial]))
	across = max(across, math.Abs(a[Transverse]))
	moment = max(moment, math.Abs(a[Rotation]))
	for _, r := range s.Reactions {
		axial = max(axial, math.Abs(r.Force[Axial]))
		across = max(across, math.Abs(r.Force[Transverse]))
		moment = max(moment, math.Abs(r.Force[Rotation]))
	}
	if L := m.Length(); L > 0 {
		across = max(across, moment/L)
	}
	return axial, across
}

// deformations are the sizes of the displacements along and across the
// member that its deformations make, m: along, its strain integrated over
// it, ∫|u′| dx; across, its curvature integrated and taken over the
// member's length L, L·∫|θ′| dx (a curvature κ over a length dx turns the
// member by κ·dx, which moves a point at most L away by L·κ·dx), with its
// shear strain integrated, ∫|V|/(G·As) dx; to each the largest motion of
// a support or a foundation: a settlement (a rotation's times L), a
// spring's give |R|/k, and the motion a rigid member would need to press
// a foundation's resultant and moment into it, |F|/(k·ℓ) + 6|M|/(k·ℓ²)
// over the foundation's length ℓ. A hinge's kink adds nothing of its
// own: a pure hinge turns as the curvatures and supports beside it make
// it, a semi-rigid one under a moment that bends the member beside it too.
// The strain and curvature are the
// member's own, thermal ones included (u′ = N/EA + α·ΔT, θ′ = M/EI + κ_T),
// so that a member that carries nothing, however weak, counts nothing,
// and a heated bar free to expand counts its stretch. A strain, curvature,
// shear force, reaction or resultant whose force is negligible against
// force (N; a moment's against force·L) is round-off and counts nothing:
// where the member does not deform — the loads go straight into the
// supports, or a heated bar is held at both ends — both sizes are 0. The
// fields are those of the exact solution e, stretch by stretch (its
// ranges, Exact.stretchRanges), or without e those of s, element by
// element. On a stretch held by a stiff foundation the fields die out
// within a length of where they arise (decayLengths), and an exact
// stretch's largest strain or curvature counts over twice that length at
// most, not over the whole stretch.
func (s *Solution) deformations(e *Exact, force float64) (along, across float64) {
	m := &s.Model
	L := m.Length()
	tol := [3]float64{negligible * force, negligible * force, negligible * force * L} // by Dof
	var stretch, turn, slide float64                                                  // ∫|u′| dx (m), ∫|θ′| dx (rad), ∫|γ| dx (m)
	// add takes a stretch of section sec with its largest strain and
	// curvature and shear force, the first over the length la and the
	// others over lb.
	add := func(sec *sectionData, la, lb, strain, curvature, shear float64) {
		if sec.axialRigidity*strain > tol[Axial] {
			stretch += strain * la
		}
		if sec.flexuralRigidity*curvature > tol[Rotation] {
			turn += curvature * lb
		}
		if shear > tol[Transverse] && sec.shear > 0 {
			slide += shear * sec.shear / sec.flexuralRigidity * lb
		}
	}
	if e != nil && len(e.stretches) > 0 {
		// The largest |a·v + b| over the range r of v.
		size := func(r [2]extremum, a, b float64) float64 {
			return max(math.Abs(a*r[0].value+b), math.Abs(a*r[1].value+b))
		}
		for j, r := range e.stretchRanges() {
			st := &e.stretches[j]
			mid := st.start + 0.5*st.length
			sec := &s.sections[m.SegmentAt(mid)]
			ea, ei := sec.axialRigidity, sec.flexuralRigidity
			k, ka := m.foundationAt(mid)
			a, b := decayLengths(ea, ei, ka, k)
			la, lb := min(st.length, 2*a), min(st.length, 2*b)
			if ea > 0 && ei > 0 {
				add(sec, la, lb, size(r[QAxialForce], 1/ea, sec.thermalStrain), size(r[QBendingMoment], 1/ei, sec.thermalCurvature), size(r[QShearForce], 1, 0))
			}
		}
	} else {
		// u′ and θ′ are linear on an element (the bubble's u′ and the
		// curvature at its ends), V constant.
		for i, el := range s.Mesh.Elements {
			sec, g := &s.sections[el.Segment], &s.fields[i]
			h := el.End - el.Start
			add(sec, h, h, math.Abs(g.slope)+4*math.Abs(g.bubble)/h, max(math.Abs(g.curvature), math.Abs(g.curvature+g.third*h)), sec.flexuralRigidity*math.Abs(g.third))
		}
	}
	var motion [3]float64 // the largest motion of a support or a foundation, by Dof
	for _, r := range s.Reactions {
		sp := m.Supports[r.Support]
		for d := range Dof(3) {
			switch {
			case sp.Kind.Restrains(d) && r.Support < len(s.loads.Settlement):
				motion[d] = max(motion[d], math.Abs(s.loads.Settlement[r.Support][d]))
			case sp.Elastic(d) && math.Abs(r.Force[d]) > tol[d]:
				motion[d] = max(motion[d], math.Abs(r.Force[d])/sp.Stiffness[d])
			}
		}
	}
	for _, r := range s.Foundations {
		g, length := m.Foundations[r.Foundation], r.End-r.Start
		if length <= 0 {
			continue
		}
		if f := math.Abs(r.Force[0]); g.AxialModulus > 0 && f > tol[Axial] {
			motion[Axial] = max(motion[Axial], f/(g.AxialModulus*length))
		}
		if g.Modulus > 0 {
			var w float64
			if f := math.Abs(r.Force[1]); f > tol[Transverse] {
				w += f / (g.Modulus * length)
			}
			if c := math.Abs(r.Moment - r.Force[1]*0.5*(r.Start+r.End)); c > tol[Rotation] {
				w += 6 * c / (g.Modulus * length * length)
			}
			motion[Transverse] = max(motion[Transverse], w)
		}
	}
	return stretch + motion[Axial], L*turn + slide + max(motion[Transverse], motion[Rotation]*L)
}

// groundLengths are the lengths over which the forces along and across a
// member of m stretch and bend a segment of rigidities ea and ei: the
// member's length, or on an elastic foundation that holds the member the
// length over which the stiffest foundation spreads a force, if shorter
// (decayLengths). A stiff bed holds the deflection far under P·L³/EI,
// which would make a real deflection and its error round-off.
func groundLengths(m *Model, ea, ei float64) (along, across float64) {
	L := m.Length()
	along, across = L, L
	for _, g := range m.Foundations {
		a, b := decayLengths(ea, ei, g.AxialModulus, g.Modulus)
		along, across = min(along, a), min(across, b)
	}
	return along, across
}

// decayLengths are the lengths over which a bed of moduli ka along and k
// across spreads a force on a member of rigidities ea and ei, m:
// 1/α = √(EA/kₐ) along (the bar on an elastic bed, from memory) and
// 1/β = (4EI/k)^¼ across (Hetényi, Beams on Elastic Foundation: a force P
// deflects a long beam P·β/(2k) = P/(8EI·β³), from memory); infinite where
// the modulus is 0.
func decayLengths(ea, ei, ka, k float64) (along, across float64) {
	along, across = math.Inf(1), math.Inf(1)
	if ka > 0 {
		along = math.Sqrt(ea / ka)
	}
	if k > 0 {
		across = math.Sqrt(math.Sqrt(4 * ei / k))
	}
	return along, across
}

// LoadScales are the force (N), the stress of each segment (Pa, in the
// model's order) and the displacement (m) that the internal forces,
// stresses and displacements of s are at least measured against
// (forceFloor): what the loads, each support's action and the imposed
// deformations fully restrained make, and what the member's deformations
// make, read from its exact solution e (nil: from s). A value below a
// billionth of its scale is round-off, as the summary's extremes read it:
// where the loads go straight into the supports, the member carries
// nothing.
func (s *Solution) LoadScales(e *Exact) (force float64, stress []float64, displacement float64) {
	f := forceFloor(s, e)
	stress = make([]float64, len(f.segments))
	for i, sg := range f.segments {
		stress[i] = sg[0]
	}
	return f.all[0], stress, f.all[2]
}

// fieldScale is the size quantity q is measured against: its largest
// magnitude, from largest (each quantity's largest magnitude, in SI), unless
// that is negligible against the other fields of its kind — an axial force
// in a beam, a moment in a heated bar — and then the size of that kind:
// displacements max(|u|, |w|, |θ|·L), forces max(|N|, |V|, |M|/L) (L the
// member's length, m), stresses the largest of the three. So a field that
// is zero to round-off is not measured against its own round-off. Forces,
// stresses and displacements are of a kind at least floor (forceFloor):
// where the loads and imposed deformations go wholly into free motion (a
// determinate beam warmer below) every internal force is round-off, and
// where they are wholly restrained (a fixed-ended beam warmer below) every
// displacement is; each is measured against the size the loads would
// give, not against itself. Where the member has forces along it, its
// axial displacement, force and stress are their own problem's (linear
// theory): they are measured against what those forces make, not against
// the bending beside them, so that a real stretch of a few micrometres
// under a small pull is not read as round-off beside a deflection of tens
// of millimetres.
func fieldScale(q Quantity, largest *[quantityCount]float64, L float64, floor floorSizes) float64 {
	own := largest[q]
	var kind float64 // the size of q's kind, in q's unit
	k := -1          // which of the axial problem's sizes q is of, if it is
	switch q {
	case QAxialForce:
		k = 0
	case QAxialStress:
		k = 1
	case QAxialDisplacement:
		k = 2
	}
	switch {
	case k >= 0 && floor.axial[k] > 0:
		kind = max(own, floor.axial[k])
	case q == QAxialDisplacement || q == QDeflection || q == QRotation:
		kind = max(largest[QAxialDisplacement], largest[QDeflection], largest[QRotation]*L, floor.all[2])
		if q == QRotation {
			kind /= L
		}
	case q == QAxialForce || q == QShearForce || q == QBendingMoment:
		kind = max(largest[QAxialForce], largest[QShearForce], largest[QBendingMoment]/L, floor.all[0])
		if q == QBendingMoment {
			kind *= L
		}
	default:
		kind = max(largest[QAxialStress], largest[QBendingStress], largest[QCombinedStress], floor.all[1])
	}
	if own > negligible*kind {
		return own
	}
	return kind
}

// ImposedScales are the force and moment that the imposed deformations of
// m (temperature change and difference, settlements) would make if fully
// restrained: EA·α·ΔT, EI·α·ΔT/h, and the end actions of a fixed-ended
// member of the whole length under each settlement (beam tables, from
// memory). Where a determinate member takes them freely the reactions are
// round-off, and these, not that round-off, are the scale to judge their
// balance by.
func (m *Model) ImposedScales() (force, moment float64) {
	axial, across, moment := m.imposedScales()
	return max(axial, across), moment
}

// imposedScales are ImposedScales with the force split into the force
// along the member (temperature change, axial settlement) and the force
// across it (transverse settlement).
func (m *Model) imposedScales() (axial, across, moment float64) {
	L := m.Length()
	if L <= 0 {
		return 0, 0, 0
	}
	dT := math.Abs(m.TemperatureChange)
	for _, c := range m.Cases {
		dT = math.Max(dT, math.Abs(c.TemperatureChange))
	}
	ea, ei := 0.0, 0.0
	for _, sg := range m.Segments {
		a, e := sg.Material.ThermalExpansion, sg.Material.Elastic
		ea, ei = math.Max(ea, e*sg.Section.Area), math.Max(ei, e*sg.Section.SecondMoment)
		// The strain α·ΔT first: E·A·α may overflow where ΔT is 0.
		axial = math.Max(axial, e*sg.Section.Area*math.Abs(a*dT))
		if h := sg.Section.depth(); h > 0 {
			moment = math.Max(moment, e*sg.Section.SecondMoment*math.Abs(a*sg.TemperatureDifference)/h)
		}
	}
	for _, sp := range m.Supports {
		axial = math.Max(axial, ea*math.Abs(sp.Settlement[Axial])/L)
		across = math.Max(across, 12*ei*math.Abs(sp.Settlement[Transverse])/(L*L*L))
		moment = math.Max(moment, math.Max(6*ei*math.Abs(sp.Settlement[Transverse])/(L*L), 4*ei*math.Abs(sp.Settlement[Rotation])/L))
	}
	return axial, across, moment
}

// Summarizer gathers a Summary in a walk over a solution (a Visitor): the
// extremes of every quantity and, with an exact solution, the comparison
// with it. Summarize walks with one; a caller that walks for other
// consumers as well passes one to Walk beside them.
type Summarizer struct {
	solution   *Solution
	exact      *Exact // nil without an exact solution
	extremes   *extremes
	comparison *Comparison // nil without an exact solution
}

// NewSummarizer is an empty Summarizer of s, compared with e when e is not nil.
func NewSummarizer(s *Solution, e *Exact) *Summarizer {
	z := &Summarizer{solution: s, extremes: newExtremes(), comparison: NewComparison(s, e)}
	if e != nil && len(e.stretches) > 0 {
		z.exact = e
	}
	return z
}

func (z *Summarizer) Visit(v *ElementView) {
	z.extremes.Visit(v)
	if z.comparison != nil {
		z.comparison.Visit(v)
	}
}

func (z *Summarizer) Fork() Visitor {
	y := &Summarizer{solution: z.solution, exact: z.exact, extremes: newExtremes()}
	if z.comparison != nil {
		y.comparison = z.comparison.Fork().(*Comparison)
	}
	return y
}

func (z *Summarizer) Join(later Visitor) {
	y := later.(*Summarizer)
	z.extremes.Join(y.extremes)
	if z.comparison != nil {
		z.comparison.Join(y.comparison)
	}
}

// Comparison is the comparison with the exact solution gathered so far;
// nil when there is none.
func (z *Summarizer) Comparison() *Comparison { return z.comparison }

// Summarize collects reactions, extremes with positions, the actions at the
// supports inside the member, equilibrium, mesh size and, when e is not
// nil, the error against the exact solution, in one walk over the
// elements; with e the headline values are e's, the finite element ones
// beside them.
func Summarize(s *Solution, e *Exact) Summary {
	z := NewSummarizer(s, e)
	Walk(s, e, z)
	return z.Summary()
}

// Summary is what the walk gathered, with the reactions, the actions at
// the supports inside the member, equilibrium and mesh of the solution; the
// headline values are the exact solution's when the summarizer has one.
func (z *Summarizer) Summary() Summary {
	s := z.solution
	ex := z.exact
	sum := Summary{Exact: ex != nil}
	var exactReactions []Reaction
	if ex != nil {
		exactReactions = ex.reactions
	}
	sum.Reactions = make([]ReactionSummary, 0, len(s.Reactions))
	for i, r := range s.Reactions {
		rs := ReactionSummary{Support: r.Support + 1, X: r.X, FE: components(r.Force)}
		if r.Support >= 0 && r.Support < len(s.Model.Supports) {
			sup := s.Model.Supports[r.Support]
			rs.Kind = sup.Kind.String()
			for d := range rs.Holds {
				rs.Holds[d] = sup.Holds(Dof(d))
			}
		}
		rs.Components = rs.FE
		if i < len(exactReactions) {
			rs.Components = components(exactReactions[i].Force)
		}
		sum.Reactions = append(sum.Reactions, rs)
	}
	sum.Foundations = foundationSummaries(s, ex)
	sum.Extremes = z.extremes.list()
	var scales [quantityCount]float64
	if ex != nil {
		scales = withExact(sum.Extremes, ex.ownExtremes(), &s.Model, forceFloor(s, ex))
	}
	readExtremeSides(sum.Extremes, s, ex)
	sum.Supports = supportActions(s, ex)
	// The actions at the supports read round-off as zero as the extremes
	// do (the shear force at mid-length of a symmetric member under
	// symmetric loads).
	for i := range sum.Supports {
		a := &sum.Supports[i]
		dropRoundOffValues(scales[QShearForce], &a.Shear[0], &a.Shear[1], &a.FEShear[0], &a.FEShear[1])
		dropRoundOffValues(scales[QBendingMoment], &a.Moment[0], &a.Moment[1], &a.FEMoment[0], &a.FEMoment[1])
	}
	if s.AxialOnly {
		sum.axialOnly()
	}
	sum.FEEquilibrium = s.FEBalance(ex)
	sum.Equilibrium = sum.FEEquilibrium
	if ex != nil {
		force, moment := s.EquilibriumScales(ex)
		sum.Equilibrium = equilibriumSummary(ex.Balance(s.Equilibrium.Applied), force, moment)
	}
	if z.comparison != nil {
		norms := z.comparison.Norms()
		sum.ExactError = &norms
	}
	order := int(s.Model.Mesh.BarOrder)
	if order == 0 {
		order = int(LinearBar)
	}
	bar, beam := s.Model.Formulations()
	kinds := bar.Name() + " and " + beam.Name() + " elements"
	if s.AxialOnly {
		kinds = bar.Name() + " elements"
	}
	sum.Mesh = MeshSummary{
		Elements:  len(s.Mesh.Elements),
		Nodes:     len(s.Mesh.X),
		BarOrder:  order,
		Kinds:     kinds,
		Condition: s.Condition,
		Automatic: s.Mesh.Automatic,
		Note:      s.Mesh.Note,
	}
	return sum
}

// axialOnly leaves out of sum what a member solved as a bar alone does
// not have: the extremes of its bending quantities, the shear force and
// bending moment at its supports, and the supports' reactions across it
// and in rotation, which read as not held. The combined stress stays: it
// is the axial stress then.
func (sum *Summary) axialOnly() {
	kept := sum.Extremes[:0]
	for _, e := range sum.Extremes {
		switch e.Quantity {
		case QAxialDisplacement, QAxialForce, QAxialStress, QCombinedStress:
			kept = append(kept, e)
		}
	}
	sum.Extremes = kept
	sum.Supports = nil
	for i := range sum.Reactions {
		sum.Reactions[i].Holds[Transverse], sum.Reactions[i].Holds[Rotation] = false, false
	}
}

// supportActions are the shear force and bending moment on both sides of
// every support inside the member (not at its ends), in order along it:
// from e when not nil, with the finite element values of s beside.
func supportActions(s *Solution, e *Exact) []SupportActions {
	L := s.Model.Length()
	out := make([]SupportActions, 0, len(s.Model.Supports))
	for i, sup := range s.Model.Supports {
		if sup.X <= mergeTolerance*L || sup.X >= L*(1-mergeTolerance) {
			continue
		}
		a := SupportActions{Support: i + 1, Kind: sup.Kind.String(), X: sup.X}
		for k, side := range [2]Side{Left, Right} {
			f := s.At(sup.X, side)
			a.FEShear[k], a.FEMoment[k] = f.ShearForce, f.BendingMoment
			a.Shear[k], a.Moment[k] = a.FEShear[k], a.FEMoment[k]
			if e != nil {
				g := e.At(sup.X, side)
				a.Shear[k], a.Moment[k] = g.ShearForce, g.BendingMoment
			}
		}
		out = append(out, a)
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].X < out[j].X })
	return out
}

// foundationSummaries are what the foundations of s carry: from e when
// not nil, with the finite element resultants of s beside.
func foundationSummaries(s *Solution, e *Exact) []FoundationSummary {
	if len(s.Foundations) == 0 {
		return nil
	}
	var exact []FoundationReaction
	// The headline's round-off: the exact solution's own, or the FE's.
	condition := s.Condition
	if e != nil {
		exact = e.Foundations()
		condition = e.Condition
	}
	force, _ := s.EquilibriumScales(e)
	negligible := force * max(1e-9, 4*condition*0x1p-52)
	out := make([]FoundationSummary, len(s.Foundations))
	for i, r := range s.Foundations {
		f := s.Model.Foundations[r.Foundation]
		out[i] = FoundationSummary{Foundation: r.Foundation + 1, Start: r.Start, End: r.End,
			Holds: [2]bool{f.AxialModulus > 0, f.Modulus > 0}, Reaction: r, FE: r}
		if i < len(exact) {
			out[i].Reaction = exact[i]
		}
		g := out[i].Reaction
		out[i].nothingAcross = math.Abs(g.Force[1]) <= negligible
		out[i].couple = out[i].nothingAcross && math.Abs(g.Moment) > negligible*s.Model.Length()
	}
	return out
}

// FEBalance is the balance of the finite element solution s with its
// residual judged against EquilibriumScales(e), as Summary's
// FEEquilibrium, without the walk over the elements a summary takes.
func (s *Solution) FEBalance(e *Exact) EquilibriumSummary {
	force, moment := s.EquilibriumScales(e)
	return equilibriumSummary(s.Equilibrium, force, moment)
}

// RelativeWords is the largest residual relative to the loads (Relative)
// as every output writes it: "1.1e-16". Round-off of kilonewton loads in
// newtons, 9.095e-16 kN, is no news; its share of the loads says so.
func (e EquilibriumSummary) RelativeWords() string { return units.FormatG("%.1e", e.Relative) }

func equilibriumSummary(eq Equilibrium, force, moment float64) EquilibriumSummary {
	return EquilibriumSummary{
		Applied:   components(eq.Applied),
		Reactions: components(eq.Reactions),
		Ground:    components(eq.Ground),
		Residual:  components(eq.Residual),
		Relative:  relativeResidual(eq, force, moment),
	}
}

func components(v [3]float64) Components {
	return Components{Axial: v[0], Transverse: v[1], Moment: v[2]}
}

// relativeResidual scales the residual forces by force and the residual
// moment by moment (Solution.EquilibriumScales), so a residual of 1e-9 N
// under kilonewton loads reads as round-off, and so does a moment of
// 1e-11 N·m where the loads and reactions add up to no moment.
func relativeResidual(eq Equilibrium, force, moment float64) float64 {
	worst := 0.0
	for i, r := range eq.Residual {
		scale := force
		if i == 2 {
			scale = moment
		}
		if scale > 0 {
			worst = math.Max(worst, math.Abs(r)/scale)
		}
	}
	return worst
}

// EquilibriumScales are the force (N) and the moment about x = 0 (N·m)
// that the residuals of equilibrium are judged against: the largest of the
// loads, of their sizes added up without signs (Equilibrium.Sizes), of the
// reactions summed, of each support's and foundation's own force, which
// self-balancing actions (a temperature difference in a continuous beam,
// opposite couples) leave large while their sum is nothing, and of what the
// imposed deformations would make if fully restrained (ImposedScales), in
// the finite element solution s and, when e is not nil, the exact one. A
// moment is carried by forces and a force by moments, so each is at least
// the other over or times the member's length.
func (s *Solution) EquilibriumScales(e *Exact) (force, moment float64) {
	balances := []Equilibrium{s.Equilibrium}
	reactions := [][]Reaction{s.Reactions}
	if e != nil {
		balances = append(balances, e.Balance(s.Equilibrium.Applied))
		reactions = append(reactions, e.reactions)
	}
	for _, eq := range balances {
		for i := range 2 {
			force = max(force, math.Abs(eq.Applied[i]), math.Abs(eq.Reactions[i]))
		}
		moment = max(moment, math.Abs(eq.Applied[2]), math.Abs(eq.Reactions[2]))
	}
	force = max(force, s.Equilibrium.Sizes[0], s.Equilibrium.Sizes[1])
	moment = max(moment, s.Equilibrium.Sizes[2])
	for _, rs := range reactions {
		for _, r := range rs {
			force = max(force, math.Abs(r.Force[Axial]), math.Abs(r.Force[Transverse]))
			moment = max(moment, math.Abs(r.Force[Rotation]), math.Abs(r.X*r.Force[Transverse]))
		}
	}
	for _, g := range s.Foundations {
		force = max(force, math.Abs(g.Force[0]), math.Abs(g.Force[1]))
		moment = max(moment, math.Abs(g.Moment))
	}
	f, mo := s.Model.ImposedScales()
	force, moment = max(force, f), max(moment, mo)
	L := s.Model.Length()
	return max(force, moment/L), max(moment, force*L)
}

// Balance is the equilibrium of the exact reactions with applied, the
// resultant of the loads (Equilibrium.Applied of a solution of the same
// model).
func (e *Exact) Balance(applied [3]float64) Equilibrium {
	return equilibrium(applied, e.reactions, groundResultant(e.Foundations()))
}
