package fem_test

import (
	"fmt"
	"testing"

	"stave/fem"
)

// SegmentAt finds the segment holding x: inside it, the one to the right
// at a break, the last one at the member's end and beyond it, the first
// before the start (the rule its comment states).
func TestSegmentAt(t *testing.T) {
	m := tiled(4, 4) // breaks at 1, 2 and 3 m
	for _, c := range []struct {
		x    float64
		want int
	}{
		{-1, 0}, {0, 0}, {0.5, 0}, {1, 1}, {1.5, 1}, {2, 2}, {2.999, 2}, {3, 3}, {4, 3}, {5, 3},
	} {
		if got := m.SegmentAt(c.x); got != c.want {
			t.Errorf("SegmentAt(%g) = %d, want %d", c.x, got, c.want)
		}
	}
	if got := (&fem.Model{}).SegmentAt(1); got != -1 {
		t.Errorf("SegmentAt on a member without segments = %d, want -1", got)
	}
}

// tiled is a simply supported steel beam of length L in n equal segments
// under a uniform load.
func tiled(n int, L float64) *fem.Model {
	m := &fem.Model{Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
			Points: []fem.LoadPoint{{X: 0, Intensity: -1e4}, {X: L, Intensity: -1e4}}}}}
	at := func(i int) float64 { return L * float64(i) / float64(n) }
	for i := range n {
		m.Segments = append(m.Segments, fem.Segment{Start: at(i), End: at(i + 1),
			Section: fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: fem.Material{Elastic: 2e11}})
	}
	return m
}

// BenchmarkManySegments times the finite element and the exact solution of
// a 10 m member of many segments on Stave's mesh, which look up the segment of
// every stretch: 40,000 segments took 19 s in `stave solve` while the
// lookup walked the segments from the first.
//
//	go test -run '^$' -bench ManySegments -benchtime 1x ./fem
func BenchmarkManySegments(b *testing.B) {
	for _, n := range []int{1000, 10000} {
		m := tiled(n, 10)
		b.Run(fmt.Sprintf("segments=%d", n), func(b *testing.B) {
			for b.Loop() {
				if _, err := fem.Solve(m); err != nil {
					b.Fatal(err)
				}
				if _, err := fem.SolveExact(m); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
