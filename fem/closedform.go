package fem

import "math"

// Exact intervals that are no polynomials. On a foundation the exact
// fields are exponential–trigonometric (groundBasis), so an Interval of
// the exact solution there keeps its stretch and reads the fields in
// closed form wherever they are asked for. Its extremes are found by
// sampling, at least sixteen samples per unit of the stretch's λ over the
// interval (a wave of the solution is 2π/λ long: about a hundred samples a
// wave), each sampled turn refined by golden-section search; its integrals
// by Gauss–Legendre panels, one per half unit of λ. Polynomial reports
// false for such an interval.

// polynomial reports whether the exact fields on the stretch are
// polynomials.
func (s *exactStretch) polynomial() bool { return s.bar.polynomial() && s.beam.polynomial() }

// waves is how fast the stretch's fields can change: the larger of its
// bases' scales (λ, μ), 0 for a polynomial stretch.
func (s *exactStretch) waves() float64 { return max(s.bar.ground.scale, s.beam.ground.scale) }

// fields writes the exact fields at t ∈ [0, 1] of the stretch to f.
func (s *exactStretch) fields(t float64, f *Fields) {
	h := s.length
	var u, w [4]float64
	s.bar.derivatives(t, 1, &u)
	s.beam.derivatives(t, 3, &w)
	*f = Fields{
		X:                 s.start + t*h,
		AxialDisplacement: u[0],
		Deflection:        w[0],
		Rotation:          w[1] / h,
		AxialForce:        s.bar.stiffness*u[1]/h + s.bar.offset,
		ShearForce:        s.beam.stiffness * w[3] / (h * h * h),
		BendingMoment:     s.beam.stiffness*w[2]/(h*h) + s.beam.offset,
	}
	if s.shear != 0 {
		rot, m, v := s.shearTerms(t)
		f.Rotation += s.shear*w[3]/(h*h*h) + rot
		f.BendingMoment += m
		f.ShearForce += v
	}
	f.AxialStress = f.AxialForce / s.area
	f.BendingStress = f.BendingMoment * s.fibre / s.secondMoment
	f.CombinedStress = combinedStress(f.AxialStress, f.BendingStress)
}

// closedInterval is the part of an exact interval that reads a stretch in
// closed form.
type closedInterval struct {
	stretch  *exactStretch // nil for a polynomial interval
	t0, span float64       // ξ ∈ [0, 1] is t = t0 + span·ξ of the stretch
	samples  []Fields      // the fields at ξ = i/n, i = 0…n, once taken
	// memo holds the fields read at each ξ since the interval was set,
	// where it has one (memoInterval's alone: an interval that is copied
	// must not share it).
	memo map[float64]Fields
}

// setClosed makes v the exact fields on t ∈ [t0, t0 + span] of stretch s,
// an interval from start to end (m), read in closed form.
func (v *Interval) setClosed(s *exactStretch, t0, span, start, end float64) {
	v.Start, v.Length, v.end = start, end-start, end
	v.closed.stretch, v.closed.t0, v.closed.span = s, t0, span
	v.closed.samples = v.closed.samples[:0]
	clear(v.closed.memo)
	for q := range v.degree {
		v.degree[q] = -1
	}
	v.known, v.endsKnown, v.oneFibre = 0, false, false
}

// closedAt writes the fields at ξ of a closed-form interval to f.
func (v *Interval) closedAt(xi float64, f *Fields) {
	c := &v.closed
	c.stretch.fields(c.t0+c.span*xi, f)
	f.X = v.X(xi)
}

// closedRead is closedAt through the interval's memo, where it has one:
// the golden-section searches of every quantity's range near an end of
// the interval (endTurns) mostly close in on that end by the same points,
// so that the quantities share most readings (on a stretch short against
// its λ, nearly all: a beam on a foundation under 4,000 point loads read
// the closed form about a thousand times a stretch).
func (v *Interval) closedRead(xi float64, f *Fields) {
	memo := v.closed.memo
	if memo == nil {
		v.closedAt(xi, f)
		return
	}
	if g, ok := memo[xi]; ok {
		*f = g
		return
	}
	v.closedAt(xi, f)
	memo[xi] = *f
}

// closedPieces is how many pieces a closed-form interval is sampled in: at
// least eight, and sixteen per unit of λ over it (closedUnits).
func (v *Interval) closedPieces() int {
	return 8 + int(math.Ceil(16*v.closedUnits()))
}

// closedUnits are the units of λ over a closed-form interval, capped for a
// stretch of extreme λ, where the fields decay to nothing within a sliver
// of it anyway: the intervals of a stretch share at most 10⁵ units beyond
// sixteen each, so that a fine mesh is not sampled 10⁵ units an element
// (3e11 samples for 200,000 elements on a bed of 1e60 N/m²).
//
// Where even so every sample and Gauss node inside the interval lies
// deadUnits of a basis's decay or more from both ends of the stretch,
// that basis's functions are below e^(−deadUnits) of their size there
// (they decay from the stretch's ends: groundBasis), so the samples read
// its particular solution alone, a polynomial, and the interval's ends:
// eight samples and one panel read the same (the basis then adds no
// units). Only a bed far stiffer than any ground comes to this, λ above
// about 4e8 over the stretch (a 10 m member with EI = 5e7 N·m² on
// 4e38 N/m²): 200,000 elements sampled 264 times each and a stretch's
// 1.6 million samples took `stave solve` 12 s on a bed of 1e149 N/m².
func (v *Interval) closedUnits() float64 {
	c := &v.closed
	capped := min(c.span*c.stretch.waves(), 16+1e5*c.span)
	// The samples' and the Gauss nodes' nearest approach to the
	// interval's ends at that many units, as a share of it (the outer
	// nodes of a panel, symmetric, lie min(ξ, 1 − ξ) from its ends).
	node := min(gauss6[0].xi, 1-gauss6[0].xi)
	near := min(1/float64(8+int(math.Ceil(16*capped))), node/float64(1+int(math.Ceil(2*capped))))
	from0, from1 := c.t0+c.span*near, 1-(c.t0+c.span)+c.span*near
	units := 0.0
	for _, g := range []*groundBasis{&c.stretch.bar.ground, &c.stretch.beam.ground} {
		if g.order == 0 || g.scale > groundSeriesLimit && g.scale*min(from0, from1) >= deadUnits {
			continue
		}
		units = max(units, c.span*g.scale)
	}
	return min(units, capped)
}

// deadUnits are the units of λ beyond which a decaying basis function is
// taken as gone: e^(−64) ≈ 1.6e-28 of its size.
const deadUnits = 64

// closedSamples are the fields at the ends of the pieces, taken once.
func (v *Interval) closedSamples() []Fields {
	c := &v.closed
	if len(c.samples) == 0 {
		n := v.closedPieces()
		if cap(c.samples) < n+1 {
			c.samples = make([]Fields, n+1)
		}
		c.samples = c.samples[:n+1]
		for i := range c.samples {
			v.closedAt(float64(i)/float64(n), &c.samples[i])
		}
	}
	return c.samples
}

// closedRange is Range for a closed-form interval: the extremes of the
// samples, each sampled turn inside refined on its two pieces.
func (v *Interval) closedRange(q Quantity) (lo, hi extremum) {
	return v.closedRangeOf(q.Of)
}

// closedRangeOf is closedRange of the value of returns from the fields.
func (v *Interval) closedRangeOf(of func(*Fields) float64) (lo, hi extremum) {
	s := v.closedSamples()
	var f Fields // one for every reading: of may keep no pointer to it
	at := func(xi float64) float64 {
		v.closedRead(xi, &f)
		return of(&f)
	}
	return sampledRange(len(s)-1, func(i int) float64 { return of(&s[i]) }, at, exactSteps)
}

// Steps of refinement of a sampled turn: exactSteps of golden-section
// search narrow it to a part in 10⁸ of its two pieces, where the value is
// right to round-off, for the exact solution's extremes; errorSteps of
// parabolic interpolation (parabolicTurn) serve the largest errors, which
// are read to a few digits.
const (
	exactSteps = 40
	errorSteps = 2
)

// sampledRange finds the extremes of g on [0, 1] from its values sample(i)
// at i/n, i = 0…n: the ends, and every sample that is a turn of the
// samples, refined by steps of golden-section search between its
// neighbours. An end sample that is no less (for the largest value) or no
// more (for the smallest) than its neighbour may hide a turn inside its
// piece, just short of the end: that piece is searched too (endTurns). The
// first place along the interval wins a tie.
func sampledRange(n int, sample func(i int) float64, g func(xi float64) float64, steps int) (lo, hi extremum) {
	first := sample(0)
	lo, hi = extremum{0, first}, extremum{0, first}
	prev, here := first, sample(1)
	for i := 1; i < n; i++ {
		next := sample(i + 1)
		a, b := float64(i-1)/float64(n), float64(i+1)/float64(n)
		refine := func(sign float64) (float64, float64) {
			if steps == errorSteps {
				return parabolicTurn(g, a, b, prev, here, next, steps)
			}
			return goldenSection(g, a, b, sign, steps)
		}
		if here >= prev && here >= next && (here > prev || here > next) {
			if x, y := refine(1); y > here {
				hi.most(x, y)
			} else {
				hi.most(float64(i)/float64(n), here)
			}
		}
		if here <= prev && here <= next && (here < prev || here < next) {
			if x, y := refine(-1); y < here {
				lo.least(x, y)
			} else {
				lo.least(float64(i)/float64(n), here)
			}
		}
		prev, here = here, next
	}
	lo.least(1, here)
	hi.most(1, here)
	endTurns(g, 0, 1/float64(n), first, sample(1), steps, &lo, &hi)
	endTurns(g, 1, float64(n-1)/float64(n), here, prev, steps, &lo, &hi)
	return lo, hi
}

// endTurns searches the piece of g between the end of an interval at e
// (value ge) and the neighbouring sample at a (value ga) for a turn that
// the samples cannot show: where the end is no less than its neighbour
// the largest value may lie inside the piece, and where it is no more the
// smallest. Golden-section search over the piece finds such a turn, or
// closes in on the end where there is none, whose own value then stands.
func endTurns(g func(float64) float64, e, a, ge, ga float64, steps int, lo, hi *extremum) {
	l, r := min(a, e), max(a, e)
	if ge >= ga {
		if x, y := goldenSection(g, l, r, 1, steps); y > ge {
			hi.most(x, y)
		}
	}
	if ge <= ga {
		if x, y := goldenSection(g, l, r, -1, steps); y < ge {
			lo.least(x, y)
		}
	}
}

// goldenSection finds the largest value of sign·g on [a, b] of a function
// with one turn there, each step narrowing the bracket by 0.618 (Kiefer's
// search, Press et al., Numerical Recipes, 10.2, from memory): near a turn
// the value's error goes as the square of the bracket. It returns the place
// and g there.
func goldenSection(g func(float64) float64, a, b, sign float64, steps int) (float64, float64) {
	const r = 0.6180339887498949 // (√5 − 1)/2
	c, d := b-r*(b-a), a+r*(b-a)
	gc, gd := sign*g(c), sign*g(d)
	for range steps {
		if gc >= gd {
			b, d, gd = d, c, gc
			c = b - r*(b-a)
			gc = sign * g(c)
		} else {
			a, c, gc = c, d, gd
			d = a + r*(b-a)
			gd = sign * g(d)
		}
	}
	if gc >= gd {
		return c, sign * gc
	}
	return d, sign * gd
}

// parabolicTurn refines a turn of g sampled at a, the middle of [a, b]
// and b (values ga, gm, gb) by steps of parabolic interpolation, each
// evaluating g once at the vertex of the parabola through the three best
// points so far (Press et al., Numerical Recipes, 10.3, from memory): for
// a smooth g the vertex's value is within a part in 10⁶ or so of the turn's
// after two steps. It returns the place and g there.
func parabolicTurn(g func(float64) float64, a, b, ga, gm, gb float64, steps int) (float64, float64) {
	x := [3]float64{a, (a + b) / 2, b}
	y := [3]float64{ga, gm, gb}
	for range steps {
		d1, d2 := (y[1]-y[0])/(x[1]-x[0]), (y[2]-y[1])/(x[2]-x[1])
		curve := (d2 - d1) / (x[2] - x[0])
		if curve == 0 {
			break
		}
		v := (x[0]+x[1])/2 - d1/(2*curve)
		if !(v > x[0] && v < x[2]) || v == x[1] {
			break
		}
		gv := g(v)
		better := (gv-y[1])*curve < 0 // nearer the turn than the middle
		switch {
		case better && v < x[1]:
			x, y = [3]float64{x[0], v, x[1]}, [3]float64{y[0], gv, y[1]}
		case better:
			x, y = [3]float64{x[1], v, x[2]}, [3]float64{y[1], gv, y[2]}
		case v < x[1]:
			x[0], y[0] = v, gv
		default:
			x[2], y[2] = v, gv
		}
	}
	return x[1], y[1]
}

// closedIntegral is ∫ g over [0, 1] by the 6-point Gauss–Legendre rule on
// panels equal pieces.
func closedIntegral(panels int, g func(xi float64) float64) float64 {
	sum := 0.0
	w := 1 / float64(panels)
	for p := range panels {
		for _, q := range gauss6 {
			sum += q.w * w * g((float64(p)+q.xi)*w)
		}
	}
	return sum
}

// closedPanels is how many Gauss panels integrate a closed-form interval:
// one per half unit of λ over it; the rule's error then falls below
// round-off for the exponential–trigonometric fields.
func (v *Interval) closedPanels() int {
	return 1 + int(math.Ceil(2*v.closedUnits()))
}

// visitClosed is Comparison.Visit where the exact solution on the element
// is in closed form: the largest errors of u, w and the combined stress
// (on the fibre the finite element solution takes) by sampling both, the
// integrals by Gauss panels. Only a stretch on a foundation is read so, and
// a foundation is refused under a segment with shear deformation, so the
// energy here has no shear term.
func (c *Comparison) visitClosed(v *ElementView) {
	fe, ex := &v.FE, &v.Exact
	n := ex.closedPieces()
	type diff struct{ u, w, stress, n, m float64 }
	at := func(xi float64) diff {
		var a, b Fields
		fe.At(xi, &a)
		ex.closedAt(xi, &b)
		sign := fibreSign(a.AxialStress, a.BendingStress)
		return diff{a.AxialDisplacement - b.AxialDisplacement, a.Deflection - b.Deflection,
			(a.AxialStress - b.AxialStress) + sign*(a.BendingStress-b.BendingStress),
			a.AxialForce - b.AxialForce, a.BendingMoment - b.BendingMoment}
	}
	samples := make([]diff, n+1)
	for i := range samples {
		samples[i] = at(float64(i) / float64(n))
	}
	m := &c.maxima
	// largest is the largest |of| on the element, searched for between the
	// samples only where it could beat best: between samples an error
	// rises above its sampled neighbours by a small part of itself.
	largest := func(of func(d diff) float64, best float64) extremum {
		peak := extremum{value: -1}
		for i := range samples {
			if a := math.Abs(of(samples[i])); a > peak.value {
				peak = extremum{float64(i) / float64(n), a}
			}
		}
		if 1.25*peak.value <= best {
			return peak
		}
		lo, hi := sampledRange(n, func(i int) float64 { return of(samples[i]) }, func(xi float64) float64 { return of(at(xi)) }, errorSteps)
		if -lo.value > hi.value {
			return extremum{lo.xi, -lo.value}
		}
		return hi
	}
	m.axial = max(m.axial, largest(func(d diff) float64 { return d.u }, m.axial).value)
	m.deflection = max(m.deflection, largest(func(d diff) float64 { return d.w }, m.deflection).value)
	if e := largest(func(d diff) float64 { return d.stress }, m.stress); e.value > m.stress {
		m.stress, m.stressAt = e.value, fe.X(e.xi)
	}
	h := fe.Length
	sec := &c.solution.sections[v.Segment]
	iea, iei := 1/sec.axialRigidity, 1/sec.flexuralRigidity
	var disp, energy float64
	panels := ex.closedPanels()
	w := 1 / float64(panels)
	for p := range panels {
		for _, q := range gauss6 {
			d := at((float64(p) + q.xi) * w)
			disp += q.w * w * (d.u*d.u + d.w*d.w)
			energy += q.w * w * (d.n*d.n*iea + d.m*d.m*iei)
		}
	}
	c.sums.dispErr += h * disp
	c.sums.energyErr += h * energy
}

// addClosed is exactMeasures.add for a stretch read in closed form. The
// sizes of the terms that make N and M are the sums of the magnitudes of
// each basis function's part, the particular part's and the thermal
// offset, largest over the samples.
func (m *exactMeasures) addClosed(st *exactStretch, v *Interval) {
	m.takeStress(v)
	h := st.length
	terms := func(t float64) (axial, bending float64) {
		return st.bar.termSize(1, t)*st.bar.stiffness/h + math.Abs(st.bar.offset),
			st.beam.termSize(2, t)*st.beam.stiffness/(h*h) + math.Abs(st.beam.offset)
	}
	for i := range v.closedPieces() + 1 {
		a, b := terms(float64(i) / float64(v.closedPieces()))
		m.stressTerms = math.Max(m.stressTerms, a/st.area+b*st.fibre/st.secondMoment)
	}
	ea, ei := st.bar.stiffness, st.beam.stiffness
	panels := v.closedPanels()
	m.disp += h * closedIntegral(panels, func(xi float64) float64 {
		var f Fields
		v.closedAt(xi, &f)
		return f.AxialDisplacement*f.AxialDisplacement + f.Deflection*f.Deflection
	})
	m.energy += h * closedIntegral(panels, func(xi float64) float64 {
		var f Fields
		v.closedAt(xi, &f)
		return f.AxialForce*f.AxialForce/ea + f.BendingMoment*f.BendingMoment/ei
	})
	m.energyTerms += h * closedIntegral(panels, func(xi float64) float64 {
		a, b := terms(xi)
		return a*a/ea + b*b/ei
	})
}

// termSize is Σ|c_k·φ_k^(d)(t)| + |y_p^(d)(t)|: the size of the terms the
// d-th derivative of the solution sums, which round-off in it is relative
// to.
func (s *stretchSolution) termSize(d int, t float64) float64 {
	sum := math.Abs(s.particular(d, t))
	for k := range s.order {
		sum += math.Abs(s.coeff[k] * s.basis(k, d, t))
	}
	return sum
}

// RangeLess returns the smallest and the largest value on the interval of
// quantity q less the line from a at its start to b at its end (a
// deflection measured from a chord, say), with where they are: in closed
// form on a polynomial interval (RangeOf), by sampling on one read in
// closed form. The combined stress, which is no polynomial, is sampled
// alike.
func (v *Interval) RangeLess(q Quantity, a, b float64) (lo, hi Point) {
	if p, ok := v.Polynomial(q); ok {
		p[0] -= a
		p[1] -= b - a
		return v.RangeOf(&p)
	}
	n := 8
	if v.closed.stretch != nil {
		n = v.closedPieces()
	}
	g := func(xi float64) float64 {
		var f Fields
		v.At(xi, &f)
		return q.Of(&f) - a - (b-a)*xi
	}
	l, h := sampledRange(n, func(i int) float64 { return g(float64(i) / float64(n)) }, g, exactSteps)
	return Point{v.X(l.xi), l.value}, Point{v.X(h.xi), h.value}
}

// closedGap is ElementView.Gap where the exact solution on the element is
// read in closed form: the largest |FE − exact| of q by sampling both (the
// combined stress on the fibre the finite element solution takes), where
// it is above above.
func (v *ElementView) closedGap(q Quantity, above float64) (Point, bool) {
	fe, ex := &v.FE, &v.Exact
	gap := func(xi float64) float64 {
		var a, b Fields
		fe.At(xi, &a)
		ex.closedAt(xi, &b)
		if q == QCombinedStress {
			sign := fibreSign(a.AxialStress, a.BendingStress)
			return (a.AxialStress - b.AxialStress) + sign*(a.BendingStress-b.BendingStress)
		}
		return q.Of(&a) - q.Of(&b)
	}
	n := ex.closedPieces()
	lo, hi := sampledRange(n, func(i int) float64 { return gap(float64(i) / float64(n)) }, gap, errorSteps)
	e := hi
	if -lo.value > hi.value {
		e = extremum{lo.xi, -lo.value}
	}
	if !(e.value > above) {
		return Point{}, false
	}
	return Point{X: fe.X(e.xi), Value: e.value}, true
}
