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

// comparePoints is the number of intervals each element is sampled in for
// the maximum errors; both element ends are included, each seen from inside
// its element.
const comparePoints = 8

// gaussPoints integrates polynomials up to degree 2·6 − 1 = 11 exactly: the
// squared error of a quintic deflection has degree 10.
const gaussPoints = 6

// negligible is the relative size below which an exact measure counts as zero.
const negligible = 1e-9

// Compare measures the error of s against e, the exact solution of the same
// model. Maxima come from comparePoints+1 points per element; the L2 and
// energy norms from Gauss–Legendre quadrature per element, exact for the
// polynomial fields involved because every key point of the model is a node.
// The energy norm is sqrt(∫ EA·(ε_h − ε)² + EI·(κ_h − κ)² dx) with ε = u' − αΔT
// and κ = w″, computed as (N_h − N)²/EA + (M_h − M)²/EI. A nil argument gives
// the zero value.
//
// One walk over the elements does all of it: each point is evaluated in its
// own element, and the exact solution on the stretch holding the element
// (elements never cross a key point), so nothing is searched for.
func Compare(s *Solution, e *Exact) ErrorNorms {
	var out ErrorNorms
	if s == nil || e == nil || len(e.stretches) == 0 {
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
	j := 0
	for i, el := range s.Mesh.Elements {
		h := el.End - el.Start
		for mid := el.Start + h/2; j+1 < len(exact) && exact[j+1].start <= mid; {
			j++
		}
		ex := &exact[j]
		seg := s.Model.Segments[el.Segment]
		sec := seg.Section
		for k := 0; k <= comparePoints; k++ {
			x := el.Start + (el.End-el.Start)*float64(k)/comparePoints
			if k == comparePoints {
				x = el.End
			}
			f, g := s.inElement(i, x), ex.at(x)
			out.MaxDeflection = math.Max(out.MaxDeflection, math.Abs(f.Deflection-g.deflection))
			out.MaxAxial = math.Max(out.MaxAxial, math.Abs(f.AxialDisplacement-g.axialDisplacement))
			out.MaxStress = math.Max(out.MaxStress, math.Abs(f.CombinedStress-g.stress))
			maxStress = math.Max(maxStress, math.Abs(g.stress))
			stressTerms = math.Max(stressTerms, g.axialTerms/sec.Area+g.bendingTerms*sec.FibreDistance/sec.SecondMoment)
		}
		ea := seg.Material.Elastic * sec.Area
		ei := seg.Material.Elastic * sec.SecondMoment
		na, ma := s.actionMagnitudes(el)
		energyTermsFE += (na*na/ea + ma*ma/ei) * h
		stressTermsFE = math.Max(stressTermsFE, na/sec.Area+ma*sec.FibreDistance/sec.SecondMoment)
		for _, q := range gauss {
			x, w := el.Start+h*q.xi, h*q.w
			f, g := s.inElement(i, x), ex.at(x)
			du, dw := f.AxialDisplacement-g.axialDisplacement, f.Deflection-g.deflection
			dn, dm := f.AxialForce-g.axialForce, f.BendingMoment-g.bendingMoment
			dispErr += w * (du*du + dw*dw)
			disp += w * (g.axialDisplacement*g.axialDisplacement + g.deflection*g.deflection)
			dispFE += w * (f.AxialDisplacement*f.AxialDisplacement + f.Deflection*f.Deflection)
			energyErr += w * (dn*dn/ea + dm*dm/ei)
			energy += w * (g.axialForce*g.axialForce/ea + g.bendingMoment*g.bendingMoment/ei)
			energyTerms += w * (g.axialTerms*g.axialTerms/ea + g.bendingTerms*g.bendingTerms/ei)
		}
	}
	out.MaxStressRelative = relativeError(out.MaxStress, maxStress, stressTerms, stressTermsFE)
	out.RelativeL2 = relativeError(math.Sqrt(dispErr), math.Sqrt(disp), math.Sqrt(disp), math.Sqrt(dispFE))
	out.RelativeEnergy = relativeError(math.Sqrt(energyErr), math.Sqrt(energy), math.Sqrt(energyTerms), math.Sqrt(energyTermsFE))
	return out
}

// stretchPolynomials are the exact fields Compare reads on one stretch, as
// polynomials in t = (x − start)/length with differentiation, rigidities and
// powers of the length already applied, so a point costs one pass of
// Horner's rule over all of them.
type stretchPolynomials struct {
	start, length, inverseLength float64 // m, m, 1/m
	tolerance                    float64 // m: closer to an end than this is at the end
	axialOffset                  float64 // −EA·αΔT, N
	inverseArea, fibreOverSecond float64 // 1/A (1/m²), c/I (1/m³)
	// coeff[k][q] multiplies t^k in quantity q (see the exact* indices).
	coeff [6][exactQuantities]float64
}

// Indices of the quantities in stretchPolynomials.coeff: u and w (m); N
// without its thermal offset and M; and the sizes Σ|term| of the terms that
// make N (offset apart) and M, as in Exact.actionMagnitudes.
const (
	exactAxial = iota
	exactDeflection
	exactAxialForce
	exactMoment
	exactAxialTerms
	exactMomentTerms
	exactQuantities
)

func newStretchPolynomials(s *exactStretch, tolerance float64) stretchPolynomials {
	h := s.length
	p := stretchPolynomials{start: s.start, length: h, inverseLength: 1 / h, tolerance: tolerance,
		axialOffset: s.bar.offset, inverseArea: 1 / s.area, fibreOverSecond: s.fibre / s.secondMoment}
	put := func(q int, c []float64, d int, scale float64) {
		for k := d; k < len(c); k++ {
			v := scale * c[k] * fallingFactorial(k, d)
			p.coeff[k-d][q] = v
			if q == exactAxialForce || q == exactMoment {
				p.coeff[k-d][q+exactAxialTerms-exactAxialForce] = math.Abs(v)
			}
		}
	}
	put(exactAxial, s.bar.coeff, 0, 1)
	put(exactDeflection, s.beam.coeff, 0, 1)
	put(exactAxialForce, s.bar.coeff, 1, s.bar.stiffness/h)
	put(exactMoment, s.beam.coeff, 2, s.beam.stiffness/(h*h))
	return p
}

// exactValues are the exact fields Compare needs at one point, with the
// sizes of the terms that make N and M (see Exact.actionMagnitudes).
type exactValues struct {
	axialDisplacement, deflection float64 // m
	axialForce, bendingMoment     float64 // N, N·m
	stress                        float64 // combined, Pa
	axialTerms, bendingTerms      float64 // N, N·m
}

// at evaluates the stretch at x, which must lie on it; within the merge
// tolerance of an end, x counts as that end.
func (p *stretchPolynomials) at(x float64) exactValues {
	t := min(max((x-p.start)*p.inverseLength, 0), 1)
	if x-p.start <= p.tolerance {
		t = 0
	} else if p.start+p.length-x <= p.tolerance {
		t = 1
	}
	var y [exactQuantities]float64
	for k := len(p.coeff) - 1; k >= 0; k-- {
		c := &p.coeff[k]
		for q := range y {
			y[q] = y[q]*t + c[q]
		}
	}
	v := exactValues{
		axialDisplacement: y[exactAxial],
		deflection:        y[exactDeflection],
		axialForce:        y[exactAxialForce] + p.axialOffset,
		bendingMoment:     y[exactMoment],
		axialTerms:        y[exactAxialTerms] + math.Abs(p.axialOffset),
		bendingTerms:      y[exactMomentTerms],
	}
	v.stress = extremeFibreStress(v.axialForce*p.inverseArea, v.bendingMoment*p.fibreOverSecond)
	return v
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
