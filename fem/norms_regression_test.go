package fem_test

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"testing"

	"stave/fem"
	"stave/storage"
)

// TestCompareUnchangedByRewrite is a regression guard, not a reference test:
// testdata/compare_regression.json holds the norms Compare gave on every
// testdata model, each on its own mesh, on 101 linear-bar elements and on 25
// quadratic-bar elements, recorded from the implementation that read both
// solutions with At at nine points of every element, before Compare was
// rewritten to walk the elements once and then to take the largest errors
// in closed form. The norms, by quadrature exact either way, must agree to
// 1e-9 relative; the largest errors may only have grown, by no more than
// nine samples per element can miss of a peak between them (a few per
// cent at most: TestPropertyCompareAgainstSampling measures the closed
// forms against a dense sampling). Values at round-off level (meshes that
// are exact) only need to stay at round-off of the solution's own size.
func TestCompareUnchangedByRewrite(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("testdata", "compare_regression.json"))
	if err != nil {
		t.Fatal(err)
	}
	var cases []struct {
		File  string
		Mesh  fem.MeshSettings
		Norms fem.ErrorNorms
	}
	if err := json.Unmarshal(data, &cases); err != nil {
		t.Fatal(err)
	}
	if len(cases) < 24 {
		t.Fatalf("%d recorded cases, want 3 meshes for each of the 8 testdata models", len(cases))
	}
	for _, c := range cases {
		p, err := storage.Load(filepath.Join("..", "testdata", c.File))
		if err != nil {
			t.Fatal(err)
		}
		m := p.Model
		m.Mesh = c.Mesh
		s, err := fem.Solve(&m)
		if err != nil {
			t.Fatal(err)
		}
		e, err := fem.SolveExact(&m)
		if err != nil {
			t.Fatal(err)
		}
		// Round-off scales: the largest nodal displacement and stress.
		var u, w, stress float64
		for i, x := range s.Mesh.X {
			d := s.Displacement[i]
			u, w = math.Max(u, math.Abs(d[fem.Axial])), math.Max(w, math.Abs(d[fem.Transverse]))
			for _, side := range []fem.Side{fem.Left, fem.Right} {
				stress = math.Max(stress, math.Abs(s.At(x, side).CombinedStress))
			}
		}
		got, want := fem.Compare(s, e), c.Norms
		for _, q := range []struct {
			name            string
			got, want, unit float64
			maximum         bool
		}{
			{"MaxDeflection", got.MaxDeflection, want.MaxDeflection, w, true},
			{"MaxAxial", got.MaxAxial, want.MaxAxial, u, true},
			{"MaxStress", got.MaxStress, want.MaxStress, stress, true},
			{"MaxStressRelative", got.MaxStressRelative, want.MaxStressRelative, 1, true},
			{"RelativeL2", got.RelativeL2, want.RelativeL2, 1, false},
			{"RelativeEnergy", got.RelativeEnergy, want.RelativeEnergy, 1, false},
		} {
			floor := 1e-9*math.Abs(q.want) + 1e-12*q.unit
			grown := 0.0
			if q.maximum {
				grown = 0.05 * math.Abs(q.want)
			}
			if q.got < q.want-floor || q.got > q.want+floor+grown {
				t.Errorf("%s, %+v: %s = %.12g, recorded %.12g", c.File, c.Mesh, q.name, q.got, q.want)
			}
		}
	}
}
