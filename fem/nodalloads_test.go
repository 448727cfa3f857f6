package fem_test

import (
	"math"
	"testing"

	"stave/fem"
)

// beamOn is a simply supported steel beam of length l on n elements per
// metre of load, under the distributed loads given.
func beamOn(l float64, n int, order fem.ElementOrder, loads ...fem.DistributedLoad) *fem.Model {
	return &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: l,
			Section:  fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: fem.Material{Elastic: 200e9, Density: 7850}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: l, Kind: fem.Roller}},
		DistributedLoad: loads,
		Mesh:            fem.MeshSettings{Elements: n, BarOrder: order},
	}
}

func uniform(d fem.Dof, l, q float64) fem.DistributedLoad {
	return fem.DistributedLoad{Direction: d, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: l, Intensity: q}}}
}

func nodalLoads(t *testing.T, m *fem.Model) *fem.NodalLoads {
	t.Helper()
	mesh, err := fem.BuildMesh(m)
	if err != nil {
		t.Fatal(err)
	}
	nl, err := fem.NodalLoadsOn(m, mesh)
	if err != nil {
		t.Fatal(err)
	}
	return nl
}

func near(a, b, scale float64) bool { return math.Abs(a-b) <= 1e-12*scale }

// Each element's vector and each node's sum against closed forms, for line
// loads whose fixed-end forces the beam tables give.
func TestNodalLoadsClosedForms(t *testing.T) {
	const q, l = -10e3, 4.0 // N/m, m
	const h = l / 4         // the uniform case's elements
	for _, c := range []struct {
		name    string
		m       *fem.Model
		element [4]float64 // every element's (w₁, θ₁, w₂, θ₂) vector, N and N·m
		lumped  float64    // its lumped force at each end, N
		// force and moment are the sums Σ F and Σ (x·F + M) of the nodal
		// loads, consistent and lumped: N and N·m about x = 0.
		force, moment, lumpedMoment float64
		interior                    float64 // the consistent force at an interior node, N
	}{
		// Uniform load q on elements of length h: qh/2 at each node and
		// moments ±qh²/12 (fixed-end forces, beam tables, from memory);
		// interior nodes take qh and no moment.
		{"uniform q, 4 elements", beamOn(l, 4, 0, uniform(fem.Transverse, l, q)),
			[4]float64{q * h / 2, q * h * h / 12, q * h / 2, -q * h * h / 12}, q * h / 2,
			q * l, q * l * l / 2, q * l * l / 2, q * h},
		// A load rising linearly from 0 to q over one element of length L:
		// 3qL/20 and 7qL/20, moments qL²/30 and −qL²/20 (fixed-end forces of
		// a triangular load, beam tables, from memory). Lumping puts qL/4 on
		// each node, whose moment about the start, qL²/4, is not the
		// load's, qL²/3: the consistent vector keeps it.
		{"triangular load on one element", beamOn(l, 1, 0, fem.DistributedLoad{Direction: fem.Transverse,
			Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: l, Intensity: q}}}),
			[4]float64{3 * q * l / 20, q * l * l / 30, 7 * q * l / 20, -q * l * l / 20}, q * l / 4,
			q * l / 2, q * l * l / 3, q * l * l / 4, 0},
	} {
		t.Run(c.name, func(t *testing.T) {
			c.m.Segments[0].Material.Density = 0 // the line load alone
			nl := nodalLoads(t, c.m)
			scale := math.Abs(q) * l * l
			for i, e := range nl.Elements {
				for k := range c.element {
					if !near(e.Beam[k], c.element[k], scale) {
						t.Errorf("element %d: beam vector %v, want %v", i, e.Beam, c.element)
						break
					}
				}
				if !near(e.Lumped[1], c.lumped, scale) {
					t.Errorf("element %d: lumped %g at each end, want %g", i, e.Lumped[1], c.lumped)
				}
			}
			var force, moment, lumpedMoment float64
			for i, nd := range nl.Nodes {
				force += nd.Consistent[fem.Transverse]
				moment += nd.X*nd.Consistent[fem.Transverse] + nd.Consistent[fem.Rotation]
				lumpedMoment += nd.X * nd.Lumped[fem.Transverse]
				if nd.Lumped[fem.Rotation] != 0 {
					t.Errorf("lumping put a moment %g on the node at %g m", nd.Lumped[fem.Rotation], nd.X)
				}
				if i > 0 && i < len(nl.Nodes)-1 && (!near(nd.Consistent[fem.Transverse], c.interior, scale) || !near(nd.Consistent[fem.Rotation], 0, scale)) {
					t.Errorf("node at %g m: %v, want %g and no moment", nd.X, nd.Consistent, c.interior)
				}
			}
			// Consistent loads have the load's resultant force and moment:
			// the shape functions sum to 1 and reproduce x (rigid motions).
			if !near(force, c.force, scale) || !near(nl.Resultant[fem.Transverse], c.force, scale) {
				t.Errorf("consistent nodal forces sum to %g, resultant %g, want %g", force, nl.Resultant[fem.Transverse], c.force)
			}
			if !near(moment, c.moment, scale) || !near(nl.Resultant[2], c.moment, scale) {
				t.Errorf("consistent nodal loads have moment %g about x = 0, resultant %g, want %g", moment, nl.Resultant[2], c.moment)
			}
			if !near(lumpedMoment, c.lumpedMoment, scale) {
				t.Errorf("lumped loads have moment %g about x = 0, want %g", lumpedMoment, c.lumpedMoment)
			}
			if got, want := [2][3]float64{nl.Consistent, nl.Lumped}, [2][3]float64{{0, c.force, c.moment}, {0, c.force, c.lumpedMoment}}; !near(got[0][1], want[0][1], scale) ||
				!near(got[0][2], want[0][2], scale) || !near(got[1][1], want[1][1], scale) || !near(got[1][2], want[1][2], scale) {
				t.Errorf("sums (consistent, lumped) %v, want %v", got, want)
			}
		})
	}
}

// Self-weight along the axis on linear and quadratic bars: ph/2 at each end
// of a linear bar, ph/6, 2ph/3, ph/6 on a quadratic one (Simpson's weights,
// the quadratic shape functions' integrals; from memory); the sums are the
// weight ρ·A·g·L.
func TestNodalLoadsSelfWeightOnBars(t *testing.T) {
	const l, g = 4.0, fem.StandardGravity
	for _, order := range []fem.ElementOrder{fem.LinearBar, fem.QuadraticBar} {
		m := beamOn(l, 5, order)
		m.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}}
		m.Gravity = [2]float64{g, 0}
		nl := nodalLoads(t, m)
		p := 7850 * 4e-3 * g // N/m
		h := l / 5
		weight := p * l
		sum := 0.0
		for i, e := range nl.Elements {
			want := [3]float64{p * h / 2, 0, p * h / 2}
			if order == fem.QuadraticBar {
				want = [3]float64{p * h / 6, 2 * p * h / 3, p * h / 6}
			}
			if got := [3]float64{e.Bar[0], e.BarMiddle, e.Bar[1]}; !near(got[0], want[0], weight) || !near(got[1], want[1], weight) || !near(got[2], want[2], weight) {
				t.Errorf("%s, element %d: bar vector (start, middle, end) %v, want %v", nl.Bar, i, got, want)
			}
			if !near(e.Lumped[0], p*h/2, weight) {
				t.Errorf("%s, element %d: lumped %g at each end, want ph/2 = %g", nl.Bar, i, e.Lumped[0], p*h/2)
			}
			sum += e.BarMiddle
		}
		for _, nd := range nl.Nodes {
			sum += nd.Consistent[fem.Axial]
		}
		if !near(sum, weight, weight) || !near(nl.Resultant[fem.Axial], weight, weight) || !near(nl.Consistent[fem.Axial], weight, weight) {
			t.Errorf("%s: nodal forces sum to %g, resultant %g, the weight is %g", nl.Bar, sum, nl.Resultant[fem.Axial], weight)
		}
	}
}

// A mesh that misses a key point is refused with a message, not answered.
func TestNodalLoadsNeedTheKeyPoints(t *testing.T) {
	m := beamOn(4, 2, 0, fem.DistributedLoad{Direction: fem.Transverse,
		Points: []fem.LoadPoint{{X: 0, Intensity: -1e3}, {X: 1.5, Intensity: -2e3}}})
	mesh, err := fem.MeshFromNodes(&fem.Model{Segments: m.Segments, Supports: m.Supports}, []float64{0, 2, 4})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := fem.NodalLoadsOn(m, mesh); err == nil {
		t.Error("a mesh without a node at the load's end at 1.5 m was accepted")
	}
}

// A segment with shear deformation is solved with the interdependent
// interpolation element, whose consistent loads under a load going linearly
// from q₁ to q₂ are not the Hermite ones: integrating its shape functions
// (beamShape; Reddy, An Introduction to the Finite Element Method, from
// memory) against q gives, with μ = 1/(1 + φ) and φ = 12·EI/(G·As·h²),
// F₁ = μh((21 + 20φ)q₁ + (9 + 10φ)q₂)/60, M₁ = μh²((6 + 5φ)q₁ + (4 + 5φ)q₂)/120,
// F₂ = μh((9 + 10φ)q₁ + (21 + 20φ)q₂)/60, M₂ = −μh²((4 + 5φ)q₁ + (6 + 5φ)q₂)/120
// (derived by hand for this test; φ = 0 gives the Hermite element's
// h(7q₁ + 3q₂)/20 and h²(3q₁ + 2q₂)/60). Each element reports its φ so that
// the window can write out the vector it used.
func TestNodalLoadsShearDeformation(t *testing.T) {
	const l, gas = 6.0, 8e10 * 1e-4 // m; G·As, N
	m := beamOn(l, 3, 0, fem.DistributedLoad{Direction: fem.Transverse,
		Points: []fem.LoadPoint{{X: 1, Intensity: -2000}, {X: 2.5, Intensity: -5000}, {X: 5, Intensity: 1000}}})
	m.Segments[0].Material.Density = 0
	m.Segments[0].ShearDeformation = true
	m.Segments[0].Section.ShearArea = 1e-4
	m.Segments[0].Material.ShearModulus = 8e10
	ei := 200e9 * 8e-6
	nl := nodalLoads(t, m)
	varying := 0
	for i, e := range nl.Elements {
		h := e.End - e.Start
		phi := 12 * ei / (gas * h * h)
		if !near(e.Shear, phi, phi) {
			t.Errorf("element %d: φ = %g, want 12·EI/(G·As·h²) = %g", i, e.Shear, phi)
		}
		q1, q2 := e.Transverse[0], e.Transverse[1]
		mu := 1 / (1 + phi)
		want := [4]float64{
			mu * h * ((21+20*phi)*q1 + (9+10*phi)*q2) / 60,
			mu * h * h * ((6+5*phi)*q1 + (4+5*phi)*q2) / 120,
			mu * h * ((9+10*phi)*q1 + (21+20*phi)*q2) / 60,
			-mu * h * h * ((4+5*phi)*q1 + (6+5*phi)*q2) / 120,
		}
		for k := range want {
			if !near(e.Beam[k], want[k], 5000*l*l) {
				t.Errorf("element %d (%g m to %g m): vector %v, want %v", i, e.Start, e.End, e.Beam, want)
				break
			}
		}
		if q1 != q2 {
			varying++
		}
	}
	if varying == 0 {
		t.Fatal("no element under a varying load: the test checks nothing that tells φ apart")
	}
	m.Segments[0].ShearDeformation = false
	for i, e := range nodalLoads(t, m).Elements {
		if e.Shear != 0 {
			t.Errorf("Euler–Bernoulli element %d reports φ = %g", i, e.Shear)
		}
	}
}

// The nodal loads of a load case's solution, and of a combination's, are
// that case's and that sum's own: a model with cases keeps its loads in the
// cases, so loads taken from the model itself were none (the window's strip
// said "no line load or self-weight" under a case of 10 kN/m). Uniform q on
// elements of length h puts q·h/2 and ±q·h²/12 on the end nodes and q·h on
// the inner ones (the consistent load vector of a uniformly loaded Hermite
// beam element, [qh/2, qh²/12, qh/2, −qh²/12], textbook closed form, from
// memory).
func TestNodalLoadsOfCasesAndCombinations(t *testing.T) {
	const l, n, q1, q2, f1, f2 = 4.0, 4, -3e3, -5e3, 1.35, 1.5
	m := beamOn(l, n, fem.LinearBar)
	m.Cases = []fem.LoadCase{
		{Name: "permanent", DistributedLoad: []fem.DistributedLoad{uniform(fem.Transverse, l, q1)}},
		{Name: "imposed", DistributedLoad: []fem.DistributedLoad{uniform(fem.Transverse, l, q2)}},
	}
	p, err := fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	st, err := p.Structure(p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	sets := p.LoadSets()
	var sols []*fem.Solution
	for i := range sets {
		s, err := st.Solve(&sets[i])
		if err != nil {
			t.Fatal(err)
		}
		sols = append(sols, s)
	}
	combined, err := fem.CombineSolutions(sols, []float64{f1, f2})
	if err != nil {
		t.Fatal(err)
	}
	const h = l / n
	for _, tc := range []struct {
		name string
		s    *fem.Solution
		q    float64
	}{
		{"case permanent", sols[0], q1},
		{"case imposed", sols[1], q2},
		{"combination 1.35 permanent + 1.5 imposed", combined, f1*q1 + f2*q2},
	} {
		nl := tc.s.NodalLoads()
		if len(nl.Nodes) != n+1 {
			t.Fatalf("%s: %d nodes, want %d", tc.name, len(nl.Nodes), n+1)
		}
		scale := math.Abs(tc.q) * l * l
		for i, node := range nl.Nodes {
			force, moment := tc.q*h, 0.0
			switch i {
			case 0:
				force, moment = tc.q*h/2, tc.q*h*h/12
			case n:
				force, moment = tc.q*h/2, -tc.q*h*h/12
			}
			if !near(node.Consistent[fem.Transverse], force, scale) || !near(node.Consistent[fem.Rotation], moment, scale) {
				t.Errorf("%s: node %d carries %g N and %g N·m, want %g and %g", tc.name, i, node.Consistent[fem.Transverse], node.Consistent[fem.Rotation], force, moment)
			}
		}
		if !near(nl.Resultant[fem.Transverse], tc.q*l, scale) {
			t.Errorf("%s: resultant %g N, want q·L = %g", tc.name, nl.Resultant[fem.Transverse], tc.q*l)
		}
	}
}

// The nodal loads name the elements solved: a member solved as a bar alone
// (a rod under its own weight along it on an axial support, which holds
// nothing across, or one declared axial-only) has no beam element, and its Beam is empty; it said "Hermite
// beam". A beam under a load across it names its Hermite beam. On the
// model's mesh (NodalLoadsOn) and on a solution's (Solution.NodalLoads).
func TestNodalLoadsNameTheElementsSolved(t *testing.T) {
	rod := func(declared bool) *fem.Model {
		m := beamOn(4, 4, fem.LinearBar)
		m.Supports = []fem.Support{{X: 0, Kind: fem.AxialOnly}}
		m.Gravity = [2]float64{fem.StandardGravity, 0}
		m.AxialOnly = declared
		return m
	}
	for _, c := range []struct {
		name      string
		model     *fem.Model
		bar, beam string
	}{
		{"rod under its weight along it", rod(false), "linear bar", ""},
		{"declared axial-only", rod(true), "linear bar", ""},
		{"beam under a load across", beamOn(4, 4, fem.LinearBar, uniform(fem.Transverse, 4, -10e3)), "linear bar", "Hermite beam"},
	} {
		t.Run(c.name, func(t *testing.T) {
			s, err := fem.Solve(c.model)
			if err != nil {
				t.Fatal(err)
			}
			for how, nl := range map[string]*fem.NodalLoads{"NodalLoadsOn": nodalLoads(t, c.model), "Solution.NodalLoads": s.NodalLoads()} {
				if nl.Bar != c.bar || nl.Beam != c.beam {
					t.Errorf("%s: bar %q, beam %q; want %q, %q", how, nl.Bar, nl.Beam, c.bar, c.beam)
				}
			}
		})
	}
}
