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
// is kept.
//
// One walk over the elements does all of it: each point is evaluated in its
// own element, and the exact solution on the stretch holding the element
// (elements never cross a key point), so nothing is searched for.
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
					p.FE = s.inElement(i, p.X)
					visit(&p)
				}
			}
		}
		return out
	}
	var gauss [gaussPoints]struct{ xi, w float64 }
	{
		xs, ws := make([]float64, gaussPoints), make([]float64, gaussPoints)
		quad.Legendre{}.FixedLocations(xs, ws, 0, 1)
		for q := range gauss {
			gauss[q].xi, gauss[q].w = xs[q], ws[q]
		}
	}
	exact := make([]stretchPolynomials, len(e.stretches))
	tolerance := mergeTolerance * e.keys[len(e.keys)-1]
	for j := range exact {
		exact[j] = newStretchPolynomials(&e.stretches[j], tolerance)
	}
	var maxStress, stressTerms, stressTermsFE float64
	// Squared integrals: displacement error, exact and finite element
	// displacements; energy of the error, of the exact and of the finite
	// element solution, and of the terms that make the exact N and M.
	var dispErr, disp, dispFE, energyErr, energy, energyTerms, energyTermsFE float64
	var p ComparedPoint
	j := 0
	for i, el := range s.Mesh.Elements {
		h := el.End - el.Start
		for mid := el.Start + h/2; j+1 < len(exact) && exact[j+1].start <= mid; {
			j++
		}
		ex := &exact[j]
		seg := s.Model.Segments[el.Segment]
		sec := seg.Section
		p.Element = i
		for k := 0; k <= ComparePoints; k++ {
			x := comparePoint(el, k)
			p.X, p.FE = x, s.inElement(i, x)
			f, g := &p.FE, ex.at(x, &p.Exact)
			out.MaxDeflection = math.Max(out.MaxDeflection, math.Abs(f.Deflection-g.Deflection))
			out.MaxAxial = math.Max(out.MaxAxial, math.Abs(f.AxialDisplacement-g.AxialDisplacement))
			out.MaxStress = math.Max(out.MaxStress, math.Abs(f.CombinedStress-g.CombinedStress))
			maxStress = math.Max(maxStress, math.Abs(g.CombinedStress))
			stressTerms = math.Max(stressTerms, ex.axialTerms/sec.Area+ex.bendingTerms*sec.FibreDistance/sec.SecondMoment)
			if visit != nil {
				visit(&p)
			}
		}
		ea := seg.Material.Elastic * sec.Area
		ei := seg.Material.Elastic * sec.SecondMoment
		na, ma := s.actionMagnitudes(el)
		energyTermsFE += (na*na/ea + ma*ma/ei) * h
		stressTermsFE = math.Max(stressTermsFE, na/sec.Area+ma*sec.FibreDistance/sec.SecondMoment)
		var g Fields
		for _, q := range gauss {
			x, w := el.Start+h*q.xi, h*q.w
			f := s.inElement(i, x)
			ex.at(x, &g)
			du, dw := f.AxialDisplacement-g.AxialDisplacement, f.Deflection-g.Deflection
			dn, dm := f.AxialForce-g.AxialForce, f.BendingMoment-g.BendingMoment
			dispErr += w * (du*du + dw*dw)
			disp += w * (g.AxialDisplacement*g.AxialDisplacement + g.Deflection*g.Deflection)
			dispFE += w * (f.AxialDisplacement*f.AxialDisplacement + f.Deflection*f.Deflection)
			energyErr += w * (dn*dn/ea + dm*dm/ei)
			energy += w * (g.AxialForce*g.AxialForce/ea + g.BendingMoment*g.BendingMoment/ei)
			energyTerms += w * (ex.axialTerms*ex.axialTerms/ea + ex.bendingTerms*ex.bendingTerms/ei)
		}
	}
	out.MaxStressRelative = relativeError(out.MaxStress, maxStress, stressTerms, stressTermsFE)
	out.RelativeL2 = relativeError(math.Sqrt(dispErr), math.Sqrt(disp), math.Sqrt(disp), math.Sqrt(dispFE))
	out.RelativeEnergy = relativeError(math.Sqrt(energyErr), math.Sqrt(energy), math.Sqrt(energyTerms), math.Sqrt(energyTermsFE))
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
	// The sizes of the terms that make N and M at the last point evaluated
	// (see Exact.actionMagnitudes): round-off in them is relative to these.
	axialTerms, bendingTerms float64 // N, N·m
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
// returns f; within the merge tolerance of an end, x counts as that end.
func (p *stretchPolynomials) at(x float64, f *Fields) *Fields {
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
	p.axialTerms = nTerms + math.Abs(p.axialOffset)
	p.bendingTerms = mTerms
	return f
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
