package fem

import (
	"testing"
)

// Beyond an axial point load the axial force is nothing, the exact
// solution's exactly and the finite element one to its round-off; the
// combined stress there is the bending stress on the bottom fibre in both
// (combinedStress), not ±|σb| as round-off falls, so their extremes agree.
// Before, a finite element axial stress of 3e-15 of the bending stress
// made the smallest combined stress −20 kPa where the exact one was 0
// (15 % of the largest, on a member found by a random survey).
func TestCombinedStressBeyondAnAxialLoad(t *testing.T) {
	steel := Material{Elastic: 2e11}
	for _, a := range []float64{1, 4.286020011442118, 4.7} {
		m := &Model{
			Segments: []Segment{
				{Start: 0, End: 4.578848927802005, Section: Section{Area: 0.015506360928256862, SecondMoment: 3.618504251565941e-05, FibreDistance: 0.15}, Material: steel},
				{Start: 4.578848927802005, End: 9.15769785560401, Section: Section{Area: 0.015697903464789942, SecondMoment: 4.0683899466241374e-05, FibreDistance: 0.15}, Material: steel}},
			Supports: []Support{{X: 0, Kind: Fixed}, {X: 2.9581518434790817, Kind: Spring, Stiffness: [3]float64{0, 2.51429293936202e+06, 0}},
				{X: 6.9114822664626505, Kind: Spring, Stiffness: [3]float64{0, 8.426828118048799e+07, 0}}},
			PointLoads: []PointLoad{{X: a, Axial: 1005.4286837191995, Transverse: -18.035199236616783}},
		}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		for _, x := range Summarize(s, e).Extremes {
			if x.Quantity == QCombinedStress && x.Accuracy > MeshAccuracy {
				t.Errorf("load at %g m: combined stress FE %.6g..%.6g, exact %.6g..%.6g: %.3g of its size apart", a, x.FEMin, x.FEMax, x.Min, x.Max, x.Accuracy)
			}
		}
	}
}
