package report

import (
	"bytes"
	"context"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/study"
)

// The theory line of the convergence text must cover what a model with
// shear deformation shows: the interdependent interpolation element is
// exact at the nodes, but inside an element of length h under a line load
// q it misses the shear part of the deflection of a beam clamped at both
// ends, q·h²/(8·κGA) at its middle (Timoshenko & Gere, fixed-ended beam
// with shear deformation: w = qL⁴/(384EI) + qL²/(8κGA)), so its
// displacement error falls as h², not h⁴. Its shear force is constant in
// an element, off by up to q·h/2 from the exact one (slope q), so the shear
// strain energy of the difference, ∫(V_h − V)²/(κGA) = q²h²L/(12κGA) over
// the member, makes the energy error fall as h, not h² (derived from the
// element's constant shear; Timoshenko & Gere for the strain energy
// ∫V²/(κGA), from memory). A simply supported shear-flexible beam under a
// uniform load measures the rates the text gives.
func TestConvergenceTheoryOfShearDeformation(t *testing.T) {
	m := fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 3, ShearDeformation: true,
			Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15, ShearArea: 0.006},
			Material: fem.Material{Elastic: 2e11, ShearModulus: 8e10}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 3, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -40e3}, {X: 3, Intensity: -40e3}}}},
	}
	table, err := study.Convergence(context.Background(), &m, 64)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(table.L2.Last-2) > 0.1 {
		t.Errorf("displacement rate of the last step %.3f, want 2 (the shear part of the deflection)", table.L2.Last)
	}
	if math.Abs(table.Energy.Last-1) > 0.1 {
		t.Errorf("energy rate of the last step %.3f, want 1 (the shear strain energy)", table.Energy.Last)
	}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "shear-flexible beam", table, nil, nil, nil)
	if !strings.Contains(buf.String(), "beams with shear deformation 2 and 1") {
		t.Errorf("the theory line gives no rate for beams with shear deformation:\n%s", buf.String())
	}
}
