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
func Compare(s *Solution, e *Exact) ErrorNorms {
	var out ErrorNorms
	if s == nil || e == nil {
		return out
	}
	var maxStress, stressTerms, stressTermsFE float64
	for _, el := range s.Mesh.Elements {
		for j := 0; j <= comparePoints; j++ {
			x, side := el.Start+(el.End-el.Start)*float64(j)/comparePoints, Right
			if j == comparePoints {
				x, side = el.End, Left
			}
			h, ex := s.At(x, side), e.At(x, side)
			out.MaxDeflection = math.Max(out.MaxDeflection, math.Abs(h.Deflection-ex.Deflection))
			out.MaxAxial = math.Max(out.MaxAxial, math.Abs(h.AxialDisplacement-ex.AxialDisplacement))
			out.MaxStress = math.Max(out.MaxStress, math.Abs(h.CombinedStress-ex.CombinedStress))
			maxStress = math.Max(maxStress, math.Abs(ex.CombinedStress))
			sec := s.Model.Segments[el.Segment].Section
			na, ma := e.actionMagnitudes(x, side)
			stressTerms = math.Max(stressTerms, na/sec.Area+ma*sec.FibreDistance/sec.SecondMoment)
		}
	}
	// Squared integrals: displacement error, exact and finite element
	// displacements; energy of the error, of the exact and of the finite
	// element solution, and of the terms that make the exact N and M.
	var dispErr, disp, dispFE, energyErr, energy, energyTerms, energyTermsFE float64
	xs, ws := make([]float64, gaussPoints), make([]float64, gaussPoints)
	for _, el := range s.Mesh.Elements {
		seg := s.Model.Segments[el.Segment]
		ea := seg.Material.Elastic * seg.Section.Area
		ei := seg.Material.Elastic * seg.Section.SecondMoment
		na, ma := s.actionMagnitudes(el)
		energyTermsFE += (na*na/ea + ma*ma/ei) * (el.End - el.Start)
		sec := seg.Section
		stressTermsFE = math.Max(stressTermsFE, na/sec.Area+ma*sec.FibreDistance/sec.SecondMoment)
		quad.Legendre{}.FixedLocations(xs, ws, el.Start, el.End)
		for q, x := range xs {
			h, ex := s.At(x, Right), e.At(x, Right)
			du, dw := h.AxialDisplacement-ex.AxialDisplacement, h.Deflection-ex.Deflection
			dn, dm := h.AxialForce-ex.AxialForce, h.BendingMoment-ex.BendingMoment
			dispErr += ws[q] * (du*du + dw*dw)
			disp += ws[q] * (ex.AxialDisplacement*ex.AxialDisplacement + ex.Deflection*ex.Deflection)
			dispFE += ws[q] * (h.AxialDisplacement*h.AxialDisplacement + h.Deflection*h.Deflection)
			energyErr += ws[q] * (dn*dn/ea + dm*dm/ei)
			energy += ws[q] * (ex.AxialForce*ex.AxialForce/ea + ex.BendingMoment*ex.BendingMoment/ei)
			na, ma := e.actionMagnitudes(x, Right)
			energyTerms += ws[q] * (na*na/ea + ma*ma/ei)
		}
	}
	out.MaxStressRelative = relativeError(out.MaxStress, maxStress, stressTerms, stressTermsFE)
	out.RelativeL2 = relativeError(math.Sqrt(dispErr), math.Sqrt(disp), math.Sqrt(disp), math.Sqrt(dispFE))
	out.RelativeEnergy = relativeError(math.Sqrt(energyErr), math.Sqrt(energy), math.Sqrt(energyTerms), math.Sqrt(energyTermsFE))
	return out
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
