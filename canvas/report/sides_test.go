package report

import (
	"math"
	"strings"
	"testing"

	"stave/storage"
)

// A single case's extreme where the field jumps says on which side of the
// point it is read, in the results document ("side", "side_fe") and the
// text ("just left of 4.000 m"), as the envelope's do; elsewhere it says
// none. testdata/two_span_uniform.json, two spans of 4 m under 10 kN/m: the
// shear force is −5wL/8 = −25 kN just left of the middle support and
// +25 kN just right of it, the moment there −wL²/8 = −20 kN·m and
// continuous (AISC Manual, Beam Diagrams and Formulas, continuous beam,
// two equal spans, uniform load on both spans, from memory). On the
// file's 16 elements the finite element shear force is constant in each
// element, the mean of the exact one: +22.5 kN just right of the support,
// and −22.5 kN first reached at 3.5 m, a node where it does not jump.
func TestSolveSaysTheSideOfAJump(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	type place struct {
		Value, X, FE, XFE float64
		Side, SideFE      string
	}
	var doc struct {
		Extremes []struct {
			Quantity string
			Max, Min struct {
				Value, X float64
				FE       float64 `json:"fe"`
				XFE      float64 `json:"x_fe"`
				Side     string  `json:"side"`
				SideFE   string  `json:"side_fe"`
			}
		}
	}
	src := solveInto(t, p, &doc)
	const v, vFE, mB = 25e3, 22.5e3, -20e3
	want := map[string][2]place{ // quantity: largest, smallest
		"shear_force":    {{Value: v, X: 4, FE: vFE, XFE: 4, Side: "right", SideFE: "right"}, {Value: -v, X: 4, FE: -vFE, XFE: 3.5, Side: "left"}},
		"bending_moment": {{Value: 9.0 / 128 * 10e3 * 16, X: 1.5, XFE: 1.5}, {Value: mB, X: 4, XFE: 4}},
	}
	for _, q := range doc.Extremes {
		w, ok := want[q.Quantity]
		if !ok {
			if q.Max.Side != "" || q.Min.Side != "" || q.Max.SideFE != "" || q.Min.SideFE != "" {
				t.Errorf("%s: sides %q, %q, FE %q, %q where the field does not jump", q.Quantity, q.Max.Side, q.Min.Side, q.Max.SideFE, q.Min.SideFE)
			}
			continue
		}
		for k, g := range []place{{q.Max.Value, q.Max.X, q.Max.FE, q.Max.XFE, q.Max.Side, q.Max.SideFE}, {q.Min.Value, q.Min.X, q.Min.FE, q.Min.XFE, q.Min.Side, q.Min.SideFE}} {
			w := w[k]
			if math.Abs(g.Value-w.Value) > 1e-9*math.Abs(w.Value) || math.Abs(g.X-w.X) > 1e-9 || g.Side != w.Side ||
				math.Abs(g.XFE-w.XFE) > 1e-9 || g.SideFE != w.SideFE || w.FE != 0 && math.Abs(g.FE-w.FE) > 1e-9*math.Abs(w.FE) {
				t.Errorf("%s: %.10g at x = %g m, side %q, FE %.10g at %g m, side %q; want %.10g at %g m, side %q, FE at %g m, side %q",
					q.Quantity, g.Value, g.X, g.Side, g.FE, g.XFE, g.SideFE, w.Value, w.X, w.Side, w.XFE, w.SideFE)
			}
		}
	}
	var text strings.Builder
	WriteSolveText(&text, "two_span_uniform.json", src)
	lines := strings.Split(text.String(), "\n")
	for i, line := range lines {
		switch {
		case strings.HasPrefix(line, "  shear force "):
			// Exact and FE largest just right of the support; the exact
			// smallest just left of it, the FE one at 3.5 m.
			if strings.Count(line, "just right of 4.000 m") != 2 || i+1 == len(lines) ||
				strings.Count(lines[i+1], "just left of 4.000 m") != 1 || !strings.Contains(lines[i+1], "3.500 m") || strings.Contains(lines[i+1], "just right") {
				t.Errorf("the text does not say the sides of the shear force's extremes:\n%s\n%s", line, lines[i+1])
			}
		case strings.HasPrefix(line, "  bending moment "):
			if strings.Contains(line+lines[i+1], "just ") {
				t.Errorf("the text gives a side of the moment, which does not jump:\n%s\n%s", line, lines[i+1])
			}
		}
	}
}
