package fem

import (
	"math"
	"testing"
)

// TestExactSolutionWhateverTheStiffness: the reactions of a statically
// indeterminate beam do not depend on the size of EI, so the exact
// solution must be found, and well conditioned, for any EI the solvers
// accept (EI/ℓ³ from 1e-150 to 1e150 N/m). Before, the equations mixed
// actions (EI times the constants) and reactions (1 times themselves) in
// one row, which the row and column equilibration did not balance: two
// spans with E scaled by 1e30 had no exact solution ("condition number
// 2.67e+13 after scaling"), the finite element one alone.
func TestExactSolutionWhateverTheStiffness(t *testing.T) {
	const q, l = 10e3, 4.0 // N/m, m: two equal spans
	for _, tc := range []struct {
		name  string
		scale float64 // of E = 200 GPa
	}{
		{"steel", 1},
		{"E times 1e12", 1e12},
		{"E times 1e18", 1e18},
		{"E times 1e30", 1e30},
		{"E times 1e80", 1e80},
		{"E times 1e-25", 1e-25},
		{"E times 1e-45", 1e-45},
		{"E times 1e-80", 1e-80},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := &Model{
				Segments:        []Segment{{Start: 0, End: 2 * l, Section: Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: Material{Elastic: 2e11 * tc.scale}}},
				Supports:        []Support{{X: 0, Kind: Pinned}, {X: l, Kind: Roller}, {X: 2 * l, Kind: Roller}},
				DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{X: 0, Intensity: -q}, {X: 2 * l, Intensity: -q}}}},
			}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatalf("no exact solution: %v", err)
			}
			if e.Condition > conditionLimit {
				t.Errorf("condition estimate %.3g, above %.0g", e.Condition, conditionLimit)
			}
			// Two equal spans under a uniform load: reactions 3ql/8,
			// 10ql/8, 3ql/8 (beam tables for a continuous beam of two
			// equal spans, from memory; the three-moment equation gives
			// the same).
			want := []float64{3 * q * l / 8, 10 * q * l / 8, 3 * q * l / 8}
			for i, r := range e.Reactions() {
				if got := r.Force[Transverse]; math.Abs(got-want[i]) > 1e-9*want[i] {
					t.Errorf("support %d: reaction %.12g N, want %.12g N", i+1, got, want[i])
				}
			}
		})
	}
}
