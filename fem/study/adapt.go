package study

import (
	"context"
	"fmt"
	"math"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/mat"

	"stave/fem"
	"stave/fem/units"
)

// Iteration is one mesh of an adaptive run.
type Iteration struct {
	Elements int
	// Estimated is the recovery-based relative energy-norm error,
	// η/√(‖u_h‖² + η²); True is fem.Compare's RelativeEnergy; of a model
	// with load cases, each the largest over its cases.
	Estimated, True float64
	Effectivity     float64 // Estimated / True; NaN when True is at round-off
}

// Adaptive is the history and result of an adaptive refinement.
type Adaptive struct {
	Iterations []Iteration
	Nodes      []float64 // final mesh, m
	// Reached says the estimate and the true error both met the target
	// within MaxElements, the most elements the refinement may use.
	Reached     bool
	MaxElements int
	// AtRoundOff says the refinement stopped short of the target because
	// the last mesh's true error is at its round-off (its condition
	// estimate times ε, Row.RoundOff): finer meshes raise that floor, and
	// on a beam that only a foundation holds across they ended in a
	// stiffness matrix singular to working precision.
	AtRoundOff bool
}

// refineFraction is the share of the largest element estimate above which
// an element is halved (the "maximum strategy"; 0.5 is a common choice in
// the adaptivity literature, common practice).
const refineFraction = 0.5

// Adapt refines m's mesh until the estimated relative energy-norm error is
// at most target or the next mesh would exceed maxElements. The estimate
// chooses where to refine; since the exact solution is at hand, the true
// error must meet the target as well before the run stops, so that a
// target said to be reached is (an estimate can be low: on the first
// meshes of a beam on an elastic foundation it is about 0.7 of the truth). It starts from
// two elements per stretch between key points, so that every patch holds
// enough superconvergent points for the recovery. It stops with ctx's
// error, and the iterations so far, when ctx is done before a mesh. fem's
// messages quote values in u (fem.PrepareIn).
func Adapt(ctx context.Context, m *fem.Model, target float64, maxElements int, u units.System) (Adaptive, error) {
	if !(target > 0) {
		return Adaptive{}, fmt.Errorf("adaptive refinement: the target error must be positive, got %g", target)
	}
	exacts, keys, err := prepare(m, "adaptive refinement", u)
	if err != nil {
		return Adaptive{}, err
	}
	if start := 2 * (len(keys) - 1); maxElements < start {
		return Adaptive{}, fmt.Errorf("adaptive refinement starts from 2 elements per stretch (%d elements here); allow at least that many, got %d", start, maxElements)
	}
	nodes := Subdivide(keys, 2)
	out := Adaptive{MaxElements: maxElements}
	for {
		if err := ctx.Err(); err != nil {
			return out, err
		}
		sols, err := solveOn(m, nodes, u)
		if err != nil {
			return out, err
		}
		s := sols[0]
		indicators, estimated, trueError := estimateSets(sols, exacts, keys)
		it := Iteration{Elements: len(s.Mesh.Elements), Estimated: estimated, True: trueError}
		it.Effectivity = math.NaN()
		if it.True > RoundOff {
			it.Effectivity = it.Estimated / it.True
		}
		out.Iterations = append(out.Iterations, it)
		out.Nodes = s.Mesh.X
		if estimated <= target && it.True <= target {
			out.Reached = true
			return out, nil
		}
		if it.True <= roundOffOf(s.Condition) {
			out.AtRoundOff = true
			return out, nil
		}
		refined := bisect(s.Mesh, indicators)
		if len(refined)-1 > maxElements {
			return out, nil
		}
		nodes = refined
	}
}

// estimateSets estimates the error of every load set's solution on one
// mesh (Estimate) and measures it against that set's exact solution: the
// largest estimated and true relative energy errors over the sets, and
// each element's largest indicator relative to its set's (η_e scaled as
// the set's η is to its relative estimate), so that a small case does not
// hide where a large one needs elements. One set keeps its indicators'
// proportions, which bisect reads.
func estimateSets(sols []*fem.Solution, exacts []*fem.Exact, keys []float64) (indicators []float64, estimated, trueError float64) {
	for i, s := range sols {
		ind, est := Estimate(s, keys)
		estimated = math.Max(estimated, est)
		trueError = math.Max(trueError, fem.Compare(s, exacts[i]).RelativeEnergy)
		if len(sols) == 1 {
			return ind, estimated, trueError
		}
		eta := 0.0
		for _, v := range ind {
			eta += v * v
		}
		scale := 0.0
		if eta > 0 {
			scale = est / math.Sqrt(eta)
		}
		if indicators == nil {
			indicators = make([]float64, len(ind))
		}
		for e, v := range ind {
			indicators[e] = math.Max(indicators[e], v*scale)
		}
	}
	return indicators, estimated, trueError
}

// bisect halves every element whose indicator is at least refineFraction of
// the largest.
func bisect(mesh fem.Mesh, indicators []float64) []float64 {
	largest := 0.0
	for _, v := range indicators {
		largest = math.Max(largest, v)
	}
	out := []float64{mesh.X[0]}
	for i, el := range mesh.Elements {
		if indicators[i] >= refineFraction*largest {
			out = append(out, 0.5*(el.Start+el.End))
		}
		out = append(out, el.End)
	}
	return out
}

// Estimate returns the recovery-based error indicator η_e of each element
// of s (in √J) and the estimated relative energy-norm error
// η/√(‖u_h‖² + η²) with η² = Σ η_e². keys are the key-point nodes: patches
// never cross them, because the moment and axial force may kink or jump there.
//
// Recovery: the bending moment of a Hermite cubic is linear in an element
// and superconvergent at the two Gauss points (the interpolation error of w”
// is proportional to 12s² − h², zero at s = ±h/√12); the axial force of a
// linear bar is superconvergent at the element middle, that of a quadratic
// bar at the two Gauss points. On a segment with shear deformation the
// shear force of the interdependent interpolation element is constant and
// superconvergent at the element middle (it is the mean of the exact one
// under a uniform load), and enters the strain energy as V²/(G·As). A
// polynomial one degree above the element's is fitted by least squares to
// these values over the element and its neighbours in the same stretch
// (superconvergent patch recovery, Zienkiewicz & Zhu 1992), and
// η_e² = ∫ (M* − M_h)²/EI + (N* − N_h)²/EA + (V* − V_h)²/(G·As) dx.
func Estimate(s *fem.Solution, keys []float64) ([]float64, float64) {
	elements := s.Mesh.Elements
	stretch := make([]int, len(elements))
	k := 0
	for i, el := range elements {
		for k < len(keys)-2 && 0.5*(el.Start+el.End) > keys[k+1] {
			k++
		}
		stretch[i] = k
	}
	barGauss := 1
	if s.Model.Mesh.BarOrder == fem.QuadraticBar {
		barGauss = 2
	}
	moment := func(f fem.Fields) float64 { return f.BendingMoment }
	axial := func(f fem.Fields) float64 { return f.AxialForce }
	shear := func(f fem.Fields) float64 { return f.ShearForce }
	indicators := make([]float64, len(elements))
	var errorSquared, normSquared float64
	xs, ws := make([]float64, 4), make([]float64, 4)
	for i, el := range elements {
		var patch []fem.Element
		for j := max(i-1, 0); j <= min(i+1, len(elements)-1); j++ {
			if stretch[j] == stretch[i] {
				patch = append(patch, elements[j])
			}
		}
		recoveredMoment := fitPatch(s, patch, 2, 2, moment)
		recoveredAxial := fitPatch(s, patch, barGauss, barGauss, axial)
		seg := s.Model.Segments[el.Segment]
		ei := seg.Material.Elastic * seg.Section.SecondMoment
		ea := seg.Material.Elastic * seg.Section.Area
		igs := seg.ShearFlexibility() / ei // 1/(G·As), 0 without shear deformation
		recoveredShear := func(float64) float64 { return 0 }
		if igs != 0 {
			recoveredShear = fitPatch(s, patch, 1, 1, shear)
		}
		quad.Legendre{}.FixedLocations(xs, ws, el.Start, el.End)
		var eta2 float64
		for q, x := range xs {
			f := s.At(x, fem.Right)
			dm, dn, dv := recoveredMoment(x)-f.BendingMoment, recoveredAxial(x)-f.AxialForce, recoveredShear(x)-f.ShearForce
			eta2 += ws[q] * (dm*dm/ei + dn*dn/ea + dv*dv*igs)
			normSquared += ws[q] * (f.BendingMoment*f.BendingMoment/ei + f.AxialForce*f.AxialForce/ea + f.ShearForce*f.ShearForce*igs)
		}
		indicators[i] = math.Sqrt(eta2)
		errorSquared += eta2
	}
	if errorSquared+normSquared == 0 {
		return indicators, 0
	}
	return indicators, math.Sqrt(errorSquared / (normSquared + errorSquared))
}

// fitPatch fits a polynomial of degree `degree` (lowered when the patch has
// too few points) to value at the `points` Gauss points of each patch
// element, and returns it as a function of x.
func fitPatch(s *fem.Solution, patch []fem.Element, points, degree int, value func(fem.Fields) float64) func(float64) float64 {
	gauss, weights := make([]float64, points), make([]float64, points)
	var xs, ys []float64
	for _, el := range patch {
		quad.Legendre{}.FixedLocations(gauss, weights, el.Start, el.End)
		for _, x := range gauss {
			xs, ys = append(xs, x), append(ys, value(s.At(x, fem.Right)))
		}
	}
	degree = min(degree, len(xs)-1)
	// Centre and scale x so the small least-squares system is well conditioned.
	centre := 0.5 * (patch[0].Start + patch[len(patch)-1].End)
	half := 0.5 * (patch[len(patch)-1].End - patch[0].Start)
	a := mat.NewDense(len(xs), degree+1, nil)
	for i, x := range xs {
		t := (x - centre) / half
		for j, p := 0, 1.0; j <= degree; j, p = j+1, p*t {
			a.Set(i, j, p)
		}
	}
	var c mat.VecDense
	if err := c.SolveVec(a, mat.NewVecDense(len(ys), ys)); err != nil {
		// The points are distinct Gauss points, so the system has full rank;
		// fall back to the mean should round-off say otherwise.
		mean := 0.0
		for _, y := range ys {
			mean += y / float64(len(ys))
		}
		return func(float64) float64 { return mean }
	}
	return func(x float64) float64 {
		t := (x - centre) / half
		v := 0.0
		for j := degree; j >= 0; j-- {
			v = v*t + c.AtVec(j)
		}
		return v
	}
}

// Versus compares adaptive refinement with uniform refinement at equal true
// error.
type Versus struct {
	Adaptive        Adaptive
	AdaptiveTrue    float64 // true relative energy error of the final adaptive mesh
	UniformElements int     // fewest uniform elements (BuildMesh with Mesh.Elements) reaching AdaptiveTrue
	UniformTrue     float64 // its true relative energy error
	// Exact says the adaptive mesh's error is at round-off: the finite
	// element answer is exact for this model, and uniform refinement is
	// not compared (UniformElements 0).
	Exact bool
}

// sameError is the relative tolerance within which two true errors count
// as the same: the one mesh reached two ways gives errors a few units in
// the last place apart.
const sameError = 1e-9

// AgainstUniform runs Adapt and then finds the fewest elements a uniform
// mesh (every stretch divided in proportion to its length, as BuildMesh
// does) needs to reach the same true error (to sameError), searching up to
// maxUniform elements. It stops with ctx's error when ctx is done before a
// mesh. fem's messages quote values in u (fem.PrepareIn).
func AgainstUniform(ctx context.Context, m *fem.Model, target float64, maxElements, maxUniform int, u units.System) (Versus, error) {
	a, err := Adapt(ctx, m, target, maxElements, u)
	if err != nil {
		return Versus{}, err
	}
	v := Versus{Adaptive: a, AdaptiveTrue: a.Iterations[len(a.Iterations)-1].True}
	// Exact from the first mesh on: a target below 1e-10 refined the demo
	// down to 9.7e-11, which was then called exact for the model.
	if a.Iterations[0].True <= RoundOff {
		v.Exact = true
		return v, nil
	}
	exacts, _, err := prepare(m, "uniform refinement", u)
	if err != nil {
		return v, err
	}
	reaches := func(e float64) bool { return e <= v.AdaptiveTrue*(1+sameError) }
	// uniformError solves on n elements: the elements, the true error and
	// the condition estimate.
	uniformError := func(n int) (int, float64, float64, error) {
		if err := ctx.Err(); err != nil {
			return 0, 0, 0, err
		}
		um := *m
		um.Mesh = fem.MeshSettings{Elements: n, BarOrder: m.Mesh.BarOrder}
		p, err := fem.PrepareIn(&um, u)
		if err != nil {
			return 0, 0, 0, err
		}
		sols, err := p.SolveLoadSets(p.Mesh())
		if err != nil {
			return 0, 0, 0, err
		}
		e := 0.0
		for i, s := range sols {
			e = math.Max(e, fem.Compare(s, exacts[i]).RelativeEnergy)
		}
		return len(sols[0].Mesh.Elements), e, sols[0].Condition, nil
	}
	// Double to bracket the answer, then bisect on the requested count.
	low, high := 0, 1
	for {
		count, e, cond, err := uniformError(high)
		if err != nil {
			return v, err
		}
		if reaches(e) {
			v.UniformElements, v.UniformTrue = count, e
			break
		}
		if e <= roundOffOf(cond) {
			return v, fmt.Errorf("uniform refinement reached its round-off, an error of %s on %d elements (condition estimate %s), before the adaptive error %s", units.FormatG("%.3g", e), count, units.FormatG("%.2g", cond), units.FormatG("%.3g", v.AdaptiveTrue))
		}
		if count > maxUniform {
			return v, fmt.Errorf("uniform refinement did not reach the adaptive error %s within %d elements (%s at %d)", units.FormatG("%.3g", v.AdaptiveTrue), maxUniform, units.FormatG("%.3g", e), count)
		}
		low, high = high, 2*high
	}
	for high-low > 1 {
		mid := (low + high) / 2
		count, e, _, err := uniformError(mid)
		if err != nil {
			return v, err
		}
		if reaches(e) {
			high, v.UniformElements, v.UniformTrue = mid, count, e
		} else {
			low = mid
		}
	}
	return v, nil
}
