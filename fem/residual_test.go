package fem

import "testing"

// Where the loads and reactions add up to no force or no moment, the
// relative residual of equilibrium is judged against the model's own
// forces, not against the round-off sum: a propped cantilever under a
// temperature difference (applied nothing; the supports' forces
// ±3EI·α·ΔT/(2hL) cancel, Roark's, thermal bending of beams, from memory),
// a free beam on a foundation turned by a moment at its end (the ground's
// forces add up to a couple alone; Hetényi, Beams on Elastic Foundation,
// the semi-infinite beam, from memory) and a pinned–roller beam warmed
// (nothing anywhere). The summary gave 1 (100 %) for each of the first two.
func TestEquilibriumRelativeWhereNothingAddsUp(t *testing.T) {
	gradient := testSegment(0, 5)
	gradient.TemperatureDifference = 30
	for _, c := range []struct {
		name string
		m    Model
	}{
		{"propped cantilever under a temperature difference", Model{Segments: []Segment{gradient},
			Supports: []Support{{X: 0, Kind: Fixed}, {X: 5, Kind: Roller}}}},
		{"free beam on a foundation, moment at its end", Model{Segments: []Segment{testSegment(0, 20)},
			Foundations: []Foundation{{Start: 0, End: 20, Modulus: 1e7}}, Supports: []Support{{X: 10, Kind: AxialOnly}},
			PointLoads: []PointLoad{{X: 0, Moment: 3e4}}}},
		{"pinned–roller beam warmed", Model{Segments: []Segment{testSegment(0, 5)}, TemperatureChange: 40,
			Supports: []Support{{X: 0, Kind: Pinned}, {X: 5, Kind: Roller}}}},
	} {
		c.m.Mesh = MeshSettings{Elements: 200}
		s := mustSolve(t, &c.m)
		e, err := SolveExact(&c.m)
		if err != nil {
			t.Fatal(err)
		}
		sum := Summarize(s, e)
		if tol := max(1e-12, 4*s.Condition*0x1p-52); sum.Equilibrium.Relative > 1e-12 || sum.FEEquilibrium.Relative > tol {
			t.Errorf("%s: relative residual exact %.3g, FE %.3g; want round-off (FE up to %.3g)", c.name, sum.Equilibrium.Relative, sum.FEEquilibrium.Relative, tol)
		}
	}
}
