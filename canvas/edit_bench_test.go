package canvas

import (
	"path/filepath"
	"runtime"
	"slices"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// windowHeap stands for the live heap of the running window, which sets how
// often the collector runs: 27 MB after start-up on the demo under Xvfb
// (GODEBUG=gctrace=1 on ./stave testdata/demo.json: "41->42->27 MB"), taken
// as 32 MB. A benchmark alone has a heap of 2 to 3 MB and collects every
// second edit, about ten times as often as the window does.
const windowHeap = 32 << 20

// BenchmarkEditSolveBuild is the first stage of one interactive edit at
// 10,000 elements: a load changes, the finite element solution is computed
// and the drawing rebuilt (the exact solution and the checks follow later, so
// Exact is nil here). It runs with the benchmark's bare heap and with a
// resident block the size of the window's heap; the median over the
// iterations is reported beside the mean, since the interactive budget is
// about the typical edit, with the collections per edit.
func BenchmarkEditSolveBuild(b *testing.B) {
	p, err := storage.Load(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		b.Fatal(err)
	}
	for _, heap := range []struct {
		name  string
		bytes int
	}{{"bare", 0}, {"window", windowHeap}} {
		b.Run("heap="+heap.name, func(b *testing.B) {
			resident := make([]byte, heap.bytes)
			m := p.Model
			m.PointLoads = slices.Clone(m.PointLoads)
			m.Mesh.Elements, m.Mesh.MaxElementLength = 10000, 0
			v := NewView(1200, 900)
			v.Fit(&m)
			cache := &Cache{}
			base := m.PointLoads[0].Transverse
			var times []time.Duration
			var before, after runtime.MemStats
			runtime.GC()
			runtime.ReadMemStats(&before)
			for i := 0; b.Loop(); i++ {
				start := time.Now()
				m.PointLoads[0].Transverse = base * (1 + 0.01*float64(i%7))
				s, err := fem.Solve(&m)
				if err != nil {
					b.Fatal(err)
				}
				Build(Input{Model: &m, Solution: s, Overlays: storage.Overlays{DeformedShape: true, ShearForce: true, BendingMoment: true, ExactBand: true}, Dimensions: true, Units: units.SI, Cache: cache}, v)
				times = append(times, time.Since(start))
			}
			runtime.ReadMemStats(&after)
			runtime.KeepAlive(resident)
			slices.Sort(times)
			b.ReportMetric(float64(times[len(times)/2].Nanoseconds()), "median-ns/edit")
			b.ReportMetric(float64(after.NumGC-before.NumGC)/float64(len(times)), "gc/edit")
		})
	}
}
