package check

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"stave/fem"
)

// endConditions gives each support the end condition of all supports
// within 1e-9·L of it, as endConditionAt does for its place, whatever the
// order in which the supports are listed.
func TestEndConditionsOfEverySupport(t *testing.T) {
	const L = 3.0
	tol := 1e-9 * L
	sup := func(x float64, k fem.SupportKind) fem.Support { return fem.Support{X: x, Kind: k} }
	spring := fem.Support{X: 2, Kind: fem.Spring, Stiffness: [3]float64{0, 1e6, 0}}
	tests := []struct {
		name     string
		supports []fem.Support
		want     []EndCondition
	}{
		{"fixed and roller", []fem.Support{sup(0, fem.Fixed), sup(L, fem.Roller)}, []EndCondition{Fixed, Pinned}},
		{"roller and guided at one point, listed apart", []fem.Support{sup(0, fem.Roller), sup(L, fem.Pinned), sup(0, fem.Guided)}, []EndCondition{Fixed, Pinned, Fixed}},
		{"axial only", []fem.Support{sup(1, fem.AxialOnly), sup(0, fem.Pinned)}, []EndCondition{Free, Pinned}},
		{"a spring beside a roller", []fem.Support{sup(2, fem.Roller), spring, sup(0, fem.Pinned)}, []EndCondition{Elastic, Elastic, Pinned}},
		// Within the tolerance is not transitive: the middle one sees both.
		{"a chain within the tolerance", []fem.Support{sup(1, fem.Roller), sup(1+0.6*tol, fem.AxialOnly), sup(1+1.2*tol, fem.Guided)}, []EndCondition{Pinned, Fixed, Guided}},
		{"a place that is not a number", []fem.Support{sup(0, fem.Roller), sup(math.NaN(), fem.Guided)}, []EndCondition{Fixed, Fixed}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := &fem.Model{Segments: []fem.Segment{{Start: 0, End: L}}, Supports: tc.supports}
			got := endConditions(m)
			if !slices.Equal(got, tc.want) {
				t.Errorf("got %v, want %v", got, tc.want)
			}
			for i, s := range m.Supports {
				if one := endConditionAt(m, s.X); one != got[i] {
					t.Errorf("support %d: endConditionAt gives %v, endConditions %v", i+1, one, got[i])
				}
			}
		})
	}
}

// On many supports of every kind crowded at a few places, endConditions
// agrees with endConditionAt at each support.
func TestEndConditionsAsEachPlace(t *testing.T) {
	r := rand.New(rand.NewPCG(17, 2))
	const L = 3.0
	kinds := []fem.SupportKind{fem.Fixed, fem.Pinned, fem.Roller, fem.AxialOnly, fem.Guided}
	m := &fem.Model{Segments: []fem.Segment{{Start: 0, End: L}}}
	for range 500 {
		x := float64(r.IntN(30))*L/29 + float64(r.IntN(5)-2)*0.6e-9*L
		s := fem.Support{X: x, Kind: kinds[r.IntN(len(kinds))]}
		if r.IntN(10) == 0 {
			s = fem.Support{X: x, Kind: fem.Spring, Stiffness: [3]float64{0, 0, 1e5}}
		}
		m.Supports = append(m.Supports, s)
	}
	got := endConditions(m)
	for i, s := range m.Supports {
		if want := endConditionAt(m, s.X); got[i] != want {
			t.Fatalf("support %d at x = %v: got %v, want %v", i+1, s.X, got[i], want)
		}
	}
}
