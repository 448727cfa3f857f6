package fem_test

import (
	"fmt"
	"math"
	"testing"

	"stave/fem"
)

// Two fixed supports close together split a pinned–roller beam under a
// uniform load into two propped cantilevers and a short clamped stretch,
// whose reactions the handbook gives. Both solutions must give them to
// round-off however short the clamped stretch: the finite element answer
// by statics (Condition 37), the exact one too, from the clamped
// stretch's prescribed ends rather than its integration constants, which
// meet them only to the round-off of the whole system magnified by the
// stretch's stiffness (before, 1e-8 of the load at h = 1 mm, 5e-7 at
// 0.1 mm and 1e-4 at 0.01 mm, with no warning). FuzzScale found it (4,145
// fixed supports 0.4 mm apart).
func TestCloseFixedSupportsReactions(t *testing.T) {
	const (
		L   = 10.0 // m
		a   = 2.0  // m, the first fixed support
		w   = 10.0 // N/m, downward
		E   = 1e11 // Pa
		I   = 1e-3 // m⁴
		A   = 1e-3 // m²
		c   = 0.1  // m
		tol = 1e-9 // relative to the total load: nodal values are exact
	)
	for _, h := range []float64{1e-2, 1e-3, 1e-4, 1e-5} {
		m := &fem.Model{
			Segments: []fem.Segment{{Start: 0, End: L, Section: fem.Section{Area: A, SecondMoment: I, FibreDistance: c}, Material: fem.Material{Elastic: E}}},
			Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: a, Kind: fem.Fixed}, {X: a + h, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}},
			DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
				Points: []fem.LoadPoint{{X: 0, Intensity: -w}, {X: L, Intensity: -w}}}},
		}
		// Propped cantilever (pinned–fixed) under a uniform load w over a
		// span l: 3wl/8 at the pinned end, 5wl/8 at the fixed end; a
		// stretch fixed at both ends takes wh/2 at each. Source: beam
		// deflection tables, Mechanics of Materials (Gere & Goodno), from
		// memory.
		b := L - a - h
		want := []float64{3 * w * a / 8, 5*w*a/8 + w*h/2, 5*w*b/8 + w*h/2, 3 * w * b / 8}
		s, err := fem.Solve(m)
		if err != nil {
			t.Fatalf("h = %g m: Solve: %v", h, err)
		}
		e, err := fem.SolveExact(m)
		if err != nil {
			t.Fatalf("h = %g m: SolveExact: %v", h, err)
		}
		for _, got := range []struct {
			name      string
			reactions []fem.Reaction
		}{{"finite element", s.Reactions}, {"exact", e.Reactions()}} {
			t.Run(fmt.Sprintf("%s/h=%g", got.name, h), func(t *testing.T) {
				for i, r := range got.reactions {
					if err := math.Abs(r.Force[fem.Transverse]-want[i]) / (w * L); !(err <= tol) {
						t.Errorf("support %d: transverse reaction %.12g N, handbook %.12g N: off by %.2g of the load (finite element Condition %.3g, exact %.3g)",
							i+1, r.Force[fem.Transverse], want[i], err, s.Condition, e.Condition)
					}
				}
			})
		}
	}
}
