package fem_test

// Observed convergence of each element type against the exact solution,
// compared with the rates finite element theory predicts, and exactness of
// the nodal values at every refinement.

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/stat"

	"stave/fem"
)

// convergenceCase is a smooth problem whose exact solution lies outside the
// element's space, with the theoretical rates of its errors in h.
type convergenceCase struct {
	name   string
	order  fem.ElementOrder
	model  fem.Model
	stress quantity // the stress whose largest error is measured
	// Rates of the relative L2 error of displacement, of the energy-norm error
	// and of the largest stress error. Hughes, The Finite Element Method, ch. 1;
	// Strang & Fix, An Analysis of the Finite Element Method, ch. 1 (from memory):
	// elements complete to degree k converge as h^(k+1) in L2 and h^k in energy
	// (the stress, a derivative of order m of the displacement, as h^(k+1−m)).
	l2, energy, maxStress float64
}

func convergenceCases() []convergenceCase {
	// A load rising linearly from zero: the exact axial displacement is a cubic
	// and the exact deflection a quintic, outside every element's space.
	L := refLength
	bar := fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial,
			Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: L, Intensity: refPAxis}}}}}
	beam := fem.Model{Segments: refMember(L),
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
			Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: L, Intensity: refQ}}}}}
	return []convergenceCase{
		// Linear bar: degree 1, stress N = EA·u' is one derivative.
		{name: "linear bar", order: fem.LinearBar, model: bar, stress: axialStress, l2: 2, energy: 1, maxStress: 1},
		// Quadratic bar: degree 2.
		{name: "quadratic bar", order: fem.QuadraticBar, model: bar, stress: axialStress, l2: 3, energy: 2, maxStress: 2},
		// Hermite cubic beam: degree 3, energy and stress M = EI·w'' two derivatives.
		{name: "Hermite beam", order: fem.LinearBar, model: beam, stress: bendingStress, l2: 4, energy: 2, maxStress: 2},
	}
}

// refinements are the element counts of the convergence study.
var refinements = []int{1, 2, 4, 8, 16, 32, 64}

// rateTolerance is the allowed difference between a fitted and a theoretical rate.
const rateTolerance = 0.15

// measuredErrors are the errors of one solution, computed here by Gauss–Legendre
// quadrature (gonum) and sampling, independently of fem.Compare.
type measuredErrors struct {
	l2, energy, maxStress float64 // all relative to the exact solution's size
}

// gaussPoints per element: exact for the squared error of a quintic.
const gaussPoints = 6

// measureErrors integrates over each element; stress samples include both
// element ends, read from inside the element.
func measureErrors(sol *fem.Solution, ex *fem.Exact, stress quantity) measuredErrors {
	m := &sol.Model
	var l2Err, l2Ref, enErr, enRef, worstErr, worstRef float64
	for _, e := range sol.Mesh.Elements {
		g := m.Segments[e.Segment]
		ea := g.Material.Elastic * g.Section.Area
		ei := g.Material.Elastic * g.Section.SecondMoment
		both := func(x float64) (fem.Fields, fem.Fields) { return sol.At(x, fem.Right), ex.At(x, fem.Right) }
		integrate := func(f func(h, x fem.Fields) float64) float64 {
			return quad.Fixed(func(x float64) float64 { h, x2 := both(x); return f(h, x2) }, e.Start, e.End, gaussPoints, quad.Legendre{}, 0)
		}
		l2Err += integrate(func(h, x fem.Fields) float64 {
			return sq(h.AxialDisplacement-x.AxialDisplacement) + sq(h.Deflection-x.Deflection)
		})
		l2Ref += integrate(func(_, x fem.Fields) float64 { return sq(x.AxialDisplacement) + sq(x.Deflection) })
		enErr += integrate(func(h, x fem.Fields) float64 {
			return sq(h.AxialForce-x.AxialForce)/ea + sq(h.BendingMoment-x.BendingMoment)/ei
		})
		enRef += integrate(func(_, x fem.Fields) float64 { return sq(x.AxialForce)/ea + sq(x.BendingMoment)/ei })
		const samples = 16
		for k := 0; k <= samples; k++ {
			x, side := e.Start+(e.End-e.Start)*float64(k)/samples, fem.Right
			if k == samples {
				side = fem.Left
			}
			h, want := stress.of(sol.At(x, side)), stress.of(ex.At(x, side))
			worstErr = math.Max(worstErr, math.Abs(h-want))
			worstRef = math.Max(worstRef, math.Abs(want))
		}
	}
	return measuredErrors{l2: math.Sqrt(l2Err / l2Ref), energy: math.Sqrt(enErr / enRef), maxStress: worstErr / worstRef}
}

func sq(v float64) float64 { return v * v }

// fittedRate is the least-squares slope of log(error) against log(h).
func fittedRate(h, err []float64) float64 {
	lh, le := make([]float64, len(h)), make([]float64, len(h))
	for i := range h {
		lh[i], le[i] = math.Log(h[i]), math.Log(err[i])
	}
	_, slope := stat.LinearRegression(lh, le, nil, false)
	return slope
}

// study solves c at every refinement and returns element sizes, round-off
// floors, solutions and the exact solution.
func study(t *testing.T, c convergenceCase) ([]float64, []float64, []*fem.Solution, *fem.Exact) {
	t.Helper()
	ex, err := fem.SolveExact(&c.model)
	if err != nil {
		t.Fatalf("SolveExact: %v", err)
	}
	var hs, floors []float64
	var sols []*fem.Solution
	for _, n := range refinements {
		sol := solveWith(t, c.model, n, c.order)
		if len(sol.Mesh.Elements) != n {
			t.Fatalf("asked for %d elements on a member with no interior key points, got %d", n, len(sol.Mesh.Elements))
		}
		hs = append(hs, longestElement(sol.Mesh))
		floors = append(floors, roundOffFloor(sol))
		sols = append(sols, sol)
	}
	return hs, floors, sols, ex
}

// roundOffFloor is the relative error below which a level is left out of a
// fit: the relative round-off of a linear solve is bounded by about ε·κ
// (Higham, Accuracy and Stability of Numerical Algorithms, from memory), and
// below that the discretisation error can no longer be told from it.
func roundOffFloor(sol *fem.Solution) float64 { return 0x1p-52 * sol.Condition }

// checkRate fits the rate over the levels whose error lies above the
// round-off floor of their solution.
func checkRate(t *testing.T, what string, hs, errs, floors []float64, want float64) {
	t.Helper()
	var h, e []float64
	for i := range hs {
		if !(errs[i] > 0) || math.IsNaN(errs[i]) {
			t.Errorf("%s with h = %.4g m is %g: an error norm must be positive for a solution outside the element space", what, hs[i], errs[i])
			return
		}
		if errs[i] < floors[i] {
			t.Logf("%s: h = %.4g m left out of the fit, error %.3g is below the round-off floor %.3g", what, hs[i], errs[i], floors[i])
			continue
		}
		h, e = append(h, hs[i]), append(e, errs[i])
	}
	if len(h) < 3 {
		t.Errorf("%s: only %d levels above the round-off floor, too few to fit a rate", what, len(h))
		return
	}
	got := fittedRate(h, e)
	t.Logf("%s: fitted rate %.3f (theory %g) over %d levels, errors %.3g", what, got, want, len(h), e)
	if math.Abs(got-want) > rateTolerance {
		t.Errorf("%s converges at rate %.3f, theory says %g (allowed ±%g); errors by level: %.3g", what, got, want, rateTolerance, e)
	}
}

// TestConvergenceRates fits the observed rates twice: from the errors
// measured here and from fem.Compare, the routine the program reports errors
// with; both must match theory, and Compare's integrals must match these.
func TestConvergenceRates(t *testing.T) {
	for _, c := range convergenceCases() {
		t.Run(c.name, func(t *testing.T) {
			hs, floors, sols, ex := study(t, c)
			var own, reported [3][]float64 // L2, energy, largest stress
			for i, sol := range sols {
				m, norms := measureErrors(sol, ex, c.stress), fem.Compare(sol, ex)
				// Both are integrals of the same fields; they agree unless one
				// integrates too coarsely.
				if !(math.Abs(norms.RelativeL2-m.l2) <= 1e-3*m.l2) || !(math.Abs(norms.RelativeEnergy-m.energy) <= 1e-3*m.energy) {
					t.Errorf("%d elements: Compare gives relative L2 %.6g and energy %.6g, quadrature here %.6g and %.6g",
						refinements[i], norms.RelativeL2, norms.RelativeEnergy, m.l2, m.energy)
				}
				for k, v := range [3]float64{m.l2, m.energy, m.maxStress} {
					own[k] = append(own[k], v)
				}
				for k, v := range [3]float64{norms.RelativeL2, norms.RelativeEnergy, norms.MaxStressRelative} {
					reported[k] = append(reported[k], v)
				}
			}
			names := [3]string{"relative L2 displacement error", "relative energy-norm error", "largest " + c.stress.String() + " error"}
			rates := [3]float64{c.l2, c.energy, c.maxStress}
			for k := range 3 {
				checkRate(t, names[k], hs, own[k], floors, rates[k])
				checkRate(t, "Compare: "+names[k], hs, reported[k], floors, rates[k])
			}
		})
	}
}

// TestConvergenceNodalExactness checks that the nodal displacements equal the
// exact solution at every refinement: in 1D with consistent loads the finite
// element solution is exact at the element end nodes (Tong 1969; Strang & Fix
// ch. 1, from memory), for linear and quadratic bars and Hermite beams alike.
func TestConvergenceNodalExactness(t *testing.T) {
	for _, c := range convergenceCases() {
		t.Run(c.name, func(t *testing.T) {
			_, _, sols, ex := study(t, c)
			s := scalesOf(&c.model)
			tol := [3]float64{roundOff * s.of(axialDisplacement), roundOff * s.of(deflection), roundOff * s.of(rotation)}
			for _, sol := range sols {
				for i, x := range sol.Mesh.X {
					want := ex.At(x, fem.Right)
					exact := [3]float64{want.AxialDisplacement, want.Deflection, want.Rotation}
					for d := range 3 {
						if got := sol.Displacement[i][d]; !(math.Abs(got-exact[d]) <= tol[d]) {
							t.Errorf("%d elements, node at x = %.4g m, %s: finite element %.12g, exact %.12g",
								len(sol.Mesh.Elements), x, fem.Dof(d), got, exact[d])
						}
					}
				}
			}
		})
	}
}
