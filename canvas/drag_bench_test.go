package canvas

import (
	"context"
	"runtime"
	"slices"
	"strconv"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/bench"
	"stave/fem/check"
	"stave/fem/units"
	"stave/storage"
)

// BenchmarkDragPointLoad is the whole of one step of dragging a point load
// along a beam of 10,000 elements that carries 1,000 other point loads
// (bench.KeyPointModel, demo data): the load moves, the model is copied as
// the window copies it, the finite element solution, the exact solution and
// the checks are worked out (analysis.Solve and analysis.Finish, the exact
// solution started beside the finite element one, as the window asks while
// its analyses keep up with the drag) and the
// drawing is rebuilt from them with the checks' marks. It reports the
// median over the steps and the scene's items: the drawing reads every
// curve once per pixel column, so its size is bounded by the view's width,
// not by the elements or the loads (the items are also reported for 10
// loads beside it).
func BenchmarkDragPointLoad(b *testing.B) {
	for _, loads := range []int{10, 1_000} {
		b.Run("loads="+strconv.Itoa(loads), func(b *testing.B) {
			m := bench.KeyPointModel(10_000, loads)
			dragged := len(m.PointLoads)
			m.PointLoads = append(m.PointLoads, fem.PointLoad{X: 3.3, Transverse: -20e3})
			v := NewView(1200, 900)
			v.Fit(m)
			cache := &Cache{}
			ctx := context.Background()
			opts := check.DefaultOptions()
			var times []time.Duration
			items := 0
			resident := make([]byte, windowHeap)
			for i := 0; b.Loop(); i++ {
				start := time.Now()
				// A drag of 1 mm a step to and fro, between other loads.
				m.PointLoads[dragged].X = 3.3 + 0.001*float64(i%40)
				r := analysis.Request{Model: m.Clone(), Checks: opts, ExactAhead: true}
				a, err := analysis.Solve(ctx, r)
				if err == nil {
					a, err = analysis.Finish(ctx, r, a)
				}
				if err != nil || a.Err != nil || a.Exact == nil {
					b.Fatal(err, a.Err, a.ExactErr)
				}
				var marks []Mark
				for k, c := range a.Checks {
					if c.Status == check.Fail || c.Status == check.Warn {
						marks = append(marks, Mark{X: c.X, Index: k, Severe: c.Status == check.Fail})
					}
				}
				s := Build(Input{Model: &a.Model, Solution: a.Solution, Exact: a.Exact,
					Overlays:   storage.Overlays{DeformedShape: true, ShearForce: true, BendingMoment: true, ExactBand: true},
					Dimensions: true, Units: units.SI, Marks: marks, Cache: cache}, v)
				times = append(times, time.Since(start))
				items = len(s.Items)
			}
			runtime.KeepAlive(resident)
			slices.Sort(times)
			b.ReportMetric(float64(times[len(times)/2].Nanoseconds()), "median-ns/step")
			b.ReportMetric(float64(items), "scene-items")
		})
	}
}
