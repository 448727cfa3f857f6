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
