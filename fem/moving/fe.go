package moving

import (
	"fmt"

	"stave/fem"
)

// FELine is the finite element influence line of t at the given load
// positions (m): the member p is factorized once on mesh (Member.Structure)
// and solved once per position under the unit load alone, which stands on
// the fine mesh node nearest its position, as Stave places every point
// load. It returns the value of t per newton for each position and the x of
// the node the load stood on. Each solve costs time linear in the number of
// elements; positions on one node share its solve, and a line that would
// take more than MaxFELineWork element-solves is refused.
func FELine(p *fem.Member, mesh fem.Mesh, t Target, positions []float64) (values, at []float64, err error) {
	if t.Bending() && !p.Bending() {
		return nil, nil, fmt.Errorf("the member is solved as a bar alone (nothing holds or loads it across): it has no finite element influence line of the %s", t.Quantity)
	}
	nodes := make([]int, len(positions))
	solved := map[int]float64{}
	for i, s := range positions {
		nodes[i] = mesh.NodeNearest(s)
		solved[nodes[i]] = 0
	}
	if elements := max(len(mesh.Elements), 1); len(solved) > MaxFELineWork/elements {
		return nil, nil, fmt.Errorf("the finite element line would solve the member on its %d elements once for each of %d nodes, more than the %d element-solves (tens of seconds) Stave takes: ask for at most %d points, or a coarser mesh",
			elements, len(solved), MaxFELineWork, MaxFELineWork/elements-1)
	}
	st, err := p.Structure(mesh)
	if err != nil {
		return nil, nil, err
	}
	unit := Unloaded(p.Model())
	t = t.inner(unit.Length())
	keys := st.KeyPoints()
	values, at = make([]float64, len(positions)), make([]float64, len(positions))
	done := map[int]bool{}
	for i, k := range nodes {
		x := mesh.X[k]
		if !done[k] {
			load := fem.PointLoad{X: x, Transverse: -1}
			if !t.Bending() {
				load = fem.PointLoad{X: x, Axial: 1}
			}
			unit.PointLoads = []fem.PointLoad{load}
			loads := fem.GatherLoads(&unit, keys)
			sol, err := st.Solve(&loads)
			if err != nil {
				return nil, nil, err
			}
			solved[k], done[k] = read(sol, t), true
		}
		values[i], at[i] = solved[k], x
	}
	return values, at, nil
}

// MaxFELineWork bounds the work of a finite element influence line: the
// nodes the load stands on times the elements of the mesh. A solve of
// 10,000 elements took 1.1 ms here (BenchmarkFELinePerPosition10000Elements),
// so the bound is some 25 s, and it lets the default 21 points through on
// the finest mesh the loader takes (1.07e7 elements).
const MaxFELineWork = 250_000_000

// read is t's value in the finite element solution sol.
func read(sol *fem.Solution, t Target) float64 {
	if t.Reaction {
		return sol.Reactions[t.Support].Force[t.Motion]
	}
	f := sol.At(t.X, t.Side)
	return t.Quantity.Of(&f)
}

// Unloaded is a copy of m with its member, supports and hinges and none of
// its loads: no point or distributed loads, cases, combinations,
// self-weight, temperature change or difference, or settlements.
func Unloaded(m *fem.Model) fem.Model {
	c := m.Clone()
	c.PointLoads, c.DistributedLoad, c.Cases, c.Combinations = nil, nil, nil, nil
	c.Gravity, c.TemperatureChange = [2]float64{}, 0
	for i := range c.Supports {
		c.Supports[i].Settlement = [3]float64{}
	}
	for i := range c.Segments {
		c.Segments[i].TemperatureDifference = 0
	}
	return c
}
