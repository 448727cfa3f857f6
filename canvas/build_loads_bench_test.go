package canvas

import (
	"strconv"
	"testing"

	"stave/fem/bench"
	"stave/fem/units"
	"stave/storage"
)

// BenchmarkBuildPointLoads is the scene's part of a drag step alone
// (BenchmarkDragPointLoad has the whole step): Build for the beam of
// 10,000 elements with 10, 1,000 and 20,000 point loads (bench.KeyPointModel,
// demo data), solved once, with the curves cached as while dragging.
func BenchmarkBuildPointLoads(b *testing.B) {
	for _, loads := range []int{10, 1_000, 20_000} {
		b.Run("loads="+strconv.Itoa(loads), func(b *testing.B) {
			in := solved(b, bench.KeyPointModel(10_000, loads))
			in.Overlays = storage.Overlays{DeformedShape: true, ShearForce: true, BendingMoment: true, ExactBand: true}
			in.Units, in.Cache = units.SI, &Cache{}
			v := NewView(1200, 900)
			v.Fit(in.Model)
			items := 0
			for b.Loop() {
				items = len(Build(in, v).Items)
			}
			b.ReportMetric(float64(items), "scene-items")
		})
	}
}
