package fem

import "math"

// Extreme is the largest and smallest value of one result quantity along the
// member and where each occurs.
type Extreme struct {
	Quantity Quantity `json:"quantity"` // written as its Fields name, e.g. "BendingMoment"
	Unit     string   `json:"unit"`     // SI unit of Max and Min
	Max      float64  `json:"max"`
	XMax     float64  `json:"x_max"` // m
	Min      float64  `json:"min"`
	XMin     float64  `json:"x_min"` // m
}

// MeshSummary describes the discretisation a solution was computed on.
type MeshSummary struct {
	Elements  int     `json:"elements"`
	Nodes     int     `json:"nodes"`
	BarOrder  int     `json:"bar_order"`
	Condition float64 `json:"condition_estimate"`
}

// EquilibriumSummary is Equilibrium with named components for reports.
type EquilibriumSummary struct {
	Applied   Components `json:"applied"`
	Reactions Components `json:"reactions"`
	Residual  Components `json:"residual"`
	// Relative is the largest residual component divided by the largest applied
	// or reaction component of the same kind; it should be near round-off.
	Relative float64 `json:"relative"`
}

// Components are the three resultants of a force system: forces in N and the
// moment about x = 0 in N·m.
type Components struct {
	Axial      float64 `json:"axial"`
	Transverse float64 `json:"transverse"`
	Moment     float64 `json:"moment"`
}

// ReactionSummary is one support's reaction for reports.
type ReactionSummary struct {
	Support int     `json:"support"` // 1-based, as users count
	Kind    string  `json:"kind"`
	X       float64 `json:"x"`
	Components
}

// Summary gathers what an engineer reads first from a solution.
type Summary struct {
	Reactions   []ReactionSummary  `json:"reactions"`
	Extremes    []Extreme          `json:"extremes"`
	Equilibrium EquilibriumSummary `json:"equilibrium"`
	ExactError  *ErrorNorms        `json:"exact_error"` // nil when the exact solution is not available
	Mesh        MeshSummary        `json:"mesh"`
	Warnings    []string           `json:"warnings"`
}

// extremes gathers the largest and smallest value of every quantity along
// the member from the finite element fields, in closed form element by
// element (Interval.Range); a Visitor. At a node where a field jumps each
// element's own side counts, so the extreme is reported on the side where
// it is reached.
type extremes struct {
	lo, hi [quantityCount]Point
	seen   bool
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
	x0, x1 := fe.Start, fe.Start+fe.Length
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
	// Range, kept by the interval for the walk's other visitors.
	lo, hi := fe.Range(QCombinedStress)
	x.take(QCombinedStress, lo, hi)
}

// ends takes the values a at x0 and b at x1 of q, the first winning a tie.
func (x *extremes) ends(q Quantity, x0, a, x1, b float64) {
	lo, hi := &x.lo[q], &x.hi[q]
	if a < lo.Value {
		*lo = Point{x0, a}
	}
	if a > hi.Value {
		*hi = Point{x0, a}
	}
	if b < lo.Value {
		*lo = Point{x1, b}
	}
	if b > hi.Value {
		*hi = Point{x1, b}
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

// take keeps lo and hi where they are beyond the extremes of q so far.
func (x *extremes) take(q Quantity, lo, hi Point) {
	if lo.Value < x.lo[q].Value {
		x.lo[q] = lo
	}
	if hi.Value > x.hi[q].Value {
		x.hi[q] = hi
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

// list is the extremes in report order; all zero when no element was seen.
func (x *extremes) list() []Extreme {
	out := make([]Extreme, quantityCount)
	for i, q := range Quantities() {
		out[i] = Extreme{Quantity: q, Unit: q.Info().SI}
		if x.seen {
			out[i].Max, out[i].XMax = x.hi[q].Value, x.hi[q].X
			out[i].Min, out[i].XMin = x.lo[q].Value, x.lo[q].X
		}
	}
	return out
}

// Summarizer gathers a Summary in a walk over a solution (a Visitor): the
// extremes of every quantity and, with an exact solution, the comparison
// with it. Summarize walks with one; a caller that walks for other
// consumers as well passes one to Walk beside them.
type Summarizer struct {
	solution   *Solution
	extremes   *extremes
	comparison *Comparison // nil without an exact solution
}

// NewSummarizer is an empty Summarizer of s, compared with e when e is not nil.
func NewSummarizer(s *Solution, e *Exact) *Summarizer {
	return &Summarizer{solution: s, extremes: newExtremes(), comparison: NewComparison(s, e)}
}

func (z *Summarizer) Visit(v *ElementView) {
	z.extremes.Visit(v)
	if z.comparison != nil {
		z.comparison.Visit(v)
	}
}

func (z *Summarizer) Fork() Visitor {
	y := &Summarizer{solution: z.solution, extremes: newExtremes()}
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

// Summarize collects reactions, extremes with positions, equilibrium, mesh
// size and, when e is not nil, the error against the exact solution, in one
// walk over the elements.
func Summarize(s *Solution, e *Exact) Summary {
	z := NewSummarizer(s, e)
	Walk(s, e, z)
	return z.Summary()
}

// Summary is what the walk gathered, with the reactions, equilibrium, mesh
// and warnings of the solution.
func (z *Summarizer) Summary() Summary {
	s := z.solution
	var sum Summary
	for _, r := range s.Reactions {
		kind := ""
		if r.Support >= 0 && r.Support < len(s.Model.Supports) {
			kind = s.Model.Supports[r.Support].Kind.String()
		}
		sum.Reactions = append(sum.Reactions, ReactionSummary{
			Support: r.Support + 1, Kind: kind, X: r.X, Components: components(r.Force),
		})
	}
	sum.Extremes = z.extremes.list()
	eq := s.Equilibrium
	sum.Equilibrium = EquilibriumSummary{
		Applied:   components(eq.Applied),
		Reactions: components(eq.Reactions),
		Residual:  components(eq.Residual),
		Relative:  relativeResidual(eq),
	}
	if z.comparison != nil {
		norms := z.comparison.Norms()
		sum.ExactError = &norms
	}
	order := int(s.Model.Mesh.BarOrder)
	if order == 0 {
		order = int(LinearBar)
	}
	sum.Mesh = MeshSummary{
		Elements:  len(s.Mesh.Elements),
		Nodes:     len(s.Mesh.X),
		BarOrder:  order,
		Condition: s.Condition,
	}
	sum.Warnings = append(sum.Warnings, s.Warnings...)
	return sum
}

func components(v [3]float64) Components {
	return Components{Axial: v[0], Transverse: v[1], Moment: v[2]}
}

// relativeResidual scales each residual component by the size of the forces
// of its kind, so a residual of 1e-9 N under kilonewton loads reads as round-off.
func relativeResidual(eq Equilibrium) float64 {
	worst := 0.0
	for i := range eq.Residual {
		scale := math.Max(math.Abs(eq.Applied[i]), math.Abs(eq.Reactions[i]))
		if scale == 0 {
			continue
		}
		worst = math.Max(worst, math.Abs(eq.Residual[i])/scale)
	}
	return worst
}
