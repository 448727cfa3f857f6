package fem

import (
	"fmt"
	"math"
	"testing"
)

// shearSegment is testSegment made a Timoshenko beam with shear area
// ratio κ and Poisson's ratio 0.3, so G = E/2.6.
func shearSegment(start, end, kappa float64) Segment {
	s := testSegment(start, end)
	s.ShearDeformation = true
	s.Section.ShearCoefficient = kappa
	s.Material.Poisson = 0.3
	s.Material.Density = 0
	return s
}

// Shear deformation adds to bending (Timoshenko beam; Gere & Goodno,
// Mechanics of Materials, and Roark's Formulas for Stress and Strain, from
// memory): a cantilever with a tip load P deflects PL³/(3EI) + PL/(κGA) at
// its tip; a simply supported beam under a uniform load q deflects
// 5qL⁴/(384EI) + qL²/(8κGA) at midspan; a beam fixed at both ends under a
// uniform load still carries the end moments qL²/12 (the load is symmetric).
// The interdependent interpolation element is exact at the nodes, so FE and
// exact agree to round-off there, for stubby members (L/d = 2) and slender
// ones alike.
func TestShearDeformation(t *testing.T) {
	const kappa, P, q = 5.0 / 6, -40e3, -25e3
	ei := testE * testI
	gka := testE / 2.6 * kappa * testA
	for _, L := range []float64{0.6, 6} {
		t.Run(fmt.Sprintf("L = %g m", L), func(t *testing.T) {
			cases := []struct {
				name     string
				supports []Support
				loads    func(m *Model)
				x        float64
				want     func(f Fields) (got, want float64, what string)
			}{
				{"cantilever, tip load", []Support{{X: 0, Kind: Fixed}}, func(m *Model) { m.PointLoads = []PointLoad{{X: L, Transverse: P}} }, L,
					func(f Fields) (float64, float64, string) {
						return f.Deflection, P*L*L*L/(3*ei) + P*L/gka, "tip deflection"
					}},
				{"simply supported, uniform load", []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}}, loadedUniformly(L, q), L / 2,
					func(f Fields) (float64, float64, string) {
						return f.Deflection, 5*q*L*L*L*L/(384*ei) + q*L*L/(8*gka), "midspan deflection"
					}},
				{"fixed at both ends, uniform load", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}}, loadedUniformly(L, q), 0,
					func(f Fields) (float64, float64, string) {
						return f.BendingMoment, q * L * L / 12, "end moment"
					}},
			}
			for _, c := range cases {
				m := &Model{Segments: []Segment{shearSegment(0, L, kappa)}, Supports: c.supports, Mesh: MeshSettings{Elements: 8}}
				c.loads(m)
				s := mustSolve(t, m)
				e, err := SolveExact(m)
				if err != nil {
					t.Fatal(err)
				}
				side := Right
				if c.x == L {
					side = Left
				}
				for name, f := range map[string]Field{"FE": s, "exact": e} {
					got, want, what := c.want(f.At(c.x, side))
					if what == "end moment" && name == "FE" {
						// The FE moment is linear in an element; the end
						// moment is the support's reaction (found by statics,
						// a counter-clockwise reaction to a hogging moment).
						got = -s.Reactions[0].Force[Rotation]
					}
					if math.Abs(got-want) > 1e-9*math.Abs(want) {
						t.Errorf("%s, %s: %s %.12g, want %.12g", c.name, name, what, got, want)
					}
				}
			}
		})
	}
}

// loadedUniformly puts a uniform transverse load q over [0, L] on a model.
func loadedUniformly(L, q float64) func(*Model) {
	return func(m *Model) {
		m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {L, q}}}}
	}
}

// The interdependent interpolation element's stiffness is its strain
// energy: uᵀKu = ∫EI·θ′² + G·As·γ² over the element for the shape
// functions of beamShape, with γ = w′ − θ (Gauss–Legendre quadrature,
// exact for these quadratics); and its shear strain is constant.
func TestTimoshenkoElementEnergy(t *testing.T) {
	const h, g = 0.7, 0.013 // m, m²
	d := elementData{length: h, sectionData: sectionData{flexuralRigidity: 3e6, shear: g}}
	k := d.beamStiffness()
	phi := d.phi(h)
	u := [4]float64{0.003, -0.02, -0.001, 0.011}
	var quad float64
	for i := range 4 {
		for j := range 4 {
			quad += u[i] * k[i][j] * u[j]
		}
	}
	energy := 0.0
	xs, ws := []float64{0.5 - 0.5/math.Sqrt(3), 0.5 + 0.5/math.Sqrt(3)}, []float64{0.5, 0.5}
	var gammas []float64
	for q, xi := range xs {
		const dx = 1e-6
		w0, t0 := beamShape(xi-dx, h, phi)
		w1, t1 := beamShape(xi+dx, h, phi)
		var dw, dtheta, theta float64
		_, tm := beamShape(xi, h, phi)
		for a := range 4 {
			dw += u[a] * (w1[a] - w0[a]) / (2 * dx * h)
			dtheta += u[a] * (t1[a] - t0[a]) / (2 * dx * h)
			theta += u[a] * tm[a]
		}
		gamma := dw - theta
		gammas = append(gammas, gamma)
		energy += ws[q] * h * (3e6*dtheta*dtheta + 3e6/g*gamma*gamma)
	}
	if math.Abs(quad-energy) > 1e-6*math.Abs(quad) {
		t.Errorf("uᵀKu = %.9g, ∫EI·θ′² + G·As·γ² = %.9g", quad, energy)
	}
	if math.Abs(gammas[0]-gammas[1]) > 1e-6*math.Abs(gammas[0]) {
		t.Errorf("shear strain %.9g and %.9g along the element: not constant", gammas[0], gammas[1])
	}
}

// The interdependent interpolation element, like the Hermite one for an
// Euler–Bernoulli beam, gives the exact nodal displacements for the loads
// Stave supports (nodal exactness of elements whose shape functions solve
// the homogeneous equations, Tong 1969, from memory): on a member mixing
// Timoshenko and Euler–Bernoulli segments, springs, settlements, point
// loads, a hinge and piecewise-linear loads, every node's w and θ equal the
// exact solution's, on a uniform and a graded mesh.
func TestShearNodalExactness(t *testing.T) {
	m := mixedModel(37)
	m.Segments[1].ShearDeformation = true
	m.Segments[1].Section.ShearArea = 2e-3
	m.Segments[1].Material.ShearModulus = 20e9 // a soft web: large shear deflection
	m.Segments[2].ShearDeformation = true
	m.Segments[2].Section.ShearCoefficient = 0.4
	m.Hinges = []Hinge{{X: 6.3, Stiffness: 2e6}}
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	var big [3]float64
	for _, d := range s.Displacement {
		for k := range big {
			big[k] = max(big[k], math.Abs(d[k]))
		}
	}
	for i, x := range s.Mesh.X {
		side := Left
		if i == 0 {
			side = Right
		}
		g := e.At(x, side)
		for k, v := range [3]float64{g.AxialDisplacement, g.Deflection, g.Rotation} {
			got := s.Displacement[i][k]
			if k == int(Rotation) && side == Left {
				got = s.At(x, Left).Rotation
			}
			if math.Abs(got-v) > 1e-9*big[k] {
				t.Fatalf("node %d (x = %.4g m), %s: FE %.12g, exact %.12g", i, x, Dof(k), got, v)
			}
		}
	}
}

// Shear deformation changes what a statically indeterminate beam carries.
// With Φ = 12EI/(κGA·L²), a beam fixed at both ends under a load P at a
// (b = L − a) has end moments Pab/L²·(b + ΦL/2)/(1 + Φ) and
// Pab/L²·(a + ΦL/2)/(1 + Φ); under a settlement Δ of one end, 6EIΔ/(L²(1 + Φ))
// at both; under a rotation θ of one end, (4 + Φ)EIθ/(L(1 + Φ)) there and
// (2 − Φ)EIθ/(L(1 + Φ)) at the other (the slope-deflection equations of the
// shear-flexible beam, Przemieniecki, Theory of Matrix Structural
// Analysis; checked by the unit-load method with ∫M·m/EI + ∫V·v/(κGA); from
// memory); integrated along a load rising from 0 at x = 0 to q₀ at L, the
// point load's moments give q₀L²(1/30 + Φ/24)/(1 + Φ) at x = 0 and
// q₀L²(1/20 + Φ/24)/(1 + Φ) at L (qL²/30 and qL²/20 without shear, as
// the beam tables give them). A propped cantilever under a uniform load q keeps its prop
// R = (qL⁴/(8EI) + qL²/(2κGA))/(L³/(3EI) + L/(κGA)) (the cantilever's tip
// deflections under q and under R cancel). Both solutions, for a stubby
// beam (L = 0.6 m, Φ ≈ 1.7) and a slender one (L = 6 m, Φ ≈ 0.017).
func TestShearDeformationIndeterminate(t *testing.T) {
	const kappa, P, q, delta, theta = 5.0 / 6, -40e3, -25e3, -2e-3, 3e-3
	ei := testE * testI
	gka := testE / 2.6 * kappa * testA
	for _, L := range []float64{0.6, 6} {
		phi := 12 * ei / (gka * L * L)
		a, b := L/3, 2*L/3
		prop := -q * (L*L*L*L/(8*ei) + L*L/(2*gka)) / (L*L*L/(3*ei) + L/gka)
		for _, c := range []struct {
			name     string
			supports []Support
			load     func(m *Model)
			want     [2][2]float64 // transverse reaction and moment at x = 0 and at x = L
		}{
			{"fixed at both ends, load at L/3", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}},
				func(m *Model) { m.PointLoads = []PointLoad{{X: a, Transverse: P}} },
				func() [2][2]float64 {
					ma := -P * a * b / (L * L) * (b + phi*L/2) / (1 + phi) // counter-clockwise reaction at x = 0
					mb := P * a * b / (L * L) * (a + phi*L/2) / (1 + phi)
					ra := -P*b/L + (ma+mb)/L
					return [2][2]float64{{ra, ma}, {-P - ra, mb}}
				}()},
			{"fixed at both ends, one settling", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed, Settlement: [3]float64{0, delta, 0}}},
				func(*Model) {},
				func() [2][2]float64 {
					m := -6 * ei * delta / (L * L * (1 + phi))
					return [2][2]float64{{2 * m / L, m}, {-2 * m / L, m}}
				}()},
			{"fixed at both ends, one turned", []Support{{X: 0, Kind: Fixed, Settlement: [3]float64{0, 0, theta}}, {X: L, Kind: Fixed}},
				func(*Model) {},
				func() [2][2]float64 {
					ma, mb := (4+phi)*ei*theta/(L*(1+phi)), (2-phi)*ei*theta/(L*(1+phi))
					return [2][2]float64{{(ma + mb) / L, ma}, {-(ma + mb) / L, mb}}
				}()},
			{"fixed at both ends, triangular load", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}},
				func(m *Model) {
					m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, 0}, {L, q}}}}
				},
				func() [2][2]float64 {
					ma := -q * L * L * (1.0/30 + phi/24) / (1 + phi)
					mb := q * L * L * (1.0/20 + phi/24) / (1 + phi)
					ra := -q*L/6 + (ma+mb)/L
					return [2][2]float64{{ra, ma}, {-q*L/2 - ra, mb}}
				}()},
			{"propped cantilever, uniform load", []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Roller}}, loadedUniformly(L, q),
				[2][2]float64{{-q*L - prop, -q*L*L/2 - prop*L}, {prop, 0}}},
		} {
			m := &Model{Segments: []Segment{shearSegment(0, L, kappa)}, Supports: c.supports, Mesh: MeshSettings{Elements: 8}}
			c.load(m)
			s := mustSolve(t, m)
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			scale := math.Abs(c.want[0][0]) + math.Abs(c.want[0][1])/L
			for name, rs := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
				for i, r := range rs {
					got := [2]float64{r.Force[Transverse], r.Force[Rotation]}
					if math.Abs(got[0]-c.want[i][0]) > 1e-9*scale || math.Abs(got[1]-c.want[i][1]) > 1e-9*scale*L {
						t.Errorf("L = %g m, %s, %s: support %d takes %.9g N, %.9g N·m; want %.9g N, %.9g N·m", L, c.name, name, i+1, got[0], got[1], c.want[i][0], c.want[i][1])
					}
				}
			}
		}
	}
}

// The energy error of a Timoshenko beam counts the shear strain energy
// ∫V²/(κGA) dx beside ∫M²/EI dx (the strain energy of a beam with shear
// deformation, Timoshenko & Gere, Mechanics of Materials, from memory). A
// simply supported beam under a uniform load q on equal elements of length
// h: the interdependent interpolation element, like the Hermite one, is
// exact at the nodes, so on each element the error is the fixed-ended
// element's response to q, M − M_h = q·s(h − s)/2 − qh²/12 and
// V − V_h = q(h/2 − s) (derived here, from the fixed-end moments qh²/12,
// which shear does not change for a symmetric load), giving
// ∫(M − M_h)² = q²h⁵/720 and ∫(V − V_h)² = q²h³/12 per element. The exact
// M = qx(L − x)/2 and V = q(L/2 − x) (statics) give ∫M² = q²L⁵/240 and
// ∫V² = q²L³/24 over each half of the span. On one Timoshenko segment the
// energy error is √((h⁴/(720EI) + h²/(12κGA)) / (L⁴/(120EI) + L²/(12κGA))),
// which falls as h² while bending leads and as h once shear does; on a
// member whose left half is an Euler–Bernoulli beam and whose right half
// deforms in shear with half the I, only the right half adds shear energy.
func TestCompareTimoshenkoEnergy(t *testing.T) {
	const kappa, q, L = 5.0 / 6, -25e3, 2.0
	ei := testE * testI
	gka := testE / 2.6 * kappa * testA
	halfI := func() []Segment {
		left, right := testSegment(0, L/2), shearSegment(L/2, L, kappa)
		left.Material.Density = 0
		right.Section.SecondMoment /= 2
		return []Segment{left, right}
	}
	for _, c := range []struct {
		name     string
		segments []Segment
		// The sums over the member of ∫M²/EI and ∫V²/(κGA) per unit q²,
		// exact and of the error on elements of length h.
		exact float64
		error func(h float64) float64
	}{
		{"one Timoshenko segment", []Segment{shearSegment(0, L, kappa)},
			L*L*L*L*L/(120*ei) + L*L*L/(12*gka),
			func(h float64) float64 { return L * (h*h*h*h/(720*ei) + h*h/(12*gka)) }},
		{"Euler–Bernoulli half, Timoshenko half", halfI(),
			L*L*L*L*L/240*(1/ei+2/ei) + L*L*L/(24*gka),
			func(h float64) float64 { return L / 2 * (h*h*h*h/(720*ei) + h*h*h*h/(360*ei) + h*h/(12*gka)) }},
	} {
		t.Run(c.name, func(t *testing.T) {
			var errs []float64
			for n := 2; n <= 64; n *= 2 {
				m := &Model{Segments: c.segments, Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
					Mesh: MeshSettings{Elements: n}}
				loadedUniformly(L, q)(m)
				s, e := solveBoth(t, m)
				got := Compare(s, e).RelativeEnergy
				want := math.Sqrt(c.error(L/float64(n)) / c.exact)
				if math.Abs(got-want) > 1e-8*want {
					t.Errorf("%d elements: energy error %.12g, want %.12g", n, got, want)
				}
				errs = append(errs, got)
			}
			if r := observedRate(errs); math.Abs(r-1) > 0.05 {
				t.Errorf("energy error rate on the finest meshes %.3f, want 1 (shear leads)", r)
			}
		})
	}
}

// The displacement errors of a Timoshenko beam: a simply supported one under
// a uniform load q on n elements of length h misses on each element the
// deflection of a fixed-ended element under q, qs²(h − s)²/(24EI) +
// qs(h − s)/(2κGA) (Timoshenko & Gere, fixed-ended beam with shear
// deformation, from memory; the element is exact at the nodes), largest at
// its middle, qh⁴/(384EI) + qh²/(8κGA). With a = qh⁴/(24EI) and
// b = qh²/(2κGA) its square integrates to h·(a²/630 + ab/70 + b²/30) (beta
// integrals), and the exact deflection qx(L³ − 2Lx² + x³)/(24EI) +
// qx(L − x)/(2κGA) (the same source) to L·(31A²/630 + 17AB/210 + B²/30)
// with A = qL⁴/(24EI) and B = qL²/(2κGA).
func TestCompareTimoshenkoDisplacement(t *testing.T) {
	const kappa, q, L = 5.0 / 6, -25e3, 2.0
	ei := testE * testI
	gka := testE / 2.6 * kappa * testA
	A, B := q*L*L*L*L/(24*ei), q*L*L/(2*gka)
	exact := L * (31*A*A/630 + 17*A*B/210 + B*B/30)
	for _, n := range []int{1, 4, 16} {
		m := &Model{Segments: []Segment{shearSegment(0, L, kappa)}, Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			Mesh: MeshSettings{Elements: n}}
		loadedUniformly(L, q)(m)
		s, e := solveBoth(t, m)
		got := Compare(s, e)
		h := L / float64(n)
		a, b := q*h*h*h*h/(24*ei), q*h*h/(2*gka)
		for _, c := range []check{
			{"RelativeL2", got.RelativeL2, math.Sqrt(float64(n) * h * (a*a/630 + a*b/70 + b*b/30) / exact)},
			{"MaxDeflection", got.MaxDeflection, math.Abs(a/16 + b/4)},
		} {
			if math.Abs(c.got-c.want) > 1e-8*c.want {
				t.Errorf("%d elements: %s = %.12g, want %.12g", n, c.what, c.got, c.want)
			}
		}
	}
}

// Shear deformation in statically indeterminate beams, by the flexibility
// method with the unit-load deflections of a beam with shear deformation,
// δ = ∫M·m/EI + ∫V·v/(κGA) (Timoshenko & Gere, Mechanics of Materials;
// Roark's Formulas for Stress and Strain, cantilever and simply supported
// cases with shear; from memory). With a = L³/(3EI) + L/(κGA), the
// deflection of a cantilever's tip under a unit tip load:
//   - a beam continuous over two spans L under a uniform load q: the
//     middle support takes the midspan deflection of the simply supported
//     span 2L, 5q(2L)⁴/(384EI) + q(2L)²/(8κGA), over its deflection under a
//     unit load there, (2L)³/(48EI) + 2L/(4κGA);
//   - a propped cantilever whose prop settles by Δ takes R = Δ/a there;
//   - a propped cantilever warmer below by ΔT (free curvature k = αΔT/h
//     lifts the free tip by kL²/2) takes R = −kL²/(2a);
//   - a cantilever under a uniform load on a spring k at its tip takes
//     R = −q(L⁴/(8EI) + L²/(2κGA))/(a + 1/k);
//   - a beam fixed at x = 0 with a hinge at c and a roller at L, under a
//     uniform load q, hangs the span beyond the hinge on it, F = q(L − c)/2,
//     and deflects there by qc⁴/(8EI) + qc²/(2κGA) + Fc³/(3EI) + Fc/(κGA);
//   - a member fixed at x = 0 and guided at L (free to deflect, held
//     against turning) under a load P at L bends in double curvature,
//     M = ±PL/2, and deflects there by PL³/(12EI) + PL/(κGA);
//   - a cantilever on a pinned support with a rotational spring kᵣ turns
//     there by PL/kᵣ under a tip load P, which the spring takes from the
//     cross-section's rotation: w(L) = PL³/(3EI) + PL/(κGA) + PL²/kᵣ;
//   - a cantilever whose inner half is an Euler–Bernoulli beam and whose
//     outer half deforms in shear with half the I deflects under a tip
//     load P by P(7L³/24 + 2·L³/24)/EI from bending (∫(L − x)²/EI over
//     each half) and PL/(2κGA) from the shear of the outer half alone.
func TestShearDeformationClosedForms(t *testing.T) {
	const kappa, q, P, L, k, kr, delta, dT = 5.0 / 6, -25e3, -40e3, 4.0, 5e7, 2e7, -2e-3, 30.0
	ei := testE * testI
	gka := testE / 2.6 * kappa * testA
	a := L*L*L/(3*ei) + L/gka
	curvature := testα * dT / (2 * testC)
	for _, c := range []struct {
		name  string
		model func() *Model
		value func(s Field, r []Reaction) float64
		want  float64
	}{
		{"two spans, uniform load, middle support", func() *Model {
			m := &Model{Segments: []Segment{shearSegment(0, 2*L, kappa)},
				Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}}}
			loadedUniformly(2*L, q)(m)
			return m
		}, func(_ Field, r []Reaction) float64 { return r[1].Force[Transverse] },
			-q * (5*16*L*L*L*L/(384*ei) + 4*L*L/(8*gka)) / (8*L*L*L/(48*ei) + 2*L/(4*gka))},
		{"propped cantilever, prop settles", func() *Model {
			return &Model{Segments: []Segment{shearSegment(0, L, kappa)},
				Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Roller, Settlement: [3]float64{0, delta, 0}}}}
		}, func(_ Field, r []Reaction) float64 { return r[1].Force[Transverse] }, delta / a},
		{"propped cantilever, warmer below", func() *Model {
			s := shearSegment(0, L, kappa)
			s.TemperatureDifference = dT
			return &Model{Segments: []Segment{s}, Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Roller}}}
		}, func(_ Field, r []Reaction) float64 { return r[1].Force[Transverse] }, -curvature * L * L / (2 * a)},
		{"cantilever on a spring, uniform load", func() *Model {
			m := &Model{Segments: []Segment{shearSegment(0, L, kappa)},
				Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Spring, Stiffness: [3]float64{0, k, 0}}}}
			loadedUniformly(L, q)(m)
			return m
		}, func(_ Field, r []Reaction) float64 { return r[1].Force[Transverse] },
			-q * (L*L*L*L/(8*ei) + L*L/(2*gka)) / (a + 1/k)},
		{"hinge, deflection there", func() *Model {
			m := &Model{Segments: []Segment{shearSegment(0, L, kappa)},
				Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Roller}}, Hinges: []Hinge{{X: L / 4}}}
			loadedUniformly(L, q)(m)
			return m
		}, func(s Field, _ []Reaction) float64 { return s.At(L/4, Left).Deflection }, func() float64 {
			c, f := L/4, q*3*L/4/2
			return q*c*c*c*c/(8*ei) + q*c*c/(2*gka) + f*c*c*c/(3*ei) + f*c/gka
		}()},
		{"fixed and guided, load at the guided end", func() *Model {
			return &Model{Segments: []Segment{shearSegment(0, L, kappa)}, Supports: []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Guided}},
				PointLoads: []PointLoad{{X: L, Transverse: P}}}
		}, func(s Field, _ []Reaction) float64 { return s.At(L, Left).Deflection },
			P * (L*L*L/(12*ei) + L/gka)},
		{"cantilever on a rotational spring, tip load", func() *Model {
			return &Model{Segments: []Segment{shearSegment(0, L, kappa)}, Supports: []Support{{X: 0, Kind: Pinned, Stiffness: [3]float64{Rotation: kr}}},
				PointLoads: []PointLoad{{X: L, Transverse: P}}}
		}, func(s Field, _ []Reaction) float64 { return s.At(L, Left).Deflection },
			P * (L*L*L/(3*ei) + L/gka + L*L/kr)},
		{"stepped cantilever, shear in the outer half", func() *Model {
			inner, outer := testSegment(0, L/2), shearSegment(L/2, L, kappa)
			inner.Material.Density = 0
			outer.Section.SecondMoment /= 2
			return &Model{Segments: []Segment{inner, outer}, Supports: []Support{{X: 0, Kind: Fixed}},
				PointLoads: []PointLoad{{X: L, Transverse: P}}}
		}, func(s Field, _ []Reaction) float64 { return s.At(L, Left).Deflection },
			P * (3*L*L*L/(8*ei) + L/(2*gka))},
	} {
		m := c.model()
		m.Mesh.Elements = 8
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		for name, got := range map[string]float64{"FE": c.value(s, s.Reactions), "exact": c.value(e, e.Reactions())} {
			if math.Abs(got-c.want) > 1e-9*math.Abs(c.want) {
				t.Errorf("%s, %s: %.12g, want %.12g", c.name, name, got, c.want)
			}
		}
	}
}
