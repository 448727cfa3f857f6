package fem

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"stave/fem/band"
	"stave/fem/units"
)

// assembly is one problem's stiffness on a mesh with the supports applied,
// factorized once: solve gives the unknowns for any load vector at the cost
// of the substitutions. Assembly and loads are apart so that load cases and
// unit loads share one factorization.
type assembly struct {
	form  Formulation
	nodes []float64 // x of the mesh's end nodes
	n, kb int
	ldl   band.LDL
	fixed []fixedDof
	// coupling holds the entries of the fixed columns that were cleared, so
	// a prescribed motion's column times its value can move to the
	// right-hand side of any load vector.
	coupling []coupling
	cond     float64 // condition estimate of the scaled matrix
	// grounded says a foundation stiffens some element: solve then refines
	// (groundrefine.go), and needs the springs for it.
	grounded bool
	springs  []spring
}

// spring is an elastic restraint on one unknown.
type spring struct {
	dof       int
	stiffness float64
}

// fixedDof is an unknown a rigid restraint holds.
type fixedDof struct {
	dof      int
	support  int // index in Model.Supports, or datum
	motion   Dof
	diagonal float64 // the matrix's diagonal there, kept as it was
}

// datum stands for the support of a restraint that is no support: the
// axial datum u(0) = 0 of a member that slides free (Model.slidesFree). It
// is held without settlement and carries no force.
const datum = -1

// settlementOf is the prescribed motion d of support s, 0 for the datum.
func settlementOf(settlement [][3]float64, s int, d Dof) float64 {
	if s == datum {
		return 0
	}
	return settlement[s][d]
}

// coupling is the entry at row of the column of fixed[fixed] before it was cleared.
type coupling struct {
	row, fixed int
	value      float64
}

// assemble builds and factorizes the stiffness of form on the elements els
// between nodes, with the springs and rigid restraints of m's supports.
func assemble(m *Model, nodes []float64, els []elementData, form Formulation, u units.System) (*assembly, error) {
	a, as := build(m, nodes, els, form)
	if err := as.ldl.Factorize(a); err != nil {
		var pe *band.PivotError
		if errors.As(err, &pe) {
			return nil, pivotMessage(m, nodes, form, pe, u)
		}
		return nil, err
	}
	scale := make([]float64, as.n)
	for i := range scale {
		scale[i] = 1 / math.Sqrt(a.Data[i*(as.kb+1)])
	}
	as.cond = as.ldl.Cond(a, scale)
	if as.grounded && as.cond*0x1p-52 <= refinableError {
		as.cond = refinedCondition(as.cond)
	}
	return as, nil
}

// build assembles the stiffness of form on the elements els between nodes
// with the supports of m applied, and the assembly that will solve it.
func build(m *Model, nodes []float64, els []elementData, form Formulation) (*band.Symmetric, *assembly) {
	n, kb := form.size(len(els))
	a := band.NewSymmetric(n, kb)
	for e := range els {
		first, count := form.element(e)
		k := form.stiffness(&els[e])
		for i := range count {
			for j := i; j < count; j++ {
				a.Add(first+i, first+j, k[i][j])
			}
		}
	}
	as := &assembly{form: form, nodes: nodes, n: n, kb: kb}
	for e := range els {
		as.grounded = as.grounded || els[e].modulus > 0 || els[e].axialModulus > 0
	}
	for s, sup := range m.Supports {
		node := nearest(nodes, sup.X)
		for mi, d := range form.Motions() {
			dof := form.nodeDof(node, mi)
			switch {
			case sup.Elastic(d):
				a.Add(dof, dof, sup.Stiffness[d])
				as.springs = append(as.springs, spring{dof, sup.Stiffness[d]})
			case sup.Kind.Restrains(d):
				as.fixed = append(as.fixed, fixedDof{dof: dof, support: s, motion: d})
			}
		}
	}
	if m.slidesFree() {
		for mi, d := range form.Motions() {
			if d == Axial { // the datum u(0) = 0 (Model.slidesFree)
				as.fixed = append(as.fixed, fixedDof{dof: form.nodeDof(0, mi), support: datum, motion: d})
			}
		}
	}
	// Prescribed motions keep the band: the column times the value moves to
	// the right-hand side, row and column are cleared, and the diagonal keeps
	// its own value so the scale of the matrix is not disturbed.
	isFixed := make([]bool, n)
	for _, c := range as.fixed {
		isFixed[c.dof] = true
	}
	for q, c := range as.fixed {
		for j := max(0, c.dof-kb); j <= min(n-1, c.dof+kb); j++ {
			if j == c.dof {
				continue
			}
			i, jj := min(j, c.dof), max(j, c.dof)
			idx := i*(kb+1) + jj - i
			if !isFixed[j] && a.Data[idx] != 0 {
				as.coupling = append(as.coupling, coupling{row: j, fixed: q, value: a.Data[idx]})
			}
			a.Data[idx] = 0
		}
	}
	for q, c := range as.fixed {
		as.fixed[q].diagonal = a.Data[c.dof*(kb+1)]
	}
	return a, as
}

// solve writes to u (length as.n) the unknowns under the element loads of
// els, the point loads at the nodes nodal and the supports' settlements.
// Over a foundation it refines the solution (groundrefine.go).
func (as *assembly) solve(els []elementData, nodal [][3]float64, settlement [][3]float64, u []float64) error {
	loads := as.loads(els, nodal)
	rhs := as.restrained(slices.Clone(loads), settlement)
	if err := as.ldl.SolveTo(u, rhs); err != nil {
		return err
	}
	if lostToUnderflow(rhs, u) {
		return errUnderflow
	}
	if !as.grounded {
		return nil
	}
	for _, f := range as.fixed {
		u[f.dof] = settlementOf(settlement, f.support, f.motion)
	}
	return as.refine(els, loads, u)
}

// lostToUnderflow tells whether the solution u of a system with the
// right-hand side rhs underflowed float64: rhs is not zero, but the largest
// unknown is zero or below smallestNormal (loads of 1e-200 N/m on a
// stiffness of 1e150 N/m move it by 1e-345 m).
func lostToUnderflow(rhs, u []float64) bool {
	largest := func(v []float64) float64 {
		m := 0.0
		for _, x := range v {
			m = max(m, math.Abs(x))
		}
		return m
	}
	return largest(rhs) > 0 && largest(u) < smallestNormal
}

// rhs is the load vector of els, nodal and settlement with the supports applied.
func (as *assembly) rhs(els []elementData, nodal [][3]float64, settlement [][3]float64) []float64 {
	return as.restrained(as.loads(els, nodal), settlement)
}

// loads is the load vector of the element loads of els and the point loads
// at the nodes nodal.
func (as *assembly) loads(els []elementData, nodal [][3]float64) []float64 {
	rhs := make([]float64, as.n)
	for e := range els {
		first, count := as.form.element(e)
		f := as.form.loads(&els[e])
		for i := range count {
			rhs[first+i] += f[i]
		}
	}
	motions := as.form.Motions()
	for node, load := range nodal {
		for mi, d := range motions {
			rhs[as.form.nodeDof(node, mi)] += load[d]
		}
	}
	return rhs
}

// restrained applies the supports' prescribed motions settlement to the
// load vector rhs, in place, and returns it: the columns of the restrained
// unknowns times their motions move to the right-hand side, and their own
// rows ask for the motions.
func (as *assembly) restrained(rhs []float64, settlement [][3]float64) []float64 {
	for _, c := range as.coupling {
		f := as.fixed[c.fixed]
		rhs[c.row] -= c.value * settlementOf(settlement, f.support, f.motion)
	}
	for _, f := range as.fixed {
		rhs[f.dof] = f.diagonal * settlementOf(settlement, f.support, f.motion)
	}
	return rhs
}

// PlainSystem assembles one problem of m ("bar" or "beam") the ordinary way,
// on every element of mesh, with the supports applied: the system A·x = b
// whose solution is the finite element answer that Solve finds through the
// hierarchical basis instead. It is for benchmarks and cross-checks: on fine
// beam meshes its condition number grows like n⁴ and eliminating it loses
// every digit (see hierarchy.go).
func PlainSystem(m *Model, mesh Mesh, problem string) (a *band.Symmetric, b []float64, err error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, nil, err
	}
	if err := checkMesh(m, p.keys, mesh); err != nil {
		return nil, nil, err
	}
	bar, beam := m.Formulations()
	form := map[string]Formulation{"bar": bar, "beam": beam}[problem]
	if form == nil {
		return nil, nil, fmt.Errorf("fem: there is no %q problem: ask for \"bar\" or \"beam\"", problem)
	}
	els, nodal := elementTable(m, mesh, mesh.X, &p.loads)
	a, as := build(m, mesh.X, els, form)
	return a, as.rhs(els, nodal, p.loads.Settlement), nil
}

// pivotMessage turns a failed pivot into a message that names the place and
// the likeliest cause: a mesh too fine over an elastic foundation (whose
// every node enters the equations), a stretch of the key-point system much
// shorter than the member (a stiff piece no load can bend), else springs or
// stiffnesses far apart. It quotes places in the units of u.
func pivotMessage(m *Model, nodes []float64, form Formulation, pe *band.PivotError, u units.System) error {
	place := func(x float64) string { return quote(u, units.Position, x) }
	node := len(nodes) - 1
	for i := range nodes {
		if form.nodeDof(i, 0) >= pe.Row {
			node = i
			break
		}
	}
	x := nodes[node]
	length := nodes[len(nodes)-1] - nodes[0]
	// A piece that short on a foundation spoils the equations wherever the
	// pivot that failed lies (the elimination carries its rounding along).
	if a, b, ok := shortOnFoundation(m, nodes); ok {
		from, to := quotePair(u, units.Position, a, b)
		return fmt.Errorf("the %s equations over the elastic foundation are singular to working precision at the stretch from x = %s to %s, only %s long: every node on a foundation enters them, and items that close together (point loads, supports, ends of line loads or foundations) make a piece far too stiff beside the bed's; move them apart or, if they are one, make them one point", form.Problem(), from, to, quote(u, units.Dimension, b-a))
	}
	if k, ka := m.foundationAt(x); k > 0 || ka > 0 {
		return fmt.Errorf("the %s equations over the elastic foundation near x = %s are singular to working precision: on a foundation every node of the mesh enters them (%d nodes here), and they grow ill-conditioned as the fourth power of the number of elements; use fewer elements over the foundation, or leave the mesh to Stave", form.Problem(), place(x), len(nodes))
	}
	for i := max(node-1, 0); i < min(node+1, len(nodes)-1); i++ {
		if h := nodes[i+1] - nodes[i]; h < shortStretch*length {
			a, b := quotePair(u, units.Position, nodes[i], nodes[i+1])
			return fmt.Errorf("the %s stiffness matrix is singular to working precision at the stretch from x = %s to %s, only %s long on a member of %s: supports or changes of section that close together make a piece too stiff to solve; move them apart or, if they are one, make them one point", form.Problem(), a, b, place(h), place(length))
		}
	}
	return fmt.Errorf("the %s stiffness matrix is singular to working precision near x = %s (pivot %s of diagonal %s): check for very soft springs next to stiff parts, or stiffnesses many orders of magnitude apart", form.Problem(), place(x), units.FormatG("%.3g", pe.Pivot), units.FormatG("%.3g", pe.Diagonal))
}

// shortOnFoundation finds the shortest stretch between neighbouring key
// points of m (KeyPoints: loads, supports, breaks) that lies on a
// foundation and is shorter than the default mesh lets an element there
// be (elementData.shortestOnFoundation): every node on a foundation enters
// the factorized equations, and such a piece is stiffer than the bed's
// terms by more than their rounding can carry. No mesh can help it, since
// every mesh has nodes at the key points. ok is false when there is none.
func shortOnFoundation(m *Model, nodes []float64) (a, b float64, ok bool) {
	keys := KeyPoints(m)
	tol := mergeTolerance * m.Length()
	isKey := func(x float64) bool { return math.Abs(keys[nearest(keys, x)]-x) <= tol }
	shortest := math.Inf(1)
	for i := range len(nodes) - 1 {
		h, mid := nodes[i+1]-nodes[i], 0.5*(nodes[i]+nodes[i+1])
		if h >= shortest || !isKey(nodes[i]) || !isKey(nodes[i+1]) {
			continue
		}
		seg := m.Segments[m.SegmentAt(mid)]
		d := elementData{sectionData: sectionData{
			flexuralRigidity: seg.Material.Elastic * seg.Section.SecondMoment,
			axialRigidity:    seg.Material.Elastic * seg.Section.Area}}
		d.modulus, d.axialModulus = m.foundationAt(mid)
		if h < d.shortestOnFoundation() {
			a, b, shortest, ok = nodes[i], nodes[i+1], h, true
		}
	}
	return a, b, ok
}

// shortStretch is the length, relative to the member, below which a stretch
// of the key-point system is named as the cause of a singular system: its
// stiffness grows as the cube of the inverse length.
const shortStretch = 1e-4

// elementTable gathers each element's geometry and section and the loads l
// along it, and returns the point loads at each node apart. l must be
// gathered on key points that hold every node of mesh (KeyPoints does, for
// the key-point mesh and for the fine one). A point load is placed at the
// node of fine that holds it (so the key-point mesh and the fine mesh see it
// at the same x); when no node of mesh is there, it lies inside an element.
func elementTable(m *Model, mesh Mesh, fine []float64, l *Loads) ([]elementData, [][3]float64) {
	els := make([]elementData, len(mesh.Elements))
	nodal := make([][3]float64, len(mesh.X))
	sections := sectionTable(m, l)
	for i, e := range mesh.Elements {
		els[i] = elementData{start: e.Start, length: e.End - e.Start, sectionData: sections[e.Segment]}
		d := &els[i]
		d.axialLoad, d.transverseLoad, d.breaks = l.loadsIn(e.Start, e.End)
	}
	markReleases(m, mesh.X, els)
	groundUnder(m, els)
	for _, p := range l.Points {
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
	return els, nodal
}

// component returns the part of the point load that acts on motion d.
func (p PointLoad) component(d Dof) float64 {
	return [3]float64{p.Axial, p.Transverse, p.Moment}[d]
}

// markReleases marks the elements between nodes that start at a hinge of m.
func markReleases(m *Model, nodes []float64, els []elementData) {
	for _, h := range m.Hinges {
		if i := nearest(nodes, h.X); i > 0 && i < len(els) {
			els[i].released, els[i].release = true, h.Stiffness
		}
	}
}
