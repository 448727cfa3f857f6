package moving

import (
	"cmp"
	"errors"
	"math"
	"slices"

	"stave/fem"
)

// maxReaders is the most lines one scan takes.
const maxReaders = len(envelopeRows)

// extreme is the largest (or smallest) effect found so far and the number
// of the position that gives it, −1 before any.
type extreme struct {
	value float64
	at    int32
}

// most takes v at position at where it is the first or beyond the largest
// so far by more than a tie (fem.Beyond): of equal effects, round-off
// apart, the first position (forward before backward, then along the run).
func (e *extreme) most(v float64, at int32) {
	if e.at < 0 || fem.Beyond(v, e.value) {
		e.value, e.at = v, at
	}
}

// least is most for the smallest.
func (e *extreme) least(v float64, at int32) {
	if e.at < 0 || fem.Beyond(e.value, v) {
		e.value, e.at = v, at
	}
}

// scan folds into hi and lo (one per line of ls) the largest and smallest
// effect of the run over all its positions. On each stretch of positions
// between the breaks (where an axle or an end of the uniform load passes a
// bound of ls) every line's effect is one polynomial F of the front's
// position, of degree 3 (4 with a uniform load): its extremes over the
// positions are at the first and last position of the stretch and at the
// positions next to the roots of F′. Where the lines may jump (at ls.at), a
// position with an axle standing on the point is also evaluated with the
// axle on each of the sides given (on the line's sides of its jump).
//
// Every polynomial is written in ŝ = s/ℓ, the front's position over the
// member's length, so that each axle's term on each piece of ls is shifted
// once per scan, not once per stretch of positions; with ŝ in [0, 1] that
// costs at most a digit of the sixteen.
func (r *run) scan(ls *lines, hi, lo []extreme, jumps []fem.Side) {
	n, ell := ls.n, ls.length
	r.terms(ls)
	br := r.mergeBreaks(ls)
	// place[a] is the piece of ls under axle a (then under the ends of the
	// uniform load), advanced as the stretches of positions go by.
	places := slices.Grow(r.places[:0], len(r.axles)+2)[:len(r.axles)+2]
	clear(places)
	r.places = places
	ends := [2]float64{r.u0, r.u1}
	var f [maxReaders]poly
	summed := -1 // stretches since f was summed afresh; −1 before the first
	for i := 1; i < len(br); i++ {
		a, b := br[i-1], br[i]
		if b < a || (b == a && r.n > 1) {
			continue
		}
		kLo := max(0, int(math.Ceil((a-r.s0)/r.step-1e-9)))
		kHi := min(r.n-1, int(math.Floor((b-r.s0)/r.step+1e-9)))
		if r.n == 1 {
			kLo, kHi = 0, 0
		}
		if kLo > kHi {
			continue
		}
		mid := 0.5 * (a + b)
		// f holds every axle's term on the piece it stood on at the last
		// stretch evaluated: a long train moves a few axles to another
		// piece per stretch, so f takes their change alone (summing every
		// axle on every stretch cost the square of the axles), and is
		// summed afresh every resumEvery stretches, against drift, and
		// always for a short train.
		full := summed < 0 || summed == resumEvery || len(r.axles) <= shortTrain
		if full {
			f = [maxReaders]poly{}
			summed = 0
		}
		summed++
		ns := slots(ls)
		for k, ax := range r.axles {
			move(ls, f[:n], &places[k], mid+ax.offset, ax.load, r.axleTerms[k*ns*n:], full)
		}
		if r.uniform {
			for e, off := range ends {
				sign := float64(2*e - 1) // the integral to the far end less that to the near one
				move(ls, f[:n], &places[len(r.axles)+e], mid+off, sign*r.q, r.uniformTerms[e*ns*n:], full)
			}
		}
		for i := range n {
			cands := append(r.candidates[:0], kLo, kHi)
			var roots [3]float64
			for _, u := range roots[:rootsIn(f[i].derivative(), a/ell, b/ell, &roots)] {
				k := int(math.Floor((u*ell - r.s0) / r.step))
				cands = append(cands, min(max(k, kLo), kHi), min(max(k+1, kLo), kHi))
			}
			r.candidates = cands
			for _, k := range cands {
				v := f[i].at(r.front(k) / ell)
				hi[i].most(v, r.first+int32(k))
				lo[i].least(v, r.first+int32(k))
			}
		}
	}
	if len(jumps) > 0 {
		r.scanJumps(ls, hi, lo, jumps)
	}
}

// A train of at most shortTrain axles is summed afresh on every stretch of
// positions; a longer one every resumEvery stretches (see scan).
const (
	shortTrain = 8
	resumEvery = 32
)

// move advances *place to the slot of ls holding sigma (see terms), where a
// load c stands whose terms per slot are terms (len(f) lines a slot), and
// adds c times its terms there to f; unless full, f already holds its
// terms on the slot it leaves, which it trades for the new (nothing when it
// stays).
func move(ls *lines, f []poly, place *int, sigma, c float64, terms []poly, full bool) {
	n := len(f)
	old := *place
	p := ls.advance(place, sigma)
	if !full && p == old {
		return
	}
	g := terms[p*n : p*n+n]
	for i := range f {
		f[i].add(c, &g[i])
	}
	if !full {
		g0 := terms[old*n : old*n+n]
		for i := range f {
			f[i].add(-c, &g0[i])
		}
	}
}

// terms writes, for every axle and piece of ls, each line's value per
// newton of that axle as a polynomial in ŝ (the axle at ŝ·ℓ + offset
// standing on the piece), and for each end of the uniform load the
// integral of each line from 0 to it.
//
// A load's terms take slots(ls) places: the pieces of ls between two more,
// before the member (slot 0) and past it (the last), where a train that
// drives off its ends (Train.OffEnds) has loads that carry nothing: an axle
// there adds zero, an end of the uniform load the integral to that end of
// the member.
func (r *run) terms(ls *lines) {
	n, np := ls.n, ls.pieces()
	ns := slots(ls)
	r.axleTerms = slices.Grow(r.axleTerms[:0], len(r.axles)*ns*n)[:len(r.axles)*ns*n]
	for k, ax := range r.axles {
		at := r.axleTerms[k*ns*n : (k+1)*ns*n]
		clear(at[:n])
		clear(at[(ns-1)*n:])
		for p := range np {
			t := (ax.offset - ls.bounds[p]) / ls.length
			for i := range n {
				at[(p+1)*n+i] = ls.coef[p*n+i].shift(t)
			}
		}
	}
	if !r.uniform {
		return
	}
	r.uniformTerms = slices.Grow(r.uniformTerms[:0], 2*ns*n)[:2*ns*n]
	for e, off := range [2]float64{r.u0, r.u1} {
		ut := r.uniformTerms[e*ns*n : (e+1)*ns*n]
		for i := range n {
			ut[i] = poly{}
			ut[(ns-1)*n+i] = poly{ls.integral(i, ls.bounds[np])}
		}
		for p := range np {
			t := (off - ls.bounds[p]) / ls.length
			for i := range n {
				phi := ls.coef[p*n+i].antiderivative()
				for c := range phi {
					phi[c] *= ls.length
				}
				phi[0] += ls.integ[p*n+i]
				ut[(p+1)*n+i] = phi.shift(t)
			}
		}
	}
}

// slots is the number of places a load's terms take on ls: its pieces and
// one before and one past the member (see terms).
func slots(ls *lines) int { return ls.pieces() + 2 }

// setKeys keeps the fronts where an axle or an end of the uniform load
// passes one of the member's key points, within the run's positions and
// in order, for every scan to merge its own breaks into.
func (r *run) setKeys(keys []float64) {
	r.keys = keys
	r.offsets = r.offsets[:0]
	for _, ax := range r.axles {
		r.offsets = append(r.offsets, ax.offset)
	}
	if r.uniform {
		r.offsets = append(r.offsets, r.u0, r.u1)
	}
	r.fixed = append(r.fixed[:0], r.s0)
	for _, b := range keys {
		r.fixed = r.within(r.fixed, b)
	}
	r.fixed = append(r.fixed, r.front(r.n-1))
	slices.Sort(r.fixed)
	r.fixed = slices.Compact(r.fixed)
	if r.n == 1 {
		// One position: first and last are one, and the one stretch of
		// positions runs from it to itself.
		r.fixed = []float64{r.s0, r.s0}
	}
}

// within appends the fronts that put an axle or an end of the uniform load
// on x strictly inside the run's positions.
func (r *run) within(out []float64, x float64) []float64 {
	last := r.front(r.n - 1)
	for _, off := range r.offsets {
		if s := x - off; s > r.s0 && s < last {
			out = append(out, s)
		}
	}
	return out
}

// mergeBreaks returns the run's breaks at the key points merged with those
// at the point ls reads, in order.
func (r *run) mergeBreaks(ls *lines) []float64 {
	moving := r.moving[:0]
	if _, key := slices.BinarySearch(r.keys, ls.at); !key {
		moving = r.within(moving, ls.at)
		slices.Sort(moving)
	}
	r.moving = moving
	br := r.breaks[:0]
	i, j := 0, 0
	for i < len(r.fixed) || j < len(moving) {
		if j == len(moving) || (i < len(r.fixed) && r.fixed[i] <= moving[j]) {
			br = append(br, r.fixed[i])
			i++
		} else {
			br = append(br, moving[j])
			j++
		}
	}
	r.breaks = br
	return br
}

// advance moves *p on to the slot of ls holding sigma (see terms: slot 0
// before the member, piece j in slot j + 1, then past it), which never lies
// before it (the stretches of positions come in order). A load within the
// key tolerance of an end of the member stands on it.
func (ls *lines) advance(p *int, sigma float64) int {
	np := ls.pieces()
	tol := keyTolerance * ls.length
	if *p == 0 && sigma >= ls.bounds[0]-tol {
		*p = 1
	}
	for *p >= 1 && *p < np && ls.bounds[*p] <= sigma {
		*p++
	}
	if *p == np && sigma > ls.bounds[np]+tol {
		*p = np + 1
	}
	return *p
}

// scanJumps evaluates the positions that put an axle on ls.at, where the
// lines jump, with that axle on the given sides of the point.
func (r *run) scanJumps(ls *lines, hi, lo []extreme, sides []fem.Side) {
	for a, ax := range r.axles {
		s := ls.at - ax.offset
		k := int(math.Round((s - r.s0) / r.step))
		if r.n == 1 {
			k = 0
		}
		if k < 0 || k >= r.n || math.Abs(r.front(k)-s) > r.tolerance {
			continue
		}
		front := r.front(k)
		for i := range ls.n {
			base := 0.0
			for b, other := range r.axles {
				if b != a {
					base += other.load * ls.valueOn(i, front+other.offset)
				}
			}
			if r.uniform {
				base += r.q * (ls.integralOn(i, front+r.u1) - ls.integralOn(i, front+r.u0))
			}
			for _, side := range sides {
				v := base + ax.load*ls.value(i, ls.at, side)
				hi[i].most(v, r.first+int32(k))
				lo[i].least(v, r.first+int32(k))
			}
		}
	}
}

// valueOn is line i with the load at x, from the right where it jumps, and
// zero for a load off the member (a train partly off it, Train.OffEnds).
func (ls *lines) valueOn(i int, x float64) float64 {
	tol := keyTolerance * ls.length
	if x < ls.bounds[0]-tol || x > ls.bounds[ls.pieces()]+tol {
		return 0
	}
	return ls.value(i, x, fem.Right)
}

// integralOn is ∫ line i from the member's start to x, with x taken back
// onto the member: a uniform load beyond its ends carries nothing.
func (ls *lines) integralOn(i int, x float64) float64 {
	return ls.integral(i, min(max(x, ls.bounds[0]), ls.bounds[ls.pieces()]))
}

// EnvelopeQuantities are the quantities a train's envelope holds: those a
// load across the member moves (a train moves no axial force).
var EnvelopeQuantities = []fem.Quantity{fem.QDeflection, fem.QRotation, fem.QShearForce, fem.QBendingMoment, fem.QBendingStress}

// The rows the envelope reads at a station, in the order of the first four
// EnvelopeQuantities; the bending stress is the moment's times c/I.
var envelopeRows = [4]int{compW, compTheta, compV, compM}

// Envelope is the largest and the smallest effect of a train at every
// station over all its positions, with the position that governs each.
type Envelope struct {
	Train Train
	// Stations are the points the envelope is taken at, m, in order.
	Stations []float64
	// Max and Min hold, per quantity of EnvelopeQuantities and station,
	// the largest and smallest value in SI units; MaxAt and MinAt the
	// number of the position giving it (Placement).
	Max, Min     [][]float64
	MaxAt, MinAt [][]int32
	// Reactions are the extremes of every reaction across the member
	// (transverse and rotation) of every support.
	Reactions []ReactionEnvelope
	// Step is the distance between positions, m, and Positions their
	// number in each direction the train moves.
	Step      float64
	Positions int
	runs      []run
}

// ReactionEnvelope is the range of one reaction over a train's positions.
type ReactionEnvelope struct {
	Support      int
	Motion       fem.Dof
	Max, Min     float64 // N or N·m
	MaxAt, MinAt Placement
}

// Placement is position number i of the envelope's train.
func (e *Envelope) Placement(i int32) Placement {
	for _, r := range e.runs {
		if i >= r.first && int(i-r.first) < r.n {
			return Placement{r.direction, r.front(int(i - r.first))}
		}
	}
	return Placement{}
}

// Nearest is the envelope's position nearest to p, facing p's way when the
// train moves that way (else the first way it moves).
func (e *Envelope) Nearest(p Placement) Placement {
	r := e.runs[0]
	for _, o := range e.runs {
		if o.direction == p.Direction {
			r = o
		}
	}
	k := 0
	if r.n > 1 {
		k = min(max(int(math.Round((p.Front-r.s0)/r.step)), 0), r.n-1)
	}
	return Placement{r.direction, r.front(k)}
}

// Combine is the envelope of a combination that takes the train with a
// factor on top of other loads: base.Max[q][s] and base.Min[q][s] are the
// largest and the smallest of quantity q of EnvelopeQuantities at station
// s under the other loads, already factored (the same where they are
// fixed; over the arrangements of loads placed by span where they are
// not: the worst of the sum is the worst of each, as the train's position
// and the spans loaded are chosen apart). A positive factor takes the
// train's largest value to the combination's largest, a negative one its
// smallest, with the positions that govern them. The reactions combine
// likewise with base.MaxReactions and base.MinReactions (one per entry of
// Reactions; nil for none). The load-case envelope merges a train this way.
func (e *Envelope) Combine(factor float64, base Base) *Envelope {
	out := *e
	nq := len(EnvelopeQuantities)
	out.Max, out.Min = make([][]float64, nq), make([][]float64, nq)
	out.MaxAt, out.MinAt = make([][]int32, nq), make([][]int32, nq)
	at := func(b [][]float64, q, s int) float64 {
		if b == nil {
			return 0
		}
		return b[q][s]
	}
	for q := range nq {
		hi, lo, hiAt, loAt := e.Max[q], e.Min[q], e.MaxAt[q], e.MinAt[q]
		if factor < 0 {
			hi, lo, hiAt, loAt = lo, hi, loAt, hiAt
		}
		out.Max[q], out.Min[q] = make([]float64, len(e.Stations)), make([]float64, len(e.Stations))
		out.MaxAt[q], out.MinAt[q] = slices.Clone(hiAt), slices.Clone(loAt)
		for s := range e.Stations {
			out.Max[q][s], out.Min[q][s] = at(base.Max, q, s)+factor*hi[s], at(base.Min, q, s)+factor*lo[s]
		}
	}
	out.Reactions = slices.Clone(e.Reactions)
	for i := range out.Reactions {
		r := &out.Reactions[i]
		var bHi, bLo float64
		if base.MaxReactions != nil {
			bHi, bLo = base.MaxReactions[i], base.MinReactions[i]
		}
		if factor < 0 {
			r.Max, r.Min, r.MaxAt, r.MinAt = r.Min, r.Max, r.MinAt, r.MaxAt
		}
		r.Max, r.Min = bHi+factor*r.Max, bLo+factor*r.Min
	}
	return &out
}

// Base is what a combination's other loads give at an envelope's stations
// and supports, for Combine: per quantity of EnvelopeQuantities and
// station, their largest and smallest value, and per entry of Reactions
// their largest and smallest reaction; nil for none.
type Base struct {
	Max, Min                   [][]float64
	MaxReactions, MinReactions []float64
}

// AllPositions is the number of positions in every direction together.
func (e *Envelope) AllPositions() int {
	n := 0
	for _, r := range e.runs {
		n += r.n
	}
	return n
}

// Extreme is one extreme of a quantity: its value, where it is and the
// train's position that gives it.
type Extreme struct {
	Value, X  float64
	Placement Placement
}

// Worst is the largest and the smallest value of quantity q (one of
// EnvelopeQuantities) anywhere along the member over every position.
func (e *Envelope) Worst(q fem.Quantity) (hi, lo Extreme) {
	k := slices.Index(EnvelopeQuantities, q)
	if k < 0 {
		return Extreme{}, Extreme{}
	}
	scale := e.scale(k)
	best, least := e.worstStation(k, true, scale), e.worstStation(k, false, scale)
	return Extreme{e.Max[k][best], e.Stations[best], e.Placement(e.MaxAt[k][best])},
		Extreme{e.Min[k][least], e.Stations[least], e.Placement(e.MinAt[k][least])}
}

// scale is the largest magnitude of quantity k (an index into
// EnvelopeQuantities) anywhere in e.
func (e *Envelope) scale(k int) float64 {
	s := 0.0
	for i := range e.Stations {
		s = max(s, math.Abs(e.Max[k][i]), math.Abs(e.Min[k][i]))
	}
	return s
}

// worstStation is the station of the largest (upper) or smallest value of
// quantity k: the first along the member of values that tie to round-off
// against the field's size, scale (fem.BeyondField), so that a deflection
// of 1e-18 m beside a support's 0 does not name a place of its own.
func (e *Envelope) worstStation(k int, upper bool, scale float64) int {
	b := 0
	for i := range e.Stations {
		if upper && fem.BeyondField(e.Max[k][i], e.Max[k][b], scale) ||
			!upper && fem.BeyondField(e.Min[k][b], e.Min[k][i], scale) {
			b = i
		}
	}
	return b
}

// minStations is the number of intervals below which the default stations
// divide the mesh's elements further, so that a coarse mesh still gives a
// smooth envelope.
const minStations = 400

// Stations are the default stations of an envelope: every node of mesh,
// with points between them so that no gap is longer than L/minStations.
func Stations(mesh fem.Mesh) []float64 {
	if len(mesh.X) == 0 {
		return nil
	}
	L := mesh.X[len(mesh.X)-1] - mesh.X[0]
	out := []float64{mesh.X[0]}
	for i := 1; i < len(mesh.X); i++ {
		a, b := mesh.X[i-1], mesh.X[i]
		k := max(1, int(math.Ceil((b-a)/L*minStations*(1-1e-12))))
		for j := 1; j < k; j++ {
			out = append(out, a+(b-a)*float64(j)/float64(k))
		}
		out = append(out, b)
	}
	return out
}

// bothSides are the sides of a jump an envelope takes: the larger of the two.
var bothSides = []fem.Side{fem.Left, fem.Right}

// parallelStations is the number of stations from which Envelope works on
// two goroutines.
const parallelStations = 2048

// Envelope finds train t's envelope at the stations (nil for Stations of
// mesh, with the peaks added: see peaks), with the step t gives or one
// derived from mesh. Its cost grows with the stations, the axles and the
// key points, not with the number of positions (see the package comment).
func (in *Influence) Envelope(t *Train, mesh fem.Mesh, stations []float64) (*Envelope, error) {
	s := in.bending
	if s == nil {
		return nil, in.bendingErr
	}
	runs, err := t.runs(in.model.Length(), mesh)
	if err != nil {
		return nil, err
	}
	own := stations == nil
	if own {
		stations = Stations(mesh)
	}
	e := in.envelopeAt(s, t, runs, stations)
	if own {
		if extra := in.peaks(s, e); len(extra) > 0 {
			stations = append(slices.Clone(stations), extra...)
			slices.Sort(stations)
			e = in.envelopeAt(s, t, runs, slices.Compact(stations))
		}
	}
	in.envelopeReactions(s, e)
	return e, nil
}

// envelopeAt is train t's envelope at the stations, without reactions.
func (in *Influence) envelopeAt(s *sweeps, t *Train, runs []run, stations []float64) *Envelope {
	e := &Envelope{Train: *t, Stations: stations, runs: runs, Step: runs[0].step, Positions: runs[0].n}
	nq := len(EnvelopeQuantities)
	e.Max, e.Min = make([][]float64, nq), make([][]float64, nq)
	e.MaxAt, e.MinAt = make([][]int32, nq), make([][]int32, nq)
	for q := range nq {
		e.Max[q], e.Min[q] = make([]float64, len(stations)), make([]float64, len(stations))
		e.MaxAt[q], e.MinAt[q] = make([]int32, len(stations)), make([]int32, len(stations))
	}
	n := len(stations)
	if n < parallelStations {
		in.envelopeStations(s, e, 0, n)
	} else {
		done := make(chan struct{})
		go func() {
			in.envelopeStations(s, e, n/2, n)
			close(done)
		}()
		in.envelopeStations(s, e, 0, n/2)
		<-done
	}
	return e
}

// maxClimb bounds the steps of one climb in Peak.
const maxClimb = 1000

// peaks are the points, off the stations of e, where each quantity's
// largest and smallest value over the member lie (Peak).
func (in *Influence) peaks(s *sweeps, e *Envelope) []float64 {
	probe := func(xs []float64) *Envelope { return in.envelopeAt(s, &e.Train, e.runs, xs) }
	var out []float64
	for q := range EnvelopeQuantities {
		for _, upper := range []bool{true, false} {
			if ex, moved := e.Peak(q, upper, probe); moved {
				out = append(out, ex.X)
			}
		}
	}
	return out
}

// Peak is the largest (upper) or smallest value of quantity q (an index
// into EnvelopeQuantities) over the member, where the worst station of e
// may miss it, and whether it lies off the stations; probe gives the same
// envelope as e (the train's, or a combination's that takes it) at other
// points, or nil when it cannot. For one position of a train the bending
// moment has its corners, and the shear force its jumps, under the axles,
// so the worst value stands under an axle, which the stations miss unless
// one lies there (by up to the shear force times half the gap between
// stations); a smooth peak (the deflection) lies between stations, which
// miss it by the curvature times the gap squared.
//
// The worst value need not lie next to the worst station: where stations
// tie (a moment of zero over an unloaded overhang) the first of them is no
// better a start than the last, and a peak under an axle may stand between
// two stations that both read less than another station elsewhere. So
// Peak climbs from the worst station and from every other station that
// turns (is no worse than its neighbours, and not in the middle of a
// plateau) within the largest difference between neighbouring stations
// of the worst, the best maxStarts of them, and keeps the best it reaches.
// Each climb tries the turn of the parabola through its station and the
// neighbours (between the neighbouring stations), and the points under the
// axles of the governing position and of its neighbours on either side
// (wherever they stand: a step may be longer than the gap between
// stations, and the peaks of two positions lie a step apart), and moves to
// the best of them while that is worse still; then it searches the gap
// either side of where it stopped by golden section (a smooth turn next to
// a support, where the field bends differently on either side and the
// parabola misses it). The moment under one axle is a concave function of
// the position as long as no axle passes a key point or the point itself,
// so the climb reaches the largest moment of the classic rule (midspan
// halfway between the axle and the resultant) on the positions of the
// step.
func (e *Envelope) Peak(q int, upper bool, probe func(xs []float64) *Envelope) (Extreme, bool) {
	n := len(e.Stations)
	if n == 0 {
		return Extreme{}, false
	}
	tol := keyTolerance * (e.Stations[n-1] - e.Stations[0])
	sign := 1.0
	values, at := e.Max[q], e.MaxAt[q]
	if !upper {
		sign, values, at = -1, e.Min[q], e.MinAt[q]
	}
	scale := e.scale(q)
	b := e.worstStation(q, upper, scale)
	best := Extreme{values[b], e.Stations[b], e.Placement(at[b])}
	if probe != nil {
		for _, start := range e.climbStarts(values, sign, b) {
			if ex := e.climb(q, upper, start, probe); fem.BeyondField(sign*ex.Value, sign*best.Value, scale) {
				best = ex
			}
		}
	}
	i, _ := slices.BinarySearch(e.Stations, best.X)
	onStation := i < n && math.Abs(e.Stations[i]-best.X) <= tol || i > 0 && math.Abs(e.Stations[i-1]-best.X) <= tol
	return best, !onStation
}

// maxStarts bounds the stations Peak climbs from.
const maxStarts = 8

// axleReach is how near an axle, relative to the member's length, Peak's
// search of the gaps leaves the value to the axle's own place.
const axleReach = 1e-6

// goldenSteps are the steps of Peak's search of the gaps either side of
// where a climb stops: each narrows the bracket by 0.618, so the place is
// found to a part in 10⁷ of the two gaps.
const goldenSteps = 32

// climbStarts are the stations Peak climbs from, in order of their
// values, worst first (sign·values largest): the worst station b, and the
// other stations that turn within the largest difference between
// neighbouring stations of it.
func (e *Envelope) climbStarts(values []float64, sign float64, b int) []int {
	n := len(values)
	margin := 0.0
	for i := 1; i < n; i++ {
		margin = max(margin, math.Abs(values[i]-values[i-1]))
	}
	starts := []int{b}
	for i := range n {
		v := sign * values[i]
		if i == b || v < sign*values[b]-margin {
			continue
		}
		left, right := i > 0, i < n-1
		if left && sign*values[i-1] > v || right && sign*values[i+1] > v {
			continue // not a turn
		}
		if left && right && sign*values[i-1] == v && sign*values[i+1] == v {
			continue // inside a plateau: its ends stand for it
		}
		starts = append(starts, i)
	}
	slices.SortStableFunc(starts[1:], func(i, j int) int { return cmp.Compare(sign*values[j], sign*values[i]) })
	return starts[:min(len(starts), maxStarts)]
}

// climb is Peak's climb from station b (see Peak).
func (e *Envelope) climb(q int, upper bool, b int, probe func(xs []float64) *Envelope) Extreme {
	n := len(e.Stations)
	tol := keyTolerance * (e.Stations[n-1] - e.Stations[0])
	sign := 1.0
	values, at := e.Max[q], e.MaxAt[q]
	if !upper {
		sign, values, at = -1, e.Min[q], e.MinAt[q]
	}
	scale := e.scale(q)
	read := func(xs []float64) ([]float64, []int32, bool) {
		p := probe(xs)
		if p == nil {
			return nil, nil, false
		}
		if upper {
			return p.Max[q], p.MaxAt[q], true
		}
		return p.Min[q], p.MinAt[q], true
	}
	lo, hi := e.Stations[max(b-1, 0)]+tol, e.Stations[min(b+1, n-1)]-tol
	x, pos, v := e.Stations[b], at[b], values[b]
	for c := range maxClimb {
		cands := e.underAxles(pos)
		if c == 0 && b > 0 && b < n-1 {
			if xv, ok := vertex(e.Stations[b-1:b+2], values[b-1:b+2]); ok && xv > lo && xv < hi {
				cands = append(cands, xv)
				slices.Sort(cands)
			}
		}
		if len(cands) == 0 {
			break
		}
		pv, pat, ok := read(cands)
		if !ok {
			break
		}
		best := -1
		for i := range cands {
			if fem.BeyondField(sign*pv[i], sign*v, scale) && (best < 0 || sign*pv[i] > sign*pv[best]) {
				best = i
			}
		}
		if best < 0 {
			break
		}
		x, pos, v = cands[best], pat[best], pv[best]
	}
	// The gaps either side of x, between the stations around it.
	i, _ := slices.BinarySearch(e.Stations, x)
	a, z := e.Stations[max(i-1, 0)], e.Stations[min(i+1, n-1)]
	if i < n && e.Stations[i] > x+tol {
		z = e.Stations[i]
	}
	if z-a > 2*tol {
		g := func(xx float64) (float64, int32, bool) {
			pv, pat, ok := read([]float64{xx})
			if !ok {
				return 0, 0, false
			}
			return pv[0], pat[0], true
		}
		// A corner under an axle is the climb's to find, at the axle
		// itself: the search closing in on one reads the lines a hair to
		// the wrong side of the axle and would overshoot by the shear
		// force times that hair.
		if xg, vg, pg, ok := goldenSearch(g, a, z, sign); ok && fem.BeyondField(sign*vg, sign*v, scale) &&
			!slices.ContainsFunc(e.underAxles(pg), func(xa float64) bool { return math.Abs(xa-xg) <= axleReach*(e.Stations[n-1]-e.Stations[0]) }) {
			x, pos, v = xg, pg, vg
		}
	}
	return Extreme{v, x, e.Placement(pos)}
}

// goldenSearch finds the largest value of sign·g on [a, b] of a function
// with one turn there by goldenSteps of golden-section search (Kiefer's
// search, Press et al., Numerical Recipes, 10.2, from memory): the place,
// the value, the position that gives it, and false when g cannot be read.
func goldenSearch(g func(float64) (float64, int32, bool), a, b, sign float64) (float64, float64, int32, bool) {
	const r = 0.6180339887498949 // (√5 − 1)/2
	c, d := b-r*(b-a), a+r*(b-a)
	gc, pc, ok1 := g(c)
	gd, pd, ok2 := g(d)
	if !ok1 || !ok2 {
		return 0, 0, 0, false
	}
	for range goldenSteps {
		if sign*gc >= sign*gd {
			b, d, gd, pd = d, c, gc, pc
			c = b - r*(b-a)
			var ok bool
			if gc, pc, ok = g(c); !ok {
				return 0, 0, 0, false
			}
		} else {
			a, c, gc, pc = c, d, gd, pd
			d = a + r*(b-a)
			var ok bool
			if gd, pd, ok = g(d); !ok {
				return 0, 0, 0, false
			}
		}
	}
	if sign*gc >= sign*gd {
		return c, gc, pc, true
	}
	return d, gd, pd, true
}

// vertex is where the parabola through three points (x[i], v[i]) turns,
// if it turns.
func vertex(x, v []float64) (float64, bool) {
	d1, d2 := (v[1]-v[0])/(x[1]-x[0]), (v[2]-v[1])/(x[2]-x[1])
	curvature := (d2 - d1) / (x[2] - x[0])
	if curvature == 0 || math.IsNaN(curvature) {
		return 0, false
	}
	return 0.5*(x[0]+x[1]) - d1/(2*curvature), true
}

// underAxles are the points under the axles of position i and of the
// positions either side of it in its run, in order, on the stretch of the
// stations (an axle may stand off the member: Train.OffEnds).
func (e *Envelope) underAxles(i int32) []float64 {
	var out []float64
	first, last := e.Stations[0], e.Stations[len(e.Stations)-1]
	for _, r := range e.runs {
		k := int(i - r.first)
		if i < r.first || k >= r.n {
			continue
		}
		for j := max(k-1, 0); j <= min(k+1, r.n-1); j++ {
			for _, ax := range r.axles {
				if x := r.front(j) + ax.offset; x >= first && x <= last {
					out = append(out, x)
				}
			}
		}
	}
	slices.Sort(out)
	return slices.Compact(out)
}

// workRuns are copies of runs with scratch of their own, for one goroutine,
// ready to scan the member of s.
func workRuns(runs []run, s *sweeps) []run {
	out := make([]run, len(runs))
	for i, r := range runs {
		out[i] = run{direction: r.direction, s0: r.s0, step: r.step, n: r.n, first: r.first,
			axles: r.axles, uniform: r.uniform, q: r.q, u0: r.u0, u1: r.u1, tolerance: r.tolerance}
		out[i].setKeys(s.keys)
	}
	return out
}

// envelopeStations fills stations from to to of e.
func (in *Influence) envelopeStations(s *sweeps, e *Envelope, from, to int) {
	runs := workRuns(e.runs, s)
	var ls lines
	var rs [4]reader
	var hi, lo [4]extreme
	K := len(s.keys) - 1
	m := in.model
	for st := from; st < to; st++ {
		x := e.Stations[st]
		sides := []fem.Side{fem.Right}
		if k := s.keyIndex(x); math.Abs(x-s.keys[k]) <= keyTolerance*s.length {
			x = s.keys[k]
			switch k {
			case 0:
			case K:
				sides = []fem.Side{fem.Left}
			default:
				sides = []fem.Side{fem.Left, fem.Right}
			}
		}
		first := true
		for _, side := range sides {
			i, tau := s.locate(x, side)
			for q, row := range envelopeRows {
				_, scale, _ := s.quantityRow(EnvelopeQuantities[q])
				rs[q] = s.stationReader(i, tau, row, scale)
				rs[q].x = x
				hi[q], lo[q] = extreme{at: -1}, extreme{at: -1}
			}
			ls.fill(s, rs[:])
			for r := range runs {
				runs[r].scan(&ls, hi[:], lo[:], bothSides)
			}
			seg := m.Segments[segmentAt(m, x, side)].Section
			stress := seg.FibreDistance / seg.SecondMoment
			for q := range EnvelopeQuantities {
				h, l := hi[min(q, 3)], lo[min(q, 3)]
				if q == 4 {
					h.value, l.value = h.value*stress, l.value*stress
				}
				if first || fem.Beyond(h.value, e.Max[q][st]) {
					e.Max[q][st], e.MaxAt[q][st] = h.value, h.at
				}
				if first || fem.Beyond(e.Min[q][st], l.value) {
					e.Min[q][st], e.MinAt[q][st] = l.value, l.at
				}
			}
			first = false
		}
	}
}

// Worst is the largest and the smallest value of target tg under train t
// over all its positions, with the positions giving them, for the step t
// gives or one derived from mesh. A quantity at a point where it jumps is
// read on tg.Side; a bending target only (a train loads across).
func (in *Influence) Worst(t *Train, mesh fem.Mesh, tg Target) (hi, lo Extreme, err error) {
	if !tg.Bending() {
		return hi, lo, errors.New("a train loads the member across: ask for a bending quantity or a transverse or rotation reaction")
	}
	tg = tg.inner(in.model.Length())
	s, err := in.sweepsFor(tg)
	if err != nil {
		return hi, lo, err
	}
	r, err := in.reader(s, tg)
	if err != nil {
		return hi, lo, err
	}
	all, err := t.runs(in.model.Length(), mesh)
	if err != nil {
		return hi, lo, err
	}
	runs := workRuns(all, s)
	var ls lines
	ls.fill(s, []reader{r})
	h, l := []extreme{{at: -1}}, []extreme{{at: -1}}
	// Read just left of the point, an axle standing on it is after it:
	// the line's piece on the right of its jump; and the other way round.
	var jumps []fem.Side
	if !tg.Reaction {
		jumps = []fem.Side{-tg.Side}
		if tg.Side == 0 {
			jumps = []fem.Side{fem.Left}
		}
	}
	for i := range runs {
		runs[i].scan(&ls, h, l, jumps)
	}
	e := Envelope{runs: runs}
	x := tg.X
	if tg.Reaction {
		x = in.model.Supports[tg.Support].X
	}
	return Extreme{h[0].value, x, e.Placement(h[0].at)}, Extreme{l[0].value, x, e.Placement(l[0].at)}, nil
}

// envelopeReactions finds the range of every reaction across the member.
func (in *Influence) envelopeReactions(s *sweeps, e *Envelope) {
	runs := workRuns(e.runs, s)
	var ls lines
	for i, sup := range in.model.Supports {
		for _, d := range []fem.Dof{fem.Transverse, fem.Rotation} {
			if !sup.Holds(d) {
				continue
			}
			rs := []reader{s.reactionReader(s.keyIndex(sup.X), d)}
			ls.fill(s, rs)
			hi, lo := []extreme{{at: -1}}, []extreme{{at: -1}}
			for r := range runs {
				runs[r].scan(&ls, hi, lo, nil)
			}
			e.Reactions = append(e.Reactions, ReactionEnvelope{Support: i, Motion: d,
				Max: hi[0].value, Min: lo[0].value, MaxAt: e.Placement(hi[0].at), MinAt: e.Placement(lo[0].at)})
		}
	}
}
