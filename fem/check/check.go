// Package check runs the checks an engineer makes on a solved member and
// reports each as a Result a newcomer can act on:
//
//   - stress utilisation per segment: max |combined stress| against the
//     allowable stress divided by a safety factor;
//   - deflection per span between transverse supports against span/n;
//   - Euler buckling of the parts in compression, with the effective length
//     factor recognised from the supports;
//   - equilibrium: applied loads against reactions;
//   - the finite element error against the exact solution;
//   - a handbook cross-check when the model is a standard case (Handbook).
//
// Results are an aid for checking only, never a code check or an approval:
// every Result carries Caution. Values are SI (as in package fem); messages
// are written in the display units of Options.Units.
package check

import (
	"math"
	"sort"

	"stave/fem"
	"stave/fem/units"
)

// Caution accompanies every result: the project's one caution.
const Caution = fem.Caution

// Status grades a result.
type Status int

// Statuses, from good to bad; Info is for checks that could not be made or
// that only report.
const (
	Pass Status = iota
	Info
	Warn
	Fail
)

var statusNames = [...]string{"pass", "info", "warn", "fail"}

// String names the status in lower case.
func (s Status) String() string { return nameOf(statusNames[:], int(s)) }

// nameOf returns names[i], or "unknown" for a value outside the list.
func nameOf(names []string, i int) string {
	if i < 0 || i >= len(names) {
		return "unknown"
	}
	return names[i]
}

// Kind says what a check judges.
type Kind int

// Kinds of check.
const (
	// Design checks judge the member against a limit: stress, deflection,
	// buckling. Failing one says the member is too weak, not that the
	// numbers are wrong.
	Design Kind = iota
	// Verification checks judge the answer itself: equilibrium, the error
	// against the exact solution, the handbook cross-check. Failing one
	// means the results should not be trusted as they stand.
	Verification
)

// Result is one check.
type Result struct {
	Name    string
	Kind    Kind
	Status  Status
	Message string  // what it means and what to look at, for someone new to the trade
	X       float64 // where to look, m
	Span    [2]float64
	Value   float64 // the checked value, SI (stress Pa, deflection m, force N...)
	Limit   float64 // what Value is checked against, SI
	Caution string
}

// Options set the limits of the checks. A zero field takes its default.
type Options struct {
	// SafetyFactor divides each segment's Allowable stress (default 1: the
	// value given is used as is, so give an allowable stress, or the yield
	// stress and a factor).
	SafetyFactor float64
	// SpanRatio is n in the deflection limit span/n for spans between
	// supports (default 360).
	SpanRatio float64
	// CantileverRatio is n in length/n for a cantilever or an overhang
	// (default 180).
	CantileverRatio float64
	// ErrorLimit is the largest relative stress error against the exact
	// solution that passes (default 0.01).
	ErrorLimit float64
	// HandbookTolerance is the largest relative difference from a handbook
	// value that passes (default 0.01).
	HandbookTolerance float64
	// Units is the display system for messages (default units.SI).
	Units units.System
}

// DefaultOptions are the limits Run uses for zero fields. The deflection
// ratios are common practice for floors and cantilevers (see
// DeflectionLimits); the 1 % tolerances are Stave's own choice, well below
// the uncertainty of loads and material data.
func DefaultOptions() Options {
	return Options{SafetyFactor: 1, SpanRatio: 360, CantileverRatio: 180,
		ErrorLimit: 0.01, HandbookTolerance: 0.01, Units: units.SI}
}

func (o Options) withDefaults() Options {
	d := DefaultOptions()
	pick := func(v *float64, def float64) {
		if !(*v > 0) {
			*v = def
		}
	}
	pick(&o.SafetyFactor, d.SafetyFactor)
	pick(&o.SpanRatio, d.SpanRatio)
	pick(&o.CantileverRatio, d.CantileverRatio)
	pick(&o.ErrorLimit, d.ErrorLimit)
	pick(&o.HandbookTolerance, d.HandbookTolerance)
	if o.Units.Name == "" {
		o.Units = d.Units
	}
	return o
}

// Run makes every check on model m with its finite element solution s and,
// when e is not nil, its exact solution. Stresses, deflections and axial
// forces are read from both solutions and the larger magnitude is used, so
// a coarse mesh cannot hide a peak between nodes.
func Run(m *fem.Model, s *fem.Solution, e *fem.Exact, opts Options) []Result {
	opts = opts.withDefaults()
	if m == nil || s == nil {
		return []Result{withCaution(Result{Name: "Checks", Status: Info,
			Message: "There is no solution to check yet: fix the model until it solves, then the checks run."})}
	}
	p := read(m, s, e)
	var out []Result
	out = append(out, stressChecks(p, opts)...)
	out = append(out, deflectionChecks(p, opts)...)
	out = append(out, bucklingChecks(p, opts)...)
	out = append(out, equilibriumChecks(m, s, opts)...)
	out = append(out, exactCheck(p, opts))
	out = append(out, handbookCheck(m, s, opts)...)
	for i := range out {
		out[i] = withCaution(out[i])
	}
	return out
}

func withCaution(r Result) Result {
	r.Caution = Caution
	return r
}

// peak is the value a check keeps, and where it occurs.
type peak struct{ value, x float64 }

// probe holds what the checks read from the solutions, gathered in one walk
// over the points where fem.CompareVisiting compares them: both solutions
// are read once per point and every check that covers the point takes its
// value there.
type probe struct {
	model   *fem.Model
	exact   *fem.Exact // nil when not available
	parts   []stretch  // spans and overhangs, for deflection
	columns []column   // parts checked for buckling
	// stress holds per segment the combined stress of largest magnitude
	// (signed), from whichever solution is larger there.
	stress []peak
	// deflection holds per part the largest |w − chord| (see chordLine).
	deflection []peak
	// compression holds per column the largest −N.
	compression []peak
	// stressError is the largest |σ_h − σ| against the exact solution.
	stressError peak
	// norms are the error norms against the exact solution.
	norms fem.ErrorNorms
}

// read walks the points of s (and e) once for every check.
func read(m *fem.Model, s *fem.Solution, e *fem.Exact) probe {
	p := probe{model: m, exact: e, parts: stretches(m), columns: columns(m)}
	els := s.Mesh.Elements
	p.stress = make([]peak, len(m.Segments))
	for i, seg := range m.Segments {
		p.stress[i].x = seg.Start
	}
	p.deflection = make([]peak, len(p.parts))
	p.compression = make([]peak, len(p.columns))
	for k, c := range p.columns {
		p.compression[k].x = c.a
	}
	p.stressError.value = -1
	partCover, columnCover := newCover(els, len(p.parts)), newCover(els, len(p.columns))
	// The support deflections of each part, per solution, for its chord.
	chords := make([][2]chordLine, len(p.parts))
	for k, st := range p.parts {
		partCover.set(k, st.a, st.b)
		chords[k][0] = newChord(s, st)
		if e != nil {
			chords[k][1] = newChord(e, st)
		}
	}
	for k, c := range p.columns {
		columnCover.set(k, c.a, c.b)
	}
	// The solutions in order, finite element first: a later one replaces an
	// earlier value only when strictly larger in magnitude.
	larger := func(fromFE, fromExact float64) float64 {
		best := 0.0
		if math.Abs(fromFE) > math.Abs(best) {
			best = fromFE
		}
		if e != nil && math.Abs(fromExact) > math.Abs(best) {
			best = fromExact
		}
		return best
	}
	var parts, cols []int
	element := -1
	var stress *peak
	p.norms = fem.CompareVisiting(s, e, func(pt *fem.ComparedPoint) {
		if pt.Element != element {
			element = pt.Element
			parts, cols = partCover.at(element, parts[:0]), columnCover.at(element, cols[:0])
			stress = &p.stress[els[element].Segment]
		}
		x, fe, ex := pt.X, &pt.FE, &pt.Exact
		if v := larger(fe.CombinedStress, ex.CombinedStress); math.Abs(v) > math.Abs(stress.value) {
			*stress = peak{v, x}
		}
		for _, k := range parts {
			c := &chords[k]
			v := larger(fe.Deflection-c[0].at(x), ex.Deflection-c[1].at(x))
			if math.Abs(v) > p.deflection[k].value {
				p.deflection[k] = peak{math.Abs(v), x}
			}
		}
		for _, k := range cols {
			if n := -fe.AxialForce; n > p.compression[k].value {
				p.compression[k] = peak{n, x}
			}
			if n := -ex.AxialForce; e != nil && n > p.compression[k].value {
				p.compression[k] = peak{n, x}
			}
		}
		if d := math.Abs(fe.CombinedStress - ex.CombinedStress); e != nil && d > p.stressError.value {
			p.stressError = peak{d, x}
		}
	})
	return p
}

// cover finds, element by element, which of a list of parts of the member
// (sorted along it, as stretches and columns are) an element overlaps. Part
// k covers the elements first[k] ≤ i < end[k], those with End > a and
// Start < b; both bounds grow with k, so a sliding window finds them.
type cover struct {
	els        []fem.Element
	first, end []int
	next       int // parts before next end before the current element
}

func newCover(els []fem.Element, parts int) cover {
	return cover{els: els, first: make([]int, parts), end: make([]int, parts)}
}

// set records the elements part k = [a, b] overlaps.
func (c *cover) set(k int, a, b float64) {
	c.first[k] = sort.Search(len(c.els), func(i int) bool { return c.els[i].End > a })
	c.end[k] = sort.Search(len(c.els), func(i int) bool { return c.els[i].Start >= b })
}

// at appends to dst the parts covering element i; i must not decrease
// between calls.
func (c *cover) at(i int, dst []int) []int {
	for c.next < len(c.end) && c.end[c.next] <= i {
		c.next++
	}
	for k := c.next; k < len(c.first) && c.first[k] <= i; k++ {
		if i < c.end[k] {
			dst = append(dst, k)
		}
	}
	return dst
}

func (p probe) fromWhat() string {
	if p.exact != nil {
		return "the larger of the finite element and exact solutions"
	}
	return "the finite element solution (no exact solution given: peaks between nodes may be missed; refine the mesh to be sure)"
}
