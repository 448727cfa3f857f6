package fem

import (
	"math"
	"sort"
)

// At evaluates the finite element fields at x from the interpolation of the
// element that holds x. At a node, side picks the element to the Left or to
// the Right (any other value means Right); x is clamped to [0, L].
func (s *Solution) At(x float64, side Side) Fields {
	if s == nil || len(s.elements) == 0 {
		return Fields{X: x}
	}
	return s.inElement(s.elementAt(x, side), x)
}

// elementAt finds the element holding x by binary search; positions within
// the merge tolerance of a node count as that node.
func (s *Solution) elementAt(x float64, side Side) int {
	nodes := s.Mesh.X
	last := len(s.elements) - 1
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
	out := make([]Fields, 0, len(s.elements)*(n+1))
	for e := range s.elements {
		d := &s.elements[e]
		for j := 0; j <= n; j++ {
			x := d.start + d.length*float64(j)/float64(n)
			if j == n {
				x = s.Mesh.X[e+1] // exactly the node, free of round-off
			}
			out = append(out, s.inElement(e, x))
		}
	}
	return out
}

// inElement evaluates the fields at x with element e's interpolation.
func (s *Solution) inElement(e int, x float64) Fields {
	d := &s.elements[e]
	xi := min(max((x-d.start)/d.length, 0), 1)
	x = d.start + xi*d.length
	f := Fields{X: x}

	n, dn := barShape(s.barOrder, xi, d.length)
	first, count := barSystem{s.barOrder}.element(e)
	strain := -d.thermalStrain
	for a := range count {
		f.AxialDisplacement += n[a] * s.bar[first+a]
		strain += dn[a] * s.bar[first+a]
	}
	f.AxialForce = d.axialRigidity * strain

	h, d1, d2, d3 := hermite(xi, d.length)
	w := s.beam[2*e : 2*e+4]
	var curvature, third float64
	for a := range w {
		f.Deflection += h[a] * w[a]
		f.Rotation += d1[a] * w[a]
		curvature += d2[a] * w[a]
		third += d3[a] * w[a]
	}
	f.BendingMoment = d.flexuralRigidity * curvature
	f.ShearForce = d.flexuralRigidity * third

	f.AxialStress = f.AxialForce / d.area
	f.BendingStress = f.BendingMoment * d.fibre / d.secondMoment
	top, bottom := f.AxialStress-f.BendingStress, f.AxialStress+f.BendingStress
	f.CombinedStress = bottom
	if math.Abs(top) > math.Abs(bottom) {
		f.CombinedStress = top
	}
	return f
}
