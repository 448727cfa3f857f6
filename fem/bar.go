package fem

import "math"

// The bar: 2-node linear and 3-node quadratic elements for
// −(EA (u' − αΔT))' = p, with u the axial displacement.

// barFormulation is the bar element of an order.
type barFormulation struct{ order ElementOrder }

func (f barFormulation) Name() string {
	if f.order == QuadraticBar {
		return "quadratic bar"
	}
	return "linear bar"
}

func (barFormulation) Problem() string    { return "bar" }
func (barFormulation) Motions() []Dof     { return []Dof{Axial} }
func (barFormulation) Hierarchical() bool { return true }

// Varies: u is linear (quadratic) and N constant (linear) in a linear
// (quadratic) bar (Hughes, The Finite Element Method, ch. 1 and 3, from memory).
func (f barFormulation) Varies(q Quantity) Variation {
	d := int(f.order) // the degree of u
	switch q {
	case QAxialDisplacement:
		return Variation{Degree: d, Nodal: true}
	case QAxialForce, QAxialStress:
		return Variation{Degree: d - 1}
	}
	return Variation{Degree: -1}
}

func (f barFormulation) stride() int                          { return f.order.nodes() - 1 }
func (f barFormulation) size(ne int) (int, int)               { return ne*f.stride() + 1, f.stride() }
func (f barFormulation) nodeDof(node, _ int) int              { return node * f.stride() }
func (f barFormulation) element(e int) (int, int)             { return e * f.stride(), f.order.nodes() }
func (f barFormulation) stiffness(d *elementData) localMatrix { return d.barStiffness(f.order) }
func (f barFormulation) loads(d *elementData) localVector     { return d.barLoads(f.order) }

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

// barStiffness is the closed-form bar stiffness: EA/h·[1 −1; −1 1] for the
// linear element, EA/(3h)·[7 −8 1; −8 16 −8; 1 −8 7] for the quadratic one
// (Hughes, The Finite Element Method, ch. 1 and 3, from memory), the
// linear one with the foundation's under the element (addBarGround).
func (d *elementData) barStiffness(order ElementOrder) localMatrix {
	c := d.axialRigidity / d.length
	if order == QuadraticBar {
		c /= 3
		return localMatrix{{7 * c, -8 * c, c}, {-8 * c, 16 * c, -8 * c}, {c, -8 * c, 7 * c}}
	}
	k := localMatrix{{c, -c}, {-c, c}}
	d.addBarGround(&k)
	return k
}

// barLoads is the consistent nodal load vector ∫N·p dx plus the thermal
// forces ∫N'·EA·αΔT dx = EA·αΔT·(N(end) − N(start)) and N·P for the point
// loads inside.
func (d *elementData) barLoads(order ElementOrder) localVector {
	var f localVector
	h := d.length
	if len(d.breaks) == 0 {
		for _, g := range gauss3 {
			n, _ := barShape(order, g.xi, h)
			p := d.axialLoad[0] + (d.axialLoad[1]-d.axialLoad[0])*g.xi
			for a := range order.nodes() {
				f[a] += g.w * h * n[a] * p
			}
		}
	} else {
		d.pieces(d.start, d.start+h, func(pc loadPiece) {
			for _, g := range gauss3 {
				n, _ := barShape(order, (pc.start+g.xi*pc.length-d.start)/h, h)
				p := pc.p0 + (pc.p1-pc.p0)*g.xi
				for a := range order.nodes() {
					f[a] += g.w * pc.length * n[a] * p
				}
			}
		})
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

// linearBarLoadsOn is ∫N·p dx over [x0, x1] within d for the linear bar
// element from x0 to x1 under d's axial line load (without its thermal
// forces), by pieces where the load breaks.
func (d *elementData) linearBarLoadsOn(x0, x1 float64) [2]float64 {
	h := x1 - x0
	if pc, ok := d.pieceOver(x0, x1); ok {
		p0, p1 := pc.at(x0, 0), pc.at(x1, 0)
		return [2]float64{h * (2*p0 + p1) / 6, h * (p0 + 2*p1) / 6}
	}
	var f [2]float64
	d.pieces(x0, x1, func(pc loadPiece) {
		for _, g := range gauss3 {
			xi := (pc.start + g.xi*pc.length - x0) / h
			p := pc.p0 + (pc.p1-pc.p0)*g.xi
			f[0] += g.w * pc.length * (1 - xi) * p
			f[1] += g.w * pc.length * xi * p
		}
	})
	return f
}

// elementLength bounds the interpolation error of the bar (Strang & Fix, An
// Analysis of the Finite Element Method, ch. 1, interpolation error of
// piecewise polynomials, from memory): on a linear element N is constant,
// off by at most |p|·h/2 from the exact N, whose slope is −p, and u is off
// by at most |u″|·h²/8 = |p|·h²/(8·EA); on a quadratic one N is linear, off
// by at most |p′|·h²/8, and u by at most |u‴|·h³/72 ≈ |p′|·h³/(72·EA).
// The axial stress follows N/A; the combined stress takes half the
// tolerance, the beam's error taking the other half.
func (f barFormulation) elementLength(d *elementData, s *fieldScales, tol float64) float64 {
	// The default mesh sizes stretches of linear load; on a foundation the
	// bar feels p − kₐ·u, bounded by |p| + kₐ·|u|max.
	p := max(math.Abs(d.axialLoad[0]), math.Abs(d.axialLoad[1])) + d.axialModulus*s[QAxialDisplacement]
	slope := math.Abs(d.axialLoad[1]-d.axialLoad[0]) / d.length
	ea, area := d.axialRigidity, d.area
	if f.order == QuadraticBar {
		return min(
			sizeLimit(slope/8, 2, tol*s[QAxialForce]),
			sizeLimit(slope/(8*area), 2, tol*s[QAxialStress]),
			sizeLimit(slope/(8*area), 2, tol/2*s[QCombinedStress]),
			sizeLimit(slope/(72*ea), 3, tol*s[QAxialDisplacement]))
	}
	return min(
		sizeLimit(p/2, 1, tol*s[QAxialForce]),
		sizeLimit(p/(2*area), 1, tol*s[QAxialStress]),
		sizeLimit(p/(2*area), 1, tol/2*s[QCombinedStress]),
		sizeLimit(p/(8*ea), 2, tol*s[QAxialDisplacement]))
}
