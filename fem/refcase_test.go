package fem_test

// Shared machinery of the reference and convergence tests: the quantities a
// check reads, the tolerances theory allows for them, and the checks of point
// values, extremes, reactions and equilibrium against book values.

import (
	"math"
	"testing"

	"stave/fem"
)

// Member data shared by the handbook cases: a steel member in SI units.
const (
	refLength  = 4.0    // L, m
	refE       = 200e9  // E, Pa
	refI       = 8e-6   // I, m⁴
	refA       = 4e-3   // A, m²
	refC       = 0.1    // c, m
	refAlpha   = 12e-6  // α, 1/K
	refDensity = 7850.0 // ρ, kg/m³
	refEI      = refE * refI
	refEA      = refE * refA
)

// Loads shared by the handbook cases: gravity-like loads are negative (down).
const (
	refP     = -10e3 // transverse point load, N
	refQ     = -5e3  // transverse uniform load, N/m
	refF     = 40e3  // axial point load along +x, N
	refPAxis = 5e3   // axial distributed load along +x, N/m
)

var (
	refSteel   = fem.Material{Name: "steel", Elastic: refE, Density: refDensity, ThermalExpansion: refAlpha}
	refSection = fem.Section{Area: refA, SecondMoment: refI, FibreDistance: refC}
)

// refMember is one uniform steel segment from 0 to length.
func refMember(length float64) []fem.Segment {
	return []fem.Segment{{Start: 0, End: length, Section: refSection, Material: refSteel}}
}

// roundOff is the relative tolerance for values theory says are exact.
const roundOff = 1e-9

// quantity is one result read off fem.Fields.
type quantity int

const (
	axialDisplacement quantity = iota
	deflection
	rotation
	axialForce
	shearForce
	bendingMoment
	axialStress
	bendingStress
)

var quantityNames = [...]string{"axial displacement", "deflection", "rotation", "axial force",
	"shear force", "bending moment", "axial stress", "bending stress"}

func (q quantity) String() string { return quantityNames[q] }

func (q quantity) of(f fem.Fields) float64 {
	switch q {
	case axialDisplacement:
		return f.AxialDisplacement
	case deflection:
		return f.Deflection
	case rotation:
		return f.Rotation
	case axialForce:
		return f.AxialForce
	case shearForce:
		return f.ShearForce
	case bendingMoment:
		return f.BendingMoment
	case axialStress:
		return f.AxialStress
	}
	return f.BendingStress
}

// nodallyExact reports whether the finite element value of q at a node equals
// the exact value: in 1D with consistent nodal loads the nodal displacements
// and rotations are exact (Tong 1969; Strang & Fix ch. 1; from memory). Forces
// at nodes are not: they come from derivatives of the element fields.
func (q quantity) nodallyExact() bool {
	return q == axialDisplacement || q == deflection || q == rotation
}

// memberScales are the sizes of each quantity in one model, worked out from
// its loads and stiffnesses; round-off tolerances are relative to them, so a
// book value of zero still gets a meaningful tolerance.
type memberScales struct {
	length    float64 // L, m
	force     float64 // sum of the magnitudes of all loads, N
	minEA     float64
	minEI     float64
	minArea   float64
	maxCOverI float64
}

func scalesOf(m *fem.Model) memberScales {
	s := memberScales{length: m.Length(), minEA: math.Inf(1), minEI: math.Inf(1), minArea: math.Inf(1)}
	for _, g := range m.Segments {
		ea, ei := g.Material.Elastic*g.Section.Area, g.Material.Elastic*g.Section.SecondMoment
		s.minEA, s.minEI = math.Min(s.minEA, ea), math.Min(s.minEI, ei)
		s.minArea = math.Min(s.minArea, g.Section.Area)
		s.maxCOverI = math.Max(s.maxCOverI, g.Section.FibreDistance/g.Section.SecondMoment)
		s.force += math.Abs(ea * g.Material.ThermalExpansion * m.TemperatureChange)
		s.force += g.Material.Density * g.Section.Area * math.Hypot(m.Gravity[0], m.Gravity[1]) * (g.End - g.Start)
	}
	for _, p := range m.PointLoads {
		s.force += math.Abs(p.Axial) + math.Abs(p.Transverse) + math.Abs(p.Moment)/s.length
	}
	// A settlement loads the member by the force that would force it on a
	// member fixed at both ends: 12EI·Δ/L³ across, 6EI·θ/L² in rotation
	// (slope-deflection, from memory), EA·u/L along.
	var stiffest [2]float64 // largest EA and EI, N and N·m²
	for _, g := range m.Segments {
		stiffest[0] = math.Max(stiffest[0], g.Material.Elastic*g.Section.Area)
		stiffest[1] = math.Max(stiffest[1], g.Material.Elastic*g.Section.SecondMoment)
	}
	L := s.length
	for _, sp := range m.Supports {
		d := sp.Settlement
		s.force += math.Abs(d[0])*stiffest[0]/L + math.Abs(d[1])*12*stiffest[1]/(L*L*L) + math.Abs(d[2])*6*stiffest[1]/(L*L)
	}
	for _, d := range m.DistributedLoad {
		for i := 1; i < len(d.Points); i++ {
			a, b := d.Points[i-1], d.Points[i]
			s.force += (math.Abs(a.Intensity) + math.Abs(b.Intensity)) / 2 * (b.X - a.X)
		}
	}
	return s
}

// of is the size of quantity q in the model.
func (s memberScales) of(q quantity) float64 {
	L, F := s.length, s.force
	switch q {
	case axialDisplacement:
		return F * L / s.minEA
	case deflection:
		return F * L * L * L / s.minEI
	case rotation:
		return F * L * L / s.minEI
	case axialForce, shearForce:
		return F
	case bendingMoment:
		return F * L
	case axialStress:
		return F / s.minArea
	}
	return F * L * s.maxCOverI
}

// loadBounds are the largest distributed load intensities and slopes of a
// model (self-weight included), which bound the error between nodes.
type loadBounds struct {
	axial, axialSlope           float64 // N/m, N/m²
	transverse, transverseSlope float64
}

func loadBoundsOf(m *fem.Model) loadBounds {
	var b loadBounds
	for _, d := range m.DistributedLoad {
		var most, steepest float64
		for i, p := range d.Points {
			most = math.Max(most, math.Abs(p.Intensity))
			if i > 0 {
				prev := d.Points[i-1]
				steepest = math.Max(steepest, math.Abs((p.Intensity-prev.Intensity)/(p.X-prev.X)))
			}
		}
		if d.Direction == fem.Axial {
			b.axial += most
			b.axialSlope += steepest
		} else {
			b.transverse += most
			b.transverseSlope += steepest
		}
	}
	var weight float64 // heaviest self-weight per length, kg/m
	for _, g := range m.Segments {
		weight = math.Max(weight, g.Material.Density*g.Section.Area)
	}
	b.axial += weight * math.Abs(m.Gravity[0])
	b.transverse += weight * math.Abs(m.Gravity[1])
	return b
}

// betweenNodes bounds |finite element − exact| for q anywhere in elements of
// length h, given that the nodal values are exact. Then each element's field
// is fixed by its end values alone:
//   - Hermite beam: w_h is the cubic Hermite interpolant of w, whose error is
//     w””/24·s²(h−s)² (Strang & Fix ch. 1, from memory); differentiating gives
//     h⁴/384, h³/125, h²/12 and h/2 times max|q|/EI for w, θ, M/EI and V/EI.
//   - linear bar: u_h is the linear interpolant of u: h²/8·max|p|/EA for u,
//     h/2·max|p| for N.
//   - quadratic bar: u_h' is the L2 projection of u' onto linear functions on
//     each element (bubble and constant tests of the Galerkin equation), so a
//     uniform load is reproduced exactly and a linear one leaves
//     h²/12·max|p'| in N and 0.0081·h³·max|p'|/EA in u.
//
// These constants hold for a load constant over the element; the factor 2
// covers its variation within an element (a linear load adds a term one
// power of h higher).
func betweenNodes(q quantity, order fem.ElementOrder, h float64, loads loadBounds, s memberScales) float64 {
	const margin = 2
	p, dp, w := loads.axial, loads.axialSlope, loads.transverse
	var e float64
	switch q {
	case deflection:
		e = math.Pow(h, 4) / 384 * w / s.minEI
	case rotation:
		e = math.Pow(h, 3) / 125 * w / s.minEI
	case bendingMoment:
		e = h * h / 12 * w
	case bendingStress:
		e = h * h / 12 * w * s.maxCOverI
	case shearForce:
		e = h / 2 * w
	case axialDisplacement:
		if order == fem.QuadraticBar {
			e = 0.0081 * math.Pow(h, 3) * dp / s.minEA
		} else {
			e = h * h / 8 * p / s.minEA
		}
	case axialForce, axialStress:
		if order == fem.QuadraticBar {
			e = h * h / 12 * dp
		} else {
			e = h / 2 * p
		}
		if q == axialStress {
			e /= s.minArea
		}
	}
	return margin * e
}

// pointCheck is a book value of one quantity at one point of the member; a
// zero side reads inside the member (right of x, left of it at the far end).
type pointCheck struct {
	x    float64
	side fem.Side
	q    quantity
	want float64
}

// extremeCheck says that the largest magnitude of q along the member is
// want, reached at x. When stationary, the extreme lies where the field is
// smooth, so its slope (θ for w, V for M) vanishes there too.
type extremeCheck struct {
	q          quantity
	want       float64
	x          float64
	side       fem.Side
	stationary bool
}

// slope is the quantity whose zero marks a smooth extreme of q.
func (q quantity) slope() quantity {
	if q == deflection {
		return rotation
	}
	return shearForce // of bending moment
}

// refCase is one handbook case: the model a user would enter and what the
// book says about it.
type refCase struct {
	name      string
	model     fem.Model
	reactions [][3]float64 // per support, in Model.Supports order: force on the member
	energy    float64      // strain energy, J
	points    []pointCheck
	extremes  []extremeCheck
}

// judge holds what is needed to check one field (finite element or exact)
// against book values: the field, the allowed error of each quantity at each
// point, and samples along the member for extremes.
type judge struct {
	field  fem.Field
	length float64 // L, m
	// exactAt says whether theory makes q exact at x, so that only round-off
	// is allowed (finite element judges only).
	exactAt func(q quantity, x float64) bool
	allowed func(q quantity, x float64) float64
	samples []fem.Fields
}

// at reads the field at x; a check that names no side reads inside the member.
func (j judge) at(x float64, side fem.Side) fem.Fields {
	if side == 0 {
		side = fem.Right
		if x >= j.length {
			side = fem.Left
		}
	}
	return j.field.At(x, side)
}

func (j judge) checkPoints(t *testing.T, c refCase, only func(q quantity, x float64) bool) {
	t.Helper()
	for _, p := range c.points {
		if only != nil && !only(p.q, p.x) {
			continue
		}
		got := p.q.of(j.at(p.x, p.side))
		if tol := j.allowed(p.q, p.x); !(math.Abs(got-p.want) <= tol) {
			t.Errorf("%s at x = %g m: got %.10g, book %.10g (|difference| %.3g > tolerance %.3g)",
				p.q, p.x, got, p.want, math.Abs(got-p.want), tol)
		}
	}
}

func (j judge) checkExtremes(t *testing.T, c refCase) {
	t.Helper()
	for _, e := range c.extremes {
		tol := j.allowed(e.q, e.x)
		at := j.at(e.x, e.side)
		if got := e.q.of(at); !(math.Abs(got-e.want) <= tol) {
			t.Errorf("extreme %s at x = %g m: got %.10g, book %.10g (|difference| %.3g > tolerance %.3g)",
				e.q, e.x, got, e.want, math.Abs(got-e.want), tol)
		}
		if e.stationary {
			sl := e.q.slope()
			if got, stol := sl.of(at), j.allowed(sl, e.x); !(math.Abs(got) <= stol) {
				t.Errorf("extreme %s at x = %g m: %s there is %.4g, want 0 (tolerance %.3g): the extreme is elsewhere",
					e.q, e.x, sl, got, stol)
			}
		}
		// Nowhere along the member may the magnitude exceed the book's extreme.
		worst := math.Abs(e.want) + j.allowedAnywhere(e.q)
		for _, f := range j.samples {
			if v := e.q.of(f); math.Abs(v) > worst {
				t.Errorf("%s at x = %.4g m is %.8g, beyond the book's extreme %.8g at x = %g m",
					e.q, f.X, v, e.want, e.x)
				break
			}
		}
	}
}

// allowedAnywhere is the loosest tolerance of q over the samples.
func (j judge) allowedAnywhere(q quantity) float64 {
	var most float64
	for _, f := range j.samples {
		most = math.Max(most, j.allowed(q, f.X))
	}
	return most
}

// checkReactions compares reactions with the book, support by support.
func checkReactions(t *testing.T, c refCase, got []fem.Reaction, s memberScales) {
	t.Helper()
	if len(got) != len(c.reactions) {
		t.Errorf("got %d reactions, want one per support (%d)", len(got), len(c.reactions))
	}
	seen := make([]bool, len(c.reactions))
	tol := [3]float64{roundOff * s.force, roundOff * s.force, roundOff * s.force * s.length}
	for _, r := range got {
		if r.Support < 0 || r.Support >= len(c.reactions) || seen[r.Support] {
			t.Errorf("reaction names support %d: not a support of the model or named twice", r.Support)
			continue
		}
		seen[r.Support] = true
		want := c.reactions[r.Support]
		for d := range 3 {
			if !(math.Abs(r.Force[d]-want[d]) <= tol[d]) {
				t.Errorf("support %d at x = %g m, %s reaction: got %.10g, book %.10g",
					r.Support, c.model.Supports[r.Support].X, fem.Dof(d), r.Force[d], want[d])
			}
		}
	}
}

// appliedLoads totals the loads of a model: Fx, Fy (N) and the moment about
// x = 0 (N·m, counter-clockwise), integrating each linear piece of a
// distributed load in closed form.
func appliedLoads(m *fem.Model) [3]float64 {
	var a [3]float64
	for _, p := range m.PointLoads {
		a[0] += p.Axial
		a[1] += p.Transverse
		a[2] += p.X*p.Transverse + p.Moment
	}
	for _, d := range m.DistributedLoad {
		for i := 1; i < len(d.Points); i++ {
			x1, q1, x2, q2 := d.Points[i-1].X, d.Points[i-1].Intensity, d.Points[i].X, d.Points[i].Intensity
			force := (q1 + q2) / 2 * (x2 - x1)
			if d.Direction == fem.Axial {
				a[0] += force
				continue
			}
			a[1] += force
			a[2] += (x2 - x1) / 6 * (q1*(2*x1+x2) + q2*(x1+2*x2))
		}
	}
	for _, g := range m.Segments {
		weight := g.Material.Density * g.Section.Area * (g.End - g.Start)
		a[0] += weight * m.Gravity[0]
		a[1] += weight * m.Gravity[1]
		a[2] += weight * m.Gravity[1] * (g.Start + g.End) / 2
	}
	return a
}

// checkEquilibrium checks that loads and reactions balance to round-off.
func checkEquilibrium(t *testing.T, m *fem.Model, reactions []fem.Reaction, reported *fem.Equilibrium) {
	t.Helper()
	s := scalesOf(m)
	tol := [3]float64{roundOff * s.force, roundOff * s.force, roundOff * s.force * s.length}
	applied := appliedLoads(m)
	var sum [3]float64
	for _, r := range reactions {
		sum[0] += r.Force[0]
		sum[1] += r.Force[1]
		sum[2] += r.Force[2] + r.X*r.Force[1]
	}
	for d, name := range []string{"Fx", "Fy", "moment about x = 0"} {
		if res := applied[d] + sum[d]; !(math.Abs(res) <= tol[d]) {
			t.Errorf("equilibrium %s: applied %.10g + reactions %.10g leaves %.3g", name, applied[d], sum[d], res)
		}
		if reported == nil {
			continue
		}
		if !(math.Abs(reported.Applied[d]-applied[d]) <= tol[d]) {
			t.Errorf("reported applied %s is %.10g, the loads total %.10g", name, reported.Applied[d], applied[d])
		}
		if !(math.Abs(reported.Residual[d]) <= tol[d]) {
			t.Errorf("reported equilibrium residual %s is %.3g, want round-off (below %.3g)", name, reported.Residual[d], tol[d])
		}
	}
}

// solveWith solves a copy of m with the given mesh; it stops the test on error.
func solveWith(t *testing.T, m fem.Model, elements int, order fem.ElementOrder) *fem.Solution {
	t.Helper()
	m.Mesh = fem.MeshSettings{Elements: elements, BarOrder: order}
	sol, err := fem.Solve(&m)
	if err != nil {
		t.Fatalf("Solve with %d elements (bar order %d): %v", elements, order, err)
	}
	if len(sol.Mesh.X) < 2 || len(sol.Displacement) != len(sol.Mesh.X) {
		t.Fatalf("Solve with %d elements: mesh has %d nodes and %d nodal displacements", elements, len(sol.Mesh.X), len(sol.Displacement))
	}
	return sol
}

// longestElement is the largest element length h of a mesh, m.
func longestElement(mesh fem.Mesh) float64 {
	var h float64
	for _, e := range mesh.Elements {
		h = math.Max(h, e.End-e.Start)
	}
	return h
}

// isNode reports whether x is an element end node of the mesh.
func isNode(mesh fem.Mesh, x float64) bool {
	for _, n := range mesh.X {
		if math.Abs(n-x) <= 1e-12*math.Max(1, math.Abs(x)) {
			return true
		}
	}
	return false
}

// feJudge checks a finite element solution: nodal displacements to round-off,
// everything else within the between-node bound for its element size.
func feJudge(sol *fem.Solution, order fem.ElementOrder) judge {
	s := scalesOf(&sol.Model)
	loads := loadBoundsOf(&sol.Model)
	h := longestElement(sol.Mesh)
	exactAt := func(q quantity, x float64) bool {
		return q.nodallyExact() && isNode(sol.Mesh, x) || betweenNodes(q, order, h, loads, s) == 0
	}
	return judge{
		field:   sol,
		length:  sol.Model.Length(),
		exactAt: exactAt,
		allowed: func(q quantity, x float64) float64 {
			tol := roundOff * s.of(q)
			if exactAt(q, x) {
				return tol
			}
			return tol + betweenNodes(q, order, h, loads, s)
		},
		samples: sol.Sample(8),
	}
}

// checkStrainEnergy compares the finite element strain energy with the book's.
// With consistent loads the finite element energy falls short of the exact one
// by half the squared energy norm of the error (Hughes ch. 1, from memory),
// at most ½·L·(ΔM²/EI + ΔN²/EA) with ΔM, ΔN the between-node bounds.
func checkStrainEnergy(t *testing.T, c refCase, sol *fem.Solution, order fem.ElementOrder) {
	t.Helper()
	s := scalesOf(&sol.Model)
	loads := loadBoundsOf(&sol.Model)
	h := longestElement(sol.Mesh)
	dM := betweenNodes(bendingMoment, order, h, loads, s)
	dN := betweenNodes(axialForce, order, h, loads, s)
	shortfall := s.length / 2 * (dM*dM/s.minEI + dN*dN/s.minEA)
	got, tol := sol.StrainEnergy, roundOff*c.energy
	if !(got <= c.energy+tol && got >= c.energy-tol-shortfall) {
		t.Errorf("strain energy %.10g J, book %.10g J (allowed below it by %.3g J, above by %.3g J)",
			got, c.energy, tol+shortfall, tol)
	}
}

// exactJudge checks the closed-form solution: exact everywhere, to round-off.
func exactJudge(ex *fem.Exact, m *fem.Model) judge {
	s := scalesOf(m)
	L := m.Length()
	const n = 2048
	samples := make([]fem.Fields, 0, 2*(n+1))
	for i := 0; i <= n; i++ {
		x := L * float64(i) / n
		samples = append(samples, ex.At(x, fem.Left), ex.At(x, fem.Right))
	}
	return judge{
		field:   ex,
		length:  L,
		allowed: func(q quantity, _ float64) float64 { return roundOff * s.of(q) },
		samples: samples,
	}
}

// barOrders are the bar elements a case runs with: both when it loads the
// member axially, otherwise only the default.
func (c refCase) barOrders() []fem.ElementOrder {
	for _, p := range c.points {
		if p.q == axialDisplacement || p.q == axialForce || p.q == axialStress {
			return []fem.ElementOrder{fem.LinearBar, fem.QuadraticBar}
		}
	}
	return []fem.ElementOrder{fem.LinearBar}
}

func orderName(o fem.ElementOrder) string {
	if o == fem.QuadraticBar {
		return "quadratic bar"
	}
	return "linear bar"
}
