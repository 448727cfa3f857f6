package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"stave/canvas/report"
)

// casesResult is the part of `stave solve --json` a model with load cases
// adds.
type casesResult struct {
	Shown     string
	SummaryOf string `json:"summary_of"`
	Cases     []struct {
		Name      string
		Reactions []struct{ Transverse struct{ Value float64 } }
		Extremes  []struct {
			Quantity string
			Max, Min struct{ Value float64 }
		}
	}
	Combinations []struct {
		Name    string
		Kind    string
		Factors []struct {
			Case   string
			Factor float64
		}
	}
	Envelope struct {
		Caution    string
		Spans      [][2]float64
		Quantities []struct {
			Quantity string
			Max, Min governing
		}
		Reactions []struct {
			Support  int
			Max, Min map[string]governing
		}
	}
}

type governing struct {
	Value, X    float64
	Combination string
	LoadedSpans []struct {
		Case  string
		Spans []int
	} `json:"loaded_spans"`
}

// Two equal spans through the file format and the JSON, case by case and
// as an envelope, against the continuous-beam tables (AISC Manual, beam
// diagrams and formulas, two equal spans, uniform load on both spans and
// on one span; from memory): both spans, reactions 3qL/8, 10qL/8, 3qL/8,
// moment over the middle support −qL²/8, largest span moment 9qL²/128 at
// 3L/8; one span, reactions 7qL/16, 10qL/16, −qL/16, moment over the
// middle −qL²/16, largest span moment 49qL²/512 at 7L/16. Reactions are
// nodal values (exact to round-off); moments are finite element values
// between nodes, within 0.2 % on the file's 64 elements.
func TestSolveJSONTwoSpanCases(t *testing.T) {
	code, out, stderr := runStave(t, "solve", "--json", "../../testdata/two_span_cases.json")
	if code != 0 {
		t.Fatalf("exit %d, stderr %s", code, stderr)
	}
	var got casesResult
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	const L, W = 4.0, 10e3 // span, m; load, N/m downward
	if len(got.Cases) != 3 || len(got.Combinations) != 3 {
		t.Fatalf("%d cases and %d combinations, want 3 and 3", len(got.Cases), len(got.Combinations))
	}
	for i, want := range []struct {
		reactions          [3]float64
		support, span, atX float64
	}{
		{[3]float64{3 * W * L / 8, 10 * W * L / 8, 3 * W * L / 8}, -W * L * L / 8, 9 * W * L * L / 128, 3 * L / 8},
		{[3]float64{7 * W * L / 16, 10 * W * L / 16, -W * L / 16}, -W * L * L / 16, 49 * W * L * L / 512, 7 * L / 16},
	} {
		c := got.Cases[i]
		for k, r := range c.Reactions {
			if math.Abs(r.Transverse.Value-want.reactions[k]) > 1e-9*W*L {
				t.Errorf("%s: reaction %d %.9g N, want %.9g", c.Name, k+1, r.Transverse.Value, want.reactions[k])
			}
		}
		m := c.Extremes[5] // bending moment
		if m.Quantity != "bending_moment" {
			t.Fatalf("extreme 6 is %s", m.Quantity)
		}
		if math.Abs(m.Min.Value-want.support) > 2e-3*W*L*L/8 || math.Abs(m.Max.Value-want.span) > 2e-3*W*L*L/8 {
			t.Errorf("%s: moments %.6g and %.6g N·m, want %.6g and %.6g", c.Name, m.Min.Value, m.Max.Value, want.support, want.span)
		}
	}
	// The envelope: the middle reaction largest with both spans loaded,
	// the end reaction's uplift −qL/16 from the imposed load on the far
	// span alone.
	r := got.Envelope.Reactions
	if hi := r[1].Max["transverse"]; math.Abs(hi.Value-10*W*L/8) > 1e-9*W*L || hi.Combination != "both" {
		t.Errorf("middle reaction %.9g N from %s, want %.9g from both", hi.Value, hi.Combination, 10*W*L/8)
	}
	lo := r[0].Min["transverse"]
	if math.Abs(lo.Value+W*L/16) > 1e-9*W*L || lo.Combination != "pattern" || len(lo.LoadedSpans) != 1 || !slices.Equal(lo.LoadedSpans[0].Spans, []int{2}) {
		t.Errorf("end reaction's least %.9g N from %s with %+v loaded, want %.9g from pattern with span 2", lo.Value, lo.Combination, lo.LoadedSpans, -W*L/16)
	}
	if !strings.Contains(got.Envelope.Caution, "local code") || len(got.Envelope.Spans) != 2 {
		t.Errorf("envelope caution %q, spans %v", got.Envelope.Caution, got.Envelope.Spans)
	}
	if got.Shown != "envelope of 3 combinations" || got.SummaryOf != "combination both" {
		t.Errorf("shown %q, summary of %q", got.Shown, got.SummaryOf)
	}
	// Every governing value lists its loaded spans, an empty list for a
	// combination that places nothing by span (docs/json.md: lists are
	// always lists).
	var raw struct {
		Envelope struct {
			Quantities []struct{ Max, Min map[string]any }
			Reactions  []struct{ Max, Min map[string]map[string]any }
		}
	}
	if err := json.Unmarshal([]byte(out), &raw); err != nil {
		t.Fatal(err)
	}
	var values []map[string]any
	for _, q := range raw.Envelope.Quantities {
		values = append(values, q.Max, q.Min)
	}
	for i, r := range raw.Envelope.Reactions {
		// A motion the support leaves free is null (a roller's axial and
		// moment), as in the reactions; the pinned end holds axially.
		for _, side := range []map[string]map[string]any{r.Max, r.Min} {
			for name, g := range side {
				free := name == "moment" || name == "axial" && i > 0
				if free != (g == nil) {
					t.Errorf("support %d, %s: %v, want null exactly where the support leaves the motion free", i+1, name, g)
				}
				if g != nil {
					values = append(values, g)
				}
			}
		}
	}
	for _, g := range values {
		if l, ok := g["loaded_spans"].([]any); !ok || (g["combination"] != "pattern" && len(l) != 0) {
			t.Errorf("governing value %v: loaded_spans %v, want a list (empty unless the combination places a case by span)", g, g["loaded_spans"])
		}
	}
}

// --show NAME prints one case or combination; an unknown name is misuse,
// with the names to choose from.
func TestSolveShow(t *testing.T) {
	// The envelope's text, the default, ends with the cautions, after the
	// warnings.
	code, out, stderr := runStave(t, "solve", "../../testdata/two_span_cases.json")
	warnings, caution := strings.Index(out, "Warnings"), strings.LastIndex(out, "Caution: ")
	if code != 0 || warnings < 0 || caution < warnings || !strings.HasSuffix(strings.TrimSpace(out), report.CombinedCaution) {
		t.Errorf("the envelope's text does not end with the cautions after the warnings (exit %d, stderr %s):\n%s", code, stderr, out)
	}
	code, out, stderr = runStave(t, "solve", "--show", "first span", "../../testdata/two_span_cases.json")
	if code != 0 || !strings.Contains(out, "Showing load case first span") || !strings.Contains(out, "Reactions") {
		t.Errorf("exit %d, out %s, stderr %s", code, out, stderr)
	}
	code, out, _ = runStave(t, "solve", "--json", "--show", "pattern", "../../testdata/two_span_cases.json")
	var got casesResult
	if err := json.Unmarshal([]byte(out), &got); code != 0 || err != nil || got.SummaryOf != "combination pattern" {
		t.Errorf("exit %d, %v, summary of %q", code, err, got.SummaryOf)
	}
	code, _, stderr = runStave(t, "solve", "--show", "snow", "../../testdata/two_span_cases.json")
	if code != 2 || !strings.Contains(stderr, `"first span"`) {
		t.Errorf("exit %d, stderr %s", code, stderr)
	}
	code, _, stderr = runStave(t, "solve", "--show", "x", "../../testdata/demo.json")
	if code != 2 || !strings.Contains(stderr, "no load cases") {
		t.Errorf("exit %d, stderr %s", code, stderr)
	}
}

// A combination that takes a moving load train: the simply supported beam
// of span L = 4 m under its case (q = 10 kN/m down) plus 1.5 times two
// axles of 10 kN, 1 m apart. With one axle at x ≤ 3 m and the other 1 m
// beyond, statics gives M = q·x·(L − x)/2 + 1.5·P·x·(2L − 2x − 1)/L =
// 46.25·x − 12.5·x² kN·m, largest at x = 1.85 m: 42.78125 kN·m (or at its
// mirror image, 2.15 m), a position of the 0.01 m step. The governing
// words name the train's position in the units the text is in.
func TestSolveCombinationWithTrain(t *testing.T) {
	path := variant(t, t.TempDir(), "with_train", func(m map[string]any) {
		stiff(m)
		m["cases"] = []any{map[string]any{"name": "dead", "loads": m["loads"], "by_span": true}}
		delete(m, "loads")
		m["combinations"] = []any{map[string]any{"name": "C", "kind": "strength",
			"factors": []any{map[string]any{"case": "dead", "factor": 1}, map[string]any{"train": "two axles", "factor": 1.5}}}}
		m["trains"] = []any{map[string]any{"name": "two axles", "step": 0.01,
			"axles": []any{map[string]any{"load": 10e3}, map[string]any{"load": 10e3, "spacing": 1}}}}
	})
	code, out, stderr := runStave(t, "solve", "--json", path)
	var got casesResult
	if err := json.Unmarshal([]byte(out), &got); code != 0 || err != nil {
		t.Fatalf("exit %d, %v, stderr %s", code, err, stderr)
	}
	for _, q := range got.Envelope.Quantities {
		if q.Quantity != "bending_moment" {
			continue
		}
		if math.Abs(q.Max.Value-42781.25) > 1e-9*42781.25 || (math.Abs(q.Max.X-1.85) > 1e-9 && math.Abs(q.Max.X-2.15) > 1e-9) || q.Max.Combination != "C" {
			t.Errorf("largest moment %.12g N·m at %g from %s, want 42781.25 at 1.85 or 2.15 from C", q.Max.Value, q.Max.X, q.Max.Combination)
		}
		// A combination that takes a train is worked out with every span
		// loaded, and says so.
		if l := q.Max.LoadedSpans; len(l) != 1 || l[0].Case != "dead" || !slices.Equal(l[0].Spans, []int{1}) {
			t.Errorf("largest moment's loaded spans %+v, want dead on span 1", l)
		}
	}
	for _, c := range []struct{ units, unit string }{{"SI", "m"}, {"US", "ft"}} {
		code, out, stderr = runStave(t, "solve", "--units", c.units, path)
		if code != 0 {
			t.Fatalf("%s: exit %d, stderr %s", c.units, code, stderr)
		}
		for _, line := range strings.Split(out, "\n") {
			if !strings.HasPrefix(line, "  bending moment ") {
				continue
			}
			i := strings.Index(line, "front at ")
			if i < 0 {
				t.Fatalf("%s: the moment's governing words name no position of the train: %q", c.units, line)
			}
			if f := strings.Fields(line[i+len("front at "):]); len(f) < 2 || f[1] != c.unit {
				t.Errorf("%s: the train's front is given as %q, want a position in %s", c.units, line[i:], c.unit)
			}
		}
	}
}

// A combination of a uniform load, a point load and a couple taken with a
// negative factor, and a settlement, on two unequal spans (4 m and 6 m, EI
// = 3.2 MN·m²), shown with --show, against the three-moment equation
// (from memory; e.g. Hibbeler, Structural Analysis, ch. 10):
// 2·M_B·(L1 + L2) = −6·A1·x̄1/L1 − 6·A2·x̄2/L2 + 6·EI·(h_A/L1 + h_C/L2),
// A·x̄ the simple spans' moment areas about their far ends, h the outer
// supports' heights above B.
//
//   - D, 5 kN/m down on both spans: 20·M_B = −(5·4³/4 + 5·6³/4) kN·m²,
//     M_B = −17.5 kN·m.
//   - P, 20 kN down at 7 m (3 m from B and C) and a counter-clockwise
//     couple of 10 kN·m at 2 m: the load's term 6·(20·3·3/2)·(6 + 3)/3/6 =
//     270, the couple's A·x̄ = C·(a²/2 − L1²/6) = −6.667 kN·m², term −10:
//     M_B = −(270 − 10)/20 = −13 kN·m.
//   - S, B settles 10 mm: 6·EI·(0.01/4 + 0.01/6)/20 = +4 kN·m.
//
// C = D − 0.5·P + S: M_B = −17.5 + 6.5 + 4 = −7 kN·m, and by statics of
// the first span R_A = 10 + M_B/4 (D) − 0.5·(2.5 + M_B/4) (P; the couple
// gives C/L1) + M_B/4 (S) = 5.625 + 0.375 + 1 = 7 kN, a nodal value the
// finite elements hold too.
func TestSolveCombinationAgainstThreeMoments(t *testing.T) {
	const model = `{"format": "stave-member", "version": 2,
  "units": {"length": "m", "area": "m²", "second_moment": "m⁴", "force": "N", "moment": "N·m", "line_load": "N/m", "stress": "Pa", "density": "kg/m³", "acceleration": "m/s²", "thermal_expansion": "1/K", "temperature_change": "K", "rotation": "rad", "spring": "N/m", "rotational_spring": "N·m/rad"},
  "member": {"segments": [{"start": 0, "end": 10, "section": {"area": 0.004, "second_moment": 1.6e-5, "fibre_distance": 0.1}, "material": {"elastic_modulus": 2e11}}]},
  "supports": [{"x": 0, "kind": "pinned"}, {"x": 4, "kind": "roller", "settlement": {"transverse": -0.01}}, {"x": 10, "kind": "roller"}],
  "cases": [
    {"name": "D", "loads": [{"kind": "distributed", "direction": "transverse", "points": [[0, -5000], [10, -5000]]}]},
    {"name": "P", "loads": [{"kind": "point", "x": 7, "transverse": -20000}, {"kind": "point", "x": 2, "moment": 10000}]},
    {"name": "S", "settlements": true}],
  "combinations": [{"name": "C", "kind": "strength", "factors": [{"case": "D", "factor": 1}, {"case": "P", "factor": -0.5}, {"case": "S", "factor": 1}]}]}`
	path := filepath.Join(t.TempDir(), "three_moments.json")
	if err := os.WriteFile(path, []byte(model), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, stderr := runStave(t, "solve", "--json", "--show", "C", path)
	var got struct {
		SummaryOf string `json:"summary_of"`
		Reactions []struct {
			Transverse struct{ Value, FE float64 }
		}
		SupportActions []struct {
			X          float64
			MomentLeft struct{ Value float64 } `json:"moment_left"`
		} `json:"support_actions"`
		Cases []struct {
			Name           string
			SupportActions []struct {
				MomentLeft struct{ Value float64 } `json:"moment_left"`
			} `json:"support_actions"`
		}
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil || code > 3 {
		t.Fatalf("exit %d, %v, stderr %s", code, err, stderr)
	}
	if got.SummaryOf != "combination C" || len(got.SupportActions) != 1 || len(got.Reactions) != 3 || len(got.Cases) != 3 {
		t.Fatalf("summary of %q, %d support actions, %d reactions, %d cases", got.SummaryOf, len(got.SupportActions), len(got.Reactions), len(got.Cases))
	}
	for i, want := range []float64{-17500, -13000, 4000} {
		if v := got.Cases[i].SupportActions[0].MomentLeft.Value; math.Abs(v-want) > 1e-9*17500 {
			t.Errorf("case %s: M_B %.12g N·m, want %g", got.Cases[i].Name, v, want)
		}
	}
	mb := got.SupportActions[0].MomentLeft
	if math.Abs(mb.Value+7000) > 1e-9*17500 {
		t.Errorf("combination: M_B %.12g N·m, want −7000", mb.Value)
	}
	ra := got.Reactions[0].Transverse
	if math.Abs(ra.Value-7000) > 1e-9*7000 || math.Abs(ra.FE-7000) > 1e-9*7000 {
		t.Errorf("combination: R_A %.12g N (FE %.12g), want 7000", ra.Value, ra.FE)
	}
}

// The text of a model with load cases, shown as its envelope, lists the
// envelope's checks as the JSON does, each naming its governing
// combination: the deflection of the two-span beam's second span governs
// with the imposed load on that span alone, 7.320 mm, as the first span's
// does with the first span loaded (one span of two equal spans loaded:
// 0.0092·wL⁴/EI, AISC Manual, beam diagrams and formulas, from memory).
func TestSolveTextOfAnEnvelopeListsItsChecks(t *testing.T) {
	code, out, _ := runStave(t, "solve", "../../testdata/two_span_cases.json")
	if code != 0 {
		t.Fatalf("exit %d", code)
	}
	for _, want := range []string{"\nChecks\n", "Deflection, span 4.000 m to 8.000 m (governing: pattern, imposed on span 2)", "7.320 mm exact", "\nWarnings\n"} {
		if !strings.Contains(out, want) {
			t.Errorf("the envelope's text has no %q", want)
		}
	}
	if strings.Index(out, "\nChecks\n") > strings.Index(out, "\nWarnings\n") {
		t.Error("the checks come after the warnings; want them before")
	}
}
