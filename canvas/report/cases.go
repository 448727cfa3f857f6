package report

import (
	"fmt"
	"io"
	"slices"
	"strings"
	"text/tabwriter"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/fem/units"
)

// CombinedCaution goes with every result combined from load cases: the
// factors are the engineer's, not Stave's.
const CombinedCaution = "Combined results use the factors given in the model; Stave builds in no code's factors. Use the factors your local code gives; a qualified engineer must review the combinations."

// CasesJSON are the keys `stave solve --json` adds for a model with load
// cases, beside the results of what it shows (docs/json.md, "Load cases,
// combinations and envelope").
type CasesJSON struct {
	Shown string `json:"shown"`
	// SummaryOf names the case or combination the summary beside these
	// keys is of: the one shown, or the first combination for the envelope.
	SummaryOf    string            `json:"summary_of"`
	Cases        []CaseJSON        `json:"cases"`
	Combinations []CombinationJSON `json:"combinations"`
	Envelope     EnvelopeJSON      `json:"envelope"`
}

// CaseJSON is one load case and its results alone.
type CaseJSON struct {
	Name              string  `json:"name"`
	SelfWeight        bool    `json:"self_weight"`
	TemperatureChange float64 `json:"temperature_change"` // K
	Settlements       bool    `json:"settlements"`
	// TemperatureDifferences says the segments' temperature differences
	// through the depth act in this case.
	TemperatureDifferences bool `json:"temperature_differences"`
	BySpan                 bool `json:"by_span"`
	// PointLoads and DistributedLoads count the case's own loads, for the
	// text's description of the case; the document leaves the loads to
	// the model's file.
	PointLoads, DistributedLoads int `json:"-"`
	*Results
}

// CombinationJSON is one combination, its factors and its results with
// every span loaded.
type CombinationJSON struct {
	Name    string       `json:"name"`
	Kind    string       `json:"kind"`
	Label   string       `json:"label,omitempty"`
	Factors []FactorJSON `json:"factors"`
	*Results
}

// FactorJSON is one case of a combination, or one of its moving load
// trains, and its factor.
type FactorJSON struct {
	Case   string  `json:"case,omitempty"`
	Train  string  `json:"train,omitempty"`
	Factor float64 `json:"factor"`
}

// EnvelopeJSON is the envelope over every combination and arrangement of
// spans.
type EnvelopeJSON struct {
	Caution string `json:"caution"`
	// Solution is whose values the quantities' envelope holds: "exact", or
	// "finite element" where the exact solution is no polynomial (a member
	// on an elastic foundation).
	Solution string `json:"solution"`
	// Accuracy says how far to trust a finite element envelope: the
	// largest accuracy of the combinations' finite element extremes against
	// their exact ones; nil for an exact envelope, or without an exact
	// solution to measure it by.
	Accuracy   *EnvelopeAccuracyJSON `json:"accuracy"`
	Spans      [][2]float64          `json:"spans"` // m, in order; loaded spans count from 1
	Quantities []QuantityEnvelope    `json:"quantities"`
	Reactions  []ReactionEnvelopeJS  `json:"reactions"`
	// Foundations are what each foundation carries, at its largest and
	// smallest; empty without foundations.
	Foundations []FoundationEnvelopeJS `json:"foundations"`
}

// EnvelopeAccuracyJSON is the largest accuracy (fem.Extreme.Accuracy, a
// share of the field's largest magnitude) of every combination's finite
// element extremes, with its field and its combination.
type EnvelopeAccuracyJSON struct {
	Ratio       float64 `json:"ratio"`
	Quantity    string  `json:"quantity"` // as in the extremes, e.g. shear_force
	Combination string  `json:"combination"`
	quantity    fem.Quantity
}

// Words say how far to trust a finite element envelope, in a sentence.
func (a *EnvelopeAccuracyJSON) Words() string {
	if analysis.RoundOff(a.Ratio) {
		return "Its values are the finite element ones on this mesh: the combinations' FE extremes equal their exact ones (to round-off)."
	}
	return fmt.Sprintf("Its values are the finite element ones on this mesh: the combinations' FE extremes are within %s of a field's largest magnitude of their exact ones (worst: %s in %s).",
		units.FormatG("%.3g %%", 100*a.Ratio), a.quantity.Info().Name, a.Combination)
}

// QuantityEnvelope is one quantity's largest and smallest value.
type QuantityEnvelope struct {
	Quantity fem.Quantity  `json:"-"`
	Name     string        `json:"quantity"` // as in the extremes, e.g. bending_moment
	Unit     string        `json:"unit"`
	Max      GoverningJSON `json:"max"`
	Min      GoverningJSON `json:"min"`
}

// GoverningJSON is one extreme and what gives it.
type GoverningJSON struct {
	Value       float64 `json:"value"`
	X           float64 `json:"x"` // m
	Combination string  `json:"combination"`
	// LoadedSpans are, for each case of the combination placed by span,
	// the spans loaded in the worst arrangement (counted from 1); the
	// others are unloaded. Empty when the combination places no case by
	// span.
	LoadedSpans []LoadedSpansJSON `json:"loaded_spans"`
	// Train is where the combination's moving load train stands when
	// the extreme comes from a combination that takes one.
	Train *TrainPlacementJSON `json:"train,omitempty"`
	// Side is "left" or "right" where the field of the governing
	// combination and arrangement jumps at X (the shear force at a
	// support): the extreme is its limit just left or just right of X, as
	// support_actions give both. Left out where the field does not jump.
	Side string `json:"side,omitempty"`
}

// TrainPlacementJSON is a train at one position: its name, the x of its
// front (m) and the way it faces.
type TrainPlacementJSON struct {
	Name      string  `json:"name"`
	Front     float64 `json:"front"`
	Direction string  `json:"direction"`
}

// LoadedSpansJSON are the spans of one case loaded in an arrangement.
type LoadedSpansJSON struct {
	Case  string `json:"case"`
	Spans []int  `json:"spans"`
}

// ReactionEnvelopeJS is one support's reaction envelope, per component.
type ReactionEnvelopeJS struct {
	Support int     `json:"support"` // 1-based
	Kind    string  `json:"kind"`
	X       float64 `json:"x"`
	// Max and Min hold "axial", "transverse" and "moment": null for a
	// motion the support leaves free, as the reactions give it.
	Max map[string]*GoverningJSON `json:"max"`
	Min map[string]*GoverningJSON `json:"min"`
}

// FoundationEnvelopeJS is one foundation's envelope: the resultant of the
// ground's forces along ("axial") and across ("transverse") the member.
type FoundationEnvelopeJS struct {
	Foundation int                      `json:"foundation"` // 1-based
	Start      float64                  `json:"start"`      // m
	End        float64                  `json:"end"`        // m
	Max        map[string]GoverningJSON `json:"max"`
	Min        map[string]GoverningJSON `json:"min"`
}

var componentNames = [3]string{"axial", "transverse", "moment"}

// CasesResults are the cases, combinations and envelope of a, which must
// be complete and have Cases; nil for a model without cases.
func CasesResults(a *analysis.Analysis) (*CasesJSON, error) {
	c := a.Cases
	if c == nil {
		return nil, nil
	}
	if c.Envelope == nil {
		return nil, fmt.Errorf("the combinations were not solved: %v", a.ExactErr)
	}
	m := &a.Model
	out := &CasesJSON{Shown: c.Show.Title(m), SummaryOf: c.Show.Title(m)}
	if c.Show.Kind == analysis.ShowEnvelope {
		out.SummaryOf = analysis.Show{Kind: analysis.ShowCombination}.Title(m)
	}
	for k, lc := range m.Cases {
		s, err := c.CaseSummary(k)
		if err != nil {
			return nil, fmt.Errorf("load case %q: %w", lc.Name, err)
		}
		out.Cases = append(out.Cases, CaseJSON{Name: lc.Name, SelfWeight: lc.SelfWeight, TemperatureChange: lc.TemperatureChange,
			Settlements: lc.Settlements, TemperatureDifferences: lc.ThermalGradient, BySpan: lc.BySpan,
			PointLoads: len(lc.PointLoads), DistributedLoads: len(lc.DistributedLoad), Results: resultsOf(s)})
	}
	for k, cb := range c.Combinations {
		cj := CombinationJSON{Name: cb.Name, Kind: cb.Kind.String(), Label: cb.Label}
		for _, f := range cb.Factors {
			cj.Factors = append(cj.Factors, FactorJSON{Case: m.LoadSetName(f.Case), Factor: PlainZero(f.Factor)})
		}
		if k < len(c.Summaries) && c.Summaries[k] != nil {
			cj.Results = resultsOf(*c.Summaries[k])
		}
		out.Combinations = append(out.Combinations, cj)
	}
	env, shares := c.Envelope, c.Solutions.Loads.Shares
	out.Envelope = EnvelopeJSON{Caution: CombinedCaution, Solution: envelopeSolution(env), Accuracy: envelopeAccuracy(c), Spans: c.Solutions.Loads.Spans}
	for _, q := range env.Quantities {
		out.Envelope.Quantities = append(out.Envelope.Quantities, QuantityEnvelope{Quantity: q.Quantity, Name: q.Quantity.Key(), Unit: q.Quantity.Info().SI,
			Max: governingJSON(m, c.Combinations, shares, q.Max), Min: governingJSON(m, c.Combinations, shares, q.Min)})
	}
	out.Envelope.Reactions = []ReactionEnvelopeJS{} // a list even without supports (docs/json.md)
	for _, r := range env.Reactions {
		sup := m.Supports[r.Support]
		rj := ReactionEnvelopeJS{Support: r.Support + 1, Kind: sup.Kind.String(), X: r.X,
			Max: map[string]*GoverningJSON{}, Min: map[string]*GoverningJSON{}}
		for d, name := range componentNames {
			rj.Max[name], rj.Min[name] = nil, nil
			if sup.Holds(fem.Dof(d)) {
				hi, lo := governingJSON(m, c.Combinations, shares, r.Max[d]), governingJSON(m, c.Combinations, shares, r.Min[d])
				rj.Max[name], rj.Min[name] = &hi, &lo
			}
		}
		out.Envelope.Reactions = append(out.Envelope.Reactions, rj)
	}
	out.Envelope.Foundations = []FoundationEnvelopeJS{}
	for _, f := range env.Foundations {
		fj := FoundationEnvelopeJS{Foundation: f.Foundation + 1, Start: f.Start, End: f.End,
			Max: map[string]GoverningJSON{}, Min: map[string]GoverningJSON{}}
		for d, name := range componentNames[:2] {
			fj.Max[name], fj.Min[name] = governingJSON(m, c.Combinations, shares, f.Max[d]), governingJSON(m, c.Combinations, shares, f.Min[d])
		}
		out.Envelope.Foundations = append(out.Envelope.Foundations, fj)
	}
	return out, nil
}

// governingJSON is g of model m, whose envelope is over combinations with
// the span shares shares (fem.CombinationLoads.Shares). Its loaded spans
// have one entry for each case the combination places by span, with a
// factor other than 0 and loads to place (a share), in the order of the
// file's cases, as the checks' words give them: the spans g loads, []
// for none.
func governingJSON(m *fem.Model, combinations []fem.Combination, shares []fem.Share, g fem.Governing) GoverningJSON {
	out := GoverningJSON{Value: g.Value, X: g.X, Combination: combinations[g.Combination].Name, LoadedSpans: []LoadedSpansJSON{}, Side: g.Side.Name()}
	for _, sh := range shares {
		takes := slices.ContainsFunc(combinations[g.Combination].Factors, func(cf fem.CaseFactor) bool { return cf.Case == sh.Case && cf.Factor != 0 })
		if !takes {
			continue
		}
		name := m.LoadSetName(sh.Case)
		if n := len(out.LoadedSpans); n == 0 || out.LoadedSpans[n-1].Case != name {
			out.LoadedSpans = append(out.LoadedSpans, LoadedSpansJSON{Case: name, Spans: []int{}})
		}
		if slices.Contains(g.Loaded, sh) {
			l := &out.LoadedSpans[len(out.LoadedSpans)-1]
			l.Spans = append(l.Spans, sh.Span+1)
		}
	}
	return out
}

// Place is where g is, in units u: "4.000 m", or "just left of 4.000 m"
// where the field jumps there (g.Side, fem.Side.Place).
func (g GoverningJSON) Place(u units.System) string {
	return fem.SideNamed(g.Side).Place(u.Format(units.Position, g.X))
}

// Arrangement is g's loaded spans in words, and its train's position in
// units u: "imposed on spans 1, 3"; "" when its combination places nothing
// by span and takes no train.
func (g GoverningJSON) Arrangement(u units.System) string {
	var parts []string
	if t := g.Train; t != nil {
		parts = append(parts, fmt.Sprintf("train %q, front at %s %s", t.Name, u.Format(units.Position, t.Front), t.Direction))
	}
	for _, l := range g.LoadedSpans {
		if len(l.Spans) == 0 {
			parts = append(parts, l.Case+" on no span")
			continue
		}
		s := make([]string, len(l.Spans))
		for i, n := range l.Spans {
			s[i] = fmt.Sprint(n)
		}
		word := "spans "
		if len(s) == 1 {
			word = "span "
		}
		parts = append(parts, l.Case+" on "+word+strings.Join(s, ", "))
	}
	return strings.Join(parts, "; ")
}

// FactorsText is a combination's factors in words: "1.35 × permanent + 1.5 × imposed".
// A negative factor is subtracted: "1 × permanent − 0.5 × wind"; a factor
// of 0, −0 too, is a term "+ 0 × snow".
func FactorsText(c CombinationJSON) string {
	var b strings.Builder
	for i, f := range c.Factors {
		sign, factor := "+", PlainZero(f.Factor)
		if factor < 0 {
			sign, factor = "−", -factor
		}
		switch {
		case i > 0:
			b.WriteString(" " + sign + " ")
		case sign == "−":
			b.WriteString(sign)
		}
		if f.Train != "" {
			fmt.Fprintf(&b, "%g × train %q", factor, f.Train)
		} else {
			fmt.Fprintf(&b, "%g × %s", factor, f.Case)
		}
	}
	return b.String()
}

// PlainZero is f with a zero of either sign as 0: a file may write a
// factor "-0", and a user may type one, which is no subtraction and reads
// "-0" in a document or a field.
func PlainZero(f float64) float64 {
	if f == 0 {
		return 0
	}
	return f
}

// WithTrains adds to r what CasesResults, reading the analysis alone,
// leaves out of a project with moving load trains: each combination's
// trains among its factors, and the combinations that take a train in the
// envelope (addTrainExtremes). It returns the trains' results (nil without
// trains), src's own when it has them. A nil r stays nil.
func (r *CasesJSON) WithTrains(src Source) []TrainResult {
	trains, p := src.trains(), src.Project
	if r != nil && p != nil {
		r.addTrainFactors(&p.Model, p.Trains)
		r.addTrainExtremes(&p.Model, trains)
	}
	return trains
}

// addTrainFactors adds to r's combinations the moving load trains each
// takes in model m, by the trains' names.
func (r *CasesJSON) addTrainFactors(m *fem.Model, trains []moving.Train) {
	for i := range r.Combinations {
		c := &r.Combinations[i]
		for _, cb := range m.Combinations {
			if cb.Name != c.Name {
				continue
			}
			for _, tf := range cb.Trains {
				if tf.Train >= 0 && tf.Train < len(trains) {
					c.Factors = append(c.Factors, FactorJSON{Train: trains[tf.Train].Name, Factor: PlainZero(tf.Factor)})
				}
			}
		}
	}
}

// addTrainExtremes takes into r's envelope the combinations that take a
// moving load train (trains, with their combinations worked out): where
// such a combination, at its train's worst position, goes beyond the
// envelope of the combinations' cases, it governs, with the train's
// position. Where no combination stresses the member along it, the
// combined stress is the bending stress on the worse fibre and takes the
// train too; otherwise it, the foundations and the drawing's envelope keep
// the cases alone.
func (r *CasesJSON) addTrainExtremes(m *fem.Model, trains []TrainResult) {
	if r == nil {
		return
	}
	envelope := func(q fem.Quantity) *QuantityEnvelope {
		for i := range r.Envelope.Quantities {
			if r.Envelope.Quantities[i].Quantity == q {
				return &r.Envelope.Quantities[i]
			}
		}
		return nil
	}
	axial := envelope(fem.QAxialStress)
	unstressedAlong := axial != nil && axial.Max.Value == 0 && axial.Min.Value == 0
	for _, tr := range trains {
		for _, c := range tr.Combinations {
			// beyond reports whether v, of this combination with its
			// train, takes the place of g as the largest (upper) or the
			// smallest: a tie goes to the first combination in the
			// file, and within one to its cases alone (fem.Supersedes).
			beyond := func(v float64, g *GoverningJSON, upper bool) bool {
				first := c.index < slices.IndexFunc(m.Combinations, func(cb fem.Combination) bool { return cb.Name == g.Combination })
				if upper {
					return fem.Supersedes(v, g.Value, 0, first)
				}
				return fem.Supersedes(-v, -g.Value, 0, first)
			}
			// upper says the extreme is a largest value, whose cases'
			// arrangement is the one that raises q there.
			governing := func(g fem.Governing, e TrainExtreme) GoverningJSON {
				g.Value, g.X = e.Value, e.X
				out := governingJSON(m, m.Combinations, c.solutions.Loads.Shares, g)
				out.Train = &TrainPlacementJSON{Name: tr.Train.Name, Front: e.Front, Direction: e.Direction}
				return out
			}
			for _, w := range c.Worst {
				if q := envelope(w.Quantity); q != nil {
					if beyond(w.Largest.Value, &q.Max, true) {
						q.Max = governing(c.Loaded(w.Quantity, w.Largest.X, true), w.Largest)
					}
					if beyond(w.Smallest.Value, &q.Min, false) {
						q.Min = governing(c.Loaded(w.Quantity, w.Smallest.X, false), w.Smallest)
					}
				}
				if q := envelope(fem.QCombinedStress); q != nil && unstressedAlong && w.Quantity == fem.QBendingStress {
					worse, upper := w.Largest, true
					if -w.Smallest.Value > worse.Value {
						worse, upper = w.Smallest, false
						worse.Value = -worse.Value
					}
					loaded := c.Loaded(w.Quantity, worse.X, upper)
					if beyond(worse.Value, &q.Max, true) {
						q.Max = governing(loaded, worse)
					}
					if beyond(-worse.Value, &q.Min, false) {
						q.Min = governing(loaded, worse)
						q.Min.Value = -worse.Value
					}
				}
			}
			for _, re := range c.Envelope.Reactions {
				name := componentNames[re.Motion]
				for i := range r.Envelope.Reactions {
					env := &r.Envelope.Reactions[i]
					if env.Support != re.Support+1 {
						continue
					}
					x := m.Supports[re.Support].X
					lo, hi := c.solutions.ArrangedReaction(c.index, re.Support, re.Motion)
					if g := env.Max[name]; g != nil && beyond(re.Max, g, true) {
						*g = governing(hi, TrainExtreme{Value: re.Max, X: x, Front: re.MaxAt.Front, Direction: re.MaxAt.Direction.String()})
					}
					if g := env.Min[name]; g != nil && beyond(re.Min, g, false) {
						*g = governing(lo, TrainExtreme{Value: re.Min, X: x, Front: re.MinAt.Front, Direction: re.MinAt.Direction.String()})
					}
				}
			}
		}
	}
}

// takesTrains reports whether a combination of r takes a train.
func (r *CasesJSON) takesTrains() bool {
	for _, c := range r.Combinations {
		for _, f := range c.Factors {
			if f.Train != "" {
				return true
			}
		}
	}
	return false
}

// WriteCasesText writes the cases, the combinations with their factors,
// and the envelope with the governing combination of each extreme and
// reaction, as text tables in units u.
func WriteCasesText(w io.Writer, path string, r *CasesJSON, u units.System) {
	pos := func(x float64) string { return u.Format(units.Position, x) }
	fmt.Fprintf(w, "Stave %s: %s\n", Version, path)
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintln(tw, "Load cases")
	for _, c := range r.Cases {
		var marks []string
		for _, n := range []struct {
			count int
			what  string
		}{{c.PointLoads, "point load"}, {c.DistributedLoads, "distributed load"}} {
			if n.count > 0 {
				marks = append(marks, units.Count(n.count, n.what))
			}
		}
		if c.SelfWeight {
			marks = append(marks, "self-weight")
		}
		if c.TemperatureChange != 0 {
			marks = append(marks, "temperature change "+u.Format(units.TemperatureChange, c.TemperatureChange))
		}
		if c.Settlements {
			marks = append(marks, "settlements")
		}
		if c.TemperatureDifferences {
			marks = append(marks, "temperature differences through the depth")
		}
		if c.BySpan {
			marks = append(marks, "placed by span")
		}
		fmt.Fprintf(tw, "  %s\t%s\n", c.Name, strings.Join(marks, ", "))
	}
	fmt.Fprintln(tw, "\nCombinations (factors given in the model: typical values at most; use your local code's)")
	for _, c := range r.Combinations {
		kind := c.Kind
		if c.Label != "" {
			kind = c.Label
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", c.Name, kind, FactorsText(c))
	}
	if r.takesTrains() {
		fmt.Fprintln(tw, "  A combination that takes a train enters the envelope below with its train at the train's worst position (its cases placed by span in their worst arrangement there); the trains further on give it in full.")
	}
	tw.Flush()
	fmt.Fprintf(tw, "\nEnvelope over every combination%s (%s solution)\n", spanWords(r.Envelope.Spans), r.Envelope.Solution)
	if a := r.Envelope.Accuracy; a != nil {
		fmt.Fprintf(tw, "  %s\n", a.Words())
	}
	fmt.Fprintln(tw, "  quantity\tlargest\tat x\tgoverning\tsmallest\tat x\tgoverning")
	for _, q := range r.Envelope.Quantities {
		k := q.Quantity.Info().Unit
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\n", q.Quantity.Info().Name, u.Format(k, q.Max.Value), q.Max.Place(u), governingWords(q.Max, u),
			u.Format(k, q.Min.Value), q.Min.Place(u), governingWords(q.Min, u))
	}
	tw.Flush()
	if len(r.Envelope.Reactions) == 0 {
		fmt.Fprintln(tw, "\nReaction envelope: none, "+noSupports+" (its resultant: Ground envelope, below)")
	} else {
		fmt.Fprintln(tw, "\nReaction envelope (forces of the supports on the member)")
		fmt.Fprintln(tw, "  support\tx\tcomponent\tlargest\tgoverning\tsmallest\tgoverning")
	}
	for _, re := range r.Envelope.Reactions {
		for d, name := range componentNames {
			k := units.Force
			if d == 2 {
				k = units.Moment
			}
			hi, lo := re.Max[name], re.Min[name]
			if hi == nil || lo == nil || hi.Value == 0 && lo.Value == 0 {
				continue
			}
			fmt.Fprintf(tw, "  %d %s\t%s\t%s\t%s\t%s\t%s\t%s\n", re.Support, re.Kind, pos(re.X), name, u.Format(k, hi.Value), governingWords(*hi, u), u.Format(k, lo.Value), governingWords(*lo, u))
		}
	}
	tw.Flush()
	if len(r.Envelope.Foundations) > 0 {
		fmt.Fprintln(tw, "\nGround envelope (resultant of each foundation's forces on the member)")
		fmt.Fprintln(tw, "  foundation\tfrom\tto\tcomponent\tlargest\tgoverning\tsmallest\tgoverning")
		for _, f := range r.Envelope.Foundations {
			for _, name := range componentNames[:2] {
				hi, lo := f.Max[name], f.Min[name]
				if hi.Value == 0 && lo.Value == 0 {
					continue
				}
				fmt.Fprintf(tw, "  %d\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", f.Foundation, pos(f.Start), pos(f.End), name,
					u.Format(units.Force, hi.Value), governingWords(hi, u), u.Format(units.Force, lo.Value), governingWords(lo, u))
			}
		}
		tw.Flush()
	}
}

// WriteCasesCaution writes the caution on results and on combined ones,
// which ends the text of a model with load cases.
func WriteCasesCaution(w io.Writer) {
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
	fmt.Fprintln(w, CombinedCaution)
}

// spanWords says how many spans the envelope places loads on.
func spanWords(spans [][2]float64) string {
	if len(spans) < 2 {
		return ""
	}
	return fmt.Sprintf(" and every arrangement of the %d spans for the cases placed by span", len(spans))
}

// atPlace is where g is as words after a value: "at 4.000 m", "just left
// of 4.000 m" (fem.Side.At).
func atPlace(g GoverningJSON, u units.System) string {
	return fem.SideNamed(g.Side).At(u.Format(units.Position, g.X))
}

// governingWords names what gives an extreme, positions in units u:
// "ULS 1 (imposed on spans 1, 3)".
func governingWords(g GoverningJSON, u units.System) string {
	if a := g.Arrangement(u); a != "" {
		return g.Combination + " (" + a + ")"
	}
	return g.Combination
}

// envelopeInput is the envelope the drawing shows for a, or nil when a
// shows one solution.
func envelopeInput(a *analysis.Analysis) *canvas.Envelope {
	c := a.Cases
	// Without a solution (the combinations overflowed, say) the drawing
	// shows the problem instead.
	if c == nil || c.Show.Kind != analysis.ShowEnvelope || a.Solution == nil {
		return nil
	}
	env := &canvas.Envelope{Solutions: c.Solutions, Result: c.Envelope, Names: make([]string, len(c.Combinations))}
	for k, cb := range c.Combinations {
		env.Names[k] = cb.Name
		env.TrainsLeftOut = env.TrainsLeftOut || len(cb.Trains) > 0
	}
	return env
}

// sheetCaseLines are the calculation sheet's lines on the cases of src's
// model: what is shown, the cases, the combinations with their factors,
// the envelope's governing bending moments, the
// transverse reactions' envelope, with the caution on combined results;
// none for a model without cases or an analysis not finished.
func sheetCaseLines(src Source) []string {
	a := src.Analysis
	if a == nil || a.Cases == nil || !a.Complete {
		return nil
	}
	r, err := CasesResults(a)
	if err != nil {
		return []string{"the cases could not be reported: " + err.Error()}
	}
	u := src.Units
	var names, combos []string
	for _, c := range r.Cases {
		n := c.Name
		if c.BySpan {
			n += " (placed by span)"
		}
		names = append(names, n)
	}
	for _, c := range r.Combinations {
		kind := c.Kind
		if c.Label != "" {
			kind = c.Label
		}
		combos = append(combos, fmt.Sprintf("%s (%s) = %s", c.Name, kind, FactorsText(c)))
	}
	lines := []string{fmt.Sprintf("Shown: %s; the results above are those of %s. Load cases: %s. Combinations: %s. %s",
		r.Shown, r.SummaryOf, strings.Join(names, "; "), strings.Join(combos, "; "), CombinedCaution)}
	if a := r.Envelope.Accuracy; a != nil {
		lines = append(lines, "The envelope is of the finite element solutions (a member on an elastic foundation). "+a.Words())
	}
	for _, q := range r.Envelope.Quantities {
		switch q.Quantity {
		case fem.QBendingMoment:
			k := q.Quantity.Info().Unit
			lines = append(lines, fmt.Sprintf("Envelope of %s: largest %s %s, %s; smallest %s %s, %s.", q.Quantity.Info().Name,
				u.Format(k, q.Max.Value), atPlace(q.Max, u), governingWords(q.Max, u),
				u.Format(k, q.Min.Value), atPlace(q.Min, u), governingWords(q.Min, u)))
		}
	}
	// transverse is the range of one transverse envelope, numbered n;
	// "" where it is zero throughout.
	transverse := func(n int, hi, lo *GoverningJSON) string {
		if hi == nil || lo == nil || hi.Value == 0 && lo.Value == 0 {
			return ""
		}
		return fmt.Sprintf("%d: %s (%s) to %s (%s)", n, u.Format(units.Force, lo.Value), governingWords(*lo, u), u.Format(units.Force, hi.Value), governingWords(*hi, u))
	}
	var reactions, ground []string
	for _, re := range r.Envelope.Reactions {
		if t := transverse(re.Support, re.Max["transverse"], re.Min["transverse"]); t != "" {
			reactions = append(reactions, t)
		}
	}
	for _, f := range r.Envelope.Foundations {
		hi, lo := f.Max["transverse"], f.Min["transverse"]
		if t := transverse(f.Foundation, &hi, &lo); t != "" {
			ground = append(ground, t)
		}
	}
	if len(reactions) > 0 {
		lines = append(lines, "Transverse reactions, support "+strings.Join(reactions, "; ")+".")
	}
	if len(ground) > 0 {
		lines = append(lines, "Ground's resultant across the member, foundation "+strings.Join(ground, "; ")+".")
	}
	return lines
}

// envelopeAccuracy is how far the finite element envelope of c is from the
// exact solutions: the worst accuracy of its combinations' extremes (each
// with every span loaded); nil for an exact envelope, or when a
// combination has no exact solution or was not solved.
func envelopeAccuracy(c *analysis.Cases) *EnvelopeAccuracyJSON {
	if c.Envelope.Exact || len(c.Summaries) != len(c.Combinations) {
		return nil
	}
	var out *EnvelopeAccuracyJSON
	for k, sum := range c.Summaries {
		if sum == nil {
			return nil
		}
		w, ok := sum.Worst()
		if !ok {
			return nil
		}
		if out == nil || w.Accuracy > out.Ratio {
			out = &EnvelopeAccuracyJSON{Ratio: w.Accuracy, Quantity: w.Quantity.Key(), Combination: c.Combinations[k].Name, quantity: w.Quantity}
		}
	}
	return out
}

// envelopeSolution names whose values env's quantities hold.
func envelopeSolution(env *fem.Envelope) string {
	if env.Exact {
		return "exact"
	}
	return "finite element"
}
