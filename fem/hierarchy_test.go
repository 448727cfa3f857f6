package fem

import (
	"fmt"
	"math"
	"testing"

	"stave/fem/units"
)

// assembled is the plain finite element solution of m on mesh: the fine
// stiffness matrix assembled and eliminated by band.LDL, the way Solve worked
// before the hierarchical basis. It is exact in exact arithmetic, so on small
// meshes, where its round-off is small, both must agree to round-off.
type assembled struct {
	bar, beam []float64 // all unknowns, quadratic middle nodes included
	reactions []Reaction
	cond      float64
}

func solveAssembled(t *testing.T, m *Model, mesh Mesh) assembled {
	t.Helper()
	order := m.Mesh.BarOrder
	if order == 0 {
		order = LinearBar
	}
	loads := GatherLoads(m, KeyPoints(m))
	els, nodal := elementTable(m, mesh, mesh.X, &loads)
	out := assembled{reactions: make([]Reaction, len(m.Supports))}
	for i, sup := range m.Supports {
		out.reactions[i] = Reaction{Support: i, X: sup.X}
	}
	for _, p := range []Formulation{barFormulation{order}, hermiteBeam{}} {
		as, err := assemble(m, mesh.X, els, p, units.Base)
		if err != nil {
			t.Fatalf("assembled solve: %v", err)
		}
		u := make([]float64, as.n)
		if err := as.solve(els, nodal, loads.Settlement, u); err != nil {
			t.Fatalf("assembled solve: %v", err)
		}
		assembledReactions(m, mesh, els, p, u, out.reactions)
		out.cond = max(out.cond, as.cond)
		if p.Problem() == "bar" {
			out.bar = u
		} else {
			out.beam = u
		}
	}
	return out
}

// assembledReactions fills p's components of the reactions the plain way:
// rigid restraints from the element end forces K·u − f at the node less the
// point loads there, springs as −k·displacement.
func assembledReactions(m *Model, mesh Mesh, els []elementData, p Formulation, u []float64, reactions []Reaction) {
	for r, sup := range m.Supports {
		node := nearest(mesh.X, sup.X)
		for mi, d := range p.Motions() {
			dof := p.nodeDof(node, mi)
			switch {
			case sup.Kind == Spring:
				reactions[r].Force[d] = -sup.Stiffness[d] * u[dof]
			case sup.Kind.Restrains(d):
				force := 0.0
				for _, pl := range m.PointLoads {
					if nearest(mesh.X, pl.X) == node {
						force -= pl.component(d)
					}
				}
				for e := max(node-1, 0); e <= min(node, len(els)-1); e++ {
					first, count := p.element(e)
					if dof < first || dof >= first+count {
						continue
					}
					k, f := p.stiffness(&els[e]), p.loads(&els[e])
					a := dof - first
					force -= f[a]
					for b := range count {
						force += k[a][b] * u[first+b]
					}
				}
				reactions[r].Force[d] = force
			}
		}
	}
}

// largest is max |v|, at least tiny so it can divide.
func largest(v []float64) float64 {
	m := 1e-300
	for _, x := range v {
		m = max(m, math.Abs(x))
	}
	return m
}

// everyOther returns v[from], v[from+2], ...
func everyOther(v []float64, from int) []float64 {
	var out []float64
	for i := from; i < len(v); i += 2 {
		out = append(out, v[i])
	}
	return out
}

// TestHierarchyMatchesAssembled compares the hierarchical solution with the
// assembled one on uniform and graded meshes of a model with every kind of
// load, support and section change: nodal values, reactions, the quadratic
// bars' middle nodes, and the moments and shear forces inside the elements.
func TestHierarchyMatchesAssembled(t *testing.T) {
	graded := func(t *testing.T, m *Model, n int) Mesh {
		x := make([]float64, n+1)
		for i := range x {
			r := float64(i) / float64(n)
			x[i] = m.Length() * r * r * r
		}
		mesh, err := MeshFromNodes(m, x)
		if err != nil {
			t.Fatal(err)
		}
		return mesh
	}
	uniform := func(t *testing.T, m *Model, n int) Mesh {
		m.Mesh.Elements = n
		mesh, err := BuildMesh(m)
		if err != nil {
			t.Fatal(err)
		}
		return mesh
	}
	for _, order := range []ElementOrder{LinearBar, QuadraticBar} {
		for _, mk := range []struct {
			name string
			mesh func(*testing.T, *Model, int) Mesh
		}{{"uniform", uniform}, {"graded", graded}} {
			for _, n := range []int{1, 7, 40} {
				for _, hinged := range []bool{false, true} {
					t.Run(fmt.Sprintf("order %d, %s, %d elements, hinges %v", order, mk.name, n, hinged), func(t *testing.T) {
						m := mixedModel(0)
						m.Mesh.BarOrder = order
						if hinged { // a pure hinge and a semi-rigid joint
							m.Hinges = []Hinge{{X: 1.8}, {X: 6.3, Stiffness: 2e6}}
						}
						mesh := mk.mesh(t, m, n)
						s, err := SolveOnMesh(m, mesh)
						if err != nil {
							t.Fatal(err)
						}
						ref := solveAssembled(t, m, mesh)
						// Round-off of the assembled solve, or 1e-12 when smaller.
						tol := max(1e-12, ref.cond*0x1p-52)
						t.Logf("tolerance %.2g", tol)
						stride := order.nodes() - 1
						scale := [3]float64{largest(ref.bar), largest(everyOther(ref.beam, 0)), largest(everyOther(ref.beam, 1))}
						for i, d := range s.Displacement {
							want := [3]float64{ref.bar[stride*i], ref.beam[2*i], ref.beam[2*i+1]}
							for k := range d {
								if math.Abs(d[k]-want[k]) > tol*scale[k] {
									t.Fatalf("node %d (x = %g), %s: hierarchical %.15g, assembled %.15g", i, mesh.X[i], Dof(k), d[k], want[k])
								}
							}
						}
						var forces []float64
						for _, r := range ref.reactions {
							forces = append(forces, r.Force[:]...)
						}
						for i, r := range s.Reactions {
							for k, v := range r.Force {
								if want := ref.reactions[i].Force[k]; math.Abs(v-want) > tol*largest(forces) {
									t.Errorf("reaction %d, %s: hierarchical %.15g, assembled %.15g", i+1, Dof(k), v, want)
								}
							}
						}
						var moment, shear, axial, mid []float64
						var moments, shears, axials, mids []float64
						loads := GatherLoads(m, KeyPoints(m))
						els, _ := elementTable(m, mesh, mesh.X, &loads)
						for e, el := range mesh.Elements {
							h := el.End - el.Start
							d := elementData{length: h}
							_, _, d2, d3 := hermite(0.5, h)
							ei := s.sections[el.Segment].flexuralRigidity
							ea := s.sections[el.Segment].axialRigidity
							u := [4]float64(ref.beam[2*e : 2*e+4])
							if els[e].released { // the element's own start rotation at a hinge
								u[1] = els[e].releasedRotation(u)
							}
							var curvature, third float64
							for a := range 4 {
								curvature += d2[a] * u[a]
								third += d3[a] * u[a]
							}
							_, dn := barShape(order, 0.5, d.length)
							strain := -s.sections[el.Segment].thermalStrain
							for a := range order.nodes() {
								strain += dn[a] * ref.bar[stride*e+a]
							}
							f := s.At(0.5*(el.Start+el.End), Right)
							moment, moments = append(moment, f.BendingMoment), append(moments, ei*curvature)
							shear, shears = append(shear, f.ShearForce), append(shears, ei*third)
							axial, axials = append(axial, f.AxialForce), append(axials, ea*strain)
							if order == QuadraticBar {
								mid, mids = append(mid, f.AxialDisplacement), append(mids, ref.bar[stride*e+1])
							}
						}
						for _, c := range []struct {
							name      string
							got, want []float64
						}{{"bending moment", moment, moments}, {"shear force", shear, shears}, {"axial force", axial, axials}, {"middle node", mid, mids}} {
							for e := range c.got {
								// Fields lose up to n² more to cancellation in the assembled reference.
								if math.Abs(c.got[e]-c.want[e]) > 1e3*tol*largest(c.want) {
									t.Errorf("%s in element %d: hierarchical %.15g, assembled %.15g", c.name, e+1, c.got[e], c.want[e])
								}
							}
						}
					})
				}
			}
		}
	}
}

// The closed-form Hermite load vector against 3-point Gauss–Legendre
// quadrature of ∫N·q, exact for a cubic times a linear load.
func TestHermiteLoadsQuadrature(t *testing.T) {
	for _, c := range []struct{ h, q0, q1 float64 }{{1, 1, 1}, {2.5, -3e3, 7e3}, {1e-4, 5, -2}} {
		var want localVector
		for _, g := range gauss3 {
			n, _, _, _ := hermite(g.xi, c.h)
			q := c.q0 + (c.q1-c.q0)*g.xi
			for a := range n {
				want[a] += g.w * c.h * n[a] * q
			}
		}
		got := hermiteLoads(c.h, c.q0, c.q1)
		for a := range want {
			if math.Abs(got[a]-want[a]) > 1e-14*largest(want[:]) {
				t.Errorf("h = %g, q = %g..%g: entry %d closed form %.15g, quadrature %.15g", c.h, c.q0, c.q1, a, got[a], want[a])
			}
		}
	}
}

// Strain energy from the hierarchy equals ½uᵀKu of the assembled solution
// (springs excluded) summed by element quadrature.
func TestHierarchyStrainEnergy(t *testing.T) {
	for _, order := range []ElementOrder{LinearBar, QuadraticBar} {
		m := mixedModel(30)
		m.Mesh.BarOrder = order
		s := mustSolve(t, m)
		ref := solveAssembled(t, m, s.Mesh)
		loads := GatherLoads(m, KeyPoints(m))
		els, _ := elementTable(m, s.Mesh, s.Mesh.X, &loads)
		stride := order.nodes() - 1
		want := 0.0
		for e := range els {
			want += els[e].strainEnergy(order, ref.bar[stride*e:stride*e+order.nodes()], ref.beam[2*e:2*e+4])
		}
		if relErr(s.StrainEnergy, want) > 1e-10 {
			t.Errorf("order %d: strain energy %.15g, assembled %.15g", order, s.StrainEnergy, want)
		}
	}
}

// A load a hair's breadth from a support makes a short stiff stretch whose
// end forces K·u − f cannot resolve; the reactions come by statics from the
// long stretch and must match the exact ones (simply supported beam with
// point loads: Gere & Goodno, Mechanics of Materials, from memory, solved
// here by SolveExact) within Condition·ε, and balance the loads as closely.
func TestReactionsNextToShortStretch(t *testing.T) {
	for _, gap := range []float64{6e-3, 6e-5, 6e-7, 6e-9} {
		m := testModel(Support{X: 0, Kind: Pinned}, Support{X: testL, Kind: Roller})
		m.PointLoads = []PointLoad{{X: gap, Transverse: testP}, {X: testL / 2, Transverse: testP}}
		m.Mesh.Elements = 1000
		s := mustSolve(t, m)
		ex, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		tol := max(1e-12, s.Condition*0x1p-52)
		for i, r := range ex.Reactions() {
			if got := s.Reactions[i].Force[Transverse]; relErr(got, r.Force[Transverse]) > tol {
				t.Errorf("load %g m from the support: reaction %d is %.12g, exact %.12g (tolerance %.2g)", gap, i+1, got, r.Force[Transverse], tol)
			}
		}
		q := s.Equilibrium
		if math.Abs(q.Residual[1]) > tol*math.Abs(q.Applied[1]) || math.Abs(q.Residual[2]) > tol*math.Abs(q.Applied[2]) {
			t.Errorf("load %g m from the support: equilibrium residual %v of applied %v (tolerance %.2g)", gap, q.Residual, q.Applied, tol)
		}
	}
}

// Meshes of parallelRefine elements or more are refined in jobs on two
// goroutines; every nodal displacement and element field must equal, to the
// bit, what one refiner walking each stretch from its key points gives, and
// the strain energy (summed in two parts) must agree to round-off. The
// second model's one stretch has a load break near its start, so the jobs
// are cut from intervals without a break inside, on the linear path.
func TestParallelRefineMatchesSequential(t *testing.T) {
	short := &Model{
		Segments: []Segment{testSegment(0, 8)},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}, {X: 7, Kind: Roller}, {X: 8, Kind: Roller}},
		DistributedLoad: []DistributedLoad{
			{Direction: Transverse, Points: []LoadPoint{{0, -3e3}, {0.3, -1e3}}},
			{Direction: Transverse, Points: []LoadPoint{{0, -2e3}, {8, -7e3}}},
			{Direction: Axial, Points: []LoadPoint{{0, 1e3}, {8, -2e3}}},
		},
		Mesh: MeshSettings{Elements: 3 * parallelRefine},
	}
	for _, m := range []*Model{mixedModel(3 * parallelRefine), short} {
		refineSequentially(t, m)
	}
}

func refineSequentially(t *testing.T, m *Model) {
	s := mustSolve(t, m)
	keys, err := keyNodes(m, s.Mesh.X)
	if err != nil {
		t.Fatal(err)
	}
	keyX := make([]float64, len(keys))
	for j, i := range keys {
		keyX[j] = s.Mesh.X[i]
	}
	loads := GatherLoads(m, KeyPoints(m))
	stretches, _ := elementTable(m, meshOn(m, keyX), s.Mesh.X, &loads)
	if len(stretches) < 3 || len(s.Mesh.Elements) < parallelRefine {
		t.Fatalf("%d stretches and %d elements: the test needs several stretches and a mesh refined in parallel", len(stretches), len(s.Mesh.Elements))
	}
	disp := make([][3]float64, len(s.Displacement))
	for _, i := range keys {
		disp[i] = s.Displacement[i]
	}
	fields := make([]elementField, len(s.Mesh.Elements))
	r := stretchRefiner{x: s.Mesh.X, disp: disp, fields: fields, order: LinearBar}
	r.findNodes(stretches)
	for j := range stretches {
		r.setup(stretches, j)
		r.split(keys[j], keys[j+1], r.startTaylor(&stretches[j], keys[j], keys[j+1]))
	}
	for i := range disp {
		if disp[i] != s.Displacement[i] {
			t.Fatalf("node %d: sequential %v, parallel %v", i, disp[i], s.Displacement[i])
		}
	}
	for e := range fields {
		if fields[e] != s.fields[e] {
			t.Fatalf("element %d: sequential %+v, parallel %+v", e, fields[e], s.fields[e])
		}
	}
	if relErr(0.5*r.energy, s.StrainEnergy) > 1e-13 {
		t.Errorf("strain energy: sequential %.17g, parallel %.17g", 0.5*r.energy, s.StrainEnergy)
	}
}
