package canvas

import (
	"path/filepath"
	"slices"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// BenchmarkEditSolveBuild is the first stage of one interactive edit at
// 10,000 elements: a load changes, the finite element solution is computed
// and the drawing rebuilt (the exact solution and the checks follow later, so
// Exact is nil here). The median over the iterations is reported beside the
// mean, since the interactive budget is about the typical edit.
func BenchmarkEditSolveBuild(b *testing.B) {
	p, err := storage.Load(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		b.Fatal(err)
	}
	m := p.Model
	m.Mesh.Elements, m.Mesh.MaxElementLength = 10000, 0
	v := NewView(1200, 900)
	v.Fit(&m)
	cache := &Cache{}
	base := m.PointLoads[0].Transverse
	var times []time.Duration
	for i := 0; b.Loop(); i++ {
		start := time.Now()
		m.PointLoads[0].Transverse = base * (1 + 0.01*float64(i%7))
		s, err := fem.Solve(&m)
		if err != nil {
			b.Fatal(err)
		}
		Build(Input{Model: &m, Solution: s, Layers: DefaultLayers(), Units: units.SI, Cache: cache}, v)
		times = append(times, time.Since(start))
	}
	slices.Sort(times)
	b.ReportMetric(float64(times[len(times)/2].Nanoseconds()), "median-ns/edit")
}
