package canvas

import (
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// Demo data: a steel beam of two segments on a pinned and a roller support
// with an overhang, a trapezoidal load, a point force and a point moment.
func demoModel(elements int) *fem.Model {
	steel := fem.Material{Name: "steel", Elastic: 200e9, Density: 7850}
	sec := fem.Section{Area: 5.38e-3, SecondMoment: 8.36e-5, FibreDistance: 0.15}
	small := fem.Section{Area: 3.9e-3, SecondMoment: 4.5e-5, FibreDistance: 0.12}
	return &fem.Model{
		Segments: []fem.Segment{
			{Start: 0, End: 4, Section: sec, Material: steel},
			{Start: 4, End: 6, Section: small, Material: steel},
		},
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4.5, Kind: fem.Roller}},
		PointLoads: []fem.PointLoad{
			{X: 2, Transverse: -20e3},
			{X: 6, Transverse: -5e3, Axial: 10e3},
			{X: 3, Moment: 8e3},
		},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
			Points: []fem.LoadPoint{{X: 0, Intensity: -8e3}, {X: 4.5, Intensity: -14e3}}}},
		Mesh: fem.MeshSettings{Elements: elements},
	}
}

// solved builds the input for m with the finite element and exact solutions.
func solved(t testing.TB, m *fem.Model) Input {
	t.Helper()
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatalf("solving the demo model: %v", err)
	}
	e, err := fem.SolveExact(m)
	if err != nil {
		t.Fatalf("exact solution of the demo model: %v", err)
	}
	o := storage.Overlays{DeformedShape: true, AxialForce: true, ShearForce: true, BendingMoment: true, Stress: true, Nodes: true, ExactBand: true}
	return Input{Model: m, Solution: s, Exact: e, Overlays: o, Dimensions: true, Units: units.SI}
}
