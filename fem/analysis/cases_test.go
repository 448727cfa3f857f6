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

// CaseSummary solves every case on one structure shared by the cases; each
// summary must be that of the case solved on a structure of its own
// against its own exact solution, in every view.
func TestCaseSummaryIsTheCaseAlone(t *testing.T) {
	m := load(t, "two_span_cases.json")
	for _, show := range []Show{{Kind: ShowEnvelope}, {Kind: ShowCase, Index: 1}} {
		a, err := Run(context.Background(), Request{Model: m, Show: show})
		if err != nil || a.Err != nil || a.Cases == nil {
			t.Fatalf("%v, %v", err, a.Err)
		}
		p, err := fem.Prepare(&m)
		if err != nil {
			t.Fatal(err)
		}
		exacts, err := p.ExactLoadSets()
		if err != nil {
			t.Fatal(err)
		}
		for k := range m.Cases {
			got, err := a.Cases.CaseSummary(k)
			if err != nil {
				t.Fatal(err)
			}
			st, err := p.Structure(p.Mesh())
			if err != nil {
				t.Fatal(err)
			}
			s, err := st.Solve(&p.LoadSets()[k])
			if err != nil {
				t.Fatal(err)
			}
			if want := fem.Summarize(s, exacts[k]); !reflect.DeepEqual(got, want) {
				t.Errorf("%s: case %q's summary differs from the case solved alone", show.Title(&m), m.Cases[k].Name)
			}
		}
	}
}
