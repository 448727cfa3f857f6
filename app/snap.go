package app

import (
	"math"

	"stave/canvas"
	"stave/fem"
)

// snapPixels is how close, in screen pixels, the mouse must come to a feature
// of the member for a position to snap to it.
const snapPixels = 8

// snapper pulls positions along the member onto the ends, segment breaks,
// other supports, loads and load vertices, and otherwise onto the grid.
type snapper struct {
	points []float64 // feature positions, m
	grid   float64   // grid step, m; 0 for none
	reach  float64   // snap distance, m
	length float64   // member length, m; 0 when there is no member
}

// newSnapper collects the snap points of m, leaving out the item being moved
// (so it does not snap to where it started).
func newSnapper(m *fem.Model, moving canvas.Ref, grid, metresPerPixel float64) snapper {
	s := snapper{grid: grid, reach: snapPixels * metresPerPixel, length: m.Length()}
	for _, f := range fem.Features(m) {
		if !moves(moving, f, len(m.Segments)) {
			s.points = append(s.points, f.X)
		}
	}
	return s
}

// moves reports whether dragging the part moving carries feature f along.
// A segment carries the break at its end (its own end and the next
// segment's start), the member end the last segment's end, a distributed
// load or one of its vertices the whole load, a foundation both its ends.
func moves(moving canvas.Ref, f fem.Feature, segments int) bool {
	it := f.Item
	switch moving.Kind {
	case canvas.Segment:
		return it.Kind == fem.SegmentItem && (it.Index == moving.Index && f.Vertex == 1 || it.Index == moving.Index+1 && f.Vertex == 0)
	case canvas.MemberEnd:
		return it.Kind == fem.SegmentItem && it.Index == segments-1 && f.Vertex == 1
	case canvas.Support:
		return it.Kind == fem.SupportItem && it.Index == moving.Index
	case canvas.PointLoad:
		return it.Kind == fem.PointLoadItem && it.Index == moving.Index
	case canvas.Hinge:
		return it.Kind == fem.HingeItem && it.Index == moving.Index
	case canvas.Foundation:
		return it.Kind == fem.FoundationItem && it.Index == moving.Index
	case canvas.DistributedLoad, canvas.LoadVertex:
		return it.Kind == fem.DistributedLoadItem && it.Index == moving.Index
	}
	return false
}

// snap returns x moved onto the nearest feature within reach, else onto the
// grid, and kept on the member when there is one.
func (s snapper) snap(x float64) float64 {
	best, bestDist := x, s.reach
	for _, p := range s.points {
		if d := math.Abs(p - x); d <= bestDist {
			best, bestDist = p, d
		}
	}
	if best == x && s.grid > 0 {
		best = math.Round(x/s.grid) * s.grid
	}
	if s.length > 0 {
		best = math.Max(0, math.Min(s.length, best))
	}
	return best
}
