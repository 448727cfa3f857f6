package moving

import (
	"math"
	"slices"
)

// Windows: a station reads only the stretch of the member where its lines
// matter.
//
// On a member over many supports the influence line of a point dies away
// from it, by a factor of about 2 − √3 ≈ 0.27 per span of a continuous
// beam of equal spans (the three-moment equation's homogeneous solution,
// from memory), so that ten spans away it is below a millionth of its
// peak. An envelope that scanned the whole member at every station cost
// the stations times the key points: the square of the supports (1,000
// supports under a two-axle train took 16 s for `stave solve`). So a
// station's lines are filled, and the train scanned, only over a window:
// the stretch where some line may still reach farLine of its largest
// piece, widened by the train's length so that every position with a load
// in that stretch has all its loads in the window. Beyond the stretch
// every piece of every line is bounded (sweeps.setBounds), and with it
// every effect of the positions left out (cut); the extremes stay those
// of the whole member by extreme's bookkeeping of what a position left
// out may have done (extreme.skip). Where that bound cannot rule the
// positions left out out (a train whose run lies far from the station, a
// line whose extreme lies far away), the station is scanned again over
// every position (scanRuns). So the window only saves work: for a train of
// at most shortTrain axles alone the envelope is the same to the bit; with
// a uniform load (its integrals taken from the window's start rather than
// the member's) or a long train (its running sums begun afresh at the
// window) it is the same to round-off, and a line that is zero to
// round-off at the station may name a position of its own round-off
// (settled).

// farLine is the size, relative to a line's largest piece so far, below
// which the rest of the member beyond a stretch may bound the line: the
// window ends there.
const farLine = 1e-6

// farRoundOff is, relative to a line's largest piece and per newton of the
// train's loads, the round-off a position off the window may have carried
// in the whole scan: a uniform load's integral is taken from the member's
// start, so that far along it carries the round-off of the integral over
// the window (its size times the member's length, times a few ulps); a
// long train's sums keep the round-off of terms taken out (see scan:
// summed afresh every resumEvery stretches, each term's round-off read at
// most (1/shortSlot)³ times). Both well above their worst case.
const (
	farRoundOff     = 1e-9
	farRoundOffLong = 1e-5
)

// sym2 is a symmetric 2 × 2 matrix [[a, b], [b, c]]: the shape Q of an
// ellipse that holds a set of coefficient pairs v, in that |y·v| ≤
// √(y·Q·yᵀ) for every row y (its reach).
type sym2 struct{ a, b, c float64 }

// plus is the ellipse holding both: max(p, q) ≤ √(p² + q²).
func (q sym2) plus(r sym2) sym2 { return sym2{q.a + r.a, q.b + r.b, q.c + r.c} }

// boundRoundOff widens an ellipse, per mapping, against the round-off of
// the products (relative to the sizes multiplied): a few hundred ulps.
const boundRoundOff = 1e-13

// mapped is the ellipse holding M·v for every v q holds: M·Q·Mᵀ, widened on
// its diagonal by the round-off of the products.
func (q sym2) mapped(m mat2) sym2 {
	p00, p01 := m[0][0]*q.a+m[0][1]*q.b, m[0][0]*q.b+m[0][1]*q.c
	p10, p11 := m[1][0]*q.a+m[1][1]*q.b, m[1][0]*q.b+m[1][1]*q.c
	out := sym2{p00*m[0][0] + p01*m[0][1], p00*m[1][0] + p01*m[1][1], p10*m[1][0] + p11*m[1][1]}
	// The same products of sizes: what round-off is relative to.
	a0, a1 := math.Abs(m[0][0]), math.Abs(m[0][1])
	b0, b1 := math.Abs(m[1][0]), math.Abs(m[1][1])
	qa, qb, qc := math.Abs(q.a), math.Abs(q.b), math.Abs(q.c)
	size := max((a0*qa+a1*qb)*a0+(a0*qb+a1*qc)*a1, (b0*qa+b1*qb)*b0+(b0*qb+b1*qc)*b1)
	w := boundRoundOff * size
	out.a += w
	out.c += w
	return out
}

// reach is the largest |y·v| over the ellipse, to round-off (widened), and
// to the absolute round-off of rows carried into subnormal numbers, whose
// every product may be off by 2⁻¹⁰⁷⁴ (a few hundred such); a row of exact
// zeros reaches nothing, its products beyond being exact zeros too.
func (q sym2) reach(y [2]float64) float64 {
	if y == [2]float64{} {
		return 0
	}
	v := y[0]*y[0]*q.a + 2*y[0]*y[1]*q.b + y[1]*y[1]*q.c
	size := y[0]*y[0]*math.Abs(q.a) + 2*math.Abs(y[0]*y[1]*q.b) + y[1]*y[1]*math.Abs(q.c)
	r := math.Sqrt(max(v, 0) + boundRoundOff*size)
	if max(math.Abs(y[0]), math.Abs(y[1])) < 0x1p-1000 {
		r += 0x1p-1066 * math.Sqrt(math.Abs(q.a)+math.Abs(q.c))
	}
	return r
}

// pieceBound is the ellipse holding Σ_p c_p·t_p for every |t_p| ≤ hᵖ, c_p the
// coefficient pairs of τᵖ of stretch j's jump on the side after the point
// read (a, the left sweep's) or before it (b): every line's piece on
// stretch j, and the sum of its terms' sizes, is its row times such a
// pair. Four terms: Q = 4·Σ h²ᵖ·c_p·c_pᵀ (Cauchy–Schwarz).
func (s *sweeps) pieceBound(j int, after bool) sym2 {
	h := (s.keys[j+1] - s.keys[j]) / s.length
	off := s.r
	if after {
		off = 0
	}
	var q sym2
	hp := 1.0
	for p := range 4 {
		y := &s.jump[j][p]
		c0, c1 := y[off]*hp, 0.0
		if s.r == 2 {
			c1 = y[off+1] * hp
		}
		q = q.plus(sym2{4 * c0 * c0, 4 * c0 * c1, 4 * c1 * c1})
		hp *= h
	}
	return q
}

// setBounds finds, for every stretch j, the ellipses holding its own
// pieces (pieceAfter, pieceBefore: for a load after the point read and
// before it) and those beyond it, in terms of a line's row on stretch j
// (see lines.fill): afterBound[j] the pieces of the stretches after j,
// beforeBound[j] those before j. A line's row on stretch j reaches over
// them to bound its pieces: the window's edge. It also finds the longest
// stretch.
func (s *sweeps) setBounds() {
	K := len(s.keys) - 1
	s.pieceAfter, s.pieceBefore = make([]sym2, K), make([]sym2, K)
	for j := range K {
		s.pieceAfter[j], s.pieceBefore[j] = s.pieceBound(j, true), s.pieceBound(j, false)
		s.longest = max(s.longest, s.keys[j+1]-s.keys[j])
	}
	s.afterBound, s.beforeBound = make([]sym2, K), make([]sym2, K)
	for j := K - 2; j >= 0; j-- {
		s.afterBound[j] = s.pieceAfter[j+1].plus(s.afterBound[j+1]).mapped(s.ml[j+1])
	}
	for j := 1; j < K; j++ {
		s.beforeBound[j] = s.pieceBefore[j-1].plus(s.beforeBound[j-1]).mapped(s.mr[j])
	}
}

// window is the part of the member a station's lines are filled and its
// train scanned over: stretches lo to hi of the sweeps. Loads outside the
// stretch from near to far (m) give every line i less than beyond[i] per
// newton, the sum of its terms' sizes; size[i] is the largest such sum of
// line i's pieces inside.
type window struct {
	lo, hi       int
	near, far    float64
	beyond, size []float64
	whole        bool    // the window is the member
	longest      float64 // the member's longest stretch between key points, m
	// Scratch: each line's row on the stretch reached after and before
	// the point, and the reaches at an edge.
	rowAfter, rowBefore [][2]float64
	reach               []float64
}

// fewStretches is the number of stretches below which a window is the
// whole member: its lines die away over a few tens of them (farLine), and
// on fewer the window would save too little to pay for finding it (the
// two spans of BenchmarkEnvelopeFourAxles2000Positions10000Elements lost
// a third of their time to it).
const fewStretches = 24

// set finds the window of the lines the readers rs read (at one point)
// for a train whose loads stand within extent of each other (m).
func (w *window) set(s *sweeps, rs []reader, extent float64) {
	K := len(s.keys) - 1
	n := len(rs)
	r0 := &rs[0]
	if K < fewStretches {
		w.lo, w.hi, w.whole = 0, K-1, true
		return
	}
	w.beyond = slices.Grow(w.beyond[:0], n)[:n]
	w.size = slices.Grow(w.size[:0], n)[:n]
	w.rowAfter = slices.Grow(w.rowAfter[:0], n)[:n]
	w.rowBefore = slices.Grow(w.rowBefore[:0], n)[:n]
	clear(w.beyond)
	clear(w.size)
	piece := func(i, j int, row [2]float64, bounds []sym2) {
		w.size[i] = max(w.size[i], math.Abs(rs[i].scale)*bounds[j].reach(row))
	}
	// The pieces on both sides of the point, then outwards a stretch a
	// side at a time (the rows as lines.fill carries them), each side's
	// edge judged against the largest piece of both so far.
	hi, lo := r0.after, r0.before
	for i := range n {
		w.rowAfter[i], w.rowBefore[i] = rs[i].afterRow, rs[i].beforeRow
		if hi < K {
			piece(i, hi, w.rowAfter[i], s.pieceAfter)
		}
		if lo >= 0 {
			piece(i, lo, w.rowBefore[i], s.pieceBefore)
		}
	}
	doneAfter, doneBefore := hi >= K-1, lo <= 0
	for !doneAfter || !doneBefore {
		if !doneAfter {
			if doneAfter = w.edge(rs, w.rowAfter, s.afterBound[hi]); !doneAfter {
				hi++
				for i := range n {
					w.rowAfter[i] = rowTimes(w.rowAfter[i], s.ml[hi])
					piece(i, hi, w.rowAfter[i], s.pieceAfter)
				}
				doneAfter = hi >= K-1
			}
		}
		if !doneBefore {
			if doneBefore = w.edge(rs, w.rowBefore, s.beforeBound[lo]); !doneBefore {
				for i := range n {
					w.rowBefore[i] = rowTimes(w.rowBefore[i], s.mr[lo])
					piece(i, lo-1, w.rowBefore[i], s.pieceBefore)
				}
				lo--
				doneBefore = lo <= 0
			}
		}
	}
	lo = max(min(lo, r0.at), 0)
	hi = min(max(hi, r0.at), K-1)
	w.near, w.far = s.keys[lo], s.keys[hi+1]
	// Widened by the train, and a stretch more each side against the
	// tolerance a load on a key point is placed with.
	w.lo = max(s.stretchAt(w.near-extent)-1, 0)
	w.hi = min(s.stretchAt(w.far+extent)+1, K-1)
	w.whole = w.lo == 0 && w.hi == K-1
	w.longest = s.longest
}

// edge reports whether the window may end on the stretch where the lines
// have rows rows, the ellipse q holding every piece beyond it: whether
// every line's reach there is below farLine of its largest piece so far.
// If so it takes the reaches, doubled against round-off, into beyond.
func (w *window) edge(rs []reader, rows [][2]float64, q sym2) bool {
	w.reach = slices.Grow(w.reach[:0], len(rs))[:len(rs)]
	for i := range rs {
		w.reach[i] = 2 * math.Abs(rs[i].scale) * q.reach(rows[i])
		if !(w.reach[i] <= farLine*w.size[i]) {
			return false
		}
	}
	for i, r := range w.reach {
		w.beyond[i] = max(w.beyond[i], r)
	}
	return true
}

// stretchAt is the stretch holding x, clamped to the member.
func (s *sweeps) stretchAt(x float64) int {
	K := len(s.keys) - 1
	j, _ := slices.BinarySearch(s.keys, x)
	return min(max(j-1, 0), K-1)
}
