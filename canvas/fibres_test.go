package canvas

import (
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// stripTexts are the texts of scene s that are not empty, in order.
func stripTexts(s *Scene) []string {
	var out []string
	for _, it := range s.Items {
		if it.Kind == Text && it.Text != "" {
			out = append(out, it.Text)
		}
	}
	return out
}

// The stress diagram says which stress it draws, so that a checking
// engineer who sets it beside the results is not misled. Two spans under a
// uniform load, no axial force (twoSpans), sag by M = 9wL²/128 =
// 11.25 kN·m at 1.5 m and hog by wL²/8 = 20 kN·m over the middle support
// (beam tables, from memory): the bottom fibre's M·c/I is +140.6 MPa and
// −250 MPa there, and the top fibre's the opposite. Of one solution the
// diagram draws the fibre of the larger magnitude, the bottom one where
// no axial force acts (both tie), so its largest label is the FE 143.2 MPa
// at 1.5 m while the results' combined stress, of both fibres, is largest
// at 250 MPa over the support, the top fibre's tension: it was titled
// "Combined stress [MPa]", "tension + drawn above", as if its peaks were
// the results'. Its title now names the larger fibre and its footer the
// results' both fibres, in the drawing and on the sheet; the sheet's
// table, like the text output, says its combined stress is of both fibres.
// The envelope of combinations draws both fibres, as the results give
// them, and says so.
func TestStressDiagramSaysWhichFibre(t *testing.T) {
	in := solved(t, twoSpans())
	in.Overlays = storage.Overlays{Stress: true}
	sum := fem.Summarize(in.Solution, in.Exact)
	f := units.SI.Format
	v := NewView(1200, 700)
	v.Fit(in.Model)
	texts := stripTexts(Build(in, v))
	hi := "FE " + f(units.Stress, sum.Extremes[fem.QBendingStress].FEMax) + " at " + f(units.Position, 1.5)
	if !slices.Contains(texts, hi) {
		t.Fatalf("no label %q, the bottom fibre's largest, among %q", hi, texts)
	}
	if got := f(units.Stress, sum.Extremes[fem.QCombinedStress].Max); got != f(units.Stress, 250e6) {
		t.Fatalf("the results' largest combined stress is %s, want 250.0 MPa", got)
	}
	all := strings.Join(texts, " ")
	for _, want := range []string{"Combined stress, larger fibre [MPa]", "the results' combined stress is of both fibres"} {
		if !strings.Contains(all, want) {
			t.Errorf("one solution: no %q among %s", want, all)
		}
	}
	sheet := strings.Join(stripTexts(buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}})), " ")
	for _, want := range []string{"Combined stress, larger fibre [MPa]", "Combined stress N/A ± M·c/I: largest, the greatest tension, and smallest, the greatest compression, in either extreme fibre."} {
		if !strings.Contains(sheet, want) {
			t.Errorf("sheet: no %q among %s", want, sheet)
		}
	}

	m, cs, sol := twoSpanCombinations(t)
	env := Input{Model: m, Solution: sol, Overlays: storage.Overlays{Stress: true},
		Envelope: &Envelope{Solutions: cs, Result: cs.Envelope(), Names: []string{"both", "first"}}}
	v.Fit(m)
	all = strings.Join(stripTexts(Build(env, v)), " ")
	for _, want := range []string{"Combined stress, both fibres [MPa]", "greatest compression of both extreme fibres"} {
		if !strings.Contains(all, want) {
			t.Errorf("envelope: no %q among %s", want, all)
		}
	}
	if strings.Contains(all, "larger fibre") || strings.Contains(all, "Tension + drawn above.") {
		t.Errorf("envelope: names the larger fibre, but draws both: %s", all)
	}
}
