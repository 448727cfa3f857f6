package check

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"stave/fem"
	"stave/fem/units"
)

// EndCondition is how a support holds one end of a column.
type EndCondition int

// End conditions, from the restraints of the supports at that end.
const (
	Free    EndCondition = iota // neither deflection nor rotation held
	Pinned                      // deflection held, rotation free
	Fixed                       // deflection and rotation held
	Guided                      // rotation held, free to deflect sideways
	Elastic                     // a spring: the factor is not recognised
)

var endNames = [...]string{"free", "pinned", "fixed", "guided", "elastic"}

// String names the end condition.
func (c EndCondition) String() string { return nameOf(endNames[:], int(c)) }

// EffectiveLength is an effective length factor K for a pair of end
// conditions, theoretical and as recommended for design.
type EffectiveLength struct {
	Ends        [2]EndCondition
	Theoretical float64
	Design      float64 // recommended where ideal conditions are only approximated
	Source      string
}

// effectiveLengthSource is where the factors come from.
const effectiveLengthSource = "AISC Specification Commentary, Table C-A-7.1, case (%s) (from memory)"

// EffectiveLengths lists the factors for the end conditions the check
// recognises. The fixed–pinned theoretical value is the root of tan(kL) = kL,
// 0.699; the table prints 0.7.
func EffectiveLengths() []EffectiveLength {
	row := func(a, b EndCondition, theoretical, design float64, letter string) EffectiveLength {
		return EffectiveLength{[2]EndCondition{a, b}, theoretical, design, fmt.Sprintf(effectiveLengthSource, letter)}
	}
	return []EffectiveLength{
		row(Fixed, Fixed, 0.5, 0.65, "a"),
		row(Fixed, Pinned, 0.699, 0.8, "b"),
		row(Fixed, Guided, 1.0, 1.2, "c"),
		row(Fixed, Free, 2.0, 2.1, "d"),
		row(Pinned, Pinned, 1.0, 1.0, "e"),
		row(Pinned, Guided, 2.0, 2.0, "f"),
	}
}

// LookUpEffectiveLength finds the factor for two end conditions in either order.
func LookUpEffectiveLength(a, b EndCondition) (EffectiveLength, bool) {
	for _, k := range EffectiveLengths() {
		if (k.Ends[0] == a && k.Ends[1] == b) || (k.Ends[0] == b && k.Ends[1] == a) {
			return k, true
		}
	}
	return EffectiveLength{}, false
}

// EulerLoad is the elastic critical load π²EI/(KL)² of a prismatic column, N.
func EulerLoad(flexuralRigidity, factor, length float64) float64 {
	kl := factor * length
	return math.Pi * math.Pi * flexuralRigidity / (kl * kl)
}

// endConditionAt combines the supports at x into one end condition.
func endConditionAt(m *fem.Model, x float64) EndCondition { return restraintsAt(m, x).condition() }

// restraintsAt counts the restraints of the supports at x.
func restraintsAt(m *fem.Model, x float64) restraints {
	tol := 1e-9 * m.Length()
	var r restraints
	for _, s := range m.Supports {
		if math.Abs(s.X-x) > tol {
			continue // (a place that is not a number is taken as everywhere)
		}
		r.add(s, 1)
	}
	return r
}

// endConditions is endConditionAt(m, s.X) for every support s, in the
// order of m.Supports, found in one sweep over the supports sorted by
// position rather than one scan of all supports per support.
func endConditions(m *fem.Model) []EndCondition {
	out := make([]EndCondition, len(m.Supports))
	if slices.ContainsFunc(m.Supports, func(s fem.Support) bool { return math.IsNaN(s.X) || math.IsInf(s.X, 0) }) {
		// Such a place does not sort, and endConditionAt takes a support
		// there to be at every x: ask it.
		for i, s := range m.Supports {
			out[i] = endConditionAt(m, s.X)
		}
		return out
	}
	order := make([]int, len(m.Supports))
	for i := range order {
		order[i] = i
	}
	slices.SortFunc(order, func(a, b int) int { return cmp.Compare(m.Supports[a].X, m.Supports[b].X) })
	tol := 1e-9 * m.Length()
	var r restraints // of the supports order[lo:hi], those within tol of the current one
	lo, hi := 0, 0
	for _, i := range order {
		x := m.Supports[i].X
		for ; hi < len(order) && m.Supports[order[hi]].X-x <= tol; hi++ {
			r.add(m.Supports[order[hi]], 1)
		}
		for ; x-m.Supports[order[lo]].X > tol; lo++ {
			r.add(m.Supports[order[lo]], -1)
		}
		out[i] = r.condition()
	}
	return out
}

// restraints counts the supports that restrain deflection, rotation, and
// either by a spring.
type restraints struct{ deflection, rotation, spring int }

func (r *restraints) add(s fem.Support, n int) {
	if s.Kind.Restrains(fem.Transverse) {
		r.deflection += n
	}
	if s.Kind.Restrains(fem.Rotation) {
		r.rotation += n
	}
	if s.Elastic(fem.Transverse) || s.Elastic(fem.Rotation) {
		r.spring += n
	}
}

func (r restraints) condition() EndCondition {
	if r.spring > 0 && !(r.deflection > 0 && r.rotation > 0) {
		return Elastic
	}
	return r.rigid()
}

// rigid is the end condition of the rigid restraints alone, springs left
// out. A spring only stiffens a column (its strain energy adds to the
// Rayleigh quotient of the buckling load: Timoshenko & Gere, Theory of
// Elastic Stability, 2nd ed., ch. 2, energy method, from memory), so the
// column without it buckles no later: its factor is a conservative one.
func (r restraints) rigid() EndCondition {
	switch {
	case r.deflection > 0 && r.rotation > 0:
		return Fixed
	case r.deflection > 0:
		return Pinned
	case r.rotation > 0:
		return Guided
	}
	return Free
}

// column is a stretch to check for buckling with its factor.
type column struct {
	a, b   float64
	factor EffectiveLength
	known  bool
	note   string // how the factor was found
	// cantilever says the column is fixed at fixedAt (a or b) and free
	// at its other end, the case cantileverMultiplier solves.
	cantilever bool
	fixedAt    float64
}

// columns splits the member into the stretches to check. Without supports
// inside the member, the whole member is one column with its end
// conditions, a spring at an end left out (restraints.rigid). With supports
// inside, each span between supports is taken as pinned–pinned (K = 1),
// conservative because continuity and end fixity only shorten the buckling
// length, and an overhang from a support that holds rotation rigidly as
// fixed–free, a cantilever whatever holds the member beyond that support;
// springs along a span or an overhang are left out, which is conservative
// too. Other overhangs are not recognised, nor a column with a hinge
// inside, which lengthens the buckling length beyond what its ends give.
func columns(m *fem.Model) []column {
	L := m.Length()
	tol := 1e-9 * L
	inside := false
	for _, s := range m.Supports {
		holds := s.Holds(fem.Transverse) || s.Holds(fem.Rotation)
		inside = inside || (holds && s.X > tol && s.X < L-tol)
	}
	// hinged says a hinge inside [a, b] frees the member to turn there.
	hinged := func(a, b float64) bool {
		return slices.ContainsFunc(m.Hinges, func(h fem.Hinge) bool { return h.X > a+tol && h.X < b-tol })
	}
	const hingeNote = "a hinge inside it frees the member to turn there, which makes its buckling length longer than its ends give"
	if !inside {
		ra, rb := restraintsAt(m, 0), restraintsAt(m, L)
		a, b := ra.condition(), rb.condition()
		note := fmt.Sprintf("ends %s and %s", a, b)
		if a == Elastic || b == Elastic {
			a, b = ra.rigid(), rb.rigid()
			note += fmt.Sprintf(", taken as %s and %s: %s", a, b, springNote)
		}
		k, ok := LookUpEffectiveLength(a, b)
		c := column{a: 0, b: L, factor: k, known: ok, note: note}
		if a == Fixed && b == Free || a == Free && b == Fixed {
			c.cantilever = true
			if b == Fixed {
				c.fixedAt = L
			}
		}
		if hinged(0, L) {
			c.known, c.note = false, c.note+"; "+hingeNote
		}
		return []column{c}
	}
	pinned, _ := LookUpEffectiveLength(Pinned, Pinned)
	cantilever, _ := LookUpEffectiveLength(Fixed, Free)
	var out []column
	for _, st := range stretches(m, false) {
		c := column{a: st.a, b: st.b, factor: pinned, known: true,
			note: "a span between supports, taken as pinned at both ends (conservative: continuity over the supports only helps)"}
		support := st.a // where an overhang is held
		if !st.support[0] {
			support = st.b
		}
		switch {
		case hinged(st.a, st.b) && st.overhangs:
			c.known, c.note = false, "an overhang beyond a support; "+hingeNote
		case hinged(st.a, st.b):
			c.known, c.note = false, "a span between supports; "+hingeNote
		case st.overhangs && restraintsAt(m, support).rigid() == Fixed:
			c.cantilever, c.fixedAt = true, support
			c.factor, c.note = cantilever, "an overhang from a support that holds it fixed, taken as fixed there and free at its end whatever holds the member beyond the support (any spring along it is left out: "+springNote+")"
		case st.overhangs:
			c.known, c.note = false, "an overhang beyond a support that does not hold its rotation rigidly: not a standard case"
		}
		out = append(out, c)
	}
	return out
}

// springNote says why a column's springs are left out.
const springNote = "a spring only stiffens a column, so leaving it out is conservative"

// Columns are the stretches of m checked for buckling, from and to (m),
// each the Span of its check.
func Columns(m *fem.Model) [][2]float64 {
	var out [][2]float64
	for _, c := range columns(m) {
		out = append(out, [2]float64{c.a, c.b})
	}
	return out
}

// bucklingChecks compares the largest compression in each column with its
// Euler load.
func bucklingChecks(p *Probe, o Options) []Result {
	var out []Result
	roundOff := AxialRoundOff(p.model)
	h := p.headline()
	for k, c := range p.columns {
		compression, where := h.compression[k].value, h.compression[k].x
		if compression <= roundOff {
			continue // in tension, or compressed by round-off alone
		}
		span := fmt.Sprintf("%s to %s", o.Units.Format(units.Position, c.a), o.Units.Format(units.Position, c.b))
		r := Result{Name: "Buckling, " + span, Code: CodeBuckling, Unit: "N", Span: [2]float64{c.a, c.b}, X: where, Value: compression}
		p.beside(&r, p.fe.compression[k])
		force := o.Units.Format(units.Force, compression)
		if !c.known {
			r.Status = Info
			r.Message = fmt.Sprintf("This part carries up to %s of compression (from %s), but its buckling length is not a standard case (%s), so Euler buckling is not checked here: work out the effective length by hand.", force, p.fromWhat(), c.note)
			out = append(out, r)
			continue
		}
		rigidity, shear, stepped := smallestRigidity(p.model, c.a, c.b)
		length := c.b - c.a
		r.Limit = ShearReduced(EulerLoad(rigidity, c.factor.Design, length), shear)
		theoretical := ShearReduced(EulerLoad(rigidity, c.factor.Theoretical, length), shear)
		varies := compression-h.least[k] > 1e-6*compression
		multiplier, solved := 0.0, false
		if c.cantilever && varies && math.IsInf(shear, 1) {
			multiplier, solved = cantileverMultiplier(p.model, p.headlineField(), c, EulerLoad(rigidity, c.factor.Theoretical, length)/compression)
		}
		if solved {
			theoretical = multiplier * compression
			ratio := c.factor.Theoretical / c.factor.Design
			r.Limit = theoretical * ratio * ratio
		}
		utilisation := compression / r.Limit
		r.Status = Pass
		if utilisation > 1 {
			r.Status = Fail
		}
		figures := LimitFigures(o.Units, units.Force, compression, r.Limit)
		critical := "the Euler load π²EI/(KL)² = " + o.Units.FormatFigures(units.Force, r.Limit, figures)
		switch {
		case solved:
			critical = fmt.Sprintf("the critical compression %s of this column under the compression as it varies along it (%s), times (%.3g/%.3g)² for the design factor",
				o.Units.FormatFigures(units.Force, r.Limit, figures), cantileverSource, c.factor.Theoretical, c.factor.Design)
		case !math.IsInf(shear, 1):
			critical = fmt.Sprintf("the critical load Pe/(1 + Pe/(G·As)) = %s of a column that deforms in shear (Pe = π²EI/(KL)² = %s, G·As = %s; %s)",
				o.Units.FormatFigures(units.Force, r.Limit, figures), o.Units.Format(units.Force, EulerLoad(rigidity, c.factor.Design, length)), o.Units.Format(units.Force, shear), engesserSource)
		}
		r.Message = fmt.Sprintf("Utilisation %s: the largest compression %s at x = %s, from %s, against %s, with K = %.3g (recommended design value; theoretical K = %.3g gives %s) for %s; source: %s. %s",
			UtilisationText(utilisation), o.Units.FormatFigures(units.Force, compression, figures), o.Units.Format(units.Position, where), p.fromWhat(), critical,
			c.factor.Design, c.factor.Theoretical, o.Units.Format(units.Force, theoretical), c.note, c.factor.Source,
			p.feBeside(o, units.Force, compression, p.fe.compression[k]))
		switch {
		case solved:
			r.Message += fmt.Sprintf("The compression varies along this part (self-weight or loads along it): the column buckles when it is %.4g times what it is, with %s of compression at x = %s. ",
				multiplier, o.Units.Format(units.Force, theoretical), o.Units.Format(units.Position, where))
		case varies:
			r.Message += "The compression varies along this part (self-weight or loads along it): the largest is taken as acting all along, which is conservative. "
		}
		if stepped && !solved {
			r.Message += "The section changes along this part: the smallest EI (and G·As) is used, which is conservative. "
		}
		bound := "The Euler load"
		if solved || !math.IsInf(shear, 1) {
			bound = "The critical load"
		}
		r.Message += bound + " is an upper bound for a perfectly straight elastic column bent in the member's plane; real columns fail below it (initial crookedness, yielding), which design codes allow for with column curves. Buckling out of the plane, about the weak axis, or lateral-torsional buckling is not checked."
		out = append(out, r)
	}
	return out
}

// cantileverSource is where the critical load of a column fixed at one
// end and free at the other under a compression that varies comes from.
const cantileverSource = "the smallest λ for which (EI·θ')' + λ·N·θ = 0 holds with θ = 0 at the fixed end and θ' = 0 at the free one, θ the slope; under its own weight alone Greenhill's (qL)cr = 7.837·EI/L², Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §2.10 (from memory)"

// cantileverSteps is the number of Runge–Kutta steps along a column.
const cantileverSteps = 512

// cantileverMultiplier returns the factor λ by which the compression N
// along column c, fixed at c.fixedAt and free at its other end, as field f
// gives it, is multiplied at buckling: the smallest λ for which
// (EI·θ')' + λ·N·θ = 0 has a solution θ ≠ 0 with θ = 0 at the fixed end
// and EI·θ' = 0 at the free one (θ the slope; the free end takes no force
// across the member, so the column's equation (EI·w”)” + (N·w')' = 0
// integrates once: Timoshenko & Gere, Theory of Elastic Stability, 2nd ed.,
// §2.10, from memory). It takes classical Runge–Kutta steps from the fixed
// end between the model's key points, where N and EI are smooth, and
// brackets λ from lowest, a lower bound (the largest compression all along
// on the smallest EI), then bisects. False when no λ is found.
func cantileverMultiplier(m *fem.Model, f fem.Field, c column, lowest float64) (float64, bool) {
	type step struct{ h, ei, n0, n1, n2 float64 } // length, EI, compression at start, middle, end
	length := c.b - c.a
	tol := 1e-9 * m.Length()
	xs := []float64{c.a, c.b}
	for _, x := range fem.KeyPoints(m) {
		if x > c.a+tol && x < c.b-tol {
			xs = append(xs, x)
		}
	}
	slices.Sort(xs)
	xs = slices.Compact(xs)
	var steps []step
	for i := 1; i < len(xs); i++ {
		x0, x1 := xs[i-1], xs[i]
		seg := m.Segments[m.SegmentAt((x0+x1)/2)]
		ei := seg.Material.Elastic * seg.Section.SecondMoment
		n := max(4, int(math.Ceil(cantileverSteps*(x1-x0)/length)))
		h := (x1 - x0) / float64(n)
		compression := func(x float64, side fem.Side) float64 { return -f.At(x, side).AxialForce }
		for j := range n {
			start, end := x0+float64(j)*h, x0+float64(j+1)*h
			if j == n-1 {
				end = x1
			}
			steps = append(steps, step{h, ei, compression(start, fem.Right), compression((start+end)/2, fem.Right), compression(end, fem.Left)})
		}
	}
	if c.fixedAt == c.b { // walk from the fixed end
		slices.Reverse(steps)
		for i := range steps {
			steps[i].n0, steps[i].n2 = steps[i].n2, steps[i].n0
		}
	}
	// bent says whether EI·θ', 1 at the fixed end with θ = 0 there, falls
	// to zero anywhere along the column under λ·N. Where N ≥ 0 it does so
	// first at the free end, at the first λ, and beyond it for every larger
	// λ (Sturm's comparison theorem: its zeros move towards the fixed end
	// as λ grows), so the first λ is where bent turns true; a stretch in
	// tension can only make bent turn true earlier, which is conservative.
	bent := func(lambda float64) bool {
		theta, mu := 0.0, 1.0
		for _, s := range steps {
			d := func(theta, mu, n float64) (float64, float64) { return mu / s.ei, -lambda * n * theta }
			t1, m1 := d(theta, mu, s.n0)
			t2, m2 := d(theta+s.h/2*t1, mu+s.h/2*m1, s.n1)
			t3, m3 := d(theta+s.h/2*t2, mu+s.h/2*m2, s.n1)
			t4, m4 := d(theta+s.h*t3, mu+s.h*m3, s.n2)
			theta += s.h / 6 * (t1 + 2*t2 + 2*t3 + t4)
			mu += s.h / 6 * (m1 + 2*m2 + 2*m3 + m4)
			if mu <= 0 {
				return true
			}
		}
		return false
	}
	if !(lowest > 0) || math.IsInf(lowest, 0) {
		return 0, false
	}
	lo, hi := lowest, lowest
	if bent(lo) {
		return lo, true // the bound itself, to round-off
	}
	for i := 0; !bent(hi); i++ {
		if i == 200 {
			return 0, false
		}
		lo, hi = hi, 2*hi
	}
	for range 100 {
		mid := (lo + hi) / 2
		if mid <= lo || mid >= hi {
			break
		}
		if bent(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return lo, true
}

// headlineField is the solution the design checks judge: the exact one
// when there is one.
func (p *Probe) headlineField() fem.Field {
	if p.exact != nil {
		return p.exact
	}
	return p.solution
}

// engesserSource is where the critical load of a column that deforms in
// shear comes from.
const engesserSource = "Engesser's formula, Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §2.16 (from memory)"

// ShearReduced is the critical load of a column whose Euler load is euler
// and whose shear stiffness is shear = G·As (N), Pe/(1 + Pe/(G·As))
// (engesserSource); euler itself for a column rigid in shear (shear +Inf).
func ShearReduced(euler, shear float64) float64 {
	if math.IsInf(shear, 1) {
		return euler
	}
	return euler / (1 + euler/shear)
}

// smallestRigidity returns the smallest EI of the segments overlapping
// [a, b], the smallest shear stiffness G·As of those that deform in shear
// (+Inf when none does), and whether the section varies there.
func smallestRigidity(m *fem.Model, a, b float64) (ei, shear float64, varies bool) {
	ei, shear = math.Inf(1), math.Inf(1)
	largest, largestShear := 0.0, 0.0
	for _, s := range m.Segments {
		if s.End <= a || s.Start >= b {
			continue
		}
		r, gas := s.Material.Elastic*s.Section.SecondMoment, math.Inf(1)
		if f := s.ShearFlexibility(); f > 0 {
			gas = r / f
		}
		ei, largest = math.Min(ei, r), math.Max(largest, r)
		shear, largestShear = math.Min(shear, gas), math.Max(largestShear, gas)
	}
	return ei, shear, largest > ei || largestShear > shear
}

// negligible is the fraction of a force scale below which a force is
// round-off.
const negligible = 1e-9

// AxialRoundOff is the compression at or below which a column of m is
// taken as not compressed (round-off) and gets no buckling check, N.
func AxialRoundOff(m *fem.Model) float64 { return negligible * axialScale(m) }

// axialScale is the size of the axial forces m can carry, N: per load set
// (the model's own loads, or each case's: a model with cases has none of
// its own), its axial loads summed by magnitude and the largest thermal
// force EA·|αΔT|, summed over the load sets.
func axialScale(m *fem.Model) float64 {
	if len(m.Cases) == 0 {
		return loadSetAxialScale(m)
	}
	scale := 0.0
	for i := range m.Cases {
		set := m.LoadSet(i)
		scale += loadSetAxialScale(&set)
	}
	return scale
}

// loadSetAxialScale is axialScale of a model without cases.
func loadSetAxialScale(m *fem.Model) float64 {
	l := fem.GatherLoads(m, fem.KeyPoints(m))
	scale := 0.0
	for _, pl := range l.Points {
		scale += math.Abs(pl.Axial)
	}
	for j, p := range l.Axial {
		scale += (l.Keys[j+1] - l.Keys[j]) * (math.Abs(p[0]) + math.Abs(p[1])) / 2
	}
	thermal := 0.0
	for _, s := range m.Segments {
		thermal = max(thermal, s.Material.Elastic*s.Section.Area*math.Abs(s.Material.ThermalExpansion*l.TemperatureChange))
	}
	return max(scale, thermal)
}
