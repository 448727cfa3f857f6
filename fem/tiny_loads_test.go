package fem_test

import (
	"fmt"
	"math"
	"testing"

	"stave/fem"
)

// A member's answers scale with its loads, down to the smallest a file may
// hold: the exact extremes of a simply supported beam keep their values over
// the load and their places. Loads near 1e-200 squared the fields'
// coefficients to zero when the turning points were sought, so the largest
// moment of a triangular load was read at the end of the beam (5.8e-216 N·m
// at x = 4 m for 1e-200 N/m) and a coarse_mesh warning blamed the mesh.
func TestTinyLoadsKeepTheirExtremes(t *testing.T) {
	L := refLength
	for _, c := range []struct {
		name   string
		model  func(size float64) fem.Model
		q      fem.Quantity
		max    bool
		factor float64 // the extreme over the load's size
		x      float64 // where, m
	}{
		// Load rising from 0 to q: R = qL/6 at the left, M(x) = qLx/6 − qx³/(6L),
		// largest at x = L/√3: qL²/(9√3) (statics, derived here).
		{"triangular load, largest moment", func(q float64) fem.Model {
			return tinyBeam(nil, []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: L, Intensity: -q}}}})
		}, fem.QBendingMoment, true, L * L / (9 * math.Sqrt(3)), L / math.Sqrt(3)},
		// A counter-clockwise moment M0 at midspan: R = M0/L up at the left,
		// EI·w'' = M0·x/L on the left half and w(L/2) = 0 by antisymmetry, so
		// w = M0·x(4x² − L²)/(24·L·EI), lowest at x = L/(2√3): −M0·L²/(72√3·EI)
		// (statics, derived here).
		{"moment at midspan, lowest deflection", func(m float64) fem.Model {
			return tinyBeam([]fem.PointLoad{{X: L / 2, Moment: m}}, nil)
		}, fem.QDeflection, false, -L * L / (72 * math.Sqrt(3) * refEI), L / (2 * math.Sqrt(3))},
	} {
		for _, size := range []float64{1, 1e-100, 1e-200, 1e-280} {
			t.Run(fmt.Sprintf("%s, %g", c.name, size), func(t *testing.T) {
				m := c.model(size)
				x := fem.Summarize(solveBothModels(t, &m)).Extremes[c.q]
				value, at := x.Min, x.XMin
				if c.max {
					value, at = x.Max, x.XMax
				}
				if want := c.factor * size; math.Abs(value-want) > 1e-9*math.Abs(want) || math.Abs(at-c.x) > 1e-6*L {
					t.Errorf("%v %g at x = %g m, want %g at x = %g m", c.q, value, at, want, c.x)
				}
			})
		}
	}
}

// tinyBeam is the reference steel member simply supported at its ends.
func tinyBeam(points []fem.PointLoad, lines []fem.DistributedLoad) fem.Model {
	return fem.Model{
		Segments:        refMember(refLength),
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: refLength, Kind: fem.Roller}},
		PointLoads:      points,
		DistributedLoad: lines,
	}
}
