package fem

import (
	"math"
	"sort"
)

// At evaluates the finite element fields at x from the interpolation of the
// element that holds x. At a node, side picks the element to the Left or to
// the Right (any other value means Right); x is clamped to [0, L].
func (s *Solution) At(x float64, side Side) Fields {
	if s == nil || len(s.fields) == 0 {
		return Fields{X: x}
	}
	return s.InElement(s.elementAt(x, side), x)
}

// elementAt finds the element holding x by binary search; positions within
// the merge tolerance of a node count as that node.
func (s *Solution) elementAt(x float64, side Side) int {
	nodes := s.Mesh.X
	last := len(s.fields) - 1
	tol := mergeTolerance * nodes[len(nodes)-1]
	i := sort.SearchFloat64s(nodes, x) // first node >= x
	switch {
	case i < len(nodes) && nodes[i]-x <= tol: // at node i
	case i > 0 && x-nodes[i-1] <= tol: // at node i-1
		i--
	default: // strictly inside element i-1
		return min(max(i-1, 0), last)
	}
	if side == Left {
		return max(i-1, 0)
	}
	return min(i, last)
}

// Sample returns the fields at n+1 evenly spaced points of every element,
// both ends included, in order along the member; n < 1 counts as 1. Each
// point is evaluated in its own element, so jumps at nodes show as two
// points with the same x.
func (s *Solution) Sample(n int) []Fields {
	if s == nil {
		return nil
	}
	n = max(n, 1)
	out := make([]Fields, 0, len(s.fields)*(n+1))
	for e, el := range s.Mesh.Elements {
		for j := 0; j <= n; j++ {
			x := el.Start + (el.End-el.Start)*float64(j)/float64(n)
			if j == n {
				x = s.Mesh.X[e+1] // exactly the node, free of round-off
			}
			out = append(out, s.InElement(e, x))
		}
	}
	return out
}

// InElement evaluates the fields at x in element e of s.Mesh, x clamped to
// the element; callers that walk the elements in order use it to skip the
// search At makes for every point. Displacements interpolate the end values,
// so neighbouring elements agree at a node to the bit; slopes, forces and
// moments come from the derivatives the hierarchy carried down
// (hierarchy.go), free of the cancellation that differencing nearly equal
// nodal values would bring on fine meshes.
func (s *Solution) InElement(e int, x float64) Fields {
	el := s.Mesh.Elements[e]
	var f Fields
	s.fieldsAt(e, min(max((x-el.Start)/(el.End-el.Start), 0), 1), &f)
	return f
}

// fieldsAt writes the fields at local coordinate ξ ∈ [0, 1] of element e to f.
func (s *Solution) fieldsAt(e int, xi float64, f *Fields) {
	el := s.Mesh.Elements[e]
	sec := &s.sections[el.Segment]
	h := el.End - el.Start
	f.X = el.Start + xi*h
	a, b := s.ends(e)
	g := s.fields[e]

	f.AxialDisplacement = (1-xi)*a[Axial] + xi*b[Axial] + 4*xi*(1-xi)*g.bubble
	f.AxialForce = sec.axialRigidity * (g.slope + (4-8*xi)*g.bubble/h - sec.thermalStrain)

	n := hermiteValues(xi, h)
	if sec.shear != 0 { // the interdependent interpolation of a Timoshenko element
		n, _ = beamShape(xi, h, 12*sec.shear/(h*h))
	}
	f.Deflection = n[0]*a[Transverse] + n[1]*a[Rotation] + n[2]*b[Transverse] + n[3]*b[Rotation]
	d, rest := xi*h, (1-xi)*h
	curvature := g.curvature + g.third*d
	// θ from both ends, blended, so each end reproduces its nodal rotation.
	fromStart := a[Rotation] + d*(g.curvature+g.third*d/2)
	fromEnd := b[Rotation] - rest*(curvature+g.third*rest/2)
	f.Rotation = (1-xi)*fromStart + xi*fromEnd
	f.BendingMoment = sec.flexuralRigidity * (curvature - sec.thermalCurvature)
	f.ShearForce = sec.flexuralRigidity * g.third
	sec.stresses(f)
}

// stresses sets the stresses of f from its axial force and bending moment.
func (sec *sectionData) stresses(f *Fields) {
	f.AxialStress = f.AxialForce / sec.area
	f.BendingStress = f.BendingMoment * sec.fibre / sec.secondMoment
	f.CombinedStress = combinedStress(f.AxialStress, f.BendingStress)
}

// fibreTie is the size of an axial stress, relative to the bending stress,
// below which it counts as none: round-off of a member without axial force.
// The finite element axial force there is the round-off of EA·(u₂ − u₁)/h,
// which, h short and u set by an axial load elsewhere, reaches 1e-15 of
// the bending stress and more; 1e-9 of it changes no stress that matters.
const fibreTie = 1e-9

// combinedStress is the extreme-fibre stress σa ± σb of larger magnitude
// (σa the axial, σb the bending stress): σa + |σb| under axial tension,
// σa − |σb| under compression, and the bottom fibre σa + σb when σa is zero
// or within round-off of σb (fibreTie), so that noise in a member without
// axial force cannot flip its sign. The finite element and the exact
// solution both take it.
func combinedStress(a, b float64) float64 {
	return a + fibreSign(a, b)*b
}

// fibreSign is the sign of σb in combinedStress(a, b).
func fibreSign(a, b float64) float64 {
	switch {
	case math.Abs(a) <= fibreTie*math.Abs(b):
		return 1
	case (a > 0) == (b > 0):
		return 1
	}
	return -1
}

// elementInterval sets v to the fields of element e: the polynomials in ξ
// of the interpolation InElement evaluates, from the end displacements and
// the derivatives the hierarchy carried down (the deflection from its
// Taylor data at the start, w + θ·s + w″·s²/2 + w‴·s³/6, the same cubic as
// the Hermite interpolation of the end values but free of its
// cancellation on fine meshes), and InElement's values at both ends.
// Coefficients beyond the degrees of v.degree are left as they are (zero).
func (s *Solution) elementInterval(e int, v *Interval) {
	el := &s.Mesh.Elements[e]
	sec := &s.sections[el.Segment]
	h := el.End - el.Start
	a, b := &s.Displacement[e], &s.Displacement[e+1]
	startRotation := a[Rotation]
	if s.releasedStart != nil {
		if r, ok := s.releasedStart[e]; ok {
			startRotation = r
		}
	}
	g := &s.fields[e]
	v.Start, v.Length, v.end = el.Start, h, el.End
	v.solution, v.element = s, e
	p := &v.poly
	ea, ei := sec.axialRigidity, sec.flexuralRigidity
	// The constant terms as fieldsAt computes them at ξ = 0, to the bit.
	n0 := ea * (g.slope + 4*g.bubble/h - sec.thermalStrain)
	m0 := ei * (g.curvature - sec.thermalCurvature)
	shear := ei * g.third
	u, w, r := &p[QAxialDisplacement], &p[QDeflection], &p[QRotation]
	u[0], u[1], u[2] = a[Axial], b[Axial]-a[Axial]+4*g.bubble, -4*g.bubble
	w[0], w[1] = a[Transverse], h*(startRotation-sec.shear*g.third) // w′ = θ − g·θ″
	w[2], w[3] = h*h*g.curvature/2, h*h*h*g.third/6
	r[0], r[1], r[2] = startRotation, h*g.curvature, h*h*g.third/2
	p[QAxialForce][0], p[QAxialForce][1] = n0, -8*ea*g.bubble/h
	p[QShearForce][0] = shear
	p[QBendingMoment][0], p[QBendingMoment][1] = m0, ei*g.third*h
	// The ends, as fieldsAt computes them at ξ = 0 and 1 (to the bit, but
	// for the sign of a zero): the displacements are the nodal ones.
	start, end := &v.ends[0], &v.ends[1]
	start.X, start.AxialDisplacement, start.Deflection, start.Rotation = el.Start, a[Axial], a[Transverse], startRotation
	start.AxialForce, start.ShearForce, start.BendingMoment = n0, shear, m0
	end.X, end.AxialDisplacement, end.Deflection, end.Rotation = el.Start+h, b[Axial], b[Transverse], b[Rotation]
	end.AxialForce = ea * (g.slope + -4*g.bubble/h - sec.thermalStrain)
	end.ShearForce, end.BendingMoment = shear, ei*(g.curvature+g.third*h-sec.thermalCurvature)
	sec.stresses(start)
	sec.stresses(end)
	// The stresses' constant terms are the start's; their slopes follow
	// from the ends' difference, the stresses being linear here.
	p[QAxialStress][0], p[QAxialStress][1] = start.AxialStress, end.AxialStress-start.AxialStress
	p[QBendingStress][0], p[QBendingStress][1] = start.BendingStress, end.BendingStress-start.BendingStress
	v.endsKnown, v.known = true, 0
	v.oneFibre = v.degree[QAxialStress] <= 1 && v.degree[QBendingStress] <= 1 && oneFibre(&p[QAxialStress], &p[QBendingStress])
}

// Varies says how quantity q varies inside the elements of s, as the
// formulation that carries it says (the bar for u, N and N/A, the beam for
// w, θ, V, M and Mc/I); Degree −1 for the combined stress, which is not one
// polynomial.
func (s *Solution) Varies(q Quantity) Variation {
	bar, beam := s.Model.Formulations()
	if v := bar.Varies(q); v.Degree >= 0 {
		return v
	}
	return beam.Varies(q)
}

// degrees are the degrees of the polynomial quantities inside the elements
// of s; a quantity no formulation gives one for is taken as of the largest.
func (s *Solution) degrees() [polynomialQuantities]int {
	var d [polynomialQuantities]int
	for q := range d {
		d[q] = s.Varies(Quantity(q)).Degree
		if d[q] < 0 {
			d[q] = polynomialTerms - 1
		}
	}
	return d
}

// values are the quantities of f indexed by Quantity.
func (f *Fields) values() [quantityCount]float64 {
	return [quantityCount]float64{
		QAxialDisplacement: f.AxialDisplacement, QDeflection: f.Deflection, QRotation: f.Rotation,
		QAxialForce: f.AxialForce, QShearForce: f.ShearForce, QBendingMoment: f.BendingMoment,
		QAxialStress: f.AxialStress, QBendingStress: f.BendingStress, QCombinedStress: f.CombinedStress,
	}
}

// ends are element e's end displacements as the element sees them: at the
// start of an element that starts at a hinge, with its own rotation.
func (s *Solution) ends(e int) (start, end [3]float64) {
	start, end = s.Displacement[e], s.Displacement[e+1]
	if r, ok := s.releasedStart[e]; ok {
		start[Rotation] = r
	}
	return start, end
}
