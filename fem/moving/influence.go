package moving

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"

	"stave/fem"
)

// Target is what an influence line reads: a quantity at a point of the
// member, or the reaction of a support in one motion.
type Target struct {
	// Quantity is read at X (m) from Side, where it may jump (the shear
	// force under the load, a moment at a support): the deflection,
	// rotation, shear force, bending moment or bending stress (bending), or
	// the axial displacement, axial force or axial stress (axial).
	Quantity fem.Quantity
	X        float64
	Side     fem.Side
	// Reaction asks instead for the reaction of Model.Supports[Support] in
	// Motion, which the support must hold (rigidly or by a spring).
	Reaction bool
	Support  int
	Motion   fem.Dof
}

// String names the target in words, positions in metres.
func (t Target) String() string {
	if t.Reaction {
		return fmt.Sprintf("%s reaction of support %d", t.Motion, t.Support+1)
	}
	side := ""
	if t.Side == fem.Left {
		side = " (left side)"
	}
	return fmt.Sprintf("%s at x = %s m%s", t.Quantity, trim(t.X), side)
}

// Describe names the line's target in words for a page, its position
// written as x (with its unit): "bending moment at x = 2.5 m", or where
// the quantity jumps at the point (Line.sided) the side it is read on, as
// the static outputs say it (fem.Side.At): "shear force just left of
// x = 6 m"; or the reaction of a support.
func (l *Line) Describe(x string) string {
	t := l.Target
	if t.Reaction {
		return t.String()
	}
	return fmt.Sprintf("%s %s", t.Quantity, l.Side().At("x = "+x))
}

// String names l's target in words, positions in metres, with its side
// where it jumps (Describe).
func (l *Line) String() string { return l.Describe(trim(l.Target.X) + " m") }

// Side is the side of its point that l's target is read on where its
// quantity jumps there (see sided), 0 where the side does not matter.
func (l *Line) Side() fem.Side {
	switch {
	case !l.sided:
		return 0
	case l.Target.Side == 0:
		return fem.Right // as read (Target.Side)
	}
	return l.Target.Side
}

// inner is t read on the member: at either end only one side of the point
// lies on it (the right of x = 0, the left of x = L), and that is the side
// read whatever side t names. Read from outside, the shear force at an end
// would be zero for every load but one standing on the end itself.
func (t Target) inner(length float64) Target {
	if t.Reaction {
		return t
	}
	switch {
	case t.X <= keyTolerance*length:
		t.Side = fem.Right
	case t.X >= length-keyTolerance*length:
		t.Side = fem.Left
	}
	return t
}

// Bending reports whether t is a bending quantity, for a unit force down;
// otherwise it is axial, for a unit force along +x.
func (t Target) Bending() bool {
	if t.Reaction {
		return t.Motion != fem.Axial
	}
	switch t.Quantity {
	case fem.QAxialDisplacement, fem.QAxialForce, fem.QAxialStress:
		return false
	}
	return true
}

// UnitLoad is the unit load of t's influence line, in words, of 1 of the
// force unit named by symbol: the unit the ordinates are read per ("N" for
// the ordinates in SI base units, "kip" for ordinates per kip).
func (t Target) UnitLoad(symbol string) string {
	if t.Bending() {
		return "a unit force of 1 " + symbol + " acting down"
	}
	return "a unit force of 1 " + symbol + " along +x"
}

// Influence holds a member's influence lines in closed form (see the
// package comment): set up once, any target's line in time proportional to
// the number of key points.
type Influence struct {
	model *fem.Model
	// The sweeps of the bending and the axial problem, or why there are none.
	bending, axial       *sweeps
	bendingErr, axialErr error
}

// New sets up the influence lines of the member p. It refuses a member fem
// cannot solve (a mechanism, say) with fem's own message; a member that can
// carry loads of one kind only (a beam on rollers alone has no axial
// restraint) is set up, and Line refuses the targets of the other.
func New(p *fem.Member) (*Influence, error) {
	if _, err := p.ExactStructure(); err != nil {
		return nil, err
	}
	m := p.Model()
	in := &Influence{model: m}
	across, along := unsupported(m)
	switch {
	case m.AxialOnly:
		in.bendingErr = errors.New("the member is axial-only (a tie or strut): it carries no load across and has no bending influence lines")
	case across != "":
		in.bendingErr = fmt.Errorf("influence lines across the member and moving load trains are not available for a member with %s: the member's closed-form influence lines leave it out; solve the train at chosen positions as loads instead", across)
	default:
		in.bending, in.bendingErr = newSweeps(m, bendingProblem)
	}
	if along != "" {
		in.axialErr = fmt.Errorf("influence lines along the member are not available for a member with %s: the member's closed-form influence lines leave it out", along)
	} else {
		in.axial, in.axialErr = newSweeps(m, axialProblem)
	}
	if in.bending == nil && in.axial == nil {
		return nil, in.bendingErr
	}
	return in, nil
}

// unsupported says what of m the closed-form influence lines (the transfer
// sweeps of green.go) do not take, across and along the member: an elastic
// foundation, shear deformation; "" when they take it all.
func unsupported(m *fem.Model) (across, along string) {
	for _, f := range m.Foundations {
		if f.Modulus > 0 {
			across = "an elastic foundation across it"
		}
		if f.AxialModulus > 0 {
			along = "an elastic foundation along it"
		}
	}
	for _, sg := range m.Segments {
		if sg.ShearDeformation && across == "" {
			across = "shear deformation"
		}
	}
	return across, along
}

// Model is the member's model, shared: do not change it.
func (in *Influence) Model() *fem.Model { return in.model }

// sweepsFor returns the sweeps that answer t.
func (in *Influence) sweepsFor(t Target) (*sweeps, error) {
	if t.Bending() {
		return in.bending, in.bendingErr
	}
	return in.axial, in.axialErr
}

// Line is one influence line: the value of its target per newton of the
// unit load (Target.Unit), as a function of the load's position s along the
// member, piecewise cubic.
type Line struct {
	Target Target
	// sided says the side Target is read on matters (see sided).
	sided bool
	lines
}

// Line returns the influence line of t.
func (in *Influence) Line(t Target) (*Line, error) {
	t = t.inner(in.model.Length())
	s, err := in.sweepsFor(t)
	if err != nil {
		return nil, err
	}
	r, err := in.reader(s, t)
	if err != nil {
		return nil, err
	}
	ln := &Line{Target: t}
	ln.fill(s, []reader{r})
	ln.sided = in.sided(s, ln)
	return ln, nil
}

// sided reports whether the side l's target is read on matters: its
// quantity jumps at its point inside the member, under the unit load
// standing there (the shear force: Line.Jump) or for loads anywhere (the
// shear force at a support, the rotation at a hinge, the stress where
// the section changes), the line read on the other side differing from
// l beyond round-off at a third and two thirds of every stretch. An end
// of the member has one side only; a reaction none.
func (in *Influence) sided(s *sweeps, l *Line) bool {
	t := l.Target
	L := in.model.Length()
	if t.Reaction || t.X <= keyTolerance*L || t.X >= L-keyTolerance*L {
		return false
	}
	if l.Jump() != 0 {
		return true
	}
	if k := s.keyIndex(t.X); math.Abs(t.X-s.keys[k]) > keyTolerance*s.length {
		return false // off the key points nothing jumps but under the load
	}
	other := t
	other.Side = fem.Left
	if t.Side == fem.Left {
		other.Side = fem.Right
	}
	r, err := in.reader(s, other)
	if err != nil {
		return false
	}
	var o lines
	o.fill(s, []reader{r})
	size, apart := 0.0, 0.0
	for i := 1; i < len(s.keys); i++ {
		for _, f := range []float64{1.0 / 3, 2.0 / 3} {
			p := s.keys[i-1] + f*(s.keys[i]-s.keys[i-1])
			a, b := l.value(0, p, fem.Right), o.value(0, p, fem.Right)
			size, apart = max(size, math.Abs(a), math.Abs(b)), max(apart, math.Abs(a-b))
		}
	}
	return apart > jumpRoundOff*size
}

// jump is how much the line of t rises as the unit load crosses t's own
// point towards +x (see Line.Jump).
func (in *Influence) jump(t Target) float64 {
	if t.Reaction {
		return 0
	}
	switch t.Quantity {
	case fem.QShearForce, fem.QAxialForce:
		return 1
	case fem.QAxialStress:
		return 1 / in.model.Segments[segmentAt(in.model, t.X, t.Side)].Section.Area
	}
	return 0
}

// Jump is how much the line rises, per newton, as the unit load crosses
// the target's own point towards +x: 1 for the shear force and the axial
// force (the load passes from the part behind the cut to the part ahead),
// one over the area on the side read for the axial stress, 0 for the
// quantities that do not jump there and for reactions. A load standing on
// the point itself lies on the far side of the cut from the side read, so
// its value is the line's limit on that side less the jump (read on the
// right) or plus it (read on the left); at an end of the member, where the
// line has no piece beyond the point, only the jump gives it.
func (l *Line) Jump() float64 { return l.jumps[0] }

// reader is a linear quantity read at one point, in the coefficients of the
// sweeps: for a load after the point, the row that reads the left sweep's
// state from the coefficients of stretch after (later stretches by ml); for
// a load before it, the row that reads the right sweep's state from those
// of stretch before (earlier stretches by mr). The point lies in stretch
// at, τ = tau from its start, and the value is scaled to SI by scale.
type reader struct {
	after, before       int
	afterRow, beforeRow [2]float64
	at                  int
	tau                 float64
	x                   float64 // the point, m
	scale               float64
	jump                float64 // see Line.Jump
}

// reader compiles t for s.
func (in *Influence) reader(s *sweeps, t Target) (reader, error) {
	m := in.model
	if t.Reaction {
		if t.Support < 0 || t.Support >= len(m.Supports) {
			return reader{}, fmt.Errorf("there is no support %d: the member has %d", t.Support+1, len(m.Supports))
		}
		sup := m.Supports[t.Support]
		if t.Motion < fem.Axial || t.Motion > fem.Rotation || !sup.Holds(t.Motion) {
			return reader{}, fmt.Errorf("support %d (%s at x = %s m) does not hold the %s motion: it has no %s reaction", t.Support+1, sup.Kind, trim(sup.X), t.Motion, t.Motion)
		}
		return s.reactionReader(s.keyIndex(sup.X), t.Motion), nil
	}
	if !(t.X >= 0 && t.X <= m.Length()) {
		// Every digit of x: 12.0000000001 is not 12.
		return reader{}, fmt.Errorf("x = %s m is not on the member (0 to %s m): give a point on it", strconv.FormatFloat(t.X, 'g', -1, 64), trim(m.Length()))
	}
	row, scale, ok := s.quantityRow(t.Quantity)
	if !ok {
		if t.Quantity == fem.QCombinedStress {
			return reader{}, errors.New("the combined stress is not linear in the loads (it takes the larger fibre): it has no influence line; ask for the bending or the axial stress")
		}
		return reader{}, fmt.Errorf("there is no influence line of the %s", t.Quantity)
	}
	switch t.Quantity {
	case fem.QBendingStress, fem.QAxialStress:
		seg := m.Segments[segmentAt(m, t.X, t.Side)]
		if t.Quantity == fem.QBendingStress {
			scale *= seg.Section.FibreDistance / seg.Section.SecondMoment
		} else {
			scale /= seg.Section.Area
		}
	}
	i, tau := s.locate(t.X, t.Side)
	r := s.stationReader(i, tau, row, scale)
	r.x = t.X
	r.jump = in.jump(t)
	if k := s.keyIndex(t.X); math.Abs(t.X-s.keys[k]) <= keyTolerance*s.length {
		r.x = s.keys[k] // the key point itself, as locate took it
	}
	return r, nil
}

// segmentAt is the segment holding x, the one on side at a break.
func segmentAt(m *fem.Model, x float64, side fem.Side) int {
	i := m.SegmentAt(x)
	if side == fem.Left && i > 0 && math.Abs(x-m.Segments[i].Start) <= keyTolerance*m.Length() {
		return i - 1
	}
	return i
}

// quantityRow is the state component q reads and the scale from the scaled
// response to the scaled unit jump to SI per newton (see green.go).
func (s *sweeps) quantityRow(q fem.Quantity) (row int, scale float64, ok bool) {
	l, e := s.length, s.rigidity
	if s.problem == axialProblem {
		switch q {
		case fem.QAxialDisplacement:
			return compU, l / e, true
		case fem.QAxialForce, fem.QAxialStress:
			return compN, 1, true
		}
		return 0, 0, false
	}
	switch q {
	case fem.QDeflection:
		return compW, l * l * l / e, true
	case fem.QRotation:
		return compTheta, l * l / e, true
	case fem.QBendingMoment, fem.QBendingStress:
		return compM, l, true
	case fem.QShearForce:
		return compV, 1, true
	}
	return 0, 0, false
}

// locate is the stretch holding x and τ from its start; at a key point the
// stretch on side (the one inside the member at its ends).
func (s *sweeps) locate(x float64, side fem.Side) (int, float64) {
	K := len(s.keys) - 1
	k := s.keyIndex(x)
	if math.Abs(x-s.keys[k]) <= keyTolerance*s.length {
		if k == K || (side == fem.Left && k > 0) {
			return k - 1, (s.keys[k] - s.keys[k-1]) / s.length
		}
		return k, 0
	}
	j := k
	if x < s.keys[k] {
		j = k - 1
	}
	return j, (x - s.keys[j]) / s.length
}

// stationReader reads state component row at τ in stretch i.
func (s *sweeps) stationReader(i int, tau float64, row int, scale float64) reader {
	zl := s.transferBasis(s.zlPlus[i], i, tau)
	zr := s.transferBasis(s.zrPlus[i], i, tau)
	return reader{
		after: i, before: i, at: i, tau: tau, scale: scale,
		afterRow:  [2]float64{zl[0][row], zl[1][row]},
		beforeRow: [2]float64{zr[0][row], zr[1][row]},
	}
}

// reactionReader reads the reaction in motion d of the support at key
// point k: the jump of the force its restraint acts on, which is the
// reaction (V jumps by the transverse reaction R, M by −C, N by −R).
func (s *sweeps) reactionReader(k int, d fem.Dof) reader {
	row, sign, scale := compV, 1.0, 1.0
	switch d {
	case fem.Rotation:
		row, sign, scale = compM, -1, s.length
	case fem.Axial:
		row, sign = compN, -1
	}
	r := reader{after: k, before: k - 1, scale: sign * scale}
	// Left sweep: stretch k's coefficients, the state left of k read
	// through ml[k].
	left := rowTimes([2]float64{s.zlMinus[k][0][row], s.zlMinus[k][1][row]}, s.ml[k])
	r.afterRow = [2]float64{s.zlPlus[k][0][row] - left[0], s.zlPlus[k][1][row] - left[1]}
	// Right sweep: stretch k−1's coefficients, the state right of k read
	// through mr[k].
	right := rowTimes([2]float64{s.zrPlus[k][0][row], s.zrPlus[k][1][row]}, s.mr[k])
	r.beforeRow = [2]float64{right[0] - s.zrMinus[k][0][row], right[1] - s.zrMinus[k][1][row]}
	K := len(s.keys) - 1
	if k == K {
		r.at, r.tau = K-1, (s.keys[K]-s.keys[K-1])/s.length
	} else {
		r.at, r.tau = k, 0
	}
	r.x = s.keys[k]
	return r
}

// lines are n influence lines on common pieces between bounds (m), each
// piece's cubic in τ = (s − start)/ℓ per newton, with the integral of each
// line from the first bound to the piece's start (per newton, times m).
// The pieces cover the member, or a window of it (fillWindow).
type lines struct {
	n      int
	length float64 // ℓ, m
	bounds []float64
	coef   []poly    // [piece·n + line]
	integ  []float64 // [piece·n + line]
	// first and last are the member's ends, m.
	first, last float64
	// at is the point the readers read (where a line may jump).
	at float64
	// jumps is, per line, how much it rises as the load crosses at
	// towards +x (see Line.Jump).
	jumps []float64
	// rows is scratch: per stretch and reader, the row fill applies.
	rows [][2]float64
}

// pieces is the number of pieces.
func (ls *lines) pieces() int { return len(ls.bounds) - 1 }

// fill sets ls to the lines of the readers rs, which must read at one
// point, along the whole member. It reuses ls's slices, so a loop over
// stations allocates nothing.
func (ls *lines) fill(s *sweeps, rs []reader) { ls.fillWindow(s, rs, 0, len(s.keys)-2) }

// fillWindow is fill over stretches lo to hi of s alone, which must hold
// the point read: each piece there as fill finds it, to the bit, but the
// integrals, taken from the window's start.
func (ls *lines) fillWindow(s *sweeps, rs []reader, lo, hi int) {
	K := len(s.keys) - 1
	n := len(rs)
	r0 := &rs[0]
	ls.n, ls.length = n, s.length
	ls.first, ls.last = s.keys[0], s.keys[K]
	ls.at = r0.x
	ls.jumps = ls.jumps[:0]
	for i := range n {
		ls.jumps = append(ls.jumps, rs[i].jump)
	}
	ls.bounds, ls.coef = ls.bounds[:0], ls.coef[:0]
	ls.rows = slices.Grow(ls.rows[:0], 2*K*n)[:2*K*n]
	// rows[j·n+i] reads the right sweep from stretch j's coefficients (j up
	// to before, going down by mr), rows[(K+j)·n+i] the left sweep (j from
	// after, going up by ml).
	for i := range n {
		row := rs[i].beforeRow
		for j := r0.before; j >= lo; j-- {
			ls.rows[j*n+i] = row
			row = rowTimes(row, s.mr[j])
		}
		row = rs[i].afterRow
		for j := r0.after; j <= hi; j++ {
			if j > r0.after {
				row = rowTimes(row, s.ml[j])
			}
			ls.rows[(K+j)*n+i] = row
		}
	}
	for j := lo; j <= hi; j++ {
		a, b := s.keys[j], s.keys[j+1]
		switch {
		case j < r0.at:
			ls.addPiece(s, rs, j, a, b, false, 0)
		case j > r0.at:
			ls.addPiece(s, rs, j, a, b, true, 0)
		default:
			ls.addPiece(s, rs, j, a, ls.at, false, 0)
			ls.addPiece(s, rs, j, ls.at, b, true, r0.tau)
		}
	}
	// Integrals from the first bound to each piece's start.
	ls.integ = slices.Grow(ls.integ[:0], len(ls.coef))[:len(ls.coef)]
	for i := range n {
		ls.integ[i] = 0
	}
	for p := 1; p < ls.pieces(); p++ {
		h := (ls.bounds[p] - ls.bounds[p-1]) / ls.length
		for i := range n {
			anti := ls.coef[(p-1)*n+i].antiderivative()
			ls.integ[p*n+i] = ls.integ[(p-1)*n+i] + ls.length*anti.at(h)
		}
	}
}

// addPiece adds the piece [from, to] of stretch j, for a load after the
// readers' point (the left sweep's a) or before it (the right sweep's b),
// its cubics shifted to start shift (τ) into the stretch.
func (ls *lines) addPiece(s *sweeps, rs []reader, j int, from, to float64, after bool, shift float64) {
	if !(to > from) {
		return
	}
	if len(ls.bounds) == 0 {
		ls.bounds = append(ls.bounds, from)
	}
	ls.bounds = append(ls.bounds, to)
	K, n := len(s.keys)-1, len(rs)
	base, off := j*n, s.r
	if after {
		base, off = (K+j)*n, 0
	}
	for i := range rs {
		row := ls.rows[base+i]
		var c poly
		for p := range 4 {
			y := &s.jump[j][p]
			v := row[0] * y[off]
			if s.r == 2 {
				v += row[1] * y[off+1]
			}
			c[p] = rs[i].scale * v
		}
		ls.coef = append(ls.coef, c.shift(shift))
	}
}

// trim writes x to six significant figures, without trailing zeros.
func trim(x float64) string { return strconv.FormatFloat(x, 'g', 6, 64) }

// piece is the index of the piece holding s: at a bound, the piece on side
// (the one inside at the ends).
func (ls *lines) piece(s float64, side fem.Side) int {
	p, found := slices.BinarySearch(ls.bounds, s)
	last := ls.pieces() - 1
	// A bound within the key tolerance is the bound.
	tol := keyTolerance * ls.length
	if !found && p < len(ls.bounds) && ls.bounds[p]-s <= tol {
		found = true
	} else if !found && p > 0 && s-ls.bounds[p-1] <= tol {
		p, found = p-1, true
	}
	switch {
	case found && side == fem.Left:
		p--
	case !found:
		p--
	}
	return min(max(p, 0), last)
}

// value is line i at s, on side at a bound where it jumps.
func (ls *lines) value(i int, s float64, side fem.Side) float64 {
	p := ls.piece(s, side)
	return ls.coef[p*ls.n+i].at((s - ls.bounds[p]) / ls.length)
}

// standing is line i with the load standing on its own point at, taken
// as the limit of the piece on side (Left: the load just before the point).
// At an end of the member the piece beyond it lies off the member: its
// limit is the inside piece's across the jump (a load on the free end of a
// cantilever is all its shear force there).
func (ls *lines) standing(i int, side fem.Side) float64 {
	tol := keyTolerance * ls.length
	switch {
	case side == fem.Left && ls.at-ls.first <= tol:
		return ls.value(i, ls.at, fem.Right) - ls.jumps[i]
	case side == fem.Right && ls.last-ls.at <= tol:
		return ls.value(i, ls.at, fem.Left) + ls.jumps[i]
	}
	return ls.value(i, ls.at, side)
}

// integral is ∫ line i from 0 to s, per newton times m.
func (ls *lines) integral(i int, s float64) float64 {
	p := ls.piece(s, fem.Right)
	anti := ls.coef[p*ls.n+i].antiderivative()
	return ls.integ[p*ls.n+i] + ls.length*anti.at((s-ls.bounds[p])/ls.length)
}

// At is the value of the target per newton with the unit load at s (m); at
// a point where the line jumps (the shear force with the load at its own
// point) side picks the limit.
func (l *Line) At(s float64, side fem.Side) float64 { return l.value(0, s, side) }

// Integral is the integral of the line from a to b, per newton times m: the
// value of the target under a uniform load of 1 N/m over [a, b].
func (l *Line) Integral(a, b float64) float64 { return l.integral(0, b) - l.integral(0, a) }

// Point is one point of an influence line: the load position S (m) and the
// value there per newton.
type Point struct {
	S     float64 `json:"s"`
	Value float64 `json:"value"`
}

// Polylines samples the line with about n points in all, each piece from
// its start to its end (so a jump shows as a gap between two polylines).
func (l *Line) Polylines(n int) [][]Point {
	span := l.bounds[len(l.bounds)-1] - l.bounds[0]
	out := make([][]Point, 0, l.pieces())
	for p := range l.pieces() {
		a, b := l.bounds[p], l.bounds[p+1]
		m := max(2, int(math.Ceil(float64(n)*(b-a)/span))+1)
		pts := make([]Point, m)
		c := &l.coef[p]
		for k := range pts {
			s := a + (b-a)*float64(k)/float64(m-1)
			pts[k] = Point{s, c.at((s - a) / l.length)}
		}
		out = append(out, pts)
	}
	return out
}

// Extremes are the smallest and the largest value of the line and where
// they are, from the ends of its pieces and the roots of their derivatives:
// where a single load does most. Of values that tie to round-off against
// the line's size (fem.BeyondField) the first along the member is kept, so
// that a moment of 1e-16 beside a support's 0 names no place of its own.
func (l *Line) Extremes() (lo, hi Point) {
	var cands []Point
	scale := 0.0
	take := func(s, v float64) {
		cands = append(cands, Point{s, v})
		scale = max(scale, math.Abs(v))
	}
	for p := range l.pieces() {
		a, b := l.bounds[p], l.bounds[p+1]
		c := &l.coef[p]
		h := (b - a) / l.length
		take(a, c.at(0))
		var r [3]float64
		d := c.derivative()
		for _, u := range r[:rootsIn(d, 0, h, &r)] {
			take(a+u*l.length, c.at(u))
		}
		take(b, c.at(h))
	}
	// A load standing on the line's own point where it jumps: at an end of
	// the member a value no piece holds (see standing).
	if l.jumps[0] != 0 {
		take(l.at, l.standing(0, fem.Left))
		take(l.at, l.standing(0, fem.Right))
	}
	lo, hi = cands[0], cands[0]
	for _, c := range cands[1:] {
		if fem.BeyondField(lo.Value, c.Value, scale) {
			lo = c
		}
		if fem.BeyondField(c.Value, hi.Value, scale) {
			hi = c
		}
	}
	return lo, hi
}

// Piece is one piece of an influence line: from From to To (m) its value
// per newton is Σ Coefficients[k]·ξᵏ, ξ = (s − From)/(To − From).
type Piece struct {
	From         float64    `json:"from"`
	To           float64    `json:"to"`
	Coefficients [4]float64 `json:"coefficients"`
}

// Pieces are the line's pieces in order; the line may jump between two.
func (l *Line) Pieces() []Piece {
	out := make([]Piece, l.pieces())
	for p := range out {
		a, b := l.bounds[p], l.bounds[p+1]
		h := (b - a) / l.length
		c := l.coef[p]
		out[p] = Piece{From: a, To: b, Coefficients: [4]float64{c[0], c[1] * h, c[2] * h * h, c[3] * h * h * h}}
	}
	return out
}
