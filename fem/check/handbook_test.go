package check

import (
	"math"
	"strings"
	"testing"

	"stave/fem"
)

// Each recognised case is checked twice: its handbook values (the formulas
// of Roark's Table 8.1 and the AISC beam diagrams, from memory) against
// Stave's exact solution of the same model, which integrates the
// differential equations independently, to 1e-9; and the recognition itself.
func TestHandbookRecognisesStandardCases(t *testing.T) {
	const L = 5.0
	fixed := func(x float64) fem.Support { return fem.Support{X: x, Kind: fem.Fixed} }
	pinned := func(x float64) fem.Support { return fem.Support{X: x, Kind: fem.Pinned} }
	roller := func(x float64) fem.Support { return fem.Support{X: x, Kind: fem.Roller} }
	cases := []struct {
		name     string
		supports []fem.Support
		edit     func(m *fem.Model)
		want     string // the case's name starts so
	}{
		{"cantilever, tip load", []fem.Support{fixed(0)},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: L, Transverse: -8e3}} }, "Cantilever, point load"},
		{"cantilever fixed on the right, tip load", []fem.Support{fixed(L)},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 0, Transverse: 3e3}} }, "Cantilever, point load"},
		{"cantilever fixed on the right, uniform load", []fem.Support{fixed(L)},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-2e3, 0, L)} }, "Cantilever, uniform"},
		{"simply supported, central load", []fem.Support{pinned(0), roller(L)},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: L / 2, Transverse: -10e3}} }, "Simply supported, point load"},
		{"simply supported, self-weight only", []fem.Support{pinned(0), roller(L)},
			func(m *fem.Model) { m.Gravity = [2]float64{0, -fem.StandardGravity} }, "Simply supported, uniform"},
		{"simply supported, two uniform loads and self-weight", []fem.Support{roller(0), pinned(L)},
			func(m *fem.Model) {
				m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L), uniform(-2e3, 0, L)}
				m.Gravity = [2]float64{0, -fem.StandardGravity}
			}, "Simply supported, uniform"},
		{"fixed at both ends, uniform", []fem.Support{fixed(0), fixed(L)},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-4e3, 0, L)} }, "Fixed at both ends"},
		{"propped cantilever, uniform", []fem.Support{fixed(0), roller(L)},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-4e3, 0, L)} }, "Propped cantilever"},
		{"propped cantilever mirrored, uniform", []fem.Support{pinned(0), fixed(L)},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(6e3, 0, L)} }, "Propped cantilever"},
		{"two equal spans, uniform", []fem.Support{pinned(0), roller(L / 2), roller(L)},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-4e3, 0, L)} }, "Two equal spans"},
		{"bar, end load", []fem.Support{fixed(0)},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: L, Axial: 50e3}} }, "Bar fixed at one end"},
		{"bar held on the right, end load", []fem.Support{fixed(L)},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 0, Axial: 50e3}} }, "Bar fixed at one end"},
		{"hanging rod", []fem.Support{fixed(0)},
			func(m *fem.Model) { m.Gravity = [2]float64{fem.StandardGravity, 0} }, "Rod under its own weight"},
		{"standing rod held at the top end x = L", []fem.Support{fixed(L)},
			func(m *fem.Model) { m.Gravity = [2]float64{fem.StandardGravity, 0} }, "Rod under its own weight"},
	}
	for _, c := range cases {
		m := beam(L, c.supports, 0)
		c.edit(&m)
		hb, ok := Handbook(&m)
		if !ok || !strings.HasPrefix(hb.Name, c.want) {
			t.Errorf("%s: recognised %v as %q, want %q", c.name, ok, hb.Name, c.want)
			continue
		}
		if !strings.Contains(hb.Source, "from memory") || hb.Formula == "" || len(hb.Quantities) == 0 {
			t.Errorf("%s: case %+v lacks a source, formula or quantities", c.name, hb)
		}
		_, e := solveBoth(t, &m)
		for _, q := range hb.Quantities {
			got, found := q.Read(e, e.Reactions())
			if !found || !near(got, q.Value, 1e-9) || q.Value == 0 {
				t.Errorf("%s, %s at x = %g: exact solution %.10g, handbook %.10g", c.name, q.Name, q.X, got, q.Value)
			}
		}
	}
}

func TestHandbookLeavesOtherModels(t *testing.T) {
	const L = 4.0
	ss := []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}
	cases := []struct {
		name     string
		supports []fem.Support
		edit     func(m *fem.Model)
	}{
		{"two segments", ss, func(m *fem.Model) {
			second := m.Segments[0]
			m.Segments[0].End, second.Start = 2, 2
			m.Segments = append(m.Segments, second)
			m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)}
		}},
		{"partial uniform load", ss, func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, 2)} }},
		{"triangular load", ss, func(m *fem.Model) {
			m.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0}, {X: L, Intensity: -1e3}}}}
		}},
		{"point load off centre", ss, func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 1, Transverse: -1e3}} }},
		{"point and uniform load", ss, func(m *fem.Model) {
			m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -1e3}}
			m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)}
		}},
		{"point moment", ss, func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 2, Moment: 1e3}} }},
		{"temperature change", ss, func(m *fem.Model) {
			m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)}
			m.TemperatureChange = 20
		}},
		{"spring support", []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Spring, Stiffness: [3]float64{0, 1e6, 0}}},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)} }},
		{"settlement", []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller, Settlement: [3]float64{0, -0.01, 0}}},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)} }},
		{"unequal spans", []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 1, Kind: fem.Roller}, {X: L, Kind: fem.Roller}},
			func(m *fem.Model) { m.DistributedLoad = []fem.DistributedLoad{uniform(-1e3, 0, L)} }},
		{"cantilever with load short of the tip", []fem.Support{{X: 0, Kind: fem.Fixed}},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 3, Transverse: -1e3}} }},
		{"axial and transverse load together", []fem.Support{{X: 0, Kind: fem.Fixed}},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: L, Axial: 1e3, Transverse: -1e3}} }},
		{"inclined self-weight", []fem.Support{{X: 0, Kind: fem.Fixed}},
			func(m *fem.Model) { m.Gravity = [2]float64{5, -5} }},
		{"bar held at both ends", []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Pinned}},
			func(m *fem.Model) { m.PointLoads = []fem.PointLoad{{X: 2, Axial: 1e3}} }},
		{"no load", ss, func(m *fem.Model) {}},
	}
	for _, c := range cases {
		m := beam(L, c.supports, 0)
		c.edit(&m)
		if hb, ok := Handbook(&m); ok {
			t.Errorf("%s: recognised as %q", c.name, hb.Name)
		}
	}
}

// The propped cantilever's largest deflection is printed as qL⁴/(185EI) at
// 0.4215L (AISC Manual beam diagrams; Roark's Table 8.1 case 2c; from memory).
func TestProppedCantileverConstants(t *testing.T) {
	if !near(proppedDeflection, 1.0/185, 2e-3) || !near(propped, 0.4215, 1e-4) {
		t.Errorf("δmax·EI/(qL⁴) = %.6g (want ≈ 1/185 = %.6g), at %.5g L (want 0.4215)", proppedDeflection, 1.0/185, propped)
	}
	if residual := 8*math.Pow(propped, 3) - 9*propped*propped + 1; math.Abs(residual) > 1e-12 {
		t.Errorf("t = %g does not solve 8t³ − 9t² + 1 = 0 (residual %g)", propped, residual)
	}
}
