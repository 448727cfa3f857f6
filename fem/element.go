package fem

import "math"

// localMatrix and localVector hold one element's stiffness and loads; bars use
// the leading 2×2 or 3×3 part.
type (
	localMatrix [4][4]float64
	localVector [4]float64
)

// Formulation is what one kind of element contributes to a solve, kept in
// one place per kind (bar.go, beam.go) so that the solver, the drawing and
// the post-processing ask it instead of assuming a kind: the nodal motions
// it owns and how its unknowns are numbered, its stiffness and consistent
// nodal loads, how each result quantity varies inside it, and whether the
// hierarchical refinement of hierarchy.go applies to it.
type Formulation interface {
	// Name is the element in the trade's words: "linear bar", "Hermite beam".
	Name() string
	// Problem names the equation it discretises: "bar" or "beam".
	Problem() string
	// Motions are the nodal motions it owns, in the order of a node's unknowns.
	Motions() []Dof
	// Varies says how quantity q varies inside one element.
	Varies(q Quantity) Variation
	// Hierarchical reports whether a stretch of such elements is solved in
	// the hierarchical basis (hierarchy.go) rather than assembled.
	Hierarchical() bool

	// size is the number of unknowns and the half-bandwidth for a mesh of
	// the given number of elements.
	size(elements int) (n, halfBandwidth int)
	// nodeDof is the unknown of motion number motion at end node node.
	nodeDof(node, motion int) int
	// element returns the first unknown of element e and how many it has;
	// an element's unknowns are consecutive.
	element(e int) (first, count int)
	stiffness(d *elementData) localMatrix
	loads(d *elementData) localVector
	// elementLength is the longest element on the stretch d that keeps the
	// interpolation error of every quantity the element carries within tol
	// of that quantity's largest exact magnitude (automesh.go); +Inf when
	// any length will do.
	elementLength(d *elementData, scale *fieldScales, tol float64) float64
}

// Variation is how a result quantity varies inside one element.
type Variation struct {
	// Degree is the degree of the polynomial in x that the quantity is
	// inside an element, or −1 when it is not one polynomial (the combined
	// stress, the larger of two fibres) or the element does not carry it.
	Degree int
	// Nodal reports that the quantity takes the nodal values at the element's
	// ends (the displacements), so it is continuous across nodes.
	Nodal bool
}

// Formulations returns the element formulations a model is solved with: its
// bar and its beam.
func (m *Model) Formulations() (bar, beam Formulation) {
	order := m.Mesh.BarOrder
	if order == 0 {
		order = LinearBar
	}
	shear := 0
	for _, s := range m.Segments {
		if s.ShearFlexibility() > 0 {
			shear++
		}
	}
	extent := someShear
	switch shear {
	case 0:
		extent = noShear
	case len(m.Segments):
		extent = allShear
	}
	return barFormulation{order}, hermiteBeam{extent}
}

// elementData is what an element needs from the model: geometry, section,
// material and the loads acting along it. An element of the fine mesh has
// linear loads, as every break point of a distributed load is a node; a
// stretch of the key-point system may hold break points and point loads
// (pieces.go).
type elementData struct {
	start, length float64 // m
	sectionData
	axialLoad      [2]float64 // p just inside the start and the end, N/m
	transverseLoad [2]float64 // q just inside the start and the end, N/m
	// breaks are where the line loads change slope or jump inside, in order.
	breaks []loadBreak
	// points are the point loads strictly inside the element, which only
	// the key-point mesh has: Solve keeps loads-only key points out of it.
	points []PointLoad
	// released says the element starts at a hinge: its own start rotation
	// is tied to the node's by a rotational spring of stiffness release
	// (N·m/rad, 0 for a pure hinge). Only stretches of the key-point mesh
	// start at hinges.
	released bool
	release  float64
	// startRotation is the released element's own start rotation, rad, once
	// solved.
	startRotation float64
	// modulus and axialModulus are those of the foundations under the
	// element, N/m² (foundation.go); ground is, once solved, the resultant
	// of their forces on it: along x, along y, and the moment of the latter
	// about the element's end (setGround).
	modulus, axialModulus float64
	ground                [3]float64
}

// gauss3 is the 3-point Gauss–Legendre rule on [0, 1], exact for polynomials
// of degree 5: enough for a cubic shape function times a linear load.
var gauss3 = [3]struct{ xi, w float64 }{
	{0.5 - 0.5*math.Sqrt(0.6), 5.0 / 18},
	{0.5, 8.0 / 18},
	{0.5 + 0.5*math.Sqrt(0.6), 5.0 / 18},
}
