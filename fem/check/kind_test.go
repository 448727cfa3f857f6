package check

import (
	"strings"
	"testing"

	"stave/fem"
)

// A failed design check says the member is too weak; a failed verification
// says the answer is doubtful. The window marks results unreliable only for
// the second, so every result must say which it is.
func TestKindsOfCheck(t *testing.T) {
	m := &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 4,
			Section:  fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: fem.Material{Elastic: 200e9, Allowable: 1e6}}}, // far too low: the stress check fails
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -5e3}, {X: 4, Intensity: -5e3}}}},
		Mesh:            fem.MeshSettings{Elements: 8},
	}
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatal(err)
	}
	e, err := fem.SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	seen := map[Kind]bool{}
	stressFailed := false
	for _, r := range Run(m, s, e, DefaultOptions()) {
		want := Design
		for _, prefix := range []string{"Equilibrium", "Error against", "Handbook"} {
			if strings.HasPrefix(r.Name, prefix) {
				want = Verification
			}
		}
		if r.Kind != want {
			t.Errorf("%q has kind %d, want %d", r.Name, r.Kind, want)
		}
		seen[r.Kind] = true
		if strings.HasPrefix(r.Name, "Stress") && r.Status == Fail {
			stressFailed = true
		}
	}
	if !seen[Design] || !seen[Verification] {
		t.Errorf("want both kinds among the results, saw %v", seen)
	}
	if !stressFailed {
		t.Error("an allowable stress of 1 MPa under 10 kN·m should fail the stress check")
	}
}
