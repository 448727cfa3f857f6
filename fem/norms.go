package fem

import "math"

// ErrorNorms measure how far a finite element solution is from the exact one.
// The three relative measures, in words:
//
//   - MaxStressRelative, the largest stress error: the largest difference
//     between the finite element and the exact combined stress anywhere
//     along the member, as a share of the largest exact stress;
//   - RelativeL2, the displacement error: the root mean square over the
//     member of the difference in displacement (u and w), as a share of
//     the root mean square of the exact displacement;
//   - RelativeEnergy, the energy error: the square root of the strain
//     energy of the difference between the two solutions, as a share of
//     the square root of the exact strain energy — the measure finite
//     element theory bounds, and the one adaptive refinement aims at.
//     Both energies are the whole strain energy: axial and bending, and
//     on a segment with shear deformation the shear strain energy too.
//
// Each is divided by a measure of the exact solution, and a measure can
// vanish: a bar held at both ends and heated does not move, a free bar
// heated or a determinate beam whose support settles carries no stress,
// a bar pulled at a support that holds it carries nothing. The ratio
// would then be round-off over round-off, read as 100 %, or x/0. So each
// measure has a scale that cannot vanish while anything acts on the
// member: the sizes of the terms that make N and M (for example E·α·ΔT
// beside E·u'), exact and finite element alike, and the loads' scale
// (forceFloor: the loads, each reaction and the imposed deformations
// fully restrained), which the terms lack where the loads go straight
// into the supports: for the stress and the energy the same measure of
// those terms and that force, for the displacement the displacement
// those strains and curvatures and that force add up to over the
// member's length (its characteristic displacement). Where the
// exact measure is negligible against its scale (below negligible times
// it), the error is judged against the scale instead: round-off reads 0, a
// real error a finite ratio, never +Inf or NaN.
type ErrorNorms struct {
	MaxDeflection     float64 // max |w_h − w| over the member, m
	MaxAxial          float64 // max |u_h − u|, m
	MaxStress         float64 // max |σ_h − σ| of the combined stress, Pa (see Comparison)
	MaxStressAt       float64 // where MaxStress is reached, m; the first such place along the member
	MaxStressRelative float64 // the largest stress error, relative (see above)
	RelativeL2        float64 // the displacement error, relative
	RelativeEnergy    float64 // the energy error, relative
}

// roundOff is the size of round-off in nodal values relative to the terms
// that make them: a few roundings per level of the hierarchy and in the
// exact solution's sums, with margin.
const roundOff = 256 * 0x1p-52

// Names of the three relative measures, for every output.
const (
	StressErrorName       = "largest stress error"
	DisplacementErrorName = "displacement error (root mean square)"
	EnergyErrorName       = "energy error"
)

// negligible is the relative size below which an exact measure counts as zero.
const negligible = 1e-9

// Compare measures the error of s against e, the exact solution of the same
// model, in one walk over the elements (see Comparison). A nil argument
// gives the zero value.
func Compare(s *Solution, e *Exact) ErrorNorms {
	c := NewComparison(s, e)
	if c == nil {
		return ErrorNorms{}
	}
	Walk(s, e, c)
	return c.Norms()
}

// Comparison measures the error of a finite element solution against the
// exact solution of the same model in a walk over the elements (a
// Visitor), in closed form: on each element both solutions are polynomials
// (Interval), so the largest errors are taken at the ends and at the roots
// of the derivative of their difference, and the L2 and energy norms are
// integrated by Gauss–Legendre rules exact for the degrees involved (every
// key point of the model is a node). The energy norm is
// sqrt(∫ EA·(ε_h − ε)² + EI·(κ_h − κ)² + G·As·(γ_h − γ)² dx) with
// ε = u' − αΔT, κ = θ′ and γ = w′ − θ the shear strain (zero without shear
// deformation), computed as (N_h − N)²/EA + (M_h − M)²/EI + (V_h − V)²/(G·As).
// The measures of the exact solution alone are taken once, stretch by
// stretch, by NewComparison.
//
// The stress error compares the finite element combined stress σ_h with
// the exact stress on the same fibre, the one σ_h is taken at (the larger
// of the finite element solution's two). Wherever both solutions find the
// same fibre the larger this is the difference of their combined stresses;
// where the axial stress changes sign under bending, the larger fibre
// switches, and two fibres chosen independently would differ by 2|Mc/I| on
// the sliver between the two solutions' switches, however fine the mesh.
type Comparison struct {
	solution *Solution
	exact    *exactMeasures // shared with forks, read only
	maxima   errorMaxima
	sums     errorIntegrals
}

// errorMaxima are the largest errors found so far.
type errorMaxima struct {
	deflection, axial, stress float64 // max |w_h − w| (m), |u_h − u| (m), |σ_h − σ| (Pa)
	stressAt                  float64 // where |σ_h − σ| is largest, m
}

// errorIntegrals are the squared integrals over the elements seen: of the
// displacement error and of the energy of the error.
type errorIntegrals struct {
	dispErr, energyErr float64
}

// exactMeasures are the sizes of the exact solution that the relative
// errors divide by: max |σ| and max of the sizes of the terms that make σ
// (Pa), the squared L2 norm of the displacements, the energy (shear
// included) and the energy of the terms that make N and M, and the squared
// L2 norms of the strains and curvatures those terms make (m and 1/m).
type exactMeasures struct {
	stress, stressTerms       float64
	stressAt                  float64 // where stress is reached, m
	disp, energy, energyTerms float64
	strainTerms, curveTerms   float64
	// floor is the loads' scale (forceFloor) of the finite element
	// solution with this exact one. It is kept here, not in Comparison:
	// a field more there made BenchmarkCompare about 1.8 times slower
	// (measured on 100,000 elements; the cause was not found).
	floor floorSizes
}

// NewComparison is an empty comparison of s with e, which has measured e
// alone; nil when either is nil.
func NewComparison(s *Solution, e *Exact) *Comparison {
	if s == nil || e == nil {
		return nil
	}
	c := &Comparison{solution: s, exact: &exactMeasures{}}
	for j, v := range e.EachInterval() {
		c.exact.add(&e.stretches[j], v)
	}
	c.exact.floor = forceFloor(s, e)
	return c
}

// add measures the exact solution on stretch st, whose fields are v.
func (m *exactMeasures) add(st *exactStretch, v *Interval) {
	if v.closed.stretch != nil {
		m.addClosed(st, v)
		return
	}
	m.takeStress(v)
	// The sizes Σ|term| of the terms that make N (the thermal term included)
	// and M: round-off in them is relative to these. Their coefficients are
	// not negative, so they are largest at the stretch's end.
	var axial, bending Polynomial
	ea, ei := st.bar.stiffness, st.beam.stiffness
	for k := range 3 {
		axial[k] = math.Abs(ea / st.length * float64(k+1) * st.bar.coeff[k+1])
	}
	axial[0] += math.Abs(st.bar.offset)
	for k := range 4 {
		bending[k] = math.Abs(ei / (st.length * st.length) * float64((k+1)*(k+2)) * st.beam.coeff[k+2])
	}
	m.stressTerms = math.Max(m.stressTerms, axial.at(2, 1)/st.area+bending.at(3, 1)*st.fibre/st.secondMoment)
	h := st.length
	u, w := &v.poly[QAxialDisplacement], &v.poly[QDeflection]
	for _, q := range gauss6 { // w² is of degree 10
		uq, wq := u.at(3, q.xi), w.at(5, q.xi)
		m.disp += q.w * h * (uq*uq + wq*wq)
	}
	n, mo, vs := &v.poly[QAxialForce], &v.poly[QBendingMoment], &v.poly[QShearForce]
	// M² and the terms² are of degree 6 at most, V² of 4; 1/(G·As) is g/EI,
	// zero without shear deformation.
	igs := st.shear / ei
	for _, q := range gauss4 {
		nq, mq, vq := n.at(2, q.xi), mo.at(3, q.xi), vs.at(2, q.xi)
		at, bt := axial.at(2, q.xi), bending.at(3, q.xi)
		m.energy += q.w * h * (nq*nq/ea + mq*mq/ei + vq*vq*igs)
		m.energyTerms += q.w * h * (at*at/ea + bt*bt/ei)
		m.strainTerms += q.w * h * at * at / (ea * ea)
		m.curveTerms += q.w * h * bt * bt / (ei * ei)
	}
}

// takeStress takes the largest combined stress of v, and where it is.
func (m *exactMeasures) takeStress(v *Interval) {
	lo, hi := v.Range(QCombinedStress)
	if math.Abs(lo.Value) > math.Abs(hi.Value) {
		hi = lo
	}
	if math.Abs(hi.Value) > m.stress {
		m.stress, m.stressAt = math.Abs(hi.Value), hi.X
	}
}

// dispTerms is the L2 norm of the characteristic displacement of a member
// of length L (m^1.5): the strains and curvatures that make N and M, over
// the member's length, ‖ε‖·L and ‖κ‖·L² — for a bar held at both ends and
// heated, |α·ΔT|·L over its length; a scale of the displacements that
// does not vanish where the displacements do.
func (m *exactMeasures) dispTerms(L float64) float64 {
	return math.Sqrt(m.strainTerms*L*L + m.curveTerms*L*L*L*L)
}

// Visit compares the two solutions on one element: the errors of u and w
// in closed form where the nodal values agree (bubbles, see
// hermiteBubble), the rest with the fewest exact Gauss points. A largest
// error is sought on the element only where a bound of it could beat the
// largest so far (cubicBound, maxAbsBeyond).
func (c *Comparison) Visit(v *ElementView) {
	if !v.HasExact {
		return
	}
	fe, ex := &v.FE, &v.Exact
	if ex.closed.stretch != nil {
		c.visitClosed(v)
		return
	}
	// The differences are of the exact fields' degrees (exactDegrees), at
	// least the finite element ones for the elements of fem: u cubic, w
	// quintic, N quadratic, M cubic.
	fu, eu := &fe.poly[QAxialDisplacement], &ex.poly[QAxialDisplacement]
	fw, ew := &fe.poly[QDeflection], &ex.poly[QDeflection]
	fn, en := &fe.poly[QAxialForce], &ex.poly[QAxialForce]
	fm, em := &fe.poly[QBendingMoment], &ex.poly[QBendingMoment]
	du := Polynomial{fu[0] - eu[0], fu[1] - eu[1], fu[2] - eu[2], fu[3] - eu[3]}
	dw := Polynomial{fw[0] - ew[0], fw[1] - ew[1], fw[2] - ew[2], fw[3] - ew[3], fw[4] - ew[4], fw[5] - ew[5]}
	dn := Polynomial{fn[0] - en[0], fn[1] - en[1], fn[2] - en[2]}
	dm := Polynomial{fm[0] - em[0], fm[1] - em[1], fm[2] - em[2], fm[3] - em[3]}
	m := &c.maxima
	h := fe.Length
	sec := &c.solution.sections[v.Segment]
	in := &c.sums
	// The nodal values of both solutions agree to round-off, relative to
	// the size of the exact stretch's terms (ElementView.exactSize): the
	// errors of u and w are bubbles, in closed form. Where they do not (a
	// solution that lost digits), the errors are measured as they are:
	// their largest values searched for, the fewest Gauss points exact for
	// each square (du² of degree 6, dw² of degree 10).
	disp := 0.0
	if a, b, ok := linearBubble(&du, roundOff*v.exactSize[0]); ok {
		if bound := (math.Abs(a) + math.Abs(b)) / 4; bound > m.axial {
			m.axial = max(m.axial, linearBubbleMax(a, b))
		}
		disp += linearBubbleSquare(a, b)
	} else {
		if cubicBound(&du) > m.axial {
			m.axial = max(m.axial, maxAbs(&du, 3).value)
		}
		for _, q := range &gauss4 {
			uq := du.at3(q.xi)
			disp += q.w * uq * uq
		}
	}
	if a, b, ok := hermiteBubble(&dw, roundOff*v.exactSize[1]); ok {
		if bound := max(math.Abs(a), math.Abs(a+b)) / 16; bound > m.deflection {
			m.deflection = max(m.deflection, hermiteBubbleMax(a, b))
		}
		disp += hermiteBubbleSquare(a, b)
	} else {
		noise := roundOff * (math.Abs(fw[0]) + math.Abs(fw[1]) + math.Abs(fw[2]) + math.Abs(fw[3]))
		m.deflection = maxAbsBeyond(&dw, m.deflection, noise)
		for _, q := range &gauss6 {
			wq := dw.At(q.xi)
			disp += q.w * wq * wq
		}
	}
	in.dispErr += h * disp
	if e := combinedError(fe, ex, m.stress); e.value > m.stress {
		m.stress, m.stressAt = e.value, fe.X(e.xi)
	}
	// dN² and dM² are of degree 6 at most, dV² of degree 4; 1/(G·As) is
	// g/EI, zero without shear deformation.
	iea, iei, igs := 1/sec.axialRigidity, 1/sec.flexuralRigidity, sec.shear/sec.flexuralRigidity
	fv, ev := &fe.poly[QShearForce], &ex.poly[QShearForce]
	dv := Polynomial{fv[0] - ev[0], fv[1] - ev[1], fv[2] - ev[2]}
	energy := 0.0
	for _, q := range &gauss4 {
		nq, mq, vq := dn.at2(q.xi), dm.at3(q.xi), dv.at2(q.xi)
		energy += q.w * (nq*nq*iea + mq*mq*iei + vq*vq*igs)
	}
	in.energyErr += h * energy
}

func (c *Comparison) Fork() Visitor {
	return &Comparison{solution: c.solution, exact: c.exact}
}

func (c *Comparison) Join(later Visitor) {
	d := later.(*Comparison)
	m, n := &c.maxima, &d.maxima
	m.deflection, m.axial = math.Max(m.deflection, n.deflection), math.Max(m.axial, n.axial)
	if n.stress > m.stress {
		m.stress, m.stressAt = n.stress, n.stressAt
	}
	c.sums.dispErr += d.sums.dispErr
	c.sums.energyErr += d.sums.energyErr
}

// Norms are the error norms of the elements seen against the exact solution.
func (c *Comparison) Norms() ErrorNorms {
	m, in, ex := &c.maxima, &c.sums, c.exact
	var fe *feMeasures // taken only if an exact measure vanishes
	own := func() *feMeasures {
		if fe == nil {
			fe = c.solution.ownMeasures()
		}
		return fe
	}
	// The loads' scale (forceFloor): a stress, of the section the largest
	// exact stress acts on, the displacement the member's deformations
	// make, over the member's length (its L2 norm), and the work of that
	// force through that displacement (the energy norm's square).
	model := &c.solution.Model
	L := model.Length()
	floor := ex.floor
	return ErrorNorms{
		MaxDeflection: m.deflection,
		MaxAxial:      m.axial,
		MaxStress:     m.stress,
		MaxStressAt:   m.stressAt,
		MaxStressRelative: relativeError(m.stress, ex.stress, max(ex.stressTerms, floor.stressNear(model, ex.stressAt).all[1]),
			func() float64 { return own().stressTerms }),
		RelativeL2: relativeError(math.Sqrt(in.dispErr), math.Sqrt(ex.disp),
			max(math.Sqrt(ex.disp), ex.dispTerms(L), floor.all[2]*math.Sqrt(L)),
			func() float64 { return math.Sqrt(own().disp) }),
		RelativeEnergy: relativeError(math.Sqrt(in.energyErr), math.Sqrt(ex.energy),
			max(math.Sqrt(ex.energyTerms), math.Sqrt(floor.all[0]*floor.all[2])),
			func() float64 { return math.Sqrt(own().energyTerms) }),
	}
}

// WorstStress is where the largest error of the combined stress was found,
// m; the first such place along the member.
func (c *Comparison) WorstStress() float64 { return c.maxima.stressAt }

// feMeasures are the finite element solution's own sizes, which the
// relative errors are judged against where the exact solution's vanish:
// the squared L2 norm of its displacements, the energy of the terms that
// make its N and M, and the largest stress those terms make.
type feMeasures struct {
	disp, energyTerms, stressTerms float64
}

// ownMeasures walks the elements of s for its own measures.
func (s *Solution) ownMeasures() *feMeasures {
	var out feMeasures
	for v := range s.Elements(nil, 0, len(s.fields)) {
		fe := &v.FE
		h := fe.Length
		u, w := &fe.poly[QAxialDisplacement], &fe.poly[QDeflection]
		for _, q := range gauss4 { // u_h² and w_h² are of degree 6 at most
			uq, wq := u.at(fe.degree[QAxialDisplacement], q.xi), w.at(fe.degree[QDeflection], q.xi)
			out.disp += q.w * h * (uq*uq + wq*wq)
		}
		sec := &s.sections[v.Segment]
		na, ma := s.actionMagnitudes(v.Element)
		out.energyTerms += (na*na/sec.axialRigidity + ma*ma/sec.flexuralRigidity) * h
		out.stressTerms = math.Max(out.stressTerms, na/sec.area+ma*sec.fibre/sec.secondMoment)
	}
	return &out
}

// combinedError is the largest |σ_h − σ| of the combined stress on an
// element, fe and ex its finite element and exact fields, and where (ξ),
// with σ the exact stress on the fibre σ_h is taken at; {0, −1} when a
// bound shows it is not above best. The element is cut where the finite
// element solution's larger fibre may change (pieces.splitFibres); on each
// piece the error is σa_h − σa ± (σb_h − σb), one polynomial whose extremes
// are at the piece's ends (both sides of a cut count) or at the roots of
// its derivative.
func combinedError(fe, ex *Interval, best float64) extremum {
	fa, fb := &fe.poly[QAxialStress], &fe.poly[QBendingStress]
	ea, eb := &ex.poly[QAxialStress], &ex.poly[QBendingStress]
	dfe := max(fe.degree[QAxialStress], fe.degree[QBendingStress])
	d := max(dfe, ex.degree[QAxialStress], ex.degree[QBendingStress])
	var da, db Polynomial
	if d <= 3 {
		// The walk's usual case, written out: the terms above the cubic's
		// are zero in both.
		da[0], da[1], da[2], da[3] = fa[0]-ea[0], fa[1]-ea[1], fa[2]-ea[2], fa[3]-ea[3]
		db[0], db[1], db[2], db[3] = fb[0]-eb[0], fb[1]-eb[1], fb[2]-eb[2], fb[3]-eb[3]
		if cubicBound(&da)+cubicBound(&db) <= best {
			return extremum{value: -1} // |σa error| + |σb error| cannot beat best
		}
	} else {
		for k := range da {
			da[k], db[k] = fa[k]-ea[k], fb[k]-eb[k]
		}
	}
	if fe.oneFibre { // one piece, as splitFibres would leave it
		g := combine(1, &da, fibreSign(fa.at(dfe, 0.5), fb.at(dfe, 0.5)), &db)
		return maxAbs(&g, d)
	}
	var ps pieces
	ps.reset()
	ps.splitFibres(fa, fb, dfe)
	best0 := extremum{value: -1}
	for i := 0; i < ps.n; i++ {
		x0, x1 := ps.breaks[i], ps.breaks[i+1]
		mid := (x0 + x1) / 2
		g := combine(1, &da, fibreSign(fa.at(dfe, mid), fb.at(dfe, mid)), &db)
		if ps.n == 1 {
			return maxAbs(&g, d)
		}
		take := func(xi float64) {
			if v := math.Abs(g.at(d, xi)); v > best0.value {
				best0 = extremum{xi, v}
			}
		}
		take(x0)
		dg := g.Derivative()
		var r [polynomialTerms - 1]float64
		for _, xi := range r[:dg.roots(&r)] {
			if xi > x0 && xi < x1 {
				take(xi)
			}
		}
		take(x1)
	}
	return best0
}

// relativeError is err/exact, unless exact is negligible against
// exactTerms, the same measure of the terms it sums or of the loads'
// scale, the larger (then it is zero to round-off and the ratio means
// nothing). In that case the error is judged
// against scale, the larger of exactTerms and feTerms (asked for only
// then): 0 when it is at round-off level, else err/scale. See ErrorNorms.
func relativeError(err, exact, exactTerms float64, feTerms func() float64) float64 {
	if exact > negligible*exactTerms && exact > 0 {
		return err / exact
	}
	scale := math.Max(exactTerms, feTerms())
	if err <= negligible*scale {
		return 0
	}
	return err / scale
}

// actionMagnitudes bounds the sizes of the terms the interpolation of element
// el sums into N and M: nodal values times the largest derivatives of the
// shape functions (1/h for the linear bar, 6/h² and 4/h for the Hermite beam,
// per node), plus the thermal term. Round-off in N_h and M_h is relative to these.
func (s *Solution) actionMagnitudes(el Element) (axial, bending float64) {
	seg := s.Model.Segments[el.Segment]
	h := el.End - el.Start
	var u, w, theta float64
	for _, d := range s.Displacement[el.First : el.First+2] {
		u, w, theta = u+math.Abs(d[Axial]), w+math.Abs(d[Transverse]), theta+math.Abs(d[Rotation])
	}
	thermal := math.Abs(seg.Material.ThermalExpansion * s.Model.TemperatureChange)
	axial = seg.Material.Elastic * seg.Section.Area * (u/h + thermal)
	bending = seg.Material.Elastic * seg.Section.SecondMoment * (6*w/(h*h) + 4*theta/h)
	return axial, bending
}
