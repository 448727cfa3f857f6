package fem

import (
	"errors"
	"fmt"
	"math"
	"math/bits"

	"stave/fem/band"
)

// Solution is the finite element answer for one model.
type Solution struct {
	Model        Model // a copy of the solved model
	Mesh         Mesh
	Displacement [][3]float64 // per node of Mesh.X: u (m), w (m), θ (rad)
	Reactions    []Reaction   // one per support, in the order of Model.Supports
	StrainEnergy float64      // energy stored in the member (springs excluded), J
	Equilibrium  Equilibrium
	// Condition bounds how much round-off can grow in the results: relative
	// errors up to about Condition·ε (ε = 2.2e-16) are possible in
	// displacements, forces and moments. It is the larger estimated 1-norm
	// condition number of the bar and beam key-point systems, the only ones
	// solved by elimination, after symmetric scaling to a unit diagonal,
	// plus a term for the levels of the hierarchical refinement (see
	// hierarchy.go), each of which adds a few rounding errors.
	Condition float64
	Warnings  []string

	sections []sectionData // per segment of Model
	barOrder ElementOrder
	fields   []elementField // per element of Mesh
}

// sectionData is what the fields need from a segment.
type sectionData struct {
	axialRigidity, flexuralRigidity float64 // EA (N), EI (N·m²)
	area, secondMoment, fibre       float64 // A (m²), I (m⁴), c (m)
	thermalStrain                   float64 // α·ΔT
}

// conditionLimit is the condition number beyond which results are flagged:
// relative errors of up to cond·ε, 2e-4 at the limit, may then show in the
// last digits an engineer reads.
const conditionLimit = 1e12

// levelRoundOff is the growth of relative round-off per level of the
// hierarchical refinement, a bound with margin over the largest measured
// (TestFineBeamAccuracy: below 1 per level on the reference members).
const levelRoundOff = 4

// conditionWarning says how far results of a problem with condition number
// cond can be trusted, or returns "" when they can.
func conditionWarning(problem string, cond float64) string {
	const eps = 0x1p-52
	switch {
	case cond*eps >= 1:
		return fmt.Sprintf("the %s stiffness matrix is singular to working precision (estimated condition number %.2g, beyond 1/ε of float64): the results are meaningless; check for springs or sections of extreme stiffness, or supports and loads almost at one point", problem, cond)
	case cond > conditionLimit:
		return fmt.Sprintf("the %s stiffness matrix is ill-conditioned (estimated condition number %.2g): results are unreliable, with relative errors possibly up to %.0e; avoid extreme stiffness contrasts and supports or loads very close together", problem, cond, cond*eps)
	}
	return ""
}

// MechanismError says the supports leave a rigid-body motion free.
type MechanismError struct {
	Motion  string // "axial", "transverse" or "rotation"
	Message string
}

func (e *MechanismError) Error() string { return e.Message }

// Solve validates, meshes, assembles and solves the model.
func Solve(m *Model) (*Solution, error) {
	mesh, err := BuildMesh(m)
	if err != nil {
		return nil, err
	}
	return SolveOnMesh(m, mesh)
}

// SolveOnMesh solves the model on a given mesh, which must hold a node at
// every key point (BuildMesh and MeshFromNodes make such meshes). The
// key-point system is assembled and solved by band.LDL; the nodes between key
// points follow from the hierarchical basis of hierarchy.go in O(n).
func SolveOnMesh(m *Model, mesh Mesh) (*Solution, error) {
	if err := m.Validate(); err != nil {
		return nil, err
	}
	if err := checkMesh(m, mesh); err != nil {
		return nil, err
	}
	if err := checkMechanism(m); err != nil {
		return nil, err
	}
	keys, err := keyNodes(m, mesh.X)
	if err != nil {
		return nil, err
	}
	s := &Solution{Model: m.Clone(), Mesh: mesh, barOrder: m.Mesh.BarOrder, sections: sectionTable(m)}
	if s.barOrder == 0 {
		s.barOrder = LinearBar
	}
	keyX := make([]float64, len(keys))
	for j, i := range keys {
		keyX[j] = mesh.X[i]
	}
	coarse := meshOn(m, keyX)
	stretches, keyPointLoads := elementTable(m, coarse, mesh.X)
	s.Reactions = make([]Reaction, len(m.Supports))
	for i, sup := range m.Supports {
		s.Reactions[i] = Reaction{Support: i, X: sup.X}
	}
	s.Displacement = make([][3]float64, len(mesh.X))
	for _, p := range []system{barSystem{LinearBar}, beamSystem{}} {
		u, cond, err := solveBanded(m, coarse, stretches, keyPointLoads, p)
		if err != nil {
			return nil, err
		}
		s.Condition = max(s.Condition, cond)
		if w := conditionWarning(p.name(), cond); w != "" {
			s.Warnings = append(s.Warnings, w)
		}
		for j, i := range keys {
			for mi, d := range p.motions() {
				s.Displacement[i][d] = u[p.nodeDof(j, mi)]
			}
		}
	}
	keyDisp := make([][3]float64, len(keys))
	for j, i := range keys {
		keyDisp[j] = s.Displacement[i]
	}
	staticReactions(m, keyX, stretches, keyPointLoads, keyDisp, s.Reactions)
	s.fields = make([]elementField, len(mesh.Elements))
	energy, poison := refineAll(stretchRefiner{x: mesh.X, disp: s.Displacement, fields: s.fields, order: s.barOrder}, stretches, keys)
	depth := 0
	for j := range stretches {
		depth = max(depth, bits.Len(uint(keys[j+1]-keys[j]-1)))
	}
	s.StrainEnergy = 0.5 * energy
	if err := checkFinite(poison, s); err != nil {
		return nil, err
	}
	s.Condition += levelRoundOff * float64(depth)
	s.Equilibrium = equilibrium(m, s.Reactions)
	return s, nil
}

// checkFinite refuses results that overflowed float64, which validated but
// extreme inputs (E of 1e-300 Pa, a moment of 1e308 N·m) can produce; poison
// is the refinement's (stretchRefiner.poison).
func checkFinite(poison float64, s *Solution) error {
	for _, d := range s.Displacement[len(s.Displacement)-1] {
		poison += d * 0
	}
	for _, re := range s.Reactions {
		for _, f := range re.Force {
			poison += f * 0
		}
	}
	if poison != 0 || !isFinite(s.StrainEnergy) {
		return errNotFinite
	}
	return nil
}

// errNotFinite is the refusal of results that overflowed, by either solver.
var errNotFinite = errors.New("the results are too large for floating point (a displacement, force, moment or stress is infinite or undefined): check the units and magnitudes of the section, material, springs and loads")

// sectionTable gathers the section data of every segment.
func sectionTable(m *Model) []sectionData {
	out := make([]sectionData, len(m.Segments))
	for i, seg := range m.Segments {
		sec, mat := seg.Section, seg.Material
		out[i] = sectionData{
			axialRigidity:    mat.Elastic * sec.Area,
			flexuralRigidity: mat.Elastic * sec.SecondMoment,
			area:             sec.Area,
			secondMoment:     sec.SecondMoment,
			fibre:            sec.FibreDistance,
			thermalStrain:    mat.ThermalExpansion * m.TemperatureChange,
		}
	}
	return out
}

// system is one of the two independent problems on the mesh.
type system interface {
	name() string
	motions() []Dof // the nodal motions this problem owns, in node order
	size(elements int) (n, halfBandwidth int)
	nodeDof(node, motion int) int
	// element returns the first unknown of element e and how many it has;
	// an element's unknowns are consecutive.
	element(e int) (first, count int)
	local(d *elementData) (localMatrix, localVector)
}

type barSystem struct{ order ElementOrder }

func (barSystem) name() string               { return "bar" }
func (barSystem) motions() []Dof             { return []Dof{Axial} }
func (p barSystem) stride() int              { return p.order.nodes() - 1 }
func (p barSystem) size(ne int) (int, int)   { return ne*p.stride() + 1, p.stride() }
func (p barSystem) nodeDof(node, _ int) int  { return node * p.stride() }
func (p barSystem) element(e int) (int, int) { return e * p.stride(), p.order.nodes() }
func (p barSystem) local(d *elementData) (localMatrix, localVector) {
	return d.barStiffness(p.order), d.barLoads(p.order)
}

type beamSystem struct{}

func (beamSystem) name() string                 { return "beam" }
func (beamSystem) motions() []Dof               { return []Dof{Transverse, Rotation} }
func (beamSystem) size(ne int) (int, int)       { return 2*ne + 2, 3 }
func (beamSystem) nodeDof(node, motion int) int { return 2*node + motion }
func (beamSystem) element(e int) (int, int)     { return 2 * e, 4 }
func (beamSystem) local(d *elementData) (localMatrix, localVector) {
	return d.beamStiffness(), d.beamLoads()
}

// solveBanded assembles problem p on mesh (with element data els and point
// loads at the nodes nodal), solves
// it by band.LDL and returns the unknowns and the condition estimate of the
// scaled matrix. Solve uses it for the key-point mesh; on a fine mesh it is
// the plain assembled solution.
func solveBanded(m *Model, mesh Mesh, els []elementData, nodal [][3]float64, p system) ([]float64, float64, error) {
	n, kb := p.size(len(els))
	a := band.NewSymmetric(n, kb)
	rhs := make([]float64, n)
	for e := range els {
		first, count := p.element(e)
		k, f := p.local(&els[e])
		for i := range count {
			rhs[first+i] += f[i]
			for j := i; j < count; j++ {
				a.Add(first+i, first+j, k[i][j])
			}
		}
	}
	for node, load := range nodal {
		for mi, d := range p.motions() {
			rhs[p.nodeDof(node, mi)] += load[d]
		}
	}
	type prescribed struct {
		dof   int
		value float64
	}
	var fixed []prescribed
	for _, sup := range m.Supports {
		node := nearest(mesh.X, sup.X)
		for mi, d := range p.motions() {
			dof := p.nodeDof(node, mi)
			switch {
			case sup.Kind == Spring:
				a.Add(dof, dof, sup.Stiffness[d])
			case sup.Kind.Restrains(d):
				fixed = append(fixed, prescribed{dof, sup.Settlement[d]})
			}
		}
	}
	// Prescribed motions keep the band: the column times the value moves to
	// the right-hand side, row and column are cleared, and the diagonal keeps
	// its own value so the scale of the matrix is not disturbed.
	isFixed := make([]bool, n)
	for _, c := range fixed {
		isFixed[c.dof] = true
	}
	for _, c := range fixed {
		for j := max(0, c.dof-kb); j <= min(n-1, c.dof+kb); j++ {
			if j == c.dof {
				continue
			}
			i, jj := min(j, c.dof), max(j, c.dof)
			idx := i*(kb+1) + jj - i
			if !isFixed[j] {
				rhs[j] -= a.Data[idx] * c.value
			}
			a.Data[idx] = 0
		}
	}
	for _, c := range fixed {
		rhs[c.dof] = a.Data[c.dof*(kb+1)] * c.value
	}
	var f band.LDL
	u := make([]float64, n)
	if err := f.FactorizeSolve(a, u, rhs); err != nil {
		var pe *band.PivotError
		if errors.As(err, &pe) {
			return nil, 0, pivotMessage(mesh.X, p, pe)
		}
		return nil, 0, err
	}
	scale := make([]float64, n)
	for i := range scale {
		scale[i] = 1 / math.Sqrt(a.Data[i*(kb+1)])
	}
	return u, f.Cond(a, scale), nil
}

// pivotMessage turns a failed pivot into a message that names the place.
func pivotMessage(nodes []float64, p system, pe *band.PivotError) error {
	x := nodes[len(nodes)-1]
	for node := range nodes {
		if p.nodeDof(node, 0) >= pe.Row {
			x = nodes[node]
			break
		}
	}
	return fmt.Errorf("the %s stiffness matrix is singular to working precision near x = %s (pivot %.3g of diagonal %.3g): check for very soft springs, very stiff contrasts, or supports and loads almost at one point", p.name(), fmtMetres(x), pe.Pivot, pe.Diagonal)
}

// component returns the part of the point load that acts on motion d.
func (p PointLoad) component(d Dof) float64 {
	return [3]float64{p.Axial, p.Transverse, p.Moment}[d]
}

// elementTable gathers each element's properties and the loads along it,
// and returns the point loads at each node apart. A point load is placed at
// the node of fine that holds it (so the key-point mesh and the fine mesh
// see it at the same x); when no node of mesh is there, it lies inside an
// element.
func elementTable(m *Model, mesh Mesh, fine []float64) ([]elementData, [][3]float64) {
	els := make([]elementData, len(mesh.Elements))
	nodal := make([][3]float64, len(mesh.X))
	sections := sectionTable(m)
	for i, e := range mesh.Elements {
		seg := m.Segments[e.Segment]
		weight := seg.Material.Density * seg.Section.Area // kg/m
		els[i] = elementData{
			start:          e.Start,
			length:         e.End - e.Start,
			sectionData:    sections[e.Segment],
			axialLoad:      [2]float64{weight * m.Gravity[0], weight * m.Gravity[0]},
			transverseLoad: [2]float64{weight * m.Gravity[1], weight * m.Gravity[1]},
		}
	}
	for _, p := range m.PointLoads {
		p.X = fine[nearest(fine, p.X)]
		node := nearest(mesh.X, p.X)
		if mesh.X[node] == p.X {
			for d := Axial; d <= Rotation; d++ {
				nodal[node][d] += p.component(d)
			}
			continue
		}
		e := node
		if p.X < mesh.X[node] {
			e--
		}
		els[e].points = append(els[e].points, p)
	}
	for _, d := range m.DistributedLoad {
		for k := 1; k < len(d.Points); k++ {
			a, b := d.Points[k-1], d.Points[k]
			slope := (b.Intensity - a.Intensity) / (b.X - a.X)
			for e := nearest(mesh.X, a.X); e < nearest(mesh.X, b.X); e++ {
				target := &els[e].axialLoad
				if d.Direction == Transverse {
					target = &els[e].transverseLoad
				}
				target[0] += a.Intensity + slope*(mesh.X[e]-a.X)
				target[1] += a.Intensity + slope*(mesh.X[e+1]-a.X)
			}
		}
	}
	return els, nodal
}

// equilibrium sums the applied loads (exact integrals of the model's loads)
// and the reactions: forces along x and y, and moments about x = 0.
func equilibrium(m *Model, reactions []Reaction) Equilibrium {
	var q Equilibrium
	for _, p := range m.PointLoads {
		q.Applied[0] += p.Axial
		q.Applied[1] += p.Transverse
		q.Applied[2] += p.Moment + p.X*p.Transverse
	}
	for _, d := range m.DistributedLoad {
		for k := 1; k < len(d.Points); k++ {
			a, b := d.Points[k-1], d.Points[k]
			h := b.X - a.X
			force := 0.5 * h * (a.Intensity + b.Intensity)
			if d.Direction == Axial {
				q.Applied[0] += force
				continue
			}
			q.Applied[1] += force
			// ∫x·q dx for q linear on [a, b].
			q.Applied[2] += h / 6 * (a.Intensity*(2*a.X+b.X) + b.Intensity*(a.X+2*b.X))
		}
	}
	for _, seg := range m.Segments {
		w := seg.Material.Density * seg.Section.Area * (seg.End - seg.Start)
		q.Applied[0] += w * m.Gravity[0]
		q.Applied[1] += w * m.Gravity[1]
		q.Applied[2] += w * m.Gravity[1] * 0.5 * (seg.Start + seg.End)
	}
	for _, r := range reactions {
		q.Reactions[0] += r.Force[0]
		q.Reactions[1] += r.Force[1]
		q.Reactions[2] += r.Force[2] + r.X*r.Force[1]
	}
	for i := range q.Residual {
		q.Residual[i] = q.Applied[i] + q.Reactions[i]
	}
	return q
}

// checkMechanism looks for rigid-body motions the supports leave free. The
// bar's rigid motion is u = a; the beam's are w = a + b·x, which one point of
// deflection restraint, or one rotation restraint, cannot both stop.
func checkMechanism(m *Model) error {
	restrains := func(s Support, d Dof) bool {
		if s.Kind == Spring {
			return s.Stiffness[d] > 0
		}
		return s.Kind.Restrains(d)
	}
	var axial, rotation bool
	var deflection []float64
	for _, s := range m.Supports {
		axial = axial || restrains(s, Axial)
		rotation = rotation || restrains(s, Rotation)
		if restrains(s, Transverse) {
			deflection = append(deflection, s.X)
		}
	}
	switch {
	case !axial:
		return &MechanismError{Motion: "axial", Message: "the member can slide along its axis: add an axial restraint (pinned, fixed, axial or spring support)"}
	case len(deflection) == 0:
		return &MechanismError{Motion: "transverse", Message: "the member can move sideways: add a support that restrains deflection"}
	case len(deflection) == 1 && !rotation:
		return &MechanismError{Motion: "rotation", Message: fmt.Sprintf("the member can rotate about the support at x = %s: add a second support or fix one end", fmtMetres(deflection[0]))}
	}
	return nil
}
