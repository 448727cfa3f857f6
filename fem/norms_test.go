package fem

import (
	"math"
	"testing"
)

func solveBoth(t *testing.T, m *Model) (*Solution, *Exact) {
	t.Helper()
	s, err := Solve(m)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatalf("SolveExact: %v", err)
	}
	return s, e
}

// With point loads only the exact u is linear and w cubic between nodes, so
// linear bars and Hermite beams reproduce them (Hughes, The Finite Element
// Method, ch. 1, nodal exactness in one dimension, from memory): every norm
// must be at round-off level.
func TestCompareZeroWhenTheElementsAreExact(t *testing.T) {
	m := Model{Segments: member(5, 2),
		Supports: []Support{{X: 0, Kind: Fixed}, {X: 3.5, Kind: Roller},
			{X: 5, Kind: Spring, Stiffness: [3]float64{1e6, 3e5, 0}}},
		PointLoads: []PointLoad{{X: 1, Axial: 8e3, Transverse: -6e3}, {X: 4.2, Moment: 2e3, Transverse: 1e3}},
		Mesh:       MeshSettings{Elements: 7}}
	m.Segments[1].Section.SecondMoment = tI / 2
	s, e := solveBoth(t, &m)
	n := Compare(s, e)
	scale := math.Abs(e.At(4.2, Right).Deflection) + math.Abs(e.At(1, Right).AxialDisplacement)
	for _, c := range []check{
		{"MaxDeflection/scale", n.MaxDeflection / scale, 0},
		{"MaxAxial/scale", n.MaxAxial / scale, 0},
		{"MaxStressRelative", n.MaxStressRelative, 0},
		{"RelativeL2", n.RelativeL2, 0},
		{"RelativeEnergy", n.RelativeEnergy, 0},
	} {
		if !(c.got < 1e-11) {
			t.Errorf("%s = %.3g, want round-off (< 1e-11)", c.what, c.got)
		}
	}
	t.Logf("point loads only: %+v", n)
}

// A bar fixed at x = 0 under a uniform axial load p, n linear elements. The
// nodal values are exact, so on each element of length h the error is the
// interpolation error (p/2EA)·s·(h − s) and N − N_h = p·(h/2 − s). Integrating:
// ‖u − u_h‖/‖u‖ = 1/(4n²) and the energy ratio is 1/(2n); max |u − u_h| =
// pL²/(8EA·n²) and the stress error peaks at p·h/(2A) against pL/A.
// Derived from the interpolation error of linear elements (Strang & Fix, An
// Analysis of the Finite Element Method, ch. 1 and 3, rates 2 and 1, from memory).
func TestCompareLinearBarUniformLoad(t *testing.T) {
	for _, n := range []int{1, 2, 4, 8, 16} {
		m := Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Axial, 0, tL, tQ, tQ)},
			Mesh:            MeshSettings{Elements: n, BarOrder: LinearBar}}
		s, e := solveBoth(t, &m)
		got := Compare(s, e)
		nf := float64(n)
		for _, c := range []check{
			{"RelativeL2", got.RelativeL2, 1 / (4 * nf * nf)},
			{"RelativeEnergy", got.RelativeEnergy, 1 / (2 * nf)},
			{"MaxAxial", got.MaxAxial, tQ * tL * tL / (8 * tEA * nf * nf)},
			{"MaxStressRelative", got.MaxStressRelative, 1 / (2 * nf)},
			{"MaxDeflection", got.MaxDeflection, 0},
		} {
			tol := relTol * math.Abs(c.want)
			if c.want == 0 {
				tol = 1e-15 // m: far below the 1e-4 m axial displacements here
			}
			if math.Abs(c.got-c.want) > tol {
				t.Errorf("%d elements: %s = %.12g, want %.12g", n, c.what, c.got, c.want)
			}
		}
	}
}

// observedRate fits the slope of log(error) against log(h) over the last
// three meshes of a halving sequence.
func observedRate(errs []float64) float64 {
	k := len(errs)
	return math.Log2(errs[k-3]/errs[k-1]) / 2
}

// Convergence under refinement, measured by fitting the observed rate
// (Strang & Fix, An Analysis of the Finite Element Method, ch. 3, from memory:
// with degree-k elements the L2 error is O(h^(k+1)) and the energy error O(h^k)).
func TestCompareConvergenceRates(t *testing.T) {
	for _, c := range []struct {
		name               string
		model              Model
		rateL2, rateEnergy float64
	}{
		{"quadratic bar, linearly varying axial load", Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Axial, 0, tL, 0, tQ)}, Mesh: MeshSettings{BarOrder: QuadraticBar}}, 3, 2},
		{"Hermite beam, simply supported, uniform load", Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}}, 4, 2},
		{"Hermite beam, cantilever, triangular load", Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, 0)}}, 4, 2},
	} {
		t.Run(c.name, func(t *testing.T) {
			var l2, energy []float64
			for n := 2; n <= 32; n *= 2 {
				m := c.model
				m.Mesh.Elements = n
				s, e := solveBoth(t, &m)
				got := Compare(s, e)
				l2, energy = append(l2, got.RelativeL2), append(energy, got.RelativeEnergy)
			}
			r2, re := observedRate(l2), observedRate(energy)
			t.Logf("L2 %.3g → %.3g (rate %.3f), energy %.3g → %.3g (rate %.3f)", l2[0], l2[len(l2)-1], r2, energy[0], energy[len(energy)-1], re)
			if math.Abs(r2-c.rateL2) > 0.1 || math.Abs(re-c.rateEnergy) > 0.1 {
				t.Errorf("observed rates L2 %.3f, energy %.3f; theory %g and %g", r2, re, c.rateL2, c.rateEnergy)
			}
		})
	}
}

// Members that move without straining: exact N and M vanish and the finite
// element ones are round-off, so the relative stress and energy errors must
// read 0, not a ratio of two round-off values or an infinity.
func TestCompareVanishingExactStress(t *testing.T) {
	heated := Model{Segments: member(tL, 1.5), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
		TemperatureChange: tT, Mesh: MeshSettings{Elements: 6}}
	heated.Segments[1].Section.Area = tA / 3
	settled := Model{Segments: member(tL, 1.5),
		Supports: []Support{{X: 0, Kind: Pinned, Settlement: [3]float64{0.002, 0, 0}},
			{X: tL, Kind: Roller, Settlement: [3]float64{0, -0.01, 0}}},
		Mesh: MeshSettings{Elements: 6}}
	for name, m := range map[string]Model{"free thermal expansion": heated, "settlement of a simple beam": settled} {
		s, e := solveBoth(t, &m)
		got := Compare(s, e)
		if got.MaxStressRelative != 0 || got.RelativeEnergy != 0 {
			t.Errorf("%s: MaxStressRelative = %g, RelativeEnergy = %g, want 0 and 0 (absolute stress error %g Pa)",
				name, got.MaxStressRelative, got.RelativeEnergy, got.MaxStress)
		}
		if !(got.RelativeL2 < 1e-12) {
			t.Errorf("%s: RelativeL2 = %g, want round-off", name, got.RelativeL2)
		}
	}
}

// A bar held at both ends and heated does not move: the displacement error
// is round-off over round-off, which read 128 % when it was divided by the
// exact displacement alone. Here the two segments carry the same thermal
// force E·A·α·ΔT (A and α in inverse proportion), equal to the last bit or
// not, so the exact u is zero (restrained bar under a temperature change:
// N = −E·A·α·ΔT, u = 0; Gere & Goodno, Mechanics of Materials, thermal
// effects, from memory) and both solutions find round-off there.
func TestCompareVanishingExactDisplacement(t *testing.T) {
	for _, area := range []float64{0.0033, 0.0031, 0.007} {
		m := Model{Segments: member(tL, 1.7), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Fixed}},
			TemperatureChange: 30, Mesh: MeshSettings{Elements: 10}}
		m.Segments[1].Section.Area = area
		m.Segments[1].Material.ThermalExpansion = tX * tA / area
		s, e := solveBoth(t, &m)
		got := Compare(s, e)
		if got.RelativeL2 > 1e-12 || got.RelativeEnergy > 1e-12 || got.MaxStressRelative > 1e-12 {
			t.Errorf("A₂ = %g m²: displacement error %g, energy error %g, stress error %g; want round-off (< 1e-12) (largest |u_h − u| %g m)",
				area, got.RelativeL2, got.RelativeEnergy, got.MaxStressRelative, got.MaxAxial)
		}
		// The axial force is the restrained thermal force of either segment.
		want := -tE * tA * tX * 30
		if n := e.At(1, Right).AxialForce; math.Abs(n-want) > 1e-9*math.Abs(want) {
			t.Errorf("A₂ = %g m²: exact N = %g N, want −E·A·α·ΔT = %g N", area, n, want)
		}
	}
}

func TestRelativeError(t *testing.T) {
	for _, c := range []struct {
		name                                  string
		err, exact, exactTerms, feTerms, want float64
	}{
		{"ordinary ratio", 0.5, 10, 12, 11, 0.05},
		{"everything zero", 0, 0, 0, 0, 0},
		{"exact and error at round-off of the terms", 1e-6, 1e-7, 1e5, 1e5, 0},
		{"exact exactly zero, error at round-off of the finite element terms", 1e-7, 0, 0, 1e3, 0},
		{"exact zero, real error", 3, 0, 0, 3, 1},
		{"exact negligible, real error against the terms", 2e4, 1e-8, 8e4, 2e4, 0.25},
	} {
		asked := false
		feTerms := func() float64 { asked = true; return c.feTerms }
		if got := relativeError(c.err, c.exact, c.exactTerms, feTerms); math.Abs(got-c.want) > 1e-15 {
			t.Errorf("%s: relativeError = %g, want %g", c.name, got, c.want)
		}
		// The finite element terms are worked out only when the exact measure is negligible.
		if ordinary := c.exact > 1e-9*c.exactTerms && c.exact > 0; asked == ordinary {
			t.Errorf("%s: finite element terms asked for: %v", c.name, asked)
		}
	}
}

// A load that acts at a support goes straight into it: the member carries
// nothing (a bar pinned at both ends and pulled at one of them: N = 0
// between the supports, the support there takes the whole load; statics,
// from memory). Both solutions are round-off then, and their own terms
// are as well, so the stress error was round-off over round-off: a bar of
// 3.7 m, A = 0.0033 m², pulled by 3.3 N at its pinned end read a stress
// error of 100 % on 1.3e-13 Pa. Round-off against the loads' scale (P/A)
// is no error.
func TestCompareLoadIntoSupport(t *testing.T) {
	for _, c := range []struct {
		name      string
		L, area   float64
		supports  []Support
		load      PointLoad
		axialOnly bool
	}{
		{"tie pinned at both ends, pulled at one", 3.7, 0.0033, []Support{{X: 0, Kind: Pinned}, {X: 3.7, Kind: Pinned}}, PointLoad{X: 3.7, Axial: 3.3}, true},
		{"bar with an overhang, pulled at its fixed end", 2.35, 0.0033, []Support{{X: 0.56, Kind: Pinned}, {X: 2.35, Kind: Fixed}}, PointLoad{X: 2.35, Axial: 3.3}, false},
		{"tie of 1 m, A = 0.003 m²", 1, 0.003, []Support{{X: 0.56, Kind: Pinned}, {X: 1, Kind: Pinned}}, PointLoad{X: 1, Axial: 3.3}, true},
	} {
		m := Model{Segments: member(c.L), Supports: c.supports, PointLoads: []PointLoad{c.load}, AxialOnly: c.axialOnly}
		m.Segments[0].Section.Area = c.area
		s, e := solveBoth(t, &m)
		got := Compare(s, e)
		if got.MaxStressRelative != 0 || got.RelativeEnergy != 0 || got.RelativeL2 != 0 {
			t.Errorf("%s: stress error %g, energy error %g, displacement error %g, want 0 (absolute stress error %g Pa beside P/A = %g Pa)",
				c.name, got.MaxStressRelative, got.RelativeEnergy, got.RelativeL2, got.MaxStress, c.load.Axial/c.area)
		}
	}
}

// A beam on a stiff elastic foundation deflects little, and its
// displacement error is real, not round-off: a 12 m ground beam (E = 30
// GPa, I = 0.0256 m⁴) under 600 kN at x = 1.5 m and x = 10.5 m on a bed of
// k = 1e15 N/m² deflects P·β/(2k) under each load, β = (k/4EI)^¼ (Hetényi,
// Beams on Elastic Foundation, infinite beam under a concentrated load,
// from memory; the ends and the other load lie 36/β and more away). The
// displacements were measured against what the loads would bend the
// member over its whole length, P·L³/EI, 1e8 times more: the error read
// 0 % on every mesh of a convergence study, and at 1e17 N/m² the
// deflection itself read 0. The error is checked against its definition
// (ErrorNorms: the root mean square of w_h − w over that of w), integrated
// here on a fine grid.
func TestDisplacementErrorOnAStiffFoundation(t *testing.T) {
	const L, E, I, P = 12.0, 30e9, 0.0256, 600e3
	for _, c := range []struct {
		k        float64
		elements int
	}{{1e15, 4}, {1e15, 600}, {1e17, 600}} {
		m := &Model{
			Segments: []Segment{{Start: 0, End: L, Section: Section{Area: 0.48, SecondMoment: I, FibreDistance: 0.4},
				Material: Material{Elastic: E}}},
			Supports:    []Support{{X: 6, Kind: AxialOnly}},
			Foundations: []Foundation{{Start: 0, End: L, Modulus: c.k}},
			PointLoads:  []PointLoad{{X: 1.5, Transverse: -P}, {X: 10.5, Transverse: -P}},
			Mesh:        MeshSettings{Elements: c.elements},
		}
		s, e := solveBoth(t, m)
		beta := math.Pow(c.k/(4*E*I), 0.25)
		want := -P * beta / (2 * c.k)
		if w := e.At(1.5, Right).Deflection; !relNear(w, want, 1e-6) {
			t.Fatalf("k = %g N/m²: exact deflection under the load %g m, Hetényi %g m", c.k, w, want)
		}
		sum := Summarize(s, e)
		if d := sum.Extremes[QDeflection]; !relNear(d.Min, want, 1e-6) {
			t.Errorf("k = %g N/m², %d elements: smallest deflection %g m, want %g m", c.k, c.elements, d.Min, want)
		}
		const n = 200000
		var diff, size float64
		for i := range n + 1 {
			x := L * float64(i) / n
			w, wh := e.At(x, Right).Deflection, s.At(x, Right).Deflection
			f := 1.0
			if i == 0 || i == n {
				f = 0.5
			}
			diff += f * (wh - w) * (wh - w)
			size += f * w * w
		}
		want = math.Sqrt(diff / size)
		if got := sum.ExactError.RelativeL2; !relNear(got, want, 0.02) {
			t.Errorf("k = %g N/m², %d elements: displacement error %g, want %g", c.k, c.elements, got, want)
		}
	}
}

// Along the member alike: a 10 m bar (EA = 8e8 N) on an axial bed of
// kₐ = 1e20 N/m² pulled by P = 100 kN at its free end x = 0 stretches
// u(0) = P/(EA·α), α = √(kₐ/EA), and the bed holds the rest (the
// semi-infinite bar on an elastic bed, EA·u″ = kₐ·u, from memory). Against
// P·L/EA, 1e10 times more, its displacement and their error read 0.
func TestAxialDisplacementOnAStiffBed(t *testing.T) {
	const L, EA, P, ka = 10.0, 8e8, 100e3, 1e20
	m := &Model{
		Segments:    []Segment{{Start: 0, End: L, Section: Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: Material{Elastic: EA / 0.004}}},
		Foundations: []Foundation{{Start: 0, End: L, AxialModulus: ka}},
		PointLoads:  []PointLoad{{X: 0, Axial: -P}},
		AxialOnly:   true,
		Mesh:        MeshSettings{Elements: 4},
	}
	s, e := solveBoth(t, m)
	want := -P / (EA * math.Sqrt(ka/EA))
	if u := e.At(0, Right).AxialDisplacement; !relNear(u, want, 1e-6) {
		t.Fatalf("exact u(0) = %g m, want %g m", u, want)
	}
	sum := Summarize(s, e)
	if u := sum.Extremes[QAxialDisplacement]; !relNear(u.Min, want, 1e-6) {
		t.Errorf("smallest axial displacement %g m, want %g m", u.Min, want)
	}
	if sum.ExactError.RelativeL2 == 0 {
		t.Errorf("displacement error 0 on 4 elements over a decay length of %g m", 1/math.Sqrt(ka/EA))
	}
}
