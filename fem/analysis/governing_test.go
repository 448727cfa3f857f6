package analysis

import (
	"fmt"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// The envelope's check of equilibrium, which every combination passes
// (its residuals round-off, about 1e-15 of the loads), is named for the
// first combination in the file, as any check where combinations tie:
// the one named was the combination whose round-off made reactions over
// applied loads largest, a different one for each direction. Twenty
// point forces on a beam continuous over three spans, each its own case
// and combination (invented numbers); each balances its loads (statics).
func TestEnvelopeCheckTiesGoToTheFirstCombination(t *testing.T) {
	m := fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 12, Section: fem.Section{Area: 0.004, SecondMoment: 2e-5, FibreDistance: 0.1},
			Material: fem.Material{Elastic: 2e11}}},
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}, {X: 8, Kind: fem.Roller}, {X: 12, Kind: fem.Roller}},
	}
	for k := range 20 {
		name := fmt.Sprintf("C%d", k+1)
		m.Cases = append(m.Cases, fem.LoadCase{Name: name, PointLoads: []fem.PointLoad{{X: 0.37 + 0.563*float64(k), Transverse: -1e3 * float64(1+k%7)}}})
		m.Combinations = append(m.Combinations, fem.Combination{Name: name, Kind: fem.Strength, Factors: []fem.CaseFactor{{Case: k, Factor: 1.1 + 0.05*float64(k%5)}}})
	}
	for _, direction := range []string{"axial forces", "transverse forces", "moments about x = 0"} {
		r := envelopeCheck(t, m, func(r check.Result) bool { return strings.HasPrefix(r.Name, "Equilibrium, "+direction) }, "no equilibrium check of "+direction)
		if r.Status != check.Pass || !strings.HasSuffix(r.Name, "(governing: C1)") {
			t.Errorf("%s: %s, want it passed and named for the first combination, C1", r.Name, r.Status)
		}
	}
}
