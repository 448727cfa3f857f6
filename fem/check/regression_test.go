package check

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
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
// At at nine points of every element, before Run was rewritten to read them
// in one pass and then to take its peaks in closed form. The rewrites must
// give the same checks, statuses and limits, and values and positions to
// 1e-9 relative, but that a peak found in closed form (stress, deflection,
// compression) may have grown by what nine samples per element miss of a
// peak between them, and moved within an element to where it is. Values at
// round-off level (the relative error of a mesh that is exact, the
// compression of a member in tension) need only stay at round-off; where
// the largest stress error is reached at several places at once (the same
// error in every element), any of them will do. The design checks read the
// larger of the two solutions' peaks when these were recorded and judge
// the exact one now, with the finite element one beside it: the larger of
// the two, and its place, must be what was recorded; the handbook checks
// read the finite element solution then and the exact one now, so the
// value recorded is their FE value, and the exact one must pass.
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
		force := 0.0 // N: the largest applied or reacting force
		for i := range 2 {
			force = math.Max(force, math.Max(math.Abs(s.Equilibrium.Applied[i]), math.Abs(s.Equilibrium.Reactions[i])))
		}
		for i, want := range c.Results {
			r := got[i]
			floor := 0.0
			switch {
			case r.Name == "Error against the exact solution":
				floor = 1e-12 // a relative error: round-off of a mesh that is exact
			case strings.HasPrefix(r.Name, "Buckling"):
				floor = 1e-12 * force
			}
			same := func(g, w, tol float64) bool { return math.Abs(g-w) <= tol }
			tol, grown, moved := 1e-9*math.Abs(want.Value)+floor, 0.0, 1e-9*L
			if peak := r.Kind == Design; peak {
				grown, moved = 1e-3*math.Abs(want.Value), longestElement(s)
			}
			if r.Kind == Design && r.HasFE && r.FE > r.Value {
				r.Value, r.X = r.FE, r.FEX
			}
			if r.Code == CodeHandbook && r.HasFE {
				// The exact solution is the handbook's closed form.
				if r.Status != Pass {
					t.Errorf("%s, %+v: %s: exact %g against the handbook's %g: %v", c.File, c.Mesh, r.Name, r.Value, r.Limit, r.Status)
				}
				r.Value, r.Status = r.FE, want.Status
			}
			sameX := same(r.X, want.X, moved) ||
				r.Name == "Error against the exact solution" && worstStressError(s, e, r.X)
			sameValue := r.Value >= want.Value-tol && r.Value <= want.Value+tol+grown
			if r.Name != want.Name || r.Status != want.Status || !sameX || !sameValue ||
				!same(r.Limit, want.Limit, 1e-9*math.Abs(want.Limit)) {
				t.Errorf("%s, %+v:\n got %q %v x = %.12g value %.12g limit %.12g\nwant %q %v x = %.12g value %.12g limit %.12g",
					c.File, c.Mesh, r.Name, r.Status, r.X, r.Value, r.Limit, want.Name, want.Status, want.X, want.Value, want.Limit)
			}
		}
	}
}

// longestElement is the length of the longest element of s, m.
func longestElement(s *fem.Solution) float64 {
	h := 0.0
	for _, el := range s.Mesh.Elements {
		h = math.Max(h, el.End-el.Start)
	}
	return h
}

// worstStressError reports whether |σ_h − σ| at x, from either side, is the
// largest over the sample points of every element (to 1e-9 relative, or to
// round-off of the stresses when the error is round-off itself), read
// through At as before the rewrite.
func worstStressError(s *fem.Solution, e *fem.Exact, x float64) bool {
	differs := func(x float64, side fem.Side) float64 {
		return math.Abs(s.At(x, side).CombinedStress - e.At(x, side).CombinedStress)
	}
	worst, stress := 0.0, 0.0
	for _, el := range s.Mesh.Elements {
		for j := 0; j <= comparePoints; j++ {
			x, side := el.Start+(el.End-el.Start)*float64(j)/comparePoints, fem.Right
			if j == comparePoints {
				x, side = el.End, fem.Left
			}
			worst = math.Max(worst, differs(x, side))
			stress = math.Max(stress, math.Abs(e.At(x, side).CombinedStress))
		}
	}
	at := math.Max(differs(x, fem.Left), differs(x, fem.Right))
	return at >= worst*(1-1e-9)-1e-12*stress
}

// comparePoints is the number of intervals each element was sampled in by
// the implementation the recorded values come from.
const comparePoints = 8
