package fem_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"stave/fem"
)

// The largest gap on each element, in closed form, is at least what a dense
// sampling of both solutions finds there and at most a little more (a
// sampling can only miss a peak between its points), and the gap is that
// large where it is reported; a floor below it never skips it. The combined
// stress compares the exact stress on the finite element solution's fibre,
// as Compare does.
func TestGapClosedForm(t *testing.T) {
	forRandomModels(t, 47, everyLoadKind, func(t *testing.T, _ *rand.Rand, m *fem.Model) {
		s, e := solveBothModels(t, m)
		scale := fieldScales(s, e)
		var fe, ex fem.Fields
		for v := range s.Elements(e, 0, len(s.Mesh.Elements)) {
			for _, q := range fem.Quantities() {
				got, ok := v.Gap(q, -1)
				if !ok {
					t.Fatalf("element %d, %s: no gap with the exact solution on the view", v.Index, q)
				}
				// A floor at or above the gap may skip the work, one below it may not.
				if _, ok := v.Gap(q, got.Value*(1-1e-9)-1e-300); !ok && got.Value > 0 {
					t.Errorf("element %d, %s: a gap of %g was skipped as not above %g", v.Index, q, got.Value, got.Value*(1-1e-9))
				}
				gap := func(xi float64) float64 {
					v.FE.At(xi, &fe)
					v.Exact.At(xi, &ex)
					if q != fem.QCombinedStress {
						return math.Abs(q.Of(&fe) - q.Of(&ex))
					}
					sign := 1.0
					if fe.CombinedStress != fe.AxialStress+fe.BendingStress {
						sign = -1
					}
					return math.Abs(fe.CombinedStress - (ex.AxialStress + sign*ex.BendingStress))
				}
				dense := 0.0
				for j := 0; j <= densePoints; j++ {
					dense = math.Max(dense, gap(float64(j)/densePoints))
				}
				floor, slack := 1e-9*scale[q], 1e-4*scale[q]
				if q == fem.QCombinedStress {
					slack = 2e-2 * scale[q] // a change of fibre is approached to one sample
				}
				if got.Value < dense-floor || got.Value > dense+slack+floor {
					t.Errorf("element %d, %s: closed-form gap %g, dense sampling %g", v.Index, q, got.Value, dense)
				}
				if got.X < v.Start || got.X > v.End {
					t.Errorf("element %d (%g to %g m), %s: gap reported at x = %g m, outside it", v.Index, v.Start, v.End, q, got.X)
				}
				if q != fem.QCombinedStress {
					if at := gap((got.X - v.Start) / (v.End - v.Start)); math.Abs(at-got.Value) > floor+1e-12*got.Value {
						t.Errorf("element %d, %s: gap %g reported at x = %g m, where it is %g", v.Index, q, got.Value, got.X, at)
					}
				}
			}
		}
		for v := range s.Elements(nil, 0, 1) {
			if _, ok := v.Gap(fem.QBendingMoment, -1); ok {
				t.Error("a view without the exact solution gives a gap")
			}
		}
	})
}
