package fem

import (
	"math"
	"testing"
)

// Point loads on a ramp are key points of the loads, where the intensity
// on either side is interpolated from the ramp's own points: a straight
// line has one slope, so none of them is a break of the line load, whose
// stretch the refinement then reads as one linear piece. A real kink of the
// load (where it stops rising) stays a break. Compared to the bit, round-off
// in the interpolated intensities made most of the point loads on a ramp
// breaks.
func TestPointLoadsOnARampAreNoBreaks(t *testing.T) {
	for _, tc := range []struct {
		name   string
		points []LoadPoint
		want   []float64 // the breaks inside the span, m
	}{
		{"straight ramp", []LoadPoint{{X: 0, Intensity: 0}, {X: 10, Intensity: -20e3}}, nil},
		{"ramp, then level", []LoadPoint{{X: 0, Intensity: 0}, {X: 5, Intensity: -20e3}, {X: 10, Intensity: -20e3}}, []float64{5}},
		{"axial ramp", nil, nil},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := &Model{
				Segments: []Segment{{Start: 0, End: 10, Section: Section{Area: 6e-3, SecondMoment: 1e-4, FibreDistance: 0.15},
					Material: Material{Elastic: 210e9}}},
				Supports: []Support{{X: 0, Kind: Pinned}, {X: 10, Kind: Roller}},
				Mesh:     MeshSettings{Elements: 1000},
			}
			if tc.points != nil {
				m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: tc.points}}
			} else {
				m.DistributedLoad = []DistributedLoad{{Direction: Axial, Points: []LoadPoint{{X: 0, Intensity: 3e3}, {X: 10, Intensity: -7e3}}}}
			}
			for i := range 333 {
				m.PointLoads = append(m.PointLoads, PointLoad{X: 10 * (float64(i) + 0.5) / 333, Transverse: -1e3})
			}
			p, err := Prepare(m)
			if err != nil {
				t.Fatal(err)
			}
			_, _, breaks := p.loads.loadsIn(0, 10)
			var got []float64
			for _, b := range breaks {
				got = append(got, b.x)
			}
			if len(got) != len(tc.want) {
				t.Fatalf("breaks at %v, want %v", got, tc.want)
			}
			for i := range got {
				if math.Abs(got[i]-tc.want[i]) > 1e-12 {
					t.Errorf("break %d at %g m, want %g m", i, got[i], tc.want[i])
				}
			}
		})
	}
}
