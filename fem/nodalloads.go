package fem

// NodalLoads are what the line loads and the self-weight of a model put on
// the nodes of a mesh in the finite element solution: each element's
// consistent nodal load vector (the integral of its shape functions times
// the load, as the solver forms it), their sums at the nodes, and beside
// them what lumping half of each element's load onto each of its two nodes
// would put there (forces only, no moments). Point loads, settlements and
// temperature are left out: they are not spread over an element.
type NodalLoads struct {
	// Bar and Beam name the element formulations solved (ElementNames):
	// "linear bar", "Hermite beam"; Beam is "" for a member solved as a bar
	// alone.
	Bar, Beam string
	BarOrder  ElementOrder  // of the bar elements
	Nodes     []NodeLoad    // per node of Mesh.X
	Elements  []ElementLoad // per element of Mesh.Elements
	// Resultant is that of the line loads and the self-weight: the force
	// along x and across (N) and the moment about x = 0 (N·m, counter-clockwise).
	// Consistent and Lumped are the same sums of the nodal loads each way
	// (the middle nodes of quadratic bars included): the consistent ones
	// equal the resultant, the lumped ones its forces but not, in general,
	// its moment.
	Resultant, Consistent, Lumped [3]float64
}

// NodeLoad is what the line loads put on one node.
type NodeLoad struct {
	X float64 // m
	// Consistent is the sum of the consistent vectors of the elements that
	// meet here: axial force, transverse force (N) and moment (N·m).
	Consistent [3]float64
	// Lumped is half of each neighbouring element's axial and transverse
	// load; lumping puts no moment (index Rotation is zero).
	Lumped [3]float64
}

// ElementLoad is one element's share of the line loads.
type ElementLoad struct {
	Start, End float64 // m
	// Axial and Transverse are the line loads p and q at the element's start
	// and end, self-weight included, N/m; they vary linearly in between,
	// every break of a load being a node.
	Axial, Transverse [2]float64
	// Bar is the consistent vector of the bar element, ∫N·p dx, at its start
	// and end node, N; BarMiddle that at the middle node of a quadratic bar
	// (zero for a linear one).
	Bar       [2]float64
	BarMiddle float64
	// Beam is the consistent vector of the beam element, ∫N·q dx, for
	// (w₁, θ₁, w₂, θ₂): N, N·m, N, N·m. Its shape functions are the Hermite
	// cubics, or on a segment with shear deformation those of the
	// interdependent interpolation element (Shear above zero).
	Beam [4]float64
	// Shear is the element's shear parameter φ = 12·EI/(G·As·h²): 0 for an
	// Euler–Bernoulli element, whose vector is the Hermite one.
	Shear float64
	// Lumped is half of the element's axial and of its transverse load, N,
	// put on each of its end nodes by lumping.
	Lumped [2]float64
}

// NodalLoadsOn works out the nodal loads of m's own line loads and
// self-weight on mesh, which must hold a node at every key point
// (BuildMesh and MeshFromNodes make such meshes; a solution's Mesh is
// one). For a load case of a model with cases, pass m.LoadSet(i).
func NodalLoadsOn(m *Model, mesh Mesh) (*NodalLoads, error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, err
	}
	pm := &p.model
	if err := checkMesh(pm, p.keys, mesh); err != nil {
		return nil, err
	}
	return nodalLoads(pm, mesh, GatherLoads(pm, p.keys), p.bending), nil
}

// nodalLoads are those of the line loads and self-weight in l, gathered on
// the key points of the prepared model pm, on mesh; bending says the
// member's bending is solved (Member.Bending).
func nodalLoads(pm *Model, mesh Mesh, l Loads, bending bool) *NodalLoads {
	l.Points, l.TemperatureChange = nil, 0 // line loads and self-weight alone
	els, _ := elementTable(pm, mesh, mesh.X, &l)
	order := pm.Mesh.BarOrder
	if order == 0 {
		order = LinearBar
	}
	bar, beam := elementNames(pm, bending)
	out := &NodalLoads{Bar: bar, Beam: beam, BarOrder: order, Resultant: l.Resultant(),
		Nodes: make([]NodeLoad, len(mesh.X)), Elements: make([]ElementLoad, len(els))}
	for i, x := range mesh.X {
		out.Nodes[i].X = x
	}
	for i := range els {
		d := &els[i]
		fb, fw := d.barLoads(order), d.beamLoads()
		e := ElementLoad{Start: d.start, End: d.start + d.length, Axial: d.axialLoad, Transverse: d.transverseLoad,
			Beam: [4]float64(fw), Shear: d.phi(d.length)}
		last := order.nodes() - 1
		e.Bar = [2]float64{fb[0], fb[last]}
		if last == 2 {
			e.BarMiddle = fb[1]
		}
		e.Lumped = [2]float64{d.length * (d.axialLoad[0] + d.axialLoad[1]) / 4, d.length * (d.transverseLoad[0] + d.transverseLoad[1]) / 4}
		out.Elements[i] = e
		first := mesh.Elements[i].First
		for k, n := range []*NodeLoad{&out.Nodes[first], &out.Nodes[first+1]} {
			n.Consistent[Axial] += e.Bar[k]
			n.Consistent[Transverse] += e.Beam[2*k]
			n.Consistent[Rotation] += e.Beam[2*k+1]
			n.Lumped[Axial] += e.Lumped[0]
			n.Lumped[Transverse] += e.Lumped[1]
		}
	}
	for _, n := range out.Nodes {
		out.Consistent = add3(out.Consistent, n.X, n.Consistent)
		out.Lumped = add3(out.Lumped, n.X, n.Lumped)
	}
	for _, e := range out.Elements {
		out.Consistent = add3(out.Consistent, (e.Start+e.End)/2, [3]float64{e.BarMiddle, 0, 0})
	}
	return out
}

// NodalLoads are the nodal loads of the line loads and self-weight s
// answers, on its own mesh: what the window's strip and `stave solve
// --json` show. For a load case or a combination they are its own loads
// (a combination's the sum of its factored cases), not the model's.
func (s *Solution) NodalLoads() *NodalLoads {
	return nodalLoads(&s.Model, s.Mesh, s.loads, !s.AxialOnly)
}

// ElementNames names the element formulations s was solved with, as
// NodalLoads does: "linear bar", "Hermite beam"; the beam's is "" when the
// member was solved as a bar alone (AxialOnly).
func (s *Solution) ElementNames() (bar, beam string) { return elementNames(&s.Model, !s.AxialOnly) }

// elementNames names the bar and beam elements of m, the beam's "" when
// its bending is not solved.
func elementNames(m *Model, bending bool) (bar, beam string) {
	b, w := m.Formulations()
	if !bending {
		return b.Name(), ""
	}
	return b.Name(), w.Name()
}

// add3 adds the loads f at x to the sums r: forces, and the moment about x = 0.
func add3(r [3]float64, x float64, f [3]float64) [3]float64 {
	return [3]float64{r[0] + f[Axial], r[1] + f[Transverse], r[2] + f[Rotation] + x*f[Transverse]}
}
