package fem_test

import (
	"strings"
	"testing"

	"stave/fem"
)

// Loads so small against the member's stiffness that the displacements or
// forces fall below float64's smallest normal number, 2^−1022 ≈ 2.2e-308
// (IEEE 754 binary64), lose their digits: the reactions come out as zero
// or a few bits, and equilibrium failed with "report the model". The solver
// refuses them instead, as it refuses results that overflow. Deflections
// from 5·q·L⁴/(384·E·I) (Roark, simply supported beam, uniform load) on the
// 4 m beam of tiled: I = 8e-6 m⁴.
func TestResultsThatUnderflowAreRefused(t *testing.T) {
	for _, c := range []struct {
		name    string
		q, E    float64 // N/m, Pa
		refused bool
	}{
		// w = 20.8 mm: an ordinary beam.
		{"ordinary", -1e4, 2e11, false},
		// w = 4.2e-285 m, reactions 2e-140 N: tiny but normal numbers.
		{"tiny but normal", -1e-140, 1e150, false},
		// w = 4.2e-345 m underflows to zero, and the reactions, worked out
		// from the displacements on 8 elements, no longer balance the
		// 4e-200 N applied (`stave solve` failed equilibrium).
		{"displacements lost", -1e-200, 1e150, true},
		// q·L = 2e-323 N: the load itself has one significant bit.
		{"subnormal load", -5e-324, 2e11, true},
		// w = 2.1e-311 m: a subnormal deflection, 11 bits short.
		{"subnormal deflection", -1e-305, 2e11, true},
	} {
		m := tiled(1, 4)
		m.Mesh.Elements = 8
		m.Segments[0].Material.Elastic = c.E
		m.DistributedLoad[0].Points[0].Intensity = c.q
		m.DistributedLoad[0].Points[1].Intensity = c.q
		_, err := fem.Solve(m)
		switch {
		case c.refused && (err == nil || !strings.Contains(err.Error(), "too small for floating point")):
			t.Errorf("%s: Solve gave error %v, want the refusal of results too small for floating point", c.name, err)
		case !c.refused && err != nil:
			t.Errorf("%s: Solve refused: %v", c.name, err)
		}
	}
}

// A combination's factor can make the results underflow as well: 1e-320
// times the ordinary beam's 20.8 mm is 2.1e-322 m, a subnormal number of
// 6 significant bits.
func TestCombinationsThatUnderflowAreRefused(t *testing.T) {
	s, err := fem.Solve(tiled(1, 4))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		factor  float64
		refused bool
	}{{1, false}, {1e-300, false}, {1e-320, true}} {
		_, err := fem.CombineSolutions([]*fem.Solution{s}, []float64{c.factor})
		if got := err != nil && strings.Contains(err.Error(), "too small for floating point"); got != c.refused {
			t.Errorf("factor %g: CombineSolutions gave error %v, refused %v, want %v", c.factor, err, got, c.refused)
		}
	}
}

// The combination whose factor makes the results underflow is named, and
// so is a case placed by span whose share does: a file has many.
func TestUnderflowNamesTheCombination(t *testing.T) {
	for _, bySpan := range []bool{false, true} {
		m := tiled(1, 4)
		m.Supports = append(m.Supports, fem.Support{X: 2, Kind: fem.Roller})
		tiny := []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e-305}, {X: 4, Intensity: -1e-305}}}}
		m.Cases = []fem.LoadCase{{Name: "imposed", DistributedLoad: m.DistributedLoad}, {Name: "dust", DistributedLoad: tiny, BySpan: bySpan}}
		m.DistributedLoad = nil
		m.Combinations = []fem.Combination{{Name: "ordinary", Factors: []fem.CaseFactor{{Case: 0, Factor: 1.5}}},
			{Name: "dust alone", Factors: []fem.CaseFactor{{Case: 1, Factor: 1}}}}
		p, err := fem.Prepare(m)
		if err != nil {
			t.Fatal(err)
		}
		_, err = p.SolveCombinations(p.Mesh())
		want := `combination "dust alone"`
		if bySpan {
			want = `load case "dust", span 1`
		}
		if err == nil || !strings.Contains(err.Error(), want) || !strings.Contains(err.Error(), "too small for floating point") {
			t.Errorf("by span %v: SolveCombinations gave error %v, want one naming %s", bySpan, err, want)
		}
	}
}
