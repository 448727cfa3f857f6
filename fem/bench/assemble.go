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

// Assemble builds the problem's fine-mesh stiffness matrix and load vector
// (fem.PlainSystem), the system whose solution is fem's finite element
// answer on mesh: the ordinary assembly the kernels are timed on. The
// benchmark reads one unknown per motion and node, so it takes linear bars
// only.
func Assemble(m *fem.Model, mesh fem.Mesh, p Problem) (*System, error) {
	if m.Mesh.BarOrder == fem.QuadraticBar {
		return nil, fmt.Errorf("bench: Assemble handles linear bars only; set Mesh.BarOrder to LinearBar")
	}
	a, b, err := fem.PlainSystem(m, mesh, p.String())
	if err != nil {
		return nil, err
	}
	return &System{Problem: p, A: a, B: b}, nil
}
