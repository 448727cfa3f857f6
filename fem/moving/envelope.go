package moving

import (
	"errors"
	"math"
	"slices"

	"stave/fem"
)

// maxReaders is the most lines one scan takes.
const maxReaders = len(envelopeRows)

// extreme is the largest (or smallest) effect found so far and the
// position of the train that gives it; set is false before any.
//
// A windowed scan leaves out positions whose effects it bounds (skip):
// had they been taken in turn, the extreme might stand elsewhere. It is
// then unsure: the value it would hold lies between lo and hi (signed:
// the largest of −v for least; lo −∞ while it may be unset), until an
// effect beyond hi comes, which it would take whatever it held, and it is
// sure again. Meanwhile value and at follow the positions taken alone.
// One that ends unsure is found again over every position (scanRuns).
type extreme struct {
	value  float64
	at     Placement
	set    bool
	unsure bool
	lo, hi float64
}

// most takes v at position at where it is the first or beyond the largest
// so far by more than a tie (fem.Beyond): of equal effects, round-off
// apart, the first found (forward before backward, then along the run).
func (e *extreme) most(v float64, at Placement) { e.take(v, at, true) }

// least is most for the smallest.
func (e *extreme) least(v float64, at Placement) { e.take(v, at, false) }

// take is most (upper) or least.
func (e *extreme) take(v float64, at Placement, upper bool) {
	if e.unsure {
		switch sv := signed(v, upper); {
		case fem.Beyond(sv, e.hi):
			e.value, e.at, e.set, e.unsure = v, at, true, false
			return
		case fem.Beyond(sv, e.lo):
			e.hi = max(e.hi, sv)
		}
	}
	if e.takes(v, upper) {
		e.value, e.at, e.set = v, at, true
	}
}

// takes reports whether most (upper) or least would take v, of the
// positions taken (see extreme).
func (e *extreme) takes(v float64, upper bool) bool {
	switch {
	case !e.set:
		return true
	case upper:
		return fem.Beyond(v, e.value)
	}
	return fem.Beyond(e.value, v)
}

// skip stands for positions left out whose effects lie within ±bound:
// most (upper) or least might have taken any of them. Where the line is
// exactly zero off the window (zero: its every piece there is ±0),
// positions from the first of a run (first, fromStart) give exactly +0,
// as sums of ±0 and a uniform load's integrals over them do, so they are
// taken as the first of them, the rest changing nothing.
func (e *extreme) skip(bound float64, zero bool, upper bool, first Placement, fromStart bool) {
	if !(bound >= 0) {
		bound = math.Inf(1) // no bound: unsure for good
	}
	switch {
	case zero && fromStart:
		e.take(0, first, upper)
	case e.unsure:
		if fem.Beyond(bound, e.lo) {
			e.hi = max(e.hi, bound)
		}
	case !e.set:
		e.unsure, e.lo, e.hi = true, math.Inf(-1), bound
	default:
		if sv := signed(e.value, upper); fem.Beyond(bound, sv) {
			e.unsure, e.lo, e.hi = true, sv, max(sv, bound)
		}
	}
}

// signed is v for the largest, −v for the smallest: Beyond is symmetric
// under the change of sign.
func signed(v float64, upper bool) float64 {
	if upper {
		return v
	}
	return -v
}

// scan folds into hi and lo (one per line of ls) the largest and smallest
// effect of the run over all its positions: every front from the run's
// first to its last, not only those of the step. On each stretch of
// positions between the breaks (where an axle or an end of the uniform
// load passes a bound of ls) every line's effect is one polynomial F of
// the front's position, of degree 3 (4 with a uniform load): its extremes
// over the stretch are at its ends and at the roots of F′, where F is
// evaluated exactly. At a break where a line jumps (an axle on ls.at) the
// ends of the stretches either side are the two limits, the axle just
// before the point and just beyond it. Where the lines may jump, a
// position with an axle standing on the point is also evaluated with the
// axle on each of the sides given (on the line's sides of its jump).
//
// F is written about the stretch's first front: each load's piece of a
// line, a cubic about the piece's start, is shifted by no more than the
// piece's length, so that F keeps its digits on a piece 0.1 mm long 5 m
// from the member's origin, or for an axle kilometres behind the front
// (written about the origin, such a cubic cancelled all but a few).
//
// With a window w, ls holds the window's pieces alone and scan leaves out
// the positions whose loads all stand off the stretch where the lines
// matter (see window.go), taking instead their bound into hi and lo
// (extreme.skip); w is nil where ls holds every load of every position.
func (r *run) scan(ls *lines, hi, lo []extreme, jumps []fem.Side, w *window) {
	n, ell := ls.n, ls.length
	r.setCut(ls, w)
	r.terms(ls)
	br, before, after, total := r.mergeBreaks(ls)
	if before {
		r.skip(hi, lo, true)
	}
	// place[a] is the slot of ls under axle a (then under the ends of the
	// uniform load), advanced as the stretches of positions go by.
	places := slices.Grow(r.places[:0], len(r.axles)+2)[:len(r.axles)+2]
	clear(places)
	r.places = places
	ends := [2]float64{r.u0, r.u1}
	// f holds, about front origin, every load's term on a slot that is
	// not short (see terms) where it stood at the last stretch evaluated:
	// a long train moves a few loads to another slot per stretch, so f
	// takes their change alone (summing every load on every stretch cost
	// the square of the axles), and is summed afresh every resumEvery
	// stretches, against drift, and always for a short train. g holds, on
	// each stretch afresh, the terms on short slots, which f never takes:
	// taken out of f, their large coefficients would leave their round-off
	// behind. f is also summed afresh where it would be shifted more than
	// ℓ from where it was last summed: round-off it holds grows with the
	// cube of the shift (a train whose axles are far apart crosses long
	// stretches with no axle on the member, over which f is moved on).
	var f, g [maxReaders]poly
	origin, summedAt := 0.0, 0.0
	summed := -1 // stretches since f was summed afresh; −1 before the first
	for i := 1; i < len(br); i++ {
		a, b := br[i-1], br[i]
		if b < a {
			continue
		}
		if b == a && total > 2 {
			continue // two breaks at one front: the stretches either side hold it
		}
		if b == a {
			// A run of one position: no stretch of positions to take
			// limits over, only the train where it stands.
			r.evaluate(ls, hi, lo, a, r.axleOn(ls, a, jumps), jumps)
			continue
		}
		mid := 0.5 * (a + b)
		full := summed < 0 || summed == resumEvery || len(r.axles) <= shortTrain || a-summedAt > ell
		if full {
			f = [maxReaders]poly{}
			summed, summedAt = 0, a
		} else {
			for k := range n {
				f[k] = f[k].shift((a - origin) / ell)
			}
		}
		origin = a
		summed++
		g = [maxReaders]poly{}
		for k, ax := range r.axles {
			r.move(ls, f[:n], g[:n], &places[k], a, mid, ax.offset, ax.load, r.axleTerms, full)
		}
		if r.uniform {
			for e, off := range ends {
				sign := float64(2*e - 1) // the integral to the far end less that to the near one
				r.move(ls, f[:n], g[:n], &places[len(r.axles)+e], a, mid, off, sign*r.q, r.uniformTerms, full)
			}
		}
		h := (b - a) / ell
		for i := range n {
			F := f[i]
			F.add(1, &g[i])
			var roots [3]float64
			cands := append(r.candidates[:0], 0, h)
			cands = append(cands, roots[:rootsIn(F.derivative(), 0, h, &roots)]...)
			r.candidates = cands
			for c, v := range cands {
				front := a + v*ell
				switch c {
				case 0:
					front = a
				case 1:
					front = b
				}
				value := F.at(v)
				at := Placement{r.direction, front}
				if c < 2 && (hi[i].takes(value, true) || lo[i].takes(value, false)) {
					at.Front = r.clearOfEnds(ls, front, a, b)
				}
				hi[i].most(value, at)
				lo[i].least(value, at)
			}
		}
	}
	if after {
		r.skip(hi, lo, false)
	}
	if len(jumps) > 0 {
		r.scanJumps(ls, hi, lo, jumps)
	}
	r.scanMeetings(ls, hi, lo, jumps)
}

// cut is what a windowed scan leaves out (see window.go): the positions
// whose loads all stand off the stretch of the window where its lines
// matter, their fronts before lo or after hi; bound[i] bounds their
// effect on line i: far[i], what the lines give there, plus noise[i], the
// round-off the whole member's scan may have carried there (0 for a short
// train of axles alone, whose every position is summed afresh).
type cut struct {
	on                bool
	lo, hi            float64
	bound, far, noise []float64
}

// cutMargin is the margin, in key tolerances, by which a position left out
// keeps its loads off the stretch where the lines matter: a load within
// the tolerance of a key point stands on it.
const cutMargin = 4

// setCut sets r.cut for a scan of ls in window w (nil: none).
func (r *run) setCut(ls *lines, w *window) {
	r.cut.on = w != nil && !w.whole
	if !r.cut.on {
		return
	}
	margin := cutMargin * r.tolerance
	r.cut.lo, r.cut.hi = w.near-r.maxOff-margin, w.far-r.minOff+margin
	// A position off the stretch: each axle at most beyond per newton;
	// the uniform load's integral over its length and, at most, the two
	// pieces its ends stand on. Round-off (farRoundOff) per newton of
	// the axles, and of the uniform load over the member.
	loads := 0.0
	for _, ax := range r.axles {
		loads += ax.load
	}
	spread, round, rel := loads, loads, 0.0
	if r.uniform {
		spread += r.q * (r.u1 - r.u0 + 2*w.longest)
		round += r.q * (ls.last - ls.first)
		rel = farRoundOff
	}
	if len(r.axles) > shortTrain {
		rel = farRoundOffLong
	}
	n := ls.n
	r.cut.bound = slices.Grow(r.cut.bound[:0], n)[:n]
	r.cut.far = slices.Grow(r.cut.far[:0], n)[:n]
	r.cut.noise = slices.Grow(r.cut.noise[:0], n)[:n]
	for i := range n {
		r.cut.far[i], r.cut.noise[i] = w.beyond[i]*spread, rel*w.size[i]*round
		r.cut.bound[i] = r.cut.far[i] + r.cut.noise[i]
	}
}

// skip takes into hi and lo positions the window leaves out, from the
// run's first position or not (fromStart).
func (r *run) skip(hi, lo []extreme, fromStart bool) {
	first := Placement{r.direction, r.s0}
	for i, b := range r.cut.bound {
		zero := r.cut.far[i] == 0
		hi[i].skip(b, zero, true, first, fromStart)
		lo[i].skip(b, zero, false, first, fromStart)
	}
}

// clearOfEnds is front, an end of the stretch of positions from a to b,
// moved into the stretch past where an axle the stretch holds off the
// member stands on a member's end: a train placed there carries that
// axle (Train.Model), the stretch's limit does not. The front moved by
// four times the key tolerance gives the limit to round-off.
func (r *run) clearOfEnds(ls *lines, front, a, b float64) float64 {
	np := ls.pieces()
	for k, ax := range r.axles {
		bound := ls.bounds[0]
		switch r.places[k] {
		case 0:
		case np + 1:
			bound = ls.bounds[np]
		default:
			continue
		}
		if math.Abs(front+ax.offset-bound) <= r.tolerance {
			d := min(4*r.tolerance, 0.5*(b-a))
			if front == b {
				d = -d
			}
			return front + d
		}
	}
	return front
}

// A train of at most shortTrain axles is summed afresh on every stretch of
// positions; a longer one every resumEvery stretches (see scan).
const (
	shortTrain = 8
	resumEvery = 32
)

// shortSlot is the length, relative to ℓ, of a piece of ls below which a
// load's term on it is summed afresh on every stretch of positions (see
// scan): f keeps the round-off of a term it takes out, its coefficients'
// times 1e-16, which a stretch as long as ℓ reads times (ℓ/piece)³ at
// most, 1e-10 of the line at this length.
const shortSlot = 1e-2

// move advances *place to the slot of ls holding the load at mid + off
// (front mid), where a load c stands whose terms per slot are terms (see
// terms), and adds c times its term there, about front a, to f, or to g
// on a short slot; unless full, f already holds its term on the slot it
// leaves, which it trades for the new (nothing when it stays).
func (r *run) move(ls *lines, f, g []poly, place *int, a, mid, off, c float64, terms []poly, full bool) {
	old := *place
	p := ls.advance(place, mid+off)
	if !full && p == old && !r.short[p] {
		return
	}
	if !full && p != old && !r.short[old] {
		addTerm(ls, f, old, a+off, -c, terms)
	}
	if r.short[p] {
		addTerm(ls, g, p, a+off, c, terms)
	} else if full || p != old {
		addTerm(ls, f, p, a+off, c, terms)
	}
}

// addTerm adds to f c times the terms of slot p (len(f) lines a slot)
// written about the load at x: a polynomial in the distance the load moves
// on, over ℓ.
func addTerm(ls *lines, f []poly, p int, x, c float64, terms []poly) {
	n := len(f)
	t := 0.0
	switch {
	case p == 0:
		return // nothing before the member
	case p <= ls.pieces():
		t = (x - ls.bounds[p-1]) / ls.length
	}
	g := terms[p*n : p*n+n]
	for i := range f {
		f[i].addShifted(c, &g[i], t)
	}
}

// terms writes, for every slot of ls, each line's value per newton of an
// axle standing there as a polynomial in τ (the axle at τ·ℓ from the
// piece's start), and for an end of the uniform load there the integral of
// each line from 0 to it; and which slots are short (shortSlot).
//
// The slots are the pieces of ls between two more: before the member
// (slot 0) and past it (the last), where a train that drives off its ends
// (Train.OffEnds) has loads that carry nothing: an axle there adds zero,
// an end of the uniform load the integral to that end of the member.
func (r *run) terms(ls *lines) {
	n, np := ls.n, ls.pieces()
	ns := slots(ls)
	r.short = slices.Grow(r.short[:0], ns)[:ns]
	clear(r.short)
	for p := range np {
		r.short[p+1] = ls.bounds[p+1]-ls.bounds[p] < shortSlot*ls.length
	}
	r.axleTerms = slices.Grow(r.axleTerms[:0], ns*n)[:ns*n]
	clear(r.axleTerms[:n])
	copy(r.axleTerms[n:], ls.coef[:np*n])
	clear(r.axleTerms[(ns-1)*n:])
	if !r.uniform {
		return
	}
	r.uniformTerms = slices.Grow(r.uniformTerms[:0], ns*n)[:ns*n]
	for i := range n {
		r.uniformTerms[i] = poly{}
		r.uniformTerms[(ns-1)*n+i] = poly{ls.integral(i, ls.bounds[np])}
	}
	for p := range np {
		for i := range n {
			phi := ls.coef[p*n+i].antiderivative()
			for c := range phi {
				phi[c] *= ls.length
			}
			phi[0] += ls.integ[p*n+i]
			r.uniformTerms[(p+1)*n+i] = phi
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
	r.minOff, r.maxOff = slices.Min(r.offsets), slices.Max(r.offsets)
	r.sortedOffsets = r.sortedOffsets[:0]
	for _, ax := range r.axles {
		r.sortedOffsets = append(r.sortedOffsets, ax.offset)
	}
	slices.Sort(r.sortedOffsets)
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
// at the point ls reads, in order, and how many there are in all. Where
// r.cut leaves positions out, it returns those from the last break before
// the cut's first front to the first after its last, and whether breaks
// are left out before them and after.
func (r *run) mergeBreaks(ls *lines) (br []float64, before, after bool, total int) {
	moving := r.moving[:0]
	if _, key := slices.BinarySearch(r.keys, ls.at); !key {
		moving = r.within(moving, ls.at)
		slices.Sort(moving)
	}
	r.moving = moving
	fixed := r.fixed
	total = len(fixed) + len(moving)
	if r.cut.on {
		first, _ := slices.BinarySearch(fixed, r.cut.lo)
		last, _ := slices.BinarySearch(fixed, r.cut.hi)
		first, last = max(first-1, 0), min(last, len(fixed)-1)
		before, after = first > 0, last < len(fixed)-1
		fixed = fixed[first : last+1]
	}
	br = r.breaks[:0]
	i, j := 0, 0
	for j < len(moving) && moving[j] < fixed[0] {
		j++
	}
	end := fixed[len(fixed)-1]
	for i < len(fixed) || (j < len(moving) && moving[j] <= end) {
		if j == len(moving) || moving[j] > end || (i < len(fixed) && fixed[i] <= moving[j]) {
			br = append(br, fixed[i])
			i++
		} else {
			br = append(br, moving[j])
			j++
		}
	}
	r.breaks = br
	return br, before, after, total
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
// lines jump, with that axle on the given sides of the point, where the
// position is an end of the run: inside it the stretches of positions
// either side end there, and scan takes their ends, the axle just before
// the point and just beyond it. On an end of the member the axle standing
// on it gives a value of its own (lines.standing) that neither limit
// holds, so there every position on the run that puts an axle on it is
// evaluated.
func (r *run) scanJumps(ls *lines, hi, lo []extreme, sides []fem.Side) {
	first, last := r.s0, r.front(r.n-1)
	tol := keyTolerance * ls.length
	onEnd := ls.at-ls.first <= tol || ls.last-ls.at <= tol
	for a, ax := range r.axles {
		front := ls.at - ax.offset
		switch {
		case math.Abs(front-first) <= r.tolerance:
			front = first
		case math.Abs(front-last) <= r.tolerance:
			front = last
		case onEnd && front > min(first, last) && front < max(first, last):
		default:
			continue
		}
		r.evaluate(ls, hi, lo, front, a, sides)
	}
}

// scanMeetings evaluates the positions inside the run at which two loads
// or more stand where the lines may jump at once: on a member's end, which
// a train that drives off it (Train.OffEnds) crosses, its lines dropping
// to zero beyond (from a free or elastic end's value, or a reaction's at
// its support), or an axle on ls.at, with the sides given (none for a
// reaction's line, which does not jump there). Either side of such a
// position the loads stand on one side or the other of their jumps, so
// that the stretches of positions either side end in limits that leave
// out the position's own mix: an axle on a cantilever's tip and another
// on the point read, both beyond it.
func (r *run) scanMeetings(ls *lines, hi, lo []extreme, sides []fem.Side) {
	if len(r.axles) < 2 {
		return
	}
	first, last := r.s0, r.front(r.n-1)
	points := append(r.jumpPoints[:0], ls.first, ls.last)
	if len(sides) > 0 && ls.at > points[0]+r.tolerance && ls.at < points[1]-r.tolerance {
		points = append(points, ls.at)
	}
	r.jumpPoints = points
	for _, ax := range r.axles {
		for _, p := range points {
			front := p - ax.offset
			if front <= first+r.tolerance || front >= last-r.tolerance {
				continue // scan takes a run's ends with every load where it stands
			}
			meet := 0
			for _, q := range points {
				meet += r.axlesNear(q - front)
			}
			if meet < 2 {
				continue
			}
			r.evaluate(ls, hi, lo, front, r.axleOn(ls, front, sides), sides)
		}
	}
}

// axleOn is the axle that stands on ls.at with the front at front, where
// the lines jump there on the sides given (see evaluate), or −1.
func (r *run) axleOn(ls *lines, front float64, sides []fem.Side) int {
	if len(sides) == 0 {
		return -1
	}
	for a, ax := range r.axles {
		if math.Abs(front+ax.offset-ls.at) <= r.tolerance {
			return a
		}
	}
	return -1
}

// axlesNear is the number of axles whose offset lies within the tolerance
// of off.
func (r *run) axlesNear(off float64) int {
	i, _ := slices.BinarySearch(r.sortedOffsets, off-r.tolerance)
	n := 0
	for ; i < len(r.sortedOffsets) && r.sortedOffsets[i] <= off+r.tolerance; i++ {
		n++
	}
	return n
}

// evaluate folds into hi and lo the effect of the train with its front at
// front, every load where it stands (an axle on an end of the member on
// it) but axle at (−1 for none), which stands on ls.at, on each of the
// sides given.
func (r *run) evaluate(ls *lines, hi, lo []extreme, front float64, at int, sides []fem.Side) {
	if r.cut.on && (front < r.cut.lo || front > r.cut.hi) {
		r.skip(hi, lo, false)
		return
	}
	place := Placement{r.direction, front}
	for i := range ls.n {
		base := 0.0
		for b, other := range r.axles {
			if b != at {
				base += other.load * ls.valueOn(i, front+other.offset)
			}
		}
		if r.uniform {
			base += r.q * (ls.integralOn(i, front+r.u1) - ls.integralOn(i, front+r.u0))
		}
		if at < 0 {
			hi[i].most(base, place)
			lo[i].least(base, place)
			continue
		}
		for _, side := range sides {
			v := base + r.axles[at].load*ls.standing(i, side)
			hi[i].most(v, place)
			lo[i].least(v, place)
		}
	}
}

// valueOn is line i with the load at x, from the right where it jumps, and
// zero for a load off the member (a train partly off it, Train.OffEnds).
func (ls *lines) valueOn(i int, x float64) float64 {
	tol := keyTolerance * ls.length
	if x < ls.first-tol || x > ls.last+tol {
		return 0
	}
	return ls.value(i, x, fem.Right)
}

// integralOn is ∫ line i from the member's start to x, with x taken back
// onto the member: a uniform load beyond its ends carries nothing.
func (ls *lines) integralOn(i int, x float64) float64 {
	return ls.integral(i, min(max(x, ls.first), ls.last))
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
	// the largest and smallest value in SI units over every position of
	// the train along its run; MaxAt and MinAt the position giving it.
	Max, Min     [][]float64
	MaxAt, MinAt [][]Placement
	// MaxSide and MinSide are, per quantity and station, the side of the
	// station that Max and Min are read on where the envelope jumps
	// there (the shear force at a support, the rotation at a hinge), 0
	// where it does not.
	MaxSide, MinSide [][]fem.Side
	// Reactions are the extremes of every reaction across the member
	// (transverse and rotation) of every support.
	Reactions []ReactionEnvelope
	// Step is the distance between the positions the train is shown at
	// and stepped through, m, and Positions their number in each direction
	// it moves; the extremes take every position in between as well.
	Step      float64
	Positions int
	runs      []run
	// read is the side a station on an inner key point is read on, or 0
	// for the larger of both (EnvelopeSide).
	read fem.Side
}

// ReactionEnvelope is the range of one reaction over a train's positions.
type ReactionEnvelope struct {
	Support      int
	Motion       fem.Dof
	Max, Min     float64 // N or N·m
	MaxAt, MinAt Placement
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
	out.MaxAt, out.MinAt = make([][]Placement, nq), make([][]Placement, nq)
	out.MaxSide, out.MinSide = make([][]fem.Side, nq), make([][]fem.Side, nq)
	at := func(b [][]float64, q, s int) float64 {
		if b == nil {
			return 0
		}
		return b[q][s]
	}
	for q := range nq {
		hi, lo, hiAt, loAt, hiSide, loSide := e.Max[q], e.Min[q], e.MaxAt[q], e.MinAt[q], e.MaxSide[q], e.MinSide[q]
		if factor < 0 {
			hi, lo, hiAt, loAt, hiSide, loSide = lo, hi, loAt, hiAt, loSide, hiSide
		}
		out.Max[q], out.Min[q] = make([]float64, len(e.Stations)), make([]float64, len(e.Stations))
		out.MaxAt[q], out.MinAt[q] = slices.Clone(hiAt), slices.Clone(loAt)
		out.MaxSide[q], out.MinSide[q] = slices.Clone(hiSide), slices.Clone(loSide)
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

// Extreme is one extreme of a quantity: its value, where it is and the
// train's position that gives it; Side is the side of X it is read on
// where the envelope jumps there (Envelope.MaxSide), 0 where it does not.
type Extreme struct {
	Value, X  float64
	Placement Placement
	Side      fem.Side
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
	return Extreme{e.Max[k][best], e.Stations[best], e.MaxAt[k][best], e.MaxSide[k][best]},
		Extreme{e.Min[k][least], e.Stations[least], e.MinAt[k][least], e.MinSide[k][least]}
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

// standingSides are the sides of its jump that a line read at a station
// on side takes for an axle standing on the station (lines.standing). At
// a key point, read on each side by a line of its own (a support, whose
// reaction stands on the point with the axle), the axle is on the far
// side of the cut from the side read, as Influence.Worst takes it: the
// limit with it beyond the point is another position, which the scan
// takes where the run has it, and a run that ends with the axle on the
// point has not. Elsewhere the field at the station jumps under the axle
// itself, and both its sides are the field there.
func standingSides(key bool, side fem.Side) []fem.Side {
	switch {
	case !key:
		return bothSides
	case side == fem.Left:
		return bothSides[1:]
	}
	return bothSides[:1]
}

// parallelStations is the number of stations from which Envelope works on
// two goroutines.
const parallelStations = 2048

// Envelope finds train t's envelope at the stations (nil for Stations of
// mesh, with the peaks added: see peaks) over every position of its front
// along its run; the step t gives (or one derived from mesh) spaces the
// positions it is shown at. Its cost grows with the stations, the axles
// and the key points near each station (window.go), not with the step
// (see the package comment).
func (in *Influence) Envelope(t *Train, mesh fem.Mesh, stations []float64) (*Envelope, error) {
	s, runs, err := in.bendingRuns(t, mesh)
	if err != nil {
		return nil, err
	}
	own := stations == nil
	if own {
		stations = Stations(mesh)
	}
	e := in.envelopeAt(s, t, runs, stations, 0)
	if own {
		if extra := in.peaks(s, e); len(extra) > 0 {
			e = in.envelopeAt(s, t, runs, merged(stations, extra, keyTolerance*in.model.Length()), 0)
		}
	}
	in.envelopeReactions(s, e)
	return e, nil
}

// merged is stations, in order, with the points of extra added but for
// those within tol of a station or of a point added before them: one
// point, whose station is kept (a peak under an axle at 9.2 − 3.2 =
// 5.999999999999999 m is the station of the support at 6 m).
func merged(stations, extra []float64, tol float64) []float64 {
	out := slices.Clone(stations)
	for _, x := range extra {
		i, _ := slices.BinarySearch(out, x)
		if i < len(out) && out[i]-x <= tol || i > 0 && x-out[i-1] <= tol {
			continue
		}
		out = slices.Insert(out, i, x)
	}
	return out
}

// EnvelopeSide is train t's envelope at the stations (which it needs),
// each station on an inner key point (a support, a hinge, a change of
// section) read on side alone: where a field jumps there (the shear force
// at a support) Envelope holds the larger of the two sides, EnvelopeSide
// that side's, to combine with other loads' field on the same side.
func (in *Influence) EnvelopeSide(t *Train, mesh fem.Mesh, stations []float64, side fem.Side) (*Envelope, error) {
	s, runs, err := in.bendingRuns(t, mesh)
	if err != nil {
		return nil, err
	}
	e := in.envelopeAt(s, t, runs, stations, side)
	in.envelopeReactions(s, e)
	return e, nil
}

// bendingRuns are the bending problem's sweeps and train t's runs along
// the member, or why there are none.
func (in *Influence) bendingRuns(t *Train, mesh fem.Mesh) (*sweeps, []run, error) {
	if in.bending == nil {
		return nil, nil, in.bendingErr
	}
	runs, err := t.runs(in.model.Length(), mesh)
	return in.bending, runs, err
}

// envelopeAt is train t's envelope at the stations, without reactions,
// read on side at inner key points (0: the larger of both).
func (in *Influence) envelopeAt(s *sweeps, t *Train, runs []run, stations []float64, side fem.Side) *Envelope {
	e := &Envelope{Train: *t, Stations: stations, runs: runs, Step: runs[0].step, Positions: runs[0].n, read: side}
	nq := len(EnvelopeQuantities)
	e.Max, e.Min = make([][]float64, nq), make([][]float64, nq)
	e.MaxAt, e.MinAt = make([][]Placement, nq), make([][]Placement, nq)
	e.MaxSide, e.MinSide = make([][]fem.Side, nq), make([][]fem.Side, nq)
	for q := range nq {
		e.Max[q], e.Min[q] = make([]float64, len(stations)), make([]float64, len(stations))
		e.MaxAt[q], e.MinAt[q] = make([]Placement, len(stations)), make([]Placement, len(stations))
		e.MaxSide[q], e.MinSide[q] = make([]fem.Side, len(stations)), make([]fem.Side, len(stations))
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
// largest and smallest value over the member lie: under an axle
// (axlePeaks) or where Peak finds them (the deflection and the rotation,
// and the rest where a uniform load may turn them between axles).
func (in *Influence) peaks(s *sweeps, e *Envelope) []float64 {
	probe := func(xs []float64) *Envelope { return in.envelopeAt(s, &e.Train, e.runs, xs, 0) }
	out := in.axlePeaks(s, e)
	for q := range EnvelopeQuantities {
		if q >= peakShear && e.Train.Uniform.Load == 0 {
			// With axles alone these stand under an axle or on a key
			// point: axlePeaks and the stations hold them.
			continue
		}
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
// points, each exact over every position of the train, or nil when it
// cannot. For one position of a train the bending moment has its
// corners, and the shear force its jumps, under the axles, so the worst
// value stands under an axle, which the stations miss unless one lies
// there (by up to the shear force times half the gap between stations); a
// smooth peak (the deflection) lies between stations, which miss it by the
// curvature times the gap squared. From the worst station Peak climbs: it
// tries the turn of the parabola through that station and its neighbours
// and the points under the axles of the governing position, and moves to
// the best of them while that is worse still. Then it closes in on the
// peak between the stations either side of where it stands: refineProbes
// points at a time, spread evenly, keeping the stretch around the best
// of them, until the stretch is refineTolerance of the member long or
// the field flat over it. A
// peak the climb does not reach (the envelope turning more than once
// between two stations) is missed; for a train alone Influence.Envelope
// adds the exact peaks under the axles first (axlePeaks).
func (e *Envelope) Peak(q int, upper bool, probe func(xs []float64) *Envelope) (Extreme, bool) {
	n := len(e.Stations)
	if n == 0 {
		return Extreme{}, false
	}
	span := e.Stations[n-1] - e.Stations[0]
	tol := keyTolerance * span
	sign := 1.0
	values, at, sides := e.Max[q], e.MaxAt[q], e.MaxSide[q]
	if !upper {
		sign, values, at, sides = -1, e.Min[q], e.MinAt[q], e.MinSide[q]
	}
	scale := e.scale(q)
	b := e.worstStation(q, upper, scale)
	x, pos, v, side := e.Stations[b], at[b], values[b], sides[b]
	// try probes xs and moves to the worst of them where that is worse
	// than where Peak stands, reporting whether the probe answered and
	// whether the field is flat to round-off over xs and where Peak stood.
	try := func(xs []float64) (moved, answered, flat bool) {
		p := probe(xs)
		if p == nil {
			return false, false, false
		}
		pv, pat, psides := p.Max[q], p.MaxAt[q], p.MaxSide[q]
		if !upper {
			pv, pat, psides = p.Min[q], p.MinAt[q], p.MinSide[q]
		}
		best := -1
		flat = true
		for i := range xs {
			flat = flat && math.Abs(pv[i]-v) <= flatField*scale
			if fem.BeyondField(sign*pv[i], sign*v, scale) && (best < 0 || sign*pv[i] > sign*pv[best]) {
				best = i
			}
		}
		if best >= 0 {
			x, pos, v, side = xs[best], pat[best], pv[best], psides[best]
		}
		return best >= 0, true, flat
	}
	for c := range maxClimb {
		var cands []float64
		for _, u := range e.underAxles(pos) {
			if math.Abs(u-x) > tol {
				cands = append(cands, u)
			}
		}
		if c == 0 && b > 0 && b < n-1 {
			lo, hi := e.Stations[b-1]+tol, e.Stations[b+1]-tol
			if xv, ok := vertex(e.Stations[b-1:b+2], values[b-1:b+2]); ok && xv > lo && xv < hi {
				cands = append(cands, xv)
				slices.Sort(cands)
			}
		}
		if len(cands) == 0 {
			break
		}
		if moved, answered, _ := try(cands); !moved || !answered {
			break
		}
	}
	// The stations either side of x.
	i, _ := slices.BinarySearch(e.Stations, x-tol)
	lo, hi := e.Stations[max(i-1, 0)], e.Stations[min(i, n-1)]
	if math.Abs(e.Stations[min(i, n-1)]-x) <= tol {
		hi = e.Stations[min(i+1, n-1)]
	}
	first, last := lo+stationGap*span, hi-stationGap*span
	xs := make([]float64, 0, refineProbes)
	for hi-lo > refineTolerance*span {
		xs = xs[:0]
		d := (hi - lo) / (refineProbes + 1)
		for k := 1; k <= refineProbes; k++ {
			if u := lo + d*float64(k); math.Abs(u-x) > tol && u >= first && u <= last {
				xs = append(xs, u)
			}
		}
		if len(xs) == 0 {
			break
		}
		if _, answered, flat := try(xs); !answered || flat {
			break
		}
		lo, hi = max(lo, x-d), min(hi, x+d)
	}
	return Extreme{v, x, pos, side}, math.Abs(x-e.Stations[b]) > tol
}

// Peak closes in on a peak refineProbes points at a time, until the
// stretch it lies in is refineTolerance of the member long, or the field
// is flat over it to flatField of its size: a peak under an axle is then
// missed by the shear force times that stretch, one where the field turns
// smoothly by round-off. Three points a time narrow the stretch to half
// for the fewest points.
// It comes no closer than stationGap of the member to the stations either
// side, which may be supports: a train placed with an axle a hair off a
// support is a model the exact solver cannot take (a load 1e-11 to 1e-9
// of the member from a support), and the station itself holds the limit.
const (
	refineProbes    = 3
	refineTolerance = 1e-10
	flatField       = 1e-14
	stationGap      = 1e-8
)

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

// underAxles are the points under the axles of the train at p, in
// order, on the stretch of the stations (an axle may stand off the
// member: Train.OffEnds).
func (e *Envelope) underAxles(p Placement) []float64 {
	var out []float64
	first, last := e.Stations[0], e.Stations[len(e.Stations)-1]
	for _, r := range e.runs {
		if r.direction != p.Direction {
			continue
		}
		for _, ax := range r.axles {
			if x := p.Front + ax.offset; x >= first && x <= last {
				out = append(out, x)
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
		out[i] = run{direction: r.direction, s0: r.s0, step: r.step, n: r.n,
			axles: r.axles, uniform: r.uniform, q: r.q, u0: r.u0, u1: r.u1, tolerance: r.tolerance}
		out[i].setKeys(s.keys)
	}
	return out
}

// scanRuns sets hi and lo to the extremes of the lines of the readers rs
// (reading at one point) over every position of the runs: scanned in the
// window of the member where the lines matter, w (see window.go), or,
// where the positions it leaves out might have given an extreme, again
// over the stretch that holds the point and every load of every position
// (the whole member but for a train whose run is short); ls holds the
// lines filled.
func scanRuns(s *sweeps, ls *lines, w *window, rs []reader, runs []run, hi, lo []extreme, jumps []fem.Side) {
	r0 := &runs[0]
	margin := cutMargin * r0.tolerance
	w.set(s, rs, r0.maxOff-r0.minOff+margin)
	ls.fillWindow(s, rs, w.lo, w.hi)
	for {
		clear(hi)
		clear(lo)
		for r := range runs {
			runs[r].scan(ls, hi, lo, jumps, w)
		}
		if w == nil || settled(hi, lo, &runs[0].cut) {
			return
		}
		first, last := w.lo, w.hi
		for _, r := range runs {
			first = min(first, max(s.stretchAt(r.s0+r.minOff-margin)-1, 0))
			last = max(last, min(s.stretchAt(r.front(r.n-1)+r.maxOff+margin)+1, len(s.keys)-2))
		}
		ls.fillWindow(s, rs, first, last)
		w = nil
	}
}

// settled reports whether the extremes hi and lo of a windowed scan that
// left out c are those of the whole member's: none is unsure (extreme),
// or, where a scan of the whole member would itself have carried
// round-off (c.noise), the positions left out could have given no more
// than that round-off, and those taken gave an extreme. A line that is
// zero to round-off at the point (the deflection over a rigid support
// under a uniform load) then names a position of its own round-off,
// as a scan of the whole member names one of its round-off.
func settled(hi, lo []extreme, c *cut) bool {
	for i := range hi {
		if !hi[i].unsure && !lo[i].unsure {
			continue
		}
		if !(c.noise[i] > 0 && c.far[i] <= c.noise[i] && hi[i].set && lo[i].set) {
			return false
		}
	}
	return true
}

// stationReaders sets rs, one per row of envelopeRows, to read the
// envelope's quantities at x, on side where they jump.
func (in *Influence) stationReaders(s *sweeps, x float64, side fem.Side, rs []reader) {
	i, tau := s.locate(x, side)
	for q, row := range envelopeRows {
		_, scale, _ := s.quantityRow(EnvelopeQuantities[q])
		rs[q] = s.stationReader(i, tau, row, scale)
		rs[q].x = x
		rs[q].jump = in.jump(Target{Quantity: EnvelopeQuantities[q], X: x, Side: side})
	}
}

// envelopeStations fills stations from to to of e.
func (in *Influence) envelopeStations(s *sweeps, e *Envelope, from, to int) {
	runs := workRuns(e.runs, s)
	var ls lines
	var w window
	var rs [4]reader
	var hi, lo [4]extreme
	K := len(s.keys) - 1
	m := in.model
	for st := from; st < to; st++ {
		x := e.Stations[st]
		sides := []fem.Side{fem.Right}
		k := s.keyIndex(x)
		key := math.Abs(x-s.keys[k]) <= keyTolerance*s.length
		if key {
			x = s.keys[k]
			switch {
			case k == 0:
			case k == K:
				sides = []fem.Side{fem.Left}
			case e.read != 0:
				sides = []fem.Side{e.read}
			default:
				sides = []fem.Side{fem.Left, fem.Right}
			}
		}
		// The extremes read on each side, by quantity: [side][q].
		var his, los [2][len(envelopeRows) + 1]extreme // the rows, then the bending stress
		for k, side := range sides {
			in.stationReaders(s, x, side, rs[:])
			scanRuns(s, &ls, &w, rs[:], runs, hi[:], lo[:], standingSides(key, side))
			seg := m.Segments[segmentAt(m, x, side)].Section
			stress := seg.FibreDistance / seg.SecondMoment
			for q := range EnvelopeQuantities {
				his[k][q], los[k][q] = hi[min(q, 3)], lo[min(q, 3)]
				if q == 4 {
					his[k][q].value, los[k][q].value = his[k][q].value*stress, los[k][q].value*stress
				}
			}
		}
		for q := range EnvelopeQuantities {
			h, l := his[0][q], los[0][q]
			var hs, ls fem.Side
			if len(sides) == 2 {
				h, hs = sideOf(his[0][q], his[1][q], true)
				l, ls = sideOf(los[0][q], los[1][q], false)
			}
			e.Max[q][st], e.MaxAt[q][st], e.MaxSide[q][st] = h.value, h.at, hs
			e.Min[q][st], e.MinAt[q][st], e.MinSide[q][st] = l.value, l.at, ls
		}
	}
}

// sideOf is the larger (upper) or smaller of left and right, a station's
// extremes read just left and just right of it, and the side it is read
// on (JumpSide): the left one where the envelope does not jump.
func sideOf(left, right extreme, upper bool) (extreme, fem.Side) {
	side := JumpSide(left.value, right.value, upper)
	if side == fem.Right {
		return right, side
	}
	return left, side
}

// JumpSide is the side of a point that an envelope's largest (upper) or
// smallest value there is read on, left and right being its values just
// left and just right of the point: the side of the larger (smaller),
// or 0 where they differ by no more than round-off of their size (the
// envelope does not jump there).
func JumpSide(left, right float64, upper bool) fem.Side {
	switch {
	case math.Abs(left-right) <= jumpRoundOff*max(math.Abs(left), math.Abs(right)):
		return 0
	case fem.Beyond(signed(right, upper), signed(left, upper)):
		return fem.Right
	}
	return fem.Left
}

// jumpRoundOff is the share of its size by which an envelope's extremes
// either side of a station may differ without a jump between them: the
// two sides are read through different stretches' coefficients.
const jumpRoundOff = 1e-9

// Worst is the largest and the smallest value of target tg under train t
// over every position of its front along its run, with the positions
// giving them (the step plays no part). A quantity at a point where it
// jumps is read on tg.Side; a bending target only (a train loads across).
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
	h, l := []extreme{{}}, []extreme{{}}
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
		runs[i].scan(&ls, h, l, jumps, nil)
	}
	x := tg.X
	if tg.Reaction {
		x = in.model.Supports[tg.Support].X
	}
	return Extreme{Value: h[0].value, X: x, Placement: h[0].at}, Extreme{Value: l[0].value, X: x, Placement: l[0].at}, nil
}

// envelopeReactions finds the range of every reaction across the member.
func (in *Influence) envelopeReactions(s *sweeps, e *Envelope) {
	runs := workRuns(e.runs, s)
	var ls lines
	var w window
	for i, sup := range in.model.Supports {
		for _, d := range []fem.Dof{fem.Transverse, fem.Rotation} {
			if !sup.Holds(d) {
				continue
			}
			rs := []reader{s.reactionReader(s.keyIndex(sup.X), d)}
			hi, lo := []extreme{{}}, []extreme{{}}
			scanRuns(s, &ls, &w, rs, runs, hi, lo, nil)
			e.Reactions = append(e.Reactions, ReactionEnvelope{Support: i, Motion: d,
				Max: hi[0].value, Min: lo[0].value, MaxAt: hi[0].at, MinAt: lo[0].at})
		}
	}
}
