package bench

import (
	"math"
	"testing"

	"stave/fem"
	"stave/fem/band"
)

// TestAssembleMatchesFem checks that the system the kernels are timed on is
// the one fem solves: solved with band.LDL it must give fem.Solve's nodal
// displacements. The reference is fem itself; the tolerance is round-off on
// systems whose condition is far below 1/ε at these sizes.
func TestAssembleMatchesFem(t *testing.T) {
	tests := []struct {
		name  string
		model *fem.Model
	}{
		{"bar model, 7 elements", BarModel(7)},
		{"bar model, 60 elements", BarModel(60)},
		{"beam model, 9 elements", BeamModel(9)},
		{"beam model, 60 elements", BeamModel(60)},
		{"beam model with a settling support, 20 elements", settled(BeamModel(20))},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			sol, err := fem.Solve(tc.model)
			if err != nil {
				t.Fatal(err)
			}
			for _, p := range []Problem{Bar, Beam} {
				sys, err := Assemble(tc.model, sol.Mesh, p)
				if err != nil {
					t.Fatal(err)
				}
				var f band.LDL
				if err := f.Factorize(sys.A); err != nil {
					t.Fatalf("%s: %v", p, err)
				}
				x := make([]float64, sys.A.N)
				if err := f.SolveTo(x, sys.B); err != nil {
					t.Fatal(err)
				}
				motions := p.motions()
				for mi, d := range motions {
					scale := 0.0
					for _, u := range sol.Displacement {
						scale = max(scale, math.Abs(u[d]))
					}
					// An unloaded problem (the bar model's beam) has exact zeros to match.
					for node, u := range sol.Displacement {
						got := x[len(motions)*node+mi]
						if math.Abs(got-u[d]) > 1e-10*scale {
							t.Fatalf("%s: %s at node %d (x = %g m): assembled system gives %.12g, fem gives %.12g", p, d, node, sol.Mesh.X[node], got, u[d])
						}
					}
				}
			}
		})
	}
}

func TestAssembleRefusesWhatItDoesNotModel(t *testing.T) {
	quadratic := BarModel(4)
	quadratic.Mesh.BarOrder = fem.QuadraticBar
	for _, m := range []*fem.Model{quadratic} {
		mesh, err := fem.BuildMesh(m)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := Assemble(m, mesh, Beam); err == nil {
			t.Errorf("Assemble accepted a model it cannot reproduce: %+v", m.Mesh)
		}
	}
}

// settled gives the second support of m a settlement of 10 mm.
func settled(m *fem.Model) *fem.Model {
	m.Supports[1].Settlement[fem.Transverse] = -0.01
	return m
}
