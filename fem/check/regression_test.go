package check

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"testing"

	"stave/fem"
)

// regressionCase is one testdata model on one mesh with the results Run gave.
type regressionCase struct {
	File    string
	Mesh    fem.MeshSettings
	Results []recorded
}

type recorded struct {
	Name     string
	Status   Status
	X, Value float64
	Limit    float64
}

// TestRunUnchangedByRewrite is a regression guard, not a reference test:
// testdata/run_regression.json holds what Run gave on every testdata model,
// each on its own mesh, on 101 linear-bar elements and on 25 quadratic-bar
// elements, recorded from the implementation that probed both solutions with
// At at every sample point, before Run was rewritten to read them in one
// pass. The rewrite must give the same checks, statuses, positions and
// values to 1e-9 relative; values at round-off level (the relative error of
// a mesh that is exact) only need to stay at round-off.
func TestRunUnchangedByRewrite(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("testdata", "run_regression.json"))
	if err != nil {
		t.Fatal(err)
	}
	var cases []regressionCase
	if err := json.Unmarshal(data, &cases); err != nil {
		t.Fatal(err)
	}
	if len(cases) < 24 {
		t.Fatalf("%d recorded cases, want 3 meshes for each of the 8 testdata models", len(cases))
	}
	for _, c := range cases {
		m := loadModel(t, c.File)
		m.Mesh = c.Mesh
		s, e := solveBoth(t, m)
		got := Run(m, s, e, Options{})
		if len(got) != len(c.Results) {
			t.Errorf("%s, %+v: %d results %v, recorded %d", c.File, c.Mesh, len(got), names(got), len(c.Results))
			continue
		}
		L := m.Length()
		for i, want := range c.Results {
			r := got[i]
			floor := 0.0
			if r.Name == "Error against the exact solution" {
				floor = 1e-12 // a relative error: round-off of a mesh that is exact
			}
			same := func(g, w, tol float64) bool { return math.Abs(g-w) <= tol }
			if r.Name != want.Name || r.Status != want.Status ||
				!same(r.X, want.X, 1e-9*L) ||
				!same(r.Value, want.Value, 1e-9*math.Abs(want.Value)+floor) ||
				!same(r.Limit, want.Limit, 1e-9*math.Abs(want.Limit)) {
				t.Errorf("%s, %+v:\n got %q %v x = %.12g value %.12g limit %.12g\nwant %q %v x = %.12g value %.12g limit %.12g",
					c.File, c.Mesh, r.Name, r.Status, r.X, r.Value, r.Limit, want.Name, want.Status, want.X, want.Value, want.Limit)
			}
		}
	}
}
