package fem

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// ErrorNorms measure how far a finite element solution is from the exact one.
//
// The relative measures divide by the exact solution's measure. Where that
// measure vanishes (to round-off) the ratio would be 0/0 or x/0, so Compare
// divides instead by a scale of the problem, the larger of the exact and the
// finite element measures (and, for stresses and energy, the thermal term
// E·α·ΔT that N = EA·(u' − αΔT) cancels): an error at round-off level then
// reads 0, and a real error reads at most 2. The relative measures thus stay
// finite and can be plotted and stored, unlike +Inf or NaN.
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
	var maxStress, maxStressFE float64
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
			maxStressFE = math.Max(maxStressFE, math.Abs(h.CombinedStress))
		}
	}
	// Squared integrals: displacement error, exact and finite element
	// displacements; energy of the error, of the exact and of the finite
	// element solution, and of the thermal force EA·αΔT.
	var dispErr, disp, dispFE, energyErr, energy, energyFE, energyThermal float64
	var thermalStress float64
	xs, ws := make([]float64, gaussPoints), make([]float64, gaussPoints)
	for _, el := range s.Mesh.Elements {
		seg := s.Model.Segments[el.Segment]
		ea := seg.Material.Elastic * seg.Section.Area
		ei := seg.Material.Elastic * seg.Section.SecondMoment
		thermal := seg.Material.ThermalExpansion * s.Model.TemperatureChange
		thermalStress = math.Max(thermalStress, math.Abs(seg.Material.Elastic*thermal))
		energyThermal += ea * thermal * thermal * (el.End - el.Start)
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
			energyFE += ws[q] * (h.AxialForce*h.AxialForce/ea + h.BendingMoment*h.BendingMoment/ei)
		}
	}
	out.MaxStressRelative = relativeError(out.MaxStress, maxStress, maxStressFE, thermalStress)
	out.RelativeL2 = relativeError(math.Sqrt(dispErr), math.Sqrt(disp), math.Sqrt(dispFE), 0)
	out.RelativeEnergy = relativeError(math.Sqrt(energyErr), math.Sqrt(energy), math.Sqrt(energyFE), math.Sqrt(energyThermal))
	return out
}

// relativeError is err/exact, unless the exact measure is negligible against
// the problem's scale (the largest of exact, finite element and other, a
// measure of terms the exact value may cancel): then err/scale, with an error
// at round-off level reported as 0. See ErrorNorms.
func relativeError(err, exact, fe, other float64) float64 {
	scale := math.Max(exact, math.Max(fe, other))
	switch {
	case exact > negligible*scale:
		return err / exact
	case err <= negligible*scale:
		return 0
	default:
		return err / scale
	}
}
