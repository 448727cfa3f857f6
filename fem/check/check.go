// Package check runs the checks an engineer makes on a solved member and
// reports each as a Result a newcomer can act on:
//
//   - stress utilisation per segment: max |combined stress| against the
//     allowable stress divided by a safety factor;
//   - deflection per span between transverse supports against span/n;
//   - Euler buckling of the parts in compression, with the effective length
//     factor recognised from the supports (springs left out, which is
//     conservative), and a column fixed at one end and free at the other
//     under a compression that varies solved for that compression;
//   - equilibrium: applied loads against reactions;
//   - the finite element error against the exact solution;
//   - a handbook cross-check when the model is a standard case (Handbook).
//
// The design checks (stress, deflection, buckling) judge the exact solution
// of the model when there is one: it is the model's own response, free of
// the mesh's discretisation error, so a coarse mesh neither hides a peak
// between nodes nor fails a member the model does not overload. The finite
// element value is reported beside it (Result.FE, and in the message), and
// the error of the finite element answer is a check of its own. Without an
// exact solution they judge the finite element solution and say so.
//
// Results are an aid for checking only, never a code check or an approval:
// every Result carries Caution. Values are SI (as in package fem); messages
// are written in the display units of Options.Units.
package check

import (
	"fmt"
	"iter"
	"math"
	"sort"
	"strconv"

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

// Codes name each check for programs, stable across releases.
const (
	CodeStress      = "stress"
	CodeDeflection  = "deflection"
	CodeBuckling    = "buckling"
	CodeEquilibrium = "equilibrium"
	CodeExactError  = "exact_error"
	CodeHandbook    = "handbook"
)

// Result is one check.
type Result struct {
	Name    string
	Code    string // which check: CodeStress, CodeDeflection...
	Kind    Kind
	Status  Status
	Message string  // what it means and what to look at, for someone new to the trade
	X       float64 // where to look, m
	Span    [2]float64
	Value   float64 // the checked value, SI (stress Pa, deflection m, force N...)
	Limit   float64 // what Value is checked against, SI
	// SpanRatio is n of a deflection check's limit span/n, as the options
	// give it (Limit is the span over it); 0 for the other checks.
	SpanRatio float64
	Unit      string // the SI unit of Value and Limit; "" for a ratio
	// Exact says Value is read from the exact solution; FE and FEX are then
	// the finite element value and where it is (m), for the checks that read
	// a peak or a handbook quantity (HasFE).
	Exact   bool
	FE, FEX float64
	HasFE   bool
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
// forces are read from both solutions; the design checks judge the exact
// ones when there are any (see the package comment) and report the finite
// element ones beside them. It walks the elements once for its probes and
// the comparison with the exact solution; a caller that walks them for
// other consumers too uses NewProbe and Probe.Results.
func Run(m *fem.Model, s *fem.Solution, e *fem.Exact, opts Options) []Result {
	if m == nil || s == nil {
		return []Result{withCaution(Result{Name: "Checks", Status: Info,
			Message: "There is no solution to check yet: fix the model until it solves, then the checks run."})}
	}
	p := NewProbe(m, s, e)
	c := fem.NewComparison(s, e)
	if c == nil {
		fem.Walk(s, e, p)
	} else {
		fem.Walk(s, e, p, c)
	}
	return p.Results(c, opts)
}

// Results makes every check from what p gathered in a walk over all the
// elements and c, the comparison with the exact solution gathered in the
// same walk (nil when there is no exact solution).
func (p *Probe) Results(c *fem.Comparison, opts Options) []Result {
	opts = opts.withDefaults()
	p.foldExact()
	p.dropRoundOff()
	if c != nil {
		p.norms, p.stressErrorAt = c.Norms(), c.WorstStress()
	}
	var out []Result
	out = append(out, stressChecks(p, opts)...)
	out = append(out, deflectionChecks(p, opts)...)
	out = append(out, bucklingChecks(p, opts)...)
	out = append(out, equilibriumChecks(p.model, p.solution, p.exact, opts)...)
	out = append(out, exactCheck(p, opts))
	out = append(out, handbookCheck(p.model, p.solution, p.exact, opts)...)
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

// peaks are the values the design checks read from one solution.
type peaks struct {
	// stress holds per segment the combined stress of largest magnitude (signed).
	stress []peak
	// deflection holds per part the largest |w − chord| (see chordLine).
	deflection []peak
	// compression holds per column the largest −N, and least its
	// smallest (negative where the column is in tension somewhere).
	compression []peak
	least       []float64
}

// Probe holds what the checks read from the solutions, in closed form: the
// finite element solution element by element in a walk (it is a
// fem.Visitor), the exact solution stretch by stretch between key points,
// where each of its fields is one polynomial. Every check that covers an
// element or a stretch takes its extreme there.
type Probe struct {
	model    *fem.Model
	solution *fem.Solution
	exact    *fem.Exact // nil when not available
	parts    []stretch  // spans and overhangs, for deflection
	columns  []column   // parts checked for buckling
	// chords are the support deflections of each part, per solution.
	chords                 [][2]chordLine
	partCover, columnCover cover
	covered                []int // scratch for the parts or columns covering an element

	// fe holds the peaks of the finite element solution, taken in the
	// walk; exact those of the exact solution (Results).
	fe, ex peaks

	// From the comparison with the exact solution (Results): the error
	// norms and where the largest stress error is.
	norms         fem.ErrorNorms
	stressErrorAt float64
}

// NewProbe is an empty probe of model m, its finite element solution s and
// its exact solution e (nil when not available), to be shown every element
// of s in a walk (fem.Walk) before its Results are read.
func NewProbe(m *fem.Model, s *fem.Solution, e *fem.Exact) *Probe {
	p := &Probe{model: m, solution: s, exact: e, parts: stretches(m, true), columns: columns(m)}
	els := s.Mesh.Elements
	p.partCover, p.columnCover = newCover(els, len(p.parts)), newCover(els, len(p.columns))
	p.chords = make([][2]chordLine, len(p.parts))
	tilts := settlementTilts(s, m, p.parts)
	for k, st := range p.parts {
		p.partCover.set(k, st.a, st.b)
		p.chords[k][0] = newChord(s, st, tilts[k])
		if e != nil {
			p.chords[k][1] = newChord(e, st, tilts[k])
		}
	}
	for k, c := range p.columns {
		p.columnCover.set(k, c.a, c.b)
	}
	p.reset()
	return p
}

// reset empties the peaks.
func (p *Probe) reset() {
	p.fe, p.ex = p.newPeaks(), p.newPeaks()
}

// newPeaks are empty peaks, each at the start of its part of the member.
func (p *Probe) newPeaks() peaks {
	k := peaks{stress: make([]peak, len(p.model.Segments)), deflection: make([]peak, len(p.parts)),
		compression: make([]peak, len(p.columns)), least: make([]float64, len(p.columns))}
	for i := range k.least {
		k.least[i] = math.Inf(1)
	}
	for i, seg := range p.model.Segments {
		k.stress[i].x = seg.Start
	}
	for i, c := range p.columns {
		k.compression[i].x = c.a
	}
	return k
}

// headline are the peaks the design checks judge: the exact solution's
// when there is one.
func (p *Probe) headline() *peaks {
	if p.exact != nil {
		return &p.ex
	}
	return &p.fe
}

// beside sets r's finite element value beside an exact one.
func (p *Probe) beside(r *Result, fe peak) {
	r.Exact = p.exact != nil
	if r.Exact {
		r.FE, r.FEX, r.HasFE = fe.value, fe.x, true
	}
}

// Visit takes the finite element peaks of one element.
func (p *Probe) Visit(v *fem.ElementView) {
	fe := &v.FE
	p.fe.takeStress(v.Segment, fe)
	p.covered = p.partCover.at(v.Index, p.covered[:0])
	for _, k := range p.covered {
		p.fe.takeDeflection(k, fe, &p.chords[k][0])
	}
	p.covered = p.columnCover.at(v.Index, p.covered[:0])
	for _, k := range p.covered {
		p.fe.takeCompression(k, fe)
	}
}

// Fork is an empty probe of the same solutions for a later part of the member.
func (p *Probe) Fork() fem.Visitor {
	q := *p
	q.partCover, q.columnCover = p.partCover.fresh(), p.columnCover.fresh()
	q.covered = nil
	q.reset()
	return &q
}

// Join takes the peaks of later, which saw the elements after p's.
func (p *Probe) Join(later fem.Visitor) {
	q := later.(*Probe)
	a, b := &p.fe, &q.fe
	for i, pk := range b.stress {
		if math.Abs(pk.value) > math.Abs(a.stress[i].value) {
			a.stress[i] = pk
		}
	}
	for k, pk := range b.deflection {
		if pk.value > a.deflection[k].value {
			a.deflection[k] = pk
		}
	}
	for k, pk := range b.compression {
		if pk.value > a.compression[k].value {
			a.compression[k] = pk
		}
		a.least[k] = min(a.least[k], b.least[k])
	}
}

// dropRoundOff zeroes the stresses and deflections of both solutions'
// peaks that are round-off against the loads' scale
// (fem.Solution.LoadScales), a stress against its own segment's, a
// deflection against what the member's deformations make (read from the
// exact solution where there is one): where the loads go straight into the
// supports the member carries nothing, and
// 1e-13 Pa is no stress (nor a difference of 100 % between two such
// values).
func (p *Probe) dropRoundOff() {
	_, stress, displacement := p.solution.LoadScales(p.exact)
	for _, k := range []*peaks{&p.fe, &p.ex} {
		for i := range k.stress {
			if math.Abs(k.stress[i].value) <= negligible*stress[i] {
				k.stress[i].value = 0
			}
		}
		for i := range k.deflection {
			if math.Abs(k.deflection[i].value) <= negligible*displacement {
				k.deflection[i].value = 0
			}
		}
	}
}

// foldExact takes the exact solution's peaks, stretch by stretch.
func (p *Probe) foldExact() {
	if p.exact == nil {
		return
	}
	p.ex = p.newPeaks()
	var parts, columns sweep
	for _, iv := range p.exact.EachInterval() {
		mid := iv.X(0.5)
		p.ex.takeStress(p.model.SegmentAt(mid), iv)
		for k := range holding(&parts, p.parts, mid) {
			p.ex.takeDeflection(k, iv, &p.chords[k][1])
		}
		for k := range holding(&columns, p.columns, mid) {
			p.ex.takeCompression(k, iv)
		}
	}
}

// extent is a part of the member from a to b.
type extent interface{ ends() (a, b float64) }

func (s stretch) ends() (a, b float64) { return s.a, s.b }
func (c column) ends() (a, b float64)  { return c.a, c.b }

// sweep slides along a list of parts sorted along the member, both ends
// growing with k (as stretches and columns are), for points that never
// decrease: next is the first part that does not end before the last
// point. It finds the parts holding each point in time proportional to
// their number, where a search of the whole list for every stretch of the
// exact solution took 49 s for a beam over 100,000 supports.
type sweep struct{ next int }

// holding yields the index of every part of list that holds x (a ≤ x ≤
// b); x must not decrease between calls with the same sweep.
func holding[T extent](s *sweep, list []T, x float64) iter.Seq[int] {
	return func(yield func(int) bool) {
		for s.next < len(list) {
			if _, b := list[s.next].ends(); b >= x {
				break
			}
			s.next++
		}
		for k := s.next; k < len(list); k++ {
			a, b := list[k].ends()
			if a > x {
				return
			}
			if x <= b && !yield(k) {
				return
			}
		}
	}
}

// takeStress takes the combined stress of largest magnitude on v for segment i.
func (p *peaks) takeStress(i int, v *fem.Interval) {
	lo, hi := v.Range(fem.QCombinedStress)
	best := hi
	if math.Abs(lo.Value) > math.Abs(hi.Value) {
		best = lo
	}
	if math.Abs(best.Value) > math.Abs(p.stress[i].value) {
		p.stress[i] = peak{best.Value, best.X}
	}
}

// takeDeflection takes the largest |w − chord| on v for part k.
func (p *peaks) takeDeflection(k int, v *fem.Interval, c *chordLine) {
	a, b := c.at(v.X(0)), c.at(v.X(1))
	var lo, hi fem.Point
	if w, ok := v.Polynomial(fem.QDeflection); ok {
		w[0] -= a
		w[1] -= b - a
		if w.MaxAbsBound() <= p.deflection[k].value {
			return // it cannot beat the peak so far
		}
		if endsHold(&w) {
			lo, hi = endsOnly(v, w[0], w.At(1))
		} else {
			lo, hi = v.RangeOf(&w) // as RangeLess reads a polynomial interval
		}
	} else {
		lo, hi = v.RangeLess(fem.QDeflection, a, b)
	}
	best := hi
	if math.Abs(lo.Value) > math.Abs(hi.Value) {
		best = lo
	}
	if math.Abs(best.Value) > p.deflection[k].value {
		p.deflection[k] = peak{math.Abs(best.Value), best.X}
	}
}

// endsHold reports whether w, a cubic, lies strictly between its values at
// the ends inside the interval: its inner Bernstein coefficients do, and
// its hull holds it (Farin, Curves and Surfaces for CAGD, ch. 5, from
// memory). Its range is then its ends', and no search is needed.
func endsHold(w *fem.Polynomial) bool {
	if w[4] != 0 || w[5] != 0 {
		return false
	}
	end := w[0] + w[1] + w[2] + w[3]
	lo, hi := min(w[0], end), max(w[0], end)
	b1 := w[0] + w[1]/3
	b2 := b1 + (w[1]+w[2])/3
	return lo < b1 && b1 < hi && lo < b2 && b2 < hi
}

// endsOnly is the range of a quantity valued a at the start of v and b at
// its end with nothing beyond them inside: the start wins a tie, as in
// Interval.RangeOf.
func endsOnly(v *fem.Interval, a, b float64) (lo, hi fem.Point) {
	lo, hi = fem.Point{X: v.X(0), Value: a}, fem.Point{X: v.X(0), Value: a}
	if b < a {
		lo = fem.Point{X: v.X(1), Value: b}
	}
	if b > a {
		hi = fem.Point{X: v.X(1), Value: b}
	}
	return lo, hi
}

// takeCompression takes the largest and the smallest −N on v for column
// k: at the ends where N is linear on v (the elements of fem), as Range
// would give them, else from Range.
func (p *peaks) takeCompression(k int, v *fem.Interval) {
	if n, ok := v.Polynomial(fem.QAxialForce); ok && n[2] == 0 && n[3] == 0 && n[4] == 0 && n[5] == 0 {
		at, least, most := v.X(0), v.End(0).AxialForce, v.End(0).AxialForce
		if b := v.End(1).AxialForce; b < least {
			at, least = v.X(1), b
		} else {
			most = b
		}
		if -least > p.compression[k].value {
			p.compression[k] = peak{-least, at}
		}
		p.least[k] = min(p.least[k], -most)
		return
	}
	lo, hi := v.Range(fem.QAxialForce)
	if n := -lo.Value; n > p.compression[k].value {
		p.compression[k] = peak{n, lo.X}
	}
	p.least[k] = min(p.least[k], -hi.Value)
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

// fresh is c for a new walk, from any element on.
func (c cover) fresh() cover {
	c.next = 0
	return c
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

// fromWhat names the solution the design checks read.
func (p *Probe) fromWhat() string {
	if p.exact != nil {
		return "the exact solution of the model"
	}
	return "the finite element solution (no exact solution: peaks between nodes may be missed; refine the mesh to be sure)"
}

// feBeside is the sentence that gives the finite element value beside the
// exact one of a design check, value and fe in kind k; "" without an
// exact solution.
func (p *Probe) feBeside(o Options, k units.Kind, value float64, fe peak) string {
	if p.exact == nil {
		return ""
	}
	diff := ""
	switch {
	case value == 0:
	case fe.value == value:
		diff = ", 0 %" // no sign on nothing
	default:
		diff = ", " + units.FormatG("%+.3g %%", 100*(fe.value-value)/value)
	}
	return fmt.Sprintf("The finite element solution on this mesh gives %s at x = %s (FE − exact %s%s). ",
		o.Units.Format(k, fe.value), o.Units.Format(units.Position, fe.x), o.Units.Format(k, fe.value-value), diff)
}

// LimitFigures is the number of significant figures to print a checked
// value and its limit with, both of kind k in units u: the four of
// units.System.Format, or, for a value above its limit (a failed check)
// that four figures print alike or below it, as many more as show it
// above, so "11.11 mm" never stands beside a limit of "11.11 mm" and
// "fail" (a utilisation of 1.0001); as UtilisationText never prints a
// failure as 1.00.
func LimitFigures(u units.System, k units.Kind, value, limit float64) int {
	const four, most = 4, 17
	figures := four
	for ; value > limit && figures < most; figures++ {
		shown := func(v float64) float64 {
			x, _ := strconv.ParseFloat(units.FormatNumberFigures(u.ToDisplay(k, v), figures), 64)
			return x
		}
		if shown(value) > shown(limit) {
			break
		}
	}
	return figures
}

// UtilisationText writes a utilisation (the checked value over its limit,
// failing above 1) to two decimals, or to three figures from a million up,
// where the decimals would run to hundreds of digits (a safety factor of
// 1e300, say), and in words beyond the range of floating-point numbers
// (units.FormatG). A utilisation above 1 that two decimals round to 1.00
// gets as many more as show it above 1, so the text never reads "1.00"
// beside a failed check.
func UtilisationText(u float64) string {
	if !(math.Abs(u) < 1e6) {
		return units.FormatG("%.3g", u)
	}
	text := fmt.Sprintf("%.2f", u)
	for decimals := 3; u > 1 && decimals <= 17; decimals++ {
		if shown, _ := strconv.ParseFloat(text, 64); shown > 1 {
			break
		}
		text = fmt.Sprintf("%.*f", decimals, u)
	}
	return text
}
