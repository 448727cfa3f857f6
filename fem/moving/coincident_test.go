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

// The position an envelope names gives the value it reports. Driving off
// an overhang's tip, the front axle leaves the member at front = L: the
// effect just after is the other axle's alone, but the train placed with
// its front on the tip still carries the front axle there. The largest
// shear at 5 m of a span of 7 m with a 3 m overhang under 100 kN leading
// 150 kN by 4.3 m is the rear axle's alone at 5.7 m, 150·(7 − 5.7)/7 kN
// (the support's reaction, statics), reached as the front axle leaves the
// tip: it was named with the front on the tip, where solving the train
// gives −15 kN (the front axle's −100·3/7 kN added).
func TestEnvelopeNamesAPositionGivingItsValue(t *testing.T) {
	const P1, P2, span, tip = 100e3, 150e3, 7.0, 10.0
	m := beam(tip, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: span, Kind: fem.Roller})
	p, in := prepared(t, m)
	tr := &Train{Axles: []Axle{{Load: P1}, {Load: P2, Spacing: 4.3}}, OffEnds: true, Direction: Forward}
	const x = 5.0
	e, err := in.Envelope(tr, p.Mesh(), []float64{x})
	if err != nil {
		t.Fatal(err)
	}
	want := P2 * (span - (tip - 4.3)) / span
	got, at := e.Max[2][0], e.MaxAt[2][0]
	if !near(got, want, 1e-9) {
		t.Fatalf("largest shear %.12g N, want %.12g N", got, want)
	}
	placed := tr.Model(m, at)
	ex, err := fem.SolveExact(&placed)
	if err != nil {
		t.Fatal(err)
	}
	if v := ex.At(x, fem.Right).ShearForce; !near(v, got, 1e-9) {
		t.Errorf("largest shear %.12g N named at %v, where solving the train gives %.12g N", got, at, v)
	}
}
