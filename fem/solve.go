package fem

import "errors"

// Solution is the finite element answer for one model.
// STUB: the fem core helper replaces this file with the real solver.
type Solution struct {
	Model        Model
	Mesh         Mesh
	Displacement [][3]float64 // per node of Mesh.X: u (m), w (m), θ (rad)
	Reactions    []Reaction
	StrainEnergy float64 // J
	Equilibrium  Equilibrium
	Condition    float64 // estimated 1-norm condition number of the stiffness matrix (largest of bar and beam)
	Warnings     []string
}

// Solve meshes, assembles and solves the model.
func Solve(m *Model) (*Solution, error) { return nil, errors.New("fem: solver not yet written") }

// At evaluates the finite element fields at x.
func (s *Solution) At(x float64, side Side) Fields { return Fields{X: x} }

// Sample returns the fields at n+1 evenly spaced points inside every element
// (both ends included), in order along the member.
func (s *Solution) Sample(n int) []Fields { return nil }
