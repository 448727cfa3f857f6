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

	"stave/fem"
	"stave/fem/units"
)

// Caution accompanies every result.
const Caution = "Stave's results are an aid for checking only. A qualified engineer must review them; local codes and licensed practice govern."

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

// Result is one check.
type Result struct {
	Name    string
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
	p := newProbe(m, s, e)
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

// probe reads the fields of the solutions at sample points.
type probe struct {
	model    *fem.Model
	solution *fem.Solution
	exact    *fem.Exact  // nil when not available
	sources  []fem.Field // the solution, then the exact solution if any
}

// perElement is how many intervals each element is sampled in; eight
// resolves the quintic exact deflection well inside the 1 % the checks work to.
const perElement = 8

func newProbe(m *fem.Model, s *fem.Solution, e *fem.Exact) probe {
	p := probe{model: m, solution: s, exact: e, sources: []fem.Field{s}}
	if e != nil {
		p.sources = append(p.sources, e)
	}
	return p
}

// point is a sample position seen from inside one element.
type point struct {
	x       float64
	side    fem.Side
	segment int
}

// points lists the sample points of the elements that overlap [a, b].
func (p probe) points(a, b float64) []point {
	var out []point
	for _, el := range p.solution.Mesh.Elements {
		if el.End <= a || el.Start >= b {
			continue
		}
		for j := 0; j <= perElement; j++ {
			x, side := el.Start+(el.End-el.Start)*float64(j)/perElement, fem.Right
			if j == perElement {
				x, side = el.End, fem.Left
			}
			out = append(out, point{x, side, el.Segment})
		}
	}
	return out
}

// largest returns the value of f, over all sources, with the largest
// magnitude at pt; f gets the source too, to read it elsewhere.
func (p probe) largest(pt point, f func(src fem.Field, at fem.Fields) float64) float64 {
	best := 0.0
	for _, src := range p.sources {
		if v := f(src, src.At(pt.x, pt.side)); math.Abs(v) > math.Abs(best) {
			best = v
		}
	}
	return best
}

func (p probe) fromWhat() string {
	if p.exact != nil {
		return "the larger of the finite element and exact solutions"
	}
	return "the finite element solution (no exact solution given: peaks between nodes may be missed; refine the mesh to be sure)"
}
