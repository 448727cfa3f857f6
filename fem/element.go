package fem

import "math"

// localMatrix and localVector hold one element's stiffness and loads; bars use
// the leading 2×2 or 3×3 part.
type (
	localMatrix [4][4]float64
	localVector [4]float64
)

// elementData is what an element needs from the model: geometry, section,
// material and the loads acting along it. Loads are linear within an element
// because every break point of a distributed load is a node.
type elementData struct {
	start, length float64 // m
	sectionData
	axialLoad      [2]float64 // p at start and end, N/m
	transverseLoad [2]float64 // q at start and end, N/m
	// points are the point loads strictly inside the element, which only
	// the key-point mesh has: Solve keeps loads-only key points out of it.
	points []PointLoad
}

// gauss3 is the 3-point Gauss–Legendre rule on [0, 1], exact for polynomials
// of degree 5: enough for a cubic shape function times a linear load.
var gauss3 = [3]struct{ xi, w float64 }{
	{0.5 - 0.5*math.Sqrt(0.6), 5.0 / 18},
	{0.5, 8.0 / 18},
	{0.5 + 0.5*math.Sqrt(0.6), 5.0 / 18},
}

// nodes returns the number of bar nodes of an element of that order.
func (o ElementOrder) nodes() int {
	if o == QuadraticBar {
		return 3
	}
	return 2
}

// barShape returns the bar shape functions and their x-derivatives at ξ ∈ [0, 1]
// for an element of length h. Quadratic nodes are ordered start, middle, end.
func barShape(order ElementOrder, xi, h float64) (n, dn [3]float64) {
	if order == QuadraticBar {
		n = [3]float64{(1 - xi) * (1 - 2*xi), 4 * xi * (1 - xi), xi * (2*xi - 1)}
		dn = [3]float64{(4*xi - 3) / h, (4 - 8*xi) / h, (4*xi - 1) / h}
		return n, dn
	}
	return [3]float64{1 - xi, xi}, [3]float64{-1 / h, 1 / h}
}

// hermite returns the cubic Hermite shape functions for (w1, θ1, w2, θ2) at
// ξ ∈ [0, 1] for an element of length h, with their first, second and third
// x-derivatives.
func hermite(xi, h float64) (n, d1, d2, d3 [4]float64) {
	x2 := xi * xi
	n = hermiteValues(xi, h)
	d1 = [4]float64{(6*x2 - 6*xi) / h, 1 - 4*xi + 3*x2, (6*xi - 6*x2) / h, 3*x2 - 2*xi}
	d2 = [4]float64{(12*xi - 6) / (h * h), (6*xi - 4) / h, (6 - 12*xi) / (h * h), (6*xi - 2) / h}
	d3 = [4]float64{12 / (h * h * h), 6 / (h * h), -12 / (h * h * h), 6 / (h * h)}
	return n, d1, d2, d3
}

// hermiteValues is n of hermite alone, free of its divisions: the fields of
// an element need only the values.
func hermiteValues(xi, h float64) [4]float64 {
	x2, x3 := xi*xi, xi*xi*xi
	return [4]float64{1 - 3*x2 + 2*x3, h * (xi - 2*x2 + x3), 3*x2 - 2*x3, h * (x3 - x2)}
}

// barStiffness is the closed-form bar stiffness: EA/h·[1 −1; −1 1] for the
// linear element, EA/(3h)·[7 −8 1; −8 16 −8; 1 −8 7] for the quadratic one
// (Hughes, The Finite Element Method, ch. 1 and 3, from memory).
func (d *elementData) barStiffness(order ElementOrder) localMatrix {
	c := d.axialRigidity / d.length
	if order == QuadraticBar {
		c /= 3
		return localMatrix{{7 * c, -8 * c, c}, {-8 * c, 16 * c, -8 * c}, {c, -8 * c, 7 * c}}
	}
	return localMatrix{{c, -c}, {-c, c}}
}

// barLoads is the consistent nodal load vector ∫N·p dx plus the thermal
// forces ∫N'·EA·αΔT dx = EA·αΔT·(N(end) − N(start)) and N·P for the point
// loads inside.
func (d *elementData) barLoads(order ElementOrder) localVector {
	var f localVector
	h := d.length
	for _, g := range gauss3 {
		n, _ := barShape(order, g.xi, h)
		p := d.axialLoad[0] + (d.axialLoad[1]-d.axialLoad[0])*g.xi
		for a := range order.nodes() {
			f[a] += g.w * h * n[a] * p
		}
	}
	thermal := d.axialRigidity * d.thermalStrain
	f[0] -= thermal
	f[order.nodes()-1] += thermal
	for _, p := range d.points {
		n, _ := barShape(order, (p.X-d.start)/h, h)
		for a := range order.nodes() {
			f[a] += n[a] * p.Axial
		}
	}
	return f
}

// beamStiffness is the closed-form Hermite beam stiffness for (w1, θ1, w2, θ2)
// (Hughes, The Finite Element Method; Strang & Fix, ch. 1; from memory).
func (d *elementData) beamStiffness() localMatrix {
	h := d.length
	c := d.flexuralRigidity / (h * h * h)
	return localMatrix{
		{12 * c, 6 * h * c, -12 * c, 6 * h * c},
		{6 * h * c, 4 * h * h * c, -6 * h * c, 2 * h * h * c},
		{-12 * c, -6 * h * c, 12 * c, -6 * h * c},
		{6 * h * c, 2 * h * h * c, -6 * h * c, 4 * h * h * c},
	}
}

// beamLoads is the consistent nodal load vector ∫N·q dx, plus N·P + N'·C
// for the point loads inside (the work of a moment C is C·w').
func (d *elementData) beamLoads() localVector {
	f := hermiteLoads(d.length, d.transverseLoad[0], d.transverseLoad[1])
	for _, p := range d.points {
		n, d1, _, _ := hermite((p.X-d.start)/d.length, d.length)
		for a := range f {
			f[a] += n[a]*p.Transverse + d1[a]*p.Moment
		}
	}
	return f
}

// hermiteLoads is ∫N·q dx for the Hermite shape functions of an element of
// length h under a load going linearly from q0 to q1: the fixed-end forces of
// a trapezoidal load (h(7q0+3q1)/20, h²(3q0+2q1)/60, h(3q0+7q1)/20,
// −h²(2q0+3q1)/60; beam fixed-end force tables, from memory; checked against
// Gauss–Legendre quadrature in TestHermiteLoadsQuadrature).
func hermiteLoads(h, q0, q1 float64) localVector {
	return localVector{
		h * (7*q0 + 3*q1) / 20,
		h * h * (3*q0 + 2*q1) / 60,
		h * (3*q0 + 7*q1) / 20,
		-h * h * (2*q0 + 3*q1) / 60,
	}
}
