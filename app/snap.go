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
	if len(m.Segments) > 0 {
		s.points = append(s.points, 0)
	}
	for i, seg := range m.Segments {
		if !(moving.Kind == canvas.Segment && moving.Index == i) && !(moving.Kind == canvas.MemberEnd && i == len(m.Segments)-1) {
			s.points = append(s.points, seg.End)
		}
	}
	for i, sup := range m.Supports {
		if !(moving.Kind == canvas.Support && moving.Index == i) {
			s.points = append(s.points, sup.X)
		}
	}
	for i, p := range m.PointLoads {
		if !(moving.Kind == canvas.PointLoad && moving.Index == i) {
			s.points = append(s.points, p.X)
		}
	}
	for i, d := range m.DistributedLoad {
		if (moving.Kind == canvas.DistributedLoad || moving.Kind == canvas.LoadVertex) && moving.Index == i {
			continue
		}
		for _, p := range d.Points {
			s.points = append(s.points, p.X)
		}
	}
	return s
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
