package fem

import "testing"

// featureCount counts what Features lists, for a model with every kind of
// feature (segments, supports, a hinge, a foundation, point and distributed
// loads, and the loads of cases), for a bare one and for an empty one: the
// memory check counts the key points with it, and Features takes it as its
// capacity. (Features' own contract; no check value of its own.)
func TestFeatureCountIsFeatures(t *testing.T) {
	line := func(xs ...float64) DistributedLoad {
		d := DistributedLoad{Direction: Transverse}
		for _, x := range xs {
			d.Points = append(d.Points, LoadPoint{X: x, Intensity: -1e3})
		}
		return d
	}
	full := &Model{
		Segments:        []Segment{testSegment(0, 4), testSegment(4, 10)},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: 10, Kind: Roller}, {X: 6, Kind: Roller}},
		Hinges:          []Hinge{{X: 5}},
		Foundations:     []Foundation{{Start: 1, End: 3, Modulus: 1e6}},
		PointLoads:      []PointLoad{{X: 2, Transverse: -1e3}, {X: 7, Moment: 5e2}},
		DistributedLoad: []DistributedLoad{line(0, 3, 8), line(4, 9)},
		Cases: []LoadCase{
			{Name: "a", PointLoads: []PointLoad{{X: 8, Transverse: 1e3}}, DistributedLoad: []DistributedLoad{line(1, 2, 3, 4)}},
			{Name: "b", DistributedLoad: []DistributedLoad{line(0, 10)}},
		},
	}
	bare := &Model{Segments: []Segment{testSegment(0, 3)}}
	for name, m := range map[string]*Model{"every kind": full, "bare": bare, "empty": {}} {
		if got, want := featureCount(m), len(Features(m)); got != want {
			t.Errorf("%s: featureCount %d, Features lists %d", name, got, want)
		}
	}
}
