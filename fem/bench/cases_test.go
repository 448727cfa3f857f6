package bench

import (
	"context"
	"fmt"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/analysis"
)

// casesModel is BeamModel with its loads replaced by 20 load cases (a
// point force each, a line load in every third, self-weight in the first)
// and 10 combinations of 13 or 14 cases each: invented numbers, for
// timing only.
func casesModel(elements int) *fem.Model {
	m := BeamModel(elements)
	m.PointLoads, m.DistributedLoad = nil, nil
	for k := range 20 {
		lc := fem.LoadCase{Name: fmt.Sprintf("case %d", k+1),
			PointLoads: []fem.PointLoad{{X: 0.5 + 14*float64(k)/20, Transverse: -1e3 * float64(k+1)}}, SelfWeight: k == 0}
		if k%3 == 0 {
			lc.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e3}, {X: 15, Intensity: -2e3}}}}
		}
		m.Cases = append(m.Cases, lc)
	}
	for c := range 10 {
		cb := fem.Combination{Name: fmt.Sprintf("combination %d", c+1)}
		for k := range 20 {
			if (k+c)%3 != 0 {
				cb.Factors = append(cb.Factors, fem.CaseFactor{Case: k, Factor: 1 + 0.05*float64(c)})
			}
		}
		m.Combinations = append(m.Combinations, cb)
	}
	return m
}

// BenchmarkCases times, side by side in each iteration, the analysis of a
// 10,000-element beam with 20 load cases and 10 combinations shown as its
// envelope and of the same beam with one load set (BeamModel): the first
// stage (what a drag in the window waits for: the solve, and for the
// cases the envelope) and the whole analysis (both stages: for the cases
// every combination's exact solution, summary and checks). It reports
// the ratios, cases over one case; the target is 2 or less.
func BenchmarkCases(b *testing.B) {
	ctx := context.Background()
	one := analysis.Request{Model: *BeamModel(10_000)}
	many := analysis.Request{Model: *casesModel(10_000), Show: analysis.Show{Kind: analysis.ShowEnvelope}}
	var first, whole [2]time.Duration
	for b.Loop() {
		for i, r := range []analysis.Request{one, many} {
			t0 := time.Now()
			a, err := analysis.Solve(ctx, r)
			if err != nil || a.Err != nil {
				b.Fatal(err, a.Err)
			}
			t1 := time.Now()
			if a, err = analysis.Finish(ctx, r, a); err != nil || !a.Complete {
				b.Fatal(err)
			}
			first[i] += t1.Sub(t0)
			whole[i] += time.Since(t0)
		}
	}
	n := float64(b.N)
	b.ReportMetric(float64(first[0].Microseconds())/n, "µs-solve-1case")
	b.ReportMetric(float64(first[1].Microseconds())/n, "µs-solve-cases")
	b.ReportMetric(float64(first[1])/float64(first[0]), "solve-ratio")
	b.ReportMetric(float64(whole[1])/float64(whole[0]), "whole-ratio")
}

// manyCasesModel is BeamModel on its default mesh with its loads replaced
// by 300 load cases, a point force each and every tenth a line load placed
// by span instead, and 300 combinations of two or three cases each, strength
// and serviceability in turn: invented numbers, for timing only.
func manyCasesModel() *fem.Model {
	m := BeamModel(0)
	m.PointLoads, m.DistributedLoad = nil, nil
	for k := range 300 {
		lc := fem.LoadCase{Name: fmt.Sprintf("case %d", k+1),
			PointLoads: []fem.PointLoad{{X: 0.025 + 0.05*float64(k), Transverse: -1e3 * float64(1+k%7)}}}
		if k%10 == 0 {
			lc.PointLoads, lc.BySpan = nil, true
			lc.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e3}, {X: 15, Intensity: -1e3}}}}
		}
		m.Cases = append(m.Cases, lc)
	}
	for c := range 300 {
		cb := fem.Combination{Name: fmt.Sprintf("combination %d", c+1), Kind: fem.CombinationKind(c % 2)}
		for i := range 2 + c%2 {
			cb.Factors = append(cb.Factors, fem.CaseFactor{Case: (7*c + 101*i) % 300, Factor: 1 + 0.1*float64(i)})
		}
		m.Combinations = append(m.Combinations, cb)
	}
	return m
}

// BenchmarkManyCases times the whole analysis (both stages, as `stave
// solve` runs it) of a beam with 300 load cases and 300 combinations
// shown as its envelope. Its checks copied every case for every case of
// every combination (fem.Model.LoadSet) and walked every case's span
// shares for every combination (fem.CombinationSolutions.Within): about
// 22 s for this model then, 1.3 s now (on two shared cores).
func BenchmarkManyCases(b *testing.B) {
	ctx := context.Background()
	r := analysis.Request{Model: *manyCasesModel(), Show: analysis.Show{Kind: analysis.ShowEnvelope}}
	for b.Loop() {
		a, err := analysis.Solve(ctx, r)
		if err != nil || a.Err != nil {
			b.Fatal(err, a.Err)
		}
		if a, err = analysis.Finish(ctx, r, a); err != nil || !a.Complete {
			b.Fatal(err)
		}
	}
}
