package analysis

import (
	"context"
	"reflect"
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// Finish summarises and checks every combination of a model with cases;
// the combination it shows (the first for the envelope) it walks once for
// the analysis and the cases alike. Each combination's summary and checks
// must be what fem.Summarize and check.Run give on that combination alone,
// for the shipped models with cases, one placed by span (pattern loading).
func TestCasesSummariesAreEachCombinations(t *testing.T) {
	for _, name := range []string{"two_span_cases.json", "three_span_pattern.json"} {
		m := load(t, name)
		for _, show := range []Show{{Kind: ShowEnvelope}, {Kind: ShowCombination, Index: 1}} {
			r := Request{Model: m, Checks: check.DefaultOptions(), Show: show}
			a, err := Run(context.Background(), r)
			if err != nil || a.Err != nil || a.Cases == nil {
				t.Fatalf("%s: %v, %v", name, err, a.Err)
			}
			c := a.Cases
			if len(c.Summaries) != len(c.Combinations) || len(c.Combinations) < 2 {
				t.Fatalf("%s: %d summaries of %d combinations; the test needs two or more", name, len(c.Summaries), len(c.Combinations))
			}
			for k := range c.Combinations {
				s, err := c.Solutions.Solution(k)
				if err != nil {
					t.Fatal(err)
				}
				e, err := c.Solutions.Exact(k)
				if err != nil {
					t.Fatal(err)
				}
				if want := fem.Summarize(s, e); !reflect.DeepEqual(c.Summaries[k], want) {
					t.Errorf("%s, %s: combination %d's summary differs from its own", name, show.Title(&m), k+1)
				}
			}
			if show.Kind == ShowCombination {
				if want := check.Run(&a.Model, a.Solution, a.Exact, r.Checks); !reflect.DeepEqual(a.Checks, want) {
					t.Errorf("%s, %s: the checks differ from check.Run's", name, show.Title(&m))
				}
				if got, want := a.Summary(), c.Summaries[show.Index]; !reflect.DeepEqual(got, want) {
					t.Errorf("%s, %s: the analysis's summary is not the combination's", name, show.Title(&m))
				}
			}
		}
	}
}
