package analysis

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"sync"

	"stave/fem"
	"stave/fem/check"
)

// A model with load cases is analysed by superposition on one structure
// (fem.Member.SolveCombinations): every combination, and every span share
// of the cases placed by span, is one substitution on one factorization.
// The analysis shows one case, one combination or the envelope of all
// combinations; in every view Solution and Exact are one solution, so the
// drawing, the summary and the checks read them as for a model without
// cases, and Cases holds the rest.

// ShowKind says what the analysis of a model with cases shows.
type ShowKind int

// What can be shown.
const (
	ShowEnvelope    ShowKind = iota // every combination at once
	ShowCase                        // one load case, factor 1
	ShowCombination                 // one combination, every span loaded
)

// Show picks what is shown: a kind and, for a case or a combination, its
// index in Model.Cases or in Cases.Combinations.
type Show struct {
	Kind  ShowKind
	Index int
}

// Cases is what the analysis found of a model with load cases.
type Cases struct {
	Show Show
	// Combinations are those of the envelope (fem.Model.EnvelopeCombinations).
	Combinations []fem.Combination
	// Solutions are the combinations' load sets solved, the exact ones
	// after Finish.
	Solutions *fem.CombinationSolutions
	// Envelope is every quantity's envelope over the combinations, in
	// closed form with the governing combinations, after Finish (the
	// drawing samples the envelope from Solutions before).
	Envelope *fem.Envelope
	// Summaries are each combination's summary (every span loaded), one
	// per combination in the order of Combinations, nil where its solution
	// failed (Unsolved says why), and Governing the combination each of
	// the analysis's Checks was taken from, after Finish.
	Summaries []*fem.Summary
	Governing []int
	// Unsolved is, per combination, why its solution failed (results that
	// underflow, say); nil where it solved. Such a combination has no
	// summary and no checks, and the envelope's checks are of the others.
	Unsolved []error
	member   *fem.Member
	mesh     fem.Mesh
	alone    *caseSolver // shared by the copies of c
}

// caseSolver solves load cases alone: the finite element ones on one
// structure, the exact ones all at once, each built on first use.
type caseSolver struct {
	mu               sync.Mutex
	structure        *fem.Structure
	structureErr     error
	exacts           []*fem.Exact
	exactErr         error
	built, exactDone bool
}

// solve is load case k of c alone, on c's mesh.
func (cs *caseSolver) solve(c *Cases, k int) (*fem.Solution, error) {
	cs.mu.Lock()
	defer cs.mu.Unlock()
	if !cs.built {
		cs.structure, cs.structureErr = c.member.Structure(c.mesh)
		cs.built = true
	}
	if cs.structureErr != nil {
		return nil, cs.structureErr
	}
	return cs.structure.Solve(&c.member.LoadSets()[k])
}

// exact is every load case's exact solution.
func (cs *caseSolver) exact(c *Cases) ([]*fem.Exact, error) {
	cs.mu.Lock()
	defer cs.mu.Unlock()
	if !cs.exactDone {
		cs.exacts, cs.exactErr = c.member.ExactLoadSets()
		cs.exactDone = true
	}
	return cs.exacts, cs.exactErr
}

// ShowNamed finds the case or combination named name in m: one whose name
// is written exactly so first (a combination, then a case), then one whose
// name differs only in letter case (a combination, then a case), since a
// case "g" and a combination "G" may both be in the file; "envelope" shows
// the envelope. False when none is so named.
func ShowNamed(m *fem.Model, name string) (Show, bool) {
	if strings.EqualFold(name, "envelope") {
		return Show{Kind: ShowEnvelope}, true
	}
	for _, same := range []func(a, b string) bool{func(a, b string) bool { return a == b }, strings.EqualFold} {
		for c, cb := range m.EnvelopeCombinations() {
			if same(cb.Name, name) {
				return Show{Kind: ShowCombination, Index: c}, true
			}
		}
		for k := range m.LoadSetCount() {
			if same(m.LoadSetName(k), name) {
				return Show{Kind: ShowCase, Index: k}, true
			}
		}
	}
	return Show{}, false
}

// Title names what s shows of m: "envelope of 3 combinations",
// "load case permanent", "combination ULS 1".
func (s Show) Title(m *fem.Model) string {
	switch cbs := m.EnvelopeCombinations(); {
	case s.Kind == ShowCase && s.Index >= 0 && s.Index < m.LoadSetCount():
		return "load case " + m.LoadSetName(s.Index)
	case s.Kind == ShowCombination && s.Index >= 0 && s.Index < len(cbs):
		return "combination " + cbs[s.Index].Name
	case len(cbs) == 1:
		return "envelope of 1 combination"
	default:
		return fmt.Sprintf("envelope of %d combinations", len(cbs))
	}
}

// solveCases is the first stage for a model with cases: every
// combination solved, and the shown case or combination as a.Solution
// (the first combination for the envelope).
func solveCases(a *Analysis, r Request) {
	p, err := fem.PrepareIn(&a.Model, a.Units)
	if err != nil {
		a.Err = err
		return
	}
	mesh, err := meshFor(p, r.Nodes)
	if err != nil {
		a.Err = err
		return
	}
	c := &Cases{Show: r.Show, Combinations: a.Model.EnvelopeCombinations(), member: p, mesh: mesh, alone: &caseSolver{}}
	a.Cases = c
	// One case or one combination needs its own load sets alone; the
	// others follow in Finish.
	switch s := r.Show; {
	case s.Kind == ShowCase && s.Index >= 0 && s.Index < a.Model.LoadSetCount():
		a.Solution, a.Err = solveSets(p, mesh, []fem.Loads{p.LoadSets()[s.Index]}, []float64{1})
	case s.Kind == ShowCombination && s.Index >= 0 && s.Index < len(c.Combinations):
		var cl *fem.CombinationLoads
		if cl, a.Err = p.CombinationLoads(); a.Err != nil {
			return
		}
		sets, factors := []fem.Loads{cl.Fixed[s.Index]}, []float64{1}
		for j, f := range cl.Factors[s.Index] {
			if f != 0 {
				sets, factors = append(sets, cl.ShareLoads[j]), append(factors, f)
			}
		}
		a.Solution, a.Err = solveSets(p, mesh, sets, factors)
	default:
		c.Show = Show{Kind: ShowEnvelope}
		if c.Solutions, a.Err = p.SolveCombinations(mesh); a.Err == nil {
			// The envelope shows the first combination: name it when it
			// cannot be solved (results that underflow, say).
			if a.Solution, a.Err = c.Solutions.Solution(0); a.Err != nil && len(c.Combinations) > 0 {
				a.Err = fmt.Errorf("%s: %w", c.combinationName(&a.Model, 0), a.Err)
			}
		}
	}
}

// solveSets is Σ factors[i]·sets[i] solved on p's structure on mesh: the
// loads combined first and solved once, as the envelope solves a
// combination (fem.CombinationSolutions.Solution), so that loads that
// cancel leave nothing behind.
func solveSets(p *fem.Member, mesh fem.Mesh, sets []fem.Loads, factors []float64) (*fem.Solution, error) {
	st, err := p.Structure(mesh)
	if err != nil {
		return nil, err
	}
	l, err := fem.CombineLoads(sets, factors)
	if err != nil {
		return nil, err
	}
	return st.Solve(&l)
}

// clone is a copy of c that Finish may fill in while the window shows c.
func (c *Cases) clone() *Cases {
	d := *c
	if c.Solutions != nil {
		sols := *c.Solutions
		d.Solutions = &sols
	}
	return &d
}

// exact is the exact solution of what c shows, with every combination's
// (solved here when the first stage did not).
func (c *Cases) exact() (*fem.Exact, error) {
	if c.Solutions == nil {
		var err error
		if c.Solutions, err = c.member.SolveCombinations(c.mesh); err != nil {
			return nil, err
		}
	}
	if err := c.Solutions.SolveExact(c.member); err != nil {
		return nil, err
	}
	if c.Show.Kind == ShowCase {
		exacts, err := c.alone.exact(c)
		if err != nil {
			return nil, err
		}
		return exacts[c.Show.Index], nil
	}
	return c.Solutions.Exact(max(c.Show.Index, 0))
}

// finish finds the envelope, summarises and checks every combination, and for the envelope
// keeps each check from the combination where it is worst: design checks
// of stress and buckling from the strength combinations, of deflection
// from the serviceability ones (from all when there are none of that
// kind), checks of the answer from all.
func (c *Cases) finish(a *Analysis, opts check.Options) {
	if c.Solutions == nil {
		return // the exact stage could not solve them, and says why
	}
	c.Envelope = c.Solutions.Envelope()
	per := make([][]check.Result, len(c.Combinations))
	c.Summaries, c.Unsolved = make([]*fem.Summary, len(c.Combinations)), make([]error, len(c.Combinations))
	for k := range c.Combinations {
		if k == c.shownCombination() {
			// Finish's own walk was of this combination: a.Solution and
			// a.Exact are its, solved the same way to the bit.
			sum := a.Summary()
			c.Summaries[k], per[k] = &sum, a.Checks
			continue
		}
		s, err := c.Solutions.Solution(k)
		if err != nil {
			c.Unsolved[k] = err
			continue
		}
		e, _ := c.Solutions.Exact(k)
		z := fem.NewSummarizer(s, e)
		p := check.NewProbe(&a.Model, s, e)
		fem.Walk(s, e, z, p)
		sum := z.Summary()
		c.Summaries[k], per[k] = &sum, p.Results(z.Comparison(), opts)
	}
	if arranged, k := c.arranger(a); arranged != nil {
		// The combination, or the case placed by span, shown alone: its
		// results are with every span loaded, its checks from the worst
		// arrangement, as the envelope's are, named where that is not
		// every span loaded.
		checks, words := arranged.patterned(a, k, slices.Clone(a.Checks), opts)
		for i, w := range words {
			if w != "" {
				checks[i].Name += " (" + w + ")"
			}
		}
		a.Checks = checks
		if c.Show.Kind == ShowCombination {
			c.notJudged(a.Checks, k)
		}
		return
	}
	if c.Show.Kind != ShowEnvelope {
		return
	}
	words := make([][]string, len(per))
	for k := range per {
		if c.Unsolved[k] == nil {
			per[k], words[k] = c.patterned(a, k, slices.Clone(per[k]), opts)
		}
	}
	a.Checks, c.Governing = nil, nil
	for _, name := range checkNames(per) {
		found, by, at := false, 0, 0
		var best check.Result
		for k := range per {
			i := slices.IndexFunc(per[k], func(r check.Result) bool { return r.Name == name })
			if i < 0 || !c.judges(per[k][i], k) {
				continue
			}
			if !found || worse(per[k][i], best) {
				found, best, by, at = true, per[k][i], k, i
			}
		}
		if !found {
			continue // a design check that only combinations of another kind make
		}
		governing := c.Combinations[by].Name
		if words[by][at] != "" {
			governing += ", " + words[by][at]
		}
		best.Name += " (governing: " + governing + ")"
		a.Checks = append(a.Checks, best)
		c.Governing = append(c.Governing, by)
	}
}

// arranger is what arranges the spans loaded for the checks of what c
// shows alone, with the index of its combination there: c itself for a
// combination; for a case placed by span, the analysis of a model whose
// one combination is the case at factor 1, since by_span says its load may
// stand on any of the spans (docs/format.md, pattern loading) whether it is
// shown alone or combined. Nil for anything else, and for a case that
// model cannot solve (its checks then stay those of every span loaded).
func (c *Cases) arranger(a *Analysis) (*Cases, int) {
	s := c.Show
	switch {
	case s.Kind == ShowCombination:
		return c, s.Index
	case s.Kind != ShowCase || s.Index < 0 || s.Index >= len(a.Model.Cases) || !a.Model.Cases[s.Index].BySpan:
		return nil, 0
	}
	m := a.Model.Clone()
	m.Combinations = []fem.Combination{{Name: m.Cases[s.Index].Name, Kind: fem.OtherCombination,
		Factors: []fem.CaseFactor{{Case: s.Index, Factor: 1}}}}
	p, err := fem.PrepareIn(&m, a.Units)
	if err != nil {
		return nil, 0
	}
	sols, err := p.SolveCombinations(c.mesh)
	if err != nil {
		return nil, 0
	}
	if c.Solutions.FixedExact != nil && sols.SolveExact(p) != nil {
		return nil, 0 // the exact solutions of the model's own solved, this one's must too
	}
	return &Cases{Show: c.Show, Combinations: m.EnvelopeCombinations(), Solutions: sols, member: p, mesh: c.mesh, alone: &caseSolver{}}, 0
}

// checkNames are the names of every combination's checks, once each, in
// the order the checks are made: a check that only a later combination
// makes (buckling where only it compresses the member) follows the check
// before it there.
func checkNames(per [][]check.Result) []string {
	var names []string
	for _, results := range per {
		at := 0 // where a new name goes
		for _, r := range results {
			if i := slices.Index(names, r.Name); i >= 0 {
				at = i + 1
				continue
			}
			names = slices.Insert(names, at, r.Name)
			at++
		}
	}
	return names
}

// patternSteps bounds how often patterned moves to a check's new place.
const patternSteps = 4

// patterned makes the stress, deflection and buckling checks of
// combination k (results, every span loaded) those of the worst
// arrangement of the spans its cases placed by span load: with every span
// loaded the moment over a support is not the largest (the two spans
// beside it loaded give more), nor a span's deflection (it and every
// second span loaded), nor a column's compression where axial loads on
// other spans relieve it. At the
// check's place it loads the spans whose share pushes the checked value
// further the way it goes there, solves and checks that arrangement, and
// again from that check's place while the arrangement changes; a check
// worse than before replaces it in results. It returns, per check, the
// loaded spans in words ("imposed on spans 1, 3") where an arrangement
// other than every span loaded gives the check, else "". A column that
// every span loaded leaves uncompressed, but another arrangement
// compresses, gets its buckling check from the worst arrangement, added
// to results.
func (c *Cases) patterned(a *Analysis, k int, results []check.Result, opts check.Options) ([]check.Result, []string) {
	cs := c.Solutions
	var all []int // the shares combination k takes
	for j, f := range cs.Loads.Factors[k] {
		if f != 0 {
			all = append(all, j)
		}
	}
	if len(all) == 0 {
		return results, make([]string, len(results))
	}
	solved := arrangements{}
	results, start := c.arrangedColumns(a, k, all, results, opts, solved)
	words := make([]string, len(results))
	exact := cs.FixedExact != nil
	field := func(fixed bool, j int) fem.Field {
		switch {
		case exact && fixed:
			return cs.FixedExact[k]
		case exact:
			return cs.SharesExact[j]
		case fixed:
			return cs.Fixed[k]
		}
		return cs.Shares[j]
	}
	fields := func(fixed bool, j int, x float64) fem.Fields { return field(fixed, j).At(x, fem.Right) }
	for i := range results {
		r := results[i]
		if r.Kind != check.Design || (r.Code != check.CodeStress && r.Code != check.CodeDeflection && r.Code != check.CodeBuckling) {
			continue
		}
		// value is the checked quantity of one load set at x: the
		// deflection from the line the check measures it from
		// (check.DeflectionLine), the compression −N, or the stress in the
		// bottom fibre (top when bottom is false).
		from, to := r.Span[0], r.Span[1]
		lines := map[int][2]float64{} // per load set: the fixed loads' at −1, share j's at j
		line := func(fixed bool, j int) [2]float64 {
			key := j
			if fixed {
				key = -1
			}
			l, ok := lines[key]
			if !ok {
				fe := cs.Shares[j]
				if fixed {
					fe = cs.Fixed[k]
				}
				l, _ = check.DeflectionLine(&a.Model, fe, field(fixed, j), from, to)
				lines[key] = l
			}
			return l
		}
		value := func(fixed bool, j int, x float64, bottom bool) float64 {
			if r.Code == check.CodeDeflection {
				l := line(fixed, j)
				return fields(fixed, j, x).Deflection - l[0] - (l[1]-l[0])*(x-from)/(to-from)
			}
			f := fields(fixed, j, x)
			if r.Code == check.CodeBuckling {
				return -f.AxialForce
			}
			if bottom {
				return f.AxialStress + f.BendingStress
			}
			return f.AxialStress - f.BendingStress
		}
		best, bestOn := r, all
		if start[i] != nil {
			bestOn = start[i] // a column only that arrangement compresses
		}
		// Start from the arrangement that is worst anywhere on the
		// check's stretch, in closed form: where every span loaded is
		// worst, another arrangement may be far from the worst.
		var chord [2]float64 // the line the deflection of the loads always on is measured from
		if r.Code == check.CodeDeflection {
			chord = line(true, 0)
		}
		on := c.worstArrangement(k, r, chord)
		if !slices.Equal(on, bestOn) {
			if got, ok := c.checkArrangement(a, k, on, r.Name, opts, solved); ok {
				r = got
				if worse(r, best) {
					best, bestOn = r, on
				}
			}
		}
		for range patternSteps {
			x := r.X
			total := func(bottom bool) float64 {
				v := value(true, 0, x, bottom)
				for _, j := range on {
					v += cs.Loads.Factors[k][j] * value(false, j, x, bottom)
				}
				return v
			}
			bottom := math.Abs(total(true)) >= math.Abs(total(false))
			sign := math.Copysign(1, total(bottom))
			var next []int
			for _, j := range all {
				if sign*cs.Loads.Factors[k][j]*value(false, j, x, bottom) > 0 {
					next = append(next, j)
				}
			}
			if slices.Equal(next, on) {
				break
			}
			on = next
			got, ok := c.checkArrangement(a, k, on, r.Name, opts, solved)
			if !ok {
				break
			}
			r = got
			if worse(r, best) {
				best, bestOn = r, on
			}
		}
		if !slices.Equal(bestOn, all) {
			results[i] = best
			words[i] = c.arrangementWords(&a.Model, k, bestOn)
		}
	}
	return results, words
}

// arrangedColumns adds to results, combination k's checks with every
// span loaded, the buckling check of each column they lack that some
// arrangement of the shares (all, those k takes) compresses beyond
// round-off, from the arrangement that compresses it most (in closed
// form, fem.CombinationSolutions.Within), each after the check before it
// there. start holds per check of the new results the arrangement it is
// from, nil for every span loaded.
func (c *Cases) arrangedColumns(a *Analysis, k int, all []int, results []check.Result, opts check.Options, solved arrangements) (_ []check.Result, start [][]int) {
	start = make([][]int, len(results))
	roundOff := check.AxialRoundOff(&a.Model)
	for _, span := range check.Columns(&a.Model) {
		is := func(r check.Result) bool { return r.Code == check.CodeBuckling && r.Span == span }
		if slices.ContainsFunc(results, is) {
			continue
		}
		g := c.Solutions.Within(k, span[0], span[1], [2]float64{})[fem.QAxialForce].Min
		on := c.loaded(k, g)
		if on == nil {
			on = []int{} // no span loaded: nil in start is every span loaded
		}
		if -g.Value <= roundOff || slices.Equal(on, all) {
			continue // no arrangement compresses it, or every span loaded is the worst and made no check
		}
		got, ok := solved.checks(c, a, k, on, opts)
		i := slices.IndexFunc(got, is)
		if !ok || i < 0 {
			continue
		}
		at := 0 // after the nearest check before it that results have
		for j := i - 1; j >= 0; j-- {
			if n := slices.IndexFunc(results, func(r check.Result) bool { return r.Name == got[j].Name }); n >= 0 {
				at = n + 1
				break
			}
		}
		results, start = slices.Insert(results, at, got[i]), slices.Insert(start, at, on)
	}
	return results, start
}

// worstArrangement is the arrangement of the shares combination k takes
// (indices into its Loads.Shares, in order) that gives the largest value
// in size of check r's quantity on its stretch, in closed form: the
// combined stress, the compression (the smallest axial force), or the
// deflection with chord (the line the check measures it from, at the
// stretch's ends) taken off that of the loads always on; the shares'
// deflections are taken as they are, which is how the check measures them
// where the stretch ends at supports.
func (c *Cases) worstArrangement(k int, r check.Result, chord [2]float64) []int {
	cs := c.Solutions
	q := fem.QCombinedStress
	switch r.Code {
	case check.CodeDeflection:
		q = fem.QDeflection
	case check.CodeBuckling:
		q = fem.QAxialForce
	}
	env := cs.Within(k, r.Span[0], r.Span[1], chord)
	g := env[q].Max
	if q == fem.QAxialForce || math.Abs(env[q].Min.Value) > math.Abs(g.Value) {
		g = env[q].Min
	}
	return c.loaded(k, g)
}

// loaded are the shares of combination k that g loads, as indices into
// its Loads.Shares, in order.
func (c *Cases) loaded(k int, g fem.Governing) []int {
	cs := c.Solutions
	var on []int
	for j, sh := range cs.Loads.Shares {
		if cs.Loads.Factors[k][j] != 0 && slices.Contains(g.Loaded, sh) {
			on = append(on, j)
		}
	}
	return on
}

// checkArrangement is the check named name of arrangementChecks, and
// whether it was found, solved once per arrangement in solved.
func (c *Cases) checkArrangement(a *Analysis, k int, on []int, name string, opts check.Options, solved arrangements) (check.Result, bool) {
	results, _ := solved.checks(c, a, k, on, opts)
	i := slices.IndexFunc(results, func(r check.Result) bool { return r.Name == name })
	if i < 0 {
		return check.Result{}, false
	}
	return results[i], true
}

// arrangements are the checks of the arrangements of one combination
// solved so far, by their loaded shares: the checks of many stretches that
// one arrangement governs share its solve. Solving it again for each check
// took minutes on a by-span case over 2,000 segments.
type arrangements map[string]arranged

type arranged struct {
	results []check.Result
	ok      bool
}

// checks are arrangementChecks(a, k, on, opts), solved the first time the
// arrangement on is asked for.
func (solved arrangements) checks(c *Cases, a *Analysis, k int, on []int, opts check.Options) ([]check.Result, bool) {
	key := fmt.Sprint(on)
	got, done := solved[key]
	if !done {
		got.results, got.ok = c.arrangementChecks(a, k, on, opts)
		solved[key] = got
	}
	return got.results, got.ok
}

// arrangementChecks solves combination k with the shares on loaded and its
// other shares unloaded, and checks it: its checks, and whether it solved.
func (c *Cases) arrangementChecks(a *Analysis, k int, on []int, opts check.Options) ([]check.Result, bool) {
	cs := c.Solutions
	sols, factors := []*fem.Solution{cs.Fixed[k]}, []float64{1}
	var exacts []*fem.Exact
	if cs.FixedExact != nil {
		exacts = []*fem.Exact{cs.FixedExact[k]}
	}
	for _, j := range on {
		sols, factors = append(sols, cs.Shares[j]), append(factors, cs.Loads.Factors[k][j])
		if exacts != nil {
			exacts = append(exacts, cs.SharesExact[j])
		}
	}
	s, err := fem.CombineSolutions(sols, factors)
	if err != nil {
		return nil, false
	}
	var e *fem.Exact
	if exacts != nil {
		if e, err = fem.CombineExact(exacts, factors); err != nil {
			return nil, false
		}
	}
	z := fem.NewSummarizer(s, e)
	p := check.NewProbe(&a.Model, s, e)
	fem.Walk(s, e, z, p)
	return p.Results(z.Comparison(), opts), true
}

// arrangementWords names the loaded spans of the shares on, case by case
// for the cases combination k places by span: "imposed on spans 1, 3";
// "imposed on no span" for a case none of whose spans is loaded.
func (c *Cases) arrangementWords(m *fem.Model, k int, on []int) string {
	cl := c.Solutions.Loads
	var cases []int
	spans := map[int][]string{}
	for j, sh := range cl.Shares {
		if cl.Factors[k][j] == 0 {
			continue
		}
		if !slices.Contains(cases, sh.Case) {
			cases = append(cases, sh.Case)
		}
		if slices.Contains(on, j) {
			spans[sh.Case] = append(spans[sh.Case], strconv.Itoa(sh.Span+1))
		}
	}
	var parts []string
	for _, lc := range cases {
		switch n := spans[lc]; len(n) {
		case 0:
			parts = append(parts, m.LoadSetName(lc)+" on no span")
		case 1:
			parts = append(parts, m.LoadSetName(lc)+" on span "+n[0])
		default:
			parts = append(parts, m.LoadSetName(lc)+" on spans "+strings.Join(n, ", "))
		}
	}
	return strings.Join(parts, "; ")
}

// solutionWords name the load set whose solution the analysis's summary
// and sketch are of, as words to follow a statement about it: ` in load
// case "permanent"`, ` in combination "strength" with every span loaded`
// (of the cases it places by span); "" without cases.
func (c *Cases) solutionWords(m *fem.Model) string {
	if c == nil {
		return ""
	}
	k := c.shownCombination()
	if k < 0 {
		if c.Show.Index < 0 || c.Show.Index >= m.LoadSetCount() {
			return ""
		}
		return fmt.Sprintf(" in load case %q", m.LoadSetName(c.Show.Index))
	}
	return c.combinationWords(m, k)
}

// combinationWords name combination k as words to follow a statement
// about its solution: ` in combination "strength" with every span loaded`
// (of the cases it places by span), ` in combination "SLS"`; "" for no
// combination of c.
func (c *Cases) combinationWords(m *fem.Model, k int) string {
	if k < 0 || k >= len(c.Combinations) {
		return ""
	}
	for _, f := range c.Combinations[k].Factors {
		if f.Case >= 0 && f.Case < len(m.Cases) && m.Cases[f.Case].BySpan {
			return " in " + c.combinationName(m, k) + " with every span loaded"
		}
	}
	return " in " + c.combinationName(m, k)
}

// combinationName names combination k of c: `combination "ULS 1"`, or
// `load case "permanent"` for a model without combinations, whose
// envelope takes each case alone at factor 1 (fem.Model.EnvelopeCombinations).
func (c *Cases) combinationName(m *fem.Model, k int) string {
	if len(m.Combinations) == 0 {
		return fmt.Sprintf("load case %q", c.Combinations[k].Name)
	}
	return fmt.Sprintf("combination %q", c.Combinations[k].Name)
}

// shownCombination is the combination whose solution the analysis shows
// (the first for the envelope), or −1 for a load case.
func (c *Cases) shownCombination() int {
	switch c.Show.Kind {
	case ShowEnvelope:
		return 0
	case ShowCombination:
		return c.Show.Index
	}
	return -1
}

// notJudged turns the design checks of combination k, shown alone, that
// the envelope takes from combinations of another kind (judges) into
// information: a deflection under factored strength loads, or a stress
// under serviceability loads, is no check of the member, and failing it
// would say the member fails what it is never held to.
func (c *Cases) notJudged(checks []check.Result, k int) {
	for i := range checks {
		r := &checks[i]
		if r.Status == check.Info || c.judges(*r, k) {
			continue
		}
		kind := "strength"
		if r.Code == check.CodeDeflection {
			kind = "serviceability"
		}
		r.Status = check.Info
		r.Message = fmt.Sprintf("Not judged under %q, a %s combination: this model judges it under its %s combinations (the envelope takes it from them). %s",
			c.Combinations[k].Name, c.Combinations[k].Kind, kind, r.Message)
	}
}

// judges reports whether combination k is of the kind that judges check
// r: deflection on serviceability, other design checks on strength, each
// only when the model has a combination of that kind.
func (c *Cases) judges(r check.Result, k int) bool {
	if r.Kind != check.Design {
		return true
	}
	want := fem.Strength
	if strings.HasPrefix(r.Name, "Deflection") {
		want = fem.Serviceability
	}
	any := false
	for _, cb := range c.Combinations {
		any = any || cb.Kind == want
	}
	return !any || c.Combinations[k].Kind == want
}

// worse reports whether check a is worse than b: a worse status, or the
// same with a value nearer its limit (its value where it has none) by more
// than a tie (fem.Beyond); of two failed checks of equilibrium, the one
// whose loads and reactions differ more, for their size. Passed checks of
// equilibrium tie: each balances to round-off. A tie leaves b, which the
// envelope found first: its check is named for the first combination in
// the file's order among those that tie.
func worse(a, b check.Result) bool {
	switch {
	case a.Status != b.Status:
		return a.Status > b.Status
	case a.Code == check.CodeEquilibrium && a.Status == check.Pass:
		return false
	case a.Code == check.CodeEquilibrium:
		return fem.Beyond(imbalance(a), imbalance(b))
	}
	return fem.Beyond(ratio(a), ratio(b))
}

func ratio(r check.Result) float64 {
	if r.Limit == 0 {
		return math.Abs(r.Value)
	}
	return math.Abs(r.Value / r.Limit)
}

// imbalance is how far a check of equilibrium is off: its applied loads
// (Value) less the reactions' (Limit), as a share of the larger; 0 where
// both are 0.
func imbalance(r check.Result) float64 {
	size := max(math.Abs(r.Value), math.Abs(r.Limit))
	if size == 0 {
		return 0
	}
	return math.Abs(r.Value-r.Limit) / size
}

// CaseSummary solves load case k alone and summarises it against its
// exact solution. The structure and the cases' exact solutions are found
// once for all the cases.
func (c *Cases) CaseSummary(k int) (fem.Summary, error) {
	s, err := c.alone.solve(c, k)
	if err != nil {
		return fem.Summary{}, err
	}
	exacts, err := c.alone.exact(c)
	if err != nil {
		return fem.Summarize(s, nil), nil
	}
	return fem.Summarize(s, exacts[k]), nil
}

// finiteElementEnvelope reports whether c shows an envelope whose values
// are the finite element ones (fem.Envelope.Exact false: a member on an
// elastic foundation) and has every combination's summary to weigh them
// by; false for a nil c.
func (c *Cases) finiteElementEnvelope() bool {
	return c != nil && c.Show.Kind == ShowEnvelope && c.Envelope != nil && !c.Envelope.Exact && len(c.Summaries) == len(c.Combinations)
}
