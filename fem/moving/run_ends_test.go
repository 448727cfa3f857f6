package moving

import (
	"math"
	"testing"

	"stave/fem"
)

// A train's envelope takes only positions on its run: an axle standing on
// a support at an end of the run counts as standing there, not as the
// limit with it just beyond the support, a position past the run's end.
//
// Two equal spans L, one axle P running from 0 to L (it stops on the
// middle support): the shear force just right of the middle support is
// −R₃, the end reaction of the second span, for a load at a in the first,
// R₃ = −a(L² − a²)/(4L³) (two-span continuous beam, the moment over the
// middle support −Pa(L² − a²)/(4L²): AISC Beam Diagrams and Formulas,
// continuous beam – two equal spans – concentrated load at any point,
// from memory), largest P/(6√3) at a = L/√3; the axle on the support
// itself goes into the support. Taking the axle as just past the support
// gave P.
//
// A simple span L carrying two axles P exactly L apart, which fit on it in
// one position only, one on each support: every load goes into a support
// and the shear force is zero all along (statics), where the axle on the
// left support taken as just right of it gave P at x = 0.
func TestEnvelopeStaysOnTheRun(t *testing.T) {
	const L, P = 6.0, 100e3
	spans := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller})
	simple := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	for _, c := range []struct {
		name     string
		m        *fem.Model
		tr       *Train
		x        float64
		side     fem.Side
		hi, lo   float64
		wantSide fem.Side
	}{
		{"one axle stopping on the middle support, just right of it", spans,
			&Train{Name: "to the support", Axles: []Axle{{Load: P}}, From: 0, To: L, Direction: BothWays, Step: 0.1},
			L, fem.Right, P / (6 * math.Sqrt(3)), 0, fem.Right},
		{"two axles a span apart, at the left support", simple,
			&Train{Name: "a span long", Axles: []Axle{{Load: P}, {Load: P, Spacing: L}}, Direction: BothWays, Step: 0.1},
			0, fem.Right, 0, 0, 0},
		{"two axles a span apart, at the right support", simple,
			&Train{Name: "a span long", Axles: []Axle{{Load: P}, {Load: P, Spacing: L}}, Direction: BothWays, Step: 0.1},
			L, fem.Left, 0, 0, 0},
	} {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			hi, lo, err := in.Worst(c.tr, p.Mesh(), Target{Quantity: fem.QShearForce, X: c.x, Side: c.side})
			if err != nil {
				t.Fatal(err)
			}
			if !near(hi.Value, c.hi, 1e-9*P) || !near(lo.Value, c.lo, 1e-9*P) {
				t.Errorf("worst: %.12g N (front at %g) to %.12g N (front at %g), want %.12g to %.12g N",
					lo.Value, lo.Placement.Front, hi.Value, hi.Placement.Front, c.lo, c.hi)
			}
			e, err := in.Envelope(c.tr, p.Mesh(), []float64{0, c.x, c.m.Length()})
			if err != nil {
				t.Fatal(err)
			}
			k := 2 // the shear force in EnvelopeQuantities
			if got := e.Max[k][1]; !near(got, c.hi, 1e-9*P) || e.MaxSide[k][1] != c.wantSide {
				t.Errorf("envelope at x = %g: largest %.12g N on side %q, want %.12g N on side %q", c.x, got, e.MaxSide[k][1].Name(), c.hi, c.wantSide.Name())
			}
			if c.m == simple {
				for s := range e.Stations {
					if !near(e.Max[k][s], 0, 1e-9*P) || !near(e.Min[k][s], 0, 1e-9*P) {
						t.Errorf("envelope at x = %g: %.12g to %.12g N, want 0", e.Stations[s], e.Min[k][s], e.Max[k][s])
					}
				}
			}
		})
	}
}
