package moving

import (
	"testing"

	"stave/fem"
)

// The shear force at a free end of the member, read on the member (the
// right of x = 0, the left of x = L), is carried by a load standing on the
// end itself and by nothing else: a cantilever fixed at 0 with a tip load
// P at L has V = P all along it, at x = L just left of the load too, and a
// load P at the free end x = 0 of an overhang gives V(0⁺) = −P (statics of
// a cantilever, e.g. Gere & Goodno, Mechanics of Materials, shear-force
// diagrams of cantilevers, from memory; V = dM/dx with M sagging
// positive). The line of V at an end is therefore 0 for every load
// position but the end, where it is ±1; its extremes, a train's worst
// value there and the envelope at the end's station must take that load
// standing on the end.
func TestShearAtAnEndTakesTheLoadOnIt(t *testing.T) {
	const P = 35e3
	cantilever := beam(4, fem.Support{X: 0, Kind: fem.Fixed})
	overhang := beam(10, fem.Support{X: 2, Kind: fem.Pinned}, fem.Support{X: 10, Kind: fem.Roller})
	for _, c := range []struct {
		name     string
		m        *fem.Model
		x        float64
		side     fem.Side
		wantLine Point // the extreme of the line that is not 0
		hi       bool  // wantLine is the largest (else the smallest)
	}{
		{"cantilever tip, V(L⁻)", cantilever, 4, fem.Left, Point{4, 1}, true},
		{"overhang's free end, V(0⁺)", overhang, 0, fem.Right, Point{0, -1}, false},
	} {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			tg := Target{Quantity: fem.QShearForce, X: c.x, Side: c.side}
			lo, hi := line(t, in, tg).Extremes()
			got := lo
			if c.hi {
				got = hi
			}
			if !near(got.Value, c.wantLine.Value, 1e-12) || !near(got.S, c.wantLine.S, 1e-12) {
				t.Errorf("line's extreme: %.15g with the load at %g, want %g at %g", got.Value, got.S, c.wantLine.Value, c.wantLine.S)
			}
			// One axle between end stops, which stands on the end at the
			// end of its run; and three driving off the member, the middle
			// one (P) standing on the end inside the run, the others (P/2)
			// 1 m either side, one off the member, one on it.
			for _, tr := range []*Train{
				{Name: "one axle", Axles: []Axle{{Load: P}}, Direction: BothWays, Step: 0.1},
				{Name: "driving off", Axles: []Axle{{Load: P / 2}, {Load: P, Spacing: 1}, {Load: P / 2, Spacing: 1}}, Direction: BothWays, OffEnds: true, Step: 0.1},
			} {
				whi, wlo, err := in.Worst(tr, p.Mesh(), tg)
				if err != nil {
					t.Fatal(err)
				}
				w := wlo
				if c.hi {
					w = whi
				}
				if want := P * c.wantLine.Value; !near(w.Value, want, 1e-12) {
					t.Errorf("%s: train's worst %.15g N with the front at %g, want %g N", tr.Name, w.Value, w.Placement.Front, want)
				}
				e, err := in.Envelope(tr, p.Mesh(), []float64{0, c.m.Length() / 2, c.m.Length()})
				if err != nil {
					t.Fatal(err)
				}
				st := 0
				if c.x > 0 {
					st = 2
				}
				env := e.Min[2][st]
				if c.hi {
					env = e.Max[2][st]
				}
				if want := P * c.wantLine.Value; !near(env, want, 1e-12) {
					t.Errorf("%s: envelope at x = %g %.15g N, want %g N", tr.Name, c.x, env, want)
				}
			}
		})
	}
}
