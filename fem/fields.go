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
	sec := &s.sections[el.Segment]
	h := el.End - el.Start
	xi := min(max((x-el.Start)/h, 0), 1)
	x = el.Start + xi*h
	f := Fields{X: x}
	a, b := s.ends(e)
	g := s.fields[e]

	f.AxialDisplacement = (1-xi)*a[Axial] + xi*b[Axial] + 4*xi*(1-xi)*g.bubble
	f.AxialForce = sec.axialRigidity * (g.slope + (4-8*xi)*g.bubble/h - sec.thermalStrain)

	n := hermiteValues(xi, h)
	f.Deflection = n[0]*a[Transverse] + n[1]*a[Rotation] + n[2]*b[Transverse] + n[3]*b[Rotation]
	d, rest := xi*h, (1-xi)*h
	curvature := g.curvature + g.third*d
	// θ from both ends, blended, so each end reproduces its nodal rotation.
	fromStart := a[Rotation] + d*(g.curvature+g.third*d/2)
	fromEnd := b[Rotation] - rest*(curvature+g.third*rest/2)
	f.Rotation = (1-xi)*fromStart + xi*fromEnd
	f.BendingMoment = sec.flexuralRigidity * curvature
	f.ShearForce = sec.flexuralRigidity * g.third

	f.AxialStress = f.AxialForce / sec.area
	f.BendingStress = f.BendingMoment * sec.fibre / sec.secondMoment
	f.CombinedStress = extremeFibreStress(f.AxialStress, f.BendingStress)
	return f
}

// DeflectionExtremum refines an extreme of the finite element deflection
// found by sampling near x: among x itself and the points of the element
// holding x and of its two neighbours where that element's cubic has zero
// slope, it returns the one with the largest deflection (the smallest when
// largest is false). Two samplings of a flat peak then report the same
// place, not each its own sample.
func (s *Solution) DeflectionExtremum(x float64, largest bool) (at, w float64) {
	if s == nil || len(s.fields) == 0 {
		return x, 0
	}
	better := func(v, than float64) bool { return largest && v > than || !largest && v < than }
	e := s.elementAt(x, Right)
	at, w = x, s.InElement(e, x).Deflection
	for k := max(e-1, 0); k <= min(e+1, len(s.fields)-1); k++ {
		for _, xi := range s.stationaryPoints(k) {
			el := s.Mesh.Elements[k]
			p := el.Start + xi*(el.End-el.Start)
			if v := s.InElement(k, p).Deflection; better(v, w) {
				at, w = p, v
			}
		}
	}
	return at, w
}

// stationaryPoints returns the ξ in (0, 1) where the Hermite cubic of
// element e has zero slope: dw/dξ = c2·ξ² + c1·ξ + c0 from the derivatives of
// the shape functions of hermiteValues.
func (s *Solution) stationaryPoints(e int) []float64 {
	h := s.Mesh.Elements[e].End - s.Mesh.Elements[e].Start
	a, b := s.ends(e)
	wa, ta, wb, tb := a[Transverse], h*a[Rotation], b[Transverse], h*b[Rotation]
	c2 := 6*wa + 3*ta - 6*wb + 3*tb
	c1 := -6*wa - 4*ta + 6*wb - 2*tb
	c0 := ta
	var roots []float64
	switch {
	case c2 == 0 && c1 == 0:
		return nil
	case c2 == 0:
		roots = append(roots, -c0/c1)
	default:
		d := c1*c1 - 4*c2*c0
		if d < 0 {
			return nil
		}
		// The root free of cancellation, then the other from the product.
		q := -0.5 * (c1 + math.Copysign(math.Sqrt(d), c1))
		roots = append(roots, q/c2)
		if q != 0 {
			roots = append(roots, c0/q)
		}
	}
	out := roots[:0]
	for _, r := range roots {
		if r > 0 && r < 1 {
			out = append(out, r)
		}
	}
	return out
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
