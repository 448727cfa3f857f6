package bench

import (
	"fmt"

	"stave/fem"
	"stave/fem/band"
)

// Problem is one of the two independent systems fem solves on a mesh.
type Problem int

// The two problems: the bar (axial motion u, half-bandwidth 1 with linear
// elements) and the beam (deflection w and rotation θ, half-bandwidth 3).
const (
	Bar Problem = iota
	Beam
)

func (p Problem) String() string {
	if p == Bar {
		return "bar"
	}
	return "beam"
}

// motions lists the nodal motions the problem owns, in the order of its unknowns.
func (p Problem) motions() []fem.Dof {
	if p == Bar {
		return []fem.Dof{fem.Axial}
	}
	return []fem.Dof{fem.Transverse, fem.Rotation}
}

// System is one assembled problem: A·x = B with the supports applied.
type System struct {
	Problem Problem
	A       *band.Symmetric
	B       []float64
}

// Assemble builds the problem's fine-mesh stiffness matrix and load vector,
// the system whose solution is fem's finite element answer on mesh: linear
// bar or Hermite beam elements, consistent loads from piecewise-linear
// distributed loads, self-weight and temperature, point loads and springs at
// the nearest node, and rigid restraints applied by clearing their row and
// column but keeping the diagonal. It handles linear bars and zero
// settlements only, which is all the benchmark models use.
func Assemble(m *fem.Model, mesh fem.Mesh, p Problem) (*System, error) {
	if m.Mesh.BarOrder == fem.QuadraticBar {
		return nil, fmt.Errorf("bench: Assemble handles linear bars only; set Mesh.BarOrder to LinearBar")
	}
	for i, s := range m.Supports {
		if s.Settlement != [3]float64{} {
			return nil, fmt.Errorf("bench: support %d at x = %g m has a settlement, which Assemble does not handle; remove it", i+1, s.X)
		}
	}
	nodes := len(mesh.X)
	per := len(p.motions())
	n, k := per*nodes, 2*per-1
	a := band.NewSymmetric(n, k)
	b := make([]float64, n)
	loads := elementLoads(m, mesh, p)
	w := k + 1
	for e, el := range mesh.Elements {
		seg := m.Segments[el.Segment]
		h := el.End - el.Start
		var ke [4][4]float64
		var fe [4]float64
		if p == Bar {
			ke, fe = barElement(seg, h, loads[e], m.TemperatureChange)
		} else {
			ke, fe = beamElement(seg, h, loads[e])
		}
		first := per * el.First
		for i := range 2 * per {
			b[first+i] += fe[i]
			for j := i; j < 2*per; j++ {
				a.Data[(first+i)*w+j-i] += ke[i][j]
			}
		}
	}
	for _, pl := range m.PointLoads {
		node := mesh.NodeNearest(pl.X)
		for mi, d := range p.motions() {
			b[per*node+mi] += [3]float64{pl.Axial, pl.Transverse, pl.Moment}[d]
		}
	}
	var fixed []int
	for _, s := range m.Supports {
		node := mesh.NodeNearest(s.X)
		for mi, d := range p.motions() {
			dof := per*node + mi
			switch {
			case s.Kind == fem.Spring:
				a.Data[dof*w] += s.Stiffness[d]
			case s.Kind.Restrains(d):
				fixed = append(fixed, dof)
			}
		}
	}
	for _, dof := range fixed {
		for j := max(0, dof-k); j <= min(n-1, dof+k); j++ {
			if j != dof {
				lo, hi := min(j, dof), max(j, dof)
				a.Data[lo*w+hi-lo] = 0
			}
		}
		b[dof] = 0
	}
	return &System{Problem: p, A: a, B: b}, nil
}

// elementLoads returns the problem's line load (N/m) at the two ends of each
// element: self-weight plus the distributed loads, which are linear within an
// element because their break points are nodes.
func elementLoads(m *fem.Model, mesh fem.Mesh, p Problem) [][2]float64 {
	dir := p.motions()[0]
	loads := make([][2]float64, len(mesh.Elements))
	for e, el := range mesh.Elements {
		seg := m.Segments[el.Segment]
		g := seg.Material.Density * seg.Section.Area * m.Gravity[dir]
		loads[e] = [2]float64{g, g}
	}
	for _, d := range m.DistributedLoad {
		if d.Direction != dir {
			continue
		}
		for k := 1; k < len(d.Points); k++ {
			lo, hi := d.Points[k-1], d.Points[k]
			slope := (hi.Intensity - lo.Intensity) / (hi.X - lo.X)
			for e := mesh.NodeNearest(lo.X); e < mesh.NodeNearest(hi.X); e++ {
				loads[e][0] += lo.Intensity + slope*(mesh.X[e]-lo.X)
				loads[e][1] += lo.Intensity + slope*(mesh.X[e+1]-lo.X)
			}
		}
	}
	return loads
}

// barElement is the linear bar: stiffness EA/h·[1 −1; −1 1], consistent load
// h/6·[2p₀+p₁, p₀+2p₁] (Hughes, The Finite Element Method, ch. 1, from
// memory) and the thermal forces ∓EA·αΔT.
func barElement(seg fem.Segment, h float64, p [2]float64, temperature float64) ([4][4]float64, [4]float64) {
	ea := seg.Material.Elastic * seg.Section.Area
	c := ea / h
	thermal := ea * seg.Material.ThermalExpansion * temperature
	return [4][4]float64{{c, -c}, {-c, c}},
		[4]float64{h*(2*p[0]+p[1])/6 - thermal, h*(p[0]+2*p[1])/6 + thermal}
}

// beamElement is the Hermite cubic beam for (w₁, θ₁, w₂, θ₂) with the
// consistent load of a linear q from q₀ to q₁:
// [h(7q₀+3q₁)/20, h²(3q₀+2q₁)/60, h(3q₀+7q₁)/20, −h²(2q₀+3q₁)/60]
// (Hughes, The Finite Element Method; Strang & Fix, ch. 1; from memory).
func beamElement(seg fem.Segment, h float64, q [2]float64) ([4][4]float64, [4]float64) {
	c := seg.Material.Elastic * seg.Section.SecondMoment / (h * h * h)
	return [4][4]float64{
			{12 * c, 6 * h * c, -12 * c, 6 * h * c},
			{6 * h * c, 4 * h * h * c, -6 * h * c, 2 * h * h * c},
			{-12 * c, -6 * h * c, 12 * c, -6 * h * c},
			{6 * h * c, 2 * h * h * c, -6 * h * c, 4 * h * h * c},
		}, [4]float64{
			h * (7*q[0] + 3*q[1]) / 20,
			h * h * (3*q[0] + 2*q[1]) / 60,
			h * (3*q[0] + 7*q[1]) / 20,
			-h * h * (2*q[0] + 3*q[1]) / 60,
		}
}
