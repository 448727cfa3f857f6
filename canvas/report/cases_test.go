package report

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"stave/fem/analysis"
	"stave/storage"
)

// The calculation sheet of a model with cases lists what is shown, the
// cases, the combinations with their factors, the envelope's governing
// moments and reactions, and the caution on combined results; a model
// without cases gets none of it.
func TestSheetCaseLines(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	src, err := Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	all := strings.Join(sheetCaseLines(src), "\n")
	for _, want := range []string{"envelope of 3 combinations", "pattern (typical; use the factors your local code gives) = 1 × imposed",
		"at 4.000 m, both", "(pattern (imposed on span 2))", "Stave builds in no code's factors"} {
		if !strings.Contains(all, want) {
			t.Errorf("the sheet's lines lack %q:\n%s", want, all)
		}
	}
	demo, err := storage.Load("../../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	if src, err = Analyse(context.Background(), demo); err != nil || sheetCaseLines(src) != nil {
		t.Errorf("a model without cases: %v, lines %q", err, sheetCaseLines(src))
	}
}

// Exports show a case, a combination or the envelope: each drawing
// differs from the others.
func TestExportShows(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	var outs []string
	for _, s := range []analysis.Show{{Kind: analysis.ShowEnvelope}, {Kind: analysis.ShowCase, Index: 1}, {Kind: analysis.ShowCombination, Index: 2}} {
		var b bytes.Buffer
		if _, err := Export(context.Background(), &b, p, "svg", Options{Show: s}); err != nil {
			t.Fatal(err)
		}
		outs = append(outs, b.String())
	}
	if !strings.Contains(outs[0], "envelope of the combinations") || strings.Contains(outs[1], "envelope of the combinations") {
		t.Error("the envelope's drawing does not say so, or a case's does")
	}
	if outs[1] == outs[2] || outs[0] == outs[1] {
		t.Error("a case, a combination and the envelope draw the same")
	}
}
