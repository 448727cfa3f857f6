package report

import (
	"fmt"
	"math"
	"slices"
	"sync"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// TrainResult is one train's worst positions for the target and, when
// asked, its envelope.
type TrainResult struct {
	Train moving.Train
	Label string
	// Target says Largest and Smallest hold the target's extremes.
	Target            bool
	Largest, Smallest TrainExtreme
	// Err is why the train could not be placed (it does not fit, say).
	Err      error
	Envelope *moving.Envelope
	// Worst are the envelope's extremes of each quantity, checked by
	// solving the train at its governing position by finite elements.
	Worst []QuantityWorst
	// Combinations are the combinations that take the train, each its
	// envelope with the combination's own cases on top (with the envelope).
	Combinations []TrainCombination
}

// TrainCombination is a combination that takes a train with a factor:
// at every station, the combination's cases (exact solution, the worst
// arrangement of those placed by span) plus the factor times the train's
// largest or smallest value, and the extremes of that over the member.
type TrainCombination struct {
	Combination string
	Factor      float64
	Envelope    *moving.Envelope
	Worst       []QuantityWorst
	// solutions are the model's combinations solved, for the arrangement
	// of the cases placed by span (Loaded); index is this one's.
	solutions *fem.CombinationSolutions
	index     int
	// sides are the sides of their stations that the extremes where the
	// cases' field jumps are read on; the others are read on the right,
	// where nothing jumps.
	sides map[sideRead]fem.Side
}

// sideRead is the largest (upper) or smallest value of quantity q (an
// index into moving.EnvelopeQuantities) at station s.
type sideRead struct {
	q, s  int
	upper bool
}

// TrainExtreme is an extreme of a quantity under a train: its value (SI),
// where it is, the position that gives it and, when checked, the finite
// element value with the train solved there. Side is "left" or "right"
// where the envelope jumps at X (the shear force at a support): the value
// is then the one just left or just right of the point, as a single
// case's extremes say (fem.Side.Name); left out where it does not jump.
type TrainExtreme struct {
	Value     float64  `json:"value"`
	X         float64  `json:"x"`
	Side      string   `json:"side,omitempty"`
	Direction string   `json:"direction"`
	Front     float64  `json:"front"`
	FE        *float64 `json:"finite_elements,omitempty"`
}

// Extreme is e as the envelope's extremes are: its value, where it is,
// the side of it and the position that gives it.
func (e TrainExtreme) Extreme() moving.Extreme {
	d, _ := moving.ParseDirection(e.Direction)
	return moving.Extreme{Value: e.Value, X: e.X, Side: fem.SideNamed(e.Side), Placement: moving.Placement{Direction: d, Front: e.Front}}
}

// QuantityWorst are the extremes of one quantity over a train's positions.
type QuantityWorst struct {
	Quantity fem.Quantity `json:"quantity"`
	Largest  TrainExtreme `json:"largest"`
	Smallest TrainExtreme `json:"smallest"`
}

// trainResults places every train of p on the member of in: its extremes
// of target when one is given, and its envelope when asked; a train that
// cannot be worked out carries why, its values in u.
func trainResults(p *storage.Project, in *moving.Influence, mesh fem.Mesh, target *moving.Target, envelope bool, u units.System) []TrainResult {
	var out []TrainResult
	// The combinations solved with every span share, once for every train
	// that a combination takes.
	arranged := sync.OnceValues(func() (*fem.CombinationSolutions, error) { return arrangedSolutions(&p.Model) })
	for i := range p.Trains {
		t := &p.Trains[i]
		tr := TrainResult{Train: *t, Label: t.Label(i)}
		if err := trainResult(p, i, in, mesh, target, envelope, arranged, &tr, u); err != nil {
			// The train's own: the others are worked out all the same (an
			// axle of 1e300 N on one train had every train of the file
			// reported as not placed).
			tr = TrainResult{Train: *t, Label: t.Label(i), Err: err}
		}
		out = append(out, tr)
	}
	return out
}

// trainResult works out train i of p into tr: its worst positions for
// target, when not nil, and its envelope with the combinations that take
// it, when envelope (arranged solves the combinations for them). Why a
// train does not fit quotes its values in u.
func trainResult(p *storage.Project, i int, in *moving.Influence, mesh fem.Mesh, target *moving.Target, envelope bool,
	arranged func() (*fem.CombinationSolutions, error), tr *TrainResult, u units.System) error {
	t := &p.Trains[i]
	if err := t.Check(p.Model.Length(), i, u); err != nil {
		return err
	}
	if target != nil {
		hi, lo, err := in.Worst(t, mesh, *target)
		if err != nil {
			return err
		}
		tr.Target, tr.Largest, tr.Smallest = true, trainExtreme(hi), trainExtreme(lo)
	}
	if !envelope {
		return nil
	}
	var err error
	if tr.Envelope, err = in.Envelope(t, mesh, nil); err != nil {
		return err
	}
	if tr.Worst, err = checkedWorst(&p.Model, t, tr.Envelope); err != nil {
		return err
	}
	tr.Combinations, err = trainCombinations(p, i, in, mesh, tr.Envelope, arranged)
	return err
}

// trainCombinations are the combinations of p that take train i, each
// with train i's envelope e factored on top of its cases (exact solution):
// at each station the worst arrangement of its cases placed by span for
// the largest value and for the smallest, the train's position and the
// spans loaded being chosen apart (every span loaded can fall short: a
// by-span load on one span of two with an axle on it gives more sagging
// there than on both). Where the cases' field jumps at a station (the
// shear force at a support), the two sides are combined apart: the train's
// envelope is read on either side of the station (moving.EnvelopeSide), so
// its largest value meets the cases' field on the same side, and the worse
// side is kept. arranged gives the model's combinations
// solved with every span share, the same for every train.
func trainCombinations(p *storage.Project, i int, in *moving.Influence, mesh fem.Mesh, e *moving.Envelope,
	arranged func() (*fem.CombinationSolutions, error)) ([]TrainCombination, error) {
	m := &p.Model
	var out []TrainCombination
	var cs *fem.CombinationSolutions
	var sides [2]*moving.Envelope
	for ci, cb := range m.Combinations {
		for _, tf := range cb.Trains {
			if tf.Train != i {
				continue
			}
			if cs == nil {
				var err error
				if cs, err = arranged(); err != nil {
					return nil, fmt.Errorf("combination %q with its train: %w", cb.Name, err)
				}
				for k, side := range []fem.Side{fem.Left, fem.Right} {
					if sides[k], err = in.EnvelopeSide(&p.Trains[i], mesh, e.Stations, side); err != nil {
						return nil, err
					}
				}
			}
			// The cases at the stations on one side, every quantity's
			// largest and smallest over the arrangements, with the
			// reactions when asked.
			base := func(stations []float64, side fem.Side, reactions bool) moving.Base {
				nq := len(moving.EnvelopeQuantities)
				b := moving.Base{Max: make([][]float64, nq), Min: make([][]float64, nq)}
				for q := range nq {
					b.Max[q], b.Min[q] = make([]float64, len(stations)), make([]float64, len(stations))
				}
				for s, x := range stations {
					lo, hi := cs.Arranged(ci, moving.EnvelopeQuantities, x, side)
					for q := range nq {
						b.Max[q][s], b.Min[q][s] = hi[q].Value, lo[q].Value
					}
				}
				if reactions {
					for _, re := range e.Reactions {
						lo, hi := cs.ArrangedReaction(ci, re.Support, re.Motion)
						b.MaxReactions, b.MinReactions = append(b.MaxReactions, hi.Value), append(b.MinReactions, lo.Value)
					}
				}
				return b
			}
			right := base(e.Stations, fem.Right, true)
			c := e.Combine(tf.Factor, right)
			// The cases' field and the train's on each side of the
			// station itself.
			leftBase := base(e.Stations, fem.Left, false)
			onLeft, onRight := sides[0].Combine(tf.Factor, leftBase), sides[1].Combine(tf.Factor, right)
			tc := TrainCombination{Combination: cb.Name, Factor: PlainZero(tf.Factor), Envelope: c, solutions: cs, index: ci, sides: map[sideRead]fem.Side{}}
			for q := range moving.EnvelopeQuantities {
				scale := 0.0
				for s := range e.Stations {
					scale = max(scale, math.Abs(right.Max[q][s]), math.Abs(right.Min[q][s]))
				}
				for s := range e.Stations {
					jumpsMax, jumpsMin := math.Abs(leftBase.Max[q][s]-right.Max[q][s]) > 1e-12*scale, math.Abs(leftBase.Min[q][s]-right.Min[q][s]) > 1e-12*scale
					if !jumpsMax && !jumpsMin {
						continue // no jump: the station's own values hold
					}
					// side records the side an extreme is read on where its own field jumps.
					side := func(upper, jumps, onTheRight bool) {
						switch {
						case !jumps:
						case onTheRight:
							tc.sides[sideRead{q, s, upper}] = fem.Right
						default:
							tc.sides[sideRead{q, s, upper}] = fem.Left
						}
					}
					c.Max[q][s], c.MaxAt[q][s] = onLeft.Max[q][s], onLeft.MaxAt[q][s]
					if onRight.Max[q][s] > c.Max[q][s] {
						c.Max[q][s], c.MaxAt[q][s] = onRight.Max[q][s], onRight.MaxAt[q][s]
						side(true, jumpsMax, true)
					} else {
						side(true, jumpsMax, false)
					}
					c.Min[q][s], c.MinAt[q][s] = onLeft.Min[q][s], onLeft.MinAt[q][s]
					if onRight.Min[q][s] < c.Min[q][s] {
						c.Min[q][s], c.MinAt[q][s] = onRight.Min[q][s], onRight.MinAt[q][s]
						side(false, jumpsMin, true)
					} else {
						side(false, jumpsMin, false)
					}
					// The side the combination's own extremes are read on,
					// where the sum jumps.
					c.MaxSide[q][s] = moving.JumpSide(onLeft.Max[q][s], onRight.Max[q][s], true)
					c.MinSide[q][s] = moving.JumpSide(onLeft.Min[q][s], onRight.Min[q][s], false)
				}
			}
			if !finiteEnvelope(c) {
				return nil, fmt.Errorf("combination %q takes it with a factor of %s, and the results are too large for floating point (a force, moment or displacement is infinite): check the factor and the train's loads", cb.Name, units.FormatG("%.3g", tf.Factor))
			}
			// The combination at points off the stations, for its peaks
			// there (no support lies between stations: no jump to side).
			probe := func(xs []float64) *moving.Envelope {
				at, err := in.Envelope(&p.Trains[i], mesh, xs)
				if err != nil {
					return nil
				}
				return at.Combine(tf.Factor, base(xs, fem.Right, false))
			}
			for k, q := range moving.EnvelopeQuantities {
				hi, lo := c.Worst(q)
				if peak, off := c.Peak(k, true, probe); off {
					hi = peak
				}
				if peak, off := c.Peak(k, false, probe); off {
					lo = peak
				}
				tc.Worst = append(tc.Worst, QuantityWorst{Quantity: q, Largest: trainExtreme(hi), Smallest: trainExtreme(lo)})
			}
			out = append(out, tc)
		}
	}
	return out, nil
}

// finiteEnvelope says whether every extreme of e, along the member and of
// the reactions, is a finite number.
func finiteEnvelope(e *moving.Envelope) bool {
	infinite := func(v float64) bool { return math.IsInf(v, 0) || math.IsNaN(v) }
	for _, rows := range [][][]float64{e.Max, e.Min} {
		for _, row := range rows {
			if slices.ContainsFunc(row, infinite) {
				return false
			}
		}
	}
	return !slices.ContainsFunc(e.Reactions, func(r moving.ReactionEnvelope) bool { return infinite(r.Max) || infinite(r.Min) })
}

// TrainCombinations are the combinations of p that take train i, each
// with e, the train's envelope on in and mesh, factored on top of its
// cases, as the trains' results give them.
func TrainCombinations(p *storage.Project, i int, in *moving.Influence, mesh fem.Mesh, e *moving.Envelope) ([]TrainCombination, error) {
	return trainCombinations(p, i, in, mesh, e, func() (*fem.CombinationSolutions, error) { return arrangedSolutions(&p.Model) })
}

// arrangedSolutions are the load sets of m's combinations, every case and
// every span share of a case placed by span, solved exactly.
func arrangedSolutions(m *fem.Model) (*fem.CombinationSolutions, error) {
	member, err := fem.Prepare(m)
	if err != nil {
		return nil, err
	}
	cs, err := member.SolveCombinations(member.Mesh())
	if err != nil {
		return nil, err
	}
	if err := cs.SolveExact(member); err != nil {
		return nil, err
	}
	return cs, nil
}

// Loaded is the arrangement of the combination's cases placed by span
// that gives its largest (upper) or smallest value of q at x, under the
// train's governing position there: the spans loaded, and the side of x
// it is read on where the cases' field jumps there (Governing.Side).
func (c TrainCombination) Loaded(q fem.Quantity, x float64, upper bool) fem.Governing {
	var side fem.Side
	if s := slices.Index(c.Envelope.Stations, x); s >= 0 {
		side = c.sides[sideRead{slices.Index(moving.EnvelopeQuantities, q), s, upper}]
	}
	read := side
	if read == 0 {
		read = fem.Right // nothing jumps: either side
	}
	lo, hi := c.solutions.Arranged(c.index, []fem.Quantity{q}, x, read)
	g := hi[0]
	if !upper {
		g = lo[0]
	}
	g.Side = side
	return g
}

func trainExtreme(e moving.Extreme) TrainExtreme {
	return TrainExtreme{Value: e.Value, X: e.X, Side: e.Side.Name(), Direction: e.Placement.Direction.String(), Front: e.Placement.Front}
}

// checkedWorst are the envelope's extremes of each quantity, each checked
// by solving the train at its governing position by finite elements and
// reading the field there on either side. Where an axle stands on the
// point the envelope holds the larger of the two limits with the axle just
// either side of it (the shear force beside a wheel, say), which finite
// elements, placing the load on the node, do not give at once: the train
// is then also solved moved by a hair (nudge·L) each way, and the reading
// nearest to the envelope's is kept, so a check that fails shows.
func checkedWorst(m *fem.Model, t *moving.Train, e *moving.Envelope) ([]QuantityWorst, error) {
	var out []QuantityWorst
	for _, q := range moving.EnvelopeQuantities {
		hi, lo := e.Worst(q)
		w := QuantityWorst{Quantity: q, Largest: trainExtreme(hi), Smallest: trainExtreme(lo)}
		for _, x := range []struct {
			ex  moving.Extreme
			out *TrainExtreme
		}{{hi, &w.Largest}, {lo, &w.Smallest}} {
			v, err := feReading(m, t, q, x.ex)
			if err != nil {
				return nil, err
			}
			x.out.FE = &v
		}
		out = append(out, w)
	}
	return out, nil
}

// nudge is how far, relative to the member, a train is moved to read the
// limits beside an axle standing on a point.
const nudge = 1e-6

// feReading is quantity q at ex.X with the train at ex.Placement solved by
// finite elements (see checkedWorst).
func feReading(m *fem.Model, t *moving.Train, q fem.Quantity, ex moving.Extreme) (float64, error) {
	L := m.Length()
	places := []moving.Placement{ex.Placement}
	points, _ := t.Loads(ex.Placement)
	for _, p := range points {
		if math.Abs(p.X-ex.X) <= 1e-9*L {
			for _, d := range []float64{-nudge * L, nudge * L} {
				// A train at an end of its run moves by a hair one way only.
				if pl := (moving.Placement{Direction: ex.Placement.Direction, Front: ex.Placement.Front + d}); onRun(t, pl, L) {
					places = append(places, pl)
				}
			}
			break
		}
	}
	best := math.NaN()
	for _, pl := range places {
		tm := t.Model(m, pl)
		sol, err := fem.Solve(&tm)
		if err != nil {
			return 0, fmt.Errorf("the train at its governing position: %w", err)
		}
		for _, side := range []fem.Side{fem.Left, fem.Right} {
			f := sol.At(ex.X, side)
			if v := q.Of(&f); math.IsNaN(best) || math.Abs(v-ex.Value) < math.Abs(best-ex.Value) {
				best = v
			}
		}
	}
	return best, nil
}

// onRun reports whether p is one of t's positions on a member of length
// L: its front within the range the train's fronts take (Train.Fronts,
// the mirror range for a train moving backward).
func onRun(t *moving.Train, p moving.Placement, L float64) bool {
	lo, hi := t.Fronts(L)
	if p.Direction == moving.Backward {
		lo, hi = lo-t.Length(), hi-t.Length()
	}
	return p.Front >= lo && p.Front <= hi
}

// TrainEnvelopes are the envelopes of every train of p, each extreme
// checked by finite elements at its governing position: what the solve
// command can add to its JSON as "trains" (TrainsJSON). Its messages
// quote values in u; units of no name (the zero System) are SI base
// units, as a file holds them.
func TrainEnvelopes(p *storage.Project, u units.System) ([]TrainResult, error) {
	member, in, err := InfluenceOf(p, u)
	if err != nil {
		return nil, err
	}
	return trainResults(p, in, member.Mesh(), nil, true, u), nil
}

// solveTrains are the envelopes of p's trains for the solve command, each
// train alone on the member without its own loads; when the member's
// influence lines cannot be set up, every train carries why, in u.
func solveTrains(p *storage.Project, u units.System) []TrainResult {
	if p == nil || len(p.Trains) == 0 {
		return nil
	}
	rs, err := TrainEnvelopes(p, u)
	if err == nil {
		return rs
	}
	rs = make([]TrainResult, len(p.Trains))
	for i, t := range p.Trains {
		rs[i] = TrainResult{Train: t, Label: t.Label(i), Err: err}
	}
	return rs
}

// InfluenceOf prepares the member of p and sets up its influence lines:
// the member every command and the window's moving loads work on. fem's
// messages quote values in u (fem.PrepareIn); units of no name (the zero
// System) are SI base units.
func InfluenceOf(p *storage.Project, u units.System) (*fem.Member, *moving.Influence, error) {
	member, err := fem.PrepareIn(&p.Model, u)
	if err != nil {
		return nil, nil, err
	}
	if mesh := member.Mesh(); mesh.Automatic && len(mesh.Elements) < influenceElements {
		// The automatic mesh is sized for the member's own loads (one
		// element a stretch when it has none); a unit load standing on the
		// nearest node needs nodes along the whole member.
		m := p.Model.Clone()
		m.Mesh.Elements = influenceElements
		if member, err = fem.PrepareIn(&m, u); err != nil {
			return nil, nil, err
		}
	}
	in, err := moving.New(member)
	return member, in, err
}

// influenceElements is the fewest elements the finite element influence
// line and a train's default step are taken on, when the mesh is Stave's.
const influenceElements = 100

// TrainJSON is one train's results as JSON, in SI units; positions are the
// x of the train's front (its first axle) and the way it faces.
type TrainJSON struct {
	Train     string             `json:"train"`
	Error     string             `json:"error,omitempty"`
	Direction string             `json:"direction"`
	From      float64            `json:"from"`
	To        float64            `json:"to"`
	Step      float64            `json:"step,omitempty"`
	Positions int                `json:"positions,omitempty"`
	Target    *TargetJSON        `json:"target,omitempty"`
	Worst     []QuantityWorst    `json:"worst,omitempty"`
	Reactions []ReactionJSON     `json:"reactions,omitempty"`
	Envelope  *TrainEnvelopeJSON `json:"envelope,omitempty"`
	// Combinations are the combinations that take the train
	// (TrainCombination).
	Combinations []TrainCombinationJSON `json:"combinations,omitempty"`
}

// TrainCombinationJSON is a combination that takes the train: its name,
// the train's factor and the extremes of every quantity.
type TrainCombinationJSON struct {
	Combination string          `json:"combination"`
	Factor      float64         `json:"factor"`
	Worst       []QuantityWorst `json:"worst"`
}

// TargetJSON are a train's extremes of the influence command's target.
type TargetJSON struct {
	Largest  TrainExtreme `json:"largest"`
	Smallest TrainExtreme `json:"smallest"`
}

// ReactionJSON is the range of one reaction over a train's positions;
// Support counts from 1.
type ReactionJSON struct {
	Support  int          `json:"support"`
	Motion   string       `json:"motion"`
	Largest  TrainExtreme `json:"largest"`
	Smallest TrainExtreme `json:"smallest"`
}

// TrainEnvelopeJSON is a train's envelope at every station: per quantity the
// largest and smallest values and the front and direction of the train
// that gives each.
type TrainEnvelopeJSON struct {
	Stations   []float64          `json:"stations"`
	Quantities []EnvelopeQuantity `json:"quantities"`
}

// EnvelopeQuantity is the envelope of one quantity.
type EnvelopeQuantity struct {
	Quantity     fem.Quantity `json:"quantity"`
	Max          []float64    `json:"max"`
	MaxFront     []float64    `json:"max_front"`
	MaxDirection []string     `json:"max_direction"`
	Min          []float64    `json:"min"`
	MinFront     []float64    `json:"min_front"`
	MinDirection []string     `json:"min_direction"`
}

// TrainsJSON turns train results on model m into JSON, with the envelope
// at every station when stations is set.
func TrainsJSON(m *fem.Model, rs []TrainResult, stations bool) []TrainJSON {
	out := make([]TrainJSON, 0, len(rs))
	for _, r := range rs {
		from, to := r.Train.Run(m.Length())
		j := TrainJSON{Train: r.Label, Direction: r.Train.Direction.String(), From: from, To: to}
		if r.Train.Name != "" {
			j.Train = r.Train.Name // the name as the file gives it; "train N" for one without
		}
		if r.Err != nil {
			j.Error = r.Err.Error()
			out = append(out, j)
			continue
		}
		if r.Target {
			j.Target = &TargetJSON{r.Largest, r.Smallest}
		}
		if e := r.Envelope; e != nil {
			j.Step, j.Positions, j.Worst = e.Step, e.Positions, r.Worst
			for _, re := range e.Reactions {
				x := m.Supports[re.Support].X
				j.Reactions = append(j.Reactions, ReactionJSON{Support: re.Support + 1, Motion: re.Motion.String(),
					Largest:  TrainExtreme{Value: re.Max, X: x, Direction: re.MaxAt.Direction.String(), Front: re.MaxAt.Front},
					Smallest: TrainExtreme{Value: re.Min, X: x, Direction: re.MinAt.Direction.String(), Front: re.MinAt.Front}})
			}
			if stations {
				j.Envelope = envelopeJSON(e)
			}
			for _, c := range r.Combinations {
				j.Combinations = append(j.Combinations, TrainCombinationJSON{Combination: c.Combination, Factor: c.Factor, Worst: c.Worst})
			}
		}
		out = append(out, j)
	}
	return out
}

func envelopeJSON(e *moving.Envelope) *TrainEnvelopeJSON {
	out := &TrainEnvelopeJSON{Stations: e.Stations}
	for q, qty := range moving.EnvelopeQuantities {
		eq := EnvelopeQuantity{Quantity: qty, Max: e.Max[q], Min: e.Min[q]}
		for s := range e.Stations {
			hi, lo := e.MaxAt[q][s], e.MinAt[q][s]
			eq.MaxFront, eq.MaxDirection = append(eq.MaxFront, hi.Front), append(eq.MaxDirection, hi.Direction.String())
			eq.MinFront, eq.MinDirection = append(eq.MinFront, lo.Front), append(eq.MinDirection, lo.Direction.String())
		}
		out.Quantities = append(out.Quantities, eq)
	}
	return out
}

// TrainFindings are the findings of the trains that could not be placed
// on the member, which their results leave out: a warning each, beside
// the error in the train's own results.
func TrainFindings(trains []TrainResult) []analysis.Finding {
	var out []analysis.Finding
	for _, t := range trains {
		if t.Err == nil {
			continue
		}
		out = append(out, analysis.CodeTrainNotPlaced.Finding(fmt.Sprintf("moving load %s left out", t.Label),
			fmt.Sprintf("Moving load %s could not be placed on the member, so the trains' results leave it out: %v.", t.Label, t.Err)))
	}
	return out
}

// UncheckedTrains are the findings of p's trains that no combination takes:
// the design checks, the drawn results and the load-case envelope are the
// member's own loads and cases alone, so a crane runway checked without
// its crane would pass at the stress of its self-weight. A caution each.
func UncheckedTrains(p *storage.Project) []analysis.Finding {
	var out []analysis.Finding
	for i := range p.Trains {
		taken := slices.ContainsFunc(p.Model.Combinations, func(cb fem.Combination) bool {
			return slices.ContainsFunc(cb.Trains, func(tf fem.TrainFactor) bool { return tf.Train == i })
		})
		if taken {
			continue
		}
		label := p.Trains[i].Label(i)
		out = append(out, analysis.CodeTrainNotChecked.Finding(fmt.Sprintf("moving load %s not in the checks", label),
			fmt.Sprintf("Moving load %s is in no combination, so the design checks and the drawn results take the member's own loads and cases alone. The train's worst effects over all its positions are in the trains' results (stave solve, stave influence --envelope, Study > Moving loads… in the window): check them against your limits, or take the train in a combination with the loads that act with it.", label)))
	}
	return out
}

// WithTrains is src with its trains worked out (Trains) and the findings
// of those that could not be placed, or that no combination takes, added
// to its findings.
func (src Source) WithTrains() Source {
	src.Trains = src.trains()
	src.Findings = append(slices.Clip(src.Findings), TrainFindings(src.Trains)...)
	if src.Project != nil {
		src.Findings = append(src.Findings, UncheckedTrains(src.Project)...)
	}
	return src
}
