package fem_test

import (
	"fmt"
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// manySupports is a 30 m beam on n supports, a pinned end and rollers
// evenly spaced, under a uniform load: n is limited by the file size to
// about 30,000 (see "Hostile sizes" in docs/performance.md).
func manySupports(n int) *fem.Model {
	const L = 30.0
	m := &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: L, Section: fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: fem.Material{Elastic: 2e11}}},
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
			Points: []fem.LoadPoint{{X: 0, Intensity: -1e4}, {X: L, Intensity: -1e4}}}},
	}
	for i := 1; i < n; i++ {
		m.Supports = append(m.Supports, fem.Support{X: L * float64(i) / float64(n-1), Kind: fem.Roller})
	}
	return m
}

// BenchmarkManySupports times the stages that once visited every pair of
// supports: Validate's search for two supports at one point, which every
// solve runs several times (the convergence study twice per level), and
// the handbook recognition, which found each support's end condition by
// scanning all supports. Both took time growing with the square of the
// supports (at 28,000, most of the 15–20 s of `stave solve`); both now
// sort the supports by place once.
//
//	go test -run '^$' -bench ManySupports -benchtime 1x ./fem
func BenchmarkManySupports(b *testing.B) {
	for _, n := range []int{1000, 4000, 16000} {
		m := manySupports(n)
		b.Run(fmt.Sprintf("Validate/supports=%d", n), func(b *testing.B) {
			for b.Loop() {
				if err := m.Validate(); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(fmt.Sprintf("Handbook/supports=%d", n), func(b *testing.B) {
			for b.Loop() {
				check.Handbook(m)
			}
		})
	}
}
