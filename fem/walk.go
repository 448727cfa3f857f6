package fem

import (
	"iter"
	"math"
	"sort"
)

// Post-processing walks the elements once. Inside an element every field
// of the finite element solution is a polynomial of low degree (how low,
// its Formulation's Varies says), and inside a stretch between key points
// every field of the exact solution is one too (a quintic deflection at
// most). A walk hands each element to its consumers as an ElementView: both
// solutions on the element as polynomials in the element's own coordinate,
// so extremes come from the roots of derivatives and error norms from
// closed forms (the element errors are bubbles where the nodal values
// agree) or Gauss–Legendre rules exact for the degrees involved, with no
// sampling; bounds skip what cannot change a result. Consumers are
// Visitors (the summary's extremes, the error comparison, the checks'
// probes, the drawing's pixel columns and largest gaps) or range over
// Solution.Elements (the CSV rows).

// Interval is one interval of the member, an element or a stretch of the
// exact solution between key points, with every result quantity on it as a
// polynomial in the local coordinate ξ = (x − Start)/Length ∈ [0, 1]. The
// combined stress, the larger of two fibres, is not one polynomial: it is
// made from the axial and the bending stress wherever it is read.
type Interval struct {
	Start, Length float64 // m
	// end is where the interval ends, the key point or node itself: Start +
	// Length may miss it by a unit in the last place, and a position there
	// must name the point, not the far side of a jump at it.
	end float64
	// ends are the fields at ξ = 0 and ξ = 1 (End), worked out when first
	// asked for unless endsKnown.
	ends      [2]Fields
	endsKnown bool
	// oneFibre says the combined stress is one linear polynomial on the
	// interval (see oneFibre); false where it may not be.
	oneFibre bool
	poly     [polynomialQuantities]Polynomial
	degree   [polynomialQuantities]int
	// solution and element name the element of a finite element solution
	// the interval is, whose own interpolation At evaluates; nil for the
	// exact solution.
	solution *Solution
	element  int
	// closed reads the exact solution in closed form where it is no
	// polynomial (closedform.go).
	closed closedInterval
	// ranges are the results of Range, taken once per interval: known
	// holds a bit per quantity whose range is there.
	ranges [quantityCount][2]extremum
	known  uint16
}

// polynomialQuantities are the quantities that are polynomials inside an
// interval: QAxialDisplacement to QBendingStress.
const polynomialQuantities = int(QCombinedStress)

// Polynomial is quantity q on the interval as a polynomial in ξ, in SI
// units; false for the combined stress, which is not one.
func (v *Interval) Polynomial(q Quantity) (Polynomial, bool) {
	if q < 0 || int(q) >= polynomialQuantities || v.closed.stretch != nil {
		return Polynomial{}, false
	}
	return v.poly[q], true
}

// X is the position of local coordinate ξ, m.
func (v *Interval) X(xi float64) float64 {
	if xi == 1 {
		return v.end
	}
	return v.Start + xi*v.Length
}

// End is the fields at the start (i = 0) or the end (i = 1) of the
// interval, seen from inside it; for an element exactly as
// Solution.InElement gives them (the nodal displacements to the bit).
func (v *Interval) End(i int) *Fields {
	if !v.endsKnown {
		v.endsFromPolynomials()
		v.endsKnown = true
	}
	return &v.ends[i]
}

// At writes the fields at ξ to f: for an element of a finite element
// solution what Solution.InElement gives there, to the bit (its
// interpolation, which the polynomials equal to round-off), for the exact
// solution the polynomials' values.
func (v *Interval) At(xi float64, f *Fields) {
	switch {
	case xi == 0:
		*f = *v.End(0)
	case xi == 1:
		*f = *v.End(1)
	case v.solution != nil:
		v.solution.fieldsAt(v.element, xi, f)
	default:
		v.evaluate(xi, f)
	}
}

// evaluate writes the polynomials' values at ξ to f, or the closed form's.
func (v *Interval) evaluate(xi float64, f *Fields) {
	if v.closed.stretch != nil {
		v.closedAt(xi, f)
		return
	}
	at := func(q Quantity) float64 { return v.poly[q].at(v.degree[q], xi) }
	f.X = v.X(xi)
	f.AxialDisplacement, f.Deflection, f.Rotation = at(QAxialDisplacement), at(QDeflection), at(QRotation)
	f.AxialForce, f.ShearForce, f.BendingMoment = at(QAxialForce), at(QShearForce), at(QBendingMoment)
	f.AxialStress, f.BendingStress = at(QAxialStress), at(QBendingStress)
	f.CombinedStress = combinedStress(f.AxialStress, f.BendingStress)
}

// Range returns the smallest and the largest value of q on the interval and
// where they are, in closed form: the ends and the roots of the
// derivative. Where the combined stress jumps inside the interval (the
// axial stress changes sign under bending, so the other fibre becomes the
// larger) the value on the side where it is extreme counts. The start
// wins a tie with the end, and a turn inside is taken only where it goes
// beyond both by more than a tie (turn).
func (v *Interval) Range(q Quantity) (lo, hi Point) {
	if q < 0 || q >= quantityCount {
		return Point{X: v.Start}, Point{X: v.Start}
	}
	r := &v.ranges[q]
	if v.known&(1<<q) == 0 {
		v.rangeOf(q, r)
		v.known |= 1 << q
	}
	return Point{v.X(r[0].xi), r[0].value}, Point{v.X(r[1].xi), r[1].value}
}

// rangeOf works out Range of q into r.
func (v *Interval) rangeOf(q Quantity, r *[2]extremum) {
	switch {
	case v.closed.stretch != nil:
		r[0], r[1] = v.closedRange(q)
	case q == QCombinedStress && v.oneFibre:
		r[0], r[1] = endsRange(v.End(0).CombinedStress, v.End(1).CombinedStress)
	case q == QCombinedStress:
		r[0], r[1] = v.combinedRange()
	case v.degree[q] <= 1 || !turnsInside(&v.poly[q], v.degree[q]):
		// Monotone: the ends.
		r[0], r[1] = endsRange(q.Of(v.End(0)), q.Of(v.End(1)))
	default:
		r[0], r[1] = rangeOn(&v.poly[q], v.degree[q], q.Of(v.End(0)), q.Of(v.End(1)))
	}
}

// endsRange is the range of a quantity that does not turn inside an
// interval, a at its start and b at its end; the start wins a tie.
func endsRange(a, b float64) (lo, hi extremum) {
	lo, hi = extremum{0, a}, extremum{0, a}
	lo.least(1, b)
	hi.most(1, b)
	return lo, hi
}

// oneFibre reports whether the combined stress of linear axial and
// bending stresses a and b is one linear polynomial, the larger fibre the
// same throughout: pieces.splitLinearFibres would not cut.
func oneFibre(a, b *Polynomial) bool {
	a1, b1 := a[0]+a[1], b[0]+b[1]
	return (b[0] < 0) == (b1 < 0) && (a[0] < 0) == (a1 < 0) &&
		min(math.Abs(a[0]), math.Abs(a1)) > fibreTie*max(math.Abs(b[0]), math.Abs(b1))
}

// endsFromPolynomials sets the ends to the polynomials' values at ξ = 0 (their
// constant terms) and ξ = 1 (the sums of their coefficients).
func (v *Interval) endsFromPolynomials() {
	if v.closed.stretch != nil {
		v.closedAt(0, &v.ends[0])
		v.closedAt(1, &v.ends[1])
		return
	}
	var at0, at1 [polynomialQuantities]float64
	for q := range at0 {
		p := &v.poly[q]
		at0[q] = p[0]
		sum := p[v.degree[q]]
		for k := v.degree[q] - 1; k >= 0; k-- {
			sum += p[k]
		}
		at1[q] = sum
	}
	for i, at := range [2]*[polynomialQuantities]float64{&at0, &at1} {
		f := &v.ends[i]
		f.X = v.X(float64(i))
		f.AxialDisplacement, f.Deflection, f.Rotation = at[QAxialDisplacement], at[QDeflection], at[QRotation]
		f.AxialForce, f.ShearForce, f.BendingMoment = at[QAxialForce], at[QShearForce], at[QBendingMoment]
		f.AxialStress, f.BendingStress = at[QAxialStress], at[QBendingStress]
		f.CombinedStress = combinedStress(f.AxialStress, f.BendingStress)
	}
}

// RangeOf returns the smallest and the largest value on the interval of p,
// a polynomial in its ξ (a field less a line, say), with where they are, in
// closed form as Range.
func (v *Interval) RangeOf(p *Polynomial) (lo, hi Point) {
	d := p.Degree()
	l, h := rangeOn(p, d, p[0], p.at(d, 1))
	return Point{v.X(l.xi), l.value}, Point{v.X(h.xi), h.value}
}

// pieces cut an interval where the larger fibre of the combined stress may
// change (splitFibres): on each piece the combined stress is σa + sign·σb
// with one sign, one polynomial.
type pieces struct {
	breaks [4*(polynomialTerms-1) + 2]float64 // 0, the cuts in order, 1
	n      int                                // pieces: breaks[0] to breaks[n]
}

// reset leaves the whole interval as one piece.
func (ps *pieces) reset() {
	ps.breaks[0], ps.breaks[1], ps.n = 0, 1, 1
}

// split cuts the pieces where p, of degree d, changes sign.
func (ps *pieces) split(p *Polynomial, d int) {
	if !mayVanish(p, d) {
		return
	}
	var r [polynomialTerms - 1]float64
	for _, x := range r[:p.roots(&r)] {
		ps.cut(x)
	}
}

// mayVanish reports whether p, of degree d, may change sign in [0, 1]: not
// when its constant term outweighs all the others together, nor when it is
// zero everywhere.
func mayVanish(p *Polynomial, d int) bool {
	rest := 0.0
	for k := 1; k <= d; k++ {
		rest += math.Abs(p[k])
	}
	return math.Abs(p[0]) <= rest && rest != 0
}

// piece is the combined stress σa + sign·σb on piece i, the fibre chosen
// as combinedStress chooses it in the middle of the piece; the pieces must
// be cut where that choice can change (splitFibres).
func (ps *pieces) piece(i int, a, b *Polynomial) Polynomial {
	mid := (ps.breaks[i] + ps.breaks[i+1]) / 2
	return combine(1, a, fibreSign(a.At(mid), b.At(mid)), b)
}

// splitFibres cuts the pieces where combinedStress changes fibre for σa = a
// and σb = b, of degree d at most: where σb changes sign, and where |σa|
// crosses fibreTie·|σb|, the zeros of a ∓ fibreTie·b.
func (ps *pieces) splitFibres(a, b *Polynomial, d int) {
	if d <= 1 {
		ps.splitLinearFibres(a, b)
		return
	}
	ps.split(b, d)
	for _, t := range []float64{fibreTie, -fibreTie} {
		g := combine(1, a, -t, b)
		ps.split(&g, d)
	}
}

// splitLinearFibres is splitFibres for linear a and b, in closed form.
func (ps *pieces) splitLinearFibres(a, b *Polynomial) {
	a1, b1 := a[0]+a[1], b[0]+b[1] // at ξ = 1
	if (b[0] < 0) != (b1 < 0) {
		ps.cutLine(b[0], b[1])
	}
	// |σa| crosses fibreTie·|σb| only where σa is about zero.
	if (a[0] < 0) == (a1 < 0) && min(math.Abs(a[0]), math.Abs(a1)) > fibreTie*max(math.Abs(b[0]), math.Abs(b1)) {
		return
	}
	for _, t := range [2]float64{fibreTie, -fibreTie} {
		ps.cutLine(a[0]-t*b[0], a[1]-t*b[1])
	}
}

// cutLine cuts the pieces where c0 + c1·ξ vanishes inside (0, 1).
func (ps *pieces) cutLine(c0, c1 float64) {
	if x := -c0 / c1; x > 0 && x < 1 {
		ps.cut(x)
	}
}

// cut cuts the piece holding x, inside (0, 1), at x.
func (ps *pieces) cut(x float64) {
	i := ps.n
	for ps.breaks[i-1] > x {
		i--
	}
	if ps.breaks[i-1] == x {
		return
	}
	copy(ps.breaks[i+1:ps.n+2], ps.breaks[i:ps.n+1])
	ps.breaks[i] = x
	ps.n++
}

// combine is sa·a + sb·b.
func combine(sa float64, a *Polynomial, sb float64, b *Polynomial) Polynomial {
	var g Polynomial
	for k := range g {
		g[k] = sa*a[k] + sb*b[k]
	}
	return g
}

// combinedRange is Range of the combined stress, in ξ.
func (v *Interval) combinedRange() (lo, hi extremum) {
	a, b := &v.poly[QAxialStress], &v.poly[QBendingStress]
	d := max(v.degree[QAxialStress], v.degree[QBendingStress])
	start, end := v.End(0).CombinedStress, v.End(1).CombinedStress
	lo, hi = extremum{0, start}, extremum{0, start}
	take := func(xi, value float64) {
		lo.least(xi, value)
		hi.most(xi, value)
	}
	if d <= 1 {
		// Linear stresses: the combined stress is linear between the places
		// where the fibre may change, and either fibre's value there is a
		// limit.
		var ps pieces
		ps.reset()
		ps.splitLinearFibres(a, b)
		for _, xi := range ps.breaks[1:ps.n] {
			av, bv := a[0]+a[1]*xi, b[0]+b[1]*xi
			take(xi, av+bv)
			take(xi, av-bv)
		}
		take(1, end)
		return lo, hi
	}
	var f pieces
	f.reset()
	f.splitFibres(a, b, d)
	for i := 0; i < f.n; i++ {
		x0, x1 := f.breaks[i], f.breaks[i+1]
		g := f.piece(i, a, b)
		// The limits at the piece's ends: at a cut the stress may jump
		// between fibres, at the interval's ends it may where a cut falls
		// on them.
		take(x0, g.at(d, x0))
		if d >= 2 {
			dg := g.Derivative()
			var r [polynomialTerms - 1]float64
			for _, xi := range r[:dg.roots(&r)] {
				if within(xi, x0, x1) {
					take(xi, g.at(d, xi))
				}
			}
		}
		take(x1, g.at(d, x1))
	}
	take(1, end)
	return lo, hi
}

// FibreRange returns the least and the greatest stress of either extreme
// fibre on the interval, with where they are: the greatest compression
// σa − |σb| and the greatest tension σa + |σb|, whichever fibre is the
// larger in magnitude. Range of the combined stress follows the larger
// fibre alone, as the field is drawn, and hides the tension fibre under
// compression and bending (and the compression fibre under tension). Each
// fibre's stress, σa + σb at the bottom and σa − σb at the top, is one
// polynomial, read in closed form as Range reads one; the first place met
// along the interval wins a tie.
func (v *Interval) FibreRange() (lo, hi Point) {
	var l, h [2]extremum
	for i, sign := range [2]float64{1, -1} {
		l[i], h[i] = v.fibreRange(sign)
	}
	if l[1].value < l[0].value || l[1].value == l[0].value && l[1].xi < l[0].xi {
		l[0] = l[1]
	}
	if h[1].value > h[0].value || h[1].value == h[0].value && h[1].xi < h[0].xi {
		h[0] = h[1]
	}
	return Point{v.X(l[0].xi), l[0].value}, Point{v.X(h[0].xi), h[0].value}
}

// fibreRange is the range of σa + sign·σb on the interval, in ξ.
func (v *Interval) fibreRange(sign float64) (lo, hi extremum) {
	of := func(f *Fields) float64 { return f.AxialStress + sign*f.BendingStress }
	if v.closed.stretch != nil {
		return v.closedRangeOf(of)
	}
	d := max(v.degree[QAxialStress], v.degree[QBendingStress])
	a, b := of(v.End(0)), of(v.End(1))
	if d <= 1 { // linear: the ends (a finite element's stresses)
		return endsRange(a, b)
	}
	p := combine(1, &v.poly[QAxialStress], sign, &v.poly[QBendingStress])
	if !turnsInside(&p, d) {
		return endsRange(a, b)
	}
	return rangeOn(&p, d, a, b)
}

// ElementView is one element of a walk: where it is in the mesh, and the
// finite element solution on it with, when the walk has one, the exact
// solution of the same model. A walk reuses one view for every element:
// copy what you keep.
type ElementView struct {
	Index int // in Mesh.Elements
	Element
	FE Interval
	// Exact is the exact solution on the element when HasExact.
	Exact    Interval
	HasExact bool
	// exactSize is the sums of the magnitudes of the coefficients of u and
	// w of the exact stretch holding the element (m): the scale of their
	// round-off.
	exactSize [2]float64
}

// walker fills the view of each element in turn.
type walker struct {
	s     *Solution
	exact *Exact
	on    exactCursor
	view  ElementView
}

// exactCursor reads an exact solution element by element, along the
// member: it keeps the stretch of the last element.
type exactCursor struct {
	exact   *Exact
	stretch int
}

// interval sets v to the exact solution on the element from start to end
// (m): the polynomials of the stretch holding it, re-expressed on the
// element. Elements never cross a key point, so one stretch holds each; it
// returns that stretch and whether it differs from the last element's.
func (c *exactCursor) interval(start, end float64, v *Interval) (*exactStretch, bool) {
	st := c.exact.stretches
	mid := start + (end-start)/2
	moved := false
	if c.stretch+1 < len(st) && st[c.stretch+1].start <= mid {
		c.stretch = sort.Search(len(st), func(j int) bool { return st[j].start > mid }) - 1
		moved = true
	}
	s := &st[c.stretch]
	t0 := (start - s.start) / s.length
	if start-s.start <= mergeTolerance*c.exact.keys[len(c.exact.keys)-1] {
		t0 = 0
	}
	s.interval(t0, (end-start)/s.length, start, end, v)
	return s, moved
}

func newWalker(s *Solution, e *Exact) *walker {
	w := &walker{s: s}
	if e != nil && len(e.stretches) > 0 {
		w.exact, w.on.exact = e, e
		w.view.HasExact = true
		w.view.Exact.degree = exactDegrees
		w.view.exactSize = e.stretches[0].sizes()
	}
	w.view.FE.degree = s.degrees()
	return w
}

// element is the view of element i; i must not decrease between calls.
func (w *walker) element(i int) *ElementView {
	v := &w.view
	v.Index, v.Element = i, w.s.Mesh.Elements[i]
	w.s.elementInterval(i, &v.FE)
	if w.exact != nil {
		w.exactOn(v)
	}
	return v
}

// exactOn sets v.Exact to the exact solution on v's element.
func (w *walker) exactOn(v *ElementView) {
	if s, moved := w.on.interval(v.Start, v.End, &v.Exact); moved {
		v.exactSize = s.sizes()
	}
}

// sizes are the sums of the magnitudes of the stretch's coefficients of u
// and w, m: the scale of round-off in their values (ElementView.exactSize).
func (s *exactStretch) sizes() [2]float64 {
	var out [2]float64
	for i, c := range [2][]float64{s.bar.coeff, s.beam.coeff} {
		for _, v := range c {
			out[i] += math.Abs(v)
		}
	}
	return out
}

// exactDegrees are the degrees of the exact fields on a stretch under a
// linearly varying load: u cubic (EA·u″ = −p), w quintic (EI·w⁗ = q) and
// their derivatives.
var exactDegrees = [polynomialQuantities]int{
	QAxialDisplacement: 3, QDeflection: 5, QRotation: 4, QAxialForce: 2,
	QShearForce: 2, QBendingMoment: 3, QAxialStress: 2, QBendingStress: 3,
}

// interval sets v to the exact fields on t ∈ [t0, t0 + scale] of the
// stretch, an interval from start to end (m): u and w
// shifted to t0 (repeated synthetic division, Knuth, TAOCP vol. 2, 4.6.4,
// from memory) and scaled to the interval, the rest their derivatives.
// The coefficients are written one by one: a walk calls this for every
// element.
func (s *exactStretch) interval(t0, scale, start, end float64, v *Interval) {
	if !s.polynomial() {
		v.setClosed(s, t0, scale, start, end)
		return
	}
	v.closed.stretch = nil
	p := &v.poly
	u, w := &p[QAxialDisplacement], &p[QDeflection]
	c, d := s.bar.coeff[:4:4], s.beam.coeff[:6:6]
	u[0], u[1], u[2], u[3] = c[0], c[1], c[2], c[3]
	w[0], w[1], w[2], w[3], w[4], w[5] = d[0], d[1], d[2], d[3], d[4], d[5]
	cubicTaylorShift(u, t0, scale)
	taylorShift(w, t0, scale)
	h := end - start
	ih := 1 / h
	ea, ei := s.bar.stiffness*ih, s.beam.stiffness*ih*ih
	ia, ci := 1/s.area, s.fibre/s.secondMoment
	r := &p[QRotation]
	r[0], r[1], r[2], r[3], r[4] = w[1]*ih, 2*w[2]*ih, 3*w[3]*ih, 4*w[4]*ih, 5*w[5]*ih
	n := &p[QAxialForce]
	n[0], n[1], n[2] = ea*u[1]+s.bar.offset, 2*ea*u[2], 3*ea*u[3]
	vs := &p[QShearForce]
	vs[0], vs[1], vs[2] = 6*ei*ih*w[3], 24*ei*ih*w[4], 60*ei*ih*w[5]
	m := &p[QBendingMoment]
	m[0], m[1], m[2], m[3] = 2*ei*w[2]+s.beam.offset, 6*ei*w[3], 12*ei*w[4], 20*ei*w[5]
	if g := s.shear; g != 0 {
		// Shear deformation (exactStretch.shearTerms): θ gains g·w‴ and a
		// constant, M gains g·q (linear in ξ), V gains g·q′.
		rot, m0, v := s.shearTerms(t0)
		_, m1, _ := s.shearTerms(t0 + scale)
		third := g * ih * ih * ih
		r[0] += third*6*w[3] + rot
		r[1] += third * 24 * w[4]
		r[2] += third * 60 * w[5]
		m[0] += m0
		m[1] += m1 - m0
		vs[0] += v
	}
	sa, sb := &p[QAxialStress], &p[QBendingStress]
	sa[0], sa[1], sa[2] = n[0]*ia, n[1]*ia, n[2]*ia
	sb[0], sb[1], sb[2], sb[3] = m[0]*ci, m[1]*ci, m[2]*ci, m[3]*ci
	v.Start, v.Length, v.end = start, end-start, end
	v.degree = exactDegrees
	v.known, v.endsKnown, v.oneFibre = 0, false, false
}

// taylorShift turns p(t) into q(ξ) = p(t0 + scale·ξ). The steps are
// written out, which the compiler turns into straight code.
func taylorShift(p *Polynomial, t0, scale float64) {
	p[4] += t0 * p[5]
	p[3] += t0 * p[4]
	p[2] += t0 * p[3]
	p[1] += t0 * p[2]
	p[0] += t0 * p[1]
	p[4] += t0 * p[5]
	p[3] += t0 * p[4]
	p[2] += t0 * p[3]
	p[1] += t0 * p[2]
	p[4] += t0 * p[5]
	p[3] += t0 * p[4]
	p[2] += t0 * p[3]
	p[4] += t0 * p[5]
	p[3] += t0 * p[4]
	p[4] += t0 * p[5]
	s2 := scale * scale
	s4 := s2 * s2
	p[1], p[2], p[3], p[4], p[5] = p[1]*scale, p[2]*s2, p[3]*s2*scale, p[4]*s4, p[5]*s4*scale
}

// cubicTaylorShift is taylorShift for p of degree 3 at most, whose other
// steps add zeros: the same result to the bit.
func cubicTaylorShift(p *Polynomial, t0, scale float64) {
	p[2] += t0 * p[3]
	p[1] += t0 * p[2]
	p[0] += t0 * p[1]
	p[2] += t0 * p[3]
	p[1] += t0 * p[2]
	p[2] += t0 * p[3]
	s2 := scale * scale
	p[1], p[2], p[3] = p[1]*scale, p[2]*s2, p[3]*s2*scale
}

// EachInterval yields the exact solution stretch by stretch, between
// neighbouring key points, in order along the member, with each stretch's
// index: on each every field is one polynomial or one closed form, so
// checks of the exact solution alone take their extremes stretch by
// stretch. It yields one Interval, reused for each stretch: copy what you
// keep. (A slice of them all, as Intervals returned before, was about a
// kilobyte a stretch, made three times per drag step on a beam of 1,000
// loads.) The intervals' ranges (Range) are the exact solution's own,
// worked out for every quantity the first time it is asked: the summary,
// the comparison, the checks and the drawing each took them anew before.
func (e *Exact) EachInterval() iter.Seq2[int, *Interval] {
	return func(yield func(int, *Interval) bool) {
		if e == nil {
			return
		}
		ranges := e.stretchRanges()
		var v Interval
		for j := range e.stretches {
			e.stretchInterval(j, ranges, &v)
			if !yield(j, &v) {
				return
			}
		}
	}
}

// stretchInterval sets v to stretch j of e with its ranges.
func (e *Exact) stretchInterval(j int, ranges [][quantityCount][2]extremum, v *Interval) {
	s := &e.stretches[j]
	s.interval(0, 1, s.start, s.end, v)
	v.ranges, v.known = ranges[j], allRanges
}

// allRanges has the bit of every quantity in Interval.known.
const allRanges = 1<<quantityCount - 1

// stretchRanges are the ranges of every quantity on each stretch
// (Exact.ranges), worked out the first time they are asked for.
func (e *Exact) stretchRanges() [][quantityCount][2]extremum {
	e.rangesOnce.Do(func() {
		e.ranges = make([][quantityCount][2]extremum, len(e.stretches))
		inHalves(len(e.stretches), func(from, to int) {
			v := memoInterval()
			for j := from; j < to; j++ {
				s := &e.stretches[j]
				s.interval(0, 1, s.start, s.end, v)
				for q := range Quantity(quantityCount) {
					v.rangeOf(q, &e.ranges[j][q])
				}
			}
		})
	})
	return e.ranges
}

// memoInterval is an interval that keeps its closed-form readings
// (closedRead): for one goroutine's own use, never to be copied.
func memoInterval() *Interval {
	v := new(Interval)
	v.closed.memo = make(map[float64]Fields)
	return v
}

// parallelStretches is the number of stretches from which the exact
// solution's ranges are worked out in two halves at once: a stretch on a
// foundation takes tens of microseconds or more (a few hundred closed-form
// readings), far more than a goroutine costs.
const parallelStretches = 512

// inHalves runs work on the stretches from ≤ j < to, for every j < n: from
// parallelStretches on, the second half on a second goroutine. Each
// stretch's work stands alone, so the answer is the same to the bit on any
// number of cores.
func inHalves(n int, work func(from, to int)) {
	if n < parallelStretches {
		work(0, n)
		return
	}
	done := make(chan struct{})
	go func() {
		work(n/2, n)
		close(done)
	}()
	work(0, n/2)
	<-done
}

// Elements returns the elements from ≤ i < to of s, in order along the
// member, each as a view with the exact solution e on it (none when e is
// nil). The view is reused: copy what you keep.
func (s *Solution) Elements(e *Exact, from, to int) iter.Seq[*ElementView] {
	return func(yield func(*ElementView) bool) {
		if s == nil {
			return
		}
		from, to = max(from, 0), min(to, len(s.fields))
		w := newWalker(s, e)
		for i := from; i < to; i++ {
			if !yield(w.element(i)) {
				return
			}
		}
	}
}

// Visitor gathers something from the elements of a walk (extremes, error
// norms, the checks' peaks), which it is shown in order along the member.
// Walk may show a later part of the member to a fresh visitor from Fork on
// another goroutine and then Join it: after Join a visitor must hold what
// it would hold had it seen the later elements itself, ties going to the
// earlier element as in one pass.
type Visitor interface {
	Visit(v *ElementView)
	Fork() Visitor
	Join(later Visitor)
}

// parallelWalk is the number of elements from which Walk takes two halves
// at once: below it a goroutine costs more than it saves.
const parallelWalk = 4096

// Walk shows every element of s, in order, to every visitor, with the exact
// solution e on it when e is not nil: one walk feeds them all. From
// parallelWalk elements on, the second half of the member goes to forks of
// the visitors on a second goroutine; the halves depend on the mesh alone,
// so the answer is the same on any number of cores.
func Walk(s *Solution, e *Exact, vs ...Visitor) {
	if s == nil {
		return
	}
	WalkElements(s, e, 0, len(s.fields), vs...)
}

// WalkElements is Walk over the elements from ≤ i < to alone (a drawing's
// visible ones): from parallelWalk of them on, the second half of them goes
// to forks of the visitors.
func WalkElements(s *Solution, e *Exact, from, to int, vs ...Visitor) {
	if s == nil || len(vs) == 0 {
		return
	}
	from, to = max(from, 0), min(to, len(s.fields))
	visit := func(from, to int, vs []Visitor) {
		for v := range s.Elements(e, from, to) {
			for _, c := range vs {
				c.Visit(v)
			}
		}
	}
	if to-from < parallelWalk {
		visit(from, to, vs)
		return
	}
	mid := from + (to-from)/2
	later := make([]Visitor, len(vs))
	for i, v := range vs {
		later[i] = v.Fork()
	}
	done := make(chan struct{})
	go func() {
		visit(mid, to, later)
		close(done)
	}()
	visit(from, mid, vs)
	<-done
	for i, v := range vs {
		v.Join(later[i])
	}
}
