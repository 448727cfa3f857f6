package check

import (
	"math"
	"strings"
	"testing"

	"stave/fem"
)

// A ground beam on its bed under a point load in the middle: the ground
// carries the whole load (statics), and the finite element balance, read
// from the displacements of a fine mesh, misses by no more than its
// round-off bound (Condition·ε): the equilibrium checks pass on the default
// mesh. A balance that misses by more than that bound fails.
func TestEquilibriumOnAFoundation(t *testing.T) {
	m := fem.Model{Segments: []fem.Segment{{Start: 0, End: 40, // a concrete strip, 0.4 × 0.5 m nominal
		Section:  fem.Section{Area: 0.1, SecondMoment: 1e-3, FibreDistance: 0.25},
		Material: fem.Material{Elastic: 30e9}}}}
	m.Foundations = []fem.Foundation{{Start: 0, End: 40, Modulus: 5e7}}
	m.PointLoads = []fem.PointLoad{{X: 20, Transverse: -100e3}}
	s, e := solveBoth(t, &m)
	for _, r := range equilibriumChecks(&m, s, e, Options{}) {
		if r.Status != Pass {
			t.Errorf("%s: %v on the default mesh (condition %.2g): %s", r.Name, r.Status, s.Condition, r.Message)
		}
	}
	off := *s
	off.Equilibrium.Reactions[fem.Transverse] *= 1 + 100*max(s.Condition*epsilon, equilibriumTolerance)
	if r := find(t, equilibriumChecks(&m, &off, e, Options{}), "Equilibrium, transverse"); r.Status != Fail {
		t.Errorf("a balance off by 100 times its round-off bound: %v, want a failure", r.Status)
	}
}

// A determinate beam warmer below curves freely: no support acts, every
// reaction and internal force is round-off. Its balance is judged against
// the forces the temperature difference would make if restrained
// (EI·α·ΔT/h, Model.ImposedScales), not against that round-off, and its
// force fields are not reported as far from exact. Before, both failed: a
// residual of 3e-16 N against loads of nothing.
func TestEquilibriumOfFreeThermalCurvature(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Roller}, {X: 3, Kind: fem.Guided}}, 0)
	m.Segments[0].TemperatureDifference = 10
	m.Mesh = fem.MeshSettings{}
	s, e := solveBoth(t, &m)
	for _, r := range equilibriumChecks(&m, s, e, Options{}) {
		if r.Status != Pass {
			t.Errorf("%s: %v", r.Name, r.Status)
		}
	}
	for _, x := range fem.Summarize(s, e).Extremes {
		if x.Accuracy > fem.MeshAccuracy {
			t.Errorf("%s: FE %.3g..%.3g against exact %.3g..%.3g reads %.3g apart", x.Quantity, x.FEMin, x.FEMax, x.Min, x.Max, x.Accuracy)
		}
	}
	if f, mo := m.ImposedScales(); f != 0 || mo <= 0 {
		t.Errorf("imposed scales %g N, %g N·m; want none along and EI·α·ΔT/h across", f, mo)
	}
}

// An error against the exact solution that could not be measured (NaN: the
// comparison overflowed, as on a member whose thermal expansion of about
// 9e302 /K reached the error norms) is never a pass: the check says it
// could not judge the mesh, and is flagged.
func TestExactErrorNotANumberIsNoPass(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 0)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -10e3}}
	s, e := solveBoth(t, &m)
	p := &Probe{model: &m, solution: s, exact: e}
	p.norms.MaxStressRelative, p.norms.RelativeEnergy = math.NaN(), math.NaN()
	r := exactCheck(p, DefaultOptions())
	if r.Status == Pass || !strings.Contains(r.Message, "could not be measured") {
		t.Errorf("an error of NaN: %v, %q; want it flagged as not measured", r.Status, r.Message)
	}
	p.norms.MaxStressRelative, p.norms.RelativeEnergy = 0.001, 0.001
	if r := exactCheck(p, DefaultOptions()); r.Status != Pass {
		t.Errorf("an error of 0.1 %%: %v, want a pass", r.Status)
	}
}

// Loads that balance among themselves leave the supports nothing to carry:
// two opposite couples of 5 kN·m over the supports of a beam with
// overhangs (each span between them bends uniformly, the overhangs carry
// nothing; statics, Roark's Formulas for Stress and Strain, Table 8.1
// case 3 with the couple at a support, from memory), a force pair with its
// balancing couple, and opposite axial forces on a bar. Every reaction is
// round-off, and so are the sums; the balance is judged against the sizes
// of the loads themselves, not against those sums. Before, the moment
// balance of the two couples failed on a residual of 2e-12 N·m against
// loads that add up to nothing, and the command exited 3.
func TestEquilibriumOfLoadsThatBalance(t *testing.T) {
	overhangs := []fem.Support{{X: 1, Kind: fem.Pinned}, {X: 7, Kind: fem.Roller}}
	for _, c := range []struct {
		name   string
		points []fem.PointLoad
	}{
		{"opposite couples over the supports", []fem.PointLoad{{X: 1, Moment: 5e3}, {X: 7, Moment: -5e3}}},
		{"opposite couples at the ends", []fem.PointLoad{{X: 0, Moment: 5e3}, {X: 9, Moment: -5e3}}},
		{"a force pair and its balancing couple", []fem.PointLoad{{X: 2.3, Transverse: 7e3}, {X: 5.9, Transverse: -7e3}, {X: 4.1, Moment: 7e3 * 3.6}}},
		{"opposite axial forces", []fem.PointLoad{{X: 0.7, Axial: 3e3}, {X: 8.3, Axial: -3e3}}},
	} {
		m := beam(9, overhangs, 0)
		m.Segments[0].Material.Density = 0
		m.PointLoads = c.points
		m.Mesh = fem.MeshSettings{}
		s, e := solveBoth(t, &m)
		for _, r := range equilibriumChecks(&m, s, e, DefaultOptions()) {
			if r.Status != Pass {
				t.Errorf("%s: %s %v: %s", c.name, r.Name, r.Status, r.Message)
			}
		}
		off := *s
		off.Equilibrium.Reactions[fem.Rotation]++ // 1 N·m against couples of 5 kN·m and more
		if r := find(t, equilibriumChecks(&m, &off, e, DefaultOptions()), "Equilibrium, moments"); r.Status != Fail {
			t.Errorf("%s: a moment balance off by 1 N·m: %v, want a failure", c.name, r.Status)
		}
	}
}

// A beam with no load along it has no axial reaction: the equilibrium
// check's limit (the reactions' sum, negated to compare with the loads) is
// +0, never -0, which the JSON wrote as "limit": -0. Before, the axial row
// of every model without axial loads read -0.
func TestEquilibriumLimitHasNoNegativeZero(t *testing.T) {
	m := beam(4, []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, 0)
	m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -10e3}}
	s, e := solveBoth(t, &m)
	for _, r := range equilibriumChecks(&m, s, e, Options{}) {
		if (r.Value == 0 && math.Signbit(r.Value)) || (r.Limit == 0 && math.Signbit(r.Limit)) {
			t.Errorf("%s: value %g, limit %g; want no negative zero", r.Name, r.Value, r.Limit)
		}
	}
}
