package bench

import "stave/fem"

// Demo data: the sections, loads and supports below are invented numbers
// chosen to exercise every kind of load and several supports, not a design.

// steel is a structural steel with round-number properties (demo data).
var steel = fem.Material{Name: "steel", Elastic: 210e9, Density: 7850, ThermalExpansion: 12e-6}

// BarModel is a 12 m tie of two sections hanging from x = 0 under its own
// weight, with uniform and triangular axial loads, two point loads, a rise
// of temperature, and three axial restraints (one of them elastic).
func BarModel(elements int) *fem.Model {
	return &fem.Model{
		Segments: []fem.Segment{
			{Start: 0, End: 6, Section: fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.05}, Material: steel},
			{Start: 6, End: 12, Section: fem.Section{Area: 2.5e-3, SecondMoment: 5e-6, FibreDistance: 0.05}, Material: steel},
		},
		Supports: []fem.Support{
			{X: 0, Kind: fem.Pinned},
			{X: 7, Kind: fem.AxialOnly},
			{X: 12, Kind: fem.Spring, Stiffness: [3]float64{5e7, 2e6, 0}},
		},
		PointLoads: []fem.PointLoad{{X: 4.5, Axial: 20e3}, {X: 10, Axial: -15e3}},
		DistributedLoad: []fem.DistributedLoad{
			{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 2e3}, {X: 12, Intensity: 2e3}}},
			{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 3, Intensity: 0}, {X: 9, Intensity: 5e3}}},
		},
		Gravity:           [2]float64{fem.StandardGravity, 0},
		TemperatureChange: 20,
		Mesh:              fem.MeshSettings{Elements: elements, BarOrder: fem.LinearBar},
	}
}

// BeamModel is a 15 m continuous beam of two sections over four supports
// (fixed, two rollers, a spring), under self-weight, a uniform and a
// triangular load, two point forces, a point moment and an axial pull.
func BeamModel(elements int) *fem.Model {
	return &fem.Model{
		Segments: []fem.Segment{
			{Start: 0, End: 5, Section: fem.Section{Area: 5.38e-3, SecondMoment: 8.36e-5, FibreDistance: 0.15}, Material: steel},
			{Start: 5, End: 15, Section: fem.Section{Area: 6.26e-3, SecondMoment: 1.16e-4, FibreDistance: 0.165}, Material: steel},
		},
		Supports: []fem.Support{
			{X: 0, Kind: fem.Fixed},
			{X: 5, Kind: fem.Roller},
			{X: 10, Kind: fem.Roller},
			{X: 15, Kind: fem.Spring, Stiffness: [3]float64{0, 5e6, 0}},
		},
		PointLoads: []fem.PointLoad{
			{X: 2.5, Transverse: -30e3},
			{X: 7.5, Moment: 15e3},
			{X: 12.5, Transverse: -25e3},
			{X: 15, Axial: 50e3},
		},
		DistributedLoad: []fem.DistributedLoad{
			{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 15, Intensity: -10e3}}},
			{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 5, Intensity: 0}, {X: 10, Intensity: -20e3}}},
		},
		Gravity: [2]float64{0, -fem.StandardGravity},
		Mesh:    fem.MeshSettings{Elements: elements, BarOrder: fem.LinearBar},
	}
}

// KeyPointModel is BeamModel on about elements elements with loads more
// point forces of 1 kN, down and up in turn, spread evenly along the
// member between its other key points (demo data): every one is a key
// point of the exact solution and a node of the mesh.
func KeyPointModel(elements, loads int) *fem.Model {
	m := BeamModel(elements)
	for i := range loads {
		force := -1e3
		if i%2 == 1 {
			force = 0.5e3
		}
		m.PointLoads = append(m.PointLoads, fem.PointLoad{X: 15 * (float64(i) + 0.5) / float64(loads), Transverse: force})
	}
	return m
}
