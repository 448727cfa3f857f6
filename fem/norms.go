package fem

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// ErrorNorms measure how far a finite element solution is from the exact one.
//
// The relative measures divide by the exact solution's measure. Where that
// measure vanishes (to round-off: a free bar heated, a determinate member
// whose support settles) the ratio would be 0/0 or x/0, and round-off noise
// would read as a 100 % error. Compare then divides instead by a scale of the
// problem: the same measure built from the sizes of the terms that cancel in
// N and M, exact (for example E·α·ΔT against E·u') and finite element (nodal
// values times the largest shape-function derivatives). An error at round-off level then
// reads 0, a real error a finite ratio; the relative measures stay finite and
// can be plotted and stored, unlike +Inf or NaN.
type ErrorNorms struct {
	MaxDeflection     float64 // max |w_h − w| over the member, m
	MaxAxial          float64 // max |u_h − u|, m
	MaxStress         float64 // max |σ_h − σ| of the combined stress, Pa
	MaxStressRelative float64 // MaxStress / max |σ|
	RelativeL2        float64 // ‖(u_h,w_h) − (u,w)‖₂ / ‖(u,w)‖₂
	RelativeEnergy    float64 // energy norm of the error / energy norm of the exact solution
}

// ComparePoints is the number of intervals each element is sampled in for
// the maximum errors; both element ends are included, each seen from inside
// its element. Eight resolves the quintic exact deflection between the
// nodes well inside 1 %.
const ComparePoints = 8

// gaussPoints integrates polynomials up to degree 2·6 − 1 = 11 exactly: the
// squared error of a quintic deflection has degree 10.
const gaussPoints = 6

// negligible is the relative size below which an exact measure counts as zero.
const negligible = 1e-9

// ComparedPoint is one of the points where Compare reads both solutions.
type ComparedPoint struct {
	X       float64 // m
	Element int     // index in Mesh.Elements of the element the point is seen from
	FE      Fields  // the finite element fields there
	// Exact holds the exact fields there, equal to Exact.At on the same side
	// to round-off; zero when there is no exact solution.
	Exact Fields
}

// Compare measures the error of s against e, the exact solution of the same
// model. Maxima come from ComparePoints+1 points per element; the L2 and
// energy norms from Gauss–Legendre quadrature per element, exact for the
// polynomial fields involved because every key point of the model is a node.
// The energy norm is sqrt(∫ EA·(ε_h − ε)² + EI·(κ_h − κ)² dx) with ε = u' − αΔT
// and κ = w″, computed as (N_h − N)²/EA + (M_h − M)²/EI. A nil argument gives
// the zero value.
func Compare(s *Solution, e *Exact) ErrorNorms { return CompareVisiting(s, e, nil) }

// CompareVisiting is Compare that also shows visit, when not nil, each point
// the maxima are taken at, in order along the member: ComparePoints+1 per
// element, both ends included and each seen from inside its element. Checks
// that need both solutions at those points read them there at no further
// cost. With e nil it visits the finite element fields alone (Exact zero)
// and returns the zero value. The point is reused between calls: copy what
// is kept. visit is called on the caller's goroutine.
//
// Each point is evaluated in its own element, and the exact solution on the
// stretch holding the element (elements never cross a key point), so nothing
// is searched for. The maxima and the integrals are independent walks over
// the elements and run at once, the integrals on a second goroutine.
func CompareVisiting(s *Solution, e *Exact, visit func(*ComparedPoint)) ErrorNorms {
	var out ErrorNorms
	if s == nil {
		return out
	}
	if e == nil || len(e.stretches) == 0 {
		if visit != nil {
			var p ComparedPoint
			for i, el := range s.Mesh.Elements {
				p.Element = i
				for k := 0; k <= ComparePoints; k++ {
					p.X = comparePoint(el, k)
					p.FE = s.InElement(i, p.X)
					visit(&p)
				}
			}
		}
		return out
	}
	c := comparison{solution: s, exact: make([]stretchPolynomials, len(e.stretches))}
	tolerance := mergeTolerance * e.keys[len(e.keys)-1]
	for j := range c.exact {
		c.exact[j] = newStretchPolynomials(&e.stretches[j], tolerance)
	}
	integrals := make(chan errorIntegrals, 1)
	go func() { integrals <- c.integrals() }()
	m := c.maxima(visit)
	in := <-integrals
	out.MaxDeflection, out.MaxAxial, out.MaxStress = m.deflection, m.axial, m.stress
	out.MaxStressRelative = relativeError(m.stress, m.exactStress, m.exactStressTerms, in.stressTermsFE)
	out.RelativeL2 = relativeError(math.Sqrt(in.dispErr), math.Sqrt(in.disp), math.Sqrt(in.disp), math.Sqrt(in.dispFE))
	out.RelativeEnergy = relativeError(math.Sqrt(in.energyErr), math.Sqrt(in.energy), math.Sqrt(in.energyTerms), math.Sqrt(in.energyTermsFE))
	return out
}

// comparison holds a solution and the exact one, stretch by stretch, for
// the walks of CompareVisiting; both walks only read it.
type comparison struct {
	solution *Solution
	exact    []stretchPolynomials
}

// stretchFor returns the exact stretch holding el, advancing *j, which the
// elements of one walk move along the member.
func (c *comparison) stretchFor(el Element, j *int) *stretchPolynomials {
	for mid := el.Start + (el.End-el.Start)/2; *j+1 < len(c.exact) && c.exact[*j+1].start <= mid; {
		*j++
	}
	return &c.exact[*j]
}

// errorMaxima are the largest errors and the sizes they are judged against.
type errorMaxima struct {
	deflection, axial, stress float64 // max |w_h − w| (m), |u_h − u| (m), |σ_h − σ| (Pa)
	exactStress               float64 // max |σ|, Pa
	exactStressTerms          float64 // max of the sizes of the terms that make σ, Pa
}

// maxima takes the largest errors at the ComparePoints+1 points of every
// element, showing each point to visit.
func (c *comparison) maxima(visit func(*ComparedPoint)) errorMaxima {
	var out errorMaxima
	var p ComparedPoint
	j := 0
	for i, el := range c.solution.Mesh.Elements {
		ex := c.stretchFor(el, &j)
		sec := c.solution.Model.Segments[el.Segment].Section
		p.Element = i
		for k := 0; k <= ComparePoints; k++ {
			x := comparePoint(el, k)
			p.X, p.FE = x, c.solution.InElement(i, x)
			axialTerms, bendingTerms := ex.at(x, &p.Exact)
			f, g := &p.FE, &p.Exact
			out.deflection = math.Max(out.deflection, math.Abs(f.Deflection-g.Deflection))
			out.axial = math.Max(out.axial, math.Abs(f.AxialDisplacement-g.AxialDisplacement))
			out.stress = math.Max(out.stress, math.Abs(f.CombinedStress-g.CombinedStress))
			out.exactStress = math.Max(out.exactStress, math.Abs(g.CombinedStress))
			out.exactStressTerms = math.Max(out.exactStressTerms, axialTerms/sec.Area+bendingTerms*sec.FibreDistance/sec.SecondMoment)
			if visit != nil {
				visit(&p)
			}
		}
	}
	return out
}

// errorIntegrals are the squared integrals of the norms: displacement error,
// exact and finite element displacements; energy of the error, of the exact
// and of the finite element solution, of the terms that make the exact N
// and M and of those of the finite element ones; with the largest stress the
// finite element terms make.
type errorIntegrals struct {
	dispErr, disp, dispFE                         float64
	energyErr, energy, energyTerms, energyTermsFE float64
	stressTermsFE                                 float64
}

// integrals integrates the squared errors element by element by
// Gauss–Legendre quadrature.
func (c *comparison) integrals() errorIntegrals {
	var gauss [gaussPoints]struct{ xi, w float64 }
	xs, ws := make([]float64, gaussPoints), make([]float64, gaussPoints)
	quad.Legendre{}.FixedLocations(xs, ws, 0, 1)
	for q := range gauss {
		gauss[q].xi, gauss[q].w = xs[q], ws[q]
	}
	var out errorIntegrals
	var g Fields
	j := 0
	for i, el := range c.solution.Mesh.Elements {
		ex := c.stretchFor(el, &j)
		h := el.End - el.Start
		seg := c.solution.Model.Segments[el.Segment]
		sec := seg.Section
		ea := seg.Material.Elastic * sec.Area
		ei := seg.Material.Elastic * sec.SecondMoment
		na, ma := c.solution.actionMagnitudes(el)
		out.energyTermsFE += (na*na/ea + ma*ma/ei) * h
		out.stressTermsFE = math.Max(out.stressTermsFE, na/sec.Area+ma*sec.FibreDistance/sec.SecondMoment)
		for _, q := range gauss {
			x, w := el.Start+h*q.xi, h*q.w
			f := c.solution.InElement(i, x)
			axialTerms, bendingTerms := ex.at(x, &g)
			du, dw := f.AxialDisplacement-g.AxialDisplacement, f.Deflection-g.Deflection
			dn, dm := f.AxialForce-g.AxialForce, f.BendingMoment-g.BendingMoment
			out.dispErr += w * (du*du + dw*dw)
			out.disp += w * (g.AxialDisplacement*g.AxialDisplacement + g.Deflection*g.Deflection)
			out.dispFE += w * (f.AxialDisplacement*f.AxialDisplacement + f.Deflection*f.Deflection)
			out.energyErr += w * (dn*dn/ea + dm*dm/ei)
			out.energy += w * (g.AxialForce*g.AxialForce/ea + g.BendingMoment*g.BendingMoment/ei)
			out.energyTerms += w * (axialTerms*axialTerms/ea + bendingTerms*bendingTerms/ei)
		}
	}
	return out
}

// comparePoint is the k-th of the ComparePoints+1 points of element el.
func comparePoint(el Element, k int) float64 {
	if k == ComparePoints {
		return el.End
	}
	return el.Start + (el.End-el.Start)*float64(k)/ComparePoints
}

// stretchPolynomials are the exact fields on one stretch as polynomials in
// t = (x − start)/length, with differentiation, rigidities and powers of the
// length already applied, so a point costs one pass of Horner's rule over
// all of them.
type stretchPolynomials struct {
	start, length, inverseLength float64 // m, m, 1/m
	tolerance                    float64 // m: closer to an end than this is at the end
	axialOffset                  float64 // −EA·αΔT, N
	area, fibre, secondMoment    float64 // A (m²), c (m), I (m⁴)
	// coeff[k][q] multiplies t^k in quantity q (see the exact* indices).
	coeff [6][exactQuantities]float64
}

// Indices of the quantities in stretchPolynomials.coeff: u, w, θ, N without
// its thermal offset, V, M, and the sizes Σ|term| of the terms that make N
// (offset apart) and M.
const (
	exactAxial = iota
	exactDeflection
	exactRotation
	exactAxialForce
	exactShear
	exactMoment
	exactAxialTerms
	exactMomentTerms
	exactQuantities
)

func newStretchPolynomials(s *exactStretch, tolerance float64) stretchPolynomials {
	h := s.length
	p := stretchPolynomials{start: s.start, length: h, inverseLength: 1 / h, tolerance: tolerance,
		axialOffset: s.bar.offset, area: s.area, fibre: s.fibre, secondMoment: s.secondMoment}
	put := func(q int, c []float64, d int, scale float64) {
		for k := d; k < len(c); k++ {
			p.coeff[k-d][q] = scale * c[k] * fallingFactorial(k, d)
		}
	}
	put(exactAxial, s.bar.coeff, 0, 1)
	put(exactDeflection, s.beam.coeff, 0, 1)
	put(exactRotation, s.beam.coeff, 1, 1/h)
	put(exactAxialForce, s.bar.coeff, 1, s.bar.stiffness/h)
	put(exactShear, s.beam.coeff, 3, s.beam.stiffness/(h*h*h))
	put(exactMoment, s.beam.coeff, 2, s.beam.stiffness/(h*h))
	for k := range p.coeff {
		p.coeff[k][exactAxialTerms] = math.Abs(p.coeff[k][exactAxialForce])
		p.coeff[k][exactMomentTerms] = math.Abs(p.coeff[k][exactMoment])
	}
	return p
}

// at writes the exact fields at x, which must lie on the stretch, to f and
// returns the sizes of the terms that make N and M there (Σ|term|, not
// |Σ term|, the thermal term included): round-off in them is relative to these. Within
// the merge tolerance of an end, x counts as that end.
func (p *stretchPolynomials) at(x float64, f *Fields) (axialTerms, bendingTerms float64) {
	t := min(max((x-p.start)*p.inverseLength, 0), 1)
	if x-p.start <= p.tolerance {
		t = 0
	} else if p.start+p.length-x <= p.tolerance {
		t = 1
	}
	// One accumulator per quantity keeps them all in registers.
	var u, w, theta, n, v, m, nTerms, mTerms float64
	for k := len(p.coeff) - 1; k >= 0; k-- {
		c := &p.coeff[k]
		u, w, theta = u*t+c[exactAxial], w*t+c[exactDeflection], theta*t+c[exactRotation]
		n, v, m = n*t+c[exactAxialForce], v*t+c[exactShear], m*t+c[exactMoment]
		nTerms, mTerms = nTerms*t+c[exactAxialTerms], mTerms*t+c[exactMomentTerms]
	}
	f.X = p.start + t*p.length
	f.AxialDisplacement, f.Deflection, f.Rotation = u, w, theta
	f.AxialForce, f.ShearForce, f.BendingMoment = n+p.axialOffset, v, m
	f.AxialStress = f.AxialForce / p.area
	f.BendingStress = f.BendingMoment * p.fibre / p.secondMoment
	f.CombinedStress = extremeFibreStress(f.AxialStress, f.BendingStress)
	return nTerms + math.Abs(p.axialOffset), mTerms
}

// relativeError is err/exact, unless exact is negligible against
// exactTerms, the same measure of the terms it sums (then it is zero to
// round-off and the ratio means nothing). In that case the error is judged
// against scale, the larger of exactTerms and feTerms: 0 when it is at
// round-off level, else err/scale. See ErrorNorms.
func relativeError(err, exact, exactTerms, feTerms float64) float64 {
	scale := math.Max(exactTerms, feTerms)
	switch {
	case exact > negligible*exactTerms && exact > 0:
		return err / exact
	case err <= negligible*scale:
		return 0
	default:
		return err / scale
	}
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
