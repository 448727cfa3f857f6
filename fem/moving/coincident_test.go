package moving

import (
	"testing"

	"stave/fem"
)

// A train that drives off a cantilever's free end, with its second axle
// reaching the point read at the front the first reaches the tip: at that
// one position both stand on the part beyond the point, and the shear
// force there is the sum of both loads (equilibrium of the free part of a
// cantilever, statics, from memory); the fixed end's reaction is the
// sum of both where the axles stand a member's length apart, one on the
// tip and one on the root. On either side of that position one load
// is off the part or off the member, which the stretches of positions
// either side take alone: the shear read 120 kN for 200 kN.
func TestLoadsMeetingJumpsAtOnePosition(t *testing.T) {
	const L, P1, P2 = 5.0, 80e3, 120e3
	m := beam(L, fem.Support{X: 0, Kind: fem.Fixed})
	p, in := prepared(t, m)
	for _, c := range []struct {
		name    string
		spacing float64
		x       float64 // the station, m; 0 for the fixed end's reaction
		dir     Direction
	}{
		{"shear at 3.3 m, forward", 1.7, 3.3, Forward},
		{"shear at 3.3 m, backward", 1.7, 3.3, Backward},
		{"shear at 1.25 m, spacing 3.75 m", 3.75, 1.25, BothWays},
		{"reaction, axles a member's length apart", L, 0, BothWays},
	} {
		t.Run(c.name, func(t *testing.T) {
			tr := &Train{Axles: []Axle{{Load: P1}, {Load: P2, Spacing: c.spacing}}, OffEnds: true, Direction: c.dir}
			if c.x == 0 {
				e, err := in.Envelope(tr, p.Mesh(), []float64{L / 2})
				if err != nil {
					t.Fatal(err)
				}
				for _, r := range e.Reactions {
					if r.Motion == fem.Transverse && !near(r.Max, P1+P2, 1e-12) {
						t.Errorf("largest transverse reaction %.12g N with the front at %v, want %.12g N (both axles on the member)", r.Max, r.MaxAt, P1+P2)
					}
				}
				return
			}
			e, err := in.Envelope(tr, p.Mesh(), []float64{c.x})
			if err != nil {
				t.Fatal(err)
			}
			if got := e.Max[2][0]; !near(got, P1+P2, 1e-12) {
				t.Errorf("envelope: largest shear %.12g N at x = %g m with the front at %v, want %.12g N (both loads beyond the point)", got, c.x, e.MaxAt[2][0], P1+P2)
			}
			hi, _, err := in.Worst(tr, p.Mesh(), Target{Quantity: fem.QShearForce, X: c.x, Side: fem.Left})
			if err != nil {
				t.Fatal(err)
			}
			if !near(hi.Value, P1+P2, 1e-12) {
				t.Errorf("worst: largest shear %.12g N just left of x = %g m with the front at %v, want %.12g N", hi.Value, c.x, hi.Placement, P1+P2)
			}
		})
	}
}
