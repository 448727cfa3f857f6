package bench

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/analysis"
)

// BenchmarkPostProcessing times, in each iteration and side by side, the
// finite element solve (analysis.Solve: mesh, both problems, reactions;
// it starts the exact solution beside them) and what follows it:
//
//   - summary: the exact solution, one walk over the elements for the
//     extremes and the comparison with the exact solution (fem.Summarize),
//     and the summary as JSON;
//   - finish: everything `stave solve --json` does after the solve
//     (analysis.Finish: the exact solution waited for, one walk for the summary and the
//     checks' probes, the checks and the handbook case; then the JSON).
//
// It reports summary/solve and finish/solve, and the solve per element.
// Run it with -benchtime 5x or so on a quiet machine: the ratios are what
// to read, the machine's speed drifts.
func BenchmarkPostProcessing(b *testing.B) {
	ctx := context.Background()
	for _, bm := range benchModels {
		for _, size := range []int{10_000, 100_000, 1_000_000} {
			r := analysis.Request{Model: *bm.build(size), ExactAhead: true} // as analysis.Run
			b.Run(fmt.Sprintf("%s/elements=%d", bm.name, size), func(b *testing.B) {
				var solve, summary, finish time.Duration
				for b.Loop() {
					t0 := time.Now()
					a, err := analysis.Solve(ctx, r)
					if err != nil || a.Err != nil {
						b.Fatal(err, a.Err)
					}
					t1 := time.Now()
					e, err := fem.SolveExact(&a.Model)
					if err != nil {
						b.Fatal(err)
					}
					if err := json.NewEncoder(io.Discard).Encode(fem.Summarize(a.Solution, e)); err != nil {
						b.Fatal(err)
					}
					t2 := time.Now()
					if a, err = analysis.Finish(ctx, r, a); err != nil || a.Exact == nil {
						b.Fatal(err, a.ExactErr)
					}
					if err := json.NewEncoder(io.Discard).Encode(a.Summary()); err != nil {
						b.Fatal(err)
					}
					solve, summary, finish = solve+t1.Sub(t0), summary+t2.Sub(t1), finish+time.Since(t2)
				}
				b.ReportMetric(float64(summary)/float64(solve), "summary/solve")
				b.ReportMetric(float64(finish)/float64(solve), "finish/solve")
				b.ReportMetric(float64(solve.Nanoseconds())/float64(b.N*size), "solve-ns/element")
			})
		}
	}
}
