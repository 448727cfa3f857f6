package fem

import (
	"fmt"
	"math"
	"slices"
)

// Load cases and combinations. A member is checked under separate actions
// (permanent, imposed, snow, wind, temperature...) combined with the factors
// the engineer's local code sets. A model with Cases holds its loads there,
// not in its own load fields; a model without them has one load set, its
// own loads. Every case is solved on one Structure and one ExactStructure
// (one factorization each), and a combination is the linear combination of
// the case results, for the finite element answer and the exact solution
// alike (CombineSolutions, CombineExact). No code's factors are built in:
// the factors are the engineer's.

// LoadCase is one named set of actions.
type LoadCase struct {
	Name            string
	PointLoads      []PointLoad
	DistributedLoad []DistributedLoad
	// SelfWeight says the member's self-weight (Model.Gravity) acts in this case.
	SelfWeight bool
	// TemperatureChange is a uniform change of temperature in this case, K.
	TemperatureChange float64
	// Settlements says the supports' settlements (Support.Settlement) act
	// in this case.
	Settlements bool
	// ThermalGradient says the segments' temperature differences through
	// the depth (Segment.TemperatureDifference) act in this case.
	ThermalGradient bool
	// BySpan marks a load placed span by span (pattern loading): the
	// envelope takes, at every point, the arrangement of loaded spans that
	// is worst there (SpanLoads).
	BySpan bool
}

// CombinationKind says what a combination is for.
type CombinationKind int

// Kinds of combination.
const (
	Strength       CombinationKind = iota // ultimate limit state: forces and stresses
	Serviceability                        // serviceability: deflections
	OtherCombination
)

var combinationKindNames = [...]string{"strength", "serviceability", "other"}

// String names the kind as files and messages do.
func (k CombinationKind) String() string {
	if k < 0 || int(k) >= len(combinationKindNames) {
		return "unknown"
	}
	return combinationKindNames[k]
}

// ParseCombinationKind is the inverse of CombinationKind.String.
func ParseCombinationKind(s string) (CombinationKind, bool) {
	i := slices.Index(combinationKindNames[:], s)
	return CombinationKind(max(i, 0)), i >= 0
}

// Combination is a named linear combination of load cases.
type Combination struct {
	Name string
	Kind CombinationKind
	// Label is the engineer's word for the kind in their code, shown
	// instead of the kind's name when given.
	Label   string
	Factors []CaseFactor
	// Trains are moving load trains taken with the combination, each with
	// its factor, on top of its cases. They belong to the project (its
	// trains, by index), not to the model: fem solves the combination's
	// cases alone, and package moving adds the trains' envelopes.
	Trains []TrainFactor
}

// TrainFactor is one moving load train (an index into the project's
// trains) and its factor in a combination.
type TrainFactor struct {
	Train  int
	Factor float64
}

// CaseFactor is one load case (an index into Model.Cases) and its factor.
type CaseFactor struct {
	Case   int
	Factor float64
}

// LoadSetCount is the number of load sets m is solved for: its cases, or
// one (its own loads) when it has none.
func (m *Model) LoadSetCount() int { return max(len(m.Cases), 1) }

// LoadSetName names load set i: the case's name, or "loads" for a model
// without cases.
func (m *Model) LoadSetName(i int) string {
	if len(m.Cases) == 0 {
		return "loads"
	}
	return m.Cases[i].Name
}

// LoadSet is the model of load set i alone: the member and supports of m
// with that case's actions as its own loads (self-weight, temperature and
// settlements only where the case takes them), and no cases.
//
// Only the member and case i are copied, not the other cases and the
// combinations: the checks take a load set of every case for every
// combination, and copying the whole model each time made a model of 300
// cases and 300 combinations copy 300³ cases.
func (m *Model) LoadSet(i int) Model {
	if len(m.Cases) == 0 {
		return m.Clone()
	}
	member := *m
	member.Cases, member.Combinations = nil, nil
	c := member.Clone()
	lc := m.Cases[i]
	c.PointLoads, c.DistributedLoad = cloneLoads(lc.PointLoads, lc.DistributedLoad)
	c.TemperatureChange = lc.TemperatureChange
	if !lc.SelfWeight {
		c.Gravity = [2]float64{}
	}
	if !lc.Settlements {
		for k := range c.Supports {
			c.Supports[k].Settlement = [3]float64{}
		}
	}
	if !lc.ThermalGradient {
		for k := range c.Segments {
			c.Segments[k].TemperatureDifference = 0
		}
	}
	return c
}

// CaseLifted is m with case k's point and distributed loads and
// temperature change moved to its own load fields (and out of the case):
// the form in which the window edits case k and a drawing draws its
// loads. A model without cases is returned as it is.
func (m *Model) CaseLifted(k int) Model {
	c := m.Clone()
	if len(m.Cases) == 0 {
		return c
	}
	k = min(max(k, 0), len(c.Cases)-1)
	lc := &c.Cases[k]
	c.PointLoads, c.DistributedLoad, c.TemperatureChange = lc.PointLoads, lc.DistributedLoad, lc.TemperatureChange
	lc.PointLoads, lc.DistributedLoad, lc.TemperatureChange = nil, nil, 0
	return c
}

// gatherLoadSets gathers every load set of m on keys.
func gatherLoadSets(m *Model, keys []float64) []Loads {
	out := make([]Loads, m.LoadSetCount())
	for i := range out {
		set := m.LoadSet(i)
		out[i] = GatherLoads(&set, keys)
	}
	return out
}

// LoadSets are the member's load sets (its cases, or its own loads),
// gathered on its key points: the loads to give its Structure and
// ExactStructure. They are shared, not copied: do not change them.
func (p *Member) LoadSets() []Loads { return p.loadSets }

// SolveLoadSets solves every load set of the member on mesh with one
// factorization: the finite element solutions, in the order of the cases.
func (p *Member) SolveLoadSets(mesh Mesh) ([]*Solution, error) {
	st, err := p.Structure(mesh)
	if err != nil {
		return nil, err
	}
	out := make([]*Solution, len(p.loadSets))
	for i := range p.loadSets {
		if out[i], err = st.Solve(&p.loadSets[i]); err != nil {
			return nil, fmt.Errorf("load case %q: %w", p.model.LoadSetName(i), err)
		}
	}
	return out, nil
}

// ExactLoadSets solves every load set of the member in closed form with one
// factorization, in the order of the cases.
func (p *Member) ExactLoadSets() ([]*Exact, error) {
	es, err := p.ExactStructure()
	if err != nil {
		return nil, err
	}
	out := make([]*Exact, len(p.loadSets))
	for i := range p.loadSets {
		if out[i], err = es.Solve(&p.loadSets[i]); err != nil {
			return nil, fmt.Errorf("load case %q: %w", p.model.LoadSetName(i), err)
		}
	}
	return out, nil
}

// CombineSolutions is Σ factors[i]·sols[i] for solutions of one Structure
// (the load sets of one member on one mesh): displacements, fields,
// reactions and equilibrium combine linearly; the strain energy, which does
// not, is left zero. The warnings are all of the solutions', once each.
func CombineSolutions(sols []*Solution, factors []float64) (*Solution, error) {
	if len(sols) == 0 || len(sols) != len(factors) {
		return nil, fmt.Errorf("fem: %d solutions for %d factors: give one factor per solution", len(sols), len(factors))
	}
	first := sols[0]
	out := &Solution{Model: first.Model, Mesh: first.Mesh, sections: first.sections, barOrder: first.barOrder, AxialOnly: first.AxialOnly,
		Displacement: make([][3]float64, len(first.Displacement)),
		Reactions:    make([]Reaction, len(first.Reactions)),
		fields:       make([]elementField, len(first.fields))}
	sets := make([]Loads, len(sols))
	for k, s := range sols {
		sets[k] = s.loads
	}
	var err error
	if out.loads, err = CombineLoads(sets, factors); err != nil {
		return nil, err
	}
	copy(out.Reactions, first.Reactions)
	for i := range out.Reactions {
		out.Reactions[i].Force = [3]float64{}
	}
	if first.Foundations != nil {
		out.Foundations = make([]FoundationReaction, len(first.Foundations))
		for i, r := range first.Foundations {
			out.Foundations[i] = FoundationReaction{Foundation: r.Foundation, Start: r.Start, End: r.End}
		}
	}
	for k, s := range sols {
		if len(s.Displacement) != len(out.Displacement) || len(s.Reactions) != len(out.Reactions) || &s.Mesh.X[0] != &first.Mesh.X[0] {
			return nil, fmt.Errorf("fem: solution %d was not found on the same structure as the first: solve every load set on one Structure", k+1)
		}
		f := factors[k]
		out.Condition = max(out.Condition, s.Condition)
		out.AxialOnly = out.AxialOnly && s.AxialOnly
		for _, w := range s.Warnings {
			if !slices.Contains(out.Warnings, w) {
				out.Warnings = append(out.Warnings, w)
			}
		}
		for i, d := range s.Displacement {
			for j := range d {
				out.Displacement[i][j] += f * d[j]
			}
		}
		for i, g := range s.fields {
			o := &out.fields[i]
			o.slope += f * g.slope
			o.bubble += f * g.bubble
			o.curvature += f * g.curvature
			o.third += f * g.third
		}
		for i, r := range s.Reactions {
			for j := range r.Force {
				out.Reactions[i].Force[j] += f * r.Force[j]
			}
		}
		for i, r := range s.Foundations {
			o := &out.Foundations[i]
			o.Force[0] += f * r.Force[0]
			o.Force[1] += f * r.Force[1]
			o.Moment += f * r.Moment
		}
		for e, r := range s.releasedStart {
			if out.releasedStart == nil {
				out.releasedStart = map[int]float64{}
			}
			out.releasedStart[e] += f * r
		}
		for j := range 3 {
			out.Equilibrium.Applied[j] += f * s.Equilibrium.Applied[j]
			out.Equilibrium.Reactions[j] += f * s.Equilibrium.Reactions[j]
			out.Equilibrium.Ground[j] += f * s.Equilibrium.Ground[j]
			out.Equilibrium.Sizes[j] += math.Abs(f) * s.Equilibrium.Sizes[j]
		}
	}
	// The thermal strain is a load: combine it too.
	out.sections = slices.Clone(first.sections)
	for i := range out.sections {
		out.sections[i].thermalStrain, out.sections[i].thermalCurvature = 0, 0
		for k, s := range sols {
			out.sections[i].thermalStrain += factors[k] * s.sections[i].thermalStrain
			out.sections[i].thermalCurvature += factors[k] * s.sections[i].thermalCurvature
		}
	}
	for j := range 3 {
		out.Equilibrium.Residual[j] = out.Equilibrium.Applied[j] + out.Equilibrium.Reactions[j]
	}
	// The strain energy is not linear in the factors: it is found again,
	// and results whose squares overflow (a factor of 1e300 on a case) are
	// refused, as Solve refuses them.
	energy := 0.0
	for i, el := range out.Mesh.Elements {
		energy += out.sections[el.Segment].energy(el.End-el.Start, out.fields[i])
	}
	out.StrainEnergy = 0.5 * energy
	if !isFinite(out.StrainEnergy) {
		return nil, errNotFinite
	}
	if err := checkUnderflow(out); err != nil {
		return nil, err
	}
	return out, nil
}

// CombineExact is Σ factors[i]·exacts[i] for exact solutions of one
// ExactStructure: every stretch's constants, particular parts, thermal
// offsets, line loads (for the shear terms) and the reactions combine
// linearly.
func CombineExact(exacts []*Exact, factors []float64) (*Exact, error) {
	if len(exacts) == 0 || len(exacts) != len(factors) {
		return nil, fmt.Errorf("fem: %d exact solutions for %d factors: give one factor per solution", len(exacts), len(factors))
	}
	first := exacts[0]
	out := &Exact{Condition: first.Condition, model: first.model, keys: first.keys, stretches: make([]exactStretch, len(first.stretches)), reactions: make([]Reaction, len(first.reactions))}
	for j, s := range first.stretches {
		o := &out.stretches[j]
		*o = s
		o.thermalStrain, o.load, o.axialLoad = 0, [2]float64{}, [2]float64{}
		o.bar.offset, o.bar.coeff = 0, make([]float64, len(s.bar.coeff))
		o.beam.offset, o.beam.coeff = 0, make([]float64, len(s.beam.coeff))
	}
	for i, r := range first.reactions {
		out.reactions[i] = Reaction{Support: r.Support, X: r.X}
	}
	for k, e := range exacts {
		if len(e.stretches) != len(out.stretches) || &e.keys[0] != &first.keys[0] {
			return nil, fmt.Errorf("fem: exact solution %d was not found on the same structure as the first: solve every load set on one ExactStructure", k+1)
		}
		f := factors[k]
		for j := range e.stretches {
			s, o := &e.stretches[j], &out.stretches[j]
			o.thermalStrain += f * s.thermalStrain
			for i := range 2 {
				o.load[i] += f * s.load[i]
				o.axialLoad[i] += f * s.axialLoad[i]
			}
			o.bar.offset += f * s.bar.offset
			o.beam.offset += f * s.beam.offset
			for c := range s.bar.coeff {
				o.bar.coeff[c] += f * s.bar.coeff[c]
			}
			for c := range s.beam.coeff {
				o.beam.coeff[c] += f * s.beam.coeff[c]
			}
		}
		for i, r := range e.reactions {
			for d := range r.Force {
				out.reactions[i].Force[d] += f * r.Force[d]
			}
		}
	}
	return out, nil
}

// Spans are the stretches of the member between neighbouring supports that
// hold it across (rigidly or by a spring), with the overhangs beyond the
// first and last such support, in order; pattern loading loads them one by
// one.
func (m *Model) Spans() [][2]float64 {
	var at []float64
	for _, s := range m.Supports {
		if s.Holds(Transverse) {
			at = append(at, s.X)
		}
	}
	slices.Sort(at)
	L := m.Length()
	tol := mergeTolerance * L
	edges := []float64{0}
	for _, x := range append(at, L) {
		if x-edges[len(edges)-1] > tol {
			edges = append(edges, x)
		}
	}
	edges[len(edges)-1] = L
	spans := make([][2]float64, len(edges)-1)
	for i := range spans {
		spans[i] = [2]float64{edges[i], edges[i+1]}
	}
	return spans
}

// SpanLoads splits case c's point and distributed loads by the member's
// spans: the model of each span's share alone (LoadSet of the case with its
// loads clipped to the span). A point load at a support goes with the span
// on its right, at the far end with the last. The shares add up to the
// case, so the results of any arrangement of loaded spans are the sum of
// those of its spans. Self-weight, temperature and settlements are not
// placed by span and stay out of the shares.
func (m *Model) SpanLoads(c int) []Model {
	spans := m.Spans()
	out := make([]Model, len(spans))
	base := m.LoadSet(c)
	base.Gravity, base.TemperatureChange = [2]float64{}, 0
	for k := range base.Supports {
		base.Supports[k].Settlement = [3]float64{}
	}
	for k := range base.Segments {
		base.Segments[k].TemperatureDifference = 0
	}
	for k, sp := range spans {
		share := base.Clone()
		share.PointLoads, share.DistributedLoad = nil, nil
		last := k == len(spans)-1
		for _, p := range base.PointLoads {
			if p.X >= sp[0] && (p.X < sp[1] || last) {
				share.PointLoads = append(share.PointLoads, p)
			}
		}
		for _, d := range base.DistributedLoad {
			if clipped, ok := clipLoad(d, sp[0], sp[1]); ok {
				share.DistributedLoad = append(share.DistributedLoad, clipped)
			}
		}
		out[k] = share
	}
	return out
}

// clipLoad is the part of d over [a, b], or false when none of it lies there.
func clipLoad(d DistributedLoad, a, b float64) (DistributedLoad, bool) {
	out := DistributedLoad{Direction: d.Direction}
	for k := 1; k < len(d.Points); k++ {
		p, q := d.Points[k-1], d.Points[k]
		lo, hi := max(p.X, a), min(q.X, b)
		if !(hi > lo) {
			continue
		}
		at := func(x float64) LoadPoint {
			return LoadPoint{X: x, Intensity: linearBetween(p.X, q.X, p.Intensity, q.Intensity, x)}
		}
		if n := len(out.Points); n == 0 || out.Points[n-1] != at(lo) {
			out.Points = append(out.Points, at(lo)) // a start, or a step
		}
		out.Points = append(out.Points, at(hi))
	}
	return out, len(out.Points) >= 2
}
